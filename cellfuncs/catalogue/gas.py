"""Catalogue entries of the gas family (ISO 6976:2016 properties, combustion, fuel flow)."""

from cellfuncs.catalogue.spec import Arg, CellFunction

CATEGORY = "cellfuncs · gas"

_COMPONENTS = Arg(
    "components",
    'Range of component names (formula or common name, e.g. CH4, methane, n-C4H10; "C6+" is '
    "taken as n-hexane), or a two-column range of names and amounts with amounts left empty",
    kind="gas",
)
_AMOUNTS = Arg(
    "amounts",
    "Amounts in the same shape as components, in mol% (sum near 100) or mole fractions (sum "
    "near 1); normalised, a sum more than 2 % off is an error; leave empty for a two-column "
    "components range",
    kind="amounts", default=None,
)
#: the same where a required argument follows (no default in the signature); an
#: ``amounts`` argument may still be left empty for a two-column components range
_AMOUNTS_REQ = Arg(_AMOUNTS.name, _AMOUNTS.help, kind="amounts")
#: words accepted for a calorific value kind; other families' "kind" arguments reuse this mapping
KIND_ALIASES = {"hhv": "gross", "superior": "gross", "higher": "gross",
                "lhv": "net", "inferior": "net", "lower": "net"}


_GROSS = ("; gas-quality functions default to gross 15/15, as gas analyses are reported")
_NET = "; engine-side functions default to net, as engine datasheets (GAS_CV: gross 15/15)"


def _kind(default: str) -> Arg:
    why = _GROSS if default == "gross" else _NET
    return Arg("kind", "Calorific value kind, gross (HHV, superior: water formed condensed) or "
               "net (LHV, inferior: water formed as vapour)" + why, kind="option",
               default=default, options=("gross", "net"), aliases=KIND_ALIASES)


def _ref(default: str) -> Arg:
    return Arg("ref_conditions", 'Reference conditions "t1/t2" in °C: combustion t1 (0, 15, 20 '
               'or 25) / metering t2 (0, 15 or 20), e.g. "15/15", "25/0"', kind="text",
               default=default)


_T_METERING = Arg("ref_conditions", 'Reference conditions "t1/t2" in °C (only the metering '
                  'temperature t2 matters here: 0, 15 or 20), or t2 alone as a number',
                  kind="reference", default="15/15")
_P_METERING = Arg("p_metering_bar", "Metering reference pressure, 0.90 to 1.10", unit="bar(a)",
                  default=1.01325)
_BASIS = Arg("basis", "Basis of the value: volume (real gas at metering conditions), mass or molar",
             kind="option", default="volume", options=("volume", "mass", "molar"))

_NOTE = " Estimate for tendering; contract values follow the gas supplier's analysis."

ENTRIES = [
    CellFunction(
        name="GAS_COMPONENTS",
        target="cellfuncs.gas.composition:component_names",
        category=CATEGORY,
        description="Accepted gas component names, one per row, for a drop-down list "
                    '("C6+" is taken as n-hexane); with index, the n-th name alone.',
        args=(Arg("index", "Return only the n-th name (1 = first); blank returns the whole "
                  "column", kind="integer", default=None),),
        returns="component names (one column), or the n-th name [-]",
        shape="column",
    ),
    CellFunction(
        name="GAS_MOLAR_MASS",
        target="cellfuncs.gas.iso6976:molar_mass",
        category=CATEGORY,
        description="Molar mass of a gas from its composition (ISO 6976:2016).",
        args=(_COMPONENTS, _AMOUNTS),
        returns="molar mass [kg/kmol]",
    ),
    CellFunction(
        name="GAS_Z",
        target="cellfuncs.gas.iso6976:compression_factor",
        category=CATEGORY,
        description="Compression factor Z of a gas at metering reference conditions by the "
                    "summation-factor method of ISO 6976:2016 (error when Z <= 0.9).",
        args=(_COMPONENTS, _AMOUNTS, _T_METERING, _P_METERING),
        returns="compression factor [-]",
    ),
    CellFunction(
        name="GAS_CV",
        target="cellfuncs.gas.iso6976:calorific_value",
        category=CATEGORY,
        description="Gross or net calorific value of a gas (ISO 6976:2016), volume (real "
                    "gas), mass or molar basis; defaults gross 15/15 as analyses are "
                    "reported (GAS_FUEL_FLOW: net 25/0)." + _NOTE,
        args=(_COMPONENTS, _AMOUNTS, _kind("gross"), _BASIS, _ref("15/15"), _P_METERING),
        returns='calorific value: basis "volume" [MJ/m³], "mass" [MJ/kg], "molar" [kJ/mol]',
    ),
    CellFunction(
        name="GAS_WOBBE",
        target="cellfuncs.gas.iso6976:wobbe_index",
        category=CATEGORY,
        description="Wobbe index (volumetric calorific value over the square root of the "
                    "relative density) of a gas, ISO 6976:2016; defaults gross 15/15 as analyses "
                    "are reported (GAS_FUEL_FLOW: net 25/0).",
        args=(_COMPONENTS, _AMOUNTS, _kind("gross"), _ref("15/15"), _P_METERING),
        returns="Wobbe index [MJ/m³]",
    ),
    CellFunction(
        name="GAS_DENSITY",
        target="cellfuncs.gas.iso6976:density",
        category=CATEGORY,
        description="Real-gas density of a gas at metering reference conditions, ISO 6976:2016.",
        args=(_COMPONENTS, _AMOUNTS, _T_METERING, _P_METERING),
        returns="density [kg/m³]",
    ),
    CellFunction(
        name="GAS_REL_DENSITY",
        target="cellfuncs.gas.iso6976:relative_density",
        category=CATEGORY,
        description="Real-gas relative density of a gas to dry air at metering reference "
                    "conditions, ISO 6976:2016.",
        args=(_COMPONENTS, _AMOUNTS, _T_METERING, _P_METERING),
        returns="relative density [-]",
    ),
    CellFunction(
        name="GAS_CV_UNCERTAINTY",
        target="cellfuncs.gas.uncertainty:cv_uncertainty",
        category=CATEGORY,
        description="Expanded uncertainty of GAS_CV on the same basis by ISO 6976:2016 Annex B: "
                    "composition uncertainties (uncorrelated) plus the component data's own.",
        args=(
            _COMPONENTS, _AMOUNTS_REQ,
            Arg("amount_uncertainties", "Standard uncertainties of the amounts, same shape and "
                "unit as amounts (blank = 0), uncorrelated", kind="amount_uncertainties"),
            _kind("gross"), _BASIS, _ref("15/15"),
            Arg("coverage", "Coverage factor k (2 for about 95 %), 1 to 5", unit="-", default=2.0),
        ),
        returns='expanded uncertainty: basis "volume" [MJ/m³], "mass" [MJ/kg], "molar" [kJ/mol]',
    ),
    CellFunction(
        name="GAS_AIR_REQUIREMENT",
        target="cellfuncs.gas.combustion:air_requirement",
        category=CATEGORY,
        description="Stoichiometric dry combustion air of a gas (complete combustion; dry air "
                    "O2 0.20946, N2 0.78084, Ar 0.00934, CO2 0.00036).",
        args=(_COMPONENTS, _AMOUNTS,
              Arg("basis", "Basis of the ratio, volume: m³ air per m³ gas (molar ratio); mass: kg "
                  "air per kg gas",
                  kind="option", default="volume", options=("volume", "mass"))),
        returns='stoichiometric air: "volume" [m³/m³], "mass" [kg/kg]',
    ),
    CellFunction(
        name="GAS_CO2_FACTOR",
        target="cellfuncs.gas.combustion:co2_factor",
        category=CATEGORY,
        description="CO2 emitted per fuel energy on complete combustion, the CO2 carried in the "
                    "fuel included (ISO 6976:2016 calorific values)." + _NOTE,
        args=(_COMPONENTS, _AMOUNTS, _kind("net"),
              Arg("t_combustion", "Combustion reference temperature: 0, 15, 20 or 25", unit="°C",
                  default=25.0)),
        returns="CO2 emission factor [kg/MWh]",
    ),
    CellFunction(
        name="GAS_FUEL_FLOW",
        target="cellfuncs.gas.combustion:fuel_flow",
        category=CATEGORY,
        description="Gas volume flow at metering reference conditions (1.01325 bar) for a fuel "
                    "power from the engine's datasheet; defaults net 25/0 as datasheets (GAS_CV, "
                    "GAS_WOBBE: gross 15/15)." + _NOTE,
        args=(_COMPONENTS, _AMOUNTS_REQ,
              Arg("fuel_power_kw", "Fuel power (heat input) on the chosen kind, 0 or more",
                  unit="kW"),
              _kind("net"), _ref("25/0")),
        returns="gas volume flow at metering conditions [m³/h]",
    ),
    CellFunction(
        name="GAS_FUEL_POWER",
        target="cellfuncs.gas.combustion:fuel_power",
        category=CATEGORY,
        description="Fuel power of a gas volume flow at metering reference conditions "
                    "(1.01325 bar); inverse of GAS_FUEL_FLOW; defaults net 25/0 as engine "
                    "datasheets (GAS_CV, GAS_WOBBE: gross 15/15)." + _NOTE,
        args=(_COMPONENTS, _AMOUNTS_REQ,
              Arg("fuel_flow_m3_h", "Gas volume flow at the metering reference conditions "
                  "(ref_conditions t2, 1.01325 bar), 0 or more", unit="m³/h"),
              _kind("net"), _ref("25/0")),
        returns="fuel power [kW]",
    ),
]
