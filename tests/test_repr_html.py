"""Jupyter: result objects render their tables as HTML (`_repr_html_`)."""

from __future__ import annotations

import subprocess
import sys

from clampstack.assembly import solve_assembly
from clampstack.flange import analyse_flange
from clampstack.inputs.assembly import read_assembly_file
from clampstack.inputs.flange import read_flange_file
from clampstack.inputs.joint import read_joint_file
from clampstack.joint import analyse
from clampstack.studies.scatter import scatter
from conftest import EXAMPLES


def test_every_result_renders_html_with_the_caution():
    _, asm = read_assembly_file(str(EXAMPLES / "tie-rod-in-spacer-tube.toml"))
    _, fl = read_flange_file(str(EXAMPLES / "pump-outlet-flange-8-bolts.toml"))
    _, js = read_joint_file(str(EXAMPLES / "m16-through-bolt-alternating.toml"))
    results = [
        solve_assembly(asm),
        analyse_flange(fl, compensate=False),
        analyse(js),
        scatter(js, js.distributions or {}, 2000, seed=1),
    ]
    for r in results:
        page = r._repr_html_()
        assert page.startswith("<div>") and "<table>" in page
        assert "qualified engineer" in page
    assert "spacer-tube" in results[0]._repr_html_()
    assert "gasket_crush" in results[1]._repr_html_()


def test_the_domain_loads_its_view_from_the_presentation_only_when_shown():
    # a fresh interpreter: analysing imports no presentation; the first display loads it once
    code = (
        "import sys\n"
        "from clampstack.inputs.joint import read_joint_file\n"
        "from clampstack.joint import analyse\n"
        f"_, s = read_joint_file({str(EXAMPLES / 'm10-cover-screw-aluminium.toml')!r})\n"
        "r = analyse(s)\n"
        "assert not any(m.startswith('clampstack.outputs') for m in sys.modules), 'early'\n"
        "page = r._repr_html_()\n"
        "assert 'clampstack.outputs.notebook' in sys.modules\n"
        "assert page.startswith('<div>') and 'PASS' in page\n"
        "print('ok')\n"
    )
    out = subprocess.run([sys.executable, "-c", code], capture_output=True, text=True)
    assert out.returncode == 0 and out.stdout.strip() == "ok", out.stderr


def test_a_class_without_a_view_falls_back_to_the_plain_repr():
    from clampstack.display import Shown, render_html

    class Plain(Shown):
        pass

    assert render_html(Plain()) is None and Plain()._repr_html_() is None
