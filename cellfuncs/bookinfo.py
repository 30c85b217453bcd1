"""``cellfuncs inputs``: what a workbook takes and gives, read from its defined names.

A named input is a defined name of one cell that holds a value, not a formula;
its unit is read from the cell to the right of it and its label from the cell
to the left (as the demo workbooks lay them out).  The outputs are the defined
names starting with ``out_`` (what ``cellfuncs cases`` writes by default), with
the values the file holds (cached by the last recalculation).  Named ranges
(a gas analysis) are listed apart: ``cases`` sets single cells only.
"""

from __future__ import annotations

import os
from dataclasses import asdict, dataclass

__all__ = ["BookInfo", "NamedCell", "book_info", "info_text", "info_json"]


@dataclass
class NamedCell:
    """One defined name: where it points, what it holds, its label and unit."""

    name: str
    ref: str          # Sheet!A1 (or Sheet!A1:B4 for a range)
    value: object     # number, text, None; for a range its shape "rows x columns"
    unit: str
    label: str


@dataclass
class BookInfo:
    book: str
    inputs: list      # NamedCell, single cells holding a value
    outputs: list     # NamedCell, names starting with out_
    ranges: list      # NamedCell, named ranges of more than one cell
    other: int        # named single cells holding a formula that are not outputs

    @property
    def cases_columns(self) -> list:
        """Column headers ``cellfuncs cases`` accepts by name (besides any Sheet!A1 input cell)."""
        return [c.name for c in self.inputs]


def _text(v) -> str:
    if v is None:
        return ""
    if isinstance(v, float):
        return f"{v:.10g}"
    return str(v)


def _short(v, width: int = 40) -> str:
    t = _text(v)
    return t if len(t) <= width else t[:width - 3] + "..."


def _quote_sheet(sheet: str) -> str:
    return f"'{sheet}'" if any(ch in sheet for ch in " -!'()") else sheet


def book_info(path: str) -> BookInfo:
    """Read ``path`` (.xlsx/.xlsm); raise :class:`cellfuncs.headless.package.BookError` if it is unusable."""
    import zipfile

    import openpyxl
    from openpyxl.utils.cell import range_boundaries

    from cellfuncs.headless.package import BookError

    if not os.path.isfile(path):
        raise BookError(f"{path}: no such file")
    if not path.lower().endswith((".xlsx", ".xlsm")):
        raise BookError(f"{path}: not an .xlsx workbook")
    try:
        wb = openpyxl.load_workbook(path)
        cached = openpyxl.load_workbook(path, data_only=True)
    except (zipfile.BadZipFile, KeyError, OSError, ValueError) as exc:
        raise BookError(f"{path}: not a readable .xlsx workbook ({exc})") from None
    inputs, outputs, ranges, other = [], [], [], 0
    for name, dn in wb.defined_names.items():
        if name.startswith("_xlnm") or dn.is_external:
            continue
        try:
            dests = list(dn.destinations)
        except Exception:  # noqa: BLE001 - a name that is a formula or a constant, not a place
            dests = []
        if len(dests) != 1 or dests[0][0] not in wb.sheetnames:
            continue
        sheet, ref = dests[0][0], dests[0][1].replace("$", "")
        ws, ws_v = wb[sheet], cached[sheet]
        where = f"{_quote_sheet(sheet)}!{ref}"
        if ":" in ref:
            try:
                c0, r0, c1, r1 = range_boundaries(ref)
                shape = f"{r1 - r0 + 1} x {c1 - c0 + 1}"
            except (TypeError, ValueError):  # whole rows or columns ("A:A")
                shape = "whole rows or columns"
            ranges.append(NamedCell(name, where, shape, "", ""))
            continue
        try:
            cell = ws[ref]
        except (ValueError, IndexError):  # not a cell reference
            continue
        unit, label = _unit_beside(ws_v, cell.row, cell.column), _label_beside(ws, cell.row, cell.column)
        is_formula = isinstance(cell.value, str) and cell.value.startswith("=") or cell.data_type == "f"
        if name.lower().startswith("out_"):
            outputs.append(NamedCell(name, where, ws_v[ref].value, _unit(unit), _text(label)))
        elif is_formula:
            other += 1
        else:
            inputs.append(NamedCell(name, where, cell.value, _unit(unit), _text(label)))
    return BookInfo(os.path.basename(path), inputs, outputs, ranges, other)


def _unit_beside(ws_v, row: int, col: int):
    """The unit: the first text to the right, past the numbers of a table row (as displayed)."""
    for c in range(col + 1, col + 10):
        v = ws_v.cell(row, c).value
        if v is None or isinstance(v, str):
            return v
    return None


def _label_beside(ws, row: int, col: int):
    """The label: the nearest text to the left that is not a formula."""
    for c in range(col - 1, 0, -1):
        v = ws.cell(row, c).value
        if isinstance(v, str) and not v.startswith("="):
            return v
    return None


def _unit(v) -> str:
    # a unit is short text; a number or a long sentence beside the cell is not one
    if isinstance(v, str) and 0 < len(v.strip()) <= 24 and not v.startswith("="):
        return v.strip()
    return ""


def _table(rows: list, head: tuple) -> list:
    widths = [max(len(str(r[i])) for r in [head] + rows) for i in range(len(head))]
    out = []
    for r in [head] + rows:
        out.append("  " + "  ".join(str(v).ljust(w) for v, w in zip(r, widths)).rstrip())
    return out


def info_text(info: BookInfo) -> str:
    """The plain-text report of ``cellfuncs inputs``."""
    lines = [f"{info.book}", ""]
    if info.inputs:
        lines.append(f"Named inputs ({len(info.inputs)}):")
        lines += _table([(c.name, _short(c.value), c.unit, c.ref, c.label) for c in info.inputs],
                        ("name", "value", "unit", "cell", "label"))
    else:
        lines.append("Named inputs: none (no defined name points at a single cell holding a value)")
    if info.ranges:
        lines += ["", f"Named ranges ({len(info.ranges)}; edit them in the workbook — cases sets single cells):"]
        lines += _table([(c.name, c.ref, c.value) for c in info.ranges], ("name", "cells", "rows x columns"))
    lines.append("")
    if info.outputs:
        lines.append(f"Outputs ({len(info.outputs)}; names starting with out_, written by cases by default;"
                     " values as last computed):")
        lines += _table([(c.name, _short(c.value) if c.value is not None else "(not computed)", c.unit, c.ref,
                          c.label) for c in info.outputs], ("name", "value", "unit", "cell", "label"))
    else:
        lines.append("Outputs: none (no defined name starts with out_; give cases --outputs)")
    lines += ["", "Column headers that cellfuncs cases accepts:"]
    if info.inputs:
        lines.append("  " + ",".join(info.cases_columns))
    example = info.inputs[0].ref if info.inputs else "Inputs!B5"
    lines.append(f"  or any input cell written as Sheet!A1 (a cell holding a value, not a formula), e.g. {example}")
    return "\n".join(lines) + "\n"


def info_json(info: BookInfo) -> dict:
    """The ``--json`` form: book, inputs, ranges, outputs, cases_columns."""
    return {"book": info.book,
            "inputs": [asdict(c) for c in info.inputs],
            "ranges": [asdict(c) for c in info.ranges],
            "outputs": [asdict(c) for c in info.outputs],
            "cases_columns": info.cases_columns}
