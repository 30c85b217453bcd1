"""What a Calc cell call does once LibreOffice's Python has found cellfuncs.

Called by the extension's UNO component (``component.py``) with the values Calc hands
over for ``any`` parameters: ``None`` (void) for an argument left out, at the end or in the
middle (``F(1;;3)``), so its default applies as in Excel; a float or a str for a value or
a one-cell reference (empty text ``""`` stays ``""``: an error for a number argument, as in
Excel; a reference to an empty cell arrives as 0.0, which nothing here can tell from a
typed 0), a tuple of rows for a range (blank cells ``None`` or ``""``, both made ``None``).
Measured with LibreOffice 7.4 (tests/test_libreoffice.py).  The shared
:mod:`cellfuncs.adapt` rules then apply as in Excel and headless (for an option, text or
range argument 0 counts as omitted).

Results: a number or a text; an array (a tuple of rows) for functions whose result is
an array.  A :class:`~cellfuncs.errors.CellInputError` becomes a Calc error value of
the same kind, ``#NUM!`` or ``#VALUE!``: Calc reads a returned double that is a NaN
carrying an error code in its low 32 bits as that error (Calc's own encoding of error
values in doubles, the same one it uses in its cells and matrices).  The reason is not
shown in the cell (Calc has no place for it); ``cellfuncs recalc`` reports it per cell.
Any other exception becomes the text ``"#VALUE! internal error: ..."``, as in Excel.
"""

from __future__ import annotations

import struct

from cellfuncs import catalogue
from cellfuncs.adapt import call as _adapt_call
from cellfuncs.errors import CellInputError

__all__ = ["call", "error_value", "CALC_ERROR_CODES", "INTERNAL_ERROR"]

#: Calc's error numbers for the Excel error values (shown as #NUM! etc. in Calc)
CALC_ERROR_CODES = {"#NUM!": 503, "#VALUE!": 519, "#NULL!": 521, "#REF!": 524,
                    "#NAME?": 525, "#DIV/0!": 532, "#N/A": 32767}
INTERNAL_ERROR = "#VALUE! internal error: "


def error_value(code: str) -> float:
    """The double Calc reads as the error value ``code`` (a quiet NaN with the number)."""
    number = CALC_ERROR_CODES.get(code, CALC_ERROR_CODES["#VALUE!"])
    return struct.unpack("<d", struct.pack("<Q", 0x7FF8000000000000 | number))[0]


def _arg(v):
    if isinstance(v, tuple):
        return [[None if c == "" else c for c in (row if isinstance(row, tuple) else (row,))]
                for row in v]
    return v


def _cell(v):
    if v is None:
        return ""
    if isinstance(v, bool):
        return 1.0 if v else 0.0
    return v


def call(name: str, args: tuple, array: bool):
    """Compute the catalogue function ``name`` on Calc's ``args``."""
    try:
        entry = catalogue.by_name(name)
    except KeyError:
        res = (f"#NAME? cellfuncs {_version()} has no function {name}; build the extension again "
               "with `cellfuncs calc-extension`")
        return ((res,),) if array else res
    try:
        res = _adapt_call(entry, tuple(_arg(a) for a in args))
    except CellInputError as exc:
        res = error_value(exc.excel_error)
    except Exception as exc:  # noqa: BLE001 - a cell must never show a traceback
        res = INTERNAL_ERROR + " ".join(f"{type(exc).__name__}: {exc}".split())[:200]
    if isinstance(res, list):
        rows = tuple(tuple(_cell(c) for c in row) for row in res)
        if array:
            return rows
        if len(rows) == 1 and len(rows[0]) == 1:
            return rows[0][0]
        return INTERNAL_ERROR + f"{name} returned {len(rows)}x{len(rows[0])} cells to one cell"
    res = _cell(res)
    return ((res,),) if array else res


def _version() -> str:
    from cellfuncs import __version__

    return __version__
