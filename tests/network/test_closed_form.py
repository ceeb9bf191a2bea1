"""Network solver against closed-form solutions of statically indeterminate bars.

Source for every closed form here: the compatibility method for axially loaded
bars (equilibrium + compatibility + Hooke's law) as found in any mechanics of
materials text, e.g. Gere & Goodno, *Mechanics of Materials*, ch. 2 (statically
indeterminate structures, thermal effects, misfits and prestrains).
"""

from __future__ import annotations

import numpy as np
import pytest

from clampstack.errors import InputError, SolveError
from clampstack.network import COMPRESSION, TENSION, Curve, Network

REL = 1e-12


def test_two_segment_bar_between_walls_load_at_joint():
    # Bar A-B-C fixed at A and C, force P at B.  R_A = -P k1/(k1+k2), R_C = -P k2/(k1+k2)
    k1, k2, p = 2.0e8, 5.0e7, 12e3
    net = Network.from_arrays(3, [0, 1], [1, 2], [k1, k2], fixed=[0, 2])
    s = net.solve(np.array([0.0, p, 0.0]))
    assert s.displacement[1] == pytest.approx(p / (k1 + k2), rel=REL)
    assert s.force[0] == pytest.approx(p * k1 / (k1 + k2), rel=REL)  # segment AB in tension
    assert s.force[1] == pytest.approx(-p * k2 / (k1 + k2), rel=REL)  # BC in compression
    assert s.reaction[0] == pytest.approx(-p * k1 / (k1 + k2), rel=REL)
    assert s.reaction[2] == pytest.approx(-p * k2 / (k1 + k2), rel=REL)
    assert s.reaction.sum() + p == pytest.approx(0.0, abs=1e-9 * p)


@pytest.mark.parametrize("n", [1, 3, 7, 40])
def test_n_segments_in_series_tip_load(n):
    # Series springs: 1/k = sum 1/k_i; tip displacement = P/k; every segment carries P.
    rng = np.random.default_rng(n)
    k = rng.uniform(1e6, 1e9, n)
    p = 3.7e4
    net = Network.from_arrays(n + 1, np.arange(n), np.arange(1, n + 1), k, fixed=[0])
    f = np.zeros(n + 1)
    f[-1] = p
    s = net.solve(f)
    assert s.displacement[-1] == pytest.approx(p * np.sum(1 / k), rel=1e-11)
    np.testing.assert_allclose(s.force, p, rtol=1e-11)
    assert s.reaction[0] == pytest.approx(-p, rel=1e-11)


@pytest.mark.parametrize("n", [2, 5, 11])
def test_parallel_parts_share_by_stiffness(n):
    # Parallel springs: k = sum k_i, load share F_i = P k_i / k.
    rng = np.random.default_rng(100 + n)
    k = rng.uniform(1e6, 1e9, n)
    p = -8.0e3
    net = Network.from_arrays(2, np.zeros(n, int), np.ones(n, int), k, fixed=[0])
    s = net.solve(np.array([0.0, p]))
    np.testing.assert_allclose(s.force, p * k / k.sum(), rtol=1e-11)


def test_heated_bar_between_walls_stress():
    # Fully restrained bar heated by dT: sigma = -E alpha dT, independent of length.
    E, alpha, dT, A, L = 205e9, 11.5e-6, 60.0, 3.0e-4, 0.45
    net = Network.from_arrays(2, [0], [1], [E * A / L], [alpha * dT * L], fixed=[0, 1])
    s = net.solve()
    assert s.force[0] / A == pytest.approx(-E * alpha * dT, rel=REL)
    assert s.reaction[0] == pytest.approx(E * alpha * dT * A, rel=REL)  # wall pushes +axis
    assert s.reaction[1] == pytest.approx(-E * alpha * dT * A, rel=REL)


def test_heated_two_material_bar_between_walls():
    # Two segments in series, both heated, walls rigid:
    # N = -(a1 L1 + a2 L2) dT / (L1/(E1 A1) + L2/(E2 A2)).
    E1, A1, L1, a1 = 205e9, 4e-4, 0.3, 11.5e-6
    E2, A2, L2, a2 = 70e9, 9e-4, 0.2, 23e-6
    dT = 45.0
    k = [E1 * A1 / L1, E2 * A2 / L2]
    d0 = [a1 * dT * L1, a2 * dT * L2]
    net = Network.from_arrays(3, [0, 1], [1, 2], k, d0, fixed=[0, 2])
    s = net.solve()
    expected = -(a1 * L1 + a2 * L2) * dT / (L1 / (E1 * A1) + L2 / (E2 * A2))
    np.testing.assert_allclose(s.force, expected, rtol=1e-12)
    # junction displacement: u_B = N/k1 + a1 dT L1
    assert s.displacement[1] == pytest.approx(expected / k[0] + d0[0], rel=1e-11)


def test_misfit_bolt_and_sleeve():
    # A rod too short by m assembled inside a sleeve (parallel between the same
    # nodes): compatibility N_rod/k_r - m = N_sleeve/k_s ... with N_rod = -N_sleeve:
    # N_rod = m k_r k_s / (k_r + k_s) (tension), N_sleeve = -N_rod.
    kr, ks, m = 3.0e8, 9.0e8, 1.2e-4
    net = Network.from_arrays(2, [0, 0], [1, 1], [kr, ks], [-m, 0.0], fixed=[0])
    s = net.solve()
    expected = m * kr * ks / (kr + ks)
    assert s.force[0] == pytest.approx(expected, rel=REL)
    assert s.force[1] == pytest.approx(-expected, rel=REL)
    assert s.reaction[0] == pytest.approx(0.0, abs=1e-9 * expected)


def test_compression_only_part_goes_slack():
    # Same rod + sleeve, sleeve compression-only, pull P on the free end:
    # clamped while P < N0 (1 + k_s/k_r)... i.e. sleeve force = -N0 + P k_s/(k_r+k_s) < 0;
    # beyond separation the rod carries P alone.
    kr, ks, m = 3.0e8, 9.0e8, 1.2e-4
    n0 = m * kr * ks / (kr + ks)
    p_sep = n0 * (kr + ks) / ks
    net = Network.from_arrays(2, [0, 0], [1, 1], [kr, ks], [-m, 0.0], [0, COMPRESSION], fixed=[0])
    below = net.solve(np.array([0.0, 0.6 * p_sep]))
    assert below.force[1] == pytest.approx(-n0 + 0.6 * p_sep * ks / (kr + ks), rel=1e-11)
    assert below.force[0] == pytest.approx(n0 + 0.6 * p_sep * kr / (kr + ks), rel=1e-11)
    assert below.carrying.tolist() == [True, True]
    above = net.solve(np.array([0.0, 1.4 * p_sep]))
    assert above.force[1] == 0.0
    assert above.force[0] == pytest.approx(1.4 * p_sep, rel=1e-11)
    assert above.carrying.tolist() == [True, False]


def test_gap_closes_under_load():
    # Bar fixed at A with a stop at clearance g beyond its tip: the tip moves
    # P/k1 until it touches; after that the stop takes (k2/(k1+k2)) of the rest.
    k1, k2, g = 5e7, 2e8, 5e-5
    net = Network.from_arrays(
        3, [0, 1], [1, 2], [k1, k2], behaviour=[0, COMPRESSION], gap=[0, g], fixed=[0, 2]
    )
    small = net.solve(np.array([0.0, 0.5 * k1 * g, 0.0]))
    assert small.displacement[1] == pytest.approx(0.5 * g, rel=1e-12)
    assert small.force[1] == 0.0
    p = 4 * k1 * g
    big = net.solve(np.array([0.0, p, 0.0]))
    u = (p + k2 * g) / (k1 + k2)
    assert big.displacement[1] == pytest.approx(u, rel=1e-11)
    assert big.force[1] == pytest.approx(-k2 * (u - g), rel=1e-11)


def test_tension_only_link_with_slack():
    # A chain link (tension-only) with slack s in parallel with a spring.
    k1, k2, s = 1e6, 4e6, 2e-3
    net = Network.from_arrays(
        2, [0, 0], [1, 1], [k1, k2], behaviour=[0, TENSION], gap=[0, s], fixed=[0]
    )
    r = net.solve(np.array([0.0, 5e3]))  # u = 5e-3 > s: link taut
    u = (5e3 + k2 * s) / (k1 + k2)
    assert r.displacement[1] == pytest.approx(u, rel=1e-11)
    assert r.force[1] == pytest.approx(k2 * (u - s), rel=1e-11)
    r = net.solve(np.array([0.0, -5e3]))  # pushed: link slack
    assert r.force[1] == 0.0 and r.force[0] == pytest.approx(-5e3, rel=1e-12)


def test_piecewise_linear_curve_part():
    # A soft-then-stiff part (like a gasket) in series with a linear spring:
    # the curve is 1e6 N/m up to 1 mm compression, 1e7 N/m beyond.
    curve = Curve.make([-2e-3, -1e-3, 0.0], [-1e3 - 1e4, -1e3, 0.0])
    k1 = 5e6
    net = Network.from_arrays(
        3, [0, 1], [1, 2], [k1, 1.0], behaviour=[0, 3], curves={1: curve}, fixed=[0, 2]
    )
    p = 9e3  # pushes node 1 toward the curve part: the curve part is compressed
    s = net.solve(np.array([0.0, p, 0.0]))
    # guess stiff branch: k1 u + (1e3 + 1e7 (u - 1e-3)) = p
    u = (p - 1e3 + 1e4) / (k1 + 1e7)
    assert u > 1e-3
    assert s.displacement[1] == pytest.approx(u, rel=1e-11)
    assert s.force[1] == pytest.approx(-(1e3 + 1e7 * (u - 1e-3)), rel=1e-11)
    assert s.residual <= 1e-9 * p


def test_falling_curve_is_refused():
    with pytest.raises(InputError, match="falls"):
        Curve.make([0.0, 1.0, 2.0], [0.0, 5.0, 4.0])


def test_zero_stiffness_part_names_nodes():
    with pytest.raises(InputError, match="nodes 1 and 2"):
        Network.from_arrays(3, [0, 1], [1, 2], [1.0, 0.0], fixed=[0])


def test_floating_group_is_input_error():
    net = Network.from_arrays(4, [0, 2], [1, 3], [1.0, 1.0], fixed=[0])
    with pytest.raises(InputError, match="nodes 2, 3"):
        net.solve()


def test_mechanism_through_slack_contact_is_solve_error():
    # node 1 held only by a compression-only part, pulled away: it would fly off
    net = Network.from_arrays(2, [0], [1], [1e6], behaviour=[COMPRESSION], fixed=[0])
    with pytest.raises(SolveError, match="mechanism"):
        net.solve(np.array([0.0, 10.0]))


def test_warm_start_gives_same_answer():
    kr, ks, m = 3.0e8, 9.0e8, 1.2e-4
    net = Network.from_arrays(2, [0, 0], [1, 1], [kr, ks], [-m, 0.0], [0, COMPRESSION], fixed=[0])
    cold = net.solve(np.array([0.0, 1e5]))
    warm = net.solve(np.array([0.0, 1e5]), start=net.solve().displacement)
    np.testing.assert_allclose(cold.force, warm.force, rtol=1e-12)
