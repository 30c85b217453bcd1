"""The LibreOffice Calc adapter: an add-in extension generated from the catalogue.

:mod:`cellfuncs.calc.build` writes the extension (``cellfuncs calc-extension -o
cellfuncs.oxt``): a type library with one UNO interface holding every catalogue
function (:mod:`cellfuncs.calc.unoidl`), the Python UNO component
(``component.py``) with the names, descriptions and argument help, and the folders
where the building interpreter finds cellfuncs and its dependencies.  In Calc the
component hands each call to :mod:`cellfuncs.calc.runtime`, which shares
:mod:`cellfuncs.adapt` with the Excel and headless adapters.  See docs/libreoffice.md.
"""
