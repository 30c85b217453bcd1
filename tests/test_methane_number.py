"""Methane number: EN 16726:2015 Annex A partial-mixture method and the linear correlation.

Vectors: tests/vectors/methane_number.csv (definition of the scale, the annex's CO/H2 binary and
inert polynomial, published pure-gas values, the Kubesh, King & Liss (1992) formula).  The
sanity values and check notes quoted inside cellfuncs/data/en16726_annex_a.json (the figures'
transcription) are reproduced here as well.
"""

import json
import math

import pytest
from hypothesis import assume, given, settings, strategies as st

from cellfuncs.errors import CellInputError
from cellfuncs.gas import methane_number as mnm
from cellfuncs.gas import mn_diagrams as dg
from cellfuncs.gas.methane_number import (
    basis_text, en16726_details,
    methane_number, methane_number_linear,
)
from cellfuncs.gas.mn_split import split_combustibles
from gas_cases import call_entry
from vectors import approx, params

NG = {"CH4": 90.0, "C2H6": 6.0, "C3H8": 2.0, "nC4H10": 0.5, "iC4H10": 0.5, "N2": 1.0}


@pytest.mark.parametrize("row", params("methane_number"))
def test_vectors(row):
    assert call_entry(row["function"], row) == approx(row)


# ---------------------------------------------------------------------------
# the figures: provenance kept, polynomials reproduce the transcription's own values


def test_data_file_keeps_provenance_and_doubts():
    d = json.loads(dg.DATA_FILE.read_text(encoding="utf-8"))
    assert d["source"].startswith("EN 16726:2015 Annex A")
    assert "unverified" in d["provenance"].lower() or "not been checked" in d["provenance"]
    assert any("D06" in q for q in d["open_questions"])
    assert any("a22" in q for q in d["open_questions"])
    assert d["lumping"]["factors"]["n-C5H12"] == 2.3
    assert d["lumping"]["factors"]["C6+ (hexanes and higher)"] == 5.3
    assert len(d["diagrams"]) == 18


def test_inert_polynomial_sanity_values():
    """sanity_values.inert_polynomial of the data file (the transcription's own figures)."""
    sv = dg.annex()["sanity_values"]["inert_polynomial"]
    p = dg.inert_diagram()
    assert p.value(100, 0) == pytest.approx(sv["P(100,0)"], abs=5e-5)
    assert p.value(90, 10) == pytest.approx(sv["P(90,10)"], abs=0.005)
    assert p.value(60, 40) == pytest.approx(sv["P(60,40)"], abs=0.005)
    assert p.value(90, 0) == pytest.approx(sv["P(90,0) (10 % N2)"], abs=0.005)


def test_co_h2_binary_sanity_values():
    """sanity_values.CO_H2_binary of the data file."""
    sv = dg.annex()["sanity_values"]["CO_H2_binary"]
    d14 = dg.diagram("D14")
    assert d14.value(100, 0) == pytest.approx(sv["100/0"], abs=1e-9)
    assert d14.value(50, 50) == pytest.approx(sv["50/50"], abs=1e-9)
    assert d14.value(0, 100) == pytest.approx(sv["0/100"], abs=1e-9)


def test_check_notes_reproduced():
    """check_notes of the data file: D01 CH4-H2 edge within 0.8 of MN = % CH4; D05 CH4 corner
    96.7; D06 72.4 at 80/20 and pure-H2 corner 3.1; D12 ends 99.3 / 18.9."""
    d01, d05, d06, d12 = (dg.diagram(c) for c in ("D01", "D05", "D06", "D12"))
    worst = max(abs(d01.value(x, 100 - x) - x) for x in range(0, 101))
    assert round(worst, 1) <= 0.8  # the note quotes one decimal
    assert d05.value(100, 0) == pytest.approx(96.7, abs=0.05)
    assert d06.value(80, 20) == pytest.approx(72.4, abs=0.05)
    assert d06.value(0, 100) == pytest.approx(3.1, abs=0.05)
    assert d12.value(100, 0) == pytest.approx(99.3, abs=0.05)
    assert d12.value(0, 100) == pytest.approx(18.9, abs=0.05)


def test_pure_gas_corners_near_published_values():
    """sanity_values.note: CH4 100, H2 0, CO 75, C2H6 43.7, C3H8 33, n-C4 10 (common practice)."""
    for cid, ref in (("CH4", 100), ("H2", 0), ("CO", 75), ("C2H6", 43.7), ("C3H8", 33),
                     ("nC4H10", 10)):
        assert methane_number({cid: 1.0}) == pytest.approx(ref, abs=1.0)


def test_d01_rays_to_hydrogen_corner_are_monotone():
    """The hydrogen-carried plan inverts D01 rays without a table: check they fall monotonically."""
    d01 = dg.diagram("D01")
    for x0 in range(0, 101, 5):
        prev = None
        for k in range(0, 201):
            t = k / 200
            v = d01.value(x0 * (1 - t), 100 * t)
            if prev is not None:
                assert v < prev
            prev = v


# ---------------------------------------------------------------------------
# the split


GASES = {
    "natural gas": NG,
    "natural gas + 20 % H2": {"CH4": 72, "C2H6": 5, "C3H8": 1.5, "nC4H10": 0.5, "H2": 20, "N2": 1},
    "lean gas with pentanes": {"CH4": 87.34, "C2H6": 7, "C3H8": 2.2, "nC4H10": 0.41, "nC5H12": 0.11,
                               "nC6H14": 0.2, "N2": 0.74, "CO2": 2.0},
    "hydrogen-rich": {"H2": 70, "CH4": 15, "C2H6": 5, "C3H8": 5, "nC4H10": 5},
    "wood gas": {"H2": 18, "CO": 20, "CH4": 3, "CO2": 12, "N2": 47},
    "biogas": {"CH4": 60, "CO2": 38, "N2": 1.5, "O2": 0.5, "H2S": 0.02},
    "LPG": {"C3H8": 95, "C2H6": 2, "nC4H10": 3},
    "H2 with traces": {"H2": 96, "CH4": 3, "nC4H10": 1},
}


@pytest.mark.parametrize("name", sorted(GASES))
def test_split_has_equal_mn_and_closes_the_balance(name):
    r = en16726_details(GASES[name])
    used: dict = {}
    for p in r.partials:
        assert p.mn == pytest.approx(r.mn_combustibles, abs=0.01)
        am = dict(p.amounts)
        ch4_min = dg.TRUSTED_CH4_MIN if p.code in ("D09", "D10", "D11") else None
        assert dg.diagram(p.code).outside(am, ch4_min) == ""
        for g, v in am.items():
            assert v >= 0
            used[g] = used.get(g, 0.0) + v
    assert math.fsum(used.values()) == pytest.approx(100.0, abs=1e-6)
    assert r.mn == pytest.approx(r.mn_combustibles + r.inert_term, abs=1e-12)


def test_typical_gases_avoid_d06_and_say_so():
    for name in ("natural gas", "natural gas + 20 % H2", "lean gas with pentanes", "biogas"):
        r = en16726_details(GASES[name])
        assert "D06" not in r.diagram_shares
        assert "D06 not used" in basis_text(GASES[name])


def test_result_leaning_on_d06_is_flagged():
    """96 % H2 with butane: butane's only partner at MN < 9.9 is D06 (the doubtful diagram)."""
    g = GASES["H2 with traces"]
    r = en16726_details(g)
    assert "D06" in r.diagram_shares
    text = basis_text(g)
    assert "CAUTION" in text and "D06" in text


def test_split_is_deterministic():
    a = en16726_details(GASES["natural gas + 20 % H2"]).mn
    mnm._en16726.cache_clear()
    b = en16726_details(GASES["natural gas + 20 % H2"]).mn
    assert a == b


def test_methane_hydrogen_binary_edge_is_d01():
    """CH4/H2 blends sit on the D01 edge, which the transcription says is within 0.8 of MN = % CH4."""
    for ch4 in (95, 80, 60, 40, 20, 5):
        r = en16726_details({"CH4": ch4, "H2": 100 - ch4})
        assert set(r.diagram_shares) == {"D01"}
        assert r.mn == pytest.approx(ch4, abs=0.8)


def test_no_split_is_an_error_naming_the_limit():
    with pytest.raises(CellInputError, match="components: .*no split"):
        methane_number({"CH4": 90, "CO": 10})  # CO's only diagram is CO/H2 (MN <= 75)
    with pytest.raises(CellInputError, match="components: .*H2S"):
        split_combustibles((("H2S", 100.0),))


# ---------------------------------------------------------------------------
# pre-treatment: dry and O2-free, lumping, Ar/He


def test_water_and_oxygen_are_removed_and_the_rest_renormalised():
    wet = dict(NG, H2O=3.0, O2=1.0)
    assert methane_number(wet) == pytest.approx(methane_number(NG), abs=1e-12)


def test_butane_equivalent_lumping():
    """pentanes x 2.3, hexanes and heavier x 5.3 (EN 16726:2015 Annex A lumping, data file)."""
    base = {"CH4": 99.0}
    m5 = methane_number(dict(base, nC5H12=1.0))
    assert m5 == pytest.approx(methane_number(dict(base, nC4H10=2.3)), abs=1e-9)
    assert methane_number(dict(base, neoC5H12=1.0)) == pytest.approx(m5, abs=1e-9)
    m6 = methane_number(dict(base, nC6H14=1.0))
    assert m6 == pytest.approx(methane_number(dict(base, nC4H10=5.3)), abs=1e-9)
    assert methane_number(dict(base, nC8H18=1.0)) == pytest.approx(m6, abs=1e-9)


def test_argon_and_helium_count_as_nitrogen():
    a = methane_number(dict(NG, N2=0.5, Ar=0.3, He=0.2))
    assert a == pytest.approx(methane_number(NG), abs=1e-12)
    assert "counted as nitrogen" in basis_text(dict(NG, N2=0.5, Ar=0.5))


@pytest.mark.parametrize("gas, pattern", [
    ({"CH4": 90, "nC5H12": 3.5, "C2H6": 6.5}, r"pentanes 3.5 vol-% are above 3 vol-%"),
    ({"CH4": 90, "nC6H14": 3.2, "C2H6": 6.8}, r"hexanes and heavier 3.2 vol-% are above 3 vol-%"),
    ({"CH4": 90, "iC5H12": 2.5, "nC7H16": 2.6, "C2H6": 4.9}, r"5.1 vol-% are above 5 vol-% together"),
    ({"CH4": 95, "NH3": 5}, r"ammonia \(NH3\) is not covered"),
    ({"CH4": 95, "Ar": 1.5, "N2": 3.5}, r"argon \(Ar\).*above the 1 vol-%"),
    ({"CH4": 30, "CO2": 70}, r"combustibles 30 vol-% are below 35 vol-%"),
    ({"CH4": 34, "N2": 66}, r"combustibles 34 vol-% are below 35"),
    ({"CH4": 36, "N2": 64, "He": 0}, None),
])
def test_en16726_limits(gas, pattern):
    """Method limits C5 <= 3, C6+ <= 3, together <= 5 vol-% (ASTM D8221 scope text on EN 16726
    Annex A, data file lumping notes); inert diagram domain combustibles >= 35 vol-% (data file);
    NH3 not covered and Ar + He <= 1 vol-% counted as N2 (our documented treatment)."""
    if pattern is None:
        assert math.isfinite(methane_number(gas))
        return
    with pytest.raises(CellInputError, match="components: EN16726: .*" + pattern):
        methane_number(gas)


# ---------------------------------------------------------------------------
# monotonicity (hypothesis), inside the domains: natural gas with up to 25 % hydrogen


@st.composite
def natural_gases(draw):
    return {
        "CH4": draw(st.floats(70, 100)), "C2H6": draw(st.floats(0, 10)),
        "C3H8": draw(st.floats(0, 4)), "nC4H10": draw(st.floats(0, 1)),
        "iC4H10": draw(st.floats(0, 0.5)), "nC5H12": draw(st.floats(0, 0.2)),
        "H2": draw(st.sampled_from([0.0, 5.0, 12.0, 25.0])), "N2": draw(st.floats(0, 8)),
        "CO2": draw(st.floats(0, 5)),
    }


@settings(max_examples=60, deadline=None)
@given(natural_gases(), st.sampled_from(["C2H6", "C3H8", "nC4H10", "H2", "CO2", "N2"]),
       st.sampled_from([0.05, 1.0]))
def test_monotonic(gas, cid, add):
    """Adding ethane, propane, butane or hydrogen lowers MN; adding CO2 or N2 raises it."""
    m0 = methane_number(gas)
    more = dict(gas)
    more[cid] = more[cid] + add
    m1 = methane_number(more)
    if cid in ("CO2", "N2"):
        assert m1 > m0
    else:
        assert m1 < m0


@settings(max_examples=40, deadline=None)
@given(st.floats(0.0, 1.0))
def test_hydrogen_blend_lowers_mn_over_the_whole_range(h):
    """Blending hydrogen into a natural gas lowers MN, across the switch between plans."""
    assume(h < 0.999)
    ng = {"CH4": 92, "C2H6": 5, "C3H8": 2, "nC4H10": 1}
    a = methane_number({**{k: v * (1 - h) for k, v in ng.items()}, "H2": 100 * h})
    h2 = min(h + 0.02, 1.0)
    b = methane_number({**{k: v * (1 - h2) for k, v in ng.items()}, "H2": 100 * h2})
    assert b < a


# ---------------------------------------------------------------------------
# linear method


def test_linear_formula():
    """Kubesh, King & Liss (1992): MON linear in the mole fractions, MN = 1.624 MON - 119.1."""
    g = {"CH4": 88.0, "C2H6": 5.0, "C3H8": 2.0, "nC4H10": 0.6, "iC4H10": 0.4, "CO2": 1.5, "N2": 2.5}
    mon = (137.78 * 0.88 + 29.948 * 0.05 - 18.193 * 0.02 - 167.062 * 0.01 + 181.233 * 0.015
           + 26.994 * 0.025)
    assert methane_number_linear(g) == pytest.approx(1.624 * mon - 119.1, rel=1e-12)


@pytest.mark.parametrize("gas, pattern", [
    ({"CH4": 90, "H2": 10}, r"hydrogen \(H2\) is outside"),
    ({"CH4": 90, "CO": 10}, r"carbon monoxide \(CO\) is outside"),
    ({"CH4": 99, "H2S": 1}, r"hydrogen sulfide \(H2S\) is outside"),
    ({"CH4": 65, "C2H6": 35}, r"methane 65 vol-% is below 70 vol-%"),
    ({"CH4": 90, "nC5H12": 3.5, "C2H6": 6.5}, r"pentanes 3.5 vol-% are above 3"),
])
def test_linear_refuses(gas, pattern):
    with pytest.raises(CellInputError, match="components: linear: " + pattern):
        methane_number(gas, "linear")


# ---------------------------------------------------------------------------
# cell wrappers, caching, text


def cell_methane_number(*values):
    from cellfuncs import adapt, catalogue

    return adapt.call(catalogue.by_name("GAS_METHANE_NUMBER"), values)


def cell_methane_number_basis(*values):
    from cellfuncs import adapt, catalogue

    return adapt.call(catalogue.by_name("GAS_METHANE_NUMBER_BASIS"), values)


def test_cell_functions_parse_the_composition():
    names = (("methane",), ("ethane",), ("propane",), ("n-butane",), ("isobutane",), ("nitrogen",))
    amounts = ((90.0,), (6.0,), (2.0,), (0.5,), (0.5,), (1.0,))
    two_col = tuple((n[0], a[0]) for n, a in zip(names, amounts))
    ref = methane_number(NG)
    assert cell_methane_number(names, amounts, "en16726") == pytest.approx(ref, abs=1e-12)
    assert cell_methane_number(two_col, None, "en16726") == pytest.approx(ref, abs=1e-12)
    assert cell_methane_number(two_col, None, "EN 16726") == pytest.approx(ref, abs=1e-12)
    assert cell_methane_number(two_col, None, "linear") == pytest.approx(
        methane_number_linear(NG), abs=1e-12)
    text = cell_methane_number_basis(two_col, None, "en16726")
    assert text.startswith("EN 16726 Annex A") and "Table A.10" in text
    assert "104.7" in cell_methane_number_basis(two_col, None, "linear")


def test_bad_method_names_the_argument():
    with pytest.raises(CellInputError, match='method: "octane"'):
        methane_number(NG, "octane")


def test_results_are_cached():
    mnm._en16726.cache_clear()
    en16726_details(NG)
    en16726_details(dict(NG))
    info = mnm._en16726.cache_info()
    assert info.hits >= 1 and info.misses == 1


def test_a22_doubt_is_reported_with_co2():
    text = basis_text({"CH4": 90, "CO2": 10})
    assert "a22 sign unverified" in text
    r = en16726_details({"CH4": 90, "CO2": 10})
    a22 = dg.inert_diagram().rows[2][2]
    assert r.a22_spread == pytest.approx(-2 * a22 * 90**2 * 10**2, rel=1e-12)
