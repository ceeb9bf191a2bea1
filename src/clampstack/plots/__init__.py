"""Figures of clampstack results (matplotlib, Agg canvas, clampstack's own style).

This is the only package that imports matplotlib; import it lazily (inside a
function) from anything the command line loads at start-up.

Every plot function takes result objects and returns a
:class:`matplotlib.figure.Figure`; :func:`figure_svg`, :func:`figure_png` and
:func:`inline_svg` render it.
"""

from __future__ import annotations

from ._style import figure_png, figure_svg, inline_svg
from .joint import bolt_load_plot, joint_diagram, spring_schematic
from .studies import binned_histogram, gasket_states_plot, histogram, passes_plot, sweep_plot

__all__ = [
    "binned_histogram",
    "bolt_load_plot",
    "figure_png",
    "figure_svg",
    "gasket_states_plot",
    "histogram",
    "inline_svg",
    "joint_diagram",
    "passes_plot",
    "spring_schematic",
    "sweep_plot",
]
