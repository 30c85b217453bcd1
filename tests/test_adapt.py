"""The cell boundary rules shared by both adapters (the project's cell-input rules); checked on real catalogue entries.

Expected values: ht.LMTD (reference library) for the HX_LMTD calls; the rest are the rules themselves.
"""

import ht
import pytest

from cellfuncs import catalogue, excel, headless
from cellfuncs.adapt import coerce_args

LMTD = catalogue.by_name("HX_LMTD")
CV = catalogue.by_name("GAS_CV")
headless.register()


def test_numbers_blanks_and_defaults():
    assert excel.HX_LMTD(100.0, 60.0, 30.0, 40.2) == pytest.approx(ht.LMTD(100, 60, 30, 40.2), rel=1e-12)
    assert excel.HX_LMTD(100, 60, 30, 40.2, None) == excel.HX_LMTD(100.0, 60.0, 30.0, 40.2, "counter")
    assert excel.HX_LMTD(100, 60, 30, 40.2, "") == excel.HX_LMTD(100.0, 60.0, 30.0, 40.2)
    assert excel.HX_LMTD([[100.0]], 60, 30, 40.2) == excel.HX_LMTD(100.0, 60, 30, 40.2)  # a 1x1 range


def test_options_are_case_and_space_insensitive():
    par = ht.LMTD(100, 60, 30, 40.2, counterflow=False)
    for word in ("parallel", "PARALLEL", "  Parallel "):
        assert excel.HX_LMTD(100, 60, 30, 40.2, word) == pytest.approx(par, rel=1e-12)
    assert excel.HX_LMTD(100, 60, 30, 40.2, "sideways").startswith("#VALUE! flow: 'sideways' is not one of")


def test_text_booleans_and_blanks_are_refused_for_numbers():
    assert excel.HX_LMTD("100", 60, 30, 40.2).startswith("#VALUE! t_hot_in: text '100' is not a number")
    assert excel.HX_LMTD(True, 60, 30, 40.2).startswith("#VALUE! t_hot_in: True is a logical value")
    assert excel.HX_LMTD(None, 60, 30, 40.2).startswith("#VALUE! t_hot_in: a value is required")
    assert excel.HX_LMTD([[1.0, 2.0]], 60, 30, 40.2).startswith("#VALUE! t_hot_in: expects one cell")
    assert excel.HX_LMTD(float("nan"), 60, 30, 40.2).startswith("#NUM! t_hot_in:")


def test_engine_omitted_argument_zero_means_default_for_options():
    fn = headless._make(LMTD)
    assert fn(100, 60, 30, 40.2, 0) == pytest.approx(ht.LMTD(100, 60, 30, 40.2), rel=1e-12)
    assert fn(100, 60, 30, 40.2, None) == pytest.approx(ht.LMTD(100, 60, 30, 40.2), rel=1e-12)  # blank cell
    assert fn(100, 60, 30, 40.2, "") == pytest.approx(ht.LMTD(100, 60, 30, 40.2), rel=1e-12)  # F(...,,)


def test_ranges_in_every_shape_give_the_same_gas():
    names = ["methane", "ethane", "nitrogen"]
    amounts = [95.0, 3.0, 2.0]
    as_column = ([[n] for n in names], [[a] for a in amounts])
    as_row = ([names], [amounts])
    as_1d = (names, amounts)
    two_col = ([[n, a] for n, a in zip(names, amounts)], None)
    with_blank_row = ([[n] for n in names] + [[None]], [[a] for a in amounts] + [[None]])
    results = {excel.GAS_CV(c, f, "gross", "volume", "15/15") for c, f in
               (as_column, as_row, as_1d, two_col, with_blank_row)}
    assert len(results) == 1 and isinstance(results.pop(), float)
    engine = headless._make(CV)
    arr = [[n, a] for n, a in zip(names, amounts)] + [[None, None]]  # a range as the engine hands it over
    assert engine(arr, "", "gross", "volume", "15/15") == pytest.approx(
        excel.GAS_CV(*two_col, "gross", "volume", "15/15"), rel=1e-15)


def test_range_cells_reach_the_core_as_float_str_or_none():
    coerced = coerce_args(CV, ([["methane", 1], [" ", True]], None))
    assert coerced[0] == (("methane", 1.0), (None, True))


def test_errors_pass_through_the_engine():
    fn = headless._make(LMTD)
    err = {"type": "Error", "kind": "Div"}  # an error value as the engine hands it over
    res = fn(err, 60, 30, 40.2)
    assert headless.is_engine_error(res) and res.error_kind == "Div"


def test_extreme_inputs_are_named_not_internal_errors():
    """A result that overflows for an absurd input names that input (hostile-input test finding)."""
    res = excel.CHP_HEAT_RATE(2.2250738585e-313)
    assert res.startswith("#NUM! electrical_efficiency:") and "too extreme" in res


def test_too_many_arguments():
    assert excel._run(LMTD, (1.0,) * 6).startswith("#VALUE! HX_LMTD: takes at most 5 arguments")
