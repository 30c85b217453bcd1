"""The one pint unit registry (built lazily) and the UNIT_CONVERT cell function.

Trade units are defined on top of pint's defaults: ``bar(g)`` and ``psig``
(gauge pressure against a standard atmosphere of 1.01325 bar), ``mbar``,
``inH2O``, ``MMBtu``, ``therm``, ``kcal``.
"""

from __future__ import annotations

import math
from functools import lru_cache

from cellfuncs.errors import CellInputError, CellTypeError

__all__ = ["registry", "convert"]

ATMOSPHERE_BAR = 1.01325  # standard atmosphere [bar]; gauge pressures refer to it

# our spellings -> pint expressions; gauge units are handled apart
_ALIASES = {
    "°c": "degC", "degc": "degC", "c": "degC", "celsius": "degC",
    "°f": "degF", "degf": "degF", "f": "degF", "fahrenheit": "degF",
    "k": "kelvin", "kelvin": "kelvin",
    "bar(a)": "bar", "bara": "bar", "bar": "bar", "mbar": "millibar",
    "psi": "psi", "psia": "psi", "inh2o": "inH2O", "mmh2o": "millimeter_H2O",
    "kwh": "kilowatt_hour", "mwh": "megawatt_hour", "mj": "megajoule", "gj": "gigajoule",
    "kj": "kilojoule", "mmbtu": "MMBtu", "btu": "Btu", "therm": "therm",
    "kcal": "kilocalorie_IT", "hp": "hp", "kw": "kilowatt", "mw": "megawatt", "w": "watt",
    "m³/h": "m**3/hour", "m3/h": "m**3/hour", "kg/h": "kg/hour", "m²": "m**2", "m³": "m**3",
}
_GAUGE = {"bar(g)": "bar", "barg": "bar", "psig": "psi"}


@lru_cache(maxsize=1)
def registry():
    """The shared pint UnitRegistry (built on first use, ~0.2 s)."""
    import pint

    ureg = pint.UnitRegistry(autoconvert_offset_to_baseunit=True)
    ureg.define("MMBtu = 1e6 * Btu_it")
    ureg.define("kilocalorie_IT = 1000 * international_calorie")
    return ureg


# temperatures: exact affine maps to kelvin (pint's offset arithmetic leaves 1e-14 residues)
_TEMPERATURE = {
    "degC": (1.0, 273.15), "kelvin": (1.0, 0.0),
    "degF": (5.0 / 9.0, 459.67 * 5.0 / 9.0), "degR": (5.0 / 9.0, 0.0),
}
_TEMPERATURE_NAMES = {"°r": "degR", "degr": "degR", "rankine": "degR"}


def _resolve(name: str, which: str):
    key = name.strip()
    low = key.lower()
    if low in _GAUGE:
        return _GAUGE[low], True
    expr = _ALIASES.get(low, key)
    ureg = registry()
    try:
        unit = ureg.Unit(expr)
    except Exception:  # pint raises several types for bad names
        raise CellTypeError(f"{which}: unknown unit {name!r}") from None
    return unit, False


@lru_cache(maxsize=512)
def _plan(from_unit: str, to_unit: str):
    u_from, g_from = _resolve(from_unit, "from_unit")
    u_to, g_to = _resolve(to_unit, "to_unit")
    ureg = registry()
    a, b = ureg.Unit(u_from), ureg.Unit(u_to)
    if a.dimensionality != b.dimensionality:
        raise CellInputError(
            f"to_unit: cannot convert {from_unit!r} ({a.dimensionality}) to {to_unit!r} ({b.dimensionality})")
    return a, g_from, b, g_to


def _temperature_key(name: str):
    low = name.strip().lower()
    key = _ALIASES.get(low, _TEMPERATURE_NAMES.get(low))
    return key if key in _TEMPERATURE else None


def convert(value: float, from_unit: str, to_unit: str) -> float:
    """Convert ``value`` from ``from_unit`` to ``to_unit``.

    Parameters
    ----------
    value : float
        The quantity in ``from_unit``. [from_unit]
    from_unit, to_unit : str
        Unit names: pint's names plus °C, °F, K, °R, bar, bar(a), bar(g), mbar,
        psi, psig, inH2O (conventional, 249.0889 Pa), kWh, MJ, MMBtu (10⁶ Btu_IT), therm (10⁵ Btu_IT),
        kcal (international-table calorie, 4.1868 kJ), hp (mechanical, 550 ft·lbf/s).
        Gauge units (``bar(g)``, ``psig``) refer to 1.01325 bar.

    Returns
    -------
    float
        The value in ``to_unit``. [to_unit]

    References
    ----------
    .. [1] pint documentation, https://pint.readthedocs.io (unit definitions).
    """
    ta, tb = _temperature_key(from_unit), _temperature_key(to_unit)
    if ta and tb:
        (fa, oa), (fb, ob) = _TEMPERATURE[ta], _TEMPERATURE[tb]
        kelvin = value * fa + oa
        if kelvin < 0:
            raise CellInputError(f"value: {value:g} {from_unit} is below absolute zero")
        out = (kelvin - ob) / fb
        if not math.isfinite(out):
            raise CellInputError(f"value: {value:g} {from_unit} is too large to convert")
        return float(round(out, 12)) if abs(out) < 1e6 else out
    a, g_from, b, g_to = _plan(from_unit, to_unit)
    ureg = registry()
    q = ureg.Quantity(value, a)
    if g_from:
        q = q + ureg.Quantity(ATMOSPHERE_BAR, "bar")
    if g_to:
        q = q - ureg.Quantity(ATMOSPHERE_BAR, "bar")
    out = float(q.to(b).magnitude)
    if not math.isfinite(out):
        raise CellInputError(f"value: {value:g} {from_unit} is too large to convert to {to_unit}")
    return float(f"{out:.15g}")  # drop last-digit noise of the factor chain


def version() -> str:
    """The installed cellfuncs version (for traceable tender workbooks)."""
    from cellfuncs import __version__

    return __version__
