"""The catalogue is the one source of truth: checks on its entries and on what is generated from it."""

import sys
from pathlib import Path

import pytest

from cellfuncs import catalogue, docgen, excel
from cellfuncs.catalogue.spec import KINDS

ROOT = Path(__file__).resolve().parent.parent
ENTRIES = catalogue.entries()
UNITS = {"", "-", "°C", "K", "bar(a)", "bar", "kW", "kg/h", "m³/h", "kW/K", "W/(m²·K)", "m²"}


def test_functions_md_is_current():
    path = ROOT / "docs" / "functions.md"
    assert path.read_text(encoding="utf-8") == docgen.functions_markdown(), (
        "docs/functions.md is stale: run `cellfuncs functions --markdown > docs/functions.md`")


@pytest.mark.parametrize("entry", ENTRIES, ids=[e.name for e in ENTRIES])
def test_entry_is_complete(entry):
    assert entry.name == entry.name.upper()
    assert entry.category.startswith("cellfuncs · ")
    assert 0 < len(entry.description) <= 255
    assert entry.returns and "[" in entry.returns, "returns must state a unit in brackets"
    assert entry.shape in ("scalar", "row", "column", "array")
    seen_optional = False
    for a in entry.args:
        assert a.kind in KINDS
        assert a.help and len(a.full_help()) <= 255
        assert a.name == a.name.lower()
        if a.kind == "option":
            assert a.options and all(o == o.lower() for o in a.options)
            assert not a.optional or a.default is None or a.default in a.options
        if a.optional:
            seen_optional = True
        else:
            assert not seen_optional, f"{a.name}: required after optional"
    assert callable(entry.resolve())
    assert callable(getattr(excel, entry.name))


@pytest.mark.parametrize("entry", [e for e in ENTRIES if e.example], ids=lambda e: e.name)
def test_example_computes(entry):
    res = getattr(excel, entry.name)(*entry.example)
    assert not (isinstance(res, str) and res.startswith("#")), res


def test_validation_md_is_current():
    sys.path.insert(0, str(ROOT / "tools"))
    from validation_md import validation_markdown  # a repository tool, not part of the package

    path = ROOT / "docs" / "validation.md"
    assert path.read_text(encoding="utf-8") == validation_markdown(ROOT), (
        "docs/validation.md is stale: run `python tools/make_validation_md.py`")


def test_every_vectors_file_names_its_sources():
    from vectors import REQUIRED_COLUMNS, VECTOR_DIR, load

    for path in VECTOR_DIR.glob("*.csv"):
        rows = load(path.stem)
        assert rows, path.name
        for r in rows:
            for col in REQUIRED_COLUMNS:
                assert r[col] not in (None, ""), f"{path.name}: empty {col}"
