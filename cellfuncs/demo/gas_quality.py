"""Demo workbook ``gas_quality.xlsx``: invented gases side by side.

Four invented gases — a pipeline natural gas, a digester biogas, a landfill gas
and the pipeline gas blended with 20 % hydrogen — with every GAS_ property on
the chosen reference conditions, the uncertainty of the calorific value from
the analysis' uncertainties, the methane number, and the fuel flow for a given
fuel power.
"""

from __future__ import annotations

from openpyxl.styles import Font

from cellfuncs.demo.book import DemoBook

FILENAME = "gas_quality.xlsx"
EXPECTED_ERRORS: set = set()

GASES = ("Northfold grid gas", "Millbeck digester biogas", "Skelby Moor landfill gas",
         "Northfold gas + 20 % H2")
# mol-%; invented analyses (the blend is 80 % of the grid gas plus 20 % hydrogen)
ANALYSIS = [
    ("methane", 92.5, 62.0, 48.0, 74.0, 0.05),
    ("ethane", 4.2, 0, 0, 3.36, 0.02),
    ("propane", 0.9, 0, 0, 0.72, 0.005),
    ("n-butane", 0.15, 0, 0, 0.12, 0.002),
    ("isobutane", 0.12, 0, 0, 0.096, 0.002),
    ("n-pentane", 0.03, 0, 0, 0.024, 0.001),
    ("hydrogen", 0, 0, 0, 20.0, 0),
    ("nitrogen", 1.3, 1.2, 14.5, 1.04, 0.02),
    ("carbon dioxide", 0.8, 36.5, 36.0, 0.64, 0.01),
    ("oxygen", 0, 0.3, 1.5, 0, 0),
]
REFS = ("15/15", "25/0", "0/0", "15/0", "20/20", "25/15", "25/20")
COLS = "BCDE"


def _unit(base: str, kind: str = "kind", ref: str = "ref_conditions") -> str:
    """A unit cell that spells the calorific-value kind and reference conditions, e.g. MJ/m³ (net, 15/15)."""
    kind_text = f'"&{kind}&"' if kind == "kind" else kind
    return f'="{base} ({kind_text}, "&{ref}&")"'


def build(path: str) -> None:
    b = DemoBook("Gas quality — four invented gases side by side",
                 "ISO 6976:2016 properties, calorific-value uncertainty, methane number (EN 16726:2015 "
                 "Annex A), combustion air, CO2 factor and fuel flow.")
    b.input_heading("Reference conditions and plant")
    b.input("ref_conditions", "Reference conditions combustion/metering", "15/15", "°C/°C",
            "t1 combustion (0, 15, 20, 25) / t2 metering (0, 15, 20)", options=REFS)
    b.input("kind", "Calorific value kind", "net", "", "net = LHV, gross = HHV", options=("net", "gross"))
    b.input("fuel_ref_conditions", "Reference for the fuel flow", "25/0", "°C/°C",
            "datasheets state net fuel power, often at 25/0",
            options=REFS)
    b.input("fuel_power_kw", "Fuel power of the engine (datasheet)", 2900, "kW",
            "from the engine's declared datasheet (net)")
    b.input("coverage", "Coverage factor of the uncertainty", 2, "-", "2 ≈ 95 %")
    header = ("component",) + GASES + ("u(grid gas)",)
    b.input_table("Gas analyses (mol-%)", header, ANALYSIS,
                  ("gas_names", "gas_1", "gas_2", "gas_3", "gas_4", "gas_1_u"), unit="mol-%",
                  note="invented analyses; u = standard uncertainty of each amount")

    c = b.sheet("Properties", "Gas properties (ISO 6976:2016 on the chosen reference conditions)")
    c.calc("Reference conditions combustion/metering (Inputs)", "=ref_conditions", "°C/°C",
           note="Z, density and relative density use the metering temperature t2")
    c.row += 1
    c.table_row("", list(GASES), "")
    for j in range(4):
        c.ws.cell(c.row - 1, 2 + j).font = Font(bold=True)

    def row(label, template, unit, fmt="0.000", name_prefix=None):
        r = c.table_row(label, [template.format(g=f"gas_{i + 1}", i=i + 1) for i in range(4)], unit, fmt)
        if name_prefix:
            for i in range(4):
                b.name(f"{name_prefix}_{i + 1}", f"Properties!${COLS[i]}${r}")
        return r

    row("Sum of the analysis", "=SUM({g})", "mol-%", "0.00")
    row("Molar mass", "=GAS_MOLAR_MASS(gas_names,{g})", "kg/kmol", "0.000")
    row("Compression factor Z at metering", "=GAS_Z(gas_names,{g},ref_conditions)",
        "-", "0.00000")
    row("Calorific value (kind chosen), volume", "=GAS_CV(gas_names,{g},kind,\"volume\",ref_conditions)", _unit("MJ/m³"),
        "0.000", "out_cv")
    row("Gross calorific value, volume", "=GAS_CV(gas_names,{g},\"gross\",\"volume\",ref_conditions)",
        _unit("MJ/m³", "gross"))
    row("Net calorific value, volume", "=GAS_CV(gas_names,{g},\"net\",\"volume\",ref_conditions)",
        _unit("MJ/m³", "net"))
    row("Net calorific value, mass", "=GAS_CV(gas_names,{g},\"net\",\"mass\",ref_conditions)",
        _unit("MJ/kg", "net"))
    row("Gross calorific value, molar", "=GAS_CV(gas_names,{g},\"gross\",\"molar\",ref_conditions)",
        _unit("kJ/mol", "gross"), "0.00")
    row("Wobbe index (gross)", "=GAS_WOBBE(gas_names,{g},\"gross\",ref_conditions)", _unit("MJ/m³", "gross"),
        "0.000", "out_wobbe")
    row("Wobbe index (net)", "=GAS_WOBBE(gas_names,{g},\"net\",ref_conditions)", _unit("MJ/m³", "net"))
    row("Density at metering", "=GAS_DENSITY(gas_names,{g},ref_conditions)", "kg/m³",
        "0.0000")
    row("Relative density", "=GAS_REL_DENSITY(gas_names,{g},ref_conditions)", "-",
        "0.0000")
    row("Methane number (EN 16726:2015 Annex A)", "=GAS_METHANE_NUMBER(gas_names,{g})", "-", "0.0",
        "out_mn")
    row("Stoichiometric air, volume", "=GAS_AIR_REQUIREMENT(gas_names,{g},\"volume\")", "m³/m³")
    row("Stoichiometric air, mass", "=GAS_AIR_REQUIREMENT(gas_names,{g},\"mass\")", "kg/kg")
    row("CO2 factor (net, 25 °C)", "=GAS_CO2_FACTOR(gas_names,{g},\"net\",25)", "kg/MWh", "0.0")
    row("Fuel flow for the engine's fuel power",
        "=GAS_FUEL_FLOW(gas_names,{g},fuel_power_kw,\"net\",fuel_ref_conditions)",
        _unit("m³/h", "net", "fuel_ref_conditions"), "0.0", "out_fuel_flow")
    row("Check: fuel power of that flow",
        "=GAS_FUEL_POWER(gas_names,{g},out_fuel_flow_{i},\"net\",fuel_ref_conditions)",
        "kW", "0.0")
    c.heading("Uncertainty of the grid gas' calorific value (ISO 6976:2016 Annex B)")
    c.calc("Expanded uncertainty of the chosen calorific value",
           "=GAS_CV_UNCERTAINTY(gas_names,gas_1,gas_1_u,kind,\"volume\",ref_conditions,coverage)", _unit("MJ/m³"),
           name="out_cv_u_1", fmt="0.0000")
    c.calc("Relative expanded uncertainty", "=out_cv_u_1/out_cv_1", "-", fmt="0.00%")
    c.calc("Linear methane number of the grid gas", "=GAS_METHANE_NUMBER(gas_names,gas_1,\"linear\")", "-",
           "correlation of Kubesh, King & Liss (1992)", fmt="0.0")
    c.note("The EN 16726 figures come from an open transcription not verified against the standard's "
           "Table A.10; see docs/methods.md.")

    res = b.sheet("Results", "Gas quality summary (invented gases)")
    res.table_row("", list(GASES), "")
    res.table_row("Calorific value (kind and reference chosen)", [f"=out_cv_{i + 1}" for i in range(4)],
                  _unit("MJ/m³"), "0.00")
    res.table_row("Wobbe index (gross)", [f"=out_wobbe_{i + 1}" for i in range(4)], _unit("MJ/m³", "gross"),
                  "0.00")
    res.table_row("Methane number", [f"=out_mn_{i + 1}" for i in range(4)], "-", "0.0")
    res.table_row("Fuel flow for the engine", [f"=out_fuel_flow_{i + 1}" for i in range(4)],
                  _unit("m³/h", "net", "fuel_ref_conditions"), "0.0")
    b.finish()
    b.save(path)


def summary(v: dict) -> list:
    out = []
    for i, g in enumerate(GASES, start=1):
        cv, mn, ff = v.get(f"out_cv_{i}"), v.get(f"out_mn_{i}"), v.get(f"out_fuel_flow_{i}")

        def f(x, d=2):
            return f"{x:.{d}f}" if isinstance(x, float) else str(x)

        out.append(f"{g}: CV {f(cv)} MJ/m³, methane number {f(mn, 1)}, fuel flow {f(ff, 1)} m³/h")
    return out
