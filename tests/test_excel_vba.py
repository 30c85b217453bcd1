"""The Excel module as Excel would import it: xlwings' classic UDF decorators bound in,
then xlwings' own VBA wrapper generator run over the module (Windows modules stubbed)."""

import importlib
import io
import re
import sys
import types

import pytest

from cellfuncs import catalogue
from cellfuncs.catalogue.spec import RANGE_KINDS


@pytest.fixture()
def windows_excel_module(monkeypatch):
    for name in ("pythoncom", "pywintypes"):
        stub = types.ModuleType(name)
        stub.CoInitialize = lambda: None
        monkeypatch.setitem(sys.modules, name, stub)
    win32com = types.ModuleType("win32com")
    client = types.ModuleType("win32com.client")
    client.Dispatch = lambda *a, **k: None
    win32com.client = client
    monkeypatch.setitem(sys.modules, "win32com", win32com)
    monkeypatch.setitem(sys.modules, "win32com.client", client)
    sys.modules.pop("xlwings.udfs", None)
    udfs = importlib.import_module("xlwings.udfs")
    import xlwings

    monkeypatch.setattr(xlwings, "func", udfs.xlfunc, raising=False)
    monkeypatch.setattr(xlwings, "arg", udfs.xlarg, raising=False)
    monkeypatch.setattr(xlwings, "ret", udfs.xlret, raising=False)
    sys.modules.pop("cellfuncs.excel", None)
    module = importlib.import_module("cellfuncs.excel")
    yield udfs, module
    sys.modules.pop("cellfuncs.excel", None)
    sys.modules.pop("xlwings.udfs", None)


class _Book:
    Name = "tender.xlsm"


def _vba(udfs, module):
    buf = io.StringIO()
    udfs.generate_vba_wrapper("cellfuncs.excel", module, buf, _Book())
    return buf.getvalue()


def test_every_entry_has_a_wrapper(windows_excel_module):
    udfs, module = windows_excel_module
    vba = _vba(udfs, module)
    sigs = dict(re.findall(r"^Function (\w+)\((.*)\)$", vba, re.M))
    for e in catalogue.entries():
        assert e.name in sigs, e.name
        expected = ", ".join(("Optional " if a.optional else "") + a.name for a in e.args)
        assert sigs[e.name] == expected


_CELL_REF = re.compile(r"^(?:[A-Z]{1,3}[0-9]+|R[0-9]*C[0-9]*)$", re.I)
_VBA_ID = re.compile(r"^[A-Za-z][A-Za-z0-9_]{0,254}$")


def test_names_are_valid_and_unique(windows_excel_module):
    _, module = windows_excel_module
    seen = set()
    for e in catalogue.entries():
        for name in [e.name] + [a.name for a in e.args]:
            assert _VBA_ID.match(name), name
            assert not _CELL_REF.match(name), name
        assert e.name.upper() not in seen
        seen.add(e.name.upper())
        assert len({a.name.lower() for a in e.args}) == len(e.args)


def test_category_and_help_survive(windows_excel_module):
    _, module = windows_excel_module
    for e in catalogue.entries():
        xf = getattr(module, e.name).__xlfunc__
        assert xf["category"] == e.category
        assert xf["ret"]["doc"] == e.description
        assert len(e.description) <= 255
        for a, xa in zip(e.args, xf["args"]):
            assert xa["name"] == a.name
            assert xa["doc"] == a.full_help()[:255]
            assert 0 < len(xa["doc"]) <= 255
            assert ("optional" in xa) == a.optional
            # ranges arrive as rows of cells whatever their shape (a one-row range stays a row)
            assert (xa["options"].get("ndim") == 2) == (a.kind in RANGE_KINDS)
