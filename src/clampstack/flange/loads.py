"""The loads of a gasketed flange: ASME BPVC VIII-1 Appendix 2 bolt loads and the working
load per bolt, shared between the bolt circle and the gasket (see :mod:`.analysis`)."""

from __future__ import annotations

import math
from dataclasses import dataclass

import numpy as np

from .model import FlangeSpec

INCH = 0.0254


@dataclass(frozen=True)
class App2:
    """ASME BPVC VIII-1 Appendix 2 quantities (SI)."""

    b0: float
    b: float
    G: float
    H: float
    Hp: float
    Wm1: float
    Wm2: float
    Am: float
    Ab: float
    external: float = 0.0  # F + 4 M / G, the external axial force and moment once [N]
    W: float = 0.0  # flange design bolt load (A_m + A_b) S_a / 2 [N]
    area_basis: str = ""  # which bolt root area A_b stands on


def asme_app2(spec: FlangeSpec) -> App2:
    """Operating and seating bolt loads and bolt areas, ASME BPVC VIII-1 Appendix 2, 2-5."""
    g = spec.gasket
    width = 0.5 * (g.outer_diameter - g.inner_diameter)
    b0 = 0.5 * width  # Table 2-5.2, sketch (1a): flat ring on a raised face
    if b0 <= 0.25 * INCH:
        b = b0
        G = 0.5 * (g.outer_diameter + g.inner_diameter)
    else:
        b = 0.5 * math.sqrt(b0 / INCH) * INCH
        G = g.outer_diameter - 2 * b
    P = spec.pressure
    H = 0.785 * G**2 * P
    Hp = 2 * b * 3.14 * G * g.m * P
    Wm2 = 3.14 * b * G * g.y
    # the external axial force F and moment M enter once, as bolt load: W_m1 = H + H_p + F
    # + 4 M / G with H and H_p at the design pressure (the form of ASME BPVC VIII-2, 4.16.6,
    # from memory; App. 2 itself covers the pressure only). A compressive F is given no
    # credit (conservative; our rule).
    external = max(spec.axial_force, 0.0) + 4 * abs(spec.bending_moment) / G
    Wm1 = H + Hp + external
    Am = max(Wm1 / spec.allowable_stress, Wm2 / spec.allowable_stress_ambient)
    # root area of the thread: pi/4 d3^2 with the basic minor diameter d3 = d - 1.226869 P
    # (ISO 898-1; ASME B1.1 profile for unified threads); the catalog holds no tabulated
    # minor-diameter areas, so this computed one is used and named in the output
    Ab = spec.bolt_count * spec.thread.Ad3
    basis = "root area pi/4 d3^2, d3 = d - 1.226869 P (ISO 898-1 basic minor diameter)"
    W = (Am + Ab) * spec.allowable_stress_ambient / 2  # App. 2-5(e), flange design bolt load
    return App2(b0, b, G, H, Hp, Wm1, Wm2, Am, Ab, external, W, basis)


def working_loads(spec: FlangeSpec, G: float) -> np.ndarray:
    """Axial working load per bolt [N]: (H + F)/N + 4 M cos(theta_i)/(N D_bc)."""
    n = spec.bolt_count
    theta = 2 * math.pi * np.arange(n) / n
    H = math.pi / 4 * G**2 * spec.pressure
    return (H + spec.axial_force) / n + 4 * spec.bending_moment * np.cos(theta) / (
        n * spec.bolt_circle
    )


def load_split(spec: FlangeSpec, G: float, rotation: bool) -> tuple[np.ndarray, np.ndarray]:
    """The working load per bolt shared between the ring at the bolt (U) and over the gasket (F).

    Without rotation every load acts on the face over the gasket.  With rotation each
    load acts at its own radius (ASME BPVC VIII-1 Appendix 2, 2-3, loose-type flange
    moment arms, from memory): the end force on the bore ``H_D = pi/4 B^2 P`` with the
    external force and moment at ``h_D = (C - B)/2``, the pressure on the face
    ``H_T = H - H_D`` at ``h_T = (h_D + h_G)/2``, measured in from the bolt circle C; a
    load at arm ``a`` is shared as ``1 - a/h_G`` on the bolt's node and ``a/h_G`` on the
    gasket's (the same virtual work on a rigid ring section).  Returns (at U, at F) [N].
    """
    FA = working_loads(spec, G)
    if not rotation:
        return np.zeros_like(FA), FA
    n = spec.bolt_count
    B, C = spec.ring_inner_diameter, spec.bolt_circle
    hG = 0.5 * (C - G)
    hD = 0.5 * (C - B)
    hT = 0.5 * (hD + hG)
    H = math.pi / 4 * G**2 * spec.pressure
    HD = math.pi / 4 * B**2 * spec.pressure
    on_T = np.full(n, (H - HD) / n)
    on_D = FA - on_T  # end force, external force and moment, at the bore
    at_F = on_D * hD / hG + on_T * hT / hG
    return FA - at_F, at_F
