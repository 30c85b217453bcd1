"""The headless side: the catalogue's functions in a formula engine, ``recalc`` and ``cases``.

Modules, one job each:

* :mod:`~cellfuncs.headless.engine` — the formula engine (``formualizer``): how our
  functions are registered and called, values in and out, and every workaround
  for what the engine does not do by itself;
* :mod:`~cellfuncs.headless.values` — the engine's values in and out, the callback
  that calls a catalogue function;
* :mod:`~cellfuncs.headless.formula_text` — formula text for the engine (omitted
  arguments, add-in prefixes, links to other workbooks) and what a formula refers to;
* :mod:`~cellfuncs.headless.book` — what the engine needs from a package (read only);
* :mod:`~cellfuncs.headless.limits` — budgets (cells present, cells referenced, memory);
* :mod:`~cellfuncs.headless.recalculation` — ``cellfuncs recalc``;
* :mod:`~cellfuncs.headless.cases` — ``cellfuncs cases``;
* :mod:`~cellfuncs.headless.files` — output checks shared by both commands.

Reading and writing the package itself is :mod:`cellfuncs.headless.package`.  Importing this
package imports neither the engine nor any physics.
"""

from __future__ import annotations

from cellfuncs.headless.package import BookError

from .recalculation import Recalc, key_text, recalc, write_with_cached_values

__all__ = ["register", "recalc", "Recalc", "BookError", "write_with_cached_values", "key_text",
           "engine_error", "is_engine_error", "engine_error_message", "INTERNAL_ERRORS"]


def register() -> None:
    """Import the engine (functions are registered on each workbook the engine loads)."""
    from . import engine

    engine.fz()


def _make(entry):
    """The engine callback of one catalogue entry (as registered; for tests)."""
    from .engine import make_callback

    return make_callback(entry)


def engine_error(code: str, message: str = ""):
    from .engine import engine_error as make

    return make(code, message)


def is_engine_error(v) -> bool:
    from .engine import is_engine_error as check

    return check(v)


def engine_error_message(v) -> str:
    from .engine import engine_error_message as text

    return text(v)


def __getattr__(name):
    if name == "INTERNAL_ERRORS":
        from .engine import INTERNAL_ERRORS

        return INTERNAL_ERRORS
    raise AttributeError(name)
