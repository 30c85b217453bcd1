"""EXH_STEAM: saturated steam from engine exhaust (cellfuncs.recovery.steam).

Outside sources: one case checked by hand (below, after Ganapathy 2003, Industrial Boilers and
Heat Recovery Steam Generators, with IAPWS-95 water from CoolProp 8 PropsSI and the saturation
temperature of IAPWS R7-97(2012) Table 36); saturated water and steam against CoolProp's IF97 and
IAPWS-95 water; the vectors are in tests/vectors/steam.csv.  Energy balances and bad input as
properties.
"""

from __future__ import annotations

import subprocess
import sys

import pytest
from hypothesis import assume, given
from hypothesis import strategies as st

from vectors import approx, params

from cellfuncs.errors import CellInputError, CellTypeError
from cellfuncs.gas.composition import parse_composition
from cellfuncs.props import if97
from cellfuncs import adapt, catalogue
from cellfuncs.recovery.steam import exhaust_steam, steam_balance

NAMES = [["methane"], ["ethane"], ["propane"], ["nitrogen"], ["carbon dioxide"]]
AMOUNTS = [[92.0], [4.5], [1.0], [1.5], [1.0]]
GAS = parse_composition(NAMES, AMOUNTS)
METHANE = parse_composition([["methane"]], [[100.0]])


# ---- vectors ----------------------------------------------------------------------------

@pytest.mark.parametrize("row", params("steam", "EXH_STEAM"))
def test_exh_steam_vectors(row):
    got = exhaust_steam(row["exhaust_flow_kg_h"], row["t_exhaust_in"], row["air_ratio"], GAS,
                        row["p_steam_bar"], row["t_feedwater"], row["pinch_k"], row["result"],
                        row["approach_k"])
    assert got == approx(row)


@pytest.mark.parametrize("row", params("steam", "SAT_H_LIQUID") + params("steam", "SAT_H_VAPOUR")
                         + params("steam", "T_SAT"))
def test_saturation_vectors(row):
    p = row["p_steam_bar"] / 10.0
    ts = if97.t_sat(p)
    got = {"SAT_H_LIQUID": lambda: if97.region1(p, ts).h,
           "SAT_H_VAPOUR": lambda: if97.region2(p, ts).h,
           "T_SAT": lambda: ts - 273.15}[row["function"]]()
    assert got == approx(row)


def test_hand_calculation():
    """The hand calculation behind the EXH_STEAM rows of tests/vectors/steam.csv.

    Exhaust 10,000 kg/h at 450 °C, air ratio 1.8, the pipeline gas above; drum 10 bar(a),
    feedwater 105 °C, pinch 10 K, approach 0 K.

    1. T_s at 1 MPa = 453.035632 K = 179.885632 °C (IAPWS R7-97(2012) Table 36).
    2. Gas leaves the evaporator at 179.885632 + 10 = 189.885632 °C;
       Q_ev = EXH_HEAT(10000, 450, 189.885632, 1.8, gas) = 815.887 kW (the exhaust core).
    3. Saturated liquid and steam at 10 bar(a), IAPWS-95 (CoolProp PropsSI 'H', 'P', 1e6, 'Q', 0/1,
       'Water'): h' = 762.515, h'' = 2777.109 kJ/kg; latent heat 2014.594 kJ/kg.
       Steam = 815.887 / 2014.594 kg/s = 0.404988 kg/s = 1457.96 kg/h.
    4. Feedwater at 105 °C and 10 bar(a), IAPWS-95 (PropsSI 'H', 'P', 1e6, 'T', 378.15, 'Water'):
       440.924 kJ/kg; economiser rise to h' = 321.591 kJ/kg.
    5. Q_ec = 0.404988 · 321.591 = 130.241 kW; duty = 815.887 + 130.241 = 946.128 kW.
    6. Stack: the t at which EXH_HEAT(10000, 189.885632, t, 1.8, gas) = 130.241 kW, found by
       bisection: 146.913 °C.
    The function gives 1458.07 kg/h, 946.231 kW, 146.879 °C: within 1e-4 and 0.04 K, the
    IF97-IAPWS-95 difference in h' (0.17 kJ/kg at 10 bar).
    """
    from cellfuncs.gas.composition import parse_composition
    from cellfuncs.recovery.exhaust import exhaust_heat

    ts = 453.035632 - 273.15
    q_ev = exhaust_heat(10000.0, 450.0, ts + 10.0, 1.8, parse_composition(NAMES, AMOUNTS))
    assert q_ev == pytest.approx(815.887, abs=1e-3)
    b = steam_balance(10000.0, 450.0, 1.8, GAS, 10.0, 105.0, 10.0, 0.0)
    assert b["evaporator_kw"] == pytest.approx(q_ev, rel=1e-8)       # same gas enthalpy, T_s to 1e-9
    assert b["steam_kg_h"] == pytest.approx(1457.96, rel=5e-4)
    assert b["duty_kw"] == pytest.approx(946.128, rel=5e-4)
    assert b["t_stack"] == pytest.approx(146.913, abs=0.1)


# ---- energy balances --------------------------------------------------------------------

def _water_side_kw(b):
    return b["steam_kg_h"] / 3600.0 * (b["h_steam"] - b["h_feedwater"])


def test_energy_balance_closes():
    """Gas side m_g·(h(t_in) − h(t_stack)) = duty = water side m_s·(h'' − h_fw), to 1e-9."""
    for args in [(10000.0, 450.0, 1.8, GAS, 10.0, 105.0, 10.0, 0.0),
                 (25000.0, 520.0, 1.6, METHANE, 25.0, 60.0, 15.0, 8.0),
                 (4000.0, 380.0, 2.2, GAS, 3.0, 80.0, 5.0, 3.0)]:
        b = steam_balance(*args)
        assert b["gas_heat_kw"] == pytest.approx(b["duty_kw"], rel=1e-9)
        assert _water_side_kw(b) == pytest.approx(b["duty_kw"], rel=1e-9)
        assert b["evaporator_kw"] + b["economiser_kw"] == pytest.approx(b["duty_kw"], rel=1e-12)


@given(m=st.floats(500.0, 50000.0), t_in=st.floats(250.0, 650.0), lam=st.floats(1.0, 3.0),
       p=st.floats(1.0, 60.0), fw=st.floats(0.0, 1.0), pinch=st.floats(1.0, 40.0),
       approach=st.floats(0.0, 20.0))
def test_energy_balance_property(m, t_in, lam, p, fw, pinch, approach):
    """duty = gas-side heat = water-side heat for any accepted input (rel 1e-9)."""
    ts = if97.t_sat(p / 10.0) - 273.15
    t_fw = 5.0 + fw * max(ts - approach - 5.0, 0.0)
    try:
        b = steam_balance(m, t_in, lam, GAS, p, t_fw, pinch, approach)
    except CellInputError:
        assume(False)
    assert b["steam_kg_h"] > 0
    assert b["gas_heat_kw"] == pytest.approx(b["duty_kw"], rel=1e-9)
    assert _water_side_kw(b) == pytest.approx(b["duty_kw"], rel=1e-9)
    assert b["t_dew"] <= b["t_stack"] <= ts + pinch + 1e-8
    assert b["t_stack"] > t_fw or b["economiser_kw"] == 0


def test_pinch_and_approach_trends():
    """A larger pinch raises less steam; a larger approach leaves a hotter stack (common practice)."""
    s = [exhaust_steam(10000.0, 450.0, 1.8, GAS, 10.0, 105.0, k) for k in (5.0, 10.0, 20.0)]
    assert s[0] > s[1] > s[2]
    t = [exhaust_steam(10000.0, 450.0, 1.8, GAS, 10.0, 105.0, 10.0, "t_stack", a) for a in (0.0, 10.0, 30.0)]
    assert t[0] < t[1] < t[2]


def test_results_and_cell_boundary():
    row = exhaust_steam(10000.0, 450.0, 1.8, GAS, 10.0, 105.0, 10.0, "all", 0.0)
    assert len(row) == 3
    for i, r in enumerate(("steam", "duty", "t_stack")):
        assert exhaust_steam(10000.0, 450.0, 1.8, GAS, 10.0, 105.0, 10.0, r) == row[i]
    # in a cell: the gas as names + amounts, or one two-column range; "all" a 1×3 row
    entry = catalogue.by_name("EXH_STEAM")
    two_col = [[n[0], a[0]] for n, a in zip(NAMES, AMOUNTS)]
    assert adapt.call(entry, (10000.0, 450.0, 1.8, NAMES, AMOUNTS, 10.0, 105.0, 10.0, "all")) == [row]
    assert adapt.call(entry, (10000.0, 450.0, 1.8, two_col, None, 10.0, 105.0, 10.0, "all")) == [row]
    # feedwater at the economiser outlet: no economiser duty, stack = saturation + pinch
    ts = if97.t_sat(1.0) - 273.15
    b = steam_balance(10000.0, 450.0, 1.8, GAS, 10.0, ts - 5.0, 10.0, 5.0)
    assert b["economiser_kw"] == pytest.approx(0.0, abs=1e-9)
    assert b["t_stack"] == pytest.approx(ts + 10.0, abs=1e-8)


# ---- bad input ------------------------------------------------------------------------------

@pytest.mark.parametrize("pinch", [0.0, -5.0])
def test_pinch_must_be_positive(pinch):
    with pytest.raises(CellInputError, match="^pinch_k: "):
        exhaust_steam(10000.0, 450.0, 1.8, GAS, 10.0, 105.0, pinch)


def test_feedwater_above_saturation():
    with pytest.raises(CellInputError, match="^t_feedwater: 190 °C is above the saturation temperature 179.89"):
        exhaust_steam(10000.0, 450.0, 1.8, GAS, 10.0, 190.0)
    with pytest.raises(CellInputError, match="^t_feedwater: 175 °C is above the economiser outlet 169.89"):
        exhaust_steam(10000.0, 450.0, 1.8, GAS, 10.0, 175.0, 10.0, "steam", 10.0)


@pytest.mark.parametrize("p", [0.5, 0.0, -1.0, 161.0, 200.0])
def test_steam_pressure_out_of_range(p):
    with pytest.raises(CellInputError, match="^p_steam_bar: "):
        exhaust_steam(10000.0, 450.0, 1.8, GAS, p, 80.0)


def test_stack_below_dew_point_names_both_temperatures():
    """1 bar(a) drum, feedwater 5 °C, pinch 5 K: the stack would be 41.38 °C, below the exhaust's
    water dew point 49.34 °C (at 1.01325 bar(a))."""
    with pytest.raises(CellInputError, match=r"stack temperature 41\.38 °C is below the exhaust's water "
                                             r"dew point 49\.34 °C"):
        exhaust_steam(10000.0, 450.0, 1.8, METHANE, 1.0, 5.0, 5.0)


def test_other_refusals():
    with pytest.raises(CellInputError, match="^t_exhaust_in: 150 °C is not above"):
        exhaust_steam(10000.0, 150.0, 1.8, GAS, 10.0, 80.0)
    with pytest.raises(CellInputError, match="^exhaust_flow_kg_h: "):
        exhaust_steam(0.0, 450.0, 1.8, GAS, 10.0, 80.0)
    with pytest.raises(CellInputError, match="^air_ratio: "):
        exhaust_steam(10000.0, 450.0, 0.9, GAS, 10.0, 80.0)
    with pytest.raises(CellInputError, match="^approach_k: "):
        exhaust_steam(10000.0, 450.0, 1.8, GAS, 10.0, 80.0, 10.0, "steam", -1.0)
    with pytest.raises(CellInputError, match="^t_feedwater: .*temperature cross"):
        exhaust_steam(10000.0, 700.0, 1.0, METHANE, 1.0, 20.0, 1.0)
    # 98 bar(a), pinch 0.5 K, approach 0.1 K: both economiser ends are clear, but water cp rises
    # towards saturation at this pressure and the profiles cross inside (about 273 °C)
    with pytest.raises(CellInputError, match="^t_feedwater: the gas .* inside the economiser"):
        exhaust_steam(1000.0, 550.0, 1.1, METHANE, 98.0, 95.0, 0.5, "steam", 0.1)
    with pytest.raises(CellTypeError, match="^result: "):
        exhaust_steam(10000.0, 450.0, 1.8, GAS, 10.0, 80.0, 10.0, "power")
    with pytest.raises(CellTypeError):
        exhaust_steam(10000.0, "hot", 1.8, GAS, 10.0, 80.0)


def test_does_not_import_coolprop():
    code = ("import sys\nfrom cellfuncs import adapt, catalogue\n"
            "adapt.call(catalogue.by_name('EXH_STEAM'), (10000.0, 450.0, 1.8, [['methane']], [[100.0]], "
            "10.0, 105.0))\n"
            "assert 'CoolProp' not in sys.modules\nprint('ok')\n")
    r = subprocess.run([sys.executable, "-c", code], capture_output=True, text=True, timeout=120)
    assert r.returncode == 0, r.stderr
