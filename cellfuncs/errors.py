"""Errors raised at the cell boundary and a small helper to check ranges.

Every error a cell user can cause is a :class:`CellInputError` whose message is
one line naming the argument, the value received and what is valid.  The
adapters turn it into an Excel error value: ``#NUM!`` for a number outside its
range or an infeasible case, ``#VALUE!`` for a value of the wrong kind (text
where a number is needed, an unknown option word).
"""

from __future__ import annotations

import math

__all__ = [
    "CellInputError",
    "CellTypeError",
    "check_range",
    "check_finite",
    "fmt",
    "UsageError",
]


class UsageError(Exception):
    """Unusable command-line input (missing file, bad --set): one line, exit code 2."""


class CellInputError(ValueError):
    """A cell input the function cannot use; ``excel_error`` is ``#NUM!``.

    Parameters
    ----------
    message : str
        One line: argument name, value received, what is valid.
    """

    excel_error = "#NUM!"

    def __init__(self, message: str):
        message = " ".join(str(message).split())  # always one line
        super().__init__(message)

    @property
    def message(self) -> str:
        return self.args[0]

    def cell_text(self) -> str:
        """The text shown in an Excel cell, e.g. ``#NUM! c_ratio: 1.4 is above 1``."""
        return f"{self.excel_error} {self.message}"


class CellTypeError(CellInputError):
    """A value of the wrong kind (text for a number, unknown option); ``#VALUE!``."""

    excel_error = "#VALUE!"


def fmt(value: float) -> str:
    """Format a number for an error message: short, no trailing zeros."""
    if isinstance(value, float):
        if value == 0:
            return "0"
        if math.isfinite(value) and 1e-3 <= abs(value) < 1e7:
            return f"{value:.6g}"
        return f"{value:.4g}"
    return str(value)


def check_finite(name: str, value: float, unit: str = "") -> float:
    """Raise unless ``value`` is a finite real number."""
    if not (isinstance(value, (int, float)) and not isinstance(value, bool)):
        raise CellTypeError(f"{name}: {value!r} is not a number")
    if not math.isfinite(value):
        raise CellInputError(f"{name}: {value} is not a finite number")
    return float(value)


def check_range(
    name: str,
    value: float,
    lo: float | None = None,
    hi: float | None = None,
    unit: str = "",
    *,
    lo_open: bool = False,
    hi_open: bool = False,
    where: str = "",
) -> float:
    """Check that ``value`` lies in [lo, hi] (or the open variant) and return it.

    Parameters
    ----------
    name : str
        Argument name as the cell user sees it.
    value : float
        Value received.
    lo, hi : float, optional
        Bounds; ``None`` means unbounded on that side.
    unit : str
        Unit shown after numbers, e.g. ``"°C"`` or ``"bar"``. [-]
    lo_open, hi_open : bool
        Exclude the bound itself.
    where : str
        Where the bound comes from (a standard's clause), appended in brackets.

    Raises
    ------
    CellInputError
        ``"t_metering: 40 °C is above 20 °C (ISO 6976:2016 clause 5)"``.
    """
    value = check_finite(name, value, unit)
    u = f" {unit}" if unit else ""
    tail = f" ({where})" if where else ""
    if lo is not None and (value < lo or (lo_open and value == lo)):
        rel = "must be above" if lo_open else "is below"
        if lo_open:
            raise CellInputError(f"{name}: {fmt(value)}{u} {rel} {fmt(lo)}{u}{tail}")
        raise CellInputError(f"{name}: {fmt(value)}{u} {rel} {fmt(lo)}{u}{tail}")
    if hi is not None and (value > hi or (hi_open and value == hi)):
        if hi_open:
            raise CellInputError(f"{name}: {fmt(value)}{u} must be below {fmt(hi)}{u}{tail}")
        raise CellInputError(f"{name}: {fmt(value)}{u} is above {fmt(hi)}{u}{tail}")
    return value
