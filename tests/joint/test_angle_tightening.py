"""Angle-controlled tightening: snug torque, then the nut turned by an angle.

Elastic (from the compatibility of bolt and clamped parts; VDI 2230-1 resiliences):
F_M = F_snug + P theta / (2 pi (delta_S + delta_P)), F_snug = T_snug / k(mu) (VDI 2230-1
R13 / ISO 16047).  Past the yield preload F_0.2 (VDI 2230-1 R7 with nu = 1) the bolt is
bilinear up to R_m at 2 % plastic strain of the clamp length (from memory):
F = [F_y + (u - F_y delta_S) k_p] / (1 + delta_P k_p), u = F_snug (dS + dP) + P theta/(2 pi).
Hand calculations from these relations; consistency checks of the tool's own closed form
against its result object where so labelled.
"""

from __future__ import annotations

import math

import numpy as np
import pytest

from clampstack.components import permissible_preload
from clampstack.components.tightening import HARDENING_STRAIN
from clampstack.errors import InputError
from clampstack.inputs.joint import joint_from_data
from clampstack.joint.analysis import analyse
from clampstack.studies.scatter import scatter

MU = 0.12


def _joint(**tightening) -> dict:
    t = {
        "method": "angle",
        "snug_torque": "20 N*m",
        "angle": "10 deg",
        "thread_friction": MU,
        "head_friction": MU,
        "torque_tolerance": 0.0,
    }
    t.update(tightening)
    return {
        "title": "angle",
        "bolt": {"thread": "M12", "grade": "10.9", "length": "60 mm"},
        "nut": {},
        "clamped": [{"material": "steel", "thickness": "40 mm"}],
        "tightening": t,
        "service": {"axial_load": "10 kN"},
    }


def test_elastic_angle_adds_the_thread_lead_over_the_joint_resilience():
    r = analyse(joint_from_data(_joint()))
    dS, dP = r.springs.delta_S, r.springs.delta_P
    F_snug = 20.0 / r.spec.tightening.snug_torque * r.angle["snug_preload_min_N"]
    th = math.radians(10)
    expect = F_snug + 1.75e-3 * th / (2 * math.pi * (dS + dP))
    assert r.assembly_max == pytest.approx(expect, rel=1e-9)
    assert r.angle["yields_max"] is False and r.angle["permanent_elongation_max_um"] == 0
    j = r.to_dict()["tightening"]
    assert j["method"] == "angle" and j["snug_torque_Nm"] == 20.0 and j["angle_deg"] == [10.0, 10.0]
    # elastic: the assembly preload is checked against F_M,zul as for torque tightening
    assert any(c.name == "assembly_preload" for c in r.checks)


def test_past_yield_the_bilinear_bolt_by_hand():
    r = analyse(joint_from_data(_joint(angle="90 deg")))
    dS, dP = r.springs.delta_S, r.springs.delta_P
    s = r.spec
    thr = s.bolt.thread
    Fy = float(permissible_preload(thr.As, thr.ds, thr.d2, thr.P, 1.2 * s.bolt.grade.Rp02, MU, 1.0))
    Fu = Fy * s.bolt.grade.Rm / s.bolt.grade.Rp02
    kp = (Fu - Fy) / (HARDENING_STRAIN * s.clamp_length + (Fu - Fy) * dS)
    u = r.angle["snug_preload_max_N"] * (dS + dP) + thr.P * math.pi / 2 / (2 * math.pi)
    F = (Fy + (u - Fy * dS) * kp) / (1 + dP * kp)
    assert r.assembly_max == pytest.approx(F, rel=1e-9)
    assert r.angle["yields_max"] is True
    assert r.angle["permanent_elongation_max_um"] == pytest.approx((u - F * (dS + dP)) * 1e6)
    assert r.angle["utilization_max"] > 1
    assert not any(c.name == "assembly_preload" for c in r.checks)


def test_scatter_gives_a_probability_of_yield_that_means_something():
    # an angle near the yield threshold: some bolts of the lot yield, some do not
    spec = joint_from_data(
        _joint(
            angle="48 deg",
            angle_tolerance="3 deg",
            torque_tolerance=0.06,
            thread_friction="0.10..0.14",
            head_friction="0.10..0.14",
        )
    )
    sr = scatter(spec, {}, 20_000)
    p = sr.probability("bolt_yield_assembly")["estimate"]
    assert 0.02 < p < 0.98
    assert "angle" in sr.distributions and "deg" in sr.distributions["angle"]


@pytest.mark.parametrize(
    ("tightening", "key"),
    [
        ({"snug_torque": None}, "tightening.snug_torque"),
        ({"angle": None}, "tightening.angle"),
        ({"angle": "-10 deg"}, "tightening.angle"),
        ({"torque": "50 N*m"}, "tightening.torque"),
    ],
)
def test_bad_angle_input(tightening, key):
    data = _joint(**tightening)
    data["tightening"] = {k: v for k, v in data["tightening"].items() if v is not None}
    with pytest.raises(InputError) as err:
        joint_from_data(data)
    assert err.value.key == key


def test_angle_keys_belong_to_the_angle_method():
    data = _joint()
    data["tightening"]["method"] = "torque"
    with pytest.raises(InputError) as err:
        joint_from_data(data)
    assert err.value.key == "tightening.snug_torque"


def test_a_broken_bolt_is_said():
    r = analyse(joint_from_data(_joint(angle="400 deg")))
    assert r.angle["breaks"] is True
    assert any("tensile strength" in n for n in r.notes)
    assert np.isfinite(r.assembly_max)
