"""Statistical assembly scatter: Monte Carlo of tightening, settling, temperature and load.

Each sample draws the thread and head friction (uniform over the file's ranges
unless a distribution is given), the torque-tool accuracy, and whatever the
optional ``[distributions]`` table lists (torque, preload, embedding,
temperature, axial load, bolt yield strength, interface friction), then runs the
joint chain of ``clampstack check`` in closed form, vectorised over the samples:
torque -> assembly preload (ISO 16047 / VDI 2230-1 R13), embedding loss,
thermal change with the moduli at temperature (VDI 2230-1, 5.4.2.3), service
load through the joint diagram with separation handled exactly piecewise
(:func:`clampstack.joint.analysis.service_closed_form`).

Samples are processed in blocks of ``BLOCK`` with their own random streams
(``numpy.random.SeedSequence(seed).spawn``), so the answer for a seed does not
depend on how many blocks are processed at once, and memory stays bounded for
any number of samples.  Percentiles are exact up to ``EXACT_LIMIT`` samples and
from a fine histogram (2**17 bins between the sample extremes, found in a first
pass) beyond.  Probabilities carry Clopper-Pearson 95 % intervals (Clopper and
Pearson, Biometrika 26, 1934).
"""

from __future__ import annotations

import math
from collections.abc import Callable
from dataclasses import dataclass, field
from typing import Any

import numpy as np

from ..catalog import yield_at_temperature
from ..components import permissible_preload
from ..components.tightening import angle_preload
from ..display import Shown
from ..errors import InputError
from ..joint.analysis import analyse, eccentric_joints
from ..joint.eccentric import EccentricJoint, eccentric_states
from ..joint.model import DIST_KEYS, DIST_LOWER_BOUNDS, Dist, JointSpec
from ..joint.prepare import (
    Prepared,
    prepare,
    service_closed_form,
    service_preload,
    temperature_data_notes,
)
from .sampling import (  # noqa: F401  (re-exported for the flange study and callers)
    BINS,
    BLOCK,
    EXACT_LIMIT,
    QUANTILES,
    Convergence,
    block_rng,
    clopper_pearson,
    event_probability,
    run,
)

# --------------------------------------------------------------------------- the chain


@dataclass(frozen=True)
class Chain:
    """Everything the per-sample chain needs, fixed for a joint (SI floats)."""

    prep: Prepared
    dists: dict[str, Dist]
    FA_lo: float
    FA_hi: float
    FQ: float
    mu_T: float
    Rp: float
    T_service: float
    #: eccentric joints: the joint at service temperature, its opening edge as check finds it
    eccentric: EccentricJoint | None = None


def make_chain(spec: JointSpec, dists: dict[str, Dist]) -> Chain:
    """Resolve the default distributions (friction ranges, torque-tool accuracy)."""
    prep = prepare(spec)
    tr = spec.tightening
    d = dict(dists)
    for name, rng_ in (
        ("thread_friction", tr.thread_friction),
        ("head_friction", tr.head_friction),
    ):
        if name not in d:
            d[name] = Dist("uniform", *rng_) if rng_[0] != rng_[1] else Dist("fixed", rng_[0])
    if tr.method == "angle" and "angle" not in d:
        assert tr.angle is not None
        d["angle"] = Dist(
            "uniform", max(tr.angle[0] - tr.angle_tolerance, 0.0), tr.angle[1] + tr.angle_tolerance
        )
    if (
        tr.method in ("torque", "angle")
        and "torque" not in d
        and "torque_factor" not in d
        and tr.torque_tolerance > 0
    ):
        # the tool's torque tolerance (given, from `tool`, or the +-6 % default) as a uniform
        # scatter of the applied torque, as the deterministic range takes it
        tol = tr.torque_tolerance
        d["torque_factor"] = Dist("uniform", 1 - tol, 1 + tol)
    if tr.method == "tension" and "preload" not in d:
        # a tensioner's scatter: the deterministic range (tightening factor) as a uniform
        d["preload"] = Dist("uniform", prep.assembly_min, prep.assembly_max)
    if tr.method in ("yield", "angle") and "yield_strength" not in d:
        # bolts of a lot between R_p0.2min and 1.2 R_p0.2min (VDI 2230-1, from memory)
        d["yield_strength"] = Dist("uniform", spec.bolt.grade.Rp02, 1.2 * spec.bolt.grade.Rp02)
    return Chain(
        prep,
        d,
        spec.service.axial_load[0],
        spec.service.axial_load[1],
        spec.service.shear_load,
        spec.requirements.slip_friction,
        spec.bolt.grade.Rp02,
        spec.service.temperature,
        None if spec.eccentric is None else eccentric_joints(spec, prep.model)[1],
    )


def _draw(chain: Chain, rng: np.random.Generator, n: int) -> dict[str, np.ndarray]:
    """One block of random inputs, always drawn in the same order (reproducibility)."""
    out = {}
    for name in DIST_KEYS:  # fixed order
        if name in chain.dists:
            out[name] = chain.dists[name].sample(rng, n)
    return out


def evaluate(chain: Chain, x: dict[str, np.ndarray], n: int) -> dict[str, np.ndarray]:
    """The joint chain for ``n`` samples of inputs ``x`` (vectorised)."""
    prep = chain.prep
    s = prep.spec
    tr = s.tightening
    thr = s.bolt.thread
    muG = np.maximum(x.get("thread_friction", np.full(n, tr.thread_friction[0])), 0.0)
    muK = np.maximum(x.get("head_friction", np.full(n, tr.head_friction[0])), 0.0)
    Rp = x.get("yield_strength")
    Rp_arr = np.full(n, chain.Rp) if Rp is None else np.maximum(Rp, 1.0)
    # assembly preload
    if tr.method == "torque":
        if "torque" in x:
            T = x["torque"]
        else:
            T = prep.torque[0] * x.get("torque_factor", np.ones(n))
        FM = T / prep.k_torque_fn(muG, muK)
    elif tr.method == "angle":
        # snug torque through the torque relation, then the angle (bilinear bolt past yield)
        F_snug = tr.snug_torque * x.get("torque_factor", np.ones(n)) / prep.k_torque_fn(muG, muK)
        Fy = np.asarray(permissible_preload(prep.A0, prep.d0, thr.d2, thr.P, Rp_arr, muG, 1.0))
        Fu = Fy * s.bolt.grade.Rm / s.bolt.grade.Rp02
        FM, _, _ = angle_preload(
            F_snug,
            x["angle"],
            thr.P,
            prep.springs.delta_S,
            prep.springs.delta_P,
            Fy,
            Fu,
            s.clamp_length,
        )
    elif tr.method == "yield":
        FM = np.asarray(permissible_preload(prep.A0, prep.d0, thr.d2, thr.P, Rp_arr, muG, 1.0))
    else:  # tension
        FM = x["preload"]
    FM = np.maximum(FM, 0.0)
    dSa, dPa = prep.springs.delta_S, prep.springs.delta_P
    fZ = np.maximum(x.get("embedding", np.full(n, prep.embedding_amount)), 0.0)
    # temperature: the model's resiliences and free elongations at the sampled temperatures
    if "temperature" in x:
        Ts = x["temperature"]
    else:
        Ts = np.full(1, chain.T_service)
    dS, dP = prep.model.resiliences(Ts)
    thb, thc = prep.model.thermal(Ts)
    phi = s.service.load_height * dP / (dS + dP)
    FV = service_preload(FM, dSa + dPa, dS + dP, thb - thc, fZ)
    FA_hi = x.get("axial_load", np.full(n, chain.FA_hi))
    pre, _ = service_closed_form(FV, phi, 0.0)
    e = s.eccentric
    if e is None:
        FS_hi, FK_hi = service_closed_form(FV, phi, FA_hi)
        FS_lo, FK_lo = service_closed_form(FV, phi, chain.FA_lo)
        opening = FK_hi <= 0.0
    else:  # VDI 2230-1 linear where closed, the contact model where the interface opens
        ej = chain.eccentric
        assert ej is not None
        beta = prep.model.bending(Ts)
        geo = (s.service.load_height, e.bolt_offset, e.load_offset, ej.u, e.interface)
        MB_lo, MB_hi = s.service.bending_moment
        hi = eccentric_states(dS, dP, beta, *geo, FV, FA_hi, MB_hi, lift_off=True)
        lo = eccentric_states(dS, dP, beta, *geo, FV, chain.FA_lo, MB_lo, lift_off=True)
        FS_hi, FK_hi, FS_lo, FK_lo = hi.bolt_load, hi.clamp_load, lo.bolt_load, lo.clamp_load
        # F_Kab of the sampled load (VDI 2230-1 5.3.2; geometry only): the clamp load below it
        opening = FK_hi < ej.opening_clamp_load(FA_hi, MB_hi)
    residual = np.minimum(FK_hi, FK_lo)
    # bolt yield at assembly: tension with thread torsion on the plastic section modulus
    # pi d0^3/12, as in VDI 2230-1 R7 (so the yield preload is F_M,zul at nu = 1); in
    # service: the residual torsion k_tau = 0.5 on the elastic pi d0^3/16 (R8)
    Wp = math.pi * prep.d0**3 / 16
    tau_a = FM * (thr.d2 / 2) * (thr.P / (math.pi * thr.d2) + 1.155 * muG) / Wp
    if tr.method == "tension":
        tau_a = np.zeros(n)
    s_asm = np.sqrt((FM / prep.A0) ** 2 + 3 * (0.75 * tau_a) ** 2)
    if "temperature" in x:
        ratio_T = (
            np.asarray(
                yield_at_temperature(s.bolt.grade, prep.model.part_T(s.bolt.temperature, Ts))[0]
            )
            / s.bolt.grade.Rp02
        )
    else:
        ratio_T = float(yield_at_temperature(s.bolt.grade, s.bolt.temperature)[0]) / (
            s.bolt.grade.Rp02
        )
    FSmax = np.maximum(FS_hi, FS_lo)
    s_srv = np.sqrt((FSmax / prep.A0) ** 2 + 3 * (0.5 * tau_a) ** 2)
    yield_asm = s_asm > Rp_arr
    yield_srv = s_srv > Rp_arr * ratio_T
    yield_ = yield_asm | yield_srv
    mu_T = x.get("slip_friction", np.full(n, chain.mu_T))
    slip = (residual * np.maximum(mu_T, 0.0) < chain.FQ) if chain.FQ > 0 else np.zeros(n, bool)
    separation = FK_hi <= 0.0 if chain.FA_hi > 0 or "axial_load" in x else np.zeros(n, bool)
    return {
        "assembly_preload": FM,
        "service_preload": np.broadcast_to(pre, (n,)),
        "residual_clamp_load": np.broadcast_to(residual, (n,)),
        "separation": np.broadcast_to(separation, (n,)),
        "opening": np.broadcast_to(opening, (n,)),
        "bolt_yield": np.broadcast_to(yield_, (n,)),
        "bolt_yield_assembly": np.broadcast_to(yield_asm, (n,)),
        "bolt_yield_service": np.broadcast_to(yield_srv, (n,)),
        "slip": np.broadcast_to(slip, (n,)),
    }


# --------------------------------------------------------------------------- the study


@dataclass(frozen=True)
class ScatterResult(Shown):
    """Percentiles, probabilities and the deterministic comparisons."""

    spec: JointSpec
    samples: int
    seed: int
    percentiles: dict[str, dict[str, float]]
    counts: dict[str, int]
    histogram: dict[str, tuple[np.ndarray, np.ndarray]]  # quantity -> (edges, counts)
    deterministic: dict[str, Any]
    nasa: dict[str, Any]
    distributions: dict[str, str]
    exact: bool
    intervals: dict[str, dict[str, dict[str, float]]] = field(default_factory=dict)
    convergence: dict[str, Any] = field(default_factory=dict)
    notes: tuple[str, ...] = ()

    def probability(self, name: str) -> dict[str, float]:
        """Estimate and 95 % interval of an event's probability."""
        return event_probability(self.counts[name], self.samples)

    @property
    def probability_check(self) -> dict[str, Any]:
        """The file's ``max_failure_probability`` against the 95 % upper bounds."""
        limit = self.spec.requirements.max_failure_probability
        events = ("separation", "bolt_yield", "slip") + (
            ("opening",) if self.spec.eccentric is not None else ()
        )
        applies = self.convergence.get("events", {}) if self.convergence else {}
        over = [
            e
            for e in events
            if limit is not None
            and applies.get(e, {}).get("state") != "does not apply"
            and self.probability(e)["high"] > limit
        ]
        return {"limit": limit, "exceeded": over, "ok": not over}

    @property
    def ok(self) -> bool:
        """Exit rule of ``scatter``: the deterministic checks pass and no failure probability
        exceeds the file's ``[requirements] max_failure_probability`` (95 % upper bound)."""
        return bool(self.deterministic["ok"]) and self.probability_check["ok"]

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
            "nasa_std_5020": self.nasa,
            "notes": list(self.notes),
            "probability_limit": self.probability_check,
            "ok": self.ok,
        }


QUANTS = ("assembly_preload", "service_preload", "residual_clamp_load")
EVENTS = (
    "separation",
    "opening",
    "bolt_yield",
    "bolt_yield_assembly",
    "bolt_yield_service",
    "slip",
)


def scatter(
    spec: JointSpec,
    dists: dict[str, Dist],
    samples: int,
    seed: int = 0,
    chunk_blocks: int = 4,
    progress: Callable[[int], None] | None = None,
    convergence: Convergence | None = None,
) -> ScatterResult:
    """Run the Monte Carlo study (see the module docstring).

    ``convergence=None``: exactly ``samples`` samples.  Otherwise ``samples`` is the first
    round and sampling goes on in whole blocks until every probability that applies has
    converged (:mod:`clampstack.studies.sampling`).  ``chunk_blocks`` is kept for callers;
    the blocks are evaluated one at a time (the results do not depend on it).
    """
    if spec.eccentric is not None:
        spec.eccentric.refuse_outside_core("scatter")
    if samples < 1:
        raise InputError(
            f"the number of samples must be at least 1, got {samples}", key="--samples"
        )
    if samples > 10**10:
        raise InputError("at most 1e10 samples", key="--samples")
    if chunk_blocks < 1:
        raise InputError("chunk must be at least one block", key="chunk")
    chain = make_chain(spec, dists)
    # the service temperatures the study reaches: sampled (mean +- 6 std for normal) or fixed
    T_span = np.array([spec.service.temperature])
    if "temperature" in chain.dists:
        d = chain.dists["temperature"]
        T_span = np.array([d.a, d.b] if d.kind == "uniform" else [d.a - 6 * d.b, d.a + 6 * d.b])
        try:
            chain.prep.model.check_range(T_span, extrapolate=True)
        except InputError as err:
            raise InputError(
                err.detail + " (sampled temperatures, mean +- 6 std for normal)",
                key="distributions.temperature",
            ) from None

    def block(b: int, size: int) -> dict[str, np.ndarray]:
        return evaluate(chain, _draw(chain, block_rng(seed, b), size), size)

    applies = {
        "separation": chain.FA_hi > 0 or "axial_load" in chain.dists,
        "opening": chain.FA_hi > 0
        or "axial_load" in chain.dists
        or (spec.eccentric is not None and any(spec.service.bending_moment)),
        "slip": chain.FQ > 0,
    }
    got = run(block, BLOCK, samples, QUANTS, EVENTS, applies, convergence, progress)

    det = analyse(spec)
    failing = [c.name for c in det.checks if not c.passed]
    governing = det.governing.name if det.governing is not None else None
    deterministic = {
        "assembly_preload_min_N": det.assembly_min,
        "assembly_preload_max_N": det.assembly_max,
        "tightening_factor": det.alpha_A,
        "residual_clamp_load_min_N": det.residual_clamp_min,
        "separation_load_N": None if det.eccentric else det.separation_load,
        "opening_load_N": det.eccentric["opening_load_N"] if det.eccentric else None,
        "ok": det.ok,
        "failing_checks": failing,
        "governing_check": governing,
    }
    nasa = _nasa(chain, det)
    notes = temperature_data_notes(spec, chain.prep.model, T_span)
    for name, dist in chain.dists.items():  # truncated tails (at most MAX_TRUNCATED)
        bound = DIST_LOWER_BOUNDS.get(name)
        share = dist.share_below(bound) if bound is not None else 0.0
        if share > 1e-12:
            notes.append(
                f"{name}: about {share:.2g} of the samples fall below "
                f"{'absolute zero' if name == 'temperature' else f'{bound:g}'} and are "
                "truncated to it (the quantity cannot be negative)"
            )
    described = {k: v.describe(**_unit(k)) for k, v in chain.dists.items()}
    return ScatterResult(
        spec,
        got.samples,
        seed,
        got.percentiles,
        got.counts,
        got.histogram,
        deterministic,
        nasa,
        described,
        got.exact,
        got.intervals,
        got.convergence,
        tuple(notes),
    )


def _unit(key: str) -> dict[str, Any]:
    """Display unit of a sampled input (for the text and the JSON description)."""
    return {
        "torque": {"unit": "N*m"},
        "preload": {"unit": "kN", "factor": 1e3},
        "axial_load": {"unit": "kN", "factor": 1e3},
        "embedding": {"unit": "um", "factor": 1e-6},
        "temperature": {"unit": "degC", "offset": 273.15, "spread_unit": "K"},
        "yield_strength": {"unit": "MPa", "factor": 1e6},
        "angle": {"unit": "deg", "factor": math.pi / 180},
    }.get(key, {})


def _nasa(chain: Chain, det) -> dict[str, Any]:
    """Preload bounds after the preload-uncertainty approach of NASA-STD-5020 (from memory).

    P_max = (1 + Gamma) P_nom + dP_T+,  P_min = (1 - Gamma) P_nom - P_relax - dP_T-,
    with Gamma = 0.35 for unlubricated and 0.25 for lubricated torque control (our rule:
    lubricated when the mean thread friction is at most 0.12).  P_relax is the embedding
    loss; dP_T the thermal preload change at the service temperature.  Clause numbers are
    not restated here (from memory: the preload section of NASA-STD-5020A).
    """
    prep = chain.prep
    s = prep.spec
    tr = s.tightening
    if tr.method != "torque" or prep.torque is None:
        return {
            "applies": False,
            "reason": "the NASA-STD-5020 uncertainty factors are for torque-controlled tightening",
        }
    mu_mean = 0.5 * sum(tr.thread_friction)
    lubricated = mu_mean <= 0.12
    gamma = 0.25 if lubricated else 0.35
    P_nom = prep.torque[0] / prep.k_torque_fn(mu_mean, 0.5 * sum(tr.head_friction))
    dT = det.thermal_change
    P_max = (1 + gamma) * P_nom + max(dT, 0.0)
    P_min = (1 - gamma) * P_nom - prep.embedding_loss - max(-dT, 0.0)
    FA = max(s.service.axial_load[1], 0.0)
    return {
        "applies": True,
        "lubricated": lubricated,
        "uncertainty": gamma,
        "preload_nominal_N": P_nom,
        "preload_max_N": P_max,
        "preload_min_N": P_min,
        "residual_clamp_load_min_N": P_min - (1 - det.load_factor_service) * FA,
        "source": "NASA-STD-5020A preload uncertainty approach (factors and clauses from memory)",
    }
