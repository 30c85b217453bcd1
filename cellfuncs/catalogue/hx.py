"""Catalogue entries of the hx family (heat-exchanger sizing and rating)."""

from dataclasses import replace

from cellfuncs.catalogue.spec import Arg, CellFunction
from cellfuncs.heat_transfer.arrangements import ALIASES, ARRANGEMENTS, FLOWS, RATE_OUTPUTS

CATEGORY = "cellfuncs · heat transfer"
_PKG = "cellfuncs.heat_transfer"

_FLOW_ALIASES = {k: v for k, v in ALIASES.items() if v in FLOWS}
_ARR_HELP = ("Flow arrangement (n-m: n shell, m tube passes; cross: both unmixed; counterflow, "
             "crossflow accepted)")


def _t(name, what):
    return Arg(name, f"{what} temperature", "°C")


_STREAMS = (
    _t("t_hot_in", "Hot stream inlet"),
    _t("t_hot_out", "Hot stream outlet"),
    _t("t_cold_in", "Cold stream inlet"),
    _t("t_cold_out", "Cold stream outlet"),
)


def _arrangement(default, why=""):
    return Arg("arrangement", _ARR_HELP + why, kind="option", default=default,
               options=ARRANGEMENTS, aliases=ALIASES)


#: HX_F's default stays "1-2": F is relative to counterflow, so "counter" would always give 1
_F_DEFAULT_WHY = "; counter gives F = 1"


_CAUTION = " Estimate for tendering; final design per local codes and licensed engineers."

ENTRIES = [
    CellFunction(
        name="HX_LMTD",
        target=f"{_PKG}.lmtd:lmtd",
        category=CATEGORY,
        description=("Log-mean temperature difference of a counterflow or parallel-flow "
                     "heat exchanger from its four stream temperatures; a temperature "
                     "cross is an error."),
        args=_STREAMS + (
            Arg("arrangement", "Flow arrangement of the two streams, counter or parallel (aliases "
                "such as counterflow accepted; shell-and-tube and crossflow: HX_F)",
                kind="option", default="counter", options=FLOWS, aliases=_FLOW_ALIASES),
        ),
        returns="log-mean temperature difference [K]",
    ),
    CellFunction(
        name="HX_F",
        target=f"{_PKG}.correction:correction_factor",
        category=CATEGORY,
        description=("LMTD correction factor F relative to counterflow for shell-and-tube "
                     "(1-2 to 4-8) and crossflow arrangements; error when the "
                     "arrangement cannot reach the temperatures."),
        args=_STREAMS + (_arrangement("1-2", _F_DEFAULT_WHY),),
        returns="LMTD correction factor F [-]",
    ),
    CellFunction(
        name="HX_UA",
        target=f"{_PKG}.rating:ua_required",
        category=CATEGORY,
        description=("Required UA of a heat exchanger for a duty between four stream "
                     "temperatures: duty/(F·LMTD)." + _CAUTION),
        args=(Arg("duty_kw", "Heat duty transferred", "kW"),) + _STREAMS
        + (_arrangement("counter"),),
        returns="required UA [kW/K]",
    ),
    CellFunction(
        name="HX_AREA",
        target=f"{_PKG}.rating:area_required",
        category=CATEGORY,
        description=("Required heat-transfer area for a duty between four stream "
                     "temperatures at overall coefficient U: duty/(U·F·LMTD)." + _CAUTION),
        args=(
            Arg("duty_kw", "Heat duty transferred", "kW"),
            Arg("u_w_m2_k", "Overall heat-transfer coefficient referred to the area sought",
                "W/(m²·K)"),
        ) + _STREAMS + (_arrangement("counter"),),
        returns="required area [m²]",
    ),
    CellFunction(
        name="HX_EFFECTIVENESS",
        target=f"{_PKG}.effectiveness:epsilon",
        category=CATEGORY,
        description=("Heat-exchanger effectiveness from NTU = UA/Cmin and the capacity-rate "
                     "ratio Cmin/Cmax, for counter, parallel, shell-and-tube and crossflow "
                     "arrangements."),
        args=(
            Arg("ntu", "Number of transfer units UA/Cmin, 0 or more", "-"),
            Arg("c_ratio", "Capacity-rate ratio Cmin/Cmax, 0 to 1 (0 for a condensing or "
                "boiling stream)", "-"),
            _arrangement("counter"),
        ),
        returns="effectiveness ε [-]",
    ),
    CellFunction(
        name="HX_NTU",
        target=f"{_PKG}.effectiveness:transfer_units",
        category=CATEGORY,
        description=("Number of transfer units NTU = UA/Cmin needed for an effectiveness at "
                     "a capacity-rate ratio; error beyond the arrangement's maximum "
                     "effectiveness."),
        args=(
            Arg("effectiveness", "Required effectiveness q/qmax, 0 to below 1", "-"),
            Arg("c_ratio", "Capacity-rate ratio Cmin/Cmax, 0 to 1 (0 for a condensing or "
                "boiling stream)", "-"),
            _arrangement("counter"),
        ),
        returns="number of transfer units NTU [-]",
    ),
    CellFunction(
        name="HX_RATE",
        target=f"{_PKG}.rating:rate_exchanger",
        category=CATEGORY,
        description=("Rating of a given exchanger by ε-NTU: duty, hot or cold outlet "
                     "temperature or effectiveness from inlet temperatures, capacity rates "
                     "and UA; \"all\" gives a 1x3 row (duty, t_hot_out, t_cold_out)."),
        args=(
            Arg("t_hot_in", "Hot stream inlet temperature", "°C"),
            Arg("t_cold_in", "Cold stream inlet temperature", "°C"),
            Arg("c_hot_kw_k", "Hot stream capacity rate, mass flow times cp", "kW/K"),
            Arg("c_cold_kw_k", "Cold stream capacity rate, mass flow times cp", "kW/K"),
            Arg("ua_kw_k", "UA of the exchanger", "kW/K"),
            _arrangement("counter"),
            Arg("result", "Result wanted; all = 1x3 row duty [kW], t_hot_out [°C], "
                "t_cold_out [°C]", kind="option", default="duty",
                options=RATE_OUTPUTS),
        ),
        returns=('duty [kW], t_hot_out or t_cold_out [°C], effectiveness [-], or for '
                 '"all" a 1x3 row: duty [kW], t_hot_out [°C], t_cold_out [°C]'),
        shape="row",
    ),
]

#: one valid call per function, as a cell would pass the arguments (for the
#: ``example`` field of CellFunction where the catalogue has it)
EXAMPLES = {
    "HX_LMTD": (100.0, 60.0, 30.0, 40.2, "counter"),
    "HX_F": (130.0, 110.0, 15.0, 85.0, "1-2"),
    "HX_UA": (500.0, 90.0, 70.0, 60.0, 80.0, "counter"),
    "HX_AREA": (500.0, 3000.0, 90.0, 70.0, 60.0, 80.0, "counter"),
    "HX_EFFECTIVENESS": (2.0, 0.5, "cross"),
    "HX_NTU": (0.7, 0.5, "1-2"),
    "HX_RATE": (90.0, 60.0, 25.0, 20.0, 40.0, "counter", "all"),
}

ENTRIES = [replace(e, example=EXAMPLES[e.name]) for e in ENTRIES]
