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

# the Python interface (its one list of names is clampstack.api.__all__); clampstack.api
# imports nothing heavy at its top (each function loads what it needs), so
# `import clampstack` and the command line stay fast
from . import api as _api  # noqa: E402
from .api import *  # noqa: E402, F403

__all__ = ["__version__", *_api.__all__]
