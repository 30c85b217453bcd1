"""Catalogue entries of the knock family."""

from cellfuncs.catalogue.spec import Arg, CellFunction  # noqa: F401

ENTRIES: list = []
