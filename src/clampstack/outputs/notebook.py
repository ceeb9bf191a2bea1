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
from ..studies.scatter import ScatterResult
from ..studies.sweep import SweepResult
from .html import assembly_repr_html, flange_repr_html, scatter_repr_html
from .joint import joint_html_tables
from .sweep import sweep_html_table

html_for(JointResult)(joint_html_tables)
html_for(FlangeResult)(flange_repr_html)
html_for(AssemblyResult)(assembly_repr_html)
html_for(SweepResult)(sweep_html_table)
html_for(ScatterResult)(scatter_repr_html)
html_for(FlangeScatterResult)(scatter_repr_html)
