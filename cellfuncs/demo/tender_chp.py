"""Demo workbook ``tender_chp.xlsx``: a complete tender calculation for an invented plant.

Scenario (invented): the Ashcombe Vale district-heating plant, one gas-engine
set on pipeline natural gas.  Gas properties and methane number → fuel flow →
mixture flow → compressor outlet → HT/LT charge-air cooler duties and dew point
→ knock margin → hot-water chain in the chosen order with its check → exhaust
heat to the stack temperature → heat-exchanger areas → balance, heat rate and
primary energy savings → a one-page summary.  A second sheet pipes the same
sources in another order to show what the order does.
"""

from __future__ import annotations

from cellfuncs.demo.book import DemoBook
from cellfuncs.heat_transfer.arrangements import ARRANGEMENTS

FILENAME = "tender_chp.xlsx"
EXPECTED_ERRORS: set = set()

GAS = [("methane", 91.4), ("ethane", 4.9), ("propane", 1.1), ("n-butane", 0.25), ("isobutane", 0.2),
       ("n-pentane", 0.05), ("nitrogen", 1.3), ("carbon dioxide", 0.8)]
SOURCES = ("oil cooler", "HT charge-air stage", "jacket water", "exhaust")
ORDER_A = ("oil cooler", "jacket water", "HT charge-air stage", "exhaust")
ORDER_B = ("exhaust", "jacket water", "HT charge-air stage", "oil cooler")
AMB = "t_amb,rh_amb,p_amb"
MIX = "air_ratio,gas_names,gas_amounts," + AMB


def build(path: str) -> None:
    b = DemoBook("Tender calculation — Ashcombe Vale district heating (invented)",
                 "One gas-engine set on pipeline gas: fuel, charge air, knock margin, heat recovery in "
                 "the chosen order, exhaust, exchanger areas, balance and primary energy savings.")
    b.input_heading("Site")
    b.input("t_amb", "Ambient air temperature (design day)", 30, "°C")
    b.input("rh_amb", "Ambient relative humidity", 0.55, "-", "fraction 0–1")
    b.input("p_amb", "Ambient pressure", 0.99, "bar(a)")
    b.input_heading("Engine set (declared datasheet values; invented here)")
    b.input("p_el", "Electrical output", 1560, "kW")
    b.input("fuel_kw", "Fuel power (net calorific value)", 3650, "kW")
    b.input("eta_gen", "Generator efficiency", 0.97, "-")
    b.input("speed", "Engine speed", 1500, "rpm")
    b.input("freq", "Grid frequency", 50, "Hz")
    b.input("displacement", "Total displacement", 64, "l", "16 cylinders × 4.0 l")
    b.input("air_ratio", "Air ratio λ (engine datasheet)", 1.85, "-")
    b.input("p_boost", "Boost pressure", 3.3, "bar(a)")
    b.input("eta_c", "Compressor isentropic efficiency", 0.78, "-")
    b.input("cr", "Compression ratio (effective)", 12.5, "-")
    b.input("t_after_ht", "Mixture after the HT stage", 90, "°C")
    b.input("t_intake", "Mixture after the LT stage (intake)", 50, "°C")
    b.input("t_ref", "Knock reference: mixture temperature", 50, "°C", "rated knock-free point (datasheet)")
    b.input("p_ref", "Knock reference: boost pressure", 3.3, "bar(a)")
    b.input("mn_ref", "Knock reference: methane number", 80, "-")
    b.input("q_oil", "Oil-cooler heat", 190, "kW")
    b.input("t_oil_max", "Oil-cooler hot side (oil out of the engine)", 82, "°C")
    b.input("q_jw", "Jacket-water heat", 560, "kW")
    b.input("t_jw_in", "Jacket water from the engine", 92, "°C")
    b.input("t_jw_out", "Jacket water back to the engine", 82, "°C")
    b.input("t_exh", "Exhaust after the turbine", 445, "°C")
    b.input_heading("Client's hot water and design choices")
    b.input("t_return", "Hot-water return", 60, "°C")
    b.input("t_flow", "Hot-water flow wanted", 90, "°C")
    b.input("t_stack", "Exhaust to the stack", 120, "°C",
            "about 120 °C keeps natural-gas exhaust clear of condensation (common practice)")
    b.input("min_approach", "Minimum approach in each exchanger", 5, "K")
    for i, src in enumerate(ORDER_A, start=1):
        b.input(f"order_{i}", f"Heat source at stage {i} (chosen order)", src, "", "drop-down",
                options=SOURCES)
    b.input("u_plate", "U of the jacket-water plate exchanger", 3500, "W/(m²·K)")
    b.input("u_exh", "U of the exhaust exchanger (gas side)", 60, "W/(m²·K)")
    b.input("exh_arr", "Exhaust exchanger arrangement", "counter", "", "drop-down", options=ARRANGEMENTS)
    b.input("ref_el", "Reference efficiency, separate electricity", 0.525, "-",
            "harmonised value in force for fuel, year and country: look it up")
    b.input("ref_th", "Reference efficiency, separate heat", 0.90, "-", "idem")
    b.input_table("Gas analysis", ("component", "mol-%"), GAS, ("gas_names", "gas_amounts"), unit="mol-%",
                  note="invented pipeline gas")

    g = b.sheet("Gas and air", "Gas, fuel and charge air")
    g.calc("Net calorific value (25/0)", '=GAS_CV(gas_names,gas_amounts,"net","volume","25/0")', "MJ/m³ (net, 25/0)",
           name="cv_net", fmt="0.000")
    g.calc("Wobbe index (gross, 15/15)", '=GAS_WOBBE(gas_names,gas_amounts,"gross","15/15")', "MJ/m³ (gross, 15/15)",
           name="wobbe", fmt="0.000")
    g.calc("Methane number (EN 16726:2015 Annex A)", "=GAS_METHANE_NUMBER(gas_names,gas_amounts)", "-",
           name="mn_gas", fmt="0.0")
    g.calc("Fuel gas flow (25/0)", '=GAS_FUEL_FLOW(gas_names,gas_amounts,fuel_kw,"net","25/0")', "m³/h (net, 25/0)",
           name="out_fuel_flow", result=True, fmt="0.0")
    g.calc("Mixture mass flow", f'=CAC_MIXTURE_FLOW(fuel_kw,air_ratio,gas_names,gas_amounts,"net",{AMB},'
           '"mixture")', "kg/h", name="mix_flow", fmt="0")
    g.calc("Compressor outlet temperature", f"=TURBO_T_OUT(t_amb,p_amb,p_boost,eta_c,air_ratio,gas_names,"
           "gas_amounts,t_amb,rh_amb)", "°C", name="t_comp_out", fmt="0.0")
    g.calc("HT charge-air stage heat", f"=CAC_DUTY(mix_flow,t_comp_out,t_after_ht,p_boost,{MIX})", "kW",
           name="q_ht", fmt="0.0")
    g.calc("LT charge-air stage heat (dumped)", f"=CAC_DUTY(mix_flow,t_after_ht,t_intake,p_boost,{MIX})", "kW",
           name="out_q_lt", fmt="0.0")
    g.calc("Mixture dew point at boost pressure", f"=CAC_DEWPOINT(p_boost,{MIX})", "°C", name="dewpoint",
           fmt="0.0")
    g.calc("Condensation check", '=IF(t_intake>dewpoint,"OK: intake above the dew point",'
           '"CONDENSATE in the intake: separate and drain it")', "", name="dew_check")
    g.calc("Knock margin at the intake temperature", '=KNOCK_MARGIN(t_intake,p_boost,cr,mn_gas,t_ref,p_ref,'
           'mn_ref,cr,"K")', "K", name="out_knock_k", result=True, fmt="0.0")
    g.calc("Methane number needed", "=KNOCK_MN_REQUIRED(t_intake,p_boost,cr,t_ref,p_ref,mn_ref,cr)", "-",
           name="mn_needed", fmt="0.0")
    g.calc("Shaft power", "=p_el/eta_gen", "kW", name="p_shaft", fmt="0")
    g.calc("BMEP", "=ENGINE_BMEP(p_shaft,displacement,speed)", "bar", name="bmep", fmt="0.0")
    g.calc("Generator pole pairs", "=GEN_POLE_PAIRS(freq,speed)", "-", name="pole_pairs", fmt="0")

    e = b.sheet("Exhaust", "Exhaust heat to the stack")
    e.calc("Exhaust mass flow (wet)", f'=EXH_FLOW(fuel_kw,air_ratio,gas_names,gas_amounts,"net",{AMB})', "kg/h",
           name="exh_flow", fmt="0")
    e.calc("Water dew point of the exhaust", f"=EXH_DEWPOINT(air_ratio,gas_names,gas_amounts,1.01325,{AMB})",
           "°C", name="exh_dew", fmt="0.0")
    e.calc("Exhaust heat from the turbine outlet to the stack", f"=EXH_HEAT(exh_flow,t_exh,t_stack,{MIX})", "kW",
           name="q_exh", fmt="0.0")
    e.calc("O2 in the exhaust (dry)", f'=EXH_COMPOSITION(air_ratio,gas_names,gas_amounts,"O2","dry",{AMB})',
           "-", name="o2_dry", fmt="0.00%")
    e.calc("Exhaust capacity rate (mean)", "=q_exh/(t_exh-t_stack)", "kW/K", name="c_exh", fmt="0.000")

    def chain_sheet(title, order_names, prefix):
        s = b.sheet(title, f"Hot-water chain — {title.lower()}")
        s.note("Heat sources in the order the client's water meets them; volume flow at the return temperature.")
        src = s.row
        s.table_row("source", list(SOURCES))
        s.table_row("heat [kW]", ["=q_oil", "=q_ht", "=q_jw", "=q_exh"], "kW", "0.0")
        s.table_row("hot-side temperature [°C]", ["=t_oil_max", "=t_after_ht", "=t_jw_out", "=t_stack"], "°C",
                    "0.0")
        s.note("Hot-side temperature = what the source's outlet must stay above (the colder end of each source).")
        order_row = s.table_row("stage order", [f"={n}" for n in order_names])
        duty_row = s.table_row("duty in that order", [
            f"=INDEX($B${src + 1}:$E${src + 1},MATCH({chr(66 + j)}{order_row},$B${src}:$E${src},0))"
            for j in range(4)], "kW", "0.0")
        hot_row = s.table_row("hot-side temperature in that order", [
            f"=INDEX($B${src + 2}:$E${src + 2},MATCH({chr(66 + j)}{order_row},$B${src}:$E${src},0))"
            for j in range(4)], "°C", "0.0")
        duties = f"$B${duty_row}:$E${duty_row}"
        hots = f"$B${hot_row}:$E${hot_row}"
        s.calc("Total heat to the client", f"=SUM({duties})", "kW", name=f"{prefix}_heat", fmt="0.0")
        s.calc("Hot-water flow for the wanted flow temperature (at return temperature)",
               f"=HW_FLOW({prefix}_heat,t_return,t_flow)", "m³/h", name=f"{prefix}_flow", fmt="0.00")
        temps = s.array("Water temperature after each stage", f"=HW_CHAIN(t_return,{prefix}_flow,{duties})", 4,
                        "°C", fmt="0.0")
        sheet_q = "'" + title + "'"
        short = prefix.replace("out_", "chain_")  # ranges are not case outputs (those are single cells)
        b.name(f"{short}_temps", sheet_q + "!" + "$B${r}:$E${r}".format(r=s.row - 1))
        b.name(f"{short}_order", sheet_q + "!" + f"$B${order_row}:$E${order_row}")
        assert temps.endswith(f"B{s.row - 1}:E{s.row - 1}")
        s.calc("Check of the order", f"=HW_CHAIN_CHECK(t_return,{prefix}_flow,{duties},{hots},min_approach)",
               "", name=f"{prefix}_check")
        return s

    chain_sheet("Chosen order", [f"order_{i}" for i in range(1, 5)], "out_a")
    bsheet = chain_sheet("Another order", [f'"{n}"' for n in ORDER_B], "out_b")
    bsheet.note("The same sources in another order: the check says which stage would fail and why.")

    h = b.sheet("Exchangers", "Heat-exchanger sizing (LMTD, F)")
    h.note("Jacket-water plate exchanger: stage of the chosen order that takes the jacket water.")
    # position of the jacket-water stage and the water temperatures around it
    h.calc("Stage number of the jacket water", "=MATCH(\"jacket water\",chain_a_order,0)", "-",
           name="jw_stage", fmt="0")
    h.calc("Water into the jacket-water exchanger", "=IF(jw_stage=1,t_return,INDEX(chain_a_temps,"
           "jw_stage-1))", "°C", name="jw_w_in", fmt="0.0")
    h.calc("Water out of the jacket-water exchanger", "=INDEX(chain_a_temps,jw_stage)", "°C",
           name="jw_w_out", fmt="0.0")
    h.calc("Plate exchanger area", '=HX_AREA(q_jw,u_plate,t_jw_in,t_jw_out,jw_w_in,jw_w_out,"counter")', "m²",
           name="out_area_plate", result=True, fmt="0.0")
    h.calc("Stage number of the exhaust", "=MATCH(\"exhaust\",chain_a_order,0)", "-",
           name="ex_stage", fmt="0")
    h.calc("Water into the exhaust exchanger", "=IF(ex_stage=1,t_return,INDEX(chain_a_temps,"
           "ex_stage-1))", "°C", name="ex_w_in", fmt="0.0")
    h.calc("Water out of the exhaust exchanger", "=INDEX(chain_a_temps,ex_stage)", "°C",
           name="ex_w_out", fmt="0.0")
    h.calc("Exhaust exchanger LMTD (counterflow)", '=HX_LMTD(t_exh,t_stack,ex_w_in,ex_w_out,"counter")', "K",
           name="ex_lmtd", fmt="0.0")
    h.calc("F factor of the chosen arrangement", '=IF(exh_arr="counter",1,HX_F(t_exh,t_stack,ex_w_in,ex_w_out,'
           'exh_arr))', "-", name="ex_f", fmt="0.000")
    h.calc("Required UA (duty / (F · LMTD))", "=HX_UA(q_exh,t_exh,t_stack,ex_w_in,ex_w_out,exh_arr)", "kW/K",
           name="ex_ua", fmt="0.00")
    h.calc("Exhaust exchanger area (gas side)", "=HX_AREA(q_exh,u_exh,t_exh,t_stack,ex_w_in,ex_w_out,exh_arr)",
           "m²", name="out_area_exh", result=True, fmt="0.0")

    h.calc("Plate exchanger UA", '=HX_UA(q_jw,t_jw_in,t_jw_out,jw_w_in,jw_w_out,"counter")', "kW/K",
           name="jw_ua", fmt="0.00")

    rt = b.sheet("Rated order", "The sized exchangers rated in both orders (HW_CHAIN_RATE)")
    rt.note("Jacket-water plate exchanger and exhaust exchanger as sized above, on the hot-water flow of "
            "the chosen order, entering at the return temperature.")
    rt.note("A stage whose source is colder than the water reaching it gets a negative duty: the water "
            "would heat the source.")
    first = rt.table_row("stage", ["jacket water", "exhaust"])
    rt.table_row("hot inlet [°C]", ["=t_jw_in", "=t_exh"], "°C", "0.0")
    rt.table_row("hot capacity rate [kW/K]", ["=q_jw/(t_jw_in-t_jw_out)", "=c_exh"], "kW/K", "0.000")
    rt.table_row("UA [kW/K]", ["=jw_ua", "=ex_ua"], "kW/K", "0.00")
    rt.table_row("stage (other order)", ["exhaust", "jacket water"])
    rt.table_row("hot inlet [°C]", ["=t_exh", "=t_jw_in"], "°C", "0.0")
    rt.table_row("hot capacity rate [kW/K]", ["=c_exh", "=q_jw/(t_jw_in-t_jw_out)"], "kW/K", "0.000")
    rt.table_row("UA [kW/K]", ["=ex_ua", "=jw_ua"], "kW/K", "0.00")

    def rng(r):
        return f"$B${r}:$C${r}"

    a_t, a_c, a_ua = rng(first + 1), rng(first + 2), rng(first + 3)
    b_t, b_c, b_ua = rng(first + 5), rng(first + 6), rng(first + 7)
    rt.heading("Jacket water first, then exhaust")
    rt.array("duty per stage", f'=HW_CHAIN_RATE(t_return,out_a_flow,{a_t},{a_c},{a_ua},"counter","duty")', 2,
             "kW", fmt="0.0")
    rt.array("water after each stage", f'=HW_CHAIN_RATE(t_return,out_a_flow,{a_t},{a_c},{a_ua},"counter","t_out")',
             2, "°C", fmt="0.0")
    rt.heading("Exhaust first, then jacket water")
    rt.array("duty per stage", f'=HW_CHAIN_RATE(t_return,out_a_flow,{b_t},{b_c},{b_ua},"counter","duty")', 2,
             "kW", fmt="0.0")
    rt.array("water after each stage", f'=HW_CHAIN_RATE(t_return,out_a_flow,{b_t},{b_c},{b_ua},"counter","t_out")',
             2, "°C", fmt="0.0")
    rt.note("In the second order the exhaust heats the water first; the jacket-water exchanger then sees "
            "hotter water and recovers less (or, past the jacket temperature, would heat the engine).")

    p = b.sheet("Balance", "Plant balance")
    p.table_row("heat recovered [kW]", ["=q_oil", "=q_ht", "=q_jw", "=q_exh"], "kW", "0.0")
    heat = f"'Balance'!$B${p.row - 1}:$E${p.row - 1}"
    p.calc("Electrical efficiency", f'=CHP_BALANCE(fuel_kw,p_el,{heat},"electrical")', "-", name="eta_el",
           fmt="0.0%")
    p.calc("Thermal efficiency", f'=CHP_BALANCE(fuel_kw,p_el,{heat},"thermal")', "-", name="eta_th", fmt="0.0%")
    p.calc("Total efficiency", f'=CHP_BALANCE(fuel_kw,p_el,{heat},"total")', "-", name="out_eta_total",
           result=True, fmt="0.0%")
    p.calc("Unaccounted (losses, LT heat, radiation)", f'=CHP_BALANCE(fuel_kw,p_el,{heat},"unaccounted")', "-",
           fmt="0.0%")
    p.calc("Heat rate", "=CHP_HEAT_RATE(eta_el)", "kJ/kWh", name="out_heat_rate", fmt="0")
    p.calc("Primary energy savings (Directive 2012/27/EU Annex II)", "=CHP_PES(eta_el,eta_th,ref_el,ref_th)",
           "-", name="out_pes", result=True, fmt="0.0%")

    r = b.sheet("Results", "Tender summary — Ashcombe Vale district heating (invented)")
    r.calc("Electrical output", "=p_el", "kW", fmt="0")
    r.calc("Fuel power (net)", "=fuel_kw", "kW", fmt="0")
    r.calc("Fuel gas flow (25/0)", "=out_fuel_flow", "m³/h", result=True, fmt="0.0")
    r.calc("Methane number of the gas / needed", '=TEXT(mn_gas,"0.0")&" / "&TEXT(mn_needed,"0.0")', "-")
    r.calc("Knock margin at the intake temperature", "=out_knock_k", "K", result=True, fmt="0.0")
    r.calc("Charge-air condensation", "=dew_check", "")
    r.calc("Heat to the client (chosen order)", "=out_a_heat", "kW", result=True, fmt="0")
    r.calc("Hot-water flow", "=out_a_flow", "m³/h", fmt="0.0")
    r.calc("Check of the chosen order", "=out_a_check", "")
    r.calc("LT charge-air heat to dump", "=out_q_lt", "kW", fmt="0")
    r.calc("Plate exchanger area (jacket water)", "=out_area_plate", "m²", fmt="0.0")
    r.calc("Exhaust exchanger area (gas side)", "=out_area_exh", "m²", fmt="0.0")
    r.calc("Electrical / thermal / total efficiency",
           '=TEXT(eta_el,"0.0%")&" / "&TEXT(eta_th,"0.0%")&" / "&TEXT(out_eta_total,"0.0%")', "-")
    r.calc("Primary energy savings", "=out_pes", "-", result=True, fmt="0.0%")
    r.calc("Computed with cellfuncs", "=CELLFUNCS_VERSION()", "")
    b.finish()
    b.save(path)


def summary(v: dict) -> list:
    def f(name, d=1):
        x = v.get(name)
        return f"{x:.{d}f}" if isinstance(x, float) else str(x)

    return [f"fuel {f('out_fuel_flow')} m³/h; knock margin {f('out_knock_k')} K; heat to client "
            f"{f('out_a_heat', 0)} kW; PES {f('out_pes', 3)}; total efficiency {f('out_eta_total', 3)}",
            f"chosen order: {v.get('out_a_check')}",
            f"other order:  {v.get('out_b_check')}"]
