"""Gaskets: ASME BPVC VIII-1 Appendix 2 factors m and y, stress limits and loading curves.

Data: ``gaskets.csv``.  ``m`` (maintenance factor) and ``y`` (seating stress) are the
ASME BPVC VIII-1 Appendix 2 Table 2-5.1 values for the gasket type, stored in psi
for ``y`` as tabulated and converted here.  The loading curve (gasket stress against
compression strain, compression / thickness), the unloading modulus (the stiffer
slope on which a compressed gasket springs back) and the maximum stress (crush
limit) are typical values, marked in the source column; a real design should use
the manufacturer's data, which the input file can give instead.
"""

from __future__ import annotations

from dataclasses import dataclass
from functools import cache

from clampstack.catalog._common import by_key, fmt, read_csv

PSI = 6894.757293168361
MPA = 1e6


@dataclass(frozen=True)
class Gasket:
    """A gasket type (SI): m [-], y [Pa], maximum stress [Pa], curve (strain, stress [Pa])."""

    key: str
    name: str
    m: float
    y: float
    max_stress: float
    unload_modulus: float
    curve_strain: tuple[float, ...]
    curve_stress: tuple[float, ...]
    source: str


@cache
def _all() -> tuple[Gasket, ...]:
    out = []
    for row in read_csv("gaskets.csv"):
        out.append(
            Gasket(
                key=row["key"],
                name=row["name"],
                m=float(row["m"]),
                y=float(row["y_psi"]) * PSI,
                max_stress=float(row["max_stress_MPa"]) * MPA,
                unload_modulus=float(row["unload_modulus_MPa"]) * MPA,
                curve_strain=tuple(float(v) for v in row["curve_strain"].split(";")),
                curve_stress=tuple(float(v) * MPA for v in row["curve_stress_MPa"].split(";")),
                source=row["source"],
            )
        )
    return tuple(out)


def gaskets() -> list[Gasket]:
    """All gasket types of the catalog."""
    return list(_all())


def gasket(key: str) -> Gasket:
    """The gasket type called ``key`` (case and punctuation ignored); InputError if unknown."""
    return by_key(_all(), key, "gasket type", "list them with `clampstack catalog gaskets`")


def gasket_listing() -> tuple[list[str], list[list[str]]]:
    """Display table of the gasket types."""
    header = ["type", "description", "m", "y [MPa]", "y [psi]", "max stress [MPa]", "source"]
    rows = [
        [
            g.key,
            g.name,
            fmt(g.m),
            fmt(g.y / MPA),
            f"{g.y / PSI:.0f}",
            fmt(g.max_stress / MPA),
            g.source,
        ]
        for g in _all()
    ]
    return header, rows
