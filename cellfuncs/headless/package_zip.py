"""Reading the zip container of a workbook with bounded resources.

Every refusal is a :class:`~cellfuncs.headless.package.BookError` with one line (the CLI turns it into exit 2).

* A part is refused before it is decompressed when the zip directory declares more than
  :data:`MAX_PART_BYTES` uncompressed, or more than :data:`RATIO_FLOOR_BYTES` at a compression
  ratio over :data:`MAX_RATIO`; the same limits are applied again to the bytes actually produced
  while streaming (a declared size can lie), and the whole package may not inflate to more than
  :data:`MAX_TOTAL_BYTES`.
* Member names that are absolute (``/x``, ``C:/x``), contain a ``..`` segment, or occur twice are
  refused, as are compression methods other than the two the package format allows (stored and
  deflated) and encrypted members.
* A DOCTYPE anywhere in an XML part is refused (entity expansion and external entities need one).
* A compound (CFB/OLE2) file is what Excel writes for a password-protected workbook; it is named as
  such instead of "not a zip file".

References
----------
ECMA-376 Part 2 (Open Packaging Conventions), annex C: ZIP appnote subset (stored and deflate only).
PKWARE APPNOTE.TXT 6.3: zip file format. [MS-CFB]: compound file header signature.
[MS-OFFCRYPTO] 2.3.4: an encrypted package is a CFB with ``EncryptionInfo`` and ``EncryptedPackage``.
"""

from __future__ import annotations

import copy
import zipfile
import zlib

#: the largest uncompressed part accepted [bytes]
MAX_PART_BYTES = 256 * 2**20
#: above this size [bytes] a part must not inflate more than :data:`MAX_RATIO` times
RATIO_FLOOR_BYTES = 16 * 2**20
#: the largest accepted ratio uncompressed : compressed for parts above RATIO_FLOOR_BYTES [-]
MAX_RATIO = 200
#: the largest total of all parts, uncompressed [bytes]
MAX_TOTAL_BYTES = 512 * 2**20
#: the most members a package may have
MAX_MEMBERS = 100_000

CFB_MAGIC = bytes.fromhex("D0CF11E0A1B11AE1")
_CHUNK = 1 << 20
_ALLOWED_METHODS = (zipfile.ZIP_STORED, zipfile.ZIP_DEFLATED)
_XML_EXT = (".xml", ".rels", ".vml", ".svg")


def _err(msg: str):
    from cellfuncs.headless.package import BookError

    return BookError(msg)


def _mb(n: int) -> str:
    return f"{n / 2**20:.0f} MB"


def check_container(path: str, label: str) -> None:
    """Name a compound (CFB) file for what it is before the zip reader calls it "not a zip file"."""
    with open(path, "rb") as fh:
        head = fh.read(8)
        if head != CFB_MAGIC:
            return
        found_enc = found_book = False
        tail = b""
        while True:
            chunk = fh.read(_CHUNK)
            if not chunk:
                break
            block = tail + chunk
            found_enc = found_enc or "EncryptedPackage".encode("utf-16-le") in block
            found_book = found_book or "Workbook".encode("utf-16-le") in block
            tail = block[-64:]
    if found_book and not found_enc:
        raise _err(f"{label}: a legacy binary (.xls) workbook: save a copy as .xlsx")
    raise _err("password-protected workbook: save a copy without a password")


def check_names(infos, label: str) -> None:
    """Refuse absolute member names, ``..`` segments, duplicates, odd methods, encrypted members."""
    if len(infos) > MAX_MEMBERS:
        raise _err(f"{label}: {len(infos)} zip members, more than the {MAX_MEMBERS:,} accepted")
    seen = set()
    for info in infos:
        name = info.filename
        flat = name.replace("\\", "/")
        if (flat.startswith("/") or (len(flat) > 1 and flat[1] == ":") or "\x00" in flat
                or ".." in flat.split("/")):
            raise _err(f"{label}: zip member name {name!r} is absolute or leaves the package (refused)")
        key = flat.lower()
        if key in seen:
            raise _err(f"{label}: zip member {name!r} occurs twice (refused)")
        seen.add(key)
        if info.flag_bits & 0x1:
            raise _err("password-protected workbook: save a copy without a password")
        if info.compress_type not in _ALLOWED_METHODS:
            raise _err(f"{label}: zip member {name!r} uses compression method {info.compress_type}; "
                       "a workbook package uses only stored or deflated parts")


def _check_size(name: str, size: int, compressed: int, label: str, stage: str) -> None:
    if size > MAX_PART_BYTES:
        raise _err(f"{label}: part {name} {stage} more than {_mb(MAX_PART_BYTES)} uncompressed (refused)")
    if size > RATIO_FLOOR_BYTES and size > MAX_RATIO * max(compressed, 1):
        raise _err(f"{label}: part {name} {stage} more than {_mb(RATIO_FLOOR_BYTES)} at a compression ratio "
                   f"over {MAX_RATIO}:1 (refused)")


def read_parts(zf: zipfile.ZipFile, label: str, file_size: int) -> dict:
    """Every member's bytes, checked against the limits before and while decompressing."""
    infos = zf.infolist()
    check_names(infos, label)
    total = 0
    for info in infos:
        _check_size(info.filename, info.file_size, min(info.compress_size, file_size), label, "declares")
        total += info.file_size
    if total > MAX_TOTAL_BYTES:
        raise _err(f"{label}: the parts declare {_mb(total)} in all, more than {_mb(MAX_TOTAL_BYTES)} (refused)")
    parts = {}
    total = 0
    for info in infos:
        compressed = min(info.compress_size, file_size)
        # read with a ceiling above every limit, so that the reader does not stop at a declared size
        # that lies: the limits below are checked on the bytes that really come out
        probe = copy.copy(info)
        probe.file_size = MAX_PART_BYTES + 1
        chunks, size = [], 0
        with zf.open(probe) as fh:
            while True:
                chunk = fh.read(_CHUNK)
                if not chunk:
                    break
                size += len(chunk)
                _check_size(info.filename, size, compressed, label, "inflates to")
                if total + size > MAX_TOTAL_BYTES:
                    raise _err(f"{label}: the parts inflate to more than {_mb(MAX_TOTAL_BYTES)} in all (refused)")
                chunks.append(chunk)
        if size != info.file_size:
            raise _err(f"{label}: part {info.filename} inflates to {size} bytes, not the {info.file_size} "
                       "its zip directory declares (corrupt or forged; refused)")
        total += size
        parts[info.filename] = b"".join(chunks)
        del chunks
    return parts


def is_xml_part(name: str, data: bytes) -> bool:
    if name.lower().endswith(_XML_EXT):
        return True
    head = data[:64].lstrip(b"\xef\xbb\xbf\xff\xfe\x00 \t\r\n")
    return head.startswith(b"<")


def _utf16(data: bytes):
    """The codec of a UTF-16 part (with or without a byte-order mark), else None."""
    if data[:2] in (b"\xff\xfe", b"\xfe\xff"):
        return "utf-16"
    if data[:2] == b"<\x00":
        return "utf-16-le"
    if data[:2] == b"\x00<":
        return "utf-16-be"
    return None


def xml_text_bytes(data: bytes) -> bytes:
    """The part as UTF-8 bytes (UTF-16 parts are transcoded and their declaration says so)."""
    codec = _utf16(data)
    if codec is None:
        return data
    text = data.decode(codec)
    if text.startswith("\ufeff"):
        text = text[1:]
    if text.startswith("<?xml"):
        end = text.find("?>")
        decl = text[:end].replace("UTF-16", "UTF-8").replace("utf-16", "UTF-8")
        text = decl + text[end:]
    return text.encode("utf-8")


def check_no_doctype(parts: dict, label: str) -> None:
    """Refuse a DOCTYPE declaration in any XML part (case-insensitive, also in UTF-16 parts)."""
    for name, data in parts.items():
        if not is_xml_part(name, data):
            continue
        if _utf16(data):
            data = xml_text_bytes(data)
        pos = data.find(b"<!")
        while pos >= 0:
            if data[pos + 2: pos + 9].upper() == b"DOCTYPE":
                raise _err(f"{label}: part {name} has a DOCTYPE declaration (refused: a workbook part "
                           "never needs one)")
            pos = data.find(b"<!", pos + 2)


def decompress_error_types():
    return (zipfile.BadZipFile, zipfile.LargeZipFile, OSError, EOFError, RuntimeError, ValueError,
            NotImplementedError, zlib.error)
