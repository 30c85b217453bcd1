"""Reading and editing a worksheet part's ``sheetData`` with an XML parser, in place.

The part is parsed once per operation with expat; elements are matched by their local name at
their depth (worksheet, sheetData, row, c, child of c), so ``x:``-prefixed SpreadsheetML reads like
the default namespace.  Each element of interest is located by its byte span in the part (expat's
byte index of each start and end event); an edit replaces only the spans it changes, so everything
else in the part (other elements and cells, attribute quoting, whitespace, namespace declarations)
stays byte for byte as it was.  A rewritten cell's start tag is rebuilt from its parsed attributes
(double quotes); new elements take the prefix the part uses for ``sheetData``.  A DOCTYPE or an
entity declaration stops the parse with a refusal.

Positions follow the format's rules: a ``row`` without ``r`` is the row after the previous one (the
first is row 1), a ``c`` without ``r`` the column after the previous cell of its row (the first is
column A).  Every cell written or inserted gets an explicit ``r``.

References
----------
ECMA-376 Part 1, 18.3.1.73 (row, ``r`` optional), 18.3.1.4 (c, ``r`` optional, ``t`` cell types),
18.3.1.40 (f), 18.3.1.96 (v), 18.3.1.53 (is, inline string); W3C XML 1.0, 2.3 and 3.1 (attribute
values in single or double quotes; start tags and empty-element tags).
"""

from __future__ import annotations

import xml.parsers.expat as expat

from cellfuncs.headless.package_formula import col_letters as col_text


def escape(data: str, entities: dict | None = None) -> str:
    """``&``, ``<``, ``>`` (and ``entities``) escaped, as xml.sax.saxutils.escape does; that
    module imports urllib, a measurable part of a cold ``cellfuncs recalc``."""
    data = data.replace("&", "&amp;").replace(">", "&gt;").replace("<", "&lt;")
    for k, v in (entities or {}).items():
        data = data.replace(k, v)
    return data


def _err(msg):
    from cellfuncs.headless.package import BookError

    return BookError(msg)


class El:
    """An element's byte span: ``start`` ('<'), ``close`` (its end tag, or ``end`` when empty) and
    ``end``; :func:`open_end` gives the end of its start tag.  ``attrs`` as expat reports them
    (by the qualified names written in the part), ``prefix`` like ``"x:"``."""

    __slots__ = ("local", "prefix", "start", "_open_end", "close", "end", "attrs", "empty", "text")

    def __init__(self, local, prefix, start, attrs):
        self.local, self.prefix, self.start, self.attrs = local, prefix, start, attrs
        self._open_end = self.close = self.end = self.text = None
        self.empty = False


def open_end(data: bytes, el: El) -> int:
    """Index after the element's start tag (computed once)."""
    if el._open_end is None:
        if el.empty:
            el._open_end = el.end
        elif not el.attrs:  # nothing but the name (and maybe blanks) in the tag
            el._open_end = data.find(b">", el.start + 1 + len(el.prefix) + len(el.local)) + 1
        else:
            el._open_end = tag_end(data, el.start)
    return el._open_end


_GT = (b">", b" ", b"\t", b"\r", b"\n")


def tag_end(data: bytes, i: int) -> int:
    """Index after the start tag beginning at i ('>' outside quoted attribute values)."""
    while True:
        gt = data.find(b">", i)
        if gt < 0:
            return len(data)
        q1, q2 = data.find(b'"', i, gt), data.find(b"'", i, gt)
        qs = [q for q in (q1, q2) if q >= 0]
        if not qs:
            return gt + 1
        q = min(qs)
        close = data.find(data[q:q + 1], q + 1)
        i = close + 1 if close >= 0 else len(data)


def _split(name: str):
    """("c", "x:", b"</x:c") for the qualified name "x:c"."""
    prefix, _, local = name.rpartition(":")
    prefix = prefix + ":" if prefix else ""
    return local, prefix, ("</" + name).encode("utf-8")


def _parser():
    p = expat.ParserCreate()
    p.buffer_text = True
    p.StartDoctypeDeclHandler = p.EntityDeclHandler = _refuse_doctype
    return p


def _parse(p, data: bytes, what: str):
    try:
        p.Parse(data, True)
    except expat.ExpatError as exc:
        err = _err(f"not well-formed XML ({expat.ErrorString(exc.code)}, line {exc.lineno})")
        err.xml_error = True
        raise err from None


def parse_only(data: bytes, what: str = "part") -> None:
    """Check that the part is well-formed XML without a DOCTYPE (no Python handler per element)."""
    _parse(_parser(), data, what)


def find_elements(data: bytes, locals_: set, what: str = "part") -> list:
    """Every element whose local name is in ``locals_``, with its span and attributes (by the
    qualified names written in the part)."""
    p = _parser()
    found, stack = [], []

    def start(name, attrs):
        local, prefix, _ = _split(name)
        if local in locals_:
            i = p.CurrentByteIndex
            e = tag_end(data, i)
            el = El(local, prefix, i, attrs)
            el._open_end = e
            if data[e - 2:e] == b"/>":
                el.empty, el.close, el.end = True, e, e
            found.append(el)
            stack.append(el)
        else:
            stack.append(None)

    def end(name):
        el = stack.pop()
        if el is not None and not el.empty:
            el.close = p.CurrentByteIndex
            el.end = data.find(b">", el.close) + 1

    p.StartElementHandler, p.EndElementHandler = start, end
    _parse(p, data, what)
    return found


def apply_edits(data: bytes, edits: list) -> bytes:
    """Replace the spans (start, end, new bytes); spans must not overlap."""
    if not edits:
        return data
    edits.sort(key=lambda e: (e[0], e[1]))
    out, pos = [], 0
    for s, e, new in edits:
        out.append(data[pos:s])
        out.append(new)
        pos = e
    out.append(data[pos:])
    return b"".join(out)


_ATTR_ENT = {'"': "&quot;", "\n": "&#10;", "\r": "&#13;", "\t": "&#9;"}


def start_tag(el: El, drop=(), first: str = "", empty: bool = False) -> bytes:
    """The element's start tag rebuilt from its attributes (document order, double quotes):
    ``first`` (text) right after the name, attributes in ``drop`` left out."""
    kept = "".join(f' {k}="{escape(v, _ATTR_ENT)}"' for k, v in el.attrs.items() if k not in drop)
    return f"<{el.prefix}{el.local}{first}{kept}{'/>' if empty else '>'}".encode("utf-8")


# -- walking sheetData ---------------------------------------------------------------------------

class Cell:
    __slots__ = ("row", "col", "el", "explicit", "f", "v", "is_", "others", "nkids")

    def __init__(self, row, col, el, explicit):
        self.row, self.col, self.el, self.explicit = row, col, el, explicit
        self.f = self.v = self.is_ = None
        self.others = []
        self.nkids = 0


class Row:
    __slots__ = ("num", "el", "explicit", "last_col")

    def __init__(self, num, el, explicit):
        self.num, self.el, self.explicit, self.last_col = num, el, explicit, 0


def walk(data: bytes, visitor, what: str = "sheet", text: bool = True) -> None:
    """Parse a worksheet part, calling ``visitor`` methods with spans:

    ``dimension(el)``, ``sheet_data_start(el)``, ``row_start(row)``, ``cell(cell, row)``,
    ``row_end(row)``, ``sheet_data_end(el)``.  ``text=False`` skips collecting formula and value
    text and the spans of ``v`` and ``is`` (faster when only positions matter).

    Elements are matched by local name at their depth (root, sheetData, row, c, child of c), so a
    prefixed part (``x:c``) reads like an unprefixed one.
    """
    p = _parser()
    names: dict = {}
    depth = 0
    sd = dim = row = cell = kid = collect = None
    inside = False
    in_rph = 0
    last_row = 0
    startswith = data.startswith
    find = data.find

    def split(name):
        got = names.get(name)
        if got is None:
            got = names[name] = _split(name)
        return got

    def finish(el, close_tag):
        """Set el's end from the end event: its end tag starts there, or the empty element ended."""
        i = p.CurrentByteIndex
        n = len(close_tag)
        if startswith(close_tag, i) and data[i + n:i + n + 1] in _GT:
            el.close = i
            el.end = find(b">", i) + 1
        else:
            el.empty = True
            el.close = el.end = i

    def start(name, attrs):
        nonlocal depth, sd, dim, inside, row, cell, kid, collect, in_rph, last_row
        d = depth
        depth = d + 1
        if not inside:
            if d == 1:
                local, prefix, _ = split(name)
                if local == "dimension":
                    dim = El(local, prefix, p.CurrentByteIndex, attrs)
                elif local == "sheetData" and sd is None:
                    sd = El(local, prefix, p.CurrentByteIndex, attrs)
                    inside = True
                    visitor.sheet_data_start(sd)
            return
        if d == 3:
            if row is not None:
                local, prefix, _ = split(name)
                if local == "c":
                    ref = attrs.get("r")
                    col = _ref_col(ref) if ref else row.last_col + 1
                    row.last_col = col
                    cell = Cell(row.num, col, El(local, prefix, p.CurrentByteIndex, attrs), bool(ref))
        elif d == 4:
            if cell is None:
                return
            cell.nkids += 1
            local, prefix, _ = split(name)
            if local == "f":
                kid = cell.f = El(local, prefix, p.CurrentByteIndex, attrs)
                if text:
                    collect = kid.text = []
            elif local == "v" or local == "is":
                if text:
                    kid = El(local, prefix, p.CurrentByteIndex, attrs)
                    kid.text = []
                    if local == "v":
                        cell.v = kid
                        collect = kid.text
                    else:
                        cell.is_ = kid
                else:
                    cell.v = True  # present; no span needed
            else:
                kid = El(local, prefix, p.CurrentByteIndex, attrs)
                cell.others.append(kid)
        elif d == 2:
            local, prefix, _ = split(name)
            if local == "row":
                r = attrs.get("r")
                num = int(r) if r else last_row + 1
                last_row = num
                row = Row(num, El(local, prefix, p.CurrentByteIndex, attrs), bool(r))
                visitor.row_start(row)
        elif d > 4 and text and kid is not None and kid.local == "is":
            local = split(name)[0]
            if local == "rPh":
                in_rph += 1
            elif local == "t" and not in_rph:
                collect = kid.text

    def end(name):
        nonlocal depth, inside, row, cell, kid, collect, in_rph
        depth -= 1
        d = depth
        if not inside:
            if d == 1 and dim is not None and dim.end is None and split(name)[0] == "dimension":
                finish(dim, split(name)[2])
                visitor.dimension(dim)
            return
        if d == 4:
            if kid is not None:
                finish(kid, split(name)[2])
                if kid.text is not None:
                    kid.text = "".join(kid.text)
                kid = collect = None
        elif d == 3:
            if cell is not None:
                finish(cell.el, split(name)[2])
                visitor.cell(cell, row)
                cell = None
        elif d == 2:
            if row is not None:
                finish(row.el, split(name)[2])
                visitor.row_end(row)
                row = None
        elif d == 1:
            finish(sd, split(name)[2])
            inside = False
            visitor.sheet_data_end(sd)
        elif text and kid is not None:
            local = split(name)[0]
            if local == "rPh":
                in_rph -= 1
            elif local == "t":
                collect = None

    def chars(t):
        if collect is not None:
            collect.append(t)

    p.StartElementHandler, p.EndElementHandler = start, end
    if text:
        p.CharacterDataHandler = chars
    _parse(p, data, what)


def _refuse_doctype(*_a):
    raise _err("a DOCTYPE declaration in a workbook part (refused)")


_COLS: dict = {}


def _ref_col(ref: str) -> int:
    letters = ref.rstrip("0123456789").lstrip("$").rstrip("$")
    n = _COLS.get(letters)
    if n is None:
        n = 0
        for ch in letters.upper():
            if not "A" <= ch <= "Z":
                raise _err(f"not a cell reference: {ref!r}")
            n = n * 26 + (ord(ch) - 64)
        if not 1 <= n <= 16384:
            raise _err(f"not a cell reference: {ref!r}")
        _COLS[letters] = n
    return n


class _Visitor:
    def dimension(self, el):
        pass

    def sheet_data_start(self, el):
        pass

    def row_start(self, row):
        pass

    def cell(self, cell, row):
        pass

    def row_end(self, row):
        pass

    def sheet_data_end(self, el):
        pass




def _num_text(v: float) -> str:
    if float(v).is_integer() and abs(v) < 1e15:
        return str(int(v))
    return repr(float(v))


def _esc(text: str) -> bytes:
    return escape(text).encode("utf-8")
