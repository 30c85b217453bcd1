"""Effectiveness–NTU relations for the arrangements of :mod:`.arrangements`.

Notation: NTU = UA/Cmin [-], Cr = Cmin/Cmax in [0, 1] [-], ε = q/qmax [-].
Every relation is written so that it stays accurate at Cr = 0 and at Cr = 1
without a separate formula: with d = 1 − Cr,

* counterflow   ε = NTU·E(−NTU·d) / (NTU·E(−NTU·d) + exp(−NTU·d))
* parallel      ε = (1 − exp(−NTU(1 + Cr)))/(1 + Cr)
* 1-2 shell     ε1 = 2·t / ((1 + Cr)·t + s),  t = tanh(NTU·s/2), s = √(1 + Cr²)
* N shells      h = N·r·L(w)·E(N·ln(1 + w)),  r = ε1/(1 − ε1), w = r·d,
                ε = h/(1 + h), ε1 at NTU/N
* Cmax mixed    ε = z·E(−Cr·z),  z = 1 − exp(−NTU)
* Cmin mixed    ε = 1 − exp(−NTU·E(−Cr·NTU))
* both unmixed  ε = (1/(Cr·NTU)) Σ_{n>=0} Q(n, NTU)·Q(n, Cr·NTU)

with E(y) = (exp(y) − 1)/y, L(w) = ln(1 + w)/w (both 1 at 0) and
Q(n, x) = 1 − exp(−x)·Σ_{m<=n} x^m/m!, the Poisson survival function.  These
are the textbook relations rearranged (the N-shell one is
ε = (X^N − 1)/(X^N − Cr) with X = (1 − ε1·Cr)/(1 − ε1)), not new physics.
The inverses are closed forms except for unmixed crossflow, which uses a
bracketed Brent root finder.
"""

from __future__ import annotations

import math

from cellfuncs.errors import CellInputError, check_range, fmt
from cellfuncs.heat_transfer.arrangements import KNOWN as _KNOWN
from cellfuncs.heat_transfer.arrangements import SHELLS, advice, describe, parse

__all__ = [
    "epsilon",
    "transfer_units",
    "epsilon_max",
    "NTU_MAX_CROSS",
    "cross_unmixed",
]

_exp = math.exp
_expm1 = math.expm1
_log1p = math.log1p
_sqrt = math.sqrt
_tanh = math.tanh
_atanh = math.atanh
_log = math.log
_lgamma = math.lgamma

#: largest NTU accepted for unmixed crossflow (the series needs ~25·√NTU terms)
NTU_MAX_CROSS = 1.0e5


def _exprel(y: float) -> float:
    """(exp(y) − 1)/y, 1 at y = 0."""
    if y == 0.0:
        return 1.0
    return _expm1(y) / y


def _log1prel(w: float) -> float:
    """ln(1 + w)/w, 1 at w = 0."""
    if w == 0.0:
        return 1.0
    return _log1p(w) / w


# ---------------------------------------------------------------- forward ---

def _eps_counter(ntu, cr):
    x = ntu * (1.0 - cr)
    g = ntu * _exprel(-x)
    return g / (g + _exp(-x))


def _eps_parallel(ntu, cr):
    c = 1.0 + cr
    return -_expm1(-ntu * c) / c


def _eps_one_shell(ntu, cr):
    s = _sqrt(1.0 + cr * cr)
    t = _tanh(0.5 * ntu * s)
    return 2.0 * t / ((1.0 + cr) * t + s)


def _shells_from_r(r, cr, n):
    """N-shell ε from r = ε1/(1 − ε1) of one shell (N >= 2)."""
    w = r * (1.0 - cr)
    big_l = _log1p(w)
    y = n * big_l
    if y > 700.0:  # X^N > e^700: ε = 1 to double precision
        return 1.0
    rel = big_l / w if w != 0.0 else 1.0  # L(w)
    h = n * r * rel * (_expm1(y) / y if y != 0.0 else 1.0)
    return h / (1.0 + h)


def _eps_shells(ntu, cr, n):
    e1 = _eps_one_shell(ntu / n, cr)
    if n == 1:
        return e1
    if e1 >= 1.0:  # only when Cr ~ 0 and NTU huge
        return 1.0
    return _shells_from_r(e1 / (1.0 - e1), cr, n)


def _eps_cmax_mixed(ntu, cr):
    z = -_expm1(-ntu)
    return z * _exprel(-cr * z)


def _eps_cmin_mixed(ntu, cr):
    return -_expm1(-ntu * _exprel(-cr * ntu))


def _poisson_window(x: float):
    """Index range [lo, hi) outside which the Poisson(x) pmf is negligible."""
    spread = 10.0 * _sqrt(x) + 25.0
    lo = int(x - spread)
    if lo < 0:
        lo = 0
    hi = int(x + spread) + 2
    return lo, hi


def _survival(x: float, n0: int, n1: int) -> list:
    """Q(n, x) = P(X > n), X ~ Poisson(x), for n in range(n0, n1).

    Each value is formed as a sum of positive pmf terms (the lower sum for n
    below the mean, the upper sum above), so it keeps its relative accuracy
    even where it is tiny; terms below ~1e-20 of the total are dropped.
    """
    lo, hi = _poisson_window(x)
    out = [1.0] * (n1 - n0)
    a, b = max(n0, lo), min(n1, hi)
    if a >= b:
        if n0 >= hi:
            return [0.0] * (n1 - n0)
        if n1 <= lo:
            return out
    # pmf p[m - lo] for m in [lo, hi], started at the mode (no underflow)
    mode = int(x)
    if mode < lo:
        mode = lo
    size = hi - lo + 1
    p = [0.0] * size
    pm = _exp(mode * _log(x) - x - _lgamma(mode + 1.0)) if x > 0 else 1.0
    p[mode - lo] = pm
    v = pm
    for m in range(mode, lo, -1):  # p[m-1] = p[m]·m/x
        v = v * m / x
        p[m - 1 - lo] = v
    v = pm
    for m in range(mode + 1, hi + 1):  # p[m] = p[m-1]·x/m
        v = v * x / m
        p[m - lo] = v
    if x > 50.0:  # remove the rounding of the large-x mode pmf
        total = 0.0
        for v in p:
            total += v
        inv = 1.0 / total
        p = [v * inv for v in p]
    # upper sums: U[n] = Σ_{m>n} p_m ; lower sums: 1 − Σ_{m<=n} p_m
    upper = [0.0] * size
    acc = 0.0
    for m in range(hi, lo - 1, -1):
        upper[m - lo] = acc  # Σ_{k>m}
        acc += p[m - lo]
    lower_acc = 0.0
    split = int(x)
    for n in range(lo, hi):
        lower_acc += p[n - lo]
        if n0 <= n < n1:
            out[n - n0] = (1.0 - lower_acc) if n < split else upper[n - lo]
    for n in range(max(n0, hi), n1):
        out[n - n0] = 0.0
    return out


def cross_unmixed(ntu: float, cr: float) -> float:
    """Effectiveness of single-pass crossflow with both fluids unmixed [-].

    Parameters
    ----------
    ntu : float
        Number of transfer units, 0 <= NTU <= :data:`NTU_MAX_CROSS` [-].
    cr : float
        Capacity-rate ratio Cmin/Cmax, 0 <= Cr <= 1 [-].

    Returns
    -------
    float
        ε = (1/(Cr·NTU)) Σ_{n>=0} Q(n, NTU)·Q(n, Cr·NTU) [-], the exact series;
        1 − exp(−NTU) at Cr = 0.

    Notes
    -----
    The series (Mason 1955; tabulated in Shah & Sekulic 2003, Table 3.3)
    is a sum of positive terms; each Poisson tail Q is built from pmf terms
    so it keeps its relative accuracy where it is tiny.  For NTU <= 50 the
    pmfs are generated from m = 0; above, only the ~20·√(Cr·NTU) + 50
    indices where the terms differ from 1 or 0 are summed and the leading
    run of terms equal to 1 is counted.  Agrees with a 50-digit evaluation
    to ~1e-15 relative; about 5 µs at NTU = 2.

    References
    ----------
    Mason, J. L. (1955). Heat transfer in crossflow. Proc. 2nd US National
    Congress of Applied Mechanics, 801-803.
    Shah, R. K., Sekulic, D. P. (2003). Fundamentals of Heat Exchanger
    Design, Wiley, Table 3.3.
    """
    if ntu == 0.0:
        return 0.0
    b = cr * ntu
    if b < 1e-30:  # Cr·NTU -> 0: the relative correction is below b/2
        return -_expm1(-ntu)
    if ntu <= 50.0:
        return _cross_small(ntu, b)
    lo_b, hi_b = _poisson_window(b)
    qa = _survival(ntu, lo_b, hi_b)
    qb = _survival(b, lo_b, hi_b)
    acc = 0.0
    for i in range(hi_b - lo_b - 1, -1, -1):  # small terms first
        acc += qa[i] * qb[i]
    return (acc + lo_b) / b


def _cross_small(a: float, b: float) -> float:
    """The unmixed-crossflow series for NTU = a <= 50, Cr·NTU = b > 0.

    Both pmfs are built upward from m = 0 until the dropped tails change
    the sum by less than ~1e-18 relative (Σ_n Q(n, b) = b, Σ_n Q(n, a) = a),
    then the tails and the products are summed from the top down (all terms
    positive).
    """
    pa = _exp(-a)
    pb = _exp(-b)
    scale = a / (b * (-_expm1(-a)))
    beyond = a + 3.0 * _sqrt(a) + 3.0
    lst_a = [pa]
    lst_b = [pb]
    m = 0
    while True:
        m += 1
        pa = pa * a / m
        pb = pb * b / m
        lst_a.append(pa)
        lst_b.append(pb)
        if m > beyond and pa < 1e-19 and pb * scale < 1e-19:
            break
    qa = qb = acc = 0.0
    for k in range(m, 0, -1):  # after adding p_k: qa = Q(k-1, a)
        qa += lst_a[k]
        qb += lst_b[k]
        acc += qa * qb
    return acc / b


def _eps_core(ntu: float, cr: float, arr: str) -> float:
    if arr == "counter":
        return _eps_counter(ntu, cr)
    if arr == "parallel":
        return _eps_parallel(ntu, cr)
    n = SHELLS.get(arr)
    if n is not None:
        return _eps_shells(ntu, cr, n)
    if arr == "cross":
        return cross_unmixed(ntu, cr)
    if arr == "cross-cmin-mixed":
        return _eps_cmin_mixed(ntu, cr)
    return _eps_cmax_mixed(ntu, cr)


def epsilon_max(c_ratio: float, arrangement: str = "counter") -> float:
    """Largest effectiveness an arrangement approaches as NTU → ∞ [-].

    Parameters
    ----------
    c_ratio : float
        Cmin/Cmax, 0 <= Cr <= 1 [-].
    arrangement : str
        An arrangement word.

    Returns
    -------
    float
        1 for counterflow and unmixed crossflow, 1/(1 + Cr) for parallel
        flow, (1 − exp(−Cr))/Cr with Cmax mixed, 1 − exp(−1/Cr) with Cmin
        mixed and the N-shell relation at ε1 = 2/(1 + Cr + √(1 + Cr²)).
        The limit itself needs an infinite area.

    References
    ----------
    Shah, R. K., Sekulic, D. P. (2003). Fundamentals of Heat Exchanger
    Design, Table 3.3 (the ε-NTU relations, taken as NTU → ∞).
    """
    cr = c_ratio
    arr = (arrangement if type(arrangement) is str and arrangement in _KNOWN
           else parse(arrangement))
    if cr == 0.0 or arr in ("counter", "cross"):
        return 1.0
    if arr == "parallel":
        return 1.0 / (1.0 + cr)
    if arr == "cross-cmax-mixed":
        return _exprel(-cr)
    if arr == "cross-cmin-mixed":
        return -_expm1(-1.0 / cr)
    n = SHELLS[arr]
    s = _sqrt(1.0 + cr * cr)
    if n == 1:
        return 2.0 / (1.0 + cr + s)
    r = 2.0 / (s - 1.0 + cr)  # ε1/(1 − ε1) at the one-shell limit
    if r > 1e300:  # Cr ~ 0
        return 1.0
    return _shells_from_r(r, cr, n)


def _check_cr(c_ratio):
    if type(c_ratio) is float and 0.0 <= c_ratio <= 1.0:
        return c_ratio
    return check_range("c_ratio", c_ratio, 0.0, 1.0, "", where="Cmin/Cmax")


def epsilon(ntu, c_ratio, arrangement="counter") -> float:
    """Heat-exchanger effectiveness ε from NTU and the capacity-rate ratio.

    Parameters
    ----------
    ntu : float
        Number of transfer units UA/Cmin, >= 0 (<= 1e5 for ``"cross"``) [-].
    c_ratio : float
        Capacity-rate ratio Cmin/Cmax, 0 <= Cr <= 1; 0 for a condensing or
        boiling stream [-].
    arrangement : str
        ``"counter"``, ``"parallel"``, ``"1-2"``, ``"2-4"``, ``"3-6"``,
        ``"4-8"``, ``"cross"``, ``"cross-cmin-mixed"``, ``"cross-cmax-mixed"``.

    Returns
    -------
    float
        Effectiveness ε = q/(Cmin·(t_hot_in − t_cold_in)) [-].

    Raises
    ------
    CellInputError
        Negative NTU, Cr outside [0, 1], NTU above 1e5 for unmixed crossflow.

    Notes
    -----
    Ideal exchanger: constant U and specific heats, no losses, no axial
    conduction.  At Cr = 0 every arrangement gives 1 − exp(−NTU).  N-shell
    arrangements are N ideal 1-2 shells in series in overall counterflow, each
    with UA/N.  Unmixed crossflow uses the exact series (not the common
    curve fit).

    References
    ----------
    Bergman, T. L. et al. (2011). Fundamentals of Heat and Mass Transfer,
    7th ed., Wiley, Table 11.3.
    Shah, R. K., Sekulic, D. P. (2003). Fundamentals of Heat Exchanger
    Design, Wiley, Table 3.3.
    Mason, J. L. (1955). Heat transfer in crossflow. Proc. 2nd US National
    Congress of Applied Mechanics, 801-803.
    """
    arr = (arrangement if type(arrangement) is str and arrangement in _KNOWN
           else parse(arrangement))
    if not (type(ntu) is float and 0.0 <= ntu <= 1e300):
        ntu = check_range("ntu", ntu, 0.0, None, "")
    cr = _check_cr(c_ratio)
    if arr == "cross" and ntu > NTU_MAX_CROSS:
        raise CellInputError(
            f"ntu: {fmt(ntu)} is above {fmt(NTU_MAX_CROSS)}, the limit for "
            "unmixed crossflow (the effectiveness is then within 0.2 % of 1)")
    return _eps_core(ntu, cr, arr)


# ---------------------------------------------------------------- inverse ---

class _Infeasible(Exception):
    """ε cannot be reached by the arrangement at this Cr."""


def _ntu_counter(e, cr):
    u = e * (1.0 - cr) / (1.0 - e)
    return e / (1.0 - e) * _log1prel(u)


def _ntu_parallel(e, cr):
    c = 1.0 + cr
    if e * c >= 1.0:
        raise _Infeasible
    return -_log1p(-e * c) / c


def _ntu_one_shell(e1, cr):
    s = _sqrt(1.0 + cr * cr)
    den = 2.0 - (1.0 + cr) * e1
    arg = s * e1 / den if den > 0.0 else 2.0
    if arg >= 1.0:
        raise _Infeasible
    return 2.0 * _atanh(arg) / s


def _ntu_shells(e, cr, n):
    if n == 1:
        return _ntu_one_shell(e, cr)
    q = e / (1.0 - e)
    u = q * (1.0 - cr)
    lu = _log1p(u)
    big_m = lu / n
    k = q * (lu / u if u != 0.0 else 1.0) * (_expm1(big_m) / big_m if big_m != 0.0 else 1.0) / n
    e1 = k / (1.0 + k)
    return n * _ntu_one_shell(e1, cr)


def _ntu_cmax_mixed(e, cr):
    v = e * _log1prel(-e * cr)
    if v >= 1.0:
        raise _Infeasible
    return -_log1p(-v)


def _ntu_cmin_mixed(e, cr):
    lg = _log1p(-e)
    v = cr * lg
    if v <= -1.0:
        raise _Infeasible
    return -lg * _log1prel(v)


def _brent(f, a, b, fa, fb, xtol=1e-15, maxiter=200):
    """Root of f in [a, b] with f(a)·f(b) <= 0 (Brent 1973, zero finder)."""
    if fa == 0.0:
        return a
    if fb == 0.0:
        return b
    c, fc = a, fa
    d = e = b - a
    for _ in range(maxiter):
        if (fb > 0.0) == (fc > 0.0):
            c, fc = a, fa
            d = e = b - a
        if abs(fc) < abs(fb):
            a, b, c = b, c, b
            fa, fb, fc = fb, fc, fb
        tol = 2.0 * 2.2e-16 * abs(b) + 0.5 * xtol
        m = 0.5 * (c - b)
        if abs(m) <= tol or fb == 0.0:
            return b
        if abs(e) >= tol and abs(fa) > abs(fb):
            s = fb / fa
            if a == c:  # secant
                p = 2.0 * m * s
                q = 1.0 - s
            else:  # inverse quadratic interpolation
                q = fa / fc
                r = fb / fc
                p = s * (2.0 * m * q * (q - r) - (b - a) * (r - 1.0))
                q = (q - 1.0) * (r - 1.0) * (s - 1.0)
            if p > 0.0:
                q = -q
            else:
                p = -p
            if 2.0 * p < min(3.0 * m * q - abs(tol * q), abs(e * q)):
                e, d = d, p / q
            else:
                d = e = m
        else:
            d = e = m
        a, fa = b, fb
        b = b + d if abs(d) > tol else b + (tol if m > 0.0 else -tol)
        fb = f(b)
    return b


def _ntu_cross(e, cr):
    lo = _ntu_counter(e, cr)  # crossflow needs more NTU than counterflow
    if lo >= NTU_MAX_CROSS:
        raise _Infeasible
    f = lambda t: cross_unmixed(t, cr) - e  # noqa: E731
    flo = f(lo)
    if flo >= 0.0:
        return lo
    try:  # one fluid mixed needs more NTU than none mixed
        hi = min(_ntu_cmin_mixed(e, cr), _ntu_cmax_mixed(e, cr))
    except _Infeasible:
        hi = 2.0 * lo + 1.0
    hi = min(hi, NTU_MAX_CROSS)
    fhi = f(hi)
    while fhi < 0.0:
        if hi >= NTU_MAX_CROSS:
            raise _Infeasible
        lo, flo = hi, fhi
        hi = min(4.0 * hi, NTU_MAX_CROSS)
        fhi = f(hi)
    return _brent(f, lo, hi, flo, fhi, xtol=1e-16 * hi)


def _ntu_core(e, cr, arr):
    if e == 0.0:
        return 0.0
    if e >= 1.0:
        raise _Infeasible
    if arr == "counter":
        return _ntu_counter(e, cr)
    if cr == 0.0:
        return -_log1p(-e)
    if arr == "parallel":
        return _ntu_parallel(e, cr)
    n = SHELLS.get(arr)
    if n is not None:
        return _ntu_shells(e, cr, n)
    if arr == "cross":
        return _ntu_cross(e, cr)
    if arr == "cross-cmin-mixed":
        return _ntu_cmin_mixed(e, cr)
    return _ntu_cmax_mixed(e, cr)


def transfer_units(effectiveness, c_ratio, arrangement="counter") -> float:
    """Number of transfer units NTU = UA/Cmin needed for an effectiveness.

    Parameters
    ----------
    effectiveness : float
        Required ε, 0 <= ε < ε_max of the arrangement at this Cr [-].
    c_ratio : float
        Capacity-rate ratio Cmin/Cmax, 0 <= Cr <= 1 [-].
    arrangement : str
        An arrangement word (see :func:`epsilon`).

    Returns
    -------
    float
        NTU [-].

    Raises
    ------
    CellInputError
        ε outside [0, 1), Cr outside [0, 1], or ε at or beyond the largest
        effectiveness the arrangement reaches at this Cr (the message gives
        that maximum and what to change).

    Notes
    -----
    Closed-form inverses for every arrangement except unmixed crossflow,
    which is solved by Brent's method between the counterflow NTU (a lower
    bound) and the one-fluid-mixed NTU (an upper bound) to ~1e-15 relative.
    N shells: the overall ε is mapped to the one-shell ε1 by inverting
    ε = (X^N − 1)/(X^N − Cr), X = (1 − ε1·Cr)/(1 − ε1); then
    NTU = N·NTU1(ε1).

    References
    ----------
    Bergman, T. L. et al. (2011). Fundamentals of Heat and Mass Transfer,
    7th ed., Wiley, Table 11.4.
    Shah, R. K., Sekulic, D. P. (2003). Fundamentals of Heat Exchanger
    Design, Wiley, Table 3.3.
    Brent, R. P. (1973). Algorithms for Minimization without Derivatives,
    Prentice-Hall, chapter 4.
    """
    arr = (arrangement if type(arrangement) is str and arrangement in _KNOWN
           else parse(arrangement))
    e = effectiveness
    if not (type(e) is float and 0.0 <= e < 1.0):
        e = check_range("effectiveness", e, 0.0, 1.0, "", hi_open=True)
    cr = _check_cr(c_ratio)
    try:
        return _ntu_core(e, cr, arr)
    except _Infeasible:
        raise CellInputError(_too_high(e, cr, arr)) from None


def _too_high(e, cr, arr):
    if arr == "cross":
        return (f"effectiveness: {fmt(e)} needs NTU above {fmt(NTU_MAX_CROSS)} in "
                f"{describe(arr)} at c_ratio {fmt(cr)}; {advice(arr)}")
    emax = epsilon_max(cr, arr)
    return (f"effectiveness: {fmt(e)} is not below {fmt(emax)}, the most "
            f"{describe(arr)} reaches at c_ratio {fmt(cr)}; {advice(arr)}")
