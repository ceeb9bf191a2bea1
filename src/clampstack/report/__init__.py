"""The self-contained HTML calculation report (``clampstack report``).

:func:`render_joint_report` renders the report of an analysed joint,
:func:`render_flange_report` that of a gasketed flange, each with its JSON and
CSV companions, in memory; :func:`clampstack.outputs.files.write_files`
then writes them, each file replaced atomically.  Nothing is written until
everything has been rendered.
"""

from __future__ import annotations

from .assembly import assembly_report_file_names, render_assembly_report
from .flange import flange_report_file_names, render_flange_report
from .joint import render_joint_report, report_file_names

__all__ = [
    "assembly_report_file_names",
    "render_assembly_report",
    "flange_report_file_names",
    "render_flange_report",
    "render_joint_report",
    "report_file_names",
]
