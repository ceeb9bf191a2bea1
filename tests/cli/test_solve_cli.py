"""``clampstack solve`` through the command line (CliRunner), per DESIGN.md."""

from __future__ import annotations

import json

import pytest
from click.testing import CliRunner

from clampstack.cli import main

ROD_TUBE = """
title = "rod and tube"
[[part]]
name = "rod"
ends = ["A", "B"]
length = "300 mm"
area = "100 mm^2"
modulus = "200 GPa"
misfit = "-0.1 mm"
[[part]]
name = "tube"
ends = ["A", "B"]
length = "300 mm"
area = "300 mm^2"
modulus = "100 GPa"
contact = "compression"
[supports]
fixed = ["A"]
[[case]]
name = "pull"
[[case.load]]
node = "B"
force = "20 kN"
"""


def run(*args: str):
    return CliRunner().invoke(main, list(args))


def test_solve_json_keys_signs_and_values(write_toml):
    path = write_toml(ROD_TUBE)
    res = run("solve", str(path), "--json")
    assert res.exit_code == 0, res.output
    out = json.loads(res.stdout)
    assert out["title"] == "rod and tube"
    assert [c["name"] for c in out["cases"]] == ["assembly", "pull"]
    # hand calculation (compatibility of a rod 0.1 mm short inside a tube):
    # k_rod = 200e3*100/300 = 66 666.7 N/mm, k_tube = 100e3*300/300 = 100 000 N/mm
    # N_rod = 0.1 * k_r k_t/(k_r+k_t) = 4000 N tension, tube -4000 N
    first = out["cases"][0]
    assert first["parts"]["rod"]["force_N"] == pytest.approx(4000.0, rel=1e-9)
    assert first["parts"]["tube"]["force_N"] == pytest.approx(-4000.0, rel=1e-9)
    assert first["parts"]["rod"]["stress_MPa"] == pytest.approx(40.0, rel=1e-9)
    assert first["parts"]["tube"]["carrying"] is True
    assert first["nodes"]["A"]["displacement_mm"] == 0.0
    assert first["reactions"]["A"]["force_N"] == pytest.approx(0.0, abs=1e-6)
    assert first["equilibrium_residual_N"] <= 1e-6
    # pull of 20 kN > separation load 4000*(1+k_r/k_t) = 6667 N: tube slack
    pull = out["cases"][1]
    assert pull["parts"]["tube"]["carrying"] is False
    assert pull["parts"]["tube"]["force_N"] == 0.0
    assert pull["parts"]["rod"]["force_N"] == pytest.approx(20e3, rel=1e-9)
    assert pull["reactions"]["A"]["force_N"] == pytest.approx(-20e3, rel=1e-9)
    # rod elongation = N/k - misfit... fitted elongation: 20000/66666.7 - 0.1 mm = 0.2 mm
    assert pull["parts"]["rod"]["elongation_mm"] == pytest.approx(0.2, rel=1e-9)
    assert pull["nodes"]["B"]["displacement_mm"] == pytest.approx(0.2, rel=1e-9)


def test_solve_readable_output_has_tables_and_caution(write_toml):
    res = run("solve", str(write_toml(ROD_TUBE)))
    assert res.exit_code == 0
    assert "Case: pull" in res.output and "no (slack)" in res.output
    assert "qualified engineer" in res.output


def test_solve_us_units(write_toml):
    res = run("solve", str(write_toml(ROD_TUBE)), "--units", "us")
    assert res.exit_code == 0
    assert "lbf" in res.output and "ksi" in res.output


@pytest.mark.parametrize(
    "example",
    [
        "tie-rod-in-spacer-tube.toml",
        "stepped-spindle-with-stop.toml",
        "load-cell-rig-bolts-and-sleeves.toml",
    ],
)
def test_examples_solve(examples_dir, example):
    res = run("solve", str(examples_dir / example), "--json")
    assert res.exit_code == 0, res.output
    out = json.loads(res.stdout)
    for case in out["cases"]:
        scale = max(abs(p["force_N"]) for p in case["parts"].values())
        assert case["equilibrium_residual_N"] <= 1e-9 * scale


def test_load_cell_rig_load_share(examples_dir):
    # Parallel bolts and sleeves: while everything carries, a push P on the bottom plate
    # is shared by stiffness (compatibility of parallel members, any mechanics text):
    # the bolts lose P k_b / (k_b + k_s + k_c,series), the sleeves and the cell gain the rest.
    out = json.loads(
        run("solve", str(examples_dir / "load-cell-rig-bolts-and-sleeves.toml"), "--json").stdout
    )
    cases = {c["name"]: c for c in out["cases"]}
    base, push = cases["assembly"]["parts"], cases["test push 150 kN"]["parts"]

    def total(state, part):
        return state[part]["total_force_N"]

    d_bolt = total(push, "bolts (M16)") - total(base, "bolts (M16)")
    d_sleeve = total(push, "spacer sleeves") - total(base, "spacer sleeves")
    d_centre = total(push, "centre sleeve") - total(base, "centre sleeve")
    assert d_bolt + d_sleeve + d_centre == pytest.approx(-150e3, rel=1e-9)
    # the load share the output gives is the same split
    share = cases["test push 150 kN"]["load_share"]["bottom: -150000 N"]
    assert share["bolts (M16)"] * -150e3 == pytest.approx(d_bolt, rel=1e-6)
    # preloaded assembly: bolt tension equals the sum of the sleeve compressions
    assert total(base, "bolts (M16)") == pytest.approx(
        -total(base, "spacer sleeves") - total(base, "centre sleeve"), rel=1e-9
    )
    assert base["bolts (M16)"]["count"] == 4
    assert base["bolts (M16)"]["force_N"] * 4 == pytest.approx(total(base, "bolts (M16)"))


def test_mechanism_names_the_nodes(write_toml):
    # a tip held only by a compression-only part, pulled away: a mechanism, named by node
    text = """
[[part]]
name = "rod"
ends = ["base", "tip"]
stiffness = "100 kN/mm"
contact = "compression"
[supports]
fixed = ["base"]
[[load]]
node = "tip"
force = "5 kN"
"""
    res = run("solve", str(write_toml(text)))
    assert res.exit_code == 2
    assert "nodes tip" in res.stderr and "mechanism" in res.stderr


def test_design_md_example_literally(write_toml):
    # the [[part]] example of DESIGN.md as written: a fixed node "B" that no part uses is a
    # support with nothing on it (reaction 0)
    text = """
title = "..."
[[part]]
name = "rod"
ends = ["A", "C"]
length = "450 mm"
area = "314 mm^2"
material = "steel"
[supports]
fixed = ["A", "B"]
[[load]]
node = "C"
force = "60 kN"
"""
    out = json.loads(run("solve", str(write_toml(text)), "--json").stdout)
    case = out["cases"][0]
    assert case["parts"]["rod"]["force_N"] == pytest.approx(60e3)
    assert case["reactions"]["B"]["force_N"] == 0.0
    assert case["reactions"]["A"]["force_N"] == pytest.approx(-60e3)


@pytest.mark.parametrize(
    "fixed, load, key, hint",
    [
        ('["base", "Tip"]', "tip", "supports.fixed[2]", "did you mean 'tip'?"),
        ('["bsae"]', "tip", "supports.fixed", "base"),  # no fixed node a part uses at all
        ('["base"]', "tpi", "load[1].node", "did you mean 'tip'?"),
    ],
)
def test_misspelt_node_names_are_refused_with_a_did_you_mean(write_toml, fixed, load, key, hint):
    text = f"""
[[part]]
name = "rod"
ends = ["base", "tip"]
stiffness = "100 kN/mm"
[supports]
fixed = {fixed}
[[load]]
node = "{load}"
force = "5 kN"
"""
    res = run("solve", str(write_toml(text)))
    assert res.exit_code == 2
    assert key in res.stderr and hint in res.stderr
    assert len(res.stderr.strip().splitlines()) == 1
