"""Knock family: the screening model's identities (tests/vectors/knock.csv) and properties.

Source of every identity: the screening model (Livengood & Wu 1955 integral with an
Arrhenius ignition delay held at the declared reference point); they hold to 1e-9.
"""

import pytest
from hypothesis import given, settings
from hypothesis import strategies as st

from cellfuncs.catalogue import by_name
from cellfuncs.errors import CellInputError, CellTypeError
from vectors import approx, params

OPT = ("k_per_mn", "n_poly", "activation_k", "pressure_exp")


def _call(name, *args):
    return by_name(name).resolve()(*args)


def _run(row):
    f = row["function"]
    ref = (row["t_ref"], row["p_ref_bar"], row["mn_ref"], row["compression_ratio_ref"])
    opt = tuple(row[k] for k in OPT)
    if f == "KNOCK_MARGIN":
        return _call(f, row["t_mixture"], row["p_boost_bar"], row["compression_ratio"],
                     row["methane_number"], *ref, row["output"], *opt)
    if f == "KNOCK_T_LIMIT":
        return _call(f, row["p_boost_bar"], row["compression_ratio"], row["methane_number"],
                     *ref, *opt)
    if f == "KNOCK_MN_REQUIRED":
        return _call(f, row["t_mixture"], row["p_boost_bar"], row["compression_ratio"], *ref,
                     *opt)
    raise AssertionError(f)


@pytest.mark.parametrize("row", params("knock"))
def test_vectors(row):
    assert _run(row) == approx(row)


REF = dict(t_ref=45.0, p_ref_bar=3.0, mn_ref=80.0)
site = st.fixed_dictionaries({
    "t": st.floats(20.0, 70.0), "p": st.floats(1.5, 5.0), "eps": st.floats(9.0, 14.0),
    "mn": st.floats(50.0, 110.0), "k": st.floats(0.3, 2.0), "n": st.floats(1.25, 1.4),
    "B": st.floats(10000.0, 30000.0), "a": st.floats(0.3, 1.5),
})


def _margin(s, **over):
    d = dict(s, **over)
    return _call("KNOCK_MARGIN", d["t"], d["p"], d["eps"], d["mn"], 45.0, 3.0, 80.0, 12.0, "k",
                 d["k"], d["n"], d["B"], d["a"])


@settings(max_examples=150, deadline=None)
@given(s=site)
def test_identities_everywhere(s):
    """KNOCK_T_LIMIT − t_mixture = KNOCK_MARGIN; margin_MN = margin_K/k;
    KNOCK_MN_REQUIRED at t_mixture = KNOCK_T_LIMIT gives back the methane number."""
    opt = (s["k"], s["n"], s["B"], s["a"])
    ref = (45.0, 3.0, 80.0, 12.0)
    lim = _call("KNOCK_T_LIMIT", s["p"], s["eps"], s["mn"], *ref, *opt)
    m_k = _call("KNOCK_MARGIN", s["t"], s["p"], s["eps"], s["mn"], *ref, "k", *opt)
    m_mn = _call("KNOCK_MARGIN", s["t"], s["p"], s["eps"], s["mn"], *ref, "mn", *opt)
    assert lim - s["t"] == pytest.approx(m_k, abs=1e-9)
    assert m_mn == pytest.approx(m_k / s["k"], abs=1e-9)
    if -30.0 <= lim <= 150.0:
        need = _call("KNOCK_MN_REQUIRED", lim, s["p"], s["eps"], *ref, *opt)
        assert need == pytest.approx(s["mn"], abs=1e-9)
    need_t = _call("KNOCK_MN_REQUIRED", s["t"], s["p"], s["eps"], *ref, *opt)
    assert need_t == pytest.approx(s["mn"] - m_mn, abs=1e-9)


@settings(max_examples=150, deadline=None)
@given(s=site, dp=st.floats(0.05, 1.0), de=st.floats(0.1, 2.0), dmn=st.floats(0.5, 20.0))
def test_monotonic(s, dp, de, dmn):
    """Margin falls with boost and with compression ratio, rises with methane number."""
    m = _margin(s)
    assert _margin(s, p=s["p"] + dp) < m
    assert _margin(s, eps=s["eps"] + de) < m
    assert _margin(s, mn=s["mn"] + dmn) > m
    assert _margin(s, t=s["t"] + 1.0) == pytest.approx(m - 1.0, abs=1e-9)


def test_compression_ratio_ref_defaults_to_compression_ratio():
    a = _call("KNOCK_MARGIN", 45.0, 3.2, 13.0, 80.0, 45.0, 3.0, 80.0, None)
    b = _call("KNOCK_MARGIN", 45.0, 3.2, 13.0, 80.0, 45.0, 3.0, 80.0, 13.0)
    assert a == b


def test_defaults_are_the_documented_values():
    """Defaults as the module text states them (B, a from a GRI-Mech 3.0 fit; k after Bade Shrestha & Rodrigues 2008; n common practice)."""
    e = by_name("KNOCK_MARGIN")
    d = {a.name: a.default for a in e.args}
    assert (d["k_per_mn"], d["polytropic_exponent"], d["activation_temperature"],
            d["delay_pressure_exponent"], d["unit"]) == (
        0.8, 1.35, 19600.0, 0.85, "k")


def test_bad_input_names_the_argument():
    ok = (45.0, 3.0, 12.0, 80.0, 45.0, 3.0, 80.0)
    cases = [
        ("t_mixture", (200.0,) + ok[1:]),
        ("p_boost_bar", (45.0, 0.0) + ok[2:]),
        ("compression_ratio", (45.0, 3.0, 2.0) + ok[3:]),
        ("methane_number", ok[:3] + (-5.0,) + ok[4:]),
        ("p_ref_bar", ok[:5] + (-1.0, 80.0)),
        ("mn_ref", ok[:6] + (200.0,)),
    ]
    for arg, a in cases:
        with pytest.raises(CellInputError, match=arg):
            _call("KNOCK_MARGIN", *a)
    with pytest.raises(CellInputError, match="k_per_mn"):
        _call("KNOCK_MARGIN", *ok, None, "k", 0.0)
    with pytest.raises(CellInputError, match="n_poly"):
        _call("KNOCK_T_LIMIT", 3.0, 12.0, 80.0, 45.0, 3.0, 80.0, None, 0.8, 2.0)
    with pytest.raises(CellInputError, match="activation_k"):
        _call("KNOCK_MN_REQUIRED", 45.0, 3.0, 12.0, 45.0, 3.0, 80.0, None, 0.8, 1.35, -1.0)
    with pytest.raises(CellInputError, match="pressure_exp"):
        _call("KNOCK_MN_REQUIRED", 45.0, 3.0, 12.0, 45.0, 3.0, 80.0, None, 0.8, 1.35, 19600.0,
              -0.5)
    with pytest.raises(CellInputError, match="compression_ratio_ref"):
        _call("KNOCK_T_LIMIT", 3.0, 12.0, 80.0, 45.0, 3.0, 80.0, 40.0)
    with pytest.raises(CellTypeError, match="output"):
        _call("KNOCK_MARGIN", *ok, None, "furlongs")
