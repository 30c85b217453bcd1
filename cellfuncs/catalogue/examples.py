"""One valid call per cell function, as a cell would pass the arguments.

Used for the ``example`` field of the catalogue entries of families that did
not give one inline: the reliability test mutates them one argument at a time
and the benchmarks time them.  The gas is a plain pipeline-type natural gas
(common practice, not a specific supply).
"""

NAMES = [["methane"], ["ethane"], ["propane"], ["nitrogen"], ["carbon dioxide"]]
AMOUNTS = [[92.0], [4.5], [1.0], [1.5], [1.0]]
U_AMOUNTS = [[0.05], [0.02], [0.01], [0.02], [0.01]]

EXAMPLES = {
    "GAS_COMPONENTS": (3.0,),
    "GAS_MOLAR_MASS": (NAMES, AMOUNTS),
    "GAS_Z": (NAMES, AMOUNTS, 15.0, 1.01325),
    "GAS_CV": (NAMES, AMOUNTS, "net", "volume", "15/15"),
    "GAS_WOBBE": (NAMES, AMOUNTS, "gross", "15/15"),
    "GAS_DENSITY": (NAMES, AMOUNTS, 15.0),
    "GAS_REL_DENSITY": (NAMES, AMOUNTS, 15.0),
    "GAS_CV_UNCERTAINTY": (NAMES, AMOUNTS, U_AMOUNTS, "gross", "volume", "15/15", 2.0),
    "GAS_AIR_REQUIREMENT": (NAMES, AMOUNTS, "mass"),
    "GAS_CO2_FACTOR": (NAMES, AMOUNTS, "net", 25.0),
    "GAS_FUEL_FLOW": (NAMES, AMOUNTS, 2500.0, "net", "25/0"),
    "GAS_FUEL_POWER": (NAMES, AMOUNTS, 250.0, "net", "25/0"),
    "CAC_MIXTURE_FLOW": (2500.0, 1.8, NAMES, AMOUNTS, "net", 25.0, 0.3, 1.0, "mixture"),
    "TURBO_T_OUT": (25.0, 1.0, 3.0, 0.78, 1.8, NAMES, AMOUNTS, 25.0, 0.3),
    "CAC_DEWPOINT": (3.0, 1.8, NAMES, AMOUNTS, 25.0, 0.6, 1.0),
    "CAC_DUTY": (6000.0, 180.0, 90.0, 3.0, 1.8, NAMES, AMOUNTS, 25.0, 0.6, 1.0),
    "CAC_CONDENSATE": (6000.0, 40.0, 3.0, 1.8, NAMES, AMOUNTS, 30.0, 0.8, 1.0),
    "KNOCK_MARGIN": (45.0, 3.0, 12.0, 80.0, 50.0, 3.0, 80.0),
    "KNOCK_T_LIMIT": (3.0, 12.0, 75.0, 50.0, 3.0, 80.0),
    "KNOCK_MN_REQUIRED": (45.0, 3.0, 12.0, 50.0, 3.0, 80.0),
    "UNIT_CONVERT": (20.0, "°C", "°F"),
    "CELLFUNCS_VERSION": (),
}
