"""``clampstack report``: content, companions, exit codes and safe writing."""

from __future__ import annotations

import csv
import io
import json
import re
from datetime import UTC, datetime

import pytest
from click.testing import CliRunner

from clampstack import __version__
from clampstack.cli import main
from clampstack.inputs.joint import read_joint_file
from clampstack.joint import analyse
from clampstack.outputs.text import CAUTION, fmt_number
from clampstack.report import render_joint_report, report_file_names
from clampstack.report.joint import report_sweep

NOW = datetime(2025, 3, 4, 5, 6, tzinfo=UTC)


def render(examples_dir, name, **kw):
    doc, spec = read_joint_file(str(examples_dir / f"{name}.toml"))
    r = analyse(spec)
    return doc, r, render_joint_report(doc, r, now=NOW, **kw)


def test_report_sections_numbers_and_traceability(examples_dir):
    doc, r, files = render(examples_dir, "m10-cover-screw-aluminium")
    names = report_file_names("m10-cover-screw-aluminium")
    assert list(files) == [names["json"], names["states"], names["checks"], names["html"]]
    page = files[names["html"]]
    assert page.startswith("<!DOCTYPE html>")
    # self-contained: no URL, no script, nothing to fetch
    assert "http://" not in page and "https://" not in page
    assert "<script" not in page and "<img" not in page and "<link" not in page
    assert "@import" not in page and "url(" not in page.split("<body>")[0]
    # print rules for A4 and Letter
    assert "@page" in page and "break-inside:avoid" in page and "counter(pages)" in page
    for sid in (
        "summary",
        "inputs",
        "model",
        "diagram",
        "states",
        "checks",
        "tightening",
        "assumptions",
        "references",
    ):
        assert f'<section id="{sid}">' in page
    assert 'id="temperature"' not in page  # service at assembly temperature: no sweep
    assert page.count("<svg ") == 4  # first-page diagram, schematic, joint diagram, load curves
    # job summary: verdict, governing check, torque spec
    assert "<b>PASS</b>" in page and "governing check <b>working_stress</b>" in page
    assert f"{fmt_number(r.torque[0])}&nbsp;N&middot;m" in page
    # inputs as entered and the defaults applied
    assert "thread = &quot;M10&quot;" in page and "torque = &quot;48 N*m&quot;" in page
    for key, _ in r.defaults:
        assert f"<code>{key}</code>" in page
    # states and checks with their numbers and sources
    for st in r.states:
        assert f"<td>{fmt_number(st.clamp_min / 1e3)}</td>" in page
    for c in r.checks:
        assert f"<b>{c.name}</b>" in page
        assert c.source.split(" (")[0] in page
    assert "VDI 2230 Part 1:2015" in page and "Wileman" in page and "ISO 16047" in page
    assert "Budynas" in page and "ISO 898-1:2013" in page
    for a in r.assumptions:
        assert a.split(" (")[0][:40] in page.replace("&#x27;", "'")
    assert CAUTION in page
    assert __version__ in page and "2025-03-04 05:06 UTC" in page
    assert doc.sha256 in page and len(doc.sha256) == 64


def test_json_and_csv_beside_the_page(examples_dir):
    doc, r, files = render(examples_dir, "m10-cover-screw-aluminium")
    names = report_file_names("m10-cover-screw-aluminium")
    data = json.loads(files[names["json"]])
    meta = data.pop("report")
    assert data == json.loads(json.dumps(r.to_dict()))
    assert meta["input_sha256"] == doc.sha256 and meta["clampstack_version"] == __version__
    states = list(csv.DictReader(io.StringIO(files[names["states"]])))
    assert [s["name"] for s in states] == [s.key for s in r.states]
    assert float(states[3]["clamp_load_min_N"]) == r.states[3].clamp_min
    checks = list(csv.DictReader(io.StringIO(files[names["checks"]])))
    assert [c["name"] for c in checks] == [c.name for c in r.checks]
    assert all(c["pass"] == "true" for c in checks)
    assert float(checks[0]["value"]) == r.checks[0].value and checks[0]["source"]


def test_hot_joint_gets_the_temperature_section(examples_dir):
    _, r, files = render(examples_dir, "exhaust-flange-hot")
    page = files["exhaust-flange-hot.html"]
    assert '<section id="temperature">' in page and page.count("<svg ") == 5
    assert "<b>FAIL</b>" in page and '<span class="fail">FAIL</span>' in page
    sw, note = report_sweep(r)
    T = sw.temperature - 273.15
    srv = r.spec.service
    assert T[0] == pytest.approx(srv.assembly_temperature - 273.15 - 20)
    assert T[-1] <= srv.temperature - 273.15 + 20 + 1e-9
    assert "swept from" in note
    for lim in sw.limits:
        assert f"<b>{lim.check}</b> fails" in page
    # numbered without gaps
    heads = re.findall(r"<h2>(\d+)\. ", page)
    assert heads == [str(i) for i in range(1, len(heads) + 1)]


def test_sweep_is_narrowed_to_the_materials_data(examples_dir, monkeypatch):
    import clampstack.studies.sweep as sweep_mod
    from clampstack.errors import InputError

    _, spec = read_joint_file(str(examples_dir / "exhaust-flange-hot.toml"))
    r = analyse(spec)
    real = sweep_mod.sweep
    calls = []

    def fake(spec, lo, hi, *a, **k):
        calls.append((lo, hi))
        if hi > spec.service.temperature + 1e-9:
            raise InputError("beyond the data", key="--temperature")
        return real(spec, lo, hi, *a, **k)

    monkeypatch.setattr(sweep_mod, "sweep", fake)
    sw, note = report_sweep(r)
    assert len(calls) == 3 and sw.temperature[-1] == pytest.approx(spec.service.temperature)
    assert "narrowed" in note

    def never(spec, lo, hi, *a, **k):
        raise InputError("no data", key="--temperature")

    monkeypatch.setattr(sweep_mod, "sweep", never)
    sw, note = report_sweep(r)
    assert sw is None and "no data" in note
    page = render_joint_report(read_joint_file(str(examples_dir / "exhaust-flange-hot.toml"))[0], r)
    assert "No temperature sweep: no data" in page["exhaust-flange-hot.html"]


def test_report_command_exit_codes_and_output(examples_dir, tmp_path):
    out = tmp_path / "rep"
    res = CliRunner().invoke(
        main, ["report", str(examples_dir / "m10-cover-screw-aluminium.toml"), "-o", str(out)]
    )
    assert res.exit_code == 0, res.output
    page = out / "m10-cover-screw-aluminium.html"
    assert f"Report: {page}" in res.output and page.is_file()
    assert sorted(p.name for p in out.iterdir()) == sorted(
        report_file_names("m10-cover-screw-aluminium").values()
    )
    res = CliRunner().invoke(
        main, ["report", str(examples_dir / "exhaust-flange-hot.toml"), "-o", str(out), "--json"]
    )
    assert res.exit_code == 1
    data = json.loads(res.stdout)
    assert data["ok"] is False and data["report"].endswith("exhaust-flange-hot.html")
    res = CliRunner().invoke(
        main,
        [
            "report",
            str(examples_dir / "m16-through-bolt-alternating.toml"),
            "-o",
            str(out),
            "--units",
            "us",
        ],
    )
    assert res.exit_code == 0
    assert "lbf" in (out / "m16-through-bolt-alternating.html").read_text()


def test_bad_input_writes_nothing(write_toml, tmp_path, examples_dir):
    bad = write_toml('[bolt]\nthread = "M10"\ngrade = "8.8"\nlength = "5 kN"\n')
    out = tmp_path / "rep"
    res = CliRunner().invoke(main, ["report", str(bad), "-o", str(out)])
    assert res.exit_code == 2
    assert res.output.count("\n") == 1 and "bolt.length" in res.output
    assert not out.exists()
    target = tmp_path / "a-file"
    target.write_text("x")
    good = examples_dir / "m10-cover-screw-aluminium.toml"
    res = CliRunner().invoke(main, ["report", str(good), "-o", str(target)])
    assert res.exit_code == 2 and "not a folder" in res.output


def test_failed_rendering_keeps_the_good_report(examples_dir, tmp_path, monkeypatch):
    src = str(examples_dir / "m10-cover-screw-aluminium.toml")
    out = tmp_path / "rep"
    assert CliRunner().invoke(main, ["report", src, "-o", str(out)]).exit_code == 0
    before = {p.name: p.read_bytes() for p in out.iterdir()}

    import clampstack.plots as plots

    def broken(*a, **k):
        raise RuntimeError("renderer broke")

    monkeypatch.setattr(plots, "bolt_load_plot", broken)  # fails after two figures are drawn
    res = CliRunner().invoke(main, ["report", src, "-o", str(out)])
    assert res.exit_code != 0
    assert {p.name: p.read_bytes() for p in out.iterdir()} == before  # untouched, no temp files
