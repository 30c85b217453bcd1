"""Write tests/vectors/chargeair.csv: expected values from reference libraries only.

Build-time tool (CoolProp, psychrolib, scipy); nothing from cellfuncs is used
for an expected value.  Run from the repository root::

    /tmp/venv/bin/python tools/make_chargeair_vectors.py

Inputs that a reference needs besides the cell arguments (the humidity ratio
of the ambient air) are computed here from IAPWS-IF97 through CoolProp's
``IF97::Water`` backend: w = (18.01528/28.96541)·p_w/(p − p_w),
p_w = rh·p_sat(t), molar masses of ISO 6976:2016 (the dry air of the gas
family's combustion core, O2 0.20946, N2 0.78084, Ar 0.00934, CO2 0.00036).
"""

from __future__ import annotations

import csv
import math
from pathlib import Path

import CoolProp.CoolProp as CP
import psychrolib
from CoolProp.HumidAirProp import HAPropsSI
from scipy.integrate import quad
from scipy.optimize import brentq

OUT = Path(__file__).resolve().parents[1] / "tests" / "vectors" / "chargeair.csv"

R = 8.314462618
M = {"N2": 28.0134, "O2": 31.9988, "Ar": 39.948, "CO2": 44.0095, "H2O": 18.01528,
     "CH4": 16.04246, "C2H6": 30.06904, "C3H8": 44.09562}
CPNAME = {"N2": "Nitrogen", "O2": "Oxygen", "Ar": "Argon", "CO2": "CarbonDioxide",
          "H2O": "Water", "CH4": "Methane", "C2H6": "Ethane", "C3H8": "Propane"}
AIR = {"O2": 0.20946, "N2": 0.78084, "Ar": 0.00934, "CO2": 0.00036}
M_AIR = sum(x * M[s] for s, x in AIR.items())
O2_NEED = {"CH4": 2.0, "C2H6": 3.5, "C3H8": 5.0, "N2": 0.0, "CO2": 0.0}
# the gases of the vectors (their names are the `gas` column; the test holds the same table)
GASES = {"air": None, "CH4": {"CH4": 1.0},
         "NG1": {"CH4": 0.90, "C2H6": 0.05, "C3H8": 0.02, "N2": 0.02, "CO2": 0.01}}

FIELDS = ["function", "source", "locator", "expected", "rtol", "atol", "note", "gas",
          "fuel_power_kw", "mixture_flow_kg_h", "t_in", "t_out", "p_in_bar", "p_out_bar",
          "eta_is", "p_bar", "lambda_", "kind", "t_ambient", "rh_ambient", "p_ambient_bar",
          "part"]


def psat(t_c: float) -> float:
    """IAPWS-IF97 saturation pressure [Pa] via CoolProp's IF97 backend."""
    return CP.PropsSI("P", "T", t_c + 273.15, "Q", 0, "IF97::Water")


def moles_per_dry_air(gas: str, lam, t_amb, rh, p_amb) -> dict:
    pw = rh * psat(t_amb)
    y = pw / (p_amb * 1e5)
    n = dict(AIR)
    n["H2O"] = y / (1 - y)
    comp = GASES[gas]
    if comp:
        a_min = sum(x * O2_NEED[s] for s, x in comp.items()) / 0.20946
        nf = 1.0 / (lam * a_min)
        for s, x in comp.items():
            n[s] = n.get(s, 0.0) + nf * x
    return n


def w_ratio(t_amb, rh, p_amb) -> float:
    pw = rh * psat(t_amb)
    return M["H2O"] / M_AIR * pw / (p_amb * 1e5 - pw)


def cp0(s, T):
    return CP.PropsSI("Cp0molar", "T", T, "P", 10.0, CPNAME[s])


def row(function, source, locator, expected, rtol=0.0, atol=0.0, note="", **inputs):
    r = {k: "" for k in FIELDS}
    r.update(function=function, source=source, locator=locator, expected=f"{expected:.10g}",
             rtol=f"{rtol:g}", atol=f"{atol:g}", note=note)
    for k, v in inputs.items():
        r[k] = v if isinstance(v, str) else f"{v:.10g}"
    return r


def turbo_air_rows() -> list:
    rows = []
    for t1, pr, eta in ((25, 1.5, 0.8), (25, 2.0, 0.8), (25, 3.0, 0.78), (25, 4.0, 0.76),
                        (25, 5.0, 0.75), (0, 3.0, 1.0), (40, 5.0, 0.8), (25, 2.5, 0.82)):
        T1, p1 = t1 + 273.15, 1.0e5
        s1 = CP.PropsSI("Smass", "T", T1, "P", p1, "Air")
        h1 = CP.PropsSI("Hmass", "T", T1, "P", p1, "Air")
        h2s = CP.PropsSI("Hmass", "Smass", s1, "P", p1 * pr, "Air")
        h2 = h1 + (h2s - h1) / eta
        T2 = CP.PropsSI("T", "Hmass", h2, "P", p1 * pr, "Air")
        rows.append(row("TURBO_T_OUT", "CoolProp 8 real-fluid Air: PropsSI('Smass') isentropic, "
                        "eta on PropsSI('Hmass')", f"dry air PR {pr:g} eta {eta:g} t_in {t1:g}",
                        T2 - 273.15, atol=0.5, note="issue 4 check: within 0.5 K, PR 1.5-5",
                        gas="air", t_in=t1, p_in_bar=1.0, p_out_bar=pr, eta_is=eta,
                        t_ambient=25, rh_ambient=0.0))
    # constant-kappa textbook relation at PR 2
    for eta in (0.8, 1.0):
        T1 = 298.15
        T2 = T1 * (1 + (2.0 ** (0.4 / 1.4) - 1) / eta)
        rows.append(row("TURBO_T_OUT", "textbook constant-kappa relation T1(1+(PR^((k-1)/k)-1)/eta), "
                        "kappa 1.4", f"dry air PR 2 eta {eta:g}", T2 - 273.15, atol=2.0,
                        gas="air", t_in=25, p_in_bar=1.0, p_out_bar=2.0, eta_is=eta,
                        t_ambient=25, rh_ambient=0.0))
    return rows


def turbo_mix_rows() -> list:
    """Humid air-gas mixture: isentropic by integrating CoolProp 'Cp0molar' (ideal gas)."""
    rows = []
    for gas, lam, t1, p1, pr, eta, ta, rh in (("NG1", 1.8, 30, 0.98, 3.2, 0.78, 30, 0.6),
                                              ("CH4", 2.0, 20, 1.0, 4.0, 0.8, 20, 0.5),
                                              ("air", None, 35, 1.0, 2.5, 0.8, 35, 0.8)):
        n = moles_per_dry_air(gas, lam, ta, rh, p1)
        tot = sum(n.values())

        def cpm(T):
            return sum(v * cp0(s, T) for s, v in n.items()) / tot

        T1 = t1 + 273.15
        T2s = brentq(lambda T: quad(lambda t: cpm(t) / t, T1, T)[0] - R * math.log(pr), T1, 2 * T1)
        dh = quad(cpm, T1, T2s)[0] / eta
        T2 = brentq(lambda T: quad(cpm, T1, T)[0] - dh, T1, 2.5 * T1)
        rows.append(row("TURBO_T_OUT", "CoolProp 8 ideal-gas parts PropsSI('Cp0molar') per "
                        "species, integrated (scipy quad)", f"{gas}{f' lambda {lam:g}' if lam else ''} PR {pr:g} t_in {t1:g}",
                        T2 - 273.15, atol=0.3, note="humid mixture, composition by arithmetic",
                        gas=gas, t_in=t1, p_in_bar=p1, p_out_bar=p1 * pr, eta_is=eta,
                        lambda_=lam if lam else "", t_ambient=ta, rh_ambient=rh))
    return rows


def dewpoint_rows() -> list:
    psychrolib.SetUnitSystem(psychrolib.SI)
    rows = []
    for ta, rh, pa, p in ((25, 0.6, 1.0, 1.0), (25, 0.3, 1.0, 2.5), (35, 0.8, 1.0, 4.0),
                          (10, 0.9, 0.95, 3.0), (30, 0.5, 1.0, 3.5)):
        w = w_ratio(ta, rh, pa)
        d_cp = HAPropsSI("D", "T", 373.15, "P", p * 1e5, "W", w) - 273.15
        d_ps = psychrolib.GetTDewPointFromHumRatio(100.0, w, p * 1e5)
        common = dict(gas="air", p_bar=p, t_ambient=ta, rh_ambient=rh, p_ambient_bar=pa)
        rows.append(row("CAC_DEWPOINT", "CoolProp 8 HAPropsSI('D','T',T,'P',p,'W',w)",
                        f"air {ta:g} °C rh {rh:g} at {p:g} bar", d_cp, atol=0.3,
                        note="HAPropsSI includes the enhancement factor", **common))
        rows.append(row("CAC_DEWPOINT", "psychrolib 2.5 GetTDewPointFromHumRatio (ASHRAE "
                        "Handbook Fundamentals 2017 ch. 1)", f"air {ta:g} °C rh {rh:g} at {p:g} bar",
                        d_ps, atol=0.3, **common))
    # a gas mixture: the water partial pressure by arithmetic, the saturation by IF97
    for gas, lam, ta, rh, p in (("CH4", 1.8, 30, 0.7, 3.0), ("NG1", 2.0, 40, 0.5, 2.0)):
        n = moles_per_dry_air(gas, lam, ta, rh, 1.0)
        y = n["H2O"] / sum(n.values())
        td = CP.PropsSI("T", "P", y * p * 1e5, "Q", 1, "IF97::Water") - 273.15
        rows.append(row("CAC_DEWPOINT", "CoolProp 8 PropsSI('T','P',p_w,'Q',1,'IF97::Water')",
                        f"{gas} lambda {lam:g} at {p:g} bar", td, atol=0.01,
                        note="p_w = y_w·p, y_w by arithmetic", gas=gas, lambda_=lam, p_bar=p,
                        t_ambient=ta, rh_ambient=rh, p_ambient_bar=1.0))
    return rows


def duty_rows() -> list:
    rows = []
    # humid air above the dew point: enthalpy difference per kg dry air
    for ta, rh, p, t1, t2 in ((25, 0.6, 2.5, 150, 60), (30, 0.8, 3.0, 170, 80),
                              (20, 0.5, 1.8, 90, 35), (10, 0.9, 4.0, 200, 45)):
        w = w_ratio(ta, rh, 1.0)
        flow = 3600.0 * (1 + w)  # kg/h of humid air carrying 1 kg/s dry air
        dh = (HAPropsSI("H", "T", t1 + 273.15, "P", p * 1e5, "W", w)
              - HAPropsSI("H", "T", t2 + 273.15, "P", p * 1e5, "W", w)) / 1000.0
        rows.append(row("CAC_DUTY", "CoolProp 8 HAPropsSI('H',...) difference per kg dry air",
                        f"humid air {t1:g}->{t2:g} °C at {p:g} bar", dh, rtol=5e-3,
                        note="1 kg/s dry air; above the dew point", gas="air",
                        mixture_flow_kg_h=flow, t_in=t1, t_out=t2, p_bar=p, t_ambient=ta,
                        rh_ambient=rh, p_ambient_bar=1.0))
    # condensing: humid air in - saturated humid air out - liquid water out
    for ta, rh, p, t1, t2 in ((25, 0.6, 2.5, 150, 30), (30, 0.8, 3.0, 120, 25),
                              (35, 0.9, 4.0, 190, 40), (20, 0.7, 1.5, 100, 15)):
        w = w_ratio(ta, rh, 1.0)
        flow = 3600.0 * (1 + w)
        ws = HAPropsSI("W", "T", t2 + 273.15, "P", p * 1e5, "R", 1.0)
        assert ws < w
        hl = CP.PropsSI("H", "T", t2 + 273.15, "Q", 0, "Water")
        dh = (HAPropsSI("H", "T", t1 + 273.15, "P", p * 1e5, "W", w)
              - HAPropsSI("H", "T", t2 + 273.15, "P", p * 1e5, "W", ws) - (w - ws) * hl) / 1000.0
        rows.append(row("CAC_DUTY", "CoolProp 8 balance HAPropsSI('H') in - HAPropsSI('H', R=1) "
                        "out - (w-w_s)·PropsSI('H','Q',0,'Water')",
                        f"condensing humid air {t1:g}->{t2:g} °C at {p:g} bar", dh, rtol=1e-2,
                        note="1 kg/s dry air; issue 4 check within 1 %", gas="air",
                        mixture_flow_kg_h=flow, t_in=t1, t_out=t2, p_bar=p, t_ambient=ta,
                        rh_ambient=rh, p_ambient_bar=1.0))
    # dry mixtures, sensible only: mass flow x mean cp x dT
    for gas, lam, t1, t2, p in (("CH4", 1.8, 180, 45, 2.5), ("NG1", 2.0, 200, 50, 3.0),
                                ("NG1", 1.6, 120, 40, 2.0)):
        n = moles_per_dry_air(gas, lam, 25, 0.0, 1.0)
        n.pop("H2O")
        mass = sum(v * M[s] for s, v in n.items())  # g per mol dry air
        T1, T2 = t1 + 273.15, t2 + 273.15
        cp_mean = quad(lambda T: sum(v * cp0(s, T) for s, v in n.items()), T2, T1)[0] / (T1 - T2) / mass
        flow = 3600.0  # kg/h
        q = flow / 3600.0 * cp_mean * (T1 - T2)  # kW (cp in kJ/(kg K) = J/(g K))
        rows.append(row("CAC_DUTY", "mass flow x mean cp x dT, cp from CoolProp 8 ideal-gas "
                        "PropsSI('Cp0molar') per species", f"dry {gas} lambda {lam:g} "
                        f"{t1:g}->{t2:g} °C", q, rtol=2e-3, note="issue 4 check within 0.2 %",
                        gas=gas, mixture_flow_kg_h=flow, t_in=t1, t_out=t2, p_bar=p,
                        lambda_=lam, t_ambient=25, rh_ambient=0.0, p_ambient_bar=1.0))
    return rows


def flow_rows() -> list:
    """CAC_MIXTURE_FLOW of methane from the ISO 6976:2016 table by arithmetic."""
    hm = (890.58 - 2 * 44.013) / 16.04246  # MJ/kg net at 25 °C, ISO 6976:2016 table
    fuel = 3.6 * 1000.0 / hm
    air = 1.5 * 2 / 0.20946 * M_AIR / M["CH4"] * fuel
    w = w_ratio(25, 0.3, 1.0)
    src = "ISO 6976:2016 table (CH4 890.58, H2O 44.013 kJ/mol at 25 °C, M) + arithmetic"
    common = dict(gas="CH4", fuel_power_kw=1000.0, lambda_=1.5, kind="net", t_ambient=25,
                  rh_ambient=0.3, p_ambient_bar=1.0)
    return [
        row("CAC_MIXTURE_FLOW", src, "methane 1000 kW net, fuel", fuel, rtol=1e-9, part="fuel",
            **common),
        row("CAC_MIXTURE_FLOW", src + "; dry air O2 0.20946", "methane lambda 1.5, dry air", air,
            rtol=1e-9, part="dry_air", **common),
        row("CAC_MIXTURE_FLOW", src + "; w from IAPWS-IF97 via CoolProp IF97::Water",
            "methane lambda 1.5, water at 25 °C rh 0.3", air * w, rtol=1e-6, part="water",
            **common),
        row("CAC_MIXTURE_FLOW", src + "; w from IAPWS-IF97 via CoolProp IF97::Water",
            "methane lambda 1.5, mixture", fuel + air * (1 + w), rtol=1e-8, part="mixture",
            **common),
    ]


def main() -> None:
    rows = turbo_air_rows() + turbo_mix_rows() + dewpoint_rows() + duty_rows() + flow_rows()
    OUT.parent.mkdir(parents=True, exist_ok=True)
    with OUT.open("w", newline="", encoding="utf-8") as fh:
        fh.write("# charge-air check vectors, written by tools/make_chargeair_vectors.py from "
                 "CoolProp 8, psychrolib 2.5 and ISO 6976:2016 figures (no cellfuncs code)\n")
        fh.write("# gas: air = humid air only; CH4 = methane; NG1 = CH4 90, C2H6 5, C3H8 2, "
                 "N2 2, CO2 1 mol%\n")
        w = csv.DictWriter(fh, fieldnames=FIELDS, lineterminator="\n")
        w.writeheader()
        w.writerows(rows)
    print(f"wrote {OUT} ({len(rows)} rows)")


if __name__ == "__main__":
    main()
