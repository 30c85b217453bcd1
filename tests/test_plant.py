"""Plant balance: heat rate, primary energy savings, energy balance.

Sources: Directive 2012/27/EU Annex II (b) formula (arithmetic); 1 kWh =
3600 kJ.  Vectors in tests/vectors/plant.csv.
"""

from __future__ import annotations

import pytest
from hypothesis import given, settings
from hypothesis import strategies as st

from vectors import approx, params

from cellfuncs import adapt, catalogue
from cellfuncs.errors import CellInputError, CellTypeError
from cellfuncs.recovery.plant import chp_balance, chp_heat_rate, chp_pes


def _cell(name):
    """The catalogue function NAME as a cell calls it (the shared adapter: ranges, blanks, errors)."""
    entry = catalogue.by_name(name)
    return lambda *values: adapt.call(entry, values)


CHP_BALANCE = _cell("CHP_BALANCE")


def _heat_range(text):
    """'500;;400' -> a column range ((500.0,), (None,), (400.0,))."""
    return tuple((float(c),) if c else (None,) for c in str(text).split(";"))


@pytest.mark.parametrize("row", params("plant", "CHP_PES"))
def test_pes(row):
    """Directive 2012/27/EU Annex II (b) by hand, with the regulation's figures where a fuel is named."""
    got = chp_pes(row["el"], row["th"], row["ref_el"], row["ref_th"], row["fuel"] or None, row["year"],
                  row["heat_use"] or "hot-water", row["voltage_kv"], row["onsite_share"] or 0.0)
    assert got == approx(row)


@pytest.mark.parametrize("row", params("plant", "CHP_HEAT_RATE"))
def test_heat_rate(row):
    assert chp_heat_rate(row["el"]) == approx(row)


@pytest.mark.parametrize("row", params("plant", "CHP_BALANCE"))
def test_balance(row):
    got = CHP_BALANCE(row["fuel_kw"], row["electrical_kw"], _heat_range(row["heat_kw"]), row["output"])
    assert got == approx(row)


def test_balance_range_shapes():
    """A row, a column, a block and a flat list give the same sum."""
    for rng in (((300.0, None, 200.0),), ((300.0,), (200.0,)), ((300.0, 100.0), (None, 100.0)),
                [300.0, 200.0], 500.0):
        assert CHP_BALANCE(1000.0, 0.0, rng, "thermal") == pytest.approx(0.5, rel=1e-15)


@pytest.mark.parametrize("call,name,err", [
    (lambda: chp_heat_rate(0.0), "electrical_efficiency:", CellInputError),
    (lambda: chp_heat_rate(1.2), "electrical_efficiency:", CellInputError),
    (lambda: chp_pes(0.4, -0.1, 0.525, 0.9), "thermal_efficiency:", CellInputError),
    (lambda: chp_pes(0.4, 0.45, 0.0, 0.9), "ref_electrical_efficiency:", CellInputError),
    (lambda: chp_pes(0.4, 0.45, 0.525, 1.5), "ref_thermal_efficiency:", CellInputError),
    (lambda: CHP_BALANCE(0.0, 100.0, ((1.0,),)), "fuel_power_kw:", CellInputError),
    (lambda: CHP_BALANCE(1000.0, -1.0, ((1.0,),)), "electrical_kw:", CellInputError),
    (lambda: CHP_BALANCE(1000.0, 100.0, ((1.0, -5.0),)), "heat_kw:", CellInputError),
    (lambda: CHP_BALANCE(1000.0, 100.0, ((1.0, "x"),)), "heat_kw:", CellTypeError),
    (lambda: chp_balance(1000.0, 100.0, (1.0,), "gross"), "output:", CellTypeError),
])
def test_bad_input(call, name, err):
    with pytest.raises(err) as e:
        call()
    assert e.value.message.startswith(name)


@settings(max_examples=200, deadline=None)
@given(el=st.floats(0.2, 0.5), th=st.floats(0.0, 0.6), d=st.floats(1e-3, 0.1))
def test_pes_monotonic(el, th, d):
    base = chp_pes(el, th, 0.525, 0.9)
    assert chp_pes(el, min(th + d, 1.0), 0.525, 0.9) >= base
    assert chp_pes(min(el + d, 1.0), th, 0.525, 0.9) > base
    assert chp_pes(el, th, 0.525 + d / 10, 0.9) < base


@settings(max_examples=200, deadline=None)
@given(fuel=st.floats(1.0, 1e5), el=st.floats(0.0, 1.0),
       heats=st.lists(st.one_of(st.none(), st.floats(0.0, 1e4)), min_size=1, max_size=8))
def test_balance_parts_add_up(fuel, el, heats):
    el_kw = el * fuel
    rng = (tuple(heats),)
    parts = [CHP_BALANCE(fuel, el_kw, rng, o) for o in ("electrical", "thermal", "unaccounted")]
    assert sum(parts) == pytest.approx(1.0, rel=1e-9)
    assert CHP_BALANCE(fuel, el_kw, rng) == pytest.approx(parts[0] + parts[1], rel=1e-12, abs=1e-15)
