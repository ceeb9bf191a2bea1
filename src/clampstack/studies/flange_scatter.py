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
from .sampling import BLOCK, Convergence, block_rng, event_probability, run

QUANTS = ("assembly_preload", "residual_clamp_load")
EVENTS = (
    "gasket_below_operating",
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
    block = max(256, BLOCK // max(n, 1))  # samples per block: bounded memory per block
    loss = det.assembly_gasket - det.service_gasket  # per sector, ring model
    gain = det.service_bolt - det.passes[-1]  # per bolt, ring model
    Hp_n = det.app2.Hp / n
    muG_lo, muG_hi = spec.thread_friction
    muK_lo, muK_hi = spec.head_friction
    DKm = 0.5 * (spec.bearing_diameter + spec.hole)
    Rp = spec.grade.Rp02
    Rp_T = float(yield_at_temperature(spec.grade, spec.T_bolt)[0])
    Wp = math.pi * thr.ds**3 / 16
    tol = spec.torque_tolerance
    dist = {
        "thread_friction": f"uniform {muG_lo:.4g}..{muG_hi:.4g} (each bolt)",
        "head_friction": f"uniform {muK_lo:.4g}..{muK_hi:.4g} (each bolt)",
    }
    if spec.method == "torque":
        dist["torque_factor"] = f"uniform {1 - tol:.4g}..{1 + tol:.4g} (each bolt)"
    else:
        dist["preload"] = (
            f"uniform {det.assembly_range[0]:.4g}..{det.assembly_range[1]:.4g} N (each bolt)"
        )

    pull = None
    if det.tensioning is not None:  # each bolt's largest pull per unit preload left
        pull = det.tensioning.peak / np.maximum(det.passes[-1], 1e-300)

    def one_block(b: int, m: int) -> dict[str, np.ndarray]:
        rng = block_rng(seed, b)
        muG = rng.uniform(muG_lo, muG_hi, (m, n))
        muK = rng.uniform(muK_lo, muK_hi, (m, n))
        if spec.method == "torque":
            T = det.torque[0] * rng.uniform(1 - tol, 1 + tol, (m, n))
            FM = T / (0.16 * thr.P + 0.58 * thr.d2 * muG + 0.5 * muK * DKm)
            tau = FM * (thr.d2 / 2) * (thr.P / (math.pi * thr.d2) + 1.155 * muG) / Wp
        else:
            FM = rng.uniform(*det.assembly_range, (m, n))
            tau = np.zeros((m, n))
        gasket = FM - loss[None, :]
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
            "gasket_below_operating": gmin < Hp_n,
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
