"""Shared test helpers."""

from __future__ import annotations

import os
from pathlib import Path

import pytest

ROOT = Path(__file__).resolve().parents[1]
EXAMPLES = ROOT / "examples"

os.environ.setdefault("MPLBACKEND", "Agg")


@pytest.fixture
def examples_dir() -> Path:
    return EXAMPLES


@pytest.fixture
def write_toml(tmp_path):
    """Write a TOML text to a file in a fresh folder and return its path."""

    def _write(text: str, name: str = "input.toml") -> Path:
        p = tmp_path / name
        p.write_text(text, encoding="utf-8")
        return p

    return _write
