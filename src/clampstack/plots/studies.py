"""Figures of studies: temperature sweep, tightening passes, scatter histograms.

Drawn from the study results as they are (no mechanics here).  Artists that
carry values have a ``gid`` so that tests can read the plotted data back.
"""

from __future__ import annotations

from collections.abc import Mapping, Sequence

import numpy as np
from matplotlib.figure import Figure

from ..outputs.text import UNIT_SYSTEMS, fmt_number
from ..studies.sweep import SweepResult
from ._style import (
    BOLT,
    BOLT_LIGHT,
    CLAMP,
    GOOD,
    INK,
    LIMIT,
    LIMIT_LIGHT,
    MUTED,
    PASS_RAMP,
    new_figure,
    style,
)


def _force(units: str) -> tuple[str, float]:
    return UNIT_SYSTEMS[units].force


def sweep_plot(result: SweepResult, units: str = "si") -> Figure:
    """Preload and residual clamp load against service temperature.

    The band is the preload at temperature between the minimum assembly preload
    (after embedding) and the maximum assembly preload: the assembly scatter
    carried through the temperature range.  The line below it is the residual
    clamp load under the maximum working load (minimum branch).  Points where a
    check fails are shaded; the temperatures where a check starts to fail
    (``result.limits``, root-found) are marked and named.
    """
    fl, ff = _force(units)
    s = result.spec
    uu = UNIT_SYSTEMS[units]
    T = uu.temp(result.temperature)
    with style():
        fig = new_figure(height=3.8)
        ax = fig.add_subplot()
        ax.set_title("Preload and residual clamp load over the service temperature")
        ax.set_xlabel(f"service temperature [{uu.temp_symbol}]")
        ax.set_ylabel(f"force [{fl}]")
        band = ax.fill_between(
            T,
            result.preload_min / ff,
            result.preload_max / ff,
            color=BOLT_LIGHT,
            lw=0,
            label="preload, assembly scatter F_M,min .. F_M,max",
        )
        band.set_gid("preload-band")
        ax.plot(T, result.preload_max / ff, color=BOLT, lw=1.0, gid="preload-max")
        ax.plot(T, result.preload_min / ff, color=BOLT, lw=1.6, gid="preload-min")
        ax.plot(
            T,
            result.residual_min / ff,
            color=CLAMP,
            lw=1.8,
            gid="residual-min",
            label="residual clamp load F_KR,min",
        )
        rq = s.requirements.residual_clamp_load
        if rq > 0:
            ax.axhline(rq / ff, color=GOOD, lw=0.9, ls=(0, (4, 2)), label="required clamp load")
            ax.get_lines()[-1].set_gid("required-clamp-load")
        Ta = uu.temp(s.service.assembly_temperature)
        if T[0] <= Ta <= T[-1]:
            ax.axvline(Ta, color=MUTED, lw=0.8, ls=":")
            ax.get_lines()[-1].set_gid("assembly-temperature")
            ax.annotate(
                f"assembly {Ta:.4g} {uu.temp_symbol}",
                (Ta, 1.0),
                xycoords=("data", "axes fraction"),
                xytext=(3, -3),
                textcoords="offset points",
                va="top",
                fontsize=7,
                color=MUTED,
            )
        bad = ~np.asarray(result.ok, dtype=bool)
        if bad.any():
            fill = ax.fill_between(
                T,
                0,
                1,
                where=bad,
                transform=ax.get_xaxis_transform(),
                color=LIMIT_LIGHT,
                lw=0,
                zorder=0,
                label="a check fails",
            )
            fill.set_gid("failing")
        for i, lim in enumerate(result.limits):
            t = uu.temp(lim.temperature)
            ax.axvline(t, color=LIMIT, lw=1.0, ls=(0, (4, 1.5)))
            ax.get_lines()[-1].set_gid(f"limit-{i}")
            where = (
                "over the whole range"
                if lim.fails == "whole range"
                else f"{lim.fails} {t:.1f} {uu.temp_symbol}"
            )
            ax.annotate(
                f"{lim.check} fails {where}",
                (t, 0.0),
                xycoords=("data", "axes fraction"),
                xytext=(3, 4 + 11 * i),
                textcoords="offset points",
                rotation=0,
                fontsize=7,
                color=LIMIT,
            ).set_gid(f"limit-label-{i}")
        top = float(np.max(result.preload_max)) / ff
        ax.set_ylim(min(0.0, float(np.min(result.residual_min)) / ff * 1.05), top * 1.1)
        ax.set_xlim(T[0], T[-1])
        fig.legend(loc="outside lower center", ncols=2, fontsize=7, handlelength=2.6)
    return fig


def passes_plot(
    passes: Sequence[Sequence[float]],
    bolt_count: int,
    target: float | None = None,
    units: str = "si",
    title: str = "Preload of each bolt after each tightening pass",
) -> Figure:
    """Preload of every bolt after every tightening pass (elastic interaction).

    Parameters
    ----------
    passes
        ``passes[k][i]``: preload of bolt ``i`` (numbered from 1 in the figure)
        after pass ``k`` [N].
    bolt_count
        Number of bolts; every pass must list that many preloads.
    target
        Target preload [N], drawn as a line if given.
    """
    if bolt_count < 1:
        raise ValueError("bolt_count must be at least 1")
    data = [np.asarray(p, dtype=float) for p in passes]
    if not data:
        raise ValueError("no passes to plot")
    for k, p in enumerate(data):
        if p.shape != (bolt_count,):
            raise ValueError(f"pass {k + 1} lists {p.size} preloads, expected {bolt_count}")
    fl, ff = _force(units)
    x = np.arange(1, bolt_count + 1)
    # earlier passes in lighter shades of the bolt colour, the final pass in the bolt colour
    idx = np.round(np.linspace(0, len(PASS_RAMP) - 2, max(len(data) - 1, 1))).astype(int)
    ramp = [PASS_RAMP[i] for i in idx][: len(data) - 1] + [BOLT]
    with style():
        fig = new_figure(height=3.4)
        ax = fig.add_subplot()
        ax.set_title(title)
        ax.set_xlabel("bolt")
        ax.set_ylabel(f"preload [{fl}]")
        for k, p in enumerate(data):
            last = k == len(data) - 1
            color = ramp[k]
            ax.plot(
                x,
                p / ff,
                marker="o",
                ms=4.5 if last else 3,
                lw=2.0 if last else 1.0,
                color=color,
                label=f"after pass {k + 1}",
                gid=f"pass-{k + 1}",
            )
        if target is not None:
            ax.axhline(target / ff, color=INK, lw=0.9, ls=(0, (4, 2)), label="target")
            ax.get_lines()[-1].set_gid("target")
        final = data[-1]
        ax.annotate(
            f"final: {fmt_number(final.min() / ff)} .. {fmt_number(final.max() / ff)} {fl}",
            (1.0, 0.0),
            xycoords="axes fraction",
            xytext=(-2, 4),
            textcoords="offset points",
            ha="right",
            fontsize=7.5,
            color=INK,
            bbox={"boxstyle": "square,pad=0.15", "fc": "white", "ec": "none", "alpha": 0.85},
        ).set_gid("final-range")
        if bolt_count <= 24:
            ax.set_xticks(x)
        ax.set_xlim(0.5, bolt_count + 0.5)
        ax.set_ylim(0, max(float(np.max([p.max() for p in data])), target or 0.0) / ff * 1.15)
        ax.legend(loc="upper left", ncols=min(len(data) + (target is not None), 6), fontsize=7)
    return fig


#: colours of the flange states, from assembly to shut-down
STATE_COLOURS = {
    "assembly": BOLT,
    "start_up": CLAMP,
    "hot": LIMIT,
    "cooled": GOOD,
    "shut_down": MUTED,
}


def gasket_states_plot(
    states: Mapping[str, Sequence[float]],
    seating: float,
    operating_minimum: float,
    crush: float,
    units: str = "si",
    labels: Mapping[str, str] | None = None,
    title: str = "Gasket stress at each bolt through the heat cycle",
) -> Figure:
    """Gasket stress of every bolt's sector at each state, against the gasket's lines.

    Parameters
    ----------
    states
        ``{state: stresses}``, one stress per bolt sector [Pa], in the order drawn.
    seating, operating_minimum, crush
        The seating stress y, the operating minimum (H_p per sector area) and the crush
        limit [Pa], drawn as horizontal lines.
    labels
        Legend text per state (default: the state's name).
    """
    u = UNIT_SYSTEMS[units]
    sl, sf = u.stress
    data = {k: np.asarray(v, dtype=float) for k, v in states.items()}
    if not data:
        raise ValueError("no states to plot")
    n = {v.size for v in data.values()}
    if len(n) != 1:
        raise ValueError("every state must list one stress per bolt")
    (count,) = n
    x = np.arange(1, count + 1)
    with style():
        fig = new_figure(height=3.6)
        ax = fig.add_subplot()
        ax.set_title(title)
        ax.set_xlabel("bolt")
        ax.set_ylabel(f"gasket stress [{sl}]")
        for k, v in data.items():
            ax.plot(
                x,
                v / sf,
                marker="o",
                ms=3.5,
                lw=1.4,
                color=STATE_COLOURS.get(k, INK),
                label=(labels or {}).get(k, k),
                gid=f"state-{k}",
            )
        for value, text, ls, gid in (
            (seating, "seating y", (0, (5, 2)), "seating"),
            (operating_minimum, "operating minimum", (0, (2, 2)), "operating-minimum"),
            (crush, "crush", "-", "crush"),
        ):
            ax.axhline(value / sf, color=LIMIT if gid != "seating" else INK, lw=0.9, ls=ls)
            ax.get_lines()[-1].set_gid(gid)
            ax.annotate(
                f"{text} {fmt_number(value / sf)} {sl}",
                (1.0, value / sf),
                xycoords=("axes fraction", "data"),
                xytext=(-2, 2),
                textcoords="offset points",
                ha="right",
                va="bottom",
                fontsize=7,
                color=INK,
            )
        top = max(crush, max(float(v.max()) for v in data.values())) / sf
        ax.set_ylim(0, top * 1.08)
        if count <= 24:
            ax.set_xticks(x)
        ax.set_xlim(0.5, count + 0.5)
        fig.legend(loc="outside lower center", ncols=min(len(data), 5), fontsize=7)
    return fig


def histogram(
    samples: Sequence[float] | np.ndarray,
    quantity: str = "assembly preload",
    unit: str = "kN",
    scale: float = 1e3,
    limit: float | None = None,
    limit_label: str = "limit",
    bins: int | str = "auto",
    percentiles: Sequence[float] = (1.0, 50.0, 99.0),
) -> Figure:
    """Histogram of ``samples`` (SI values; shown divided by ``scale`` in ``unit``).

    Percentiles (``numpy.percentile``, linear interpolation) are marked and
    named; ``limit`` (SI) is drawn as a line, with the share of samples beyond
    it on the side away from the median.
    """
    v = np.asarray(samples, dtype=float).ravel()
    v = v[np.isfinite(v)]
    if v.size == 0:
        raise ValueError("no finite samples to plot")
    shown = v / scale
    with style():
        fig = new_figure(height=3.4)
        ax = fig.add_subplot()
        ax.set_title(f"{quantity[:1].upper()}{quantity[1:]}: {v.size:,} samples".replace(",", " "))
        ax.set_xlabel(f"{quantity} [{unit}]")
        ax.set_ylabel("samples")
        _, _, patches = ax.hist(shown, bins=bins, color=BOLT, alpha=0.85, edgecolor="white", lw=0.4)
        for p in patches:
            p.set_gid("bar")
        ax.grid(axis="x", visible=False)
        pct = np.percentile(shown, list(percentiles))
        for k, (q, x) in enumerate(zip(percentiles, pct, strict=True)):
            ax.axvline(x, color=INK if q == 50 else MUTED, lw=1.0, ls="-" if q == 50 else "--")
            ax.get_lines()[-1].set_gid(f"p{q:g}")
            ax.annotate(
                f"p{q:02g} = {fmt_number(float(x))}",
                (x, 1.0),
                xycoords=("data", "axes fraction"),
                xytext=(3, -3 - 10 * (k % 2)),
                textcoords="offset points",
                va="top",
                fontsize=7,
                color=INK,
            ).set_gid(f"label-p{q:g}")
        if limit is not None:
            lim = limit / scale
            ax.axvline(lim, color=LIMIT, lw=1.4)
            ax.get_lines()[-1].set_gid("limit")
            below = lim < np.median(shown)
            share = float(np.mean(shown < lim) if below else np.mean(shown > lim))
            ax.annotate(
                f"{limit_label} {fmt_number(lim)} {unit}: {share * 100:.3g} % "
                f"{'below' if below else 'above'}",
                (lim, 0.5),
                xycoords=("data", "axes fraction"),
                xytext=(-4 if below else 4, 0),
                textcoords="offset points",
                ha="right" if below else "left",
                fontsize=7,
                color=LIMIT,
                rotation=90,
                va="center",
            ).set_gid("limit-label")
    return fig


def binned_histogram(
    edges: Sequence[float] | np.ndarray,
    counts: Sequence[int] | np.ndarray,
    quantity: str = "assembly preload",
    unit: str = "kN",
    scale: float = 1e3,
    percentiles: Mapping[float, float] | None = None,
    limit: float | None = None,
    limit_label: str = "limit",
) -> Figure:
    """Histogram already binned by a study: ``counts[i]`` samples in ``edges[i]..edges[i+1]``.

    For studies that keep counts rather than samples (the scatter study's
    ``ScatterResult.histogram``, any number of samples).  Edges, percentiles
    and ``limit`` are SI values, shown divided by ``scale`` in ``unit``;
    ``percentiles`` maps the percent (1, 50, 99) to the value the study found.
    Percentiles and the limit are lines named in a legend above the bars (the
    share beyond the limit would be only as exact as the bins, so it is not
    printed).  A limit farther from the samples than their own range is not
    drawn to scale: the legend names it and the side it lies on.
    """
    top = 0.84  # lines end here (axes fraction); the legend sits above
    e = np.asarray(edges, dtype=float).ravel()
    c = np.asarray(counts).ravel()
    if e.size != c.size + 1 or c.size == 0:
        raise ValueError(f"{c.size} counts need {c.size + 1} edges, got {e.size}")
    if not np.all(np.isfinite(e)) or np.any(np.diff(e) <= 0):
        raise ValueError("edges must be finite and increasing")
    total = int(np.sum(c))
    if total <= 0 or np.any(c < 0):
        raise ValueError("no samples to plot")
    shown = e / scale
    with style():
        fig = new_figure(height=3.4)
        ax = fig.add_subplot()
        ax.set_title(f"{quantity[:1].upper()}{quantity[1:]}: {total:,} samples".replace(",", " "))
        ax.set_xlabel(f"{quantity} [{unit}]")
        ax.set_ylabel("samples")
        bars = ax.bar(
            shown[:-1],
            c,
            width=np.diff(shown),
            align="edge",
            color=BOLT,
            alpha=0.85,
            edgecolor="white",
            lw=0.4,
        )
        for p in bars:
            p.set_gid("bar")
        ax.grid(axis="x", visible=False)
        for q, x in sorted((percentiles or {}).items()):
            ax.axvline(
                x / scale,
                color=INK if q == 50 else MUTED,
                lw=1.0,
                ls="-" if q == 50 else "--",
                ymax=top,
                label=f"p{q:02g} = {fmt_number(x / scale)} {unit}",
            )
            ax.get_lines()[-1].set_gid(f"p{q:g}")
        if limit is not None:
            lim = limit / scale
            lo, hi = shown[0], shown[-1]
            span = hi - lo
            text = f"{limit_label} {fmt_number(lim)} {unit}"
            if lo - span <= lim <= hi + span:
                ax.axvline(lim, color=LIMIT, lw=1.4, ymax=top, label=text)
            else:  # far off: named, not drawn to scale
                side = "below" if lim < lo else "above"
                ax.plot([], [], color=LIMIT, lw=1.4, label=f"{text} (off the scale, {side})")
            ax.get_lines()[-1].set_gid("limit")
        ax.set_ylim(0, float(np.max(c)) * 1.04 / top)  # the legend above the bars and lines
        if ax.get_lines():
            ax.legend(loc="upper left", ncols=4, fontsize=7, handlelength=2.2)
    return fig
