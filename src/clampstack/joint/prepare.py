"""The joint before its checks: springs, tightening range and the joint's spring network.

:func:`prepare` resolves everything that the states and the check chain need
(resiliences at assembly and in service, load factor, assembly preload range,
embedding, torque); :func:`joint_network` builds the axial spring network of the
joint (VDI 2230-1:2015, section 5.3; see :mod:`clampstack.joint.analysis`), and
:func:`service_closed_form` is its exact closed form for the sweep and the
scatter study. Shared by :mod:`~clampstack.joint.analysis`,
:mod:`~clampstack.joint.plastic` and :mod:`~clampstack.joint.curves`.
"""

from __future__ import annotations

import math
from collections.abc import Callable
from dataclasses import dataclass
from typing import Any

import numpy as np

from ..catalog import yield_at_temperature, yield_extrapolation
from ..components import (
    embedding_amount,
    permissible_preload,
    thread_torque,
    tightening_factor,
    yield_controlled_preload_range,
)
from ..components.tightening import HARDENING_STRAIN, angle_preload
from ..network import COMPRESSION, TENSION, Network
from .model import JointSpec
from .thermal import TemperatureModel

K_TAU = 0.5  # residual torsion factor in service (VDI 2230-1 R8)

_MODEL_NAMES = {
    "vdi2230": "VDI 2230-1 pressure cone / sleeve model (5.1.2)",
    "shigley": "Shigley 30-degree frustum model (Mechanical Engineering Design, ch. 8)",
    "wileman": "Wileman, Choudhury and Green (1991) exponential fit",
}


@dataclass(frozen=True)
class Springs:
    """Resiliences at one set of temperatures [m/N]."""

    delta_S: float
    delta_P: float
    segments: tuple[tuple[str, float, float], ...]  # bolt segments: (name, length, resilience)

    @property
    def load_factor_K(self) -> float:
        """Phi_K = delta_P / (delta_S + delta_P) (VDI 2230-1, 5.3.1)."""
        return self.delta_P / (self.delta_S + self.delta_P)


@dataclass(frozen=True)
class State:
    """Bolt load and residual clamp load of one state, for both branches [N]."""

    key: str
    label: str
    bolt_min: float
    bolt_max: float
    clamp_min: float
    clamp_max: float
    axial_load: float


# --------------------------------------------------------------------------- preparation


@dataclass(frozen=True)
class Prepared:
    """Everything about a joint that does not depend on the service state."""

    spec: JointSpec
    model: TemperatureModel
    springs: Springs  # at assembly temperature
    A0: float
    d0: float
    permissible_preload: float
    assembly_min: float
    assembly_max: float
    alpha_A: float
    alpha_A_basis: str
    torque: tuple[float, float, float] | None
    k_torque_fn: Callable[[float, float], float]
    thread_torque_factor: float  # M_G / F_M at mu_G,min [m]; 0 for tension tightening
    k_tau: float
    embedding_amount: float
    embedding_loss: float
    notes: tuple[str, ...]
    assumptions: tuple[str, ...]
    #: method angle: snug, window, yield, elongation; method tension: load transfer
    method_info: dict[str, Any] | None = None

    @property
    def check_basis(self) -> str:
        """Basis of the checks R8-R10: "permissible", "actual", or "yield" (yield-controlled)."""
        if self.spec.tightening.method in ("yield", "angle"):
            return "yield"
        return self.spec.requirements.check_basis

    def check_preload(self, basis: str | None = None) -> float:
        """Assembly preload of the working-stress, fatigue and surface-pressure checks [N].

        VDI 2230-1:2015 evaluates R8 (working stress), R9 (mean load) and R10 (surface
        pressure) with the permissible assembly preload ``F_M,zul``, whatever torque is
        specified: ``basis = "permissible"``.  ``"actual"`` takes ``F_M,max`` of the given
        torque or preload instead.  Yield-controlled tightening has no ``F_M,zul`` of its
        own; its ``F_M,max`` (strongest bolt of the lot) is used in both cases.
        """
        basis = basis or self.check_basis
        if basis == "permissible" and self.check_basis != "yield":
            return self.permissible_preload
        return self.assembly_max


def temperature_data_notes(
    spec: JointSpec, model: TemperatureModel, T_service: np.ndarray
) -> list[str]:
    """Notes for every property used outside its catalog data at service temperature(s) [K].

    The moduli and expansion coefficients the temperature model extrapolates below a
    material's data (:meth:`TemperatureModel.extrapolations`) and the bolt grade's yield
    strength held at its 20 degC value in the cold (:func:`~clampstack.catalog.yield_extrapolation`),
    each naming the part, the property and the temperatures.
    """
    notes = model.extrapolation_notes(T_service)
    b = spec.bolt
    T_bolt = np.append(model.part_T(b.temperature, T_service), spec.service.assembly_temperature)
    held = yield_extrapolation(b.grade, T_bolt)
    if held is not None:
        notes.append(held.text("bolt"))
    return notes


def torque_preload_range(
    torque: float | None,
    preload: float | None,
    upper: float,
    k_torque: Callable[[float, float], float],
    thread_friction: tuple[float, float],
    head_friction: tuple[float, float],
    tolerance: float,
    scatter: float | None,
) -> tuple[tuple[float, float, float], float, float, float, str, str | None]:
    """Torque specification and assembly preload range of torque tightening.

    ``M_A = F_M k(mu_G, mu_K)`` (VDI 2230-1 R13, ISO 16047).  The nominal torque is the
    given ``torque``, or the one that gives ``preload`` at the mean friction, or (neither
    given) the one whose upper tolerance takes the bolt to ``upper`` at the lowest friction.
    ``F_M,max`` = largest torque at the lowest friction; ``F_M,min`` = smallest torque at
    the highest friction, or ``F_M,max / scatter`` when a tightening factor is given, or
    ``F_M,max / 1.6`` (VDI 2230-1 Table A8, from memory) when the friction is one value.
    Returns ``((M_A, M_A,min, M_A,max), F_M,min, F_M,max, alpha_A, basis, note)``.
    """
    muG_lo, muG_hi = thread_friction
    muK_lo, muK_hi = head_friction
    note = None
    if torque is not None:
        MA = torque
    elif preload is not None:
        MA = preload * k_torque(0.5 * (muG_lo + muG_hi), 0.5 * (muK_lo + muK_hi))
    else:
        MA = upper * k_torque(muG_lo, muK_lo) / (1 + tolerance)
        note = (
            "No torque or preload given: the torque is set so that the maximum preload "
            "reaches the permissible preload (VDI 2230-1 R13)."
        )
    MA_min, MA_max = MA * (1 - tolerance), MA * (1 + tolerance)
    FM_max = MA_max / k_torque(muG_lo, muK_lo)
    if scatter is not None:
        alpha, basis = scatter, "given"
        FM_min = FM_max / alpha
    elif muG_lo == muG_hi and muK_lo == muK_hi:
        alpha = tightening_factor("torque", friction_known=False, bound="lower")
        basis = (
            f"VDI 2230-1 Table A8 default for torque tightening with one friction value "
            f"({alpha:g}, from memory)"
        )
        FM_min = FM_max / alpha
    else:
        FM_min = MA_min / k_torque(muG_hi, muK_hi)
        alpha = FM_max / FM_min
        basis = f"from the friction range and the torque tolerance +-{tolerance:.0%}"
    return (MA, MA_min, MA_max), FM_min, FM_max, alpha, basis, note


def prepare(spec: JointSpec, model: TemperatureModel | None = None) -> Prepared:
    """Springs, tightening (VDI 2230-1 R7, R13; ISO 16047) and embedding (5.4.2)."""
    b, tr, srv = spec.bolt, spec.tightening, spec.service
    thr, grd = b.thread, b.grade
    notes: list[str] = []
    assumptions = [
        "Concentric axial loading and clamping only (VDI 2230-1 case of a concentric joint); "
        "bending, prying and eccentric loads are not modelled.",
        f"Clamped-part stiffness by the {_MODEL_NAMES[spec.clamp_model]}.",
        "Maximum bolt load from the maximum assembly preload without embedding loss; minimum "
        "residual clamp load from the minimum assembly preload after embedding (VDI 2230-1 R8, R5).",
        "Moduli and thermal expansion from the catalog at each part's temperature (mean "
        "expansion coefficients from 20 degC); bolt yield strength at the bolt's temperature "
        "where elevated-temperature data exist; limiting surface pressures at room temperature.",
    ]
    # cross-section A0 and its diameter d0 (VDI 2230-1: the smallest section)
    d0, A0 = thr.ds, thr.As
    if b.shank_diameter is not None and math.pi / 4 * b.shank_diameter**2 < A0:
        d0, A0 = b.shank_diameter, math.pi / 4 * b.shank_diameter**2

    if model is None:  # a caller trying many grades may pass the model of the same parts
        model = TemperatureModel(spec)
    notes.extend(temperature_data_notes(spec, model, np.array([srv.temperature])))
    dSa, dPa = model.resiliences_at_assembly()
    sp_a = Springs(dSa, dPa, tuple(model.segment_resiliences()))

    muG_lo, muG_hi = tr.thread_friction
    muK_lo, muK_hi = tr.head_friction
    dh = spec.layers[0].hole
    dW_turn = b.bearing_diameter if spec.nut is None else spec.nut.bearing_diameter
    DKm = 0.5 * (dW_turn + dh)

    def k_torque(muG: float, muK: float) -> float:
        # M_A / F_M (VDI 2230-1 R13, ISO 16047)
        return 0.16 * thr.P + 0.58 * thr.d2 * muG + 0.5 * muK * DKm

    Rp = grd.Rp02
    if srv.assembly_temperature > 293.15 + 1e-9:
        Rp = float(yield_at_temperature(grd, srv.assembly_temperature)[0])
    if tr.method == "tension":
        FMzul = tr.utilization * Rp * A0  # no thread torsion when a tensioner stretches the bolt
    else:
        FMzul = float(permissible_preload(A0, d0, thr.d2, thr.P, Rp, muG_lo, tr.utilization))
    torque: tuple[float, float, float] | None = None
    angle_info: dict[str, Any] | None = None
    if tr.method == "torque":
        torque, FM_min, FM_max, alpha, basis, note = torque_preload_range(
            tr.torque,
            tr.preload,
            FMzul,
            k_torque,
            tr.thread_friction,
            tr.head_friction,
            tr.torque_tolerance,
            tr.scatter,
        )
        if note:
            notes.append(note)
    elif tr.method == "angle":
        # snug torque (torque relation, tool tolerance), then the nut turned by the angle:
        # elastic stretch of bolt and parts, past yield a bilinear bolt (angle_preload)
        assert tr.snug_torque is not None and tr.angle is not None
        tol, dth = tr.torque_tolerance, tr.angle_tolerance
        T_snug = (tr.snug_torque * (1 - tol), tr.snug_torque * (1 + tol))
        F_snug = (T_snug[0] / k_torque(muG_hi, muK_hi), T_snug[1] / k_torque(muG_lo, muK_lo))
        th = (max(tr.angle[0] - dth, 0.0), tr.angle[1] + dth)
        lK = spec.clamp_length
        # weakest bolt at the highest thread friction, strongest (1.2 R_p0.2min) at the lowest
        Fy = (
            float(permissible_preload(A0, d0, thr.d2, thr.P, Rp, muG_hi, 1.0)),
            float(permissible_preload(A0, d0, thr.d2, thr.P, 1.2 * Rp, muG_lo, 1.0)),
        )
        Fu = (Fy[0] * grd.Rm / Rp, Fy[1] * grd.Rm / Rp)
        lo = angle_preload(F_snug[0], th[0], thr.P, dSa, dPa, Fy[0], Fu[0], lK)
        hi = angle_preload(F_snug[1], th[1], thr.P, dSa, dPa, Fy[1], Fu[1], lK)
        FM_min, FM_max = float(lo[0]), float(hi[0])
        FMzul = float(permissible_preload(A0, d0, thr.d2, thr.P, Rp, muG_lo, tr.utilization))
        alpha = FM_max / FM_min
        basis = (
            "snug torque with its tolerance and friction, angle window, bolt yield scatter "
            "(R_p0.2 to 1.2 R_p0.2, from memory)"
        )
        if tr.scatter is not None:
            alpha, basis = tr.scatter, "given"
            FM_min = FM_max / alpha
        torque = (tr.snug_torque, T_snug[0], T_snug[1])
        angle_info = {
            "snug_torque_Nm": tr.snug_torque,
            "snug_preload_min_N": F_snug[0],
            "snug_preload_max_N": F_snug[1],
            "angle_min_deg": math.degrees(th[0]),
            "angle_max_deg": math.degrees(th[1]),
            "yield_preload_min_N": Fy[0],
            "yield_preload_max_N": Fy[1],
            "utilization_min": FM_min / Fy[0],
            "utilization_max": FM_max / Fy[1],
            "yields_min": bool(lo[0] > Fy[0]),
            "yields_max": bool(hi[0] > Fy[1]),
            "permanent_elongation_min_um": float(lo[1]) * 1e6,
            "permanent_elongation_max_um": float(hi[1]) * 1e6,
            "breaks": bool(hi[2]),
        }
        if hi[2]:
            notes.append(
                "Angle tightening: at the largest angle the strongest bolt reaches its "
                "tensile strength (it would break): reduce the angle."
            )
        notes.append(
            "Method angle: snug torque, then the nut turned by the angle; the torque shown "
            "is the snug torque. Past the yield point the bolt follows a bilinear law up to "
            f"R_m at {HARDENING_STRAIN:.0%} plastic strain of the clamp length (from memory)."
        )
    elif tr.method == "yield":
        FM_min, FM_max = (
            float(x)
            for x in yield_controlled_preload_range(A0, d0, thr.d2, thr.P, Rp, muG_lo, muG_hi)
        )
        FMzul = float(permissible_preload(A0, d0, thr.d2, thr.P, 1.2 * Rp, muG_lo, 1.0))
        alpha = FM_max / FM_min
        basis = "yield-point scatter of the bolts (R_p0.2max = 1.2 R_p0.2min, from memory)"
        if tr.scatter is not None:
            alpha, basis = tr.scatter, "given"
            FM_min = FM_max / alpha
        # torque at the yield point: least for the weakest bolt at the lowest friction,
        # most for the strongest bolt at the highest friction (indicative only)
        T_lo = float(permissible_preload(A0, d0, thr.d2, thr.P, Rp, muG_lo, 1.0)) * k_torque(
            muG_lo, muK_lo
        )
        T_hi = float(permissible_preload(A0, d0, thr.d2, thr.P, 1.2 * Rp, muG_hi, 1.0)) * k_torque(
            muG_hi, muK_hi
        )
        torque = (0.5 * (T_lo + T_hi), T_lo, T_hi)
        notes.append(
            "Method yield: the joint is tightened to the yield point; the torque range is "
            "indicative (the yield signal controls)."
        )
        assumptions.append(
            "Yield-controlled tightening: permissible preload with nu = 1 and "
            "R_p0.2max = 1.2 R_p0.2min (VDI 2230-1, from memory)."
        )
    else:  # tension
        alpha = tr.scatter if tr.scatter is not None else tightening_factor("tension", bound="mid")
        basis = (
            "given"
            if tr.scatter is not None
            else (
                f"VDI 2230-1 Table A8, hydraulic tensioning, middle of 1.2-1.6 ({alpha:g}, from memory)"
            )
        )
        # load transfer: the nut takes less than the tool applied (thread and nut deflect
        # when the tool lets go); LTF = residual / applied = 1 / (1 + d / l_K) unless given
        # (tensioner practice, from memory: the loss grows as the grip shortens)
        ltf = tr.load_transfer_factor or 1.0 / (1.0 + thr.d / spec.clamp_length)
        if tr.preload is not None:
            FM_min = 2 * tr.preload / (1 + alpha)
            FM_max = alpha * FM_min
        else:  # the tool's largest tension takes the bolt to F_M,zul (no torsion)
            FM_max = FMzul * ltf
            FM_min = FM_max / alpha
        angle_info = {
            "load_transfer_factor": ltf,
            "load_transfer_basis": "given"
            if tr.load_transfer_factor
            else "1 / (1 + d / l_K) (tensioner practice, from memory; use the tool maker's data)",
            "applied_tension_min_N": FM_min / ltf,
            "applied_tension_max_N": FM_max / ltf,
        }
        notes.append(
            "Method tension: no thread torsion at assembly; no torque specification. The "
            f"tensioner applies {FM_min / ltf / 1e3:.4g} .. {FM_max / ltf / 1e3:.4g} kN; the "
            f"nut keeps {ltf:.0%} of it (load transfer factor)."
        )

    if spec.embedding_amount is not None:
        fZ = spec.embedding_amount
    else:
        n_interfaces = len(spec.layers) - 1 + (1 if spec.tapped else 0)
        fZ = float(
            embedding_amount(
                spec.roughness,
                n_interfaces,
                "transverse" if srv.shear_load > 0 else "axial",
                thread=True,
                n_bearing=1 if spec.tapped else 2,
            )
        )
    FZ = fZ / (dSa + dPa)
    kG = 0.0 if tr.method == "tension" else float(thread_torque(1.0, thr.P, thr.d2, muG_lo))
    return Prepared(
        spec,
        model,
        sp_a,
        A0,
        d0,
        FMzul,
        FM_min,
        FM_max,
        alpha,
        basis,
        torque,
        k_torque,
        kG,
        0.0 if tr.method == "tension" else K_TAU,
        fZ,
        FZ,
        tuple(notes),
        tuple(assumptions),
        angle_info,
    )


# --------------------------------------------------------------------------- network


@dataclass(frozen=True)
class JointNet:
    net: Network
    load_node: int
    bolt: int
    inner: int


def joint_network(dS: float, dP: float, n: float, bolt_free: float, clamp_free: float) -> JointNet:
    """Network of the joint: bolt H-N in parallel with the clamped stack H-A-B-N.

    Nodes 0 H (head plane), 1 A, 2 B, 3 N (nut plane); with n = 1, A = H and B = N.
    ``bolt_free`` and ``clamp_free`` are the free elongations (misfit, thermal,
    embedding) of the bolt and of the whole clamped stack; the stack's share is
    split in proportion to resilience.  The bolt carries tension only (a nut cannot
    push), the middle part of the stack compression only (the interface).
    """
    if n >= 1.0 - 1e-9:  # outer parts of vanishing length: merge the planes
        net = Network.from_arrays(
            2,
            [0, 0],
            [1, 1],
            [1 / dS, 1 / dP],
            [bolt_free, clamp_free],
            [TENSION, COMPRESSION],
            fixed=[0],
        )
        return JointNet(net, 1, 0, 1)
    outer = 0.5 * (1 - n)
    net = Network.from_arrays(
        4,
        [0, 0, 1, 2],
        [3, 1, 2, 3],
        [1 / dS, 1 / (outer * dP), 1 / (n * dP), 1 / (outer * dP)],
        [bolt_free, outer * clamp_free, n * clamp_free, outer * clamp_free],
        [TENSION, 0, COMPRESSION, 0],
        fixed=[1],
    )
    return JointNet(net, 2, 0, 2)


def solve_service(jn: JointNet, FA: float) -> tuple[float, float]:
    loads = np.zeros(jn.net.n_nodes)
    loads[jn.load_node] = FA
    sol = jn.net.solve(loads)
    return float(sol.force[jn.bolt]) + 0.0, float(-sol.force[jn.inner]) + 0.0


def service_closed_form(
    FV: np.ndarray, phi: np.ndarray, FA: float | np.ndarray
) -> tuple[np.ndarray, np.ndarray]:
    """Bolt load and clamp load of the joint network in closed form (exact, piecewise).

    While bolt and interface both carry: ``F_S = F_V + Phi_n F_A``,
    ``F_K = F_V - (1 - Phi_n) F_A`` (VDI 2230-1, 5.3.1).  Interface open: the bolt
    carries ``F_A``; bolt slack (preload lost, compressive load): the interface
    carries ``-F_A``.  Vectorised over any of the arguments.
    """
    FS_a = FV + phi * FA
    FK_a = FV - (1 - phi) * FA
    both = (FS_a >= 0) & (FK_a >= 0)
    FA_arr = np.asarray(FA, dtype=float)
    FS = np.where(both, FS_a, np.where(FA_arr > 0, FA_arr, 0.0)) + 0.0  # + 0.0: no -0.0
    FK = np.where(both, FK_a, np.where(FA_arr < 0, -FA_arr, 0.0)) + 0.0
    return FS, FK


def service_preload(
    FM: Any, resilience_assembly: float, resilience_service: Any, thermal: Any, embedding: Any = 0.0
) -> Any:
    """Preload at service temperature [N] of an assembly preload ``FM`` [N] (vectorised).

    The bolt's misfit ``F_M (delta_S + delta_P)`` at assembly, less the embedding ``f_Z``
    and the net free thermal elongation ``thermal`` (bolt minus clamped stack) [m], over
    the joint's resilience at service temperature (VDI 2230-1:2015, 5.4.2.3, with the
    moduli at temperature); the closed form of the joint network without working load.
    """
    return (FM * resilience_assembly - embedding - thermal) / resilience_service


def check_bolt_loads(
    FM: Any, FV_T: Any, phi: Any, FA_lo: float, FA_hi: float
) -> tuple[np.ndarray, np.ndarray]:
    """Bolt loads of the checks R8-R10 for a check preload ``FM`` (vectorised).

    VDI 2230-1:2015 R8: ``F_S,max = F_M + Phi F_A,max - Delta F'_Vth``, the thermal term
    counted only where it raises the preload (from memory): the preload in service is
    ``max(F_V,T, F_M)`` with ``F_V,T`` the preload ``FM`` becomes at service temperature
    without embedding.  Through the joint network's closed form (exact past separation).
    R9's mean load ``F_Sm = F_M + (F_SAo + F_SAu)/2`` (from memory) is taken from the same
    preload.  Returns ``(F_S,max, F_Sm)`` [N]: the larger of assembly and service for
    ``F_S,max`` (R10's assembly and service pressures use it too).
    """
    FM = np.asarray(FM, dtype=float)
    FV = np.maximum(np.asarray(FV_T, dtype=float), FM)
    hi = service_closed_form(FV, phi, FA_hi)[0]
    lo = service_closed_form(FV, phi, FA_lo)[0]
    bolt_max = np.maximum.reduce(np.broadcast_arrays(FM, FV, hi, lo))
    return bolt_max, 0.5 * (hi + lo)
