"""Figures of a single-bolt joint, drawn from a :class:`~clampstack.joint.JointResult`.

* :func:`joint_diagram` - the joint load diagram (VDI 2230-1:2015, 5.3.1: force
  against elongation of bolt and clamped parts), with the assembly preload
  range, the embedding loss, the thermal change, the working load split by the
  load factor and the separation point;
* :func:`bolt_load_plot` - bolt load and clamp load against the working load,
  solved with the joint network (:func:`clampstack.joint.curves.load_curve`);
* :func:`spring_schematic` - the spring model of the joint.

Nothing here recomputes mechanics: forces come from the result (its states,
preloads, separation load, load factor); only the straight lines of the diagram
between those points are drawn from the resiliences (slopes ``1/delta``).

Every artist that carries a value has a ``gid`` (``bolt``, ``clamped-max``,
``working-load``, ``value-FA,sep``, ...) so that tests can read the plotted
data back.
"""

from __future__ import annotations

from typing import Any

import numpy as np
from matplotlib.figure import Figure
from matplotlib.patches import FancyArrowPatch, Rectangle

from ..joint.analysis import JointResult
from ..outputs.text import UNIT_SYSTEMS, fmt_number
from ._style import (
    BOLT,
    BOLT_LIGHT,
    CLAMP,
    EMBED,
    GOOD,
    INK,
    LIMIT,
    LOAD,
    MUTED,
    THERMAL,
    new_figure,
    style,
)

C0 = 273.15


def _units(units: str) -> tuple[str, float, str, float]:
    u = UNIT_SYSTEMS[units]
    return u.force[0], u.force[1], u.small_length[0].replace("um", "µm"), u.small_length[1]


def _state(result: JointResult, key: str):
    for st in result.states:
        if st.key == key:
            return st
    raise KeyError(key)


def _line(ax, x, y, gid: str, **kw: Any):
    (ln,) = ax.plot(np.asarray(x, dtype=float), np.asarray(y, dtype=float), **kw)
    ln.set_gid(gid)
    return ln


def _arrow(ax, xy0, xy1, color: str, gid: str, both: bool = True, lw: float = 1.1):
    a = FancyArrowPatch(
        xy0,
        xy1,
        arrowstyle="<|-|>" if both else "-|>",
        mutation_scale=7,
        color=color,
        lw=lw,
        shrinkA=0,
        shrinkB=0,
    )
    a.set_gid(gid)
    ax.add_patch(a)
    return a


def _dodge(values: list[float], gap: float) -> list[float]:
    """Spread label positions (ascending order kept) so that neighbours are ``gap`` apart."""
    if not values:
        return []
    order = np.argsort(values)
    pos = np.asarray(values, dtype=float)[order]
    for i in range(1, pos.size):
        pos[i] = max(pos[i], pos[i - 1] + gap)
    out = np.empty_like(pos)
    out[order] = pos
    return out.tolist()


# --------------------------------------------------------------------------- joint diagram


def joint_diagram(result: JointResult, units: str = "si") -> Figure:
    """The joint load diagram of ``result`` (VDI 2230-1:2015, 5.3.1; the layout is our own).

    Main panel: the bolt line (slope ``1/delta_S``) rising through the maximum
    and minimum assembly preload, the clamped-parts lines (slope ``-1/delta_P``)
    at ``F_M,max``, ``F_M,min``, after embedding (shifted by ``f_Z``, preload
    ``F_M,min - F_Z``) and at service temperature (``+ dF_V,th``).  Detail panel:
    the working load ``F_A`` at the service-temperature preload of the minimum
    branch, split into the bolt load increase ``Phi_n F_A`` and the clamp load
    decrease ``(1 - Phi_n) F_A``, and the separation point ``F_A,sep``.  With a
    load introduction factor ``n < 1`` the working-load lines have the slopes of
    the springs the load acts on: ``1/(delta_S + (1 - n) delta_P)`` on the bolt
    side and ``-1/(n delta_P)`` on the clamp side (the joint network: F_A acts
    between the planes A and B, on the bolt in series with the outer parts of the
    stack on one side and on the part between A and B on the other, which gives
    ``Phi_n = n delta_P / (delta_S + delta_P)`` of VDI 2230-1, 5.3.1); with
    ``n = 1`` they are the bolt and clamped-parts lines themselves.

    The main panel uses the resiliences at assembly temperature, the detail panel
    those at service temperature (as the result's load factor does).
    """
    fl, ff, xl, xf = _units(units)
    s = result.spec
    dS, dP = result.springs.delta_S, result.springs.delta_P
    dSs, dPs = result.springs_service.delta_S, result.springs_service.delta_P
    n = s.service.load_height
    phi = result.load_factor_service
    FMmin, FMmax = result.assembly_min, result.assembly_max
    FV = _state(result, "embedded").bolt_min
    FVT = _state(result, "temperature").bolt_min
    svc = _state(result, "service_max")
    FA = svc.axial_load
    Fsep = result.separation_load
    thermal = abs(FVT - FV) > 1e-9 * FMmax
    uu = UNIT_SYSTEMS[units]
    T0, T1, TS = (
        uu.temp(s.service.assembly_temperature),
        uu.temp(s.service.temperature),
        uu.temp_symbol,
    )

    def X(v: float) -> float:
        return v / xf

    def Y(v: float) -> float:
        return v / ff

    with style():
        fig = new_figure(height=4.3)
        gs = fig.add_gridspec(2, 2, width_ratios=[1.75, 1.0], height_ratios=[1.25, 1.0])
        ax = fig.add_subplot(gs[:, 0])
        az = fig.add_subplot(gs[0, 1])
        av = fig.add_subplot(gs[1, 1])
        ax.set_title("Joint load diagram")
        ax.set_xlabel(f"elongation of bolt, shortening of clamped parts [{xl}]")
        ax.set_ylabel(f"force [{fl}]")

        F_top = max(FMmax, FVT, svc.bolt_max, result.permissible_preload) * 1.08
        _line(ax, [0, X(F_top * dS)], [0, Y(F_top)], "bolt", color=BOLT, lw=2.0, label="bolt")

        def clamped(F: float, gid: str, **kw: Any):
            return _line(ax, [X(F * dS), X(F * (dS + dP))], [Y(F), 0.0], gid, **kw)

        clamped(FMmax, "clamped-max", color=CLAMP, lw=2.0, label="clamped parts at F_M,max")
        clamped(FMmin, "clamped-min", color=CLAMP, lw=2.0, ls=(0, (5, 2)), label="at F_M,min")
        clamped(FV, "clamped-embedded", color=EMBED, lw=1.3, label="after embedding")
        if thermal:
            clamped(
                FVT,
                "clamped-thermal",
                color=THERMAL,
                lw=1.3,
                ls=(0, (6, 2, 1.5, 2)),
                label=f"at service temperature ({T1:.4g} {TS})",
            )
        ax.axhspan(Y(FMmin), Y(FMmax), color=BOLT_LIGHT, alpha=0.45, lw=0, zorder=0)
        ax.axhline(Y(result.permissible_preload), color=LIMIT, lw=0.9, ls=(0, (1, 2)))
        ax.get_lines()[-1].set_gid("level-FMzul")
        x_right = max(X(FMmax * (dS + dP)), X(F_top * dS)) * 1.04
        ax.set_xlim(0, x_right)
        ax.set_ylim(0, Y(F_top) * 1.04)

        # preload levels: dotted from the force axis to their point on the bolt line
        levels = [
            ("FMzul", "F_M,zul", result.permissible_preload, LIMIT),
            ("FMmax", "F_M,max", FMmax, CLAMP),
            ("FMmin", "F_M,min", FMmin, CLAMP),
            ("FV", "F_V", FV, EMBED),
        ]
        if thermal:
            levels.append(("FVT", "F_V,T", FVT, THERMAL))
        for key, _, F, c in levels[1:]:
            _line(ax, [0, X(F * dS)], [Y(F)] * 2, f"level-{key}", color=c, lw=0.7, ls=":")
        ylim = ax.get_ylim()[1]
        ys = _dodge([Y(F) / ylim for _, _, F, _ in levels], 0.045)
        for (key, sym, _, c), yf in zip(levels, ys, strict=True):
            t = ax.text(0.012, yf, sym, transform=ax.transAxes, color=c, va="bottom", fontsize=8)
            t.set_gid(f"label-{key}")

        # embedding and temperature: the preload changes, as arrows beside the bolt line (on its
        # empty side) from one preload to the next; f_Z along the elongation axis
        off = 0.035 * x_right

        def change(F0: float, F1: float, color: str, gid: str, sym: str) -> None:
            _arrow(ax, (X(F0 * dS) - off, Y(F0)), (X(F1 * dS) - off, Y(F1)), color, gid)
            ax.annotate(
                sym,
                (X(0.5 * (F0 + F1) * dS) - off, Y(0.5 * (F0 + F1))),
                xytext=(-4, 0),
                textcoords="offset points",
                ha="right",
                va="center",
                color=color,
            )

        change(FMmin, FV, EMBED, "arrow-FZ", "F_Z")
        if FV > 0:
            y0 = 0.035 * Y(F_top)
            xa, xb = X(FV * (dS + dP)), X(FMmin * (dS + dP))
            _arrow(ax, (xa - y0 * X(dP) / Y(1.0), y0), (xb - y0 * X(dP) / Y(1.0), y0), EMBED, "f_Z")
            ax.text(0.5 * (xa + xb), 2.2 * y0, "f_Z", color=EMBED, ha="center", va="bottom")
        if thermal:
            change(FV, FVT, THERMAL, "arrow-dFth", "ΔF_V,th")

        # working load: the detail panel, and its outline on the main panel
        a_side = dSs + (1.0 - n) * dPs  # springs the bolt-side share of F_A acts on
        b_side = n * dPs  # springs the clamp-side share acts on (between the planes A and B)
        Fknee = Fsep
        if result.eccentric is not None:
            # eccentric loading: the clamp side n delta_P**, the bolt side the rest of
            # delta_S + delta_P*, so that b / (a + b) = Phi_en* (VDI 2230-1, 5.3.2); the
            # lines are drawn straight to where the clamp side would reach zero, the opening
            # point F_A,ab is marked on them
            ej = result.eccentric_joint
            b_side = n * ej.dP_2star
            a_side = max(dSs + dPs - b_side, 1e-6 * (dSs + dPs))
            Fknee = max(FVT, 0.0) / (1 - phi) if phi < 1 else Fsep
        xP = X(FVT * dS)
        points = _service_geometry(FVT, FA, Fknee, phi, a_side, b_side)
        if FVT > 0:
            x_sep = xP + X(points["x_sep"])
            xs = [xP, x_sep, xP + X(points["x_A"])]
            ys_ = [0.0, Y(max(Fsep, svc.bolt_min, FVT))]
            span_x = max(xs) - min(xs)
            pad_x = max(span_x * 0.35, 1e-3 * x_right)
            box = (min(xs) - pad_x, max(xs) + pad_x, ys_[0], ys_[1] * 1.15)
            ax.add_patch(
                Rectangle(
                    (box[0], Y(min(svc.clamp_min, FVT)) * 0.9),
                    box[1] - box[0],
                    box[3] - Y(min(svc.clamp_min, FVT)) * 0.9,
                    fill=False,
                    ec=MUTED,
                    lw=0.6,
                    ls=(0, (2, 2)),
                    gid="detail-outline",
                )
            )
            _service_panel(
                az, result, dS, dP, xP, box, points, X, Y, fl, xl, thermal, T1, Fknee, a_side
            )
        else:
            az.set_axis_off()
            az.text(
                0.5,
                0.5,
                "no preload left at service temperature",
                ha="center",
                va="center",
                color=LIMIT,
                transform=az.transAxes,
            )

        # the values, as a small table
        closed = FA <= Fsep  # the interface still carries at the maximum working load
        av.set_axis_off()
        rows = [
            ("FMmax", "F_M,max", FMmax),
            ("FMmin", "F_M,min", FMmin),
            ("FZ", "F_Z", result.embedding_loss),
            ("dFth", "ΔF_V,th", result.thermal_change),
            ("FVT", "F_V,T" if thermal else "F_V", FVT),
            ("FA", "F_A,max", FA),
            # the bolt load increase and clamp load decrease under F_A (VDI 2230-1 F_SA, F_PA):
            # Phi_n F_A and (1 - Phi_n) F_A while the joint stays closed
            ("FSA", "F_SA = Φ_n·F_A" if closed else "F_SA (open)", svc.bolt_min - FVT),
            (
                "FPA",
                "F_PA = (1 − Φ_n)·F_A" if closed else "F_PA (open)",
                FVT - svc.clamp_min,
            ),
            ("FKR", "F_KR,min", svc.clamp_min),
            ("FA,sep", "F_A,sep", Fsep),
        ]
        if result.eccentric is not None:
            e = result.eccentric
            rows[-1] = ("FKab", "F_Kab", e["opening_clamp_load_N"] or 0.0)
            closed = not e["opened"]
            rows[6] = ("FSA", "F_SA" + ("" if closed else " (open)"), svc.bolt_min - FVT)
            rows[7] = ("FPA", "F_PA" + ("" if closed else " (open)"), FVT - svc.clamp_min)
        tiny = 1e-9 * FMmax  # round-off of differences of states: show as zero
        rows = [(k, sym, 0.0 if abs(v) < tiny else v) for k, sym, v in rows]
        step = 1.0 / (len(rows) + 1.5)
        for i, (key, sym, v) in enumerate(rows):
            y = 1.0 - (i + 0.5) * step
            av.text(0.02, y, sym, transform=av.transAxes, va="center", color=INK).set_gid(
                f"symbol-{key}"
            )
            av.text(
                0.98,
                y,
                f"{fmt_number(v / ff)} {fl}",
                transform=av.transAxes,
                va="center",
                ha="right",
                color=INK,
            ).set_gid(f"value-{key}")
        sym = "Φ*_en" if result.eccentric is not None else "Φ_n"
        note = f"{sym} = {phi:.4g} (n = {n:.3g}); {T0:.4g} → {T1:.4g} {TS}"
        av.text(
            0.02,
            1.0 - (len(rows) + 0.6) * step,
            note,
            transform=av.transAxes,
            color=MUTED,
            va="center",
            fontsize=7.5,
        ).set_gid("value-phi")
        fig.legend(
            handles=ax.get_legend_handles_labels()[0],
            loc="outside lower center",
            ncols=5 if thermal else 4,
            fontsize=7,
            handlelength=2.6,
        )
    return fig


def _service_geometry(
    FVT: float, FA: float, Fsep: float, phi: float, a_side: float, b_side: float
) -> dict[str, float]:
    """Elongations [m] of the working-load construction, relative to the preload point.

    The bolt-side line rises by ``Phi_n F_A`` over ``Phi_n F_A a`` and the clamp-side
    line falls by ``(1 - Phi_n) F_A`` over the same distance (``a (Phi_n) = b (1 - Phi_n)``
    with ``Phi_n = b / (a + b)``); the clamp-side line reaches zero at ``F_V b``, where the
    bolt-side line is at ``F_A,sep``.  Beyond separation the bolt side carries all of F_A.
    """
    x_sep = FVT * b_side
    x_A = phi * FA * a_side if FA <= Fsep else x_sep + (FA - Fsep) * a_side
    return {"x_sep": x_sep, "x_A": x_A}


def _service_panel(
    az, result, dS, dP, xP, box, points, X, Y, fl, xl, thermal, T1, Fsep, a_side
) -> None:
    s = result.spec
    svc = _state(result, "service_max")
    FVT = _state(result, "temperature").bolt_min
    FA = svc.axial_load
    az.set_title("Working load, F_M,min branch", fontsize=8.5)
    az.set_xlabel(f"elongation [{xl}]", fontsize=7.5)
    x0, x1, _, ytop = box
    # the bolt line and the current clamped-parts line through the preload point
    xs = np.array([x0, x1])
    _line(az, xs, xs * (Y(1.0) / X(dS)), "detail-bolt", color=BOLT, lw=1.6)
    c = THERMAL if thermal else EMBED
    _line(
        az,
        xs,
        Y(FVT) - (xs - xP) * (Y(1.0) / X(dP)),
        "detail-clamped",
        color=c,
        lw=1.2,
        ls=(0, (6, 2, 1.5, 2)) if thermal else "-",
    )
    x_sep = xP + X(points["x_sep"])
    # working-load lines from the preload point to the separation point (and beyond)
    F_end = max(Fsep, FA)
    x_end = xP + X(points["x_A"]) if FA > Fsep else x_sep
    _line(az, [xP, x_end], [Y(FVT), Y(F_end)], "service-bolt-side", color=LOAD, lw=1.3)
    _line(az, [xP, x_sep], [Y(FVT), 0.0], "service-clamp-side", color=LOAD, lw=1.3, ls="--")
    xA = xP + X(points["x_A"])
    if FA != 0:
        # F_A as a vertical bar: the bolt's share Phi_n F_A above the preload, the clamped
        # parts' share (1 - Phi_n) F_A below it
        _line(
            az,
            [xA, xA],
            [Y(svc.clamp_min), Y(svc.bolt_min)],
            "working-load",
            color=LOAD,
            lw=4.5,
            solid_capstyle="butt",
            alpha=0.35,
        )
        if FA <= Fsep:
            _line(
                az,
                [xA, xA],
                [Y(FVT), Y(svc.bolt_min)],
                "share-bolt",
                color=BOLT,
                lw=2.0,
                solid_capstyle="butt",
            )
            _line(
                az,
                [xA, xA],
                [Y(svc.clamp_min), Y(FVT)],
                "share-clamp",
                color=CLAMP,
                lw=2.0,
                solid_capstyle="butt",
            )
        w = x1 - x0
        az.text(
            xA + 0.02 * w,
            Y(0.5 * (svc.clamp_min + svc.bolt_min)),
            " F_A",
            color=LOAD,
            va="center",
            fontsize=8.5,
        )
    az.axhline(Y(FVT), color=MUTED, lw=0.6, ls=":")
    e = result.eccentric
    if e is None:
        az.plot([x_sep], [Y(Fsep)], "o", ms=5, mfc="white", mec=LIMIT, mew=1.4, gid="separation")
        az.annotate(
            "F_A,sep",
            (x_sep, Y(Fsep)),
            xytext=(6, 2),
            textcoords="offset points",
            color=LIMIT,
            fontsize=8,
            va="bottom",
        )
    elif e["opening_load_N"] is not None:
        # the opening point: the bolt side at F_V + Phi F_A,ab, the clamp side at F_Kab
        phi, Fab = result.load_factor_service, e["opening_load_N"]
        xo = xP + X(phi * Fab * a_side)
        yb, yk = Y(FVT + phi * Fab), Y(FVT - (1 - phi) * Fab)
        az.plot([xo, xo], [yb, yk], "o", ms=5, mfc="white", mec=LIMIT, mew=1.4, gid="opening")
        az.plot([xo, xo], [yb, yk], color=LIMIT, lw=0.8, ls=":")
        az.annotate(
            "F_A,ab",
            (xo, yb),
            xytext=(6, 2),
            textcoords="offset points",
            color=LIMIT,
            fontsize=8,
            va="bottom",
        )
        az.annotate(
            "F_Kab",
            (xo, yk),
            xytext=(6, -2),
            textcoords="offset points",
            color=LIMIT,
            fontsize=8,
            va="top",
        )
    az.plot([xP], [Y(FVT)], "o", ms=3.5, color=INK, gid="preload-point")
    az.annotate(
        "F_V,T" if thermal else "F_V",
        (xP, Y(FVT)),
        xytext=(-10, 0),
        textcoords="offset points",
        ha="right",
        va="center",
        fontsize=8,
    )
    az.set_xlim(x0, x1)
    az.set_ylim(0.0, ytop)
    rq = s.requirements.residual_clamp_load
    if rq > 0 and Y(rq) < ytop:
        az.axhline(Y(rq), color=GOOD, lw=0.8, ls=(0, (4, 2)))
        az.get_lines()[-1].set_gid("required-clamp-load")
        az.text(x0 + 0.02 * (x1 - x0), Y(rq), "F_K,erf", color=GOOD, va="bottom", fontsize=7.5)


# --------------------------------------------------------------------------- load curves


def bolt_load_plot(result: JointResult, units: str = "si", n_points: int = 61) -> Figure:
    """Bolt load and clamp load against the working load (joint network, service temperature).

    Solid: minimum assembly preload with embedding (governs the residual clamp
    load and separation); dashed: maximum assembly preload without embedding
    (governs the bolt load).  The knee of each branch is its separation load
    (VDI 2230-1:2015, 5.3.2); the shaded band is the service load range.
    """
    from ..joint.curves import load_curve

    if result.eccentric is not None:
        return eccentric_load_plot(result, units, n_points)
    fl, ff, _, _ = _units(units)
    s = result.spec
    lo = load_curve(result, n_points, "min")
    top = float(lo.axial_load[-1])
    hi = load_curve(result, n_points, "max", up_to=top)
    FA_lo, FA_hi = s.service.axial_load
    with style():
        fig = new_figure(height=3.4)
        ax = fig.add_subplot()
        ax.set_title(
            "Bolt load and clamp load against the working load "
            f"({UNIT_SYSTEMS[units].temp(s.service.temperature):.4g} {UNIT_SYSTEMS[units].temp_symbol})"
        )
        ax.set_xlabel(f"working load F_A [{fl}]")
        ax.set_ylabel(f"force [{fl}]")
        if FA_hi != FA_lo:
            ax.axvspan(FA_lo / ff, FA_hi / ff, color=LOAD, alpha=0.08, lw=0)
        ax.axvline(FA_hi / ff, color=LOAD, lw=0.9, ls=(0, (4, 2)))
        ax.get_lines()[-1].set_gid("FA-max")
        x = lo.axial_load / ff
        ax.plot(x, x, color=MUTED, lw=0.7, ls=":", gid="FS=FA", label="F_S = F_A")
        _line(
            ax,
            hi.axial_load / ff,
            hi.bolt_load / ff,
            "bolt-max",
            color=BOLT,
            lw=1.2,
            ls=(0, (5, 2)),
            label="bolt, F_M,max",
        )
        _line(
            ax,
            hi.axial_load / ff,
            hi.clamp_load / ff,
            "clamp-max",
            color=CLAMP,
            lw=1.2,
            ls=(0, (5, 2)),
            label="clamp, F_M,max",
        )
        _line(ax, x, lo.bolt_load / ff, "bolt-min", color=BOLT, lw=2.0, label="bolt, F_M,min")
        _line(ax, x, lo.clamp_load / ff, "clamp-min", color=CLAMP, lw=2.0, label="clamp, F_M,min")
        rq = s.requirements.residual_clamp_load
        if rq > 0:
            ax.axhline(rq / ff, color=GOOD, lw=0.9, ls=(0, (4, 2)))
            ax.get_lines()[-1].set_gid("required-clamp-load")
            ax.annotate(
                "required clamp load",
                (1.0, rq / ff),
                xycoords=("axes fraction", "data"),
                xytext=(-2, 3),
                textcoords="offset points",
                ha="right",
                va="bottom",
                color=GOOD,
                fontsize=7.5,
            )
        if lo.separation_load > 0 and lo.separation_load <= top:
            sx = lo.separation_load / ff
            ax.plot([sx], [sx], "o", ms=5, mfc="white", mec=LIMIT, mew=1.4, gid="separation-min")
            ax.annotate(
                "F_A,sep",
                (sx, sx),
                xytext=(-6, 6),
                textcoords="offset points",
                ha="right",
                va="bottom",
                color=LIMIT,
                fontsize=8,
            )
        if hi.separation_load <= top:
            sx = hi.separation_load / ff
            ax.plot([sx], [sx], "o", ms=4, mfc="white", mec=LIMIT, mew=1.0, gid="separation-max")
        svc = _state(result, "service_max")
        ax.plot(
            [FA_hi / ff] * 2,
            [svc.clamp_min / ff, svc.bolt_min / ff],
            "o",
            ms=3,
            color=INK,
            gid="service-points",
        )
        info = (
            f"at F_A,max = {fmt_number(FA_hi / ff)} {fl}, minimum preload: "
            f"bolt load {fmt_number(svc.bolt_min / ff)} {fl}, "
            f"residual clamp load {fmt_number(svc.clamp_min / ff)} {fl}\n"
            f"separation at F_A,sep = {fmt_number(result.separation_load / ff)} {fl}"
            f" ({fmt_number(hi.separation_load / ff)} {fl} at maximum preload)"
        )
        ax.text(
            0.01,
            0.985,
            info,
            transform=ax.transAxes,
            va="top",
            fontsize=7.5,
            color=INK,
            linespacing=1.5,
            gid="info",
        )
        ax.set_xlim(min(0.0, FA_lo / ff), top / ff)
        ax.set_ylim(0, max(float(hi.bolt_load.max()), top) / ff * 1.3)
        fig.legend(loc="outside lower center", ncols=5, fontsize=7, handlelength=2.6)
    return fig


def eccentric_load_plot(result: JointResult, units: str = "si", n_points: int = 61) -> Figure:
    """Bolt load, clamp load and contact against the working load of an eccentric joint.

    The axial load and the bending moment grow together, ``lambda (F_A,max, M_B,max)``;
    the horizontal axis is ``lambda F_A,max`` (or ``lambda M_B,max`` where no axial load
    acts).  Up to the opening point the VDI 2230-1 linear relations (5.3.2); beyond it the
    contact model of :mod:`clampstack.joint.eccentric` (our model), with the linear line
    continued dotted for comparison and the clamp load against opening ``lambda F_Kab``.
    Lower panel: the part of the interface in contact.  Service temperature.
    """
    fl, ff, _, _ = _units(units)
    s = result.spec
    e, ej = result.eccentric, result.eccentric_joint
    assert e is not None and ej is not None
    FA, MB = s.service.axial_load[1], s.service.bending_moment[1]
    by_force = FA > 0
    lam_ab = e["opening_load_ratio"]
    top = 1.5 * max(1.0, lam_ab or 0.0)
    extra = [1.0] + ([lam_ab] if lam_ab is not None and lam_ab <= top else [])
    lam = np.unique(np.concatenate([np.linspace(0.0, top, n_points), extra]))
    FV_lo = _state(result, "temperature").bolt_min
    FV_hi = _state(result, "temperature").bolt_max
    bolt_lo, clamp_lo, cw_lo = ej.curve(FV_lo, FA, MB, lam)
    bolt_hi, _, _ = ej.curve(FV_hi, FA, MB, lam)
    uu = UNIT_SYSTEMS[units]
    (ml, mf), (ll, lf) = uu.torque, uu.length
    x = lam * (FA / ff if by_force else MB / mf)
    xlabel = (
        f"working load F_A [{fl}]" if by_force else f"bending moment M_B [{ml.replace('*', '·')}]"
    )
    lin = FV_lo + lam * (ej.phi_en * FA + ej.phi_m * MB)
    with style():
        fig = new_figure(height=4.2)
        gs = fig.add_gridspec(2, 1, height_ratios=[3.0, 1.0])
        ax = fig.add_subplot(gs[0])
        aw = fig.add_subplot(gs[1], sharex=ax)
        ax.set_title(
            "Eccentric joint: bolt load and clamp load through and past opening "
            f"({UNIT_SYSTEMS[units].temp(s.service.temperature):.4g} "
            f"{UNIT_SYSTEMS[units].temp_symbol})"
        )
        ax.set_ylabel(f"force [{fl}]")
        ax.axvline(x[lam == 1.0][0], color=LOAD, lw=0.9, ls=(0, (4, 2)))
        ax.get_lines()[-1].set_gid("load-max")
        if lam_ab is not None and lam_ab <= top:
            xo = lam_ab * (FA / ff if by_force else MB / mf)
            ax.axvspan(xo, x[-1], color=LIMIT, alpha=0.06, lw=0)
            ax.text(
                xo,
                0.02,
                "  past opening: contact model",
                transform=ax.get_xaxis_transform(),
                color=LIMIT,
                fontsize=7.5,
                va="bottom",
            )
        _line(
            ax,
            x,
            bolt_hi / ff,
            "bolt-max",
            color=BOLT,
            lw=1.2,
            ls=(0, (5, 2)),
            label="bolt, F_M,max",
        )
        _line(ax, x, bolt_lo / ff, "bolt-min", color=BOLT, lw=2.0, label="bolt, F_M,min")
        _line(ax, x, clamp_lo / ff, "clamp-min", color=CLAMP, lw=2.0, label="clamp, F_M,min")
        past = lam >= (lam_ab if lam_ab is not None else np.inf)
        if past.any():
            _line(
                ax,
                x[past],
                lin[past] / ff,
                "bolt-linear",
                color=MUTED,
                lw=1.0,
                ls=":",
                label="VDI linear F_V + Φ*_en·F_A",
            )
        if e["opening_clamp_load_N"] is not None and e["opening_clamp_load_N"] > 0:
            _line(
                ax,
                x,
                lam * e["opening_clamp_load_N"] / ff,
                "opening-clamp-load",
                color=LIMIT,
                lw=0.9,
                ls=(0, (4, 2)),
                label="F_Kab (clamp load against opening)",
            )
        if lam_ab is not None and lam_ab <= top:
            i = int(np.argmin(np.abs(lam - lam_ab)))
            ax.plot(
                [x[i]] * 2,
                [bolt_lo[i] / ff, clamp_lo[i] / ff],
                "o",
                ms=5,
                mfc="white",
                mec=LIMIT,
                mew=1.4,
                gid="opening",
            )
            ax.annotate(
                "opening",
                (x[i], bolt_lo[i] / ff),
                xytext=(-6, 6),
                textcoords="offset points",
                ha="right",
                color=LIMIT,
                fontsize=8,
            )
        ax.set_ylim(0, max(float(bolt_hi.max()), float(bolt_lo.max())) / ff * 1.12)
        ax.tick_params(labelbottom=False)
        _line(aw, x, cw_lo / lf, "contact-width", color=INK, lw=1.4)
        aw.axhline(ej.interface.length / lf, color=MUTED, lw=0.7, ls=":")
        aw.set_ylim(0, ej.interface.length / lf * 1.1)
        aw.set_ylabel(f"contact [{ll}]", fontsize=7.5)
        aw.set_xlabel(xlabel)
        aw.set_xlim(0, x[-1])
        fig.legend(loc="outside lower center", ncols=3, fontsize=7, handlelength=2.6)
    return fig


# --------------------------------------------------------------------------- schematic


def _spring(
    ax,
    x: float,
    y0: float,
    y1: float,
    color: str,
    coils: int = 6,
    width: float = 0.09,
    gid: str = "",
) -> None:
    """A zigzag spring from (x, y0) to (x, y1) with straight leads."""
    h = y1 - y0
    lead = 0.18 * h
    ys = np.linspace(y0 + lead, y1 - lead, 2 * coils + 1)
    xs = x + width * np.array([0.0] + [(-1) ** k for k in range(1, 2 * coils)] + [0.0])
    ax.plot([x, x], [y0, y0 + lead], color=color, lw=1.4, solid_capstyle="butt")
    ax.plot(xs, ys, color=color, lw=1.4, gid=gid or None)
    ax.plot([x, x], [y1 - lead, y1], color=color, lw=1.4, solid_capstyle="butt")


def spring_schematic(result: JointResult) -> Figure:
    """The spring model of the joint: bolt segments in series, parallel to the clamped stack.

    The clamped parts are split at the load introduction planes A and B
    (load introduction factor n, VDI 2230-1:2015, 5.2.2); the part between A and B
    holds the interface and carries compression only; the working load F_A pulls
    A and B apart.  Labels give each spring's resilience at assembly temperature.
    """
    s = result.spec
    n = s.service.load_height
    dS, dP = result.springs.delta_S, result.springs.delta_P
    segs = result.springs.segments

    def res(v: float) -> str:
        return f"{fmt_number(v * 1e9, 3)} µm/kN"

    with style():
        fig = new_figure(height=3.7)
        ax = fig.add_subplot()
        ax.set_axis_off()
        ax.set_xlim(0, 10)
        ax.set_ylim(-1.2, 10.6)
        yH, yN = 9.4, 0.6
        xb, xc = 2.4, 5.6
        # rigid head and nut planes tie bolt and clamped parts together
        nut = "tapped part" if s.tapped else "nut"
        for y, lab in ((yH, "H  head bearing plane"), (yN, f"N  {nut} bearing plane")):
            ax.plot([xb - 0.5, xc + 0.9], [y, y], color=INK, lw=3.0, solid_capstyle="butt")
            ax.text(xc + 1.05, y, lab, va="center", fontsize=7.5, color=INK)
        # bolt: its segments in series
        k = len(segs)
        edges = np.linspace(yH, yN, k + 1)
        for i, (name, _, r) in enumerate(segs):
            _spring(ax, xb, edges[i + 1], edges[i], BOLT, coils=3, width=0.16, gid=f"bolt-{i}")
            ax.text(
                xb - 0.35,
                0.5 * (edges[i] + edges[i + 1]),
                f"{name}\n{res(r)}",
                ha="right",
                va="center",
                fontsize=6.8,
                color=BOLT,
                linespacing=1.1,
            )
        ax.text(
            xb,
            yH + 0.55,
            f"bolt δ_S = {res(dS)}",
            ha="center",
            fontsize=8,
            color=BOLT,
            weight="bold",
        )
        ax.text(
            xb,
            yN - 0.5,
            "tension only (preload: length misfit)",
            ha="center",
            va="top",
            fontsize=7,
            color=MUTED,
        )
        ax.text(
            xc,
            yH + 0.55,
            f"clamped parts δ_P = {res(dP)}",
            ha="center",
            fontsize=8,
            color=CLAMP,
            weight="bold",
        )
        if n < 1.0 - 1e-9:
            L = yH - yN
            yA = yH - 0.5 * (1 - n) * L
            yB = yN + 0.5 * (1 - n) * L
            _spring(ax, xc, yA, yH, CLAMP, coils=2, width=0.16, gid="clamp-outer-head")
            _spring(ax, xc, yB, yA, CLAMP, coils=4, width=0.16, gid="clamp-inner")
            _spring(ax, xc, yN, yB, CLAMP, coils=2, width=0.16, gid="clamp-outer-nut")
            for y, lab in ((yA, "A"), (yB, "B")):
                ax.plot([xc - 0.45, xc + 0.45], [y, y], color=LOAD, lw=2.0, solid_capstyle="butt")
                ax.text(xc + 0.55, y, lab, va="center", fontsize=8, color=LOAD, weight="bold")
            ax.text(
                xc + 1.05,
                0.5 * (yA + yH),
                f"(1 − n)/2·δ_P = {res(0.5 * (1 - n) * dP)}",
                va="center",
                fontsize=7,
                color=CLAMP,
            )
            ax.text(
                xc + 1.05,
                0.5 * (yN + yB),
                f"(1 − n)/2·δ_P = {res(0.5 * (1 - n) * dP)}",
                va="center",
                fontsize=7,
                color=CLAMP,
            )
            mid = 0.5 * (yA + yB)
        else:
            yA, yB = yH, yN
            _spring(ax, xc, yN, yH, CLAMP, coils=6, width=0.16, gid="clamp-inner")
            mid = 0.5 * (yH + yN)
        ax.text(
            xc + 1.05,
            mid + 0.35,
            f"n·δ_P = {res(n * dP)}",
            va="center",
            fontsize=7,
            color=CLAMP,
        )
        ax.text(
            xc + 1.05,
            mid - 0.3,
            "compression only (holds the interface)",
            va="center",
            fontsize=6.8,
            color=MUTED,
        )
        # the interface: a break in the middle spring's lead
        ax.plot([xc - 0.3, xc + 0.3], [mid, mid], color=INK, lw=0.8, ls=(0, (2, 1.5)))
        # working load arrows at A (up, towards the head) and B (down)
        for y, sgn, gid in ((yA, 1, "FA-A"), (yB, -1, "FA-B")):
            a = FancyArrowPatch(
                (xc - 0.75, y),
                (xc - 0.75, y + sgn * 0.9),
                arrowstyle="-|>",
                mutation_scale=9,
                color=LOAD,
                lw=1.6,
                shrinkA=0,
                shrinkB=0,
            )
            a.set_gid(gid)
            ax.add_patch(a)
            ax.text(
                xc - 0.95,
                y + sgn * 0.45,
                "F_A",
                ha="right",
                va="center",
                color=LOAD,
                fontsize=8.5,
            )
        ax.text(
            10.0,
            -0.5,
            f"n = {n:g};  Φ_K = {result.springs.load_factor_K:.4g},  "
            f"Φ_n = n·Φ_K = {result.load_factor:.4g};  clamp length "
            f"{s.clamp_length * 1e3:.4g} mm",
            fontsize=7.5,
            color=INK,
            ha="right",
            va="top",
        )
    return fig
