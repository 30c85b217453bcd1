"""Sizing (required UA and area) and rating (duty and outlets) of an exchanger.

Sizing: q = UA·F·LMTD_counter, so UA = q/(F·LMTD_counter) and
A = UA/U.  Rating: NTU = UA/Cmin, ε from :mod:`.effectiveness`,
q = ε·Cmin·(t_hot_in − t_cold_in), outlets from the energy balance.
"""

from __future__ import annotations

import math

from cellfuncs.errors import CellInputError, CellTypeError, check_range, fmt
from cellfuncs.heat_transfer import effectiveness as _eff
from cellfuncs.heat_transfer.arrangements import KNOWN, RATE_OUTPUTS, parse
from cellfuncs.heat_transfer.correction import f_of_streams
from cellfuncs.heat_transfer.lmtd import (
    ABS_ZERO_C,
    T_MAX_C,
    check_streams,
    lmtd_of_differences,
    terminal_differences,
)

__all__ = ["ua_required", "area_required", "rate_exchanger", "OUTPUTS"]

#: words of the ``output`` argument of :func:`rate_exchanger`
OUTPUTS = RATE_OUTPUTS

_isfinite = math.isfinite


def _ua(duty_kw, t_hot_in, t_hot_out, t_cold_in, t_cold_out, arrangement):
    arr = (arrangement if type(arrangement) is str and arrangement in KNOWN
           else parse(arrangement))
    q = check_range("duty_kw", duty_kw, 0.0, None, "kW", lo_open=True)
    thi, tho, tci, tco = check_streams(t_hot_in, t_hot_out, t_cold_in, t_cold_out,
                                       strict=True)
    if arr == "parallel":
        mtd = lmtd_of_differences(*terminal_differences(thi, tho, tci, tco, "parallel"))
    else:
        f = f_of_streams(thi, tho, tci, tco, arr)  # also checks the cross
        mtd = f * lmtd_of_differences(*terminal_differences(thi, tho, tci, tco, "counter"))
    return q, q / mtd


def ua_required(duty_kw, t_hot_in, t_hot_out, t_cold_in, t_cold_out,
                arrangement="counter") -> float:
    """UA an exchanger needs for a duty between four stream temperatures [kW/K].

    Parameters
    ----------
    duty_kw : float
        Heat duty, > 0 [kW].
    t_hot_in, t_hot_out : float
        Hot stream inlet and outlet temperatures [°C].
    t_cold_in, t_cold_out : float
        Cold stream inlet and outlet temperatures [°C].
    arrangement : str
        Arrangement word (default ``"counter"``).

    Returns
    -------
    float
        UA = duty/(F·LMTD_counter) [kW/K] (for ``"parallel"``,
        duty/LMTD_parallel).

    Raises
    ------
    CellInputError
        duty <= 0, a temperature cross, or temperatures the arrangement
        cannot reach (see :func:`.correction.correction_factor`).

    Notes
    -----
    The duty is taken as given; it fixes the capacity rates
    C = duty/ΔT of each stream.  Constant U and specific heats assumed.
    An estimate for tendering: final design follows local codes and
    licensed engineers.

    References
    ----------
    Bergman, T. L. et al. (2011). Fundamentals of Heat and Mass Transfer,
    7th ed., Wiley, sections 11.3 and 11.4.
    """
    q, ua = _ua(duty_kw, t_hot_in, t_hot_out, t_cold_in, t_cold_out, arrangement)
    if not _isfinite(ua):
        raise CellInputError(f"duty_kw: {fmt(q)} kW gives a UA beyond the number range")
    return ua


def area_required(duty_kw, u_w_m2k, t_hot_in, t_hot_out, t_cold_in, t_cold_out,
                  arrangement="counter") -> float:
    """Heat-transfer area an exchanger needs for a duty [m²].

    Parameters
    ----------
    duty_kw : float
        Heat duty, > 0 [kW].
    u_w_m2k : float
        Overall heat-transfer coefficient referred to the area sought, > 0
        [W/(m²·K)].
    t_hot_in, t_hot_out, t_cold_in, t_cold_out : float
        Stream temperatures [°C].
    arrangement : str
        Arrangement word (default ``"counter"``).

    Returns
    -------
    float
        A = 1000·UA/U with UA from :func:`ua_required` [m²].

    Raises
    ------
    CellInputError
        As :func:`ua_required`, and U <= 0.

    Notes
    -----
    U is taken as uniform over the area (clean or with fouling allowance, as
    the user chooses).  An estimate for tendering.

    References
    ----------
    Bergman, T. L. et al. (2011). Fundamentals of Heat and Mass Transfer,
    7th ed., Wiley, Example 11.3.
    """
    u = check_range("u_w_m2k", u_w_m2k, 0.0, None, "W/(m²·K)", lo_open=True)
    q, ua = _ua(duty_kw, t_hot_in, t_hot_out, t_cold_in, t_cold_out, arrangement)
    area = ua * 1000.0 / u
    if not _isfinite(area):
        raise CellInputError(
            f"u_w_m2k: {fmt(u)} W/(m²·K) with duty_kw {fmt(q)} kW gives an area "
            "beyond the number range")
    return area


def rate_exchanger(t_hot_in, t_cold_in, c_hot_kw_k, c_cold_kw_k, ua_kw_k,
                   arrangement="counter", output="duty"):
    """Duty and outlet temperatures of a given exchanger (rating).

    Parameters
    ----------
    t_hot_in : float
        Hot stream inlet temperature, >= t_cold_in [°C].
    t_cold_in : float
        Cold stream inlet temperature [°C].
    c_hot_kw_k : float
        Hot stream capacity rate (mass flow × cp), > 0 [kW/K].
    c_cold_kw_k : float
        Cold stream capacity rate, > 0 [kW/K].
    ua_kw_k : float
        UA of the exchanger, >= 0 [kW/K].
    arrangement : str
        Arrangement word (default ``"counter"``).
    output : str
        ``"duty"`` [kW], ``"t_hot_out"`` [°C], ``"t_cold_out"`` [°C],
        ``"effectiveness"`` [-] or ``"all"``.

    Returns
    -------
    float or list
        The chosen output; for ``"all"`` the list [duty [kW], t_hot_out [°C],
        t_cold_out [°C]].

    Raises
    ------
    CellInputError
        t_hot_in below t_cold_in, capacity rates <= 0, UA < 0, NTU above the
        unmixed-crossflow limit.
    CellTypeError
        Unknown output word.

    Notes
    -----
    NTU = UA/Cmin, Cr = Cmin/Cmax, q = ε(NTU, Cr)·Cmin·(t_hot_in − t_cold_in);
    t_hot_out = t_hot_in − q/C_hot, t_cold_out = t_cold_in + q/C_cold, so the
    energy balance holds to rounding.  With ``"cross-cmin-mixed"`` /
    ``"cross-cmax-mixed"`` the mixed stream is whichever has the smaller /
    larger capacity rate.  A condensing or boiling stream is entered with a
    very large capacity rate.

    References
    ----------
    Bergman, T. L. et al. (2011). Fundamentals of Heat and Mass Transfer,
    7th ed., Wiley, section 11.4.
    """
    arr = (arrangement if type(arrangement) is str and arrangement in KNOWN
           else parse(arrangement))
    out = output if output in OUTPUTS else _parse_output(output)
    thi = check_range("t_hot_in", t_hot_in, ABS_ZERO_C, T_MAX_C, "°C")
    tci = check_range("t_cold_in", t_cold_in, ABS_ZERO_C, T_MAX_C, "°C")
    if thi < tci:
        raise CellInputError(
            f"t_hot_in: {fmt(thi)} °C is below t_cold_in {fmt(tci)} °C "
            "(swap the streams)")
    ch = check_range("c_hot_kw_k", c_hot_kw_k, 0.0, None, "kW/K", lo_open=True)
    cc = check_range("c_cold_kw_k", c_cold_kw_k, 0.0, None, "kW/K", lo_open=True)
    ua = check_range("ua_kw_k", ua_kw_k, 0.0, None, "kW/K")
    if ch <= cc:
        cmin, cmax = ch, cc
    else:
        cmin, cmax = cc, ch
    cr = cmin / cmax
    ntu = ua / cmin
    if not ntu <= 1e300:
        ntu = 1e300  # ε has reached its limit long before
    if arr == "cross" and ntu > _eff.NTU_MAX_CROSS:
        raise CellInputError(
            f"ua_kw_k: NTU = UA/Cmin = {fmt(ntu)} is above {fmt(_eff.NTU_MAX_CROSS)}, "
            "the limit for unmixed crossflow")
    e = _eff._eps_core(ntu, cr, arr)
    if out == "effectiveness":
        return e
    q = e * cmin * (thi - tci)
    if not _isfinite(q):
        raise CellInputError(
            f"c_hot_kw_k, c_cold_kw_k: {fmt(ch)} and {fmt(cc)} kW/K give a duty "
            "beyond the number range")
    if out == "duty":
        return q
    tho = thi - q / ch
    tco = tci + q / cc
    if out == "t_hot_out":
        return tho
    if out == "t_cold_out":
        return tco
    return [q, tho, tco]


def _parse_output(word):
    if isinstance(word, str):
        w = "".join(word.split()).lower()
        if w in OUTPUTS:
            return w
    words = ", ".join(f'"{o}"' for o in OUTPUTS)
    raise CellTypeError(f"output: {word!r} is not one of {words}")
