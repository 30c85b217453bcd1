"""The formula text the engine is given (cellfuncs/headless/formula_text.py).

Expected texts are worked by hand from the formula grammar (ECMA-376 Part 1, 18.17): an
omitted argument is an empty place between separators; strings, quoted sheet names and
structured references are never split.
"""

import subprocess
import sys

import pytest
from hypothesis import given, settings
from hypothesis import strategies as st

from cellfuncs.headless.formula_text import OMITTED, TAG, rewrite

OURS = frozenset({"HX_LMTD", "EXH_FLOW", "GAS_CV"})
O = '"' + OMITTED + '"'  # the text standing for an omitted argument


@pytest.mark.parametrize("formula, expected", [
    ('=EXH_FLOW(3650,1.85,A2:A9,B2:B9,"net",,0.6,1)', 'EXH_FLOW(3650,1.85,A2:A9,B2:B9,"net",' + O + ',0.6,1)'),
    ("=HX_LMTD(90,,60,80)", 'HX_LMTD(90,' + O + ',60,80)'),
    ("=HX_LMTD(1,2,)", 'HX_LMTD(1,2,' + O + ')'),
    ("=HX_LMTD(1, ,3,4)", 'HX_LMTD(1,' + O + ' ,3,4)'),
    ("=HX_LMTD()", "HX_LMTD()"),
    ('=IF(A1,HX_LMTD(1,,3,4),"a,,b")', 'IF(A1,HX_LMTD(1,' + O + ',3,4),"a,,b")'),   # commas in text stay
    ("=ROUND(2.5,)", "ROUND(2.5,)"),                                          # built-ins untouched
    ('=_xludf.HX_LMTD(100,60,30,40.2,"parallel")', 'HX_LMTD(100,60,30,40.2,"parallel")'),
    ("='[1]'!HX_LMTD(1,2,3,4)", "HX_LMTD(1,2,3,4)"),
    ("=cellfuncs.xlam!HX_LMTD(1,2,3,4)", "HX_LMTD(1,2,3,4)"),
    ("=[other.xlsx]Sheet1!A1+1", "#REF!+1"),
    ("='C:\\data\\[other.xlsx]Sheet1'!A1+1", "#REF!+1"),
    ("=SUM([other.xlsx]Sheet1!A:A)", "SUM(#REF!)"),
    ("='Site''s data'!A1*2", "'Site''s data'!A1*2"),
    ("=Costs[[#Data],[cost]]", "Costs[[#Data],[cost]]"),
])
def test_rewrites(formula, expected):
    assert rewrite(formula, OURS).text == expected


def test_tag_goes_first_and_omissions_still_fill():
    r = rewrite("=HX_LMTD(90,,60,80)", OURS, TAG + "7")
    assert r.text == f'HX_LMTD("{TAG}7",90,{O},60,80)'
    assert rewrite("=HX_LMTD()", OURS, TAG + "1").text == f'HX_LMTD("{TAG}1")'


def test_three_d_references_expand_over_the_sheets_between():
    sheets = ["S", "Alpha", "Beta", "Gamma", "P 1", "P2"]
    assert rewrite("=AVERAGE(Alpha:Gamma!$B$2)", OURS, None, sheets).text == \
        "AVERAGE(Alpha!$B$2,Beta!$B$2,Gamma!$B$2)"
    # a sheet named like a cell (P2) is quoted
    assert rewrite("=SUM('P 1:P2'!A1:B2)", OURS, None, sheets).text == "SUM('P 1'!A1:B2,'P2'!A1:B2)"
    unknown = rewrite("=SUM(Alpha:Zeta!A1)", OURS, None, sheets)
    assert unknown.three_d and unknown.text == "SUM(Alpha:Zeta!A1)"


def test_ranges_are_listed_with_open_ends():
    r = rewrite("=SUM(C1:L1000000)+VLOOKUP(1,A:F,2,FALSE)+SUM(3:5)+Inputs!B3:C4", OURS)
    assert r.ranges == [(None, 1, 3, 1000000, 12), (None, 1, 1, 0, 6), (None, 3, 1, 5, 0),
                        ("Inputs", 3, 2, 4, 3)]


_atoms = st.sampled_from(["A1", "$B$2", "C3:D4", "1", "2.5", '"x,,y"', "TRUE", "Sheet2!A1", "'My sheet'!B2"])


@st.composite
def _builtin_formulas(draw, depth=0):
    if depth > 2 or draw(st.booleans()):
        return draw(_atoms)
    fn = draw(st.sampled_from(["SUM", "MAX", "IF", "ROUND", "AVERAGE"]))
    args = draw(st.lists(_builtin_formulas(depth=depth + 1) | st.just(""), min_size=1, max_size=4))
    return f"{fn}({','.join(args)})"


@settings(max_examples=200, deadline=None)
@given(_builtin_formulas())
def test_formulas_without_our_functions_are_not_changed(f):
    assert rewrite("=" + f, OURS).text == f


def test_importing_the_headless_package_is_light():
    code = ("import sys, cellfuncs.headless, cellfuncs.cli; "
            "print(sorted(m for m in ('formualizer', 'CoolProp', 'scipy', 'openpyxl') if m in sys.modules))")
    p = subprocess.run([sys.executable, "-c", code], capture_output=True, text=True, check=True)
    assert p.stdout.strip() == "[]"
