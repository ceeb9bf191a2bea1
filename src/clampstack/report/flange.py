"""HTML calculation report of a gasketed multi-bolt flange, with JSON and CSV beside it.

The same page as the joint report (:mod:`clampstack.report.joint`): inline CSS,
figures as inline SVG, no scripts and no URL; it prints on A4 and on Letter.
It shows the torque per bolt and the target preload, the input as entered with
the defaults applied, the ASME BPVC VIII-1 Appendix 2 bolt loads, the gasket
stress window, every bolt after every tightening pass and in service, the
checks with their sources and margins, the notes, the references and the
pressure-equipment caution (:data:`clampstack.outputs.flange.FLANGE_CAUTION`).
Everything is rendered in memory; :func:`clampstack.outputs.files.write_files`
writes it.
"""

from __future__ import annotations

import csv
import io
import json
from datetime import UTC, datetime
from pathlib import Path
from typing import Any

import numpy as np

from .._version import __version__
from ..flange.analysis import FlangeResult
from ..flange.loads import INCH
from ..inputs.files import InputDocument, file_stem
from ..outputs.flange import FLANGE_CAUTION
from ..outputs.joint import _mu
from ..outputs.joint import check_value as _check_value
from ..outputs.text import UNIT_SYSTEMS, DisplayUnits, fmt_number, localize
from ._common import (
    MARGIN_NOTE,
    _checks_csv,
    _checks_table,
    _e,
    _f,
    _figure,
    _kv,
    _lab,
    _page,
    _renumber,
    _table,
    report_block,
    verdict_html,
)

C0 = 273.15
PSI = 6894.757293168361  # Pa

REFERENCES: tuple[str, ...] = (
    "ASME Boiler and Pressure Vessel Code, Section VIII, Division 1, Mandatory Appendix 2, "
    "<i>Rules for bolted flange connections with ring type gaskets</i>: 2-5 (bolt loads "
    "W<sub>m1</sub>, W<sub>m2</sub> and the bolt area A<sub>m</sub>), Table 2-5.1 (gasket "
    "factors m and y), Table 2-5.2 (gasket seating width b<sub>0</sub>). ASME, New York.",
    "ASME PCC-1, <i>Pressure boundary bolted flange joint assembly</i>: tightening passes, "
    "star (cross) pattern, target bolt stress. ASME, New York.",
    "VDI 2230 Part 1:2015, <i>Systematic calculation of highly stressed bolted joints &mdash; "
    "Joints with one cylindrical bolt</i>. VDI, D&uuml;sseldorf: permissible assembly preload "
    "(R7), tightening torque (R13), bolt and plate resilience (5.1).",
    "Young, W. C., Budynas, R. G., Sadegh, A. M., <i>Roark's Formulas for Stress and "
    "Strain</i>, McGraw-Hill: beam formulas (fixed and guided ends), used for the ring "
    "between neighbouring bolts.",
    "ISO 898-1:2013, <i>Mechanical properties of fasteners made of carbon steel and alloy "
    "steel &mdash; Part 1: Bolts, screws and studs with specified property classes</i>.",
    "ISO 16047:2005, <i>Fasteners &mdash; Torque/clamp force testing</i>.",
    "ISO 68-1, ISO 261, ISO 724 (ISO general purpose metric screw threads); ASME B1.1-2019, "
    "<i>Unified Inch Screw Threads</i>; ISO 273:1979 (clearance holes).",
    "ASTM A193/A193M (bolting for high-temperature service), ASME BPVC Section II Part D "
    "(material properties at temperature): catalog data, each row with its source "
    "(<code>clampstack catalog</code>).",
    "Przemieniecki, J. S., <i>Theory of Matrix Structural Analysis</i>, McGraw-Hill, 1968, "
    "chapter 3 (the direct stiffness method of the spring network).",
)

# the gasket stress window drawn as a bar (HTML boxes, no figure)
_WINDOW_CSS = (
    ".window{margin:.5rem 0 .2rem;break-inside:avoid;page-break-inside:avoid}"
    ".window .track{position:relative;height:26px;background:#f1f4f6;border:1px solid #d6dde1;"
    "border-radius:3px}"
    ".window .track span{position:absolute;top:0;bottom:0}"
    ".window .win{background:#cfe8d7;border-left:2px solid #2f7a4a;border-right:2px solid #2f7a4a}"
    ".window .gap{background:#f6dcd9;border-left:2px solid #b3261e;border-right:2px solid #b3261e}"
    ".window .asm{top:7px!important;bottom:7px!important;background:#1b6c8f;opacity:.55}"
    ".window .tgt{width:0;border-left:2px solid #1e2b33;top:-3px!important;bottom:-3px!important}"
    ".window .scale{display:flex;justify-content:space-between;font-size:7.5pt;color:#5d6b73}"
    ".key{display:inline-block;width:.9em;height:.7em;vertical-align:baseline;margin:0 .25em 0 .6em}"
    ".key.win{background:#cfe8d7;border:1px solid #2f7a4a}.key.asm{background:#1b6c8f;opacity:.55}"
    ".key.tgt{width:0;border-left:2px solid #1e2b33}.key.gap{background:#f6dcd9}"
    "table.bolts td,table.bolts th{padding:.15rem .3rem}"
    "@media print{p.lead{break-after:avoid-page;page-break-after:avoid}}"
)


def flange_report_file_names(stem: str) -> dict[str, str]:
    """Names of the flange report files for an input file named ``stem``."""
    return {
        "html": f"{stem}.html",
        "json": f"{stem}.json",
        "bolts": f"{stem}-bolts.csv",
        "checks": f"{stem}-checks.csv",
    }


# --------------------------------------------------------------------------- helpers


def _check_values(c: Any, u: DisplayUnits) -> tuple[str, str]:
    """Value and limit of a check in display units (areas too)."""
    if c.unit == "mm2":
        lab = u.label("area").replace("^2", "\u00b2")
        return (f"{u.fmt('area', c.value * 1e-6)} {lab}", f"{u.fmt('area', c.limit * 1e-6)} {lab}")
    return _check_value(c, u)


def _q(u: DisplayUnits, kind: str, value: float | None) -> str:
    """A value with its unit that never wraps inside (``163&nbsp;790&nbsp;lbf``)."""
    return _f(u, kind, value).replace(" ", "&nbsp;")


def _n(u: DisplayUnits, kind: str, value: float) -> str:
    """A number in display units that never wraps inside (``24&nbsp;357``)."""
    return u.fmt(kind, value).replace(" ", "&nbsp;")


def _pressure(u: DisplayUnits, p: float) -> str:
    if u.name == "us":
        return f"{fmt_number(p / PSI)}&nbsp;psi"
    return f"{fmt_number(p / 1e6)}&nbsp;MPa ({fmt_number(p / 1e5)}&nbsp;bar)"


def _moment(u: DisplayUnits, m: float) -> str:
    if u.name == "us":
        return _q(u, "torque", m)
    return f"{fmt_number(m / 1e3)}&nbsp;kN&middot;m"


def _deg(T: float, u: DisplayUnits | None = None) -> str:
    if u is not None and u.us:
        return f"{u.temp(T):.4g}&nbsp;&deg;F"
    return f"{T - C0:g}&nbsp;&deg;C"


def _by_design(r: FlangeResult) -> set[str]:
    """Checks at their limit by construction: neither torque nor preload given, so the
    target was set from the top of the window (the bolt or the gasket crush limit)."""
    s = r.spec
    if s.torque is not None or s.preload is not None:
        return set()
    reason = r.window_reasons[1]
    if reason.startswith("bolt permissible preload"):  # also x the load transfer factor
        return {"assembly_preload"}
    return {"gasket crush limit": {"gasket_crush"}}.get(reason, set())


def _governing(r: FlangeResult) -> Any:
    active = [c for c in r.checks if c.skipped is None]
    skip = _by_design(r)
    pool = [c for c in active if c.name not in skip] or active
    return min(pool, key=lambda c: c.margin) if pool else None


# --------------------------------------------------------------------------- sections


def _summary(r: FlangeResult, u: DisplayUnits) -> str:
    s = r.spec
    n = s.bolt_count
    gov = _governing(r)
    active = [c for c in r.checks if c.skipped is None]
    at_limit = [c.name for c in active if c.name in _by_design(r)]
    verdict = verdict_html(r.checks, gov)
    fr = " / ".join(f"{100 * p:.4g}" for p in r.pass_fractions)
    k = len(r.pass_fractions)
    passes = f"{k} pass{'es' if k != 1 else ''} ({fr} %)"
    if r.torque is not None:
        t0, t1, t2 = r.torque
        spec = (
            f'<div class="spec"><span>Torque per bolt</span>'
            f'<span class="big">{_q(u, "torque", t0)}</span>'
            f"<span>min {_q(u, 'torque', t1)} &middot; max {_q(u, 'torque', t2)}</span>"
            f"<span>{n} bolts, {passes}; thread friction {_e(_mu(s.thread_friction))}, "
            f"head friction {_e(_mu(s.head_friction))}</span></div>"
        )
    elif r.tensioning is not None:
        t = r.tensioning
        applied = "; ".join(
            f"{_e(lab)}: {_q(u, 'force', F)}" for lab, F in zip(t.labels, t.applied, strict=True)
        )
        spec = (
            f'<div class="spec"><span>Applied tension per bolt (tensioners, '
            f"{_e(t.coverage)})</span>"
            f'<span class="big">{_q(u, "force", t.applied[0])}</span>'
            f"<span>{applied}</span>"
            f"<span>{n} bolts; the nuts keep about {t.load_transfer_factor:.0%} "
            f"(load transfer factor, {_e(t.load_transfer_basis)}); residual preload "
            f"{_q(u, 'force', r.target)} nominal; no torque specification</span></div>"
        )
    else:
        spec = (
            f'<div class="spec"><span>Preload per bolt (tensioner)</span>'
            f'<span class="big">{_q(u, "force", r.target)}</span>'
            f"<span>{n} bolts, {passes}; no torque specification</span></div>"
        )
    lo, hi = r.window
    final = r.passes[-1]
    ratio = r.target / s.thread.As / float(s.grade.Rp02)
    a = r.app2
    rows = [
        (
            "Target preload per bolt F<sub>M</sub>",
            f"<b>{_q(u, 'force', r.target)}</b> ({ratio:.0%} of the yield point on A<sub>s</sub>)",
        ),
        (
            "Assembly preload F<sub>M,min</sub> .. F<sub>M,max</sub>",
            f"{_q(u, 'force', r.assembly_range[0])} .. {_q(u, 'force', r.assembly_range[1])} "
            f"(&alpha;<sub>A</sub> = {r.alpha_A:.3g})",
        ),
        (
            "Preload window per bolt",
            f"{_q(u, 'force', lo)} .. {_q(u, 'force', hi)}"
            + (" <b class=fail>(empty)</b>" if lo > hi else ""),
        ),
        (
            "Required bolt load (App. 2)",
            f"W<sub>m1</sub> = {_q(u, 'force', a.Wm1)} (operating), W<sub>m2</sub> = "
            f"{_q(u, 'force', a.Wm2)} (gasket seating)",
        ),
        (
            "Preload after the last pass",
            f"{_q(u, 'force', float(np.min(final)))} .. {_q(u, 'force', float(np.max(final)))} "
            f"(spread {r.final_spread:.1%})",
        ),
        (
            "Loading",
            f"pressure {_pressure(u, s.pressure)}; axial force {_q(u, 'force', s.axial_force)}; "
            f"bending moment {_moment(u, s.bending_moment)}",
        ),
        (
            "Temperatures",
            f"assembly {_deg(s.T_assembly, u)}, flange {_deg(s.T_flange, u)}, "
            f"bolts {_deg(s.T_bolt, u)}",
        ),
    ]
    note = ""
    if at_limit:
        note = (
            "<p class=meta>No torque or preload was given: the target was set so that the "
            "largest assembly preload meets the top of the window, so "
            f"<b>{_e(', '.join(at_limit))}</b> sits at its limit by design and is not "
            "reported as governing.</p>"
        )
    return (
        '<section id="summary"><h2>1. Summary</h2>'
        f"{verdict}{spec}{_kv(rows)}{note}"
        f'<div class="caution">{_e(FLANGE_CAUTION)}</div></section>'
    )


def _inputs(doc: InputDocument, r: FlangeResult, u: DisplayUnits) -> str:
    s = r.spec
    g = s.gasket
    name = Path(doc.path).name
    defaults = (
        _table(
            ["key", "value applied"],
            [[f"<code>{_e(k)}</code>", _e(v)] for k, v in r.defaults],
            left={0, 1},
            cls="small",
        )
        if r.defaults
        else "<p>No defaults were applied: every value was given.</p>"
    )
    L = "length"
    data = [
        (
            "Flange",
            f"{s.bolt_count} bolts on a {_q(u, L, s.bolt_circle)} bolt circle; ring "
            f"{_q(u, L, s.ring_inner_diameter)} .. {_q(u, L, s.ring_outer_diameter)}, "
            f"{_q(u, L, s.thickness)} thick, {_e(s.material.name)}; "
            + ("identical flange pair" if s.mating == "flange" else "on a rigid face"),
        ),
        (
            "Bolts",
            f"{_e(s.thread.designation)} grade {_e(s.grade.name)} "
            f"({_e(s.bolt_material.name)}); hole {_q(u, L, s.hole)}, bearing diameter "
            f"{_q(u, L, s.bearing_diameter)}, nut height {_q(u, L, s.nut_height)}",
        ),
        (
            "Allowable bolt stress",
            f"S<sub>b</sub> = {_q(u, 'stress', s.allowable_stress)} (design temperature), "
            f"S<sub>a</sub> = {_q(u, 'stress', s.allowable_stress_ambient)} (ambient)",
        ),
        (
            "Gasket",
            f"{_e(g.name)}, {_q(u, L, g.inner_diameter)} .. {_q(u, L, g.outer_diameter)}, "
            f"{_q(u, L, g.thickness)} thick (area {_q(u, 'area', g.area)}); m = {g.m:g}, "
            f"y = {_q(u, 'stress', g.y)}, crush limit {_q(u, 'stress', g.max_stress)}, "
            f"unloading modulus {_q(u, 'stress', g.unload_modulus)}"
            f"<br><span class=meta>{_e(g.source)}</span>",
        ),
        (
            "Tightening",
            f"method {_e(s.method)}; "
            + (f"torque {_q(u, 'torque', s.torque)}; " if s.torque is not None else "")
            + (f"preload {_q(u, 'force', s.preload)}; " if s.preload is not None else "")
            + f"thread friction {_e(_mu(s.thread_friction))}, head friction "
            f"{_e(_mu(s.head_friction))}; utilisation &nu; = {s.utilization:g}"
            + (
                f"; torque tolerance &plusmn;{s.torque_tolerance * 100:.3g} %"
                if s.method == "torque"
                else ""
            ),
        ),
    ]
    return (
        '<section id="inputs"><h2>2. Inputs</h2>'
        f"<p>The input file <code>{_e(name)}</code> as entered (quantities with their units; "
        f'SHA-256 <span class="hash">{_e(doc.sha256)}</span>):</p>'
        f'<pre class="input">{_e(doc.text.rstrip())}</pre>'
        "<h3>Defaults applied</h3>"
        "<p>Values the input did not give, and what was used instead:</p>"
        f"{defaults}<h3>Data used</h3>{_kv(data)}</section>"
    )


def _app2(r: FlangeResult, u: DisplayUnits) -> str:
    s = r.spec
    a = r.app2
    g = s.gasket
    n = s.bolt_count
    width = 0.5 * (g.outer_diameter - g.inner_diameter)
    narrow = a.b0 <= 0.25 * INCH
    F = _lab(u, "force")

    def force(v: float) -> tuple[str, str]:
        return _q(u, "force", v), _q(u, "force", v / n)

    rows = [
        [
            "basic gasket seating width",
            "b<sub>0</sub>",
            _q(u, "length", a.b0),
            "",
            f"N/2, N = {_q(u, 'length', width)} the gasket width (Table 2-5.2, flat ring on a "
            "raised face)",
        ],
        [
            "effective gasket seating width",
            "b",
            _q(u, "length", a.b),
            "",
            "b = b<sub>0</sub> (b<sub>0</sub> &le; 1/4 in)"
            if narrow
            else "b = 0.5 &radic;b<sub>0</sub> in inches (b<sub>0</sub> &gt; 1/4 in)",
        ],
        [
            "diameter of the gasket load reaction",
            "G",
            _q(u, "length", a.G),
            "",
            "mean diameter of the gasket contact face"
            if narrow
            else "outside diameter of the gasket contact face &minus; 2b",
        ],
        ["hydrostatic end force", "H", *force(a.H), "0.785 G&sup2; P"],
        ["gasket load in operation", "H<sub>p</sub>", *force(a.Hp), "2 b &pi; G m P"],
        [
            "<b>required bolt load, operating</b>",
            "W<sub>m1</sub>",
            f"<b>{_q(u, 'force', a.Wm1)}</b>",
            _q(u, "force", a.Wm1 / n),
            "H + H<sub>p</sub> + F + 4M/G (F, M once; form of ASME VIII-2 4.16)",
        ],
        [
            "<b>required bolt load, gasket seating</b>",
            "W<sub>m2</sub>",
            f"<b>{_q(u, 'force', a.Wm2)}</b>",
            _q(u, "force", a.Wm2 / n),
            "&pi; b G y",
        ],
        [
            "required bolt area",
            "A<sub>m</sub>",
            _q(u, "area", a.Am),
            _q(u, "area", a.Am / n),
            "max(W<sub>m1</sub>/S<sub>b</sub>, W<sub>m2</sub>/S<sub>a</sub>)",
        ],
        [
            "available bolt area",
            "A<sub>b</sub>",
            _q(u, "area", a.Ab),
            _q(u, "area", a.Ab / n),
            f"{n} &times; &pi;/4 d<sub>3</sub>&sup2; (root area of the thread, d<sub>3</sub> = d &minus; 1.226869 P, ISO 898-1)",
        ],
        [
            "flange design bolt load",
            "W",
            _q(u, "force", a.W),
            _q(u, "force", a.W / n),
            "(A<sub>m</sub> + A<sub>b</sub>) S<sub>a</sub> / 2",
        ],
    ]
    table = _table(
        ["quantity", "symbol", "value", "per bolt", "rule (ASME BPVC VIII-1 App. 2, 2-5)"],
        rows,
        left={0, 1, 4},
        cls="small",
    )
    return (
        '<section id="app2"><div class="keep">'
        "<h2>3. Required bolt load (ASME BPVC VIII-1 Appendix 2)</h2>"
        f"<p>Design pressure P = {_pressure(u, s.pressure)}; gasket factors m = {g.m:g}, y = "
        f"{_q(u, 'stress', g.y)}; allowable bolt stress S<sub>b</sub> = "
        f"{_q(u, 'stress', s.allowable_stress)}, S<sub>a</sub> = "
        f"{_q(u, 'stress', s.allowable_stress_ambient)}. Forces for all bolts, and per bolt "
        f"[{F}].</p>"
        f"{table}<p class=meta>The code's own constants are used (0.785 and 3.14 for &pi;/4 "
        "and &pi;).</p></div></section>"
    )


def _window_bar(r: FlangeResult, u: DisplayUnits) -> str:
    lo, hi = r.window
    fmin, fmax = r.assembly_range
    top = max(lo, hi, fmax, r.target) * 1.1
    if not top > 0:
        return ""

    def pct(v: float) -> str:
        return f"{max(0.0, min(100.0, 100 * v / top)):.2f}%"

    def width(a: float, b: float) -> str:
        return f"{max(0.0, 100 * (b - a) / top):.2f}%"

    band = (
        f'<span class="win" style="left:{pct(lo)};width:{width(lo, hi)}"></span>'
        if lo <= hi
        else f'<span class="gap" style="left:{pct(hi)};width:{width(hi, lo)}"></span>'
    )
    bar = (
        f'<div class="track">{band}'
        f'<span class="asm" style="left:{pct(fmin)};width:{width(fmin, fmax)}"></span>'
        f'<span class="tgt" style="left:{pct(r.target)}"></span></div>'
        f'<div class="scale"><span>0</span><span>{_q(u, "force", top)}</span></div>'
    )
    key = (
        '<p class=meta><span class="key win"></span>preload window'
        if lo <= hi
        else '<p class=meta><span class="key gap"></span>empty window (between the bounds)'
    ) + (
        '<span class="key asm"></span>assembly preload F<sub>M,min</sub> .. F<sub>M,max</sub>'
        '<span class="key tgt"></span>target preload</p>'
    )
    return (
        f'<div class="window" role="img" aria-label="Preload window, assembly range and '
        f'target per bolt">{bar}</div>{key}'
    )


def _window(r: FlangeResult, u: DisplayUnits) -> str:
    s = r.spec
    g = s.gasket
    n = s.bolt_count
    lo, hi = r.window
    seat = r.app2.Wm2 / n
    crush = g.max_stress * g.area / n
    F = _lab(u, "force")
    S = _lab(u, "stress")

    def row(label: str, f: float, basis: str) -> list[str]:
        return [label, _n(u, "force", f), _n(u, "stress", f * n / g.area), basis]

    rows = [row("<b>lower bound</b>", lo, _e(r.window_reasons[0]))]
    if r.window_reasons[0] != "gasket seating (W_m2/N)":
        rows.append(row("gasket seating", seat, "W<sub>m2</sub>/N (ASME VIII-1 App. 2)"))
    rows.append(row("<b>upper bound</b>", hi, _e(r.window_reasons[1])))
    if r.window_reasons[1] != "gasket crush limit":
        rows.append(row("gasket crush limit", crush, _e(f"gasket data: {g.name}")))
    if r.window_reasons[1] != "bolt permissible preload":
        rows.append(
            row(
                "bolt permissible preload",
                r.permissible_preload,
                f"VDI 2230-1:2015 R7 (&nu; = {s.utilization:g})",
            )
        )
    rows += [
        row("target preload", r.target, "nominal preload of the final pass"),
        row("smallest assembly preload", r.assembly_range[0], "F<sub>M,min</sub>"),
        row("largest assembly preload", r.assembly_range[1], "F<sub>M,max</sub>"),
    ]
    table = _table(
        ["per bolt", f"preload [{F}]", f"mean gasket stress [{S}]", "basis"],
        rows,
        left={0, 3},
        cls="small",
    )
    fmin, fmax = r.assembly_range
    if lo > hi:
        verdict = (
            "The window is empty: no preload both seats the gasket (and keeps it tight in "
            "service) and stays below the upper bound."
        )
    elif lo <= fmin and fmax <= hi * (1 + 1e-9):
        verdict = "The whole assembly range lies inside the window."
    else:
        verdict = "The assembly range reaches outside the window."
    return (
        '<section id="window"><div class="keep"><h2>4. Gasket stress window</h2>'
        "<p>The preload each bolt may carry after assembly: at least enough to seat the gasket "
        "and to keep the gasket load H<sub>p</sub> in service (with the loss of gasket load "
        "from assembly to service found with the ring model), at most the gasket crush limit "
        "and the bolt's permissible preload. Gasket stress: the preload of all bolts over the "
        f"gasket contact area {_q(u, 'area', g.area)}.</p>"
        f"{_window_bar(r, u)}</div>{table}<p>{_e(verdict)}</p></section>"
    )


def _bolts(r: FlangeResult, u: DisplayUnits) -> str:
    s = r.spec
    n = s.bolt_count
    F = _lab(u, "force")
    tens = r.tensioning
    rows = []
    for i in range(n):
        rows.append(
            [
                str(i + 1),
                f"{360.0 * i / n:.1f}",
                *(_n(u, "force", float(p[i])) for p in r.passes),
                *([] if tens else [_n(u, "force", float(r.compensated_targets[i]))]),
                _n(u, "force", float(r.working_loads[i])),
                _n(u, "force", float(r.service_bolt[i])),
                _n(u, "force", float(r.service_gasket[i])),
            ]
        )
    heads = (
        ["bolt", "angle [&deg;]"]
        + [f"pass {k + 1} ({100 * f:.4g} %)" for k, f in enumerate(r.pass_fractions)]
        + ([] if tens else ["1-pass target"])
        + [
            "working load F<sub>A</sub>",
            "bolt in service",
            "gasket in service",
        ]
    )
    table = _table(heads, rows, left=set(), cls="small bolts")
    comp = r.compensated_final
    comp_spread = (
        float((np.max(comp) - np.min(comp)) / np.mean(comp)) if float(np.mean(comp)) > 0 else 0.0
    )
    # a short table stays on one page with its heading; a long one may break between rows
    keep = ' class="keep"' if n <= 16 else ""
    comp_text = (
        ""
        if tens
        else (
            "the compensated target of a single pass (each bolt tightened once, in the order of "
            "pass 1, to the value that leaves every bolt at the target once all are done), "
        )
    )
    comp_after = (
        ""
        if tens
        else f"; a single pass with the compensated targets ends with a spread of {comp_spread:.2%}"
    )
    return (
        f'<section id="bolts"><div{keep}><h2>6. Bolt by bolt</h2>'
        f'<p class="lead">Forces per bolt [{F}]: the preload after each tightening pass, '
        f"{comp_text}the working load "
        "from pressure, axial force and bending moment, and the bolt and gasket-sector loads in "
        "service. Angles are measured from bolt 1; a positive bending moment loads bolt 1 most."
        f"</p>{table}</div>"
        f"<p class=meta>After the last pass the preloads spread by {r.final_spread:.1%} "
        f"((max &minus; min)/mean){comp_after}. Equilibrium residual in service: "
        f"{_q(u, 'force', r.equilibrium_residual)}.</p></section>"
    )


def _service(r: FlangeResult, u: DisplayUnits, figure: str) -> str:
    """The heat cycle per bolt, the ring's rotation and the pressure's effect."""
    c = r.cycle
    if c is None:
        return ""
    s = r.spec
    A = r.sector_area
    S, F = _lab(u, "stress"), _lab(u, "force")
    names = ("start_up", "hot", "cooled", "shut_down")
    rows = []
    for i in range(s.bolt_count):
        rows.append(
            [str(i + 1), _n(u, "stress", float(r.assembly_gasket[i]) / A)]
            + [_n(u, "stress", float(c[k].gasket[i]) / A) for k in names]
            + [_n(u, "force", float(r.passes[-1][i]))]
            + [_n(u, "force", float(c[k].bolt[i])) for k in names]
        )
    heads = (
        ["bolt", f"gasket after passes [{S}]"]
        + [f"{k.replace('_', '-')} [{S}]" for k in names]
        + [f"bolt after passes [{F}]"]
        + [f"{k.replace('_', '-')} [{F}]" for k in names]
    )
    table = _table(heads, rows, left=set(), cls="small bolts")
    rot = r.rotation_dict()
    pe = r.pressure_effect
    if rot["enabled"]:
        rot_text = (
            f"The flange rings turn as a whole (ring theory, K<sub>&theta;</sub> = "
            f"{rot['stiffness_Nm_per_rad'] / 1e3:.4g} kN&middot;m/rad per ring, lever h<sub>G</sub> "
            f"= {u.fmt('length', r.lever)}&nbsp;{_lab(u, 'length')}): "
            f"{rot['assembly_max_deg']:.3f}&deg; after the passes and "
            f"{rot['service_max_deg']:.3f}&deg; at start-up, against the rigidity limit of "
            "ASME VIII-1 App. 2-14 (0.2&deg; for a loose-type flange)."
        )
    else:
        rot_text = "The flange rings translate only (flange.rotation = false)."
    lf = pe.get("load_factor")
    pe_text = (
        f"The pressure and external loads ({_q(u, 'force', pe['working_load_N'])} in all) raise "
        f"the bolt loads by {_q(u, 'force', pe['bolt_load_increase_N'])} in all and lower the "
        f"gasket load by {_q(u, 'force', pe['gasket_load_decrease_N'])}"
        + (f" (load factor {lf:.3g})" if lf is not None else "")
        + "; ASME App. 2 assumes the bolts carry all of it (W<sub>m1</sub> = H + H<sub>p</sub> = "
        f"{_q(u, 'force', pe['app2_operating_N'])})."
    )
    return (
        '<section id="service"><div class="keep"><h2>7. Heat cycle and rotation</h2>'
        f'<p class="lead">Gasket stress of each bolt sector [{S}] and bolt load [{F}] after '
        "the passes and through the heat cycle: start-up (hot, pressurised), hot after creep "
        f"relaxation ({_e(c.relaxation_basis)}), cooled back under pressure, and shut down. "
        f"Operating minimum H<sub>p</sub>/N: "
        f"{_q(u, 'stress', r.app2.Hp / s.bolt_count / A)}; seating y: "
        f"{_q(u, 'stress', s.gasket.y)}; crush: {_q(u, 'stress', s.gasket.max_stress)}.</p>"
        f"{table}</div>{figure}"
        f"<p>{rot_text}</p><p>{pe_text}</p></section>"
    )


def _passes(r: FlangeResult, u: DisplayUnits, figure: str) -> str:
    s = r.spec
    if r.tensioning is not None:
        return _tension_passes(r, u, figure)
    rows = []
    for k, (frac, pattern, order, forces) in enumerate(
        zip(s.passes, s.patterns, r.orders, r.passes, strict=True)
    ):
        rows.append(
            [
                str(k + 1),
                f"{100 * frac:g} %",
                _n(u, "force", frac * r.target),
                _e(pattern),
                "-".join(str(b + 1) for b in order),
                f"{_n(u, 'force', float(np.min(forces)))}&nbsp;..&nbsp;"
                f"{_n(u, 'force', float(np.max(forces)))}",
            ]
        )
    F = _lab(u, "force")
    table = _table(
        [
            "pass",
            "of the target",
            f"each bolt to [{F}]",
            "pattern",
            "order (bolt numbers)",
            f"after the pass [{F}]",
        ],
        rows,
        left={3, 4},
        cls="small",
    )
    return (
        '<section id="passes"><div class="keep"><h2>5. Tightening passes</h2>'
        "<p>Each pass turns every nut, in the order given, until its bolt carries the pass's "
        "share of the target; tightening a bolt compresses the gasket and the ring under it and "
        "so unloads its neighbours (elastic interaction, ring network of the flange).</p>"
        f"{table}</div>{figure}</section>"
    )


def _tension_passes(r: FlangeResult, u: DisplayUnits, figure: str) -> str:
    """The tensioning passes: which bolts, the applied tension, the preloads left."""
    t = r.tensioning
    assert t is not None
    F = _lab(u, "force")
    rows = []
    for k, (label, bolts, applied, forces) in enumerate(
        zip(t.labels, t.sets, t.applied, r.passes, strict=True)
    ):
        rows.append(
            [
                str(k + 1),
                _e(label),
                _n(u, "force", applied),
                "-".join(str(b + 1) for b in bolts) if len(bolts) < r.spec.bolt_count else "all",
                f"{_n(u, 'force', float(np.min(forces)))}&nbsp;..&nbsp;"
                f"{_n(u, 'force', float(np.max(forces)))}",
            ]
        )
    table = _table(
        ["pass", "tensioners", f"applied tension [{F}]", "bolts", f"after the pass [{F}]"],
        rows,
        left={1, 3},
        cls="small",
    )
    how = {
        "all": "A tensioner on every bolt pulls all bolts at once; the nuts are run down and "
        "the tools let go together.",
        "half": "Tensioners on every other bolt: the first set is overtensioned so that, once "
        "the second set is tensioned (which unloads the first through the gasket and the ring), "
        "both sets end with the same mean preload; a check pass on the first set turns only "
        "the nuts that are still short (common practice of 50 % tool coverage, from memory).",
        "sequence": "One tensioner, bolt by bolt, in the order and shares of the passes; each "
        "bolt tensioned unloads its neighbours (elastic interaction).",
    }[t.coverage]
    return (
        '<section id="passes"><div class="keep"><h2>5. Tensioning passes</h2>'
        f"<p>{_e(how)} When a tool lets go, its nut keeps about "
        f"{t.load_transfer_factor:.0%} of the applied tension (load transfer factor, "
        f"{_e(t.load_transfer_basis)}); the ring network of the flange carries the interaction "
        "between bolts.</p>"
        f"{table}</div>{figure}</section>"
    )


def _checks(r: FlangeResult, u: DisplayUnits) -> str:
    return (
        '<section id="checks"><h2>7. Checks</h2>'
        f"{MARGIN_NOTE}{_checks_table(r.checks, u, _check_values)}</section>"
    )


def _notes(r: FlangeResult, u: DisplayUnits | None = None) -> str:
    notes = (
        "".join(f"<li>{_e(x if u is None else localize(x, u))}</li>" for x in r.notes)
        or "<li>None.</li>"
    )
    model = (
        "<li>Ring model: one sector per bolt, the bolt (tension only; for a flange pair half "
        "the bolt against the plane of symmetry), the flange ring under the bolt (VDI 2230-1 "
        "cone over the flange thickness) and the gasket sector (compression only, loading "
        "curve, unloading along the stiffer unloading modulus) in a spring network; "
        "neighbouring bolts are coupled through the ring as fixed-guided beams over one bolt "
        "pitch (Roark; from memory).</li>"
        "<li>Working loads: hydrostatic end force and axial force shared equally, the bending "
        "moment as 4 M cos&theta;<sub>i</sub>/(N D<sub>bc</sub>) per bolt, all applied at the "
        "gasket.</li>"
        "<li>Torque per bolt per VDI 2230-1:2015 R13 and ISO 16047: M<sub>A</sub> = "
        "F<sub>M</sub> (0.16 P + 0.58 d<sub>2</sub> &mu;<sub>G</sub> + &mu;<sub>K</sub> "
        "D<sub>Km</sub>/2); the target preload at the mean friction.</li>"
    )
    return (
        '<section id="notes"><h2>8. Notes and assumptions</h2>'
        f"<h3>Notes</h3><ul class=notes>{notes}</ul>"
        f"<h3>Assumptions</h3><ul class=notes>{model}</ul></section>"
    )


def _references() -> str:
    items = "".join(f"<li>{x}</li>" for x in REFERENCES)
    return (
        '<section id="references"><h2>9. References</h2>'
        "<p class=meta>The published methods and data the calculation uses; each check above "
        "names its clause.</p>"
        f'<ol class="refs">{items}</ol></section>'
    )


# --------------------------------------------------------------------------- files


def _bolts_csv(r: FlangeResult) -> str:
    d = r.to_dict()
    buf = io.StringIO()
    w = csv.writer(buf, lineterminator="\n")
    keys = [
        "bolt",
        "angle_deg",
        *(f"pass_{k + 1}_N" for k in range(len(r.passes))),
        "compensated_target_N",
        "working_load_N",
        "service_load_N",
        "gasket_force_assembly_N",
        "gasket_force_service_N",
        *(
            f"{q}_{k}_N"
            for q in ("bolt_load", "gasket_force")
            for k in ("hot", "cooled", "shut_down")
            if r.cycle is not None
        ),
    ]
    w.writerow(keys)
    for i, b in enumerate(d["bolts"]):
        row = [str(b["bolt"]), repr(float(b["angle_deg"]))]
        row += [repr(float(p[i])) for p in d["passes"]]
        row += ["" if b[k] is None else repr(float(b[k])) for k in keys[2 + len(r.passes) :]]
        w.writerow(row)
    return buf.getvalue()


def render_flange_report(
    doc: InputDocument,
    result: FlangeResult,
    units: str = "si",
    now: datetime | None = None,
) -> dict[str, str]:
    """Render the flange report files of ``result`` in memory: ``{file name: content}``.

    The HTML report (the passes figure inline as SVG), the JSON result
    (``result.to_dict()`` with a ``report`` block naming the tool version, the
    date and the input's SHA-256) and two CSV files (bolts, checks).  Nothing is
    written here; the page comes last.
    """
    from ..plots import gasket_states_plot, passes_plot

    u = UNIT_SYSTEMS[units]
    now = now or datetime.now(UTC)
    stamp = now.strftime("%Y-%m-%d %H:%M UTC")
    name = Path(doc.path).name
    stem = file_stem(doc, "flange")
    names = flange_report_file_names(stem)
    s = result.spec
    g = s.gasket
    n = s.bolt_count

    figure = _figure(
        passes_plot(result.passes, n, target=result.target, units=units),
        "f1",
        "Preload of each bolt after each tightening pass",
        "Figure 1. Preload of each bolt after each tightening pass (lighter: earlier passes), "
        "with the target preload of the final pass; solved with the ring network, so a bolt "
        "tightened early loses preload as its neighbours are tightened.",
    )
    figure2 = ""
    if result.cycle is not None:
        A = result.sector_area
        c = result.cycle
        states = {"assembly": result.assembly_gasket / A}
        states.update({k: c[k].gasket / A for k in ("start_up", "hot", "cooled", "shut_down")})
        figure2 = _figure(
            gasket_states_plot(
                states,
                g.y,
                result.app2.Hp / n / A,
                g.max_stress,
                units=units,
                labels={
                    "assembly": "after the passes",
                    "start_up": "start-up",
                    "hot": "hot, relaxed",
                    "cooled": "cooled, pressurised",
                    "shut_down": "shut down",
                },
            ),
            "f2",
            "Gasket stress at each bolt through the heat cycle",
            "Figure 2. Gasket stress of each bolt sector after the passes and through the heat "
            "cycle, against the seating stress y, the operating minimum H_p/N per sector area "
            "and the crush limit (nominal preload).",
        )
    L = _lab(u, "length")
    head = (
        f"<header><h1>{_e(s.title)}</h1>"
        f'<p class="sub">Gasketed flange calculation report &middot; {n} &times; '
        f"{_e(s.thread.designation)} grade {_e(s.grade.name)} on a "
        f"{u.fmt('length', s.bolt_circle)}&nbsp;{L} bolt circle; {_e(g.name)} gasket "
        f"{u.fmt('length', g.inner_diameter)} &times; {u.fmt('length', g.outer_diameter)} "
        f"&times; {u.fmt('length', g.thickness)}&nbsp;{L}; "
        f"{'flange pair' if s.mating == 'flange' else 'flange on a rigid face'}</p>"
        f'<p class="meta">clampstack {_e(__version__)} &middot; {_e(stamp)} &middot; input '
        f'<code>{_e(name)}</code> &middot; SHA-256 <span class="hash">{_e(doc.sha256)}</span>'
        "</p></header>"
    )
    body = "".join(
        [
            head,
            _summary(result, u),
            _inputs(doc, result, u),
            _app2(result, u),
            _window(result, u),
            _passes(result, u, figure),
            _bolts(result, u),
            _service(result, u, figure2),
            _checks(result, u),
            _notes(result, u),
            _references(),
            f"<footer><div class=caution>{_e(FLANGE_CAUTION)}</div>"
            f'<p class="meta">Generated by clampstack {_e(__version__)} on {_e(stamp)} from '
            f'<code>{_e(name)}</code>, SHA-256 <span class="hash">{_e(doc.sha256)}</span>. '
            f"Results beside this file: <code>{_e(names['json'])}</code>, "
            f"<code>{_e(names['bolts'])}</code>, <code>{_e(names['checks'])}</code>.</p>"
            "</footer>",
        ]
    )
    page = _page(
        s.title,
        __version__,
        f"clampstack {__version__} - {name} (SHA-256 {doc.sha256[:12]}) - {s.title}",
        _renumber(body),
        _WINDOW_CSS,
    )
    data = result.to_dict()
    data["report"] = report_block(doc, now, units, __version__)
    return {
        names["json"]: json.dumps(data, indent=2, allow_nan=False) + "\n",
        names["bolts"]: _bolts_csv(result),
        names["checks"]: _checks_csv(data["checks"]),
        names["html"]: page,
    }
