"""The bundled verification cases (``clampstack verify``), one test per case, the CLI and
the generated validation page."""

from __future__ import annotations

import json

import pytest
from click.testing import CliRunner

from clampstack.cli import main
from clampstack.verify import cases, get, run_case
from clampstack.verify import registry as reg
from clampstack.verify.docgen import validation_markdown
from conftest import ROOT

NAMES = [c.name for c in cases()]


@pytest.mark.parametrize("name", NAMES)
def test_case(name):
    r = run_case(get(name))
    assert r.error is None, r.error
    assert r.source.strip()
    assert r.passed, (r.computed, r.expected, r.deviation, r.tolerance, r.source)


def test_enough_cases_in_every_group():
    groups: dict[str, int] = {}
    for c in cases():
        groups[c.group] = groups.get(c.group, 0) + 1
    assert len(NAMES) >= 40
    for group in (
        "thread geometry",
        "grades",
        "stiffness",
        "tightening",
        "joint diagram",
        "thermal",
        "flange",
        "network",
    ):
        assert groups.get(group, 0) >= 3, group


def test_recalled_values_say_so():
    # rows whose source lists a value recalled without the document say "from memory"
    for name in ("F_M,Tab M10 8.8", "M_A,Tab M12 10.9", "R_p0.2 of class 8.8 at 200 degC"):
        assert "from memory" in run_case(get(name)).source


def test_cli_json_document():
    res = CliRunner().invoke(main, ["verify", "--json"])
    assert res.exit_code == 0, res.output
    doc = json.loads(res.stdout)
    assert set(doc) >= {"cases", "passed", "failed", "ok"}
    assert doc["ok"] is True and doc["failed"] == 0 and doc["passed"] == len(NAMES)
    for c in doc["cases"]:
        assert {"name", "source", "expected", "computed", "deviation", "tolerance", "pass"} <= set(
            c
        )


def test_cli_table_and_exit_code_on_a_failing_case(monkeypatch):
    res = CliRunner().invoke(main, ["verify"])
    assert res.exit_code == 0
    header = res.stdout.splitlines()[0].split()
    assert header[:2] == ["case", "source"] and "deviation" in header and "pass" in header
    assert f"{len(NAMES)} of {len(NAMES)} cases pass" in res.stdout

    def wrong():
        return reg.Outcome(1.0, 2.0, 0.01, "a deliberately wrong case")

    def broken():
        raise ZeroDivisionError("boom")

    monkeypatch.setitem(reg._REGISTRY, "zz wrong", reg.Case("zz wrong", "test", wrong))
    monkeypatch.setitem(reg._REGISTRY, "zz broken", reg.Case("zz broken", "test", broken))
    res = CliRunner().invoke(main, ["verify"])
    assert res.exit_code == 1
    assert "FAIL" in res.stdout and "2 FAIL" in res.stdout and "ZeroDivisionError" in res.stdout
    res = CliRunner().invoke(main, ["verify", "--json"])
    assert res.exit_code == 1
    doc = json.loads(res.stdout)
    assert doc["ok"] is False and doc["failed"] == 2


def test_validation_page_is_generated_from_the_registry():
    on_disk = (ROOT / "docs" / "validation.md").read_text(encoding="utf-8")
    assert on_disk == validation_markdown(), "run: .venv/bin/python -m clampstack.verify.docgen"
