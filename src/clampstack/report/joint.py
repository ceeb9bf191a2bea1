"""HTML calculation report of a single-bolt joint, with JSON and CSV beside it.

The page is self-contained: inline CSS, figures as inline SVG, no scripts, no
fonts or images to fetch and no URL at all.  It prints on A4 and on Letter
(``@page`` margins that fit both, page numbers in the page margin, break rules
that keep headings with what follows and figures and table rows whole).
"""

from __future__ import annotations

import csv
import io
import json
from datetime import UTC, datetime
from pathlib import Path
from typing import Any

from .._version import __version__
from ..errors import InputError
from ..inputs.files import InputDocument, file_stem
from ..joint.analysis import JointResult
from ..outputs.joint import _margin, _mu, case_rows, check_value, eccentric_lines, governing
from ..outputs.text import (
    CAUTION,
    UNIT_SYSTEMS,
    DisplayUnits,
    default_text,
    fmt_number,
    localize,
)
from ._common import (
    _T,
    MARGIN_NOTE,
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
from ._common import _checks_csv as _checks_csv_rows

C0 = 273.15
SWEEP_MARGIN = 20.0  # K beyond the assembly and service temperatures
SCATTER_SAMPLES = 100_000  # Monte Carlo samples of the report's scatter section
SCATTER_SEED = 0

#: cited only when the report holds the scatter section
SCATTER_REFERENCE = (
    "Clopper, C. J., Pearson, E. S., &ldquo;The use of confidence or fiducial limits "
    "illustrated in the case of the binomial&rdquo;, <i>Biometrika</i> 26 (1934) "
    "404&ndash;413 (the 95 % intervals of the scatter probabilities)."
)

REFERENCES: tuple[str, ...] = (
    "VDI 2230 Part 1:2015, <i>Systematic calculation of highly stressed bolted joints &mdash; "
    "Joints with one cylindrical bolt</i>. VDI, D&uuml;sseldorf.",
    "ISO 898-1:2013, <i>Mechanical properties of fasteners made of carbon steel and alloy "
    "steel &mdash; Part 1: Bolts, screws and studs with specified property classes &mdash; "
    "Coarse thread and fine pitch thread</i>.",
    "ISO 16047:2005, <i>Fasteners &mdash; Torque/clamp force testing</i>.",
    "Budynas, R. G., Nisbett, J. K., <i>Shigley's Mechanical Engineering Design</i>, "
    "McGraw-Hill, chapter 8 (screws, fasteners and the design of non-permanent joints).",
    "Wileman, J., Choudhury, M., Green, I., &ldquo;Computation of member stiffness in bolted "
    "connections&rdquo;, <i>Journal of Mechanical Design</i> 113 (1991) 432&ndash;437.",
    "Alexander, E. M., &ldquo;Analysis and design of threaded assemblies&rdquo;, SAE Technical "
    "Paper 770420, 1977.",
    "FED-STD-H28/2, <i>Screw-thread standards for federal services</i>, section 2.",
    "ISO 68-1, ISO 261, ISO 262, ISO 724 (ISO general purpose metric screw threads); "
    "ASME B1.1-2019, <i>Unified Inch Screw Threads</i>.",
    "ISO 273:1979 (clearance holes); ISO 4014, ISO 4032, ISO 4762 (dimensions of hexagon "
    "head bolts, hexagon nuts and socket head cap screws).",
    "ISO 3506-1 (stainless steel fasteners), SAE J429 (inch-series bolts), ASTM A193/A193M "
    "(bolting for high-temperature service), ASME BPVC Section II Part D (material "
    "properties at temperature): catalog data, each row with its source "
    "(<code>clampstack catalog</code>).",
    "Przemieniecki, J. S., <i>Theory of Matrix Structural Analysis</i>, McGraw-Hill, 1968, "
    "chapter 3 (the direct stiffness method of the spring network).",
)


def report_file_names(stem: str) -> dict[str, str]:
    """Names of the report files for an input file named ``stem`` (without extension)."""
    return {
        "html": f"{stem}.html",
        "json": f"{stem}.json",
        "states": f"{stem}-states.csv",
        "checks": f"{stem}-checks.csv",
    }


# --------------------------------------------------------------------------- sections


ANSWER_CSS = (
    "figure.compact{margin:.2rem 0 .1rem}figure.compact svg.figure{width:62%;margin:0 auto}"
    "table.margins td,table.margins th{font-size:8pt;padding:.03rem .35rem}"
    "div.details{break-before:page;page-break-before:always}"
)


def _margins(r: JointResult, u: DisplayUnits) -> str:
    """Every check's value, limit and margin in one compact table (the answer's page)."""
    rows = []
    for c in r.checks:
        v, lim = check_value(c, u)
        verdict = (
            '<span class="off">off</span>'
            if c.skipped
            else (
                '<span class="pass">pass</span>' if c.passed else '<span class="fail">FAIL</span>'
            )
        )
        row = [_e(c.name), _e(v), _e(c.relation), _e(lim), _e(_margin(c)), verdict]
        if r.cases:
            row.append(_e((c.extra or {}).get("governing_case", "")))
        rows.append(row)
    head = ["check", "value", "", "limit", "margin", "result"] + (["case"] if r.cases else [])
    return _table(head, rows, left={0, 5, 6}, cls="small margins")


def _summary(r: JointResult, u: DisplayUnits, compact_diagram: str = "") -> str:
    s = r.spec
    tr = s.tightening
    gov = governing(r)
    verdict = verdict_html(r.checks, gov)
    if r.angle is not None:
        a = r.angle
        t0, t1, t2 = r.torque
        spec = (
            f'<div class="spec"><span>Snug torque, then angle</span>'
            f'<span class="big">{_f(u, "torque", t0)} + {a["angle_min_deg"]:.4g}..'
            f"{a['angle_max_deg']:.4g}&deg;</span>"
            f"<span>snug min {_f(u, 'torque', t1)} &middot; max {_f(u, 'torque', t2)}</span>"
            f"<span>method angle; thread friction {_e(_mu(tr.thread_friction))}, "
            f"head friction {_e(_mu(tr.head_friction))}</span></div>"
        )
    elif r.torque is not None:
        t0, t1, t2 = r.torque
        spec = (
            f'<div class="spec"><span>Tightening torque</span>'
            f'<span class="big">{_f(u, "torque", t0)}</span>'
            f"<span>min {_f(u, 'torque', t1)} &middot; max {_f(u, 'torque', t2)}</span>"
            f"<span>method {_e(tr.method)}; thread friction {_e(_mu(tr.thread_friction))}, "
            f"head friction {_e(_mu(tr.head_friction))}</span></div>"
        )
    else:
        spec = (
            f'<div class="spec"><span>Method {_e(tr.method)}</span>'
            f'<span class="big">{_f(u, "force", r.assembly_min)} .. '
            f"{_f(u, 'force', r.assembly_max)}</span><span>assembly preload (no torque "
            "specification)</span></div>"
        )
    svc = s.service
    rows = [
        (
            "Assembly preload F<sub>M,min</sub> .. F<sub>M,max</sub>",
            f"{_f(u, 'force', r.assembly_min)} .. {_f(u, 'force', r.assembly_max)} "
            f"(permissible {_f(u, 'force', r.permissible_preload)})",
        ),
        ("Maximum bolt load", _f(u, "force", r.bolt_load_max)),
        (
            "Minimum residual clamp load F<sub>KR,min</sub>",
            f"{_f(u, 'force', r.residual_clamp_min)} (required "
            f"{_f(u, 'force', r.required_clamp_load)})",
        ),
        (
            "Separation load F<sub>A,sep</sub>",
            f"{_f(u, 'force', r.separation_load)} (maximum axial load "
            f"{_f(u, 'force', svc.axial_load[1])})",
        )
        if r.eccentric is None
        else (
            "Opening: clamp load against opening F<sub>Kab</sub>, opening load F<sub>A,ab</sub>",
            _opening_text(r, u),
        ),
        (
            "Load factor " + ("&Phi;<sub>en</sub>*" if r.eccentric else "&Phi;<sub>n</sub>"),
            f"{r.load_factor:.4g} at assembly, {r.load_factor_service:.4g} in service "
            f"(n = {svc.load_height:.3g})",
        ),
        (
            "Temperatures",
            f"assembly {_T(u, svc.assembly_temperature)}, service {_T(u, svc.temperature)}",
        ),
    ]
    cases = ""
    if r.cases:
        head, crow = case_rows(r, u)
        cases = (
            f"<p>{len(r.cases)} load cases; each check below gives its worst case, the states "
            f"are those of the governing case <b>{_e(r.governing_case or '')}</b>.</p>"
            + _table(
                [_e(h) for h in head],
                [[_e(x) for x in row] for row in crow],
                left={0, 5, 6},
                cls="small",
            )
        )
    gov_case = ""
    if r.cases and gov is not None:
        gc = (gov.extra or {}).get("governing_case", r.governing_case)
        gov_case = f"<p>Governing load case: <b>{_e(gc)}</b> (of {len(r.cases)}).</p>"
    # the answer on the first page: verdict, tightening, every margin, the diagram, caution;
    # the key figures and the cases follow on the next page
    return (
        '<section id="summary"><h2>1. Summary</h2>'
        f"{verdict}{gov_case}{spec}{_margins(r, u)}{compact_diagram}"
        f'<div class="caution">{_e(CAUTION)}</div>'
        f'<div class="details"><h3>Key figures</h3>{_kv(rows)}{cases}</div></section>'
    )


def _opening_text(r: JointResult, u: DisplayUnits) -> str:
    e = r.eccentric
    assert e is not None
    if e["edge_open_at_assembly"]:
        return "the preload alone lifts edge u (the bolt lies outside the interface's core)"
    if e["open_at_assembly"]:
        lam = e["opening_load_ratio"]
        return (
            "the preload alone lifts the edge away from u; edge u "
            + (f"opens at {lam:.3g} x the maximum load" if lam is not None else "stays closed")
            + " (contact model)"
        )
    fab = (
        _f(u, "force", e["opening_load_N"])
        if e["opening_load_N"] is not None
        else "none along the service load"
    )
    return (
        f"{_f(u, 'force', e['opening_clamp_load_N'])}; {fab} (maximum axial load "
        f"{_f(u, 'force', r.spec.service.axial_load[1])}"
        + ("; the interface opens: contact model" if e["opened"] else "")
        + ")"
    )


def _eccentric(r: JointResult, u: DisplayUnits) -> str:
    """The eccentric joint's quantities (VDI 2230-1:2015, 5.1.2.3, 5.3.2, 5.5.3)."""
    if r.eccentric is None:
        return ""
    lines = "".join(f"<li>{_e(x)}</li>" for x in eccentric_lines(r, u))
    return (
        '<div class="keep"><h3>Eccentric clamping and loading</h3>'
        "<p>The bending resilience of the clamped body adds to its axial resilience at the "
        "bolt line (VDI 2230-1:2015, 5.1.2.3): &delta;<sub>P</sub>* = &delta;<sub>P</sub> + "
        "s<sub>sym</sub><sup>2</sup> l<sub>K</sub>/(E<sub>P</sub> I<sub>Bers</sub>) for the "
        "preload, &delta;<sub>P</sub>** = &delta;<sub>P</sub> + s<sub>sym</sub> a "
        "l<sub>K</sub>/(E<sub>P</sub> I<sub>Bers</sub>) for the working load, "
        "&Phi;<sub>en</sub>* = n &delta;<sub>P</sub>**/(&delta;<sub>S</sub> + "
        "&delta;<sub>P</sub>*). The interface edge u opens when the residual clamp load falls "
        "to F<sub>Kab</sub> (5.3.2, Navier's linear pressure over the interface). Beyond the "
        "opening point these linear relations no longer hold: the states come from a contact "
        "model (a compression-only bed over the interface inside the clamped body's "
        "resilience; our model, not in VDI 2230), which reproduces them exactly while the "
        "interface is closed. The bolt's bending stress follows the rotation of the clamped "
        "body and enters the fatigue check (5.5.3).</p>"
        f"<ul>{lines}</ul></div>"
    )


def _inputs(doc: InputDocument, r: JointResult, u: DisplayUnits | None = None) -> str:
    name = Path(doc.path).name
    defaults = (
        _table(
            ["key", "value applied"],
            [
                [
                    f"<code>{_e(k)}</code>",
                    _e(v if u is None else default_text(v, u, k)),
                ]
                for k, v in r.defaults
            ],
            left={0, 1},
            cls="small",
        )
        if r.defaults
        else "<p>No defaults were applied: every value was given.</p>"
    )
    return (
        '<section id="inputs"><h2>2. Inputs</h2>'
        f"<p>The input file <code>{_e(name)}</code> as entered (quantities with their units; "
        f'SHA-256 <span class="hash">{_e(doc.sha256)}</span>):</p>'
        f'<pre class="input">{_e(doc.text.rstrip())}</pre>'
        "<h3>Defaults applied</h3>"
        "<p>Values the input did not give, and what was used instead:</p>"
        f"{defaults}</section>"
    )


def _model(r: JointResult, u: DisplayUnits, schematic: str) -> str:
    s = r.spec
    b = s.bolt
    sp, sps = r.springs, r.springs_service
    stiff = _lab(u, "stiffness")
    rows = [
        ("Bolt", _e(f"{b.thread.designation} grade {b.grade.name}, {b.head} head")),
        (
            "Bolt stiffness 1/&delta;<sub>S</sub>",
            f"{u.fmt('stiffness', 1 / sp.delta_S)} {stiff} (service "
            f"{u.fmt('stiffness', 1 / sps.delta_S)} {stiff})",
        ),
        (
            "Clamped-part stiffness 1/&delta;<sub>P</sub>",
            f"{u.fmt('stiffness', 1 / sp.delta_P)} {stiff} (service "
            f"{u.fmt('stiffness', 1 / sps.delta_P)} {stiff}); model "
            f"<code>{_e(s.clamp_model)}</code>",
        ),
        (
            "Load factors",
            f"&Phi;<sub>K</sub> = {sp.load_factor_K:.4g}, &Phi;<sub>n</sub> = n &Phi;<sub>K</sub> "
            f"= {r.load_factor:.4g} (n = {s.service.load_height:.3g})",
        ),
        ("Clamp length l<sub>K</sub>", _f(u, "length", s.clamp_length)),
        (
            "Smallest section A<sub>0</sub>",
            f"{_f(u, 'area', r.A0)} (d<sub>0</sub> = {_f(u, 'length', r.d0)}); stress area "
            f"A<sub>s</sub> = {_f(u, 'area', b.thread.As)}",
        ),
    ]
    seg_rows = [
        [_e(name), u.fmt("length", length), f"{res * 1e9:.4g}"] for name, length, res in sp.segments
    ]
    segs = _table(
        ["bolt segment", f"length [{_lab(u, 'length')}]", "resilience [&micro;m/kN]"],
        seg_rows,
        cls="small",
    )
    lay_rows = []
    for lay in s.layers:
        lay_rows.append(
            [
                _e(lay.name),
                _e(lay.kind),
                _e(lay.material.name),
                u.fmt("length", lay.thickness),
                u.fmt("length", lay.hole),
                u.fmt("length", lay.outer_diameter) if lay.outer_diameter else "full cone",
                f"{u.temp(lay.temperature):.4g}",
            ]
        )
    L = _lab(u, "length")
    layers = _table(
        [
            "clamped part",
            "kind",
            "material",
            f"thickness [{L}]",
            f"hole [{L}]",
            f"outer diameter [{L}]",
            f"service [&deg;{'F' if u.us else 'C'}]",
        ],
        lay_rows,
        left={0, 1, 2},
        cls="small",
    )
    return (
        '<section id="model"><div class="keep"><h2>3. Model</h2>'
        "<p>The joint is an axial spring network (VDI 2230-1:2015, 5.3): the bolt in parallel "
        "with the clamped parts, which are split at the load introduction planes A and B. The "
        "bolt carries tension only, the part between A and B (it holds the interface) "
        "compression only, so separation comes out of the solve. The preload is a length "
        "misfit of the bolt, embedding a shortening of the clamped stack, temperature a free "
        "thermal elongation of every part.</p>"
        f"{schematic}</div>{_kv(rows)}{segs}{layers}{_eccentric(r, u)}</section>"
    )


def _diagrams(diagram: str, loads: str) -> str:
    return f'<section id="diagram"><h2>4. Joint load diagram</h2>{diagram}{loads}</section>'


def _states(r: JointResult, u: DisplayUnits) -> str:
    F = _lab(u, "force")
    rows = [
        [
            _e(st.label),
            u.fmt("force", st.axial_load),
            u.fmt("force", st.bolt_min),
            u.fmt("force", st.bolt_max),
            u.fmt("force", st.clamp_min),
            u.fmt("force", st.clamp_max),
        ]
        for st in r.states
    ]
    return (
        '<section id="states"><h2>5. States</h2>'
        + _table(
            [
                "state",
                f"F<sub>A</sub> [{F}]",
                f"bolt load, min [{F}]",
                f"bolt load, max [{F}]",
                f"clamp load, min [{F}]",
                f"clamp load, max [{F}]",
            ],
            rows,
        )
        + "<p class=meta>min: minimum assembly preload with embedding (governs the residual "
        "clamp load); max: maximum assembly preload, embedding not counted (governs the bolt "
        "load; VDI 2230-1 R8, R10).</p></section>"
    )


def _checks(r: JointResult, u: DisplayUnits) -> str:
    return (
        '<section id="checks"><h2>6. Checks</h2>'
        f"{MARGIN_NOTE}{_checks_table(r.checks, u)}</section>"
    )


def _tightening(r: JointResult, u: DisplayUnits) -> str:
    s = r.spec
    tr = s.tightening
    rows = [("Method", _e(tr.method))]
    if tr.lubricant:
        rows.append(("Lubricant or coating", f"<code>{_e(tr.lubricant)}</code> (catalog friction)"))
    if tr.tool:
        rows.append(("Torque tool", f"<code>{_e(tr.tool)}</code> (catalog tools)"))
    if tr.nut_factor is not None:
        rows.append(
            (
                "Nut factor K (T = K F d)",
                f"{_e(_mu(tr.nut_factor))}; it lumps friction and geometry, the friction below "
                "is what it implies",
            )
        )
    if r.angle is not None:
        a = r.angle
        rows += [
            (
                "Snug torque, then angle",
                f"<b>{_f(u, 'torque', r.torque[0])}</b> (range {_f(u, 'torque', r.torque[1])} .. "
                f"{_f(u, 'torque', r.torque[2])}), then {a['angle_min_deg']:.4g} .. "
                f"{a['angle_max_deg']:.4g}&deg;",
            ),
            (
                "Preload after the snug torque",
                f"{_f(u, 'force', a['snug_preload_min_N'])} .. "
                f"{_f(u, 'force', a['snug_preload_max_N'])}",
            ),
            (
                "Bolt utilisation of its yield preload",
                f"{a['utilization_min']:.0%} .. {a['utilization_max']:.0%}"
                + (
                    f"; the bolt yields, permanent elongation up to "
                    f"{a['permanent_elongation_max_um']:.3g} &micro;m"
                    if a["yields_max"]
                    else "; elastic"
                ),
            ),
        ]
    elif r.torque is not None:
        rows += [
            ("Tightening torque, nominal", f"<b>{_f(u, 'torque', r.torque[0])}</b>"),
            (
                "Torque range",
                f"{_f(u, 'torque', r.torque[1])} .. {_f(u, 'torque', r.torque[2])}"
                + (
                    f" (tolerance &plusmn;{tr.torque_tolerance * 100:.3g} %)"
                    if tr.method == "torque"
                    else " (indicative)"
                ),
            ),
        ]
    if r.torque_required is not None:
        rows.append(
            (
                "Smallest nominal torque for the required clamp load",
                _f(u, "torque", r.torque_required),
            )
        )
    rows += [
        ("Thread friction &mu;<sub>G</sub>", _e(_mu(tr.thread_friction))),
        ("Head friction &mu;<sub>K</sub>", _e(_mu(tr.head_friction))),
        (
            "Assembly preload F<sub>M,min</sub> .. F<sub>M,max</sub>",
            f"{_f(u, 'force', r.assembly_min)} .. {_f(u, 'force', r.assembly_max)}",
        ),
        (
            "Permissible assembly preload F<sub>M,zul</sub>",
            f"{_f(u, 'force', r.permissible_preload)} (utilisation &nu; = {tr.utilization:g})",
        ),
        (
            "Required minimum assembly preload F<sub>M,erf</sub>",
            _f(u, "force", r.required_assembly_min),
        ),
        ("Tightening factor &alpha;<sub>A</sub>", f"{r.alpha_A:.3g} ({_e(r.alpha_A_basis)})"),
        (
            "Embedding",
            f"f<sub>Z</sub> = {_f(u, 'small_length', r.embedding_amount)}, preload loss "
            f"F<sub>Z</sub> = {_f(u, 'force', r.embedding_loss)}",
        ),
        (
            "Thermal preload change",
            f"{_f(u, 'force', r.thermal_change)} (minimum branch, "
            f"{_T(u, s.service.assembly_temperature)} &rarr; {_T(u, s.service.temperature)})",
        ),
    ]
    if r.cycle is not None and r.cycle.permanent_loss > 0:
        rows.append(("Permanent loss after a heat cycle", _f(u, "force", r.cycle.permanent_loss)))
    return (
        '<section id="tightening"><h2>7. Tightening specification</h2>'
        f"{_kv(rows)}<p class=meta>Torque per VDI 2230-1:2015 R13 and ISO 16047: "
        "M<sub>A</sub> = F<sub>M</sub> (0.16 P + 0.58 d<sub>2</sub> &mu;<sub>G</sub> + "
        "&mu;<sub>K</sub> D<sub>Km</sub>/2).</p></section>"
    )


def _temperature(sweep: Any, figure: str, note: str, u: DisplayUnits) -> str:
    if sweep is None:
        return f'<section id="temperature"><h2>8. Temperature</h2><p>{_e(note)}</p></section>'
    T = sweep.temperature
    lims = (
        "".join(
            f"<li><b>{_e(lim.check)}</b> fails "
            + (
                "over the whole range"
                if lim.fails == "whole range"
                else f"{_e(lim.fails)} {_T(u, lim.temperature)}"
            )
            + "</li>"
            for lim in sweep.limits
        )
        or "<li>Every check passes over the whole range.</li>"
    )
    return (
        '<section id="temperature"><div class="keep"><h2>8. Temperature</h2>'
        f"<p>{_e(note)}</p>{figure}</div>"
        f"<ul class=notes>{lims}</ul>"
        f"<p>Thermal preload change (minimum preload, after embedding): "
        f"{_f(u, 'force', sweep.thermal_change_cold)} at {_T(u, T[0])}, "
        f"{_f(u, 'force', sweep.thermal_change_hot)} at {_T(u, T[-1])}.</p></section>"
    )


def _assumptions(r: JointResult, u: DisplayUnits | None = None) -> str:
    def loc(x: str) -> str:
        return x if u is None else localize(x, u)

    a = "".join(f"<li>{_e(loc(x))}</li>" for x in r.assumptions)
    n = "".join(f"<li>{_e(loc(x))}</li>" for x in r.notes) or "<li>None.</li>"
    return (
        '<section id="assumptions"><h2>9. Assumptions and notes</h2>'
        f"<h3>Assumptions</h3><ul class=notes>{a}</ul><h3>Notes</h3><ul class=notes>{n}</ul>"
        "</section>"
    )


def _references(extra: tuple[str, ...] = ()) -> str:
    items = "".join(f"<li>{x}</li>" for x in (*REFERENCES, *extra))
    return (
        '<section id="references"><h2>10. References</h2>'
        "<p class=meta>The published methods and data the calculation uses; each check above "
        "names its clause.</p>"
        f'<ol class="refs">{items}</ol></section>'
    )


# --------------------------------------------------------------------------- sweep


def _temp_plain(T: float, u: DisplayUnits | None) -> str:
    """A temperature [K] as plain text in the report's scale (degC without units)."""
    if u is None or not u.us:
        return f"{T - C0:g} °C"
    return f"{u.temp(T):.4g} °F"


def report_sweep(result: JointResult, u: DisplayUnits | None = None) -> tuple[Any, str]:
    """The temperature sweep for the report, or ``None`` and why not.

    Only when the service temperature differs from the assembly temperature:
    from 20 K below the lower to 20 K above the higher of the two, narrowed
    (10 K, then 0 K beyond them) when a material's data do not reach so far.
    """
    from ..studies.sweep import sweep

    srv = result.spec.service
    Ta, Ts = srv.assembly_temperature, srv.temperature
    if abs(Ts - Ta) < 1e-9:
        return None, (
            "The service temperature equals the assembly temperature "
            f"({_temp_plain(Ta, u)}): no temperature sweep."
        )
    lo, hi = min(Ta, Ts), max(Ta, Ts)
    last = ""
    for m in (SWEEP_MARGIN, 0.5 * SWEEP_MARGIN, 0.0):
        try:
            sw = sweep(result.spec, lo - m, hi + m)
        except InputError as err:
            last = err.detail
            continue
        return sw, (
            f"Service temperature swept from {_temp_plain(lo - m, u)} to "
            f"{_temp_plain(hi + m, u)} ({m * (1.8 if u is not None and u.us else 1):g} "
            f"{'°F' if u is not None and u.us else 'K'} beyond the assembly and service "
            "temperatures"
            + ("" if m == SWEEP_MARGIN else ", narrowed to the materials' data")
            + "); parts with a temperature of their own keep their difference."
        )
    return None, f"No temperature sweep: {last}"


# --------------------------------------------------------------------------- scatter

_QUANTITY = {
    "assembly_preload": "assembly preload F<sub>M</sub>",
    "service_preload": "preload in service, no working load",
    "residual_clamp_load": "residual clamp load F<sub>KR</sub> (minimum over the load range)",
}
_EVENT = {
    "separation": "the interface opens under the largest working load",
    "bolt_yield": "the bolt yields, at assembly or in service",
    "bolt_yield_assembly": "the bolt yields at assembly (tension and thread torsion)",
    "bolt_yield_service": "the bolt yields in service (largest load, residual torsion)",
    "slip": "the interface slips under the shear load",
}


def report_scatter(result: JointResult) -> tuple[Any, str]:
    """The scatter study of the report, or ``None`` and why not.

    Run only when the input has a ``[distributions]`` table: adaptive from
    :data:`SCATTER_SAMPLES` samples with seed :data:`SCATTER_SEED` and the default
    convergence rule, the same study as ``clampstack scatter FILE --seed 0``.
    """
    from ..studies.sampling import Convergence
    from ..studies.scatter import scatter

    spec = result.spec
    if spec.distributions is None:
        return None, "The input has no [distributions] table: no scatter study."
    try:
        sr = scatter(
            spec,
            spec.distributions,
            SCATTER_SAMPLES,
            seed=SCATTER_SEED,
            convergence=Convergence(),
        )
    except InputError as err:
        return None, f"No scatter study: {err.detail}"
    return sr, ""


def _given_distributions(spec: Any) -> dict[str, Any]:
    """The distributions the input gives (``Dist`` objects), by key."""
    return dict(spec.distributions or {})


def _dist_text(d: Any, key: str, u: DisplayUnits) -> str:
    """A distribution in display units: ``normal, mean 48.00 N&middot;m, std 1.500 N&middot;m``."""
    from ..joint.model import DIST_KEYS

    kind = DIST_KEYS[key][0]
    if kind == "temperature":

        def val(x: float, spread: bool = False) -> str:
            if spread:
                return f"{fmt_number(x * (1.8 if u.us else 1.0))}&nbsp;{'&deg;F' if u.us else 'K'}"
            return _T(u, x)

    else:
        display = {"length": "small_length", "dimensionless": None}.get(kind, kind)

        def val(x: float, spread: bool = False) -> str:
            return fmt_number(x, 3) if display is None else _f(u, display, x)

    if d.kind == "uniform":
        return f"uniform {val(d.a)} .. {val(d.b)}"
    if d.kind in ("normal", "lognormal"):
        return f"{d.kind}, mean {val(d.a)}, standard deviation {val(d.b, spread=True)}"
    return f"fixed {val(d.a)}"


def _convergence_html(sr: Any) -> str:
    """One sentence: how the sample count was reached and what has not converged."""
    c = sr.convergence or {}
    if not c.get("adaptive"):
        return "A fixed number of samples."
    text = (
        f"Sampled in {c['rounds']} rounds until every probability's 95 % interval was "
        f"narrower than {c['target_relative_width']:.0%} of its estimate or its upper bound "
        f"below {c['negligible_below']:g}"
    )
    pending = [e for e, st in c["events"].items() if not st["converged"]]
    if not pending:
        return _e(text + ".")
    return _e(text) + (
        f"; <b>not converged</b> at the cap of {c['max_samples']:,} samples: ".replace(
            ",", "&nbsp;"
        )
        + _e(", ".join(pending))
        + " (read these estimates as an order of magnitude)."
    )


def _scatter(sr: Any, note: str, figures: str, u: DisplayUnits) -> str:
    if sr is None:
        return f'<section id="scatter"><h2>9. Statistical scatter</h2><p>{_e(note)}</p></section>'
    F = _lab(u, "force")
    count = f"{sr.samples:,}".replace(",", "&nbsp;")
    intro = (
        "<p>The input's <code>[distributions]</code> table asks for a Monte Carlo study of the "
        "assembly scatter: each sample draws the inputs below and runs the check chain in "
        "closed form (tightening, embedding, temperature, working load through the joint "
        f"diagram). <b>{count} samples, seed {sr.seed}</b>: the same input file gives the same "
        "numbers in every report; <code>clampstack scatter FILE --seed 0</code> runs the same "
        "study. " + _convergence_html(sr) + "</p>"
    )
    given = _given_distributions(sr.spec)
    inputs = _table(
        ["sampled input", "distribution"],
        [
            [f"<code>{_e(k)}</code>", _dist_text(given[k], k, u) if k in given else _e(v)]
            for k, v in sr.distributions.items()
        ],
        left={0, 1},
        cls="small",
    )
    keys = ("p01", "p05", "p50", "p95", "p99", "mean")
    rows = [
        [_QUANTITY[q], *(u.fmt("force", sr.percentiles[q][k]).replace(" ", "&nbsp;") for k in keys)]
        for q in _QUANTITY
    ]
    for q in _QUANTITY:  # the 95 % interval of each percentile under it
        ci = sr.intervals.get(q)
        if ci:
            idx = [i for i, (name, _) in enumerate(_QUANTITY.items()) if name == q][0]
            rows.insert(
                2 * idx + 1,
                [
                    "<span class=meta>95 % interval</span>",
                    *(
                        f"{u.fmt('force', ci[k]['low'])}&nbsp;..&nbsp;"
                        f"{u.fmt('force', ci[k]['high'])}".replace(" ", "&nbsp;")
                        for k in keys[:-1]
                    ),
                    "",
                ],
            )
    pct = _table([f"[{F}]", "1 %", "5 %", "50 %", "95 %", "99 %", "mean"], rows, cls="small")
    prow = []
    for name, meaning in _EVENT.items():
        pr = sr.probability(name)
        prow.append(
            [
                f"<b>{_e(name)}</b><br><span class=meta>{_e(meaning)}</span>",
                f"{pr['estimate']:.3g}",
                f"{pr['low']:.3g} .. {pr['high']:.3g}",
                f"{pr['count']:,}".replace(",", "&nbsp;"),
            ]
        )
    prob = _table(
        ["probability that", "estimate", "95 % interval (Clopper&ndash;Pearson)", "samples"],
        prow,
        cls="small",
    )
    d = sr.deterministic
    compare = (
        "<p>For comparison, the tightening factor of VDI 2230-1 (tightening specification "
        "above) gives an assembly "
        f"preload of {_f(u, 'force', d['assembly_preload_min_N'])} .. "
        f"{_f(u, 'force', d['assembly_preload_max_N'])} and a minimum residual clamp load of "
        f"{_f(u, 'force', d['residual_clamp_load_min_N'])}; the study's 1 % .. 99 % range of the "
        f"assembly preload is {_f(u, 'force', sr.percentiles['assembly_preload']['p01'])} .. "
        f"{_f(u, 'force', sr.percentiles['assembly_preload']['p99'])}.</p>"
    )
    return (
        '<section id="scatter"><div class="keep"><h2>9. Statistical scatter</h2>'
        f"{intro}{inputs}</div>"
        f'<div class="keep"><h3>Percentiles</h3>{pct}</div>'
        f'<div class="keep"><h3>Probabilities</h3>{prob}'
        "<p class=meta>Estimate: share of the samples; interval: exact binomial 95 % "
        "confidence interval (Clopper and Pearson, 1934). A count of zero still has an upper "
        "bound above zero.</p></div>"
        f"{compare}{figures}</section>"
    )


def _scatter_figures(sr: Any, r: JointResult, units: str, first: int) -> str:
    """Histograms of the assembly preload and the residual clamp load (figures ``first``..)."""
    from ..plots import binned_histogram

    u = UNIT_SYSTEMS[units]
    label, factor = u.force
    out = []
    samples = f"{sr.samples:,}".replace(",", "&nbsp;")
    req = r.spec.requirements.residual_clamp_load
    for k, (q, name, limit, limit_label, caption) in enumerate(
        (
            (
                "assembly_preload",
                "assembly preload",
                r.permissible_preload,
                "permissible",
                "with the permissible assembly preload F<sub>M,zul</sub>",
            ),
            (
                "residual_clamp_load",
                "residual clamp load",
                req if req > 0 else None,
                "required",
                "with the required clamp load" if req > 0 else "(no required clamp load given)",
            ),
        )
    ):
        edges, counts = sr.histogram[q]
        p = sr.percentiles[q]
        fig = binned_histogram(
            edges,
            counts,
            quantity=name,
            unit=label,
            scale=factor,
            percentiles={1.0: p["p01"], 50.0: p["p50"], 99.0: p["p99"]},
            limit=limit,
            limit_label=limit_label,
        )
        n = first + k
        out.append(
            _figure(
                fig,
                f"f{n}",
                f"Histogram of the {name}",
                f"Figure {n}. Histogram of the {name} over the {samples} samples "
                f"({len(counts)} bins), the 1 %, 50 % and 99 % percentiles marked, {caption}.",
            )
        )
    return "".join(out)


# --------------------------------------------------------------------------- report


def _states_csv(r: JointResult) -> str:
    buf = io.StringIO()
    w = csv.writer(buf, lineterminator="\n")
    keys = [
        "name",
        "label",
        "axial_load_N",
        "bolt_load_min_N",
        "bolt_load_max_N",
        "clamp_load_min_N",
        "clamp_load_max_N",
    ]
    w.writerow(keys)
    for st in r.to_dict()["states"]:
        w.writerow([st[k] if isinstance(st[k], str) else repr(float(st[k])) for k in keys])
    return buf.getvalue()


def _checks_csv(r: JointResult) -> str:
    return _checks_csv_rows(r.to_dict()["checks"])


def render_joint_report(
    doc: InputDocument,
    result: JointResult,
    units: str = "si",
    now: datetime | None = None,
    with_sweep: bool = True,
    with_scatter: bool = True,
) -> dict[str, str]:
    """Render the report files of ``result`` in memory: ``{file name: content}``.

    The HTML report (figures inline as SVG), the JSON result (``result.to_dict()``
    with a ``report`` block naming the tool version, the date and the input's
    SHA-256, and a ``scatter`` block when the input has a ``[distributions]``
    table) and two CSV files (states, checks).  Nothing is written here.
    """
    from ..plots import bolt_load_plot, joint_diagram, spring_schematic, sweep_plot

    u = UNIT_SYSTEMS[units].for_torque(result.torque[0] if result.torque else None)
    now = now or datetime.now(UTC)
    stamp = now.strftime("%Y-%m-%d %H:%M UTC")
    name = Path(doc.path).name
    stem = file_stem(doc, "joint")
    names = report_file_names(stem)
    s = result.spec
    thermal = abs(s.service.temperature - s.service.assembly_temperature) > 1e-9

    schematic = _figure(
        spring_schematic(result),
        "f1",
        "Spring model of the joint",
        "Figure 1. Spring model: the bolt's segments in series, in parallel with the clamped "
        "parts split at the load introduction planes A and B; the working load F<sub>A</sub> "
        "pulls A and B apart. Resiliences at assembly temperature.",
    )
    diagram = _figure(
        joint_diagram(result, units),
        "f2",
        "Joint load diagram",
        "Figure 2. Joint load diagram (VDI 2230-1:2015, 5.3.1). Left: bolt line (slope "
        "1/&delta;<sub>S</sub>) and clamped-parts lines (slope &minus;1/&delta;<sub>P</sub>) at "
        "the maximum and minimum assembly preload, after embedding"
        + (" and at service temperature" if thermal else "")
        + "; the shaded band is the assembly preload scatter. Right: the maximum working load at "
        "the minimum preload, its share in the bolt (&Phi;<sub>n</sub> F<sub>A</sub>) and in the "
        "clamped parts ((1 &minus; &Phi;<sub>n</sub>) F<sub>A</sub>), and "
        + (
            "the separation point"
            if result.eccentric is None
            else "the opening point F<sub>A,ab</sub>, where the clamp load falls to "
            "F<sub>Kab</sub> (eccentric: &delta;<sub>P</sub>* in place of &delta;<sub>P</sub>, "
            "&Phi;<sub>en</sub>* in place of &Phi;<sub>n</sub>)"
        )
        + " (stiffness at service temperature).",
    )
    from ..plots import inline_svg

    compact = (
        '<figure class="compact">'
        + inline_svg(joint_diagram(result, units), "f0", title="Joint load diagram")
        + "<figcaption>Joint load diagram (figure 2 below, in full).</figcaption></figure>"
    )
    loads = _figure(
        bolt_load_plot(result, units),
        "f3",
        "Bolt load and clamp load against the working load",
        "Figure 3. Bolt load and clamp load against the working load, solved with the spring "
        "network at service temperature; the knee is the separation load, beyond which the "
        "bolt carries all of F<sub>A</sub>."
        if result.eccentric is None
        else "Figure 3. Eccentric joint: bolt load and clamp load against the working load "
        "(axial load and bending moment growing together) at service temperature. Up to the "
        "opening point the VDI 2230-1 linear relations; beyond it (shaded) the contact model, "
        "with the linear line dotted for comparison and the clamp load against opening "
        "F<sub>Kab</sub> dashed. Below: the length of the interface in contact.",
    )
    sweep_section, figures = "", 3
    if with_sweep and thermal:
        sw, note = report_sweep(result, u)
        fig = ""
        if sw is not None:
            fig = _figure(
                sweep_plot(sw, units),
                "f4",
                "Preload and residual clamp load over the temperature",
                "Figure 4. Preload (band: minimum to maximum assembly preload) and residual clamp "
                "load against the service temperature; where a check fails the background is "
                "shaded.",
            )
            figures += 1
        sweep_section = _temperature(sw, fig, note, u)
    scatter_section, sr = "", None
    if with_scatter and s.distributions is not None:
        sr, note = report_scatter(result)
        figs = "" if sr is None else _scatter_figures(sr, result, units, figures + 1)
        scatter_section = _scatter(sr, note, figs, u)

    head = (
        f"<header><h1>{_e(s.title)}</h1>"
        f'<p class="sub">Bolted joint calculation report &middot; '
        f"{_e(s.bolt.thread.designation)} grade {_e(s.bolt.grade.name)}, clamp length "
        f"{_f(u, 'length', s.clamp_length)}</p>"
        f'<p class="meta">clampstack {_e(__version__)} &middot; {_e(stamp)} &middot; input '
        f'<code>{_e(name)}</code> &middot; SHA-256 <span class="hash">{_e(doc.sha256)}</span>'
        "</p></header>"
    )
    body = "".join(
        [
            head,
            _summary(result, u, compact),
            _inputs(doc, result, u),
            _model(result, u, schematic),
            _diagrams(diagram, loads),
            _states(result, u),
            _checks(result, u),
            _tightening(result, u),
            sweep_section,
            scatter_section,
            _assumptions(result, u),
            _references((SCATTER_REFERENCE,) if sr is not None else ()),
            f"<footer><div class=caution>{_e(CAUTION)}</div>"
            f'<p class="meta">Generated by clampstack {_e(__version__)} on {_e(stamp)} from '
            f'<code>{_e(name)}</code>, SHA-256 <span class="hash">{_e(doc.sha256)}</span>. '
            f"Results beside this file: <code>{_e(names['json'])}</code>, "
            f"<code>{_e(names['states'])}</code>, <code>{_e(names['checks'])}</code>.</p>"
            "</footer>",
        ]
    )
    body = _renumber(body)  # consecutive, with or without the temperature and scatter sections
    page = _page(
        s.title,
        __version__,
        f"clampstack {__version__} - {name} (SHA-256 {doc.sha256[:12]}) - {s.title}",
        body,
        ANSWER_CSS,
    )
    data = result.to_dict()
    data["report"] = report_block(doc, now, units, __version__)
    if sr is not None:
        data["scatter"] = sr.to_dict()
    # the page last: when it is there, the results beside it are too
    return {
        names["json"]: json.dumps(data, indent=2, allow_nan=False) + "\n",
        names["states"]: _states_csv(result),
        names["checks"]: _checks_csv(result),
        names["html"]: page,
    }
