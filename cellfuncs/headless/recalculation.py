"""``cellfuncs recalc``: compute every formula of a workbook, keep what cannot be computed.

* computed cells get their new value as the cached value in the output;
* a cell the engine cannot compute (a form it does not implement, a what-if
  data table, a 3-D reference ...) keeps the cached value it had in the input
  and is listed in :attr:`Recalc.gaps` with its reason — unless an input it
  depends on was changed with ``--set``: then its old value would be stale and
  it becomes an error (listed too);
* the engine works on a private copy; the output is the input package with
  only the cached values of computed cells changed (:mod:`cellfuncs.headless.package`).
"""

from __future__ import annotations

import math
import re
from dataclasses import dataclass, field

from cellfuncs.headless.package import BookError, ErrorText, Package, col_letters

from . import limits
from .book import parse_ref, read_book

__all__ = ["Recalc", "recalc", "write_with_cached_values", "resolve_target", "parse_value",
           "key_text", "name_warnings", "catalogue_names", "open_model"]


@dataclass
class Recalc:
    """Result of a recalculation.

    values : {(sheet, "A1"): value} for every formula cell (array ranges cell by cell);
        a value is a float, str, bool, or an :class:`~cellfuncs.headless.package.ErrorText`.
        Cells not computed hold the value the input file held.
    messages : {(sheet, "A1"): one-line message} for the cells that ended in an error.
    gaps : {(sheet, "A1"): reason} for the cells the engine could not compute.
    kept : the cells of ``gaps`` whose cached value was kept (not rewritten).
    warnings : lines for stderr about the workbook (names that hide a function ...).
    """

    values: dict = field(default_factory=dict)
    messages: dict = field(default_factory=dict)
    gaps: dict = field(default_factory=dict)
    kept: set = field(default_factory=set)
    warnings: list = field(default_factory=list)

    def errors(self) -> list:
        return [k for k, v in self.values.items() if isinstance(v, ErrorText)]


_CATALOGUE: dict = {}


def catalogue_names() -> frozenset:
    if "names" not in _CATALOGUE:
        from cellfuncs import catalogue

        _CATALOGUE["entries"] = list(catalogue.entries())
        _CATALOGUE["names"] = frozenset(e.name.upper() for e in _CATALOGUE["entries"])
    return _CATALOGUE["names"]


def _entries():
    catalogue_names()
    return _CATALOGUE["entries"]


def key_text(sheet: str, ref: str) -> str:
    """``Sheet!A1``, quoting sheet names with spaces or punctuation."""
    if re.fullmatch(r"[A-Za-z_][A-Za-z0-9_.]*", sheet):
        return f"{sheet}!{ref}"
    return "'" + sheet.replace("'", "''") + f"'!{ref}"


def parse_value(text: str, what: str):
    """A value typed on the command line or in a CSV cell: a finite number, else text.

    Raises BookError (one line) for an empty value or a number that is not finite.
    """
    t = text.strip()
    if t == "":
        raise BookError(f"{what}: empty value (give a number, or text for a text input)")
    try:
        v = float(t)
    except ValueError:
        return t
    if not math.isfinite(v):
        raise BookError(f"{what}: {t!r} is not a finite number")
    return v


def _name_target(text: str, book):
    """A defined name's text -> (sheet, row, col), or a one-line reason it is not one cell."""
    t = text.strip()
    if t.startswith("="):
        t = t[1:]
    if "#REF!" in t or not t:
        return "points to nothing (#REF!)"
    sheet, bang, ref = t.rpartition("!")
    if not bang:
        if re.fullmatch(r"-?[\d.]+(?:[eE][-+]?\d+)?|\".*\"|TRUE|FALSE", t, re.I):
            return f"is the constant {t}, not a cell"
        return f"is the formula {t}, not a cell"
    sheet = sheet[1:-1].replace("''", "'") if sheet.startswith("'") else sheet
    found = book.sheet(sheet)
    if found is None:
        return f"points to sheet {sheet!r}, which the workbook does not have"
    ref = ref.replace("$", "")
    if ":" in ref:
        return f"names the range {found}!{ref}, not one cell"
    pos = parse_ref(ref)
    if pos is None:
        return f"is {t}, not a cell"
    return (found, pos[0], pos[1])


def resolve_target(target: str, book):
    """``Sheet!A1`` or a workbook-level defined name -> (sheet, row, col).

    Raises BookError with one line when the target is not one cell of the workbook.
    """
    t = target.strip()
    if "!" in t:
        sheet, _, ref = t.rpartition("!")
        sheet = sheet[1:-1].replace("''", "'") if sheet.startswith("'") and sheet.endswith("'") else sheet
        found = book.sheet(sheet)
        if found is None:
            raise BookError(f"{target}: the workbook has no sheet {sheet!r}")
        from cellfuncs.headless.package import split_ref

        r, c = split_ref(ref)  # a reference outside a worksheet is a BookError with its reason
        return found, r, c
    hits = [txt for name, local, txt in book.names if name.upper() == t.upper() and local is None]
    if not hits:
        hits = [txt for name, local, txt in book.names if name.upper() == t.upper()]
    if not hits:
        raise BookError(f"{target}: no such cell or defined name in the workbook")
    where = _name_target(hits[0], book)
    if isinstance(where, str):
        raise BookError(f"{target}: the defined name {where}")
    return where


def resolve_inputs(targets: list, book, what: str) -> list:
    """Targets -> cells; a formula cell or the same cell twice is refused (one line)."""
    cells, seen = [], {}
    for t in targets:
        try:
            cell = resolve_target(t, book)
        except BookError as exc:
            raise BookError(f"{what} {exc}") from None
        sheet, r, c = cell
        stored = book.cells.get(sheet, {}).get((r, c))
        ref = key_text(sheet, f"{col_letters(c)}{r}")
        if stored is not None and (stored.formula is not None or stored.ftype is not None):
            raise BookError(f"{what} {t}: {ref} holds a formula, not an input")
        if cell in seen:
            raise BookError(f"{what} {t}: {ref} is already set by {seen[cell]}; set each cell once")
        seen[cell] = t
        cells.append(cell)
    return cells


def check_input_value(value, cell, book, what: str):
    """Text only into a cell that holds text now (a number cell or a blank needs a number)."""
    if isinstance(value, str):
        stored = book.cells.get(cell[0], {}).get((cell[1], cell[2]))
        if stored is None or not isinstance(stored.value, str) or isinstance(stored.value, ErrorText):
            held = "is blank" if stored is None or stored.value is None else "holds a number"
            raise BookError(f"{what}: {value!r} is not a number (this input {held})")


def name_warnings(book) -> list:
    """Defined names spelled like a catalogue function (issue: a name hides the function in some readers)."""
    names = catalogue_names()
    return [f"warning: the defined name {n} is also the name of a cell function; "
            "rename it so no reader confuses the two" for n, _, _ in book.names if n.upper() in names]


def open_model(path: str, sets: dict | None = None):
    """Read ``path``, check the budgets, load the engine copy.

    ``sets`` maps targets (``Sheet!A1`` or names) to values typed as text.
    Returns (Package, BookData, Model, {(sheet, r, c): value} of the sets).
    """
    from .engine import Model

    pkg = Package(path)
    book = read_book(pkg.parts)
    limits.check_present(book)
    resolved = {}
    if sets:
        cells = resolve_inputs(list(sets), book, "--set")
        for (target, text), cell in zip(sets.items(), cells):
            value = parse_value(text, f"--set {target}") if isinstance(text, str) else text
            check_input_value(value, cell, book, f"--set {target}")
            resolved[cell] = value
    model = Model(pkg.parts, book, catalogue_names(), resolved)
    limits.check_referenced(model)
    model.load(_entries())
    return pkg, book, model, resolved


def _refresh_tables(model):
    """Compute the what-if data tables and give the engine their values."""
    tables = model.data_table_values()
    for (s, r, c), v in tables.items():
        model.gaps.pop((s, r, c), None)
        if isinstance(v, ErrorText):
            model.set_error(s, r, c, str(v))
        else:
            model.set_value(s, r, c, v)
        model.table_values[(s, r, c)] = v
    return bool(tables)


#: rounds of "keep the cached values of the cells not computed, evaluate again"
MAX_SETTLE_ROUNDS = 8
#: above this many such cells in one round they all keep their cached values (no tracing)
MAX_TRACED_GAPS = 1000


def _gap_roots(model, fresh: dict) -> list:
    """The cells of ``fresh`` that use no other cell of ``fresh`` (where a gap starts).

    All of ``fresh`` when the engine cannot say which cells use which (INDIRECT or OFFSET in
    the workbook, a trace over its budget), when there are more than :data:`MAX_TRACED_GAPS`,
    or when they all use each other (a cycle).
    """
    if len(fresh) < 2 or len(fresh) > MAX_TRACED_GAPS:
        return list(fresh)
    inner = set()
    for key in sorted(fresh):
        if key in inner:
            continue  # its dependents were traced with the cell it depends on
        deps = model.dependents([key])
        if deps is None:
            return list(fresh)
        inner |= {k for k in deps if k != key and k in fresh}
    return [k for k in fresh if k not in inner] or list(fresh)


def _settle(model, book, stale=lambda key: False):
    """Evaluate; a cell the engine cannot compute gets its cached value, and the rest is evaluated again.

    ``stale(key)`` says whether such a cell depends on changed inputs: then it gets an error
    instead, so nothing computed from it uses a value the file held for other inputs.
    """
    from .engine import LIMITATION_KINDS

    for (s, r, c) in list(model.gaps):
        if stale((s, r, c)):
            model.set_error(s, r, c, "#N/A")
    model.evaluate()
    if model.data_tables and _refresh_tables(model):
        model.evaluate()
    late = {}
    for _ in range(MAX_SETTLE_ROUNDS):
        fresh = {}
        for key in model.formula_cells:
            if key in late or key in model.gaps:
                continue
            v = model.value(*key)
            kind = getattr(v, "kind", None)
            if isinstance(v, ErrorText) and kind in LIMITATION_KINDS:
                stored = book.cells[key[0]].get((key[1], key[2]))
                cached = stored.value if stored is not None else None
                if cached is not None and str(cached) == str(v):
                    continue  # the file held the same error: a result, not a gap
                dropped = model.uses_dropped_name(key) if kind == "Name" else None
                if dropped:
                    fresh[key] = (f"uses the defined name {dropped}, whose formula the engine cannot load",
                                  cached)
                    continue
                if kind == "Name" and not (cached is not None and not isinstance(cached, ErrorText)):
                    continue  # #NAME? with nothing better to keep: an error as Excel shows it
                fresh[key] = (LIMITATION_KINDS[kind], cached)
        if not fresh:
            break
        # only the cells where the gap starts keep their cached value; a cell that merely uses
        # one of them is computed from that kept value in the next round
        fresh = {k: fresh[k] for k in _gap_roots(model, fresh)}
        late.update(fresh)
        for (s, r, c), (_, cached) in fresh.items():
            if stale((s, r, c)) or isinstance(cached, ErrorText):
                model.set_error(s, r, c, "#N/A" if stale((s, r, c)) else str(cached))
            elif cached is not None:
                model.set_value(s, r, c, cached)
        model.evaluate()
    return {k: reason for k, (reason, _) in late.items()}


def recalc(path: str, sets: dict | None = None):
    """Compute every formula of a workbook.

    Returns
    -------
    (Recalc, Package)
        The values and the package ready to receive them as cached values.

    Raises
    ------
    BookError
        The workbook cannot be used (one line).
    """
    with limits.guard():
        pkg, book, model, resolved = open_model(path, sets)
        # what depends on the changed inputs, traced before cells are replaced by their cached values
        deps = model.dependents(list(resolved)) if resolved else set()
        late = _settle(model, book, lambda key: bool(resolved) and (deps is None or key in deps))
        gaps = dict(model.gaps)
        gaps.update(late)
        stale = set()
        if resolved and gaps:
            stale = set(gaps) if deps is None else {k for k in gaps if k in deps}
        res = Recalc(warnings=name_warnings(book))
        by_cell = model.messages_by_cell()
        for key in list(model.formula_cells) + [k for k in model.gaps if k not in model.formula_cells]:
            sheet, r, c = key
            ref = f"{col_letters(c)}{r}"
            if key in gaps:
                stored = book.cells[sheet].get((r, c))
                if key in stale or stored is None or stored.value is None:
                    v = ErrorText("#N/A")
                    why = "its inputs changed" if key in stale else "the file holds no value for it"
                    v.message = f"not computed: {gaps[key]}; {why}"
                    res.values[(sheet, ref)] = v
                    res.messages[(sheet, ref)] = f"#N/A {v.message}"
                else:
                    res.values[(sheet, ref)] = stored.value
                    res.kept.add((sheet, ref))
                res.gaps[(sheet, ref)] = gaps[key]
                continue
            v = model.value(sheet, r, c)
            res.values[(sheet, ref)] = v
            if isinstance(v, ErrorText):
                msg = by_cell.get(key)
                if msg is None:
                    msg = (f"{v} (unknown function or name)" if str(v) == "#NAME?"
                           else f"{v} (from the formula itself or a cell it uses)")
                v.message = msg.split(" ", 1)[1] if msg.startswith("#") and " " in msg else msg
                res.messages[(sheet, ref)] = msg
        if resolved:
            pkg.set_values({(s, f"{col_letters(c)}{r}"): v for (s, r, c), v in resolved.items()})
    return res, pkg


def write_with_cached_values(res: Recalc, pkg: Package, out_path: str, compress: bool = True) -> None:
    """Store the computed values in the package and write it atomically (kept cells untouched)."""
    pkg.set_cached({k: v for k, v in res.values.items() if k not in res.kept})
    pkg.keep_cached_on_open()
    pkg.save(out_path, compress=compress)

