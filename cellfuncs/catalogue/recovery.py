"""Catalogue entries of the recovery family: hot-water circuits, exhaust heat,
genset and engine basics, plant balance.

All results are estimates for tendering; engine data come from the engine's
declared datasheet; final design follows local codes and licensed engineers.
"""

from cellfuncs.catalogue.gas import KIND_ALIASES
from cellfuncs.catalogue.spec import REQUIRED, Arg, CellFunction
from cellfuncs.heat_transfer.arrangements import ALIASES as _HX_ALIASES
from cellfuncs.heat_transfer.arrangements import ARRANGEMENTS as _HX_WORDS

CAT_HR = "cellfuncs · heat recovery"
CAT_ENG = "cellfuncs · engine"
CAT_PLANT = "cellfuncs · plant balance"

_REC = "cellfuncs.recovery."

PES_FUELS = ("natural-gas", "biogas", "refinery-gas", "waste-gas", "oil", "bio-liquid")
PES_HEAT_USES = ("hot-water", "steam", "exhaust")
PES_FUEL_ALIASES = {"naturalgas": "natural-gas", "lng": "natural-gas", "lpg": "natural-gas",
                    "biomethane": "natural-gas", "hydrogen": "refinery-gas", "syngas": "refinery-gas",
                    "synthesisgas": "refinery-gas", "diesel": "oil", "heavyfueloil": "oil",
                    "bioliquid": "bio-liquid", "landfillgas": "biogas", "sewagegas": "biogas"}
_ENG = "cellfuncs.engine."

GLYCOL_WORDS = ("ethylene", "propylene")
GLYCOL_ALIASES = {"eg": "ethylene", "meg": "ethylene", "ethyleneglycol": "ethylene",
                  "pg": "propylene", "mpg": "propylene", "propyleneglycol": "propylene"}
#: the one list of arrangement words and aliases (cellfuncs.heat_transfer.arrangements)
ARRANGEMENT_WORDS = _HX_WORDS
ARRANGEMENT_ALIASES = dict(_HX_ALIASES)

_PROPS = ("Water: IAPWS-IF97 at 3 bar(a) (liquid 0 to 133.52 °C); water-glycol: Melinder (2010) "
          "property fits for ethylene or propylene glycol, mass fraction 0-0.6, freezing point "
          "to 100 °C")


def _glycol_fraction():
    return Arg("glycol_fraction", "Glycol mass fraction of the circuit fluid, 0 for water, "
               "at most 0.6", "-", default=0.0)


def _glycol():
    return Arg("glycol", "Glycol in the circuit fluid (ignored when glycol_fraction is 0)",
               kind="option", default="ethylene", options=GLYCOL_WORDS, aliases=GLYCOL_ALIASES)


def _t(name, what):
    return Arg(name, what, "°C")


def _flow(name="flow_m3h", what="Hot-water volume flow, measured at the water's inlet temperature"):
    return Arg(name, what, "m³/h")


_CHAIN_FLOW = ("Client's circuit volume flow, measured at the water's inlet temperature "
               "t_water_in (the return)")

HOT_WATER = [
    CellFunction(
        name="HW_CP",
        target=_REC + "water:hw_cp",
        category=CAT_HR,
        description="Specific heat capacity of hot water or water-glycol at 3 bar(a). " + _PROPS + ".",
        args=(_t("t_water", "Temperature of the circuit fluid (water or water-glycol)"),
              _glycol_fraction(), _glycol()),
        returns="specific heat capacity cp [kJ/(kg·K)]",
    ),
    CellFunction(
        name="HW_DENSITY",
        target=_REC + "water:hw_density",
        category=CAT_HR,
        description="Density of hot water or water-glycol at 3 bar(a). " + _PROPS + ".",
        args=(_t("t_water", "Temperature of the circuit fluid (water or water-glycol)"),
              _glycol_fraction(), _glycol()),
        returns="density [kg/m³]",
    ),
    CellFunction(
        name="HW_FLOW",
        target=_REC + "water:hw_flow",
        category=CAT_HR,
        description="Hot-water volume flow (measured at t_water_in) that carries duty_kw between "
                    "t_water_in and t_water_out, from the enthalpy rise at 3 bar(a). An estimate "
                    "for tendering.",
        args=(Arg("duty_kw", "Heat added to the water (negative if it is cooled)", "kW"),
              _t("t_water_in", "Water inlet temperature; the flow is measured here"),
              _t("t_water_out", "Water outlet temperature"),
              _glycol_fraction(), _glycol()),
        returns="volume flow at t_water_in [m³/h]",
    ),
    CellFunction(
        name="HW_DUTY",
        target=_REC + "water:hw_duty",
        category=CAT_HR,
        description="Duty of a hot-water flow (volume measured at t_water_in) heated from "
                    "t_water_in to t_water_out, from the enthalpy rise at 3 bar(a). An estimate "
                    "for tendering.",
        args=(_flow("water_flow_m3_h"),
              _t("t_water_in", "Water inlet temperature; the flow is measured here"),
              _t("t_water_out", "Water outlet temperature"), _glycol_fraction(), _glycol()),
        returns="duty [kW], negative when the water is cooled",
    ),
    CellFunction(
        name="HW_CHAIN",
        target=_REC + "chain_results:hw_chain",
        category=CAT_HR,
        description="Water temperature after each heat exchanger of a hot-water chain when the "
                    "listed duties are added in the listed order (array formula), or after stage "
                    "k. Boiling at 3 bar(a) (133.52 °C) is an error naming the stage.",
        args=(_t("t_water_in", "Client's water entering the first exchanger (the return)"),
              _flow("water_flow_m3_h", _CHAIN_FLOW),
              Arg("duties_kw", "Duty of each exchanger in water-flow order, one row or column "
                  "[kW]; a blank cell is a stage with no duty", kind="stages"),
              _glycol_fraction(), _glycol(),
              Arg("stage", "Return only the temperature after this stage (1 = first); blank "
                  "returns every stage", kind="integer", default=None)),
        returns="water temperature after each stage, laid out like duties_kw [°C]",
        shape="array",
        example=(60.0, 50.0, [[200.0, 300.0, 400.0]], 0.0, "ethylene", 2),
    ),
    CellFunction(
        name="HW_CHAIN_RATE",
        target=_REC + "chain_results:hw_chain_rate",
        category=CAT_HR,
        description="Rates a hot-water chain in water-flow order by epsilon-NTU: rated streams "
                    "(source inlet, capacity rate, UA) and engine loops at fixed duty with a dump "
                    "cooler (stage_kinds). Per stage, one stage, or a chain total.",
        args=(_t("t_water_in", "Client's water entering the first exchanger (the return)"),
              _flow("water_flow_m3_h", _CHAIN_FLOW),
              Arg("t_source_in", "Source (hot-side) inlet temperature of each stage, one row or column "
                  "[°C]; ignored for loop stages", kind="stages"),
              Arg("c_source_kw_k", "Source capacity rate (mass flow times cp) of each stage [kW/K]; "
                  "ignored for loop stages", kind="stages"),
              Arg("ua_kw_k", "UA of each stage, one row or column [kW/K]; blank or 0 = no exchange",
                  kind="stages"),
              Arg("arrangement", "Flow arrangement of every stage", kind="option",
                  default="counter", options=ARRANGEMENT_WORDS, aliases=ARRANGEMENT_ALIASES),
              Arg("result", "Per stage: water out, duty to the water, source out, dump, water in, "
                  "source in; or a chain total", kind="option",
                  default="t_out", options=("t_out", "duty", "t_hot_out", "dump", "t_in", "t_hot_in",
                                            "total_duty", "total_dump"),
                  aliases={"tout": "t_out", "thotout": "t_hot_out", "q": "duty",
                           "twaterout": "t_out", "tsourceout": "t_hot_out", "twaterin": "t_in",
                           "tsourcein": "t_hot_in"}),
              _glycol_fraction(), _glycol(),
              Arg("stage_kinds", 'Kind of each stage, "stream" (rated stream) or "loop" (engine '
                  "circuit at fixed duty with a dump cooler); blank = stream", kind="words",
                  default=None),
              Arg("duties_kw", "Duty the engine rejects into each loop stage [kW]; blank for streams",
                  kind="stages", default=None),
              Arg("t_engine_in_max", "Maximum engine inlet temperature of each loop, one cell per stage "
                  "or one for all [°C]", kind="stages", default=None),
              Arg("engine_flow_m3_h", "Engine circuit flow of each loop, measured at t_engine_in_max, "
                  "one per stage or one for all [m³/h]", kind="stages", default=None),
              Arg("stage", "Return only this stage's value (1 = first); blank returns every stage",
                  kind="integer", default=None),
              Arg("engine_glycol_fraction", "Glycol mass fraction of the engine circuits, 0 for water",
                  "-", default=0.0),
              Arg("engine_glycol", "Glycol of the engine circuits", kind="option", default="ethylene",
                  options=GLYCOL_WORDS, aliases=GLYCOL_ALIASES)),
        returns="per stage: water or source temperature [°C], duty or dump [kW], laid out like "
                "t_source_in; one stage's value, or a chain total [kW]",
        shape="array",
        example=(60.0, 40.0, [[None, 445.0]], [[None, 5.0]], [[40.0, 10.0]], "counter", "dump", 0.0,
                 "ethylene", [["loop", "stream"]], [[800.0, None]], [[82.0]], [[60.0]], 1),
    ),
    CellFunction(
        name="HW_CHAIN_CHECK",
        target=_REC + "chain_results:hw_chain_check",
        category=CAT_HR,
        description='"OK", or one line naming the first stage of a hot-water chain where the water '
                    "leaves above its source inlet minus the approach (hot end), the source leaves "
                    "below the water entering plus the approach (cold end), or water boils.",
        args=(_t("t_water_in", "Client's water entering the first exchanger (the return)"),
              _flow("water_flow_m3_h", _CHAIN_FLOW),
              Arg("duties_kw", "Duty of each exchanger in water-flow order, one row or column "
                  "[kW]; a blank cell is a stage with no duty", kind="stages"),
              Arg("t_source_in", "Hot end: each source's inlet (hottest) temperature, for an engine "
                  "loop its engine outlet; one cell per stage or one for all [°C]", kind="stages"),
              Arg("min_approach_k", "Smallest allowed temperature difference at either end of a "
                  "stage", "K", default=5.0),
              _glycol_fraction(), _glycol(),
              Arg("t_source_out", "Cold end: each source's outlet (coldest) temperature, for an "
                  "engine loop t_engine_in_max; blank = not checked [°C]", kind="stages",
                  default=None)),
        returns="\"OK\" or a one-line finding [text]",
        example=(60.0, 50.0, [[200.0, 300.0, 400.0]], [[92.0, 95.0, 450.0]], 5.0, 0.0, "ethylene",
                 [[82.0, 70.0, 120.0]]),
    ),
]

_DATASHEET = "from the engine's declared datasheet"

ENGINE = [
    CellFunction(
        name="GEN_SPEED",
        target=_ENG + "genset:gen_speed",
        category=CAT_ENG,
        description="Synchronous speed of a generator (GEN_ = generator): 60 times the grid "
                    "frequency divided by the number of pole pairs (2 pole pairs: 1,500 rpm at "
                    "50 Hz, 1,800 rpm at 60 Hz).",
        args=(Arg("frequency_hz", "Grid frequency", "Hz"),
              Arg("pole_pairs", "Number of pole pairs of the generator, a whole number", "-",
                  kind="integer")),
        returns="synchronous speed [rpm]",
    ),
    CellFunction(
        name="GEN_POLE_PAIRS",
        target=_ENG + "genset:gen_pole_pairs",
        category=CAT_ENG,
        description="Pole pairs of a synchronous generator (GEN_ = generator) from grid frequency "
                    "and speed; an error when the speed is more than 0.5 % away from a synchronous "
                    "speed.",
        args=(Arg("frequency_hz", "Grid frequency", "Hz"),
              Arg("speed_rpm", "Generator shaft speed " + _DATASHEET, "rpm")),
        returns="pole pairs [-]",
    ),
    CellFunction(
        name="ENGINE_BMEP",
        target=_ENG + "bmep:engine_bmep",
        category=CAT_ENG,
        description="Brake mean effective pressure of a reciprocating engine from shaft power, total "
                    "displacement and speed; a four-stroke engine fires each cylinder once per two "
                    "crankshaft turns (BMEP = 1200·P/(V·n)).",
        args=(Arg("shaft_power_kw", "Shaft (brake) power " + _DATASHEET, "kW"),
              Arg("displacement_l", "Total swept volume of all cylinders", "l"),
              Arg("speed_rpm", "Crankshaft speed", "rpm"),
              Arg("strokes", "Strokes per working cycle, 4 or 2", "-", kind="integer", default=4)),
        returns="brake mean effective pressure [bar]",
    ),
    CellFunction(
        name="ENGINE_POWER",
        target=_ENG + "bmep:engine_power",
        category=CAT_ENG,
        description="Shaft power of a reciprocating engine from brake mean effective pressure, total "
                    "displacement and speed (inverse of ENGINE_BMEP).",
        args=(Arg("bmep_bar", "Brake mean effective pressure", "bar"),
              Arg("displacement_l", "Total swept volume of all cylinders", "l"),
              Arg("speed_rpm", "Crankshaft speed", "rpm"),
              Arg("strokes", "Strokes per working cycle, 4 or 2", "-", kind="integer", default=4)),
        returns="shaft power [kW]",
    ),
]

PLANT = [
    CellFunction(
        name="CHP_HEAT_RATE",
        target=_REC + "plant:chp_heat_rate",
        category=CAT_PLANT,
        description="Heat rate of a generating set: fuel energy per kWh of electricity, 3600 divided "
                    "by the electrical efficiency, on that efficiency's calorific-value basis.",
        args=(Arg("electrical_efficiency", "Electrical efficiency, a fraction " + _DATASHEET, "-"),),
        returns="heat rate [kJ/kWh]",
    ),
    CellFunction(
        name="CHP_PES",
        target=_REC + "plant:chp_pes",
        category=CAT_PLANT,
        description="Primary energy savings of cogeneration, 1 - 1/(η_th/ref_th + η_el/ref_el), "
                    "Directive 2012/27/EU Annex II; references given, or by fuel and year from Delegated "
                    "Regulation (EU) 2015/2402 Annexes I-II, grid-loss factor of Annex IV.",
        args=(Arg("electrical_efficiency", "CHP electrical efficiency, electricity over fuel input "
                  "on net calorific value", "-"),
              Arg("thermal_efficiency", "CHP heat efficiency, useful heat over fuel input on net "
                  "calorific value", "-"),
              Arg("reference_electrical_efficiency", "Reference efficiency for separate electricity "
                  "production; blank when fuel is given", "-", default=None),
              Arg("reference_thermal_efficiency", "Reference efficiency for separate heat "
                  "production; blank when fuel is given", "-", default=None),
              Arg("fuel", "Take both references from Delegated Regulation (EU) 2015/2402 Annexes I and "
                  "II for this fuel (figures from memory: check them)", kind="option", default=None,
                  options=PES_FUELS, aliases=PES_FUEL_ALIASES),
              Arg("construction_year", "Year the unit was built (Annex I), 1900 to 2023; later units "
                  "fall under Delegated Regulation (EU) 2023/2104", "-", default=None),
              Arg("heat_use", "Annex II column: hot water, steam or direct use of exhaust gases",
                  kind="option", default="hot-water", options=PES_HEAT_USES,
                  aliases={"water": "hot-water", "exhaustgas": "exhaust", "directexhaust": "exhaust"}),
              Arg("voltage_kv", "Grid connection voltage; when given the electrical reference is "
                  "corrected for avoided grid losses (Annex IV)", "kV", default=None),
              Arg("onsite_share", "Share of the electricity consumed on site, 0 to 1 (Annex IV)", "-",
                  default=0.0)),
        returns="primary energy savings [-] (high-efficiency cogeneration: >= 0.10)",
        example=(0.42, 0.45, None, None, "natural-gas", 2020, "hot-water", 10.0, 0.2),
    ),
    CellFunction(
        name="CHP_BALANCE",
        target=_REC + "plant:chp_balance",
        category=CAT_PLANT,
        description="Energy balance of a CHP plant as fractions of the fuel power: total, electrical, "
                    "thermal (the heat range summed, blanks skipped) or unaccounted losses. An "
                    "estimate for tendering.",
        args=(Arg("fuel_power_kw", "Fuel power input (state its calorific-value basis)", "kW"),
              Arg("electrical_kw", "Electrical output", "kW"),
              Arg("heat_kw", "Useful heat outputs, any range, summed; blank cells are skipped [kW]",
                  kind="numbers"),
              Arg("result", "Which fraction", kind="option", default="total",
                  options=("total", "electrical", "thermal", "unaccounted"),
                  aliases={"losses": "unaccounted", "heat": "thermal", "power": "electrical"})),
        returns="fraction of the fuel power [-]",
        example=(3650.0, 1560.0, [[560.0, 190.0, 820.0]], "unaccounted"),
    ),
]

_COMPONENTS = Arg(
    "components",
    "Range of fuel-gas component names (formula or common name, as in the GAS_ functions), or a "
    "two-column range of names and amounts with amounts left empty", kind="gas")
_AMOUNTS = Arg(
    "amounts",
    "Amounts in the same shape as components, in mol% (sum near 100) or mole fractions (sum near "
    "1); leave empty for a two-column components range", kind="amounts", default=None)
_AMOUNTS_REQ = Arg(_AMOUNTS.name, _AMOUNTS.help, kind="amounts")  # a required argument follows
_AIR_RATIO = Arg("air_ratio", "Air ratio λ (excess air ratio) of the engine, 1 to 20 (complete "
                 "combustion needs at least 1), from the engine's declared datasheet", "-")
_ISO = "ISO 3046-1 standard reference conditions: 25 °C, 30 % RH, 100 kPa"


def _ambient():
    return (Arg("t_ambient", "Combustion-air temperature (its humidity adds water to the exhaust), "
                f"-50 to 60 ({_ISO})", "°C", default=25.0),
            Arg("rh_ambient", f"Relative humidity of the combustion air, 0 to 1 ({_ISO})", "-",
                default=0.3),
            Arg("p_ambient_bar", f"Ambient pressure, 0.5 to 1.2 ({_ISO})", "bar(a)", default=1.0))


_EXH_NOTE = " An estimate for tendering."

EXHAUST = [
    CellFunction(
        name="EXH_FLOW",
        target=_REC + "exhaust:exhaust_flow",
        category=CAT_HR,
        description="Wet exhaust mass flow of a gas engine: fuel + air ratio times the "
                    "stoichiometric dry air + the air's water vapour, complete combustion."
                    + _EXH_NOTE,
        args=(Arg("fuel_power_kw", "Fuel power input " + _DATASHEET + ", on the kind of calorific "
                  "value given (at 25 °C combustion reference)", "kW"),
              _AIR_RATIO, _COMPONENTS, _AMOUNTS,
              Arg("kind", "Calorific value the fuel power refers to, net (LHV, inferior) or "
                  "gross (HHV, superior), at 25 °C combustion; engine-side functions default to "
                  "net, as engine datasheets are", kind="option", default="net", options=("gross", "net"),
                  aliases=KIND_ALIASES),
              *_ambient()),
        returns="wet exhaust mass flow [kg/h]",
    ),
    CellFunction(
        name="EXH_COMPOSITION",
        target=_REC + "exhaust:exhaust_composition",
        category=CAT_HR,
        description="Mole fraction of CO2, H2O, O2, N2, Ar or SO2 in a gas engine's exhaust (complete "
                    "combustion, H2S to SO2, excess O2, the humid air's water and argon), wet or "
                    "dry; a fraction 0-1 (times 100 for vol-%, as EXH_O2_CORRECT wants).",
        args=(_AIR_RATIO, _COMPONENTS, _AMOUNTS_REQ,
              Arg("species", "Exhaust species", kind="option", default=REQUIRED,
                  options=("co2", "h2o", "o2", "n2", "ar", "so2"),
                  aliases={"carbondioxide": "co2", "water": "h2o", "oxygen": "o2",
                           "nitrogen": "n2", "argon": "ar", "sulfurdioxide": "so2"}),
              Arg("moisture", "Wet exhaust, or dry (water removed; h2o is then 0)", kind="option",
                  default="wet", options=("wet", "dry")),
              *_ambient()),
        returns="mole (volume) fraction [-]",
    ),
    CellFunction(
        name="EXH_HEAT",
        target=_REC + "exhaust:exhaust_heat",
        category=CAT_HR,
        description="Sensible heat a gas engine's exhaust gives up between t_exhaust_in and "
                    "t_exhaust_out (ideal-gas mixture, GRI-Mech 3.0 NASA-7 data); an outlet below "
                    "the water dew point is an error. About 120 °C is the usual stack limit.",
        args=(Arg("exhaust_flow_kg_h", "Wet exhaust mass flow " + _DATASHEET + " or from EXH_FLOW",
                  "kg/h"),
              _t("t_exhaust_in", "Exhaust temperature entering the exchanger"),
              _t("t_exhaust_out", "Exhaust (stack) temperature leaving the exchanger; about 120 °C is the "
                 "usual design limit for natural gas to stay clear of water and acid condensation "
                 "(common practice), and below the water dew point (at 1.01325 bar(a)) is an error"),
              _AIR_RATIO, _COMPONENTS, _AMOUNTS, *_ambient()),
        returns="heat given up by the exhaust [kW], sensible only",
    ),
    CellFunction(
        name="EXH_DEWPOINT",
        target=_REC + "exhaust:exhaust_dewpoint",
        category=CAT_HR,
        description="Water dew point of a gas engine's exhaust at a pressure: saturation temperature "
                    "of water (IAPWS-IF97) at its partial pressure. The acid dew point of sulfur-"
                    "bearing gas is higher and not computed.",
        args=(_AIR_RATIO, _COMPONENTS, _AMOUNTS,
              Arg("p_exhaust_bar", "Exhaust pressure", "bar(a)", default=1.01325), *_ambient()),
        returns="water dew point [°C]",
    ),
    CellFunction(
        name="EXH_O2_CORRECT",
        target=_REC + "exhaust:o2_correct",
        category="cellfuncs · emissions",
        description="An emission concentration referred to a reference O2 content: c·(20.9 − "
                    "O2_ref)/(20.9 − O2_meas), O2 in vol-% dry (common practice in emission permits; "
                    "some use 21: check the permit). From EXH_COMPOSITION(...,\"o2\",\"dry\"): "
                    "times 100.",
        args=(Arg("concentration", "Measured concentration on a dry basis, any unit (e.g. mg/m³)",
                  "-"),
              Arg("o2_measured_pct", "O2 measured, vol-% dry, below 20.9 (EXH_COMPOSITION gives a "
                  "fraction: =100*EXH_COMPOSITION(air_ratio,components,amounts,\"o2\",\"dry\"))",
                  "vol-%"),
              Arg("o2_reference_pct", "Reference O2 of the limit value, vol-% dry (e.g. 5 or 15)",
                  "vol-%")),
        returns="concentration at the reference O2 [unit of concentration]",
    ),
]

ENTRIES: list = HOT_WATER + EXHAUST + ENGINE + PLANT
