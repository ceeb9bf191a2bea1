"""Figures: the plotted data are the results' numbers (read back from the artists), not pixels."""

from __future__ import annotations

import re
import subprocess
import sys

import numpy as np
import pytest

from clampstack.inputs.joint import read_joint_file
from clampstack.joint import analyse
from clampstack.joint.curves import load_curve
from clampstack.outputs.text import fmt_number
from clampstack.plots import (
    bolt_load_plot,
    figure_png,
    figure_svg,
    histogram,
    inline_svg,
    joint_diagram,
    passes_plot,
    spring_schematic,
    sweep_plot,
)
from clampstack.studies.sweep import sweep

C0 = 273.15


def by_gid(fig, gid):
    found = fig.findobj(lambda a: a.get_gid() == gid)
    assert found, f"no artist with gid {gid!r}"
    return found[0]


def has_gid(fig, gid):
    return bool(fig.findobj(lambda a: a.get_gid() == gid))


def xy(line):
    return np.asarray(line.get_xdata(), dtype=float), np.asarray(line.get_ydata(), dtype=float)


@pytest.fixture(scope="module")
def results():
    from conftest import EXAMPLES

    out = {}
    for name in (
        "m10-cover-screw-aluminium",
        "bolt-in-aluminium-sleeve-hot",
        "m16-through-bolt-alternating",
    ):
        _, spec = read_joint_file(str(EXAMPLES / f"{name}.toml"))
        out[name] = analyse(spec)
    return out


@pytest.mark.parametrize(
    "name",
    ["m10-cover-screw-aluminium", "bolt-in-aluminium-sleeve-hot", "m16-through-bolt-alternating"],
)
def test_joint_diagram_lines_are_the_results(results, name):
    r = results[name]
    st = {s.key: s for s in r.states}
    dS, dP = r.springs.delta_S, r.springs.delta_P
    fig = joint_diagram(r)
    um, kN = 1e-6, 1e3  # axis units

    x, y = xy(by_gid(fig, "bolt"))
    assert x[0] == 0 and y[0] == 0
    assert (y[1] * kN) / (x[1] * um) == pytest.approx(1 / dS, rel=1e-12)  # slope 1/delta_S
    for gid, F in (
        ("clamped-max", r.assembly_max),
        ("clamped-min", r.assembly_min),
        ("clamped-embedded", r.assembly_min - r.embedding_loss),
    ):
        x, y = xy(by_gid(fig, gid))
        assert y[0] * kN == pytest.approx(F, rel=1e-9)
        assert x[0] * um == pytest.approx(F * dS, rel=1e-12)  # starts on the bolt line
        assert y[1] == 0.0
        assert (y[0] - y[1]) * kN / ((x[1] - x[0]) * um) == pytest.approx(1 / dP, rel=1e-9)
    # the embedded line is the minimum line shifted by f_Z along the elongation axis
    x_min, _ = xy(by_gid(fig, "clamped-min"))
    x_emb, _ = xy(by_gid(fig, "clamped-embedded"))
    assert (x_min[1] - x_emb[1]) * um == pytest.approx(r.embedding_amount, rel=1e-9)

    thermal = r.thermal_change != 0
    assert has_gid(fig, "clamped-thermal") == thermal
    if thermal:
        _, y = xy(by_gid(fig, "clamped-thermal"))
        assert y[0] * kN == pytest.approx(st["temperature"].bolt_min, rel=1e-12)
        assert (y[0] * kN - st["embedded"].bolt_min) == pytest.approx(r.thermal_change, rel=1e-9)

    # the working load: a vertical bar from the residual clamp load to the bolt load
    svc = st["service_max"]
    x, y = xy(by_gid(fig, "working-load"))
    assert x[0] == x[1]
    assert y[0] * kN == pytest.approx(svc.clamp_min, rel=1e-12)
    assert y[1] * kN == pytest.approx(svc.bolt_min, rel=1e-12)
    assert (y[1] - y[0]) * kN == pytest.approx(svc.axial_load, rel=1e-9)
    _, yb = xy(by_gid(fig, "share-bolt"))
    assert (yb[1] - yb[0]) * kN == pytest.approx(r.load_factor_service * svc.axial_load, rel=1e-6)
    # its ends lie on the working-load lines through the service-temperature preload point
    FVT = st["temperature"].bolt_min
    xs, ys = xy(by_gid(fig, "service-bolt-side"))
    xc, yc = xy(by_gid(fig, "service-clamp-side"))
    assert ys[0] * kN == pytest.approx(FVT) and yc[0] * kN == pytest.approx(FVT)
    n = r.spec.service.load_height
    sS, sP = r.springs_service.delta_S, r.springs_service.delta_P
    bolt_slope = (ys[1] - ys[0]) * kN / ((xs[1] - xs[0]) * um)
    clamp_slope = (yc[0] - yc[1]) * kN / ((xc[1] - xc[0]) * um)
    assert bolt_slope == pytest.approx(1 / (sS + (1 - n) * sP), rel=1e-9)
    assert clamp_slope == pytest.approx(1 / (n * sP), rel=1e-9)
    assert np.interp(x[0], xs, ys) == pytest.approx(y[1], rel=1e-9)
    assert np.interp(x[0], xc, yc) == pytest.approx(y[0], rel=1e-9)
    # the separation point: the bolt-side line reaches F_A,sep where the clamp side reaches 0
    sx, sy = xy(by_gid(fig, "separation"))
    assert sy[0] * kN == pytest.approx(r.separation_load, rel=1e-12)
    assert sx[0] == pytest.approx(xc[1]) and ys[1] * kN == pytest.approx(r.separation_load)

    # the annotated values are the result's, formatted as elsewhere
    def val(key):
        return by_gid(fig, f"value-{key}").get_text()

    assert val("FMmax") == f"{fmt_number(r.assembly_max / kN)} kN"
    assert val("FMmin") == f"{fmt_number(r.assembly_min / kN)} kN"
    assert val("FZ") == f"{fmt_number(r.embedding_loss / kN)} kN"
    assert val("dFth") == f"{fmt_number(r.thermal_change / kN)} kN"
    assert val("FA") == f"{fmt_number(svc.axial_load / kN)} kN"
    assert val("FKR") == f"{fmt_number(r.residual_clamp_min / kN)} kN"
    assert val("FA,sep") == f"{fmt_number(r.separation_load / kN)} kN"
    assert f"{r.load_factor_service:.4g}" in by_gid(fig, "value-phi").get_text()


def test_joint_diagram_in_us_units(results):
    r = results["m10-cover-screw-aluminium"]
    fig = joint_diagram(r, units="us")
    _, y = xy(by_gid(fig, "clamped-max"))
    assert y[0] == pytest.approx(r.assembly_max / 4.4482216152605, rel=1e-12)
    assert by_gid(fig, "value-FA,sep").get_text().endswith(" lbf")


def test_bolt_load_plot_is_the_network_curve(results):
    r = results["m16-through-bolt-alternating"]
    fig = bolt_load_plot(r, n_points=31)
    lo = load_curve(r, 31, "min")
    for gid, data in (("bolt-min", lo.bolt_load), ("clamp-min", lo.clamp_load)):
        x, y = xy(by_gid(fig, gid))
        np.testing.assert_allclose(x, lo.axial_load / 1e3, rtol=1e-12)
        np.testing.assert_allclose(y, data / 1e3, rtol=1e-12)
    hi = load_curve(r, 31, "max", up_to=float(lo.axial_load[-1]))
    _, y = xy(by_gid(fig, "bolt-max"))
    np.testing.assert_allclose(y, hi.bolt_load / 1e3, rtol=1e-12)
    sx, sy = xy(by_gid(fig, "separation-min"))
    assert sx[0] == pytest.approx(r.separation_load / 1e3) and sy[0] == sx[0]
    x, _ = xy(by_gid(fig, "FA-max"))
    assert x[0] == pytest.approx(r.spec.service.axial_load[1] / 1e3)
    _, y = xy(by_gid(fig, "required-clamp-load"))
    assert y[0] == pytest.approx(r.spec.requirements.residual_clamp_load / 1e3)
    info = by_gid(fig, "info").get_text()
    assert f"{fmt_number(r.residual_clamp_min / 1e3)} kN" in info
    assert f"{fmt_number(r.separation_load / 1e3)} kN" in info


def test_spring_schematic_has_every_bolt_segment_and_the_split_stack(results):
    r = results["m10-cover-screw-aluminium"]
    fig = spring_schematic(r)
    for i in range(len(r.springs.segments)):
        assert has_gid(fig, f"bolt-{i}")
    for gid in ("clamp-outer-head", "clamp-inner", "clamp-outer-nut", "FA-A", "FA-B"):
        assert has_gid(fig, gid)
    texts = " ".join(t.get_text() for t in fig.findobj(lambda a: hasattr(a, "get_text")))
    assert f"{fmt_number(r.springs.delta_S * 1e9, 3)} µm/kN" in texts
    assert f"{r.load_factor:.4g}" in texts


def test_sweep_plot_data_and_limits(examples_dir):
    _, spec = read_joint_file(str(examples_dir / "exhaust-flange-hot.toml"))
    sw = sweep(spec, 20 + C0, 300 + C0, 5.0)
    assert sw.limits  # this joint fails a check when hot
    fig = sweep_plot(sw)
    T = sw.temperature - C0
    for gid, data in (
        ("preload-min", sw.preload_min),
        ("preload-max", sw.preload_max),
        ("residual-min", sw.residual_min),
    ):
        x, y = xy(by_gid(fig, gid))
        np.testing.assert_allclose(x, T)
        np.testing.assert_allclose(y, data / 1e3)
    for i, lim in enumerate(sw.limits):
        x, _ = xy(by_gid(fig, f"limit-{i}"))
        assert x[0] == pytest.approx(lim.temperature - C0)
        label = by_gid(fig, f"limit-label-{i}").get_text()
        assert lim.check in label and f"{lim.temperature - C0:.1f}" in label
    assert has_gid(fig, "failing")
    x, _ = xy(by_gid(fig, "assembly-temperature"))
    assert x[0] == pytest.approx(20.0)


def test_passes_plot():
    passes = [[5e3, 6e3, 5.5e3, 6.2e3], [9e3, 9.5e3, 9.1e3, 9.8e3], [12e3, 11.8e3, 12.1e3, 12.3e3]]
    fig = passes_plot(passes, 4, target=12e3)
    for k, p in enumerate(passes, start=1):
        x, y = xy(by_gid(fig, f"pass-{k}"))
        np.testing.assert_array_equal(x, [1, 2, 3, 4])
        np.testing.assert_allclose(y, np.asarray(p) / 1e3)
    _, y = xy(by_gid(fig, "target"))
    assert y[0] == 12.0
    assert by_gid(fig, "final-range").get_text() == "final: 11.80 .. 12.30 kN"
    with pytest.raises(ValueError, match="pass 2 lists 3"):
        passes_plot([[1.0, 2.0, 3.0, 4.0], [1.0, 2.0, 3.0]], 4)
    with pytest.raises(ValueError):
        passes_plot([], 4)


def test_histogram_counts_percentiles_and_limit():
    rng = np.random.default_rng(7)
    v = rng.normal(25e3, 2e3, 5000)
    fig = histogram(v, limit=21e3, limit_label="required")
    bars = fig.findobj(lambda a: a.get_gid() == "bar")
    assert sum(b.get_height() for b in bars) == 5000
    for q in (1, 50, 99):
        x, _ = xy(by_gid(fig, f"p{q}"))
        assert x[0] == pytest.approx(np.percentile(v, q) / 1e3)
        assert by_gid(fig, f"label-p{q}").get_text() == (
            f"p{q:02d} = {fmt_number(np.percentile(v, q) / 1e3)}"
        )
    share = np.mean(v < 21e3) * 100
    assert f"{share:.3g} % below" in by_gid(fig, "limit-label").get_text()
    with pytest.raises(ValueError):
        histogram([np.nan])


def test_rendering_svg_png_and_inline(results):
    r = results["m10-cover-screw-aluminium"]
    fig = joint_diagram(r)
    png = figure_png(fig, dpi=50)
    assert png.startswith(b"\x89PNG\r\n\x1a\n")
    svg = figure_svg(fig)
    assert svg.startswith("<?xml") and "<svg" in svg and "<metadata>" not in svg
    # stable: the same result gives the same file
    assert figure_svg(joint_diagram(r)) == figure_svg(joint_diagram(r))
    inl = inline_svg(fig, "fx", title="Joint load diagram")
    assert inl.startswith("<svg ") and inl.endswith("</svg>")
    assert "http" not in inl and "xmlns" not in inl and "xlink:" not in inl
    assert 'aria-label="Joint load diagram"' in inl and "viewBox=" in inl
    ids = set(re.findall(r'\bid="([^"]+)"', inl))
    assert ids and all(i.startswith("fx-") for i in ids)
    refs = set(re.findall(r'href="#([^"]+)"', inl)) | set(re.findall(r"url\(#([^)]+)\)", inl))
    assert refs <= ids  # every reference resolves inside this figure


def test_help_does_not_import_matplotlib():
    code = (
        "import sys\n"
        "from clampstack.cli import main\n"
        "try:\n    main(['--help'])\nexcept SystemExit:\n    pass\n"
        "print('MPL', 'matplotlib' in sys.modules)\n"
    )
    out = subprocess.run([sys.executable, "-c", code], capture_output=True, text=True, check=True)
    assert "MPL False" in out.stdout


def test_report_figures_keep_their_text_as_text(tmp_path):
    """The report's inline SVG figures carry labels as <text>, not glyph outlines."""
    import re

    from click.testing import CliRunner

    from clampstack.cli import main
    from conftest import EXAMPLES

    res = CliRunner().invoke(
        main, ["report", str(EXAMPLES / "m16-through-bolt-alternating.toml"), "-o", str(tmp_path)]
    )
    assert res.exit_code == 0, res.output
    html = (tmp_path / "m16-through-bolt-alternating.html").read_text(encoding="utf-8")
    svgs = re.findall(r"<svg\b.*?</svg>", html, flags=re.S)
    assert len(svgs) >= 3
    for svg in svgs:
        assert "<text" in svg
        assert 'id="DejaVuSans' not in svg and "DejaVuSans-" not in svg  # no glyph defs
    texts = " ".join(re.findall(r"<text\b[^>]*>(.*?)</text>", html, flags=re.S))
    assert "working load F_A" in texts
    assert "F_M,min" in texts
