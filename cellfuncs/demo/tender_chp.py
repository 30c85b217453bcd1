"""Demo workbook ``tender_chp.xlsx``: a tender calculation for an invented plant that adds up.

Scenario (invented): the Ashcombe Vale district-heating plant, one gas-engine
set on pipeline natural gas.  The engine's declared datasheet (invented, at the
site's design conditions) sits on its own sheet and adds up to the fuel input.
Gas properties and methane number → fuel flow → charge air (declared duties
beside the computed ones) → knock margin, also at the lowest methane number of
the published methods → exhaust, the permit's emission limits converted and
the acid dew point (only for a gas with H2S) → the site rating (ISO 2533
pressure at the site's altitude, the declared derating and part-load tables
read by TABLE_INTERP/TABLE_INTERP2) → the engine's HT circuit (jacket
water, oil and HT charge-air stage) as one engine loop with one plate
exchanger to the client, the exhaust exchanger after it, both rated in the
chosen and the reversed order with the dump heat shown → the LT stage to a
sized dry cooler at the design ambient, the HT emergency cooler sized for the
whole HT duty → the first-law check of the plant → primary energy savings with
the reference values of Delegated Regulation (EU) 2015/2402 → a summary.
"""

from __future__ import annotations

from openpyxl.styles import Alignment, Font

from cellfuncs.demo.book import _BOX, _INPUT_FILL, DemoBook
from cellfuncs.heat_transfer.arrangements import ARRANGEMENTS

FILENAME = "tender_chp.xlsx"
EXPECTED_ERRORS: set = set()

GAS = [("methane", 91.4), ("ethane", 4.9), ("propane", 1.1), ("n-butane", 0.25), ("isobutane", 0.2),
       ("n-pentane", 0.05), ("nitrogen", 1.3), ("carbon dioxide", 0.8)]
SOURCES = ("HT engine circuit", "exhaust")
ORDER = ("HT engine circuit", "exhaust")

#: the invented engine's declared datasheet at the site's design conditions: (name, label, value, unit, note)
DATASHEET = (
    ("fuel_power_kw", "Fuel power (net calorific value)", 3650, "kW", ""),
    ("electrical_kw", "Electrical output at the generator terminals", 1560, "kW", "42.7 % of the fuel"),
    ("generator_efficiency", "Generator efficiency", 0.97, "-", ""),
    ("q_jacket_kw", "Jacket-water heat", 340, "kW", "HT circuit"),
    ("q_oil_kw", "Lube-oil heat", 160, "kW", "HT circuit"),
    ("q_cac_ht_kw", "HT charge-air stage heat", 245, "kW", "HT circuit"),
    ("q_cac_lt_kw", "LT charge-air stage heat", 103, "kW", "LT circuit, to the dry cooler"),
    ("exhaust_flow_kg_h", "Exhaust mass flow (wet)", 8760, "kg/h", ""),
    ("t_exhaust_in", "Exhaust temperature after the turbine", 445, "°C", ""),
    ("q_exhaust_kw", "Exhaust heat, turbine outlet to 120 °C", 890, "kW", ""),
    ("q_exhaust_loss_kw", "Exhaust loss, 120 °C to 25 °C (water as vapour)", 249, "kW", "net-CV balance"),
    ("q_radiation_kw", "Radiation and convection from the engine", 55, "kW", "1.5 % of the fuel"),
    ("t_engine_in_max", "HT circuit: maximum engine inlet temperature", 80, "°C", ""),
    ("engine_flow_m3_h", "HT circuit: flow through the engine (at its inlet)", 60, "m³/h", ""),
    ("air_ratio", "Air ratio (lambda)", 1.85, "-", ""),
    ("p_boost_bar", "Boost pressure", 3.3, "bar(a)", ""),
    ("isentropic_efficiency", "Compressor isentropic efficiency", 0.78, "-", ""),
    ("compression_ratio", "Compression ratio (effective)", 12.5, "-", ""),
    ("t_mixture_ht", "Mixture after the HT stage", 90, "°C", ""),
    ("t_mixture", "Mixture after the LT stage (intake)", 50, "°C", ""),
    ("t_mixture_ref", "Knock reference: mixture temperature", 50, "°C", "rated knock-free point"),
    ("p_boost_ref_bar", "Knock reference: boost pressure", 3.3, "bar(a)", ""),
    ("methane_number_ref", "Knock reference: methane number", 80, "-", ""),
    ("speed_rpm", "Engine speed", 1500, "rpm", ""),
    ("frequency_hz", "Grid frequency", 50, "Hz", ""),
    ("displacement_l", "Total displacement", 64, "l", "16 cylinders × 4.0 l"),
)
#: the datasheet items that add up to the fuel power (the generator loss follows from its efficiency)
BALANCE_ITEMS = ("electrical_kw", "q_jacket_kw", "q_oil_kw", "q_cac_ht_kw", "q_cac_lt_kw", "q_exhaust_kw",
                 "q_exhaust_loss_kw", "q_radiation_kw")

#: invented declared derating by altitude (rows) and intake-air temperature (columns), a factor on the
#: declared electrical output; full output up to 500 m and 30 °C, as the datasheet's design point needs
DERATE_ALTITUDES = (0, 250, 500, 1000, 1500, 2000)
DERATE_TEMPERATURES = (-20, 25, 30, 35, 40, 45)
DERATE = ((1.00, 1.00, 1.00, 0.98, 0.94, 0.89),
          (1.00, 1.00, 1.00, 0.97, 0.93, 0.88),
          (1.00, 1.00, 0.98, 0.95, 0.91, 0.86),
          (0.97, 0.97, 0.94, 0.91, 0.87, 0.82),
          (0.92, 0.92, 0.89, 0.86, 0.82, 0.78),
          (0.87, 0.87, 0.84, 0.81, 0.78, 0.74))
#: invented declared derating by methane number: full output from the knock reference's MN 80 up
MN_DERATE = ((60, 0.70), (65, 0.78), (70, 0.86), (75, 0.93), (80, 1.00), (100, 1.00))
#: invented declared part-load table: load [%], electrical and thermal efficiency (net); the 100 % row is
#: the datasheet's full-load figures (formulas), thermal = HT circuit + exhaust to 120 °C
PART_LOAD = ((40, 0.365, 0.505), (60, 0.395, 0.482), (80, 0.414, 0.463),
             (100, "=electrical_kw/fuel_power_kw", "=(q_ht_kw+q_exhaust_kw)/fuel_power_kw"))
PART_LOADS = (50, 75, 100)

AMB = "t_ambient,rh_ambient,p_ambient_bar"
MIX = "air_ratio,gas_names,gas_amounts," + AMB
SHEET_RATED = "Rated order"


def datasheet_values() -> dict:
    """The declared datasheet as {name: value}."""
    return {n: v for n, _label, v, _u, _note in DATASHEET}


def _input_formula(b: DemoBook, name, label, formula, unit, note, fmt) -> None:
    """A computed row on Inputs (boxed, no input fill), named ``name``: not a cases column."""
    r = b._in_row
    b.inputs.cell(r, 1, label)
    c = b.inputs.cell(r, 2, formula)
    c.border = _BOX
    c.number_format = fmt
    b.inputs.cell(r, 3, unit)
    b.inputs.cell(r, 4, note)
    b.name(name, f"Inputs!$B${r}")
    b._in_row += 1


def _inputs(b: DemoBook) -> None:
    b.input_heading("Site (design day)")
    b.input("t_ambient", "Ambient air temperature (design day)", 30, "°C")
    b.input("rh_ambient", "Ambient relative humidity", 0.55, "-", "fraction 0–1")
    b.input("site_altitude_m", "Site altitude", 200, "m", "sets the ambient pressure below")
    b.input("p_ambient_offset_bar", "Design-day weather correction of the ambient pressure", 0.0, "bar",
            "added to the standard atmosphere; 0 = none")
    _input_formula(b, "p_ambient_bar", "Ambient pressure: standard atmosphere at the altitude",
                   "=SITE_PRESSURE(site_altitude_m)+p_ambient_offset_bar", "bar(a)",
                   "computed (ISO 2533 + the correction), used on every sheet", "0.0000")
    b.input_heading("Client's hot water and design choices")
    b.input("t_water_in", "Hot-water return (client's water entering the plant)", 60, "°C")
    b.input("t_water_out", "Hot-water flow wanted", 90, "°C")
    b.input("t_stack", "Exhaust to the stack", 120, "°C",
            "about 120 °C keeps natural-gas exhaust clear of condensation (common practice)")
    b.input("min_approach_k", "Minimum approach at either end of each exchanger", 5, "K")
    for i, src in enumerate(ORDER, start=1):
        b.input(f"order_{i}", f"Heat source at stage {i} (chosen order)", src, "", "drop-down", options=SOURCES)
    b.input("ua_margin", "Surface margin of the HT plate exchanger", 0.10, "-", "fraction of the UA needed")
    b.input("u_plate_w_m2_k", "U of the HT plate exchanger", 3500, "W/(m²·K)")
    b.input("u_exhaust_w_m2_k", "U of the exhaust exchanger (gas side)", 60, "W/(m²·K)")
    b.input("exhaust_arrangement", "Exhaust exchanger arrangement", "counter", "", "drop-down", options=ARRANGEMENTS)
    b.input_heading("LT circuit and coolers (water-glycol)")
    b.input("lt_glycol_fraction", "Glycol mass fraction of the LT circuit", 0.35, "-",
            "ethylene glycol, frost protection of the dry cooler")
    b.input("ht_glycol_fraction", "Glycol mass fraction of the engine's HT circuit", 0.0, "-",
            "the HT emergency cooler sits on this circuit")
    b.input("t_lt_hot", "LT coolant leaving the LT charge-air stage", 45, "°C")
    b.input("t_lt_cold", "LT coolant entering the LT charge-air stage", 40, "°C")
    b.input("t_air_out_lt", "Air leaving the LT dry cooler", 38, "°C")
    b.input("t_air_out_ht", "Air leaving the HT emergency cooler", 45, "°C")
    b.input_heading("Emission limits (invented permit, dry exhaust at the reference O2)")
    b.input("nox_limit_mg_nm3", "NOx limit (as NO2)", 500, "mg/Nm³", "0 °C, 1.01325 bar, dry")
    b.input("co_limit_mg_nm3", "CO limit", 300, "mg/Nm³", "0 °C, 1.01325 bar, dry")
    b.input("o2_reference_pct", "Reference O2 of the limits", 5, "vol-%", "dry exhaust")
    b.input_heading("Primary energy savings (Delegated Regulation (EU) 2015/2402)")
    b.input("pes_fuel", "Fuel of the reference values", "natural-gas", "", "Annexes I and II",
            options=("natural-gas", "biogas", "refinery-gas", "waste-gas", "oil", "bio-liquid"))
    b.input("construction_year", "Year of construction of the unit", 2023, "-",
            "the regulation's values cover units built up to 2023 (figures from memory: check them)")
    b.input("voltage_kv", "Grid connection voltage", 10, "kV", "Annex IV grid-loss correction")
    b.input("onsite_share", "Share of the electricity used on site", 0.0, "-", "fraction 0–1")
    b.input_table("Gas analysis", ("component", "mol-%"), GAS, ("gas_names", "gas_amounts"),
                  note="invented pipeline gas")


def _datasheet(b: DemoBook) -> None:
    d = b.sheet("Engine datasheet", "Declared datasheet of the invented engine (site design conditions)")
    d.note("Invented figures, physically consistent: the items below add up to the fuel input (net calorific value).")
    for name, label, value, unit, note in DATASHEET:
        d.calc(label, value, unit, note, name=name, fmt="0.00" if isinstance(value, float) else "0")
        d.ws.cell(d.row - 1, 2).fill = _INPUT_FILL
    d.calc("Generator loss (electrical output / efficiency − output)", "=electrical_kw/generator_efficiency-"
           "electrical_kw", "kW", name="q_generator_loss_kw", fmt="0.0")
    d.calc("HT circuit duty (jacket + oil + HT charge air)", "=q_jacket_kw+q_oil_kw+q_cac_ht_kw", "kW",
           name="q_ht_kw", fmt="0")
    items = "+".join(BALANCE_ITEMS) + "+q_generator_loss_kw"
    d.calc("Sum of the declared items", f"={items}", "kW", name="datasheet_sum", fmt="0.0")
    d.calc("Datasheet closure (fuel − sum)", "=fuel_power_kw-datasheet_sum", "kW", name="datasheet_closure",
           fmt="0.0")
    r = d.table_row("declared heat flows [kW]", ["=q_jacket_kw", "=q_oil_kw", "=q_cac_ht_kw", "=q_cac_lt_kw",
                                                 "=q_exhaust_kw"], "kW", "0")
    d.calc("Datasheet check (first law)", f"=CHP_BALANCE_CHECK(fuel_power_kw,electrical_kw,$B${r}:$F${r},"
           "q_exhaust_loss_kw,q_radiation_kw+q_generator_loss_kw)", "", name="datasheet_check")


def _gas_and_air(b: DemoBook) -> None:
    g = b.sheet("Gas and air", "Gas, fuel and charge air (computed beside the declared figures)")
    g.calc("Net calorific value", '=GAS_CV(gas_names,gas_amounts,"net","volume","25/0")', "MJ/m³ (net, 25/0)",
           name="cv_net", fmt="0.000")
    g.calc("Wobbe index", '=GAS_WOBBE(gas_names,gas_amounts,"gross","15/15")', "MJ/m³ (gross, 15/15)",
           name="wobbe", fmt="0.000")
    g.calc("Methane number (EN 16726:2015 Annex A)", "=GAS_METHANE_NUMBER(gas_names,gas_amounts)", "-",
           name="mn_gas", fmt="0.0")
    g.calc("Fuel gas flow (net calorific value, 25/0)", '=GAS_FUEL_FLOW(gas_names,gas_amounts,fuel_power_kw,"net",'
           '"25/0")', "m³/h (0 °C)",
           name="out_fuel_flow", result=True, fmt="0.0")
    g.calc("Mixture mass flow", f'=CAC_MIXTURE_FLOW(fuel_power_kw,air_ratio,gas_names,gas_amounts,"net",{AMB},'
           '"mixture")', "kg/h", name="mixture_flow_kg_h", fmt="0")
    g.calc("Compressor outlet temperature", "=TURBO_T_OUT(t_ambient,p_ambient_bar,p_boost_bar,"
           "isentropic_efficiency,air_ratio,gas_names,gas_amounts,t_ambient,rh_ambient)", "°C",
           name="t_compressor_out", fmt="0.0")
    g.calc("HT charge-air stage heat, computed", f"=CAC_DUTY(mixture_flow_kg_h,t_compressor_out,t_mixture_ht,"
           f"p_boost_bar,{MIX})", "kW", name="q_cac_ht_calc", fmt="0.0",
           note="declared value on the datasheet sheet")
    g.calc("LT charge-air stage heat, computed", f"=CAC_DUTY(mixture_flow_kg_h,t_mixture_ht,t_mixture,"
           f"p_boost_bar,{MIX})", "kW", name="q_cac_lt_calc", fmt="0.0")
    g.calc("Mixture dew point at boost pressure", f"=CAC_DEWPOINT(p_boost_bar,{MIX})", "°C",
           name="t_dew_mixture", fmt="0.0")
    g.calc("Condensation check", '=IF(t_mixture>t_dew_mixture,"OK: intake above the dew point",'
           '"CONDENSATE in the intake: separate and drain it")', "", name="dew_check")
    g.calc("Knock margin at the intake temperature", "=KNOCK_MARGIN(t_mixture,p_boost_bar,compression_ratio,"
           'mn_gas,t_mixture_ref,p_boost_ref_bar,methane_number_ref,compression_ratio,"K")', "K",
           name="out_knock_k", result=True, fmt="0.0")
    g.heading("Methane number by method: the spread and the knock margin at its lowest")
    g.calc("Methane-number spread (highest − lowest method)",
           '=GAS_METHANE_NUMBER_SPREAD(gas_names,gas_amounts,"spread")', "-", name="mn_spread", fmt="0.0")
    g.calc("Lowest methane number of the methods", '=GAS_METHANE_NUMBER_SPREAD(gas_names,gas_amounts,"lowest")',
           "-", name="mn_lowest", fmt="0.0")
    g.calc("Each method's methane number", '=GAS_METHANE_NUMBER_SPREAD(gas_names,gas_amounts,"methods")', "",
           name="mn_methods")
    g.calc("Knock margin at the default MN (EN 16726 Annex A)", "=out_knock_k", "K", fmt="0.0")
    g.calc("Knock margin at the lowest MN of the methods", "=KNOCK_MARGIN(t_mixture,p_boost_bar,compression_ratio,"
           'mn_lowest,t_mixture_ref,p_boost_ref_bar,methane_number_ref,compression_ratio,"K")', "K",
           name="out_knock_k_mn_low", result=True, fmt="0.0")
    g.note("Published methods differ by 5–10 MN on the same gas (EN 16726 Annex A; Kubesh, King & Liss 1992 with "
           "the paper's or ISO 15403-1's MON-to-MN): judge the margin at the lowest.")
    g.note("The engine's required methane number, and the method it is stated in, come from the engine's declared "
           "datasheet.")
    g.row += 1
    g.calc("Methane number needed", "=KNOCK_MN_REQUIRED(t_mixture,p_boost_bar,compression_ratio,t_mixture_ref,"
           "p_boost_ref_bar,methane_number_ref,compression_ratio)", "-", name="mn_needed", fmt="0.0")
    g.calc("Shaft power", "=electrical_kw/generator_efficiency", "kW", name="shaft_kw", fmt="0")
    g.calc("BMEP", "=ENGINE_BMEP(shaft_kw,displacement_l,speed_rpm,4)", "bar", name="bmep_bar", fmt="0.0")
    g.calc("Generator pole pairs", "=GEN_POLE_PAIRS(frequency_hz,speed_rpm)", "-", name="pole_pairs", fmt="0")

    e = b.sheet("Exhaust", "Exhaust: computed beside the declared figures")
    e.calc("Exhaust mass flow (wet), computed", f'=EXH_FLOW(fuel_power_kw,air_ratio,gas_names,gas_amounts,"net",{AMB})',
           "kg/h", name="exhaust_flow_calc", fmt="0", note="declared value on the datasheet sheet")
    e.calc("Water dew point of the exhaust", f"=EXH_DEWPOINT(air_ratio,gas_names,gas_amounts,1.01325,{AMB})",
           "°C", name="t_dew_exhaust", fmt="0.0")
    e.calc("Exhaust heat, turbine outlet to the stack (declared flow)",
           f"=EXH_HEAT(exhaust_flow_kg_h,t_exhaust_in,t_stack,{MIX})", "kW", name="q_exhaust_calc", fmt="0.0")
    e.calc("Exhaust loss at the stack temperature, above 25 °C",
           f"=EXH_LOSS(exhaust_flow_kg_h,t_stack,{MIX.replace('gas_amounts,', 'gas_amounts,25,')})", "kW",
           name="q_exhaust_loss_calc", fmt="0.0")
    e.calc("O2 in the exhaust (dry)", f'=EXH_COMPOSITION(air_ratio,gas_names,gas_amounts,"O2","dry",{AMB})',
           "-", name="o2_dry", fmt="0.00%")
    e.calc("Exhaust capacity rate (mean, turbine outlet to stack)", "=q_exhaust_calc/(t_exhaust_in-t_stack)",
           "kW/K", name="c_exhaust_kw_k", fmt="0.000")
    _emissions(e)


def _emissions(e) -> None:
    """The permit's limits converted (EMIS_CONVERT, EXH_DRY_VOLUME) and the acid dew point beside the stack."""
    e.heading("Emission limits converted (invented permit; dry exhaust at the reference O2 of the Inputs)")
    e.calc("Dry exhaust per kWh of fuel at the reference O2 (F-factor)",
           '=EXH_DRY_VOLUME(gas_names,gas_amounts,o2_reference_pct,"net")', "Nm³/kWh (net)", name="dry_volume_ref",
           fmt="0.0000")
    e.calc("Dry exhaust flow at the reference O2, full load", "=dry_volume_ref*fuel_power_kw", "Nm³/h",
           name="dry_flow_ref", fmt="0")
    e.calc("Dry exhaust flow at the engine's own O2, full load",
           '=EXH_DRY_VOLUME(gas_names,gas_amounts,100*o2_dry,"net")*fuel_power_kw', "Nm³/h", name="dry_flow_actual",
           fmt="0")
    for sp, word, lim in (("nox", "NOx", "nox_limit_mg_nm3"), ("co", "CO", "co_limit_mg_nm3")):
        label = "NOx (as NO2)" if sp == "nox" else "CO"
        e.calc(f"{label} limit", f"={lim}", "mg/Nm³ (dry, ref. O2)", fmt="0")
        e.calc(f"{label} limit in ppm", f'=EMIS_CONVERT({lim},"mg/Nm3","ppm","{word}",gas_names,gas_amounts,'
               'o2_reference_pct)', "ppm (dry, ref. O2)", name=f"{sp}_ppm", fmt="0.0")
        e.calc(f"{label} limit per kWh of electricity", f'=EMIS_CONVERT({lim},"mg/Nm3","g/kWh","{word}",gas_names,'
               'gas_amounts,o2_reference_pct,electrical_kw/fuel_power_kw,"net")', "g/kWh (electrical)",
               name=f"out_{sp}_g_kwh", result=sp == "nox", fmt="0.000")
        e.calc(f"{label} at the limit, full load", f"=out_{sp}_g_kwh*electrical_kw/1000", "kg/h",
               name=f"{sp}_kg_h", fmt="0.00",
               note=f'="same as limit × dry flow: "&TEXT({lim}*dry_flow_ref/1E6,"0.00")')
    e.note("Emission guarantees come from the engine's declared data; permits follow local law.")
    e.heading("Acid dew point beside the stack temperature")
    e.calc("H2S in the gas analysis", '=SUMIF(gas_names,"hydrogen sulfide",gas_amounts)+SUMIF(gas_names,"H2S",'
           'gas_amounts)+SUMIF(gas_names,"hydrogen sulphide",gas_amounts)', "mol-%", name="h2s_pct", fmt="0.0000")
    e.calc("Sulphuric-acid dew point (Verhoff & Banchero 1974)",
           f'=IF(h2s_pct>0,TEXT(EXH_ACID_DEWPOINT(air_ratio,gas_names,gas_amounts,1.01325,{AMB}),"0.0")&'
           '" °C acid dew point, stack at "&TEXT(t_stack,"0")&" °C","no sulphur in the gas — no acid dew point")',
           "", name="acid_dewpoint", note="2 % of the sulphur as SO3 (common practice 1–5 %)")
    e.note("The invented pipeline gas's analysis holds no H2S (odorant sulphur, a few mg/m³, is not in it), so the "
           "stack is limited by the water dew point above.")


def _sizing(b: DemoBook) -> None:
    h = b.sheet("Exchangers", "Sizing at the design point (HT circuit first, then exhaust)")
    h.calc("Heat to the client at design (HT circuit + exhaust)", "=q_ht_kw+q_exhaust_calc", "kW",
           name="q_client_design", fmt="0.0")
    h.calc("Hot-water flow for the wanted flow temperature (at the return)",
           '=HW_FLOW(q_client_design,t_water_in,t_water_out,0,"ethylene")', "m³/h", name="water_flow_m3_h",
           fmt="0.00")
    h.calc("Engine outlet of the HT circuit", '=HW_ENGINE_LOOP(q_ht_kw,t_engine_in_max,engine_flow_m3_h,'
           't_water_in,water_flow_m3_h,0,"counter","t_engine_out",ht_glycol_fraction,"ethylene")', "°C",
           name="t_engine_out",
           fmt="0.00")
    h.calc("Water after the HT plate exchanger", '=HW_CHAIN(t_water_in,water_flow_m3_h,q_ht_kw,0,"ethylene",1)',
           "°C", name="t_water_after_ht", fmt="0.00")
    h.calc("HT plate exchanger UA needed", '=HX_UA(q_ht_kw,t_engine_out,t_engine_in_max,t_water_in,'
           't_water_after_ht,"counter")', "kW/K", name="ua_plate_needed", fmt="0.00")
    h.calc("HT plate exchanger UA with the surface margin", "=ua_plate_needed*(1+ua_margin)", "kW/K",
           name="ua_plate", fmt="0.00")
    h.calc("HT plate exchanger area", "=ua_plate*1000/u_plate_w_m2_k", "m²", name="out_area_plate", result=True,
           fmt="0.0")
    h.calc("Exhaust exchanger UA needed", "=HX_UA(q_exhaust_calc,t_exhaust_in,t_stack,t_water_after_ht,"
           "t_water_out,exhaust_arrangement)", "kW/K", name="ua_exhaust", fmt="0.00")
    h.calc("Exhaust exchanger area (gas side)", "=HX_AREA(q_exhaust_calc,u_exhaust_w_m2_k,t_exhaust_in,t_stack,"
           "t_water_after_ht,t_water_out,exhaust_arrangement)", "m²", name="out_area_exh", result=True, fmt="0.0")

    c = b.sheet("Coolers", "LT dry cooler and HT emergency cooler at the design ambient")
    c.calc("LT dry cooler UA (crossflow)", '=DRYCOOLER_UA(q_cac_lt_kw,t_lt_hot,t_lt_cold,t_ambient,t_air_out_lt,'
           '"cross",lt_glycol_fraction,"ethylene")', "kW/K", name="out_ua_lt_drycooler", fmt="0.00")
    c.calc("LT dry cooler air flow (at the air inlet)", "=DRYCOOLER_AIR_FLOW(q_cac_lt_kw,t_ambient,t_air_out_lt,"
           "rh_ambient,p_ambient_bar)", "m³/h", name="air_flow_lt", fmt="0")
    c.calc("Mixture intake reachable at the design ambient?",
           '=IF(AND(t_lt_cold>=t_ambient+min_approach_k,t_mixture>=t_lt_cold+min_approach_k),'
           '"OK: "&TEXT(t_mixture,"0")&" °C intake from "&TEXT(t_lt_cold,"0")&" °C coolant, "&'
           'TEXT(t_ambient,"0")&" °C air",'
           '"NOT REACHABLE: intake needs coolant at or below "&TEXT(t_mixture-min_approach_k,"0.0")&'
           '" °C, the dry cooler gives no less than "&TEXT(t_ambient+min_approach_k,"0.0")&" °C")', "",
           name="lt_reachable")
    c.calc("HT emergency cooler UA for the whole HT duty", '=DRYCOOLER_UA(q_ht_kw,t_engine_out,t_engine_in_max,'
           't_ambient,t_air_out_ht,"cross",ht_glycol_fraction,"ethylene")', "kW/K", name="ua_ht_dump", fmt="0.00")
    c.calc("HT emergency cooler air flow", "=DRYCOOLER_AIR_FLOW(q_ht_kw,t_ambient,t_air_out_ht,rh_ambient,"
           "p_ambient_bar)", "m³/h", name="air_flow_ht", fmt="0")


def _grid(s, r0: int, c0: int, rows, fmt="0.00") -> None:
    """Declared values (sand fill, boxed) from row r0, column c0 of a calculation sheet."""
    for i, row in enumerate(rows):
        for j, v in enumerate(row):
            c = s.ws.cell(r0 + i, c0 + j, v)
            c.border = _BOX
            c.number_format = fmt if j or c0 > 2 else "0"
            if not (isinstance(v, str) and v.startswith("=")):
                c.fill = _INPUT_FILL


def _site(b: DemoBook) -> None:
    s = b.sheet("Site rating", "Site rating: pressure, declared derating, methane number and part load")
    for col in "BCDEFGHI":
        s.ws.column_dimensions[col].width = 15
    s.note("Declared tables of the invented engine (invented figures, as its datasheet would give them). A spare "
           "blank row and column end each table:")
    s.note("TABLE_INTERP and TABLE_INTERP2 ignore them, and refuse to extrapolate beyond a table.")
    s.heading("Site")
    s.calc("Site altitude (Inputs)", "=site_altitude_m", "m", fmt="0")
    s.calc("Standard-atmosphere pressure at the site (ISO 2533)", "=SITE_PRESSURE(site_altitude_m)", "bar(a)",
           name="out_site_pressure", result=True, fmt="0.0000")
    s.calc("Design-day weather correction (Inputs)", "=p_ambient_offset_bar", "bar", fmt="0.000")
    s.calc("Ambient pressure used on every sheet (Inputs)", "=p_ambient_bar", "bar(a)", fmt="0.0000",
           note="the standard atmosphere + the correction")
    s.calc("Design intake-air temperature (Inputs: design-day ambient)", "=t_ambient", "°C", fmt="0.0")

    s.heading("Declared derating by altitude and intake-air temperature [factor on the declared output]")
    r0 = s.row
    s.ws.cell(r0, 1, "altitude [m] ↓ · intake air [°C] →")
    _grid(s, r0, 3, [DERATE_TEMPERATURES + (None,)], "0")
    rows = [(a,) + f + (None,) for a, f in zip(DERATE_ALTITUDES, DERATE)] + [(None,) * 8]
    _grid(s, r0 + 1, 2, rows)
    last_r, last_c = r0 + len(rows), "I"
    b.name("derate_altitudes", f"'Site rating'!$B${r0 + 1}:$B${last_r}")
    b.name("derate_temperatures", f"'Site rating'!$C${r0}:${last_c}${r0}")
    b.name("derate_table", f"'Site rating'!$C${r0 + 1}:${last_c}${last_r}")
    s.row = last_r + 2

    s.heading("Declared derating by methane number, and declared part load (net calorific value)")
    r0 = s.row
    for col, text in ((2, "MN"), (3, "factor"), (5, "load [%]"), (6, "el. efficiency"),
                      (7, "th. efficiency")):
        c = s.ws.cell(r0, col, text)
        c.font = Font(bold=True)
        c.alignment = Alignment(horizontal="right")
    _grid(s, r0 + 1, 2, list(MN_DERATE) + [(None, None)])
    _grid(s, r0 + 1, 5, list(PART_LOAD) + [(None, None, None)], "0.000")
    for i in range(len(PART_LOAD) + 1):
        s.ws.cell(r0 + 1 + i, 5).number_format = "0"
    last_mn, last_pl = r0 + len(MN_DERATE) + 1, r0 + len(PART_LOAD) + 1
    b.name("mn_axis", f"'Site rating'!$B${r0 + 1}:$B${last_mn}")
    b.name("mn_factors", f"'Site rating'!$C${r0 + 1}:$C${last_mn}")
    b.name("part_load_axis", f"'Site rating'!$E${r0 + 1}:$E${last_pl}")
    b.name("part_load_el", f"'Site rating'!$F${r0 + 1}:$F${last_pl}")
    b.name("part_load_th", f"'Site rating'!$G${r0 + 1}:$G${last_pl}")
    s.row = max(last_mn, last_pl) + 1
    s.note("The 100 % row is the datasheet's full load: electrical output, and HT circuit + exhaust to 120 °C, "
           "over the fuel input.")

    s.heading("Available power at the site")
    s.calc("Factor for altitude and intake temperature (TABLE_INTERP2)", "=TABLE_INTERP2(site_altitude_m,t_ambient,"
           "derate_altitudes,derate_temperatures,derate_table)", "-", name="site_factor", fmt="0.000")
    s.calc("Factor for the gas's methane number (default method)", "=TABLE_INTERP(mn_gas,mn_axis,mn_factors)", "-",
           name="mn_factor", fmt="0.000")
    s.calc("Factor at the lowest methane number of the methods", "=TABLE_INTERP(mn_lowest,mn_axis,mn_factors)", "-",
           name="mn_factor_low", fmt="0.000")
    s.calc("Available site power (declared output × factors)", "=electrical_kw*site_factor*mn_factor", "kW",
           name="out_site_power", result=True, fmt="0")
    s.calc("Available site power at the lowest methane number", "=electrical_kw*site_factor*mn_factor_low", "kW",
           name="out_site_power_mn_low", fmt="0")
    s.calc("Declared output available at the site?", '=IF(MIN(out_site_power,out_site_power_mn_low)>=electrical_kw,'
           '"OK: the declared "&TEXT(electrical_kw,"0")&" kW at this site and gas",'
           '"DERATED to "&TEXT(MIN(out_site_power,out_site_power_mn_low),"0")&" kW: the plant balance uses the '
           'declared output")', "", name="site_power_check")
    s.note("The factors multiply, per the invented datasheet's combination rule; follow the engine's own datasheet "
           "(some take the lowest factor).")

    s.heading("Part load (TABLE_INTERP in the declared table; output at the available site power)")
    r = s.table_row("load", ["el. efficiency", "th. efficiency", "electrical [kW]", "fuel [kW]"])
    for col in range(2, 6):
        s.ws.cell(r, col).alignment = Alignment(horizontal="right")
    for load in PART_LOADS:
        el = f"TABLE_INTERP({load},part_load_axis,part_load_el)"
        s.table_row(f"{load} %", [f"={el}", f"=TABLE_INTERP({load},part_load_axis,part_load_th)",
                                  f"={load}/100*out_site_power", f"={load}/100*out_site_power/{el}"], "", "0.000")
        r = s.row - 1
        b.name(f"part_load_el_{load}", f"'Site rating'!$B${r}")
        b.name(f"part_load_th_{load}", f"'Site rating'!$C${r}")
        for col in (4, 5):
            s.ws.cell(r, col).number_format = "0"
    s.note("Derating and part-load figures come from the engine's declared datasheet; these are invented.")


def _order_block(s, title: str, order_cells: list, prefix: str) -> dict:
    """One rated chain (two stages) on the Rated-order sheet; per-cell HW_CHAIN_RATE, no array formulas."""
    s.heading(title)
    src = s.table_row("heat source", order_cells)
    cols = ("B", "C")

    def per(expr_exhaust, expr_loop):
        return [f'=IF({c}{src}="exhaust",{expr_exhaust},{expr_loop})' for c in cols]

    # strict: the drop-down's two words only; any other word reaches the chain, which refuses it by name
    kinds = s.table_row("stage kind", [f'=IF({c}{src}="{SOURCES[1]}","stream",IF({c}{src}="{SOURCES[0]}","loop",'
                                       f'"not a heat source: "&{c}{src}))' for c in cols])
    # a loop's source inlet and capacity rate, and a stream's declared heat, are shown but not used
    t_in = s.table_row("source in [°C] (used for streams)", per("t_exhaust_in", "t_engine_out"), "°C", "0.0")
    c_src = s.table_row("source capacity rate [kW/K] (used for streams)",
                        per("c_exhaust_kw_k", "q_ht_kw/(t_engine_out-t_engine_in_max)"), "kW/K", "0.000")
    ua = s.table_row("UA [kW/K]", per("ua_exhaust", "ua_plate"), "kW/K", "0.00")
    duty = s.table_row("declared heat [kW] (used for loops)", per("q_exhaust_kw", "q_ht_kw"), "kW", "0.0")
    rng = {k: f"$B${r}:$C${r}" for k, r in (("kinds", kinds), ("t_in", t_in), ("c", c_src), ("ua", ua),
                                             ("duty", duty))}
    base = (f"t_water_in,water_flow_m3_h,{rng['t_in']},{rng['c']},{rng['ua']},\"counter\",\"{{w}}\",0,"
            f"\"ethylene\",{rng['kinds']},{rng['duty']},t_engine_in_max,engine_flow_m3_h,{{k}},ht_glycol_fraction,"
            "\"ethylene\"")
    rows = {}
    for word, label, unit, fmt in (("duty", "heat to the client's water", "kW", "0.0"),
                                   ("dump", "heat to the dump cooler", "kW", "0.0"),
                                   ("t_in", "water entering", "°C", "0.0"),
                                   ("t_out", "water leaving", "°C", "0.0"),
                                   ("t_hot_in", "source entering (loop: engine outlet)", "°C", "0.0"),
                                   ("t_hot_out", "source leaving the exchanger", "°C", "0.0")):
        rows[word] = s.table_row(label, [f"=HW_CHAIN_RATE({base.format(w=word, k=k)})" for k in (1, 2)], unit,
                                 fmt)
    # the source's cold end: the engine inlet limit for a loop, the rated gas outlet for the exhaust
    cold = s.table_row("source outlet limit for the check", [
        f'=IF({c}{src}="exhaust",{c}{rows["t_hot_out"]},t_engine_in_max)' for c in cols], "°C", "0.0")
    q = f"$B${rows['duty']}:$C${rows['duty']}"
    twice = f"$B${src}=$C${src}"
    s.calc("Heat to the client", f"=IF({twice},NA(),SUM({q}))", "kW", name=f"{prefix}_heat", fmt="0.0",
           note="#N/A when the order names one heat source twice")
    s.calc("Dump heat of the HT circuit", f"=SUM($B${rows['dump']}:$C${rows['dump']})", "kW",
           name=f"{prefix}_dump", fmt="0.0")
    s.calc("Water to the client", f"=$C${rows['t_out']}", "°C", name=f"{prefix}_t_flow", fmt="0.0")
    s.calc("Exhaust leaving its exchanger", f'=IF($B${src}="exhaust",$B${rows["t_hot_out"]},$C${rows["t_hot_out"]})',
           "°C", name=f"{prefix}_t_stack", fmt="0.0")
    s.calc("Check of both ends of each stage", f'=IF({twice},"CHECK: the same heat source twice ("&$B${src}&")",'
           f"HW_CHAIN_CHECK(t_water_in,water_flow_m3_h,{q},"
           f"$B${rows['t_hot_in']}:$C${rows['t_hot_in']},min_approach_k,0,\"ethylene\",$B${cold}:$C${cold}))", "",
           name=f"{prefix}_check")
    return rows


def _rated(b: DemoBook) -> None:
    s = b.sheet(SHEET_RATED, "The sized exchangers rated in both orders (HW_CHAIN_RATE with an engine loop)")
    s.note("The HT circuit is an engine loop: it rejects its declared duty, the plate exchanger passes what the "
           "client's water takes, the dump cooler the rest.")
    s.note("The exhaust is a rated stream (turbine-outlet temperature, mean capacity rate, UA); flow at the "
           "return temperature.")
    _order_block(s, "Chosen order (Inputs: order_1, order_2)", ["=order_1", "=order_2"], "rated_a")
    _order_block(s, "Reversed order", [ORDER[1], ORDER[0]], "rated_b")
    s.note("Reversed, the exhaust heats the water first: the HT plate exchanger then sees warmer water, the "
           "engine loop gives less and its dump cooler takes the rest; the exhaust leaves colder.")


def _balance(b: DemoBook) -> None:
    p = b.sheet("Balance", "Plant balance on the net calorific value (chosen order)")
    p.table_row("heat flows leaving the plant [kW]", ["=rated_a_heat", "=rated_a_dump", "=q_cac_lt_kw"], "kW",
                "0.0")
    heat = f"'Balance'!$B${p.row - 1}:$D${p.row - 1}"
    p.note("Heat to the client, dump heat of the HT circuit, LT charge-air heat to the dry cooler.")
    p.calc("Exhaust loss at the rated stack temperature, above 25 °C",
           f"=EXH_LOSS(exhaust_flow_kg_h,rated_a_t_stack,{MIX.replace('gas_amounts,', 'gas_amounts,25,')})", "kW",
           name="out_exhaust_loss", fmt="0.0")
    p.calc("Radiation and generator loss (declared)", "=q_radiation_kw+q_generator_loss_kw", "kW",
           name="other_losses", fmt="0.0")
    p.calc("Balance check", f"=CHP_BALANCE_CHECK(fuel_power_kw,electrical_kw,{heat},out_exhaust_loss,other_losses)",
           "", name="out_balance_check")
    p.calc("Fuel power", "=fuel_power_kw", "kW", name="out_fuel_power", fmt="0")
    p.calc("Electrical output", "=electrical_kw", "kW", name="out_electrical", fmt="0")
    p.calc("Heat to the client", "=rated_a_heat", "kW", name="out_heat_to_client", fmt="0")
    p.calc("Heat dumped (HT dump cooler + LT dry cooler)", "=rated_a_dump+q_cac_lt_kw", "kW",
           name="out_dump_heat", fmt="0")
    p.calc("Electrical efficiency", '=CHP_BALANCE(fuel_power_kw,electrical_kw,out_heat_to_client,"electrical")', "-",
           name="eta_el", fmt="0.0%")
    p.calc("Thermal efficiency (useful heat)", '=CHP_BALANCE(fuel_power_kw,electrical_kw,out_heat_to_client,'
           '"thermal")', "-", name="eta_th", fmt="0.0%")
    p.calc("Total efficiency", '=CHP_BALANCE(fuel_power_kw,electrical_kw,out_heat_to_client,"total")', "-",
           name="out_eta_total", result=True, fmt="0.0%")
    p.calc("Heat rate", "=CHP_HEAT_RATE(eta_el)", "kJ/kWh", name="out_heat_rate", fmt="0")
    p.calc("Primary energy savings (Directive 2012/27/EU Annex II)", '=CHP_PES(eta_el,eta_th,,,pes_fuel,'
           'construction_year,"hot-water",voltage_kv,onsite_share)', "-", name="out_pes", result=True, fmt="0.0%",
           note="references of Delegated Regulation (EU) 2015/2402, Annex IV grid-loss factor")


def build(path: str) -> None:
    b = DemoBook("Tender calculation — Ashcombe Vale district heating (invented)",
                 "One gas-engine set on pipeline gas: a declared datasheet that adds up, fuel, charge air, knock "
                 "margin, engine loop and exhaust in the chosen order, coolers, a first-law check and PES.")
    _inputs(b)
    _datasheet(b)
    _gas_and_air(b)
    _site(b)
    _sizing(b)
    _rated(b)
    _balance(b)

    r = b.sheet("Results", "Tender summary — Ashcombe Vale district heating (invented)")
    r.calc("Balance check (first law, net calorific value)", "=out_balance_check", "")
    r.calc("Datasheet check", "=datasheet_check", "")
    r.calc("Site altitude / standard-atmosphere pressure", '=TEXT(site_altitude_m,"0")&" m / "&'
           'TEXT(out_site_pressure,"0.000")&" bar(a)"', "")
    r.calc("Available site power (declared × site and MN factors)", "=out_site_power", "kW", result=True, fmt="0")
    r.calc("Electrical output (declared)", "=out_electrical", "kW", fmt="0")
    r.calc("Fuel power (net)", "=out_fuel_power", "kW", fmt="0")
    r.calc("Fuel gas flow (net calorific value, 25/0)", "=out_fuel_flow", "m³/h (0 °C)", result=True, fmt="0.0")
    r.calc("Methane number: default method / lowest method / needed", '=TEXT(mn_gas,"0.0")&" / "&TEXT(mn_lowest,'
           '"0.0")&" / "&TEXT(mn_needed,"0.0")', "-")
    r.calc("Knock margin at the intake temperature (default MN)", "=out_knock_k", "K", result=True, fmt="0.0")
    r.calc("Knock margin at the lowest methane number", "=out_knock_k_mn_low", "K", result=True, fmt="0.0")
    r.calc("Charge-air condensation", "=dew_check", "")
    r.calc("Heat to the client (chosen order)", "=out_heat_to_client", "kW", result=True, fmt="0")
    r.calc("Heat dumped (HT dump cooler + LT dry cooler)", "=out_dump_heat", "kW", result=True, fmt="0")
    r.calc("Hot-water flow / temperature to the client", '=TEXT(water_flow_m3_h,"0.0")&" m³/h / "&'
           'TEXT(rated_a_t_flow,"0.0")&" °C"', "")
    r.calc("Check of the chosen order", "=rated_a_check", "")
    r.calc("Exhaust to the stack (rated) / loss", '=TEXT(rated_a_t_stack,"0.0")&" °C / "&TEXT(out_exhaust_loss,'
           '"0")&" kW"', "")
    r.calc("HT plate exchanger area", "=out_area_plate", "m²", fmt="0.0")
    r.calc("Exhaust exchanger area (gas side)", "=out_area_exh", "m²", fmt="0.0")
    r.calc("LT dry cooler UA / air flow", '=TEXT(out_ua_lt_drycooler,"0.0")&" kW/K / "&TEXT(air_flow_lt,"0")&'
           '" m³/h"', "")
    r.calc("Mixture intake at the design ambient", "=lt_reachable", "")
    r.calc("Electrical / thermal / total efficiency",
           '=TEXT(eta_el,"0.0%")&" / "&TEXT(eta_th,"0.0%")&" / "&TEXT(out_eta_total,"0.0%")', "-")
    r.calc("Primary energy savings", "=out_pes", "-", result=True, fmt="0.0%")
    r.calc("NOx limit per kWh of electricity", '=TEXT(nox_limit_mg_nm3,"0")&" mg/Nm³ at "&TEXT(o2_reference_pct,'
           '"0")&" % O2 = "&TEXT(out_nox_g_kwh,"0.00")&" g/kWh"', "")
    r.calc("Acid dew point", "=acid_dewpoint", "")
    r.calc("Computed with cellfuncs", "=CELLFUNCS_VERSION()", "")
    b.finish()
    b.save(path)


def summary(v: dict) -> list:
    def f(name, d=1):
        x = v.get(name)
        return f"{x:.{d}f}" if isinstance(x, float) else str(x)

    return [f"fuel {f('out_fuel_flow')} m³/h; knock margin {f('out_knock_k')} K; heat to client "
            f"{f('out_heat_to_client', 0)} kW; dumped {f('out_dump_heat', 0)} kW; PES {f('out_pes', 3)}; "
            f"total efficiency {f('out_eta_total', 3)}",
            f"site {f('out_site_pressure', 4)} bar, {f('out_site_power', 0)} kW available; lowest MN "
            f"{f('mn_lowest')}, knock margin there {f('out_knock_k_mn_low')} K; NOx {f('out_nox_g_kwh', 2)} g/kWh",
            f"balance: {v.get('out_balance_check')}",
            f"chosen order: {v.get('rated_a_check')}",
            f"reversed order: {v.get('rated_b_check')}; HT dump {f('rated_b_dump', 0)} kW"]
