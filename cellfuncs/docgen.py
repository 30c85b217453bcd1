"""Text and Markdown views of the catalogue (``cellfuncs functions``, docs/functions.md)
and of the naming glossary (docs/glossary.md: ``python -m cellfuncs.docgen --glossary``)."""

from __future__ import annotations

from cellfuncs import catalogue

__all__ = ["functions_text", "functions_markdown", "function_text", "function_markdown", "find_entry",
           "unknown_name_line", "glossary_markdown"]


def _signature(e) -> str:
    parts = [f"[{a.name}]" if a.optional else a.name for a in e.args]
    return f"{e.name}({', '.join(parts)})"


def find_entry(name: str):
    """The catalogue entry called ``name`` (not case-sensitive, ``=`` and ``()`` ignored), or None."""
    key = name.strip().lstrip("=").split("(")[0].strip().upper()
    return next((e for e in catalogue.entries() if e.name == key), None)


def unknown_name_line(name: str) -> str:
    """One line for an unknown function name, with the closest names."""
    import difflib

    names = [e.name for e in catalogue.entries()]
    key = name.strip().upper()
    close = [n for n in names if key and n.startswith(key)][:5]
    close += [n for n in difflib.get_close_matches(key, names, n=5, cutoff=0.5) if n not in close]
    if close:
        return f"no cell function {name!r}; closest: {', '.join(close[:5])}"
    return f"no cell function {name!r}; `cellfuncs functions` lists them all"


def _entry_lines(e) -> list:
    lines = [_signature(e), f"    {e.description}"]
    lines += [f"    {a.name}: {a.full_help()}" for a in e.args]
    lines.append(f"    returns: {e.returns}")
    return lines


def function_text(e) -> str:
    """One function as ``cellfuncs functions NAME`` shows it."""
    lines = [f"{e.name} ({e.category})"] + _entry_lines(e)[1:]
    lines.insert(1, "    " + _signature(e))
    ex = _example_line(e)
    if ex:
        lines.append("    " + ex.replace("`", ""))
    return "\n".join(lines) + "\n"


def functions_text() -> str:
    lines = []
    category = None
    for e in catalogue.entries():
        if e.category != category:
            category = e.category
            lines.append(f"\n== {category} ==")
        lines += _entry_lines(e)
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
    # an argument left out (None in the example) is written as Excel takes it: nothing between commas
    args = list(e.example)
    while args and args[-1] is None:
        args.pop()
    call = ",".join("" if v is None else " " + _fmt_value(v) for v in args).lstrip()
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
        out += _markdown_lines(e)
    return "\n".join(out)


def _markdown_lines(e) -> list:
    out = [f"### `{_signature(e)}`", "", e.description, ""]
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
    return out


def function_markdown(e) -> str:
    """One function's section of docs/functions.md."""
    return "\n".join(_markdown_lines(e))
def glossary_markdown() -> str:
    """docs/glossary.md, generated from :mod:`cellfuncs.catalogue.glossary`."""
    from cellfuncs.catalogue import glossary as g

    r = g.RULES
    out = [
        "# Naming glossary",
        "",
        "Generated from `cellfuncs/catalogue/glossary.py` by `python -m cellfuncs.docgen "
        "--glossary > docs/glossary.md`; do not edit by hand. `tests/test_glossary.py` checks "
        "every argument of every cell function against this table and fails when this file "
        "is stale.",
        "",
        "One name for one thing across all families. Function names and argument positions of "
        "existing functions never change (workbooks call them by position); argument names, "
        "help, validity ranges and stated defaults may, each change listed in CHANGELOG.md.",
        "",
        "## Rules",
        "",
    ]
    titles = {"temperatures": "Temperatures", "pressures": "Pressures", "units": "Unit suffixes",
              "ratios": "Ratios and efficiencies", "gas": "Gas analysis",
              "words": "Option words", "order": "Order of arguments (new functions)",
              "positions": "Existing functions", "per_cell": "Per-cell results",
              "names": "Function names", "defaults": "Defaults",
              "limits": "Excel's limits"}
    for key, title in titles.items():
        out.append(f"- **{title}**: {r[key]}")
    out += ["", "## Arrangement defaults other than counter", "", "| function | default | why |",
            "|---|---|---|"]
    for name, (word, why) in g.ARRANGEMENT_DEFAULTS.items():
        out.append(f"| `{name}` | `{word}` | {_md_escape(why)} |")
    out += ["", "## Function-name prefixes", "",
            "A new function takes the prefix of its family; a new family gets a new prefix and "
            "its own category.", "",
            "| prefix | category | what it covers |", "|---|---|---|"]
    for prefix, (family, what) in g.PREFIXES.items():
        out.append(f"| `{prefix}` | cellfuncs · {family} | {_md_escape(what)} |")
    out += ["", "## Argument names", "",
            "Group = place in the argument list of a new function: " + "; ".join(
                f"{k} {v}" for k, v in g.GROUPS.items()) + ". Unit = the unit at the cell "
            "(blank: words, text, or a range whose unit the help states).", "",
            "| name | group | unit | meaning |", "|---|---|---|---|"]
    for name in sorted(g.GLOSSARY):
        group, unit, meaning = g.GLOSSARY[name]
        out.append(f"| `{name}` | {group} | {_md_escape(unit)} | {_md_escape(meaning)} |")
    out += ["", "## Names not to use", "", "| not | but |", "|---|---|"]
    for bad, good in sorted(g.FORBIDDEN.items()):
        out.append(f"| `{bad}` | {_md_escape(good)} |")
    out.append("")
    return "\n".join(out)


if __name__ == "__main__":  # pragma: no cover - a developer's command
    import sys

    if sys.argv[1:] == ["--glossary"]:
        sys.stdout.write(glossary_markdown())
    else:
        sys.stdout.write(functions_markdown())
