"""Combustion core, air requirement, CO2 factor, fuel flow.

Vectors: tests/vectors/gas_combustion.csv (stoichiometric arithmetic, methane checks
derived from the ISO 6976:2016 component tables, common-practice figures).
"""

import math

import pytest
from hypothesis import given, settings, strategies as st

from cellfuncs.errors import CellInputError
from cellfuncs.gas import combustion as cb
from cellfuncs.gas.composition import parse_composition
from cellfuncs.gas.iso6976 import M_AIR, molar_mass
from gas_cases import call_entry
from vectors import approx, params

PIPELINE = {"CH4": 0.92, "C2H6": 0.04, "C3H8": 0.01, "nC4H10": 0.003, "iC4H10": 0.002,
            "N2": 0.015, "CO2": 0.01}


@pytest.mark.parametrize("row", params("gas_combustion"))
def test_vectors(row):
    assert call_entry(row["function"], row) == approx(row)


def test_dry_air_sums_to_one_and_matches_iso6976_air():
    """DRY_AIR (common practice) sums to 1; its molar mass with the ISO 6976:2016 molar masses
    is within 2e-6 of the standard's M_air = 28.96546 kg/kmol."""
    assert math.fsum(cb.DRY_AIR.values()) == pytest.approx(1.0, abs=1e-12)
    assert cb.dry_air_molar_mass() == pytest.approx(M_AIR, rel=2e-6)


def test_methane_dry_co2_max():
    """Methane burnt stoichiometrically: 11.7 % CO2 in the dry flue gas (common practice)."""
    f = cb.flue_gas_fractions({"CH4": 1}, 1.0, dry=True)
    assert f["CO2"] == pytest.approx(0.117, rel=0.01)
    assert f["O2"] == pytest.approx(0.0, abs=1e-12)


def test_co2_factor_natural_gas_in_ipcc_range():
    """A pipeline natural gas: IPCC 2006 Guidelines, Vol. 2, Table 1.4, natural gas default
    56 100 kg CO2/TJ (net), 95 % range 54 300 to 58 300 kg/TJ (from memory) = 195.5 to 209.9
    kg/MWh."""
    f = cb.co2_factor(PIPELINE, "net", 25)
    assert 54.3 * 3.6 <= f <= 58.3 * 3.6


@settings(max_examples=150, deadline=None)
@given(st.floats(1.0, 3.0), st.floats(0.0, 0.05),
       st.dictionaries(st.sampled_from(["CH4", "C2H6", "C3H8", "H2", "CO", "H2S", "NH3", "N2",
                                        "CO2", "H2O", "Ar", "He", "O2"]),
                       st.floats(0.01, 1.0), min_size=1, max_size=6))
def test_atom_and_mass_balance(lam, water, amounts):
    """Conservation (arithmetic): atoms and mass of fuel + air equal those of the flue gas."""
    comp = parse_composition({k: v / sum(amounts.values()) for k, v in amounts.items()})
    if cb.o2_demand(comp) <= 1e-9:
        with pytest.raises(CellInputError, match="^components:"):
            cb.flue_gas_moles(comp, lam, water)
        return
    n = cb.flue_gas_moles(comp, lam, water)
    air = lam * cb.stoich_air_molar(comp)
    c, h, o, nn, s = cb.atoms(comp)
    assert n["CO2"] == pytest.approx(c + air * cb.DRY_AIR["CO2"], rel=1e-12, abs=1e-14)
    assert 2 * n["H2O"] == pytest.approx(h + 2 * air * water, rel=1e-12, abs=1e-14)
    o_in = o + air * (2 * cb.DRY_AIR["O2"] + 2 * cb.DRY_AIR["CO2"]) + air * water
    o_out = 2 * n["CO2"] + n["H2O"] + 2 * n["SO2"] + 2 * n["O2"]
    assert o_out == pytest.approx(o_in, rel=1e-12)
    m_in = molar_mass(comp) + air * cb.dry_air_molar_mass() + air * water * cb.species_molar_mass("H2O")
    m_out = sum(v * cb.species_molar_mass(k) for k, v in n.items())
    assert m_out == pytest.approx(m_in, rel=1e-5)  # SO2 from atomic weights, others from the table
    assert all(v >= 0 for v in n.values())
    # excess oxygen is (lambda - 1) times the demand
    assert n["O2"] == pytest.approx((lam - 1) * cb.o2_demand(comp), abs=1e-12)


def test_products_of_ammonia_and_h2s():
    """Source of every value: arithmetic (stoichiometry of complete combustion)."""
    p = cb.products({"NH3": 0.5, "H2S": 0.5})
    # arithmetic (stoichiometry): 2 NH3 -> N2 + 3 H2O, H2S -> SO2 + H2O, per 0.5 mol each
    assert p["N2"] == pytest.approx(0.25) and p["SO2"] == pytest.approx(0.5)
    assert p["H2O"] == pytest.approx(0.5 * 1.5 + 0.5 * 1.0)
    # arithmetic (stoichiometry): NH3 + 3/4 O2 -> 1/2 N2 + 3/2 H2O; CO + 1/2 O2 -> CO2
    assert cb.o2_demand({"NH3": 1}) == pytest.approx(0.75)
    assert cb.o2_demand({"CO": 1}) == pytest.approx(0.5)


def test_oxygen_in_fuel_reduces_air():
    """O2 carried by the fuel counts against the demand (arithmetic)."""
    a0 = cb.stoich_air_molar({"CH4": 0.9, "N2": 0.1})
    a1 = cb.stoich_air_molar({"CH4": 0.9, "N2": 0.05, "O2": 0.05})
    assert a0 - a1 == pytest.approx(0.05 / 0.20946, rel=1e-12)


def test_fuel_mass_cv_matches_iso6976_mass_basis():
    from cellfuncs.gas.iso6976 import calorific_value
    assert cb.fuel_mass_cv(PIPELINE) == calorific_value(PIPELINE, "net", "mass", "25/0")


@settings(max_examples=100, deadline=None)
@given(st.floats(0.0, 1e5), st.sampled_from(["gross", "net"]), st.sampled_from(["25/0", "15/15", "0/0", "20/20"]))
def test_fuel_power_inverts_fuel_flow(p, kind, ref):
    q = cb.fuel_flow(PIPELINE, p, kind, ref)
    assert cb.fuel_power(PIPELINE, q, kind, ref) == pytest.approx(p, rel=1e-14, abs=1e-9)


@settings(max_examples=100, deadline=None)
@given(st.floats(0.01, 0.5), st.sampled_from(["C2H6", "C3H8", "nC4H10"]))
def test_heavier_hydrocarbons_need_more_air(share, heavy):
    assert cb.stoich_air_molar({"CH4": 1 - share, heavy: share}) > cb.stoich_air_molar({"CH4": 1})


def test_bad_input():
    with pytest.raises(CellInputError, match="^components: the gas needs no oxygen"):
        cb.air_requirement({"N2": 0.5, "CO2": 0.5})
    with pytest.raises(CellInputError, match="^lambda_:"):
        cb.flue_gas_moles({"CH4": 1}, 0.9)
    with pytest.raises(CellInputError, match="^water_per_mol_dry_air:"):
        cb.flue_gas_moles({"CH4": 1}, 1.5, -0.1)
    with pytest.raises(CellInputError, match="^fuel_power_kw:"):
        cb.fuel_flow({"CH4": 1}, -5.0)
    with pytest.raises(CellInputError, match="^flow_m3h:"):
        cb.fuel_power({"CH4": 1}, -5.0)
    with pytest.raises(CellInputError, match="^components: the gas has no calorific value"):
        cb.co2_factor({"N2": 0.5, "CO2": 0.5})
    with pytest.raises(CellInputError, match="^ref:"):
        cb.fuel_flow({"CH4": 1}, 100.0, "net", "25/25")
    with pytest.raises(CellInputError, match="^t_combustion:"):
        cb.co2_factor({"CH4": 1}, "net", 30)
