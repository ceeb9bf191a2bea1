"""Sizing candidates varied from a validated specification equal the file with its bolts
replaced and read again (a consistency check between two routes through the same rules)."""

from __future__ import annotations

import dataclasses
import math
import tomllib

import pytest
from reference_candidates import candidate_data, flange_candidate_data

from clampstack.catalog import thread
from clampstack.errors import InputError
from clampstack.inputs.flange import flange_from_data
from clampstack.inputs.joint import joint_from_data
from clampstack.studies.flange_size import flange_candidate_spec
from clampstack.studies.size import candidate_spec, candidate_threads

#: fields that record where a value came from, not the joint itself
BOOKKEEPING = {"defaults", "given", "key"}


def same(a, b, where="spec"):
    """Recursive equality of two specs, floats to 1e-9 relative (engagement is written to 6
    significant digits in the file route)."""
    if dataclasses.is_dataclass(a) and dataclasses.is_dataclass(b):
        assert type(a) is type(b), where
        for f in dataclasses.fields(a):
            if f.name not in BOOKKEEPING:
                same(getattr(a, f.name), getattr(b, f.name), f"{where}.{f.name}")
    elif isinstance(a, float | int) and isinstance(b, float | int) and not isinstance(a, bool):
        assert math.isclose(a, b, rel_tol=1e-6, abs_tol=1e-15), f"{where}: {a} != {b}"
    elif isinstance(a, tuple | list) and isinstance(b, tuple | list):
        assert len(a) == len(b), where
        for i, (x, y) in enumerate(zip(a, b, strict=True)):
            same(x, y, f"{where}[{i}]")
    else:
        assert a == b, f"{where}: {a!r} != {b!r}"


JOINTS = [
    "m10-cover-screw-aluminium.toml",
    "m16-through-bolt-alternating.toml",
    "bolt-in-aluminium-sleeve-hot.toml",
    "gearbox-cover-cold-to-hot.toml",
    "exhaust-flange-hot.toml",
]


@pytest.mark.parametrize("example", JOINTS)
def test_joint_candidates_equal_the_file_route(examples_dir, example):
    data = tomllib.loads((examples_dir / example).read_text())
    base = joint_from_data(data)
    compared = refused = 0
    for thr in candidate_threads(base.bolt.thread)[:16]:
        for grade in ("8.8", "12.9", "A4-80"):
            for method in ("torque", "yield", "tension"):
                try:
                    ref = joint_from_data(candidate_data(data, base, thr, grade, method))
                except InputError:
                    ref = None
                try:
                    got = candidate_spec(base, thr, grade, method)
                except InputError:
                    got = None
                assert (ref is None) == (got is None), (thr.designation, grade, method)
                if ref is None:
                    refused += 1
                    continue
                same(got, ref)
                compared += 1
    assert compared >= 3 and refused >= 1


@pytest.mark.parametrize(
    "example", ["pump-outlet-flange-8-bolts.toml", "ring-flange-24-bolts-moment.toml"]
)
def test_flange_candidates_equal_the_file_route(examples_dir, example):
    data = tomllib.loads((examples_dir / example).read_text())
    base = flange_from_data(data)
    compared = refused = 0
    for name in ("M12", "M16", "M20", "M24", "M30"):
        for grade in ("8.8", "ASTM A193 B7", "10.9"):
            for count in (4, 8, 12, 24, 200):
                try:
                    ref = flange_from_data(
                        flange_candidate_data(data, name, grade, "torque", count)
                    )
                except InputError:
                    ref = None
                try:
                    got = flange_candidate_spec(base, thread(name), grade, "torque", count)
                except InputError:
                    got = None
                assert (ref is None) == (got is None), (name, grade, count)
                if ref is None:
                    refused += 1
                    continue
                same(got, ref)
                compared += 1
    assert compared >= 3 and refused >= 1
