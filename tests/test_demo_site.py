"""The tender demo's Site rating sheet and its site-side figures (issue 12), checked on the committed
workbook's cached values: standard-atmosphere pressure, available power from the declared tables,
the part-load table against the datasheet, the knock margin at the lowest methane number, and the
emission-limit conversions.

Each expected value is computed here independently of cellfuncs (a standard's formula by hand,
numpy / scipy interpolation of the tables read back from the workbook, molar masses), with its
source beside it.
"""

from __future__ import annotations

import math
from pathlib import Path

import numpy as np
import openpyxl
import pytest

from cellfuncs.demo import tender_chp

BOOK = Path(__file__).resolve().parent.parent / "workbooks_demo" / tender_chp.FILENAME
D = tender_chp.datasheet_values()


@pytest.fixture(scope="module")
def book():
    return openpyxl.load_workbook(BOOK), openpyxl.load_workbook(BOOK, data_only=True)


def _ref(book, name):
    wb, _ = book
    sheet, ref = next(iter(wb.defined_names[name].destinations))
    return sheet, ref.replace("$", "")


def value(book, name):
    sheet, ref = _ref(book, name)
    v = book[1][sheet][ref].value
    assert v is not None, f"{name}: no cached value in {sheet}!{ref}"
    return v


def cells(book, name):
    """A named range's cached values, as a list of rows."""
    sheet, ref = _ref(book, name)
    return [[c.value for c in row] for row in book[1][sheet][ref]]


def _trimmed(values):
    """A one-row or one-column range as floats, trailing blanks dropped (the tables' spare cells)."""
    flat = [v for row in values for v in row]
    while flat and flat[-1] is None:
        flat.pop()
    return np.array(flat, dtype=float)


def test_site_pressure_is_the_iso_2533_standard_atmosphere(book):
    """ISO 2533:1975 troposphere, p = p0 (1 - L H / T0)^(g0 M / (R* L)), p0 = 101 325 Pa, T0 = 288.15 K,
    L = 0.0065 K/m, g0 = 9.80665 m/s², M = 0.0289644 kg/mol, R* = 8.31432 J/(mol K) (the standard's
    constants), evaluated by hand; at 200 m its table gives 98 945 Pa (from memory)."""
    altitude = value(book, "site_altitude_m")
    expected = 1.01325 * (1 - 0.0065 * altitude / 288.15) ** (9.80665 * 0.0289644 / (8.31432 * 0.0065))
    assert value(book, "out_site_pressure") == pytest.approx(expected, rel=1e-6)
    if altitude == 200:
        assert value(book, "out_site_pressure") == pytest.approx(0.98945, abs=1e-5)
    # the ambient pressure every sheet uses is this standard atmosphere + the design day's weather offset
    assert value(book, "p_ambient_bar") == pytest.approx(expected + value(book, "p_ambient_offset_bar"), rel=1e-6)


def test_site_power_is_declared_output_times_table_factors(book):
    """Site factor: bilinear interpolation of the declared table (scipy.interpolate.RegularGridInterpolator,
    reference library) at the site's altitude and design intake temperature; MN factor: numpy.interp in
    the declared methane-number table; the factors multiply (the invented datasheet's rule)."""
    from scipy.interpolate import RegularGridInterpolator

    alt = _trimmed(cells(book, "derate_altitudes"))
    temp = _trimmed(cells(book, "derate_temperatures"))
    grid = np.array([[v for v in row[:len(temp)]] for row in cells(book, "derate_table")[:len(alt)]], dtype=float)
    # the spare blank row and column are there (and ignored by the formulas)
    assert all(v is None for v in cells(book, "derate_table")[-1])
    assert all(row[-1] is None for row in cells(book, "derate_table"))
    site = float(RegularGridInterpolator((alt, temp), grid)([[value(book, "site_altitude_m"),
                                                               value(book, "t_ambient")]])[0])
    assert value(book, "site_factor") == pytest.approx(site, rel=1e-12)

    mn_x, mn_y = _trimmed(cells(book, "mn_axis")), _trimmed(cells(book, "mn_factors"))
    f_mn = float(np.interp(value(book, "mn_gas"), mn_x, mn_y))
    f_low = float(np.interp(value(book, "mn_lowest"), mn_x, mn_y))
    assert value(book, "mn_factor") == pytest.approx(f_mn, rel=1e-12)
    assert value(book, "mn_factor_low") == pytest.approx(f_low, rel=1e-12)
    assert value(book, "out_site_power") == pytest.approx(D["electrical_kw"] * site * f_mn, rel=1e-12)
    assert value(book, "out_site_power_mn_low") == pytest.approx(D["electrical_kw"] * site * f_low, rel=1e-12)
    # the datasheet is declared at the site's design conditions: the tables give it in full there
    assert value(book, "out_site_power") == pytest.approx(D["electrical_kw"], rel=1e-12)
    assert str(value(book, "site_power_check")).startswith("OK")


def test_part_load_table_full_load_row_is_the_datasheet(book):
    """100 % row = the declared full load: electrical output / fuel, and HT circuit + exhaust to 120 °C
    over the fuel (first law on the datasheet); 50 % and 75 % by numpy.interp in the declared table."""
    fuel = D["fuel_power_kw"]
    el_100 = D["electrical_kw"] / fuel
    th_100 = (D["q_jacket_kw"] + D["q_oil_kw"] + D["q_cac_ht_kw"] + D["q_exhaust_kw"]) / fuel
    loads = _trimmed(cells(book, "part_load_axis"))
    el, th = _trimmed(cells(book, "part_load_el")), _trimmed(cells(book, "part_load_th"))
    assert loads[-1] == 100
    assert el[-1] == pytest.approx(el_100, rel=1e-12) and th[-1] == pytest.approx(th_100, rel=1e-12)
    assert value(book, "part_load_el_100") == pytest.approx(el_100, rel=1e-12)
    assert value(book, "part_load_th_100") == pytest.approx(th_100, rel=1e-12)
    for load in (50, 75):
        assert value(book, f"part_load_el_{load}") == pytest.approx(float(np.interp(load, loads, el)), rel=1e-12)
        assert value(book, f"part_load_th_{load}") == pytest.approx(float(np.interp(load, loads, th)), rel=1e-12)
    # electrical efficiency falls and thermal rises towards part load (common practice)
    assert np.all(np.diff(el) > 0) and np.all(np.diff(th) < 0)


def test_knock_margin_at_lowest_mn_not_above_default(book):
    """The lowest of the methods' methane numbers is no higher than the default method's, so its knock
    margin is no larger (a gas of lower MN knocks earlier: common practice)."""
    mn, low, spread = value(book, "mn_gas"), value(book, "mn_lowest"), value(book, "mn_spread")
    assert spread > 0 and low <= mn
    assert value(book, "out_knock_k_mn_low") <= value(book, "out_knock_k")


def test_emission_limits_convert_consistently(book):
    """ppm = mg/Nm³ × 22.414 L/mol / M (ideal gas at 0 °C, 1.01325 bar; M(NO2) = 46.0055 g/mol,
    M(CO) = 28.0101 g/mol from IUPAC standard atomic weights); mass flow at the limit = limit × dry flow
    at the reference O2 = g/kWh × electrical output (the F-factor method's definition)."""
    for sp, molar_mass in (("nox", 46.0055), ("co", 28.0101)):
        limit = value(book, f"{sp}_limit_mg_nm3")
        assert value(book, f"{sp}_ppm") == pytest.approx(limit * 22.414 / molar_mass, rel=1e-4)
        from_flow = limit * value(book, "dry_flow_ref") / 1e6
        assert value(book, f"{sp}_kg_h") == pytest.approx(from_flow, rel=1e-9)
        assert value(book, f"out_{sp}_g_kwh") * D["electrical_kw"] / 1000 == pytest.approx(from_flow, rel=1e-9)


def test_no_sulphur_no_acid_dew_point_and_balance_still_ok(book):
    """The demo gas has no H2S: the sheet says so instead of a number (EXH_ACID_DEWPOINT refuses a
    sulphur-free gas); the plant's first-law check still reads OK (issue 11)."""
    assert not any(n.lower() in ("hydrogen sulfide", "h2s", "hydrogen sulphide") for n, _ in tender_chp.GAS)
    assert value(book, "h2s_pct") == 0
    assert value(book, "acid_dewpoint") == "no sulphur in the gas — no acid dew point"
    assert str(value(book, "out_balance_check")).startswith("OK")
    assert math.isfinite(value(book, "out_site_pressure"))


def test_results_sheet_shows_the_site_side(book):
    """The Results sheet carries site pressure, site power, the lowest MN and its knock margin, and NOx in
    g/kWh (issue 12), each by its defined name."""
    wb, _ = book
    formulas = " ".join(str(c.value) for row in wb["Results"].iter_rows() for c in row if c.value)
    for name in ("out_site_pressure", "out_site_power", "mn_lowest", "out_knock_k_mn_low", "out_nox_g_kwh"):
        assert name in formulas, f"Results sheet lacks {name}"
