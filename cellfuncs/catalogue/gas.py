"""Catalogue entries of the gas family."""

from cellfuncs.catalogue.spec import Arg, CellFunction  # noqa: F401

ENTRIES: list = []
