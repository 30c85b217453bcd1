"""Dry coolers (air-cooled dump and low-temperature coolers): required UA and air flow.

A dry cooler passes the circuit's water (or water-glycol) through finned tubes
over which fans blow ambient air.  :func:`drycooler_ua` gives the UA the
cooler needs for a duty between four temperatures (LMTD with the F factor of
the arrangement, the heat-exchanger family's :func:`ua_required`);
:func:`drycooler_air_flow` the volume of ambient air that carries the duty
from the air inlet to the air outlet temperature.

The air side assumes sensible heating of humid air at constant humidity (no
condensation or evaporation: the air is heated), the humid air an ideal-gas
mixture of dry air (the gas family's composition) and water vapour with the
NASA-7 enthalpies of the charge-air family, the vapour content from the
ambient relative humidity (IAPWS-IF97 saturation pressure), and the volume
measured at the air inlet.  Fan heat and casing losses are not counted.

Results are estimates for tendering; final design follows local codes and
licensed engineers.
"""

from __future__ import annotations

import re

from cellfuncs.errors import CellInputError, check_range, fmt

__all__ = ["drycooler_ua", "drycooler_air_flow", "humid_air_fractions"]

#: molar gas constant [J/(mol·K)] (CODATA 2018, exact)
R_MOLAR = 8.314462618


def drycooler_ua(duty_kw: float, t_water_in: float, t_water_out: float, t_air_in: float, t_air_out: float,
                 arrangement: str = "cross", glycol_fraction: float = 0.0, glycol: str = "ethylene") -> float:
    """UA a dry cooler needs to cool the circuit's water with ambient air [kW/K].

    Parameters
    ----------
    duty_kw : float
        Heat to reject, > 0 [kW].
    t_water_in, t_water_out : float
        Circuit fluid entering and leaving the cooler (hot side) [°C].
    t_air_in, t_air_out : float
        Air entering (the design ambient) and leaving the cooler (cold side) [°C].
    arrangement : str
        Flow arrangement (heat-exchanger family's words); ``"cross"`` (both
        streams unmixed) is the usual finned-tube coil.
    glycol_fraction, glycol : float, str
        Circuit fluid [-]; its temperatures must lie in the fluid's liquid range.

    Returns
    -------
    float
        ``UA = duty/(F·LMTD)`` [kW/K].

    Raises
    ------
    CellInputError
        duty not above 0, the water or air not cooled/heated, a temperature
        cross, a fluid temperature outside its liquid range.

    Notes
    -----
    Constant U and specific heats over the cooler (the LMTD method).

    References
    ----------
    .. [1] Bergman, T. L. et al. (2011), Fundamentals of Heat and Mass Transfer,
       7th ed., sections 11.3 and 11.4.
    """
    from cellfuncs.heat_transfer.rating import ua_required
    from cellfuncs.recovery import water as _w

    _w.enthalpy(t_water_in, glycol_fraction, glycol, name="t_water_in")
    _w.enthalpy(t_water_out, glycol_fraction, glycol, name="t_water_out")
    check_range("t_air_in", t_air_in, -60.0, 60.0, "°C", where="ambient air")
    if not t_water_out < t_water_in:
        raise CellInputError(f"t_water_out: {fmt(t_water_out)} °C is not below t_water_in "
                             f"{fmt(t_water_in)} °C; a dry cooler cools the circuit")
    if not t_air_out > t_air_in:
        raise CellInputError(f"t_air_out: {fmt(t_air_out)} °C is not above t_air_in {fmt(t_air_in)} °C; "
                             "the air is heated")
    check_range("t_air_out", t_air_out, -60.0, 200.0, "°C")
    try:
        return ua_required(duty_kw, t_water_in, t_water_out, t_air_in, t_air_out, arrangement)
    except CellInputError as err:  # the heat-exchanger family names its streams hot and cold
        msg = err.message
        for a, b in (("t_hot_in", "t_water_in"), ("t_hot_out", "t_water_out"), ("t_cold_in", "t_air_in"),
                     ("t_cold_out", "t_air_out")):
            msg = re.sub(rf"\b{a}\b", b, msg)
        raise CellInputError(msg) from None


def humid_air_fractions(t_air_in: float, rh_ambient: float, p_ambient_bar: float) -> dict:
    """Mole fractions of humid air: the gas family's dry air plus water vapour [-].

    References
    ----------
    .. [1] Wagner, W. et al. (2000), IAPWS-IF97, region 4 (saturation pressure,
       :mod:`cellfuncs.chargeair.humid`).
    """
    from cellfuncs.chargeair import humid
    from cellfuncs.gas.combustion import DRY_AIR

    y = humid.vapour_mole_fraction(t_air_in, rh_ambient, p_ambient_bar, name_t="t_air_in")
    x = {sp: v * (1.0 - y) for sp, v in DRY_AIR.items()}
    x["H2O"] = y
    return x


def drycooler_air_flow(duty_kw: float, t_air_in: float, t_air_out: float, rh_ambient: float = 0.3,
                       p_ambient_bar: float = 1.0) -> float:
    """Ambient air volume flow that carries a duty through a dry cooler [m³/h].

    Parameters
    ----------
    duty_kw : float
        Heat the air takes up, > 0 [kW].
    t_air_in : float
        Air entering the cooler (the design ambient), -60 to 60 [°C].
    t_air_out : float
        Air leaving the cooler, above t_air_in, at most 200 [°C].
    rh_ambient : float
        Relative humidity of the ambient air, 0 to 1 [-].
    p_ambient_bar : float
        Ambient pressure [bar(a)].

    Returns
    -------
    float
        Humid-air volume flow at the air inlet (t_air_in, p_ambient_bar) [m³/h].

    Raises
    ------
    CellInputError
        duty not above 0, t_air_out not above t_air_in, humidity or pressure
        out of range.

    Notes
    -----
    ``ṅ = duty/(h̄(t_air_out) − h̄(t_air_in))`` with the molar enthalpy of the
    humid-air ideal-gas mixture (NASA-7, GRI-Mech 3.0), ``V̇ = ṅ·R·T_in/p``.
    Sensible heating at constant humidity; the ideal-gas volume is within
    about 0.05 % of the real humid air at ambient conditions.

    References
    ----------
    .. [1] Smith, G. P. et al. (1999), GRI-Mech 3.0 thermodynamic data (NASA-7).
    .. [2] ASHRAE Handbook - Fundamentals (2017), ch. 1, psychrometrics (humid
       air as an ideal-gas mixture; from memory).
    """
    from cellfuncs.gas import idealgas

    q = check_range("duty_kw", duty_kw, 0.0, None, "kW", lo_open=True)
    t_in = check_range("t_air_in", t_air_in, -60.0, 60.0, "°C", where="ambient air")
    t_out = check_range("t_air_out", t_air_out, -60.0, 200.0, "°C")
    if not t_out > t_in:
        raise CellInputError(f"t_air_out: {fmt(t_out)} °C is not above t_air_in {fmt(t_in)} °C; "
                             "the air is heated")
    rh = check_range("rh_ambient", rh_ambient, 0.0, 1.0, "", where="a fraction 0-1")
    p = check_range("p_ambient_bar", p_ambient_bar, 0.5, 1.2, "bar(a)")
    x = humid_air_fractions(t_in, rh, p)
    dh = idealgas.h_mix(x, t_out + 273.15) - idealgas.h_mix(x, t_in + 273.15)  # J/mol
    n_dot = q * 1000.0 / dh  # mol/s
    return n_dot * R_MOLAR * (t_in + 273.15) / (p * 1e5) * 3600.0
