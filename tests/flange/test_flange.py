"""Gasketed flange: ASME App. 2 against a hand calculation, ring interaction against the
analytic rigid-flange result, compensated targets, equilibrium, moment loading, bad input."""

from __future__ import annotations

import json
import math

import numpy as np
import pytest
from click.testing import CliRunner

from clampstack.cli import main
from clampstack.flange.analysis import (
    asme_app2,
    build_ring,
    compensated_targets,
    cross_order,
    simulate_passes,
    working_loads,
)
from clampstack.inputs.flange import flange_from_data

PSI = 6894.757293168361
INCH = 0.0254


def data(**over):
    d = {
        "title": "test flange",
        "flange": {
            "bolt_count": 8,
            "bolt_circle": "160 mm",
            "thickness": "20 mm",
            "inner_diameter": "90 mm",
            "outer_diameter": "200 mm",
            # the axial ring model: these tests check it (the rotating ring has its own,
            # tests/flange/test_rotation.py)
            "rotation": False,
        },
        "bolt": {"thread": "M16", "grade": "8.8"},
        "gasket": {
            "type": "spiral-wound",
            "inner_diameter": "95 mm",
            "outer_diameter": "127 mm",
            "thickness": "4.5 mm",
        },
        "loading": {"pressure": "40 bar"},
        "tightening": {"thread_friction": "0.10..0.14"},
    }
    for k, v in over.items():
        d[k] = v
    return d


def test_app2_against_hand_calculation():
    # ASME BPVC VIII-1 Appendix 2, 2-5, worked by hand for this gasket (inches, psi):
    # N = (127 - 95)/2 = 16 mm; b0 = N/2 = 8 mm = 0.31496 in > 1/4 in ->
    # b = 0.5 sqrt(0.31496) = 0.28060 in = 7.1273 mm; G = 127 - 2 b = 112.745 mm = 4.43878 in
    # P = 40 bar = 580.151 psi; m = 3, y = 10 000 psi (Table 2-5.1, spiral wound, from memory)
    # H = 0.785 G^2 P = 0.785 x 19.70277 x 580.151 = 8972.9 lbf
    # Hp = 2 b 3.14 G m P = 2 x 0.28060 x 3.14 x 4.43878 x 3 x 580.151 = 13 613.7 lbf
    # Wm2 = 3.14 b G y = 3.14 x 0.28060 x 4.43878 x 10 000 = 39 109.2 lbf
    spec = flange_from_data(data())
    a = asme_app2(spec)
    lbf = 4.4482216152605
    assert a.b0 == pytest.approx(8e-3, rel=1e-12)
    assert a.b / INCH == pytest.approx(0.28060, rel=1e-4)
    assert a.G / INCH == pytest.approx(4.43878, rel=1e-5)
    assert a.H / lbf == pytest.approx(8972.9, rel=2e-4)
    assert a.Hp / lbf == pytest.approx(13613.7, rel=2e-4)
    assert a.Wm1 == pytest.approx(a.H + a.Hp, rel=1e-12)
    assert a.Wm2 / lbf == pytest.approx(39109.2, rel=2e-4)
    # required area with S_a = S_b = min(Rm/5, Rp/4) = 160 MPa for 8.8 (our default)
    assert a.Am == pytest.approx(max(a.Wm1, a.Wm2) / 160e6, rel=1e-12)
    # available: 8 root areas of M16 (d3 = 16 - 1.226869 x 2 = 13.546 mm, ISO 898-1)
    assert a.Ab == pytest.approx(8 * math.pi / 4 * (13.546262e-3) ** 2, rel=1e-6)


def test_narrow_gasket_uses_mean_diameter():
    # b0 <= 1/4 in: b = b0 and G = mean contact diameter (App. 2, 2-5)
    spec = flange_from_data(
        data(
            gasket={
                "type": "fibre-3mm",
                "inner_diameter": "100 mm",
                "outer_diameter": "120 mm",
                "thickness": "3 mm",
            }
        )
    )
    a = asme_app2(spec)
    assert a.b0 == pytest.approx(5e-3) and a.b == a.b0
    assert a.G == pytest.approx(0.110)


def linear_rigid_spec(n=8):
    # linear gasket (loading and unloading on the same line), very stiff ring and flange
    return flange_from_data(
        data(
            flange={
                "bolt_count": n,
                "bolt_circle": "160 mm",
                "thickness": "20 mm",
                "inner_diameter": "90 mm",
                "outer_diameter": "200 mm",
                "mating": "rigid",
            },
            gasket={
                "inner_diameter": "95 mm",
                "outer_diameter": "127 mm",
                "thickness": "4.5 mm",
                "m": 3.0,
                "y": "69 MPa",
                "max_stress": "300 MPa",
                "unload_modulus": "5000 MPa",
                "curve": [[0.02, "100 MPa"], [0.04, "200 MPa"]],
            },
        )
    )


def test_rigid_flange_linear_gasket_interaction_against_analytic():
    # Rigid plate on a linear gasket of total stiffness K_g, bolts of stiffness k_b; bolts
    # not yet tightened are loose (they carry nothing, and cannot push).  Tightening the
    # next bolt from zero to the target t moves the plate by t / (K_g + e k_b), with e the
    # number of bolts already tightened, so each of those drops by the fraction
    # c = k_b / (K_g + e k_b) of t (equilibrium of the plate + compatibility).
    spec = linear_rigid_spec()
    import dataclasses

    ring = build_ring(dataclasses.replace(spec, rotation=False))  # a ring that does not turn
    ring.k_ring *= 1e8
    ring.k_flange *= 1e8
    n = ring.n
    kb = ring.k_bolt
    Kg = n * 5000e6 * ring.sector_area / ring.gasket_thickness
    target = 40e3
    order = cross_order(n)
    sim = simulate_passes(ring, np.full(n, target), (1.0,), [order])[-1]
    F = np.zeros(n)
    done: list[int] = []
    for j in order:
        c = kb / (Kg + len(done) * kb)
        F[done] -= c * target
        F[j] = target
        done.append(j)
    assert F.min() > 0  # every bolt still carries: the recurrence applies throughout
    np.testing.assert_allclose(sim, F, rtol=2e-6)
    assert F[order[0]] == F.min()  # the first bolt lost the most


def test_compensated_single_pass_is_uniform_within_1_percent():
    for d in (data(), linear_rigid_spec_data()):
        spec = flange_from_data(d)
        order = cross_order(spec.bolt_count)
        t, final = compensated_targets(spec, 50e3, order)
        spread = (final.max() - final.min()) / final.mean()
        assert spread <= 0.01
        assert final.mean() == pytest.approx(50e3, rel=0.01)
        # and an uncompensated single pass is not uniform
        ring = build_ring(spec)
        plain = simulate_passes(ring, np.full(spec.bolt_count, 50e3), (1.0,), [order])[-1]
        assert (plain.max() - plain.min()) / plain.mean() > 0.01


def linear_rigid_spec_data():
    d = data()
    d["gasket"] = {
        "inner_diameter": "95 mm",
        "outer_diameter": "127 mm",
        "thickness": "4.5 mm",
        "m": 3.0,
        "y": "69 MPa",
        "max_stress": "300 MPa",
        "unload_modulus": "500 MPa",
        "curve": [[0.2, "100 MPa"], [0.4, "200 MPa"]],
    }
    return d


def test_equilibrium_of_the_ring_in_every_state():
    spec = flange_from_data(
        data(loading={"pressure": "40 bar", "bending_moment": "3 kN*m", "axial_force": "5 kN"})
    )
    ring = build_ring(spec)
    n = ring.n
    G = asme_app2(spec).G
    FA = working_loads(spec, G)
    for frac in (0.3, 0.7, 1.0):
        for b in cross_order(n):
            ring.tighten(b, frac * 60e3, np.zeros(n))
            _, bolts, gasket, _ = ring.solve(np.zeros(n))
            assert abs(bolts.sum() - gasket.sum()) <= 1e-9 * bolts.sum() + 1e-6
    _, bolts, gasket, _ = ring.solve(FA)
    assert abs(bolts.sum() - gasket.sum() - FA.sum()) <= 1e-9 * bolts.sum()


def test_moment_loading_distribution():
    # bolt loads around the circle: F/N + 4 M cos(theta) / (N D_bc)
    spec = flange_from_data(
        data(loading={"pressure": "0 bar", "axial_force": "16 kN", "bending_moment": "4 kN*m"})
    )
    FA = working_loads(spec, 0.1)
    n, M, D = 8, 4e3, 0.160
    assert FA.max() == pytest.approx(16e3 / n + 4 * M / (n * D), rel=1e-12)
    assert FA.min() == pytest.approx(16e3 / n - 4 * M / (n * D), rel=1e-12)
    assert FA.sum() == pytest.approx(16e3, rel=1e-12)
    # moment equilibrium: sum F_i r cos(theta_i) = M
    theta = 2 * np.pi * np.arange(n) / n
    assert np.sum(FA * 0.5 * D * np.cos(theta)) == pytest.approx(M, rel=1e-12)


def test_cross_order_for_eight_bolts():
    assert [b + 1 for b in cross_order(8)] == [1, 5, 3, 7, 2, 6, 4, 8]


def run(*args):
    return CliRunner().invoke(main, list(args))


@pytest.mark.parametrize(
    "example", ["pump-outlet-flange-8-bolts.toml", "ring-flange-24-bolts-moment.toml"]
)
def test_flange_examples_json(examples_dir, example):
    res = run("flange", str(examples_dir / example), "--json")
    assert res.exit_code in (0, 1), res.output
    out = json.loads(res.stdout)
    for k in ("operating_N", "seating_N"):
        assert out["required_bolt_load"][k] > 0
    for k in ("effective_width_mm", "reaction_diameter_mm"):
        assert out["gasket"][k] > 0
    n = out["bolt_count"]
    assert len(out["bolts"]) == n and all("preload_N" in b for b in out["bolts"])
    assert len(out["passes"]) == 4 and all(len(p) == n for p in out["passes"])
    assert isinstance(out["checks"], list) and isinstance(out["ok"], bool)
    assert (res.exit_code == 0) == out["ok"]


def test_readable_flange_output_has_pressure_caution(examples_dir):
    res = run("flange", str(examples_dir / "pump-outlet-flange-8-bolts.toml"))
    assert "pressure-equipment code" in res.output and "qualified engineer" in res.output
    assert "pass 4" in res.output and "W_m2" in res.output


@pytest.mark.parametrize(
    ("path", "value", "needle"),
    [
        (("gasket", "outer_diameter"), "170 mm", "gasket.outer_diameter"),
        (("flange", "bolt_count"), 2, "flange.bolt_count"),
        (("loading", "pressure"), "-5 bar", "loading.pressure"),
        (("tightening", "passes"), [30, -70], "tightening.passes"),
        (("gasket", "type"), "unobtainium", "gasket.type"),
    ],
)
def test_bad_flange_input(write_toml, path, value, needle):
    import tomllib  # noqa: F401 - the text below is TOML

    d = data()
    d[path[0]][path[1]] = value
    p = write_toml(_to_toml(d))
    res = run("flange", str(p))
    assert res.exit_code == 2
    assert res.stdout == ""
    line = res.stderr.strip()
    assert "\n" not in line and needle in line and p.name in line


def _to_toml(d: dict) -> str:
    def val(v):
        if isinstance(v, str):
            return json.dumps(v)
        if isinstance(v, list):
            return "[" + ", ".join(val(x) for x in v) + "]"
        return json.dumps(v) if isinstance(v, bool) else repr(v)

    out = [f"title = {json.dumps(d['title'])}"]
    for table, kv in d.items():
        if table == "title":
            continue
        out.append(f"[{table}]")
        out.extend(f"{k} = {val(v)}" for k, v in kv.items())
    return "\n".join(out) + "\n"


def test_bolt_and_nut_keys_as_for_a_joint(write_toml):
    # DESIGN.md: a flange file's [bolt] and [nut] are "as for a joint"; [tightening] as for
    # a joint plus the pass sequence (methods torque, angle, yield, tension)
    text = """
[flange]
bolt_count = 8
bolt_circle = "160 mm"
thickness = "20 mm"
material = "steel"
[bolt]
thread = "M16"
grade = "8.8"
length = "80 mm"
head = "hex"
shank_length = "10 mm"
temperature = "100 degC"
[nut]
height = "13 mm"
bearing_diameter = "22 mm"
[gasket]
type = "spiral-wound"
inner_diameter = "95 mm"
outer_diameter = "127 mm"
thickness = "4.5 mm"
[loading]
pressure = "40 bar"
[tightening]
method = "yield"
thread_friction = "0.10..0.14"
passes = [50, 100]
"""
    res = run("flange", str(write_toml(text)), "--json")
    assert res.exit_code in (0, 1), res.output
    out = json.loads(res.stdout)
    assert len(out["passes"]) == 2
    short = text.replace('length = "80 mm"', 'length = "40 mm"')
    res = run("flange", str(write_toml(short)))
    assert res.exit_code == 2 and "bolt.length" in res.stderr


@pytest.mark.parametrize(
    ("flange_mat", "T_flange", "T_bolt", "sign"),
    [
        ("steel", "80 degC", "80 degC", 0),
        ("steel", "80 degC", "20 degC", 1),
        ("aluminium-6082-T6", "80 degC", "80 degC", 1),
        ("steel", "20 degC", "80 degC", -1),
    ],
)
def test_flange_temperature_changes_bolt_load_the_right_way(flange_mat, T_flange, T_bolt, sign):
    # compatibility: a flange that grows more than its bolts raises the bolt load, one that
    # grows less lowers it; the same steel at one temperature changes it only through the
    # (small) modulus change
    d = data(loading={"pressure": "0 bar", "temperature": T_flange, "bolt_temperature": T_bolt})
    d["flange"]["material"] = flange_mat
    cold = data(loading={"pressure": "0 bar"})
    cold["flange"]["material"] = flange_mat
    from clampstack.flange.analysis import analyse_flange

    hot_r = analyse_flange(flange_from_data(d), compensate=False)
    cold_r = analyse_flange(flange_from_data(cold), compensate=False)
    change = (hot_r.service_bolt.mean() - cold_r.service_bolt.mean()) / cold_r.service_bolt.mean()
    if sign == 0:
        assert abs(change) < 0.02
    else:
        assert change * sign > 0.01


def test_flange_aliases_and_pass_fractions(write_toml):
    d = data()
    d["loading"] = {
        "pressure": "10 bar",
        "flange_temperature": "60 degC",
        "gasket_temperature": "60 degC",
    }
    d["tightening"] = {
        "thread_friction": "0.10..0.14",
        "passes": ["30 %", "70 %", "100 %"],
        "sequence": "circular",
    }
    res = run("flange", str(write_toml(_to_toml(d))), "--json")
    assert res.exit_code in (0, 1), res.output
    out = json.loads(res.stdout)
    assert out["pass_fractions"] == pytest.approx([0.3, 0.7, 1.0])
    assert out["pass_orders"][0] == list(range(1, 9))
    d["tightening"]["passes"] = [0.3, 0.7, 1.0]
    out = json.loads(run("flange", str(write_toml(_to_toml(d))), "--json").stdout)
    assert out["pass_fractions"] == pytest.approx([0.3, 0.7, 1.0])
