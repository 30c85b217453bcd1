"""Start-up and whole-workbook costs, each against a reference measured in the same run.

- ``import cellfuncs.excel`` vs ``import xlwings`` (which it cannot avoid) vs a bare interpreter;
  also the ``-X importtime`` total of ``cellfuncs.excel`` (target <= 0.5 s).
- ``cellfuncs recalc`` of the demo workbook vs loading the same workbook with openpyxl.
"""

import re
import subprocess
import sys
import tempfile
from pathlib import Path

import pytest


def _py(code):
    subprocess.run([sys.executable, "-c", code], check=True)


@pytest.mark.parametrize("code", ["pass", "import xlwings", "import cellfuncs.excel"])
def test_import(benchmark, code):
    benchmark.group = "import"
    benchmark.pedantic(_py, args=(code,), rounds=5, iterations=1)


def test_importtime_total():
    p = subprocess.run([sys.executable, "-X", "importtime", "-c", "import cellfuncs.excel"],
                       capture_output=True, text=True, check=True)
    last = [ln for ln in p.stderr.splitlines() if re.search(r"\|\s*cellfuncs\.excel$", ln)][-1]
    total_us = int(last.split("|")[1])
    print(f"\nimport cellfuncs.excel (-X importtime cumulative): {total_us / 1e6:.3f} s")
    assert total_us < 0.5e6


@pytest.fixture(scope="module")
def demo_book():
    from cellfuncs import demo

    d = tempfile.mkdtemp()
    path, _, _ = demo.build_one("hx_sizing", d)
    return path


def test_recalc_demo(benchmark, demo_book):
    from cellfuncs import headless

    benchmark.group = "recalc hx_sizing.xlsx"
    benchmark.pedantic(headless.recalc, args=(demo_book,), rounds=3, iterations=1)


def test_openpyxl_load_demo(benchmark, demo_book):
    import openpyxl

    benchmark.group = "recalc hx_sizing.xlsx"
    benchmark.pedantic(openpyxl.load_workbook, args=(demo_book,), rounds=3, iterations=1)
