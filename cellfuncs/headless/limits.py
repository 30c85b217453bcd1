"""Budgets of the headless engine: cells present, cells referenced, memory.

The package reader refuses parts that inflate too far (see :mod:`cellfuncs.headless.package`);
these budgets bound what the engine is asked to do with what is inside:

* at most :data:`MAX_PRESENT_CELLS` cells holding a value or formula in all sheets;
* at most :data:`MAX_REFERENCED_CELLS` cells referenced by all formulas together,
  each range clipped to the used area of its sheet in the engine's private copy
  (``SUM(C1:L1000000)`` on a sheet used down to row 5 counts 50 cells; a whole
  column counts the used rows);
* a MemoryError anywhere becomes one line (exit 2); the engine works in memory,
  so no temporary file is left behind.
"""

from __future__ import annotations

import contextlib

from cellfuncs.headless.package import BookError

__all__ = ["MAX_PRESENT_CELLS", "MAX_REFERENCED_CELLS", "check_present", "check_referenced", "guard"]

#: cells with a value or formula the engine is given (all sheets together)
MAX_PRESENT_CELLS = 5_000_000
#: cells all formulas reference together, ranges clipped to each sheet's used area
MAX_REFERENCED_CELLS = 200_000_000


def check_present(book):
    n = sum(len(c) for c in book.cells.values())
    if n > MAX_PRESENT_CELLS:
        raise BookError(f"the workbook holds {n:,} cells, more than the {MAX_PRESENT_CELLS:,} "
                        "the headless engine computes")


def check_referenced(model):
    n = model.referenced_cells
    if n > MAX_REFERENCED_CELLS:
        raise BookError(f"the formulas reference {n:,} cells (ranges clipped to the used area), more than "
                        f"the {MAX_REFERENCED_CELLS:,} the headless engine computes")


@contextlib.contextmanager
def guard():
    """Turn running out of memory into one line."""
    try:
        yield
    except MemoryError:
        raise BookError("out of memory while computing the workbook (it is too large for this "
                        "machine; see the limits in docs/headless.md)") from None
