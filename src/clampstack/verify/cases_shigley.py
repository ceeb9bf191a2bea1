"""Worked examples of Shigley's Mechanical Engineering Design, ch. 8, with their printed answers.

Budynas & Nisbett, *Shigley's Mechanical Engineering Design*, 9th ed. (McGraw-Hill,
2011), chapter 8 "Screws, Fasteners, and the Design of Nonpermanent Joints".  The
input data, the printed answers and the example and equation numbers are recalled
without the book at hand (from memory), and the pages are not recalled: confirm them
against the book.  Every number is computed with clampstack's own functions in the
book's conventions: Shigley's bolt stiffness ``k_b = A_d A_t E/(A_d l_t + A_t l_d)``
(eq. (8-17)) from :func:`~clampstack.components.cylinder_resilience` of the shank
and the threaded part (``A_t`` from the catalog), member stiffness by 30-degree
frusta (:func:`~clampstack.components.shigley_members`, eq. (8-20)/(8-22)) or by
Wileman's fit (eq. (8-23)), and the load sharing of bolt and members from
clampstack's joint network (:func:`~clampstack.joint.prepare.joint_network` with the
load at the bearing planes, ``n = 1``), which gives Shigley's joint constant
``C = k_b/(k_b + k_m)``.  Shigley's frustum constants are 0.5774 and 1.155 (tan 30
and 2 tan 30 degrees rounded); the code uses the exact tangent.

The tolerance is half a unit of the last printed digit, as a fraction of the value.
"""

from __future__ import annotations

import math

from ..catalog import grade, thread
from ..components import (
    cylinder_resilience,
    head_torque,
    plate_resiliences,
    shigley_frustum,
    shigley_members,
    thread_torque,
    wileman_1991,
)
from .registry import Outcome, register

G = "worked examples: Shigley"
INCH = 0.0254
PSI = 6894.757293168361
LBF = 4.4482216152605
LBF_PER_IN = LBF / INCH
MLBF_PER_IN = 1e6 * LBF_PER_IN
KIP = 1e3 * LBF
E_STEEL = 30e6 * PSI
BOOK = "Budynas & Nisbett, Shigley's Mechanical Engineering Design, 9th ed. (2011), ch. 8"


def _src(example: str) -> str:
    return f"{BOOK}, Example {example}, page not recalled (from memory)"


def _half_step(printed: str) -> float:
    """Half a unit of the last printed digit, relative ("15.97" -> 0.005/15.97)."""
    decimals = len(printed.split(".")[1]) if "." in printed else 0
    return 0.5 * 10.0**-decimals / float(printed)


def _printed(computed: float, printed: str, example: str, unit: str, extra: float = 0.0):
    return Outcome(computed, float(printed), _half_step(printed) + extra, _src(example), unit)


def _bolt_stiffness(ld_in: float, lt_in: float, d_in: float, designation: str) -> float:
    """Shigley eq. (8-17): shank l_d on A_d and thread l_t on A_t in series [N/m], steel."""
    Ad = math.pi / 4 * (d_in * INCH) ** 2
    At = thread(designation).As
    return 1.0 / (
        cylinder_resilience(ld_in * INCH, Ad, E_STEEL)
        + cylinder_resilience(lt_in * INCH, At, E_STEEL)
    )


def _joint(kb: float, km: float, Fi: float, P: float) -> tuple[float, float, float, float]:
    """Bolt and clamp loads of clampstack's joint network, preloaded to F_i, at 0 and at P [N].

    Bolt (tension only) beside the members (compression only), the load applied at the
    bearing planes (n = 1), the preload as a length misfit of the bolt.
    """
    from ..joint.prepare import joint_network, solve_service

    dS, dP = 1.0 / kb, 1.0 / km
    jn = joint_network(dS, dP, 1.0, -Fi * (dS + dP), 0.0)
    b0, c0 = solve_service(jn, 0.0)
    b1, c1 = solve_service(jn, P)
    return b0, c0, b1, c1


# ----------------------------------------------------------------------------- Example 8-1
# Square-thread power screw, F = 6.4 kN per screw, collar d_c = 40 mm, f_c = 0.08: the collar
# torque T_c = F f_c d_c/2 (eq. (8-6)) is printed as 10.24 N*m.  It is the bearing-friction
# term of the bolt torque, M_K = F mu_K D_Km/2 (VDI 2230-1 R13, ISO 16047).


@register("Shigley Ex. 8-1: collar friction torque T_c", G, kind="published")
def ex81_collar() -> Outcome:
    return _printed(float(head_torque(6.4e3, 0.08, 40e-3)), "10.24", "8-1(b)", "N*m")


# ----------------------------------------------------------------------------- Example 8-2
# Two 1/2 in steel plates (E = 30 Mpsi) and a 0.095 in steel washer, 1/2-13 UNC SAE grade 5
# bolt: grip l = 1.095 in, L = 1.75 in, L_T = 2d + 1/4 = 1.25 in, l_d = 0.50 in,
# l_t = 0.595 in, A_d = 0.1963 in^2, A_t = 0.1419 in^2.  Printed: k_m = 15.97 Mlbf/in
# (frusta, eq. (8-22)), 15.73 Mlbf/in (Wileman, eq. (8-23)), k_b = 4.45 Mlbf/in,
# C = 0.218.


def _ex82() -> tuple[float, float]:
    kb = _bolt_stiffness(0.50, 0.595, 0.5, "1/2-13 UNC")
    plates = [0.5 * INCH, 0.5 * INCH, 0.095 * INCH]
    km = 1.0 / float(shigley_members(plates, [E_STEEL] * 3, 0.5 * INCH).sum())
    return kb, km


@register("Shigley Ex. 8-2: member stiffness k_m by frusta", G, kind="published")
def ex82_km() -> Outcome:
    return _printed(_ex82()[1] / MLBF_PER_IN, "15.97", "8-2(a)", "Mlbf/in")


@register("Shigley Ex. 8-2: member stiffness k_m by Wileman's fit", G, kind="published")
def ex82_wileman() -> Outcome:
    km = float(wileman_1991(0.5 * INCH, 1.095 * INCH, E_STEEL, "steel"))
    return _printed(km / MLBF_PER_IN, "15.73", "8-2(a)", "Mlbf/in")


@register("Shigley Ex. 8-2: bolt stiffness k_b", G, kind="published")
def ex82_kb() -> Outcome:
    return _printed(_ex82()[0] / MLBF_PER_IN, "4.45", "8-2(b)", "Mlbf/in")


@register("Shigley Ex. 8-2: joint constant C from the joint network", G, kind="published")
def ex82_C() -> Outcome:
    # the example gives no preload or load; C does not depend on them while the joint is
    # clamped (10 kip preload, 1 kip load)
    kb, km = _ex82()
    P = 1e3 * LBF
    b0, _, b1, _ = _joint(kb, km, 10e3 * LBF, P)
    return _printed((b1 - b0) / P, "0.218", "8-2(c)", "")


# ----------------------------------------------------------------------------- Example 8-3
# 3/4-16 UNF SAE grade 5 bolt in a tension joint, P = 6 kip, F_i = 25 kip, k_b = 6.50 and
# k_m = 13.8 Mlbf/in, A_t = 0.373 in^2.  Printed: sigma_i = F_i/A_t = 67.0 kpsi;
# sigma_b = (C P + F_i)/A_t = 72.2 kpsi with C = 0.320.


@register("Shigley Ex. 8-3: preload stress sigma_i = F_i/A_t", G, kind="published")
def ex83_sigma_i() -> Outcome:
    At = thread("3/4-16 UNF").As
    return _printed(25 * KIP / At / PSI / 1e3, "67.0", "8-3(a)", "kpsi")


@register("Shigley Ex. 8-3: bolt stress in service from the joint network", G, kind="published")
def ex83_sigma_b() -> Outcome:
    At = thread("3/4-16 UNF").As
    _, _, b1, _ = _joint(6.50 * MLBF_PER_IN, 13.8 * MLBF_PER_IN, 25 * KIP, 6 * KIP)
    return _printed(b1 / At / PSI / 1e3, "72.2", "8-3(a)", "kpsi")


@register("Shigley Ex. 8-3 data: tightening torque by eq. (8-26)", G, kind="hand")
def ex83_torque() -> Outcome:
    # Shigley eq. (8-26): T = (F_i d_m/2)(tan lambda + f sec alpha)/(1 - f tan lambda sec
    # alpha) + 0.625 f_c F_i d, the power-screw torque of a 60-degree thread plus the
    # collar on the mean of d and 1.5 d.  The first term is tan(lambda + rho') with
    # tan rho' = f/cos 30 deg, which is clampstack's thread torque in its exact form with d_m
    # in place of d_2; the second is its bearing torque with D_Km = 1.25 d.  Data of
    # Ex. 8-3: F_i = 25 kip, d = 0.75 in, 16 threads/in, d_r = sqrt(4 x 0.351/pi) = 0.668 in
    # (minor area of Table 8-2), d_m = (0.75 + 0.668)/2 = 0.709 in, f = f_c = 0.15.  By hand:
    # tan lambda = (1/16)/(pi x 0.709) = 0.0280598; f sec 30 deg = 0.173205;
    # (0.0280598 + 0.173205)/(1 - 0.15 x 0.0280598 x 1.154701) = 0.201265/0.995140
    # = 0.202248; 25 000 x 0.709/2 x 0.202248 = 1792.42 lbf*in;
    # 0.625 x 0.15 x 25 000 x 0.75 = 1757.81 lbf*in; T = 3550.23 lbf*in = 3.55023 kip*in
    F = 25 * KIP
    Tt = thread_torque(F, INCH / 16, 0.709 * INCH, 0.15, exact=True)
    Tb = head_torque(F, 0.15, 1.25 * 0.75 * INCH)
    return Outcome(
        float(Tt + Tb) / (KIP * INCH),
        3.55023,
        2e-5,
        f"hand calculation from {BOOK}, eq. (8-26) with the data of Example 8-3 "
        "(data from memory), not a printed answer",
        "kip*in",
    )


# ----------------------------------------------------------------------------- Example 8-4
# Grade 25 cast-iron pressure vessel, separating force 36 kip on N bolts, 5/8-11 UNC SAE
# grade 5 x 2 1/4 in, grip l = 1.50 in (two 3/4 in members), L_T = 2d + 1/4 = 1.50 in,
# l_d = 0.75 in, l_t = 0.75 in, A_d = 0.3068 in^2, A_t = 0.226 in^2, E = 30 Mpsi (bolt) and
# 14 Mpsi (no. 25 cast iron, Table A-24, as the example takes it), S_p = 85 kpsi.  Printed:
# k_b = 5.21 Mlbf/in, k_m = 8.95 Mlbf/in (eq. (8-22)), C = 0.368, F_i = 0.75 A_t S_p =
# 14.4 kip, N = 5.52 -> six bolts; with six (P = 6 kip each): n_L = 2.18, n_p = 1.16,
# n_0 = 3.80.


def _ex84():
    kb = _bolt_stiffness(0.75, 0.75, 0.625, "5/8-11 UNC")
    E_ci = 14e6 * PSI
    km = 1.0 / float(shigley_members([0.75 * INCH, 0.75 * INCH], [E_ci, E_ci], 0.625 * INCH).sum())
    At = thread("5/8-11 UNC").As
    Fp = At * grade("SAE J429 5", 0.625 * INCH).proof  # proof load A_t S_p
    Fi = 0.75 * Fp  # Shigley eq. (8-31), reusable connections
    P = 36 * KIP / 6
    return kb, km, Fp, Fi, P, _joint(kb, km, Fi, P)


@register("Shigley Ex. 8-4: bolt stiffness k_b", G, kind="published")
def ex84_kb() -> Outcome:
    return _printed(_ex84()[0] / MLBF_PER_IN, "5.21", "8-4(a)", "Mlbf/in")


@register("Shigley Ex. 8-4: member stiffness k_m, cast iron", G, kind="published")
def ex84_km() -> Outcome:
    return _printed(_ex84()[1] / MLBF_PER_IN, "8.95", "8-4(a)", "Mlbf/in")


@register("Shigley Ex. 8-4: joint constant C from the joint network", G, kind="published")
def ex84_C() -> Outcome:
    *_, P, (b0, _, b1, _) = _ex84()
    return _printed((b1 - b0) / P, "0.368", "8-4(a)", "")


@register("Shigley Ex. 8-4: preload F_i = 0.75 A_t S_p", G, kind="published")
def ex84_Fi() -> Outcome:
    return _printed(_ex84()[3] / KIP, "14.4", "8-4(b)", "kip")


@register("Shigley Ex. 8-4: load factor n_L with six bolts", G, kind="published")
def ex84_nL() -> Outcome:
    # n_L = (S_p A_t - F_i)/(C P) (eq. (8-29)); C P is the network's bolt load increase
    _, _, Fp, Fi, _, (b0, _, b1, _) = _ex84()
    return _printed((Fp - Fi) / (b1 - b0), "2.18", "8-4(c)", "")


@register("Shigley Ex. 8-4: yielding factor of safety n_p", G, kind="published")
def ex84_np() -> Outcome:
    # n_p = S_p A_t/(C P + F_i) (eq. (8-28)): the proof load over the network's bolt load
    _, _, Fp, _, _, (_, _, b1, _) = _ex84()
    return _printed(Fp / b1, "1.16", "8-4(c)", "")


@register("Shigley Ex. 8-4: load factor against separation n_0", G, kind="published")
def ex84_n0() -> Outcome:
    # n_0 = F_i/(P (1 - C)) (eq. (8-30)): the network's clamp load falls by (1 - C) P
    *_, (_, c0, _, c1) = _ex84()
    return _printed(c0 / (c0 - c1), "3.80", "8-4(c)", "")


# ----------------------------------------------------------------------------- Example 8-5
# Cap screw 5/8-11 UNC SAE grade 5 through a 1/16 in hardened steel washer and a 5/8 in
# steel cover (E = 30 Mpsi) into a cast-iron base (E = 16 Mpsi), t_2 >= d: effective grip
# l = h + d/2 = 0.6875 + 0.3125 = 1 in (Fig. 8-20), D = 1.5 d = 0.9375 in; three frusta:
# steel t = 0.5 in, steel t = 0.1875 in from D = 1.298 in, cast iron t = 0.3125 in.
# Printed: k_1 = 46.46, k_2 = 197.43, k_3 = 32.39, k_m = 17.40 Mlbf/in; the screw is
# threaded all the way, k_b = A_t E/l = 6.78 Mlbf/in; C = 0.280.
# clampstack's Shigley cap-screw rule (a slab d/2 of the tapped part below the last plate,
# plate_resiliences(..., method="shigley", tapped=True)) is the rule of Fig. 8-20.


def _ex85() -> tuple[float, float]:
    plates = [(0.0625 * INCH, E_STEEL, "steel"), (0.625 * INCH, E_STEEL, "steel")]
    r = plate_resiliences(
        plates,
        0.9375 * INCH,
        0.6875 * INCH,
        method="shigley",
        tapped=True,
        d=0.625 * INCH,
        E_tapped=16e6 * PSI,
    )
    kb = 1.0 / float(cylinder_resilience(1.0 * INCH, thread("5/8-11 UNC").As, E_STEEL))
    return kb, 1.0 / float(r.sum())


@register("Shigley Ex. 8-5: upper frustum k_1 of a cap-screw joint", G, kind="published")
def ex85_k1() -> Outcome:
    k1 = float(shigley_frustum(0.5 * INCH, 0.625 * INCH, 0.9375 * INCH, E_STEEL))
    return _printed(k1 / MLBF_PER_IN, "46.46", "8-5(a)", "Mlbf/in")


@register("Shigley Ex. 8-5: cap-screw member stiffness k_m, l = h + d/2", G, kind="published")
def ex85_km() -> Outcome:
    # The book evaluates eq. (8-20) with 0.5774 and 1.155 and rounds D of the middle frustum
    # to 1.298 in: its own three frusta give 46.458, 197.433, 32.394 -> k_m = 17.4035; the
    # exact tan 30 deg and D = 1.29821 in give 17.4057 (+0.0124 %).  That 0.0124 % is added
    # to the half-unit tolerance (0.029 %) as 0.015 %.
    return _printed(_ex85()[1] / MLBF_PER_IN, "17.40", "8-5(a)", "Mlbf/in", extra=1.5e-4)


@register("Shigley Ex. 8-5: cap-screw stiffness k_b = A_t E/l", G, kind="published")
def ex85_kb() -> Outcome:
    return _printed(_ex85()[0] / MLBF_PER_IN, "6.78", "8-5(a)", "Mlbf/in")


@register("Shigley Ex. 8-5: joint constant C from the joint network", G, kind="published")
def ex85_C() -> Outcome:
    # F_i = 0.75 A_t S_p = 14.4 kip and the largest load of 5 kip per screw (Example 8-5(b))
    kb, km = _ex85()
    P = 5 * KIP
    b0, _, b1, _ = _joint(kb, km, 14.4 * KIP, P)
    return _printed((b1 - b0) / P, "0.280", "8-5(a)", "")
