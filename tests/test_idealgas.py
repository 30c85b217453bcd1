"""Checks of cellfuncs.gas.idealgas (NASA-7 polynomials) against outside data.

Reference libraries used live:
* CoolProp 8 ``PropsSI('Cp0molar', 'T', T, 'P', p, fluid)`` - the ideal-gas part
  of each fluid's reference equation of state;
* ``chemicals`` 1.5.2 ``heat_capacity.TRCCp`` with ``TRC_gas_data`` (TRC
  ideal-gas heat capacity correlations), ``reaction.Hfg`` and ``reaction.S0g``
  (standard formation enthalpy and entropy, mostly ATcT).
"""

import math

import pytest
from hypothesis import given, settings
from hypothesis import strategies as st

from cellfuncs.errors import CellInputError
from cellfuncs.gas import idealgas as ig

CP_NAMES = {
    "N2": "Nitrogen", "O2": "Oxygen", "Ar": "Argon", "CO2": "CarbonDioxide",
    "H2O": "Water", "CH4": "Methane", "C2H6": "Ethane", "C3H8": "Propane",
    "nC4H10": "n-Butane", "iC4H10": "IsoButane", "H2": "Hydrogen",
    "CO": "CarbonMonoxide", "SO2": "SulfurDioxide", "He": "Helium",
    "H2S": "HydrogenSulfide", "NH3": "Ammonia", "nC6H14": "n-Hexane",
    "nC7H16": "n-Heptane", "nC8H18": "n-Octane", "nC5H12": "n-Pentane",
}
CAS = {"CH4": "74-82-8", "CO2": "124-38-9", "H2O": "7732-18-5", "C2H6": "74-84-0",
       "C3H8": "74-98-6", "CO": "630-08-0", "N2": "7727-37-9", "O2": "7782-44-7",
       "nC4H10": "106-97-8", "SO2": "7446-09-5", "H2S": "7783-06-4", "NH3": "7664-41-7"}


def cp0_coolprop(sp, T):
    """CoolProp ideal-gas molar heat capacity [J/(mol K)] (PropsSI 'Cp0molar')."""
    import CoolProp.CoolProp as CP

    # the low pressure keeps CoolProp's phase check quiet at low temperatures
    return CP.PropsSI("Cp0molar", "T", T, "P", 10.0, CP_NAMES[sp])


# (species, temperatures [K], rtol): air and exhaust species tightly, fuels where
# the charge air needs them (<= 700 K), minor species looser
CP_CASES = [
    ("N2", (220, 300, 400, 600, 1000, 1500), 2.5e-3),
    ("O2", (220, 300, 400, 600, 1000, 1500), 1e-3),
    ("Ar", (220, 300, 1000), 1e-4),
    ("CO2", (250, 300, 400, 600, 1000, 1500), 2e-3),
    ("H2O", (300, 400, 600, 1000), 1e-3),
    ("CH4", (250, 300, 400, 600), 5e-3),
    ("C2H6", (250, 300, 400, 600), 5e-3),
    ("C3H8", (300, 400, 600), 6e-3),
    ("nC4H10", (300, 400, 600), 6e-3),
    ("iC4H10", (300, 400, 600), 6e-3),
    ("H2", (250, 300, 400, 600, 1000), 3.5e-3),
    ("CO", (250, 300, 400, 600, 1000), 1.5e-3),
    ("SO2", (300, 400, 600, 1000), 2e-3),
    ("He", (220, 1000), 1e-4),
    ("H2S", (300, 400, 600), 3e-3),
    ("NH3", (250, 300, 400, 600), 8e-3),
    ("nC5H12", (300, 400, 600), 6e-3),
    ("nC6H14", (250, 300, 400, 600), 1e-2),  # our own fit, see tools/extract_nasa7.py
    ("nC7H16", (300, 400, 600), 1e-2),
    ("nC8H18", (300, 400, 600), 1.5e-2),
]


@pytest.mark.parametrize("sp,temps,rtol", CP_CASES, ids=[c[0] for c in CP_CASES])
def test_cp_vs_coolprop_ideal_gas(sp, temps, rtol):
    """cp against CoolProp PropsSI('Cp0molar', ...) of the species' reference EOS."""
    for T in temps:
        assert ig.cp_molar(sp, T) == pytest.approx(cp0_coolprop(sp, T), rel=rtol), T


@pytest.mark.parametrize("sp", ["CH4", "CO2", "H2O", "N2", "C2H6", "C3H8", "CO"])
def test_cp_vs_chemicals_trc(sp):
    """cp against chemicals.heat_capacity.TRCCp (TRC ideal-gas correlation), 300-600 K, 0.6 %."""
    from chemicals.heat_capacity import TRC_gas_data, TRCCp

    r = TRC_gas_data.loc[CAS[sp]]
    coeffs = [r[k] for k in ("a0", "a1", "a2", "a3", "a4", "a5", "a6", "a7")]
    for T in (300.0, 450.0, 600.0):
        assert ig.cp_molar(sp, T) == pytest.approx(TRCCp(T, *coeffs), rel=6e-3), T


# (n-butane left out: chemicals' S0g of 304.4 J/(mol K) disagrees with the usual
#  310 J/(mol K) of the thermochemical tables; the NASA value is 309.9)
@pytest.mark.parametrize("sp", ["CH4", "CO2", "H2O", "C2H6", "C3H8", "CO", "NH3", "SO2", "H2S"])
def test_formation_enthalpy_and_entropy_vs_chemicals(sp):
    """h(298.15 K) = standard formation enthalpy, s0(298.15 K) = standard entropy:
    chemicals.reaction.Hfg (within 0.6 kJ/mol) and S0g (within 0.3 J/(mol K))."""
    from chemicals.reaction import Hfg, S0g

    assert ig.h_molar(sp, 298.15) == pytest.approx(Hfg(CAS[sp]), abs=600.0)
    assert ig.s0_molar(sp, 298.15) == pytest.approx(S0g(CAS[sp]), abs=0.3)


@pytest.mark.parametrize("sp", ["N2", "O2", "Ar", "H2"])
def test_elements_have_zero_formation_enthalpy(sp):
    """Elements in their reference state: h(298.15 K) = 0 (definition), within 2 J/mol."""
    assert ig.h_molar(sp, 298.15) == pytest.approx(0.0, abs=2.0)


@pytest.mark.parametrize("sp", ["N2", "CO2", "H2O", "CH4"])
def test_enthalpy_difference_vs_integrated_coolprop_cp(sp):
    """h(T2) - h(T1) against the integral of CoolProp 'Cp0molar' (scipy quad), 300-700 K, 0.2 %."""
    from scipy.integrate import quad

    ref = quad(lambda t: cp0_coolprop(sp, t), 300.0, 700.0)[0]
    assert ig.h_molar(sp, 700.0) - ig.h_molar(sp, 300.0) == pytest.approx(ref, rel=2e-3)


def test_polynomials_continuous_at_1000_K():
    """cp, h and s0 are continuous at the 1000 K break (NASA-7 construction) for every species."""
    for sp in ig.species():
        p = ig.species_poly(sp)
        lo, hi = 1000.0 - 1e-9, 1000.0
        assert p.cp(lo) == pytest.approx(p.cp(hi), rel=2e-3), sp
        assert p.h(lo) == pytest.approx(p.h(hi), rel=1e-4, abs=20.0), sp
        assert p.s0(lo) == pytest.approx(p.s0(hi), rel=1e-4), sp


def test_sources_named_for_every_species():
    for sp in ig.species():
        assert ig.source(sp)
    assert "GRI-Mech 3.0" in ig.source("CH4")
    assert "TM-4513" in ig.source("nC4H10")


def test_mixture_is_mole_weighted_sum():
    """The mixture polynomial equals the mole-fraction-weighted species values (linearity)."""
    x = {"N2": 0.7, "O2": 0.1, "CO2": 0.05, "H2O": 0.1, "CH4": 0.05}
    for T in (250.0, 900.0, 1200.0):
        assert ig.cp_mix(x, T) == pytest.approx(sum(v * ig.cp_molar(s, T) for s, v in x.items()))
        assert ig.h_mix(x, T) == pytest.approx(sum(v * ig.h_molar(s, T) for s, v in x.items()))
        assert ig.s0_mix(x, T) == pytest.approx(sum(v * ig.s0_molar(s, T) for s, v in x.items()))
    # not normalised in mix_poly, normalised in the *_mix forms
    x2 = {k: 2 * v for k, v in x.items()}
    assert ig.mix_poly(x2).cp(500.0) == pytest.approx(2 * ig.cp_mix(x, 500.0))
    assert ig.cp_mix(x2, 500.0) == pytest.approx(ig.cp_mix(x, 500.0))


def test_molar_mass_of_dry_air():
    """Dry air O2 0.20946 N2 0.78084 Ar 0.00934 CO2 0.00036 (common practice) has
    M = 28.96546 g/mol (ISO 6976:2016, clause on relative density), to 1e-5."""
    air = {"N2": 0.78084, "O2": 0.20946, "Ar": 0.00934, "CO2": 0.00036}
    assert ig.molar_mass_mix(air) == pytest.approx(28.96546, abs=1e-4)


@settings(max_examples=150, deadline=None)
@given(T=st.floats(200.0, 3000.0), sp=st.sampled_from(["N2", "H2O", "CO2", "CH4", "SO2", "Ar"]))
def test_inverse_temperature_round_trips(T, sp):
    p = ig.species_poly(sp)
    # (the two ranges meet at 1000 K with a tiny jump, so near it T is found to 1e-4 K)
    assert p.t_from_h(p.h(T)) == pytest.approx(T, abs=1e-4)
    assert p.t_from_s0(p.s0(T)) == pytest.approx(T, abs=1e-4)
    assert p.h(p.t_from_h(p.h(T))) == pytest.approx(p.h(T), rel=1e-9, abs=1e-6)


@settings(max_examples=100, deadline=None)
@given(T=st.floats(200.0, 2999.0), sp=st.sampled_from(sorted(
    ["N2", "O2", "Ar", "CO2", "H2O", "CH4", "C2H6", "C3H8", "H2", "CO", "SO2"])))
def test_enthalpy_increases_and_cp_positive(T, sp):
    p = ig.species_poly(sp)
    assert p.cp(T) > 0
    assert p.h(T + 1.0) > p.h(T)
    assert p.s0(T + 1.0) > p.s0(T)


def test_bad_input_names_the_argument():
    with pytest.raises(CellInputError, match="species"):
        ig.cp_molar("XeF6", 300.0)
    with pytest.raises(CellInputError, match="T_K"):
        ig.h_molar("N2", 150.0)
    with pytest.raises(CellInputError, match="T_K"):
        ig.cp_mix({"N2": 1.0}, 5000.0)
    with pytest.raises(CellInputError, match="x"):
        ig.cp_mix({}, 300.0)
    with pytest.raises(CellInputError, match="x"):
        ig.molar_mass_mix({"N2": -1.0, "O2": 0.5})
    assert not math.isnan(ig.s0_molar("He", 200.0))
