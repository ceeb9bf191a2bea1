"""Gasketed flange: ASME BPVC VIII-1 Appendix 2 by hand, elastic interaction of a rigid
flange on a linear gasket, and the bolt loads from a bending moment.
"""

from __future__ import annotations

from functools import cache
from typing import Any

from .registry import Outcome, register

G = "flange"
INCH = 0.0254
LBF = 4.4482216152605
APP2 = "ASME BPVC VIII-1 Appendix 2, 2-5, hand calculation"


def _data(**over: Any) -> dict[str, Any]:
    d: dict[str, Any] = {
        "title": "verification flange",
        "flange": {
            "bolt_count": 8,
            "bolt_circle": "160 mm",
            "thickness": "20 mm",
            "inner_diameter": "90 mm",
            "outer_diameter": "200 mm",
        },
        "bolt": {"thread": "M16", "grade": "8.8"},
        "gasket": {
            "type": "spiral-wound",
            "inner_diameter": "95 mm",
            "outer_diameter": "127 mm",
            "thickness": "4.5 mm",
        },
        "loading": {"pressure": "40 bar"},
        "tightening": {"thread_friction": "0.10..0.14"},
    }
    d.update(over)
    return d


@cache
def _app2():
    from ..flange.analysis import asme_app2
    from ..inputs.flange import flange_from_data

    return asme_app2(flange_from_data(_data()))


# ASME BPVC VIII-1 Appendix 2, 2-5, by hand for this gasket (inches, psi):
# N = (127 - 95)/2 = 16 mm; b0 = N/2 = 8 mm = 0.31496 in > 1/4 in ->
# b = 0.5 sqrt(0.31496) = 0.28060 in; G = 127 mm - 2 b = 112.745 mm = 4.43878 in
# P = 40 bar = 580.151 psi; m = 3, y = 10 000 psi (Table 2-5.1, spiral wound, from memory)
# H = 0.785 G^2 P = 0.785 x 19.70277 x 580.151 = 8972.9 lbf
# H_p = 2 b 3.14 G m P = 2 x 0.28060 x 3.14 x 4.43878 x 3 x 580.151 = 13 613.7 lbf
# W_m2 = 3.14 b G y = 3.14 x 0.28060 x 4.43878 x 10 000 = 39 109.2 lbf
@register("App. 2 effective gasket width b", G, kind="hand")
def app2_b() -> Outcome:
    return Outcome(_app2().b / INCH, 0.28060, 1e-4, APP2, "in")


@register("App. 2 gasket reaction diameter G", G, kind="hand")
def app2_G() -> Outcome:
    return Outcome(_app2().G / INCH, 4.43878, 1e-5, APP2, "in")


@register("App. 2 hydrostatic end force H", G, kind="hand")
def app2_H() -> Outcome:
    return Outcome(_app2().H / LBF, 8972.9, 2e-4, APP2, "lbf")


@register("App. 2 joint contact load H_p", G, kind="hand")
def app2_Hp() -> Outcome:
    return Outcome(_app2().Hp / LBF, 13613.7, 2e-4, APP2, "lbf")


@register("App. 2 seating load W_m2", G, kind="hand")
def app2_Wm2() -> Outcome:
    return Outcome(_app2().Wm2 / LBF, 39109.2, 2e-4, f"{APP2} (y from memory)", "lbf")


# W_m1, A_m, A_b and W (App. 2-5(c), (d), (e)) for the same flange, pressure only, by hand
# (more digits than above: H = 0.785 x 4.438786^2 x 580.1510 = 8973.03 lbf,
# H_p = 13 613.95 lbf, W_m2 = 39 110.38 lbf):
# W_m1 = H + H_p = 22 586.99 lbf
# S_b = S_a = min(R_m/5, R_p0.2/4) = min(800/5, 640/4) = 160 MPa = 23 206.04 psi (M16 8.8;
#   clampstack's default, bolting design factors of ASME II-D, from memory)
# A_m = max(W_m1/S_b, W_m2/S_a) = 39 110.38/23 206.04 = 1.685354 in^2 (seating governs)
# A_b = 8 x pi/4 d3^2, d3 = 16 - 1.226869 x 2 = 13.546262 mm: 8 x 144.1215 = 1152.972 mm^2
#     = 1.787110 in^2
# W = (A_m + A_b) S_a/2 = 3.472464 x 23 206.04/2 = 40 291.07 lbf
@register("App. 2 operating load W_m1 = H + H_p", G, kind="hand")
def app2_Wm1() -> Outcome:
    return Outcome(_app2().Wm1 / LBF, 22586.99, 1e-6, APP2, "lbf")


@register("App. 2 required bolt area A_m", G, kind="hand")
def app2_Am() -> Outcome:
    return Outcome(_app2().Am / INCH**2, 1.685354, 1e-6, f"{APP2} (y from memory)", "in^2")


@register("App. 2 available bolt area A_b (root area)", G, kind="hand")
def app2_Ab() -> Outcome:
    return Outcome(_app2().Ab * 1e6, 1152.972, 1e-6, f"{APP2}, d3 of ISO 898-1", "mm^2")


@register("App. 2 flange design bolt load W = (A_m + A_b) S_a/2", G, kind="hand")
def app2_W() -> Outcome:
    return Outcome(_app2().W / LBF, 40291.07, 1e-6, f"{APP2}, 2-5(e) (y from memory)", "lbf")


@register("App. 2 narrow gasket: G is the mean diameter", G, kind="hand")
def app2_narrow() -> Outcome:
    # b0 = (120 - 100)/4 = 5 mm <= 1/4 in: b = b0 and G = (100 + 120)/2 = 110 mm
    from ..flange.analysis import asme_app2
    from ..inputs.flange import flange_from_data

    spec = flange_from_data(
        _data(
            gasket={
                "type": "fibre-3mm",
                "inner_diameter": "100 mm",
                "outer_diameter": "120 mm",
                "thickness": "3 mm",
            }
        )
    )
    return Outcome(asme_app2(spec).G * 1e3, 110.0, 1e-12, APP2, "mm")


@cache
def _rigid_interaction() -> tuple[Any, Any]:
    # Rigid plate on a linear gasket of total stiffness K_g, bolts of stiffness k_b; bolts
    # not yet tightened are loose.  Tightening the next bolt from zero to the target t moves
    # the plate by t/(K_g + e k_b), with e the number of bolts already tightened, so each
    # of those drops by c = k_b/(K_g + e k_b) of t (equilibrium of the plate and
    # compatibility; the elastic interaction that ASME PCC-1 describes, in its simplest form).
    import numpy as np

    from ..flange.analysis import build_ring, cross_order, simulate_passes
    from ..inputs.flange import flange_from_data

    spec = flange_from_data(
        _data(
            flange={
                "bolt_count": 8,
                "bolt_circle": "160 mm",
                "thickness": "20 mm",
                "inner_diameter": "90 mm",
                "outer_diameter": "200 mm",
                "mating": "rigid",
            },
            gasket={
                "inner_diameter": "95 mm",
                "outer_diameter": "127 mm",
                "thickness": "4.5 mm",
                "m": 3.0,
                "y": "69 MPa",
                "max_stress": "300 MPa",
                "unload_modulus": "5000 MPa",
                "curve": [[0.02, "100 MPa"], [0.04, "200 MPa"]],
            },
        )
    )
    import dataclasses

    ring = build_ring(dataclasses.replace(spec, rotation=False))  # a ring that does not turn
    ring.k_ring *= 1e8  # a rigid ring and flange plate
    ring.k_flange *= 1e8
    n, kb = ring.n, ring.k_bolt
    Kg = n * 5000e6 * ring.sector_area / ring.gasket_thickness
    target = 40e3
    order = cross_order(n)
    sim = simulate_passes(ring, np.full(n, target), (1.0,), [order])[-1]
    F = np.zeros(n)
    done: list[int] = []
    for j in order:
        F[done] -= kb / (Kg + len(done) * kb) * target
        F[j] = target
        done.append(j)
    return sim, F


@register(
    "elastic interaction: first bolt after one cross pass, rigid flange", G, kind="consistency"
)
def interaction_first() -> Outcome:
    sim, F = _rigid_interaction()
    return Outcome(
        float(sim.min()) / 1e3,
        float(F.min()) / 1e3,
        2e-6,
        "rigid plate on a linear gasket, equilibrium and compatibility, closed form",
        "kN",
    )


@register(
    "elastic interaction: mean bolt load after one cross pass, rigid flange", G, kind="consistency"
)
def interaction_mean() -> Outcome:
    sim, F = _rigid_interaction()
    return Outcome(
        float(sim.mean()) / 1e3,
        float(F.mean()) / 1e3,
        2e-6,
        "rigid plate on a linear gasket, equilibrium and compatibility, closed form",
        "kN",
    )


@register("most loaded bolt under axial force and bending moment", G, kind="hand")
def moment_loading() -> Outcome:
    # F_i = F/N + M r cos(theta_i)/sum_j(r^2 cos^2 theta_j) = F/N + 4 M cos(theta_i)/(N D_bc):
    # 16 kN/8 + 4 x 4 kN*m/(8 x 0.160 m)
    #     = 2 kN + 12.5 kN = 14.5 kN (moment equilibrium of a rigid bolt circle)
    from ..flange.analysis import working_loads
    from ..inputs.flange import flange_from_data

    spec = flange_from_data(
        _data(loading={"pressure": "0 bar", "axial_force": "16 kN", "bending_moment": "4 kN*m"})
    )
    FA = working_loads(spec, 0.1)
    return Outcome(
        float(FA.max()) / 1e3,
        14.5,
        1e-12,
        "statics of a rigid bolt circle, F_i = F/N + M r cos(theta_i)/sum(r^2 cos^2), closed form",
        "kN",
    )


# Ring rotation, ring theory by hand for the verification flange with 36 mm rings:
# ring 90 .. 200 mm, 8 holes of 17.5 mm on a 160 mm circle; K_theta / E = t^3/12 (2 pi
# ln(b/a) - N pi d_h^2/(4 R_bc^2)) = 3.888e-6 x (5.017171 - 0.300660) = 1.833780e-5 m^3
RING = "ring theory (Timoshenko, Strength of Materials II; Roark; from memory), hand calculation"


def _ring_spec():
    from ..inputs.flange import flange_from_data

    d = _data()
    d["flange"] = dict(d["flange"], thickness="36 mm")
    return flange_from_data(d)


@register("flange ring rotational stiffness K_theta / E", G, kind="hand")
def ring_stiffness() -> Outcome:
    from ..flange.analysis import ring_rotation_stiffness

    return Outcome(ring_rotation_stiffness(_ring_spec(), 1.0) * 1e6, 18.33780, 2e-6, RING, "cm^3")


@register("App. 2-14 rigidity constant 109.4 from ring theory (no holes)", G, kind="hand")
def rigidity_constant() -> Outcome:
    # ASME VIII-1 App. 2-14 (loose flange): J = 109.4 M_o/(E t^3 ln K K_L) <= 1 (from
    # memory); ring theory's rotation in degrees is 12/(2 pi) x 180/pi M/(E t^3 ln K)
    import dataclasses
    import math

    from ..flange.analysis import ring_rotation_stiffness

    spec = dataclasses.replace(_ring_spec(), hole=1e-12)
    lnK = math.log(spec.ring_outer_diameter / spec.ring_inner_diameter)
    got = math.degrees(1.0 / ring_rotation_stiffness(spec, 1.0)) * spec.thickness**3 * lnK
    return Outcome(got, 109.4, 5e-4, "ASME BPVC VIII-1 App. 2-14 (from memory)", "")


@register("ring network: rotation meets the moment balance", G, kind="consistency")
def ring_moment_balance() -> Outcome:
    # every bolt tightened, no pressure: theta = h_G sum F / K_theta
    import numpy as np

    from ..flange.analysis import build_ring, simulate_passes

    spec = _ring_spec()
    ring = build_ring(spec)
    simulate_passes(ring, np.full(ring.n, 50e3), (1.0,), [list(range(ring.n))])
    _, bolts, _, _ = ring.solve(np.zeros(ring.n))
    want = ring.lever * float(bolts.sum()) / ring.rotation_stiffness
    return Outcome(
        float(ring.rotations()[0]) * 1e3,
        want * 1e3,
        1e-9,
        "moment balance of the ring, closed form",
        "mrad",
    )
