"""Uncertainty of the ISO 6976:2016 calorific value (Annex B propagation).

The calorific value H is a function of the mole fractions x_i, the component
calorific values Hc_i (and L° of water for the net value), the summation
factors s_i (through Z, volume basis), the atomic weights (through M, mass
basis) and R (volume basis).  With all inputs uncorrelated the standard
uncertainty is the root sum of squares of sensitivity × standard uncertainty:

molar   ∂H/∂x_i = H_i,   ∂H/∂Hc_i = x_i,   ∂H/∂L° = x_w (gross) or −Σ_{i≠w} x_i h_i/2 (net)
mass    Hm = H/M:  ∂Hm/∂x_i = H_i/M − H·M_i/M²,  ∂Hm/∂A_k = −(H/M²)·Σ x_i n_ik
volume  Hv = H·F, F = p2/(Z·R·T2):  ∂Hv/∂x_i = F·H_i + Hv·2q·S·s_i/Z,
        ∂Hv/∂s_i = Hv·2q·S·x_i/Z,  ∂Hv/∂R = −Hv/R     (S = Σ x_i s_i, q = p2/p0)

H_i is the component's value of the chosen kind (net: Hc_i − L°·h_i/2).  The
u(x_i) are those of the normalised mole fractions, taken as uncorrelated
(the case of ISO 6976:2016 Annex D, Example 1); the partial derivatives are
those of the summation formulas, as in that example.

Atomic weights and their uncertainties: IUPAC 2005 standard atomic weights
(the values behind the molar masses of the ISO 6976:2016 table), standard
uncertainty taken as half the tabulated bracket; this reproduces the
published u(Hm) of Example 1 (from memory for the IUPAC figures).
"""

from __future__ import annotations

import math

from cellfuncs.errors import CellInputError, check_range
from cellfuncs.gas import iso6976
from cellfuncs.gas.composition import Composition, parse_composition

__all__ = ["ATOMIC_WEIGHTS", "cv_standard_uncertainty", "cv_uncertainty"]

#: element -> (standard atomic weight [g/mol], tabulated bracket U), IUPAC 2005 (from memory)
ATOMIC_WEIGHTS = {
    "C": (12.0107, 0.0008), "H": (1.00794, 0.00007), "O": (15.9994, 0.0003),
    "N": (14.0067, 0.0002), "S": (32.065, 0.005), "He": (4.002602, 0.000002),
    "Ar": (39.948, 0.001),
}

#: atoms per molecule by element, for the molar-mass sensitivities
_ELEMENTS = {
    "CH4": {"C": 1, "H": 4}, "C2H6": {"C": 2, "H": 6}, "C3H8": {"C": 3, "H": 8},
    "nC4H10": {"C": 4, "H": 10}, "iC4H10": {"C": 4, "H": 10},
    "nC5H12": {"C": 5, "H": 12}, "iC5H12": {"C": 5, "H": 12}, "neoC5H12": {"C": 5, "H": 12},
    "nC6H14": {"C": 6, "H": 14}, "nC7H16": {"C": 7, "H": 16}, "nC8H18": {"C": 8, "H": 18},
    "H2": {"H": 2}, "CO": {"C": 1, "O": 1}, "H2S": {"H": 2, "S": 1}, "NH3": {"N": 1, "H": 3},
    "H2O": {"H": 2, "O": 1}, "He": {"He": 1}, "Ar": {"Ar": 1}, "N2": {"N": 2},
    "O2": {"O": 2}, "CO2": {"C": 1, "O": 2},
}


def _component_value(row: dict, cid: str, kind: str, t1, l_w: float) -> float:
    if cid == "H2O":
        return l_w if kind == "gross" else 0.0
    h = row[f"hc_{t1}"]
    if kind == "net":
        h -= l_w * _ELEMENTS[cid].get("H", 0) / 2.0
    return h


def cv_standard_uncertainty(comp, u_x: dict, kind: str = "gross", basis: str = "volume",
                            ref="15/15", p_metering_bar: float = iso6976.P0_BAR) -> float:
    """Standard uncertainty (coverage 1) of the ISO 6976:2016 calorific value.

    Parameters
    ----------
    comp : Composition
        Normalised composition.
    u_x : dict
        ``{id: u(x_i)}`` standard uncertainties of the normalised mole
        fractions (components absent from ``comp`` count with x_i = 0). [-]
    kind, basis, ref, p_metering_bar
        As :func:`cellfuncs.gas.iso6976.calorific_value`.

    Returns
    -------
    u : float
        Standard uncertainty on the basis: [kJ/mol], [MJ/kg] or [MJ/m³].

    Notes
    -----
    Inputs uncorrelated; see the module text for the sensitivities.

    References
    ----------
    .. [1] ISO 6976:2016, Annex B (uncertainty) and Annex D, Example 1.
    .. [2] JCGM 100:2008 (GUM), clause 5.1 (law of propagation of uncertainty).
    """
    c = comp if isinstance(comp, Composition) else parse_composition(comp)
    kind = iso6976.parse_kind(kind)
    basis = iso6976.parse_basis(basis)
    t1, t2 = iso6976.parse_ref(ref)
    tab = iso6976.component_table()
    l_w = tab["H2O"][f"hc_{t1}"]
    u_lw = tab["H2O"]["u_hc"]
    x = dict(zip(c.ids, c.x))
    ids = list(c.ids) + [i for i in u_x if i not in x]
    hi = {i: _component_value(tab[i], i, kind, t1, l_w) for i in ids}
    h = math.fsum(x.get(i, 0.0) * hi[i] for i in ids)
    m = math.fsum(x.get(i, 0.0) * tab[i]["molar_mass"] for i in ids)
    # derivative of H with respect to L° (water enthalpy of vaporisation)
    if kind == "gross":
        dh_dl = x.get("H2O", 0.0)
    else:
        dh_dl = -math.fsum(x.get(i, 0.0) * _ELEMENTS[i].get("H", 0) / 2.0
                           for i in ids if i != "H2O")
    terms = []
    if basis == "molar":
        terms += [(hi[i] * u_x.get(i, 0.0)) for i in ids]
        terms += [(x.get(i, 0.0) * tab[i]["u_hc"]) for i in ids if i != "H2O"]
        terms.append(dh_dl * u_lw)
    elif basis == "mass":
        terms += [((hi[i] / m - h * tab[i]["molar_mass"] / m ** 2) * u_x.get(i, 0.0)) for i in ids]
        terms += [(x.get(i, 0.0) / m * tab[i]["u_hc"]) for i in ids if i != "H2O"]
        terms.append(dh_dl / m * u_lw)
        for el, (_, bracket) in ATOMIC_WEIGHTS.items():
            n_el = math.fsum(x.get(i, 0.0) * _ELEMENTS[i].get(el, 0) for i in ids)
            terms.append(h / m ** 2 * n_el * bracket / 2.0)
    else:
        p2 = iso6976._p_metering(p_metering_bar)
        q = p2 / iso6976.P0_BAR
        z = iso6976.compression_factor(c, t2, p2)
        f = p2 * 1e5 / (z * iso6976.R * (t2 + 273.15)) / 1000.0
        hv = h * f
        s = math.fsum(x.get(i, 0.0) * tab[i][f"s_{t2}"] for i in ids)
        terms += [((f * hi[i] + hv * 2 * q * s * tab[i][f"s_{t2}"] / z) * u_x.get(i, 0.0))
                  for i in ids]
        terms += [(f * x.get(i, 0.0) * tab[i]["u_hc"]) for i in ids if i != "H2O"]
        terms.append(f * dh_dl * u_lw)
        terms += [(hv * 2 * q * s * x.get(i, 0.0) / z * tab[i]["u_s"]) for i in ids]
        terms.append(hv / iso6976.R * iso6976.U_R)
    return math.sqrt(math.fsum(t * t for t in terms))


def cv_uncertainty(comp, u_x: dict, kind: str = "gross", basis: str = "volume", ref="15/15",
                   coverage: float = 2.0, p_metering_bar: float = iso6976.P0_BAR) -> float:
    """Expanded uncertainty U = k·u of the calorific value (basis units).

    Parameters
    ----------
    coverage : float
        Coverage factor k, 1 to 5 (2 ≈ 95 %). [-]

    See :func:`cv_standard_uncertainty` for the other arguments.

    Returns
    -------
    U : float
        Expanded uncertainty in the unit of the basis: [MJ/m³] (volume),
        [MJ/kg] (mass) or [kJ/mol] (molar).

    Notes
    -----
    U = k·u with u from :func:`cv_standard_uncertainty` (inputs uncorrelated).
    Validity: the scope of ISO 6976:2016 as for
    :func:`cellfuncs.gas.iso6976.calorific_value`; k checked in 1 to 5.

    References
    ----------
    .. [1] ISO 6976:2016, Annex B (uncertainty) and Annex D, Example 1.
    .. [2] JCGM 100:2008 (GUM), clause 6 (expanded uncertainty).
    """
    k = check_range("coverage", coverage, 1.0, 5.0, "-")
    return k * cv_standard_uncertainty(comp, u_x, kind, basis, ref, p_metering_bar)
