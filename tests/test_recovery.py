"""Hot-water circuits: water properties, flows and duties, chains of exchangers.

Outside sources: CoolProp 8 ``PropsSI`` (IAPWS-95 water, INCOMP::MEG/MPG
water-glycol after Melinder 2010) and ``ht.effectiveness_from_NTU`` (Caleb
Bell's ht 1.2, epsilon-NTU relations); the vectors are in
tests/vectors/recovery.csv.
"""

from __future__ import annotations

import math

import pytest
from hypothesis import given, settings
from hypothesis import strategies as st

from vectors import approx, params

from cellfuncs.errors import CellInputError, CellTypeError
from cellfuncs.recovery import chain, water
from cellfuncs import adapt, catalogue
from cellfuncs.recovery.chain import chain_temperatures, rate_chain, rate_chain_water
from cellfuncs.recovery.chain_results import hw_chain
from cellfuncs.recovery.water import hw_cp, hw_density, hw_duty, hw_flow


def _cell(name):
    """The catalogue function NAME as a cell calls it (the shared adapter: ranges, layout, errors)."""
    entry = catalogue.by_name(name)
    return lambda *values: adapt.call(entry, values)


HW_CHAIN, HW_CHAIN_RATE, HW_CHAIN_CHECK = _cell("HW_CHAIN"), _cell("HW_CHAIN_RATE"), _cell("HW_CHAIN_CHECK")

CASES = {
    # stage data (hot_t_in, hot_c_kw_k, ua_kw_k) of the order-matters check
    "ew-exh": ([92.0, 450.0], [20.95, 3.351], [60.0, 8.0]),
    "exh-ew": ([450.0, 92.0], [3.351, 20.95], [8.0, 60.0]),
}


# ---- vectors ------------------------------------------------------------------

@pytest.mark.parametrize("row", params("recovery", "HW_CP"))
def test_cp_vectors(row):
    assert hw_cp(row["t"], row["glycol_fraction"], row["glycol"]) == approx(row)


@pytest.mark.parametrize("row", params("recovery", "HW_DENSITY"))
def test_density_vectors(row):
    assert hw_density(row["t"], row["glycol_fraction"], row["glycol"]) == approx(row)


@pytest.mark.parametrize("row", params("recovery", "T_BOIL"))
def test_boiling_point_vector(row):
    assert water.T_BOIL_C == approx(row)
    assert water.T_WATER_MAX < water.T_BOIL_C < water.T_WATER_MAX + 0.01


def _rate_case(case):
    th, ch, ua = CASES[case]
    return rate_chain(70.0, 41.9, th, ch, ua, "counter")


@pytest.mark.parametrize("row", params("recovery", "RATE_CHAIN"))
def test_order_matters_vectors(row):
    res = _rate_case(row["case"])
    q = row["quantity"]
    k = int(q[-1]) - 1
    value = {"duty": res[k][0], "t_out": res[k][1], "t_hot_out": res[k][2]}[q[:-1]]
    assert value == approx(row)


def _ht_stage(t_c, c_c, t_h, c_h, ua):
    """One counterflow stage with ht.effectiveness_from_NTU (reference library)."""
    import ht

    c_min, c_max = min(c_c, c_h), max(c_c, c_h)
    eps = ht.effectiveness_from_NTU(ua / c_min, c_min / c_max, "counterflow")
    q = eps * c_min * (t_h - t_c)
    return q, t_c + q / c_c, t_h - q / c_h


@pytest.mark.parametrize("case", sorted(CASES))
def test_order_matters_against_ht(case):
    """Recompute both chains stage by stage with ht.effectiveness_from_NTU."""
    th, ch, ua = CASES[case]
    t = 70.0
    res = _rate_case(case)
    for k in range(2):
        q, t, t_hot = _ht_stage(t, 41.9, th[k], ch[k], ua[k])
        assert res[k][0] == pytest.approx(q, rel=1e-9)
        assert res[k][1] == pytest.approx(t, rel=1e-9)
        assert res[k][2] == pytest.approx(t_hot, rel=1e-9)


def test_order_changes_total():
    """Reversing the two stages loses heat: 1511.8 kW vs 1046.8 kW.

    Source: ht 1.2.0, ht.effectiveness_from_NTU (counterflow) stage by stage, the
    stage duties of tests/vectors/recovery.csv summed.
    """
    a = sum(r[0] for r in _rate_case("ew-exh"))
    b = sum(r[0] for r in _rate_case("exh-ew"))
    assert a == pytest.approx(398.39635559411533 + 1113.3614236733335, rel=1e-9)
    assert b == pytest.approx(1141.9346302438564 - 95.14084880582622, rel=1e-9)


# ---- live cross-checks against CoolProp ------------------------------------------

@pytest.mark.parametrize("t", [0.5, 5.0, 25.0, 47.3, 70.0, 85.0, 99.0, 110.0, 125.0, 133.0])
def test_water_against_propssi(t):
    """cp and density against CoolProp PropsSI('C'/'D', 'T', T, 'P', 3e5, ...): 'IF97::Water'
    (the formulation used since issue 9) at rtol 1e-9, 'Water' (IAPWS-95) at rtol 1e-3 (the 0.1 %
    bound issue 9 sets on the move of hot-water results; it was 1e-6 while water came from IAPWS-95)."""
    from CoolProp.CoolProp import PropsSI

    T = t + 273.15
    assert hw_cp(t) == pytest.approx(PropsSI("C", "T", T, "P", 3e5, "IF97::Water") / 1e3, rel=1e-9)
    assert hw_density(t) == pytest.approx(PropsSI("D", "T", T, "P", 3e5, "IF97::Water"), rel=1e-9)
    assert hw_cp(t) == pytest.approx(PropsSI("C", "T", T, "P", 3e5, "Water") / 1e3, rel=1e-3)
    assert hw_density(t) == pytest.approx(PropsSI("D", "T", T, "P", 3e5, "Water"), rel=1e-3)


@pytest.mark.parametrize("glycol,fluid", [("ethylene", "MEG"), ("propylene", "MPG")])
@pytest.mark.parametrize("x,t", [(0.1, 5.0), (0.25, 40.0), (0.4, 90.0), (0.6, -20.0)])
def test_glycol_against_propssi(glycol, fluid, x, t):
    """Against CoolProp PropsSI(..., 'INCOMP::MEG[x]' / 'INCOMP::MPG[x]'), rtol 1e-6."""
    from CoolProp.CoolProp import PropsSI

    name = f"INCOMP::{fluid}[{x}]"
    T = t + 273.15
    assert hw_cp(t, x, glycol) == pytest.approx(PropsSI("C", "T", T, "P", 3e5, name) / 1e3, rel=1e-6)
    assert hw_density(t, x, glycol) == pytest.approx(PropsSI("D", "T", T, "P", 3e5, name), rel=1e-6)


def test_duty_is_enthalpy_rise_propssi():
    """HW_DUTY = V·ρ(t_in)·Δh / 3600 with ρ and h from CoolProp PropsSI ('D', 'H'; 3e5 Pa):
    'IF97::Water' (the formulation used) at rtol 1e-9, 'Water' (IAPWS-95) at rtol 1e-3 (issue 9's
    0.1 % bound; 1e-9 while water came from IAPWS-95)."""
    from CoolProp.CoolProp import PropsSI

    for fluid, rtol in (("IF97::Water", 1e-9), ("Water", 1e-3)):
        rho = PropsSI("D", "T", 333.15, "P", 3e5, fluid)
        dh = PropsSI("H", "T", 363.15, "P", 3e5, fluid) - PropsSI("H", "T", 333.15, "P", 3e5, fluid)
        assert hw_duty(50.0, 60.0, 90.0) == pytest.approx(50.0 * rho * dh / 3.6e6, rel=rtol)


# ---- round trips and identities ------------------------------------------------

def test_flow_round_trip_exact():
    """HW_FLOW·density(t_in)·mean cp·ΔT = duty: HW_DUTY(HW_FLOW(Q)) returns Q."""
    for q, a, b in [(1000.0, 70.0, 90.0), (2500.0, 60.0, 105.0), (-300.0, 90.0, 75.0)]:
        v = hw_flow(q, a, b)
        assert hw_duty(v, a, b) == pytest.approx(q, rel=1e-14)
        cp_mean = (water.enthalpy(b) - water.enthalpy(a)) / (b - a)
        assert v / 3600 * hw_density(a) * cp_mean * (b - a) == pytest.approx(q, rel=1e-14)


def test_one_stage_chain_is_duty_inversion():
    t = chain_temperatures(60.0, 80.0, [1500.0])[0]
    assert hw_duty(80.0, 60.0, t) == pytest.approx(1500.0, rel=1e-10)
    t = chain_temperatures(40.0, 30.0, [400.0], 0.35, "propylene")[0]
    assert hw_duty(30.0, 40.0, t, 0.35, "propylene") == pytest.approx(400.0, rel=1e-10)


def test_chain_stages_add_up():
    temps = chain_temperatures(60.0, 90.0, [150.0, 420.0, None, 900.0])
    assert temps[1] == temps[2]
    assert hw_duty(90.0, 60.0, temps[-1]) == pytest.approx(1470.0, rel=1e-10)


def test_chain_rate_water_stage_by_stage_against_hx_rate():
    """Each HW_CHAIN_RATE stage equals HX_RATE (heat-exchanger family, catalogue target) with that
    stage's water inlet and capacity rate; a stage colder than the water is HX_RATE with the
    streams swapped (the water is then the hot stream)."""
    from cellfuncs.catalogue import by_name

    hx_rate = by_name("HX_RATE").resolve()
    th, ch, ua = [92.0, 450.0, 85.0], [20.95, 3.351, 30.0], [60.0, 8.0, 25.0]
    seen_negative = False
    for arr in chain.ARRANGEMENTS:
        res = rate_chain_water(70.0, 36.0, th, ch, ua, arr)
        for k, r in enumerate(res):
            if th[k] >= r["t_in"]:
                q, t_hot, t_out = hx_rate(th[k], r["t_in"], ch[k], r["c_water"], ua[k], arr, "all")
            else:
                seen_negative = True
                q, t_out, t_hot = hx_rate(r["t_in"], th[k], r["c_water"], ch[k], ua[k], arr, "all")
                q = -q
            assert r["duty"] == pytest.approx(q, rel=1e-9)
            assert r["t_hot_out"] == pytest.approx(t_hot, rel=1e-9)
            assert r["t_out"] == pytest.approx(t_out, rel=1e-9)
    assert seen_negative  # the 85 °C source after the exhaust stage runs backwards


def test_chain_rate_water_stages_against_ht():
    """Same check against ht.effectiveness_from_NTU (counterflow) with the reported capacity rate."""
    th, ch, ua = [92.0, 450.0, 85.0], [20.95, 3.351, 30.0], [60.0, 8.0, 25.0]
    res = rate_chain_water(70.0, 36.0, th, ch, ua, "counter")
    for k, r in enumerate(res):
        q, t_out, t_hot = _ht_stage(r["t_in"], r["c_water"], th[k], ch[k], ua[k])
        assert r["duty"] == pytest.approx(q, rel=1e-9)
        assert r["t_out"] == pytest.approx(t_out, rel=1e-9)
        assert r["t_hot_out"] == pytest.approx(t_hot, rel=1e-9)
        # water side: duty is the enthalpy rise of the volume flow (HW_DUTY)
        assert hw_duty(36.0, 70.0, r["t_out"]) - hw_duty(36.0, 70.0, r["t_in"]) == pytest.approx(
            r["duty"], rel=1e-9, abs=1e-9)
        if k + 1 < len(res):
            assert res[k + 1]["t_in"] == r["t_out"]


# ---- through the cell boundary: ranges and layout ------------------------------------------------------

def test_cell_chain_layout():
    row = HW_CHAIN(60.0, 50.0, ((200.0, 300.0, None, 400.0),))
    assert len(row) == 1 and len(row[0]) == 4
    col = HW_CHAIN(60.0, 50.0, ((200.0,), (300.0,), (None,), (400.0,)))
    assert [c[0] for c in col] == row[0]
    assert HW_CHAIN(60.0, 50.0, ((200.0,), (300.0,)), 0.0, "ethylene", 2) == row[0][1]


def test_cell_chain_rate_outputs():
    th, ch, ua = ((92.0,), (450.0,)), ((20.95,), (3.351,)), ((60.0,), (8.0,))
    duty = HW_CHAIN_RATE(70.0, 40.0, th, ch, ua, "counter", "duty")
    t_out = HW_CHAIN_RATE(70.0, 40.0, th, ch, ua)
    t_hot = HW_CHAIN_RATE(70.0, 40.0, th, ch, ua, "counter", "t_hot_out")
    assert len(duty) == 2 and all(len(r) == 1 for r in duty)
    assert t_hot[0][0] == pytest.approx(92.0 - duty[0][0] / 20.95, rel=1e-12)
    assert t_hot[1][0] == pytest.approx(450.0 - duty[1][0] / 3.351, rel=1e-12)
    assert 70.0 < t_out[0][0] < t_out[1][0] < 133.5


def test_cell_chain_rate_negative_duty_when_source_colder():
    duty = HW_CHAIN_RATE(70.0, 40.0, ((450.0, 92.0),), ((3.351, 20.95),), ((8.0, 60.0),),
                           "counter", "duty")[0]
    assert duty[0] > 0 > duty[1]


def test_chain_check_ok_and_findings():
    assert HW_CHAIN_CHECK(60.0, 50.0, ((200.0, 300.0, 400.0),), ((92.0, 95.0, 450.0),)) == "OK"
    # 60 °C, 50 m³/h: stage 1 at 1500 kW leaves about 86 °C, above the oil cooler's 80 - 5 = 75 °C
    text = HW_CHAIN_CHECK(60.0, 50.0, ((1500.0, 300.0),), ((80.0, 450.0),))
    assert text.startswith("stage 1 hot end:") and "\n" not in text and "75" in text
    text = HW_CHAIN_CHECK(60.0, 50.0, ((200.0, 300.0, 4000.0),), ((92.0, 95.0, 450.0),))
    assert text.startswith("stage 3:") and "133.52" in text
    # one hot_t_max for all stages
    assert HW_CHAIN_CHECK(60.0, 50.0, ((200.0, 300.0),), ((95.0,),), 5.0) == "OK"


# ---- bad input names the argument --------------------------------------------

@pytest.mark.parametrize("call,name", [
    (lambda: hw_cp(140.0), "t:"),
    (lambda: hw_cp(-1.0), "t:"),
    (lambda: hw_cp(105.0, 0.3), "t:"),
    (lambda: hw_cp(-30.0, 0.3), "t:"),
    (lambda: hw_cp(50.0, 0.7), "glycol_fraction:"),
    (lambda: hw_cp(50.0, -0.1), "glycol_fraction:"),
    (lambda: hw_density(float("nan")), "t:"),
    (lambda: hw_flow(0.0, 60.0, 90.0), "duty_kw:"),
    (lambda: hw_flow(100.0, 60.0, 60.0), "t_out:"),
    (lambda: hw_flow(100.0, 90.0, 60.0), "t_out:"),
    (lambda: hw_flow(100.0, 60.0, 150.0), "t_out:"),
    (lambda: hw_duty(0.0, 60.0, 90.0), "flow_m3h:"),
    (lambda: hw_duty(10.0, 160.0, 90.0), "t_in:"),
    (lambda: HW_CHAIN(60.0, 10.0, ((2000.0, 3000.0),)), "duties_kw:"),
    (lambda: HW_CHAIN(140.0, 10.0, ((20.0,),)), "t_water_in:"),
    (lambda: HW_CHAIN(60.0, -1.0, ((20.0,),)), "water_flow_m3_h:"),
    (lambda: HW_CHAIN(60.0, 10.0, ((20.0,),), 0.0, "ethylene", 3), "stage:"),
    (lambda: HW_CHAIN(60.0, 10.0, ((500.0,),), 0.3, "ethylene", None), "duties_kw:"),
    (lambda: HW_CHAIN_RATE(70.0, 5.0, ((450.0,),), ((10.0,),), ((30.0,),)), "ua_kw_k:"),
    (lambda: HW_CHAIN_RATE(70.0, 5.0, ((450.0, 90.0),), ((10.0,),), ((30.0,),)), "c_source_kw_k:"),
    (lambda: HW_CHAIN_RATE(70.0, 5.0, ((None,),), ((10.0,),), ((30.0,),)), "t_source_in:"),
    (lambda: HW_CHAIN_RATE(70.0, 5.0, ((90.0,),), ((0.0,),), ((30.0,),)), "c_source_kw_k:"),
    (lambda: HW_CHAIN_RATE(70.0, 5.0, ((90.0,),), ((5.0,),), ((-3.0,),)), "ua_kw_k:"),
    (lambda: HW_CHAIN_CHECK(60.0, 50.0, ((200.0, 300.0),), ((92.0, None),)), "t_source_in:"),
    (lambda: HW_CHAIN_CHECK(60.0, 50.0, ((200.0,),), ((92.0,),), -1.0), "min_approach_k:"),
])
def test_bad_input_names_argument(call, name):
    with pytest.raises(CellInputError) as err:
        call()
    assert err.value.message.startswith(name)
    assert "\n" not in err.value.message


@pytest.mark.parametrize("call,name", [
    (lambda: hw_cp(50.0, 0.3, "glycerol"), "glycol:"),
    (lambda: HW_CHAIN(60.0, 10.0, ((20.0, 30.0), (1.0, 2.0))), "duties_kw:"),
    (lambda: HW_CHAIN(60.0, 10.0, ((20.0, "x"),)), "duties_kw:"),
    (lambda: hw_chain(60.0, 10.0, [20.0], 0.0, "ethylene", 1.5), "stage:"),
    (lambda: HW_CHAIN_RATE(70.0, 5.0, ((90.0,),), ((5.0,),), ((3.0,),), "zigzag"), "arrangement:"),
    (lambda: HW_CHAIN_RATE(70.0, 5.0, ((90.0,),), ((5.0,),), ((3.0,),), "counter", "x"), "result:"),
])
def test_wrong_kind_names_argument(call, name):
    with pytest.raises(CellTypeError) as err:
        call()
    assert err.value.message.startswith(name)


def test_boiling_error_names_stage():
    with pytest.raises(CellInputError, match=r"stage 2 .*133\.52 °C"):
        chain_temperatures(60.0, 10.0, [200.0, 5000.0])
    with pytest.raises(CellInputError, match=r"ua_kw_k: stage 1 .*boiling"):
        rate_chain_water(90.0, 2.0, [450.0], [10.0], [40.0])


# ---- properties --------------------------------------------------------------------

temps = st.floats(1.0, 130.0)
glycols = st.sampled_from(["ethylene", "propylene"])


@settings(max_examples=120, deadline=None)
@given(q=st.floats(10.0, 5000.0), a=temps, b=temps, x=st.sampled_from([0.0, 0.2, 0.45]), g=glycols)
def test_flow_duty_round_trip(q, a, b, x, g):
    if x > 0:
        a, b = min(a, 99.0), min(b, 99.0)
    if abs(a - b) < 0.05:
        return
    q = q if b > a else -q
    v = hw_flow(q, a, b, x, g)
    assert v > 0
    assert hw_duty(v, a, b, x, g) == pytest.approx(q, rel=1e-12)


@settings(max_examples=80, deadline=None)
@given(duties=st.lists(st.floats(-200.0, 800.0), min_size=1, max_size=6),
       flow=st.floats(80.0, 200.0), t_ret=st.floats(40.0, 70.0))  # stays below boiling at 3 bar
def test_chain_energy_adds_up(duties, flow, t_ret):
    temps_ = chain_temperatures(t_ret, flow, duties)
    total = hw_duty(flow, t_ret, temps_[-1])
    assert total == pytest.approx(math.fsum(duties), rel=1e-9, abs=1e-7)
    for k, q in enumerate(duties):
        before = t_ret if k == 0 else temps_[k - 1]
        assert (temps_[k] - before) * q >= -1e-9


@settings(max_examples=80, deadline=None)
@given(t_in=st.floats(40.0, 90.0), c_w=st.floats(5.0, 80.0),
       stages=st.lists(st.tuples(st.floats(20.0, 600.0), st.floats(0.5, 50.0),
                                 st.one_of(st.just(0.0), st.floats(0.01, 80.0))),
                       min_size=1, max_size=5),
       arr=st.sampled_from(chain.ARRANGEMENTS))
def test_rate_chain_energy_balance(t_in, c_w, stages, arr):
    th, ch, ua = (list(s) for s in zip(*stages))
    res = rate_chain(t_in, c_w, th, ch, ua, arr)
    t = t_in
    for (q, t_out, t_hot_out), h, c in zip(res, th, ch):
        assert q == pytest.approx(c_w * (t_out - t), rel=1e-9, abs=1e-9)
        assert q == pytest.approx(c * (h - t_hot_out), rel=1e-9, abs=1e-9)
        # never past the other stream's inlet; sign follows the temperature difference
        assert min(t, h) - 1e-9 <= t_out <= max(t, h) + 1e-9
        assert q * (h - t) >= 0
        t = t_out


@settings(max_examples=60, deadline=None)
@given(t=st.floats(0.0, 133.5), x=st.sampled_from([0.0, 0.3]), g=glycols)
def test_props_positive_and_inverse(t, x, g):
    if x > 0:
        t = min(max(t, -10.0), 100.0)
    cp = hw_cp(t, x, g)
    rho = hw_density(t, x, g)
    assert 3.0 < cp < 4.4 and 900.0 < rho < 1100.0
    h = water.enthalpy(t, x, g)
    assert water.temperature_from_enthalpy(h, 50.0, x, g) == pytest.approx(t, abs=1e-8)


# ---- catalogue entries of the family ------------------------------------------------

FAMILY_CATEGORIES = {"cellfuncs · heat recovery", "cellfuncs · engine", "cellfuncs · plant balance"}


def _family():
    from cellfuncs.catalogue import recovery

    return recovery.ENTRIES


def test_catalogue_entries_are_well_formed():
    import inspect

    names = {e.name for e in _family()}
    assert names == {"HW_CP", "HW_DENSITY", "HW_FLOW", "HW_DUTY", "HW_CHAIN", "HW_CHAIN_RATE",
                     "HW_CHAIN_CHECK", "EXH_FLOW", "EXH_COMPOSITION", "EXH_HEAT", "EXH_DEWPOINT",
                     "EXH_O2_CORRECT", "GEN_SPEED", "GEN_POLE_PAIRS", "ENGINE_BMEP", "ENGINE_POWER",
                     "CHP_HEAT_RATE", "CHP_PES", "CHP_BALANCE"}
    for e in _family():
        if e.name == "EXH_O2_CORRECT":  # an emission correction: listed with the emission functions
            assert e.category == "cellfuncs · emissions"
            continue
        assert e.category in FAMILY_CATEGORIES
        assert e.category == ("cellfuncs · heat recovery" if e.name[:3] in ("HW_", "EXH")
                              else "cellfuncs · engine" if e.name[:3] in ("GEN", "ENG")
                              else "cellfuncs · plant balance")
        assert len(e.description) <= 255
        assert "[" in e.returns
        params_ = list(inspect.signature(e.resolve()).parameters.values())
        assert len(params_) >= len(e.args)
        for a in e.args:
            if a.kind == "option":
                assert all(o == o.lower() for o in a.options)
                assert a.default is None or a.default in a.options or not a.optional
            if a.kind in ("range", "option", "text"):
                assert a.unit == ""


def test_catalogue_calls_like_the_adapters():
    """The catalogue entries called through the shared adapter (ranges as tuples of rows)."""

    def call(name, *args):
        return _cell(name)(*args)

    assert call("HW_CP", 70.0) == pytest.approx(hw_cp(70.0))
    t = call("HW_CHAIN", 60.0, 50.0, ((200.0, 300.0),))
    assert len(t[0]) == 2
    assert call("HW_CHAIN", 60.0, 50.0, ((200.0,), (300.0,)), 0.0, "ethylene", 1) == t[0][0]
    r = call("HW_CHAIN_RATE", 70.0, 40.0, ((92.0, 450.0),), ((20.95, 3.351),), ((60.0, 8.0),))
    assert 70 < r[0][0] < r[0][1]
    assert call("HW_CHAIN_CHECK", 60.0, 50.0, ((200.0,),), ((95.0,),)) == "OK"
    comps, fr = (("methane",),), ((100.0,),)
    assert call("EXH_FLOW", 1000.0, 1.8, comps, fr) > 2000
    from cellfuncs.recovery.exhaust import exhaust_composition
    assert call("EXH_COMPOSITION", 1.8, comps, fr, "co2") == exhaust_composition(
        1.8, {"CH4": 100.0}, "co2", "wet", 25.0, 0.3, 1.0)
    from cellfuncs.recovery.exhaust import exhaust_heat
    assert call("EXH_HEAT", 3600.0, 450.0, 120.0, 1.8, comps, fr) == exhaust_heat(
        3600.0, 450.0, 120.0, 1.8, {"CH4": 100.0}, 25.0, 0.3, 1.0)
    assert call("EXH_DEWPOINT", 1.8, comps, fr) > 47.9  # humid air adds water
    assert call("GEN_SPEED", 50.0, 2) == 1500.0
    assert call("ENGINE_BMEP", 1000.0, 50.0, 1500.0) == pytest.approx(16.0, rel=1e-12)
    assert call("CHP_BALANCE", 2000.0, 800.0, ((500.0,), (None,), (400.0,))) == pytest.approx(0.85)
