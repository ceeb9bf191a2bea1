"""The Python interface: exports, the generated reference page, and the doctested
examples (the module docstring and docs/python.md)."""

from __future__ import annotations

import doctest
import os

import pytest

import clampstack
from clampstack.apidoc import api_reference
from conftest import ROOT


def test_the_package_exports_the_interface():
    for name in (
        "load",
        "joint_from_dict",
        "analyse",
        "flange_from_dict",
        "analyse_flange",
        "assembly_from_dict",
        "solve",
        "sweep",
        "scatter",
        "size",
    ):
        assert name in clampstack.__all__ and callable(getattr(clampstack, name))
    with pytest.raises(AttributeError):
        clampstack.nonexistent  # noqa: B018


def test_api_reference_is_generated_from_the_docstrings():
    on_disk = (ROOT / "docs" / "api.md").read_text(encoding="utf-8")
    assert on_disk == api_reference(), "run: .venv/bin/python -m clampstack.apidoc"


def test_doctests_of_the_interface_and_the_walk_through(monkeypatch):
    monkeypatch.chdir(ROOT)  # the examples are named relative to the repository
    import clampstack.api

    assert doctest.testmod(clampstack.api).failed == 0
    res = doctest.testfile(str(ROOT / "docs" / "python.md"), module_relative=False)
    assert res.attempted > 10 and res.failed == 0


def test_results_are_frozen_and_errors_name_the_file(tmp_path):
    import dataclasses

    from clampstack.errors import InputError

    r = clampstack.analyse(clampstack.load(ROOT / "examples" / "m10-cover-screw-aluminium.toml"))
    assert dataclasses.is_dataclass(r)
    with pytest.raises(dataclasses.FrozenInstanceError):
        r.spec = None  # type: ignore[misc]
    bad = tmp_path / "bad.toml"
    bad.write_text(
        (ROOT / "examples" / "m10-cover-screw-aluminium.toml")
        .read_text()
        .replace('"40 mm"', '"40 kN"')
    )
    with pytest.raises(InputError) as e:
        clampstack.load(bad)
    assert (
        "bad.toml" in str(e.value) and os.fspath(bad) in str(e.value) or "bad.toml" in str(e.value)
    )


def test_every_result_is_a_frozen_dataclass_with_to_dict_and_html():
    import dataclasses

    j = clampstack.load(ROOT / "examples" / "m10-cover-screw-aluminium.toml")
    f = clampstack.load(ROOT / "examples" / "pump-outlet-flange-8-bolts.toml")
    a = clampstack.load(ROOT / "examples" / "load-cell-rig-bolts-and-sleeves.toml")
    results = [
        clampstack.analyse(j),
        clampstack.analyse_flange(f),
        clampstack.solve(a),
        clampstack.sweep(j, "0 degC", "80 degC"),
        clampstack.sweep(f, 293.15, 393.15),
        clampstack.scatter(j, samples=500),
        clampstack.scatter(f, samples=500),
        clampstack.size(j),
        clampstack.size(f),
    ]
    for r in results:
        name = type(r).__name__
        assert dataclasses.is_dataclass(r) and type(r).__dataclass_params__.frozen, name
        assert isinstance(r.to_dict(), dict), name
        html = r._repr_html_()
        assert html and html.lstrip().startswith("<"), name
