"""Jupyter: result objects render their tables as HTML (`_repr_html_`)."""

from __future__ import annotations

from clampstack.assembly import solve_assembly
from clampstack.flange import analyse_flange
from clampstack.inputs.assembly import read_assembly_file
from clampstack.inputs.flange import read_flange_file
from clampstack.inputs.joint import read_joint_file
from clampstack.joint import analyse
from clampstack.studies.scatter import parse_distributions, scatter
from conftest import EXAMPLES


def test_every_result_renders_html_with_the_caution():
    _, asm = read_assembly_file(str(EXAMPLES / "tie-rod-in-spacer-tube.toml"))
    _, fl = read_flange_file(str(EXAMPLES / "pump-outlet-flange-8-bolts.toml"))
    _, js = read_joint_file(str(EXAMPLES / "m16-through-bolt-alternating.toml"))
    results = [
        solve_assembly(asm),
        analyse_flange(fl, compensate=False),
        analyse(js),
        scatter(js, parse_distributions(js.distributions), 2000, seed=1),
    ]
    for r in results:
        page = r._repr_html_()
        assert page.startswith("<div>") and "<table>" in page
        assert "qualified engineer" in page
    assert "spacer-tube" in results[0]._repr_html_()
    assert "gasket_crush" in results[1]._repr_html_()
