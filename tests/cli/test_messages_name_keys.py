"""Every message names what the user wrote: file, key path or option."""

from __future__ import annotations

import json
from pathlib import Path

from click.testing import CliRunner

from clampstack.cli import main

EXAMPLES = Path(__file__).parent.parent.parent / "examples"


def _run(*args: str):
    return CliRunner().invoke(main, list(args))


def test_flange_inner_diameter_above_outer_names_the_inner_key(tmp_path):
    text = (EXAMPLES / "pump-outlet-flange-8-bolts.toml").read_text(encoding="utf-8")
    p = tmp_path / "f.toml"
    p.write_text(text.replace('inner_diameter = "90 mm"', 'inner_diameter = "250 mm"', 1))
    res = _run("flange", str(p))
    assert res.exit_code == 2 and "flange.inner_diameter" in res.stderr


def test_option_errors_name_the_option_not_the_file():
    f = str(EXAMPLES / "gearbox-cover-cold-to-hot.toml")
    res = _run("sweep", f, "--temperature", "0..50", "--step", "-1")
    assert res.exit_code == 2
    assert res.stderr.startswith("clampstack: error: --step:") and f not in res.stderr


def test_a_mechanism_names_the_parts(tmp_path):
    p = tmp_path / "a.toml"
    p.write_text(
        'title = "strut"\n[[part]]\nname = "strut"\nends = ["A", "B"]\n'
        'stiffness = "100 kN/mm"\ncontact = "compression"\n[supports]\nfixed = ["A"]\n'
        '[[case]]\nname = "pull"\n[[case.load]]\nnode = "B"\nforce = "1 kN"\n'
    )
    res = _run("solve", str(p))
    assert res.exit_code == 2
    assert "'strut' (part[1], compression only)" in res.stderr


def test_a_curve_beyond_its_last_point_warns(tmp_path):
    p = tmp_path / "c.toml"
    p.write_text(
        'title = "curve"\n[[part]]\nname = "pack"\nends = ["A", "B"]\n'
        'curve = [["0 mm", "0 kN"], ["1 mm", "5 kN"], ["2 mm", "15 kN"]]\n'
        '[supports]\nfixed = ["A"]\n[[case]]\nname = "big pull"\n[[case.load]]\n'
        'node = "B"\nforce = "30 kN"\n'
    )
    res = _run("solve", str(p), "--json")
    notes = json.loads(res.stdout)["notes"]
    assert len(notes) == 1 and "beyond its curve's last point" in notes[0]
    assert "part[1]" in notes[0] and "'big pull'" in notes[0]
    res = _run("solve", str(p))
    assert "Warnings" in res.stdout


def test_a_floating_group_names_its_parts(tmp_path):
    p = tmp_path / "f.toml"
    p.write_text(
        'title = "floating"\n[[part]]\nname = "rod"\nends = ["A", "B"]\n'
        'stiffness = "100 kN/mm"\n[[part]]\nname = "loose pair"\nends = ["C", "D"]\n'
        'stiffness = "100 kN/mm"\n[supports]\nfixed = ["A"]\n'
    )
    res = _run("solve", str(p))
    assert res.exit_code == 2 and "'loose pair' (part[2])" in res.stderr
