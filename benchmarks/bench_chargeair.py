"""Benchmarks: CAC_DEWPOINT and CAC_DUTY cores against the equivalent CoolProp calls.

Run::

    /tmp/venv/bin/python -m pytest benchmarks/bench_chargeair.py --benchmark-only \
        --benchmark-columns=mean,stddev,rounds --benchmark-sort=name

Air only (humid air, no gas), the case CoolProp's HAPropsSI covers.  The
CoolProp side does what the cell has to do: the humidity ratio from the
ambient state, then the dew point at the boost pressure (HAPropsSI 'W' then
'D'), or the enthalpies in and out (HAPropsSI 'W' then 'H' twice).

``fresh`` runs change the ambient temperature on every call, so no cache of
cellfuncs helps; the plain runs repeat one ambient state, as a sheet does when
many cells share the site conditions.  Target: cellfuncs no slower than CoolProp.
"""

import itertools

import pytest

from cellfuncs.chargeair import cooler

P_BAR, T_AMB, RH, P_AMB = 3.0, 25.0, 0.6, 1.0
T_IN, T_OUT, FLOW = 160.0, 60.0, 10000.0


def _fresh_temps():
    # 1000 distinct ambient temperatures, cycled (each one a new cache key)
    return itertools.cycle([10.0 + i * 0.02 for i in range(1000)])


@pytest.mark.benchmark(group="dewpoint")
def test_dewpoint_cellfuncs(benchmark):
    td = benchmark(cooler.dew_point, P_BAR, None, None, T_AMB, RH, P_AMB)
    assert 30.0 < td < 45.0


@pytest.mark.benchmark(group="dewpoint")
def test_dewpoint_cellfuncs_fresh(benchmark):
    temps = _fresh_temps()
    benchmark(lambda: cooler.dew_point(P_BAR, None, None, next(temps), RH, P_AMB))


@pytest.mark.benchmark(group="dewpoint")
def test_dewpoint_coolprop(benchmark):
    from CoolProp.HumidAirProp import HAPropsSI

    def run(t_amb=T_AMB):
        w = HAPropsSI("W", "T", t_amb + 273.15, "R", RH, "P", P_AMB * 1e5)
        return HAPropsSI("D", "T", T_IN + 273.15, "P", P_BAR * 1e5, "W", w) - 273.15

    td = benchmark(run)
    assert td == pytest.approx(cooler.dew_point(P_BAR, None, None, T_AMB, RH, P_AMB), abs=0.3)


@pytest.mark.benchmark(group="dewpoint")
def test_dewpoint_coolprop_fresh(benchmark):
    from CoolProp.HumidAirProp import HAPropsSI

    temps = _fresh_temps()

    def run():
        w = HAPropsSI("W", "T", next(temps) + 273.15, "R", RH, "P", P_AMB * 1e5)
        return HAPropsSI("D", "T", T_IN + 273.15, "P", P_BAR * 1e5, "W", w)

    benchmark(run)


@pytest.mark.benchmark(group="duty")
def test_duty_cellfuncs(benchmark):
    q = benchmark(cooler.duty, FLOW, T_IN, T_OUT, P_BAR, None, None, T_AMB, RH, P_AMB)
    assert q > 0


@pytest.mark.benchmark(group="duty")
def test_duty_cellfuncs_fresh(benchmark):
    temps = _fresh_temps()
    benchmark(lambda: cooler.duty(FLOW, T_IN, T_OUT, P_BAR, None, None, next(temps), RH, P_AMB))


@pytest.mark.benchmark(group="duty")
def test_duty_coolprop(benchmark):
    from CoolProp.HumidAirProp import HAPropsSI

    def run(t_amb=T_AMB):
        w = HAPropsSI("W", "T", t_amb + 273.15, "R", RH, "P", P_AMB * 1e5)
        h1 = HAPropsSI("H", "T", T_IN + 273.15, "P", P_BAR * 1e5, "W", w)
        h2 = HAPropsSI("H", "T", T_OUT + 273.15, "P", P_BAR * 1e5, "W", w)
        return FLOW / 3600.0 / (1 + w) * (h1 - h2) / 1000.0

    q = benchmark(run)
    assert q == pytest.approx(cooler.duty(FLOW, T_IN, T_OUT, P_BAR, None, None, T_AMB, RH, P_AMB),
                              rel=5e-3)


@pytest.mark.benchmark(group="duty")
def test_duty_coolprop_fresh(benchmark):
    from CoolProp.HumidAirProp import HAPropsSI

    temps = _fresh_temps()

    def run():
        w = HAPropsSI("W", "T", next(temps) + 273.15, "R", RH, "P", P_AMB * 1e5)
        h1 = HAPropsSI("H", "T", T_IN + 273.15, "P", P_BAR * 1e5, "W", w)
        h2 = HAPropsSI("H", "T", T_OUT + 273.15, "P", P_BAR * 1e5, "W", w)
        return h1 - h2

    benchmark(run)
