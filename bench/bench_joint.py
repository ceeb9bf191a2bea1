"""Joint benchmarks: check of one joint, and a 1,000-point temperature sweep (target <= 50 ms)."""

from __future__ import annotations

import sys
from pathlib import Path

ROOT = Path(__file__).resolve().parents[1]
sys.path.insert(0, str(ROOT / "bench"))

import _timing as T  # noqa: E402


def main() -> None:
    import numpy as np

    from clampstack.inputs.joint import read_joint_file
    from clampstack.joint import analyse
    from clampstack.joint.prepare import prepare
    from clampstack.studies.sweep import _evaluate, sweep

    _, spec = read_joint_file(str(ROOT / "examples" / "gearbox-cover-cold-to-hot.toml"))
    t_check = T.measure(lambda: analyse(spec))
    lo, hi = 273.15 - 40, 273.15 + 150
    step = (hi - lo) / 999
    t_sweep = T.measure(lambda: sweep(spec, lo, hi, step))
    prep = prepare(spec)
    Tk = np.linspace(lo, hi, 1000)
    t_chain = T.measure(lambda: _evaluate(prep, Tk))
    from clampstack.inputs.joint import read_joint_file
    from clampstack.studies.size import size

    _, base = read_joint_file(str(ROOT / "examples" / "m16-through-bolt-alternating.toml"))
    t_size = T.measure(lambda: size(base))
    res = size(base)
    sec = "joint"
    print(f"\n{sec}")
    T.report(sec, "check of one joint (states, checks, heat cycle)", t_check)
    T.report(sec, "sweep, 1,000 temperature points, full check chain", t_sweep, 0.05)
    T.report(sec, "of which the vectorised states and margins", t_chain)
    T.report(
        sec,
        f"sizing over the catalog ({res.candidates} candidates, {res.evaluated} checked)",
        t_size,
        0.2,
    )


if __name__ == "__main__":
    main()
