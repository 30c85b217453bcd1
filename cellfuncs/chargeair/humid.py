"""Water in air: saturation pressure, humidity ratio, dew point, latent heat.

Plain ``math`` throughout (these run inside every charge-air and exhaust call):

* over liquid water, 273.15-647.096 K: the saturation-pressure equation of
  IAPWS-IF97 region 4 (Wagner et al. 2000) and its closed-form backward
  equation for the saturation temperature;
* over ice, below 273.16 K: the IAPWS 2011 sublimation-pressure equation
  (Wagner, Riethmann, Feistel & Harvey 2011), inverted by Newton's method.
  Psychrometric practice (ASHRAE Handbook Fundamentals; CoolProp's humid air)
  takes saturation over ice below the triple point; so does this module, and
  "relative humidity" below 0 °C is relative to ice;
* enthalpy of vaporisation from the Clausius-Clapeyron equation with the
  IF97 dp/dT and the saturated densities of the IAPWS auxiliary equations
  (Wagner & Pruss 1993).

The vapour is an ideal gas (enhancement factor 1): partial pressure of water =
mole fraction × total pressure.  At 4 bar the enhancement factor of water in
air is about 1.02, which moves a dew point by about 0.15 K.

Units: temperatures in K for the ``*_K`` helpers, °C where the name says so;
pressures in Pa unless the argument name ends in ``_bar``.

Notes
-----
Saturation over liquid 273.15-647.096 K, over ice 190-273.16 K.  The IF97
equation agrees with IAPWS-95 within 0.025 % in pressure.

References
----------
.. [1] Wagner, W., Cooper, J.R., Dittmann, A. et al. (2000), The IAPWS
   industrial formulation 1997 for the thermodynamic properties of water and
   steam, J. Eng. Gas Turbines Power 122, 150-182 (region 4, eqs. 30 and 31).
.. [2] Wagner, W., Riethmann, T., Feistel, R., Harvey, A.H. (2011), New
   equations for the sublimation pressure and melting pressure of H2O ice Ih,
   J. Phys. Chem. Ref. Data 40, 043103.
.. [3] Wagner, W., Pruss, A. (1993), International equations for the
   saturation properties of ordinary water substance, J. Phys. Chem. Ref.
   Data 22, 783-787.
"""

from __future__ import annotations

import math

from cellfuncs.errors import CellInputError, check_range, fmt
from cellfuncs.props import if97 as _if97

__all__ = [
    "M_WATER",
    "M_DRY_AIR",
    "EPS",
    "T_CRIT",
    "p_sat_K",
    "t_sat_K",
    "p_sat_c",
    "dew_point_c",
    "vapour_pressure",
    "vapour_mole_fraction",
    "humidity_ratio",
    "latent_heat_K",
]

#: molar masses [g/mol]: water as ISO 6976:2016, dry air the M_air of ISO 6976:2016
M_WATER = 18.01528
M_DRY_AIR = 28.96546
#: ratio of the molar masses of water and dry air [-]
EPS = M_WATER / M_DRY_AIR

T_CRIT = 647.096  # K
P_CRIT = 22.064e6  # Pa
RHO_CRIT = 322.0  # kg/m³
T_TRIPLE = 273.16  # K
P_TRIPLE = 611.657  # Pa
T_LOW = 190.0  # K, lowest temperature accepted over ice

# IAPWS 2011 sublimation pressure
_SUB_A = (-0.212144006e2, 0.273203819e2, -0.610598130e1)
_SUB_B = (0.333333333e-2, 0.120666667e1, 0.170333333e1)
# Wagner & Pruss (1993) auxiliary equations: saturated liquid and vapour density
_RL = ((1.99274064, 1 / 3), (1.09965342, 2 / 3), (-0.510839303, 5 / 3),
       (-1.75493479, 16 / 3), (-45.5170352, 43 / 3), (-6.74694450e5, 110 / 3))
_RV = ((-2.03150240, 2 / 6), (-2.68302940, 4 / 6), (-5.38626492, 8 / 6),
       (-17.2991605, 18 / 6), (-44.7586581, 37 / 6), (-63.9201063, 71 / 6))


def _p_liquid(T: float) -> float:
    """IF97 eq. 30 (cellfuncs.props.if97), T in K -> Pa."""
    return _if97.p_sat(T) * 1e6


def _t_liquid(p: float) -> float:
    """IF97 eq. 31 (cellfuncs.props.if97), p in Pa -> K."""
    return _if97.t_sat(p * 1e-6)


def _p_ice(T: float) -> float:
    """IAPWS 2011 sublimation pressure, T in K -> Pa."""
    th = T / T_TRIPLE
    s = _SUB_A[0] * th ** _SUB_B[0] + _SUB_A[1] * th ** _SUB_B[1] + _SUB_A[2] * th ** _SUB_B[2]
    return P_TRIPLE * math.exp(s / th)


def _t_ice(p: float) -> float:
    """Inverse of :func:`_p_ice` by Newton's method on ln p (smooth, 4-6 steps)."""
    lnp = math.log(p)
    T = 273.0
    for _ in range(40):
        f = math.log(_p_ice(T)) - lnp
        # d ln p / dT by a central difference (the function is very smooth)
        d = (math.log(_p_ice(T + 1e-3)) - math.log(_p_ice(T - 1e-3))) / 2e-3
        dT = f / d
        T -= dT
        if abs(dT) < 1e-10:
            break
    return T


def p_sat_K(T_K: float) -> float:
    """Saturation pressure of water [Pa] at T_K [K]: over ice below 273.16 K, over liquid above.

    Raises :class:`~cellfuncs.errors.CellInputError` outside 190-647.096 K.

    References
    ----------
    .. [1] Wagner, W., Cooper, J.R., Dittmann, A. et al. (2000), The IAPWS
       industrial formulation 1997 for the thermodynamic properties of water and
       steam, J. Eng. Gas Turbines Power 122, 150-182 (region 4).
    .. [2] Wagner, W., Riethmann, T., Feistel, R., Harvey, A.H. (2011), New
       equations for the sublimation pressure and melting pressure of H2O ice Ih,
       J. Phys. Chem. Ref. Data 40, 043103 (over ice).
    """
    if T_K < T_TRIPLE:
        if not T_K >= T_LOW:
            raise CellInputError(f"T: {fmt(T_K - 273.15)} °C is below {fmt(T_LOW - 273.15)} °C "
                                 "(saturation pressure of water over ice)")
        return _p_ice(T_K)
    if not T_K <= T_CRIT:
        raise CellInputError(f"T: {fmt(T_K - 273.15)} °C is above the critical temperature "
                             "of water 373.946 °C")
    return _p_liquid(T_K)


def t_sat_K(p_Pa: float) -> float:
    """Saturation (dew or frost point) temperature [K] of water vapour at partial pressure p_Pa [Pa].

    References
    ----------
    .. [1] Wagner, W., Cooper, J.R., Dittmann, A. et al. (2000), The IAPWS
       industrial formulation 1997 for the thermodynamic properties of water and
       steam, J. Eng. Gas Turbines Power 122, 150-182 (region 4).
    .. [2] Wagner, W., Riethmann, T., Feistel, R., Harvey, A.H. (2011), New
       equations for the sublimation pressure and melting pressure of H2O ice Ih,
       J. Phys. Chem. Ref. Data 40, 043103 (over ice).
    """
    if not p_Pa > 0:
        raise CellInputError(f"p_water: {fmt(p_Pa)} Pa must be above 0 (no water vapour, no dew point)")
    if p_Pa >= P_TRIPLE:
        if p_Pa > P_CRIT:
            raise CellInputError(f"p_water: {fmt(p_Pa / 1e5)} bar is above the critical pressure "
                                 "of water 220.64 bar")
        return _t_liquid(p_Pa)
    if p_Pa < _p_ice(T_LOW):
        raise CellInputError(f"p_water: {fmt(p_Pa)} Pa gives a frost point below "
                             f"{fmt(T_LOW - 273.15)} °C")
    return _t_ice(p_Pa)


def p_sat_c(t_c: float) -> float:
    """Saturation pressure of water [Pa] at t_c [°C] (see :func:`p_sat_K`).

    References
    ----------
    .. [1] Wagner, W., Cooper, J.R., Dittmann, A. et al. (2000), The IAPWS
       industrial formulation 1997 for the thermodynamic properties of water and
       steam, J. Eng. Gas Turbines Power 122, 150-182 (region 4).
    .. [2] Wagner, W., Riethmann, T., Feistel, R., Harvey, A.H. (2011), New
       equations for the sublimation pressure and melting pressure of H2O ice Ih,
       J. Phys. Chem. Ref. Data 40, 043103 (over ice).
    """
    return p_sat_K(t_c + 273.15)


def dew_point_c(y_water: float, p_bar: float) -> float:
    """Water dew point [°C] of a gas with water mole fraction y_water [-] at p_bar [bar(a)].

    Frost point (over ice) when below 0.01 °C.  Enhancement factor neglected.
    A gas too dry for the saturation equations is an error that names the
    humidity (the water in a cell user's mixture comes from ``rh_ambient``).

    References
    ----------
    .. [1] Wagner, W., Cooper, J.R., Dittmann, A. et al. (2000), The IAPWS
       industrial formulation 1997 for the thermodynamic properties of water and
       steam, J. Eng. Gas Turbines Power 122, 150-182 (region 4).
    .. [2] Wagner, W., Riethmann, T., Feistel, R., Harvey, A.H. (2011), New
       equations for the sublimation pressure and melting pressure of H2O ice Ih,
       J. Phys. Chem. Ref. Data 40, 043103 (over ice).
    """
    p_w = y_water * p_bar * 1e5
    if 0.0 < p_w < _p_ice(T_LOW):
        raise CellInputError(f"rh_ambient: the mixture is too dry for a dew point (water vapour "
                             f"{fmt(p_w)} Pa, frost point below {fmt(T_LOW - 273.15)} °C)")
    return t_sat_K(p_w) - 273.15


def vapour_pressure(t_c: float, rh: float, name_t: str = "t_ambient",
                    name_rh: str = "rh_ambient") -> float:
    """Partial pressure of water [Pa] in air at t_c [°C] and relative humidity rh [-] (0-1).

    References
    ----------
    .. [1] Wagner, W., Cooper, J.R., Dittmann, A. et al. (2000), The IAPWS
       industrial formulation 1997 for the thermodynamic properties of water and
       steam, J. Eng. Gas Turbines Power 122, 150-182 (region 4).
    .. [2] Wagner, W., Riethmann, T., Feistel, R., Harvey, A.H. (2011), New
       equations for the sublimation pressure and melting pressure of H2O ice Ih,
       J. Phys. Chem. Ref. Data 40, 043103 (over ice).
    """
    check_range(name_rh, rh, 0.0, 1.0, "")
    check_range(name_t, t_c, T_LOW - 273.15, 100.0, "°C")
    return rh * p_sat_c(t_c)


def vapour_mole_fraction(t_c: float, rh: float, p_bar: float, name_t: str = "t_ambient",
                         name_rh: str = "rh_ambient", name_p: str = "p_ambient_bar") -> float:
    """Mole fraction of water [-] in humid air at t_c [°C], rh [-] and p_bar [bar(a)].

    References
    ----------
    .. [1] Wagner, W., Cooper, J.R., Dittmann, A. et al. (2000), The IAPWS
       industrial formulation 1997 for the thermodynamic properties of water and
       steam, J. Eng. Gas Turbines Power 122, 150-182 (region 4).
    .. [2] Wagner, W., Riethmann, T., Feistel, R., Harvey, A.H. (2011), New
       equations for the sublimation pressure and melting pressure of H2O ice Ih,
       J. Phys. Chem. Ref. Data 40, 043103 (over ice).
    """
    pw = vapour_pressure(t_c, rh, name_t, name_rh)
    check_range(name_p, p_bar, 0.0, None, "bar", lo_open=True)
    if pw >= p_bar * 1e5:
        raise CellInputError(f"{name_t}: {fmt(t_c)} °C at {name_rh} {fmt(rh)} gives a water "
                             f"vapour pressure {fmt(pw / 1e5)} bar not below {name_p} {fmt(p_bar)} bar")
    return pw / (p_bar * 1e5)


def humidity_ratio(t_c: float, rh: float, p_bar: float, name_t: str = "t_ambient",
                   name_rh: str = "rh_ambient", name_p: str = "p_ambient_bar") -> float:
    """Humidity ratio [kg water / kg dry air] of humid air at t_c [°C], rh [-], p_bar [bar(a)].

    w = ε·p_w/(p − p_w) with ε = M_water/M_dry_air = 0.621970.

    References
    ----------
    .. [1] Wagner, W., Cooper, J.R., Dittmann, A. et al. (2000), The IAPWS
       industrial formulation 1997 for the thermodynamic properties of water and
       steam, J. Eng. Gas Turbines Power 122, 150-182 (region 4).
    .. [2] Wagner, W., Riethmann, T., Feistel, R., Harvey, A.H. (2011), New
       equations for the sublimation pressure and melting pressure of H2O ice Ih,
       J. Phys. Chem. Ref. Data 40, 043103 (over ice).
    """
    y = vapour_mole_fraction(t_c, rh, p_bar, name_t, name_rh, name_p)
    return EPS * y / (1.0 - y)


def _dpdT_liquid(T: float) -> float:
    """dp_sat/dT of the IF97 equation [Pa/K] (central difference of a smooth closed form)."""
    d = 1e-3
    return (_p_liquid(T + d) - _p_liquid(T - d)) / (2 * d)


def latent_heat_K(T_K: float) -> float:
    """Enthalpy of vaporisation of water h'' − h' [J/kg] at T_K [K] (273.15-640 K).

    Clausius-Clapeyron, L = T·(dp/dT)·(1/ρ'' − 1/ρ'), with dp/dT from IF97
    region 4 and the saturated densities from the Wagner & Pruss (1993)
    auxiliary equations; agrees with IAPWS-95 within 0.05 % at 0-200 °C.

    References
    ----------
    .. [1] Wagner, W., Cooper, J.R., Dittmann, A. et al. (2000), The IAPWS
       industrial formulation 1997 for the thermodynamic properties of water and
       steam, J. Eng. Gas Turbines Power 122, 150-182 (region 4, dp/dT).
    .. [2] Wagner, W., Pruss, A. (1993), International equations for the
       saturation properties of ordinary water substance, J. Phys. Chem. Ref.
       Data 22, 783-787 (saturated densities).
    """
    T = check_range("T", T_K, 273.15, 640.0, "K")
    tau = 1.0 - T / T_CRIT
    rho_l = RHO_CRIT * (1.0 + sum(b * tau ** e for b, e in _RL))
    rho_v = RHO_CRIT * math.exp(sum(c * tau ** e for c, e in _RV))
    return T * _dpdT_liquid(T) * (1.0 / rho_v - 1.0 / rho_l)
