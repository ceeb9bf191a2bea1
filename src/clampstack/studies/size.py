"""Automatic sizing: the smallest thread, grade and tightening method that pass every check.

Every candidate (thread of the file's series x grade that covers the size x
tightening method) is the validated joint with its bolt replaced
(:func:`candidate_spec`, by ``dataclasses.replace``, never from the file): the bolt
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

import math
from dataclasses import dataclass, replace
from typing import Any

import numpy as np

from ..catalog import Thread, grades, threads
from ..catalog import grade as catalog_grade
from ..catalog import material as catalog_material
from ..catalog.parts import washer_size
from ..display import Shown
from ..errors import InputError
from ..joint import geometry
from ..joint.cases import case_spec
from ..joint.eccentric import substitute_inertia
from ..joint.model import JointSpec, LayerSpec, PartMaterial
from ..joint.prepare import prepare
from ..joint.thermal import TemperatureModel
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
class Constraints:
    """What ``size`` may choose from (None: everything it knows).

    ``threads``: designations allowed (``--thread``); ``diameters``: the nominal diameter
    range [m] (``--threads M6..M12``); ``methods`` and ``grades``: the tightening methods
    and property classes or grades allowed.
    """

    threads: tuple[str, ...] | None = None
    diameters: tuple[float, float] | None = None
    methods: tuple[str, ...] | None = None
    grades: tuple[str, ...] | None = None

    def threads_of(self, candidates: list[Thread]) -> list[Thread]:
        out = candidates
        if self.threads is not None:
            out = [t for t in out if t.designation in self.threads]
        if self.diameters is not None:
            lo, hi = self.diameters
            out = [t for t in out if lo - 1e-12 <= t.d <= hi + 1e-12]
        return out


#: What would make a failing candidate pass, by its failing check (common practice, no
#: source: the usual design changes for each rule of VDI 2230-1).
REMEDIES = {
    "surface_pressure_head": "a washer (or a larger, hardened one) under the head",
    "surface_pressure_nut": "a washer (or a larger, hardened one) under the nut",
    "thread_stripping": "more thread engagement",
    "working_stress": "the next size or a stronger grade",
    "fatigue": "the next size, a waisted shank, or threads rolled after heat treatment",
    "assembly_preload": "the next size or a stronger grade",
    "residual_clamp_load": "more preload: the next size, a stronger grade or a tighter method",
    "separation": "more preload: the next size, a stronger grade or a tighter method",
    "opening": "more preload, or the bolt nearer the load",
    "slip": "more preload, or a rougher interface (slip coefficient)",
    "plastic_collapse": "the next size or a stronger grade",
    "cycle_yield": "the next size, a stronger grade, or washers under the bearing faces",
}


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
    engagement: float | None = None  # tapped hole: the engagement the design was checked with

    def to_dict(self) -> dict[str, Any]:
        return {
            "thread": self.thread,
            "grade": self.grade,
            "method": self.method,
            "bolt_length_mm": self.length * 1e3,
            "engagement_mm": None if self.engagement is None else self.engagement * 1e3,
            "torque_Nm": None if self.torque is None else self.torque[0],
            "torque_min_Nm": None if self.torque is None else self.torque[1],
            "torque_max_Nm": None if self.torque is None else self.torque[2],
            "preload_min_N": self.preload[0],
            "preload_max_N": self.preload[1],
            "governing_check": self.governing,
            "margin": self.margin,
        }


@dataclass(frozen=True)
class SizeResult(Shown):
    title: str
    designs: tuple[Design, ...]
    candidates: int
    evaluated: int
    cases: tuple[str, ...] = ()  # [[case]]: every design passes in each of them
    #: when nothing passes: the candidates closest to passing, each with its failing checks
    #: and what would make it pass
    nearest: tuple[dict[str, Any], ...] = ()
    constraints: dict[str, Any] | None = None  # what the search was held to (None: nothing)

    def to_dict(self) -> dict[str, Any]:
        out = {
            "title": self.title,
            "designs": [d.to_dict() for d in self.designs],
            "candidates": self.candidates,
            "evaluated": self.evaluated,
            "nearest": list(self.nearest),
            "constraints": self.constraints,
        }
        if self.cases:
            out["cases"] = list(self.cases)
        return out


def candidate_threads(base: Thread) -> list[Thread]:
    """Threads of the same system and series as ``base``, smallest first."""
    out = [t for t in threads() if t.system == base.system and t.series == base.series]
    return sorted(out, key=lambda t: (t.d, -t.P))


def _layer(layer: LayerSpec, thr: Thread, first_hole: float, given: frozenset[str]) -> LayerSpec:
    """A layer of the base joint on the candidate bolt: size defaults taken anew."""
    key = layer.key
    if layer.kind == "washer":
        h_w, od_w = washer_size(thr.d)
        return replace(
            layer,
            thickness=layer.thickness if f"{key}.thickness" in given else h_w,
            outer_diameter=layer.outer_diameter if f"{key}.outer_diameter" in given else od_w,
            hole=layer.hole if f"{key}.inner_diameter" in given else first_hole,
        )
    if f"{key}.hole" in given:
        return layer
    return replace(layer, hole=geometry.clearance_hole(thr, key)[0])


def candidate_spec(base: JointSpec, thr: Thread, grade: str, method: str) -> JointSpec:
    """The validated joint ``base`` with its bolt replaced by one candidate (see module doc).

    What the file gave is kept; what followed from the bolt's size (bearing face,
    plain shank, nut height, clearance holes and washers not given) is taken anew
    for the candidate with the rules of the input reader (:mod:`clampstack.joint.geometry`),
    the torque or preload is left open, and the candidate is checked to fit
    (:func:`~clampstack.joint.geometry.check_fit`); InputError if it does not.
    """
    given = base.given
    grd = catalog_grade(grade, thr.d)
    b = base.bolt
    notes: dict[str, str] = {}
    if "bolt.material" in given or "bolt.modulus" in given:
        bolt_mat = b.material
    else:
        bolt_mat = PartMaterial(
            f"{grd.material_key} (grade {grd.name})", catalog_material(grd.material_key)
        )
        notes["bolt.material"] = f"{grd.material_key} (from grade {grd.name})"
    clamped = [x for x in base.layers if x.kind != "washer"]
    first_hole = clamped[0].hole if "clamped[1].hole" in given else None
    if first_hole is None:
        first_hole = geometry.clearance_hole(thr, "clamped[1]")[0]
    layers = tuple(_layer(x, thr, first_hole, given) for x in base.layers)
    lK0 = base.clamp_length  # the bolt length follows the base joint's clamp length
    nut, tapped = base.nut, base.tapped_hole
    if tapped is not None:
        engagement = tapped.engagement / b.thread.d * thr.d
        tapped = replace(tapped, engagement=engagement)
        length = lK0 + engagement
    else:
        assert nut is not None
        own_mat = "nut.material" in given or "nut.modulus" in given
        mat = nut.material if own_mat else bolt_mat
        nut = replace(
            nut,
            height=thr.nut_height,
            bearing_diameter=nut.bearing_diameter
            if "nut.bearing_diameter" in given
            else geometry.nut_bearing_diameter(thr),
            material=mat,
            Rm=nut.Rm if "nut.strength" in given else grd.Rm,
            shear_ratio=mat.material.shear_ratio if mat.material else 0.6,
            across_flats=thr.head_across_flats,
        )
        notes["nut.height"] = f"{thr.nut_height * 1e3:g} mm (ISO 4032)"
        length = lK0 + thr.nut_height + 2 * thr.P
    length = math.ceil(length * 1e3 - 1e-9) * 1e-3  # a whole number of mm
    dW, notes["bolt.bearing_diameter"] = geometry.head_bearing_diameter(thr, b.head)
    shank, notes["bolt.shank_length"] = geometry.plain_shank(thr, length, b.head)
    lK = sum(x.thickness for x in layers)
    bolt = replace(
        b,
        thread=thr,
        grade=grd,
        length=length,
        shank_length=geometry.shank_in_clamp(shank, lK),
        shank_diameter=None,
        bearing_diameter=dW,
        material=bolt_mat,
    )
    tightening = replace(base.tightening, method=method, torque=None, preload=None)
    ecc = base.eccentric
    if ecc is not None:
        # the deformation body follows the candidate's bearing face; its hole must fit
        itf = ecc.interface
        hole = max(x.hole for x in layers)
        if itf.shape != "given" and abs(ecc.bolt_offset) + 0.5 * hole >= itf.half:
            raise InputError("the hole reaches the interface's edge", key="eccentricity")
        if "eccentricity.bending_inertia" not in given:
            ods = [x.outer_diameter for x in layers if x.outer_diameter and x.kind == "plate"]
            I_Bers, basis = substitute_inertia(
                dW, lK, min(ods) if ods else None, tapped is not None, itf
            )
            ecc = replace(ecc, bending_inertia=I_Bers, bending_inertia_basis=basis)
            notes["eccentricity.bending_inertia"] = f"{I_Bers * 1e12:.4g} mm^4 ({basis})"
    dropped = {
        "bolt.shank_length",
        "bolt.shank_diameter",
        "bolt.bearing_diameter",
        "nut.height",
        "nut.width_across_flats",
    }
    keys = (given - dropped) | {"bolt.thread", "bolt.grade", "bolt.length", "tightening.method"}
    spec = replace(
        base,
        bolt=bolt,
        nut=nut,
        tapped_hole=tapped,
        layers=layers,
        tightening=tightening,
        given=keys | ({"tapped_hole.engagement"} if tapped is not None else set()),
        eccentric=ecc,
    )
    geometry.check_fit(spec, spec.given)
    return geometry.with_defaults(spec, notes)


def size(
    base: JointSpec, progress: Any = None, constraints: Constraints | None = None
) -> SizeResult:
    """Search threads x grades x methods for the Pareto-smallest passing designs of ``base``."""
    e = base.eccentric
    if e is not None:
        e.refuse_outside_core("size")
    con = constraints or Constraints()
    sizes = con.threads_of(candidate_threads(base.bolt.thread))
    grade_names = METRIC_GRADES if base.bolt.thread.system == "metric" else UNIFIED_GRADES
    known = {g.name for g in grades()}
    if con.grades is not None:
        grade_names = con.grades
    grade_names = tuple(g for g in grade_names if g in known)
    methods = tuple(m for m in METHODS if con.methods is None or m in con.methods)
    if not sizes:
        raise InputError(
            f"no thread of the {base.bolt.thread.system} {base.bolt.thread.series} series is "
            "within the constraint",
            key="--threads" if con.diameters is not None else "--thread",
        )
    failures: list[dict[str, Any]] = []
    skipped = {name for name, _ in base.skips}
    T = np.array([base.service.temperature])
    strength = {}
    for g in grade_names:
        rows = [x for x in grades() if x.name == g]
        strength[g] = min(x.Rp02 for x in rows)
    order = sorted(grade_names, key=lambda g: strength[g])
    memo: dict[tuple[int, str, str], Design | None] = {}
    FA_hi = max(base.service.axial_load[1], 0.0)
    slip_need = (
        base.service.shear_load * base.requirements.slip_safety / base.requirements.slip_friction
    )
    # (1 - Phi_n) F_A with Phi_n <= n; an eccentric joint's Phi_en* may exceed n: no load term
    load_share = 0.0 if e is not None else (1 - base.service.load_height) * FA_hi
    need_floor = max(base.requirements.residual_clamp_load, slip_need, load_share)
    evaluated = 0

    models: dict[tuple[int, str, str], TemperatureModel] = {}
    sized: dict[tuple[int, str], JointSpec | InputError] = {}

    def variant(i: int, g: str, method: str) -> JointSpec:
        """The candidate: built once per size and grade, the method swapped in (all that
        candidate_spec does with the method)."""
        if (i, g) not in sized:
            try:
                sized[(i, g)] = candidate_spec(base, sizes[i], g, "torque")
            except InputError as err:
                sized[(i, g)] = err
        spec = sized[(i, g)]
        if isinstance(spec, InputError):
            raise spec
        return replace(spec, tightening=replace(spec.tightening, method=method))

    def cell(i: int, g: str, method: str) -> Design | None:
        """The design at (size i, grade, method) if it passes, else None (memoised)."""
        nonlocal evaluated
        key = (i, g, method)
        if key in memo:
            return memo[key]
        if progress is not None:
            progress(min(len(memo) + 1, 2000))
        # a necessary condition, cheap: even tightened to 1.2 R_p0.2 on A_s (the most any
        # method reaches) the bolt must hold the clamp load needed against separation and
        # the required residual clamp load (Phi_n <= n); a size below it cannot pass
        try:
            Rp_g = catalog_grade(g, sizes[i].d).Rp02
        except InputError:
            return None
        # (sound because any bolt load above 1.2 R_p0.2 A_s fails the working-stress check,
        # so the screen is off when that check is switched off)
        if "working_stress" not in skipped and 1.2 * Rp_g * sizes[i].As < need_floor:
            return None
        memo[key] = None
        thr = sizes[i]
        try:
            spec = variant(i, g, method)
            # the springs depend on the size and the materials, not on grade or method
            mkey = (i, spec.bolt.material.name, spec.nut.material.name if spec.nut else "")
            if mkey not in models:
                # the plates' terms depend on the size only: share them between materials
                same = next((m for k2, m in models.items() if k2[0] == i), None)
                models[mkey] = TemperatureModel(spec, same.clamp_terms if same else None)
            prep = prepare(spec, models[mkey])
            if base.cases:  # every load case must pass: the smallest margin of each check
                m = {}
                for case in base.cases:
                    cs = case_spec(spec, case)
                    cp = prepare(cs)  # its own temperatures: no terms shared
                    Tc = np.array([cs.service.temperature])
                    for k, v in _evaluate(cp, Tc)["margins"].items():
                        m[k] = np.minimum(m[k], v) if k in m else v
            else:
                m = _evaluate(prep, T)["margins"]
        except InputError:
            return None  # does not fit (grade size range, holes, length, data range)
        evaluated += 1
        active = {c: float(v[0]) for c, v in m.items() if c not in skipped}
        failing = {c: v for c, v in active.items() if v < -1e-9}
        if failing:
            failures.append(
                {
                    "thread": thr.designation,
                    "grade": spec.bolt.grade.name,
                    "method": method,
                    "failing": [
                        {"check": c, "margin": v, "remedy": REMEDIES.get(c, "")}
                        for c, v in sorted(failing.items(), key=lambda kv: kv[1])
                    ],
                    "_worst": min(failing.values()),
                    "_d": thr.d,
                }
            )
        if all(v >= -1e-9 for v in active.values()):
            # assembly_preload sits at its limit by construction (the candidate is
            # tightened to its permissible preload): not reported as governing
            pick = {c: v for c, v in active.items() if c != "assembly_preload"} or active
            gov = min(pick, key=pick.get)
            memo[key] = Design(
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
                spec.tapped_hole.engagement if spec.tapped_hole else None,
            )
        return memo[key]

    designs = []
    for method in methods:
        for g in order:
            # the smallest size of this grade and method that passes (ascending scan)
            first = next((i for i in range(len(sizes)) if cell(i, g, method)), None)
            if first is None:
                continue
            des = memo[(first, g, method)]
            weaker = [w for w in order if strength[w] < des.yield_strength]
            if not any(cell(first, w, method) for w in weaker):
                designs.append(des)
    n_s, n_g, n_m = len(sizes), len(grade_names), len(methods)
    designs.sort(key=lambda x: (x.d, x.yield_strength, METHODS.index(x.method)))
    nearest: list[dict[str, Any]] = []
    if not designs:
        # the three closest to passing (largest worst margin), each with what would help
        for f in sorted(failures, key=lambda f: (-f["_worst"], f["_d"]))[:3]:
            nearest.append({k: v for k, v in f.items() if not k.startswith("_")})
    held = {
        "threads": None if con.threads is None else list(con.threads),
        "diameter_range_mm": None
        if con.diameters is None
        else [con.diameters[0] * 1e3, con.diameters[1] * 1e3],
        "methods": list(methods),
        "grades": list(grade_names),
    }
    return SizeResult(
        base.title,
        tuple(designs),
        n_s * n_g * n_m,
        evaluated,
        tuple(c.name for c in base.cases),
        tuple(nearest),
        held,
    )
