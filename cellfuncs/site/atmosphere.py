"""Ambient pressure of the ISO 2533 standard atmosphere in the troposphere.

The standard atmosphere has a constant temperature gradient of −6.5 K/km from
288.15 K and 101 325 Pa at mean sea level up to the tropopause at 11 000 m
geopotential altitude.  Hydrostatic balance of a perfect gas with that
temperature profile gives

    p = p0 · (1 − L·H/T0) ^ (g0 / (R·L))

with p0 = 101 325 Pa, T0 = 288.15 K, L = 0.0065 K/m, g0 = 9.80665 m/s²,
R = 287.052 87 J/(kg·K) (the standard's specific gas constant of dry air) and
H the geopotential altitude.  The exponent is 5.255 88.

H is the geopotential altitude; a site's height above sea level is a geometric
height Z, H = r·Z/(r + Z) with r = 6 356 766 m.  Below 5 000 m the two differ by
at most 3.9 m, which changes the pressure by less than 0.1 % (0.05 % at
5 000 m), well inside the weather's day-to-day swing of a few per cent.
"""

from __future__ import annotations

from cellfuncs.errors import check_range

__all__ = ["P0_PA", "T0_K", "LAPSE_K_M", "G0", "R_AIR", "EXPONENT", "ALTITUDE_RANGE_M",
           "site_pressure"]

#: ISO 2533:1975 standard sea-level pressure [Pa]
P0_PA = 101325.0
#: ISO 2533:1975 standard sea-level temperature [K]
T0_K = 288.15
#: ISO 2533:1975 temperature gradient of the troposphere, magnitude [K/m]
LAPSE_K_M = 0.0065
#: ISO 2533:1975 standard acceleration of free fall [m/s²]
G0 = 9.80665
#: ISO 2533:1975 specific gas constant of dry air [J/(kg·K)]
R_AIR = 287.05287
#: g0/(R·L) [-]
EXPONENT = G0 / (R_AIR * LAPSE_K_M)
#: the range offered here: the troposphere formula holds to 11 000 m, tender sites lie below 5 000 m [m]
ALTITUDE_RANGE_M = (-500.0, 5000.0)


def site_pressure(altitude_m: float) -> float:
    """Ambient pressure of the ISO 2533 standard atmosphere at a site's altitude.

    Parameters
    ----------
    altitude_m : float
        Geopotential altitude of the site, −500 to 5 000. [m]

    Returns
    -------
    p : float
        Standard-atmosphere pressure, p0·(1 − L·H/T0)^(g0/(R·L)). [bar(a)]

    Raises
    ------
    CellInputError
        Altitude outside −500 to 5 000 m.

    Notes
    -----
    Troposphere of the standard atmosphere (temperature gradient −6.5 K/km,
    288.15 K and 1.01325 bar at sea level).  The altitude is geopotential;
    taking a height above sea level instead changes the pressure by under
    0.1 % below 5 000 m.  The real pressure on a given day differs from the
    standard one by the weather (a few per cent); derating follows the engine's
    declared derating table.

    References
    ----------
    .. [1] ISO 2533:1975, Standard Atmosphere, clause 2 (constants) and the
       troposphere pressure equation; identical below 32 km to the U.S. Standard
       Atmosphere 1976 (NOAA/NASA/USAF, NOAA-S/T 76-1562).
    """
    h = check_range("altitude_m", altitude_m, *ALTITUDE_RANGE_M, "m",
                    where="ISO 2533 troposphere as offered here")
    return P0_PA * (1.0 - LAPSE_K_M * h / T0_K) ** EXPONENT / 1e5
