"""`cellfuncs cases`: 1,000 cases of the tender workbook (target <= 3 s with 2 workers, issue 9).

Reference in the same run: one `cellfuncs recalc` of the same workbook (load, compile, compute).

    python -m pytest benchmarks/bench_cases.py --benchmark-only
"""

import csv
import random
import subprocess
import sys
from pathlib import Path

import pytest

# a copy of workbooks_demo/tender_chp.xlsx as it stood on 2026-12-01: later demo changes do not move the figure
BOOK = Path(__file__).resolve().parent / "inputs" / "tender_chp_2026-12-01.xlsx"


@pytest.fixture(scope="module")
def cases_csv(tmp_path_factory):
    rng = random.Random(1)
    path = tmp_path_factory.mktemp("cases") / "cases.csv"
    with open(path, "w", newline="") as fh:
        w = csv.writer(fh)
        # the input names of the 2026-12-01 copy (the demo's names were changed later)
        w.writerow(["t_amb", "rh_amb", "t_return", "t_flow"])
        for _ in range(1000):
            w.writerow([round(rng.uniform(-5, 38), 1), round(rng.uniform(0.2, 0.95), 2),
                        rng.choice([55, 60, 65]), rng.choice([85, 90])])
    return path


def _cli(*args):
    subprocess.run([sys.executable, "-m", "cellfuncs.cli", *args], check=True, capture_output=True)


@pytest.mark.parametrize("workers", ["1", "2"])
def test_cases_1000(benchmark, cases_csv, tmp_path, workers):
    benchmark.group = "cases: 1000 cases of tender_chp.xlsx"
    out = tmp_path / "results.csv"
    benchmark.pedantic(_cli, args=("cases", str(BOOK), str(cases_csv), "-o", str(out), "--workers", workers),
                       rounds=1, iterations=1)
    assert sum(1 for _ in open(out)) == 1001


def test_one_recalc(benchmark, tmp_path):
    benchmark.group = "cases: 1000 cases of tender_chp.xlsx"
    benchmark.pedantic(_cli, args=("recalc", str(BOOK), "-o", str(tmp_path / "o.xlsx")), rounds=3, iterations=1)
