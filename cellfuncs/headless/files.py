"""Output checks and atomic text output shared by ``recalc`` and ``cases``."""

from __future__ import annotations

import os
import tempfile

from cellfuncs.errors import UsageError

__all__ = ["check_output_path", "write_text_atomic"]


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


def _umask() -> int:
    mask = os.umask(0)
    os.umask(mask)
    return mask


def write_text_atomic(out: str, text: str, suffix: str = ".csv"):
    """Write ``text`` (UTF-8) to ``out`` through a temporary file in the same folder."""
    folder = os.path.dirname(os.path.abspath(out)) or "."
    fd, tmp = tempfile.mkstemp(prefix=".cellfuncs-", suffix=suffix, dir=folder)
    try:
        with os.fdopen(fd, "w", encoding="utf-8", newline="") as fh:
            fh.write(text)
        os.chmod(tmp, 0o666 & ~_umask())
        os.replace(tmp, out)
    except OSError as exc:
        if os.path.exists(tmp):
            os.unlink(tmp)
        raise UsageError(f"-o {out}: cannot write ({exc.strerror or exc})") from None
