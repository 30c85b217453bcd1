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


def build(path: str) -> None:
    b = DemoBook("Heat-exchanger sizing — Fernwick Hollow district heating (invented)",
                 "Plate heat exchanger (engine jacket water → client hot water) and exhaust heat "
                 "exchanger: duty, LMTD, F, UA, area; part-load rating of the chosen plate exchanger.")
    b.input_heading("Plate heat exchanger: engine jacket water → client hot water")
    b.input("phx_duty", "Jacket-water heat to transfer (engine datasheet)", 620, "kW",
            "from the engine's declared datasheet at 100 % load")
    b.input("jw_in", "Jacket water from engine", 90, "°C")
    b.input("jw_out", "Jacket water back to engine", 74, "°C")
    b.input("hw_in", "Client hot water in (return)", 62, "°C")
    b.input("hw_out", "Client hot water out", 82, "°C")
    b.input("phx_u", "Clean overall heat-transfer coefficient U", 3800, "W/(m²·K)",
            "typical of gasketed plates with water on both sides; ask the supplier")
    b.input("phx_fouling", "Area allowance for fouling", 0.15, "-", "fraction of the clean area")
    b.input("phx_arr", "Flow arrangement", "counter", "", "drop-down", options=ARRANGEMENTS)
    b.input("phx_load", "Part load to rate", 0.5, "-", "fraction of full heat and flows")
    b.input_heading("Exhaust heat exchanger: exhaust gas → client hot water")
    b.input("exhaust_flow_kg_h", "Exhaust mass flow (engine datasheet)", 6100, "kg/h")
    b.input("exh_cp", "Mean exhaust specific heat 450→120 °C", 1.12, "kJ/(kg·K)",
            "about 1.1 for lean natural-gas exhaust; cellfuncs' EXH_ functions compute it")
    b.input("exh_in", "Exhaust in", 455, "°C")
    b.input("exh_out", "Exhaust out (stack)", 120, "°C",
            "about 120 °C keeps natural-gas exhaust clear of condensation (common practice)")
    b.input("exh_u", "Overall U, finned tubes, gas side", 65, "W/(m²·K)")
    b.input("exh_arr", "Flow arrangement", "cross-cmax-mixed", "", "drop-down", options=ARRANGEMENTS)

    c = b.sheet("Calc", "Calculation")
    c.heading("Plate heat exchanger at full load")
    c.calc("Hot-side capacity rate C_hot = duty / ΔT_hot", "=phx_duty/(jw_in-jw_out)", "kW/K",
           name="phx_c_hot")
    c.calc("Cold-side capacity rate C_cold = duty / ΔT_cold", "=phx_duty/(hw_out-hw_in)", "kW/K",
           name="phx_c_cold")
    c.calc("LMTD (counterflow)", '=HX_LMTD(jw_in,jw_out,hw_in,hw_out,"counter")', "K", name="phx_lmtd")
    c.calc("F factor for the arrangement", "=IF(phx_arr=\"counter\",1,HX_F(jw_in,jw_out,hw_in,hw_out,phx_arr))",
           "-", name="phx_f", fmt="0.0000")
    c.calc("Required UA", "=HX_UA(phx_duty,jw_in,jw_out,hw_in,hw_out,phx_arr)", "kW/K", name="phx_ua")
    c.calc("Clean area", "=HX_AREA(phx_duty,phx_u,jw_in,jw_out,hw_in,hw_out,phx_arr)", "m²",
           name="phx_area_clean")
    c.calc("Area with fouling allowance (to buy)", "=phx_area_clean*(1+phx_fouling)", "m²",
           name="out_phx_area", result=True)
    c.calc("UA of the exchanger bought", "=out_phx_area*phx_u/1000", "kW/K", name="phx_ua_bought")
    c.heading("Chosen plate exchanger rated at part load (flows × part load)")
    c.calc("Hot-side capacity rate", "=phx_c_hot*phx_load", "kW/K", name="pl_c_hot")
    c.calc("Cold-side capacity rate", "=phx_c_cold*phx_load", "kW/K", name="pl_c_cold")
    c.calc("Part-load duty", '=HX_RATE(jw_in,hw_in,pl_c_hot,pl_c_cold,phx_ua_bought,phx_arr,"duty")', "kW",
           name="out_pl_duty", result=True)
    c.calc("Jacket water back to the engine at part load",
           '=HX_RATE(jw_in,hw_in,pl_c_hot,pl_c_cold,phx_ua_bought,phx_arr,"t_hot_out")', "°C", name="pl_jw_out")
    c.calc("Client water out at part load", '=HX_RATE(jw_in,hw_in,pl_c_hot,pl_c_cold,phx_ua_bought,phx_arr,"t_cold_out")',
           "°C", name="out_pl_hw_out", result=True)
    c.calc("Effectiveness at part load", '=HX_RATE(jw_in,hw_in,pl_c_hot,pl_c_cold,phx_ua_bought,phx_arr,"effectiveness")',
           "-", name="pl_eff", fmt="0.000")
    c.heading("Exhaust heat exchanger")
    c.calc("Exhaust capacity rate", "=exhaust_flow_kg_h*exh_cp/3600", "kW/K", name="exh_c")
    c.calc("Exhaust heat to the stack temperature", "=exh_c*(exh_in-exh_out)", "kW", name="out_exh_duty",
           result=True)
    c.calc("Client water into the exhaust exchanger", "=hw_out", "°C", "after the plate exchanger",
           name="exh_w_in")
    c.calc("Client water out of the exhaust exchanger", "=exh_w_in+out_exh_duty/phx_c_cold", "°C",
           name="out_exh_w_out", result=True)
    c.calc("Capacity-rate ratio Cmin/Cmax", "=MIN(exh_c,phx_c_cold)/MAX(exh_c,phx_c_cold)", "-",
           name="exh_cr", fmt="0.000")
    c.calc("Effectiveness needed", "=(exh_in-exh_out)/(exh_in-exh_w_in)", "-", name="exh_eff", fmt="0.000")
    c.calc("NTU needed (ε-NTU)", "=HX_NTU(exh_eff,exh_cr,exh_arr)", "-", name="exh_ntu", fmt="0.000")
    c.calc("Required UA from NTU", "=exh_ntu*MIN(exh_c,phx_c_cold)", "kW/K", name="exh_ua")
    c.calc("Required UA from LMTD·F (check)", "=HX_UA(out_exh_duty,exh_in,exh_out,exh_w_in,out_exh_w_out,exh_arr)",
           "kW/K", name="exh_ua_check")
    c.calc("Gas-side area", "=exh_ua*1000/exh_u", "m²", name="out_exh_area", result=True)

    r = b.sheet("Results", "Results — heat exchangers, Fernwick Hollow (invented)")
    r.calc("Plate heat exchanger area to buy (with fouling allowance)", "=out_phx_area", "m²", result=True)
    r.calc("Plate exchanger duty at full load", "=phx_duty", "kW")
    r.calc("LMTD at full load", "=phx_lmtd", "K")
    r.calc("Duty at part load", "=out_pl_duty", "kW", result=True)
    r.calc("Client water out at part load", "=out_pl_hw_out", "°C", result=True)
    r.calc("Exhaust heat to the stack", "=out_exh_duty", "kW", result=True)
    r.calc("Client water out of the exhaust exchanger", "=out_exh_w_out", "°C", result=True)
    r.calc("Exhaust exchanger gas-side area", "=out_exh_area", "m²", result=True)
    b.finish()
    b.save(path)


def summary(v: dict) -> list:
    def f(name, fmt="{:.1f}"):
        x = v.get(name)
        return fmt.format(x) if isinstance(x, float) else str(x)

    return [
        f"plate exchanger: {f('out_phx_area')} m² to buy; at part load {f('out_pl_duty')} kW, "
        f"client water out {f('out_pl_hw_out')} °C",
        f"exhaust exchanger: {f('out_exh_duty')} kW to the stack temperature, water out "
        f"{f('out_exh_w_out')} °C, gas-side area {f('out_exh_area')} m²",
    ]
