"""Split of a gas's combustibles into partial mixtures of one methane number.

EN 16726:2015 Annex A finds a gas's methane number by dividing its
combustibles into partial mixtures, each inside one of the annex's diagrams,
such that all partial mixtures have the same methane number.  Such a split is
not unique; this module fixes one deterministically by *plans* in which each
group has a fixed partner in a fixed diagram (see :func:`split_combustibles`
and docs/methods.md).  For a trial methane number every partial mixture
then needs a definite amount of its partner ("hub") group, and the trial value
is moved until the need equals what the gas holds: a one-dimensional root
with a monotone residual, so the result is unique for the plan.
"""

from __future__ import annotations

import math
from dataclasses import dataclass

from cellfuncs.errors import CellInputError
from cellfuncs.gas import mn_diagrams as dg

__all__ = ["Partial", "split_combustibles", "SINGLE_ORDER", "PURE_GROUP"]


@dataclass(frozen=True)
class Partial:
    """One partial mixture: diagram code, amounts (vol-% of the combustibles), its MN."""

    code: str
    amounts: tuple
    mn: float

    @property
    def share(self) -> float:
        """Size of the partial mixture. [vol-% of the combustibles]"""
        return math.fsum(v for _, v in self.amounts)


def _combine(parts: list, supply: float) -> float:
    """Sum of hub demands minus the supply, with +-inf sentinels; nan on contradiction."""
    pos = any(p == math.inf for p in parts)
    neg = any(p == -math.inf for p in parts)
    if pos and neg:
        return math.nan
    if pos:
        return math.inf
    if neg:
        return -math.inf
    return math.fsum(parts) - supply


def _times(ratio: float, amount: float) -> float:
    return 0.0 if amount == 0 else ratio * amount


def _plan_methane(c: dict):
    """Methane-carried split; returns (M, partials) or None when it does not apply."""
    if "CH4" not in c or len(c) < 2:
        return None
    if set(c) - {"CH4", "C2H6", "C3H8", "C4H10_eq", "H2", "H2S", "CO"}:
        return None
    if "CO" in c and "H2" not in c:
        return None
    ch4, c2, c3 = c["CH4"], c.get("C2H6", 0.0), c.get("C3H8", 0.0)
    c4, h2, h2s, co = c.get("C4H10_eq", 0.0), c.get("H2", 0.0), c.get("H2S", 0.0), c.get("CO", 0.0)
    face = dg.Ray("D04", "CH4", (("C2H6", c2), ("C3H8", c3)), n=200) if c2 + c3 > 0 else None
    e_c4 = dg.edge("D08", "CH4", "C4H10_eq")
    e_h2 = dg.edge("D01", "CH4", "H2")
    e_h2s = dg.edge("D11", "CH4", "H2S")
    e_co = dg.edge("D14", "H2", "CO")

    def h2_pool(m):
        if not co:
            return h2
        return h2 - _times(e_co.hub_per_base(m), co)

    def excess(m):
        parts = []
        if face is not None:
            parts.append(_times(face.hub_per_base(m), c2 + c3))
        parts.append(_times(e_c4.hub_per_base(m), c4))
        parts.append(_times(e_h2s.hub_per_base(m), h2s))
        if h2:
            pool = h2_pool(m)
            if pool == math.inf:
                parts.append(math.inf)
            elif pool < 0:
                parts.append(-math.inf)
            else:
                parts.append(_times(e_h2.hub_per_base(m), pool))
        return _combine(parts, ch4)

    m = dg.solve_increasing(excess, -1.0, 101.0)
    if m is None:
        return None
    out = []
    if face is not None:
        out.append(("D04", (("CH4", face.hub_per_base(m) * (c2 + c3)), ("C2H6", c2), ("C3H8", c3))))
    if c4:
        out.append(("D08", (("CH4", e_c4.hub_per_base(m) * c4), ("C4H10_eq", c4))))
    if h2s:
        out.append(("D11", (("CH4", e_h2s.hub_per_base(m) * h2s), ("H2S", h2s))))
    if co:
        out.append(("D14", (("CO", co), ("H2", e_co.hub_per_base(m) * co))))
    if h2:
        pool = h2_pool(m)
        if pool > 0:
            out.append(("D01", (("CH4", e_h2.hub_per_base(m) * pool), ("H2", pool))))
    return m, out


def _plan_hydrogen(c: dict):
    """Hydrogen-carried split; returns (M, partials) or None when it does not apply.

    Propane pairs with hydrogen (D03) below the MN of pure propane on D03 and
    with methane (CH4-C3H8 edge of D04) from there up; the butane equivalent
    pairs with hydrogen (H2-C4 edge of D06, the doubtful diagram) below the end
    of the usable CH4-C4 edge of D08 and with methane (D08) from there up.  At
    a switch point both partial mixtures have that MN, so the group may be
    shared between them (fraction ``lam`` on the upper partner).
    """
    if "H2" not in c or len(c) < 2:
        return None
    if set(c) - {"H2", "CH4", "C2H6", "C3H8", "CO", "C4H10_eq", "H2S"}:
        return None
    ch4 = c.get("CH4", 0.0)
    if "H2S" in c and not ch4:
        return None
    h2, c2, c3 = c["H2"], c.get("C2H6", 0.0), c.get("C3H8", 0.0)
    c4, h2s, co = c.get("C4H10_eq", 0.0), c.get("H2S", 0.0), c.get("CO", 0.0)
    e_c4 = dg.edge("D08", "CH4", "C4H10_eq")
    e_c4h = dg.edge("D06", "H2", "C4H10_eq")
    e_h2s = dg.edge("D11", "CH4", "H2S")
    e_co = dg.edge("D14", "H2", "CO")
    e_c3h = dg.edge("D03", "H2", "C3H8")
    e_c3m = dg.edge("D04", "CH4", "C3H8")
    sw3, sw4 = e_c3h.mn_far, e_c4.mn_far  # pure propane on D03; end of the D08 CH4-C4 edge

    def upper(m, sw, lam):
        """Share of a switching group on its upper (methane) partner at MN m."""
        return 1.0 if m > sw else (lam if m == sw else 0.0)

    def pieces(m, lam):
        """(H2 demands, CH4 demands) of all pieces but the D01 face."""
        f3, f4 = upper(m, sw3, lam), upper(m, sw4, lam)
        need_h2 = [_times(e_co.hub_per_base(m), co),
                   _times(e_c3h.hub_per_base(m), c3 * (1 - f3)),
                   _times(e_c4h.hub_per_base(m), c4 * (1 - f4))]
        need_ch4 = [_times(e_c4.hub_per_base(m), c4 * f4),
                    _times(e_c3m.hub_per_base(m), c3 * f3),
                    _times(e_h2s.hub_per_base(m), h2s)]
        return need_h2, need_ch4

    def face_ray(rest):
        return dg.Ray("D01", "H2", (("CH4", rest), ("C2H6", c2)), n=0)

    def shortfall(m, lam=1.0):  # increasing in M: H2 supply minus H2 demand
        need_h2, need_ch4 = pieces(m, lam)
        v = _combine(need_ch4, 0.0)
        if math.isnan(v):
            return math.nan
        rest = ch4 - v
        if rest == math.inf:
            face = math.inf        # M too low for the CH4 edges
        elif rest < -1e-12:
            face = -math.inf       # M too high: the CH4 edges need more CH4 than there is
        elif max(rest, 0.0) + c2 <= 0:
            face = 0.0
        else:
            rest = max(rest, 0.0)
            face = _times(face_ray(rest).hub_per_base(m), rest + c2)
        return -_combine(need_h2 + [face], h2)

    m = dg.solve_increasing(shortfall, -1.0, 101.0, switches=(sw3, sw4))
    if m is None:
        return None
    lam = 1.0
    if m in (sw3, sw4):
        lo, hi = shortfall(m, 0.0), shortfall(m, 1.0)
        if not (math.isfinite(lo) and math.isfinite(hi)) or lo * hi > 0:
            return None
        a, b = 0.0, 1.0
        for _ in range(60):  # shortfall rises with lam: bisection on the shared fraction
            lam = 0.5 * (a + b)
            if shortfall(m, lam) < 0:
                a = lam
            else:
                b = lam
    need_h2, need_ch4 = pieces(m, lam)
    f3, f4 = upper(m, sw3, lam), upper(m, sw4, lam)
    rest = max(ch4 - math.fsum(need_ch4), 0.0)
    out = []
    if rest + c2 > 0:
        out.append(("D01", (("CH4", rest), ("H2", face_ray(rest).hub_per_base(m) * (rest + c2)),
                            ("C2H6", c2))))
    if c3 * (1 - f3) > 0:
        out.append(("D03", (("H2", need_h2[1]), ("C3H8", c3 * (1 - f3)))))
    if c3 * f3 > 0:
        out.append(("D04", (("CH4", need_ch4[1]), ("C3H8", c3 * f3))))
    if co:
        out.append(("D14", (("CO", co), ("H2", need_h2[0]))))
    if c4 * (1 - f4) > 0:
        out.append(("D06", (("H2", need_h2[2]), ("C4H10_eq", c4 * (1 - f4)))))
    if c4 * f4 > 0:
        out.append(("D08", (("CH4", need_ch4[0]), ("C4H10_eq", c4 * f4))))
    if h2s:
        out.append(("D11", (("CH4", need_ch4[2]), ("H2S", h2s))))
    return m, out


_SHOW = {"C4H10_eq": "butane equivalent"}

#: single diagrams tried, in this order, when no split plan applies (D06 last)
SINGLE_ORDER = ("D04", "D01", "D02", "D14", "D08", "D07", "D05", "D03",
                "D11", "D10", "D09", "D12", "D13", "D15", "D16", "D06")
#: the diagram whose corner gives a pure group's MN
PURE_GROUP = {"CH4": "D04", "C2H6": "D04", "C3H8": "D04", "C4H10_eq": "D08",
              "H2": "D14", "CO": "D14"}


def _plan_single(c: dict):
    """The whole combustible mixture in one diagram; (M, partials, reason-if-none)."""
    reasons = []
    for code in SINGLE_ORDER:
        d = dg.diagram(code)
        if not set(c) <= set(d.groups()):
            continue
        ch4_min = dg.TRUSTED_CH4_MIN if code in ("D09", "D10", "D11") else None
        why = d.outside(c, ch4_min)
        if why:
            reasons.append(why)
            continue
        return d.mn(c), [(code, tuple(c.items()))], ""
    return None, None, "; ".join(reasons)


def split_combustibles(groups: tuple) -> tuple:
    """Split the combustibles into partial mixtures that share one methane number.

    Parameters
    ----------
    groups : tuple of (group, vol-%)
        Combustible groups after lumping, summing to 100 (``CH4, C2H6, C3H8,
        C4H10_eq, H2, CO, H2S``). [vol-%]

    Returns
    -------
    mn : float
        The common methane number of the partial mixtures. [-]
    plan : str
        ``"single component"``, ``"methane-carried"``, ``"hydrogen-carried"`` or
        ``"single diagram"``.
    partials : tuple of Partial
        Diagram, amounts (vol-% of the combustibles) and MN of each partial mixture.

    Raises
    ------
    CellInputError
        When no plan gives a split inside the diagrams' domains.

    Notes
    -----
    Plans, tried in this order (the first with a solution inside the domains,
    equal MN to 0.01 and a closed balance of every group is used):

    1. one group only: the corner of a fixed diagram (``PURE_GROUP``);
    2. methane-carried: ethane and propane with methane in D04; butane
       equivalent with methane on the CH4-C4 edge of D08; hydrogen with methane
       on the CH4-H2 edge of D01; H2S with methane on the CH4-H2S edge of D11
       (CH4 75-100 %); CO with hydrogen in the binary D14, whose hydrogen is
       taken from the hydrogen before the rest goes to D01.  For a trial MN each
       partial mixture fixes the methane it needs; the total need rises with
       the MN, so the MN at which it equals the methane present is unique;
    3. hydrogen-carried (when methane is too scarce for plan 2): methane and
       ethane with hydrogen in D01; CO with hydrogen in D14; propane with
       hydrogen on D03 below the MN of pure propane there, above it with
       methane on the CH4-C3H8 edge of D04; butane equivalent with methane on
       D08 down to the end of that edge's monotone part (MN 9.9), below it with
       hydrogen on the H2-C4 edge of D06 (doubtful; flagged); H2S with methane
       on D11.  The methane not needed by D04, D08 and D11 goes to D01.  The
       total hydrogen need falls with the MN: again one root (at a switch point
       the switching group is shared between its two partial mixtures, both of
       which have that MN);
    4. single diagram: all groups inside one diagram (``SINGLE_ORDER``, D06 last).

    D06 is used only in plan 3 below MN 9.9 with butanes present and as the
    last single diagram, i.e. only where nothing else covers the gas.

    References
    ----------
    .. [1] EN 16726:2015, Gas infrastructure - Quality of gas - Group H, Annex A
       (figures as published in open transcriptions; unverified against Table A.10).
    """
    c = {g: v for g, v in groups if v > 0}
    if len(c) == 1:
        (g, v), = c.items()
        if g not in PURE_GROUP:
            raise CellInputError(f"components: EN16726: {g} alone lies in no diagram's domain "
                                 "(H2S is covered only mixed with at least 75 vol-% methane)")
        code = PURE_GROUP[g]
        m = dg.diagram(code).mn(c)
        return m, "single component", (Partial(code, ((g, v),), m),)
    for plan, fn in (("methane-carried", _plan_methane), ("hydrogen-carried", _plan_hydrogen)):
        res = fn(c)
        if res is None:
            continue
        m, raw = res
        partials = _checked(raw, m, c)
        if partials is not None:
            return m, plan, partials
    m, raw, why = _plan_single(c)
    if m is not None:
        return m, "single diagram", tuple(Partial(code, am, m) for code, am in raw)
    listed = ", ".join(f"{_SHOW.get(g, g)} {v:.3g} %" for g, v in c.items())
    tail = f"; single diagrams: {why}" if why else ""
    raise CellInputError(
        f"components: EN16726: no split of the combustibles ({listed}) into partial mixtures "
        f"of equal methane number inside the diagrams' domains{tail}")


def _checked(raw: list, m: float, c: dict):
    """Partials with their own MN; None unless all lie in their domain, match m to 0.01
    and together hold exactly the combustibles ``c``."""
    used: dict = {}
    for _, amounts in raw:
        for g, v in amounts:
            used[g] = used.get(g, 0.0) + v
    if any(abs(used.get(g, 0.0) - v) > 1e-6 * 100.0 for g, v in c.items()):
        return None
    out = []
    for code, amounts in raw:
        am = {g: v for g, v in amounts if v > 0}
        d = dg.diagram(code)
        ch4_min = dg.TRUSTED_CH4_MIN if code in ("D09", "D10", "D11") else None
        if not am or d.outside(am, ch4_min) or not all(math.isfinite(v) for v in am.values()):
            return None
        mn = d.mn(am)
        if abs(mn - m) > 0.01:
            return None
        out.append(Partial(code, tuple(am.items()), mn))
    return tuple(out)
