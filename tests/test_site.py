"""Site conditions and declared tables: SITE_PRESSURE, TABLE_INTERP, TABLE_INTERP2.

Outside sources: the ISO 2533:1975 standard-atmosphere table (tests/vectors/site.csv),
fluids 1.3 ``ATMOSPHERE_1976`` (U.S. Standard Atmosphere 1976, equal to ISO 2533
below 32 km, taking geometric altitude), ``numpy.interp`` and scipy's
``RegularGridInterpolator(method="linear")`` on random tables.
"""

from __future__ import annotations

import math

import numpy as np
import pytest
from hypothesis import assume, given, settings
from hypothesis import strategies as st

from vectors import approx, params

from cellfuncs import excel
from cellfuncs.errors import CellInputError, CellTypeError
from cellfuncs.site.atmosphere import site_pressure
from cellfuncs import adapt, catalogue


def _cell(name):
    """The catalogue function NAME as a cell calls it (the shared adapter reads the ranges)."""
    entry = catalogue.by_name(name)
    return lambda *values: adapt.call(entry, values)


# the tests below are about ranges as cells hold them (layout, trailing blanks): through the adapter
table_interp, table_interp2 = _cell("TABLE_INTERP"), _cell("TABLE_INTERP2")

R_EARTH = 6356766.0  # m, ISO 2533 radius for geopotential altitude


def col(values):
    return tuple((v,) for v in values)


# ---- SITE_PRESSURE -----------------------------------------------------------------------

@pytest.mark.parametrize("row", params("site", "SITE_PRESSURE"))
def test_site_pressure_vectors(row):
    assert excel.SITE_PRESSURE(row["altitude_m"]) == approx(row)


@pytest.mark.parametrize("h", [-500.0, 0.0, 250.0, 1000.0, 1234.5, 2500.0, 4000.0, 5000.0])
def test_site_pressure_vs_us_standard_atmosphere(h):
    """Source: fluids 1.3 fluids.atmosphere.ATMOSPHERE_1976(Z).P at Z = r·H/(r − H) (U.S. Standard Atmosphere 1976 = ISO 2533 below 32 km)."""
    from fluids.atmosphere import ATMOSPHERE_1976

    z = R_EARTH * h / (R_EARTH - h)
    assert site_pressure(h) * 1e5 == pytest.approx(ATMOSPHERE_1976(z).P, rel=1e-6)


@pytest.mark.parametrize("h", [500.0, 1000.0, 2000.0, 3500.0, 5000.0])
def test_geopotential_vs_geometric_under_0p1_percent(h):
    """Source: fluids 1.3 ATMOSPHERE_1976 at the geometric height h (what the help promises: under 0.1 %)."""
    from fluids.atmosphere import ATMOSPHERE_1976

    assert abs(site_pressure(h) * 1e5 / ATMOSPHERE_1976(h).P - 1.0) < 1e-3


@given(st.floats(-500.0, 4999.0))
def test_site_pressure_falls_with_altitude(h):
    assert site_pressure(h + 1.0) < site_pressure(h)


@pytest.mark.parametrize("h", [-500.01, 5000.01, 11000.0, -1e9])
def test_site_pressure_refuses_outside_range(h):
    with pytest.raises(CellInputError, match=r"altitude_m: .* (below -500|above 5000) m"):
        site_pressure(h)


def test_site_pressure_text_is_value_error():
    assert excel.SITE_PRESSURE("high").startswith("#VALUE! altitude_m")


# ---- TABLE_INTERP ------------------------------------------------------------------------

def test_table_interp_knots_and_midpoints():
    xs, ys = col([0.0, 1000.0, 2000.0]), col([1.0, 0.96, 0.89])
    assert table_interp(1000.0, xs, ys) == 0.96
    assert table_interp(1500.0, xs, ys) == pytest.approx(0.925, rel=1e-15)
    assert table_interp(0.0, xs, ys) == 1.0 and table_interp(2000.0, xs, ys) == 0.89


def test_table_interp_trailing_blanks_and_row_layout():
    xs = ((0.0,), (10.0,), (None,), (None,))
    ys = ((5.0,), (7.0,), (None,), ("",))
    assert table_interp(5.0, xs, ys) == 6.0
    assert table_interp(5.0, ((0.0, 10.0, None),), ((5.0, 7.0, None),)) == 6.0
    assert excel.TABLE_INTERP(5.0, [[0.0], [10.0], [None]], [[5.0], [7.0], [None]]) == 6.0


def test_core_takes_plain_numbers():
    """The cores take sequences of floats (the adapter reads the ranges); hand arithmetic, common
    practice: halfway between 0.96 and 0.89 is 0.925; the grid's centre is the mean of its corners."""
    from cellfuncs.site import tables

    assert tables.table_interp(1500.0, [0.0, 1000.0, 2000.0], [1.0, 0.96, 0.89]) == pytest.approx(0.925)
    assert tables.table_interp2(0.5, 0.5, (0.0, 1.0), (0.0, 1.0), ((1.0, 2.0), (3.0, 4.0))) == 2.5
    with pytest.raises(CellInputError, match="^x_values: row 3 .* does not increase"):
        tables.table_interp(1.0, [0.0, 1.0, 1.0], [1.0, 2.0, 3.0])


def test_table_interp_decreasing_axis():
    assert table_interp(25.0, col([40.0, 30.0, 20.0]), col([0.9, 0.95, 1.0])) == pytest.approx(0.975)


@pytest.mark.parametrize("xs, msg", [
    ([0.0, 10.0, 10.0], r"x_values: row 3 \(10\) does not increase from row 2 \(10\)"),
    ([0.0, 10.0, 5.0, 20.0], r"x_values: row 3 \(5\) does not increase from row 2"),
    ([30.0, 20.0, 25.0], r"x_values: row 3 \(25\) does not decrease from row 2"),
])
def test_table_interp_refuses_non_monotonic_naming_row(xs, msg):
    with pytest.raises(CellInputError, match=msg):
        table_interp(1.0, col(xs), col([1.0] * len(xs)))


@pytest.mark.parametrize("x", [-0.001, 20.001, 1e9])
def test_table_interp_refuses_extrapolation_naming_range(x):
    with pytest.raises(CellInputError, match=r"x: .* outside the table's range 0 to 20 \(x_values"):
        table_interp(x, col([0.0, 10.0, 20.0]), col([1.0, 2.0, 3.0]))


@pytest.mark.parametrize("xs, ys, err, msg", [
    (((0.0,), (None,), (2.0,)), col([1, 2, 3]), CellInputError, r"x_values: row 2 is blank inside"),
    (col([0.0, "ten"]), col([1.0, 2.0]), CellTypeError, r"x_values: row 2 holds 'ten'"),
    (col([0.0, True]), col([1.0, 2.0]), CellTypeError, r"x_values: row 2"),
    (col([0.0, 1.0, 2.0]), col([1.0, 2.0]), CellInputError, r"y_values: 2 values beside 3 x_values"),
    (col([0.0]), col([1.0]), CellInputError, r"x_values: 1 value; a table needs at least two"),
    (((0.0, 1.0), (2.0, 3.0)), col([1.0, 2.0]), CellInputError, r"x_values: a range of 2 rows and 2"),
    (col([None, None]), col([1.0]), CellInputError, r"x_values: the range holds only blanks"),
    (col([0.0, 1.0]), ((1.0,), (None,)), CellInputError, r"y_values: 1 value beside 2"),
])
def test_table_interp_refusals(xs, ys, err, msg):
    with pytest.raises(err, match=msg):
        table_interp(0.5, xs, ys)


finite = st.floats(-1e6, 1e6, allow_nan=False)


@st.composite
def tables(draw, n_min=2, n_max=12):
    xs = sorted(set(draw(st.lists(finite, min_size=n_min, max_size=n_max))))
    assume(len(xs) >= 2 and min(np.diff(xs)) > 1e-6 * (1.0 + max(abs(xs[0]), abs(xs[-1]))))
    if draw(st.booleans()):
        xs = xs[::-1]
    ys = draw(st.lists(finite, min_size=len(xs), max_size=len(xs)))
    return xs, ys


@settings(max_examples=300)
@given(tables(), st.floats(0.0, 1.0))
def test_table_interp_matches_numpy_interp(tab, frac):
    """Source: numpy.interp (linear interpolation of an increasing table)."""
    xs, ys = tab
    lo, hi = min(xs), max(xs)
    x = lo + frac * (hi - lo)
    x = min(max(x, lo), hi)
    order = np.argsort(xs)
    want = float(np.interp(x, np.asarray(xs)[order], np.asarray(ys)[order]))
    got = table_interp(x, col(xs), col(ys))
    scale = max(abs(v) for v in ys) + 1.0
    assert abs(got - want) <= 1e-9 * scale


@given(tables())
def test_table_interp_reproduces_knots(tab):
    xs, ys = tab
    for x, y in zip(xs, ys):
        assert table_interp(x, col(xs), col(ys)) == y


@given(tables(), st.floats(0.0, 1.0))
def test_table_interp_stays_between_neighbours(tab, frac):
    xs, ys = tab
    x = min(max(xs), min(xs) + frac * (max(xs) - min(xs)))  # rounding may step past the last knot
    got = table_interp(x, col(xs), col(ys))
    assert min(ys) - 1e-9 <= got <= max(ys) + 1e-9


# ---- TABLE_INTERP2 -----------------------------------------------------------------------

@st.composite
def grids(draw):
    xs, _ = draw(tables(n_max=6))
    ys, _ = draw(tables(n_max=6))
    z = [[draw(finite) for _ in ys] for _ in xs]
    return xs, ys, z


@settings(max_examples=300)
@given(grids(), st.floats(0.0, 1.0), st.floats(0.0, 1.0))
def test_table_interp2_matches_scipy(grid, fx, fy):
    """Source: scipy.interpolate.RegularGridInterpolator(method="linear") on the same grid."""
    from scipy.interpolate import RegularGridInterpolator

    xs, ys, z = grid
    x = min(xs) + fx * (max(xs) - min(xs))
    y = min(ys) + fy * (max(ys) - min(ys))
    x, y = min(max(x, min(xs)), max(xs)), min(max(y, min(ys)), max(ys))
    zi = np.asarray(z)
    ax, ay = np.asarray(xs), np.asarray(ys)
    if ax[0] > ax[-1]:
        ax, zi = ax[::-1], zi[::-1, :]
    if ay[0] > ay[-1]:
        ay, zi = ay[::-1], zi[:, ::-1]
    want = float(RegularGridInterpolator((ax, ay), zi, method="linear")([[x, y]])[0])
    got = table_interp2(x, y, col(xs), (tuple(ys),), tuple(tuple(r) for r in z))
    scale = max(abs(v) for r in z for v in r) + 1.0
    assert abs(got - want) <= 1e-9 * scale


@given(grids())
def test_table_interp2_grid_points_and_lines(grid):
    xs, ys, z = grid
    zt = tuple(tuple(r) for r in z)
    for i, x in enumerate(xs):
        for j, y in enumerate(ys):
            assert table_interp2(x, y, col(xs), (tuple(ys),), zt) == z[i][j]
    # along a grid row the result is the 1-D interpolation of that row
    ymid = 0.5 * (ys[0] + ys[1])
    assert table_interp2(xs[0], ymid, col(xs), (tuple(ys),), zt) == pytest.approx(
        table_interp(ymid, col(ys), col(z[0])), rel=1e-12, abs=1e-9)


def test_table_interp2_spare_rows_and_columns():
    xs = ((0.0,), (1000.0,), (None,))
    ys = ((25.0, 35.0, None),)
    z = ((1.0, 0.9, None), (0.9, 0.8, None), (None, None, None))
    assert table_interp2(500.0, 30.0, xs, ys, z) == pytest.approx(0.9)
    assert excel.TABLE_INTERP2(500.0, 30.0, [[0.0], [1000.0]], [[25.0, 35.0]],
                               [[1.0, 0.9], [0.9, 0.8]]) == pytest.approx(0.9)


@pytest.mark.parametrize("x, y, xs, ys, z, msg", [
    (5.0, 30.0, col([0.0, 10.0]), ((25.0, 35.0),), ((1.0, 2.0),), r"table: 1 row\(s\), x_values has 2"),
    (5.0, 30.0, col([0.0, 10.0]), ((25.0, 35.0),), ((1.0, 2.0), (3.0, None)),
     r"table: row 2, column 2 is blank"),
    (5.0, 30.0, col([0.0, 10.0]), ((25.0, 35.0),), ((1.0, 2.0, 9.0), (3.0, 4.0, None)),
     r"table: row 1 holds values beyond column 2"),
    (5.0, 30.0, col([0.0, 10.0]), ((25.0, 35.0),), ((1.0, 2.0), (3.0, 4.0), (5.0, 6.0)),
     r"table: row 3 holds values but x_values has only 2"),
    (5.0, 40.0, col([0.0, 10.0]), ((25.0, 35.0),), ((1.0, 2.0), (3.0, 4.0)),
     r"y: 40 is outside the table's range 25 to 35 \(y_values"),
    (11.0, 30.0, col([0.0, 10.0]), ((25.0, 35.0),), ((1.0, 2.0), (3.0, 4.0)),
     r"x: 11 is outside the table's range 0 to 10 \(x_values"),
    (5.0, 30.0, col([0.0, 10.0]), ((35.0, 35.0),), ((1.0, 2.0), (3.0, 4.0)),
     r"y_values: column 2 \(35\) does not decrease|y_values: column 2 \(35\) does not increase"),
    (5.0, 30.0, col([0.0, 10.0]), ((25.0, 35.0),), ((1.0, "x"), (3.0, 4.0)),
     r"table: row 1, column 2 holds 'x'"),
])
def test_table_interp2_refusals(x, y, xs, ys, z, msg):
    with pytest.raises((CellInputError, CellTypeError), match=msg):
        table_interp2(x, y, xs, ys, z)


def test_huge_span_stays_finite():
    got = table_interp(0.0, col([-1e308, 1e308]), col([-1e308, 1e308]))
    assert math.isfinite(got) and abs(got) < 1e293
