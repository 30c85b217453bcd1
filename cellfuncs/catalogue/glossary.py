"""The naming glossary of the cell functions: one name for one thing (issue 10).

This table is the one source: ``docs/glossary.md`` is generated from it
(``cellfuncs glossary`` is not a command; run ``python -m cellfuncs.docgen
--glossary > docs/glossary.md``) and ``tests/test_glossary.py`` checks every
argument of the catalogue against it: the name is listed here, its unit at the
cell boundary is the unit listed here, forbidden names are absent, option words
come from one vocabulary each.

Each entry is ``name: (group, unit, meaning)``:

group
    Where the argument goes in a NEW function (the order rule):
    1 what the function is computed on (duty, flows, temperatures, pressures,
    powers, datasheet figures), 2 the fluid or gas (air ratio, gas analysis,
    glycol), 3 site conditions (ambient), 4 options (kind, arrangement, result).
unit
    The unit of the value at the cell boundary, as the catalogue writes it
    (``"°C"``, ``"bar(a)"``, ``"kW"``, ...); ``"-"`` dimensionless; ``""`` for
    words, text and ranges whose unit is stated in the help.
meaning
    One sentence.
"""

from __future__ import annotations

__all__ = ["GLOSSARY", "GROUPS", "SUFFIX_UNITS", "FORBIDDEN", "GAS_QUALITY_FUNCTIONS",
           "AMBIENT_DEFAULTS", "ARRANGEMENT_DEFAULTS", "PREFIXES", "RULES"]

GROUPS = {1: "what it is computed on", 2: "the fluid or gas", 3: "site conditions", 4: "options"}

_T = "°C"
_P = "bar(a)"

GLOSSARY: dict = {
    # ---- temperatures t_<stream>_<end> [°C]
    "t_hot_in": (1, _T, "Hot stream temperature entering an exchanger."),
    "t_hot_out": (1, _T, "Hot stream temperature leaving an exchanger."),
    "t_cold_in": (1, _T, "Cold stream temperature entering an exchanger."),
    "t_cold_out": (1, _T, "Cold stream temperature leaving an exchanger."),
    "t_water": (1, _T, "Temperature of the circuit water (or water-glycol) where a property is taken."),
    "t_water_in": (1, _T, "Circuit (client) water temperature entering the exchanger or chain; a "
                   "water volume flow is measured here."),
    "t_water_out": (1, _T, "Circuit (client) water temperature leaving the exchanger or chain."),
    "t_source_in": (1, _T, "Hot-side (heat source) temperature entering a stage of a hot-water chain."),
    "t_source_out": (1, _T, "Hot-side (heat source) temperature leaving a stage of a hot-water chain."),
    "t_source_max": (1, _T, "Hottest hot-side temperature of a stage's heat source."),
    "t_engine_in_max": (1, _T, "Highest engine cooling-water inlet temperature the engine allows "
                        "(engine datasheet)."),
    "t_engine_out": (1, _T, "Engine cooling-water outlet temperature (engine datasheet)."),
    "t_air_in": (1, _T, "Charge air (or air-gas mixture) temperature at the compressor inlet."),
    "t_air_out": (1, _T, "Charge air (or air-gas mixture) temperature at the compressor outlet."),
    "t_mixture": (1, _T, "Air-gas mixture (charge) temperature after the charge-air cooler, in the "
                  "receiver."),
    "t_mixture_in": (1, _T, "Air-gas mixture temperature entering a charge-air cooler (stage)."),
    "t_mixture_out": (1, _T, "Air-gas mixture temperature leaving a charge-air cooler (stage)."),
    "t_mixture_ref": (1, _T, "Mixture temperature of the declared reference point (engine datasheet)."),
    "t_exhaust_in": (1, _T, "Exhaust temperature entering an exhaust heat exchanger."),
    "t_exhaust_out": (1, _T, "Exhaust temperature leaving an exhaust heat exchanger."),
    "t_stack": (1, _T, "Exhaust temperature at the stack, after the last heat recovery."),
    "t_feedwater": (1, _T, "Boiler feedwater temperature."),
    "t_reference": (1, _T, "A reference temperature named in the help (e.g. of a rating)."),
    "t_combustion": (4, _T, "Combustion reference temperature t1 of a calorific value: 0, 15, 20 or 25."),
    "t_ambient": (3, _T, "Ambient (combustion and charge) air temperature at the site."),
    # ---- pressures p_<place>_bar, absolute [bar(a)]
    "p_boost_bar": (1, _P, "Boost (receiver) pressure of the air-gas mixture, absolute."),
    "p_boost_ref_bar": (1, _P, "Boost pressure of the declared reference point (engine datasheet), "
                        "absolute."),
    "p_air_in_bar": (1, _P, "Pressure at the compressor inlet, absolute."),
    "p_air_out_bar": (1, _P, "Pressure at the compressor outlet, absolute."),
    "p_exhaust_bar": (1, _P, "Exhaust pressure, absolute."),
    "p_steam_bar": (1, _P, "Steam pressure, absolute."),
    "p_metering_bar": (4, _P, "Metering reference pressure of a gas volume, absolute."),
    "p_ambient_bar": (3, _P, "Ambient (barometric) pressure at the site, absolute."),
    "bmep_bar": (1, "bar", "Brake mean effective pressure (a mean pressure, not absolute)."),
    # ---- flows
    "water_flow_m3_h": (1, "m³/h", "Circuit water volume flow, measured at the water inlet "
                        "temperature."),
    "engine_flow_m3_h": (1, "m³/h", "Engine cooling-water volume flow (engine datasheet)."),
    "fuel_flow_m3_h": (1, "m³/h", "Fuel gas volume flow at the metering reference conditions."),
    "exhaust_flow_kg_h": (1, "kg/h", "Wet exhaust mass flow."),
    "mixture_flow_kg_h": (1, "kg/h", "Mass flow of the whole air-gas mixture (dry air, water vapour "
                          "and fuel gas)."),
    # ---- powers and duties
    "fuel_power_kw": (1, "kW", "Fuel power (heat input) on the calorific-value kind stated."),
    "electrical_kw": (1, "kW", "Electrical output."),
    "shaft_power_kw": (1, "kW", "Shaft (brake) power of the engine."),
    "duty_kw": (1, "kW", "Heat duty transferred."),
    "duties_kw": (1, "kW", "Duty of each stage of a chain, one row or column."),
    "heat_kw": (1, "kW", "Useful heat outputs, a range summed."),
    "heat_flows_kw": (1, "kW", "Every heat flow leaving the plant, recovered and dumped, a range "
                      "summed."),
    "exhaust_loss_kw": (1, "kW", "Heat lost with the exhaust above the reference temperature."),
    "other_losses_kw": (1, "kW", "Losses counted apart (radiation, auxiliaries)."),
    # ---- heat-transfer quantities
    "ua_kw_k": (1, "kW/K", "UA of an exchanger: overall coefficient times area."),
    "c_hot_kw_k": (1, "kW/K", "Capacity rate (mass flow times cp) of the hot stream."),
    "c_cold_kw_k": (1, "kW/K", "Capacity rate (mass flow times cp) of the cold stream."),
    "c_source_kw_k": (1, "kW/K", "Capacity rate of a chain stage's heat source."),
    "u_w_m2_k": (1, "W/(m²·K)", "Overall heat-transfer coefficient."),
    "ntu": (1, "-", "Number of transfer units UA/Cmin."),
    "c_ratio": (1, "-", "Capacity-rate ratio Cmin/Cmax, 0 to 1."),
    "effectiveness": (1, "-", "Exchanger effectiveness q/qmax, 0 to 1."),
    "min_approach_k": (1, "K", "Smallest allowed temperature difference between a source and the "
                       "water it heats."),
    "approach_k": (1, "K", "Temperature difference between two streams at one end."),
    "pinch_k": (1, "K", "Smallest temperature difference between two streams along an exchanger."),
    # ---- efficiencies and engine data (fractions 0-1)
    "electrical_efficiency": (1, "-", "Electrical efficiency as a fraction 0 to 1."),
    "thermal_efficiency": (1, "-", "Thermal (useful heat) efficiency as a fraction 0 to 1."),
    "isentropic_efficiency": (1, "-", "Isentropic efficiency of a compressor as a fraction 0 to 1."),
    "reference_electrical_efficiency": (1, "-", "Harmonised reference efficiency for separate "
                                        "electricity production (regulation), a fraction."),
    "reference_thermal_efficiency": (1, "-", "Harmonised reference efficiency for separate heat "
                                     "production (regulation), a fraction."),
    "ref_electrical_efficiency": (1, "-", "Older name of reference_electrical_efficiency (CHP_PES "
                                  "before issue 10)."),
    "ref_thermal_efficiency": (1, "-", "Older name of reference_thermal_efficiency (CHP_PES before "
                               "issue 10)."),
    "frequency_hz": (1, "Hz", "Grid frequency."),
    "pole_pairs": (1, "-", "Number of pole pairs of a generator, a whole number."),
    "speed_rpm": (1, "rpm", "Shaft speed."),
    "displacement_l": (1, "l", "Total swept volume of all cylinders."),
    "strokes": (4, "-", "Strokes per working cycle, 4 or 2."),
    "compression_ratio": (1, "-", "Compression ratio of the engine."),
    "compression_ratio_ref": (1, "-", "Compression ratio of the declared reference point "
                              "(engine datasheet)."),
    "methane_number": (2, "-", "Methane number of the site's gas."),
    "methane_number_ref": (1, "-", "Methane number of the declared reference point (engine "
                           "datasheet)."),
    "k_per_mn": (4, "K", "Allowed mixture temperature change per methane-number point."),
    "polytropic_exponent": (4, "-", "Polytropic exponent of the compression stroke."),
    "activation_temperature": (4, "K", "Ignition-delay activation temperature B (activation energy "
                               "over the gas constant)."),
    "delay_pressure_exponent": (4, "-", "Pressure exponent a of the ignition-delay correlation."),
    "stage_kinds": (1, "", 'Kind of each stage of a chain ("stream" or "loop"), one row or column.'),
    "engine_glycol_fraction": (2, "-", "Glycol mass fraction of the engine circuits, 0 for water."),
    "engine_glycol": (2, "", "Which glycol the engine circuits hold: ethylene or propylene."),
    "fuel": (4, "", "Fuel category of a regulation's reference values."),
    "construction_year": (4, "-", "Year the unit was built."),
    "heat_use": (4, "", "How the heat is used (hot water, steam, exhaust gas directly)."),
    "voltage_kv": (4, "kV", "Grid connection voltage."),
    "onsite_share": (4, "-", "Share of the electricity consumed on site, 0 to 1."),
    "altitude_m": (1, "m", "Site altitude above sea level (geopotential)."),
    "x": (1, "-", "Where a table is read on its row axis, in the unit of x_values."),
    "y": (1, "-", "Where a table is read on its column axis, in the unit of y_values."),
    "x_values": (1, "", "Row axis of a table, one column or row, monotonic."),
    "y_values": (1, "", "Tabulated values (1-D table) or the column axis (2-D table)."),
    "table": (1, "", "The tabulated grid of a 2-D table."),
    "so3_share": (4, "-", "Molar share of the fuel's sulphur leaving as SO3."),
    # ---- the fluid or gas
    "air_ratio": (2, "-", "Air ratio λ: dry combustion air over stoichiometric dry air."),
    "components": (2, "", "A gas analysis: a range of component names, or a two-column range of "
                   "names and amounts when amounts is left empty."),
    "amounts": (2, "", "Amounts of the components, same shape, in mol% (sum near 100) or mole "
                "fractions (sum near 1); normalised."),
    "amount_uncertainties": (2, "", "Standard uncertainties of the amounts, same shape and unit."),
    "glycol_fraction": (2, "-", "Glycol mass fraction of the circuit fluid, 0 for water."),
    "glycol": (2, "", "Which glycol: ethylene or propylene."),
    # ---- site conditions
    "rh_ambient": (3, "-", "Ambient relative humidity as a fraction 0 to 1."),
    # ---- options and words
    "kind": (4, "", "Calorific-value kind: gross (HHV) or net (LHV)."),
    "basis": (4, "", "Basis of a quantity: volume, mass or molar."),
    "moisture": (4, "", "Water included or removed: wet or dry."),
    "ref_conditions": (4, "", 'Reference conditions "t1/t2" in °C, combustion t1 / metering t2 '
                       '("15/15", "25/0"); where stated, a number is the metering temperature alone.'),
    "arrangement": (4, "", "Flow arrangement of an exchanger (the one list of words and aliases of "
                    "cellfuncs.heat_transfer.arrangements)."),
    "result": (4, "", 'Which result is returned ("all" = a 1×N row).'),
    "unit": (4, "", "Unit of the result."),
    "unit_given": (4, "", "Unit the value is given in."),
    "unit_wanted": (4, "", "Unit the value is wanted in."),
    "method": (4, "", "Calculation method."),
    "species": (4, "", "Exhaust species."),
    "coverage": (4, "-", "Coverage factor k of an expanded uncertainty."),
    "stage": (4, "", "Number of one stage (1 = first) for a per-cell result."),
    "index": (4, "", "Number of one item of a list (1 = first) for a per-cell result."),
    # ---- values
    "value": (1, "", "The value to convert."),
    "concentration": (1, "-", "Measured emission concentration on a dry basis, any unit."),
    "o2_measured_pct": (1, "vol-%", "O2 measured, vol-% dry (EXH_COMPOSITION times 100)."),
    "o2_reference_pct": (1, "vol-%", "Reference O2 of a limit value, vol-% dry."),
}

#: a name ending so has this unit (scalar arguments)
SUFFIX_UNITS = {"_kw": "kW", "_kg_h": "kg/h", "_m3_h": "m³/h", "_kw_k": "kW/K",
                "_w_m2_k": "W/(m²·K)", "_pct": "vol-%", "_k": "K", "_m": "m", "_rpm": "rpm",
                "_hz": "Hz", "_l": "l"}

#: names no argument may have, with the name to use
FORBIDDEN = {
    "t": "t_<stream>, e.g. t_water", "t_in": "t_<stream>_in", "t_out": "t_<stream>_out",
    "lambda_": "air_ratio", "lambda": "air_ratio", "output": "result (or unit)",
    "flow": "arrangement (a direction) or <what>_flow_<unit> (a flow)",
    "ref": "ref_conditions", "fractions": "amounts", "u_fractions": "amount_uncertainties",
    "eta_is": "isentropic_efficiency", "n_poly": "polytropic_exponent",
    "pressure_exp": "delay_pressure_exponent", "p_bar": "p_<place>_bar",
    "from_unit": "unit_given", "to_unit": "unit_wanted", "part": "result",
    "o2_measured": "o2_measured_pct", "o2_reference": "o2_reference_pct",
    "t_metering": "ref_conditions", "flow_m3h": "water_flow_m3_h or fuel_flow_m3_h",
    "u_w_m2k": "u_w_m2_k", "t_ref": "t_mixture_ref", "p_ref_bar": "p_boost_ref_bar",
    "mn_ref": "methane_number_ref",
}

#: functions that default to gross 15/15 (gas quality, as gas analyses are reported);
#: every other function with a ``kind`` defaults to net (engine side, as datasheets are)
GAS_QUALITY_FUNCTIONS = frozenset(("GAS_CV", "GAS_WOBBE", "GAS_CV_UNCERTAINTY"))

#: defaults of the ambient arguments (ISO 3046-1 standard reference conditions)
AMBIENT_DEFAULTS = {"t_ambient": 25.0, "rh_ambient": 0.3, "p_ambient_bar": 1.0}

#: arrangement defaults other than "counter", each with its reason (the defaults rule)
ARRANGEMENT_DEFAULTS = {
    "HX_F": ("1-2", "F is relative to counterflow (F = 1 there), so a counter default would "
             "always return 1; 1-2 is the commonest shell-and-tube exchanger"),
    "DRYCOOLER_UA": ("cross", "a dry cooler is a finned crossflow coil"),
}

#: function-name prefixes and the family (category) each belongs to
PREFIXES = {
    "UNIT_": ("general", "unit conversion"),
    "CELLFUNCS_": ("general", "about the package"),
    "HX_": ("heat transfer", "a heat exchanger of any service"),
    "GAS_": ("gas", "a property of the fuel gas from its analysis"),
    "CAC_": ("charge air", "charge air: the air-gas mixture from intake to receiver, cooler "
             "included (CAC_MIXTURE_FLOW is the mixture's flow, not the cooler's)"),
    "TURBO_": ("charge air", "the turbocharger compressor"),
    "KNOCK_": ("knock", "knock screening of the engine"),
    "HW_": ("heat recovery", "hot-water circuits and chains"),
    "EXH_": ("heat recovery", "the engine's exhaust (its emissions side: category emissions)"),
    "EMIS_": ("emissions", "emission values and their units"),
    "SITE_": ("site and datasheet", "the site's conditions"),
    "TABLE_": ("site and datasheet", "reading a datasheet table"),
    "DRYCOOLER_": ("heat recovery", "dry coolers (air-cooled heat rejection)"),
    "GEN_": ("engine", "the generator (GEN_ = generator, not general)"),
    "ENGINE_": ("engine", "the reciprocating engine"),
    "CHP_": ("plant balance", "the whole CHP plant"),
}

#: the rules, as written into docs/glossary.md
RULES = {
    "temperatures": "t_<stream>_<end> in °C: t_hot_in, t_water_out, t_source_in; never bare t, "
                    "t_in or t_out.",
    "pressures": "p_<place>_bar, absolute, in bar(a): p_boost_bar, p_exhaust_bar (bmep_bar is a "
                 "mean effective pressure, not absolute).",
    "units": "one suffix style: _kw, _kg_h, _m3_h, _kw_k, _w_m2_k, _pct (vol-%), _k (a temperature "
             "difference, or a temperature in kelvin), _m, _rpm, _hz, _l.",
    "ratios": "air_ratio for λ; efficiencies <what>_efficiency as a fraction 0 to 1.",
    "gas": "a gas analysis is components + amounts (+ amount_uncertainties); amounts may be left "
           "empty when components is a two-column range of names and amounts.",
    "words": "result chooses what is returned (\"all\" = a 1×N row); unit is the unit of a "
             "result; basis only volume/mass/molar; moisture wet/dry; kind gross/net; "
             "ref_conditions the \"t1/t2\" text; the suffix _ref only for a datasheet reference "
             "point; arrangement for the exchanger flow-arrangement words (one list, aliases "
             "included, e.g. counterflow, crossflow); unit_given/unit_wanted wherever a unit is "
             "converted.",
    "order": "arguments of a NEW function: what it is computed on (duty, flows, temperatures), "
             "then the fluid or gas (air_ratio, components, amounts), then site conditions "
             "(t_ambient, rh_ambient, p_ambient_bar), then options (kind, arrangement, result).",
    "positions": "existing functions keep their names and argument positions (workbooks call by "
                 "position); new optional arguments go at the end.",
    "per_cell": "every function returning several values has a per-cell form (a result word, a "
                "stage or an index), so no workbook needs an array formula.",
    "names": "function names DOMAIN_QUANTITY in capitals, with a prefix from the table of "
             "prefixes; a new family gets a new prefix and its own category "
             "\"cellfuncs · <family>\".",
    "defaults": "gas-quality functions (GAS_CV, GAS_WOBBE, GAS_CV_UNCERTAINTY) default to gross "
                "15/15, as gas analyses are reported; engine-side functions (fuel flow and power, "
                "exhaust, charge air, emissions, CO2 factor) to net, as engine datasheets are "
                "(fuel flow: net 25/0). The kind and reference conditions are spelled in every "
                "help and in the demos' unit cells, e.g. \"MJ/m³ (gross, 15/15)\". Ambient "
                "arguments default to t_ambient = 25 °C, rh_ambient = 0.3, p_ambient_bar = 1.0 "
                "(ISO 3046-1 standard reference conditions: 25 °C, 30 % RH, 100 kPa). "
                "Arrangement arguments default to \"counter\", except where the table of "
                "arrangement defaults below gives another word with its reason (HX_F: \"1-2\").",
    "limits": "no text result longer than 255 characters (Excel's limit).",
}
