"""Scatter benchmarks (targets: 1e6 samples of the chain <= 0.1 s, within 3x of the bare
numpy floor, >= 20x faster per sample than a plain Python loop; 1e8 samples <= 500 MB)."""

from __future__ import annotations

import math
import subprocess
import sys
import time
from pathlib import Path

import numpy as np

ROOT = Path(__file__).resolve().parents[1]
sys.path.insert(0, str(ROOT / "bench"))
EXAMPLE = str(ROOT / "examples" / "m16-through-bolt-alternating.toml")

import _timing as T  # noqa: E402


def main() -> None:
    from clampstack.inputs.joint import read_joint_file
    from clampstack.joint.prepare import service_closed_form
    from clampstack.studies.scatter import _draw, evaluate, make_chain, scatter

    _, spec = read_joint_file(EXAMPLE)
    chain = make_chain(spec, spec.distributions or {})
    n = 10**6
    rng = np.random.default_rng(1)
    x = _draw(chain, rng, n)
    t_draw = T.measure(lambda: _draw(chain, np.random.default_rng(1), n))

    # the floor: the same formulas written out bare, with the same inputs
    p = chain.prep
    thr = spec.bolt.thread
    dS, dP = (float(v) for v in p.model.resiliences(spec.service.temperature))
    thb, thc = (float(v) for v in p.model.thermal(spec.service.temperature))
    dSa, dPa = p.springs.delta_S, p.springs.delta_P
    phi = spec.service.load_height * dP / (dS + dP)
    DKm_k = p.k_torque_fn  # closure: 0.16 P + 0.58 d2 muG + muK DKm/2
    T0 = p.torque[0]
    FA_hi, FA_lo = spec.service.axial_load[1], spec.service.axial_load[0]
    Wp = math.pi * p.d0**3 / 16

    def floor(x=x):
        FM = T0 * x.get("torque_factor", 1.0) / DKm_k(x["thread_friction"], x["head_friction"])
        FV = (FM * (dSa + dPa) - p.embedding_amount - (thb - thc)) / (dS + dP)
        FS, FK = service_closed_form(FV, phi, FA_hi)
        FS2, FK2 = service_closed_form(FV, phi, FA_lo)
        tau = FM * (thr.d2 / 2) * (thr.P / (math.pi * thr.d2) + 1.155 * x["thread_friction"]) / Wp
        s1 = np.sqrt((FM / p.A0) ** 2 + 3 * tau**2)
        s2 = np.sqrt((np.maximum(FS, FS2) / p.A0) ** 2 + 0.75 * tau**2)
        return (s1 > 6.4e8) | (s2 > 6.4e8), np.minimum(FK, FK2) * 0.2 < 2500

    def python_loop(m=20000):
        out = 0
        for i in range(m):
            muG = x["thread_friction"][i]
            muK = x["head_friction"][i]
            FM = T0 * (x["torque_factor"][i] if "torque_factor" in x else 1.0) / DKm_k(muG, muK)
            FV = (FM * (dSa + dPa) - p.embedding_amount - (thb - thc)) / (dS + dP)
            FK = FV - (1 - phi) * FA_hi
            FS = FV + phi * FA_hi if FK >= 0 else FA_hi
            tau = FM * (thr.d2 / 2) * (thr.P / (math.pi * thr.d2) + 1.155 * muG) / Wp
            s1 = math.sqrt((FM / p.A0) ** 2 + 3 * tau**2)
            s2 = math.sqrt((FS / p.A0) ** 2 + 0.75 * tau**2)
            out += (s1 > 6.4e8) or (s2 > 6.4e8) or (max(FK, 0) * 0.2 < 2500)
        return out

    sec = "scatter"
    print(f"\n{sec} (one core)")
    m = 20000

    def chain_m():
        xm = {key: v[:m] for key, v in x.items()}
        return evaluate(chain, xm, m)

    t_c, t_f, r_floor = T.interleaved(lambda: evaluate(chain, x, n), floor)
    T.report(sec, "full chain, vectorised, 1e6 samples", t_c, 0.1)
    T.report(sec, "random draws for the chain, 1e6 samples", t_draw)
    T.report(sec, "bare numpy floor, same formulas, 1e6 samples", t_f)
    T.report_ratio(
        "ratios",
        "bare numpy floor / chain, 1e6 samples (chain within 3x: >= 0.333)",
        r_floor,
        1 / 3,
        le=False,
    )
    t_c2, t_l, r_loop = T.interleaved(chain_m, python_loop)
    T.report(sec, f"plain Python loop, {m:,d} samples", t_l)
    T.report_ratio("ratios", f"Python loop / chain, {m:,d} samples", r_loop, 20, le=False)

    # the whole scatter study at 1e4 samples vs the bare numpy chain at 1e4 samples
    n4 = 10**4
    x4 = {key: v[:n4] for key, v in x.items()}
    dists = spec.distributions or {}
    t_f4, t_s4, r_s = T.interleaved(lambda: floor(x4), lambda: scatter(spec, dists, n4, seed=1))
    T.report(sec, "scatter study, 1e4 samples", t_s4)
    T.report(sec, "bare numpy chain, 1e4 samples", t_f4)
    T.report_ratio("ratios", "scatter study / bare numpy, 1e4 samples", r_s, 3.0)
    t = time.perf_counter()
    code = (
        "import resource;from clampstack.inputs.joint import read_joint_file;"
        "from clampstack.studies.scatter import scatter;"
        f"_, s = read_joint_file({EXAMPLE!r});"
        "scatter(s, s.distributions or {}, 10**8, seed=1);"
        "print(resource.getrusage(resource.RUSAGE_SELF).ru_maxrss)"
    )
    rss = subprocess.run([sys.executable, "-c", code], capture_output=True, text=True, check=True)
    el = time.perf_counter() - t
    mb = int(rss.stdout.strip()) / 1024
    T.note(
        sec,
        "1e8 samples, whole study (one run)",
        f"{el:.1f} s, peak memory {mb:.0f} MB (target <= 500 MB) {T.status(mb, 500)}",
    )


if __name__ == "__main__":
    main()
