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

import copy
import math
from typing import Any

from ..catalog import grades, threads
from ..errors import InputError
from ..flange.analysis import analyse_flange, asme_app2
from ..inputs.flange import flange_from_data
from .size import METRIC_GRADES, UNIFIED_GRADES

FLANGE_METHODS = ("torque", "tension")


def flange_candidate_data(
    data: dict[str, Any], thread: str, grade: str, method: str, count: int
) -> dict[str, Any]:
    """The flange file's data with the bolts replaced by one candidate."""
    d = copy.deepcopy(data)
    b = d.setdefault("bolt", {})
    for k in ("hole", "bearing_diameter"):
        b.pop(k, None)
    b["thread"] = thread
    b["grade"] = grade
    d["flange"] = dict(d["flange"])
    d["flange"]["bolt_count"] = count
    tr = dict(d.get("tightening") or {})
    for k in ("torque", "preload", "order"):
        tr.pop(k, None)
    if tr.get("pattern") == "custom" or (
        isinstance(tr.get("pattern"), list) and "custom" in tr["pattern"]
    ):
        tr.pop("pattern")
    tr["method"] = method
    d["tightening"] = tr
    d.pop("nut", None)
    return d


def size_flange(data: dict[str, Any]) -> dict[str, Any]:
    """Search the catalog for the smallest passing flange bolting (JSON-ready dict)."""
    base = flange_from_data(data)
    series = [
        t for t in threads() if t.system == base.thread.system and t.series == base.thread.series
    ]
    series.sort(key=lambda t: t.d)
    names = METRIC_GRADES if base.thread.system == "metric" else UNIFIED_GRADES
    known = {g.name for g in grades()}
    names = tuple(g for g in names if g in known)
    strength = {g: min(x.Rp02 for x in grades() if x.name == g) for g in names}
    counts = [c for c in range(4, 2 * base.bolt_count + 1, 4)]
    designs = []
    screened = checked = 0
    for method in FLANGE_METHODS:
        for g in sorted(names, key=lambda x: strength[x]):
            for n in counts:
                # the smallest size that passes with n bolts of this grade and method
                for thr in series:
                    if math.pi * base.bolt_circle / n < 2 * thr.d:
                        break  # no room for the wrench between bolts
                    try:
                        spec = flange_from_data(
                            flange_candidate_data(data, thr.designation, g, method, n)
                        )
                    except InputError:
                        continue
                    screened += 1
                    if not _screen(spec):
                        continue
                    checked += 1
                    r = analyse_flange(spec, compensate=False)
                    if not r.ok:
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
                            "_key": (thr.d, n, strength[g]),
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
    return {"title": base.title, "designs": keep, "screened": screened, "checked": checked}


def _screen(spec) -> bool:
    """Cheap necessary conditions: App. 2 bolt area and a usable gasket window."""
    a = asme_app2(spec)
    if a.Ab < a.Am:
        return False
    n = spec.bolt_count
    return a.Wm2 / n <= spec.gasket.max_stress * spec.gasket.area / n
