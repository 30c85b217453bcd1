"""Water and steam from the IAPWS Industrial Formulation 1997 (IAPWS-IF97).

Regions implemented, each from the basic equation of the release:

* region 1, compressed liquid: the Gibbs free energy γ(π, τ) of eq. (7),
  coefficients of Table 2, with the backward equation T(p, h) of eq. (11),
  Table 6;
* region 2, superheated steam: γ = γ° + γʳ of eqs. (15)-(17), ideal-gas part
  Table 10, residual part Table 11;
* region 4, the saturation line: p_s(T) of eq. (30) and T_s(p) of eq. (31),
  Table 34.

Units follow the release: p in MPa, T in K, v in m³/kg, h in kJ/kg, s and cp in
kJ/(kg·K).  The functions do no argument checking beyond the validity of the
equations (:func:`check_region1`, :func:`check_region2`, :func:`check_sat_p`,
:func:`check_sat_t`): callers check their own arguments.

Reference state as IAPWS-95: u = 0 and s = 0 for the saturated liquid at the
triple point, so enthalpy differences agree with CoolProp's IAPWS-95 within
the tolerances below and absolute values within 0.1 kJ/kg or so.

Consistency with IAPWS-95: the basic equations reproduce IAPWS-95 within the
tolerances set for their development, detailed in Wagner et al. (2000) [2]
(the release's Section 2 points there).  From memory of [2]: regions 1 and 2
Δv/v ≤ 0.05 %, Δcp/cp ≤ 1 %, Δh ≤ 0.2 kJ/kg (region 1), region 4
Δp_s/p_s ≤ 0.025 %.  The tests measure the actual differences against
CoolProp's IAPWS-95 and assert these bounds.

References
----------
.. [1] IAPWS R7-97(2012), Revised Release on the IAPWS Industrial Formulation
   1997 for the Thermodynamic Properties of Water and Steam, Lucerne 2007,
   revised 2012.  Tables 2, 6, 10, 11, 34 (coefficients); Tables 5, 7, 15, 35,
   36 (verification values).
.. [2] Wagner, W., Cooper, J.R., Dittmann, A. et al. (2000), The IAPWS
   industrial formulation 1997 for the thermodynamic properties of water and
   steam, J. Eng. Gas Turbines Power 122, 150-182.
"""

from __future__ import annotations

import math
from typing import NamedTuple

from cellfuncs.errors import CellInputError, fmt

__all__ = [
    "R",
    "State",
    "region1",
    "region2",
    "t_ph_region1",
    "p_sat",
    "t_sat",
    "check_region1",
    "check_region2",
    "check_sat_t",
    "check_sat_p",
    "T_MIN",
    "T_REGION1_MAX",
    "P_MAX",
    "T_CRIT",
    "P_CRIT",
    "P_SAT_MIN",
    "P_SAT_623",
]

#: specific gas constant of water, release eq. (1) [kJ/(kg·K)]
R = 0.461526
#: critical temperature, eq. (3) [K]
T_CRIT = 647.096
#: critical pressure, eq. (4) [MPa]
P_CRIT = 22.064
#: lowest temperature of the formulation [K]
T_MIN = 273.15
#: upper temperature of region 1 [K]
T_REGION1_MAX = 623.15
#: upper pressure of regions 1 and 2 [MPa]
P_MAX = 100.0
#: saturation pressure at 273.15 K, release Section 8.1 [MPa]
P_SAT_MIN = 611.213e-6
#: saturation pressure at 623.15 K, where saturation leaves regions 1 and 2 [MPa]
P_SAT_623 = 16.529164253

# ---- Region 1: Table 2 (I_i, J_i, n_i), reducing p* = 16.53 MPa, T* = 1386 K -------------
_R1 = (
    (0, -2, 0.14632971213167),
    (0, -1, -0.84548187169114),
    (0, 0, -0.37563603672040e1),
    (0, 1, 0.33855169168385e1),
    (0, 2, -0.95791963387872),
    (0, 3, 0.15772038513228),
    (0, 4, -0.16616417199501e-1),
    (0, 5, 0.81214629983568e-3),
    (1, -9, 0.28319080123804e-3),
    (1, -7, -0.60706301565874e-3),
    (1, -1, -0.18990068218419e-1),
    (1, 0, -0.32529748770505e-1),
    (1, 1, -0.21841717175414e-1),
    (1, 3, -0.52838357969930e-4),
    (2, -3, -0.47184321073267e-3),
    (2, 0, -0.30001780793026e-3),
    (2, 1, 0.47661393906987e-4),
    (2, 3, -0.44141845330846e-5),
    (2, 17, -0.72694996297594e-15),
    (3, -4, -0.31679644845054e-4),
    (3, 0, -0.28270797985312e-5),
    (3, 6, -0.85205128120103e-9),
    (4, -5, -0.22425281908000e-5),
    (4, -2, -0.65171222895601e-6),
    (4, 10, -0.14341729937924e-12),
    (5, -8, -0.40516996860117e-6),
    (8, -11, -0.12734301741641e-8),
    (8, -6, -0.17424871230634e-9),
    (21, -29, -0.68762131295531e-18),
    (23, -31, 0.14478307828521e-19),
    (29, -38, 0.26335781662795e-22),
    (30, -39, -0.11947622640071e-22),
    (31, -40, 0.18228094581404e-23),
    (32, -41, -0.93537087292458e-25),
)
_R1_PSTAR = 16.53
_R1_TSTAR = 1386.0

# ---- Region 1 backward T(p, h): Table 6 (I_i, J_i, n_i), p* = 1 MPa, h* = 2500 kJ/kg -------
_R1_TPH = (
    (0, 0, -0.23872489924521e3),
    (0, 1, 0.40421188637945e3),
    (0, 2, 0.11349746881718e3),
    (0, 6, -0.58457616048039e1),
    (0, 22, -0.15285482413140e-3),
    (0, 32, -0.10866707695377e-5),
    (1, 0, -0.13391744872602e2),
    (1, 1, 0.43211039183559e2),
    (1, 2, -0.54010067170506e2),
    (1, 3, 0.30535892203916e2),
    (1, 4, -0.65964749423638e1),
    (1, 10, 0.93965400878363e-2),
    (1, 32, 0.11573647505340e-6),
    (2, 10, -0.25858641282073e-4),
    (2, 32, -0.40644363084799e-8),
    (3, 10, 0.66456186191635e-7),
    (3, 32, 0.80670734103027e-10),
    (4, 32, -0.93477771213947e-12),
    (5, 32, 0.58265442020601e-14),
    (6, 32, -0.15020185953503e-16),
)

# ---- Region 2 ideal-gas part: Table 10 (J°_i, n°_i), p* = 1 MPa, T* = 540 K ---------------
_R2_0 = (
    (0, -0.96927686500217e1),
    (1, 0.10086655968018e2),
    (-5, -0.56087911283020e-2),
    (-4, 0.71452738081455e-1),
    (-3, -0.40710498223928),
    (-2, 0.14240819171444e1),
    (-1, -0.43839511319450e1),
    (2, -0.28408632460772),
    (3, 0.21268463753307e-1),
)
# ---- Region 2 residual part: Table 11 (I_i, J_i, n_i) ---------------------------------------
_R2_R = (
    (1, 0, -0.17731742473213e-2),
    (1, 1, -0.17834862292358e-1),
    (1, 2, -0.45996013696365e-1),
    (1, 3, -0.57581259083432e-1),
    (1, 6, -0.50325278727930e-1),
    (2, 1, -0.33032641670203e-4),
    (2, 2, -0.18948987516315e-3),
    (2, 4, -0.39392777243355e-2),
    (2, 7, -0.43797295650573e-1),
    (2, 36, -0.26674547914087e-4),
    (3, 0, 0.20481737692309e-7),
    (3, 1, 0.43870667284435e-6),
    (3, 3, -0.32277677238570e-4),
    (3, 6, -0.15033924542148e-2),
    (3, 35, -0.40668253562649e-1),
    (4, 1, -0.78847309559367e-9),
    (4, 2, 0.12790717852285e-7),
    (4, 3, 0.48225372718507e-6),
    (5, 7, 0.22922076337661e-5),
    (6, 3, -0.16714766451061e-10),
    (6, 16, -0.21171472321355e-2),
    (6, 35, -0.23895741934104e2),
    (7, 0, -0.59059564324270e-17),
    (7, 11, -0.12621808899101e-5),
    (7, 25, -0.38946842435739e-1),
    (8, 8, 0.11256211360459e-10),
    (8, 36, -0.82311340897998e1),
    (9, 13, 0.19809712802088e-7),
    (10, 4, 0.10406965210174e-18),
    (10, 10, -0.10234747095929e-12),
    (10, 14, -0.10018179379511e-8),
    (16, 29, -0.80882908646985e-10),
    (16, 50, 0.10693031879409),
    (18, 57, -0.33662250574171),
    (20, 20, 0.89185845355421e-24),
    (20, 35, 0.30629316876232e-12),
    (20, 48, -0.42002467698208e-5),
    (21, 21, -0.59056029685639e-25),
    (22, 53, 0.37826947613457e-5),
    (23, 39, -0.12768608934681e-14),
    (24, 26, 0.73087610595061e-28),
    (24, 40, 0.55414715350778e-16),
    (24, 58, -0.94369707241210e-6),
)
_R2_TSTAR = 540.0

# ---- Region 4: Table 34, n1..n10 --------------------------------------------------------
_N4 = (
    0.11670521452767e4,
    -0.72421316703206e6,
    -0.17073846940092e2,
    0.12020824702470e5,
    -0.32325550322333e7,
    0.14915108613530e2,
    -0.48232657361591e4,
    0.40511340542057e6,
    -0.23855557567849,
    0.65017534844798e3,
)


class State(NamedTuple):
    """Properties at one (p, T) state."""

    #: specific volume [m³/kg]
    v: float
    #: specific enthalpy [kJ/kg]
    h: float
    #: specific entropy [kJ/(kg·K)]
    s: float
    #: specific isobaric heat capacity [kJ/(kg·K)]
    cp: float


def region1(p: float, t: float) -> State:
    """Compressed liquid: v, h, s, cp from the region-1 Gibbs equation (no checks).

    Parameters
    ----------
    p : float
        Pressure [MPa], p_s(T) ≤ p ≤ 100.
    t : float
        Temperature [K], 273.15 to 623.15.

    Returns
    -------
    State
        v [m³/kg], h [kJ/kg], s [kJ/(kg·K)], cp [kJ/(kg·K)].

    Notes
    -----
    γ = Σ nᵢ (7.1 − π)^Iᵢ (τ − 1.222)^Jᵢ with π = p/16.53 MPa, τ = 1386 K/T
    (release eq. 7, Table 2); v = RTπγ_π/p, h = RTτγ_τ, s = R(τγ_τ − γ),
    cp = −Rτ²γ_ττ (Table 3).  Also reasonable for metastable liquid close
    to the region (release Section 5.1).

    References
    ----------
    .. [1] IAPWS R7-97(2012), Section 5.1, eq. (7), Tables 2 and 3.
    """
    pi = p / _R1_PSTAR
    tau = _R1_TSTAR / t
    a = 7.1 - pi
    b = tau - 1.222
    g = g_p = g_t = g_tt = 0.0
    for i, j, n in _R1:
        ai = a ** i
        bj = b ** j
        g += n * ai * bj
        if i:
            g_p -= n * i * ai / a * bj
        if j:
            bj1 = bj / b
            g_t += n * ai * j * bj1
            if j != 1:
                g_tt += n * ai * j * (j - 1) * bj1 / b
    rt = R * t
    return State(rt * pi * g_p / p * 1e-3, rt * tau * g_t, R * (tau * g_t - g), -R * tau * tau * g_tt)


def t_ph_region1(p: float, h: float) -> float:
    """Backward equation T(p, h) of region 1 [K] (no checks).

    Parameters
    ----------
    p : float
        Pressure [MPa].
    h : float
        Specific enthalpy [kJ/kg].

    Returns
    -------
    float
        θ = Σ nᵢ π^Iᵢ (η + 1)^Jᵢ with π = p/1 MPa, η = h/2500 kJ/kg [K];
        consistent with :func:`region1` within 25 mK (release Section 5.2).

    References
    ----------
    .. [1] IAPWS R7-97(2012), Section 5.2.1, eq. (11), Table 6.
    """
    eta1 = h / 2500.0 + 1.0
    return math.fsum(n * p ** i * eta1 ** j for i, j, n in _R1_TPH)


def region2(p: float, t: float) -> State:
    """Superheated steam: v, h, s, cp from the region-2 Gibbs equation (no checks).

    Parameters
    ----------
    p : float
        Pressure [MPa], 0 < p ≤ p_s(T) for T ≤ 623.15 K.
    t : float
        Temperature [K], 273.15 to 1073.15.

    Returns
    -------
    State
        v [m³/kg], h [kJ/kg], s [kJ/(kg·K)], cp [kJ/(kg·K)].

    Notes
    -----
    γ = ln π + Σ n°ᵢ τ^J°ᵢ + Σ nᵢ π^Iᵢ (τ − 0.5)^Jᵢ with π = p/1 MPa,
    τ = 540 K/T (eqs. 15-17, Tables 10 and 11); properties from Table 12.
    Valid on the saturated-vapour line up to 623.15 K.

    References
    ----------
    .. [1] IAPWS R7-97(2012), Section 6.1, eqs. (15)-(17), Tables 10-12.
    """
    pi = p
    tau = _R2_TSTAR / t
    g0 = math.log(pi)
    g0_t = g0_tt = 0.0
    for j, n in _R2_0:
        tj = tau ** j
        g0 += n * tj
        if j:
            g0_t += n * j * tj / tau
            g0_tt += n * j * (j - 1) * tj / (tau * tau)
    b = tau - 0.5
    gr = gr_p = gr_t = gr_tt = 0.0
    for i, j, n in _R2_R:
        pii = pi ** i
        bj = b ** j
        gr += n * pii * bj
        gr_p += n * i * pii / pi * bj
        if j:
            bj1 = bj / b
            gr_t += n * pii * j * bj1
            if j != 1:
                gr_tt += n * pii * j * (j - 1) * bj1 / b
    rt = R * t
    g_t = g0_t + gr_t
    v = rt * pi * (1.0 / pi + gr_p) / p * 1e-3
    return State(v, rt * tau * g_t, R * (tau * g_t - (g0 + gr)), -R * tau * tau * (g0_tt + gr_tt))


def p_sat(t: float) -> float:
    """Saturation pressure [MPa] at t [K], 273.15 to 647.096 K (no checks).

    References
    ----------
    .. [1] IAPWS R7-97(2012), Section 8.1, eq. (30), Table 34.
    """
    n = _N4
    th = t + n[8] / (t - n[9])
    a = th * th + n[0] * th + n[1]
    b = n[2] * th * th + n[3] * th + n[4]
    c = n[5] * th * th + n[6] * th + n[7]
    return (2.0 * c / (-b + math.sqrt(b * b - 4.0 * a * c))) ** 4


def t_sat(p: float) -> float:
    """Saturation temperature [K] at p [MPa], 611.213 Pa to 22.064 MPa (no checks).

    References
    ----------
    .. [1] IAPWS R7-97(2012), Section 8.2, eq. (31), Table 34.
    """
    n = _N4
    beta = p ** 0.25
    e = beta * beta + n[2] * beta + n[5]
    f = n[0] * beta * beta + n[3] * beta + n[6]
    g = n[1] * beta * beta + n[4] * beta + n[7]
    d = 2.0 * g / (-f - math.sqrt(f * f - 4.0 * e * g))
    return 0.5 * (n[9] + d - math.sqrt((n[9] + d) ** 2 - 4.0 * (n[8] + n[9] * d)))


# ---- validity checks (one line, naming the argument) -----------------------------------

def check_sat_p(name: str, p: float, unit_scale: float = 1.0, unit: str = "MPa") -> None:
    """Raise unless p (given in ``unit``, ``p·unit_scale`` in MPa) lies on IF97's saturation line."""
    pm = p * unit_scale
    if not P_SAT_MIN <= pm <= P_CRIT:
        raise CellInputError(f"{name}: {fmt(p)} {unit} is outside the IAPWS-IF97 saturation line "
                             f"{fmt(P_SAT_MIN / unit_scale)} to {fmt(P_CRIT / unit_scale)} {unit}")


def check_sat_t(name: str, t: float) -> None:
    """Raise unless t [K] lies on IF97's saturation line (273.15 to 647.096 K)."""
    if not T_MIN <= t <= T_CRIT:
        raise CellInputError(f"{name}: {fmt(t)} K is outside the IAPWS-IF97 saturation line "
                             f"{fmt(T_MIN)} to {fmt(T_CRIT)} K")


def check_region1(name: str, p: float, t: float) -> None:
    """Raise unless (p [MPa], t [K]) is in region 1 (liquid, 273.15-623.15 K, p_s(T) ≤ p ≤ 100 MPa)."""
    if not T_MIN <= t <= T_REGION1_MAX:
        raise CellInputError(f"{name}: {fmt(t - 273.15)} °C is outside IAPWS-IF97 region 1 "
                             f"(liquid water 0 to 350 °C)")
    if not p <= P_MAX:
        raise CellInputError(f"{name}: {fmt(p)} MPa is above 100 MPa (IAPWS-IF97 region 1)")
    if p < p_sat(t):
        raise CellInputError(f"{name}: water at {fmt(t - 273.15)} °C boils below "
                             f"{fmt(p_sat(t))} MPa; {fmt(p)} MPa is not liquid (IAPWS-IF97 region 1)")


def check_region2(name: str, p: float, t: float) -> None:
    """Raise unless (p [MPa], t [K]) is in region 2 below 623.15 K or up to 16.529 MPa above it."""
    if not T_MIN <= t <= 1073.15:
        raise CellInputError(f"{name}: {fmt(t - 273.15)} °C is outside IAPWS-IF97 region 2 "
                             f"(steam 0 to 800 °C)")
    limit = p_sat(t) if t <= T_REGION1_MAX else P_SAT_623
    if not 0.0 < p <= limit:
        raise CellInputError(f"{name}: steam at {fmt(t - 273.15)} °C condenses above "
                             f"{fmt(limit)} MPa; {fmt(p)} MPa is outside IAPWS-IF97 region 2 as used here")
