"""Catalogue entries of the chargeair family."""

from cellfuncs.catalogue.spec import Arg, CellFunction  # noqa: F401

ENTRIES: list = []
