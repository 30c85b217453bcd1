"""``cellfuncs functions [NAME]`` and ``cellfuncs demo``: one function, unknown names, any console
encoding, and no silent writing into a folder that holds other files."""

import os
import subprocess
import sys

import pytest

from cellfuncs import catalogue
from cellfuncs.cli import main


def _run(args, encoding=None, code=None, **kw):
    env = dict(os.environ)
    if encoding:
        env["PYTHONIOENCODING"] = encoding  # what a redirected Windows console or LANG=C gives
    cmd = [sys.executable, "-c", code] if code else [sys.executable, "-m", "cellfuncs.cli", *args]
    return subprocess.run(cmd, capture_output=True, env=env, timeout=300, **kw)


@pytest.mark.parametrize("name", ["HX_LMTD", "hx_lmtd", " =Hx_Lmtd( "])
def test_one_function(name, capsys):
    assert main(["functions", name]) == 0
    out = capsys.readouterr().out
    entry = next(e for e in catalogue.entries() if e.name == "HX_LMTD")
    assert out.startswith("HX_LMTD (")
    for a in entry.args:
        assert f"    {a.name}: " in out
    assert "GAS_CV" not in out


def test_one_function_markdown(capsys):
    from cellfuncs import docgen

    assert main(["functions", "GAS_CV", "--markdown"]) == 0
    out = capsys.readouterr().out
    assert out.startswith("### `GAS_CV(")
    assert out in docgen.functions_markdown()  # the same section as in docs/functions.md


@pytest.mark.parametrize("name, closest", [("HX_LMDT", "HX_LMTD"), ("gas_cv_unc", "GAS_CV_UNCERTAINTY"),
                                           ("knock", "KNOCK_MARGIN")])
def test_unknown_function_names_the_closest(name, closest, capsys):
    assert main(["functions", name]) == 2
    cap = capsys.readouterr()
    assert cap.out == ""
    assert cap.err.count("\n") == 1 and closest in cap.err and name in cap.err


def test_unknown_function_without_close_names(capsys):
    assert main(["functions", "QQQQQQ"]) == 2
    assert "cellfuncs functions" in capsys.readouterr().err


@pytest.mark.parametrize("encoding", ["cp1252", "ascii", "latin-1"])
def test_functions_on_any_console_encoding(encoding):
    p = _run(["functions"], encoding)
    assert p.returncode == 0, p.stderr.decode("utf-8", "replace")
    text = p.stdout.decode(encoding)
    assert text.count("\n") > 100
    assert all(e.name in text for e in catalogue.entries())
    assert b"Traceback" not in p.stderr
    one = _run(["functions", "HX_RATE"], encoding)
    assert one.returncode == 0 and b"-NTU" in one.stdout


def test_stand_ins_keep_the_text_readable():
    """ASCII output writes ° as "deg" and → as "->" instead of failing."""
    p = _run(["functions", "HX_LMTD"], "ascii")
    text = p.stdout.decode("ascii")
    assert "[deg" in text or "degC" in text
    assert "->" in text  # the example line's arrow


DEMO_STUB = """
import sys
import cellfuncs.demo as demo
demo.build_all = lambda out: ["fuel flow 281.5 m\\u00b3/h at 25 \\u00b0C, \\u03bb 1.9 \\u2192 OK \\u2014 done"]
from cellfuncs.cli import main
sys.exit(main(["demo", "-o", sys.argv[1]]))
"""


@pytest.mark.parametrize("encoding", ["cp1252", "ascii"])
def test_demo_summary_on_any_console_encoding(tmp_path, encoding):
    """The demo summary carries °, ³, λ, →: written with stand-ins, not a UnicodeEncodeError."""
    p = subprocess.run([sys.executable, "-c", DEMO_STUB, str(tmp_path / "out")], capture_output=True,
                       env={**os.environ, "PYTHONIOENCODING": encoding}, timeout=120)
    assert p.returncode == 0, p.stderr.decode("utf-8", "replace")
    text = p.stdout.decode(encoding)
    assert "fuel flow 281.5 m" in text and "-> OK" in text and "done" in text


def _stub_demo(monkeypatch):
    import cellfuncs.demo as demo

    def fake(out):
        with open(os.path.join(out, "tender_chp.xlsx"), "w") as fh:
            fh.write("new")
        return ["built"]

    monkeypatch.setattr(demo, "build_all", fake)


def test_demo_refuses_a_non_empty_folder(tmp_path, monkeypatch, capsys):
    _stub_demo(monkeypatch)
    (tmp_path / "notes.txt").write_text("mine")
    assert main(["demo", "-o", str(tmp_path)]) == 2
    err = capsys.readouterr().err
    assert err.count("\n") == 1 and "--force" in err and "not empty" in err
    assert sorted(os.listdir(tmp_path)) == ["notes.txt"]


def test_demo_force_writes_into_a_non_empty_folder(tmp_path, monkeypatch, capsys):
    _stub_demo(monkeypatch)
    (tmp_path / "notes.txt").write_text("mine")
    assert main(["demo", "-o", str(tmp_path), "--force"]) == 0
    assert sorted(os.listdir(tmp_path)) == ["notes.txt", "tender_chp.xlsx"]
    assert (tmp_path / "notes.txt").read_text() == "mine"


@pytest.mark.parametrize("make", ["new", "empty"])
def test_demo_writes_into_a_new_or_empty_folder(tmp_path, monkeypatch, make):
    _stub_demo(monkeypatch)
    target = tmp_path / "demo"
    if make == "empty":
        target.mkdir()
    assert main(["demo", "-o", str(target)]) == 0
    assert os.listdir(target) == ["tender_chp.xlsx"]


@pytest.mark.parametrize("encoding", ["cp1252", "ascii"])
def test_inputs_on_any_console_encoding(encoding):
    from pathlib import Path

    book = Path(__file__).resolve().parent.parent / "workbooks_demo" / "knock_whatif.xlsx"
    p = _run(["inputs", str(book)], encoding)
    assert p.returncode == 0, p.stderr.decode("utf-8", "replace")
    text = p.stdout.decode(encoding)
    assert "air_ratio" in text and "t_ambient" in text
