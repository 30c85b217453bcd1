"""Demo workbook ``hx_sizing.xlsx``: sizing and rating the heat exchangers of an invented plant.

Scenario (invented): the Fernwick Hollow district-heating plant, one gas-engine
set of about 1.2 MW electrical.  The engine's jacket-water circuit hands its
heat to the client's hot-water circuit through a plate heat exchanger; the
exhaust heat exchanger then lifts the client's water further.  The workbook
sizes both (duty, LMTD, F, UA, area at a given U with a fouling allowance)
and rates the chosen plate exchanger at part load.
"""

from __future__ import annotations

from cellfuncs.demo.book import DemoBook
from cellfuncs.heat_transfer.arrangements import ARRANGEMENTS

FILENAME = "hx_sizing.xlsx"
EXPECTED_ERRORS: set = set()
#: the plate exchanger's four temperatures, in the order HX_LMTD, HX_F, HX_UA and HX_AREA take them
PLATE_T = "plate_t_hot_in,plate_t_hot_out,plate_t_cold_in,plate_t_cold_out"
#: HX_RATE's arguments for the chosen plate exchanger at part load (before the result word)
RATE_ARGS = ("plate_t_hot_in,plate_t_cold_in,part_load_c_hot_kw_k,part_load_c_cold_kw_k,plate_ua_bought_kw_k,"
             "plate_arrangement")


def build(path: str) -> None:
    b = DemoBook("Heat-exchanger sizing — Fernwick Hollow district heating (invented)",
                 "Plate heat exchanger (engine jacket water → client hot water) and exhaust heat "
                 "exchanger: duty, LMTD, F, UA, area; part-load rating of the chosen plate exchanger.")
    b.input_heading("Plate heat exchanger: engine jacket water → client hot water")
    b.input("plate_duty_kw", "Jacket-water heat to transfer (engine datasheet)", 620, "kW",
            "from the engine's declared datasheet at 100 % load")
    b.input("plate_t_hot_in", "Jacket water from engine", 90, "°C")
    b.input("plate_t_hot_out", "Jacket water back to engine", 74, "°C")
    b.input("plate_t_cold_in", "Client hot water in (return)", 62, "°C")
    b.input("plate_t_cold_out", "Client hot water out", 82, "°C")
    b.input("plate_u_w_m2_k", "Clean overall heat-transfer coefficient U", 3800, "W/(m²·K)",
            "typical of gasketed plates with water on both sides; ask the supplier")
    b.input("plate_fouling_allowance", "Area allowance for fouling", 0.15, "-", "fraction of the clean area")
    b.input("plate_arrangement", "Flow arrangement", "counter", "", "drop-down", options=ARRANGEMENTS)
    b.input("part_load", "Part load to rate", 0.5, "-", "fraction of full heat and flows")
    b.input_heading("Exhaust heat exchanger: exhaust gas → client hot water")
    b.input("exhaust_flow_kg_h", "Exhaust mass flow (engine datasheet)", 6100, "kg/h")
    b.input("exhaust_cp_kj_kg_k", "Mean exhaust specific heat 450→120 °C", 1.12, "kJ/(kg·K)",
            "about 1.1 for lean natural-gas exhaust; cellfuncs' EXH_ functions compute it")
    b.input("t_exhaust_in", "Exhaust in", 455, "°C")
    b.input("t_exhaust_out", "Exhaust out (stack)", 120, "°C",
            "about 120 °C keeps natural-gas exhaust clear of condensation (common practice)")
    b.input("exhaust_u_w_m2_k", "Overall U, finned tubes, gas side", 65, "W/(m²·K)")
    b.input("exhaust_arrangement", "Flow arrangement", "cross-cmax-mixed", "", "drop-down", options=ARRANGEMENTS)

    c = b.sheet("Calc", "Calculation")
    c.heading("Plate heat exchanger at full load")
    c.calc("Hot-side capacity rate C_hot = duty / ΔT_hot", "=plate_duty_kw/(plate_t_hot_in-plate_t_hot_out)",
           "kW/K", name="plate_c_hot_kw_k")
    c.calc("Cold-side capacity rate C_cold = duty / ΔT_cold", "=plate_duty_kw/(plate_t_cold_out-plate_t_cold_in)",
           "kW/K", name="plate_c_cold_kw_k")
    c.calc("LMTD (counterflow)", f'=HX_LMTD({PLATE_T},"counter")', "K", name="plate_lmtd_k")
    c.calc("F factor for the arrangement", f'=IF(plate_arrangement="counter",1,HX_F({PLATE_T},plate_arrangement))',
           "-", name="plate_f_factor", fmt="0.0000")
    c.calc("Required UA", f"=HX_UA(plate_duty_kw,{PLATE_T},plate_arrangement)", "kW/K", name="plate_ua_kw_k")
    c.calc("Clean area", f"=HX_AREA(plate_duty_kw,plate_u_w_m2_k,{PLATE_T},plate_arrangement)", "m²",
           name="plate_area_clean_m2")
    c.calc("Area with fouling allowance (to buy)", "=plate_area_clean_m2*(1+plate_fouling_allowance)", "m²",
           name="out_plate_area_m2", result=True)
    c.calc("UA of the exchanger bought", "=out_plate_area_m2*plate_u_w_m2_k/1000", "kW/K",
           name="plate_ua_bought_kw_k")
    c.heading("Chosen plate exchanger rated at part load (flows × part load)")
    c.calc("Hot-side capacity rate", "=plate_c_hot_kw_k*part_load", "kW/K", name="part_load_c_hot_kw_k")
    c.calc("Cold-side capacity rate", "=plate_c_cold_kw_k*part_load", "kW/K", name="part_load_c_cold_kw_k")
    c.calc("Part-load duty", f'=HX_RATE({RATE_ARGS},"duty")', "kW", name="out_part_load_duty_kw", result=True)
    c.calc("Jacket water back to the engine at part load", f'=HX_RATE({RATE_ARGS},"t_hot_out")', "°C",
           name="part_load_t_hot_out")
    c.calc("Client water out at part load", f'=HX_RATE({RATE_ARGS},"t_cold_out")', "°C",
           name="out_part_load_t_cold_out", result=True)
    c.calc("Effectiveness at part load", f'=HX_RATE({RATE_ARGS},"effectiveness")', "-",
           name="part_load_effectiveness", fmt="0.000")
    c.heading("Exhaust heat exchanger")
    c.calc("Exhaust capacity rate", "=exhaust_flow_kg_h*exhaust_cp_kj_kg_k/3600", "kW/K", name="exhaust_c_hot_kw_k")
    c.calc("Exhaust heat to the stack temperature", "=exhaust_c_hot_kw_k*(t_exhaust_in-t_exhaust_out)", "kW",
           name="out_exhaust_duty_kw", result=True)
    c.calc("Client water into the exhaust exchanger", "=plate_t_cold_out", "°C", "after the plate exchanger",
           name="exhaust_t_cold_in")
    c.calc("Client water out of the exhaust exchanger", "=exhaust_t_cold_in+out_exhaust_duty_kw/plate_c_cold_kw_k",
           "°C", name="out_exhaust_t_cold_out", result=True)
    c.calc("Capacity-rate ratio Cmin/Cmax",
           "=MIN(exhaust_c_hot_kw_k,plate_c_cold_kw_k)/MAX(exhaust_c_hot_kw_k,plate_c_cold_kw_k)", "-",
           name="exhaust_c_ratio", fmt="0.000")
    c.calc("Effectiveness needed", "=(t_exhaust_in-t_exhaust_out)/(t_exhaust_in-exhaust_t_cold_in)", "-",
           name="exhaust_effectiveness", fmt="0.000")
    c.calc("NTU needed (ε-NTU)", "=HX_NTU(exhaust_effectiveness,exhaust_c_ratio,exhaust_arrangement)", "-",
           name="exhaust_ntu", fmt="0.000")
    c.calc("Required UA from NTU", "=exhaust_ntu*MIN(exhaust_c_hot_kw_k,plate_c_cold_kw_k)", "kW/K",
           name="exhaust_ua_kw_k")
    c.calc("Required UA from LMTD·F (check)", "=HX_UA(out_exhaust_duty_kw,t_exhaust_in,t_exhaust_out,"
           "exhaust_t_cold_in,out_exhaust_t_cold_out,exhaust_arrangement)", "kW/K", name="exhaust_ua_check_kw_k")
    c.calc("Gas-side area", "=exhaust_ua_kw_k*1000/exhaust_u_w_m2_k", "m²", name="out_exhaust_area_m2", result=True)

    r = b.sheet("Results", "Results — heat exchangers, Fernwick Hollow (invented)")
    r.calc("Plate heat exchanger area to buy (with fouling allowance)", "=out_plate_area_m2", "m²", result=True)
    r.calc("Plate exchanger duty at full load", "=plate_duty_kw", "kW")
    r.calc("LMTD at full load", "=plate_lmtd_k", "K")
    r.calc("Duty at part load", "=out_part_load_duty_kw", "kW", result=True)
    r.calc("Client water out at part load", "=out_part_load_t_cold_out", "°C", result=True)
    r.calc("Exhaust heat to the stack", "=out_exhaust_duty_kw", "kW", result=True)
    r.calc("Client water out of the exhaust exchanger", "=out_exhaust_t_cold_out", "°C", result=True)
    r.calc("Exhaust exchanger gas-side area", "=out_exhaust_area_m2", "m²", result=True)
    b.finish()
    b.save(path)


def summary(v: dict) -> list:
    def f(name, fmt="{:.1f}"):
        x = v.get(name)
        return fmt.format(x) if isinstance(x, float) else str(x)

    return [
        f"plate exchanger: {f('out_plate_area_m2')} m² to buy; at part load {f('out_part_load_duty_kw')} kW, "
        f"client water out {f('out_part_load_t_cold_out')} °C",
        f"exhaust exchanger: {f('out_exhaust_duty_kw')} kW to the stack temperature, water out "
        f"{f('out_exhaust_t_cold_out')} °C, gas-side area {f('out_exhaust_area_m2')} m²",
    ]
