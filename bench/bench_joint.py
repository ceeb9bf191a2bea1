"""Joint benchmarks: check of one joint, and a 1,000-point temperature sweep (target <= 50 ms)."""

from __future__ import annotations

import time
from pathlib import Path

ROOT = Path(__file__).resolve().parents[1]


def best_of(fn, repeat: int = 7) -> float:
    times = []
    for _ in range(repeat):
        t = time.perf_counter()
        fn()
        times.append(time.perf_counter() - t)
    return min(times)


def main() -> None:
    import numpy as np

    from clampstack.inputs.joint import read_joint_file
    from clampstack.joint import analyse
    from clampstack.joint.prepare import prepare
    from clampstack.studies.sweep import _evaluate, sweep

    _, spec = read_joint_file(str(ROOT / "examples" / "gearbox-cover-cold-to-hot.toml"))
    t_check = best_of(lambda: analyse(spec))
    lo, hi = 273.15 - 40, 273.15 + 150
    step = (hi - lo) / 999
    t_sweep = best_of(lambda: sweep(spec, lo, hi, step))
    prep = prepare(spec)
    T = np.linspace(lo, hi, 1000)
    t_chain = best_of(lambda: _evaluate(prep, T))
    from clampstack.inputs.joint import read_joint_file
    from clampstack.studies.size import size

    _, base = read_joint_file(str(ROOT / "examples" / "m16-through-bolt-alternating.toml"))
    t_size = best_of(lambda: size(base), 3)
    res = size(base)
    print("\njoint")
    print(f"  check of one joint (network states, checks, heat cycle)  {t_check * 1e3:8.2f} ms")
    print(
        f"  sweep, 1,000 temperature points, full check chain      {t_sweep * 1e3:8.2f} ms "
        "(target <= 50 ms)"
    )
    print(f"    of which the vectorised states and margins           {t_chain * 1e3:8.2f} ms")
    print(
        f"  sizing over the catalog ({res.candidates} candidates, {res.evaluated} checked)"
        f"  {t_size * 1e3:8.1f} ms (target <= 200 ms)"
    )


if __name__ == "__main__":
    main()
