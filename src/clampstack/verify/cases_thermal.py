"""Thermal: restrained bars, a bolt in a sleeve, the VDI 2230-1 thermal preload change and
the permanent loss of an elastic-perfectly-plastic bolt.

Closed forms from the compatibility method for statically indeterminate axial
members with thermal strain (Gere & Goodno, *Mechanics of Materials*, ch. 2) and
VDI 2230-1:2015, 5.4.2.3.
"""

from __future__ import annotations

from functools import cache
from typing import Any

from ..network import Network
from .registry import Outcome, register

G = "thermal"
GERE = "Gere & Goodno, Mechanics of Materials, ch. 2, thermal effects"


@register("heated bar between rigid walls, stress", G, kind="hand")
def heated_bar() -> Outcome:
    # sigma = -E alpha dT = -205 000 MPa x 11.5e-6 /K x 60 K = -141.45 MPa (any length)
    E, alpha, dT, A, L = 205e9, 11.5e-6, 60.0, 3.0e-4, 0.45
    net = Network.from_arrays(2, [0], [1], [E * A / L], [alpha * dT * L], fixed=[0, 1])
    s = net.solve()
    return Outcome(s.force[0] / A / 1e6, -141.45, 1e-9, f"{GERE}, hand calculation", "MPa")


@register("heated steel/aluminium bar between rigid walls, force", G, kind="hand")
def heated_two_materials() -> Outcome:
    # steel 300 mm, 400 mm^2, 205 GPa, 11.5e-6 /K; aluminium 200 mm, 900 mm^2, 70 GPa,
    # 23e-6 /K; both warmed by 45 K:
    # free elongation (11.5e-6 x 300 + 23e-6 x 200) x 45 = 0.36225 mm
    # flexibility 300/(205 000 x 400) + 200/(70 000 x 900) = 6.833140e-6 mm/N
    # N = -0.36225 / 6.833140e-6 = -53 013.7 N
    E1, A1, L1, a1 = 205e9, 4e-4, 0.3, 11.5e-6
    E2, A2, L2, a2 = 70e9, 9e-4, 0.2, 23e-6
    dT = 45.0
    net = Network.from_arrays(
        3,
        [0, 1],
        [1, 2],
        [E1 * A1 / L1, E2 * A2 / L2],
        [a1 * dT * L1, a2 * dT * L2],
        fixed=[0, 2],
    )
    return Outcome(net.solve().force[0] / 1e3, -53.0137, 2e-6, f"{GERE}, hand calculation", "kN")


@register("steel rod in a warmer-growing sleeve, rod force", G, kind="hand")
def rod_in_sleeve() -> Outcome:
    # rod k_r = 300 kN/mm and sleeve k_s = 900 kN/mm between the same two nodes, L = 100 mm,
    # the sleeve expands 12e-6 /K more, dT = 80 K: mismatch 12e-6 x 80 x 100 = 0.096 mm
    # N_rod = 0.096 x 300 x 900/(300 + 900) = 0.096 x 225 = 21.6 kN (tension)
    kr, ks = 3.0e8, 9.0e8
    net = Network.from_arrays(2, [0, 0], [1, 1], [kr, ks], [0.0, 0.096e-3], fixed=[0])
    return Outcome(net.solve().force[0] / 1e3, 21.6, 1e-9, f"{GERE}, hand calculation", "kN")


def _joint(**over: Any) -> dict[str, Any]:
    data: dict[str, Any] = {
        "title": "thermal verification joint",
        "bolt": {"thread": "M12", "grade": "10.9", "length": "60 mm", "head": "hex"},
        "nut": {},
        "clamped": [
            {"material": "steel", "thickness": "18 mm"},
            {"material": "steel", "thickness": "22 mm"},
        ],
        "tightening": {"torque": "90 N*m", "thread_friction": "0.10..0.14"},
        "service": {"axial_load": "0 kN", "load_height": 0.5},
    }
    data.update(over)
    return data


def _analyse(data: dict[str, Any]):
    from ..inputs.joint import joint_from_data
    from ..joint import analyse

    return analyse(joint_from_data(data))


@cache
def _constant_moduli():
    return _analyse(
        _joint(
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
    )


@register("thermal preload change, constant moduli", G, kind="consistency")
def thermal_constant() -> Outcome:
    # VDI 2230-1 5.4.2.3 with constant moduli: dF = -l_K (alpha_S - alpha_P) dT/(delta_S + delta_P)
    # l_K = 40 mm, alpha_S = 11e-6, alpha_P = 23e-6 /K, dT = 80 K (a gain: the plates grow more)
    r = _constant_moduli()
    dS, dP = r.springs.delta_S, r.springs.delta_P
    expected = -0.040 * (11e-6 - 23e-6) * 80.0 / (dS + dP)
    return Outcome(
        r.thermal_change / 1e3, expected / 1e3, 1e-9, "VDI 2230-1:2015 5.4.2.3, closed form", "kN"
    )


@register("thermal preload change, steel in steel at 300 degC (moduli only)", G, kind="consistency")
def thermal_modulus_only() -> Outcome:
    # Same catalog steel for bolt, nut and plates at one temperature: the free thermal
    # elongations cancel; F_T = F_V (delta_S + delta_P)/(delta_S,T + delta_P,T)
    # (VDI 2230-1 5.4.2.3 with alpha_S = alpha_P)
    r = _analyse(
        _joint(
            bolt={"thread": "M12", "grade": "10.9", "length": "60 mm", "material": "steel"},
            nut={"material": "steel"},
            service={"axial_load": "0 kN", "temperature": "300 degC"},
        )
    )
    a, s = r.springs, r.springs_service
    F = r.assembly_min - r.embedding_loss
    expected = F * (a.delta_S + a.delta_P) / (s.delta_S + s.delta_P) - F
    return Outcome(
        r.thermal_change / 1e3, expected / 1e3, 1e-9, "VDI 2230-1:2015 5.4.2.3, closed form", "kN"
    )


def _epp_joint(T_service: str) -> dict[str, Any]:
    # A2-70 (no elevated-temperature data: constant yield 450 MPa), constant moduli and
    # expansion, n = 1, no embedding, tensioned to exactly 22 kN
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
        "tightening": {"method": "tension", "preload": "22 kN", "scatter": 1.0},
        "service": {"load_height": 1.0, "temperature": T_service},
    }


@register("permanent loss of a bolt yielding in a heat cycle", G, kind="consistency")
def epp_loss() -> Outcome:
    # Elastic-perfectly-plastic bar in parallel with an elastic member (Gere & Goodno ch. 2,
    # elastoplastic analysis): heating adds dF_th; above the yield force Y the bolt
    # stretches plastically; on cooling the force falls by dF_th, so the loss is
    # F_0 + dF_th - Y with Y = 450 MPa x A_s (ISO 3506-1 A2-70, M10)
    r = _analyse(_epp_joint("150 degC"))
    Y = 450e6 * r.A0
    dF = r.thermal_change_max
    return Outcome(
        r.cycle.permanent_loss / 1e3,
        (22e3 + dF - Y) / 1e3,
        1e-9,
        "Gere & Goodno ch. 2, elastoplastic bar, closed form",
        "kN",
    )


@register("elastic heat cycle returns the preload", G, kind="consistency")
def epp_elastic() -> Outcome:
    # the same joint to 60 degC stays elastic: the preload after the cycle equals the
    # preload before it (compatibility; Gere & Goodno ch. 2)
    c = _analyse(_epp_joint("60 degC")).cycle
    return Outcome(
        c.preload_after[1] / 1e3,
        c.preload_before[1] / 1e3,
        1e-12,
        "Gere & Goodno ch. 2, elastic cycle, closed form",
        "kN",
    )
