"""A small self-contained HTML page of a ``solve`` result (no external fetches), the HTML
tables of the notebook views, and the escaping of input text for HTML and CSS
(:func:`html_text`, :func:`css_string`) that the calculation reports use too."""

from __future__ import annotations

import html
from datetime import UTC, datetime

from .._version import __version__
from ..assembly import AssemblyResult
from .text import CAUTION, SI

_CSS = """
body{font-family:system-ui,-apple-system,"Segoe UI",sans-serif;margin:2rem auto;max-width:60rem;
color:#1d2327;line-height:1.4}
h1{font-size:1.4rem;border-bottom:3px solid #2f6f5e;padding-bottom:.3rem}
h2{font-size:1.1rem;margin-top:1.6rem;color:#2f6f5e}
table{border-collapse:collapse;margin:.5rem 0;font-variant-numeric:tabular-nums}
th,td{border-bottom:1px solid #d5dbdf;padding:.25rem .7rem;text-align:right}
th{background:#eef3f1;font-weight:600}td.l,th.l{text-align:left}
.caution{border-left:4px solid #b5651d;background:#fbf3ea;padding:.6rem 1rem;margin-top:2rem}
.meta{color:#5b6770;font-size:.85rem}
@media print{body{margin:0;max-width:none}h2{break-after:avoid}table{break-inside:avoid}}
"""


# --------------------------------------------------------------------------- escaping
#
# Every text that comes from an input file (titles, names, notes, reasons, file names)
# is escaped for the context it lands in with one of these two helpers, here and in the
# calculation reports (clampstack.report); markup of our own never goes through them.

_CSS_SAFE = frozenset("abcdefghijklmnopqrstuvwxyzABCDEFGHIJKLMNOPQRSTUVWXYZ0123456789 -_.,:()/+")


def html_text(x: object) -> str:
    """``x`` as HTML text or a quoted attribute value: ``& < > " '`` as character
    references (valid XML as well, so also for text inside inline SVG)."""
    return html.escape(str(x), quote=True)


def css_string(x: object) -> str:
    """``x`` as the content of a double-quoted CSS string (``content:"..."``).

    Every character outside ASCII letters, digits, space and ``-_.,:()/+`` becomes a
    CSS hex escape of six digits and a space (``<`` is ``\\00003c ``), so no quote,
    backslash, newline or ``</style>`` can appear in the style sheet; the browser
    shows the text unchanged.
    """
    return "".join(c if c in _CSS_SAFE else f"\\{ord(c):06x} " for c in str(x))


_e = html_text


def _page(title: str, body: str) -> str:
    return (
        '<!DOCTYPE html>\n<html lang="en"><head><meta charset="utf-8">'
        f"<title>{_e(title)}</title><style>{_CSS}</style></head><body>\n{body}\n</body></html>\n"
    )


def _meta(source_name: str, sha256: str) -> str:
    return (
        f'<p class="meta">clampstack {__version__} &middot; '
        f"{datetime.now(UTC).strftime('%Y-%m-%d %H:%M UTC')}"
        + (
            f" &middot; input {_e(source_name)} (SHA-256 {_e(sha256[:16])}&hellip;)"
            if sha256
            else ""
        )
        + "</p>"
    )


def joint_html(result, source_name: str = "", sha256: str = "") -> str:
    """A single page with the joint's verdict, states and checks (inline CSS)."""
    from .joint import joint_html_tables

    body = f"<h1>{_e(result.spec.title)}</h1>{_meta(source_name, sha256)}"
    body += joint_html_tables(result)
    body += f'<div class="caution">{_e(CAUTION)}</div>'
    return _page(result.spec.title, body)


def assembly_html(result: AssemblyResult, source_name: str = "", sha256: str = "") -> str:
    """Render the solved assembly as one HTML page (inline CSS, tables per case)."""
    u = SI
    asm = result.assembly
    parts = []
    parts.append(f"<h1>{_e(asm.title)}</h1>")
    parts.append(_meta(source_name, sha256))
    rows = "".join(
        f'<tr><td class="l">{_e(p.name)}</td><td class="l">{_e(p.ends[0])} &rarr; {_e(p.ends[1])}</td>'
        f"<td>{u.fmt('length', p.length)}</td><td>{u.fmt('area', p.area)}</td>"
        f'<td>{u.fmt("stiffness", p.stiffness)}</td><td class="l">{_e(p.material or "")}</td>'
        f'<td class="l">{_e(p.behaviour)}</td></tr>'
        for p in asm.parts
    )
    parts.append(
        "<h2>Parts</h2><table><tr><th class=l>part</th><th class=l>ends</th><th>length [mm]</th>"
        "<th>area [mm&sup2;]</th><th>stiffness [kN/mm]</th><th class=l>material</th>"
        f"<th class=l>behaviour</th></tr>{rows}</table>"
        f"<p>Fixed nodes: {_e(', '.join(asm.fixed))}.</p>"
    )
    for case in result.cases:
        prow = "".join(
            f'<tr><td class="l">{_e(p.name)}</td><td>{u.fmt("force", case.force[p.name])}</td>'
            f"<td>{u.fmt('stress', case.stress[p.name])}</td>"
            f"<td>{u.fmt('length', case.elongation[p.name])}</td>"
            f'<td class="l">{"yes" if case.carrying[p.name] else "no (slack)"}</td></tr>'
            for p in asm.parts
        )
        nrow = "".join(
            f'<tr><td class="l">{_e(n)}</td><td>{u.fmt("length", d)}</td>'
            f"<td>{u.fmt('force', case.reactions[n]) if n in case.reactions else ''}</td></tr>"
            for n, d in case.displacement.items()
        )
        parts.append(
            f"<h2>Case: {_e(case.name)}</h2><table><tr><th class=l>part</th><th>force [kN]</th>"
            "<th>stress [MPa]</th><th>elongation [mm]</th><th class=l>carrying</th></tr>"
            f"{prow}</table><table><tr><th class=l>node</th><th>displacement [mm]</th>"
            f"<th>reaction [kN]</th></tr>{nrow}</table>"
            f'<p class="meta">Equilibrium residual {case.residual:.3g} N</p>'
        )
    parts.append(
        "<p class=meta>Signs: part force tension positive; displacements, loads and reactions "
        "along +axis (from a part's first end to its second).</p>"
    )
    parts.append(f'<div class="caution">{_e(CAUTION)}</div>')
    return _page(asm.title, "\n".join(parts))


def html_table(headers: list[str], rows: list[list[object]]) -> str:
    """A plain HTML table (escaped cells), for notebooks."""
    head = "".join(f"<th>{_e(h)}</th>" for h in headers)
    body = "".join("<tr>" + "".join(f"<td>{_e(c)}</td>" for c in r) + "</tr>" for r in rows)
    return f"<table><tr>{head}</tr>{body}</table>"


def assembly_repr_html(result: AssemblyResult) -> str:
    """Parts, forces and reactions of every case (Jupyter ``_repr_html_``)."""
    out = [f"<div><b>{_e(result.assembly.title)}</b>"]
    for case in result.cases:
        rows = [
            [
                p,
                f"{case.force[p] / 1e3:.4g}",
                "-" if case.stress[p] is None else f"{case.stress[p] / 1e6:.4g}",
                f"{case.elongation[p] * 1e3:.4g}",
                "yes" if case.carrying[p] else "no",
            ]
            for p in case.force
        ]
        out.append(f"<p>{_e(case.name)}</p>")
        out.append(
            html_table(["part", "force [kN]", "stress [MPa]", "elongation [mm]", "carrying"], rows)
        )
    out.append(f"<p><small>{_e(CAUTION)}</small></p></div>")
    return "".join(out)


def checks_rows(checks) -> list[list[object]]:
    """Rows of a checks table: name, value, limit, margin, result, source."""
    import math

    rows = []
    for c in checks:
        m = c.margin
        rows.append(
            [
                c.name,
                f"{c.value:.4g} {c.unit}",
                f"{c.relation} {c.limit:.4g} {c.unit}",
                "inf" if math.isinf(m) else f"{round(m * 100, 1) + 0.0:+.1f} %",
                "off" if c.skipped else ("pass" if c.passed else "FAIL"),
                c.source,
            ]
        )
    return rows


def flange_repr_html(result) -> str:
    """Verdict, per-bolt loads and the checks of a flange (Jupyter ``_repr_html_``)."""
    n = result.spec.bolt_count
    rows = [
        [
            i + 1,
            f"{result.passes[-1][i] / 1e3:.4g}",
            f"{result.service_bolt[i] / 1e3:.4g}",
            f"{result.service_gasket[i] / 1e3:.4g}",
        ]
        for i in range(n)
    ]
    return (
        f"<div><b>{_e(result.spec.title)}</b>: {'PASS' if result.ok else 'FAIL'}"
        + html_table(
            ["bolt", "after the passes [kN]", "in service [kN]", "gasket in service [kN]"], rows
        )
        + html_table(
            ["check", "value", "limit", "margin", "result", "source"], checks_rows(result.checks)
        )
        + f"<p><small>{_e(CAUTION)}</small></p></div>"
    )


def scatter_repr_html(result) -> str:
    """Percentiles and probabilities of a scatter study (Jupyter ``_repr_html_``)."""
    prow = [
        [
            q,
            *(
                f"{result.percentiles[q][k] / 1e3:.4g}"
                for k in ("p01", "p05", "p50", "p95", "p99", "mean")
            ),
        ]
        for q in result.percentiles
    ]
    brow = []
    for name in result.counts:
        pr = result.probability(name)
        brow.append([name, f"{pr['estimate']:.3g}", f"{pr['low']:.3g} .. {pr['high']:.3g}"])
    return (
        f"<div><b>{_e(result.spec.title)}</b>: {result.samples} samples, seed {result.seed}"
        + html_table(["[kN]", "1 %", "5 %", "50 %", "95 %", "99 %", "mean"], prow)
        + html_table(["probability of", "estimate", "95 % interval"], brow)
        + f"<p><small>{_e(CAUTION)}</small></p></div>"
    )
