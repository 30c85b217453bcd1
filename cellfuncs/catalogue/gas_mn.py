"""Catalogue entries of the methane-number functions (EN 16726:2015 Annex A, linear correlation)."""

from cellfuncs.catalogue.spec import Arg, CellFunction

CATEGORY = "cellfuncs · gas"

# the same composition arguments as every GAS_ function
from cellfuncs.catalogue.gas import _AMOUNTS, _COMPONENTS  # noqa: E402

_METHOD = Arg(
    "method",
    '"en16726": EN 16726 Annex A; "linear", "hc_ratio": Kubesh, King & Liss 1992 '
    "(pipeline gas), MN from MON by the paper or by ISO 15403-1 (_iso15403)",
    kind="option", default="en16726",
    options=("en16726", "linear", "linear_iso15403", "hc_ratio", "hc_ratio_iso15403"),
    aliases={"en16726:2015": "en16726", "annexa": "en16726", "kubesh": "linear",
             "sae922359": "linear", "hc": "hc_ratio"},
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
                    "(partial mixtures) or the Kubesh, King & Liss (1992) linear or H/C "
                    "correlations; error outside a method's limits." + _NOTE,
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


# ---- the spread between methods (cellfuncs.gas.mn_correlations) ----

ENTRIES.append(CellFunction(
    name="GAS_METHANE_NUMBER_SPREAD",
    target="cellfuncs.gas.mn_correlations:spread",
    category=CATEGORY,
    description="Highest minus lowest methane number over the methods valid for the gas (EN 16726 "
                "Annex A; Kubesh, King & Liss 1992 linear and H/C MON, each with the paper's and "
                "ISO 15403-1's MON-to-MN); error if fewer than two apply.",
    args=(_COMPONENTS, _AMOUNTS,
          Arg("result", '"spread" (highest - lowest), "lowest", "highest", "count" (methods that '
              'apply) or "methods" (text: each method\'s MN)', kind="option", default="spread",
              options=("spread", "lowest", "highest", "count", "methods"))),
    returns="methane-number spread [-]",
    example=(_EXAMPLE[0], None, "spread"),
))
