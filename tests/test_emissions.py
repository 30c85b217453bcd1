"""Emissions: EMIS_CONVERT, EXH_DRY_VOLUME, EXH_ACID_DEWPOINT.

Outside sources (tests/vectors/emissions.csv): US EPA Method 19 Table 19-2 F_d of
natural gas; hand stoichiometry with the ISO 6976:2016 component table; the
ppm-to-mg/Nm3 factor of each species from IUPAC 2005 atomic weights, and the
rounded factors of the trade; the Verhoff & Banchero (1974) equation evaluated by
hand for two exhausts.
"""

from __future__ import annotations

import itertools
import math

import pytest
from hypothesis import given, settings
from hypothesis import strategies as st

from gas_cases import as_ranges, pairs
from vectors import approx, params

from cellfuncs import excel
from cellfuncs.emissions import acid_dewpoint as ad
from cellfuncs.emissions import conversions as ec
from cellfuncs.errors import CellInputError, CellTypeError
from cellfuncs.gas.composition import parse_composition

NG = {"methane": 92.0, "ethane": 4.5, "propane": 1.0, "nitrogen": 1.5, "carbon dioxide": 1.0}


def _opt(row, name, default):
    v = row.get(name)
    return default if v in (None, "") else v


@pytest.mark.parametrize("row", params("emissions", "EXH_DRY_VOLUME"))
def test_dry_volume_vectors(row):
    names, amounts = as_ranges(row["composition"])
    got = excel.EXH_DRY_VOLUME(names, amounts, row["o2_reference_pct"], row["kind"])
    assert got * _opt(row, "scale", 1.0) == approx(row)


@pytest.mark.parametrize("row", params("emissions", "EMIS_CONVERT"))
def test_emis_convert_vectors(row):
    names, amounts = as_ranges(row["composition"]) if row["composition"] else (None, None)
    got = excel.EMIS_CONVERT(row["value"], row["unit_given"], row["unit_wanted"], row["species"],
                             names, amounts, row["o2_reference_pct"],
                             row["electrical_efficiency"], row["kind"])
    assert got == approx(row)


@pytest.mark.parametrize("row", params("emissions", "EXH_ACID_DEWPOINT"))
def test_acid_dewpoint_vectors(row):
    names, amounts = as_ranges(row["composition"])
    got = excel.EXH_ACID_DEWPOINT(row["air_ratio"], names, amounts, row["p_exhaust_bar"],
                                  row["t_ambient"], row["rh_ambient"], row["p_ambient_bar"],
                                  row["so3_share"])
    assert got == approx(row)


def test_verhoff_banchero_published_worked_example():
    """Source: worked example quoted with the equation in secondary sources: 12 vol-% water and 0.02 vol-% SO2 at 1.02457 atm, 2 % to SO3 (mass basis), p_H2O 93.44 mmHg, p_SO3 0.0024917 mmHg give 1000/T = 2.489, about 402 K (129 °C); the example rounds ln p_SO3 to -6, hence 1e-3."""
    t = ad.verhoff_banchero(93.44, 0.0024917)
    assert 1000.0 / (t + 273.15) == pytest.approx(2.489, abs=1e-3)
    assert t + 273.15 == pytest.approx(402.0, abs=0.5)


def test_emission_factors_independent_of_o2_for_mass_per_energy():
    """mg/MJ and g/kWh do not depend on the reference O2 (it cancels)."""
    c = parse_composition(NG)
    a = ec.emis_convert(1.0, "mg/mj", "g/kwh", "co", c, 5.0, 0.4)
    b = ec.emis_convert(1.0, "mg/mj", "g/kwh", "co", c, 15.0, 0.4)
    assert a == b == pytest.approx(3.6e-3 / 0.4, rel=1e-14)


def test_o2_dilution_matches_exh_o2_correct():
    """The ppm at two reference O2 levels differ by (20.9 − O2_b)/(20.9 − O2_a), as EXH_O2_CORRECT."""
    c = parse_composition(NG)
    mj = ec.emis_convert(100.0, "ppm", "mg/mj", "nox", c, 5.0)
    at15 = ec.emis_convert(mj, "mg/mj", "ppm", "nox", c, 15.0)
    assert at15 == pytest.approx(excel.EXH_O2_CORRECT(100.0, 5.0, 15.0), rel=1e-12)


UNITS = ("ppm", "mg/nm3", "mg/mj", "g/kwh")


@settings(max_examples=200)
@given(st.floats(1e-6, 1e6), st.sampled_from(list(itertools.permutations(UNITS, 2))),
       st.sampled_from(sorted(ec.SPECIES)), st.floats(0.0, 20.0), st.floats(0.05, 1.0),
       st.sampled_from(["net", "gross"]))
def test_round_trips_between_every_pair(value, pair, species, o2, eta, kind):
    c = parse_composition(NG)
    a, b = pair
    there = ec.emis_convert(value, a, b, species, c, o2, eta, kind)
    back = ec.emis_convert(there, b, a, species, c, o2, eta, kind)
    assert back == pytest.approx(value, rel=1e-12)


def test_same_unit_returns_value():
    assert ec.emis_convert(12.5, "ppm", "ppm") == 12.5
    assert excel.EMIS_CONVERT(12.5, "mg/MJ", "mg/mj") == 12.5


def test_dry_volume_scales_with_o2():
    c = parse_composition(NG)
    assert ec.dry_volume(c, 15.0) == pytest.approx(ec.dry_volume(c, 0.0) * 20.9 / 5.9, rel=1e-14)
    assert ec.dry_volume(c, 0.0, "gross") < ec.dry_volume(c, 0.0, "net")


@pytest.mark.parametrize("args, err, msg", [
    ((10.0, "ppm", "mg/mj"), CellInputError, r"components: converting to or from mg/MJ needs the gas"),
    ((10.0, "g/kwh", "ppm"), CellInputError, r"electrical_efficiency: needed to convert to or from g/kWh"),
    ((10.0, "ppm", "g/kwh", "nox", NG), CellInputError, r"electrical_efficiency: needed"),
    ((10.0, "ppm", "g/kwh", "nox", NG, 5.0, 1.2), CellInputError, r"electrical_efficiency: 1.2 is above 1"),
    ((10.0, "ppm", "g/kwh", "nox", NG, 5.0, 0.0), CellInputError, r"electrical_efficiency: 0 must be above 0"),
    ((-1.0, "ppm", "mg/nm3"), CellInputError, r"value: -1 .*is below 0"),
    ((1.0, "ppb", "mg/nm3"), CellTypeError, r'unit_given: "ppb" is not one of'),
    ((1.0, "ppm", "lb/MMBtu"), CellTypeError, r'unit_wanted: "lb/MMBtu" is not one of'),
    ((1.0, "ppm", "mg/nm3", "N2O"), CellTypeError, r'species: "N2O" is not one of'),
    ((1.0, "ppm", "mg/nm3", "nox", None, 20.9), CellInputError, r"o2_reference_pct: 20.9 vol-% must be below"),
    ((1.0, "ppm", "mg/mj", "nox", {"nitrogen": 100.0}), CellInputError, r"components: the gas has no calorific value"),
])
def test_emis_convert_refusals(args, err, msg):
    args = list(args)
    if len(args) > 4 and isinstance(args[4], dict):
        args[4] = parse_composition(args[4])
    with pytest.raises(err, match=msg):
        ec.emis_convert(*args)


def test_emis_convert_cell_errors_name_arguments():
    assert excel.EMIS_CONVERT(1.0, "ppm", "mg/MJ").startswith("#NUM! components: converting to or from mg/MJ")
    names, amounts = as_ranges("CH4=90;N2=5")
    assert excel.EMIS_CONVERT(1.0, "ppm", "mg/MJ", "nox", names, amounts).startswith("#NUM! amounts:")


def test_species_words_and_alias():
    assert ec.species_molar_mass("Formaldehyde") == ec.species_molar_mass("HCHO")
    assert excel.EMIS_CONVERT(1.0, "ppm", "mg/Nm3", "formaldehyde") == pytest.approx(30.02598 / 22.414)


# ---- acid dew point ---------------------------------------------------------------------

SOUR = {"methane": 98.0, "hydrogen sulfide": 0.5, "carbon dioxide": 1.5}


def test_acid_dewpoint_refuses_sweet_gas():
    with pytest.raises(CellInputError, match=r"components: the gas holds no sulphur .* no sulphuric-acid dew point"):
        ad.acid_dewpoint(1.8, parse_composition(NG))


def test_acid_dewpoint_above_water_dewpoint_and_rises_with_so3():
    """Physics: the acid dew point lies above the water dew point and rises with the SO3 share."""
    from cellfuncs.recovery import exhaust

    c = parse_composition(SOUR)
    lo = ad.acid_dewpoint(1.8, c, so3_share=0.01)
    hi = ad.acid_dewpoint(1.8, c, so3_share=0.05)
    assert exhaust.exhaust_dewpoint(1.8, c) < lo < hi


@pytest.mark.parametrize("kwargs, msg", [
    (dict(air_ratio=0.9), r"air_ratio: 0.9 is below 1"),
    (dict(p_exhaust_bar=3.0), r"p_exhaust_bar: 3 bar\(a\) is above 2"),
    (dict(so3_share=0.0), r"so3_share: 0 must be above 0"),
    (dict(so3_share=1.5), r"so3_share: 1.5 is above 1"),
    (dict(so3_share=1e-12), r"components: so little SO3 .* below the water dew point"),
])
def test_acid_dewpoint_refusals(kwargs, msg):
    args = dict(air_ratio=1.8, comp=parse_composition(SOUR))
    args.update(kwargs)
    with pytest.raises(CellInputError, match=msg):
        ad.acid_dewpoint(**args)


@given(st.floats(1e-3, 1e3), st.floats(1e-7, 1.0))
def test_verhoff_banchero_monotonic(pw, ps):
    assert ad.verhoff_banchero(pw, ps * 2.0) > ad.verhoff_banchero(pw, ps)
