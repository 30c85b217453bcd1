"""ISO 6976:2016 properties and their uncertainty.

Vectors: tests/vectors/gas_iso6976.csv (ISO 6976:2016 Annex D Example 1; pure methane derived
from the standard's component tables).  Live cross-checks against reference libraries:
``chemicals.combustion.combustion_data`` with ``chemicals.reaction.Hfg``,
``chemicals.elements.molecular_weight``, ``chemicals.heat_capacity.Poling_integral`` and
CoolProp ``PropsSI`` (IAPWS-95 water, methane HEOS).
"""

import math

import pytest
from hypothesis import given, settings, strategies as st

from cellfuncs.errors import CellInputError, CellTypeError
from cellfuncs.gas import iso6976
from cellfuncs.gas.composition import COMPONENT_IDS, parse_composition
from cellfuncs.gas.iso6976 import (
    calorific_value, compression_factor, component_table, density, molar_mass, parse_ref,
    relative_density, wobbe_index,
)
from cellfuncs.gas.uncertainty import cv_standard_uncertainty, cv_uncertainty
from gas_cases import call_entry
from vectors import approx, params

EXAMPLE_1 = {"CH4": 0.933212, "C2H6": 0.025656, "C3H8": 0.015368, "N2": 0.010350, "CO2": 0.015414}
U_EXAMPLE_1 = {"CH4": 0.000346, "C2H6": 0.000243, "C3H8": 0.000148, "N2": 0.000195, "CO2": 0.000111}


@pytest.mark.parametrize("row", params("gas_iso6976"))
def test_vectors(row):
    assert call_entry(row["function"], row) == approx(row)


# ---------------------------------------------------------------------------
# cross-checks of the component table against reference libraries

_CHEM_NAMES = {
    "CH4": ("methane", "CH4"), "C2H6": ("ethane", "C2H6"), "C3H8": ("propane", "C3H8"),
    "nC4H10": ("n-butane", "C4H10"), "iC4H10": ("isobutane", "C4H10"),
    "nC5H12": ("pentane", "C5H12"), "iC5H12": ("isopentane", "C5H12"),
    "neoC5H12": ("neopentane", "C5H12"), "nC6H14": ("hexane", "C6H14"),
    "nC7H16": ("heptane", "C7H16"), "nC8H18": ("octane", "C8H18"), "H2": ("hydrogen", "H2"),
    "CO": ("carbon monoxide", "CO"), "H2S": ("hydrogen sulfide", "H2S"),
}
_FORMULA = {"NH3": "NH3", "H2O": "H2O", "He": "He", "Ar": "Ar", "N2": "N2", "O2": "O2", "CO2": "CO2"}


@pytest.mark.parametrize("cid", sorted(_CHEM_NAMES))
def test_hc25_vs_chemicals(cid):
    """Hc(25 °C) vs chemicals.combustion.combustion_data(formula, Hf=chemicals.reaction.Hfg(CAS)).

    The tabulated formation enthalpy must be passed: without it chemicals falls back to an
    estimate.  Tolerance 0.02 % (the project's acceptance criterion).
    """
    from chemicals.combustion import combustion_data
    from chemicals.identifiers import CAS_from_any
    from chemicals.reaction import Hfg

    name, formula = _CHEM_NAMES[cid]
    hf = Hfg(CAS_from_any(name))
    assert hf is not None
    hhv = -combustion_data(formula, Hf=hf).HHV / 1000.0
    assert component_table()[cid]["hc_25"] == pytest.approx(hhv, rel=2e-4)


@pytest.mark.parametrize("cid", COMPONENT_IDS)
def test_molar_mass_vs_chemicals(cid):
    """M_i vs chemicals.elements.molecular_weight(simple_formula_parser(formula)), 5 decimals."""
    from chemicals.elements import molecular_weight, simple_formula_parser

    formula = _CHEM_NAMES.get(cid, (None, _FORMULA.get(cid)))[1]
    mw = molecular_weight(simple_formula_parser(formula))
    assert round(component_table()[cid]["molar_mass"], 5) == pytest.approx(round(mw, 5), abs=1e-12)


@pytest.mark.parametrize("t", [15, 20, 25])
def test_water_enthalpy_of_vaporisation_vs_iapws95(t):
    """L°(t) vs CoolProp IAPWS-95: ideal-gas enthalpy (p -> 0) minus liquid at 1.01325 bar,
    PropsSI("Hmolar", "T", T, "P", p, "Water"); within 0.001 kJ/mol (acceptance criterion).  0 °C is below
    the triple-point temperature, where CoolProp refuses the low-pressure state."""
    from CoolProp.CoolProp import PropsSI

    T = t + 273.15
    l0 = (PropsSI("Hmolar", "T", T, "P", 1e-3, "Water")
          - PropsSI("Hmolar", "T", T, "P", 101325.0, "Water")) / 1000.0
    assert component_table()["H2O"][f"hc_{t}"] == pytest.approx(l0, abs=1e-3)


def test_methane_gross_vs_chemicals_and_coolprop():
    """Methane gross 15/15 [MJ/m³] from chemicals + CoolProp, within 0.01 % (acceptance criterion).

    Hc(25 °C) = -chemicals.combustion.combustion_data("CH4", Hf=Hfg("74-82-8")).HHV, moved to
    15 °C with Kirchhoff's law: ideal-gas Cp of CH4, O2, CO2 by
    chemicals.heat_capacity.Poling_integral (Cp_data_Poling), liquid water by CoolProp
    PropsSI("Hmolar", "T", T, "P", 101325, "Water"); Z of methane by CoolProp
    PropsSI("Z", "T", 288.15, "P", 101325, "Methane").
    """
    from chemicals.combustion import combustion_data
    from chemicals.heat_capacity import Cp_data_Poling, Poling_integral
    from chemicals.reaction import Hfg
    from CoolProp.CoolProp import PropsSI

    t15, t25 = 288.15, 298.15
    hc25 = -combustion_data("CH4", Hf=Hfg("74-82-8")).HHV

    def dh_gas(cas):  # H(25 °C) - H(15 °C), ideal gas [J/mol]
        a = Cp_data_Poling.loc[cas, ["a0", "a1", "a2", "a3", "a4"]].tolist()
        return Poling_integral(t25, *a) - Poling_integral(t15, *a)

    dh_water_liq = (PropsSI("Hmolar", "T", t25, "P", 101325.0, "Water")
                    - PropsSI("Hmolar", "T", t15, "P", 101325.0, "Water"))
    # Hc(15) = Hc(25) + [H_products(25) - H_products(15)] - [H_reactants(25) - H_reactants(15)]
    hc15 = hc25 + (dh_gas("124-38-9") + 2 * dh_water_liq) - (dh_gas("74-82-8") + 2 * dh_gas("7782-44-7"))
    z = PropsSI("Z", "T", t15, "P", 101325.0, "Methane")
    hv_ref = hc15 * 101325.0 / (z * 8.3144621 * t15) / 1e6
    assert calorific_value({"CH4": 1}, "gross", "volume", "15/15") == pytest.approx(hv_ref, rel=1e-4)
    # the 25 °C combustion value needs no temperature correction
    z0 = PropsSI("Z", "T", t15, "P", 101325.0, "Methane")
    assert calorific_value({"CH4": 1}, "gross", "volume", "25/15") == pytest.approx(
        hc25 * 101325.0 / (z0 * 8.3144621 * t15) / 1e6, rel=1e-4)


@pytest.mark.parametrize("t", [0, 15, 20])
def test_methane_z_and_density_vs_coolprop(t):
    """Z and density of methane at 1.01325 bar vs CoolProp PropsSI("Z"/"Dmass", "T", T, "P",
    101325, "Methane"); summation-factor method within 2e-5 on Z, 1e-4 on density."""
    from CoolProp.CoolProp import PropsSI

    T = t + 273.15
    assert compression_factor({"CH4": 1}, t) == pytest.approx(PropsSI("Z", "T", T, "P", 101325.0, "Methane"), abs=2e-5)
    assert density({"CH4": 1}, t) == pytest.approx(PropsSI("Dmass", "T", T, "P", 101325.0, "Methane"), rel=1e-4)


def test_dry_air_relative_density_is_one():
    """Dry air relative to dry air: d = 1 (definition), via the summation factors; 1e-4."""
    air = {"N2": 0.78084, "O2": 0.20946, "Ar": 0.00934, "CO2": 0.00036}
    for t in (0, 15, 20):
        assert relative_density(air, t) == pytest.approx(1.0, abs=1e-4)


def test_uncertainty_example_1_direct():
    """Annex D Example 1 via the core (ISO 6976:2016 Annex D, Example 1)."""
    assert cv_standard_uncertainty(EXAMPLE_1, U_EXAMPLE_1, "gross", "molar") == pytest.approx(0.615609872, abs=5e-10)
    assert cv_uncertainty(EXAMPLE_1, U_EXAMPLE_1, "gross", "volume", coverage=2) == pytest.approx(2 * 0.026267, abs=1e-6)


# ---------------------------------------------------------------------------
# properties that must hold (arithmetic of the method)


def test_net_below_gross_and_bases_consistent():
    c = parse_composition(EXAMPLE_1)
    for ref in ("0/0", "15/15", "20/20", "25/0", "25/20"):
        g = calorific_value(c, "gross", "volume", ref)
        n = calorific_value(c, "net", "volume", ref)
        assert n < g
    gm = calorific_value(c, "gross", "molar", "15/15")
    assert calorific_value(c, "gross", "mass", "15/15") == pytest.approx(gm / molar_mass(c), rel=1e-15)
    d = relative_density(c, 15)
    assert wobbe_index(c, "gross", "15/15") == pytest.approx(calorific_value(c) / math.sqrt(d), rel=1e-15)


def test_water_in_gas_gross_counts_l0_net_counts_nothing():
    """ISO 6976:2016: water vapour contributes L° to the gross and 0 to the net value."""
    dry = calorific_value({"CH4": 0.98, "N2": 0.02}, "net", "molar", "15/15")
    wet = calorific_value({"CH4": 0.98, "H2O": 0.02}, "net", "molar", "15/15")
    assert wet == pytest.approx(dry, rel=1e-15)
    wet_g = calorific_value({"CH4": 0.98, "H2O": 0.02}, "gross", "molar", "15/15")
    dry_g = calorific_value({"CH4": 0.98, "N2": 0.02}, "gross", "molar", "15/15")
    assert wet_g - dry_g == pytest.approx(0.02 * 44.431, rel=1e-12)


def test_pressure_correction_of_z():
    """Z = 1 - (p2/p0) S²: the non-ideality scales with p2 (ISO 6976:2016)."""
    z1 = compression_factor({"CH4": 1}, 15, 1.01325)
    z2 = compression_factor({"CH4": 1}, 15, 1.10)
    assert (1 - z2) / (1 - z1) == pytest.approx(1.10 / 1.01325, rel=1e-12)
    # ideal-gas part scales with p, so the real-gas Hv scales slightly more than p
    h1 = calorific_value({"CH4": 1}, p_metering_bar=1.01325)
    h2 = calorific_value({"CH4": 1}, p_metering_bar=1.10)
    assert h2 / h1 == pytest.approx(1.10 / 1.01325 * z1 / z2, rel=1e-12)


@settings(max_examples=100, deadline=None)
@given(st.floats(0.0, 0.3), st.sampled_from(["N2", "CO2"]))
def test_inert_lowers_cv(share, inert):
    base = calorific_value({"CH4": 1.0})
    diluted = calorific_value({"CH4": 1.0 - share, inert: share}) if share > 0 else base
    assert diluted <= base * (1 - share) * 1.01 + 1e-12


@settings(max_examples=100, deadline=None)
@given(st.floats(0.0, 0.1), st.floats(0.0, 0.1))
def test_uncertainty_grows_with_u_x(u1, u2):
    lo = cv_standard_uncertainty(EXAMPLE_1, {"CH4": u1 * 1e-2})
    hi = cv_standard_uncertainty(EXAMPLE_1, {"CH4": (u1 + u2) * 1e-2})
    assert hi >= lo


# ---------------------------------------------------------------------------
# bad input: errors name the argument


@pytest.mark.parametrize("ref", ["15", "15/15/15", "abc", "/15", "15-15"])
def test_bad_ref_strings(ref):
    with pytest.raises(CellTypeError, match="^ref:"):
        parse_ref(ref)


@pytest.mark.parametrize("ref, what", [("30/15", "combustion"), ("15/25", "metering"), ("10/0", "combustion")])
def test_ref_outside_tables(ref, what):
    with pytest.raises(CellInputError, match=f"^ref: {what}"):
        calorific_value({"CH4": 1}, ref=ref)


def test_ref_spellings():
    assert parse_ref("15 °C / 15 °C") == (15, 15)
    assert parse_ref("25/0") == (25, 0)
    assert parse_ref(" 20/20 ") == (20, 20)


@pytest.mark.parametrize("p", [0.5, 1.2, -1.0])
def test_bad_metering_pressure(p):
    with pytest.raises(CellInputError, match="^p_metering_bar:"):
        calorific_value({"CH4": 1}, p_metering_bar=p)


def test_bad_metering_temperature():
    with pytest.raises(CellInputError, match="^t_metering:"):
        compression_factor({"CH4": 1}, 10)


@pytest.mark.parametrize("kind", ["hot", "gros", 3])
def test_bad_kind(kind):
    with pytest.raises(CellTypeError, match="^kind:"):
        calorific_value({"CH4": 1}, kind)


def test_bad_basis():
    with pytest.raises(CellTypeError, match="^basis:"):
        calorific_value({"CH4": 1}, "gross", "energy")


def test_kind_aliases():
    g = calorific_value({"CH4": 1}, "gross")
    n = calorific_value({"CH4": 1}, "net")
    assert calorific_value({"CH4": 1}, "HHV") == g == calorific_value({"CH4": 1}, "superior")
    assert calorific_value({"CH4": 1}, "LHV") == n == calorific_value({"CH4": 1}, "Inferior")


@pytest.mark.parametrize("fn", [lambda c: compression_factor(c), lambda c: calorific_value(c),
                                lambda c: density(c), lambda c: relative_density(c),
                                lambda c: wobbe_index(c)])
def test_z_out_of_scope_refused(fn):
    """Z <= 0.9 is outside ISO 6976:2016: n-octane has Z(15 °C) = 1 - 0.4346² = 0.811.

    Source: ISO 6976:2016 component table (n-octane row, summation factor s(15 °C) 0.4346).
    """
    with pytest.raises(CellInputError, match="^components: compression factor Z = 0.81"):
        fn({"nC8H18": 1})


def test_z_out_of_scope_mass_basis_still_given():
    """Mass and molar values need no Z and stay available."""
    # ISO 6976:2016 component table (n-octane row): Hc(25 °C) = 5511.80 kJ/mol
    assert calorific_value({"nC8H18": 1}, "gross", "molar", "25/15") == pytest.approx(5511.80)


def test_uncertainty_bad_input():
    names = (("CH4",), ("N2",))
    with pytest.raises(CellInputError, match="^amount_uncertainties:"):
        call_entry("GAS_CV_UNCERTAINTY", {"composition": "CH4=90;N2=10", "u_fractions": "CH4=-0.1;N2=0.1"})
    from cellfuncs.adapt import call
    from cellfuncs.catalogue import by_name

    def cell_cv_uncertainty(*v):
        return call(by_name("GAS_CV_UNCERTAINTY"), v)

    with pytest.raises(CellInputError, match="^amount_uncertainties:"):
        cell_cv_uncertainty(names, ((90.0,), (10.0,)), ((0.1,), (0.1,), (0.1,)))
    with pytest.raises(CellInputError, match="^coverage:"):
        cell_cv_uncertainty(names, ((90.0,), (10.0,)), ((0.1,), (0.1,)), "gross", "volume", "15/15", 0.5)


def test_every_tabulated_temperature_present():
    tab = component_table()
    for cid in COMPONENT_IDS:
        for t in iso6976.T_COMBUSTION:
            assert tab[cid][f"hc_{t}"] >= 0
        for t in iso6976.T_METERING:
            assert -0.02 < tab[cid][f"s_{t}"] < 0.5
        assert tab[cid]["source"].startswith("ISO 6976:2016")
