"""Single-bolt joint analysis: springs, tightening, states and the check chain.

The joint is an axial spring network (VDI 2230-1:2015, section 5.3; the joint
diagram of section 5.3.1, reproduced with the network instead of the closed
form):

* the bolt (resilience ``delta_S``, VDI 2230-1 section 5.1.1) between the head
  bearing ``H`` and the nut bearing (or tapped thread) ``N``, tension only;
* the clamped parts (``delta_P``, section 5.1.2) between the same planes, split
  at the load introduction planes ``A`` and ``B`` into ``(1 - n)/2 delta_P``,
  ``n delta_P``, ``(1 - n)/2 delta_P`` (the load introduction factor ``n`` of
  section 5.2.2); the middle part, which contains the interface, carries
  compression only, so separation comes out of the solve exactly;
* the preload is a length misfit of the bolt, embedding a shortening of the
  clamped stack, temperature a free thermal elongation of every part with the
  moduli at each part's temperature (:mod:`clampstack.joint.thermal`);
* the axial working load ``F_A`` pulls ``A`` and ``B`` apart.

Two branches are followed: the minimum assembly preload with embedding (which
governs the residual clamp load) and the maximum assembly preload without
embedding (which governs bolt stress; VDI 2230-1 does the same in step R8).

The check chain (:func:`evaluate_checks`) works on floats or on numpy arrays, so
the same rules serve ``check`` (one state, from the network) and ``sweep``
(many temperatures, from the closed form of the same network).
"""

from __future__ import annotations

import math
from dataclasses import dataclass, field, replace
from typing import Any

import numpy as np

from ..catalog import yield_at_temperature
from ..components import (
    bolt_shear_ratio,
    endurance_rolled_after_heat_treatment,
    endurance_rolled_before_heat_treatment,
    nut_dilation_factor,
    stripping_engagement,
)
from ..display import Shown
from ..errors import InputError
from .checks import Check
from .eccentric import (
    ContactState,
    EccentricJoint,
    bolt_bending_stress,
    first_opening_edge,
)
from .model import JointSpec
from .prepare import (
    Prepared,
    Springs,
    State,
    check_bolt_loads,
    joint_network,
    prepare,
    service_preload,
    solve_service,
)
from .thermal import TemperatureModel, part_modulus

#: Checks whose value depends on the check preload (VDI 2230-1 R8-R10).
BASIS_CHECKS = ("working_stress", "fatigue", "surface_pressure_head", "surface_pressure_nut")
BASIS_NAMES = {
    "permissible": "permissible preload F_M,zul",
    "actual": "actual maximum preload F_M,max",
    "yield": "maximum yield-controlled preload F_M,max",
}

# --------------------------------------------------------------------------- checks


@dataclass(frozen=True)
class CheckRow:
    """A check before it is bound to floats: value and limit may be arrays."""

    name: str
    title: str
    value: Any
    limit: Any
    unit: str
    relation: str
    source: str
    detail: str = ""
    extra: dict[str, Any] | None = None  # further JSON keys of the check


def evaluate_checks(
    prep: Prepared,
    T_bolt: Any,
    FM_check: float,
    bolt_load_max: Any,
    amplitude: Any | None,
    bolt_load_mean: Any | None,
    residual_min: Any,
    separation_load: Any,
    opening: CheckRow | None = None,
    fatigue_detail: str = "",
    opening_clamp_load: float = 0.0,
) -> tuple[list[CheckRow], list[str]]:
    """The check chain on floats or arrays (VDI 2230-1 R7-R12); returns rows and notes.

    ``FM_check`` is the assembly preload of R8-R10 (:meth:`Prepared.check_preload`);
    ``bolt_load_max`` and ``bolt_load_mean`` come from it (:func:`check_bolt_loads`).
    ``opening`` (eccentric joints, :func:`opening_row`) takes the place of ``separation``.
    """
    s = prep.spec
    b, tr, srv, rq = s.bolt, s.tightening, s.service, s.requirements
    thr, grd = b.thread, b.grade
    notes: list[str] = []
    rows: list[CheckRow] = []
    yield_method = tr.method == "yield" or (
        tr.method == "angle" and prep.method_info is not None and prep.method_info["yields_max"]
    )
    if yield_method:
        notes.append(
            "Assembly preload not checked against F_M,zul: the bolt is tightened to its "
            "yield point by design."
        )
    else:
        mu_text = (
            "no torsion" if tr.method == "tension" else f"mu_G,min = {tr.thread_friction[0]:g}"
        )
        tension = tr.method == "tension" and prep.method_info is not None
        rows.append(
            CheckRow(
                "assembly_preload",
                "Largest applied tension within the permissible preload"
                if tension
                else "Maximum assembly preload within the permissible preload",
                (prep.method_info["applied_tension_max_N"] if tension else prep.assembly_max) / 1e3,
                prep.permissible_preload / 1e3,
                "kN",
                "<=",
                f"VDI 2230-1:2015, 5.5.1, R7 (F_M,zul at nu = {tr.utilization:g}, {mu_text})",
            )
        )
    Rp_T, basis = yield_at_temperature(grd, T_bolt)
    if yield_method:  # preload tied to the bolt's yield: the strongest bolt of the lot
        Rp_T = 1.2 * np.asarray(Rp_T)
        basis += "; x 1.2 for the strongest bolt of a yield-tightened lot (from memory)"
    sigma = bolt_load_max / prep.A0
    tau = prep.k_tau * prep.thread_torque_factor * FM_check / (math.pi * prep.d0**3 / 16)
    sred = np.sqrt(sigma**2 + 3 * tau**2)
    rows.append(
        CheckRow(
            "working_stress",
            "Equivalent stress in service below the yield point",
            sred / 1e6,
            np.asarray(Rp_T) / 1e6,
            "MPa",
            "<=",
            f"VDI 2230-1:2015, 5.5.2, R8 (sigma_red,B with k_tau = {prep.k_tau:g}); yield: {basis}",
        )
    )
    if amplitude is not None:
        if grd.name not in ("8.8", "9.8", "10.9", "12.9"):
            notes.append(
                f"Fatigue: the VDI 2230-1 endurance formula is given for property classes "
                f"8.8 to 12.9; for grade {grd.name} it is only a guide."
            )
        sASV = float(endurance_rolled_before_heat_treatment(thr.d))
        endurance, how = sASV, "rolled before heat treatment"
        if b.rolled == "after":
            F02 = thr.As * grd.Rp02
            ratio = np.clip(bolt_load_mean / F02, 0.3 + 1e-12, 1.0)
            endurance = endurance_rolled_after_heat_treatment(thr.d, ratio * F02, F02)
            how = "rolled after heat treatment"
        rows.append(
            CheckRow(
                "fatigue",
                "Stress amplitude below the endurance limit of the thread",
                amplitude / 1e6,
                np.asarray(endurance) / rq.fatigue_safety / 1e6,
                "MPa",
                "<=",
                f"VDI 2230-1:2015, 5.5.3, R9 (sigma_ASV, {how}; S_D = {rq.fatigue_safety:g}; "
                "formulas from memory)",
                fatigue_detail,
            )
        )
    else:
        notes.append("Fatigue not checked: the axial load does not alternate.")
    FA_lo, FA_hi = srv.axial_load
    if rq.residual_clamp_load > 0:
        # an eccentric joint needs the clamp load against opening on top (R2: F_KP + F_KA)
        rows.append(
            CheckRow(
                "residual_clamp_load",
                "Residual clamp load at least the required clamp load",
                residual_min / 1e3,
                (rq.residual_clamp_load + opening_clamp_load) / 1e3,
                "kN",
                ">=",
                "VDI 2230-1:2015, 5.5.4, R2/R11 (F_KR,min >= F_Kerf"
                + (" = F_KP + F_Kab, eccentric)" if opening is not None else ")"),
            )
        )
    if opening is not None:
        rows.append(opening)
    elif FA_hi > 0:
        rows.append(
            CheckRow(
                "separation",
                "No separation of the clamped parts under the maximum load",
                separation_load / 1e3,
                FA_hi / 1e3,
                "kN",
                ">=",
                "VDI 2230-1:2015, 5.3.2 (F_A,sep = F_V / (1 - Phi_n)); joint diagram",
            )
        )
    FQ = srv.shear_load
    if FQ > 0:
        need = FQ * rq.slip_safety / rq.slip_friction
        rows.append(
            CheckRow(
                "slip",
                "Residual clamp load carries the transverse load by friction",
                residual_min / 1e3,
                need / 1e3,
                "kN",
                ">=",
                f"VDI 2230-1:2015, 5.5.6, R12 (F_KQerf = F_Q/(q_F mu_T), S_G = {rq.slip_safety:g}; "
                "from memory)",
                f"mu_T = {rq.slip_friction:g}, F_Q = {FQ / 1e3:.4g} kN",
            )
        )
    rows.extend(_surface_rows(s, bolt_load_max, notes))
    rows.append(_stripping_row(s, notes))
    return rows, notes


def _surface_rows(spec: JointSpec, F: Any, notes: list[str]) -> list[CheckRow]:
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
    rows = []
    for name, where, dW, stack in sides:
        # the part under the bearing face, then (behind a washer) the part under the washer:
        # the face with the least ratio p_G / area governs at every load
        best: tuple[float, float, str] | None = None
        missing = []
        bearing_d = dW
        for lay in stack:
            outer = min(bearing_d, lay.outer_diameter) if lay.outer_diameter else bearing_d
            area = math.pi / 4 * (outer**2 - lay.hole**2)
            if area <= 0:
                break
            if lay.limiting_pressure is None:
                missing.append(lay.name)
            elif best is None or lay.limiting_pressure * area < best[0] * best[1]:
                best = (area, lay.limiting_pressure, lay.name)
            if lay.kind != "washer" or lay.outer_diameter is None:
                break
            bearing_d = lay.outer_diameter
        if missing:
            notes.append(
                f"Surface pressure under the {where} not checked on {', '.join(missing)}: "
                "no limiting pressure for its material (give limiting_pressure)."
            )
        if best is not None:
            area, pG, part = best
            rows.append(
                CheckRow(
                    name,
                    f"Surface pressure under the {where} below the limiting pressure",
                    F / area / 1e6,
                    pG / 1e6,
                    "MPa",
                    "<=",
                    "VDI 2230-1:2015, 5.5.5, R10 (p_G guide values, table from memory)",
                    f"on {part}, at the maximum bolt load",
                )
            )
    return rows


#: Customary minimum engagement of a tapped thread by material family, in diameters
#: (common practice, no source; e.g. 1 d in steel, 1.25 d in cast iron, 2 d in light alloys).
CUSTOMARY_ENGAGEMENT: tuple[tuple[str, float, str], ...] = (
    ("aluminium", 2.0, "aluminium"),
    ("magnesium", 2.0, "magnesium"),
    ("cast-iron", 1.25, "cast iron"),
    ("steel", 1.0, "steel"),
    ("stainless", 1.0, "steel"),
    ("titanium", 1.0, "titanium"),
)


def _stripping_row(spec: JointSpec, notes: list[str]) -> CheckRow:
    """Engagement against thread stripping: VDI 2230-1:2015 5.5.5.2 with Alexander's C1-C3."""
    thr, grd = spec.bolt.thread, spec.bolt.grade
    tau_S_ratio, tau_S_src = bolt_shear_ratio(grd.name)
    if spec.tapped_hole is not None:
        th = spec.tapped_hole
        Le, Rm, ratio, where, mat = th.engagement, th.Rm, th.shear_ratio, "tapped hole", th.material
        C1, c1_text = 1.0, "C1 = 1 (tapped hole)"
    else:
        assert spec.nut is not None
        nut = spec.nut
        Le, Rm, ratio, where, mat = nut.height, nut.Rm, nut.shear_ratio, "nut", nut.material
        C1 = float(nut_dilation_factor(nut.across_flats, thr.d))
        c1_text = f"C1 = {C1:.3g} (s/d = {nut.across_flats / thr.d:.3g})"
    st = stripping_engagement(
        thr.d, thr.P, thr.As, grd.Rm, tau_S_ratio * grd.Rm, ratio * Rm, C1, d2=thr.d2, D1=thr.d1
    )
    d = thr.d
    if spec.tapped_hole is not None and mat.material is not None:
        key = mat.material.key
        for prefix, k, family in CUSTOMARY_ENGAGEMENT:
            if key.startswith(prefix) and Le < k * d * (1 - 1e-9):
                notes.append(
                    f"Thread engagement {Le * 1e3:.3g} mm = {Le / d:.2g} d in {family}: below the "
                    f"customary minimum of about {k:g} d ({k * d * 1e3:.3g} mm) for tapped threads "
                    "in that material (common practice, no source), even where the stripping "
                    "check passes."
                )
                break
    elif spec.nut is not None and Le < 0.8 * d * (1 - 1e-9):
        notes.append(
            f"Nut height {Le * 1e3:.3g} mm is below 0.8 d, the height of a standard nut "
            "(ISO 898-2 style 1 nuts have m >= 0.8 d; common practice for a thin nut: it may "
            "strip before the bolt breaks)."
        )
    return CheckRow(
        "thread_stripping",
        f"Thread engagement in the {where} long enough not to strip",
        Le * 1e3,
        st.required * 1e3,
        "mm",
        ">=",
        "VDI 2230-1:2015, 5.5.5.2 after Alexander (SAE 770420): minimum effective "
        "engagement with nut dilation C1 and thread bending C2, C3 (relations from memory); "
        "basic-profile shear areas",
        f"governing: {st.governing}; {c1_text}, C2 = {st.C2:.3g}, C3 = {st.C3:.3g}, "
        f"R_S = {st.strength_ratio:.3g}; internal thread R_m = {Rm / 1e6:.4g} MPa, "
        f"tau_B/R_m = {ratio:g}; bolt R_m,min = {grd.Rm / 1e6:.4g} MPa, tau_B/R_m = "
        f"{tau_S_ratio:g} ({tau_S_src}); engagement taken as effective (full threads)",
        extra={
            "required_engagement_mm": st.required * 1e3,
            "internal_thread_engagement_mm": st.internal * 1e3,
            "bolt_thread_engagement_mm": st.external * 1e3,
            "C1": st.C1,
            "C2": st.C2,
            "C3": st.C3,
            "strength_ratio": st.strength_ratio,
            "governing": st.governing,
        },
    )


def margins(rows: list[CheckRow]) -> dict[str, np.ndarray]:
    """Margin of every row (same rule as :attr:`Check.margin`), vectorised."""
    out = {}
    for r in rows:
        v = np.asarray(r.value, dtype=float)
        lim = np.asarray(r.limit, dtype=float)
        with np.errstate(divide="ignore", invalid="ignore"):
            if r.relation == "<=":
                m = np.where(v > 0, lim / np.where(v > 0, v, 1.0) - 1.0, np.inf)
            else:
                m = np.where(lim > 0, v / np.where(lim > 0, lim, 1.0) - 1.0, np.inf)
        out[r.name] = m
    return out


# --------------------------------------------------------------------------- result


@dataclass(frozen=True)
class JointResult(Shown):
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
    check_basis: str  # "permissible", "actual" or "yield" (Prepared.check_basis)
    check_preload: float  # F_M of the checks R8-R10 [N]
    bolt_load_max_actual: float  # F_S,max from F_M,max [N]
    bolt_load_max_permissible: float  # F_S,max from F_M,zul [N] (F_M,max when yield-tightened)
    checks: tuple[Check, ...]
    notes: tuple[str, ...]
    assumptions: tuple[str, ...]
    defaults: tuple[tuple[str, str], ...] = field(default=())
    cycle: Any = None  # permanent-loss cycle (clampstack.joint.plastic.CycleResult)
    angle: dict[str, Any] | None = None  # method angle (Prepared.method_info)
    tension: dict[str, Any] | None = None  # method tension: load transfer (Prepared.method_info)
    eccentric: dict[str, Any] | None = None  # eccentric clamping and loading (eccentric_summary)
    eccentric_joint: EccentricJoint | None = None  # at service temperature (for the figures)
    cases: tuple[Any, ...] = ()  # [[case]]: CaseResult per case (clampstack.joint.cases)
    governing_case: str | None = None  # the case this result's states come from

    @property
    def preload_at_limit_by_design(self) -> bool:
        """True when no torque or preload was given: F_M,max was set to F_M,zul."""
        tr = self.spec.tightening
        return tr.torque is None and tr.preload is None

    @property
    def governing(self) -> Check | None:
        """The active check with the smallest margin, or None.

        When the torque was derived from the permissible preload, the assembly-preload
        check sits at its limit by construction and is not reported as governing.
        """
        active = [c for c in self.checks if c.skipped is None]
        if self.preload_at_limit_by_design:
            active = [c for c in active if c.name != "assembly_preload"] or active
        return min(active, key=lambda c: c.margin) if active else None

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
        keys = ("nominal_Nm", "min_Nm", "max_Nm")
        torque: dict[str, float | None] = dict.fromkeys(keys)
        if self.torque is not None:
            torque = dict(zip(keys, self.torque, strict=True))
        torque["required_min_Nm"] = self.torque_required
        out = {
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
                "torque_tolerance": s.tightening.torque_tolerance,
                "lubricant": s.tightening.lubricant,
                "tool": s.tightening.tool,
                "nut_factor": None
                if s.tightening.nut_factor is None
                else list(s.tightening.nut_factor),
                **(
                    {
                        "snug_torque_Nm": s.tightening.snug_torque,
                        "angle_deg": [math.degrees(a) for a in s.tightening.angle or ()],
                        "angle_tolerance_deg": math.degrees(s.tightening.angle_tolerance),
                        "angle": self.angle,
                    }
                    if s.tightening.method == "angle"
                    else {}
                ),
                **(self.tension or {}),
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
                "check_basis": self.check_basis,
                "check_preload_N": self.check_preload,
            },
            "torque": torque,
            "service": {
                "axial_load_min_N": s.service.axial_load[0],
                "axial_load_max_N": s.service.axial_load[1],
                "shear_load_N": s.service.shear_load,
                "temperature_degC": s.service.temperature - 273.15,
                "assembly_temperature_degC": s.service.assembly_temperature - 273.15,
                "bolt_load_max_N": self.bolt_load_max,
                "bolt_load_max_actual_N": self.bolt_load_max_actual,
                "bolt_load_max_permissible_N": self.bolt_load_max_permissible,
                "residual_clamp_load_min_N": self.residual_clamp_min,
                "required_clamp_load_N": self.required_clamp_load,
                "separation_load_N": None if self.eccentric else self.separation_load,
                **(
                    {
                        "bending_moment_min_Nm": s.service.bending_moment[0],
                        "bending_moment_max_Nm": s.service.bending_moment[1],
                        "opening_clamp_load_N": self.eccentric["opening_clamp_load_N"],
                        "opening_load_N": self.eccentric["opening_load_N"],
                    }
                    if self.eccentric
                    else {}
                ),
            },
            "states": states,
            "checks": [c.to_dict() for c in self.checks],
            "ok": self.ok,
            "notes": list(self.notes),
            "assumptions": list(self.assumptions),
            "defaults": dict(self.defaults),
        }
        if self.cases:
            out["governing_case"] = self.governing_case
            out["cases"] = [c.to_dict() for c in self.cases]
        if self.eccentric is not None:
            out["eccentric"] = {
                k: v
                for k, v in self.eccentric.items()
                if k not in ("notes", "knee_N", "axial_load_max_N")
            }
        if self.cycle is not None:
            out["preload"]["after_cycle_min_N"] = self.cycle.preload_after[0]
            out["preload"]["after_cycle_max_N"] = self.cycle.preload_after[1]
            out["preload"]["permanent_loss_N"] = self.cycle.permanent_loss
        return out


PLASTIC_SOURCE = (
    "VDI 2230-1:2015, 5.5.2 (R8) and 5.4.2 (R5): the joint is designed to stay elastic in "
    "service; elastic-perfectly-plastic bolt and bearing faces in the joint's spring network "
    "(our model)"
)


def plastic_checks(cycle: Any, skip: dict[str, str]) -> tuple[Check, ...]:
    """Checks from the elastic-plastic cycle: a collapse, or a permanent preload loss, fails.

    ``cycle`` is the :class:`~clampstack.joint.plastic.CycleResult` from assembly to the
    largest service load and temperature and back, or None where no equilibrium exists
    (plastic collapse).  ``plastic_collapse``: value 1 where a collapse was found, limit 0.
    ``cycle_yield``: the permanent preload loss [kN], limit 0.
    """
    collapse = Check(
        "plastic_collapse",
        "Equilibrium under the largest service load with yielding bolt and bearing faces",
        1.0 if cycle is None else 0.0,
        0.0,
        "",
        "<=",
        PLASTIC_SOURCE,
        "1: no equilibrium exists (plastic collapse); 0: the joint holds",
        skip.get("plastic_collapse"),
    )
    out = [collapse]
    if cycle is not None:
        out.append(
            Check(
                "cycle_yield",
                "No permanent preload loss from yielding between assembly, service and back",
                cycle.permanent_loss / 1e3,
                0.0,
                "kN",
                "<=",
                PLASTIC_SOURCE,
                f"yielded: {', '.join(cycle.yielded) or 'nothing'}",
                skip.get("cycle_yield"),
            )
        )
    return tuple(out)


def springs(spec: JointSpec, service: bool) -> Springs:
    """Bolt and clamped-part resilience at assembly (``service=False``) or service temperatures."""
    model = TemperatureModel(spec)
    if not service:
        dS, dP = model.resiliences_at_assembly()
        return Springs(dS, dP, tuple(model.segment_resiliences()))
    dS, dP = model.resiliences(model.T_service)
    return Springs(float(dS), float(dP), tuple(model.segment_resiliences(model.T_service)))


# --------------------------------------------------------------------------- analysis


def analyse(spec: JointSpec) -> JointResult:
    """Analyse and check a single-bolt joint (VDI 2230-1 calculation steps R0-R13).

    With ``[[case]]`` load cases: every case, and the governing values
    (:func:`clampstack.joint.cases.analyse_cases`).
    """
    if spec.cases:
        from .cases import CaseResult, case_spec, merge_cases

        results = []
        for i, case in enumerate(spec.cases):
            try:
                results.append(CaseResult(case.name, analyse(case_spec(spec, case))))
            except InputError as err:
                raise InputError(
                    f"case {case.name!r}: {err.detail}", key=f"case[{i + 1}]"
                ) from None
        return merge_cases(spec, results)
    prep = prepare(spec)
    srv, rq = spec.service, spec.requirements
    model = prep.model
    sp_a = prep.springs
    dSa, dPa = sp_a.delta_S, sp_a.delta_P
    T_srv = srv.temperature
    dSs, dPs = (float(x) for x in model.resiliences(T_srv))
    sp_s = Springs(dSs, dPs, tuple(model.segment_resiliences(T_srv)))
    n = srv.load_height
    phi_n = n * sp_a.load_factor_K
    phi_n_s = n * sp_s.load_factor_K
    th_bolt, th_clamp = (float(x) for x in model.thermal(T_srv))
    FA_lo, FA_hi = srv.axial_load
    MB_lo, MB_hi = srv.bending_moment
    fZ = prep.embedding_amount
    ecc = eccentric_joints(spec, model) if spec.eccentric is not None else None
    contact: dict[tuple[str, str], ContactState] = {}
    if ecc is not None:
        phi_n, phi_n_s = ecc[0].phi_en, ecc[1].phi_en

    def branch(FM: float, embed: bool) -> dict[str, tuple[float, float]]:
        misfit = -FM * (dSa + dPa)
        fz = fZ if embed else 0.0
        asm = joint_network(dSa, dPa, n, misfit, 0.0)
        emb = joint_network(dSa, dPa, n, misfit, -fz)
        hot = joint_network(dSs, dPs, n, misfit + th_bolt, th_clamp - fz)
        out = {
            "assembly": solve_service(asm, 0.0),
            "embedded": solve_service(emb, 0.0),
            "temperature": solve_service(hot, 0.0),
        }
        loads = {"service_max": (FA_hi, MB_hi)}
        if (FA_lo, MB_lo) != (FA_hi, MB_hi):
            loads["service_min"] = (FA_lo, MB_lo)
        for key, (fa, mb) in loads.items():
            if ecc is None:
                out[key] = solve_service(hot, fa)
            else:  # the VDI linear relations, or the contact model past opening
                st = ecc[1].state(out["temperature"][0], fa, mb)
                contact[("min" if embed else "max", key)] = st
                out[key] = (st.bolt_load, st.clamp_load)
        return out

    lo = branch(prep.assembly_min, embed=True)
    hi = branch(prep.assembly_max, embed=False)
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
    FV_T = lo["temperature"][1]  # clamp load at service temperature, no working load
    separation_load = max(FV_T, 0.0) / (1.0 - phi_n_s) if phi_n_s < 1 else 0.0
    residual_min = min(v[1] for key, v in lo.items() if key.startswith("service"))
    ecc_info = None
    if ecc is not None:
        ecc_info = eccentric_summary(spec, model, ecc[1], FV_T, contact)
        separation_load = ecc_info["knee_N"]

    def check_loads(FM: float) -> tuple[float, float]:
        # R8-R10 loads from the check preload (VDI 2230-1 rule of the thermal term)
        FV_hot = service_preload(FM, dSa + dPa, dSs + dPs, th_bolt - th_clamp)
        if ecc is not None:
            FV = max(float(FV_hot), FM)
            up = ecc[1].state(FV, FA_hi, MB_hi).bolt_load
            down = ecc[1].state(FV, FA_lo, MB_lo).bolt_load
            return max(FM, FV, up, down), 0.5 * (up + down)
        bm, mean_load = check_bolt_loads(FM, FV_hot, phi_n_s, FA_lo, FA_hi)
        return float(bm), float(mean_load)

    FM_check = prep.check_preload()
    bolt_load_max, mean_check = check_loads(FM_check)

    # requirements: clamp load (VDI 2230-1 R2) and minimum assembly preload (R5)
    FQ = srv.shear_load
    slip_need = FQ * rq.slip_safety / rq.slip_friction if FQ > 0 else 0.0
    load_loss = (1 - phi_n_s) * max(FA_hi, 0.0)
    opening = None
    FKab_req = 0.0
    fatigue_detail = ""
    if ecc_info is not None:
        # VDI 2230-1 R2: F_Kerf >= max(F_KQ, F_KP + F_KA), F_KA the clamp load against opening
        FKab_req = ecc_info["opening_clamp_load_N"] or 0.0
        FKerf = max(rq.residual_clamp_load + FKab_req, slip_need)
        load_loss = max(
            (1 - phi_n_s) * FA_hi - ecc[1].phi_m * MB_hi,
            (1 - phi_n_s) * FA_lo - ecc[1].phi_m * MB_lo,
            0.0,
        )
        opening = opening_row(ecc_info, residual_min)
    else:
        FKerf = max(rq.residual_clamp_load, slip_need)
    thermal_loss = max(0.0, -thermal_change)
    required_FM = FKerf + load_loss + prep.embedding_loss + thermal_loss

    amplitude = mean = None
    alternating = (FA_lo, MB_lo) != (FA_hi, MB_hi)
    if alternating:
        amplitude = max(
            abs(lo["service_max"][0] - lo["service_min"][0]),
            abs(hi["service_max"][0] - hi["service_min"][0]),
        ) / (2 * spec.bolt.thread.As)
        mean = mean_check
        if ecc_info is not None:
            bend = ecc_info["bending_amplitude_MPa"] * 1e6
            fatigue_detail = (
                f"axial {amplitude / 1e6:.4g} MPa + bending {bend / 1e6:.4g} MPa "
                "(VDI 2230-1:2015, 5.5.3, sigma_SAb; eccentric)"
            )
            amplitude = amplitude + bend
    T_b = spec.bolt.temperature
    rows, check_notes = evaluate_checks(
        prep,
        T_b,
        FM_check,
        bolt_load_max,
        amplitude,
        mean,
        residual_min,
        separation_load,
        opening,
        fatigue_detail,
        FKab_req,
    )
    # the same checks with the other preload, shown beside them as information
    basis = prep.check_basis
    other = {"permissible": "actual", "actual": "permissible"}.get(basis)
    info: dict[str, dict[str, Any]] = {}
    bolt_load_max_other = bolt_load_max
    if other is not None:
        FM_o = prep.check_preload(other)
        bolt_load_max_other, mean_o = check_loads(FM_o)
        rows_o, _ = evaluate_checks(
            prep,
            T_b,
            FM_o,
            bolt_load_max_other,
            amplitude,
            mean_o if alternating else None,
            residual_min,
            separation_load,
            opening,
            fatigue_detail,
            FKab_req,
        )
        m_o = margins(rows_o)
        for r in rows_o:
            if r.name in BASIS_CHECKS:
                mo = float(m_o[r.name])
                info[r.name] = {
                    "basis": other,
                    "preload_N": FM_o,
                    "value": float(r.value),
                    "limit": float(r.limit),
                    "margin": None if math.isinf(mo) else mo,
                }
    skip = dict(spec.skips)

    def detail(r: CheckRow) -> str:
        if r.name not in BASIS_CHECKS:
            return r.detail
        text = f"{BASIS_NAMES[basis]} = {FM_check / 1e3:.4g} kN"
        if r.name in info:
            o = info[r.name]
            text += (
                f"; with {BASIS_NAMES[o['basis']]} = {o['preload_N'] / 1e3:.4g} kN: "
                f"{o['value']:.4g} {r.unit} (information)"
            )
        return f"{r.detail}; {text}" if r.detail else text

    checks = tuple(
        Check(
            r.name,
            r.title,
            float(r.value),
            float(r.limit),
            r.unit,
            r.relation,
            r.source,
            detail(r),
            skip.get(r.name),
            info.get(r.name),
            r.extra,
        )
        for r in rows
    )
    torque_required = None
    if spec.tightening.method == "torque" and prep.torque is not None:
        # F_M,min is proportional to the nominal torque: the smallest torque for the requirement
        torque_required = required_FM * prep.torque[0] / prep.assembly_min
        limit_torque = (
            prep.permissible_preload
            * prep.k_torque_fn(spec.tightening.thread_friction[0], spec.tightening.head_friction[0])
            / (1 + spec.tightening.torque_tolerance)
        )
        if torque_required > limit_torque:
            check_notes.append(
                f"The required clamp load needs a nominal torque of at least "
                f"{torque_required:.4g} N*m, but {limit_torque:.4g} N*m already takes the bolt to "
                "its permissible preload: a stronger or larger bolt, or a tighter tightening "
                "method, is needed."
            )

    from ..errors import SolveError
    from .plastic import permanent_loss_cycle

    notes = list(prep.notes) + check_notes
    if ecc_info is not None:
        notes.extend(ecc_info["notes"])
    try:
        cycle = permanent_loss_cycle(prep) if ecc is None else None
    except SolveError:
        cycle = None
        notes.append(
            "Plastic collapse: with the bolt and the bearing faces elastic-perfectly-plastic, "
            "no equilibrium exists under the largest service load (the load exceeds what the "
            "yielding bolt or bearing faces can carry); the permanent preload loss cannot be "
            "given. See the failing checks."
        )
    if ecc is None:
        checks = checks + plastic_checks(cycle, skip)
    else:
        notes.append(
            "The elastic-plastic cycle (plastic_collapse, cycle_yield) is not modelled for "
            "eccentric joints: the working-stress check R8 keeps the bolt elastic."
        )
    present = {c.name for c in checks}
    for name, reason in spec.skips:
        if name not in present:
            notes.append(
                f"[[skip]] {name}: this joint has no such check (it does not apply here), so "
                f"nothing was switched off; the reason given was: {reason}"
            )
    if cycle is not None and cycle.permanent_loss > 0:
        notes.append(
            f"Yielding on the way from assembly to service and back ({', '.join(cycle.yielded)}): "
            f"the maximum-preload "
            f"joint keeps {cycle.preload_after[1] / 1e3:.4g} kN after cooling back to the assembly "
            f"temperature, a permanent loss of {cycle.permanent_loss / 1e3:.4g} kN."
        )
    return JointResult(
        spec=spec,
        springs=sp_a,
        springs_service=sp_s,
        load_factor=phi_n,
        load_factor_service=phi_n_s,
        A0=prep.A0,
        d0=prep.d0,
        permissible_preload=prep.permissible_preload,
        assembly_min=prep.assembly_min,
        assembly_max=prep.assembly_max,
        alpha_A=prep.alpha_A,
        alpha_A_basis=prep.alpha_A_basis,
        torque=prep.torque,
        torque_required=torque_required,
        embedding_amount=fZ,
        embedding_loss=prep.embedding_loss,
        thermal_change=thermal_change,
        thermal_change_max=thermal_change_max,
        states=states,
        separation_load=separation_load,
        bolt_load_max=bolt_load_max,
        residual_clamp_min=residual_min,
        required_assembly_min=required_FM,
        required_clamp_load=FKerf,
        check_basis=basis,
        check_preload=FM_check,
        bolt_load_max_actual=bolt_load_max if basis != "permissible" else bolt_load_max_other,
        bolt_load_max_permissible=(
            bolt_load_max if basis == "permissible" else bolt_load_max_other
        ),
        checks=checks,
        notes=tuple(notes),
        assumptions=prep.assumptions,
        defaults=spec.defaults,
        cycle=cycle,
        angle=prep.method_info if spec.tightening.method == "angle" else None,
        tension=prep.method_info if spec.tightening.method == "tension" else None,
        eccentric=ecc_info,
        eccentric_joint=None if ecc is None else ecc[1],
    )


# --------------------------------------------------------------------------- eccentric


def eccentric_joints(
    spec: JointSpec, model: TemperatureModel
) -> tuple[EccentricJoint, EccentricJoint]:
    """The eccentric joint at assembly and at service temperature, the opening edge resolved.

    ``delta_P`` of the :class:`EccentricJoint` is the concentric resilience: the model's
    resilience is ``delta_P*`` for an eccentric joint (:mod:`clampstack.joint.thermal`).
    Without a given ``edge_distance`` the edge is the one that opens first under the
    maximum load (:func:`~clampstack.joint.eccentric.first_opening_edge`).
    """
    e = spec.eccentric
    assert e is not None
    srv = spec.service
    s2 = e.bolt_offset**2

    def make(dS: float, dP: float, beta: float, u: float) -> EccentricJoint:
        return EccentricJoint(
            dS, dP - s2 * beta, beta, srv.load_height, e.bolt_offset, e.load_offset, u, e.interface
        )

    dSs, dPs = (float(x) for x in model.resiliences(srv.temperature))
    beta_s = float(model.bending(srv.temperature))
    ej_s = make(dSs, dPs, beta_s, e.edge_distance or e.interface.half)
    if e.edge_distance is None:
        ej_s = replace(
            ej_s,
            u=first_opening_edge(
                ej_s,
                1.0,
                [
                    (srv.axial_load[1], srv.bending_moment[1]),
                    (srv.axial_load[0], srv.bending_moment[0]),
                ],
            ),
        )
    dSa, dPa = model.resiliences_at_assembly()
    return make(dSa, dPa, model.bending_at_assembly(), ej_s.u), ej_s


def bending_length(spec: JointSpec, model: TemperatureModel) -> float:
    """``l_ers`` [m]: the bolt's substitute bending length referred to the stress diameter.

    ``l_ers = sum l_i (A_S / A_i)^2`` over the segments of the axial model (the same
    substitute lengths for head, engaged thread and nut; VDI 2230-1:2015, 5.5.3, from
    memory): a segment's bending resilience ``l_i / (E I_i)`` with ``I ~ A^2``.
    """
    As = spec.bolt.thread.As
    total = 0.0
    for (_, length), term in zip(model.bolt_segments, model.bolt_terms, strict=True):
        if length <= 0:
            continue
        area = length / term.coef
        total += length * (As / area) ** 2
    return total


def bending_stress_per_rotation(spec: JointSpec, model: TemperatureModel, T_service: Any) -> Any:
    """``E_S d_S / (2 l_ers)`` [Pa per rad] at service temperature(s) [K] (vectorised): the
    bolt's bending stress per rotation of the clamped body
    (:func:`~clampstack.joint.eccentric.bolt_bending_stress`, VDI 2230-1:2015 5.5.3)."""
    E_S = part_modulus(spec.bolt.material, model.part_T(spec.bolt.temperature, T_service))
    d_S = math.sqrt(4 * spec.bolt.thread.As / math.pi)
    return bolt_bending_stress(1.0, E_S, d_S, bending_length(spec, model))


def eccentric_summary(
    spec: JointSpec,
    model: TemperatureModel,
    ej: EccentricJoint,
    FV_T: float,
    contact: dict[tuple[str, str], ContactState],
) -> dict[str, Any]:
    """Opening load, clamp load against opening, bolt bending and contact (SI; JSON-ready)."""
    e = spec.eccentric
    assert e is not None
    srv = spec.service
    FA_lo, FA_hi = srv.axial_load
    MB_lo, MB_hi = srv.bending_moment
    i = ej.interface
    # the edge u itself open under the preload alone; or the other edge (the bolt outside
    # the core toward u): then VDI's linear relations do not hold, the contact model judges u
    at_assembly = ej.interface.core + ej.s * ej.u <= 0
    far_open = not at_assembly and ej.open_at_assembly
    notes: list[str] = []
    FKab = None
    if not (at_assembly or far_open):
        # F_Kab at the maximum and the minimum load; an edge that does not open needs none
        FKab = (
            max(ej.opening_clamp_load(FA_hi, MB_hi), ej.opening_clamp_load(FA_lo, MB_lo), 0.0)
            + 0.0  # no -0.0
        )
        lam = ej.opening_ratio(FV_T, FA_hi, MB_hi)
    elif far_open:
        lam = ej.contact_opening_ratio(FV_T, FA_hi, MB_hi)
        if (FA_lo, MB_lo) != (FA_hi, MB_hi):
            lam = min(lam, ej.contact_opening_ratio(FV_T, FA_lo, MB_lo))
    else:
        lam = 0.0
    finite = math.isfinite(lam)
    opening_load = lam * FA_hi if finite and FA_hi > 0 else None
    opening_moment = lam * MB_hi if finite and MB_hi != 0 else None
    knee = (
        opening_load
        if opening_load is not None
        else (max(FV_T, 0.0) / (1 - ej.phi_en) if ej.phi_en < 1 else 0.0)
    )
    # bolt bending: sigma_b = E_S d_S gamma / (2 l_ers)
    l_ers = bending_length(spec, model)
    K = bending_stress_per_rotation(spec, model, srv.temperature)
    sig = {k: float(K) * st.rotation for k, st in contact.items()}
    amp = 0.0
    for br in ("min", "max"):
        if (br, "service_min") in sig:
            amp = max(amp, 0.5 * abs(sig[(br, "service_max")] - sig[(br, "service_min")]))
    top = contact[("min", "service_max")]
    top_max = contact[("max", "service_max")]
    opened = any(st.opened for st in contact.values())
    # the edges the contact model lifts in any service state
    h = i.half
    lifted = sorted(
        {
            x
            for st in contact.values()
            if st.opened
            for x, gone in (
                (h, st.contact[1] < h * (1 - 1e-9)),
                (-h, st.contact[0] > -h * (1 - 1e-9)),
            )
            if gone
        },
        reverse=True,
    )
    separated = any(st.model == "separated" for st in contact.values())
    if far_open:
        notes.append(
            f"The bolt lies outside the core of the interface (|s_sym| = {abs(ej.s) * 1e3:.4g} mm "
            f"> I_BT/(A_D h) = {i.core / i.half * 1e3:.4g} mm): the preload alone lifts the edge "
            "away from u. The VDI 2230-1 linear relations and F_Kab do not apply; the states "
            "and the opening of edge u come from the contact model (our model)"
            + (
                f", which keeps u closed up to {lam:.3g} x the maximum load."
                if math.isfinite(lam)
                else ", which keeps u closed at any multiple of the load."
            )
        )
    if at_assembly:
        notes.append(
            f"The bolt lies outside the core of the interface (|s_sym| = {abs(ej.s) * 1e3:.4g} mm "
            f"> I_BT/(A_D h) = {i.core / i.half * 1e3:.4g} mm): the preload alone lifts the far "
            "edge, and the VDI 2230-1 linear relations do not apply; the states come from the "
            "contact model (our model)."
        )
    elif separated:
        notes.append(
            "The clamped parts separate under the service load (the load acts on the bolt's "
            "line, and the bolt carries it alone): no clamp load is left."
        )
    elif opened and not far_open:
        where = (
            f"the opening load F_A,ab = {opening_load / 1e3:.4g} kN"
            if opening_load is not None and math.isfinite(lam)
            else "the opening point"
        )
        edges = " and ".join(f"{x * 1e3:+.4g} mm" for x in lifted) or f"{ej.u * 1e3:+.4g} mm"
        notes.append(
            f"The interface opens at its edge ({edges}) in service: the VDI 2230-1 linear "
            f"relations hold up to {where}; beyond it the bolt load, the clamp load and the "
            "contact come from the contact model (compression-only bed over the interface; our "
            f"model, not in VDI 2230). At the maximum load {top.contact_width * 1e3:.4g} mm of "
            f"the {i.length * 1e3:.4g} mm interface stay in contact."
        )
    if i.shape == "given":
        notes.append(
            "The interface is given by area and second moment: the contact model uses the "
            f"rectangle of the same properties ({i.length * 1e3:.4g} mm long)."
        )
    return {
        "load_factor": ej.phi_en,
        "moment_load_factor_per_m": ej.phi_m,
        "bending_inertia_mm4": e.bending_inertia * 1e12,
        "bending_inertia_basis": e.bending_inertia_basis,
        "interface_shape": i.shape,
        "interface_area_mm2": i.area * 1e6,
        "interface_second_moment_mm4": i.second_moment * 1e12,
        "interface_length_mm": i.length * 1e3,
        "bolt_offset_mm": ej.s * 1e3,
        "load_offset_mm": ej.a * 1e3,
        "edge_distance_mm": ej.u * 1e3,
        "edge_distance_given": e.edge_distance is not None,
        "resilience_concentric_mm_per_N": ej.dP * 1e3,
        "resilience_clamping_mm_per_N": ej.dP_star * 1e3,
        "resilience_loading_mm_per_N": ej.dP_2star * 1e3,
        "bending_resilience_per_N_mm": ej.beta * 1e-3,
        "bending_length_mm": l_ers * 1e3,
        "axial_load_max_N": FA_hi,
        "open_at_assembly": at_assembly or far_open,
        "edge_open_at_assembly": at_assembly,
        "opening_basis": "contact model"
        if far_open
        else (
            "separation"
            if not at_assembly and FKab == 0 and FA_hi > 0 and ej._on_bolt_line(FA_hi, MB_hi)
            else "VDI 2230-1 linear"
        ),
        "opening_clamp_load_N": FKab,
        "opening_load_N": opening_load,
        "opening_moment_Nm": opening_moment,
        "opening_load_ratio": lam if finite else None,
        "opened": opened,
        "bolt_bending_stress_max_MPa": max(abs(v) for v in sig.values()) / 1e6,
        "bending_amplitude_MPa": amp / 1e6,
        "contact": {
            "model": top.model,
            "contact_width_mm": top.contact_width * 1e3,
            "contact_from_mm": top.contact[0] * 1e3,
            "contact_to_mm": top.contact[1] * 1e3,
            "bolt_load_N": top.bolt_load,
            "clamp_load_N": top.clamp_load,
            "max_preload_bolt_load_N": top_max.bolt_load,
            "max_preload_contact_width_mm": top_max.contact_width * 1e3,
        },
        "knee_N": knee,
        "notes": notes,
    }


def opening_row(info: dict[str, Any], residual_min: Any, detail: str | None = None) -> CheckRow:
    """The ``opening`` check: ``F_KR,min >= F_Kab`` (VDI 2230-1:2015, 5.3.2 and R2).

    Where the preload alone lifts the far edge the rule becomes: the bolt inside the core
    of the interface, ``|s_sym| <= I_BT / (A_D |u|)`` (the same Navier pressure at zero load).
    """
    u = info["edge_distance_mm"]
    if info["opening_basis"] == "separation":
        # the load on the bolt's line: no edge opens first, the parts separate as a whole
        return CheckRow(
            "opening",
            "No separation of the clamped parts under the maximum load (load on the bolt's line)",
            np.asarray(info["opening_load_N"]) / 1e3,
            info["axial_load_max_N"] / 1e3,
            "kN",
            ">=",
            "VDI 2230-1:2015, 5.3.2 (F_A,sep = F_V / (1 - Phi_en*): F_Kab = 0 on both edges)",
            detail if detail is not None else "",
        )
    if info["opening_basis"] == "contact model":
        lam = info["opening_load_ratio"]
        return CheckRow(
            "opening",
            "No opening of the interface at edge u under the maximum load (contact model)",
            64.0 if lam is None else lam,
            1.0,
            "x load",
            ">=",
            "VDI 2230-1:2015, 5.3.2 (the edge must not open); the preload alone lifts the other "
            "edge, so the load ratio at which u opens comes from the contact model (our model)",
            f"opening edge u = {u:+.4g} mm; "
            + (
                "closed up to 64 x the maximum load (the search's end)"
                if lam is None
                else f"opens at {lam:.4g} x the maximum load"
            ),
        )
    if info["edge_open_at_assembly"]:
        core = info["interface_second_moment_mm4"] / (info["interface_area_mm2"] * abs(u))
        return CheckRow(
            "opening",
            "Bolt inside the core of the interface (no opening under the preload alone)",
            abs(info["bolt_offset_mm"]),
            core,
            "mm",
            "<=",
            "VDI 2230-1:2015, 5.3.2 (Navier's linear pressure over the interface; from memory)",
            f"opening edge u = {u:+.4g} mm",
        )
    return CheckRow(
        "opening",
        "No opening of the interface at its edge under the maximum load",
        residual_min / 1e3,
        info["opening_clamp_load_N"] / 1e3,
        "kN",
        ">=",
        "VDI 2230-1:2015, 5.3.2 and R2 (F_KR,min >= F_Kab = (F_A (a - s_sym) u + M_B u) / "
        "(I_BT/A_D + s_sym u); from memory)",
        detail
        if detail is not None
        else f"opening edge u = {u:+.4g} mm; opening load "
        + (
            f"F_A,ab = {info['opening_load_N'] / 1e3:.4g} kN"
            if info["opening_load_N"] is not None
            else "none along the service load"
        ),
    )


def select_case(spec: JointSpec, name: str | None) -> tuple[JointSpec, str | None]:
    """The joint in one load case for a study (``sweep``, ``scatter``) and a note saying
    which; ``name`` None: the governing case of :func:`analyse`.  Without cases: ``spec``
    itself and no note.  InputError (key ``--case``) for an unknown name."""
    from .cases import case_spec, check_case_name

    check_case_name(spec, name)
    if not spec.cases:
        return spec, None
    names = [c.name for c in spec.cases]
    if name is None:
        name = analyse(spec).governing_case
        how = "the governing case of check; --case NAME for another"
    else:
        how = "--case"
    case = spec.cases[names.index(name)]
    return case_spec(spec, case), f"Load case {name!r} ({how})."
