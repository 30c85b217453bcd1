"""Write workbooks_demo/cases.csv: a few what-if cases for tender_chp.xlsx, from its named inputs.

Run from the repository root after the tender demo is rebuilt (its input names may change):

    python tools/make_cases_csv.py [workbooks_demo/tender_chp.xlsx] [workbooks_demo/cases.csv]

The inputs are found by role (ambient temperature, ambient humidity, hot-water return and flow
temperatures) from the workbook's named inputs, so a renamed input is picked up as long as its
name follows the glossary (t_ambient, rh_ambient, t_water_in/t_return, t_water_out/t_flow).
The cases are invented site conditions a tender is typically asked about: a hot humid design day,
a cold day, a warmer and a cooler hot-water return.
"""

from __future__ import annotations

import csv
import re
import sys
from pathlib import Path

ROOT = Path(__file__).resolve().parent.parent
sys.path.insert(0, str(ROOT))

#: role -> pattern on the input's name (case-insensitive); the first matching named input is used
ROLES = {
    "t_ambient": r"^(site_)?t_amb(ient)?$",
    "rh_ambient": r"^(site_)?rh_amb(ient)?$",
    "t_return": r"^(t_return|t_water_in|t_hw_return)$",
    "t_flow": r"^(t_flow|t_water_out|t_hw_flow)$",
}

#: the cases, by role; None = the workbook's current value
CASES = (
    {"t_ambient": None, "rh_ambient": None, "t_return": None, "t_flow": None},   # as the workbook
    {"t_ambient": 35, "rh_ambient": 0.6, "t_return": None, "t_flow": None},      # hot, humid day
    {"t_ambient": 5, "rh_ambient": 0.8, "t_return": None, "t_flow": None},       # cold day
    {"t_ambient": 25, "rh_ambient": 0.3, "t_return": None, "t_flow": None},      # ISO 3046-1 standard reference conditions
    {"t_ambient": None, "rh_ambient": None, "t_return": 65, "t_flow": 90},       # warmer return water
    {"t_ambient": None, "rh_ambient": None, "t_return": 50, "t_flow": 80},       # low-temperature network
)


def find_roles(inputs) -> dict:
    """role -> the named input (``cellfuncs.bookinfo.NamedCell``) that plays it."""
    found = {}
    for role, pattern in ROLES.items():
        match = [c for c in inputs if re.match(pattern, c.name, re.IGNORECASE)
                 and isinstance(c.value, (int, float))]
        if not match:
            raise SystemExit(f"make_cases_csv: no named input for {role} (a name matching {pattern}); "
                             "update ROLES in tools/make_cases_csv.py")
        found[role] = match[0]
    return found


def case_rows(book: str) -> tuple:
    """(header, rows) of the sample cases for ``book``."""
    from cellfuncs.bookinfo import book_info

    roles = find_roles(book_info(book).inputs)
    header = [roles[r].name for r in ROLES]
    rows = []
    for case in CASES:
        rows.append([f"{(roles[r].value if case[r] is None else case[r]):g}" for r in ROLES])
    return header, rows


def write_cases(book: str, out: str) -> None:
    header, rows = case_rows(book)
    with open(out, "w", newline="", encoding="utf-8") as fh:
        w = csv.writer(fh, lineterminator="\n")
        w.writerow(header)
        w.writerows(rows)


if __name__ == "__main__":
    book = sys.argv[1] if len(sys.argv) > 1 else str(ROOT / "workbooks_demo" / "tender_chp.xlsx")
    out = sys.argv[2] if len(sys.argv) > 2 else str(ROOT / "workbooks_demo" / "cases.csv")
    write_cases(book, out)
    print(f"wrote {out}")
