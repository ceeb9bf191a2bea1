"""The one visual style of clampstack's figures, and rendering to SVG and PNG.

Figures are built on :class:`matplotlib.figure.Figure` with an Agg canvas
attached directly: pyplot and its global state are never touched, so drawing a
report changes nothing in a user's own matplotlib session (a notebook keeps its
backend).
"""

from __future__ import annotations

import io
import re
from collections.abc import Iterator
from contextlib import contextmanager
from typing import Any

import matplotlib
from matplotlib.backends.backend_agg import FigureCanvasAgg
from matplotlib.figure import Figure

# palette: ink, paper and one colour per physical role (the same role has the same colour
# in every figure: bolt, clamped parts, working load, temperature, embedding, limits)
INK = "#1e2b33"
MUTED = "#5d6b73"
GRID = "#e3e8eb"
PAPER = "#ffffff"
BOLT = "#1b6c8f"
BOLT_LIGHT = "#cfe3ec"
CLAMP = "#c0761a"
CLAMP_LIGHT = "#f3e1c8"
LOAD = "#7d3c74"
THERMAL = "#cf4a2e"
EMBED = "#6f8390"
LIMIT = "#b3261e"
LIMIT_LIGHT = "#f6dcd9"
GOOD = "#2f7a4a"
PASS_RAMP = ("#c6dbe5", "#a4c5d5", "#80aec4", "#5b97b2", "#3a82a2", "#1b6c8f")

RC: dict[str, Any] = {
    "font.family": "DejaVu Sans",
    "font.size": 8.5,
    "mathtext.fontset": "dejavusans",
    "axes.edgecolor": MUTED,
    "axes.labelcolor": INK,
    "axes.titlecolor": INK,
    "axes.titlesize": 9.5,
    "axes.titleweight": "bold",
    "axes.titlelocation": "left",
    "axes.titlepad": 8.0,
    "axes.labelsize": 8.5,
    "axes.linewidth": 0.7,
    "axes.spines.top": False,
    "axes.spines.right": False,
    "axes.grid": True,
    "axes.axisbelow": True,
    "axes.facecolor": PAPER,
    "grid.color": GRID,
    "grid.linewidth": 0.6,
    "grid.linestyle": "-",
    "xtick.color": MUTED,
    "ytick.color": MUTED,
    "xtick.labelcolor": INK,
    "ytick.labelcolor": INK,
    "xtick.labelsize": 7.5,
    "ytick.labelsize": 7.5,
    "xtick.major.size": 3.0,
    "ytick.major.size": 3.0,
    "legend.frameon": False,
    "legend.fontsize": 7.5,
    "lines.linewidth": 1.6,
    "lines.solid_capstyle": "round",
    "figure.facecolor": PAPER,
    "figure.dpi": 100,
    "savefig.facecolor": PAPER,
    # text as <text> elements (searchable, selectable, and far quicker to write than
    # glyph outlines); the labels are plain Unicode, no mathtext, so nothing is parsed
    "svg.fonttype": "none",
    "svg.hashsalt": "clampstack",  # stable ids: the same result gives the same SVG
    "path.simplify": True,
}

WIDTH = 6.9  # in: the printable width of A4 and Letter with 15 mm margins, less a little


@contextmanager
def style() -> Iterator[None]:
    """Apply clampstack's rc settings (figures must be built and saved inside)."""
    with matplotlib.rc_context(RC):
        yield


def new_figure(width: float = WIDTH, height: float = 4.2) -> Figure:
    """A Figure with an Agg canvas, outside pyplot."""
    fig = Figure(figsize=(width, height), layout="constrained")
    FigureCanvasAgg(fig)
    return fig


def figure_png(fig: Figure, dpi: int = 160) -> bytes:
    """Render ``fig`` to PNG bytes (Agg)."""
    buf = io.BytesIO()
    with style():
        fig.savefig(buf, format="png", dpi=dpi, metadata={"Software": None})
    return buf.getvalue()


def figure_svg(fig: Figure) -> str:
    """Render ``fig`` to a standalone SVG document (no date, no metadata block)."""
    buf = io.StringIO()
    with style():
        fig.savefig(buf, format="svg", metadata={"Date": None})
    return _strip_metadata(buf.getvalue())


def _strip_metadata(svg: str) -> str:
    return re.sub(r"\s*<metadata>.*?</metadata>", "", svg, count=1, flags=re.S)


_ID = re.compile(r'\bid="([^"]+)"')


def inline_svg(fig: Figure, prefix: str, title: str = "") -> str:
    """``fig`` as an ``<svg>`` element to place inside an HTML page.

    The XML declaration, DOCTYPE, metadata and namespace declarations are dropped
    (the HTML parser puts ``<svg>`` in the SVG namespace itself), so the page
    names no URL at all; ``xlink:href`` becomes the SVG 2 ``href``; every id gets
    ``prefix`` so that several figures on one page cannot clash; the size follows
    the width of the page (the viewBox keeps the aspect ratio).
    """
    svg = figure_svg(fig)
    svg = svg[svg.index("<svg") :]
    ids = set(_ID.findall(svg))
    svg = _ID.sub(lambda m: f'id="{prefix}-{m.group(1)}"', svg)

    def ref(m: re.Match[str]) -> str:
        name = m.group(2)
        return f"{m.group(1)}#{prefix}-{name}" if name in ids else m.group(0)

    svg = re.sub(r"(url\(|href=\")#([^)\"]+)", ref, svg)
    svg = svg.replace("xlink:href=", "href=")
    head_end = svg.index(">")
    head = svg[:head_end]
    head = re.sub(r'\s+xmlns(:\w+)?="[^"]*"', "", head)
    head = re.sub(r'\s+(width|height)="[^"]*"', "", head)
    head = re.sub(r'\s+version="[^"]*"', "", head)
    label = f' role="img" aria-label="{_attr(title)}"' if title else ' role="img"'
    svg = f'{head} class="figure"{label}{svg[head_end:]}'
    return svg.strip()


def _attr(text: str) -> str:
    return text.replace("&", "&amp;").replace('"', "&quot;").replace("<", "&lt;")
