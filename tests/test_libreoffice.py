"""The Calc extension in a real LibreOffice, headless (issue 13).

One module-scoped run builds the extension with ``cellfuncs calc-extension``, installs it
with ``unopkg add`` into a throwaway profile and drives ONE soffice process through
tests/lo_driver.py (run by LibreOffice's own Python, which has ``uno``):

* a workbook made in Calc with every catalogue function's example (ranges written to
  cells) — each value is compared with ``cellfuncs.adapt.call`` (the same code the Excel
  and headless adapters use) to 1e-9 relative; that workbook is saved as .xlsx and
  recalculated headless (Calc -> headless);
* each demo workbook in workbooks_demo/ (made and recalculated headless) opened with
  the extension and recalculated — every formula cell compared with ``cellfuncs recalc``
  (headless -> Calc).

A second soffice with a bare profile (no extension) opens each demo as a recipient would
and prints its Results sheet to PDF (then PNG and text with poppler's pdftoppm and
pdftotext): no error value where the file holds a number, no error text on the page.

The expected values are those of our own headless engine: these tests check that the
Calc adapter gives the same numbers, not the physics (that is checked against outside
sources in the family tests).  Skipped, with the reason, where LibreOffice or its Python
bridge is missing.  CI installs them (.ci/run).
"""

from __future__ import annotations

import json
import math
import os
import shutil
import re
import subprocess
import sys
import zipfile
from pathlib import Path

import pytest

from cellfuncs import catalogue
from cellfuncs.adapt import call as adapt_call

ROOT = Path(__file__).resolve().parent.parent
DEMOS = sorted((ROOT / "workbooks_demo").glob("*.xlsx"))
DRIVER = Path(__file__).resolve().parent / "lo_driver.py"
#: Calc's error numbers -> the Excel error values (Calc shows these texts)
CALC_ERRORS = {503: "#NUM!", 519: "#VALUE!", 521: "#NULL!", 524: "#REF!", 525: "#NAME?",
               532: "#DIV/0!", 32767: "#N/A"}
ERROR_WORDS = ("#NAME?", "#VALUE!", "#NUM!", "#REF!", "#DIV/0!", "#N/A", "#NULL!", "Err:")
DATA_COLUMN = 26  # column AA: where the examples' ranges are written
#: demos that fail the no-add-in checks on this branch, with what is pending elsewhere (the
#: demo owners' per-cell forms, issue 13 item 3; the interface issue's renamed defined names)
XFAIL_NO_ADDIN = {
    "hx_sizing.xlsx": "pending (issue 13 item 3, demo owner): the legacy array formula "
                      "HX_RATE(...,\"all\") in Calc!B17:D17 is recomputed by LibreOffice on load "
                      "and shows #NAME? without the add-in; use HX_RATE's per-cell results",
    "tender_chp.xlsx": "pending (issue 13 item 3, demo owner): legacy array formulas HW_CHAIN "
                       "and HW_CHAIN_RATE (Chosen order!B13:E13, Another order!B13:E13, Rated "
                       "order!B15:C20) show #NAME? without the add-in; and (interface issue) the "
                       "defined name exh_flow equals the function EXH_FLOW: Err:509 in Exhaust!B3",
}


def _lo_python():
    for exe in (os.environ.get("CELLFUNCS_LO_PYTHON"), "/usr/bin/python3", shutil.which("python3")):
        if not exe or not os.path.exists(exe):
            continue
        try:
            out = subprocess.run([exe, "-c", "import uno, sys; print('%d.%d' % sys.version_info[:2])"],
                                 capture_output=True, text=True, timeout=60)
        except (OSError, subprocess.TimeoutExpired):
            continue
        if out.returncode == 0:
            return exe, out.stdout.strip()
    return None, None


def _skip_reason():
    if not shutil.which("soffice") or not shutil.which("unopkg"):
        return ("LibreOffice is not installed (no soffice/unopkg on PATH; Debian: apt-get install "
                "libreoffice-calc-nogui python3-uno, as .ci/run does)")
    exe, version = _lo_python()
    if exe is None:
        return ("LibreOffice's Python bridge is missing (no Python with `import uno`; Debian: "
                "apt-get install python3-uno, or set CELLFUNCS_LO_PYTHON)")
    here = "%d.%d" % sys.version_info[:2]
    if version != here:
        return (f"LibreOffice's Python is {version}, these tests run under {here}: the extension "
                "only loads cellfuncs from the same minor version (docs/libreoffice.md)")
    return None


pytestmark = pytest.mark.skipif(_skip_reason() is not None, reason=_skip_reason() or "")


# ---------------------------------------------------------------------------------------
# helpers
def _col(n: int) -> str:
    s = ""
    n += 1
    while n:
        n, r = divmod(n - 1, 26)
        s = chr(65 + r) + s
    return s


def _literal(v) -> str:
    if v is None:
        return ""
    if isinstance(v, str):
        return '"' + v.replace('"', '""') + '"'
    return repr(float(v))


def _is_range(v) -> bool:
    return isinstance(v, (list, tuple))


def _variants(entry):
    """The catalogue example, and two bad inputs: its first number as text, and as -1e9."""
    example = tuple(entry.example)
    yield example
    for i, arg in enumerate(entry.args[:len(example)]):
        if arg.kind == "number" and not _is_range(example[i]):
            for bad in ("x", -1e9):
                yield example[:i] + (bad,) + example[i + 1:]
            return


def _expected(entry, values):
    """What the shared adapter code gives: cells, or the Excel error value of the error."""
    from cellfuncs.errors import CellInputError

    try:
        return adapt_call(entry, values)
    except CellInputError as exc:
        return exc.excel_error


def example_sheet():
    """Cells and formulas of a sheet holding every catalogue example (and two bad inputs per
    function), and the values the adapters' shared code gives for them."""
    values, cells, expected = [], [], {}
    row = 0
    for entry in catalogue.entries():
        if not entry.example and entry.args:
            continue
        for example in _variants(entry):
            want = _expected(entry, example)
            args, data_col, height = [], DATA_COLUMN, 1
            for v in example:
                if _is_range(v):
                    rows = [list(r) if _is_range(r) else [r] for r in v]
                    width = max(len(r) for r in rows)
                    for i, r in enumerate(rows):
                        for j, c in enumerate(r):
                            if c is not None:
                                values.append([f"{_col(data_col + j)}{row + i + 1}", c])
                    args.append(f"{_col(data_col)}{row + 1}:"
                                f"{_col(data_col + width - 1)}{row + len(rows)}")
                    data_col += width + 1
                    height = max(height, len(rows))
                else:
                    args.append(_literal(v))
            shape = (len(want), len(want[0])) if isinstance(want, list) else (1, 1)
            formula = f"={entry.name}(" + ";".join(args) + ")"
            cells.append([f"A{row + 1}", formula, shape[0], shape[1]])
            grid = want if isinstance(want, list) else [[want]]
            for i, r in enumerate(grid):
                for j, c in enumerate(r):
                    expected[f"Sheet1!{_col(j)}{row + i + 1}"] = (entry.name, c)
            row += max(height, shape[0]) + 1
    return values, cells, expected


def _unopkg_add(oxt: Path, profile: Path):
    """``unopkg add`` into a fresh profile, after a first start has set the profile up.

    unopkg refuses to run as root without --shared, so as root both run as nobody.  (An
    extension added to a profile no soffice had started yet was dropped at the first start.)
    """
    profile.mkdir()
    prefix = []
    if hasattr(os, "geteuid") and os.geteuid() == 0:
        if not shutil.which("setpriv"):
            pytest.skip("running as root and no setpriv to run unopkg as an ordinary user")
        os.chown(profile, 65534, 65534)
        os.chmod(oxt, 0o644)
        prefix = ["setpriv", "--reuid=65534", "--regid=65534", "--clear-groups"]
    env = dict(os.environ, HOME=str(profile))
    user = f"-env:UserInstallation=file://{profile}"
    subprocess.run(prefix + ["soffice", "--headless", "--norestore", "--nologo", user,
                             "--terminate_after_init"], capture_output=True, env=env, timeout=180)
    out = subprocess.run(prefix + ["unopkg", "add", user, str(oxt)], capture_output=True, text=True,
                         env=env, timeout=180)
    assert out.returncode == 0, f"unopkg add failed: {out.stdout} {out.stderr}"


def _drive(profile: Path, tasks: list, work: Path, name: str) -> list:
    exe, _ = _lo_python()
    job, result = work / f"{name}_job.json", work / f"{name}_result.json"
    job.write_text(json.dumps({"profile": str(profile), "tasks": tasks}))
    out = subprocess.run([exe, str(DRIVER), str(job), str(result)], capture_output=True,
                         text=True, timeout=600)
    assert out.returncode == 0, f"LibreOffice driver failed: {out.stderr[-2000:]}"
    results = json.loads(result.read_text())
    for task, res in zip(tasks, results):
        assert res["ok"], f"{task.get('path', task['kind'])}: {res.get('error')}"
    return [{c["ref"]: c for c in res["cells"]} for res in results]


def _headless(path: Path) -> dict:
    from cellfuncs import headless

    res, _ = headless.recalc(str(path))
    return {f"{s}!{r}": v for (s, r), v in res.values.items()}


def _same(lo: dict, want) -> str | None:
    """None when Calc's cell equals ``want`` (a headless/adapt value), else why not."""
    from cellfuncs.headless.package import ErrorText

    if isinstance(want, ErrorText) or (isinstance(want, str) and want in CALC_ERRORS.values()):
        # what Calc shows in the cell (its own text for the error number)
        got = lo["text"] if lo["error"] else lo["value"]
        return None if got == str(want) else f"{got!r} != {str(want)!r}"
    if lo["error"]:
        return f"Calc shows {CALC_ERRORS.get(lo['error'], 'Err:%d' % lo['error'])}, expected {want!r}"
    got = lo["value"]
    if isinstance(want, bool):
        want = float(want)
    if isinstance(want, float):
        if not isinstance(got, float):
            return f"{got!r} != {want!r}"
        if not math.isclose(got, want, rel_tol=1e-9, abs_tol=1e-300 if want else 1e-12):
            return f"{got!r} != {want!r} (rel. {abs(got - want) / max(abs(want), 1e-300):.2e})"
        return None
    want = "" if want is None else want
    return None if got == want else f"{got!r} != {want!r}"


# ---------------------------------------------------------------------------------------
@pytest.fixture(scope="module")
def lo():
    """Everything LibreOffice computes for these tests, in two soffice runs."""
    import tempfile

    # not under pytest's private tmp folder: unopkg may have to run as another user
    work = Path(tempfile.mkdtemp(prefix="cellfuncs-lo-"))
    os.chmod(work, 0o755)
    try:
        yield _lo_runs(work)
    finally:
        shutil.rmtree(work, ignore_errors=True)


def _lo_runs(work: Path) -> dict:
    oxt = work / "cellfuncs.oxt"
    out = subprocess.run([sys.executable, "-m", "cellfuncs.cli", "calc-extension", "-o", str(oxt)],
                         capture_output=True, text=True, timeout=300)
    assert out.returncode == 0, out.stderr
    _unopkg_add(oxt, work / "profile_addin")

    books = work / "books"
    books.mkdir()
    copies = []
    for src in DEMOS:  # copies: LibreOffice leaves lock files beside what it opens
        shutil.copy(src, books / src.name)
        copies.append(books / src.name)

    values, cells, expected = example_sheet()
    calc_made = work / "calc_made.xlsx"
    tasks = [{"kind": "cells", "values": values, "cells": cells, "save": str(calc_made)}]
    tasks += [{"kind": "open", "path": str(p), "recalc": True} for p in copies]
    tasks.append({"kind": "describe", "names": [e.name for e in catalogue.entries()]})
    tasks.append({"kind": "open", "path": str(calc_made), "recalc": True})
    tasks.append({"kind": "cells", "values": OMITTED_VALUES, "cells": [[r, f, 1, 1] for r, f in OMITTED_CELLS],
                  "save": None})
    got = _drive(work / "profile_addin", tasks, work, "addin")

    # an extension that says it was built by another Python (3.0): each function shows the text
    other = work / "other_python.oxt"
    with zipfile.ZipFile(oxt) as src, zipfile.ZipFile(other, "w") as dst:
        for name in src.namelist():
            data = src.read(name)
            if name.endswith(".py"):
                data = re.sub(rb"'python': \[\d+, \d+, \d+\]", b"'python': [3, 0, 0]", data)
            dst.writestr(name, data)
    _unopkg_add(other, work / "profile_other")
    mismatch = _drive(work / "profile_other", [{"kind": "cells", "cells": [
        ["A1", "=HX_LMTD(100;60;30;40.2)", 1, 1], ["B1", "=GAS_COMPONENTS()", 2, 1]]}], work, "other")

    bare = work / "profile_bare"
    bare.mkdir()
    pdfs = [work / (p.stem + "_results.pdf") for p in copies]
    tasks = [{"kind": "open", "path": str(p), "recalc": False,
              "pdf": {"sheet": "Results", "path": str(pdf)}} for p, pdf in zip(copies, pdfs)]
    plain = _drive(bare, tasks, work, "bare")
    return {"examples": got[0], "expected": expected, "calc_made": calc_made,
            "demos": dict(zip((p.name for p in DEMOS), got[1:-3])), "wizard": got[-3],
            "calc_made_in_calc": got[-2], "omitted": got[-1], "other_python": mismatch[0],
            "plain": dict(zip((p.name for p in DEMOS), plain)),
            "pdfs": dict(zip((p.name for p in DEMOS), pdfs)), "work": work}


#: an argument left out, empty text and an empty cell in Calc (a gas in A1:B5, C20 left empty)
_GAS = (("methane", 92.0), ("ethane", 4.5), ("propane", 1.0), ("nitrogen", 1.5), ("carbon dioxide", 1.0))
OMITTED_VALUES = [[f"{c}{i}", v[j]] for i, v in enumerate(_GAS, start=1) for j, c in enumerate("AB")]
_EXH = 'EXH_FLOW(3650;1.85;A1:A5;B1:B5;"net";{};0.6;1)'
OMITTED_CELLS = [("D1", "=HX_LMTD(100;60;30;40.2;)"), ("D2", "=HX_LMTD(100;60;30;40.2)"),
                 ("D3", "=" + _EXH.format("")), ("D4", "=" + _EXH.format("25")),
                 ("D5", "=" + _EXH.format('""')), ("D6", "=" + _EXH.format('IF(FALSE();1;"")')),
                 ("D7", "=" + _EXH.format("C20")), ("D8", "=" + _EXH.format("0"))]


def test_an_argument_left_out_in_calc_takes_its_default(lo):
    """Calc hands an argument left out (in the middle or at the end) over as void (None): the
    catalogue default applies, as in Excel (EXH_FLOW t_ambient = 25 °C, catalogue); empty text
    is #VALUE! as in Excel and headless; a reference to an empty cell arrives as 0, which for a
    number argument is the number 0 (docs/libreoffice.md, "Difference to Excel")."""
    cells = {ref.split("!")[1]: c for ref, c in lo["omitted"].items()}
    default = catalogue.by_name("EXH_FLOW").args[5].default
    assert default == 25.0
    assert not cells["D1"]["error"] and cells["D1"]["value"] == cells["D2"]["value"]
    assert not cells["D3"]["error"] and cells["D3"]["value"] == cells["D4"]["value"]
    assert CALC_ERRORS.get(cells["D5"]["error"]) == "#VALUE!"
    assert CALC_ERRORS.get(cells["D6"]["error"]) == "#VALUE!"
    assert not cells["D7"]["error"] and cells["D7"]["value"] == cells["D8"]["value"] != cells["D4"]["value"]


def test_every_catalogue_example_computes_in_calc_as_headless(lo):
    """Reference: cellfuncs.adapt.call on the catalogue example (the adapters' shared code)."""
    cells, expected = lo["examples"], lo["expected"]
    with_example = {e.name for e in catalogue.entries() if e.example or not e.args}
    assert {name for name, _ in expected.values()} == with_example
    bad = []
    for ref, (name, want) in expected.items():
        why = _same(cells[ref], want) if ref in cells else "no formula cell"
        if why:
            bad.append(f"{ref} {name}: {why}")
    assert not bad, "\n".join(bad[:20])


def test_function_wizard_shows_catalogue_text(lo):
    """Calc's function wizard lists every function with the catalogue's description and help."""
    from cellfuncs.calc.build import functions_table

    table = functions_table()
    wizard = lo["wizard"]
    assert sorted(wizard) == sorted(table)
    for name, info in table.items():
        shown = wizard[name]
        assert shown["description"] == info["description"], name
        assert [a[:2] for a in shown["args"]] == info["args"], name
        assert entry_description_starts(name, shown["description"])


def entry_description_starts(name, text):
    return text.startswith(catalogue.by_name(name).description)


def test_every_catalogue_function_computes_in_calc(lo):
    """Each function is computed in Calc at least once: in the examples or in a demo."""
    import re

    seen = {name for name, _ in lo["expected"].values()}
    for cells in lo["demos"].values():
        for cell in cells.values():
            seen.update(n.upper() for n in re.findall(r"CELLFUNCTIONS\.(\w+)\(", cell["formula"]))
    missing = sorted({e.name for e in catalogue.entries()} - seen)
    assert not missing, f"never computed in Calc (give them a catalogue example): {missing}"


def test_workbook_saved_by_calc_reopens_in_calc(lo):
    """Calc -> .xlsx -> Calc: the names Calc wrote link again and compute the same values."""
    again, cells = lo["calc_made_in_calc"], lo["examples"]
    bad = [f"{ref}: {why}" for ref, cell in cells.items()
           if (why := _same(again.get(ref, {"error": 0, "value": "missing"}),
                            cell["text"] if cell["error"] else cell["value"]))]
    assert not bad, "\n".join(bad[:20])


def test_extension_built_by_another_python_says_what_to_do(lo):
    """Every function shows one text naming both versions and the command to run."""
    cells = lo["other_python"]
    here = "%d.%d" % sys.version_info[:2]
    for ref in ("Sheet1!A1", "Sheet1!B1"):
        text = cells[ref]["value"]
        assert text.startswith(f"#VALUE! cellfuncs: LibreOffice runs Python {here} but this "
                               "extension was built with Python 3.0"), text
        assert "cellfuncs calc-extension" in text and "unopkg add" in text


def test_workbook_made_in_calc_recalculates_headless(lo):
    """Calc -> headless: the .xlsx Calc saved, recalculated by `cellfuncs recalc`'s engine."""
    headless = _headless(lo["calc_made"])
    cells = lo["examples"]
    assert set(cells) <= set(headless), sorted(set(cells) - set(headless))[:10]
    bad = [f"{ref}: {why}" for ref, cell in cells.items() if (why := _same(cell, headless[ref]))]
    assert not bad, "\n".join(bad[:20])


@pytest.mark.parametrize("book", [p.name for p in DEMOS])
def test_demo_recomputes_in_calc_as_headless(lo, book):
    """headless -> Calc: every formula cell of the demo, recalculated in Calc with the add-in."""
    headless = _headless(ROOT / "workbooks_demo" / book)
    cells = lo["demos"][book]
    assert cells, "no formula cells read"
    missing = sorted(set(headless) - set(cells))
    assert not missing, f"formula cells Calc does not see: {missing[:10]}"
    bad = [f"{ref} {cells[ref]['formula']}: {why}" for ref in headless
           if (why := _same(cells[ref], headless[ref]))]
    assert not bad, "\n".join(bad[:20])


def _no_addin_failures(lo, book):
    import openpyxl

    wb = openpyxl.load_workbook(ROOT / "workbooks_demo" / book, data_only=True)
    bad = []
    for ref, cell in lo["plain"][book].items():
        sheet, addr = ref.rsplit("!", 1)
        held = wb[sheet][addr].value
        if isinstance(held, (int, float)) and not isinstance(held, bool) and cell["error"]:
            bad.append(f"{ref} {cell['formula']}: file holds {held}, Calc shows "
                       f"{CALC_ERRORS.get(cell['error'], cell['error'])}")
    return bad


@pytest.mark.parametrize("book", [p.name for p in DEMOS])
def test_demo_without_addin_shows_the_numbers(lo, book, request):
    """A recipient without the extension: no error value where the file holds a number."""
    bad = _no_addin_failures(lo, book)
    if bad and book in XFAIL_NO_ADDIN:
        request.applymarker(pytest.mark.xfail(reason=XFAIL_NO_ADDIN[book], strict=False))
    assert not bad, "\n".join(bad[:20])


@pytest.mark.parametrize("book", [p.name for p in DEMOS])
def test_results_sheet_renders_without_error_text(lo, book, request):
    """The Results sheet as printed by LibreOffice without the extension (PDF -> PNG, text)."""
    if not (shutil.which("pdftotext") and shutil.which("pdftoppm")):
        pytest.skip("poppler-utils (pdftotext, pdftoppm) not installed")
    pdf = lo["pdfs"][book]
    assert pdf.exists() and pdf.stat().st_size > 0
    png = pdf.with_suffix("")
    subprocess.run(["pdftoppm", "-png", "-r", "60", "-f", "1", "-l", "1", "-singlefile", str(pdf),
                    str(png)], check=True, timeout=120)
    assert png.with_suffix(".png").stat().st_size > 1000
    text = subprocess.run(["pdftotext", "-layout", str(pdf), "-"], capture_output=True, text=True,
                          check=True, timeout=120).stdout
    assert "Results" in text or text.strip(), "empty page"
    found = [w for w in ERROR_WORDS if w in text]
    if found and book in XFAIL_NO_ADDIN:
        request.applymarker(pytest.mark.xfail(reason=XFAIL_NO_ADDIN[book], strict=False))
    assert not found, f"error text on the printed Results sheet: {found}"

