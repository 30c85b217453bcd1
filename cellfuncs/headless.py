"""The headless adapter: catalogue functions in the ``formulas`` engine.

:func:`register` puts every catalogue function into the engine's function
table (also under the ``_XLUDF.`` prefix Excel writes for add-in functions it
did not know when the file was saved).  :func:`recalc` computes a workbook —
Excel built-ins and ours — and returns every formula cell's value;
:func:`write_with_cached_values` stores those values in a copy of the workbook
so that a reader without the add-in sees the numbers.

Behaviour at the boundary (see also :mod:`cellfuncs.adapt`):

* an argument holding an Excel error is passed through unchanged;
* a :class:`~cellfuncs.errors.CellInputError` becomes a real Excel error value
  (``#NUM!`` or ``#VALUE!``) that carries the one-line message for the report;
* nothing ever raises out of a registered function (an exception there would
  abort the engine's load or silently drop the cell);
* a function returning several values returns a 2-D array for a legacy
  (fixed-size) array formula; dynamic-array spills are not supported;
* references to other workbooks become ``#REF!``: no link is followed.
"""

from __future__ import annotations

import math
import os
import re
import shutil
import tempfile
from dataclasses import dataclass, field

from cellfuncs import catalogue
from cellfuncs.adapt import call as _adapt_call
from cellfuncs.errors import CellInputError
from cellfuncs.xlsx import BookError, ErrorText, Package, col_index, col_letters, split_ref

__all__ = ["register", "recalc", "Recalc", "BookError", "load_model", "cell_value"]

_STATE: dict = {}
#: the largest sheet (rows × columns of cells with content) the engine is given
MAX_ENGINE_CELLS = 2_000_000
#: messages of unexpected exceptions seen in registered functions (tests fail on these)
INTERNAL_ERRORS: list = []


def _xl():
    if "XlError" not in _STATE:
        import numpy as np
        import schedula as sh
        from formulas.tokens.operand import XlError

        class CellError(XlError):
            """An Excel error value that also carries our one-line message."""

            message = ""

        _STATE.update(XlError=XlError, CellError=CellError, EMPTY=sh.EMPTY, np=np)
    return _STATE


def make_error(code: str, message: str):
    err = _xl()["CellError"](code)
    err.message = message
    return err


class _PassThrough(Exception):
    def __init__(self, err):
        self.err = err


def _raw(v):
    """An engine argument -> the plain value the shared coercion expects."""
    st = _xl()
    XlError, EMPTY, np = st["XlError"], st["EMPTY"], st["np"]
    if isinstance(v, XlError):
        raise _PassThrough(v)
    if v is EMPTY:
        return None
    if hasattr(v, "ranges") and hasattr(v, "value"):  # formulas Ranges (a reference)
        v = v.value
    if isinstance(v, np.ndarray):
        if v.ndim == 0:
            return _raw(v.item())
        rows = v.tolist() if v.ndim == 2 else [v.tolist()]
        out = []
        for row in rows:
            cells = []
            for c in row:
                if isinstance(c, XlError):
                    raise _PassThrough(c)
                cells.append(None if c is EMPTY else (c.item() if hasattr(c, "item") else c))
            out.append(cells)
        if len(out) == 1 and len(out[0]) == 1:
            return out[0][0]
        return out
    if hasattr(v, "item") and not isinstance(v, (str, bytes)):
        return v.item()
    return v


def _make(entry):
    def cell_function(*args):
        try:
            raw = tuple(_raw(a) for a in args)
        except _PassThrough as p:
            return p.err
        except Exception:
            # a reference with no value yet: the engine probes defined names while loading.
            # Raising here (quietly, see _quiet) lets it compute the cell later; returning an
            # error would be cached as the cell's value.
            raise
        try:
            res = _adapt_call(entry, raw)
        except CellInputError as exc:
            return make_error(exc.excel_error, exc.message)
        except Exception as exc:  # noqa: BLE001 - never raise into the engine
            text = " ".join(f"{type(exc).__name__}: {exc}".split())[:200]
            INTERNAL_ERRORS.append(f"{entry.name}: {text}")
            return make_error("#VALUE!", f"internal error: {text}")
        if isinstance(res, list):
            return _xl()["np"].array(res, dtype=object)
        return res

    cell_function.__name__ = entry.name
    cell_function.__doc__ = entry.description
    return cell_function


class _quiet:
    """Silence the engine's logger (it logs expected probes during load)."""

    def __enter__(self):
        import logging

        self.logger = logging.getLogger("schedula")
        self.level = self.logger.level
        self.logger.setLevel(logging.CRITICAL + 1)
        return self

    def __exit__(self, *exc):
        self.logger.setLevel(self.level)
        return False


def register() -> None:
    """Register every catalogue function in the engine (idempotent)."""
    if _STATE.get("registered"):
        return
    import formulas

    funcs = formulas.get_functions()
    for entry in catalogue.entries():
        fn = _make(entry)
        funcs[entry.name.upper()] = fn
        funcs["_XLUDF." + entry.name.upper()] = fn
        # the name LibreOffice writes for our Calc add-in's functions (cellfuncs.calc)
        funcs["ORG.CELLFUNCS.CALC.CELLFUNCTIONS." + entry.name.upper()] = fn
    _STATE["registered"] = True


# ---------------------------------------------------------------------------------------
# workbook preparation
_EXT_FUNC = None
_EXT_REF = re.compile(r"(?:'[^'\[]*\[[^\]]+\][^']*'|\[[^\]]+\][A-Za-z0-9_.]+)!\$?[A-Za-z]{1,3}\$?\d+"
                      r"(?::\$?[A-Za-z]{1,3}\$?\d+)?")


def _calc_formula(text: str) -> str:
    """Formula text as the engine should see it: add-in prefixes removed, external refs #REF!."""
    global _EXT_FUNC
    if _EXT_FUNC is None:
        names = "|".join(sorted((re.escape(e.name) for e in catalogue.entries()), key=len,
                                reverse=True))
        _EXT_FUNC = re.compile(r"(?:'?\[\d+\]'?!|'?[^'!(),=+\-*/&^<>\s]+\.xla[mx]?'?!)(" + names
                               + r")\s*\(", re.I)
    text = _EXT_FUNC.sub(lambda m: m.group(1) + "(", text)
    return _EXT_REF.sub("#REF!", text)


@dataclass
class Recalc:
    """Result of a recalculation.

    values : {(sheet, "A1"): value} for every formula cell (array ranges cell by cell);
        a value is a float, str, bool, or an :class:`~cellfuncs.xlsx.ErrorText`.
    messages : {(sheet, "A1"): one-line message} for the cells that ended in an error.
    """

    values: dict = field(default_factory=dict)
    messages: dict = field(default_factory=dict)

    def errors(self) -> list:
        return [k for k, v in self.values.items() if isinstance(v, ErrorText)]


def _formula_cells(path: str):
    """Formula cells (array ranges cell by cell), defined names and the openpyxl workbook."""
    import openpyxl
    from openpyxl.worksheet.formula import ArrayFormula

    try:
        wb = openpyxl.load_workbook(path, keep_vba=False, keep_links=False)
    except Exception as exc:  # openpyxl raises many types for broken files
        raise BookError(f"{path}: cannot read the workbook ({type(exc).__name__}: {exc})".split(
            "\n")[0]) from None
    cells, names = [], {}
    for ws in wb.worksheets:
        # only the cells the file holds (iter_rows would build the whole used range)
        for _, c in sorted(ws._cells.items()):
            v = c.value
            if isinstance(v, ArrayFormula):
                r1, c1, r2, c2 = _range_bounds(v.ref)
                for r in range(r1, r2 + 1):
                    for cc in range(c1, c2 + 1):
                        cells.append((ws.title, f"{col_letters(cc)}{r}", v.ref))
            elif isinstance(v, str) and v.startswith("=") and c.data_type == "f":
                cells.append((ws.title, c.coordinate, None))
    for name, dn in wb.defined_names.items():
        try:
            dests = list(dn.destinations)
        except Exception:  # noqa: BLE001 - a name that is a formula or constant, not a reference
            continue
        if len(dests) == 1:
            names[name.upper()] = (dests[0][0], dests[0][1].replace("$", ""))
    return cells, names, wb


def _range_bounds(ref: str):
    a, _, b = ref.replace("$", "").partition(":")
    r1, c1 = split_ref(a)
    r2, c2 = split_ref(b or a)
    return r1, c1, r2, c2


def cell_value(v):
    """An engine value -> float, str, bool or ErrorText (with message attribute)."""
    st = _xl()
    XlError, EMPTY, np = st["XlError"], st["EMPTY"], st["np"]
    if isinstance(v, XlError):
        et = ErrorText(str(v))
        et.message = getattr(v, "message", "")
        return et
    if v is EMPTY or v is None:
        return 0.0
    if isinstance(v, (bool, np.bool_)):
        return bool(v)
    if isinstance(v, (int, float, np.integer, np.floating)):
        f = float(v)
        if not math.isfinite(f):
            et = ErrorText("#NUM!")
            et.message = "result is not a finite number"
            return et
        return f
    return str(v)


def resolve_target(target: str, names: dict, sheets: list):
    """``Sheet!A1`` or a defined name -> (sheet as written, "A1"); None if unknown."""
    t = target.strip()
    if "!" in t:
        sheet, _, ref = t.rpartition("!")
        sheet = sheet.strip("'")
        match = [s for s in sheets if s.upper() == sheet.upper()]
        if not match:
            return None
        split_ref(ref)  # a reference outside a worksheet is a BookError with its reason
        return match[0], ref.replace("$", "").upper()
    where = names.get(t.upper())
    if where is not None and ":" in where[1]:
        raise BookError(f"{target}: names the range {where[0]}!{where[1]}, not one cell")
    return where


def load_model(path: str, sets: dict | None = None):
    """Prepare ``path`` for the engine and return (model, info).

    ``sets`` maps targets (``Sheet!A1`` or defined names) to values applied to a
    private copy before computing.  ``info`` has the formula cells, names, sheets,
    the prepared output package and the temporary folder to remove.
    """
    register()
    pkg = Package(path)
    cells, names, wb = _formula_cells(path)
    sheets = wb.sheetnames
    resolved = {}
    formula_at = {(c[0], c[1]) for c in cells}
    for target, value in (sets or {}).items():
        try:
            where = resolve_target(target, names, sheets)
        except BookError as exc:
            raise BookError(f"--set {exc}") from None
        if where is None:
            raise BookError(f"--set {target}: no such cell or defined name in {os.path.basename(path)}")
        if where in formula_at:
            raise BookError(f"--set {target}: {where[0]}!{where[1]} holds a formula, not an input")
        resolved[where] = value
    if resolved:
        pkg.set_values(resolved)
        cells = [c for c in cells if (c[0], c[1]) not in resolved]
    tmpdir = tempfile.mkdtemp(prefix="cellfuncs-")
    calc_path = os.path.join(tmpdir, "book.xlsx")
    out_parts = dict(pkg.parts)
    pkg.map_formulas(_calc_formula)
    pkg.drop_empty_cells()
    for sheet, (rows, cols) in pkg.used_extent().items():
        if rows * cols > MAX_ENGINE_CELLS:
            shutil.rmtree(tmpdir, ignore_errors=True)
            raise BookError(f"{os.path.basename(path)}: sheet {sheet!r} spans {rows} rows × {cols} columns, "
                            f"more than the {MAX_ENGINE_CELLS:,} cells the headless engine computes")
    pkg.save(calc_path)
    import formulas

    try:
        try:
            with _quiet():
                model = formulas.ExcelModel().loads(calc_path).finish(complete=False)
        except Exception:  # noqa: BLE001 - most often one formula the engine cannot parse
            # second try: formulas the engine cannot parse become #NAME? (only those cells fail)
            parser = formulas.Parser()

            def parseable(text):
                try:
                    parser.ast("=" + text if not text.startswith("=") else text)
                    return text
                except Exception:  # noqa: BLE001
                    return "#NAME?"

            pkg.map_formulas(parseable)
            pkg.save(calc_path)
            with _quiet():
                model = formulas.ExcelModel().loads(calc_path).finish(complete=False)
    except BookError:
        raise
    except Exception as exc:  # noqa: BLE001
        shutil.rmtree(tmpdir, ignore_errors=True)
        raise BookError(f"{path}: the formula engine cannot load it ({type(exc).__name__})") from None
    finally:
        pkg.parts = out_parts  # the output keeps the original formulas
    info = {"cells": cells, "names": names, "sheets": sheets, "workbook": wb, "package": pkg, "tmpdir": tmpdir,
            "calc_name": "BOOK.XLSX"}
    return model, info


def solution_values(solution, info) -> Recalc:
    """Map an engine solution back to the workbook's own sheet names and cells."""
    by_key = {}
    for key, val in solution.items():
        k = str(key)
        if "!" not in k:
            continue
        sheet_part, _, ref = k.rpartition("!")
        sheet = sheet_part.strip("'")
        if "]" in sheet:
            sheet = sheet.split("]", 1)[1]
        by_key[(sheet.upper(), ref.upper())] = val
    out = Recalc()
    for sheet, ref, array_ref in info["cells"]:
        key = (sheet.upper(), (array_ref or ref).upper().replace("$", ""))
        val = by_key.get(key)
        if val is None:
            et = ErrorText("#REF!")
            et.message = "could not be computed (unsupported function or a reference outside this workbook)"
            out.values[(sheet, ref)] = et
        else:
            arr = getattr(val, "value", val)
            if array_ref is not None and hasattr(arr, "shape") and getattr(arr, "ndim", 0) == 2:
                r1, c1, _, _ = _range_bounds(array_ref)
                r, c = split_ref(ref)
                i, j = r - r1, c - c1
                if i < arr.shape[0] and j < arr.shape[1]:
                    v = arr[i, j]
                else:
                    v = _xl()["XlError"]("#N/A")
            elif hasattr(arr, "shape") and getattr(arr, "ndim", 0) >= 1:
                v = arr.flat[0]
            else:
                v = arr
            out.values[(sheet, ref)] = cell_value(v)
        got = out.values[(sheet, ref)]
        if isinstance(got, ErrorText):
            default = ("(unknown function or name)" if str(got) == "#NAME?"
                       else "(from the formula itself or a cell it uses)")
            out.messages[(sheet, ref)] = f"{got} {got.message or default}"
    return out


def recalc(path: str, sets: dict | None = None):
    """Compute every formula of a workbook.

    Returns
    -------
    (Recalc, Package)
        The values and the package ready to receive them as cached values.

    Raises
    ------
    BookError
        The workbook cannot be used (one line).
    """
    model, info = load_model(path, sets)
    try:
        with _quiet():
            solution = model.calculate()
        res = solution_values(solution, info)
    finally:
        shutil.rmtree(info["tmpdir"], ignore_errors=True)
    return res, info["package"]


def write_with_cached_values(res: Recalc, pkg: Package, out_path: str, compress: bool = True) -> None:
    """Store the computed values in the package and write it atomically."""
    pkg.set_cached(res.values)
    pkg.keep_cached_on_open()
    pkg.save(out_path, compress=compress)


def key_text(sheet: str, ref: str) -> str:
    """``Sheet!A1``, quoting sheet names with spaces or punctuation."""
    if re.fullmatch(r"[A-Za-z_][A-Za-z0-9_.]*", sheet):
        return f"{sheet}!{ref}"
    return "'" + sheet.replace("'", "''") + f"'!{ref}"


_ = col_index  # re-exported helpers used by the CLI
