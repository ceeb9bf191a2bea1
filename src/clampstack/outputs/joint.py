"""Readable renderings of a joint result: terminal text and HTML tables."""

from __future__ import annotations

import html
import math
from dataclasses import replace

from ..joint.analysis import JointResult
from .text import (
    CAUTION,
    UNIT_SYSTEMS,
    DisplayUnits,
    defaults_block,
    fmt_number,
    localize,
    notes_block,
    table,
)


def _joint_line(r: JointResult, u: DisplayUnits | None = None) -> str:
    s = r.spec
    b = s.bolt
    head = {"hex": "hex head", "socket": "socket head", "stud": "stud"}[b.head]
    end = f"into a tapped hole in {s.tapped_hole.material.name}" if s.tapped_hole else "with nut"
    if u is not None and u.us:
        L = u.label("length")
        lengths = (
            f"{u.fmt('length', b.length)} {L}",
            f"{u.fmt('length', s.clamp_length)} {L}",
        )
    else:
        lengths = (f"{b.length * 1e3:g} mm", f"{s.clamp_length * 1e3:.4g} mm")
    return (
        f"{b.thread.designation} grade {b.grade.name}, {head}, length "
        f"{lengths[0]}, {end}; clamp length {lengths[1]} "
        f"({len(s.layers)} layer{'s' if len(s.layers) != 1 else ''})"
    )


def check_value(c, u: DisplayUnits) -> tuple[str, str]:
    """Value and limit of a check in the chosen display units."""
    conv = {
        "kN": ("force", 1e3),
        "MPa": ("stress", 1e6),
        "mm": ("length", 1e-3),
        "mm2": ("area", 1e-6),
    }
    if c.unit in conv:
        kind, si = conv[c.unit]
        lab = u.label(kind)
        return (f"{u.fmt(kind, c.value * si)} {lab}", f"{u.fmt(kind, c.limit * si)} {lab}")
    return fmt_number(c.value), fmt_number(c.limit)


def _margin(c) -> str:
    m = c.margin
    return "inf" if math.isinf(m) else f"{round(m * 100, 1) + 0.0:+.1f} %"


def _mu(rng: tuple[float, float]) -> str:
    return f"{rng[0]:.2f}" if rng[0] == rng[1] else f"{rng[0]:.2f}..{rng[1]:.2f}"


def governing(r: JointResult):
    """The active check with the smallest margin, or None.

    When the torque was derived from the permissible preload, the assembly-preload
    check sits at its limit by construction and is not reported as governing.
    """
    return r.governing


def basis_lines(r: JointResult, u: DisplayUnits) -> list[str]:
    """Which preload the checks R8-R10 use, and those checks on the other basis."""
    from ..joint.analysis import BASIS_NAMES

    F = u.label("force")
    how = {
        "permissible": 'VDI 2230-1 R8-R10; [requirements] check_basis = "permissible"',
        "actual": '[requirements] check_basis = "actual"; VDI 2230-1 uses F_M,zul',
        "yield": "yield-controlled tightening",
    }[r.check_basis]
    lines = [
        f"  working stress, fatigue and surface pressure with the {BASIS_NAMES[r.check_basis]}"
        f" = {u.fmt('force', r.check_preload)} {F} ({how})"
    ]
    other = [c for c in r.checks if c.information]
    if other:
        o = other[0].information
        shown = []
        for c in other:
            alt = replace(c, value=c.information["value"], limit=c.information["limit"])
            shown.append(f"{c.name} {check_value(alt, u)[0]} ({_margin(alt)})")
        lines.append(
            f"  with the {BASIS_NAMES[o['basis']]} = {u.fmt('force', o['preload_N'])} {F} "
            f"(information): {', '.join(shown)}"
        )
    return lines


def eccentric_lines(r: JointResult, u: DisplayUnits) -> list[str]:
    """The eccentric joint in a few lines: geometry, resiliences, opening, contact, bending."""
    e = r.eccentric
    assert e is not None
    F, L = u.label("force"), u.label("length")

    def mm(v: float) -> str:
        return f"{u.fmt('length', v * 1e-3)} {L}"

    def area(v_mm2: float) -> str:
        return f"{u.fmt('area', v_mm2 * 1e-6)} {u.label('area')}"

    def inertia(v_mm4: float) -> str:  # second moment of area
        return f"{v_mm4 / 25.4**4:.4g} in^4" if u.us else f"{v_mm4:.4g} mm^4"

    def res(v_mm_per_N: float) -> str:  # resilience
        return f"{v_mm_per_N / 25.4 * 4.4482216152605:.4g}" if u.us else f"{v_mm_per_N:.4g}"

    c = e["contact"]
    lines = [
        f"interface {e['interface_shape']}: A_D = {area(e['interface_area_mm2'])}, "
        f"I_BT = {inertia(e['interface_second_moment_mm4'])}; s_sym = {mm(e['bolt_offset_mm'])}, "
        f"a = {mm(e['load_offset_mm'])}, opening edge u = {mm(e['edge_distance_mm'])}"
        + ("" if e["edge_distance_given"] else " (the edge that opens first)"),
        f"I_Bers = {inertia(e['bending_inertia_mm4'])} ({localize(e['bending_inertia_basis'], u)})",
        f"delta_P = {res(e['resilience_concentric_mm_per_N'])}, delta_P* = "
        f"{res(e['resilience_clamping_mm_per_N'])}, delta_P** = "
        f"{res(e['resilience_loading_mm_per_N'])} {'in/lbf' if u.us else 'mm/N'}; "
        f"Phi_en* = {e['load_factor']:.4g}"
        + (
            f", Phi_m* = {e['moment_load_factor_per_m'] / 1e3:.4g} 1/mm"
            if any(r.spec.service.bending_moment)
            else ""
        ),
    ]
    lam = e["opening_load_ratio"]
    if e["edge_open_at_assembly"]:
        lines.append("the preload alone lifts edge u: the bolt lies outside the interface's core")
    elif e["open_at_assembly"]:
        lines.append(
            "the preload alone lifts the edge away from u (the bolt lies outside the core); "
            + (
                f"edge u opens at {lam:.3g} x the maximum load (contact model)"
                if lam is not None
                else "edge u stays closed (contact model)"
            )
        )
    else:
        lines.append(
            f"clamp load against opening F_Kab = {u.fmt('force', e['opening_clamp_load_N'])} {F}; "
            + (
                f"opening load F_A,ab = {u.fmt('force', e['opening_load_N'])} {F}"
                if e["opening_load_N"] is not None
                else (
                    f"opens at {e['opening_load_ratio']:.3g} x the maximum load"
                    if e["opening_load_ratio"] is not None
                    else "does not open along the service load"
                )
            )
        )
    lines.append(
        f"at the maximum load ({c['model']}): bolt load {u.fmt('force', c['bolt_load_N'])} {F}, "
        f"clamp load {u.fmt('force', c['clamp_load_N'])} {F}, contact "
        f"{mm(c['contact_width_mm'])} of {mm(e['interface_length_mm'])}"
    )
    lines.append(
        f"bolt bending stress up to {u.fmt('stress', e['bolt_bending_stress_max_MPa'] * 1e6)} "
        f"{u.label('stress')}, amplitude {u.fmt('stress', e['bending_amplitude_MPa'] * 1e6)} "
        f"{u.label('stress')} (l_ers = {mm(e['bending_length_mm'])})"
    )
    return lines


def case_rows(r: JointResult, u: DisplayUnits) -> tuple[list[str], list[list[str]]]:
    """The load-case table: loads, temperature, bolt load, residual clamp load, verdict."""
    F = u.label("force")
    head = [
        "case",
        f"F_A [{F}]",
        f"T [{u.temp_label}]",
        f"bolt max [{F}]",
        f"clamp min [{F}]",
        "result",
        "governing check",
    ]
    rows = []
    for cr in r.cases:
        x = cr.result
        lo, hi = x.spec.service.axial_load
        gov = x.governing
        loads = u.fmt("force", hi) if lo == hi else f"{u.fmt('force', lo)}..{u.fmt('force', hi)}"
        rows.append(
            [
                cr.name,
                loads,
                f"{u.temp(x.spec.service.temperature):.4g}",
                u.fmt("force", x.bolt_load_max),
                u.fmt("force", x.residual_clamp_min),
                "pass" if x.ok else "FAIL",
                "" if gov is None else f"{gov.name} ({_margin(gov)})",
            ]
        )
    return head, rows


def case_lines(r: JointResult, u: DisplayUnits) -> list[str]:
    """The load cases as a text table."""
    head, rows = case_rows(r, u)
    return [
        "Load cases",
        table(head, rows, right=[False, True, True, True, True, False, False]),
    ]


def joint_text(r: JointResult, units: str = "si") -> str:
    """The ``check`` result as compact tables: verdict, tightening, states, checks, caution."""
    u = UNIT_SYSTEMS[units].for_torque(r.torque[0] if r.torque else None)
    s = r.spec
    F = u.label("force")
    out = [s.title, _joint_line(r, u), ""]
    failed = [c.name for c in r.checks if not c.passed]
    gov = governing(r)
    active = [c for c in r.checks if c.skipped is None]
    if r.ok:
        out.append(
            f"RESULT: PASS - all {len(active)} checks pass"
            + (f"; governing: {gov.name} ({_margin(gov)})" if gov else "")
        )
    else:
        out.append(f"RESULT: FAIL - {', '.join(failed)}")
    if r.cases:
        gc = (gov.extra or {}).get("governing_case", r.governing_case) if gov else r.governing_case
        out.append(
            f"  {len(r.cases)} load cases; governing: {gc!r} (the states below are those of "
            f"{r.governing_case!r}; each check gives its worst case)"
        )
    # every check's margin at a glance, and the joint diagram in numbers
    out.append(
        "  margins: "
        + ", ".join(f"{c.name} {'off' if c.skipped else _margin(c)}" for c in r.checks if c.name)
    )
    svc = next((st for st in r.states if st.key == "service_max"), None)
    temp = next((st for st in r.states if st.key == "temperature"), None)
    if svc is not None and temp is not None:
        out.append(
            f"  joint: F_M {u.fmt('force', r.assembly_min)}..{u.fmt('force', r.assembly_max)}, "
            f"F_V {u.fmt('force', temp.bolt_min)}, F_A {u.fmt('force', svc.axial_load)}, "
            f"F_S,max {u.fmt('force', r.bolt_load_max)}, F_KR,min "
            f"{u.fmt('force', r.residual_clamp_min)} {F}"
        )
    out.append("")

    tr = s.tightening
    out.append("Tightening specification")
    mu = f"thread friction {_mu(tr.thread_friction)}, head friction {_mu(tr.head_friction)}"
    extra = "".join(
        f"; {name} {v}" for name, v in (("lubricant", tr.lubricant), ("tool", tr.tool)) if v
    )
    if tr.nut_factor is not None:
        K = tr.nut_factor
        extra += (
            f"; nut factor K = {_mu(K)} (T = K F d: it lumps friction and geometry; the "
            "friction shown is what it implies)"
        )
    out.append(f"  method {tr.method}; {mu}{extra}")
    if r.angle is not None:
        a, T = r.angle, u.label("torque")
        out.append(
            f"  snug torque {u.fmt('torque', r.torque[0])} {T} "
            f"(min {u.fmt('torque', r.torque[1])}, max {u.fmt('torque', r.torque[2])} {T}), "
            f"then turn {a['angle_min_deg']:.4g}..{a['angle_max_deg']:.4g} deg"
        )
        out.append(
            f"  preload after snug {u.fmt('force', a['snug_preload_min_N'])} .. "
            f"{u.fmt('force', a['snug_preload_max_N'])} {F}; bolt utilisation "
            f"{a['utilization_min']:.0%} .. {a['utilization_max']:.0%} of its yield preload"
            + (
                f"; the bolt yields (permanent elongation up to "
                f"{a['permanent_elongation_max_um']:.3g} um)"
                if a["yields_max"]
                else "; elastic"
            )
        )
    elif r.tension is not None:
        t = r.tension
        out.append(
            f"  applied tension {u.fmt('force', t['applied_tension_min_N'])} .. "
            f"{u.fmt('force', t['applied_tension_max_N'])} {F}; load transfer factor "
            f"{t['load_transfer_factor']:.3g} ({t['load_transfer_basis']})"
        )
    elif r.torque is not None:
        T = u.label("torque")
        out.append(
            f"  tightening torque {u.fmt('torque', r.torque[0])} {T} "
            f"(min {u.fmt('torque', r.torque[1])}, max {u.fmt('torque', r.torque[2])} {T})"
        )
        if r.torque_required is not None:
            out.append(
                f"  smallest nominal torque that meets the required clamp load: "
                f"{u.fmt('torque', r.torque_required)} {T}"
            )
    out.append(
        f"  assembly preload {u.fmt('force', r.assembly_min)} .. "
        f"{u.fmt('force', r.assembly_max)} {F}; permissible "
        f"{u.fmt('force', r.permissible_preload)} {F}; required at least "
        f"{u.fmt('force', r.required_assembly_min)} {F}"
    )
    out.append(f"  tightening factor alpha_A = {r.alpha_A:.3g} ({r.alpha_A_basis})")
    out.append("")
    out.append("Stiffness and load factor")
    out.append(
        f"  bolt {u.fmt('stiffness', 1 / r.springs.delta_S)} {u.label('stiffness')}, "
        f"clamped parts {u.fmt('stiffness', 1 / r.springs.delta_P)} {u.label('stiffness')}"
        + (" (delta_P*, at the bolt line)" if r.eccentric else "")
        + f", Phi_K = {r.springs.load_factor_K:.4g}, "
        + ("Phi_en*" if r.eccentric else "Phi_n")
        + f" = {r.load_factor:.4g} (n = {s.service.load_height:.3g})"
    )
    out.append(
        f"  embedding {u.fmt('small_length', r.embedding_amount, 3)} {u.label('small_length')}"
        " -> preload loss "
        f"{u.fmt('force', r.embedding_loss)} {F}; thermal change "
        f"{u.fmt('force', r.thermal_change)} {F} "
        f"({u.temp(s.service.assembly_temperature):.4g} -> "
        f"{u.temp(s.service.temperature):.4g} {u.temp_label})"
    )
    if r.eccentric is None:
        out.append(f"  separation load {u.fmt('force', r.separation_load)} {F}")
    else:
        out.append("")
        out.append("Eccentric clamping and loading (VDI 2230-1:2015, 5.1.2.3, 5.3.2, 5.5.3)")
        out.extend(f"  {line}" for line in eccentric_lines(r, u))
    out.append("")
    rows = [
        [
            st.label,
            u.fmt("force", st.axial_load),
            u.fmt("force", st.bolt_min),
            u.fmt("force", st.bolt_max),
            u.fmt("force", st.clamp_min),
            u.fmt("force", st.clamp_max),
        ]
        for st in r.states
    ]
    out.append(
        table(
            [
                "state",
                f"F_A [{F}]",
                f"bolt min [{F}]",
                f"bolt max [{F}]",
                f"clamp min [{F}]",
                f"clamp max [{F}]",
            ],
            rows,
            right=[False, True, True, True, True, True],
        )
    )
    out.append(
        "  min: minimum assembly preload with embedding; max: maximum assembly preload, "
        "embedding not counted (conservative for the bolt)."
    )
    out.append("")
    if r.cases:
        out.extend(case_lines(r, u))
        out.append("")
    crow = []
    for c in r.checks:
        v, lim = check_value(c, u)
        verdict = "off" if c.skipped else ("pass" if c.passed else "FAIL")
        row = [c.name, v, c.relation, lim, _margin(c), verdict]
        if r.cases:
            row.append((c.extra or {}).get("governing_case", ""))
        crow.append(row + [localize(c.source, u)])
    head = ["check", "value", "", "limit", "margin", "result"] + (["case"] if r.cases else [])
    out.append(
        table(
            head + ["source"],
            crow,
            right=[False, True, False, True, True, False] + ([False] if r.cases else []) + [False],
        )
    )
    out.extend(basis_lines(r, u))
    for c in r.checks:
        if c.skipped:
            out.append(f"  {c.name} switched off: {c.skipped}")
    out.extend(notes_block(r.notes, u=u))
    out.extend(defaults_block(r.defaults, u))
    out.append("")
    out.append(CAUTION)
    return "\n".join(out)


def joint_html_tables(r: JointResult) -> str:
    """States and checks as HTML tables (Jupyter ``_repr_html_``)."""
    e = html.escape
    rows = "".join(
        f"<tr><td style='text-align:left'>{e(st.label)}</td><td>{st.axial_load / 1e3:.4g}</td>"
        f"<td>{st.bolt_min / 1e3:.4g}</td><td>{st.bolt_max / 1e3:.4g}</td>"
        f"<td>{st.clamp_min / 1e3:.4g}</td><td>{st.clamp_max / 1e3:.4g}</td></tr>"
        for st in r.states
    )
    checks = "".join(
        f"<tr><td style='text-align:left'>{e(c.name)}</td><td>{c.value:.4g} {e(c.unit)}</td>"
        f"<td>{e(c.relation)} {c.limit:.4g} {e(c.unit)}</td><td>{_margin(c)}</td>"
        f"<td>{'off' if c.skipped else ('pass' if c.passed else '<b>FAIL</b>')}</td>"
        f"<td style='text-align:left'>{e(c.source)}</td></tr>"
        for c in r.checks
    )
    verdict = "PASS" if r.ok else "FAIL"
    return (
        f"<div><b>{e(r.spec.title)}</b>: {verdict}<table><tr><th>state</th><th>F_A [kN]</th>"
        "<th>bolt min [kN]</th><th>bolt max [kN]</th><th>clamp min [kN]</th>"
        f"<th>clamp max [kN]</th></tr>{rows}</table><table><tr><th>check</th><th>value</th>"
        f"<th>limit</th><th>margin</th><th>result</th><th>source</th></tr>{checks}</table>"
        f"<p><small>{e(CAUTION)}</small></p></div>"
    )
