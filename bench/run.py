"""clampstack benchmarks: ``make bench`` prints the figures (no timing asserts in tests).

Targets (issue tracker):
* network: a 1e6-part chain assembled and solved in <= 0.5 s on one core, a
  general sparse network of 1e6 parts in <= 5 s, cost growing linearly;
  1e4 parts with contact;
* >= 1000x faster than PyNite on the same 1,000-part network (side by side);
* start-up: ``clampstack --help`` <= 150 ms, ``clampstack solve`` on an example
  <= 0.8 s for the whole process.
"""

from __future__ import annotations

import os
import subprocess
import sys
import time
from pathlib import Path

# one core, as the targets say
for var in ("OMP_NUM_THREADS", "OPENBLAS_NUM_THREADS", "MKL_NUM_THREADS"):
    os.environ.setdefault(var, "1")

import numpy as np  # noqa: E402

ROOT = Path(__file__).resolve().parents[1]
sys.path.insert(0, str(ROOT / "bench"))


def best_of(fn, repeat: int = 5) -> float:
    """Best wall time of ``repeat`` calls [s]."""
    times = []
    for _ in range(repeat):
        t = time.perf_counter()
        fn()
        times.append(time.perf_counter() - t)
    return min(times)


def chain(n: int):
    from clampstack.network import Network

    k = np.full(n, 2.0e8)
    i = np.arange(n)
    f = np.zeros(n + 1)
    f[-1] = 1e4

    def run():
        Network.from_arrays(n + 1, i, i + 1, k, fixed=[0]).solve(f)

    return run


def general(n_parts: int, seed: int = 0):
    """A shuffled ladder: a chain plus parts spanning 2-5 nodes, nodes numbered at random."""
    from clampstack.network import Network

    rng = np.random.default_rng(seed)
    n = n_parts // 2
    a = np.arange(n - 1)
    a2 = rng.integers(0, n - 5, n_parts - (n - 1))
    span = rng.integers(2, 6, a2.size)
    perm = rng.permutation(n)
    i = perm[np.concatenate([a, a2])]
    j = perm[np.concatenate([a + 1, a2 + span])]
    k = rng.uniform(1e6, 1e9, i.size)
    f = rng.uniform(-1e3, 1e3, n)

    def run():
        Network.from_arrays(n, i, j, k, fixed=[perm[0]]).solve(f)

    return run


def contact(n_parts: int, seed: int = 1):
    """A chain with every other extra part compression- or tension-only."""
    from clampstack.network import COMPRESSION, TENSION, Network

    rng = np.random.default_rng(seed)
    n = n_parts // 2 + 1
    a = np.arange(n - 1)
    a2 = rng.integers(0, n - 3, n_parts - (n - 1))
    i = np.concatenate([a, a2])
    j = np.concatenate([a + 1, a2 + rng.integers(1, 3, a2.size)])
    k = rng.uniform(1e6, 1e9, i.size)
    beh = np.zeros(i.size, dtype=np.int8)
    beh[n - 1 :] = rng.choice([COMPRESSION, TENSION], a2.size)
    d0 = rng.uniform(-2e-5, 2e-5, i.size)
    f = rng.uniform(-1e3, 1e3, n)
    state = {}

    def run():
        s = Network.from_arrays(n, i, j, k, d0, beh, fixed=[0]).solve(f)
        state["iterations"] = s.iterations

    return run, state


def pynite_side_by_side(n_parts: int = 1000, seed: int = 3):
    from Pynite import FEModel3D

    from clampstack.network import Network

    rng = np.random.default_rng(seed)
    n = n_parts // 2 + 1
    a = np.arange(n - 1)
    a2 = rng.integers(0, n - 3, n_parts - (n - 1))
    i = np.concatenate([a, a2])
    j = np.concatenate([a + 1, a2 + rng.integers(1, 3, a2.size)])
    k = rng.uniform(1e6, 1e9, i.size)
    f = rng.uniform(-1e3, 1e3, n)
    f[0] = 0.0

    def ours():
        return Network.from_arrays(n, i, j, k, fixed=[0]).solve(f).displacement

    def theirs():
        m = FEModel3D()
        for a_ in range(n):
            m.add_node(f"N{a_}", float(a_), 0.0, 0.0)
            m.def_support(f"N{a_}", a_ == 0, True, True, True, True, True)
        for p in range(i.size):
            m.add_spring(f"S{p}", f"N{i[p]}", f"N{j[p]}", float(k[p]))
        for a_ in range(1, n):
            m.add_node_load(f"N{a_}", "FX", float(f[a_]))
        m.analyze_linear(check_stability=False)
        return np.array([m.nodes[f"N{a_}"].DX["Combo 1"] for a_ in range(n)])

    t_ours = best_of(ours, 20)
    t_theirs = best_of(theirs, 2)
    diff = float(np.max(np.abs(ours() - theirs())) / np.max(np.abs(theirs())))
    return t_ours, t_theirs, diff


def process_time(args: list[str], repeat: int = 5) -> float:
    exe = Path(sys.executable).with_name("clampstack")
    best = float("inf")
    for _ in range(repeat):
        t = time.perf_counter()
        subprocess.run([str(exe), *args], check=False, capture_output=True, cwd=ROOT)
        best = min(best, time.perf_counter() - t)
    return best


def main() -> None:
    import scipy.linalg  # noqa: F401 - import cost is not solve cost
    import scipy.sparse.csgraph  # noqa: F401
    import scipy.sparse.linalg  # noqa: F401

    print("clampstack benchmarks (best of several runs, one core)")
    print("\nnetwork: linear chain, assembled and solved")
    for n in (10**3, 10**4, 10**5, 10**6):
        t = best_of(chain(n), 5 if n < 10**6 else 3)
        print(f"  {n:>9,d} parts  {t * 1e3:9.2f} ms   {t / n * 1e9:7.1f} ns/part")
    print("\nnetwork: general sparse (shuffled ladder, RCM + banded Cholesky or SuperLU)")
    for n in (10**4, 10**5, 10**6):
        t = best_of(general(n), 3)
        print(f"  {n:>9,d} parts  {t * 1e3:9.2f} ms   {t / n * 1e9:7.1f} ns/part")
    run, state = contact(10**4)
    t = best_of(run, 3)
    print(
        f"\nnetwork: 10,000 parts with contact  {t * 1e3:.2f} ms "
        f"({state['iterations']} Newton iterations)"
    )
    try:
        t_ours, t_theirs, diff = pynite_side_by_side()
        print(
            f"\nPyNite side by side, 1,000-part network: ours {t_ours * 1e3:.3f} ms, "
            f"PyNite {t_theirs * 1e3:.1f} ms, ratio {t_theirs / t_ours:,.0f}x "
            f"(max rel. difference {diff:.1e})"
        )
    except ImportError:
        print("\nPyNite not installed: side-by-side comparison skipped")
    print("\nprocess start-up (whole process)")
    print(f"  clampstack --help                      {process_time(['--help']) * 1e3:7.1f} ms")
    ex = "examples/tie-rod-in-spacer-tube.toml"
    print(f"  clampstack solve {ex:<22s} {process_time(['solve', ex]) * 1e3:7.1f} ms")
    # benchmarks of later layers live beside this file as bench_*.py with a main()
    import runpy

    for extra in sorted((ROOT / "bench").glob("bench_*.py")):
        runpy.run_path(str(extra), run_name="__main__")


if __name__ == "__main__":
    main()
