"""The physics packages know nothing about cells (issue 10, item 3).

Ranges, blanks, layouts and gas analyses are read once, at the cell boundary
(:mod:`cellfuncs.adapt`, by the argument kinds of the catalogue); the physics
receives floats, tuples of floats and parsed compositions.  So no module of a
physics package defines a ``cell_...`` wrapper, nor imports the adapter, the
catalogue or a ``_cells`` helper module.
"""

from __future__ import annotations

import ast
from pathlib import Path

import pytest

ROOT = Path(__file__).resolve().parents[1] / "cellfuncs"
PHYSICS = ("gas", "chargeair", "knock", "heat_transfer", "recovery", "engine", "emissions", "site", "props")
FORBIDDEN = ("cellfuncs.adapt", "cellfuncs.catalogue", "cellfuncs.excel", "cellfuncs.headless")


def _modules():
    for pkg in PHYSICS:
        yield from sorted((ROOT / pkg).rglob("*.py"))


def _findings(path: Path) -> list:
    tree = ast.parse(path.read_text(encoding="utf-8"))
    found = []
    if path.stem == "_cells":
        found.append("a _cells module")
    for node in ast.walk(tree):
        if isinstance(node, (ast.FunctionDef, ast.AsyncFunctionDef)) and node.name.startswith("cell_"):
            found.append(f"defines {node.name}")
        elif isinstance(node, ast.Assign):
            for t in node.targets:
                if isinstance(t, ast.Name) and t.id.startswith("cell_"):
                    found.append(f"binds {t.id}")
        elif isinstance(node, ast.Import):
            for a in node.names:
                if a.name.startswith(FORBIDDEN) or a.name.split(".")[-1] == "_cells":
                    found.append(f"imports {a.name}")
        elif isinstance(node, ast.ImportFrom):
            mod = node.module or ""
            names = [a.name for a in node.names]
            if mod.startswith(FORBIDDEN) or mod.split(".")[-1] == "_cells" or "_cells" in names \
                    or (mod == "cellfuncs" and {"adapt", "catalogue", "excel", "headless"} & set(names)):
                found.append(f"imports from {mod or '.'} {names}")
    return found


def test_the_physics_packages_exist():
    mods = list(_modules())
    assert len(mods) > 20
    assert {p.relative_to(ROOT).parts[0] for p in mods} == set(PHYSICS)


@pytest.mark.parametrize("path", list(_modules()), ids=lambda p: str(p.relative_to(ROOT)))
def test_no_cell_code_in_physics(path):
    assert _findings(path) == []


def test_the_check_finds_cell_code(tmp_path):
    """The checker itself: a wrapper, an adapter import and a _cells import are found."""
    bad = tmp_path / "bad.py"
    bad.write_text("from cellfuncs.adapt import call\nfrom cellfuncs.recovery._cells import layout\n"
                   "import cellfuncs.catalogue\ndef cell_x(a):\n    return a\ncell_y = cell_x\n")
    assert len(_findings(bad)) == 5
