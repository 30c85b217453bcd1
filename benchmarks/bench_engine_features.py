"""Side by side: which workbook shapes each formula engine computes (a script, not a test).

Each shape is a small workbook built with openpyxl (XML edited where openpyxl cannot write the
shape); the expected value is what a spreadsheet computes by the function's definition (worked
by hand next to each case).  Both engines read the same file; the script prints one line per
shape and engine: ``ok``, ``WRONG <value>`` or ``FAIL <reason>``, and the time taken.

    python benchmarks/bench_engine_features.py [--only cellfuncs|formualizer|formulas]

``cellfuncs`` is ``cellfuncs.headless.recalc`` (the engine with our workarounds); ``formualizer``
and ``formulas`` are the two engines used bare.  "kept" = the cell was not computed and kept the
value the file held (reported, exit 3).
"""

from __future__ import annotations

import os
import re
import sys
import tempfile
import time
import zipfile

import openpyxl
from openpyxl.workbook.defined_name import DefinedName
from openpyxl.worksheet.formula import ArrayFormula
from openpyxl.worksheet.table import Table

CASES = []


def case(fn):
    CASES.append(fn)
    return fn


def _edit(path, member, fn):
    """Rewrite one zip member with fn(text) -> text."""
    with zipfile.ZipFile(path) as zf:
        parts = {i.filename: zf.read(i.filename) for i in zf.infolist()}
    parts[member] = fn(parts[member].decode()).encode()
    with zipfile.ZipFile(path, "w", zipfile.ZIP_DEFLATED) as zf:
        for k, v in parts.items():
            zf.writestr(k, v)


def _book(cells, title="S"):
    wb = openpyxl.Workbook()
    ws = wb.active
    ws.title = title
    for k, v in cells.items():
        ws[k] = v
    return wb, ws


# Each case returns (path, sheet, cell, expected) and writes the workbook to `d`.
@case
def offset(d):
    wb, ws = _book({"A1": 1, "A2": 2, "A3": 3, "B1": "=SUM(OFFSET(A1,0,0,3,1))"})
    return wb, "S", "B1", 6.0  # 1+2+3


@case
def subtotal(d):
    wb, ws = _book({"A1": 1, "A2": 2, "A3": 3, "B1": "=SUBTOTAL(109,A1:A3)"})
    return wb, "S", "B1", 6.0


@case
def aggregate(d):
    wb, ws = _book({"A1": 1, "A2": 2, "A3": 3, "A4": "=1/0", "B1": "=AGGREGATE(9,6,A1:A4)"})
    return wb, "S", "B1", 6.0  # option 6 ignores error values


@case
def indirect_computed(d):
    wb, ws = _book({"A1": 10, "A2": 20, "C1": 2, "B1": '=INDIRECT("A"&C1)*2'})
    return wb, "S", "B1", 40.0


@case
def hyperlink(d):
    wb, ws = _book({"B1": '=HYPERLINK("https://example.org","site list")'})
    return wb, "S", "B1", "site list"


@case
def sequence(d):
    wb, ws = _book({"B1": "=SUM(SEQUENCE(4))"})
    return wb, "S", "B1", 10.0


@case
def apostrophe_sheet(d):
    wb, ws = _book({"B1": "='Site''s data'!A1*2"})
    wb.create_sheet("Site's data")["A1"] = 21
    return wb, "S", "B1", 42.0


@case
def sheet_scoped_name(d):
    wb, ws = _book({"A1": 5, "B1": "=rate*2"})
    other = wb.create_sheet("T")
    other["A1"] = 7
    other["B1"] = "=rate*2"
    ws.defined_names["rate"] = DefinedName("rate", attr_text="S!$A$1")
    other.defined_names["rate"] = DefinedName("rate", attr_text="T!$A$1")
    return wb, "T", "B1", 14.0


@case
def structured_ref(d):
    wb, ws = _book({"A1": "item", "B1": "cost", "A2": "a", "B2": 1, "A3": "b", "B3": 2,
                    "D1": "=SUM(Costs[cost])"})
    ws.add_table(Table(displayName="Costs", ref="A1:B3"))
    return wb, "S", "D1", 3.0


@case
def three_d_ref(d):
    wb, ws = _book({"B1": "=SUM(P1:P3!A1)"})
    for i in (1, 2, 3):
        wb.create_sheet(f"P{i}")["A1"] = i
    return wb, "S", "B1", 6.0


@case
def iterative_circular(d):
    # x = x/2 + 1 converges to 2 (Excel: File > Options > iterative calculation)
    wb, ws = _book({"A1": "=B1/2+1", "B1": "=A1"})
    wb.calculation.iterate = True
    wb.calculation.iterateCount = 100
    wb.calculation.iterateDelta = 1e-9
    return wb, "S", "A1", 2.0


@case
def data_table(d):
    # one-variable what-if table: column input cell A1, formula row C1 = A1*10
    wb, ws = _book({"A1": 1, "C1": "=A1*10", "B2": 2, "B3": 3, "C2": 20, "C3": 30})
    return wb, "S", "C3", 30.0


data_table.xml = lambda t: re.sub(r'<c r="C2"[^>]*>.*?</c>',
                                  '<c r="C2"><f t="dataTable" ref="C2:C3" dt2D="0" dtr="0" r1="A1"/>'
                                  '<v>999</v></c>', t, flags=re.S).replace(
    '<c r="C3" t="n"><v>30</v></c>', '<c r="C3"><v>999</v></c>')


@case
def legacy_array_fewer_cells(d):
    # {=A1:A3*2} entered over D1:D2 only: Excel shows the top-left part (2, 4)
    wb, ws = _book({"A1": 1, "A2": 2, "A3": 3})
    ws["D1"] = ArrayFormula("D1:D2", "=A1:A3*2")
    return wb, "S", "D2", 4.0


legacy_array_fewer_cells.xml = lambda t: re.sub(
    r'(<row r="2"[^>]*>)(.*?)(</row>)', r'\1\2<c r="D2"><v>999</v></c>\3', t, flags=re.S)


@case
def legacy_array_cached(d):
    # a legacy array whose other cells hold cached values (as every saved file has)
    wb, ws = _book({"A1": 1, "A2": 2, "A3": 3})
    ws["D1"] = ArrayFormula("D1:D3", "=A1:A3*2")
    return wb, "S", "D3", 6.0


legacy_array_cached.xml = lambda t: re.sub(
    r'(<row r="(\d)"[^>]*>)(.*?)(</row>)',
    lambda m: m.group(1) + m.group(3) + (f'<c r="D{m.group(2)}"><v>999</v></c>'
                                         if m.group(2) in "23" else "") + m.group(4), t, flags=re.S)


@case
def whole_column(d):
    wb, ws = _book({"A1": 1, "A2": 2, "B1": 5, "B2": 6, "C1": "=SUM(A:A)+VLOOKUP(2,A:B,2,FALSE)"})
    return wb, "S", "C1", 9.0


@case
def external_whole_column(d):
    wb, ws = _book({"C1": "=SUM([other.xlsx]Sheet1!A:A)"})
    return wb, "S", "C1", "#REF!"


@case
def omitted_argument_builtin(d):
    # ROUND(2.5,) : the omitted digits argument is 0 -> 3
    wb, ws = _book({"B1": "=ROUND(2.5,)"})
    return wb, "S", "B1", 3.0


def build(d):
    out = []
    for fn in CASES:
        wb, sheet, cell, expected = fn(d)
        path = os.path.join(d, fn.__name__ + ".xlsx")
        wb.save(path)
        if hasattr(fn, "xml"):
            _edit(path, "xl/worksheets/sheet1.xml", fn.xml)
        out.append((fn.__name__, path, sheet, cell, expected))
    return out


def big_book(d, n=40_000):
    """n built-in formula cells in ten columns: running sums and lookups over an input column."""
    wb = openpyxl.Workbook()
    ws = wb.active
    ws.title = "S"
    rows = n // 10
    for r in range(1, rows + 1):
        ws.cell(r, 1, r * 0.5)
        ws.cell(r, 2, f"=A{r}*2")
        ws.cell(r, 3, f"=B{r}+A{r}")
        ws.cell(r, 4, f"=IF(C{r}>100,C{r}-100,C{r})")
        ws.cell(r, 5, f"=ROUND(D{r}/3,2)")
        ws.cell(r, 6, f"=MAX(A{r},E{r})")
        ws.cell(r, 7, f"=MIN(B{r},F{r})")
        ws.cell(r, 8, f"=SQRT(ABS(G{r}))")
        ws.cell(r, 9, f"=H{r}^2+1")
        ws.cell(r, 10, f"=SUM(B{r}:I{r})")
        ws.cell(r, 11, f"=K{r - 1}+J{r}" if r > 1 else "=J1")
    path = os.path.join(d, "big.xlsx")
    wb.save(path)
    return path, rows


def _value_fz(v):
    if isinstance(v, dict) and v.get("type") == "Error":
        kind = str(v.get("kind"))
        return {"Div": "#DIV/0!", "Na": "#N/A", "Null": "#NULL!"}.get(kind, "#" + kind.upper() + (
            "?" if kind == "Name" else "!"))
    return v


def run_formualizer(path, sheet, cell):
    import formualizer as fz
    from openpyxl.utils.cell import coordinate_from_string, column_index_from_string

    col, row = coordinate_from_string(cell)
    wb = fz.load_workbook(path)
    wb.evaluate_all()
    return _value_fz(wb.get_value(sheet, row, column_index_from_string(col)))


def run_formulas(path, sheet, cell):
    import formulas

    model = formulas.ExcelModel().loads(path).finish()
    sol = model.calculate()
    name = os.path.basename(path).upper()
    from openpyxl.utils.cell import coordinate_from_string, column_index_from_string, range_boundaries

    col, row = coordinate_from_string(cell)
    c = column_index_from_string(col)
    prefix = f"'[{name}]{sheet.upper()}'!"
    for k, v in sol.items():
        k = str(k).upper()
        if not k.startswith(prefix):
            continue
        c1, r1, c2, r2 = range_boundaries(k[len(prefix):])
        if None in (c1, r1, c2, r2) or not (r1 <= row <= r2 and c1 <= c <= c2):
            continue
        val = getattr(v, "value", v)
        if hasattr(val, "shape") and getattr(val, "ndim", 0) == 2:
            i, j = row - r1, c - c1
            val = val[i, j] if i < val.shape[0] and j < val.shape[1] else "(outside the result)"
        elif hasattr(val, "flat"):
            val = val.flat[0]
        return str(val) if "Error" in type(val).__name__ else val
    return "(not in the solution)"


def run_cellfuncs(path, sheet, cell):
    """The engine as cellfuncs drives it (workarounds in cellfuncs/headless/engine.py)."""
    from cellfuncs.headless import recalc

    res, _ = recalc(path)
    v = res.values.get((sheet, cell))
    return f"kept {v!r}" if (sheet, cell) in res.kept else v


def _same(a, b):
    if isinstance(b, float):
        try:
            return abs(float(a) - b) <= 1e-9 * max(1, abs(b))
        except (TypeError, ValueError):
            return False
    return str(a) == str(b)


def main(argv):
    engines = {"cellfuncs": run_cellfuncs, "formualizer": run_formualizer, "formulas": run_formulas}
    if "--only" in argv:
        keep = argv[argv.index("--only") + 1]
        engines = {keep: engines[keep]}
    d = tempfile.mkdtemp()
    for name, path, sheet, cell, expected in build(d):
        line = [f"{name:28s}"]
        for en, fn in engines.items():
            t0 = time.perf_counter()
            try:
                got = fn(path, sheet, cell)
                verdict = "ok" if _same(got, expected) else f"WRONG {got!r}"
            except Exception as exc:  # noqa: BLE001 - a comparison script
                verdict = f"FAIL {type(exc).__name__}: {str(exc).splitlines()[0][:60] if str(exc) else ''}"
            line.append(f"{en}: {verdict} ({time.perf_counter() - t0:.2f} s)")
        print(" | ".join(line), flush=True)


if __name__ == "__main__":
    main(sys.argv[1:])
