"""Tightening: torque-preload relation, permissible assembly preload, assembly stress.

Sources: VDI 2230-1:2015, calculation steps R1 (tightening factor, Table A8), R7
(assembly stress and permissible assembly preload, section 5.5.1) and R13 (tightening
torque, section 5.5); ISO 16047:2005 (torque/clamp force testing, the definitions of the
thread and bearing friction coefficients).  VDI clause and table numbers are cited from
memory; the calculation steps R0..R13 are VDI 2230-1's.

Units: SI (m, N, N*m, Pa).  All functions are vectorised over numpy arrays.
"""

from __future__ import annotations

import math
from dataclasses import dataclass
from typing import Literal

import numpy as np

from ._util import FloatArray, as_array, out, require

__all__ = [
    "CombinedStress",
    "TIGHTENING_FACTOR_RANGES",
    "assembly_stress",
    "assembly_torque",
    "bearing_diameter_default",
    "effective_bearing_diameter",
    "head_torque",
    "iso16047_head_friction",
    "iso16047_thread_friction",
    "permissible_preload",
    "friction_from_nut_factor",
    "preload_from_torque",
    "thread_torque",
    "tightening_factor",
    "torsional_section_modulus",
    "yield_controlled_preload_range",
]

#: 1 / cos(30 deg) = 1.1547: the flank-angle factor of the 60 degree ISO thread (VDI 2230-1
#: writes 1.155; ISO 16047 writes 0.577 = 1/(2 cos 30 deg) for d2 mu/2 terms).
_FLANK = 1.0 / math.cos(math.radians(30.0))


def effective_bearing_diameter(dW: FloatArray, dh: FloatArray) -> FloatArray:
    """Effective diameter of the friction moment at the head bearing, ``D_Km = (d_W + d_h)/2``.

    VDI 2230-1:2015, section 5.5 (tightening torque, R13); ISO 16047 uses the same mean
    ``D_b = (d_o + d_h)/2`` of the bearing annulus.

    Parameters
    ----------
    dW : float or ndarray
        Outer bearing diameter [m].
    dh : float or ndarray
        Hole (inner bearing) diameter [m].

    Returns
    -------
    float or ndarray
        ``D_Km`` [m].
    """
    dW_a, dh_a = as_array(dW), as_array(dh)
    require(dW_a > dh_a, "bearing diameter must exceed the hole diameter")
    require(dh_a >= 0, "hole diameter must not be negative")
    return out(0.5 * (dW_a + dh_a))


def bearing_diameter_default(
    head: Literal["hex", "socket", "nut"], s: float | None = None, dk: float | None = None
) -> float:
    """Default outer bearing diameter d_W of a standard head or nut.

    * ``"hex"`` / ``"nut"``: ``d_W = s`` (width across flats).  With ``d_W = s`` and
      medium clearance holes (ISO 273) the tightening torques of VDI 2230-1 Table A1, as
      recalled from memory, are reproduced within about 2 % (see
      ``tests/validation/test_vdi2230.py``); the table's own stated basis is not
      restated here.  The real bearing face ``d_w,min`` of ISO 4014 / ISO 4032 is somewhat
      smaller (about 0.9 s, from memory), so ``s`` slightly overstates the head friction
      torque and understates the surface pressure: pass the standard's ``d_w,min``
      instead where the surface pressure governs.
    * ``"socket"``: ``d_W = d_k``, the head diameter of an ISO 4762 screw (common
      practice, no source; the edge radius makes the true bearing ring a little smaller).

    Parameters
    ----------
    head : {"hex", "socket", "nut"}
        Head or nut form.
    s : float, optional
        Width across flats [m] (hex, nut).
    dk : float, optional
        Head diameter [m] (socket).

    Returns
    -------
    float
        ``d_W`` [m].
    """
    if head in ("hex", "nut"):
        if s is None or not s > 0:
            raise ValueError("a hexagon head or nut needs the width across flats s > 0")
        return float(s)
    if head == "socket":
        if dk is None or not dk > 0:
            raise ValueError("a socket head needs the head diameter dk > 0")
        return float(dk)
    raise ValueError(f"unknown head {head!r}; expected 'hex', 'socket' or 'nut'")


def _check_common(F, P, d2, muG) -> None:
    require(as_array(P) > 0, "pitch must be positive")
    require(as_array(d2) > 0, "pitch diameter must be positive")
    require(as_array(muG) >= 0, "thread friction must not be negative")
    require(np.isfinite(as_array(F)), "force must be finite")


def thread_torque(
    F: FloatArray, P: FloatArray, d2: FloatArray, muG: FloatArray, exact: bool = False
) -> FloatArray:
    """Thread torque M_G of a 60 degree ISO thread.

    Formulas (VDI 2230-1:2015, section 5.5.1)::

        exact:        M_G = F (d2/2) tan(phi + rho'),  tan phi = P/(pi d2),
                      tan rho' = mu_G / cos(30 deg) = 1.155 mu_G
        approximate:  M_G = F (d2/2) (P/(pi d2) + 1.155 mu_G)

    The approximate form replaces ``tan(phi + rho')`` by ``tan phi + tan rho'`` (exact to
    first order; a little low, by the factor ``1 - tan phi tan rho'`` of about 1 %); it is
    the form inside VDI 2230-1's permissible preload and torque equations and ISO 16047's
    definitions.

    Parameters
    ----------
    F : float or ndarray
        Preload [N].
    P : float or ndarray
        Pitch [m].
    d2 : float or ndarray
        Pitch diameter [m].
    muG : float or ndarray
        Thread friction coefficient [-].
    exact : bool
        Use ``tan(phi + rho')``.

    Returns
    -------
    float or ndarray
        Thread torque [N*m].
    """
    _check_common(F, P, d2, muG)
    F_a, P_a, d2_a, mu_a = (as_array(v) for v in (F, P, d2, muG))
    tan_phi = P_a / (math.pi * d2_a)
    if exact:
        factor = np.tan(np.arctan(tan_phi) + np.arctan(_FLANK * mu_a))
    else:
        factor = tan_phi + _FLANK * mu_a
    return out(F_a * 0.5 * d2_a * factor)


def head_torque(F: FloatArray, muK: FloatArray, DKm: FloatArray) -> FloatArray:
    """Head (or nut) bearing friction torque ``M_K = F mu_K D_Km / 2``.

    VDI 2230-1:2015, section 5.5 (R13); ISO 16047 (bearing friction torque ``T_b``).

    Parameters
    ----------
    F : float or ndarray
        Preload [N].
    muK : float or ndarray
        Bearing friction coefficient [-].
    DKm : float or ndarray
        Effective bearing friction diameter [m].

    Returns
    -------
    float or ndarray
        Torque [N*m].
    """
    F_a, mu_a, D_a = as_array(F), as_array(muK), as_array(DKm)
    require(mu_a >= 0, "bearing friction must not be negative")
    require(D_a > 0, "bearing diameter must be positive")
    return out(F_a * mu_a * 0.5 * D_a)


def _torque_coefficient(P, d2, muG, muK, DKm):
    """``M_A / F`` [m] of VDI 2230-1 / ISO 16047."""
    return 0.16 * P + 0.58 * d2 * muG + 0.5 * muK * DKm


def friction_from_nut_factor(
    K: FloatArray, d: FloatArray, P: FloatArray, d2: FloatArray, DKm: FloatArray
) -> FloatArray:
    """The friction coefficient (thread and bearing face alike) that a nut factor implies.

    The short-form torque relation ``T = K F d`` (Shigley, *Mechanical Engineering
    Design*, eq. 8-27; K lumps pitch, friction and geometry) equals VDI 2230-1 R13 /
    ISO 16047 ``T = F (0.16 P + 0.58 d2 mu_G + mu_K D_Km / 2)`` with ``mu_G = mu_K = mu``
    when ``mu = (K d - 0.16 P) / (0.58 d2 + D_Km / 2)``.  SI units; the result may be
    negative for a nut factor too small for the thread (the caller refuses it).
    """
    K_a, d_a, P_a, d2_a, D_a = (as_array(v) for v in (K, d, P, d2, DKm))
    return out((K_a * d_a - 0.16 * P_a) / (0.58 * d2_a + 0.5 * D_a))


def assembly_torque(
    F: FloatArray,
    P: FloatArray,
    d2: FloatArray,
    muG: FloatArray,
    muK: FloatArray,
    DKm: FloatArray,
) -> FloatArray:
    """Tightening torque for a preload, ``M_A = F (0.16 P + 0.58 d2 mu_G + mu_K D_Km/2)``.

    VDI 2230-1:2015, section 5.5 (tightening torque, step R13); ISO 16047:2005 (the
    thread torque ``P/(2 pi) + 0.577 d2 mu_th`` per newton and the bearing torque
    ``mu_b D_b/2``).  ``0.16 P ~ P/(2 pi)`` is the pitch (useful work) term,
    ``0.58 d2 mu_G ~ d2 mu_G/(2 cos 30 deg)`` the thread friction term.

    Parameters
    ----------
    F : float or ndarray
        Assembly preload [N].
    P : float or ndarray
        Pitch [m].
    d2 : float or ndarray
        Pitch diameter [m].
    muG : float or ndarray
        Thread friction coefficient [-].
    muK : float or ndarray
        Head (bearing) friction coefficient [-].
    DKm : float or ndarray
        Effective bearing friction diameter ``(d_W + d_h)/2`` [m].

    Returns
    -------
    float or ndarray
        Tightening torque [N*m].

    Notes
    -----
    Validity: ISO metric (60 degree) threads, right-hand, torque applied at the head or
    nut that turns against a flat bearing face; prevailing torque (locking elements)
    must be added separately.
    """
    _check_common(F, P, d2, muG)
    F_a, P_a, d2_a, muG_a, muK_a, D_a = (as_array(v) for v in (F, P, d2, muG, muK, DKm))
    require(muK_a >= 0, "bearing friction must not be negative")
    require(D_a > 0, "bearing diameter must be positive")
    return out(F_a * _torque_coefficient(P_a, d2_a, muG_a, muK_a, D_a))


def preload_from_torque(
    T: FloatArray,
    P: FloatArray,
    d2: FloatArray,
    muG: FloatArray,
    muK: FloatArray,
    DKm: FloatArray,
) -> FloatArray:
    """Preload produced by a tightening torque: the inverse of :func:`assembly_torque`.

    ``F_M = M_A / (0.16 P + 0.58 d2 mu_G + mu_K D_Km/2)`` (VDI 2230-1:2015, section 5.5,
    R13, solved for the preload).

    Parameters
    ----------
    T : float or ndarray
        Tightening torque [N*m].
    P, d2, muG, muK, DKm
        As in :func:`assembly_torque`.

    Returns
    -------
    float or ndarray
        Preload [N].
    """
    _check_common(T, P, d2, muG)
    T_a, P_a, d2_a, muG_a, muK_a, D_a = (as_array(v) for v in (T, P, d2, muG, muK, DKm))
    require(muK_a >= 0, "bearing friction must not be negative")
    require(D_a > 0, "bearing diameter must be positive")
    return out(T_a / _torque_coefficient(P_a, d2_a, muG_a, muK_a, D_a))


def iso16047_thread_friction(
    T_th: FloatArray, F: FloatArray, P: FloatArray, d2: FloatArray
) -> FloatArray:
    """Thread friction coefficient from a measured thread torque (ISO 16047).

    ``mu_th = (T_th/F - P/(2 pi)) / (0.577 d2)`` (ISO 16047:2005, definition of the
    thread friction coefficient; 0.577 = 1/(2 cos 30 deg)).  Here ``0.5 d2/cos 30 deg`` is
    used unrounded.

    Parameters
    ----------
    T_th : float or ndarray
        Thread torque [N*m].
    F : float or ndarray
        Clamp force [N], > 0.
    P, d2 : float or ndarray
        Pitch and pitch diameter [m].

    Returns
    -------
    float or ndarray
        ``mu_th`` [-].
    """
    T_a, F_a, P_a, d2_a = (as_array(v) for v in (T_th, F, P, d2))
    require(F_a > 0, "clamp force must be positive")
    return out((T_a / F_a - P_a / (2 * math.pi)) / (0.5 * d2_a * _FLANK))


def iso16047_head_friction(T_b: FloatArray, F: FloatArray, Db: FloatArray) -> FloatArray:
    """Bearing friction coefficient from a measured bearing torque, ``mu_b = 2 T_b/(D_b F)``.

    ISO 16047:2005 (definition of the under-head friction coefficient).

    Parameters
    ----------
    T_b : float or ndarray
        Bearing (under-head) torque [N*m].
    F : float or ndarray
        Clamp force [N], > 0.
    Db : float or ndarray
        Effective bearing diameter [m].

    Returns
    -------
    float or ndarray
        ``mu_b`` [-].
    """
    T_a, F_a, D_a = as_array(T_b), as_array(F), as_array(Db)
    require(F_a > 0, "clamp force must be positive")
    require(D_a > 0, "bearing diameter must be positive")
    return out(2.0 * T_a / (D_a * F_a))


def permissible_preload(
    As: FloatArray,
    d0: FloatArray,
    d2: FloatArray,
    P: FloatArray,
    Rp02: FloatArray,
    muG_min: FloatArray,
    nu: FloatArray = 0.9,
) -> FloatArray:
    """Permissible assembly preload F_M,zul (VDI 2230-1, step R7).

    Formula (VDI 2230-1:2015, section 5.5.1)::

        F_M,zul = A0 nu R_p0.2min
                  / sqrt(1 + 3 [ (3/2) (d2/d0) (P/(pi d2) + 1.155 mu_G,min) ]^2)

    with ``A0 = A_s`` and ``d0 = d_S = (d2 + d3)/2`` for standard bolts (``A0`` the
    smallest cross-section and ``d0`` its diameter for a waisted shank).  The factor
    ``3/2`` corresponds to the torsional stress with the fully plastic section modulus
    ``pi d0^3/12`` (see :func:`assembly_stress` with ``plastic=True``; our reading).

    Parameters
    ----------
    As : float or ndarray
        Stress cross-section A0 [m^2].
    d0 : float or ndarray
        Its diameter [m].
    d2 : float or ndarray
        Pitch diameter [m].
    P : float or ndarray
        Pitch [m].
    Rp02 : float or ndarray
        Minimum 0.2 % proof stress / yield point of the bolt [Pa].
    muG_min : float or ndarray
        Smallest thread friction coefficient expected [-].
    nu : float or ndarray
        Utilisation of the yield point by the equivalent stress at assembly, 0.9 by
        default (VDI 2230-1).

    Returns
    -------
    float or ndarray
        ``F_M,zul`` [N].
    """
    As_a, d0_a, d2_a, P_a, Rp_a, mu_a, nu_a = (
        as_array(v) for v in (As, d0, d2, P, Rp02, muG_min, nu)
    )
    require(As_a > 0, "stress area must be positive")
    require(d0_a > 0, "stress diameter must be positive")
    require(Rp_a > 0, "yield strength must be positive")
    require((nu_a > 0) & (nu_a <= 1.0), "utilisation nu must lie in (0, 1]")
    _check_common(0.0, P_a, d2_a, mu_a)
    k = 1.5 * d2_a / d0_a * (P_a / (math.pi * d2_a) + _FLANK * mu_a)
    return out(As_a * nu_a * Rp_a / np.sqrt(1.0 + 3.0 * k**2))


def torsional_section_modulus(d0: FloatArray, plastic: bool = False) -> FloatArray:
    """Polar section modulus of a round section: ``pi d0^3/16`` elastic, ``pi d0^3/12`` plastic.

    Elastic: any strength-of-materials text (Shigley, ch. 3); VDI 2230-1 uses
    ``W_P = pi d0^3/16`` for the assembly and working torsional stress.  Fully plastic
    (uniform shear stress over the section): ``2 pi r^3/3 = pi d^3/12``.

    Parameters
    ----------
    d0 : float or ndarray
        Diameter [m].
    plastic : bool
        Fully plastic modulus.

    Returns
    -------
    float or ndarray
        ``W_P`` [m^3].
    """
    d0_a = as_array(d0)
    require(d0_a > 0, "diameter must be positive")
    return out(math.pi * d0_a**3 / (12.0 if plastic else 16.0))


@dataclass(frozen=True)
class CombinedStress:
    """Tension, torsion and von Mises equivalent stress of a bolt section [Pa].

    Attributes
    ----------
    sigma : float or ndarray
        Axial (tensile) stress [Pa].
    tau : float or ndarray
        Torsional shear stress used in the equivalent stress (already multiplied by any
        reduction factor) [Pa].
    sigma_red : float or ndarray
        ``sqrt(sigma^2 + 3 tau^2)`` [Pa].
    """

    sigma: FloatArray
    tau: FloatArray
    sigma_red: FloatArray


def assembly_stress(
    F: FloatArray,
    P: FloatArray,
    d2: FloatArray,
    d0: FloatArray,
    muG: FloatArray,
    A0: FloatArray | None = None,
    plastic: bool = False,
) -> CombinedStress:
    """Equivalent (von Mises) stress in the bolt at assembly, tension plus thread torsion.

    Formulas (VDI 2230-1:2015, section 5.5.1, step R7)::

        sigma_M   = F_M / A0
        tau_M     = M_G / W_P,  M_G from :func:`thread_torque` (approximate form)
        sigma_red = sqrt(sigma_M^2 + 3 tau_M^2)

    Parameters
    ----------
    F : float or ndarray
        Assembly preload [N].
    P, d2 : float or ndarray
        Pitch and pitch diameter [m].
    d0 : float or ndarray
        Diameter of the critical cross-section [m] (``(d2 + d3)/2`` for a standard bolt).
    muG : float or ndarray
        Thread friction [-].
    A0 : float or ndarray, optional
        Critical cross-section [m^2]; default ``pi d0^2/4``.
    plastic : bool
        Use the fully plastic section modulus ``pi d0^3/12`` (consistent with the
        ``3/2`` factor of :func:`permissible_preload`); default elastic ``pi d0^3/16``.

    Returns
    -------
    CombinedStress
    """
    d0_a = as_array(d0)
    A0_a = math.pi / 4 * d0_a**2 if A0 is None else as_array(A0)
    require(A0_a > 0, "cross-section must be positive")
    MG = as_array(thread_torque(F, P, d2, muG))
    sigma = as_array(F) / A0_a
    tau = MG / as_array(torsional_section_modulus(d0_a, plastic))
    return CombinedStress(out(sigma), out(tau), out(np.sqrt(sigma**2 + 3.0 * tau**2)))


#: VDI 2230-1:2015, Table A8 (from memory): guide ranges (low, high) of the tightening
#: factor alpha_A = F_M,max/F_M,min by method.
TIGHTENING_FACTOR_RANGES: dict[str, tuple[float, float]] = {
    "ultrasonic": (1.05, 1.2),  # elongation-controlled with ultrasound
    "elongation": (1.1, 1.5),  # mechanical elongation measurement
    "tension": (1.2, 1.6),  # hydraulic tensioning
    "torque-tested": (1.4, 1.6),  # torque wrench, torque set by tests on the original parts
    "torque-estimated": (1.6, 2.0),  # torque wrench, friction estimated (friction class B)
    "torque-rough": (1.7, 2.5),  # torque wrench, friction estimated (friction class A)
    "impact": (2.5, 4.0),  # impact or impulse wrench
    "yield": (1.2, 1.4),  # scatter of F_M from the bolts' yield point scatter
    "angle": (1.2, 1.4),  # as yield-controlled
}


def tightening_factor(
    method: str,
    friction_known: bool = False,
    bound: Literal["upper", "lower", "mid"] = "upper",
) -> float:
    """Tightening factor alpha_A for the design (VDI 2230-1, step R1, Table A8, from memory).

    * ``"torque"``: torque wrench; ``friction_known=True`` (tightening torque found by
      tests on the original parts) 1.4..1.6, otherwise (friction estimated) 1.6..2.0.
    * ``"tension"`` (hydraulic) 1.2..1.6; ``"ultrasonic"`` 1.05..1.2; ``"elongation"``
      1.1..1.5; ``"impact"`` 2.5..4.0; ``"torque-rough"`` 1.7..2.5.
    * ``"yield"`` and ``"angle"``: 1.0.  VDI 2230-1 sizes the bolt for F_M,min here; the
      preload scatter (1.2..1.4 in the table) comes from the bolts' yield point scatter,
      see :func:`yield_controlled_preload_range`.

    Within a range the ``bound`` picks the value; the default is the upper end, which is
    conservative for both F_M,max and F_M,min (our choice; override with a measured
    scatter where known).

    Parameters
    ----------
    method : str
        Tightening method (see above).
    friction_known : bool
        For ``"torque"``: the torque was set by tests on the original parts.
    bound : {"upper", "lower", "mid"}
        Which end of the guide range.

    Returns
    -------
    float
        alpha_A [-], >= 1.
    """
    key = method.strip().lower()
    if key in ("yield", "angle"):
        return 1.0
    if key == "torque":
        key = "torque-tested" if friction_known else "torque-estimated"
    if key == "hydraulic":
        key = "tension"
    if key not in TIGHTENING_FACTOR_RANGES:
        raise ValueError(
            f"unknown tightening method {method!r}; expected one of "
            f"torque, {', '.join(TIGHTENING_FACTOR_RANGES)}"
        )
    lo, hi = TIGHTENING_FACTOR_RANGES[key]
    if bound == "upper":
        return hi
    if bound == "lower":
        return lo
    if bound == "mid":
        return 0.5 * (lo + hi)
    raise ValueError(f"unknown bound {bound!r}; expected 'upper', 'lower' or 'mid'")


def yield_controlled_preload_range(
    As: FloatArray,
    d0: FloatArray,
    d2: FloatArray,
    P: FloatArray,
    Rp02_min: FloatArray,
    muG_min: FloatArray,
    muG_max: FloatArray,
    yield_ratio: float = 1.2,
) -> tuple[FloatArray, FloatArray]:
    """Preload range of yield- or angle-controlled tightening (to the yield point).

    Tightened to yield, the equivalent stress reaches the yield point (``nu = 1`` in
    :func:`permissible_preload`, VDI 2230-1 step R7).  Assumptions (ours, stated):

    * ``F_M,min`` = the permissible-preload formula with ``nu = 1``, ``R_p0.2min`` and the
      largest thread friction ``mu_G,max`` (more torsion, less tension at yield);
    * ``F_M,max`` = the same with ``R_p0.2max = yield_ratio R_p0.2min`` and ``mu_G,min``;
      ``yield_ratio = 1.2`` is VDI 2230-1's assumption for the upper yield point of a
      bolt lot (from memory).

    Parameters
    ----------
    As, d0, d2, P : float or ndarray
        As in :func:`permissible_preload` [m^2, m].
    Rp02_min : float or ndarray
        Minimum 0.2 % proof stress [Pa].
    muG_min, muG_max : float or ndarray
        Thread friction range [-].
    yield_ratio : float
        ``R_p0.2max/R_p0.2min`` [-], default 1.2 (from memory).

    Returns
    -------
    (F_M,min, F_M,max) : tuple of float or ndarray
        Preloads [N].
    """
    require(yield_ratio >= 1.0, "yield_ratio must be >= 1")
    require(as_array(muG_max) >= as_array(muG_min), "muG_max must be >= muG_min")
    f_min = permissible_preload(As, d0, d2, P, Rp02_min, muG_max, nu=1.0)
    f_max = permissible_preload(As, d0, d2, P, as_array(Rp02_min) * yield_ratio, muG_min, nu=1.0)
    return f_min, f_max


#: Plastic strain of the bolt's free loaded length between the yield point and the tensile
#: strength, for the bilinear hardening law of angle tightening (from memory: quenched and
#: tempered bolt steels of classes 8.8 to 12.9 reach R_m at about 2 % plastic strain over the
#: loaded length; an approximation of ours, stated in the output).
HARDENING_STRAIN = 0.02


def angle_preload(
    F_snug: FloatArray,
    angle: FloatArray,
    P: float,
    delta_S: float,
    delta_P: float,
    F_yield: FloatArray,
    F_ultimate: FloatArray,
    loaded_length: float,
) -> tuple[np.ndarray, np.ndarray, np.ndarray]:
    """Preload after turning the nut by ``angle`` [rad] from the snug preload ``F_snug`` [N].

    The turn stretches bolt and clamped parts together by ``P angle / (2 pi)`` (the lead of
    a single-start thread).  Elastic: ``F = F_snug + P angle / (2 pi (delta_S + delta_P))``
    (VDI 2230-1, joint resilience; from the compatibility of bolt and parts).  Past
    ``F_yield`` (the yield preload under tension and thread torsion, VDI 2230-1 R7 with
    ``nu = 1``) the bolt follows a bilinear law up to ``F_ultimate``, the plastic stiffness
    ``k_p = (F_u - F_y) / (HARDENING_STRAIN l + (F_u - F_y) delta_S)`` over its loaded length
    ``l``; the clamped parts stay elastic.  Returns ``(F, plastic elongation, broke)``:
    the preload [N], the bolt's permanent elongation [m] and whether ``F_ultimate`` would be
    exceeded (the bolt breaks; ``F`` is then ``F_ultimate``).  Vectorised.
    """
    Fs, th, Fy, Fu = (np.asarray(v, dtype=float) for v in (F_snug, angle, F_yield, F_ultimate))
    c = delta_S + delta_P
    u = Fs * c + P * th / (2 * math.pi)  # total stretch of bolt and parts
    F_el = u / c
    kp = (Fu - Fy) / (HARDENING_STRAIN * loaded_length + (Fu - Fy) * delta_S)
    F_pl = (Fy + (u - Fy * delta_S) * kp) / (1 + delta_P * kp)
    plastic = F_el > Fy
    F = np.where(plastic, F_pl, F_el)
    broke = F > Fu
    F = np.minimum(F, Fu)
    perm = np.where(plastic, np.maximum(u - F * c, 0.0), 0.0)
    return F, perm, broke
