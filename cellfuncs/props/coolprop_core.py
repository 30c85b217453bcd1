"""CoolProp's compiled core, loaded without the package's start-up.

``import CoolProp`` runs the package's ``__init__``, which asks the library for the list of every
fluid it knows and so loads them all: about 2.7 s on this project's machines, most of a cold
``cellfuncs recalc`` of a workbook with a water–glycol circuit.  The compiled module
``CoolProp.CoolProp`` alone loads in milliseconds and computes the incompressible mixtures
(``INCOMP::MEG``/``MPG``) the hot-water family needs exactly as before.  :func:`core` loads it
under its own name ``CoolProp.CoolProp``, so a later ``import CoolProp`` (tests, the reference
libraries) finds it there and reuses it instead of loading the library a second time.  Where the
compiled module cannot be loaded on its own (another build of CoolProp), the ordinary import is
used.
"""

from __future__ import annotations

import sys

__all__ = ["core"]

_NAME = "CoolProp.CoolProp"


def core():
    """The module ``CoolProp.CoolProp`` (AbstractState, PT_INPUTS, iT_freeze, PropsSI)."""
    mod = sys.modules.get(_NAME)
    if mod is not None:
        return mod
    try:
        mod = _load_compiled()
    except Exception:  # noqa: BLE001 - any failure: the ordinary (slower) import
        sys.modules.pop(_NAME, None)
        mod = None
    if mod is None or not hasattr(mod, "AbstractState"):
        sys.modules.pop(_NAME, None)
        import CoolProp.CoolProp as mod  # noqa: PLC0415
    return mod


def _load_compiled():
    import importlib.machinery
    import importlib.util
    import os

    spec = importlib.util.find_spec("CoolProp")
    if spec is None or not spec.submodule_search_locations:
        return None
    folder = list(spec.submodule_search_locations)[0]
    for suffix in importlib.machinery.EXTENSION_SUFFIXES:
        path = os.path.join(folder, "CoolProp" + suffix)
        if os.path.isfile(path):
            break
    else:
        return None
    loader = importlib.machinery.ExtensionFileLoader(_NAME, path)
    mspec = importlib.util.spec_from_file_location(_NAME, path, loader=loader)
    mod = importlib.util.module_from_spec(mspec)
    sys.modules[_NAME] = mod
    loader.exec_module(mod)
    return mod
