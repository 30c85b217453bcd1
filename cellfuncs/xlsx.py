"""Small, careful edits of an .xlsx package: cell values and cached results.

The headless recalculation must hand back the *same* workbook (styles,
defined names, data validation, comments, charts, column widths) with the
computed numbers stored as the formula cells' cached values.  Loading and
saving through openpyxl would drop charts and images, so this module edits
the sheet XML of the package directly and leaves every other part untouched.

Only ``<sheetData>`` is edited: a cell element is replaced by one with the
same reference, style and formula and a new value; a cell that an array
formula covers but that the file does not list yet is inserted in column
order.  ``fullCalcOnLoad`` is switched off so that a reader without the add-in
keeps the numbers.
"""

from __future__ import annotations

import os
import posixpath
import re
import tempfile
import zipfile
import zlib
from xml.sax.saxutils import escape

__all__ = ["BookError", "Package", "col_index", "split_ref"]


class BookError(Exception):
    """The file is not a workbook this tool can use (one line message)."""


_CELL_RE = re.compile(r'<c(?=[\s>/])(?:[^>"]|"[^"]*")*?(?:/>|>.*?</c>)', re.S)
_ROW_RE = re.compile(r'<row(?=[\s>/])(?:[^>"]|"[^"]*")*?(?:/>|>.*?</row>)', re.S)
_ATTR_RE = re.compile(r'([\w:]+)="([^"]*)"')
_F_RE = re.compile(r'<f(?=[\s>/])(?:[^>"]|"[^"]*")*?(?:/>|>.*?</f>)', re.S)
_REF_RE = re.compile(r"^\$?([A-Za-z]{1,3})\$?(\d+)$")


def col_index(letters: str) -> int:
    n = 0
    for ch in letters.upper():
        n = n * 26 + (ord(ch) - 64)
    return n


def col_letters(n: int) -> str:
    s = ""
    while n:
        n, r = divmod(n - 1, 26)
        s = chr(65 + r) + s
    return s


MAX_ROW, MAX_COL = 1048576, 16384  # the size of a worksheet


def split_ref(ref: str):
    """``"B12"`` -> (12, 2); a reference outside a worksheet is a BookError."""
    m = _REF_RE.match(ref.strip())
    if not m:
        raise BookError(f"not a cell reference: {ref!r}")
    row, col = int(m.group(2)), col_index(m.group(1))
    if not (1 <= row <= MAX_ROW and 1 <= col <= MAX_COL):
        raise BookError(f"{ref}: outside a worksheet (rows 1 to {MAX_ROW}, columns A to XFD)")
    return row, col


def _attrs(tag_text: str) -> dict:
    head = tag_text.split(">", 1)[0]
    return dict(_ATTR_RE.findall(head))


def _num_text(v: float) -> str:
    if float(v).is_integer() and abs(v) < 1e15:
        return str(int(v))
    return repr(float(v))


class Package:
    """An .xlsx file held in memory as its zip parts.

    Parameters
    ----------
    path : str
        The workbook to read.

    Raises
    ------
    BookError
        Missing file, not a zip, corrupt zip, not a spreadsheet package.
    """

    def __init__(self, path: str):
        if not os.path.isfile(path):
            raise BookError(f"{path}: no such file")
        try:
            with zipfile.ZipFile(path) as zf:
                bad = zf.testzip()
                if bad is not None:
                    raise BookError(f"{path}: corrupt zip member {bad}")
                self.infos = zf.infolist()
                self.parts = {i.filename: zf.read(i.filename) for i in self.infos}
        except zipfile.BadZipFile:
            raise BookError(f"{path}: not an .xlsx workbook (not a zip file)") from None
        except (OSError, EOFError, zipfile.LargeZipFile, RuntimeError, ValueError, zlib.error) as exc:
            raise BookError(f"{path}: cannot read the workbook ({exc})") from None
        if "xl/workbook.xml" not in self.parts:
            raise BookError(f"{path}: not an .xlsx workbook (no xl/workbook.xml)")
        if any(n.lower().endswith("vbaproject.bin") for n in self.parts):
            # macros are never run; keeping the file is fine, but say nothing runs
            self.has_macros = True
        else:
            self.has_macros = False
        self._sheets = self._sheet_map()

    # -- structure -------------------------------------------------------------------
    def _sheet_map(self) -> dict:
        wb = self.parts["xl/workbook.xml"].decode("utf-8")
        rels = self.parts.get("xl/_rels/workbook.xml.rels", b"").decode("utf-8")
        targets = {}
        for m in re.finditer(r"<Relationship\b[^>]*>", rels):
            a = dict(_ATTR_RE.findall(m.group(0)))
            targets[a.get("Id")] = a.get("Target", "")
        out = {}
        for m in re.finditer(r"<sheet\b[^>]*>", wb):
            a = dict(_ATTR_RE.findall(m.group(0)))
            rid = a.get("r:id") or next((v for k, v in a.items() if k.endswith(":id")), None)
            target = targets.get(rid, "")
            if not target:
                continue
            path = target.lstrip("/") if target.startswith("/") else posixpath.normpath(
                posixpath.join("xl", target))
            out[_unescape(a["name"])] = path
        return out

    @property
    def sheet_names(self) -> list:
        return list(self._sheets)

    def sheet_name(self, name: str) -> str:
        """The sheet's name as written in the workbook (case-insensitive lookup)."""
        for s in self._sheets:
            if s.upper() == name.upper():
                return s
        raise BookError(f"no sheet named {name!r}")

    # -- cell edits ------------------------------------------------------------------
    def _edit_sheet(self, sheet: str, cells: dict, formula_cell: bool):
        path = self._sheets[self.sheet_name(sheet)]
        xml = self.parts[path].decode("utf-8")
        m = re.search(r"<sheetData\s*/>|<sheetData\b[^>]*>(.*?)</sheetData>", xml, re.S)
        if m is None:
            raise BookError(f"sheet {sheet!r} has no cell data")
        body = m.group(1) or ""
        rows = {}
        order = []
        for rm in _ROW_RE.finditer(body):
            text = rm.group(0)
            a = _attrs(text)
            r = int(a["r"])
            head = re.sub(r'\sspans="[^"]*"', "", text.split(">", 1)[0].rstrip("/")) + ">"
            cell_map = {}
            for cm in _CELL_RE.finditer(text):
                ca = _attrs(cm.group(0))
                cell_map[split_ref(ca["r"])[1]] = cm.group(0)
            rows[r] = (head, cell_map)
            order.append(r)
        for (r, c), value in cells.items():
            if r not in rows:
                rows[r] = (f'<row r="{r}">', {})
            head, cell_map = rows[r]
            old = cell_map.get(c)
            cell_map[c] = _cell_xml(f"{col_letters(c)}{r}", old, value, formula_cell)
        new_body = []
        for r in sorted(rows):
            head, cell_map = rows[r]
            inner = "".join(cell_map[c] for c in sorted(cell_map))
            new_body.append(head + inner + "</row>")
        new = "<sheetData>" + "".join(new_body) + "</sheetData>"
        xml = xml[: m.start()] + new + xml[m.end():]
        self.parts[path] = xml.encode("utf-8")

    def set_values(self, values: dict):
        """Write input values: {(sheet, "A1"): number | str | bool | None}."""
        self._group_edit(values, formula_cell=False)

    def set_cached(self, values: dict):
        """Write formula results as cached values: {(sheet, "A1"): value}.

        A value is a float, str, bool, or an ``ErrorText`` (str subclass) for an
        Excel error such as ``#NUM!``.
        """
        self._group_edit(values, formula_cell=True)

    def _group_edit(self, values, formula_cell):
        by_sheet: dict = {}
        for (sheet, ref), v in values.items():
            by_sheet.setdefault(sheet, {})[split_ref(ref)] = v
        for sheet, cells in by_sheet.items():
            self._edit_sheet(sheet, cells, formula_cell)

    def keep_cached_on_open(self):
        """Stop readers recomputing on load (they would lose our numbers)."""
        wb = self.parts["xl/workbook.xml"].decode("utf-8")
        wb = re.sub(r'\sfullCalcOnLoad="[^"]*"', "", wb)
        self.parts["xl/workbook.xml"] = wb.encode("utf-8")

    def drop_empty_cells(self):
        """Remove cells with neither value nor formula (styled blanks) and the stated dimension.

        Only for the engine's private copy: the engine walks every cell of the used range, and a
        single formatted blank far away (a common leftover) would make that range enormous.
        """
        empty = re.compile(r'<c(?=[\s>/])(?:[^>"]|"[^"]*")*?(?:/>|>\s*</c>)', re.S)
        for path in self._sheets.values():
            xml = self.parts[path].decode("utf-8")
            xml = re.sub(r"<dimension\b[^>]*/>", "", xml)
            xml = empty.sub("", xml)
            self.parts[path] = xml.encode("utf-8")

    def used_extent(self) -> dict:
        """Rows × columns spanned by the cells that are present, per sheet."""
        out = {}
        for name, path in self._sheets.items():
            xml = self.parts[path].decode("utf-8")
            rows, cols = 0, 0
            for m in re.finditer(r'<c\b[^>]*?\br="\$?([A-Z]{1,3})\$?(\d+)"', xml):
                rows = max(rows, int(m.group(2)))
                cols = max(cols, col_index(m.group(1)))
            out[name] = (rows, cols)
        return out

    def map_formulas(self, fn):
        """Apply ``fn(text) -> text`` to every formula in every sheet."""
        for path in self._sheets.values():
            xml = self.parts[path].decode("utf-8")

            def sub(m):
                t = m.group(0)
                if t.endswith("/>"):
                    return t
                head, rest = t.split(">", 1)
                body = rest[: -len("</f>")]
                return head + ">" + escape(fn(_unescape(body))) + "</f>"

            self.parts[path] = _F_RE.sub(sub, xml).encode("utf-8")

    # -- output ----------------------------------------------------------------------
    def save(self, out_path: str, compress: bool = True):
        """Write the package atomically (temporary file in the same folder, then rename).

        ``compress=False`` stores the parts uncompressed (the committed demo workbooks: their XML
        stays readable text in the repository).
        """
        method = zipfile.ZIP_DEFLATED if compress else zipfile.ZIP_STORED
        folder = os.path.dirname(os.path.abspath(out_path)) or "."
        fd, tmp = tempfile.mkstemp(prefix=".cellfuncs-", suffix=".xlsx", dir=folder)
        try:
            with os.fdopen(fd, "wb") as fh, zipfile.ZipFile(fh, "w", method) as zf:
                for info in self.infos:
                    zi = zipfile.ZipInfo(info.filename, date_time=info.date_time)
                    zi.compress_type = method
                    zi.external_attr = info.external_attr
                    zf.writestr(zi, self.parts[info.filename])
            os.chmod(tmp, 0o666 & ~_umask())
            os.replace(tmp, out_path)
        except BaseException:
            if os.path.exists(tmp):
                os.unlink(tmp)
            raise


def _umask() -> int:
    mask = os.umask(0)
    os.umask(mask)
    return mask


class ErrorText(str):
    """An Excel error value (``#NUM!``) to be written as such, not as text."""


def _unescape(s: str) -> str:
    return (s.replace("&lt;", "<").replace("&gt;", ">").replace("&quot;", '"')
            .replace("&apos;", "'").replace("&amp;", "&"))


def _cell_xml(ref: str, old: str | None, value, formula_cell: bool) -> str:
    attrs = _attrs(old) if old else {}
    keep = "".join(f' {k}="{v}"' for k, v in attrs.items() if k not in ("r", "t"))
    f = ""
    if old and formula_cell:
        fm = _F_RE.search(old)
        f = fm.group(0) if fm else ""
    if value is None:
        return f'<c r="{ref}"{keep}>{f}</c>' if f else f'<c r="{ref}"{keep}/>'
    if isinstance(value, ErrorText):
        return f'<c r="{ref}"{keep} t="e">{f}<v>{escape(str(value))}</v></c>'
    if isinstance(value, bool):
        return f'<c r="{ref}"{keep} t="b">{f}<v>{int(value)}</v></c>'
    if isinstance(value, (int, float)):
        return f'<c r="{ref}"{keep}>{f}<v>{_num_text(value)}</v></c>'
    text = escape(str(value))
    if formula_cell:
        return f'<c r="{ref}"{keep} t="str">{f}<v>{text}</v></c>'
    return f'<c r="{ref}"{keep} t="inlineStr"><is><t xml:space="preserve">{text}</t></is></c>'
