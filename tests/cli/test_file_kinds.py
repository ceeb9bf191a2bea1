"""One rule for the kind of an input file; a command given another kind says what it is."""

from __future__ import annotations

from pathlib import Path

import pytest
from click.testing import CliRunner

from clampstack.cli import main
from clampstack.inputs.files import KIND_COMMANDS, file_kind, load_toml

EX = Path(__file__).parents[2] / "examples"
FILES = {
    "joint": EX / "m10-cover-screw-aluminium.toml",
    "flange": EX / "pump-outlet-flange-8-bolts.toml",
    "assembly": EX / "tie-rod-in-spacer-tube.toml",
}
ARGS = {"sweep": ["--temperature", "20..60"], "scatter": ["--samples", "200"], "report": ["-o"]}


def test_every_example_has_a_kind():
    for path in EX.glob("*.toml"):
        assert file_kind(load_toml(str(path)).data) in KIND_COMMANDS, path.name


@pytest.mark.parametrize(
    "command", ["check", "sweep", "scatter", "size", "report", "flange", "solve"]
)
@pytest.mark.parametrize("kind", sorted(FILES))
def test_a_command_given_a_kind_it_does_not_read(command, kind, tmp_path):
    if command in KIND_COMMANDS[kind]:
        return  # it reads it (tested with each command)
    args = [command, str(FILES[kind]), *ARGS.get(command, [])]
    if command == "report":
        args.append(str(tmp_path / "out"))
    res = CliRunner().invoke(main, args)
    assert res.exit_code == 2, res.output
    line = res.stderr.strip()
    assert "\n" not in line and FILES[kind].name in line
    assert f"which `clampstack {command}` does not read" in line
    for reader in KIND_COMMANDS[kind]:
        assert f"`clampstack {reader}`" in line
    assert not (tmp_path / "out").exists()
