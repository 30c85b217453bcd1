"""End to end: a workbook calling the HX functions, recalculated by `cellfuncs recalc`.

Expected values come from the reference library `ht` (ht.LMTD, ht.F_LMTD_Fakheri,
ht.effectiveness_from_NTU, ht.NTU_from_effectiveness), computed in the test.
"""

import hashlib
import json
import subprocess
import sys
import zipfile

import ht
import openpyxl
import pytest
from openpyxl.comments import Comment
from openpyxl.workbook.defined_name import DefinedName
from openpyxl.worksheet.datavalidation import DataValidation
from openpyxl.worksheet.formula import ArrayFormula


def _run(*args):
    return subprocess.run([sys.executable, "-m", "cellfuncs.cli", *args], capture_output=True,
                          text=True, timeout=300)


def _digest(path):
    return hashlib.sha256(path.read_bytes()).hexdigest()


@pytest.fixture()
def book(tmp_path):
    wb = openpyxl.Workbook()
    ws = wb.active
    ws.title = "Inputs"
    for r, (label, value) in enumerate([("t_hot_in", 130), ("t_hot_out", 110), ("t_cold_in", 15),
                                        ("t_cold_out", 85), ("duty", 500), ("u", 1200),
                                        ("arrangement", "1-2"), ("c_ratio_bad", 1.4)], start=1):
        ws.cell(r, 1, label)
        ws.cell(r, 2, value)
        wb.defined_names[label] = DefinedName(label, attr_text=f"Inputs!$B${r}")
    dv = DataValidation(type="list", formula1='"counter,1-2,2-4"')
    ws.add_data_validation(dv)
    dv.add("B7")
    ws["B1"].comment = Comment("engine datasheet value", "demo")
    ws.column_dimensions["A"].width = 33
    c = wb.create_sheet("HX Calc")
    c["A1"] = "=HX_LMTD(t_hot_in,t_hot_out,t_cold_in,t_cold_out)"
    c["A2"] = "=HX_F(t_hot_in,t_hot_out,t_cold_in,t_cold_out,arrangement)"
    c["A3"] = "=HX_UA(duty,t_hot_in,t_hot_out,t_cold_in,t_cold_out,arrangement)"
    c["A4"] = "=HX_AREA(duty,u,t_hot_in,t_hot_out,t_cold_in,t_cold_out,arrangement)"
    c["A5"] = '=HX_EFFECTIVENESS(2,0.5,"cross")'
    c["A6"] = "=HX_NTU(A5,0.5,\"cross\")"
    c["A7"] = "=HX_EFFECTIVENESS(2,c_ratio_bad)"      # deliberately bad: c_ratio above 1
    c["A8"] = "=A7*2"                                  # depends on the bad cell
    c["A9"] = "=A1+1"                                  # does not
    c["B1"] = ArrayFormula("B1:D1", '=HX_RATE(130,15,25,35.7142857142857,10,"counter","all")')
    c["A10"] = '=_xludf.HX_LMTD(100,60,30,40.2,"parallel")'
    path = tmp_path / "in.xlsx"
    wb.save(path)
    return path


def test_recalc_json_values_errors_and_safety(book, tmp_path):
    before = _digest(book)
    out = tmp_path / "out.xlsx"
    p = _run("recalc", str(book), "-o", str(out), "--json")
    assert p.returncode == 0, p.stderr
    got = json.loads(p.stdout)
    lmtd = ht.LMTD(130, 110, 15, 85)
    f12 = ht.F_LMTD_Fakheri(130, 110, 15, 85, shells=1)
    assert got["HX Calc!A1"] == pytest.approx(lmtd, rel=1e-9)              # ht.LMTD
    assert got["HX Calc!A2"] == pytest.approx(f12, rel=1e-9)               # ht.F_LMTD_Fakheri
    assert got["HX Calc!A3"] == pytest.approx(500 / (lmtd * f12), rel=1e-9)
    assert got["HX Calc!A4"] == pytest.approx(500e3 / (1200 * lmtd * f12), rel=1e-9)
    eps = ht.effectiveness_from_NTU(2, 0.5, subtype="crossflow")  # ht: exact, both fluids unmixed
    assert got["HX Calc!A5"] == pytest.approx(eps, rel=1e-9)
    assert got["HX Calc!A6"] == pytest.approx(2.0, rel=1e-9)  # round trip through our own NTU
    assert got["HX Calc!A7"] == "#NUM!"
    assert got["HX Calc!A8"] == "#NUM!"
    assert got["HX Calc!A9"] == pytest.approx(lmtd + 1, rel=1e-12)
    # counterflow rating: C_min = 25 kW/K, Cr = 0.7, NTU = 0.4 (ht.effectiveness_from_NTU)
    e = ht.effectiveness_from_NTU(0.4, 0.7, subtype="counterflow")
    assert got["HX Calc!B1"] == pytest.approx(e * 25 * 115, rel=1e-9)
    assert got["HX Calc!C1"] == pytest.approx(130 - e * 115, rel=1e-9)
    assert got["HX Calc!D1"] == pytest.approx(15 + e * 25 * 115 / 35.7142857142857, rel=1e-9)
    # Bergman Example 11.1 streams in parallel flow: ht.LMTD(100, 60, 30, 40.2, counterflow=False)
    assert got["HX Calc!A10"] == pytest.approx(ht.LMTD(100, 60, 30, 40.2, counterflow=False), rel=1e-9)
    errors = [k for k, v in got.items() if isinstance(v, str) and v.startswith("#")]
    assert sorted(errors) == ["HX Calc!A7", "HX Calc!A8"]
    assert "HX Calc!A7: #NUM! c_ratio" in p.stderr
    # the input is untouched; the output carries formulas, cached values and the rest
    assert _digest(book) == before
    wb = openpyxl.load_workbook(out, data_only=True)
    assert wb["HX Calc"]["A1"].value == pytest.approx(lmtd, rel=1e-9)
    assert wb["HX Calc"]["C1"].value == pytest.approx(130 - e * 115, rel=1e-9)
    assert wb["HX Calc"]["A7"].value == "#NUM!"
    wbf = openpyxl.load_workbook(out)
    assert wbf["HX Calc"]["A1"].value == "=HX_LMTD(t_hot_in,t_hot_out,t_cold_in,t_cold_out)"
    assert set(wbf.defined_names) >= {"t_hot_in", "duty", "arrangement"}
    assert wbf["Inputs"].data_validations.dataValidation[0].formula1 == '"counter,1-2,2-4"'
    assert wbf["Inputs"]["B1"].comment.text == "engine datasheet value"
    assert wbf["Inputs"].column_dimensions["A"].width == 33
    wbxml = zipfile.ZipFile(out).read("xl/workbook.xml").decode()
    assert "fullCalcOnLoad" not in wbxml


def test_set_overrides_an_input(book, tmp_path):
    out = tmp_path / "out.xlsx"
    p = _run("recalc", str(book), "-o", str(out), "--json", "--set", "t_hot_in=140",
             "--set", "Inputs!B7=counter")
    assert p.returncode == 0, p.stderr
    got = json.loads(p.stdout)
    assert got["HX Calc!A1"] == pytest.approx(ht.LMTD(140, 110, 15, 85), rel=1e-9)
    assert got["HX Calc!A2"] == pytest.approx(1.0)  # counterflow: F = 1
    assert openpyxl.load_workbook(out)["Inputs"]["B1"].value == 140


def test_unusable_input_exits_2_with_one_line(book, tmp_path):
    out = tmp_path / "o.xlsx"
    cases = {
        "missing": [str(tmp_path / "nope.xlsx"), "-o", str(out)],
        "same file": [str(book), "-o", str(book)],
        "same file, other spelling": [str(book), "-o", str(tmp_path / "." / "in.xlsx")],
        "unknown target": [str(book), "-o", str(out), "--set", "no_such_name=1"],
        "bad set": [str(book), "-o", str(out), "--set", "t_hot_in"],
        "empty value": [str(book), "-o", str(out), "--set", "t_hot_in="],
        "no folder": [str(book), "-o", str(tmp_path / "missing" / "o.xlsx")],
    }
    text = tmp_path / "notes.xlsx"
    text.write_text("not a workbook")
    cases["not a zip"] = [str(text), "-o", str(out)]
    broken = tmp_path / "broken.xlsx"
    broken.write_bytes(book.read_bytes()[:900])
    cases["corrupt zip"] = [str(broken), "-o", str(out)]
    before = _digest(book)
    for why, args in cases.items():
        p = _run("recalc", *args)
        assert p.returncode == 2, (why, p.stderr)
        lines = p.stderr.strip().splitlines()
        assert len(lines) == 1 and lines[0].startswith("cellfuncs: "), (why, p.stderr)
        assert "Traceback" not in p.stderr
    assert _digest(book) == before
    assert not out.exists()


def test_external_links_become_errors(tmp_path):
    wb = openpyxl.Workbook()
    ws = wb.active
    ws["A1"] = "=[other.xlsx]Sheet1!A1+1"
    ws["A2"] = "=2+2"
    ws["A3"] = "='C:\\data\\[other.xlsx]Sheet1'!A1+1"
    ws["A4"] = "=INDIRECT(\"'/srv/[other.xlsx]Inputs'!B7\")"
    path = tmp_path / "links.xlsx"
    wb.save(path)
    p = _run("recalc", str(path), "-o", str(tmp_path / "o.xlsx"), "--json")
    assert p.returncode == 0, p.stderr
    got = json.loads(p.stdout)
    assert got["Sheet!A1"] == "#REF!"
    assert got["Sheet!A2"] == 4
    assert got["Sheet!A3"] == "#REF!"
    assert got["Sheet!A4"] in ("#REF!", "#NAME?")  # an error, never the 0 of an unread link


def test_more_unusable_input_exits_2(book, tmp_path):
    """Hostile inputs found in review: each is one line and exit 2, and nothing is written."""
    out = tmp_path / "o.xlsx"
    folder = tmp_path / "a_folder"
    folder.mkdir()
    flipped = bytearray(book.read_bytes())
    with zipfile.ZipFile(book) as zf:
        info = zf.getinfo("xl/worksheets/sheet2.xml")
    flipped[info.header_offset + 60] ^= 0xFF  # damage the compressed sheet data
    damaged = tmp_path / "damaged.xlsx"
    damaged.write_bytes(bytes(flipped))
    cases = {
        "row 0": [str(book), "-o", str(out), "--set", "Inputs!A0=3"],
        "past column XFD": [str(book), "-o", str(out), "--set", "Inputs!ZZZ1=3"],
        "not finite": [str(book), "-o", str(out), "--set", "duty=nan"],
        "infinite": [str(book), "-o", str(out), "--set", "duty=1e999"],
        "a formula cell": [str(book), "-o", str(out), "--set", "HX Calc!A1=5"],
        "output is a folder": [str(book), "-o", str(folder)],
        "damaged zip data": [str(damaged), "-o", str(out)],
    }
    for why, args in cases.items():
        p = _run("recalc", *args)
        assert p.returncode == 2, (why, p.stderr)
        assert len(p.stderr.strip().splitlines()) == 1, (why, p.stderr)
    assert not out.exists()


def test_a_far_away_formatted_blank_does_not_blow_up(tmp_path):
    """A styled empty cell at XFD1048576 (a common leftover) must not make the engine walk 17e9 cells."""
    from openpyxl.styles import Font

    wb = openpyxl.Workbook()
    ws = wb.active
    ws["A1"] = "=HX_LMTD(100,60,30,40.2)"
    ws["XFD1048576"].font = Font(bold=True)
    path = tmp_path / "far.xlsx"
    wb.save(path)
    p = _run("recalc", str(path), "-o", str(tmp_path / "o.xlsx"), "--json")
    assert p.returncode == 0, p.stderr
    assert json.loads(p.stdout)["Sheet!A1"] == pytest.approx(43.200409294, rel=1e-9)  # Bergman Ex. 11.1


def test_one_unreadable_formula_fails_alone(tmp_path):
    """A formula the engine cannot parse (a structured table reference) fails as #NAME?, the rest computes."""
    wb = openpyxl.Workbook()
    ws = wb.active
    ws["A1"] = "=Table1[Col]"
    ws["A2"] = "=HX_LMTD(100,60,30,40.2)"
    path = tmp_path / "table.xlsx"
    wb.save(path)
    out = tmp_path / "o.xlsx"
    p = _run("recalc", str(path), "-o", str(out), "--json")
    assert p.returncode == 0, p.stderr
    got = json.loads(p.stdout)
    assert got["Sheet!A1"] == "#NAME?"
    assert got["Sheet!A2"] == pytest.approx(43.200409294, rel=1e-9)  # Bergman Ex. 11.1
    assert openpyxl.load_workbook(out)["Sheet"]["A1"].value == "=Table1[Col]"
