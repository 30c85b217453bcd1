"""Every catalogue function, through both adapters, with random and hostile input.

Picks up new catalogue entries automatically.  For each call: no unexpected
exception, no NaN/inf in a result, and every error text names an argument.
"""

import math
import os

import pytest
from hypothesis import HealthCheck, given, settings
from hypothesis import strategies as st

from cellfuncs import catalogue, excel, headless

ENTRIES = catalogue.entries()
FUZZ_EXAMPLES = int(os.environ.get("CELLFUNCS_FUZZ_EXAMPLES", "60"))
headless.register()

numbers = st.one_of(
    st.sampled_from([0.0, -1.0, 1.0, 1e300, -1e300, 1e-300, 0.5, 100.0, 2.0]),
    st.floats(allow_nan=False, allow_infinity=False, width=64),
    st.integers(-10**6, 10**6),
)
texts = st.one_of(st.sampled_from(["", " ", "abc", "12", "counter", "CH4", "#NUM!"]),
                  st.text(max_size=8))
cells = st.one_of(numbers, texts, st.none(), st.booleans())
blocks = st.lists(st.lists(cells, min_size=1, max_size=3), min_size=1, max_size=4).map(
    lambda rows: [r + [None] * (max(map(len, rows)) - len(r)) for r in rows])


def value_for(arg):
    if arg.kind in ("number", "integer"):
        return st.one_of(numbers, texts, st.none(), st.booleans())
    if arg.kind == "option":
        opts = list(arg.options) + [o.upper() for o in arg.options] + [f"  {o} " for o in arg.options]
        return st.one_of(st.sampled_from(opts), texts, st.none(), numbers)
    if arg.kind in ("text", "reference"):
        return st.one_of(texts, st.none(), numbers)
    return st.one_of(blocks, cells)


def args_for(entry):
    plain = st.tuples(*[value_for(a) for a in entry.args])
    if not entry.example:
        return plain
    ex = list(entry.example) + [None] * (len(entry.args) - len(entry.example))

    @st.composite
    def mutated(draw):
        i = draw(st.integers(0, max(len(entry.args) - 1, 0)))
        vals = list(ex)
        if entry.args:
            vals[i] = draw(value_for(entry.args[i]))
        return tuple(vals)

    return st.one_of(plain, mutated(), st.just(tuple(ex)))


def _names(entry):
    return [a.name for a in entry.args] + [entry.name]


def _check_excel_result(entry, res):
    if isinstance(res, str) and res.startswith("#"):
        assert not res.startswith(excel.INTERNAL_ERROR), res
        code, _, msg = res.partition(" ")
        assert code in ("#NUM!", "#VALUE!"), res
        assert any(n in msg for n in _names(entry)), f"{entry.name}: error names no argument: {res}"
        return
    flat = [c for row in res for c in row] if isinstance(res, list) else [res]
    for c in flat:
        if isinstance(c, float):
            assert math.isfinite(c), res


def _to_engine(v):
    """A cell value as the engine hands it to a registered function (blank: None, range: rows)."""
    return v


def _check_headless_result(entry, res):
    if headless.is_engine_error(res):
        msg = headless.engine_error_message(res)
        assert "internal error" not in msg, msg
        assert any(n in msg for n in _names(entry)), f"{entry.name}: error names no argument: {msg!r}"
        return
    flat = [c for row in res for c in row] if isinstance(res, list) else [res]
    for c in flat:
        if isinstance(c, float):
            assert math.isfinite(c)


@pytest.mark.parametrize("entry", ENTRIES, ids=[e.name for e in ENTRIES])
def test_hostile_input_through_both_adapters(entry):
    xl_fn = getattr(excel, entry.name)
    engine_fn = headless._make(entry)

    @settings(max_examples=FUZZ_EXAMPLES, deadline=None, database=None,
              suppress_health_check=list(HealthCheck))
    @given(args_for(entry))
    def run(values):
        _check_excel_result(entry, xl_fn(*values))
        _check_headless_result(entry, engine_fn(*[_to_engine(v) for v in values]))

    run()
    assert not headless.INTERNAL_ERRORS, headless.INTERNAL_ERRORS
