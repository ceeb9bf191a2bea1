"""Stiffness models: VDI 2230-1 bolt and cone/sleeve, Shigley frusta, Wileman et al. (1991).

Expected values are hand calculations from the published formulas, the working
written out beside each case (a calculator, not the code under test).
"""

from __future__ import annotations

from ..components.bolt import bolt_resilience
from ..components.plates import (
    shigley_frustum,
    shigley_members,
    sleeve_resilience,
    vdi2230_cone,
    vdi2230_plates,
    wileman_1991,
)
from .registry import Outcome, register

MPA = 1e6
E_STEEL = 205_000 * MPA
INCH = 0.0254
PSI = 6894.757293168361
LBF_PER_IN = 4.4482216152605 / INCH
G = "stiffness"


@register("VDI bolt resilience, M10 hex, l_K = 30 mm", G, kind="hand")
def vdi_bolt() -> Outcome:
    # VDI 2230-1:2015 5.1.1, M10 hex bolt, l_K = 30 mm, plain shank 10 mm of d = 10 mm,
    # E = 205 000 MPa, nut.  A_N = 78.540 mm^2, A_d3 = pi/4 8.15970^2 = 52.292 mm^2:
    # head 0.5 d = 5, shank 10, nut 0.4 d = 4 on A_N; free thread 20, engaged 0.5 d = 5 on A_d3
    # delta_S = [(5 + 10 + 4)/78.540 + (20 + 5)/52.292] / 205 000
    #         = (0.241915 + 0.478085)/205 000 = 3.5122e-6 mm/N
    r = bolt_resilience(10e-3, 1.5e-3, None, E_STEEL, 30e-3, [(10e-3, 10e-3)])
    return Outcome(
        r.total * 1e3 * 1e6, 3.5122, 2e-4, "VDI 2230-1:2015 5.1.1, hand calculation", "1e-6 mm/N"
    )


@register("VDI cone, through bolt, full cone", G, kind="hand")
def vdi_cone() -> Outcome:
    # VDI 2230-1:2015 5.1.2.1, l_K = 30, d_W = 16, d_h = 11, D'_A = 40 mm, steel:
    # beta_L = 1.875, y = 2.5
    # tan phi_D = 0.362 + 0.032 ln(0.9375) + 0.153 ln(2.5) = 0.500127
    # D_A,Gr = 16 + 30 x 0.500127 = 31.004 < 40: full cone
    # delta_P = 2 ln[27 x 20.004 / (5 x 42.004)] / (205 000 pi 11 x 0.500127)
    #         = 2 x 0.944561 / 3.54305e6 = 5.3319e-7 mm/N
    r = vdi2230_cone(30e-3, 16e-3, 11e-3, 40e-3, E_STEEL)
    return Outcome(
        r * 1e3 * 1e7, 5.3319, 2e-4, "VDI 2230-1:2015 5.1.2.1, hand calculation", "1e-7 mm/N"
    )


@register("VDI cone + sleeve, tapped joint", G, kind="hand")
def vdi_cone_sleeve() -> Outcome:
    # VDI 2230-1:2015 5.1.2.1, tapped (w = 2), same geometry:
    # tan phi_E = 0.348 + 0.013 ln(1.875) + 0.193 ln(2.5) = 0.533016
    # D_A,Gr = 16 + 2 x 30 x 0.533016 = 47.98 > 40: cone + sleeve
    # delta_P = {2/(2 x 11 x 0.533016) ln[27 x 29/(5 x 51)]
    #            + 4/(1600 - 121) [30 - 24/(2 x 0.533016)]} / (205 000 pi)
    #         = (0.191340 + 0.020248)/644 026 = 3.2854e-7 mm/N
    r = vdi2230_cone(30e-3, 16e-3, 11e-3, 40e-3, E_STEEL, tapped=True)
    return Outcome(
        r * 1e3 * 1e7, 3.2854, 2e-4, "VDI 2230-1:2015 5.1.2.1, hand calculation", "1e-7 mm/N"
    )


def _two_materials():
    return vdi2230_plates([10e-3, 20e-3], [E_STEEL, 70_000 * MPA], 16e-3, 11e-3, 40e-3)


# VDI 2230-1:2015 5.1.2 (parts of different moduli: delta_P = sum of the slices), through
# bolt, steel 10 mm on aluminium 20 mm (E = 70 000 MPa), d_W = 16, d_h = 11, D'_A = 40:
# tan phi = 0.500127; cone from the head D(10) = 26.0025, meets its mirror at 15 mm.
# steel 0..10: ln[27 x 15.0025/(5 x 37.0025)]/(205 000 pi 11 x 0.500127) = 2.21175e-7 mm/N
# aluminium 10..30: (ln 1.174602 + ln 2.571686)/(70 000 pi 11 x 0.500127) = 9.13764e-7 mm/N
@register("VDI cone sliced, steel plate of a steel/aluminium stack", G, kind="hand")
def vdi_slice_steel() -> Outcome:
    return Outcome(
        _two_materials()[0] * 1e3 * 1e7,
        2.21175,
        1e-4,
        "VDI 2230-1:2015 5.1.2, hand calculation",
        "1e-7 mm/N",
    )


@register("VDI cone sliced, aluminium plate of a steel/aluminium stack", G, kind="hand")
def vdi_slice_alu() -> Outcome:
    return Outcome(
        _two_materials()[1] * 1e3 * 1e7,
        9.13764,
        1e-4,
        "VDI 2230-1:2015 5.1.2, hand calculation",
        "1e-7 mm/N",
    )


@register("sleeve resilience, 70 mm aluminium tube 24/13 mm", G, kind="hand")
def sleeve() -> Outcome:
    # Hooke's law for a tube (VDI 2230-1 5.1.2, sleeve case): delta = 4 l/(E pi (D^2 - d^2))
    # A = pi/4 (24^2 - 13^2) = pi/4 x 407 = 319.657 mm^2
    # delta = 70/(70 000 x 319.657) = 3.12835e-6 mm/N
    r = sleeve_resilience(70e-3, 24e-3, 13e-3, 70_000 * MPA)
    return Outcome(
        r * 1e3 * 1e6, 3.12835, 1e-5, "VDI 2230-1:2015 5.1.2, sleeve, hand calculation", "1e-6 mm/N"
    )


@register("Shigley frustum, eq. (8-20)", G, kind="hand")
def shigley_single() -> Outcome:
    # Shigley ch. 8, eq. (8-20), t = 0.75 in, d = 0.5 in, D = 0.75 in, E = 30 Mpsi:
    # ln[(1.155 x 0.75 + 0.25)(1.25)/((1.155 x 0.75 + 1.25)(0.25))] = ln(2.637330) = 0.969767
    # k = 0.5774 pi 30e6 x 0.5 / 0.969767 = 28.06e6 lbf/in
    k = shigley_frustum(0.75 * INCH, 0.5 * INCH, 0.75 * INCH, 30e6 * PSI) / LBF_PER_IN
    return Outcome(
        k / 1e6,
        28.06,
        1e-3,
        "Shigley, Mechanical Engineering Design, ch. 8, eq. (8-20), hand calculation",
        "Mlbf/in",
    )


@register("Shigley members, two equal steel plates, eq. (8-22)", G, kind="hand")
def shigley_two_plates() -> Outcome:
    # Shigley ch. 8, eq. (8-22): d = 0.5 in, l = 1.5 in, D = 1.5 d, E = 30 Mpsi:
    # 5 (0.5774 l + 0.5 d)/(0.5774 l + 2.5 d) = 5.5805/2.1161 = 2.63716; ln = 0.96970
    # k_m = 0.5774 pi 30e6 x 0.5 / (2 x 0.96970) = 14.03e6 lbf/in
    r = shigley_members([0.75 * INCH, 0.75 * INCH], [30e6 * PSI, 30e6 * PSI], 0.5 * INCH)
    return Outcome(
        1.0 / r.sum() / LBF_PER_IN / 1e6,
        14.03,
        1e-3,
        "Shigley, Mechanical Engineering Design, ch. 8, eq. (8-22), hand calculation",
        "Mlbf/in",
    )


@register("Shigley members, steel on cast iron, three frusta", G, kind="hand")
def shigley_cast_iron() -> Outcome:
    # Shigley ch. 8, members of different materials split into frusta in series.
    # d = 0.5 in, D = 0.75 in; steel 0.5 in (30 Mpsi) on cast iron 1.0 in (14.5 Mpsi):
    # k1 = 33.30e6 (steel, t = 0.5), k2 = 86.15e6 (cast iron, t = 0.25, D = 1.3274),
    # k3 = 13.56e6 (cast iron, t = 0.75); 1/k_m = 1/33.30 + 1/86.15 + 1/13.56 -> 8.667e6 lbf/in
    r = shigley_members([0.5 * INCH, 1.0 * INCH], [30e6 * PSI, 14.5e6 * PSI], 0.5 * INCH)
    return Outcome(
        1.0 / r.sum() / LBF_PER_IN / 1e6,
        8.667,
        2e-3,
        "Shigley, Mechanical Engineering Design, ch. 8, frusta in series, hand calculation",
        "Mlbf/in",
    )


@register("Wileman fit, 1/2 in steel bolt, 1.5 in grip", G, kind="hand")
def wileman_steel() -> Outcome:
    # Wileman, Choudhury and Green (1991), k_m = E d A exp(B d/l), steel A = 0.78715,
    # B = 0.62873 (as reproduced in Shigley ch. 8, eq. (8-23)):
    # k_m = 30e6 x 0.5 x 0.78715 exp(0.62873 x 0.5/1.5) = 11.80725e6 x 1.233156 = 14.56e6 lbf/in
    k = wileman_1991(0.5 * INCH, 1.5 * INCH, 30e6 * PSI) / LBF_PER_IN
    return Outcome(
        k / 1e6,
        14.56,
        1e-3,
        "Wileman, Choudhury and Green 1991 (Shigley ch. 8, eq. (8-23)), hand calculation",
        "Mlbf/in",
    )


@register("Wileman fit, aluminium, d/l = 0.5", G, kind="hand")
def wileman_alu() -> Outcome:
    # k_m/(E d) = A exp(B d/l), aluminium A = 0.79670, B = 0.63816 (from memory):
    # 0.79670 x e^(0.31908) = 0.79670 x 1.375861 = 1.09615
    d, E = 0.01, 100e9
    k = wileman_1991(d, 2 * d, E, "aluminium")
    return Outcome(
        k / (E * d),
        1.09615,
        2e-5,
        "Wileman, Choudhury and Green 1991, aluminium row (from memory), hand calculation",
        "",
    )
