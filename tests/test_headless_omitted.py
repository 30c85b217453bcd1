"""Every catalogue function with each optional argument omitted, through `cellfuncs recalc`.

An omitted argument (``F(1,,3)`` or a trailing omission ``F(1,2)``) must give exactly what
the call with the argument's default spelled out gives, as it does in Excel, where a
missing argument reaches an add-in function as "missing" and the catalogue default applies
(the expected value is the catalogue's own documented default: the source of truth here
is the catalogue, cellfuncs/catalogue/*.py).  An argument whose default is "the core
decides" (None) is compared with a reference to a blank cell, which the catalogue
documents as the same thing.
"""

import json
import subprocess
import sys

import openpyxl
import pytest

from cellfuncs import catalogue

GAS = [("methane", 92.0, 0.05), ("ethane", 4.5, 0.02), ("propane", 1.0, 0.01), ("nitrogen", 1.5, 0.02),
       ("carbon dioxide", 1.0, 0.01)]
NAMES, AMOUNTS, U_AMOUNTS = "Data!$A$1:$A$5", "Data!$B$1:$B$5", "Data!$C$1:$C$5"
ROW4 = "Data!$E$1:$H$1"      # 190, 560, 245, 890 kW (four stage duties)
HOT4 = "Data!$E$2:$H$2"      # 120, 95, 90, 470 °C (hot-side temperatures)
C4 = "Data!$E$3:$H$3"        # 8, 12, 10, 2 kW/K
UA4 = "Data!$E$4:$H$4"       # 20, 30, 25, 5 kW/K
BLANK = "Data!$Z$100"

#: required arguments of the functions whose catalogue entry gives no example (invented, valid values)
EXAMPLES = {
    "HW_CP": (70.0,),
    "HW_DENSITY": (70.0,),
    "HW_FLOW": (500.0, 60.0, 90.0),
    "HW_DUTY": (15.0, 60.0, 90.0),
    "HW_CHAIN": (60.0, 55.0, ROW4),
    "HW_CHAIN_RATE": (60.0, 55.0, HOT4, C4, UA4),
    "HW_CHAIN_CHECK": (60.0, 55.0, ROW4, HOT4),
    "EXH_FLOW": (3650.0, 1.85, NAMES, AMOUNTS),
    "EXH_COMPOSITION": (1.85, NAMES, AMOUNTS, "o2"),
    "EXH_HEAT": (5000.0, 450.0, 120.0, 1.85, NAMES, AMOUNTS),
    "EXH_DEWPOINT": (1.85, NAMES, AMOUNTS),
    "EXH_O2_CORRECT": (150.0, 9.0, 5.0),
    "GEN_SPEED": (50.0, 2),
    "GEN_POLE_PAIRS": (50.0, 1500.0),
    "ENGINE_BMEP": (1000.0, 48.0, 1500.0),
    "ENGINE_POWER": (18.0, 48.0, 1500.0),
    "CHP_HEAT_RATE": (0.42,),
    "CHP_PES": (0.42, 0.45, 0.53, 0.9),
    "CHP_BALANCE": (2400.0, 1000.0, ROW4),
}


def _text(v):
    """A Python example value -> formula text."""
    if isinstance(v, str) and (v.startswith("Data!") or v == BLANK):
        return v
    if isinstance(v, str):
        return '"' + v.replace('"', '""') + '"'
    if isinstance(v, bool):
        return "TRUE" if v else "FALSE"
    if isinstance(v, (int, float)):
        return repr(float(v)) if isinstance(v, float) else str(v)
    if v is None:
        return BLANK
    if isinstance(v, list):  # a block of the catalogue examples: the gas of sheet Data
        flat = [c for row in v for c in row]
        if len(v[0]) == 2:
            return "Data!$J$1:$K$6"
        if all(isinstance(c, str) for c in flat):
            return NAMES
        if flat == [g[2] for g in GAS]:
            return U_AMOUNTS
        return AMOUNTS
    raise TypeError(v)


def _spelled(arg):
    """The default of an optional argument written out (a blank cell when the core decides)."""
    d = arg.default
    if d is None:
        return BLANK
    return _text(d)


def _calls():
    """[(label, formula with an omission, formula with the default spelled out)]."""
    out = []
    for e in catalogue.entries():
        example = list(e.example) if e.example else list(EXAMPLES.get(e.name, ()))
        required = [a for a in e.args if not a.optional]
        if len(example) < len(required):
            pytest.fail(f"{e.name}: no example call; add its required arguments to EXAMPLES")
        base = [_text(v) for v in example] + [_spelled(a) for a in e.args[len(example):]]
        for k, arg in enumerate(e.args):
            if not arg.optional:
                continue
            b = base
            if arg.kind == "amounts" and k > 0 and e.args[k - 1].kind == "gas":
                # amounts left out: the gas analysis is then the two-column range (names, amounts)
                b = base[:k - 1] + ["Data!$J$1:$K$6"] + base[k:]
            spelled = b[:k] + [_spelled(arg)] + b[k + 1:]
            middle = b[:k] + [""] + b[k + 1:]
            out.append((f"{e.name}: {arg.name} as ,,", f"={e.name}({','.join(middle)})",
                        f"={e.name}({','.join(spelled)})"))
            trailing_spelled = b[:k] + [_spelled(a) for a in e.args[k:]]
            out.append((f"{e.name}: {arg.name} and after left out", f"={e.name}({','.join(b[:k])})",
                        f"={e.name}({','.join(trailing_spelled)})"))
    return out


def _book(path, calls):
    wb = openpyxl.Workbook()
    data = wb.active
    data.title = "Data"
    for r, (n, a, u) in enumerate(GAS, start=1):
        data.cell(r, 1, n)
        data.cell(r, 2, a)
        data.cell(r, 3, u)
    for r, row in enumerate([(190, 560, 245, 890), (120, 95, 90, 470), (8, 12, 10, 2), (20, 30, 25, 5)], 1):
        for c, v in enumerate(row, start=5):
            data.cell(r, c, v)
    for r, (n, a) in enumerate([("methane", 90.0), ("ethane", 6.0), ("propane", 2.0), ("n-butane", 0.5),
                                ("isobutane", 0.5), ("nitrogen", 1.0)], start=1):
        data.cell(r, 10, n)
        data.cell(r, 11, a)
    calc = wb.create_sheet("Calc")
    for i, (_, omitted, spelled) in enumerate(calls):
        # INDEX(...,1,1): the first value of a function that returns several (no spilling)
        calc.cell(i + 1, 1, f"=INDEX({omitted[1:]},1,1)")
        calc.cell(i + 1, 2, f"=INDEX({spelled[1:]},1,1)")
    wb.save(path)


def test_every_optional_argument_omitted_equals_its_default(tmp_path):
    calls = _calls()
    assert len(calls) > 100
    path = tmp_path / "omitted.xlsx"
    _book(path, calls)
    p = subprocess.run([sys.executable, "-m", "cellfuncs.cli", "recalc", str(path), "-o",
                        str(tmp_path / "out.xlsx"), "--json"], capture_output=True, text=True, timeout=600)
    assert p.returncode == 0, p.stderr[-2000:]
    got = json.loads(p.stdout)
    wrong = []
    for i, (label, omitted, spelled) in enumerate(calls, start=1):
        a, b = got[f"Calc!A{i}"], got[f"Calc!B{i}"]
        if a != b:
            wrong.append(f"{label}: {omitted} -> {a!r}, {spelled} -> {b!r}")
    assert not wrong, "\n".join(wrong[:20])
    # the calls compute (not all errors): most give a number
    numbers = sum(isinstance(got[f"Calc!B{i}"], float) for i in range(1, len(calls) + 1))
    assert numbers > 0.8 * len(calls)


def test_the_issue_formulas(tmp_path):
    """The four formulas of the issue: each omission now takes the default, as in Excel."""
    wb = openpyxl.Workbook()
    ws = wb.active
    ws.title = "S"
    for r, (n, a, _) in enumerate(GAS, start=2):
        ws.cell(r, 1, n)
        ws.cell(r, 2, a)
    ws["D1"] = '=EXH_FLOW(3650,1.85,A2:A6,B2:B6,"net",,0.6,1)'
    ws["D2"] = '=EXH_FLOW(3650,1.85,A2:A6,B2:B6,"net",25,0.6,1)'   # t_ambient default 25 °C (catalogue)
    ws["D3"] = '=GAS_CV(A2:B6,,"gross","volume","15/15")'             # a two-column gas, fractions left out
    ws["D4"] = '=GAS_CV(A2:A6,B2:B6,"gross","volume","15/15")'
    ws["D5"] = "=HX_LMTD(90,,60,80)"                                  # a required argument left out
    ws["D6"] = "=TURBO_T_OUT(25,1,3,0.78,1.8,A2:A6,B2:B6,,0.3)"
    ws["D7"] = "=TURBO_T_OUT(25,1,3,0.78,1.8,A2:A6,B2:B6,25,0.3)"
    path = tmp_path / "issue.xlsx"
    wb.save(path)
    p = subprocess.run([sys.executable, "-m", "cellfuncs.cli", "recalc", str(path), "-o",
                        str(tmp_path / "out.xlsx"), "--json"], capture_output=True, text=True, timeout=600)
    assert p.returncode == 0, p.stderr
    got = json.loads(p.stdout)
    assert isinstance(got["S!D1"], float) and got["S!D1"] == got["S!D2"]
    assert isinstance(got["S!D3"], float) and got["S!D3"] == got["S!D4"]
    assert got["S!D5"] == "#VALUE!"
    assert "S!D5: #VALUE!" in p.stderr and "required" in p.stderr and "0 °C" not in p.stderr
    assert isinstance(got["S!D6"], float) and got["S!D6"] == got["S!D7"]
