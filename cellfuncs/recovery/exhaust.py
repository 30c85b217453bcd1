"""Engine exhaust: mass flow, composition, sensible heat to a stack temperature, dew point.

The exhaust is the flue gas of complete combustion of the fuel gas with
λ times the stoichiometric dry air plus the water vapour the humid ambient air
carries (gas family's combustion core, :mod:`cellfuncs.gas.combustion`: carbon
to CO2, hydrogen to H2O, H2S to SO2, excess O2, the air's N2, Ar and CO2).  Its
enthalpy is that of an ideal-gas mixture of the species, with the NASA-7
polynomials of GRI-Mech 3.0 used by the charge-air family
(:mod:`cellfuncs.gas.idealgas`).  The water dew point is the saturation
temperature of water (IAPWS-IF97, :mod:`cellfuncs.chargeair.humid`) at the
water's partial pressure.

Sensible heat only: below the water dew point water (and, with sulfur in the
fuel, acid) condenses.  About 120 °C is the usual lowest stack temperature for
natural-gas exhaust (common practice); it is not enforced here.
"""

from __future__ import annotations

import math

from cellfuncs.errors import CellInputError, CellTypeError, check_range, fmt

__all__ = [
    "SPECIES_WORDS",
    "P_EXHAUST_BAR",
    "ambient_water",
    "exhaust_moles",
    "exhaust_fractions",
    "exhaust_mass_per_mol_fuel",
    "exhaust_flow",
    "exhaust_composition",
    "exhaust_enthalpy_drop",
    "exhaust_heat",
    "exhaust_dewpoint",
    "o2_correct",
]

#: species words of EXH_COMPOSITION -> flue-gas species id
SPECIES_WORDS = {"co2": "CO2", "h2o": "H2O", "o2": "O2", "n2": "N2", "ar": "Ar", "so2": "SO2"}
#: pressure at which EXH_HEAT checks the dew point [bar(a)]
P_EXHAUST_BAR = 1.01325
#: O2 content of dry air in the emission-correction formula [vol-%] (common practice)
O2_AIR_PERCENT = 20.9
#: combustion reference temperature of the calorific value used for the fuel flow [°C]
T_COMBUSTION = 25


def _comb():
    from cellfuncs.gas import combustion

    return combustion


def _comp(comp):
    from cellfuncs.gas.composition import Composition, parse_composition

    return comp if isinstance(comp, Composition) else parse_composition(comp)


def _lambda(lambda_: float) -> float:
    return check_range("lambda_", lambda_, 1.0, 20.0, "", where="complete combustion needs lambda >= 1")


def ambient_water(t_ambient: float = 25.0, rh_ambient: float = 0.3, p_ambient_bar: float = 1.0) -> float:
    """Water carried by the combustion air per mole of dry air [mol/mol].

    ``w = y/(1 − y)`` with ``y = rh·p_sat(t)/p`` (IAPWS-IF97 saturation
    pressure from :mod:`cellfuncs.chargeair.humid`).

    References
    ----------
    .. [1] Wagner, W. et al. (2000), IAPWS-IF97, J. Eng. Gas Turbines Power 122,
       150-182 (saturation pressure, region 4).
    """
    from cellfuncs.chargeair import humid

    y = humid.vapour_mole_fraction(t_ambient, rh_ambient, p_ambient_bar,
                                   "t_ambient", "rh_ambient", "p_ambient_bar")
    return y / (1.0 - y)


def exhaust_moles(comp, lambda_: float, water_per_mol_dry_air: float = 0.0, air: dict | None = None) -> dict:
    """Exhaust of one mole of fuel [mol/mol fuel], wet, per species.

    Parameters
    ----------
    comp : Composition or anything :func:`parse_composition` takes
        Fuel gas.
    lambda_ : float
        Air ratio λ (dry air / stoichiometric dry air), 1 to 20 [-].
    water_per_mol_dry_air : float
        Water vapour of the combustion air per mole of dry air [mol/mol].
    air : dict, optional
        Dry-air mole fractions ``{"O2", "N2", "Ar", "CO2"}``; None uses the
        gas family's :data:`cellfuncs.gas.combustion.DRY_AIR`.

    Returns
    -------
    dict
        ``{species: mol per mol fuel}`` for CO2, H2O, SO2, N2, O2, Ar, He.

    Notes
    -----
    With ``air=None`` this is :func:`cellfuncs.gas.combustion.flue_gas_moles`;
    another dry air uses the same stoichiometry (the gas family's O2 demand and
    products) with that air's fractions.

    References
    ----------
    See :mod:`cellfuncs.gas.combustion`.
    """
    comb = _comb()
    c = _comp(comp)
    lam = _lambda(lambda_)
    w = check_range("water_per_mol_dry_air", water_per_mol_dry_air, 0.0, 1.0, "mol/mol")
    if air is None:
        return comb.flue_gas_moles(c, lam, w)
    o_min = comb.o2_demand(c)
    if o_min <= 1e-12:
        raise CellInputError("components: the gas needs no oxygen (no combustible components)")
    a = lam * o_min / air["O2"]
    out = comb.products(c)
    for sp in ("CO2", "N2", "Ar"):
        out[sp] += a * air.get(sp, 0.0)
    out["H2O"] += a * w
    out["O2"] = max(a * air["O2"] - o_min, 0.0)
    return out


def exhaust_fractions(comp, lambda_: float, water_per_mol_dry_air: float = 0.0,
                      dry: bool = False, air: dict | None = None) -> dict:
    """Exhaust mole fractions [-], wet or dry (water removed); see :func:`exhaust_moles`.

    References
    ----------
    See :mod:`cellfuncs.gas.combustion`.
    """
    n = exhaust_moles(comp, lambda_, water_per_mol_dry_air, air)
    if dry:
        n["H2O"] = 0.0
    tot = math.fsum(n.values())
    return {k: v / tot for k, v in n.items()}


def exhaust_mass_per_mol_fuel(comp, lambda_: float, water_per_mol_dry_air: float = 0.0,
                              air: dict | None = None) -> float:
    """Mass of exhaust per mole of fuel: fuel + dry air + air's water [g/mol fuel].

    Mass is conserved by construction: ``M_fuel + λ·a_min·(M_air + w·M_H2O)``
    with the ISO 6976:2016 molar masses.

    References
    ----------
    .. [1] ISO 6976:2016, component molar-mass table; stoichiometry as
       :mod:`cellfuncs.gas.combustion`.
    """
    comb = _comb()
    from cellfuncs.gas import iso6976

    c = _comp(comp)
    lam = _lambda(lambda_)
    w = check_range("water_per_mol_dry_air", water_per_mol_dry_air, 0.0, 1.0, "mol/mol")
    air_ = comb.DRY_AIR if air is None else air
    o_min = comb.o2_demand(c)
    if o_min <= 1e-12:
        raise CellInputError("components: the gas needs no oxygen (no combustible components)")
    n_air = lam * o_min / air_["O2"]
    m_air = math.fsum(x * comb.species_molar_mass(s) for s, x in air_.items())
    return iso6976.molar_mass(c) + n_air * (m_air + w * comb.species_molar_mass("H2O"))


def _kind(kind: str) -> str:
    from cellfuncs.gas import iso6976

    return iso6976.parse_kind(kind if kind not in (None, "") else "net")


def exhaust_flow(fuel_power_kw: float, lambda_: float, comp, kind: str = "net",
                 t_ambient: float = 25.0, rh_ambient: float = 0.3, p_ambient_bar: float = 1.0,
                 air: dict | None = None) -> float:
    """Wet exhaust mass flow of an engine burning a gas at an air ratio.

    Parameters
    ----------
    fuel_power_kw : float
        Fuel power on the ``kind`` calorific value at 25 °C [kW], from the
        engine's declared datasheet.
    lambda_ : float
        Air ratio λ [-], 1 to 20.
    comp : Composition
        Fuel gas.
    kind : str
        ``"net"`` or ``"gross"`` calorific value of the fuel power.
    t_ambient, rh_ambient, p_ambient_bar : float
        Combustion air: temperature [°C], relative humidity [-], pressure [bar(a)].
    air : dict, optional
        Dry-air composition, default the gas family's.

    Returns
    -------
    float
        Wet exhaust mass flow [kg/h] = fuel + dry air + the air's water.

    Notes
    -----
    Fuel molar flow = fuel power / ISO 6976:2016 molar calorific value at
    25 °C.  Complete combustion, no unburnt fuel or slip.

    References
    ----------
    ISO 6976:2016 (calorific values, molar masses).
    """
    p = check_range("fuel_power_kw", fuel_power_kw, 0.0, None, "kW")
    from cellfuncs.gas import iso6976

    c = _comp(comp)
    h = iso6976.molar_cv(c, _kind(kind), T_COMBUSTION)  # kJ/mol
    if h <= 0:
        raise CellInputError("components: the gas has no calorific value")
    w = ambient_water(t_ambient, rh_ambient, p_ambient_bar)
    n_fuel = p / h  # mol/s
    return n_fuel * exhaust_mass_per_mol_fuel(c, lambda_, w, air) * 3.6  # g/s -> kg/h


def _species(species: str) -> str:
    if not isinstance(species, str) or species.strip().lower() not in SPECIES_WORDS:
        raise CellTypeError(f"species: {species!r} is not one of " +
                            ", ".join(f'"{s}"' for s in SPECIES_WORDS))
    return SPECIES_WORDS[species.strip().lower()]


def _basis(basis: str) -> bool:
    b = "wet" if basis in (None, "") else basis
    if not isinstance(b, str) or b.strip().lower() not in ("wet", "dry"):
        raise CellTypeError(f'basis: {basis!r} is not "wet" or "dry"')
    return b.strip().lower() == "dry"


def exhaust_composition(lambda_: float, comp, species: str, basis: str = "wet",
                        t_ambient: float = 25.0, rh_ambient: float = 0.3, p_ambient_bar: float = 1.0,
                        air: dict | None = None) -> float:
    """Mole fraction of one species in the exhaust.

    Parameters
    ----------
    lambda_ : float
        Air ratio λ [-].
    comp : Composition
        Fuel gas.
    species : str
        ``"co2"``, ``"h2o"``, ``"o2"``, ``"n2"``, ``"ar"`` or ``"so2"``.
    basis : str
        ``"wet"`` or ``"dry"`` (water removed; ``"h2o"`` is then 0).
    t_ambient, rh_ambient, p_ambient_bar : float
        Combustion air [°C], [-], [bar(a)].

    Returns
    -------
    float
        Mole (= volume, ideal gas) fraction [-].

    References
    ----------
    See :func:`exhaust_moles`.
    """
    sp = _species(species)
    dry = _basis(basis)
    w = ambient_water(t_ambient, rh_ambient, p_ambient_bar)
    return exhaust_fractions(comp, lambda_, w, dry, air)[sp]


def _poly(moles: dict):
    from cellfuncs.gas import idealgas

    return idealgas.mix_poly({k: v for k, v in moles.items() if v > 0})


def exhaust_enthalpy_drop(comp, lambda_: float, t_in: float, t_out: float,
                          water_per_mol_dry_air: float = 0.0, air: dict | None = None) -> float:
    """Specific enthalpy drop of the exhaust from t_in to t_out [kJ/kg] (ideal gas, no checks).

    References
    ----------
    .. [1] Smith, G.P. et al. (1999), GRI-Mech 3.0 (NASA-7 polynomials of the
       species, :mod:`cellfuncs.gas.idealgas`).
    """
    p = _poly(exhaust_moles(comp, lambda_, water_per_mol_dry_air, air))
    return (p.h(t_in + 273.15) - p.h(t_out + 273.15)) / p.molar_mass  # J/g = kJ/kg


def exhaust_dewpoint(lambda_: float, comp, p_bar: float = 1.01325, t_ambient: float = 25.0,
                     rh_ambient: float = 0.3, p_ambient_bar: float = 1.0,
                     air: dict | None = None, name_p: str = "p_bar") -> float:
    """Water dew point of the exhaust.

    Parameters
    ----------
    lambda_ : float
        Air ratio λ [-].
    comp : Composition
        Fuel gas.
    p_bar : float
        Exhaust pressure [bar(a)].
    t_ambient, rh_ambient, p_ambient_bar : float
        Combustion air [°C], [-], [bar(a)].

    Returns
    -------
    float
        Temperature at which water starts to condense, ``T_sat(y_H2O·p)`` [°C].

    Notes
    -----
    Saturation temperature from IAPWS-IF97 region 4 (charge-air family); no
    enhancement factor.  The acid dew point of sulfur-bearing fuels is higher
    and is not computed.

    References
    ----------
    IAPWS R7-97(2012), IAPWS-IF97, region 4 (saturation line).
    """
    from cellfuncs.chargeair import humid

    p = check_range(name_p, p_bar, 0.0, 200.0, "bar(a)", lo_open=True)
    w = ambient_water(t_ambient, rh_ambient, p_ambient_bar)
    y = exhaust_fractions(comp, lambda_, w, False, air)["H2O"]
    if y <= 0:
        raise CellInputError("components: the exhaust holds no water (no hydrogen in the fuel, "
                             "dry air), so it has no water dew point")
    return humid.dew_point_c(y, p)


def exhaust_heat(exhaust_flow_kg_h: float, t_in: float, t_out: float, lambda_: float, comp,
                 t_ambient: float = 25.0, rh_ambient: float = 0.3, p_ambient_bar: float = 1.0,
                 air: dict | None = None) -> float:
    """Sensible heat the exhaust gives up when cooled from t_in to t_out.

    Parameters
    ----------
    exhaust_flow_kg_h : float
        Wet exhaust mass flow [kg/h], from the engine's declared datasheet or
        :func:`exhaust_flow`.
    t_in, t_out : float
        Exhaust temperature before and after the exchanger [°C].
    lambda_ : float
        Air ratio λ [-].
    comp : Composition
        Fuel gas.
    t_ambient, rh_ambient, p_ambient_bar : float
        Combustion air [°C], [-], [bar(a)].

    Returns
    -------
    float
        ``ṁ·(h(t_in) − h(t_out))`` [kW], ideal-gas mixture enthalpy.

    Raises
    ------
    CellInputError
        t_out below the exhaust's water dew point at 1.01325 bar(a), or above t_in.

    Notes
    -----
    NASA-7 polynomials of GRI-Mech 3.0, valid 200-3000 K (t_in up to
    1500 °C accepted here).  Sensible heat only; about 120 °C is the usual
    lowest stack temperature for natural gas (common practice).

    References
    ----------
    Smith, G. P. et al. (1999), GRI-Mech 3.0 thermodynamic data.
    McBride, B. J., Gordon, S., Reno, M. A. (1993), NASA TM-4513.
    """
    m = check_range("exhaust_flow_kg_h", exhaust_flow_kg_h, 0.0, None, "kg/h")
    t_in = check_range("t_in", t_in, -50.0, 1500.0, "°C")
    t_out = check_range("t_out", t_out, -50.0, 1500.0, "°C")
    if t_out > t_in:
        raise CellInputError(f"t_out: {fmt(t_out)} °C is above t_in {fmt(t_in)} °C; "
                             "the exhaust gives up heat only when it is cooled")
    w = ambient_water(t_ambient, rh_ambient, p_ambient_bar)
    moles = exhaust_moles(comp, lambda_, w, air)
    tot = math.fsum(moles.values())
    y = moles["H2O"] / tot
    if y > 0:
        from cellfuncs.chargeair import humid

        t_dew = humid.dew_point_c(y, P_EXHAUST_BAR)
        if t_out < t_dew:
            raise CellInputError(
                f"t_out: {fmt(t_out)} °C is below the exhaust's water dew point {fmt(round(t_dew, 2))} °C "
                f"(at {fmt(P_EXHAUST_BAR)} bar(a)); EXH_HEAT gives sensible heat only")
    p = _poly(moles)
    dh = (p.h(t_in + 273.15) - p.h(t_out + 273.15)) / p.molar_mass  # kJ/kg
    return m / 3600.0 * dh


def o2_correct(concentration: float, o2_measured: float, o2_reference: float) -> float:
    """An emission concentration referred to a reference O2 content.

    Parameters
    ----------
    concentration : float
        Measured concentration on a dry basis, >= 0 (any unit, e.g. [mg/m³] or
        [ppm]; the result has the same unit).
    o2_measured : float
        O2 measured in the dry exhaust, 0 to below 20.9 [vol-%].
    o2_reference : float
        Reference O2 of the limit value, 0 to below 20.9 (e.g. 5 or 15) [vol-%].

    Returns
    -------
    float
        ``c·(20.9 − O2_ref)/(20.9 − O2_meas)``, same unit as ``concentration``.

    Raises
    ------
    CellInputError
        Negative concentration; an O2 content below 0 or at or above 20.9 vol-%.

    Notes
    -----
    The dilution correction used in emission permits, with 20.9 vol-% O2 in
    dry air (common practice; e.g. Quebec Clean Air Regulation, Q-2, r. 4.1,
    s. 71, for 15 % O2).  Some regulations use 21 in place of 20.9: check
    the permit.  Validity: both O2 contents in [0, 20.9) vol-% dry; the
    concentration must be on the same dry basis as the O2 reading.

    References
    ----------
    .. [1] Quebec Clean Air Regulation, CQLR c. Q-2, r. 4.1, s. 71 (correction
       to 15 % O2 with 20.9 vol-% O2 in dry air).
    """
    c = check_range("concentration", concentration, 0.0, None, "")
    meas = check_range("o2_measured", o2_measured, 0.0, O2_AIR_PERCENT, "vol-%", hi_open=True,
                       where="below the 20.9 vol-% of dry air")
    ref = check_range("o2_reference", o2_reference, 0.0, O2_AIR_PERCENT, "vol-%", hi_open=True,
                      where="below the 20.9 vol-% of dry air")
    return c * (O2_AIR_PERCENT - ref) / (O2_AIR_PERCENT - meas)
