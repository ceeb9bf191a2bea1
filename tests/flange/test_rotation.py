"""Flange ring rotation (ring theory) and the heat cycle with gasket creep relaxation."""

from __future__ import annotations

import copy
import dataclasses
import json
import math
from pathlib import Path

import numpy as np
import pytest
from test_flange import data  # the same test flange (tests/flange/test_flange.py)

from clampstack.flange.analysis import (
    analyse_flange,
    build_ring,
    ring_rotation_stiffness,
    simulate_passes,
)
from clampstack.flange.service import heat_cycle, service_conditions
from clampstack.inputs.flange import flange_from_data, read_flange_file

ROOT = Path(__file__).resolve().parents[2]


def rotating(**over) -> dict:
    d = data(**over)
    d["flange"] = dict(d["flange"], rotation=True, thickness="36 mm")
    return d


def test_ring_rotation_stiffness_worked_by_hand():
    # Ring 90 .. 200 mm, t = 36 mm, 8 holes of 17.5 mm (M16, ISO 273 medium) on a 160 mm
    # circle; ring theory K = E t^3/12 (2 pi ln(b/a) - N pi d_h^2 / (4 R_bc^2)):
    # ln(100/45) = 0.798508, 2 pi x = 5.017171; 8 pi 0.0175^2 / (4 0.08^2) = 0.300660;
    # t^3/12 = 3.888e-6 m^3  ->  K / E = 3.888e-6 x 4.716511 = 1.833780e-5 m^3 (by hand)
    spec = flange_from_data(rotating())
    assert spec.hole == pytest.approx(0.0175)
    assert ring_rotation_stiffness(spec, 1.0) == pytest.approx(1.833780e-5, rel=2e-6)


def test_ring_formula_is_app2_rigidity_and_the_thin_ring_limit():
    # ASME VIII-1 App. 2-14 (loose flange): J = 109.4 M_o/(E t^3 ln K K_L), i.e. the
    # rotation in degrees is 109.4 M/(E t^3 ln K) (from memory): ring theory without holes
    spec = flange_from_data(rotating())
    no_holes = dataclasses.replace(spec, hole=1e-12)
    K = ring_rotation_stiffness(no_holes, 1.0)
    t, lnK = spec.thickness, math.log(spec.ring_outer_diameter / spec.ring_inner_diameter)
    assert math.degrees(1.0 / K) == pytest.approx(109.4 / (t**3 * lnK), rel=5e-4)
    # thin ring: theta = M_t R^2 / (E I) with M_t = M / (2 pi R), I = w t^3 / 12
    # (Timoshenko, Strength of Materials II; Roark; from memory)
    R, w = 0.1, 0.002
    thin = dataclasses.replace(
        no_holes, ring_inner_diameter=2 * (R - w / 2), ring_outer_diameter=2 * (R + w / 2)
    )
    I_ring = w * t**3 / 12
    assert 1.0 / ring_rotation_stiffness(thin, 1.0) == pytest.approx(
        R / (2 * math.pi * I_ring), rel=1e-4
    )


def test_network_rotation_meets_the_moment_balance():
    # every bolt at its preload, no pressure: the links carry the bolt loads, so the ring
    # turns by theta = h_G sum F / K_theta (compatibility and moment balance)
    spec = flange_from_data(rotating())
    ring = build_ring(spec)
    n = ring.n
    simulate_passes(ring, np.full(n, 50e3), (0.5, 1.0), [list(range(n))] * 2)
    _, bolts, gasket, sol = ring.solve(np.zeros(n))
    theta = ring.rotations(sol)
    K = ring.rotation_stiffness
    assert K == pytest.approx(ring_rotation_stiffness(spec, spec.material.E(spec.T_assembly)))
    np.testing.assert_allclose(theta, ring.lever * bolts.sum() / K, rtol=1e-9)
    # and the gasket carries the bolts
    assert gasket.sum() == pytest.approx(bolts.sum(), rel=1e-9)


def test_rotation_off_gives_the_axial_ring_of_the_first_round():
    # flange --json of the four flange examples recorded with the axial ring model (the
    # commit before rotation, 846bf9c); the rotating model switched off, and the gasket's
    # new thermal expansion set to zero, gives the same numbers
    ref = json.loads((Path(__file__).parent / "data" / "axial_ring_reference.json").read_text())
    thick = {  # the examples' rings before they were thickened for rotation
        "pump-outlet-flange-8-bolts": 0.020,
        "cooling-water-flange-nut-factor": 0.022,
        "ring-flange-24-bolts-moment": 0.036,
        "steam-header-flange-tensioned": 0.030,
    }
    for name, r in ref.items():
        _, spec = read_flange_file(str(ROOT / "examples" / f"{name}.toml"))
        spec = dataclasses.replace(
            spec,
            rotation=False,
            thickness=thick[name],
            gasket=dataclasses.replace(spec.gasket, expansion=0.0),
            bolt_length=None,
        )
        d = analyse_flange(spec).to_dict()
        for got, want in zip(d["bolts"], r["bolts"], strict=True):
            for k, v in want.items():
                if isinstance(v, float):
                    assert got[k] == pytest.approx(v, rel=1e-9, abs=1e-6), (name, k)
        for c in r["checks"]:
            (cc,) = [x for x in d["checks"] if x["name"] == c["name"]]
            assert cc["value"] == pytest.approx(c["value"], rel=1e-9), (name, c["name"])
        assert d["target_preload_N"] == pytest.approx(r["target_preload_N"], rel=1e-9)


def test_pressure_effect_balances_and_rotation_unloads_the_gasket_more():
    # the pressure's effect: bolt increase + gasket decrease = working load (equilibrium);
    # with rotation the end force at the bore levers the ring about the gasket, so the
    # gasket loses more and the bolts gain less than in the axial model
    out = {}
    for rot in (False, True):
        d = rotating()
        d["flange"]["rotation"] = rot
        pe = analyse_flange(flange_from_data(d), compensate=False).pressure_effect
        assert pe["bolt_load_increase_N"] + pe["gasket_load_decrease_N"] == pytest.approx(
            pe["working_load_N"], rel=1e-7
        )
        out[rot] = pe
    assert out[True]["load_factor"] < out[False]["load_factor"]
    assert out[True]["gasket_load_decrease_N"] > out[False]["gasket_load_decrease_N"]


def test_heat_cycle_relaxes_by_the_factor_and_keeps_the_loss():
    d = rotating(loading={"pressure": "40 bar", "temperature": "300 degC"})
    spec = flange_from_data(d)
    P = spec.gasket.relaxation(spec.T_gasket_service, spec.T_assembly)
    assert P == pytest.approx(0.90)  # spiral-wound at 300 degC, the catalog's table
    r = analyse_flange(spec, compensate=False)
    c = r.cycle
    np.testing.assert_allclose(c["hot"].gasket / c["start_up"].gasket, P, rtol=1e-9)
    # creep is permanent: cooled back under pressure the gasket keeps less than the same
    # cold, pressurised state without the heat cycle
    ring = build_ring(spec)
    simulate_passes(ring, np.full(ring.n, r.target), spec.passes, r.orders)
    cold_only = copy.copy(ring)
    again = heat_cycle(cold_only, dataclasses.replace(service_conditions(spec)))
    np.testing.assert_allclose(again["hot"].gasket, c["hot"].gasket, rtol=1e-9)
    no_heat = dataclasses.replace(spec, T_flange=spec.T_assembly, T_bolt=spec.T_assembly)
    plain = analyse_flange(no_heat, compensate=False).cycle
    assert np.all(c["cooled"].gasket < plain["cooled"].gasket)
    assert plain.relaxation == 1.0
    np.testing.assert_allclose(plain["cooled"].gasket, plain["start_up"].gasket, rtol=1e-9)
    (chk,) = [x for x in r.checks if x.name == "gasket_heat_cycle"]
    assert chk.value <= min(c["hot"].gasket.min(), c["cooled"].gasket.min()) / 1e3 + 1e-9


def test_a_given_relaxation_factor_and_bad_values():
    d = rotating(loading={"pressure": "40 bar", "temperature": "150 degC"})
    d["gasket"] = dict(d["gasket"], relaxation=0.7)
    r = analyse_flange(flange_from_data(d), compensate=False)
    assert r.cycle.relaxation == 0.7 and "given" in r.cycle.relaxation_basis
    from clampstack.errors import InputError

    d["gasket"]["relaxation"] = 1.2
    with pytest.raises(InputError) as e:
        flange_from_data(d)
    assert e.value.key == "gasket.relaxation"


def test_the_gasket_table_is_reused_while_the_history_stands():
    # consistency check: a second solve with the same unloading history and held bolts
    # uses the same table object and gives the same answer
    spec = flange_from_data(rotating())
    ring = build_ring(spec)
    n = ring.n
    simulate_passes(ring, np.full(n, 50e3), (0.5, 1.0), [list(range(n))] * 2)
    first = ring.solve(np.zeros(n))
    table = ring._table_cache[1]
    second = ring.solve(np.zeros(n))
    assert ring._table_cache[1] is table
    np.testing.assert_allclose(second[1], first[1], rtol=1e-12)
