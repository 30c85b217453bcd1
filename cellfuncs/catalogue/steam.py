"""Catalogue entries of the steam family: saturated steam raised from engine exhaust.

All results are estimates for tendering; engine data come from the engine's
declared datasheet; final design follows local codes and licensed engineers.
"""

from cellfuncs.catalogue.examples import AMOUNTS, NAMES
from cellfuncs.catalogue.spec import Arg, CellFunction

CAT_HR = "cellfuncs · heat recovery"

#: result words of EXH_STEAM (the same tuple as cellfuncs.recovery.steam.RESULTS)
STEAM_RESULTS = ("steam", "duty", "t_stack", "all")

ENTRIES = [
    CellFunction(
        name="EXH_STEAM",
        target="cellfuncs.recovery.steam:exhaust_steam",
        category=CAT_HR,
        description=("Saturated steam from a gas engine's exhaust: evaporator pinch, economiser to "
                     "saturation less an approach; no blowdown, no heat loss. Water and steam "
                     "IAPWS-IF97; \"all\" gives a 1x3 row (steam, duty, t_stack)."),
        args=(
            Arg("exhaust_flow_kg_h", "Wet exhaust mass flow from the engine's declared datasheet "
                "or from EXH_FLOW", "kg/h"),
            Arg("t_exhaust_in", "Exhaust temperature entering the evaporator", "°C"),
            Arg("air_ratio", "Air ratio (excess air ratio) lambda of the engine, 1 to 20, from the "
                "engine's declared datasheet", "-"),
            # amounts has no default in the signature (required arguments follow it, as in
            # EXH_COMPOSITION); it may still be left empty for a two-column components range
            Arg("components", "Range of fuel-gas component names (formula or common name, as in "
                "the GAS_ functions), or a two-column range of names and amounts", kind="gas"),
            Arg("amounts", "Amounts in the same shape as components, in mol% (sum near 100) or "
                "mole fractions (sum near 1); leave empty for a two-column components range",
                kind="amounts"),
            Arg("p_steam_bar", "Drum (steam) pressure, absolute, 1 to 160", "bar(a)"),
            Arg("t_feedwater", "Feedwater temperature entering the economiser, at most the "
                "saturation temperature less approach_k", "°C"),
            Arg("pinch_k", "Pinch: gas leaving the evaporator minus the saturation temperature, "
                "above 0", "K", default=10.0),
            Arg("result", "Result wanted; all = 1x3 row steam [kg/h], duty [kW], t_stack [°C]",
                kind="option", default="steam", options=STEAM_RESULTS),
            Arg("approach_k", "Approach: saturation temperature minus the water leaving the "
                "economiser, 0 or more", "K", default=0.0),
        ),
        returns=('steam [kg/h], duty (evaporator plus economiser) [kW] or t_stack [°C]; for "all" '
                 'a 1x3 row: steam [kg/h], duty [kW], t_stack [°C]. Combustion air at the ISO '
                 '3046-1 standard reference conditions; a stack below the water dew point is an '
                 'error'),
        shape="row",
        example=(10000.0, 450.0, 1.8, NAMES, AMOUNTS, 10.0, 105.0, 10.0, "all", 0.0),
    ),
]
