"""Package reading: a part inflating to 300 MB is refused in under 2 s (issue 9, item 3).

Cases, each measured in the same run:

- ``read_small`` (reference): reading a small honest workbook (the test module's plain book);
- ``refuse_declared``: the zip directory declares the 300 MiB part honestly (refused before
  decompressing anything);
- ``refuse_lying``: the directory declares 1,000 bytes for the same part (refused while streaming,
  after the ratio limit is passed);
- ``cli_refuse_lying`` / ``cli_version``: the whole ``cellfuncs recalc`` command on the lying book
  (interpreter start-up included) against ``cellfuncs --version``.

The workbooks are built streaming (1 MiB of blanks deflated once and repeated), each under 1 MiB on
disk.

    python -m pytest benchmarks/bench_package.py --benchmark-only
"""

import subprocess
import sys

import openpyxl
import pytest

from test_xlsx_package import bomb_book  # benchmarks/conftest.py puts tests/ on the path

from cellfuncs.headless.package import BookError, Package


@pytest.fixture(scope="module")
def books(tmp_path_factory):
    d = tmp_path_factory.mktemp("pkg")
    wb = openpyxl.Workbook()
    ws = wb.active
    ws.title = "Calc"
    for r in range(1, 51):
        ws.cell(r, 1, r * 1.5)
        ws.cell(r, 2, f"=A{r}*2")
    plain = d / "plain.xlsx"
    wb.save(plain)
    return {"plain": plain,
            "declared": bomb_book(d, plain, 300, name="declared.xlsx"),
            "lying": bomb_book(d, plain, 300, declared=1000, name="lying.xlsx")}


def _refuse(path):
    try:
        Package(str(path))
    except BookError:
        return
    raise AssertionError(f"{path} was not refused")


def test_read_small(benchmark, books):
    benchmark.group = "package: refuse a 300 MB-inflating part"
    benchmark.pedantic(Package, args=(str(books["plain"]),), rounds=5, iterations=1)


@pytest.mark.parametrize("kind", ["declared", "lying"])
def test_refuse(benchmark, books, kind):
    benchmark.group = "package: refuse a 300 MB-inflating part"
    benchmark.pedantic(_refuse, args=(books[kind],), rounds=5, iterations=1)
    assert benchmark.stats.stats.max < 2.0


def _cli(*args, ok=True):
    p = subprocess.run([sys.executable, "-m", "cellfuncs.cli", *args], capture_output=True, text=True)
    assert (p.returncode == 0) == ok, p.stderr


def test_cli_version(benchmark):
    benchmark.group = "package: cellfuncs recalc refusing the lying 300 MB book"
    benchmark.pedantic(_cli, args=("--version",), rounds=3, iterations=1)


def test_cli_refuse_lying(benchmark, books, tmp_path):
    benchmark.group = "package: cellfuncs recalc refusing the lying 300 MB book"
    benchmark.pedantic(_cli, args=("recalc", str(books["lying"]), "-o", str(tmp_path / "o.xlsx")),
                       kwargs={"ok": False}, rounds=3, iterations=1)
    assert benchmark.stats.stats.max < 2.0


# -- sheet edits on 40,000 formula cells -----------------------------------------------------------

@pytest.fixture(scope="module")
def big(tmp_path_factory):
    wb = openpyxl.Workbook()
    ws = wb.active
    ws.title = "S"
    for r in range(1, 10001):
        ws.cell(r, 1, r * 1.0)
        for c in range(2, 6):
            ws.cell(r, c, f"=A{r}*{c}+1")
    path = tmp_path_factory.mktemp("big") / "big.xlsx"
    wb.save(path)
    return str(path)


def _bare_parse(data):
    import xml.parsers.expat as expat

    expat.ParserCreate().Parse(data, True)


def _private_copy(path):
    pkg = Package(path)
    pkg.map_formulas(lambda text: text)
    pkg.drop_empty_cells()
    pkg.used_extent()


def _cached(pkg, values):
    pkg.set_cached(values)


EDITS = "package: sheet edits, 40,000 formula cells (2 MB sheet part)"


def test_edit_reference_bare_parse(benchmark, big):
    benchmark.group = EDITS
    data = Package(big).parts["xl/worksheets/sheet1.xml"]
    benchmark.pedantic(_bare_parse, args=(data,), rounds=3, iterations=1)


def test_edit_read_package(benchmark, big):
    benchmark.group = EDITS
    benchmark.pedantic(Package, args=(big,), rounds=3, iterations=1)


def test_edit_private_copy(benchmark, big):
    """What the engine's private copy costs: map every formula, drop empty cells, extent."""
    benchmark.group = EDITS
    benchmark.pedantic(_private_copy, args=(big,), rounds=3, iterations=1)


def test_edit_set_cached(benchmark, big):
    benchmark.group = EDITS
    from cellfuncs.headless.package import col_letters

    values = {("S", f"{col_letters(c)}{r}"): r * c + 1.0 for r in range(1, 10001) for c in range(2, 6)}
    benchmark.pedantic(_cached, setup=lambda: ((Package(big), values), {}), rounds=3, iterations=1)
