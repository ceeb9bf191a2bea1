"""Which linear solver the network picks, and that each answers the same.

Consistency checks (our own routes against each other and against an exact answer
computed in extended precision); no published source is involved.
"""

from __future__ import annotations

import subprocess
import sys

import numpy as np
import pytest

from clampstack.errors import InputError
from clampstack.network import Network, core
from clampstack.network.core import _LinearSolver


def _free(n_nodes: int, i: np.ndarray, j: np.ndarray, fixed: list[int]):
    idx = np.full(n_nodes, -1, dtype=np.int64)
    free = np.setdiff1d(np.arange(n_nodes), fixed)
    idx[free] = np.arange(free.size)
    return free.size, idx[i], idx[j]


def _random_non_local(m: int, seed: int = 0):
    """A random recursive tree plus parts between random node pairs (no locality)."""
    rng = np.random.default_rng(seed)
    n = m // 2
    child = np.arange(1, n)
    parent = (rng.random(n - 1) * child).astype(np.int64)
    extra = m - (n - 1)
    a = rng.integers(0, n, extra)
    b = rng.integers(0, n - 1, extra)
    b = np.where(b >= a, b + 1, b)
    i, j = np.concatenate((parent, a)), np.concatenate((child, b))
    return n, i, j, rng.uniform(1e6, 1e9, m), rng.uniform(-1e3, 1e3, n)


def _rails(rails: int, stations: int):
    """Parallel chains with a cross part between neighbours at every station."""
    node = np.arange(rails * stations).reshape(stations, rails)
    along_i, along_j = node[:-1].ravel(), node[1:].ravel()
    across_i, across_j = node[:, :-1].ravel(), node[:, 1:].ravel()
    return node, np.concatenate((along_i, across_i)), np.concatenate((along_j, across_j))


def test_small_networks_are_dense_and_need_no_scipy_linear_algebra():
    code = (
        "import sys; import clampstack as cs;"
        "r = cs.analyse(cs.load('examples/m16-through-bolt-alternating.toml'));"
        "print('scipy.linalg' in sys.modules, 'scipy.optimize' in sys.modules)"
    )
    out = subprocess.run(
        [sys.executable, "-c", code], capture_output=True, text=True, check=True, cwd=_root()
    )
    assert out.stdout.split() == ["False", "False"]
    n, i, j = 5, np.array([0, 1, 2, 3]), np.array([1, 2, 3, 4])
    assert _LinearSolver(*_free(n, i, j, [0]), lambda: None).method == "dense"


def _root():
    from pathlib import Path

    return Path(__file__).resolve().parents[2]


def test_a_wide_regular_grid_stays_banded():
    # 32 rails of 15,000 stations: about 1e6 parts, band 32.  A fixed work budget used to
    # send it to the general sparse solver (7x slower); work and memory now allow the band.
    node, i, j = _rails(32, 15_000)
    s = _LinearSolver(*_free(node.size, i, j, list(node[0])), lambda: None)
    assert (s.method, s.band, s.perm) == ("banded", 32, None)


def test_a_non_local_network_is_solved_iteratively_and_agrees_with_a_dense_solve(monkeypatch):
    n, i, j, k, f = _random_non_local(60_000)
    assert _LinearSolver(*_free(n, i, j, [0]), lambda: None).method == "iterative"
    # the same route on a network small enough for a dense reference
    monkeypatch.setattr(core, "_SPARSE_ALWAYS", 0)
    monkeypatch.setattr(core, "_BAND_FLOPS", 0)
    n, i, j, k, f = _random_non_local(3000, seed=2)
    nf, fi, fj = _free(n, i, j, [0])
    assert _LinearSolver(nf, fi, fj, lambda: None).method == "iterative"
    sol = Network.from_arrays(n, i, j, k, fixed=[0]).solve(f)
    K = np.zeros((n, n))
    np.add.at(K, (i, i), k)
    np.add.at(K, (j, j), k)
    np.add.at(K, (i, j), -k)
    np.add.at(K, (j, i), -k)
    u = np.zeros(n)
    u[1:] = np.linalg.solve(K[1:, 1:], f[1:])
    assert np.max(np.abs(sol.displacement - u)) <= 1e-10 * np.max(np.abs(u))
    assert sol.residual <= 1e-9 * np.max(np.abs(f))


def test_the_iterative_route_names_a_floating_group(monkeypatch):
    monkeypatch.setattr(core, "_SPARSE_ALWAYS", 0)
    monkeypatch.setattr(core, "_DENSE_MAX", 0)
    monkeypatch.setattr(core, "_BAND_FLOPS", 0)
    n, i, j, k, f = _random_non_local(4000)
    # two more nodes joined only to each other: they float
    i, j = np.append(i, n), np.append(j, n + 1)
    k, f = np.append(k, 1e8), np.append(f, [0.0, 0.0])
    nf, fi, fj = _free(n + 2, i, j, [0])
    assert _LinearSolver(nf, fi, fj, lambda: None).method == "iterative"
    with pytest.raises(InputError, match="floating group"):
        Network.from_arrays(n + 2, i, j, k, fixed=[0]).solve(f)


@pytest.mark.parametrize("tip_only", [True, False])
def test_a_long_chain_keeps_full_precision(tip_only):
    # Exact answer in extended precision: the part forces are sums of the loads beyond
    # them (the chain is statically determinate), the displacements sums of force over
    # stiffness.  Before refinement in extended precision the error was 1e-8 at 1e5 parts.
    n = 100_000
    rng = np.random.default_rng(5)
    k = rng.uniform(1e6, 1e9, n)
    f = rng.uniform(-1e3, 1e3, n + 1)
    if tip_only:
        f[:] = 0.0
        f[-1] = 1e4
    f[0] = 0.0
    sol = Network.from_arrays(n + 1, np.arange(n), np.arange(1, n + 1), k, fixed=[0]).solve(f)
    ld = np.longdouble
    force = np.cumsum(f[::-1].astype(ld))[::-1][1:]
    u = np.concatenate(([ld(0)], np.cumsum(force / k.astype(ld))))
    err = float(np.max(np.abs(sol.displacement.astype(ld) - u)) / np.max(np.abs(u)))
    limit = 1e-12 if core._EXTENDED else 1e-7  # without a wider long double: double only
    assert err <= limit
