"""The Calc extension's parts that need no LibreOffice: the file, the type library, the runtime,
the component's set-up errors (with stand-ins for LibreOffice's ``uno`` modules).

Calc itself computing with the extension is tests/test_libreoffice.py.
"""

from __future__ import annotations

import math
import struct
import sys
import types
import zipfile

import pytest

from cellfuncs import catalogue
from cellfuncs.adapt import call as adapt_call
from cellfuncs.calc import build, runtime
from cellfuncs.calc.unoidl import Interface, Method, type_library
from cellfuncs.cli import main


@pytest.fixture(scope="module")
def oxt(tmp_path_factory):
    path = tmp_path_factory.mktemp("oxt") / "cellfuncs.oxt"
    assert main(["calc-extension", "-o", str(path)]) == 0
    return path


def test_extension_holds_manifest_types_component_and_job(oxt):
    with zipfile.ZipFile(oxt) as zf:
        names = set(zf.namelist())
        manifest = zf.read("META-INF/manifest.xml").decode()
        source = zf.read(build.COMPONENT).decode()
    assert names == {"META-INF/manifest.xml", "description.xml", build.TYPES, build.COMPONENT,
                     build.JOBS}
    for name in (build.TYPES, build.COMPONENT, build.JOBS):
        assert f'manifest:full-path="{name}"' in manifest
    compile(source, build.COMPONENT, "exec")  # valid Python for LibreOffice's interpreter


@pytest.mark.parametrize("bad", ["x.xlsx", "no/such/folder/x.oxt"])
def test_command_refuses_unusable_output(tmp_path, bad, capsys):
    assert main(["calc-extension", "-o", str(tmp_path / bad)]) == 2
    assert capsys.readouterr().err.startswith("cellfuncs: -o ")


def test_every_function_has_its_description_and_argument_help():
    table = build.functions_table()
    assert list(table) == [e.name for e in catalogue.entries()]
    for e in catalogue.entries():
        assert table[e.name]["args"] == [[a.name, a.full_help()] for a in e.args]
        assert table[e.name]["description"].startswith(e.description)
        assert table[e.name]["array"] == (e.shape != "scalar")


# --- the type library, read back by the layout of LibreOffice's unoidl/README.md -------------
def _u32(data, at):
    return struct.unpack_from("<I", data, at)[0]


def _string(data, at):
    n = _u32(data, at)
    assert not n & 0x80000000  # written inline, never as an offset
    return data[at + 4:at + 4 + n].decode("ascii"), at + 4 + n


def _map(data, at, count):
    out = {}
    for i in range(count):
        name_at, payload = _u32(data, at + 8 * i), _u32(data, at + 8 * i + 4)
        out[data[name_at:data.index(b"\0", name_at)].decode("ascii")] = payload
    assert list(out) == sorted(out)  # the reader bisects
    return out


def _strings(data, at):
    count, at, out = _u32(data, at), at + 4, []
    for _ in range(count):
        text, at = _string(data, at)
        out.append(text)
    return out, at


def _interface(data, at):
    assert data[at] & 0x3F == 5  # interface type
    bases, at = _strings(data, at + 1)
    optional, at = _strings(data, at)
    assert not optional and _u32(data, at) == 0  # no optional bases, no attributes
    count, at, methods = _u32(data, at + 4), at + 8, []
    for _ in range(count):
        name, at = _string(data, at)
        returns, at = _string(data, at)
        n, at, params = _u32(data, at), at + 4, []
        for _ in range(n):
            assert data[at] == 0  # direction "in"
            pname, at = _string(data, at + 1)
            ptype, at = _string(data, at)
            params.append((pname, ptype))
        _exceptions, at = _strings(data, at)
        methods.append((name, returns, tuple(params)))
    assert at <= len(data)
    return bases, methods


def test_type_library_layout_reads_back():
    data = type_library([build.interface()])
    assert data[:8] == b"UNOIDL\xff\x00"  # magic and format version 0
    node = _map(data, _u32(data, 8), _u32(data, 12))
    for module in ("org", "cellfuncs", "calc"):
        at = node[module]
        assert data[at] == 0  # a module
        node = _map(data, at + 5, _u32(data, at + 1))
    bases, methods = _interface(data, node["XCellFunctions"])
    assert bases == ["com.sun.star.uno.XInterface"]
    assert [m[0] for m in methods] == [e.name for e in catalogue.entries()]
    for (name, returns, params), e in zip(methods, catalogue.entries()):
        assert returns == ("[][]any" if e.shape != "scalar" else "any")
        assert params == tuple((a.name, "any") for a in e.args)


def test_type_library_refuses_a_name_used_twice():
    one = Interface("a.b.X", (Method("F", "any"),))
    with pytest.raises(ValueError):
        type_library([one, one])


# --- the runtime (what a Calc call runs) ----------------------------------------------------
def _error_number(v):
    assert isinstance(v, float) and math.isnan(v)
    return struct.unpack("<Q", struct.pack("<d", v))[0] & 0xFFFFFFFF


def test_error_values_are_calcs_numbers():
    # LibreOffice include/formula/errorcodes.hxx: IllegalFPOperation 503 (shown #NUM!),
    # NoValue 519 (shown #VALUE!) — from memory; tests/test_libreoffice.py sees Calc show them
    assert _error_number(runtime.error_value("#NUM!")) == 503
    assert _error_number(runtime.error_value("#VALUE!")) == 519


def test_runtime_gives_adapt_results_errors_and_arrays():
    entry = catalogue.by_name("HX_LMTD")
    assert runtime.call("HX_LMTD", (100.0, 60.0, 30.0, 40.2, None), False) == \
        adapt_call(entry, (100.0, 60.0, 30.0, 40.2))
    assert _error_number(runtime.call("HX_LMTD", (100.0, 60.0, 30.0, "x", None), False)) == 519
    assert _error_number(runtime.call("HX_LMTD", (100.0, 60.0, 30.0, 400.0, None), False)) == 503
    names = runtime.call("GAS_COMPONENTS", (), True)
    assert isinstance(names, tuple) and all(isinstance(r, tuple) and len(r) == 1 for r in names)
    assert names[0][0] == adapt_call(catalogue.by_name("GAS_COMPONENTS"), ())[0][0]
    # a range as Calc hands it over: a tuple of rows, empty cells ""
    gas = ((("methane",), ("ethane",), ("",)), ((95.0,), (5.0,), ("",)))
    assert runtime.call("GAS_CV", gas + (None,) * 4, False) == pytest.approx(
        adapt_call(catalogue.by_name("GAS_CV"), ([["methane"], ["ethane"]], [[95.0], [5.0]])),
        rel=1e-12)
    assert runtime.call("NO_SUCH_FUNCTION", (), False).startswith("#NAME? ")


# --- the component, with stand-ins for LibreOffice's modules --------------------------------
@pytest.fixture
def component(monkeypatch):
    """Load the generated component with stand-ins for uno/unohelper; returns a loader."""
    class Base:
        pass

    class Helper:
        def __init__(self):
            self.impls = []

        def addImplementation(self, cls, name, services):
            self.impls.append((cls, name, services))

    def struct_type(*fields):
        def init(self, *args):
            for f, v in zip(fields, args):
                setattr(self, f, v)
        return type("Struct", (), {"__init__": init})

    mods = {
        "unohelper": {"Base": Base, "ImplementationHelper": Helper},
        "com.sun.star.lang": {"Locale": struct_type("Language", "Country", "Variant"),
                              "XLocalizable": type("XL", (), {}), "XServiceInfo": type("XS", (), {}),
                              "XServiceName": type("XN", (), {})},
        "com.sun.star.sheet": {"LocalizedName": struct_type("Locale", "Name"),
                               "XAddIn": type("XA", (), {}),
                               "XCompatibilityNames": type("XC", (), {})},
        "com.sun.star.task": {"XJob": type("XJ", (), {})},
        "org.cellfuncs.calc": {"XCellFunctions": type("XF", (), {})},
    }
    for name, attrs in mods.items():
        mod = types.ModuleType(name)
        mod.__dict__.update(attrs)
        monkeypatch.setitem(sys.modules, name, mod)
    monkeypatch.setattr(sys, "path", list(sys.path))

    def load(info):
        ns = {"__name__": "cellfuncs_calc"}
        exec(compile(build.component_source(info), build.COMPONENT, "exec"), ns)  # noqa: S102
        return ns

    return load


def test_component_answers_calc_from_the_table(component):
    ns = component(build.build_info())
    addin = ns["CellFunctions"](None)
    assert addin.getProgrammaticFuntionName("hx_lmtd") == "HX_LMTD"
    assert addin.getDisplayArgumentName("HX_LMTD", 0) == catalogue.by_name("HX_LMTD").args[0].name
    assert addin.getCompatibilityNames("HX_LMTD")[0].Name == "HX_LMTD"
    assert addin.HX_LMTD(100.0, 60.0, 30.0, 40.2, None) == pytest.approx(
        adapt_call(catalogue.by_name("HX_LMTD"), (100.0, 60.0, 30.0, 40.2)), rel=1e-12)


def test_component_with_another_python_shows_what_to_do(component):
    info = dict(build.build_info(), python=[3, 0, 0])
    addin = component(info)["CellFunctions"](None)
    text = addin.HX_LMTD(100.0, 60.0, 30.0, 40.2, None)
    here = "%d.%d" % sys.version_info[:2]
    assert text.startswith(f"#VALUE! cellfuncs: LibreOffice runs Python {here} but this "
                           "extension was built with Python 3.0")
    assert "cellfuncs calc-extension" in text and "unopkg add" in text
    assert addin.HW_CHAIN(60.0, 35.0, ((100.0,),), None) == ((text,),)  # arrays: one cell


def test_component_relinks_only_unlinked_names(component):
    pattern = component(build.build_info())["_unlinked_pattern"]()
    assert pattern.search('=hx_lmtd(a1;b1;c1;d1)')
    assert pattern.search('=1+Gas_CV(B2:B6;C2:C6)')
    assert not pattern.search('=ORG.CELLFUNCS.CALC.CELLFUNCTIONS.HX_LMTD(a1;b1;c1;d1)')
    assert not pattern.search('=my_hx_lmtd(1)')
