"""Catalogue entries of the general family."""

from cellfuncs.catalogue.spec import Arg, CellFunction  # noqa: F401

ENTRIES: list = []
