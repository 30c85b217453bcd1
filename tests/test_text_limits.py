"""Excel's limits (issue 10): no text a cell function returns is longer than 255 characters.

Source of the limit: a worksheet function returning a text longer than 255
characters shows #VALUE! in the host spreadsheet (through xlwings) — the issue's
observation, common practice for user-defined functions.  The test runs every
catalogue function over its example and hostile inputs, results and error texts.
"""

import dataclasses

import pytest
from hypothesis import HealthCheck, given, settings
from hypothesis import strategies as st

from cellfuncs import catalogue, excel
from cellfuncs.gas import methane_number as mn
from cellfuncs.gas.composition import parse_composition

LIMIT = 255
ENTRIES = catalogue.entries()

hostile = st.one_of(st.none(), st.sampled_from(["", "abc", "12", "counter", "#NUM!", "x" * 300]),
                    st.floats(allow_nan=False, allow_infinity=False), st.booleans(),
                    st.lists(st.lists(st.one_of(st.none(), st.text(max_size=300),
                                                st.floats(allow_nan=False)),
                                      min_size=1, max_size=2), min_size=1, max_size=3))


def _texts(res):
    flat = [c for row in res for c in row] if isinstance(res, list) else [res]
    return [c for c in flat if isinstance(c, str)]


@pytest.mark.parametrize("entry", ENTRIES, ids=[e.name for e in ENTRIES])
def test_no_text_over_255_characters(entry):
    fn = getattr(excel, entry.name)
    ex = list(entry.example) + [None] * (len(entry.args) - len(entry.example))
    for t in _texts(fn(*ex)):
        assert len(t) <= LIMIT, (entry.name, len(t), t)

    @settings(max_examples=25, deadline=None, database=None,
              suppress_health_check=list(HealthCheck))
    @given(st.integers(0, max(len(entry.args) - 1, 0)), hostile)
    def run(i, v):
        vals = list(ex)
        if vals:
            vals[i] = v
        for t in _texts(fn(*vals)):
            assert len(t) <= LIMIT, (entry.name, len(t), t)

    run()


HYDROGEN_RICH = [
    {"methane": 60, "hydrogen": 30, "n-butane": 2, "isobutane": 1, "n-pentane": 1, "n-hexane": 1,
     "carbon dioxide": 3, "helium": 0.5, "argon": 0.3, "nitrogen": 1.2},
    {"methane": 45.5, "hydrogen": 38.8, "n-butane": 1.7, "isobutane": 1.8, "n-pentane": 0.3,
     "n-hexane": 0.6, "ethane": 3.9, "carbon dioxide": 4.5, "nitrogen": 2.6},
]


@pytest.mark.parametrize("gas", HYDROGEN_RICH)
def test_methane_number_basis_of_hydrogen_rich_gases(gas):
    text = mn.basis_text(parse_composition(gas))
    assert len(text) <= LIMIT and "Table A.10" in text


def test_methane_number_basis_keeps_cautions_when_shortened(monkeypatch):
    """The longest case: every doubtful diagram noted, argon/helium, a22 spread."""
    real = mn.en16726_details(parse_composition(HYDROGEN_RICH[0]))
    notes = tuple(f"{'CAUTION' if c in mn.dg.SUSPECT else 'note'}: leans on {c} for 12.3 % of the "
                  f"combustibles ({why})" for c, why in mn.dg.DOUBTFUL.items())
    notes += ("argon/helium 0.8 vol-% counted as nitrogen",)
    fake = dataclasses.replace(real, notes=notes)
    monkeypatch.setattr(mn, "en16726_details", lambda comp: fake)
    full = mn._en16726_text(fake, compact=False)
    assert len(full) > LIMIT  # the case the issue found (395 characters)
    text = mn.basis_text(parse_composition(HYDROGEN_RICH[0]))
    assert len(text) <= LIMIT
    assert "CAUTION D06" in text and text.endswith("Table A.10")
