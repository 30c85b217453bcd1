"""Ideal-gas heat capacity, enthalpy and entropy of single species and mixtures.

NASA 7-coefficient polynomials (two temperature ranges joined at 1000 K) read
once from ``cellfuncs/data/nasa7_gri30.csv``.  Shared by the charge-air and
exhaust families, so everything that runs in hot loops is plain ``math`` on
precomputed coefficient tuples:

* :func:`species_poly` / :func:`mix_poly` return an immutable :class:`Nasa7`
  whose methods (``cp``, ``h``, ``s0``, ``t_from_h``, ``t_from_s0``) do no
  checking and no look-ups.  Because every polynomial of the table has its
  break at 1000 K and the functions are linear in the coefficients, a mixture
  is again one NASA-7 polynomial: the mole-fraction-weighted sum of the
  species' coefficients (cached per composition).
* :func:`cp_molar`, :func:`h_molar`, :func:`s0_molar` and the ``*_mix``
  variants are the checked convenience forms.

Units: T in kelvin; molar cp and s0 in J/(mol·K); molar h in J/mol.

Reference state: the usual NASA / GRI-Mech basis.  ``h`` includes the standard
enthalpy of formation at 298.15 K (elements in their reference states), so
enthalpy differences across a reaction are right as well as sensible heat;
``s0`` is the standard entropy at p0 = 1 bar (no pressure or mixing term).

Notes
-----
Validity 200 K to 3000 K for every species of the table (3500 K or more for
most).  Some source polynomials start at 298.15 K or 300 K (N2, Ar, C3H8,
pentanes, H2S, SO2); below that they are extrapolated, which
``tests/test_idealgas.py`` checks against CoolProp's ideal-gas parts (N2 and
Ar within 0.05 % at 220 K; the pentanes are the weakest, a few per cent at
200 K, of no weight in a fuel-air mixture).

References
----------
.. [1] Smith, G.P., Golden, D.M., Frenklach, M. et al. (1999), GRI-Mech 3.0,
   thermodynamic data file, http://combustion.berkeley.edu/gri-mech/.
.. [2] McBride, B.J., Gordon, S., Reno, M.A. (1993), Coefficients for
   calculating thermodynamic and transport properties of individual species,
   NASA TM-4513.
.. [3] Span, R., Wagner, W. (2003), Equations of state for technical
   applications II: results for nonpolar fluids, Int. J. Thermophys. 24, 41-109
   (n-hexane ideal-gas part, via CoolProp; fitted by tools/extract_nasa7.py).
"""

from __future__ import annotations

import csv
import math
from functools import lru_cache
from pathlib import Path

from cellfuncs.errors import CellInputError, check_range

__all__ = [
    "R",
    "T_MIN",
    "T_MAX",
    "Nasa7",
    "species",
    "species_poly",
    "mix_poly",
    "molar_mass",
    "molar_mass_mix",
    "cp_molar",
    "h_molar",
    "s0_molar",
    "cp_mix",
    "h_mix",
    "s0_mix",
    "source",
]

#: molar gas constant [J/(mol·K)] (CODATA 2018, exact since the 2019 SI)
R = 8.314462618
#: lowest and highest temperature accepted by the checked functions [K]
T_MIN = 200.0
T_MAX = 3000.0
#: the break temperature of every polynomial in the table [K]
T_MID = 1000.0
# bracket of the temperature solvers [K]
_SOLVE_LO, _SOLVE_HI = 150.0, 3500.0

_DATA = Path(__file__).resolve().parents[1] / "data" / "nasa7_gri30.csv"


class Nasa7:
    """One NASA 7-coefficient polynomial (a species or a fixed mixture).

    Amounts are per mole of the species, or per ``sum(x)`` moles of a mixture
    built by :func:`mix_poly`.  Methods do no argument checking (hot loops):
    the caller keeps T within [:data:`T_MIN`, :data:`T_MAX`].

    Parameters
    ----------
    low, high : sequence of 7 float
        Coefficients a1..a7 below and above 1000 K (cp/R form).
    molar_mass : float
        [g/mol] (equal to [kg/kmol]).
    """

    __slots__ = ("low", "high", "molar_mass", "_cl", "_ch", "_hl", "_hh", "_sl", "_sh")

    def __init__(self, low, high, molar_mass: float):
        self.low = tuple(float(v) for v in low)
        self.high = tuple(float(v) for v in high)
        self.molar_mass = float(molar_mass)
        # pre-scaled coefficients: cp, h and s0 as plain polynomials in T
        for tag, a in (("l", self.low), ("h", self.high)):
            cp = (R * a[0], R * a[1], R * a[2], R * a[3], R * a[4])
            h = (R * a[0], R * a[1] / 2, R * a[2] / 3, R * a[3] / 4, R * a[4] / 5, R * a[5])
            s = (R * a[0], R * a[1], R * a[2] / 2, R * a[3] / 3, R * a[4] / 4, R * a[6])
            setattr(self, "_c" + tag, cp)
            setattr(self, "_h" + tag, h)
            setattr(self, "_s" + tag, s)

    def cp(self, T: float) -> float:
        """Molar isobaric heat capacity [J/(mol·K)] at T [K]."""
        c = self._cl if T < T_MID else self._ch
        return c[0] + T * (c[1] + T * (c[2] + T * (c[3] + T * c[4])))

    def h(self, T: float) -> float:
        """Molar enthalpy [J/mol] at T [K], formation enthalpy included."""
        c = self._hl if T < T_MID else self._hh
        return c[5] + T * (c[0] + T * (c[1] + T * (c[2] + T * (c[3] + T * c[4]))))

    def s0(self, T: float) -> float:
        """Molar standard entropy at 1 bar [J/(mol·K)] at T [K]."""
        c = self._sl if T < T_MID else self._sh
        return c[0] * math.log(T) + c[5] + T * (c[1] + T * (c[2] + T * (c[3] + T * c[4])))

    def t_from_h(self, h: float, guess: float = 400.0, tol: float = 1e-9) -> float:
        """Temperature [K] at which ``self.h(T) == h`` (safeguarded Newton, 150-3500 K)."""
        return self._solve(self.h, lambda T: self.cp(T), h, guess, tol, "h", "enthalpy",
                           "J/mol")

    def t_from_s0(self, s0: float, guess: float = 400.0, tol: float = 1e-9) -> float:
        """Temperature [K] at which ``self.s0(T) == s0`` (safeguarded Newton, 150-3500 K)."""
        return self._solve(self.s0, lambda T: self.cp(T) / T, s0, guess, tol, "s0", "entropy",
                           "J/(mol·K)")

    def _solve(self, fn, dfn, target, guess, tol, name, what, unit) -> float:
        # Newton inside a bracket on which fn rises (cp > 0); a step that leaves the
        # bracket is replaced by bisection, so the polynomials are never used far
        # outside their range (where a spurious root may lie)
        lo, hi = _SOLVE_LO, _SOLVE_HI
        if not fn(lo) <= target <= fn(hi):
            raise CellInputError(f"{name}: {what} {target:.6g} {unit} is outside "
                                 f"{lo:g}-{hi:g} K")
        T = min(max(guess, lo), hi)
        for _ in range(100):
            f = fn(T) - target
            if f > 0:
                hi = T
            else:
                lo = T
            T_new = T - f / dfn(T)
            if not lo < T_new < hi:
                T_new = 0.5 * (lo + hi)
            if abs(T_new - T) < tol or hi - lo < tol:
                return T_new
            T = T_new
        return self._at_break(fn, target, name, what, unit)

    def _at_break(self, fn, target, name, what, unit) -> float:
        # the two ranges of a polynomial meet at 1000 K with a jump of ~1e-6;
        # a target inside that jump makes Newton cycle: the answer is 1000 K
        hi = fn(T_MID)
        lo = fn(T_MID * (1 - 1e-12))
        if min(lo, hi) - 1e-6 * abs(hi) <= target <= max(lo, hi) + 1e-6 * abs(hi):
            return T_MID
        raise CellInputError(f"{name}: no temperature found for {what} {target:.6g} {unit}")

    def __repr__(self) -> str:  # pragma: no cover - cosmetic
        return f"Nasa7(M={self.molar_mass:.5g} g/mol)"


@lru_cache(maxsize=1)
def _table() -> dict:
    out = {}
    with _DATA.open(newline="", encoding="utf-8") as fh:
        rows = csv.DictReader(ln for ln in fh if not ln.startswith("#"))
        for r in rows:
            if float(r["t_mid"]) != T_MID:  # pragma: no cover - guarded by the tool
                raise RuntimeError(f"{r['species']}: break temperature is not 1000 K")
            low = [float(r[f"low_a{i}"]) for i in range(1, 8)]
            high = [float(r[f"high_a{i}"]) for i in range(1, 8)]
            out[r["species"]] = (Nasa7(low, high, float(r["molar_mass"])), r["source"],
                                 float(r["t_high"]))
    return out


def species() -> tuple:
    """Ids of the species in the table (the gas family's canonical ids, plus SO2)."""
    return tuple(_table())


def source(sp: str) -> str:
    """Where the polynomial of species ``sp`` comes from (the CSV's source column)."""
    return _entry(sp)[1]


def _entry(sp: str):
    try:
        return _table()[sp]
    except KeyError:
        raise CellInputError(
            f"species: {sp!r} is not in the ideal-gas table (known: {', '.join(_table())})"
        ) from None


def species_poly(sp: str) -> Nasa7:
    """The :class:`Nasa7` polynomial of one species (canonical id, e.g. ``"CH4"``).

    References
    ----------
    .. [1] Smith, G.P., Golden, D.M., Frenklach, M. et al. (1999), GRI-Mech 3.0,
       thermodynamic data file.
    .. [2] McBride, B.J., Gordon, S., Reno, M.A. (1993), Coefficients for
       calculating thermodynamic and transport properties of individual species,
       NASA TM-4513.
    """
    return _entry(sp)[0]


def _key(x) -> tuple:
    items = x.items() if isinstance(x, dict) else x
    return tuple(sorted((str(k), float(v)) for k, v in items if v))


def mix_poly(x) -> Nasa7:
    """The :class:`Nasa7` polynomial of a mixture of fixed composition.

    Parameters
    ----------
    x : dict or iterable of (species, amount)
        Amounts [mol] (mole fractions, or moles per mole of something); not
        normalised, so the results are per ``sum(x)`` moles and
        ``molar_mass`` is the mass of those moles [g].

    Returns
    -------
    Nasa7
        Cached per composition.

    References
    ----------
    .. [1] Smith, G.P., Golden, D.M., Frenklach, M. et al. (1999), GRI-Mech 3.0,
       thermodynamic data file.
    .. [2] McBride, B.J., Gordon, S., Reno, M.A. (1993), Coefficients for
       calculating thermodynamic and transport properties of individual species,
       NASA TM-4513.
    """
    return _mix_cached(_key(x))


@lru_cache(maxsize=1024)
def _mix_cached(key: tuple) -> Nasa7:
    low = [0.0] * 7
    high = [0.0] * 7
    m = 0.0
    for sp, n in key:
        p = species_poly(sp)
        for i in range(7):
            low[i] += n * p.low[i]
            high[i] += n * p.high[i]
        m += n * p.molar_mass
    return Nasa7(low, high, m)


def molar_mass(sp: str) -> float:
    """Molar mass [g/mol] of a species (ISO 6976:2016 figures; SO2 from the same atomic weights).

    References
    ----------
    .. [1] ISO 6976:2016, component molar-mass table; SO2 from the same atomic
       weights (IUPAC 2005, from memory).
    """
    return species_poly(sp).molar_mass


def _mix_total(x):
    key = _key(x)
    total = sum(n for _, n in key)
    if not total > 0 or any(n < 0 for _, n in key):
        raise CellInputError("x: mole fractions must be non-negative with a positive sum")
    return _mix_cached(key), total


def molar_mass_mix(x) -> float:
    """Mean molar mass [g/mol] of a mixture given by mole fractions (normalised here).

    References
    ----------
    .. [1] ISO 6976:2016, component molar-mass table; SO2 from the same atomic
       weights (IUPAC 2005, from memory).
    """
    p, total = _mix_total(x)
    return p.molar_mass / total


def _check_T(T_K: float, sp: str | None = None) -> float:
    hi = T_MAX if sp is None else min(T_MAX, _entry(sp)[2])
    return check_range("T_K", T_K, T_MIN, hi, "K")


def cp_molar(sp: str, T_K: float) -> float:
    """Ideal-gas molar isobaric heat capacity.

    Parameters
    ----------
    sp : str
        Species id (``"N2"``, ``"CH4"``, ``"nC4H10"``, ...).
    T_K : float
        Temperature [K], 200-3000.

    Returns
    -------
    float
        cp [J/(mol·K)].

    References
    ----------
    .. [1] Smith, G.P., Golden, D.M., Frenklach, M. et al. (1999), GRI-Mech 3.0,
       thermodynamic data file.
    .. [2] McBride, B.J., Gordon, S., Reno, M.A. (1993), Coefficients for
       calculating thermodynamic and transport properties of individual species,
       NASA TM-4513.
    """
    p = species_poly(sp)
    return p.cp(_check_T(T_K, sp))


def h_molar(sp: str, T_K: float) -> float:
    """Ideal-gas molar enthalpy [J/mol] at T_K [K], standard formation enthalpy included.

    References
    ----------
    .. [1] Smith, G.P., Golden, D.M., Frenklach, M. et al. (1999), GRI-Mech 3.0,
       thermodynamic data file.
    .. [2] McBride, B.J., Gordon, S., Reno, M.A. (1993), Coefficients for
       calculating thermodynamic and transport properties of individual species,
       NASA TM-4513.
    """
    p = species_poly(sp)
    return p.h(_check_T(T_K, sp))


def s0_molar(sp: str, T_K: float) -> float:
    """Ideal-gas molar standard entropy at 1 bar [J/(mol·K)] at T_K [K].

    References
    ----------
    .. [1] Smith, G.P., Golden, D.M., Frenklach, M. et al. (1999), GRI-Mech 3.0,
       thermodynamic data file.
    .. [2] McBride, B.J., Gordon, S., Reno, M.A. (1993), Coefficients for
       calculating thermodynamic and transport properties of individual species,
       NASA TM-4513.
    """
    p = species_poly(sp)
    return p.s0(_check_T(T_K, sp))


def cp_mix(x, T_K: float) -> float:
    """Molar cp [J/(mol·K)] of a mixture given by mole fractions (normalised here).

    References
    ----------
    .. [1] Smith, G.P., Golden, D.M., Frenklach, M. et al. (1999), GRI-Mech 3.0,
       thermodynamic data file.
    .. [2] McBride, B.J., Gordon, S., Reno, M.A. (1993), Coefficients for
       calculating thermodynamic and transport properties of individual species,
       NASA TM-4513.
    """
    p, total = _mix_total(x)
    return p.cp(_check_T(T_K)) / total


def h_mix(x, T_K: float) -> float:
    """Molar enthalpy [J/mol] of a mixture given by mole fractions (normalised here).

    References
    ----------
    .. [1] Smith, G.P., Golden, D.M., Frenklach, M. et al. (1999), GRI-Mech 3.0,
       thermodynamic data file.
    .. [2] McBride, B.J., Gordon, S., Reno, M.A. (1993), Coefficients for
       calculating thermodynamic and transport properties of individual species,
       NASA TM-4513.
    """
    p, total = _mix_total(x)
    return p.h(_check_T(T_K)) / total


def s0_mix(x, T_K: float) -> float:
    """Mole-fraction-weighted standard entropy [J/(mol·K)] at 1 bar.

    The ideal mixing term ``-R·Σ x ln x`` is not included (it cancels in any
    process of fixed composition, such as an isentropic compression).

    References
    ----------
    .. [1] Smith, G.P., Golden, D.M., Frenklach, M. et al. (1999), GRI-Mech 3.0,
       thermodynamic data file.
    .. [2] McBride, B.J., Gordon, S., Reno, M.A. (1993), Coefficients for
       calculating thermodynamic and transport properties of individual species,
       NASA TM-4513.
    """
    p, total = _mix_total(x)
    return p.s0(_check_T(T_K)) / total
