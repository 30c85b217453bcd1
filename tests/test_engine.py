"""Genset and engine basics: synchronous speed, pole pairs, BMEP and shaft power.

Sources: synchronous speed 60·f/p (common practice, facts of the trade);
BMEP = 1200·P/(V·n) for four-stroke (Heywood, Internal Combustion Engine
Fundamentals, 1988, ch. 2, eq. 2.19).  Vectors in tests/vectors/engine.csv.
"""

from __future__ import annotations

import pytest
from hypothesis import given, settings
from hypothesis import strategies as st

from vectors import approx, params

from cellfuncs.engine.bmep import engine_bmep, engine_power
from cellfuncs.engine.genset import gen_pole_pairs, gen_speed
from cellfuncs.errors import CellInputError, CellTypeError


@pytest.mark.parametrize("row", params("engine", "GEN_SPEED"))
def test_gen_speed(row):
    assert gen_speed(row["frequency_hz"], int(row["pole_pairs"])) == approx(row)


@pytest.mark.parametrize("row", params("engine", "GEN_POLE_PAIRS"))
def test_gen_pole_pairs(row):
    assert gen_pole_pairs(row["frequency_hz"], row["speed_rpm"]) == row["expected"]


@pytest.mark.parametrize("row", params("engine", "ENGINE_BMEP"))
def test_bmep(row):
    got = engine_bmep(row["power_kw"], row["displacement_l"], row["speed_rpm"], int(row["strokes"]))
    assert got == approx(row)


@pytest.mark.parametrize("row", params("engine", "ENGINE_POWER"))
def test_power(row):
    got = engine_power(row["bmep_bar"], row["displacement_l"], row["speed_rpm"], int(row["strokes"]))
    assert got == approx(row)


def test_bmep_matches_si_definition():
    """BMEP = W_cycle / V_d with W_cycle = P·n_R/N in SI units (Heywood ch. 2)."""
    p_w, v_m3, n_rps = 1.5e6, 0.0487, 25.0
    w_cycle = p_w * 2 / n_rps  # J per cycle, four-stroke
    assert engine_bmep(1500.0, 48.7, 1500.0) == pytest.approx(w_cycle / v_m3 / 1e5, rel=1e-13)


def test_pole_pairs_tolerance():
    assert gen_pole_pairs(50.0, 1507.0) == 2.0  # 0.47 % off
    with pytest.raises(CellInputError, match=r"^speed_rpm: 1510 rpm is not synchronous at 50 Hz"):
        gen_pole_pairs(50.0, 1510.0)  # 0.67 % off, e.g. an induction generator's slip
    with pytest.raises(CellInputError, match="1 pole pair;"):
        gen_pole_pairs(50.0, 5000.0)


@pytest.mark.parametrize("call,name,err", [
    (lambda: gen_speed(0.0, 2), "frequency_hz:", CellInputError),
    (lambda: gen_speed(50.0, 0), "pole_pairs:", CellInputError),
    (lambda: gen_speed(50.0, 2.5), "pole_pairs:", CellTypeError),
    (lambda: gen_pole_pairs(50.0, -1500.0), "speed_rpm:", CellInputError),
    (lambda: engine_bmep(-1.0, 50.0, 1500.0), "shaft_power_kw:", CellInputError),
    (lambda: engine_bmep(1000.0, 0.0, 1500.0), "displacement_l:", CellInputError),
    (lambda: engine_bmep(1000.0, 50.0, 0.0), "speed_rpm:", CellInputError),
    (lambda: engine_bmep(1000.0, 50.0, 1500.0, 3), "strokes:", CellTypeError),
    (lambda: engine_power(-2.0, 50.0, 1500.0), "bmep_bar:", CellInputError),
    (lambda: engine_power(20.0, 50.0, float("inf")), "speed_rpm:", CellInputError),
])
def test_bad_input(call, name, err):
    with pytest.raises(err) as e:
        call()
    assert e.value.message.startswith(name)


@settings(max_examples=200, deadline=None)
@given(p=st.floats(0.0, 2e4), v=st.floats(0.1, 500.0), n=st.floats(100.0, 3000.0),
       strokes=st.sampled_from([2, 4]))
def test_power_inverts_bmep(p, v, n, strokes):
    assert engine_power(engine_bmep(p, v, n, strokes), v, n, strokes) == pytest.approx(p, rel=1e-14)


@settings(max_examples=200, deadline=None)
@given(f=st.sampled_from([50.0, 60.0, 25.0, 400.0]), p=st.integers(1, 40))
def test_pole_pairs_inverts_speed(f, p):
    assert gen_pole_pairs(f, gen_speed(f, p)) == p


def test_pole_pairs_tiny_speed_is_a_clear_error():
    """Found by the hostile-input test: a speed of 2e-308 rpm overflowed the rounding."""
    from cellfuncs.engine.genset import gen_pole_pairs

    with pytest.raises(CellInputError, match="speed_rpm"):
        gen_pole_pairs(1.0, 2.2250738585072014e-308)
