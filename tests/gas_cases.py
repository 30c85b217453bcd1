"""Helpers shared by the gas tests: build cell ranges, call catalogue entries."""

from __future__ import annotations

from cellfuncs.catalogue import by_name


def pairs(text: str) -> list:
    """``"CH4=0.9;N2=0.1"`` -> [("CH4", 0.9), ("N2", 0.1)]."""
    out = []
    for item in (text or "").split(";"):
        if item.strip():
            name, _, value = item.partition("=")
            out.append((name.strip(), float(value)))
    return out


def as_ranges(text: str) -> tuple:
    """Names range and amounts range (one column each), as the adapters hand them over."""
    p = pairs(text)
    return tuple((n,) for n, _ in p), tuple((v,) for _, v in p)


def call_entry(name: str, row: dict):
    """Call a catalogue entry's target the way the adapters do (catalogue order, defaults)."""
    entry = by_name(name)
    names, amounts = as_ranges(row["composition"])
    u = as_ranges(row.get("u_fractions") or "")[1]
    args = []
    for a in entry.args:
        if a.name == "components":
            args.append(names)
        elif a.name == "amounts":
            args.append(amounts)
        elif a.name == "amount_uncertainties":
            args.append(u)
        else:
            v = row.get(a.name)
            if v is None or v == "":
                v = a.default
            elif a.kind == "option":
                v = a.aliases.get(str(v).lower(), str(v).lower())
            elif a.kind == "text":
                v = str(v)
            args.append(v)
    from cellfuncs.adapt import call

    return call(entry, tuple(args))
