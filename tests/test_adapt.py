"""The cell boundary rules shared by both adapters (the project's cell-input rules); checked on real catalogue entries.

Expected values: ht.LMTD (reference library) for the HX_LMTD calls; the rest are the rules themselves.
"""

import ht
import pytest

from cellfuncs import catalogue, excel, headless
from cellfuncs.adapt import coerce_args
from cellfuncs.errors import CellInputError, CellTypeError

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
    assert excel.HX_LMTD(100, 60, 30, 40.2, "sideways").startswith("#VALUE! arrangement: 'sideways' is not one of")


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
    from cellfuncs.adapt import _coerce_cells

    coerced = _coerce_cells(CV, ([["methane", 1], [" ", True]], None))
    assert coerced[0] == (("methane", 1.0), (None, True))


def test_a_gas_analysis_reaches_the_core_parsed_once():
    """kind "gas" + "amounts": the core gets one Composition; the amounts position is folded."""
    from cellfuncs.gas.composition import Composition

    two_col = coerce_args(CV, ([["methane", 90.0], ["ethane", 10.0]], None))
    split = coerce_args(CV, ([["methane"], ["ethane"]], [[90.0], [10.0]]))
    assert isinstance(two_col[0], Composition) and two_col == split
    assert len(two_col) == len(CV.args) - 1
    assert two_col[0].get("CH4") == pytest.approx(0.9, abs=1e-15)  # normalised (ISO 6976:2016 cl. 5)
    with pytest.raises(CellInputError, match="^amounts:"):
        coerce_args(CV, ([["methane"], ["ethane"]], [[90.0]]))


def test_core_errors_speak_the_catalogue_names():
    from cellfuncs.adapt import call
    from cellfuncs.catalogue import by_name

    with pytest.raises(CellInputError, match="^isentropic_efficiency:"):
        call(by_name("TURBO_T_OUT"), (25.0, 1.0, 3.0, 1.5))
    with pytest.raises(CellInputError, match="^ref_conditions:"):
        call(by_name("GAS_Z"), ([["methane", 100.0]], None, 17.0))


def test_gas_z_takes_the_reference_text_or_a_number():
    """ISO 6976:2016 clause 3: "t1/t2" is combustion/metering; Z depends on t2 only."""
    from cellfuncs.adapt import call
    from cellfuncs.catalogue import by_name

    gas = [["methane", 90.0], ["ethane", 10.0]]
    for name in ("GAS_Z", "GAS_DENSITY", "GAS_REL_DENSITY"):
        e = by_name(name)
        assert call(e, (gas, None, "25/0")) == call(e, (gas, None, 0.0)) == call(e, (gas, None, "15/0"))
        assert call(e, (gas, None, "15/15")) == call(e, (gas, None, 15.0)) == call(e, (gas, None))
        with pytest.raises(CellTypeError):
            call(e, (gas, None, "15"))  # numeric text is refused, as for every number


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


def _old_style_cv(components, amounts=None, kind="gross"):
    """An entry on the old convention: plain ranges and a wrapper that parses them."""
    from cellfuncs.gas.composition import parse_composition
    from cellfuncs.gas.iso6976 import calorific_value

    return calorific_value(parse_composition(components, amounts), kind)


def test_the_old_range_convention_keeps_working():
    """Entries of other branches may still pass plain ranges to a cell_ wrapper."""
    from cellfuncs.adapt import call
    from cellfuncs.catalogue import Arg, CellFunction

    old = CellFunction(
        name="OLD_CV", target=f"{__name__}:_old_style_cv", category="cellfuncs · gas",
        description="test", returns="[MJ/m³]",
        args=(Arg("components", "names", kind="range"),
              Arg("amounts", "amounts", kind="range", default=None),
              Arg("kind", "kind", kind="option", default="gross", options=("gross", "net"))))
    gas = [["methane", 90.0], ["ethane", 10.0]]
    assert call(old, (gas, None)) == call(catalogue.by_name("GAS_CV"), (gas, None))
    assert call(old, ([["methane"], ["ethane"]], [[90.0], [10.0]], "net")) == call(
        catalogue.by_name("GAS_CV"), (gas, None, "net"))
