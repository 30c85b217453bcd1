"""Small helpers for range arguments of the recovery family.

A range arrives from the adapters as a tuple of rows, each a tuple of cells
(float, str or None for blank).  Stage lists (duties, hot-side data) must be a
single row or a single column; results are laid out the same way.  A flat
sequence of numbers (a direct Python call) is accepted too.
"""

from __future__ import annotations

import math

from cellfuncs.errors import CellInputError, CellTypeError

__all__ = ["stage_cells", "layout", "numbers", "sum_cells"]


def _is_seq(v) -> bool:
    return isinstance(v, (tuple, list))


def stage_cells(name: str, rng) -> tuple:
    """Cells of a one-row or one-column range, in order, and its layout.

    Parameters
    ----------
    name : str
        Argument name for error messages.
    rng : tuple of tuples, sequence or number
        The range as the adapters hand it over.

    Returns
    -------
    tuple
        ``(cells, layout)``: a list of float or None (blank), and ``"row"``,
        ``"column"`` or ``"flat"`` (a plain sequence or number was given).

    Raises
    ------
    CellTypeError
        A block with more than one row and column, or a text cell.
    """
    if rng is None:
        raise CellTypeError(f"{name}: no cells given; select one row or one column")
    if isinstance(rng, (int, float)) and not isinstance(rng, bool):
        rows, lay = [[rng]], "flat"
    elif _is_seq(rng) and all(not _is_seq(c) for c in rng):
        rows, lay = [list(rng)], "flat"
    elif _is_seq(rng) and all(_is_seq(r) for r in rng):
        rows = [list(r) for r in rng]
        n_rows, n_cols = len(rows), max((len(r) for r in rows), default=0)
        if n_rows == 0 or n_cols == 0:
            raise CellTypeError(f"{name}: no cells given; select one row or one column")
        if n_rows > 1 and n_cols > 1:
            raise CellTypeError(
                f"{name}: a {n_rows}×{n_cols} block was given; select one row or one column")
        lay = "row" if n_rows == 1 else "column"
    else:
        raise CellTypeError(f"{name}: {rng!r} is not a range of numbers")
    flat = [c for r in rows for c in r]
    if lay == "column":
        flat = [r[0] if r else None for r in rows]
    cells = []
    for i, c in enumerate(flat, start=1):
        if c is None or (isinstance(c, str) and c.strip() == ""):
            cells.append(None)
        elif isinstance(c, bool) or not isinstance(c, (int, float)):
            raise CellTypeError(f"{name}: cell {i} {c!r} is not a number")
        elif not math.isfinite(c):
            raise CellInputError(f"{name}: cell {i} {c} is not a finite number")
        else:
            cells.append(float(c))
    if not cells:
        raise CellTypeError(f"{name}: no cells given; select one row or one column")
    return cells, lay


def layout(values: list, lay: str):
    """Lay a 1-D result out like the input range: row -> [[...]], column -> [[a], [b]]."""
    if lay == "row":
        return [list(values)]
    if lay == "column":
        return [[v] for v in values]
    return list(values)


def numbers(name: str, rng) -> list:
    """All non-blank numbers of a range of any shape (blanks skipped)."""
    if isinstance(rng, (int, float)) and not isinstance(rng, bool):
        flat = [rng]
    elif _is_seq(rng):
        flat = []
        for r in rng:
            flat.extend(r if _is_seq(r) else [r])
    else:
        raise CellTypeError(f"{name}: {rng!r} is not a range of numbers")
    out = []
    for i, c in enumerate(flat, start=1):
        if c is None or (isinstance(c, str) and c.strip() == ""):
            continue
        if isinstance(c, bool) or not isinstance(c, (int, float)):
            raise CellTypeError(f"{name}: cell {i} {c!r} is not a number")
        if not math.isfinite(c):
            raise CellInputError(f"{name}: cell {i} {c} is not a finite number")
        out.append(float(c))
    return out


def sum_cells(name: str, rng) -> float:
    """Sum of the non-blank numbers of a range (blanks skipped)."""
    return math.fsum(numbers(name, rng))
