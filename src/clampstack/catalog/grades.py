"""Fastener strength grades: ISO 898-1, ISO 3506-1, SAE J429, ASTM A193.

Data: ``grades.csv``, one row per grade and size range.  Strengths are the standards'
minimum values: ``Rm`` minimum tensile strength; ``Rp02`` the minimum yield value the
standard specifies (ISO 898-1: lower yield strength ReL for 4.6 and 5.6, stress at
0.0048 d non-proportional elongation Rpf for 4.8, 5.8 and 6.8, 0.2 % proof strength for
the others; ISO 3506-1, SAE J429 and ASTM A193: 0.2 % offset yield), named in
``yield_basis``; ``proof`` the proof stress (ISO 898-1 Sp,nom, SAE J429 proof strength;
``None`` where the standard gives none).  SAE J429 values are tabulated in ksi and stored
converted at 6.894757 MPa/ksi; ASTM A193/A193M values are the standard's own MPa values.

Size ranges are inclusive at both ends; a size on a boundary shared by two rows of one
grade belongs to the row for the smaller sizes, as the standards write it (ISO 898-1
"d <= 16 mm" / "d > 16 mm", SAE J429 "1/4 to 1 in incl." / "over 1 to 1-1/2 in",
ASTM A193 "2-1/2 in and under" / "over 2-1/2 to 4 in").
"""

from __future__ import annotations

import math
import re
from dataclasses import dataclass
from functools import cache

from clampstack.catalog._common import fmt, opt_float, read_csv, squash, unknown
from clampstack.catalog.materials import T_REF as T_ROOM
from clampstack.catalog.materials import Extrapolation
from clampstack.errors import InputError

MPA = 1e6
GPA = 1e9
MM = 1e-3

_HINT = "list them with `clampstack catalog grades`"
#: Relative tolerance on the size-range limits (inch sizes converted to metres).
_RTOL = 1e-6


@dataclass(frozen=True)
class Grade:
    """One row of a fastener grade: strengths for one size range (SI).

    Attributes
    ----------
    name : str
        Canonical grade name: ``"8.8"``, ``"A4-80"``, ``"SAE J429 5"``, ``"ASTM A193 B7"``.
    Rm : float
        Minimum tensile strength [Pa].
    Rp02 : float
        Minimum yield value [Pa] (see ``yield_basis``).
    proof : float or None
        Proof stress [Pa]; ``None`` where the standard gives none.
    E : float
        Modulus of elasticity of the bolt at 20 degC [Pa].
    alpha : float
        Coefficient of thermal expansion at 20 degC [1/K].
    material_key : str
        Catalog material that describes the bolt over temperature (``material(key)``).
    d_range : tuple of float
        Nominal diameters ``(d_min, d_max)`` [m] the row applies to (see module notes).
    source : str
        Published source of the row.
    yield_basis : str
        ``"ReL"``, ``"Rpf"`` or ``"Rp0.2"``: what ``Rp02`` is.
    """

    name: str
    Rm: float
    Rp02: float
    proof: float | None
    E: float
    alpha: float
    material_key: str
    d_range: tuple[float, float]
    source: str
    yield_basis: str = "Rp0.2"

    def applies_to(self, diameter: float) -> bool:
        """Return True when ``diameter`` [m] lies in this row's size range (inclusive)."""
        lo, hi = self.d_range
        return lo * (1 - _RTOL) <= diameter <= hi * (1 + _RTOL)


def _norm(name: str) -> str:
    """Normalise a grade name for comparison (drop ISO prefixes and filler words)."""
    text = name.lower()
    text = re.sub(r"iso\s*(898|3506)\s*-?\s*1(\s*:\s*\d{4})?", " ", text)
    text = re.sub(r"\b(property|class|grade)\b", " ", text)
    return squash(text)


@cache
def _load() -> tuple[tuple[Grade, ...], dict[str, str]]:
    rows: list[Grade] = []
    aliases: dict[str, str] = {}
    for r in read_csv("grades.csv"):
        proof = opt_float(r["proof_MPa"])
        g = Grade(
            name=r["grade"],
            Rm=float(r["Rm_MPa"]) * MPA,
            Rp02=float(r["Rp02_MPa"]) * MPA,
            proof=None if proof is None else proof * MPA,
            E=float(r["E_GPa"]) * GPA,
            alpha=float(r["alpha_1e-6_per_K"]) * 1e-6,
            material_key=r["material_key"],
            d_range=(float(r["d_min_mm"]) * MM, float(r["d_max_mm"]) * MM),
            source=r["source"],
            yield_basis=r["yield_basis"],
        )
        rows.append(g)
        for alias in [g.name, *r["aliases"].split("|")]:
            if not alias.strip():
                continue
            key = _norm(alias)
            if aliases.setdefault(key, g.name) != g.name:  # pragma: no cover - data bug
                raise RuntimeError(f"grade alias {alias!r} is ambiguous in grades.csv")
    rows.sort(key=lambda g: (g.name, g.d_range[0]))
    return tuple(rows), aliases


def grades() -> list[Grade]:
    """Return every grade row (one per grade and size range).

    Returns
    -------
    list of Grade
    """
    order: dict[str, int] = {}
    for r in read_csv("grades.csv"):
        order.setdefault(r["grade"], len(order))
    return sorted(_load()[0], key=lambda g: (order[g.name], g.d_range[0]))


def _fmt_mm(value: float) -> str:
    return fmt(value / MM, 2)


def grade(name: str, diameter: float | None = None) -> Grade:
    """Look up a fastener grade, picking the row that applies to the bolt size.

    Parameters
    ----------
    name : str
        Grade name or alias, e.g. ``"8.8"``, ``"10.9"``, ``"A2-70"``, ``"A4-80"``,
        ``"SAE J429 5"``, ``"SAE 5"``, ``"J429-8"``, ``"ASTM A193 B7"``, ``"B7"``
        (case, spaces and the prefixes ``ISO 898-1``/``property class`` do not matter).
    diameter : float, optional
        Nominal bolt diameter [m].  Without it the row for the smallest sizes is returned.

    Returns
    -------
    Grade

    Raises
    ------
    InputError
        Unknown grade (with near matches), or a diameter outside every row of the grade
        (the message names the grade and its valid size range).
    """
    rows, aliases = _load()
    canonical = aliases.get(_norm(str(name)))
    if canonical is None:
        canonical = {a: r["grade"] for r in read_csv("grades.csv") for a in r["aliases"].split("|")}
        candidates = sorted({g.name for g in rows}) + sorted(canonical)
        raise unknown("grade", str(name), candidates, _HINT, canonical=canonical)
    mine = [g for g in rows if g.name == canonical]
    if diameter is None:
        return mine[0]
    d = float(diameter)
    if not math.isfinite(d) or d <= 0:
        raise InputError(f"grade {canonical}: bolt diameter must be a positive length, got {d!r} m")
    for g in mine:
        if g.applies_to(d):
            return g
    lo = min(g.d_range[0] for g in mine)
    hi = max(g.d_range[1] for g in mine)
    span = f"up to {_fmt_mm(hi)} mm" if lo == 0 else f"{_fmt_mm(lo)} to {_fmt_mm(hi)} mm"
    raise InputError(
        f"grade {canonical} has no strength data for a {_fmt_mm(d)} mm bolt; "
        f"its valid size range is {span} ({mine[0].source.split(':')[0]})"
    )


@cache
def _yield_tables() -> dict[str, tuple[tuple[float, ...], tuple[float, ...], str]]:
    """Grade -> (T [K], Rp0.2 ratio to 20 degC, source) from ``grades_temperature.csv``."""
    rows: dict[str, list[tuple[float, float, str]]] = {}
    for row in read_csv("grades_temperature.csv"):
        rows.setdefault(row["grade"], []).append(
            (float(row["T_degC"]) + 273.15, float(row["Rp02_ratio"]), row["source"])
        )
    out = {}
    for name, pts in rows.items():
        pts.sort()
        out[name] = (tuple(p[0] for p in pts), tuple(p[1] for p in pts), pts[0][2])
    return out


def yield_at_temperature(g: Grade, T_K: float | object) -> tuple[object, str]:
    """Minimum yield value of grade ``g`` at temperature(s) ``T_K`` [Pa], and its basis.

    Uses the elevated-temperature ratios of ``grades_temperature.csv`` (ISO 898-1
    Annex A; ASME BPVC II-D Table Y-1 for B7; values from memory) with linear
    interpolation.  Below 20 degC the room-temperature value is held (strength
    rises in the cold; conservative) and the basis says so (:func:`yield_extrapolation`
    describes it for a note).  Above the table an :class:`InputError` names
    the grade and its range.  A grade without such data keeps its room-temperature
    value, and the basis says so.  Accepts a float or a numpy array.
    """
    import numpy as np

    table = _yield_tables().get(g.name)
    arr = np.asarray(T_K, dtype=float)
    if table is None:
        val = np.full(arr.shape, g.Rp02)
        basis = f"no elevated-temperature data for grade {g.name}: room-temperature value used"
    else:
        T, ratio, source = table
        if np.any(arr > T[-1] + 1e-9):
            raise InputError(
                f"{float(arr.max()) - 273.15:g} degC is above the elevated-temperature data of "
                f"grade {g.name} (up to {T[-1] - 273.15:g} degC)"
            )
        val = g.Rp02 * np.interp(arr, T, ratio)
        basis = source.split(": ")[0].split(" yield strength")[0] + " (from memory)"
        if np.any(arr < T[0] - 1e-9):
            basis += f"; below {T[0] - 273.15:g} degC its {T[0] - 273.15:g} degC value held"
    return (float(val) if val.ndim == 0 else val), basis


def yield_extrapolation(g: Grade, T_K: float | object) -> Extrapolation | None:
    """The hold of the yield value below the data of grade ``g``, if a ``T_K`` [K] is colder.

    Below its first tabulated temperature (20 degC; the room-temperature minimum for a
    grade without temperature data) :func:`yield_at_temperature` holds the 20 degC value:
    the strength of steels rises in the cold.  Returns ``None`` when no temperature is colder.
    """
    import numpy as np

    table = _yield_tables().get(g.name)
    T0 = table[0][0] if table is not None else T_ROOM
    arr = np.asarray(T_K, dtype=float).ravel()
    arr = arr[np.isfinite(arr)]
    if arr.size == 0 or float(arr.min()) >= T0 - 1e-9:
        return None
    return Extrapolation(
        f"grade {g.name}",
        "yield strength",
        "below",
        T0,
        float(arr.min()),
        "held",
        f"{fmt(g.Rp02 / MPA, 1)} MPa",
        "the strength rises in the cold",
    )
