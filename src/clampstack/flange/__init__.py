"""Gasketed bolted flanges: ASME VIII-1 App. 2 bolt loads, gasket window, tightening passes."""

from .analysis import FlangeResult, analyse_flange, asme_app2, cross_order
from .model import FlangeSpec, GasketSpec

__all__ = ["FlangeResult", "FlangeSpec", "GasketSpec", "analyse_flange", "asme_app2", "cross_order"]
