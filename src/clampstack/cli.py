"""Command line: thin click commands that parse, call, print and set the exit code.

Exit codes (DESIGN.md): 0 every check passes, 1 a design check fails, 2 bad
input or usage (one line on stderr naming the file and key; nothing written).
Heavy imports (numpy, scipy, pint, matplotlib) happen inside the commands so
that ``clampstack --help`` starts fast.
"""

from __future__ import annotations

import functools
import json
import sys
from collections.abc import Callable
from typing import Any

import click

from . import __version__

EXIT_OK, EXIT_FAIL, EXIT_INPUT = 0, 1, 2


def _fail_input(message: str) -> None:
    click.echo(f"clampstack: error: {message}", err=True)
    sys.exit(EXIT_INPUT)


def handle_errors(fn: Callable[..., Any]) -> Callable[..., Any]:
    """Turn clampstack's own errors into one line on stderr and exit code 2."""

    @functools.wraps(fn)
    def wrapper(*args: Any, **kwargs: Any) -> Any:
        from .errors import ClampstackError

        try:
            return fn(*args, **kwargs)
        except ClampstackError as err:
            _fail_input(" ".join(str(err).split()))
        except RecursionError:
            _fail_input("input is nested too deeply")

    return wrapper


def _print_json(obj: Any) -> None:
    click.echo(json.dumps(obj, indent=2, allow_nan=False))


class _Group(click.Group):
    def list_commands(self, ctx: click.Context) -> list[str]:
        return list(self.commands)  # in the order they are defined


@click.group(cls=_Group, context_settings={"help_option_names": ["-h", "--help"]})
@click.version_option(__version__, prog_name="clampstack")
def main() -> None:
    """clampstack: bolted-joint preload and clamp load as axial springs.

    Results support, and do not replace, the judgement of a qualified engineer;
    applicable codes and regulations govern.
    """


@main.command()
@click.argument("file", type=str)
@click.option("--json", "as_json", is_flag=True, help="Machine-readable result on stdout.")
@click.option(
    "--units",
    type=click.Choice(["si", "us"]),
    default="si",
    show_default=True,
    help="Units of the readable output.",
)
@handle_errors
def solve(file: str, as_json: bool, units: str) -> None:
    """Solve a generic axial assembly (parts between nodes) in FILE."""
    from .assembly import solve_assembly
    from .io.assembly_input import read_assembly_file
    from .io.report_text import assembly_text

    _, asm = read_assembly_file(file)
    result = solve_assembly(asm)
    if as_json:
        _print_json(result.to_dict())
    else:
        click.echo(assembly_text(result, units))
    sys.exit(EXIT_OK)


@main.command()
@click.argument("file", type=str)
@click.option("--json", "as_json", is_flag=True, help="Machine-readable result on stdout.")
@click.option(
    "--units",
    type=click.Choice(["si", "us"]),
    default="si",
    show_default=True,
    help="Units of the readable output.",
)
@handle_errors
def check(file: str, as_json: bool, units: str) -> None:
    """Analyse and check a single-bolt joint in FILE (exit 1 if a check fails)."""
    from .io.joint_input import read_joint_file
    from .io.joint_text import joint_text
    from .joint import analyse

    _, spec = read_joint_file(file)
    result = analyse(spec)
    if as_json:
        _print_json(result.to_dict())
    else:
        click.echo(joint_text(result, units))
    sys.exit(EXIT_OK if result.ok else EXIT_FAIL)


@main.command()
@click.argument("what", type=click.Choice(["threads", "grades", "materials"]))
@click.option("--json", "as_json", is_flag=True, help="Machine-readable listing on stdout.")
@handle_errors
def catalog(what: str, as_json: bool) -> None:
    """List what the catalog holds (threads, grades, materials), with sources."""
    from .catalog import listing
    from .io.text import table

    headers, rows = listing(what)
    if as_json:
        _print_json([dict(zip(headers, r, strict=True)) for r in rows])
    else:
        click.echo(table(headers, rows))


@main.command()
@click.option(
    "-o",
    "--output",
    "out_dir",
    default="clampstack-demo",
    show_default=True,
    help="Folder to write the demo results into.",
)
@handle_errors
def demo(out_dir: str) -> None:
    """Run the bundled example end to end and write its results into ./clampstack-demo/."""
    from .demo import run_demo

    for line in run_demo(out_dir):
        click.echo(line)


if __name__ == "__main__":  # pragma: no cover
    main()
