"""Permanent preload loss from a heat cycle with an elastic-perfectly-plastic bolt.

Hand calculation for the elastic-perfectly-plastic bar in parallel with an elastic
member (any mechanics of materials text, e.g. Gere & Goodno, ch. 2, elastoplastic
analysis of statically indeterminate bars): heating raises the bolt force elastically
by dF_th; if F0 + dF_th exceeds the yield force Y the bolt stretches plastically by
(F0 + dF_th - Y)(delta_S + delta_P); on cooling the force falls by dF_th along the
elastic slope, so the preload left is Y - dF_th, a loss of F0 + dF_th - Y.
"""

from __future__ import annotations

import pytest

from clampstack.inputs.joint import joint_from_data
from clampstack.joint import analyse
from clampstack.joint.plastic import permanent_loss_cycle
from clampstack.joint.prepare import prepare


def joint(T_service: str, preload: str = "22 kN") -> dict:
    # A2-70 (no elevated-temperature data: constant yield 450 MPa), constant moduli and
    # expansion, n = 1, no embedding: the closed form above applies exactly.
    return {
        "bolt": {
            "thread": "M10",
            "grade": "A2-70",
            "length": "50 mm",
            "modulus": "200 GPa",
            "expansion": "11e-6 / K",
        },
        "nut": {},
        "clamped": [{"modulus": "70 GPa", "expansion": "23e-6 / K", "thickness": "35 mm"}],
        "embedding": {"amount": "0 um"},
        "tightening": {"method": "tension", "preload": preload, "scatter": 1.0},
        "service": {"load_height": 1.0, "temperature": T_service},
    }


def test_elastic_cycle_returns_the_preload_exactly():
    r = analyse(joint_from_data(joint("60 degC")))
    c = r.cycle
    assert c.yielded == ()
    assert c.preload_after[1] == pytest.approx(c.preload_before[1], rel=1e-12)
    assert c.permanent_loss == pytest.approx(0.0, abs=1e-9 * c.preload_before[1])


def test_yielding_bolt_loses_the_hand_calculated_amount():
    spec = joint_from_data(joint("150 degC"))
    r = analyse(spec)
    Y = 450e6 * r.A0  # ISO 3506-1 A2-70 Rp0.2 = 450 MPa (catalog), As of M10
    F0 = 22e3
    dF = r.thermal_change_max  # elastic thermal change, constant moduli
    assert F0 + dF > Y  # the case yields
    c = r.cycle
    assert "bolt" in c.yielded
    assert c.preload_after[1] == pytest.approx(Y - dF, rel=1e-9)
    assert c.permanent_loss == pytest.approx(F0 + dF - Y, rel=1e-9)
    # the peak of the path sits on the yield plateau
    assert max(p[2] for p in c.path) == pytest.approx(Y, rel=1e-9)
    assert any("permanent loss" in n for n in r.notes)


def test_cycle_to_a_lower_peak_is_elastic_again():
    prep = prepare(joint_from_data(joint("150 degC")))
    low = permanent_loss_cycle(prep, T_peak=293.15 + 30)
    assert low.permanent_loss == pytest.approx(0.0, abs=1e-6)


def test_plastic_collapse_is_a_note_and_failing_checks_not_an_error():
    # service load above what the yielding bearing faces can carry (found by fuzzing):
    # the check reports failing rules (exit 1), the cycle a plastic collapse
    from click.testing import CliRunner

    from clampstack.cli import main

    spec = joint_from_data(
        {
            "bolt": {"thread": "M12", "grade": "10.9", "length": "60 mm"},
            "nut": {},
            "clamped": [
                {"material": "steel", "thickness": "18 mm"},
                {"material": "steel", "thickness": "22 mm"},
            ],
            "tightening": {"torque": "90 N*m", "thread_friction": "0.10..0.14"},
            "service": {"axial_load": "0..58 kN", "load_height": 0.5},
        }
    )
    r = analyse(spec)
    assert not r.ok
    if r.cycle is None:
        assert any("Plastic collapse" in n for n in r.notes)
    else:  # the faces flatten until the bolt carries nothing: all preload is lost
        assert r.cycle.preload_after[1] <= 1e-6 * r.cycle.preload_before[1]
        assert any("permanent loss" in n for n in r.notes)
    import tempfile
    from pathlib import Path

    d = Path(tempfile.mkdtemp())
    f = d / "j.toml"
    f.write_text("""
[bolt]
thread = "M12"
grade = "10.9"
length = "60 mm"
[nut]
[[clamped]]
material = "steel"
thickness = "18 mm"
[[clamped]]
material = "steel"
thickness = "22 mm"
[tightening]
torque = "90 N*m"
thread_friction = "0.10..0.14"
[service]
axial_load = "0..58 kN"
""")
    res = CliRunner().invoke(main, ["check", str(f)])
    assert res.exit_code == 1, res.output


def _soft_layer_joint(load: str):
    # a steel stack with a soft cast-aluminium layer under a large service load: the
    # bearing faces yield (our own scenario)
    return joint_from_data(
        {
            "bolt": {"thread": "M12", "grade": "10.9", "length": "60 mm"},
            "nut": {},
            "clamped": [
                {"material": "steel", "thickness": "18 mm"},
                {"material": "aluminium-cast", "thickness": "22 mm"},
            ],
            "tightening": {"torque": "110 N*m"},
            "service": {"axial_load": load},
        }
    )


@pytest.mark.parametrize("load", ["60 kN", "90 kN", "200 kN"])
def test_a_collapse_or_a_permanent_loss_is_a_failing_named_check(load):
    r = analyse(_soft_layer_joint(load))
    by = {c.name: c for c in r.checks}
    if r.cycle is None:  # no equilibrium with yielding parts
        assert not by["plastic_collapse"].passed and "VDI 2230-1" in by["plastic_collapse"].source
        assert not r.ok
    elif r.cycle.permanent_loss > 0:
        assert not by["cycle_yield"].passed
        assert by["cycle_yield"].value == pytest.approx(r.cycle.permanent_loss / 1e3)
        assert not r.ok
    else:
        assert by["plastic_collapse"].passed and by["cycle_yield"].passed
    # never a PASS beside a note of collapse or yielding
    if any("Plastic collapse" in n or "permanent loss" in n for n in r.notes):
        assert not r.ok


def test_the_two_plastic_checks_appear_in_every_check(examples_dir):
    from clampstack.inputs.joint import read_joint_file

    _, spec = read_joint_file(str(examples_dir / "m16-through-bolt-alternating.toml"))
    r = analyse(spec)
    names = [c.name for c in r.checks]
    assert "plastic_collapse" in names and "cycle_yield" in names
    assert all(c.passed for c in r.checks if c.name in ("plastic_collapse", "cycle_yield"))
