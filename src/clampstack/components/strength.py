"""Strength checks of the bolt, the bearing faces, the threads and the friction grip.

* Fatigue endurance of rolled threads, VDI 2230-1:2015 section 5.5.3 (step R9).
* Working stress with residual torsion, VDI 2230-1 section 5.5.2 (step R8).
* Surface pressure under head and nut, VDI 2230-1 section 5.5.4 (step R10).
* Thread stripping: shear areas of FED-STD-H28/2 (appendix on strength of threads) as
  reproduced in Machinery's Handbook ("Strength of screw threads"), strip force as
  shear area x shear strength, shear strength = ratio x R_m, a screening after
  Alexander, SAE 770420 (1977), the method used in VDI 2230-1 section 5.5.5 (step R11).
* Slip: required clamp load for friction grip, VDI 2230-1 section 5.5.6 (step R12).

VDI clause numbers are cited from memory; the step numbers R8..R12 are VDI 2230-1's.
Units: SI (m, m^2, N, N*m, Pa).  Vectorised over numpy arrays.
"""

from __future__ import annotations

import math
from dataclasses import dataclass

import numpy as np

from ._util import FloatArray, as_array, out, require
from .tightening import CombinedStress, torsional_section_modulus

__all__ = [
    "BOLT_SHEAR_RATIO",
    "SHEAR_STRENGTH_RATIO",
    "CombinedStress",
    "Stripping",
    "bolt_shear_ratio",
    "nut_dilation_factor",
    "stripping_engagement",
    "thread_bending_factors",
    "bearing_area",
    "endurance_rolled_after_heat_treatment",
    "endurance_rolled_before_heat_treatment",
    "external_thread_shear_area",
    "internal_thread_shear_area",
    "minimum_engagement",
    "slip_clamp_load",
    "strip_force",
    "stress_amplitude",
    "surface_pressure",
    "working_stress",
]

#: Ratio of shear strength to tensile strength tau_B/R_m used for thread stripping
#: (Alexander, SAE 770420, as quoted in VDI 2230-1 step R11; values from memory).
SHEAR_STRENGTH_RATIO: dict[str, float] = {
    "steel": 0.6,
    "austenitic": 0.8,
    "stainless": 0.8,
    "grey-cast-iron": 0.9,
    "aluminium": 0.7,
}


# --------------------------------------------------------------------------- fatigue


def endurance_rolled_before_heat_treatment(d: FloatArray) -> FloatArray:
    """Endurance limit (stress amplitude) of a thread rolled before heat treatment.

    Formula (VDI 2230-1:2015, section 5.5.3, step R9, from memory)::

        sigma_ASV = 0.85 (150/d + 45)    [MPa, with d in mm]

    Parameters
    ----------
    d : float or ndarray
        Nominal diameter [m].

    Returns
    -------
    float or ndarray
        sigma_ASV [Pa], the stress amplitude at 2e6 cycles and 99 % survival referred to
        the stress area.

    Notes
    -----
    Validity: high-strength bolts (8.8 to 12.9) with standard metric threads, mean
    stress up to the yield-point range, diameters as stated in VDI 2230-1 (up to about
    M40 as we recall it, from memory).
    """
    d_mm = as_array(d) * 1e3
    require(d_mm > 0, "d must be positive")
    return out(0.85 * (150.0 / d_mm + 45.0) * 1e6)


def endurance_rolled_after_heat_treatment(
    d: FloatArray, F_Sm: FloatArray, F_02min: FloatArray
) -> FloatArray:
    """Endurance limit of a thread rolled after heat treatment.

    Formula (VDI 2230-1:2015, section 5.5.3, step R9, from memory)::

        sigma_ASG = (2 - F_Sm/F_0.2min) sigma_ASV,   0.3 < F_Sm/F_0.2min < 1

    Parameters
    ----------
    d : float or ndarray
        Nominal diameter [m].
    F_Sm : float or ndarray
        Mean bolt load [N].
    F_02min : float or ndarray
        Bolt load at the minimum yield point, ``A_s R_p0.2min`` [N].

    Returns
    -------
    float or ndarray
        sigma_ASG [Pa].

    Raises
    ------
    ValueError
        If the load ratio lies outside the validity range 0.3..1.
    """
    ratio = as_array(F_Sm) / as_array(F_02min)
    require((ratio >= 0.3) & (ratio <= 1.0), "F_Sm/F_0.2min outside the validity range 0.3..1")
    return out((2.0 - ratio) * as_array(endurance_rolled_before_heat_treatment(d)))


def stress_amplitude(F_SAo: FloatArray, F_SAu: FloatArray, As: FloatArray) -> FloatArray:
    """Alternating stress of the bolt, ``sigma_a = (F_SAo - F_SAu)/(2 A_s)``.

    VDI 2230-1:2015, section 5.5.3 (step R9); the safety against fatigue is then
    ``S_D = sigma_AS/sigma_a >= 1.2`` (VDI 2230-1, from memory).

    Parameters
    ----------
    F_SAo, F_SAu : float or ndarray
        Upper and lower additional bolt load [N].
    As : float or ndarray
        Stress area [m^2].

    Returns
    -------
    float or ndarray
        sigma_a [Pa].
    """
    As_a = as_array(As)
    require(As_a > 0, "stress area must be positive")
    return out(np.abs(as_array(F_SAo) - as_array(F_SAu)) / (2.0 * As_a))


# --------------------------------------------------------------------------- working stress


def working_stress(
    F_Smax: FloatArray,
    A0: FloatArray,
    M_G: FloatArray,
    d0: FloatArray,
    k_tau: FloatArray = 0.5,
) -> CombinedStress:
    """Equivalent stress of the bolt in service, with a residual share of the thread torsion.

    Formulas (VDI 2230-1:2015, section 5.5.2, step R8)::

        sigma_z,max = F_S,max / A0
        tau_max     = M_G / W_P,    W_P = pi d0^3 / 16
        sigma_red,B = sqrt(sigma_z,max^2 + 3 (k_tau tau_max)^2)

    with ``k_tau = 0.5`` the recommended reduction of the torsion after assembly
    (VDI 2230-1); the safety against yield is ``S_F = R_p0.2min/sigma_red,B >= 1.0``.

    Parameters
    ----------
    F_Smax : float or ndarray
        Maximum bolt load [N].
    A0 : float or ndarray
        Smallest cross-section (``A_s`` for a standard bolt) [m^2].
    M_G : float or ndarray
        Thread torque at assembly [N*m] (at the largest assembly preload).
    d0 : float or ndarray
        Diameter of that cross-section [m].
    k_tau : float or ndarray
        Residual torsion factor [-], 0.5 by default; 0 for torque-free tightening
        (tensioning).

    Returns
    -------
    CombinedStress
        ``tau`` is the reduced torsion ``k_tau tau_max``.
    """
    A0_a = as_array(A0)
    require(A0_a > 0, "cross-section must be positive")
    k = as_array(k_tau)
    require((k >= 0) & (k <= 1), "k_tau must lie in [0, 1]")
    sigma = as_array(F_Smax) / A0_a
    tau = k * as_array(M_G) / as_array(torsional_section_modulus(d0))
    return CombinedStress(out(sigma), out(tau), out(np.sqrt(sigma**2 + 3.0 * tau**2)))


# --------------------------------------------------------------------------- surface pressure


def bearing_area(dW: FloatArray, dh: FloatArray) -> FloatArray:
    """Bearing area under head or nut, ``A_p = pi/4 (d_W^2 - d_h^2)``.

    VDI 2230-1:2015, section 5.5.4 (step R10).

    Parameters
    ----------
    dW : float or ndarray
        Outer bearing diameter [m].
    dh : float or ndarray
        Hole (or chamfer) diameter [m].

    Returns
    -------
    float or ndarray
        Area [m^2].
    """
    dW_a, dh_a = as_array(dW), as_array(dh)
    require(dh_a >= 0, "hole diameter must not be negative")
    require(dW_a > dh_a, "bearing diameter must exceed the hole diameter")
    return out(math.pi / 4 * (dW_a**2 - dh_a**2))


def surface_pressure(F: FloatArray, dW: FloatArray, dh: FloatArray) -> FloatArray:
    """Surface pressure under head or nut, ``p = F / A_p``.

    VDI 2230-1:2015, section 5.5.4 (step R10): with ``F = F_M,zul`` (assembly) or
    ``F_S,max`` (service) against the limiting pressure ``p_G`` of the clamped material.

    Parameters
    ----------
    F : float or ndarray
        Force [N].
    dW, dh : float or ndarray
        Bearing diameters [m].

    Returns
    -------
    float or ndarray
        Pressure [Pa].
    """
    return out(as_array(F) / as_array(bearing_area(dW, dh)))


# --------------------------------------------------------------------------- stripping


def external_thread_shear_area(
    d: FloatArray,
    P: FloatArray,
    Le: FloatArray,
    Kn_max: FloatArray | None = None,
    Es_min: FloatArray | None = None,
) -> FloatArray:
    """Shear area of the external (bolt) thread, sheared at the internal thread's minor diameter.

    Formula (FED-STD-H28/2, strength of threads; Machinery's Handbook, "Strength of screw
    threads"), with ``n = 1/P`` threads per unit length::

        A_S,s = pi n L_e K_n,max [ 1/(2n) + 0.57735 (E_s,min - K_n,max) ]

    Defaults use the ISO basic profile (ISO 68-1 / ISO 724): ``K_n = D1 = d - 1.082532 P``
    and ``E_s = d2 = d - 0.649519 P``, which gives ``A_S,s = 0.75 pi D1 L_e`` (the basic
    tooth width at D1 is 3/4 P).  Tolerance-class limits (e.g. 6g/6H of ISO 965-1) give a
    smaller area; pass them as ``Kn_max`` and ``Es_min`` for a tighter check.

    Parameters
    ----------
    d, P : float or ndarray
        Nominal diameter and pitch [m].
    Le : float or ndarray
        Length of engagement [m].
    Kn_max : float or ndarray, optional
        Maximum minor diameter of the internal thread [m].
    Es_min : float or ndarray, optional
        Minimum pitch diameter of the external thread [m].

    Returns
    -------
    float or ndarray
        Shear area [m^2].
    """
    d_a, P_a, Le_a = as_array(d), as_array(P), as_array(Le)
    require((d_a > 0) & (P_a > 0), "d and P must be positive")
    require(Le_a >= 0, "engagement length must not be negative")
    Kn = d_a - 1.082532 * P_a if Kn_max is None else as_array(Kn_max)
    Es = d_a - 0.649519 * P_a if Es_min is None else as_array(Es_min)
    n = 1.0 / P_a
    return out(math.pi * n * Le_a * Kn * (0.5 / n + 0.57735 * (Es - Kn)))


def internal_thread_shear_area(
    d: FloatArray,
    P: FloatArray,
    Le: FloatArray,
    Ds_min: FloatArray | None = None,
    En_max: FloatArray | None = None,
) -> FloatArray:
    """Shear area of the internal (nut, tapped hole) thread, sheared at the bolt's major diameter.

    Formula (FED-STD-H28/2, strength of threads; Machinery's Handbook, "Strength of screw
    threads"), ``n = 1/P``::

        A_S,n = pi n L_e D_s,min [ 1/(2n) + 0.57735 (D_s,min - E_n,max) ]

    Defaults use the ISO basic profile: ``D_s = d`` and ``E_n = D2 = d - 0.649519 P``,
    which gives ``A_S,n = 0.875 pi d L_e`` (the basic internal tooth width at d is 7/8 P).

    Parameters
    ----------
    d, P : float or ndarray
        Nominal diameter and pitch [m].
    Le : float or ndarray
        Length of engagement [m].
    Ds_min : float or ndarray, optional
        Minimum major diameter of the external thread [m].
    En_max : float or ndarray, optional
        Maximum pitch diameter of the internal thread [m].

    Returns
    -------
    float or ndarray
        Shear area [m^2].
    """
    d_a, P_a, Le_a = as_array(d), as_array(P), as_array(Le)
    require((d_a > 0) & (P_a > 0), "d and P must be positive")
    require(Le_a >= 0, "engagement length must not be negative")
    Ds = d_a if Ds_min is None else as_array(Ds_min)
    En = d_a - 0.649519 * P_a if En_max is None else as_array(En_max)
    n = 1.0 / P_a
    return out(math.pi * n * Le_a * Ds * (0.5 / n + 0.57735 * (Ds - En)))


def strip_force(
    shear_area: FloatArray,
    Rm: FloatArray,
    shear_ratio: FloatArray = 0.6,
    factor: FloatArray = 1.0,
) -> FloatArray:
    """Thread stripping force, ``F = A_S x (tau_B/R_m) x R_m x C``.

    Screening after Alexander (SAE 770420) as used in VDI 2230-1 step R11: shear area
    (:func:`external_thread_shear_area` / :func:`internal_thread_shear_area`) times shear
    strength, ``tau_B = shear_ratio R_m`` (:data:`SHEAR_STRENGTH_RATIO`, from memory).
    ``factor`` takes Alexander's reduction factors (nut dilation C1 and thread bending
    C2/C3, each <= 1) when the caller has them; the default 1 ignores them and so
    overstates the strip strength, for standard nuts by roughly 10-20 % (our estimate
    from Alexander's factors as recalled, not a published figure): keep a margin.

    Parameters
    ----------
    shear_area : float or ndarray
        Shear area [m^2].
    Rm : float or ndarray
        Tensile strength of the thread's material [Pa].
    shear_ratio : float or ndarray
        ``tau_B/R_m`` [-].
    factor : float or ndarray
        Product of reduction factors [-].

    Returns
    -------
    float or ndarray
        Strip force [N].
    """
    A, R, r, c = (as_array(v) for v in (shear_area, Rm, shear_ratio, factor))
    require(A >= 0, "shear area must not be negative")
    require(R > 0, "tensile strength must be positive")
    require((r > 0) & (r <= 1), "shear ratio must lie in (0, 1]")
    require((c > 0) & (c <= 1), "reduction factor must lie in (0, 1]")
    return out(A * r * R * c)


def minimum_engagement(
    d: FloatArray,
    P: FloatArray,
    As: FloatArray,
    Rm_bolt: FloatArray,
    Rm_internal: FloatArray,
    shear_ratio_internal: FloatArray = 0.6,
    factor: FloatArray = 1.0,
    Ds_min: FloatArray | None = None,
    En_max: FloatArray | None = None,
    shear_ratio_bolt: FloatArray | None = None,
) -> FloatArray:
    """Engagement length at which the internal thread strips at the bolt's tensile capacity.

    Solves ``A_S,n(L_e) tau_B,M C = A_s R_m,S`` for ``L_e``; the shear area is linear in
    ``L_e`` (FED-STD-H28/2 via :func:`internal_thread_shear_area`), ``tau_B,M`` is
    ``shear_ratio_internal R_m,M`` (Alexander, SAE 770420, as in VDI 2230-1 step R11).
    With the basic profile::

        L_e = A_s R_m,S / (0.875 pi d x shear_ratio x R_m,M x C)

    If ``shear_ratio_bolt`` is given, the bolt's own thread (external, sheared at the
    basic minor diameter D1 of the internal thread) is checked too and the larger
    length is returned.

    Parameters
    ----------
    d, P : float or ndarray
        Nominal diameter and pitch [m].
    As : float or ndarray
        Bolt stress area [m^2].
    Rm_bolt : float or ndarray
        Bolt tensile strength [Pa].
    Rm_internal : float or ndarray
        Tensile strength of the nut or tapped part [Pa].
    shear_ratio_internal : float or ndarray
        ``tau_B/R_m`` of the nut or tapped part [-].
    factor : float or ndarray
        Alexander's reduction factors, product [-] (default 1: none).
    Ds_min, En_max : float or ndarray, optional
        Tolerance-class diameters (see :func:`internal_thread_shear_area`).
    shear_ratio_bolt : float or ndarray, optional
        ``tau_B/R_m`` of the bolt; when given, also check external-thread stripping.

    Returns
    -------
    float or ndarray
        Minimum engagement length [m].

    Notes
    -----
    A screening value: common practice (no source) asks for at least 1 d in steel,
    1.25-1.5 d in cast iron and about 2 d in aluminium, and ISO 898-2 nuts have
    ``m >= 0.8 d``.
    """
    As_a, Rs = as_array(As), as_array(Rm_bolt)
    require(As_a > 0, "stress area must be positive")
    require(Rs > 0, "bolt tensile strength must be positive")
    capacity = As_a * Rs
    per_length = as_array(
        strip_force(
            internal_thread_shear_area(d, P, 1.0, Ds_min, En_max),
            Rm_internal,
            shear_ratio_internal,
            factor,
        )
    )
    require(per_length > 0, "internal thread shear area is not positive for these diameters")
    Le = capacity / per_length
    if shear_ratio_bolt is not None:
        per_length_ext = as_array(
            strip_force(external_thread_shear_area(d, P, 1.0), Rm_bolt, shear_ratio_bolt, factor)
        )
        Le = np.maximum(Le, capacity / per_length_ext)
    return out(Le)


# --------------------------------------------------------- stripping, VDI 2230-1 5.5.5

#: tau_B/R_m of bolt steels by property class (VDI 2230-1:2015 Table 7, from memory).
BOLT_SHEAR_RATIO: dict[str, float] = {"8.8": 0.65, "10.9": 0.62, "12.9": 0.60}


def bolt_shear_ratio(grade: str) -> tuple[float, str]:
    """``tau_B/R_m`` of a bolt of property class ``grade`` and where it comes from."""
    if grade in BOLT_SHEAR_RATIO:
        return BOLT_SHEAR_RATIO[grade], "VDI 2230-1 Table 7 (from memory)"
    return 0.6, "0.6 for steel (common practice, no source)"


def nut_dilation_factor(s: FloatArray, d: FloatArray) -> FloatArray:
    """Alexander's factor ``C1`` for the dilation (bell-mouthing) of a nut.

    VDI 2230-1:2015 5.5.5.2 after Alexander (SAE 770420), from memory::

        C1 = 3.8 (s/d) - (s/d)^2 - 2.61   for 1.4 <= s/d < 1.9
        C1 = 1                            for s/d >= 1.9 (and for tapped holes)

    ``s`` width across flats, ``d`` nominal diameter [m].  Below ``s/d = 1.4`` the
    relation's end value is held (outside the published range).
    """
    r = np.clip(as_array(s) / as_array(d), 1.4, 1.9)
    return out(np.where(r >= 1.9, 1.0, 3.8 * r - r**2 - 2.61))


def thread_bending_factors(R_S: FloatArray) -> tuple[FloatArray, FloatArray]:
    """Alexander's thread-bending factors ``(C2, C3)`` from the strength ratio ``R_S``.

    VDI 2230-1:2015 5.5.5.2 after Alexander (SAE 770420), from memory; ``C2`` reduces the
    external (bolt) thread, ``C3`` the internal (nut, tapped hole) thread::

        C2 = 5.594 - 13.682 R_S + 14.107 R_S^2 - 6.057 R_S^3 + 0.9353 R_S^4  (1 < R_S <= 2.2)
        C2 = 0.897                                                           (R_S <= 1)
        C3 = 0.728 + 1.769 R_S - 2.896 R_S^2 + 1.296 R_S^3                   (0.4 < R_S < 1)
        C3 = 0.897                                                           (R_S >= 1)

    Outside the published ranges (``R_S > 2.2``, ``R_S < 0.4``) the end values are held.
    """
    r = as_array(R_S)
    r2 = np.clip(r, 1.0, 2.2)
    C2 = np.where(
        r <= 1.0, 0.897, 5.594 - 13.682 * r2 + 14.107 * r2**2 - 6.057 * r2**3 + 0.9353 * r2**4
    )
    r3 = np.clip(r, 0.4, 1.0)
    C3 = np.where(r >= 1.0, 0.897, 0.728 + 1.769 * r3 - 2.896 * r3**2 + 1.296 * r3**3)
    return out(C2), out(C3)


@dataclass(frozen=True)
class Stripping:
    """Minimum effective engagement against stripping (VDI 2230-1 5.5.5.2), SI units."""

    required: float  # the larger of the two [m]
    internal: float  # internal (nut, tapped) thread strips [m]
    external: float  # bolt thread strips [m]
    C1: float
    C2: float
    C3: float
    strength_ratio: float  # R_S = tau_BM A_SGM / (tau_BS A_SGS)
    governing: str  # "internal thread" or "bolt thread"


def stripping_engagement(
    d: float,
    P: float,
    As: float,
    Rm_bolt: float,
    tau_bolt: float,
    tau_internal: float,
    C1: float = 1.0,
    d2: float | None = None,
    D1: float | None = None,
    D2: float | None = None,
) -> Stripping:
    """Minimum effective engagement at which neither thread strips before the bolt breaks.

    VDI 2230-1:2015 5.5.5.2 after Alexander (SAE 770420), relations from memory::

        m_eff,min,M = R_m,S A_s P / (C1 C3 tau_BM (P/2 + (d - D2) tan 30) pi d)
        m_eff,min,S = R_m,S A_s P / (C1 C2 tau_BS (P/2 + (d2 - D1) tan 30) pi D1)
        R_S = tau_BM A_SGM / (tau_BS A_SGS)

    with the shear areas of the internal thread at ``d`` (``A_SGM``) and of the bolt
    thread at ``D1`` (``A_SGS``) of the basic profile (ISO 68-1; FED-STD-H28/2 form, see
    :func:`internal_thread_shear_area`), ``C1`` the nut dilation factor
    (:func:`nut_dilation_factor`; 1 for a tapped hole) and ``C2``, ``C3`` from
    :func:`thread_bending_factors`.  ``R_m,S`` is the bolt's tensile strength [Pa]
    (VDI 2230-1 takes its maximum; pass it if known), ``tau_bolt`` and ``tau_internal``
    the shear strengths [Pa].  The engagement is the effective one: full threads,
    countersinks and runouts excluded.
    """
    D1 = d - 1.082532 * P if D1 is None else D1
    D2 = d - 0.649519 * P if D2 is None else D2
    d2 = d - 0.649519 * P if d2 is None else d2
    require(min(d, P, As, Rm_bolt, tau_bolt, tau_internal, C1) > 0, "inputs must be positive")
    t30 = math.tan(math.radians(30.0))
    a_int = (P / 2 + (d - D2) * t30) * math.pi * d / P  # A_SGM per unit engagement
    a_ext = (P / 2 + (d2 - D1) * t30) * math.pi * D1 / P  # A_SGS per unit engagement
    R_S = tau_internal * a_int / (tau_bolt * a_ext)
    C2, C3 = (float(x) for x in thread_bending_factors(R_S))
    F = Rm_bolt * As
    m_int = F / (C1 * C3 * tau_internal * a_int)
    m_ext = F / (C1 * C2 * tau_bolt * a_ext)
    gov = "internal thread" if m_int >= m_ext else "bolt thread"
    return Stripping(max(m_int, m_ext), m_int, m_ext, float(C1), C2, C3, float(R_S), gov)


# --------------------------------------------------------------------------- slip


def slip_clamp_load(
    FQ: FloatArray,
    mu_T: FloatArray,
    q_F: FloatArray = 1,
    safety: FloatArray = 1.0,
    M_Y: FloatArray = 0.0,
    q_M: FloatArray = 1,
    r_a: FloatArray | None = None,
) -> FloatArray:
    """Clamp load required to carry a transverse load (and torque) by friction.

    Formula (VDI 2230-1:2015, section 5.5.6, step R12, from memory)::

        F_KQerf = F_Q,max/(q_F mu_T,min) + M_Y,max/(q_M r_a mu_T,min)

    multiplied here by ``safety`` (``S_G``: VDI 2230-1 asks ``F_KR,min/F_KQerf >= 1.2``
    static, ``>= 1.8`` alternating, from memory), so the result is the residual clamp
    load one bolt must keep.

    Parameters
    ----------
    FQ : float or ndarray
        Transverse load per joint [N].
    mu_T : float or ndarray
        Smallest friction coefficient in the interfaces [-].
    q_F : int, float or ndarray
        Number of force-transmitting inner interfaces [-].
    safety : float or ndarray
        Slip safety factor S_G [-].
    M_Y : float or ndarray
        Torque about the bolt axis to be carried [N*m].
    q_M : int, float or ndarray
        Number of torque-transmitting interfaces [-].
    r_a : float or ndarray, optional
        Friction radius for the torque [m]; needed when ``M_Y != 0``.

    Returns
    -------
    float or ndarray
        Required clamp load [N].
    """
    mu = as_array(mu_T)
    require(mu > 0, "interface friction must be positive")
    require(as_array(q_F) > 0, "q_F must be positive")
    require(as_array(safety) > 0, "safety must be positive")
    req = np.abs(as_array(FQ)) / (as_array(q_F) * mu)
    if np.any(as_array(M_Y) != 0):
        if r_a is None:
            raise ValueError("a torque M_Y needs the friction radius r_a")
        require(as_array(r_a) > 0, "friction radius must be positive")
        require(as_array(q_M) > 0, "q_M must be positive")
        req = req + np.abs(as_array(M_Y)) / (as_array(q_M) * as_array(r_a) * mu)
    return out(as_array(safety) * req)
