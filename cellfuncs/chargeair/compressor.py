"""Compressor outlet temperature of humid air or an air–gas mixture (TURBO_T_OUT).

Ideal-gas mixture of fixed composition with temperature-dependent heat
capacities (NASA-7 polynomials, :mod:`cellfuncs.gas.idealgas`):

1. isentropic outlet T_2s from the entropy balance
   Σ y_i s°_i(T_2s) − Σ y_i s°_i(T_1) = R ln(p_2/p_1)
   (the mixing term is the same at both ends and cancels);
2. the isentropic efficiency on enthalpy: h_2 = h_1 + (h_2s − h_1)/η_is;
3. T_2 from h_2.

The mixture is humid air plus fuel gas at the air ratio λ (see
:mod:`cellfuncs.chargeair.mixture`); without a gas, humid air only.  The
ambient humidity is taken at the compressor inlet pressure p_in_bar (TURBO_T_OUT
has no separate ambient pressure); for an inlet outside 0.5-1.2 bar (a later
stage) the water content is that of the ambient air at 1.0 bar.

Notes
-----
Validity: t_in -50 to 300 °C, p_in 0.3 to 50 bar(a), pressure ratio 1 to 10,
outlet below 1000 °C.  For dry air the result is within 0.35 K of CoolProp's
real-fluid air (Lemmon et al. 2000) for pressure ratios 1.5-5 from 0 to 50 °C
(the difference is mostly the real-gas effect, which the ideal-gas model
leaves out).  η_is is the compressor's total-to-total or total-to-static
isentropic efficiency as the turbocharger map states it.

References
----------
.. [1] Smith, G.P. et al. (1999), GRI-Mech 3.0; McBride, B.J., Gordon, S.,
   Reno, M.A. (1993), NASA TM-4513 (ideal-gas data).
.. [2] Dixon, S.L., Hall, C.A. (2014), Fluid Mechanics and Thermodynamics of
   Turbomachinery, 7th ed., Butterworth-Heinemann, ch. 2 (isentropic
   efficiency of a compressor on enthalpy; from memory).
"""

from __future__ import annotations

import math

from cellfuncs.chargeair import humid
from cellfuncs.chargeair.mixture import (ISO_RH_AMBIENT, ISO_T_AMBIENT,
                                         charge_mixture)
from cellfuncs.errors import CellInputError, check_range, fmt
from cellfuncs.gas import idealgas

__all__ = ["t_out"]

T_OUT_MAX = 1000.0  # °C


def t_out(t_in, p_in_bar, p_out_bar, eta_is, lambda_=None, comp=None,
          t_ambient=ISO_T_AMBIENT, rh_ambient=ISO_RH_AMBIENT) -> float:
    """Compressor outlet temperature of humid air or the air–gas mixture.

    Parameters
    ----------
    t_in : float
        Compressor inlet temperature [°C], -50 to 300.
    p_in_bar, p_out_bar : float
        Inlet and outlet pressure [bar(a)]; p_out >= p_in, ratio <= 10.
    eta_is : float
        Isentropic efficiency [-], in (0, 1].
    lambda_ : float, optional
        Air ratio [-], needed when a gas is given.
    comp : Composition, optional
        Fuel gas; None for humid air only.
    t_ambient, rh_ambient : float
        Ambient air that sets the humidity [°C], [-] (ISO 3046-1 defaults,
        from memory: 25 °C, 0.3).

    Returns
    -------
    float
        Outlet temperature [°C].

    Raises
    ------
    CellInputError
        p_out below p_in, η outside (0, 1], t_in below the mixture's dew point
        at p_in (the inlet would carry liquid water).

    Notes
    -----
    Isentropic outlet from Σ y_i s°_i(T_2s) − Σ y_i s°_i(T_1) = R ln(p_2/p_1),
    then h_2 = h_1 + (h_2s − h_1)/η_is and T_2 from h_2 (ideal-gas mixture of
    fixed composition, NASA-7 heat capacities).  Validity (checked, else
    CellInputError): t_in -50 to 300 °C, p_in_bar 0.3 to 50 bar(a), pressure
    ratio 1 to 10, outlet below 1000 °C, t_ambient -50 to 60 °C, rh_ambient
    0 to 1, λ in (0, 20].  For dry air within 0.35 K of a real-fluid air model
    (Lemmon et al. 2000) for pressure ratios 1.5-5 from 0 to 50 °C.

    References
    ----------
    .. [1] Dixon, S.L., Hall, C.A. (2014), Fluid Mechanics and Thermodynamics of
       Turbomachinery, 7th ed., ch. 2 (isentropic efficiency of a compressor on
       enthalpy; from memory).
    .. [2] Smith, G.P. et al. (1999), GRI-Mech 3.0; McBride, B.J., Gordon, S.,
       Reno, M.A. (1993), NASA TM-4513 (ideal-gas NASA-7 data).
    .. [3] Lemmon, E.W., Jacobsen, R.T., Penoncello, S.G., Friend, D.G. (2000),
       Thermodynamic properties of air and mixtures of nitrogen, argon and
       oxygen, J. Phys. Chem. Ref. Data 29, 331-385 (comparison only).
    """
    t1 = check_range("t_in", t_in, -50.0, 300.0, "°C")
    p1 = check_range("p_in_bar", p_in_bar, 0.3, 50.0, "bar")
    p2 = check_range("p_out_bar", p_out_bar, 0.0, None, "bar")
    if p2 < p1:
        raise CellInputError(f"p_out_bar: {fmt(p2)} bar is below p_in_bar {fmt(p1)} bar "
                             "(a compressor raises the pressure)")
    if p2 > 10.0 * p1:
        raise CellInputError(f"p_out_bar: {fmt(p2)} bar is above 10 × p_in_bar "
                             f"({fmt(10 * p1)} bar; pressure ratio at most 10)")
    eta = check_range("eta_is", eta_is, 0.0, 1.0, "", lo_open=True)
    # the ambient humidity at the compressor inlet pressure; a later stage (inlet
    # outside 0.5-1.2 bar) carries the water of ambient air at 1.0 bar
    p_amb = p1 if 0.5 <= p1 <= 1.2 else 1.0
    mix = charge_mixture(comp, lambda_, t_ambient, rh_ambient, p_amb)
    if mix.n_water > 0.0:
        td = humid.dew_point_c(mix.y_water, p1)
        if t1 < td - 1e-9:
            raise CellInputError(f"t_in: {fmt(t1)} °C is below the mixture's dew point "
                                 f"{td:.2f} °C at p_in_bar {fmt(p1)} bar (liquid water at the "
                                 "inlet)")
    poly = mix.poly()
    n = mix.n_water + mix.n_other
    T1 = t1 + 273.15
    if p2 == p1:
        return t1
    s2 = poly.s0(T1) + n * idealgas.R * math.log(p2 / p1)
    T2s = poly.t_from_s0(s2, guess=T1 * (p2 / p1) ** 0.2857)
    h1 = poly.h(T1)
    h2 = h1 + (poly.h(T2s) - h1) / eta
    # guard: outlet within the polynomials' range before solving
    if h2 > poly.h(T_OUT_MAX + 273.15):
        raise CellInputError(f"eta_is: {fmt(eta)} gives an outlet above {fmt(T_OUT_MAX)} °C "
                             "at this pressure ratio")
    T2 = poly.t_from_h(h2, guess=T1 + (T2s - T1) / eta)
    return T2 - 273.15
