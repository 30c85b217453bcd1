"""Knock margin: a screening index calibrated to one declared reference point.

Not a knock prediction.  The engine's datasheet declares a point at which it
is rated knock-free: mixture temperature after the charge-air cooler t_ref,
boost pressure p_ref and methane number MN_ref.  This module asks how far the
site's mixture temperature, boost pressure, compression ratio and gas move the
engine from that point, by holding the end-gas ignition delay at its reference
value.

Model
-----
End of compression, polytropic with exponent n (site and reference point)::

    T_c = (t + 273.15)·ε^(n−1)    [K]        p_c = p·ε^n

Knock onset where the Livengood-Wu integral ∫dt/τ reaches 1 (Livengood & Wu
1955) with an Arrhenius ignition delay τ ∝ p^(−a)·exp(B/T).  Holding τ at the
reference point's value gives the limiting end-gas temperature at the site's
pressure::

    1/T_c,lim = 1/T_c,ref + (a/B)·ln(p_c/p_c,ref)

The allowed mixture temperature and the margins::

    T_allow   = T_c,lim / ε^(n−1) − 273.15 + k·(MN − MN_ref)     [°C]
    margin_K  = T_allow − t_mixture                               [K]
    margin_MN = margin_K / k                                      [-]
    MN_req    = MN − margin_MN  (= MN_ref − (T_allow(MN_ref) − t)/k)

Defaults: B = 19,600 K and a = 0.85 from an ignition-delay fit to GRI-Mech 3.0
(constant volume, methane-air at λ 1.8, 800-1,000 K, 40-120 bar; the
Spadaccini & Colket (1994) correlation has a similar activation temperature,
18,693 K); k = 0.8 K per methane-number point, an estimate with about ±30 %
uncertainty (derived from published knock-limited compression-ratio shifts
with CO2 and N2 dilution, Bade Shrestha & Rodrigues 2008) - override it with
the engine's own derating data where available; n = 1.35 (common practice).

Cautions
--------
A screening index calibrated to one declared point.  Use the effective
compression ratio for engines with early or late inlet-valve closing.  Load
(BMEP) and ignition-timing changes are not covered.  k is uncertain.  Keep the
mixture above its dew point.  The engine maker's knock control and derating
data govern; results are estimates for tendering.

Notes
-----
Validity (checked): t -30 to 150 °C, p 0.5 to 10 bar(a), ε 4 to 25,
MN 0 to 150, k 0.05 to 10 K, n 1.0 to 1.6, B 1,000 to 100,000 K, a 0 to 3.

References
----------
.. [1] Livengood, J.C., Wu, P.C. (1955), Correlation of autoignition phenomena
   in internal combustion engines and rapid compression machines, Fifth
   Symposium (International) on Combustion, 347-356.
.. [2] Spadaccini, L.J., Colket, M.B. (1994), Ignition delay characteristics of
   methane fuels, Prog. Energy Combust. Sci. 20, 431-460.
.. [3] Bade Shrestha, S.O., Rodrigues, R. (2008), Effects of diluents on knock
   limited performance of a spark ignition engine (SAE paper; knock-limited
   compression ratio with CO2 and N2 dilution).
.. [4] Smith, G.P. et al. (1999), GRI-Mech 3.0.
"""

from __future__ import annotations

import math

from cellfuncs.errors import CellInputError, CellTypeError, check_range

__all__ = [
    "B_DEFAULT", "A_DEFAULT", "K_DEFAULT", "N_DEFAULT",
    "t_limit", "margin", "mn_required",
]

B_DEFAULT = 19600.0  # K
A_DEFAULT = 0.85  # -
K_DEFAULT = 0.8  # K per MN point
N_DEFAULT = 1.35  # -

_OUTPUTS = ("k", "mn")


def _checked(p_boost_bar, compression_ratio, t_ref, p_ref_bar, mn_ref, compression_ratio_ref,
             k_per_mn, n_poly, activation_k, pressure_exp) -> tuple:
    p = check_range("p_boost_bar", p_boost_bar, 0.5, 10.0, "bar")
    eps = check_range("compression_ratio", compression_ratio, 4.0, 25.0, "")
    tr = check_range("t_ref", t_ref, -30.0, 150.0, "°C")
    pr = check_range("p_ref_bar", p_ref_bar, 0.5, 10.0, "bar")
    mnr = check_range("mn_ref", mn_ref, 0.0, 150.0, "")
    eps_r = eps if compression_ratio_ref is None else check_range(
        "compression_ratio_ref", compression_ratio_ref, 4.0, 25.0, "")
    k = check_range("k_per_mn", K_DEFAULT if k_per_mn is None else k_per_mn, 0.05, 10.0, "K")
    n = check_range("n_poly", N_DEFAULT if n_poly is None else n_poly, 1.0, 1.6, "")
    b = check_range("activation_k", B_DEFAULT if activation_k is None else activation_k,
                    1000.0, 100000.0, "K")
    a = check_range("pressure_exp", A_DEFAULT if pressure_exp is None else pressure_exp,
                    0.0, 3.0, "")
    return p, eps, tr, pr, mnr, eps_r, k, n, b, a


def _t_allow_ref_mn(p, eps, tr, pr, eps_r, n, b, a) -> float:
    """Allowed mixture temperature [°C] for a gas of MN = MN_ref."""
    tc_ref = (tr + 273.15) * eps_r ** (n - 1.0)
    ln_ratio = math.log(p * eps ** n / (pr * eps_r ** n))
    inv = 1.0 / tc_ref + (a / b) * ln_ratio
    if not inv > 0.0:  # pragma: no cover - unreachable within the checked ranges
        raise CellInputError("p_boost_bar: the pressure ratio to the reference is out of the "
                             "model's range")
    return (1.0 / inv) / eps ** (n - 1.0) - 273.15


def t_limit(p_boost_bar, compression_ratio, methane_number, t_ref, p_ref_bar, mn_ref,
            compression_ratio_ref=None, k_per_mn=K_DEFAULT, n_poly=N_DEFAULT,
            activation_k=B_DEFAULT, pressure_exp=A_DEFAULT) -> float:
    """Highest mixture temperature after the cooler for this gas (KNOCK_T_LIMIT).

    Parameters
    ----------
    p_boost_bar : float
        Boost (receiver) pressure at the site [bar(a)].
    compression_ratio : float
        Geometric, or for early/late inlet-valve closing the effective,
        compression ratio [-].
    methane_number : float
        Methane number of the site's gas [-].
    t_ref, p_ref_bar, mn_ref : float
        Declared knock-free reference point: mixture temperature [°C], boost
        pressure [bar(a)], methane number [-].
    compression_ratio_ref : float, optional
        Compression ratio at the reference point [-] (default: compression_ratio).
    k_per_mn : float
        Allowed mixture temperature gained per methane-number point [K].
    n_poly : float
        Polytropic exponent of compression [-].
    activation_k : float
        Ignition-delay activation temperature B [K].
    pressure_exp : float
        Ignition-delay pressure exponent a [-].

    Returns
    -------
    float
        T_allow, the highest mixture temperature after the cooler at which the
        end-gas ignition delay stays at its reference value, shifted by
        k_per_mn per methane-number point of the site's gas [°C].

    Notes
    -----
    T_c,ref = (t_ref + 273.15)·ε_ref^(n−1); 1/T_c,lim = 1/T_c,ref +
    (a/B)·ln(p·ε^n / (p_ref·ε_ref^n)); T_allow = T_c,lim/ε^(n−1) − 273.15 +
    k·(MN − MN_ref).  A screening index calibrated to one declared point, not a
    knock prediction; load (BMEP) and ignition timing are not covered.
    Validity (checked, else CellInputError): t_ref -30 to 150 °C,
    p_boost_bar and p_ref_bar 0.5 to 10 bar(a), compression ratios 4 to 25,
    methane numbers 0 to 150, k_per_mn 0.05 to 10 K, n_poly 1.0 to 1.6,
    activation_k 1,000 to 100,000 K, pressure_exp 0 to 3.

    References
    ----------
    .. [1] Livengood, J.C., Wu, P.C. (1955), Correlation of autoignition phenomena
       in internal combustion engines and rapid compression machines, Fifth
       Symposium (International) on Combustion, 347-356.
    .. [2] Spadaccini, L.J., Colket, M.B. (1994), Ignition delay characteristics of
       methane fuels, Prog. Energy Combust. Sci. 20, 431-460.
    .. [3] Bade Shrestha, S.O., Rodrigues, R. (2008), Effects of diluents on knock
       limited performance of a spark ignition engine (SAE paper).
    """
    p, eps, tr, pr, mnr, eps_r, k, n, b, a = _checked(
        p_boost_bar, compression_ratio, t_ref, p_ref_bar, mn_ref, compression_ratio_ref,
        k_per_mn, n_poly, activation_k, pressure_exp)
    mn = check_range("methane_number", methane_number, 0.0, 150.0, "")
    return _t_allow_ref_mn(p, eps, tr, pr, eps_r, n, b, a) + k * (mn - mnr)


def _output(output) -> str:
    if output is None:
        return "k"
    if not isinstance(output, str):
        raise CellTypeError(f'output: {output!r} is not a word; use "k" or "mn"')
    w = output.strip().lower().replace(" ", "")
    w = {"": "k", "kelvin": "k", "methanenumber": "mn"}.get(w, w)
    if w not in _OUTPUTS:
        raise CellTypeError(f'output: "{output}" is not an output; use "k" (kelvin) or '
                            '"mn" (methane-number points)')
    return w


def margin(t_mixture, p_boost_bar, compression_ratio, methane_number, t_ref, p_ref_bar,
           mn_ref, compression_ratio_ref=None, output="k", k_per_mn=K_DEFAULT,
           n_poly=N_DEFAULT, activation_k=B_DEFAULT, pressure_exp=A_DEFAULT) -> float:
    """Knock margin (KNOCK_MARGIN).

    Parameters
    ----------
    t_mixture : float
        Mixture temperature after the charge-air cooler at the site [°C].
    p_boost_bar : float
        Boost (receiver) pressure at the site [bar(a)].
    compression_ratio : float
        Geometric, or for early/late inlet-valve closing the effective,
        compression ratio [-].
    methane_number : float
        Methane number of the site's gas [-].
    t_ref, p_ref_bar, mn_ref : float
        Declared knock-free reference point: mixture temperature [°C], boost
        pressure [bar(a)], methane number [-].
    compression_ratio_ref : float, optional
        Compression ratio at the reference point [-] (default: compression_ratio).
    output : str
        ``"k"``: kelvin the mixture may still warm up before the calibrated
        limit [K]; ``"mn"``: the same in methane-number points [-].
    k_per_mn : float
        Allowed mixture temperature gained per methane-number point [K].
    n_poly : float
        Polytropic exponent of compression [-].
    activation_k : float
        Ignition-delay activation temperature B [K].
    pressure_exp : float
        Ignition-delay pressure exponent a [-].

    Returns
    -------
    float
        margin [K] (``"k"``) or [-] (``"mn"``); negative means beyond the limit.

    Notes
    -----
    margin_K = T_allow − t_mixture with T_allow from :func:`t_limit`;
    margin_MN = margin_K / k_per_mn.  A screening index calibrated to one
    declared point, not a knock prediction.  Validity (checked, else
    CellInputError): t_mixture -30 to 150 °C; the other arguments as
    :func:`t_limit`.

    References
    ----------
    .. [1] Livengood, J.C., Wu, P.C. (1955), Correlation of autoignition phenomena
       in internal combustion engines and rapid compression machines, Fifth
       Symposium (International) on Combustion, 347-356.
    .. [2] Spadaccini, L.J., Colket, M.B. (1994), Ignition delay characteristics of
       methane fuels, Prog. Energy Combust. Sci. 20, 431-460.
    .. [3] Bade Shrestha, S.O., Rodrigues, R. (2008), Effects of diluents on knock
       limited performance of a spark ignition engine (SAE paper).
    """
    t = check_range("t_mixture", t_mixture, -30.0, 150.0, "°C")
    which = _output(output)
    k = check_range("k_per_mn", K_DEFAULT if k_per_mn is None else k_per_mn, 0.05, 10.0, "K")
    m_k = t_limit(p_boost_bar, compression_ratio, methane_number, t_ref, p_ref_bar, mn_ref,
                  compression_ratio_ref, k, n_poly, activation_k, pressure_exp) - t
    return m_k if which == "k" else m_k / k


def mn_required(t_mixture, p_boost_bar, compression_ratio, t_ref, p_ref_bar, mn_ref,
                compression_ratio_ref=None, k_per_mn=K_DEFAULT, n_poly=N_DEFAULT,
                activation_k=B_DEFAULT, pressure_exp=A_DEFAULT) -> float:
    """Methane number the engine needs at this mixture temperature (KNOCK_MN_REQUIRED).

    Parameters
    ----------
    t_mixture : float
        Mixture temperature after the charge-air cooler at the site [°C].
    p_boost_bar : float
        Boost (receiver) pressure at the site [bar(a)].
    compression_ratio : float
        Geometric, or for early/late inlet-valve closing the effective,
        compression ratio [-].
    t_ref, p_ref_bar, mn_ref : float
        Declared knock-free reference point: mixture temperature [°C], boost
        pressure [bar(a)], methane number [-].
    compression_ratio_ref : float, optional
        Compression ratio at the reference point [-] (default: compression_ratio).
    k_per_mn : float
        Allowed mixture temperature gained per methane-number point [K].
    n_poly : float
        Polytropic exponent of compression [-].
    activation_k : float
        Ignition-delay activation temperature B [K].
    pressure_exp : float
        Ignition-delay pressure exponent a [-].

    Returns
    -------
    float
        Required methane number [-].

    Notes
    -----
    MN_req = MN_ref − (T_allow(MN_ref) − t_mixture)/k: the methane number at
    which the margin is zero.  May be below 0 or above 100 (a far-off point).
    Validity (checked, else CellInputError): t_mixture -30 to 150 °C; the
    other arguments as :func:`t_limit`.

    References
    ----------
    .. [1] Livengood, J.C., Wu, P.C. (1955), Correlation of autoignition phenomena
       in internal combustion engines and rapid compression machines, Fifth
       Symposium (International) on Combustion, 347-356.
    .. [2] Spadaccini, L.J., Colket, M.B. (1994), Ignition delay characteristics of
       methane fuels, Prog. Energy Combust. Sci. 20, 431-460.
    .. [3] Bade Shrestha, S.O., Rodrigues, R. (2008), Effects of diluents on knock
       limited performance of a spark ignition engine (SAE paper).
    """
    t = check_range("t_mixture", t_mixture, -30.0, 150.0, "°C")
    p, eps, tr, pr, mnr, eps_r, k, n, b, a = _checked(
        p_boost_bar, compression_ratio, t_ref, p_ref_bar, mn_ref, compression_ratio_ref,
        k_per_mn, n_poly, activation_k, pressure_exp)
    return mnr - (_t_allow_ref_mn(p, eps, tr, pr, eps_r, n, b, a) - t) / k
