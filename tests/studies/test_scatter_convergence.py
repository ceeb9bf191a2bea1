"""Adaptive Monte Carlo against an exact probability; percentile intervals; yield split.

The exact reference: with both friction coefficients fixed, the assembly preload is
``F_M = T / k`` and the bolt yields at assembly exactly when ``F_M`` exceeds the yield
preload ``F_M,0.2`` of VDI 2230-1 R7 with ``nu = 1``, i.e. when the torque exceeds
``T* = F_M,0.2 k``.  For a normal torque the probability is the normal tail
``1 - Phi((T* - mu)/sigma)`` (scipy.stats.norm, an independent route to the number).
"""

from __future__ import annotations

import math

import numpy as np
from scipy.stats import norm

from clampstack.components import permissible_preload
from clampstack.inputs.joint import joint_from_data
from clampstack.joint.model import Dist
from clampstack.joint.prepare import prepare
from clampstack.studies.sampling import Convergence, quantile_ranks
from clampstack.studies.scatter import scatter

MU = 0.12


def _spec():
    return joint_from_data(
        {
            "title": "exact tail",
            "bolt": {"thread": "M12", "grade": "8.8", "length": "50 mm"},
            "nut": {},
            "clamped": [{"material": "steel", "thickness": "30 mm"}],
            "tightening": {"torque": "70 N*m", "thread_friction": MU, "head_friction": MU},
            "service": {"axial_load": "5 kN"},
        }
    )


def _exact(spec, mean: float, std: float) -> float:
    prep = prepare(spec)
    thr = spec.bolt.thread
    F02 = float(permissible_preload(prep.A0, prep.d0, thr.d2, thr.P, spec.bolt.grade.Rp02, MU, 1.0))
    T_star = F02 * prep.k_torque_fn(MU, MU)
    return float(norm.sf((T_star - mean) / std)), T_star


def test_adaptive_sampling_converges_on_an_exact_tail_probability():
    spec = _spec()
    _, T_star = _exact(spec, 0.0, 1.0)
    std = 4.0
    mean = T_star - 3.719 * std  # tail probability about 1e-4
    p, _ = _exact(spec, mean, std)
    assert 0.8e-4 < p < 1.2e-4
    dists = {"torque": Dist("normal", mean, std)}
    conv = Convergence(rel_width=0.3, negligible=1e-5, max_samples=20_000_000)
    r = scatter(spec, dists, 100_000, seed=3, convergence=conv)
    pr = r.probability("bolt_yield_assembly")
    assert r.convergence["converged"] is True
    assert r.convergence["events"]["bolt_yield_assembly"]["state"] == "converged"
    assert pr["low"] <= p <= pr["high"]
    assert (pr["high"] - pr["low"]) / pr["estimate"] <= 0.3
    assert r.samples > 100_000  # 1e-4 needs more than the first round
    # yield in service is rarer here (k_tau = 0.5); either one counts in bolt_yield
    assert r.counts["bolt_yield"] >= max(
        r.counts["bolt_yield_assembly"], r.counts["bolt_yield_service"]
    )
    # the percentile interval of the median assembly preload holds the exact median T/k
    med = mean / prepare(spec).k_torque_fn(MU, MU)
    ci = r.intervals["assembly_preload"]["p50"]
    assert ci["low"] <= med <= ci["high"]


def test_a_capped_run_says_it_has_not_converged():
    spec = _spec()
    _, T_star = _exact(spec, 0.0, 1.0)
    dists = {"torque": Dist("normal", T_star - 4.5 * 4.0, 4.0)}  # about 3e-6
    conv = Convergence(rel_width=0.1, negligible=1e-9, max_samples=200_000)
    r = scatter(spec, dists, 65_536, seed=1, convergence=conv)
    assert r.convergence["converged"] is False
    assert r.convergence["events"]["bolt_yield_assembly"]["converged"] is False
    assert r.samples <= 4 * 65_536


def test_fixed_samples_stay_exactly_as_asked():
    r = scatter(_spec(), {}, 12_345, seed=0)
    assert r.samples == 12_345 and r.convergence["adaptive"] is False


def test_quantile_ranks_of_the_median():
    # n = 100, median: the distribution-free 95 % interval is x(40) .. x(61) (1-based;
    # binomial tables, e.g. Conover, Practical Nonparametric Statistics, from memory)
    assert quantile_ranks(100, 0.5) == (39, 60)
    # coverage of the rule, by simulation of uniform samples (exact median 0.5)
    rng = np.random.default_rng(0)
    hits = 0
    for _ in range(2000):
        x = np.sort(rng.random(100))
        i, j = quantile_ranks(100, 0.5)
        hits += x[i] <= 0.5 <= x[j]
    assert hits / 2000 > 0.94


def test_the_deterministic_comparison_names_the_failing_check():
    spec = joint_from_data(
        {
            "title": "overtorqued",
            "bolt": {"thread": "M12", "grade": "8.8", "length": "50 mm"},
            "nut": {},
            "clamped": [{"material": "steel", "thickness": "30 mm"}],
            "tightening": {"torque": "120 N*m", "thread_friction": "0.10..0.14"},
            "service": {"axial_load": "5 kN"},
        }
    )
    r = scatter(spec, {}, 2000)
    d = r.to_dict()["deterministic"]
    assert d["ok"] is False and "assembly_preload" in d["failing_checks"]
    assert not math.isnan(r.probability("bolt_yield")["estimate"])
