"""Fatigue, working stress, surface pressure, thread stripping and slip."""

from __future__ import annotations

import math

import numpy as np
import pytest
from hypothesis import given, settings
from hypothesis import strategies as st

from clampstack.components.bolt import thread_geometry
from clampstack.components.strength import (
    SHEAR_STRENGTH_RATIO,
    bearing_area,
    endurance_rolled_after_heat_treatment,
    endurance_rolled_before_heat_treatment,
    external_thread_shear_area,
    internal_thread_shear_area,
    minimum_engagement,
    slip_clamp_load,
    stress_amplitude,
    strip_force,
    surface_pressure,
    working_stress,
)

G = thread_geometry(10e-3, 1.5e-3)


def test_endurance_rolled_before_heat_treatment():
    # VDI 2230-1 (from memory): 0.85 (150/d + 45) MPa; M10: 0.85 x 60 = 51 MPa
    assert endurance_rolled_before_heat_treatment(10e-3) == pytest.approx(51e6)
    assert endurance_rolled_before_heat_treatment(20e-3) == pytest.approx(0.85 * 52.5e6)
    d = np.array([6e-3, 12e-3, 24e-3])
    assert np.all(np.diff(endurance_rolled_before_heat_treatment(d)) < 0)


def test_endurance_rolled_after_heat_treatment():
    # (2 - F_Sm/F_0.2min) sigma_ASV, valid for 0.3..1
    assert endurance_rolled_after_heat_treatment(10e-3, 0.7, 1.0) == pytest.approx(1.3 * 51e6)
    with pytest.raises(ValueError):
        endurance_rolled_after_heat_treatment(10e-3, 0.2, 1.0)


def test_stress_amplitude():
    assert stress_amplitude(3000.0, 1000.0, 58e-6) == pytest.approx(2000.0 / (2 * 58e-6))


def test_working_stress_with_half_torsion():
    F, MG = 40e3, 30.0
    s = working_stress(F, G.As, MG, G.d0)
    tau = 0.5 * MG / (math.pi * G.d0**3 / 16)
    assert s.sigma == pytest.approx(F / G.As)
    assert s.tau == pytest.approx(tau)
    assert s.sigma_red == pytest.approx(math.sqrt((F / G.As) ** 2 + 3 * tau**2))
    free = working_stress(F, G.As, MG, G.d0, k_tau=0.0)
    assert free.sigma_red == pytest.approx(F / G.As)


def test_surface_pressure():
    assert bearing_area(16e-3, 11e-3) == pytest.approx(math.pi / 4 * (16e-3**2 - 11e-3**2))
    assert surface_pressure(30e3, 16e-3, 11e-3) == pytest.approx(
        30e3 / (math.pi / 4 * (16e-3**2 - 11e-3**2))
    )
    with pytest.raises(ValueError):
        bearing_area(10e-3, 11e-3)


def test_basic_profile_shear_areas():
    # Basic profile: external tooth width 3/4 P at D1, internal tooth width 7/8 P at d.
    Le = 8e-3
    assert external_thread_shear_area(G.d, G.P, Le) == pytest.approx(
        0.75 * math.pi * G.D1 * Le, rel=1e-5
    )
    assert internal_thread_shear_area(G.d, G.P, Le) == pytest.approx(
        0.875 * math.pi * G.d * Le, rel=1e-5
    )


def test_tolerance_diameters_reduce_the_areas():
    Le = 8e-3
    base_ext = external_thread_shear_area(G.d, G.P, Le)
    tol_ext = external_thread_shear_area(G.d, G.P, Le, Kn_max=G.D1 + 0.3e-3, Es_min=G.d2 - 0.15e-3)
    assert tol_ext < base_ext
    base_int = internal_thread_shear_area(G.d, G.P, Le)
    tol_int = internal_thread_shear_area(G.d, G.P, Le, Ds_min=G.d - 0.25e-3, En_max=G.d2 + 0.2e-3)
    assert tol_int < base_int


def test_strip_force_and_minimum_engagement():
    Rm_bolt, Rm_alu = 800e6, 310e6
    ratio = SHEAR_STRENGTH_RATIO["aluminium"]
    Le = minimum_engagement(G.d, G.P, G.As, Rm_bolt, Rm_alu, ratio)
    hand = G.As * Rm_bolt / (0.875 * math.pi * G.d * ratio * Rm_alu)
    assert Le == pytest.approx(hand, rel=1e-5)
    strip = strip_force(internal_thread_shear_area(G.d, G.P, Le), Rm_alu, ratio)
    assert strip == pytest.approx(G.As * Rm_bolt, rel=1e-12)
    # aluminium needs far more engagement than a steel nut of the same strength class
    steel = minimum_engagement(G.d, G.P, G.As, Rm_bolt, 800e6, 0.6)
    assert Le > steel
    both = minimum_engagement(G.d, G.P, G.As, Rm_bolt, 800e6, 0.6, shear_ratio_bolt=0.6)
    assert both >= steel


@settings(max_examples=60, deadline=None)
@given(Rm_int=st.floats(150e6, 1200e6), factor=st.floats(0.5, 1.0))
def test_engagement_falls_with_nut_strength(Rm_int, factor):
    a = minimum_engagement(G.d, G.P, G.As, 1040e6, Rm_int, 0.6, factor)
    b = minimum_engagement(G.d, G.P, G.As, 1040e6, Rm_int * 1.1, 0.6, factor)
    assert b < a


def test_slip_clamp_load():
    # VDI 2230-1 R12: F_KQerf = F_Q/(q_F mu_T) + M_Y/(q_M r_a mu_T)
    assert slip_clamp_load(2e3, 0.15) == pytest.approx(2e3 / 0.15)
    assert slip_clamp_load(2e3, 0.15, q_F=2, safety=1.2) == pytest.approx(1.2 * 2e3 / 0.3)
    with_torque = slip_clamp_load(2e3, 0.15, M_Y=30.0, r_a=0.05)
    assert with_torque == pytest.approx(2e3 / 0.15 + 30.0 / (0.05 * 0.15))
    with pytest.raises(ValueError):
        slip_clamp_load(2e3, 0.15, M_Y=30.0)
    with pytest.raises(ValueError):
        slip_clamp_load(2e3, 0.0)
