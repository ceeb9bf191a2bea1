"""Control characters from an input file never reach the terminal raw (issue: terminal safety)."""

from __future__ import annotations

from pathlib import Path

import pytest
from click.testing import CliRunner

from clampstack.cli import main
from clampstack.outputs.text import terminal_safe

EXAMPLES = Path(__file__).parent.parent.parent / "examples"
HOSTILE = "A\\u001b[2J\\u0007 bell\\r\\nRESULT: PASS \\u202eevil\\u009b"


def _file(tmp_path: Path, example: str) -> Path:
    text = (EXAMPLES / example).read_text(encoding="utf-8")
    lines = [ln for ln in text.splitlines() if not ln.startswith("title")]
    p = tmp_path / example
    p.write_text(f'title = "{HOSTILE}"\n' + "\n".join(lines) + "\n", encoding="utf-8")
    return p


def _raw_controls(s: str) -> list[str]:
    return [c for c in s if (ord(c) < 32 and c != "\n") or 0x7F <= ord(c) <= 0x9F or c == "\u202e"]


@pytest.mark.parametrize(
    ("cmd", "example", "extra"),
    [
        ("check", "m10-cover-screw-aluminium.toml", []),
        ("sweep", "gearbox-cover-cold-to-hot.toml", ["--temperature", "0..60"]),
        ("scatter", "m16-through-bolt-alternating.toml", ["--samples", "500"]),
        ("flange", "pump-outlet-flange-8-bolts.toml", []),
        ("size", "m10-cover-screw-aluminium.toml", []),
    ],
)
def test_text_output_shows_control_characters_escaped(tmp_path, cmd, example, extra):
    res = CliRunner().invoke(main, [cmd, str(_file(tmp_path, example)), *extra])
    assert res.exit_code in (0, 1), res.output
    assert _raw_controls(res.stdout) == []
    first = res.stdout.splitlines()[0]
    assert "\\x1b[2J" in first and "\\x07" in first and "\\u202e" in first
    # the line break inside the title stays on the title's line: no forged verdict line
    assert "\\nRESULT: PASS" in first
    assert not any(ln.startswith("RESULT: PASS \\u202e") for ln in res.stdout.splitlines()[1:])


def test_error_messages_are_escaped_too(tmp_path):
    p = tmp_path / "bad.toml"
    text = (EXAMPLES / "m10-cover-screw-aluminium.toml").read_text(encoding="utf-8")
    p.write_text(text.replace('material = "steel"', 'material = "steel\\u001b[31m"', 1))
    res = CliRunner().invoke(main, ["check", str(p)])
    assert res.exit_code == 2
    assert _raw_controls(res.stderr) == [] and "\\x1b[31m" in res.stderr


def test_terminal_safe_keeps_ordinary_text():
    assert terminal_safe("M10 10.9 — 45 N·m, ±6 %\nnext") == "M10 10.9 — 45 N·m, ±6 %\nnext"
    assert terminal_safe("\x1b\x07\x7f\u200f") == "\\x1b\\x07\\x7f\\u200f"
