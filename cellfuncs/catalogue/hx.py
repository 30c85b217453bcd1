"""Catalogue entries of the hx family."""

from cellfuncs.catalogue.spec import Arg, CellFunction  # noqa: F401

ENTRIES: list = []
