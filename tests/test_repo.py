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


def test_readme_tour_formulas_compute(tmp_path):
    """Every formula of the README's tour, on a sheet with a gas in B2:C6 and duties in D2:D5."""
    import openpyxl

    from cellfuncs import headless

    text = (ROOT / "README.md").read_text(encoding="utf-8")
    tour = text.split("## A short tour", 1)[1].split("\n## ", 1)[0]
    formulas = re.findall(r"`(=[A-Z_0-9]+\(.*?\))`", tour)
    assert len(formulas) >= 8
    wb = openpyxl.Workbook()
    ws = wb.active
    ws.title = "Tour"
    for r, (name, amount) in enumerate([("methane", 92.0), ("ethane", 4.5), ("propane", 1.0),
                                        ("nitrogen", 1.5), ("carbon dioxide", 1.0)], start=2):
        ws.cell(r, 2, name)
        ws.cell(r, 3, amount)
    for r, duty in enumerate([190.0, 560.0, 245.0, 890.0], start=2):
        ws.cell(r, 4, duty)
    from openpyxl.worksheet.formula import ArrayFormula

    for i, f in enumerate(formulas, start=1):
        r = 5 * i - 4
        # HW_CHAIN fills one cell per stage: a (legacy) array formula over four cells
        ws.cell(r, 6, ArrayFormula(f"F{r}:F{r + 3}", f) if f.startswith("=HW_CHAIN(") else f)
    path = tmp_path / "tour.xlsx"
    wb.save(path)
    res, _ = headless.recalc(str(path))
    assert not res.messages, res.messages
    # UNIT_CONVERT(1, "MMBtu", "kWh"): 1 MMBtu = 10^6 Btu_IT = 293.071 kWh (NIST SP 811 Appendix B.8)
    assert res.values[("Tour", "F1")] == __import__("pytest").approx(293.07107, rel=1e-6)
    chain = [res.values[("Tour", f"F{r}")] for r in range(31, 35)]
    assert chain == sorted(chain) and chain[0] > 60
