"""``clampstack report`` of a flange file: sections, companions, figure data, exit codes."""

from __future__ import annotations

import csv
import html
import io
import json
import re
from datetime import UTC, datetime

import numpy as np
import pytest
from click.testing import CliRunner

from clampstack import __version__
from clampstack.cli import main
from clampstack.flange import analyse_flange
from clampstack.inputs.flange import read_flange_file
from clampstack.outputs.flange import FLANGE_CAUTION
from clampstack.outputs.text import SI, fmt_number
from clampstack.report import flange_report_file_names, render_flange_report
from conftest import EXAMPLES

NOW = datetime(2025, 3, 4, 5, 6, tzinfo=UTC)
PUMP = EXAMPLES / "pump-outlet-flange-8-bolts.toml"


@pytest.fixture(scope="module")
def pump():
    """The pump flange analysed and its report rendered, with the passes figure kept."""
    import clampstack.plots as plots

    doc, spec = read_flange_file(str(PUMP))
    r = analyse_flange(spec)
    real = plots.passes_plot
    drawn = []

    def spy(*a, **k):
        fig = real(*a, **k)
        drawn.append(fig)
        return fig

    mp = pytest.MonkeyPatch()
    mp.setattr(plots, "passes_plot", spy)
    try:
        files = render_flange_report(doc, r, now=NOW)
    finally:
        mp.undo()
    return doc, r, files, drawn


def cell(x: float) -> str:
    return fmt_number(x).replace(" ", "&nbsp;")


def test_flange_report_has_every_section(pump):
    doc, r, files, _ = pump
    names = flange_report_file_names("pump-outlet-flange-8-bolts")
    assert list(files) == [names["json"], names["bolts"], names["checks"], names["html"]]
    page = files[names["html"]]
    assert page.startswith("<!DOCTYPE html>")
    # self-contained: no URL, nothing to fetch or run
    assert re.search(r"https?://", page) is None
    assert "<script" not in page and "<img" not in page and "<link" not in page
    assert "@page" in page and "counter(pages)" in page
    for sid in (
        "summary",
        "inputs",
        "app2",
        "window",
        "passes",
        "bolts",
        "service",
        "checks",
        "notes",
        "references",
    ):
        assert f'<section id="{sid}">' in page
    heads = re.findall(r"<h2>(\d+)\. ", page)
    assert heads == [str(i) for i in range(1, 11)]
    assert page.count("<svg ") == 2  # the passes figure and the heat cycle's
    # summary: verdict, torque per bolt, target preload and window
    assert "<b>PASS</b>" in page and "governing check <b>bolt_area</b>" in page
    assert f'Torque per bolt</span><span class="big">{cell(r.torque[0])}&nbsp;N&middot;m' in page
    assert f"<b>{cell(r.target / 1e3)}&nbsp;kN</b>" in page
    assert f"{cell(r.window[0] / 1e3)}&nbsp;kN .. {cell(r.window[1] / 1e3)}&nbsp;kN" in page
    # inputs as entered and the defaults applied
    assert "bolt_count = 8" in page and "pattern = [&quot;cross&quot;" in page
    for key, _ in r.defaults:
        assert f"<code>{key}</code>" in page
    # App. 2: every quantity with its value
    a = r.app2
    for v, kind, unit in (
        (a.b0, "length", "mm"),
        (a.b, "length", "mm"),
        (a.G, "length", "mm"),
        (a.H, "force", "kN"),
        (a.Hp, "force", "kN"),
        (a.Wm1, "force", "kN"),
        (a.Wm2, "force", "kN"),
        (a.Am, "area", "mm&sup2;"),
        (a.Ab, "area", "mm&sup2;"),
    ):
        assert f"<td>{SI.fmt(kind, v).replace(' ', '&nbsp;')}&nbsp;{unit}</td>" in page or (
            f"<td><b>{SI.fmt(kind, v)}&nbsp;{unit}</b></td>" in page
        )
    for sym in (
        "b<sub>0</sub>",
        "W<sub>m1</sub>",
        "W<sub>m2</sub>",
        "A<sub>m</sub>",
        "H<sub>p</sub>",
    ):
        assert sym in page
    # the window table names its bounds and their reasons
    assert html.escape(r.window_reasons[0]) in page and html.escape(r.window_reasons[1]) in page
    # checks with margins and sources, notes, references, caution, traceability
    for c in r.checks:
        assert f"<b>{c.name}</b>" in page
        assert html.escape(c.source.split(" (")[0]) in page
        assert f"<td>{c.margin * 100:+.1f}&nbsp;%</td>" in page
    area = next(c for c in r.checks if c.unit == "mm2")
    assert f"<td>{cell(area.value)}&nbsp;mm²</td>" in page  # areas with their unit
    for note in r.notes:
        assert html.escape(note) in page
    for ref in (
        "ASME Boiler and Pressure Vessel Code, Section VIII",
        "ASME PCC-1",
        "VDI 2230 Part 1",
    ):
        assert ref in page
    assert "Roark's Formulas for Stress and Strain" in page
    assert html.escape(FLANGE_CAUTION) in page
    assert __version__ in page and "2025-03-04 05:06 UTC" in page
    assert doc.sha256 in page


def test_per_bolt_table_rows(pump):
    _, r, files, _ = pump
    page = files["pump-outlet-flange-8-bolts.html"]
    body = page.split('<section id="bolts">')[1].split("</section>")[0]
    rows = re.findall(r"<tr>(.*?)</tr>", body.split("<tbody>")[1])
    assert len(rows) == r.spec.bolt_count
    for i, row in enumerate(rows):
        cells = re.findall(r"<td[^>]*>(.*?)</td>", row)
        want = [str(i + 1), f"{360 * i / r.spec.bolt_count:.1f}"]
        want += [cell(float(p[i]) / 1e3) for p in r.passes]
        want += [
            cell(float(x[i]) / 1e3)
            for x in (r.compensated_targets, r.working_loads, r.service_bolt, r.service_gasket)
        ]
        assert cells == want


def test_json_and_csv_beside_the_page(pump):
    doc, r, files, _ = pump
    names = flange_report_file_names("pump-outlet-flange-8-bolts")
    data = json.loads(files[names["json"]])
    meta = data.pop("report")
    assert data == json.loads(json.dumps(r.to_dict()))
    assert meta["input_sha256"] == doc.sha256 and meta["clampstack_version"] == __version__
    bolts = list(csv.DictReader(io.StringIO(files[names["bolts"]])))
    assert [int(b["bolt"]) for b in bolts] == list(range(1, r.spec.bolt_count + 1))
    for i, b in enumerate(bolts):
        for k, p in enumerate(r.passes):
            assert float(b[f"pass_{k + 1}_N"]) == float(p[i])
        assert float(b["compensated_target_N"]) == float(r.compensated_targets[i])
        assert float(b["working_load_N"]) == float(r.working_loads[i])
        assert float(b["service_load_N"]) == float(r.service_bolt[i])
        assert float(b["gasket_force_service_N"]) == float(r.service_gasket[i])
        assert float(b["gasket_force_assembly_N"]) == float(r.assembly_gasket[i])
        assert float(b["angle_deg"]) == pytest.approx(360 * i / r.spec.bolt_count)
    checks = list(csv.DictReader(io.StringIO(files[names["checks"]])))
    assert [c["name"] for c in checks] == [c.name for c in r.checks]
    assert [c["pass"] for c in checks] == ["true" if c.passed else "false" for c in r.checks]
    assert float(checks[0]["value"]) == r.checks[0].value and checks[0]["source"]


def test_passes_figure_plots_the_passes(pump):
    _, r, _, drawn = pump
    (fig,) = drawn
    n = r.spec.bolt_count
    for k, p in enumerate(r.passes, start=1):
        (line,) = fig.findobj(lambda a, k=k: a.get_gid() == f"pass-{k}")
        np.testing.assert_array_equal(line.get_xdata(), np.arange(1, n + 1))
        np.testing.assert_allclose(line.get_ydata(), np.asarray(p) / 1e3, rtol=1e-12)
    (target,) = fig.findobj(lambda a: a.get_gid() == "target")
    assert target.get_ydata()[0] == pytest.approx(r.target / 1e3)
    assert not fig.findobj(lambda a: a.get_gid() == f"pass-{len(r.passes) + 1}")


def test_report_command_on_flange_files(tmp_path, write_toml):
    out = tmp_path / "rep"
    res = CliRunner().invoke(main, ["report", str(PUMP), "-o", str(out)])
    assert res.exit_code == 0, res.output
    names = flange_report_file_names("pump-outlet-flange-8-bolts")
    assert sorted(p.name for p in out.iterdir()) == sorted(names.values())
    assert (
        res.output.startswith("PASS: Pump outlet")
        and f"Report: {out / names['html']}" in res.output
    )
    # a design check fails: exit 1, the report is written and says so
    text = PUMP.read_text(encoding="utf-8").replace('"40 bar"', '"250 bar"')
    failing = write_toml(text, "hot-pump.toml")
    res = CliRunner().invoke(main, ["report", str(failing), "-o", str(out), "--json"])
    assert res.exit_code == 1, res.output
    data = json.loads(res.stdout)
    assert data["ok"] is False and data["report"].endswith("hot-pump.html")
    page = (out / "hot-pump.html").read_text(encoding="utf-8")
    assert "<b>FAIL</b>" in page and '<span class="fail">FAIL</span>' in page
    # bad input: exit 2, one line naming the file and key, nothing written
    bad = write_toml(text.replace('thickness = "36 mm"', 'thickness = "36 kN"'), "bad.toml")
    fresh = tmp_path / "nothing"
    res = CliRunner().invoke(main, ["report", str(bad), "-o", str(fresh)])
    assert res.exit_code == 2
    assert res.output.count("\n") == 1 and "bad.toml" in res.output
    assert "flange.thickness" in res.output
    assert not fresh.exists()


def test_failed_rendering_keeps_the_good_flange_report(tmp_path, monkeypatch):
    out = tmp_path / "rep"
    assert CliRunner().invoke(main, ["report", str(PUMP), "-o", str(out)]).exit_code == 0
    before = {p.name: p.read_bytes() for p in out.iterdir()}

    import clampstack.plots as plots

    def broken(*a, **k):
        raise RuntimeError("renderer broke")

    monkeypatch.setattr(plots, "passes_plot", broken)
    res = CliRunner().invoke(main, ["report", str(PUMP), "-o", str(out)])
    assert res.exit_code != 0
    assert {p.name: p.read_bytes() for p in out.iterdir()} == before  # untouched, no temp files


def test_flange_report_in_us_units(pump):
    doc, r, _, _ = pump
    page = render_flange_report(doc, r, units="us", now=NOW)["pump-outlet-flange-8-bolts.html"]
    assert "ft&middot;lbf" in page and "lbf" in page and "psi" in page
    assert "&nbsp;kN" not in page


def test_flange_report_shows_the_heat_cycle_per_bolt(examples_dir):
    # the heat cycle section: per-bolt gasket stress and bolt load at each state, and the
    # figure of gasket stress per bolt against the seating, operating-minimum and crush lines
    import re

    from clampstack.flange import analyse_flange
    from clampstack.inputs.flange import read_flange_file
    from clampstack.report import render_flange_report

    doc, spec = read_flange_file(str(examples_dir / "hot-oil-flange-spiral-wound.toml"))
    r = analyse_flange(spec)
    files = render_flange_report(doc, r)
    html = files["hot-oil-flange-spiral-wound.html"]
    assert '<section id="service">' in html and "Figure 2." in html
    for gid in ("state-hot", "state-cooled", "seating", "operating-minimum", "crush"):
        assert f'id="f2-{gid}"' in html
    # the table lists every bolt's cooled gasket stress as the result holds it
    A = r.sector_area
    sec = html[html.index('<section id="service">') :]
    sec = sec[: sec.index("</section>")]
    cells = re.findall(r"<td[^>]*>([^<]*)</td>", sec)
    for i in range(spec.bolt_count):
        assert f"{r.cycle['cooled'].gasket[i] / A / 1e6:.4g}" in cells
    csv_text = files["hot-oil-flange-spiral-wound-bolts.csv"]
    assert "gasket_force_cooled_N" in csv_text.splitlines()[0]
