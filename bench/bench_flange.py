"""Flange benchmark: a 96-bolt flange tightened in 4 passes (target <= 0.2 s)."""

from __future__ import annotations

import sys
from pathlib import Path

sys.path.insert(0, str(Path(__file__).resolve().parent))

import _timing as T  # noqa: E402


def spec96():
    from clampstack.inputs.flange import flange_from_data

    return flange_from_data(
        {
            "flange": {
                "bolt_count": 96,
                "bolt_circle": "3000 mm",
                "thickness": "80 mm",
                "inner_diameter": "2800 mm",
                "outer_diameter": "3120 mm",
            },
            "bolt": {"thread": "M24", "grade": "10.9"},
            "gasket": {
                "type": "spiral-wound",
                "inner_diameter": "2860 mm",
                "outer_diameter": "2940 mm",
                "thickness": "4.5 mm",
            },
            "loading": {"pressure": "10 bar"},
            "tightening": {"thread_friction": "0.10..0.14", "passes": [30, 70, 100, 100]},
        }
    )


def main() -> None:
    import numpy as np

    from clampstack.flange.analysis import (
        analyse_flange,
        build_ring,
        pass_orders,
        simulate_passes,
    )

    spec = spec96()
    orders = pass_orders(spec)

    def passes() -> None:
        ring = build_ring(spec)
        simulate_passes(ring, np.full(96, 200e3), spec.passes, orders)

    sec = "flange"
    print(f"\n{sec}")
    T.report(sec, "96 bolts, 4 passes (384 tightening steps)", T.measure(passes), 0.2)
    T.report(
        sec, "whole flange analysis of the same flange", T.measure(lambda: analyse_flange(spec))
    )
    studies()


def studies(runs: int = 5) -> None:
    """Flange studies on the bundled examples: median (min .. max) of ``runs`` runs each."""
    from pathlib import Path

    from clampstack.inputs.flange import read_flange_file
    from clampstack.studies.flange_scatter import flange_scatter
    from clampstack.studies.flange_size import size_flange
    from clampstack.studies.flange_sweep import flange_sweep

    ex = Path(__file__).resolve().parents[1] / "examples"
    pump = read_flange_file(str(ex / "pump-outlet-flange-8-bolts.toml"))[1]
    steam = read_flange_file(str(ex / "steam-header-flange-tensioned.toml"))[1]
    hot = read_flange_file(str(ex / "hot-oil-flange-spiral-wound.toml"))[1]
    jobs = [
        ("size, pump outlet (8 bolts, torque and tension)", lambda: size_flange(pump), 1.0),
        ("size, steam header (tensioned half per pass)", lambda: size_flange(steam), None),
        (
            "sweep --cycle, hot-oil flange, 101 points",
            lambda: flange_sweep(hot, hot.T_assembly, hot.T_flange, cycle=True),
            None,
        ),
        ("scatter, hot-oil flange, 10 000 samples", lambda: flange_scatter(hot, 10_000), None),
    ]
    times: dict[str, list[float]] = {name: [] for name, _, _ in jobs}
    for _ in range(runs):
        for name, fn, _ in jobs:
            times[name].append(T.timed(fn))
    for name, _, target in jobs:
        T.report("flange", f"study: {name}", T.stat(times[name]), target)


if __name__ == "__main__":
    main()
