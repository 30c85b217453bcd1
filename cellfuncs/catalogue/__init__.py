"""The one list of cell functions; everything a cell user sees comes from here.

Each family keeps its entries in its own module (``catalogue/hx.py``,
``catalogue/gas.py``, ...) as a list ``ENTRIES``; this package joins them in
:data:`FAMILIES` order.  ``cellfuncs.excel``, ``cellfuncs.headless``,
``cellfuncs functions`` and ``docs/functions.md`` are all generated from
:func:`entries`.
"""

from __future__ import annotations

import importlib

from cellfuncs.catalogue.spec import REQUIRED, Arg, CellFunction

__all__ = ["REQUIRED", "Arg", "CellFunction", "FAMILIES", "entries", "by_name"]

#: family modules, in the order functions are listed in the docs
FAMILIES = ("general", "hx", "gas", "gas_mn", "chargeair", "knock", "recovery", "plant", "steam", "site", "emissions")

_CACHE: dict = {}


def entries() -> tuple:
    """All catalogue entries, in family order (cached)."""
    if "all" not in _CACHE:
        from dataclasses import replace

        from cellfuncs.catalogue.examples import EXAMPLES

        out = []
        for fam in FAMILIES:
            mod = importlib.import_module(f"cellfuncs.catalogue.{fam}")
            # entries that give no example inline take the one in catalogue/examples.py
            out.extend(replace(e, example=EXAMPLES[e.name]) if not e.example and e.name in EXAMPLES else e
                       for e in mod.ENTRIES)
        names = [e.name.upper() for e in out]
        dupes = {n for n in names if names.count(n) > 1}
        if dupes:
            raise RuntimeError(f"duplicate catalogue names: {sorted(dupes)}")
        _CACHE["all"] = tuple(out)
    return _CACHE["all"]


def by_name(name: str) -> CellFunction:
    """The entry with this Excel name (case-insensitive)."""
    if "map" not in _CACHE:
        _CACHE["map"] = {e.name.upper(): e for e in entries()}
    return _CACHE["map"][name.upper()]
