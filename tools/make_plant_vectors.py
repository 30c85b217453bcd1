"""Print the reference-library rows of tests/vectors/plant.csv (plant family).

Build-time tool: expected values from ht 1.2.0 (effectiveness_from_NTU, LMTD),
CoolProp 8 (PropsSI IAPWS-IF97 water at 3 bar(a); ideal-gas limit of N2, O2, Ar,
CO2 and water at 1 Pa; HAPropsSI humid air) and psychrolib 2.5; nothing from
cellfuncs is used for an expected value.  Run from the repository root and
paste the printed rows under the matching comment of the vectors file::

    python tools/make_plant_vectors.py
"""

from __future__ import annotations

import csv
import sys

import CoolProp.CoolProp as CP
import ht
import psychrolib
from CoolProp.HumidAirProp import HAPropsSI

P_CIRCUIT = 3e5  # Pa, the hot-water family's circuit pressure

COLUMNS = ("function,source,locator,expected,rtol,atol,note,el,th,ref_el,ref_th,fuel_kw,electrical_kw,heat_kw,"
           "output,fuel,year,heat_use,voltage_kv,onsite_share,duty_kw,t_engine_in_max,engine_flow_m3_h,"
           "t_water_in,water_flow_m3_h,ua_kw_k,arrangement,result,exhaust_flow_kg_h,t_stack,t_reference,"
           "air_ratio,gas,t_water_out,t_air_in,t_air_out,rh_ambient,p_ambient_bar,glycol_fraction").split(",")


def _fluid(x):
    return "IF97::Water" if not x else f"INCOMP::MEG[{x}]"


def h_w(t, x=0.0):  # kJ/kg at 3 bar(a): water (IAPWS-IF97) or ethylene glycol (Melinder 2010)
    return CP.PropsSI("H", "T", t + 273.15, "P", P_CIRCUIT, _fluid(x)) / 1e3


def rho_w(t, x=0.0):
    return CP.PropsSI("D", "T", t + 273.15, "P", P_CIRCUIT, _fluid(x))


def t_from_h(h, x=0.0):
    # inverted on the forward equation: IF97's backward T(p,h) is consistent only to some mK
    from scipy.optimize import brentq

    if x:
        return CP.PropsSI("T", "H", h * 1e3, "P", P_CIRCUIT, _fluid(x)) - 273.15
    return brentq(lambda t: h_w(t) - h, 0.01, 133.0, xtol=1e-12, rtol=1e-14)


def engine_loop(duty, t_emax, flow_e, t_wi, flow_w, ua, subtype, x=0.0):
    """The issue's model, stage by stage with ht and CoolProp (mean cp iterated); x = engine-side glycol."""
    m_e = flow_e * rho_w(t_emax, x) / 3600
    m_w = flow_w * rho_w(t_wi) / 3600
    h_eo = h_w(t_emax, x) + duty / m_e
    t_eo = t_from_h(h_eo, x)
    cp_h = cp_c = 4.2
    for _ in range(60):
        c_h, c_c = m_e * cp_h, m_w * cp_c
        c_min, c_max = min(c_h, c_c), max(c_h, c_c)
        q = ht.effectiveness_from_NTU(ua / c_min, c_min / c_max, subtype) * c_min * (t_eo - t_wi)
        t_ho = t_from_h(h_eo - q / m_e, x)
        t_co = t_from_h(h_w(t_wi) + q / m_w)
        cp_h, cp_c = q / m_e / (t_eo - t_ho), q / m_w / (t_co - t_wi)
    to_client = min(duty, q)
    return {"to_client": to_client, "dump": duty - to_client,
            "t_water_out": t_from_h(h_w(t_wi) + to_client / m_w), "t_engine_out": t_eo}


def main():
    w = csv.DictWriter(sys.stdout, COLUMNS, extrasaction="raise", lineterminator="\n")
    src = "ht 1.2.0 effectiveness_from_NTU + CoolProp 8 PropsSI IF97::Water (IAPWS-IF97, as the hot-water family uses) at 3 bar(a)"
    for case in [(800, 82, 60, 60, 40, 40, "counter", "counterflow", 0.0),
                 (800, 82, 60, 70, 40, 40, "counter", "counterflow", 0.0),
                 (800, 82, 60, 90, 40, 40, "counter", "counterflow", 0.0),
                 (560, 88, 45, 65, 55, 70, "parallel", "parallel", 0.0),
                 (800, 82, 60, 40, 80, 200, "counter", "counterflow", 0.0),
                 (600, 85, 50, 72, 30, 35, "counter", "counterflow", 0.3)]:
        duty, t_emax, fe, twi, fw, ua, arr, sub, x = case
        r = engine_loop(duty, t_emax, fe, twi, fw, ua, sub, x)
        for k, v in r.items():
            w.writerow({"function": "HW_ENGINE_LOOP",
                        "source": src + (f" and INCOMP::MEG[{x}] (Melinder 2010) engine side" if x else ""),
                        "locator": f"issue 11 model by hand: {duty} kW, engine in {t_emax} °C, water in {twi} °C, "
                                   f"UA {ua} ({k})", "glycol_fraction": x or "",
                        "expected": f"{v:.10g}", "rtol": "2e-5", "atol": "1e-6", "duty_kw": duty,
                        "t_engine_in_max": t_emax, "engine_flow_m3_h": fe, "t_water_in": twi,
                        "water_flow_m3_h": fw, "ua_kw_k": ua, "arrangement": arr, "result": k})
    # exhaust loss of a methane exhaust, lambda 1.8, dry combustion air (gas family's dry air)
    air = {"O2": 0.20946, "N2": 0.78084, "Ar": 0.00934, "CO2": 0.00036}
    lam = 1.8
    n_air = lam * 2 / air["O2"]
    moles = {sp: n_air * x for sp, x in air.items()}
    moles["O2"] -= 2
    moles["CO2"] += 1
    moles["H2O"] = 2
    names = {"O2": "Oxygen", "N2": "Nitrogen", "Ar": "Argon", "CO2": "CarbonDioxide", "H2O": "Water"}
    mass = sum(n * CP.PropsSI("M", names[sp]) for sp, n in moles.items())  # kg per mol fuel

    def dh(t1, t2):  # J per mol fuel, ideal-gas limit (1 Pa)
        return sum(n * (CP.PropsSI("Hmolar", "T", t1 + 273.15, "P", 1.0, names[sp])
                        - CP.PropsSI("Hmolar", "T", t2 + 273.15, "P", 1.0, names[sp]))
                   for sp, n in moles.items())

    for t_stack in (120.0, 180.0, 450.0):
        q = 10000 / 3600 * dh(t_stack, 25.0) / mass / 1e3
        w.writerow({"function": "EXH_LOSS", "source": "CoolProp 8 PropsSI Hmolar at 1 Pa (ideal-gas limit) per species",
                    "locator": f"methane, lambda 1.8, dry air, 10000 kg/h, {t_stack} °C to 25 °C",
                    "expected": f"{q:.10g}", "rtol": "2e-3", "note": "NASA-7 vs reference-equation ideal parts",
                    "exhaust_flow_kg_h": 10000, "t_stack": t_stack, "t_reference": 25, "air_ratio": lam,
                    "gas": "CH4=100", "rh_ambient": 0, "p_ambient_bar": 1.0})
    # dry-cooler air flow: humid air heated at constant humidity ratio, volume at the inlet
    psychrolib.SetUnitSystem(psychrolib.SI)
    for duty, t1, t2, rh, p in ((300, 30, 45, 0.4, 0.99), (103, 30, 38, 0.55, 0.99), (500, -10, 5, 0.8, 1.0)):
        pa = p * 1e5
        wr = HAPropsSI("W", "T", t1 + 273.15, "P", pa, "R", rh)
        dh_ = HAPropsSI("H", "T", t2 + 273.15, "P", pa, "W", wr) - HAPropsSI("H", "T", t1 + 273.15, "P", pa, "W", wr)
        v = duty * 1e3 / dh_ * HAPropsSI("V", "T", t1 + 273.15, "P", pa, "W", wr) * 3600
        w.writerow({"function": "DRYCOOLER_AIR_FLOW", "source": "CoolProp 8 HAPropsSI (ASHRAE RP-1485 humid air)",
                    "locator": f"{duty} kW, air {t1} to {t2} °C, RH {rh}, {p} bar(a): duty/Δh·v at the inlet",
                    "expected": f"{v:.10g}", "rtol": "3e-3", "note": "real humid air vs ideal-gas mixture",
                    "duty_kw": duty, "t_air_in": t1, "t_air_out": t2, "rh_ambient": rh, "p_ambient_bar": p})
        if t1 > 0:
            wr2 = psychrolib.GetHumRatioFromRelHum(t1, rh, pa)
            dh2 = psychrolib.GetMoistAirEnthalpy(t2, wr2) - psychrolib.GetMoistAirEnthalpy(t1, wr2)
            v2 = duty * 1e3 / dh2 * psychrolib.GetMoistAirVolume(t1, wr2, pa) * 3600
            w.writerow({"function": "DRYCOOLER_AIR_FLOW",
                        "source": "psychrolib 2.5 (ASHRAE Handbook Fundamentals 2017 ch. 1)",
                        "locator": f"{duty} kW, air {t1} to {t2} °C, RH {rh}, {p} bar(a)",
                        "expected": f"{v2:.10g}", "rtol": "1.5e-3", "note": "constant cp of the handbook's enthalpy",
                        "duty_kw": duty, "t_air_in": t1, "t_air_out": t2, "rh_ambient": rh, "p_ambient_bar": p})
    for duty, twi, two, tai, tao in ((103, 45, 40, 30, 38), (250, 90, 82, 30, 45)):
        ua = duty / ht.LMTD(twi, two, tai, tao, counterflow=True)
        w.writerow({"function": "DRYCOOLER_UA", "source": "ht 1.2.0 LMTD (counterflow)",
                    "locator": f"{duty} kW, water {twi} to {two} °C, air {tai} to {tao} °C: duty/LMTD",
                    "expected": f"{ua:.10g}", "rtol": "1e-9", "duty_kw": duty, "t_water_in": twi,
                    "t_water_out": two, "t_air_in": tai, "t_air_out": tao, "arrangement": "counter"})


if __name__ == "__main__":
    main()
