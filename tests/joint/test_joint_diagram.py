"""Joint-diagram relations: closed form (VDI 2230-1:2015, section 5.3) against the network.

Closed forms (VDI 2230-1, 5.3.1-5.3.2, as summarised in ../shared/REFERENCE.md):
Phi_K = delta_P/(delta_S + delta_P), Phi_n = n Phi_K; F_SA = Phi_n F_A;
F_PA = (1 - Phi_n) F_A; F_S = F_V + F_SA; F_K = F_V - F_PA;
F_A,sep = F_V/(1 - Phi_n); beyond separation the bolt carries F_A.
Embedding: F_Z = f_Z/(delta_S + delta_P) (VDI 2230-1, 5.4.2).
Thermal, constant moduli: dF = -l_K (alpha_S - alpha_P) dT/(delta_S + delta_P)
(VDI 2230-1, 5.4.2.3, follows from compatibility).
"""

from __future__ import annotations

import math

import pytest
from hypothesis import given, settings
from hypothesis import strategies as st

from clampstack.inputs.joint import joint_from_data
from clampstack.joint.analysis import analyse
from clampstack.joint.prepare import joint_network, solve_service

REL = 1e-9


def base(**over) -> dict:
    data = {
        "title": "test joint",
        "bolt": {"thread": "M12", "grade": "10.9", "length": "60 mm", "head": "hex"},
        "nut": {},
        "clamped": [
            {"material": "steel", "thickness": "18 mm"},
            {"material": "steel", "thickness": "22 mm"},
        ],
        "tightening": {"torque": "90 N*m", "thread_friction": "0.10..0.14"},
        "service": {"axial_load": "0..15 kN", "load_height": 0.5},
    }
    for k, v in over.items():
        data[k] = v
    return data


@pytest.mark.parametrize("n", [0.25, 0.5, 0.7, 1.0])
@pytest.mark.parametrize("FA", [0.0, 3e3, 12e3, -5e3])
def test_network_reproduces_joint_diagram_while_clamped(n, FA):
    dS, dP, FV = 2.4e-9, 0.8e-9, 30e3
    jn = joint_network(dS, dP, n, -FV * (dS + dP), 0.0)
    bolt, clamp = solve_service(jn, FA)
    phi = n * dP / (dS + dP)
    assert bolt == pytest.approx(FV + phi * FA, rel=REL)
    assert clamp == pytest.approx(FV - (1 - phi) * FA, rel=REL)
    assert bolt - clamp == pytest.approx(FA, rel=REL, abs=1e-9 * FV)


@pytest.mark.parametrize("n", [0.3, 1.0])
def test_separation_load_and_bolt_beyond_separation(n):
    dS, dP, FV = 2.4e-9, 0.8e-9, 30e3
    phi = n * dP / (dS + dP)
    F_sep = FV / (1 - phi)
    jn = joint_network(dS, dP, n, -FV * (dS + dP), 0.0)
    bolt, clamp = solve_service(jn, F_sep * (1 - 1e-9))
    assert clamp == pytest.approx(0.0, abs=1e-6 * FV)
    for factor in (1.2, 2.0, 5.0):
        bolt, clamp = solve_service(jn, factor * F_sep)
        assert clamp == 0.0  # the interface has opened: exactly zero
        assert bolt == pytest.approx(factor * F_sep, rel=REL)  # the bolt carries all of F_A


def test_analysis_states_against_closed_form():
    r = analyse(joint_from_data(base()))
    dS, dP = r.springs.delta_S, r.springs.delta_P
    phi = 0.5 * dP / (dS + dP)
    assert r.load_factor == pytest.approx(phi, rel=1e-12)
    assert r.embedding_loss == pytest.approx(r.embedding_amount / (dS + dP), rel=1e-12)
    st = {s.key: s for s in r.states}
    FV = r.assembly_min - r.embedding_loss
    assert st["embedded"].bolt_min == pytest.approx(FV, rel=REL)
    assert st["service_max"].bolt_min == pytest.approx(FV + phi * 15e3, rel=REL)
    assert st["service_max"].clamp_min == pytest.approx(FV - (1 - phi) * 15e3, rel=REL)
    assert r.separation_load == pytest.approx(FV / (1 - phi), rel=REL)
    assert r.residual_clamp_min == pytest.approx(FV - (1 - phi) * 15e3, rel=REL)
    # maximum branch: no embedding (conservative for the bolt)
    assert st["service_max"].bolt_max == pytest.approx(r.assembly_max + phi * 15e3, rel=REL)
    # the checks R8-R10 take the permissible preload (VDI 2230-1:2015 R8: F_S,max = F_M,zul +
    # Phi F_A,max at room temperature); the actual F_M,max is shown beside it
    assert r.check_basis == "permissible"
    assert r.bolt_load_max == pytest.approx(r.permissible_preload + phi * 15e3, rel=REL)
    assert r.bolt_load_max_actual == pytest.approx(r.assembly_max + phi * 15e3, rel=REL)


def test_thermal_change_constant_moduli_closed_form():
    # Bolt of expansion 11e-6/K, aluminium-like plates 23e-6/K with constant moduli,
    # warmed uniformly by 80 K: dF = -l_K (alpha_S - alpha_P) dT / (delta_S + delta_P).
    data = base(
        bolt={
            "thread": "M12",
            "grade": "10.9",
            "length": "60 mm",
            "modulus": "205 GPa",
            "expansion": "11e-6 / K",
        },
        clamped=[{"modulus": "70 GPa", "expansion": "23e-6 / K", "thickness": "40 mm"}],
        service={
            "axial_load": "0 kN",
            "temperature": "100 degC",
            "assembly_temperature": "20 degC",
        },
    )
    r = analyse(joint_from_data(data))
    dS, dP = r.springs.delta_S, r.springs.delta_P
    assert r.springs_service.delta_S == pytest.approx(dS, rel=1e-12)  # constant moduli
    expected = -0.040 * (11e-6 - 23e-6) * 80.0 / (dS + dP)
    assert r.thermal_change == pytest.approx(expected, rel=1e-9)
    assert r.thermal_change > 0  # aluminium grows more: preload rises
    assert r.thermal_change_max == pytest.approx(expected, rel=1e-9)


def test_steel_in_steel_changes_preload_only_through_modulus():
    # Same catalog steel for bolt and plates at a uniform temperature: the free thermal
    # elongations cancel and only the modulus change acts: F_T = F (dS + dP)/(dS_T + dP_T)
    # (VDI 2230-1, 5.4.2.3 with alpha_S = alpha_P).
    data = base(
        bolt={"thread": "M12", "grade": "10.9", "length": "60 mm", "material": "steel"},
        nut={"material": "steel"},
        service={"axial_load": "0 kN", "temperature": "300 degC"},
    )
    r = analyse(joint_from_data(data))
    a, s = r.springs, r.springs_service
    F = r.assembly_min - r.embedding_loss
    expected = F * (a.delta_S + a.delta_P) / (s.delta_S + s.delta_P) - F
    assert r.thermal_change == pytest.approx(expected, rel=1e-9)
    assert r.thermal_change < 0  # steel softens when hot


def test_torque_preload_relation_iso16047():
    r = analyse(joint_from_data(base()))
    thr = r.spec.bolt.thread
    dh = r.spec.layers[0].hole
    DKm = 0.5 * (r.spec.nut.bearing_diameter + dh)

    def k(mu):
        return 0.16 * thr.P + 0.58 * thr.d2 * mu + 0.5 * mu * DKm

    assert r.torque == pytest.approx((90.0, 90 * 0.94, 90 * 1.06), rel=1e-12)
    assert r.assembly_max == pytest.approx(90 * 1.06 / k(0.10), rel=1e-12)
    assert r.assembly_min == pytest.approx(90 * 0.94 / k(0.14), rel=1e-12)


@settings(max_examples=40, deadline=None)
@given(
    n=st.floats(0.05, 1.0),
    FA=st.floats(-20e3, 40e3),
    torque=st.floats(40, 120),
    mu=st.floats(0.06, 0.2),
)
def test_invariants(n, FA, torque, mu):
    data = base(
        tightening={"torque": f"{torque} N*m", "thread_friction": mu},
        service={"axial_load": f"{FA} N", "load_height": n},
    )
    r = analyse(joint_from_data(data))
    assert 0.0 <= r.load_factor <= 1.0
    st_ = {s.key: s for s in r.states}["service_max"]
    if st_.clamp_min > 0:
        # while clamped, bolt load minus clamp load equals the service load
        assert st_.bolt_min - st_.clamp_min == pytest.approx(FA, abs=1e-6 * max(abs(FA), 1e3))
    else:
        assert FA >= r.separation_load * (1 - 1e-9)
        assert st_.bolt_min == pytest.approx(FA, rel=1e-9)


@settings(max_examples=30, deadline=None)
@given(
    t1=st.floats(20, 100), dt=st.floats(1, 50), mu1=st.floats(0.06, 0.2), dmu=st.floats(0.01, 0.1)
)
def test_preload_rises_with_torque_and_falls_with_friction(t1, dt, mu1, dmu):
    def fm(torque, mu):
        d = base(tightening={"torque": f"{torque} N*m", "thread_friction": mu, "scatter": 1.5})
        return analyse(joint_from_data(d)).assembly_max

    assert fm(t1 + dt, mu1) > fm(t1, mu1)
    assert fm(t1, mu1 + dmu) < fm(t1, mu1)


def test_load_factor_bounds_and_finite_separation():
    r = analyse(joint_from_data(base()))
    assert 0 < r.load_factor < r.springs.load_factor_K < 1
    assert math.isfinite(r.separation_load)


def test_required_torque_gives_exactly_the_required_preload():
    r = analyse(joint_from_data(base()))
    data = base(tightening={"torque": f"{r.torque_required} N*m", "thread_friction": "0.10..0.14"})
    r2 = analyse(joint_from_data(data))
    assert r2.assembly_min == pytest.approx(r.required_assembly_min, rel=1e-9)


def test_vdi_thermal_relation_with_temperature_dependent_moduli():
    # VDI 2230-1, 5.4.2.3: F_V,T = [F_V (dS + dP) - (l_K a_S dT_S - sum l_i a_i dT_i)]
    # / (dS,T + dP,T) with catalog moduli at temperature and mean expansion coefficients,
    # evaluated by hand from the catalog and the springs, against the network result.
    from clampstack.catalog import material

    data = base(
        bolt={"thread": "M12", "grade": "10.9", "length": "70 mm", "material": "steel-alloy"},
        nut={"material": "steel-alloy"},
        clamped=[
            {"material": "aluminium-6082-T6", "thickness": "20 mm"},
            {"material": "stainless", "thickness": "25 mm", "temperature": "140 degC"},
        ],
        service={"axial_load": "0 kN", "temperature": "110 degC"},
    )
    r = analyse(joint_from_data(data))
    T0 = 293.15
    Ts, Tst = 383.15, 413.15
    bolt = material("steel-alloy")
    al, ss = material("aluminium-6082-T6"), material("stainless")
    lK = 0.045
    free = (
        lK * bolt.expansion(Ts) * (Ts - T0)
        - 0.020 * al.expansion(Ts) * (Ts - T0)
        - 0.025 * ss.expansion(Tst) * (Tst - T0)
    )
    a, s = r.springs, r.springs_service
    FV = r.assembly_min - r.embedding_loss
    expected = (FV * (a.delta_S + a.delta_P) - free) / (s.delta_S + s.delta_P) - FV
    assert r.thermal_change == pytest.approx(expected, rel=1e-9)
