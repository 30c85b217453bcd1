"""Synchronous generator speed and pole pairs.

A synchronous machine with p pole pairs on a grid of frequency f turns at
``n = 60·f/p`` [rpm]: two pole pairs give 1,500 rpm at 50 Hz and 1,800 rpm at
60 Hz.
"""

from __future__ import annotations

from cellfuncs.errors import CellInputError, CellTypeError, check_range, fmt

__all__ = ["gen_speed", "gen_pole_pairs", "SYNC_TOLERANCE"]

#: relative speed deviation still taken as synchronous [-]
SYNC_TOLERANCE = 0.005


def _frequency(frequency_hz: float) -> float:
    return check_range("frequency_hz", frequency_hz, 0.0, 1000.0, "Hz", lo_open=True)


def gen_speed(frequency_hz: float, pole_pairs: int) -> float:
    """Synchronous speed of a generator.

    Parameters
    ----------
    frequency_hz : float
        Grid frequency [Hz].
    pole_pairs : int
        Number of pole pairs, a whole number >= 1 [-].

    Returns
    -------
    float
        Synchronous speed ``60·f/p`` [rpm].

    Notes
    -----
    Exact for a synchronous generator; an induction (asynchronous) generator
    runs a little above this speed (its slip).

    References
    ----------
    Fitzgerald, A. E., Kingsley, C., Umans, S. D. (2003), Electric Machinery,
    6th ed., ch. 4 (synchronous speed n = 120·f/poles).
    """
    f = _frequency(frequency_hz)
    if isinstance(pole_pairs, bool) or not isinstance(pole_pairs, (int, float)):
        raise CellTypeError(f"pole_pairs: {pole_pairs!r} is not a whole number")
    p = check_range("pole_pairs", pole_pairs, 1.0, 1000.0, "")
    if p != int(p):
        raise CellTypeError(f"pole_pairs: {fmt(p)} is not a whole number")
    return 60.0 * f / int(p)


def gen_pole_pairs(frequency_hz: float, speed_rpm: float) -> float:
    """Pole pairs of a synchronous generator from its speed.

    Parameters
    ----------
    frequency_hz : float
        Grid frequency [Hz].
    speed_rpm : float
        Shaft speed [rpm].

    Returns
    -------
    float
        Pole pairs ``p = 60·f/n`` rounded to a whole number [-].

    Raises
    ------
    CellInputError
        When ``speed_rpm`` is more than 0.5 % away from the synchronous speed
        of the nearest whole number of pole pairs.

    Notes
    -----
    The 0.5 % tolerance accepts rounded datasheet speeds; it rejects an
    induction generator's slip of about 1 %.

    References
    ----------
    See :func:`gen_speed`.
    """
    f = _frequency(frequency_hz)
    # at most 1000 pole pairs, as gen_speed accepts: below that speed no generator is synchronous
    n = check_range("speed_rpm", speed_rpm, 60.0 * f / 1000.5, None, "rpm",
                    where=f"{fmt(60.0 * f / 1000.0)} rpm is 1000 pole pairs at {fmt(f)} Hz")
    p = max(1, round(60.0 * f / n))
    n_sync = 60.0 * f / p
    if abs(n - n_sync) > SYNC_TOLERANCE * n_sync:
        raise CellInputError(
            f"speed_rpm: {fmt(n)} rpm is not synchronous at {fmt(f)} Hz (nearest: {fmt(n_sync)} rpm "
            f"with {p} pole pair{'s' if p > 1 else ''}; tolerance 0.5 %)")
    return float(p)
