"""LMTD correction factor F for shell-and-tube and crossflow arrangements.

F is the ratio of the UA a counterflow exchanger needs to the UA the actual
arrangement needs for the same four terminal temperatures, so
q = UA·F·LMTD_counter.  With the cold-side temperature effectiveness
P = (t_cold_out − t_cold_in)/(t_hot_in − t_cold_in) and
R = (t_hot_in − t_hot_out)/(t_cold_out − t_cold_in), and written for the
fluid with the smaller capacity rate (ε = P, Cr = R when R <= 1; ε = P·R,
Cr = 1/R otherwise),

    F = NTU_counter(ε, Cr) / NTU_arrangement(ε, Cr).

For one shell this is Bowman, Mueller & Nagle (1940):

    F = √(R²+1)/(R−1) · ln((1−P)/(1−PR))
        / ln((2 − P(R+1−√(R²+1))) / (2 − P(R+1+√(R²+1)))),

and for N shells in series the same with P replaced by the one-shell P1
(Fakheri 2003 gives the two combined in one expression).  The NTU functions
of :mod:`.effectiveness` are written to be exact at R = 1 and R = 0, so no
separate R = 1 formula is needed.  Crossflow arrangements use their ε-NTU
relations in the same ratio.
"""

from __future__ import annotations

from cellfuncs.errors import CellInputError, fmt
from cellfuncs.heat_transfer import effectiveness as _eff
from cellfuncs.heat_transfer.arrangements import KNOWN, advice, describe, parse
from cellfuncs.heat_transfer.lmtd import check_streams, terminal_differences

__all__ = ["correction_factor", "capacity_terms", "f_of_streams"]

#: relative distance to the largest effectiveness below which a P counts as at the limit
#: (rounding of the four temperatures, ~1e-16, is far below; any real design far above)
_AT_LIMIT = 1e-12


def capacity_terms(thi, tho, tci, tco):
    """ε, Cr, P and R of four (checked) stream temperatures.

    Returns
    -------
    tuple
        (ε [-], Cr [-], P [-], R [-]); ε and Cr refer to the stream with the
        smaller capacity rate (the larger temperature change).

    References
    ----------
    Bowman, R. A., Mueller, A. C., Nagle, W. M. (1940). Mean temperature
    difference in design. Trans. ASME 62, 283-294.
    Shah, R. K., Sekulic, D. P. (2003). Fundamentals of Heat Exchanger
    Design, section 3.7 (P, R and the F factor; from memory).
    """
    dh = thi - tho
    dc = tco - tci
    span = thi - tci
    p = dc / span
    r = dh / dc if dc > 0.0 else float("inf")
    if dc >= dh:
        return dc / span, dh / dc, p, r
    return dh / span, dc / dh, p, r


def _infeasible(arr, cr, p, r, cold_is_cmin):
    if arr == "cross" and cr > 0.0:
        return (f"t_hot_out, t_cold_out: {describe(arr)} would need NTU above "
                f"{fmt(_eff.NTU_MAX_CROSS)} for P = {p:.4f} at R = {r:.4f}; "
                f"{advice(arr)}")
    emax = _eff.epsilon_max(cr, arr)
    pmax = emax if cold_is_cmin else emax * cr  # ε = P·R when hot is Cmin
    ps, pms = f"{p:.2f}", f"{pmax:.2f}"
    if ps == pms:
        ps, pms = f"{p:.4f}", f"{pmax:.4f}"
    if ps == pms:
        return (f"t_hot_out, t_cold_out: P = {ps} at R = {r:.2f} is the limit of {describe(arr)}, "
                f"reached only with an infinite area; {advice(arr)}")
    return (f"t_hot_out, t_cold_out: {describe(arr)} cannot reach P = {ps} at "
            f"R = {r:.2f} (at most P = {pms}); {advice(arr)}")


def f_of_streams(thi, tho, tci, tco, arr):
    """F for checked floats and a canonical arrangement word [-].

    References
    ----------
    Bowman, R. A., Mueller, A. C., Nagle, W. M. (1940). Mean temperature
    difference in design. Trans. ASME 62, 283-294.
    Shah, R. K., Sekulic, D. P. (2003). Fundamentals of Heat Exchanger
    Design, section 3.7 (P, R and the F factor; from memory).
    """
    if not (thi > tco and tho > tci):
        terminal_differences(thi, tho, tci, tco, "counter")  # raises, naming the cross
    if arr == "counter":
        return 1.0
    dh = thi - tho
    dc = tco - tci
    if dc >= dh:  # cold stream has the smaller capacity rate
        e, cr = dc / (thi - tci), dh / dc
    else:
        e, cr = dh / (thi - tci), dc / dh
    if cr == 0.0:  # one stream isothermal: every arrangement is counterflow
        return 1.0
    if arr != "cross" and e >= _eff.epsilon_max(cr, arr) * (1.0 - _AT_LIMIT):
        # at the arrangement's largest effectiveness NTU is infinite and F = 0; a P equal to
        # the limit to rounding must not come back as a small but finite F
        _, _, p, r = capacity_terms(thi, tho, tci, tco)
        raise CellInputError(_infeasible(arr, cr, p, r, dc >= dh))
    try:
        ntu_a = _eff._ntu_core(e, cr, arr)
    except _eff._Infeasible:
        _, _, p, r = capacity_terms(thi, tho, tci, tco)
        raise CellInputError(_infeasible(arr, cr, p, r, dc >= dh)) from None
    return _eff._ntu_counter(e, cr) / ntu_a


def correction_factor(t_hot_in, t_hot_out, t_cold_in, t_cold_out, arrangement="1-2") -> float:
    """LMTD correction factor F of an arrangement relative to counterflow [-].

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
    arrangement : str
        ``"1-2"`` (default), ``"2-4"``, ``"3-6"``, ``"4-8"``, ``"cross"``,
        ``"cross-cmin-mixed"``, ``"cross-cmax-mixed"``, ``"parallel"`` or
        ``"counter"`` (F = 1).

    Returns
    -------
    float
        F with q = UA·F·LMTD_counter, 0 < F <= 1 [-]; 1 when one stream does
        not change temperature.

    Raises
    ------
    CellInputError
        Temperature cross of the counterflow terminal differences, neither
        stream changing temperature, or a duty the arrangement cannot reach at
        any area ("a 1-2 exchanger cannot reach P = 0.60 at R = 1.50 (at most
        P = 0.46); use more shells").

    Notes
    -----
    Bowman, Mueller & Nagle (1940) for one shell pass with an even number of
    tube passes; N shell passes are N such shells in series, each with UA/N.
    R = 1 is exact (no limit formula).  F is symmetric in the two streams.
    Designs with F below about 0.75–0.8 are usually avoided (common
    practice): F falls steeply there and small deviations in the temperatures
    make the exchanger infeasible.

    References
    ----------
    Bowman, R. A., Mueller, A. C., Nagle, W. M. (1940). Mean temperature
    difference in design. Trans. ASME 62, 283-294.
    Fakheri, A. (2003). A general expression for the determination of the log
    mean temperature correction factor for shell and tube heat exchangers.
    J. Heat Transfer 125(3), 527-530.
    """
    arr = (arrangement if type(arrangement) is str and arrangement in KNOWN
           else parse(arrangement))
    thi, tho, tci, tco = check_streams(t_hot_in, t_hot_out, t_cold_in, t_cold_out,
                                       strict=True)
    return f_of_streams(thi, tho, tci, tco, arr)
