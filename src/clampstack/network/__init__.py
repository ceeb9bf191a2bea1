"""Axial spring network solver (unit-free; see :mod:`clampstack.network.core`)."""

from .core import BEHAVIOURS, COMPRESSION, CURVE, LINEAR, TENSION, Curve, Network, Solution

__all__ = [
    "BEHAVIOURS",
    "COMPRESSION",
    "CURVE",
    "LINEAR",
    "TENSION",
    "Curve",
    "Network",
    "Solution",
]
