"""Saturated steam raised from engine exhaust: evaporator with a pinch, economiser with an approach.

The design-point calculation of a single-pressure heat-recovery steam generator
(HRSG) as set out by Ganapathy [1] (common practice):

1. saturation temperature ``T_s`` at the drum pressure (IAPWS-IF97 region 4);
2. evaporator: the gas leaves at ``T_s + pinch``; it gives
   ``Q_ev = ṁ_g·(h_g(t_exhaust_in) − h_g(T_s + pinch))``, which turns water
   leaving the economiser (``T_s − approach``, region 1) into saturated steam
   (region 2 at ``T_s``): ``ṁ_s = Q_ev / (h'' − h_eco)``;
3. economiser: the same ``ṁ_s`` heated from the feedwater temperature to
   ``T_s − approach`` takes ``Q_ec = ṁ_s·(h_eco − h_fw)`` from the gas, whose
   stack temperature follows from ``h_g(t_stack) = h_g(T_s + pinch) − Q_ec/ṁ_g``.

No blowdown, no heat loss to the surroundings, no pressure drops (feedwater
enthalpy taken at the drum pressure, pump work neglected).  The exhaust is the
ideal-gas flue gas of :mod:`cellfuncs.recovery.exhaust` (complete combustion at
the air ratio, combustion air at the ISO 3046-1 standard reference conditions
25 °C, 30 % RH, 100 kPa), enthalpy from the GRI-Mech 3.0 NASA-7 polynomials of
:mod:`cellfuncs.gas.idealgas`.  The stack may not fall below the exhaust's
water dew point (at 1.01325 bar(a)).

References
----------
.. [1] Ganapathy, V. (2003), Industrial Boilers and Heat Recovery Steam
   Generators: Design, Applications, and Calculations, Marcel Dekker, New York
   (HRSG design with pinch and approach points; chapter from memory).
.. [2] IAPWS R7-97(2012), IAPWS-IF97, regions 1, 2 and 4.
"""

from __future__ import annotations

from cellfuncs.errors import CellInputError, CellTypeError, check_range, fmt

__all__ = [
    "P_STEAM_MIN_BAR",
    "P_STEAM_MAX_BAR",
    "RESULTS",
    "steam_balance",
    "exhaust_steam",
]

#: lowest drum pressure accepted [bar(a)]
P_STEAM_MIN_BAR = 1.0
#: highest drum pressure accepted: below 165.29 bar(a), where the saturation
#: line leaves IF97 regions 1 and 2 (623.15 K) [bar(a)]
P_STEAM_MAX_BAR = 160.0
#: result words of EXH_STEAM
RESULTS = ("steam", "duty", "t_stack", "all")

_T0 = 273.15


def _gas(comp, air_ratio: float):
    """(NASA-7 polynomial of the wet exhaust per mole of fuel, its water mole fraction)."""
    from cellfuncs.gas import idealgas
    from cellfuncs.recovery import exhaust

    moles = exhaust.exhaust_moles(comp, air_ratio, exhaust.ambient_water())
    tot = sum(moles.values())
    return idealgas.mix_poly({k: v for k, v in moles.items() if v > 0}), moles["H2O"] / tot


def _result(result) -> str:
    r = "steam" if result in (None, "") else result
    if not isinstance(r, str) or r.strip().lower() not in RESULTS:
        raise CellTypeError(f"result: {result!r} is not one of " + ", ".join(f'"{w}"' for w in RESULTS))
    return r.strip().lower()


#: points inside the economiser checked for a temperature cross
_ECO_POINTS = 20


def _check_economiser(poly, p: float, h_fw: float, h_eco: float, h_stack: float, h_gas_ev: float,
                      t_fw: float) -> None:
    """Raise if the gas is not hotter than the water at points inside the (counterflow) economiser.

    Water at enthalpy ``h_fw + f·(h_eco − h_fw)`` meets gas at ``h_stack + f·(h_gas_ev −
    h_stack)`` (both linear in the heat exchanged); the water temperature comes from the
    region-1 backward equation T(p, h) (within 25 mK of the forward equation).
    """
    from cellfuncs.props import if97

    mm = poly.molar_mass
    for k in range(1, _ECO_POINTS):
        f = k / _ECO_POINTS
        t_w = if97.t_ph_region1(p, h_fw + f * (h_eco - h_fw)) - _T0
        t_g = poly.t_from_h((h_stack + f * (h_gas_ev - h_stack)) * mm, guess=t_w + _T0 + 10.0) - _T0
        if t_g <= t_w:
            raise CellInputError(f"t_feedwater: the gas ({fmt(round(t_g, 2))} °C) is not hotter than the "
                                 f"water ({fmt(round(t_w, 2))} °C) inside the economiser (temperature "
                                 f"cross); raise t_feedwater or pinch_k")


def steam_balance(exhaust_flow_kg_h: float, t_exhaust_in: float, air_ratio: float, comp,
                  p_steam_bar: float, t_feedwater: float, pinch_k: float = 10.0,
                  approach_k: float = 0.0) -> dict:
    """Heat and mass balance of a single-pressure exhaust steam generator.

    Parameters
    ----------
    exhaust_flow_kg_h : float
        Wet exhaust mass flow, from the engine's declared datasheet [kg/h].
    t_exhaust_in : float
        Exhaust temperature entering the evaporator [°C].
    air_ratio : float
        Air ratio λ of the engine, 1 to 20 [-].
    comp : Composition
        Fuel gas (anything :func:`cellfuncs.gas.composition.parse_composition` takes).
    p_steam_bar : float
        Drum (steam) pressure, 1 to 160 [bar(a)].
    t_feedwater : float
        Feedwater temperature entering the economiser, 0 °C to ``T_s − approach_k`` [°C].
    pinch_k : float
        Gas leaving the evaporator minus saturation temperature, above 0 [K].
    approach_k : float
        Saturation temperature minus water leaving the economiser, ≥ 0 [K].

    Returns
    -------
    dict
        ``steam_kg_h`` [kg/h], ``duty_kw`` (evaporator + economiser) [kW],
        ``evaporator_kw``, ``economiser_kw`` [kW], ``t_stack``, ``t_sat``,
        ``t_gas_evaporator_out``, ``t_economiser_out`` [°C], ``h_feedwater``,
        ``h_economiser_out``, ``h_steam`` [kJ/kg], ``gas_heat_kw`` (the
        exhaust's enthalpy drop from t_exhaust_in to t_stack) [kW] and
        ``t_dew`` (the exhaust's water dew point) [°C].

    Raises
    ------
    CellInputError
        A value out of range; feedwater above saturation less the approach;
        exhaust not hotter than saturation plus the pinch; a temperature cross
        at the economiser's cold end or at one of 19 points inside it; a stack
        below the water dew point.

    Notes
    -----
    See the module docstring for the method.  No blowdown, no heat loss, no
    pressure drops.  Water and steam from IAPWS-IF97 (regions 1, 2, 4).

    References
    ----------
    .. [1] Ganapathy, V. (2003), Industrial Boilers and Heat Recovery Steam
       Generators, Marcel Dekker.
    .. [2] IAPWS R7-97(2012), IAPWS-IF97.
    """
    from cellfuncs.props import if97
    from cellfuncs.recovery import exhaust

    m_g = check_range("exhaust_flow_kg_h", exhaust_flow_kg_h, 0.0, None, "kg/h", lo_open=True) / 3600.0
    t_in = check_range("t_exhaust_in", t_exhaust_in, -50.0, 1500.0, "°C")
    lam = check_range("air_ratio", air_ratio, 1.0, 20.0, "",
                      where="complete combustion needs an air ratio of at least 1")
    p_bar = check_range("p_steam_bar", p_steam_bar, P_STEAM_MIN_BAR, P_STEAM_MAX_BAR, "bar(a)",
                        where="saturated water and steam from IAPWS-IF97 regions 1 and 2, which reach "
                              "the saturation line up to 165.29 bar(a)")
    pinch = check_range("pinch_k", pinch_k, 0.0, 300.0, "K", lo_open=True,
                        where="the gas must leave the evaporator above the saturation temperature")
    approach = check_range("approach_k", approach_k, 0.0, None, "K")
    t_fw = check_range("t_feedwater", t_feedwater, 0.0, None, "°C", where="liquid water, IAPWS-IF97 region 1")

    p = p_bar / 10.0  # MPa
    ts = if97.t_sat(p) - _T0
    t_eco = ts - approach
    if t_fw > ts:
        raise CellInputError(f"t_feedwater: {fmt(t_fw)} °C is above the saturation temperature "
                             f"{fmt(round(ts, 2))} °C at {fmt(p_bar)} bar(a); feedwater must be liquid")
    if t_fw > t_eco:
        raise CellInputError(f"t_feedwater: {fmt(t_fw)} °C is above the economiser outlet "
                             f"{fmt(round(t_eco, 2))} °C (saturation {fmt(round(ts, 2))} °C less "
                             f"approach_k {fmt(approach)} K)")
    t_ev = ts + pinch
    if t_in <= t_ev:
        raise CellInputError(f"t_exhaust_in: {fmt(t_in)} °C is not above the saturation temperature "
                             f"{fmt(round(ts, 2))} °C plus pinch_k {fmt(pinch)} K = {fmt(round(t_ev, 2))} °C; "
                             "no steam can be raised")

    poly, y_h2o = _gas(comp, lam)
    mm = poly.molar_mass  # g per mole of fuel burnt

    def h_g(t_c: float) -> float:  # kJ/kg
        return poly.h(t_c + _T0) / mm

    h_fw = if97.region1(p, t_fw + _T0).h
    h_eco = if97.region1(p, t_eco + _T0).h
    h_steam = if97.region2(p, ts + _T0).h
    h_gas_ev = h_g(t_ev)
    q_ev = m_g * (h_g(t_in) - h_gas_ev)
    m_s = q_ev / (h_steam - h_eco)
    q_ec = m_s * (h_eco - h_fw)
    h_stack = h_gas_ev - q_ec / m_g
    if q_ec > 0 and h_stack <= h_g(t_fw):
        raise CellInputError(f"t_feedwater: the economiser would cool the gas to or below the feedwater "
                             f"{fmt(t_fw)} °C (temperature cross at its cold end); raise t_feedwater "
                             "or pinch_k")
    t_stack = poly.t_from_h(h_stack * mm, guess=t_ev + _T0, tol=1e-10) - _T0
    if q_ec > 0:
        _check_economiser(poly, p, h_fw, h_eco, h_stack, h_gas_ev, t_fw)
    t_dew = exhaust.exhaust_dewpoint(lam, comp) if y_h2o > 0 else None
    if t_dew is not None and t_stack < t_dew:
        raise CellInputError(f"t_feedwater: the stack temperature {fmt(round(t_stack, 2))} °C is below the "
                             f"exhaust's water dew point {fmt(round(t_dew, 2))} °C (at "
                             f"{fmt(exhaust.P_EXHAUST_BAR)} bar(a)); raise t_feedwater or approach_k")
    return {
        "steam_kg_h": m_s * 3600.0,
        "duty_kw": q_ev + q_ec,
        "evaporator_kw": q_ev,
        "economiser_kw": q_ec,
        "t_stack": t_stack,
        "t_sat": ts,
        "t_gas_evaporator_out": t_ev,
        "t_economiser_out": t_eco,
        "h_feedwater": h_fw,
        "h_economiser_out": h_eco,
        "h_steam": h_steam,
        "gas_heat_kw": m_g * (h_g(t_in) - h_g(t_stack)),
        "t_dew": t_dew,
    }


def exhaust_steam(exhaust_flow_kg_h: float, t_exhaust_in: float, air_ratio: float, comp,
                  p_steam_bar: float, t_feedwater: float, pinch_k: float = 10.0,
                  result: str = "steam", approach_k: float = 0.0):
    """Saturated steam raised from an engine's exhaust (EXH_STEAM).

    Parameters
    ----------
    exhaust_flow_kg_h, t_exhaust_in, air_ratio, comp, p_steam_bar, t_feedwater, pinch_k, approach_k
        As :func:`steam_balance`.
    result : str
        ``"steam"`` [kg/h], ``"duty"`` (evaporator + economiser) [kW],
        ``"t_stack"`` [°C] or ``"all"`` (a list of the three in that order).

    Returns
    -------
    float or list
        The chosen result.

    References
    ----------
    See :func:`steam_balance`.
    """
    r = _result(result)
    b = steam_balance(exhaust_flow_kg_h, t_exhaust_in, air_ratio, comp, p_steam_bar, t_feedwater,
                      pinch_k, approach_k)
    row = [b["steam_kg_h"], b["duty_kw"], b["t_stack"]]
    return row if r == "all" else row[RESULTS.index(r)]
