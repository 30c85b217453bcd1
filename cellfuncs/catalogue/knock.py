"""Catalogue entries of the knock family (screening knock margin)."""

from cellfuncs.catalogue.spec import Arg, CellFunction

CATEGORY = "cellfuncs · knock"

_CAUTION = (" Screening index calibrated to one datasheet point, not a knock prediction; "
            "the maker's knock control and derating govern.")

_T_MIX = Arg("t_mixture", "Mixture temperature after the charge-air cooler at the site, "
             "-30 to 150", unit="°C")
_P_BOOST = Arg("p_boost_bar", "Boost (receiver) pressure at the site, 0.5 to 10", unit="bar(a)")
_EPS = Arg("compression_ratio", "Compression ratio, 4 to 25; use the effective one for early "
           "or late inlet-valve closing", unit="-")
_MN = Arg("methane_number", "Methane number of the site's gas, 0 to 150", unit="-")
_T_REF = Arg("t_mixture_ref", "Mixture temperature of the declared knock-free reference point "
             "(engine datasheet)", unit="°C")
_P_REF = Arg("p_boost_ref_bar", "Boost pressure of the declared reference point (engine datasheet)",
             unit="bar(a)")
_MN_REF = Arg("methane_number_ref", "Methane number of the declared reference point (engine datasheet)",
              unit="-")
_EPS_REF = Arg("compression_ratio_ref", "Compression ratio at the reference point; blank: "
               "the same as compression_ratio", unit="-", default=None)
_K = Arg("k_per_mn", "Allowed mixture temperature per methane-number point, an estimate "
         "(about ±30 %); override with the engine's derating data", unit="K", default=0.8)
_N = Arg("polytropic_exponent", "Polytropic exponent of compression, 1.0 to 1.6 (common practice)",
         unit="-", default=1.35)
_B = Arg("activation_temperature", "Ignition-delay activation temperature B (activation energy "
         "over the gas constant), from a GRI-Mech 3.0 fit for lean methane-air", unit="K",
         default=19600.0)
_A = Arg("delay_pressure_exponent", "Pressure exponent a of the ignition delay, from the same "
         "fit", unit="-",
         default=0.85)

ENTRIES = [
    CellFunction(
        name="KNOCK_MARGIN",
        target="cellfuncs.knock.margin:margin",
        category=CATEGORY,
        description="Knock margin: kelvin (k) or methane-number points (mn) left before the "
                    "calibrated limit, negative beyond it; not for load or timing."
                    + _CAUTION,
        args=(_T_MIX, _P_BOOST, _EPS, _MN, _T_REF, _P_REF, _MN_REF, _EPS_REF,
              Arg("unit", "Unit of the margin: k (kelvin of mixture temperature) or mn "
                  "(methane-number points)", kind="option", default="k",
                  options=("k", "mn"), aliases={"kelvin": "k", "methanenumber": "mn"}),
              _K, _N, _B, _A),
        returns='knock margin: "k" [K], "mn" [-]',
    ),
    CellFunction(
        name="KNOCK_T_LIMIT",
        target="cellfuncs.knock.margin:t_limit",
        category=CATEGORY,
        description="Highest mixture temperature after the charge-air cooler for this gas, "
                    "boost and compression ratio; keep it above the dew point too."
                    + _CAUTION,
        args=(_P_BOOST, _EPS, _MN, _T_REF, _P_REF, _MN_REF, _EPS_REF, _K, _N, _B, _A),
        returns="highest mixture temperature [°C]",
    ),
    CellFunction(
        name="KNOCK_MN_REQUIRED",
        target="cellfuncs.knock.margin:mn_required",
        category=CATEGORY,
        description="Methane number the engine needs at this mixture temperature, boost and "
                    "compression ratio." + _CAUTION,
        args=(_T_MIX, _P_BOOST, _EPS, _T_REF, _P_REF, _MN_REF, _EPS_REF, _K, _N, _B, _A),
        returns="required methane number [-]",
    ),
]
