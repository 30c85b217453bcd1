"""The demo workbooks: built with openpyxl, then recalculated headlessly.

Each module in :data:`WORKBOOKS` has ``FILENAME``, ``build(path)`` (writes the
workbook with formulas) and ``summary(values)`` (a few lines of key results
from the recalculated values, keyed by defined name).  All scenarios, sites,
plants and numbers are invented.
"""

from __future__ import annotations

import importlib
import os
import tempfile

__all__ = ["WORKBOOKS", "build_all", "build_one"]

#: demo modules, in the order they are built
WORKBOOKS = ("tender_chp", "gas_quality", "knock_whatif", "hx_sizing")


def build_one(module_name: str, out_dir: str):
    """Build one demo workbook into ``out_dir``; return (path, Recalc, named values)."""
    from cellfuncs import headless

    mod = importlib.import_module(f"cellfuncs.demo.{module_name}")
    final = os.path.join(out_dir, mod.FILENAME)
    fd, raw = tempfile.mkstemp(prefix=".build-", suffix=".xlsx", dir=out_dir)
    os.close(fd)
    try:
        mod.build(raw)
        res, pkg = headless.recalc(raw)
        # stored uncompressed: the committed demo workbooks stay readable text in the repository
        headless.write_with_cached_values(res, pkg, final, compress=False)
    finally:
        os.unlink(raw)
    named = named_values(final, res)
    return final, res, named


def named_values(path: str, res) -> dict:
    """Values of the workbook's single-cell defined names, from a recalculation."""
    import openpyxl

    wb = openpyxl.load_workbook(path)
    out = {}
    for name, dn in wb.defined_names.items():
        dests = list(dn.destinations)
        if len(dests) == 1 and ":" not in dests[0][1]:
            key = (dests[0][0], dests[0][1].replace("$", ""))
            if key in res.values:
                out[name] = res.values[key]
    return out


def build_all(out_dir: str) -> list:
    """Build every demo workbook; return summary lines for the terminal."""
    os.makedirs(out_dir, exist_ok=True)
    lines = []
    for name in WORKBOOKS:
        mod = importlib.import_module(f"cellfuncs.demo.{name}")
        path, res, named = build_one(name, out_dir)
        unexpected = [f"{s}!{r}" for (s, r) in res.errors()
                      if (s, r) not in getattr(mod, "EXPECTED_ERRORS", set())]
        lines.append(f"{mod.FILENAME}: {len(res.values)} formula cells computed"
                     + (f", UNEXPECTED ERRORS in {', '.join(unexpected)}" if unexpected else ""))
        lines.extend("  " + s for s in mod.summary(named))
    lines.append("Results are estimates for tendering; engine data must come from the engine's "
                 "declared datasheet; final design follows local codes and licensed engineers.")
    return lines
