"""Brake mean effective pressure and shaft power of a reciprocating engine.

``BMEP = P·n_R/(V_d·N)`` with ``n_R`` crankshaft revolutions per power stroke
(2 for a four-stroke engine, 1 for a two-stroke engine).  With P in kW, V_d in
litres and N in rpm: ``BMEP [bar] = 600·n_R·P/(V_d·N)``, i.e.
``1200·P/(V_d·N)`` for a four-stroke engine.
"""

from __future__ import annotations

from cellfuncs.errors import CellTypeError, check_range

__all__ = ["engine_bmep", "engine_power"]


def _revs_per_stroke(strokes) -> int:
    if isinstance(strokes, bool) or not isinstance(strokes, (int, float)) or strokes not in (2, 4):
        raise CellTypeError(f"strokes: {strokes!r} is not 2 or 4")
    return 2 if strokes == 4 else 1


def _geometry(displacement_l: float, speed_rpm: float) -> tuple:
    v = check_range("displacement_l", displacement_l, 0.0, None, "l", lo_open=True)
    n = check_range("speed_rpm", speed_rpm, 0.0, None, "rpm", lo_open=True)
    return v, n


def engine_bmep(shaft_power_kw: float, displacement_l: float, speed_rpm: float,
                strokes: int = 4) -> float:
    """Brake mean effective pressure.

    Parameters
    ----------
    shaft_power_kw : float
        Shaft (brake) power [kW], from the engine's declared datasheet.
    displacement_l : float
        Total swept volume of all cylinders [l].
    speed_rpm : float
        Crankshaft speed [rpm].
    strokes : int
        4 (one power stroke per cylinder every two turns) or 2 [-].

    Returns
    -------
    float
        BMEP [bar] = ``600·n_R·P/(V·n)``; ``1200·P/(V·n)`` for four-stroke.

    Notes
    -----
    Pure definition; valid for any power >= 0.

    References
    ----------
    Heywood, J. B. (1988), Internal Combustion Engine Fundamentals,
    McGraw-Hill, ch. 2 (section 2.7, mean effective pressure).
    """
    p = check_range("shaft_power_kw", shaft_power_kw, 0.0, None, "kW")
    n_r = _revs_per_stroke(strokes)
    v, n = _geometry(displacement_l, speed_rpm)
    return 600.0 * n_r * p / (v * n)


def engine_power(bmep_bar: float, displacement_l: float, speed_rpm: float,
                 strokes: int = 4) -> float:
    """Shaft power from the brake mean effective pressure.

    Parameters
    ----------
    bmep_bar : float
        Brake mean effective pressure [bar].
    displacement_l : float
        Total swept volume of all cylinders [l].
    speed_rpm : float
        Crankshaft speed [rpm].
    strokes : int
        4 or 2 [-].

    Returns
    -------
    float
        Shaft power [kW] = ``BMEP·V·n/(600·n_R)``, the inverse of
        :func:`engine_bmep`.

    References
    ----------
    Heywood, J. B. (1988), Internal Combustion Engine Fundamentals,
    McGraw-Hill, ch. 2.
    """
    b = check_range("bmep_bar", bmep_bar, 0.0, None, "bar")
    n_r = _revs_per_stroke(strokes)
    v, n = _geometry(displacement_l, speed_rpm)
    return b * v * n / (600.0 * n_r)


