"""Exhaust loss of a gas engine on a net-calorific-value balance.

The sensible heat the wet exhaust still carries when it leaves the stack,
counted from a reference temperature (the combustion reference of the net
calorific value, 25 °C), with its water kept as vapour: on a balance on the
net calorific value the latent heat of the water is not part of the fuel
input, so it is not a loss either.  The enthalpy is that of the exhaust
family's ideal-gas mixture (:mod:`cellfuncs.recovery.exhaust`), so

    EXH_LOSS(t1) − EXH_LOSS(t2) = EXH_HEAT(t1 → t2).

Results are estimates for tendering; the exhaust flow comes from the engine's
declared datasheet; final design follows local codes and licensed engineers.
"""

from __future__ import annotations

from cellfuncs.errors import CellInputError, check_range, fmt

__all__ = ["exhaust_loss"]


def exhaust_loss(exhaust_flow_kg_h: float, t_stack: float, air_ratio: float, comp, t_reference: float = 25.0,
                 t_ambient: float = 25.0, rh_ambient: float = 0.3, p_ambient_bar: float = 1.0,
                 air: dict | None = None) -> float:
    """Sensible heat of the wet exhaust above a reference temperature, water as vapour [kW].

    Parameters
    ----------
    exhaust_flow_kg_h : float
        Wet exhaust mass flow, >= 0 [kg/h].
    t_stack : float
        Exhaust temperature leaving the plant (after the last exchanger), -50
        to 1500 [°C], not below t_reference.
    air_ratio : float
        Air ratio λ of the engine [-].
    comp : Composition
        Fuel gas (parsed).
    t_reference : float
        Reference temperature of the balance, the combustion reference of the
        calorific value, -50 to 100 [°C].
    t_ambient, rh_ambient, p_ambient_bar : float
        Combustion air: its humidity adds water to the exhaust [°C], [-], [bar(a)].

    Returns
    -------
    float
        ``ṁ·(h(t_stack) − h(t_reference))`` [kW], ideal-gas mixture, water as vapour.

    Raises
    ------
    CellInputError
        Negative flow, temperatures out of range, t_stack below t_reference.

    Notes
    -----
    The loss on a net-calorific-value balance (the latent heat of the
    exhaust's water is outside the net fuel input).  No dew-point check: below
    the water dew point a condensing exchanger would recover latent heat too,
    which a net balance counts as a (negative) loss; this function gives the
    sensible part only.  NASA-7 polynomials of GRI-Mech 3.0, 200-3000 K.

    References
    ----------
    .. [1] Smith, G. P. et al. (1999), GRI-Mech 3.0 thermodynamic data.
    .. [2] McBride, B. J., Gordon, S., Reno, M. A. (1993), NASA TM-4513.
    .. [3] ISO 3046-1:2002, reference conditions of the engine's heat balance
       (25 °C; from memory).
    """
    from cellfuncs.recovery import exhaust as _x

    m = check_range("exhaust_flow_kg_h", exhaust_flow_kg_h, 0.0, None, "kg/h")
    t_s = check_range("t_stack", t_stack, -50.0, 1500.0, "°C")
    t_r = check_range("t_reference", t_reference, -50.0, 100.0, "°C")
    if t_s < t_r:
        raise CellInputError(f"t_stack: {fmt(t_s)} °C is below t_reference {fmt(t_r)} °C; the loss is "
                             "counted from the reference temperature up")
    lam = check_range("air_ratio", air_ratio, 1.0, 20.0, "")
    w = _x.ambient_water(t_ambient, rh_ambient, p_ambient_bar)
    dh = _x.exhaust_enthalpy_drop(comp, lam, t_s, t_r, w, air)  # kJ/kg
    return m / 3600.0 * dh
