"""The repository keeps its promises: CI runs the README's test command."""

import re
from pathlib import Path

ROOT = Path(__file__).resolve().parent.parent


def _readme_commands():
    text = (ROOT / "README.md").read_text(encoding="utf-8")
    setup = text.split("## Set up", 1)[1].split("\n## ", 1)[0]
    return re.findall(r"```\n(.+?)\n```", setup)


def test_readme_has_exactly_two_setup_commands():
    cmds = _readme_commands()
    assert len(cmds) == 2
    assert cmds[0].endswith("cellfuncs demo")
    assert cmds[1].endswith("python -m pytest")


def test_ci_runs_the_readme_test_command():
    ci = (ROOT / ".ci" / "run").read_text(encoding="utf-8").splitlines()
    assert _readme_commands()[1] in ci
