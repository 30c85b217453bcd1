"""The package side of `cellfuncs recalc`: reading and writing the zip and its sheet XML.

Workbooks are built with openpyxl and then edited at the XML or zip level into the shapes other
writers produce (issue 9 item 4, issue 13 item 3).  Expected values: arithmetic of the inputs for
the built-in formulas; ``ht.LMTD`` (reference library) for HX_LMTD; for shared formulas, the
per-cell formula text openpyxl wrote for the same workbook before it was turned into a shared
group (ECMA-376 Part 1, 18.3.1.40: each cell of a group means the master formula with its relative
references moved).
"""

import os
import re
import shutil
import struct
import subprocess
import sys
import zipfile
import zlib

import ht
import openpyxl
import pytest
from hypothesis import given, settings
from hypothesis import strategies as st
from openpyxl.chart import BarChart, Reference
from openpyxl.styles import Font
from openpyxl.workbook.defined_name import DefinedName
from openpyxl.worksheet.datavalidation import DataValidation

from cellfuncs.headless import package_zip as xlsx_zip
from cellfuncs.cli import main
from cellfuncs.headless.package import BookError, Package, check_output_kind
from cellfuncs.headless.package_formula import shift_formula

MAIN_NS = "http://schemas.openxmlformats.org/spreadsheetml/2006/main"
SHEET = "xl/worksheets/sheet1.xml"
LMTD = ht.LMTD(100, 60, 30, 40)  # reference library ht.LMTD, counterflow


def _recalc(capsys, *args):
    rc = main(["recalc", *map(str, args)])
    err = capsys.readouterr().err.strip()
    return rc, err


def _one_line(err):
    assert err and "\n" not in err and "Traceback" not in err, err
    return err


def _rewrite(src, dst, edits=None, add=(), drop=()):
    """Copy a zip, applying ``edits[name](text) -> text`` and adding (name, bytes) members."""
    edits = edits or {}
    with zipfile.ZipFile(src) as zin, zipfile.ZipFile(dst, "w", zipfile.ZIP_DEFLATED) as zout:
        for info in zin.infolist():
            if info.filename in drop:
                continue
            data = zin.read(info.filename)
            if info.filename in edits:
                data = edits[info.filename](data.decode("utf-8")).encode("utf-8")
            zout.writestr(info, data)
        for name, data in add:
            zout.writestr(zipfile.ZipInfo(name), data)
    return dst


@pytest.fixture()
def plain(tmp_path):
    wb = openpyxl.Workbook()
    ws = wb.active
    ws.title = "Calc"
    ws["A1"], ws["A2"], ws["A3"] = 2, 3, "tender"
    ws["B1"] = "=A1*10"
    ws["B2"] = "=A2+A1"
    ws["B3"] = "=HX_LMTD(100,60,30,40)"
    ws["C1"] = '=A3&"-x"'
    ws["C2"] = "=A1>A2"
    ws["D3"] = "=B1+B2"
    wb.defined_names["first"] = DefinedName("first", attr_text="Calc!$A$1")
    path = tmp_path / "plain.xlsx"
    wb.save(path)
    return path


EXPECTED = {"B1": 20, "B2": 5, "B3": LMTD, "C1": "tender-x", "C2": False, "D3": 25}


def _no_r(xml):
    xml = re.sub(r'(<row\b[^>]*?) r="\d+"', r"\1", xml)
    return re.sub(r'(<c\b[^>]*?) r="[A-Z]+\d+"', r"\1", xml)


def _prefixed(xml):
    xml = xml.replace(f'xmlns="{MAIN_NS}"', f'xmlns:x="{MAIN_NS}"', 1)
    return re.sub(r"<(/?)(?!\?)([A-Za-z]+)", r"<\1x:\2", xml)


def _single_quotes(xml):
    return re.sub(r'(\s[\w:]+)="([^"]*)"', r"\1='\2'", xml)


SHAPES = {
    "no_r": {SHEET: _no_r},
    "prefix": {SHEET: _prefixed, "xl/workbook.xml": _prefixed},
    "single_quotes": {SHEET: _single_quotes, "xl/workbook.xml": _single_quotes,
                      "xl/_rels/workbook.xml.rels": _single_quotes},
    "all": {SHEET: lambda x: _single_quotes(_prefixed(_no_r(x))), "xl/workbook.xml": _prefixed},
}


def _fill_row_gaps(path):
    """openpyxl skips empty cells; without r they would shift, so give every row A..D."""
    wb = openpyxl.load_workbook(path)
    ws = wb["Calc"]
    for r in range(1, 4):
        for c in range(1, 5):
            if ws.cell(r, c).value is None:
                ws.cell(r, c).value = 0
    wb.save(path)


@pytest.mark.parametrize("shape", sorted(SHAPES))
def test_sheet_shapes_read_and_written(tmp_path, capsys, plain, shape):
    _fill_row_gaps(plain)
    src = _rewrite(plain, tmp_path / f"{shape}.xlsx", SHAPES[shape])
    out = tmp_path / "out.xlsx"
    rc, err = _recalc(capsys, src, "-o", out)
    assert rc == 0, err
    values = openpyxl.load_workbook(out, data_only=True)["Calc"]
    for ref, want in EXPECTED.items():
        got = values[ref].value
        assert got == (pytest.approx(want, rel=1e-12) if isinstance(want, float) else want), ref
    formulas = openpyxl.load_workbook(out)["Calc"]
    assert formulas["B1"].value == "=A1*10" and formulas["A1"].value == 2
    with zipfile.ZipFile(src) as zin, zipfile.ZipFile(out) as zout:
        assert zin.namelist() == zout.namelist()
        for name in zin.namelist():
            a, b = zin.read(name), zout.read(name)
            if name == SHEET:  # everything outside sheetData is kept byte for byte
                assert a[:a.index(b"sheetData")] == b[:b.index(b"sheetData")]
                assert a[a.rindex(b"sheetData"):] == b[b.rindex(b"sheetData"):]
            elif name != "xl/workbook.xml":
                assert a == b, name


def test_no_r_positions_follow_order(tmp_path):
    """A row without r follows the previous row; a cell without r the previous cell (18.3.1.4)."""
    wb = openpyxl.Workbook()
    wb.active.title = "S"
    wb.save(tmp_path / "s.xlsx")
    body = ('<sheetData><row><c><v>1</v></c><c r="D1"><v>4</v></c><c><v>5</v></c></row>'
            '<row r="3"><c><v>7</v></c></row><row><c r="B4"><v>8</v></c></row></sheetData>')
    src = _rewrite(tmp_path / "s.xlsx", tmp_path / "n.xlsx",
                   {SHEET: lambda x: re.sub(r"<sheetData\s*/>|<sheetData>.*</sheetData>", body, x)})
    pkg = Package(str(src))
    got = {ref: v[2] for ref, v in pkg.cells("S").items()}
    assert got == {"A1": "1", "D1": "4", "E1": "5", "A3": "7", "B4": "8"}
    assert pkg.used_extent() == {"S": (4, 5)}
    pkg.set_values({("S", "C1"): 3, ("S", "A2"): "two", ("S", "E1"): 6})
    pkg.save(str(tmp_path / "o.xlsx"))
    ws = openpyxl.load_workbook(tmp_path / "o.xlsx")["S"]
    assert [[c.value for c in row] for row in ws.iter_rows(min_row=1, max_row=4, max_col=5)] == [
        [1, None, 3, 4, 6], ["two", None, None, None, None], [7, None, None, None, None],
        [None, 8, None, None, None]]


def test_utf16_sheet_part(tmp_path, capsys, plain):
    """XML 1.0, 4.3.3: a part may be UTF-16 with a byte-order mark; it is read and written."""
    with zipfile.ZipFile(plain) as zin, zipfile.ZipFile(tmp_path / "u.xlsx", "w") as zout:
        for info in zin.infolist():
            data = zin.read(info.filename)
            if info.filename == SHEET:
                text = data.decode("utf-8")
                text = text if text.startswith("<?xml") else '<?xml version="1.0" encoding="UTF-16"?>' + text
                data = text.replace('encoding="UTF-8"', 'encoding="UTF-16"').encode("utf-16")
            zout.writestr(info, data)
    rc, err = _recalc(capsys, tmp_path / "u.xlsx", "-o", tmp_path / "o.xlsx")
    assert rc == 0, err
    values = openpyxl.load_workbook(tmp_path / "o.xlsx", data_only=True)["Calc"]
    assert values["B1"].value == 20 and values["D3"].value == 25
    bad = tmp_path / "bad.xlsx"
    with zipfile.ZipFile(plain) as zin, zipfile.ZipFile(bad, "w") as zout:
        for info in zin.infolist():
            data = zin.read(info.filename)
            if info.filename == "xl/styles.xml":
                data = _put_doctype(data.decode("utf-8")).encode("utf-16-le")
            zout.writestr(info, data)
    rc, err = _recalc(capsys, bad, "-o", tmp_path / "o2.xlsx")
    assert rc == 2 and "DOCTYPE" in _one_line(err)


def test_malformed_sheet_is_one_line(tmp_path, capsys, plain):
    src = _rewrite(plain, tmp_path / "m.xlsx", {SHEET: lambda x: x.replace("</sheetData>", "")})
    rc, err = _recalc(capsys, src, "-o", tmp_path / "o.xlsx")
    assert rc == 2 and f"part {SHEET}: not well-formed XML" in _one_line(err)


def _put_doctype(xml):
    return xml.replace("?>", '?><!DOCTYPE x [<!ENTITY big "bigbigbig">]>', 1) if xml.startswith("<?xml") \
        else '<!DOCTYPE x [<!ENTITY big "b">]>' + xml


@pytest.mark.parametrize("part", [SHEET, "xl/styles.xml", "[Content_Types].xml"])
def test_doctype_refused(tmp_path, capsys, plain, part):
    src = _rewrite(plain, tmp_path / "d.xlsx", {part: _put_doctype})
    rc, err = _recalc(capsys, src, "-o", tmp_path / "o.xlsx")
    assert rc == 2 and "DOCTYPE" in _one_line(err) and part in err
    assert not (tmp_path / "o.xlsx").exists()


@pytest.mark.parametrize("name", ["../../x.xml", "/x/y.xml", "xl/../../y.xml", "C:/z.xml", "..\\w.xml"])
def test_unsafe_member_names_refused(tmp_path, capsys, plain, name):
    src = _rewrite(plain, tmp_path / "m.xlsx", add=[(name, b"<a/>")])
    rc, err = _recalc(capsys, src, "-o", tmp_path / "o.xlsx")
    assert rc == 2 and "absolute or leaves the package" in _one_line(err)


def test_password_protected_file(tmp_path, capsys):
    """[MS-OFFCRYPTO] 2.3.4: an encrypted package is a compound file holding EncryptedPackage."""
    enc = tmp_path / "locked.xlsx"
    enc.write_bytes(xlsx_zip.CFB_MAGIC + bytes(504) + "EncryptedPackage".encode("utf-16-le") + bytes(1000))
    rc, err = _recalc(capsys, enc, "-o", tmp_path / "o.xlsx")
    assert rc == 2 and _one_line(err) == "cellfuncs: password-protected workbook: save a copy without a password"
    bare = tmp_path / "bare.xlsx"
    bare.write_bytes(xlsx_zip.CFB_MAGIC + bytes(4096))
    assert _recalc(capsys, bare, "-o", tmp_path / "o.xlsx")[1].endswith("save a copy without a password")
    legacy = tmp_path / "legacy.xlsx"
    legacy.write_bytes(xlsx_zip.CFB_MAGIC + bytes(504) + "Workbook".encode("utf-16-le") + bytes(100))
    rc, err = _recalc(capsys, legacy, "-o", tmp_path / "o.xlsx")
    assert rc == 2 and "legacy binary (.xls)" in _one_line(err)


# -- bounded decompression -----------------------------------------------------------------------

def _deflate_block():
    """1 MiB of spaces as raw deflate, ending on a full flush, so copies can be concatenated."""
    c = zlib.compressobj(9, zlib.DEFLATED, -15)
    return c.compress(b" " * 2**20) + c.flush(zlib.Z_FULL_FLUSH)


def _deflate_end():
    c = zlib.compressobj(9, zlib.DEFLATED, -15)
    return c.compress(b"") + c.flush()


def raw_zip(path, members):
    """Write a zip from (name, chunks, crc, compressed size, declared size, method) without
    checking anything, so the directory can lie (PKWARE APPNOTE 4.3.7, 4.3.12, 4.3.16)."""
    central, offset = [], 0
    with open(path, "wb") as fh:
        for name, chunks, crc, csize, usize, method in members:
            n = name.encode()
            head = struct.pack("<IHHHHHIIIHH", 0x04034B50, 20, 0, method, 0, 0x21, crc, csize, usize, len(n), 0)
            fh.write(head + n)
            for chunk in chunks:
                fh.write(chunk)
            central.append(struct.pack("<IHHHHHHIIIHHHHHII", 0x02014B50, 20, 20, 0, method, 0, 0x21, crc,
                                       csize, usize, len(n), 0, 0, 0, 0, 0, offset) + n)
            offset = fh.tell()
        cd = b"".join(central)
        fh.write(cd + struct.pack("<IHHHHIIH", 0x06054B50, 0, 0, len(members), len(members), len(cd), offset, 0))


def bomb_book(tmp_path, plain, inflated_mb, declared=None, name="bomb.xlsx"):
    """The plain workbook with its sheet replaced by a part inflating to ``inflated_mb`` MiB."""
    members = []
    with zipfile.ZipFile(plain) as zf:
        for info in zf.infolist():
            if info.filename == SHEET:
                block, end = _deflate_block(), _deflate_end()
                csize = len(block) * inflated_mb + len(end)
                chunks = (block if i < inflated_mb else end for i in range(inflated_mb + 1))
                usize = inflated_mb * 2**20 if declared is None else declared
                crc, spaces = 0, b" " * 2**20
                for _ in range(inflated_mb):
                    crc = zlib.crc32(spaces, crc)
                members.append((SHEET, chunks, crc, csize, usize, 8))
            else:
                data = zf.read(info.filename)
                members.append((info.filename, [data], zlib.crc32(data), len(data), len(data), 0))
    path = tmp_path / name
    raw_zip(path, members)
    return path


def test_declared_size_over_limit_refused(tmp_path, capsys, plain):
    src = bomb_book(tmp_path, plain, 300)
    assert src.stat().st_size < 2**20  # built streaming: 300 MiB of content in under 1 MiB
    rc, err = _recalc(capsys, src, "-o", tmp_path / "o.xlsx")
    assert rc == 2 and "declares more than 256 MB" in _one_line(err)


def test_lying_directory_refused_while_streaming(tmp_path, capsys, plain):
    src = bomb_book(tmp_path, plain, 300, declared=1000)
    rc, err = _recalc(capsys, src, "-o", tmp_path / "o.xlsx")
    assert rc == 2 and "inflates to more than 16 MB at a compression ratio over 200:1" in _one_line(err)


def test_lying_directory_under_the_limits_refused(tmp_path, capsys, plain):
    src = bomb_book(tmp_path, plain, 2, declared=1000)
    rc, err = _recalc(capsys, src, "-o", tmp_path / "o.xlsx")
    assert rc == 2 and "not the 1000 its zip directory declares" in _one_line(err)


def test_ratio_rule_only_above_the_floor(tmp_path, plain, monkeypatch):
    """Above 16 MB a ratio over 200:1 is refused; below it any ratio passes (limits scaled down)."""
    monkeypatch.setattr(xlsx_zip, "RATIO_FLOOR_BYTES", 3 * 2**20)
    monkeypatch.setattr(xlsx_zip, "MAX_PART_BYTES", 8 * 2**20)
    with pytest.raises(BookError, match="ratio over 200:1"):
        Package(str(bomb_book(tmp_path, plain, 4, name="a.xlsx")))
    with pytest.raises(BookError, match="declares more than 8 MB"):
        Package(str(bomb_book(tmp_path, plain, 9, name="b.xlsx")))
    with pytest.raises(BookError, match="not the"):  # 2 MiB of spaces: under the floor, then a lie
        Package(str(bomb_book(tmp_path, plain, 2, declared=10, name="c.xlsx")))


def test_refusal_keeps_memory_small(tmp_path, plain):
    """The 300 MiB part is refused without inflating it: peak memory of the process stays small."""
    src = bomb_book(tmp_path, plain, 300, declared=1000)
    code = ("from cellfuncs.headless.package import Package, BookError\n"
            f"try:\n    Package({str(src)!r})\nexcept BookError as e:\n    print(e)\n"
            "print([ln.split()[1] for ln in open('/proc/self/status') if ln.startswith('VmHWM')][0])")
    p = subprocess.run([sys.executable, "-c", code], capture_output=True, text=True, timeout=120)
    msg, rss_kb = p.stdout.strip().splitlines()  # VmHWM: peak resident set of this process [kB]
    assert "ratio over 200:1" in msg
    assert int(rss_kb) < 150 * 1024, rss_kb


def test_memory_error_is_one_line(tmp_path, capsys, plain, monkeypatch):
    def boom(*a, **k):
        raise MemoryError

    monkeypatch.setattr(xlsx_zip, "read_parts", boom)
    rc, err = _recalc(capsys, plain, "-o", tmp_path / "o.xlsx")
    assert rc == 2 and "out of memory" in _one_line(err)


# -- output kind ---------------------------------------------------------------------------------

def _macro_book(tmp_path, plain):
    ct = "application/vnd.ms-excel.sheet.macroEnabled.main+xml"
    return _rewrite(plain, tmp_path / "in.xlsm", {
        "[Content_Types].xml": lambda x: re.sub(r'(PartName="/xl/workbook.xml" ContentType=")[^"]*', rf"\g<1>{ct}",
                                               x).replace("<Default ", '<Default Extension="bin" ContentType='
                                                          '"application/vnd.ms-office.vbaProject"/><Default ', 1),
        "xl/_rels/workbook.xml.rels": lambda x: x.replace("</Relationships>", '<Relationship Id="rIdV" Type="http://'
                                                          'schemas.microsoft.com/office/2006/relationships/vbaProject"'
                                                          ' Target="vbaProject.bin"/></Relationships>')},
        add=[("xl/vbaProject.bin", xlsx_zip.CFB_MAGIC + b"macro bytes kept as they are")])


def test_output_extension_matches_content(tmp_path, capsys, plain):
    xlsm = _macro_book(tmp_path, plain)
    assert Package(str(xlsm)).has_macros and not Package(str(plain)).has_macros
    rc, err = _recalc(capsys, xlsm, "-o", tmp_path / "out.xlsx")
    assert rc == 2 and "macro-enabled; name the output .xlsm" in _one_line(err)
    assert not (tmp_path / "out.xlsx").exists()
    rc, err = _recalc(capsys, xlsm, "-o", tmp_path / "out.xlsm")
    assert rc == 0, err
    with zipfile.ZipFile(xlsm) as a, zipfile.ZipFile(tmp_path / "out.xlsm") as b:
        assert a.read("xl/vbaProject.bin") == b.read("xl/vbaProject.bin")
        assert a.read("[Content_Types].xml") == b.read("[Content_Types].xml")
    rc, err = _recalc(capsys, plain, "-o", tmp_path / "out2.xlsm")
    assert rc == 2 and "holds no macros; name the output .xlsx" in _one_line(err)
    for bad in ("out.csv", "out", "out.xls"):
        rc, err = _recalc(capsys, plain, "-o", tmp_path / bad)
        assert rc == 2 and "name it .xlsx" in _one_line(err)
        assert not (tmp_path / bad).exists()
    check_output_kind(Package(str(plain)), "fine.XLSX")


# -- shared formulas -----------------------------------------------------------------------------

def _shared_book(tmp_path):
    """Rows 1-6: numbers in A, and in B..E the same formula per column written per cell."""
    wb = openpyxl.Workbook()
    ws = wb.active
    ws.title = "Calc"
    other = wb.create_sheet("Data")
    for r in range(1, 7):
        ws.cell(r, 1, 10.0 * r)
        other.cell(r, 1, r * 1.5)
        ws.cell(r, 2, f"=A{r}*2+$A$1")
        ws.cell(r, 3, f"=SUM($A$1:A{r})+A$2+$A{r}")
        ws.cell(r, 4, f"=HX_LMTD(A{r}+100,A{r}+60,30,40)")
        ws.cell(r, 5, f"=Data!A{r}*B{r}")
    plain = tmp_path / "percell.xlsx"
    wb.save(plain)

    def share(xml):
        for col, si in (("B", 0), ("C", 1), ("D", 2), ("E", 3)):
            for r in range(1, 7):
                m = re.search(rf'<c r="{col}{r}"><f>(.*?)</f>', xml)
                new = (f'<c r="{col}{r}"><f t="shared" ref="{col}1:{col}6" si="{si}">{m.group(1)}</f>' if r == 1
                       else f'<c r="{col}{r}"><f t="shared" si="{si}"/>')
                xml = xml.replace(m.group(0), new)
        return xml

    return plain, _rewrite(plain, tmp_path / "shared.xlsx", {SHEET: share})


def test_shared_formulas_written_in_full(tmp_path, capsys):
    plain, shared = _shared_book(tmp_path)
    assert "<f t=\"shared\" si=\"0\"/>" in zipfile.ZipFile(shared).read(SHEET).decode()
    out, ref_out = tmp_path / "out.xlsx", tmp_path / "ref.xlsx"
    assert _recalc(capsys, shared, "-o", out)[0] == 0
    assert _recalc(capsys, plain, "-o", ref_out)[0] == 0
    want = {k: v[0] for k, v in Package(str(plain)).cells("Calc").items()}
    got = Package(str(out)).cells("Calc")
    assert {k: v[0] for k, v in got.items()} == want
    assert "shared" not in zipfile.ZipFile(out).read(SHEET).decode()
    a = openpyxl.load_workbook(out, data_only=True)["Calc"]
    b = openpyxl.load_workbook(ref_out, data_only=True)["Calc"]
    for row_a, row_b in zip(a.iter_rows(), b.iter_rows()):
        assert [c.value for c in row_a] == [c.value for c in row_b]
    assert a["D3"].value == pytest.approx(ht.LMTD(130, 90, 30, 40), rel=1e-12)


@pytest.mark.skipif(not shutil.which("soffice"), reason="LibreOffice (soffice) is not installed")
def test_shared_formulas_show_numbers_in_libreoffice(tmp_path, capsys):
    _, shared = _shared_book(tmp_path)
    out = tmp_path / "out.xlsx"
    assert _recalc(capsys, shared, "-o", out)[0] == 0
    profile = tmp_path / "lo-profile"
    subprocess.run(["soffice", f"-env:UserInstallation=file://{profile}", "--headless", "--convert-to", "csv",
                    "--outdir", str(tmp_path / "csv"), str(out)], capture_output=True, timeout=180, check=True)
    text = (tmp_path / "csv" / "out.csv").read_text(encoding="utf-8", errors="replace")
    assert "#NAME?" not in text and "Err:" not in text
    rows = [line.split(",") for line in text.splitlines()]
    assert len(rows) == 6
    assert float(rows[2][3]) == pytest.approx(ht.LMTD(130, 90, 30, 40), rel=1e-9)
    assert float(rows[5][1]) == 60 * 2 + 10  # =A6*2+$A$1


@settings(max_examples=200, deadline=None)
@given(col=st.integers(1, 200), row=st.integers(1, 5000), d_row=st.integers(-50, 50), d_col=st.integers(-20, 20),
       abs_c=st.booleans(), abs_r=st.booleans())
def test_shift_round_trip(col, row, d_row, d_col, abs_c, abs_r):
    """Moving by (dr, dc) and back restores the formula; absolute parts never move."""
    from cellfuncs.headless.package import col_letters

    ref = f"{'$' if abs_c else ''}{col_letters(col)}{'$' if abs_r else ''}{row}"
    text = f'SUM({ref}:{ref})+LOG10({ref})*"A1"&Data!{ref}'
    moved = shift_formula(text, d_row, d_col)
    if "#REF!" in moved:
        assert (not abs_r and not 1 <= row + d_row <= 1048576) or (not abs_c and not 1 <= col + d_col <= 16384)
        return
    assert shift_formula(moved, -d_row, -d_col) == text
    assert '"A1"' in moved and "LOG10(" in moved
    if abs_c and abs_r:
        assert moved == text


def test_shift_examples():
    """Per-cell text Excel stores for the same formula one row down and one column right
    (ECMA-376 Part 1, 18.17.2 A1-style references, $ marks absolute)."""
    assert shift_formula("A1*2+$A$1", 1, 0) == "A2*2+$A$1"
    assert shift_formula("SUM(A:A,$B:C,3:4,$5:5)", 1, 1) == "SUM(B:B,$B:D,4:5,$5:6)"
    assert shift_formula("'Site''s data'!B2+S1:S3!A1+Table1[Col A]+1E3", 1, 1) == \
        "'Site''s data'!C3+S1:S3!B2+Table1[Col A]+1E3"
    assert shift_formula("A1", -1, 0) == "#REF!"


# -- values only ---------------------------------------------------------------------------------

def test_values_only_copy(tmp_path, capsys):
    wb = openpyxl.Workbook()
    ws = wb.active
    ws.title = "Calc"
    for r in range(1, 5):
        ws.cell(r, 1, r * 100.0)
        ws.cell(r, 2, f"=A{r}/4")
    ws["C1"] = '="duty "&A1'
    ws["C2"] = "=A2>A1"
    ws["C3"] = "=1/0"
    ws["C4"] = "=HX_LMTD(100,60,30,40)"
    ws["B1"].font = Font(bold=True)
    dv = DataValidation(type="decimal", operator="between", formula1="0", formula2="1000")
    ws.add_data_validation(dv)
    dv.add("A1:A4")
    wb.defined_names["duties"] = DefinedName("duties", attr_text="Calc!$B$1:$B$4")
    chart = BarChart()
    chart.add_data(Reference(ws, min_col=2, min_row=1, max_row=4))
    ws.add_chart(chart, "E2")
    src0 = tmp_path / "v0.xlsx"
    wb.save(src0)
    src = _rewrite(src0, tmp_path / "v.xlsx", {
        "[Content_Types].xml": lambda x: x.replace("</Types>", '<Override PartName="/xl/calcChain.xml" ContentType='
                                                   '"application/vnd.openxmlformats-officedocument.spreadsheetml.'
                                                   'calcChain+xml"/></Types>'),
        "xl/_rels/workbook.xml.rels": lambda x: x.replace("</Relationships>", '<Relationship Id="rIdC" Type="http://'
                                                          'schemas.openxmlformats.org/officeDocument/2006/'
                                                          'relationships/calcChain" Target="calcChain.xml"/>'
                                                          "</Relationships>")},
        add=[("xl/calcChain.xml", f'<calcChain xmlns="{MAIN_NS}"><c r="B1" i="1"/></calcChain>'.encode())])
    out = tmp_path / "values.xlsx"
    rc, err = _recalc(capsys, src, "-o", out, "--values")
    assert rc == 0, err
    book = openpyxl.load_workbook(out)
    cells = [c for row in book["Calc"].iter_rows() for c in row]
    assert not [c.coordinate for c in cells if c.data_type == "f"]
    got = {c.coordinate: c.value for c in cells if c.value is not None}
    assert got["B3"] == 75 and got["C1"] == "duty 100" and got["C2"] is True and got["C3"] == "#DIV/0!"
    assert got["C4"] == pytest.approx(LMTD, rel=1e-12)
    data_only = openpyxl.load_workbook(out, data_only=True)["Calc"]
    assert {c.coordinate: c.value for row in data_only.iter_rows() for c in row if c.value is not None} == got
    assert book["Calc"]["B1"].font.bold
    assert book["Calc"].data_validations.dataValidation
    assert "duties" in book.defined_names
    with zipfile.ZipFile(src) as a, zipfile.ZipFile(out) as b:
        names = b.namelist()
        assert "xl/calcChain.xml" not in names and "calcChain" not in b.read("[Content_Types].xml").decode()
        assert "calcChain" not in b.read("xl/_rels/workbook.xml.rels").decode()
        charts = [n for n in a.namelist() if n.startswith("xl/charts/")]
        assert charts and all(a.read(n) == b.read(n) for n in charts)
        assert a.read("xl/styles.xml") == b.read("xl/styles.xml")
        wb_in, wb_out = a.read("xl/workbook.xml"), b.read("xl/workbook.xml")  # only fullCalcOnLoad goes
        assert re.sub(rb"<calcPr[^>]*>", b"", wb_in) == re.sub(rb"<calcPr[^>]*>", b"", wb_out)
        assert b"fullCalcOnLoad" in wb_in and b"fullCalcOnLoad" not in wb_out


def test_unchanged_parts_byte_identical(tmp_path, capsys, plain):
    out = tmp_path / "o.xlsx"
    assert _recalc(capsys, plain, "-o", out)[0] == 0
    with zipfile.ZipFile(plain) as a, zipfile.ZipFile(out) as b:
        assert a.namelist() == b.namelist()
        same = [n for n in a.namelist() if a.read(n) == b.read(n)]
        assert set(a.namelist()) - set(same) <= {SHEET, "xl/workbook.xml"}
    assert os.path.getsize(out) > 0


# -- round trip over random sheets in every shape ------------------------------------------------

def _drop_implied_r(xml):
    """Remove r where the format lets the position follow from the order (row after row, cell after
    cell), keeping it after a gap."""
    state = {"row": 0, "col": 0}

    def sub(m):
        tag, rest, letters, digits = m.group(1), m.group(2), m.group(3), int(m.group(4))
        if tag == "row":
            implied = digits == state["row"] + 1
            state["row"], state["col"] = digits, 0
        else:
            col = 0
            for ch in letters:
                col = col * 26 + ord(ch) - 64
            implied = col == state["col"] + 1
            state["col"] = col
        return f"<{tag}{rest}" if implied else m.group(0)

    return re.sub(r'<(row|c)\b([^>]*?) r="([A-Z]*)(\d+)"', sub, xml)


ROUND_SHAPES = {
    "plain": lambda x: x,
    "no_r": _drop_implied_r,
    "prefix": _prefixed,
    "single_quotes": _single_quotes,
    "all": lambda x: _single_quotes(_prefixed(_drop_implied_r(x))),
}
_cells = st.tuples(st.integers(1, 12), st.integers(1, 8))
_values = st.one_of(st.integers(-10**6, 10**6), st.floats(-1e9, 1e9, allow_nan=False).map(lambda v: round(v, 6)),
                    st.booleans(), st.text(alphabet="ab xy&<>\"'", min_size=1, max_size=6).filter(str.strip))


@pytest.fixture(scope="module")
def round_dir(tmp_path_factory):
    return tmp_path_factory.mktemp("round")


@settings(max_examples=40, deadline=None)
@given(initial=st.dictionaries(_cells, _values, max_size=25), edits=st.dictionaries(_cells, _values, max_size=10),
       shape=st.sampled_from(sorted(ROUND_SHAPES)))
def test_set_values_round_trip(round_dir, initial, edits, shape):
    """Whatever the shape, what is written is what a reader finds, and nothing else moves."""
    from cellfuncs.headless.package import col_letters

    wb = openpyxl.Workbook()
    ws = wb.active
    ws.title = "S"
    for (r, c), v in initial.items():
        ws.cell(r, c, v)
    src0, src, out = round_dir / "r0.xlsx", round_dir / "r.xlsx", round_dir / "o.xlsx"
    wb.save(src0)
    _rewrite(src0, src, {SHEET: ROUND_SHAPES[shape]})
    pkg = Package(str(src))
    assert set(pkg.cells("S")) == {f"{col_letters(c)}{r}" for (r, c) in initial}
    pkg.set_values({("S", f"{col_letters(c)}{r}"): v for (r, c), v in edits.items()})
    pkg.save(str(out))
    back = openpyxl.load_workbook(out)["S"]
    got = {(c.row, c.column): c.value for row in back.iter_rows() for c in row if c.value is not None}
    want = {**initial, **edits}
    assert got.keys() == want.keys()
    for key, v in want.items():
        assert got[key] == (pytest.approx(v, rel=1e-15) if isinstance(v, float) else v), key
