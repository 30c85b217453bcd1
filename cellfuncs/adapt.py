"""Turn cell values into core inputs and core results into cell values.

Both adapters (``cellfuncs.excel`` for xlwings, ``cellfuncs.headless`` for the
``formulas`` engine) call :func:`call` with the raw values a cell formula
handed over.  The rules, the same for both:

* a number argument takes an int or float (a 1×1 range counts); booleans,
  text (even numeric text such as ``"12"``), NaN and infinities are refused;
* a blank, ``None`` or ``""`` for an optional argument means "use the default";
  for option, text and range arguments ``0`` means the same (the headless engine
  and LibreOffice Calc hand an omitted argument ``F(1,,3)`` over as 0);
* option words are matched case-insensitively with surrounding spaces ignored;
* a range argument becomes a tuple of rows of cells (float, str or ``None``);
  a scalar becomes ``((v,),)`` and a 1-D list a column.

Errors are :class:`~cellfuncs.errors.CellInputError`; the adapters render them.
"""

from __future__ import annotations

import itertools
import math

from cellfuncs.catalogue.spec import REQUIRED, CellFunction
from cellfuncs.errors import CellInputError, CellTypeError

__all__ = ["coerce_args", "call", "result_to_cells", "is_blank"]

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


def _one(arg, v):
    kind = arg.kind
    if kind == "range":
        # an optional range given 0: what the headless engine and Calc hand over for an
        # argument left out in the middle, F(A1:B6,,"x") (a range can't be the number 0)
        if v is None or (isinstance(v, str) and v.strip() == "") or (
                arg.optional and type(v) in _NUMBER_TYPES and v == 0):
            if arg.optional:
                return arg.default
            raise CellTypeError(f"{arg.name}: a range is required (got a blank)")
        return _range(arg, v)
    v = _scalar(arg.name, v)
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
        if word in arg.options:
            return word
        alias = {k.lower(): w for k, w in arg.aliases.items()}.get(word)
        if alias is not None:
            return alias
        raise CellTypeError(f"{arg.name}: {v.strip()!r} is not one of " + ", ".join(arg.options))
    if kind == "text":
        if isinstance(v, bool) or not isinstance(v, str):
            if isinstance(v, _NUMBER_TYPES):
                return f"{v:g}"
            raise CellTypeError(f"{arg.name}: {v!r} is not text")
        return v.strip()
    raise RuntimeError(f"unknown argument kind {kind!r}")  # pragma: no cover


_isfinite = math.isfinite


def coerce_args(entry: CellFunction, values: tuple) -> list:
    """Coerce raw cell values (missing trailing ones = blank) to core inputs."""
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
        elif v is None and arg.default is not REQUIRED and kind != "range":
            out.append(arg.default)
        elif type(v) is str and kind == "option" and v in arg.options:
            out.append(v)
        else:
            out.append(_one(arg, v))
    return out


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


def result_to_cells(entry: CellFunction, result):
    """A scalar, or a list of rows (2-D) for multi-cell results."""
    if type(result) is float:
        if _isfinite(result):
            return result
        raise FloatingPointError(f"{entry.name} produced {result}")
    if isinstance(result, (list, tuple)):
        if result and isinstance(result[0], (list, tuple)):
            return [[_check_out(entry, c) for c in row] for row in result]
        cells = [_check_out(entry, c) for c in result]
        if entry.shape == "column":
            return [[c] for c in cells]
        return [cells]
    if hasattr(result, "tolist") and getattr(result, "ndim", 0) > 0:
        return result_to_cells(entry, result.tolist())
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
    try:
        return result_to_cells(entry, entry.resolve()(*coerced))
    except (FloatingPointError, OverflowError, ZeroDivisionError):
        for arg, v in zip(entry.args, coerced):
            if type(v) is float and (abs(v) > EXTREME_HIGH or 0.0 < abs(v) < EXTREME_LOW):
                raise CellInputError(f"{arg.name}: {v:.4g} is too extreme for {entry.name} "
                                     "(the result overflows)") from None
        raise
