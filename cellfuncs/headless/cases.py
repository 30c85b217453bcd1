"""``cellfuncs cases``: run a workbook over the rows of a CSV file (batch what-if).

Each CSV column header names an input of the workbook (a defined name or
``Sheet!A1``), each row is a case.  The outputs are the workbook's defined
names starting with ``out_`` (in the workbook's order) unless ``--outputs``
lists others.  The workbook is loaded once per worker process, not per case;
formulas the outputs do not depend on are left out, and each case sets the
inputs and computes only what depends on them.

The CSV may be comma- or semicolon-separated (as spreadsheet programs write it
with a decimal comma), UTF-8 (with or without a byte-order mark) or UTF-16.
The results CSV has the input columns in the order of the header, then one
column per output and, beside each, ``<output> error`` with the reason of an
error cell; numbers are written with 10 significant digits.
"""

from __future__ import annotations

import re

import csv
import io
import os
import sys

from cellfuncs.headless.package import BookError, ErrorText

from .files import check_output_path, write_text_atomic

__all__ = ["run", "CaseRunner"]


class CaseRunner:
    """A workbook loaded for fixed inputs and outputs.

    Parameters
    ----------
    book : str
        The workbook.
    inputs : list of str
        Input targets (defined names or ``Sheet!A1``).
    outputs : list of str or None
        Output targets; ``None`` = the defined names starting with ``out_``.
    """

    def __init__(self, book: str, inputs: list, outputs: list | None = None):
        from . import recalculation as rc

        self.book = book
        pkg, data, model, _ = rc.open_model(book)
        self.data, self.model = data, model
        if outputs is None:
            seen = set()
            outputs = []
            for n, local, _ in data.names:
                if local is None and n.lower().startswith("out_") and n.upper() not in seen:
                    seen.add(n.upper())
                    outputs.append(n)
            if not outputs:
                raise BookError(f"{os.path.basename(book)}: no defined names starting with out_; "
                                "list outputs with --outputs")
        self.inputs, self.outputs = list(inputs), list(outputs)
        self.input_cells = rc.resolve_inputs(self.inputs, data, "input column")
        self.output_cells = []
        for t in self.outputs:
            try:
                self.output_cells.append(rc.resolve_target(t, data))
            except BookError as exc:
                raise BookError(f"output {exc}") from None
        self.numeric_inputs = []
        for cell in self.input_cells:
            stored = data.cells.get(cell[0], {}).get((cell[1], cell[2]))
            self.numeric_inputs.append(not (stored is not None and isinstance(stored.value, str)
                                            and not isinstance(stored.value, ErrorText)))
        deps = model.dependents(self.input_cells)  # traced before cells get their cached values
        # a cell the engine cannot compute that depends on the inputs is an error in every case
        late = rc._settle(model, data, lambda key: deps is None or key in deps)
        gaps = dict(model.gaps)
        gaps.update(late)
        #: outputs that cannot be computed: (reason, True when they depend on the inputs)
        self.gaps = {}
        for cell in self.output_cells:
            if cell in gaps:
                self.gaps[cell] = (gaps[cell], deps is None or cell in deps)
        # only the outputs are read: formulas they do not depend on are left out of each case, and
        # then evaluating what is dirty is the same as evaluating the outputs (and quicker)
        self.pruned = model.keep_only(self.output_cells) is not None

    def parse_row(self, row: dict, line: int, case_no: int) -> list:
        """A CSV row -> input values: numbers where the text is one, else text (only for text inputs)."""
        from .recalculation import parse_value

        vals = []
        where = f"case {case_no} (line {line})"
        for target, numeric in zip(self.inputs, self.numeric_inputs):
            text = row.get(target) or ""
            v = parse_value(text, f"{where}, column {target}")
            if isinstance(v, str) and numeric:
                hint = ("; write the decimal point as '.' (e.g. 0.5), not a comma"
                        if re.fullmatch(r"\s*[-+]?\d*,\d+\s*", text) else "")
                raise BookError(f"{where}, column {target}: {text.strip()!r} is not a number "
                                f"(this input holds a number){hint}")
            vals.append(v)
        return vals

    def run_case(self, values: list) -> list:
        """Output values of one case: float, str, bool or ErrorText (with .message)."""
        m = self.model
        for (s, r, c), v in zip(self.input_cells, values):
            m.set_value(s, r, c, v)
        todo = [c for c in self.output_cells if c not in self.gaps]
        if m.data_tables:
            # what-if tables follow the case's inputs: computed again before the outputs
            m.evaluate()
            from .recalculation import _refresh_tables

            _refresh_tables(m)
        if todo:
            if self.pruned:
                m.evaluate()
            else:
                m.evaluate_cells(todo)
        by_cell = m.messages_by_cell()
        out = []
        for cell in self.output_cells:
            if cell in self.gaps:
                reason, depends = self.gaps[cell]
                stored = self.data.cells.get(cell[0], {}).get((cell[1], cell[2]))
                if depends or stored is None or stored.value is None:
                    et = ErrorText("#N/A")
                    et.message = f"not computed: {reason}"
                    out.append(et)
                else:
                    out.append(stored.value)
                continue
            v = m.value(*cell)
            if isinstance(v, ErrorText):
                msg = by_cell.get(cell) or next(iter(by_cell.values()), "")
                v.message = msg.split(" ", 1)[1] if msg.startswith("#") and " " in msg else msg
            out.append(v)
        return out


_WORKER: dict = {}


def _init_worker(book, inputs, outputs):
    _WORKER["runner"] = CaseRunner(book, inputs, outputs)


def _work(values):
    return [(str(v), getattr(v, "message", ""), True) if isinstance(v, ErrorText) else (v, "", False)
            for v in _WORKER["runner"].run_case(values)]


def _unpack(items):
    out = []
    for v, msg, is_err in items:
        if is_err:
            v = ErrorText(v)
            v.message = msg
        out.append(v)
    return out


def _decode(raw: bytes, path: str) -> str:
    if raw.startswith((b"\xff\xfe", b"\xfe\xff")):
        return raw.decode("utf-16")
    try:
        return raw.decode("utf-8-sig")
    except UnicodeDecodeError:
        raise BookError(f"{path}: not UTF-8 or UTF-16 text; save the CSV as UTF-8") from None


def _read_cases(path):
    if not os.path.isfile(path):
        raise BookError(f"{path}: no such file")
    with open(path, "rb") as fh:
        text = _decode(fh.read(), path)
    first = text.split("\n", 1)[0]
    delimiter = ";" if first.count(";") > first.count(",") else ","
    try:
        reader = csv.reader(io.StringIO(text, newline=""), delimiter=delimiter)
        table = [r for r in reader]
    except csv.Error as exc:
        raise BookError(f"{path}: not a readable CSV file ({exc})") from None
    lines = [(i, r) for i, r in enumerate(table, start=1) if any(c.strip() for c in r)]
    if not lines:
        raise BookError(f"{path}: no header row (one column per workbook input)")
    header = [h.strip() for h in lines[0][1]]
    if any(not h for h in header):
        raise BookError(f"{path}: a column has an empty header")
    dupes = sorted({h for h in header if header.count(h) > 1})
    if dupes:
        raise BookError(f"{path}: column {dupes[0]!r} appears more than once")
    rows = []
    for n, (line, r) in enumerate(lines[1:], start=1):
        if len(r) > len(header):
            raise BookError(f"{path}: case {n} (line {line}) has more fields than the header")
        rows.append((line, dict(zip(header, [c for c in r] + [""] * (len(header) - len(r))))))
    return header, rows, delimiter


def _fmt(v):
    if isinstance(v, bool):
        return "TRUE" if v else "FALSE"
    if isinstance(v, float):
        if v == int(v) and abs(v) < 1e15:
            return str(int(v))
        return f"{v:.10g}"
    return "" if v is None else str(v)


def run(ns) -> int:
    """Entry point of ``cellfuncs cases`` (argparse namespace)."""
    from cellfuncs.errors import UsageError

    out = ns.output
    check_output_path(out, ns.book, ns.cases_csv)
    if ns.workers < 1:
        raise UsageError(f"--workers {ns.workers}: must be 1 or more")
    outputs = [o.strip() for o in ns.outputs.split(",") if o.strip()] if ns.outputs else None
    try:
        header, rows, delimiter = _read_cases(ns.cases_csv)
        runner = CaseRunner(ns.book, header, outputs)
        cases = [runner.parse_row(r, line, n) for n, (line, r) in enumerate(rows, start=1)]
    except BookError as exc:
        raise UsageError(str(exc)) from None
    except MemoryError:
        raise UsageError("out of memory while loading the workbook") from None

    progress = None
    if sys.stderr.isatty():
        try:
            from tqdm import tqdm

            progress = tqdm(total=len(cases), file=sys.stderr, unit="case")
        except ImportError:  # pragma: no cover
            progress = None

    try:
        results = _compute(ns, runner, cases, progress)
    except MemoryError:
        raise UsageError("out of memory while computing the cases") from None
    finally:
        if progress:
            progress.close()
    _write_results(out, runner, rows, results, delimiter)
    return 0


def _compute(ns, runner, cases, progress) -> list:
    results = []
    if ns.workers == 1 or len(cases) < 2:
        for vals in cases:
            results.append(runner.run_case(vals))
            if progress:
                progress.update()
    else:
        import multiprocessing as mp

        chunk = max(1, len(cases) // (ns.workers * 4))
        ctx = mp.get_context()
        if ctx.get_start_method() == "fork":
            # the workers start as copies of this process: the loaded workbook and the imported
            # physics come with them instead of being loaded once more per worker
            _WORKER["runner"] = runner
            init, args = None, ()
        else:  # spawn (Windows, macOS): each worker loads the book itself
            init, args = _init_worker, (ns.book, runner.inputs, runner.outputs)
        with ctx.Pool(ns.workers, init, args) as pool:
            for r in pool.imap(_work, cases, chunksize=chunk):
                results.append(_unpack(r))
                if progress:
                    progress.update()
    return results


def _write_results(out, runner, rows, results, delimiter):
    buf = io.StringIO()
    w = csv.writer(buf, lineterminator="\n", delimiter=delimiter)
    cols = list(runner.inputs)
    for name in runner.outputs:
        cols += [name, f"{name} error"]
    w.writerow(cols)
    n_err = 0
    for n, ((line, raw), outs) in enumerate(zip(rows, results), start=1):
        cells = []
        for name, o in zip(runner.outputs, outs):
            if isinstance(o, ErrorText):
                n_err += 1
                why = getattr(o, "message", "") or ""
                print(f"case {n} (line {line}), {name}: {o} {why}".rstrip(), file=sys.stderr)
                cells += [str(o), why]
            else:
                cells += [_fmt(o), ""]
        w.writerow([raw.get(h, "").strip() for h in runner.inputs] + cells)
    write_text_atomic(out, buf.getvalue())
    print(f"{len(results)} cases, {len(runner.outputs)} outputs, {n_err} error cells; wrote {out}",
          file=sys.stderr)
