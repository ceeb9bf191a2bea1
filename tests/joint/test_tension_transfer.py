"""Hydraulic tensioning: the nut keeps the load-transfer share of the applied tension.

LTF = residual / applied = 1 / (1 + d / l_K) (tensioner practice, from memory), unless the
file gives the tool maker's figure.  Without a given preload the tool's largest tension
takes the bolt to F_M,zul = nu R_p0.2 A_s (no torsion; VDI 2230-1 R7 for a tensioner).
M20 10.9 (ISO 898-1: R_p0.2 = 940 MPa; A_s = 244.8 mm^2 ISO 898-1 Table 4), l_K = 80 mm.
"""

from __future__ import annotations

import pytest

from clampstack.errors import InputError
from clampstack.inputs.joint import joint_from_data
from clampstack.joint.analysis import analyse


def _joint(**tightening) -> dict:
    return {
        "title": "tensioned",
        "bolt": {"thread": "M20", "grade": "10.9", "length": "120 mm"},
        "nut": {},
        "clamped": [{"material": "steel", "thickness": "80 mm"}],
        "tightening": {"method": "tension", **tightening},
        "service": {"axial_load": "30 kN"},
    }


def test_load_transfer_by_hand():
    r = analyse(joint_from_data(_joint()))
    ltf = 1 / (1 + 20 / 80)
    applied_max = 0.9 * 940e6 * 244.8e-6
    assert r.tension["load_transfer_factor"] == pytest.approx(ltf)
    assert r.tension["applied_tension_max_N"] == pytest.approx(applied_max, rel=2e-3)
    assert r.assembly_max == pytest.approx(ltf * applied_max, rel=2e-3)
    c = {x.name: x for x in r.checks}["assembly_preload"]
    assert c.value == pytest.approx(applied_max / 1e3, rel=2e-3) and "applied tension" in c.title
    j = r.to_dict()["tightening"]
    assert j["load_transfer_factor"] == pytest.approx(ltf) and "applied_tension_min_N" in j


def test_a_given_factor_and_preload():
    r = analyse(joint_from_data(_joint(load_transfer_factor=0.9, preload="150 kN")))
    assert r.tension["load_transfer_basis"] == "given"
    mean_residual = 0.5 * (r.assembly_min + r.assembly_max)
    assert mean_residual == pytest.approx(150e3)
    assert r.tension["applied_tension_max_N"] == pytest.approx(r.assembly_max / 0.9)


@pytest.mark.parametrize(
    "tightening",
    [{"load_transfer_factor": 0.2}, {"method": "torque", "load_transfer_factor": 0.8}],
)
def test_bad_load_transfer_factors(tightening):
    with pytest.raises(InputError) as err:
        joint_from_data(_joint(**tightening))
    assert err.value.key == "tightening.load_transfer_factor"
