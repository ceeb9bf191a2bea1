"""ASME BPVC VIII-1 Appendix 2 bolt loads with an external axial force and moment.

Hand calculation from the published relations (App. 2-5: b0, b, G, H, H_p, W_m2,
A_m, W; the external force and moment added once to the operating bolt load in the
form of ASME BPVC VIII-2 4.16.6, W_m1 = H + H_p + F + 4 M / G, from memory).  The
working is written out below so that a reviewer can redo it with a calculator.
"""

from __future__ import annotations

import math

import pytest

from clampstack.flange import asme_app2
from clampstack.inputs.flange import flange_from_data

DATA = {
    "title": "hand check",
    "flange": {"bolt_count": 8, "bolt_circle": "160 mm", "thickness": "20 mm"},
    "bolt": {"thread": "M16", "grade": "8.8"},
    "gasket": {
        "inner_diameter": "95 mm",
        "outer_diameter": "127 mm",
        "thickness": "4.5 mm",
        "m": 3.0,
        "y": "69 MPa",
    },
    "loading": {"pressure": "4 MPa", "axial_force": "10 kN", "bending_moment": "1 kN*m"},
}

# gasket width N = (127 - 95)/2 = 16 mm; b0 = N/2 = 8 mm (Table 2-5.2, sketch 1a)
# b0 > 6.35 mm: b = 0.5 sqrt(b0 / 25.4 mm) x 25.4 mm = 0.5 x sqrt(0.31496) x 25.4 = 7.1274 mm
# G = OD - 2 b = 127 - 14.2548 = 112.7452 mm
B = 0.5 * math.sqrt(8 / 25.4) * 25.4e-3
G = 127e-3 - 2 * B
# H = 0.785 G^2 P = 0.785 x 0.1127452^2 x 4e6 = 39914 N
H = 0.785 * G**2 * 4e6
# H_p = 2 b 3.14 G m P = 2 x 0.0071274 x 3.14 x 0.1127452 x 3 x 4e6 = 60558 N
HP = 2 * B * 3.14 * G * 3.0 * 4e6
# F + 4 M / G = 10000 + 4 x 1000 / 0.1127452 = 10000 + 35478 = 45478 N
EXT = 10e3 + 4 * 1e3 / G
# W_m2 = 3.14 b G y = 3.14 x 0.0071274 x 0.1127452 x 69e6 = 174104 N
WM2 = 3.14 * B * G * 69e6
# S_a = S_b = min(800/5, 640/4) = 160 MPa (our default for 8.8, from memory)
SB = 160e6
# A_b = 8 x pi/4 d3^2, d3 = 16 - 1.226869 x 2 = 13.546 mm: 8 x 144.12 mm^2 = 1153.0 mm^2
AB = 8 * math.pi / 4 * (16e-3 - 1.226869 * 2e-3) ** 2


def test_operating_load_takes_the_external_force_and_moment_once():
    a = asme_app2(flange_from_data(DATA))
    assert a.b == pytest.approx(B, rel=1e-9)
    assert a.G == pytest.approx(G, rel=1e-9)
    assert a.H == pytest.approx(H, rel=1e-9)
    assert a.Hp == pytest.approx(HP, rel=1e-9)
    assert a.Wm1 == pytest.approx(H + HP + EXT, rel=1e-9)  # 39914 + 60558 + 45478 = 145950 N
    assert a.Wm1 == pytest.approx(145_950, rel=1e-4)
    # not the old equivalent-pressure route, which multiplied F and M by (1 + 8 b m / G)
    P_eq = 4e6 + 4 * 10e3 / (math.pi * G**2) + 16 * 1e3 / (math.pi * G**3)
    old = 0.785 * G**2 * P_eq + 2 * B * 3.14 * G * 3.0 * P_eq
    assert old > 1.4 * (a.Wm1 - H - HP) + H + HP


def test_bolt_area_and_design_bolt_load():
    a = asme_app2(flange_from_data(DATA))
    am = max((H + HP + EXT) / SB, WM2 / SB)  # seating governs: 174104 / 160e6 = 1088.1 mm^2
    assert a.Am == pytest.approx(am, rel=1e-9)
    assert a.Am * 1e6 == pytest.approx(1088.1, rel=1e-4)
    assert a.Ab == pytest.approx(AB, rel=1e-9)
    # W = (A_m + A_b) S_a / 2 = (1088.1 + 1153.0) x 160 / 2 = 179290 N (App. 2-5(e))
    assert a.W == pytest.approx((am + AB) * SB / 2, rel=1e-9)
    assert a.W == pytest.approx(179_290, rel=1e-4)
    assert "d3" in a.area_basis


def test_json_carries_the_design_load_and_the_area_basis():
    from clampstack.flange import analyse_flange

    d = analyse_flange(flange_from_data(DATA), compensate=False).to_dict()
    rb = d["required_bolt_load"]
    assert rb["operating_N"] == pytest.approx(H + HP + EXT, rel=1e-9)
    assert rb["design_N"] == pytest.approx((max((H + HP + EXT), WM2) / SB + AB) * SB / 2)
    assert "root area" in rb["bolt_area_basis"]
