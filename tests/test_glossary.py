"""The naming glossary (issue 10) enforced on the whole catalogue.

Source of the rules: docs/glossary.md, generated from
cellfuncs/catalogue/glossary.py (one source).  The ISO 3046-1 standard reference
conditions (25 °C, 30 % RH, 100 kPa) are ISO 3046-1:2002 clause 5.1
(standard reference conditions), used for the ambient defaults.
"""

from pathlib import Path

import pytest

from cellfuncs import catalogue, docgen
from cellfuncs.catalogue.glossary import (AMBIENT_DEFAULTS, ARRANGEMENT_DEFAULTS, FORBIDDEN,
                                          GAS_QUALITY_FUNCTIONS, GLOSSARY, PREFIXES, SUFFIX_UNITS)
from cellfuncs.catalogue.spec import RANGE_KINDS
from cellfuncs.heat_transfer.arrangements import ALIASES, ARRANGEMENTS

ROOT = Path(__file__).resolve().parent.parent
ENTRIES = catalogue.entries()

#: entries renamed on the plant branch (issue 10, same glossary); the lead empties this set
#: when merging that branch
PENDING: set = set()

#: functions that existed before the glossary: their argument ORDER is fixed (workbooks
#: call by position); every other function follows the order rule
LEGACY = {
    "UNIT_CONVERT", "CELLFUNCS_VERSION", "HX_LMTD", "HX_F", "HX_UA", "HX_AREA",
    "HX_EFFECTIVENESS", "HX_NTU", "HX_RATE", "GAS_COMPONENTS", "GAS_MOLAR_MASS", "GAS_Z",
    "GAS_CV", "GAS_WOBBE", "GAS_DENSITY", "GAS_REL_DENSITY", "GAS_CV_UNCERTAINTY",
    "GAS_AIR_REQUIREMENT", "GAS_CO2_FACTOR", "GAS_FUEL_FLOW", "GAS_FUEL_POWER",
    "GAS_METHANE_NUMBER", "GAS_METHANE_NUMBER_BASIS", "CAC_MIXTURE_FLOW", "TURBO_T_OUT",
    "CAC_DEWPOINT", "CAC_DUTY", "CAC_CONDENSATE", "KNOCK_MARGIN", "KNOCK_T_LIMIT",
    "KNOCK_MN_REQUIRED", "HW_CP", "HW_DENSITY", "HW_FLOW", "HW_DUTY", "HW_CHAIN",
    "HW_CHAIN_RATE", "HW_CHAIN_CHECK", "EXH_FLOW", "EXH_COMPOSITION", "EXH_HEAT",
    "EXH_DEWPOINT", "EXH_O2_CORRECT", "GEN_SPEED", "GEN_POLE_PAIRS", "ENGINE_BMEP",
    "ENGINE_POWER", "CHP_HEAT_RATE", "CHP_PES", "CHP_BALANCE",
}

#: new functions that may break the order rule, each with its reason (empty so far)
_ISSUE_ORDER = "its argument order is fixed by the issue that asked for it (the checks call it by position)"
ORDER_EXEMPT: dict = {
    "HW_ENGINE_LOOP": _ISSUE_ORDER + ": issue 11 item 1",
    "DRYCOOLER_UA": _ISSUE_ORDER + ": issue 11 item 4",
    "EXH_LOSS": _ISSUE_ORDER + ": issue 11 item 5",
    "EMIS_CONVERT": _ISSUE_ORDER + ": issue 12 item 3",
    "EXH_DRY_VOLUME": _ISSUE_ORDER + ": issue 12 item 3",
    "EXH_ACID_DEWPOINT": _ISSUE_ORDER + ": issue 12 item 5 (EXH_DEWPOINT's arguments, then so3_share)",
    "EXH_STEAM": _ISSUE_ORDER + ": issue 12 item 4",
}

CHECKED = [e for e in ENTRIES if e.name not in PENDING]
ARGS = [(e, a) for e in CHECKED for a in e.args]
IDS = [f"{e.name}.{a.name}" for e, a in ARGS]


def test_glossary_md_is_generated_from_the_table():
    path = ROOT / "docs" / "glossary.md"
    assert path.read_text(encoding="utf-8") == docgen.glossary_markdown(), (
        "docs/glossary.md is stale: run `python -m cellfuncs.docgen --glossary > docs/glossary.md`")


def test_brief_glossary_names_are_in_the_table():
    """The names other branches were told to use (common brief, issue 10) are all listed."""
    brief = """t_hot_in t_hot_out t_cold_in t_cold_out t_water_in t_water_out t_source_in
    t_source_out t_engine_in_max t_engine_out t_air_in t_air_out t_exhaust_in t_exhaust_out
    t_stack t_feedwater t_mixture t_ambient t_reference p_boost_bar p_exhaust_bar p_ambient_bar
    p_steam_bar p_metering_bar air_ratio electrical_efficiency thermal_efficiency
    isentropic_efficiency components amounts amount_uncertainties result unit basis moisture
    kind ref_conditions arrangement unit_given unit_wanted o2_measured_pct o2_reference_pct
    glycol_fraction glycol rh_ambient water_flow_m3_h engine_flow_m3_h exhaust_flow_kg_h
    mixture_flow_kg_h fuel_power_kw electrical_kw duty_kw ua_kw_k min_approach_k pinch_k
    approach_k""".split()
    assert [n for n in brief if n not in GLOSSARY] == []
    assert not set(GLOSSARY) & set(FORBIDDEN)


@pytest.mark.parametrize("entry,arg", ARGS, ids=IDS)
def test_every_argument_name_is_in_the_glossary_with_its_unit(entry, arg):
    assert arg.name not in FORBIDDEN, f"{entry.name}: {arg.name} -> {FORBIDDEN.get(arg.name)}"
    assert arg.name in GLOSSARY, (f"{entry.name}: {arg.name!r} is not in the glossary "
                                  "(add it to cellfuncs/catalogue/glossary.py)")
    unit = GLOSSARY[arg.name][1]
    if arg.kind in RANGE_KINDS:
        assert arg.unit == ""
        if unit not in ("", "-"):
            assert f"[{unit}]" in arg.help, f"{entry.name}.{arg.name}: help must state [{unit}]"
    elif arg.kind in ("option", "text", "reference"):
        assert arg.unit == "" and unit == "", f"{entry.name}.{arg.name}"
    else:
        assert arg.unit == unit, f"{entry.name}.{arg.name}: unit {arg.unit!r}, glossary {unit!r}"


def test_unit_suffixes_and_stream_names():
    for name, (_, unit, _) in GLOSSARY.items():
        suffix = max((s for s in SUFFIX_UNITS if name.endswith(s)), key=len, default=None)
        if suffix and name not in ("c_ratio",):
            assert unit == SUFFIX_UNITS[suffix], f"{name}: {unit!r} but suffix {suffix}"
        if name.startswith("t_"):
            assert unit == "°C", name
            assert name not in ("t", "t_in", "t_out")
        if name.startswith("p_") and name.endswith("_bar"):
            assert unit == "bar(a)", name
        if name.endswith("_efficiency"):
            assert unit == "-", name
        assert "lambda" not in name and not name.endswith("m3h") and not name.endswith("m2k")
    for name in GLOSSARY:
        if name.endswith("_ref"):
            assert "datasheet" in GLOSSARY[name][2], f"{name}: _ref is for a datasheet point"


def _args_named(name):
    return [(e, a) for e, a in ARGS if a.name == name]


def test_option_vocabularies():
    for e, a in _args_named("basis"):
        assert set(a.options) <= {"volume", "mass", "molar"}, e.name
    for e, a in _args_named("moisture"):
        assert set(a.options) == {"wet", "dry"}, e.name
    for e, a in _args_named("kind"):
        assert set(a.options) == {"gross", "net"}, e.name
    for e, a in _args_named("result") + _args_named("unit"):
        assert a.kind == "option", e.name
    for e, a in _args_named("ref_conditions"):
        assert a.kind in ("text", "reference"), e.name


def test_one_arrangement_vocabulary_with_its_aliases():
    found = _args_named("arrangement")
    assert len(found) >= 7
    for e, a in found:
        assert set(a.options) <= set(ARRANGEMENTS), e.name
        for alias, word in ALIASES.items():
            if word in a.options:
                assert a.aliases.get(alias) == word, f"{e.name}: alias {alias!r} missing"
        if "counter" in a.options:
            assert a.aliases.get("counterflow") == "counter"
        if "cross" in a.options:
            assert a.aliases.get("crossflow") == "cross"
    for e in ENTRIES:  # the chain too (its names are renamed elsewhere, its words are ours)
        for a in e.args:
            if a.kind == "option" and "counter" in a.options:
                assert a.aliases.get("counterflow") == "counter", e.name
                if "cross" in a.options:
                    assert a.aliases.get("crossflow") == "cross", e.name


def test_defaults_rule():
    for e, a in _args_named("kind"):
        want = "gross" if e.name in GAS_QUALITY_FUNCTIONS else "net"
        assert a.default == want, f"{e.name}: kind defaults to {a.default}, rule says {want}"
        assert "default" in a.help, f"{e.name}: the kind's help does not state the default rule"
        has_ref = any(b.name in ("ref_conditions", "t_combustion") for b in e.args)
        assert has_ref or "°C" in a.help, f"{e.name}: the kind's reference conditions unstated"
    for e, a in _args_named("ref_conditions"):
        want = "15/15" if e.name.startswith("GAS_") and e.name not in (
            "GAS_FUEL_FLOW", "GAS_FUEL_POWER") else "25/0"
        assert a.default == want, e.name
    for name, value in AMBIENT_DEFAULTS.items():
        for e, a in _args_named(name):
            assert a.default == value, f"{e.name}.{name}"
            assert "ISO 3046-1 standard reference conditions" in a.help, f"{e.name}.{name}"
    for e, a in _args_named("arrangement"):
        assert a.default == ARRANGEMENT_DEFAULTS.get(e.name, ("counter",))[0], e.name
    for e in ("GAS_FUEL_FLOW", "GAS_FUEL_POWER", "GAS_CV", "GAS_WOBBE"):
        d = catalogue.by_name(e).description
        assert "gross 15/15" in d and "25/0" in d, e


def test_no_unsure_or_foreign_wording_in_help():
    for e in ENTRIES:
        texts = [e.description, e.returns] + [a.help for a in e.args]
        for t in texts:
            assert "reference from memory" not in t, e.name
            assert "INCOMP" not in t and "::" not in t, e.name
            assert "lambda_" not in t, e.name


def test_o2_correct_help_shows_the_factor_100():
    e = catalogue.by_name("EXH_O2_CORRECT")
    assert [a.name for a in e.args] == ["concentration", "o2_measured_pct", "o2_reference_pct"]
    assert "100*EXH_COMPOSITION" in e.args[1].help


def test_prefixes_and_categories():
    for e in ENTRIES:
        prefix = max((p for p in PREFIXES if e.name.startswith(p)), key=len, default=None)
        assert prefix, f"{e.name}: no known prefix (add the family's prefix to the glossary)"
        allowed = {"cellfuncs · " + PREFIXES[prefix][0]}
        if prefix == "EXH_":  # the exhaust's emission-side functions sit with the emissions
            allowed.add("cellfuncs · emissions")
        assert e.category in allowed, e.name
        assert e.name == e.name.upper()
    for name in ("GEN_SPEED", "GEN_POLE_PAIRS"):
        assert "GEN_ = generator" in catalogue.by_name(name).description
    assert "TURBO_ = turbocharger" in catalogue.by_name("TURBO_T_OUT").description
    assert "CAC_ = charge air" in catalogue.by_name("CAC_MIXTURE_FLOW").description


def test_order_rule_for_new_functions():
    for e in CHECKED:
        if e.name in LEGACY or e.name in ORDER_EXEMPT:
            continue
        groups = [GLOSSARY[a.name][0] for a in e.args]
        assert groups == sorted(groups), (
            f"{e.name}: arguments out of the glossary order (computed on, fluid or gas, site, "
            f"options): {[(a.name, g) for a, g in zip(e.args, groups)]}")


def test_pending_entries_still_exist():
    """PENDING names real entries, so it is emptied rather than forgotten."""
    names = {e.name for e in ENTRIES}
    assert PENDING <= names


def test_every_multi_value_function_has_a_per_cell_form():
    """Glossary rule "per_cell": a result word, a stage or an index gives one value per cell."""
    for e in CHECKED:
        if e.shape == "scalar":
            continue
        per_cell = [a for a in e.args if a.name in ("result", "stage", "index")]
        assert per_cell, f"{e.name} returns several values but has no result/stage/index"
        assert per_cell[0].optional, e.name


def test_gas_components_index_gives_one_name():
    from cellfuncs import excel

    names = [row[0] for row in excel.GAS_COMPONENTS()]
    assert names[0] == "methane" and len(names) > 10
    assert [excel.GAS_COMPONENTS(i) for i in range(1, len(names) + 1)] == names
    for bad in (0, len(names) + 1, 1.5):
        assert excel.GAS_COMPONENTS(bad).startswith("#NUM! index:")


def test_gas_analysis_arguments_come_in_pairs():
    """kind "gas" is followed by kind "amounts" (named components/amounts); "amounts" and
    "amount_uncertainties" never stand alone, and an old-convention pair (kind "range") is
    never mixed with the new kinds (a merge of the two conventions would misparse)."""
    for e in ENTRIES:
        kinds = [a.kind for a in e.args]
        for i, a in enumerate(e.args):
            if a.kind == "gas":
                assert a.name == "components", e.name
                assert i + 1 < len(kinds) and kinds[i + 1] == "amounts", (
                    f"{e.name}: components of kind 'gas' must be followed by amounts of kind 'amounts'")
            if a.kind == "amounts":
                assert a.name == "amounts" and i > 0 and kinds[i - 1] == "gas", e.name
            if a.kind == "amount_uncertainties":
                assert "gas" in kinds[:i], e.name
            if a.name in ("components", "amounts") and a.kind == "range":
                other = "amounts" if a.name == "components" else "components"
                assert all(b.kind == "range" for b in e.args if b.name == other), (
                    f"{e.name}: {a.name} is a plain range but {other} is not")
