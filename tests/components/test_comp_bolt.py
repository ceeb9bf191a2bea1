"""Bolt resilience (VDI 2230-1, section 5.1.1) and ISO 4014 thread length."""

from __future__ import annotations

import math

import numpy as np
import pytest
from hypothesis import given, settings
from hypothesis import strategies as st

from clampstack.components.bolt import (
    bolt_resilience,
    cylinder_resilience,
    default_shank_length,
    iso4014_thread_length,
    thread_geometry,
)

E = 205e9
D, P = 10e-3, 1.5e-3
D3 = D - 1.226869 * P  # ISO 898-1
AN = math.pi / 4 * D**2
AD3 = math.pi / 4 * D3**2


def test_thread_geometry_matches_iso898_stress_area():
    # ISO 898-1 tabulates As = 58.0 mm^2 for M10 (REFERENCE.md).
    g = thread_geometry(10e-3, 1.5e-3)
    assert g.As == pytest.approx(58.0e-6, rel=2e-3)
    assert g.d2 == pytest.approx(9.026e-3, abs=1e-6)  # ISO 724: d - 0.649519 P
    assert g.d3 == pytest.approx(8.160e-3, abs=1e-6)  # ISO 898-1: d - 1.226869 P


def test_hex_bolt_with_shank_hand_formula():
    # VDI 2230-1 5.1.1: 0.5d/(E AN) + ls/(E AN) + lGew/(E Ad3) + 0.5d/(E Ad3) + 0.4d/(E AN)
    lK, ls = 30e-3, 12e-3
    r = bolt_resilience(D, P, None, E, lK, [(ls, D)], head="hex", end="nut")
    hand = (0.5 * D + ls + 0.4 * D) / (E * AN) + ((lK - ls) + 0.5 * D) / (E * AD3)
    assert r.total == pytest.approx(hand, rel=1e-12)
    assert r.stiffness == pytest.approx(1 / hand, rel=1e-12)
    assert r.loaded_length == lK
    assert r.free_thread_length == pytest.approx(lK - ls)
    assert [s.name for s in r.segments] == [
        "head",
        "shank 1",
        "free thread",
        "engaged thread",
        "nut",
    ]
    assert sum(s.resilience for s in r.segments) == pytest.approx(r.total)
    assert r.substitute_length == pytest.approx(0.5 * D + lK + 0.5 * D + 0.4 * D)


def test_socket_head_tapped_hole_with_own_moduli():
    lK = 20e-3
    E_al = 70e9
    r = bolt_resilience(D, P, D3, E, lK, head="socket", end="tapped", E_tapped=E_al)
    hand = 0.4 * D / (E * AN) + (lK + 0.5 * D) / (E * AD3) + 0.33 * D / (E_al * AN)
    assert r.total == pytest.approx(hand, rel=1e-12)
    assert r.segments[-1].name == "tapped hole"
    assert r.segments[-1].modulus == E_al


def test_nut_modulus_used_for_nut_only():
    r = bolt_resilience(D, P, None, E, 20e-3, E_nut=100e9)
    nut = [s for s in r.segments if s.name == "nut"][0]
    assert nut.modulus == 100e9
    assert nut.resilience == pytest.approx(0.4 * D / (100e9 * AN))


def test_stud_in_tapped_hole_has_nut_end_instead_of_head():
    lK = 25e-3
    r = bolt_resilience(D, P, None, E, lK, head=None, end="tapped")
    names = [s.name for s in r.segments]
    assert "head" not in names
    assert names[0] == "top nut" and names[-1] == "tapped hole"
    hand = (0.4 * D + 0.33 * D) / (E * AN) + (0.5 * D + lK + 0.5 * D) / (E * AD3)
    assert r.total == pytest.approx(hand, rel=1e-12)


def test_reduced_shank_segments():
    lK = 40e-3
    segs = [(5e-3, D), (25e-3, 7.5e-3)]
    r = bolt_resilience(D, P, None, E, lK, segs)
    hand = (0.5 * D + 5e-3 + 0.4 * D) / (E * AN) + 25e-3 / (E * math.pi / 4 * 7.5e-3**2)
    hand += (10e-3 + 0.5 * D) / (E * AD3)
    assert r.total == pytest.approx(hand, rel=1e-12)


def test_shank_split_is_the_same_as_one_segment():
    a = bolt_resilience(D, P, None, E, 30e-3, [(20e-3, D)])
    b = bolt_resilience(D, P, None, E, 30e-3, [(8e-3, D), (12e-3, D)])
    assert a.total == pytest.approx(b.total, rel=1e-13)


def test_shank_longer_than_clamp_raises():
    with pytest.raises(ValueError, match="exceeds the clamp length"):
        bolt_resilience(D, P, None, E, 20e-3, [(21e-3, D)])


def test_shank_equal_to_clamp_has_no_free_thread():
    r = bolt_resilience(D, P, None, E, 20e-3, [(20e-3 * (1 + 1e-12), D)])
    assert "free thread" not in [s.name for s in r.segments]
    assert r.free_thread_length == 0.0


@pytest.mark.parametrize(
    "kwargs",
    [
        {"head": "round"},
        {"end": "weld"},
        {"E_nut": -1.0},
    ],
)
def test_bad_options_raise(kwargs):
    with pytest.raises(ValueError):
        bolt_resilience(D, P, None, E, 20e-3, **kwargs)


def test_cylinder_resilience_vectorised():
    L = np.array([1e-3, 2e-3, 3e-3])
    r = cylinder_resilience(L, 1e-4, 200e9)
    assert isinstance(r, np.ndarray)
    np.testing.assert_allclose(r, L / (200e9 * 1e-4))
    assert isinstance(cylinder_resilience(1e-3, 1e-4, 200e9), float)


@pytest.mark.parametrize(
    ("d", "length", "b"),
    [
        (10e-3, 45e-3, 26e-3),  # ISO 4014: b = 2d + 6 (l <= 125)
        (10e-3, 125e-3, 26e-3),
        (16e-3, 150e-3, 44e-3),  # 2d + 12 (125 < l <= 200)
        (20e-3, 220e-3, 65e-3),  # 2d + 25 (l > 200)
    ],
)
def test_iso4014_thread_length(d, length, b):
    assert iso4014_thread_length(d, length) == pytest.approx(b)


def test_default_shank_length_and_fully_threaded():
    assert default_shank_length(10e-3, 45e-3) == pytest.approx(19e-3)
    assert default_shank_length(10e-3, 20e-3) == 0.0
    out = default_shank_length(np.array([10e-3, 12e-3]), np.array([60e-3, 30e-3]))
    np.testing.assert_allclose(out, [34e-3, 0.0])


@settings(max_examples=60, deadline=None)
@given(
    lK=st.floats(5e-3, 0.3),
    frac=st.floats(0.0, 1.0),
    dmm=st.sampled_from([6, 8, 10, 12, 16, 20, 24]),
)
def test_longer_clamp_more_resilient_and_shank_stiffens(lK, frac, dmm):
    d = dmm * 1e-3
    p = {6: 1.0, 8: 1.25, 10: 1.5, 12: 1.75, 16: 2.0, 20: 2.5, 24: 3.0}[dmm] * 1e-3
    base = bolt_resilience(d, p, None, E, lK)
    longer = bolt_resilience(d, p, None, E, lK * 1.1)
    assert longer.total > base.total
    with_shank = bolt_resilience(d, p, None, E, lK, [(frac * lK, d)])
    assert with_shank.total <= base.total * (1 + 1e-12)
