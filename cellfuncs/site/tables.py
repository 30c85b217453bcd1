"""Linear interpolation in an engine's declared tables (derating, part load), as cells hold them.

A declared table is a column of x values (altitude, intake temperature, load,
methane number) beside a column of y values, or a grid with one axis down the
rows and one across the columns.  The rules are those an estimator expects
from a datasheet table:

* the axis values are strictly increasing or strictly decreasing; otherwise the
  error names the first row that breaks the order;
* no extrapolation: an x outside the table is an error naming the table's range
  (a datasheet says nothing beyond its last row);
* blanks at the end of a range are ignored, so a table may have spare rows;
  a blank inside the table is an error naming the row.

Interpolation is linear between neighbouring rows (bilinear in a grid: linear
along the rows, then along the columns).  At a tabulated point the tabulated
value is returned exactly.
"""

from __future__ import annotations

import math
from bisect import bisect_right

from cellfuncs.errors import CellInputError, CellTypeError, check_finite, fmt

__all__ = ["axis_values", "table_interp", "table_interp2"]


def _is_blank(c) -> bool:
    return c is None or (isinstance(c, str) and c.strip() == "")


def _number(name: str, where: str, c) -> float:
    if isinstance(c, bool) or not isinstance(c, (int, float)):
        raise CellTypeError(f"{name}: {where} holds {c!r}, not a number")
    if not math.isfinite(c):
        raise CellInputError(f"{name}: {where} holds {c}, not a finite number")
    return float(c)


def axis_values(name: str, values, monotonic: bool = True) -> tuple:
    """The values of a table axis (or of a column of tabulated values), checked.

    Parameters
    ----------
    name : str
        Argument name for the error messages.
    values : sequence of float
        The values in table order, trailing blanks already dropped (the cell
        adapter does that).  A sequence with ``layout == "row"`` (values read
        across a row) numbers its values as columns in the messages, otherwise
        as rows.
    monotonic : bool
        Require strictly increasing or strictly decreasing values (an axis).

    Returns
    -------
    values : tuple of float
        The values in order. [unit of the values]

    Raises
    ------
    CellInputError, CellTypeError
        A value that is not a finite number, fewer than two values (axes), an
        axis not strictly monotonic (naming the first offending row).

    References
    ----------
    .. [1] Common practice (reading a declared datasheet table).
    """
    word = "column" if getattr(values, "layout", None) == "row" else "row"
    vals = tuple(_number(name, f"{word} {i}", c) for i, c in enumerate(values, start=1))
    if not vals:
        raise CellInputError(f"{name}: the range holds only blanks")
    if monotonic:
        if len(vals) < 2:
            raise CellInputError(f"{name}: {len(vals)} value; a table needs at least two")
        up = vals[1] > vals[0]
        for i in range(1, len(vals)):
            if (vals[i] <= vals[i - 1]) if up else (vals[i] >= vals[i - 1]):
                trend = "increase" if up else "decrease"
                raise CellInputError(
                    f"{name}: {word} {i + 1} ({fmt(vals[i])}) does not {trend} from {word} {i} "
                    f"({fmt(vals[i - 1])}); values must be strictly increasing or strictly "
                    "decreasing")
    return vals


def _locate(name_x: str, x: float, name_xs: str, xs: tuple) -> tuple:
    """(i, t): x lies between xs[i] and xs[i+1] at fraction t (0 <= t <= 1)."""
    lo, hi = min(xs[0], xs[-1]), max(xs[0], xs[-1])
    if not lo <= x <= hi:
        raise CellInputError(f"{name_x}: {fmt(x)} is outside the table's range {fmt(lo)} to "
                             f"{fmt(hi)} ({name_xs}; no extrapolation)")
    up = xs[-1] > xs[0]
    key = xs if up else tuple(-v for v in xs)
    k = x if up else -x
    i = min(max(bisect_right(key, k) - 1, 0), len(xs) - 2)
    x0, x1 = xs[i], xs[i + 1]
    if x == x0:
        return i, 0.0
    if x == x1:
        return i, 1.0
    # halves keep a span such as -1e308 .. 1e308 finite; exact for normal numbers
    t = (0.5 * x - 0.5 * x0) / (0.5 * x1 - 0.5 * x0)
    return i, min(max(t, 0.0), 1.0)


def _lerp(y0: float, y1: float, t: float) -> float:
    if t == 0.0 or y0 == y1:
        return y0
    if t == 1.0:
        return y1
    d = y1 - y0
    if math.isfinite(d):
        return y0 + t * d
    return y0 * (1.0 - t) + y1 * t


def _finite(v: float, name: str) -> float:
    if not math.isfinite(v):  # pragma: no cover - guarded above; never a NaN in a cell
        raise CellInputError(f"{name}: the values are too large to interpolate")
    return v


def table_interp(x: float, x_values, y_values) -> float:
    """Linear interpolation in a declared table (no extrapolation).

    Parameters
    ----------
    x : float
        Where to read the table, inside the range of ``x_values``. [unit of x_values]
    x_values : sequence of float
        Strictly increasing or strictly decreasing values (in a cell: one
        column or row, trailing blanks dropped by the adapter). [any unit]
    y_values : sequence of float
        The tabulated values, same length. [any unit]

    Returns
    -------
    y : float
        y0 + (y1 − y0)·(x − x0)/(x1 − x0) between the neighbouring rows; the
        tabulated value at a tabulated x. [unit of y_values]

    Raises
    ------
    CellInputError
        x outside the table (message names the range); axis not strictly
        monotonic (names the first offending row); blank or text inside the
        values; lengths that differ.

    Notes
    -----
    Valid for any table of at least two rows.  A declared derating or
    part-load table is the engine's; between its rows the engine may not be
    linear, so keep the table's own steps.

    References
    ----------
    .. [1] Common practice (linear interpolation in a declared datasheet table).
    """
    xv = check_finite("x", x)
    xs = axis_values("x_values", x_values)
    ys = axis_values("y_values", y_values, monotonic=False)
    if len(ys) != len(xs):
        raise CellInputError(f"y_values: {len(ys)} value{'s' if len(ys) != 1 else ''} beside "
                             f"{len(xs)} x_values (trailing blanks ignored); give one y per x")
    i, t = _locate("x", xv, "x_values", xs)
    return _finite(_lerp(ys[i], ys[i + 1], t), "y_values")


def _grid(xs: tuple, ys: tuple, table) -> tuple:
    rows = tuple(tuple(r) for r in table)
    n, m = len(xs), len(ys)
    out = []
    for r, row in enumerate(rows, start=1):
        if r > n:
            if any(not _is_blank(c) for c in row):
                raise CellInputError(f"table: row {r} holds values but x_values has only {n}; "
                                     "give one table row per x value")
            continue
        if any(not _is_blank(c) for c in row[m:]):
            raise CellInputError(f"table: row {r} holds values beyond column {m}, but y_values "
                                 f"has only {m}; give one table column per y value")
        if len(row) < m:
            raise CellInputError(f"table: {len(row)} columns, y_values has {m} values")
        vals = []
        for c_i, c in enumerate(row[:m], start=1):
            if _is_blank(c):
                raise CellInputError(f"table: row {r}, column {c_i} is blank inside the table")
            vals.append(_number("table", f"row {r}, column {c_i}", c))
        out.append(tuple(vals))
    if len(out) < n:
        raise CellInputError(f"table: {len(out)} row(s), x_values has {n} values; give one table "
                             "row per x value")
    return tuple(out)


def table_interp2(x: float, y: float, x_values, y_values, table) -> float:
    """Bilinear interpolation in a declared grid (no extrapolation).

    Parameters
    ----------
    x : float
        Value on the row axis, inside the range of ``x_values``. [unit of x_values]
    y : float
        Value on the column axis, inside the range of ``y_values``. [unit of y_values]
    x_values : sequence of float
        The row axis: strictly monotonic values, one per table row. [any unit]
    y_values : sequence of float
        The column axis: strictly monotonic values, one per table column. [any unit]
    table : sequence of sequences of float or None
        The tabulated values, rows matching ``x_values`` and columns matching
        ``y_values``; blank (None) spare rows and columns at the end are
        ignored. [any unit]

    Returns
    -------
    z : float
        Linear along x between the neighbouring rows, then linear along y:
        (1−t)(1−u)·z00 + t(1−u)·z10 + (1−t)u·z01 + tu·z11. [unit of table]

    Raises
    ------
    CellInputError
        x or y outside its axis (names the range); an axis not strictly
        monotonic (names the first offending row); a blank or text in the grid
        (names row and column); shapes that do not match.

    Notes
    -----
    Valid for any grid of at least 2×2.  At a grid point the tabulated value is
    returned exactly; along a grid line the result equals 1-D interpolation.

    References
    ----------
    .. [1] Common practice (bilinear interpolation in a declared datasheet table).
    """
    xv = check_finite("x", x)
    yv = check_finite("y", y)
    xs = axis_values("x_values", x_values)
    ys = axis_values("y_values", y_values)
    grid = _grid(xs, ys, table)
    i, t = _locate("x", xv, "x_values", xs)
    j, u = _locate("y", yv, "y_values", ys)
    z0 = _lerp(grid[i][j], grid[i + 1][j], t)
    z1 = _lerp(grid[i][j + 1], grid[i + 1][j + 1], t)
    return _finite(_lerp(z0, z1, u), "table")
