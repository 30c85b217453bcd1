"""Gas composition input: component names and amounts -> normalised mole fractions.

Every GAS_ function (and the charge-air, exhaust and knock families) takes a
gas analysis the way a cell user types it: a column of component names and a
column of amounts, or one two-column block.  :func:`parse_composition` turns
that into an immutable, hashable :class:`Composition` with canonical component
ids and mole fractions that sum to exactly 1.

Rules
-----
* ``components`` is a range of names and ``fractions`` a range of the same
  shape with the amounts; or ``components`` is a two-column range
  (names, amounts) and ``fractions`` is omitted.  Python callers may also pass
  a dict ``{name: amount}``, a list of names with a list of amounts, or a list
  of ``(name, amount)`` pairs.
* Amounts are mol% (sum near 100) or mole fractions (sum near 1), told apart
  by the sum; a sum more than 2 % away from 100 % is an error stating the sum.
  Within that tolerance the composition is normalised.
* An amount must be a number.  Text is refused, numeric text too ("90",
  "95,5 %", "1,000": the last could be one or a thousand), with a
  CellTypeError naming the argument and the row.
* Blank rows are skipped; a name with a blank amount counts as absent (so a
  template listing every component can be filled in partly).  A first row of
  two texts that are neither a component nor a number is taken as a heading.
* A negative amount, a duplicate component or an unknown name is an error
  naming the row, with the closest accepted name suggested.
* ``"C6+"`` is taken as n-hexane (common practice for a lumped hexanes-plus
  fraction when no split is reported).

Canonical ids (other modules rely on these exact strings):
``CH4, C2H6, C3H8, nC4H10, iC4H10, nC5H12, iC5H12, neoC5H12, nC6H14, nC7H16,
nC8H18, H2, CO, H2S, NH3, H2O, He, Ar, N2, O2, CO2``.
"""

from __future__ import annotations

import math
from dataclasses import dataclass, field
from functools import lru_cache

from cellfuncs.errors import CellInputError, CellTypeError, fmt

__all__ = [
    "COMPONENT_IDS",
    "Composition",
    "parse_composition",
    "accepted_names",
    "component_names",
    "component_id",
    "display_name",
    "paired_amounts",
]

#: canonical component ids in the order of ISO 6976:2016 Table 1 (as used here)
COMPONENT_IDS = (
    "CH4", "C2H6", "C3H8", "nC4H10", "iC4H10", "nC5H12", "iC5H12", "neoC5H12",
    "nC6H14", "nC7H16", "nC8H18", "H2", "CO", "H2S", "NH3", "H2O", "He", "Ar",
    "N2", "O2", "CO2",
)

# id -> (display name for the drop-down list, further accepted spellings)
_NAMES = {
    "CH4": ("methane", ("CH4",)),
    "C2H6": ("ethane", ("C2H6",)),
    "C3H8": ("propane", ("C3H8",)),
    "nC4H10": ("n-butane", ("n-C4H10", "nC4H10", "butane", "normal butane")),
    "iC4H10": ("isobutane", ("i-C4H10", "iC4H10", "i-butane", "iso-butane",
                             "2-methylpropane")),
    "nC5H12": ("n-pentane", ("n-C5H12", "nC5H12", "pentane", "normal pentane")),
    "iC5H12": ("isopentane", ("i-C5H12", "iC5H12", "i-pentane", "iso-pentane",
                              "2-methylbutane")),
    "neoC5H12": ("neopentane", ("neo-C5H12", "neoC5H12", "neo-pentane",
                                "2,2-dimethylpropane")),
    "nC6H14": ("n-hexane", ("n-C6H14", "nC6H14", "hexane", "C6+")),
    "nC7H16": ("n-heptane", ("n-C7H16", "nC7H16", "heptane")),
    "nC8H18": ("n-octane", ("n-C8H18", "nC8H18", "octane")),
    "H2": ("hydrogen", ("H2",)),
    "CO": ("carbon monoxide", ("CO",)),
    "H2S": ("hydrogen sulfide", ("H2S", "hydrogen sulphide")),
    "NH3": ("ammonia", ("NH3",)),
    "H2O": ("water", ("H2O", "water vapour", "water vapor")),
    "He": ("helium", ("He",)),
    "Ar": ("argon", ("Ar",)),
    "N2": ("nitrogen", ("N2",)),
    "O2": ("oxygen", ("O2",)),
    "CO2": ("carbon dioxide", ("CO2",)),
}

#: the drop-down list of GAS_COMPONENTS: one common name per component, plus "C6+"
_DROPDOWN = tuple(_NAMES[i][0] for i in COMPONENT_IDS[:9]) + ("C6+",) + tuple(
    _NAMES[i][0] for i in COMPONENT_IDS[9:])

_ORDER = {cid: k for k, cid in enumerate(COMPONENT_IDS)}


def _key(name: str) -> str:
    """Lookup key of a name: lower case, spaces, hyphens, underscores, commas dropped."""
    return "".join(ch for ch in name.lower() if ch not in " -_,\t\u00a0")


_LOOKUP: dict = {}
for _cid, (_disp, _more) in _NAMES.items():
    for _n in (_disp, _cid) + _more:
        _LOOKUP[_key(_n)] = _cid
# spelled-out key -> a readable spelling, for suggestions
_SPELLING: dict = {}
for _cid, (_disp, _more) in _NAMES.items():
    for _n in (_disp,) + _more:
        _SPELLING.setdefault(_key(_n), _n)


def accepted_names(every_spelling: bool = False) -> list:
    """Accepted component names.

    Parameters
    ----------
    every_spelling : bool
        False: one common name per component plus ``"C6+"`` (the drop-down list
        of ``GAS_COMPONENTS``); True: every accepted spelling.

    Returns
    -------
    names : list of str
    """
    if not every_spelling:
        return list(_DROPDOWN)
    out = []
    for cid in COMPONENT_IDS:
        disp, more = _NAMES[cid]
        for n in (disp,) + more:
            if n not in out:
                out.append(n)
    return out


def component_names(index=None):
    """The accepted component names (GAS_COMPONENTS), or the n-th of them.

    Parameters
    ----------
    index : int, optional
        1-based position in the drop-down list; None returns the whole list.

    Returns
    -------
    list of str or str
        The list of :func:`accepted_names`, or its ``index``-th name. [-]

    Raises
    ------
    CellInputError
        ``index`` outside 1 to the number of names.
    """
    names = accepted_names()
    if index is None:
        return names
    if isinstance(index, bool) or not isinstance(index, int) or not 1 <= index <= len(names):
        raise CellInputError(f"index: {index!r} is not a whole number from 1 to {len(names)}")
    return names[index - 1]


def display_name(cid: str) -> str:
    """The common name of a canonical id (``"nC4H10"`` -> ``"n-butane"``)."""
    return _NAMES[cid][0]


def _suggest(name: str) -> str:
    import difflib

    key = _key(name)
    for cutoff in (0.75, 0.5):
        hits = difflib.get_close_matches(key, list(_SPELLING), n=1, cutoff=cutoff)
        if hits:
            return f'did you mean "{_SPELLING[hits[0]]}"?'
    return "see GAS_COMPONENTS() for the accepted names"


def component_id(name: str, arg: str = "components", where: str = "") -> str:
    """Canonical id of a component name (case-insensitive, formula or common name).

    Parameters
    ----------
    name : str
        Component name as typed (``"n-Butane"``, ``"nC4H10"``, ``"C6+"``).
    arg : str
        Argument name for the error message.
    where : str
        Position for the error message (``"row 3"``).

    Raises
    ------
    CellInputError
        For an unknown name, with the closest accepted name suggested.
    """
    cid = _LOOKUP.get(_key(name))
    if cid is None:
        pos = f" {where}" if where else ""
        raise CellInputError(f'{arg}:{pos} unknown component "{name}", {_suggest(name)}')
    return cid


@dataclass(frozen=True)
class Composition:
    """Normalised gas composition (immutable, hashable).

    Attributes
    ----------
    ids : tuple of str
        Canonical component ids present (amount > 0), in :data:`COMPONENT_IDS` order.
    x : tuple of float
        Mole fractions, same order, summing to 1. [-]
    total : float
        Sum of the amounts as given (before normalisation); not part of equality.
    unit : str
        ``"mol%"`` or ``"fraction"``: how the amounts were read; not part of equality.
    """

    ids: tuple
    x: tuple
    total: float = field(default=1.0, compare=False)
    unit: str = field(default="fraction", compare=False)

    def __post_init__(self):
        object.__setattr__(self, "_hash", hash((self.ids, self.x)))

    def __hash__(self) -> int:  # computed once: compositions key many caches
        return self._hash

    def get(self, cid: str, default: float = 0.0) -> float:
        """Mole fraction of a component id (``default`` if absent). [-]"""
        try:
            return self.x[self.ids.index(cid)]
        except ValueError:
            return default

    def as_dict(self) -> dict:
        """``{id: mole fraction}`` in canonical order."""
        return dict(zip(self.ids, self.x))

    def items(self):
        """Pairs ``(id, mole fraction)``."""
        return zip(self.ids, self.x)

    def __len__(self) -> int:
        return len(self.ids)

    def __contains__(self, cid) -> bool:
        return cid in self.ids


# ---------------------------------------------------------------------------
# parsing


def _numeric_text(s: str) -> bool:
    """Text that a reader would take for a number ("90", "95,5 %", "1,000", "1.000,5")."""
    t = s.strip().rstrip("%").replace(" ", "").replace("\u00a0", "")
    for cand in (t.replace(",", "."), t.replace(",", ""), t.replace(".", "").replace(",", ".")):
        try:
            float(cand)
        except ValueError:
            continue
        return True
    return False


def _amount(cell, arg: str, where: str):
    """An amount cell -> float or None (blank).

    Text is refused, numeric-looking text too: "1,000" could be one or a
    thousand, so an amount must be entered as a number.
    """
    if cell is None:
        return None
    if isinstance(cell, bool):
        raise CellTypeError(f"{arg}: {where} amount {cell!r} is not a number")
    if isinstance(cell, (int, float)):
        v = float(cell)
    elif isinstance(cell, str):
        s = cell.strip()
        if s == "":
            return None
        raise CellTypeError(f"{arg}: {where} holds the text {s!r}, not a number"
                            + (" (enter it as a number)" if _numeric_text(s) else ""))
    else:
        raise CellTypeError(f"{arg}: {where} amount {cell!r} is not a number")
    if not math.isfinite(v):
        raise CellInputError(f"{arg}: {where} amount {v} is not a finite number")
    return v


def _name(cell, arg: str, where: str):
    """A name cell -> stripped str or None (blank)."""
    if cell is None:
        return None
    if isinstance(cell, str):
        s = cell.strip()
        return s or None
    shown = fmt(float(cell)) if isinstance(cell, (int, float)) else repr(cell)
    raise CellTypeError(f"{arg}: {where} holds {shown}, a component name is needed")


def _is_header(ncell, acell) -> bool:
    """First row with text in both cells, neither a component nor a number."""
    if not (isinstance(ncell, str) and isinstance(acell, str)) or _key(ncell) in _LOOKUP:
        return False
    return not _numeric_text(acell)


def _finish(pairs: tuple, name_arg: str, amount_arg: str) -> Composition:
    """pairs: ((where, name_cell, amount_cell), ...) -> Composition."""
    seen: dict = {}
    if pairs and _is_header(pairs[0][1], pairs[0][2]):
        pairs = pairs[1:]  # a heading row selected with the data ("component", "mol%")
    for where, ncell, acell in pairs:
        name = _name(ncell, name_arg, where)
        amount = _amount(acell, amount_arg, where)
        if name is None:
            if amount is None or amount == 0.0:
                continue  # blank row
            raise CellInputError(f"{name_arg}: {where} has amount {fmt(amount)} but no component name")
        cid = component_id(name, name_arg, where)
        if cid in seen:
            prev_where, prev_name = seen[cid][0], seen[cid][1]
            raise CellInputError(
                f'{name_arg}: {where} "{name}" repeats {prev_where} "{prev_name}" '
                f"(both are {display_name(cid)}); give each component once")
        if amount is not None and amount < 0:
            raise CellInputError(f'{amount_arg}: {where} ({name}) amount {fmt(amount)} is negative')
        seen[cid] = (where, name, amount or 0.0)
    present = {cid: v[2] for cid, v in seen.items() if v[2] > 0}
    if not present:
        raise CellInputError(f"{amount_arg}: the composition is empty (no component with an amount above 0)")
    total = math.fsum(present.values())
    if abs(total - 100.0) <= 2.0:
        unit = "mol%"
    elif abs(total - 1.0) <= 0.02:
        unit = "fraction"
    else:
        raise CellInputError(
            f"{amount_arg}: the amounts sum to {fmt(total)}, which is neither 100 mol% "
            "(98 to 102) nor 1 as mole fractions (0.98 to 1.02)")
    ids = tuple(sorted(present, key=_ORDER.__getitem__))
    x = [present[c] / total for c in ids]
    # make the sum exactly 1 by putting the rounding residue on the largest fraction
    big = max(range(len(x)), key=x.__getitem__)
    x[big] = 1.0 - math.fsum(x[:big] + x[big + 1:])
    return Composition(ids=ids, x=tuple(x), total=total, unit=unit)


def _shape(rng: tuple) -> tuple:
    rows = len(rng)
    cols = max((len(r) for r in rng), default=0)
    return rows, cols


def _cells(rng: tuple):
    """Row-major cells with a position label."""
    rows, cols = _shape(rng)
    for r, row in enumerate(rng, 1):
        for c, cell in enumerate(row, 1):
            if cols == 1:
                where = f"row {r}"
            elif rows == 1:
                where = f"column {c}"
            else:
                where = f"row {r}, column {c}"
            yield where, cell


def _is_range(obj) -> bool:
    return isinstance(obj, tuple) and all(isinstance(r, tuple) for r in obj)


@lru_cache(maxsize=2048)
def _parse_ranges(components: tuple, fractions) -> Composition:
    if fractions is None:
        rows, cols = _shape(components)
        if cols == 2:
            pairs = tuple((f"row {r}", row[0] if len(row) > 0 else None,
                           row[1] if len(row) > 1 else None)
                          for r, row in enumerate(components, 1))
        elif rows == 2 and cols > 2:
            pairs = tuple((f"column {c}", components[0][c - 1] if c - 1 < len(components[0]) else None,
                           components[1][c - 1] if c - 1 < len(components[1]) else None)
                          for c in range(1, cols + 1))
        else:
            raise CellInputError(
                f"fractions: omitted, so components must be a two-column range (names, amounts); "
                f"got {rows} row(s) × {cols} column(s)")
        return _finish(pairs, "components", "components")
    (nr, nc), (fr, fc) = _shape(components), _shape(fractions)
    one_d = (nr == 1 or nc == 1) and (fr == 1 or fc == 1)
    names = list(_cells(components))
    amounts = [cell for _, cell in _cells(fractions)]
    if (nr, nc) != (fr, fc) and not (one_d and len(names) == len(amounts)):
        raise CellInputError(
            f"fractions: {fr} row(s) × {fc} column(s) does not match components "
            f"{nr} row(s) × {nc} column(s)")
    pairs = tuple((where, n, a) for (where, n), a in zip(names, amounts))
    return _finish(pairs, "components", "fractions")


@lru_cache(maxsize=512)
def _parse_pairs(pairs: tuple) -> Composition:
    return _finish(tuple((f"row {k}", n, a) for k, (n, a) in enumerate(pairs, 1)),
                   "components", "fractions")


def _as_tuple(seq):
    return tuple(seq)


def parse_composition(components, fractions=None) -> Composition:
    """Parse a gas analysis into a normalised :class:`Composition`.

    Parameters
    ----------
    components : range, dict, list or Composition
        A range (tuple of rows of cells: str, float or None) of component
        names, or a two-column range (names, amounts) when ``fractions`` is
        None; a dict ``{name: amount}``; a list of names; a list of
        ``(name, amount)`` pairs; or an already parsed :class:`Composition`
        (returned unchanged).
    fractions : range or list, optional
        Amounts of the same shape as ``components``, in mol% (sum near 100)
        or mole fractions (sum near 1). [mol% or -]

    Returns
    -------
    composition : Composition
        Canonical ids and mole fractions summing to 1. [-]

    Raises
    ------
    CellInputError
        Sum more than 2 % away from 100 %, negative amount, duplicate or
        unknown component (closest accepted name suggested), empty input,
        mismatched shapes.
    CellTypeError
        Text where an amount is needed, a number where a name is needed.

    Notes
    -----
    Results are cached on the (hashable) input, so a sheet with hundreds of
    cells on the same gas parses it once.  ``"C6+"`` is taken as n-hexane
    (common practice).

    References
    ----------
    .. [1] ISO 6976:2016, Natural gas -- Calculation of calorific values,
       density, relative density and Wobbe indices from composition, clause 5
       (mole fractions normalised to sum 1).
    """
    if isinstance(components, Composition):
        return components
    if isinstance(components, dict):
        if fractions is not None:
            raise CellInputError("fractions: must be omitted when components is a dict")
        if any(isinstance(v, bool) for v in components.values()):
            raise CellTypeError("components: dict values must be numbers, not True/False")
        try:
            return _parse_pairs(tuple(components.items()))
        except TypeError:  # unhashable amounts
            raise CellTypeError("components: dict values must be numbers") from None
    if isinstance(components, str):
        components = ((components,),)
    if isinstance(fractions, (int, float)) and not isinstance(fractions, bool):
        fractions = ((float(fractions),),)
    if _is_range(components) and (fractions is None or _is_range(fractions)):
        # True == 1.0 for the cache key: reject booleans before the cache is asked
        for rng, arg in ((components, "components"), (fractions or (), "fractions")):
            for row in rng:
                for cell in row:
                    if isinstance(cell, bool):
                        raise CellTypeError(f"{arg}: {cell!r} is not a name or a number")
        try:
            return _parse_ranges(components, fractions)
        except TypeError as exc:  # unhashable cells
            raise CellTypeError(f"components: cells must be text, numbers or blank ({exc})") from None
    # Python lists / other sequences
    try:
        comps = list(components)
    except TypeError:
        raise CellTypeError(f"components: {components!r} is not a range of names") from None
    if fractions is None:
        if all(isinstance(p, (tuple, list)) and len(p) == 2 for p in comps):
            return parse_composition(tuple((p[0], p[1]) for p in comps))
        raise CellInputError("fractions: omitted, so components must be (name, amount) pairs")
    fr = list(fractions)
    flat_c = tuple((c,) if not isinstance(c, (tuple, list)) else tuple(c) for c in comps)
    flat_f = tuple((f,) if not isinstance(f, (tuple, list)) else tuple(f) for f in fr)
    return _parse_ranges(flat_c, flat_f)


def paired_amounts(components, values, arg: str = "u_fractions") -> dict:
    """Amounts given alongside ``components`` (e.g. uncertainties), by component id.

    Parameters
    ----------
    components : range, list or dict
        The names range as given to :func:`parse_composition` (a two-column
        range counts by its first column).
    values : range, list or dict
        Same shape as the names (or as ``components`` itself); blank cells count as 0.
    arg : str
        Argument name for error messages.

    Returns
    -------
    amounts : dict
        ``{id: value}`` as given (not normalised). [unit of the input]

    Raises
    ------
    CellInputError
        Shapes differ, negative value, unknown or duplicate name.
    """
    if isinstance(components, dict):
        if not isinstance(values, dict):
            raise CellTypeError(f"{arg}: must be a dict when components is a dict")
        pairs = [(f"row {k}", n, values.get(n)) for k, n in enumerate(components, 1)]
        extra = set(values) - set(components)
        if extra:
            raise CellInputError(f"{arg}: {sorted(extra)} are not among the components")
    else:
        if isinstance(components, (list, tuple)) and not _is_range(components):
            components = tuple((c,) for c in components)
        if isinstance(values, (list, tuple)) and not _is_range(values):
            values = tuple((v,) for v in values)
        if isinstance(values, (int, float)) and not isinstance(values, bool):
            values = ((float(values),),)
        if not (_is_range(components) and _is_range(values)):
            raise CellTypeError(f"{arg}: must be a range of numbers")
        (nr, nc), (vr, vc) = _shape(components), _shape(values)
        if nc == 2 and vc == 1 and nr == vr:
            components = tuple((row[0] if row else None,) for row in components)
            nc = 1
        names = list(_cells(components))
        vals = [cell for _, cell in _cells(values)]
        one_d = (nr == 1 or nc == 1) and (vr == 1 or vc == 1)
        if (nr, nc) != (vr, vc) and not (one_d and len(names) == len(vals)):
            raise CellInputError(f"{arg}: {vr} row(s) × {vc} column(s) does not match components "
                                 f"{nr} row(s) × {nc} column(s)")
        pairs = [(w, n, v) for (w, n), v in zip(names, vals)]
    out: dict = {}
    for where, ncell, vcell in pairs:
        name = _name(ncell, "components", where)
        v = _amount(vcell, arg, where)
        if name is None:
            if v:
                raise CellInputError(f"{arg}: {where} has {fmt(v)} but no component name")
            continue
        cid = component_id(name, "components", where)
        if cid in out:
            raise CellInputError(f'components: {where} "{name}" is given twice ({display_name(cid)})')
        if v is not None and v < 0:
            raise CellInputError(f"{arg}: {where} ({name}) value {fmt(v)} is negative")
        out[cid] = v or 0.0
    return out
