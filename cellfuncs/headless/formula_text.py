"""Formula text as the engine should see it, and what a formula refers to.

A small scanner (strings, quoted sheet names, brackets and parentheses are
respected) that, for the engine's private copy of a workbook only:

* removes the prefixes Excel writes before add-in functions it did not know
  (``_xludf.``, ``'[1]'!``, ``cellfuncs.xlam!``) from calls to catalogue functions;
* fills an omitted argument of a catalogue function (``F(1,,3)``, ``F(1,)``) with
  the text :data:`OMITTED` (a private-use character), which the engine callback
  turns into ``None`` = "missing", as an omitted argument reaches a function in
  Excel — an engine would otherwise hand the function a 0, and ``""`` is a value
  of its own (empty text: an error for a number argument);
* puts a tag before the first argument of every catalogue call so a function's
  one-line message can be tied to the cell that called it;
* turns references into other workbooks into ``#REF!`` (no link is followed);
* lists the ranges a formula refers to (to count the cells it makes the engine
  read) and the forms the engine does not compute (3-D references).

Only the private copy is changed; the output keeps the workbook's own formulas.
"""

from __future__ import annotations

import re
from dataclasses import dataclass, field

#: prefixes a spreadsheet program writes before an add-in function's name: Excel's for a
#: function it did not know when saving, and the name LibreOffice Calc writes for the
#: functions of our Calc extension (cellfuncs.calc)
_ADDIN_PREFIXES = ("_XLUDF.", "ORG.CELLFUNCS.CALC.CELLFUNCTIONS.")

__all__ = ["TAG", "OMITTED", "Rewritten", "rewrite", "split_sheet_ref"]

#: first character of the tag argument (a private-use character, never typed in a workbook)
TAG = "\ue000"
#: the text standing for an omitted argument of a catalogue call (another private-use character)
OMITTED = "\ue001"
_OMITTED_TEXT = '"' + OMITTED + '"'

_NAME = re.compile(r"[A-Za-z_\\][A-Za-z0-9_.\\]*")
_CELL = r"\$?[A-Za-z]{1,3}\$?\d+"
_RANGE = re.compile(rf"({_CELL}):({_CELL})|(\$?[A-Za-z]{{1,3}}):(\$?[A-Za-z]{{1,3}})(?![\w(])|(\$?\d+):(\$?\d+)")
_COLROW = re.compile(r"\$?([A-Za-z]{1,3})\$?(\d+)")
_SPECIAL = re.compile(r"[\"'\[!]")
_CALL = re.compile(r"([A-Za-z_\\][A-Za-z0-9_.\\]*)\s*\(")


@dataclass
class Rewritten:
    """A formula for the engine and what it refers to.

    text : the formula for the engine (no leading ``=``).
    ranges : [(sheet or None, r1, c1, r2, c2)] with 0 for an open end (whole column/row).
    three_d : a 3-D reference (``Sheet1:Sheet3!A1``) was seen.
    external : a reference to another workbook was turned into ``#REF!``.
    functions : names of the functions called (upper case, prefixes removed).
    """

    text: str
    ranges: list = field(default_factory=list)
    three_d: bool = False
    external: bool = False
    functions: set = field(default_factory=set)


def _col(letters: str) -> int:
    n = 0
    for ch in letters.upper():
        n = n * 26 + ord(ch) - 64
    return n


def _skip_quoted(s: str, i: int, q: str) -> int:
    """Index after the closing quote of a quoted run starting at ``s[i] == q`` (doubled quotes escape)."""
    j = i + 1
    while j < len(s):
        if s[j] == q:
            if j + 1 < len(s) and s[j + 1] == q:
                j += 2
                continue
            return j + 1
        j += 1
    return len(s)


def _skip_brackets(s: str, i: int) -> int:
    depth = 0
    j = i
    while j < len(s):
        if s[j] == "[":
            depth += 1
        elif s[j] == "]":
            depth -= 1
            if depth == 0:
                return j + 1
        elif s[j] == "'" and depth > 0 and j + 1 < len(s) and s[j + 1] in "[]#'":
            j += 1  # an escaped character inside a structured reference
        j += 1
    return len(s)


def split_sheet_ref(prefix: str):
    """``'Site''s data'`` or ``Inputs`` -> the sheet name; None when the prefix names another workbook."""
    p = prefix[:-1] if prefix.endswith("!") else prefix
    if p.startswith("'") and p.endswith("'"):
        p = p[1:-1].replace("''", "'")
    if "[" in p or "]" in p:
        return None
    return p


def _ranges_in(piece: str, sheet, out: list):
    for m in _RANGE.finditer(piece):
        if m.group(1):
            a, b = _COLROW.fullmatch(m.group(1)), _COLROW.fullmatch(m.group(2))
            r1, r2 = int(a.group(2)), int(b.group(2))
            c1, c2 = _col(a.group(1)), _col(b.group(1))
            out.append((sheet, min(r1, r2), min(c1, c2), max(r1, r2), max(c1, c2)))
        elif m.group(3):
            c1, c2 = _col(m.group(3).lstrip("$")), _col(m.group(4).lstrip("$"))
            out.append((sheet, 1, min(c1, c2), 0, max(c1, c2)))
        else:
            r1, r2 = int(m.group(5).lstrip("$")), int(m.group(6).lstrip("$"))
            out.append((sheet, min(r1, r2), 1, max(r1, r2), 0))


def _ranges_3d(expanded, ref, first, last, sheets, out):
    upper = [x.upper() for x in sheets]
    i, j = sorted((upper.index(first.upper()), upper.index(last.upper())))
    for sh in sheets[i:j + 1]:
        if ":" in ref:
            _ranges_in(ref, sh, out)


def _quote(sheet: str) -> str:
    if re.fullmatch(r"[A-Za-z_][A-Za-z0-9_.]*", sheet) and not _COLROW.fullmatch(sheet):
        return sheet
    return "'" + sheet.replace("'", "''") + "'"


def _expand_3d(first: str, last: str, ref: str, sheets):
    """``Sheet1:Sheet3!A1`` -> ``Sheet1!A1,Sheet2!A1,Sheet3!A1`` (the sheets between, in workbook order).

    Excel allows a 3-D reference only in functions that take a list of values (SUM, AVERAGE,
    COUNT, MAX, MIN, PRODUCT, STDEV, VAR and their variants), where this list means the same.
    None when a sheet is unknown.
    """
    if not sheets:
        return None
    upper = [x.upper() for x in sheets]
    try:
        i, j = upper.index(first.upper()), upper.index(last.upper())
    except ValueError:
        return None
    i, j = min(i, j), max(i, j)
    return ",".join(f"{_quote(sh)}!{ref}" for sh in sheets[i:j + 1])


_REF_AFTER = re.compile(r"(\$?[A-Za-z]{1,3}\$?\d+(?::\$?[A-Za-z]{1,3}\$?\d+)?|"
                        r"\$?[A-Za-z]{1,3}:\$?[A-Za-z]{1,3}|\$?\d+:\$?\d+)")


def rewrite(text: str, catalogue_names: frozenset, tag: str | None = None, sheets=None) -> Rewritten:
    """Rewrite one formula (with or without the leading ``=``) for the engine.

    Parameters
    ----------
    text : str
        The formula as stored in the workbook.
    catalogue_names : frozenset of str
        Upper-case names of the catalogue functions.
    tag : str or None
        Text of the tag argument put before the first argument of each catalogue call
        (``None``: no tag).
    sheets : list of str or None
        The workbook's sheets in order, to expand 3-D references (``None``: they are kept
        and flagged in :attr:`Rewritten.three_d`).
    """
    s = text[1:] if text.startswith("=") else text
    if not _SPECIAL.search(s):
        calls = {m.group(1).upper() for m in _CALL.finditer(s)}
        if not (calls & catalogue_names) and not any(c.startswith(_ADDIN_PREFIXES) for c in calls):
            # the common case: no quotes, brackets, sheet prefixes or catalogue calls
            res = Rewritten(s, functions={c[7:] if c.startswith("_XLFN.") else c for c in calls})
            for m in _RANGE.finditer(s):
                if m.start() == 0 or not (s[m.start() - 1].isalnum() or s[m.start() - 1] in "._$"):
                    _ranges_in(m.group(0), None, res.ranges)
            return res
    out = []
    res = Rewritten("")
    stack = []  # one entry per open parenthesis: True when it opens a catalogue call
    i, n = 0, len(s)
    expect_arg = False  # just after "(" or "," of a catalogue call
    while i < n:
        ch = s[i]
        if expect_arg:
            j = i
            while j < n and s[j] in " \t\r\n":
                j += 1
            if j < n and s[j] in ",)":
                out.append(_OMITTED_TEXT)
            expect_arg = False
        if ch == '"':
            j = _skip_quoted(s, i, '"')
            out.append(s[i:j])
            i = j
            continue
        if ch == "'" or ch == "[":
            # a quoted sheet name or an external/structured reference, possibly followed by "!"
            j = _skip_quoted(s, i, "'") if ch == "'" else _skip_brackets(s, i)
            k = j
            while k < n and (s[k].isalnum() or s[k] in "_."):
                k += 1  # [1]Sheet1 or [book.xlsx]Sheet1
            if k < n and s[k] == "!":
                prefix = s[i:k + 1]
                sheet = split_sheet_ref(prefix)
                m = re.match(r"(\$?[A-Za-z]{1,3}\$?\d+(?::\$?[A-Za-z]{1,3}\$?\d+)?|\$?[A-Za-z]{1,3}:\$?[A-Za-z]{1,3}|"
                             r"\$?\d+:\$?\d+)", s[k + 1:])
                fm = _NAME.match(s, k + 1)
                if fm and fm.end() < n and s[fm.end()] == "(" and fm.group(0).upper() in catalogue_names:
                    i = k + 1  # an add-in prefix before one of our functions: dropped
                    continue
                if sheet is None or (ch == "'" and "[" in prefix):
                    res.external = True
                    out.append("#REF!")
                    i = k + 1 + (m.end() if m else 0)
                    continue
                if ":" in sheet and m:
                    first, _, last = sheet.partition(":")
                    expanded = _expand_3d(first, last, m.group(0), sheets)
                    if expanded is None:
                        res.three_d = True
                    else:
                        _ranges_3d(expanded, m.group(0), first, last, sheets, res.ranges)
                        out.append(expanded)
                        i = k + 1 + m.end()
                        continue
                elif ":" in sheet:
                    res.three_d = True
                if m:
                    _ranges_in(m.group(0), sheet, res.ranges)
                out.append(s[i:k + 1 + (m.end() if m else 0)])
                i = k + 1 + (m.end() if m else 0)
                continue
            out.append(s[i:j])
            i = j
            continue
        if ch.isalpha() or ch in "_\\$":
            m = _NAME.match(s, i) if ch != "$" else None
            if m:
                word = m.group(0)
                end = m.end()
                # a sheet prefix without quotes: Inputs!B3, Sheet1:Sheet3!A1, book.xlam!FUNC(
                if end < n and s[end] in "!:" and not _COLROW.fullmatch(word):
                    k = end
                    if s[k] == ":":
                        m2 = _NAME.match(s, k + 1)
                        if m2 and m2.end() < n and s[m2.end()] == "!":
                            rm = _REF_AFTER.match(s, m2.end() + 1)
                            expanded = _expand_3d(word, m2.group(0), rm.group(0), sheets) if rm else None
                            if expanded is None:
                                res.three_d = True
                                out.append(s[i:m2.end() + 1])
                                i = m2.end() + 1
                                continue
                            _ranges_3d(expanded, rm.group(0), word, m2.group(0), sheets, res.ranges)
                            out.append(expanded)
                            i = rm.end()
                            continue
                    if s[k] == "!":
                        fm = _NAME.match(s, k + 1)
                        if (fm and fm.end() < n and s[fm.end()] == "(" and fm.group(0).upper() in catalogue_names
                                and word.lower().endswith((".xla", ".xlam", ".xlsm", ".xlsx"))):
                            i = k + 1
                            continue
                        rm = re.match(r"(\$?[A-Za-z]{1,3}\$?\d+(?::\$?[A-Za-z]{1,3}\$?\d+)?|"
                                      r"\$?[A-Za-z]{1,3}:\$?[A-Za-z]{1,3}|\$?\d+:\$?\d+)", s[k + 1:])
                        if rm:
                            _ranges_in(rm.group(0), word, res.ranges)
                            out.append(s[i:k + 1 + rm.end()])
                            i = k + 1 + rm.end()
                            continue
                        out.append(s[i:k + 1])
                        i = k + 1
                        continue
                if end < n and s[end] == "(":
                    name = word.upper()
                    for prefix in _ADDIN_PREFIXES:
                        if name.startswith(prefix):
                            name = name[len(prefix):]
                    if name.startswith("_XLFN."):
                        name = name[len("_XLFN."):]
                    res.functions.add(name)
                    ours = name in catalogue_names
                    out.append((name if ours else word) + "(")
                    stack.append(ours)
                    i = end + 1
                    if ours:
                        j = i
                        while j < n and s[j] in " \t\r\n":
                            j += 1
                        if tag is not None:
                            out.append('"' + tag + '"')
                            if j < n and s[j] != ")":
                                out.append(",")
                                expect_arg = True
                        else:
                            expect_arg = j < n and s[j] != ")"
                    continue
                if end < n and s[end] == "[":
                    # a structured reference Table[Column]: kept as written
                    j = _skip_brackets(s, end)
                    out.append(s[i:j])
                    i = j
                    continue
                piece_m = _RANGE.match(s, i)
                if piece_m and piece_m.end() < n and s[piece_m.end()] == "!" and piece_m.group(1):
                    # Sheet1:Sheet3!A1 with sheet names that look like cells (P1:P3!A1)
                    rm = _REF_AFTER.match(s, piece_m.end() + 1)
                    first, last = piece_m.group(1), piece_m.group(2)
                    expanded = _expand_3d(first, last, rm.group(0), sheets) if rm else None
                    if expanded is None:
                        res.three_d = True
                        out.append(piece_m.group(0))
                        i = piece_m.end()
                        continue
                    _ranges_3d(expanded, rm.group(0), first, last, sheets, res.ranges)
                    out.append(expanded)
                    i = rm.end()
                    continue
                if piece_m:
                    _ranges_in(piece_m.group(0), None, res.ranges)
                    out.append(piece_m.group(0))
                    i = piece_m.end()
                    continue
                out.append(word)
                i = end
                continue
        if ch == "$" or ch.isdigit():
            piece_m = _RANGE.match(s, i)
            if piece_m and (i == 0 or not (s[i - 1].isalnum() or s[i - 1] in "._")):
                _ranges_in(piece_m.group(0), None, res.ranges)
                out.append(piece_m.group(0))
                i = piece_m.end()
                continue
        if ch == "(":
            stack.append(False)
        elif ch == ")":
            if stack:
                stack.pop()
        elif ch == "," and stack and stack[-1]:
            out.append(",")
            i += 1
            expect_arg = True
            continue
        out.append(ch)
        i += 1
    if expect_arg:
        out.append(_OMITTED_TEXT)
    res.text = "".join(out)
    return res
