"""The UNO component of the Calc extension (runs in LibreOffice's Python, not in the venv).

``cellfuncs calc-extension`` copies this file into the extension after a generated
block that defines ``BUILD`` (the building interpreter's version and the folders
holding cellfuncs and its dependencies) and ``FUNCTIONS`` (name -> description,
argument names and help, whether the result is an array).  It implements
com.sun.star.sheet.AddIn for Calc: the function names, descriptions and argument
help for the function wizard come from ``FUNCTIONS``; a call puts the recorded
folders on ``sys.path`` once, then hands over to :mod:`cellfuncs.calc.runtime`.
Nothing of cellfuncs is imported before the first call, so Calc can list the
functions even where cellfuncs cannot be loaded; every call then shows one text
saying what to do.  Not importable outside LibreOffice (it needs ``uno``).
"""

import re
import site
import sys

import unohelper
from com.sun.star.lang import Locale, XLocalizable, XServiceInfo, XServiceName
from com.sun.star.sheet import LocalizedName, XAddIn, XCompatibilityNames
from com.sun.star.task import XJob

from org.cellfuncs.calc import XCellFunctions  # the interface in the extension's types.rdb

BUILD = globals().get("BUILD", {})  # noqa: F821 - set by the generated block
FUNCTIONS = globals().get("FUNCTIONS", {})  # noqa: F821

IMPLEMENTATION = "org.cellfuncs.calc.CellFunctions"
SERVICES = ("com.sun.star.sheet.AddIn", IMPLEMENTATION)
RELINK = "org.cellfuncs.calc.Relink"  # the job run when a document is opened (Jobs.xcu)
FORMULA_CELLS = 16  # com.sun.star.sheet.CellFlags.FORMULA
CATEGORY = "Add-In"  # Calc has a fixed list of categories; others land here anyway

_STATE = {}


def _python_text(version):
    return "%d.%d" % tuple(version[:2])


def _setup():
    """Return cellfuncs.calc.runtime, or the one-line text every function shows instead."""
    if "runtime" in _STATE:
        return _STATE["runtime"]
    built = tuple(BUILD.get("python", ()))
    here = sys.version_info[:2]
    rebuild = ("build the extension again with `cellfuncs calc-extension -o cellfuncs.oxt` from a "
               "Python %s environment that has cellfuncs installed, then `unopkg add --force "
               "cellfuncs.oxt` (see docs/libreoffice.md)" % _python_text(here))
    if built[:2] != here:
        result = ("#VALUE! cellfuncs: LibreOffice runs Python %s but this extension was built with "
                  "Python %s; %s" % (_python_text(here), _python_text(built or (0, 0)), rebuild))
    else:
        before = list(sys.path)
        for folder in BUILD.get("site_dirs", ()):
            site.addsitedir(folder)  # also runs the .pth files there (editable installs)
        added = [p for p in tuple(BUILD.get("paths", ())) + tuple(p for p in sys.path if p not in before)
                 if p not in before]
        # the recorded folders first, so the packages cellfuncs was built with are used
        sys.path[:] = list(dict.fromkeys(added)) + [p for p in before if p not in added]
        try:
            from cellfuncs.calc import runtime
        except Exception as exc:  # noqa: BLE001 - shown in the cells instead
            text = " ".join(("%s: %s" % (type(exc).__name__, exc)).split())[:160]
            result = ("#VALUE! cellfuncs: cannot load cellfuncs from %s (%s); %s"
                      % (BUILD.get("executable", "?"), text, rebuild))
        else:
            result = runtime
    _STATE["runtime"] = result
    return result


def _make_method(name, array):
    def method(self, *args):
        runtime = _setup()
        if isinstance(runtime, str):
            return ((runtime,),) if array else runtime
        return runtime.call(name, args, array)

    method.__name__ = name
    return method


class CellFunctions(unohelper.Base, XCellFunctions, XAddIn, XCompatibilityNames, XServiceName,
                    XServiceInfo, XLocalizable):
    def __init__(self, ctx, *args):
        self.ctx = ctx
        self.locale = Locale("en", "US", "")

    # XAddIn (the programmatic name is the display name: the Excel name)
    def getProgrammaticFuntionName(self, display_name):
        name = display_name.upper()
        return name if name in FUNCTIONS else ""

    def getDisplayFunctionName(self, name):
        return name if name in FUNCTIONS else ""

    def getFunctionDescription(self, name):
        return FUNCTIONS[name]["description"] if name in FUNCTIONS else ""

    def getDisplayArgumentName(self, name, index):
        args = FUNCTIONS.get(name, {}).get("args", ())
        return args[index][0] if 0 <= index < len(args) else ""

    def getArgumentDescription(self, name, index):
        args = FUNCTIONS.get(name, {}).get("args", ())
        return args[index][1] if 0 <= index < len(args) else ""

    def getProgrammaticCategoryName(self, name):
        return CATEGORY

    def getDisplayCategoryName(self, name):
        return CATEGORY

    # XCompatibilityNames: the name in .xlsx files (Excel's name) is the same name
    def getCompatibilityNames(self, name):
        if name not in FUNCTIONS:
            return ()
        return (LocalizedName(Locale("en", "US", ""), name),)

    # XLocalizable
    def setLocale(self, locale):
        self.locale = locale

    def getLocale(self):
        return self.locale

    # XServiceName, XServiceInfo
    def getServiceName(self):
        return IMPLEMENTATION

    def getImplementationName(self):
        return IMPLEMENTATION

    def supportsService(self, name):
        return name in SERVICES

    def getSupportedServiceNames(self):
        return SERVICES


def _unlinked_pattern():
    """Our names as a formula shows them when Calc did not link them to the add-in on import."""
    if "pattern" not in _STATE:
        names = "|".join(sorted(map(re.escape, FUNCTIONS), key=len, reverse=True))
        _STATE["pattern"] = re.compile(r"(?<![.\w])(%s)\s*\(" % names, re.I) if names else None
    return _STATE["pattern"]


def relink(doc):
    """Enter again every formula that names our functions but was not linked to them.

    LibreOffice up to at least 7.4 does not map an add-in's compatibility (Excel) names when
    it reads an .xlsx, so ``=HX_LMTD(...)`` arrives as an unknown name (shown in lower case,
    #NAME? once recalculated).  Entering the same text again links it.  Returns the number
    of formulas entered again.
    """
    pattern = _unlinked_pattern()
    if pattern is None or not hasattr(doc, "Sheets"):
        return 0
    count = 0
    modified = doc.isModified()
    sheets = doc.Sheets
    for i in range(sheets.Count):
        sheet = sheets.getByIndex(i)
        done = set()
        for addr in sheet.queryContentCells(FORMULA_CELLS).RangeAddresses:
            block = sheet.getCellRangeByPosition(addr.StartColumn, addr.StartRow,
                                                 addr.EndColumn, addr.EndRow)
            for r, row in enumerate(block.getFormulaArray()):
                for c, formula in enumerate(row):
                    if not pattern.search(formula):
                        continue
                    cell = sheet.getCellByPosition(addr.StartColumn + c, addr.StartRow + r)
                    cursor = sheet.createCursorByRange(cell)
                    cursor.collapseToCurrentArray()
                    a = cursor.RangeAddress
                    key = (a.StartColumn, a.StartRow, a.EndColumn, a.EndRow)
                    if key in done:
                        continue
                    done.add(key)
                    text = cell.getFormula()  # an array formula reads "{=...}"
                    if text.startswith("{") and text.endswith("}"):
                        cursor.setArrayFormula(text[1:-1])
                    else:
                        cell.setFormula(text)
                    count += 1
    if count and not modified:
        doc.setModified(False)
    return count


class Relink(unohelper.Base, XJob, XServiceInfo):
    """Runs :func:`relink` on every spreadsheet opened (registered for OnLoad in Jobs.xcu)."""

    def __init__(self, ctx, *args):
        self.ctx = ctx

    def execute(self, args):
        for arg in args:
            if arg.Name == "Environment":
                for env in arg.Value:
                    if env.Name == "Model" and env.Value is not None:
                        try:
                            relink(env.Value)
                        except Exception:  # noqa: BLE001 - never disturb opening a document
                            pass
        return None

    def getImplementationName(self):
        return RELINK

    def supportsService(self, name):
        return name in (RELINK, "com.sun.star.task.Job")

    def getSupportedServiceNames(self):
        return (RELINK, "com.sun.star.task.Job")


for _name, _info in FUNCTIONS.items():
    setattr(CellFunctions, _name, _make_method(_name, _info["array"]))

g_ImplementationHelper = unohelper.ImplementationHelper()
g_ImplementationHelper.addImplementation(CellFunctions, IMPLEMENTATION, SERVICES)
g_ImplementationHelper.addImplementation(Relink, RELINK, (RELINK, "com.sun.star.task.Job"))
