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
    """The solved state of one load case (SI floats, keyed by names)."""

    name: str
    displacement: dict[str, float]
    force: dict[str, float]
    stress: dict[str, float | None]
    elongation: dict[str, float]
    carrying: dict[str, bool]
    reactions: dict[str, float]
    residual: float

    def to_dict(self) -> dict[str, Any]:
        """JSON form per DESIGN.md (``solve --json``)."""
        return {
            "name": self.name,
            "nodes": {n: {"displacement_mm": v * 1e3} for n, v in self.displacement.items()},
            "parts": {
                p: {
                    "force_N": self.force[p],
                    "stress_MPa": None if self.stress[p] is None else self.stress[p] * 1e-6,
                    "elongation_mm": self.elongation[p] * 1e3,
                    "carrying": self.carrying[p],
                }
                for p in self.force
            },
            "reactions": {n: {"force_N": v} for n, v in self.reactions.items()},
            "equilibrium_residual_N": self.residual,
        }


@dataclass(frozen=True)
class AssemblyResult(Shown):
    """All solved cases of an assembly; the first is the assembled state."""

    assembly: Assembly
    cases: tuple[CaseResult, ...]

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
    k = np.array([p.stiffness for p in parts], dtype=float)
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


def _solve_assembly(asm: Assembly) -> AssemblyResult:
    net, index = build_network(asm)
    names = asm.node_names()
    base = _load_vector(asm.loads, index, "load")
    first = net.solve(base)
    results = [_case_result(ASSEMBLY_CASE, asm, names, first)]
    for c_no, case in enumerate(asm.cases):
        loads = base + _load_vector(case.loads, index, f"case[{c_no + 1}].load")
        extra = None
        if case.temperature_change:
            extra = np.array([p.thermal_elongation(case.temperature_change) for p in asm.parts])
        sol = net.solve(loads, extra_elongation=extra, start=first.displacement)
        results.append(_case_result(case.name, asm, names, sol))
    return AssemblyResult(asm, tuple(results))


def _case_result(name: str, asm: Assembly, names: tuple[str, ...], sol) -> CaseResult:
    parts = asm.parts
    fixed = set(asm.fixed)
    return CaseResult(
        name=name,
        displacement={n: float(sol.displacement[i]) for i, n in enumerate(names)},
        force={p.name: float(sol.force[n]) for n, p in enumerate(parts)},
        stress={
            p.name: (float(sol.force[n]) / p.area if p.area else None) for n, p in enumerate(parts)
        },
        elongation={p.name: float(sol.elongation[n]) for n, p in enumerate(parts)},
        carrying={p.name: bool(sol.carrying[n]) for n, p in enumerate(parts)},
        reactions={n: float(sol.reaction[i]) for i, n in enumerate(names) if n in fixed},
        residual=float(sol.residual),
    )
