"""Scatter benchmarks (targets: 1e6 samples of the chain <= 0.1 s, within 3x of the bare
numpy floor, >= 20x faster per sample than a plain Python loop; 1e8 samples <= 500 MB)."""

from __future__ import annotations

import math
import resource
import subprocess
import sys
import time
from pathlib import Path

import numpy as np

ROOT = Path(__file__).resolve().parents[1]
EXAMPLE = str(ROOT / "examples" / "m16-through-bolt-alternating.toml")


def best(fn, repeat=5):
    out = []
    for _ in range(repeat):
        t = time.perf_counter()
        fn()
        out.append(time.perf_counter() - t)
    return min(out)


def main() -> None:
    from clampstack.inputs.joint import read_joint_file
    from clampstack.joint.prepare import service_closed_form
    from clampstack.studies.scatter import _draw, evaluate, make_chain

    _, spec = read_joint_file(EXAMPLE)
    chain = make_chain(spec, spec.distributions or {})
    n = 10**6
    rng = np.random.default_rng(1)
    x = _draw(chain, rng, n)
    t_chain = best(lambda: evaluate(chain, x, n))
    t_draw = best(lambda: _draw(chain, np.random.default_rng(1), n))

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

    def floor():
        FM = T0 * x.get("torque_factor", 1.0) / DKm_k(x["thread_friction"], x["head_friction"])
        FV = (FM * (dSa + dPa) - p.embedding_amount - (thb - thc)) / (dS + dP)
        FS, FK = service_closed_form(FV, phi, FA_hi)
        FS2, FK2 = service_closed_form(FV, phi, FA_lo)
        tau = FM * (thr.d2 / 2) * (thr.P / (math.pi * thr.d2) + 1.155 * x["thread_friction"]) / Wp
        s1 = np.sqrt((FM / p.A0) ** 2 + 3 * tau**2)
        s2 = np.sqrt((np.maximum(FS, FS2) / p.A0) ** 2 + 0.75 * tau**2)
        return (s1 > 6.4e8) | (s2 > 6.4e8), np.minimum(FK, FK2) * 0.2 < 2500

    t_floor = best(floor)

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

    t_loop = best(python_loop, 2) / 20000 * n
    print("\nscatter (1e6 samples, one core)")
    print(f"  full chain, vectorised            {t_chain * 1e3:8.1f} ms (target <= 100 ms)")
    print(f"  random draws for the chain        {t_draw * 1e3:8.1f} ms")
    print(
        f"  bare numpy floor, same formulas   {t_floor * 1e3:8.1f} ms  "
        f"(chain / floor = {t_chain / t_floor:.2f}, target <= 3)"
    )
    print(
        f"  plain Python loop (extrapolated)  {t_loop * 1e3:8.0f} ms  "
        f"(loop / chain = {t_loop / t_chain:.0f}x, target >= 20x)"
    )
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
    print(
        f"  1e8 samples, whole study           {el:8.1f} s, peak memory "
        f"{int(rss.stdout.strip()) / 1024:.0f} MB (target <= 500 MB)"
    )
    _ = resource


if __name__ == "__main__":
    main()
