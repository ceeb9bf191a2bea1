"""Jupyter display of a temperature sweep: verdict, limits and a thinned table of the points."""

from __future__ import annotations

import re

from clampstack.inputs.joint import read_joint_file
from clampstack.studies.sweep import sweep

C0 = 273.15


def test_sweep_repr_html_thins_the_points(examples_dir):
    _, spec = read_joint_file(str(examples_dir / "exhaust-flange-hot.toml"))
    r = sweep(spec, 20 + C0, 300 + C0, 0.1)  # 2801 points
    page = r._repr_html_()
    rows = re.findall(r"<tr><td>([-\d.]+)</td><td>([-\d.]+)</td>", page)
    assert 20 <= len(rows) <= 25
    assert rows[0][0] == "20.0" and rows[-1][0] == "300.0"  # both ends shown
    assert rows[0][1] == f"{r.preload_min[0] / 1e3:.4g}"
    assert f"25 of {r.temperature.size} points" in page
    assert "FAIL" in page and "working_stress fails above" in page
    assert "qualified engineer" in page


def test_short_sweep_shows_every_point(examples_dir):
    _, spec = read_joint_file(str(examples_dir / "gearbox-cover-cold-to-hot.toml"))
    r = sweep(spec, -40 + C0, 150 + C0, 19.0)
    page = r._repr_html_()
    assert page.count("<tr><td>") == r.temperature.size
    assert f"({r.temperature.size} points)" in page
