"""Sizing: every design returned passes `check`; the next smaller size and the next weaker
grade (same method) fail."""

from __future__ import annotations

import json
import tomllib

import pytest
from click.testing import CliRunner
from reference_candidates import candidate_data

from clampstack.catalog import grade as catalog_grade
from clampstack.cli import main
from clampstack.errors import InputError
from clampstack.inputs.joint import joint_from_data
from clampstack.joint import analyse
from clampstack.studies.size import (
    METHODS,
    METRIC_GRADES,
    candidate_threads,
    size,
)


def _ok(data, base, thr, g, method):
    try:
        spec = joint_from_data(candidate_data(data, base, thr, g, method))
    except InputError:
        return None
    r = analyse(spec)
    return r.ok


@pytest.mark.parametrize("example", ["m16-through-bolt-alternating.toml"])
def test_every_design_passes_check_and_smaller_fails(examples_dir, example):
    data = tomllib.loads((examples_dir / example).read_text())
    result = size(joint_from_data(data))
    assert result.designs
    base = joint_from_data(data)
    sizes = candidate_threads(base.bolt.thread)
    names = [t.designation for t in sizes]
    for d in result.designs[:6]:
        thr = sizes[names.index(d.thread)]
        assert _ok(data, base, thr, d.grade, d.method) is True
        i = names.index(d.thread)
        if i > 0:  # next smaller size, same grade and method
            assert _ok(data, base, sizes[i - 1], d.grade, d.method) in (False, None)
        # next weaker grade of the same size that covers it
        Rp = catalog_grade(d.grade, thr.d).Rp02
        weaker = []
        for g in METRIC_GRADES:
            try:
                gr = catalog_grade(g, thr.d)
            except InputError:
                continue
            if gr.Rp02 < Rp:
                weaker.append((gr.Rp02, g))
        if weaker:
            g = max(weaker)[1]
            assert _ok(data, base, thr, g, d.method) in (False, None)
    assert all(d.method in METHODS for d in result.designs)
    # smallest first
    ds = [sizes[names.index(d.thread)].d for d in result.designs]
    assert ds == sorted(ds)


def test_size_cli_json(examples_dir):
    res = CliRunner().invoke(
        main, ["size", str(examples_dir / "m16-through-bolt-alternating.toml"), "--json"]
    )
    assert res.exit_code == 0, res.output
    out = json.loads(res.stdout)
    d0 = out["designs"][0]
    assert set(d0) >= {"thread", "grade", "method", "torque_Nm", "governing_check", "margin"}
