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
        "worked examples: Shigley",
        "check chain",
        "sweep",
    ):
        assert groups.get(group, 0) >= 3, group


def test_every_case_has_a_kind():
    kinds: dict[str, int] = {}
    for c in cases():
        assert c.kind in reg.KINDS, c.name
        kinds[c.kind] = kinds.get(c.kind, 0) + 1
    assert set(kinds) == set(reg.KINDS)
    # the spring network against the tool's own closed forms is never an external comparison
    for c in cases():
        if c.group == "joint diagram":
            assert c.kind == "consistency", c.name


def test_at_least_fifteen_published_worked_examples():
    # worked examples with their printed answers: the source names the book, the edition,
    # the example and the page (or says it is not recalled), and "from memory"
    published = [run_case(c) for c in cases() if c.kind == "published"]
    worked = [r for r in published if "Example" in r.source]
    assert len(worked) >= 15
    for r in worked:
        assert "ed." in r.source and "page" in r.source and "from memory" in r.source, r.name
    # a hand calculation from a book's example says it is not a printed answer
    r = run_case(get("Shigley Ex. 8-3 data: tightening torque by eq. (8-26)"))
    assert r.kind == "hand" and "not a printed answer" in r.source


def test_the_verify_areas_of_issue_12_are_covered():
    names = " | ".join(NAMES)
    for needle in (
        "tapped joint: bolt resilience",
        "working stress R8",
        "surface pressure R10",
        "slip R12",
        "rolled after heat treatment",
        "tension tightening",
        "yield-controlled tightening",
        "App. 2 required bolt area A_m",
        "App. 2 flange design bolt load W",
        "sweep: residual clamp load fails below",
        "sweep: surface pressure fails above",
    ):
        assert needle in names, needle


def test_kind_is_required_and_checked():
    with pytest.raises(TypeError):
        reg.register("zz no kind", "test")  # type: ignore[call-arg]
    with pytest.raises(ValueError, match="kind"):
        reg.add("zz bad kind", "test", lambda: reg.Outcome(1.0, 1.0, 0.0, "x"), kind="guess")
    assert "zz bad kind" not in reg._REGISTRY


def test_recalled_values_say_so():
    # rows whose source lists a value recalled without the document say "from memory"
    for name in (
        "F_M,Tab M10 8.8",
        "M_A,Tab M12 10.9",
        "R_p0.2 of class 8.8 at 200 degC",
        "Shigley Ex. 8-2: member stiffness k_m by frusta",
        "Shigley Ex. 8-4: load factor against separation n_0",
    ):
        assert "from memory" in run_case(get(name)).source


def test_cli_json_document():
    res = CliRunner().invoke(main, ["verify", "--json"])
    assert res.exit_code == 0, res.output
    doc = json.loads(res.stdout)
    assert set(doc) >= {"cases", "passed", "failed", "ok", "kinds"}
    assert doc["ok"] is True and doc["failed"] == 0 and doc["passed"] == len(NAMES)
    assert sum(doc["kinds"].values()) == len(NAMES) and set(doc["kinds"]) == set(reg.KINDS)
    for c in doc["cases"]:
        keys = {"name", "group", "kind", "source", "expected", "computed", "unit", "deviation"}
        assert keys | {"tolerance", "pass"} <= set(c)
        assert c["kind"] in reg.KINDS


def test_cli_table_and_exit_code_on_a_failing_case(monkeypatch):
    res = CliRunner().invoke(main, ["verify"])
    assert res.exit_code == 0
    header = res.stdout.splitlines()[0].split()
    assert header[:3] == ["case", "kind", "source"] and "deviation" in header and "pass" in header
    assert " consistency " in res.stdout and " published " in res.stdout
    assert f"{len(NAMES)} of {len(NAMES)} cases pass" in res.stdout

    def wrong():
        return reg.Outcome(1.0, 2.0, 0.01, "a deliberately wrong case")

    def broken():
        raise ZeroDivisionError("boom")

    monkeypatch.setitem(reg._REGISTRY, "zz wrong", reg.Case("zz wrong", "test", wrong, "hand"))
    monkeypatch.setitem(reg._REGISTRY, "zz broken", reg.Case("zz broken", "test", broken, "hand"))
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
