"""`cellfuncs cases` leaves out of each case the formulas the outputs do not depend on (for speed):
outputs reached through a legacy array's other cells and through INDEX must still be computed.

Expected values: ht.LMTD (the reference library of the HX family), then plain arithmetic.
"""

import csv
import subprocess
import sys

import ht
import openpyxl
import pytest
from openpyxl.workbook.defined_name import DefinedName
from openpyxl.worksheet.formula import ArrayFormula


@pytest.fixture()
def book(tmp_path):
    wb = openpyxl.Workbook()
    ws = wb.active
    ws.title = "Inputs"
    for r, (name, v) in enumerate([("t_hot_in", 100), ("t_cold_out", 40.2)], 1):
        ws.cell(r, 2, v)
        wb.defined_names[name] = DefinedName(name, attr_text=f"Inputs!$B${r}")
    c = wb.create_sheet("Calc")
    c["A1"] = '=HX_LMTD(t_hot_in,60,30,t_cold_out,"counter")'
    c["B1"] = "=A1+1"
    c["C1"] = "=A1+2"
    c["A3"] = ArrayFormula("A3:C3", "=A1:C1*2")      # legacy array: C3 is not its anchor
    c["E1"] = "=INDEX(A3:C3,3)"
    o = wb.create_sheet("Other")                     # nothing an output needs
    o["A1"] = '=HX_LMTD(t_hot_in,60,30,t_cold_out,"counter")*10'
    o["A2"] = "=A1+Calc!B1"
    wb.defined_names["out_index"] = DefinedName("out_index", attr_text="Calc!$E$1")
    wb.defined_names["out_c3"] = DefinedName("out_c3", attr_text="Calc!$C$3")
    path = tmp_path / "book.xlsx"
    wb.save(path)
    return path


@pytest.mark.parametrize("workers", ["1", "2"])
def test_outputs_through_array_cells_and_index(book, tmp_path, workers):
    cases = tmp_path / "cases.csv"
    rows = [(100, 40.2), (120, 50), (90, 45)]
    with open(cases, "w", newline="") as fh:
        csv.writer(fh).writerows([["t_hot_in", "t_cold_out"], *rows])
    out = tmp_path / "res.csv"
    p = subprocess.run([sys.executable, "-m", "cellfuncs.cli", "cases", str(book), str(cases), "-o", str(out),
                        "--workers", workers], capture_output=True, text=True, timeout=300)
    assert p.returncode == 0, p.stderr
    got = list(csv.DictReader(open(out)))
    for (t_hot, t_cold), row in zip(rows, got):
        lmtd = ht.LMTD(t_hot, 60, 30, t_cold)        # ht.LMTD, counterflow
        assert float(row["out_index"]) == pytest.approx(2 * (lmtd + 2), rel=1e-9)
        assert float(row["out_c3"]) == pytest.approx(2 * (lmtd + 2), rel=1e-9)


def test_runner_leaves_out_only_what_outputs_do_not_need(book):
    from cellfuncs.headless.cases import CaseRunner

    r = CaseRunner(str(book), ["t_hot_in", "t_cold_out"], ["Calc!C3", "Calc!B1"])
    assert r.pruned
    lmtd = ht.LMTD(110, 60, 30, 45)                  # ht.LMTD, counterflow
    c3, b1 = r.run_case([110.0, 45.0])
    assert c3 == pytest.approx(2 * (lmtd + 2), rel=1e-9)
    assert b1 == pytest.approx(lmtd + 1, rel=1e-9)
    assert r.model.value("Other", 1, 1) == 0.0       # left out: not computed for the cases
