"""``cellfuncs cases``: run a workbook over the rows of a CSV file (batch what-if).

Each CSV column header names an input of the workbook (a defined name or
``Sheet!A1``), each row is a case.  The outputs are the workbook's defined
names starting with ``out_`` unless ``--outputs`` lists others.  The workbook
is loaded and compiled once (per worker process), not per case.
"""

from __future__ import annotations

import csv
import io
import math
import os
import shutil
import sys
import tempfile

from cellfuncs.xlsx import BookError, ErrorText

__all__ = ["run", "CaseRunner"]


class CaseRunner:
    """A workbook compiled for fixed inputs and outputs.

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
        from cellfuncs import headless

        self.book = book
        model, info = headless.load_model(book)
        shutil.rmtree(info["tmpdir"], ignore_errors=True)
        names, sheets, wb = info["names"], info["sheets"], info["workbook"]
        if outputs is None:
            spelled = {n.upper(): n for n in wb.defined_names}  # names as the workbook writes them
            outputs = sorted((spelled.get(n, n) for n in names if n.lower().startswith("out_")), key=str.lower)
            if not outputs:
                raise BookError(f"{os.path.basename(book)}: no defined names starting with out_; "
                                "list outputs with --outputs")
        self.inputs, self.outputs = list(inputs), list(outputs)
        self.input_cells = [self._where(t, names, sheets, "input column") for t in self.inputs]
        formula_at = {(c[0], c[1]) for c in info["cells"]}
        for t, cell in zip(self.inputs, self.input_cells):
            if cell in formula_at:
                raise BookError(f"input column {t!r}: {cell[0]}!{cell[1]} holds a formula, not an input")
        self.output_cells = [self._where(t, names, sheets, "output") for t in self.outputs]
        self.numeric_inputs = [isinstance(v, (int, float)) and not isinstance(v, bool)
                               for v in (wb[sh][ref].value for sh, ref in self.input_cells)]

        def key(cell):
            return f"'[book.xlsx]{cell[0].upper()}'!{cell[1]}"

        with headless._quiet():
            self.fn = model.compile(inputs=[key(c) for c in self.input_cells],
                                    outputs=[key(c) for c in self.output_cells])

    @staticmethod
    def _where(target, names, sheets, what):
        from cellfuncs import headless

        where = headless.resolve_target(target, names, sheets)
        if where is None:
            raise BookError(f"{what} {target!r}: no such cell or defined name in the workbook")
        return where

    def parse_row(self, row: dict, line: int) -> list:
        """A CSV row -> input values: numbers where the text is one, else text.

        Where the workbook's input cell holds a number now, the case must give a number.
        """
        vals = []
        for target, numeric in zip(self.inputs, self.numeric_inputs):
            text = (row.get(target) or "").strip()
            try:
                v = float(text)
            except ValueError:
                if numeric:
                    raise BookError(f"line {line}, column {target}: {text!r} is not a number "
                                    "(this input holds a number)") from None
                vals.append(text)
                continue
            if not math.isfinite(v):
                raise BookError(f"line {line}, column {target}: {text!r} is not a finite number")
            vals.append(v)
        return vals

    def run_case(self, values: list) -> list:
        """Output values of one case: float, str, bool or ErrorText (with .message)."""
        from cellfuncs import headless

        with headless._quiet():
            res = self.fn(*values)
        if not isinstance(res, (list, tuple)):
            res = [res]
        out = []
        for r in res:
            arr = getattr(r, "value", r)
            if hasattr(arr, "shape") and getattr(arr, "ndim", 0) >= 1:
                arr = arr.flat[0]
            out.append(headless.cell_value(arr))
        return out


_WORKER: dict = {}


def _init_worker(book, inputs, outputs):
    _WORKER["runner"] = CaseRunner(book, inputs, outputs)


def _work(values):
    return _WORKER["runner"].run_case(values)


def _read_cases(path):
    if not os.path.isfile(path):
        raise BookError(f"{path}: no such file")
    try:
        with open(path, newline="", encoding="utf-8-sig") as fh:
            reader = csv.DictReader(fh)
            header = reader.fieldnames
            rows = list(reader)
    except (UnicodeDecodeError, csv.Error) as exc:
        raise BookError(f"{path}: not a readable CSV file ({exc})") from None
    if not header:
        raise BookError(f"{path}: no header row (one column per workbook input)")
    if any(not h or not h.strip() for h in header):
        raise BookError(f"{path}: a column has an empty header")
    header = [h.strip() for h in header]
    dupes = sorted({h for h in header if header.count(h) > 1})
    if dupes:
        raise BookError(f"{path}: column {dupes[0]!r} appears more than once")
    for i, r in enumerate(rows, start=2):
        if None in r:
            raise BookError(f"{path}: line {i} has more fields than the header")
    return header, [{(k or "").strip(): v for k, v in r.items()} for r in rows]


def run(ns) -> int:
    """Entry point of ``cellfuncs cases`` (argparse namespace)."""
    from cellfuncs.cli import check_output_path
    from cellfuncs.errors import UsageError

    out = ns.output
    check_output_path(out, ns.book, ns.cases_csv)
    if ns.workers < 1:
        raise UsageError(f"--workers {ns.workers}: must be 1 or more")
    outputs = [o.strip() for o in ns.outputs.split(",") if o.strip()] if ns.outputs else None
    try:
        header, rows = _read_cases(ns.cases_csv)
        runner = CaseRunner(ns.book, header, outputs)
        cases = [runner.parse_row(r, i + 2) for i, r in enumerate(rows)]
    except BookError as exc:
        raise UsageError(str(exc)) from None

    progress = None
    if sys.stderr.isatty():
        try:
            from tqdm import tqdm

            progress = tqdm(total=len(cases), file=sys.stderr, unit="case")
        except ImportError:  # pragma: no cover
            progress = None

    results = []
    if ns.workers == 1 or len(cases) < 2:
        for vals in cases:
            results.append(runner.run_case(vals))
            if progress:
                progress.update()
    else:
        import multiprocessing as mp

        chunk = max(1, len(cases) // (ns.workers * 8))
        # the platform's default start method (spawn on Windows): each worker loads the book itself
        with mp.get_context().Pool(ns.workers, _init_worker,
                                         (ns.book, runner.inputs, runner.outputs)) as pool:
            for r in pool.imap(_work, cases, chunksize=chunk):
                results.append(r)
                if progress:
                    progress.update()
    if progress:
        progress.close()

    buf = io.StringIO()
    w = csv.writer(buf, lineterminator="\n")
    w.writerow(runner.inputs + runner.outputs)
    n_err = 0
    for i, (raw, vals, outs) in enumerate(zip(rows, cases, results)):
        cells = []
        for name, o in zip(runner.outputs, outs):
            if isinstance(o, ErrorText):
                n_err += 1
                print(f"case {i + 1}, {name}: {o} {getattr(o, 'message', '')}".rstrip(), file=sys.stderr)
                cells.append(str(o))
            else:
                cells.append(repr(o) if isinstance(o, float) else o)
        w.writerow([raw.get(h, "") for h in runner.inputs] + cells)
    folder = os.path.dirname(os.path.abspath(out)) or "."
    from cellfuncs.xlsx import _umask

    fd, tmp = tempfile.mkstemp(prefix=".cellfuncs-", suffix=".csv", dir=folder)
    try:
        with os.fdopen(fd, "w", encoding="utf-8", newline="") as fh:
            fh.write(buf.getvalue())
        os.chmod(tmp, 0o666 & ~_umask())
        os.replace(tmp, out)
    except OSError as exc:
        if os.path.exists(tmp):
            os.unlink(tmp)
        raise UsageError(f"-o {out}: cannot write ({exc.strerror or exc})") from None
    print(f"{len(cases)} cases, {len(runner.outputs)} outputs, {n_err} error cells; wrote {out}",
          file=sys.stderr)
    return 0
