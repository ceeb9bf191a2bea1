"""Which assembly preload the checks R8-R10 use (VDI 2230-1:2015, 5.5.1-5.5.5), by hand.

VDI 2230-1:2015 checks the working stress (R8), the mean load of the fatigue check
(R9) and the surface pressure (R10) with the permissible assembly preload F_M,zul,
whatever torque is specified (relations from memory):

* R7: F_M,zul = A_0 nu R_p0.2min / sqrt(1 + 3 [3/2 d_2/d_0 (P/(pi d_2) + 1.155 mu_G,min)]^2)
* R8: F_S,max = F_M,zul + Phi_n F_A,max (- Delta F'_Vth, only a gain);
  sigma_red,B = sqrt(sigma_z^2 + 3 (k_tau tau)^2), sigma_z = F_S,max / A_0,
  tau = M_G / W_p, M_G = F_M,zul d_2/2 (P/(pi d_2) + 1.155 mu_G,min), W_p = pi d_0^3/16,
  k_tau = 0.5
* R9, rolled after heat treatment: sigma_ASG = (2 - F_Sm/F_0.2min) sigma_ASV with
  F_Sm = F_M,zul + Phi_n (F_A,max + F_A,min)/2
* R10: p_max = F_S,max / A_p,min (the larger of assembly and service)

Thread data M10 (ISO 724 / ISO 898-1 Table 4): d_2 = 9.026 mm, d_3 = 8.160 mm,
A_s = 58.0 mm^2, P = 1.5 mm; grade 8.8, d <= 16: R_p0.2min = 640 MPa (ISO 898-1).
"""

from __future__ import annotations

import math

import pytest

from clampstack.components import endurance_rolled_before_heat_treatment
from clampstack.inputs.joint import joint_from_data
from clampstack.joint.analysis import analyse

d2, d3, As, P, Rp = 9.026e-3, 8.160e-3, 58.0e-6, 1.5e-3, 640e6
d0 = 0.5 * (d2 + d3)
MU = 0.12


def joint(**requirements) -> dict:
    return {
        "title": "check basis",
        "bolt": {"thread": "M10", "grade": "8.8", "length": "30 mm", "rolled": "after"},
        "nut": {},
        "clamped": [
            {"material": "steel", "thickness": "10 mm"},
            {"material": "steel", "thickness": "10 mm"},
        ],
        "tightening": {"torque": "38 N*m", "thread_friction": MU, "head_friction": MU},
        "service": {"axial_load": "2..8 kN", "load_height": 0.5},
        "requirements": requirements,
    }


def by_name(r):
    return {c.name: c for c in r.checks}


def test_permissible_basis_by_hand():
    r = analyse(joint_from_data(joint()))
    k = 1.5 * d2 / d0 * (P / (math.pi * d2) + 1.155 * MU)
    FMzul = As * 0.9 * Rp / math.sqrt(1 + 3 * k**2)
    assert r.permissible_preload == pytest.approx(FMzul, rel=2e-3)
    assert r.assembly_max < 0.9 * FMzul  # the torque is well below the limit
    phi = r.load_factor  # Phi_n from the network (checked in test_vdi2230.py)
    FSmax = FMzul + phi * 8e3
    MG = FMzul * d2 / 2 * (P / (math.pi * d2) + 1.155 * MU)
    sred = math.hypot(FSmax / As, math.sqrt(3) * 0.5 * MG / (math.pi * d0**3 / 16))
    c = by_name(r)
    assert r.check_basis == "permissible"
    assert r.check_preload == pytest.approx(r.permissible_preload, rel=1e-12)
    assert r.bolt_load_max == pytest.approx(FSmax, rel=2e-3)
    assert c["working_stress"].value == pytest.approx(sred / 1e6, rel=3e-3)
    # R9: mean load with F_M,zul, rolled after heat treatment
    FSm = FMzul + phi * 5e3
    sASV = float(endurance_rolled_before_heat_treatment(10e-3))
    sASG = (2 - FSm / (As * Rp)) * sASV
    assert c["fatigue"].limit == pytest.approx(sASG / 1.2 / 1e6, rel=3e-3)
    # R10: the same F_S,max over the bearing area; the actual-preload figure beside it
    pG = c["surface_pressure_head"]
    info = pG.information
    assert info["basis"] == "actual"
    assert info["preload_N"] == pytest.approx(r.assembly_max, rel=1e-12)
    ratio = (r.assembly_max + phi * 8e3) / FSmax
    assert info["value"] == pytest.approx(pG.value * ratio, rel=3e-3)
    assert "information" in pG.detail


def test_actual_basis_uses_the_torque_and_shows_the_permissible_beside():
    default = analyse(joint_from_data(joint()))
    actual = analyse(joint_from_data(joint(check_basis="actual")))
    assert actual.check_basis == "actual"
    assert actual.check_preload == pytest.approx(actual.assembly_max, rel=1e-12)
    a, d = by_name(actual), by_name(default)
    for name in ("working_stress", "fatigue", "surface_pressure_head", "surface_pressure_nut"):
        # the two routes are the same two figures, swapped
        assert a[name].value == pytest.approx(d[name].information["value"], rel=1e-12)
        assert d[name].value == pytest.approx(a[name].information["value"], rel=1e-12)
        assert a[name].limit == pytest.approx(d[name].information["limit"], rel=1e-12)
    # the actual preload is the lower one here: less stress, a higher endurance (R9 mean)
    assert a["working_stress"].value < d["working_stress"].value
    assert a["fatigue"].limit > d["fatigue"].limit
    assert actual.bolt_load_max == pytest.approx(default.bolt_load_max_actual, rel=1e-12)
    assert actual.to_dict()["preload"]["check_basis"] == "actual"


def test_a_thermal_loss_of_preload_is_not_credited_in_r8():
    # titanium plates expand less than the steel bolt: the preload falls when hot; R8 takes
    # F_S,max = F_M,zul + Phi_n F_A,max without the loss (VDI 2230-1 R8, from memory)
    data = joint()
    data["clamped"] = [
        {"material": "titanium-6Al-4V", "thickness": "10 mm"},
        {"material": "titanium-6Al-4V", "thickness": "10 mm"},
    ]
    data["service"]["temperature"] = "90 degC"
    r = analyse(joint_from_data(data))
    assert r.thermal_change_max < 0
    assert r.bolt_load_max == pytest.approx(
        r.permissible_preload + r.load_factor_service * 8e3, rel=1e-9
    )


def test_a_thermal_gain_of_preload_is_added_in_r8():
    # aluminium plates expand more: the gain adds to F_S,max (R8's -Delta F'_Vth < 0)
    data = joint()
    data["clamped"] = [
        {"material": "aluminium-6082-T6", "thickness": "10 mm"},
        {"material": "aluminium-6082-T6", "thickness": "10 mm"},
    ]
    data["service"]["temperature"] = "90 degC"
    r = analyse(joint_from_data(data))
    assert r.thermal_change_max > 0
    s = r.springs
    ss = r.springs_service
    # the gain of F_M,zul: the same misfit through the service resiliences, plus the thermal
    # share, is the gain of F_M,max scaled by the ratio of the preloads plus the
    # stiffness-only part (linear in F_M)
    gain_max = r.thermal_change_max
    stiff = (s.delta_S + s.delta_P) / (ss.delta_S + ss.delta_P)
    thermal_only = gain_max - r.assembly_max * (stiff - 1)
    gain_zul = r.permissible_preload * (stiff - 1) + thermal_only
    assert r.bolt_load_max == pytest.approx(
        r.permissible_preload + gain_zul + r.load_factor_service * 8e3, rel=1e-9
    )
