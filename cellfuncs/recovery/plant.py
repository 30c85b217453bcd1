"""Plant balance of a CHP unit: heat rate, efficiencies, primary energy savings.

Primary energy savings follow Directive 2012/27/EU, Annex II (b):

    PES = 1 − 1 / (CHP_Hη/Ref_Hη + CHP_Eη/Ref_Eη)

with the CHP unit's heat and electrical efficiencies and the harmonised
reference efficiencies for separate production of heat and electricity.  The
reference values depend on fuel, year of construction and country (and on
corrections for climate and grid losses), so they are arguments here.
"""

from __future__ import annotations

import math

from cellfuncs.errors import CellInputError, CellTypeError, check_range, fmt
from cellfuncs.recovery._cells import numbers

__all__ = ["chp_heat_rate", "chp_pes", "chp_balance", "BALANCE_OUTPUTS"]

BALANCE_OUTPUTS = ("total", "electrical", "thermal", "unaccounted")


def _eff(name: str, value: float) -> float:
    return check_range(name, value, 0.0, 1.0, "", lo_open=True, where="a fraction, 0 < η <= 1")


def chp_heat_rate(electrical_efficiency: float) -> float:
    """Heat rate: fuel energy per unit of electricity.

    Parameters
    ----------
    electrical_efficiency : float
        Electrical efficiency on the fuel's calorific value basis used, in
        (0, 1] [-].

    Returns
    -------
    float
        Heat rate ``3600/η_el`` [kJ/kWh], on the same calorific-value basis.

    Raises
    ------
    CellInputError
        η_el not in (0, 1].

    Notes
    -----
    1 kWh = 3600 kJ (definition).  Validity (checked): 0 < η_el <= 1.  State
    the calorific-value basis (net or gross) next to the result.

    References
    ----------
    .. [1] BIPM (2019), The International System of Units (SI Brochure), 9th ed.,
       Table 8 (kilowatt hour = 3.6 MJ).
    """
    return 3600.0 / _eff("electrical_efficiency", electrical_efficiency)


def chp_pes(electrical_efficiency: float, thermal_efficiency: float,
            ref_electrical_efficiency: float, ref_thermal_efficiency: float) -> float:
    """Primary energy savings of cogeneration, Directive 2012/27/EU Annex II.

    Parameters
    ----------
    electrical_efficiency : float
        CHP electrical efficiency, yearly electricity / fuel input (net
        calorific value) [-].
    thermal_efficiency : float
        CHP heat efficiency, yearly useful heat / fuel input [-]; may be 0.
    ref_electrical_efficiency : float
        Harmonised reference efficiency for separate electricity production [-].
    ref_thermal_efficiency : float
        Harmonised reference efficiency for separate heat production [-].

    Returns
    -------
    float
        PES [-] = ``1 − 1/(η_th/ref_th + η_el/ref_el)``; negative when the
        unit uses more primary energy than separate production.

    Notes
    -----
    The directive calls cogeneration "high-efficiency" when PES >= 0.10 (small
    and micro units: PES > 0).  The reference values are set by Commission
    Delegated Regulation for each fuel and year and corrected for climate and
    grid losses; take them from the applicable regulation.

    References
    ----------
    .. [1] Directive 2012/27/EU of the European Parliament and of the Council on
       energy efficiency, Annex II (b), OJ L 315, 14.11.2012.
    """
    el = _eff("electrical_efficiency", electrical_efficiency)
    th = check_range("thermal_efficiency", thermal_efficiency, 0.0, 1.0, "",
                     where="a fraction, 0 <= η <= 1")
    ref_el = _eff("ref_electrical_efficiency", ref_electrical_efficiency)
    ref_th = _eff("ref_thermal_efficiency", ref_thermal_efficiency)
    return 1.0 - 1.0 / (th / ref_th + el / ref_el)


def chp_balance(fuel_power_kw: float, electrical_kw: float, heat_kw, output: str = "total") -> float:
    """Energy balance of a CHP unit as fractions of the fuel power.

    Parameters
    ----------
    fuel_power_kw : float
        Fuel power input, > 0 [kW] (state the calorific-value basis next to it).
    electrical_kw : float
        Electrical output, >= 0 [kW].
    heat_kw : range or sequence
        Useful heat outputs, each >= 0 [kW], summed; blank cells are skipped.
    output : str
        ``"total"`` (electrical + thermal), ``"electrical"``, ``"thermal"``
        or ``"unaccounted"`` (1 − total: losses to radiation, the stack and
        unrecovered coolers).

    Returns
    -------
    float
        The chosen fraction of the fuel power [-].

    Raises
    ------
    CellTypeError
        Unknown output word.
    CellInputError
        fuel_power_kw not above 0; a negative electrical or heat output.

    Notes
    -----
    Fractions of the fuel power (first-law balance): η_el = P_el/P_fuel,
    η_th = ΣQ/P_fuel, total = η_el + η_th, unaccounted = 1 − total.  No upper
    limit is checked: on the net calorific value a condensing plant can exceed
    a total of 1; the unaccounted part is then negative.

    References
    ----------
    .. [1] Directive 2012/27/EU on energy efficiency, Annex II (a)-(b): electrical
       and heat efficiency as yearly output over the fuel input (from memory).
    """
    if not isinstance(output, str) or output.strip().lower() not in BALANCE_OUTPUTS:
        raise CellTypeError(f"output: {output!r} is not one of " +
                            ", ".join(f'"{o}"' for o in BALANCE_OUTPUTS))
    output = output.strip().lower()
    fuel = check_range("fuel_power_kw", fuel_power_kw, 0.0, None, "kW", lo_open=True)
    el = check_range("electrical_kw", electrical_kw, 0.0, None, "kW")
    heats = numbers("heat_kw", heat_kw)
    for i, q in enumerate(heats, start=1):
        if q < 0:
            raise CellInputError(f"heat_kw: value {i} is {fmt(q)} kW; useful heat cannot be negative")
    heat = math.fsum(heats)
    if output == "electrical":
        return el / fuel
    if output == "thermal":
        return heat / fuel
    total = (el + heat) / fuel
    return total if output == "total" else 1.0 - total
