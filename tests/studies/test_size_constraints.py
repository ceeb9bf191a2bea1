"""`size` held to threads, methods and grades; the nearest candidates when nothing passes."""

from __future__ import annotations

import json
from pathlib import Path

import pytest
from click.testing import CliRunner

from clampstack.cli import main
from clampstack.studies.flange_size import PRESSURE_GRADES_METRIC

EX = Path(__file__).parents[2] / "examples"
JOINT = str(EX / "m10-cover-screw-aluminium.toml")
FLANGE = str(EX / "pump-outlet-flange-8-bolts.toml")


def _size(*args: str) -> tuple[int, dict]:
    res = CliRunner().invoke(main, ["size", *args, "--json"])
    return res.exit_code, json.loads(res.stdout) if res.stdout.strip() else {}


def test_held_to_one_thread_a_range_methods_and_grades():
    code, d = _size(JOINT, "--thread", "M8")
    assert code == 0 and {x["thread"] for x in d["designs"]} == {"M8"}
    code, d = _size(JOINT, "--threads", "M6..M8", "--methods", "torque", "--grades", "8.8,10.9")
    assert {x["thread"] for x in d["designs"]} <= {"M6", "M7", "M8"}
    assert {x["method"] for x in d["designs"]} == {"torque"}
    assert {x["grade"] for x in d["designs"]} <= {"8.8", "10.9"}
    assert d["constraints"]["methods"] == ["torque"]


def test_nothing_passes_gives_the_nearest_with_remedies():
    code, d = _size(JOINT, "--threads", "M5..M6", "--grades", "4.6", "--methods", "torque")
    assert code == 1 and not d["designs"]
    assert 1 <= len(d["nearest"]) <= 3
    for n in d["nearest"]:
        assert n["failing"] and all(f["remedy"] and f["margin"] < 0 for f in n["failing"])


def test_flange_search_defaults_to_pressure_bolting_grades():
    code, d = _size(FLANGE)
    assert code == 0 and {x["grade"] for x in d["designs"]} <= set(PRESSURE_GRADES_METRIC)
    assert "pressure bolting" in d["grades_basis"]
    code, d = _size(FLANGE, "--grades", "10.9", "--methods", "tension")
    assert {x["grade"] for x in d["designs"]} <= {"10.9"}
    assert {x["method"] for x in d["designs"]} <= {"tension"}


@pytest.mark.parametrize(
    "args,key",
    [
        (["--thread", "M7.5"], "--thread"),
        (["--threads", "M12..M8"], "--threads"),
        (["--threads", "M8"], "--threads"),
        (["--methods", "glue"], "--methods"),
        (["--grades", "99.9"], "--grades"),
    ],
)
def test_bad_size_options(args, key):
    res = CliRunner().invoke(main, ["size", JOINT, *args])
    assert res.exit_code == 2 and f"error: {key}:" in res.stderr
