"""The demo workbooks: deterministic, computed without unexpected errors, carrying cached values,
the cautions and the Excel set-up; a fresh build matches the committed files cell by cell."""

import math
import subprocess
import sys
from pathlib import Path

import openpyxl
import pytest

from cellfuncs import demo

ROOT = Path(__file__).resolve().parent.parent
COMMITTED = ROOT / "workbooks_demo"


@pytest.fixture(scope="module")
def built(tmp_path_factory):
    out = tmp_path_factory.mktemp("demo")
    books = {}
    for name in demo.WORKBOOKS:
        path, res, named = demo.build_one(name, str(out))
        books[name] = (Path(path), res, named)
    return books


@pytest.mark.parametrize("name", demo.WORKBOOKS)
def test_no_unexpected_error_cells(built, name):
    import importlib

    mod = importlib.import_module(f"cellfuncs.demo.{name}")
    _, res, _ = built[name]
    unexpected = {k: res.messages[k] for k in res.errors() if k not in mod.EXPECTED_ERRORS}
    assert not unexpected


@pytest.mark.parametrize("name", demo.WORKBOOKS)
def test_structure_cautions_and_cached_values(built, name):
    path, res, _ = built[name]
    wb = openpyxl.load_workbook(path)
    assert wb.sheetnames[0] == "Inputs"
    assert "Results" in wb.sheetnames
    conf = wb["xlwings.conf"]
    assert (conf["A1"].value, conf["B1"].value) == ("UDF Modules", "cellfuncs.excel")
    for sheet in ("Inputs", "Results"):
        text = " ".join(str(c.value) for row in wb[sheet].iter_rows() for c in row if c.value)
        assert "estimates for tendering" in text
        assert "declared datasheet" in text
        assert "licensed engineers" in text
    assert any(n for n in wb.defined_names), "named inputs"
    values = openpyxl.load_workbook(path, data_only=True)
    for (sheet, ref), v in res.values.items():
        cached = values[sheet][ref].value
        assert cached is not None, f"{sheet}!{ref} has no cached value"


@pytest.mark.parametrize("name", demo.WORKBOOKS)
def test_fresh_build_matches_committed(built, name):
    path, _, _ = built[name]
    committed = COMMITTED / path.name
    assert committed.exists(), f"run `cellfuncs demo -o workbooks_demo` and commit {path.name}"
    for data_only in (False, True):
        a = openpyxl.load_workbook(path, data_only=data_only)
        b = openpyxl.load_workbook(committed, data_only=data_only)
        assert a.sheetnames == b.sheetnames
        for ws in a.worksheets:
            wb_ = b[ws.title]
            for row in ws.iter_rows():
                for c in row:
                    other = wb_[c.coordinate].value
                    mine = c.value
                    if isinstance(mine, float) and isinstance(other, (int, float)):
                        assert math.isclose(mine, other, rel_tol=1e-9, abs_tol=1e-12), (ws.title, c.coordinate)
                    elif hasattr(mine, "text"):  # array formula
                        assert mine.text == getattr(other, "text", None), (ws.title, c.coordinate)
                    else:
                        assert mine == other, (ws.title, c.coordinate, mine, other)


def test_demo_command(tmp_path):
    p = subprocess.run([sys.executable, "-m", "cellfuncs.cli", "demo", "-o", str(tmp_path)],
                       capture_output=True, text=True, timeout=600)
    assert p.returncode == 0, p.stderr
    assert "UNEXPECTED" not in p.stdout
    assert "estimates for tendering" in p.stdout
    for name in demo.WORKBOOKS:
        import importlib

        assert (tmp_path / importlib.import_module(f"cellfuncs.demo.{name}").FILENAME).exists()
