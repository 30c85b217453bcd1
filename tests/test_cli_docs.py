"""Every command line in README.md and docs/*.md runs as written against the demo workbooks.

A command line is a line of a fenced code block that starts with ``cellfuncs ``; a synopsis line
(one with ``[optional]`` parts, as in docs/headless.md) is not one.  Each runs in a temporary folder
holding a copy of ``workbooks_demo/``, so outputs the docs name land there.
"""

import re
import shlex
import shutil
import subprocess
import sys
from pathlib import Path

import pytest

ROOT = Path(__file__).resolve().parent.parent
DOCS = [ROOT / "README.md"] + sorted((ROOT / "docs").glob("*.md"))


def command_lines():
    found = []
    for path in DOCS:
        in_block = False
        for n, line in enumerate(path.read_text(encoding="utf-8").splitlines(), start=1):
            if line.lstrip().startswith("```"):
                in_block = not in_block
                continue
            text = line.strip()
            if in_block and text.startswith("cellfuncs ") and "[" not in text.split("#")[0]:
                found.append(pytest.param(text, id=f"{path.relative_to(ROOT)}:{n}"))
    return found


LINES = command_lines()


def test_the_docs_have_command_lines():
    ids = {p.id.split(":")[0] for p in LINES}
    assert "README.md" in ids and len(LINES) >= 5


@pytest.fixture(scope="module")
def workdir(tmp_path_factory):
    d = tmp_path_factory.mktemp("docs")
    shutil.copytree(ROOT / "workbooks_demo", d / "workbooks_demo")
    return d


@pytest.mark.parametrize("line", LINES)
def test_command_line_runs(line, workdir):
    args = shlex.split(line, comments=True)
    assert args[0] == "cellfuncs"
    p = subprocess.run([sys.executable, "-m", "cellfuncs.cli", *args[1:]], cwd=workdir, capture_output=True,
                       text=True, encoding="utf-8", timeout=900)
    assert p.returncode == 0, f"{line}\n{p.stderr}"
    for i, a in enumerate(args):   # whatever the line writes with -o exists afterwards
        if a in ("-o", "--output"):
            assert (workdir / args[i + 1]).exists()
    assert "Traceback" not in p.stderr


def test_synopsis_lines_name_real_commands():
    """The synopsis lines skipped above still name commands that exist."""
    from cellfuncs.cli import build_parser

    commands = set(build_parser()._subparsers._group_actions[0].choices)
    for path in DOCS:
        for m in re.finditer(r"^cellfuncs (\w[\w-]*) .*\[", path.read_text(encoding="utf-8"), re.M):
            assert m.group(1) in commands, (path.name, m.group(0))
