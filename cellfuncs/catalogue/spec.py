"""The data types of the catalogue: one :class:`CellFunction` per cell function.

A catalogue entry says everything a cell user sees: the Excel name, the
category, a one-line description (<= 255 characters, Excel's limit), the
arguments with their unit, help text, default and allowed words, and what is
returned.  The core callable is named by a dotted path (``"pkg.mod:func"``) and
imported on first use, so building the catalogue imports no physics.

Argument kinds
--------------
``number``   a real number; the adapters reject text (empty text ``""``
             included), booleans, NaN.  An omitted argument or a blank cell
             means "use the default".
``integer``  a number that must be whole (pole pairs, stage index).
``option``   one word from ``options`` (case-insensitive, spaces ignored;
             ``aliases`` maps more words onto them).  Omitted, a blank, ``""``
             or ``0`` means "use the default" (LibreOffice Calc hands a
             reference to an empty cell over as 0).
``text``     free text (a unit name, a reference condition ``"15/15"``).
``range``    a block of cells: the core receives a tuple of rows, each a tuple
             of cells; a cell is a float, a str or ``None`` (blank).
``stages``   one row or one column of numbers, one per stage; a blank is a
             stage with nothing in it.  The core receives a tuple of floats and
             ``None``; a 1-D result of an ``array`` function is laid out like
             the function's first ``stages`` argument (a row or a column).
``words``    one row or one column of words (stage kinds); the core receives a
             tuple of stripped texts and ``None`` (blank).
``numbers``  every number of a block of any shape (heat flows to add up),
             blanks skipped; the core receives a tuple of floats.
``axis``     one row or one column of numbers of a declared table, trailing
             blanks dropped, a blank inside refused; the core receives a tuple
             of floats.
``table``    a block of numbers; the core receives a tuple of rows of floats
             and ``None`` (blank).
             For all five, text or a logical value where a number belongs is
             refused naming the argument and the cell; a block where one row
             or one column is wanted is refused.
``reference`` a number or a text: reference conditions ``"t1/t2"`` or, as a
             number, the metering temperature alone (GAS_Z, GAS_DENSITY,
             GAS_REL_DENSITY); the core receives a float or the stripped text.

A gas analysis (the glossary's ``components`` + ``amounts``) is parsed once,
at the cell boundary (:mod:`cellfuncs.adapt`), never by the physics:

``gas``      the component names: a range of names, or a two-column range of
             names and amounts when the following ``amounts`` is left empty.
             The core receives one parsed
             :class:`~cellfuncs.gas.composition.Composition` in this position
             (``None`` when the argument is optional and blank).
``amounts``  the amounts belonging to the ``gas`` argument just before it
             (mol% or mole fractions).  Consumed by the parse: this position
             is NOT passed to the core, so the core has one argument fewer.
``amount_uncertainties``  standard uncertainties of the amounts, same shape
             and unit; the core receives ``{component id: uncertainty as a
             mole fraction}`` (scaled by the same normalisation as the amounts).
"""

from __future__ import annotations

import importlib
from dataclasses import dataclass, field
from typing import Any, Callable

__all__ = ["REQUIRED", "Arg", "CellFunction", "KINDS", "RANGE_KINDS"]


class _Required:
    def __repr__(self) -> str:  # pragma: no cover - cosmetic
        return "REQUIRED"


REQUIRED: Any = _Required()
KINDS = ("number", "integer", "option", "text", "range", "reference", "gas", "amounts",
         "amount_uncertainties", "stages", "words", "numbers", "axis", "table")

#: kinds that take a block of cells (xlwings hands them over as 2-D lists)
RANGE_KINDS = frozenset(("range", "gas", "amounts", "amount_uncertainties", "stages", "words", "numbers",
                         "axis", "table"))


@dataclass(frozen=True)
class Arg:
    """One argument of a cell function.

    Parameters
    ----------
    name : str
        snake_case name, also the Excel argument name (a valid VBA identifier).
    help : str
        One sentence for Excel's function wizard; the unit is appended.
    unit : str
        Unit at the cell boundary: ``"°C"``, ``"K"``, ``"bar(a)"``, ``"kW"``,
        ``"kg/h"``, ``"m³/h"``, ``"kW/K"``, ``"W/(m²·K)"``, ``"m²"``, ``"-"``;
        empty for option, text and range arguments.
    kind : str
        One of :data:`KINDS`.
    default : object
        :data:`REQUIRED`, or the value used when the argument is omitted or
        its cell is blank.  ``None``
        is allowed and means "the core decides" (documented in ``help``).
    options : tuple of str
        Allowed words for ``option`` arguments (lower case, canonical).
    aliases : dict
        More accepted words -> canonical option word.
    """

    name: str
    help: str
    unit: str = ""
    kind: str = "number"
    default: Any = REQUIRED
    options: tuple = ()
    aliases: dict = field(default_factory=dict)

    @property
    def optional(self) -> bool:
        return self.default is not REQUIRED

    def full_help(self) -> str:
        """Help text with unit and, for options, the allowed words."""
        text = self.help.rstrip(".")
        if self.kind == "option":
            text += ": " + ", ".join(f'"{o}"' for o in self.options)
        if self.unit:
            text += f" [{self.unit}]"
        if self.optional and self.default is not None:
            d = f'"{self.default}"' if isinstance(self.default, str) else f"{self.default:g}"
            text += f" (default {d})"
        return text + "."


@dataclass(frozen=True)
class CellFunction:
    """One cell function of the catalogue.

    Parameters
    ----------
    name : str
        Excel name, DOMAIN_QUANTITY in capitals (``HX_LMTD``).
    target : str
        Dotted path of the core callable, ``"cellfuncs.heat_transfer.lmtd:lmtd"``.
        It is called positionally with the coerced arguments in catalogue order
        (an ``amounts`` argument is folded into the ``gas`` argument before it,
        so the core has one parameter fewer per gas analysis).
    category : str
        Function-wizard category, ``"cellfuncs · heat transfer"``.
    description : str
        One line, <= 255 characters.
    args : tuple of Arg
    returns : str
        What is returned, with its unit in brackets.
    shape : str
        ``"scalar"``; ``"row"`` or ``"column"`` when a 1-D result is returned
        (for an array formula); ``"array"`` when the core returns rows itself,
        or a 1-D list laid out like the first ``stages`` argument.
    example : tuple
        Optional: one valid set of argument values as a cell would pass them
        (ranges as lists of rows).  The reliability test mutates it one
        argument at a time; the docs show it.
    """

    name: str
    target: str
    category: str
    description: str
    args: tuple
    returns: str
    shape: str = "scalar"
    example: tuple = ()

    def resolve(self) -> Callable:
        """Import and return the core callable (cached per process)."""
        fn = _RESOLVED.get(self.target)
        if fn is None:
            module, _, attr = self.target.partition(":")
            fn = getattr(importlib.import_module(module), attr)
            _RESOLVED[self.target] = fn
        return fn


_RESOLVED: dict = {}
