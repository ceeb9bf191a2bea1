"""The ``--json`` output of every command on every bundled example, against the record.

A consistency check, not a verification: it catches *change*, and guards refactors
("a refactor changes no number"). A deliberate change of a figure is recorded again
with ``python tests/snapshots/outputs.py record`` and named in the commit message.
"""

from __future__ import annotations

import json
import sys
from pathlib import Path

sys.path.insert(0, str(Path(__file__).with_name("snapshots")))

import outputs  # noqa: E402


def test_every_command_on_every_example_gives_the_recorded_output() -> None:
    recorded = json.loads(outputs.SNAPSHOT.read_text())
    now = outputs.record_all()
    diffs = outputs.differences(recorded, now)
    assert not diffs, "outputs changed:\n" + "\n".join(diffs[:40])


def test_the_comparison_sees_a_changed_figure() -> None:
    a = {"x": [{"force_N": 1000.0, "ok": True}]}
    assert outputs.differences(a, {"x": [{"force_N": 1000.0 * (1 + 1e-6), "ok": True}]})
    assert outputs.differences(a, {"x": [{"force_N": 1000.0, "ok": False}]})
    assert not outputs.differences(a, {"x": [{"force_N": 1000.0 * (1 + 1e-12), "ok": True}]})
