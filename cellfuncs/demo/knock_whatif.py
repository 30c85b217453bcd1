"""Demo workbook ``knock_whatif.xlsx``: knock margin and condensation on a hot, humid day.

Scenario (invented): the Quarry Lane heat-and-power plant on a hot, humid summer
day; one gas-engine set with a two-stage charge-air cooler (HT stage into the
heat-recovery circuit, LT stage to a dry cooler).  The workbook follows the
mixture through the compressor and both cooler stages, compares the intake
temperature with the mixture's dew point, and tabulates the knock margin over
mixture temperature and methane number, and over the ambient temperature and
humidity (through the charge-air chain), with charts.
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
ARGS_MIX = "air_ratio,gas_names,gas_amounts,t_amb,rh_amb,p_amb"


def build(path: str) -> None:
    b = DemoBook("Knock margin what-if — Quarry Lane plant on a hot, humid day (invented)",
                 "Charge-air chain (compressor, HT and LT cooler stages), dew point against the intake "
                 "temperature, knock margin over mixture temperature, methane number and ambient.")
    b.input_heading("Site (invented hot, humid day)")
    b.input("t_amb", "Ambient air temperature", 34, "°C")
    b.input("rh_amb", "Ambient relative humidity", 0.65, "-", "fraction 0–1")
    b.input("p_amb", "Ambient pressure", 0.98, "bar(a)")
    b.input_heading("Engine (values as from a declared datasheet; invented here)")
    b.input("fuel_kw", "Fuel power (net)", 2900, "kW")
    b.input("air_ratio", "Air ratio λ (engine datasheet)", 1.9, "-")
    b.input("p_boost", "Boost pressure after the compressor", 3.4, "bar(a)")
    b.input("eta_c", "Compressor isentropic efficiency", 0.78, "-")
    b.input("cr", "Compression ratio (effective)", 12.0, "-",
            "use the effective ratio for early/late inlet-valve closing")
    b.input("t_ref", "Reference point: mixture temperature", 50, "°C", "rated knock-free point (datasheet)")
    b.input("p_ref", "Reference point: boost pressure", 3.4, "bar(a)")
    b.input("mn_ref", "Reference point: methane number", 80, "-")
    b.input("k_mn", "Mixture-temperature shift per MN point", 0.8, "K", "uncertain (±30 %): use engine data")
    b.input_heading("Charge-air cooler")
    b.input("t_after_ht", "Mixture after the HT stage", 92, "°C")
    b.input("t_intake", "Mixture after the LT stage (intake)", 45, "°C")
    b.input("dry_approach", "Dry-cooler approach (LT water above ambient)", 8, "K", "invented demo figure")
    b.input("lt_approach", "LT-stage approach (mixture above LT water)", 7, "K", "invented demo figure")
    b.input_table("Gas analysis", ("component", "mol-%"), GAS, ("gas_names", "gas_amounts"), unit="mol-%",
                  note="invented pipeline gas")

    c = b.sheet("Chain", "Charge-air chain at the site conditions")
    c.calc("Methane number of the gas (EN 16726:2015 Annex A)", "=GAS_METHANE_NUMBER(gas_names,gas_amounts)",
           "-", name="mn_gas", fmt="0.0")
    c.calc("Mixture mass flow (dry air + water vapour + gas)",
           '=CAC_MIXTURE_FLOW(fuel_kw,air_ratio,gas_names,gas_amounts,"net",t_amb,rh_amb,p_amb,"mixture")',
           "kg/h", name="mix_flow", fmt="0")
    c.calc("Compressor outlet temperature", "=TURBO_T_OUT(t_amb,p_amb,p_boost,eta_c,air_ratio,gas_names,"
           "gas_amounts,t_amb,rh_amb)", "°C", name="t_comp_out", fmt="0.0")
    c.calc("HT stage duty (compressor outlet → after HT)",
           f"=CAC_DUTY(mix_flow,t_comp_out,t_after_ht,p_boost,{ARGS_MIX})", "kW", name="out_ht_duty",
           result=True, fmt="0.0")
    c.calc("LT stage duty (after HT → intake)", f"=CAC_DUTY(mix_flow,t_after_ht,t_intake,p_boost,{ARGS_MIX})",
           "kW", name="out_lt_duty", result=True, fmt="0.0")
    c.calc("Dew point of the mixture at boost pressure", f"=CAC_DEWPOINT(p_boost,{ARGS_MIX})", "°C",
           name="out_dewpoint", result=True, fmt="0.0")
    c.calc("Intake temperature above the dew point", "=t_intake-out_dewpoint", "K", name="dew_margin", fmt="0.0")
    c.calc("Condensate in the LT stage", f"=CAC_CONDENSATE(mix_flow,t_intake,p_boost,{ARGS_MIX})", "kg/h",
           name="out_condensate", fmt="0.0")
    c.calc("Condensation check", '=IF(dew_margin>0,"OK: intake above the dew point",'
           '"CONDENSATE: separate and drain it, or raise the intake temperature")', "", name="dew_check")
    c.calc("Knock margin at the intake temperature", "=KNOCK_MARGIN(t_intake,p_boost,cr,mn_gas,t_ref,p_ref,"
           "mn_ref,cr,\"K\",k_mn)", "K", name="out_margin_k", result=True, fmt="0.0")
    c.calc("Knock margin in methane-number points", "=KNOCK_MARGIN(t_intake,p_boost,cr,mn_gas,t_ref,p_ref,"
           "mn_ref,cr,\"MN\",k_mn)", "-", name="out_margin_mn", fmt="0.0")
    c.calc("Highest mixture temperature for this gas", "=KNOCK_T_LIMIT(p_boost,cr,mn_gas,t_ref,p_ref,mn_ref,cr,"
           "k_mn)", "°C", name="out_t_limit", result=True, fmt="0.0")
    c.calc("Methane number needed at the intake temperature", "=KNOCK_MN_REQUIRED(t_intake,p_boost,cr,t_ref,"
           "p_ref,mn_ref,cr,k_mn)", "-", name="out_mn_required", fmt="0.0")
    c.note("Knock margin is a screening index calibrated to one declared point; the engine's knock control "
           "and derating data govern.")

    g = b.sheet("Knock grid", "Knock margin [K] over mixture temperature and methane number")
    head = g.table_row("mixture °C \\ methane number", list(MNS))
    first = g.row
    for t in T_MIX:
        r = g.row
        g.table_row(t, [f"=KNOCK_MARGIN($A{r},p_boost,cr,{chr(66 + j)}${head},t_ref,p_ref,mn_ref,cr,\"K\",k_mn)"
                        for j in range(len(MNS))], "K", "0.0")
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
    head = a.table_row("ambient °C", ["intake °C", "knock margin K"] + [f"dew point °C, rh {rh:.0%}" for rh in RHS])
    first = a.row
    for t in T_AMB:
        r = a.row
        cells = [f"=$A{r}+dry_approach+lt_approach",
                 f"=KNOCK_MARGIN(B{r},p_boost,cr,mn_gas,t_ref,p_ref,mn_ref,cr,\"K\",k_mn)"]
        cells += [f"=CAC_DEWPOINT(p_boost,air_ratio,gas_names,gas_amounts,$A{r},{rh},p_amb)" for rh in RHS]
        a.table_row(t, cells, "", "0.0")
    last = a.row - 1
    chart2 = ScatterChart()
    chart2.title = "Knock margin and dew point against ambient temperature"
    chart2.style = 13
    chart2.x_axis.title = "ambient temperature [°C]"
    chart2.y_axis.title = "[K] / [°C]"
    xs = Reference(a.ws, min_col=1, min_row=first, max_row=last)
    for col in range(3, 4 + len(RHS) + 1):
        ys = Reference(a.ws, min_col=col, min_row=head, max_row=last)
        chart2.series.append(Series(ys, xs, title_from_data=True))
    chart2.width, chart2.height = 18, 9
    a.ws.add_chart(chart2, f"A{last + 3}")

    res = b.sheet("Results", "Knock and condensation summary — Quarry Lane (invented)")
    res.calc("Methane number of the gas", "=mn_gas", "-", fmt="0.0")
    res.calc("Compressor outlet temperature", "=t_comp_out", "°C", fmt="0.0")
    res.calc("HT stage duty", "=out_ht_duty", "kW", result=True, fmt="0.0")
    res.calc("LT stage duty", "=out_lt_duty", "kW", result=True, fmt="0.0")
    res.calc("Dew point at boost pressure", "=out_dewpoint", "°C", result=True, fmt="0.0")
    res.calc("Condensation check", "=dew_check", "")
    res.calc("Knock margin at the intake temperature", "=out_margin_k", "K", result=True, fmt="0.0")
    res.calc("Highest mixture temperature for this gas", "=out_t_limit", "°C", result=True, fmt="0.0")
    b.finish()
    b.save(path)


def summary(v: dict) -> list:
    def f(name, d=1):
        x = v.get(name)
        return f"{x:.{d}f}" if isinstance(x, float) else str(x)

    return [f"cooler: HT {f('out_ht_duty')} kW, LT {f('out_lt_duty')} kW; dew point {f('out_dewpoint')} °C, "
            f"condensate {f('out_condensate', 2)} kg/h",
            f"knock margin {f('out_margin_k')} K ({f('out_margin_mn')} MN); mixture limit {f('out_t_limit')} °C"]
