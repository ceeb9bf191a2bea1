"""Temperature sweep: preload, clamp load, bolt stress and every check margin over a range.

The joint's service temperature is scanned; parts with a temperature of their own
rise above the assembly temperature in proportion to the joint's (a hot flange
stays hotter than its bolt; at the assembly temperature all parts are at it).  The states come from the closed form of the joint
network (:func:`clampstack.joint.analysis.service_closed_form`, exact including
separation and a slack bolt), vectorised over all temperature points; the
checks from the same :func:`~clampstack.joint.analysis.evaluate_checks` that
``clampstack check`` uses.  The temperatures where a check starts to fail are
found by root finding (Brent's method, scipy.optimize.brentq) on the margin,
not just the nearest grid point.
"""

from __future__ import annotations

import math
from collections.abc import Callable
from dataclasses import dataclass
from typing import Any

import numpy as np

from ..display import Shown
from ..errors import InputError, SolveError
from ..joint.analysis import (
    bending_stress_per_rotation,
    eccentric_joints,
    evaluate_checks,
    margins,
    opening_row,
)
from ..joint.eccentric import eccentric_states
from ..joint.model import JointSpec
from ..joint.prepare import (
    Prepared,
    check_bolt_loads,
    prepare,
    service_closed_form,
    service_preload,
    temperature_data_notes,
)

C0 = 273.15
CHUNK = 20_000  # temperature points per piece of the evaluation (and of a progress bar)
MAX_POINTS = 1_000_001  # temperature points of one sweep


@dataclass(frozen=True)
class Limit:
    """A temperature where a check changes from passing to failing."""

    check: str
    temperature: float  # K
    fails: str  # "above", "below" (the side on which it fails) or "whole range"


@dataclass(frozen=True)
class SweepResult(Shown):
    """Arrays over the temperature points (SI) and the limits found."""

    spec: JointSpec
    temperature: np.ndarray
    preload_min: np.ndarray
    preload_max: np.ndarray
    residual_min: np.ndarray
    bolt_load_max: np.ndarray
    bolt_stress_max: np.ndarray
    margins: dict[str, np.ndarray]
    ok: np.ndarray
    limits: tuple[Limit, ...]
    preload_assembly: tuple[float, float]  # (min after embedding, max) at assembly temperature
    assembly_range: tuple[float, float]  # assembly preload F_M,min, F_M,max
    skipped: dict[str, str]
    cycle: dict[str, Any] | None = None
    check_basis: str = "permissible"  # preload of the checks R8-R10 (Prepared.check_basis)
    check_preload: float = 0.0  # that preload [N]; bolt_load_max and the stresses follow it
    notes: tuple[str, ...] = ()  # material data extrapolated or held over the range

    @property
    def thermal_change_cold(self) -> float:
        """Minimum-branch preload at the cold end minus at assembly temperature [N]."""
        return float(self.preload_min[0] - self.preload_assembly[0])

    @property
    def thermal_change_hot(self) -> float:
        """Minimum-branch preload at the hot end minus at assembly temperature [N]."""
        return float(self.preload_min[-1] - self.preload_assembly[0])

    @property
    def passed(self) -> bool:
        """Every check at every point, and no collapse or permanent loss in the cycles."""
        cycles_ok = all(c.get("ok", True) for c in (self.cycle or {}).values())
        return bool(np.all(self.ok)) and cycles_ok

    def point_columns(self, start: int = 0, stop: int | None = None) -> dict[str, list[Any]]:
        """The per-point values of the JSON form for the points ``start:stop``, column-wise.

        Python floats and bools (``ndarray.tolist``: the same values as ``float(x)``), in
        the order of the keys of a point; the margins are in :meth:`margin_columns`.
        """
        sl = slice(start, stop)
        return {
            "temperature_degC": (self.temperature[sl] - C0).tolist(),
            "preload_min_N": self.preload_min[sl].tolist(),
            "preload_max_N": self.preload_max[sl].tolist(),
            "residual_clamp_load_min_N": self.residual_min[sl].tolist(),
            "bolt_load_max_N": self.bolt_load_max[sl].tolist(),
            "bolt_stress_max_MPa": (self.bolt_stress_max[sl] * 1e-6).tolist(),
            "ok": self.ok[sl].tolist(),
        }

    def margin_columns(self, start: int = 0, stop: int | None = None) -> dict[str, list[Any]]:
        """Every check's margin at the points ``start:stop`` (None where not finite)."""
        sl = slice(start, stop)
        return {
            n: [x if math.isfinite(x) else None for x in m[sl].tolist()]
            for n, m in self.margins.items()
        }

    def to_dict(self, points: bool = True) -> dict[str, Any]:
        """JSON form per DESIGN.md (``sweep --json``).

        It holds one dict per point; for a long sweep the command line streams the same
        text instead (:func:`clampstack.outputs.sweep.sweep_json_chunks`).  With
        ``points=False`` the ``points`` entry is an empty list (in its place).
        """
        rows: list[dict[str, Any]] = []
        if points:
            cols = self.point_columns()
            mcols = self.margin_columns()
            for i in range(self.temperature.size):
                row = {k: v[i] for k, v in cols.items()}
                row["margins"] = {n: v[i] for n, v in mcols.items()}
                rows.append(row)
        out: dict[str, Any] = {
            "title": self.spec.title,
            "assembly_temperature_degC": self.spec.service.assembly_temperature - C0,
            "assembly_preload_min_N": self.assembly_range[0],
            "assembly_preload_max_N": self.assembly_range[1],
            "check_basis": self.check_basis,
            "check_preload_N": self.check_preload,
            "points": rows,
            "limits": [
                {"check": lim.check, "temperature_degC": lim.temperature - C0, "fails": lim.fails}
                for lim in self.limits
            ],
            "thermal_change_cold_N": self.thermal_change_cold,
            "thermal_change_hot_N": self.thermal_change_hot,
            "skipped": self.skipped,
            "notes": list(self.notes),
            "ok": self.passed,
        }
        if self.cycle is not None:
            out["cycle"] = self.cycle
        return out


def _evaluate(prep: Prepared, T: np.ndarray) -> dict[str, Any]:
    """All states and check margins at service temperatures ``T`` [K] (vectorised)."""
    if prep.spec.eccentric is not None:
        return _evaluate_eccentric(prep, T)
    s = prep.spec
    srv = s.service
    model = prep.model
    dSa, dPa = prep.springs.delta_S, prep.springs.delta_P
    dS, dP = model.resiliences(T)
    phi = srv.load_height * dP / (dS + dP)
    thb, thc = model.thermal(T)
    FA_lo, FA_hi = srv.axial_load
    alternating = FA_lo != FA_hi
    res = {}
    for name, FM, fz in (
        ("min", prep.assembly_min, prep.embedding_amount),
        ("max", prep.assembly_max, 0.0),
    ):
        FV = service_preload(FM, dSa + dPa, dS + dP, thb - thc, fz)
        pre, clamp0 = service_closed_form(FV, phi, 0.0)
        hi = service_closed_form(FV, phi, FA_hi)
        lo = service_closed_form(FV, phi, FA_lo) if alternating else hi
        res[name] = (pre, clamp0, hi, lo)
    pre_min, clamp0_min, hi_min, lo_min = res["min"]
    pre_max, _, hi_max, lo_max = res["max"]
    FM_check = prep.check_preload()
    FV_check = service_preload(FM_check, dSa + dPa, dS + dP, thb - thc)
    bolt_max, mean_check = check_bolt_loads(FM_check, FV_check, phi, FA_lo, FA_hi)
    bolt_max = np.broadcast_to(bolt_max, T.shape)
    residual = np.minimum(hi_min[1], lo_min[1])
    separation = np.maximum(clamp0_min, 0.0) / (1 - phi)
    amplitude = mean = None
    if alternating:
        amplitude = np.maximum(np.abs(hi_min[0] - lo_min[0]), np.abs(hi_max[0] - lo_max[0])) / (
            2 * s.bolt.thread.As
        )
        mean = mean_check
    T_bolt = prep.model.part_T(s.bolt.temperature, T)
    rows, _ = evaluate_checks(
        prep, T_bolt, FM_check, bolt_max, amplitude, mean, residual, separation
    )
    m = margins(rows)
    return {
        "pre_min": pre_min,
        "pre_max": pre_max,
        "residual": residual,
        "bolt_max": bolt_max,
        "margins": {k: np.broadcast_to(v, T.shape).astype(float) for k, v in m.items()},
    }


def _evaluate_eccentric(prep: Prepared, T: np.ndarray) -> dict[str, Any]:
    """:func:`_evaluate` for an eccentric joint: the same states and checks as ``check``.

    VDI 2230-1's linear relations in closed form over all points where the interface
    stays closed, the contact model where it opens
    (:func:`~clampstack.joint.eccentric.eccentric_states`); the opening edge is the one
    ``check`` finds at the file's service temperature.
    """
    s = prep.spec
    srv, e, model = s.service, s.eccentric, prep.model
    assert e is not None
    ej = eccentric_joints(s, model)[1]
    dSa, dPa = prep.springs.delta_S, prep.springs.delta_P
    dS, dP = model.resiliences(T)
    beta = model.bending(T)
    thb, thc = model.thermal(T)
    (FA_lo, FA_hi), (MB_lo, MB_hi) = srv.axial_load, srv.bending_moment
    alternating = (FA_lo, MB_lo) != (FA_hi, MB_hi)
    geo = (srv.load_height, e.bolt_offset, e.load_offset, ej.u, e.interface)

    def states(FV: np.ndarray, FA: float, MB: float):
        return eccentric_states(dS, dP, beta, *geo, FV, FA, MB)

    res = {}
    for name, FM, fz in (
        ("min", prep.assembly_min, prep.embedding_amount),
        ("max", prep.assembly_max, 0.0),
    ):
        FV = service_preload(FM, dSa + dPa, dS + dP, thb - thc, fz)
        hi = states(FV, FA_hi, MB_hi)
        res[name] = (FV, hi, states(FV, FA_lo, MB_lo) if alternating else hi)
    FV_min, hi_min, lo_min = res["min"]
    FV_max, hi_max, lo_max = res["max"]
    FM_check = prep.check_preload()
    FV_check = np.maximum(service_preload(FM_check, dSa + dPa, dS + dP, thb - thc), FM_check)
    up = states(FV_check, FA_hi, MB_hi).bolt_load
    down = states(FV_check, FA_lo, MB_lo).bolt_load if alternating else up
    bolt_max = np.maximum.reduce([np.full(T.shape, FM_check), FV_check, up, down])
    residual = np.minimum(hi_min.clamp_load, lo_min.clamp_load)
    FKab = max(ej.opening_clamp_load(FA_hi, MB_hi), ej.opening_clamp_load(FA_lo, MB_lo), 0.0)
    on_line = FKab == 0 and FA_hi > 0 and ej._on_bolt_line(FA_hi, MB_hi)
    phi = (
        srv.load_height * (dP - e.bolt_offset * (e.bolt_offset - e.load_offset) * beta) / (dS + dP)
    )
    info = {
        "opening_basis": "separation" if on_line else "VDI 2230-1 linear",
        "edge_open_at_assembly": False,
        "edge_distance_mm": ej.u * 1e3,
        "opening_clamp_load_N": FKab,
        "opening_load_N": np.maximum(FV_min, 0.0) / (1 - phi),  # F_A,sep on the bolt's line
        "axial_load_max_N": FA_hi,
    }
    opening = opening_row(info, residual, f"opening edge u = {ej.u * 1e3:+.4g} mm")
    amplitude = mean = None
    if alternating:
        K = bending_stress_per_rotation(s, model, T)
        amplitude = np.maximum(
            np.abs(hi_min.bolt_load - lo_min.bolt_load) / (2 * s.bolt.thread.As)
            + K * np.abs(hi_min.rotation - lo_min.rotation) / 2,
            np.abs(hi_max.bolt_load - lo_max.bolt_load) / (2 * s.bolt.thread.As)
            + K * np.abs(hi_max.rotation - lo_max.rotation) / 2,
        )
        mean = 0.5 * (up + down)
    T_bolt = model.part_T(s.bolt.temperature, T)
    rows, _ = evaluate_checks(
        prep,
        T_bolt,
        FM_check,
        bolt_max,
        amplitude,
        mean,
        residual,
        np.zeros(T.shape),
        opening,
        "",
        FKab,
    )
    m = margins(rows)
    return {
        "pre_min": FV_min,
        "pre_max": FV_max,
        "residual": residual,
        "bolt_max": bolt_max,
        "margins": {k: np.broadcast_to(v, T.shape).astype(float) for k, v in m.items()},
    }


def temperature_points(T_low: float, T_high: float, step: float | None = None) -> np.ndarray:
    """The sweep's temperatures [K]: ``T_low`` in steps of ``step`` (default 100 intervals),
    and ``T_high`` as the last point.

    At most :data:`MAX_POINTS` (an ``InputError`` on ``--step`` beyond), so that every
    accepted sweep stays within a few hundred MB (the points' arrays are kept for the
    limits, the table and the streamed ``--json``/``--csv``).
    """
    if not T_high > T_low:
        raise InputError("the temperature range must run from low to high", key="--temperature")
    if step is None:
        step = (T_high - T_low) / 100.0
    if not step > 0:
        raise InputError("the step must be greater than zero", key="--step")
    span = (T_high - T_low) / step
    n = int(np.floor(span + 1e-9)) + 1 if span < 2 * MAX_POINTS else None  # span may be inf
    if n is None or n > MAX_POINTS:
        many = n if n is not None else f"about {span:.3g}" if math.isfinite(span) else "endless"
        raise InputError(
            f"a step of {step:g} K gives {many} temperature points, too many (at most "
            f"1 000 001, a step of at least {_up3((T_high - T_low) / (MAX_POINTS - 1)):g} K)",
            key="--step",
        )
    T = T_low + step * np.arange(n)
    if T[-1] < T_high - 1e-9:
        T = np.append(T, T_high)
    return T


def _up3(x: float) -> float:
    """``x`` > 0 rounded up to three significant digits."""
    unit = 10.0 ** (math.floor(math.log10(x)) - 2)
    return math.ceil(x / unit * (1 - 1e-12)) * unit


def _evaluate_all(
    prep: Prepared, T: np.ndarray, progress: Callable[[int], None] | None
) -> dict[str, Any]:
    """:func:`_evaluate` over ``T``; beyond :data:`CHUNK` points in pieces, into arrays
    allocated once, so that the temporaries of the evaluation stay those of one piece."""
    if T.size <= CHUNK:
        return _evaluate(prep, T)
    ev: dict[str, Any] = {}
    for start in range(0, T.size, CHUNK):
        stop = min(start + CHUNK, T.size)
        part = _evaluate(prep, T[start:stop])
        if not ev:
            ev = {k: np.empty(T.size) for k in ("pre_min", "pre_max", "residual", "bolt_max")}
            ev["margins"] = {name: np.empty(T.size) for name in part["margins"]}
        for k in ("pre_min", "pre_max", "residual", "bolt_max"):
            ev[k][start:stop] = part[k]
        for name, v in part["margins"].items():
            ev["margins"][name][start:stop] = v
        if progress is not None:
            progress(stop)
    return ev


def sweep(
    spec: JointSpec,
    T_low: float,
    T_high: float,
    step: float | None = None,
    cycle: bool = False,
    progress: Callable[[int], None] | None = None,
) -> SweepResult:
    """Sweep the service temperature from ``T_low`` to ``T_high`` [K] in steps of ``step`` [K]."""
    if spec.eccentric is not None:
        spec.eccentric.refuse_outside_core("sweep")
        if cycle:
            raise InputError(
                "the elastic-plastic cycle is not modelled for eccentric joints", key="--cycle"
            )
    T = temperature_points(T_low, T_high, step)
    prep = prepare(spec)
    _check_range(prep, T)
    notes = tuple(temperature_data_notes(spec, prep.model, np.array([T[0], T[-1]])))
    ev = _evaluate_all(prep, T, progress)
    skipped = dict(spec.skips)
    active = [k for k in ev["margins"] if k not in skipped]
    ok = np.ones(T.shape, dtype=bool)
    for k in active:
        ok &= ev["margins"][k] >= -1e-9
    at_asm = _evaluate(prep, np.array([spec.service.assembly_temperature]))
    limits = _limits(prep, T, ev["margins"], active)
    cyc = None
    if cycle:
        cyc = _cycles(prep, T_low, T_high)
    return SweepResult(
        spec=spec,
        temperature=T,
        preload_min=ev["pre_min"],
        preload_max=ev["pre_max"],
        residual_min=ev["residual"],
        bolt_load_max=ev["bolt_max"],
        bolt_stress_max=ev["bolt_max"] / prep.A0,
        margins=ev["margins"],
        ok=ok,
        limits=limits,
        preload_assembly=(float(at_asm["pre_min"][0]), float(at_asm["pre_max"][0])),
        assembly_range=(prep.assembly_min, prep.assembly_max),
        skipped=skipped,
        cycle=cyc,
        check_basis=prep.check_basis,
        check_preload=prep.check_preload(),
        notes=notes,
    )


def _check_range(prep: Prepared, T: np.ndarray) -> None:
    """Every part's temperature within its material data, or at most the margin below them.

    What lies below the data is extrapolated and named in the result's notes
    (:func:`~clampstack.joint.prepare.temperature_data_notes`); the error names the part,
    the material and the option the range came from.
    """
    try:
        prep.model.check_range(np.array([T[0], T[-1]]), extrapolate=True)
        s = prep.spec
        from ..catalog import yield_at_temperature

        yield_at_temperature(
            s.bolt.grade, prep.model.part_T(s.bolt.temperature, np.array([T[0], T[-1]]))
        )
    except InputError as err:
        raise InputError(err.detail, key="--temperature") from None


def _limits(prep: Prepared, T: np.ndarray, m: dict[str, np.ndarray], active: list[str]) -> tuple:
    """Pass/fail boundaries of every check, refined by Brent's method on the margin."""
    out = []
    for name in active:
        mm = m[name]
        fail = mm < -1e-9
        if not fail.any():
            continue
        if fail.all():
            out.append(Limit(name, float(T[0]), "whole range"))
            continue
        idx = np.flatnonzero(fail[1:] != fail[:-1])
        if idx.size:
            from scipy.optimize import brentq  # only when a margin changes sign
        for i in idx:

            def f(t: float, name: str = name) -> float:
                return float(_evaluate(prep, np.array([t]))["margins"][name][0])

            a, b = float(T[i]), float(T[i + 1])
            fa, fb = f(a), f(b)
            root = brentq(f, a, b, xtol=1e-9, rtol=1e-12) if fa * fb < 0 else (a if fa < 0 else b)
            out.append(Limit(name, root, "above" if fail[i + 1] else "below"))
    return tuple(sorted(out, key=lambda x: x.temperature))


def _cycles(prep: Prepared, T_low: float, T_high: float) -> dict[str, Any]:
    """Preload left after a cycle from assembly temperature to each end of the range and back."""
    from ..joint.plastic import permanent_loss_cycle

    out = {}
    T0 = prep.spec.service.assembly_temperature
    for label, Tp in (("cold", T_low), ("hot", T_high)):
        if abs(Tp - T0) < 1e-9:
            continue
        try:
            c = permanent_loss_cycle(prep, T_peak=Tp)
        except SolveError:
            out[label] = {
                "peak_temperature_degC": Tp - C0,
                "collapse": True,
                "note": "no equilibrium with yielding parts (plastic collapse)",
                "check": "plastic_collapse",
                "ok": False,
            }
            continue
        out[label] = {
            "peak_temperature_degC": Tp - C0,
            "preload_before_min_N": c.preload_before[0],
            "preload_before_max_N": c.preload_before[1],
            "preload_after_min_N": c.preload_after[0],
            "preload_after_max_N": c.preload_after[1],
            "permanent_loss_N": c.permanent_loss,
            "yielded": list(c.yielded),
            "check": "cycle_yield",
            "ok": not c.permanent_loss > 0,
        }
    return out
