"""Charge-air cooler: duty with condensation, condensate, dew point of the mixture.

The mixture (humid air + fuel gas, :mod:`cellfuncs.chargeair.mixture`) is an
ideal-gas mixture (NASA-7 data, :mod:`cellfuncs.gas.idealgas`).  Cooling from
t_in to t_out at p_bar:

* dew point: the water partial pressure y_w·p equals the saturation pressure
  (IAPWS-IF97 region 4; enhancement factor 1, see :mod:`cellfuncs.chargeair.humid`);
* below the dew point the vapour beyond saturation at (t_out, p_bar) leaves as
  liquid water at t_out: remaining vapour n_v = n_other·p_s/(p − p_s) per mole of
  dry air, condensate n_w − n_v;
* duty = H_in − H_out, with the gas enthalpy Σ n_i h_i(T) and the liquid water
  enthalpy h_liq(T) = h_H2O,ideal gas(T) − L(T)·M_w, L = h'' − h' of IAPWS
  (Clausius-Clapeyron with the IAPWS auxiliary equations, within 0.02 % of
  IAPWS-95).  The vapour's own departure from the ideal gas at saturation
  (about 0.1 % of L at 60 °C) is left out.

A two-stage cooler is two calls: HT stage from the compressor outlet to the
intermediate temperature, LT stage from there to the intake temperature.

Cautions: cooling below the dew point is allowed (it is what the user checks),
but condensate in the intake damages engines unless it is separated and
drained.  Results are estimates for tendering; the cooler's datasheet and the
engine maker's intake limits govern.

Notes
-----
Validity: t -40 to 400 °C, p_bar 0.5 to 50 bar(a); condensation only above
0.01 °C (liquid water; ice is refused).

References
----------
.. [1] Wagner, W. et al. (2000), IAPWS-IF97, J. Eng. Gas Turbines Power 122,
   150-182.
.. [2] Wagner, W., Pruss, A. (1993), J. Phys. Chem. Ref. Data 22, 783-787
   (auxiliary equations for the saturated densities).
.. [3] ASHRAE Handbook - Fundamentals (2017), ch. 1 Psychrometrics (dew point
   from the water partial pressure; humid-air enthalpy balance of a cooling
   coil with condensate leaving at the coil temperature; from memory).
"""

from __future__ import annotations

from cellfuncs.chargeair import humid
from cellfuncs.chargeair.mixture import (ISO_P_AMBIENT_BAR, M_WATER, ChargeMixture,
                                         charge_mixture)
from cellfuncs.errors import CellInputError, check_range, fmt
from cellfuncs.gas import idealgas

__all__ = ["dew_point", "duty", "condensate", "outlet_state"]

T_LO, T_HI = -40.0, 400.0  # °C
P_LO, P_HI = 0.5, 50.0  # bar


def _p(p_bar) -> float:
    return check_range("p_bar", p_bar, P_LO, P_HI, "bar")


def _mix(lambda_, comp, t_ambient, rh_ambient, p_ambient_bar) -> ChargeMixture:
    return charge_mixture(comp, lambda_, t_ambient, rh_ambient, p_ambient_bar)


def _dew(mix: ChargeMixture, p: float) -> float:
    return humid.dew_point_c(mix.y_water, p)


def dew_point(p_bar, lambda_, comp, t_ambient, rh_ambient,
              p_ambient_bar=ISO_P_AMBIENT_BAR) -> float:
    """Water dew point of the charge mixture at pressure p_bar.

    Parameters
    ----------
    p_bar : float
        Pressure of the mixture (boost pressure) [bar(a)], 0.5 to 50.
    lambda_ : float
        Air ratio [-], (0, 20] (ignored for air only).
    comp : Composition or None
        Fuel gas; None for humid air only.
    t_ambient, rh_ambient, p_ambient_bar : float
        Ambient air [°C], [-], [bar(a)].

    Returns
    -------
    float
        Dew point [°C] (frost point below 0.01 °C).

    Raises
    ------
    CellInputError
        A dry mixture (rh 0 and no water in the gas) has no dew point.

    Notes
    -----
    The water partial pressure y_w·p equals the saturation pressure
    (IAPWS-IF97 region 4, over ice below 0.01 °C; enhancement factor 1).
    Validity (checked, else CellInputError): p_bar 0.5 to 50 bar(a),
    t_ambient -50 to 60 °C, rh_ambient 0 to 1, p_ambient_bar 0.5 to 1.2
    bar(a), λ in (0, 20].

    References
    ----------
    .. [1] Wagner, W. et al. (2000), IAPWS-IF97, J. Eng. Gas Turbines Power 122,
       150-182 (saturation pressure, region 4).
    .. [2] ISO 3046-1:2002, standard reference conditions 25 °C, 30 % relative
       humidity, 100 kPa (the defaults of the ambient state; from memory).
    """
    p = _p(p_bar)
    mix = _mix(lambda_, comp, t_ambient, rh_ambient, p_ambient_bar)
    if mix.n_water <= 0.0:
        raise CellInputError("rh_ambient: 0 and no water in the gas, so the mixture is dry "
                             "and has no dew point")
    return _dew(mix, p)


def outlet_state(mix: ChargeMixture, t_out: float, p: float) -> tuple:
    """Vapour and condensate at (t_out [°C], p [bar]) per mole of dry air.

    Returns
    -------
    (n_vapour, n_condensate) : tuple of float
        [mol / mol dry air].

    References
    ----------
    .. [1] Wagner, W. et al. (2000), IAPWS-IF97, J. Eng. Gas Turbines Power 122,
       150-182 (saturation pressure, region 4).
    """
    T = t_out + 273.15
    if T >= humid.T_CRIT:
        return mix.n_water, 0.0
    ps = humid.p_sat_K(T)
    pp = p * 1e5
    if ps >= pp:
        return mix.n_water, 0.0
    n_sat = mix.n_other * ps / (pp - ps)
    if n_sat >= mix.n_water:
        return mix.n_water, 0.0
    return n_sat, mix.n_water - n_sat


def _check_t(name, t) -> float:
    return check_range(name, t, T_LO, T_HI, "°C")


def _condensing_ok(t_out: float, n_cond: float) -> None:
    if n_cond > 0.0 and t_out < 0.01:
        raise CellInputError(f"t_out: {fmt(t_out)} °C is below 0.01 °C with water condensing "
                             "(ice forming is not covered)")


def _per_mol_dry_air(mixture_flow_kg_h: float, mix: ChargeMixture) -> float:
    """Moles of dry air per second for a mixture mass flow [kg/h]."""
    return mixture_flow_kg_h / 3.6 / mix.mass  # (kg/h)/3.6 = g/s ; / (g/mol) = mol/s


def duty(mixture_flow_kg_h, t_in, t_out, p_bar, lambda_, comp, t_ambient, rh_ambient,
         p_ambient_bar=ISO_P_AMBIENT_BAR) -> float:
    """Heat removed from the charge mixture between t_in and t_out, latent heat included.

    Parameters
    ----------
    mixture_flow_kg_h : float
        Mass flow of the whole mixture (dry air + water + fuel) [kg/h], >= 0
        (CAC_MIXTURE_FLOW with part "mixture").
    t_in, t_out : float
        Mixture temperature into and out of the cooler (stage) [°C], t_out <= t_in.
    p_bar : float
        Mixture pressure [bar(a)] (pressure drop neglected).
    lambda_, comp, t_ambient, rh_ambient, p_ambient_bar
        As :func:`dew_point`.

    Returns
    -------
    float
        Duty [kW], sensible plus the latent heat of the water condensed.

    Raises
    ------
    CellInputError
        t_out above t_in; t_in below the dew point at p_bar (the inlet must be
        vapour only); condensation below 0.01 °C.

    Notes
    -----
    duty = ṅ_air·(H_in − H_out) with the ideal-gas enthalpies (NASA-7) of the
    mixture and, below the dew point, the latent heat L(t_out) of the water
    condensed (L = h'' − h' from Clausius-Clapeyron with the IAPWS auxiliary
    equations); the condensate leaves as liquid at t_out.  Validity (checked,
    else CellInputError): t_in and t_out -40 to 400 °C, p_bar 0.5 to 50
    bar(a), condensation only above 0.01 °C, t_ambient -50 to 60 °C,
    rh_ambient 0 to 1, p_ambient_bar 0.5 to 1.2 bar(a), λ in (0, 20].

    References
    ----------
    .. [1] Wagner, W. et al. (2000), IAPWS-IF97, J. Eng. Gas Turbines Power 122,
       150-182 (saturation pressure, region 4).
    .. [2] Smith, G.P. et al. (1999), GRI-Mech 3.0; McBride, B.J., Gordon, S.,
       Reno, M.A. (1993), NASA TM-4513 (ideal-gas NASA-7 data).
    .. [3] Wagner, W., Pruss, A. (1993), J. Phys. Chem. Ref. Data 22, 783-787
       (auxiliary equations for the saturated densities).
    """
    m = check_range("mixture_flow_kg_h", mixture_flow_kg_h, 0.0, None, "kg/h")
    t1 = _check_t("t_in", t_in)
    t2 = _check_t("t_out", t_out)
    p = _p(p_bar)
    if t2 > t1:
        raise CellInputError(f"t_out: {fmt(t2)} °C is above t_in {fmt(t1)} °C (a cooler "
                             "lowers the temperature)")
    mix = _mix(lambda_, comp, t_ambient, rh_ambient, p_ambient_bar)
    _, n_in_cond = outlet_state(mix, t1, p)
    if n_in_cond > 0.0:
        raise CellInputError(f"t_in: {fmt(t1)} °C is below the mixture's dew point "
                             f"{_dew(mix, p):.2f} °C at p_bar {fmt(p)} bar (the inlet must "
                             "be vapour only)")
    n_v, n_c = outlet_state(mix, t2, p)
    _condensing_ok(t2, n_c)
    other = mix.poly_other()
    h2o = idealgas.species_poly("H2O")
    T1, T2 = t1 + 273.15, t2 + 273.15
    dh = other.h(T1) - other.h(T2) + mix.n_water * (h2o.h(T1) - h2o.h(T2))
    if n_c > 0.0:
        dh += n_c * humid.latent_heat_K(T2) * M_WATER * 1e-3  # J/kg · kg/mol
    return _per_mol_dry_air(m, mix) * dh * 1e-3


def condensate(mixture_flow_kg_h, t_out, p_bar, lambda_, comp, t_ambient, rh_ambient,
               p_ambient_bar=ISO_P_AMBIENT_BAR) -> float:
    """Water condensed by cooling the charge mixture to t_out at p_bar.

    Parameters
    ----------
    mixture_flow_kg_h : float
        Mass flow of the whole mixture [kg/h], >= 0.
    t_out : float
        Cooler outlet temperature [°C].
    p_bar, lambda_, comp, t_ambient, rh_ambient, p_ambient_bar
        As :func:`dew_point`.

    Returns
    -------
    float
        Condensate [kg/h]; 0 at or above the dew point.

    Raises
    ------
    CellInputError
        Condensation below 0.01 °C (ice is not covered).

    Notes
    -----
    The vapour left at (t_out, p_bar) is n_v = n_other·p_s/(p − p_s) per mole
    of dry air (p_s by IAPWS-IF97 region 4); the rest of the water condenses.
    Validity (checked, else CellInputError): t_out -40 to 400 °C, p_bar 0.5 to
    50 bar(a), condensation only above 0.01 °C, t_ambient -50 to 60 °C,
    rh_ambient 0 to 1, p_ambient_bar 0.5 to 1.2 bar(a), λ in (0, 20].

    References
    ----------
    .. [1] Wagner, W. et al. (2000), IAPWS-IF97, J. Eng. Gas Turbines Power 122,
       150-182 (saturation pressure, region 4).
    """
    m = check_range("mixture_flow_kg_h", mixture_flow_kg_h, 0.0, None, "kg/h")
    t2 = _check_t("t_out", t_out)
    p = _p(p_bar)
    mix = _mix(lambda_, comp, t_ambient, rh_ambient, p_ambient_bar)
    _, n_c = outlet_state(mix, t2, p)
    _condensing_ok(t2, n_c)
    return _per_mol_dry_air(m, mix) * n_c * M_WATER * 3.6  # g/s -> kg/h
