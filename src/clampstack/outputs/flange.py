"""Readable rendering of a flange result."""

from __future__ import annotations

import math

import numpy as np

from ..flange.analysis import FlangeResult
from .joint import check_value
from .text import UNIT_SYSTEMS, defaults_block, fmt_number, notes_block, table

FLANGE_CAUTION = (
    "Caution: pressure equipment. These results support, and do not replace, the judgement "
    "of a qualified engineer; the applicable pressure-equipment code (e.g. ASME BPVC VIII-1, "
    "EN 13445, EN 1591-1) and local regulations govern, and the gasket manufacturer's data "
    "take precedence over the catalog's typical values."
)


def _margin(c) -> str:
    m = c.margin
    return "inf" if math.isinf(m) else f"{round(m * 100, 1) + 0.0:+.1f} %"


def flange_text(r: FlangeResult, units: str = "si") -> str:
    """Required bolt load, gasket window, torque per bolt, per-pass preloads, checks, caution."""
    u = UNIT_SYSTEMS[units]
    s = r.spec
    F = u.label("force")
    a = r.app2
    n = s.bolt_count
    out = [
        s.title,
        f"{n} x {s.thread.designation} grade {s.grade.name} on a {u.fmt('length', s.bolt_circle)} "
        f"{u.label('length')} bolt circle; {s.gasket.name} gasket "
        f"{u.fmt('length', s.gasket.inner_diameter)} x {u.fmt('length', s.gasket.outer_diameter)} "
        f"x {u.fmt('length', s.gasket.thickness)} {u.label('length')}; "
        f"{'flange pair' if s.mating == 'flange' else 'flange on a rigid face'}",
        "",
    ]
    failed = [c.name for c in r.checks if not c.passed]
    out.append("RESULT: PASS - all checks pass" if r.ok else f"RESULT: FAIL - {', '.join(failed)}")
    out.append("")
    out.append("Required bolt load (ASME BPVC VIII-1 Appendix 2)")
    out.append(
        f"  gasket b0 = {u.fmt('length', a.b0)} {u.label('length')}, b = {u.fmt('length', a.b)} "
        f"{u.label('length')}, G = {u.fmt('length', a.G)} {u.label('length')}, "
        f"m = {s.gasket.m:g}, y = "
        + (
            f"{fmt_number(s.gasket.y / 6894.757293168361, us=True)} psi"  # as ASME's tables
            if u.us
            else f"{u.fmt('stress', s.gasket.y)} {u.label('stress')}"
        )
    )
    out.append(
        f"  H = {u.fmt('force', a.H)}, H_p = {u.fmt('force', a.Hp)}, "
        f"W_m1 (operating) = {u.fmt('force', a.Wm1)}, W_m2 (seating) = "
        f"{u.fmt('force', a.Wm2)} {F}"
    )
    if a.external > 0:
        out.append(
            f"  external force and moment, once: F + 4 M / G = {u.fmt('force', a.external)} {F} "
            "(included in W_m1; form of ASME VIII-2 4.16)"
        )
    out.append(
        f"  bolt area: required A_m = {u.fmt('area', a.Am)}, available A_b = "
        f"{u.fmt('area', a.Ab)} {u.label('area')} ({a.area_basis})"
    )
    out.append(f"  flange design bolt load W = (A_m + A_b) S_a / 2 = {u.fmt('force', a.W)} {F}")
    out.append("")
    out.append("Gasket stress window and tightening (per bolt)")
    out.append(
        f"  preload window {u.fmt('force', r.window[0])} .. {u.fmt('force', r.window[1])} "
        f"{F} (low: {r.window_reasons[0]}; high: {r.window_reasons[1]})"
    )
    out.append(
        f"  target preload {u.fmt('force', r.target)} {F} = "
        f"{r.target / s.thread.As / s.grade.Rp02:.0%} of yield on A_s; assembly range "
        f"{u.fmt('force', r.assembly_range[0])} .. {u.fmt('force', r.assembly_range[1])} {F}"
        f" (alpha_A {r.alpha_A:.3g})"
    )
    tens = r.tensioning
    if tens is not None:
        applied = ", ".join(
            f"{lab} {u.fmt('force', Fa)} {F}"
            for lab, Fa in zip(tens.labels, tens.applied, strict=True)
        )
        out.append(f"  tensioners ({tens.coverage}), applied tension per bolt: {applied}")
        out.append(
            f"  load transfer factor {tens.load_transfer_factor:.3g} "
            f"({tens.load_transfer_basis}); no torque specification"
        )
    if r.torque is not None:
        T = u.label("torque")
        out.append(
            f"  torque per bolt {u.fmt('torque', r.torque[0])} {T} (min "
            f"{u.fmt('torque', r.torque[1])}, max {u.fmt('torque', r.torque[2])} {T})"
        )
    out.append("")
    fr = [f"{100 * p:.4g} %" for p in r.pass_fractions]
    rows = []
    for i in range(n):
        rows.append(
            [str(i + 1), f"{360 * i / n:.1f}"]
            + [u.fmt("force", float(p[i])) for p in r.passes]
            + ([] if tens else [u.fmt("force", float(r.compensated_targets[i]))])
            + [
                u.fmt("force", float(r.working_loads[i])),
                u.fmt("force", float(r.service_bolt[i])),
                u.fmt("force", float(r.service_gasket[i])),
            ]
        )
    out.append(
        table(
            ["bolt", "angle"]
            + [f"pass {k + 1} ({f}) [{F}]" for k, f in enumerate(fr)]
            + ([] if tens else [f"1-pass target [{F}]"])
            + [
                f"F_A [{F}]",
                f"in service [{F}]",
                f"gasket in service [{F}]",
            ],
            rows,
            right=[True] * (len(rows[0])),
        )
    )
    final = r.passes[-1]
    spread = (
        f"  after the last pass: {u.fmt('force', float(np.min(final)))} .. "
        f"{u.fmt('force', float(np.max(final)))} {F}, spread {r.final_spread:.1%}"
    )
    if tens is not None:
        out.append(
            "  passes: "
            + "; ".join(f"pass {k + 1} {lab}" for k, lab in enumerate(r.pass_labels))
            + " (% of the last pass's applied tension)"
        )
        out.append(spread)
    else:
        orders = "; ".join(f"pass {k + 1} {pat}" for k, pat in enumerate(r.pass_labels))
        out.append(
            f"  patterns: {orders}; cross order: {'-'.join(str(b + 1) for b in r.orders[0])}"
        )
        out.append(
            f"{spread}; single pass with the compensated targets (in pass-1 order): spread "
            f"{_spread(r.compensated_final):.2%}"
        )
    out.append("")
    crow = []
    for c in r.checks:
        verdict = "pass" if c.passed else "FAIL"
        value, limit = check_value(c, u)
        crow.append(
            [
                c.name,
                value,
                c.relation,
                limit,
                _margin(c),
                verdict,
                str((c.extra or {}).get("governing_bolt", "")),
                c.source,
            ]
        )
    out.append(
        table(
            ["check", "value", "", "limit", "margin", "result", "bolt", "source"],
            crow,
            right=[False, True, False, True, True, False, True, False],
        )
    )
    out.append(
        "  bolt: the governing bolt (or its gasket sector), from the per-bolt loads after the "
        "last pass and in service; the assembly scatter scales the preload part of each load."
    )
    out.extend(notes_block(r.notes, u=u))
    out.extend(defaults_block(r.defaults, u))
    out.append("")
    out.append(FLANGE_CAUTION)
    return "\n".join(out)


def _spread(f) -> float:
    m = float(np.mean(f))
    return float((np.max(f) - np.min(f)) / m) if m > 0 else 0.0
