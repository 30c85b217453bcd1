"""More methane-number methods and the spread between methods.

Kubesh, King & Liss (1992) give two correlations for the motor octane number
(MON) of natural gas, a linear one in the mole fractions (method ``"linear"``
of :mod:`cellfuncs.gas.methane_number`) and a cubic one in the
hydrogen-to-carbon atom ratio H/C of the gas:

    MON = −406.14 + 508.04·(H/C) − 173.55·(H/C)² + 20.17·(H/C)³

and convert MON to MN by their own regression, MN = 1.624·MON − 119.1.
ISO 15403-1 converts by MN = 1.445·MON − 103.42.  Each pair (MON correlation,
conversion) is a method here:

``"hc_ratio"``            H/C correlation, the paper's conversion;
``"hc_ratio_iso15403"``   H/C correlation, ISO 15403-1 conversion;
``"linear_iso15403"``     linear correlation, ISO 15403-1 conversion
                          (``"linear"`` itself keeps the paper's conversion).

:func:`spread` evaluates every method on a gas, keeps those whose validity
covers it and returns the highest minus the lowest methane number: the
published methods differ by 5-10 on the same gas, and a tender should show
it.  Estimates for tendering; the engine's permitted gas quality and its
methane-number derating come from the engine's declared datasheet.
"""

from __future__ import annotations

import math
from functools import lru_cache

from cellfuncs.errors import CellInputError, CellTypeError, fmt
from cellfuncs.gas import methane_number as mn

__all__ = [
    "HC_MON", "MN_PAPER", "MN_ISO15403", "HC_INERT_MAX", "HC_RANGE", "NEW_METHODS",
    "SPREAD_METHODS", "hc_ratio", "mon_hc_ratio", "mon_linear", "methane_number_by",
    "basis", "spread_details", "spread",
]

#: MON = a0 + a1·r + a2·r² + a3·r³, r = H/C atoms; Kubesh, King & Liss (1992), as quoted in
#: secondary sources (not checked against the paper)
HC_MON = (-406.14, 508.04, -173.55, 20.17)
#: MN = k·MON + d of the paper (Kubesh, King & Liss 1992), the one of method "linear"
MN_PAPER = mn.LINEAR_MN
#: MN = k·MON + d of ISO 15403-1:2006 (informative annex on the methane number; clause unverified)
MN_ISO15403 = (1.445, -103.42)
#: inerts (N2, CO2, Ar, He) of the dry O2-free gas the H/C correlation tolerates [vol-%] (our screen:
#: it cannot see them; a pipeline-type gas holds a few per cent)
HC_INERT_MAX = 5.0
#: H/C atom ratios of the hydrocarbon part accepted (our screen: n-butane 2.5 to methane 4.0) [-]
HC_RANGE = (2.5, 4.0)

NEW_METHODS = ("linear_iso15403", "hc_ratio", "hc_ratio_iso15403")
#: every method the spread tries, in this order
SPREAD_METHODS = ("en16726", "linear", "linear_iso15403", "hc_ratio", "hc_ratio_iso15403")
INERTS = ("N2", "CO2", "Ar", "He")
HYDROCARBONS = ("CH4", "C2H6", "C3H8", "nC4H10", "iC4H10") + mn.PENTANES + mn.HEXANES_PLUS
_CH = {"CH4": (1, 4), "C2H6": (2, 6), "C3H8": (3, 8), "nC4H10": (4, 10), "iC4H10": (4, 10),
       "nC5H12": (5, 12), "iC5H12": (5, 12), "neoC5H12": (5, 12), "nC6H14": (6, 14),
       "nC7H16": (7, 16), "nC8H18": (8, 18)}


def _gas(comp) -> dict:
    ids, x = mn._items(comp)
    if not ids:
        raise CellInputError("components: the composition is empty")
    return mn._dry_o2_free(ids, x)


@lru_cache(maxsize=1024)
def _hc_checked(ids: tuple, x: tuple) -> float:
    g = mn._dry_o2_free(ids, x)
    tag = "hc_ratio"
    for cid in mn.LINEAR_REFUSED:
        if g.get(cid, 0.0) > 0:
            raise CellInputError(
                f"components: {tag}: {mn._NAMES[cid]} ({cid}) is outside the H/C correlation of "
                "Kubesh, King & Liss (1992) (hydrocarbon gases only)")
    mn._check_heavies(g, tag)
    inert = math.fsum(g.get(c, 0.0) for c in INERTS)
    if inert > HC_INERT_MAX:
        raise CellInputError(
            f"components: {tag}: inerts (N2, CO2, Ar, He) {fmt(inert)} vol-% are above "
            f"{HC_INERT_MAX:g} vol-% (our screen: the H/C correlation cannot see them)")
    ch4 = g.get("CH4", 0.0)
    if ch4 < mn.LINEAR_CH4_MIN:
        raise CellInputError(
            f"components: {tag}: methane {fmt(ch4)} vol-% is below {mn.LINEAR_CH4_MIN:g} vol-% "
            "(our screen for the pipeline-type natural gas the correlation was fitted to)")
    c = math.fsum(g.get(k, 0.0) * _CH[k][0] for k in HYDROCARBONS)
    h = math.fsum(g.get(k, 0.0) * _CH[k][1] for k in HYDROCARBONS)
    r = h / c
    lo, hi = HC_RANGE
    if not lo <= r <= hi + 1e-12:
        raise CellInputError(f"components: {tag}: H/C ratio {fmt(r)} is outside {lo:g} to {hi:g} "
                             "(our screen: butane to methane)")
    return min(r, hi)


def hc_ratio(comp) -> float:
    """Hydrogen-to-carbon atom ratio of the hydrocarbons of a gas, checked for the H/C correlation. [-]

    Parameters
    ----------
    comp : mapping or Composition
        ``{canonical id: mole fraction}`` (dry, O2-free basis taken here). [-]

    Returns
    -------
    r : float
        Σ x_i·H_i / Σ x_i·C_i over methane to octane. [-]

    Raises
    ------
    CellInputError
        H2, CO, H2S or NH3 present; inerts above 5 vol-%; methane below 70 vol-%;
        pentanes or hexanes-plus above the EN 16726 limits; H/C outside 2.5-4.

    References
    ----------
    .. [1] Kubesh, J., King, S. R., Liss, W. E. (1992). Effect of gas composition
       on octane number of natural gas fuels. SAE Technical Paper 922359.
    """
    ids, x = mn._items(comp)
    if not ids:
        raise CellInputError("components: the composition is empty")
    return _hc_checked(ids, x)


def mon_hc_ratio(comp) -> float:
    """Motor octane number by the H/C correlation of Kubesh, King & Liss (1992). [-]

    MON = −406.14 + 508.04 r − 173.55 r² + 20.17 r³, r = H/C of :func:`hc_ratio`.

    Parameters
    ----------
    comp : mapping or Composition
        Gas, as :func:`hc_ratio`. [-]

    Returns
    -------
    mon : float
        Motor octane number (140.1 for methane). [-]

    Raises
    ------
    CellInputError
        As :func:`hc_ratio`.

    Notes
    -----
    Validity as :func:`hc_ratio`.  Coefficients as quoted in secondary sources,
    not checked against the paper.

    References
    ----------
    .. [1] Kubesh, J., King, S. R., Liss, W. E. (1992). SAE Technical Paper 922359.
    """
    r = hc_ratio(comp)
    a0, a1, a2, a3 = HC_MON
    return a0 + r * (a1 + r * (a2 + r * a3))


def mon_linear(comp) -> float:
    """Motor octane number of the linear correlation (method ``"linear"``), before conversion. [-]

    Parameters
    ----------
    comp : mapping or Composition
        Gas (see :func:`cellfuncs.gas.methane_number.methane_number_linear`). [-]

    Returns
    -------
    mon : float
        (MN_linear + 119.1)/1.624: the MON the method ``"linear"`` converts. [-]

    Raises
    ------
    CellInputError
        As :func:`cellfuncs.gas.methane_number.methane_number_linear`.

    References
    ----------
    .. [1] Kubesh, J., King, S. R., Liss, W. E. (1992). SAE Technical Paper 922359.
    """
    k, d = MN_PAPER
    return (mn.methane_number_linear(comp) - d) / k


def methane_number_by(comp, method: str) -> float:
    """Methane number by one of :data:`NEW_METHODS`.

    Parameters
    ----------
    comp : mapping or Composition
        ``{canonical id: mole fraction}``. [-]
    method : str
        ``"linear_iso15403"``, ``"hc_ratio"`` or ``"hc_ratio_iso15403"``.

    Returns
    -------
    mn : float
        MN = k·MON + d with (k, d) = (1.624, −119.1) of the paper or (1.445,
        −103.42) of ISO 15403-1. [-]

    Raises
    ------
    CellInputError
        Outside the MON correlation's validity (see :func:`hc_ratio` and
        :func:`cellfuncs.gas.methane_number.methane_number_linear`).
    CellTypeError
        Unknown method.

    References
    ----------
    .. [1] Kubesh, J., King, S. R., Liss, W. E. (1992). SAE Technical Paper 922359.
    .. [2] ISO 15403-1:2006, Natural gas for use as a compressed fuel for
       vehicles - Part 1: Designation of the quality (MN from MON).
    """
    if method == "linear_iso15403":
        mon = mon_linear(comp)
    elif method in ("hc_ratio", "hc_ratio_iso15403"):
        mon = mon_hc_ratio(comp)
    else:
        raise CellTypeError(f'method: "{method}" is not one of ' + ", ".join(NEW_METHODS))
    k, d = MN_ISO15403 if method.endswith("iso15403") else MN_PAPER
    return k * mon + d


def basis(comp, method: str) -> str:
    """One line on what a methane number of :data:`NEW_METHODS` leans on (for the tender record)."""
    v = methane_number_by(comp, method)
    conv = ("ISO 15403-1 MN = 1.445 MON - 103.42" if method.endswith("iso15403")
            else "paper's MN = 1.624 MON - 119.1")
    if method.startswith("hc_ratio"):
        return (f"H/C-ratio MON correlation (Kubesh, King & Liss 1992), H/C {hc_ratio(comp):.3f}, "
                f"MON {mon_hc_ratio(comp):.1f}, {conv}: MN {v:.1f}; hydrocarbon gases with at most "
                f"{HC_INERT_MAX:g} vol-% inerts, which it cannot see")
    return (f"linear MON correlation (Kubesh, King & Liss 1992), MON {mon_linear(comp):.1f}, {conv}: "
            f"MN {v:.1f}; pipeline-type natural gas only")


def spread_details(comp) -> tuple:
    """((method, MN) for every valid method, (method, reason) for every refusal).

    Parameters
    ----------
    comp : mapping or Composition
        ``{canonical id: mole fraction}``. [-]

    Returns
    -------
    valid : tuple of (str, float)
        Methods of :data:`SPREAD_METHODS` that accept the gas, with their MN. [-]
    refused : tuple of (str, str)
        The others with the one-line reason.

    References
    ----------
    .. [1] See :func:`cellfuncs.gas.methane_number.methane_number` and
       :func:`methane_number_by`.
    """
    valid, refused = [], []
    for m in SPREAD_METHODS:
        try:
            valid.append((m, mn.methane_number(comp, m)))
        except CellTypeError:
            raise
        except CellInputError as exc:
            refused.append((m, exc.message))
    return tuple(valid), tuple(refused)


SPREAD_RESULTS = ("spread", "lowest", "highest", "count", "methods")


def spread(comp, result: str = "spread"):
    """Methane-number spread over the published methods valid for a gas.

    Parameters
    ----------
    comp : mapping or Composition
        ``{canonical id: mole fraction}`` (dry, O2-free basis taken). [-]
    result : str
        ``"spread"`` (default): highest − lowest; ``"lowest"``, ``"highest"``:
        that methane number; ``"count"``: how many methods apply; ``"methods"``:
        one line listing each method's MN and each refusal.

    Returns
    -------
    value : float or str
        Spread, lowest or highest MN [-], count [-] or text.

    Raises
    ------
    CellInputError
        Fewer than two methods apply (the message gives the refusals).
    CellTypeError
        Unknown result word.

    Notes
    -----
    Methods: EN 16726:2015 Annex A, the linear and the H/C-ratio MON
    correlations of Kubesh, King & Liss (1992), each with the paper's and with
    ISO 15403-1's MON-to-MN conversion; each applies only inside its validity
    (see docs/methods.md).  On pure methane they give 100, 104.7, 95.7, 108.4
    and 99.0: the spread is a property of the methods, not of the gas.

    References
    ----------
    .. [1] EN 16726:2015, Annex A.
    .. [2] Kubesh, J., King, S. R., Liss, W. E. (1992). SAE Technical Paper 922359.
    .. [3] ISO 15403-1:2006 (MN from MON).
    """
    word = "spread" if result in (None, "") else result
    if not isinstance(word, str) or "".join(word.lower().split()) not in SPREAD_RESULTS:
        raise CellTypeError(f"result: {result!r} is not one of " +
                            ", ".join(f'"{w}"' for w in SPREAD_RESULTS))
    word = "".join(word.lower().split())
    _gas(comp)
    valid, refused = spread_details(comp)
    if word == "count":
        return float(len(valid))
    if word == "methods":
        parts = [f"{m} {v:.1f}" for m, v in valid] + [f"{m} refused" for m, _ in refused]
        return "; ".join(parts)
    if len(valid) < (1 if word in ("lowest", "highest") else 2):
        need = 2 if word == "spread" else 1
        head = (f"components: {len(valid)} methane-number method(s) apply to this gas, a {word} "
                f"needs {need}; refused: ")
        # one line within Excel's 255 characters: each refused method by name, its reason cut short
        suffix = ' — see the "methods" result'
        room = max(0, 250 - len(head) - len(suffix))
        names = ", ".join(m for m, _ in refused)
        first = refused[0][1].split(": ")[-1] if refused else ""
        tail = names + (f" (first: {first})" if first else "")
        if len(tail) > room:
            tail = tail[:max(0, room - 1)].rstrip() + "…"
        raise CellInputError(head + tail + suffix)
    vals = [v for _, v in valid]
    if word == "lowest":
        return min(vals)
    if word == "highest":
        return max(vals)
    return max(vals) - min(vals)
