"""Single-bolt joint analysis: springs, tightening, states and the check chain.

The joint is an axial spring network (VDI 2230-1:2015, section 5.3; the joint
diagram of section 5.3.1, reproduced with the network instead of the closed
form):

* the bolt (resilience ``delta_S``, VDI 2230-1 section 5.1.1) between the head
  bearing ``H`` and the nut bearing (or tapped thread) ``N``;
* the clamped parts (``delta_P``, section 5.1.2) between the same planes, split
  at the load introduction planes ``A`` and ``B`` into ``(1 - n)/2 delta_P``,
  ``n delta_P``, ``(1 - n)/2 delta_P`` (the load introduction factor ``n`` of
  section 5.2.2); the middle part, which contains the interface, carries
  compression only, so separation comes out of the solve exactly;
* the preload is a length misfit of the bolt, embedding a shortening of the
  clamped stack, temperature a free thermal elongation of every part with the
  moduli at each part's temperature;
* the axial working load ``F_A`` pulls ``A`` and ``B`` apart.

Two branches are followed: the minimum assembly preload with embedding (which
governs the residual clamp load) and the maximum assembly preload without
embedding (which governs bolt stress; VDI 2230-1 does the same in step R8).
"""

from __future__ import annotations

import math
from dataclasses import dataclass, field
from typing import Any

import numpy as np

from ..components import (
    bolt_resilience,
    clamped_resilience,
    embedding_amount,
    endurance_rolled_after_heat_treatment,
    endurance_rolled_before_heat_treatment,
    minimum_engagement,
    permissible_preload,
    thread_torque,
    tightening_factor,
    working_stress,
    yield_controlled_preload_range,
)
from ..errors import InputError
from ..network import COMPRESSION, TENSION, Network
from .checks import Check
from .model import JointSpec

TORQUE_FACTOR_SOURCE = (
    "VDI 2230-1:2015, 5.4.3 / ISO 16047: M_A = F (0.16 P + 0.58 d2 muG + muK D_Km/2)"
)


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


@dataclass(frozen=True)
class JointResult:
    """Everything ``clampstack check`` reports about a joint (SI floats)."""

    spec: JointSpec
    springs: Springs  # at assembly temperature
    springs_service: Springs  # at service temperatures
    load_factor: float  # Phi_n at assembly temperature
    load_factor_service: float
    A0: float
    d0: float
    permissible_preload: float
    assembly_min: float
    assembly_max: float
    alpha_A: float
    alpha_A_basis: str
    torque: tuple[float, float, float] | None  # nominal, min, max [N*m]
    torque_required: float | None  # smallest nominal torque that meets F_M,min >= required
    embedding_amount: float
    embedding_loss: float
    thermal_change: float  # min branch: F(service T) - F(assembly T), after embedding
    thermal_change_max: float
    states: tuple[State, ...]
    separation_load: float
    bolt_load_max: float
    residual_clamp_min: float
    required_assembly_min: float
    required_clamp_load: float
    checks: tuple[Check, ...]
    notes: tuple[str, ...]
    assumptions: tuple[str, ...]
    defaults: tuple[tuple[str, str], ...] = field(default=())

    @property
    def preload_at_limit_by_design(self) -> bool:
        """True when no torque or preload was given: F_M,max was set to F_M,zul."""
        tr = self.spec.tightening
        return tr.torque is None and tr.preload is None

    @property
    def ok(self) -> bool:
        """True when every check that is switched on passes."""
        return all(c.passed for c in self.checks)

    def to_dict(self) -> dict[str, Any]:
        """JSON form per DESIGN.md (``check --json``)."""
        s = self.spec
        thr = s.bolt.thread
        states = [
            {
                "name": st.key,
                "label": st.label,
                "axial_load_N": st.axial_load,
                "bolt_load_min_N": st.bolt_min,
                "bolt_load_max_N": st.bolt_max,
                "clamp_load_min_N": st.clamp_min,
                "clamp_load_max_N": st.clamp_max,
            }
            for st in self.states
        ]
        torque = None
        if self.torque is not None:
            torque = {
                "nominal_Nm": self.torque[0],
                "min_Nm": self.torque[1],
                "max_Nm": self.torque[2],
                "required_min_Nm": self.torque_required,
            }
        else:
            torque = {"nominal_Nm": None, "min_Nm": None, "max_Nm": None, "required_min_Nm": None}
        return {
            "title": s.title,
            "bolt": {
                "thread": thr.designation,
                "grade": s.bolt.grade.name,
                "stress_area_mm2": thr.As * 1e6,
                "stiffness_N_per_mm": 1e-3 / self.springs.delta_S,
                "resilience_mm_per_N": self.springs.delta_S * 1e3,
                "yield_strength_MPa": s.bolt.grade.Rp02 * 1e-6,
                "tensile_strength_MPa": s.bolt.grade.Rm * 1e-6,
                "segments": [
                    {"name": n, "length_mm": ln * 1e3, "resilience_mm_per_N": r * 1e3}
                    for n, ln, r in self.springs.segments
                ],
            },
            "clamped": {
                "stiffness_N_per_mm": 1e-3 / self.springs.delta_P,
                "resilience_mm_per_N": self.springs.delta_P * 1e3,
                "clamp_length_mm": s.clamp_length * 1e3,
                "model": s.clamp_model,
            },
            "load_factor": self.load_factor,
            "load_factor_K": self.springs.load_factor_K,
            "load_factor_service": self.load_factor_service,
            "tightening": {
                "method": s.tightening.method,
                "tightening_factor": self.alpha_A,
                "tightening_factor_basis": self.alpha_A_basis,
                "thread_friction": list(s.tightening.thread_friction),
                "head_friction": list(s.tightening.head_friction),
            },
            "preload": {
                "assembly_min_N": self.assembly_min,
                "assembly_max_N": self.assembly_max,
                "permissible_N": self.permissible_preload,
                "required_min_N": self.required_assembly_min,
                "embedding_amount_um": self.embedding_amount * 1e6,
                "embedding_loss_N": self.embedding_loss,
                "thermal_change_N": self.thermal_change,
                "thermal_change_max_N": self.thermal_change_max,
            },
            "torque": torque,
            "service": {
                "axial_load_min_N": s.service.axial_load[0],
                "axial_load_max_N": s.service.axial_load[1],
                "shear_load_N": s.service.shear_load,
                "temperature_degC": s.service.temperature - 273.15,
                "assembly_temperature_degC": s.service.assembly_temperature - 273.15,
                "bolt_load_max_N": self.bolt_load_max,
                "residual_clamp_load_min_N": self.residual_clamp_min,
                "required_clamp_load_N": self.required_clamp_load,
                "separation_load_N": self.separation_load,
            },
            "states": states,
            "checks": [c.to_dict() for c in self.checks],
            "ok": self.ok,
            "notes": list(self.notes),
            "assumptions": list(self.assumptions),
            "defaults": {k: v for k, v in self.defaults},
        }

    def _repr_html_(self) -> str:  # pragma: no cover - exercised in notebooks
        from ..io.joint_text import joint_html_tables

        return joint_html_tables(self)


# --------------------------------------------------------------------------- springs


def springs(spec: JointSpec, service: bool) -> Springs:
    """Bolt and clamped-part resilience at assembly (``service=False``) or service temperatures."""
    b = spec.bolt
    thr = b.thread
    T_asm = spec.service.assembly_temperature

    def T(part_T: float) -> float:
        return part_T if service else T_asm

    E_bolt = b.material.E(T(b.temperature))
    lK = spec.clamp_length
    shank = []
    if b.shank_length > 0:
        shank = [(b.shank_length, b.shank_diameter or thr.d)]
    head = None if b.head == "stud" else b.head
    E_nut = spec.nut.material.E(T(b.temperature)) if spec.nut else None
    E_tapped = (
        spec.tapped_hole.material.E(T(spec.tapped_hole.temperature)) if spec.tapped_hole else None
    )
    try:
        bolt = bolt_resilience(
            thr.d,
            thr.P,
            thr.d3,
            E_bolt,
            lK,
            shank,
            head,
            "tapped" if spec.tapped else "nut",
            E_nut=E_nut,
            E_tapped=E_tapped,
        )
    except ValueError as err:
        raise InputError(str(err), key="bolt") from None
    plates = [
        (lay.thickness, lay.material.E(T(lay.temperature)), lay.family)
        for lay in spec.layers
        if lay.kind != "sleeve"
    ]
    ods = [lay.outer_diameter for lay in spec.layers if lay.kind != "sleeve" and lay.outer_diameter]
    DA = min(ods) if ods else None
    dh = (
        max(lay.hole for lay in spec.layers if lay.kind != "washer")
        if any(lay.kind != "washer" for lay in spec.layers)
        else spec.layers[0].hole
    )
    delta_P = 0.0
    if plates:
        try:
            delta_P = float(
                clamped_resilience(
                    plates,
                    b.bearing_diameter,
                    dh,
                    DA,
                    spec.clamp_model,
                    spec.tapped,
                    thr.d,
                    E_tapped,
                )
            )
        except ValueError as err:
            raise InputError(
                str(err), key="clamp_model" if "Wileman" in str(err) else "clamped"
            ) from None
    for lay in spec.layers:
        if lay.kind == "sleeve":
            assert lay.outer_diameter is not None
            area = math.pi / 4 * (lay.outer_diameter**2 - lay.hole**2)
            delta_P += lay.thickness / (lay.material.E(T(lay.temperature)) * area)
    segs = tuple((s.name, s.length, s.resilience) for s in bolt.segments)
    return Springs(float(bolt.total), delta_P, segs)


# --------------------------------------------------------------------------- network


@dataclass(frozen=True)
class _Net:
    net: Network
    load_node: int
    bolt: int
    inner: int


def _joint_network(dS: float, dP: float, n: float, bolt_free: float, clamp_free: float) -> _Net:
    """Network of the joint: bolt H-N in parallel with the clamped stack H-A-B-N.

    Nodes 0 H (head plane), 1 A, 2 B, 3 N (nut plane); with n = 1, A = H and B = N.
    ``bolt_free`` and ``clamp_free`` are the free elongations (misfit, thermal,
    embedding) of the bolt and of the whole clamped stack; the stack's share is
    split in proportion to resilience.
    """
    if n >= 1.0:
        i, j = [0, 0], [1, 1]
        k = [1 / dS, 1 / dP]
        d0 = [bolt_free, clamp_free]
        beh = [TENSION, COMPRESSION]
        net = Network.from_arrays(2, i, j, k, d0, beh, fixed=[0])
        return _Net(net, 1, 0, 1)
    outer = 0.5 * (1 - n)
    i = [0, 0, 1, 2]
    j = [3, 1, 2, 3]
    k = [1 / dS, 1 / (outer * dP), 1 / (n * dP), 1 / (outer * dP)]
    d0 = [bolt_free, outer * clamp_free, n * clamp_free, outer * clamp_free]
    beh = [TENSION, 0, COMPRESSION, 0]  # a nut cannot push: the bolt carries tension only
    net = Network.from_arrays(4, i, j, k, d0, beh, fixed=[1])
    return _Net(net, 2, 0, 2)


def _solve(jn: _Net, FA: float) -> tuple[float, float]:
    loads = np.zeros(jn.net.n_nodes)
    loads[jn.load_node] = FA
    sol = jn.net.solve(loads)
    return float(sol.force[jn.bolt]), float(-sol.force[jn.inner])


# --------------------------------------------------------------------------- analysis


def _thermal_free(spec: JointSpec) -> tuple[float, float]:
    """Free thermal elongation of bolt (over l_K) and clamped stack from assembly to service [m]."""
    T_a = spec.service.assembly_temperature
    b = spec.bolt
    lK = spec.clamp_length
    bolt = lK * (b.material.strain(b.temperature) - b.material.strain(T_a))
    clamp = sum(
        lay.thickness * (lay.material.strain(lay.temperature) - lay.material.strain(T_a))
        for lay in spec.layers
    )
    return bolt, clamp


def analyse(spec: JointSpec) -> JointResult:
    """Analyse and check a single-bolt joint (VDI 2230-1 calculation steps R0-R13)."""
    b, tr, srv, rq = spec.bolt, spec.tightening, spec.service, spec.requirements
    thr, grd = b.thread, b.grade
    notes: list[str] = []
    assumptions: list[str] = [
        "Concentric axial loading and clamping only (VDI 2230-1 case of a concentric joint); "
        "bending, prying and eccentric loads are not modelled.",
        f"Clamped-part stiffness by the {_MODEL_NAMES[spec.clamp_model]}.",
        "Maximum bolt load from the maximum assembly preload without embedding loss; minimum "
        "residual clamp load from the minimum assembly preload after embedding (VDI 2230-1 R8, R5).",
        "Moduli and thermal expansion from the catalog at each part's temperature (mean "
        "expansion coefficients from 20 degC); bolt strengths at room temperature.",
    ]

    # cross-section A0 and its diameter d0 (VDI 2230-1: the smallest section)
    d0, A0 = thr.ds, thr.As
    if b.shank_diameter is not None and math.pi / 4 * b.shank_diameter**2 < A0:
        d0, A0 = b.shank_diameter, math.pi / 4 * b.shank_diameter**2

    sp_a = springs(spec, service=False)
    sp_s = springs(spec, service=True)
    n = srv.load_height
    phi_n = n * sp_a.load_factor_K
    phi_n_s = n * sp_s.load_factor_K

    # --- tightening (VDI 2230-1 R7, R13; ISO 16047)
    muG_lo, muG_hi = tr.thread_friction
    muK_lo, muK_hi = tr.head_friction
    dh = spec.layers[0].hole
    dW_turn = b.bearing_diameter if (spec.tapped or spec.nut is None) else spec.nut.bearing_diameter
    DKm = 0.5 * (dW_turn + dh)

    def k_torque(muG: float, muK: float) -> float:
        return 0.16 * thr.P + 0.58 * thr.d2 * muG + 0.5 * muK * DKm

    Rp = grd.Rp02
    if tr.method == "tension":
        FMzul = tr.utilization * Rp * A0  # no thread torsion when a tensioner stretches the bolt
    else:
        FMzul = float(permissible_preload(A0, d0, thr.d2, thr.P, Rp, muG_lo, tr.utilization))
    torque: tuple[float, float, float] | None = None
    single_friction = muG_lo == muG_hi and muK_lo == muK_hi
    if tr.method == "torque":
        if tr.torque is not None:
            MA = tr.torque
        elif tr.preload is not None:
            MA = tr.preload * k_torque(0.5 * (muG_lo + muG_hi), 0.5 * (muK_lo + muK_hi))
        else:
            MA = FMzul * k_torque(muG_lo, muK_lo) / (1 + tr.torque_tolerance)
        MA_min, MA_max = MA * (1 - tr.torque_tolerance), MA * (1 + tr.torque_tolerance)
        torque = (MA, MA_min, MA_max)
        FM_max = MA_max / k_torque(muG_lo, muK_lo)
        if tr.scatter is not None:
            alpha, basis = tr.scatter, "given"
            FM_min = FM_max / alpha
        elif single_friction:
            alpha = tightening_factor("torque", friction_known=False, bound="lower")
            basis = (
                f"VDI 2230-1 Table A8 default for torque tightening with one friction value "
                f"({alpha:g}, from memory)"
            )
            FM_min = FM_max / alpha
        else:
            FM_min = MA_min / k_torque(muG_hi, muK_hi)
            alpha = FM_max / FM_min
            basis = f"from the friction range and the torque tolerance +-{tr.torque_tolerance:.0%}"
    elif tr.method in ("yield", "angle"):
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
        torque = (
            0.5 * (FM_min * k_torque(muG_lo, muK_lo) + FM_max * k_torque(muG_hi, muK_hi)),
            FM_min * k_torque(muG_lo, muK_lo),
            FM_max * k_torque(muG_hi, muK_hi),
        )
        notes.append(
            f"Method {tr.method}: the joint is tightened to the yield point; the torque "
            "range is indicative (the angle or yield signal controls)."
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
        if tr.preload is not None:
            FM_min = 2 * tr.preload / (1 + alpha)
            FM_max = alpha * FM_min
        else:
            FM_max = FMzul
            FM_min = FM_max / alpha
        notes.append("Method tension: no thread torsion at assembly; no torque specification.")

    # --- embedding (VDI 2230-1, 5.4.2)
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
    dSa, dPa = sp_a.delta_S, sp_a.delta_P
    FZ = fZ / (dSa + dPa)

    # --- states through the network
    th_bolt, th_clamp = _thermal_free(spec)
    FA_lo, FA_hi = srv.axial_load

    def branch(FM: float, embed: bool) -> dict[str, tuple[float, float]]:
        misfit = -FM * (dSa + dPa)
        fz = fZ if embed else 0.0
        asm = _joint_network(dSa, dPa, n, misfit, 0.0)
        emb = _joint_network(dSa, dPa, n, misfit, -fz)
        hot = _joint_network(sp_s.delta_S, sp_s.delta_P, n, misfit + th_bolt, th_clamp - fz)
        out = {
            "assembly": _solve(asm, 0.0),
            "embedded": _solve(emb, 0.0),
            "temperature": _solve(hot, 0.0),
            "service_max": _solve(hot, FA_hi),
        }
        if FA_lo != FA_hi:
            out["service_min"] = _solve(hot, FA_lo)
        return out

    lo = branch(FM_min, embed=True)
    hi = branch(FM_max, embed=False)
    labels = {
        "assembly": ("assembly", 0.0),
        "embedded": ("after embedding", 0.0),
        "temperature": ("at service temperature", 0.0),
        "service_max": ("in service, maximum load", FA_hi),
        "service_min": ("in service, minimum load", FA_lo),
    }
    states = tuple(
        State(key, labels[key][0], lo[key][0], hi[key][0], lo[key][1], hi[key][1], labels[key][1])
        for key in lo
    )
    thermal_change = lo["temperature"][0] - lo["embedded"][0]
    thermal_change_max = hi["temperature"][0] - hi["embedded"][0]
    FV_T = lo["temperature"][0]
    separation_load = FV_T / (1.0 - phi_n_s) if phi_n_s < 1.0 else math.inf
    bolt_load_max = max(v[0] for v in hi.values())
    residual_min = min(v[1] for key, v in lo.items() if key.startswith("service"))

    # --- requirements: clamp load (VDI 2230-1 R2) and minimum assembly preload (R5)
    FQ = srv.shear_load
    slip_need = FQ * rq.slip_safety / rq.slip_friction if FQ > 0 else 0.0
    FKerf = max(rq.residual_clamp_load, slip_need)
    thermal_loss = max(0.0, -thermal_change)
    required_FM = FKerf + (1 - phi_n_s) * max(FA_hi, 0.0) + FZ + thermal_loss

    # --- checks
    checks: list[Check] = []
    skip = dict(spec.skips)

    def add(c: Check) -> None:
        if c.name in skip:
            c = Check(
                c.name,
                c.title,
                c.value,
                c.limit,
                c.unit,
                c.relation,
                c.source,
                c.detail,
                skip[c.name],
            )
        checks.append(c)

    nu_used = 1.0 if tr.method in ("yield", "angle") else tr.utilization
    add(
        Check(
            "assembly_preload",
            "Maximum assembly preload within the permissible preload",
            FM_max / 1e3,
            FMzul / 1e3,
            "kN",
            "<=",
            f"VDI 2230-1:2015, 5.5.1, R7 (F_M,zul at nu = {nu_used:g}, mu_G,min = {muG_lo:g})",
            f"F_M,max = {FM_max / 1e3:.4g} kN, F_M,zul = {FMzul / 1e3:.4g} kN",
        )
    )
    MG = 0.0 if tr.method == "tension" else float(thread_torque(FM_max, thr.P, thr.d2, muG_lo))
    ws = working_stress(bolt_load_max, A0, MG, d0, 0.0 if tr.method == "tension" else 0.5)
    add(
        Check(
            "working_stress",
            "Equivalent stress in service below the yield point",
            float(ws.sigma_red) / 1e6,
            Rp / 1e6,
            "MPa",
            "<=",
            "VDI 2230-1:2015, 5.5.2, R8 (sigma_red,B with k_tau = 0.5)",
            f"sigma_z = {float(ws.sigma) / 1e6:.4g} MPa, tau = {float(ws.tau) / 1e6:.4g} MPa",
        )
    )
    if FA_lo != FA_hi:
        amp = max(
            abs(lo["service_max"][0] - lo["service_min"][0]),
            abs(hi["service_max"][0] - hi["service_min"][0]),
        ) / (2 * thr.As)
        sASV = float(endurance_rolled_before_heat_treatment(thr.d))
        endurance, how = sASV, "rolled before heat treatment"
        if b.rolled == "after":
            FSm = 0.5 * (lo["service_max"][0] + lo["service_min"][0])
            ratio = FSm / (thr.As * Rp)
            ratio = min(max(ratio, 0.3 + 1e-12), 1.0)
            endurance = float(
                endurance_rolled_after_heat_treatment(thr.d, ratio * thr.As * Rp, thr.As * Rp)
            )
            how = "rolled after heat treatment"
        add(
            Check(
                "fatigue",
                "Stress amplitude below the endurance limit of the thread",
                amp / 1e6,
                endurance / rq.fatigue_safety / 1e6,
                "MPa",
                "<=",
                f"VDI 2230-1:2015, 5.5.3, R9 (sigma_ASV, {how}; S_D = {rq.fatigue_safety:g}; "
                "formulas from memory)",
                f"endurance {endurance / 1e6:.4g} MPa",
            )
        )
    else:
        notes.append("Fatigue not checked: the axial load does not alternate.")
    if rq.residual_clamp_load > 0:
        add(
            Check(
                "residual_clamp_load",
                "Residual clamp load at least the required clamp load",
                residual_min / 1e3,
                rq.residual_clamp_load / 1e3,
                "kN",
                ">=",
                "VDI 2230-1:2015, 5.5.4, R2/R11 (F_KR,min >= F_Kerf)",
            )
        )
    if FA_hi > 0:
        add(
            Check(
                "separation",
                "No separation of the clamped parts under the maximum load",
                separation_load / 1e3 if math.isfinite(separation_load) else 1e12,
                FA_hi / 1e3,
                "kN",
                ">=",
                "VDI 2230-1:2015, 5.3.2 (F_A,sep = F_V / (1 - Phi_n)); joint diagram",
                f"residual clamp load {residual_min / 1e3:.4g} kN at F_A,max = {FA_hi / 1e3:.4g} kN",
            )
        )
    if FQ > 0:
        add(
            Check(
                "slip",
                "Residual clamp load carries the transverse load by friction",
                residual_min / 1e3,
                slip_need / 1e3,
                "kN",
                ">=",
                f"VDI 2230-1:2015, 5.5.6, R12 (F_KQerf = F_Q/(q_F mu_T), S_G = {rq.slip_safety:g}; "
                "from memory)",
                f"mu_T = {rq.slip_friction:g}, F_Q = {FQ / 1e3:.4g} kN",
            )
        )
    _surface_checks(spec, bolt_load_max, add, notes)
    _stripping_check(spec, add, notes)

    # F_M,min is proportional to the nominal torque: the smallest torque for the requirement
    torque_required = None
    if tr.method == "torque" and torque is not None:
        torque_required = required_FM * torque[0] / FM_min

    defaults = spec.defaults
    if tr.method == "torque" and tr.torque is None and tr.preload is None:
        notes.append(
            "No torque or preload given: the torque is set so that the maximum preload "
            "reaches the permissible preload (VDI 2230-1 R13)."
        )
    return JointResult(
        spec=spec,
        springs=sp_a,
        springs_service=sp_s,
        load_factor=phi_n,
        load_factor_service=phi_n_s,
        A0=A0,
        d0=d0,
        permissible_preload=FMzul,
        assembly_min=FM_min,
        assembly_max=FM_max,
        alpha_A=alpha,
        alpha_A_basis=basis,
        torque=torque,
        torque_required=torque_required,
        embedding_amount=fZ,
        embedding_loss=FZ,
        thermal_change=thermal_change,
        thermal_change_max=thermal_change_max,
        states=states,
        separation_load=separation_load,
        bolt_load_max=bolt_load_max,
        residual_clamp_min=residual_min,
        required_assembly_min=required_FM,
        required_clamp_load=FKerf,
        checks=tuple(checks),
        notes=tuple(notes),
        assumptions=tuple(assumptions),
        defaults=defaults,
    )


_MODEL_NAMES = {
    "vdi2230": "VDI 2230-1 pressure cone / sleeve model (5.1.2)",
    "shigley": "Shigley 30-degree frustum model (Mechanical Engineering Design, ch. 8)",
    "wileman": "Wileman, Choudhury and Green (1991) exponential fit",
}


def _surface_checks(spec: JointSpec, F: float, add, notes: list[str]) -> None:
    """Surface pressure under head and nut (VDI 2230-1:2015, 5.5.5, R10)."""
    b = spec.bolt
    sides = [("surface_pressure_head", "head", b.bearing_diameter, spec.layers[:2])]
    if spec.nut is not None:
        sides.append(
            (
                "surface_pressure_nut",
                "nut",
                spec.nut.bearing_diameter,
                tuple(reversed(spec.layers[-2:])),
            )
        )
    for name, where, dW, stack in sides:
        worst: tuple[float, float, str] | None = None
        missing = []
        # the part under the bearing face, then (behind a washer) the part under the washer
        bearing_d = dW
        for lay in stack:
            area = math.pi / 4 * (bearing_d**2 - lay.hole**2)
            if area <= 0:
                break
            p = F / area
            if lay.limiting_pressure is None:
                missing.append(lay.name)
            else:
                margin = lay.limiting_pressure / p
                if worst is None or margin < worst[1] / worst[0]:
                    worst = (p, lay.limiting_pressure, lay.name)
            if lay.kind != "washer" or lay.outer_diameter is None:
                break
            bearing_d = lay.outer_diameter
        if missing:
            notes.append(
                f"Surface pressure under the {where} not checked on {', '.join(missing)}: "
                "no limiting pressure for its material (give limiting_pressure)."
            )
        if worst is not None:
            p, pG, part = worst
            add(
                Check(
                    name,
                    f"Surface pressure under the {where} below the limiting pressure",
                    p / 1e6,
                    pG / 1e6,
                    "MPa",
                    "<=",
                    "VDI 2230-1:2015, 5.5.5, R10 (p_G guide values, table from memory)",
                    f"on {part}, at the maximum bolt load {F / 1e3:.4g} kN",
                )
            )


def _stripping_check(spec: JointSpec, add, notes: list[str]) -> None:
    """Engagement length against thread stripping (VDI 2230-1 R11 with Alexander's method)."""
    thr, grd = spec.bolt.thread, spec.bolt.grade
    if spec.tapped_hole is not None:
        th = spec.tapped_hole
        Le, Rm, ratio, where = th.engagement, th.Rm, th.shear_ratio, "tapped hole"
    else:
        assert spec.nut is not None
        nut = spec.nut
        Le, Rm, ratio, where = nut.height, nut.Rm, nut.shear_ratio, "nut"
    need = float(minimum_engagement(thr.d, thr.P, thr.As, grd.Rm, Rm, ratio, shear_ratio_bolt=0.6))
    add(
        Check(
            "thread_stripping",
            f"Thread engagement in the {where} long enough not to strip",
            Le * 1e3,
            need * 1e3,
            "mm",
            ">=",
            "VDI 2230-1:2015, 5.5.5, R11 / Alexander (SAE 770420); shear areas FED-STD-H28/2 "
            "basic profile; shear ratios from memory",
            f"internal thread R_m = {Rm / 1e6:.4g} MPa, tau_B/R_m = {ratio:g}; "
            "bolt should break before the thread strips",
        )
    )
