"""Readable rendering of a scatter study."""

from __future__ import annotations

from ..studies.scatter import QUANTS, ScatterResult
from .text import CAUTION, UNIT_SYSTEMS, localize, notes_block, table

_LABELS = {
    "assembly_preload": "assembly preload",
    "service_preload": "preload in service (no load)",
    "residual_clamp_load": "residual clamp load",
}


def scatter_text(r: ScatterResult, units: str = "si") -> str:
    """Percentiles, probabilities with intervals, and the deterministic comparisons."""
    u = UNIT_SYSTEMS[units]
    F = u.label("force")
    count = f"{r.samples:,}".replace(",", " ")
    out = [r.spec.title, f"{count} samples, seed {r.seed}", ""]
    out.append("Sampled inputs")
    out.extend(f"  {k}: {localize(v, u)}" for k, v in r.distributions.items())
    out.append("")
    out.append(_percentile_table(r, _LABELS, QUANTS, u))
    if not r.exact:
        out.append("  (percentiles from a histogram of 131 072 bins)")
    out.append("")
    out.append(
        _probability_table(
            r,
            ("opening" if r.spec.eccentric is not None else "separation",)
            + ("bolt_yield", "bolt_yield_assembly", "bolt_yield_service", "slip"),
        )
    )
    out.extend(convergence_lines(r))
    out.append("")
    d = r.deterministic
    out.append("Deterministic comparison")
    out.append(
        f"  tightening factor (VDI 2230-1): assembly preload "
        f"{u.fmt('force', d['assembly_preload_min_N'])} .. "
        f"{u.fmt('force', d['assembly_preload_max_N'])} {F} "
        f"(alpha_A {d['tightening_factor']:.3g}); minimum residual clamp load "
        f"{u.fmt('force', d['residual_clamp_load_min_N'])} {F}; "
        + (
            f"all checks pass (governing: {d['governing_check']})"
            if d["ok"]
            else f"FAIL: {', '.join(d['failing_checks'])}"
        )
    )
    n = r.nasa
    if n.get("applies"):
        out.append(
            f"  NASA-STD-5020 preload uncertainty (+-{n['uncertainty']:.0%}, "
            f"{'lubricated' if n['lubricated'] else 'unlubricated'}): preload "
            f"{u.fmt('force', n['preload_min_N'])} .. {u.fmt('force', n['preload_max_N'])} "
            f"{F}; minimum residual clamp load "
            f"{u.fmt('force', n['residual_clamp_load_min_N'])} {F} (factors from memory)"
        )
    else:
        out.append(f"  NASA-STD-5020: {n.get('reason', 'not applied')}")
    pc = r.probability_check
    if pc["limit"] is not None:
        out.append(
            f"  probability limit ([requirements] max_failure_probability = {pc['limit']:g}, "
            "95 % upper bound): "
            + ("met" if pc["ok"] else f"EXCEEDED by {', '.join(pc['exceeded'])}")
        )
    out.extend(notes_block(r.notes, u=u))
    out.append("")
    out.append(CAUTION)
    return "\n".join(out)


def flange_scatter_text(r, units: str = "si") -> str:
    """Percentiles and probabilities of a flange's assembly scatter."""
    u = UNIT_SYSTEMS[units]
    F = u.label("force")
    count = f"{r.samples:,}".replace(",", " ")
    out = [r.spec.title, f"{count} samples of {r.spec.bolt_count} bolts each, seed {r.seed}", ""]
    out.append("Sampled inputs")
    out.extend(f"  {k}: {v}" for k, v in r.distributions.items())
    out.append("")
    labels = {
        "assembly_preload": "assembly preload (every bolt)",
        "residual_clamp_load": "smallest sector gasket force in service",
        "gasket_after_cycle": "smallest after the heat cycle (hot, cooled)",
    }
    out.append(
        _percentile_table(
            r, labels, ("assembly_preload", "residual_clamp_load", "gasket_after_cycle"), u
        )
    )
    out.append("")
    out.append(
        _probability_table(
            r,
            (
                "gasket_below_operating",
                "gasket_below_operating_after_cycle",
                "separation",
                "bolt_yield",
                "bolt_yield_assembly",
                "bolt_yield_service",
            ),
        )
    )
    out.extend(convergence_lines(r))
    d = r.deterministic
    out.append("")
    out.append(
        f"Deterministic: target {u.fmt('force', d['target_preload_N'])} {F} per bolt, "
        f"range {u.fmt('force', d['assembly_preload_min_N'])} .. "
        f"{u.fmt('force', d['assembly_preload_max_N'])} {F}; operating minimum per sector "
        f"{u.fmt('force', d['operating_minimum_per_sector_N'])} {F}; "
        + ("all checks pass" if d["ok"] else f"FAIL: {', '.join(d['failing_checks'])}")
    )
    out.append(
        "Passes and service state linearised about the deterministic ring analysis (each "
        "pass turns each nut to its own sampled target, in order); the heat cycle's "
        "relaxation scales with each sample's factor."
    )
    out.append("")
    out.append(CAUTION)
    return "\n".join(out)


def _percentile_table(r, labels: dict[str, str], quants, u) -> str:
    F = u.label("force")
    rows = []
    for q in quants:
        rows.append(
            [labels[q]]
            + [
                u.fmt("force", r.percentiles[q][k])
                for k in ("p01", "p05", "p50", "p95", "p99", "mean")
            ]
        )
        ci = r.intervals.get(q)
        if ci:
            rows.append(
                ["  95 % interval"]
                + [
                    f"{u.fmt('force', ci[k]['low'])}..{u.fmt('force', ci[k]['high'])}"
                    for k in ("p01", "p05", "p50", "p95", "p99")
                ]
                + [""]
            )
    return table(
        [f"[{F}]", "1 %", "5 %", "50 %", "95 %", "99 %", "mean"], rows, right=[False] + [True] * 6
    )


_EVENT_LABELS = {
    "bolt_yield": "bolt_yield (either)",
    "bolt_yield_assembly": "  at assembly",
    "bolt_yield_service": "  in service",
}


def convergence_lines(r) -> list[str]:
    """How the sample count was reached, and which estimates have not converged."""
    c = r.convergence or {}
    if not c.get("adaptive"):
        return ["  fixed number of samples (--samples); intervals as printed"]
    pending = [e for e, s in c["events"].items() if not s["converged"]]
    count = f"{r.samples:,}".replace(",", " ")
    head = (
        f"  adaptive: {count} samples in {c['rounds']} rounds, until each probability's "
        f"95 % interval is narrower than {c['target_relative_width']:.0%} of its estimate or "
        f"its upper bound below {c['negligible_below']:g}"
    )
    if not pending:
        return [head + "; all converged"]
    return [
        head,
        "  NOT CONVERGED at the cap of "
        + f"{c['max_samples']:,}".replace(",", " ")
        + " samples: "
        + ", ".join(
            f"{e} (interval {c['events'][e]['relative_width']:.0%} of the estimate)"
            if c["events"][e]["relative_width"] is not None
            else f"{e} (no event yet)"
            for e in pending
        )
        + "; raise --max-samples or read these estimates as order of magnitude",
    ]


def _probability_table(r, names) -> str:
    rows = []
    for name in names:
        pr = r.probability(name)
        rows.append(
            [
                _EVENT_LABELS.get(name, name),
                f"{pr['estimate']:.3g}",
                f"{pr['low']:.3g} .. {pr['high']:.3g}",
                str(pr["count"]),
            ]
        )
    return table(
        ["probability of", "estimate", "95 % interval (Clopper-Pearson)", "count"],
        rows,
        right=[False, True, True, True],
    )
