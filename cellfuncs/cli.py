"""The ``cellfuncs`` command: recalc, functions, demo, cases.

Exit codes: 0 when the job was done (a workbook with error cells still counts
as computed), 2 with one line on stderr for unusable input.  No command ever
writes over its input; outputs are written atomically.
"""

from __future__ import annotations

import argparse
import json
import math
import os
import sys

__all__ = ["main"]


from cellfuncs.errors import UsageError


def _parse_value(text: str):
    t = text.strip()
    if t == "":
        raise UsageError("--set: empty value (write REF=VALUE with a number or text)")
    try:
        v = float(t)
    except ValueError:
        return t
    if not math.isfinite(v):
        raise UsageError(f"--set: {t!r} is not a finite number")
    return v


def _parse_sets(items):
    sets = {}
    for item in items or ():
        if "=" not in item:
            raise UsageError(f"--set {item}: expected REF=VALUE, e.g. Inputs!B3=45 or site_t=45")
        ref, _, val = item.partition("=")
        if not ref.strip():
            raise UsageError(f"--set {item}: the cell reference or name is missing")
        sets[ref.strip()] = _parse_value(val)
    return sets


def _same_file(a: str, b: str) -> bool:
    if os.path.exists(a) and os.path.exists(b):
        return os.path.samefile(a, b)
    return os.path.realpath(a) == os.path.realpath(b)


def check_output_path(out: str, *inputs: str):
    """Refuse an output that is an input, a folder, or in a folder that does not exist."""
    for src in inputs:
        if _same_file(src, out):
            raise UsageError(f"-o {out}: would write over an input file; choose another file")
    if os.path.isdir(out):
        raise UsageError(f"-o {out}: is a folder; give a file name")
    folder = os.path.dirname(os.path.abspath(out))
    if not os.path.isdir(folder):
        raise UsageError(f"-o {out}: folder {folder} does not exist")
    if not os.access(folder, os.W_OK):
        raise UsageError(f"-o {out}: cannot write in folder {folder}")


def _json_value(v):
    from cellfuncs.xlsx import ErrorText

    if isinstance(v, ErrorText):
        return str(v)
    return v


def cmd_recalc(ns) -> int:
    from cellfuncs import headless
    from cellfuncs.xlsx import BookError

    if not ns.book.lower().endswith((".xlsx", ".xlsm")) and os.path.isfile(ns.book):
        raise UsageError(f"{ns.book}: not an .xlsx workbook")
    check_output_path(ns.output, ns.book)
    sets = _parse_sets(ns.set)
    try:
        res, pkg = headless.recalc(ns.book, sets)
        headless.write_with_cached_values(res, pkg, ns.output)
    except BookError as exc:
        raise UsageError(str(exc)) from None
    except OSError as exc:
        raise UsageError(f"-o {ns.output}: cannot write ({exc.strerror or exc})") from None
    for (sheet, ref), msg in res.messages.items():
        print(f"{sheet}!{ref}: {msg}", file=sys.stderr)
    if ns.json:
        obj = {f"{s}!{r}": _json_value(v) for (s, r), v in res.values.items()}
        json.dump(obj, sys.stdout, ensure_ascii=False)
        sys.stdout.write("\n")
    else:
        print(f"computed {len(res.values)} formula cells, {len(res.messages)} with an error; "
              f"wrote {ns.output}", file=sys.stderr)
    return 0


def cmd_functions(ns) -> int:
    from cellfuncs import docgen

    text = docgen.functions_markdown() if ns.markdown else docgen.functions_text()
    sys.stdout.write(text)
    return 0


def cmd_demo(ns) -> int:
    from cellfuncs import demo

    out = os.path.abspath(ns.output)
    if os.path.exists(out) and not os.path.isdir(out):
        raise UsageError(f"-o {ns.output}: is a file, not a folder")
    try:
        os.makedirs(out, exist_ok=True)
        summary = demo.build_all(out)
    except OSError as exc:
        raise UsageError(f"-o {ns.output}: cannot write there ({exc.strerror or exc})") from None
    for line in summary:
        print(line)
    print(f"demo workbooks written to {out}")
    return 0


def cmd_cases(ns) -> int:
    from cellfuncs import cases

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
        "list the functions, build the demo workbooks, run batch what-if cases. Results are "
        "estimates for tendering; engine data come from the engine's declared datasheet."))
    p.add_argument("--version", action="version", version=f"cellfuncs {__version__}")
    sub = p.add_subparsers(dest="command", required=True)

    r = sub.add_parser("recalc", help="compute a workbook and write it with cached values")
    r.add_argument("book", help="input workbook (.xlsx); never written to")
    r.add_argument("-o", "--output", required=True, help="output workbook (.xlsx)")
    r.add_argument("--set", action="append", metavar="REF=VALUE",
                   help="override an input before computing (Sheet!A1 or a defined name)")
    r.add_argument("--json", action="store_true", help="print every formula cell's value as JSON")
    r.set_defaults(func=cmd_recalc)

    f = sub.add_parser("functions", help="list the cell functions")
    f.add_argument("--markdown", action="store_true", help="Markdown (as in docs/functions.md)")
    f.set_defaults(func=cmd_functions)

    d = sub.add_parser("demo", help="build and recalculate the demo workbooks")
    d.add_argument("-o", "--output", default="cellfuncs-demo", help="folder (default ./cellfuncs-demo)")
    d.set_defaults(func=cmd_demo)

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
