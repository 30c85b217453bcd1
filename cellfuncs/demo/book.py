"""Building blocks of the demo workbooks (openpyxl): inputs, calculation rows, results.

Every demo workbook has an ``Inputs`` sheet (named input cells, units beside
them, drop-down lists for option words), calculation sheets that call our
functions, a ``Results`` sheet, an ``xlwings.conf`` sheet with
``UDF Modules`` = ``cellfuncs.excel``, and a visible caution block.

Tables of inputs (a gas analysis) sit on columns of their own to the right of
the note column.  Every sheet named ``Inputs`` or ``Results`` gets a print
area and a fit-to-width page setup when the book is saved, whatever module
built it.  No defined name may equal a cell-function name (LibreOffice shows
``Err:509`` for such a formula and Excel's function import trips over it).
"""

from __future__ import annotations

import datetime as _dt

from openpyxl import Workbook
from openpyxl.styles import Alignment, Border, Font, PatternFill, Side
from openpyxl.workbook.defined_name import DefinedName
from openpyxl.worksheet.datavalidation import DataValidation
from openpyxl.utils import get_column_letter
from openpyxl.worksheet.formula import ArrayFormula

__all__ = ["DemoBook", "CAUTION_LINES", "PRINTED_SHEETS", "page_setup"]

#: sheets that get a print area and a fit-to-width page setup when a demo book is saved
PRINTED_SHEETS = ("Inputs", "Results")
#: first column of the tables of inputs on the Inputs sheet (after the note column D and a gap E)
_TABLE_COL = 6

CAUTION_LINES = (
    "CAUTION — estimates for tendering only.",
    "Engine data (outputs, temperatures, flows, knock reference point) must come from the engine's declared datasheet.",
    "Final design of gas, pressure, hot-water and exhaust systems follows local codes and is done by licensed engineers.",
    "All names, sites and numbers in this demo are invented.",
)

_TITLE = Font(bold=True, size=14)
_HEAD = Font(bold=True)
_INPUT_FILL = PatternFill("solid", fgColor="FFF6E7C1")   # pale sand: cells a user may change
_RESULT_FILL = PatternFill("solid", fgColor="FFDDEBDD")  # pale sage: key results
_CAUTION_FILL = PatternFill("solid", fgColor="FFF4D6D6")
_THIN = Side(style="thin", color="FF9A9A9A")
_BOX = Border(top=_THIN, bottom=_THIN, left=_THIN, right=_THIN)
FIXED_TIME = _dt.datetime(2026, 1, 1, 0, 0, 0)


def _function_names() -> frozenset:
    from cellfuncs import catalogue

    return frozenset(e.name.upper() for e in catalogue.entries())


def page_setup(ws, print_area: bool = True) -> None:
    """Landscape when wide, fit to one page wide (any height); print area over the used cells."""
    last_col, last_row = ws.max_column, ws.max_row
    if print_area:
        # a check text computed in the last column runs on into the empty columns to its right:
        # the printed area takes in about 45 characters' width more so the text is not cut
        spare, extra = 0.0, 0
        while spare < 45:
            extra += 1
            spare += ws.column_dimensions[get_column_letter(last_col + extra)].width or 9
        ws.print_area = f"A1:{get_column_letter(last_col + extra)}{last_row}"
    width = sum((ws.column_dimensions[get_column_letter(i)].width or 9) for i in range(1, last_col + 1))
    ws.page_setup.orientation = "landscape" if width > 110 else "portrait"
    ws.page_setup.paperSize = ws.PAPERSIZE_A4
    ws.page_setup.fitToWidth = 1
    ws.page_setup.fitToHeight = 0
    ws.sheet_properties.pageSetUpPr.fitToPage = True
    ws.print_options.gridLines = False
    ws.page_margins.left = ws.page_margins.right = 0.5


def _wrapped(ws, row, col, text, width=None):
    """Write ``text`` wrapped in its column, the row made tall enough (no program re-fits it)."""
    c = ws.cell(row, col, text)
    c.alignment = Alignment(wrap_text=True, vertical="top")
    width = width or ws.column_dimensions[get_column_letter(col)].width or 9
    lines = -(-len(str(text)) // max(int(width * 1.25), 1))
    if lines > 1:
        rd = ws.row_dimensions[row]
        rd.height = max(rd.height or 15, 15 * lines)
        for left in range(1, col):  # the row's label, value and unit at the top, beside the first line
            cell = ws.cell(row, left)
            if cell.value is not None:
                cell.alignment = Alignment(vertical="top", wrap_text=cell.alignment.wrap_text)
    return c


class _Sheet:
    """A calculation or results sheet filled row by row: label | value | unit | note."""

    def __init__(self, book, ws, title):
        self.book, self.ws = book, ws
        ws["A1"] = title
        ws["A1"].font = _TITLE
        self.row = 3
        for col, width in zip("ABCDEFGHIJ", (52, 22, 22, 22, 22, 22, 22, 16, 16, 16)):
            ws.column_dimensions[col].width = width

    def heading(self, text):
        self.row += 1
        self.ws.cell(self.row, 1, text).font = _HEAD
        self.row += 1

    def note(self, text):
        self.ws.cell(self.row, 1, text).alignment = Alignment(wrap_text=False)
        self.row += 1

    def calc(self, label, formula, unit="", note="", name=None, result=False, fmt="0.00"):
        """A row with a formula in column B; ``name`` makes it a defined name."""
        r = self.row
        self.ws.cell(r, 1, label)
        c = self.ws.cell(r, 2, formula)
        c.number_format = fmt
        c.border = _BOX
        if result:
            c.fill = _RESULT_FILL
        self.ws.cell(r, 3, unit)
        if note:
            self.ws.cell(r, 4, note)
        ref = f"'{self.ws.title}'!$B${r}"
        if name:
            self.book.name(name, ref)
        self.row += 1
        return f"'{self.ws.title}'!B{r}" if not name else name

    def array(self, label, formula, n_cols, unit="", note="", fmt="0.00"):
        """A legacy array formula over n_cols cells starting at column B."""
        r = self.row
        self.ws.cell(r, 1, label)
        last = chr(ord("B") + n_cols - 1)
        ref = f"B{r}:{last}{r}"
        self.ws[f"B{r}"] = ArrayFormula(ref, formula)
        for i in range(n_cols):
            cell = self.ws.cell(r, 2 + i)
            cell.number_format = fmt
            cell.border = _BOX
        self.ws.cell(r, 2 + n_cols, unit)
        if note:
            self.ws.cell(r, 3 + n_cols, note)
        self.row += 1
        return f"'{self.ws.title}'!{ref}"

    def table_row(self, label, cells, unit="", fmt="0.00"):
        """A row of plain values or formulas from column B on."""
        r = self.row
        self.ws.cell(r, 1, label)
        for i, v in enumerate(cells):
            c = self.ws.cell(r, 2 + i, v)
            if isinstance(v, str) and v.startswith("="):
                c.number_format = fmt
                c.border = _BOX
        if unit:
            self.ws.cell(r, 2 + len(cells), unit)
        self.row += 1
        return r

    def caution(self):
        self.row += 1
        for line in CAUTION_LINES:
            c = self.ws.cell(self.row, 1, line)
            c.fill = _CAUTION_FILL
            c.font = _HEAD if line.startswith("CAUTION") else Font()
            self.row += 1


class DemoBook:
    """A demo workbook under construction.

    Parameters
    ----------
    title : str
        Shown at the top of the Inputs sheet.
    purpose : str
        One line on what the workbook shows.
    """

    def __init__(self, title: str, purpose: str):
        self.wb = Workbook()
        self.wb.properties.creator = "cellfuncs demo"
        self.wb.properties.created = FIXED_TIME
        self.wb.properties.modified = FIXED_TIME
        ws = self.wb.active
        ws.title = "Inputs"
        self.inputs = ws
        ws["A1"] = title
        ws["A1"].font = _TITLE
        ws["A2"] = purpose
        for col, width in zip("ABCD", (46, 18, 12, 56)):
            ws.column_dimensions[col].width = width
        self._in_row = 4
        self._table_row = 4
        self._head_inputs()
        self.sheets = {}

    def _head_inputs(self):
        for i, h in enumerate(("input", "value", "unit", "note"), start=1):
            self.inputs.cell(self._in_row, i, h).font = _HEAD
        self._in_row += 1

    def name(self, name: str, ref: str):
        """Define ``name`` for ``ref``; a name equal to a cell-function name is refused."""
        if name.upper() in _function_names():
            raise ValueError(f"defined name {name!r} is the name of the cell function {name.upper()}; "
                             "choose another name (a workbook must not define it)")
        self.wb.defined_names[name] = DefinedName(name, attr_text=ref)

    def input_heading(self, text: str):
        self._in_row += 1
        self.inputs.cell(self._in_row, 1, text).font = _HEAD
        self._in_row += 1

    def input(self, name, label, value, unit="", note="", options=None, fmt=None):
        """An input cell in column B of Inputs, named ``name``; options -> drop-down list."""
        r = self._in_row
        ws = self.inputs
        ws.cell(r, 1, label)
        c = ws.cell(r, 2, value)
        c.fill = _INPUT_FILL
        c.border = _BOX
        if fmt:
            c.number_format = fmt
        ws.cell(r, 3, unit)
        if note:
            _wrapped(ws, r, 4, note)
        if options:
            dv = DataValidation(type="list", formula1='"' + ",".join(options) + '"', allow_blank=True)
            ws.add_data_validation(dv)
            dv.add(c)
        self.name(name, f"Inputs!$B${r}")
        self._in_row += 1
        return name

    def input_block(self, name, label, rows, unit="", note=""):
        """A block of inputs (e.g. a gas analysis: names in B, amounts in C)."""
        ws = self.inputs
        ws.cell(self._in_row, 1, label).font = _HEAD
        if note:
            ws.cell(self._in_row, 4, note)
        self._in_row += 1
        first = self._in_row
        width = len(rows[0])
        for row in rows:
            for j, v in enumerate(row):
                c = ws.cell(self._in_row, 2 + j, v)
                c.fill = _INPUT_FILL
                c.border = _BOX
            if unit:
                ws.cell(self._in_row, 2 + width, unit)
            self._in_row += 1
        last = self._in_row - 1
        end_col = chr(ord("B") + width - 1)
        self.name(name, f"Inputs!$B${first}:${end_col}${last}")
        return name

    def input_table(self, label, header, rows, names, unit="", note=""):
        """A table of inputs on columns of its own, right of the note column.

        The first column holds the row labels, then one column per further header
        entry; ``names[i]`` names column i of the table (``None`` leaves it
        unnamed).  Tables stack downwards from the top of the sheet.  ``unit`` is
        added to the label when the label does not already say it.  Returns the
        first and last row numbers of the data.
        """
        ws = self.inputs
        col0 = _TABLE_COL
        if unit and unit not in label:
            label = f"{label} ({unit})"
        ws.cell(self._table_row, col0, label).font = _HEAD
        self._table_row += 1
        if note:
            ws.cell(self._table_row, col0, note).font = Font(italic=True)
            self._table_row += 1
        widths = []
        for j, h in enumerate(header):
            longest = max([len(str(h)) // 2 + 1] + [len(str(r[j])) for r in rows])
            dim = ws.column_dimensions[get_column_letter(col0 + j)]
            dim.width = max(dim.width or 0, min(max(longest + 3, 10), 28))
            widths.append(dim.width)
        for j, h in enumerate(header):
            c = _wrapped(ws, self._table_row, col0 + j, h, widths[j])
            c.font = _HEAD
        self._table_row += 1
        first = self._table_row
        for row in rows:
            for j, v in enumerate(row):
                c = ws.cell(self._table_row, col0 + j, v)
                c.border = _BOX
                if j > 0:
                    c.fill = _INPUT_FILL
            self._table_row += 1
        last = self._table_row - 1
        self._table_row += 1
        ws.column_dimensions[get_column_letter(col0 - 1)].width = 3
        for j, name in enumerate(names):
            if name:
                col = get_column_letter(col0 + j)
                self.name(name, f"Inputs!${col}${first}:${col}${last}")
        return first, last

    def input_caution(self):
        self._in_row += 1
        for line in CAUTION_LINES:
            c = self.inputs.cell(self._in_row, 1, line)
            c.fill = _CAUTION_FILL
            c.font = _HEAD if line.startswith("CAUTION") else Font()
            self._in_row += 1

    def sheet(self, title: str, heading: str | None = None) -> _Sheet:
        ws = self.wb.create_sheet(title)
        s = _Sheet(self, ws, heading or title)
        self.sheets[title] = s
        return s

    def finish(self):
        """Add the caution block to Inputs and Results, and the xlwings.conf sheet."""
        self.input_caution()
        if "Results" in self.sheets:
            self.sheets["Results"].caution()
        conf = self.wb.create_sheet("xlwings.conf")
        conf["A1"] = "UDF Modules"
        conf["B1"] = "cellfuncs.excel"
        conf.column_dimensions["A"].width = 18
        conf.column_dimensions["B"].width = 24
        self.wb.calculation.fullCalcOnLoad = True

    def save(self, path: str):
        for ws in self.wb.worksheets:
            if ws.title != "xlwings.conf":
                # calculation sheets: no print area, so that their charts print too
                page_setup(ws, print_area=ws.title in PRINTED_SHEETS)
        self.wb.save(path)
