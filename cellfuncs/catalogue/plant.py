"""Catalogue entries of the plant family: engine cooling loops at fixed duty, dry coolers,
the exhaust loss and the first-law check of a CHP plant's balance.

All results are estimates for tendering; engine data come from the engine's
declared datasheet; final design follows local codes and licensed engineers.
"""

from cellfuncs.catalogue.examples import AMOUNTS, NAMES
from cellfuncs.catalogue.recovery import (ARRANGEMENT_ALIASES, ARRANGEMENT_WORDS, CAT_HR, CAT_PLANT,
                                          GLYCOL_ALIASES, GLYCOL_WORDS)
from cellfuncs.catalogue.spec import Arg, CellFunction

_REC = "cellfuncs.recovery."
_DATASHEET = "from the engine's declared datasheet"


def _arrangement(default):
    return Arg("arrangement", "Flow arrangement of the exchanger", kind="option", default=default,
               options=ARRANGEMENT_WORDS, aliases=ARRANGEMENT_ALIASES)


def _glycol_pair(what):
    return (Arg("glycol_fraction", f"Glycol mass fraction of {what}, 0 for water, at most 0.6", "-",
                default=0.0),
            Arg("glycol", "Glycol (ignored when glycol_fraction is 0)", kind="option", default="ethylene",
                options=GLYCOL_WORDS, aliases=GLYCOL_ALIASES))


def _ambient():
    return (Arg("t_ambient", "Combustion-air temperature (its humidity adds water to the exhaust); default: ISO 3046-1 standard reference conditions: 25 °C, 30 % RH, 100 kPa",
                "°C", default=25.0),
            Arg("rh_ambient", "Relative humidity of the combustion air, 0 to 1; default: ISO 3046-1 standard reference conditions: 25 °C, 30 % RH, 100 kPa", "-", default=0.3),
            Arg("p_ambient_bar", "Ambient pressure; default: ISO 3046-1 standard reference conditions: 25 °C, 30 % RH, 100 kPa", "bar(a)", default=1.0))


ENTRIES = [
    CellFunction(
        name="HW_ENGINE_LOOP",
        target=_REC + "engine_loop:hw_engine_loop",
        category=CAT_HR,
        description="Engine cooling circuit at fixed duty, one exchanger (UA, epsilon-NTU) to the "
                    "client's water and a dump cooler holding the engine inlet at its limit: heat to "
                    "the client, dump heat, water out, engine out, or all (1x4).",
        args=(Arg("duty_kw", "Heat the engine rejects into the circuit " + _DATASHEET, "kW"),
              Arg("t_engine_in_max", "Maximum engine inlet temperature of the circuit " + _DATASHEET,
                  "°C"),
              Arg("engine_flow_m3_h", "Engine circuit volume flow, measured at t_engine_in_max", "m³/h"),
              Arg("t_water_in", "Client's water entering the exchanger", "°C"),
              Arg("water_flow_m3_h", "Client's water volume flow, measured at t_water_in", "m³/h"),
              Arg("ua_kw_k", "UA of the exchanger between the engine circuit and the client", "kW/K"),
              _arrangement("counter"),
              Arg("result", "Result wanted; all = 1x4 row to_client [kW], dump [kW], t_water_out "
                  "[°C], t_engine_out [°C]", kind="option", default="to_client",
                  options=("to_client", "dump", "t_water_out", "t_engine_out", "all"),
                  aliases={"client": "to_client", "dumpcooler": "dump"}),
              *_glycol_pair("the engine circuit (the client's side is water)")),
        returns='heat to the client or dump heat [kW], or t_water_out or t_engine_out [°C]; "all" a '
                "1x4 row",
        shape="row",
        example=(800.0, 82.0, 60.0, 70.0, 40.0, 40.0, "counter", "all", 0.0, "ethylene"),
    ),
    CellFunction(
        name="DRYCOOLER_UA",
        target=_REC + "drycooler:drycooler_ua",
        category=CAT_HR,
        description="UA a dry (air-cooled) cooler needs to reject a duty from the circuit's water, "
                    "between water in/out and air in/out: duty/(F·LMTD), crossflow by default. An "
                    "estimate for tendering.",
        args=(Arg("duty_kw", "Heat to reject", "kW"),
              Arg("t_water_in", "Circuit fluid entering the cooler", "°C"),
              Arg("t_water_out", "Circuit fluid leaving the cooler", "°C"),
              Arg("t_air_in", "Air entering the cooler: the site's design ambient", "°C"),
              Arg("t_air_out", "Air leaving the cooler", "°C"),
              _arrangement("cross"),
              *_glycol_pair("the circuit fluid (its temperatures must be liquid)")),
        returns="required UA [kW/K]",
        example=(103.0, 45.0, 40.0, 30.0, 38.0, "cross", 0.35, "ethylene"),
    ),
    CellFunction(
        name="DRYCOOLER_AIR_FLOW",
        target=_REC + "drycooler:drycooler_air_flow",
        category=CAT_HR,
        description="Ambient air volume flow (at the air inlet) a dry cooler needs to take up a duty "
                    "between the air inlet and outlet temperatures: humid air heated at constant "
                    "humidity, ideal-gas mixture. An estimate for tendering.",
        args=(Arg("duty_kw", "Heat the air takes up", "kW"),
              Arg("t_air_in", "Air entering the cooler: the site's design ambient", "°C"),
              Arg("t_air_out", "Air leaving the cooler", "°C"),
              Arg("rh_ambient", "Relative humidity of the ambient air, 0 to 1; default: ISO 3046-1 standard reference conditions: 25 °C, 30 % RH, 100 kPa", "-", default=0.3),
              Arg("p_ambient_bar", "Ambient pressure; default: ISO 3046-1 standard reference conditions: 25 °C, 30 % RH, 100 kPa", "bar(a)", default=1.0)),
        returns="air volume flow at the air inlet [m³/h]",
        example=(103.0, 30.0, 38.0, 0.4, 0.99),
    ),
    CellFunction(
        name="EXH_LOSS",
        target=_REC + "exhaust_loss:exhaust_loss",
        category=CAT_HR,
        description="Exhaust loss on a net-calorific-value balance: sensible heat the wet exhaust still "
                    "carries above t_reference (25 °C), water kept as vapour. EXH_LOSS(t1) - "
                    "EXH_LOSS(t2) = EXH_HEAT(t1 to t2).",
        args=(Arg("exhaust_flow_kg_h", "Wet exhaust mass flow " + _DATASHEET + " or from EXH_FLOW",
                  "kg/h"),
              Arg("t_stack", "Exhaust temperature leaving the plant (after the last exchanger)", "°C"),
              Arg("air_ratio", "Air ratio (excess air ratio) lambda of the engine, 1 to 20, "
                  + _DATASHEET, "-"),
              Arg("components", "Range of fuel-gas component names, or a two-column range of names "
                  "and amounts when amounts is omitted", kind="gas"),
              Arg("amounts", "Amounts in the same shape as components, in mol% (sum near 100) or "
                  "mole fractions (sum near 1); omit for a two-column components range",
                  kind="amounts", default=None),
              Arg("t_reference", "Reference temperature of the balance (combustion reference of the "
                  "net calorific value)", "°C", default=25.0),
              *_ambient()),
        returns="exhaust loss above t_reference [kW], sensible, water as vapour",
        example=(8500.0, 120.0, 1.8, NAMES, AMOUNTS, 25.0, 25.0, 0.3, 1.0),
    ),
    CellFunction(
        name="CHP_BALANCE_CHECK",
        target=_REC + "plant:chp_balance_check",
        category=CAT_PLANT,
        description="First-law check of a CHP plant on the net calorific value: OK when -0.5 % to 5 % "
                    "of the fuel is unaccounted, CHECK above 5 %, FIRST-LAW VIOLATION when outputs "
                    "exceed the fuel by over 0.5 %. Radiation + generator loss: typ. 2-5 % of the fuel.",
        args=(Arg("fuel_power_kw", "Fuel power input on the net calorific value", "kW"),
              Arg("electrical_kw", "Electrical output", "kW"),
              Arg("heat_flows_kw", "Every heat flow leaving the plant, recovered and dumped, any "
                  "range [kW]; blanks skipped", kind="numbers"),
              Arg("exhaust_loss_kw", "Exhaust loss above 25 °C, water as vapour (EXH_LOSS)", "kW"),
              Arg("other_losses_kw", "Losses counted apart, e.g. radiation (typically 1-3 % of the "
                  "fuel) and generator loss (2.5-4 % of the electrical output, about 1-1.7 % of "
                  "the fuel; common practice)", "kW", default=0.0)),
        returns="one line of text, at most 255 characters [text]",
        example=(3650.0, 1560.0, [[560.0, 190.0, 300.0, 120.0]], 820.0, 100.0),
    ),
]
