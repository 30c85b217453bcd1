"""The engine's values in and out: the callback that calls a catalogue function.

What ``formualizer`` hands a registered function (float, str, bool, ``None`` for a
blank cell, a list of rows for a range, ``{"type": "Error", ...}`` for an error,
:data:`~cellfuncs.headless.formula_text.OMITTED` for an argument left out) becomes
what :mod:`cellfuncs.adapt` expects, and what a function returns becomes an engine
value; engine results become plain values (float, str, bool, None or
:class:`~cellfuncs.headless.package.ErrorText`).  The engine itself, the private
copy of the workbook and the workarounds are in :mod:`cellfuncs.headless.engine`.
"""

from __future__ import annotations

import math

from cellfuncs.errors import CellInputError
from cellfuncs.headless.package import ErrorText

from .formula_text import OMITTED, TAG

__all__ = ["CODE_OF_KIND", "KIND_OF_CODE", "LIMITATION_KINDS", "MAX_DATA_TABLE_CELLS", "INTERNAL_ERRORS",
           "fz", "engine_error", "is_engine_error", "engine_error_message", "make_callback", "plain"]

CODE_OF_KIND = {"Null": "#NULL!", "Div": "#DIV/0!", "Value": "#VALUE!", "Ref": "#REF!", "Name": "#NAME?",
                "Num": "#NUM!", "Na": "#N/A", "Spill": "#SPILL!", "Calc": "#CALC!", "NImpl": "#N/A",
                "Circ": "#NUM!", "Cancelled": "#N/A", "Error": "#VALUE!"}
KIND_OF_CODE = {"#NULL!": "Null", "#DIV/0!": "Div", "#VALUE!": "Value", "#REF!": "Ref", "#NAME?": "Name",
                "#NUM!": "Num", "#N/A": "Na", "#SPILL!": "Spill", "#CALC!": "Calc"}
#: error kinds that mean "the engine could not compute this", not a result
LIMITATION_KINDS = {"NImpl": "a function or reference form the engine does not implement",
                    "Circ": "a circular reference (iterative calculation is off in this workbook)",
                    "Cancelled": "the calculation was stopped",
                    "Name": "a name or function the engine does not know"}
#: the largest what-if data table computed (cells); larger ones keep their cached values
MAX_DATA_TABLE_CELLS = 10_000
#: messages of unexpected exceptions seen in registered functions (tests fail on these)
INTERNAL_ERRORS: list = []

_FZ = {}


def fz():
    if "mod" not in _FZ:
        import formualizer

        _FZ["mod"] = formualizer
    return _FZ["mod"]


def engine_error(code: str, message: str = ""):
    """An engine error value for an Excel error code (``"#NUM!"``)."""
    return fz().LiteralValue.error(KIND_OF_CODE.get(code, "Value"), message or None)


def is_engine_error(v) -> bool:
    if isinstance(v, dict):
        return v.get("type") == "Error"
    LV = fz().LiteralValue
    return isinstance(v, LV) and bool(_prop(v, "is_error"))


def engine_error_message(v) -> str:
    if isinstance(v, dict):
        return v.get("message") or ""
    try:
        return _prop(v, "error_message") or ""
    except AttributeError:
        return ""


def _prop(obj, name):
    v = getattr(obj, name)
    return v() if callable(v) else v


def _code(v) -> str:
    if isinstance(v, dict):
        return CODE_OF_KIND.get(str(v.get("kind")), "#VALUE!")
    kind = v.error_kind
    kind = kind() if callable(kind) else kind
    return CODE_OF_KIND.get(str(kind), "#VALUE!")


class _PassThrough(Exception):
    def __init__(self, err):
        self.err = err


def _raw(v):
    """An engine argument -> the plain value the shared coercion expects (an omitted one: None)."""
    if v == OMITTED:
        return None
    if isinstance(v, dict) and v.get("type") == "Error":
        raise _PassThrough(v)
    if isinstance(v, list):
        rows = v if (v and isinstance(v[0], list)) else [v]
        out = []
        for row in rows:
            cells = []
            for c in row:
                if isinstance(c, dict) and c.get("type") == "Error":
                    raise _PassThrough(c)
                cells.append(c)
            out.append(cells)
        if len(out) == 1 and len(out[0]) == 1:
            return out[0][0]
        return out
    return v


def make_callback(entry, messages: dict | None = None):
    """The engine callback for one catalogue entry.

    A first argument starting with the tag character names the calling cell; a
    :class:`~cellfuncs.errors.CellInputError` becomes an engine error value and its
    one-line message is filed in ``messages`` under that tag.  Nothing ever raises
    out of the callback.
    """
    from cellfuncs.adapt import call as adapt_call

    def cell_function(*args):
        tag = None
        if args and isinstance(args[0], str) and args[0].startswith(TAG):
            tag, args = args[0], args[1:]
        try:
            raw = tuple(_raw(a) for a in args)
        except _PassThrough as p:
            return engine_error(_code(p.err))
        try:
            res = adapt_call(entry, raw)
        except CellInputError as exc:
            if tag is not None and messages is not None:
                messages.setdefault(tag, f"{exc.excel_error} {exc.message}")
            return engine_error(exc.excel_error, exc.message)
        except Exception as exc:  # noqa: BLE001 - never raise into the engine
            text = " ".join(f"{type(exc).__name__}: {exc}".split())[:200]
            INTERNAL_ERRORS.append(f"{entry.name}: {text}")
            if tag is not None and messages is not None:
                messages.setdefault(tag, f"#VALUE! internal error: {text}")
            return engine_error("#VALUE!", f"internal error: {text}")
        if isinstance(res, list):
            return [list(r) if isinstance(r, (list, tuple)) else [r] for r in res]
        if isinstance(res, float) and not math.isfinite(res):
            return engine_error("#NUM!", "result is not a finite number")
        return res

    cell_function.__name__ = entry.name
    cell_function.__doc__ = entry.description
    return cell_function


def plain(v):
    """An engine result -> float, str, bool or ErrorText (None for an empty cell)."""
    if v is None:
        return None
    if isinstance(v, dict) and v.get("type") == "Error":
        et = ErrorText(CODE_OF_KIND.get(str(v.get("kind")), "#VALUE!"))
        et.kind = str(v.get("kind"))
        return et
    if isinstance(v, bool):
        return v
    if isinstance(v, (int, float)):
        f = float(v)
        if not math.isfinite(f):
            et = ErrorText("#NUM!")
            et.kind = "Num"
            return et
        return f
    if isinstance(v, list):
        return plain(v[0][0] if v and isinstance(v[0], list) and v[0] else (v[0] if v else None))
    if hasattr(v, "isoformat"):  # a date or time: its serial number is what the cell holds
        import datetime as dt

        base = dt.datetime(1899, 12, 30)
        if isinstance(v, dt.datetime):
            return (v - base).total_seconds() / 86400
        if isinstance(v, dt.date):
            return float((v - base.date()).days)
        return (v.hour * 3600 + v.minute * 60 + v.second) / 86400
    return str(v)
