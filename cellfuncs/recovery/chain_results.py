"""Hot-water chains as cells ask for them: one stage's value, every stage, or a chain total.

HW_CHAIN, HW_CHAIN_RATE and HW_CHAIN_CHECK call these; the physics of the
chain (stage by stage rating, engine loops, the checks) is in
:mod:`cellfuncs.recovery.chain`.  Stage lists arrive as sequences of float and
None; ``stage`` (1-based) picks one value so that no workbook needs a legacy
array formula; a rated chain is solved once per set of inputs however many
cells ask for a part of it.
"""

from __future__ import annotations

import math
from functools import lru_cache

from cellfuncs.errors import CellInputError, CellTypeError
from cellfuncs.recovery.chain import chain_check, chain_temperatures, rate_chain_water

__all__ = ["hw_chain", "hw_chain_rate", "hw_chain_check", "RATE_RESULTS"]


def _stage_values(name: str, values) -> list:
    """A stage list as floats and None (blank); a single number counts as one stage."""
    if values is None:
        raise CellTypeError(f"{name}: no stages given")
    if isinstance(values, (int, float)) and not isinstance(values, bool):
        return [float(values)]
    out = list(values)
    if not out:
        raise CellTypeError(f"{name}: no stages given")
    return out


def _optional_values(name: str, values):
    return None if values is None else _stage_values(name, values)


def hw_chain(t_water_in, water_flow_m3_h, duties_kw, glycol_fraction=0.0, glycol="ethylene", stage=None):
    """Water temperature after each stage of a chain of given duties, or after one stage.

    Parameters
    ----------
    t_water_in : float
        Client's water entering the first stage [°C].
    water_flow_m3_h : float
        Circuit volume flow measured at t_water_in [m³/h].
    duties_kw : sequence of float or None
        Duty of each stage in water-flow order, None = no duty [kW].
    glycol_fraction, glycol : float, str
        Glycol mass fraction [-] and glycol word.
    stage : int or None
        1-based stage; None returns every stage.

    Returns
    -------
    list of float or float
        Temperature after each stage, or after ``stage`` [°C].

    References
    ----------
    .. [1] First law of thermodynamics (steady flow), see :func:`chain_temperatures`.
    """
    temps = chain_temperatures(t_water_in, water_flow_m3_h, _stage_values("duties_kw", duties_kw),
                               glycol_fraction, glycol)
    if stage is None:
        return temps
    k = _check_stage(stage, len(temps))
    return temps[k - 1]


def _check_stage(stage, n: int) -> int:
    if isinstance(stage, bool) or not isinstance(stage, (int, float)) or stage != int(stage):
        raise CellTypeError(f"stage: {stage!r} is not a whole number")
    k = int(stage)
    if not 1 <= k <= n:
        raise CellInputError(f"stage: {k} is not between 1 and {n} (the number of stages)")
    return k


#: result words of HW_CHAIN_RATE: per stage, then totals over the chain
RATE_RESULTS = ("t_out", "duty", "t_hot_out", "dump", "t_in", "t_hot_in", "total_duty", "total_dump")
_RESULT_ALIASES = {"t_water_out": "t_out", "t_source_out": "t_hot_out", "t_water_in": "t_in",
                   "t_source_in": "t_hot_in", "q": "duty"}


def _rate_result(result) -> str:
    if isinstance(result, str):
        w = "".join(result.split()).lower()
        w = _RESULT_ALIASES.get(w, w)
        if w in RATE_RESULTS:
            return w
    raise CellTypeError(f"result: {result!r} is not one of " + ", ".join(f'"{o}"' for o in RATE_RESULTS))


def _as_tuple(values):
    return None if values is None else tuple(values)


@lru_cache(maxsize=256)
def _rated_chain(t_water_in, water_flow_m3_h, th, ch, ua, arrangement, glycol_fraction, glycol, kinds,
                 duties, t_engine_in_max, engine_flow, engine_glycol_fraction, engine_glycol):
    """The rated chain for one set of inputs, solved once however many cells ask for a part of it.

    A workbook asks for each stage's temperature, duty and dump in separate cells (the per-cell
    form); all take the same solution.  The stage dicts are only read by the callers.  Errors are
    not cached (they are raised again).
    """
    return tuple(rate_chain_water(t_water_in, water_flow_m3_h, list(th), list(ch), list(ua), arrangement,
                                  glycol_fraction, glycol, None if kinds is None else list(kinds),
                                  None if duties is None else list(duties),
                                  None if t_engine_in_max is None else list(t_engine_in_max),
                                  None if engine_flow is None else list(engine_flow),
                                  engine_glycol_fraction, engine_glycol))


def hw_chain_rate(t_water_in, water_flow_m3_h, t_source_in, c_source_kw_k, ua_kw_k, arrangement="counter",
                  result="t_out", glycol_fraction=0.0, glycol="ethylene", stage_kinds=None, duties_kw=None,
                  t_engine_in_max=None, engine_flow_m3_h=None, stage=None, engine_glycol_fraction=0.0,
                  engine_glycol="ethylene"):
    """One result of :func:`rate_chain_water`: per stage, one stage's value, or a chain total.

    Parameters are those of :func:`rate_chain_water` (stage lists as sequences
    of float or None, ``stage_kinds`` a sequence of words or None), plus
    ``result`` (one of :data:`RATE_RESULTS`) and ``stage`` (1-based, or None for
    every stage).

    Returns
    -------
    list or float
        Per stage: water or source temperature [°C], duty or dump [kW] ("" where
        a stage has no such value); one stage's value; or a chain total [kW].

    References
    ----------
    .. [1] See :func:`rate_chain_water` (ε-NTU rating, first law).
    """
    word = _rate_result(result)
    th = _stage_values("t_source_in", t_source_in)
    ch = _stage_values("c_source_kw_k", c_source_kw_k)
    ua = _stage_values("ua_kw_k", ua_kw_k)
    kinds = [stage_kinds] if isinstance(stage_kinds, str) else stage_kinds
    res = _rated_chain(t_water_in, water_flow_m3_h, tuple(th), tuple(ch), tuple(ua), arrangement,
                       glycol_fraction, glycol, None if kinds is None else tuple(kinds),
                       _as_tuple(_optional_values("duties_kw", duties_kw)),
                       _as_tuple(_optional_values("t_engine_in_max", t_engine_in_max)),
                       _as_tuple(_optional_values("engine_flow_m3_h", engine_flow_m3_h)),
                       engine_glycol_fraction, engine_glycol)
    if word.startswith("total_"):
        if stage is not None:
            raise CellInputError(f"stage: {stage!r} given with result \"{word}\"; a total has no stage")
        return math.fsum(r[word[6:]] for r in res)
    vals = [r[word] if r[word] is not None else "" for r in res]
    if stage is not None:
        return vals[_check_stage(stage, len(vals)) - 1]
    return vals


def hw_chain_check(t_water_in, water_flow_m3_h, duties_kw, t_source_in, min_approach_k=5.0,
                   glycol_fraction=0.0, glycol="ethylene", t_source_out=None):
    """"OK" or the first finding at either end of a stage (one line); see :func:`chain_check`.

    References
    ----------
    .. [1] See :func:`chain_check` (approach at both ends of each stage, common practice).
    """
    cells = _stage_values("duties_kw", duties_kw)
    tmax = _stage_values("t_source_in", t_source_in)
    tlow = _optional_values("t_source_out", t_source_out)
    return chain_check(t_water_in, water_flow_m3_h, cells, tmax, min_approach_k, glycol_fraction, glycol, tlow)
