"""Demo workbook ``knock_whatif.xlsx``: knock margin and condensation on a hot, humid day.

Scenario (invented): the Quarry Lane heat-and-power plant on a hot, humid summer
day; one gas-engine set with a two-stage charge-air cooler (HT stage into the
heat-recovery circuit, LT stage to a dry cooler).  The workbook follows the
mixture through the compressor and both cooler stages, compares the intake
temperature with the mixture's dew point, and tabulates the knock margin over
mixture temperature and methane number, and over the ambient temperature and
humidity (through the charge-air chain), with charts.  Beside the default
methane number it shows the spread over the published methods and the knock
margin at the lowest of them (issue 12).
"""

from __future__ import annotations

from openpyxl.chart import Reference, ScatterChart, Series

from cellfuncs.demo.book import DemoBook

FILENAME = "knock_whatif.xlsx"
EXPECTED_ERRORS: set = set()

GAS = [("methane", 90.1), ("ethane", 5.6), ("propane", 1.6), ("n-butane", 0.35), ("isobutane", 0.25),
       ("nitrogen", 1.2), ("carbon dioxide", 0.9)]
T_MIX = (35, 40, 45, 50, 55, 60)
MNS = (60, 70, 80, 90, 100)
T_AMB = (10, 15, 20, 25, 30, 35, 40, 45)
RHS = (0.3, 0.6, 0.9)
ARGS_MIX = "air_ratio,gas_names,gas_amounts,t_ambient,rh_ambient,p_ambient_bar"
#: the declared reference point of the knock functions (the compression ratio is the same as the site's)
KNOCK_REF = "t_mixture_ref,p_boost_ref_bar,methane_number_ref,compression_ratio"


def build(path: str) -> None:
    b = DemoBook("Knock margin what-if — Quarry Lane plant on a hot, humid day (invented)",
                 "Charge-air chain (compressor, HT and LT cooler stages), dew point against the intake "
                 "temperature, knock margin over mixture temperature, methane number and ambient.")
    b.input_heading("Site (invented hot, humid day)")
    b.input("t_ambient", "Ambient air temperature", 34, "°C")
    b.input("rh_ambient", "Ambient relative humidity", 0.65, "-", "fraction 0–1")
    b.input("p_ambient_bar", "Ambient pressure", 0.98, "bar(a)")
    b.input_heading("Engine (values as from a declared datasheet; invented here)")
    b.input("fuel_power_kw", "Fuel power (net)", 2900, "kW")
    b.input("air_ratio", "Air excess ratio λ", 1.9, "-")
    b.input("p_boost_bar", "Boost pressure after the compressor", 3.4, "bar(a)")
    b.input("isentropic_efficiency", "Compressor isentropic efficiency", 0.78, "-")
    b.input("compression_ratio", "Compression ratio (effective)", 12.0, "-",
            "use the effective ratio for early/late inlet-valve closing")
    b.input("t_mixture_ref", "Reference point: mixture temperature", 50, "°C", "rated knock-free point (datasheet)")
    b.input("p_boost_ref_bar", "Reference point: boost pressure", 3.4, "bar(a)")
    b.input("methane_number_ref", "Reference point: methane number", 80, "-")
    b.input("k_per_mn", "Mixture-temperature shift per MN point", 0.8, "K", "uncertain (±30 %): use engine data")
    b.input_heading("Charge-air cooler")
    b.input("t_mixture_ht", "Mixture after the HT stage", 92, "°C")
    b.input("t_mixture", "Mixture after the LT stage (intake)", 45, "°C")
    b.input("drycooler_approach_k", "Dry-cooler approach (LT water above ambient)", 8, "K", "invented demo figure")
    b.input("lt_approach_k", "LT-stage approach (mixture above LT water)", 7, "K", "invented demo figure")
    b.input_table("Gas analysis", ("component", "mol-%"), GAS, ("gas_names", "gas_amounts"), unit="mol-%",
                  note="invented pipeline gas")

    c = b.sheet("Chain", "Charge-air chain at the site conditions")
    c.calc("Methane number of the gas (EN 16726:2015 Annex A)", "=GAS_METHANE_NUMBER(gas_names,gas_amounts)",
           "-", name="mn_gas", fmt="0.0")
    c.calc("Mixture mass flow (dry air + water vapour + gas)",
           '=CAC_MIXTURE_FLOW(fuel_power_kw,air_ratio,gas_names,gas_amounts,"net",t_ambient,rh_ambient,'
           'p_ambient_bar,"mixture")',
           "kg/h", name="mixture_flow_kg_h", fmt="0")
    c.calc("Compressor outlet temperature", "=TURBO_T_OUT(t_ambient,p_ambient_bar,p_boost_bar,isentropic_efficiency,"
           "air_ratio,gas_names,gas_amounts,t_ambient,rh_ambient)", "°C", name="t_air_out", fmt="0.0")
    c.calc("HT stage duty (compressor outlet → after HT)",
           f"=CAC_DUTY(mixture_flow_kg_h,t_air_out,t_mixture_ht,p_boost_bar,{ARGS_MIX})", "kW",
           name="out_ht_duty_kw", result=True, fmt="0.0")
    c.calc("LT stage duty (after HT → intake)",
           f"=CAC_DUTY(mixture_flow_kg_h,t_mixture_ht,t_mixture,p_boost_bar,{ARGS_MIX})", "kW",
           name="out_lt_duty_kw", result=True, fmt="0.0")
    c.calc("Dew point of the mixture at boost pressure", f"=CAC_DEWPOINT(p_boost_bar,{ARGS_MIX})", "°C",
           name="out_t_dew_mixture", result=True, fmt="0.0")
    c.calc("Intake temperature above the dew point", "=t_mixture-out_t_dew_mixture", "K", name="dew_margin_k",
           fmt="0.0")
    c.calc("Condensate in the LT stage", f"=CAC_CONDENSATE(mixture_flow_kg_h,t_mixture,p_boost_bar,{ARGS_MIX})",
           "kg/h", name="out_condensate_kg_h", fmt="0.0")
    c.calc("Condensation check", '=IF(dew_margin_k>0,"OK: intake above the dew point",'
           '"CONDENSATE: separate and drain it, or raise the intake temperature")', "", name="dew_check")
    c.calc("Knock margin at the intake temperature",
           f'=KNOCK_MARGIN(t_mixture,p_boost_bar,compression_ratio,mn_gas,{KNOCK_REF},"K",k_per_mn)', "K",
           name="out_knock_margin_k", result=True, fmt="0.0")
    c.calc("Knock margin in methane-number points",
           f'=KNOCK_MARGIN(t_mixture,p_boost_bar,compression_ratio,mn_gas,{KNOCK_REF},"MN",k_per_mn)', "-",
           name="out_knock_margin_mn", fmt="0.0")
    c.heading("Methane number by method: the spread and the knock margin at its lowest")
    c.calc("Methane-number spread (highest − lowest method)",
           "=GAS_METHANE_NUMBER_SPREAD(gas_names,gas_amounts,\"spread\")", "-", name="mn_spread", fmt="0.0")
    c.calc("Lowest methane number of the methods", "=GAS_METHANE_NUMBER_SPREAD(gas_names,gas_amounts,"
           "\"lowest\")", "-", name="mn_lowest", fmt="0.0")
    c.calc("Methods that apply to this gas", "=GAS_METHANE_NUMBER_SPREAD(gas_names,gas_amounts,\"count\")",
           "-", name="mn_methods_count", fmt="0")
    c.calc("Knock margin at the default MN (EN 16726 Annex A)", "=out_knock_margin_k", "K", fmt="0.0")
    c.calc("Knock margin at the lowest MN of the methods",
           f'=KNOCK_MARGIN(t_mixture,p_boost_bar,compression_ratio,mn_lowest,{KNOCK_REF},"K",k_per_mn)', "K",
           name="out_knock_margin_lowest_mn_k", result=True, fmt="0.0")
    c.calc("Each method's methane number", "=GAS_METHANE_NUMBER_SPREAD(gas_names,gas_amounts,\"methods\")",
           "", name="mn_methods")
    c.note("Published methods differ by 5–10 MN on the same gas (EN 16726 Annex A; Kubesh, King & Liss 1992 "
           "with the paper's or ISO 15403-1's MON-to-MN): judge the margin at the lowest.")
    c.note("The engine's required methane number, and the method it is stated in, come from the engine's "
           "declared datasheet.")
    c.heading("Mixture-temperature limit and required methane number")
    c.calc("Highest mixture temperature for this gas",
           f"=KNOCK_T_LIMIT(p_boost_bar,compression_ratio,mn_gas,{KNOCK_REF},k_per_mn)", "°C",
           name="out_t_mixture_limit", result=True, fmt="0.0")
    c.calc("Methane number needed at the intake temperature",
           f"=KNOCK_MN_REQUIRED(t_mixture,p_boost_bar,compression_ratio,{KNOCK_REF},k_per_mn)", "-",
           name="out_methane_number_required", fmt="0.0")
    c.note("Knock margin is a screening index calibrated to one declared point; the engine's knock control "
           "and derating data govern.")

    g = b.sheet("Knock grid", "Knock margin [K] over mixture temperature and methane number")
    head = g.table_row("mixture °C \\ methane number", list(MNS))
    first = g.row
    for t in T_MIX:
        r = g.row
        g.table_row(t, [f'=KNOCK_MARGIN($A{r},p_boost_bar,compression_ratio,{chr(66 + j)}${head},{KNOCK_REF},'
                        '"K",k_per_mn)' for j in range(len(MNS))], "K", "0.0")
    last = g.row - 1
    chart = ScatterChart()
    chart.title = "Knock margin against mixture temperature"
    chart.style = 13
    chart.x_axis.title = "mixture temperature after the cooler [°C]"
    chart.y_axis.title = "knock margin [K]"
    xs = Reference(g.ws, min_col=1, min_row=first, max_row=last)
    for j, mn in enumerate(MNS):
        ys = Reference(g.ws, min_col=2 + j, min_row=head, max_row=last)
        s = Series(ys, xs, title_from_data=True)
        chart.series.append(s)
    chart.width, chart.height = 18, 9
    g.ws.add_chart(chart, f"A{last + 3}")

    a = b.sheet("Ambient grid", "Through the charge-air chain: ambient temperature and humidity")
    a.note("Intake temperature = ambient + dry-cooler approach + LT-stage approach (demo assumption).")
    a.note("Condensate forms in the LT stage where the intake temperature is below the dew point.")
    head = a.table_row("ambient °C", ["intake °C", "knock margin K"]
                       + [f"dew point °C, rh {rh:.0%}" for rh in RHS])
    first = a.row
    for t in T_AMB:
        r = a.row
        cells = [f"=$A{r}+drycooler_approach_k+lt_approach_k",
                 f'=KNOCK_MARGIN(B{r},p_boost_bar,compression_ratio,mn_gas,{KNOCK_REF},"K",k_per_mn)']
        cells += [f"=CAC_DEWPOINT(p_boost_bar,air_ratio,gas_names,gas_amounts,$A{r},{rh},p_ambient_bar)"
                  for rh in RHS]
        a.table_row(t, cells, "", "0.0")
    last = a.row - 1
    xs = Reference(a.ws, min_col=1, min_row=first, max_row=last)
    dew = ScatterChart()
    dew.title = "Intake temperature against the mixture's dew point"
    dew.style = 13
    dew.x_axis.title = "ambient temperature [°C]"
    dew.y_axis.title = "temperature [°C]"
    # the intake temperature (solid, dark), then the dew point at each humidity (dashed, light to dark)
    for col, colour, dash in [(2, "1F3A5F", None)] + [(4 + j, c, "dash") for j, c in
                                                       enumerate(("E8A33D", "D0652B", "9E2A2B"))]:
        ys = Reference(a.ws, min_col=col, min_row=head, max_row=last)
        s = Series(ys, xs, title_from_data=True)
        s.graphicalProperties.line.solidFill = colour
        s.graphicalProperties.line.width = 28575 if dash is None else 19050
        if dash:
            s.graphicalProperties.line.dashStyle = dash
        s.smooth = False
        dew.series.append(s)
    dew.width, dew.height = 18, 9
    a.ws.add_chart(dew, f"A{last + 3}")
    knock = ScatterChart()
    knock.title = "Knock margin against ambient temperature"
    knock.style = 13
    knock.x_axis.title = "ambient temperature [°C]"
    knock.y_axis.title = "knock margin [K]"
    knock.series.append(Series(Reference(a.ws, min_col=3, min_row=head, max_row=last), xs,
                               title_from_data=True))
    knock.legend = None
    knock.width, knock.height = 18, 9
    a.ws.add_chart(knock, f"E{last + 3}")

    res = b.sheet("Results", "Knock and condensation summary — Quarry Lane (invented)")
    res.calc("Methane number of the gas", "=mn_gas", "-", fmt="0.0")
    res.calc("Compressor outlet temperature", "=t_air_out", "°C", fmt="0.0")
    res.calc("HT stage duty", "=out_ht_duty_kw", "kW", result=True, fmt="0.0")
    res.calc("LT stage duty", "=out_lt_duty_kw", "kW", result=True, fmt="0.0")
    res.calc("Dew point at boost pressure", "=out_t_dew_mixture", "°C", result=True, fmt="0.0")
    res.calc("Condensation check", "=dew_check", "")
    res.calc("Knock margin at the intake temperature", "=out_knock_margin_k", "K", result=True, fmt="0.0")
    res.calc("Methane-number spread over the methods", "=mn_spread", "-", fmt="0.0")
    res.calc("Lowest methane number of the methods", "=mn_lowest", "-", fmt="0.0")
    res.calc("Knock margin at the lowest methane number", "=out_knock_margin_lowest_mn_k", "K", result=True,
             fmt="0.0")
    res.calc("Highest mixture temperature for this gas", "=out_t_mixture_limit", "°C", result=True, fmt="0.0")
    res.note("Methane-number methods differ by 5–10 MN on the same gas (see Chain).")
    res.note("The engine's required MN, and its method, come from its declared datasheet.")
    b.finish()
    b.save(path)


def summary(v: dict) -> list:
    def f(name, d=1):
        x = v.get(name)
        return f"{x:.{d}f}" if isinstance(x, float) else str(x)

    return [f"cooler: HT {f('out_ht_duty_kw')} kW, LT {f('out_lt_duty_kw')} kW; "
            f"dew point {f('out_t_dew_mixture')} °C, condensate {f('out_condensate_kg_h', 2)} kg/h",
            f"knock margin {f('out_knock_margin_k')} K ({f('out_knock_margin_mn')} MN); "
            f"mixture limit {f('out_t_mixture_limit')} °C",
            f"methane number {f('mn_gas')} (default method), lowest {f('mn_lowest')} (spread {f('mn_spread')}); "
            f"knock margin at the lowest {f('out_knock_margin_lowest_mn_k')} K"]
