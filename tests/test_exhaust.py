"""Exhaust: composition, molar mass, enthalpy drop, dew point, flow, O2 correction.

Outside sources: a lambda 1.8 methane case worked by hand (complete-combustion
stoichiometry with dry air O2 20.95 %, N2 78.08 %, Ar 0.93 %, CO2 0.04 %: the
air named ``ROUNDED_AIR`` here; rows with air "gas" use the gas family's
``DRY_AIR``); CoolProp 8 per-species ideal-gas enthalpy
(``AbstractState.hmolar_idealgas``) for the enthalpy drop and EXH_HEAT; the dew
point (IAPWS-IF97 saturation of the charge-air family) against CoolProp
``PropsSI('T', 'P', p_w, 'Q', 0, 'Water')``.  Vectors in tests/vectors/exhaust.csv.
"""

from __future__ import annotations

import math

import pytest
from hypothesis import given, settings
from hypothesis import strategies as st

from vectors import approx, params

from cellfuncs.errors import CellInputError, CellTypeError
from cellfuncs.gas import combustion, idealgas
from cellfuncs.gas.composition import parse_composition
from cellfuncs.recovery import exhaust as ex

#: four-figure dry air (O2 20.95 %, N2 78.08 %, Ar 0.93 %, CO2 0.04 %) of the "rounded" vectors
ROUNDED_AIR = {"O2": 0.2095, "N2": 0.7808, "Ar": 0.0093, "CO2": 0.0004}
METHANE = {"methane": 100.0}
COOLPROP = {"CO2": "CarbonDioxide", "H2O": "Water", "O2": "Oxygen", "N2": "Nitrogen",
            "Ar": "Argon", "SO2": "SulfurDioxide"}


def _air(row):
    return ROUNDED_AIR if row["air"] == "rounded" else None


@pytest.mark.parametrize("row", params("exhaust", "EXH_COMPOSITION"))
def test_composition(row):
    got = ex.exhaust_composition(1.8, METHANE, row["species"], row["basis"], 25.0, 0.0, 1.0,
                                 air=_air(row))
    assert got == approx(row)


@pytest.mark.parametrize("row", params("exhaust", "EXH_MOLAR_MASS"))
def test_molar_mass(row):
    n = ex.exhaust_moles(METHANE, 1.8, 0.0, _air(row))
    assert ex.exhaust_mass_per_mol_fuel(METHANE, 1.8, 0.0, _air(row)) / math.fsum(n.values()) == approx(row)


@pytest.mark.parametrize("row", params("exhaust", "EXH_ENTHALPY_DROP"))
def test_enthalpy_drop(row):
    assert ex.exhaust_enthalpy_drop(METHANE, 1.8, 450.0, 120.0, 0.0, _air(row)) == approx(row)
    # the same through EXH_HEAT: 3600 kg/h = 1 kg/s gives kW = kJ/kg
    assert ex.exhaust_heat(3600.0, 450.0, 120.0, 1.8, METHANE, 25.0, 0.0, 1.0, _air(row)) == approx(row)


@pytest.mark.parametrize("row", params("exhaust", "EXH_DEWPOINT"))
def test_dewpoint(row):
    assert ex.exhaust_dewpoint(1.8, METHANE, 1.01325, 25.0, 0.0, 1.0, _air(row)) == approx(row)


@pytest.mark.parametrize("row", params("exhaust", "EXH_O2_CORRECT"))
def test_o2_correct(row):
    assert ex.o2_correct(row["concentration"], row["o2_measured"], row["o2_reference"]) == approx(row)


def test_gas_family_air_path_equals_explicit_air():
    """exhaust_moles with air=DRY_AIR (own stoichiometry) equals the gas core's flue_gas_moles."""
    comp = {"methane": 88.0, "ethane": 6.0, "propane": 2.0, "N2": 2.5, "CO2": 1.0, "H2S": 0.5}
    a = ex.exhaust_moles(comp, 1.7, 0.012, combustion.DRY_AIR)
    b = ex.exhaust_moles(comp, 1.7, 0.012, None)
    assert a.keys() == b.keys()
    for k in a:
        assert a[k] == pytest.approx(b[k], rel=1e-13, abs=1e-15)
    assert a["SO2"] == pytest.approx(0.005, rel=1e-12)


def _coolprop_dh(moles, t_in, t_out):
    """Σ n_i·(h_i(t_in) − h_i(t_out)) / Σ n_i·M_i with CoolProp AbstractState.hmolar_idealgas [kJ/kg]."""
    import CoolProp.CoolProp as CP

    dh = m = 0.0
    for sp, n in moles.items():
        if n <= 0:
            continue
        st_ = CP.AbstractState("HEOS", COOLPROP[sp])
        h = []
        for t in (t_in, t_out):
            st_.update(CP.PT_INPUTS, 100.0, t + 273.15)
            h.append(st_.hmolar_idealgas())
        dh += n * (h[0] - h[1])
        m += n * st_.molar_mass() * 1e3
    return dh / m


@pytest.mark.parametrize("lam,t_in,t_out,rh", [(1.8, 450.0, 120.0, 0.0), (1.5, 520.0, 180.0, 0.6),
                                              (2.0, 400.0, 100.0, 0.3), (1.0, 600.0, 150.0, 0.5)])
def test_heat_against_coolprop_species_sum(lam, t_in, t_out, rh):
    """EXH_HEAT per kg vs a per-species CoolProp ideal-gas enthalpy sum (hmolar_idealgas), 0.05 %."""
    w = ex.ambient_water(25.0, rh, 1.0)
    moles = ex.exhaust_moles(METHANE, lam, w)
    q = ex.exhaust_heat(3600.0, t_in, t_out, lam, METHANE, 25.0, rh, 1.0)
    assert q == pytest.approx(_coolprop_dh(moles, t_in, t_out), rel=5e-4)


def test_heat_with_sulfur_against_coolprop():
    comp = {"methane": 97.0, "H2S": 1.0, "CO2": 2.0}
    moles = ex.exhaust_moles(comp, 1.6, 0.0)
    assert moles["SO2"] > 0
    q = ex.exhaust_heat(3600.0, 480.0, 160.0, 1.6, comp, 25.0, 0.0, 1.0)
    assert q == pytest.approx(_coolprop_dh(moles, 480.0, 160.0), rel=5e-4)


def test_dewpoint_against_coolprop_saturation():
    """T_sat(y·p) against CoolProp PropsSI('T', 'P', p_w, 'Q', 0, 'Water') (IAPWS-95), 0.02 K."""
    from CoolProp.CoolProp import PropsSI

    for lam, p in [(1.8, 1.01325), (1.3, 1.05), (2.2, 1.2)]:
        y = ex.exhaust_fractions(METHANE, lam, ex.ambient_water(25.0, 0.3, 1.0))["H2O"]
        expected = PropsSI("T", "P", y * p * 1e5, "Q", 0, "Water") - 273.15
        assert ex.exhaust_dewpoint(lam, METHANE, p) == pytest.approx(expected, abs=0.02)


def test_flow_mass_balance():
    """Exhaust mass = fuel + dry air + water (mass balance) and equals Σ n_i·M_i of the species."""
    from cellfuncs.gas import iso6976

    comp = parse_composition({"methane": 92.0, "ethane": 4.0, "N2": 3.0, "CO2": 1.0})
    w = ex.ambient_water(25.0, 0.3, 1.0)
    flow = ex.exhaust_flow(1000.0, 1.8, comp)
    n_fuel = 1000.0 / iso6976.molar_cv(comp, "net", 25)  # mol/s
    m_fuel = n_fuel * iso6976.molar_mass(comp)
    n_air = n_fuel * 1.8 * combustion.stoich_air_molar(comp)
    m_air = n_air * combustion.dry_air_molar_mass()
    m_w = n_air * w * combustion.species_molar_mass("H2O")
    assert flow == pytest.approx((m_fuel + m_air + m_w) * 3.6, rel=1e-12)
    moles = ex.exhaust_moles(comp, 1.8, w)
    species_mass = n_fuel * math.fsum(n * idealgas.molar_mass(s) for s, n in moles.items() if n)
    assert flow == pytest.approx(species_mass * 3.6, rel=1e-4)


def test_flow_methane_lambda_one_is_stoich_air_plus_fuel():
    """At lambda 1 with dry air the air/fuel mass ratio is GAS_AIR_REQUIREMENT(mass) (gas family)."""
    from cellfuncs.gas import iso6976

    flow = ex.exhaust_flow(1000.0, 1.0, METHANE, "net", 25.0, 0.0, 1.0)
    m_fuel = 1000.0 / iso6976.mass_cv(parse_composition(METHANE), "net", 25) / 1000 * 3600
    assert flow / m_fuel - 1.0 == pytest.approx(
        combustion.air_requirement(parse_composition(METHANE), "mass"), rel=1e-12)


def test_cell_functions_take_ranges():
    """The gas analysis is parsed at the cell boundary (adapt), the same for both shapes."""
    from cellfuncs import adapt
    from cellfuncs.catalogue import by_name

    def cell(name, *v):
        return adapt.call(by_name(name), v)

    comps, fracs = (("methane",), ("ethane",)), ((95.0,), (5.0,))
    two_col = (("methane", 95.0), ("ethane", 5.0))
    a = cell("EXH_FLOW", 1000.0, 1.8, comps, fracs)
    b = cell("EXH_FLOW", 1000.0, 1.8, two_col, None)
    assert a == b > 0
    y = cell("EXH_COMPOSITION", 1.8, comps, fracs, "o2", "dry")
    assert 0.05 < y < 0.12
    assert cell("EXH_COMPOSITION", 1.8, two_col, None, "h2o", "dry") == 0.0
    assert cell("EXH_DEWPOINT", 1.8, comps, fracs) > 40
    assert cell("EXH_HEAT", 5000.0, 450.0, 120.0, 1.8, comps, fracs) > 0
    with pytest.raises(CellInputError, match="^air_ratio:"):
        cell("EXH_FLOW", 1000.0, 0.5, comps, fracs)


def test_stack_temperature_error_names_dew_point():
    with pytest.raises(CellInputError, match=r"^t_out: 40 °C is below the exhaust's water dew point 4\d\.\d+ °C"):
        ex.exhaust_heat(5000.0, 450.0, 40.0, 1.8, METHANE)


@pytest.mark.parametrize("call,name,err", [
    (lambda: ex.exhaust_flow(-5.0, 1.8, METHANE), "fuel_power_kw:", CellInputError),
    (lambda: ex.exhaust_flow(1000.0, 0.9, METHANE), "lambda_:", CellInputError),
    (lambda: ex.exhaust_flow(1000.0, 1.8, METHANE, "medium"), "kind:", CellTypeError),
    (lambda: ex.exhaust_flow(1000.0, 1.8, METHANE, "net", 25.0, 1.5), "rh_ambient:", CellInputError),
    (lambda: ex.exhaust_flow(1000.0, 1.8, METHANE, "net", 25.0, 0.3, 0.0), "p_ambient_bar:", CellInputError),
    (lambda: ex.exhaust_flow(1000.0, 1.8, {"N2": 100.0}), "components:", CellInputError),
    (lambda: ex.exhaust_composition(1.8, METHANE, "nox"), "species:", CellTypeError),
    (lambda: ex.exhaust_composition(1.8, METHANE, "co2", "moist"), "basis:", CellTypeError),
    (lambda: ex.exhaust_heat(-1.0, 450.0, 120.0, 1.8, METHANE), "exhaust_flow_kg_h:", CellInputError),
    (lambda: ex.exhaust_heat(1000.0, 450.0, 480.0, 1.8, METHANE), "t_out:", CellInputError),
    (lambda: ex.exhaust_heat(1000.0, 2000.0, 120.0, 1.8, METHANE), "t_in:", CellInputError),
    (lambda: ex.exhaust_dewpoint(1.8, METHANE, 0.0), "p_bar:", CellInputError),
    (lambda: ex.exhaust_dewpoint(1.8, {"CO": 100.0}, 1.0, 25.0, 0.0), "components:", CellInputError),
    (lambda: ex.o2_correct(-1.0, 10.0, 15.0), "concentration:", CellInputError),
    (lambda: ex.o2_correct(100.0, 20.9, 15.0), "o2_measured:", CellInputError),
    (lambda: ex.o2_correct(100.0, 10.0, 21.0), "o2_reference:", CellInputError),
])
def test_bad_input(call, name, err):
    with pytest.raises(err) as e:
        call()
    assert e.value.message.startswith(name)


@settings(max_examples=60, deadline=None)
@given(lam=st.floats(1.0, 3.0), rh=st.floats(0.0, 1.0), t_amb=st.floats(-10.0, 40.0))
def test_fractions_sum_and_dry_basis(lam, rh, t_amb):
    w = ex.ambient_water(t_amb, rh, 1.0)
    wet = ex.exhaust_fractions(METHANE, lam, w)
    dry = ex.exhaust_fractions(METHANE, lam, w, dry=True)
    assert math.fsum(wet.values()) == pytest.approx(1.0, rel=1e-14)
    assert dry["H2O"] == 0.0
    for k in ("CO2", "O2", "N2", "Ar"):
        assert dry[k] == pytest.approx(wet[k] / (1.0 - wet["H2O"]), rel=1e-12)


@settings(max_examples=60, deadline=None)
@given(lam=st.floats(1.0, 3.0), a=st.floats(130.0, 600.0), b=st.floats(130.0, 600.0))
def test_heat_additive_and_monotonic(lam, a, b):
    hi, lo = max(a, b), min(a, b)
    mid = (hi + lo) / 2
    q = ex.exhaust_heat(1000.0, hi, lo, lam, METHANE)
    q1 = ex.exhaust_heat(1000.0, hi, mid, lam, METHANE)
    q2 = ex.exhaust_heat(1000.0, mid, lo, lam, METHANE)
    assert q >= 0
    assert q == pytest.approx(q1 + q2, rel=1e-10, abs=1e-10)


@settings(max_examples=60, deadline=None)
@given(lam1=st.floats(1.0, 3.0), d=st.floats(0.01, 1.0))
def test_leaner_is_drier_and_has_more_o2(lam1, d):
    a = ex.exhaust_fractions(METHANE, lam1, 0.0)
    b = ex.exhaust_fractions(METHANE, lam1 + d, 0.0)
    assert b["H2O"] < a["H2O"] and b["O2"] > a["O2"]
    assert ex.exhaust_dewpoint(lam1 + d, METHANE, 1.01325, 25.0, 0.0) < ex.exhaust_dewpoint(
        lam1, METHANE, 1.01325, 25.0, 0.0)


@settings(max_examples=100, deadline=None)
@given(c=st.floats(0.0, 1e4), meas=st.floats(0.0, 20.0), ref=st.floats(0.0, 20.0))
def test_o2_correct_round_trip(c, meas, ref):
    back = ex.o2_correct(ex.o2_correct(c, meas, ref), ref, meas)
    assert back == pytest.approx(c, rel=1e-12, abs=1e-12)


def test_exh_flow_kind_takes_the_gas_families_words():
    """EXH_FLOW's kind accepts the same words as the GAS_ kind arguments (one shared mapping)."""
    from cellfuncs import adapt
    from cellfuncs.catalogue import by_name
    from cellfuncs.catalogue.gas import KIND_ALIASES

    exh = by_name("EXH_FLOW")
    kind = next(a for a in exh.args if a.name == "kind")
    gas_kind = next(a for a in by_name("GAS_CV").args if a.name == "kind")
    assert kind.aliases == gas_kind.aliases == KIND_ALIASES
    assert set(kind.options) == set(gas_kind.options)
    comps, fr = [["methane"], ["ethane"]], [[95.0], [5.0]]
    gross = ex.exhaust_flow(1000.0, 1.8, {"CH4": 95.0, "C2H6": 5.0}, "gross", 25.0, 0.3, 1.0)
    net = ex.exhaust_flow(1000.0, 1.8, {"CH4": 95.0, "C2H6": 5.0}, "net", 25.0, 0.3, 1.0)
    assert gross < net  # the same power on the larger (gross) value burns less gas
    for word, want in (("HHV", gross), ("superior", gross), ("Higher", gross), ("gross", gross),
                       ("LHV", net), ("Inferior", net), ("lower", net), ("net", net), (None, net)):
        assert adapt.call(exh, (1000.0, 1.8, comps, fr, word)) == pytest.approx(want, rel=1e-12)
    with pytest.raises(CellTypeError, match="^kind:"):
        adapt.call(exh, (1000.0, 1.8, comps, fr, "wet"))
