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

from cellfuncs.errors import CellInputError, CellTypeError, check_finite, check_range, fmt

__all__ = ["chp_heat_rate", "chp_pes", "chp_balance", "chp_balance_check", "pes_reference", "grid_loss_factor",
           "BALANCE_OUTPUTS", "PES_FUELS", "PES_HEAT_USES"]

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


#: fuel words of CHP_PES (Delegated Regulation (EU) 2015/2402 Annexes I and II, gaseous and liquid fuels)
PES_FUELS = ("natural-gas", "biogas", "refinery-gas", "waste-gas", "oil", "bio-liquid")
#: heat-use words of CHP_PES (Annex II columns)
PES_HEAT_USES = ("hot-water", "steam", "exhaust")
#: last year of construction the 2015/2402 values are carried for (Delegated Regulation (EU)
#: 2023/2104 revised them from 2024; its figures are not carried)
LAST_YEAR = 2023

_TABLE: dict = {}


def _pes_table() -> dict:
    """cellfuncs/data/pes_reference.csv as {(table, fuel, condition): value} and the voltage bands."""
    if not _TABLE:
        import csv
        from importlib import resources

        text = resources.files("cellfuncs").joinpath("data/pes_reference.csv").read_text(encoding="utf-8")
        rows = csv.DictReader(ln for ln in text.splitlines() if not ln.startswith("#"))
        bands = {}
        for r in rows:
            if r["table"] == "annex_iv":
                key = (float(r["lo_kv"]), float(r["hi_kv"]) if r["hi_kv"] else math.inf)
                bands.setdefault(key, {})[r["condition"]] = float(r["value"])
            else:
                _TABLE[(r["table"], r["fuel"], r["condition"])] = float(r["value"])
        _TABLE["bands"] = sorted(bands.items())
    return _TABLE


def _period(year: float) -> str:
    y = check_range("construction_year", year, 1900.0, float(LAST_YEAR), "",
                    where="units built from 2024 fall under Delegated Regulation (EU) 2023/2104, whose "
                    "values are not carried: give the reference efficiencies directly")
    if y != int(y):
        raise CellInputError(f"construction_year: {fmt(y)} is not a whole year")
    return "before-2012" if y < 2012 else "2012-2015" if y < 2016 else "from-2016"


def grid_loss_factor(voltage_kv: float, onsite_share: float = 0.0) -> float:
    """Correction factor for avoided grid losses, Delegated Regulation (EU) 2015/2402 Annex IV [-].

    Parameters
    ----------
    voltage_kv : float
        Voltage of the grid connection, >= 0 [kV].
    onsite_share : float
        Share of the electricity consumed on site, 0 to 1 [-]; the rest is
        exported to the grid.

    Returns
    -------
    float
        ``share·f_on-site + (1 − share)·f_exported`` of the voltage band.

    References
    ----------
    .. [1] Commission Delegated Regulation (EU) 2015/2402, Annex IV (figures in
       cellfuncs/data/pes_reference.csv, from memory).
    """
    v = check_range("voltage_kv", voltage_kv, 0.0, 1000.0, "kV")
    share = check_range("onsite_share", onsite_share, 0.0, 1.0, "", where="a fraction 0-1")
    for (lo, hi), f in _pes_table()["bands"]:
        if lo <= v < hi:
            return share * f["on-site"] + (1.0 - share) * f["exported"]
    raise CellInputError(f"voltage_kv: {fmt(v)} kV is in no band of Annex IV")  # pragma: no cover


def pes_reference(fuel: str, construction_year: float, heat_use: str = "hot-water") -> tuple:
    """Harmonised reference efficiencies (electricity, heat) of Delegated Regulation (EU) 2015/2402 [-].

    Parameters
    ----------
    fuel : str
        One of :data:`PES_FUELS`.
    construction_year : float
        Year of construction of the unit, 1900 to 2023.
    heat_use : str
        One of :data:`PES_HEAT_USES` (Annex II column).

    Returns
    -------
    tuple
        ``(ref_electrical, ref_thermal)`` [-], uncorrected.

    References
    ----------
    .. [1] Commission Delegated Regulation (EU) 2015/2402, Annexes I and II
       (figures in cellfuncs/data/pes_reference.csv, from memory).
    """
    fuel = _word("fuel", fuel, PES_FUELS)
    heat_use = _word("heat_use", heat_use, PES_HEAT_USES)
    t = _pes_table()
    return t[("annex_i", fuel, _period(construction_year))], t[("annex_ii", fuel, heat_use)]


def _word(name: str, value, words: tuple) -> str:
    if isinstance(value, str):
        w = "".join(value.split()).lower().replace("_", "-")
        if w in words:
            return w
    raise CellTypeError(f"{name}: {value!r} is not one of " + ", ".join(f'"{o}"' for o in words))


def chp_pes(electrical_efficiency: float, thermal_efficiency: float,
            ref_electrical_efficiency: float | None = None, ref_thermal_efficiency: float | None = None,
            fuel: str | None = None, construction_year: float | None = None, heat_use: str = "hot-water",
            voltage_kv: float | None = None, onsite_share: float = 0.0) -> float:
    """Primary energy savings of cogeneration, Directive 2012/27/EU Annex II.

    Parameters
    ----------
    electrical_efficiency : float
        CHP electrical efficiency, yearly electricity / fuel input (net
        calorific value) [-].
    thermal_efficiency : float
        CHP heat efficiency, yearly useful heat / fuel input [-]; may be 0.
    ref_electrical_efficiency : float or None
        Reference efficiency for separate electricity production [-] (plain
        form); None when ``fuel`` is given.
    ref_thermal_efficiency : float or None
        Reference efficiency for separate heat production [-] (plain form);
        None when ``fuel`` is given.
    fuel : str or None
        Take both references from Delegated Regulation (EU) 2015/2402: one of
        :data:`PES_FUELS` (Annexes I and II).
    construction_year : float or None
        Year of construction of the unit (Annex I), needed with ``fuel``.
    heat_use : str
        Annex II column: ``"hot-water"``, ``"steam"`` or ``"exhaust"`` (direct
        use of exhaust gases).
    voltage_kv : float or None
        Grid connection voltage [kV]: when given, the electrical reference is
        multiplied by the Annex IV correction factor for avoided grid losses.
    onsite_share : float
        Share of the electricity consumed on site, 0 to 1 [-] (Annex IV).

    Returns
    -------
    float
        PES [-] = ``1 − 1/(η_th/ref_th + η_el/ref_el)``; negative when the
        unit uses more primary energy than separate production.

    Raises
    ------
    CellInputError
        Efficiencies outside (0, 1]; both a fuel and reference efficiencies, or
        neither; a year of construction after 2023 (values revised by
        Delegated Regulation (EU) 2023/2104, not carried).

    Notes
    -----
    The directive calls cogeneration "high-efficiency" when PES >= 0.10 (small
    and micro units: PES > 0).  The Annex II formula is carried unchanged into
    Directive (EU) 2023/1791 (from memory).  No climate correction (Annex III)
    is applied.  The figures of the regulation (cellfuncs/data/pes_reference.csv)
    are from memory: check them against the Official Journal.

    References
    ----------
    .. [1] Directive 2012/27/EU of the European Parliament and of the Council on
       energy efficiency, Annex II (b), OJ L 315, 14.11.2012.
    .. [2] Commission Delegated Regulation (EU) 2015/2402 of 12 October 2015,
       Annexes I, II and IV, OJ L 333, 19.12.2015, p. 54.
    """
    el = _eff("electrical_efficiency", electrical_efficiency)
    th = check_range("thermal_efficiency", thermal_efficiency, 0.0, 1.0, "",
                     where="a fraction, 0 <= η <= 1")
    if fuel is not None:
        if ref_electrical_efficiency is not None or ref_thermal_efficiency is not None:
            raise CellInputError("fuel: given together with reference efficiencies; give either a fuel "
                                 "(and construction_year) or both reference efficiencies")
        if construction_year is None:
            raise CellInputError("construction_year: blank; the regulation's electrical reference "
                                 "depends on the year the unit was built")
        ref_el, ref_th = pes_reference(fuel, construction_year, heat_use)
    else:
        if ref_electrical_efficiency is None or ref_thermal_efficiency is None:
            name = "ref_electrical_efficiency" if ref_electrical_efficiency is None else "ref_thermal_efficiency"
            raise CellInputError(f"{name}: blank; give both reference efficiencies, or a fuel and "
                                 "construction_year to take them from Delegated Regulation (EU) 2015/2402")
        ref_el = _eff("ref_electrical_efficiency", ref_electrical_efficiency)
        ref_th = _eff("ref_thermal_efficiency", ref_thermal_efficiency)
    if voltage_kv is not None:
        ref_el *= grid_loss_factor(voltage_kv, onsite_share)
    return 1.0 - 1.0 / (th / ref_th + el / ref_el)


def _heat_list(name: str, values) -> list:
    """Heat flows as a list of finite floats (a single number counts as one flow)."""
    if isinstance(values, (int, float)) and not isinstance(values, bool):
        values = (values,)
    if not isinstance(values, (tuple, list)):
        raise CellTypeError(f"{name}: {values!r} is not a list of numbers")
    return [check_finite(name, q) for q in values]


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
    heats = _heat_list("heat_kw", heat_kw)
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


#: bounds of CHP_BALANCE_CHECK: unaccounted share of the fuel [-]
BALANCE_OK_LOW, BALANCE_OK_HIGH = -0.005, 0.05


#: the largest power the balance check takes [kW] (10 GW: far above any engine plant; beyond it a
#: share of the fuel is no longer a number worth printing)
_PLANT_MAX_KW = 1e7


def chp_balance_check(fuel_power_kw: float, electrical_kw: float, heat_flows_kw, exhaust_loss_kw: float,
                      other_losses_kw: float = 0.0) -> str:
    """First-law check of a CHP plant's balance on the net calorific value (one line of text).

    Parameters
    ----------
    fuel_power_kw : float
        Fuel power input on the net calorific value, > 0 [kW].
    electrical_kw : float
        Electrical output, >= 0 [kW].
    heat_flows_kw : range or sequence
        Every heat flow leaving the plant, recovered and dumped, each >= 0
        [kW]; blanks skipped.
    exhaust_loss_kw : float
        Sensible heat of the exhaust leaving the stack above 25 °C, water as
        vapour (EXH_LOSS), >= 0 [kW].
    other_losses_kw : float
        Losses counted separately, e.g. radiation and generator losses, >= 0 [kW].

    Returns
    -------
    str
        ``"OK: ..."`` when the unaccounted share of the fuel lies between
        −0.5 % and 5 %; ``"CHECK: ..."`` when more than 5 % is unaccounted;
        ``"FIRST-LAW VIOLATION: outputs exceed the fuel by N kW (x.x %)"`` when
        the outputs exceed the fuel by more than 0.5 %.  At most 255 characters.

    Notes
    -----
    unaccounted = fuel − electrical − Σ heat flows − exhaust loss − other
    losses.  Radiation from the engine and the generator's losses are what
    normally remains when they are not entered: radiation typically about 1-3 % of
    the fuel, the generator's loss 2.5-4 % of the electrical output (about 1-1.7 %
    of the fuel) on engine sets of this size (common practice).

    References
    ----------
    .. [1] ISO 3046-1:2002, engine heat balance at standard reference conditions
       (from memory); first law of thermodynamics (steady flow).
    """
    fuel = check_range("fuel_power_kw", fuel_power_kw, 1e-3, _PLANT_MAX_KW, "kW")
    el = check_range("electrical_kw", electrical_kw, 0.0, _PLANT_MAX_KW, "kW")
    heats = _heat_list("heat_flows_kw", heat_flows_kw)
    for i, q in enumerate(heats, start=1):
        if q < 0:
            raise CellInputError(f"heat_flows_kw: value {i} is {fmt(q)} kW; a heat flow leaving the plant "
                                 "cannot be negative")
        if q > _PLANT_MAX_KW:
            raise CellInputError(f"heat_flows_kw: value {i} is {fmt(q)} kW, above the "
                                 f"{_PLANT_MAX_KW:.0e} kW this check takes")
    exh = check_range("exhaust_loss_kw", exhaust_loss_kw, 0.0, _PLANT_MAX_KW, "kW")
    other = check_range("other_losses_kw", other_losses_kw, 0.0, _PLANT_MAX_KW, "kW")
    out = math.fsum([el, exh, other] + heats)
    rest = fuel - out
    share = rest / fuel
    if share < BALANCE_OK_LOW:
        return (f"FIRST-LAW VIOLATION: outputs exceed the fuel by {_kw_text(-rest)} kW "
                f"({_pct_text(-share)} %)")
    kw, pct = _kw_text(rest), _pct_text(share)
    if share > BALANCE_OK_HIGH:
        return (f"CHECK: {kw} kW ({pct} %) of the fuel unaccounted, more than 5 %; "
                "a heat flow or loss is missing")
    return f"OK: {kw} kW ({pct} %) of the fuel unaccounted, within -0.5 % to 5 %"


def _kw_text(kw: float) -> str:
    """Whole kW; six significant digits beyond a plant's size (the text stays short)."""
    return str(round(kw) + 0) if abs(kw) < 1e9 else f"{kw:.6g}"


def _pct_text(share: float) -> str:
    """A share of the fuel in per cent with one decimal ("-0.0" written as "0.0")."""
    pct = share * 100
    return f"{round(pct, 1) + 0.0:.1f}" if abs(pct) < 1e6 else f"{pct:.3g}"
