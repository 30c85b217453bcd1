"""Emission values between the units of permits and engine datasheets, and the dry exhaust volume.

Units (all on dry exhaust at the reference O2 content ``o2_reference_pct``):

``ppm``     µmol of the species per mol of dry exhaust;
``mg/Nm3``  mg per m³ of dry exhaust at 0 °C and 1.01325 bar ("normal" m³);
``mg/MJ``   mg per MJ of fuel energy on the chosen calorific-value kind;
``g/kWh``   g per kWh of electricity (needs the electrical efficiency).

    mg/Nm³ = ppm · M / V_m,   V_m = 22.414 L/mol (ideal gas at 0 °C, 1.01325 bar)
    mg/MJ  = mg/Nm³ · V_dry(O2_ref) / 3.6
    g/kWh  = mg/MJ · 3.6 / 1000 / η_el

V_dry is the F-factor of the gas: the dry flue gas of stoichiometric
combustion (gas family's combustion core: CO2, SO2, N2 and Ar of the air and
the fuel, water removed) per unit of fuel energy, diluted to the reference O2
by the air that carries it, V_dry(O2_ref) = V_dry,0 · 20.9/(20.9 − O2_ref).
The calorific value is ISO 6976:2016's at 25 °C combustion reference.

Molar masses of the species from the IUPAC 2005 standard atomic weights used
by ISO 6976:2016 (C 12.0107, H 1.00794, O 15.9994, N 14.0067, S 32.065): NOx
as NO2, THC as CH4.
"""

from __future__ import annotations

import math

from cellfuncs.errors import CellInputError, CellTypeError, check_range, fmt

__all__ = [
    "MOLAR_VOLUME_L", "O2_AIR_PCT", "T_COMBUSTION", "SPECIES", "SPECIES_ALIASES", "UNITS",
    "UNIT_ALIASES", "species_molar_mass", "dry_volume", "emis_convert", "emis_convert_words",
]

#: molar volume of an ideal gas at 0 °C and 1.01325 bar (R·273.15 K/101 325 Pa = 22.41397) [L/mol]
MOLAR_VOLUME_L = 22.414
#: O2 in dry air in the dilution factor 20.9/(20.9 − O2_ref) [vol-%] (US EPA Method 19; common practice)
O2_AIR_PCT = 20.9
#: combustion reference temperature of the calorific value [°C]
T_COMBUSTION = 25

_AW = {"C": 12.0107, "H": 1.00794, "O": 15.9994, "N": 14.0067, "S": 32.065}

#: species word -> (formula counted, {element: atoms})
SPECIES = {
    "nox": ("NO2", {"N": 1, "O": 2}),
    "co": ("CO", {"C": 1, "O": 1}),
    "hcho": ("HCHO", {"C": 1, "H": 2, "O": 1}),
    "so2": ("SO2", {"S": 1, "O": 2}),
    "nh3": ("NH3", {"N": 1, "H": 3}),
    "thc": ("CH4", {"C": 1, "H": 4}),
}
SPECIES_ALIASES = {"formaldehyde": "hcho", "ch2o": "hcho", "nox(asno2)": "nox",
                   "thc(asch4)": "thc", "ammonia": "nh3"}

UNITS = ("ppm", "mg/nm3", "mg/mj", "g/kwh")
UNIT_ALIASES = {"mg/nm³": "mg/nm3", "mg/m3n": "mg/nm3", "ppmv": "ppm", "ppmvd": "ppm",
                "µmol/mol": "ppm", "umol/mol": "ppm", "g/kwhe": "g/kwh", "g/kwh(el)": "g/kwh"}
_NEEDS_GAS = ("mg/mj", "g/kwh")


def _word(value, name: str, words, aliases) -> str:
    if not isinstance(value, str):
        raise CellTypeError(f"{name}: {value!r} is not one of " + ", ".join(f'"{w}"' for w in words))
    key = "".join(value.lower().split())
    key = aliases.get(key, key)
    if key not in words:
        raise CellTypeError(f"{name}: \"{value.strip()}\" is not one of " +
                            ", ".join(f'"{w}"' for w in words))
    return key


def species_molar_mass(species: str = "nox") -> float:
    """Molar mass of an emission species as it is counted (NOx as NO2, THC as CH4). [g/mol]

    Parameters
    ----------
    species : str
        ``"nox"``, ``"co"``, ``"hcho"`` (``"formaldehyde"``), ``"so2"``,
        ``"nh3"`` or ``"thc"`` (case-insensitive).

    Returns
    -------
    m : float
        Sum of the IUPAC 2005 atomic weights of the counted formula. [g/mol]

    Raises
    ------
    CellTypeError
        Unknown species word.

    References
    ----------
    .. [1] IUPAC, Atomic weights of the elements 2005, Pure Appl. Chem. 78 (2006)
       2051-2066 (the values ISO 6976:2016 uses).
    """
    key = _word(species, "species", tuple(SPECIES), SPECIES_ALIASES)
    return math.fsum(_AW[e] * n for e, n in SPECIES[key][1].items())


def _o2(o2_reference_pct: float) -> float:
    return check_range("o2_reference_pct", o2_reference_pct, 0.0, O2_AIR_PCT, "vol-%",
                       hi_open=True, where="dry exhaust, below the 20.9 vol-% of air")


def dry_volume(comp, o2_reference_pct: float = 0.0, kind: str = "net") -> float:
    """Dry exhaust volume per unit of fuel energy (F-factor method).

    Parameters
    ----------
    comp : Composition
        Fuel gas (anything :func:`cellfuncs.gas.composition.parse_composition` takes).
    o2_reference_pct : float
        O2 content of the dry exhaust the volume is referred to, 0 to below
        20.9. [vol-%]
    kind : str
        Calorific-value kind of the fuel energy, ``"net"`` (default) or ``"gross"``.

    Returns
    -------
    v : float
        V = n_dry · V_m / H(kind, 25 °C) · 20.9/(20.9 − O2_ref), with n_dry the
        dry stoichiometric flue gas per mole of fuel and V_m = 22.414 L/mol.
        [Nm³/kWh] (m³ at 0 °C, 1.01325 bar per kWh of fuel)

    Raises
    ------
    CellInputError
        O2 reference outside 0 to 20.9 vol-%; a gas without combustibles or
        calorific value.

    Notes
    -----
    Complete combustion in dry air (gas family's combustion core); SO2 from
    H2S counts as dry gas.  Valid for any gas of the component list with a
    positive calorific value.  For natural gas about 0.78 Nm³/kWh on the gross
    and 0.86 Nm³/kWh on the net calorific value at 0 % O2.

    References
    ----------
    .. [1] US EPA, 40 CFR Part 60 Appendix A-7, Method 19, section 12.3 (F
       factors from the fuel's ultimate analysis) and Table 19-2 (F_d).
    .. [2] ISO 6976:2016, component tables (calorific values at 25 °C).
    """
    from cellfuncs.gas import combustion, iso6976
    from cellfuncs.gas.composition import Composition, parse_composition

    c = comp if isinstance(comp, Composition) else parse_composition(comp)
    o2 = _o2(o2_reference_pct)
    k = iso6976.parse_kind("net" if kind in (None, "") else kind)
    h = iso6976.molar_cv(c, k, T_COMBUSTION)  # kJ/mol
    if h <= 0:
        raise CellInputError("components: the gas has no calorific value, so no exhaust volume "
                             "per fuel energy")
    n = combustion.flue_gas_moles(c, 1.0, 0.0)
    n_dry = math.fsum(v for s, v in n.items() if s != "H2O")
    return n_dry * MOLAR_VOLUME_L * 1e-3 / (h / 3600.0) * O2_AIR_PCT / (O2_AIR_PCT - o2)


def _to_mg_nm3(value, unit, m, v_mj, eta):
    if unit == "ppm":
        return value * m / MOLAR_VOLUME_L
    if unit == "mg/nm3":
        return value
    if unit == "mg/mj":
        return value / v_mj
    return value * eta * 1000.0 / 3.6 / v_mj  # g/kWh


def _from_mg_nm3(c, unit, m, v_mj, eta):
    if unit == "ppm":
        return c * MOLAR_VOLUME_L / m
    if unit == "mg/nm3":
        return c
    if unit == "mg/mj":
        return c * v_mj
    return c * v_mj * 3.6 / 1000.0 / eta  # g/kWh


def emis_convert(value: float, unit_given: str, unit_wanted: str, species: str = "nox",
                 comp=None, o2_reference_pct: float = 5.0, electrical_efficiency: float | None = None,
                 kind: str = "net") -> float:
    """An emission value in another unit.

    Parameters
    ----------
    value : float
        Emission value in ``unit_given``, >= 0. [unit_given]
    unit_given, unit_wanted : str
        ``"ppm"`` (µmol/mol dry), ``"mg/Nm3"`` (dry, 0 °C, 1.01325 bar), both
        at ``o2_reference_pct``; ``"mg/MJ"`` of fuel energy; ``"g/kWh"`` of
        electricity (case-insensitive).
    species : str
        ``"nox"`` (as NO2), ``"co"``, ``"hcho"`` (formaldehyde), ``"so2"``,
        ``"nh3"``, ``"thc"`` (as CH4); used for ppm only.
    comp : Composition, optional
        Fuel gas; needed for mg/MJ and g/kWh.
    o2_reference_pct : float
        Reference O2 of the dry exhaust, 0 to below 20.9 (default 5). [vol-%]
    electrical_efficiency : float, optional
        Electrical efficiency on the ``kind`` calorific value, above 0 to 1;
        needed for g/kWh. [-]
    kind : str
        Calorific-value kind of the fuel energy, ``"net"`` (default) or ``"gross"``.

    Returns
    -------
    value : float
        The emission in ``unit_wanted``. [unit_wanted]

    Raises
    ------
    CellInputError
        Negative value; O2 reference outside 0 to 20.9 vol-%; efficiency outside
        (0, 1]; mg/MJ or g/kWh without the gas (components) or g/kWh without
        the efficiency.
    CellTypeError
        Unknown unit or species word.

    Notes
    -----
    mg/Nm³ = ppm·M/22.414; mg/MJ = mg/Nm³·V_dry(O2_ref)/3.6 with V_dry from
    :func:`dry_volume` [Nm³/kWh]; g/kWh = mg/MJ·3.6/1000/η_el.  Valid for any
    gas :func:`dry_volume` accepts.  Emission guarantees come from the engine's
    declared data; the permit's units, reference O2 and averaging follow local
    law.

    References
    ----------
    .. [1] US EPA, 40 CFR Part 60 Appendix A-7, Method 19 (F-factor method,
       20.9/(20.9 − %O2) dilution).
    .. [2] IUPAC 2005 atomic weights (molar masses); ideal-gas molar volume
       R·273.15 K/101 325 Pa (CODATA R).
    """
    v = check_range("value", value, 0.0, None, unit_given if isinstance(unit_given, str) else "")
    ug = _word(unit_given, "unit_given", UNITS, UNIT_ALIASES)
    uw = _word(unit_wanted, "unit_wanted", UNITS, UNIT_ALIASES)
    o2 = _o2(o2_reference_pct)
    m = species_molar_mass("nox" if species in (None, "") else species)
    eta = None
    if "g/kwh" in (ug, uw) and ug != uw:
        if electrical_efficiency is None:
            raise CellInputError("electrical_efficiency: needed to convert to or from g/kWh "
                                 "(per kWh of electricity); give it as a fraction 0-1")
        eta = check_range("electrical_efficiency", electrical_efficiency, 0.0, 1.0, "",
                          lo_open=True, where="a fraction")
    v_mj = None
    if (ug in _NEEDS_GAS or uw in _NEEDS_GAS) and ug != uw:
        if comp is None:
            need = ug if ug in _NEEDS_GAS else uw
            raise CellInputError(f"components: converting to or from {_SHOW[need]} needs the gas "
                                 "analysis (components) for the dry exhaust volume per fuel energy")
        v_mj = dry_volume(comp, o2, kind) / 3.6  # Nm³/MJ
    if ug == uw:
        return v
    out = _from_mg_nm3(_to_mg_nm3(v, ug, m, v_mj, eta), uw, m, v_mj, eta)
    if not math.isfinite(out):
        raise CellInputError(f"value: {fmt(v)} is too large to convert")
    return out


_SHOW = {"ppm": "ppm", "mg/nm3": "mg/Nm3", "mg/mj": "mg/MJ", "g/kwh": "g/kWh"}


def emis_convert_words(value, unit_given, unit_wanted, species="nox", gas=None, o2_reference_pct=5.0,
                       electrical_efficiency=None, kind="net") -> float:
    """:func:`emis_convert` with the unit words checked first; the gas is used only when needed.

    ``gas`` is a :class:`~cellfuncs.gas.composition.Composition` or None; it is
    ignored when neither unit needs the fuel (ppm <-> mg/Nm3, or the same unit).

    References
    ----------
    .. [1] See :func:`emis_convert` (F-factor method).
    """
    ug = _word(unit_given, "unit_given", UNITS, UNIT_ALIASES)
    uw = _word(unit_wanted, "unit_wanted", UNITS, UNIT_ALIASES)
    need_gas = ug != uw and (ug in _NEEDS_GAS or uw in _NEEDS_GAS)
    return emis_convert(value, ug, uw, species, gas if need_gas else None, o2_reference_pct,
                        electrical_efficiency, kind)
