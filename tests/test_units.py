import pytest
from hypothesis import given, settings
from hypothesis import strategies as st

from cellfuncs import excel
from cellfuncs.errors import CellInputError, CellTypeError
from cellfuncs.units import convert
from vectors import approx, params


@pytest.mark.parametrize("row", params("units"))
def test_unit_vectors(row):
    assert convert(row["value"], row["from_unit"], row["to_unit"]) == approx(row)


def test_excel_cell_shows_the_reason():
    assert excel.UNIT_CONVERT(1, "kg", "m").startswith("#NUM! unit_wanted: cannot convert 'kg'")
    assert excel.UNIT_CONVERT(1, "flurbs per gallon", "m").startswith("#VALUE! unit_given:")
    assert excel.UNIT_CONVERT("12", "bar", "psi").startswith("#VALUE! value: text '12' is not a number")


def test_bad_units_raise():
    with pytest.raises(CellTypeError, match="from_unit"):
        convert(1.0, "flurbs", "K")
    with pytest.raises(CellInputError, match="to_unit"):
        convert(1.0, "kW", "bar")


@settings(max_examples=100, deadline=None)
@given(st.floats(-200, 1e4), st.sampled_from(["°C", "°F", "K", "kWh", "MJ", "bar", "psi", "bar(g)"]))
def test_round_trip(value, unit):
    if unit == "K":
        value = abs(value)  # kelvin starts at absolute zero
    other = {"°C": "°F", "°F": "K", "K": "°C", "kWh": "MMBtu", "MJ": "kcal", "bar": "mbar",
             "psi": "bar(g)", "bar(g)": "psig"}[unit]
    back = convert(convert(value, unit, other), other, unit)
    assert back == pytest.approx(value, rel=1e-12, abs=1e-9)


def test_version_is_the_package_version():
    import cellfuncs

    assert excel.CELLFUNCS_VERSION() == cellfuncs.__version__


def test_limits():
    """Found by the hostile-input test: 1e308 °C overflowed; below absolute zero is refused."""
    with pytest.raises(CellInputError, match="value"):
        convert(9.987184082568422e307, "°C", "°F")
    with pytest.raises(CellInputError, match="absolute zero"):
        convert(-300.0, "°C", "K")
    with pytest.raises(CellInputError, match="value"):
        convert(1e308, "MMBtu", "J")
