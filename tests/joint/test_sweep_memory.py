"""Bounded memory of a long sweep: the points are capped, and ``--json``/``--csv`` stream.

No timing and no memory figure is asserted here (DEVELOPERS.md: speed lives in
``bench/``); the tests check that the long-sweep paths are the ones taken and that
they give the same bytes as the whole-text renderers.
"""

from __future__ import annotations

import dataclasses
import json
import re
from pathlib import Path

import numpy as np
import pytest
from click.testing import CliRunner

from clampstack.cli import main
from clampstack.errors import InputError
from clampstack.inputs.joint import read_joint_file
from clampstack.joint.prepare import prepare
from clampstack.outputs.sweep import sweep_csv, sweep_csv_chunks, sweep_json_chunks
from clampstack.studies import sweep as sweep_module
from clampstack.studies.sweep import (
    CHUNK,
    MAX_POINTS,
    SweepResult,
    _evaluate,
    sweep,
    temperature_points,
)

ROOT = Path(__file__).resolve().parents[2]
GEARBOX = ROOT / "examples" / "gearbox-cover-cold-to-hot.toml"
JOINTS = [
    "bolt-in-aluminium-sleeve-hot.toml",
    "exhaust-flange-hot.toml",
    "gearbox-cover-cold-to-hot.toml",
    "m10-cover-screw-aluminium.toml",
    "m16-through-bolt-alternating.toml",
]
C0 = 273.15


def whole_json(r: SweepResult) -> str:
    """What ``sweep --json`` printed before it streamed."""
    return json.dumps(r.to_dict(), indent=2, allow_nan=False)


@pytest.mark.parametrize("name", JOINTS)
@pytest.mark.parametrize("cycle", [False, True])
def test_streamed_json_is_byte_identical(name, cycle):
    _, spec = read_joint_file(str(ROOT / "examples" / name))
    r = sweep(spec, C0 - 20, C0 + 140, cycle=cycle)
    assert "".join(sweep_json_chunks(r)) == whole_json(r)
    assert "".join(sweep_json_chunks(r, block=7)) == whole_json(r)  # pieces end mid-way


def test_streamed_json_with_margins_that_are_not_finite_or_none():
    _, spec = read_joint_file(str(GEARBOX))
    r = sweep(spec, C0 - 40, C0 + 150, step=10.0)
    names = list(r.margins)
    m = dict(r.margins)
    m[names[0]] = np.where(np.arange(r.temperature.size) % 3 == 0, np.inf, m[names[0]])
    m[names[1]] = np.full(r.temperature.size, np.nan)
    odd = dataclasses.replace(r, margins=m)
    assert "".join(sweep_json_chunks(odd, block=4)) == whole_json(odd)
    assert json.loads("".join(sweep_json_chunks(odd)))["points"][0]["margins"][names[0]] is None
    none = dataclasses.replace(r, margins={})
    assert "".join(sweep_json_chunks(none, block=4)) == whole_json(none)
    title = dataclasses.replace(r, spec=dataclasses.replace(r.spec, title='a "points": % \x00 x'))
    assert "".join(sweep_json_chunks(title, block=3)) == whole_json(title)


def test_a_value_json_cannot_encode_is_refused_before_the_first_piece():
    _, spec = read_joint_file(str(GEARBOX))
    r = sweep(spec, C0 - 40, C0 + 150, step=10.0)
    bad = dataclasses.replace(r, preload_min=np.full(r.temperature.size, np.nan))
    with pytest.raises(ValueError):
        whole_json(bad)
    pieces = sweep_json_chunks(bad)
    with pytest.raises(ValueError):
        next(pieces)


def test_streamed_csv_is_the_whole_text():
    _, spec = read_joint_file(str(GEARBOX))
    r = sweep(spec, C0 - 40, C0 + 150, step=1.0)
    pieces = list(sweep_csv_chunks(r, block=50))
    assert len(pieces) == 1 + -(-r.temperature.size // 50)
    assert "".join(pieces) == sweep_csv(r)
    lines = sweep_csv(r).splitlines()
    assert len(lines) == r.temperature.size + 1 and lines[1].split(",")[0] == "-40"


def test_a_long_sweep_streams_and_never_builds_the_list_of_points(monkeypatch):
    """``sweep --json`` and ``--csv`` on more points than a piece: the streaming path."""
    to_dict = SweepResult.to_dict

    def frame_only(self, points=True):
        assert not points, "sweep --json built the list of a dict per point"
        return to_dict(self, points)

    monkeypatch.setattr(SweepResult, "to_dict", frame_only)
    monkeypatch.setattr("clampstack.outputs.sweep.sweep_csv", None)  # not the whole text
    step = 190 / (CHUNK + 1234)  # more points than a piece of the evaluation and the output
    args = ["sweep", str(GEARBOX), "--temperature", "-40..150", "--step", repr(step)]
    res = CliRunner().invoke(main, [*args, "--json"])
    assert res.exit_code in (0, 1), res.output
    data = json.loads(res.stdout)
    n = len(data["points"])
    assert n == CHUNK + 1235
    assert data["points"][-1]["temperature_degC"] == pytest.approx(150)
    assert res.stdout.endswith("}\n")
    res = CliRunner().invoke(main, [*args, "--csv"])
    assert res.exit_code in (0, 1), res.output
    assert len(res.stdout.splitlines()) == n + 1


def test_the_evaluation_in_pieces_is_the_evaluation_at_once():
    _, spec = read_joint_file(str(GEARBOX))
    T = temperature_points(C0 - 40, C0 + 150, 190 / (2 * CHUNK + 17))
    assert T.size > 2 * CHUNK
    r = sweep(spec, T[0], T[-1], 190 / (2 * CHUNK + 17))
    at_once = _evaluate(prepare(spec), T)
    np.testing.assert_allclose(r.preload_min, at_once["pre_min"], rtol=1e-13)
    np.testing.assert_allclose(r.bolt_load_max, at_once["bolt_max"], rtol=1e-13)
    for name, v in at_once["margins"].items():
        np.testing.assert_allclose(r.margins[name], v, rtol=1e-13, atol=1e-15)


@pytest.mark.parametrize("step", ["0.0001", "1e-12", "1e-320"])
def test_too_many_points_is_one_line_naming_the_step(step, monkeypatch):
    monkeypatch.setattr(sweep_module, "prepare", None)  # refused before any work
    res = CliRunner().invoke(
        main, ["sweep", str(GEARBOX), "--temperature", "-40..150", "--step", step, "--json"]
    )
    assert res.exit_code == 2 and res.stdout == ""
    lines = res.stderr.strip().splitlines()
    assert len(lines) == 1 and "Traceback" not in res.stderr
    assert "--step" in lines[0] and "at most 1 000 001" in lines[0]
    smallest = float(re.search(r"a step of at least ([0-9.e+-]+) K", lines[0]).group(1))
    assert temperature_points(C0 - 40, C0 + 150, smallest).size <= MAX_POINTS + 1
    with pytest.raises(InputError, match="too many"):
        temperature_points(C0 - 40, C0 + 150, smallest / 1.01)


def test_the_largest_accepted_sweep_has_a_million_points():
    T = temperature_points(C0 - 40, C0 + 150, 0.00019)
    assert T.size == MAX_POINTS
    assert T[-1] == pytest.approx(C0 + 150)
