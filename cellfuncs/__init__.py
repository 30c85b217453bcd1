"""cellfuncs: spreadsheet cell functions for tendering gas-engine CHP plants.

The physics lives in the topic subpackages (``gas``, ``chargeair``, ``knock``,
``heat_transfer``, ``recovery``, ``engine``) as plain functions of floats.
``cellfuncs.catalogue`` lists the cell functions; ``cellfuncs.excel`` and
``cellfuncs.headless`` are generated from it.
"""

__version__ = "0.1.0"

from cellfuncs.errors import CellInputError  # noqa: E402,F401

__all__ = ["__version__", "CellInputError"]
