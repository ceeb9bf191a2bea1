"""Record and compare the ``--json`` output of every command on every bundled example.

A refactor changes no number: before code is moved, record; after, compare.

    python tests/snapshots/outputs.py record     # writes tests/snapshots/outputs.json
    python tests/snapshots/outputs.py compare    # exit 1 and a diff listing on any change

``tests/test_output_snapshots.py`` runs the comparison in the suite. When a change is
*meant* to change a figure (a fix of the mechanics), record again and say so in the
commit message: the diff of ``outputs.json`` is the reviewer's list of what moved.
Volatile fields (version, date, file paths) are left out.
"""

from __future__ import annotations

import json
import math
import sys
import tempfile
from pathlib import Path
from typing import Any

ROOT = Path(__file__).resolve().parents[2]
EXAMPLES = ROOT / "examples"
SNAPSHOT = Path(__file__).with_name("outputs.json")

#: figures compared to this relative tolerance (round-off of a reordered sum, nothing more)
RTOL = 1e-9
VOLATILE = {"clampstack_version", "date", "generated", "report", "files", "path", "elapsed_s"}


def kind(path: Path) -> str:
    text = path.read_text()
    if "[[part]]" in text:
        return "assembly"
    if "[flange]" in text:
        return "flange"
    return "joint"


def commands(path: Path) -> list[list[str]]:
    """Every command, with the options a user would give, run on one example."""
    f = str(path)
    out = {
        "assembly": [["solve", f, "--json"], ["check", f, "--json"]],
        "joint": [
            ["check", f, "--json"],
            ["sweep", f, "--temperature", "-20..140", "--json"],
            ["sweep", f, "--temperature", "20..120", "--cycle", "--json"],
            ["scatter", f, "--samples", "4000", "--json"],
            ["size", f, "--json"],
            ["solve", f, "--json"],
        ],
        "flange": [
            ["flange", f, "--json"],
            ["scatter", f, "--samples", "400", "--json"],
            ["size", f, "--json"],
            ["sweep", f, "--temperature", "20..120", "--json"],
        ],
    }[kind(path)]
    return out


def _clean(obj: Any) -> Any:
    if isinstance(obj, dict):
        return {k: _clean(v) for k, v in obj.items() if k not in VOLATILE}
    if isinstance(obj, list):
        return [_clean(v) for v in obj]
    return obj


def run(args: list[str]) -> dict[str, Any]:
    """Run one command in-process; its exit code, JSON (or first stderr line)."""
    from click.testing import CliRunner

    from clampstack.cli import main

    res = CliRunner().invoke(main, args, catch_exceptions=False)
    entry: dict[str, Any] = {"exit": res.exit_code}
    if res.exit_code in (0, 1):
        entry["json"] = _clean(json.loads(res.stdout))
    else:
        entry["stderr"] = res.stderr.strip().replace(str(EXAMPLES) + "/", "examples/")
    return entry


def record_all() -> dict[str, Any]:
    out: dict[str, Any] = {}
    for path in sorted(EXAMPLES.glob("*.toml")):
        for args in commands(path):
            key = " ".join(a.replace(str(EXAMPLES) + "/", "examples/") for a in args)
            out[key] = run(args)
    for what in ("threads", "grades", "materials", "gaskets"):
        out[f"catalog {what} --json"] = run(["catalog", what, "--json"])
    out["verify --json"] = run(["verify", "--json"])
    with tempfile.TemporaryDirectory() as tmp:
        for name in ("m10-cover-screw-aluminium", "pump-outlet-flange-8-bolts"):
            res = run(["report", str(EXAMPLES / f"{name}.toml"), "-o", tmp, "--json"])
            data = json.loads((Path(tmp) / f"{name}.json").read_text())
            out[f"report examples/{name}.toml (its JSON file)"] = {
                "exit": res["exit"],
                "json": _clean(data),
            }
    return out


def differences(a: Any, b: Any, where: str = "") -> list[str]:
    """Where ``b`` differs from ``a`` (numbers to RTOL), as 'path: a -> b' lines."""
    if isinstance(a, dict) and isinstance(b, dict):
        out = []
        for k in sorted(set(a) | set(b), key=str):
            if k not in a or k not in b:
                out.append(f"{where}/{k}: {'missing' if k not in b else 'added'}")
            else:
                out += differences(a[k], b[k], f"{where}/{k}")
        return out
    if isinstance(a, list) and isinstance(b, list):
        if len(a) != len(b):
            return [f"{where}: {len(a)} items -> {len(b)}"]
        return [
            d
            for i, (x, y) in enumerate(zip(a, b, strict=True))
            for d in differences(x, y, f"{where}[{i}]")
        ]
    num = (int, float)
    if (
        isinstance(a, num)
        and isinstance(b, num)
        and not isinstance(a, bool)
        and not isinstance(b, bool)
    ):
        # an equilibrium residual is the solver's round-off (it differs between numpy
        # builds): compared to 1e-6 N, far below any force the tool reports
        round_off = 1e-6 if "residual" in where.rsplit("/", 1)[-1] else 1e-12
        if math.isclose(a, b, rel_tol=RTOL, abs_tol=round_off):
            return []
        return [f"{where}: {a!r} -> {b!r}"]
    return [] if a == b else [f"{where}: {a!r} -> {b!r}"]


def main(argv: list[str]) -> int:
    if argv[1:] == ["record"]:
        SNAPSHOT.write_text(json.dumps(record_all(), indent=1, sort_keys=True) + "\n")
        print(f"wrote {SNAPSHOT}")
        return 0
    if argv[1:] == ["compare"]:
        diffs = differences(json.loads(SNAPSHOT.read_text()), record_all())
        print("\n".join(diffs[:200]) or "no change")
        return 1 if diffs else 0
    print(__doc__)
    return 2


if __name__ == "__main__":
    sys.exit(main(sys.argv))
