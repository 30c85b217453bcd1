"""``cellfuncs inputs BOOK``: named inputs with values and units, the out_ outputs, the columns
``cellfuncs cases`` accepts; and the sample cases.csv of the tender demo."""

import csv
import json
import subprocess
import sys
from pathlib import Path

import openpyxl
import pytest
from openpyxl.workbook.defined_name import DefinedName

from cellfuncs.cli import main

ROOT = Path(__file__).resolve().parent.parent
DEMO = ROOT / "workbooks_demo"


@pytest.fixture()
def small_book(tmp_path):
    """Inputs laid out as the demos do (label | value | unit), a range, an output and a named formula."""
    wb = openpyxl.Workbook()
    ws = wb.active
    ws.title = "Inputs"
    ws.append(["input", "value", "unit"])
    ws.append(["Ambient temperature", 31.5, "°C"])
    ws.append(["Arrangement", "counter", None])
    ws.append(["Water flow", 12, "m³/h"])
    ws["E1"], ws["E2"] = "methane", "ethane"
    ws["F1"], ws["F2"] = 90, 10
    calc = wb.create_sheet("Calc sheet")
    calc["A1"], calc["B1"], calc["C1"] = "Twice the temperature", "=2*t_ambient", "°C"
    calc["B2"] = "=B1+1"
    for name, ref in (("t_ambient", "Inputs!$B$2"), ("arrangement_word", "Inputs!$B$3"),
                      ("water_flow_m3_h", "Inputs!$B$4"), ("gas_names", "Inputs!$E$1:$E$2"),
                      ("out_double", "'Calc sheet'!$B$1"), ("helper", "'Calc sheet'!$B$2")):
        wb.defined_names[name] = DefinedName(name, attr_text=ref)
    path = tmp_path / "small.xlsx"
    wb.save(path)
    return path


def test_inputs_text_lists_inputs_units_outputs_and_columns(small_book, capsys):
    assert main(["inputs", str(small_book)]) == 0
    out = capsys.readouterr().out
    lines = out.splitlines()
    row = next(ln for ln in lines if ln.split()[:1] == ["t_ambient"])
    assert row.split()[:4] == ["t_ambient", "31.5", "°C", "Inputs!B2"]
    assert "Ambient temperature" in row
    assert next(ln for ln in lines if ln.split()[:1] == ["water_flow_m3_h"]).split()[2] == "m³/h"
    assert next(ln for ln in lines if ln.split()[:1] == ["gas_names"]).split()[1:] == ["Inputs!E1:E2", "2", "x",
                                                                                       "1"]
    out_row = next(ln for ln in lines if ln.split()[:1] == ["out_double"])
    assert "(not computed)" in out_row and "'Calc sheet'!B1" in out_row
    assert "t_ambient,arrangement_word,water_flow_m3_h" in out  # the cases columns, in workbook order
    assert "helper" not in out  # a named formula cell is neither an input nor an output


def test_inputs_json(small_book, capsys):
    assert main(["inputs", str(small_book), "--json"]) == 0
    obj = json.loads(capsys.readouterr().out)
    assert obj["cases_columns"] == ["t_ambient", "arrangement_word", "water_flow_m3_h"]
    assert obj["inputs"][0] == {"name": "t_ambient", "ref": "Inputs!B2", "value": 31.5, "unit": "°C",
                                "label": "Ambient temperature"}
    assert obj["inputs"][1]["unit"] == ""
    assert [o["name"] for o in obj["outputs"]] == ["out_double"]
    assert obj["ranges"][0]["name"] == "gas_names"


def test_inputs_shows_cached_output_values_of_a_computed_book(tmp_path, capsys):
    """A recalculated workbook's outputs show the values the file holds (read back with openpyxl)."""
    src = DEMO / "hx_sizing.xlsx"
    assert main(["inputs", str(src), "--json"]) == 0
    obj = json.loads(capsys.readouterr().out)
    wb = openpyxl.load_workbook(src, data_only=True)
    for o in obj["outputs"]:
        sheet, _, ref = o["ref"].rpartition("!")
        assert o["value"] == wb[sheet.strip("'")][ref].value
    assert {"exhaust_flow_kg_h", "plate_duty_kw"} <= set(obj["cases_columns"])


@pytest.mark.parametrize("args, message", [
    (["nope.xlsx"], "no such file"),
    (["README.md"], "not an .xlsx workbook"),
])
def test_inputs_unusable_book(args, message, capsys):
    target = args[0] if args[0].startswith("nope") else str(ROOT / args[0])
    assert main(["inputs", target]) == 2
    err = capsys.readouterr().err
    assert message in err and err.count("\n") == 1


def test_inputs_columns_are_accepted_by_cases(tmp_path):
    """Every column `inputs` names is accepted by `cases` (one case with the workbook's own values)."""
    book = DEMO / "hx_sizing.xlsx"
    p = subprocess.run([sys.executable, "-m", "cellfuncs.cli", "inputs", str(book), "--json"],
                       capture_output=True, text=True, timeout=120)
    obj = json.loads(p.stdout)
    values = {c["name"]: c["value"] for c in obj["inputs"]}
    cases_csv = tmp_path / "one.csv"
    with cases_csv.open("w", newline="", encoding="utf-8") as fh:
        w = csv.writer(fh)
        w.writerow(obj["cases_columns"])
        w.writerow([values[c] for c in obj["cases_columns"]])
    out = tmp_path / "res.csv"
    p = subprocess.run([sys.executable, "-m", "cellfuncs.cli", "cases", str(book), str(cases_csv), "-o", str(out)],
                       capture_output=True, text=True, timeout=300)
    assert p.returncode == 0, p.stderr
    with out.open(encoding="utf-8") as fh:
        rows = list(csv.reader(fh))
    assert len(rows) == 2


# ---- the sample cases.csv of the tender demo -------------------------------------------------

def _tool():
    sys.path.insert(0, str(ROOT / "tools"))
    import make_cases_csv

    return make_cases_csv


def test_sample_cases_csv_is_current():
    """workbooks_demo/cases.csv is what tools/make_cases_csv.py makes from the tender's named inputs."""
    header, rows = _tool().case_rows(str(DEMO / "tender_chp.xlsx"))
    with (DEMO / "cases.csv").open(encoding="utf-8", newline="") as fh:
        committed = list(csv.reader(fh))
    assert committed == [header] + rows, "run `python tools/make_cases_csv.py` after rebuilding the tender demo"


def test_sample_cases_run(tmp_path):
    out = tmp_path / "results.csv"
    p = subprocess.run([sys.executable, "-m", "cellfuncs.cli", "cases", "workbooks_demo/tender_chp.xlsx",
                        "workbooks_demo/cases.csv", "-o", str(out)], cwd=ROOT, capture_output=True, text=True,
                       timeout=600)
    assert p.returncode == 0, p.stderr
    with (DEMO / "cases.csv").open(encoding="utf-8") as fh:
        n_cases = sum(1 for _ in fh) - 1
    with out.open(encoding="utf-8") as fh:
        rows = list(csv.reader(fh))
    assert len(rows) == n_cases + 1 and n_cases >= 4


def test_sample_cases_refuse_a_book_without_the_roles(small_book):
    with pytest.raises(SystemExit, match="no named input for rh_ambient"):
        _tool().case_rows(str(small_book))


def test_inputs_corrupt_book(tmp_path, capsys):
    bad = tmp_path / "bad.xlsx"
    bad.write_bytes(b"not a zip")
    assert main(["inputs", str(bad)]) == 2
    err = capsys.readouterr().err
    assert "not a readable .xlsx workbook" in err and err.count("\n") == 1


def test_inputs_odd_names(tmp_path, capsys):
    """Names of whole columns, constants and broken references are shown or skipped, never a traceback."""
    wb = openpyxl.Workbook()
    ws = wb.active
    ws.title = "S"
    ws["A1"] = 1
    for name, ref in (("whole_column", "S!$A:$A"), ("a_constant", "0.5"), ("broken", "#REF!")):
        wb.defined_names[name] = DefinedName(name, attr_text=ref)
    path = tmp_path / "odd.xlsx"
    wb.save(path)
    assert main(["inputs", str(path), "--json"]) == 0
    obj = json.loads(capsys.readouterr().out)
    assert obj["inputs"] == [] and obj["outputs"] == []
    assert [r["name"] for r in obj["ranges"]] == ["whole_column"]
