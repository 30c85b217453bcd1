"""Catalogue entries of the methane-number functions (EN 16726:2015 Annex A, linear correlation)."""

from cellfuncs.catalogue.spec import Arg, CellFunction

CATEGORY = "cellfuncs · gas"

# the same composition arguments as every GAS_ function
from cellfuncs.catalogue.gas import _AMOUNTS, _COMPONENTS  # noqa: E402

_METHOD = Arg(
    "method",
    '"en16726": EN 16726:2015 Annex A (dry, O2-free; C5 and C6+ at most 3 vol-% each, 5 % '
    'together); "linear": Kubesh, King & Liss 1992, pipeline natural gas only (no H2, '
    "CO, H2S; CH4 >= 70 %; 104.7 for pure methane)",
    kind="option", default="en16726", options=("en16726", "linear"),
    aliases={"en16726:2015": "en16726", "annexa": "en16726", "kubesh": "linear",
             "sae922359": "linear"},
)

_EXAMPLE = ([["methane", 90.0], ["ethane", 6.0], ["propane", 2.0], ["n-butane", 0.5],
             ["isobutane", 0.5], ["nitrogen", 1.0]], None, "en16726")

_NOTE = " Estimate for tendering; the engine's MN limit is on its datasheet."

ENTRIES = [
    CellFunction(
        name="GAS_METHANE_NUMBER",
        target="cellfuncs.gas.methane_number:methane_number",
        category=CATEGORY,
        description="Methane number (knock resistance) of a gas by EN 16726:2015 Annex A "
                    "(partial mixtures) or the linear Kubesh, King & Liss (1992) correlation; "
                    "error outside the method's limits." + _NOTE,
        args=(_COMPONENTS, _AMOUNTS, _METHOD),
        returns="methane number [-]",
        example=_EXAMPLE,
    ),
    CellFunction(
        name="GAS_METHANE_NUMBER_BASIS",
        target="cellfuncs.gas.methane_number:basis_text",
        category=CATEGORY,
        description="One line of text on what GAS_METHANE_NUMBER leans on: EN 16726 Annex A "
                    "diagrams and their shares, inert correction, and cautions (doubtful "
                    "diagram D06, sign of term a22, figures unverified against Table A.10).",
        args=(_COMPONENTS, _AMOUNTS, _METHOD),
        returns="text [-]",
        example=_EXAMPLE,
    ),
]
