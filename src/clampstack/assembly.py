"""Generic axial assemblies (``clampstack solve``): named parts between named nodes.

An :class:`Assembly` is what an input file describes after validation: parts
with their stiffness and free elongation already in SI floats, the fixed nodes,
the assembly loads and any further load cases.  :func:`solve_assembly` turns it
into a :class:`~clampstack.network.Network`, solves the assembled state and
every load case from it, and returns immutable results.

Sign conventions (also in DESIGN.md): part force is tension positive;
displacement and loads are along +axis (from a part's first end to its
second); a reaction is the force the support exerts on the assembly, +axis.
"""

from __future__ import annotations

from dataclasses import dataclass, field
from typing import Any

import numpy as np

from .display import Shown
from .errors import InputError
from .network import BEHAVIOURS, CURVE, Curve, Network


@dataclass(frozen=True)
class PartSpec:
    """One part: SI floats (m, m^2, Pa, 1/K, N/m, K)."""

    name: str
    ends: tuple[str, str]
    stiffness: float  # N/m (for a curve part: the initial slope, for information)
    length: float | None = None
    area: float | None = None
    modulus: float | None = None
    expansion: float | None = None
    material: str | None = None
    behaviour: str = "linear"  # linear | compression | tension | curve
    gap: float = 0.0
    misfit: float = 0.0
    temperature_change: float = 0.0
    curve: Curve | None = None
    key: str = ""  # key path in the input, for messages
    count: int = 1  # identical parts in parallel; stiffness and force are per part
    preload: float | None = None  # N per part in the assembled state: the misfit is solved for

    def thermal_elongation(self, dT: float) -> float:
        """Free thermal elongation ``alpha * dT * L`` [m] for a temperature change [K]."""
        if dT == 0.0:
            return 0.0
        if self.expansion is None or self.length is None:
            raise InputError(
                "a temperature change needs the part's length and expansion "
                "(give material or expansion)",
                key=f"{self.key}.temperature_change" if self.key else None,
            )
        return self.expansion * dT * self.length


@dataclass(frozen=True)
class LoadCase:
    """Loads and a uniform temperature change applied on top of the assembled state."""

    name: str
    loads: tuple[tuple[str, float], ...] = ()
    temperature_change: float = 0.0


@dataclass(frozen=True)
class Assembly:
    """A validated generic assembly."""

    title: str
    parts: tuple[PartSpec, ...]
    fixed: tuple[str, ...]
    loads: tuple[tuple[str, float], ...] = ()
    cases: tuple[LoadCase, ...] = ()
    nodes: tuple[str, ...] = field(default=())

    def node_names(self) -> tuple[str, ...]:
        """Node names in order of first appearance (parts, then supports and loads)."""
        if self.nodes:
            return self.nodes
        seen: dict[str, None] = {}
        for p in self.parts:
            seen.setdefault(p.ends[0])
            seen.setdefault(p.ends[1])
        for n in self.fixed:
            seen.setdefault(n)
        return tuple(seen)


@dataclass(frozen=True)
class CaseResult:
    """The solved state of one load case (SI floats, keyed by names).

    ``force`` is per part (a part with ``count`` n carries n times it in all);
    ``elongation`` is the change of the distance between the part's two end nodes from the
    unloaded geometry, ``u_second - u_first`` (its free elongation, from misfit and
    temperature, is part of it: the force follows from the elongation less the free one).
    ``load_share``: for each applied load of the case (``"node: force"``), the share of it
    that each part (in all, over its count) takes on top of the assembled state;
    ``events``: where a contact part unloads, goes slack or closes as the case's loads and
    temperature change grow from zero (factor on the case, found to 1e-12).
    """

    name: str
    displacement: dict[str, float]
    force: dict[str, float]
    stress: dict[str, float | None]
    elongation: dict[str, float]
    carrying: dict[str, bool]
    reactions: dict[str, float]
    residual: float
    counts: dict[str, int] = field(default_factory=dict)
    load_share: dict[str, dict[str, float]] = field(default_factory=dict)
    events: tuple[dict[str, Any], ...] = ()

    def to_dict(self) -> dict[str, Any]:
        """JSON form per DESIGN.md (``solve --json``)."""
        return {
            "name": self.name,
            "nodes": {n: {"displacement_mm": v * 1e3} for n, v in self.displacement.items()},
            "parts": {
                p: {
                    "force_N": self.force[p],
                    "count": self.counts.get(p, 1),
                    "total_force_N": self.force[p] * self.counts.get(p, 1),
                    "stress_MPa": None if self.stress[p] is None else self.stress[p] * 1e-6,
                    "elongation_mm": self.elongation[p] * 1e3,
                    "carrying": self.carrying[p],
                }
                for p in self.force
            },
            "reactions": {n: {"force_N": v} for n, v in self.reactions.items()},
            "equilibrium_residual_N": self.residual,
            "load_share": self.load_share,
            "events": list(self.events),
        }


@dataclass(frozen=True)
class AssemblyResult(Shown):
    """All solved cases of an assembly; the first is the assembled state."""

    assembly: Assembly
    cases: tuple[CaseResult, ...]
    #: parts with a preload: the misfit that gives it (free minus fitted length) [m]
    fitted_misfits: dict[str, float] = field(default_factory=dict)

    @property
    def notes(self) -> tuple[str, ...]:
        """Warnings: a curve part whose force lies beyond its curve's points (the end
        slope carries on there: data the file did not give)."""
        out = []
        for c in self.cases:
            for part in self.assembly.parts:
                cv = part.curve
                if cv is None:
                    continue
                F = c.force[part.name]
                tol = 1e-9 * max(abs(float(cv.f[-1])), abs(float(cv.f[0])), 1.0)
                side = None
                if F > float(cv.f[-1]) + tol:
                    side, end = "last", float(cv.f[-1])
                elif F < float(cv.f[0]) - tol:
                    side, end = "first", float(cv.f[0])
                if side:
                    out.append(
                        f"case {c.name!r}: part {part.name!r} ({part.key}) carries "
                        f"{F / 1e3:.4g} kN, beyond its curve's {side} point ({end / 1e3:.4g} kN): "
                        "the end slope is carried on there; extend the curve"
                    )
        return tuple(out)

    def to_dict(self) -> dict[str, Any]:
        """JSON form per DESIGN.md."""
        return {
            "title": self.assembly.title,
            "cases": [c.to_dict() for c in self.cases],
            "preloads": {
                p.name: {"preload_N": p.preload, "misfit_mm": self.fitted_misfits[p.name] * 1e3}
                for p in self.assembly.parts
                if p.name in self.fitted_misfits
            },
            "notes": list(self.notes),
        }


ASSEMBLY_CASE = "assembly"


def build_network(asm: Assembly) -> tuple[Network, dict[str, int]]:
    """The network of an assembly and its node index (validated; InputError naming nodes)."""
    names = asm.node_names()
    index = {n: i for i, n in enumerate(names)}
    for node in asm.fixed:
        if node not in index:
            raise InputError(
                f"unknown node {node!r} (nodes: {', '.join(names)})", key="supports.fixed"
            )
    parts = asm.parts
    i = np.array([index[p.ends[0]] for p in parts], dtype=np.int64)
    j = np.array([index[p.ends[1]] for p in parts], dtype=np.int64)
    k = np.array([p.stiffness * p.count for p in parts], dtype=float)
    d0 = np.array([p.misfit + p.thermal_elongation(p.temperature_change) for p in parts])
    beh = np.array([BEHAVIOURS[p.behaviour] for p in parts], dtype=np.int8)
    gap = np.array([p.gap for p in parts])
    curves = {n: p.curve for n, p in enumerate(parts) if p.curve is not None}
    k = np.where(beh == CURVE, 1.0, k)
    fixed = [index[n] for n in asm.fixed]
    net = Network.from_arrays(len(names), i, j, k, d0, beh, gap, curves, fixed)
    unheld = net.unheld_groups()
    if unheld:
        loose = [names[n] for n in unheld[0]]
        group = ", ".join(loose[:8])
        parts_at = [p for p in parts if p.ends[0] in loose or p.ends[1] in loose]
        shown = ", ".join(f"{p.name!r} ({p.key or 'part'})" for p in parts_at[:6])
        raise InputError(
            f"nodes {group} are not joined to any fixed node (a floating sub-assembly"
            + (f" of {shown}" if shown else "")
            + "); add a support or a part that ties them in",
            key="supports.fixed",
        )
    return net, index


def _load_vector(
    loads: tuple[tuple[str, float], ...], index: dict[str, int], key: str
) -> np.ndarray:
    f = np.zeros(len(index))
    for n, (node, force) in enumerate(loads):
        if node not in index:
            raise InputError(
                f"unknown node {node!r} (nodes: {', '.join(index)})", key=f"{key}[{n + 1}].node"
            )
        f[index[node]] += force
    return f


def _with_names(err: Exception, names: tuple[str, ...], asm: Assembly | None = None) -> str:
    """The network's message with node numbers replaced by the assembly's node names, and
    the parts that join those nodes named."""
    import re

    touched: list[str] = []

    def repl(m: re.Match[str]) -> str:
        ids = [int(x) for x in m.group(1).split(", ")]
        shown = [names[i] if 0 <= i < len(names) else str(i) for i in ids]
        touched.extend(shown)
        return "nodes " + ", ".join(shown)

    text = re.sub(r"nodes (\d+(?:, \d+)*)", repl, str(err))
    text = re.sub(r"carry a load of (-?[0-9.e+-]+) ", r"carry a load of \1 N ", text)
    if asm is not None and touched:
        parts = [p for p in asm.parts if p.ends[0] in touched or p.ends[1] in touched]
        if parts:
            shown = ", ".join(
                f"{p.name!r} ({p.key or 'part'}"
                + (f", {p.behaviour} only" if p.behaviour in ("compression", "tension") else "")
                + ")"
                for p in parts[:6]
            )
            text += f"; parts at those nodes: {shown}"
    return text


def solve_assembly(asm: Assembly) -> AssemblyResult:
    """Solve the assembled state and every load case (each from the assembled state)."""
    from .errors import SolveError

    names = asm.node_names()
    try:
        return _solve_assembly(asm)
    except SolveError as err:
        raise SolveError(_with_names(err, names, asm)) from None


def _fit_preloads(asm: Assembly, base: np.ndarray) -> tuple[Assembly, dict[str, float]]:
    """The assembly with the misfit of every preloaded part set so that it carries its
    preload in the assembled state (Newton on the misfits, the sensitivities from unit
    misfits on the same network; exact in one step while no contact changes)."""
    from dataclasses import replace

    pre = [n for n, p in enumerate(asm.parts) if p.preload is not None]
    if not pre:
        return asm, {}
    target = np.array([asm.parts[n].preload * asm.parts[n].count for n in pre])
    delta = np.zeros(len(pre))
    scale = max(float(np.max(np.abs(target))), 1.0)

    def with_misfits(d: np.ndarray) -> Assembly:
        parts = list(asm.parts)
        for m, n in enumerate(pre):
            parts[n] = replace(parts[n], misfit=float(d[m]))
        return replace(asm, parts=tuple(parts))

    def forces(d: np.ndarray) -> np.ndarray:
        net, _ = build_network(with_misfits(d))
        return np.asarray(net.solve(base).force)[pre]

    for _ in range(30):
        F = forces(delta)
        r = F - target
        if float(np.max(np.abs(r))) <= 1e-10 * scale:
            break
        # a part's force falls with a longer free length (a too-long bolt is slack): the
        # sensitivity from a step of the size that changes the force by about the target
        # (a tensile preload needs a part shorter than its gap: step that way)
        steps = np.array(
            [
                -np.sign(target[m] or 1.0) * scale / asm.parts[n].stiffness / asm.parts[n].count
                for m, n in enumerate(pre)
            ]
        )
        S = np.empty((len(pre), len(pre)))
        for m in range(len(pre)):
            d2 = delta.copy()
            d2[m] += steps[m]
            S[:, m] = (forces(d2) - F) / steps[m]
        try:
            delta = delta - np.linalg.solve(S, r)
        except np.linalg.LinAlgError:
            raise InputError(
                "the preloads cannot all be reached (a preloaded part carries no load in the "
                "assembled state)",
                key=asm.parts[pre[0]].key + ".preload",
            ) from None
    else:
        raise InputError(
            "the preloads cannot all be reached together", key=asm.parts[pre[0]].key + ".preload"
        )
    fitted = with_misfits(delta)
    return fitted, {asm.parts[n].name: float(delta[m]) for m, n in enumerate(pre)}


def _solve_assembly(asm: Assembly) -> AssemblyResult:
    names = asm.node_names()
    index0 = {n: i for i, n in enumerate(names)}
    base = _load_vector(asm.loads, index0, "load")
    asm, fitted = _fit_preloads(asm, base)
    net, index = build_network(asm)
    first = net.solve(base)
    results = [_case_result(ASSEMBLY_CASE, asm, names, first)]
    for c_no, case in enumerate(asm.cases):
        loads = base + _load_vector(case.loads, index, f"case[{c_no + 1}].load")
        extra = None
        if case.temperature_change:
            extra = np.array([p.thermal_elongation(case.temperature_change) for p in asm.parts])
        sol = net.solve(loads, extra_elongation=extra, start=first.displacement)
        share = _load_share(net, asm, index, base, case, first)
        events = _events(net, asm, base, loads - base, extra, first)
        results.append(_case_result(case.name, asm, names, sol, share, events))
    return AssemblyResult(asm, tuple(results), fitted)


def _load_share(
    net, asm: Assembly, index, base, case: LoadCase, first
) -> dict[str, dict[str, float]]:
    """Share of each applied load of ``case`` taken by each part (in all, over its count),
    on top of the assembled state: the load alone, scaled small enough that no contact of
    the assembled state changes (the tangent share), divided by the load."""
    out: dict[str, dict[str, float]] = {}
    F0 = np.asarray(first.force)
    for node, force in case.loads:
        if force == 0:
            continue
        f = base.copy()
        f[index[node]] += force * 1e-6
        sol = net.solve(f, start=first.displacement)
        dF = (np.asarray(sol.force) - F0) / (force * 1e-6)
        out[f"{node}: {force:g} N"] = {p.name: float(dF[n]) for n, p in enumerate(asm.parts)}
    return out


def _events(net, asm: Assembly, base, dload, extra, first, top: float = 8.0) -> tuple:
    """Where a contact part unloads (or closes, or goes slack) as the case grows from zero:
    the factor on the case's loads and temperature change, bracketed on a grid up to ``top``
    times the case and bisected to 1e-12."""
    contact = [n for n, p in enumerate(asm.parts) if p.behaviour in ("compression", "tension")]
    if not contact or (not np.any(dload) and extra is None):
        return ()

    def carrying(lam: float) -> np.ndarray:
        ext = None if extra is None else lam * extra
        sol = net.solve(base + lam * dload, extra_elongation=ext, start=first.displacement)
        return np.asarray(sol.carrying)[contact]

    grid = np.concatenate([np.linspace(0.0, 1.0, 9), np.linspace(1.25, top, 28)])
    states = [carrying(float(x)) for x in grid]
    out = []
    for m, n in enumerate(contact):
        for k in range(len(grid) - 1):
            if states[k][m] != states[k + 1][m]:
                lo, hi = float(grid[k]), float(grid[k + 1])
                was = states[k][m]
                while hi - lo > 1e-12 * max(hi, 1.0):
                    mid = 0.5 * (lo + hi)
                    if carrying(mid)[m] == was:
                        lo = mid
                    else:
                        hi = mid
                p = asm.parts[n]
                if p.behaviour == "tension":
                    what = "goes slack" if was else "takes load"
                elif was:
                    what = "unloads" if p.gap == 0 else "opens"
                else:
                    what = "closes"
                out.append({"part": p.name, "event": what, "at_factor": 0.5 * (lo + hi)})
    return tuple(sorted(out, key=lambda e: e["at_factor"]))


def _case_result(
    name: str,
    asm: Assembly,
    names: tuple[str, ...],
    sol,
    share: dict[str, dict[str, float]] | None = None,
    events: tuple = (),
) -> CaseResult:
    parts = asm.parts
    fixed = set(asm.fixed)
    per = [float(sol.force[n]) / p.count for n, p in enumerate(parts)]
    return CaseResult(
        name=name,
        displacement={n: float(sol.displacement[i]) for i, n in enumerate(names)},
        force={p.name: per[n] for n, p in enumerate(parts)},
        stress={p.name: (per[n] / p.area if p.area else None) for n, p in enumerate(parts)},
        elongation={p.name: float(sol.elongation[n]) for n, p in enumerate(parts)},
        carrying={p.name: bool(sol.carrying[n]) for n, p in enumerate(parts)},
        reactions={n: float(sol.reaction[i]) for i, n in enumerate(names) if n in fixed},
        residual=float(sol.residual),
        counts={p.name: p.count for p in parts},
        load_share=share or {},
        events=events,
    )
