"""The tender demo adds up: its invented engine's declared datasheet closes on the fuel input, the
declared figures agree with what the library computes from the same engine data, and the committed
workbook's first-law check reads OK.

Sources: the first law of thermodynamics (steady flow; the net-calorific-value balance of ISO 3046-1,
from memory); the plant family's own checks for the computed figures are in tests/test_plant_loops.py.
"""

from __future__ import annotations

import math
from pathlib import Path

import openpyxl
import pytest

from cellfuncs.demo import tender_chp

ROOT = Path(__file__).resolve().parent.parent
BOOK = ROOT / "workbooks_demo" / tender_chp.FILENAME
D = tender_chp.datasheet_values()


def test_declared_datasheet_closes_on_the_fuel():
    """fuel = electrical + generator loss + HT/LT heat + exhaust to 120 °C + exhaust loss + radiation
    (first law on the net calorific value), to 0.1 % of the fuel."""
    gen_loss = D["electrical_kw"] / D["generator_efficiency"] - D["electrical_kw"]
    total = math.fsum(D[k] for k in tender_chp.BALANCE_ITEMS) + gen_loss
    assert abs(D["fuel_power_kw"] - total) <= 1e-3 * D["fuel_power_kw"]
    # no item is implausible for a lean-burn gas engine (common practice): recoverable engine heat
    # (jacket, oil, charge air) 15-28 % of the fuel, radiation 1-3 %
    engine_heat = D["q_jacket_kw"] + D["q_oil_kw"] + D["q_cac_ht_kw"] + D["q_cac_lt_kw"]
    assert 0.15 <= engine_heat / D["fuel_power_kw"] <= 0.28
    assert 0.01 <= D["q_radiation_kw"] / D["fuel_power_kw"] <= 0.03


def test_declared_figures_match_the_physics():
    """The declared charge-air, exhaust flow and exhaust heat agree with the library's estimates from the
    same engine data (within 1 %): the invented engine is physically consistent."""
    from cellfuncs import excel as X

    names = [[g] for g, _ in tender_chp.GAS]
    amounts = [[a] for _, a in tender_chp.GAS]
    # the workbook's design day: 30 °C, 55 % RH, and the ISO 2533 standard atmosphere at its 200 m altitude
    # (98 945 Pa, the standard's table, from memory; checked by hand in tests/test_demo_site.py)
    amb = (30.0, 0.55, 0.98945)
    lam = D["air_ratio"]
    mix = X.CAC_MIXTURE_FLOW(D["fuel_power_kw"], lam, names, amounts, "net", *amb, "mixture")
    t_c = X.TURBO_T_OUT(amb[0], amb[2], D["p_boost_bar"], D["isentropic_efficiency"], lam, names, amounts,
                        amb[0], amb[1])
    q_ht = X.CAC_DUTY(mix, t_c, D["t_mixture_ht"], D["p_boost_bar"], lam, names, amounts, *amb)
    q_lt = X.CAC_DUTY(mix, D["t_mixture_ht"], D["t_mixture"], D["p_boost_bar"], lam, names, amounts, *amb)
    flow = X.EXH_FLOW(D["fuel_power_kw"], lam, names, amounts, "net", *amb)
    q_exh = X.EXH_HEAT(D["exhaust_flow_kg_h"], D["t_exhaust_in"], 120.0, lam, names, amounts, *amb)
    loss = X.EXH_LOSS(D["exhaust_flow_kg_h"], 120.0, lam, names, amounts, 25.0, *amb)
    assert D["q_cac_ht_kw"] == pytest.approx(q_ht, rel=0.01)
    assert D["q_cac_lt_kw"] == pytest.approx(q_lt, rel=0.01)
    assert D["exhaust_flow_kg_h"] == pytest.approx(flow, rel=0.01)
    assert D["q_exhaust_kw"] == pytest.approx(q_exh, rel=0.01)
    assert D["q_exhaust_loss_kw"] == pytest.approx(loss, rel=0.01)


def _named(name):
    wb = openpyxl.load_workbook(BOOK, data_only=True)
    (sheet, ref), = wb.defined_names[name].destinations
    return wb[sheet][ref.replace("$", "")].value


def test_committed_workbook_balance_reads_ok():
    for name in ("out_balance_check", "datasheet_check"):
        assert str(_named(name)).startswith("OK: "), name
    assert _named("rated_a_check") == "OK"
    # the reversed order dumps heat instead of pushing it into the client's water
    assert _named("rated_b_dump") > 0.0
    # heat to the client + dump + exhaust loss + losses = fuel − electrical (first law)
    out = (_named("out_heat_to_client") + _named("out_dump_heat") + _named("out_exhaust_loss")
           + D["q_radiation_kw"] + D["electrical_kw"] / D["generator_efficiency"])
    assert out == pytest.approx(D["fuel_power_kw"], rel=5e-3)


def test_no_legacy_array_formulas_and_no_stray_header():
    from openpyxl.worksheet.formula import ArrayFormula

    wb = openpyxl.load_workbook(BOOK)
    for ws in wb.worksheets:
        for row in ws.iter_rows():
            for c in row:
                assert not isinstance(c.value, ArrayFormula), (ws.title, c.coordinate)
    texts = [c.value for row in wb["Inputs"].iter_rows() for c in row if isinstance(c.value, str)]
    assert texts.count("mol-%") == 1
    from cellfuncs.catalogue import entries

    functions = {e.name.upper() for e in entries()}
    assert not [n for n in wb.defined_names if n.upper() in functions]


def test_cases_over_the_demo_inputs():
    """`cellfuncs cases` runs the demo over its inputs (site, client water); the first case reproduces the
    committed workbook, a hotter site with a colder client circuit still closes the balance."""
    from cellfuncs.headless.cases import CaseRunner

    runner = CaseRunner(str(BOOK), ["t_ambient", "rh_ambient", "t_water_in", "t_water_out"],
                        ["out_balance_check", "out_heat_to_client", "out_dump_heat"])
    rows = [runner.run_case([30.0, 0.55, 60.0, 90.0]), runner.run_case([35.0, 0.6, 55.0, 85.0])]
    assert str(rows[0][0]).startswith("OK: ") and str(rows[1][0]).startswith("OK: ")
    assert rows[0][1] == pytest.approx(_named("out_heat_to_client"), rel=1e-9)


def _runner(inputs, outputs):
    from cellfuncs.headless.cases import CaseRunner

    return CaseRunner(str(BOOK), inputs, outputs)


def test_order_inputs_take_only_the_two_drop_down_words():
    """The project's rule "never a silent wrong number": an order word other than the drop-down's two is an
    error naming it in the chain's cells, and the same source twice is flagged and gives no heat figure."""
    from cellfuncs.headless.package import ErrorText

    runner = _runner(["order_1", "order_2"], ["rated_a_check", "out_heat_to_client", "out_balance_check",
                                              "rated_a_t_flow"])
    ok = runner.run_case(list(tender_chp.ORDER))
    assert ok[0] == "OK" and ok[1] == pytest.approx(_named("out_heat_to_client"), rel=1e-9)
    for bad in (42.0, "engine", "Exhaust gas"):
        out = runner.run_case([bad, tender_chp.ORDER[1]])
        assert all(isinstance(v, ErrorText) for v in out), (bad, out)
        assert "not a heat source" in out[3].message, out[3].message
    for src in tender_chp.SOURCES:
        out = runner.run_case([src, src])
        assert out[0] == f"CHECK: the same heat source twice ({src})"
        assert isinstance(out[1], ErrorText) and isinstance(out[2], ErrorText), out


def test_ambient_pressure_follows_the_site_altitude():
    """p_ambient_bar is the ISO 2533 standard atmosphere at the site altitude plus the design-day offset
    (ISO 2533:1975 troposphere formula evaluated by hand, as in tests/test_demo_site.py), and the charge-air
    physics sees it: the compressor outlet is hotter at altitude (a higher pressure ratio to the same boost,
    first law for an isentropic-efficiency compressor, common practice)."""
    runner = _runner(["site_altitude_m", "p_ambient_offset_bar"],
                     ["p_ambient_bar", "out_site_pressure", "t_compressor_out"])

    def iso2533(h):
        return 1.01325 * (1 - 0.0065 * h / 288.15) ** (9.80665 * 0.0289644 / (8.31432 * 0.0065))

    low = runner.run_case([200.0, 0.0])
    high = runner.run_case([1500.0, 0.0])
    offset = runner.run_case([200.0, 0.012])
    assert low[0] == pytest.approx(iso2533(200.0), rel=1e-6) and low[0] == low[1]
    assert high[0] == pytest.approx(iso2533(1500.0), rel=1e-6)
    assert high[0] == pytest.approx(0.8456, abs=1e-4)  # ISO 2533 table at 1500 m: 84 560 Pa (from memory)
    assert offset[0] == pytest.approx(iso2533(200.0) + 0.012, rel=1e-6)
    assert high[2] > low[2] > offset[2]
