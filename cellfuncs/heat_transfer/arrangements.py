"""Flow-arrangement vocabulary shared by every heat-exchanger cell function.

One set of words names the flow arrangement everywhere (``HX_F``, ``HX_UA``,
``HX_AREA``, ``HX_EFFECTIVENESS``, ``HX_NTU``, ``HX_RATE``, the hot-water chain
``HW_CHAIN_RATE`` and any new family); ``HX_LMTD`` uses the first two only.
Every catalogue argument named ``arrangement`` takes its words and aliases
from here (``tests/test_glossary.py`` checks it).  This module holds the words, a few accepted aliases, the
phrases used in error messages and :func:`parse`.  It imports nothing heavy so
the catalogue may import it.

Words
-----
``counter``           pure counterflow
``parallel``          pure parallel flow (co-current)
``1-2`` ... ``4-8``   N shell passes with 2N (or more, even) tube passes;
                      N shells in series, each an ideal 1-2 shell with
                      an equal share of the total UA
``cross``             single-pass crossflow, both fluids unmixed
``cross-cmin-mixed``  single-pass crossflow, the fluid with the smaller
                      capacity rate mixed, the other unmixed
``cross-cmax-mixed``  single-pass crossflow, the fluid with the larger
                      capacity rate mixed, the other unmixed
"""

from __future__ import annotations

from cellfuncs.errors import CellTypeError

__all__ = [
    "ARRANGEMENTS",
    "FLOWS",
    "ALIASES",
    "SHELLS",
    "KNOWN",
    "RATE_OUTPUTS",
    "parse",
    "describe",
    "advice",
]

#: canonical arrangement words, in the order shown to the cell user
ARRANGEMENTS = (
    "counter",
    "parallel",
    "1-2",
    "2-4",
    "3-6",
    "4-8",
    "cross",
    "cross-cmin-mixed",
    "cross-cmax-mixed",
)

#: the two words HX_LMTD accepts
FLOWS = ("counter", "parallel")

#: further accepted words -> canonical word (lower case, no spaces)
ALIASES = {
    "counterflow": "counter",
    "countercurrent": "counter",
    "counter-current": "counter",
    "parallelflow": "parallel",
    "parallel-flow": "parallel",
    "cocurrent": "parallel",
    "co-current": "parallel",
    "crossflow": "cross",
    "cross-unmixed": "cross",
    "1-2n": "1-2",
    "2-4n": "2-4",
    "3-6n": "3-6",
    "4-8n": "4-8",
}

#: words of the ``result`` argument of HX_RATE
RATE_OUTPUTS = ("duty", "t_hot_out", "t_cold_out", "effectiveness", "all")

#: number of shell passes of the shell-and-tube words
SHELLS = {"1-2": 1, "2-4": 2, "3-6": 3, "4-8": 4}

_PHRASE = {
    "counter": "a counterflow exchanger",
    "parallel": "a parallel-flow exchanger",
    "1-2": "a 1-2 exchanger",
    "2-4": "a 2-4 exchanger",
    "3-6": "a 3-6 exchanger",
    "4-8": "a 4-8 exchanger",
    "cross": "a crossflow exchanger (both fluids unmixed)",
    "cross-cmin-mixed": "a crossflow exchanger with the Cmin fluid mixed",
    "cross-cmax-mixed": "a crossflow exchanger with the Cmax fluid mixed",
}

_ADVICE = {
    "counter": "lower the duty",
    "parallel": "use counterflow",
    "1-2": "use more shells",
    "2-4": "use more shells",
    "3-6": "use more shells",
    "4-8": "use more shells or counterflow",
    "cross": "use counterflow",
    "cross-cmin-mixed": "use unmixed crossflow or counterflow",
    "cross-cmax-mixed": "use unmixed crossflow or counterflow",
}

#: the canonical words as a set (fast membership test before :func:`parse`)
KNOWN = frozenset(ARRANGEMENTS)

_LOOKUP = {w: w for w in ARRANGEMENTS}
_LOOKUP.update(ALIASES)


def parse(word, name: str = "arrangement", allowed: tuple = ARRANGEMENTS) -> str:
    """Return the canonical arrangement word for ``word``.

    Parameters
    ----------
    word : str
        An arrangement word or alias; case and spaces are ignored.
    name : str
        Argument name for the error message.
    allowed : tuple of str
        Canonical words accepted here (:data:`FLOWS` for ``HX_LMTD``).

    Returns
    -------
    str
        One of ``allowed``.

    Raises
    ------
    CellTypeError
        For anything else (``#VALUE!``).
    """
    canon = _LOOKUP.get(word) if isinstance(word, str) else None
    if canon is None and isinstance(word, str):
        canon = _LOOKUP.get("".join(word.split()).lower())
    if canon is None or canon not in allowed:
        words = ", ".join(f'"{w}"' for w in allowed)
        raise CellTypeError(f"{name}: {word!r} is not one of {words}")
    return canon


def describe(arrangement: str) -> str:
    """Phrase for messages, e.g. ``"a 1-2 exchanger"``."""
    return _PHRASE[arrangement]


def advice(arrangement: str) -> str:
    """What to do when the arrangement cannot reach a duty."""
    return _ADVICE[arrangement]
