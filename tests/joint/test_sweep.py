"""Temperature sweep: closed form against the network, root finding against a fine grid."""

from __future__ import annotations

import json

import numpy as np
import pytest
from click.testing import CliRunner
from hypothesis import given, settings
from hypothesis import strategies as st

from clampstack.cli import main
from clampstack.inputs.joint import joint_from_data, read_joint_file
from clampstack.joint import analyse
from clampstack.joint.prepare import joint_network, service_closed_form, solve_service
from clampstack.studies.sweep import _evaluate, sweep

C0 = 273.15


def cover(**over):
    data = {
        "bolt": {"thread": "M8", "grade": "8.8", "length": "30 mm"},
        "tapped_hole": {"material": "steel", "engagement": "12 mm"},
        "clamped": [{"material": "aluminium-6082-T6", "thickness": "12 mm"}],
        "tightening": {"torque": "17 N*m", "thread_friction": "0.10..0.16"},
        "service": {"axial_load": "0..2.5 kN", "temperature": "90 degC"},
        "requirements": {"residual_clamp_load": "3 kN"},
    }
    data.update(over)
    return data


@settings(max_examples=60, deadline=None)
@given(
    FV=st.floats(-5e3, 40e3),
    n=st.floats(0.1, 1.0),
    FA=st.one_of(st.just(0.0), st.floats(1.0, 80e3), st.floats(-30e3, -1.0)),
)
def test_closed_form_equals_network_including_separation(FV, n, FA):
    # the sweep's closed form (exact piecewise) against the joint network it stands for
    dS, dP = 3.1e-9, 0.9e-9
    phi = n * dP / (dS + dP)
    jn = joint_network(dS, dP, n, -FV * (dS + dP), 0.0)
    bolt, clamp = solve_service(jn, FA)
    FS, FK = service_closed_form(np.array(FV), np.array(phi), FA)
    scale = max(abs(FV), abs(FA), 1.0)
    assert float(FS) == pytest.approx(bolt, abs=1e-9 * scale)
    assert float(FK) == pytest.approx(clamp, abs=1e-9 * scale)


def test_sweep_at_service_temperature_equals_check(examples_dir):
    _, spec = read_joint_file(str(examples_dir / "gearbox-cover-cold-to-hot.toml"))
    r = analyse(spec)
    T = spec.service.temperature
    s = sweep(spec, T - 10, T + 10, 10.0)
    i = 1
    assert s.temperature[i] == pytest.approx(T)
    st_ = {x.key: x for x in r.states}
    assert s.preload_min[i] == pytest.approx(st_["temperature"].bolt_min, rel=1e-9)
    assert s.preload_max[i] == pytest.approx(st_["temperature"].bolt_max, rel=1e-9)
    assert s.residual_min[i] == pytest.approx(r.residual_clamp_min, rel=1e-9)
    assert s.bolt_load_max[i] == pytest.approx(r.bolt_load_max, rel=1e-9)
    for c in r.checks:
        if c.name in ("plastic_collapse", "cycle_yield"):
            continue  # from the elastic-plastic cycle, not per temperature point
        assert s.margins[c.name][i] == pytest.approx(c.margin, rel=1e-9, abs=1e-12)


def test_limits_by_root_finding_agree_with_a_fine_grid():
    # residual clamp load falls as the aluminium cover shrinks in the cold: find where
    # it crosses the requirement and compare with a brute-force grid of 0.001 K
    spec = joint_from_data(cover(requirements={"residual_clamp_load": "3.6 kN"}))
    s = sweep(spec, C0 - 50, C0 + 150, 5.0)
    lims = [lim for lim in s.limits if lim.check == "residual_clamp_load"]
    assert len(lims) == 1 and lims[0].fails == "below"
    root = lims[0].temperature
    grid = np.arange(root - 1.0, root + 1.0, 0.001)
    m = _evaluate(_prep(spec), grid)["margins"]["residual_clamp_load"]
    crossing = grid[np.flatnonzero((m[1:] >= 0) != (m[:-1] >= 0))[0] + 1]
    assert abs(crossing - root) <= 0.0011
    m_all = s.margins["residual_clamp_load"]
    assert m_all[0] < 0 < m_all[-1]


def _prep(spec):
    from clampstack.joint.prepare import prepare

    return prepare(spec)


def test_cold_and_hot_thermal_change_signs():
    s = sweep(joint_from_data(cover()), C0 - 40, C0 + 150, 10.0)
    # aluminium clamped by steel: preload falls in the cold and rises when hot
    assert s.thermal_change_cold < 0 < s.thermal_change_hot


def test_range_outside_catalog_data_names_material(write_toml):
    p = write_toml("""
[bolt]
thread = "M8"
grade = "8.8"
length = "30 mm"
[tapped_hole]
material = "aluminium-cast"
[[clamped]]
material = "steel"
thickness = "10 mm"
""")
    # its data end at 200 degC: above them nothing is extrapolated
    res = CliRunner().invoke(main, ["sweep", str(p), "--temperature", "-40..250"])
    assert res.exit_code == 2
    line = res.stderr.strip()
    assert "\n" not in line and "aluminium-cast" in line and "200" in line
    assert "--temperature" in line and "tapped hole" in line
    assert res.stdout == ""


def test_sweep_cli_json_and_csv(examples_dir):
    f = str(examples_dir / "gearbox-cover-cold-to-hot.toml")
    res = CliRunner().invoke(
        main, ["sweep", f, "--temperature", "-40..150", "--step", "10", "--json"]
    )
    # the hot cover adds preload; with F_M,zul in R8 (VDI 2230-1) the working stress is the
    # first check to fail, between 110 and 120 degC: the sweep exits 1 and names it
    assert res.exit_code == 1, res.output
    out = json.loads(res.stdout)
    assert out["check_basis"] == "permissible" and out["check_preload_N"] > 0
    lim = {x["check"]: x["temperature_degC"] for x in out["limits"]}
    assert 110 < lim["working_stress"] < 120
    assert len(out["points"]) == 20
    p0 = out["points"][0]
    for key in (
        "temperature_degC",
        "preload_min_N",
        "preload_max_N",
        "residual_clamp_load_min_N",
        "bolt_stress_max_MPa",
        "ok",
    ):
        assert key in p0
    assert p0["temperature_degC"] == pytest.approx(-40.0)
    assert out["points"][-1]["temperature_degC"] == pytest.approx(150.0)
    assert isinstance(out["limits"], list)
    res = CliRunner().invoke(main, ["sweep", f, "--temperature", "-40..150", "--csv"])
    lines = res.stdout.strip().splitlines()
    assert lines[0].startswith("temperature_degC,") and len(lines) == 102


def test_sweep_cycle_reports_permanent_loss(examples_dir):
    f = str(examples_dir / "exhaust-flange-hot.toml")
    res = CliRunner().invoke(main, ["sweep", f, "--temperature", "20..280", "--cycle", "--json"])
    out = json.loads(res.stdout)
    assert res.exit_code == 1  # the bolts yield when hot
    hot = out["cycle"]["hot"]
    assert hot["permanent_loss_N"] > 0 and "bolt" in hot["yielded"]
    assert any(lim["check"] == "working_stress" for lim in out["limits"])


def test_per_part_temperatures_scale_from_the_assembled_state(examples_dir):
    # the exhaust flange: flange at 380 degC, bolts at 280 degC in service; at the assembly
    # temperature every part is at it, so the sweep starts from the assembled state
    _, spec = read_joint_file(str(examples_dir / "exhaust-flange-hot.toml"))
    s = sweep(spec, C0 + 20, C0 + 380, 10.0)
    r = analyse(spec)
    assert s.preload_max[0] == pytest.approx(r.assembly_max, rel=1e-9)
    assert s.thermal_change_cold == pytest.approx(0.0, abs=1e-6)
    # and at the file's service temperature it is the check's state
    st = {x.key: x for x in r.states}
    assert s.preload_min[-1] == pytest.approx(st["temperature"].bolt_min, rel=1e-9)
