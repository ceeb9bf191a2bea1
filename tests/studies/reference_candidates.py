"""The reference route to a sizing candidate: the input file with its bolts replaced, read again.

This is how sizing built its candidates before it varied validated specifications;
the tests keep it as an independent route (the whole reader, from TOML) to check
:func:`clampstack.studies.size.candidate_spec` and
:func:`clampstack.studies.flange_size.flange_candidate_spec` against.
"""

from __future__ import annotations

import copy
import math
from typing import Any

from clampstack.catalog import Thread


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
    if method == "tension":  # tensioners on every bolt at once: no torque passes
        for k in ("passes", "pattern", "order", "sequence"):
            tr.pop(k, None)
    else:
        tr.pop("tensioning", None)
    d["tightening"] = tr
    return d


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
    if method == "tension":  # tensioners on every bolt at once: no torque passes
        for k in ("passes", "pattern", "order", "sequence"):
            tr.pop(k, None)
    else:
        tr.pop("tensioning", None)
    d["tightening"] = tr
    d.pop("nut", None)
    return d
