"""Automatic sizing: the smallest thread, grade and tightening method that pass every check.

Every candidate (thread of the file's series x grade that covers the size x
tightening method) is built from the input file with the bolt replaced: the bolt
length follows the clamp length (plus nut height and two pitches of protrusion,
or plus the engagement scaled with the diameter for a tapped hole), size-specific
defaults (head bearing face, nut height, clearance holes not given in the file)
are taken for the candidate's size, and the torque or preload is left open so
that the candidate is tightened to its permissible preload (VDI 2230-1 R13).
Each candidate is checked with the same rules as ``clampstack check`` (the
vectorised check chain of :mod:`clampstack.studies.sweep` at the service
temperature).  Reported are the Pareto-smallest designs: those that pass while
the next smaller size with the same grade and method, and the next weaker grade
of the same size and method, both fail.
"""

from __future__ import annotations

import copy
import math
from dataclasses import dataclass
from typing import Any

import numpy as np

from ..catalog import Thread, grades, threads
from ..errors import InputError
from ..io.joint_input import joint_from_data
from ..joint.analysis import prepare
from .sweep import _evaluate

METHODS = ("torque", "yield", "tension")
METRIC_GRADES = (
    "4.6",
    "4.8",
    "5.6",
    "5.8",
    "6.8",
    "8.8",
    "9.8",
    "10.9",
    "12.9",
    "A2-70",
    "A4-70",
    "A2-80",
    "A4-80",
)
UNIFIED_GRADES = ("SAE J429 5", "SAE J429 8", "ASTM A193 B7")


@dataclass(frozen=True)
class Design:
    """One passing design."""

    thread: str
    grade: str
    method: str
    d: float
    yield_strength: float
    length: float
    torque: tuple[float, float, float] | None
    preload: tuple[float, float]
    governing: str
    margin: float

    def to_dict(self) -> dict[str, Any]:
        return {
            "thread": self.thread,
            "grade": self.grade,
            "method": self.method,
            "bolt_length_mm": self.length * 1e3,
            "torque_Nm": None if self.torque is None else self.torque[0],
            "torque_min_Nm": None if self.torque is None else self.torque[1],
            "torque_max_Nm": None if self.torque is None else self.torque[2],
            "preload_min_N": self.preload[0],
            "preload_max_N": self.preload[1],
            "governing_check": self.governing,
            "margin": self.margin,
        }


@dataclass(frozen=True)
class SizeResult:
    title: str
    designs: tuple[Design, ...]
    candidates: int
    evaluated: int

    def to_dict(self) -> dict[str, Any]:
        return {
            "title": self.title,
            "designs": [d.to_dict() for d in self.designs],
            "candidates": self.candidates,
            "evaluated": self.evaluated,
        }


def candidate_threads(base: Thread) -> list[Thread]:
    """Threads of the same system and series as ``base``, smallest first."""
    out = [t for t in threads() if t.system == base.system and t.series == base.series]
    return sorted(out, key=lambda t: (t.d, -t.P))


def candidate_data(
    data: dict[str, Any], base_spec, thread: Thread, grade: str, method: str
) -> dict[str, Any]:
    """The input file's data with the bolt replaced by one candidate (see module doc)."""
    d = copy.deepcopy(data)
    bolt = d.setdefault("bolt", {})
    for k in ("shank_length", "shank_diameter", "bearing_diameter"):
        bolt.pop(k, None)
    bolt["thread"] = thread.designation
    bolt["grade"] = grade
    lK = base_spec.clamp_length
    if base_spec.tapped_hole is not None:
        ratio = base_spec.tapped_hole.engagement / base_spec.bolt.thread.d
        engagement = ratio * thread.d
        d["tapped_hole"] = dict(d.get("tapped_hole") or {})
        d["tapped_hole"]["engagement"] = f"{engagement * 1e3:.6g} mm"
        length = lK + engagement
    else:
        d["nut"] = {k: v for k, v in (d.get("nut") or {}).items() if k != "height"}
        length = lK + thread.nut_height + 2 * thread.P
    bolt["length"] = f"{math.ceil(length * 1e3 - 1e-9):d} mm"
    tr = dict(d.get("tightening") or {})
    tr.pop("torque", None)
    tr.pop("preload", None)
    tr["method"] = method
    d["tightening"] = tr
    return d


def size(data: dict[str, Any]) -> SizeResult:
    """Search threads x grades x methods for the Pareto-smallest passing designs."""
    base = joint_from_data(data)
    sizes = candidate_threads(base.bolt.thread)
    grade_names = METRIC_GRADES if base.bolt.thread.system == "metric" else UNIFIED_GRADES
    known = {g.name for g in grades()}
    grade_names = tuple(g for g in grade_names if g in known)
    skipped = {name for name, _ in base.skips}
    T = np.array([base.service.temperature])
    n_s, n_g, n_m = len(sizes), len(grade_names), len(METHODS)
    ok = np.zeros((n_s, n_g, n_m), dtype=bool)
    info: dict[tuple[int, int, int], Design] = {}
    evaluated = 0
    for i, thr in enumerate(sizes):
        for j, g in enumerate(grade_names):
            for k, method in enumerate(METHODS):
                try:
                    spec = joint_from_data(candidate_data(data, base, thr, g, method))
                    prep = prepare(spec)
                    m = _evaluate(prep, T)["margins"]
                except InputError:
                    continue  # does not fit (grade size range, holes, length, data range)
                evaluated += 1
                active = {c: float(v[0]) for c, v in m.items() if c not in skipped}
                if all(v >= -1e-9 for v in active.values()):
                    ok[i, j, k] = True
                    # assembly_preload sits at its limit by construction (the candidate is
                    # tightened to its permissible preload): not reported as governing
                    pick = {c: v for c, v in active.items() if c != "assembly_preload"} or active
                    gov = min(pick, key=pick.get)
                    info[(i, j, k)] = Design(
                        thr.designation,
                        spec.bolt.grade.name,
                        method,
                        thr.d,
                        spec.bolt.grade.Rp02,
                        spec.bolt.length,
                        prep.torque,
                        (prep.assembly_min, prep.assembly_max),
                        gov,
                        pick[gov],
                    )
    designs = []
    for (i, j, k), des in info.items():
        smaller = i > 0 and ok[i - 1, j, k]
        weaker = any(
            ok[i, jj, k] and info[(i, jj, k)].yield_strength < des.yield_strength
            for jj in range(n_g)
            if (i, jj, k) in info
        )
        if not smaller and not weaker:
            designs.append(des)
    designs.sort(key=lambda x: (x.d, x.yield_strength, METHODS.index(x.method)))
    return SizeResult(base.title, tuple(designs), n_s * n_g * n_m, evaluated)
