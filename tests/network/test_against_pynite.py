"""Our network solver against PyNite (``pynitefea``), a general 3D frame FE library.

PyNite is an independent solver: we build the same axial network from its
two-node springs on the X axis (every other degree of freedom restrained) and
compare node displacements and part forces.
"""

from __future__ import annotations

import numpy as np
import pytest

from clampstack.network import COMPRESSION, LINEAR, TENSION, Network

Pynite = pytest.importorskip("Pynite")


def _random_network(seed: int, n_nodes: int = 14, n_parts: int = 26, contact: bool = False):
    rng = np.random.default_rng(seed)
    i = list(range(n_nodes - 1))
    j = list(range(1, n_nodes))
    while len(i) < n_parts:
        a = int(rng.integers(0, n_nodes - 1))
        b = int(rng.integers(a + 1, n_nodes))
        i.append(a)
        j.append(b)
    k = rng.uniform(1e6, 5e8, n_parts)
    beh = np.zeros(n_parts, dtype=int)
    if contact:
        beh[n_nodes - 1 :] = rng.choice([LINEAR, COMPRESSION, TENSION], n_parts - n_nodes + 1)
    loads = rng.uniform(-2e4, 2e4, n_nodes)
    fixed = [0, n_nodes - 1] if seed % 2 else [0]
    loads[fixed] = 0.0
    return np.array(i), np.array(j), k, beh, loads, fixed


def _pynite(i, j, k, beh, loads, fixed):
    from Pynite import FEModel3D

    m = FEModel3D()
    n = len(loads)
    for a in range(n):
        m.add_node(f"N{a}", float(a), 0.0, 0.0)
        # only the axial (X) translation is free
        m.def_support(f"N{a}", a in fixed, True, True, True, True, True)
    for p, (a, b) in enumerate(zip(i, j, strict=True)):
        m.add_spring(
            f"S{p}",
            f"N{a}",
            f"N{b}",
            float(k[p]),
            tension_only=bool(beh[p] == TENSION),
            comp_only=bool(beh[p] == COMPRESSION),
        )
    for a in range(n):
        if loads[a] != 0.0 and a not in fixed:
            m.add_node_load(f"N{a}", "FX", float(loads[a]))
    if np.any(beh != LINEAR):
        m.analyze(check_statics=False, max_iter=60)
    else:
        m.analyze_linear()
    disp = np.array([m.nodes[f"N{a}"].DX["Combo 1"] for a in range(n)])
    return disp


@pytest.mark.parametrize("seed", [1, 2, 3])
def test_random_linear_network_matches_pynite(seed):
    i, j, k, beh, loads, fixed = _random_network(seed)
    assert len(i) >= 20
    ours = Network.from_arrays(len(loads), i, j, k, fixed=fixed).solve(loads)
    ref = _pynite(i, j, k, beh, loads, fixed)
    scale = np.abs(ref).max()
    np.testing.assert_allclose(ours.displacement, ref, rtol=1e-9, atol=1e-9 * scale)
    # part forces from PyNite's displacements with the same spring law
    ref_force = k * (ref[j] - ref[i])
    fscale = np.abs(ref_force).max()
    np.testing.assert_allclose(ours.force, ref_force, rtol=1e-9, atol=1e-9 * fscale)


@pytest.mark.parametrize("seed", [4, 5, 6, 7])
def test_random_contact_network_state_matches_pynite(seed):
    # PyNite's own tension-/compression-only iteration was seen to stop in states
    # that are not in equilibrium (seed 4: a 2.4 kN residual), so it is not the
    # reference for the contact *state*.  Instead: solve with our solver, give
    # PyNite the parts that carry as plain linear springs (slack ones left out),
    # and require the same displacements; then check the sign conditions that
    # make the state admissible (no compression-only part in tension etc.).
    i, j, k, beh, loads, fixed = _random_network(seed, contact=True)
    n = len(loads)
    ours = Network.from_arrays(n, i, j, k, behaviour=beh, fixed=fixed).solve(loads)
    keep = ours.carrying
    ref = _pynite(i[keep], j[keep], k[keep], np.zeros(int(keep.sum()), int), loads, fixed)
    scale = np.abs(ref).max()
    np.testing.assert_allclose(ours.displacement, ref, rtol=1e-9, atol=1e-9 * scale)
    e = ref[j] - ref[i]
    assert np.all(e[(beh == COMPRESSION) & keep] <= 1e-12 * scale)
    assert np.all(e[(beh == COMPRESSION) & ~keep] >= -1e-12 * scale)
    assert np.all(e[(beh == TENSION) & keep] >= -1e-12 * scale)
    assert np.all(e[(beh == TENSION) & ~keep] <= 1e-12 * scale)
