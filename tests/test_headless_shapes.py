"""Real-workbook shapes through `cellfuncs recalc` (issue 9's lists, the engine side).

Each shape is built with openpyxl (its XML edited where openpyxl cannot write it).  The
expected values are worked by hand from the definition of each spreadsheet function
(ECMA-376 Part 1, 18.17 formulas; 18.3.1.40 for the what-if data table attributes) and
written next to each cell.  Where LibreOffice is installed, its headless conversion of the
same input (which computes the formulas, as the input holds no cached values) is compared
with ours as an outside reference.
"""

import json
import re
import shutil
import subprocess
import sys
import zipfile

import openpyxl
import pytest
from openpyxl.workbook.defined_name import DefinedName
from openpyxl.worksheet.formula import ArrayFormula
from openpyxl.worksheet.table import Table


def _run(*args, timeout=300):
    return subprocess.run([sys.executable, "-m", "cellfuncs.cli", *args], capture_output=True, text=True,
                          timeout=timeout)


def _edit(path, member, fn):
    with zipfile.ZipFile(path) as zf:
        parts = {i.filename: zf.read(i.filename) for i in zf.infolist()}
    parts[member] = fn(parts[member].decode()).encode()
    with zipfile.ZipFile(path, "w", zipfile.ZIP_DEFLATED) as zf:
        for k, v in parts.items():
            zf.writestr(k, v)


def _sheet_part(path, title):
    wb = openpyxl.load_workbook(path)
    return f"xl/worksheets/sheet{wb.sheetnames.index(title) + 1}.xml"


#: cell -> expected value (hand-worked)
EXPECTED = {
    "S!B1": 6.0,             # SUM(OFFSET(A1,0,0,3,1)) = 1+2+3
    "S!B2": 6.0,             # SUBTOTAL(109, A1:A3) = sum of the visible cells
    "S!B3": 6.0,             # AGGREGATE(9, 6, A1:A4): sum ignoring the #DIV/0! in A4
    "S!B4": 4.0,             # INDIRECT("A"&C1)*2 with C1 = 2 -> A2*2
    "S!B5": "site list",     # HYPERLINK shows its friendly name
    "S!B6": 10.0,            # SUM(SEQUENCE(4)) = 1+2+3+4
    "S!B7": 42.0,            # 'Site''s data'!A1*2 = 21*2
    "S!B8": 4.0,             # rate scoped to S -> S!A2 = 2, *2
    "T!B1": 14.0,            # rate scoped to T -> T!A1 = 7, *2
    "S!B9": 3.0,             # SUM(Costs[cost]) = 1+2
    "S!B10": 6.0,            # SUM(Plant1:Plant3!A1) = 1+2+3
    "S!B11": 12.0,           # SUM(K:K) + VLOOKUP(2,K:L,2,FALSE) = 6 + 6
    "S!B12": "#REF!",        # a whole column of another workbook: no link is followed
    "S!D1": 2.0, "S!D2": 4.0,                # {=A1:A3*2} over D1:D2: the top-left part
    "S!E1": 3.0, "S!E2": 6.0, "S!E3": 9.0,   # {=A1:A3*3} over E1:E3 whose cells held cached values
    "S!F1": 7.0, "S!F2": 7.0,                # {=7} over F1:F2: one value fills the range
    "DT!C2": 20.0, "DT!C3": 30.0,            # one-variable table: A1 := B2, B3 in C1 = A1*10
    "DT!H5": 103.0, "DT!I5": 203.0,          # two-variable: G4 = E1*100+E2, E1 := H4:I4, E2 := G5:G6
    "DT!H6": 104.0, "DT!I6": 204.0,
}


@pytest.fixture(scope="module")
def shapes(tmp_path_factory):
    d = tmp_path_factory.mktemp("shapes")
    wb = openpyxl.Workbook()
    s = wb.active
    s.title = "S"
    for r, v in enumerate([1, 2, 3], start=1):
        s.cell(r, 1, v)
        s.cell(r, 11, v)            # K1:K3
        s.cell(r, 12, v + 4)        # L1:L3
    s["A4"] = "=1/0"
    s["C1"] = 2
    s["B1"] = "=SUM(OFFSET(A1,0,0,3,1))"
    s["B2"] = "=SUBTOTAL(109,A1:A3)"
    s["B3"] = "=AGGREGATE(9,6,A1:A4)"
    s["B4"] = '=INDIRECT("A"&C1)*2'
    s["B5"] = '=HYPERLINK("https://example.org","site list")'
    s["B6"] = "=SUM(SEQUENCE(4))"
    s["B7"] = "='Site''s data'!A1*2"
    s["B8"] = "=rate*2"
    s["B9"] = "=SUM(Costs[cost])"
    s["B10"] = "=SUM(Plant1:Plant3!A1)"
    s["B11"] = "=SUM(K:K)+VLOOKUP(2,K:L,2,FALSE)"
    s["B12"] = "=SUM([other.xlsx]Sheet1!A:A)"
    s["D1"] = ArrayFormula("D1:D2", "=A1:A3*2")
    s["E1"] = ArrayFormula("E1:E3", "=A1:A3*3")
    s["F1"] = ArrayFormula("F1:F2", "=7")
    s.defined_names["rate"] = DefinedName("rate", attr_text="S!$A$2")
    t = wb.create_sheet("T")
    t["A1"] = 7
    t["B1"] = "=rate*2"
    t.defined_names["rate"] = DefinedName("rate", attr_text="T!$A$1")
    wb.create_sheet("Site's data")["A1"] = 21
    tab = wb.create_sheet("Tab")
    for r, row in enumerate([("item", "cost"), ("a", 1), ("b", 2)], start=1):
        tab.cell(r, 1, row[0])
        tab.cell(r, 2, row[1])
    tab.add_table(Table(displayName="Costs", ref="A1:B3"))
    for i in (1, 2, 3):
        wb.create_sheet(f"Plant{i}")["A1"] = i
    dt = wb.create_sheet("DT")
    dt["A1"] = 1
    dt["C1"] = "=A1*10"
    dt["B2"], dt["B3"] = 2, 3
    dt["C2"], dt["C3"] = 0, 0
    dt["E1"], dt["E2"] = 0, 0
    dt["G4"] = "=E1*100+E2"
    dt["H4"], dt["I4"], dt["G5"], dt["G6"] = 1, 2, 3, 4
    for ref in ("H5", "I5", "H6", "I6"):
        dt[ref] = 0
    path = d / "shapes.xlsx"
    wb.save(path)
    # cached values in the other cells of E1:E3 (as every saved file has them)
    # (in column order, before the K cell of the row, as a writer lays them out)
    _edit(path, "xl/worksheets/sheet1.xml", lambda x: re.sub(
        r'(<row r="([23])"[^>]*>.*?)(<c r="K[23]")',
        lambda m: m.group(1) + f'<c r="E{m.group(2)}"><v>999</v></c>' + m.group(3), x, flags=re.S))
    # the what-if data tables (openpyxl cannot write them)
    dt_part = _sheet_part(path, "DT")

    def tables(x):
        x = re.sub(r'<c r="C2"[^>]*>.*?</c>', '<c r="C2"><f t="dataTable" ref="C2:C3" dt2D="0" dtr="0" '
                   'r1="A1"/><v>999</v></c>', x, flags=re.S)
        return re.sub(r'<c r="H5"[^>]*>.*?</c>', '<c r="H5"><f t="dataTable" ref="H5:I6" dt2D="1" dtr="1" '
                      'r1="E1" r2="E2"/><v>999</v></c>', x, flags=re.S)

    _edit(path, dt_part, tables)
    out = d / "out.xlsx"
    p = _run("recalc", str(path), "-o", str(out), "--json")
    return path, out, p


def test_every_shape_is_computed(shapes):
    path, out, p = shapes
    assert p.returncode == 0, p.stderr
    got = json.loads(p.stdout)
    wrong = {k: (got.get(k), v) for k, v in EXPECTED.items()
             if not (got.get(k) == v or (isinstance(v, float) and isinstance(got.get(k), float)
                                         and abs(got[k] - v) < 1e-9))}
    assert not wrong, wrong
    # the output holds the same values as cached values and keeps its formulas
    wb = openpyxl.load_workbook(out, data_only=True)
    assert wb["S"]["B1"].value == 6 and wb["DT"]["I6"].value == 204 and wb["S"]["E3"].value == 9
    assert openpyxl.load_workbook(out)["S"]["B10"].value == "=SUM(Plant1:Plant3!A1)"


@pytest.mark.skipif(shutil.which("soffice") is None, reason="LibreOffice (soffice) is not installed")
def test_libreoffice_computes_the_same(shapes, tmp_path):
    """LibreOffice's headless conversion of the input as an outside reference.

    Shapes LibreOffice itself does not compute (it shows an error or nothing) are skipped
    cell by cell; every cell it does compute must agree with ours.
    """
    path, out, p = shapes
    got = json.loads(p.stdout)
    lo = tmp_path / "lo"
    r = subprocess.run(["soffice", "--headless", "--convert-to", "xlsx", "--outdir", str(lo), str(path)],
                       capture_output=True, text=True, timeout=240)
    if r.returncode != 0 or not (lo / "shapes.xlsx").exists():
        pytest.skip(f"soffice could not convert: {r.stderr[-200:]}")
    wb = openpyxl.load_workbook(lo / "shapes.xlsx", data_only=True)
    agree, differ = [], []
    for key in EXPECTED:
        sheet, ref = key.split("!")
        v = wb[sheet][ref].value
        if v is None or (isinstance(v, str) and v.startswith("#") and v != got[key]):
            continue  # LibreOffice does not compute this shape
        ours = got[key]
        same = (abs(float(v) - ours) < 1e-9) if isinstance(ours, float) and isinstance(v, (int, float)) \
            else str(v) == str(ours)
        (agree if same else differ).append((key, v, ours))
    assert not differ, differ
    assert len(agree) >= 12, agree


def test_iterative_circular_reference(tmp_path):
    wb = openpyxl.Workbook()
    ws = wb.active
    ws["A1"] = "=B1/2+1"   # x = x/2 + 1 converges to 2
    ws["B1"] = "=A1"
    wb.calculation.iterate = True
    wb.calculation.iterateCount = 100
    wb.calculation.iterateDelta = 1e-9
    path = tmp_path / "loop.xlsx"
    wb.save(path)
    p = _run("recalc", str(path), "-o", str(tmp_path / "o.xlsx"), "--json")
    assert p.returncode == 0, p.stderr
    assert json.loads(p.stdout)["Sheet!A1"] == pytest.approx(2.0, abs=1e-6)


def _with_cached(path, cell, value):
    _edit(path, "xl/worksheets/sheet1.xml", lambda x: re.sub(
        rf'(<c r="{cell}"[^>]*>)(<f>.*?</f>)(<v\s*/>|<v>.*?</v>)?', rf"\1\2<v>{value}</v>", x, flags=re.S))


def test_a_cell_the_engine_cannot_compute_keeps_its_value(tmp_path):
    """An unknown function whose cell held 5: kept, named on stderr, exit 3; its dependent uses 5."""
    wb = openpyxl.Workbook()
    ws = wb.active
    ws["A1"] = 3
    ws["B1"] = "=NOSUCHFUNCTION(A1)"
    ws["C1"] = "=B1*2"
    ws["D1"] = "=A1+1"
    path = tmp_path / "gap.xlsx"
    wb.save(path)
    _with_cached(path, "B1", 5)
    out = tmp_path / "o.xlsx"
    p = _run("recalc", str(path), "-o", str(out), "--json")
    assert p.returncode == 3, p.stderr
    got = json.loads(p.stdout)
    assert got["Sheet!B1"] == 5 and got["Sheet!C1"] == 10 and got["Sheet!D1"] == 4
    lines = [ln for ln in p.stderr.splitlines() if "not computed" in ln]
    assert len(lines) == 1 and lines[0].startswith("Sheet!B1: not computed: ")
    assert openpyxl.load_workbook(out, data_only=True)["Sheet"]["B1"].value == 5
    # its input changed: the old value would be stale, so it becomes an error, named on stderr
    p = _run("recalc", str(path), "-o", str(out), "--json", "--set", "Sheet!A1=4")
    assert p.returncode == 3, p.stderr
    got = json.loads(p.stdout)
    assert got["Sheet!B1"] == "#N/A" and got["Sheet!D1"] == 5
    assert got["Sheet!C1"] == "#N/A"          # nothing is computed from the stale value 5
    assert "Sheet!B1: not computed: " in p.stderr and "inputs changed" in p.stderr


def test_cases_follow_what_if_tables(tmp_path):
    """A data table whose formula uses a case input is computed again for every case."""
    wb = openpyxl.Workbook()
    ws = wb.active
    ws["A1"], ws["K1"] = 1, 0
    ws["C1"] = "=A1*10+K1"          # the table's formula; A1 is its column input cell
    ws["B2"], ws["B3"], ws["C2"], ws["C3"] = 2, 3, 0, 0
    ws["E1"] = "=MAX(C2:C3)"
    wb.defined_names["out_top"] = DefinedName("out_top", attr_text="Sheet!$E$1")
    path = tmp_path / "t.xlsx"
    wb.save(path)
    _edit(path, "xl/worksheets/sheet1.xml", lambda x: re.sub(
        r'<c r="C2"[^>]*>.*?</c>', '<c r="C2"><f t="dataTable" ref="C2:C3" dt2D="0" dtr="0" r1="A1"/><v>0</v></c>',
        x, flags=re.S))
    cases = tmp_path / "c.csv"
    cases.write_text("Sheet!K1\n1\n5\n", encoding="utf-8")
    out = tmp_path / "r.csv"
    p = _run("cases", str(path), str(cases), "-o", str(out))
    assert p.returncode == 0, p.stderr
    rows = out.read_text().splitlines()
    assert rows[1].split(",")[1] == "31" and rows[2].split(",")[1] == "35"   # 3*10 + K1


@pytest.fixture()
def inputs_book(tmp_path):
    wb = openpyxl.Workbook()
    ws = wb.active
    ws.title = "In"
    ws["A1"], ws["B1"], ws["C1"] = 10, "counter", 5
    ws["D1"] = "=A1+C1"
    wb.defined_names["t_amb"] = DefinedName("t_amb", attr_text="In!$A$1")
    wb.defined_names["block"] = DefinedName("block", attr_text="In!$A$1:$C$1")
    wb.defined_names["const"] = DefinedName("const", attr_text="0.5")
    wb.defined_names["gone"] = DefinedName("gone", attr_text="#REF!")
    path = tmp_path / "in.xlsx"
    wb.save(path)
    return path


def test_set_reads_values_as_cases_does(inputs_book, tmp_path):
    out = tmp_path / "o.xlsx"
    for text, expected in (("1e3", 1005.0), ("-5", 0.0), (" 2.5 ", 7.5)):
        p = _run("recalc", str(inputs_book), "-o", str(out), "--json", "--set", f"t_amb={text}")
        assert p.returncode == 0, p.stderr
        assert json.loads(p.stdout)["In!D1"] == expected      # A1 + C1 with C1 = 5
    p = _run("recalc", str(inputs_book), "-o", str(out), "--set", "In!B1=parallel")   # text into text
    assert p.returncode == 0, p.stderr


@pytest.mark.parametrize("args, words", [
    (["--set", "t_amb=hot"], "not a number"),
    (["--set", "t_amb=95 °C"], "not a number"),
    (["--set", "t_amb=95,5"], "not a number"),
    (["--set", "In!E5=hot"], "not a number"),                          # text into a blank cell
    (["--set", "t_amb=1", "--set", "In!A1=2"], "set each cell once"),  # the same cell twice
    (["--set", "t_amb=1", "--set", "t_amb=2"], "twice"),
    (["--set", "block=1"], "range"),
    (["--set", "const=1"], "constant"),
    (["--set", "gone=1"], "nothing"),
    (["--set", "In!D1=1"], "formula"),
])
def test_set_refusals_are_one_line(inputs_book, tmp_path, args, words):
    out = tmp_path / "o.xlsx"
    p = _run("recalc", str(inputs_book), "-o", str(out), *args)
    assert p.returncode == 2, p.stderr
    lines = p.stderr.strip().splitlines()
    assert len(lines) == 1 and words in lines[0], p.stderr
    assert not out.exists()


def test_a_name_spelled_like_a_function_is_warned_about(tmp_path):
    wb = openpyxl.Workbook()
    ws = wb.active
    ws["A1"] = 5
    ws["B1"] = "=hx_lmtd*2"
    wb.defined_names["hx_lmtd"] = DefinedName("hx_lmtd", attr_text="Sheet!$A$1")
    path = tmp_path / "n.xlsx"
    wb.save(path)
    p = _run("recalc", str(path), "-o", str(tmp_path / "o.xlsx"), "--json")
    assert p.returncode == 0, p.stderr
    assert "warning: the defined name hx_lmtd is also the name of a cell function" in p.stderr
    assert json.loads(p.stdout)["Sheet!B1"] == 10


def test_large_ranges_are_counted_within_the_used_area(tmp_path):
    """=SUM(C1:L1000000) on a sheet used down to row 5: computed (the budget counts 50 cells)."""
    wb = openpyxl.Workbook()
    ws = wb.active
    ws["A1"], ws["C5"] = 1, 2
    ws["B1"] = "=SUM(C1:L1000000)"
    for i in range(10):
        ws.cell(2 + i, 2, f"=SUM({'ACDEFGHIJK'[i]}:{'ACDEFGHIJK'[i]})")
    path = tmp_path / "big.xlsx"
    wb.save(path)
    p = _run("recalc", str(path), "-o", str(tmp_path / "o.xlsx"), "--json")
    assert p.returncode == 0, p.stderr
    got = json.loads(p.stdout)
    assert got["Sheet!B1"] == 2 and got["Sheet!B2"] == 1 and got["Sheet!B3"] == 2


def test_budget_and_memory_errors_are_one_line(tmp_path):
    wb = openpyxl.Workbook()
    ws = wb.active
    for r in range(1, 101):
        ws.cell(r, 1, r)
    for r in range(1, 11):
        ws.cell(r, 2, "=SUM(A:A)")
    path = tmp_path / "b.xlsx"
    wb.save(path)
    out = tmp_path / "o.xlsx"
    code = ("import sys; from cellfuncs.headless import limits; limits.MAX_REFERENCED_CELLS = 999; "
            "from cellfuncs.cli import main; sys.exit(main(sys.argv[1:]))")
    p = subprocess.run([sys.executable, "-c", code, "recalc", str(path), "-o", str(out)], capture_output=True,
                       text=True, timeout=300)
    assert p.returncode == 2 and len(p.stderr.strip().splitlines()) == 1, p.stderr
    assert "1,000 cells" in p.stderr            # ten whole columns of 100 used rows
    code = ("import sys; from cellfuncs.headless import engine\n"
            "def boom(*a, **k): raise MemoryError\n"
            "engine.Model.evaluate = boom\n"
            "from cellfuncs.cli import main; sys.exit(main(sys.argv[1:]))")
    p = subprocess.run([sys.executable, "-c", code, "recalc", str(path), "-o", str(out)], capture_output=True,
                       text=True, timeout=300)
    assert p.returncode == 2 and len(p.stderr.strip().splitlines()) == 1, p.stderr
    assert "out of memory" in p.stderr and "Traceback" not in p.stderr
    assert not out.exists() and not list(tmp_path.glob(".cellfuncs-*"))


def test_a_name_holding_one_of_our_formulas_is_reported_not_guessed(tmp_path):
    """The engine cannot load a defined name whose formula calls our functions: the cell says so."""
    wb = openpyxl.Workbook()
    ws = wb.active
    ws["A1"] = 3
    ws["B1"] = "=lm+A1"
    ws["C1"] = "=A1*2"
    wb.defined_names["lm"] = DefinedName("lm", attr_text="HX_LMTD(100,60,30,40.2)")
    path = tmp_path / "nm.xlsx"
    wb.save(path)
    p = _run("recalc", str(path), "-o", str(tmp_path / "o.xlsx"), "--json")
    assert p.returncode == 3, p.stderr
    got = json.loads(p.stdout)
    assert got["Sheet!C1"] == 6 and got["Sheet!B1"] == "#N/A"
    assert "Sheet!B1: not computed: uses the defined name lm" in p.stderr
