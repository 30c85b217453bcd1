"""Write cellfuncs/data/nasa7_gri30.csv: NASA 7-coefficient ideal-gas polynomials.

Build-time tool only (Cantera and CoolProp are needed here, never at run time).
Run from the repository root::

    /tmp/venv/bin/python tools/extract_nasa7.py

Sources, per species (the ``source`` column of the CSV says which):

* GRI-Mech 3.0 thermodynamic data (Smith, Golden, Frenklach, Moriarty,
  Eiteneer, Goldenberg, Bowman, Hanson, Song, Gardiner, Lissianski, Qin 1999),
  read from Cantera's ``gri30.yaml``: O2, Ar, CO2, H2O, CH4, C2H6, C3H8,
  H2, CO, NH3.
* NASA thermodynamic data of McBride, Gordon & Reno (1993), NASA TM-4513,
  read from Cantera's ``nasa_gas.yaml``: the species GRI-Mech 3.0 lacks and
  N2 (GRI-Mech 3.0's own N2 fit starts at 300 K and its cp is 0.24 % high at
  400 K against the reference equation of state; the NASA set's N2 is within
  0.08 % from 200 K up, which keeps the compressor outlet temperature of air
  within 0.1 K of CoolProp's ideal-gas air instead of 0.25 K): N2, nC4H10,
  iC4H10, nC5H12, iC5H12, neoC5H12, nC7H16, nC8H18, He, H2S, SO2.
* n-hexane is in neither set: its heat capacity is fitted here to the ideal-gas
  part of the n-hexane equation of state in CoolProp (Span & Wagner 2003, ideal
  part after Jaeschke & Schley 1995; ``PropsSI('Cp0molar', ...)``) in the same
  two-range NASA-7 form (200-1000 K, 1000-3000 K, cp continuous at 1000 K), and
  the integration constants are set from the standard enthalpy of formation and
  the standard entropy at 298.15 K in ``chemicals`` (``Hfg``, ``S0g``).

Molar masses are those of ISO 6976:2016 (the same figures the gas family uses);
SO2 from the atomic weights implied by that table (S = 32.065, O = 15.9994).

All enthalpies are on the usual NASA / GRI basis: h(T) includes the standard
enthalpy of formation at 298.15 K (elements in their reference states), the
standard pressure is 1 bar.
"""

from __future__ import annotations

import csv
from pathlib import Path

import numpy as np

OUT = Path(__file__).resolve().parents[1] / "cellfuncs" / "data" / "nasa7_gri30.csv"

# canonical id -> (source file, name in source)
GRI = {"O2": "O2", "Ar": "AR", "CO2": "CO2", "H2O": "H2O", "CH4": "CH4",
       "C2H6": "C2H6", "C3H8": "C3H8", "H2": "H2", "CO": "CO", "NH3": "NH3"}
NASA93 = {"N2": "N2", "nC4H10": "C4H10,n-butane", "iC4H10": "C4H10,isobutane",
          "nC5H12": "C5H12,n-pentane", "iC5H12": "C5H12,i-pentane",
          "neoC5H12": "CH3C(CH3)2CH3", "nC7H16": "C7H16,n-heptane",
          "nC8H18": "C8H18,n-octane", "He": "He", "H2S": "H2S", "SO2": "SO2"}

# ISO 6976:2016 molar masses [g/mol]; SO2 from the same atomic weights
MOLAR_MASS = {"CH4": 16.04246, "C2H6": 30.06904, "C3H8": 44.09562, "nC4H10": 58.12220,
              "iC4H10": 58.12220, "nC5H12": 72.14878, "iC5H12": 72.14878,
              "neoC5H12": 72.14878, "nC6H14": 86.17536, "nC7H16": 100.20194,
              "nC8H18": 114.22852, "H2": 2.01588, "CO": 28.0101, "H2S": 34.08088,
              "NH3": 17.03052, "H2O": 18.01528, "He": 4.002602, "Ar": 39.948,
              "N2": 28.0134, "O2": 31.9988, "CO2": 44.0095,
              "SO2": 32.065 + 31.9988}

SRC_GRI = "GRI-Mech 3.0 (Smith et al. 1999) via Cantera gri30.yaml"
SRC_NASA = "NASA TM-4513 (McBride, Gordon & Reno 1993) via Cantera nasa_gas.yaml"
SRC_HEX = ("fit to CoolProp ideal-gas cp0 of n-Hexane (Span & Wagner 2003); "
           "Hf and S0 at 298.15 K from chemicals Hfg/S0g")

R = 8.314462618  # J/(mol K), CODATA 2018 (what Cantera uses)


def _nasa7_rows(yaml_name: str, names: dict, source: str) -> list:
    import cantera as ct

    species = {s.name: s for s in ct.Species.list_from_file(yaml_name)}
    rows = []
    for cid, sname in names.items():
        th = species[sname].thermo
        c = np.asarray(th.coeffs)  # [Tmid, high(7), low(7)]
        t_mid = float(c[0])
        high, low = c[1:8], c[8:15]
        t_lo, t_hi = float(th.min_temp), float(th.max_temp)
        if t_mid >= t_hi or np.array_equal(low, high):  # one range only
            t_mid = 1000.0
        if t_mid != 1000.0:
            raise RuntimeError(f"{cid}: t_mid {t_mid} K, expected 1000 K")
        rows.append(_row(cid, sname, source, t_lo, t_mid, t_hi, low, high))
    return rows


def _row(cid, sname, source, t_lo, t_mid, t_hi, low, high) -> dict:
    row = {"species": cid, "name_in_source": sname, "source": source,
           "molar_mass": f"{MOLAR_MASS[cid]:.6f}", "t_low": f"{t_lo:g}",
           "t_mid": f"{t_mid:g}", "t_high": f"{t_hi:g}"}
    for i in range(7):
        row[f"low_a{i + 1}"] = repr(float(low[i]))
    for i in range(7):
        row[f"high_a{i + 1}"] = repr(float(high[i]))
    return row


def _fit_hexane() -> dict:
    import CoolProp.CoolProp as CP
    from chemicals.reaction import Hfg, S0g

    cas = "110-54-3"

    def cp_r(T):
        return np.array([CP.PropsSI("Cp0molar", "T", t, "P", 1e3, "n-Hexane") for t in T]) / R

    t_mid = 1000.0
    tl = np.linspace(200.0, t_mid, 161)
    th = np.linspace(t_mid, 3000.0, 201)
    yl, yh = cp_r(tl), cp_r(th)
    scale = np.array([1.0, 1e-3, 1e-6, 1e-9, 1e-12])  # fit in T/1000 for conditioning
    # low range: least squares on the relative deviation
    A_l = np.vander(tl / 1000.0, 5, increasing=True)
    a_low = np.linalg.lstsq(A_l / yl[:, None], np.ones_like(yl), rcond=None)[0] * scale
    # high range with cp continuous at t_mid: a1 = cp_low(t_mid) - sum_k a_k t_mid^k
    cpm = float(np.polyval(a_low[::-1], t_mid))
    u, um = th / 1000.0, t_mid / 1000.0
    V = np.vander(u, 5, increasing=True)[:, 1:] - np.vander([um], 5, increasing=True)[:, 1:]
    b = np.linalg.lstsq(V / yh[:, None], (yh - cpm) / yh, rcond=None)[0] * scale[1:]
    a_high = np.concatenate([[cpm - float(np.dot(b, [t_mid, t_mid**2, t_mid**3, t_mid**4]))], b])
    A_l = np.vander(tl, 5, increasing=True)

    def h_rt_noconst(a, T):
        return a[0] + a[1] * T / 2 + a[2] * T**2 / 3 + a[3] * T**3 / 4 + a[4] * T**4 / 5

    def s_r_noconst(a, T):
        return a[0] * np.log(T) + a[1] * T + a[2] * T**2 / 2 + a[3] * T**3 / 3 + a[4] * T**4 / 4

    T0 = 298.15
    a6_l = (Hfg(cas) / (R * T0) - h_rt_noconst(a_low, T0)) * T0
    a7_l = S0g(cas) / R - s_r_noconst(a_low, T0)
    # continuity of h and s at t_mid
    h_mid = (h_rt_noconst(a_low, t_mid) + a6_l / t_mid) * t_mid
    a6_h = h_mid - h_rt_noconst(a_high, t_mid) * t_mid
    s_mid = s_r_noconst(a_low, t_mid) + a7_l
    a7_h = s_mid - s_r_noconst(a_high, t_mid)
    low = list(a_low) + [a6_l, a7_l]
    high = list(a_high) + [a6_h, a7_h]
    err = max(np.max(np.abs(A_l @ a_low / yl - 1)),
              np.max(np.abs(np.vander(th, 5, increasing=True) @ a_high / yh - 1)))
    print(f"n-hexane fit: max relative cp deviation from CoolProp {err:.2e}")
    return _row("nC6H14", "n-Hexane", SRC_HEX, 200.0, t_mid, 3000.0, low, high)


def main() -> None:
    rows = _nasa7_rows("gri30.yaml", GRI, SRC_GRI)
    rows += _nasa7_rows("nasa_gas.yaml", NASA93, SRC_NASA)
    rows.append(_fit_hexane())
    fields = list(rows[0].keys())
    with OUT.open("w", newline="", encoding="utf-8") as fh:
        fh.write("# NASA 7-coefficient ideal-gas polynomials, written by tools/extract_nasa7.py\n")
        fh.write("# cp/R = a1 + a2 T + a3 T^2 + a4 T^3 + a5 T^4; h/(RT) = a1 + a2 T/2 + ... + a6/T;"
                 " s0/R = a1 ln T + a2 T + ... + a7 (T in K, p0 = 1 bar)\n")
        fh.write("# low_* for t_low..t_mid, high_* for t_mid..t_high; molar_mass [g/mol] ISO 6976:2016\n")
        w = csv.DictWriter(fh, fieldnames=fields, lineterminator="\n")
        w.writeheader()
        w.writerows(rows)
    print(f"wrote {OUT} ({len(rows)} species)")


if __name__ == "__main__":
    main()
