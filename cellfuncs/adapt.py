"""Turn cell values into core inputs and core results into cell values.

Both adapters (``cellfuncs.excel`` for xlwings, ``cellfuncs.headless`` for the
``formulas`` engine) call :func:`call` with the raw values a cell formula
handed over.  The rules, the same for both:

* a number argument takes an int or float (a 1×1 range counts); booleans,
  text (even numeric text such as ``"12"``), NaN and infinities are refused;
* ``None`` (an omitted argument ``F(1,,3)`` or a blank cell: xlwings, the
  headless engine and LibreOffice Calc all hand these over as ``None``) for an
  optional argument means "use the default";
* empty text ``""`` (or only spaces: an ``IF(..., "")``, a failed lookup) is a
  value, not an omission: for a number or integer argument it is an error naming
  the argument; for option, text, reference and range arguments it means "use the
  default" (spreadsheet users write ``""`` for "the default word");
* for option, text and range arguments ``0`` also means "use the default"
  (LibreOffice Calc hands a reference to an empty cell over as 0; for a number
  argument that 0 is the number 0);
* option words are matched case-insensitively with surrounding spaces ignored;
* a range argument becomes a tuple of rows of cells (float, str or ``None``);
  a scalar becomes ``((v,),)`` and a 1-D list a column;
* a gas analysis (a ``gas`` argument and the ``amounts`` argument after it) is
  parsed here, once, into a :class:`~cellfuncs.gas.composition.Composition`
  (cached on the ranges); the core receives the composition in the ``gas``
  position and no ``amounts`` position.  Results of functions taking a gas
  analysis are cached on their coerced arguments (a sheet asks the same gas
  many times);
* a stage list (``stages``: one row or one column of numbers, a blank is a
  stage with nothing in it) becomes a tuple of floats and ``None``, laid out
  results follow it: a 1-D result of an ``array`` function is returned as a
  row or a column like the function's first stage list; a list of words
  (``words``) becomes a tuple of stripped texts and ``None``; ``numbers`` (any
  block, blanks skipped) a tuple of floats; a table ``axis`` a tuple of floats
  (trailing blanks dropped) and a ``table`` a tuple of rows of floats and
  ``None``.  Text where a number belongs is refused naming the argument and the
  cell;
* an error the core raises names its own parameter (``lambda_: ...``); the
  message is given back with the catalogue's name for that position
  (``air_ratio: ...``), so a cell always speaks the glossary's names.

Errors are :class:`~cellfuncs.errors.CellInputError`; the adapters render them.
"""

from __future__ import annotations

import functools
import inspect
import itertools
import math
import re

from cellfuncs.catalogue.spec import RANGE_KINDS, REQUIRED, CellFunction
from cellfuncs.errors import CellInputError, CellTypeError

__all__ = ["coerce_args", "call", "result_to_cells", "is_blank", "core_names"]

_NUMBER_TYPES = (int, float)


class CellErrorValue(CellInputError):
    """An argument that already holds an Excel error value (passed through)."""

    def __init__(self, name: str, code: str):
        super().__init__(f"{name}: input is the error {code}")
        self.excel_error = code


def is_blank(v) -> bool:
    return v is None or (isinstance(v, str) and v.strip() == "")


def _scalar(name, v):
    """Unwrap 1×1 lists; refuse larger blocks for scalar arguments."""
    if isinstance(v, (list, tuple)):
        flat = _flatten(v)
        if len(flat) == 1:
            return flat[0]
        raise CellTypeError(f"{name}: expects one cell, got a range of {len(flat)} cells")
    return v


def _flatten(v):
    out = []
    for item in v:
        if isinstance(item, (list, tuple)):
            out.extend(item)
        else:
            out.append(item)
    return out


def _number(arg, v):
    if isinstance(v, bool):
        raise CellTypeError(f"{arg.name}: {v!r} is a logical value, not a number")
    if isinstance(v, _NUMBER_TYPES):
        f = float(v)
        if not math.isfinite(f):
            raise CellInputError(f"{arg.name}: {v} is not a finite number")
        return f
    if isinstance(v, str):
        raise CellTypeError(f"{arg.name}: text {v.strip()!r} is not a number"
                            + (" (enter it as a number, not as text)" if _numeric_text(v) else ""))
    try:  # numpy scalars and the like
        f = float(v)
    except (TypeError, ValueError):
        raise CellTypeError(f"{arg.name}: {v!r} is not a number") from None
    if not math.isfinite(f):
        raise CellInputError(f"{arg.name}: {f} is not a finite number")
    return f


def _numeric_text(s: str) -> bool:
    try:
        float(s)
        return True
    except ValueError:
        return False


def _cell(v):
    """One cell of a range: float, str or None."""
    if v is None:
        return None
    if isinstance(v, str):
        return None if v.strip() == "" else v
    if isinstance(v, bool):
        return v
    if isinstance(v, _NUMBER_TYPES):
        return float(v)
    try:
        return float(v)
    except (TypeError, ValueError):
        return str(v)


_PLAIN_RANGE_TYPES = frozenset((float, str, type(None)))
_chain = itertools.chain.from_iterable


def _range(arg, v):
    # fast path: a list of rows of floats, names and blanks (what xlwings hands over)
    if type(v) is list and v and type(v[0]) is list:
        try:
            rows = tuple(map(tuple, v))
        except TypeError:
            rows = None
        if rows is not None:
            # floats, text and blanks pass as they are (a cell holding only spaces stays text)
            if set(map(type, _chain(rows))) <= _PLAIN_RANGE_TYPES and "" not in _chain(rows):
                return rows
    if isinstance(v, (list, tuple)):
        if not v:
            return ()
        if any(isinstance(r, (list, tuple)) for r in v):
            return tuple(tuple(_cell(c) for c in (r if isinstance(r, (list, tuple)) else (r,)))
                         for r in v)
        return tuple((_cell(c),) for c in v)
    return ((_cell(v),),)


class CellList(tuple):
    """A tuple of the cells of a one-row or one-column range; ``layout`` is
    ``"row"`` or ``"column"`` (how a result following it is laid out)."""

    __slots__ = ()
    layout = "row"


class _ColumnList(CellList):
    __slots__ = ()
    layout = "column"


def _line(name: str, rows: tuple):
    """The cells of a one-row or one-column range and its layout."""
    n_rows = len(rows)
    n_cols = max((len(r) for r in rows), default=0)
    if n_rows == 0 or n_cols == 0:
        raise CellTypeError(f"{name}: no cells given; select one row or one column")
    if n_rows > 1 and n_cols > 1:
        raise CellTypeError(f"{name}: a {n_rows}×{n_cols} block was given; select one row or one column")
    if n_rows == 1:
        return list(rows[0]), "row"
    return [r[0] if r else None for r in rows], "column"


def _cell_number(name: str, i: int, c):
    if c is None or (isinstance(c, str) and c.strip() == ""):
        return None
    if isinstance(c, bool) or not isinstance(c, _NUMBER_TYPES):
        raise CellTypeError(f"{name}: cell {i} {c!r} is not a number")
    if not math.isfinite(c):
        raise CellInputError(f"{name}: cell {i} {c} is not a finite number")
    return float(c)


def _stages(name: str, rows: tuple) -> CellList:
    """A stage list: numbers and None (blank), laid out as given."""
    cells, lay = _line(name, rows)
    out = [_cell_number(name, i, c) for i, c in enumerate(cells, start=1)]
    return (CellList if lay == "row" else _ColumnList)(out)


def _words(name: str, rows: tuple) -> CellList:
    """A list of words: stripped text, None for a blank; a number is handed on as it is
    (the core names it as a wrong word)."""
    cells, lay = _line(name, rows)
    out = [None if c is None or (isinstance(c, str) and c.strip() == "") else
           (c.strip() if isinstance(c, str) else c) for c in cells]
    return (CellList if lay == "row" else _ColumnList)(out)


def _numbers(name: str, rows: tuple) -> tuple:
    """Every number of a block of any shape, row by row; blanks skipped."""
    out = []
    for i, c in enumerate(_chain(rows), start=1):
        f = _cell_number(name, i, c)
        if f is not None:
            out.append(f)
    return tuple(out)


def _axis(name: str, rows: tuple) -> tuple:
    """A table axis or column of values: one row or column, trailing blanks dropped."""
    if not rows or not rows[0]:
        raise CellInputError(f"{name}: the range is empty")
    if len(rows) > 1 and max(len(r) for r in rows) > 1:
        raise CellInputError(f"{name}: a range of {len(rows)} rows and {max(len(r) for r in rows)} "
                             "columns; give one column or one row")
    if len(rows) == 1:
        cells, word = list(rows[0]), "column"
    else:
        cells, word = [r[0] if r else None for r in rows], "row"
    while cells and is_blank(cells[-1]):
        cells.pop()
    if not cells:
        raise CellInputError(f"{name}: the range holds only blanks")
    vals = []
    for i, c in enumerate(cells, start=1):
        if is_blank(c):
            raise CellInputError(f"{name}: {word} {i} is blank inside the table (only trailing "
                                 "blanks are ignored)")
        if isinstance(c, bool) or not isinstance(c, _NUMBER_TYPES):
            raise CellTypeError(f"{name}: {word} {i} holds {c!r}, not a number")
        if not math.isfinite(c):
            raise CellInputError(f"{name}: {word} {i} holds {c}, not a finite number")
        vals.append(float(c))
    return (CellList if word == "column" else _ColumnList)(vals)


def _table(name: str, rows: tuple) -> tuple:
    """A block of numbers: rows of floats and None (blank); text refused naming the cell."""
    out = []
    for r, row in enumerate(rows, start=1):
        vals = []
        for c_i, c in enumerate(row, start=1):
            if is_blank(c):
                vals.append(None)
            elif isinstance(c, bool) or not isinstance(c, _NUMBER_TYPES):
                raise CellTypeError(f"{name}: row {r}, column {c_i} holds {c!r}, not a number")
            elif not math.isfinite(c):
                raise CellInputError(f"{name}: row {r}, column {c_i} holds {c}, not a finite number")
            else:
                vals.append(float(c))
        out.append(tuple(vals))
    return tuple(out)


_LISTS = {"stages": _stages, "words": _words, "numbers": _numbers, "axis": _axis, "table": _table}


def _one(arg, v):
    kind = arg.kind
    if kind in RANGE_KINDS:
        # an optional range given 0: LibreOffice Calc hands a reference to one empty cell over
        # as 0 (a range can't be the number 0)
        if v is None or (isinstance(v, str) and v.strip() == "") or (
                (arg.optional or kind == "amounts") and type(v) in _NUMBER_TYPES and v == 0):
            if kind == "amounts":  # may always be left empty (two-column components range)
                return None
            if arg.optional:
                return arg.default
            raise CellTypeError(f"{arg.name}: a range is required (got a blank)")
        rows = _range(arg, v)
        shaper = _LISTS.get(kind)
        return rows if shaper is None else shaper(arg.name, rows)
    v = _scalar(arg.name, v)
    if kind in ("number", "integer") and isinstance(v, str) and v.strip() == "":
        raise CellTypeError(f"{arg.name}: empty text is not a number" + _empty_hint(arg))
    if is_blank(v) or (kind in ("option", "text") and isinstance(v, _NUMBER_TYPES)
                       and not isinstance(v, bool) and v == 0):
        if arg.optional:
            return arg.default
        raise CellTypeError(f"{arg.name}: a value is required (the cell is blank)")
    if kind == "number":
        return _number(arg, v)
    if kind == "integer":
        f = _number(arg, v)
        if f != int(f):
            raise CellInputError(f"{arg.name}: {f:g} is not a whole number")
        return int(f)
    if kind == "option":
        if not isinstance(v, str):
            raise CellTypeError(f"{arg.name}: {v!r} is not one of " + ", ".join(arg.options))
        word = v.strip().lower()
        if word not in arg.options and " " in word:
            word = "".join(word.split())  # inner spaces are ignored too ("EN 16726")
        if word in arg.options:
            return word
        alias = {k.lower(): w for k, w in arg.aliases.items()}.get(word)
        if alias is not None:
            return alias
        raise CellTypeError(f"{arg.name}: {v.strip()!r} is not one of " + ", ".join(arg.options))
    if kind == "reference":
        if isinstance(v, str):
            if _numeric_text(v):
                raise CellTypeError(f"{arg.name}: text {v.strip()!r} is neither a number nor "
                                    '"t1/t2" (enter the number as a number)')
            return v.strip()
        return _number(arg, v)
    if kind == "text":
        if isinstance(v, bool) or not isinstance(v, str):
            if isinstance(v, _NUMBER_TYPES):
                return f"{v:g}"
            raise CellTypeError(f"{arg.name}: {v!r} is not text")
        return v.strip()
    raise RuntimeError(f"unknown argument kind {kind!r}")  # pragma: no cover


def _empty_hint(arg) -> str:
    """What to do instead of empty text in a number argument."""
    if arg.default is REQUIRED:
        return " (a number is required)"
    d = arg.default
    what = f"the default {d:g}" if isinstance(d, _NUMBER_TYPES) and not isinstance(d, bool) else "the default"
    return f" (leave the argument out, or leave the cell empty, for {what})"


_isfinite = math.isfinite


def _coerce_cells(entry: CellFunction, values: tuple) -> list:
    """Coerce raw cell values (missing trailing ones = blank), one per catalogue argument."""
    args = entry.args
    n = len(values)
    if n > len(args):
        raise CellTypeError(f"{entry.name}: takes at most {len(args)} arguments, got {n}")
    out = []
    for i, arg in enumerate(args):
        v = values[i] if i < n else None
        kind = arg.kind
        # fast paths: what Excel hands over for a number cell, an option word, a blank
        if type(v) is float and kind == "number" and _isfinite(v):
            out.append(v)
        elif v is None and arg.default is not REQUIRED and kind not in RANGE_KINDS:
            out.append(arg.default)
        elif type(v) is str and kind == "option" and v in arg.options:
            out.append(v)
        else:
            out.append(_one(arg, v))
    return out


_GAS_KINDS = frozenset(("gas", "amounts", "amount_uncertainties"))


_HAS_GAS: dict = {}


def _has_gas(entry: CellFunction) -> bool:
    key = (entry.name, entry.target, len(entry.args))
    found = _HAS_GAS.get(key)
    if found is None:
        found = _HAS_GAS[key] = any(a.kind in _GAS_KINDS for a in entry.args)
    return found


def coerce_args(entry: CellFunction, values: tuple) -> list:
    """The core's positional arguments from raw cell values.

    Every value is coerced by its argument's kind; a gas analysis (``gas`` +
    ``amounts``) is parsed into one Composition, so the list is one shorter
    per ``amounts`` argument than ``entry.args``.
    """
    out = _coerce_cells(entry, values)
    if not _has_gas(entry):
        return out
    return _fold_gas(entry, out)


def _rename(exc: CellInputError, mapping: dict) -> CellInputError:
    """The same error with argument names replaced (whole identifiers only)."""
    mapping = {k: v for k, v in mapping.items() if k and v and k != v}
    if not mapping:
        return exc
    msg = exc.message
    pattern = r"(?<![A-Za-z0-9_])(" + "|".join(map(re.escape, sorted(mapping, key=len, reverse=True))) \
        + r")(?![A-Za-z0-9_])"
    new = re.sub(pattern, lambda m: mapping[m.group(1)], msg)
    if new == msg:
        return exc
    out = CellInputError(new)
    out.excel_error = exc.excel_error  # keep #VALUE! or #NUM!
    return out


@functools.lru_cache(maxsize=1024)
def _parse_plain(components: tuple, amounts):
    """parse_composition cached on ranges of floats, text and blanks only (no booleans,
    which would compare equal to 1.0 and 0.0 in the cache key)."""
    from cellfuncs.gas.composition import parse_composition

    return parse_composition(components, amounts)


def _plain(rows) -> bool:
    # rows come from _range: always a tuple of tuples of cells
    return type(rows) is tuple and _PLAIN_RANGE_TYPES.issuperset(map(type, _chain(rows)))


def _parse_gas(gas_arg, amounts_arg, components, amounts):
    from cellfuncs.gas.composition import parse_composition

    try:
        if _plain(components) and (amounts is None or _plain(amounts)):
            return _parse_plain(components, amounts)
        return parse_composition(components, amounts)
    except CellInputError as exc:
        names = {"components": gas_arg.name,
                 "fractions": amounts_arg.name if amounts_arg is not None else "amounts"}
        raise _rename(exc, names) from None


def _uncertainties(arg, v, gas):
    """{component id: standard uncertainty as a mole fraction} for a gas analysis."""
    from cellfuncs.gas.composition import paired_amounts

    components, comp = gas
    if comp is None:
        raise CellInputError(f"{arg.name}: no gas analysis is given to pair the uncertainties with")
    raw = paired_amounts(components, v, arg.name)
    return {i: u / comp.total for i, u in raw.items() if u > 0}


def _fold_gas(entry: CellFunction, cells: list) -> list:
    args = entry.args
    out = []
    gas = (None, None)
    for i, arg in enumerate(args):
        kind = arg.kind
        v = cells[i]
        if kind == "gas":
            nxt = args[i + 1] if i + 1 < len(args) and args[i + 1].kind == "amounts" else None
            amounts = cells[i + 1] if nxt is not None else None
            if v is None:
                if amounts is not None:
                    raise CellTypeError(f"{arg.name}: blank, but {nxt.name} is given; give the "
                                        "component names too")
                gas = (None, None)
                out.append(None)
            else:
                comp = _parse_gas(arg, nxt, v, amounts)
                gas = (v, comp)
                out.append(comp)
        elif kind == "amounts":
            continue  # folded into the gas argument before it
        elif kind == "amount_uncertainties":
            out.append(_uncertainties(arg, v, gas))
        else:
            out.append(v)
    return out


def core_names(entry: CellFunction) -> dict:
    """Core parameter name -> catalogue argument name, position by position."""
    names = [a.name for a in entry.args if a.kind != "amounts"]
    try:
        params = [p.name for p in inspect.signature(entry.resolve()).parameters.values()
                  if p.kind in (p.POSITIONAL_ONLY, p.POSITIONAL_OR_KEYWORD)]
    except (TypeError, ValueError):  # pragma: no cover - builtins without a signature
        return {}
    return dict(zip(params, names))


_CORE_FNS: dict = {}


@functools.lru_cache(maxsize=4096)
def _cached_core(target: str, args: tuple):
    return _CORE_FNS[target](*args)


def _call_core(entry: CellFunction, args: list):
    fn = entry.resolve()
    if not _has_gas(entry):
        return fn(*args)
    key = tuple(args)
    try:
        hash(key)
    except TypeError:  # e.g. the uncertainties dict: not cached
        return fn(*args)
    _CORE_FNS[entry.target] = fn
    return _cached_core(entry.target, key)


def _check_out(entry, v):
    if isinstance(v, bool):
        return v
    if isinstance(v, _NUMBER_TYPES):
        f = float(v)
        if not math.isfinite(f):
            raise FloatingPointError(f"{entry.name} produced {f}")
        return f
    if isinstance(v, str) or v is None:
        return v
    try:
        f = float(v)
    except (TypeError, ValueError):
        return str(v)
    if not math.isfinite(f):
        raise FloatingPointError(f"{entry.name} produced {f}")
    return f


def result_to_cells(entry: CellFunction, result, layout: str | None = None):
    """A scalar, or a list of rows (2-D) for multi-cell results.

    A 1-D result is a column when ``layout`` (the layout of the function's first
    stage list) or else the entry's shape says ``"column"``; a row otherwise.
    """
    if type(result) is float:
        if _isfinite(result):
            return result
        raise FloatingPointError(f"{entry.name} produced {result}")
    if isinstance(result, (list, tuple)):
        if result and isinstance(result[0], (list, tuple)):
            return [[_check_out(entry, c) for c in row] for row in result]
        cells = [_check_out(entry, c) for c in result]
        if (layout or entry.shape) == "column":
            return [[c] for c in cells]
        return [cells]
    if hasattr(result, "tolist") and getattr(result, "ndim", 0) > 0:
        return result_to_cells(entry, result.tolist(), layout)
    return _check_out(entry, result)


#: numbers this far from any plant quantity may overflow a core's arithmetic
EXTREME_HIGH, EXTREME_LOW = 1e12, 1e-12


def call(entry: CellFunction, values: tuple):
    """Coerce, call the core, check the result.  Raises CellInputError.

    A result that is not a finite number is an error: when an argument is of an
    extreme magnitude (above 1e12 or below 1e-12 in size) the error names it;
    otherwise it is a fault of the core (FloatingPointError, shown as an
    internal error and failed by the test suite).
    """
    coerced = coerce_args(entry, values)
    layout = None
    if entry.shape == "array":
        layout = next((v.layout for v in coerced if isinstance(v, CellList)), None)
    try:
        return result_to_cells(entry, _call_core(entry, coerced), layout)
    except CellInputError as exc:
        renamed = _rename(exc, core_names(entry))
        if renamed is exc:
            raise
        raise renamed from None
    except (FloatingPointError, OverflowError, ZeroDivisionError):
        for arg, v in zip([a for a in entry.args if a.kind != "amounts"], coerced):
            if type(v) is float and (abs(v) > EXTREME_HIGH or 0.0 < abs(v) < EXTREME_LOW):
                raise CellInputError(f"{arg.name}: {v:.4g} is too extreme for {entry.name} "
                                     "(the result overflows)") from None
        raise
