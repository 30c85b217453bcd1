"""The demo workbooks' defined names follow the naming glossary (issue 10), one name for one quantity.

What `cellfuncs inputs` lists and `cellfuncs cases` takes as column headers (the named inputs and the
named ranges) must be a glossary name, a glossary name with a prefix or suffix of our own
(``plate_t_hot_in``, ``t_mixture_ht``), a name in the glossary's style (``<thing>_<quantity>_<unit
suffix>``, ``t_<stream>_<end>``), a result ``out_…``, or a name of the explicit list below with its
reason.  In knock_whatif and hx_sizing every defined name is held to that rule; in every demo no name
is one the glossary says not to use.  Source of the rule: docs/glossary.md (cellfuncs.catalogue.glossary).
"""

from pathlib import Path
import re

import openpyxl
import pytest

from cellfuncs.bookinfo import book_info
from cellfuncs.catalogue.glossary import FORBIDDEN, GLOSSARY, SUFFIX_UNITS

DEMO = Path(__file__).resolve().parent.parent / "workbooks_demo"
DEMOS = ("tender_chp", "gas_quality", "knock_whatif", "hx_sizing")
#: demos whose every defined name (intermediate cells too) follows the rule
STRICT = ("knock_whatif", "hx_sizing")

#: names outside the rule, each with why (a pattern stands for a numbered family)
ALLOWED = {
    "gas_names": "component column of a gas analysis range (the glossary's `components`)",
    r"gas_\d+(_u)?": "amounts (and uncertainties) of analysis i of the gas_quality table",
    "derate_altitudes": "row axis of a datasheet table (TABLE_ functions' x_values)",
    "derate_temperatures": "column axis of a datasheet table (TABLE_ functions' y_values)",
    "mn_axis": "row axis of the methane-number factor table (x_values)",
    "mn_factors": "values of the methane-number factor table (y_values)",
    "part_load_axis": "row axis of the part-load table (x_values)",
    "part_load_el": "values of the part-load table, electrical (y_values)",
    "part_load_th": "values of the part-load table, thermal (y_values)",
    r"order_\d": "option word of a heat-recovery chain stage (a heat source's name)",
    "ua_margin": "fraction of UA added as surface margin; the glossary has no name for it",
    "plate_fouling_allowance": "fraction of area added for fouling; the glossary has no name for it",
    "part_load": "load fraction to rate at; the glossary has no name for it",
    r"(nox|co)_limit_mg_nm3": "emission limit in mg/Nm³, a unit the glossary's suffixes do not cover",
    "plate_area_clean_m2": "an area in m², a unit the glossary's suffixes do not cover",
    "plate_f_factor": "LMTD correction factor F (HX_F); the glossary has no argument name for it",
    r"mn_(gas|lowest|spread|methods|methods_count)": "methane-number intermediates, the same names as "
                                                       "in tender_chp",
    "dew_check": "text of a check cell, the same name as in tender_chp",
}
#: the glossary's unit suffixes, and ``_bar`` / ``_efficiency`` of its pressure and efficiency rules
SUFFIXES = tuple(SUFFIX_UNITS) + ("_bar", "_efficiency")


def _tokens(name):
    return name.lower().split("_")


def _contains(name, other):
    a, b = _tokens(name), _tokens(other)
    return any(a[i:i + len(b)] == b for i in range(len(a) - len(b) + 1))


def follows_glossary(name):
    n = name.lower()
    if n.startswith("out_") or n in GLOSSARY:
        return True
    # a glossary name with a prefix or suffix of our own; a one-word glossary name only as the last
    # word (`exhaust_arrangement`, `gas_amounts`), else `fuel` would let `fuel_kw` through
    if any(_contains(n, g) for g in GLOSSARY if "_" in g) or _tokens(n)[-1] in GLOSSARY:
        return True
    if n.endswith(SUFFIXES):                          # <thing>_<quantity>_<unit suffix>
        return True
    if n.startswith("t_") and len(_tokens(n)) >= 3:  # t_<stream>_<end>
        return True
    return any(re.fullmatch(p, n) for p in ALLOWED)


def forbidden_in(name):
    """The glossary's not-to-use names in ``name``: the whole name, or a run of two or more words outside
    any glossary name it holds (``o2_reference_pct`` holds ``o2_reference`` rightly)."""
    words = _tokens(name)
    for g in sorted((g for g in GLOSSARY if "_" in g), key=len, reverse=True):
        gw = _tokens(g)
        i = 0
        while i <= len(words) - len(gw):
            if words[i:i + len(gw)] == gw:
                words[i:i + len(gw)] = ["|"]        # a glossary name: nothing in it is forbidden
            i += 1
    rest = "_".join(words)
    return [f for f in FORBIDDEN if name.lower() == f or ("_" in f.strip("_") and _contains(rest, f))]


def test_rule_refuses_the_old_names():
    # names the demos used before they followed the glossary (common practice: the review's list)
    for old in ("p_boost", "eta_c", "cr", "t_intake", "jw_in", "hw_in", "phx_u", "exh_in",
                "t_ref", "p_ref", "mn_ref", "k_mn"):
        assert not follows_glossary(old) or forbidden_in(old), old
    for new in ("fuel_power_kw", "p_boost_bar", "isentropic_efficiency", "compression_ratio", "t_mixture",
                "plate_t_hot_in", "plate_u_w_m2_k", "t_exhaust_in", "t_mixture_ref", "k_per_mn"):
        assert follows_glossary(new) and not forbidden_in(new), new
    assert forbidden_in("mn_ref") == ["mn_ref"] and forbidden_in("site_t_ref_x") == ["t_ref"]


@pytest.mark.parametrize("demo", DEMOS)
def test_inputs_and_ranges_follow_the_glossary(demo):
    info = book_info(str(DEMO / f"{demo}.xlsx"))
    names = [c.name for c in info.inputs + info.ranges]
    assert names
    assert [n for n in names if not follows_glossary(n)] == []


@pytest.mark.parametrize("demo", STRICT)
def test_every_name_follows_the_glossary(demo):
    names = list(openpyxl.load_workbook(DEMO / f"{demo}.xlsx").defined_names)
    assert [n for n in names if not follows_glossary(n)] == []


@pytest.mark.parametrize("demo", DEMOS)
def test_no_name_the_glossary_says_not_to_use(demo):
    names = list(openpyxl.load_workbook(DEMO / f"{demo}.xlsx").defined_names)
    assert [(n, forbidden_in(n)) for n in names if forbidden_in(n)] == []


def test_allow_list_entries_are_used():
    """No stale entry: each allowed name or pattern is a defined name of some demo."""
    names = set()
    for demo in DEMOS:
        names |= {n.lower() for n in openpyxl.load_workbook(DEMO / f"{demo}.xlsx").defined_names}
    assert [p for p in ALLOWED if not any(re.fullmatch(p, n) for n in names)] == []
