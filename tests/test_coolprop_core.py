"""Water–glycol properties come from CoolProp's compiled core without the package's start-up.

Reference: CoolProp 8 PropsSI with INCOMP::MEG/MPG (Melinder 2010 fits), called through the
ordinary ``import CoolProp.CoolProp`` in the same process after our loader ran.
"""

import subprocess
import sys


def test_glycol_without_the_package_start_up():
    """A cold glycol property call loads the compiled core only; the values are CoolProp's."""
    code = (
        "import sys\n"
        "from cellfuncs.recovery import water as w\n"
        "cp, rho = w.hw_cp(40.0, 0.35), w.hw_density(40.0, 0.35, 'propylene')\n"
        "print('CoolProp' in sys.modules, 'CoolProp.CoolProp' in sys.modules)\n"
        "import CoolProp.CoolProp as CP\n"  # the ordinary import now reuses the loaded core
        "print(cp * 1000 == CP.PropsSI('C', 'T', 313.15, 'P', 3e5, 'INCOMP::MEG[0.35]'))\n"
        "print(rho == CP.PropsSI('D', 'T', 313.15, 'P', 3e5, 'INCOMP::MPG[0.35]'))\n"
        "print(sys.modules['CoolProp'].CoolProp is sys.modules['CoolProp.CoolProp'])\n"
    )
    out = subprocess.run([sys.executable, "-c", code], capture_output=True, text=True, timeout=120)
    assert out.returncode == 0, out.stderr
    lines = out.stdout.split()
    assert lines[:2] == ["False", "True"], "the package __init__ (every fluid loaded) ran"
    assert lines[2:] == ["True", "True", "True"]


def test_core_falls_back_to_the_ordinary_import():
    """When the compiled module cannot be loaded on its own, the ordinary import serves.

    Run in a fresh interpreter: a compiled extension must not be initialised twice in one process.
    """
    code = (
        "import sys\n"
        "from cellfuncs.props import coolprop_core\n"
        "def fail():\n"
        "    raise ImportError('no stand-alone load here')\n"
        "coolprop_core._load_compiled = fail\n"
        "mod = coolprop_core.core()\n"
        "print(hasattr(mod, 'AbstractState'), 'CoolProp' in sys.modules)\n"
    )
    out = subprocess.run([sys.executable, "-c", code], capture_output=True, text=True, timeout=120)
    assert out.returncode == 0, out.stderr
    assert out.stdout.split() == ["True", "True"]
