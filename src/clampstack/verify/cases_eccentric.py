"""Eccentric clamping and loading (VDI 2230-1:2015, 5.1.2.3 and 5.3.2; relations from memory).

The joint is the check-chain verification joint of :mod:`clampstack.verify.cases_checks`
(M10 8.8 through bolt, two 15 mm steel plates, E = 205 000 MPa, n = 0.5, F_A = 2..8 kN;
by hand there: delta_S = 3.512182e-6, delta_P = 5.331916e-7 mm/N) with the bolt
s_sym = 5 mm and the load a = 20 mm off the axis of a 40 x 60 mm interface and a given
I_Bers = 20 000 mm^4.  By hand:

* beta = l_K / (E I_Bers) = 30 / (205 000 x 20 000) = 7.317073e-9 1/(N mm);
* delta_P* = 5.331916e-7 + 25 beta = 7.161184e-7, delta_P** = 5.331916e-7 + 100 beta
  = 1.2648989e-6 mm/N;
* Phi_en* = 0.5 x 1.2648989 / (3.512182 + 0.7161184) = 0.1495753;
* A_D = 2400 mm^2, I_BT = 40 x 60^3 / 12 = 720 000 mm^4, I_BT/A_D = 300 mm^2, u = 30 mm:
  F_Kab = 8000 x (20 - 5) x 30 / (300 + 5 x 30) = 8000 N.
"""

from __future__ import annotations

from functools import cache

from .registry import Outcome, register

G = "eccentric joints"
VDI = "VDI 2230-1:2015"


@cache
def _joint():
    from ..inputs.joint import joint_from_data
    from ..joint import analyse
    from .cases_checks import _data

    d = _data()
    d["eccentricity"] = {
        "bolt_offset": "5 mm",
        "load_offset": "20 mm",
        "interface": {"width": "40 mm", "length": "60 mm"},
        "bending_inertia": "20000 mm^4",
    }
    return analyse(joint_from_data(d))


@register("eccentric load factor Phi_en*, by hand", G, kind="hand")
def load_factor() -> Outcome:
    return Outcome(
        _joint().load_factor,
        0.1495753,
        3e-6,
        f"{VDI} 5.1.2.3 and 5.3.2 (delta_P*, delta_P**, Phi_en*; from memory), hand calculation",
    )


@register("clamp load against opening F_Kab, by hand", G, kind="hand")
def opening_clamp_load() -> Outcome:
    e = _joint().eccentric
    return Outcome(
        e["opening_clamp_load_N"],
        8000.0,
        1e-12,
        f"{VDI} 5.3.2 (F_Kab from Navier's linear pressure over A_D, I_BT; from memory)",
        "N",
    )


@register("substitute inertia of a deformation cone, VDI's 0.147 form", G, kind="hand")
def cone_inertia() -> Outcome:
    # d_W = 16, D_A = 40 mm: 0.147 (40 - 16) 16^3 40^3 / (40^3 - 16^3) = 15 438.77 mm^4;
    # clampstack integrates the solid cone exactly (3 pi/64 = 0.14726 for VDI's 0.147)
    from ..joint.eccentric import cone_body_inertia

    t = 0.5
    lV = (40e-3 - 16e-3) / (2 * t)
    computed = cone_body_inertia(16e-3, 40e-3, 2 * lV, t, tapped=False) * 1e12
    return Outcome(
        computed,
        15438.77,
        2e-3,
        f"{VDI} 5.1.2.3 (I_V,Bers with the printed 0.147; from memory), hand calculation",
        "mm^4",
    )


@register("no-tension rectangle: contact on 3 (c/2 - e) beyond the kern", G, kind="hand")
def kern() -> Outcome:
    # elementary mechanics of a section that carries compression only (the middle third;
    # e.g. Timoshenko and Gere, Mechanics of Materials, from memory): c = 60 mm, e = 20 mm
    # > c/6: the contact is 3 (30 - 20) = 30 mm long
    ej = _joint().eccentric_joint
    w, th = ej.bed_inverse(10e3, 10e3 * 20e-3)
    lo, hi = ej._contact(w, th)
    return Outcome((hi - lo) * 1e3, 30.0, 1e-9, "section kern, hand calculation", "mm")


@register("contact model below opening equals VDI's linear bolt load", G, kind="consistency")
def contact_closed() -> Outcome:
    r = _joint()
    ej = r.eccentric_joint
    FV = next(s for s in r.states if s.key == "temperature").bolt_min
    # 4 kN: below the opening load of the minimum preload (F_A,ab = 7.5 kN)
    st = ej._follow(FV, 4e3, 0.0, 0.0)
    return Outcome(
        st.bolt_load,
        ej.linear(FV, 4e3, 0.0)[0],
        1e-9,
        "the contact model (compression-only bed) against VDI 2230-1 5.3.2 in closed form",
        "N",
    )
