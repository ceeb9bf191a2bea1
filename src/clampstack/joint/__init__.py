"""Single-bolt joints: model, analysis through the spring network, and the check chain."""

from .analysis import JointResult, Springs, State, analyse, springs
from .checks import CHECK_NAMES, Check
from .model import JointSpec

__all__ = [
    "CHECK_NAMES",
    "Check",
    "JointResult",
    "JointSpec",
    "Springs",
    "State",
    "analyse",
    "springs",
]
