"""Hot-water chains: a circuit that picks up heat in several exchangers in series.

The water returns from the client at ``t_water_in`` and passes the exchangers in
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

__all__ = [
    "ARRANGEMENTS",
    "rate_stage",
    "rate_chain",
    "rate_chain_water",
    "chain_temperatures",
    "chain_check",
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


def _stage_data(hot_t_in, hot_c_kw_k, ua_kw_k, loops=()) -> list:
    """Validate per-stage hot-side data (lists of float or None); stages in ``loops`` are skipped."""
    n = len(hot_t_in)
    if len(hot_c_kw_k) != n:
        raise CellInputError(f"c_source_kw_k: {len(hot_c_kw_k)} cells given, t_source_in has {n}; "
                             "give one per stage")
    if len(ua_kw_k) != n:
        raise CellInputError(f"ua_kw_k: {len(ua_kw_k)} cells given, t_source_in has {n}; give one per stage")
    out = []
    for k, (th, ch, ua) in enumerate(zip(hot_t_in, hot_c_kw_k, ua_kw_k), start=1):
        if k in loops:
            out.append((th, ch, ua))
            continue
        for name, v in (("t_source_in", th), ("c_source_kw_k", ch), ("ua_kw_k", ua)):
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
            raise CellInputError(f"t_source_in: {s} is blank but has ua_kw_k {fmt(ua)} kW/K")
        if ch is None:
            raise CellInputError(f"c_source_kw_k: {s} is blank but has ua_kw_k {fmt(ua)} kW/K")
        if ch <= 0:
            raise CellInputError(f"c_source_kw_k: {s} {fmt(ch)} kW/K must be above 0 kW/K")
        if th <= -273.15:
            raise CellInputError(f"t_source_in: {s} {fmt(th)} °C is not above absolute zero")
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
            f"{fmt(round(t_hi, 2))} °C ({why}); raise water_flow_m3_h or reorder the stages")
    if h < h_lo:
        t_est = t_lo - (h_lo - h) / cp_lo
        raise CellInputError(
            f"{name}: stage {k} {verb} the {label} to about {fmt(round(t_est, 1))} °C, below "
            f"{fmt(round(t_lo, 2))} °C (freezing)")


def _water_side(t_water_in, water_flow_m3_h, glycol_fraction, glycol):
    """Mass flow [kg/s] and inlet enthalpy [kJ/kg] of the client's circuit, errors naming our arguments."""
    check_range("water_flow_m3_h", water_flow_m3_h, 0.0, None, "m³/h", lo_open=True)
    m = _w.mass_flow(water_flow_m3_h, t_water_in, glycol_fraction, glycol, t_name="t_water_in")
    h = _w.enthalpy(t_water_in, glycol_fraction, glycol, name="t_water_in")
    return m, h


def _rate_stream(k, t, h, m, th, ch, ua, arrangement, bounds, glycol_fraction, glycol) -> dict:
    """One rated stream stage; the mean cp is iterated until ε-NTU duty and enthalpy rise agree."""
    cp = _w.hw_cp(t, glycol_fraction, glycol)
    if ua == 0:
        return {"kind": "stream", "duty": 0.0, "dump": 0.0, "t_in": t, "t_out": t, "t_hot_in": th,
                "t_hot_out": th, "c_water": m * cp, "h_out": h}
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
    return {"kind": "stream", "duty": q, "dump": 0.0, "t_in": t, "t_out": t_out, "t_hot_in": th,
            "t_hot_out": t_hot_out, "c_water": m * cp, "h_out": h_out}


#: stage-kind words of HW_CHAIN_RATE (blank = "stream")
STAGE_KINDS = ("stream", "loop")
_KIND_ALIASES = {"rated": "stream", "source": "stream", "enginecircuit": "loop", "engineloop": "loop",
                 "engine": "loop", "circuit": "loop"}


def _kind_word(k: int, v) -> str:
    if v is None or (isinstance(v, str) and v.strip() == ""):
        return "stream"
    if isinstance(v, str):
        w = "".join(v.split()).lower()
        w = _KIND_ALIASES.get(w, w)
        if w in STAGE_KINDS:
            return w
    raise CellTypeError(f'stage_kinds: stage {k} {v!r} is not "stream" or "loop"')


def _per_stage(name: str, values, n: int) -> list:
    """A per-stage list of n cells: one cell for all, or one per stage (None when omitted)."""
    if values is None:
        return [None] * n
    values = list(values)
    if len(values) == 1 and n > 1:
        return values * n
    if len(values) != n:
        raise CellInputError(f"{name}: {len(values)} cells given, the chain has {n} stages; "
                             "give one per stage or one for all")
    return values


def rate_chain_water(t_water_in: float, water_flow_m3_h: float, t_source_in, c_source_kw_k, ua_kw_k,
                     arrangement: str = "counter", glycol_fraction: float = 0.0,
                     glycol: str = "ethylene", stage_kinds=None, duties_kw=None,
                     t_engine_in_max=None, engine_flow_m3_h=None,
                     engine_glycol_fraction: float = 0.0, engine_glycol: str = "ethylene") -> list:
    """Rate a hot-water chain of rated streams and engine loops, water properties from :mod:`.water`.

    Parameters
    ----------
    t_water_in : float
        Client's water entering the first stage (the return) [°C].
    water_flow_m3_h : float
        Circuit volume flow measured at t_water_in [m³/h].
    t_source_in, c_source_kw_k, ua_kw_k : sequence of float or None
        Per stage in water-flow order: source (hot-side) inlet temperature
        [°C], source capacity rate [kW/K] (both ignored for loop stages), UA
        [kW/K] (blank = 0 = no exchange).
    arrangement : str
        Flow arrangement of every stage.
    glycol_fraction, glycol : float, str
        Glycol of the client's circuit [-].
    stage_kinds : sequence of str or None, optional
        Per stage ``"stream"`` (a rated stream: fixed inlet temperature and
        capacity rate) or ``"loop"`` (an engine cooling circuit at fixed duty,
        :mod:`.engine_loop`); blank or omitted = ``"stream"``.
    duties_kw, t_engine_in_max, engine_flow_m3_h : sequence or None, optional
        Per loop stage: the duty the engine rejects [kW], the maximum engine
        inlet temperature [°C] and the circuit's volume flow measured there
        [m³/h]; one cell for all stages is accepted for the last two.
    engine_glycol_fraction, engine_glycol : float, str
        Glycol of the engine circuits [-].

    Returns
    -------
    list of dict
        Per stage: ``kind``, ``duty`` (heat into the client's water) and
        ``dump`` (a loop's heat to its dump cooler) [kW], ``t_in``, ``t_out``
        (water) and ``t_hot_in``, ``t_hot_out`` (source; for a loop the engine
        outlet and the circuit leaving the exchanger) [°C], ``c_water`` [kW/K].

    Raises
    ------
    CellInputError
        Naming the stage where the water would leave its liquid range
        (boiling at 3 bar(a) = 133.52 °C for water; 100 °C for glycol), or
        where a loop's data are missing or the water reaching it is not
        below its engine outlet temperature.

    Notes
    -----
    A stream stage is rated by :func:`rate_stage` with the mean cp of the
    water iterated until the ε-NTU duty and the enthalpy rise agree.  A loop
    stage gives ``min(duty, ε·C_min·(t_engine_out − t_water))`` to the water
    and the rest to its dump cooler (:func:`.engine_loop.loop_in_chain`), so
    it never gives more than its duty; water reaching a loop at or above its
    engine outlet temperature gets nothing (the thermostat sends the whole
    circuit to the dump cooler, common practice).

    References
    ----------
    See :func:`rate_stage`, :func:`cellfuncs.recovery.engine_loop.engine_loop`
    and :func:`cellfuncs.recovery.water.hw_cp`.
    """
    from cellfuncs.recovery.engine_loop import loop_in_chain

    arrangement = _check_arrangement(arrangement)
    m, h = _water_side(t_water_in, water_flow_m3_h, glycol_fraction, glycol)
    bounds = _w.enthalpy_bounds(glycol_fraction, glycol)
    th_all = list(t_source_in)
    n = len(th_all)
    kinds = [_kind_word(k, v) for k, v in enumerate(_per_stage("stage_kinds", stage_kinds, n), start=1)]
    if stage_kinds is not None and len(list(stage_kinds)) == 1 and n > 1:
        raise CellInputError(f"stage_kinds: 1 cell given, the chain has {n} stages; give one per stage")
    loops = {k for k, w in enumerate(kinds, start=1) if w == "loop"}
    stages = _stage_data(th_all, list(c_source_kw_k), list(ua_kw_k), loops)
    if loops:
        duties = list(duties_kw) if duties_kw is not None else [None] * n
        if len(duties) != n:
            raise CellInputError(f"duties_kw: {len(duties)} cells given, the chain has {n} stages; "
                                 "give one per stage (blank for streams)")
        t_max = _per_stage("t_engine_in_max", t_engine_in_max, n)
        flows = _per_stage("engine_flow_m3_h", engine_flow_m3_h, n)
    t = float(t_water_in)
    out = []
    for k, (th, ch, ua) in enumerate(stages, start=1):
        if k not in loops:
            r = _rate_stream(k, t, h, m, th, ch, ua, arrangement, bounds, glycol_fraction, glycol)
        else:
            where = f"stage {k}"
            for name, v in (("duties_kw", duties[k - 1]), ("t_engine_in_max", t_max[k - 1]),
                            ("engine_flow_m3_h", flows[k - 1])):
                if v is None:
                    raise CellInputError(f"{name}: {where} is blank but the stage is a loop")
            q = check_range("duties_kw", duties[k - 1], 0.0, None, "kW", where=f"stage {k}")
            ua_v = 0.0 if ua is None else check_range("ua_kw_k", ua, 0.0, None, "kW/K", where=f"stage {k}")
            check_range("engine_flow_m3_h", flows[k - 1], 0.0, None, "m³/h", lo_open=True, where=f"stage {k}")
            m_e = _w.mass_flow(flows[k - 1], t_max[k - 1], engine_glycol_fraction, engine_glycol,
                               t_name=f"t_engine_in_max (stage {k})")
            lp = loop_in_chain(q, float(t_max[k - 1]), m_e, (engine_glycol_fraction, engine_glycol), t, h, m,
                               (glycol_fraction, glycol), ua_v, arrangement, where, bypass_when_hot=True)
            t_out = lp["t_water_out"]
            r = {"kind": "loop", "duty": lp["to_client"], "dump": lp["dump"], "t_in": t, "t_out": t_out,
                 "t_hot_in": lp["t_engine_out"], "t_hot_out": lp["t_hot_out"],
                 "c_water": lp["to_client"] / (t_out - t) if t_out != t else m * _w.hw_cp(t, glycol_fraction,
                                                                                           glycol),
                 "h_out": lp["h_water_out"]}
        out.append(r)
        h, t = r.pop("h_out"), r["t_out"]
    return out


def chain_temperatures(t_water_in: float, water_flow_m3_h: float, duties_kw, glycol_fraction: float = 0.0,
                       glycol: str = "ethylene") -> list:
    """Water temperature after each stage when given duties are added in order.

    Parameters
    ----------
    t_water_in : float
        Client's water entering the first stage (the return) [°C].
    water_flow_m3_h : float
        Circuit volume flow measured at t_water_in [m³/h].
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
    m, h = _water_side(t_water_in, water_flow_m3_h, glycol_fraction, glycol)
    bounds = _w.enthalpy_bounds(glycol_fraction, glycol)
    t = float(t_water_in)
    out = []
    for k, q in enumerate(duties_kw, start=1):
        q = 0.0 if q is None else check_range("duties_kw", q, None, None, "kW")
        if q != 0:
            h += q / m
            _beyond("duties_kw", k, h, bounds, "heats" if q > 0 else "cools")
            t = _w.temperature_from_enthalpy(h, t, glycol_fraction, glycol)
        out.append(t)
    return out


def chain_check(t_water_in: float, water_flow_m3_h: float, duties_kw, t_source_in,
                min_approach_k: float = 5.0, glycol_fraction: float = 0.0, glycol: str = "ethylene",
                t_source_out=None) -> str:
    """Check both ends of every stage of a hot-water chain.

    Parameters
    ----------
    t_water_in : float
        Client's water entering the first stage (the return) [°C].
    water_flow_m3_h : float
        Circuit volume flow measured at t_water_in [m³/h].
    duties_kw : sequence of float or None
        Duty of each stage in water-flow order [kW].
    t_source_in : sequence of float or None
        Hot end: the source's inlet (hottest) temperature of each stage, for an
        engine loop its engine outlet temperature [°C] (one per stage, or one
        for all).
    min_approach_k : float
        Smallest allowed temperature difference at either end of a stage [K].
    glycol_fraction, glycol : float, str
        Glycol of the client's circuit [-].
    t_source_out : sequence of float or None, optional
        Cold end: the source's outlet (coldest) temperature of each stage, for
        an engine loop its maximum engine inlet temperature [°C] (one per
        stage or one for all; omitted or blank = that end is not checked).

    Returns
    -------
    str
        ``"OK"``, or one line naming the first stage where the water leaves
        above ``t_source_in − min_approach_k`` (hot end), where the source's
        outlet is below the water entering the stage ``+ min_approach_k``
        (cold end), or where the water would boil.

    Notes
    -----
    Only stages with a positive duty are checked against their source; a
    stage with a negative duty is a cooler and is not judged here.  The two
    ends are those of a counterflow exchanger: the water leaving meets the
    source entering, the water entering meets the source leaving.

    References
    ----------
    See :func:`cellfuncs.recovery.water.hw_cp` (water and glycol properties).
    """
    approach = check_range("min_approach_k", min_approach_k, 0.0, None, "K")
    duties = list(duties_kw)
    n = len(duties)
    t_max = _per_stage("t_source_in", list(t_source_in), n)
    t_low = _per_stage("t_source_out", t_source_out, n)
    m, h = _water_side(t_water_in, water_flow_m3_h, glycol_fraction, glycol)
    t_lo, t_hi, h_lo, h_hi, cp_lo, cp_hi, label, why = _w.enthalpy_bounds(glycol_fraction, glycol)
    t = float(t_water_in)
    for k, (q, tm, tl) in enumerate(zip(duties, t_max, t_low), start=1):
        q = 0.0 if q is None else check_range("duties_kw", q, None, None, "kW")
        if q == 0:
            continue
        t_enter = t
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
                raise CellInputError(f"t_source_in: stage {k} is blank but has a duty of {fmt(q)} kW")
            check_range("t_source_in", tm, -273.15, None, "°C", lo_open=True)
            limit = tm - approach
            if t > limit + 1e-9:
                return (f"stage {k} hot end: water leaves at {fmt(round(t, 2))} °C, above "
                        f"{fmt(round(limit, 2))} °C (source in {fmt(tm)} °C − {fmt(approach)} K); "
                        "reorder, split or bypass")
            if tl is not None:
                check_range("t_source_out", tl, -273.15, None, "°C", lo_open=True)
                low = t_enter + approach
                if tl < low - 1e-9:
                    return (f"stage {k} cold end: source leaves at {fmt(round(tl, 2))} °C, below "
                            f"{fmt(round(low, 2))} °C (water in {fmt(round(t_enter, 2))} °C + "
                            f"{fmt(approach)} K); reorder, or give this heat to a dump cooler")
    return "OK"
