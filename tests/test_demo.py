"""The demo workbooks: deterministic, computed without unexpected errors, carrying cached values,
the cautions and the Excel set-up; a fresh build matches the committed files cell by cell."""

import math
import os
import re
import subprocess
import sys
from pathlib import Path

import openpyxl
import pytest

from cellfuncs import demo

ROOT = Path(__file__).resolve().parent.parent
COMMITTED = ROOT / "workbooks_demo"


class _Built(dict):
    """Each demo built once, when a test first asks for it (one failing build fails only its tests)."""

    def __init__(self, out):
        super().__init__()
        self.out = out

    def __missing__(self, name):
        path, res, named = demo.build_one(name, str(self.out))
        self[name] = (Path(path), res, named)
        return self[name]


@pytest.fixture(scope="module")
def built(tmp_path_factory):
    return _Built(tmp_path_factory.mktemp("demo"))


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
    assert committed.exists(), f"run `cellfuncs demo -o workbooks_demo --force` and commit {path.name}"
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
    """The real command, on a console that is not UTF-8 (a redirected Windows console)."""
    env = {**os.environ, "PYTHONIOENCODING": "cp1252"}
    p = subprocess.run([sys.executable, "-m", "cellfuncs.cli", "demo", "-o", str(tmp_path)],
                       capture_output=True, text=True, encoding="cp1252", timeout=600, env=env)
    assert p.returncode == 0, p.stderr
    assert "UNEXPECTED" not in p.stdout
    assert "estimates for tendering" in p.stdout
    for name in demo.WORKBOOKS:
        import importlib

        assert (tmp_path / importlib.import_module(f"cellfuncs.demo.{name}").FILENAME).exists()


# ---- layout and names (issue 10) -------------------------------------------------------------

from cellfuncs import catalogue  # noqa: E402
from cellfuncs.demo.book import PRINTED_SHEETS, DemoBook  # noqa: E402

#: the demos whose layout this file checks in detail (tender_chp is built by its own module)
OWN = ("gas_quality", "knock_whatif", "hx_sizing")


def _committed(name):
    import importlib

    return COMMITTED / importlib.import_module(f"cellfuncs.demo.{name}").FILENAME


@pytest.mark.parametrize("name", demo.WORKBOOKS)
def test_no_defined_name_is_a_function_name(name):
    """A defined name equal to a cell-function name breaks other spreadsheet programs (issue 10)."""
    functions = {e.name.upper() for e in catalogue.entries()}
    wb = openpyxl.load_workbook(_committed(name))
    assert sorted(n for n in wb.defined_names if n.upper() in functions) == []


@pytest.mark.parametrize("bad", ["exh_flow", "EXH_FLOW", "Hx_Lmtd"])
def test_book_refuses_a_function_name(bad):
    b = DemoBook("t", "p")
    with pytest.raises(ValueError, match="is the name of the cell function"):
        b.input(bad, "label", 1.0)
    b.input("exhaust_flow_kg_h", "label", 1.0)  # the glossary's name is fine


@pytest.mark.parametrize("name", demo.WORKBOOKS)
def test_printed_sheets_have_print_area_and_fit_to_width(name):
    wb = openpyxl.load_workbook(_committed(name))
    for title in PRINTED_SHEETS:
        ws = wb[title]
        assert ws.print_area, f"{title}: no print area"
        area = ws.print_area.split("!")[-1].replace("$", "")
        assert area.startswith("A1:")
        from openpyxl.utils.cell import range_boundaries

        _, _, max_col, max_row = range_boundaries(area)
        # every used cell, and the width a check text in the last column runs on into (a few columns)
        assert max_row == ws.max_row and ws.max_column <= max_col <= ws.max_column + 6, (
            "the print area covers every used cell")
        assert ws.sheet_properties.pageSetUpPr.fitToPage
        assert (ws.page_setup.fitToWidth, ws.page_setup.fitToHeight) == (1, 0)


def test_page_setup_is_applied_to_any_book(tmp_path):
    """Whatever module builds a book, its Inputs and Results sheets get the page setup on save."""
    b = DemoBook("t", "p")
    b.input("x_kw", "label", 1.0, "kW")
    r = b.sheet("Results")
    r.calc("twice", "=2*x_kw", "kW")
    other = b.sheet("Calc")
    other.calc("thrice", "=3*x_kw", "kW")
    b.finish()
    b.save(tmp_path / "b.xlsx")
    wb = openpyxl.load_workbook(tmp_path / "b.xlsx")
    assert wb["Inputs"].print_area and wb["Results"].print_area
    assert not wb["Calc"].print_area  # calculation sheets print whole, charts included
    assert wb["Calc"].page_setup.fitToWidth == 1


@pytest.mark.parametrize("name", demo.WORKBOOKS)
def test_input_tables_sit_on_their_own_columns(name):
    """Named ranges on Inputs (gas analyses) lie right of the note column, in columns wide enough."""
    from openpyxl.utils.cell import range_boundaries

    wb = openpyxl.load_workbook(_committed(name))
    ws = wb["Inputs"]
    note_col = 4
    for n, dn in wb.defined_names.items():
        sheet, ref = next(iter(dn.destinations))
        if sheet != "Inputs" or ":" not in ref:
            continue
        c0, r0, c1, r1 = range_boundaries(ref.replace("$", ""))
        assert c0 > note_col + 1, f"{n} sits under the input/note columns"
        width = ws.column_dimensions[openpyxl.utils.get_column_letter(c0)].width
        longest = max(len(str(ws.cell(r, c0).value or "")) for r in range(r0, r1 + 1))
        assert width >= longest, n


@pytest.mark.parametrize("name", OWN)
def test_no_legacy_array_formulas(name):
    from openpyxl.worksheet.formula import ArrayFormula

    wb = openpyxl.load_workbook(_committed(name))
    arrays = [f"{ws.title}!{c.coordinate}" for ws in wb.worksheets for row in ws.iter_rows() for c in row
              if isinstance(c.value, ArrayFormula)]
    assert arrays == []


def test_hx_rate_per_cell_results():
    wb = openpyxl.load_workbook(_committed("hx_sizing"))
    words = re.findall(r'HX_RATE\([^)]*,"(\w+)"\)',
                       " ".join(str(c.value) for row in wb["Calc"].iter_rows() for c in row if c.value))
    assert {"duty", "t_hot_out", "t_cold_out"} <= set(words) and "all" not in words


@pytest.mark.parametrize("name", OWN)
def test_air_ratio_is_the_name_of_lambda(name):
    wb = openpyxl.load_workbook(_committed(name))
    assert not [n for n in wb.defined_names if "lambda" in n.lower()]
    formulas = " ".join(str(c.value) for ws in wb.worksheets for row in ws.iter_rows() for c in row
                        if isinstance(c.value, str) and c.value.startswith("="))
    assert "lambda" not in formulas.lower()


def test_knock_ambient_chart_plots_intake_against_dew_point():
    """No empty series; one chart holds the intake temperature and the dew points (all in °C)."""
    path = _committed("knock_whatif")
    wb = openpyxl.load_workbook(path)
    values = openpyxl.load_workbook(path, data_only=True)
    ws = wb["Ambient grid"]
    titles = {}
    for chart in ws._charts:
        names = []
        for s in chart.series:
            ref = s.yVal.numRef.f.split("!")[-1].replace("$", "")
            cells = [c.value for row in values["Ambient grid"][ref] for c in row]
            assert cells and all(isinstance(v, (int, float)) for v in cells), f"empty series {ref}"
            head = s.tx.strRef.f.split("!")[-1].replace("$", "")
            names.append(values["Ambient grid"][head].value)
        titles[chart.title.tx.rich.p[0].r[0].t if chart.title else ""] = names
    dew = next(v for k, v in titles.items() if "dew point" in k.lower())
    assert dew[0].startswith("intake") and all(n.startswith("dew point") for n in dew[1:]) and len(dew) == 4


def test_gas_units_spell_kind_and_reference_conditions():
    """Unit cells say which calorific value and reference conditions a figure is on (issue 10)."""
    values = openpyxl.load_workbook(_committed("gas_quality"), data_only=True)
    kind, ref = None, None
    wb = openpyxl.load_workbook(_committed("gas_quality"))
    for n in ("kind", "ref_conditions", "fuel_ref_conditions"):
        sheet, cell = next(iter(wb.defined_names[n].destinations))
        if n == "kind":
            kind = values[sheet][cell.replace("$", "")].value
        elif n == "ref_conditions":
            ref = values[sheet][cell.replace("$", "")].value
        else:
            fuel_ref = values[sheet][cell.replace("$", "")].value
    units = {row[0].value: row[5].value for row in values["Properties"].iter_rows(min_col=1, max_col=6)}
    assert units["Calorific value (kind chosen), volume"] == f"MJ/m³ ({kind}, {ref})"
    assert units["Wobbe index (gross)"] == f"MJ/m³ (gross, {ref})"
    assert units["Fuel flow for the engine's fuel power"] == f"m³/h (net, {fuel_ref})"
