"""Catalog of published fastener and material data, each row naming its source.

Lazy: importing this package reads no data file and imports no numpy; the CSV files in
``clampstack/data`` are read on first use and cached.

Public API (SI units: m, m^2, Pa, 1/K, K)
-----------------------------------------
``thread(designation) -> Thread``, ``threads() -> list[Thread]``
    ISO metric coarse/fine (ISO 261, ISO 262; geometry ISO 68-1, ISO 724, ISO 898-1)
    and UNC/UNF (ASME B1.1), with standard head, nut and clearance-hole dimensions.
``grade(name, diameter=None) -> Grade``, ``grades() -> list[Grade]``
    ISO 898-1, ISO 3506-1, SAE J429 and ASTM A193 B7 strengths by size range.
``material(key) -> Material``, ``materials() -> list[Material]``
    Modulus and mean thermal expansion over temperature, strengths, VDI 2230-1 pG.
``listing(kind) -> (header, rows)``
    Display tables for ``threads``, ``grades`` and ``materials``.
"""

from __future__ import annotations

from clampstack.catalog.gaskets import Gasket, gasket, gaskets
from clampstack.catalog.grades import (
    Grade,
    grade,
    grades,
    yield_at_temperature,
    yield_extrapolation,
)
from clampstack.catalog.listing import KINDS, listing
from clampstack.catalog.materials import (
    COLD_MARGIN,
    Extrapolation,
    Material,
    material,
    materials,
)
from clampstack.catalog.threads import Thread, thread, threads

__all__ = [
    "Gasket",
    "gasket",
    "gaskets",
    "yield_at_temperature",
    "yield_extrapolation",
    "COLD_MARGIN",
    "Extrapolation",
    "KINDS",
    "Grade",
    "Material",
    "Thread",
    "grade",
    "grades",
    "listing",
    "material",
    "materials",
    "thread",
    "threads",
]
