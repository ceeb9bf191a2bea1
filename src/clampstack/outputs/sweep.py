"""Readable rendering of a temperature sweep."""

from __future__ import annotations

import html
import json
from collections.abc import Iterator
from typing import Any

import numpy as np

from ..joint.analysis import BASIS_NAMES
from ..studies.flange_sweep import FlangeSweepResult
from ..studies.sweep import C0, SweepResult
from .text import CAUTION, UNIT_SYSTEMS, notes_block, table

MAX_ROWS = 25


def _limit_lines(limits: tuple, u: Any) -> list[str]:
    """One line per limit temperature: where a check starts to fail."""
    out = []
    for lim in limits:
        where = (
            "over the whole range"
            if lim.fails == "whole range"
            else f"{lim.fails} {u.temp(lim.temperature):.2f} {u.temp_label}"
        )
        out.append(f"  {lim.check} fails {where}")
    return out


def sweep_text(r: SweepResult, units: str = "si") -> str:
    """Verdict, limits, thermal changes and a table of the points (thinned to ~25 rows)."""
    u = UNIT_SYSTEMS[units]
    F = u.label("force")
    T = r.temperature
    out = [
        r.spec.title,
        f"Service temperature {u.temp(T[0]):.4g} .. {u.temp(T[-1]):.4g} {u.temp_label}, "
        f"{T.size} points; assembly at {u.temp(r.spec.service.assembly_temperature):.4g} "
        f"{u.temp_label}",
        "",
    ]
    bad_cycles = [k for k, c in (r.cycle or {}).items() if not c.get("ok", True)]
    if bad_cycles and np.all(r.ok):
        names = sorted({r.cycle[k]["check"] for k in bad_cycles})
        out.append(f"RESULT: FAIL - {', '.join(names)} in the {' and '.join(bad_cycles)} cycle")
    elif np.all(r.ok):
        out.append("RESULT: PASS - every check passes over the whole range")
    else:
        out.append(f"RESULT: FAIL - checks fail at {int((~r.ok).sum())} of {T.size} points")
    out.extend(_limit_lines(r.limits, u))
    out.append("")
    out.append(
        f"Thermal preload change (minimum preload, after embedding): "
        f"{u.fmt('force', r.thermal_change_cold)} {F} at {u.temp(T[0]):.4g} {u.temp_label}, "
        f"{u.fmt('force', r.thermal_change_hot)} {F} at {u.temp(T[-1]):.4g} {u.temp_label}"
    )
    out.append(
        f"Assembly preload {u.fmt('force', r.assembly_range[0])} .. "
        f"{u.fmt('force', r.assembly_range[1])} {F}; bolt stress and the checks R8-R10 with the "
        f"{BASIS_NAMES[r.check_basis]} = {u.fmt('force', r.check_preload)} {F}"
    )
    out.append("")
    idx = np.arange(T.size)
    if T.size > MAX_ROWS:
        idx = np.unique(np.round(np.linspace(0, T.size - 1, MAX_ROWS)).astype(int))
    names = list(r.margins)
    rows = []
    for i in idx:
        worst = min(names, key=lambda n: r.margins[n][i]) if names else ""
        rows.append(
            [
                f"{u.temp(T[i]):.1f}",
                u.fmt("force", r.preload_min[i]),
                u.fmt("force", r.preload_max[i]),
                u.fmt("force", r.residual_min[i]),
                u.fmt("stress", r.bolt_stress_max[i]),
                f"{worst} {r.margins[worst][i] * 100:+.1f} %" if worst else "",
                "ok" if r.ok[i] else "FAIL",
            ]
        )
    out.append(
        table(
            [
                f"T [{u.temp_label}]",
                f"preload min [{F}]",
                f"preload max [{F}]",
                f"residual clamp min [{F}]",
                f"bolt stress max [{u.label('stress')}]",
                "smallest margin",
                "",
            ],
            rows,
            right=[True, True, True, True, True, False, False],
        )
    )
    if T.size > MAX_ROWS:
        out.append(f"  ({idx.size} of {T.size} points shown; --csv or --json for all)")
    if r.cycle:
        out.append("")
        out.append("Cycle from the assembly temperature to each end of the range and back:")
        for label, c in r.cycle.items():
            if c.get("collapse"):
                out.append(
                    f"  {label} ({u.temp(c['peak_temperature_degC'] + C0):.4g} {u.temp_label}): "
                    "plastic collapse, "
                    "no equilibrium with yielding parts"
                )
                continue
            msg = (
                "no yielding, preload unchanged"
                if c["permanent_loss_N"] <= 0
                else f"yields ({', '.join(c['yielded'])}); permanent loss "
                f"{u.fmt('force', c['permanent_loss_N'])} {F}"
            )
            out.append(
                f"  {label} ({u.temp(c['peak_temperature_degC'] + C0):.4g} {u.temp_label}): "
                f"{msg}; preload after "
                f"{u.fmt('force', c['preload_after_min_N'])} .. "
                f"{u.fmt('force', c['preload_after_max_N'])} {F}"
            )
    for name, why in r.skipped.items():
        out.append(f"  {name} switched off: {why}")
    out.extend(notes_block(r.notes, u=u))
    out.append("")
    out.append(CAUTION)
    return "\n".join(out)


def sweep_html_table(r: SweepResult, max_rows: int = MAX_ROWS) -> str:
    """Verdict, limits and a table of about ``max_rows`` evenly spread points (Jupyter)."""
    e = html.escape
    T = r.temperature
    idx = np.arange(T.size)
    if T.size > max_rows:
        idx = np.unique(np.round(np.linspace(0, T.size - 1, max_rows)).astype(int))
    names = list(r.margins)
    rows = []
    for i in idx:
        worst = min(names, key=lambda n: r.margins[n][i]) if names else ""
        margin = f"{e(worst)} {r.margins[worst][i] * 100:+.1f} %" if worst else ""
        rows.append(
            f"<tr><td>{T[i] - C0:.1f}</td><td>{r.preload_min[i] / 1e3:.4g}</td>"
            f"<td>{r.preload_max[i] / 1e3:.4g}</td><td>{r.residual_min[i] / 1e3:.4g}</td>"
            f"<td>{r.bolt_stress_max[i] / 1e6:.4g}</td><td style='text-align:left'>{margin}</td>"
            f"<td>{'ok' if r.ok[i] else '<b>FAIL</b>'}</td></tr>"
        )
    limits = "".join(
        f"<li>{e(lim.check)} fails "
        + (
            "over the whole range"
            if lim.fails == "whole range"
            else f"{e(lim.fails)} {lim.temperature - C0:.2f} degC"
        )
        + "</li>"
        for lim in r.limits
    )
    notes = "".join(f"<li>{e(n)}</li>" for n in r.notes)
    verdict = "PASS" if r.passed else "FAIL"
    shown = f"{idx.size} of {T.size} points" if T.size > idx.size else f"{T.size} points"
    return (
        f"<div><b>{e(r.spec.title)}</b>: {verdict} from {T[0] - C0:g} to {T[-1] - C0:g} degC "
        f"({shown})"
        + (f"<ul>{limits}</ul>" if limits else "")
        + (f"<p>Notes:</p><ul>{notes}</ul>" if notes else "")
        + "<table><tr><th>T [degC]</th>"
        "<th>preload min [kN]</th><th>preload max [kN]</th><th>residual clamp min [kN]</th>"
        "<th>bolt stress max [MPa]</th><th>smallest margin</th><th></th></tr>"
        f"{''.join(rows)}</table><p><small>{e(CAUTION)}</small></p></div>"
    )


#: points per piece of the streamed ``--json`` and ``--csv`` output
BLOCK = 5_000


def sweep_csv(result: SweepResult) -> str:
    """One row per temperature point, margins as columns (all of :func:`sweep_csv_chunks`)."""
    return "".join(sweep_csv_chunks(result))


def sweep_csv_chunks(result: SweepResult, block: int = BLOCK) -> Iterator[str]:
    """The text of :func:`sweep_csv` in pieces of ``block`` rows (the header first).

    ``sweep --csv`` writes them as they come, so a million points never sit in memory
    as one text.
    """
    names = list(result.margins)
    head = [
        "temperature_degC",
        "preload_min_N",
        "preload_max_N",
        "residual_clamp_load_min_N",
        "bolt_load_max_N",
        "bolt_stress_max_MPa",
        "ok",
        *(f"margin_{n}" for n in names),
    ]
    yield ",".join(head) + "\n"
    for start in range(0, result.temperature.size, block):
        sl = slice(start, start + block)
        cols = [
            (result.temperature[sl] - C0).tolist(),
            result.preload_min[sl].tolist(),
            result.preload_max[sl].tolist(),
            result.residual_min[sl].tolist(),
            result.bolt_load_max[sl].tolist(),
            (result.bolt_stress_max[sl] * 1e-6).tolist(),
        ]
        oks = ["true" if x else "false" for x in result.ok[sl].tolist()]
        margins = [result.margins[n][sl].tolist() for n in names]
        lines = []
        for i, ok in enumerate(oks):
            row = [f"{c[i]:.6g}" for c in cols]
            row.append(ok)
            row += [f"{m[i]:.6g}" for m in margins]
            lines.append(",".join(row))
        yield "\n".join(lines) + "\n"


_POINTS_MARK = "\x00points"  # stands for the points in the frame of the JSON text


def sweep_json_chunks(
    result: SweepResult, block: int = BLOCK, head: dict | None = None
) -> Iterator[str]:
    """``json.dumps(result.to_dict(), indent=2, allow_nan=False)`` in pieces, byte for byte
    (with the keys of ``head``, the JSON contract's header, first).

    The frame (title, limits, cycle, ...) is encoded by :mod:`json`; the points are
    written ``block`` at a time from the result's arrays, never as a list of dicts.
    Anything that cannot be encoded (a value that is not finite) raises before the
    first piece.  ``sweep --json`` writes the pieces as they come, then a line feed.
    """
    frame = {**(head or {}), **result.to_dict(points=False)}
    frame["points"] = _POINTS_MARK
    text = json.dumps(frame, indent=2, allow_nan=False)
    mark = '\n  "points": ' + json.dumps(_POINTS_MARK)
    at = text.index(mark) + len(mark) - len(json.dumps(_POINTS_MARK))
    head, tail = text[:at], text[at + len(json.dumps(_POINTS_MARK)) :]
    n = result.temperature.size
    for arr in (
        result.temperature,
        result.preload_min,
        result.preload_max,
        result.residual_min,
        result.bolt_load_max,
        result.bolt_stress_max,
    ):
        if not np.all(np.isfinite(arr)):
            raise ValueError("Out of range float values are not JSON compliant")
    if n == 0:
        yield head + "[]" + tail
        return
    keys = [json.dumps(k).replace("%", "%%") for k in result.point_columns(0, 0)]
    names = [json.dumps(m).replace("%", "%%") for m in result.margins]
    ind, ind2 = "\n      ", "\n        "
    fields = "".join(f"{ind}{k}: %s," for k in keys)
    if names:
        inner = ",".join(f"{ind2}{m}: %s" for m in names)
        template = "{" + fields + f'{ind}"margins": {{' + inner + "\n      }\n    }"
    else:
        template = "{" + fields + f'{ind}"margins": {{}}\n    }}'
    yield head + "[\n    "
    for start in range(0, n, block):
        stop = min(start + block, n)
        cols = [
            [("true" if x else "false") if isinstance(x, bool) else repr(x) for x in v]
            for v in result.point_columns(start, stop).values()
        ]
        for v in result.margin_columns(start, stop).values():
            cols.append(["null" if x is None else repr(x) for x in v])
        rows = [template % values for values in zip(*cols, strict=True)]
        yield ",\n    ".join(rows) + (",\n    " if stop < n else "")
    yield "\n  ]" + tail


def flange_sweep_text(r: FlangeSweepResult, units: str = "si") -> str:
    """Verdict, limits, a table of the points and the heat cycle per bolt."""
    from .flange import FLANGE_CAUTION

    u = UNIT_SYSTEMS[units]
    F, S = u.label("force"), u.label("stress")
    A = r.sector_area
    s = r.spec
    T = r.temperature
    ok = r.ok
    heat = [i for i, p in enumerate(r.phase) if p == "heating"]
    out = [
        s.title,
        f"Flange temperature {u.temp(T[heat[0]]):.4g} .. {u.temp(T[heat[-1]]):.4g} "
        f"{u.temp_label}, {len(heat)} points"
        + (", heated, relaxed and cooled back" if r.cycle is not None else "")
        + f"; assembly at {u.temp(s.T_assembly):.4g} {u.temp_label}; pressurised",
        "",
    ]
    cyc_ok = (r.cycle or {}).get("ok", True)
    if np.all(ok) and cyc_ok:
        out.append("RESULT: PASS - the gasket and bolt checks pass over the whole range")
    elif np.all(ok):
        out.append("RESULT: FAIL - gasket_heat_cycle: below the operating minimum after the cycle")
    else:
        out.append(f"RESULT: FAIL - checks fail at {int((~ok).sum())} of {T.size} points")
    out.extend(_limit_lines(r.limits, u))
    out.append(
        f"  gasket operating minimum {u.fmt('stress', r.operating_minimum / A)} {S} "
        f"(H_p/N), seating y {u.fmt('stress', s.gasket.y)} {S}, crush "
        f"{u.fmt('stress', s.gasket.max_stress)} {S}"
    )
    out.append("")
    head = [
        "phase",
        f"T [{u.temp_label}]",
        f"gasket min [{S}]",
        f"gasket max [{S}]",
        f"bolt min [{F}]",
        f"bolt max [{F}]",
        "rotation [deg]",
        "ok",
    ]
    rows = []
    idx = np.unique(np.linspace(0, T.size - 1, min(T.size, 25)).round().astype(int))
    for i in idx:
        rows.append(
            [
                r.phase[i],
                f"{u.temp(T[i]):.4g}",
                u.fmt("stress", r.gasket_min[i] / A),
                u.fmt("stress", r.gasket_max[i] / A),
                u.fmt("force", r.bolt_min[i]),
                u.fmt("force", r.bolt_max[i]),
                f"{np.degrees(r.rotation[i]):.3f}",
                "yes" if ok[i] else "NO",
            ]
        )
    out.append(table(head, rows))
    if r.cycle is not None:
        c = r.cycle
        out += [
            "",
            f"Heat cycle to {u.temp(c['peak_temperature_degC'] + C0):.4g} {u.temp_label}: "
            f"creep relaxation {c['relaxation_factor']:.3g} ({c['relaxation_basis']})",
        ]
        states = c["states"]
        head = ["bolt"] + [f"{st['state']} bolt [{F}]" for st in states]
        head += [f"{st['state']} gasket [{S}]" for st in states]
        rows = []
        for b in range(s.bolt_count):
            rows.append(
                [str(b + 1)]
                + [u.fmt("force", st["bolt_load_N"][b]) for st in states]
                + [u.fmt("stress", st["gasket_stress_MPa"][b] * 1e6) for st in states]
            )
        out.append(table(head, rows))
        out.append("  states: " + "; ".join(f"{st['state']}: {st['label']}" for st in states))
    out += ["", "Notes"] + [f"  - {n}" for n in r.notes]
    out += ["", FLANGE_CAUTION]
    return "\n".join(out)


def flange_sweep_csv(r: FlangeSweepResult) -> str:
    """One row per point: phase, temperature, gasket and bolt extremes, margins (SI units)."""
    A = r.sector_area
    names = list(r.margins)
    lines = [
        ",".join(
            [
                "phase",
                "temperature_degC",
                "gasket_stress_min_MPa",
                "gasket_stress_max_MPa",
                "bolt_load_min_N",
                "bolt_load_max_N",
                "rotation_deg",
                "ok",
            ]
            + [f"margin_{m}" for m in names]
        )
    ]
    ok = r.ok
    for i in range(r.temperature.size):
        vals = [
            r.phase[i],
            repr(float(r.temperature[i] - C0)),
            repr(float(r.gasket_min[i] / A * 1e-6)),
            repr(float(r.gasket_max[i] / A * 1e-6)),
            repr(float(r.bolt_min[i])),
            repr(float(r.bolt_max[i])),
            repr(float(np.degrees(r.rotation[i]))),
            "true" if ok[i] else "false",
        ] + [repr(float(r.margins[m][i])) for m in names]
        lines.append(",".join(vals))
    return "\n".join(lines) + "\n"
