"""Small, careful edits of an .xlsx package: cell values and cached results.

The headless recalculation must hand back the *same* workbook (styles, defined names, data
validation, comments, charts, column widths, VBA) with the computed numbers stored as the formula
cells' cached values.  Loading and saving through a workbook library would drop charts and images,
so this module edits the sheet XML of the package directly and writes every other part back byte
for byte.

* Reading is bounded (:mod:`cellfuncs.headless.package_zip`): oversized or over-compressed parts, unsafe member
  names, a DOCTYPE, a password-protected (compound) file are refused with one line.
* ``sheetData`` is read with an XML parser and edited in place (:mod:`cellfuncs.headless.package_sheet`,
  :mod:`cellfuncs.headless.package_edit`): namespace prefixes, cells and rows without ``r``, either quote style.
* The saved package writes shared formulas out in full in each cell (readers that re-parse them
  on load keep the cached values), and :meth:`Package.values_only` gives the "values only" copy.
* ``fullCalcOnLoad`` is switched off so that a reader without the add-in keeps the numbers.

References
----------
ECMA-376 Part 1 (SpreadsheetML) and Part 2 (Open Packaging Conventions), 5th edition, 2016.
"""

from __future__ import annotations

import functools
import os
import posixpath
import re
import tempfile
import zipfile
from urllib.parse import unquote

from cellfuncs.headless import package_edit as xlsx_edit
from cellfuncs.headless import package_zip as xlsx_zip
from cellfuncs.headless.package_formula import col_index, col_letters  # noqa: F401 - re-exported
from cellfuncs.headless.package_sheet import find_elements, open_end, parse_only, start_tag

__all__ = ["BookError", "ErrorText", "Package", "check_output_kind", "col_index", "col_letters", "split_ref"]


class BookError(Exception):
    """The file is not a workbook this tool can use (one line message)."""


class ErrorText(str):
    """An Excel error value (``#NUM!``) to be written as such, not as text."""


MAX_ROW, MAX_COL = 1048576, 16384  # the size of a worksheet
_WORKSHEET = "/worksheet"
_MACRO_TYPES = ("macroenabled",)
_REF_RE = re.compile(r"^\$?([A-Za-z]{1,3})\$?(\d+)$")  # a reference text, not XML




def split_ref(ref: str):
    """``"B12"`` -> (12, 2); a reference outside a worksheet is a BookError."""
    m = _REF_RE.match(ref.strip())
    if not m:
        raise BookError(f"not a cell reference: {ref!r}")
    letters, digits = m.group(1), m.group(2)
    row, col = int(digits), col_index(letters)
    if not (1 <= row <= MAX_ROW and 1 <= col <= MAX_COL):
        raise BookError(f"{ref}: outside a worksheet (rows 1 to {MAX_ROW}, columns A to XFD)")
    return row, col


def _one_line_memory(method):
    """A MemoryError inside becomes one BookError line instead of a traceback."""

    @functools.wraps(method)
    def wrapper(self, *args, **kwargs):
        try:
            return method(self, *args, **kwargs)
        except MemoryError:
            raise BookError(f"{self.label}: out of memory while handling the workbook "
                            "(too large for this machine)") from None

    return wrapper


def _rels_path(part: str) -> str:
    folder, base = posixpath.split(part)
    return posixpath.join(folder, "_rels", base + ".rels")


def _resolve(source_part: str, target: str) -> str:
    target = unquote(target)
    if target.startswith("/"):
        return target.lstrip("/")
    return posixpath.normpath(posixpath.join(posixpath.dirname(source_part), target))


class Package:
    """An .xlsx file held in memory as its zip parts.

    Parameters
    ----------
    path : str
        The workbook to read.

    Attributes
    ----------
    parts : dict
        Part name -> bytes (may be replaced as a whole; edits always go through the methods).
    infos : list
        The zip entries, in the input's order (names, dates, attributes for writing back).
    has_macros : bool
        The package is macro-enabled (its content type says so or it holds a VBA project).

    Raises
    ------
    BookError
        Missing file, not a zip, corrupt zip, a refused shape (see :mod:`cellfuncs.headless.package_zip`),
        not a spreadsheet package.
    """

    def __init__(self, path: str):
        self.label = path
        self._values_only = False
        self._extent: dict = {}  # part -> (the bytes it was computed for, extent)
        if not os.path.isfile(path):
            raise BookError(f"{path}: no such file")
        try:
            xlsx_zip.check_container(path, path)
            with zipfile.ZipFile(path) as zf:
                self.infos = zf.infolist()
                self.parts = xlsx_zip.read_parts(zf, path, os.path.getsize(path))
        except BookError:
            raise
        except MemoryError:
            raise BookError(f"{path}: out of memory while reading the workbook (too large for this machine)") \
                from None
        except zipfile.BadZipFile as exc:
            if "not a zip file" in str(exc).lower():
                raise BookError(f"{path}: not an .xlsx workbook (not a zip file)") from None
            raise BookError(f"{path}: corrupt workbook ({exc})") from None
        except xlsx_zip.decompress_error_types() as exc:
            raise BookError(f"{path}: cannot read the workbook ({exc})") from None
        xlsx_zip.check_no_doctype(self.parts, path)
        self.workbook_part = self._main_part()
        if self.workbook_part not in self.parts:
            raise BookError(f"{path}: not an .xlsx workbook (no {self.workbook_part})")
        ctype = self.content_type(self.workbook_part).lower()
        self.has_macros = (any(m in ctype for m in _MACRO_TYPES)
                           or any(n.lower().endswith("vbaproject.bin") for n in self.parts))
        self.is_template = ".template." in ctype
        self._sheets, self._kinds = self._sheet_map()
        for path in self._worksheets().values():  # well-formed, checked at C speed before any edit
            self._read(path, lambda d: parse_only(d, path))

    # -- structure -------------------------------------------------------------------
    def _xml(self, part: str) -> bytes:
        return xlsx_zip.xml_text_bytes(self.parts[part])

    def _relationships(self, part: str) -> list:
        rels = _rels_path(part)
        if rels not in self.parts:
            return []
        return self._read(rels, lambda d: find_elements(d, {"Relationship"}, rels))

    def _main_part(self) -> str:
        for el in self._relationships(""):
            if el.attrs.get("Type", "").endswith("/officeDocument") and el.attrs.get("TargetMode") != "External":
                return _resolve("", el.attrs.get("Target", ""))
        return "xl/workbook.xml"

    def content_type(self, part: str) -> str:
        """The content type ``[Content_Types].xml`` gives a part ("" when none)."""
        ct = "[Content_Types].xml"
        if ct not in self.parts:
            return ""
        default = ""
        ext = part.rsplit(".", 1)[-1].lower()
        for el in self._read(ct, lambda d: find_elements(d, {"Override", "Default"}, ct)):
            if el.local == "Override" and el.attrs.get("PartName", "").lstrip("/").lower() == part.lower():
                return el.attrs.get("ContentType", "")
            if el.local == "Default" and el.attrs.get("Extension", "").lower() == ext:
                default = el.attrs.get("ContentType", "")
        return default

    def _sheet_map(self):
        wb = self.workbook_part
        targets = {}
        for el in self._relationships(wb):
            if el.attrs.get("TargetMode") == "External":
                continue
            targets[el.attrs.get("Id")] = (_resolve(wb, el.attrs.get("Target", "")), el.attrs.get("Type", ""))
        out, kinds = {}, {}
        for el in self._read(wb, lambda d: find_elements(d, {"sheet"}, wb)):
            rid = el.attrs.get("r:id") or next((v for k, v in el.attrs.items() if k.endswith(":id")), None)
            target = targets.get(rid)
            if not target or "name" not in el.attrs:
                continue
            out[el.attrs["name"]] = target[0]
            kinds[el.attrs["name"]] = target[1]
        return out, kinds

    def _worksheets(self) -> dict:
        """Sheet name -> part, for the sheets that hold cells and are present."""
        return {n: p for n, p in self._sheets.items()
                if p in self.parts and (self._kinds[n].endswith(_WORKSHEET) or not self._kinds[n])}

    @property
    def sheet_names(self) -> list:
        return list(self._sheets)

    def sheet_name(self, name: str) -> str:
        """The sheet's name as written in the workbook (case-insensitive lookup)."""
        for s in self._sheets:
            if s.upper() == name.upper():
                return s
        raise BookError(f"no sheet named {name!r}")

    def _sheet_part(self, sheet: str) -> str:
        name = self.sheet_name(sheet)
        path = self._sheets[name]
        if path not in self.parts:
            raise BookError(f"{self.label}: sheet {name!r} has no part {path} in the package")
        return path

    def _read(self, path: str, fn):
        """``fn(part bytes as UTF-8)``; an XML error names the workbook and the part."""
        try:
            return fn(self._xml(path))
        except BookError as exc:
            if getattr(exc, "xml_error", False):
                raise BookError(f"{self.label}: part {path}: {exc}") from None
            raise

    def _rewrite(self, path: str, fn) -> None:
        self.parts[path] = self._read(path, fn)

    # -- reading ---------------------------------------------------------------------
    @_one_line_memory
    def cells(self, sheet: str) -> dict:
        """{"A1": (formula text or None, cell type, value text or None)} of the cells present."""
        cells = self._read(self._sheet_part(sheet), xlsx_edit.read_cells)
        return {f"{col_letters(c)}{r}": v for (r, c), v in cells.items()}

    @_one_line_memory
    def used_extent(self) -> dict:
        """Rows × columns spanned by the cells that are present, per sheet."""
        out = {}
        for name, path in self._worksheets().items():
            known = self._extent.get(path)
            if known is not None and known[0] is self.parts[path]:
                out[name] = known[1]
            else:
                out[name] = self._read(path, xlsx_edit.extent)
        return out

    # -- cell edits ------------------------------------------------------------------
    def set_values(self, values: dict):
        """Write input values: {(sheet, "A1"): number | str | bool | None}."""
        self._group_edit(values, formula_cell=False)

    def set_cached(self, values: dict):
        """Write formula results as cached values: {(sheet, "A1"): value}.

        A value is a float, str, bool, or an ``ErrorText`` (str subclass) for an
        Excel error such as ``#NUM!``.
        """
        self._group_edit(values, formula_cell=True)

    @_one_line_memory
    def _group_edit(self, values, formula_cell):
        by_sheet: dict = {}
        for (sheet, ref), v in values.items():
            by_sheet.setdefault(sheet, {})[split_ref(ref)] = v
        for sheet, cells in by_sheet.items():
            path = self._sheet_part(sheet)
            self._rewrite(path, lambda d: xlsx_edit.edit_cells(
                d, cells, formula_cell, lambda v: isinstance(v, ErrorText), f"sheet {sheet!r}"))

    @_one_line_memory
    def keep_cached_on_open(self):
        """Stop readers recomputing on load (they would lose our numbers)."""
        wb = self.workbook_part
        data = self._xml(wb)
        edits = [(el.start, open_end(data, el), start_tag(el, drop=("fullCalcOnLoad",), empty=el.empty))
                 for el in find_elements(data, {"calcPr"}, wb) if "fullCalcOnLoad" in el.attrs]
        if edits:
            from cellfuncs.headless.package_sheet import apply_edits

            self.parts[wb] = apply_edits(data, edits)

    @_one_line_memory
    def drop_empty_cells(self):
        """Remove cells with neither value nor formula (styled blanks) and the stated dimension.

        Only for the engine's private copy: the engine walks every cell of the used range, and a
        single formatted blank far away (a common leftover) would make that range enormous.  Every
        row and cell is given an explicit ``r`` on the way (readers that need it are served).
        """
        for path in self._worksheets().values():
            data, extent = self._read(path, xlsx_edit.drop_empty)
            self.parts[path] = data
            self._extent[path] = (data, extent)

    @_one_line_memory
    def map_formulas(self, fn):
        """Apply ``fn(text) -> text`` to every formula in every sheet."""
        for path in self._worksheets().values():
            self._rewrite(path, lambda d: xlsx_edit.map_formulas(d, fn))

    @_one_line_memory
    def expand_shared_formulas(self):
        """Write each shared formula out in full in every cell of its group (done by :meth:`save`)."""
        for path in self._worksheets().values():
            if b"shared" in self.parts[path]:
                self._rewrite(path, xlsx_edit.expand_shared)

    def values_only(self):
        """Make the saved copy a values-only one (the "paste as values" of a whole workbook).

        When the package is saved, every formula cell holds only its cached value (numbers, text,
        booleans, errors), the calculation chain part and its relationship and content-type entries
        are removed, and table columns lose their calculated-column formula; charts, styles,
        validation, defined names and every other part are kept.  Takes effect at :meth:`save`, so
        cached values set before or after this call are the ones kept.
        """
        self._values_only = True

    # -- output ----------------------------------------------------------------------
    def _values_only_parts(self) -> tuple:
        """(parts, names to leave out) of the values-only copy."""
        from cellfuncs.headless.package_sheet import apply_edits

        parts = dict(self.parts)
        for path in self._worksheets().values():
            parts[path] = xlsx_edit.to_values(xlsx_zip.xml_text_bytes(parts[path]))
        drop = set()
        wb = self.workbook_part
        rels = _rels_path(wb)
        if rels in parts:
            data = xlsx_zip.xml_text_bytes(parts[rels])
            gone = [el for el in find_elements(data, {"Relationship"}, rels)
                    if el.attrs.get("Type", "").endswith("/calcChain")]
            drop.update(_resolve(wb, el.attrs.get("Target", "")) for el in gone)
            parts[rels] = apply_edits(data, [(el.start, el.end, b"") for el in gone])
        ct = "[Content_Types].xml"
        if ct in parts:
            data = xlsx_zip.xml_text_bytes(parts[ct])
            gone = [el for el in find_elements(data, {"Override"}, ct)
                    if el.attrs.get("PartName", "").lstrip("/") in drop
                    or el.attrs.get("ContentType", "").endswith(".calcChain+xml")]
            drop.update(el.attrs.get("PartName", "").lstrip("/") for el in gone)
            parts[ct] = apply_edits(data, [(el.start, el.end, b"") for el in gone])
        for name in list(parts):
            if name.startswith("xl/tables/") and name.endswith(".xml") and b"calculatedColumnFormula" in parts[name]:
                data = xlsx_zip.xml_text_bytes(parts[name])
                gone = find_elements(data, {"calculatedColumnFormula"}, name)
                parts[name] = apply_edits(data, [(el.start, el.end, b"") for el in gone])
        return parts, drop

    @_one_line_memory
    def save(self, out_path: str, compress: bool = True, expand_shared: bool = True):
        """Write the package atomically (temporary file in the same folder, then rename).

        Shared formulas are written out in full (``expand_shared``); after :meth:`values_only` the
        copy holds values only.  ``compress=False`` stores the parts uncompressed (the committed demo
        workbooks: their XML stays readable text in the repository).
        """
        if self._values_only:
            parts, drop = self._values_only_parts()
        else:
            if expand_shared:
                self.expand_shared_formulas()
            parts, drop = self.parts, set()
        method = zipfile.ZIP_DEFLATED if compress else zipfile.ZIP_STORED
        folder = os.path.dirname(os.path.abspath(out_path)) or "."
        fd, tmp = tempfile.mkstemp(prefix=".cellfuncs-", suffix=".xlsx", dir=folder)
        try:
            with os.fdopen(fd, "wb") as fh, zipfile.ZipFile(fh, "w", method) as zf:
                for info in self.infos:
                    if info.filename in drop or info.filename not in parts:
                        continue
                    zi = zipfile.ZipInfo(info.filename, date_time=info.date_time)
                    zi.compress_type = method
                    zi.external_attr = info.external_attr
                    zf.writestr(zi, parts[info.filename])
            os.chmod(tmp, 0o666 & ~_umask())
            os.replace(tmp, out_path)
        except BaseException:
            if os.path.exists(tmp):
                os.unlink(tmp)
            raise


def check_output_kind(package, out_path: str) -> None:
    """Refuse an output name whose extension does not match the workbook's content.

    A macro-enabled workbook (macro content type or a VBA project) is written as ``.xlsm``, any
    other as ``.xlsx`` (templates as ``.xltm`` / ``.xltx``); any other extension is refused.

    Parameters
    ----------
    package : Package or str
        The workbook, or its path (then it is read here, with every refusal of :class:`Package`).
    out_path : str
        The output file name.

    Raises
    ------
    BookError
        One line naming the extension to use.
    """
    if not isinstance(package, Package):
        package = Package(os.fspath(package))
    ext = os.path.splitext(out_path)[1].lower()
    if package.is_template:
        want = ".xltm" if package.has_macros else ".xltx"
    else:
        want = ".xlsm" if package.has_macros else ".xlsx"
    if ext == want:
        return
    if ext not in (".xlsx", ".xlsm", ".xltx", ".xltm"):
        raise BookError(f"-o {out_path}: the output is a workbook; name it {want}")
    if package.has_macros:
        raise BookError(f"-o {out_path}: the workbook is macro-enabled; name the output {want}")
    raise BookError(f"-o {out_path}: the workbook holds no macros; name the output {want}")


def _umask() -> int:
    mask = os.umask(0)
    os.umask(mask)
    return mask
