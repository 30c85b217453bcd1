"""Text and Markdown views of the catalogue (``cellfuncs functions``, docs/functions.md)."""

from __future__ import annotations

from cellfuncs import catalogue

__all__ = ["functions_text", "functions_markdown"]


def _signature(e) -> str:
    parts = [f"[{a.name}]" if a.optional else a.name for a in e.args]
    return f"{e.name}({', '.join(parts)})"


def functions_text() -> str:
    lines = []
    category = None
    for e in catalogue.entries():
        if e.category != category:
            category = e.category
            lines.append(f"\n== {category} ==")
        lines.append(_signature(e))
        lines.append(f"    {e.description}")
        for a in e.args:
            lines.append(f"    {a.name}: {a.full_help()}")
        lines.append(f"    returns: {e.returns}")
    return "\n".join(lines).lstrip("\n") + "\n"


def _md_escape(s: str) -> str:
    return s.replace("|", "\\|")


def _fmt_value(v):
    if isinstance(v, str):
        return f'"{v}"'
    if isinstance(v, float):
        return f"{v:.6g}"
    return str(v)


def _example_line(e):
    """``Example: `=HX_LMTD(100, 60, 30, 40.2, "counter")` → 43.2004`` (scalar arguments only)."""
    if not e.example or any(isinstance(v, (list, tuple)) for v in e.example):
        return ""
    from cellfuncs import excel

    res = getattr(excel, e.name)(*e.example)
    if isinstance(res, list):
        res_text = "{" + "; ".join(", ".join(_fmt_value(c) for c in row) for row in res) + "}"
    else:
        res_text = _fmt_value(res)
    if e.name == "CELLFUNCS_VERSION":
        res_text = "the installed version"
    call = ", ".join(_fmt_value(v) for v in e.example)
    return f"Example: `={e.name}({call})` → {res_text}"


def functions_markdown() -> str:
    from cellfuncs import __version__  # noqa: F401 - the docs do not carry it (stable output)

    out = [
        "# Cell functions",
        "",
        "Generated from the catalogue (`cellfuncs/catalogue/`) by `cellfuncs functions --markdown`;"
        " do not edit by hand. A test fails when this file is stale.",
        "",
        "Units are fixed per argument. Optional arguments are in brackets; a blank cell means"
        " the default. Option words are case-insensitive. Results are estimates for tendering:"
        " engine data come from the engine's declared datasheet, and final design follows local"
        " codes and licensed engineers (see cautions.md).",
        "",
    ]
    category = None
    for e in catalogue.entries():
        if e.category != category:
            category = e.category
            out += [f"## {category}", ""]
        out += [f"### `{_signature(e)}`", "", e.description, ""]
        if e.args:
            out += ["| argument | unit | meaning |", "|---|---|---|"]
            for a in e.args:
                name = f"[{a.name}]" if a.optional else a.name
                help_ = a.full_help()
                if a.unit:
                    help_ = help_.replace(f" [{a.unit}]", "")
                out.append(f"| `{name}` | {_md_escape(a.unit or '')} | {_md_escape(help_)} |")
            out.append("")
        out += [f"Returns: {e.returns}.".replace("..", "."), ""]
        ex = _example_line(e)
        if ex:
            out += [ex, ""]
    return "\n".join(out)
