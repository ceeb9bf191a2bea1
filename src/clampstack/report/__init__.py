"""The self-contained HTML calculation report (``clampstack report``).

:func:`render_joint_report` renders the report of an analysed joint and its
JSON and CSV companions in memory; :func:`clampstack.io.files.write_files`
then writes them, each file replaced atomically.  Nothing is written until
everything has been rendered.
"""

from __future__ import annotations

from .joint import render_joint_report, report_file_names

__all__ = ["render_joint_report", "report_file_names"]
