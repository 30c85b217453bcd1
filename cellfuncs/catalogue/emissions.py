"""Catalogue entries of emission conversions, dry exhaust volume and the acid dew point."""

from cellfuncs.catalogue.gas import KIND_ALIASES
from cellfuncs.catalogue.spec import Arg, CellFunction
# the words the conversion core knows (a light module: math only), one list for both
from cellfuncs.emissions.conversions import SPECIES, SPECIES_ALIASES, UNIT_ALIASES, UNITS

CATEGORY = "cellfuncs · emissions"

# gas analysis arguments by the glossary (components + amounts)
COMPONENTS_OPT = Arg(
    "components",
    "Range of gas component names (formula or name, e.g. CH4, methane), or a two-column range of "
    "names and amounts when amounts is omitted",
    kind="gas", default=None)
COMPONENTS = Arg(
    "components",
    "Range of gas component names (formula or name, e.g. CH4, methane), or a two-column range of "
    "names and amounts when amounts is omitted",
    kind="gas")
AMOUNTS = Arg(
    "amounts",
    "Amounts in the same shape as components, mol% (sum near 100) or mole fractions (sum near 1); "
    "omit for a two-column components range",
    kind="amounts", default=None)

_KIND = Arg("kind", "Calorific value of the fuel energy: net (LHV) or gross (HHV), at 25 °C "
            "combustion reference; engine-side functions default to net, as engine datasheets",
            kind="option", default="net", options=("gross", "net"), aliases=KIND_ALIASES)


def _unit(name: str, what: str) -> Arg:
    return Arg(name, what + ": ppm and mg/Nm3 of dry exhaust at o2_reference_pct, mg/MJ of fuel, "
               "g/kWh of electricity", kind="option", options=UNITS, aliases=UNIT_ALIASES)


_GAS = ([["methane", 92.0], ["ethane", 4.5], ["propane", 1.0], ["nitrogen", 1.5],
         ["carbon dioxide", 1.0]], None)
_SOUR = ([["methane", 88.0], ["ethane", 3.0], ["nitrogen", 4.0], ["carbon dioxide", 4.9],
          ["hydrogen sulfide", 0.1]], None)

_NOTE = " Emission guarantees come from the engine's declared data; permits follow local law."

ENTRIES = [
    CellFunction(
        name="EMIS_CONVERT",
        target="cellfuncs.emissions.conversions:emis_convert_words",
        category=CATEGORY,
        description="Converts an emission value between ppm, mg/Nm3 (dry, 0 °C, 1.01325 bar, 22.414 "
                    "L/mol, at the reference O2), mg/MJ of fuel and g/kWh of electricity by the "
                    "F-factor method." + _NOTE,
        args=(Arg("value", "Emission value in unit_given, >= 0", ""),
              _unit("unit_given", "Unit of value"),
              _unit("unit_wanted", "Unit wanted"),
              Arg("species", "NOx as NO2, CO, HCHO (formaldehyde), SO2, NH3, THC as CH4; matters "
                  "for ppm", kind="option", default="nox",
                  options=tuple(SPECIES), aliases=SPECIES_ALIASES),
              COMPONENTS_OPT, AMOUNTS,
              Arg("o2_reference_pct", "Reference O2 of the dry exhaust for ppm and mg/Nm3, 0 to "
                  "below 20.9", "vol-%", default=5.0),
              Arg("electrical_efficiency", "Electrical efficiency on the kind of calorific value, "
                  "a fraction 0-1 from the engine's datasheet; needed for g/kWh", "-",
                  default=None),
              _KIND),
        returns="emission value [unit_wanted]",
        example=(500.0, "mg/nm3", "g/kwh", "nox", *_GAS, 5.0, 0.42, "net"),
    ),
    CellFunction(
        name="EXH_DRY_VOLUME",
        target="cellfuncs.emissions.conversions:dry_volume",
        category=CATEGORY,
        description="Dry exhaust volume per kWh of fuel (F-factor): stoichiometric dry flue gas of "
                    "complete combustion times 20.9/(20.9 - O2_ref), m³ at 0 °C and 1.01325 bar "
                    "(22.414 L/mol), calorific value at 25 °C.",
        args=(COMPONENTS, AMOUNTS,
              Arg("o2_reference_pct", "O2 of the dry exhaust the volume refers to, 0 to below 20.9",
                  "vol-%", default=0.0),
              _KIND),
        returns="dry exhaust volume [Nm³/kWh]",
        example=(*_GAS, 0.0, "net"),
    ),
    CellFunction(
        name="EXH_ACID_DEWPOINT",
        target="cellfuncs.emissions.acid_dewpoint:acid_dewpoint",
        category=CATEGORY,
        description="Sulphuric-acid dew point of a gas engine's exhaust by Verhoff & Banchero (1974) "
                    "from the partial pressures of H2O and SO3 (mmHg in the paper's form); error for "
                    "a gas without sulphur. An estimate for tendering.",
        args=(Arg("air_ratio", "Air ratio (lambda) of the engine, 1 to 20, from the engine's "
                  "declared datasheet", "-"),
              COMPONENTS, AMOUNTS,
              Arg("p_exhaust_bar", "Exhaust pressure at the surface in question, 0.5 to 2",
                  "bar(a)", default=1.01325),
              Arg("t_ambient", "Combustion-air temperature (ISO 3046-1 standard reference conditions by default: 25 °C, 30 % RH, 100 kPa; its humidity adds water to the "
                  "exhaust)", "°C", default=25.0),
              Arg("rh_ambient", "Relative humidity of the combustion air, 0 to 1; default: ISO 3046-1 standard reference conditions: 25 °C, 30 % RH, 100 kPa", "-", default=0.3),
              Arg("p_ambient_bar", "Ambient pressure; default: ISO 3046-1 standard reference conditions: 25 °C, 30 % RH, 100 kPa", "bar(a)", default=1.0),
              Arg("so3_share", "Molar share of the fuel's sulphur leaving as SO3 (common practice "
                  "0.01 to 0.05)", "-", default=0.02)),
        returns="acid dew point [°C]",
        example=(1.8, *_SOUR, 1.01325, 25.0, 0.3, 1.0, 0.02),
    ),
]
