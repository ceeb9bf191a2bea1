"""Readable rendering of a sizing study."""

from __future__ import annotations

from ..studies.size import SizeResult
from .text import CAUTION, UNIT_SYSTEMS, table

MAX_ROWS = 20


def size_text(r: SizeResult, units: str = "si") -> str:
    """Ranked table of the smallest passing designs with their torque specification."""
    u = UNIT_SYSTEMS[units]
    F, T, L = u.label("force"), u.label("torque"), u.label("length")
    out = [
        r.title,
        f"{r.candidates} candidates (thread x grade x method), {r.evaluated} fit and were checked",
    ]
    if r.cases:
        out.append(f"every design checked in each load case: {', '.join(r.cases)}")
    out += [
        "",
    ]
    if r.constraints and (r.constraints.get("threads") or r.constraints.get("diameter_range_mm")):
        c = r.constraints
        held = []
        if c.get("threads"):
            held.append(f"threads {', '.join(c['threads'])}")
        if c.get("diameter_range_mm"):
            lo, hi = c["diameter_range_mm"]
            held.append(f"diameters {lo:g}..{hi:g} mm")
        out.append(f"held to: {'; '.join(held)}")
    if r.constraints:
        out.append(
            f"methods {', '.join(r.constraints['methods'])}; grades "
            f"{', '.join(r.constraints['grades'])}"
        )
        out.append("")
    if not r.designs:
        out.append("RESULT: no candidate passes every check")
        if r.nearest:
            out.append("")
            out.append("The nearest candidates, and what would make them pass:")
            for n in r.nearest:
                fails = "; ".join(
                    f"{f['check']} ({f['margin'] * 100:+.1f} %): {f['remedy']}"
                    for f in n["failing"]
                )
                out.append(f"  {n['thread']} {n['grade']} {n['method']}: {fails}")
    else:
        out.append(
            f"RESULT: {len(r.designs)} smallest passing designs (each: the next smaller "
            "size and the next weaker grade fail)"
        )
        rows = []
        for d in r.designs[:MAX_ROWS]:
            torque = (
                "-"
                if d.torque is None
                else (
                    f"{u.fmt('torque', d.torque[0])} ({u.fmt('torque', d.torque[1])}.."
                    f"{u.fmt('torque', d.torque[2])})"
                )
            )
            rows.append(
                [
                    d.thread,
                    d.grade,
                    d.method,
                    u.fmt("length", d.length),
                    "-" if d.engagement is None else u.fmt("length", d.engagement),
                    torque,
                    f"{u.fmt('force', d.preload[0])}..{u.fmt('force', d.preload[1])}",
                    d.governing,
                    f"{d.margin * 100:+.1f} %",
                ]
            )
        out.append("")
        out.append(
            table(
                [
                    "thread",
                    "grade",
                    "method",
                    f"length [{L}]",
                    f"engagement [{L}]",
                    f"torque [{T}]",
                    f"preload [{F}]",
                    "governing check",
                    "margin",
                ],
                rows,
                right=[False, False, False, True, True, True, True, False, True],
            )
        )
        if len(r.designs) > MAX_ROWS:
            out.append(f"  ({MAX_ROWS} of {len(r.designs)} shown; --json for all)")
    out.append("")
    out.append(
        "Each design is tightened to its permissible preload (bolt length and, for a tapped "
        "hole, engagement as listed: the engagement scales with the diameter); run "
        "`clampstack check` on the chosen design to see every check."
    )
    out.append(CAUTION)
    return "\n".join(out)


def flange_size_text(r: dict, units: str = "si") -> str:
    """Ranked table of the smallest passing flange boltings."""
    u = UNIT_SYSTEMS[units]
    F, T = u.label("force"), u.label("torque")
    out = [
        r["title"],
        f"{r['screened']} candidates fit, {r['checked']} passed the quick screen "
        "and were analysed in full",
        "",
    ]
    out.insert(
        2,
        f"grades {', '.join(r['grades'])} ({r['grades_basis']}); methods {', '.join(r['methods'])}",
    )
    if not r["designs"]:
        out.append("RESULT: no candidate passes every check")
        if r.get("nearest"):
            out.append("")
            out.append("The nearest candidates, and what would make them pass:")
            for n in r["nearest"]:
                fails = "; ".join(
                    f"{f['check']} ({f['margin'] * 100:+.1f} %): {f['remedy']}"
                    for f in n["failing"]
                )
                out.append(
                    f"  {n['bolt_count']} x {n['thread']} {n['grade']} {n['method']}: {fails}"
                )
    else:
        out.append(f"RESULT: {len(r['designs'])} passing boltings (fewest bolts first)")
        rows = [
            [
                str(d["bolt_count"]),
                d["thread"],
                d["grade"],
                d["method"],
                "-" if d["torque_Nm"] is None else u.fmt("torque", d["torque_Nm"]),
                u.fmt("force", d["preload_N"]),
                d["governing_check"],
                f"{d['margin'] * 100:+.1f} %",
            ]
            for d in r["designs"][:MAX_ROWS]
        ]
        out.append("")
        out.append(
            table(
                [
                    "bolts",
                    "thread",
                    "grade",
                    "method",
                    f"torque [{T}]",
                    f"preload [{F}]",
                    "governing check",
                    "margin",
                ],
                rows,
                right=[True, False, False, False, True, True, False, True],
            )
        )
    if r["designs"] and len(r["designs"]) > MAX_ROWS:
        out.append(f"  ({MAX_ROWS} of {len(r['designs'])} shown; --json for all)")
    out.append("")
    out.append(
        "Pressure equipment: the applicable code and a qualified engineer govern; run "
        "`clampstack flange` on the chosen bolting for the full result."
    )
    out.append(CAUTION)
    return "\n".join(out)
