"""Joint diagram: the joint network against the closed-form relations of VDI 2230-1, 5.3.

The joint is solved as a spring network (bolt in parallel with the clamped stack,
split at the load introduction planes); while the joint is clamped this must give
exactly the closed forms of VDI 2230-1:2015, 5.3 (with the resiliences the
package computed): Phi_n = n delta_P/(delta_S + delta_P); F_S = F_V + Phi_n F_A;
F_K = F_V - (1 - Phi_n) F_A; F_A,sep = F_V/(1 - Phi_n), beyond which the bolt
carries F_A; F_Z = f_Z/(delta_S + delta_P) (5.4.2); and the torque-preload
relation of ISO 16047 / VDI 2230-1 R13.
"""

from __future__ import annotations

from functools import cache
from typing import Any

from .registry import Outcome, register

G = "joint diagram"
TIGHT = 1e-9  # the network reproduces the closed form to round-off
FA = 15e3  # service load of the clamped case [N]
FA_OPEN = 45e3  # service load beyond separation of the minimum branch [N]


def _data(axial_load: str) -> dict[str, Any]:
    # M12 10.9 hex bolt and nut through 18 + 22 mm steel, n = 0.5, 90 N*m at mu_G 0.10..0.14
    return {
        "title": "verification joint",
        "bolt": {"thread": "M12", "grade": "10.9", "length": "60 mm", "head": "hex"},
        "nut": {},
        "clamped": [
            {"material": "steel", "thickness": "18 mm"},
            {"material": "steel", "thickness": "22 mm"},
        ],
        "tightening": {"torque": "90 N*m", "thread_friction": "0.10..0.14"},
        "service": {"axial_load": axial_load, "load_height": 0.5},
    }


@cache
def _result(axial_load: str = "0..15 kN"):
    from ..inputs.joint import joint_from_data
    from ..joint import analyse

    return analyse(joint_from_data(_data(axial_load)))


def _states(r) -> dict[str, Any]:
    return {s.key: s for s in r.states}


def _phi(r) -> float:
    dS, dP = r.springs.delta_S, r.springs.delta_P
    return 0.5 * dP / (dS + dP)


def _FV(r) -> float:
    return r.assembly_min - r.embedding_loss


@register("load factor Phi_n = n delta_P/(delta_S + delta_P)", G, kind="consistency")
def load_factor() -> Outcome:
    r = _result()
    return Outcome(r.load_factor, _phi(r), TIGHT, "VDI 2230-1:2015 5.3.1, closed form")


@register("bolt load F_S = F_V + Phi_n F_A", G, kind="consistency")
def bolt_load() -> Outcome:
    r = _result()
    got = _states(r)["service_max"].bolt_min
    return Outcome(
        got / 1e3, (_FV(r) + _phi(r) * FA) / 1e3, TIGHT, "VDI 2230-1:2015 5.3.2, closed form", "kN"
    )


@register("residual clamp load F_K = F_V - (1 - Phi_n) F_A", G, kind="consistency")
def clamp_load() -> Outcome:
    r = _result()
    return Outcome(
        r.residual_clamp_min / 1e3,
        (_FV(r) - (1 - _phi(r)) * FA) / 1e3,
        TIGHT,
        "VDI 2230-1:2015 5.3.2, closed form",
        "kN",
    )


@register("separation load F_A,sep = F_V/(1 - Phi_n)", G, kind="consistency")
def separation() -> Outcome:
    r = _result()
    return Outcome(
        r.separation_load / 1e3,
        _FV(r) / (1 - _phi(r)) / 1e3,
        TIGHT,
        "VDI 2230-1:2015 5.3.2, closed form",
        "kN",
    )


@register("bolt carries F_A beyond separation", G, kind="consistency")
def beyond_separation() -> Outcome:
    r = _result("0..45 kN")
    got = _states(r)["service_max"].bolt_min
    return Outcome(
        got / 1e3, FA_OPEN / 1e3, TIGHT, "VDI 2230-1:2015 5.3.2, joint diagram after opening", "kN"
    )


@register("embedding loss in the joint F_Z = f_Z/(delta_S + delta_P)", G, kind="consistency")
def embedding() -> Outcome:
    r = _result()
    dS, dP = r.springs.delta_S, r.springs.delta_P
    return Outcome(
        r.embedding_loss / 1e3,
        r.embedding_amount / (dS + dP) / 1e3,
        TIGHT,
        "VDI 2230-1:2015 5.4.2, closed form",
        "kN",
    )


@register("maximum assembly preload F_M,max = M_A,max / k(mu_min)", G, kind="consistency")
def torque_preload() -> Outcome:
    # ISO 16047 / VDI 2230-1 R13: M_A = F_M (0.16 P + 0.58 d2 mu_G + mu_K D_Km/2) with
    # D_Km = (d_W + d_h)/2 of the nut; M_A,max = 90 x 1.06 N*m (torque tolerance +-6 %)
    r = _result()
    thr = r.spec.bolt.thread
    DKm = 0.5 * (r.spec.nut.bearing_diameter + r.spec.layers[0].hole)
    k = 0.16 * thr.P + 0.58 * thr.d2 * 0.10 + 0.5 * 0.10 * DKm
    return Outcome(
        r.assembly_max / 1e3,
        90 * 1.06 / k / 1e3,
        TIGHT,
        "ISO 16047:2005 / VDI 2230-1:2015 R13, closed form",
        "kN",
    )


@register("required assembly preload F_M,erf = (1 - Phi_n) F_A + F_Z", G, kind="consistency")
def required_preload() -> Outcome:
    # VDI 2230-1 R5 without a required residual clamp load and at one temperature:
    # F_M,erf = F_Kerf + (1 - Phi_n) F_A,max + F_Z with F_Kerf = 0
    r = _result()
    return Outcome(
        r.required_assembly_min / 1e3,
        ((1 - _phi(r)) * FA + r.embedding_loss) / 1e3,
        TIGHT,
        "VDI 2230-1:2015 R5, closed form",
        "kN",
    )
