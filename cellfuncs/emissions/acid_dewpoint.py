"""Sulphuric-acid dew point of a gas engine's exhaust (Verhoff & Banchero 1974).

The sulphur of the fuel (H2S) burns to SO2; a share of it is oxidised further to
SO3, which with the exhaust's water forms sulphuric acid that condenses well
above the water dew point.  Verhoff & Banchero fitted the dew point of
sulphuric acid to the partial pressures of water and SO3:

    1000/T_dp = 2.276 − 0.02943·ln p_H2O − 0.0858·ln p_SO3 + 0.0062·ln p_H2O·ln p_SO3

with T_dp in K and the partial pressures in mmHg (the paper's form; 1 bar =
750.062 mmHg).  The exhaust composition is that of :mod:`cellfuncs.recovery.exhaust`
(complete combustion at the air ratio, the ambient air's water included);
p_SO3 = so3_share · y_SO2 · p, with so3_share the molar share of the sulphur
that leaves as SO3 (common practice 1–5 %).
"""

from __future__ import annotations

import math

from cellfuncs.errors import CellInputError, check_range, fmt

__all__ = ["VB_COEF", "MMHG_PER_BAR", "verhoff_banchero", "acid_dewpoint"]

#: Verhoff & Banchero (1974) coefficients (a, b, c, d) of 1000/T = a − b ln pw − c ln ps + d ln pw ln ps
VB_COEF = (2.276, 0.02943, 0.0858, 0.0062)
#: mmHg per bar (1 mmHg = 133.322 387 415 Pa)
MMHG_PER_BAR = 1e5 / 133.322387415
#: exhaust pressures offered here [bar(a)]: stack conditions, where the correlation is used
P_RANGE = (0.5, 2.0)


def verhoff_banchero(p_h2o_mmhg: float, p_so3_mmhg: float) -> float:
    """Sulphuric-acid dew point from the partial pressures of water and SO3.

    Parameters
    ----------
    p_h2o_mmhg : float
        Partial pressure of water vapour, > 0. [mmHg]
    p_so3_mmhg : float
        Partial pressure of SO3 (sulphuric acid vapour counted as SO3), > 0. [mmHg]

    Returns
    -------
    t_dp : float
        1000/T = 2.276 − 0.02943 ln p_H2O − 0.0858 ln p_SO3 + 0.0062 ln p_H2O ln p_SO3. [°C]

    Raises
    ------
    CellInputError
        A partial pressure not above 0, or no finite dew point from the equation.

    Notes
    -----
    The coefficients are as the paper is quoted in the heat-recovery literature
    (the second one also appears rounded to 0.0294; the difference is below
    0.05 K in flue gases).  Fitted to flue gases near atmospheric pressure
    (from memory); no further range is checked here.

    References
    ----------
    .. [1] Verhoff, F. H., Banchero, J. T. (1974). Predicting dew points of flue
       gases. Chemical Engineering Progress 70(8), 71-72.
    """
    pw = check_range("p_h2o_mmhg", p_h2o_mmhg, 0.0, None, "mmHg", lo_open=True)
    ps = check_range("p_so3_mmhg", p_so3_mmhg, 0.0, None, "mmHg", lo_open=True)
    a, b, c, d = VB_COEF
    lw, ls = math.log(pw), math.log(ps)
    inv = a - b * lw - c * ls + d * lw * ls
    if not inv > 0 or not math.isfinite(inv):
        raise CellInputError(f"p_so3_mmhg: {fmt(ps)} mmHg with water at {fmt(pw)} mmHg is outside the "
                             "Verhoff & Banchero (1974) correlation (no positive dew point)")
    return 1000.0 / inv - 273.15


def acid_dewpoint(air_ratio: float, comp, p_exhaust_bar: float = 1.01325, t_ambient: float = 25.0,
                  rh_ambient: float = 0.3, p_ambient_bar: float = 1.0,
                  so3_share: float = 0.02) -> float:
    """Sulphuric-acid dew point of a gas engine's exhaust.

    Parameters
    ----------
    air_ratio : float
        Air ratio λ of the engine, 1 to 20. [-]
    comp : Composition
        Fuel gas; its sulphur (H2S) sets the SO2 of the exhaust.
    p_exhaust_bar : float
        Exhaust pressure, 0.5 to 2. [bar(a)]
    t_ambient, rh_ambient, p_ambient_bar : float
        Combustion air: temperature [°C], relative humidity 0-1 [-], pressure
        [bar(a)] (its water adds to the exhaust's).
    so3_share : float
        Molar share of the fuel's sulphur leaving as SO3, above 0 to 1 (common
        practice 0.01 to 0.05). [-]

    Returns
    -------
    t_dp : float
        Acid dew point by :func:`verhoff_banchero` at p_H2O = y_H2O·p and
        p_SO3 = so3_share·y_SO2·p (wet mole fractions of the exhaust). [°C]

    Raises
    ------
    CellInputError
        A gas without sulphur (no acid dew point); an air ratio, pressure or
        share out of range; an acid dew point below the water dew point (so
        little SO3 that the water dew point governs).

    Notes
    -----
    Exhaust composition from :func:`cellfuncs.recovery.exhaust.exhaust_fractions`
    (complete combustion; the ambient air's water from IAPWS-IF97 saturation).
    The SO3 share depends on the engine and any oxidation catalyst; take it
    from the engine's declared data where given.  Keep stack and heat-exchanger
    surfaces above this temperature with a margin (common practice).

    References
    ----------
    .. [1] Verhoff, F. H., Banchero, J. T. (1974). Predicting dew points of flue
       gases. Chemical Engineering Progress 70(8), 71-72.
    """
    from cellfuncs.chargeair import humid
    from cellfuncs.recovery import exhaust

    lam = check_range("air_ratio", air_ratio, 1.0, 20.0, "", where="complete combustion needs "
                      "air_ratio >= 1")
    p = check_range("p_exhaust_bar", p_exhaust_bar, *P_RANGE, "bar(a)",
                    where="stack pressures, where the correlation is used")
    share = check_range("so3_share", so3_share, 0.0, 1.0, "", lo_open=True,
                        where="a fraction; common practice 0.01 to 0.05")
    w = exhaust.ambient_water(t_ambient, rh_ambient, p_ambient_bar)
    y = exhaust.exhaust_fractions(comp, lam, w, False)
    if not y.get("SO2", 0.0) > 0:
        raise CellInputError("components: the gas holds no sulphur (no H2S), so the exhaust has no "
                             "sulphuric-acid dew point; its water dew point is EXH_DEWPOINT")
    if not y.get("H2O", 0.0) > 0:
        raise CellInputError("components: the exhaust holds no water, so no acid dew point")
    pw = y["H2O"] * p * MMHG_PER_BAR
    ps = share * y["SO2"] * p * MMHG_PER_BAR
    try:
        t_acid = verhoff_banchero(pw, ps)
    except CellInputError as exc:
        raise CellInputError(f"components: {exc.message}") from None
    t_water = humid.dew_point_c(y["H2O"], p)
    if t_acid < t_water:
        raise CellInputError(f"components: so little SO3 ({fmt(ps)} mmHg) that the correlation gives "
                             f"{t_acid:.1f} °C, below the water dew point {t_water:.1f} °C; the water "
                             "dew point governs (EXH_DEWPOINT)")
    return t_acid
