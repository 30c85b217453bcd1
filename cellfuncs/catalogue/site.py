"""Catalogue entries of site conditions and declared datasheet tables (SITE_, TABLE_)."""

from cellfuncs.catalogue.spec import Arg, CellFunction

CATEGORY = "cellfuncs · site and datasheet"

_TABLE_RULES = ("strictly increasing or decreasing; blanks at the end are ignored, so the table "
                "may have spare rows")

ENTRIES = [
    CellFunction(
        name="SITE_PRESSURE",
        target="cellfuncs.site.atmosphere:site_pressure",
        category=CATEGORY,
        description="Ambient pressure of the ISO 2533 standard atmosphere at a site's altitude "
                    "(troposphere). The altitude is geopotential; a height above sea level differs "
                    "by under 0.1 % of the pressure below 5,000 m. The day's weather differs more.",
        args=(Arg("altitude_m", "Site altitude (geopotential), -500 to 5,000", "m"),),
        returns="standard-atmosphere pressure [bar(a)]",
        example=(450.0,),
    ),
    CellFunction(
        name="TABLE_INTERP",
        target="cellfuncs.site.tables:table_interp",
        category=CATEGORY,
        description="Linear interpolation in a declared table (derating, part load): x inside the "
                    "table's range (no extrapolation), x_values strictly monotonic, trailing blanks "
                    "ignored. Table values come from the engine's declared datasheet.",
        args=(Arg("x", "Where to read the table, inside the range of x_values", "-"),
              Arg("x_values", "One column (or row) of table x values, " + _TABLE_RULES,
                  kind="axis"),
              Arg("y_values", "The tabulated values, one per x value (trailing blanks ignored)",
                  kind="axis")),
        returns="interpolated value [unit of y_values]",
        example=(1250.0, [[0.0], [1000.0], [2000.0], [None]], [[1.0], [0.96], [0.89], [None]]),
    ),
    CellFunction(
        name="TABLE_INTERP2",
        target="cellfuncs.site.tables:table_interp2",
        category=CATEGORY,
        description="Bilinear interpolation in a declared grid (e.g. derating by altitude down the "
                    "rows and intake temperature across the columns): no extrapolation, axes "
                    "strictly monotonic, trailing blanks ignored. Values from the engine's datasheet.",
        args=(Arg("x", "Value on the row axis, inside the range of x_values", "-"),
              Arg("y", "Value on the column axis, inside the range of y_values", "-"),
              Arg("x_values", "Row axis: a column of values, one per table row, " + _TABLE_RULES,
                  kind="axis"),
              Arg("y_values", "Column axis: a row of values, one per table column, strictly "
                  "increasing or decreasing (trailing blanks ignored)", kind="axis"),
              Arg("table", "The tabulated grid, rows matching x_values and columns matching "
                  "y_values (spare blank rows and columns at the end ignored)", kind="table")),
        returns="interpolated value [unit of table]",
        example=(750.0, 32.0, [[0.0], [500.0], [1000.0]], [[25.0, 30.0, 35.0, 40.0]],
                 [[1.0, 1.0, 0.98, 0.95], [1.0, 0.99, 0.96, 0.93], [0.98, 0.96, 0.93, 0.90]]),
    ),
]
