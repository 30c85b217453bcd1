"""Headless recalculation speed and memory, each against a reference measured in the same run.

A script (the figures go into docs/performance.md), not a timed test:

    python benchmarks/bench_recalc.py            # all
    python benchmarks/bench_recalc.py tender big # some
    python benchmarks/bench_recalc.py -n 5 cases # best of 5 (default 3)

* ``tender``: cold ``cellfuncs recalc`` of benchmarks/inputs/tender_chp_2026-12-01.xlsx (a copy of the
  demo as it stood on 2026-12-01, so later demo changes do not move the figure) and of the demo as it
  stands (workbooks_demo/tender_chp.xlsx); reference: a bare ``python -c pass`` (and, for scale,
  ``python -c "import CoolProp.CoolProp"``, the water-property import plain water no longer needs).
* ``cases``: 1,000 cases of that workbook with 1 and 2 workers; reference: one cold recalc of it.
* ``cases-demo`` (not in the default set; no target): the same rows over the current demo.
* ``big``: 40,000 built-in formula cells; reference: ``soffice --headless --convert-to xlsx`` of the
  same file (skipped without soffice).
* ``sum``: a 5 KB book with ``=SUM(C1:L1000000)``; ``cols``: ten whole-column references.

Each line: wall time [s] (best of the runs) and peak resident memory [MB] of the process (from
/usr/bin/time), the ratio to the reference measured just before it, and the 1-minute load average
when the line was measured (the machine may be shared: compare ratios, and rerun under load).
"Cold" = a new process each time, with the bytecode caches an installed package has.
"""

from __future__ import annotations

import csv
import os
import random
import shutil
import subprocess
import sys
import tempfile
import time
from pathlib import Path

HERE = Path(__file__).resolve().parent
BOOK = HERE / "inputs" / "tender_chp_2026-12-01.xlsx"
DEMO = HERE.parent / "workbooks_demo" / "tender_chp.xlsx"
PY = sys.executable
RUNS = 3
# bytecode caches as an installed package has them (pip compiles on install); a shell that sets
# PYTHONDONTWRITEBYTECODE would otherwise make every "cold" start compile all modules again
ENV = {k: v for k, v in os.environ.items() if k != "PYTHONDONTWRITEBYTECODE"}


def timed(cmd, cwd=None):
    """(seconds, peak MB) of one command."""
    gnu = shutil.which("time") or ("/usr/bin/time" if os.path.exists("/usr/bin/time") else None)
    t0 = time.perf_counter()
    if gnu:
        p = subprocess.run([gnu, "-f", "%M", *cmd], capture_output=True, text=True, cwd=cwd, env=ENV)
        wall = time.perf_counter() - t0
        peak = int(p.stderr.strip().splitlines()[-1]) / 1024
    else:  # pragma: no cover
        p = subprocess.run(cmd, capture_output=True, text=True, cwd=cwd, env=ENV)
        wall, peak = time.perf_counter() - t0, float("nan")
    if p.returncode not in (0, 3):
        raise RuntimeError(f"{cmd}: exit {p.returncode}: {p.stderr[-400:]}")
    return wall, peak


def line(label, wall, peak, ref=None):
    ratio = f"  {wall / ref:6.2f}× reference" if ref else " " * 20
    print(f"{label:62s} {wall:7.2f} s {peak:7.0f} MB{ratio}   load {os.getloadavg()[0]:.2f}", flush=True)


def best(n, cmd, cwd=None):
    """(min wall time, max peak memory) of n runs."""
    runs = [timed(cmd, cwd) for _ in range(n)]
    return min(r[0] for r in runs), max(r[1] for r in runs)


def bench_tender(d):
    timed([PY, "-m", "cellfuncs.cli", "recalc", str(BOOK), "-o", os.path.join(d, "t.xlsx")])  # bytecode caches
    ref = best(RUNS, [PY, "-c", "pass"])
    line("reference: python -c pass", *ref)
    try:
        cp = best(RUNS, [PY, "-c", "import CoolProp.CoolProp"])
        line("(for scale) python -c 'import CoolProp.CoolProp'", *cp, ref=ref[0])
    except RuntimeError:
        pass
    w = best(RUNS, [PY, "-m", "cellfuncs.cli", "recalc", str(BOOK), "-o", os.path.join(d, "t.xlsx")])
    line("cellfuncs recalc tender_chp_2026-12-01.xlsx (cold; target 1.0 s)", *w, ref=ref[0])
    if DEMO.exists():
        w2 = best(RUNS, [PY, "-m", "cellfuncs.cli", "recalc", str(DEMO), "-o", os.path.join(d, "t2.xlsx")])
        line("cellfuncs recalc workbooks_demo/tender_chp.xlsx (cold; 1.5 s)", *w2, ref=ref[0])
    return w


def bench_cases(d):
    rng = random.Random(1)
    path = os.path.join(d, "cases.csv")
    with open(path, "w", newline="") as fh:
        wr = csv.writer(fh)
        wr.writerow(["t_amb", "rh_amb", "t_return", "t_flow"])
        for _ in range(1000):
            wr.writerow([round(rng.uniform(-5, 38), 1), round(rng.uniform(0.2, 0.95), 2),
                         rng.choice([55, 60, 65]), rng.choice([85, 90])])
    ref = best(RUNS, [PY, "-m", "cellfuncs.cli", "recalc", str(BOOK), "-o", os.path.join(d, "t.xlsx")])
    line("reference: one cold recalc of tender_chp_2026-12-01.xlsx", *ref)
    for workers in ("1", "2"):
        w = best(RUNS, [PY, "-m", "cellfuncs.cli", "cases", str(BOOK), path, "-o", os.path.join(d, "r.csv"),
                        "--workers", workers])
        line(f"cellfuncs cases: 1,000 cases, {workers} worker(s)" + ("; target 3 s" if workers == "2" else ""),
             *w, ref=ref[0])


def bench_cases_demo(d):
    """(no target) the same 1,000 rows over the current demo, whose inputs were renamed."""
    rng = random.Random(1)
    path = os.path.join(d, "cases_demo.csv")
    with open(path, "w", newline="") as fh:
        wr = csv.writer(fh)
        wr.writerow(["t_ambient", "rh_ambient", "t_water_in", "t_water_out"])
        for _ in range(1000):
            wr.writerow([round(rng.uniform(-5, 38), 1), round(rng.uniform(0.2, 0.95), 2),
                         rng.choice([55, 60, 65]), rng.choice([85, 90])])
    ref = best(RUNS, [PY, "-m", "cellfuncs.cli", "recalc", str(DEMO), "-o", os.path.join(d, "t.xlsx")])
    line("reference: one cold recalc of workbooks_demo/tender_chp.xlsx", *ref)
    for workers in ("1", "2"):
        w = best(RUNS, [PY, "-m", "cellfuncs.cli", "cases", str(DEMO), path, "-o", os.path.join(d, "r.csv"),
                        "--workers", workers])
        line(f"cases of the current demo: 1,000 cases, {workers} worker(s)", *w, ref=ref[0])


def big_book(path, n=40_000):
    """n built-in formula cells: ten per row (arithmetic, IF, ROUND, MAX, MIN, SQRT, SUM, a running sum)."""
    import openpyxl

    wb = openpyxl.Workbook()
    ws = wb.active
    ws.title = "S"
    for r in range(1, n // 10 + 1):
        ws.cell(r, 1, r * 0.5)
        for c, f in enumerate([f"=A{r}*2", f"=B{r}+A{r}", f"=IF(C{r}>100,C{r}-100,C{r})", f"=ROUND(D{r}/3,2)",
                               f"=MAX(A{r},E{r})", f"=MIN(B{r},F{r})", f"=SQRT(ABS(G{r}))", f"=H{r}^2+1",
                               f"=SUM(B{r}:I{r})", f"=K{r - 1}+J{r}" if r > 1 else "=J1"], start=2):
            ws.cell(r, c, f)
    wb.save(path)


def bench_big(d):
    path = os.path.join(d, "big40k.xlsx")
    big_book(path)
    ref = None
    soffice = shutil.which("soffice")
    if soffice:
        lo = os.path.join(d, "lo")
        os.makedirs(lo, exist_ok=True)
        ref = best(RUNS, [soffice, "--headless", "--convert-to", "xlsx", "--outdir", lo, path])
        line("reference: soffice --headless --convert-to xlsx (40,000 formulas)", *ref)
    w = best(RUNS, [PY, "-m", "cellfuncs.cli", "recalc", path, "-o", os.path.join(d, "big_out.xlsx")])
    line("cellfuncs recalc (40,000 formulas; target 1.5×, 500 MB)", *w, ref=ref[0] if ref else None)


def bench_ranges(d):
    import openpyxl

    wb = openpyxl.Workbook()
    ws = wb.active
    ws["A1"] = 1
    ws["C5"] = 2
    ws["B1"] = "=SUM(C1:L1000000)"
    p1 = os.path.join(d, "sum.xlsx")
    wb.save(p1)
    wb = openpyxl.Workbook()
    ws = wb.active
    for r in range(1, 200):
        for c in range(1, 7):
            ws.cell(r, c, r * c)
    for i in range(10):
        col = "ABCDEF"[i % 6]
        ws.cell(1, 8 + i, f"=SUM({col}:{col})+VLOOKUP({i + 1},A:F,2,FALSE)")
    p2 = os.path.join(d, "cols.xlsx")
    wb.save(p2)
    ref = best(RUNS, [PY, "-m", "cellfuncs.cli", "recalc", str(BOOK), "-o", os.path.join(d, "t.xlsx")])
    line("reference: cold recalc of tender_chp_2026-12-01.xlsx", *ref)
    for label, p in (("=SUM(C1:L1000000), 5 KB book", p1), ("ten whole-column references", p2)):
        w = best(RUNS, [PY, "-m", "cellfuncs.cli", "recalc", p, "-o", os.path.join(d, "o.xlsx")])
        line(f"recalc: {label} ({os.path.getsize(p) // 1024} KB; 2 s, 300 MB)", *w, ref=ref[0])


def main(argv):
    global RUNS
    if argv[:1] == ["-n"]:
        RUNS, argv = int(argv[1]), argv[2:]
    todo = argv or ["tender", "cases", "big", "sum"]
    d = tempfile.mkdtemp(prefix="bench-recalc-")
    try:
        for name in todo:
            {"tender": bench_tender, "cases": bench_cases, "cases-demo": bench_cases_demo, "big": bench_big,
             "sum": bench_ranges, "cols": bench_ranges}[name](d)
    finally:
        shutil.rmtree(d, ignore_errors=True)


if __name__ == "__main__":
    main(sys.argv[1:])
