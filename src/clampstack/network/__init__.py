"""Axial spring network solver (unit-free; see :mod:`clampstack.network.core`)."""

from .core import (
    BEHAVIOURS,
    COMPRESSION,
    CURVE,
    LINEAR,
    TENSION,
    Curve,
    Network,
    Solution,
    elastic_plastic_curve,
    update_plastic,
)

__all__ = [
    "elastic_plastic_curve",
    "update_plastic",
    "BEHAVIOURS",
    "COMPRESSION",
    "CURVE",
    "LINEAR",
    "TENSION",
    "Curve",
    "Network",
    "Solution",
]
