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
    "HW_CP": (70.0, 0.0, "ethylene"),
    "HW_DENSITY": (90.0, 0.0, "ethylene"),
    "HW_FLOW": (1000.0, 70.0, 90.0, 0.0, "ethylene"),
    "HW_DUTY": (43.0, 70.0, 90.0, 0.0, "ethylene"),
    "EXH_FLOW": (2500.0, 1.8, NAMES, AMOUNTS, "net", 25.0, 0.3, 1.0),
    "EXH_COMPOSITION": (1.8, NAMES, AMOUNTS, "o2", "dry", 25.0, 0.3, 1.0),
    "EXH_HEAT": (5000.0, 450.0, 180.0, 1.8, NAMES, AMOUNTS, 25.0, 0.3, 1.0),
    "EXH_DEWPOINT": (1.8, NAMES, AMOUNTS, 1.01325, 25.0, 0.3, 1.0),
    "EXH_O2_CORRECT": (120.0, 8.5, 5.0),
    "GEN_SPEED": (50.0, 2),
    "GEN_POLE_PAIRS": (60.0, 1800.0),
    "ENGINE_BMEP": (1000.0, 48.7, 1500.0, 4),
    "ENGINE_POWER": (18.0, 48.7, 1500.0, 4),
    "CHP_HEAT_RATE": (0.42,),
    "CELLFUNCS_VERSION": (),
}
