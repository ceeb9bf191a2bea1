"""A node shared by very many parts (a hub) is eliminated by its Schur complement.

Consistency check against a dense solve of the same stiffness matrix (numpy), and
against the network with the hub's parts in another order (sparse direct path)."""

from __future__ import annotations

import numpy as np

from clampstack.network import Network
from clampstack.network.core import _LinearSolver


def _arrow(n: int, seed: int = 0):
    rng = np.random.default_rng(seed)
    # a chain 1..n on a fixed node 0, and a hub node n+1 tied to every chain node
    hub = n + 1
    i = np.concatenate((np.arange(0, n), np.arange(1, n + 1), [0]))
    j = np.concatenate((np.arange(1, n + 1), np.full(n, hub), [hub]))
    k = rng.uniform(1e6, 5e6, i.size)
    f = rng.normal(0.0, 1e3, n + 2)
    f[0] = 0.0
    return n + 2, i, j, k, f


def test_hub_elimination_matches_a_dense_solve():
    N, i, j, k, f = _arrow(200)
    net = Network.from_arrays(N, i, j, k, fixed=[0])
    sol = net.solve(f)
    K = np.zeros((N, N))
    for a, b, kk in zip(i, j, k, strict=True):
        K[a, a] += kk
        K[b, b] += kk
        K[a, b] -= kk
        K[b, a] -= kk
    u = np.zeros(N)
    u[1:] = np.linalg.solve(K[1:, 1:], f[1:])
    np.testing.assert_allclose(sol.displacement, u, rtol=1e-9, atol=1e-15)


def test_the_hub_path_is_taken_and_small_networks_stay_banded():
    N, i, j, k, f = _arrow(200)
    fi = np.where(i == 0, -1, i - 1)
    fj = np.where(j == 0, -1, j - 1)
    s = _LinearSolver(N - 1, fi, fj, lambda: None)
    assert s.hubs is not None
    N, i, j, k, f = _arrow(6)
    fi = np.where(i == 0, -1, i - 1)
    fj = np.where(j == 0, -1, j - 1)
    assert _LinearSolver(N - 1, fi, fj, lambda: None).hubs is None


def test_a_floating_network_with_a_hub_is_reported():
    # a chain and its hub joined to nothing fixed, mixed stiffnesses (the Schur complement
    # is tiny but not exactly zero): the floating group is named, never a huge answer
    import pytest

    from clampstack.errors import InputError

    n = 200
    rng = np.random.default_rng(3)
    hub = n + 1
    i = np.concatenate((np.arange(1, n), np.arange(1, n + 1)))
    j = np.concatenate((np.arange(2, n + 1), np.full(n, hub)))
    k = rng.uniform(1e5, 1e9, i.size)
    f = np.zeros(n + 2)
    f[5] = 1e3
    net = Network.from_arrays(n + 2, i, j, k, fixed=[0])
    with pytest.raises(InputError, match="not joined to any fixed node"):
        net.solve(f)
