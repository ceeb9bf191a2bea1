"""Figures of a generic axial assembly (``clampstack report`` of an assembly file).

Nothing here recomputes mechanics: forces and displacements come from the
:class:`~clampstack.assembly.AssemblyResult`.
"""

from __future__ import annotations

import numpy as np
from matplotlib.figure import Figure

from ..assembly import AssemblyResult
from ..outputs.text import UNIT_SYSTEMS
from ._style import MUTED, PASS_RAMP, new_figure, style


def _ramp(i: int, n: int) -> str:
    """The i-th of n colours from light to dark."""
    top = len(PASS_RAMP) - 1
    return PASS_RAMP[min(top, round(i * top / max(n - 1, 1)))]


def force_diagram(result: AssemblyResult, units: str = "si") -> Figure:
    """Axial force of every part (per part; tension +) in every case, as grouped bars."""
    u = UNIT_SYSTEMS[units]
    fl, ff = u.force
    parts = result.assembly.parts
    cases = result.cases
    n_p, n_c = len(parts), len(cases)
    with style():
        fig = new_figure(height=max(2.4, 0.42 * n_p * max(1.0, n_c / 2.5) + 1.2))
        ax = fig.add_subplot()
        ax.set_title("Axial force of each part (tension +), per part")
        h = 0.8 / n_c
        colours = [
            PASS_RAMP[min(len(PASS_RAMP) - 1, round(i * (len(PASS_RAMP) - 1) / max(n_c - 1, 1)))]
            for i in range(n_c)
        ]
        for k, case in enumerate(cases):
            y = np.arange(n_p) + (k - (n_c - 1) / 2) * h
            F = np.array([case.force[p.name] for p in parts]) / ff
            bars = ax.barh(y, F, height=h * 0.92, color=colours[k], label=case.name)
            for b in bars:
                b.set_gid(f"forces-{k}")
        ax.axvline(0.0, color=MUTED, lw=0.8)
        ax.set_yticks(np.arange(n_p))
        ax.set_yticklabels([p.name if p.count == 1 else f"{p.name} (x {p.count})" for p in parts])
        ax.invert_yaxis()
        ax.set_xlabel(f"force [{fl}]  (compression <  0  > tension)")
        fig.legend(loc="outside lower center", ncols=min(n_c, 4), fontsize=7)
    return fig


def displacement_plot(result: AssemblyResult, units: str = "si") -> Figure:
    """Displacement of every node along the axis in every case."""
    u = UNIT_SYSTEMS[units]
    ll, lf = u.length
    nodes = list(result.cases[0].displacement)
    with style():
        fig = new_figure(height=max(2.2, 0.36 * len(nodes) + 1.2))
        ax = fig.add_subplot()
        ax.set_title("Displacement of each node along the axis")
        n_c = len(result.cases)
        marks = "osD^v<>p"
        for k, case in enumerate(result.cases):
            x = np.array([case.displacement[n] for n in nodes]) / lf
            y = np.arange(len(nodes)) + (k - (n_c - 1) / 2) * 0.8 / n_c
            ax.plot(
                x,
                y,
                marks[k % len(marks)],
                ls="none",
                color=_ramp(k, n_c),
                ms=5,
                label=case.name,
                gid=f"displacement-{k}",
            )
        ax.axvline(0.0, color=MUTED, lw=0.8)
        ax.set_yticks(np.arange(len(nodes)))
        ax.set_yticklabels(nodes)
        ax.invert_yaxis()
        ax.set_xlabel(f"displacement along +axis [{ll}]")
        fig.legend(loc="outside lower center", ncols=min(n_c, 4), fontsize=7)
    return fig
