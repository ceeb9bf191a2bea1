"""Resilience of clamped parts: VDI 2230-1 cone/sleeve, Shigley frusta, Wileman et al.

Three published models of the compressed zone under a bolt head:

* VDI 2230-1 (2015), section 5.1.2 (step R3): a deformation cone of angle phi whose
  tangent is a regression on ``beta_L = l_K/d_W`` and ``y = D'_A/d_W``, turning into a
  sleeve where the cone meets the outer diameter of the part.
* Shigley, Mechanical Engineering Design (9th/10th ed.), chapter 8, "member stiffness":
  frusta of 30 degree half-angle, two of them meeting at mid-grip.
* Wileman, Choudhury and Green, "Computation of member stiffness in bolted connections",
  Journal of Mechanical Design 113 (1991): a fit to finite-element results,
  ``k_m = E d A exp(B d / l)``.

Several plates of different moduli (VDI 2230-1 and Shigley alike): the substitute body
(cone, sleeve) of the whole clamp is cut at the plate boundaries and the slice
resiliences are summed.  The split rule is

* through-bolted joint (``tapped=False``): two cones, each of height ``l_K/2``, with
  their narrow ends at the head and the nut bearing, symmetric about mid-grip;
* tapped thread joint (``tapped=True``, VDI ``w = 2``): one cone of height ``l_K`` from
  the head bearing down to the tapped part;
* where a cone reaches the outer diameter ``D_A`` it continues as a sleeve.

Plates are listed head side first.  A slice between depths ``z1 < z2`` of a cone with
bearing diameter ``d_W``, hole ``d_h`` and ``D(z) = d_W + 2 z tan(phi)`` has::

    delta = ln[ (D1 + d_h)(D2 - d_h) / ((D1 - d_h)(D2 + d_h)) ] / (E pi d_h tan(phi))

(the integral of ``dz / (E pi/4 (D(z)^2 - d_h^2))``), and a sleeve slice
``delta = 4 (z2 - z1) / (E pi (D_A^2 - d_h^2))``.  For one modulus this reproduces the
closed forms of VDI 2230-1 exactly (a test checks it).

Units: SI (m, Pa, m/N, N/m).  Functions that return a *resilience* say so; the Shigley
and Wileman functions return a *stiffness*, as their sources do.
"""

from __future__ import annotations

import math
from collections.abc import Sequence
from typing import Literal

import numpy as np
import numpy.typing as npt

from ._util import FloatArray, as_array, out, require

__all__ = [
    "WILEMAN_COEFFICIENTS",
    "clamped_resilience",
    "cone_limit_diameter",
    "cone_tan_phi",
    "full_cone_outer_diameter",
    "plate_resiliences",
    "shigley_frustum",
    "shigley_members",
    "sleeve_resilience",
    "vdi2230_cone",
    "vdi2230_plates",
    "wileman_1991",
]

#: Wileman, Choudhury and Green (1991), coefficients (A, B) of
#: ``k_m/(E d) = A exp(B d/l)``, as reproduced in Shigley, Mechanical Engineering
#: Design, ch. 8 (table of the stiffness parameters).  Steel from REFERENCE.md as
#: published; the other rows from memory.
WILEMAN_COEFFICIENTS: dict[str, tuple[float, float]] = {
    "steel": (0.78715, 0.62873),
    "aluminium": (0.79670, 0.63816),  # from memory
    "copper": (0.79568, 0.63553),  # from memory
    "grey-cast-iron": (0.77871, 0.61616),  # from memory
    "general": (0.78952, 0.62914),  # from memory
}

_WILEMAN_ALIASES: dict[str, str] = {
    "steel": "steel",
    "stainless": "steel",
    "stainless-steel": "steel",
    "aluminium": "aluminium",
    "aluminum": "aluminium",
    "copper": "copper",
    "brass": "copper",
    "bronze": "copper",
    "grey-cast-iron": "grey-cast-iron",
    "gray-cast-iron": "grey-cast-iron",
    "cast-iron-grey": "grey-cast-iron",
    "cast-iron-gray": "grey-cast-iron",
    "grey-iron": "grey-cast-iron",
    "general": "general",
}


def _wileman_key(material: str) -> str:
    key = material.strip().lower().replace("_", "-").replace(" ", "-")
    if key in _WILEMAN_ALIASES:
        return _WILEMAN_ALIASES[key]
    for prefix, target in (("aluminium", "aluminium"), ("aluminum", "aluminium")):
        if key.startswith(prefix):
            return target
    # Wileman's rows differ by Poisson's ratio; an unlisted family takes the
    # paper's general expression (our choice, stated in wileman_1991).
    return "general"


# --------------------------------------------------------------------------- VDI 2230


def cone_tan_phi(
    lK: FloatArray, dW: FloatArray, DA: FloatArray, tapped: bool = False
) -> FloatArray:
    """Tangent of the VDI 2230-1 deformation cone angle.

    Formula (VDI 2230-1:2015, section 5.1.2.1)::

        through-bolted (DSV):   tan phi_D = 0.362 + 0.032 ln(beta_L/2) + 0.153 ln y
        tapped thread (ESV):    tan phi_E = 0.348 + 0.013 ln(beta_L)   + 0.193 ln y

    with ``beta_L = l_K/d_W`` and ``y = D'_A/d_W``.

    Parameters
    ----------
    lK : float or ndarray
        Clamp length [m], > 0.
    dW : float or ndarray
        Outer diameter of the head (or washer) bearing face [m], > 0.
    DA : float or ndarray
        Substitute outer diameter D'_A of the clamped parts [m], > 0.
    tapped : bool
        ``True`` for a tapped thread joint.

    Returns
    -------
    float or ndarray
        ``tan(phi)`` [-].

    Notes
    -----
    These are regressions on finite-element results; VDI 2230-1 gives them for the
    concentrically clamped, concentrically loaded single-bolt joint.  For a very wide
    part (large ``y``) the fit keeps growing logarithmically; the functions below use it
    as written.
    """
    lK_a, dW_a, DA_a = as_array(lK), as_array(dW), as_array(DA)
    require(lK_a > 0, "clamp length must be positive")
    require(dW_a > 0, "bearing diameter must be positive")
    require(DA_a > 0, "outer diameter must be positive")
    beta_L = lK_a / dW_a
    y = DA_a / dW_a
    if tapped:
        t = 0.348 + 0.013 * np.log(beta_L) + 0.193 * np.log(y)
    else:
        t = 0.362 + 0.032 * np.log(beta_L / 2.0) + 0.153 * np.log(y)
    return out(t)


def cone_limit_diameter(
    lK: FloatArray, dW: FloatArray, DA: FloatArray, tapped: bool = False
) -> FloatArray:
    """Limiting outer diameter of the full deformation cone, ``D_A,Gr = d_W + w l_K tan phi``.

    VDI 2230-1:2015, section 5.1.2.1; ``w = 1`` through-bolted, ``w = 2`` tapped thread
    joint; ``tan phi`` from :func:`cone_tan_phi` with ``y = D'_A/d_W``.

    Parameters
    ----------
    lK, dW, DA : float or ndarray
        Clamp length, bearing diameter, substitute outer diameter [m].
    tapped : bool
        Tapped thread joint.

    Returns
    -------
    float or ndarray
        ``D_A,Gr`` [m].
    """
    w = 2.0 if tapped else 1.0
    t = as_array(cone_tan_phi(lK, dW, DA, tapped))
    return out(as_array(dW) + w * as_array(lK) * t)


def full_cone_outer_diameter(lK: FloatArray, dW: FloatArray, tapped: bool = False) -> FloatArray:
    """Smallest outer diameter at which the full cone forms: ``D'_A = D_A,Gr(D'_A)``.

    The cone angle grows with ``y = D'_A/d_W`` (VDI 2230-1 regression), so "a part wide
    enough for the full cone" is the fixed point ``D = d_W + w l_K tan phi(D/d_W)``.  This
    is our reading used as the default when no outer diameter is given (not a VDI
    formula).  Solved by Newton iteration from the right; the function
    ``f(D) = d_W + w l_K tan phi(D) - D`` is concave, so the iteration converges
    monotonically.

    Parameters
    ----------
    lK, dW : float or ndarray
        Clamp length and bearing diameter [m].
    tapped : bool
        Tapped thread joint (``w = 2``).

    Returns
    -------
    float or ndarray
        ``D'_A`` [m] with ``D'_A = D_A,Gr``.
    """
    lK_a, dW_a = np.broadcast_arrays(as_array(lK), as_array(dW))
    require(lK_a > 0, "clamp length must be positive")
    require(dW_a > 0, "bearing diameter must be positive")
    w = 2.0 if tapped else 1.0
    c = 0.193 if tapped else 0.153
    k = w * lK_a * c
    # Start right of the root: tan phi <= 1 + c ln(y) for any practical beta_L.
    D = dW_a + w * lK_a * 3.0 + 2.0 * k
    for _ in range(100):
        f = dW_a + w * lK_a * as_array(cone_tan_phi(lK_a, dW_a, D, tapped)) - D
        fp = k / D - 1.0
        D_new = D - f / fp
        if np.all(np.abs(D_new - D) <= 1e-14 * D):
            D = D_new
            break
        D = D_new
    return out(D)


def vdi2230_cone(
    lK: FloatArray,
    dW: FloatArray,
    dh: FloatArray,
    DA: FloatArray | None,
    E: FloatArray,
    tapped: bool = False,
) -> FloatArray:
    """Resilience of a homogeneous clamped part after VDI 2230-1 (cone / cone+sleeve / sleeve).

    Formulas (VDI 2230-1:2015, section 5.1.2.1, step R3), ``w = 1`` through-bolted,
    ``w = 2`` tapped, ``t = tan phi`` from :func:`cone_tan_phi`,
    ``D_A,Gr = d_W + w l_K t``:

    * cone, ``D'_A >= D_A,Gr``::

        delta_P = 2 ln[ (d_W+d_h)(d_W + w l_K t - d_h) / ((d_W-d_h)(d_W + w l_K t + d_h)) ]
                  / (w E pi d_h t)

    * cone + sleeve, ``d_W < D'_A < D_A,Gr``::

        delta_P = { 2/(w d_h t) ln[ (d_W+d_h)(D_A-d_h) / ((d_W-d_h)(D_A+d_h)) ]
                    + 4/(D_A^2 - d_h^2) [ l_K - (D_A - d_W)/(w t) ] } / (E pi)

    * sleeve, ``D'_A <= d_W``::

        delta_P = 4 l_K / (E pi (D_A^2 - d_h^2))

    One outer diameter is used both as ``D'_A`` (for ``y``) and as ``D_A``.

    Parameters
    ----------
    lK : float or ndarray
        Clamp length [m].
    dW : float or ndarray
        Outer bearing diameter under head, nut or washer [m].
    dh : float or ndarray
        Hole diameter [m], ``0 < d_h < d_W`` and ``d_h < D_A``.
    DA : float, ndarray or None
        Outer diameter of the clamped part [m]; ``None``: just wide enough for the full
        cone (:func:`full_cone_outer_diameter`).
    E : float or ndarray
        Young's modulus of the clamped part [Pa].
    tapped : bool
        Tapped thread joint (the cone runs from the head to the tapped part).

    Returns
    -------
    float or ndarray
        Resilience delta_P [m/N].

    Notes
    -----
    Validity (VDI 2230-1): concentric clamping, prismatic parts, outer diameter of the
    bearing ``d_W`` larger than the hole; non-circular interfaces use a mean diameter.
    The three cases join continuously at ``D'_A = d_W`` and ``D'_A = D_A,Gr``.

    References
    ----------
    VDI 2230 Part 1 (2015), section 5.1.2.1 (clause number from memory).
    """
    if DA is None:
        DA = full_cone_outer_diameter(lK, dW, tapped)
    lK_a, dW_a, dh_a, DA_a, E_a = np.broadcast_arrays(
        as_array(lK), as_array(dW), as_array(dh), as_array(DA), as_array(E)
    )
    _check_cone_inputs(lK_a, dW_a, dh_a, DA_a, E_a)
    w = 2.0 if tapped else 1.0
    t = as_array(cone_tan_phi(lK_a, dW_a, DA_a, tapped))
    require(t > 0, "cone angle fit gives tan(phi) <= 0: outside the validity of the fit")
    D_gr = dW_a + w * lK_a * t
    with np.errstate(divide="ignore", invalid="ignore"):
        cone = (
            2.0
            * np.log((dW_a + dh_a) * (D_gr - dh_a) / ((dW_a - dh_a) * (D_gr + dh_a)))
            / (w * E_a * math.pi * dh_a * t)
        )
        cone_sleeve = (
            2.0
            / (w * dh_a * t)
            * np.log((dW_a + dh_a) * (DA_a - dh_a) / ((dW_a - dh_a) * (DA_a + dh_a)))
            + 4.0 / (DA_a**2 - dh_a**2) * (lK_a - (DA_a - dW_a) / (w * t))
        ) / (E_a * math.pi)
        sleeve = 4.0 * lK_a / (E_a * math.pi * (DA_a**2 - dh_a**2))
    result = np.where(DA_a >= D_gr, cone, np.where(DA_a > dW_a, cone_sleeve, sleeve))
    return out(result)


def _check_cone_inputs(lK, dW, dh, DA, E) -> None:
    require(lK > 0, "clamp length must be positive")
    require(dh > 0, "hole diameter must be positive")
    require(dW > dh, "bearing diameter d_W must exceed the hole diameter d_h")
    require(DA > dh, "outer diameter D_A must exceed the hole diameter d_h")
    require(np.isfinite(DA), "outer diameter must be finite (None: wide enough for the full cone)")
    require(E > 0, "modulus must be positive")


def _profile_integral(
    z: npt.NDArray[np.float64],
    height: float,
    d0: float,
    dh: float,
    t: float,
    DA: float,
    symmetric: bool,
) -> npt.NDArray[np.float64]:
    """``F(z) = integral_0^z dz' / (pi/4 (D(z')^2 - d_h^2))`` of the substitute body (E = 1).

    ``D(z) = min(d0 + 2 t s, DA)`` with ``s`` the distance to the nearer bearing face
    (``symmetric``) or to the head bearing face.  Units: z, height [m]; result [1/m].
    """

    def half(s: npt.NDArray[np.float64]) -> npt.NDArray[np.float64]:
        if DA <= d0:
            hc = 0.0
        else:
            hc = (DA - d0) / (2.0 * t) if math.isfinite(DA) else math.inf
        sc = np.minimum(s, hc)
        Dz = d0 + 2.0 * t * sc
        if hc > 0.0:
            g = np.log((d0 + dh) * (Dz - dh) / ((d0 - dh) * (Dz + dh))) / (math.pi * dh * t)
        else:
            g = np.zeros_like(s)
        if math.isfinite(DA):
            g = g + np.maximum(s - hc, 0.0) * 4.0 / (math.pi * (DA**2 - dh**2))
        return g

    z = np.clip(z, 0.0, height)
    if not symmetric:
        return half(z)
    mid = 0.5 * height
    g_mid = half(np.asarray(mid))
    return np.where(z <= mid, half(np.minimum(z, mid)), 2.0 * g_mid - half(height - z))


def _slices(
    thicknesses: Sequence[float],
    moduli: Sequence[float],
    d0: float,
    dh: float,
    t: float,
    DA: float,
    symmetric: bool,
) -> npt.NDArray[np.float64]:
    th = np.asarray(thicknesses, dtype=np.float64)
    E = np.asarray(moduli, dtype=np.float64)
    require(th.ndim == 1 and th.size >= 1, "at least one plate is needed")
    require(E.shape == th.shape, "one modulus per plate")
    require(th > 0, "plate thickness must be positive")
    require(E > 0, "plate modulus must be positive")
    z = np.concatenate([[0.0], np.cumsum(th)])
    height = float(z[-1])
    F = _profile_integral(z, height, d0, dh, t, DA, symmetric)
    return np.diff(F) / E


def vdi2230_plates(
    thicknesses: Sequence[float],
    moduli: Sequence[float],
    dW: float,
    dh: float,
    DA: float | None = None,
    tapped: bool = False,
) -> npt.NDArray[np.float64]:
    """Per-plate resiliences of a stack of clamped plates after VDI 2230-1.

    The VDI 2230-1 substitute body of the whole clamp (cone angle from
    :func:`cone_tan_phi` with ``l_K = sum t_i``, cone + sleeve as in
    :func:`vdi2230_cone`) is cut at the plate boundaries; each slice takes its plate's
    modulus, ``delta_Pi = integral dz / (E_i A(z))`` over the plate (VDI 2230-1:2015,
    section 5.1.2, summing the resiliences of parts with different moduli,
    ``delta_P = sum delta_Pi``).  Split rule: through bolt, two cones of height ``l_K/2``
    meeting at mid-grip; tapped, one cone of height ``l_K`` (``w = 2``); plates head
    side first.

    Parameters
    ----------
    thicknesses : sequence of float
        Plate thicknesses [m], head side first (a washer is a plate).
    moduli : sequence of float
        Young's modulus of each plate [Pa].
    dW : float
        Outer bearing diameter [m].
    dh : float
        Hole diameter [m] (one for the stack).
    DA : float, optional
        Outer diameter of the stack [m] (one for the stack; use the smallest or a mean
        for stepped parts); ``None``: wide enough for the full cone.
    tapped : bool
        Tapped thread joint.

    Returns
    -------
    ndarray
        Resilience of each plate [m/N]; their sum is ``delta_P``.
    """
    lK = float(np.sum(np.asarray(thicknesses, dtype=np.float64)))
    require(lK > 0, "clamp length must be positive")
    if DA is None:
        DA = float(full_cone_outer_diameter(lK, dW, tapped))
    _check_cone_inputs(lK, dW, dh, DA, 1.0)
    t = float(cone_tan_phi(lK, dW, DA, tapped))
    require(t > 0, "cone angle fit gives tan(phi) <= 0: outside the validity of the fit")
    return _slices(thicknesses, moduli, float(dW), float(dh), t, float(DA), not tapped)


def sleeve_resilience(
    length: FloatArray, outer_d: FloatArray, inner_d: FloatArray, E: FloatArray
) -> FloatArray:
    """Resilience of a sleeve (hollow cylinder) under axial load, ``delta = L / (E A)``.

    ``A = pi/4 (D_o^2 - D_i^2)``; VDI 2230-1 section 5.1.2 uses the same form for the
    sleeve case and for clamping sleeves; Hooke's law.

    Parameters
    ----------
    length : float or ndarray
        Sleeve length [m], >= 0.
    outer_d, inner_d : float or ndarray
        Outer and inner diameter [m], ``0 <= inner_d < outer_d``.
    E : float or ndarray
        Young's modulus [Pa].

    Returns
    -------
    float or ndarray
        Resilience [m/N].
    """
    L, Do, Di, E_a = (as_array(v) for v in (length, outer_d, inner_d, E))
    require(L >= 0, "sleeve length must not be negative")
    require(Di >= 0, "inner diameter must not be negative")
    require(Do > Di, "outer diameter must exceed the inner diameter")
    require(E_a > 0, "modulus must be positive")
    return out(4.0 * L / (E_a * math.pi * (Do**2 - Di**2)))


# --------------------------------------------------------------------------- Shigley


def shigley_frustum(
    t: FloatArray,
    d: FloatArray,
    D: FloatArray,
    E: FloatArray,
    alpha: float = math.pi / 6,
) -> FloatArray:
    """Stiffness of one member frustum (Shigley, Mechanical Engineering Design, ch. 8).

    Formula (Shigley, 9th/10th ed., section 8-5, eq. (8-19); with alpha = 30 degrees
    eq. (8-20); equation numbers from memory)::

        k = pi E d tan(alpha) / ln[ (2 t tan(alpha) + D - d)(D + d)
                                    / ((2 t tan(alpha) + D + d)(D - d)) ]

    which for ``alpha = 30 deg`` is ``0.5774 pi E d / ln[(1.155 t + D - d)(D + d) /
    ((1.155 t + D + d)(D - d))]``.

    Parameters
    ----------
    t : float or ndarray
        Frustum height [m], > 0.
    d : float or ndarray
        Inner (hole) diameter [m]; Shigley uses the bolt diameter.
    D : float or ndarray
        Smaller outer diameter of the frustum [m], ``D > d``; at a bearing face the
        washer-face diameter, about ``1.5 d``.
    E : float or ndarray
        Young's modulus [Pa].
    alpha : float
        Half apex angle [rad]; 30 degrees by default (Shigley's recommendation).

    Returns
    -------
    float or ndarray
        Stiffness [N/m].
    """
    t_a, d_a, D_a, E_a = (as_array(v) for v in (t, d, D, E))
    require(t_a > 0, "frustum thickness must be positive")
    require(d_a > 0, "hole diameter must be positive")
    require(D_a > d_a, "frustum diameter D must exceed d")
    require(E_a > 0, "modulus must be positive")
    ta = math.tan(alpha)
    num = (2 * t_a * ta + D_a - d_a) * (D_a + d_a)
    den = (2 * t_a * ta + D_a + d_a) * (D_a - d_a)
    return out(math.pi * E_a * d_a * ta / np.log(num / den))


def shigley_members(
    thicknesses: Sequence[float],
    moduli: Sequence[float],
    d: float,
    D: float | None = None,
    alpha: float = math.pi / 6,
) -> npt.NDArray[np.float64]:
    """Per-plate resiliences of members in series by Shigley's frustum method.

    Shigley, Mechanical Engineering Design, ch. 8 ("member stiffness"): the grip is
    split at mid-grip into two frusta, each widening from the bearing face towards the
    middle; plates of different materials split them further, each piece being a frustum
    whose smaller diameter is the cone diameter at its top, ``D + 2 s tan(alpha)``; the
    members act in series, ``1/k_m = sum 1/k_i``.  The slice stiffness is
    :func:`shigley_frustum`.

    Parameters
    ----------
    thicknesses : sequence of float
        Plate thicknesses [m], head side first.
    moduli : sequence of float
        Young's moduli [Pa].
    d : float
        Bolt diameter [m] (Shigley's inner diameter of the frusta).
    D : float, optional
        Washer-face (bearing) diameter [m]; default ``1.5 d`` (Shigley).
    alpha : float
        Half apex angle [rad], default 30 degrees.

    Returns
    -------
    ndarray
        Resilience of each plate [m/N] (``1/k_i`` summed within the plate).
    """
    D = 1.5 * d if D is None else D
    require(d > 0 and D > d, "need 0 < d < D")
    return _slices(thicknesses, moduli, float(D), float(d), math.tan(alpha), math.inf, True)


# --------------------------------------------------------------------------- Wileman


def wileman_1991(
    d: FloatArray, lK: FloatArray, E: FloatArray, material: str = "steel"
) -> FloatArray:
    """Member stiffness after Wileman, Choudhury and Green (1991).

    Formula (Wileman et al., J. Mech. Des. 113 (1991); Shigley, Mechanical Engineering
    Design, ch. 8, eq. (8-23), equation number from memory)::

        k_m = E d A exp(B d / l)

    with ``l = l_K`` the grip and ``(A, B)`` from :data:`WILEMAN_COEFFICIENTS` by material
    family; a family not in the table (e.g. titanium) takes the paper's general
    expression (our choice).

    Parameters
    ----------
    d : float or ndarray
        Bolt diameter [m].
    lK : float or ndarray
        Grip (total thickness of the clamped members) [m].
    E : float or ndarray
        Young's modulus of the members [Pa].
    material : str
        ``"steel"``, ``"aluminium"``, ``"copper"``, ``"grey-cast-iron"`` or ``"general"``
        (aliases accepted).

    Returns
    -------
    float or ndarray
        Member stiffness [N/m].

    Notes
    -----
    Validity: members of one material, through-bolted, wide enough for the pressure
    cone to develop, bearing face of about 1.5 d (from memory); the fit holds over the
    grip ratios of the paper's finite-element study, which are not restated here: check
    the paper before extrapolating to very thin or very thick grips.
    """
    d_a, l_a, E_a = as_array(d), as_array(lK), as_array(E)
    require(d_a > 0, "d must be positive")
    require(l_a > 0, "grip must be positive")
    require(E_a > 0, "modulus must be positive")
    A, B = WILEMAN_COEFFICIENTS[_wileman_key(material)]
    return out(E_a * d_a * A * np.exp(B * d_a / l_a))


# --------------------------------------------------------------------------- front

Plate = tuple[float, float, str]


def plate_resiliences(
    plates: Sequence[Plate],
    dW: float,
    dh: float,
    DA: float | None = None,
    method: Literal["vdi2230", "shigley"] = "vdi2230",
    tapped: bool = False,
    d: float | None = None,
    E_tapped: float | None = None,
) -> npt.NDArray[np.float64]:
    """Resilience of each clamped plate [m/N] by the VDI 2230-1 or Shigley method.

    ``plates`` is a list of ``(thickness [m], modulus [Pa], material_family)`` head side
    first.  ``"vdi2230"``: :func:`vdi2230_plates` (one entry per plate).
    ``"shigley"``: :func:`shigley_members` with the frusta's inner diameter ``d`` (the
    bolt diameter, Shigley's convention; ``d_h`` when ``d`` is not given) and the bearing
    diameter ``d_W``.  For a tapped hole (cap screw), Shigley, ch. 8, takes the effective
    grip ``l' = h + d/2`` when the tapped part is at least ``d`` deep (assumed here): a
    slab ``d/2`` thick of modulus ``E_tapped`` (default: the last plate's) is appended and
    its resilience is returned as an extra last entry.  The Wileman fit has no per-plate
    split and is not offered here.
    """
    _check_plates(plates)
    th = [float(p[0]) for p in plates]
    E = [float(p[1]) for p in plates]
    if method == "vdi2230":
        return vdi2230_plates(th, E, dW, dh, DA, tapped)
    if method == "shigley":
        inner = dh if d is None else d
        if tapped:
            th = [*th, 0.5 * inner]
            E = [*E, E[-1] if E_tapped is None else float(E_tapped)]
        return shigley_members(th, E, inner, dW)
    raise ValueError(f"unknown per-plate method {method!r}; expected 'vdi2230' or 'shigley'")


def _check_plates(plates: Sequence[Plate]) -> None:
    if len(plates) == 0:
        raise ValueError("at least one clamped plate is needed")
    for i, p in enumerate(plates):
        if len(p) != 3:
            raise ValueError(f"plate {i}: expected (thickness, modulus, material_family)")


def clamped_resilience(
    plates: Sequence[Plate],
    dW: float,
    dh: float,
    DA: float | None = None,
    method: Literal["vdi2230", "shigley", "wileman"] = "vdi2230",
    tapped: bool = False,
    d: float | None = None,
    E_tapped: float | None = None,
) -> float:
    """Total resilience of the clamped parts [m/N] by a named published method.

    Parameters
    ----------
    plates : sequence of (thickness, modulus, material_family)
        Clamped plates and washers, head side first; thickness [m], modulus [Pa].
    dW : float
        Outer bearing diameter under head/nut/washer [m].
    dh : float
        Hole diameter [m].
    DA : float, optional
        Outer diameter of the clamped parts [m] (VDI 2230-1 only); ``None`` = full cone.
    method : {"vdi2230", "shigley", "wileman"}
        ``"vdi2230"``: VDI 2230-1 section 5.1.2 (:func:`vdi2230_plates`);
        ``"shigley"``: Shigley ch. 8 frusta (:func:`plate_resiliences`);
        ``"wileman"``: Wileman et al. (1991), :func:`wileman_1991`; it needs ``d``, a
        through bolt and plates of one modulus and family (the paper fitted homogeneous
        members only).
    tapped : bool
        Tapped thread joint.
    d : float, optional
        Bolt diameter [m] (Shigley, Wileman).
    E_tapped : float, optional
        Modulus of the tapped part [Pa] (Shigley with ``tapped``).

    Returns
    -------
    float
        Resilience delta_P [m/N].

    Raises
    ------
    ValueError
        Bad geometry, an unknown method, or a Wileman request outside its scope.
    """
    _check_plates(plates)
    if method in ("vdi2230", "shigley"):
        return float(np.sum(plate_resiliences(plates, dW, dh, DA, method, tapped, d, E_tapped)))
    if method == "wileman":
        if d is None:
            raise ValueError("the Wileman method needs the bolt diameter d")
        if tapped:
            raise ValueError("the Wileman (1991) fit covers through-bolted members only")
        moduli = {float(p[1]) for p in plates}
        families = {_wileman_key(str(p[2])) for p in plates}
        if len(moduli) != 1 or len(families) != 1:
            raise ValueError(
                "the Wileman (1991) fit covers members of one material; "
                "use method 'vdi2230' or 'shigley' for mixed plates"
            )
        lK = float(sum(float(p[0]) for p in plates))
        require(lK > 0, "clamp length must be positive")
        k = float(wileman_1991(d, lK, moduli.pop(), str(plates[0][2])))
        return 1.0 / k
    raise ValueError(f"unknown method {method!r}; expected 'vdi2230', 'shigley' or 'wileman'")
