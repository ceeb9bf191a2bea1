"""Validation against Shigley, Mechanical Engineering Design, ch. 8 (member stiffness).

US customary inputs converted exactly to SI.  The expected values are derived by hand
from the book's frustum equations (the working is in the comments); they are not copied
from a worked example.
"""

from __future__ import annotations

import math

import pytest

from clampstack.components.plates import clamped_resilience, shigley_frustum, shigley_members

INCH = 0.0254
PSI = 6894.757293168
LBF_PER_IN = 4.4482216152605 / INCH  # N/m
E_STEEL = 30e6 * PSI
E_CAST_IRON = 14.5e6 * PSI


def test_half_inch_bolt_two_steel_plates_eq_8_22():
    # Shigley ch. 8, eq. (8-22): two equal steel members, d = 0.5 in, l = 1.5 in, D = 1.5 d,
    # E = 30 Mpsi, derived by hand:
    #   0.5774 l = 0.8661;  5 (0.8661 + 0.25)/(0.8661 + 1.25) = 5.5805/2.1161 = 2.63716
    #   ln = 0.96970;  km = 0.5774 pi 30e6 0.5 / (2 x 0.96970) = 27.209e6/1.93940
    #      = 14.03e6 lbf/in
    r = shigley_members([0.75 * INCH, 0.75 * INCH], [E_STEEL, E_STEEL], 0.5 * INCH)
    km = 1.0 / r.sum() / LBF_PER_IN
    assert km == pytest.approx(14.03e6, rel=1e-3)


def test_single_frustum_eq_8_20():
    # Shigley ch. 8, eq. (8-20), t = 0.75 in, d = 0.5 in, D = 0.75 in, steel, by hand:
    #   ln[(1.155 x 0.75 + 0.25)(1.25)/((1.155 x 0.75 + 1.25)(0.25))]
    #   = ln(1.395313/0.529063) = ln(2.637330) = 0.969767
    #   k = 0.5774 pi 30e6 0.5 / 0.969767 = 28.06e6 lbf/in
    k = shigley_frustum(0.75 * INCH, 0.5 * INCH, 0.75 * INCH, E_STEEL) / LBF_PER_IN
    assert k == pytest.approx(28.06e6, rel=1e-3)


def test_steel_on_cast_iron_three_frusta():
    # Shigley ch. 8 (members of different materials: split into frusta, in series).
    # d = 0.5 in, D = 0.75 in; top steel 0.5 in, bottom cast iron 1.0 in (E = 14.5 Mpsi);
    # grip 1.5 in, mid-grip at 0.75 in.  By hand:
    #   k1 steel, t = 0.5, D = 0.75:
    #       ln[(0.5775 + 0.25)(1.25)/((0.5775 + 1.25)(0.25))] = ln(2.264022) = 0.817143
    #       k1 = 0.5774 pi 30e6 0.5/0.817143 = 33.30e6
    #   k2 cast iron, t = 0.25, D = 0.75 + 2 x 0.5 x 0.5774 = 1.3274:
    #       ln[(0.28875 + 0.8274)(1.8274)/((0.28875 + 1.8274)(0.8274))] = ln(1.164915)
    #       = 0.152650;  k2 = 0.5774 pi 14.5e6 0.5/0.152651 = 86.15e6
    #   k3 cast iron, t = 0.75, D = 0.75: ln(2.637330) = 0.969767;  k3 = 13.56e6
    #   1/km = 1/33.30 + 1/86.15 + 1/13.56 (per 1e6)  ->  km = 8.667e6 lbf/in
    r = shigley_members([0.5 * INCH, 1.0 * INCH], [E_STEEL, E_CAST_IRON], 0.5 * INCH)
    km = 1.0 / r.sum() / LBF_PER_IN
    assert km == pytest.approx(8.667e6, rel=2e-3)
    # the front with the same inputs
    plates = [(0.5 * INCH, E_STEEL, "steel"), (1.0 * INCH, E_CAST_IRON, "grey-cast-iron")]
    front = clamped_resilience(plates, 0.75 * INCH, 0.53 * INCH, method="shigley", d=0.5 * INCH)
    assert front == pytest.approx(r.sum(), rel=1e-12)


def test_frustum_angle_general_form():
    # Shigley ch. 8, eq. (8-19) general alpha; 30 deg must equal the default.
    t, d, D = 0.01, 0.01, 0.015
    assert shigley_frustum(t, d, D, 200e9, alpha=math.radians(30)) == pytest.approx(
        shigley_frustum(t, d, D, 200e9)
    )
    # a wider cone is stiffer
    assert shigley_frustum(t, d, D, 200e9, alpha=math.radians(45)) > shigley_frustum(t, d, D, 200e9)
