"""Thread series: ISO metric (coarse and fine) and unified inch (UNC, UNF).

Only the nominal diameter and the pitch are tabulated (``threads_iso_metric.csv``,
``threads_unified.csv``); the thread geometry is computed from the basic profile:

* ISO 68-1 / ISO 724: pitch diameter ``d2 = d - 0.649519 P``, nut minor diameter
  ``D1 = d1 = d - 1.082532 P``.
* ISO 898-1: minor diameter of the bolt ``d3 = d - 1.226869 P`` and stress area
  ``As = pi/4 ((d2 + d3)/2)^2``.
* VDI 2230-1: ``ds = d0 = (d2 + d3)/2``, ``Ad3 = pi d3^2/4``, ``AN = pi d^2/4``.
* ASME B1.1 (unified threads): tensile stress area ``At = pi/4 (D - 0.9743/n)^2``
  (printed there as 0.7854 (D - 0.9743/n)^2, n threads per inch); the other diameters use
  the same basic profile with ``P = 1/n``.

The standard fastener dimensions used as defaults (``dims_iso_metric.csv``,
``dims_unified.csv``): hex head width across flats (ISO 4014/4017; ASME B18.2.1 hex cap
screws), socket head diameter (ISO 4762; ASME B18.3), nut height (ISO 4032 style 1;
ASME B18.2.2 hex nuts) and clearance holes (ISO 273 fine/medium/coarse; ASME B18.2.8
close/normal/loose, stored as fine/medium/coarse).  All values are SI (m, m^2).
"""

from __future__ import annotations

import math
import re
from dataclasses import dataclass
from functools import cache, lru_cache

from clampstack.catalog._common import opt_float, read_csv, unknown
from clampstack.errors import InputError

MM = 1e-3
INCH = 0.0254

#: Basic-profile factors (ISO 68-1, ISO 724, ISO 898-1).
K_D2 = 0.649519
K_D1 = 1.082532
K_D3 = 1.226869
#: ASME B1.1 stress-area factor.
K_AT = 0.9743

_HINT = "list them with `clampstack catalog threads`"


@dataclass(frozen=True)
class Thread:
    """One thread size with its computed geometry and standard fastener dimensions (SI).

    Attributes
    ----------
    designation : str
        Canonical name: ``"M10"``, ``"M10x1.25"``, ``"1/2-13 UNC"``.
    series : str
        ``"coarse"`` or ``"fine"`` (ISO metric), ``"UNC"`` or ``"UNF"`` (unified).
    d : float
        Nominal (major) diameter [m].
    P : float
        Pitch [m] (``1/tpi`` for unified threads).
    d2 : float
        Pitch diameter ``d - 0.649519 P`` [m] (ISO 68-1, ISO 724).
    d3 : float
        Bolt minor diameter ``d - 1.226869 P`` [m] (ISO 898-1).
    d1 : float
        Nut minor diameter ``D1 = d - 1.082532 P`` [m] (ISO 68-1, ISO 724).
    As : float
        Tensile stress area [m^2]: ISO 898-1 for metric, ASME B1.1 for unified threads.
    Ad3 : float
        Minor-diameter area ``pi d3^2/4`` [m^2] (VDI 2230-1).
    AN : float
        Nominal area ``pi d^2/4`` [m^2] (VDI 2230-1).
    ds : float
        Stress diameter ``(d2 + d3)/2`` [m] (VDI 2230-1 d0 for standard bolts).
    head_across_flats : float
        Hex head width across flats s [m] (ISO 4014/4017; ASME B18.2.1 hex cap screw).
    socket_head_diameter : float or None
        Socket head cap screw head diameter dk max [m] (ISO 4762; ASME B18.3);
        ``None`` where the size is not in that standard.
    nut_height : float
        Hex nut height m [m] (ISO 4032 style 1; ASME B18.2.2 hex nut).
    hole_fine, hole_medium, hole_coarse : float or None
        Clearance hole diameters [m] (ISO 273 fine/medium/coarse; for unified threads
        ASME B18.2.8 close/normal/loose); ``None`` where not standardised.
    source : str
        Published sources of the row, its dimensions and the geometry formulas.
    system : str
        ``"metric"`` or ``"unified"``.
    tpi : float or None
        Threads per inch (unified threads only).
    """

    designation: str
    series: str
    d: float
    P: float
    d2: float
    d3: float
    d1: float
    As: float
    Ad3: float
    AN: float
    ds: float
    head_across_flats: float
    socket_head_diameter: float | None
    nut_height: float
    hole_fine: float | None
    hole_medium: float | None
    hole_coarse: float | None
    source: str
    system: str = "metric"
    tpi: float | None = None


def _basic(d: float, P: float) -> tuple[float, float, float, float, float, float]:
    """Return ``d2, d3, d1, ds, Ad3, AN`` of the basic profile (ISO 68-1, ISO 898-1, VDI 2230-1)."""
    d2 = d - K_D2 * P
    d3 = d - K_D3 * P
    d1 = d - K_D1 * P
    ds = 0.5 * (d2 + d3)
    return d2, d3, d1, ds, math.pi / 4 * d3**2, math.pi / 4 * d**2


def _mm(text: str) -> float | None:
    value = opt_float(text)
    return None if value is None else value * MM


def _inch(text: str) -> float | None:
    value = opt_float(text)
    return None if value is None else value * INCH


@cache
def _metric_dims() -> dict[float, dict[str, str]]:
    return {float(r["d_mm"]): r for r in read_csv("dims_iso_metric.csv")}


@cache
def _unified_dims() -> dict[float, dict[str, str]]:
    return {float(r["d_in"]): r for r in read_csv("dims_unified.csv")}


def _metric_thread(row: dict[str, str]) -> Thread:
    d_mm, p_mm = float(row["d_mm"]), float(row["P_mm"])
    dims = _metric_dims().get(d_mm)
    if dims is None:  # pragma: no cover - data consistency is tested
        raise RuntimeError(f"dims_iso_metric.csv has no row for d = {d_mm} mm")
    d, P = d_mm * MM, p_mm * MM
    d2, d3, d1, ds, ad3, an = _basic(d, P)
    As = math.pi / 4 * ds**2  # ISO 898-1
    source = (
        f"{row['source']}; geometry: ISO 68-1/ISO 724 d2, D1; ISO 898-1 d3, As; "
        f"dimensions: {dims['source']}"
    )
    return Thread(
        designation=row["designation"],
        series=row["series"],
        d=d,
        P=P,
        d2=d2,
        d3=d3,
        d1=d1,
        As=As,
        Ad3=ad3,
        AN=an,
        ds=ds,
        head_across_flats=float(dims["s_mm"]) * MM,
        socket_head_diameter=_mm(dims["dk_mm"]),
        nut_height=float(dims["m_mm"]) * MM,
        hole_fine=_mm(dims["hole_fine_mm"]),
        hole_medium=_mm(dims["hole_medium_mm"]),
        hole_coarse=_mm(dims["hole_coarse_mm"]),
        source=source,
        system="metric",
        tpi=None,
    )


def _unified_thread(row: dict[str, str]) -> Thread:
    d_in, tpi = float(row["d_in"]), float(row["tpi"])
    dims = _unified_dims().get(d_in)
    if dims is None:  # pragma: no cover - data consistency is tested
        raise RuntimeError(f"dims_unified.csv has no row for d = {d_in} in")
    d, P = d_in * INCH, INCH / tpi
    d2, d3, d1, ds, ad3, an = _basic(d, P)
    As = math.pi / 4 * ((d_in - K_AT / tpi) * INCH) ** 2  # ASME B1.1
    source = (
        f"{row['source']}; geometry: basic profile (ASME B1.1 / ISO 68-1) with P = 1/n, "
        f"As: ASME B1.1 At = 0.7854 (D - 0.9743/n)^2; dimensions: {dims['source']}"
    )
    return Thread(
        designation=row["designation"],
        series=row["series"],
        d=d,
        P=P,
        d2=d2,
        d3=d3,
        d1=d1,
        As=As,
        Ad3=ad3,
        AN=an,
        ds=ds,
        head_across_flats=float(dims["s_in"]) * INCH,
        socket_head_diameter=_inch(dims["dk_in"]),
        nut_height=float(dims["m_in"]) * INCH,
        hole_fine=_inch(dims["hole_close_in"]),
        hole_medium=_inch(dims["hole_normal_in"]),
        hole_coarse=_inch(dims["hole_loose_in"]),
        source=source,
        system="unified",
        tpi=tpi,
    )


@cache
def _all() -> tuple[Thread, ...]:
    metric = [_metric_thread(r) for r in read_csv("threads_iso_metric.csv")]
    unified = [_unified_thread(r) for r in read_csv("threads_unified.csv")]
    return tuple(metric + unified)


def threads() -> list[Thread]:
    """Return every thread in the catalog (ISO metric coarse and fine, then UNC and UNF).

    Returns
    -------
    list of Thread
    """
    return list(_all())


_METRIC_RE = re.compile(r"^M(\d+(?:\.\d+)?)(?:X(\d+(?:\.\d+)?))?$")
_UNIFIED_RE = re.compile(r"^(\d+(?:-\d+/\d+)?|\d+/\d+)(?:IN|\")?-(\d+)(UNC|UNF)?(?:-?[123][AB])?$")


def _parse_fraction(text: str) -> float:
    """``"1-1/2"`` -> 1.5, ``"7/16"`` -> 0.4375, ``"1"`` -> 1.0 (exact binary fractions)."""
    from fractions import Fraction

    if "-" in text:
        whole, frac = text.split("-", 1)
        return float(int(whole) + Fraction(frac))
    return float(Fraction(text))


@lru_cache(maxsize=512)
def thread(designation: str) -> Thread:
    """Look up a thread by its designation.

    Accepted forms (case and spaces do not matter, decimal comma allowed):
    ``"M10"`` (coarse), ``"M10x1.25"``, ``"M10 x 1.25"``, ``"m10x1,25"`` (fine; a pitch equal
    to the coarse pitch, ``"M10x1.5"``, resolves to coarse M10), ``"1/2-13 UNC"``,
    ``"1/2-13UNC"``, ``"1/2-20 UNF"``, ``"1-1/2-6 UNC"`` (a tolerance class suffix such as
    ``-2A`` is ignored; without a series the threads per inch decide it).

    Parameters
    ----------
    designation : str
        Thread designation.

    Returns
    -------
    Thread
        The thread with its geometry in SI units.

    Raises
    ------
    InputError
        Unknown designation; the message lists up to five near matches.
    """
    raw = str(designation)
    text = raw.strip().upper().replace("×", "X").replace(",", ".")
    text = re.sub(r"\s+", "", text)
    everything = _all()
    names = [t.designation for t in everything]

    m = _METRIC_RE.match(text)
    if m:
        d_mm = float(m.group(1))
        p_mm = float(m.group(2)) if m.group(2) else None
        metric = [t for t in everything if t.system == "metric"]
        for t in metric:
            if abs(t.d / MM - d_mm) > 1e-9:
                continue
            if p_mm is None and t.series == "coarse":
                return t
            if p_mm is not None and abs(t.P / MM - p_mm) < 1e-9:
                return t
        # nearest sizes first, then nearest pitch (coarse first when no pitch was given)
        metric.sort(
            key=lambda t: (
                abs(t.d / MM - d_mm),
                t.series != "coarse" if p_mm is None else abs(t.P / MM - p_mm),
            )
        )
        near = [t.designation for t in metric[:5]]
        raise unknown("thread", raw, names, _HINT, suggestions=near)

    m = _UNIFIED_RE.match(text)
    if m:
        try:
            d_in = _parse_fraction(m.group(1))
        except (ValueError, ZeroDivisionError):
            raise unknown("thread", raw, names, _HINT) from None
        tpi = int(m.group(2))
        series = m.group(3)
        for t in everything:
            if t.system != "unified" or t.tpi != tpi:
                continue
            if abs(t.d / INCH - d_in) > 1e-9:
                continue
            if series is not None and series != t.series:
                raise InputError(
                    f"thread {raw!r}: {t.designation.rsplit(' ', 1)[0]} is a {t.series} "
                    f"thread, not {series}; did you mean: {t.designation}?"
                )
            return t
        unified = [t for t in everything if t.system == "unified"]
        unified.sort(key=lambda t: (abs(t.d / INCH - d_in), abs((t.tpi or 0) - tpi)))
        near = [t.designation for t in unified[:5]]
        raise unknown("thread", raw, names, _HINT, suggestions=near)

    raise unknown("thread", raw, names, _HINT)
