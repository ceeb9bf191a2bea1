"""Thread stripping with Alexander's reductions, and the Monte Carlo against an exact
probability.

* Stripping (VDI 2230-1:2015 5.5.5.2 after Alexander, SAE 770420; relations from memory),
  M12 8.8 bolt and ISO 4032 nut, worked by hand from the basic profile (ISO 724):
  d = 12, P = 1.75, D2 = d2 = 10.863, D1 = 10.106 mm, A_s = 84.3 mm^2, s = 18 mm;
  R_m = 800 MPa; tau_BS = 0.65 R_m = 520, tau_BM = 0.6 R_m = 480 MPa (matched steel nut).
  Shear areas per mm of engagement: A_SGM = (P/2 + (d - D2) tan30) pi d / P = 32.991,
  A_SGS = (P/2 + (d2 - D1) tan30) pi D1 / P = 23.804 mm^2/mm; R_S = 480 x 32.991 /
  (520 x 23.804) = 1.2794; C1 = 3.8 x 1.5 - 1.5^2 - 2.61 = 0.84;
  C2 = 5.594 - 13.682 R_S + 14.107 R_S^2 - 6.057 R_S^3 + 0.9353 R_S^4 = 1.0018; C3 = 0.897.
  Bolt thread: m = 800 x 84.3 / (0.84 x 1.0018 x 520 x 23.804) = 6.4743 mm (governs);
  nut thread: m = 800 x 84.3 / (0.84 x 0.897 x 480 x 32.991) = 5.6521 mm.
* Monte Carlo: torque ~ Normal(mu, sigma) with both frictions fixed; the bolt yields at
  assembly exactly above T* = F_M,0.2 k (R7 with nu = 1), so P = 1 - Phi((T* - mu)/sigma)
  (the normal tail, scipy.stats.norm).  mu = T* - 3.09 sigma: P = 1.0e-3.
"""

from __future__ import annotations

from functools import cache

from .registry import Outcome, register

G = "rare events and stripping"


@cache
def _m12_stripping():
    from ..components import nut_dilation_factor, stripping_engagement

    st = stripping_engagement(
        12e-3,
        1.75e-3,
        84.3e-6,
        800e6,
        0.65 * 800e6,
        0.6 * 800e6,
        float(nut_dilation_factor(18e-3, 12e-3)),
        d2=10.863e-3,
        D1=10.106e-3,
        D2=10.863e-3,
    )
    return st


@register(
    "stripping, bolt thread governs: m_eff,min with C1, C2 (M12 8.8, ISO nut)", G, kind="hand"
)
def stripping_bolt_thread() -> Outcome:
    st = _m12_stripping()
    return Outcome(
        st.external * 1e3,
        6.4743,
        2e-4,
        "VDI 2230-1:2015 5.5.5.2 after Alexander (SAE 770420), hand calculation (from memory)",
        "mm",
    )


@register("stripping, nut thread: m_eff,min with C1, C3 (M12 8.8, ISO nut)", G, kind="hand")
def stripping_nut_thread() -> Outcome:
    st = _m12_stripping()
    return Outcome(
        st.internal * 1e3,
        5.6521,
        2e-4,
        "VDI 2230-1:2015 5.5.5.2 after Alexander (SAE 770420), hand calculation (from memory)",
        "mm",
    )


@register("Monte Carlo yield probability against the exact normal tail (1e-3)", G, kind="hand")
def monte_carlo_exact_tail() -> Outcome:
    from scipy.stats import norm

    from ..components import permissible_preload
    from ..inputs.joint import joint_from_data
    from ..joint.model import Dist
    from ..joint.prepare import prepare
    from ..studies.sampling import Convergence
    from ..studies.scatter import scatter

    mu = 0.12
    spec = joint_from_data(
        {
            "title": "exact tail",
            "bolt": {"thread": "M12", "grade": "8.8", "length": "50 mm"},
            "nut": {},
            "clamped": [{"material": "steel", "thickness": "30 mm"}],
            "tightening": {"torque": "70 N*m", "thread_friction": mu, "head_friction": mu},
            "service": {"axial_load": "5 kN"},
        }
    )
    prep = prepare(spec)
    thr = spec.bolt.thread
    F02 = float(permissible_preload(prep.A0, prep.d0, thr.d2, thr.P, spec.bolt.grade.Rp02, mu, 1.0))
    T_star = F02 * prep.k_torque_fn(mu, mu)
    sigma = 3.0
    mean = T_star - 3.09 * sigma
    exact = float(norm.sf(3.09))
    r = scatter(
        spec,
        {"torque": Dist("normal", mean, sigma)},
        100_000,
        seed=0,
        convergence=Convergence(rel_width=0.1, negligible=1e-5, max_samples=5_000_000),
    )
    pr = r.probability("bolt_yield_assembly")
    # tolerance: the converged 95 % interval's half width relative to the estimate
    return Outcome(
        pr["estimate"],
        exact,
        0.06,
        "exact normal tail 1 - Phi(3.09) (scipy.stats.norm) for the torque at which the "
        "VDI 2230-1 R7 yield preload is reached; adaptive sampling to a 10 % interval",
    )


# angle tightening (hand, from the compatibility of bolt and parts; bilinear bolt past yield):
# F_snug = 10 kN, P = 1.5 mm, theta = 30 deg -> stretch 1.5/12 = 0.125 mm;
# delta_S = 3e-9, delta_P = 1e-9 m/N.  Elastic: F = 10 + 0.125e-3/4e-9 N = 41.25 kN.
# Past F_y = 35 kN (F_u = 45 kN, l = 40 mm, 2 % strain): k_p = 10e3/(8e-4 + 3e-5)
# = 1.20482e7 N/m; u = 4e-5 + 1.25e-4 = 1.65e-4 m; F = (35e3 + (1.65e-4 - 1.05e-4) k_p)
# / (1 + 1e-9 k_p) = 35 297.6 N; permanent elongation u - F (dS + dP) = 23.81 um.


@register("angle tightening, elastic: F_snug + P theta / (360 deg (dS + dP))", G, kind="hand")
def angle_elastic() -> Outcome:
    import math

    from ..components.tightening import angle_preload

    F, _, _ = angle_preload(10e3, math.radians(30), 1.5e-3, 3e-9, 1e-9, 1e9, 2e9, 0.04)
    return Outcome(
        float(F) / 1e3,
        41.25,
        1e-9,
        "hand calculation from the compatibility of bolt and parts",
        "kN",
    )


@register("angle tightening past yield: bilinear bolt, preload", G, kind="hand")
def angle_plastic() -> Outcome:
    import math

    from ..components.tightening import angle_preload

    F, _, _ = angle_preload(10e3, math.radians(30), 1.5e-3, 3e-9, 1e-9, 35e3, 45e3, 0.04)
    return Outcome(
        float(F) / 1e3,
        35.2976,
        2e-6,
        "hand calculation, bilinear bolt up to R_m at 2 % plastic strain (from memory)",
        "kN",
    )
