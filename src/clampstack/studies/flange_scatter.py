"""Assembly scatter of a gasketed flange: every bolt of every sample scatters on its own.

Per sample and bolt: thread and head friction (uniform over the file's ranges),
torque-tool accuracy (uniform within the torque tolerance); a tensioner's
preload uniform over its range.  The service state is linearised about the
deterministic flange analysis (``clampstack flange``): the gasket force of
sector i in service is the bolt's assembly preload less the loss of that sector
from assembly to service in the ring model, and the bolt load in service its
preload plus the bolt's increase in the ring model.  Events: a sector's gasket
force below ``H_p/N`` (ASME VIII-1 App. 2, the operating minimum), a sector
unloaded (separation), a bolt above its yield point at assembly (with the
thread torsion) or in service.  Blocks, seeding and percentiles as in
:mod:`clampstack.studies.scatter`.
"""

from __future__ import annotations

import math
from dataclasses import dataclass, field
from typing import Any

import numpy as np

from ..catalog import yield_at_temperature
from ..display import Shown
from ..errors import InputError
from ..flange.analysis import analyse_flange
from ..flange.model import FlangeSpec
from ..joint.model import Dist
from .sampling import BLOCK, Convergence, block_rng, event_probability, run

QUANTS = ("assembly_preload", "residual_clamp_load", "gasket_after_cycle")
EVENTS = (
    "gasket_below_operating",
    "gasket_below_operating_after_cycle",
    "separation",
    "bolt_yield",
    "bolt_yield_assembly",
    "bolt_yield_service",
    "slip",
)


@dataclass(frozen=True)
class FlangeScatterResult(Shown):
    spec: FlangeSpec
    samples: int
    seed: int
    percentiles: dict[str, dict[str, float]]
    counts: dict[str, int]
    histogram: dict[str, tuple[np.ndarray, np.ndarray]]
    deterministic: dict[str, Any]
    distributions: dict[str, str]
    exact: bool
    intervals: dict[str, dict[str, dict[str, float]]] = field(default_factory=dict)
    convergence: dict[str, Any] = field(default_factory=dict)

    def probability(self, name: str) -> dict[str, float]:
        """Estimate and 95 % interval of an event's probability."""
        return event_probability(self.counts[name], self.samples)

    def to_dict(self) -> dict[str, Any]:
        return {
            "title": self.spec.title,
            "samples": self.samples,
            "seed": self.seed,
            "percentiles": {f"{q}_N": dict(d) for q, d in self.percentiles.items()},
            "percentile_intervals": {f"{q}_N": d for q, d in self.intervals.items()},
            "probabilities": {k: self.probability(k) for k in EVENTS},
            "convergence": self.convergence,
            "distributions": self.distributions,
            "percentiles_exact": self.exact,
            "deterministic": self.deterministic,
            "notes": [
                "percentiles of the assembly preload pool every bolt of every sample; the "
                "residual clamp load is the smallest sector gasket force of a sample",
                "slip does not apply to an axially loaded gasketed flange",
                "the passes are linear about the deterministic ring: a bolt the model leaves "
                "below zero is taken as loose (zero preload)",
                "a sampled relaxation factor is taken at most 1 (the few normal samples "
                "above are truncated)",
            ],
        }


def flange_scatter(
    spec: FlangeSpec,
    samples: int,
    seed: int = 0,
    chunk_blocks: int = 1,
    convergence: Convergence | None = None,
    progress: Any = None,
) -> FlangeScatterResult:
    """Monte Carlo of the flange's assembly scatter (see the module docstring)."""
    if samples < 1:
        raise InputError(
            f"the number of samples must be at least 1, got {samples}", key="--samples"
        )
    det = analyse_flange(spec, compensate=False)
    n = spec.bolt_count
    thr = spec.thread
    block = max(256, BLOCK // max(n * len(spec.passes), 1))  # bounded memory per block
    cyc = det.cycle
    g_start = cyc["start_up"].gasket
    F_det = det.passes[-1]
    loss = F_det - g_start  # per sector, assembly -> start-up, ring model
    cool_change = cyc["cooled"].gasket - cyc["hot"].gasket  # per sector, on cooling back
    gain = det.service_bolt - F_det  # per bolt, ring model
    P_det = cyc.relaxation
    Hp_n = det.app2.Hp / n
    muG_lo, muG_hi = spec.thread_friction
    muK_lo, muK_hi = spec.head_friction
    DKm = 0.5 * (spec.bearing_diameter + spec.hole)
    Rp = spec.grade.Rp02
    Rp_T = float(yield_at_temperature(spec.grade, spec.T_bolt)[0])
    Wp = math.pi * thr.ds**3 / 16
    tol = spec.torque_tolerance
    dists = dict(spec.distributions)
    if spec.nut_factor is None and "nut_factor" in dists:
        raise InputError(
            "nut_factor varies a nut factor: give tightening.nut_factor",
            key="distributions.nut_factor",
        )
    for k in ("thread_friction", "head_friction"):
        if spec.nut_factor is not None and k in dists:
            raise InputError(
                "with a nut factor the friction is implied by it: vary nut_factor",
                key=f"distributions.{k}",
            )
    fixed_note = "uniform over the file's range"
    sampled: dict[str, Dist] = {
        "thread_friction": dists.get("thread_friction", Dist("uniform", muG_lo, muG_hi)),
        "head_friction": dists.get("head_friction", Dist("uniform", muK_lo, muK_hi)),
    }
    dist = {
        k: sampled[k].describe() + (" (each bolt)" if k in dists else f" ({fixed_note}, each bolt)")
        for k in sampled
    }
    torque_mode = spec.method == "torque"
    if spec.nut_factor is not None and torque_mode:
        K_lo, K_hi = spec.nut_factor
        sampled["nut_factor"] = dists.get("nut_factor", Dist("uniform", K_lo, K_hi))
        dist["nut_factor"] = sampled["nut_factor"].describe() + " (each bolt)"
        for k in ("thread_friction", "head_friction"):
            sampled.pop(k)
            dist.pop(k)
    if torque_mode:
        if "torque" in dists:
            sampled["torque"] = dists["torque"]
            dist["torque"] = dists["torque"].describe("N*m") + " (each bolt, each pass)"
        else:
            sampled["torque_factor"] = dists.get("torque_factor", Dist("uniform", 1 - tol, 1 + tol))
            dist["torque_factor"] = sampled["torque_factor"].describe() + " (each bolt, each pass)"
    else:
        lo_a, hi_a = det.assembly_range
        sampled["preload"] = dists.get("preload", Dist("uniform", lo_a, hi_a))
        dist["preload"] = sampled["preload"].describe("N") + " (each bolt)"
    if "gasket_relaxation" in dists:
        sampled["gasket_relaxation"] = dists["gasket_relaxation"]
        dist["gasket_relaxation"] = dists["gasket_relaxation"].describe() + " (each flange)"
    else:
        dist["gasket_relaxation"] = f"fixed {P_det:.4g} ({cyc.relaxation_basis})"

    pull = None
    if det.tensioning is not None:  # each bolt's largest pull per unit preload left
        pull = det.tensioning.peak / np.maximum(F_det, 1e-300)
    passes_model = _PassModel(det) if torque_mode else None

    def one_block(b: int, m: int) -> dict[str, np.ndarray]:
        rng = block_rng(seed, b)
        tau = np.zeros((m, n))
        if torque_mode:
            npass = len(spec.passes)
            if "nut_factor" in sampled:
                K = sampled["nut_factor"].sample(rng, m * n).reshape(m, n)
                k_T = K * thr.d
                muG = None
            else:
                muG = sampled["thread_friction"].sample(rng, m * n).reshape(m, n)
                muK = sampled["head_friction"].sample(rng, m * n).reshape(m, n)
                k_T = 0.16 * thr.P + 0.58 * thr.d2 * muG + 0.5 * muK * DKm
            if "torque" in sampled:
                T_set = sampled["torque"].sample(rng, m * npass * n).reshape(m, npass, n)
            else:
                f = sampled["torque_factor"].sample(rng, m * npass * n).reshape(m, npass, n)
                T_set = det.torque[0] * f
            targets = np.asarray(spec.passes)[None, :, None] * T_set / k_T[:, None, :]
            FM = passes_model.final(targets)
            if muG is not None:
                tau = FM * (thr.d2 / 2) * (thr.P / (math.pi * thr.d2) + 1.155 * muG) / Wp
        else:
            FM = sampled["preload"].sample(rng, m * n).reshape(m, n)
        FM = np.maximum(FM, 0.0)
        P = (
            np.clip(sampled["gasket_relaxation"].sample(rng, m), 0.0, 1.0)
            if "gasket_relaxation" in sampled
            else np.full(m, P_det)
        )
        gasket = FM - loss[None, :]
        hot = P[:, None] * np.maximum(gasket, 0.0)
        cooled = hot + cool_change[None, :]
        after = np.minimum(hot, cooled).min(axis=1)
        FS = FM + gain[None, :]
        # at assembly a tensioned bolt carries the tool's pull, above what its nut keeps
        F_asm = FM * pull[None, :] if pull is not None else FM
        s_asm = np.sqrt((F_asm / thr.As) ** 2 + 3 * (0.75 * tau) ** 2)  # plastic W_p, as R7
        s_srv = np.sqrt((FS / thr.As) ** 2 + 3 * (0.5 * tau) ** 2)
        gmin = gasket.min(axis=1)
        y_asm = np.any(s_asm > Rp, axis=1)
        y_srv = np.any(s_srv > Rp_T, axis=1)
        return {
            "assembly_preload": FM.ravel(),
            "residual_clamp_load": np.maximum(gmin, 0.0),
            "gasket_after_cycle": np.maximum(after, 0.0),
            "gasket_below_operating": gmin < Hp_n,
            "gasket_below_operating_after_cycle": after < Hp_n,
            "separation": gmin <= 0.0,
            "bolt_yield": y_asm | y_srv,
            "bolt_yield_assembly": y_asm,
            "bolt_yield_service": y_srv,
            "slip": np.zeros(m, dtype=bool),
        }

    got = run(one_block, block, samples, QUANTS, EVENTS, {"slip": False}, convergence, progress, n)
    failing = [c.name for c in det.checks if not c.passed]
    deterministic = {
        "target_preload_N": det.target,
        "assembly_preload_min_N": det.assembly_range[0],
        "assembly_preload_max_N": det.assembly_range[1],
        "operating_minimum_per_sector_N": Hp_n,
        "window_N": list(det.window),
        "ok": det.ok,
        "failing_checks": failing,
    }
    return FlangeScatterResult(
        spec,
        got.samples,
        seed,
        got.percentiles,
        got.counts,
        got.histogram,
        deterministic,
        dist,
        got.exact,
        got.intervals,
        got.convergence,
    )


class _PassModel:
    """Bolt forces after the pass sequence, linear about the deterministic passes.

    The tangent ``C[:, j]`` (bolt forces per unit turn of nut j) is taken on the
    assembled ring (one solve per bolt).  Each pass turns each nut, in its order, until
    its bolt reaches that pass's target, never back (the rule of the ring's own
    simulation); vectorised over the samples.  The result is anchored on the
    deterministic simulation: ``F = F_det + (F_lin(targets) - F_lin(nominal))``, exact
    without scatter.
    """

    def __init__(self, det: Any) -> None:
        from ..flange.service import snapshot

        ring = det.ring
        n = ring.n
        zero = np.zeros(n)
        base = snapshot(ring).solve(zero)[1]
        eps = 1e-7 * max(float(np.max(det.passes[-1])), 1.0) / (ring.k_bolt * ring.scale_k[0])
        C = np.empty((n, n))
        for j in range(n):
            r = snapshot(ring)
            r.bolt_free[j] -= eps
            C[:, j] = (r.solve(zero)[1] - base) / eps
        self.C = C
        self.orders = [list(o) for o in det.orders]
        self.F_det = det.passes[-1]
        nominal = np.asarray(det.pass_fractions)[:, None] * np.full((1, n), det.target)
        self.F_nom = self._linear(nominal[None, :, :])[0]

    def _linear(self, targets: np.ndarray) -> np.ndarray:
        """(samples, passes, bolts) targets -> (samples, bolts) final forces, from zero."""
        m = targets.shape[0]
        F = np.zeros((m, self.C.shape[0]))
        for p, order in enumerate(self.orders):
            for j in order:
                turn = np.maximum(targets[:, p, j] - F[:, j], 0.0) / self.C[j, j]
                F += turn[:, None] * self.C[:, j][None, :]
        return F

    def final(self, targets: np.ndarray) -> np.ndarray:
        return self.F_det[None, :] + self._linear(targets) - self.F_nom[None, :]
