"""Write a UNO type library (``.rdb``) holding one interface, in the binary UNOIDL format.

A Calc add-in needs its function signatures as a UNO interface type that LibreOffice's
type manager knows; extensions ship it as a type library.  The SDK compiles ``.idl``
files to such libraries, but the SDK is a separate download on macOS and Windows and
a large package on Linux, and the format of the files it writes is small and
documented (LibreOffice's ``unoidl/README.md``, "Specification of the new UNOIDL
types.rdb format", format version 0, read by LibreOffice 4.1 and later).  This module
writes the subset needed here: nested modules and interface types whose methods take
``in`` parameters.

Layout used (all integers little-endian, offsets count from the start of the file):
the 8-byte header ``UNOIDL\\xff\\x00``, the offset and entry count of the root map,
then every payload written depth-first, each map's entries (name offset, payload
offset) sorted by name because the reader searches them by bisection.
"""

from __future__ import annotations

import struct
from dataclasses import dataclass, field

__all__ = ["Method", "Interface", "write_rdb", "type_library"]

_MAGIC = b"UNOIDL\xff\x00"


@dataclass(frozen=True)
class Method:
    """An interface method: ``name``, UNO ``returns`` type, ``params`` ((name, type), ...)."""

    name: str
    returns: str
    params: tuple = ()
    exceptions: tuple = ()


@dataclass(frozen=True)
class Interface:
    """An interface type named ``name`` (dotted), based on com.sun.star.uno.XInterface."""

    name: str
    methods: tuple = ()
    bases: tuple = ("com.sun.star.uno.XInterface",)
    published: bool = field(default=False)


def _u32(n: int) -> bytes:
    return struct.pack("<I", n)


def _string(text: str) -> bytes:
    """A Len-String (US-ASCII names): length with the top bit 0, then the bytes."""
    data = text.encode("ascii")
    if len(data) >= 0x80000000:  # pragma: no cover - names are short
        raise ValueError("name too long")
    return _u32(len(data)) + data


def _interface_payload(itf: Interface) -> bytes:
    out = bytearray([5 | (0x80 if itf.published else 0)])
    out += _u32(len(itf.bases))
    for base in itf.bases:
        out += _string(base)
    out += _u32(0)  # optional bases
    out += _u32(0)  # attributes
    out += _u32(len(itf.methods))
    for m in itf.methods:
        out += _string(m.name) + _string(m.returns) + _u32(len(m.params))
        for pname, ptype in m.params:
            out += b"\x00" + _string(pname) + _string(ptype)  # direction "in"
        out += _u32(len(m.exceptions))
        for exc in m.exceptions:
            out += _string(exc)
    return bytes(out)


def type_library(interfaces) -> bytes:
    """The bytes of a type library holding ``interfaces`` (and the modules around them)."""
    tree: dict = {}
    for itf in interfaces:
        *modules, leaf = itf.name.split(".")
        node = tree
        for mod in modules:
            node = node.setdefault(mod, {})
            if not isinstance(node, dict):
                raise ValueError(f"{itf.name}: {mod} is both a module and a type")
        if leaf in node:
            raise ValueError(f"{itf.name}: defined twice")
        node[leaf] = itf

    buf = bytearray(_MAGIC + _u32(0) + _u32(0))  # root offset and count filled in last

    def put(data: bytes) -> int:
        pos = len(buf)
        buf.extend(data)
        return pos

    def entries(node: dict) -> bytes:
        out = bytearray()
        for name in sorted(node, key=lambda s: s.encode("ascii")):
            value = node[name]
            if isinstance(value, dict):
                payload = put(b"\x00" + _u32(len(value)) + entries(value))
            else:
                payload = put(_interface_payload(value))
            name_at = put(name.encode("ascii") + b"\x00")
            out += _u32(name_at) + _u32(payload)
        return bytes(out)

    root = entries(tree)
    root_at = put(root)
    buf[8:16] = _u32(root_at) + _u32(len(tree))
    return bytes(buf)


def write_rdb(path: str, interfaces) -> None:
    with open(path, "wb") as fh:
        fh.write(type_library(interfaces))
