"""Monte Carlo bookkeeping shared by the scatter studies: blocks, counts, percentiles.

Samples are processed in blocks, each with its own random stream
(``numpy.random.SeedSequence(seed, spawn_key=(b,))``, the ``b``-th child of the
seed), so a block's samples do not depend on how many blocks are run.

* **Fixed size** (``rel_width=None``): exactly the requested number of samples.
* **Adaptive**: whole blocks, round after round, until the 95 % interval of every
  reported probability that applies is narrower than ``rel_width`` times its
  estimate, or its upper bound lies below ``negligible``, or ``max_samples`` is
  reached (then the study says which estimates have not converged).  The next round's
  size is the one the current counts suggest (the interval width falls as
  ``1/sqrt(k)`` with ``k`` events), between 1.25 and 8 times the samples so far.

Probabilities carry Clopper-Pearson 95 % intervals (Clopper and Pearson, Biometrika 26,
1934).  Percentiles are exact up to :data:`EXACT_LIMIT` values (then from a fine
histogram of :data:`BINS` bins between the extremes, in a second pass over the same
blocks) and carry distribution-free 95 % intervals from the order statistics: the
ranks ``l, u`` with ``P(l <= B < u) >= 0.95`` for ``B ~ Binomial(n, p)`` (e.g. Hahn and
Meeker, *Statistical Intervals*, 1991, ch. 5).
"""

from __future__ import annotations

import math
from collections.abc import Callable, Iterator
from dataclasses import dataclass, field
from typing import Any

import numpy as np

BLOCK = 1 << 16
EXACT_LIMIT = 2_000_000
BINS = 1 << 17
QUANTILES = {"p01": 1.0, "p05": 5.0, "p50": 50.0, "p95": 95.0, "p99": 99.0}


def block_rng(seed: int, b: int) -> np.random.Generator:
    """The random stream of block ``b`` (the ``b``-th child of ``seed``)."""
    return np.random.default_rng(np.random.SeedSequence(seed, spawn_key=(b,)))


def clopper_pearson(k: int, n: int, level: float = 0.95) -> tuple[float, float]:
    """Exact (Clopper-Pearson, 1934) two-sided confidence interval of a binomial proportion."""
    from scipy.special import betaincinv

    a = 1 - level
    lo = 0.0 if k == 0 else float(betaincinv(k, n - k + 1, a / 2))
    hi = 1.0 if k == n else float(betaincinv(k + 1, n - k, 1 - a / 2))
    return lo, hi


def event_probability(k: int, n: int) -> dict[str, float]:
    """``k`` events in ``n`` samples: estimate, Clopper-Pearson 95 % interval, count."""
    lo, hi = clopper_pearson(k, n)
    return {"estimate": k / n, "low": lo, "high": hi, "count": k}


def quantile_ranks(n: int, p: float, level: float = 0.95) -> tuple[int, int]:
    """0-based order-statistic indices ``(l, u)`` of a distribution-free interval of the
    ``p`` quantile from ``n`` samples (coverage at least ``level``)."""
    from scipy.stats import binom

    a = 1 - level
    lo = int(binom.ppf(a / 2, n, p)) - 1
    hi = int(binom.ppf(1 - a / 2, n, p))
    return max(lo, 0), min(hi, n - 1)


@dataclass(frozen=True)
class Convergence:
    """The adaptive rule: relative interval width, negligible level, sample cap."""

    rel_width: float = 0.3
    negligible: float = 1e-5
    max_samples: int = 10_000_000


@dataclass
class Accumulator:
    """Event counts, extremes and (while small enough) every value of each quantity."""

    quants: tuple[str, ...]
    events: tuple[str, ...]
    keep: bool = True
    counts: dict[str, int] = field(default_factory=dict)
    lo: dict[str, float] = field(default_factory=dict)
    hi: dict[str, float] = field(default_factory=dict)
    total: dict[str, float] = field(default_factory=dict)
    number: dict[str, int] = field(default_factory=dict)
    store: dict[str, list[np.ndarray]] = field(default_factory=dict)

    def __post_init__(self) -> None:
        self.counts = dict.fromkeys(self.events, 0)
        self.lo = dict.fromkeys(self.quants, math.inf)
        self.hi = dict.fromkeys(self.quants, -math.inf)
        self.total = dict.fromkeys(self.quants, 0.0)
        self.number = dict.fromkeys(self.quants, 0)
        self.store = {q: [] for q in self.quants}

    def add(self, out: dict[str, np.ndarray]) -> None:
        for e in self.events:
            self.counts[e] += int(np.count_nonzero(out[e]))
        for q in self.quants:
            v = np.asarray(out[q], dtype=float).ravel()
            self.lo[q] = min(self.lo[q], float(np.min(v)))
            self.hi[q] = max(self.hi[q], float(np.max(v)))
            self.total[q] += float(np.sum(v))
            self.number[q] += v.size
            if self.keep:
                self.store[q].append(v)
        if self.keep and max(self.number.values(), default=0) > EXACT_LIMIT:
            self.keep = False
            self.store = {q: [] for q in self.quants}

    def percentiles(
        self, again: Callable[[], Iterator[dict[str, np.ndarray]]]
    ) -> tuple[
        dict[str, dict[str, float]],
        dict[str, dict[str, dict[str, float]]],
        dict[str, tuple[np.ndarray, np.ndarray]],
        bool,
    ]:
        """Percentiles, their 95 % intervals, 60/64-bin histograms, and whether exact.

        ``again()`` yields the same blocks once more (used only beyond the exact limit).
        """
        pct: dict[str, dict[str, float]] = {}
        ci: dict[str, dict[str, dict[str, float]]] = {}
        hist: dict[str, tuple[np.ndarray, np.ndarray]] = {}
        if self.keep:
            for q in self.quants:
                allv = np.concatenate(self.store[q])
                vals = np.percentile(allv, list(QUANTILES.values()))
                pct[q] = {k: float(v) for k, v in zip(QUANTILES, vals, strict=True)}
                pct[q]["mean"] = float(np.mean(allv))
                srt = np.sort(allv)
                ci[q] = {}
                for k, p in QUANTILES.items():
                    i, j = quantile_ranks(srt.size, p / 100)
                    ci[q][k] = {"low": float(srt[i]), "high": float(srt[j])}
                c, edges = np.histogram(allv, bins=60)
                hist[q] = (edges, c)
            return pct, ci, hist, True
        fine = {q: np.zeros(BINS, dtype=np.int64) for q in self.quants}
        for out in again():  # the same samples again: fine histograms
            for q in self.quants:
                span = self.hi[q] - self.lo[q]
                v = np.asarray(out[q], dtype=float).ravel()
                if span <= 0:
                    fine[q][0] += v.size
                    continue
                idx = np.minimum(((v - self.lo[q]) / span * BINS).astype(np.int64), BINS - 1)
                fine[q] += np.bincount(idx, minlength=BINS)
        for q in self.quants:
            cum = np.cumsum(fine[q])
            lo, span, n = self.lo[q], self.hi[q] - self.lo[q], self.number[q]

            def at(target: float, cum=cum, q=q, lo=lo, span=span) -> float:
                # value below which ``target`` of the samples lie (histogram interpolation)
                if span <= 0:
                    return lo
                i = min(int(np.searchsorted(cum, target)), BINS - 1)
                prev = cum[i - 1] if i > 0 else 0
                frac = (target - prev) / max(fine[q][i], 1)
                return lo + (i + frac) / BINS * span

            pct[q] = {k: at(p / 100 * n) for k, p in QUANTILES.items()}
            pct[q]["mean"] = self.total[q] / n
            ci[q] = {}
            for k, p in QUANTILES.items():
                i, j = quantile_ranks(n, p / 100)
                ci[q][k] = {"low": at(i + 0.5), "high": at(j + 0.5)}
            coarse = fine[q].reshape(-1, BINS // 64).sum(axis=1) if span > 0 else fine[q][:64]
            hist[q] = (np.linspace(lo, self.hi[q] if span > 0 else lo + 1, 65), coarse)
        return pct, ci, hist, False


def event_status(
    counts: dict[str, int], n: int, applies: dict[str, bool], conv: Convergence
) -> dict[str, dict[str, Any]]:
    """Per event: whether its estimate has converged under ``conv``, and why."""
    out = {}
    for e, k in counts.items():
        lo, hi = clopper_pearson(k, n)
        width = (hi - lo) / (k / n) if k > 0 else math.inf
        if not applies.get(e, True):
            state, ok = "does not apply", True
        elif k > 0 and width <= conv.rel_width:
            state, ok = "converged", True
        elif hi < conv.negligible:
            state, ok = f"below {conv.negligible:g}", True
        else:
            state, ok = "not converged", False
        out[e] = {
            "converged": ok,
            "state": state,
            "relative_width": None if math.isinf(width) else width,
        }
    return out


def _next_size(
    counts: dict[str, int], n: int, status: dict[str, dict[str, Any]], conv: Convergence
) -> int:
    """Samples the counts suggest for the unconverged events (1.25..8 times ``n``)."""
    need = 1.25 * n
    for e, st in status.items():
        if st["converged"]:
            continue
        k = counts[e]
        if k > 0:
            need = max(need, 1.1 * n * (st["relative_width"] / conv.rel_width) ** 2)
        else:
            need = max(need, 1.1 * n * clopper_pearson(0, n)[1] / conv.negligible)
    return int(min(need, 8 * n))


@dataclass(frozen=True)
class Sampled:
    """What a study gets back from :func:`run`."""

    samples: int
    counts: dict[str, int]
    percentiles: dict[str, dict[str, float]]
    intervals: dict[str, dict[str, dict[str, float]]]
    histogram: dict[str, tuple[np.ndarray, np.ndarray]]
    exact: bool
    convergence: dict[str, Any]


def run(
    evaluate_block: Callable[[int, int], dict[str, np.ndarray]],
    block: int,
    samples: int,
    quants: tuple[str, ...],
    events: tuple[str, ...],
    applies: dict[str, bool],
    conv: Convergence | None = None,
    progress: Callable[[int], None] | None = None,
    values_per_sample: int = 1,
) -> Sampled:
    """Run blocks ``evaluate_block(b, size)`` fixed-size (``conv=None``) or adaptively."""
    if conv is None:
        n_blocks = -(-samples // block)
        sizes = [block] * (n_blocks - 1) + [samples - block * (n_blocks - 1)]

        def blocks() -> Iterator[dict[str, np.ndarray]]:
            done = 0
            for b in range(n_blocks):
                yield evaluate_block(b, sizes[b])
                done += sizes[b]
                if progress is not None:
                    progress(done)

        acc = Accumulator(quants, events, keep=samples * values_per_sample <= EXACT_LIMIT)
        for out in blocks():
            acc.add(out)
        pct, ci, hist, exact = acc.percentiles(blocks)
        status = event_status(acc.counts, samples, applies, Convergence(math.inf, 0.0, samples))
        conv_out = {"adaptive": False, "converged": None, "events": status}
        return Sampled(samples, acc.counts, pct, ci, hist, exact, conv_out)

    cap_blocks = max(-(-conv.max_samples // block), 1)
    n_blocks = min(max(-(-samples // block), 1), cap_blocks)
    acc = Accumulator(quants, events, keep=True)
    done_blocks, rounds = 0, 0
    while True:
        for b in range(done_blocks, n_blocks):
            acc.add(evaluate_block(b, block))
            if progress is not None:
                progress((b + 1) * block)
        done_blocks, rounds = n_blocks, rounds + 1
        n = n_blocks * block
        status = event_status(acc.counts, n, applies, conv)
        converged = all(s["converged"] for s in status.values())
        if converged or n_blocks >= cap_blocks:
            break
        n_blocks = min(
            max(-(-_next_size(acc.counts, n, status, conv) // block), n_blocks + 1), cap_blocks
        )

    def again() -> Iterator[dict[str, np.ndarray]]:
        for b in range(done_blocks):
            yield evaluate_block(b, block)

    pct, ci, hist, exact = acc.percentiles(again)
    conv_out = {
        "adaptive": True,
        "converged": converged,
        "rounds": rounds,
        "target_relative_width": conv.rel_width,
        "negligible_below": conv.negligible,
        "max_samples": cap_blocks * block,
        "events": status,
    }
    return Sampled(done_blocks * block, acc.counts, pct, ci, hist, exact, conv_out)
