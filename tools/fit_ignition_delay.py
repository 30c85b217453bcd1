"""Fit tau = A·p^(−a)·exp(B/T) to GRI-Mech 3.0 ignition delays (build-time tool, Cantera).

Constant-volume adiabatic ignition of methane-air at lambda 1.8, initial
800-1,000 K and 40-120 bar; the ignition delay is the time of the steepest
temperature rise.  Least squares on ln tau = ln A − a ln p + B/T.

    /tmp/venv/bin/python tools/fit_ignition_delay.py

Result recorded in docs/methods.md (knock section).  Cantera is not
a run-time dependency of cellfuncs.
"""

from __future__ import annotations

import numpy as np


def ignition_delay(T0: float, p_bar: float, lam: float = 1.8) -> float:
    import cantera as ct

    gas = ct.Solution("gri30.yaml")
    # methane-air: CH4 + (2·lam)(O2 + 3.76 N2) in the dry-air ratio of the gas family
    x_o2 = 0.20946
    n_air = 2.0 * lam / x_o2
    gas.TPX = T0, p_bar * 1e5, {"CH4": 1.0, "O2": n_air * x_o2, "N2": n_air * 0.78084,
                                "AR": n_air * 0.00934, "CO2": n_air * 0.00036}
    r = ct.IdealGasReactor(gas)
    net = ct.ReactorNet([r])
    t, T = [0.0], [T0]
    t_end = 10.0
    while net.time < t_end:
        net.step()
        t.append(net.time)
        T.append(r.T)
        if r.T > T0 + 600.0 and len(t) > 10:
            break
    t, T = np.array(t), np.array(T)
    dTdt = np.gradient(T, t)
    return float(t[np.argmax(dTdt)])


def main() -> None:
    rows = []
    for T0 in (800.0, 850.0, 900.0, 950.0, 1000.0):
        for p in (40.0, 80.0, 120.0):
            tau = ignition_delay(T0, p)
            rows.append((T0, p, tau))
            print(f"T0 {T0:6.1f} K  p {p:5.1f} bar  tau {tau * 1e3:10.4f} ms", flush=True)
    T = np.array([r[0] for r in rows])
    p = np.array([r[1] for r in rows])
    tau = np.array([r[2] for r in rows])
    A = np.column_stack([np.ones_like(T), -np.log(p), 1.0 / T])
    coef, *_ = np.linalg.lstsq(A, np.log(tau), rcond=None)
    resid = np.log(tau) - A @ coef
    print(f"fit: a = {coef[1]:.3f}, B = {coef[2]:.0f} K, ln A = {coef[0]:.3f}, "
          f"rms ln residual {np.sqrt(np.mean(resid ** 2)):.3f}")


if __name__ == "__main__":
    main()
