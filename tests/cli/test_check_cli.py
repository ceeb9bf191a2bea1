"""``clampstack check`` through the command line: JSON contract, exit codes, bad input."""

from __future__ import annotations

import json

import pytest
from click.testing import CliRunner
from test_bad_input import check_one_line_error

from clampstack.cli import main

JOINT = """
title = "M12 through bolt"
[bolt]
thread = "M12"
grade = "8.8"
length = "60 mm"
[nut]
[[clamped]]
material = "steel"
thickness = "20 mm"
[[clamped]]
material = "steel"
thickness = "20 mm"
[tightening]
torque = "65 N*m"
thread_friction = "0.10..0.16"
[service]
axial_load = "0..8 kN"
[requirements]
residual_clamp_load = "3 kN"
"""


def run(*args: str):
    return CliRunner().invoke(main, list(args))


def test_check_json_has_the_design_keys(write_toml):
    res = run("check", str(write_toml(JOINT)), "--json")
    assert res.exit_code == 0, res.output
    out = json.loads(res.stdout)
    # DESIGN.md: check --json prints at least these keys
    for key in ("stress_area_mm2", "stiffness_N_per_mm"):
        assert isinstance(out["bolt"][key], float)
    assert out["bolt"]["stress_area_mm2"] == pytest.approx(84.27, abs=0.01)  # ISO 898-1: 84.3
    assert isinstance(out["clamped"]["stiffness_N_per_mm"], float)
    assert 0 < out["load_factor"] < 1
    for key in (
        "assembly_min_N",
        "assembly_max_N",
        "permissible_N",
        "embedding_loss_N",
        "thermal_change_N",
    ):
        assert isinstance(out["preload"][key], float)
    for key in ("nominal_Nm", "min_Nm", "max_Nm"):
        assert isinstance(out["torque"][key], float)
    assert out["torque"]["nominal_Nm"] == pytest.approx(65.0)
    for key in ("bolt_load_max_N", "residual_clamp_load_min_N", "separation_load_N"):
        assert isinstance(out["service"][key], float)
    assert out["ok"] is True
    names = [c["name"] for c in out["checks"]]
    assert len(names) == len(set(names))
    for c in out["checks"]:
        assert set(c) >= {"name", "value", "limit", "unit", "margin", "pass", "source"}
        assert c["source"]
        assert isinstance(c["pass"], bool)
    assert out["preload"]["assembly_min_N"] < out["preload"]["assembly_max_N"]


def test_failing_check_exits_1_and_names_it(write_toml):
    text = JOINT.replace('residual_clamp_load = "3 kN"', 'residual_clamp_load = "60 kN"')
    res = run("check", str(write_toml(text)))
    assert res.exit_code == 1
    assert "RESULT: FAIL - residual_clamp_load" in res.output
    assert "qualified engineer" in res.output
    res = run("check", str(write_toml(text)), "--json")
    assert res.exit_code == 1 and json.loads(res.stdout)["ok"] is False


def test_switched_off_check_is_printed_with_reason(write_toml):
    text = (
        JOINT.replace('residual_clamp_load = "3 kN"', 'residual_clamp_load = "60 kN"')
        + """
[[skip]]
check = "residual_clamp_load"
reason = "clamp load is provided by a separate spring pack"
"""
    )
    res = run("check", str(write_toml(text)))
    assert res.exit_code == 0, res.output
    assert "separate spring pack" in res.output
    out = json.loads(run("check", str(write_toml(text)), "--json").stdout)
    c = next(c for c in out["checks"] if c["name"] == "residual_clamp_load")
    assert c["skipped"].startswith("clamp load is provided")


def test_us_units(write_toml):
    res = run("check", str(write_toml(JOINT)), "--units", "us")
    assert res.exit_code == 0
    assert "ft*lbf" in res.output and "lbf" in res.output


@pytest.mark.parametrize(
    "example",
    [
        "m10-cover-screw-aluminium.toml",
        "m16-through-bolt-alternating.toml",
        "bolt-in-aluminium-sleeve-hot.toml",
    ],
)
def test_examples_check(examples_dir, example):
    res = run("check", str(examples_dir / example), "--json")
    assert res.exit_code == 0, res.output
    assert json.loads(res.stdout)["ok"] is True


@pytest.mark.parametrize(
    ("old", "new", "needles"),
    [
        ('thread = "M12"', 'thread = "M13"', ["bolt.thread", "M12"]),
        ('grade = "8.8"', 'grade = "8.9"', ["bolt.grade", "8.8"]),
        ('length = "60 mm"', 'length = "45 mm"', ["bolt.length", "shorter than clamp length"]),
        (
            'torque = "65 N*m"',
            'torque = "65 N*m"\nhead_friction = "-0.1"',
            ["tightening.head_friction"],
        ),
        (
            'thread_friction = "0.10..0.16"',
            'thread_friction = "-0.10..0.16"',
            ["tightening.thread_friction"],
        ),
        ('torque = "65 N*m"', 'preload = "200 kN"', ["tightening.preload", "tensile strength"]),
        ("[nut]", '[nut]\nheigth = "10 mm"', ["nut.heigth", "unknown key"]),
        (
            'material = "steel"\nthickness = "20 mm"\n[tightening]',
            'material = "steel"\nthickness = "20 mm"\n[tightening]\nmethod = "torch"',
            ["tightening.method", "torque"],
        ),
        ('axial_load = "0..8 kN"', 'axial_load = "8..0 kN"', ["service.axial_load"]),
        (
            'axial_load = "0..8 kN"',
            'axial_load = "0..8 kN"\ntemperature = "900 degC"',
            ["temperature", "outside"],
        ),
    ],
)
def test_bad_joint_input(write_toml, old, new, needles):
    assert old in JOINT
    p = write_toml(JOINT.replace(old, new, 1))
    check_one_line_error(run("check", str(p)), p.name, *needles)


def test_shank_longer_than_clamp(write_toml):
    text = JOINT.replace('length = "60 mm"', 'length = "60 mm"\nshank_length = "55 mm"')
    check_one_line_error(run("check", str(write_toml(text))), "bolt.shank_length", "clamp length")


def test_unknown_thread_lists_near_matches(write_toml):
    p = write_toml(JOINT.replace('thread = "M12"', 'thread = "M11"'))
    res = run("check", str(p))
    check_one_line_error(res, "bolt.thread")
    assert "M10" in res.stderr or "M12" in res.stderr


def test_skip_needs_known_check_and_reason(write_toml):
    p = write_toml(JOINT + '[[skip]]\ncheck = "fatigeu"\nreason = "x"\n')
    check_one_line_error(run("check", str(p)), "skip[1].check", "fatigue")
    p = write_toml(JOINT + '[[skip]]\ncheck = "fatigue"\n')
    check_one_line_error(run("check", str(p)), "skip[1].reason", "missing")


def test_us_output_small_torques_in_inch_pounds_temperatures_in_degF(tmp_path):
    # US customary: below 20 ft*lbf a torque is given in in*lbf (10 N*m = 88.51 in*lbf);
    # temperatures in degF (20 degC = 68 degF); thousands with a comma
    from pathlib import Path

    from click.testing import CliRunner

    from clampstack.cli import main

    text = (Path(__file__).parents[2] / "examples" / "m10-cover-screw-aluminium.toml").read_text()
    text = text.replace('"48 N*m"', '"10 N*m"')
    path = tmp_path / "small.toml"
    path.write_text(text)
    out = CliRunner().invoke(main, ["check", str(path), "--units", "us"]).output
    assert "tightening torque 88.51 in*lbf" in out
    assert "68 -> 68 degF" in out
    big = CliRunner().invoke(main, ["check", str(path)]).output
    assert "10.00 N*m" in big and "degC" in big


def test_us_defaults_are_shown_in_us_units():
    from clampstack.outputs.text import UNIT_SYSTEMS, default_text

    us = UNIT_SYSTEMS["us"]
    assert default_text("20 degC", us) == "68 degF"
    assert default_text("6.3 um", us, "embedding.roughness") == "248.0 microinch"
    assert default_text("13.5 mm (ISO 273 medium)", us).startswith("0.5315 in (ISO 273")
    assert default_text("1.5e+04 mm^4 (cone)", us) == "1.5e+04 mm^4 (cone)"  # left as is
    assert default_text("20 degC", UNIT_SYSTEMS["si"]) == "20 degC"


def test_us_output_localizes_notes_and_joint_line():
    from clampstack.outputs.text import UNIT_SYSTEMS, localize

    us = UNIT_SYSTEMS["us"]
    # 11.03 kN = 2,480 lbf; 24 mm = 0.9449 in; 15..18 kN = 3,372..4,047 lbf; 380 degC = 716 degF
    assert localize("keeps 11.03 kN after", us) == "keeps 2,480 lbf after"
    assert localize("clamp length 24 mm (2 layers)", us) == "clamp length 0.9449 in (2 layers)"
    assert localize("uniform 15..18 kN", us) == "uniform 3,372..4,047 lbf"
    assert localize("flanges at 380 degC.", us) == "flanges at 716 degF."
    assert localize("M10 grade 8.8, 2.924e+04 mm^4", us) == "M10 grade 8.8, 2.924e+04 mm^4"
    assert localize("keeps 11.03 kN", UNIT_SYSTEMS["si"]) == "keeps 11.03 kN"
