"""Docs generated from the schema stay in sync; the bundled demo equals its example."""

from __future__ import annotations

from clampstack.demo import DEMO_ASSEMBLY, DEMO_JOINT, demo_input_path
from clampstack.inputs.docgen import input_reference
from conftest import ROOT


def test_input_reference_is_generated_from_schema():
    on_disk = (ROOT / "docs" / "input-reference.md").read_text(encoding="utf-8")
    assert on_disk == input_reference(), "run: .venv/bin/python -m clampstack.inputs.docgen"


def test_bundled_demo_matches_example_file():
    for name in (DEMO_JOINT, DEMO_ASSEMBLY):
        bundled = demo_input_path(name).read_text(encoding="utf-8")
        assert bundled == (ROOT / "examples" / name).read_text(encoding="utf-8")


def test_every_example_is_bundled_unchanged():
    # the package ships every example (clampstack examples DIR copies them out); the
    # copies in src/clampstack/examples are the files of examples/, byte for byte
    from clampstack.demo import bundled_examples

    on_disk = {p.name: p.read_text(encoding="utf-8") for p in (ROOT / "examples").glob("*.toml")}
    assert bundled_examples() == on_disk, "copy examples/*.toml to src/clampstack/examples/"


def test_readme_quick_start_is_two_commands():
    text = (ROOT / "README.md").read_text(encoding="utf-8")
    block = text.split("## Quick start", 1)[1].split("```sh", 1)[1].split("```", 1)[0]
    commands = [line.split("#")[0].strip() for line in block.strip().splitlines()]
    assert commands == ["make demo", "make test"]
