"""The HTML views of results in a notebook (``_repr_html_``), registered with :mod:`clampstack.display`.

Loaded on the first display of a result (the package's top level hands the
loader to :func:`clampstack.display.set_loader`), or by importing this module.
"""

from __future__ import annotations

from ..assembly import AssemblyResult
from ..display import html_for
from ..flange.analysis import FlangeResult
from ..joint.analysis import JointResult
from ..studies.flange_scatter import FlangeScatterResult
from ..studies.flange_size import FlangeSizeResult
from ..studies.flange_sweep import FlangeSweepResult
from ..studies.scatter import ScatterResult
from ..studies.size import SizeResult
from ..studies.sweep import SweepResult
from .html import assembly_repr_html, flange_repr_html, html_table, scatter_repr_html
from .joint import joint_html_tables
from .sweep import sweep_html_table

html_for(JointResult)(joint_html_tables)
html_for(FlangeResult)(flange_repr_html)
html_for(AssemblyResult)(assembly_repr_html)
html_for(SweepResult)(sweep_html_table)
html_for(ScatterResult)(scatter_repr_html)
html_for(FlangeScatterResult)(scatter_repr_html)


def _designs_html(designs: list[dict]) -> str:
    cols = ["thread", "grade", "method", "bolt_count", "torque_Nm", "governing_check", "margin"]
    cols = [c for c in cols if any(c in d for d in designs)]
    rows = [[_cell(d.get(c)) for c in cols] for d in designs]
    return html_table(cols, rows) if designs else "<p>no passing design</p>"


def _cell(v: object) -> object:
    return f"{v:.4g}" if isinstance(v, float) else ("" if v is None else v)


@html_for(SizeResult)
def _size_html(r: SizeResult) -> str:
    return _designs_html(r.to_dict()["designs"])


@html_for(FlangeSizeResult)
def _flange_size_html(r: FlangeSizeResult) -> str:
    return _designs_html(r.data["designs"])


@html_for(FlangeSweepResult)
def _flange_sweep_html(r: FlangeSweepResult) -> str:
    pts = r.to_dict()["points"]
    step = max(len(pts) // 25, 1)
    cols = ["phase", "temperature_degC", "gasket_stress_min_MPa", "bolt_load_min_N", "ok"]
    return html_table(cols, [[_cell(p[c]) for c in cols] for p in pts[::step]])
