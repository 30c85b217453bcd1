"""IAPWS-IF97 water and steam (cellfuncs.props.if97) and the plain-water path of the hot-water family.

Outside sources:

* IAPWS R7-97(2012), the release's verification tables (Tables 5, 7, 15, 35, 36), in
  tests/vectors/if97.csv;
* CoolProp 8 ``PropsSI`` with ``'IF97::Water'`` (an independent implementation of the same
  formulation: agreement to 1e-9) and with ``'Water'`` (IAPWS-95, Wagner & Pruß 2002: agreement
  within IF97's consistency with IAPWS-95).

Consistency of IF97 with IAPWS-95 (from memory of Wagner et al. 2000, J. Eng. Gas Turbines
Power 122, 150-182, the tolerances set for the development of the basic equations, to which the
release's Section 2 refers): regions 1 and 2 Δv/v 0.05 %, Δcp/cp 1 %; region 1 Δh 0.2 kJ/kg
(measured: up to 0.07 kJ/kg at 3 bar, 0.24 kJ/kg at 10 MPa near saturation); saturation
pressure Δp_s/p_s 0.025 % (the same figure cellfuncs.chargeair.humid states).  Issue 9 sets a tighter bound for hot water at 3 bar: the
hot-water results may move by at most 0.1 % from the IAPWS-95 values they had.
"""

from __future__ import annotations

import subprocess
import sys

import pytest
from hypothesis import given
from hypothesis import strategies as st

from vectors import approx, params

from cellfuncs.errors import CellInputError
from cellfuncs.props import if97

# IF97 vs IAPWS-95 tolerances (from memory of Wagner et al. 2000; see the module docstring)
TOL_V = 5e-4        # Δv/v, regions 1 and 2
TOL_CP = 1e-2       # Δcp/cp, regions 1 and 2
TOL_H_KJ = 0.2      # Δh [kJ/kg], as enthalpy differences
TOL_PSAT = 2.5e-4   # Δp_s/p_s, region 4
# issue 9: hot-water results move by at most 0.1 % against IAPWS-95
TOL_HW = 1e-3


def _ps(q, T, p_pa, fluid="Water"):
    from CoolProp.CoolProp import PropsSI

    return PropsSI(q, "T", T, "P", p_pa, fluid)


# ---- the release's verification tables -------------------------------------------

_PROP = {"V": "v", "H": "h", "S": "s", "CP": "cp"}


@pytest.mark.parametrize("row", params("if97"))
def test_release_tables(row):
    f = row["function"]
    if f.startswith("R1_T_PH"):
        got = if97.t_ph_region1(row["p_mpa"], row["h"])
    elif f.startswith("R1_"):
        got = getattr(if97.region1(row["p_mpa"], row["t_k"]), _PROP[f[3:]])
    elif f.startswith("R2_"):
        got = getattr(if97.region2(row["p_mpa"], row["t_k"]), _PROP[f[3:]])
    elif f == "P_SAT":
        got = if97.p_sat(row["t_k"])
    else:
        got = if97.t_sat(row["p_mpa"])
    assert got == approx(row)


# ---- against CoolProp's IF97 backend (same formulation) -------------------------------

@pytest.mark.parametrize("p_mpa,t_k", [(0.3, 274.0), (0.3, 350.0), (1.0, 450.0), (5.0, 500.0),
                                       (16.0, 600.0), (50.0, 400.0), (100.0, 620.0)])
def test_region1_against_coolprop_if97(p_mpa, t_k):
    """CoolProp 8 PropsSI(..., 'IF97::Water'): D, H, S, C at (T, P), rtol 1e-9."""
    s = if97.region1(p_mpa, t_k)
    p = p_mpa * 1e6
    assert 1 / s.v == pytest.approx(_ps("D", t_k, p, "IF97::Water"), rel=1e-9)
    assert s.h == pytest.approx(_ps("H", t_k, p, "IF97::Water") / 1e3, rel=1e-9)
    assert s.s == pytest.approx(_ps("S", t_k, p, "IF97::Water") / 1e3, rel=1e-9)
    assert s.cp == pytest.approx(_ps("C", t_k, p, "IF97::Water") / 1e3, rel=1e-9)


@pytest.mark.parametrize("p_mpa,t_k", [(0.1, 400.0), (0.5, 500.0), (1.0, 460.0), (4.0, 600.0),
                                       (10.0, 620.0), (15.0, 700.0), (0.01, 1000.0)])
def test_region2_against_coolprop_if97(p_mpa, t_k):
    """CoolProp 8 PropsSI(..., 'IF97::Water'): D, H, S, C at (T, P), rtol 1e-9."""
    s = if97.region2(p_mpa, t_k)
    p = p_mpa * 1e6
    assert 1 / s.v == pytest.approx(_ps("D", t_k, p, "IF97::Water"), rel=1e-9)
    assert s.h == pytest.approx(_ps("H", t_k, p, "IF97::Water") / 1e3, rel=1e-9)
    assert s.s == pytest.approx(_ps("S", t_k, p, "IF97::Water") / 1e3, rel=1e-9)
    assert s.cp == pytest.approx(_ps("C", t_k, p, "IF97::Water") / 1e3, rel=1e-9)


# ---- against IAPWS-95 (CoolProp 'Water') within IF97's consistency ----------------------

# at 10 MPa near saturation the measured enthalpy difference is 0.24 kJ/kg, above the 0.2 kJ/kg
# remembered from Wagner et al. (2000): the remembered figure is doubtful there and that row
# asserts 0.3 kJ/kg (the measured difference with margin), not a published figure
@pytest.mark.parametrize("p_mpa,tol_h", [(0.3, TOL_H_KJ), (1.0, TOL_H_KJ), (10.0, 0.3)])
def test_region1_against_iapws95(p_mpa, tol_h):
    """v, cp and h from 0 °C to saturation against CoolProp PropsSI 'Water' (IAPWS-95); both
    formulations put u = s = 0 at the triple-point liquid, so h is compared directly."""
    t_hi = if97.t_sat(p_mpa) - 0.01
    for i in range(41):
        T = 273.16 + (t_hi - 273.16) * i / 40
        s = if97.region1(p_mpa, T)
        assert 1 / s.v == pytest.approx(_ps("D", T, p_mpa * 1e6), rel=TOL_V)
        assert s.cp == pytest.approx(_ps("C", T, p_mpa * 1e6) / 1e3, rel=TOL_CP)
        assert s.h == pytest.approx(_ps("H", T, p_mpa * 1e6) / 1e3, abs=tol_h)


@pytest.mark.parametrize("p_mpa", [0.1, 1.0, 4.0, 10.0])
def test_region2_against_iapws95(p_mpa):
    """Steam from saturation + 1 K to 600 °C: v and cp against CoolProp 'Water' (IAPWS-95)."""
    t_lo = if97.t_sat(p_mpa) + 1.0
    for i in range(21):
        T = t_lo + (873.15 - t_lo) * i / 20
        s = if97.region2(p_mpa, T)
        assert 1 / s.v == pytest.approx(_ps("D", T, p_mpa * 1e6), rel=TOL_V)
        assert s.cp == pytest.approx(_ps("C", T, p_mpa * 1e6) / 1e3, rel=TOL_CP)


def test_saturation_against_iapws95():
    """p_s(T) against CoolProp PropsSI('P', 'T', T, 'Q', 0, 'Water'), Δp/p 0.025 %."""
    from CoolProp.CoolProp import PropsSI

    for T in [273.16, 300.0, 373.124, 420.0, 500.0, 600.0, 640.0]:
        assert if97.p_sat(T) * 1e6 == pytest.approx(PropsSI("P", "T", T, "Q", 0, "Water"), rel=TOL_PSAT)


def test_latent_heat_against_iapws95():
    """h'' − h' at saturation (region 2 minus region 1) against CoolProp 'Water' (IAPWS-95), ±0.4 kJ/kg
    (the two 0.2 kJ/kg enthalpy tolerances added)."""
    from CoolProp.CoolProp import PropsSI

    for p in [0.1, 0.5, 1.0, 2.0, 4.0, 10.0]:
        T = if97.t_sat(p)
        r = if97.region2(p, T).h - if97.region1(p, T).h
        r95 = (PropsSI("H", "P", p * 1e6, "Q", 1, "Water") - PropsSI("H", "P", p * 1e6, "Q", 0, "Water")) / 1e3
        assert r == pytest.approx(r95, abs=2 * TOL_H_KJ)


# ---- properties of the equations ---------------------------------------------------------

@given(st.floats(273.15, 647.0))
def test_saturation_round_trip(T):
    """T_s(p_s(T)) = T: eqs. (30) and (31) are the same quadratic solved both ways (release §8)."""
    assert if97.t_sat(if97.p_sat(T)) == pytest.approx(T, abs=1e-7)


@given(st.floats(0.3, 100.0), st.floats(273.16, 620.0))
def test_backward_t_ph_consistent(p, T):
    """|T(p, h(p, T)) − T| within 25 mK, the release's numerical consistency of eq. (11)
    with eq. (7) (from memory of R7-97(2012) §5.2.1)."""
    if p < if97.p_sat(T):
        return
    assert abs(if97.t_ph_region1(p, if97.region1(p, T).h) - T) < 0.025


@given(st.floats(0.01, 10.0), st.floats(0.0, 1.0), st.booleans())
def test_cp_is_dh_dt(p, frac, liquid):
    """cp = (∂h/∂T)_p (thermodynamic identity), central difference over ±0.01 K, rtol 1e-5."""
    ts = if97.t_sat(p)
    if liquid:
        T, f = 273.2 + frac * (ts - 273.3), if97.region1
    else:
        T, f = ts + 0.05 + frac * (1000.0 - ts), if97.region2
    d = 0.01
    assert f(p, T).cp == pytest.approx((f(p, T + d).h - f(p, T - d).h) / (2 * d), rel=1e-5)


def test_region_checks():
    with pytest.raises(CellInputError, match="region 1"):
        if97.check_region1("t", 0.3, 410.0)      # above boiling at 3 bar
    with pytest.raises(CellInputError, match="region 1"):
        if97.check_region1("t", 0.3, 270.0)
    with pytest.raises(CellInputError, match="region 2"):
        if97.check_region2("t", 1.0, 400.0)      # below saturation at 1 MPa
    with pytest.raises(CellInputError, match="saturation line"):
        if97.check_sat_p("p", 30.0)
    with pytest.raises(CellInputError, match="saturation line"):
        if97.check_sat_t("t", 650.0)
    if97.check_region1("t", 0.3, 406.67)
    if97.check_region2("t", 1.0, 460.0)


# ---- the hot-water family: plain water without CoolProp, within 0.1 % of IAPWS-95 ----------

def test_plain_water_does_not_import_coolprop():
    """HW_CP, HW_DENSITY, HW_FLOW, HW_DUTY, HW_CHAIN with plain water in a fresh interpreter."""
    code = (
        "import sys\n"
        "from cellfuncs.recovery import water, chain_results as chain\n"
        "water.hw_cp(60.0); water.hw_density(90.0)\n"
        "v = water.hw_flow(1000.0, 70.0, 90.0); water.hw_duty(v, 70.0, 90.0)\n"
        "chain.hw_chain(70.0, 40.0, (300.0, 500.0))\n"
        "from cellfuncs.catalogue import by_name\n"
        "assert 'CoolProp' not in sys.modules, sorted(m for m in sys.modules if 'CoolProp' in m)\n"
        "print('ok')\n"
    )
    r = subprocess.run([sys.executable, "-c", code], capture_output=True, text=True, timeout=120)
    assert r.returncode == 0, r.stderr
    assert r.stdout.strip() == "ok"


def _use_iapws95(monkeypatch):
    """Give the hot-water module its pre-issue-9 water source: CoolProp HEOS::Water at 3 bar(a)."""
    import CoolProp.CoolProp as CP

    from cellfuncs.recovery import water

    st = CP.AbstractState("HEOS", "Water")
    orig = water._props

    def props(t, fluid, x):
        if fluid is not None:
            return orig(t, fluid, x)
        st.update(CP.PT_INPUTS, 3e5, t + 273.15)
        return st.hmass(), st.cpmass(), st.rhomass()

    monkeypatch.setattr(water, "_props", props)


def _hw_results():
    from cellfuncs.recovery import chain, water

    out = []
    for i in range(0, 134):
        t = min(float(i), 133.52)
        out.append(water.hw_cp(t))
        out.append(water.hw_density(t))
    for a, b in [(0.5, 20.0), (40.0, 60.0), (70.0, 90.0), (90.0, 120.0), (110.0, 133.5), (120.0, 80.0)]:
        q = 1000.0 if b > a else -1000.0
        out.append(water.hw_flow(q, a, b))
        out.append(water.hw_duty(50.0, a, b))
    for t_ret in (40.0, 70.0):
        ts = chain.chain_temperatures(t_ret, 50.0, [400.0, 900.0, 600.0])
        out.extend(t - t_ret for t in ts)   # temperature rises [K]
    return out


def test_hot_water_moves_at_most_0_1_pct(monkeypatch):
    """HW_CP, HW_DENSITY (0-133.52 °C, 1 K steps), HW_FLOW, HW_DUTY and HW_CHAIN temperature rises
    on IF97 against the same functions on CoolProp's IAPWS-95 (the source before issue 9):
    each within 0.1 % (issue 9)."""
    new = _hw_results()
    _use_iapws95(monkeypatch)
    ref = _hw_results()
    assert len(new) == len(ref)
    for a, b in zip(new, ref):
        assert a == pytest.approx(b, rel=TOL_HW)
