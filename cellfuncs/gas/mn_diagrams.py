"""EN 16726:2015 Annex A figures: the methane-number diagrams as polynomials.

The annex describes the knock resistance of a gas by ternary and binary
diagrams, each a polynomial ``MN = sum a_ij x^i y^j`` in the vol-% ``x`` and
``y`` of two components of a partial mixture (the third is ``z = 100 - x - y``),
and an inert diagram for CO2 and N2.  The coefficients, the validity domains
and the lumping factors are read from ``cellfuncs/data/en16726_annex_a.json``,
which keeps the provenance of the figures and the known doubts about them
(``open_questions``).  This module only evaluates; the split of a gas into
partial mixtures is in :mod:`cellfuncs.gas.methane_number`.

Group names used here (the annex's combustible groups): ``CH4, C2H6, C3H8,
C4H10_eq`` (butanes plus lumped pentanes and heavier), ``H2, CO, H2S`` and the
olefins ``C2H4, C3H6, C4H6, C4H8`` (present in the data, never in a
composition of this library).
"""

from __future__ import annotations

import bisect
import json
import math
from dataclasses import dataclass
from functools import lru_cache
from pathlib import Path

__all__ = [
    "DATA_FILE",
    "Diagram",
    "Ray",
    "annex",
    "diagrams",
    "diagram",
    "inert_diagram",
    "edge",
    "solve_increasing",
    "TRUSTED_CH4_MIN",
    "DOUBTFUL",
    "SUSPECT",
    "HIGH_ORDER",
]

DATA_FILE = Path(__file__).resolve().parent.parent / "data" / "en16726_annex_a.json"

#: lowest CH4 vol-% we use in the high-order diagrams D09-D11 (the data's domain is 60-100;
#: its check notes call the 60-75 % part unreliable, and the fits turn non-monotone there)
TRUSTED_CH4_MIN = 75.0

#: the doubtful diagram (open_questions of the data): results leaning on it carry a CAUTION
SUSPECT = {
    "D06": "D06 (CH4/H2/butanes) is the most doubtful diagram: 14 terms, its CH4-H2 edge sags "
           "up to 7.7 below MN = vol-% CH4",
}
#: high-order fits, used only at CH4 >= TRUSTED_CH4_MIN; results leaning on them carry a note
HIGH_ORDER = {
    code: f"{code} is a high-order fit agreeing with the other diagrams only above 75-80 % CH4; "
          f"used here at CH4 >= {TRUSTED_CH4_MIN:g} %"
    for code in ("D09", "D10", "D11")
}
DOUBTFUL = {**SUSPECT, **HIGH_ORDER}


@lru_cache(maxsize=1)
def annex() -> dict:
    """The figures of EN 16726:2015 Annex A as stored (dict read from the JSON file).

    References
    ----------
    .. [1] EN 16726:2015, Gas infrastructure - Quality of gas - Group H, Annex A
       (figures as published in open transcriptions; unverified against Table A.10).
    """
    with DATA_FILE.open(encoding="utf-8") as fh:
        return json.load(fh)


def _range(dom: dict, key: str) -> tuple:
    lo, hi = dom.get(key, (0.0, 100.0))
    return float(lo), float(hi)


@dataclass(frozen=True)
class Diagram:
    """One polynomial of the annex.

    Attributes
    ----------
    id : str
        Identifier as in the data file, e.g. ``"D04_CH4_C2H6_C3H8"``.
    code : str
        Short code ``"D04"``.
    kind : str
        ``"ternary"``, ``"binary"``, ``"constant"`` or ``"ternary (inert)"``.
    axes : tuple of str
        Groups on the x, y and (implicit) z axis; z is ``None`` for binaries.
    rows : tuple
        ``rows[j]`` = coefficients of ``y**j`` as a tuple over powers of x.
    domain : dict
        Axis -> (lo, hi) in vol-% of the partial mixture. [vol-%]
    """

    id: str
    code: str
    kind: str
    axes: tuple
    rows: tuple
    domain: dict

    def value(self, x: float, y: float) -> float:
        """MN of the partial mixture with ``x``, ``y`` vol-% on the first two axes. [-]"""
        total = 0.0
        yp = 1.0
        for row in self.rows:
            acc = 0.0
            for a in reversed(row):
                acc = acc * x + a
            total += acc * yp
            yp *= y
        return total

    def xy(self, amounts: dict) -> tuple:
        """(x, y) in vol-% of a partial mixture given as ``{group: amount}`` (any scale)."""
        tot = math.fsum(amounts.values())
        ax, ay = self.axes[0], self.axes[1]
        return 100.0 * amounts.get(ax, 0.0) / tot, 100.0 * amounts.get(ay, 0.0) / tot

    def mn(self, amounts: dict) -> float:
        """MN of a partial mixture ``{group: amount}`` (normalised here). [-]"""
        return self.value(*self.xy(amounts))

    def groups(self) -> tuple:
        return tuple(g for g in self.axes if g)

    def outside(self, amounts: dict, ch4_min: float | None = None) -> str:
        """Empty string if the partial mixture lies in the domain, else the limit broken."""
        tot = math.fsum(amounts.values())
        extra = [g for g, v in amounts.items() if v > 0 and g not in self.axes]
        if extra:
            return f"{self.code} holds no {', '.join(extra)}"
        for axis, g in zip("xyz", self.axes):
            if g is None:
                continue
            share = 100.0 * amounts.get(g, 0.0) / tot
            lo, hi = _range(self.domain, axis)
            if g == "CH4" and ch4_min is not None:
                lo = max(lo, ch4_min)
            if share < lo - 1e-9 or share > hi + 1e-9:
                return (f"{self.code} needs {g} {lo:g} to {hi:g} vol-% of its partial mixture, "
                        f"here {share:.4g}")
        return ""


def _build(entry: dict) -> Diagram:
    comps = entry["components"]
    axes = (comps.get("x"), comps.get("y"), comps.get("z_implicit"))
    nj = 1 + max(t["j"] for t in entry["terms"])
    ni = 1 + max(t["i"] for t in entry["terms"])
    rows = [[0.0] * ni for _ in range(nj)]
    for t in entry["terms"]:
        rows[t["j"]][t["i"]] += float(t["a"])
    return Diagram(id=entry["id"], code=entry["id"][:3], kind=entry["kind"], axes=axes,
                   rows=tuple(tuple(r) for r in rows),
                   domain={k: tuple(v) for k, v in entry["domain_vol_pct"].items()})


@lru_cache(maxsize=1)
def diagrams() -> dict:
    """Code (``"D01"`` ... ``"D18"``) -> :class:`Diagram` of the combustible diagrams.

    References
    ----------
    .. [1] EN 16726:2015, Gas infrastructure - Quality of gas - Group H, Annex A
       (figures as published in open transcriptions; unverified against Table A.10).
    """
    return {d.code: d for d in (_build(e) for e in annex()["diagrams"])}


def diagram(code: str) -> Diagram:
    """One combustible diagram by code (``"D04"``).

    References
    ----------
    .. [1] EN 16726:2015, Gas infrastructure - Quality of gas - Group H, Annex A
       (figures as published in open transcriptions; unverified against Table A.10).
    """
    return diagrams()[code]


@lru_cache(maxsize=1)
def inert_diagram() -> Diagram:
    """The inert diagram D20: x = combustibles, y = CO2, z = N2, vol-% of the whole gas.

    References
    ----------
    .. [1] EN 16726:2015, Gas infrastructure - Quality of gas - Group H, Annex A
       (figures as published in open transcriptions; unverified against Table A.10).
    """
    return _build(annex()["inert_correction"])


# ---------------------------------------------------------------------------
# rays: partial mixtures of a fixed base plus a variable amount of one "hub" group


def _illinois(f, a: float, b: float, fa: float, fb: float, tol: float = 1e-12) -> float:
    """Root of f in [a, b] with f(a), f(b) of opposite sign (Illinois regula falsi)."""
    side = 0
    for _ in range(100):
        c = (a * fb - b * fa) / (fb - fa)
        fc = f(c)
        if fc == 0.0 or abs(b - a) < tol:
            return c
        if (fc > 0) == (fb > 0):
            b, fb = c, fc
            if side == -1:
                fa *= 0.5
            side = -1
        else:
            a, fa = c, fc
            if side == 1:
                fb *= 0.5
            side = 1
        if abs(b - a) < tol:
            break
    return (a * fb - b * fa) / (fb - fa) if fb != fa else 0.5 * (a + b)


class Ray:
    """Partial mixtures ``base + hub`` in one diagram, parametrised by the hub share.

    ``s`` is the hub's share of the partial mixture (0 = the base alone, 1 = the
    pure hub).  The usable part is the stretch that ends at the hub corner
    (``s = 1``) and on which the MN changes monotonically, further cut to the
    diagram's domain.  :meth:`hub_per_base` inverts it: the amount of hub per
    unit of base that gives a wanted MN.

    Parameters
    ----------
    code : str
        Diagram code.
    hub : str
        The group whose share varies.
    base : tuple of (group, amount)
        The fixed rest of the partial mixture (any scale).
    n : int
        Table points used to locate the monotone stretch; ``n <= 1`` trusts the
        ray to be monotone over its whole domain (checked for the D01 rays to
        the H2 corner in the tests).
    """

    def __init__(self, code: str, hub: str, base: tuple, n: int = 400):
        self.d = diagram(code)
        self.code = code
        self.hub = hub
        tot = math.fsum(v for _, v in base)
        self.base = {g: v / tot for g, v in base if v > 0}
        ax, ay = self.d.axes[0], self.d.axes[1]
        bx, by = self.base.get(ax, 0.0), self.base.get(ay, 0.0)
        hx, hy = float(hub == ax), float(hub == ay)
        # x(s), y(s) in vol-% along the ray
        self._lin = (100.0 * bx, 100.0 * (hx - bx), 100.0 * by, 100.0 * (hy - by))
        s_lo, s_hi = self._domain_s()
        if s_hi < 1.0:
            raise ValueError(f"{code}: hub corner of {hub} outside the domain")
        self.rising = self.at(1.0) > self.at(s_lo)  # MN grows toward the hub corner
        if n <= 1:  # trusted monotone over the whole domain: end points only
            ss, vs = [s_lo, 1.0], [self.at(s_lo), self.at(1.0)]
        else:
            step = (1.0 - s_lo) / n
            ss = [1.0 - k * step for k in range(n + 1)]  # from the corner down
            vs = [self.at(s) for s in ss]
            k = 1
            while k <= n and ((vs[k] < vs[k - 1]) if self.rising else (vs[k] > vs[k - 1])):
                k += 1
            ss, vs = ss[:k][::-1], vs[:k][::-1]  # ascending s, monotone values
        self.s_far = ss[0]
        self.table_s = ss
        self.table_v = vs if self.rising else [-v for v in vs]  # ascending either way
        self.mn_far = vs[0]
        self.mn_corner = vs[-1]

    def _domain_s(self) -> tuple:
        """Range of s allowed by the domain (and the trusted CH4 range of D09-D11)."""
        lo, hi = 0.0, 1.0
        for axis, g in zip("xyz", self.d.axes):
            if g is None:
                continue
            dlo, dhi = _range(self.d.domain, axis)
            if g == "CH4" and self.code in ("D09", "D10", "D11"):
                dlo = max(dlo, TRUSTED_CH4_MIN)
            b = self.base.get(g, 0.0)
            h = 1.0 if g == self.hub else 0.0
            # share(s) = 100 (b + s (h - b)) within [dlo, dhi]
            slope = h - b
            for bound, is_lo in ((dlo, True), (dhi, False)):
                if abs(slope) < 1e-15:
                    continue
                s_b = (bound / 100.0 - b) / slope
                if (slope > 0) == is_lo:
                    lo = max(lo, s_b)
                else:
                    hi = min(hi, s_b)
        return max(0.0, lo), min(1.0, hi + 1e-12)

    def at(self, s: float) -> float:
        """MN at hub share ``s``. [-]"""
        x0, dx, y0, dy = self._lin
        return self.d.value(x0 + s * dx, y0 + s * dy)

    def share(self, mn: float) -> float:
        """Hub share giving ``mn``; ``inf`` beyond the hub corner, ``-inf`` beyond the far end."""
        v = mn if self.rising else -mn
        tv = self.table_v
        if v >= tv[-1]:
            return math.inf
        if v < tv[0]:
            return -math.inf
        k = bisect.bisect_right(tv, v)  # tv[k-1] <= v < tv[k]
        a, b = self.table_s[k - 1], self.table_s[k]
        fa, fb = tv[k - 1] - v, tv[k] - v
        if fa == 0.0:
            return a
        sign = 1.0 if self.rising else -1.0
        return _illinois(lambda s: sign * self.at(s) - v, a, b, fa, fb)

    def hub_per_base(self, mn: float) -> float:
        """Hub amount per unit base amount giving ``mn`` (``+-inf`` as in :meth:`share`)."""
        s = self.share(mn)
        if math.isinf(s):
            return s
        if s >= 1.0:
            return math.inf
        return s / (1.0 - s)


@lru_cache(maxsize=64)
def edge(code: str, hub: str, other: str) -> Ray:
    """The (cached) binary edge ``hub``-``other`` of diagram ``code``.

    References
    ----------
    .. [1] EN 16726:2015, Gas infrastructure - Quality of gas - Group H, Annex A
       (figures as published in open transcriptions; unverified against Table A.10).
    """
    return Ray(code, hub, ((other, 1.0),), n=2000)


def solve_increasing(h, lo: float, hi: float, tol: float = 1e-10, switches: tuple = ()):
    """Root of a nondecreasing function that may return ``+-inf`` (sentinels) or ``nan``.

    ``h(M)`` is negative (or ``-inf``) when M is too low, positive (or ``+inf``)
    when M is too high, and ``nan`` when the pieces contradict each other (their
    feasible ranges of M do not overlap, so there is no root).  Bisection while
    a bracket end is a sentinel, then Illinois regula falsi (bisection again
    whenever a trial point gives a sentinel).

    switches : tuple of float
        Points where ``h`` jumps because a group changes its partner there; a
        bracket closing on one of them returns it (the caller then splits that
        group between its two partial mixtures, both of which have this MN).

    Returns
    -------
    root : float or None
        None when there is no sign change in [lo, hi], a contradiction is met,
        or the bracket closes on a jump that is not a switch point.

    References
    ----------
    .. [1] Dowell, M., Jarratt, P. (1971), A modified regula falsi method for
       computing the root of an equation, BIT 11, 168-174 (Illinois method).
    """
    flo, fhi = h(lo), h(hi)
    if math.isnan(flo) or math.isnan(fhi) or flo > 0 or fhi < 0:
        return None
    if flo == 0:
        return lo
    if fhi == 0:
        return hi
    side = 0
    for _ in range(300):
        if hi - lo < tol:
            break
        if math.isfinite(flo) and math.isfinite(fhi):
            m = (lo * fhi - hi * flo) / (fhi - flo)
            if not lo < m < hi:
                m = 0.5 * (lo + hi)
        else:
            m = 0.5 * (lo + hi)
        fm = h(m)
        if math.isnan(fm):
            return None
        if not math.isfinite(fm) and math.isfinite(flo) and math.isfinite(fhi):
            m = 0.5 * (lo + hi)  # a sentinel inside a finite bracket: fall back to halving
            fm = h(m)
            if math.isnan(fm):
                return None
            side = 0
        if fm == 0:
            return m
        if fm < 0:
            lo, flo = m, fm
            if side == -1 and math.isfinite(fhi):
                fhi *= 0.5
            side = -1
        else:
            hi, fhi = m, fm
            if side == 1 and math.isfinite(flo):
                flo *= 0.5
            side = 1
    for sw in switches:
        if lo - 1e-7 <= sw <= hi + 1e-7 and (abs(flo) > 1e-6 or abs(fhi) > 1e-6):
            return sw  # closed on the jump at a switch point
    if not (math.isfinite(flo) and math.isfinite(fhi)):
        return None  # a jump between sentinels, not a root
    return (lo * fhi - hi * flo) / (fhi - flo) if fhi != flo else 0.5 * (lo + hi)
