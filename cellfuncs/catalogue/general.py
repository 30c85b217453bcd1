"""Catalogue entries of general use: unit conversion and the package version."""

from cellfuncs.catalogue.spec import Arg, CellFunction

CATEGORY = "cellfuncs · general"

ENTRIES: list = [
    CellFunction(
        name="UNIT_CONVERT",
        target="cellfuncs.units:convert",
        category=CATEGORY,
        description=(
            "Converts a value between units (pint): temperatures with offsets, kWh, MJ, MMBtu, "
            "therm, kcal, hp, bar, mbar, psi, inH2O; bar(g) and psig are gauge against 1.01325 bar."),
        args=(
            Arg("value", "The value to convert, in unit_given"),
            Arg("unit_given", "Unit the value is given in, e.g. \"°C\", \"kWh\", \"bar(g)\"",
                kind="text"),
            Arg("unit_wanted", "Unit wanted, e.g. \"°F\", \"MJ\", \"psi\"", kind="text"),
        ),
        returns="the value in unit_wanted [unit_wanted]",
    ),
    CellFunction(
        name="CELLFUNCS_VERSION",
        target="cellfuncs.units:version",
        category=CATEGORY,
        description="The installed cellfuncs version, so that a tender workbook records what computed it.",
        args=(),
        returns="version text [-]",
    ),
]
