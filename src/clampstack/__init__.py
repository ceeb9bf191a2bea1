"""clampstack: bolted-joint preload and clamp-load analysis as axial springs.

The package models a bolted joint as axial springs in series and parallel,
solves the statically indeterminate load share, and checks the result against
published design rules.  Results support, and do not replace, the judgement of
a qualified engineer; applicable codes and regulations govern.
"""

import importlib as _importlib

from . import display as _display
from ._version import __version__

# a result shown in a notebook loads its HTML view from the presentation layer
_display.set_loader(lambda: _importlib.import_module("clampstack.outputs.notebook"))

__all__ = ["__version__"]
