"""Clamped-part resilience: VDI 2230-1 cone/sleeve, Shigley frusta, Wileman et al. (1991)."""

from __future__ import annotations

import math

import numpy as np
import pytest
from hypothesis import given, settings
from hypothesis import strategies as st

from clampstack.components.plates import (
    clamped_resilience,
    cone_limit_diameter,
    cone_tan_phi,
    full_cone_outer_diameter,
    plate_resiliences,
    shigley_frustum,
    shigley_members,
    sleeve_resilience,
    vdi2230_cone,
    vdi2230_plates,
    wileman_1991,
)

E_ST = 205e9
E_AL = 70e9
LK, DW, DH = 30e-3, 16e-3, 11e-3


@pytest.mark.parametrize("tapped", [False, True])
def test_cone_tan_phi_formulas(tapped):
    # VDI 2230-1 5.1.2.1 regressions, written out.
    lK, dW, DA = 24e-3, 15e-3, 35e-3
    bl, y = lK / dW, DA / dW
    if tapped:
        hand = 0.348 + 0.013 * math.log(bl) + 0.193 * math.log(y)
    else:
        hand = 0.362 + 0.032 * math.log(bl / 2) + 0.153 * math.log(y)
    assert cone_tan_phi(lK, dW, DA, tapped) == pytest.approx(hand, rel=1e-14)
    w = 2 if tapped else 1
    assert cone_limit_diameter(lK, dW, DA, tapped) == pytest.approx(dW + w * lK * hand)


@pytest.mark.parametrize("tapped", [False, True])
def test_cone_resilience_continuous_at_both_case_boundaries(tapped):
    # Identity: the three VDI 2230-1 cases join at D'A = dW and at D'A = DA,Gr.
    eps = 1e-9
    below = vdi2230_cone(LK, DW, DH, DW * (1 - eps), E_ST, tapped)
    above = vdi2230_cone(LK, DW, DH, DW * (1 + eps), E_ST, tapped)
    assert below == pytest.approx(above, rel=1e-6)
    d_gr = full_cone_outer_diameter(LK, DW, tapped)
    assert cone_limit_diameter(LK, DW, d_gr, tapped) == pytest.approx(d_gr, rel=1e-12)
    below = vdi2230_cone(LK, DW, DH, d_gr * (1 - eps), E_ST, tapped)
    above = vdi2230_cone(LK, DW, DH, d_gr * (1 + eps), E_ST, tapped)
    assert below == pytest.approx(above, rel=1e-6)


@pytest.mark.parametrize("tapped", [False, True])
def test_cone_resilience_decreases_with_outer_diameter(tapped):
    DA = np.linspace(11.5e-3, 80e-3, 500)
    r = vdi2230_cone(LK, DW, DH, DA, E_ST, tapped)
    assert np.all(np.diff(r) < 0)


def test_sleeve_case_is_a_tube():
    DA = 14e-3  # below dW: sleeve (VDI 2230-1 5.1.2.1)
    r = vdi2230_cone(LK, DW, DH, DA, E_ST)
    assert r == pytest.approx(4 * LK / (E_ST * math.pi * (DA**2 - DH**2)))
    assert r == pytest.approx(sleeve_resilience(LK, DA, DH, E_ST))


def test_default_outer_diameter_gives_the_full_cone():
    assert vdi2230_cone(LK, DW, DH, None, E_ST) == pytest.approx(
        vdi2230_cone(LK, DW, DH, full_cone_outer_diameter(LK, DW), E_ST)
    )


@pytest.mark.parametrize("tapped", [False, True])
@pytest.mark.parametrize("DA", [13e-3, 16e-3, 20e-3, 26e-3, 40e-3, None])
def test_slice_sum_reproduces_the_closed_forms(tapped, DA):
    # The plate-slice integration equals VDI 2230-1's closed forms for one modulus.
    slices = vdi2230_plates([4e-3, 11e-3, 15e-3], [E_ST] * 3, DW, DH, DA, tapped)
    assert slices.sum() == pytest.approx(vdi2230_cone(LK, DW, DH, DA, E_ST, tapped), rel=1e-12)


@settings(max_examples=80, deadline=None)
@given(
    split=st.floats(0.02, 0.98),
    tapped=st.booleans(),
    DA=st.one_of(st.none(), st.floats(12e-3, 60e-3)),
)
def test_splitting_a_homogeneous_clamp_changes_nothing(split, tapped, DA):
    one = clamped_resilience([(LK, E_ST, "steel")], DW, DH, DA, tapped=tapped)
    two = clamped_resilience(
        [(split * LK, E_ST, "steel"), ((1 - split) * LK, E_ST, "steel")], DW, DH, DA, tapped=tapped
    )
    assert two == pytest.approx(one, rel=1e-10)


@settings(max_examples=50, deadline=None)
@given(t1=st.floats(1e-3, 30e-3), t2=st.floats(1e-3, 30e-3), t3=st.floats(1e-3, 30e-3))
def test_through_bolt_stack_is_symmetric(t1, t2, t3):
    # Through bolt: two equal cones from head and nut, so reversing the order changes nothing.
    th, E = [t1, t2, t3], [E_ST, E_AL, 110e9]
    a = vdi2230_plates(th, E, DW, DH).sum()
    b = vdi2230_plates(th[::-1], E[::-1], DW, DH).sum()
    assert a == pytest.approx(b, rel=1e-10)


def test_mixed_moduli_bounds_and_scaling():
    th = [10e-3, 20e-3]
    steel = vdi2230_plates(th, [E_ST, E_ST], DW, DH).sum()
    alu = vdi2230_plates(th, [E_AL, E_AL], DW, DH).sum()
    mixed = vdi2230_plates(th, [E_ST, E_AL], DW, DH)
    assert steel < mixed.sum() < alu
    # Each slice scales with 1/E of its own plate.
    np.testing.assert_allclose(mixed, vdi2230_plates(th, [E_ST, E_ST], DW, DH) * [1, E_ST / E_AL])


def test_cone_vectorised_matches_scalar_loop():
    lK = np.array([10e-3, 30e-3, 60e-3])
    DA = np.array([20e-3, 30e-3, 100e-3])
    vec = vdi2230_cone(lK, DW, DH, DA, E_ST)
    for i in range(3):
        assert vec[i] == pytest.approx(vdi2230_cone(lK[i], DW, DH, DA[i], E_ST))


@pytest.mark.parametrize(
    ("args", "match"),
    [
        ((LK, DW, 17e-3, 30e-3, E_ST), "bearing diameter"),
        ((LK, DW, DH, 10e-3, E_ST), "outer diameter"),
        ((-1.0, DW, DH, 30e-3, E_ST), "clamp length"),
    ],
)
def test_bad_cone_geometry_raises(args, match):
    with pytest.raises(ValueError, match=match):
        vdi2230_cone(*args)


def test_shigley_members_two_equal_frusta_is_eq_8_22():
    # Shigley ch. 8, two equal steel members, D = 1.5 d:
    # km = 0.5774 pi E d / (2 ln[5 (0.5774 l + 0.5 d)/(0.5774 l + 2.5 d)])
    d, grip, E = 12e-3, 40e-3, 207e9
    km = (
        0.5774
        * math.pi
        * E
        * d
        / (2 * math.log(5 * (0.5774 * grip + 0.5 * d) / (0.5774 * grip + 2.5 * d)))
    )
    r = shigley_members([grip / 2, grip / 2], [E, E], d)
    assert 1 / r.sum() == pytest.approx(km, rel=2e-4)  # 0.5774, 1.155 rounded in the book form


def test_shigley_mixed_members_split_into_frusta():
    # Top 8 mm steel, bottom 22 mm aluminium, d = 10 mm, D = 15 mm; grip 30 mm, mid at 15 mm.
    d, D = 10e-3, 15e-3
    t30 = math.tan(math.pi / 6)
    k1 = shigley_frustum(8e-3, d, D, E_ST)
    k2 = shigley_frustum(7e-3, d, D + 2 * 8e-3 * t30, E_AL)  # from 8 mm down to mid-grip
    k3 = shigley_frustum(15e-3, d, D, E_AL)  # lower half from the nut face
    r = shigley_members([8e-3, 22e-3], [E_ST, E_AL], d, D)
    assert r[0] == pytest.approx(1 / k1, rel=1e-12)
    assert r[1] == pytest.approx(1 / k2 + 1 / k3, rel=1e-12)


def test_shigley_frustum_vectorised():
    t = np.array([5e-3, 10e-3])
    k = shigley_frustum(t, 10e-3, 15e-3, E_ST)
    assert k.shape == (2,) and k[0] > k[1]


def test_wileman_formula_and_aliases():
    d, lK = 10e-3, 25e-3
    assert wileman_1991(d, lK, E_ST) == pytest.approx(
        E_ST * d * 0.78715 * math.exp(0.62873 * d / lK)
    )
    assert wileman_1991(d, lK, E_AL, "aluminum") == wileman_1991(d, lK, E_AL, "aluminium-6082-T6")
    assert wileman_1991(d, lK, 110e9, "titanium-6Al-4V") == pytest.approx(
        110e9 * d * 0.78952 * math.exp(0.62914 * d / lK)
    )


def test_front_dispatch():
    plates = [(12e-3, E_ST, "steel"), (18e-3, E_ST, "steel")]
    vdi = clamped_resilience(plates, DW, DH, 40e-3)
    assert vdi == pytest.approx(vdi2230_cone(LK, DW, DH, 40e-3, E_ST))
    sh = clamped_resilience(plates, DW, DH, method="shigley", d=10e-3)
    assert sh == pytest.approx(shigley_members([12e-3, 18e-3], [E_ST, E_ST], 10e-3, DW).sum())
    wi = clamped_resilience(plates, DW, DH, method="wileman", d=10e-3)
    assert wi == pytest.approx(1 / wileman_1991(10e-3, LK, E_ST))


def test_front_shigley_tapped_adds_half_d_of_the_tapped_part():
    plates = [(20e-3, E_ST, "steel")]
    r = plate_resiliences(plates, DW, DH, method="shigley", tapped=True, d=10e-3, E_tapped=E_AL)
    assert r.shape == (2,)
    expect = shigley_members([20e-3, 5e-3], [E_ST, E_AL], 10e-3, DW)
    np.testing.assert_allclose(r, expect)


def test_front_rejects_wileman_outside_its_scope():
    mixed = [(10e-3, E_ST, "steel"), (10e-3, E_AL, "aluminium")]
    with pytest.raises(ValueError, match="one material"):
        clamped_resilience(mixed, DW, DH, method="wileman", d=10e-3)
    with pytest.raises(ValueError, match="through-bolted"):
        clamped_resilience(mixed[:1], DW, DH, method="wileman", d=10e-3, tapped=True)
    with pytest.raises(ValueError, match="bolt diameter"):
        clamped_resilience(mixed[:1], DW, DH, method="wileman")
    with pytest.raises(ValueError, match="unknown method"):
        clamped_resilience(mixed[:1], DW, DH, method="fem")  # type: ignore[arg-type]
    with pytest.raises(ValueError):
        clamped_resilience([], DW, DH)


def test_sleeve_resilience():
    assert sleeve_resilience(0.1, 0.03, 0.02, 200e9) == pytest.approx(
        0.1 / (200e9 * math.pi / 4 * (0.03**2 - 0.02**2))
    )
    with pytest.raises(ValueError):
        sleeve_resilience(0.1, 0.02, 0.03, 200e9)
