"""Empty text where a number belongs is an error; an omitted argument or a blank cell is the default.

In Excel an omitted argument and an empty cell reach an add-in function as "missing"
(xlwings hands both over as ``None``), and the catalogue default applies; empty text ``""``
(an ``IF(..., "")``, a failed lookup) is a value of its own, and a number argument given
text is an error.  Expected defaults are the catalogue's documented ones
(cellfuncs/catalogue/recovery.py: EXH_FLOW t_ambient = 25 °C, ISO 3046-1 standard reference
conditions; cellfuncs/catalogue/hx.py: HX_LMTD arrangement = counter).  The LMTD value is
the definition worked by hand: Incropera & DeWitt, Fundamentals of Heat and Mass Transfer,
eq. 11.15 (counterflow, 11.17): ΔT1 = 100 - 40.2, ΔT2 = 60 - 30,
LMTD = (ΔT1 - ΔT2) / ln(ΔT1/ΔT2).
"""

import json
import math
import subprocess
import sys

import openpyxl
import pytest

from cellfuncs import catalogue
from cellfuncs.adapt import call
from cellfuncs.errors import CellInputError

NAMES = [["methane"], ["ethane"], ["propane"], ["nitrogen"], ["carbon dioxide"]]
AMOUNTS = [[92.0], [4.5], [1.0], [1.5], [1.0]]
EXH = catalogue.by_name("EXH_FLOW")
LMTD = (59.8 - 30.0) / math.log(59.8 / 30.0)   # Incropera & DeWitt eq. 11.15, by hand


@pytest.mark.parametrize("empty", ["", "  ", "\t"])
def test_empty_text_into_a_number_argument_is_an_error(empty):
    with pytest.raises(CellInputError) as exc:
        call(EXH, (3650.0, 1.85, NAMES, AMOUNTS, "net", empty))
    assert exc.value.excel_error == "#VALUE!"
    assert exc.value.message == ("t_ambient: empty text is not a number (leave the argument out, "
                                 "or leave the cell empty, for the default 25)")
    with pytest.raises(CellInputError, match=r"^fuel_power_kw: empty text is not a number"):
        call(EXH, (empty, 1.85, NAMES, AMOUNTS))


def test_empty_text_into_an_integer_argument_is_an_error():
    entry = catalogue.by_name("GEN_SPEED")
    arg = entry.args[1]
    assert arg.kind == "integer"
    with pytest.raises(CellInputError, match=rf"^{arg.name}: empty text is not a number"):
        call(entry, (50.0, ""))


def test_omitted_or_blank_is_the_default_and_empty_text_an_option_default():
    at_25 = call(EXH, (3650.0, 1.85, NAMES, AMOUNTS, "net", 25.0))
    assert call(EXH, (3650.0, 1.85, NAMES, AMOUNTS, "net", None)) == at_25
    assert call(EXH, (3650.0, 1.85, NAMES, AMOUNTS)) == at_25
    # "" for an option word: its default (net, as engine datasheets are)
    assert call(EXH, (3650.0, 1.85, NAMES, AMOUNTS, "", None)) == at_25
    assert call(EXH, (3650.0, 1.85, NAMES, AMOUNTS, "  ", None)) == at_25


def _run(*args):
    return subprocess.run([sys.executable, "-m", "cellfuncs.cli", *args], capture_output=True,
                          text=True, timeout=300)


def test_through_cellfuncs_recalc(tmp_path):
    wb = openpyxl.Workbook()
    ws = wb.active
    for r, ((name,), (amount,)) in enumerate(zip(NAMES, AMOUNTS), start=1):
        ws.cell(r, 1, name)
        ws.cell(r, 2, amount)
    gas = "A1:A5,B1:B5"
    ws["D1"] = "=HX_LMTD(100,60,30,40.2,)"                      # omitted at the end: counter
    ws["D2"] = "=HX_LMTD(100,60,30,40.2)"
    ws["D3"] = f'=EXH_FLOW(3650,1.85,{gas},"net","")'            # empty text: an error
    ws["D4"] = f'=EXH_FLOW(3650,1.85,{gas},"net",IF(FALSE,1,""))'
    ws["D5"] = f'=EXH_FLOW(3650,1.85,{gas},"net","  ")'
    ws["D6"] = f'=EXH_FLOW(3650,1.85,{gas},"net",,0.3,1)'        # omitted in the middle: 25
    ws["D7"] = f'=EXH_FLOW(3650,1.85,{gas},"net",Z99,0.3,1)'     # a blank cell: 25
    ws["D8"] = f'=EXH_FLOW(3650,1.85,{gas},"",25,0.3,1)'         # "" for an option word: net
    ws["D9"] = f'=EXH_FLOW(3650,1.85,{gas},"net",25,0.3,1)'
    path, out = tmp_path / "empty.xlsx", tmp_path / "out.xlsx"
    wb.save(path)
    p = _run("recalc", str(path), "-o", str(out), "--json")
    got = json.loads(p.stdout)
    assert got["Sheet!D1"] == pytest.approx(LMTD, rel=1e-9)
    assert got["Sheet!D2"] == got["Sheet!D1"]
    for ref in ("D3", "D4", "D5"):
        assert got[f"Sheet!{ref}"] == "#VALUE!"
        line = next(ln for ln in p.stderr.splitlines() if ln.startswith(f"Sheet!{ref}"))
        assert "t_ambient: empty text is not a number" in line, p.stderr
    at_25 = got["Sheet!D9"]
    assert isinstance(at_25, float)
    assert got["Sheet!D6"] == at_25 and got["Sheet!D7"] == at_25 and got["Sheet!D8"] == at_25
