"""Moving a formula's relative references, for writing shared formulas out in full.

A shared formula (``<f t="shared" si="0">``) is stored once, in its first cell, and the other cells
of the group name it by ``si``; each of them means the same formula with its relative references
moved by the cell's offset from the first cell, its absolute (``$``) references kept.  Writing each
cell's own formula text lets readers that re-parse shared formulas on load keep the cached values.

The scanner walks the formula once: string literals, quoted sheet names, bracketed parts
(structured references, external-book indexes), error literals and array constants are copied
unchanged; ``A1``, ``$A1``, ``A$1``, whole columns ``A:C`` and whole rows ``3:5`` are moved;
function names, defined names, sheet names and 3-D sheet ranges are left alone.  A reference moved
outside the worksheet becomes ``#REF!``.

References
----------
ECMA-376 Part 1, 18.3.1.40 (f, shared formulas: ``t="shared"``, ``si``, ``ref``) and 18.17 (formula
grammar: A1 references, ``$`` absolute markers, column and row ranges).
"""

from __future__ import annotations

__all__ = ["shift_formula"]

MAX_ROW, MAX_COL = 1048576, 16384
_IDENT_START = set("ABCDEFGHIJKLMNOPQRSTUVWXYZabcdefghijklmnopqrstuvwxyz_\\")
_IDENT = _IDENT_START | set("0123456789.?")
_LETTERS = set("ABCDEFGHIJKLMNOPQRSTUVWXYZabcdefghijklmnopqrstuvwxyz")
_DIGITS = set("0123456789")


def col_index(letters: str) -> int:
    """Column number of column letters ("A" -> 1, "XFD" -> 16384)."""
    n = 0
    for ch in letters.upper():
        n = n * 26 + (ord(ch) - 64)
    return n


def col_letters(n: int) -> str:
    """Column letters of a column number (1 -> "A")."""
    s = ""
    while n:
        n, r = divmod(n - 1, 26)
        s = chr(65 + r) + s
    return s


_col_num, _col_text = col_index, col_letters


def _read_col(s: str, i: int):
    """``$AB`` at i -> (absolute, letters, end) or None."""
    j = i
    absolute = j < len(s) and s[j] == "$"
    if absolute:
        j += 1
    k = j
    while k < len(s) and s[k] in _LETTERS and k - j < 3:
        k += 1
    if k == j:
        return None
    return absolute, s[j:k], k


def _read_row(s: str, i: int):
    j = i
    absolute = j < len(s) and s[j] == "$"
    if absolute:
        j += 1
    k = j
    while k < len(s) and s[k] in _DIGITS:
        k += 1
    if k == j or k - j > 7:
        return None
    return absolute, s[j:k], k


def _ends_token(s: str, k: int) -> bool:
    """A reference token ends at k: not followed by a name character, "(" or "!"."""
    return k >= len(s) or (s[k] not in _IDENT and s[k] not in "($!")


def _cell_at(s: str, i: int):
    col = _read_col(s, i)
    if col is None:
        return None
    row = _read_row(s, col[2])
    if row is None or not _ends_token(s, row[2]):
        return None
    c, r = _col_num(col[1]), int(row[1])
    if not (1 <= c <= MAX_COL and 1 <= r <= MAX_ROW):
        return None
    return col[0], c, row[0], r, row[2]


def _skip_ident(s: str, i: int) -> int:
    k = i
    while k < len(s) and (s[k] in _IDENT or s[k] == "$"):
        k += 1
    return k


def _quoted(s: str, i: int, q: str) -> int:
    """End of a quoted run starting at i (doubled quotes escape)."""
    k = i + 1
    while k < len(s):
        if s[k] == q:
            if k + 1 < len(s) and s[k + 1] == q:
                k += 2
                continue
            return k + 1
        k += 1
    return len(s)


def _bracket(s: str, i: int) -> int:
    depth, k = 0, i
    while k < len(s):
        ch = s[k]
        if ch == "'" and depth:  # escape character inside structured references
            k += 2
            continue
        if ch == "[":
            depth += 1
        elif ch == "]":
            depth -= 1
            if depth == 0:
                return k + 1
        k += 1
    return len(s)


def shift_formula(text: str, d_row: int, d_col: int) -> str:
    """The formula ``text`` with its relative references moved by (d_row, d_col).

    Parameters
    ----------
    text : str
        Formula text as stored in the file (no leading ``=``).
    d_row, d_col : int
        Offset of the target cell from the cell the formula was written for [-].

    Returns
    -------
    str
        The moved formula; a reference that leaves the worksheet becomes ``#REF!``.
    """
    if d_row == 0 and d_col == 0:
        return text
    out = []
    i, n = 0, len(text)
    prev_sig = ""  # last non-space character copied, to tell a number from a row range
    while i < n:
        ch = text[i]
        if ch == '"':
            k = _quoted(text, i, '"')
        elif ch == "'":
            k = _quoted(text, i, "'")
        elif ch == "[":
            k = _bracket(text, i)
        elif ch == "{":
            k = i + 1
            while k < n and text[k] != "}":
                k = _quoted(text, k, '"') if text[k] == '"' else k + 1
            k = min(k + 1, n)
        elif ch == "#":
            k = i + 1
            while k < n and (text[k] in _IDENT or text[k] in "/!"):
                k += 1
                if text[k - 1] in "!?":
                    break
        elif ch == "$" or ch in _LETTERS:
            if ch == "$" and i + 1 < n and text[i + 1] in _DIGITS:
                got = _row_range_at(text, i, d_row)
            else:
                got = _shift_ref_at(text, i, d_row, d_col)
            if got is not None:
                piece, k = got
                out.append(piece)
                prev_sig = piece[-1]
                i = k
                continue
            k = _skip_ident(text, i)
            if k == i:
                k = i + 1
        elif ch in _DIGITS or ch == ".":
            got = _row_range_at(text, i, d_row) if prev_sig not in _IDENT else None
            if got is not None:
                piece, k = got
                out.append(piece)
                prev_sig = piece[-1]
                i = k
                continue
            k = i
            while k < n and (text[k] in _DIGITS or text[k] == "."):
                k += 1
            if k < n and text[k] in "eE" and k + 1 < n and (text[k + 1] in _DIGITS or text[k + 1] in "+-"):
                k += 2
                while k < n and text[k] in _DIGITS:
                    k += 1
        elif ch in _IDENT_START:
            k = _skip_ident(text, i)
        else:
            k = i + 1
        piece = text[i:k]
        out.append(piece)
        if piece.strip():
            prev_sig = piece.strip()[-1]
        i = k
    return "".join(out)


def _move(absolute: bool, value: int, delta: int, limit: int):
    if absolute:
        return value
    v = value + delta
    return v if 1 <= v <= limit else None


def _shift_ref_at(s: str, i: int, d_row: int, d_col: int):
    """A cell reference, cell range or column range starting at i, moved; None if there is none."""
    # a 3-D sheet range (S1:S3!A1) or a sheet name before "!" is not a reference
    k = _skip_ident(s, i)
    if k < len(s) and s[k] == "!":
        return None
    if k < len(s) and s[k] == ":":
        k2 = _skip_ident(s, k + 1)
        if k2 < len(s) and s[k2] == "!":
            return s[i:k2], k2
    cell = _cell_at(s, i)
    if cell is not None:
        ca, c, ra, r, end = cell
        nc, nr = _move(ca, c, d_col, MAX_COL), _move(ra, r, d_row, MAX_ROW)
        if nc is None or nr is None:
            return "#REF!", end
        return f"{'$' if ca else ''}{_col_text(nc)}{'$' if ra else ''}{nr}", end
    col = _read_col(s, i)
    if col is not None and col[2] < len(s) and s[col[2]] == ":":
        col2 = _read_col(s, col[2] + 1)
        if col2 is not None and _ends_token(s, col2[2]):
            c1, c2 = _col_num(col[1]), _col_num(col2[1])
            if c1 <= MAX_COL and c2 <= MAX_COL:
                n1, n2 = _move(col[0], c1, d_col, MAX_COL), _move(col2[0], c2, d_col, MAX_COL)
                if n1 is None or n2 is None:
                    return "#REF!", col2[2]
                return (f"{'$' if col[0] else ''}{_col_text(n1)}:{'$' if col2[0] else ''}{_col_text(n2)}",
                        col2[2])
    return None


def _row_range_at(s: str, i: int, d_row: int):
    a = _read_row(s, i)
    if a is None or a[2] >= len(s) or s[a[2]] != ":":
        return None
    b = _read_row(s, a[2] + 1)
    if b is None or not _ends_token(s, b[2]) or (b[2] < len(s) and s[b[2]] == "."):
        return None
    r1, r2 = int(a[1]), int(b[1])
    if not (1 <= r1 <= MAX_ROW and 1 <= r2 <= MAX_ROW):
        return None
    n1, n2 = _move(a[0], r1, d_row, MAX_ROW), _move(b[0], r2, d_row, MAX_ROW)
    if n1 is None or n2 is None:
        return "#REF!", b[2]
    return f"{'$' if a[0] else ''}{n1}:{'$' if b[0] else ''}{n2}", b[2]
