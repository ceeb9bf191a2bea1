"""Physical bounds: no temperature below absolute zero, no sampled value outside what the
quantity can be, and the file's probability limit in the exit code of `scatter`."""

from __future__ import annotations

import json
from pathlib import Path

import pytest
from click.testing import CliRunner

from clampstack.cli import main

EXAMPLES = Path(__file__).parent.parent.parent / "examples"
BASE = (EXAMPLES / "m16-through-bolt-alternating.toml").read_text(encoding="utf-8")


def _write(tmp_path: Path, text: str) -> str:
    p = tmp_path / "j.toml"
    p.write_text(text, encoding="utf-8")
    return str(p)


def _with_distributions(extra: str) -> str:
    head, _, _ = BASE.partition("[distributions]")
    return head + "[distributions]\n" + extra + "\n"


def test_below_absolute_zero_is_refused(tmp_path):
    text = BASE.replace("[service]", '[service]\ntemperature = "-1000 degC"', 1)
    res = CliRunner().invoke(main, ["check", _write(tmp_path, text)])
    assert res.exit_code == 2 and "absolute zero" in res.stderr
    assert "service.temperature" in res.stderr and res.stdout == ""


@pytest.mark.parametrize(
    ("line", "words"),
    [
        ('thread_friction = "-0.05..0.15"', "below 0"),
        ("thread_friction = {normal = [0.12, 0.05]}", "of the samples would fall below 0"),
        ('embedding = {normal = ["3 um", "2 um"]}', "of the samples would fall below 0"),
        ("slip_friction = {uniform = [-0.1, 0.2]}", "below 0"),
    ],
)
def test_unphysical_distributions_are_refused(tmp_path, line, words):
    res = CliRunner().invoke(main, ["scatter", _write(tmp_path, _with_distributions(line))])
    assert res.exit_code == 2, res.output
    assert words in res.stderr and "distributions." in res.stderr


def test_a_thin_tail_below_zero_is_truncated_with_a_note(tmp_path):
    # normal(0.14, 0.03): Phi(-4.67) = 1.5e-6 of the samples below zero (truncated to 0)
    f = _write(tmp_path, _with_distributions("thread_friction = {normal = [0.14, 0.03]}"))
    res = CliRunner().invoke(main, ["scatter", f, "--samples", "2000", "--json"])
    notes = json.loads(res.stdout)["notes"]
    assert any("thread_friction: about 1.5e-06 of the samples" in n for n in notes), notes


def test_the_probability_limit_sets_the_exit_code(tmp_path):
    # the example's deterministic checks pass; its bolt yield is about 1e-6 (adaptive run)
    strict = BASE.replace("[requirements]", "[requirements]\nmax_failure_probability = 1e-9", 1)
    loose = BASE.replace("[requirements]", "[requirements]\nmax_failure_probability = 0.01", 1)
    assert "max_failure_probability" in strict
    r1 = CliRunner().invoke(main, ["scatter", _write(tmp_path, strict), "--samples", "5000"])
    assert r1.exit_code == 1 and "EXCEEDED" in r1.stdout
    r2 = CliRunner().invoke(main, ["scatter", _write(tmp_path, loose), "--samples", "5000"])
    assert r2.exit_code == 0 and "met" in r2.stdout
