"""`cellfuncs cases`: a workbook run over the rows of a CSV (expected values: ht.LMTD)."""

import csv
import subprocess
import sys

import ht
import openpyxl
import pytest
from openpyxl.workbook.defined_name import DefinedName


def _run(*args):
    return subprocess.run([sys.executable, "-m", "cellfuncs.cli", *args], capture_output=True,
                          text=True, timeout=300)


@pytest.fixture()
def book(tmp_path):
    wb = openpyxl.Workbook()
    ws = wb.active
    ws.title = "Inputs"
    for r, (name, v) in enumerate([("t_hot_in", 100), ("t_cold_out", 40.2), ("flow", "counter")], 1):
        ws.cell(r, 2, v)
        wb.defined_names[name] = DefinedName(name, attr_text=f"Inputs!$B${r}")
    c = wb.create_sheet("Calc")
    c["B1"] = "=HX_LMTD(t_hot_in,60,30,t_cold_out,flow)"
    c["B2"] = "=B1*2"
    wb.defined_names["out_lmtd"] = DefinedName("out_lmtd", attr_text="Calc!$B$1")
    wb.defined_names["out_double"] = DefinedName("out_double", attr_text="Calc!$B$2")
    path = tmp_path / "book.xlsx"
    wb.save(path)
    return path


def _write(path, rows):
    with open(path, "w", newline="") as fh:
        csv.writer(fh).writerows(rows)


@pytest.mark.parametrize("workers", ["1", "2"])
def test_cases_values_and_errors(book, tmp_path, workers):
    cases = tmp_path / "cases.csv"
    _write(cases, [["t_hot_in", "t_cold_out", "flow"], [100, 40.2, "counter"], [100, 40.2, "parallel"],
                   [120, 50, "counter"], [50, 40.2, "counter"]])
    out = tmp_path / "res.csv"
    p = _run("cases", str(book), str(cases), "-o", str(out), "--workers", workers)
    assert p.returncode == 0, p.stderr
    rows = list(csv.DictReader(open(out)))
    # inputs in the order of the header, then the outputs in the workbook's order, each with its reason
    assert list(rows[0]) == ["t_hot_in", "t_cold_out", "flow", "out_lmtd", "out_lmtd error", "out_double",
                             "out_double error"]
    assert float(rows[0]["out_lmtd"]) == pytest.approx(ht.LMTD(100, 60, 30, 40.2), rel=1e-9)
    # parallel flow: ht.LMTD(100, 60, 30, 40.2, counterflow=False)
    assert float(rows[1]["out_lmtd"]) == pytest.approx(ht.LMTD(100, 60, 30, 40.2, counterflow=False), rel=1e-9)
    assert float(rows[2]["out_double"]) == pytest.approx(2 * ht.LMTD(120, 60, 30, 50), rel=1e-9)
    assert rows[3]["out_lmtd"] == "#NUM!"        # 50 °C hot inlet is below the cold outlet: a cross
    assert "case 4 (line 5), out_lmtd: #NUM!" in p.stderr
    assert "t_hot_in 50" in rows[3]["out_lmtd error"]  # the reason names the input at fault


def test_numbers_reach_an_input_cell_that_is_blank_now(tmp_path):
    """A case may fill an input cell that is blank in the workbook: numbers stay numbers."""
    wb = openpyxl.Workbook()
    ws = wb.active
    ws.title = "S"
    ws["B1"] = "=HX_LMTD(100,60,30,A1)"
    wb.defined_names["out_lmtd"] = DefinedName("out_lmtd", attr_text="S!$B$1")
    path = tmp_path / "blank.xlsx"
    wb.save(path)
    cases = tmp_path / "c.csv"
    _write(cases, [["S!A1"], [40.2]])
    out = tmp_path / "r.csv"
    p = _run("cases", str(path), str(cases), "-o", str(out))
    assert p.returncode == 0, p.stderr
    row = next(csv.DictReader(open(out)))
    assert float(row["out_lmtd"]) == pytest.approx(43.200409294, rel=1e-9)  # Bergman Ex. 11.1


def test_cases_bad_input_exit_2(book, tmp_path):
    out = tmp_path / "res.csv"
    unknown = tmp_path / "u.csv"
    _write(unknown, [["no_such_input"], [1]])
    text = tmp_path / "t.csv"
    _write(text, [["t_hot_in"], ["hot"]])
    dup = tmp_path / "dup.csv"
    _write(dup, [["t_hot_in", "t_hot_in"], [1, 2]])
    extra = tmp_path / "extra.csv"
    _write(extra, [["t_hot_in"], [100, 5]])
    inf = tmp_path / "inf.csv"
    _write(inf, [["t_hot_in"], ["inf"]])
    formula = tmp_path / "formula.csv"
    _write(formula, [["out_lmtd"], [1]])
    for csv_path in (unknown, text, tmp_path / "missing.csv", dup, extra, inf, formula):
        p = _run("cases", str(book), str(csv_path), "-o", str(out))
        assert p.returncode == 2, p.stderr
        assert len(p.stderr.strip().splitlines()) == 1
    p = _run("cases", str(book), str(unknown), "-o", str(unknown))
    assert p.returncode == 2
    p = _run("cases", str(book), str(unknown), "-o", str(tmp_path))
    assert p.returncode == 2 and "folder" in p.stderr
    assert not out.exists()


def test_semicolon_and_utf16_csv(book, tmp_path):
    """A CSV as spreadsheet programs write it with a decimal comma (semicolons) or as UTF-16."""
    out = tmp_path / "res.csv"
    semi = tmp_path / "semi.csv"
    semi.write_text("t_hot_in;t_cold_out;flow\n100;40.2;counter\n", encoding="utf-8")
    p = _run("cases", str(book), str(semi), "-o", str(out))
    assert p.returncode == 0, p.stderr
    text = out.read_text()
    assert text.splitlines()[0] == "t_hot_in;t_cold_out;flow;out_lmtd;out_lmtd error;out_double;out_double error"
    row = next(csv.DictReader(open(out), delimiter=";"))
    assert float(row["out_lmtd"]) == pytest.approx(ht.LMTD(100, 60, 30, 40.2), rel=1e-9)  # ht.LMTD
    wide = tmp_path / "utf16.csv"
    wide.write_text("t_hot_in,t_cold_out,flow\n100,40.2,counter\n", encoding="utf-16")
    p = _run("cases", str(book), str(wide), "-o", str(out))
    assert p.returncode == 0, p.stderr
    row = next(csv.DictReader(open(out)))
    assert float(row["out_lmtd"]) == pytest.approx(ht.LMTD(100, 60, 30, 40.2), rel=1e-9)  # ht.LMTD


def test_decimal_comma_is_refused_with_a_hint(book, tmp_path):
    """A European decimal comma ("40,2") is not read as a number: one line that says how to write it."""
    semi = tmp_path / "comma.csv"
    semi.write_text("t_hot_in;t_cold_out\n100;40,2\n", encoding="utf-8")
    p = _run("cases", str(book), str(semi), "-o", str(tmp_path / "res.csv"))
    assert p.returncode == 2
    assert p.stderr.count("\n") == 1 and "decimal point as '.'" in p.stderr, p.stderr
    assert not (tmp_path / "res.csv").exists()


def test_numbers_have_ten_significant_digits(book, tmp_path):
    cases = tmp_path / "c.csv"
    _write(cases, [["t_hot_in"], [100]])
    out = tmp_path / "r.csv"
    p = _run("cases", str(book), str(cases), "-o", str(out))
    assert p.returncode == 0, p.stderr
    row = next(csv.DictReader(open(out)))
    lmtd = ht.LMTD(100, 60, 30, 40.2)  # ht.LMTD: 43.2004092...
    assert row["out_lmtd"] == f"{lmtd:.10g}" and len(row["out_lmtd"].replace(".", "")) == 10


def test_two_columns_naming_one_cell_and_line_numbers(book, tmp_path):
    out = tmp_path / "r.csv"
    same = tmp_path / "same.csv"
    _write(same, [["t_hot_in", "Inputs!B1"], [100, 100]])
    p = _run("cases", str(book), str(same), "-o", str(out))
    assert p.returncode == 2 and len(p.stderr.strip().splitlines()) == 1, p.stderr
    assert "Traceback" not in p.stderr and "once" in p.stderr
    bad = tmp_path / "bad.csv"
    bad.write_text("t_hot_in\n100\n\n95,5\n", encoding="utf-8")   # a blank line before the bad case
    p = _run("cases", str(book), str(bad), "-o", str(out))
    assert p.returncode == 2 and "case 2 (line 4)" in p.stderr, p.stderr
    assert not out.exists()
