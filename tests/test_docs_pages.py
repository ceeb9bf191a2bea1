"""The engineer's documentation: every page exists and is linked, the examples gallery
names every example, the limits page covers the cautions, the README stays short."""

from __future__ import annotations

import re

import pytest

from conftest import EXAMPLES, ROOT

DOCS = ROOT / "docs"
PAGES = [
    "getting-started.md",
    "input-reference.md",
    "examples.md",
    "theory.md",
    "validation.md",
    "limits.md",
    "json.md",
]


def _text(name: str) -> str:
    return (DOCS / name).read_text(encoding="utf-8")


def test_every_page_exists_and_is_linked_from_the_readme():
    readme = (ROOT / "README.md").read_text(encoding="utf-8")
    on_disk = sorted(p.name for p in DOCS.glob("*.md"))
    assert set(PAGES) <= set(on_disk)
    for name in on_disk:
        assert f"(docs/{name})" in readme, f"README does not link docs/{name}"


def test_examples_gallery_names_every_example_file():
    gallery = _text("examples.md")
    missing = [p.name for p in sorted(EXAMPLES.glob("*.toml")) if f"`{p.name}`" not in gallery]
    assert not missing, f"docs/examples.md does not describe: {missing}"
    # and every command line in it points at an existing example
    for path in re.findall(r"examples/([\w.-]+\.toml)", gallery):
        assert (EXAMPLES / path).is_file(), path


@pytest.mark.parametrize(
    "topic",
    [
        "eccentric",
        "prying",
        "fatigue",
        "dynamic",
        "creep",
        "corrosion",
        "code",
        "qualified engineer",
    ],
)
def test_limits_page_covers(topic):
    assert topic in _text("limits.md").lower()


def test_theory_has_assumptions_and_limits_section():
    theory = _text("theory.md")
    assert "## 6. Assumptions and limits of validity" in theory or re.search(
        r"^## .*[Aa]ssumptions and limits of validity", theory, re.M
    )
    assert "(limits.md)" in theory


def test_readme_tour_is_short():
    text = (ROOT / "README.md").read_text(encoding="utf-8")
    block = text.split("## A short tour", 1)[1].split("```sh", 1)[1].split("```", 1)[0]
    commands = [line for line in block.strip().splitlines() if line.strip()]
    assert 6 <= len(commands) <= 12
    assert any("clampstack verify" in c for c in commands)


def test_getting_started_points_to_every_page():
    gs = _text("getting-started.md")
    for name in PAGES:
        if name != "getting-started.md":
            assert f"({name})" in gs, name
