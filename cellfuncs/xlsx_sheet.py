"""Reading and editing a worksheet part's ``sheetData`` with an XML parser, in place.

The part is parsed once per operation with expat (namespace aware, so ``x:``-prefixed SpreadsheetML
reads like the default namespace).  Each element of interest is located by its byte span in the
part; an edit replaces only the spans it changes, so everything else in the part (other elements,
attribute quoting, whitespace, namespace declarations) stays byte for byte as it was.  New elements
take the prefix the part uses for SpreadsheetML.

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
from xml.sax.saxutils import escape

_WS = b" \t\r\n"


def _err(msg):
    from cellfuncs.xlsx import BookError

    return BookError(msg)


class El:
    """An element's byte span: ``start`` ('<'), ``open_end`` (after the start tag), ``close`` (its
    end tag, or open_end when empty) and ``end``; ``attrs`` by local name, ``prefix`` like ``"x:"``."""

    __slots__ = ("local", "prefix", "start", "open_end", "close", "end", "attrs", "empty", "text", "kids")

    def __init__(self, local, prefix, start, open_end, attrs, empty):
        self.local, self.prefix, self.start, self.open_end = local, prefix, start, open_end
        self.attrs, self.empty = attrs, empty
        self.close = self.end = open_end
        self.text = None
        self.kids = None


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


def attr_pieces(data: bytes, start: int, open_end: int):
    """(qname_length, [(attribute qname, raw bytes with its leading space)]) of a start tag."""
    i = start + 1
    while i < open_end and data[i] not in _WS and data[i] not in b"/>":
        i += 1
    qlen = i - start - 1
    out = []
    while i < open_end:
        j = i
        while j < open_end and data[j] in _WS:
            j += 1
        if j >= open_end or data[j] in b"/>":
            break
        k = data.find(b"=", j, open_end)
        name = data[j:k].strip().decode("utf-8")
        q = k + 1
        while data[q] in _WS:
            q += 1
        close = data.find(data[q:q + 1], q + 1)
        out.append((name, data[i:close + 1]))
        i = close + 1
    return qlen, out


def _split(name: str):
    parts = name.split(" ")
    if len(parts) == 1:
        return parts[0], ""
    local = parts[1]
    prefix = parts[2] + ":" if len(parts) > 2 else ""
    return local, prefix


def _attrs(raw: dict) -> dict:
    out = {}
    for k, v in raw.items():
        if " " in k:
            bits = k.split(" ")
            out["{" + bits[0] + "}" + bits[1]] = v
        else:
            out[k] = v
    return out


def _parser(data: bytes):
    p = expat.ParserCreate(namespace_separator=" ")
    p.namespace_prefixes = True
    p.buffer_text = True

    def doctype(*_a):
        raise _err("a DOCTYPE declaration in a workbook part (refused)")

    p.StartDoctypeDeclHandler = doctype
    p.EntityDeclHandler = doctype
    return p


def _parse(p, data: bytes, what: str):
    try:
        p.Parse(data, True)
    except expat.ExpatError as exc:
        raise _err(f"{what}: not well-formed XML ({expat.ErrorString(exc.code)}, line {exc.lineno})") from None


def find_elements(data: bytes, locals_: set, what: str = "part") -> list:
    """Every element whose local name is in ``locals_``, with its span and attributes."""
    p = _parser(data)
    found, stack = [], []

    def start(name, attrs):
        local, prefix = _split(name)
        if local in locals_:
            i = p.CurrentByteIndex
            e = tag_end(data, i)
            el = El(local, prefix, i, e, _attrs(attrs), data[e - 2:e] == b"/>")
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


def start_tag(data: bytes, el: El, drop=(), add: str = "", empty: bool = False) -> bytes:
    """The element's start tag rebuilt: attributes in ``drop`` removed, ``add`` appended (text)."""
    qlen, pieces = attr_pieces(data, el.start, el.open_end)
    qname = data[el.start + 1: el.start + 1 + qlen]
    kept = b"".join(raw for name, raw in pieces if name not in drop)
    return b"<" + qname + kept + add.encode("utf-8") + (b"/>" if empty else b">")


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


def walk(data: bytes, visitor, what: str = "sheet") -> None:
    """Parse a worksheet part, calling ``visitor`` methods with spans:

    ``dimension(el)``, ``sheet_data_start(el)``, ``row_start(row)``, ``cell(cell, row)``,
    ``row_end(row)``, ``sheet_data_end(el)``.
    """
    p = _parser(data)
    st = {"depth": 0, "sd": None, "dim": None, "inside": False, "row": None, "cell": None, "kid": None,
          "collect": None, "in_rph": 0, "last_row": 0}

    def open_el(local, prefix, attrs):
        i = p.CurrentByteIndex
        e = tag_end(data, i)
        return El(local, prefix, i, e, attrs, data[e - 2:e] == b"/>")

    def start(name, attrs):
        d = st["depth"]
        st["depth"] = d + 1
        local, prefix = _split(name)
        if d == 1:
            if local == "dimension":
                st["dim"] = open_el(local, prefix, attrs)
            elif local == "sheetData" and st["sd"] is None:
                el = st["sd"] = open_el(local, prefix, attrs)
                st["inside"] = not el.empty
                visitor.sheet_data_start(el)
            return
        if not st["inside"]:
            return
        if d == 2:
            if local == "row":
                r = attrs.get("r")
                num = int(r) if r else st["last_row"] + 1
                st["last_row"] = num
                st["row"] = Row(num, open_el(local, prefix, attrs), bool(r))
                visitor.row_start(st["row"])
        elif d == 3:
            row = st["row"]
            if local == "c" and row is not None:
                ref = attrs.get("r")
                col = _ref_col(ref) if ref else row.last_col + 1
                row.last_col = col
                st["cell"] = Cell(row.num, col, open_el(local, prefix, attrs), bool(ref))
        elif d == 4:
            cell = st["cell"]
            if cell is None:
                return
            el = open_el(local, prefix, _attrs(attrs))
            cell.nkids += 1
            st["kid"] = el
            if local == "f":
                cell.f = el
            elif local == "v":
                cell.v = el
            elif local == "is":
                cell.is_ = el
            else:
                cell.others.append(el)
            if local in ("f", "v", "is"):
                el.text = []
                if local != "is":
                    st["collect"] = el.text
        elif st["kid"] is not None and st["kid"].local == "is":
            if local == "rPh":
                st["in_rph"] += 1
            elif local == "t" and not st["in_rph"]:
                st["collect"] = st["kid"].text

    def end(name):
        st["depth"] -= 1
        d = st["depth"]
        local, _ = _split(name)
        if d == 1:
            if local == "dimension" and st["dim"] is not None:
                _close(st["dim"], data, p)
                visitor.dimension(st["dim"])
            elif local == "sheetData" and st["sd"] is not None and (st["inside"] or st["sd"].empty):
                _close(st["sd"], data, p)
                st["inside"] = False
                visitor.sheet_data_end(st["sd"])
            return
        if not st["inside"]:
            return
        if d == 2:
            if local == "row" and st["row"] is not None:
                _close(st["row"].el, data, p)
                visitor.row_end(st["row"])
                st["row"] = None
        elif d == 3:
            if local == "c" and st["cell"] is not None:
                _close(st["cell"].el, data, p)
                visitor.cell(st["cell"], st["row"])
                st["cell"] = None
        elif d == 4:
            el = st["kid"]
            if el is not None:
                _close(el, data, p)
                if el.text is not None:
                    el.text = "".join(el.text)
                st["kid"] = None
                st["collect"] = None
        elif local == "rPh":
            st["in_rph"] -= 1
        elif local == "t":
            st["collect"] = None

    def chars(text):
        c = st["collect"]
        if c is not None:
            c.append(text)

    p.StartElementHandler, p.EndElementHandler, p.CharacterDataHandler = start, end, chars
    _parse(p, data, what)


def _close(el: El, data: bytes, p) -> None:
    if not el.empty:
        el.close = p.CurrentByteIndex
        el.end = data.find(b">", el.close) + 1


def _ref_col(ref: str) -> int:
    n = 0
    for ch in ref:
        if ch == "$":
            continue
        if not ch.isalpha():
            break
        n = n * 26 + (ord(ch.upper()) - 64)
    if n < 1:
        raise _err(f"not a cell reference: {ref!r}")
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


def col_text(n: int) -> str:
    s = ""
    while n:
        n, r = divmod(n - 1, 26)
        s = chr(65 + r) + s
    return s


def _num_text(v: float) -> str:
    if float(v).is_integer() and abs(v) < 1e15:
        return str(int(v))
    return repr(float(v))


def _esc(text: str) -> bytes:
    return escape(text).encode("utf-8")
