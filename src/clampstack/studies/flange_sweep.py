"""Temperature sweep of a gasketed flange: per-bolt bolt and gasket loads, and the heat cycle.

The flange's temperature is scanned from ``T_low`` to ``T_high``; bolt and gasket
rise in the same proportion of their rise in the file (:func:`~clampstack.flange.
service.at_fraction`).  Each point is the assembled ring (after the pass sequence of
``clampstack flange``, at the nominal preload) brought to that temperature with the
design pressure and external loads on: moduli at temperature, the parts' thermal
growths, the ring's rotation and the gasket's unloading line
(:mod:`clampstack.flange.service`).  The smallest and largest assembly preload are
taken as in ``clampstack flange``: the loss of gasket force from assembly to each
state at the nominal preload is applied to the scattered preload.

``cycle``: the flange heats through the points (its gasket history carried from point
to point), its gasket relaxes by creep at ``T_high`` (the relaxation factor at the
gasket's temperature there), and it cools back through the same points, still
pressurised; then it is shut down (cold, no pressure).  The temperatures where the
gasket falls below its operating minimum, where it reaches its crush limit and where
a bolt reaches its yield point are found by Brent's method (scipy.optimize.brentq) on
the margin of the heating branch.
"""

from __future__ import annotations

import math
from collections.abc import Callable
from dataclasses import dataclass, field
from typing import Any

import numpy as np

from ..catalog import yield_at_temperature
from ..display import Shown
from ..errors import InputError
from ..flange.analysis import FlangeResult, analyse_flange
from ..flange.model import FlangeSpec
from ..flange.service import (
    STATE_TEXT,
    Conditions,
    State,
    at_fraction,
    creep_lost,
    loads,
    relax,
    relaxation_basis,
    snapshot,
    solve_state,
)
from .sweep import Limit, temperature_points

C0 = 273.15
MAX_FLANGE_POINTS = 2001  # temperature points of a flange sweep (one ring solve each)
CHECKS = ("gasket_operating", "gasket_crush", "bolt_service_stress")


@dataclass(frozen=True)
class FlangeSweepResult(Shown):
    """States over the temperature points (SI) and the limits found."""

    spec: FlangeSpec
    temperature: np.ndarray  # flange temperature of each point [K]
    phase: tuple[str, ...]  # "heating" or "cooling" per point
    bolt: np.ndarray  # (points, bolts) at the nominal preload [N]
    gasket: np.ndarray  # (points, bolts) [N]
    rotation: np.ndarray  # (points,) [rad]
    gasket_min: np.ndarray  # smallest sector force at the smallest assembly preload [N]
    gasket_max: np.ndarray  # largest at the largest [N]
    bolt_min: np.ndarray  # smallest bolt load at the smallest assembly preload [N]
    bolt_max: np.ndarray  # largest at the largest [N]
    margins: dict[str, np.ndarray]
    limits: tuple[Limit, ...]
    operating_minimum: float  # H_p / N [N]
    cycle: dict[str, Any] | None = None
    notes: tuple[str, ...] = ()
    det: FlangeResult | None = field(default=None, repr=False)

    @property
    def sector_area(self) -> float:
        return self.spec.gasket.area / self.spec.bolt_count

    @property
    def ok(self) -> np.ndarray:
        out = np.ones(self.temperature.shape, dtype=bool)
        for m in self.margins.values():
            out &= m >= -1e-9
        return out

    @property
    def passed(self) -> bool:
        return bool(np.all(self.ok)) and bool((self.cycle or {}).get("ok", True))

    def to_dict(self) -> dict[str, Any]:
        """JSON form (``sweep --json`` on a flange file)."""
        A = self.sector_area
        ok = self.ok
        rows = [
            {
                "temperature_degC": float(self.temperature[i] - C0),
                "phase": self.phase[i],
                "gasket_stress_min_MPa": float(self.gasket_min[i]) / A * 1e-6,
                "gasket_stress_max_MPa": float(self.gasket_max[i]) / A * 1e-6,
                "bolt_load_min_N": float(self.bolt_min[i]),
                "bolt_load_max_N": float(self.bolt_max[i]),
                "rotation_deg": math.degrees(float(self.rotation[i])),
                "bolt_load_N": self.bolt[i].tolist(),
                "gasket_stress_MPa": (self.gasket[i] / A * 1e-6).tolist(),
                "ok": bool(ok[i]),
                "margins": {k: _finite(v[i]) for k, v in self.margins.items()},
            }
            for i in range(self.temperature.size)
        ]
        s = self.spec
        return {
            "title": s.title,
            "kind": "flange",
            "assembly_temperature_degC": s.T_assembly - C0,
            "operating_minimum_per_sector_N": self.operating_minimum,
            "operating_minimum_stress_MPa": self.operating_minimum / A * 1e-6,
            "seating_stress_MPa": s.gasket.y * 1e-6,
            "crush_stress_MPa": s.gasket.max_stress * 1e-6,
            "points": rows,
            "limits": [
                {"check": lim.check, "temperature_degC": lim.temperature - C0, "fails": lim.fails}
                for lim in self.limits
            ],
            **({"cycle": self.cycle} if self.cycle is not None else {}),
            "notes": list(self.notes),
            "ok": self.passed,
        }


def _finite(x: float) -> float | None:
    return float(x) if math.isfinite(x) else None


def flange_sweep(
    spec: FlangeSpec,
    T_low: float,
    T_high: float,
    step: float | None = None,
    cycle: bool = False,
    progress: Callable[[int], None] | None = None,
) -> FlangeSweepResult:
    """Sweep the flange temperature from ``T_low`` to ``T_high`` [K] (see the module)."""
    T = temperature_points(T_low, T_high, step)
    if T.size > MAX_FLANGE_POINTS:
        raise InputError(
            f"{T.size} temperature points are too many for a flange sweep (one ring solve "
            f"each; at most {MAX_FLANGE_POINTS}): give a larger step",
            key="--step",
        )
    det = analyse_flange(spec, compensate=False)
    ring0 = det.ring
    n = spec.bolt_count
    split = loads(spec, ring0.rotation)
    conds = [at_fraction(spec, float(t)) for t in T]
    for c in (conds[0], conds[-1]):
        _check_temperatures(spec, c)
    Hp_n = det.app2.Hp / n
    A = spec.gasket.area / n
    states: list[State] = []
    phase: list[str] = []
    if cycle:
        ring = snapshot(ring0)
        for i, c in enumerate(conds):
            states.append(solve_state(ring, "heating", c, split))
            phase.append("heating")
            if progress is not None:
                progress(i + 1)
        P, basis = relaxation_basis(spec, conds[-1].T_gasket)
        relaxed = relax(ring, states[-1], split, P)
        for c in conds[::-1]:
            states.append(solve_state(ring, "cooling", c, split))
            phase.append("cooling")
        # cooled back to the assembly temperature (wherever the range ends), pressurised,
        # then shut down
        T0 = spec.T_assembly
        cooled = solve_state(ring, "cooled", Conditions(T0, T0, T0), split)
        shut = solve_state(ring, "shut_down", Conditions(T0, T0, T0, 0.0), split)
    else:
        for i, c in enumerate(conds):
            states.append(solve_state(snapshot(ring0), "point", c, split))
            phase.append("heating")
            if progress is not None:
                progress(i + 1)
    bolt = np.vstack([s.bolt for s in states])
    gasket = np.vstack([s.gasket for s in states])
    rot = np.array([float(s.rotation[0]) for s in states])
    g_lo, g_hi, b_lo, b_hi = _extremes(det, gasket, bolt)
    T_all = np.array(
        [c.T_flange for c in conds] + ([c.T_flange for c in conds[::-1]] if cycle else [])
    )
    Tb_all = np.array(
        [c.T_bolt for c in conds] + ([c.T_bolt for c in conds[::-1]] if cycle else [])
    )
    margins = _margins(spec, g_lo, g_hi, b_hi, Tb_all, Hp_n, A)
    limits = _limits(
        spec, det, split, T[: len(conds)], {k: v[: len(conds)] for k, v in margins.items()}
    )
    cyc = None
    if cycle:
        cooled_lo = _extremes(det, cooled.gasket[None, :], cooled.bolt[None, :])[0][0]
        relaxed_lo = _extremes(det, relaxed.gasket[None, :], relaxed.bolt[None, :])[0][0]
        cyc = {
            "peak_temperature_degC": float(T[-1] - C0),
            "relaxation_factor": P,
            "relaxation_basis": basis,
            "states": [
                _state_dict(states[len(conds) - 1], "start_up", A),
                _state_dict(relaxed, "hot", A),
                _state_dict(cooled, "cooled", A),
                _state_dict(shut, "shut_down", A),
            ],
            "gasket_creep_mm": (creep_lost(ring) * 1e3).tolist(),
            "gasket_after_cycle_min_N": float(cooled_lo),
            "check": "gasket_heat_cycle",
            "ok": bool(cooled_lo >= Hp_n and relaxed_lo >= Hp_n),
        }
    notes = (
        "Each point: the assembled flange (nominal preload, after the pass sequence) at "
        "that flange temperature, with bolt and gasket in proportion, pressurised; "
        "minimum and maximum at the smallest and largest assembly preload.",
    )
    return FlangeSweepResult(
        spec=spec,
        temperature=T_all,
        phase=tuple(phase),
        bolt=bolt,
        gasket=gasket,
        rotation=rot,
        gasket_min=g_lo,
        gasket_max=g_hi,
        bolt_min=b_lo,
        bolt_max=b_hi,
        margins=margins,
        limits=limits,
        operating_minimum=Hp_n,
        cycle=cyc,
        notes=notes,
        det=det,
    )


def _extremes(
    det: FlangeResult, gasket: np.ndarray, bolt: np.ndarray
) -> tuple[np.ndarray, np.ndarray, np.ndarray, np.ndarray]:
    """Per point (rows of per-bolt loads at the nominal preload): the smallest and largest
    sector gasket force and bolt load at the smallest and largest assembly preload, the
    loss or gain from assembly taken at the nominal preload (as ``clampstack flange``)."""
    lo_s = det.assembly_range[0] / det.target
    hi_s = det.assembly_range[1] / det.target
    asm_g, asm_b = det.assembly_gasket[None, :], det.passes[-1][None, :]
    return (
        (gasket - (1 - lo_s) * asm_g).min(axis=1),
        (gasket + (hi_s - 1) * asm_g).max(axis=1),
        (bolt - (1 - lo_s) * asm_b).min(axis=1),
        (bolt + (hi_s - 1) * asm_b).max(axis=1),
    )


def _state_dict(st: State, name: str, A: float) -> dict[str, Any]:
    d = State(name, st.conditions, st.bolt, st.gasket, st.rotation, st.relaxation).to_dict(A)
    d["label"] = STATE_TEXT[name]
    return d


def _check_temperatures(spec: FlangeSpec, c: Any) -> None:
    """The range's ends within the materials' data (or the margin below), named as the option."""
    from ..joint.geometry import check_temperature

    try:
        check_temperature(spec.material, c.T_flange, "--temperature", extrapolate=True)
        check_temperature(spec.bolt_material, c.T_bolt, "--temperature", extrapolate=True)
        yield_at_temperature(spec.grade, c.T_bolt)
    except InputError as err:
        raise InputError(err.detail, key="--temperature") from None


def _margins(
    spec: FlangeSpec,
    g_lo: np.ndarray,
    g_hi: np.ndarray,
    b_hi: np.ndarray,
    T_bolt: np.ndarray,
    Hp_n: float,
    A: float,
) -> dict[str, np.ndarray]:
    """Margins of the three service checks of ``clampstack flange`` at every point."""
    Rp = np.array([float(yield_at_temperature(spec.grade, float(t))[0]) for t in T_bolt])
    sigma = b_hi / spec.thread.As
    return {
        "gasket_operating": (g_lo - Hp_n) / Hp_n if Hp_n > 0 else np.full(g_lo.shape, math.inf),
        "gasket_crush": (spec.gasket.max_stress - g_hi / A) / spec.gasket.max_stress,
        "bolt_service_stress": (Rp - sigma) / Rp,
    }


def _limits(
    spec: FlangeSpec,
    det: FlangeResult,
    split: Any,
    T: np.ndarray,
    m: dict[str, np.ndarray],
) -> tuple[Limit, ...]:
    """Pass/fail boundaries of each check on the heating branch, refined by Brent's method."""
    n = spec.bolt_count
    A = spec.gasket.area / n
    out: list[Limit] = []
    for name, mm in m.items():
        fail = mm < -1e-9
        if not fail.any():
            continue
        if fail.all():
            out.append(Limit(name, float(T[0]), "whole range"))
            continue
        from scipy.optimize import brentq  # only when a margin changes sign

        def f(t: float, name: str = name) -> float:
            c = at_fraction(spec, t)
            st = solve_state(snapshot(det.ring), "point", c, split)
            g_lo, g_hi, _, b_hi = _extremes(det, st.gasket[None, :], st.bolt[None, :])
            mg = _margins(spec, g_lo, g_hi, b_hi, np.array([c.T_bolt]), det.app2.Hp / n, A)
            return float(mg[name][0])

        for i in np.flatnonzero(fail[1:] != fail[:-1]):
            a, b = float(T[i]), float(T[i + 1])
            fa, fb = f(a), f(b)
            root = brentq(f, a, b, xtol=1e-6, rtol=1e-12) if fa * fb < 0 else (a if fa < 0 else b)
            out.append(Limit(name, root, "above" if fail[i + 1] else "below"))
    return tuple(sorted(out, key=lambda x: x.temperature))
