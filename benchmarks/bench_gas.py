"""GAS_CV on a 12-component gas: the Excel-module call vs a CoolProp HEOS mixture vs an empty call.

Targets (issue 3): >= 1000x faster than the CoolProp route, <= 20x the empty call with the same
arguments.  The CoolProp route computes the real-gas compression factor of the mixture with
``PropsSI('Z', 'T', 288.15, 'P', 101325, 'HEOS::...')`` and divides the ideal molar value by it,
which is what a sheet without cellfuncs would have to do for each cell.  ``excel_new_gas`` varies
the analysis on every call so the result cache cannot help (a sheet full of different gases).

    python -m pytest benchmarks/bench_gas.py --benchmark-only --benchmark-json=bench_gas.json
"""

import itertools

import pytest

from cellfuncs import excel

NAMES = [["methane"], ["ethane"], ["propane"], ["n-butane"], ["isobutane"], ["n-pentane"], ["isopentane"],
         ["n-hexane"], ["hydrogen"], ["nitrogen"], ["carbon dioxide"], ["oxygen"]]
AMOUNTS = [[88.0], [5.0], [1.6], [0.4], [0.35], [0.1], [0.1], [0.05], [1.0], [2.0], [1.3], [0.1]]
COOLPROP = ["Methane", "Ethane", "Propane", "n-Butane", "IsoButane", "n-Pentane", "Isopentane", "n-Hexane",
            "Hydrogen", "Nitrogen", "CarbonDioxide", "Oxygen"]


def _empty(components, fractions, kind, basis, ref):
    return 0.0


def _coolprop_cv():
    import CoolProp.CoolProp as CP

    from cellfuncs.gas import iso6976
    from cellfuncs.gas.composition import parse_composition

    comp = parse_composition(NAMES, AMOUNTS)
    hc = iso6976.molar_cv(comp, "gross", 15)  # kJ/mol, ideal
    fluid = "HEOS::" + "&".join(f"{n}[{a[0] / 100}]" for n, a in zip(COOLPROP, AMOUNTS))
    z = CP.PropsSI("Z", "T", 288.15, "P", 101325.0, fluid)
    return hc * 101325.0 / (z * 8.3144621 * 288.15) / 1000.0  # kJ/mol -> MJ/m³


def test_excel_cached(benchmark):
    benchmark.group = "GAS_CV 12 components"
    res = benchmark(excel.GAS_CV, NAMES, AMOUNTS, "gross", "volume", "15/15")
    assert res == pytest.approx(_coolprop_cv(), rel=1e-3)


def test_excel_new_gas(benchmark):
    benchmark.group = "GAS_CV 12 components"
    counter = itertools.count()

    def call():
        k = next(counter) % 100000
        amounts = [[88.0 - k * 1e-6]] + AMOUNTS[1:]
        return excel.GAS_CV(NAMES, amounts, "gross", "volume", "15/15")

    benchmark(call)


def test_empty(benchmark):
    benchmark.group = "GAS_CV 12 components"
    benchmark(_empty, NAMES, AMOUNTS, "gross", "volume", "15/15")


def test_coolprop_heos(benchmark):
    benchmark.group = "GAS_CV 12 components"
    benchmark.pedantic(_coolprop_cv, rounds=5, iterations=1)


def test_empty_udf_same_adapter(benchmark):
    """An empty function behind the same adapter (coercion of the same ranges), for the adapter's share."""
    from cellfuncs.adapt import coerce_args
    from cellfuncs.catalogue import by_name

    entry = by_name("GAS_CV")
    benchmark.group = "GAS_CV 12 components"

    def empty_udf(*values):
        coerce_args(entry, values)
        return 0.0

    benchmark(empty_udf, NAMES, AMOUNTS, "gross", "volume", "15/15")
