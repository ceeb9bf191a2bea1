"""clampstack: bolted-joint preload and clamp-load analysis as axial springs.

The package models a bolted joint as axial springs in series and parallel,
solves the statically indeterminate load share, and checks the result against
published design rules.  Results support, and do not replace, the judgement of
a qualified engineer; applicable codes and regulations govern.
"""

__version__ = "0.1.0"

__all__ = ["__version__"]
