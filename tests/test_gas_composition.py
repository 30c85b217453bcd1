"""Composition parsing: range forms, mol% vs fractions, normalisation, bad input.

Rules: the project's composition-input rules (docs/methods.md) and ISO 6976:2016 clause 5
(mole fractions normalised to 1).
"""

import math

import pytest
from hypothesis import given, settings, strategies as st

from cellfuncs.errors import CellInputError, CellTypeError
from cellfuncs.gas.composition import (
    COMPONENT_IDS, Composition, accepted_names, component_id, paired_amounts, parse_composition,
)

EX1 = {"CH4": 0.933212, "C2H6": 0.025656, "C3H8": 0.015368, "N2": 0.010350, "CO2": 0.015414}

amounts = st.dictionaries(st.sampled_from(COMPONENT_IDS), st.floats(1e-4, 1.0),
                          min_size=1, max_size=len(COMPONENT_IDS))


def test_forms_agree():
    names = tuple((n,) for n in EX1)
    fr = tuple((v,) for v in EX1.values())
    two_col = tuple((n, v) for n, v in EX1.items())
    row_names = (tuple(EX1),)
    row_fr = (tuple(EX1.values()),)
    a = parse_composition(names, fr)
    assert parse_composition(two_col) == a
    assert parse_composition(row_names, row_fr) == a
    assert parse_composition(names, row_fr) == a  # column of names, row of amounts
    assert parse_composition(EX1) == a
    assert parse_composition(list(EX1), list(EX1.values())) == a
    assert parse_composition(list(EX1.items())) == a
    assert parse_composition((tuple(EX1), tuple(EX1.values()))) == a  # two-row block
    assert parse_composition(a) is a
    assert isinstance(hash(a), int)


def test_canonical_ids_and_accessors():
    c = parse_composition({"Methane": 90, "n-C4H10": 4, "isobutane": 3, "C6+": 1, "nitrogen": 2})
    assert c.ids == ("CH4", "nC4H10", "iC4H10", "nC6H14", "N2")
    assert c.get("nC6H14") == pytest.approx(0.01) and c.get("H2") == 0.0
    assert c.as_dict()["CH4"] == pytest.approx(0.9)
    assert c.unit == "mol%" and c.total == pytest.approx(100.0)
    assert "N2" in c and len(c) == 5


def test_every_accepted_name_resolves():
    for name in accepted_names(every_spelling=True):
        assert component_id(name) in COMPONENT_IDS
        assert component_id(name.upper()) == component_id(name)
    assert set(component_id(n) for n in accepted_names()) == set(COMPONENT_IDS)
    assert "C6+" in accepted_names()


def test_blank_rows_and_blank_amounts_skipped():
    rng = (("CH4", 95.0), (None, None), ("", ""), ("ethane", None), ("N2", 5.0))
    c = parse_composition(rng)
    assert c.ids == ("CH4", "N2")


def test_heading_row_skipped():
    rng = (("Component", "mol%"), ("CH4", 95.0), ("N2", 5.0))
    assert parse_composition(rng).ids == ("CH4", "N2")
    with pytest.raises(CellTypeError, match="^components: row 2 holds the text 'mol%', not a number$"):
        parse_composition((("CH4", 95.0), ("Component", "mol%"), ("N2", 5.0)))


def test_cached():
    rng = (("CH4", 95.0), ("N2", 5.0))
    assert parse_composition(rng) is parse_composition((("CH4", 95.0), ("N2", 5.0)))


@settings(max_examples=200, deadline=None)
@given(amounts)
def test_mol_percent_equals_fractions(d):
    total = sum(d.values())
    frac = {k: v / total for k, v in d.items()}
    pct = {k: 100 * v for k, v in frac.items()}
    a, b = parse_composition(frac), parse_composition(pct)
    assert a.ids == b.ids
    assert a.x == pytest.approx(b.x, rel=1e-12, abs=1e-15)
    assert math.fsum(a.x) == pytest.approx(1.0, abs=1e-15)


@settings(max_examples=200, deadline=None)
@given(amounts, st.randoms(use_true_random=False))
def test_permutation_invariance(d, rnd):
    items = list(d.items())
    total = sum(d.values())
    rows = [(k, v / total) for k, v in items]
    shuffled = rows[:]
    rnd.shuffle(shuffled)
    a = parse_composition(tuple(rows))
    b = parse_composition(tuple(shuffled))
    assert a.ids == b.ids
    assert a.x == pytest.approx(b.x, rel=1e-12, abs=1e-15)


@settings(max_examples=200, deadline=None)
@given(amounts, st.floats(0.981, 1.019))
def test_normalisation_within_tolerance(d, scale):
    total = sum(d.values())
    c = parse_composition({k: scale * v / total for k, v in d.items()})
    assert math.fsum(c.x) == 1.0 or abs(math.fsum(c.x) - 1.0) < 1e-15
    for k, v in d.items():
        assert c.get(k) == pytest.approx(v / total, rel=1e-9)


@settings(max_examples=200, deadline=None)
@given(amounts, st.one_of(st.floats(0.1, 0.97), st.floats(1.03, 90.0), st.floats(103.0, 1e4)))
def test_sum_off_is_error(d, scale):
    total = sum(d.values())
    names = tuple((k,) for k in d)
    fr = tuple((scale * v / total,) for v in d.values())
    with pytest.raises(CellInputError, match="^fractions: the amounts sum to"):
        parse_composition(names, fr)


@pytest.mark.parametrize("bad, hint", [("methan", "methane"), ("ethan", "ethane"),
                                       ("nbutan", "n-butane"), ("nitrogn", "nitrogen"),
                                       ("C02", "CO2"), ("hydrogen sulfid", "hydrogen sulfide")])
def test_unknown_name_suggests(bad, hint):
    with pytest.raises(CellInputError, match=f'^components: row 2 unknown component "{bad}", did you mean "{hint}"'):
        parse_composition(((("CH4",), (bad,))), ((90.0,), (10.0,)))


def test_unknown_name_without_close_match():
    with pytest.raises(CellInputError, match="GAS_COMPONENTS"):
        parse_composition({"xyzzy": 1.0})


@pytest.mark.parametrize("rng, pattern", [
    ((("CH4", 90.0), ("methane", 10.0)), '^components: row 2 "methane" repeats row 1'),
    ((("C6+", 1.0), ("n-hexane", 1.0), ("CH4", 98.0)), '^components: row 2 "n-hexane" repeats row 1 "C6\\+"'),
    ((("CH4", 110.0), ("N2", -10.0)), r"^components: row 2 \(N2\) amount -10 is negative"),
    ((("CH4", None), (None, None)), "^components: the composition is empty"),
    (((None, 5.0), ("CH4", 95.0)), "^components: row 1 has amount 5 but no component name"),
    ((("CH4", "lots"),), "^components: row 1 holds the text 'lots', not a number$"),
    (((3.0, 100.0),), "^components: row 1 holds 3, a component name is needed"),
    ((("CH4",),), "^fractions: omitted, so components must be a two-column range"),
])
def test_bad_ranges(rng, pattern):
    with pytest.raises(CellInputError, match=pattern):
        parse_composition(rng)


def test_shape_mismatch():
    with pytest.raises(CellInputError, match="^fractions: 3 row"):
        parse_composition((("CH4",), ("N2",)), ((90.0,), (10.0,), (0.0,)))


def test_negative_in_fractions_names_fractions():
    with pytest.raises(CellInputError, match=r"^fractions: row 2 \(N2\) amount -1 is negative"):
        parse_composition((("CH4",), ("N2",)), ((101.0,), (-1.0,)))


def test_types_of_errors():
    with pytest.raises(CellTypeError):
        parse_composition((("CH4", True),))
    with pytest.raises(CellInputError):
        parse_composition((("CH4", float("nan")),))


@pytest.mark.parametrize("text", ["90", "95,5 %", "1,000", " 5 ", "1e-3", "10%", "0.5"])
def test_numeric_text_amount_is_refused(text):
    """Numeric text is never read as a number (project rule for cell input): "1,000" could be
    one or a thousand.  CellTypeError (#VALUE!) naming the argument and the row."""
    with pytest.raises(CellTypeError, match=(
            f"^fractions: row 2 holds the text '{text.strip()}', not a number "
            r"\(enter it as a number\)$")):
        parse_composition((("CH4",), ("N2",)), ((95.0,), (text,)))
    with pytest.raises(CellTypeError, match=f"^components: row 1 holds the text '{text.strip()}'"):
        parse_composition((("CH4", text), ("N2", 5.0)))
    with pytest.raises(CellTypeError, match="^components: column 2 holds the text"):
        parse_composition((("CH4", "N2", "CO2"), (90.0, text, 5.0)))
    with pytest.raises(CellTypeError, match="^fractions: row 1 holds the text"):
        parse_composition({"CH4": text})


@settings(max_examples=200, deadline=None)
@given(st.floats(0.0, 1e6, allow_nan=False), st.sampled_from(["{:g}", "{:.3f}", "{:,.2f}", "{:g} %"]),
       st.booleans())
def test_any_text_amount_is_a_type_error(value, form, comma):
    """Whatever number a text holds, it is refused with the row named, never read."""
    text = form.format(value)
    if comma:
        text = text.replace(".", ",")
    with pytest.raises(CellTypeError, match=r"^fractions: row 1 holds the text .*\(enter it as a number\)$"):
        parse_composition((("CH4",), ("N2",)), ((text,), (5.0,)))


def test_same_amounts_as_numbers_are_accepted():
    """The numbers the refused texts stand for parse as usual (mol%, sum 100)."""
    c = parse_composition((("CH4",), ("N2",)), ((95.5,), (4.5,)))
    assert c.unit == "mol%" and c.get("CH4") == pytest.approx(0.955, rel=1e-15)


def test_text_uncertainty_is_refused():
    with pytest.raises(CellTypeError, match="^u_fractions: row 2 holds the text '0,1', not a number"):
        paired_amounts((("CH4",), ("N2",)), ((0.1,), ("0,1",)))


def test_paired_amounts():
    names = (("CH4",), ("N2",), (None,))
    assert paired_amounts(names, ((0.1,), (None,), (None,))) == {"CH4": 0.1, "N2": 0.0}
    two_col = (("CH4", 90.0), ("N2", 10.0))
    assert paired_amounts(two_col, ((0.1,), (0.2,))) == {"CH4": 0.1, "N2": 0.2}
    with pytest.raises(CellInputError, match="^u_fractions: row 1"):
        paired_amounts(names, ((-0.1,), (0.0,), (0.0,)))


def test_composition_is_immutable():
    c = parse_composition(EX1)
    with pytest.raises(Exception):
        c.x = (1.0,)
    assert isinstance(c, Composition)
