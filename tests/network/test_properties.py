"""Property tests of the network solver (hypothesis).

Invariants from statics (any mechanics text): equilibrium at every free node,
reactions balance the applied loads, and the answer does not depend on the
order in which parts or nodes are listed.
"""

from __future__ import annotations

import numpy as np
from hypothesis import given, settings
from hypothesis import strategies as st

from clampstack.network import COMPRESSION, LINEAR, TENSION, Network


@st.composite
def networks(draw, with_contact: bool = False):
    n = draw(st.integers(2, 12))
    # a spanning chain keeps every node joined; extra parts in parallel anywhere
    extra = draw(st.integers(0, 12))
    i = list(range(n - 1))
    j = list(range(1, n))
    for _ in range(extra):
        a = draw(st.integers(0, n - 2))
        b = draw(st.integers(a + 1, n - 1))
        i.append(a)
        j.append(b)
    m = len(i)
    k = draw(st.lists(st.floats(1e5, 1e9), min_size=m, max_size=m))
    d0 = draw(st.lists(st.floats(-1e-4, 1e-4), min_size=m, max_size=m))
    beh = [LINEAR] * m
    gap = [0.0] * m
    if with_contact:
        for p in range(n - 1, m):  # only the extra parts may be unilateral
            beh[p] = draw(st.sampled_from([LINEAR, COMPRESSION, TENSION]))
            gap[p] = draw(st.sampled_from([0.0, 2e-5]))
    n_fixed = draw(st.integers(1, min(3, n)))
    fixed = sorted(set(draw(st.lists(st.integers(0, n - 1), min_size=n_fixed, max_size=n_fixed))))
    if 0 not in fixed:
        fixed = [0, *fixed]
    loads = np.array(draw(st.lists(st.floats(-5e4, 5e4), min_size=n, max_size=n)))
    return (
        n,
        np.array(i),
        np.array(j),
        np.array(k),
        np.array(d0),
        np.array(beh),
        np.array(gap),
        fixed,
        loads,
    )


def _solve(spec):
    n, i, j, k, d0, beh, gap, fixed, loads = spec
    net = Network.from_arrays(n, i, j, k, d0, beh, gap, fixed=fixed)
    return net.solve(loads)


def _load_scale(spec, sol):
    n, i, j, k, d0, beh, gap, fixed, loads = spec
    return max(np.abs(loads).max(), np.abs(sol.force).max(), 1.0)


def _check_equilibrium(spec, sol):
    n, i, j, k, d0, beh, gap, fixed, loads = spec
    internal = np.bincount(j, sol.force, n) - np.bincount(i, sol.force, n)
    resid = loads + sol.reaction - internal
    scale = _load_scale(spec, sol)
    assert np.abs(resid).max() <= 1e-9 * scale
    assert sol.residual <= 1e-9 * scale
    # reactions balance loads (whole-body equilibrium)
    assert abs(sol.reaction.sum() + loads.sum()) <= 1e-9 * scale * n
    free = np.ones(n, bool)
    free[fixed] = False
    assert np.all(sol.reaction[free] == 0.0)


@settings(max_examples=150, deadline=None)
@given(networks())
def test_linear_equilibrium_and_reactions(spec):
    _check_equilibrium(spec, _solve(spec))


@settings(max_examples=150, deadline=None)
@given(networks(with_contact=True))
def test_contact_equilibrium_and_sign_rules(spec):
    n, i, j, k, d0, beh, gap, fixed, loads = spec
    sol = _solve(spec)
    _check_equilibrium(spec, sol)
    assert np.all(sol.force[beh == COMPRESSION] <= 0.0)
    assert np.all(sol.force[beh == TENSION] >= 0.0)
    # complementarity: a slack unilateral part has not closed its gap
    e = sol.elongation - d0
    comp_slack = (beh == COMPRESSION) & (sol.force == 0.0)
    assert np.all(e[comp_slack] + gap[comp_slack] >= -1e-12)
    tens_slack = (beh == TENSION) & (sol.force == 0.0)
    assert np.all(e[tens_slack] - gap[tens_slack] <= 1e-12)


@settings(max_examples=100, deadline=None)
@given(networks(with_contact=True), st.randoms(use_true_random=False))
def test_order_of_parts_and_nodes_does_not_matter(spec, rnd):
    n, i, j, k, d0, beh, gap, fixed, loads = spec
    ref = _solve(spec)
    order = list(range(len(i)))
    rnd.shuffle(order)
    relabel = list(range(n))
    rnd.shuffle(relabel)
    rl = np.array(relabel)
    o = np.array(order)
    loads2 = np.zeros(n)
    loads2[rl] = loads
    spec2 = (n, rl[i[o]], rl[j[o]], k[o], d0[o], beh[o], gap[o], sorted(rl[fixed]), loads2)
    sol = _solve(spec2)
    scale = _load_scale(spec, ref)
    np.testing.assert_allclose(sol.force, ref.force[o], rtol=1e-9, atol=1e-9 * scale)
    np.testing.assert_allclose(
        sol.displacement[rl],
        ref.displacement,
        rtol=1e-8,
        atol=1e-9 * np.abs(ref.displacement).max() + 1e-15,
    )
