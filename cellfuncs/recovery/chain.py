"""Hot-water chains: a circuit that picks up heat in several exchangers in series.

The water returns from the client at ``t_return`` and passes the exchangers in
the order listed (for example oil cooler, HT charge-air stage, jacket water,
exhaust).  :func:`chain_temperatures` adds given duties in that order;
:func:`rate_chain` and :func:`rate_chain_water` rate given exchangers (hot-side
inlet temperature, hot-side capacity rate and UA per stage) by the ε-NTU
method, each stage seeing the water the previous one left; :func:`chain_check`
reports the first stage whose source cannot heat the water that far.

The order matters: a low-temperature source placed after a high-temperature
one receives water hotter than itself and takes heat out of the circuit
(negative duty).
"""

from __future__ import annotations

import math

from cellfuncs.errors import CellInputError, CellTypeError, check_range, fmt
from cellfuncs.recovery import water as _w
from cellfuncs.recovery._cells import layout, stage_cells

__all__ = [
    "ARRANGEMENTS",
    "rate_stage",
    "rate_chain",
    "rate_chain_water",
    "chain_temperatures",
    "chain_check",
    "cell_chain",
    "cell_chain_rate",
    "cell_chain_check",
]

#: arrangement words: one vocabulary with the heat-exchanger family
from cellfuncs.heat_transfer.arrangements import ARRANGEMENTS  # noqa: E402
from cellfuncs.heat_transfer.arrangements import parse as _parse_arrangement  # noqa: E402

OUTPUTS_RATE = ("t_out", "duty", "t_hot_out")


def _effectiveness(ntu: float, c_ratio: float, arrangement: str) -> float:
    """ε(NTU, Cr) from the heat-exchanger family (the one ε-NTU implementation)."""
    return _epsilon(ntu, c_ratio, arrangement)


def _epsilon(ntu, c_ratio, arrangement):
    global _epsilon
    from cellfuncs.heat_transfer.effectiveness import epsilon

    _epsilon = epsilon  # resolve the import once
    return epsilon(ntu, c_ratio, arrangement)


def _check_arrangement(arrangement: str) -> str:
    return _parse_arrangement(arrangement)


def rate_stage(t_cold_in: float, c_cold: float, t_hot_in: float, c_hot: float, ua: float,
               arrangement: str = "counter") -> tuple:
    """Rate one exchanger by the ε-NTU method.

    Parameters
    ----------
    t_cold_in : float
        Water (cold-side) inlet temperature [°C].
    c_cold : float
        Water capacity rate [kW/K].
    t_hot_in : float
        Hot-side inlet temperature [°C].
    c_hot : float
        Hot-side capacity rate [kW/K].
    ua : float
        Overall conductance UA [kW/K]; 0 means no exchange.
    arrangement : str
        Flow arrangement word, see :data:`ARRANGEMENTS`.

    Returns
    -------
    tuple
        ``(duty [kW], t_cold_out [°C], t_hot_out [°C])``; the duty is negative
        when the hot side is colder than the water (the water heats the source).

    Notes
    -----
    ``Q = ε(NTU, Cr)·Cmin·(t_hot_in − t_cold_in)`` with ``NTU = UA/Cmin``,
    ``Cr = Cmin/Cmax``.  The same relation holds for either sign of the
    temperature difference, so a "wrong way" stage is rated with the same ε.

    References
    ----------
    Kays, W. M., London, A. L. (1984), Compact Heat Exchangers, 3rd ed., ch. 2.
    Incropera, F. P., DeWitt, D. P. (2007), Fundamentals of Heat and Mass
    Transfer, 6th ed., section 11.4.
    """
    if ua == 0:
        return 0.0, t_cold_in, t_hot_in
    c_min, c_max = min(c_cold, c_hot), max(c_cold, c_hot)
    try:
        eps = _effectiveness(ua / c_min, c_min / c_max, arrangement)
    except CellInputError as err:
        raise CellInputError(f"ua_kw_k: {fmt(ua)} kW/K gives {err.message}") from None
    q = eps * c_min * (t_hot_in - t_cold_in)
    return q, t_cold_in + q / c_cold, t_hot_in - q / c_hot


def _stage_data(hot_t_in, hot_c_kw_k, ua_kw_k) -> list:
    """Validate per-stage hot-side data (lists of float or None)."""
    n = len(hot_t_in)
    if len(hot_c_kw_k) != n:
        raise CellInputError(f"hot_c_kw_k: {len(hot_c_kw_k)} cells given, hot_t_in has {n}; give one per stage")
    if len(ua_kw_k) != n:
        raise CellInputError(f"ua_kw_k: {len(ua_kw_k)} cells given, hot_t_in has {n}; give one per stage")
    out = []
    for k, (th, ch, ua) in enumerate(zip(hot_t_in, hot_c_kw_k, ua_kw_k), start=1):
        for name, v in (("hot_t_in", th), ("hot_c_kw_k", ch), ("ua_kw_k", ua)):
            if v is not None and not (isinstance(v, (int, float)) and not isinstance(v, bool)):
                raise CellTypeError(f"{name}: stage {k} {v!r} is not a number")
            if v is not None and not math.isfinite(v):
                raise CellInputError(f"{name}: stage {k} {v} is not a finite number")
        if ua is None or ua == 0:
            out.append((th, ch, 0.0))
            continue
        s = f"stage {k}"
        if ua < 0:
            raise CellInputError(f"ua_kw_k: {s} {fmt(ua)} kW/K is below 0 kW/K")
        if th is None:
            raise CellInputError(f"hot_t_in: {s} is blank but has ua_kw_k {fmt(ua)} kW/K")
        if ch is None:
            raise CellInputError(f"hot_c_kw_k: {s} is blank but has ua_kw_k {fmt(ua)} kW/K")
        if ch <= 0:
            raise CellInputError(f"hot_c_kw_k: {s} {fmt(ch)} kW/K must be above 0 kW/K")
        if th <= -273.15:
            raise CellInputError(f"hot_t_in: {s} {fmt(th)} °C is not above absolute zero")
        out.append((th, ch, ua))
    return out


def rate_chain(t_in: float, c_water: float, hot_t_in, hot_c_kw_k, ua_kw_k,
               arrangement: str = "counter") -> list:
    """Rate a chain of exchangers with a constant water capacity rate.

    Parameters
    ----------
    t_in : float
        Water temperature entering the first stage [°C].
    c_water : float
        Water capacity rate ṁ·cp [kW/K], the same in every stage.
    hot_t_in, hot_c_kw_k, ua_kw_k : sequence of float
        Per stage, in water-flow order: hot-side inlet temperature [°C],
        hot-side capacity rate [kW/K], UA [kW/K].  A stage with UA blank or 0
        exchanges nothing.
    arrangement : str
        Flow arrangement of every stage (:data:`ARRANGEMENTS`).

    Returns
    -------
    list of tuple
        Per stage ``(duty [kW], t_out [°C], t_hot_out [°C])``.

    Notes
    -----
    The core of :func:`rate_chain_water` with the capacity rates given
    directly; no water-property limits are applied.

    References
    ----------
    See :func:`rate_stage`.
    """
    t = check_range("t_in", t_in, -273.15, None, "°C", lo_open=True)
    c_water = check_range("c_water", c_water, 0.0, None, "kW/K", lo_open=True)
    arrangement = _check_arrangement(arrangement)
    out = []
    for th, ch, ua in _stage_data(list(hot_t_in), list(hot_c_kw_k), list(ua_kw_k)):
        if ua == 0:
            out.append((0.0, t, th))
            continue
        q, t, t_hot_out = rate_stage(t, c_water, th, ch, ua, arrangement)
        out.append((q, t, t_hot_out))
    return out


def _beyond(name: str, k: int, h: float, bounds: tuple, verb: str) -> None:
    """Raise if enthalpy h [kJ/kg] leaves the liquid range after stage k."""
    t_lo, t_hi, h_lo, h_hi, cp_lo, cp_hi, label, why = bounds
    if h > h_hi:
        t_est = t_hi + (h - h_hi) / cp_hi
        raise CellInputError(
            f"{name}: stage {k} {verb} the {label} to about {fmt(round(t_est, 1))} °C, above "
            f"{fmt(round(t_hi, 2))} °C ({why}); raise flow_m3h or reorder the stages")
    if h < h_lo:
        t_est = t_lo - (h_lo - h) / cp_lo
        raise CellInputError(
            f"{name}: stage {k} {verb} the {label} to about {fmt(round(t_est, 1))} °C, below "
            f"{fmt(round(t_lo, 2))} °C (freezing)")


def rate_chain_water(t_return: float, flow_m3h: float, hot_t_in, hot_c_kw_k, ua_kw_k,
                     arrangement: str = "counter", glycol_fraction: float = 0.0,
                     glycol: str = "ethylene") -> list:
    """Rate a hot-water chain with water properties from :mod:`.water`.

    Parameters
    ----------
    t_return : float
        Return temperature entering the first stage [°C].
    flow_m3h : float
        Circuit volume flow measured at t_return [m³/h].
    hot_t_in, hot_c_kw_k, ua_kw_k : sequence of float or None
        Per stage in water-flow order: hot-side inlet temperature [°C],
        hot-side capacity rate [kW/K], UA [kW/K].
    arrangement : str
        Flow arrangement of every stage.
    glycol_fraction : float
        Glycol mass fraction [-].
    glycol : str
        ``"ethylene"`` or ``"propylene"``.

    Returns
    -------
    list of dict
        Per stage: ``duty`` [kW], ``t_in``, ``t_out``, ``t_hot_out`` [°C] and
        ``c_water`` [kW/K], the water capacity rate used (ṁ times the mean cp
        over the stage, so that ``duty = ṁ·(h(t_out) − h(t_in))``).

    Raises
    ------
    CellInputError
        Naming the stage where the water would leave its liquid range
        (boiling at 3 bar(a) = 133.52 °C for water; 100 °C for glycol).

    Notes
    -----
    Each stage is rated by :func:`rate_stage`; the mean cp is iterated until
    the ε-NTU duty and the enthalpy rise agree (two or three passes).

    References
    ----------
    See :func:`rate_stage` and :func:`cellfuncs.recovery.water.hw_cp`.
    """
    arrangement = _check_arrangement(arrangement)
    m = _w.mass_flow(flow_m3h, t_return, glycol_fraction, glycol, t_name="t_return")
    h = _w.enthalpy(t_return, glycol_fraction, glycol, name="t_return")
    bounds = _w.enthalpy_bounds(glycol_fraction, glycol)
    t = float(t_return)
    stages = _stage_data(list(hot_t_in), list(hot_c_kw_k), list(ua_kw_k))
    out = []
    for k, (th, ch, ua) in enumerate(stages, start=1):
        cp = _w.hw_cp(t, glycol_fraction, glycol)
        if ua == 0:
            out.append({"duty": 0.0, "t_in": t, "t_out": t, "t_hot_out": th, "c_water": m * cp})
            continue
        t_out = t
        for _ in range(30):
            q = rate_stage(t, m * cp, th, ch, ua, arrangement)[0]
            h_out = h + q / m
            _beyond("ua_kw_k", k, h_out, bounds, "heats" if q >= 0 else "cools")
            t_out = _w.temperature_from_enthalpy(h_out, t + q / (m * cp), glycol_fraction, glycol)
            cp_new = (h_out - h) / (t_out - t) if abs(t_out - t) > 1e-7 else cp
            done = abs(cp_new - cp) <= 1e-12 * cp
            cp = cp_new
            if done:
                break
        # final pass with the converged mean cp: duty, hot outlet and water outlet agree
        q, _tc, t_hot_out = rate_stage(t, m * cp, th, ch, ua, arrangement)
        h_out = h + q / m
        _beyond("ua_kw_k", k, h_out, bounds, "heats" if q >= 0 else "cools")
        t_out = _w.temperature_from_enthalpy(h_out, t_out, glycol_fraction, glycol)
        out.append({"duty": q, "t_in": t, "t_out": t_out, "t_hot_out": t_hot_out, "c_water": m * cp})
        h, t = h_out, t_out
    return out


def chain_temperatures(t_return: float, flow_m3h: float, duties_kw, glycol_fraction: float = 0.0,
                       glycol: str = "ethylene") -> list:
    """Water temperature after each stage when given duties are added in order.

    Parameters
    ----------
    t_return : float
        Return temperature entering the first stage [°C].
    flow_m3h : float
        Circuit volume flow measured at t_return [m³/h].
    duties_kw : sequence of float or None
        Heat added in each stage, in water-flow order [kW]; None (a blank cell)
        is a stage with no duty; a negative duty cools the water.
    glycol_fraction : float
        Glycol mass fraction [-].
    glycol : str
        ``"ethylene"`` or ``"propylene"``.

    Returns
    -------
    list of float
        Temperature after each stage [°C], from ``h_k = h_(k−1) + Q_k/ṁ``.

    Raises
    ------
    CellInputError
        Naming the stage where the water would boil (133.52 °C at 3 bar(a)) or
        leave the glycol data range.

    Notes
    -----
    Properties at 3 bar(a) from :mod:`cellfuncs.recovery.water`.

    References
    ----------
    See :func:`cellfuncs.recovery.water.hw_cp`.
    """
    m = _w.mass_flow(flow_m3h, t_return, glycol_fraction, glycol, t_name="t_return")
    h = _w.enthalpy(t_return, glycol_fraction, glycol, name="t_return")
    bounds = _w.enthalpy_bounds(glycol_fraction, glycol)
    t = float(t_return)
    out = []
    for k, q in enumerate(duties_kw, start=1):
        q = 0.0 if q is None else check_range("duties_kw", q, None, None, "kW")
        if q != 0:
            h += q / m
            _beyond("duties_kw", k, h, bounds, "heats" if q > 0 else "cools")
            t = _w.temperature_from_enthalpy(h, t, glycol_fraction, glycol)
        out.append(t)
    return out


def chain_check(t_return: float, flow_m3h: float, duties_kw, hot_t_max, min_approach: float = 5.0,
                glycol_fraction: float = 0.0, glycol: str = "ethylene") -> str:
    """Check that every source can heat the water as far as the chain needs.

    Parameters
    ----------
    t_return : float
        Return temperature [°C].
    flow_m3h : float
        Circuit volume flow measured at t_return [m³/h].
    duties_kw : sequence of float or None
        Duty of each stage in water-flow order [kW].
    hot_t_max : sequence of float or None
        Hottest hot-side temperature of each stage's source [°C] (one value
        per stage, or a single value for all).
    min_approach : float
        Smallest allowed difference between that temperature and the water
        leaving the stage [K].
    glycol_fraction : float
        Glycol mass fraction [-].
    glycol : str
        ``"ethylene"`` or ``"propylene"``.

    Returns
    -------
    str
        ``"OK"``, or one line naming the first stage whose water outlet is
        above ``hot_t_max − min_approach`` or where the water would boil.

    Notes
    -----
    Only stages with a positive duty are checked against their source; a
    stage with a negative duty is a cooler and is not judged here.

    References
    ----------
    See :func:`cellfuncs.recovery.water.hw_cp` (water and glycol properties).
    """
    approach = check_range("min_approach", min_approach, 0.0, None, "K")
    duties = list(duties_kw)
    t_max = list(hot_t_max)
    if len(t_max) == 1 and len(duties) > 1:
        t_max = t_max * len(duties)
    if len(t_max) != len(duties):
        raise CellInputError(
            f"hot_t_max: {len(t_max)} cells given, duties_kw has {len(duties)}; give one per stage or one for all")
    m = _w.mass_flow(flow_m3h, t_return, glycol_fraction, glycol, t_name="t_return")
    h = _w.enthalpy(t_return, glycol_fraction, glycol, name="t_return")
    t_lo, t_hi, h_lo, h_hi, cp_lo, cp_hi, label, why = _w.enthalpy_bounds(glycol_fraction, glycol)
    t = float(t_return)
    for k, (q, tm) in enumerate(zip(duties, t_max), start=1):
        q = 0.0 if q is None else check_range("duties_kw", q, None, None, "kW")
        if q == 0:
            continue
        h += q / m
        if h > h_hi:
            t_est = t_hi + (h - h_hi) / cp_hi
            return (f"stage {k}: the {label} would reach about {fmt(round(t_est, 1))} °C, above "
                    f"{fmt(round(t_hi, 2))} °C ({why}); raise the flow, reorder, split or bypass")
        if h < h_lo:
            t_est = t_lo - (h_lo - h) / cp_lo
            return (f"stage {k}: the {label} would cool to about {fmt(round(t_est, 1))} °C, below "
                    f"{fmt(round(t_lo, 2))} °C (freezing)")
        t = _w.temperature_from_enthalpy(h, t, glycol_fraction, glycol)
        if q > 0:
            if tm is None:
                raise CellInputError(f"hot_t_max: stage {k} is blank but has a duty of {fmt(q)} kW")
            check_range("hot_t_max", tm, -273.15, None, "°C", lo_open=True)
            limit = tm - approach
            if t > limit + 1e-9:
                return (f"stage {k}: water leaves at {fmt(round(t, 2))} °C, above {fmt(round(limit, 2))} °C "
                        f"(source {fmt(tm)} °C − {fmt(approach)} K approach); reorder, split or bypass")
    return "OK"


# ---- cell wrappers (ranges in, laid-out results back) -----------------------------

def cell_chain(t_return, flow_m3h, duties_kw, glycol_fraction=0.0, glycol="ethylene", stage=None):
    """HW_CHAIN: temperatures after each stage laid out like duties_kw, or one stage's [°C]."""
    cells, lay = stage_cells("duties_kw", duties_kw)
    temps = chain_temperatures(t_return, flow_m3h, cells, glycol_fraction, glycol)
    if stage is None:
        return layout(temps, lay if lay != "flat" else "row")
    k = _check_stage(stage, len(temps))
    return [[temps[k - 1]]]


def _check_stage(stage, n: int) -> int:
    if isinstance(stage, bool) or not isinstance(stage, (int, float)) or stage != int(stage):
        raise CellTypeError(f"stage: {stage!r} is not a whole number")
    k = int(stage)
    if not 1 <= k <= n:
        raise CellInputError(f"stage: {k} is not between 1 and {n} (the number of stages)")
    return k


def cell_chain_rate(t_return, flow_m3h, hot_t_in, hot_c_kw_k, ua_kw_k, arrangement="counter",
                    output="t_out", glycol_fraction=0.0, glycol="ethylene"):
    """HW_CHAIN_RATE: per stage t_out [°C], duty [kW] or t_hot_out [°C], laid out like hot_t_in."""
    if not isinstance(output, str) or output.strip().lower() not in OUTPUTS_RATE:
        raise CellTypeError(f"output: {output!r} is not one of " + ", ".join(f'"{o}"' for o in OUTPUTS_RATE))
    output = output.strip().lower()
    th, lay = stage_cells("hot_t_in", hot_t_in)
    ch, _ = stage_cells("hot_c_kw_k", hot_c_kw_k)
    ua, _ = stage_cells("ua_kw_k", ua_kw_k)
    res = rate_chain_water(t_return, flow_m3h, th, ch, ua, arrangement, glycol_fraction, glycol)
    vals = [r[output] if r[output] is not None else "" for r in res]
    return layout(vals, lay if lay != "flat" else "row")


def cell_chain_check(t_return, flow_m3h, duties_kw, hot_t_max, min_approach=5.0,
                     glycol_fraction=0.0, glycol="ethylene"):
    """HW_CHAIN_CHECK: "OK" or the first finding (one line)."""
    cells, _ = stage_cells("duties_kw", duties_kw)
    tmax, _ = stage_cells("hot_t_max", hot_t_max)
    return chain_check(t_return, flow_m3h, cells, tmax, min_approach, glycol_fraction, glycol)
