"""clampstack benchmarks: ``make bench`` prints the figures and writes docs/performance.md.

Every figure is the median with min and max over >= 5 runs; every comparison is the
median (min .. max) of per-round ratios of interleaved runs (A, B, A, B, ...); process
figures are whole-process wall times, imports included.  BLAS threads pinned to 1.
"""

from __future__ import annotations

import os
import sys

for var in ("OMP_NUM_THREADS", "OPENBLAS_NUM_THREADS", "MKL_NUM_THREADS"):
    os.environ.setdefault(var, "1")

import subprocess  # noqa: E402
import tempfile  # noqa: E402
import time  # noqa: E402
from pathlib import Path  # noqa: E402

import numpy as np  # noqa: E402

ROOT = Path(__file__).resolve().parents[1]
sys.path.insert(0, str(ROOT / "bench"))

import _timing as T  # noqa: E402

TIMEOUT = 60.0


def chain_arrays(n: int, seed: int = 0):
    rng = np.random.default_rng(seed)
    i = np.arange(n)
    k = rng.uniform(1e6, 1e9, n)
    f = rng.uniform(-1e3, 1e3, n + 1)
    f[0] = 0.0
    return n + 1, i, i + 1, k, f, [0]


def general_arrays(n_parts: int, seed: int = 0):
    """A shuffled ladder: a chain plus parts spanning 2-5 nodes, nodes numbered at random."""
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
    return n, i, j, k, f, [int(perm[0])]


def random_arrays(n_parts: int, seed: int = 0):
    """Random non-local: a random recursive tree plus random pairs, n_parts // 2 nodes."""
    rng = np.random.default_rng(seed)
    n = n_parts // 2
    m = np.arange(1, n)
    parent = (rng.random(n - 1) * m).astype(np.int64)
    extra = n_parts - (n - 1)
    a = rng.integers(0, n, extra)
    b = (a + rng.integers(1, n, extra)) % n  # b != a
    i = np.concatenate([m, a])
    j = np.concatenate([parent, b])
    k = rng.uniform(1e6, 1e9, i.size)
    f = rng.uniform(-1e3, 1e3, n)
    return n, i, j, k, f, [0]


def rails_arrays(n_parts: int = 10**6, rails: int = 32, seed: int = 0):
    """32 rails, a cross part between neighbouring rails at every station."""
    per = rails + rails - 1  # rail parts from a station + cross parts at it
    stations = n_parts // per + 1
    node = np.arange(stations * rails).reshape(stations, rails)
    ri = node[:-1].ravel()
    rj = node[1:].ravel()
    ci = node[:, :-1].ravel()
    cj = node[:, 1:].ravel()
    i = np.concatenate([ri, ci])
    j = np.concatenate([rj, cj])
    rng = np.random.default_rng(seed)
    k = rng.uniform(1e6, 1e9, i.size)
    f = np.zeros(node.size)
    f[node[-1]] = 1e3
    return node.size, i, j, k, f, list(node[0])


CASES = {
    "chain": chain_arrays,
    "general": general_arrays,
    "random": random_arrays,
    "rails": rails_arrays,
}


def solver(arrays):
    from clampstack.network import Network

    n, i, j, k, f, fixed = arrays

    def run():
        return Network.from_arrays(n, i, j, k, fixed=fixed).solve(f)

    return run


def worker(case: str, n_parts: int) -> None:
    """Subprocess mode: one build + solve, prints its time [s]."""
    arrays = CASES[case](n_parts)
    run = solver(arrays)
    print(T.timed(run))


def guarded(section: str, label: str, case: str, n_parts: int, target: float, runs=5):
    """Run a large case in subprocesses with a timeout; stop after the first timeout."""
    times = []
    for _ in range(runs):
        try:
            out = subprocess.run(
                [sys.executable, __file__, "--worker", case, str(n_parts)],
                capture_output=True,
                text=True,
                timeout=TIMEOUT,
                check=True,
            )
            times.append(float(out.stdout.strip().splitlines()[-1]))
        except subprocess.TimeoutExpired:
            T.note(
                section,
                label,
                f"timed out (> {TIMEOUT:g} s) after {len(times)} runs "
                f"(target <= {T.fmt(target)}) MISSED",
            )
            return
        except subprocess.CalledProcessError as err:
            T.note(section, label, f"failed: {err.stderr.strip().splitlines()[-1:]}")
            return
    T.report(section, label, T.stat(times), target, note="build + solve in a fresh process")


def chain_accuracy(n: int = 10**6) -> float:
    from clampstack.network import Network

    nn, i, j, k, f, fixed = chain_arrays(n, seed=7)
    u = Network.from_arrays(nn, i, j, k, fixed=fixed).solve(f).displacement
    fl = f.astype(np.longdouble)
    force = np.cumsum(fl[::-1])[::-1][1:]  # part p carries the loads beyond node p
    uref = np.concatenate([[0], np.cumsum(force / k.astype(np.longdouble))])
    return float(np.max(np.abs(u - uref)) / np.max(np.abs(uref)))


def assembled_matrix(arrays):
    from scipy.sparse import coo_array

    n, i, j, k, f, fixed = arrays
    free = np.ones(n, bool)
    free[fixed] = False
    idx = np.full(n, -1)
    idx[free] = np.arange(free.sum())
    fi, fj = idx[i], idx[j]
    nf = int(free.sum())
    diag = np.bincount(fi[fi >= 0], k[fi >= 0], nf) + np.bincount(fj[fj >= 0], k[fj >= 0], nf)
    b = (fi >= 0) & (fj >= 0)
    rows = np.concatenate([np.arange(nf), fi[b], fj[b]])
    cols = np.concatenate([np.arange(nf), fj[b], fi[b]])
    vals = np.concatenate([diag, -k[b], -k[b]])
    return coo_array((vals, (rows, cols)), shape=(nf, nf)).tocsc(), f[free]


def pynite(section: str) -> None:
    try:
        from Pynite import FEModel3D
    except ImportError:
        T.note(section, "network solver vs PyNite", "skipped: PyNite not installed")
        return
    from clampstack.network import Network

    rng = np.random.default_rng(3)
    n_parts = 1000
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

    ta, tb, r = T.interleaved(ours, theirs)
    diff = float(np.max(np.abs(ours() - theirs())) / np.max(np.abs(theirs())))
    T.report(section, "ours, 1,000-part network", ta)
    T.report(section, "PyNite, same network", tb, note=f"max rel. diff {diff:.1e}")
    T.report_ratio("ratios", "PyNite / ours, 1,000-part network", r, 1000, le=False)


def main() -> None:
    import scipy.sparse.linalg  # noqa: F401 - import cost is not solve cost

    from clampstack.network import COMPRESSION, TENSION, Network

    print("clampstack benchmarks: median (min .. max) of >= 5 runs, one BLAS thread")
    sec = "network: chain (random stiffness)"
    print(f"\n{sec}")
    for n in (10**3, 10**4, 10**5, 10**6):
        T.report(
            sec, f"{n:,d} parts", T.measure(solver(chain_arrays(n))), 0.5 if n == 10**6 else None
        )
    err = chain_accuracy()
    T.note(
        sec,
        "accuracy, 1e6 parts: max|u-u_ref|/max|u_ref|",
        f"{err:.2e} (target <= 1e-9) {T.status(err, 1e-9)}",
    )

    sec = "network: general sparse (shuffled ladder)"
    print(f"\n{sec}")
    for n in (10**4, 10**5, 10**6):
        T.report(
            sec, f"{n:,d} parts", T.measure(solver(general_arrays(n))), 5.0 if n == 10**6 else None
        )

    sec = "network: large networks (fresh process each run, 60 s timeout)"
    print(f"\n{sec}")
    guarded(sec, "random non-local, 100,000 parts", "random", 10**5, 1.0)
    guarded(sec, "random non-local, 1,000,000 parts", "random", 10**6, 10.0)
    guarded(sec, "32-rail grid, ~1,000,000 parts", "rails", 10**6, 1.0)

    sec = "network: contact"
    print(f"\n{sec}")
    rng = np.random.default_rng(1)
    n_parts = 10**4
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
    it = Network.from_arrays(n, i, j, k, d0, beh, fixed=[0]).solve(f).iterations
    T.report(
        sec,
        "10,000 parts, half contact parts",
        T.measure(lambda: Network.from_arrays(n, i, j, k, d0, beh, fixed=[0]).solve(f)),
        note=f"{it} Newton iterations",
    )

    sec = "comparisons"
    print(f"\n{sec} (interleaved)")
    pynite(sec)
    arr = general_arrays(10**5)
    mat, rhs = assembled_matrix(arr)
    from scipy.sparse.linalg import spsolve

    ta, tb, r = T.interleaved(lambda: spsolve(mat, rhs), solver(arr))
    T.report(sec, "bare scipy spsolve, assembled 1e5-part shuffled ladder", ta)
    T.report(sec, "our build + solve, same network", tb)
    T.report_ratio("ratios", "ours / bare scipy spsolve, 1e5-part shuffled ladder", r)

    from clampstack.assembly import Assembly, PartSpec, build_network

    nn, ci, cj, ck, cf, _ = chain_arrays(10**5)
    parts = tuple(PartSpec(f"p{p}", (f"n{p}", f"n{p + 1}"), float(ck[p])) for p in range(ci.size))
    asm = Assembly("chain", parts, ("n0",))

    def named():
        net, _ = build_network(asm)
        return net.solve(cf)

    ta, tb, r = T.interleaved(solver((nn, ci, cj, ck, cf, [0])), named)
    T.report(sec, "array path, 1e5-part chain", ta)
    T.report(sec, "named-part path (build_network + solve), same chain", tb)
    T.report_ratio("ratios", "named-part / array path, 1e5-part chain", r, 2.0)

    sec = "process (whole process, imports included)"
    print(f"\n{sec}")
    T.report(
        sec, "clampstack --help", T.stat([T.process(T.cli("--help")) for _ in range(T.RUNS)]), 0.15
    )
    py = [str(T.BIN / "python"), "-c", "import numpy, pint"]
    # tie-rod-in-spacer-tube.toml is an assembly file: `check` refuses it, `solve` reads it
    for ex, cmd in (
        ("m16-through-bolt-alternating.toml", "check"),
        ("tie-rod-in-spacer-tube.toml", "solve"),
    ):
        path = f"examples/{ex}"
        ta, tb, r = T.interleaved(
            lambda: T.process(py), lambda p=path, c=cmd: T.process(T.cli(c, p))
        )
        T.report(sec, "python -c 'import numpy, pint'", ta)
        T.report(sec, f"clampstack {cmd} {ex}", tb)
        T.report_ratio("ratios", f"{cmd} {ex} / import numpy, pint (process)", r, 1.3)
        with tempfile.TemporaryDirectory() as tmp:
            ta, tb, r = T.interleaved(
                lambda p=path, c=cmd: T.process(T.cli(c, p)),
                lambda p=path, d=tmp: T.process(T.cli("report", p, "-o", d)),
            )
        T.report(sec, f"clampstack report {ex} -o <tmp>", tb)
        T.report_ratio("ratios", f"report / {cmd} {ex} (process)", r, 1.5)
    ex = "examples/tie-rod-in-spacer-tube.toml"
    T.report(
        sec,
        "clampstack solve tie-rod-in-spacer-tube.toml",
        T.stat([T.process(T.cli("solve", ex)) for _ in range(T.RUNS)]),
        0.8,
    )

    import runpy

    for extra in sorted((ROOT / "bench").glob("bench_*.py")):
        runpy.run_path(str(extra), run_name="__main__")
    write_doc()


def machine() -> list[str]:
    import platform

    import matplotlib
    import pint
    import scipy

    cpu = "unknown"
    try:
        for line in Path("/proc/cpuinfo").read_text().splitlines():
            if line.startswith("model name"):
                cpu = line.split(":", 1)[1].strip()
                break
    except OSError:
        pass
    ram = "unknown"
    try:
        kb = int(Path("/proc/meminfo").read_text().split()[1])
        ram = f"{kb / 1024**2:.1f} GB"
    except (OSError, ValueError, IndexError):
        pass
    return [
        f"- CPU: {cpu}, {os.cpu_count()} cores; RAM {ram}",
        f"- OS: {platform.platform()}; Python {platform.python_version()}",
        f"- numpy {np.__version__}, scipy {scipy.__version__}, pint {pint.__version__}, "
        f"matplotlib {matplotlib.__version__}; BLAS threads pinned to 1",
        f"- date: {time.strftime('%Y-%m-%d %H:%M UTC', time.gmtime())}",
    ]


def write_doc() -> None:
    out = [
        "# Performance",
        "",
        "Generated by `make bench` (`bench/run.py`, which overwrites this file).  Every figure",
        "is the median, with min and max, of at least 5 runs.  Every comparison is a ratio of",
        "interleaved runs in the same process (A, B, A, B, ... for at least 5 rounds): the",
        "per-round ratio B/A, its median with min .. max.  Process figures are whole-process",
        "wall times (`.venv/bin/clampstack ...` in a subprocess), imports included.  Large",
        "networks run in a fresh process each with a 60 s timeout.  To regenerate: `make bench`.",
        "",
        "## Machine",
        "",
        *machine(),
    ]
    sections: dict[str, list[list[str]]] = {}
    for s, row in T.ROWS:
        sections.setdefault(s, []).append(row)
    for s, rows in sections.items():
        out += ["", f"## {s}", ""]
        if s == "ratios":
            out += ["| comparison | median | min | max | target | status |"]
        else:
            out += ["| case | median | min | max | target | status |"]
        out += ["|---|---|---|---|---|---|"]
        out += ["| " + " | ".join(r) + " |" for r in rows]
    (ROOT / "docs" / "performance.md").write_text("\n".join(out) + "\n")
    print("\nwrote docs/performance.md")


if __name__ == "__main__":
    if len(sys.argv) > 1 and sys.argv[1] == "--worker":
        worker(sys.argv[2], int(sys.argv[3]))
    else:
        main()
