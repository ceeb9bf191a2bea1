"""The temperature sweep: limit temperatures by hand, and the sweep against ``check``.

The joint: the M10 8.8 bolt of the check-chain cases (50 mm, shank 10 mm, d_W = 16 mm,
E = 205 000 MPa, alpha = 11e-6 /K, nut alike) through two 15 mm aluminium plates with
constant E = 70 000 MPa and alpha = 23e-6 /K (d_h = 11, D'_A = 40 mm, p_G = 400 MPa),
tensioned to exactly 20 kN (scatter 1), f_Z = 8 um, F_A = 6 kN, n = 0.5, a required
residual clamp load of 10 kN, assembled at 20 degC.  With constant moduli the
resiliences do not change with temperature and the preload change is linear in it
(VDI 2230-1:2015 5.4.2.3, from memory):

* delta_S = 3.512182e-6 mm/N; delta_P = 5.331916e-7 x 205 000/70 000 = 1.561490e-6 mm/N
  (the cone does not depend on the modulus); delta_S + delta_P = 5.073672e-6 mm/N;
* Phi_n = 0.5 x 1.561490/5.073672 = 0.1538816;
* F_Z = 8e-3/5.073672e-6 = 1576.767 N;
* dF_V/dT = l_K (alpha_P - alpha_S)/(delta_S + delta_P) = 30 x 12e-6/5.073672e-6
  = 70.95454 N/K (a gain when heated: the plates grow more than the bolt).
"""

from __future__ import annotations

from functools import cache
from typing import Any

from .registry import Outcome, register

G = "sweep"
C0 = 273.15
VDI = "VDI 2230-1:2015"


def _part(**over: Any) -> dict[str, Any]:
    d = {"modulus": "205 GPa", "expansion": "11e-6 / K"}
    d.update(over)
    return d


def _plate() -> dict[str, Any]:
    return {
        "modulus": "70 GPa",
        "expansion": "23e-6 / K",
        "thickness": "15 mm",
        "hole": "11 mm",
        "outer_diameter": "40 mm",
        "limiting_pressure": "400 MPa",
    }


def _data(**service: Any) -> dict[str, Any]:
    srv = {"axial_load": "6 kN", "load_height": 0.5}
    srv.update(service)
    return {
        "title": "sweep verification joint",
        "bolt": _part(
            thread="M10",
            grade="8.8",
            length="50 mm",
            shank_length="10 mm",
            bearing_diameter="16 mm",
        ),
        "nut": _part(bearing_diameter="16 mm"),
        "clamped": [_plate(), _plate()],
        "embedding": {"amount": "8 um"},
        "tightening": {"method": "tension", "preload": "20 kN", "scatter": 1.0},
        "service": srv,
        "requirements": {"residual_clamp_load": "10 kN"},
    }


def _spec(**service: Any):
    from ..inputs.joint import joint_from_data

    return joint_from_data(_data(**service))


@cache
def _sweep():
    from ..studies.sweep import sweep

    return sweep(_spec(), C0 - 60.0, C0 + 150.0, step=10.0)


def _limit(check: str) -> tuple[float, str]:
    lim = next(x for x in _sweep().limits if x.check == check)
    return lim.temperature - C0, lim.fails


@register("sweep: residual clamp load fails below the limit temperature", G, kind="hand")
def residual_limit() -> Outcome:
    # F_KR(T) = F_M - F_Z - (1 - Phi_n) F_A + 70.95454 (T - 20 degC) = 10 000 N:
    # 20 000 - 1576.767 - 0.8461184 x 6000 = 13 346.52 N;
    # T - 20 = (10 000 - 13 346.52)/70.95454 = -47.16432 K -> T = -27.16432 degC
    T, fails = _limit("residual_clamp_load")
    if fails != "below":
        raise AssertionError(f"the residual clamp load should fail below the limit, not {fails}")
    return Outcome(
        T,
        -27.16432,
        1e-6,
        f"{VDI} 5.4.2.3 and R2 (from memory), linear in T with constant moduli, hand calculation",
        "degC",
    )


@register("sweep: surface pressure fails above the limit temperature", G, kind="hand")
def surface_limit() -> Outcome:
    # R10 at F_M,zul (tension: 0.9 x 640 x 57.98960 = 33 402.01 N), the thermal gain added:
    # F_S,max(T) = 33 402.01 + 70.95454 (T - 20) + Phi_n F_A = p_G A_p = 400 x 106.0288
    # = 42 411.50 N; Phi_n F_A = 923.290 N;
    # T - 20 = (42 411.50 - 33 402.01 - 923.29)/70.95454 = 113.9632 K -> T = 133.9632 degC
    T, fails = _limit("surface_pressure_head")
    if fails != "above":
        raise AssertionError(f"the surface pressure should fail above the limit, not {fails}")
    return Outcome(
        T,
        133.9632,
        1e-6,
        f"{VDI} 5.5.4, R10 at F_M,zul with the thermal gain (from memory), hand calculation",
        "degC",
    )


@cache
def _check_at_100():
    from ..joint import analyse

    return analyse(_spec(temperature="100 degC"))


def _index_100() -> int:
    import numpy as np

    return int(np.argmin(abs(_sweep().temperature - (C0 + 100.0))))


@register(
    "sweep closed form = check network: residual clamp load at 100 degC", G, kind="consistency"
)
def sweep_vs_check_residual() -> Outcome:
    # the sweep evaluates the closed form of the joint network, check solves the network
    s = _sweep()
    return Outcome(
        float(s.residual_min[_index_100()]) / 1e3,
        _check_at_100().residual_clamp_min / 1e3,
        1e-9,
        "clampstack sweep (closed form) against clampstack check (network) at one temperature",
        "kN",
    )


@register("sweep closed form = check network: preload at 100 degC", G, kind="consistency")
def sweep_vs_check_preload() -> Outcome:
    # minimum branch after embedding at service temperature, no working load
    s = _sweep()
    state = next(st for st in _check_at_100().states if st.key == "temperature")
    return Outcome(
        float(s.preload_min[_index_100()]) / 1e3,
        state.bolt_min / 1e3,
        1e-9,
        "clampstack sweep (closed form) against clampstack check (network) at one temperature",
        "kN",
    )
