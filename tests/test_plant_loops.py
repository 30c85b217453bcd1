"""Plant family: engine loops at fixed duty, chains with loops, dry coolers, exhaust loss, balance check,
primary energy savings by fuel.

Sources beside the checks: tests/vectors/plant.csv (ht 1.2.0, CoolProp 8, psychrolib 2.5, printed by
tools/make_plant_vectors.py; Directive 2012/27/EU Annex II by hand), the heat-exchanger family's HX_UA
and HX_RATE (catalogue targets), ht.effectiveness_from_NTU, and arithmetic of the first law.
"""

from __future__ import annotations

import math

import pytest
from hypothesis import assume, given, settings
from hypothesis import strategies as st

from vectors import approx, params

from cellfuncs.errors import CellInputError, CellTypeError
from cellfuncs.recovery import water
from cellfuncs import adapt, catalogue
from cellfuncs.recovery.chain import rate_chain_water
from cellfuncs.recovery.drycooler import drycooler_air_flow, drycooler_ua
from cellfuncs.recovery.engine_loop import engine_loop
from cellfuncs.gas.composition import parse_composition
from cellfuncs.recovery.exhaust import exhaust_heat
from cellfuncs.recovery.plant import chp_balance_check, chp_pes, grid_loss_factor, pes_reference

METHANE = ((("methane",),), ((100.0,),))
NG = ((("methane",), ("ethane",), ("propane",), ("nitrogen",), ("carbon dioxide",)),
      ((92.0,), (4.5,), (1.0,), (1.5,), (1.0,)))


def _cell(name):
    """The catalogue function NAME as a cell calls it (the shared adapter: ranges, layout, errors)."""
    entry = catalogue.by_name(name)
    return lambda *values: adapt.call(entry, values)


HW_ENGINE_LOOP, HW_CHAIN_RATE, HW_CHAIN_CHECK = (_cell("HW_ENGINE_LOOP"), _cell("HW_CHAIN_RATE"),
                                                 _cell("HW_CHAIN_CHECK"))
EXH_LOSS, CHP_BALANCE_CHECK = _cell("EXH_LOSS"), _cell("CHP_BALANCE_CHECK")


# ---- vectors from reference libraries ---------------------------------------------

@pytest.mark.parametrize("row", params("plant", "HW_ENGINE_LOOP"))
def test_engine_loop_vectors(row):
    got = HW_ENGINE_LOOP(row["duty_kw"], row["t_engine_in_max"], row["engine_flow_m3_h"], row["t_water_in"],
                              row["water_flow_m3_h"], row["ua_kw_k"], row["arrangement"], row["result"],
                              row["glycol_fraction"] or 0.0, "ethylene")
    assert got == approx(row)


@pytest.mark.parametrize("row", params("plant", "EXH_LOSS"))
def test_exh_loss_vectors(row):
    got = EXH_LOSS(row["exhaust_flow_kg_h"], row["t_stack"], row["air_ratio"], *METHANE, row["t_reference"],
                        25.0, row["rh_ambient"], row["p_ambient_bar"])
    assert got == approx(row)


@pytest.mark.parametrize("row", params("plant", "DRYCOOLER_AIR_FLOW"))
def test_drycooler_air_flow_vectors(row):
    got = drycooler_air_flow(row["duty_kw"], row["t_air_in"], row["t_air_out"], row["rh_ambient"],
                             row["p_ambient_bar"])
    assert got == approx(row)


@pytest.mark.parametrize("row", params("plant", "DRYCOOLER_UA"))
def test_drycooler_ua_vectors(row):
    got = drycooler_ua(row["duty_kw"], row["t_water_in"], row["t_water_out"], row["t_air_in"], row["t_air_out"],
                       row["arrangement"])
    assert got == approx(row)


# ---- engine loop against the heat-exchanger family and hand balances ----------------

@pytest.mark.parametrize("arr", ["counter", "parallel", "cross", "1-2"])
def test_engine_loop_stage_against_hx_rate(arr):
    """The exchanger duty equals HX_RATE (heat-exchanger family) on the converged mean-cp capacity rates,
    and both sides close their enthalpy balances (CoolProp PropsSI IF97::Water, IAPWS-IF97, 3 bar(a))."""
    import CoolProp.CoolProp as CP

    from cellfuncs.heat_transfer.rating import rate_exchanger

    r = engine_loop(800.0, 82.0, 60.0, 70.0, 40.0, 40.0, arr)
    rho = lambda t: CP.PropsSI("D", "T", t + 273.15, "P", 3e5, "IF97::Water")  # noqa: E731
    h = lambda t: CP.PropsSI("H", "T", t + 273.15, "P", 3e5, "IF97::Water") / 1e3  # noqa: E731
    m_e, m_w = 60.0 * rho(82.0) / 3600, 40.0 * rho(70.0) / 3600
    assert m_e * (h(r["t_engine_out"]) - h(82.0)) == pytest.approx(800.0, rel=1e-5)
    assert m_w * (h(r["t_water_out"]) - h(70.0)) == pytest.approx(r["to_client"], rel=1e-5)
    assert m_e * (h(r["t_engine_out"]) - h(r["t_hot_out"])) == pytest.approx(r["to_client"], rel=1e-5)
    c_h = r["to_client"] / (r["t_engine_out"] - r["t_hot_out"])
    c_c = r["to_client"] / (r["t_water_out"] - 70.0)
    q = rate_exchanger(r["t_engine_out"], 70.0, c_h, c_c, 40.0, arr, "duty")
    assert q == pytest.approx(r["to_client"], rel=1e-9)
    assert r["dump"] > 0


def test_engine_loop_bypass_gives_exactly_the_duty():
    """A client that could take more than the duty gets the duty (thermostat bypass; issue 11)."""
    r = engine_loop(500.0, 82.0, 50.0, 40.0, 80.0, 300.0)
    assert r["to_client"] == 500.0 and r["dump"] == 0.0
    assert r["t_hot_out"] == 82.0


def test_engine_loop_near_outlet_sends_nearly_all_to_dump():
    """A client return just below the engine outlet: almost all the duty goes to the dump cooler."""
    t_out = engine_loop(800.0, 82.0, 60.0, 40.0, 40.0, 40.0)["t_engine_out"]
    r = engine_loop(800.0, 82.0, 60.0, t_out - 0.01, 40.0, 40.0)
    assert r["dump"] > 0.999 * 800.0
    with pytest.raises(CellInputError) as e:
        engine_loop(800.0, 82.0, 60.0, t_out, 40.0, 40.0)
    assert e.value.message.startswith("t_water_in:")
    with pytest.raises(CellInputError):
        engine_loop(800.0, 82.0, 60.0, t_out + 5.0, 40.0, 40.0)


def test_engine_loop_all_row_and_results():
    row = HW_ENGINE_LOOP(800.0, 82.0, 60.0, 70.0, 40.0, 40.0, "counter", "all")
    assert len(row) == 1 and len(row[0]) == 4
    for k, word in enumerate(("to_client", "dump", "t_water_out", "t_engine_out")):
        assert HW_ENGINE_LOOP(800.0, 82.0, 60.0, 70.0, 40.0, 40.0, "counter", word) == row[0][k]


@settings(max_examples=150, deadline=None)
@given(duty=st.floats(0.0, 3000.0), t_max=st.floats(60.0, 95.0), f_e=st.floats(10.0, 200.0),
       dt=st.floats(0.5, 50.0), f_w=st.floats(5.0, 200.0), ua=st.floats(0.0, 500.0),
       arr=st.sampled_from(["counter", "parallel", "cross", "2-4"]), x=st.sampled_from([0.0, 0.3]))
def test_engine_loop_conserves_duty(duty, t_max, f_e, dt, f_w, ua, arr, x):
    """to_client + dump = duty to 1e-12 relative; neither is negative (first law; issue 11)."""
    try:
        t_eo = engine_loop(duty, t_max, f_e, 10.0, f_w, 0.0, arr, x)["t_engine_out"]
    except CellInputError:
        assume(False)
    t_wi = t_eo - dt
    assume(t_wi > 1.0)
    r = engine_loop(duty, t_max, f_e, t_wi, f_w, ua, arr, x)
    assert r["to_client"] + r["dump"] == pytest.approx(duty, rel=1e-12, abs=1e-12)
    assert 0.0 <= r["to_client"] <= duty and r["dump"] >= 0.0
    assert t_wi <= r["t_water_out"] <= r["t_engine_out"] + 1e-9


# ---- chain with loops -------------------------------------------------------------

def _mixed(order):
    """Jacket-water loop and exhaust stream in either order (the demo's sizes, rounded)."""
    data = {"loop": (None, None, 40.0, "loop", 800.0), "exh": (445.0, 2.6, 9.0, "stream", None)}
    cols = [data[k] for k in order]
    return ((tuple(c[0] for c in cols),), (tuple(c[1] for c in cols),), (tuple(c[2] for c in cols),),
            (tuple(c[3] for c in cols),), (tuple(c[4] for c in cols),))


@pytest.mark.parametrize("order", [("loop", "exh"), ("exh", "loop")])
def test_chain_with_loop_never_gives_more_than_the_duty(order):
    th, ch, ua, kinds, duties = _mixed(order)
    args = (60.0, 40.0, th, ch, ua, "counter")
    extra = ("ethylene", kinds, duties, ((82.0,),), ((60.0,),))
    duty = HW_CHAIN_RATE(*args, "duty", 0.0, *extra)[0]
    dump = HW_CHAIN_RATE(*args, "dump", 0.0, *extra)[0]
    k = order.index("loop")
    assert duty[k] <= 800.0 and duty[k] + dump[k] == pytest.approx(800.0, rel=1e-12)
    assert dump[1 - k] == 0.0
    total = HW_CHAIN_RATE(*args, "total_dump", 0.0, *extra)
    assert total == pytest.approx(dump[k], rel=1e-15)
    for s in (1, 2):
        assert HW_CHAIN_RATE(*args, "duty", 0.0, *extra, s) == duty[s - 1]


def test_chain_loop_stage_equals_engine_loop():
    """A loop as stage 1 of a chain is HW_ENGINE_LOOP with the chain's return and flow."""
    th, ch, ua, kinds, duties = _mixed(("loop", "exh"))
    d = HW_CHAIN_RATE(60.0, 40.0, th, ch, ua, "counter", "duty", 0.0, "ethylene", kinds, duties,
                        ((82.0,),), ((60.0,),))[0][0]
    assert d == engine_loop(800.0, 82.0, 60.0, 60.0, 40.0, 40.0)["to_client"]


def test_chain_loop_after_hot_water_dumps_all():
    """Water reaching a loop hotter than its engine outlet gets nothing; the duty goes to the dump."""
    th, ch, ua, kinds, duties = ((445.0, None),), ((5.0, None),), ((10.0, 40.0),), (("stream", "loop"),), \
        ((None, 800.0),)
    dump = HW_CHAIN_RATE(60.0, 40.0, th, ch, ua, "counter", "dump", 0.0, "ethylene", kinds, duties,
                           ((82.0,),), ((60.0,),))[0]
    assert dump[1] == 800.0


@settings(max_examples=60, deadline=None)
@given(q1=st.floats(50.0, 1500.0), q2=st.floats(50.0, 800.0), ua1=st.floats(0.0, 120.0),
       ua2=st.floats(0.0, 30.0), ua3=st.floats(0.0, 80.0), flow=st.floats(15.0, 120.0),
       t_ret=st.floats(35.0, 75.0), perm=st.permutations([0, 1, 2]))
def test_chain_duties_plus_dump_equal_source_heat(q1, q2, ua1, ua2, ua3, flow, t_ret, perm):
    """Σ duties to the water + Σ dump = Σ loop duties + Σ stream duties (first law, any order)."""
    stages = [("loop", None, None, ua1, q1, 88.0, 50.0), ("stream", 450.0, 2.8, ua2, None, None, None),
              ("loop", None, None, ua3, q2, 65.0, 20.0)]
    st_ = [stages[i] for i in perm]
    try:
        res = rate_chain_water(t_ret, flow, [s[1] for s in st_], [s[2] for s in st_], [s[3] for s in st_],
                               "counter", 0.0, "ethylene", [s[0] for s in st_], [s[4] for s in st_],
                               [s[5] for s in st_], [s[6] for s in st_])
    except CellInputError:
        assume(False)
    streams = math.fsum(r["duty"] for r in res if r["kind"] == "stream")
    total = math.fsum(r["duty"] + r["dump"] for r in res)
    assert total == pytest.approx(q1 + q2 + streams, rel=1e-12)
    for r in res:
        if r["kind"] == "loop":
            assert 0.0 <= r["duty"] and r["dump"] >= 0.0


def test_chain_check_both_ends():
    """Hot end: water out vs source in − approach; cold end: source out vs water in + approach."""
    ok = HW_CHAIN_CHECK(60.0, 50.0, ((400.0, 300.0),), ((95.0, 450.0),), 5.0, 0.0, "ethylene", ((82.0, 120.0),))
    assert ok == "OK"
    # the engine inlet limit 62 °C is below the 60 °C return + 5 K: cold end fails at stage 1
    text = HW_CHAIN_CHECK(60.0, 50.0, ((400.0, 300.0),), ((95.0, 450.0),), 5.0, 0.0, "ethylene",
                            ((62.0, 120.0),))
    assert text.startswith("stage 1 cold end:") and "65" in text
    # stage 2's exhaust leaves at 70 °C but meets water at about 66.9 °C + 5 K
    text = HW_CHAIN_CHECK(60.0, 50.0, ((400.0, 300.0),), ((95.0, 450.0),), 5.0, 0.0, "ethylene",
                            ((82.0, 70.0),))
    assert text.startswith("stage 2 cold end:")
    assert len(text) <= 255


@pytest.mark.parametrize("call,name", [
    (lambda: engine_loop(-1.0, 82.0, 60.0, 60.0, 40.0, 40.0), "duty_kw:"),
    (lambda: engine_loop(800.0, 82.0, 0.0, 60.0, 40.0, 40.0), "engine_flow_m3_h:"),
    (lambda: engine_loop(800.0, 82.0, 60.0, 60.0, 0.0, 40.0), "water_flow_m3_h:"),
    (lambda: engine_loop(800.0, 82.0, 60.0, 60.0, 40.0, -1.0), "ua_kw_k:"),
    (lambda: engine_loop(800.0, 140.0, 60.0, 60.0, 40.0, 40.0), "t_engine_in_max:"),
    (lambda: engine_loop(5000.0, 120.0, 5.0, 60.0, 40.0, 40.0), "duty_kw:"),
    (lambda: HW_CHAIN_RATE(60.0, 40.0, ((None,),), ((None,),), ((40.0,),), "counter", "duty", 0.0, "ethylene",
                             (("loop",),), ((None,),), ((82.0,),), ((60.0,),)), "duties_kw:"),
    (lambda: HW_CHAIN_RATE(60.0, 40.0, ((None,),), ((None,),), ((40.0,),), "counter", "duty", 0.0, "ethylene",
                             (("loop",),), ((800.0,),), None, ((60.0,),)), "t_engine_in_max:"),
    (lambda: HW_CHAIN_RATE(60.0, 40.0, ((None, 1.0),), ((None, 1.0),), ((40.0, 1.0),), "counter", "duty", 0.0,
                             "ethylene", (("loop", "stream"),), ((800.0,),), ((82.0,),), ((60.0,),)), "duties_kw:"),
    (lambda: HW_CHAIN_RATE(60.0, 40.0, ((450.0,),), ((5.0,),), ((10.0,),), "counter", "total_duty", 0.0,
                             "ethylene", None, None, None, None, 1), "stage:"),
    (lambda: drycooler_ua(0.0, 45.0, 40.0, 30.0, 38.0), "duty_kw:"),
    (lambda: drycooler_ua(100.0, 40.0, 45.0, 30.0, 38.0), "t_water_out:"),
    (lambda: drycooler_ua(100.0, 45.0, 40.0, 30.0, 30.0), "t_air_out:"),
    (lambda: drycooler_ua(100.0, 45.0, 40.0, 30.0, 47.0), "t_"),
    (lambda: drycooler_air_flow(100.0, 30.0, 25.0), "t_air_out:"),
    (lambda: drycooler_air_flow(100.0, 30.0, 40.0, 1.5), "rh_ambient:"),
    (lambda: EXH_LOSS(-1.0, 120.0, 1.8, *METHANE), "exhaust_flow_kg_h:"),
    (lambda: EXH_LOSS(1000.0, 20.0, 1.8, *METHANE), "t_stack:"),
    (lambda: EXH_LOSS(1000.0, 120.0, 0.8, *METHANE), "air_ratio:"),
    (lambda: chp_balance_check(0.0, 100.0, (1.0,), 10.0), "fuel_power_kw:"),
    (lambda: chp_balance_check(1000.0, 100.0, (-1.0,), 10.0), "heat_flows_kw:"),
    (lambda: chp_balance_check(1000.0, 100.0, (1.0,), -10.0), "exhaust_loss_kw:"),
    (lambda: chp_pes(0.4, 0.45, 0.525, None), "ref_thermal_efficiency:"),
    (lambda: chp_pes(0.4, 0.45, 0.525, 0.9, "natural-gas", 2020), "fuel:"),
    (lambda: chp_pes(0.4, 0.45, None, None, "natural-gas", None), "construction_year:"),
    (lambda: chp_pes(0.4, 0.45, None, None, "natural-gas", 2025), "construction_year:"),
    (lambda: chp_pes(0.4, 0.45, 0.525, 0.9, None, None, "hot-water", -1.0), "voltage_kv:"),
    (lambda: chp_pes(0.4, 0.45, 0.525, 0.9, None, None, "hot-water", 10.0, 1.2), "onsite_share:"),
])
def test_bad_input_names_argument(call, name):
    with pytest.raises(CellInputError) as e:
        call()
    assert e.value.message.startswith(name)
    assert "\n" not in e.value.message


@pytest.mark.parametrize("call,name", [
    (lambda: HW_ENGINE_LOOP(800.0, 82.0, 60.0, 60.0, 40.0, 40.0, "counter", "heat"), "result:"),
    (lambda: HW_ENGINE_LOOP(800.0, 82.0, 60.0, 60.0, 40.0, 40.0, "zigzag"), "arrangement:"),
    (lambda: HW_CHAIN_RATE(60.0, 40.0, ((450.0,),), ((5.0,),), ((10.0,),), "counter", "duty", 0.0,
                             "ethylene", (("pump",),)), "stage_kinds:"),
    (lambda: chp_pes(0.4, 0.45, None, None, "coal", 2020), "fuel:"),
    (lambda: chp_pes(0.4, 0.45, None, None, "natural-gas", 2020, "ice"), "heat_use:"),
])
def test_wrong_word_names_argument(call, name):
    with pytest.raises(CellTypeError) as e:
        call()
    assert e.value.message.startswith(name)


# ---- dry coolers ------------------------------------------------------------------

@pytest.mark.parametrize("arr", ["cross", "counter", "1-2", "cross-cmin-mixed"])
def test_drycooler_ua_is_hx_ua(arr):
    """DRYCOOLER_UA is HX_UA of the heat-exchanger family with the water as the hot stream."""
    from cellfuncs.heat_transfer.rating import ua_required

    assert drycooler_ua(103.0, 45.0, 40.0, 30.0, 38.0, arr, 0.35) == ua_required(103.0, 45.0, 40.0, 30.0, 38.0, arr)


def test_drycooler_air_flow_hand_balance():
    """Hand balance on humid air with CoolProp HAPropsSI: ṁ_da·Δh per kg dry air = duty at the
    volume flow our function gives (humid-air volume per kg dry air at the inlet), within 0.4 %."""
    from CoolProp.HumidAirProp import HAPropsSI

    v = drycooler_air_flow(103.0, 30.0, 38.0, 0.55, 0.99)
    p = 0.99e5
    w = HAPropsSI("W", "T", 303.15, "P", p, "R", 0.55)
    m_da = v / 3600 / HAPropsSI("V", "T", 303.15, "P", p, "W", w)
    q = m_da * (HAPropsSI("H", "T", 311.15, "P", p, "W", w) - HAPropsSI("H", "T", 303.15, "P", p, "W", w)) / 1e3
    assert q == pytest.approx(103.0, rel=4e-3)


# ---- exhaust loss -----------------------------------------------------------------

@settings(max_examples=60, deadline=None)
@given(t1=st.floats(130.0, 600.0), t2=st.floats(100.0, 130.0), m=st.floats(100.0, 20000.0),
       lam=st.floats(1.2, 2.5), rh=st.floats(0.0, 1.0), t_amb=st.floats(0.0, 35.0))
def test_exh_loss_difference_is_exh_heat(t1, t2, m, lam, rh, t_amb):
    """EXH_LOSS(t1) − EXH_LOSS(t2) = EXH_HEAT(t1 → t2) (issue 11), for a natural gas and humid air."""
    a = EXH_LOSS(m, t1, lam, *NG, 25.0, t_amb, rh, 1.0)
    b = EXH_LOSS(m, t2, lam, *NG, 25.0, t_amb, rh, 1.0)
    try:
        q = exhaust_heat(m, t1, t2, lam, parse_composition(*NG), t_amb, rh, 1.0)
    except CellInputError:  # t2 below the dew point: EXH_HEAT refuses
        assume(False)
    assert a - b == pytest.approx(q, rel=1e-9, abs=1e-9)


def test_exh_loss_zero_at_reference():
    assert EXH_LOSS(5000.0, 25.0, 1.8, *NG) == 0.0


# ---- balance check ----------------------------------------------------------------

def test_balance_check_three_outcomes():
    """Arithmetic of the first law: unaccounted = fuel − el − Σheat − exhaust − other."""
    ok = CHP_BALANCE_CHECK(1000.0, 420.0, ((300.0, 100.0),), 120.0, 30.0)  # 30 kW = 3.0 %
    assert ok.startswith("OK: ") and "3.0 %" in ok
    check = CHP_BALANCE_CHECK(1000.0, 420.0, ((300.0,),), 120.0, 30.0)  # 130 kW = 13.0 %
    assert check.startswith("CHECK: ") and "13.0 %" in check
    bad = CHP_BALANCE_CHECK(1000.0, 420.0, ((400.0, 100.0),), 120.0, 10.0)  # outputs exceed by 50 kW
    assert bad == "FIRST-LAW VIOLATION: outputs exceed the fuel by 50 kW (5.0 %)"
    edge = CHP_BALANCE_CHECK(1000.0, 420.0, ((300.0, 100.0),), 180.0, 4.0)  # −4 kW = −0.4 %: within
    assert edge.startswith("OK: ")
    for t in (ok, check, bad, edge):
        assert len(t) <= 255


# ---- primary energy savings ------------------------------------------------------

def test_pes_reference_lookup():
    """Delegated Regulation (EU) 2015/2402 Annexes I, II (figures from memory, cellfuncs/data/pes_reference.csv)."""
    assert pes_reference("natural-gas", 2011) == (0.525, 0.92)
    assert pes_reference("natural-gas", 2016) == (0.530, 0.92)
    assert pes_reference("natural-gas", 2016, "steam")[1] == 0.87
    assert grid_loss_factor(0.4, 1.0) == 0.851 and grid_loss_factor(400.0, 0.0) == 1.0
    assert grid_loss_factor(10.0, 0.5) == pytest.approx(0.5 * 0.891 + 0.5 * 0.918, rel=1e-15)


def test_pes_plain_form_unchanged():
    """Today's four positional arguments keep their meaning (Directive 2012/27/EU Annex II (b))."""
    assert chp_pes(0.42, 0.50, 0.525, 0.90) == pytest.approx(1 - 1 / (0.50 / 0.90 + 0.42 / 0.525), rel=1e-15)


def test_water_properties_used_are_public():
    """The loop uses the hot-water family's public functions only (another helper replaces their backend)."""
    assert callable(water.enthalpy) and callable(water.temperature_from_enthalpy) and callable(water.mass_flow)
