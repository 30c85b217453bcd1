"""Catalogue entries of the chargeair family (mixture flow, compressor, charge-air cooler)."""

from cellfuncs.catalogue.gas import KIND_ALIASES
from cellfuncs.catalogue.spec import Arg, CellFunction

CATEGORY = "cellfuncs · charge air"

_CAUTION = " Estimate for tendering; engine data from its datasheet."


def _components(optional: bool = False) -> Arg:
    text = ("Range of fuel-gas component names (formula or common name, e.g. CH4, methane, "
            "n-C4H10)")
    if optional:
        return Arg("components", text + "; omit for humid air only", kind="range", default=None)
    return Arg("components", text, kind="range")


def _fractions(optional: bool = False) -> Arg:
    text = ("Amounts in the same shape as components, mol% (sum near 100) or mole fractions "
            "(sum near 1); normalised; water (H2O) in the gas counts as vapour")
    if optional:
        return Arg("fractions", text, kind="range", default=None)
    return Arg("fractions", text, kind="range")


def _lambda(optional: bool = False) -> Arg:
    text = "Air ratio lambda (dry air over stoichiometric dry air), above 0 and at most 20"
    if optional:
        return Arg("lambda_", text + "; needed when components are given", unit="-",
                   default=None)
    return Arg("lambda_", text, unit="-")


_ISO = "ISO 3046-1 reference from memory"


def _t_ambient(optional: bool) -> Arg:
    text = "Ambient air temperature, -50 to 60, that sets the humidity"
    if optional:
        return Arg("t_ambient", text + f" ({_ISO})", unit="°C", default=25.0)
    return Arg("t_ambient", text + f" ({_ISO}: 25)", unit="°C")


def _rh_ambient(optional: bool) -> Arg:
    text = "Ambient relative humidity as a fraction 0 to 1 (over ice below 0 °C)"
    if optional:
        return Arg("rh_ambient", text + f" ({_ISO})", unit="-", default=0.3)
    return Arg("rh_ambient", text + f" ({_ISO}: 0.3)", unit="-")


_P_AMBIENT = Arg("p_ambient_bar", f"Ambient pressure, 0.5 to 1.2 ({_ISO})", unit="bar(a)",
                 default=1.0)

_P_MIX = Arg("p_bar", "Pressure of the mixture in the cooler (boost pressure), 0.5 to 50",
             unit="bar(a)")
_FLOW = Arg("mixture_flow_kg_h", "Mass flow of the whole mixture (dry air + water vapour + "
            "fuel gas), as CAC_MIXTURE_FLOW with part mixture", unit="kg/h")

ENTRIES = [
    CellFunction(
        name="CAC_MIXTURE_FLOW",
        target="cellfuncs.chargeair.mixture:cell_mixture_flow",
        category=CATEGORY,
        description="Mass flow of the air-gas mixture of a mixture-charged gas engine, or of "
                    "its dry air, water vapour or fuel part, from the fuel power, lambda and "
                    "the ambient humidity." + _CAUTION,
        args=(
            Arg("fuel_power_kw", "Fuel (heat input) power of the engine on the chosen "
                "calorific value kind, 0 or more", unit="kW"),
            _lambda(),
            _components(),
            _fractions(),
            Arg("kind", "Calorific value kind of fuel_power_kw, at 25 °C combustion "
                "(ISO 6976:2016): net (LHV) or gross (HHV)", kind="option", default="net",
                options=("net", "gross"), aliases=KIND_ALIASES),
            _t_ambient(True),
            _rh_ambient(True),
            _P_AMBIENT,
            Arg("part", "Which flow: mixture (dry air + water vapour + fuel gas), dry_air, "
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
        target="cellfuncs.chargeair.compressor:cell_turbo_t_out",
        category=CATEGORY,
        description="Compressor outlet temperature of the humid air-gas mixture (humid air "
                    "only without a gas): ideal-gas entropy balance with temperature-dependent "
                    "cp, then the isentropic efficiency on enthalpy." + _CAUTION,
        args=(
            Arg("t_in", "Compressor inlet temperature, -50 to 300, at or above the mixture's "
                "dew point", unit="°C"),
            Arg("p_in_bar", "Compressor inlet pressure, 0.3 to 50 (the ambient humidity is "
                "taken at this pressure)", unit="bar(a)"),
            Arg("p_out_bar", "Compressor outlet pressure, at least p_in_bar and at most "
                "10 times it", unit="bar(a)"),
            Arg("eta_is", "Isentropic efficiency of the compressor from its map, above 0 and "
                "at most 1", unit="-"),
            _lambda(True),
            _components(True),
            _fractions(True),
            _t_ambient(True),
            _rh_ambient(True),
        ),
        returns="compressor outlet temperature [°C]",
    ),
    CellFunction(
        name="CAC_DEWPOINT",
        target="cellfuncs.chargeair.cooler:cell_dewpoint",
        category=CATEGORY,
        description="Water dew point of the air-gas mixture at pressure p_bar (IAPWS-IF97 "
                    "saturation pressure, enhancement factor neglected); keep the intake "
                    "above it." + _CAUTION,
        args=(_P_MIX, _lambda(), _components(), _fractions(), _t_ambient(False),
              _rh_ambient(False), _P_AMBIENT),
        returns="dew point [°C]",
    ),
    CellFunction(
        name="CAC_DUTY",
        target="cellfuncs.chargeair.cooler:cell_duty",
        category=CATEGORY,
        description="Heat removed from the air-gas mixture in a charge-air cooler (stage) "
                    "between t_in and t_out: sensible plus latent heat of water condensed. "
                    "Condensate in the intake damages engines unless drained." + _CAUTION,
        args=(
            _FLOW,
            Arg("t_in", "Mixture temperature into the cooler (stage), above the dew point",
                unit="°C"),
            Arg("t_out", "Mixture temperature out of the cooler (stage), at most t_in",
                unit="°C"),
            _P_MIX, _lambda(), _components(), _fractions(), _t_ambient(False),
            _rh_ambient(False), _P_AMBIENT,
        ),
        returns="cooler duty [kW]",
    ),
    CellFunction(
        name="CAC_CONDENSATE",
        target="cellfuncs.chargeair.cooler:cell_condensate",
        category=CATEGORY,
        description="Water condensed from the air-gas mixture by cooling it to t_out at "
                    "p_bar (0 above the dew point). Condensate in the intake damages engines "
                    "unless separated and drained." + _CAUTION,
        args=(
            _FLOW,
            Arg("t_out", "Mixture temperature out of the cooler (stage)", unit="°C"),
            _P_MIX, _lambda(), _components(), _fractions(), _t_ambient(False),
            _rh_ambient(False), _P_AMBIENT,
        ),
        returns="condensate [kg/h]",
    ),
]
