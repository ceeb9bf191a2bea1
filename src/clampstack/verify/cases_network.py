"""The axial spring network against closed forms of statically indeterminate bars.

Every expected value is a hand calculation by the compatibility method
(equilibrium + compatibility + Hooke's law) as in any mechanics of materials
text, e.g. Gere & Goodno, *Mechanics of Materials*, ch. 2 (statically
indeterminate structures, misfits and prestrains); the working is beside each
case.  Stiffnesses in kN/mm = 1e6 N/m.
"""

from __future__ import annotations

import numpy as np

from ..network import COMPRESSION, CURVE, TENSION, Curve, Network
from .registry import Outcome, register

G = "network"
SRC = "Gere & Goodno, Mechanics of Materials, ch. 2, hand calculation"
KN_MM = 1e6


@register("two-segment bar between walls, reaction", G, kind="hand")
def walls() -> Outcome:
    # k1 = 200, k2 = 50 kN/mm, P = 12 kN at the joint B:
    # R_A = -P k1/(k1 + k2) = -12 x 200/250 = -9.6 kN
    net = Network.from_arrays(3, [0, 1], [1, 2], [200 * KN_MM, 50 * KN_MM], fixed=[0, 2])
    s = net.solve(np.array([0.0, 12e3, 0.0]))
    return Outcome(s.reaction[0] / 1e3, -9.6, 1e-12, SRC, "kN")


@register("three springs in series, tip displacement", G, kind="hand")
def series() -> Outcome:
    # 100, 200, 400 kN/mm in series, P = 7 kN: 1/k = 0.01 + 0.005 + 0.0025 = 0.0175 mm/kN
    # u = 7 x 0.0175 = 0.1225 mm
    k = np.array([100.0, 200.0, 400.0]) * KN_MM
    net = Network.from_arrays(4, [0, 1, 2], [1, 2, 3], k, fixed=[0])
    s = net.solve(np.array([0.0, 0.0, 0.0, 7e3]))
    return Outcome(s.displacement[-1] * 1e3, 0.1225, 1e-12, SRC, "mm")


@register("two springs in parallel, load share", G, kind="hand")
def parallel() -> Outcome:
    # 100 and 300 kN/mm in parallel, P = 8 kN: the stiffer takes 8 x 300/400 = 6 kN
    net = Network.from_arrays(2, [0, 0], [1, 1], [100 * KN_MM, 300 * KN_MM], fixed=[0])
    s = net.solve(np.array([0.0, 8e3]))
    return Outcome(s.force[1] / 1e3, 6.0, 1e-12, SRC, "kN")


def _rod_sleeve(behaviour_sleeve: int = 0) -> Network:
    # rod k_r = 300 kN/mm made 0.12 mm short, sleeve k_s = 900 kN/mm, same two nodes
    return Network.from_arrays(
        2,
        [0, 0],
        [1, 1],
        [300 * KN_MM, 900 * KN_MM],
        [-0.12e-3, 0.0],
        [0, behaviour_sleeve],
        fixed=[0],
    )


@register("rod too short assembled in a sleeve, rod force", G, kind="hand")
def misfit() -> Outcome:
    # N = m k_r k_s/(k_r + k_s) = 0.12 x 300 x 900/1200 = 0.12 x 225 = 27 kN (tension)
    return Outcome(_rod_sleeve().solve().force[0] / 1e3, 27.0, 1e-12, f"{SRC} (misfit)", "kN")


@register("compression-only sleeve under a pull, sleeve force", G, kind="hand")
def sleeve_clamped() -> Outcome:
    # from the 27 kN prestress, a pull of 18 kN: sleeve = -27 + 18 x 900/1200 = -13.5 kN
    s = _rod_sleeve(COMPRESSION).solve(np.array([0.0, 18e3]))
    return Outcome(s.force[1] / 1e3, -13.5, 1e-11, SRC, "kN")


@register("compression-only sleeve beyond separation, rod force", G, kind="hand")
def sleeve_open() -> Outcome:
    # separation at P = 27 x 1200/900 = 36 kN; at 50 kN the sleeve is slack and the rod
    # carries all of it: 50 kN
    s = _rod_sleeve(COMPRESSION).solve(np.array([0.0, 50e3]))
    return Outcome(s.force[0] / 1e3, 50.0, 1e-11, SRC, "kN")


@register("gap closing onto a stop, stop force", G, kind="hand")
def gap() -> Outcome:
    # bar k1 = 50 kN/mm, stop k2 = 200 kN/mm behind a 0.05 mm gap, P = 10 kN: without the
    # stop u = 0.2 mm > gap, so u = (P + k2 g)/(k1 + k2) = (10 + 10)/250 = 0.08 mm and the
    # stop pushes back k2 (u - g) = 200 x 0.03 = 6 kN (compression)
    net = Network.from_arrays(
        3,
        [0, 1],
        [1, 2],
        [50 * KN_MM, 200 * KN_MM],
        behaviour=[0, COMPRESSION],
        gap=[0, 0.05e-3],
        fixed=[0, 2],
    )
    s = net.solve(np.array([0.0, 10e3, 0.0]))
    return Outcome(s.force[1] / 1e3, -6.0, 1e-11, SRC, "kN")


@register("slack tension-only link beside a spring, link force", G, kind="hand")
def tension_link() -> Outcome:
    # spring 1 kN/mm beside a link 4 kN/mm with 2 mm slack, P = 5 kN: u = (5 + 4 x 2)/5
    # = 2.6 mm > 2 mm, link force 4 x 0.6 = 2.4 kN
    net = Network.from_arrays(
        2,
        [0, 0],
        [1, 1],
        [1 * KN_MM, 4 * KN_MM],
        behaviour=[0, TENSION],
        gap=[0, 2e-3],
        fixed=[0],
    )
    s = net.solve(np.array([0.0, 5e3]))
    return Outcome(s.force[1] / 1e3, 2.4, 1e-11, SRC, "kN")


@register("soft-then-stiff curve part in series, curve force", G, kind="hand")
def curve() -> Outcome:
    # curve: 1 kN/mm up to 1 mm of compression, 10 kN/mm beyond; between a fixed end and a
    # node held by a 5 kN/mm spring to the other wall, P = 9 kN towards the curve part:
    # stiff branch: 5 u + 1 + 10 (u - 1) = 9 -> u = 18/15 = 1.2 mm > 1 mm (branch holds)
    # curve force = -(1 + 10 x 0.2) = -3 kN
    c = Curve.make([-2e-3, -1e-3, 0.0], [-11e3, -1e3, 0.0])
    net = Network.from_arrays(
        3,
        [0, 1],
        [1, 2],
        [5 * KN_MM, 1.0],
        behaviour=[0, CURVE],
        curves={1: c},
        fixed=[0, 2],
    )
    s = net.solve(np.array([0.0, 9e3, 0.0]))
    return Outcome(s.force[1] / 1e3, -3.0, 1e-11, f"{SRC} (piecewise linear part)", "kN")
