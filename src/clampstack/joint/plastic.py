"""Permanent preload loss: a heat-up, service-load and cool-down cycle with yielding parts.

The joint network of :mod:`clampstack.joint.analysis` is solved step by step
along a path (assembly -> service temperature -> maximum working load ->
unloaded -> back to the assembly temperature) with elastic-perfectly-plastic
parts that keep their plastic elongation between steps (unloading along the
elastic slope):

* the bolt yields in tension at ``R_p0.2(T) A0`` (VDI 2230-1 takes the thread
  torsion as relaxed in service; ISO 898-1 Annex A elevated-temperature values
  where the grade has them);
* the clamped parts under the head and nut yield in compression at
  ``p_G A_p`` (the limiting surface pressure over the bearing area; VDI 2230-1
  R10: beyond it the surface creeps and flattens).

A cycle that stays elastic returns the original preload exactly; any yield
shortens the bolt's or the stack's free length for good.
"""

from __future__ import annotations

import math
from dataclasses import dataclass

import numpy as np

from ..catalog import yield_at_temperature
from ..network import CURVE, elastic_plastic_curve, update_plastic
from .prepare import Prepared, joint_network

STEPS = 12  # temperature sub-steps each way (monotonic ramps: exact at every step)


@dataclass(frozen=True)
class CycleResult:
    """Preload before and after a thermal/service cycle, for both branches [N]."""

    T_peak: float
    preload_before: tuple[float, float]
    preload_after: tuple[float, float]
    yielded: tuple[str, ...]
    path: tuple[tuple[float, float, float], ...]  # (T [K], bolt min, bolt max) along the path

    @property
    def permanent_loss(self) -> float:
        """Loss of the larger (maximum-preload) branch, >= 0 [N]; a difference within the
        solver's round-off (1e-9 of the preload) is no loss."""
        loss = max(
            0.0,
            self.preload_before[1] - self.preload_after[1],
            self.preload_before[0] - self.preload_after[0],
        )
        return 0.0 if loss <= 1e-9 * max(abs(self.preload_before[1]), 1.0) else loss


def _bearing_yield(prep: Prepared) -> tuple[float, float]:
    """Compressive yield force of the faces under head and nut: p_G x bearing area [N]."""
    s = prep.spec
    out = []
    sides = [(s.bolt.bearing_diameter, s.layers[0])]
    if s.nut is not None:
        sides.append((s.nut.bearing_diameter, s.layers[-1]))
    for dW, lay in sides:
        if lay.limiting_pressure is None:
            out.append(math.inf)
        else:
            out.append(lay.limiting_pressure * math.pi / 4 * (dW**2 - lay.hole**2))
    while len(out) < 2:
        out.append(math.inf)
    return out[0], out[1]


def permanent_loss_cycle(
    prep: Prepared, T_peak: float | None = None, FA: float | None = None, steps: int = STEPS
) -> CycleResult:
    """Follow assembly -> T_peak -> F_A -> 0 -> assembly temperature with yielding parts."""
    s = prep.spec
    srv = s.service
    model = prep.model
    T0 = srv.assembly_temperature
    T1 = srv.temperature if T_peak is None else T_peak
    FA_max = max(srv.axial_load[1], 0.0) if FA is None else FA
    n = srv.load_height
    dSa, dPa = model.resiliences_at_assembly()
    Yc_head, Yc_nut = _bearing_yield(prep)
    yield_ratio = 1.2 if s.tightening.method in ("yield", "angle") else 1.0
    up = list(np.linspace(T0, T1, steps + 1))
    path_T = [*up, T1, T1, *up[::-1][1:]]  # ramp up, load on, load off, ramp down
    path_F = [0.0] * len(up) + [FA_max, 0.0] + [0.0] * (len(up) - 1)
    results = []
    yielded: set[str] = set()
    for FM, embed in ((prep.assembly_min, True), (prep.assembly_max, False)):
        misfit = -FM * (dSa + dPa)
        fz = prep.embedding_amount if embed else 0.0
        plastic = {"bolt": 0.0, "head": 0.0, "nut": 0.0}
        trace = []
        u_prev = None  # each step starts from the previous state (fewer Newton steps)
        for T, F in zip(path_T, path_F, strict=True):
            dS, dP = (float(x) for x in model.resiliences(T))
            thb, thc = (float(x) for x in model.thermal(T))
            jn = joint_network(dS, dP, n, misfit + thb, thc - fz)
            net = jn.net
            Yt = (
                yield_ratio
                * float(
                    yield_at_temperature(s.bolt.grade, float(model.part_T(s.bolt.temperature, T)))[
                        0
                    ]
                )
                * prep.A0
            )
            laws = {0: ("bolt", Yt, math.inf, True, False)}
            if net.n_nodes == 4:
                laws[1] = ("head", math.inf, Yc_head, True, True)
                laws[3] = ("nut", math.inf, Yc_nut, True, True)
            else:
                laws[1] = ("head", math.inf, min(Yc_head, Yc_nut), False, True)
            curves = {}
            for p, (name, yt, yc, ct, cc) in laws.items():
                curves[p] = elastic_plastic_curve(float(net.k[p]), plastic[name], yt, yc, ct, cc)
            beh = net.behaviour.copy()
            beh[list(curves)] = CURVE
            net.behaviour = beh
            net.curves = curves
            loads = np.zeros(net.n_nodes)
            loads[jn.load_node] = F
            start = u_prev if u_prev is not None and u_prev.size == net.n_nodes else None
            sol = net.solve(loads, start=start)
            u_prev = sol.displacement
            e = sol.elongation - net.free_elongation
            for p, (name, yt, yc, _, _) in laws.items():
                new = update_plastic(
                    float(net.k[p]), plastic[name], float(e[p]), float(sol.force[p]), yt, yc
                )
                if new != plastic[name]:
                    yielded.add(name)
                plastic[name] = new
            trace.append(float(sol.force[jn.bolt]))
        results.append(trace)
    before = (results[0][0], results[1][0])
    after = (results[0][-1], results[1][-1])
    path = tuple((T, a, b) for T, a, b in zip(path_T, results[0], results[1], strict=True))
    names = {
        "bolt": "bolt",
        "head": "bearing face under the head",
        "nut": "bearing face under the nut",
    }
    return CycleResult(T1, before, after, tuple(names[y] for y in sorted(yielded)), path)
