"""The calculation report of a generic axial assembly (``clampstack report`` of a ``solve``
file): inputs, every case's part forces, stresses, elongations and node displacements, the
load share and where a contact part unloads, the force and displacement figures, the
caution.  Rendered in memory, as the joint and flange reports are."""

from __future__ import annotations

import csv
import io
import json
from datetime import UTC, datetime
from pathlib import Path

from .._version import __version__
from ..assembly import AssemblyResult
from ..inputs.files import InputDocument, file_stem
from ..outputs.text import CAUTION, UNIT_SYSTEMS, DisplayUnits
from ._common import _e, _figure, _kv, _lab, _page, _renumber, _table, report_block

REFERENCES = (
    "Przemieniecki, J. S., <i>Theory of Matrix Structural Analysis</i>, McGraw-Hill, 1968 "
    "(the direct stiffness method of the spring network).",
    "Gere, J. M., Goodno, B. J., <i>Mechanics of Materials</i>, Cengage (statically "
    "indeterminate axial members, thermal effects, misfits).",
)


def assembly_report_file_names(stem: str) -> dict[str, str]:
    """The files of an assembly report: page, JSON result and the part forces as CSV."""
    return {"html": f"{stem}.html", "json": f"{stem}.json", "parts": f"{stem}-parts.csv"}


def _case(case, result: AssemblyResult, u: DisplayUnits) -> str:
    F, S, L = _lab(u, "force"), _lab(u, "stress"), _lab(u, "length")
    rows = []
    for p in result.assembly.parts:
        rows.append(
            [
                _e(p.name if p.count == 1 else f"{p.name} (x {p.count})"),
                _e(f"{p.ends[0]} - {p.ends[1]}"),
                u.fmt("force", case.force[p.name]),
                "" if p.count == 1 else u.fmt("force", case.force[p.name] * p.count),
                u.fmt("stress", case.stress[p.name]),
                u.fmt("length", case.elongation[p.name]),
                _e(p.behaviour if p.behaviour != "linear" else ""),
                "yes" if case.carrying[p.name] else "<b>no (slack)</b>",
            ]
        )
    parts = _table(
        [
            "part",
            "ends",
            f"force [{F}]",
            f"all [{F}]",
            f"stress [{S}]",
            f"elongation [{L}]",
            "contact",
            "carrying",
        ],
        rows,
        left={0, 1, 6, 7},
        cls="small",
    )
    nodes = _table(
        ["node", f"displacement [{L}]", f"reaction [{F}]"],
        [
            [
                _e(n),
                u.fmt("length", d),
                u.fmt("force", case.reactions[n]) if n in case.reactions else "",
            ]
            for n, d in case.displacement.items()
        ],
        cls="small",
    )
    extra = ""
    for load, share in case.load_share.items():
        extra += (
            f"<p>Load share of <b>{_e(load)}</b> (the change of each part's force in all, per "
            "unit of the load): "
            + ", ".join(f"{_e(k)} {v:+.3g}" for k, v in share.items())
            + "</p>"
        )
    if case.events:
        extra += (
            "<ul>"
            + "".join(
                f"<li>{_e(ev['part'])} {_e(ev['event'])} at {ev['at_factor']:.4g} &times; this case</li>"
                for ev in case.events
            )
            + "</ul>"
        )
    return (
        f'<div class="keep"><h3>Case: {_e(case.name)}</h3>{parts}{nodes}'
        f"<p class=meta>equilibrium residual {case.residual:.3g} N</p>{extra}</div>"
    )


def _parts_csv(result: AssemblyResult) -> str:
    buf = io.StringIO()
    w = csv.writer(buf, lineterminator="\n")
    w.writerow(
        [
            "case",
            "part",
            "count",
            "force_N",
            "total_force_N",
            "stress_MPa",
            "elongation_mm",
            "carrying",
        ]
    )
    for c in result.cases:
        for p in result.assembly.parts:
            s = c.stress[p.name]
            w.writerow(
                [
                    c.name,
                    p.name,
                    p.count,
                    f"{c.force[p.name]:.9g}",
                    f"{c.force[p.name] * p.count:.9g}",
                    "" if s is None else f"{s * 1e-6:.9g}",
                    f"{c.elongation[p.name] * 1e3:.9g}",
                    c.carrying[p.name],
                ]
            )
    return buf.getvalue()


def render_assembly_report(
    doc: InputDocument, result: AssemblyResult, units: str = "si", now: datetime | None = None
) -> dict[str, str]:
    """Render the assembly report files in memory: ``{file name: content}`` (page last)."""
    from ..plots.assembly import displacement_plot, force_diagram

    u = UNIT_SYSTEMS[units]
    now = now or datetime.now(UTC)
    stamp = now.strftime("%Y-%m-%d %H:%M UTC")
    name = Path(doc.path).name
    names = assembly_report_file_names(file_stem(doc, "assembly"))
    asm = result.assembly
    f1 = _figure(
        force_diagram(result, units),
        "f1",
        "Axial force of each part",
        "Figure 1. Axial force of each part in every case (per part; tension to the right), "
        "solved with the spring network.",
    )
    f2 = _figure(
        displacement_plot(result, units),
        "f2",
        "Displacement of each node",
        "Figure 2. Displacement of each node along the axis in every case (fixed nodes at zero).",
    )
    summary = _kv(
        [
            ("Parts", f"{len(asm.parts)} ({sum(p.count for p in asm.parts)} with their counts)"),
            ("Nodes", _e(", ".join(asm.node_names()))),
            ("Fixed", _e(", ".join(asm.fixed))),
            ("Cases", _e(", ".join(c.name for c in result.cases))),
        ]
        + [
            (
                f"Preload of {_e(p.name)}",
                f"{u.fmt('force', p.preload)} {_lab(u, 'force')} per part; fitted with a misfit "
                f"of {u.fmt('length', result.fitted_misfits[p.name])} {_lab(u, 'length')}",
            )
            for p in asm.parts
            if p.name in result.fitted_misfits
        ]
    )
    notes = "".join(f"<li>{_e(n)}</li>" for n in result.notes)
    body = "".join(
        [
            f"<header><h1>{_e(asm.title)}</h1>"
            '<p class="sub">Axial assembly calculation report (spring network)</p>'
            f'<p class="meta">clampstack {_e(__version__)} &middot; {_e(stamp)} &middot; input '
            f'<code>{_e(name)}</code> &middot; SHA-256 <span class="hash">{_e(doc.sha256)}</span>'
            "</p></header>",
            f'<section id="summary"><h2>1. Summary</h2>{summary}'
            f'<div class="caution">{_e(CAUTION)}</div></section>',
            '<section id="inputs"><h2>2. Inputs</h2>'
            f"<p>The input file <code>{_e(name)}</code> as entered:</p>"
            f'<pre class="input">{_e(doc.text.rstrip())}</pre></section>',
            '<section id="states"><h2>3. States</h2>'
            "<p>Signs: part force tension +; displacement, loads and reactions along +axis (from "
            "a part's first end to its second). Elongation: the change of the distance between a "
            "part's two end nodes from the unloaded geometry, its free elongation (misfit, "
            "temperature) included. Each case is solved from the assembled state.</p>"
            + "".join(_case(c, result, u) for c in result.cases)
            + (f"<h3>Warnings</h3><ul>{notes}</ul>" if notes else "")
            + "</section>",
            f'<section id="figures"><h2>4. Forces and displacements</h2>{f1}{f2}</section>',
            '<section id="references"><h2>5. References</h2><ol class="refs">'
            + "".join(f"<li>{x}</li>" for x in REFERENCES)
            + "</ol></section>",
            f"<footer><div class=caution>{_e(CAUTION)}</div>"
            f'<p class="meta">Generated by clampstack {_e(__version__)} on {_e(stamp)} from '
            f"<code>{_e(name)}</code>. Results beside this file: <code>{_e(names['json'])}</code>, "
            f"<code>{_e(names['parts'])}</code>.</p></footer>",
        ]
    )
    page = _page(
        asm.title,
        __version__,
        f"clampstack {__version__} - {name} (SHA-256 {doc.sha256[:12]}) - {asm.title}",
        _renumber(body),
    )
    data = result.to_dict()
    data["report"] = report_block(doc, now, units, __version__)
    return {
        names["json"]: json.dumps(data, indent=2, allow_nan=False) + "\n",
        names["parts"]: _parts_csv(result),
        names["html"]: page,
    }
