"""Catalogue entries of the chargeair family (mixture flow, compressor, charge-air cooler)."""

from cellfuncs.catalogue.gas import KIND_ALIASES
from cellfuncs.catalogue.spec import Arg, CellFunction

CATEGORY = "cellfuncs · charge air"

_CAUTION = " Estimate for tendering; engine data from its datasheet."


_GAS_HELP = ("Range of fuel-gas component names (formula or common name, e.g. CH4, methane, "
             "n-C4H10), or a two-column range of names and amounts with amounts left empty")


def _components(optional: bool = False) -> Arg:
    if optional:
        return Arg("components", _GAS_HELP + "; leave empty for humid air only", kind="gas",
                   default=None)
    return Arg("components", _GAS_HELP, kind="gas")


def _amounts() -> Arg:
    return Arg("amounts", "Amounts in the same shape as components, mol% (sum near 100) or mole "
               "fractions (sum near 1); normalised; water (H2O) in the gas counts as vapour; "
               "leave empty for a two-column components range", kind="amounts", default=None)


def _air_ratio(optional: bool = False) -> Arg:
    text = ("Air ratio λ (dry air over stoichiometric dry air) from the engine's datasheet, above "
            "0 and at most 20 (a rich mixture below 1 is allowed here; EXH_ functions need at "
            "least 1 for complete combustion)")
    if optional:
        return Arg("air_ratio", text + "; needed when components are given", unit="-",
                   default=None)
    return Arg("air_ratio", text, unit="-")


_ISO = "ISO 3046-1 standard reference conditions: 25 °C, 30 % RH, 100 kPa"

_T_AMBIENT = Arg("t_ambient", f"Ambient air temperature, -50 to 60, that sets the humidity "
                 f"({_ISO})", unit="°C", default=25.0)
_RH_AMBIENT = Arg("rh_ambient", "Ambient relative humidity as a fraction 0 to 1 (over ice below "
                  f"0 °C) ({_ISO})", unit="-", default=0.3)
_P_AMBIENT = Arg("p_ambient_bar", f"Ambient pressure, 0.5 to 1.2 ({_ISO})", unit="bar(a)",
                 default=1.0)

_P_MIX = Arg("p_boost_bar", "Pressure of the mixture in the cooler (boost pressure), 0.5 to 50",
             unit="bar(a)")
_FLOW = Arg("mixture_flow_kg_h", "Mass flow of the whole mixture (dry air + water vapour + "
            "fuel gas), as CAC_MIXTURE_FLOW with result mixture", unit="kg/h")

ENTRIES = [
    CellFunction(
        name="CAC_MIXTURE_FLOW",
        target="cellfuncs.chargeair.mixture:mixture_flow",
        category=CATEGORY,
        description="Mass flow of the air-gas mixture of a mixture-charged gas engine, or of "
                    "its dry air, water or fuel part, from the fuel power, air ratio and "
                    "ambient humidity (CAC_ = charge air, not the cooler)." + _CAUTION,
        args=(
            Arg("fuel_power_kw", "Fuel (heat input) power of the engine on the chosen "
                "calorific value kind, 0 or more", unit="kW"),
            _air_ratio(),
            _components(),
            _amounts(),
            Arg("kind", "Calorific value kind of fuel_power_kw, at 25 °C combustion "
                "(ISO 6976:2016): net (LHV) or gross (HHV); engine-side functions default to "
                "net, as engine datasheets are", kind="option", default="net",
                options=("net", "gross"), aliases=KIND_ALIASES),
            _T_AMBIENT,
            _RH_AMBIENT,
            _P_AMBIENT,
            Arg("result", "Which flow: mixture (dry air + water vapour + fuel gas), dry_air, "
                "water (humidity plus the gas's own water) or fuel (the gas without its "
                "water)", kind="option", default="mixture",
                options=("mixture", "dry_air", "water", "fuel"),
                aliases={"air": "dry_air", "dryair": "dry_air", "gas": "fuel",
                         "vapour": "water", "vapor": "water", "total": "mixture"}),
        ),
        returns="mass flow [kg/h]",
    ),
    CellFunction(
        name="TURBO_T_OUT",
        target="cellfuncs.chargeair.compressor:t_out",
        category=CATEGORY,
        description="Compressor outlet temperature of the humid air-gas mixture (humid air "
                    "without a gas): ideal-gas entropy balance, cp(T), isentropic efficiency on "
                    "enthalpy (TURBO_ = turbocharger compressor)." + _CAUTION,
        args=(
            Arg("t_air_in", "Compressor inlet temperature, -50 to 300, at or above the "
                "mixture's dew point", unit="°C"),
            Arg("p_air_in_bar", "Compressor inlet pressure, 0.3 to 50 (the ambient humidity is "
                "taken at this pressure)", unit="bar(a)"),
            Arg("p_air_out_bar", "Compressor outlet pressure, at least p_air_in_bar and at most "
                "10 times it", unit="bar(a)"),
            Arg("isentropic_efficiency", "Isentropic efficiency of the compressor from its map, "
                "a fraction above 0 and at most 1", unit="-"),
            _air_ratio(True),
            _components(True),
            _amounts(),
            _T_AMBIENT,
            _RH_AMBIENT,
        ),
        returns="compressor outlet temperature [°C]",
    ),
    CellFunction(
        name="CAC_DEWPOINT",
        target="cellfuncs.chargeair.cooler:dew_point",
        category=CATEGORY,
        description="Water dew point of the air-gas mixture at pressure p_boost_bar (IAPWS-IF97 "
                    "saturation pressure, enhancement factor neglected); keep the intake "
                    "above it." + _CAUTION,
        args=(_P_MIX, _air_ratio(), _components(), _amounts(), _T_AMBIENT, _RH_AMBIENT,
              _P_AMBIENT),
        returns="dew point [°C]",
    ),
    CellFunction(
        name="CAC_DUTY",
        target="cellfuncs.chargeair.cooler:duty",
        category=CATEGORY,
        description="Heat removed from the air-gas mixture in a charge-air cooler (stage) "
                    "from t_mixture_in to t_mixture_out, sensible plus latent. "
                    "Condensate in the intake damages engines unless drained." + _CAUTION,
        args=(
            _FLOW,
            Arg("t_mixture_in", "Mixture temperature into the cooler (stage), above the dew "
                "point", unit="°C"),
            Arg("t_mixture_out", "Mixture temperature out of the cooler (stage), at most "
                "t_mixture_in", unit="°C"),
            _P_MIX, _air_ratio(), _components(), _amounts(), _T_AMBIENT, _RH_AMBIENT,
            _P_AMBIENT,
        ),
        returns="cooler duty [kW]",
    ),
    CellFunction(
        name="CAC_CONDENSATE",
        target="cellfuncs.chargeair.cooler:condensate",
        category=CATEGORY,
        description="Water condensed from the air-gas mixture by cooling it to t_mixture_out "
                    "at p_boost_bar (0 above the dew point). Condensate in the intake damages engines "
                    "unless separated and drained." + _CAUTION,
        args=(
            _FLOW,
            Arg("t_mixture_out", "Mixture temperature out of the cooler (stage)", unit="°C"),
            _P_MIX, _air_ratio(), _components(), _amounts(), _T_AMBIENT, _RH_AMBIENT,
            _P_AMBIENT,
        ),
        returns="condensate [kg/h]",
    ),
]
