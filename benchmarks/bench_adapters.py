"""Per cell function: the Excel-module call vs the core call vs an empty function.

Every catalogue entry with an ``example`` is measured three ways in the same run:
``excel`` (``cellfuncs.excel.NAME(*example)``, what a cell costs), ``core`` (the
core callable with already-coerced arguments) and ``empty`` (a Python function
that takes the same arguments and returns 0.0).  tools/perf_report.py turns the
JSON into ratios for docs/performance.md.

    python -m pytest benchmarks/bench_adapters.py --benchmark-only --benchmark-json=bench.json
"""

import pytest

from cellfuncs import catalogue, excel
from cellfuncs.adapt import coerce_args

ENTRIES = [e for e in catalogue.entries() if e.example]


def _empty(*args):
    return 0.0


@pytest.mark.parametrize("entry", ENTRIES, ids=[e.name for e in ENTRIES])
def test_excel(benchmark, entry):
    benchmark.group = entry.name
    fn = getattr(excel, entry.name)
    res = benchmark(fn, *entry.example)
    assert not (isinstance(res, str) and res.startswith("#")), res


@pytest.mark.parametrize("entry", ENTRIES, ids=[e.name for e in ENTRIES])
def test_core(benchmark, entry):
    benchmark.group = entry.name
    args = coerce_args(entry, entry.example)
    benchmark(entry.resolve(), *args)


@pytest.mark.parametrize("entry", ENTRIES, ids=[e.name for e in ENTRIES])
def test_empty(benchmark, entry):
    benchmark.group = entry.name
    benchmark(_empty, *entry.example)
