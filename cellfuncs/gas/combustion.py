"""Complete combustion of a gas in dry air: oxygen demand, air, flue gas, CO2.

Each fuel component burns completely: carbon to CO2, hydrogen to H2O,
sulfur (H2S) to SO2, nitrogen (N2, NH3) leaves as N2; He, Ar, CO2, H2O of the
fuel pass through.  Per mole of fuel with atoms C, H, O, N, S per molecule
(mole-fraction weighted):

    O2 demand      o_min = C + H/4 + S − O/2                     [mol O2/mol fuel]
    dry air        a_min = o_min / x_O2,air                       [mol air/mol fuel]
    at air ratio λ the dry air is λ·a_min; the flue gas holds
    CO2 = C + λ·a_min·x_CO2,air,  H2O = H/2 + λ·a_min·w,  SO2 = S,
    N2  = N/2 + λ·a_min·x_N2,air,  Ar = x_Ar + λ·a_min·x_Ar,air,  He = x_He,
    O2  = (λ − 1)·o_min,
    w being the water carried per mole of dry air (humidity).

Dry air: O2 0.20946, N2 0.78084, Ar 0.00934, CO2 0.00036 mole fractions
(common practice; molar mass 28.96541 kg/kmol with the ISO 6976:2016 molar
masses, 2e-6 from the standard's M_air = 28.96546 kg/kmol).

Public API used by the charge-air and exhaust families: :data:`DRY_AIR`,
:data:`ATOMS`, :func:`atoms`, :func:`dry_air_molar_mass`, :func:`o2_demand`,
:func:`products`, :func:`stoich_air_molar`, :func:`stoich_air_mass`,
:func:`flue_gas_moles`, :func:`flue_gas_fractions`, :func:`fuel_mass_cv`,
:func:`co2_factor`.
"""

from __future__ import annotations

import math
from functools import lru_cache

from cellfuncs.errors import CellInputError, CellTypeError, check_range
from cellfuncs.gas.composition import Composition, parse_composition
from cellfuncs.gas import iso6976

__all__ = [
    "DRY_AIR", "ATOMS", "FLUE_SPECIES", "atoms", "dry_air_molar_mass", "o2_demand",
    "products", "stoich_air_molar", "stoich_air_mass", "flue_gas_moles",
    "flue_gas_fractions", "species_molar_mass", "fuel_mass_cv", "co2_factor",
    "air_requirement", "fuel_flow", "fuel_power",
]

#: dry air for combustion, mole fractions [-] (common practice)
DRY_AIR = {"O2": 0.20946, "N2": 0.78084, "Ar": 0.00934, "CO2": 0.00036}

#: atoms per molecule (C, H, O, N, S) of each component id; He and Ar carry none
ATOMS = {
    "CH4": (1, 4, 0, 0, 0), "C2H6": (2, 6, 0, 0, 0), "C3H8": (3, 8, 0, 0, 0),
    "nC4H10": (4, 10, 0, 0, 0), "iC4H10": (4, 10, 0, 0, 0),
    "nC5H12": (5, 12, 0, 0, 0), "iC5H12": (5, 12, 0, 0, 0), "neoC5H12": (5, 12, 0, 0, 0),
    "nC6H14": (6, 14, 0, 0, 0), "nC7H16": (7, 16, 0, 0, 0), "nC8H18": (8, 18, 0, 0, 0),
    "H2": (0, 2, 0, 0, 0), "CO": (1, 0, 1, 0, 0), "H2S": (0, 2, 0, 0, 1),
    "NH3": (0, 3, 0, 1, 0), "H2O": (0, 2, 1, 0, 0), "He": (0, 0, 0, 0, 0),
    "Ar": (0, 0, 0, 0, 0), "N2": (0, 0, 0, 2, 0), "O2": (0, 0, 2, 0, 0),
    "CO2": (1, 0, 2, 0, 0),
}

#: species of the flue gas, in this order in every result
FLUE_SPECIES = ("CO2", "H2O", "SO2", "N2", "O2", "Ar", "He")

# molar masses of flue species not in the ISO 6976 table [kg/kmol]
# SO2 from the same atomic weights as the table (S 32.065, O 15.9994; IUPAC 2005, from memory)
_EXTRA_M = {"SO2": 32.065 + 2 * 15.9994}


def _comp(comp) -> Composition:
    return comp if isinstance(comp, Composition) else parse_composition(comp)


def species_molar_mass(species: str) -> float:
    """Molar mass of a flue-gas or fuel species (ISO 6976:2016 table; SO2 from atomic weights). [kg/kmol]

    References
    ----------
    .. [1] ISO 6976:2016, component molar-mass table; SO2 from the same atomic
       weights (IUPAC 2005, from memory).
    """
    if species in _EXTRA_M:
        return _EXTRA_M[species]
    return iso6976.component_table()[species]["molar_mass"]


@lru_cache(maxsize=1)
def dry_air_molar_mass() -> float:
    """Molar mass of :data:`DRY_AIR` with the ISO 6976:2016 molar masses (28.96541). [kg/kmol]

    References
    ----------
    .. [1] ISO 6976:2016, component molar-mass table; dry-air composition common
       practice.
    """
    return math.fsum(x * species_molar_mass(s) for s, x in DRY_AIR.items())


def atoms(comp) -> tuple:
    """Mole-weighted atoms per mole of fuel (C, H, O, N, S). [mol/mol]

    References
    ----------
    .. [1] Arithmetic (molecular formulas of the components).
    """
    return _atoms(_comp(comp))


@lru_cache(maxsize=1024)
def _atoms(c: Composition) -> tuple:
    return tuple(math.fsum(x * ATOMS[i][k] for i, x in zip(c.ids, c.x)) for k in range(5))


def o2_demand(comp) -> float:
    """Oxygen needed for complete combustion, o_min = C + H/4 + S − O/2.

    Parameters
    ----------
    comp : Composition
        Fuel composition (oxygen in the fuel counts against the demand).

    Returns
    -------
    o_min : float
        [mol O2 / mol fuel]; may be 0 or negative for a fuel without combustibles.

    References
    ----------
    .. [1] Baehr, H. D., Kabelac, S., Thermodynamik, 16th ed., Springer 2016,
       chapter on combustion (stoichiometry; from memory).
    """
    c, h, o, _, s = atoms(_comp(comp))
    return c + h / 4.0 + s - o / 2.0


def products(comp) -> dict:
    """Complete-combustion products of one mole of fuel with exactly its O2 demand.

    Returns
    -------
    moles : dict
        ``{species: mol per mol fuel}`` for :data:`FLUE_SPECIES` (O2 = 0),
        without any air constituents; the fuel's own CO2, H2O, N2, Ar, He are
        included. [mol/mol]

    References
    ----------
    .. [1] Baehr, H. D., Kabelac, S. (2016), Thermodynamik, 16th ed., chapter on
       combustion (stoichiometry; from memory).
    """
    c = _comp(comp)
    nc, nh, _, nn, ns = atoms(c)
    return {"CO2": nc, "H2O": nh / 2.0, "SO2": ns, "N2": nn / 2.0, "O2": 0.0,
            "Ar": c.get("Ar"), "He": c.get("He")}


def _need_combustible(c: Composition) -> float:
    o = o2_demand(c)
    if o <= 1e-12:
        raise CellInputError("components: the gas needs no oxygen (no combustible components, "
                             "or more oxygen than the combustibles use)")
    return o


def stoich_air_molar(comp) -> float:
    """Stoichiometric dry air, a_min = o_min / 0.20946. [mol air / mol fuel]

    Equal to the volume ratio [m³ air / m³ gas] in the ideal-gas sense.

    Raises
    ------
    CellInputError
        If the gas needs no oxygen.

    References
    ----------
    .. [1] Baehr, H. D., Kabelac, S. (2016), Thermodynamik, 16th ed., chapter on
       combustion (stoichiometry; from memory).
    """
    return _need_combustible(_comp(comp)) / DRY_AIR["O2"]


def stoich_air_mass(comp) -> float:
    """Stoichiometric dry air on a mass basis, a_min·M_air/M_fuel. [kg air / kg fuel]

    References
    ----------
    .. [1] Baehr, H. D., Kabelac, S. (2016), Thermodynamik, 16th ed., chapter on
       combustion (stoichiometry; from memory).
    .. [2] ISO 6976:2016, component molar-mass table.
    """
    c = _comp(comp)
    return stoich_air_molar(c) * dry_air_molar_mass() / iso6976.molar_mass(c)


def _check_lambda(lambda_) -> float:
    return check_range("lambda_", lambda_, 1.0, 20.0, "-",
                       where="complete combustion needs lambda >= 1")


def flue_gas_moles(comp, lambda_: float = 1.0, water_per_mol_dry_air: float = 0.0) -> dict:
    """Flue gas of one mole of fuel burnt with λ times the stoichiometric dry air.

    Parameters
    ----------
    comp : Composition
        Fuel composition.
    lambda_ : float
        Air ratio λ = dry air / stoichiometric dry air, 1 to 20. [-]
    water_per_mol_dry_air : float
        Water vapour carried by the combustion air per mole of dry air
        (humidity ratio in mol/mol, e.g. from the charge-air family). [mol/mol]

    Returns
    -------
    moles : dict
        ``{species: mol per mol fuel}`` for :data:`FLUE_SPECIES`, wet. [mol/mol]

    Raises
    ------
    CellInputError
        λ below 1 (incomplete combustion is not modelled), negative water, no combustibles.

    References
    ----------
    .. [1] Baehr, H. D., Kabelac, S., Thermodynamik, 16th ed., Springer 2016,
       chapter on combustion (from memory).
    """
    c = _comp(comp)
    lam = _check_lambda(lambda_)
    w = check_range("water_per_mol_dry_air", water_per_mol_dry_air, 0.0, 1.0, "mol/mol")
    air = lam * stoich_air_molar(c)
    out = products(c)
    out["CO2"] += air * DRY_AIR["CO2"]
    out["H2O"] += air * w
    out["N2"] += air * DRY_AIR["N2"]
    out["Ar"] += air * DRY_AIR["Ar"]
    out["O2"] = air * DRY_AIR["O2"] - o2_demand(c)
    if out["O2"] < 0:  # rounding only (lam >= 1)
        out["O2"] = 0.0
    return out


def flue_gas_fractions(comp, lambda_: float = 1.0, water_per_mol_dry_air: float = 0.0,
                       dry: bool = False) -> dict:
    """Flue-gas mole fractions, wet or dry (water removed). [-]

    See :func:`flue_gas_moles` for the arguments.

    References
    ----------
    .. [1] Baehr, H. D., Kabelac, S. (2016), Thermodynamik, 16th ed., chapter on
       combustion (stoichiometry; from memory).
    """
    n = flue_gas_moles(comp, lambda_, water_per_mol_dry_air)
    if dry:
        n["H2O"] = 0.0
    tot = math.fsum(n.values())
    return {k: v / tot for k, v in n.items()}


def fuel_mass_cv(comp, kind: str = "net", t_combustion: float = 25) -> float:
    """Calorific value per kg of fuel at a combustion reference temperature. [MJ/kg]

    Thin front of :func:`cellfuncs.gas.iso6976.mass_cv` for the charge-air and
    exhaust families (fuel mass flow = fuel power / this value).

    Parameters
    ----------
    comp : Composition
    kind : str
        ``"net"`` (default, engine datasheets) or ``"gross"``.
    t_combustion : float
        0, 15, 20 or 25. [°C]

    References
    ----------
    .. [1] ISO 6976:2016, clause 8 (calorific value on a mass basis).
    """
    return iso6976.mass_cv(_comp(comp), kind, t_combustion)


# ---------------------------------------------------------------------------
# the GAS_ functions of this module


def air_requirement(comp, basis: str = "volume") -> float:
    """Stoichiometric dry-air requirement.

    Parameters
    ----------
    comp : Composition
        Fuel composition (mole fractions, normalised). [-]
    basis : str
        ``"volume"`` (also ``"molar"``, ``"mole"``): m³ air per m³ gas as the
        molar ratio (ideal gas); ``"mass"``: kg air per kg gas.

    Returns
    -------
    air : float
        Stoichiometric dry air a_min = (C + H/4 + S − O/2)/0.20946 [m³/m³], or
        a_min·M_air/M_gas [kg/kg].

    Raises
    ------
    CellInputError
        The gas needs no oxygen (no combustibles, or more O2 than they use).
    CellTypeError
        Unknown basis.

    Notes
    -----
    Complete combustion in dry air of O2 0.20946 mole fraction (common
    practice); valid for any composition of the component list (no range
    limit beyond a positive oxygen demand).  The volume ratio is the molar
    ratio; real-gas volumes differ by Z_gas/Z_air (< 0.3 %).  Molar masses of
    ISO 6976:2016.

    References
    ----------
    .. [1] Baehr, H. D., Kabelac, S. (2016), Thermodynamik, 16th ed., chapter on
       combustion (stoichiometry; from memory).
    .. [2] ISO 6976:2016, component molar-mass table.
    """
    c = _comp(comp)
    b = (basis or "volume").strip().lower() if isinstance(basis, str) else basis
    if b in ("volume", "molar", "mole"):
        return stoich_air_molar(c)
    if b == "mass":
        return stoich_air_mass(c)
    raise CellTypeError(f'basis: {basis!r} is not a basis; use "volume" or "mass"')


def co2_factor(comp, kind: str = "net", t_combustion: float = 25) -> float:
    """CO2 emitted per fuel energy, the fuel's own CO2 included. [kg/MWh]

    f = (C atoms per mole fuel)·M_CO2 / H_molar(kind, t1) · 3600.

    Parameters
    ----------
    comp : Composition
    kind : str
        ``"net"`` or ``"gross"`` energy basis.
    t_combustion : float
        0, 15, 20 or 25. [°C]

    Raises
    ------
    CellInputError
        If the gas carries no energy.

    References
    ----------
    .. [1] ISO 6976:2016 component tables (H, M); carbon balance (arithmetic).
    """
    c = _comp(comp)
    h = iso6976.molar_cv(c, kind, t_combustion)
    if h <= 0:
        raise CellInputError("components: the gas has no calorific value, CO2 per energy is undefined")
    return atoms(c)[0] * species_molar_mass("CO2") / h * 3600.0


def _energy_per_m3(c: Composition, kind, ref) -> float:
    hv = iso6976.volume_cv(c, kind, ref)
    if hv <= 0:
        raise CellInputError("components: the gas has no calorific value")
    return hv


def fuel_flow(comp, fuel_power_kw: float, kind: str = "net", ref="25/0") -> float:
    """Gas volume flow at the metering reference conditions for a fuel power.

    Q = P·3.6 / Hv(kind, ref), metering pressure 1.01325 bar.

    Parameters
    ----------
    comp : Composition
        Fuel composition (mole fractions, normalised). [-]
    fuel_power_kw : float
        Fuel (heat input) power on the chosen kind, >= 0. [kW]
    kind : str
        ``"net"`` (default) or ``"gross"`` (aliases LHV/HHV, inferior/superior).
    ref : str
        ``"t1/t2"`` combustion/metering temperatures [°C], default ``"25/0"``.

    Returns
    -------
    flow : float
        Gas volume flow at t2 and 1.01325 bar (real gas). [m³/h]

    Raises
    ------
    CellInputError
        Negative power; t1 not 0, 15, 20 or 25 °C, t2 not 0, 15 or 20 °C; Z at
        or below 0.9 (outside ISO 6976:2016); a gas without calorific value.

    Notes
    -----
    Hv = H(kind, t1)·p2/(Z·R·T2) of ISO 6976:2016.  Valid inside the
    standard's scope: Z > 0.9 at metering conditions, the tabulated reference
    temperatures.  Estimate for tendering; the gas meter's own conditions may
    differ.

    References
    ----------
    .. [1] ISO 6976:2016, clause 8 (calorific value on a volume basis) and clause 7
       (compression factor).
    """
    c = _comp(comp)
    p = check_range("fuel_power_kw", fuel_power_kw, 0.0, None, "kW")
    return p * 3.6 / _energy_per_m3(c, kind, ref)


def fuel_power(comp, flow_m3h: float, kind: str = "net", ref="25/0") -> float:
    """Fuel power of a gas volume flow, P = Q·Hv/3.6; inverse of :func:`fuel_flow`.

    Parameters
    ----------
    comp : Composition
        Fuel composition (mole fractions, normalised). [-]
    flow_m3h : float
        Gas volume flow at the metering conditions t2 and 1.01325 bar, >= 0. [m³/h]
    kind : str
        ``"net"`` (default) or ``"gross"`` (aliases LHV/HHV, inferior/superior).
    ref : str
        ``"t1/t2"`` combustion/metering temperatures [°C], default ``"25/0"``.

    Returns
    -------
    power : float
        Fuel (heat input) power on the chosen kind. [kW]

    Raises
    ------
    CellInputError
        As :func:`fuel_flow` (negative flow instead of negative power).

    Notes
    -----
    Hv = H(kind, t1)·p2/(Z·R·T2) of ISO 6976:2016.  Valid inside the
    standard's scope: Z > 0.9 at metering conditions, the tabulated reference
    temperatures.

    References
    ----------
    .. [1] ISO 6976:2016, clause 8 (calorific value on a volume basis) and clause 7
       (compression factor).
    """
    c = _comp(comp)
    q = check_range("flow_m3h", flow_m3h, 0.0, None, "m³/h")
    return q * _energy_per_m3(c, kind, ref) / 3.6
