"""The air–gas mixture of a mixture-charged gas engine: composition and mass flows.

The mixture is built per mole of dry air: humid ambient air (dry air of
:data:`cellfuncs.gas.combustion.DRY_AIR` plus the water vapour of the ambient
humidity) and fuel gas at the air ratio λ,

    fuel         n_fuel = 1 / (λ · a_min)            [mol fuel / mol dry air]
    water vapour n_w    = y_w / (1 − y_w) + n_fuel · x_H2O,fuel
    y_w          = rh · p_sat(t_ambient) / p_ambient

with a_min the stoichiometric dry air of the gas family's combustion core and
p_sat the saturation pressure of water (IAPWS-IF97 region 4; over ice below
0.01 °C, see :mod:`cellfuncs.chargeair.humid`).  Masses use the ISO 6976:2016
molar masses, so the dry air per kg of fuel equals GAS_AIR_REQUIREMENT(mass)
times λ exactly.

CAC_MIXTURE_FLOW: fuel gas flow = fuel power / mass calorific value (kind net
or gross, combustion reference 25 °C, ISO 6976:2016 via the gas family), and
the other parts in the mixture's mass ratios.  "fuel" is the fuel gas without
its own water; that water is counted under "water".

References
----------
.. [1] ISO 6976:2016, Natural gas -- Calculation of calorific values ...,
   clause 8 (calorific value on a mass basis) and the molar-mass table.
.. [2] ISO 3046-1:2002, Reciprocating internal combustion engines --
   Performance -- Part 1, standard reference conditions 25 °C, 30 % relative
   humidity, 100 kPa (from memory).
.. [3] Wagner, W. et al. (2000), IAPWS-IF97, J. Eng. Gas Turbines Power 122,
   150-182 (saturation pressure, region 4).
"""

from __future__ import annotations

import math
from dataclasses import dataclass, field
from functools import lru_cache

from cellfuncs.chargeair import humid
from cellfuncs.errors import CellInputError, CellTypeError, check_range, fmt
from cellfuncs.gas import idealgas

__all__ = [
    "ISO_T_AMBIENT",
    "ISO_RH_AMBIENT",
    "ISO_P_AMBIENT_BAR",
    "PARTS",
    "ChargeMixture",
    "check_lambda",
    "charge_mixture",
    "mixture_flow",
]

#: ISO 3046-1 standard reference conditions (from memory): 25 °C, 30 %, 100 kPa
ISO_T_AMBIENT = 25.0
ISO_RH_AMBIENT = 0.3
ISO_P_AMBIENT_BAR = 1.0

PARTS = ("mixture", "dry_air", "water", "fuel")
_PART_ALIASES = {"dryair": "dry_air", "air": "dry_air", "gas": "fuel", "total": "mixture",
                 "vapour": "water", "vapor": "water", "h2o": "water"}

LAMBDA_MAX = 20.0
#: molar mass of water [g/mol], ISO 6976:2016
M_WATER = humid.M_WATER


@dataclass(frozen=True)
class ChargeMixture:
    """Composition and masses of the charge mixture per mole of dry air.

    Attributes
    ----------
    moles : tuple of (str, float)
        Every species (air species, fuel components, water) [mol / mol dry air].
    n_water : float
        Water vapour, humidity plus the fuel's own water [mol / mol dry air].
    n_other : float
        Everything but water [mol / mol dry air].
    mass : float
        Mass of the whole mixture [g / mol dry air].
    mass_dry_air, mass_water, mass_fuel : float
        Parts of ``mass``; fuel without its water [g / mol dry air].
    n_fuel : float
        Fuel gas as analysed, its water included [mol / mol dry air].
    n_fuel_water : float
        The fuel's own water [mol / mol dry air].
    """

    moles: tuple
    n_water: float
    n_other: float
    mass: float
    mass_dry_air: float
    mass_water: float
    mass_fuel: float
    n_fuel: float = 0.0
    n_fuel_water: float = 0.0
    other: idealgas.Nasa7 = field(default=None, compare=False, repr=False)
    whole: idealgas.Nasa7 = field(default=None, compare=False, repr=False)

    @property
    def mass_gas(self) -> float:
        """Fuel gas as analysed, its water included [g / mol dry air]."""
        return self.mass - self.mass_dry_air - (self.n_water - self.n_fuel_water) * M_WATER

    @property
    def y_water(self) -> float:
        """Mole fraction of water vapour in the mixture [-]."""
        return self.n_water / (self.n_water + self.n_other)

    def poly_other(self) -> idealgas.Nasa7:
        """NASA-7 polynomial of the non-water part (per ``n_other`` moles)."""
        return self.other

    def poly(self) -> idealgas.Nasa7:
        """NASA-7 polynomial of the whole mixture (per ``n_water + n_other`` moles)."""
        return self.whole


def check_lambda(lambda_) -> float:
    """λ must be above 0 (rich mixtures allowed here) and at most 20. [-]"""
    return check_range("lambda_", lambda_, 0.0, LAMBDA_MAX, "", lo_open=True)


def check_ambient(t_ambient, rh_ambient, p_ambient_bar) -> tuple:
    """Validate the ambient state; returns (t [°C], rh [-], p [bar])."""
    t = check_range("t_ambient", t_ambient, -50.0, 60.0, "°C")
    rh = check_range("rh_ambient", rh_ambient, 0.0, 1.0, "")
    p = check_range("p_ambient_bar", p_ambient_bar, 0.5, 1.2, "bar")
    return t, rh, p


def charge_mixture(comp, lambda_, t_ambient=ISO_T_AMBIENT, rh_ambient=ISO_RH_AMBIENT,
                   p_ambient_bar=ISO_P_AMBIENT_BAR) -> ChargeMixture:
    """Mixture of humid ambient air and fuel gas per mole of dry air.

    Parameters
    ----------
    comp : Composition or None
        Fuel gas (``cellfuncs.gas.composition``); None for humid air only.
    lambda_ : float or None
        Air ratio λ = dry air / stoichiometric dry air, (0, 20] [-]; ignored
        without a gas.
    t_ambient : float
        Ambient temperature [°C], -50 to 60.
    rh_ambient : float
        Ambient relative humidity [-], 0 to 1 (over ice below 0.01 °C).
    p_ambient_bar : float
        Ambient pressure [bar(a)], 0.5 to 1.2.

    Returns
    -------
    ChargeMixture
        Cached per input.

    References
    ----------
    .. [1] ISO 6976:2016, molar-mass table (fuel and air masses).
    .. [2] Wagner, W. et al. (2000), IAPWS-IF97, J. Eng. Gas Turbines Power 122,
       150-182 (saturation pressure, region 4).
    .. [3] Baehr, H. D., Kabelac, S. (2016), Thermodynamik, 16th ed., chapter on
       combustion (stoichiometric air; from memory).
    """
    t, rh, p = check_ambient(t_ambient, rh_ambient, p_ambient_bar)
    if comp is not None:
        if lambda_ is None:
            raise CellInputError("lambda_: missing; the air ratio is needed when a gas is given")
        lam = check_lambda(lambda_)
    else:
        lam = None
    y = humid.vapour_mole_fraction(t, rh, p)
    return _charge_mixture(comp, lam, y)


@lru_cache(maxsize=512)
def _charge_mixture(comp, lam, y_w) -> ChargeMixture:
    from cellfuncs.gas import combustion

    moles = dict(combustion.DRY_AIR)
    n_hum = y_w / (1.0 - y_w)
    moles["H2O"] = n_hum
    mass_fuel_wet = 0.0
    n_fuel = 0.0
    n_fuel_water = 0.0
    if comp is not None:
        n_fuel = 1.0 / (lam * combustion.stoich_air_molar(comp))
        for cid, x in comp.items():
            moles[cid] = moles.get(cid, 0.0) + n_fuel * x
        n_fuel_water = n_fuel * comp.get("H2O")
        from cellfuncs.gas import iso6976

        mass_fuel_wet = n_fuel * iso6976.molar_mass(comp)
    m_w = M_WATER
    mass_air = combustion.dry_air_molar_mass()
    n_water = moles["H2O"]
    mass_fuel = mass_fuel_wet - n_fuel_water * m_w
    mass_water = n_water * m_w
    # the mixture's mass from its parts (so the parts sum to it exactly)
    mass = mass_air + mass_water + mass_fuel
    n_other = math.fsum(v for k, v in moles.items() if k != "H2O")
    ordered = tuple(sorted((k, v) for k, v in moles.items() if v > 0))
    other = idealgas.mix_poly(tuple((k, v) for k, v in ordered if k != "H2O"))
    whole = idealgas.mix_poly(ordered)
    return ChargeMixture(ordered, n_water, n_other, mass, mass_air, mass_water, mass_fuel,
                         n_fuel, n_fuel_water, other, whole)


def _part(part) -> str:
    if part is None:
        return "mixture"
    if not isinstance(part, str):
        raise CellTypeError(f"part: {part!r} is not a word; use one of {', '.join(PARTS)}")
    w = part.strip().lower().replace(" ", "").replace("-", "_")
    if w == "":
        return "mixture"
    w = _PART_ALIASES.get(w, w)
    if w not in PARTS:
        raise CellTypeError(f'part: "{part}" is not a part; use one of {", ".join(PARTS)}')
    return w


def mixture_flow(fuel_power_kw, lambda_, comp, kind="net", t_ambient=ISO_T_AMBIENT,
                 rh_ambient=ISO_RH_AMBIENT, p_ambient_bar=ISO_P_AMBIENT_BAR,
                 part="mixture") -> float:
    """Mass flow of the air–gas mixture or one of its parts.

    Parameters
    ----------
    fuel_power_kw : float
        Fuel (heat input) power of the engine on the chosen kind [kW], >= 0.
    lambda_ : float
        Air ratio λ [-], (0, 20].
    comp : Composition
        Fuel gas.
    kind : str
        ``"net"`` (default) or ``"gross"`` calorific value, at 25 °C combustion.
    t_ambient, rh_ambient, p_ambient_bar : float
        Ambient air [°C], [-], [bar(a)]; defaults ISO 3046-1 (from memory).
    part : str
        ``"mixture"`` (dry air + water vapour + fuel), ``"dry_air"``,
        ``"water"`` (humidity plus the fuel's water) or ``"fuel"`` (the fuel
        gas without its water).

    Returns
    -------
    float
        Mass flow [kg/h].

    Notes
    -----
    Valid for complete mixing of air and gas before the compressor.  The
    fuel flow rests on the mass calorific value of ISO 6976:2016 at 25 °C.
    Validity (checked, else CellInputError): fuel_power_kw >= 0,
    t_ambient -50 to 60 °C, rh_ambient 0 to 1, p_ambient_bar 0.5 to 1.2
    bar(a), λ in (0, 20].

    References
    ----------
    .. [1] ISO 6976:2016, clause 8 (calorific value on a mass basis) and the
       molar-mass table.
    .. [2] ISO 3046-1:2002, standard reference conditions 25 °C, 30 % relative
       humidity, 100 kPa (the ambient defaults; from memory).
    .. [3] Wagner, W. et al. (2000), IAPWS-IF97, J. Eng. Gas Turbines Power 122,
       150-182 (saturation pressure, region 4).
    """
    p_kw = check_range("fuel_power_kw", fuel_power_kw, 0.0, None, "kW")
    which = _part(part)
    if comp is None:
        raise CellInputError("components: a fuel gas is needed for the mixture flow")
    mix = charge_mixture(comp, lambda_, t_ambient, rh_ambient, p_ambient_bar)
    from cellfuncs.gas import combustion

    hm = combustion.fuel_mass_cv(comp, kind, 25)  # MJ/kg of the gas as analysed (wet)
    if not hm > 0:
        raise CellInputError("components: the gas has no calorific value")
    m_gas = 3.6 * p_kw / hm  # kg/h of gas as analysed
    scale = m_gas / mix.mass_gas  # (kg/h) per (g / mol dry air)
    value = {"mixture": mix.mass, "dry_air": mix.mass_dry_air, "water": mix.mass_water,
             "fuel": mix.mass_fuel}[which]
    return value * scale
