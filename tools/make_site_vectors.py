"""Write tests/vectors/site.csv, emissions.csv and mn_spread.csv by hand arithmetic (no cellfuncs code).

Every expected value is the published figure or the published equation evaluated
here step by step from the figures named in the rows' source column:

* ISO 2533:1975 standard-atmosphere table (pressure at geopotential altitude; the
  six-figure table values, from memory, equal to the U.S. Standard Atmosphere 1976);
* ISO 6976:2016 component table (molar gross calorific values at 25 °C, L°(25 °C)),
  IUPAC 2005 atomic weights, dry air O2 0.20946 (common practice), V_m 22.414 L/mol;
* US EPA Method 19 Table 19-2 (F_d of natural gas);
* Verhoff & Banchero (1974) acid dew point equation;
* Kubesh, King & Liss (1992) MON correlations and MN conversion, ISO 15403-1 conversion.

Run from the repository root: ``python tools/make_site_vectors.py``.
"""

from __future__ import annotations

import csv
import math
from pathlib import Path

ROOT = Path(__file__).resolve().parent.parent
VEC = ROOT / "tests" / "vectors"

# ---- figures ---------------------------------------------------------------------------
AW = {"C": 12.0107, "H": 1.00794, "O": 15.9994, "N": 14.0067, "S": 32.065}  # IUPAC 2005
HC25 = {"CH4": 890.58, "C2H6": 1560.69, "C3H8": 2219.17, "H2S": 562.01}   # ISO 6976:2016, kJ/mol
L25 = 44.013                                                               # ISO 6976:2016 L°(25)
ATOMS = {"CH4": (1, 4, 0), "C2H6": (2, 6, 0), "C3H8": (3, 8, 0), "H2S": (0, 2, 1),
         "N2": (0, 0, 0), "CO2": (1, 0, 0)}                                # C, H, S
AIR = {"O2": 0.20946, "N2": 0.78084, "Ar": 0.00934, "CO2": 0.00036}
VM = 22.414  # L/mol
MMHG_PER_BAR = 1e5 / 133.322387415


def products(gas: dict, lam: float) -> dict:
    """Wet flue gas per mol of fuel (dry air), by hand stoichiometry."""
    tot = sum(gas.values())
    x = {k: v / tot for k, v in gas.items()}
    c = sum(x[k] * ATOMS[k][0] for k in x)
    h = sum(x[k] * ATOMS[k][1] for k in x)
    s = sum(x[k] * ATOMS[k][2] for k in x)
    o_fuel = 2 * x.get("CO2", 0.0)  # O atoms in the fuel (CO2 only here)
    o_min = c + h / 4 + s - o_fuel / 2
    air = lam * o_min / AIR["O2"]
    return {"CO2": c + air * AIR["CO2"], "H2O": h / 2, "SO2": s,
            "N2": x.get("N2", 0.0) + air * AIR["N2"], "Ar": air * AIR["Ar"],
            "O2": (lam - 1) * o_min}


def h_molar(gas: dict, kind: str) -> float:
    tot = sum(gas.values())
    hc = sum(v / tot * HC25.get(k, 0.0) for k, v in gas.items())
    if kind == "net":
        hc -= L25 * sum(v / tot * ATOMS[k][1] / 2 for k, v in gas.items())
    return hc


def v_dry(gas: dict, kind: str, o2: float = 0.0) -> float:
    p = products(gas, 1.0)
    n = sum(v for k, v in p.items() if k != "H2O")
    return n * VM * 1e-3 / (h_molar(gas, kind) / 3600) * 20.9 / (20.9 - o2)


def comp_text(gas: dict) -> str:
    return ";".join(f"{k}={v:g}" for k, v in gas.items())


def write(name: str, header: list, comments: list, rows: list) -> None:
    path = VEC / name
    with path.open("w", newline="", encoding="utf-8") as fh:
        for c in comments:
            fh.write(f"# {c}\n")
        w = csv.DictWriter(fh, fieldnames=header, lineterminator="\n")
        w.writeheader()
        for r in rows:
            w.writerow({k: (f"{v:.12g}" if isinstance(v, float) else v) for k, v in r.items()})
    print("wrote", path.relative_to(ROOT))


# ---- site.csv ------------------------------------------------------------------------
ISO2533 = [(-500, 1.07478), (0, 1.01325), (500, 0.954608), (1000, 0.898746), (1500, 0.845560),
           (2000, 0.794952), (3000, 0.701085), (4000, 0.616402), (5000, 0.540199)]
site_rows = []
for h, p in ISO2533:
    site_rows.append(dict(function="SITE_PRESSURE", source="ISO 2533:1975 standard atmosphere table "
                          "(from memory; = U.S. Standard Atmosphere 1976)",
                          locator=f"pressure at geopotential altitude {h} m (six figures)",
                          expected=p, rtol=1e-5, atol="", note="bar(a)", altitude_m=h))
site_rows.append(dict(function="SITE_PRESSURE", source="ISO 2533:1975 clause 2 constants",
                      locator="sea level: p0 = 101 325 Pa", expected=1.01325, rtol=1e-15, atol="",
                      note="bar(a)", altitude_m=0))
write("site.csv", ["function", "source", "locator", "expected", "rtol", "atol", "note", "altitude_m"],
      ["Site conditions (cellfuncs.site.atmosphere).  Written by tools/make_site_vectors.py.",
       "ISO 2533 tables give six significant figures: rtol 1e-5 covers half a unit of the last figure."],
      site_rows)

# ---- emissions.csv -------------------------------------------------------------------
CH4 = {"CH4": 100.0}
NG = {"CH4": 92.0, "C2H6": 4.5, "C3H8": 1.0, "N2": 1.5, "CO2": 1.0}
SOUR1 = {"CH4": 99.0, "H2S": 1.0}
SOUR2 = {"CH4": 90.0, "H2S": 0.5, "CO2": 9.5}
hdr = ["function", "source", "locator", "expected", "rtol", "atol", "note", "composition", "value",
       "unit_given", "unit_wanted", "species", "o2_reference_pct", "electrical_efficiency", "kind",
       "air_ratio", "p_exhaust_bar", "t_ambient", "rh_ambient", "p_ambient_bar", "so3_share", "scale"]
STO = ("arithmetic: complete-combustion stoichiometry, dry air O2 0.20946 (common practice), "
       "ISO 6976:2016 Hc(25 °C) and L°(25 °C), V_m 22.414 L/mol")
em = []
for kind in ("net", "gross"):
    for o2 in (0.0, 5.0, 15.0):
        em.append(dict(function="EXH_DRY_VOLUME", source=STO,
                       locator=f"methane, {kind}, O2 {o2:g} %: (1 + 9.548362·0.79054)·0.022414/"
                               f"(H/3600)·20.9/(20.9-O2)",
                       expected=v_dry(CH4, kind, o2), rtol=1e-9, note="Nm³/kWh",
                       composition=comp_text(CH4), o2_reference_pct=o2, kind=kind))
em.append(dict(function="EXH_DRY_VOLUME", source=STO, locator="pipeline gas CH4 92, C2H6 4.5, "
               "C3H8 1, N2 1.5, CO2 1 mol%, net, O2 0 %", expected=v_dry(NG, "net"), rtol=1e-9,
               note="Nm³/kWh", composition=comp_text(NG), o2_reference_pct=0.0, kind="net"))
SCALE = 293.15 / 273.15 * (1 / 0.3048) ** 3 * 1055.05585262e6 / 3.6e6
em.append(dict(function="EXH_DRY_VOLUME", source="US EPA 40 CFR 60 Appendix A-7 Method 19, Table 19-2",
               locator="F_d natural gas 8,710 dscf per 10^6 Btu (gross, 68 °F, 29.92 inHg)",
               expected=8710.0, rtol=0.02,
               note="result × scale: 293.15/273.15 (0 °C to 20 °C) × 35.3147 ft³/m³ × 293.071 kWh/MMBtu",
               composition=comp_text(NG), o2_reference_pct=0.0, kind="gross", scale=SCALE))
for sp, formula, common in (("nox", {"N": 1, "O": 2}, 2.05), ("co", {"C": 1, "O": 1}, 1.25),
                            ("hcho", {"C": 1, "H": 2, "O": 1}, 1.34), ("so2", {"S": 1, "O": 2}, 2.86),
                            ("nh3", {"N": 1, "H": 3}, 0.76), ("thc", {"C": 1, "H": 4}, 0.716)):
    m = sum(AW[e] * n for e, n in formula.items())
    em.append(dict(function="EMIS_CONVERT", source="IUPAC 2005 atomic weights; V_m 22.414 L/mol "
                   "(arithmetic)", locator=f"1 ppm {sp} = M/22.414 mg/Nm3, M = {m:.5f} g/mol",
                   expected=m / VM, rtol=1e-10, note="mg/Nm3 per ppm", value=1.0, unit_given="ppm",
                   unit_wanted="mg/nm3", species=sp, o2_reference_pct=5.0))
    em.append(dict(function="EMIS_CONVERT", source="common practice (conversion factor of the trade)",
                   locator=f"1 ppm {sp} ≈ {common} mg/Nm3", expected=common, rtol=5e-3,
                   note="mg/Nm3 per ppm", value=1.0, unit_given="ppm", unit_wanted="mg/nm3",
                   species=sp, o2_reference_pct=15.0))
v5 = v_dry(CH4, "net", 5.0)
em.append(dict(function="EMIS_CONVERT", source=STO, locator="methane net: 100 mg/Nm3 at 5 % O2 = "
               "100·V_dry(5 %)/3.6 mg/MJ", expected=100 * v5 / 3.6, rtol=1e-9, note="mg/MJ",
               composition=comp_text(CH4), value=100.0, unit_given="mg/nm3", unit_wanted="mg/mj",
               species="nox", o2_reference_pct=5.0, kind="net"))
em.append(dict(function="EMIS_CONVERT", source=STO, locator="methane net, η_el 0.40: 500 mg/Nm3 "
               "NOx at 5 % O2 = 500·V_dry(5 %)/1000/0.40 g/kWh", expected=500 * v5 / 1000 / 0.40,
               rtol=1e-9, note="g/kWh", composition=comp_text(CH4), value=500.0,
               unit_given="mg/nm3", unit_wanted="g/kwh", species="nox", o2_reference_pct=5.0,
               electrical_efficiency=0.40, kind="net"))
vg15 = v_dry(NG, "gross", 15.0)
m_nox = AW["N"] + 2 * AW["O"]
em.append(dict(function="EMIS_CONVERT", source=STO, locator="pipeline gas gross: 25 ppm NOx at "
               "15 % O2 = 25·M/22.414·V_dry(15 %)/3.6 mg/MJ", expected=25 * m_nox / VM * vg15 / 3.6,
               rtol=1e-9, note="mg/MJ", composition=comp_text(NG), value=25.0, unit_given="ppm",
               unit_wanted="mg/mj", species="nox", o2_reference_pct=15.0, kind="gross"))
VB = (2.276, 0.02943, 0.0858, 0.0062)
for gas, lam, p, share in ((SOUR1, 1.8, 1.01325, 0.02), (SOUR2, 1.5, 1.0, 0.05)):
    pr = products(gas, lam)
    tot = sum(pr.values())
    pw = pr["H2O"] / tot * p * MMHG_PER_BAR
    ps = share * pr["SO2"] / tot * p * MMHG_PER_BAR
    lw, ls = math.log(pw), math.log(ps)
    t = 1000 / (VB[0] - VB[1] * lw - VB[2] * ls + VB[3] * lw * ls) - 273.15
    em.append(dict(function="EXH_ACID_DEWPOINT", source="Verhoff & Banchero (1974) equation "
                   "evaluated by hand (exhaust by hand stoichiometry, dry air)",
                   locator=f"{comp_text(gas)}, λ {lam}, {p} bar, SO3 share {share}: p_H2O "
                   f"{pw:.3f} mmHg, p_SO3 {ps:.5f} mmHg", expected=t, rtol=1e-9, note="°C",
                   composition=comp_text(gas), air_ratio=lam, p_exhaust_bar=p, t_ambient=25.0,
                   rh_ambient=0.0, p_ambient_bar=1.0, so3_share=share))
write("emissions.csv", hdr,
      ["Emission conversions, dry exhaust volume, acid dew point.  Written by tools/make_site_vectors.py",
       "(hand arithmetic, no cellfuncs code).  composition: id=amount pairs separated by ';' (mol%).",
       "Blank inputs take the catalogue default."], em)

# ---- mn_spread.csv -------------------------------------------------------------------
HC = (-406.14, 508.04, -173.55, 20.17)
LIN = {"CH4": 137.78, "C2H6": 29.948, "C3H8": -18.193, "C4": -167.062, "CO2": 181.233, "N2": 26.994}
KLS = "Kubesh, King & Liss (1992) SAE 922359"
rows = []
GASES = {"methane": {"CH4": 100.0},
         "pipeline gas": {"CH4": 92.0, "C2H6": 4.5, "C3H8": 1.0, "N2": 1.5, "CO2": 1.0},
         "rich gas": {"CH4": 85.0, "C2H6": 8.0, "C3H8": 4.0, "nC4H10": 1.0, "iC4H10": 1.0, "N2": 1.0}}
CHN = {"CH4": (1, 4), "C2H6": (2, 6), "C3H8": (3, 8), "nC4H10": (4, 10), "iC4H10": (4, 10)}
for label, gas in GASES.items():
    c = sum(v * CHN[k][0] for k, v in gas.items() if k in CHN)
    h = sum(v * CHN[k][1] for k, v in gas.items() if k in CHN)
    r = h / c
    mon = HC[0] + HC[1] * r + HC[2] * r ** 2 + HC[3] * r ** 3
    tot = sum(gas.values())
    f = {k: gas.get(k, 0.0) / tot for k in ("CH4", "C2H6", "C3H8", "CO2", "N2")}
    f["C4"] = (gas.get("nC4H10", 0.0) + gas.get("iC4H10", 0.0)) / tot
    mon_lin = sum(LIN[k] * f[k] for k in LIN)
    for method, m, conv, src in (
            ("hc_ratio", mon, (1.624, -119.1), f"{KLS}: H/C MON correlation and MN = 1.624 MON - 119.1"),
            ("hc_ratio_iso15403", mon, (1.445, -103.42),
             f"{KLS} H/C MON correlation; ISO 15403-1:2006 MN = 1.445 MON - 103.42"),
            ("linear_iso15403", mon_lin, (1.445, -103.42),
             f"{KLS} linear MON correlation; ISO 15403-1:2006 MN = 1.445 MON - 103.42")):
        rows.append(dict(function="GAS_METHANE_NUMBER", source=src + " (evaluated by hand)",
                         locator=f"{label}: H/C {r:.5f}, MON {m:.4f}" if method.startswith("hc")
                         else f"{label}: MON {m:.4f}",
                         expected=conv[0] * m + conv[1], rtol=1e-9, atol="",
                         note="coefficients as quoted in secondary sources", composition=comp_text(gas),
                         method=method))
write("mn_spread.csv", ["function", "source", "locator", "expected", "rtol", "atol", "note",
                        "composition", "method"],
      ["Methane-number methods added with the spread (cellfuncs.gas.mn_correlations).  Written by",
       "tools/make_site_vectors.py: the published equations evaluated by hand.  composition in mol%."],
      rows)
