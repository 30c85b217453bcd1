"""Read what the engine needs from a workbook package (read only, engine-agnostic).

The package's parts are read with an XML parser, so namespace prefixes, either
quote style and rows or cells without an ``r`` attribute are all understood.
Nothing here writes: the output is written by :mod:`cellfuncs.headless.package` and the
engine's private copy by :mod:`cellfuncs.headless.engine`.
"""

from __future__ import annotations

import posixpath
import re
import xml.etree.ElementTree as ET
from dataclasses import dataclass, field

from cellfuncs.headless.package import BookError, ErrorText, col_letters

__all__ = ["Cell", "BookData", "read_book", "ref_text"]

_ERRORS = {"#NULL!", "#DIV/0!", "#VALUE!", "#REF!", "#NAME?", "#NUM!", "#N/A", "#SPILL!", "#CALC!",
           "#GETTING_DATA"}
_REF = re.compile(r"^\$?([A-Za-z]{1,3})\$?(\d+)$")


def _local(tag: str) -> str:
    return tag.rsplit("}", 1)[-1]


def _attr(el, name):
    """An attribute by local name, whatever its prefix."""
    v = el.get(name)
    if v is not None:
        return v
    for k, val in el.attrib.items():
        if _local(k) == name:
            return val
    return None


def ref_text(row: int, col: int) -> str:
    return f"{col_letters(col)}{row}"


def parse_ref(ref: str):
    m = _REF.match(ref.strip())
    if not m:
        return None
    n = 0
    for ch in m.group(1).upper():
        n = n * 26 + ord(ch) - 64
    return int(m.group(2)), n


@dataclass
class Cell:
    """One cell as stored: a value, or a formula with its cached value.

    ``formula`` is the formula text (None for a value cell); ``ftype`` is the
    ``t`` attribute of the formula (``None``, ``"array"``, ``"shared"``,
    ``"dataTable"``); ``fattrs`` holds its other attributes (``ref``, ``si``,
    ``r1`` ...). ``value`` is the stored value (the cached one for a formula):
    float, str, bool, :class:`~cellfuncs.headless.package.ErrorText` or None.
    """

    formula: str | None
    ftype: str | None
    fattrs: dict
    value: object


@dataclass
class BookData:
    """What the engine needs from a workbook.

    sheets : [(name, part path)] in workbook order.
    cells : {sheet: {(row, col): Cell}}.
    names : [(name, local sheet index or None, text)].
    tables : [(sheet, name, (r1, c1, r2, c2), headers, header_rows, totals_rows)].
    """

    sheets: list = field(default_factory=list)
    cells: dict = field(default_factory=dict)
    names: list = field(default_factory=list)
    tables: list = field(default_factory=list)
    extent: dict = field(default_factory=dict)

    @property
    def sheet_names(self) -> list:
        return [s for s, _ in self.sheets]

    def sheet(self, name: str) -> str | None:
        """The sheet's name as written (case-insensitive lookup)."""
        for s, _ in self.sheets:
            if s.upper() == name.upper():
                return s
        return None


def _xml(parts: dict, path: str):
    data = parts.get(path)
    if data is None:
        return None
    try:
        return ET.fromstring(data)
    except ET.ParseError as exc:
        raise BookError(f"{path}: not well-formed XML ({exc})") from None


def _rels(parts: dict, part: str) -> dict:
    folder, base = posixpath.split(part)
    root = _xml(parts, posixpath.join(folder, "_rels", base + ".rels"))
    out = {}
    if root is None:
        return out
    for el in root:
        if _local(el.tag) == "Relationship" and (_attr(el, "TargetMode") or "") != "External":
            t = _attr(el, "Target") or ""
            out[_attr(el, "Id")] = t.lstrip("/") if t.startswith("/") else posixpath.normpath(
                posixpath.join(folder, t))
    return out


def _shared_strings(parts: dict, path: str | None) -> list:
    root = _xml(parts, path) if path else None
    if root is None:
        return []
    out = []
    for si in root:
        # the text runs of the item (<t>, or <r><t>); phonetic runs (<rPh>) are not part of the value
        parts = []
        for ch in si:
            name = _local(ch.tag)
            if name == "t":
                parts.append(ch.text or "")
            elif name == "r":
                parts.extend(t.text or "" for t in ch if _local(t.tag) == "t")
        out.append("".join(parts))
    return out


def _cell_value(c, t, strings):
    v = None
    inline = None
    for ch in c:
        name = _local(ch.tag)
        if name == "v":
            v = ch.text or ""
        elif name == "is":
            inline = "".join(x.text or "" for x in ch.iter() if _local(x.tag) == "t")
    if t == "inlineStr":
        return inline if inline is not None else (v or "")
    if v is None or (v == "" and t not in ("str", "s")):
        return None
    if t == "s":
        try:
            return strings[int(v)]
        except (ValueError, IndexError):
            return None
    if t in ("str", "d"):
        return v
    if t == "b":
        return v.strip() in ("1", "true")
    if t == "e":
        return ErrorText(v.strip()) if v.strip() in _ERRORS else ErrorText("#VALUE!")
    try:
        return float(v)
    except ValueError:
        return v


def _sheet_cells(root, strings) -> tuple:
    cells = {}
    max_r = max_c = 0
    data = next((el for el in root.iter() if _local(el.tag) == "sheetData"), None)
    if data is None:
        return cells, (0, 0)
    row_no = 0
    for row in data:
        if _local(row.tag) != "row":
            continue
        r = _attr(row, "r")
        row_no = int(r) if r and r.isdigit() else row_no + 1
        col_no = 0
        for c in row:
            if _local(c.tag) != "c":
                continue
            ref = _attr(c, "r")
            pos = parse_ref(ref) if ref else None
            if pos is None:
                pos = (row_no, col_no + 1)
            col_no = pos[1]
            t = _attr(c, "t")
            formula = ftype = None
            fattrs = {}
            for ch in c:
                if _local(ch.tag) == "f":
                    formula = ch.text or ""
                    fattrs = {_local(k): v for k, v in ch.attrib.items()}
                    ftype = fattrs.pop("t", None)
            value = _cell_value(c, t, strings)
            if formula is None and ftype is None and value is None:
                continue  # a styled blank
            cells[pos] = Cell(formula, ftype, fattrs, value)
            max_r, max_c = max(max_r, pos[0]), max(max_c, pos[1])
    return cells, (max_r, max_c)


def _table(parts, path, sheet):
    root = _xml(parts, path)
    if root is None:
        return None
    ref = _attr(root, "ref") or ""
    a, _, b = ref.partition(":")
    p1, p2 = parse_ref(a), parse_ref(b or a)
    if p1 is None or p2 is None:
        return None
    headers = [(_attr(el, "name") or "") for el in root.iter() if _local(el.tag) == "tableColumn"]
    header_rows = int(_attr(root, "headerRowCount") or 1)
    totals_rows = int(_attr(root, "totalsRowCount") or 0)
    name = _attr(root, "displayName") or _attr(root, "name") or ""
    return sheet, name, (p1[0], p1[1], p2[0], p2[1]), headers, header_rows, totals_rows


def read_book(parts: dict) -> BookData:
    """Sheets, cells, defined names and tables of a package held as ``{part: bytes}``."""
    wb = _xml(parts, "xl/workbook.xml")
    if wb is None:
        raise BookError("not an .xlsx workbook (no xl/workbook.xml)")
    rels = _rels(parts, "xl/workbook.xml")
    book = BookData()
    strings_path = next((p for p in parts if p.lower() == "xl/sharedstrings.xml"), None)
    strings = _shared_strings(parts, strings_path)
    for el in wb.iter():
        name = _local(el.tag)
        if name == "sheet":
            rid = _attr(el, "id")
            path = rels.get(rid)
            if path and path in parts:
                book.sheets.append((_attr(el, "name") or "", path))
        elif name == "definedName":
            local = _attr(el, "localSheetId")
            book.names.append((_attr(el, "name") or "", int(local) if local and local.isdigit() else None,
                               el.text or ""))
    for sheet, path in book.sheets:
        root = _xml(parts, path)
        if root is None or _local(root.tag) != "worksheet":
            continue  # a chart sheet or dialog sheet: nothing to compute
        book.cells[sheet], book.extent[sheet] = _sheet_cells(root, strings)
        srels = _rels(parts, path)
        for el in root.iter():
            if _local(el.tag) == "tablePart":
                tpath = srels.get(_attr(el, "id"))
                t = _table(parts, tpath, sheet) if tpath else None
                if t:
                    book.tables.append(t)
    return book
