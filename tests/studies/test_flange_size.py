"""Flange sizing: each design passes `clampstack flange`; fewer bolts, or the next smaller
size, with the same grade and method fail."""

from __future__ import annotations

import tomllib

from reference_candidates import flange_candidate_data

from clampstack.catalog import threads
from clampstack.errors import InputError
from clampstack.flange.analysis import analyse_flange
from clampstack.inputs.flange import flange_from_data
from clampstack.studies.flange_size import size_flange


def _passes(data, thread, grade, method, n):
    try:
        spec = flange_from_data(flange_candidate_data(data, thread, grade, method, n))
    except InputError:
        return None
    return analyse_flange(spec, compensate=False).ok


def test_flange_designs_pass_and_are_minimal(examples_dir):
    data = tomllib.loads((examples_dir / "pump-outlet-flange-8-bolts.toml").read_text())
    out = size_flange(flange_from_data(data))
    designs = out["designs"]
    assert designs
    assert any(
        d["thread"] == "M16" and d["grade"] == "8.8" and d["bolt_count"] == 8 for d in designs
    )  # the file's own bolting is among them
    coarse = [
        t.designation
        for t in sorted(threads(), key=lambda t: t.d)
        if t.system == "metric" and t.series == "coarse"
    ]
    for d in designs[:4]:
        spec = flange_from_data(
            flange_candidate_data(data, d["thread"], d["grade"], d["method"], d["bolt_count"])
        )
        assert analyse_flange(spec).ok  # full analysis, with the compensated pass
        i = coarse.index(d["thread"])
        assert _passes(data, coarse[i - 1], d["grade"], d["method"], d["bolt_count"]) in (
            False,
            None,
        )
    own = next(
        d
        for d in designs
        if d["thread"] == "M16"
        and d["bolt_count"] == 8
        and d["grade"] == "8.8"
        and d["method"] == "torque"
    )
    assert _passes(data, own["thread"], own["grade"], own["method"], 4) in (False, None)
