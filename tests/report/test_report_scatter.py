"""The joint report's statistical scatter section (input with a ``[distributions]`` table)."""

from __future__ import annotations

import json
import re
from datetime import UTC, datetime

import numpy as np
import pytest

from clampstack.inputs.joint import read_joint_file
from clampstack.joint import analyse
from clampstack.outputs.text import fmt_number
from clampstack.plots import binned_histogram
from clampstack.report import render_joint_report
from clampstack.report.joint import SCATTER_SAMPLES, report_scatter
from clampstack.studies.sampling import Convergence
from clampstack.studies.scatter import scatter
from conftest import EXAMPLES

NOW = datetime(2025, 3, 4, 5, 6, tzinfo=UTC)
DISTRIBUTIONS = """
[distributions]
torque = {normal = ["48 N*m", "1.5 N*m"]}
embedding = "2 um..4 um"
"""


@pytest.fixture(scope="module")
def scattered(tmp_path_factory):
    """The cover-screw example with a [distributions] table, reported; histograms kept."""
    import clampstack.plots as plots

    text = (EXAMPLES / "m10-cover-screw-aluminium.toml").read_text(encoding="utf-8")
    path = tmp_path_factory.mktemp("scatter") / "cover-scatter.toml"
    path.write_text(text + DISTRIBUTIONS, encoding="utf-8")
    doc, spec = read_joint_file(str(path))
    r = analyse(spec)
    real = plots.binned_histogram
    drawn = []

    def spy(*a, **k):
        fig = real(*a, **k)
        drawn.append((a, k, fig))
        return fig

    mp = pytest.MonkeyPatch()
    mp.setattr(plots, "binned_histogram", spy)
    try:
        files = render_joint_report(doc, r, now=NOW)
    finally:
        mp.undo()
    # the report's study: adaptive from 100 000 samples, seed 0, the default rule
    sr = scatter(spec, spec.distributions, SCATTER_SAMPLES, seed=0, convergence=Convergence())
    return doc, r, files, drawn, sr


def test_scatter_section_numbers_and_traceability(scattered):
    _, r, files, _, sr = scattered
    page = files["cover-scatter.html"]
    assert '<section id="scatter">' in page and "Statistical scatter" in page
    heads = re.findall(r"<h2>(\d+)\. ([^<]+)</h2>", page)
    assert [int(n) for n, _ in heads] == list(range(1, len(heads) + 1))
    assert dict((t, n) for n, t in heads)["Statistical scatter"] == "8"  # no sweep here
    assert page.count("<svg ") == 6  # the first page's diagram, three figures, two histograms
    count = f"{sr.samples:,}".replace(",", "&nbsp;")
    assert sr.samples >= SCATTER_SAMPLES and sr.convergence["adaptive"]
    assert f"<b>{count} samples, seed 0</b>" in page and "rounds until every probability" in page
    # the sampled inputs in display units, the defaults the study adds too
    assert "normal, mean 48.00&nbsp;N&middot;m, standard deviation 1.500&nbsp;N&middot;m" in page
    assert "uniform 2.000&nbsp;&micro;m .. 4.000&nbsp;&micro;m" in page
    assert "<code>thread_friction</code>" in page
    # percentiles, probabilities with their intervals
    p = sr.percentiles["assembly_preload"]
    for key in ("p01", "p05", "p50", "p95", "p99", "mean"):
        assert f"<td>{_kn(p[key])}</td>" in page
    for name in ("separation", "bolt_yield", "bolt_yield_assembly", "bolt_yield_service", "slip"):
        pr = sr.probability(name)
        assert f"<b>{name}</b>" in page
        assert f"<td>{pr['low']:.3g} .. {pr['high']:.3g}</td>" in page
    assert "Clopper, C. J., Pearson, E. S." in page


def _kn(v: float) -> str:
    return fmt_number(v / 1e3).replace(" ", "&nbsp;")


def test_scatter_json_beside_the_page(scattered):
    _, r, files, _, sr = scattered
    data = json.loads(files["cover-scatter.json"])
    data.pop("report")
    assert data.pop("scatter") == json.loads(json.dumps(sr.to_dict()))
    assert data == json.loads(json.dumps(r.to_dict()))


def test_histograms_hold_every_sample(scattered):
    _, r, _, drawn, sr = scattered
    assert [k["quantity"] for _, k, _ in drawn] == ["assembly preload", "residual clamp load"]
    for (edges, counts), kw, fig in drawn:
        q = kw["quantity"].replace(" ", "_")
        np.testing.assert_array_equal(edges, sr.histogram[q][0])
        np.testing.assert_array_equal(counts, sr.histogram[q][1])
        bars = fig.findobj(lambda a: a.get_gid() == "bar")
        assert len(bars) == len(counts)
        assert sum(b.get_height() for b in bars) == sr.samples
        np.testing.assert_allclose([b.get_x() for b in bars], np.asarray(edges[:-1]) / 1e3)
        for pct, key in ((1, "p01"), (50, "p50"), (99, "p99")):
            (line,) = fig.findobj(lambda a, pct=pct: a.get_gid() == f"p{pct}")
            assert line.get_xdata()[0] == pytest.approx(sr.percentiles[q][key] / 1e3)
    # the limits: permissible preload, required clamp load
    assert drawn[0][1]["limit"] == r.permissible_preload
    assert drawn[1][1]["limit"] == r.spec.requirements.residual_clamp_load


def test_binned_histogram_checks_and_far_limits():
    edges = np.linspace(10e3, 20e3, 11)
    counts = np.arange(10)
    fig = binned_histogram(edges, counts, limit=100e3, limit_label="permissible")
    (limit,) = fig.findobj(lambda a: a.get_gid() == "limit")
    assert "off the scale, above" in limit.get_label()
    assert fig.axes[0].get_xlim()[1] < 30  # not stretched to a far limit
    with pytest.raises(ValueError, match="10 counts need 11 edges"):
        binned_histogram(edges[:-1], counts)
    with pytest.raises(ValueError):
        binned_histogram(edges, np.zeros(10))


def test_no_distributions_no_scatter(examples_dir):
    doc, spec = read_joint_file(str(examples_dir / "m10-cover-screw-aluminium.toml"))
    r = analyse(spec)
    sr, note = report_scatter(r)
    assert sr is None and "no [distributions] table" in note
