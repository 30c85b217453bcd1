"""Properties of the hot-water circuit: water or water–glycol at 3 bar(a).

Pure water comes from the IAPWS-IF97 region-1 equation
(:mod:`cellfuncs.props.if97`, plain ``math``) at a fixed circuit pressure of
3 bar absolute; it agrees with IAPWS-95 over 0-133.52 °C within 0.002 % in
density, 0.09 % in cp and 0.03 % in enthalpy differences (measured against
CoolProp's ``HEOS::Water`` in tests/test_if97.py).  Water–glycol comes from
CoolProp's incompressible mass-based binary mixtures fitted to Melinder
(2010): ``INCOMP::MEG`` (ethylene glycol) and ``INCOMP::MPG`` (propylene
glycol), glycol mass fraction 0 to 0.6, from the mixture's freezing point up
to 100 °C.

Duties are enthalpy differences at constant pressure, ``Q = m·(h(t_out) −
h(t_in))``, and a volume flow is always measured at the water's inlet
temperature.  CoolProp is imported on first use by water–glycol only; states
are cached.
"""

from __future__ import annotations

from functools import lru_cache

from cellfuncs.errors import CellInputError, CellTypeError, check_range, fmt

__all__ = [
    "P_CIRCUIT_BAR",
    "T_BOIL_C",
    "GLYCOLS",
    "GLYCOL_X_MAX",
    "GLYCOL_T_MAX",
    "hw_cp",
    "hw_density",
    "hw_flow",
    "hw_duty",
    "liquid_limits",
    "enthalpy",
    "temperature_from_enthalpy",
    "enthalpy_bounds",
    "mass_flow",
]

#: circuit pressure at which all properties are evaluated [bar(a)]
P_CIRCUIT_BAR = 3.0
_P_PA = P_CIRCUIT_BAR * 1e5
#: boiling point of water at 3 bar(a), IAPWS-95 via CoolProp
#: ``PropsSI('T', 'P', 3e5, 'Q', 0, 'Water') - 273.15`` = 133.5224 °C [°C]
#: (IAPWS-IF97 region 4 gives 133.5254 °C)
T_BOIL_C = 133.52242046093653
#: highest water temperature evaluated: the boiling point rounded down, so that
#: the state is liquid by both IAPWS-95 and IAPWS-IF97 [°C]
T_WATER_MAX = 133.52
#: lowest water temperature accepted (freezing at 3 bar is -0.02 °C) [°C]
T_WATER_MIN = 0.0
#: glycol words -> CoolProp incompressible mass-based mixture (Melinder 2010)
GLYCOLS = {"ethylene": "MEG", "propylene": "MPG"}
#: upper glycol mass fraction of the CoolProp fits [-]
GLYCOL_X_MAX = 0.6
#: upper temperature of the CoolProp fits [°C]
GLYCOL_T_MAX = 100.0

_T0 = 273.15


def _check_glycol(glycol_fraction: float, glycol: str) -> tuple:
    """Validate the glycol arguments; return (fluid, x) with fluid None for water."""
    x = check_range("glycol_fraction", glycol_fraction, 0.0, GLYCOL_X_MAX, "",
                    where="mass fraction range of CoolProp INCOMP::MEG/MPG, Melinder 2010")
    if x == 0.0:
        return None, 0.0
    if not isinstance(glycol, str) or glycol.strip().lower() not in GLYCOLS:
        raise CellTypeError(f'glycol: {glycol!r} is not one of "ethylene", "propylene"')
    return GLYCOLS[glycol.strip().lower()], x


@lru_cache(maxsize=64)
def _glycol_state(fluid: str, x: float):
    from cellfuncs.props.coolprop_core import core

    CP = core()

    st = CP.AbstractState("INCOMP", fluid)
    st.set_mass_fractions([x])
    return st, CP.PT_INPUTS


@lru_cache(maxsize=64)
def _t_freeze(fluid: str, x: float) -> float:
    from cellfuncs.props.coolprop_core import core

    CP = core()

    st, _ = _glycol_state(fluid, x)
    return st.keyed_output(CP.iT_freeze) - _T0


def liquid_limits(glycol_fraction: float = 0.0, glycol: str = "ethylene") -> tuple:
    """Temperature range in which the circuit fluid is a liquid with valid data.

    Parameters
    ----------
    glycol_fraction : float
        Glycol mass fraction [-], 0 for water.
    glycol : str
        ``"ethylene"`` or ``"propylene"``.

    Returns
    -------
    tuple
        ``(t_min, t_max, label, reason_max)``: bounds [°C], a label for the
        fluid and the reason for the upper bound, for error messages.

    References
    ----------
    See :func:`hw_cp`.
    """
    fluid, x = _check_glycol(glycol_fraction, glycol)
    if fluid is None:
        return (T_WATER_MIN, T_WATER_MAX, "water",
                f"boiling at {fmt(P_CIRCUIT_BAR)} bar(a)")
    label = f"{fmt(100 * x)} % {glycol.strip().lower()} glycol"
    return (_t_freeze(fluid, x), GLYCOL_T_MAX, label,
            f"upper limit of CoolProp INCOMP::{fluid}, Melinder 2010")


def _check_t(name: str, t: float, glycol_fraction: float, glycol: str, where: str = "") -> float:
    lo, hi, label, why_hi = liquid_limits(glycol_fraction, glycol)
    t = check_range(name, t, None, None, "°C")
    pre = f"{where} " if where else ""
    if t > hi:
        raise CellInputError(f"{name}: {pre}{fmt(t)} °C is above {fmt(round(hi, 2))} °C for {label} ({why_hi})")
    if t < lo:
        why_lo = ("freezing" if glycol_fraction == 0
                  else f"freezing point, CoolProp INCOMP::{GLYCOLS[glycol.strip().lower()]}")
        raise CellInputError(f"{name}: {pre}{fmt(t)} °C is below {fmt(round(lo, 2))} °C for {label} ({why_lo})")
    return t


@lru_cache(maxsize=16384)
def _props(t: float, fluid, x: float) -> tuple:
    """(h [J/kg], cp [J/(kg·K)], rho [kg/m³]) at t [°C] and 3 bar(a); no checks."""
    if fluid is None:
        from cellfuncs.props.if97 import region1

        st = region1(_P_PA * 1e-6, t + _T0)
        return st.h * 1000.0, st.cp * 1000.0, 1.0 / st.v
    st, pt = _glycol_state(fluid, x)
    st.update(pt, _P_PA, t + _T0)
    return st.hmass(), st.cpmass(), st.rhomass()


def _fluid(glycol_fraction: float, glycol: str):
    return _check_glycol(glycol_fraction, glycol)


def hw_cp(t: float, glycol_fraction: float = 0.0, glycol: str = "ethylene") -> float:
    """Specific isobaric heat capacity of water or water–glycol.

    Parameters
    ----------
    t : float
        Temperature [°C].
    glycol_fraction : float
        Glycol mass fraction [-]; 0 gives pure water.
    glycol : str
        ``"ethylene"`` or ``"propylene"`` (ignored for pure water).

    Returns
    -------
    float
        cp [kJ/(kg·K)].

    Notes
    -----
    Pure water: IAPWS-IF97 region 1 (:func:`cellfuncs.props.if97.region1`) at
    3 bar(a), valid from 0 °C to the boiling point 133.52 °C; within 0.09 %
    of IAPWS-95 in cp and 0.002 % in density over that range.  Water–glycol:
    CoolProp incompressible mixtures ``INCOMP::MEG`` / ``INCOMP::MPG`` (fits
    to Melinder 2010), glycol mass fraction 0–0.6, from the freezing point of
    the mixture to 100 °C.

    References
    ----------
    IAPWS R7-97(2012), IAPWS-IF97, Section 5.1 (region 1).  Wagner, W.,
    Pruß, A. (2002), The IAPWS formulation 1995 for the
    thermodynamic properties of ordinary water substance, J. Phys. Chem. Ref.
    Data 31, 387.  Melinder, Å. (2010), Properties of secondary working fluids
    for indirect systems, IIR.  Bell, I. H. et al. (2014), CoolProp, Ind. Eng.
    Chem. Res. 53, 2498.
    """
    fluid, x = _fluid(glycol_fraction, glycol)
    t = _check_t("t", t, glycol_fraction, glycol)
    return _props(t, fluid, x)[1] / 1000.0


def hw_density(t: float, glycol_fraction: float = 0.0, glycol: str = "ethylene") -> float:
    """Density of water or water–glycol at 3 bar(a).

    Parameters
    ----------
    t : float
        Temperature [°C].
    glycol_fraction : float
        Glycol mass fraction [-]; 0 gives pure water.
    glycol : str
        ``"ethylene"`` or ``"propylene"``.

    Returns
    -------
    float
        Density [kg/m³].

    Notes
    -----
    Same sources and validity ranges as :func:`hw_cp`.

    References
    ----------
    See :func:`hw_cp`.
    """
    fluid, x = _fluid(glycol_fraction, glycol)
    t = _check_t("t", t, glycol_fraction, glycol)
    return _props(t, fluid, x)[2]


def enthalpy(t: float, glycol_fraction: float = 0.0, glycol: str = "ethylene",
             name: str = "t", where: str = "") -> float:
    """Specific enthalpy at 3 bar(a) [kJ/kg], checked.

    Water: IAPWS-IF97 (u = s = 0 for the saturated liquid at the triple
    point); water–glycol: CoolProp's reference state.  Only differences at one
    composition are meaningful.

    References
    ----------
    See :func:`hw_cp`.
    """
    fluid, x = _fluid(glycol_fraction, glycol)
    t = _check_t(name, t, glycol_fraction, glycol, where)
    return _props(t, fluid, x)[0] / 1000.0


def temperature_from_enthalpy(h: float, t_guess: float, glycol_fraction: float = 0.0,
                              glycol: str = "ethylene") -> float:
    """Invert h(t) at 3 bar(a) by Newton's method (no range checks).

    Parameters
    ----------
    h : float
        Specific enthalpy [kJ/kg], as :func:`enthalpy`.
    t_guess : float
        Start value, inside the valid range [°C].

    Returns
    -------
    float
        Temperature [°C] with ``|h(t) − h| < 1e-9 kJ/kg``.

    References
    ----------
    See :func:`hw_cp`.
    """
    fluid, x = _fluid(glycol_fraction, glycol)
    lo, hi, _, _ = liquid_limits(glycol_fraction, glycol)
    t = min(max(t_guess, lo), hi)
    h_j = h * 1000.0
    for _ in range(50):
        hh, cp, _rho = _props(t, fluid, x)
        t_new = min(max(t + (h_j - hh) / cp, lo), hi)
        if abs(t_new - t) < 1e-11 * max(1.0, abs(t)):
            return t_new
        t = t_new
    return t  # pragma: no cover - Newton on a monotonic smooth h(t) converges


def enthalpy_bounds(glycol_fraction: float = 0.0, glycol: str = "ethylene") -> tuple:
    """Liquid range in enthalpy terms, for stage checks.

    Returns
    -------
    tuple
        ``(t_lo, t_hi, h_lo, h_hi, cp_lo, cp_hi, label, why_hi)`` with
        temperatures [°C], enthalpies [kJ/kg], cp [kJ/(kg·K)].

    References
    ----------
    See :func:`hw_cp`.
    """
    fluid, x = _fluid(glycol_fraction, glycol)
    lo, hi, label, why = liquid_limits(glycol_fraction, glycol)
    h_lo, cp_lo, _ = _props(lo, fluid, x)
    h_hi, cp_hi, _ = _props(hi, fluid, x)
    return lo, hi, h_lo / 1e3, h_hi / 1e3, cp_lo / 1e3, cp_hi / 1e3, label, why


def mass_flow(flow_m3h: float, t_in: float, glycol_fraction: float = 0.0,
              glycol: str = "ethylene", t_name: str = "t_in") -> float:
    """Mass flow [kg/s] of a volume flow [m³/h] measured at t_in [°C].

    References
    ----------
    See :func:`hw_cp` (density).
    """
    check_range("flow_m3h", flow_m3h, 0.0, None, "m³/h", lo_open=True)
    fluid, x = _fluid(glycol_fraction, glycol)
    t_in = _check_t(t_name, t_in, glycol_fraction, glycol)
    return flow_m3h * _props(t_in, fluid, x)[2] / 3600.0


def hw_flow(duty_kw: float, t_in: float, t_out: float, glycol_fraction: float = 0.0,
            glycol: str = "ethylene") -> float:
    """Volume flow that carries a duty between two temperatures.

    Parameters
    ----------
    duty_kw : float
        Heat added to the water (negative when it is cooled) [kW].
    t_in, t_out : float
        Water inlet and outlet temperature [°C].
    glycol_fraction : float
        Glycol mass fraction [-].
    glycol : str
        ``"ethylene"`` or ``"propylene"``.

    Returns
    -------
    float
        Volume flow measured at t_in [m³/h]:
        ``V = 3600·Q / (ρ(t_in)·(h(t_out) − h(t_in)))``.

    Notes
    -----
    Enthalpies and density at 3 bar(a); see :func:`hw_cp` for the sources and
    validity ranges.  ``h(t_out) − h(t_in) = c̄p·(t_out − t_in)`` with c̄p the
    mean heat capacity over the interval.

    References
    ----------
    See :func:`hw_cp`.
    """
    check_range("duty_kw", duty_kw, None, None, "kW")
    fluid, x = _fluid(glycol_fraction, glycol)
    t_in = _check_t("t_in", t_in, glycol_fraction, glycol)
    t_out = _check_t("t_out", t_out, glycol_fraction, glycol)
    if duty_kw == 0:
        raise CellInputError("duty_kw: 0 kW carries no heat; give a non-zero duty")
    if t_out == t_in:
        raise CellInputError(f"t_out: {fmt(t_out)} °C equals t_in; a flow needs a temperature change")
    if (duty_kw > 0) != (t_out > t_in):
        verb = "heats" if duty_kw > 0 else "cools"
        raise CellInputError(
            f"t_out: {fmt(t_out)} °C is {'below' if duty_kw > 0 else 'above'} t_in "
            f"{fmt(t_in)} °C but duty_kw {fmt(duty_kw)} kW {verb} the water")
    h_in, _, rho_in = _props(t_in, fluid, x)
    h_out = _props(t_out, fluid, x)[0]
    return 3600.0 * duty_kw * 1000.0 / (rho_in * (h_out - h_in))


def hw_duty(flow_m3h: float, t_in: float, t_out: float, glycol_fraction: float = 0.0,
            glycol: str = "ethylene") -> float:
    """Duty of a water flow between two temperatures.

    Parameters
    ----------
    flow_m3h : float
        Volume flow measured at t_in [m³/h].
    t_in, t_out : float
        Water inlet and outlet temperature [°C].
    glycol_fraction : float
        Glycol mass fraction [-].
    glycol : str
        ``"ethylene"`` or ``"propylene"``.

    Returns
    -------
    float
        ``Q = V·ρ(t_in)·(h(t_out) − h(t_in)) / 3600`` [kW]; negative when the
        water is cooled.

    Notes
    -----
    Inverse of :func:`hw_flow`; same sources and ranges as :func:`hw_cp`.

    References
    ----------
    See :func:`hw_cp`.
    """
    check_range("flow_m3h", flow_m3h, 0.0, None, "m³/h", lo_open=True)
    fluid, x = _fluid(glycol_fraction, glycol)
    t_in = _check_t("t_in", t_in, glycol_fraction, glycol)
    t_out = _check_t("t_out", t_out, glycol_fraction, glycol)
    h_in, _, rho_in = _props(t_in, fluid, x)
    h_out = _props(t_out, fluid, x)[0]
    return flow_m3h * rho_in * (h_out - h_in) / 3600.0 / 1000.0
