"""The ``cellfuncs`` command: recalc, cases, inputs, functions, demo.

Exit codes: 0 when the job was done (a workbook with error cells still counts
as computed), 3 when ``recalc`` computed with gaps (cells it could not compute
kept their cached value or became errors; each is named on stderr), 2 with one
line on stderr for unusable input.  No command ever
writes over its input; outputs are written atomically.
"""

from __future__ import annotations

import argparse
import json
import os
import sys

__all__ = ["main"]


from cellfuncs.errors import UsageError


def _parse_sets(items):
    """``REF=VALUE`` items -> {target: value text}; the values are read like `cases` cells."""
    sets = {}
    for item in items or ():
        if "=" not in item:
            raise UsageError(f"--set {item}: expected REF=VALUE, e.g. Inputs!B3=45 or site_t=45")
        ref, _, val = item.partition("=")
        if not ref.strip():
            raise UsageError(f"--set {item}: the cell reference or name is missing")
        if ref.strip() in sets:
            raise UsageError(f"--set {ref.strip()}: given twice; set each cell once")
        sets[ref.strip()] = val
    return sets


def check_output_path(out: str, *inputs: str):
    """Refuse an output that is an input, a folder, or in a folder that does not exist."""
    from cellfuncs.headless.files import check_output_path as check

    check(out, *inputs)


def _json_value(v):
    from cellfuncs.headless.package import ErrorText

    if isinstance(v, ErrorText):
        return str(v)
    return v


def cmd_recalc(ns) -> int:
    """Exit 0: every formula computed; 3: computed with gaps (cells kept or not computed); 2: unusable."""
    from cellfuncs import headless
    from cellfuncs.headless.package import BookError, check_output_kind

    if not ns.book.lower().endswith((".xlsx", ".xlsm")) and os.path.isfile(ns.book):
        raise UsageError(f"{ns.book}: not an .xlsx workbook")
    check_output_path(ns.output, ns.book)
    sets = _parse_sets(ns.set)
    try:
        check_output_kind(ns.book, ns.output)  # reads the package first: refusals come before the engine loads
        res, pkg = headless.recalc(ns.book, sets)
        if ns.values:
            pkg.values_only()
        headless.write_with_cached_values(res, pkg, ns.output)
    except BookError as exc:
        raise UsageError(str(exc)) from None
    except MemoryError:
        raise UsageError("out of memory while computing the workbook (see the limits in "
                         "docs/headless.md)") from None
    except OSError as exc:
        raise UsageError(f"-o {ns.output}: cannot write ({exc.strerror or exc})") from None
    for line in res.warnings:
        print(line, file=sys.stderr)
    for (sheet, ref), msg in res.messages.items():
        if (sheet, ref) not in res.gaps:
            print(f"{sheet}!{ref}: {msg}", file=sys.stderr)
    for (sheet, ref), why in res.gaps.items():
        if (sheet, ref) in res.kept:
            print(f"{sheet}!{ref}: not computed: {why} (kept the value the file held)", file=sys.stderr)
        else:
            msg = res.messages.get((sheet, ref), f"#N/A not computed: {why}")
            code, _, text = msg.partition(" ")
            print(f"{sheet}!{ref}: {text} (now {code})", file=sys.stderr)
    if ns.json:
        obj = {f"{s}!{r}": _json_value(v) for (s, r), v in res.values.items()}
        json.dump(obj, sys.stdout, ensure_ascii=False)
        sys.stdout.write("\n")
    else:
        print(f"computed {len(res.values) - len(res.gaps)} formula cells, {len(res.messages)} with an error, "
              f"{len(res.gaps)} not computed; wrote {ns.output}", file=sys.stderr)
    return 3 if res.gaps else 0


#: plain stand-ins for characters a non-UTF-8 console may not have; anything else becomes "?"
_STAND_INS = {"°": "deg", "·": ".", "²": "2", "³": "3", "λ": "lambda", "ε": "eps", "η": "eta",
              "Δ": "d", "→": "->", "←": "<-", "–": "-", "—": "-", "−": "-", "≈": "~", "×": "x",
              "≤": "<=", "≥": ">=", "±": "+/-", "µ": "u", "…": "...", "‘": "'", "’": "'", "“": '"',
              "”": '"'}


def _stand_in(exc):
    if not isinstance(exc, UnicodeEncodeError):  # pragma: no cover - registered for encoding only
        raise exc
    text = "".join(_STAND_INS.get(ch, "?") for ch in exc.object[exc.start:exc.end])
    try:
        text.encode(exc.encoding)
    except (UnicodeEncodeError, LookupError):
        text = "?" * (exc.end - exc.start)
    return text, exc.end


def _printable_output():
    """Let stdout and stderr show what their encoding cannot (a Windows console, redirected output).

    A console that is not UTF-8 (cp1252, ASCII under LANG=C) cannot encode λ, ε, → (ASCII not even
    ° or ³); printing them would raise UnicodeEncodeError.  They are written as plain stand-ins
    ("deg", "->") or "?" instead.
    """
    import codecs

    try:
        codecs.lookup_error("cellfuncs-stand-in")
    except LookupError:
        codecs.register_error("cellfuncs-stand-in", _stand_in)
    for stream in (sys.stdout, sys.stderr):
        if hasattr(stream, "reconfigure"):
            try:
                stream.reconfigure(errors="cellfuncs-stand-in")
            except (ValueError, OSError):  # pragma: no cover - a closed or detached stream
                pass


def cmd_functions(ns) -> int:
    from cellfuncs import docgen

    _printable_output()
    if ns.name:
        entry = docgen.find_entry(ns.name)
        if entry is None:
            raise UsageError(docgen.unknown_name_line(ns.name))
        text = docgen.function_markdown(entry) if ns.markdown else docgen.function_text(entry)
    else:
        text = docgen.functions_markdown() if ns.markdown else docgen.functions_text()
    sys.stdout.write(text)
    return 0


def cmd_demo(ns) -> int:
    from cellfuncs import demo

    _printable_output()
    out = os.path.abspath(ns.output)
    if os.path.exists(out) and not os.path.isdir(out):
        raise UsageError(f"-o {ns.output}: is a file, not a folder")
    if os.path.isdir(out) and os.listdir(out) and not ns.force:
        raise UsageError(f"-o {ns.output}: folder is not empty; choose an empty or new folder, "
                         "or add --force to write the demo workbooks into it (files of the same name are replaced)")
    try:
        os.makedirs(out, exist_ok=True)
        summary = demo.build_all(out)
    except OSError as exc:
        raise UsageError(f"-o {ns.output}: cannot write there ({exc.strerror or exc})") from None
    for line in summary:
        print(line)
    print(f"demo workbooks written to {out}")
    return 0


def cmd_inputs(ns) -> int:
    from cellfuncs import bookinfo
    from cellfuncs.headless.package import BookError

    _printable_output()
    try:
        info = bookinfo.book_info(ns.book)
    except BookError as exc:
        raise UsageError(str(exc)) from None
    if ns.json:
        json.dump(bookinfo.info_json(info), sys.stdout, ensure_ascii=True, default=str)
        sys.stdout.write("\n")
    else:
        sys.stdout.write(bookinfo.info_text(info))
    return 0


def cmd_cases(ns) -> int:
    from cellfuncs.headless import cases

    return cases.run(ns)


def cmd_calc_extension(ns) -> int:
    from cellfuncs.calc.build import build_extension

    if not ns.output.lower().endswith(".oxt"):
        raise UsageError(f"-o {ns.output}: the extension file name must end in .oxt")
    check_output_path(ns.output)
    try:
        n = build_extension(ns.output)
    except OSError as exc:
        raise UsageError(f"-o {ns.output}: cannot write ({exc.strerror or exc})") from None
    print(f"wrote {ns.output} ({n} functions, for Python {sys.version_info[0]}.{sys.version_info[1]}); "
          f"install it with: unopkg add --force {ns.output}", file=sys.stderr)
    return 0


def build_parser() -> argparse.ArgumentParser:
    from cellfuncs import __version__

    p = argparse.ArgumentParser(prog="cellfuncs", description=(
        "Cell functions for tendering gas-engine CHP plants: recalculate workbooks headlessly, "
        "run batch what-if cases, list a workbook's inputs and outputs, list the functions, build the demo "
        "workbooks. Results are "
        "estimates for tendering; engine data come from the engine's declared datasheet."))
    p.add_argument("--version", action="version", version=f"cellfuncs {__version__}")
    sub = p.add_subparsers(dest="command", required=True)

    r = sub.add_parser("recalc", help="compute a workbook and write it with cached values")
    r.add_argument("book", help="input workbook (.xlsx); never written to")
    r.add_argument("-o", "--output", required=True, help="output workbook (.xlsx)")
    r.add_argument("--set", action="append", metavar="REF=VALUE",
                   help="override an input before computing (Sheet!A1 or a defined name)")
    r.add_argument("--json", action="store_true", help="print every formula cell's value as JSON")
    r.add_argument("--values", action="store_true",
                   help="write a values-only copy: every formula replaced by its value (charts, styles kept)")
    r.set_defaults(func=cmd_recalc)

    f = sub.add_parser("functions", help="list the cell functions, or show one")
    f.add_argument("name", nargs="?", help="one function to show (e.g. HX_LMTD; not case-sensitive)")
    f.add_argument("--markdown", action="store_true", help="Markdown (as in docs/functions.md)")
    f.set_defaults(func=cmd_functions)

    d = sub.add_parser("demo", help="build and recalculate the demo workbooks")
    d.add_argument("-o", "--output", default="cellfuncs-demo", help="folder (default ./cellfuncs-demo)")
    d.add_argument("--force", action="store_true",
                   help="write into a folder that is not empty (demo files of the same name are replaced)")
    d.set_defaults(func=cmd_demo)

    i = sub.add_parser("inputs", help="list a workbook's named inputs, outputs and the columns cases accepts")
    i.add_argument("book", help="workbook (.xlsx); only read")
    i.add_argument("--json", action="store_true", help="print the same as one JSON object")
    i.set_defaults(func=cmd_inputs)

    c = sub.add_parser("cases", help="run a workbook over the cases of a CSV file")
    c.add_argument("book", help="input workbook (.xlsx)")
    c.add_argument("cases_csv", help="CSV: one column per input (defined name or Sheet!A1), one row per case")
    c.add_argument("-o", "--output", required=True, help="results CSV")
    c.add_argument("--outputs", help="comma-separated outputs (default: defined names starting with out_)")
    c.add_argument("--workers", type=int, default=1, help="processes to spread the cases over")
    c.set_defaults(func=cmd_cases)

    x = sub.add_parser("calc-extension", help="build the LibreOffice Calc extension (.oxt)")
    x.add_argument("-o", "--output", required=True, help="extension file (.oxt)")
    x.set_defaults(func=cmd_calc_extension)
    return p


def main(argv=None) -> int:
    parser = build_parser()
    ns = parser.parse_args(argv)
    try:
        return ns.func(ns)
    except UsageError as exc:
        print(f"cellfuncs: {exc}", file=sys.stderr)
        return 2
    except KeyboardInterrupt:  # pragma: no cover
        return 130


if __name__ == "__main__":  # pragma: no cover
    sys.exit(main())
