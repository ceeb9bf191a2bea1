"""The check chain of a single-bolt joint by hand: tapped-joint bolt resilience, working
stress (R8), surface pressure (R10), slip (R12), fatigue of threads rolled after heat
treatment (R9), and the tension and yield-controlled tightening methods.

Each case runs a joint file's data through ``joint_from_data`` and ``analyse`` (or one
component function) and compares one figure with the published relation worked by
hand (VDI 2230-1:2015, relations and clause numbers from memory; docs/theory.md,
sections 2.2-2.4, says which preload each check uses).  As there, the checks R8-R10
take the permissible assembly preload F_M,zul (``check_basis = "permissible"``).

The joint (all cases but the tapped one): M10 (P = 1.5 mm) class 8.8 hex bolt, 50 mm,
plain shank 10 mm of d = 10 mm, d_W = 16 mm under head and nut, E = 205 000 MPa for
bolt, nut and both 15 mm steel plates (d_h = 11 mm, D'_A = 40 mm), n = 0.5,
F_A = 2..8 kN, F_Q = 1 kN, mu_G = 0.12, 40 N*m.  By hand (ISO 724 / ISO 898-1 basic
profile, VDI 2230-1 5.1):

* d2 = 10 - 0.649519 x 1.5 = 9.025722, d3 = 10 - 1.226869 x 1.5 = 8.159697,
  d0 = (d2 + d3)/2 = 8.592709 mm, A_s = pi/4 d0^2 = 57.98960 mm^2,
  A_N = 78.53982, A_d3 = 52.29232 mm^2;
* delta_S = [(5 + 10 + 4)/78.53982 + (20 + 5)/52.29232]/205 000 = 3.512182e-6 mm/N
  (the case "VDI bolt resilience, M10 hex, l_K = 30 mm");
* delta_P = 5.331916e-7 mm/N (the case "VDI cone, through bolt, full cone");
* Phi_n = 0.5 x 0.5331916/(3.512182 + 0.5331916) = 0.0659014.
"""

from __future__ import annotations

from functools import cache
from typing import Any

from ..components import endurance_rolled_after_heat_treatment, slip_clamp_load
from .registry import Outcome, register

G = "check chain"
MPA = 1e6
VDI = "VDI 2230-1:2015"
# VDI 2230-1 prints 1.155 for 1/cos 30 deg = 1.154701, which the code uses; the hand working
# below keeps 1.155, which moves F_M,zul by 0.004 % and the figures from it by up to 0.005 %.
ROUNDED_1155 = 1e-4


def _steel(**over: Any) -> dict[str, Any]:
    d = {"modulus": "205 GPa", "expansion": "11e-6 / K"}
    d.update(over)
    return d


def _plate() -> dict[str, Any]:
    return _steel(
        thickness="15 mm", hole="11 mm", outer_diameter="40 mm", limiting_pressure="700 MPa"
    )


def _data(**over: Any) -> dict[str, Any]:
    d: dict[str, Any] = {
        "title": "check chain verification joint",
        "bolt": _steel(
            thread="M10",
            grade="8.8",
            length="50 mm",
            shank_length="10 mm",
            bearing_diameter="16 mm",
            rolled="after",
        ),
        "nut": _steel(bearing_diameter="16 mm"),
        "clamped": [_plate(), _plate()],
        "embedding": {"amount": "8 um"},
        "tightening": {"torque": "40 N*m", "thread_friction": 0.12},
        "service": {"axial_load": "2..8 kN", "load_height": 0.5, "shear_load": "1 kN"},
    }
    d.update(over)
    return d


def _analyse(data: dict[str, Any]):
    from ..inputs.joint import joint_from_data
    from ..joint import analyse

    return analyse(joint_from_data(data))


@cache
def _torque_joint():
    return _analyse(_data())


@cache
def _tension_joint():
    return _analyse(_data(tightening={"method": "tension", "preload": "25 kN"}))


@cache
def _yield_joint():
    return _analyse(_data(tightening={"method": "yield", "thread_friction": "0.10..0.14"}))


def _check(r, name: str):
    return next(c for c in r.checks if c.name == name)


# ----------------------------------------------------------------------------- tapped joint


@register("tapped joint: bolt resilience with the tapped part's modulus", G, kind="hand")
def tapped_resilience() -> Outcome:
    # VDI 2230-1 5.1.1, tapped thread joint: M10 hex, 45 mm, plain shank 10 mm, one 25 mm
    # steel plate, screwed into aluminium (E_M = 70 000 MPa): head 0.5 d and shank on A_N,
    # free thread 25 - 10 = 15 and engaged thread 0.5 d on A_d3 (E = 205 000), tapped hole
    # l_M = 0.33 d = 3.3 mm on A_N with E_M:
    # (5 + 10)/78.53982 = 0.1909859; (15 + 5)/52.29232 = 0.3824654;
    # 0.5734513/205 000 = 2.797323e-6; 3.3/(70 000 x 78.53982) = 6.002415e-7;
    # delta_S = 3.397565e-6 mm/N
    r = _analyse(
        {
            "title": "tapped verification joint",
            "bolt": _steel(
                thread="M10",
                grade="8.8",
                length="45 mm",
                shank_length="10 mm",
                bearing_diameter="16 mm",
            ),
            "tapped_hole": {"modulus": "70 GPa", "expansion": "23e-6 / K", "strength": "300 MPa"},
            "clamped": [
                _steel(thickness="25 mm", hole="11 mm", outer_diameter="40 mm"),
            ],
            "tightening": {"torque": "30 N*m", "thread_friction": 0.12},
        }
    )
    return Outcome(
        r.springs.delta_S * 1e3 * 1e6,
        3.397565,
        2e-6,
        f"{VDI} 5.1.1 (l_M = 0.33 d on A_N with the tapped part's modulus), hand calculation",
        "1e-6 mm/N",
    )


# ----------------------------------------------------------------------------- R8, R10


# F_M,zul (R7, nu = 0.9, mu_G,min = 0.12, R_p0.2 = 640 MPa):
#   P/(pi d2) = 1.5/(pi x 9.025722) = 0.0528999; + 1.155 x 0.12 = 0.1914999
#   (3/2) d2/d0 = 1.5 x 1.0503948 = 1.5755922; x 0.1914999 = 0.3017258; 3 x ^2 = 0.2731155
#   F_M,zul = 57.98960 x 0.9 x 640/sqrt(1.2731155) = 33 402.01/1.1283242 = 29 603.2 N
# R8: F_S,max = F_M,zul + Phi_n F_A,max = 29 603.2 + 0.0659014 x 8000 = 30 130.4 N
#   sigma_z = 30 130.4/57.98960 = 519.583 MPa
#   M_G = F_M,zul d2/2 (P/(pi d2) + 1.155 mu_G) = 29 603.2 x 4.512861 x 0.1914999
#       = 25 583.5 N*mm; W_p = pi d0^3/16 = 124.5719 mm^3; k_tau tau = 0.5 x 205.371
#       = 102.686 MPa
#   sigma_red,B = sqrt(519.583^2 + 3 x 102.686^2) = 549.181 MPa
@register("working stress R8 at F_M,zul, torque tightening", G, kind="hand")
def working_stress() -> Outcome:
    c = _check(_torque_joint(), "working_stress")
    return Outcome(
        c.value,
        549.181,
        ROUNDED_1155,
        f"{VDI} 5.5.2, R8 (sigma_red,B, k_tau = 0.5, F_S,max from F_M,zul), hand calculation",
        "MPa",
    )


@register("surface pressure R10 at F_M,zul under the head", G, kind="hand")
def surface_pressure() -> Outcome:
    # p = F_S,max/A_p, A_p = pi/4 (16^2 - 11^2) = 106.0288 mm^2: 30 130.4/106.0288 = 284.172 MPa
    c = _check(_torque_joint(), "surface_pressure_head")
    return Outcome(
        c.value,
        284.172,
        ROUNDED_1155,
        f"{VDI} 5.5.4, R10 (p = F_S,max/A_p, F_S,max from F_M,zul), hand calculation",
        "MPa",
    )


# ----------------------------------------------------------------------------- R12 slip


@register("slip R12: required clamp load F_Q S_G/mu_T in the joint", G, kind="hand")
def slip_limit() -> Outcome:
    # the axial load alternates (2..8 kN): S_G = 1.8 (clampstack's default after VDI 2230-1
    # R12, from memory); mu_T = 0.15 (default), F_Q = 1 kN:
    # F_KQerf S_G = 1 x 1.8/0.15 = 12.0 kN
    c = _check(_torque_joint(), "slip")
    return Outcome(c.limit, 12.0, 1e-12, f"{VDI} 5.5.6, R12 (from memory), hand calculation", "kN")


@register("slip R12: clamp load for a transverse load and a torque", G, kind="hand")
def slip_torque() -> Outcome:
    # F_KQerf = F_Q/(q_F mu_T) + M_Y/(q_M r_a mu_T), times S_G:
    # F_Q = 5 kN, M_Y = 100 N*m, q_F = q_M = 2, r_a = 40 mm, mu_T = 0.2, S_G = 1.8:
    # (5000/0.4 + 100 000/(2 x 40 x 0.2)) x 1.8 = (12 500 + 6250) x 1.8 = 33 750 N
    F = slip_clamp_load(5e3, 0.2, q_F=2, safety=1.8, M_Y=100.0, q_M=2, r_a=40e-3)
    return Outcome(
        float(F) / 1e3, 33.75, 1e-12, f"{VDI} 5.5.6, R12 (from memory), hand calculation", "kN"
    )


# ----------------------------------------------------------------------------- R9 rolled after


@register("fatigue R9: endurance of a thread rolled after heat treatment", G, kind="hand")
def fatigue_after_component() -> Outcome:
    # sigma_ASG = (2 - F_Sm/F_0.2min) sigma_ASV, M10: sigma_ASV = 0.85 (150/10 + 45) = 51.0 MPa;
    # F_Sm/F_0.2min = 0.6: (2 - 0.6) x 51.0 = 71.4 MPa
    s = endurance_rolled_after_heat_treatment(10e-3, 0.6, 1.0)
    return Outcome(float(s) / MPA, 71.4, 1e-12, f"{VDI} 5.5.3, R9 (from memory), hand", "MPa")


@register(
    "fatigue R9 in the joint: rolled after heat treatment, mean load from F_M,zul", G, kind="hand"
)
def fatigue_after_joint() -> Outcome:
    # F_Sm = F_M,zul + Phi_n (F_A,max + F_A,min)/2 = 29 603.2 + 0.0659014 x 5000 = 29 932.7 N
    # F_0.2min = A_s R_p0.2 = 57.98960 x 640 = 37 113.3 N; F_Sm/F_0.2min = 0.806521
    # sigma_ASG = (2 - 0.806521) x 51.0 = 60.8674 MPa; / S_D = 1.2 -> 50.7228 MPa
    c = _check(_torque_joint(), "fatigue")
    return Outcome(
        c.limit,
        50.7228,
        ROUNDED_1155,
        f"{VDI} 5.5.3, R9 (sigma_ASG/S_D, from memory), hand calculation",
        "MPa",
    )


# ----------------------------------------------------------------------------- tension


@register("tension tightening: F_M,zul = nu R_p0.2 A_s (no torsion)", G, kind="hand")
def tension_fmzul() -> Outcome:
    # 0.9 x 640 x 57.98960 = 33 402.01 N
    r = _tension_joint()
    return Outcome(
        r.permissible_preload / 1e3,
        33.40201,
        1e-6,
        f"{VDI} R7 without thread torsion (hydraulic tensioning), hand calculation",
        "kN",
    )


@register("tension tightening: F_M,min = 2 F_V/(1 + alpha_A)", G, kind="hand")
def tension_fmmin() -> Outcome:
    # nominal 25 kN, alpha_A = 1.4 (middle of VDI 2230-1 Table A8's 1.2-1.6, from memory):
    # F_M,min = 2 x 25/(1 + 1.4) = 20.83333 kN, F_M,max = 1.4 x F_M,min = 29.16667 kN
    r = _tension_joint()
    return Outcome(
        r.assembly_min / 1e3,
        20.83333,
        1e-6,
        f"{VDI} R1, Table A8 (from memory), nominal preload as the mean, hand calculation",
        "kN",
    )


@register("tension tightening: working stress R8 without residual torsion", G, kind="hand")
def tension_working_stress() -> Outcome:
    # k_tau = 0 (no thread torque): sigma_red,B = (F_M,zul + Phi_n F_A,max)/A_s
    # = (33 402.01 + 0.0659014 x 8000)/57.98960 = 33 929.22/57.98960 = 585.0915 MPa
    c = _check(_tension_joint(), "working_stress")
    return Outcome(
        c.value, 585.0915, 1e-6, f"{VDI} 5.5.2, R8 with k_tau = 0, hand calculation", "MPa"
    )


# ----------------------------------------------------------------------------- yield


@register("yield-controlled tightening: F_M,min at R_p0.2min and mu_G,max", G, kind="hand")
def yield_fmmin() -> Outcome:
    # R7 with nu = 1, mu_G = 0.14: 0.0528999 + 1.155 x 0.14 = 0.2145999; x 1.5755922
    # = 0.3381222; 3 x ^2 = 0.3429798; F = 57.98960 x 640/sqrt(1.3429798) = 37 113.34/1.1588700
    # = 32 025.4 N
    r = _yield_joint()
    return Outcome(
        r.assembly_min / 1e3,
        32.0254,
        ROUNDED_1155,
        f"{VDI} R7 with nu = 1 (tightened to yield), hand calculation",
        "kN",
    )


@register("yield-controlled tightening: F_M,max at 1.2 R_p0.2min and mu_G,min", G, kind="hand")
def yield_fmmax() -> Outcome:
    # R7 with nu = 1, R_p0.2max = 1.2 x 640 = 768 MPa (from memory), mu_G = 0.10:
    # 0.0528999 + 0.1155 = 0.1683999; x 1.5755922 = 0.2653300; 3 x ^2 = 0.2112002;
    # F = 57.98960 x 768/sqrt(1.2112002) = 44 536.01/1.1005454 = 40 467.2 N
    r = _yield_joint()
    return Outcome(
        r.assembly_max / 1e3,
        40.4672,
        ROUNDED_1155,
        f"{VDI} R7 with nu = 1 and the lot's upper yield point (from memory), hand calculation",
        "kN",
    )
