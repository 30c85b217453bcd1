"""Core HX calls vs the ht 1.2.0 equivalent vs an empty function (pytest-benchmark).

Run (not part of the default test run):

    cd <worktree> && /tmp/venv/bin/python -m pytest benchmarks/bench_hx_core.py \
        --benchmark-only --benchmark-group-by=group --benchmark-columns=min,median,mean,rounds

Each group times one function three ways with the same arguments:
``core`` (cellfuncs.heat_transfer), ``ht`` (the reference library's
equivalent) and ``empty`` (a do-nothing function taking the same arguments,
the floor of a Python call).  The Excel-adapter column is added by the lead.
"""

from __future__ import annotations

import pytest

ht = pytest.importorskip("ht")

from cellfuncs.heat_transfer.correction import correction_factor  # noqa: E402
from cellfuncs.heat_transfer.effectiveness import epsilon, transfer_units  # noqa: E402
from cellfuncs.heat_transfer.lmtd import lmtd  # noqa: E402


def _empty4(a, b, c, d, e="x"):
    return None


def _empty3(a, b, c="x"):
    return None


LMTD_ARGS = (100.0, 60.0, 30.0, 40.2)
F_ARGS = (130.0, 110.0, 15.0, 85.0)
E_ARGS = (2.0, 0.5)
N_ARGS = (0.7, 0.5)

CASES = [
    # group, kind, callable, args
    ("LMTD", "core", lmtd, LMTD_ARGS + ("counter",)),
    ("LMTD", "ht", ht.LMTD, LMTD_ARGS),
    ("LMTD", "empty", _empty4, LMTD_ARGS + ("counter",)),
    ("F 1-2", "core", correction_factor, F_ARGS + ("1-2",)),
    ("F 1-2", "ht", lambda *a: ht.F_LMTD_Fakheri(*a, shells=1), F_ARGS),
    ("F 1-2", "empty", _empty4, F_ARGS + ("1-2",)),
    ("F 2-4", "core", correction_factor, F_ARGS + ("2-4",)),
    ("F 2-4", "ht", lambda *a: ht.F_LMTD_Fakheri(*a, shells=2), F_ARGS),
    ("F 2-4", "empty", _empty4, F_ARGS + ("2-4",)),
]
for arr, sub, n in [("counter", "counterflow", None), ("1-2", "S&T", 1), ("2-4", "S&T", 2),
                    ("cross", "crossflow", None),
                    ("cross-cmin-mixed", "crossflow, mixed Cmin", None)]:
    CASES += [
        (f"eps {arr}", "core", epsilon, E_ARGS + (arr,)),
        (f"eps {arr}", "ht", (lambda s, k: lambda a, b: ht.effectiveness_from_NTU(
            a, b, s, n_shell_tube=k))(sub, n), E_ARGS),
        (f"eps {arr}", "empty", _empty3, E_ARGS + (arr,)),
        (f"ntu {arr}", "core", transfer_units, N_ARGS + (arr,)),
        (f"ntu {arr}", "ht", (lambda s, k: lambda a, b: ht.NTU_from_effectiveness(
            a, b, s, n_shell_tube=k))(sub, n), N_ARGS),
        (f"ntu {arr}", "empty", _empty3, N_ARGS + (arr,)),
    ]


@pytest.mark.parametrize("group,kind,fn,args", CASES,
                         ids=[f"{g}|{k}" for g, k, _, _ in CASES])
def test_bench(benchmark, group, kind, fn, args):
    benchmark.group = group
    benchmark.extra_info["kind"] = kind
    benchmark(fn, *args)
