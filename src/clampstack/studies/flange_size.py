"""Sizing of a gasketed flange: thread x grade x tightening method x bolt count.

Candidates keep the flange, gasket and loads of the file and change the bolts:
every thread of the file's series, every grade that covers it, torque or
tensioner tightening, and bolt counts in steps of 4 (the usual flange
practice) from 4 to twice the file's count, as long as the bolt pitch on the
bolt circle leaves at least two bolt diameters (common practice, no source:
room for the wrench) and the bolt holes clear the gasket.  A quick screen
(ASME VIII-1 App. 2 bolt area, a non-empty gasket window that contains the
assembly preload range) runs first; a candidate that passes it is checked with
the full flange analysis (ring model, passes, service), and only designs that
pass every check of ``clampstack flange`` are reported: per grade and method,
the fewest bolts of the smallest size.
"""

from __future__ import annotations

import math
from dataclasses import dataclass, replace
from typing import Any

from ..catalog import Thread, grades, threads
from ..catalog import grade as catalog_grade
from ..catalog import material as catalog_material
from ..catalog.parts import bearing_face_diameter
from ..display import Shown
from ..errors import InputError
from ..flange.analysis import analyse_flange, asme_app2, tightening_basis
from ..flange.model import FlangeSpec, bolt_allowable_stress, check_fit, ring_outer_diameter
from ..joint.geometry import clearance_hole, with_defaults
from ..joint.model import PartMaterial
from .size import REMEDIES, Constraints

FLANGE_METHODS = ("torque", "tension")


def flange_candidate_spec(
    base: FlangeSpec, thread: Thread, grade: str, method: str, count: int
) -> FlangeSpec:
    """The validated flange ``base`` with its bolts replaced by one candidate.

    Kept: the flange, gasket, loads, passes and what the file gave for the bolts'
    material, allowable stresses, length and shank.  Taken anew for the candidate's
    size with the reader's rules: the ISO 273 medium hole, the bearing face and
    height of an ISO 4032 nut (a nut table of the file is not carried over), the
    ring's default outer diameter, the default allowable stress; the torque,
    preload and a custom bolt order are left open.  InputError if it does not fit
    (:func:`~clampstack.flange.model.check_fit`).
    """
    given = base.given
    grd = catalog_grade(grade, thread.d)
    hole, hole_note = clearance_hole(thread, "bolt")
    notes = {"bolt.hole": hole_note}
    if "bolt.material" in given or "bolt.modulus" in given:
        bmat = base.bolt_material
    else:
        m = catalog_material(grd.material_key)
        bmat = PartMaterial(m.key, m)
    ring_out = base.ring_outer_diameter
    if "flange.outer_diameter" not in given:
        ring_out = ring_outer_diameter(base.bolt_circle, hole)
        notes["flange.outer_diameter"] = f"{ring_out * 1e3:.4g} mm"
    Sb = base.allowable_stress
    if "bolt.allowable_stress" not in given:
        Sb, notes["bolt.allowable_stress"] = bolt_allowable_stress(grd, thread)
    Sa = base.allowable_stress_ambient if "bolt.allowable_stress_ambient" in given else Sb
    patterns, passes, tensioning = base.patterns, base.passes, base.tensioning
    if "custom" in patterns:
        n_p = len(base.passes)
        patterns = ("cross",) * (n_p - 1) + ("circular" if n_p >= 3 else "cross",)
    if method == "tension" and base.method != "tension":
        # tensioners on every bolt at once, as the reader's default; the torque passes
        # of the file do not apply
        tensioning = None
        passes, patterns = (0.3, 0.7, 1.0, 1.0), ("cross", "cross", "cross", "circular")
        notes["tightening.tensioning"] = '"all" (a tensioner on every bolt)'
    elif method != "tension":
        tensioning = None
    spec = replace(
        base,
        thread=thread,
        grade=grd,
        bolt_count=count,
        bolt_material=bmat,
        hole=hole,
        bearing_diameter=bearing_face_diameter(thread.head_across_flats),
        nut_height=thread.nut_height,
        nut_material=None,
        unused=tuple(k for k in base.unused if not k.startswith("nut.")),
        ring_outer_diameter=ring_out,
        allowable_stress=Sb,
        allowable_stress_ambient=Sa,
        method=method,
        torque=None,
        preload=None,
        patterns=patterns,
        passes=passes,
        tensioning=tensioning,
        order=None,
        given=frozenset(k for k in given if not k.startswith("nut"))
        - {"bolt.hole", "bolt.bearing_diameter", "tightening.torque", "tightening.preload"},
    )
    check_fit(spec)
    return with_defaults(spec, notes)


#: Grades used for pressure bolting, the default of a flange search: property classes 5.6
#: and 8.8 of EN 1515-1 for PN flanges, and ASTM A193 B7 of ASME B16.5 (from memory).
PRESSURE_GRADES_METRIC = ("5.6", "8.8", "ASTM A193 B7")
PRESSURE_GRADES_UNIFIED = ("ASTM A193 B7",)
PRESSURE_GRADES_SOURCE = (
    "grades used for pressure bolting: EN 1515-1 (5.6, 8.8) and ASME B16.5 (ASTM A193 B7), "
    "from memory; --grades for others"
)


@dataclass(frozen=True)
class FlangeSizeResult(Shown):
    """The result of a flange search: the JSON-ready dict of ``size --json``."""

    data: dict[str, Any]

    def to_dict(self) -> dict[str, Any]:
        return dict(self.data)

    def __getitem__(self, key: str) -> Any:
        return self.data[key]


def size_flange(base: FlangeSpec, constraints: Constraints | None = None) -> dict[str, Any]:
    """Search the catalog for the smallest passing flange bolting of ``base`` (JSON-ready dict).

    By default only grades used for pressure bolting (:data:`PRESSURE_GRADES_METRIC`);
    ``constraints`` hold the search to threads, methods and grades.
    """
    con = constraints or Constraints()
    series = [
        t for t in threads() if t.system == base.thread.system and t.series == base.thread.series
    ]
    series.sort(key=lambda t: t.d)
    series = con.threads_of(series)
    if con.grades is not None:
        names, basis = con.grades, "--grades"
    else:
        metric = base.thread.system == "metric"
        names = PRESSURE_GRADES_METRIC if metric else PRESSURE_GRADES_UNIFIED
        basis = PRESSURE_GRADES_SOURCE
    known = {g.name for g in grades()}
    names = tuple(g for g in names if g in known)
    methods = tuple(m for m in FLANGE_METHODS if con.methods is None or m in con.methods)
    failures: list[dict[str, Any]] = []
    strength = {g: min(x.Rp02 for x in grades() if x.name == g) for g in names}
    counts = [c for c in range(4, 2 * base.bolt_count + 1, 4)]
    designs = []
    screened = checked = 0
    for method in methods:
        for g in sorted(names, key=lambda x: strength[x]):
            for n in counts:
                # the smallest size that passes with n bolts of this grade and method
                for thr in series:
                    if math.pi * base.bolt_circle / n < 2 * thr.d:
                        break  # no room for the wrench between bolts
                    try:
                        spec = flange_candidate_spec(base, thr, g, method, n)
                    except InputError:
                        continue
                    screened += 1
                    if not _screen(spec):
                        continue
                    checked += 1
                    r = analyse_flange(spec, compensate=False)
                    if not r.ok:
                        bad = sorted((c for c in r.checks if not c.passed), key=lambda c: c.margin)
                        if bad:
                            failures.append(
                                {
                                    "thread": thr.designation,
                                    "grade": spec.grade.name,
                                    "method": method,
                                    "bolt_count": n,
                                    "failing": [
                                        {
                                            "check": c.name,
                                            "margin": c.margin,
                                            "remedy": REMEDIES.get(
                                                c.name, "more bolts or the next size"
                                            ),
                                        }
                                        for c in bad
                                    ],
                                    "_worst": bad[0].margin,
                                }
                            )
                        continue
                    gov = min(
                        (c for c in r.checks if c.name != "assembly_preload"),
                        key=lambda c: c.margin,
                    )
                    designs.append(
                        {
                            "thread": thr.designation,
                            "grade": spec.grade.name,
                            "method": method,
                            "bolt_count": n,
                            "torque_Nm": None if r.torque is None else r.torque[0],
                            "preload_N": r.target,
                            "governing_check": gov.name,
                            "margin": gov.margin,
                            "_key": (thr.d, n, spec.grade.Rp02),  # at this diameter,
                        }
                    )
                    break
    # keep the designs no other design beats in size, count and grade at once
    keep = []
    for d in designs:
        a = d["_key"]
        dominated = any(
            o is not d
            and o["method"] == d["method"]
            and o["_key"][0] <= a[0]
            and o["_key"][1] <= a[1]
            and o["_key"][2] <= a[2]
            and o["_key"] != a
            for o in designs
        )
        if not dominated:
            keep.append(d)
    keep.sort(key=lambda d: (d["_key"][1], d["_key"][0], d["_key"][2]))  # fewest bolts first
    for d in keep:
        d.pop("_key")
    nearest = []
    if not keep:
        for f in sorted(failures, key=lambda f: -f["_worst"])[:3]:
            nearest.append({k: v for k, v in f.items() if not k.startswith("_")})
    return {
        "title": base.title,
        "designs": keep,
        "screened": screened,
        "checked": checked,
        "nearest": nearest,
        "grades": list(names),
        "grades_basis": basis,
        "methods": list(methods),
    }


def _screen(spec) -> bool:
    """Cheap necessary conditions: App. 2 bolt area, a gasket window that seating leaves
    within the crush and rotation limits, and (method torque) a smallest assembly preload
    that seats the gasket."""
    a = asme_app2(spec)
    if a.Ab < a.Am:
        return False
    seat = a.Wm2 / spec.bolt_count
    tb = tightening_basis(spec)
    if not seat <= min(tb.crush, tb.F_rot):
        return False  # no preload seats the gasket within its crush and rotation limits
    # with a torque, the smallest assembly preload bounds every bolt after the passes (the
    # last pass leaves each at most at its target): it must seat the gasket
    return tb.torque_range is None or tb.torque_range[1] >= seat
