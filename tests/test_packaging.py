"""The sdist and the wheel: LICENSE, every example, tests and docs in the sdist, one version.

Built with the installed setuptools (no build isolation, no network)."""

from __future__ import annotations

import subprocess
import sys
import tarfile
import zipfile

import pytest
from click.testing import CliRunner

import clampstack
from clampstack.cli import main
from conftest import ROOT


@pytest.fixture(scope="module")
def built(tmp_path_factory):
    # build from a copy of the tree, so that nothing is written into the repository
    import shutil

    src = tmp_path_factory.mktemp("tree") / "clampstack"
    shutil.copytree(
        ROOT,
        src,
        ignore=shutil.ignore_patterns(
            ".venv",
            ".git",
            "build",
            "dist",
            "*.egg-info",
            "__pycache__",
            ".*_cache",
            ".hypothesis",
            "clampstack-demo",
            "sdist",
        ),
    )
    out = tmp_path_factory.mktemp("dist")
    code = (
        "import sys; from setuptools import build_meta as b; "
        "d = sys.argv[1]; b.build_sdist(d); b.build_wheel(d)"  # build_sdist changes sys.argv
    )
    res = subprocess.run(
        [sys.executable, "-c", code, str(out)], cwd=src, capture_output=True, text=True, check=False
    )
    assert res.returncode == 0, res.stderr[-2000:]
    (sdist,) = out.glob("*.tar.gz")
    (wheel,) = out.glob("*.whl")
    return sdist, wheel


def test_wheel_has_license_every_example_and_the_version(built):
    _, wheel = built
    names = zipfile.ZipFile(wheel).namelist()
    assert any(n.endswith("LICENSE") for n in names)
    shipped = {n.rsplit("/", 1)[1] for n in names if n.startswith("clampstack/examples/")}
    assert shipped == {p.name for p in (ROOT / "examples").glob("*.toml")}
    assert "clampstack/py.typed" in names
    assert f"clampstack-{clampstack.__version__}" in wheel.name


def test_sdist_is_complete(built):
    sdist, _ = built
    names = tarfile.open(sdist).getnames()
    top = names[0].split("/")[0]
    rel = {n[len(top) + 1 :] for n in names}
    for need in ("LICENSE", "README.md", "CHANGELOG.md", "Makefile", "pyproject.toml"):
        assert need in rel
    for folder in ("tests", "docs", "examples", "bench"):
        tracked = {
            p.relative_to(ROOT).as_posix()
            for p in (ROOT / folder).rglob("*")
            if p.is_file() and "__pycache__" not in p.parts and ".hypothesis" not in p.parts
        }
        assert tracked <= rel, sorted(tracked - rel)[:5]


def test_examples_command_copies_them_out(tmp_path):
    res = CliRunner().invoke(main, ["examples", str(tmp_path / "ex")])
    assert res.exit_code == 0, res.output
    got = {p.name: p.read_text() for p in (tmp_path / "ex").glob("*.toml")}
    assert got == {p.name: p.read_text() for p in (ROOT / "examples").glob("*.toml")}
    again = CliRunner().invoke(main, ["examples", str(tmp_path / "ex")])
    assert again.exit_code == 2 and "--force" in again.stderr
    assert CliRunner().invoke(main, ["examples", str(tmp_path / "ex"), "--force"]).exit_code == 0
