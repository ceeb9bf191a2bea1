"""Gaskets: ASME BPVC VIII-1 Appendix 2 factors m and y, stress limits and loading curves.

Data: ``gaskets.csv``.  ``m`` (maintenance factor) and ``y`` (seating stress) are the
ASME BPVC VIII-1 Appendix 2 Table 2-5.1 values for the gasket type, stored in psi
for ``y`` as tabulated and converted here.  The loading curve (gasket stress against
compression strain, compression / thickness), the unloading modulus (the stiffer
slope on which a compressed gasket springs back) and the maximum stress (crush
limit) are typical values, marked in the source column; a real design should use
the manufacturer's data, which the input file can give instead.

``gasket_service.csv`` adds, per type, the thermal expansion through the thickness
and the creep relaxation factor P_QR (residual over initial gasket stress after a
creep relaxation test, the quantity of EN 13555) against temperature, each row
with its source (typical values, from memory).
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
    expansion: float = 0.0  # through the thickness [1/K]
    relax_temperature: tuple[float, ...] = (293.15,)  # [K]
    relax_factor: tuple[float, ...] = (1.0,)  # P_QR at those temperatures
    service_source: str = ""

    def relaxation(self, T: float) -> float:
        """Creep relaxation factor P_QR at ``T`` [K]: linear in the table, held beyond it."""
        import numpy as np

        return float(np.interp(T, self.relax_temperature, self.relax_factor))


@cache
def _all() -> tuple[Gasket, ...]:
    out = []
    service = {r["key"]: r for r in read_csv("gasket_service.csv")}
    for row in read_csv("gaskets.csv"):
        srv = service[row["key"]]
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
                expansion=float(srv["expansion_per_K"]),
                relax_temperature=tuple(
                    float(v) + 273.15 for v in srv["relax_temperature_degC"].split(";")
                ),
                relax_factor=tuple(float(v) for v in srv["relax_factor"].split(";")),
                service_source=srv["source"],
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
    header = [
        "type",
        "description",
        "m",
        "y [MPa]",
        "y [psi]",
        "max stress [MPa]",
        "P_QR (degC)",
        "source",
    ]
    rows = [
        [
            g.key,
            g.name,
            fmt(g.m),
            fmt(g.y / MPA),
            f"{g.y / PSI:.0f}",
            fmt(g.max_stress / MPA),
            " ".join(
                f"{p:g} ({T - 273.15:g})"
                for T, p in zip(g.relax_temperature, g.relax_factor, strict=True)
            ),
            g.source + "; " + g.service_source,
        ]
        for g in _all()
    ]
    return header, rows
