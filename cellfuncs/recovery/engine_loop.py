"""Engine cooling circuits at fixed duty: one exchanger to the client, a dump cooler for the rest.

An engine's cooling circuit (jacket water, and often the HT charge-air stage
and the oil cooler on the same circuit) is not a stream of given inlet
temperature and capacity rate: the engine rejects a fixed duty (from its
declared datasheet) and its coolant must come back no hotter than a maximum
engine inlet temperature.  The circuit leaves the engine at

    t_engine_out = t_engine_in_max + duty / C_engine,

passes one exchanger (UA) to the client's water, and a dump (emergency) cooler
on the engine side takes whatever the client's water cannot, so that the
engine inlet stays at ``t_engine_in_max``.  When the client's water could take
more than the duty the engine's thermostat bypasses part of the circuit and
the client receives exactly the duty (common practice).

    to_client = min(duty, ε·C_min·(t_engine_out − t_water_in)),
    dump      = duty − to_client.

Capacity rates are mass flow times the mean cp over each side's temperature
change (enthalpy differences from :mod:`cellfuncs.recovery.water`), iterated
until the ε-NTU duty and both enthalpy changes agree; ε comes from the
heat-exchanger family (:mod:`cellfuncs.heat_transfer.effectiveness`).

Results are estimates for tendering; the duty and temperatures come from the
engine's declared datasheet; final design follows local codes and licensed
engineers.
"""

from __future__ import annotations

from cellfuncs.errors import CellInputError, CellTypeError, check_range, fmt
from cellfuncs.heat_transfer.arrangements import parse as _parse_arrangement
from cellfuncs.recovery import water as _w

__all__ = ["LOOP_RESULTS", "engine_loop", "loop_in_chain", "hw_engine_loop"]

#: result words of HW_ENGINE_LOOP; "all" is a 1×4 row in this order
LOOP_RESULTS = ("to_client", "dump", "t_water_out", "t_engine_out", "all")


def _eps(ntu, c_ratio, arrangement):
    from cellfuncs.heat_transfer.effectiveness import epsilon

    return epsilon(ntu, c_ratio, arrangement)


def _mass_flow(name: str, flow_m3_h, t, t_name: str, gf: float, g: str) -> float:
    """Mass flow [kg/s] of a volume flow [m³/h] measured at t [°C], errors naming our arguments."""
    check_range(name, flow_m3_h, 0.0, None, "m³/h", lo_open=True)
    return _w.mass_flow(flow_m3_h, t, gf, g, t_name=t_name)


def _temperature(h: float, t_guess: float, gf: float, g: str, name: str, what: str, advice: str) -> float:
    """Invert h(t) after checking the liquid range; the error names ``name``."""
    t_lo, t_hi, h_lo, h_hi, cp_lo, cp_hi, label, why = _w.enthalpy_bounds(gf, g)
    if h > h_hi + 1e-9:
        t_est = t_hi + (h - h_hi) / cp_hi
        raise CellInputError(f"{name} {what} the {label} to about {fmt(round(t_est, 1))} °C, above "
                             f"{fmt(round(t_hi, 2))} °C ({why}); {advice}")
    if h < h_lo - 1e-9:
        t_est = t_lo - (h_lo - h) / cp_lo
        raise CellInputError(f"{name} {what} the {label} to about {fmt(round(t_est, 1))} °C, below "
                             f"{fmt(round(t_lo, 2))} °C (freezing)")
    return _w.temperature_from_enthalpy(h, t_guess, gf, g)


def _exchange(t_hot_in, h_hot_in, m_hot, fluid_hot, t_cold_in, h_cold_in, m_cold, fluid_cold,
              ua, arrangement):
    """ε-NTU duty [kW] of one exchanger with mean-cp capacity rates (no outlet checks)."""
    if ua == 0 or t_hot_in <= t_cold_in:
        return 0.0
    gh, ghn = fluid_hot
    gc, gcn = fluid_cold
    cp_h = _w.hw_cp(t_hot_in, gh, ghn)
    cp_c = _w.hw_cp(t_cold_in, gc, gcn)
    lo_h, hi_h, _, _ = _w.liquid_limits(gh, ghn)
    lo_c, hi_c, _, _ = _w.liquid_limits(gc, gcn)
    q = 0.0
    for _ in range(40):
        c_h, c_c = m_hot * cp_h, m_cold * cp_c
        c_min, c_max = min(c_h, c_c), max(c_h, c_c)
        try:
            eps = _eps(ua / c_min, c_min / c_max, arrangement)
        except CellInputError as err:
            raise CellInputError(f"ua_kw_k: {fmt(ua)} kW/K gives {err.message}") from None
        q = eps * c_min * (t_hot_in - t_cold_in)
        # outlets by enthalpy (clamped to the liquid range for the mean cp only)
        t_h = _w.temperature_from_enthalpy(h_hot_in - q / m_hot, t_hot_in - q / c_h, gh, ghn)
        t_c = _w.temperature_from_enthalpy(h_cold_in + q / m_cold, t_cold_in + q / c_c, gc, gcn)
        new_h = q / m_hot / (t_hot_in - t_h) if t_hot_in - t_h > 1e-7 and lo_h < t_h else cp_h
        new_c = q / m_cold / (t_c - t_cold_in) if t_c - t_cold_in > 1e-7 and t_c < hi_c else cp_c
        done = abs(new_h - cp_h) <= 1e-13 * cp_h and abs(new_c - cp_c) <= 1e-13 * cp_c
        cp_h, cp_c = new_h, new_c
        if done:
            break
    c_h, c_c = m_hot * cp_h, m_cold * cp_c
    c_min, c_max = min(c_h, c_c), max(c_h, c_c)
    return _eps(ua / c_min, c_min / c_max, arrangement) * c_min * (t_hot_in - t_cold_in)


def loop_in_chain(duty_kw: float, t_engine_in_max: float, m_engine: float, engine_fluid: tuple,
                  t_water_in: float, h_water_in: float, m_water: float, water_fluid: tuple,
                  ua_kw_k: float, arrangement: str, where: str = "", bypass_when_hot: bool = False) -> dict:
    """One engine loop seen by a client circuit of known mass flow and inlet state.

    Parameters
    ----------
    duty_kw : float
        Heat the engine rejects into the circuit, >= 0 [kW].
    t_engine_in_max : float
        Maximum engine inlet temperature of the circuit [°C].
    m_engine, m_water : float
        Mass flows of the engine circuit and the client's water [kg/s].
    engine_fluid, water_fluid : tuple
        ``(glycol_fraction, glycol)`` of each side.
    t_water_in : float
        Client water entering the exchanger [°C].
    h_water_in : float
        Its specific enthalpy [kJ/kg] (:func:`cellfuncs.recovery.water.enthalpy`).
    ua_kw_k : float
        UA of the exchanger, >= 0 [kW/K].
    arrangement : str
        Canonical arrangement word.
    where : str
        Text put after the argument name in messages (``"stage 2"``).
    bypass_when_hot : bool
        In a chain: water at or above the engine outlet temperature gets
        nothing (the thermostat sends the whole circuit to the dump cooler)
        instead of raising an error.

    Returns
    -------
    dict
        ``to_client``, ``dump`` [kW], ``t_engine_out``, ``t_hot_out`` (engine
        side leaving the exchanger, before the dump cooler), ``t_water_out``
        [°C], ``h_water_out`` [kJ/kg].

    References
    ----------
    See :func:`engine_loop`.
    """
    ge, gen = engine_fluid
    pre = f"{where} " if where else ""
    h_ei = _w.enthalpy(t_engine_in_max, ge, gen, name="t_engine_in_max", where=where)
    h_eo = h_ei + duty_kw / m_engine
    t_eo = (t_engine_in_max if duty_kw == 0 else
            _temperature(h_eo, t_engine_in_max + 1.0, ge, gen, "duty_kw: " + pre + "the duty", "heats",
                         "raise engine_flow_m3_h"))
    if t_water_in >= t_eo and bypass_when_hot:
        return {"to_client": 0.0, "dump": duty_kw, "t_engine_out": t_eo, "t_hot_out": t_eo,
                "t_water_out": t_water_in, "h_water_out": h_water_in}
    if t_water_in >= t_eo:
        raise CellInputError(
            f"t_water_in: {pre}{fmt(round(t_water_in, 3))} °C is not below the engine outlet "
            f"temperature {fmt(round(t_eo, 3))} °C (t_engine_in_max + duty/C_engine); the client's "
            "water cannot cool this circuit")
    q_x = _exchange(t_eo, h_eo, m_engine, engine_fluid, t_water_in, h_water_in, m_water, water_fluid,
                    ua_kw_k, arrangement)
    to_client = min(duty_kw, q_x)
    dump = duty_kw - to_client
    h_wo = h_water_in + to_client / m_water
    gw, gwn = water_fluid
    t_wo = (t_water_in if to_client == 0 else  # max(): Newton's last digit must not cool the water
            max(t_water_in, _temperature(h_wo, t_water_in + 1.0, gw, gwn, "ua_kw_k: " + pre + "the exchanger",
                                         "heats", "raise water_flow_m3_h")))
    t_hot_out = (t_engine_in_max if dump == 0 else
                 _w.temperature_from_enthalpy(h_eo - to_client / m_engine, t_engine_in_max, ge, gen))
    return {"to_client": to_client, "dump": dump, "t_engine_out": t_eo, "t_hot_out": t_hot_out,
            "t_water_out": t_wo, "h_water_out": h_wo}


def engine_loop(duty_kw: float, t_engine_in_max: float, engine_flow_m3_h: float, t_water_in: float,
                water_flow_m3_h: float, ua_kw_k: float, arrangement: str = "counter",
                glycol_fraction: float = 0.0, glycol: str = "ethylene") -> dict:
    """Engine cooling circuit at fixed duty coupled to the client's water by one exchanger.

    Parameters
    ----------
    duty_kw : float
        Heat the engine rejects into the circuit, from the engine's declared
        datasheet, >= 0 [kW].
    t_engine_in_max : float
        Maximum engine inlet temperature of the circuit; the dump cooler holds
        the engine inlet here [°C].
    engine_flow_m3_h : float
        Volume flow of the engine circuit, measured at t_engine_in_max, > 0 [m³/h].
    t_water_in : float
        Client's water entering the exchanger [°C].
    water_flow_m3_h : float
        Client's water volume flow, measured at t_water_in, > 0 [m³/h].
    ua_kw_k : float
        UA of the exchanger between the circuit and the client, >= 0 [kW/K].
    arrangement : str
        Flow arrangement of the exchanger (heat-exchanger family's words).
    glycol_fraction : float
        Glycol mass fraction of the engine circuit's fluid [-] (the client's
        side is water).
    glycol : str
        ``"ethylene"`` or ``"propylene"``.

    Returns
    -------
    dict
        ``to_client`` and ``dump`` [kW] (their sum is the duty), ``t_water_out``
        and ``t_engine_out`` [°C], ``t_hot_out`` (engine side leaving the
        exchanger) [°C].

    Raises
    ------
    CellInputError
        A negative duty, flows not above 0, a negative UA, the client's water
        at or above the engine outlet temperature, or a fluid leaving its
        liquid range.

    Notes
    -----
    ``t_engine_out = t_engine_in_max + duty/C_engine`` from the enthalpy rise;
    ``to_client = min(duty, ε·C_min·(t_engine_out − t_water_in))`` with
    ``ε(NTU = UA/C_min, C_min/C_max)``, capacity rates = mass flow × mean cp
    over each side's temperature change; ``dump = duty − to_client``.  When the
    client could take more than the duty the thermostat bypass limits the
    exchanger to the duty and the engine inlet stays at t_engine_in_max.
    Properties at 3 bar(a) (:mod:`cellfuncs.recovery.water`).

    References
    ----------
    .. [1] Kays, W. M., London, A. L. (1984), Compact Heat Exchangers, 3rd ed.,
       ch. 2 (ε-NTU method).
    .. [2] Incropera, F. P., DeWitt, D. P. (2007), Fundamentals of Heat and Mass
       Transfer, 6th ed., section 11.4.
    """
    q = check_range("duty_kw", duty_kw, 0.0, None, "kW")
    arr = _parse_arrangement(arrangement)
    ua = check_range("ua_kw_k", ua_kw_k, 0.0, None, "kW/K")
    m_e = _mass_flow("engine_flow_m3_h", engine_flow_m3_h, t_engine_in_max, "t_engine_in_max",
                     glycol_fraction, glycol)
    m_w = _mass_flow("water_flow_m3_h", water_flow_m3_h, t_water_in, "t_water_in", 0.0, "ethylene")
    h_wi = _w.enthalpy(t_water_in, name="t_water_in")
    return loop_in_chain(q, float(t_engine_in_max), m_e, (glycol_fraction, glycol), float(t_water_in),
                         h_wi, m_w, (0.0, "ethylene"), ua, arr)


def _result_word(result) -> str:
    if isinstance(result, str):
        w = "".join(result.split()).lower()
        if w in LOOP_RESULTS:
            return w
    raise CellTypeError(f"result: {result!r} is not one of " + ", ".join(f'"{o}"' for o in LOOP_RESULTS))


def hw_engine_loop(duty_kw, t_engine_in_max, engine_flow_m3_h, t_water_in, water_flow_m3_h, ua_kw_k,
                   arrangement="counter", result="to_client", glycol_fraction=0.0, glycol="ethylene"):
    """One result of :func:`engine_loop` [kW or °C], or "all": the four as a list.

    ``result`` is one of :data:`LOOP_RESULTS`; "all" returns to_client [kW],
    dump [kW], t_water_out [°C], t_engine_out [°C] in that order.

    References
    ----------
    .. [1] See :func:`engine_loop` (ε-NTU, first law).
    """
    word = _result_word(result)
    r = engine_loop(duty_kw, t_engine_in_max, engine_flow_m3_h, t_water_in, water_flow_m3_h, ua_kw_k,
                    arrangement, glycol_fraction, glycol)
    if word == "all":
        return [r["to_client"], r["dump"], r["t_water_out"], r["t_engine_out"]]
    return r[word]
