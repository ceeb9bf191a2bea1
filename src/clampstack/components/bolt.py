"""Bolt resilience (axial elastic compliance) after VDI 2230-1.

The bolt is modelled as cylindrical segments in series (VDI 2230-1:2015,
section 5.1.1, calculation step R3; the clause number is cited from memory)::

    delta_S = delta_SK + sum(delta_i) + delta_Gew + delta_GM
    delta_GM = delta_G + delta_M

with ``delta = l / (E A)`` for each segment and the substitute lengths

=============================  ==========================  ==================
segment                        substitute length           area, modulus
=============================  ==========================  ==================
hexagon head                   l_SK = 0.5 d                A_N, E_S
socket (hexagon socket) head   l_SK = 0.4 d                A_N, E_S
plain shank segment i          l_i                         A_i, E_S
free loaded thread             l_Gew = l_K - sum(l_i)      A_d3, E_S
engaged thread                 l_G = 0.5 d                 A_d3, E_S
nut                            l_M = 0.4 d                 A_N, E_nut
tapped hole (engaged part)     l_M = 0.33 d                A_N, E_tapped
=============================  ==========================  ==================

``A_N = pi d^2 / 4`` (nominal), ``A_d3 = pi d3^2 / 4`` (minor diameter).
A stud has no head: the end that replaces the head is a nut end
(engaged thread + nut), the other end is a nut or a tapped hole.

Everything is SI: lengths in m, areas in m^2, moduli in Pa, resilience in m/N,
stiffness in N/m.  No units library is used inside this module.
"""

from __future__ import annotations

import math
from collections.abc import Sequence
from dataclasses import dataclass
from typing import Literal

import numpy as np

from ._util import FloatArray, as_array, out, require

__all__ = [
    "BoltResilience",
    "BoltSegment",
    "ThreadGeometry",
    "bolt_resilience",
    "cylinder_resilience",
    "default_shank_length",
    "iso4014_thread_length",
    "thread_geometry",
    "HEAD_SUBSTITUTE_LENGTH",
    "ENGAGED_THREAD_SUBSTITUTE_LENGTH",
    "NUT_SUBSTITUTE_LENGTH",
    "TAPPED_HOLE_SUBSTITUTE_LENGTH",
]

#: Head substitute length as a multiple of d (VDI 2230-1, section 5.1.1).
HEAD_SUBSTITUTE_LENGTH: dict[str, float] = {"hex": 0.5, "socket": 0.4}
#: Engaged-thread substitute length l_G / d (VDI 2230-1, section 5.1.1).
ENGAGED_THREAD_SUBSTITUTE_LENGTH = 0.5
#: Nut substitute length l_M / d, through-bolted joint (VDI 2230-1, section 5.1.1).
NUT_SUBSTITUTE_LENGTH = 0.4
#: Tapped-hole substitute length l_M / d, tapped thread joint (VDI 2230-1, section 5.1.1).
TAPPED_HOLE_SUBSTITUTE_LENGTH = 0.33


@dataclass(frozen=True)
class ThreadGeometry:
    """Basic ISO metric thread geometry [m, m^2] (ISO 68-1, ISO 724, ISO 898-1, VDI 2230-1).

    Attributes
    ----------
    d, P : nominal (major) diameter and pitch [m]
    d2 : basic pitch diameter ``d - 0.649519 P`` [m] (ISO 724)
    d3 : minor diameter of the external thread ``d - 1.226869 P`` [m] (ISO 898-1)
    D1 : basic minor diameter of the internal thread ``d - 1.082532 P`` [m] (ISO 724)
    d0 : stress diameter ``(d2 + d3) / 2`` [m] (VDI 2230-1: d_S)
    As : tensile stress area ``pi/4 d0^2`` [m^2] (ISO 898-1)
    Ad3 : minor-diameter area ``pi/4 d3^2`` [m^2] (VDI 2230-1)
    AN : nominal area ``pi/4 d^2`` [m^2] (VDI 2230-1)
    """

    d: float
    P: float
    d2: float
    d3: float
    D1: float
    d0: float
    As: float
    Ad3: float
    AN: float


def thread_geometry(d: float, P: float) -> ThreadGeometry:
    """Basic geometry of an ISO metric thread.

    Formulas: ``d2 = d - 0.649519 P``, ``D1 = d - 1.082532 P`` (ISO 724, from the
    ISO 68-1 basic profile with H = 0.866025 P); ``d3 = d - 1.226869 P`` and
    ``As = pi/4 ((d2 + d3)/2)^2`` (ISO 898-1); ``A_d3``, ``A_N`` as in VDI 2230-1.

    Parameters
    ----------
    d : float
        Nominal diameter [m], > 0.
    P : float
        Pitch [m], ``0 < P < d / 1.226869``.

    Returns
    -------
    ThreadGeometry
    """
    require(d > 0 and P > 0, "thread diameter and pitch must be positive")
    require(1.226869 * P < d, "pitch too coarse for the diameter")
    d2 = d - 0.649519 * P
    d3 = d - 1.226869 * P
    D1 = d - 1.082532 * P
    d0 = 0.5 * (d2 + d3)
    return ThreadGeometry(
        d=float(d),
        P=float(P),
        d2=d2,
        d3=d3,
        D1=D1,
        d0=d0,
        As=math.pi / 4 * d0**2,
        Ad3=math.pi / 4 * d3**2,
        AN=math.pi / 4 * d**2,
    )


def cylinder_resilience(length: FloatArray, area: FloatArray, E: FloatArray) -> FloatArray:
    """Axial resilience of a prismatic bar, ``delta = l / (E A)``.

    Hooke's law for a bar in tension or compression (any strength-of-materials text,
    e.g. Shigley, Mechanical Engineering Design, ch. 4); VDI 2230-1 section 5.1.1 uses it
    for every bolt segment.

    Parameters
    ----------
    length : float or ndarray
        Length [m], >= 0.
    area : float or ndarray
        Cross-section area [m^2], > 0.
    E : float or ndarray
        Young's modulus [Pa], > 0.

    Returns
    -------
    float or ndarray
        Resilience [m/N].
    """
    length_a, area_a, E_a = as_array(length), as_array(area), as_array(E)
    require(length_a >= 0, "length must not be negative")
    require(area_a > 0, "area must be positive")
    require(E_a > 0, "modulus must be positive")
    return out(length_a / (E_a * area_a))


@dataclass(frozen=True)
class BoltSegment:
    """One spring of the bolt model.

    Attributes
    ----------
    name : str
        ``"head"``, ``"shank 1"``, ``"free thread"``, ``"engaged thread"``, ``"nut"``, ...
    length : float
        Real or substitute length [m].
    area : float
        Cross-section area [m^2].
    modulus : float
        Young's modulus used for the segment [Pa].
    resilience : float
        ``length / (modulus * area)`` [m/N].
    """

    name: str
    length: float
    area: float
    modulus: float
    resilience: float


@dataclass(frozen=True)
class BoltResilience:
    """Result of :func:`bolt_resilience`.

    Attributes
    ----------
    segments : tuple of BoltSegment
        Springs in series, head side first.
    total : float
        Bolt resilience delta_S [m/N] (VDI 2230-1, section 5.1.1).
    loaded_length : float
        Length of bolt between the bearing planes, the clamp length l_K [m]; this is
        the length whose thermal strain must match that of the clamped parts.
    free_thread_length : float
        Free loaded thread length l_Gew = l_K - sum(l_i) [m].
    """

    segments: tuple[BoltSegment, ...]
    total: float
    loaded_length: float
    free_thread_length: float

    @property
    def stiffness(self) -> float:
        """Bolt stiffness ``c_S = 1 / delta_S`` [N/m]."""
        return 1.0 / self.total

    @property
    def substitute_length(self) -> float:
        """Sum of the (substitute) segment lengths [m]."""
        return float(sum(s.length for s in self.segments))


def _segment(name: str, length: float, area: float, E: float) -> BoltSegment:
    return BoltSegment(name, float(length), float(area), float(E), float(length / (E * area)))


def bolt_resilience(
    d: float,
    P: float,
    d3: float | None,
    E: float,
    clamp_length: float,
    shank_segments: Sequence[tuple[float, float]] = (),
    head: Literal["hex", "socket"] | None = "hex",
    end: Literal["nut", "tapped"] = "nut",
    E_nut: float | None = None,
    E_tapped: float | None = None,
) -> BoltResilience:
    """Resilience of a bolt or stud after VDI 2230-1, section 5.1.1.

    Formula::

        delta_S = l_SK/(E A_N) + sum l_i/(E A_i) + l_Gew/(E A_d3)
                  + 0.5 d/(E A_d3) + l_M/(E_M A_N)

    with ``l_SK = 0.5 d`` (hex head) or ``0.4 d`` (socket head), ``l_Gew = l_K - sum l_i``,
    ``l_M = 0.4 d`` with ``E_M = E_nut`` for a nut, ``l_M = 0.33 d`` with
    ``E_M = E_tapped`` for a tapped hole.  A stud (``head=None``) has instead of the head
    a second nut end ``0.5 d/(E A_d3) + 0.4 d/(E_nut A_N)``.

    Parameters
    ----------
    d : float
        Nominal diameter [m].
    P : float
        Pitch [m]; used for ``d3`` when it is not given.
    d3 : float or None
        Minor diameter of the bolt thread [m]; ``None``: ``d - 1.226869 P`` (ISO 898-1).
    E : float
        Young's modulus of the bolt [Pa].
    clamp_length : float
        Clamp length l_K between head (or stud nut) bearing and nut bearing or the surface
        of the tapped part [m].
    shank_segments : sequence of (length, diameter)
        Plain (unthreaded) shank segments inside the clamp length, head side first, each
        as ``(length [m], diameter [m])``; a reduced (waisted) shank is one more segment.
    head : {"hex", "socket", None}
        Head form; ``None`` for a stud (nut at that end).
    end : {"nut", "tapped"}
        The far end: a nut (through-bolted joint) or a tapped hole (tapped thread joint).
    E_nut : float, optional
        Modulus of the nut(s) [Pa]; default ``E``.
    E_tapped : float, optional
        Modulus of the part with the tapped hole [Pa]; default ``E``.

    Returns
    -------
    BoltResilience

    Raises
    ------
    ValueError
        If the plain shank is longer than the clamp length, or a length, diameter or
        modulus is not positive, or ``head`` / ``end`` are unknown.

    Notes
    -----
    Validity: the substitute lengths are VDI 2230-1's for standard hexagon head and
    socket head bolts with standard nuts; they assume the engaged thread is long enough
    to develop the bolt load (see the engagement check in :mod:`.strength`).  The shank
    segments are assumed to lie inside the clamp length; the free loaded thread fills the
    rest.

    References
    ----------
    VDI 2230 Part 1 (2015), section 5.1.1 "Resilience of the bolt" (step R3).
    """
    require(d > 0 and P > 0, "d and P must be positive")
    require(E > 0, "bolt modulus must be positive")
    require(clamp_length > 0, "clamp length must be positive")
    if head is not None and head not in HEAD_SUBSTITUTE_LENGTH:
        raise ValueError(f"unknown head {head!r}; expected 'hex', 'socket' or None")
    if end not in ("nut", "tapped"):
        raise ValueError(f"unknown bolt end {end!r}; expected 'nut' or 'tapped'")
    E_nut = E if E_nut is None else E_nut
    E_tapped = E if E_tapped is None else E_tapped
    require(E_nut > 0 and E_tapped > 0, "nut and tapped-part moduli must be positive")
    if d3 is None:
        d3 = d - 1.226869 * P  # ISO 898-1
    require(0 < d3 < d, "d3 must lie between 0 and d")

    AN = math.pi / 4 * d**2
    Ad3 = math.pi / 4 * d3**2
    segs: list[BoltSegment] = []

    if head is None:
        # Stud: the upper end is a nut end (VDI 2230-1, section 5.1.1, delta_G + delta_M).
        segs.append(_segment("top nut", NUT_SUBSTITUTE_LENGTH * d, AN, E_nut))
        segs.append(
            _segment("engaged thread (top nut)", ENGAGED_THREAD_SUBSTITUTE_LENGTH * d, Ad3, E)
        )
    else:
        segs.append(_segment("head", HEAD_SUBSTITUTE_LENGTH[head] * d, AN, E))

    shank_total = 0.0
    for i, seg in enumerate(shank_segments, start=1):
        if len(seg) != 2:
            raise ValueError("each shank segment must be (length, diameter)")
        length, diameter = float(seg[0]), float(seg[1])
        require(length >= 0, f"shank segment {i}: length must not be negative")
        require(diameter > 0, f"shank segment {i}: diameter must be positive")
        shank_total += length
        if length > 0:
            segs.append(_segment(f"shank {i}", length, math.pi / 4 * diameter**2, E))

    # Tolerance of 1e-9 l_K for round-off in a caller's sum of lengths.
    if shank_total > clamp_length * (1 + 1e-9):
        raise ValueError(
            f"plain shank length {shank_total * 1e3:.6g} mm exceeds the clamp length "
            f"{clamp_length * 1e3:.6g} mm"
        )
    l_gew = max(clamp_length - shank_total, 0.0)
    if l_gew > 0:
        segs.append(_segment("free thread", l_gew, Ad3, E))

    segs.append(_segment("engaged thread", ENGAGED_THREAD_SUBSTITUTE_LENGTH * d, Ad3, E))
    if end == "nut":
        segs.append(_segment("nut", NUT_SUBSTITUTE_LENGTH * d, AN, E_nut))
    else:
        segs.append(_segment("tapped hole", TAPPED_HOLE_SUBSTITUTE_LENGTH * d, AN, E_tapped))

    total = float(sum(s.resilience for s in segs))
    return BoltResilience(
        segments=tuple(segs),
        total=total,
        loaded_length=float(clamp_length),
        free_thread_length=float(l_gew),
    )


def iso4014_thread_length(d: FloatArray, length: FloatArray) -> FloatArray:
    """Reference thread length b of a partially threaded hexagon head bolt (ISO 4014).

    Formula (ISO 4014, table of dimensions, "b ref")::

        b = 2 d + 6 mm    for l <= 125 mm
        b = 2 d + 12 mm   for 125 mm < l <= 200 mm
        b = 2 d + 25 mm   for l > 200 mm

    Parameters
    ----------
    d : float or ndarray
        Nominal diameter [m].
    length : float or ndarray
        Nominal length l under the head [m].

    Returns
    -------
    float or ndarray
        Thread length b [m].
    """
    d_a, l_a = as_array(d), as_array(length)
    require(d_a > 0, "d must be positive")
    require(l_a > 0, "bolt length must be positive")
    extra = np.where(l_a <= 0.125, 0.006, np.where(l_a <= 0.200, 0.012, 0.025))
    return out(2.0 * d_a + extra)


def default_shank_length(d: FloatArray, length: FloatArray) -> FloatArray:
    """Default plain shank length of an ISO 4014 bolt, ``l - b``, not below 0.

    Formula: ``l_shank = max(l - b, 0)`` with ``b`` from :func:`iso4014_thread_length`
    (ISO 4014); 0 means the bolt is fully threaded (as an ISO 4017 screw).  The run-out
    between shank and thread is not modelled separately (common practice, no source).

    Parameters
    ----------
    d : float or ndarray
        Nominal diameter [m].
    length : float or ndarray
        Nominal length under the head [m].

    Returns
    -------
    float or ndarray
        Plain shank length [m].
    """
    b = as_array(iso4014_thread_length(d, length))
    return out(np.maximum(as_array(length) - b, 0.0))
