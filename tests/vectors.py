"""Read check vectors from tests/vectors/<topic>.csv.

Every vectors file has the columns ``function, source, locator, expected,
rtol`` (and optionally ``atol``, ``note``) plus its own input columns.
``source`` names the outside source (standard + table/clause, textbook +
example, or a reference library + the function used; "common practice" or
"from memory" where that is all there is); ``locator`` says where in it.
docs/validation.md is generated from these files.
"""

from __future__ import annotations

import csv
from pathlib import Path

import pytest

VECTOR_DIR = Path(__file__).parent / "vectors"
REQUIRED_COLUMNS = ("function", "source", "locator", "expected", "rtol")


def _num(text: str):
    text = text.strip()
    if text == "":
        return None
    try:
        return float(text)
    except ValueError:
        return text


def load(topic: str) -> list:
    """Rows of ``tests/vectors/<topic>.csv`` as dicts (numbers parsed)."""
    path = VECTOR_DIR / f"{topic}.csv"
    with path.open(newline="", encoding="utf-8") as fh:
        lines = [ln for ln in fh if not ln.lstrip().startswith("#")]
    rows = list(csv.DictReader(lines))
    missing = [c for c in REQUIRED_COLUMNS if rows and c not in rows[0]]
    if missing:
        raise ValueError(f"{path.name}: missing columns {missing}")
    out = []
    for r in rows:
        d = {k: (v if k in ("function", "source", "locator", "note") else _num(v))
             for k, v in r.items()}
        d["atol"] = d.get("atol") or 0.0
        out.append(d)
    return out


def params(topic: str, function: str | None = None):
    """pytest parameters for the rows of a topic, id = source + locator."""
    rows = [r for r in load(topic) if function is None or r["function"] == function]
    return [pytest.param(r, id=f"{r['function']}|{r['source']}|{r['locator']}") for r in rows]


def approx(row: dict):
    """pytest.approx of the row's expected value with its tolerances."""
    return pytest.approx(row["expected"], rel=row["rtol"], abs=row["atol"])
