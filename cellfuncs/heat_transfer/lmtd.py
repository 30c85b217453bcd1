"""Log-mean temperature difference of a two-stream heat exchanger.

The textbook form (ΔT1 − ΔT2)/ln(ΔT1/ΔT2) loses all its digits as the two
terminal differences approach each other.  With the mean m = (ΔT1 + ΔT2)/2 and
the relative difference x = (ΔT1 − ΔT2)/(ΔT1 + ΔT2) it is exactly

    LMTD = m · x / atanh(x),

because ln(ΔT1/ΔT2) = ln((1 + x)/(1 − x)) = 2·atanh(x).  atanh is accurate
for small x, so the result stays correct to rounding as ΔT1 → ΔT2 and is m
when they are equal.
"""

from __future__ import annotations

import math

from cellfuncs.errors import CellInputError, check_range, fmt
from cellfuncs.heat_transfer.arrangements import FLOWS, parse

__all__ = ["lmtd", "lmtd_of_differences", "check_streams", "terminal_differences",
           "ABS_ZERO_C", "T_MAX_C"]

#: lowest temperature accepted [°C]
ABS_ZERO_C = -273.15
#: highest temperature accepted [°C]; far above any heat exchanger, it keeps
#: differences of huge inputs from overflowing
T_MAX_C = 1.0e4

_atanh = math.atanh
_log = math.log


def lmtd_of_differences(dt1: float, dt2: float) -> float:
    """Log mean of two positive temperature differences [K].

    Parameters
    ----------
    dt1, dt2 : float
        Terminal temperature differences, both > 0 [K].

    Returns
    -------
    float
        (dt1 − dt2)/ln(dt1/dt2), evaluated as m·x/atanh(x) when the ratio
        lies within 1/3 to 3 [K].

    References
    ----------
    Bergman, T. L., Lavine, A. S., Incropera, F. P., DeWitt, D. P. (2011).
    Fundamentals of Heat and Mass Transfer, 7th ed., section 11.3.
    """
    s = dt1 + dt2
    d = dt1 - dt2
    if d == 0.0:
        return dt1
    x = d / s
    if -0.5 < x < 0.5:  # ratio within 1/3..3: the atanh form keeps every digit
        return 0.5 * d / _atanh(x)
    return d / (_log(dt1) - _log(dt2))  # far apart: no cancellation


def check_streams(t_hot_in, t_hot_out, t_cold_in, t_cold_out, strict: bool = False):
    """Check the four stream temperatures of an exchanger and return them as floats.

    Parameters
    ----------
    t_hot_in, t_hot_out, t_cold_in, t_cold_out : float
        Stream temperatures [°C].
    strict : bool
        Also require that at least one stream changes temperature.

    Raises
    ------
    CellInputError
        Below absolute zero or above :data:`T_MAX_C`, a hot stream that warms
        up or a cold stream that cools down.
    """
    if (type(t_hot_in) is float and type(t_hot_out) is float
            and type(t_cold_in) is float and type(t_cold_out) is float
            and ABS_ZERO_C <= t_cold_in <= t_cold_out <= T_MAX_C
            and ABS_ZERO_C <= t_hot_out <= t_hot_in <= T_MAX_C
            and (not strict or t_hot_out != t_hot_in or t_cold_out != t_cold_in)):
        return t_hot_in, t_hot_out, t_cold_in, t_cold_out  # fast path: all valid
    thi = check_range("t_hot_in", t_hot_in, ABS_ZERO_C, T_MAX_C, "°C")
    tho = check_range("t_hot_out", t_hot_out, ABS_ZERO_C, T_MAX_C, "°C")
    tci = check_range("t_cold_in", t_cold_in, ABS_ZERO_C, T_MAX_C, "°C")
    tco = check_range("t_cold_out", t_cold_out, ABS_ZERO_C, T_MAX_C, "°C")
    if tho > thi:
        raise CellInputError(
            f"t_hot_out: {fmt(tho)} °C is above t_hot_in {fmt(thi)} °C "
            "(the hot stream must cool down)")
    if tco < tci:
        raise CellInputError(
            f"t_cold_out: {fmt(tco)} °C is below t_cold_in {fmt(tci)} °C "
            "(the cold stream must warm up)")
    if strict and tho == thi and tco == tci:
        raise CellInputError(
            f"t_hot_out, t_cold_out: neither stream changes temperature "
            f"(hot {fmt(thi)} °C, cold {fmt(tci)} °C), so no heat is exchanged")
    return thi, tho, tci, tco


def terminal_differences(thi, tho, tci, tco, flow):
    """ΔT1, ΔT2 [K] for counter or parallel flow, raising on a temperature cross."""
    if flow == "counter":
        dt1 = thi - tco
        dt2 = tho - tci
        if dt1 <= 0.0:
            rel = "above" if dt1 < 0 else "equal to"
            raise CellInputError(
                f"t_cold_out: {fmt(tco)} °C is {rel} t_hot_in {fmt(thi)} °C "
                "(temperature cross)")
        if dt2 <= 0.0:
            rel = "below" if dt2 < 0 else "equal to"
            raise CellInputError(
                f"t_hot_out: {fmt(tho)} °C is {rel} t_cold_in {fmt(tci)} °C "
                "(temperature cross)")
    else:
        dt1 = thi - tci
        dt2 = tho - tco
        if dt1 <= 0.0:
            rel = "below" if dt1 < 0 else "equal to"
            raise CellInputError(
                f"t_hot_in: {fmt(thi)} °C is {rel} t_cold_in {fmt(tci)} °C "
                "(temperature cross)")
        if dt2 <= 0.0:
            rel = "below" if dt2 < 0 else "equal to"
            raise CellInputError(
                f"t_hot_out: {fmt(tho)} °C is {rel} t_cold_out {fmt(tco)} °C "
                "(temperature cross: in parallel flow the cold outlet stays "
                "below the hot outlet)")
    return dt1, dt2


def lmtd(t_hot_in, t_hot_out, t_cold_in, t_cold_out, flow="counter") -> float:
    """Log-mean temperature difference of a counterflow or parallel-flow exchanger.

    Parameters
    ----------
    t_hot_in : float
        Hot stream inlet temperature [°C].
    t_hot_out : float
        Hot stream outlet temperature, <= t_hot_in [°C].
    t_cold_in : float
        Cold stream inlet temperature [°C].
    t_cold_out : float
        Cold stream outlet temperature, >= t_cold_in [°C].
    flow : str
        ``"counter"`` (ΔT1 = t_hot_in − t_cold_out, ΔT2 = t_hot_out − t_cold_in)
        or ``"parallel"`` (ΔT1 = t_hot_in − t_cold_in,
        ΔT2 = t_hot_out − t_cold_out).

    Returns
    -------
    float
        LMTD = (ΔT1 − ΔT2)/ln(ΔT1/ΔT2) [K]; ΔT1 when ΔT1 = ΔT2.

    Raises
    ------
    CellInputError
        A terminal difference that is zero or negative (temperature cross),
        naming the two temperatures; a hot stream that warms or a cold stream
        that cools.

    Notes
    -----
    Evaluated as m·x/atanh(x) with m = (ΔT1 + ΔT2)/2 and
    x = (ΔT1 − ΔT2)/(ΔT1 + ΔT2): exact to rounding for any ratio of the
    terminal differences, including ΔT1 → ΔT2.  Valid for constant specific
    heats and overall heat-transfer coefficient along the exchanger.

    References
    ----------
    Bergman, T. L., Lavine, A. S., Incropera, F. P., DeWitt, D. P. (2011).
    Fundamentals of Heat and Mass Transfer, 7th ed., Wiley, section 11.3.
    """
    if flow != "counter" and flow != "parallel":
        flow = parse(flow, "flow", FLOWS)
    thi, tho, tci, tco = check_streams(t_hot_in, t_hot_out, t_cold_in, t_cold_out)
    if flow == "counter":
        dt1, dt2 = thi - tco, tho - tci
    else:
        dt1, dt2 = thi - tci, tho - tco
    if not (dt1 > 0.0 and dt2 > 0.0):
        terminal_differences(thi, tho, tci, tco, flow)  # raises, naming the cross
    return lmtd_of_differences(dt1, dt2)
