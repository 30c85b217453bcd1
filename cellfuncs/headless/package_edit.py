"""The edits of a worksheet part, each one pass of :func:`cellfuncs.headless.package_sheet.walk`.

Every function takes the part's bytes and returns new bytes in which only the spans it had to
change differ; see :mod:`cellfuncs.headless.package_sheet` for how cells are located.
"""

from __future__ import annotations

from cellfuncs.headless.package_formula import shift_formula
from cellfuncs.headless.package_sheet import _Visitor, _esc, _num_text, apply_edits, col_text, start_tag, walk
from cellfuncs.headless.package_sheet import _GT, _parse, _parser, _ref_col, _split, tag_end
from cellfuncs.headless.package_sheet import open_end as opened

__all__ = ["extent", "map_formulas", "drop_empty", "edit_cells", "expand_shared", "to_values",
           "read_cells"]


def _err(msg):
    from cellfuncs.headless.package import BookError

    return BookError(msg)


def extent(data: bytes) -> tuple:
    """(last row, last column) of the cells present."""

    class V(_Visitor):
        rows = cols = 0

        def cell(self, cell, row):
            V.rows = max(V.rows, cell.row)
            V.cols = max(V.cols, cell.col)

    walk(data, V(), text=False)
    return V.rows, V.cols


def read_cells(data: bytes) -> dict:
    """{(row, col): (formula text or None, type, value text or None)} of every cell present."""
    out = {}

    class V(_Visitor):
        def cell(self, cell, row):
            f = cell.f.text if cell.f is not None else None
            v = cell.v.text if cell.v is not None else (cell.is_.text if cell.is_ is not None else None)
            out[(cell.row, cell.col)] = (f, cell.el.attrs.get("t", "n"), v)

    walk(data, V())
    return out


def map_formulas(data: bytes, fn) -> bytes:
    """Apply ``fn(text) -> text`` to the text of every formula element that has text.

    A lean pass of its own (only the ``f`` elements of cells are followed), as the engine's private
    copy maps every formula of the workbook.
    """
    edits = []
    p = _parser()
    depth = 0
    inside = False
    f_open = f_close = None
    text: list = []
    startswith = data.startswith

    def start(name, attrs):
        nonlocal depth, inside, f_open, f_close
        d = depth
        depth = d + 1
        if d == 4 and inside and (name == "f" or name.endswith(":f")):
            i = p.CurrentByteIndex
            f_open = tag_end(data, i) if attrs else data.find(b">", i) + 1
            f_close = ("</" + name).encode("utf-8")
            text.clear()
        elif d == 1 and not inside and _split(name)[0] == "sheetData":
            inside = True

    def end(name):
        nonlocal depth, inside, f_open
        depth -= 1
        if f_open is not None and depth == 4:
            i = p.CurrentByteIndex
            n = len(f_close)
            if startswith(f_close, i) and data[i + n:i + n + 1] in _GT:  # not an empty <f/>
                edits.append((f_open, i, _esc(fn("".join(text)))))
            f_open = None
        elif depth == 1 and inside:
            inside = False

    def chars(t):
        if f_open is not None:
            text.append(t)

    p.StartElementHandler, p.EndElementHandler, p.CharacterDataHandler = start, end, chars
    _parse(p, data, "sheet")
    return apply_edits(data, edits)


def drop_empty(data: bytes) -> tuple:
    """Remove ``dimension`` and cells with no content; give every row and cell an explicit ``r``.

    Returns (new bytes, (last row, last column) of the cells kept).  A lean pass of its own (no
    cell objects), as it runs on every sheet of the engine's private copy.
    """
    edits = []
    p = _parser()
    depth = 0
    inside = False
    row_num = last_col = max_row = max_col = 0
    cell_start = dim_start = None
    col = kids = 0
    explicit = False
    startswith, find = data.startswith, data.find

    def element_end(name, i):
        close = ("</" + name).encode("utf-8")
        if startswith(close, i) and data[i + len(close):i + len(close) + 1] in _GT:
            return find(b">", i) + 1
        return i

    def start(name, attrs):
        nonlocal depth, inside, row_num, last_col, cell_start, dim_start, col, kids, explicit
        d = depth
        depth = d + 1
        if not inside:
            if d == 1:
                local = _split(name)[0]
                if local == "sheetData":
                    inside = True
                elif local == "dimension":
                    dim_start = p.CurrentByteIndex
            return
        if d == 3:
            ref = attrs.get("r")
            col = _ref_col(ref) if ref else last_col + 1
            last_col, explicit, kids = col, bool(ref), 0
            cell_start = p.CurrentByteIndex
        elif d == 4:
            kids += 1
        elif d == 2:
            r = attrs.get("r")
            row_num = int(r) if r else row_num + 1
            last_col = 0
            if not r:
                pos = p.CurrentByteIndex + 1 + len(name)
                edits.append((pos, pos, f' r="{row_num}"'.encode()))

    def end(name):
        nonlocal depth, inside, cell_start, dim_start, max_row, max_col
        depth -= 1
        d = depth
        if d == 3 and cell_start is not None:
            if kids == 0:
                edits.append((cell_start, element_end(name, p.CurrentByteIndex), b""))
            else:
                if not explicit:
                    pos = cell_start + 1 + len(name)
                    edits.append((pos, pos, f' r="{col_text(col)}{row_num}"'.encode()))
                if row_num > max_row:
                    max_row = row_num
                if col > max_col:
                    max_col = col
            cell_start = None
        elif d == 1:
            if inside:
                inside = False
            elif dim_start is not None:
                edits.append((dim_start, element_end(name, p.CurrentByteIndex), b""))
                dim_start = None

    p.StartElementHandler, p.EndElementHandler = start, end
    _parse(p, data, "sheet")
    return apply_edits(data, edits), (max_row, max_col)


def _value_xml(p: str, value, formula_cell: bool, is_error) -> tuple:
    """(t attribute text, inner bytes) for a value."""
    if value is None:
        return "", b""
    if is_error(value):
        return ' t="e"', f"<{p}v>".encode() + _esc(str(value)) + f"</{p}v>".encode()
    if isinstance(value, bool):
        return ' t="b"', f"<{p}v>{int(value)}</{p}v>".encode()
    if isinstance(value, (int, float)):
        return "", f"<{p}v>{_num_text(value)}</{p}v>".encode()
    text = _esc(str(value))
    if formula_cell:
        return ' t="str"', f"<{p}v>".encode() + text + f"</{p}v>".encode()
    return (' t="inlineStr"', f'<{p}is><{p}t xml:space="preserve">'.encode() + text + f"</{p}t></{p}is>".encode())


def _cell_bytes(data, p, ref, old, value, formula_cell, is_error) -> bytes:
    t, inner = _value_xml(p, value, formula_cell, is_error)
    f_raw = b""
    ext = b""
    head = f'<{p}c r="{ref}"'.encode()
    if old is not None:
        head = start_tag(old.el, drop=("r", "t", "vm"), first=f' r="{ref}"')[:-1]
        if formula_cell and old.f is not None:
            f_raw = data[old.f.start:old.f.end]
        ext = b"".join(data[e.start:e.end] for e in old.others)
    body = f_raw + inner + ext
    if not body:
        return head + t.encode() + b"/>"
    return head + t.encode() + b">" + body + f"</{p}c>".encode()


def edit_cells(data: bytes, cells: dict, formula_cell: bool, is_error, what: str = "sheet") -> bytes:
    """Write ``{(row, col): value}`` into the cells (inserting missing rows and cells in order).

    ``formula_cell`` keeps each cell's formula and writes the value as its cached result; otherwise
    the value replaces the cell's content (an input).
    """
    by_row: dict = {}
    for (r, c), v in cells.items():
        by_row.setdefault(r, {})[c] = v
    pending_rows = sorted(by_row)
    edits = []
    state = {"p": "", "next": 0, "done_rows": set(), "order": None, "seen_sd": False}

    def new_row(r):
        p = state["p"]
        inner = b"".join(_cell_bytes(data, p, f"{col_text(c)}{r}", None, by_row[r][c], formula_cell, is_error)
                         for c in sorted(by_row[r]))
        state["done_rows"].add(r)
        return f'<{p}row r="{r}">'.encode() + inner + f"</{p}row>".encode()

    def rows_before(limit):
        out = []
        while state["next"] < len(pending_rows) and pending_rows[state["next"]] < limit:
            r = pending_rows[state["next"]]
            state["next"] += 1
            if r not in state["done_rows"]:
                out.append(new_row(r))
        return b"".join(out)

    class V(_Visitor):
        def sheet_data_start(self, el):
            state["p"] = el.prefix
            state["seen_sd"] = True

        def row_start(self, row):
            ins = rows_before(row.num)
            if ins:
                edits.append((row.el.start, row.el.start, ins))
            targets = by_row.get(row.num)
            if targets is None or row.num in state["done_rows"]:
                state["order"] = None
                return
            state["targets"] = targets
            state["order"] = sorted(targets)
            state["ptr"] = 0
            state["row_ins"] = False

        def cell(self, cell, row):
            order = state["order"]
            if order is None:
                return
            ptr, col, n = state["ptr"], cell.col, len(order)
            if ptr < n and order[ptr] < col:
                p, targets, start = state["p"], state["targets"], ptr
                while ptr < n and order[ptr] < col:
                    ptr += 1
                edits.append((cell.el.start, cell.el.start, b"".join(
                    _cell_bytes(data, p, f"{col_text(c)}{row.num}", None, targets[c], formula_cell, is_error)
                    for c in order[start:ptr])))
                state["row_ins"] = True
            if ptr < n and order[ptr] == col:
                edits.append((cell.el.start, cell.el.end, _cell_bytes(
                    data, state["p"], f"{col_text(col)}{row.num}", cell, state["targets"][col], formula_cell,
                    is_error)))
                ptr += 1
            state["ptr"] = ptr

        def row_end(self, row):
            order = state["order"]
            if order is None:
                return
            p, targets = state["p"], state["targets"]
            tail = b"".join(_cell_bytes(data, p, f"{col_text(c)}{row.num}", None, targets[c], formula_cell,
                                        is_error) for c in order[state["ptr"]:])
            if row.el.empty:
                head = start_tag(row.el, drop=("spans",))
                edits.append((row.el.start, row.el.end, head + tail + f"</{row.el.prefix}row>".encode()))
            else:
                if tail:
                    edits.append((row.el.close, row.el.close, tail))
                if tail or state["row_ins"]:
                    edits.append((row.el.start, opened(data, row.el), start_tag(row.el, drop=("spans",))))
            state["done_rows"].add(row.num)
            state["order"] = None

        def sheet_data_end(self, el):
            ins = rows_before(float("inf"))
            p = el.prefix
            if el.empty:
                edits.append((el.start, el.end, start_tag(el) + ins + f"</{p}sheetData>".encode()))
            elif ins:
                edits.append((el.close, el.close, ins))

    walk(data, V(), what, text=False)
    if not state["seen_sd"]:
        raise _err(f"{what}: has no cell data (sheetData)")
    return apply_edits(data, edits)


def expand_shared(data: bytes) -> bytes:
    """Write every shared formula out in full in each cell of its group."""
    masters: dict = {}
    edits = []

    class V(_Visitor):
        def cell(self, cell, row):
            f = cell.f
            if f is None or f.attrs.get("t") != "shared":
                return
            si = f.attrs.get("si")
            p = f.prefix
            if f.text:
                masters[si] = (cell.row, cell.col, f.text)
                edits.append((f.start, opened(data, f), start_tag(f, drop=("t", "si", "ref"))))
                return
            m = masters.get(si)
            if m is None:
                return
            text = shift_formula(m[2], cell.row - m[0], cell.col - m[1])
            edits.append((f.start, f.end, start_tag(f, drop=("t", "si", "ref")) + _esc(text)
                          + f"</{p}f>".encode()))

    walk(data, V())
    return apply_edits(data, edits)


def to_values(data: bytes) -> bytes:
    """Every formula cell holds only its cached value (text results become inline strings)."""
    edits = []

    class V(_Visitor):
        def cell(self, cell, row):
            if cell.f is None:
                return
            el = cell.el
            t = el.attrs.get("t", "n")
            p = el.prefix
            ext = b"".join(data[e.start:e.end] for e in cell.others)
            head = start_tag(el, drop=("r", "t", "cm"), first=f' r="{col_text(cell.col)}{cell.row}"')[:-1]
            if cell.v is None and cell.is_ is None:
                body, tt = b"", ""
            elif t == "str" and cell.v is not None:
                body = f'<{p}is><{p}t xml:space="preserve">'.encode() + _esc(cell.v.text or "") + \
                    f"</{p}t></{p}is>".encode()
                tt = ' t="inlineStr"'
            else:
                keep = cell.v if cell.v is not None else cell.is_
                body = data[keep.start:keep.end]
                tt = f' t="{t}"' if t != "n" else ""
            body += ext
            new = head + tt.encode() + (b">" + body + f"</{p}c>".encode() if body else b"/>")
            edits.append((el.start, el.end, new))

    walk(data, V())
    return apply_edits(data, edits)
