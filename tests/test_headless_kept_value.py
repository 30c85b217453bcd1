"""A cell the engine cannot compute keeps its cached value; the cells using it compute from it.

docs/headless.md ("What is computed and what is kept"): such a cell keeps the value the file
held and "cells that use it compute from the kept value" — even when they hold a cached value
of their own (which may be stale).  Expected values follow that rule by hand: 42 × 2 = 84.
"""

import json
import re
import subprocess
import sys
import zipfile

import openpyxl


def _run(*args):
    return subprocess.run([sys.executable, "-m", "cellfuncs.cli", *args], capture_output=True,
                          text=True, timeout=300)


def _cache(path, values):
    """Write cached values beside the formulas of sheet 1 (as a spreadsheet program saves them)."""
    with zipfile.ZipFile(path) as z:
        parts = {n: z.read(n) for n in z.namelist()}
    xml = parts["xl/worksheets/sheet1.xml"].decode()
    for ref, v in values.items():
        xml = re.sub(rf'(<c r="{ref}"[^>]*>)(<f>.*?</f>)(<v\s*/>|<v>.*?</v>)?', rf"\g<1>\g<2><v>{v}</v>",
                     xml, flags=re.S)
    parts["xl/worksheets/sheet1.xml"] = xml.encode()
    with zipfile.ZipFile(path, "w") as z:
        for n, d in parts.items():
            z.writestr(n, d)


def test_dependents_with_cached_values_compute_from_the_kept_value(tmp_path):
    wb = openpyxl.Workbook()
    ws = wb.active
    ws["A1"] = 1
    ws["B1"] = '=WEBSERVICE("http://x")'
    ws["B2"] = "=B1*2"
    ws["B3"] = "=B2+A1"
    path, out = tmp_path / "kept.xlsx", tmp_path / "out.xlsx"
    wb.save(path)
    _cache(path, {"B1": 42, "B2": 999, "B3": 1000})
    p = _run("recalc", str(path), "-o", str(out), "--json")
    assert p.returncode == 3, p.stderr
    got = json.loads(p.stdout)
    assert got["Sheet!B1"] == 42 and got["Sheet!B2"] == 84 and got["Sheet!B3"] == 85
    gaps = [ln for ln in p.stderr.splitlines() if "not computed" in ln and ln.startswith("Sheet!")]
    assert len(gaps) == 1 and gaps[0].startswith("Sheet!B1: not computed: "), p.stderr
    assert openpyxl.load_workbook(out, data_only=True)["Sheet"]["B2"].value == 84
    # an input of the kept cell changed: nothing is computed from its stale value
    ws["B1"] = '=WEBSERVICE("http://x"&A1)'
    wb.save(path)
    _cache(path, {"B1": 42, "B2": 999, "B3": 1000})
    p = _run("recalc", str(path), "-o", str(out), "--json", "--set", "Sheet!A1=2")
    got = json.loads(p.stdout)
    assert got["Sheet!B1"] == "#N/A" and got["Sheet!B2"] == "#N/A" and got["Sheet!B3"] == "#N/A"
