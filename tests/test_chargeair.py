"""Charge-air family: mixture flow, compressor outlet, cooler duty, condensate, dew point.

Outside checks are in tests/vectors/chargeair.csv (expected values from CoolProp 8,
psychrolib 2.5 and the ISO 6976:2016 table; written by tools/make_chargeair_vectors.py).
Live cross-checks below name the reference function used.
"""

import math

import pytest
from hypothesis import assume, given, settings
from hypothesis import strategies as st

from cellfuncs.catalogue import by_name
from cellfuncs.chargeair import compressor, cooler, humid, mixture
from cellfuncs.errors import CellInputError, CellTypeError
from vectors import approx, params

# the gases of the vectors file (same table as tools/make_chargeair_vectors.py)
GASES = {
    "air": None,
    "CH4": ((("CH4",),), ((100.0,),)),
    "NG1": ((("CH4",), ("C2H6",), ("C3H8",), ("N2",), ("CO2",)),
            ((90.0,), (5.0,), (2.0,), (2.0,), (1.0,))),
}
NG1 = GASES["NG1"]
CH4 = GASES["CH4"]


def _gas(row):
    g = GASES[row["gas"]]
    return (None, None) if g is None else g


def _call(name, *args):
    """Call the catalogue target of an Excel name positionally (as the adapters do)."""
    from cellfuncs.adapt import _fold_gas, _one

    e = by_name(name)
    vals = list(args) + [None] * (len(e.args) - len(args))
    cells = [_one(a, v) if a.kind in ("gas", "amounts") and v is not None
             else (a.default if v is None and a.optional else v) for a, v in zip(e.args, vals)]
    return e.resolve()(*_fold_gas(e, cells))


def _run(row):
    comps, fracs = _gas(row)
    f = row["function"]
    lam = row.get("lambda_")
    if f == "TURBO_T_OUT":
        return _call(f, row["t_in"], row["p_in_bar"], row["p_out_bar"], row["eta_is"], lam,
                     comps, fracs, row["t_ambient"], row["rh_ambient"])
    if f == "CAC_DEWPOINT":
        return _call(f, row["p_bar"], lam, comps, fracs, row["t_ambient"], row["rh_ambient"],
                     row["p_ambient_bar"])
    if f == "CAC_DUTY":
        return _call(f, row["mixture_flow_kg_h"], row["t_in"], row["t_out"], row["p_bar"], lam,
                     comps, fracs, row["t_ambient"], row["rh_ambient"], row["p_ambient_bar"])
    if f == "CAC_MIXTURE_FLOW":
        return _call(f, row["fuel_power_kw"], lam, comps, fracs, row["kind"], row["t_ambient"],
                     row["rh_ambient"], row["p_ambient_bar"], row["part"])
    raise AssertionError(f)


@pytest.mark.parametrize("row", params("chargeair"))
def test_vectors(row):
    assert _run(row) == approx(row)


# --- humid air: saturation pressure and dew point ------------------------------------

@pytest.mark.parametrize("T,p_mpa", [(300.0, 0.353658941e-2), (500.0, 0.263889776e1),
                                     (600.0, 0.123443146e2)])
def test_p_sat_if97_verification_values(T, p_mpa):
    """IAPWS-IF97 (Wagner et al. 2000), region 4 verification table (saturation pressure)."""
    assert humid.p_sat_K(T) == pytest.approx(p_mpa * 1e6, rel=5e-9)


@pytest.mark.parametrize("p_mpa,T", [(0.1, 0.372755919e3), (1.0, 0.453035632e3),
                                     (10.0, 0.584149488e3)])
def test_t_sat_if97_verification_values(p_mpa, T):
    """IAPWS-IF97 (Wagner et al. 2000), region 4 verification table (saturation temperature)."""
    assert humid.t_sat_K(p_mpa * 1e6) == pytest.approx(T, rel=5e-9)


@pytest.mark.parametrize("t", [-40.0, -20.0, -5.0, 0.02, 10.0, 25.0, 50.0, 80.0])
def test_p_sat_vs_psychrolib(t):
    """psychrolib GetSatVapPres (ASHRAE Handbook Fundamentals 2017 ch. 1, over ice below
    0.01 °C) within 0.05 %."""
    import psychrolib

    psychrolib.SetUnitSystem(psychrolib.SI)
    assert humid.p_sat_c(t) == pytest.approx(psychrolib.GetSatVapPres(t), rel=5e-4)


@pytest.mark.parametrize("T", [275.0, 300.0, 330.0, 373.15, 450.0, 550.0])
def test_latent_heat_vs_iapws95(T):
    """h'' - h' against CoolProp IAPWS-95 PropsSI('H','T',T,'Q',1/0,'Water') within 0.05 %."""
    import CoolProp.CoolProp as CP

    ref = CP.PropsSI("H", "T", T, "Q", 1, "Water") - CP.PropsSI("H", "T", T, "Q", 0, "Water")
    assert humid.latent_heat_K(T) == pytest.approx(ref, rel=5e-4)


@pytest.mark.parametrize("t,rh,p", [(25.0, 0.3, 1.0), (35.0, 0.8, 0.95), (5.0, 0.9, 1.01325)])
def test_humidity_ratio_vs_psychrolib(t, rh, p):
    """psychrolib GetHumRatioFromRelHum within 0.1 % (it uses 0.621945 for the mass ratio)."""
    import psychrolib

    psychrolib.SetUnitSystem(psychrolib.SI)
    assert humid.humidity_ratio(t, rh, p) == pytest.approx(
        psychrolib.GetHumRatioFromRelHum(t, rh, p * 1e5), rel=1e-3)


@settings(max_examples=150, deadline=None)
@given(T=st.floats(195.0, 645.0))
def test_saturation_round_trip(T):
    assert humid.t_sat_K(humid.p_sat_K(T)) == pytest.approx(T, abs=1e-6)


# --- mixture ---------------------------------------------------------------------------

def test_methane_lambda_1_air_fuel_ratio_equals_gas_air_requirement():
    """Dry air / fuel at lambda 1 = GAS_AIR_REQUIREMENT(mass) of the gas family (consistency check)."""
    ratio = {}
    for key in ("CH4", "NG1"):
        comps, fracs = GASES[key]
        air = _call("CAC_MIXTURE_FLOW", 1000.0, 1.0, comps, fracs, "net", 25.0, 0.3, 1.0,
                    "dry_air")
        fuel = _call("CAC_MIXTURE_FLOW", 1000.0, 1.0, comps, fracs, "net", 25.0, 0.3, 1.0, "fuel")
        req = _call("GAS_AIR_REQUIREMENT", comps, fracs, "mass")
        assert air / fuel == pytest.approx(req, rel=1e-12)
        ratio[key] = air / fuel
    # methane: about 17.2 kg/kg (common practice)
    assert ratio["CH4"] == pytest.approx(17.2, abs=0.1)


def test_fuel_flow_is_power_over_mass_cv():
    """Fuel = fuel power / GAS_CV(net, mass, 25 °C) of the gas family."""
    comps, fracs = NG1
    fuel = _call("CAC_MIXTURE_FLOW", 1500.0, 1.7, comps, fracs, "gross", 25.0, 0.3, 1.0, "fuel")
    hm = _call("GAS_CV", comps, fracs, "gross", "mass", "25/0", 1.01325)
    assert fuel == pytest.approx(3.6 * 1500.0 / hm, rel=1e-12)


@settings(max_examples=100, deadline=None)
@given(power=st.floats(1.0, 20000.0), lam=st.floats(0.5, 3.0), t=st.floats(-30.0, 50.0),
       rh=st.floats(0.0, 1.0), water=st.floats(0.0, 5.0))
def test_mixture_mass_balance(power, lam, t, rh, water):
    """dry air + water + fuel = mixture (exact up to float rounding), gas with its own water."""
    comps = (("CH4",), ("CO2",), ("H2O",))
    fracs = ((60.0 - water,), (40.0,), (water,))
    parts = {p: _call("CAC_MIXTURE_FLOW", power, lam, comps, fracs, "net", t, rh, 1.0, p)
             for p in mixture.PARTS}
    assert parts["mixture"] == pytest.approx(parts["dry_air"] + parts["water"] + parts["fuel"],
                                             rel=1e-14)
    assert parts["water"] >= 0.0 and parts["fuel"] > 0.0


def test_fuel_water_counts_as_water():
    """The gas's own H2O goes to "water"; "fuel" excludes it (mass balance by hand)."""
    comps, fracs = (("CH4",), ("H2O",)), ((95.0,), (5.0,))
    w = _call("CAC_MIXTURE_FLOW", 1000.0, 1.8, comps, fracs, "net", 25.0, 0.0, 1.0, "water")
    fuel = _call("CAC_MIXTURE_FLOW", 1000.0, 1.8, comps, fracs, "net", 25.0, 0.0, 1.0, "fuel")
    # mass ratio water/methane in the gas, ISO 6976:2016 molar masses
    assert w / fuel == pytest.approx(0.05 * 18.01528 / (0.95 * 16.04246), rel=1e-12)


# --- compressor --------------------------------------------------------------------

def test_turbo_no_compression_and_efficiency_order():
    assert _call("TURBO_T_OUT", 30.0, 1.0, 1.0, 0.8) == pytest.approx(30.0)
    lo = _call("TURBO_T_OUT", 25.0, 1.0, 3.0, 0.9)
    hi = _call("TURBO_T_OUT", 25.0, 1.0, 3.0, 0.7)
    assert hi > lo > 25.0


@settings(max_examples=100, deadline=None)
@given(pr=st.floats(1.05, 6.0), eta=st.floats(0.5, 1.0), t=st.floats(0.0, 50.0))
def test_turbo_monotone_in_pressure_ratio(pr, eta, t):
    a = compressor.t_out(t, 1.0, pr, eta, None, None, t, 0.3)
    b = compressor.t_out(t, 1.0, pr * 1.05, eta, None, None, t, 0.3)
    assert b > a > t


# --- cooler ------------------------------------------------------------------------

def test_two_stage_duty_adds_up():
    """HT stage + LT stage = one cooler from the compressor outlet to the intake (enthalpy is a
    state function)."""
    comps, fracs = NG1
    args = (2.8, 1.8, comps, fracs, 32.0, 0.7, 1.0)
    m = 9000.0
    whole = _call("CAC_DUTY", m, 170.0, 42.0, *args)
    ht = _call("CAC_DUTY", m, 170.0, 90.0, *args)
    lt = _call("CAC_DUTY", m, 90.0, 42.0, *args)
    assert ht + lt == pytest.approx(whole, rel=1e-12)


def test_condensing_gas_mixture_vs_coolprop_balance():
    """Condensing air-gas mixture: duty = sensible heat of all species (CoolProp ideal-gas
    PropsSI('Cp0molar') integrated) + condensate x IAPWS-95 latent heat (PropsSI 'H' at Q=1
    minus Q=0); condensate from the IF97 saturation pressure (PropsSI 'IF97::Water'). 0.5 %."""
    import CoolProp.CoolProp as CP
    from scipy.integrate import quad

    from cellfuncs.gas.composition import parse_composition

    names = {"N2": "Nitrogen", "O2": "Oxygen", "Ar": "Argon", "CO2": "CarbonDioxide",
             "H2O": "Water", "CH4": "Methane", "C2H6": "Ethane", "C3H8": "Propane"}
    comps, fracs = NG1
    p, lam, t_amb, rh = 3.0, 1.9, 35.0, 0.9
    t1, t2, m = 150.0, 35.0, 5000.0
    args = (p, lam, comps, fracs, t_amb, rh, 1.0)
    mix = mixture.charge_mixture(parse_composition(comps, fracs), lam, t_amb, rh, 1.0)
    n = dict(mix.moles)  # mol per mol dry air (composition arithmetic checked elsewhere)
    T1, T2 = t1 + 273.15, t2 + 273.15
    sens = sum(v * quad(lambda T: CP.PropsSI("Cp0molar", "T", T, "P", 10.0, names[s]), T2, T1)[0]
               for s, v in n.items())  # J per mol dry air
    ps = CP.PropsSI("P", "T", T2, "Q", 0, "IF97::Water")
    n_other = sum(v for s, v in n.items() if s != "H2O")
    n_cond = n["H2O"] - n_other * ps / (p * 1e5 - ps)
    assert n_cond > 0
    L = (CP.PropsSI("H", "T", T2, "Q", 1, "Water") - CP.PropsSI("H", "T", T2, "Q", 0, "Water"))
    dh = sens + n_cond * 18.01528e-3 * L  # J per mol dry air
    mol_s = m / 3.6 / mix.mass  # mol dry air per s
    assert _call("CAC_DUTY", m, t1, t2, *args) == pytest.approx(mol_s * dh / 1000.0, rel=5e-3)
    assert _call("CAC_CONDENSATE", m, t2, *args) == pytest.approx(
        mol_s * n_cond * 18.01528 * 3.6, rel=1e-6)


@settings(max_examples=120, deadline=None)
@given(p=st.floats(1.0, 5.0), t_amb=st.floats(0.0, 45.0), rh=st.floats(0.05, 1.0),
       lam=st.floats(1.2, 2.5), dt=st.floats(0.05, 20.0))
def test_condensate_zero_above_and_positive_below_dew_point(p, t_amb, rh, lam, dt):
    """CAC_CONDENSATE = 0 above CAC_DEWPOINT and > 0 below it (property)."""
    comps, fracs = NG1
    args = (p, lam, comps, fracs, t_amb, rh, 1.0)
    td = _call("CAC_DEWPOINT", *args)
    assume(td - dt > 0.5)
    assert _call("CAC_CONDENSATE", 1000.0, td + dt, *args) == 0.0
    assert _call("CAC_CONDENSATE", 1000.0, td - dt, *args) > 0.0


@settings(max_examples=80, deadline=None)
@given(p=st.floats(1.0, 5.0), rh=st.floats(0.1, 1.0), t2=st.floats(5.0, 80.0))
def test_duty_positive_and_grows_as_outlet_falls(p, rh, t2):
    comps, fracs = NG1
    args = (p, 1.8, comps, fracs, 30.0, rh, 1.0)
    q1 = _call("CAC_DUTY", 1000.0, 150.0, t2, *args)
    q2 = _call("CAC_DUTY", 1000.0, 150.0, t2 - 1.0, *args)
    assert q2 > q1 > 0.0


def test_dew_point_rises_with_pressure_and_humidity():
    comps, fracs = NG1
    d1 = _call("CAC_DEWPOINT", 2.0, 1.8, comps, fracs, 25.0, 0.5)
    d2 = _call("CAC_DEWPOINT", 3.0, 1.8, comps, fracs, 25.0, 0.5)
    d3 = _call("CAC_DEWPOINT", 3.0, 1.8, comps, fracs, 25.0, 0.8)
    assert d1 < d2 < d3


# --- bad input --------------------------------------------------------------------

def test_bad_input_names_the_argument():
    comps, fracs = NG1
    bad = [
        ("lambda_", "CAC_MIXTURE_FLOW", (1000.0, 0.0, comps, fracs)),
        ("lambda_", "CAC_MIXTURE_FLOW", (1000.0, -1.0, comps, fracs)),
        ("lambda_", "CAC_DEWPOINT", (2.0, 0.0, comps, fracs, 25.0, 0.3)),
        ("lambda_", "TURBO_T_OUT", (25.0, 1.0, 2.0, 0.8, None, comps, fracs)),
        ("rh_ambient", "CAC_MIXTURE_FLOW", (1000.0, 1.8, comps, fracs, "net", 25.0, 1.2)),
        ("rh_ambient", "CAC_DUTY", (1000.0, 150.0, 50.0, 2.0, 1.8, comps, fracs, 25.0, -0.1)),
        ("rh_ambient", "TURBO_T_OUT", (25.0, 1.0, 2.0, 0.8, None, None, None, 25.0, 1.5)),
        ("p_out_bar", "TURBO_T_OUT", (25.0, 2.0, 1.5, 0.8)),
        ("eta_is", "TURBO_T_OUT", (25.0, 1.0, 2.0, 0.0)),
        ("eta_is", "TURBO_T_OUT", (25.0, 1.0, 2.0, 1.2)),
        ("t_out", "CAC_DUTY", (1000.0, 50.0, 60.0, 2.0, 1.8, comps, fracs, 25.0, 0.3)),
        # the cooler inlet must be vapour only
        ("t_in", "CAC_DUTY", (1000.0, 30.0, 20.0, 4.0, 1.8, comps, fracs, 35.0, 0.9)),
        # the compressor inlet below the dew point of the humid mixture
        ("t_in", "TURBO_T_OUT", (10.0, 1.0, 2.0, 0.8, 1.8, comps, fracs, 35.0, 0.9)),
        ("rh_ambient", "CAC_DEWPOINT", (2.0, 1.8, comps, fracs, 25.0, 0.0)),
        ("p_bar", "CAC_CONDENSATE", (1000.0, 40.0, 0.1, 1.8, comps, fracs, 25.0, 0.3)),
        ("mixture_flow_kg_h", "CAC_CONDENSATE", (-5.0, 40.0, 2.0, 1.8, comps, fracs, 25.0, 0.3)),
        ("fuel_power_kw", "CAC_MIXTURE_FLOW", (-1.0, 1.8, comps, fracs)),
        ("t_ambient", "CAC_DUTY", (1000.0, 150.0, 50.0, 2.0, 1.8, comps, fracs, 75.0, 0.3)),
        ("p_ambient_bar", "CAC_DEWPOINT", (2.0, 1.8, comps, fracs, 25.0, 0.3, 2.0)),
    ]
    for arg, name, a in bad:
        with pytest.raises(CellInputError, match=arg):
            _call(name, *a)
    with pytest.raises(CellTypeError, match="part"):
        _call("CAC_MIXTURE_FLOW", 1000.0, 1.8, comps, fracs, "net", 25.0, 0.3, 1.0, "smoke")
    with pytest.raises(CellTypeError, match="kind"):
        _call("CAC_MIXTURE_FLOW", 1000.0, 1.8, comps, fracs, "medium")
    with pytest.raises(CellInputError, match="components"):
        _call("CAC_DEWPOINT", 2.0, 1.8, (("unobtainium",),), ((100.0,),), 25.0, 0.3)


def test_lean_and_rich_lambda_allowed():
    """lambda below 1 is allowed for the mixture (rich mixtures); <= 0 is not."""
    comps, fracs = CH4
    rich = _call("CAC_MIXTURE_FLOW", 1000.0, 0.9, comps, fracs, "net", 25.0, 0.3, 1.0, "dry_air")
    lean = _call("CAC_MIXTURE_FLOW", 1000.0, 1.8, comps, fracs, "net", 25.0, 0.3, 1.0, "dry_air")
    assert lean / rich == pytest.approx(2.0, rel=1e-12)


def test_results_are_finite():
    comps, fracs = NG1
    for v in (_call("CAC_DUTY", 0.0, 150.0, 40.0, 2.0, 1.8, comps, fracs, 25.0, 0.3),
              _call("CAC_CONDENSATE", 0.0, 10.0, 2.0, 1.8, comps, fracs, 25.0, 0.3),
              _call("TURBO_T_OUT", -40.0, 0.9, 9.0, 0.6, 1.8, comps, fracs, -40.0, 1.0)):
        assert math.isfinite(v)


def test_catalogue_entries_match_the_cores():
    """Every charge-air and knock entry resolves; its arguments are the core's, in order."""
    import inspect

    from cellfuncs.catalogue import entries

    names = set()
    for e in entries():
        if e.category not in ("cellfuncs · charge air", "cellfuncs · knock"):
            continue
        names.add(e.name)
        params_ = list(inspect.signature(e.resolve()).parameters)
        # positions match (the amounts position is folded into the gas analysis); the names
        # are the glossary's at the cell and the core's own in Python (adapt renames errors)
        folded = [a for a in e.args if a.kind != "amounts"]
        assert len(folded) <= len(params_), e.name
        assert len(e.description) <= 255 and "[" in e.returns
        for a in e.args:
            if a.kind == "option":
                assert a.default in a.options and all(o == o.lower() for o in a.options)
    assert names == {"CAC_MIXTURE_FLOW", "TURBO_T_OUT", "CAC_DEWPOINT", "CAC_DUTY",
                     "CAC_CONDENSATE", "KNOCK_MARGIN", "KNOCK_T_LIMIT", "KNOCK_MN_REQUIRED"}
