"""Shared timing helpers: medians with min and max over >= 5 runs, interleaved ratios."""

from __future__ import annotations

import os
import statistics
import subprocess
import sys
import time
from dataclasses import dataclass
from pathlib import Path

ROOT = Path(__file__).resolve().parents[1]
BIN = Path(sys.executable).parent
RUNS = 5
ROWS: list[tuple[str, list[str]]] = []  # (section, markdown row)


@dataclass
class Stat:
    median: float
    min: float
    max: float
    n: int


def stat(values: list[float]) -> Stat:
    return Stat(statistics.median(values), min(values), max(values), len(values))


def timed(fn) -> float:
    t = time.perf_counter()
    fn()
    return time.perf_counter() - t


def measure(fn, runs: int = RUNS) -> Stat:
    """Median, min and max wall time of ``runs`` (>= 5) calls [s]."""
    return stat([timed(fn) for _ in range(max(runs, RUNS))])


def interleaved(a, b, rounds: int = RUNS) -> tuple[Stat, Stat, Stat]:
    """A, B, A, B, ...: (time of A, time of B, per-round ratio B/A)."""
    ta, tb = [], []
    for _ in range(max(rounds, RUNS)):
        ta.append(timed(a))
        tb.append(timed(b))
    return stat(ta), stat(tb), stat([y / x for x, y in zip(ta, tb, strict=True)])


#: the environment of a user's machine: Python writes and reuses its bytecode cache
#: (some sandboxes and CI images set PYTHONDONTWRITEBYTECODE, which makes every start
#: compile the package's sources again, about 0.1 s)
PROCESS_ENV = {k: v for k, v in os.environ.items() if k != "PYTHONDONTWRITEBYTECODE"}


def process(args: list[str], timeout: float | None = None) -> float:
    """Whole-process wall time [s] (imports included, bytecode cache in use)."""
    t = time.perf_counter()
    out = subprocess.run(
        args, capture_output=True, cwd=ROOT, check=False, timeout=timeout, env=PROCESS_ENV
    )
    el = time.perf_counter() - t
    if out.returncode >= 2:  # 1 is a failed check, a result; 2 and up time an error
        raise RuntimeError(f"{' '.join(args)} exited {out.returncode}: {out.stderr[-300:]!r}")
    return el


def cli(*args: str) -> list[str]:
    return [str(BIN / "clampstack"), *args]


def fmt(s: float) -> str:
    if s >= 1:
        return f"{s:.3f} s"
    if s >= 1e-3:
        return f"{s * 1e3:.2f} ms"
    return f"{s * 1e6:.1f} us"


def status(value: float, target: float | None, le: bool = True) -> str:
    if target is None:
        return ""
    return "ok" if (value <= target if le else value >= target) else "MISSED"


def report(section: str, case: str, s: Stat, target: float | None = None, le=True, note=""):
    """Print and record one timing row (median, min, max, target, status)."""
    tgt = "" if target is None else ("<= " if le else ">= ") + fmt(target)
    st = status(s.median, target, le)
    print(f"  {case:58s} {fmt(s.median):>10s} ({fmt(s.min)} .. {fmt(s.max)}) {tgt} {st} {note}")
    ROWS.append(
        (
            section,
            [case + (f" ({note})" if note else ""), fmt(s.median), fmt(s.min), fmt(s.max), tgt, st],
        )
    )


def report_ratio(section: str, case: str, r: Stat, target: float | None = None, le=True):
    """Print and record one interleaved ratio (median, min .. max)."""
    tgt = "" if target is None else ("<= " if le else ">= ") + f"{target:g}x"
    st = status(r.median, target, le)
    print(f"  {case:58s} {r.median:10.3g}x ({r.min:.3g} .. {r.max:.3g}) {tgt} {st}")
    ROWS.append((section, [case, f"{r.median:.3g}x", f"{r.min:.3g}x", f"{r.max:.3g}x", tgt, st]))


def note(section: str, case: str, text: str) -> None:
    print(f"  {case:58s} {text}")
    ROWS.append((section, [case, text, "", "", "", ""]))
