"""Calorific value, density, relative density and Wobbe index by ISO 6976:2016.

All properties follow from the normalised composition and the component
table ``cellfuncs/data/iso6976_2016.csv``:

* molar mass          M   = Σ x_i M_i                                  [kg/kmol]
* compression factor  Z   = 1 − (p2/p0)·(Σ x_i s_i)²                   [-]
* molar gross value   Hc  = Σ x_i Hc_i(t1)                             [kJ/mol]
* molar net value     Hi  = Hc − L°(t1)·Σ x_i h_i/2  (h_i H atoms)     [kJ/mol]
* mass basis          Hm  = H/M                                        [MJ/kg]
* volume basis        Hv  = H·p2/(Z·R·T2)                              [MJ/m³]
* density             ρ   = p2·M/(Z·R·T2)                              [kg/m³]
* relative density    d   = (M/M_air)·Z_air/Z                          [-]
* Wobbe index         W   = Hv/√d                                      [MJ/m³]

with p0 = 1.01325 bar, R = 8.3144621 J/(mol·K), M_air = 28.96546 kg/kmol
and Z_air(p2) = 1 − (p2/p0)·(1 − Z_air(p0)).  Reference conditions are
written ``"t1/t2"`` (combustion / metering temperature, °C).
"""

from __future__ import annotations

import csv
import math
from functools import lru_cache
from pathlib import Path

from cellfuncs.errors import CellInputError, CellTypeError, check_range, fmt
from cellfuncs.gas.composition import COMPONENT_IDS, Composition, parse_composition

__all__ = [
    "R", "P0_BAR", "M_AIR", "Z_AIR", "T_COMBUSTION", "T_METERING",
    "component_table", "parse_ref", "parse_kind", "parse_basis",
    "molar_mass", "compression_factor", "molar_cv", "mass_cv", "volume_cv",
    "calorific_value", "density", "relative_density", "wobbe_index", "air_compression_factor",
]

#: molar gas constant, CODATA 2010, as used by ISO 6976:2016 [J/(mol·K)]
R = 8.3144621
#: standard uncertainty of R, CODATA 2010 [J/(mol·K)]
U_R = 0.0000075
#: reference pressure of the summation factors [bar]
P0_BAR = 1.01325
#: molar mass of dry air, ISO 6976:2016 [kg/kmol]
M_AIR = 28.96546
#: compression factor of dry air at 1.01325 bar, ISO 6976:2016, by metering temperature [°C]
Z_AIR = {0: 0.999419, 15: 0.999595, 20: 0.999645}
#: combustion reference temperatures of the tables [°C]
T_COMBUSTION = (0, 15, 20, 25)
#: metering reference temperatures of the tables [°C]
T_METERING = (0, 15, 20)
#: lowest compression factor inside the scope of ISO 6976:2016 [-]
Z_MIN = 0.9

_SCOPE = "ISO 6976:2016 scope"
# hydrogen atoms per molecule (for the water formed)
_H_ATOMS = {"CH4": 4, "C2H6": 6, "C3H8": 8, "nC4H10": 10, "iC4H10": 10, "nC5H12": 12,
            "iC5H12": 12, "neoC5H12": 12, "nC6H14": 14, "nC7H16": 16, "nC8H18": 18,
            "H2": 2, "CO": 0, "H2S": 2, "NH3": 3, "H2O": 2, "He": 0, "Ar": 0, "N2": 0,
            "O2": 0, "CO2": 0}

_KIND_WORDS = {"gross": "gross", "hhv": "gross", "superior": "gross", "higher": "gross",
               "hs": "gross", "net": "net", "lhv": "net", "inferior": "net", "lower": "net",
               "hi": "net"}
_BASIS_WORDS = {"volume": "volume", "volumetric": "volume", "mass": "mass", "molar": "molar",
                "mole": "molar", "mol": "molar"}


@lru_cache(maxsize=1)
def component_table() -> dict:
    """Component data of ISO 6976:2016, ``{id: {field: float, "name": str, "source": str}}``.

    Fields: ``molar_mass`` [kg/kmol], ``hc_0 … hc_25`` ideal-gas molar gross
    calorific value at combustion 0/15/20/25 °C [kJ/mol] (water: L°),
    ``u_hc`` [kJ/mol], ``s_0, s_15, s_20`` summation factors [-], ``u_s`` [-].

    References
    ----------
    .. [1] ISO 6976:2016, the component tables (molar masses, calorific values,
       summation factors and their uncertainties).
    """
    path = Path(__file__).resolve().parent.parent / "data" / "iso6976_2016.csv"
    with path.open(newline="", encoding="utf-8") as fh:
        rows = list(csv.DictReader(ln for ln in fh if not ln.startswith("#")))
    out = {}
    for r in rows:
        d = {k: (v if k in ("id", "name", "source") else float(v)) for k, v in r.items()}
        out[r["id"]] = d
    missing = set(COMPONENT_IDS) - set(out)
    if missing:  # pragma: no cover - data file damaged
        raise RuntimeError(f"iso6976_2016.csv lacks {sorted(missing)}")
    return out


# ---------------------------------------------------------------------------
# words and reference conditions


def parse_kind(kind, arg: str = "kind") -> str:
    """``"gross"`` or ``"net"`` from a kind word (aliases HHV, LHV, superior, inferior)."""
    if kind is None or (isinstance(kind, str) and kind.strip() == ""):
        return "gross"
    if not isinstance(kind, str):
        raise CellTypeError(f'{arg}: {kind!r} is not a word; use "gross" or "net"')
    word = _KIND_WORDS.get(kind.strip().lower().replace(" ", ""))
    if word is None:
        raise CellTypeError(f'{arg}: "{kind}" is not a calorific value kind; use "gross" '
                            '(HHV, superior) or "net" (LHV, inferior)')
    return word


def parse_basis(basis, arg: str = "basis") -> str:
    """``"volume"``, ``"mass"`` or ``"molar"``."""
    if basis is None or (isinstance(basis, str) and basis.strip() == ""):
        return "volume"
    word = _BASIS_WORDS.get(str(basis).strip().lower()) if isinstance(basis, str) else None
    if word is None:
        raise CellTypeError(f'{arg}: {basis!r} is not a basis; use "volume", "mass" or "molar"')
    return word


def _temperature(value, allowed, arg, what):
    if allowed is T_METERING and isinstance(value, str) and "/" in value:
        return parse_ref(value, arg)[1]  # "t1/t2": the metering temperature is t2
    try:
        t = float(value)
    except (TypeError, ValueError):
        raise CellTypeError(f"{arg}: {value!r} is not a temperature in °C") from None
    for a in allowed:
        if abs(t - a) < 1e-9:
            return a
    raise CellInputError(f"{arg}: {what} {fmt(t)} °C is not one of "
                         f"{', '.join(str(a) for a in allowed)} °C (ISO 6976:2016 tables)")


@lru_cache(maxsize=64)
def _parse_ref_text(text: str, arg: str) -> tuple:
    body = text.replace("°C", "").replace("°", "").replace(" ", "").lower().rstrip("c")
    parts = body.split("/")
    if len(parts) != 2 or not all(parts):
        raise CellTypeError(f'{arg}: "{text}" is not a reference condition; write "t1/t2" in °C, '
                            'combustion/metering, e.g. "15/15" or "25/0"')
    t1 = _temperature(parts[0].rstrip("c"), T_COMBUSTION, arg, "combustion temperature")
    t2 = _temperature(parts[1], T_METERING, arg, "metering temperature")
    return t1, t2


def parse_ref(ref, arg: str = "ref") -> tuple:
    """Reference conditions ``"t1/t2"`` -> (combustion t1, metering t2) [°C].

    Parameters
    ----------
    ref : str or tuple
        ``"15/15"``, ``"25/0"``, ``"15 °C / 15 °C"``; or a pair (t1, t2).

    Raises
    ------
    CellTypeError
        Not of the form ``t1/t2``.
    CellInputError
        t1 not in 0, 15, 20, 25 °C or t2 not in 0, 15, 20 °C.
    """
    if ref is None:
        return 15, 15
    if isinstance(ref, (tuple, list)) and len(ref) == 2:
        return (_temperature(ref[0], T_COMBUSTION, arg, "combustion temperature"),
                _temperature(ref[1], T_METERING, arg, "metering temperature"))
    if not isinstance(ref, str):
        raise CellTypeError(f'{arg}: {ref!r} is not a reference condition like "15/15"')
    if ref.strip() == "":
        return 15, 15
    return _parse_ref_text(ref.strip(), arg)


def _p_metering(p_metering_bar) -> float:
    if p_metering_bar is None:
        return P0_BAR
    return check_range("p_metering_bar", p_metering_bar, 0.90, 1.10, "bar(a)",
                       where="ISO 6976:2016 metering pressure range")


# ---------------------------------------------------------------------------
# per-composition sums (cached)


@lru_cache(maxsize=1024)
def _sums(comp: Composition) -> dict:
    tab = component_table()
    rows = [(x, tab[c], _H_ATOMS[c]) for c, x in zip(comp.ids, comp.x)]
    out = {"M": math.fsum(x * r["molar_mass"] for x, r, _ in rows),
           "h2": math.fsum(x * h / 2.0 for x, _, h in rows)}
    for t in T_COMBUSTION:
        out[f"hc_{t}"] = math.fsum(x * r[f"hc_{t}"] for x, r, _ in rows)
    for t in T_METERING:
        out[f"s_{t}"] = math.fsum(x * r[f"s_{t}"] for x, r, _ in rows)
    return out


def _comp(comp) -> Composition:
    return comp if isinstance(comp, Composition) else parse_composition(comp)


def molar_mass(comp) -> float:
    """Molar mass of the gas.

    Parameters
    ----------
    comp : Composition
        Normalised composition (or anything :func:`parse_composition` takes).

    Returns
    -------
    m : float
        Molar mass M = Σ x_i M_i. [kg/kmol]

    References
    ----------
    .. [1] ISO 6976:2016, clause 6 and the component molar-mass table.
    """
    return _sums(_comp(comp))["M"]


def compression_factor(comp, t_metering: float = 15, p_metering_bar: float = P0_BAR,
                       check_scope: bool = True) -> float:
    """Compression factor by the summation-factor method of ISO 6976:2016.

    Parameters
    ----------
    comp : Composition
        Normalised composition.
    t_metering : float or str
        Metering reference temperature, 0, 15 or 20, or reference conditions
        ``"t1/t2"`` (combustion/metering, ISO 6976:2016 clause 3) of which t2 is
        taken. [°C]
    p_metering_bar : float
        Metering reference pressure, 0.90 to 1.10. [bar(a)]
    check_scope : bool
        Raise when Z <= 0.9 (outside the standard's scope).

    Returns
    -------
    z : float
        Z = 1 − (p2/p0)·(Σ x_i s_i)². [-]

    Raises
    ------
    CellInputError
        Metering temperature not tabulated, pressure outside 0.90–1.10 bar, Z <= 0.9.

    Notes
    -----
    The p2 correction scales the second-virial term with pressure; valid for
    gases with Z > 0.9 at metering conditions.

    References
    ----------
    .. [1] ISO 6976:2016, clause 7 (compression factor) and the summation-factor table.
    """
    c = _comp(comp)
    t2 = _temperature(t_metering, T_METERING, "t_metering", "metering temperature")
    p2 = _p_metering(p_metering_bar)
    s = _sums(c)[f"s_{t2}"]
    z = 1.0 - (p2 / P0_BAR) * s * s
    if check_scope and z <= Z_MIN:
        raise CellInputError(
            f"components: compression factor Z = {z:.4f} at {t2} °C is at or below {Z_MIN} "
            f"({_SCOPE}); too many heavy or condensable components for this method")
    return z


def air_compression_factor(t_metering: float = 15, p_metering_bar: float = P0_BAR) -> float:
    """Compression factor of dry air, Z_air(p2) = 1 − (p2/p0)(1 − Z_air(p0)). [-]

    References
    ----------
    .. [1] ISO 6976:2016, clause 9 (relative density), Z of dry air.
    """
    t2 = _temperature(t_metering, T_METERING, "t_metering", "metering temperature")
    p2 = _p_metering(p_metering_bar)
    return 1.0 - (p2 / P0_BAR) * (1.0 - Z_AIR[t2])


def molar_cv(comp, kind: str = "gross", t_combustion: float = 15) -> float:
    """Ideal-gas molar calorific value.

    Parameters
    ----------
    comp : Composition
    kind : str
        ``"gross"`` (water formed condensed) or ``"net"`` (water formed as vapour).
    t_combustion : float
        Combustion reference temperature, 0, 15, 20 or 25. [°C]

    Returns
    -------
    h : float
        Hc = Σ x_i Hc_i; net Hi = Hc − L°·Σ x_i h_i/2. [kJ/mol]

    References
    ----------
    .. [1] ISO 6976:2016, clause 8 (calorific value on a molar basis).
    """
    c = _comp(comp)
    t1 = _temperature(t_combustion, T_COMBUSTION, "t_combustion", "combustion temperature")
    s = _sums(c)
    hc = s[f"hc_{t1}"]
    if parse_kind(kind) == "net":
        hc -= component_table()["H2O"][f"hc_{t1}"] * s["h2"]
    return hc


def mass_cv(comp, kind: str = "gross", t_combustion: float = 15) -> float:
    """Calorific value on a mass basis, Hm = H/M. [MJ/kg]

    References
    ----------
    .. [1] ISO 6976:2016, clause 8 (calorific value on a mass basis).
    """
    c = _comp(comp)
    return molar_cv(c, kind, t_combustion) / _sums(c)["M"]


def _vol_factor(c: Composition, t2, p2) -> float:
    """p2/(Z·R·T2) in kmol/m³ (so that kJ/mol × factor = MJ/m³)."""
    z = compression_factor(c, t2, p2)
    return p2 * 1e5 / (z * R * (t2 + 273.15)) / 1000.0


def volume_cv(comp, kind: str = "gross", ref="15/15", p_metering_bar: float = P0_BAR) -> float:
    """Real-gas calorific value on a volume basis, Hv = H·p2/(Z·R·T2). [MJ/m³]

    Parameters
    ----------
    comp : Composition
    kind : str
        ``"gross"`` or ``"net"``.
    ref : str
        ``"t1/t2"`` combustion/metering reference temperatures. [°C]
    p_metering_bar : float
        Metering pressure, 0.90–1.10. [bar(a)]

    References
    ----------
    .. [1] ISO 6976:2016, clause 8 (calorific value on a volume basis).
    """
    c = _comp(comp)
    t1, t2 = parse_ref(ref)
    return molar_cv(c, kind, t1) * _vol_factor(c, t2, p_metering_bar)


def calorific_value(comp, kind: str = "gross", basis: str = "volume", ref="15/15",
                    p_metering_bar: float = P0_BAR) -> float:
    """Calorific value on a volume [MJ/m³], mass [MJ/kg] or molar [kJ/mol] basis.

    Parameters
    ----------
    comp : Composition
    kind : str
        ``"gross"``/``"net"`` (aliases HHV, LHV, superior, inferior).
    basis : str
        ``"volume"``, ``"mass"`` or ``"molar"``.
    ref : str
        ``"t1/t2"`` [°C]; t2 and the pressure only matter on the volume basis.
    p_metering_bar : float
        Metering pressure, 0.90–1.10. [bar(a)]

    Returns
    -------
    h : float
        [MJ/m³], [MJ/kg] or [kJ/mol] by basis.

    Notes
    -----
    Volumetric values are refused when Z <= 0.9 (outside ISO 6976:2016).

    References
    ----------
    .. [1] ISO 6976:2016, clauses 5–8.
    """
    b = parse_basis(basis)
    t1, t2 = parse_ref(ref)
    k = parse_kind(kind)
    if b == "molar":
        return molar_cv(comp, k, t1)
    if b == "mass":
        return mass_cv(comp, k, t1)
    return volume_cv(comp, k, (t1, t2), p_metering_bar)


def density(comp, t_metering: float = 15, p_metering_bar: float = P0_BAR) -> float:
    """Real-gas density ρ = p2·M/(Z·R·T2). [kg/m³]

    References
    ----------
    .. [1] ISO 6976:2016, clause 9 (density).
    """
    c = _comp(comp)
    t2 = _temperature(t_metering, T_METERING, "t_metering", "metering temperature")
    return _sums(c)["M"] * _vol_factor(c, t2, p_metering_bar)


def relative_density(comp, t_metering: float = 15, p_metering_bar: float = P0_BAR) -> float:
    """Real-gas relative density to dry air, d = (M/M_air)·Z_air/Z. [-]

    References
    ----------
    .. [1] ISO 6976:2016, clause 9 (relative density); M_air = 28.96546 kg/kmol.
    """
    c = _comp(comp)
    z = compression_factor(c, t_metering, p_metering_bar)
    return _sums(c)["M"] / M_AIR * air_compression_factor(t_metering, p_metering_bar) / z


def wobbe_index(comp, kind: str = "gross", ref="15/15", p_metering_bar: float = P0_BAR) -> float:
    """Wobbe index W = Hv/√d on the volume basis. [MJ/m³]

    References
    ----------
    .. [1] ISO 6976:2016, clause 10 (Wobbe index).
    """
    c = _comp(comp)
    t1, t2 = parse_ref(ref)
    hv = volume_cv(c, kind, (t1, t2), p_metering_bar)
    return hv / math.sqrt(relative_density(c, t2, p_metering_bar))
