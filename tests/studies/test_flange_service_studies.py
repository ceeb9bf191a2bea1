"""sweep and scatter on flange files: heat cycles per bolt, and the scatter of the passes."""

from __future__ import annotations

import json
import math

import numpy as np
import pytest
from click.testing import CliRunner

from clampstack.cli import main
from clampstack.flange.analysis import analyse_flange
from clampstack.inputs.flange import read_flange_file
from clampstack.studies.flange_scatter import flange_scatter
from clampstack.studies.flange_sweep import flange_sweep

C0 = 273.15


def _spec(examples_dir, name="steam-header-flange-tensioned.toml"):
    return read_flange_file(str(examples_dir / name))[1]


def test_sweep_point_at_the_service_temperature_is_the_flange_start_up(examples_dir):
    # consistency check: the sweep's point at the file's flange temperature is the state
    # `clampstack flange` calls start-up, bolt by bolt
    spec = _spec(examples_dir, "pump-outlet-flange-8-bolts.toml")
    det = analyse_flange(spec, compensate=False)
    r = flange_sweep(spec, spec.T_assembly, spec.T_flange + 80.0, step=None)
    i = int(np.argmin(np.abs(r.temperature - spec.T_flange)))
    if abs(r.temperature[i] - spec.T_flange) < 1e-9:
        np.testing.assert_allclose(r.bolt[i], det.cycle["start_up"].bolt, rtol=1e-9)
        np.testing.assert_allclose(r.gasket[i], det.cycle["start_up"].gasket, rtol=1e-9)
    d = r.to_dict()
    for p in d["points"]:
        assert {"gasket_stress_min_MPa", "bolt_load_min_N", "temperature_degC"} <= set(p)
        assert p["gasket_stress_min_MPa"] <= p["gasket_stress_max_MPa"]
        assert len(p["bolt_load_N"]) == spec.bolt_count


def test_sweep_cycle_relaxes_at_the_peak_and_cools_back(examples_dir):
    spec = _spec(examples_dir)
    r = flange_sweep(spec, spec.T_assembly, 220 + C0, cycle=True)
    heat = [i for i, p in enumerate(r.phase) if p == "heating"]
    cool = [i for i, p in enumerate(r.phase) if p == "cooling"]
    assert len(heat) == len(cool) and r.temperature[cool[0]] == r.temperature[heat[-1]]
    c = r.cycle
    states = {s["state"]: s for s in c["states"]}
    P = c["relaxation_factor"]
    np.testing.assert_allclose(
        np.array(states["hot"]["gasket_force_N"]) / np.array(states["start_up"]["gasket_force_N"]),
        P,
        rtol=1e-9,
    )
    # at the end of the cycle the gasket keeps less than at the same temperature on heating
    assert np.all(r.gasket[cool[-1]] < r.gasket[heat[0]])
    # the cycle at the file's own temperature is the one `clampstack flange` reports
    det = analyse_flange(spec, compensate=False)
    np.testing.assert_allclose(
        states["cooled"]["gasket_force_N"], det.cycle["cooled"].gasket, rtol=1e-7
    )


def test_sweep_limit_is_a_root_of_the_margin(examples_dir):
    # a bolt temperature far above the flange's drives the gasket below its minimum on
    # heating; the limit temperature is where the margin is zero (Brent's method)
    spec = _spec(examples_dir, "pump-outlet-flange-8-bolts.toml")
    import dataclasses

    spec = dataclasses.replace(
        spec, pressure=110e5, T_flange=spec.T_assembly + 100, T_bolt=spec.T_assembly + 250
    )
    r = flange_sweep(spec, spec.T_assembly, spec.T_assembly + 100, step=5)
    lims = [lim for lim in r.limits if lim.check == "gasket_operating"]
    assert lims, r.margins["gasket_operating"]
    lim = lims[0]
    r2 = flange_sweep(spec, lim.temperature - 1e-3, lim.temperature + 1e-3, step=1e-3)
    m = r2.margins["gasket_operating"]
    assert m[0] > 0 > m[-1]


def test_sweep_and_scatter_commands_on_flange_files(examples_dir, tmp_path):
    f = examples_dir / "steam-header-flange-tensioned.toml"
    res = CliRunner().invoke(
        main, ["sweep", str(f), "--temperature", "20..220", "--cycle", "--json"]
    )
    assert res.exit_code in (0, 1), res.output
    d = json.loads(res.output)
    assert d["points"][0]["gasket_stress_min_MPa"] > 0 and "cycle" in d
    res = CliRunner().invoke(main, ["sweep", str(f), "--temperature", "20..220", "--case", "x"])
    assert res.exit_code == 2 and "--case" in res.output
    text = f.read_text().replace(
        "[tightening]",
        '[distributions]\npreload = {normal = ["62 kN", "3 kN"]}\n'
        'gasket_relaxation = "0.85..0.95"\n\n[tightening]',
    )
    g = tmp_path / "f.toml"
    g.write_text(text)
    res = CliRunner().invoke(main, ["scatter", str(g), "--samples", "4000", "--json"])
    assert res.exit_code == 0, res.output
    d = json.loads(res.output)
    p = d["probabilities"]["gasket_below_operating_after_cycle"]
    assert p["low"] <= p["estimate"] <= p["high"]
    assert "gasket_relaxation" in d["distributions"]
    bad = text.replace('gasket_relaxation = "0.85..0.95"', 'embedding = "1..2 um"')
    g.write_text(bad)
    res = CliRunner().invoke(main, ["scatter", str(g), "--samples", "100"])
    assert res.exit_code == 2 and "distributions.embedding" in res.output
    assert res.output.count("\n") == 1


def test_scatter_without_spread_is_the_deterministic_flange(examples_dir):
    # consistency check: with every input fixed the linear pass model is anchored on the
    # ring's own pass simulation, so every sample is the deterministic flange
    import dataclasses

    from clampstack.joint.model import Dist

    spec = _spec(examples_dir, "pump-outlet-flange-8-bolts.toml")
    mu = spec.thread_friction[0]
    spec = dataclasses.replace(
        spec,
        thread_friction=(mu, mu),
        head_friction=(mu, mu),
        distributions={"torque_factor": Dist("fixed", 1.0)},
    )
    det = analyse_flange(spec, compensate=False)
    r = flange_scatter(spec, 512, seed=1)
    pct = r.percentiles["assembly_preload"]
    assert pct["p01"] == pytest.approx(float(det.passes[-1].min()), rel=1e-6)
    assert pct["p99"] == pytest.approx(float(det.passes[-1].max()), rel=1e-6)
    after = min(det.cycle["hot"].gasket.min(), det.cycle["cooled"].gasket.min())
    assert r.percentiles["gasket_after_cycle"]["p50"] == pytest.approx(after, rel=1e-6)


def test_scatter_per_pass_model_follows_a_changed_last_pass(examples_dir):
    # the linear pass model against the ring's own simulation for one changed target: the
    # last pass's target of one bolt 10 % higher (tangent of the assembled ring)
    from clampstack.flange.analysis import build_ring
    from clampstack.studies.flange_scatter import _PassModel

    spec = _spec(examples_dir, "pump-outlet-flange-8-bolts.toml")
    det = analyse_flange(spec, compensate=False)
    model = _PassModel(det)
    n = spec.bolt_count
    t = np.asarray(det.pass_fractions)[:, None] * np.full((1, n), det.target)
    t2 = t.copy()
    t2[-1, 3] *= 1.10
    lin = model.final(t2[None])[0]
    ring = build_ring(spec)
    zero = np.zeros(n)
    for frac, order in zip(det.pass_fractions, det.orders, strict=True):
        for b in order:
            ring.tighten(
                b,
                frac
                * det.target
                * (
                    1.10
                    if (b == 3 and frac == det.pass_fractions[-1] and order is det.orders[-1])
                    else 1.0
                ),
                zero,
            )
    ref = ring.solve(zero)[1]
    assert math.isclose(lin[3], ref[3], rel_tol=2e-3)
    np.testing.assert_allclose(lin, ref, rtol=2e-2)


def test_sweep_cycle_cools_back_to_the_assembly_temperature(examples_dir):
    # a range that starts above the assembly temperature still reports the cooled state
    # at the assembly temperature, as `clampstack flange` does (review finding)
    spec = _spec(examples_dir, "hot-oil-flange-spiral-wound.toml")
    r = flange_sweep(spec, 150 + C0, spec.T_flange, cycle=True)
    states = {s["state"]: s for s in r.cycle["states"]}
    assert states["cooled"]["flange_temperature_degC"] == pytest.approx(spec.T_assembly - C0)
    det = analyse_flange(spec, compensate=False)
    np.testing.assert_allclose(
        states["cooled"]["gasket_force_N"], det.cycle["cooled"].gasket, rtol=1e-6
    )


def test_a_relaxation_factor_range_above_one_is_refused(examples_dir, tmp_path):
    f = examples_dir / "hot-oil-flange-spiral-wound.toml"
    g = tmp_path / "f.toml"
    g.write_text(
        f.read_text().replace('gasket_relaxation = "0.85..0.93"', 'gasket_relaxation = "0.9..1.3"')
    )
    res = CliRunner().invoke(main, ["scatter", str(g), "--samples", "100"])
    assert res.exit_code == 2 and "distributions.gasket_relaxation" in res.stderr


def test_sweep_cycle_reports_the_whole_gaskets_creep_as_flange_does(examples_dir):
    # a flange pair's ring model holds half the gasket: both reports give the whole
    # gasket's thickness lost (regression: the sweep gave the half model's)
    spec = _spec(examples_dir, "hot-oil-flange-spiral-wound.toml")
    r = flange_sweep(spec, spec.T_assembly, spec.T_flange, cycle=True)
    det = analyse_flange(spec, compensate=False)
    np.testing.assert_allclose(r.cycle["gasket_creep_mm"], det.cycle.creep * 1e3, rtol=1e-6)
