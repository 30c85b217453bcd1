"""The Excel adapter: every catalogue function as an xlwings UDF.

Set ``UDF Modules`` to ``cellfuncs.excel`` in the workbook's ``xlwings.conf``
sheet and press "Import Functions" on the xlwings ribbon.  Each attribute of
this module named like an Excel function (``HX_LMTD``) is generated from the
catalogue: a plain Python function with the catalogue's argument names,
decorated with ``xlwings.func`` (topmost), ``xlwings.arg`` per argument (its
help) and the function-wizard category.  Off Windows the xlwings decorators
are no-ops, so the module imports everywhere and the functions stay plain
Python callables.

A :class:`~cellfuncs.errors.CellInputError` becomes the cell's text,
``"#NUM! c_ratio: 1.4 is above 1"`` or ``"#VALUE! ..."``; any other exception
becomes ``"#VALUE! internal error: ..."`` (never a traceback in a cell).
"""

from __future__ import annotations

import xlwings as xw

from cellfuncs import catalogue
from cellfuncs.adapt import call as _adapt_call
from cellfuncs.catalogue.spec import RANGE_KINDS
from cellfuncs.errors import CellInputError

__all__: list = []

#: prefix of the text an unexpected exception leaves in a cell
INTERNAL_ERROR = "#VALUE! internal error: "


#: longest text a cell may show (a longer returned text shows #VALUE! in Excel)
TEXT_MAX = 255


def _fit(text: str) -> str:
    """An error text cut to Excel's 255 characters (a long echoed input is shortened)."""
    return text if len(text) <= TEXT_MAX else text[:TEXT_MAX - 1] + "…"


def _run(entry, values):
    try:
        return _adapt_call(entry, values)
    except CellInputError as exc:
        return _fit(exc.cell_text())
    except Exception as exc:  # noqa: BLE001 - a cell must never show a traceback
        text = " ".join(f"{type(exc).__name__}: {exc}".split())
        return INTERNAL_ERROR + text[:200]


_TEMPLATE = """
def {name}({params}):
    return _run(_entry, ({args}))
"""


def _make(entry):
    params = ", ".join(a.name + ("=None" if a.optional else "") for a in entry.args)
    args = "".join(a.name + ", " for a in entry.args)
    ns = {"_run": _run, "_entry": entry}
    exec(_TEMPLATE.format(name=entry.name, params=params, args=args), ns)  # noqa: S102
    fn = ns[entry.name]
    fn.__doc__ = entry.description
    fn.__module__ = __name__
    fn.__qualname__ = entry.name
    # decorators: ret/arg first (innermost), func topmost
    for a in reversed(entry.args):
        if a.kind in RANGE_KINDS:
            # always rows of cells: xlwings would flatten a one-row or one-column range
            fn = xw.arg(a.name, ndim=2, doc=a.full_help()[:255])(fn)
        else:
            fn = xw.arg(a.name, doc=a.full_help()[:255])(fn)
    fn = xw.func(category=entry.category)(fn)
    return fn


def _build():
    for entry in catalogue.entries():
        globals()[entry.name] = _make(entry)
        __all__.append(entry.name)


_build()
