"""Command-line conventions: python -m, - for standard input, exit 3 on an internal error."""

from __future__ import annotations

import json
import subprocess
import sys

from click.testing import CliRunner

from clampstack.cli import main


def test_python_dash_m_runs_the_command_line(examples_dir):
    f = examples_dir / "m10-cover-screw-aluminium.toml"
    res = subprocess.run(
        [sys.executable, "-m", "clampstack", "check", str(f), "--json"],
        capture_output=True,
        text=True,
        check=False,
    )
    assert res.returncode in (0, 1), res.stderr
    assert json.loads(res.stdout)["ok"] in (True, False)
    res = subprocess.run(
        [sys.executable, "-m", "clampstack", "--help"], capture_output=True, text=True, check=False
    )
    assert res.returncode == 0 and res.stdout.startswith("Usage: clampstack")


def test_dash_reads_standard_input(examples_dir, tmp_path):
    text = (examples_dir / "m10-cover-screw-aluminium.toml").read_text()
    a = CliRunner().invoke(main, ["check", "-", "--json"], input=text)
    b = CliRunner().invoke(
        main, ["check", str(examples_dir / "m10-cover-screw-aluminium.toml"), "--json"]
    )
    assert a.exit_code == b.exit_code and json.loads(a.stdout) == json.loads(b.stdout)
    # a flange read from standard input is recognised by its kind (the file is read once)
    flange = (examples_dir / "pump-outlet-flange-8-bolts.toml").read_text()
    res = CliRunner().invoke(main, ["report", "-", "-o", str(tmp_path)], input=flange)
    assert res.exit_code in (0, 1), res.output
    assert (tmp_path / "stdin.html").exists() and (tmp_path / "stdin.json").exists()
    bad = CliRunner().invoke(main, ["check", "-"], input="x =")
    assert bad.exit_code == 2 and bad.stderr.startswith("clampstack: error: <stdin>:")


def test_an_internal_error_exits_3_with_one_line(examples_dir, monkeypatch):
    import clampstack.joint as analysis

    def broken(*args, **kwargs):
        raise ZeroDivisionError("float division by zero")

    monkeypatch.setattr(analysis, "analyse", broken)
    f = str(examples_dir / "m10-cover-screw-aluminium.toml")
    res = CliRunner().invoke(main, ["check", f])
    assert res.exit_code == 3
    assert res.stderr.count("\n") == 1 and "internal error in `check`" in res.stderr
    assert "Traceback" not in res.stderr and res.stdout == ""
    res = CliRunner().invoke(main, ["--debug", "check", f])
    assert res.exit_code == 3 and "Traceback" in res.stderr and "ZeroDivisionError" in res.stderr


def test_short_help_texts_are_not_cut_off():
    res = CliRunner().invoke(main, ["--help"], terminal_width=80)
    commands = res.output.split("Commands:", 1)[1]
    assert "..." not in commands, commands
    assert len([ln for ln in commands.splitlines() if ln.strip()]) >= 11
