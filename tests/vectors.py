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


#: argument names renamed by the glossary (issue 10): the older column that holds each
#: in the vector files (a file's column may serve several functions' renamed arguments)
RENAMED_COLUMNS = {
    "air_ratio": "lambda_", "amounts": "fractions", "amount_uncertainties": "u_fractions",
    "ref_conditions": "ref", "unit_given": "from_unit", "unit_wanted": "to_unit",
    "u_w_m2_k": "u_w_m2k", "isentropic_efficiency": "eta_is", "p_air_in_bar": "p_in_bar",
    "p_air_out_bar": "p_out_bar", "t_air_in": "t_in", "t_mixture_in": "t_in",
    "t_mixture_out": "t_out", "t_exhaust_in": "t_in", "t_exhaust_out": "t_out",
    "t_water_in": "t_in", "t_water_out": "t_out", "t_water": "t", "p_boost_bar": "p_bar",
    "p_exhaust_bar": "p_bar", "fuel_flow_m3_h": "flow_m3h", "water_flow_m3_h": "flow_m3h",
    "t_mixture_ref": "t_ref", "p_boost_ref_bar": "p_ref_bar", "methane_number_ref": "mn_ref",
    "polytropic_exponent": "n_poly", "activation_temperature": "activation_k",
    "delay_pressure_exponent": "pressure_exp", "moisture": "basis",
    "o2_measured_pct": "o2_measured", "o2_reference_pct": "o2_reference",
    "result": "output", "unit": "output", "arrangement": "flow",
}


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
        for new, old in RENAMED_COLUMNS.items():
            if old in d and d.get(new) in (None, ""):
                d[new] = d[old]
        if "part" in d and d.get("result") in (None, ""):
            d["result"] = d["part"]
        out.append(d)
    return out


def params(topic: str, function: str | None = None):
    """pytest parameters for the rows of a topic, id = source + locator."""
    rows = [r for r in load(topic) if function is None or r["function"] == function]
    return [pytest.param(r, id=f"{r['function']}|{r['source']}|{r['locator']}") for r in rows]


def approx(row: dict):
    """pytest.approx of the row's expected value with its tolerances."""
    return pytest.approx(row["expected"], rel=row["rtol"], abs=row["atol"])
