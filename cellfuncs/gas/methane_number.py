"""Methane number of a fuel gas: EN 16726:2015 Annex A and a linear correlation.

Two methods:

``"en16726"``
    The partial-mixture method of EN 16726:2015 Annex A with the figures in
    ``cellfuncs/data/en16726_annex_a.json`` (see :mod:`cellfuncs.gas.mn_diagrams`).
    The gas is taken dry and oxygen-free, higher hydrocarbons are lumped into a
    butane equivalent, the combustibles are split into partial mixtures that
    each lie in one diagram and share one methane number, and the inert diagram
    corrects for CO2 and N2.  How the split is found is described in
    :func:`split_combustibles` and in docs/methods.md.
``"linear"``
    Kubesh, King & Liss (1992): a linear motor octane number (MON) from the
    mole fractions of methane, ethane, propane, butanes, CO2 and N2, and
    MN = 1.624 MON - 119.1.  Pipeline-type natural gas only.

The cores take a plain mapping ``{canonical id: mole fraction}`` (or a parsed
:class:`~cellfuncs.gas.composition.Composition`); ``cell_...`` functions are the
spreadsheet wrappers.  Results are cached on the (ids, fractions) tuple.
Results are estimates for tendering: the engine's permitted gas quality comes
from the engine's declared datasheet, and final design follows local codes
and licensed engineers.
"""

from __future__ import annotations

import math
import re
from dataclasses import dataclass
from functools import lru_cache

from cellfuncs.errors import CellInputError, fmt
from cellfuncs.gas import mn_diagrams as dg
from cellfuncs.gas.composition import parse_composition
from cellfuncs.gas.mn_split import Partial, split_combustibles

#: longest text a cell function may return (Excel shows #VALUE! beyond it)
TEXT_MAX = 255

__all__ = [
    "MethaneNumber",
    "methane_number",
    "methane_number_en16726",
    "methane_number_linear",
    "en16726_details",
    "split_combustibles",
    "Partial",
    "basis_text",
    "METHODS",
]

METHODS = ("en16726", "linear", "linear_iso15403", "hc_ratio", "hc_ratio_iso15403")
_METHOD_ALIASES = {"en16726:2015": "en16726", "en16726annexa": "en16726", "annexa": "en16726",
                   "kubesh": "linear", "sae922359": "linear", "hc": "hc_ratio"}

KNOWN_IDS = ("CH4", "C2H6", "C3H8", "nC4H10", "iC4H10", "nC5H12", "iC5H12", "neoC5H12",
             "nC6H14", "nC7H16", "nC8H18", "H2", "CO", "H2S", "NH3", "H2O", "He", "Ar",
             "N2", "O2", "CO2")
_NAMES = {"CH4": "methane", "C2H6": "ethane", "C3H8": "propane", "nC4H10": "n-butane",
          "iC4H10": "isobutane", "nC5H12": "n-pentane", "iC5H12": "isopentane",
          "neoC5H12": "neopentane", "nC6H14": "n-hexane", "nC7H16": "n-heptane",
          "nC8H18": "n-octane", "H2": "hydrogen", "CO": "carbon monoxide",
          "H2S": "hydrogen sulfide", "NH3": "ammonia", "H2O": "water", "He": "helium",
          "Ar": "argon", "N2": "nitrogen", "O2": "oxygen", "CO2": "carbon dioxide"}

PENTANES = ("nC5H12", "iC5H12", "neoC5H12")
HEXANES_PLUS = ("nC6H14", "nC7H16", "nC8H18")
REMOVED = ("H2O", "O2")          # taken out, the rest renormalised (dry, O2-free basis)
AS_NITROGEN = ("Ar", "He")       # counted as N2 in the inert diagram, up to ARHE_MAX
NOT_COVERED = ("NH3",)
C5_MAX, C6_MAX, C56_MAX = 3.0, 3.0, 5.0   # vol-% of the dry, O2-free gas
ARHE_MAX = 1.0                            # vol-% of the dry, O2-free gas (our treatment)
LIMIT_SRC = "EN 16726:2015 Annex A method limit, dry O2-free basis"

# group of each combustible id and its weight in that group (lumping factors from the data)
_GROUPS_ORDER = ("CH4", "C2H6", "C3H8", "C4H10_eq", "H2", "CO", "H2S")


@lru_cache(maxsize=1)
def _lumping() -> dict:
    f = dg.annex()["lumping"]["factors"]
    c4, c5, c6 = f["n-C4H10"], f["n-C5H12"], f["C6+ (hexanes and higher)"]
    out = {"CH4": ("CH4", 1.0), "C2H6": ("C2H6", 1.0), "C3H8": ("C3H8", 1.0),
           "nC4H10": ("C4H10_eq", c4), "iC4H10": ("C4H10_eq", f["i-C4H10"]),
           "H2": ("H2", 1.0), "CO": ("CO", 1.0), "H2S": ("H2S", 1.0)}
    for cid in PENTANES:
        out[cid] = ("C4H10_eq", c5)
    for cid in HEXANES_PLUS:
        out[cid] = ("C4H10_eq", c6)
    return out


# ---------------------------------------------------------------------------
# input handling


def _items(comp) -> tuple:
    """(ids, x) tuples in canonical order from a mapping or a Composition."""
    if hasattr(comp, "ids") and hasattr(comp, "x"):
        return tuple(comp.ids), tuple(float(v) for v in comp.x)
    pairs = dict(comp)
    for cid, v in pairs.items():
        if cid not in KNOWN_IDS:
            raise CellInputError(f'components: unknown component id "{cid}"')
        if not isinstance(v, (int, float)) or isinstance(v, bool) or not math.isfinite(v) or v < 0:
            raise CellInputError(f"components: {cid} fraction {v!r} is not a number >= 0")
    ids = tuple(c for c in KNOWN_IDS if pairs.get(c, 0.0) > 0)
    return ids, tuple(float(pairs[c]) for c in ids)


#: amounts below this mole fraction (0.1 ppm, far below what a gas analysis reports) count as
#: absent: a vanishing trace must not switch the partial-mixture split to another plan
TRACE = 1e-7


def _dry_o2_free(ids: tuple, x: tuple) -> dict:
    """{id: vol-%} of the gas without H2O and O2 and without sub-ppm traces, renormalised to 100."""
    kept = {c: v for c, v in zip(ids, x) if c not in REMOVED and v > TRACE}
    tot = math.fsum(kept.values())
    if tot <= 0:
        raise CellInputError("components: nothing is left once water and oxygen are removed "
                             "(methane numbers are on a dry, oxygen-free basis)")
    return {c: 100.0 * v / tot for c, v in kept.items()}


def _check_heavies(g: dict, method: str) -> None:
    c5 = math.fsum(g.get(c, 0.0) for c in PENTANES)
    c6 = math.fsum(g.get(c, 0.0) for c in HEXANES_PLUS)
    tag = f"{method}: " if method else ""
    if c5 > C5_MAX:
        raise CellInputError(f"components: {tag}pentanes {fmt(c5)} vol-% are above {C5_MAX:g} vol-% "
                             f"({LIMIT_SRC})")
    if c6 > C6_MAX:
        raise CellInputError(f"components: {tag}hexanes and heavier {fmt(c6)} vol-% are above "
                             f"{C6_MAX:g} vol-% ({LIMIT_SRC})")
    if c5 + c6 > C56_MAX:
        raise CellInputError(f"components: {tag}pentanes plus hexanes and heavier {fmt(c5 + c6)} vol-% "
                             f"are above {C56_MAX:g} vol-% together ({LIMIT_SRC})")


def _check_ar_he(g: dict, method: str) -> float:
    arhe = math.fsum(g.get(c, 0.0) for c in AS_NITROGEN)
    if arhe > ARHE_MAX:
        big = max(AS_NITROGEN, key=lambda c: g.get(c, 0.0))
        raise CellInputError(
            f"components: {method}: {_NAMES[big]} ({big}); argon plus helium {fmt(arhe)} vol-% is "
            f"above the {ARHE_MAX:g} vol-% counted as nitrogen (no diagram of EN 16726 Annex A "
            "covers them)")
    return arhe


# ---------------------------------------------------------------------------
# EN 16726 Annex A: the whole method


@dataclass(frozen=True)
class MethaneNumber:
    """Result of the EN 16726 Annex A method with what it leans on.

    Attributes
    ----------
    mn : float
        Methane number of the gas. [-]
    mn_combustibles : float
        Common methane number of the partial mixtures. [-]
    inert_term : float
        Correction for CO2 and N2, P(x, y) - P(100, 0) of the inert diagram. [-]
    combustibles, co2, n2 : float
        Shares in the dry, O2-free gas (N2 includes Ar and He). [vol-%]
    plan : str
        How the combustibles were split (see :func:`split_combustibles`).
    partials : tuple of Partial
    a22_spread : float
        Change of the MN if the inert term a22 (sign uncertain) had the other sign. [-]
    notes : tuple of str
        Cautions (doubtful diagrams, Ar/He counted as N2, ...).
    """

    mn: float
    mn_combustibles: float
    inert_term: float
    combustibles: float
    co2: float
    n2: float
    plan: str
    partials: tuple
    a22_spread: float
    notes: tuple

    @property
    def diagram_shares(self) -> dict:
        """Diagram code -> share of the combustibles in it. [vol-%]"""
        out: dict = {}
        for p in self.partials:
            out[p.code] = out.get(p.code, 0.0) + p.share
        return out

    @property
    def doubtful(self) -> tuple:
        """Codes of doubtful diagrams this result leans on (``"D06"``, ``"D11"``...)."""
        return tuple(c for c in self.diagram_shares if c in dg.DOUBTFUL)


@lru_cache(maxsize=1024)
def _en16726(ids: tuple, x: tuple) -> MethaneNumber:
    g = _dry_o2_free(ids, x)
    for cid in NOT_COVERED:
        if g.get(cid, 0.0) > 0:
            raise CellInputError(f"components: EN16726: {_NAMES[cid]} ({cid}) is not covered by "
                                 "EN 16726:2015 Annex A")
    _check_heavies(g, "EN16726")
    arhe = _check_ar_he(g, "EN16726")
    co2 = g.get("CO2", 0.0)
    n2 = g.get("N2", 0.0) + arhe
    comb = 100.0 - co2 - n2
    inert = dg.inert_diagram()
    lo_x, _ = inert.domain["x"]
    _, hi_z = inert.domain["z"]
    if comb < lo_x:
        raise CellInputError(f"components: EN16726: combustibles {fmt(comb)} vol-% are below "
                             f"{lo_x:g} vol-% (domain of the inert diagram of EN 16726:2015 Annex A)")
    if n2 > hi_z:
        raise CellInputError(f"components: EN16726: nitrogen {fmt(n2)} vol-% is above {hi_z:g} "
                             "vol-% (domain of the inert diagram of EN 16726:2015 Annex A)")
    lump = _lumping()
    grp: dict = {}
    for cid, v in g.items():
        if cid in lump:
            name, w = lump[cid]
            grp[name] = grp.get(name, 0.0) + w * v
    tot = math.fsum(grp.values())
    groups = tuple((k, 100.0 * grp[k] / tot) for k in _GROUPS_ORDER if grp.get(k, 0.0) > 0)
    m_comb, plan, partials = split_combustibles(groups)
    p_ref = inert.value(100.0, 0.0)
    term = inert.value(comb, co2) - p_ref
    a22 = inert.rows[2][2] if len(inert.rows) > 2 and len(inert.rows[2]) > 2 else 0.0
    spread = -2.0 * a22 * comb ** 2 * co2 ** 2  # MN change if a22 had the other sign
    notes = []
    shares: dict = {}
    for p in partials:
        shares[p.code] = shares.get(p.code, 0.0) + p.share
    for code, why in dg.DOUBTFUL.items():
        if code in shares:
            tag = "CAUTION" if code in dg.SUSPECT else "note"
            notes.append(f"{tag}: leans on {code} for {shares[code]:.3g} % of the combustibles "
                         f"({why})")
    if arhe > 0:
        notes.append(f"argon/helium {arhe:.3g} vol-% counted as nitrogen")
    return MethaneNumber(mn=m_comb + term, mn_combustibles=m_comb, inert_term=term,
                         combustibles=comb, co2=co2, n2=n2, plan=plan, partials=partials,
                         a22_spread=spread, notes=tuple(notes))


def en16726_details(comp) -> MethaneNumber:
    """Full EN 16726 Annex A result (cached) for a mapping ``{id: fraction}`` or a Composition.

    Parameters
    ----------
    comp : mapping or Composition
        ``{canonical id: mole fraction}`` (any positive scale; normalised on a
        dry, O2-free basis). [-]

    Returns
    -------
    MethaneNumber
        The methane number [-] with the combustible MN [-], the inert term [-],
        the shares of combustibles, CO2 and N2 [vol-%], the split plan, the
        partial mixtures, the a22 sign spread [-] and the cautions.

    Raises
    ------
    CellInputError
        As :func:`methane_number_en16726`.

    Notes
    -----
    Validity as :func:`methane_number_en16726` (pentanes and hexanes-plus at
    most 3 vol-% each and 5 vol-% together, argon plus helium at most 1 vol-%,
    no ammonia, combustibles at least 35 vol-% of the dry gas).  The result is
    cached on the (ids, fractions) tuple.

    References
    ----------
    .. [1] EN 16726:2015, Gas infrastructure - Quality of gas - Group H, Annex A
       (figures as published in open transcriptions; unverified against Table A.10).
    """
    ids, x = _items(comp)
    if not ids:
        raise CellInputError("components: the composition is empty")
    return _en16726(ids, x)


def methane_number_en16726(comp) -> float:
    """Methane number by EN 16726:2015 Annex A.

    Parameters
    ----------
    comp : mapping or Composition
        ``{canonical id: mole fraction}`` (any positive scale; normalised on a
        dry, O2-free basis). [-]

    Returns
    -------
    mn : float
        Methane number. [-]

    Raises
    ------
    CellInputError
        Ammonia present; pentanes above 3 vol-%, hexanes and heavier above
        3 vol-% or both above 5 vol-%; argon plus helium above 1 vol-%;
        combustibles below 35 vol-% or N2 above 65 vol-% (inert diagram);
        no split into partial mixtures of equal MN inside the diagrams.

    Notes
    -----
    Dry, O2-free basis: H2O and O2 are removed and the rest renormalised to
    100 vol-%.  Butane equivalent = butanes + 2.3 x pentanes (n-, iso- and
    neopentane) + 5.3 x hexanes and heavier (n-hexane, "C6+", n-heptane,
    n-octane).  Argon and helium (no diagram covers them) are counted as
    nitrogen up to 1 vol-% together (our treatment).  The combustibles are
    renormalised to 100 vol-% and split by :func:`split_combustibles`; their
    common MN is corrected for inerts by MN = MN_c + P(x, y) - P(100, 0), with
    P the inert polynomial, x the combustibles and y the CO2 in vol-% of the
    whole dry gas (N2 the rest).  The figures are unverified against the
    standard's Table A.10 (see the data file's provenance and open questions,
    and docs/methods.md).  Estimate for tendering.

    References
    ----------
    .. [1] EN 16726:2015, Gas infrastructure - Quality of gas - Group H, Annex A
       (figures as published in open transcriptions; unverified against Table A.10).
    .. [2] ASTM D8221 scope (public text): C5 and C6+ at most 3 vol-% each, 5 vol-%
       together, dry and oxygen-free, for the method it bases on EN 16726 Annex A.
    """
    return en16726_details(comp).mn


# ---------------------------------------------------------------------------
# linear correlation

LINEAR_COEF = {"CH4": 137.78, "C2H6": 29.948, "C3H8": -18.193, "C4": -167.062,
               "CO2": 181.233, "N2": 26.994}
LINEAR_MN = (1.624, -119.1)
LINEAR_REFUSED = ("H2", "CO", "H2S", "NH3")
LINEAR_CH4_MIN = 70.0  # vol-%, our screen for "pipeline-type natural gas"


@lru_cache(maxsize=1024)
def _linear(ids: tuple, x: tuple) -> float:
    g = _dry_o2_free(ids, x)
    for cid in LINEAR_REFUSED:
        if g.get(cid, 0.0) > 0:
            raise CellInputError(
                f"components: linear: {_NAMES[cid]} ({cid}) is outside the Kubesh, King & Liss "
                "(1992) correlation (pipeline-type natural gas only); use method \"en16726\"")
    _check_heavies(g, "linear")
    arhe = _check_ar_he(g, "linear")
    ch4 = g.get("CH4", 0.0)
    if ch4 < LINEAR_CH4_MIN:
        raise CellInputError(
            f"components: linear: methane {fmt(ch4)} vol-% is below {LINEAR_CH4_MIN:g} vol-% (our "
            "screen for the pipeline-type natural gas the correlation was fitted to); use method "
            "\"en16726\"")
    lump = _lumping()
    c4 = math.fsum(lump[c][1] * g.get(c, 0.0) for c in ("nC4H10", "iC4H10") + PENTANES + HEXANES_PLUS)
    f = {"CH4": ch4, "C2H6": g.get("C2H6", 0.0), "C3H8": g.get("C3H8", 0.0), "C4": c4,
         "CO2": g.get("CO2", 0.0), "N2": g.get("N2", 0.0) + arhe}
    mon = math.fsum(LINEAR_COEF[k] * f[k] / 100.0 for k in LINEAR_COEF)
    return LINEAR_MN[0] * mon + LINEAR_MN[1]


def methane_number_linear(comp) -> float:
    """Methane number by the linear MON correlation of Kubesh, King & Liss (1992).

    Parameters
    ----------
    comp : mapping or Composition
        ``{canonical id: mole fraction}`` (dry, O2-free basis taken here). [-]

    Returns
    -------
    mn : float
        MN = 1.624 MON - 119.1 with MON = 137.78 x_CH4 + 29.948 x_C2H6
        - 18.193 x_C3H8 - 167.062 x_C4H10 + 181.233 x_CO2 + 26.994 x_N2
        (mole fractions; both butanes summed). [-]

    Raises
    ------
    CellInputError
        H2, CO, H2S or NH3 present; methane below 70 vol-%; pentanes/hexanes
        above the limits of the EN 16726 method; argon plus helium above 1 vol-%.

    Notes
    -----
    Pipeline-type natural gas only.  Gives 104.7, not 100, for pure methane.
    Pentanes and heavier have no term: they are added to the butanes with the
    butane-equivalent factors of EN 16726 Annex A (2.3 and 5.3; our choice);
    argon and helium are counted as nitrogen; H2O and O2 are removed first.

    References
    ----------
    .. [1] Kubesh, J., King, S. R., Liss, W. E. (1992). Effect of gas composition
       on octane number of natural gas fuels. SAE Technical Paper 922359.
    """
    ids, x = _items(comp)
    if not ids:
        raise CellInputError("components: the composition is empty")
    return _linear(ids, x)


def _method(method) -> str:
    if method is None:
        return "en16726"
    key = "".join(str(method).lower().split())
    key = _METHOD_ALIASES.get(key, key)
    if key not in METHODS:
        raise CellInputError(f'method: "{method}" is not one of ' + ", ".join(f'"{m}"' for m in METHODS))
    return key


def methane_number(comp, method: str = "en16726") -> float:
    """Methane number of a gas by ``method`` ``"en16726"`` or ``"linear"``.

    Parameters
    ----------
    comp : mapping or Composition
        ``{canonical id: mole fraction}`` (any positive scale; taken on a dry,
        O2-free basis). [-]
    method : str
        ``"en16726"`` (EN 16726:2015 Annex A, default) or ``"linear"``
        (Kubesh, King & Liss 1992); aliases such as ``"annex a"`` or
        ``"kubesh"`` are accepted, blank or None means ``"en16726"``.

    Returns
    -------
    mn : float
        Methane number (methane = 100, hydrogen = 0). [-]

    Raises
    ------
    CellInputError
        Unknown method; otherwise as :func:`methane_number_en16726` or
        :func:`methane_number_linear`.

    Notes
    -----
    Dispatches to :func:`methane_number_en16726` or
    :func:`methane_number_linear`; see those for the validity range (EN 16726:
    pentanes and hexanes-plus at most 3 vol-% each and 5 vol-% together,
    argon plus helium at most 1 vol-%, no ammonia; linear: pipeline-type
    natural gas with at least 70 vol-% methane and no H2, CO, H2S or NH3).
    Estimate for tendering.

    References
    ----------
    .. [1] EN 16726:2015, Gas infrastructure - Quality of gas - Group H, Annex A
       (figures as published in open transcriptions; unverified against Table A.10).
    .. [2] Kubesh, J., King, S. R., Liss, W. E. (1992). Effect of gas composition
       on octane number of natural gas fuels. SAE Technical Paper 922359.
    """
    m = _method(method)
    if m not in ("en16726", "linear"):  # the other correlations (cellfuncs.gas.mn_correlations)
        from cellfuncs.gas import mn_correlations

        return mn_correlations.methane_number_by(comp, m)
    return methane_number_en16726(comp) if m == "en16726" else methane_number_linear(comp)


def basis_text(comp, method: str = "en16726") -> str:
    """One line saying what a methane number leans on and which doubts apply.

    For ``"en16726"``: the plan, the diagrams with their share of the
    combustibles, the inert correction, the effect of the uncertain sign of the
    inert term a22, a CAUTION when the doubtful diagram D06 is used (else "D06 not
    used"), a note for the high-order diagrams D09-D11 and for argon/helium.
    For ``"linear"``: the correlation and its scope.

    Parameters
    ----------
    comp : mapping or Composition
        ``{canonical id: mole fraction}`` (any positive scale). [-]
    method : str
        ``"en16726"`` (default) or ``"linear"``, as :func:`methane_number`.

    Returns
    -------
    str
        One line of text; the methane numbers in it are [-], the shares [vol-%].

    Raises
    ------
    CellInputError
        As :func:`methane_number`.

    Notes
    -----
    Validity as :func:`methane_number`.  The text is for the tender record; it
    does not replace the engine's declared gas-quality limits.

    References
    ----------
    .. [1] EN 16726:2015, Gas infrastructure - Quality of gas - Group H, Annex A
       (figures as published in open transcriptions; unverified against Table A.10).
    .. [2] Kubesh, J., King, S. R., Liss, W. E. (1992). Effect of gas composition
       on octane number of natural gas fuels. SAE Technical Paper 922359.
    """
    m = _method(method)
    if m not in ("en16726", "linear"):
        from cellfuncs.gas import mn_correlations

        return mn_correlations.basis(comp, m)
    if m == "linear":
        v = methane_number_linear(comp)
        return (f"linear MON correlation (Kubesh, King & Liss 1992), MN {v:.1f}; pipeline-type "
                "natural gas only; gives 104.7 for pure methane")
    r = en16726_details(comp)
    full = _en16726_text(r, compact=False)
    if len(full) <= TEXT_MAX:
        return full
    # Excel shows #VALUE! for a text over 255 characters: the compact form drops the notes'
    # explanations (docs/methods.md has them) and rounds the shares, keeping every caution
    full = _en16726_text(r, compact=True)
    if len(full) <= TEXT_MAX:
        return full
    tail = "; unverified vs Table A.10"
    return full[:TEXT_MAX - len(tail) - 1] + "…" + tail


def _compact_note(note: str) -> str:
    """``"CAUTION: leans on D06 for 12.3 % of the combustibles (why)"`` -> ``"CAUTION D06 12 %"``."""
    m = re.match(r"(CAUTION|note): leans on (\S+) for ([0-9.eE+-]+) %", note)
    if m:
        return f"{m.group(1)} {m.group(2)} {float(m.group(3)):.0f} %"
    return re.sub(r" \(.*\)$", "", note).replace("counted as nitrogen", "as N2")


def _en16726_text(r, compact: bool) -> str:
    """The EN 16726 line of :func:`basis_text`, full or compact."""
    if compact:
        parts = ", ".join(f"{c} {s:.0f} %" for c, s in r.diagram_shares.items())
        text = f"EN 16726 A, {r.plan}: {parts} at MN {r.mn_combustibles:.2f}; inerts {r.inert_term:+.2f}"
        if r.co2 > 0 and abs(r.a22_spread) >= 0.005:
            text += f" (a22 other sign: {r.a22_spread:+.2f})"
        notes = [_compact_note(n) for n in r.notes]
        tail = "; unverified vs Table A.10"
    else:
        parts = ", ".join(f"{c} {s:.1f} %" for c, s in r.diagram_shares.items())
        text = (f"EN 16726 Annex A, {r.plan}: {parts} of combustibles at MN "
                f"{r.mn_combustibles:.2f}; inerts {r.inert_term:+.2f}")
        if r.co2 > 0 and abs(r.a22_spread) >= 0.005:
            text += f" (a22 sign unverified: the other sign gives {r.a22_spread:+.2f})"
        notes = list(r.notes)
        tail = "; figures unverified against Table A.10"
    if not any(c in dg.SUSPECT for c in r.diagram_shares):
        text += "; D06 not used"
    if notes:
        text += "; " + "; ".join(notes)
    return text + tail
