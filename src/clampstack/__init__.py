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

#: the Python interface (clampstack.api), loaded on first use so that `import clampstack`
#: and the command line start fast
_API = (
    "analyse",
    "analyse_flange",
    "assembly_from_dict",
    "flange_from_dict",
    "joint_from_dict",
    "load",
    "scatter",
    "size",
    "solve",
    "sweep",
)

__all__ = ["__version__", *_API]


def __getattr__(name: str):
    if name in _API:
        return getattr(_importlib.import_module("clampstack.api"), name)
    raise AttributeError(f"module 'clampstack' has no attribute {name!r}")


def __dir__() -> list[str]:
    return sorted(__all__)
