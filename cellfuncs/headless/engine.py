"""The formula engine (``formualizer``) and everything specific to it, workarounds included.

The rest of :mod:`cellfuncs.headless` knows nothing of the engine's types: it
hands this module the parts of a package and gets plain values back
(float, str, bool, None, :class:`~cellfuncs.headless.package.ErrorText`).

Catalogue functions are registered on each engine workbook with
``register_function(NAME, callback)``; the callback receives the evaluated
arguments as Python values (float, str, bool, ``None`` for a blank cell, a list
of rows for a range, a dict ``{"type": "Error", "kind": ...}`` for an error) and
returns a Python value, a list of rows, or an engine error value.

Workarounds for what the engine does not do by itself (all here):

* an omitted argument ``F(1,,3)`` would reach our functions as 0: the formula
  text is rewritten (:mod:`~cellfuncs.headless.formula_text`) so it arrives as
  the private text :data:`~cellfuncs.headless.formula_text.OMITTED`, which the
  callback turns into ``None`` ("missing": the default applies, as in Excel);
* the engine's error values carry no text we can read back: each catalogue
  call gets a tag argument and the callback files the message under it;
* tables (for structured references) are not read from the file: they are
  added from the table parts;
* a legacy array formula whose other cells hold cached values spills into
  them (``#SPILL!``): in the private copy the other cells are left out and the
  formula is wrapped in ``LET(x, ..., TAKE(x, MIN(ROWS(x), rows), MIN(COLUMNS(x),
  columns)))`` so a result larger than the range shows its top-left part and a
  smaller one is spread as Excel spreads it (see :meth:`Model.value`);
* the engine evaluates in several threads by default and would call our
  functions concurrently (the water properties then gave wrong numbers):
  evaluation is set to one thread;
* what-if data tables are not computed by the engine: their cells enter the
  private copy as their cached values and :meth:`Model.data_table_values`
  computes them by setting the input cell(s) and evaluating the table's formula;
* defined names whose formula calls one of our functions are dropped by the
  engine when it loads the file (the functions are registered afterwards):
  cells using them are reported as not computed (:meth:`Model.uses_dropped_name`);
* 3-D references (``SUM(Sheet1:Sheet3!A1)``) are expanded to a list of the
  sheets' cells (:mod:`~cellfuncs.headless.formula_text`); one naming a sheet
  that does not exist is reported as not computed.
"""

from __future__ import annotations

import io
import zipfile

from cellfuncs.headless.package import ErrorText, col_letters

from .formula_text import TAG, rewrite
# the engine's values in and out, and the callback of our functions (re-exported: the rest of
# cellfuncs.headless imports them from here)
from .values import (CODE_OF_KIND, INTERNAL_ERRORS, KIND_OF_CODE, LIMITATION_KINDS,  # noqa: F401
                     MAX_DATA_TABLE_CELLS, engine_error, engine_error_message, fz, is_engine_error,
                     make_callback, plain)

__all__ = ["KIND_OF_CODE", "CODE_OF_KIND", "make_callback", "engine_error", "is_engine_error",
           "engine_error_message", "Model", "INTERNAL_ERRORS"]


# ---------------------------------------------------------------------------------------------
# the private copy


def escape(text: str) -> str:
    """XML text (saxutils pulls in urllib at import, a measurable part of a cold start)."""
    return text.replace("&", "&amp;").replace("<", "&lt;").replace(">", "&gt;")


def _value_xml(ref: str, v) -> str:
    if v is None:
        return ""
    if isinstance(v, ErrorText):
        return f'<c r="{ref}" t="e"><v>{escape(str(v))}</v></c>'
    if isinstance(v, bool):
        return f'<c r="{ref}" t="b"><v>{int(v)}</v></c>'
    if isinstance(v, (int, float)):
        return f'<c r="{ref}"><v>{float(v)!r}</v></c>'
    return f'<c r="{ref}" t="inlineStr"><is><t xml:space="preserve">{escape(str(v))}</t></is></c>'


def _in(rect, r, c):
    return rect[0] <= r <= rect[2] and rect[1] <= c <= rect[3]


def _rect(ref: str):
    from .book import parse_ref

    a, _, b = (ref or "").replace("$", "").partition(":")
    p1, p2 = parse_ref(a) if a else None, parse_ref(b or a) if a else None
    if p1 is None or p2 is None:
        return None
    return (min(p1[0], p2[0]), min(p1[1], p2[1]), max(p1[0], p2[0]), max(p1[1], p2[1]))


class Model:
    """A workbook loaded in the engine with our functions registered.

    Parameters
    ----------
    parts : dict
        The package parts ``{name: bytes}`` (the input, unchanged).
    book : BookData
        What :func:`cellfuncs.headless.book.read_book` found in it.
    catalogue_names : frozenset
        Upper-case names of the catalogue functions.
    sets : dict
        ``{(sheet, row, col): value}`` applied to the private copy.
    """

    def __init__(self, parts, book, catalogue_names, sets=None):
        self.book = book
        self.messages: dict = {}
        self.formula_cells = []      # [(sheet, row, col)] cells the engine computes
        self.tags = {}               # tag -> (sheet, row, col)
        self.gaps = {}               # (sheet, row, col) -> reason (not computed; cached value kept)
        self.arrays = {}             # (sheet, row, col) -> (anchor row, anchor col) inside a legacy array
        self.array_shapes = {}       # (sheet, r, c) anchor -> (rows, cols)
        self.referenced_cells = 0
        self.functions = set()
        self.data_tables = []        # [(sheet, (r1, c1, r2, c2), attributes)]
        self.table_values = {}       # (sheet, row, col) -> value computed for a data table
        self.extra_extent = {}       # sheet -> (rows, cols) reached by array ranges beyond the cells
        self._snap = {}
        sets = sets or {}
        out_parts = {}
        sheet_names = book.sheet_names  # a list built on each access: once, not once per cell
        for sheet, path in book.sheets:
            cells = book.cells.get(sheet)
            if cells is None:
                continue
            ext_r, ext_c = book.extent.get(sheet, (0, 0))
            covered = {}
            for (r, c), cell in cells.items():
                if cell.ftype in ("array", "dataTable"):
                    rect = _rect(cell.fattrs.get("ref") or f"{col_letters(c)}{r}")
                    if rect and cell.ftype == "dataTable":
                        self.data_tables.append((sheet, rect, dict(cell.fattrs)))
                    if rect:
                        for rr in range(rect[0], rect[2] + 1):
                            for cc in range(rect[1], rect[3] + 1):
                                covered[(rr, cc)] = (cell.ftype, (r, c), rect)
            rows: dict = {}
            for (r, c), cell in sorted(cells.items()):
                ref = f"{col_letters(c)}{r}"
                key = (sheet, r, c)
                if (sheet, r, c) in sets:
                    _put(rows, r, c, _value_xml(ref, sets[key]))
                    continue
                cov = covered.get((r, c))
                if cov and cov[0] == "dataTable":
                    self.gaps[key] = "a what-if data table too large to compute"
                    self.formula_cells.append(key)
                    _put(rows, r, c, _value_xml(ref, cell.value))
                    continue
                if cov and cov[1] != (r, c):
                    self.arrays[key] = cov[1]
                    self.formula_cells.append(key)
                    continue  # filled by the anchor's result
                if cell.formula is None and cell.ftype is None:
                    _put(rows, r, c, _value_xml(ref, cell.value))
                    continue
                tag = TAG + str(len(self.tags))
                shared = cell.ftype == "shared"
                rw = rewrite(cell.formula or "", catalogue_names, None if shared else tag, sheet_names)
                if not shared:
                    self.tags[tag] = key
                self.functions |= rw.functions
                for sh, r1, c1, r2, c2 in rw.ranges:
                    target = book.sheet(sh) if sh else sheet
                    er, ec = book.extent.get(target, (ext_r, ext_c)) if target else (0, 0)
                    r2 = er if r2 == 0 else min(r2, er)
                    c2 = ec if c2 == 0 else min(c2, ec)
                    if r2 >= r1 and c2 >= c1:
                        self.referenced_cells += (r2 - r1 + 1) * (c2 - c1 + 1)
                reason = None
                if rw.three_d:
                    reason = "a 3-D reference across sheets (the engine does not compute them)"
                if reason:
                    self.gaps[key] = reason
                    _put(rows, r, c, _value_xml(ref, cell.value))
                    continue
                text = rw.text
                if cov and cov[0] == "array":
                    rect = cov[2]
                    nr, nc = rect[2] - rect[0] + 1, rect[3] - rect[1] + 1
                    self.array_shapes[key] = (nr, nc)
                    if nr * nc > 1:
                        text = (f"LET(cfarr,{text},TAKE(cfarr,MIN(ROWS(cfarr),{nr}),"
                                f"MIN(COLUMNS(cfarr),{nc})))")
                attrs = ""
                if shared:
                    attrs = ' t="shared"' + "".join(f' {k}="{escape(v)}"' for k, v in cell.fattrs.items()
                                                    if k in ("ref", "si"))
                self.formula_cells.append(key)
                body = escape(text) if (cell.formula or not shared) else ""
                _put(rows, r, c, f'<c r="{ref}"><f{attrs}>{body}</f></c>' if body else
                                              f'<c r="{ref}"><f{attrs}/></c>')
            for (r, c), cov in covered.items():
                er, ec = self.extra_extent.get(sheet, (0, 0))
                self.extra_extent[sheet] = (max(er, r), max(ec, c))
                if (r, c) not in cells and cov[0] == "array":
                    self.arrays[(sheet, r, c)] = cov[1]  # a cell of an array range the file does not list
                    self.formula_cells.append((sheet, r, c))
            for (sh, r, c), v in sets.items():
                if sh == sheet and (r, c) not in cells:
                    _put(rows, r, c, _value_xml(f"{col_letters(c)}{r}", v))
            xml = ['<?xml version="1.0" encoding="UTF-8" standalone="yes"?>'
                   '<worksheet xmlns="http://schemas.openxmlformats.org/spreadsheetml/2006/main"><sheetData>']
            for r in sorted(rows):
                xml.append(f'<row r="{r}">' + "".join(rows[r][c] for c in sorted(rows[r])) + "</row>")
            xml.append("</sheetData></worksheet>")
            out_parts[path] = "".join(xml).encode("utf-8")
        wb_xml = parts.get("xl/workbook.xml", b"").decode("utf-8", "replace")
        if any(n in wb_xml.upper() for n in catalogue_names) or "[" in wb_xml:
            out_parts["xl/workbook.xml"] = _names_for_engine(wb_xml, catalogue_names, book.sheet_names)
        self.private_parts = out_parts
        self._parts = parts
        self.wb = None
        self.dropped_names = set()

    # -- engine ------------------------------------------------------------------------------------
    def load(self, entries):
        """Load the private copy in the engine and register the catalogue functions."""
        buf = io.BytesIO()
        keep = ("[content_types].xml", "_rels/", "xl/workbook.xml", "xl/_rels/", "xl/worksheets/",
                "xl/sharedstrings.xml", "xl/styles.xml")
        with zipfile.ZipFile(buf, "w", zipfile.ZIP_STORED) as zf:
            for name, data in self._parts.items():
                low = name.lower()
                if not low.startswith(keep) or low.startswith("xl/worksheets/_rels/"):
                    continue
                zf.writestr(name, self.private_parts.get(name, data))
        # one thread: the engine would otherwise call our functions from several threads at
        # once, and the physics (water properties) is not made for that (wrong numbers seen)
        cfg = fz().EvaluationConfig()
        cfg.enable_parallel = False
        wb = fz().Workbook.from_bytes(buf.getvalue(), config=fz().WorkbookConfig(eval_config=cfg))
        for sheet, name, (r1, c1, r2, c2), headers, header_rows, totals_rows in self.book.tables:
            try:
                wb.add_table(name, sheet, (r1, c1, r2, c2), headers, header_row=header_rows > 0,
                             totals_row=totals_rows > 0)
            except Exception:  # noqa: BLE001 - a table the engine refuses: its references stay #NAME?
                pass
        for entry in entries:
            wb.register_function(entry.name.upper(), make_callback(entry, self.messages))
        # defined names holding a formula the engine could not load (e.g. one calling our
        # functions: they are registered only after loading); cells using them are not computed
        try:
            self.dropped_names = {d["name"].upper() for d in wb.name_import_diagnostics if d.get("name")}
        except Exception:  # noqa: BLE001
            self.dropped_names = set()
        self.wb = wb
        return self

    def uses_dropped_name(self, key) -> str | None:
        """The first defined name the engine could not load that the cell's formula uses."""
        if not self.dropped_names:
            return None
        import re

        stored = self.book.cells.get(key[0], {}).get((key[1], key[2]))
        text = re.sub(r'"(?:[^"]|"")*"', "", (stored.formula or "") if stored else "")
        for word in re.findall(r"[A-Za-z_\\][A-Za-z0-9_.\\]*", text):
            if word.upper() in self.dropped_names:
                return word
        return None

    def evaluate(self):
        self.messages.clear()
        self._snap = {}
        self.wb.evaluate_all()

    def set_value(self, sheet, row, col, value):
        self._snap = {}
        self.wb.set_value(sheet, row, col, value)

    def set_error(self, sheet, row, col, code: str):
        self._snap = {}
        self.wb.set_value(sheet, row, col, engine_error(code))

    def evaluate_cells(self, cells):
        self.messages.clear()
        self._snap = {}
        return self.wb.evaluate_cells([(s, r, c) for s, r, c in cells])

    def _get(self, sheet, row, col):
        """A cell's engine value, read sheet by sheet in one call (a call per cell is slow)."""
        snap = self._snap.get(sheet)
        if snap is None:
            er, ec = self.book.extent.get(sheet, (0, 0))
            er, ec = max(er, self.extra_extent.get(sheet, (0, 0))[0]), max(ec, self.extra_extent.get(sheet, (0, 0))[1])
            snap = self.wb.sheet(sheet).get_values(fz().RangeAddress(sheet, 1, 1, max(er, 1), max(ec, 1)))
            self._snap[sheet] = snap
        if row <= len(snap) and snap and col <= len(snap[0]):
            return snap[row - 1][col - 1]
        return self.wb.get_value(sheet, row, col)

    def value(self, sheet, row, col):
        """A computed cell as a plain value.

        A cell of a legacy array range beyond its result is filled as Excel does: a single
        value fills the range, a single row repeats down, a single column repeats across,
        anything else is #N/A.
        """
        key = (sheet, row, col)
        if key in self.table_values:
            return self.table_values[key]
        v = plain(self._get(sheet, row, col))
        if v is None and key in self.arrays:
            ar, ac = self.arrays[key]
            nr, nc = self.array_shapes.get((sheet, ar, ac), (1, 1))
            get = self._get
            rows_res = next((k for k in range(nr) if get(sheet, ar + k, ac) is None), nr)
            cols_res = next((k for k in range(nc) if get(sheet, ar, ac + k) is None), nc)
            i, j = row - ar, col - ac
            if rows_res == 1 and j < cols_res:
                return self.value(sheet, ar, ac + j)
            if cols_res == 1 and i < rows_res:
                return self.value(sheet, ar + i, ac)
            et = ErrorText("#N/A")
            et.kind = "Na"
            return et
        return 0.0 if v is None else v

    def data_table_values(self) -> dict:
        """Compute the what-if data tables: {(sheet, row, col): value}.

        For each cell of a table the input cell takes the value at the head of the cell's row
        or column and the table's formula is evaluated (ECMA-376 Part 1, 18.3.1.40: ``r1`` is
        the (row) input cell, ``r2`` the column input cell of a two-variable table, ``dtr``
        says a one-variable table's values are in a row).  The inputs get their values back
        afterwards.  A table larger than :data:`MAX_DATA_TABLE_CELLS` stays not computed.
        """
        from .book import parse_ref

        out = {}
        for sheet, (r1, c1, r2, c2), a in self.data_tables:
            if (r2 - r1 + 1) * (c2 - c1 + 1) > MAX_DATA_TABLE_CELLS:
                continue
            two = a.get("dt2D") in ("1", "true")
            row_wise = a.get("dtr") in ("1", "true")
            i1, i2 = parse_ref(a.get("r1", "")), parse_ref(a.get("r2", "")) if two else None
            if i1 is None or (two and i2 is None):
                continue
            saved = [(p, self.wb.get_value(sheet, *p)) for p in ([i1, i2] if two else [i1])]
            get = self.wb.get_value
            for r in range(r1, r2 + 1):
                for c in range(c1, c2 + 1):
                    if two:
                        self.wb.set_value(sheet, *i1, get(sheet, r1 - 1, c))
                        self.wb.set_value(sheet, *i2, get(sheet, r, c1 - 1))
                        formula = (r1 - 1, c1 - 1)
                    elif row_wise:
                        self.wb.set_value(sheet, *i1, get(sheet, r1 - 1, c))
                        formula = (r, c1 - 1)
                    else:
                        self.wb.set_value(sheet, *i1, get(sheet, r, c1 - 1))
                        formula = (r1 - 1, c)
                    v = self.wb.evaluate_cell(sheet, *formula)
                    out[(sheet, r, c)] = plain(v[0][0] if isinstance(v, list) and v and isinstance(v[0], list)
                                               else v)
            for p, v in saved:
                self.wb.set_value(sheet, *p, v)
        return out

    def messages_by_cell(self) -> dict:
        return {self.tags[t]: m for t, m in self.messages.items() if t in self.tags}

    def _trace(self, cells: list, direction: str, range_budget: int = 256, strict: bool = False):
        """Every cell reached from ``cells`` [(sheet, row, col)] in ``direction`` ("Dependents" or
        "Precedents"), as a set; None when that is not known for sure: references built at run
        time (INDIRECT, OFFSET), a trace that stopped at its budget (``range_budget`` = cells of a
        range followed), and with ``strict`` a node that is not one cell.
        """
        if self.functions & {"INDIRECT", "OFFSET"}:
            return None  # references built at run time are not traced
        roots = [f"'{s}'!{col_letters(c)}{r}" if not s.isalnum() else f"{s}!{col_letters(c)}{r}"
                 for s, r, c in cells]
        try:
            t = self.wb.trace(roots, direction=getattr(fz().TraceDirection, direction), max_depth=10_000,
                              max_nodes=1_000_000, max_links=4_000_000, max_work=50_000_000,
                              range_member_budget=range_budget)
        except Exception:  # noqa: BLE001 - unknown
            return None
        try:
            if t.truncation.incomplete:
                return None  # the trace stopped at its budget
        except AttributeError:
            return None
        from .book import parse_ref

        out = set()
        for addr in t.nodes.keys():
            sheet, _, ref = addr.rpartition("!")
            sheet = sheet[1:-1].replace("''", "'") if sheet.startswith("'") else sheet
            pos = parse_ref(ref)
            if pos:
                out.add((sheet, pos[0], pos[1]))
            elif strict:
                return None
        return out

    def dependents(self, cells: list) -> set:
        """Every cell that depends (directly or not) on ``cells`` [(sheet, row, col)].

        None when that is not known for sure (references built at run time by INDIRECT or
        OFFSET, or a trace that stopped at its budget): callers then treat every cell as dependent.
        """
        return self._trace(cells, "Dependents")

    def keep_only(self, cells: list) -> int | None:
        """Empty, in the engine, every formula cell that ``cells`` do not depend on.

        For ``cases``: only the outputs are read, and the engine's partial evaluation may
        evaluate more than the cells asked for (in the tender demo it evaluated every dirty
        formula, a whole sheet no output reads included).  Nothing is emptied when the precedents are not
        known for sure (see :meth:`_trace`) or the workbook has what-if data tables (computed
        around the engine).  A cell of a legacy array range brings its anchor's formula along.
        Returns the number of formula cells emptied, None when nothing was (every formula
        stays; evaluate the cells asked for, not everything).
        """
        if self.data_tables:
            return None
        need = set(cells)
        roots = list(cells)
        while roots:
            found = self._trace(roots, "Precedents", range_budget=1_000_000, strict=True)
            if found is None:
                return None
            found |= set(roots)
            need |= found
            roots = []
            for s, r, c in found:
                anchor = self.arrays.get((s, r, c))
                if anchor and (s, *anchor) not in need:
                    need.add((s, *anchor))
                    roots.append((s, *anchor))
        drop = [k for k in self.formula_cells if k not in need and k not in self.arrays]
        for s, r, c in drop:
            self.wb.set_value(s, r, c, None)
        self._snap = {}
        return len(drop)


def _names_for_engine(xml: str, catalogue_names, sheets) -> bytes:
    """Defined names' formulas as the engine should see them (omitted arguments, links)."""
    import re

    def sub(m):
        body = (m.group(2).replace("&lt;", "<").replace("&gt;", ">").replace("&quot;", '"')
                .replace("&apos;", "'").replace("&amp;", "&"))
        return m.group(1) + escape(rewrite(body, catalogue_names, None, sheets).text) + m.group(3)

    return re.sub(r"(<(?:\w+:)?definedName\b[^>]*>)(.*?)(</(?:\w+:)?definedName>)", sub, xml,
                  flags=re.S).encode("utf-8")


def _put(rows: dict, r: int, c: int, cell_xml: str):
    if cell_xml:
        rows.setdefault(r, {})[c] = cell_xml
