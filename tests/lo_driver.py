"""Drive one headless LibreOffice for tests/test_libreoffice.py (run by LibreOffice's Python).

    /usr/bin/python3 tests/lo_driver.py JOB.json RESULT.json

JOB: {"profile": folder, "tasks": [...]}.  One soffice process is started with that
throwaway profile (-env:UserInstallation), every task runs in it, then it is closed.
Tasks:

* {"kind": "cells", "cells": [[ref, formula, rows, cols], ...], "values": [[ref, value], ...],
   "save": path or null} — a new spreadsheet; values are written, then formulas (an array
   formula when rows × cols > 1), everything recalculated; every formula cell is read.
* {"kind": "open", "path": book, "recalc": bool, "save": path or null, "pdf": null or
   {"sheet": name, "path": pdf}} — open a workbook (as a user would: no forced recalculation
   unless "recalc"), read every formula cell; optionally save it (.xlsx) or print one sheet.

* {"kind": "describe", "names": [...]} — the function wizard's entries for those names.

A cell read is {"ref": "Sheet!A1", "formula": ..., "error": Calc error number (0 = none),
"value": number or text, "text": what the cell shows}.
"""

import json
import os
import subprocess
import sys
import time

import uno
from com.sun.star.beans import PropertyValue

FORMULA_CELLS = 16  # com.sun.star.sheet.CellFlags.FORMULA
_STATE = {}


def _props(**kw):
    out = []
    for k, v in kw.items():
        p = PropertyValue()
        p.Name, p.Value = k, v
        out.append(p)
    return tuple(out)


def _col(n):
    s = ""
    n += 1
    while n:
        n, r = divmod(n - 1, 26)
        s = chr(65 + r) + s
    return s


def clean_env():
    """The environment without the tests' virtual environment, as a desktop session would
    start LibreOffice (the extension itself must find cellfuncs)."""
    env = dict(os.environ)
    venv = env.pop("VIRTUAL_ENV", None)
    for key in ("PYTHONHOME", "PYTHONPATH"):
        env.pop(key, None)
    if venv:
        env["PATH"] = os.pathsep.join(p for p in env.get("PATH", "").split(os.pathsep)
                                      if not os.path.abspath(p).startswith(os.path.abspath(venv)))
    return env


def _start_once(profile, attempt):
    pipe = "cellfuncs_test_%d_%d" % (os.getpid(), attempt)
    url = "file://" + os.path.abspath(profile)
    log = open(os.path.join(profile, "soffice.log"), "ab")
    proc = subprocess.Popen(
        ["soffice", "--headless", "--invisible", "--norestore", "--nologo", "--nodefault",
         "--nolockcheck", "-env:UserInstallation=" + url,
         "--accept=pipe,name=%s;urp;StarOffice.ComponentContext" % pipe],
        stdout=subprocess.DEVNULL, stderr=log, env=clean_env(), start_new_session=True)
    local = uno.getComponentContext()
    resolver = local.ServiceManager.createInstanceWithContext(
        "com.sun.star.bridge.UnoUrlResolver", local)
    deadline = time.time() + 90
    while True:
        try:
            ctx = resolver.resolve("uno:pipe,name=%s;urp;StarOffice.ComponentContext" % pipe)
            break
        except Exception:
            if proc.poll() is not None or time.time() > deadline:
                _stop(proc)
                return proc, None
            time.sleep(0.3)
    try:
        desktop = ctx.ServiceManager.createInstanceWithContext("com.sun.star.frame.Desktop", ctx)
    except Exception:
        _stop(proc)
        return proc, None
    _STATE["ctx"] = ctx  # for the "describe" task
    return proc, desktop


def _stop(proc):
    """End soffice and what it started (the soffice script runs soffice.bin as a child)."""
    import signal

    try:
        os.killpg(proc.pid, signal.SIGKILL)
    except OSError:
        pass
    try:
        proc.wait(timeout=30)
    except subprocess.TimeoutExpired:
        pass


def _start(profile):
    """Start soffice on the profile and connect; a first start that aborts is retried
    (seen now and then on the first start of a fresh profile)."""
    for attempt in range(3):
        proc, desktop = _start_once(profile, attempt)
        if desktop is not None:
            return proc, desktop
        sys.stderr.write("soffice exited with %s before accepting a connection; retrying\n"
                         % proc.poll())
    raise RuntimeError("soffice did not start (exit %s), see %s"
                       % (proc.poll(), os.path.join(profile, "soffice.log")))


def _read(doc):
    out = []
    sheets = doc.Sheets
    for i in range(sheets.Count):
        sheet = sheets.getByIndex(i)
        ranges = sheet.queryContentCells(FORMULA_CELLS)
        for addr in ranges.RangeAddresses:
            for row in range(addr.StartRow, addr.EndRow + 1):
                for col in range(addr.StartColumn, addr.EndColumn + 1):
                    cell = sheet.getCellByPosition(col, row)
                    err = cell.getError()
                    # FormulaResultType2: 1 value, 2 text (com.sun.star.sheet.FormulaResult)
                    is_text = cell.FormulaResultType2 == 2
                    out.append({"ref": "%s!%s%d" % (sheet.Name, _col(col), row + 1),
                                "formula": cell.getFormula(), "error": err,
                                "value": None if err else (cell.getString() if is_text
                                                           else cell.getValue()),
                                "text": cell.getString()})
    return out


def _cells(desktop, task):
    doc = desktop.loadComponentFromURL("private:factory/scalc", "_blank", 0, _props(Hidden=True))
    try:
        sheet = doc.Sheets.getByIndex(0)
        for ref, value in task.get("values", ()):
            cell = sheet.getCellRangeByName(ref)
            if isinstance(value, str):
                cell.setString(value)
            else:
                cell.setValue(value)
        for ref, formula, rows, cols in task["cells"]:
            if rows * cols > 1:
                start = sheet.getCellRangeByName(ref).CellAddress
                rng = sheet.getCellRangeByPosition(start.Column, start.Row,
                                                   start.Column + cols - 1, start.Row + rows - 1)
                rng.setArrayFormula(formula)
            else:
                sheet.getCellRangeByName(ref).setFormula(formula)
        doc.calculateAll()
        result = _read(doc)
        if task.get("save"):
            doc.storeToURL("file://" + os.path.abspath(task["save"]),
                           _props(FilterName="Calc MS Excel 2007 XML"))
        return result
    finally:
        doc.close(True)


def _describe(desktop, task):
    """What Calc's function wizard knows of the functions whose names are listed."""
    ctx = _STATE["ctx"]
    descs = ctx.ServiceManager.createInstanceWithContext(
        "com.sun.star.sheet.FunctionDescriptions", ctx)
    wanted = set(task["names"])
    out = []
    for i in range(descs.Count):
        props = {p.Name: p.Value for p in descs.getByIndex(i)}
        if props.get("Name") in wanted:
            out.append({"ref": props["Name"], "description": props.get("Description", ""),
                        "category": props.get("Category"),
                        "args": [[a.Name, a.Description, a.IsOptional]
                                 for a in (props.get("Arguments") or ())]})
    return out


def _open(desktop, task):
    url = "file://" + os.path.abspath(task["path"])
    doc = desktop.loadComponentFromURL(url, "_blank", 0, _props(Hidden=True))
    try:
        if task.get("recalc"):
            doc.calculateAll()
        result = _read(doc)
        if task.get("save"):
            doc.storeToURL("file://" + os.path.abspath(task["save"]),
                           _props(FilterName="Calc MS Excel 2007 XML"))
        pdf = task.get("pdf")
        if pdf:
            sheets = doc.Sheets
            if not sheets.hasByName(pdf["sheet"]):
                raise KeyError("no sheet named %r" % pdf["sheet"])
            for i in range(sheets.Count):  # only visible sheets are printed
                sheet = sheets.getByIndex(i)
                sheet.IsVisible = sheet.Name == pdf["sheet"]
            doc.storeToURL("file://" + os.path.abspath(pdf["path"]),
                           _props(FilterName="calc_pdf_Export"))
        return result
    finally:
        doc.close(True)


def main(job_path, result_path):
    with open(job_path, encoding="utf-8") as fh:
        job = json.load(fh)
    proc, desktop = _start(job["profile"])
    results = []
    try:
        for task in job["tasks"]:
            try:
                run = {"cells": _cells, "open": _open, "describe": _describe}[task["kind"]]
                results.append({"ok": True, "cells": run(desktop, task)})
            except Exception as exc:  # reported to the test, which fails with it
                results.append({"ok": False, "error": "%s: %s" % (type(exc).__name__, exc)})
    finally:
        try:
            desktop.terminate()
        except Exception:
            pass
        try:
            proc.wait(timeout=30)
        except subprocess.TimeoutExpired:
            pass
        _stop(proc)  # whatever is left of the process group
    with open(result_path, "w", encoding="utf-8") as fh:
        json.dump(results, fh)


if __name__ == "__main__":
    main(*sys.argv[1:3])
