"""docs/validation.md names only real cell functions, and every cell function appears in it
(with its outside checks, or listed as having none)."""

import re
import sys
from pathlib import Path

import pytest

from cellfuncs import catalogue

ROOT = Path(__file__).resolve().parent.parent
sys.path.insert(0, str(ROOT / "tools"))

from validation_md import PART_CHECKS, check_functions, validation_markdown  # noqa: E402


def _function_cells(text):
    """The backticked names in the first column of every table of the document."""
    names = []
    for line in text.splitlines():
        if line.startswith("| ") and not line.startswith("|---"):
            first = line.split(" | ")[0]
            names += re.findall(r"`([^`]+)`", first)
    return names


def test_every_name_in_the_tables_is_a_cell_function():
    catalogued = {e.name for e in catalogue.entries()}
    text = (ROOT / "docs" / "validation.md").read_text(encoding="utf-8")
    named = _function_cells(text)
    assert named
    assert sorted(set(named) - catalogued) == []


def test_every_cell_function_appears():
    text = (ROOT / "docs" / "validation.md").read_text(encoding="utf-8")
    named = set(_function_cells(text))
    assert [e.name for e in catalogue.entries() if e.name not in named] == []


def test_functions_without_a_check_are_listed_as_such():
    text = validation_markdown(ROOT)
    line = next(ln for ln in text.splitlines() if "cell functions have an outside check" in ln)
    for row in text.splitlines():
        if row.endswith("| none | none | no outside check yet |"):
            name = re.match(r"\| `([A-Z0-9_]+)`", row).group(1)
            assert f"`{name}`" in line


def test_part_checks_point_at_cell_functions():
    catalogued = {e.name for e in catalogue.entries()}
    for label, (names, note) in PART_CHECKS.items():
        assert label not in catalogued and set(names) <= catalogued and note


def test_an_unknown_vector_label_stops_the_generator():
    with pytest.raises(ValueError, match="T_NOT_A_FUNCTION"):
        check_functions("T_NOT_A_FUNCTION")
