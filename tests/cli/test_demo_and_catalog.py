"""``clampstack demo`` and ``clampstack catalog``."""

from __future__ import annotations

import json

from click.testing import CliRunner

from clampstack.cli import main


def test_demo_writes_the_report_and_the_results(tmp_path):
    out = tmp_path / "demo"
    res = CliRunner().invoke(main, ["demo", "-o", str(out)])
    assert res.exit_code == 0, res.output
    report = out / "m10-cover-screw-aluminium.html"
    assert f"Report: {report}" in res.output  # the demo prints where its report is
    joint = json.loads((out / "m10-cover-screw-aluminium.json").read_text())
    assert joint["ok"] is True
    jpage = report.read_text()
    assert jpage.startswith("<!DOCTYPE html>")
    assert "qualified engineer" in jpage and "<b>PASS</b>" in jpage
    assert "http://" not in jpage and "https://" not in jpage  # self-contained
    assert jpage.count("<svg ") == 4  # first-page diagram, spring model, joint diagram, load curves
    assert (out / "m10-cover-screw-aluminium-states.csv").is_file()
    assert (out / "m10-cover-screw-aluminium-checks.csv").is_file()
    assert (out / "m10-cover-screw-aluminium.toml").is_file()
    assert "RESULT: PASS" in res.output
    assert "RESULT: PASS" in (out / "check.txt").read_text()
    data = json.loads((out / "solve.json").read_text())
    assert data["cases"][0]["name"] == "assembly"
    page = (out / "solve.html").read_text()
    assert page.startswith("<!DOCTYPE html>")
    assert "qualified engineer" in page
    assert "http://" not in page and "https://" not in page  # self-contained
    # the numbers of the JSON appear on the page (force in kN, 4 significant digits)
    rod = data["cases"][0]["parts"]["tie-rod"]["force_N"] / 1e3
    assert f"{rod:.3f}" in page
    assert str(out / "solve.json") in res.output


def test_catalog_listings():
    for what, needle in [
        ("threads", "M10"),
        ("grades", "10.9"),
        ("materials", "aluminium-6082-T6"),
    ]:
        res = CliRunner().invoke(main, ["catalog", what])
        assert res.exit_code == 0
        assert needle in res.output and "source" in res.output
    res = CliRunner().invoke(main, ["catalog", "grades", "--json"])
    doc = json.loads(res.stdout)
    assert doc["schema"] == "clampstack.catalog" and doc["listing"] == "grades"
    (g88,) = [r for r in doc["records"] if r["grade"] == "8.8" and r["d_max_mm"] <= 16]
    # ISO 898-1: class 8.8 up to M16, R_m 800 MPa, R_p0.2 640 MPa (numbers, not text)
    assert g88["tensile_strength_MPa"] == 800 and g88["yield_strength_MPa"] == 640


def test_catalog_json_is_snake_case_numbers():
    import re

    for what in ("threads", "grades", "materials", "gaskets", "friction", "tools"):
        doc = json.loads(CliRunner().invoke(main, ["catalog", what, "--json"]).stdout)
        assert doc["records"], what
        for r in doc["records"]:
            for k, v in r.items():
                assert re.fullmatch(r"[a-z][a-z0-9_]*(_[A-Za-z0-9]+)?", k), (what, k)
                if k.endswith(("_mm", "_MPa", "_GPa", "_mm2", "_per_K", "_psi")):
                    assert v is None or isinstance(v, float | int), (what, k, v)
            assert r["source"]


def test_help_lists_commands():
    res = CliRunner().invoke(main, ["--help"])
    assert res.exit_code == 0
    for cmd in ("solve", "catalog", "demo", "report"):
        assert cmd in res.output
