"""Command line: thin click commands that parse, call, print and set the exit code.

Exit codes (DESIGN.md): 0 every check passes, 1 a design check fails, 2 bad
input or usage (one line on stderr naming the file and key; nothing written),
3 an internal error (one line; ``clampstack --debug`` shows the traceback).
Heavy imports (numpy, scipy, pint, matplotlib) happen inside the commands so
that ``clampstack --help`` starts fast.
"""

from __future__ import annotations

import functools
import json
import sys
from collections.abc import Callable
from dataclasses import replace
from typing import Any

import click

from ._version import __version__

EXIT_OK, EXIT_FAIL, EXIT_INPUT, EXIT_INTERNAL = 0, 1, 2, 3
_DEBUG = False  # clampstack --debug: show the traceback of an internal error


def _fail_input(message: str) -> None:
    _echo(f"clampstack: error: {message}", err=True)
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
        except (click.exceptions.ClickException, click.exceptions.Abort, KeyboardInterrupt):
            raise
        except BrokenPipeError:  # the reader went away (`... | head`): stop quietly
            import os

            os.dup2(os.open(os.devnull, os.O_WRONLY), sys.stdout.fileno())
            sys.exit(141)  # 128 + SIGPIPE, as a command killed by the broken pipe
        except Exception as err:  # a bug of clampstack's: one line, exit 3
            if _DEBUG:
                import traceback

                traceback.print_exc()
            what = " ".join(f"{type(err).__name__}: {err}".split())[:300]
            _echo(
                f"clampstack: internal error in `{fn.__name__.replace('_', ' ')}`: {what}; "
                "please report it with the input file (clampstack --debug "
                f"{fn.__name__} ... shows the traceback)",
                err=True,
            )
            sys.exit(EXIT_INTERNAL)

    return wrapper


def _in_file(path: str, fn: Callable[..., Any], *args: Any) -> Any:
    """Call ``fn``; an InputError it raises is reported against the input file ``path``."""
    from .errors import InputError, SolveError

    try:
        return fn(*args)
    except InputError as err:
        raise err.with_source(path) from None
    except SolveError as err:
        raise SolveError(f"{path}: {err}") from None


def _echo(text: str = "", err: bool = False, nl: bool = True) -> None:
    """Print ``text`` with control characters from the input shown escaped."""
    from .outputs.text import terminal_safe

    click.echo(terminal_safe(str(text)), err=err, nl=nl)


def _print_json(obj: Any, schema: str, sha256: str | None = None) -> None:
    """Print a ``--json`` document: the contract's header keys first, then ``obj``."""
    from .outputs.contract import envelope

    click.echo(json.dumps(envelope(schema, obj, sha256), indent=2, allow_nan=False))  # ASCII


class _Group(click.Group):
    def list_commands(self, ctx: click.Context) -> list[str]:
        return list(self.commands)  # in the order they are defined

    def main(self, *args: Any, **kwargs: Any) -> Any:  # type: ignore[override]
        """Usage errors as one line on stderr with exit code 2 (click prints several)."""
        kwargs["standalone_mode"] = False
        try:
            rv = super().main(*args, **kwargs)
        except click.exceptions.UsageError as err:
            if type(err).__name__ == "NoArgsIsHelpError" and err.ctx is not None:
                _echo(err.ctx.get_help())  # bare `clampstack`: the help, as usual
                sys.exit(0)
            msg = " ".join(err.format_message().split())
            where = f"{err.ctx.info_name}: " if err.ctx is not None and err.ctx.info_name else ""
            _echo(f"clampstack: error: {where}{msg} (see --help)", err=True)
            sys.exit(EXIT_INPUT)
        except click.exceptions.Abort:
            _echo("clampstack: aborted", err=True)
            sys.exit(1)
        except click.exceptions.ClickException as err:
            _echo(f"clampstack: error: {' '.join(err.format_message().split())}", err=True)
            sys.exit(err.exit_code)
        sys.exit(rv if isinstance(rv, int) else 0)


class _InputFile(click.ParamType):
    """An input file (or ``-``): completes as a file name in the shell; the path is
    validated by the reader, which names the file in its one-line errors."""

    name = "file"

    def convert(self, value: Any, param: Any, ctx: Any) -> Any:
        return value

    def shell_complete(self, ctx: Any, param: Any, incomplete: str) -> list[Any]:
        from click.shell_completion import CompletionItem

        return [CompletionItem(incomplete, type="file")]


FILE = _InputFile()

#: the options every analysing command shares (DESIGN.md: --json; readable units)
case_option = click.option(
    "--case",
    "case",
    type=str,
    default=None,
    help="Load case of a file with [[case]] tables [default: the governing case].",
)
json_option = click.option(
    "--json", "as_json", is_flag=True, help="Machine-readable result on stdout."
)
units_option = click.option(
    "--units",
    type=click.Choice(["si", "us"]),
    default="si",
    show_default=True,
    help="Units of the readable output.",
)


@click.group(cls=_Group, context_settings={"help_option_names": ["-h", "--help"]})
@click.version_option(__version__, prog_name="clampstack")
@click.option(
    "--debug", is_flag=True, help="Show the traceback of an internal error (exit code 3)."
)
def main(debug: bool) -> None:
    """clampstack: bolted-joint preload and clamp load as axial springs.

    Results support, and do not replace, the judgement of a qualified engineer;
    applicable codes and regulations govern.  FILE may be - for standard input.
    """
    global _DEBUG
    _DEBUG = debug


@main.command(short_help="Load share of an axial assembly of parts between nodes.")
@click.argument("file", type=FILE)
@json_option
@units_option
@handle_errors
def solve(file: str, as_json: bool, units: str) -> None:
    """Solve a generic axial assembly (parts between nodes) in FILE."""
    from .assembly import solve_assembly
    from .inputs.assembly import read_assembly_file
    from .outputs.assembly import assembly_text

    doc, asm = read_assembly_file(file)
    result = _in_file(doc.path, solve_assembly, asm)
    if as_json:
        _print_json(result.to_dict(), "solve", doc.sha256)
    else:
        _echo(assembly_text(result, units))
    sys.exit(EXIT_OK)


@main.command(short_help="Check a single-bolt joint (exit 1 if a check fails).")
@click.argument("file", type=FILE)
@json_option
@units_option
@handle_errors
def check(file: str, as_json: bool, units: str) -> None:
    """Analyse and check a single-bolt joint in FILE (exit 1 if a check fails)."""
    from .inputs.joint import read_joint_file
    from .joint import analyse
    from .outputs.joint import joint_text

    doc, spec = read_joint_file(file)
    result = _in_file(doc.path, analyse, spec)
    if as_json:
        _print_json(result.to_dict(), "check", doc.sha256)
    else:
        _echo(joint_text(result, units))
    sys.exit(EXIT_OK if result.ok else EXIT_FAIL)


def _parse_temperature_range(text: str) -> tuple[float, float]:
    """``"-40..150"`` (degC) or ``"-40..150 degC"`` / ``"233..423 K"`` to kelvin."""
    from .errors import InputError
    from .units import parse_range

    t = text.strip()
    if ".." not in t:
        raise InputError(f'expected a range "low..high", got "{text}"', key="--temperature")
    if t[-1].isdigit() or t[-1] == ".":
        t = f"{t} degC"
    return parse_range(t, "temperature", "--temperature")


@main.command(short_help="Preload and every check over a temperature range.")
@click.argument("file", type=FILE)
@click.option(
    "--temperature",
    "trange",
    required=True,
    metavar="A..B",
    help="Service temperature range, e.g. -40..150 (degC) or '250..420 K'.",
)
@click.option(
    "--step", type=float, default=None, metavar="S", help="Step in K (default: 100 intervals)."
)
@click.option(
    "--cycle",
    is_flag=True,
    help="Also follow a cycle to each end of the range and back (permanent loss).",
)
@case_option
@json_option
@click.option("--csv", "as_csv", is_flag=True, help="One CSV row per temperature on stdout.")
@units_option
@handle_errors
def sweep(
    file: str,
    trange: str,
    step: float | None,
    cycle: bool,
    case: str | None,
    as_json: bool,
    as_csv: bool,
    units: str,
) -> None:
    """Preload, clamp load and every check over a temperature range (exit 1 if one fails)."""

    from .errors import InputError
    from .inputs.files import file_kind, load_toml, require_kind
    from .inputs.joint import joint_from_data
    from .joint.analysis import select_case
    from .joint.cases import check_case_name
    from .outputs.sweep import sweep_csv_chunks, sweep_json_chunks, sweep_text
    from .studies.sweep import sweep as run_sweep

    if as_json and as_csv:
        raise InputError("choose --json or --csv, not both", key="--csv")
    doc = load_toml(file)  # read once; the kind decides which sweep
    if file_kind(doc.data) == "flange":  # a flange file: per-bolt states
        _sweep_flange(doc, trange, step, cycle, case, as_json, as_csv, units)
        return
    require_kind(doc, "joint", "sweep")
    spec = _in_file(doc.path, joint_from_data, doc.data)
    check_case_name(spec, case)  # an option's error names the option, not the file
    spec, case_note = _in_file(doc.path, select_case, spec, case)
    lo, hi, progress = _sweep_range(doc.path, trange, step, as_json or as_csv)
    result = _in_file(doc.path, run_sweep, spec, lo, hi, step, cycle, progress)
    if progress is not None:
        progress(None)
    if case_note is not None:
        result = replace(result, notes=(case_note, *result.notes))
    if as_json:  # streamed: the text of _print_json(result.to_dict()), a piece at a time
        from .outputs.contract import header

        for piece in sweep_json_chunks(result, head=header("sweep", doc.sha256)):
            click.echo(piece, nl=False)  # ASCII: json escapes all
        click.echo("")
    elif as_csv:
        for piece in sweep_csv_chunks(result):
            _echo(piece, nl=False)
    else:
        _echo(sweep_text(result, units))
    sys.exit(EXIT_OK if result.passed else EXIT_FAIL)


def _sweep_range(
    path: str, trange: str, step: float | None, quiet: bool
) -> tuple[float, float, Any]:
    """``--temperature`` and ``--step`` checked (the points refused before any bar), and the
    progress bar of the sweep (None when quiet or short)."""
    import math

    from .errors import InputError
    from .studies.sweep import temperature_points

    lo, hi = _parse_temperature_range(trange)
    if step is not None and not (math.isfinite(step) and step > 0):
        raise InputError(f"the step must be a positive number of kelvin, got {step}", key="--step")
    n_points = _in_file(path, temperature_points, lo, hi, step).size
    return lo, hi, _progress(n_points, quiet, "sweep")


def _sweep_flange(
    doc: Any,
    trange: str,
    step: float | None,
    cycle: bool,
    case: str | None,
    as_json: bool,
    as_csv: bool,
    units: str,
) -> None:
    """``sweep`` on a flange file (see :mod:`clampstack.studies.flange_sweep`)."""
    from .errors import InputError
    from .inputs.flange import flange_from_data
    from .outputs.sweep import flange_sweep_csv, flange_sweep_text
    from .studies.flange_sweep import flange_sweep

    if case is not None:
        raise InputError("a flange file has no load cases", key="--case")
    spec = _in_file(doc.path, flange_from_data, doc.data)
    lo, hi, progress = _sweep_range(doc.path, trange, step, as_json or as_csv)
    result = _in_file(doc.path, flange_sweep, spec, lo, hi, step, cycle, progress)
    if progress is not None:
        progress(None)
    if as_json:
        _print_json(result.to_dict(), "sweep", doc.sha256)
    elif as_csv:
        _echo(flange_sweep_csv(result), nl=False)
    else:
        _echo(flange_sweep_text(result, units))
    sys.exit(EXIT_OK if result.passed else EXIT_FAIL)


@main.command(short_help="Bolt loads, gasket window and passes of a flange.")
@click.argument("file", type=FILE)
@json_option
@units_option
@handle_errors
def flange(file: str, as_json: bool, units: str) -> None:
    """Analyse a gasketed flange in FILE: bolt loads, gasket window, passes (exit 1 on a fail)."""
    from .flange import analyse_flange
    from .inputs.flange import read_flange_file
    from .outputs.flange import flange_text

    doc, spec = read_flange_file(file)
    result = _in_file(doc.path, analyse_flange, spec)
    if as_json:
        _print_json(result.to_dict(), "flange", doc.sha256)
    else:
        _echo(flange_text(result, units))
    sys.exit(EXIT_OK if result.ok else EXIT_FAIL)


@main.command(short_help="Monte Carlo of the assembly scatter of a joint or flange.")
@click.argument("file", type=FILE)
@click.option(
    "--samples",
    type=int,
    default=None,
    help="Exactly this many samples (default: adaptive, from 100 000 until every "
    "probability has converged; with --rel-width or --max-samples: the first round).",
)
@click.option(
    "--rel-width",
    type=float,
    default=None,
    help="Adaptive: sample until each probability's 95 % interval is narrower than this "
    "fraction of its estimate [default 0.3].",
)
@click.option(
    "--negligible",
    type=float,
    default=None,
    help="Adaptive: a probability whose 95 % upper bound is below this has converged "
    "[default 1e-5].",
)
@click.option(
    "--max-samples",
    type=int,
    default=None,
    help="Adaptive: stop here and say which estimates have not converged [default 1e7].",
)
@click.option("--seed", type=int, default=0, show_default=True, help="Random seed.")
@case_option
@json_option
@units_option
@handle_errors
def scatter(
    file: str,
    samples: int | None,
    rel_width: float | None,
    negligible: float | None,
    max_samples: int | None,
    seed: int,
    case: str | None,
    as_json: bool,
    units: str,
) -> None:
    """Statistical assembly scatter of the joint or flange in FILE (Monte Carlo)."""
    from .errors import InputError
    from .inputs.joint import read_joint_file
    from .joint.analysis import select_case
    from .joint.cases import check_case_name
    from .outputs.scatter import scatter_text
    from .studies.sampling import Convergence
    from .studies.scatter import scatter as run_scatter

    if samples is not None and samples < 1:
        raise InputError(
            f"the number of samples must be at least 1, got {samples}", key="--samples"
        )
    if seed < 0:
        raise InputError("the seed must not be negative", key="--seed")
    adaptive = samples is None or any(x is not None for x in (rel_width, negligible, max_samples))
    conv = None
    if adaptive:
        base = Convergence()
        conv = Convergence(
            base.rel_width if rel_width is None else rel_width,
            base.negligible if negligible is None else negligible,
            base.max_samples if max_samples is None else max_samples,
        )
        if not 0 < conv.rel_width <= 10:
            raise InputError("expected a relative width in (0, 10]", key="--rel-width")
        if not 0 < conv.negligible < 1:
            raise InputError("expected a probability in (0, 1)", key="--negligible")
        if not 1 <= conv.max_samples <= 10**10:
            raise InputError("expected 1 to 1e10 samples", key="--max-samples")
        samples = min(100_000, conv.max_samples) if samples is None else samples
        if samples > conv.max_samples:
            raise InputError("the first round exceeds --max-samples", key="--samples")
    assert samples is not None
    from .inputs.files import file_kind, load_toml

    if file_kind(load_toml(file).data) == "flange":  # a flange file: every bolt scatters
        from .inputs.flange import read_flange_file
        from .outputs.scatter import flange_scatter_text
        from .studies.flange_scatter import flange_scatter

        fdoc, fspec = read_flange_file(file, "scatter")
        fres = _in_file(fdoc.path, flange_scatter, fspec, samples, seed, 1, conv)
        if as_json:
            _print_json(fres.to_dict(), "scatter", fdoc.sha256)
        else:
            _echo(flange_scatter_text(fres, units))
        sys.exit(EXIT_OK if fres.deterministic["ok"] else EXIT_FAIL)
    doc, spec = read_joint_file(file, "scatter")
    check_case_name(spec, case)  # an option's error names the option, not the file
    spec, case_note = _in_file(doc.path, select_case, spec, case)
    dists = spec.distributions or {}
    progress = _progress(conv.max_samples if conv is not None else samples, as_json, "scatter")
    result = _in_file(doc.path, run_scatter, spec, dists, samples, seed, 4, progress, conv)
    if progress is not None:
        progress(None)
    if case_note is not None:
        result = replace(result, notes=(case_note, *result.notes))
    if as_json:
        _print_json(result.to_dict(), "scatter", doc.sha256)
    else:
        _echo(scatter_text(result, units))
    sys.exit(EXIT_OK if result.ok else EXIT_FAIL)


def _progress(total: int, quiet: bool, label: str):
    """A callback ``f(done)`` drawing a bar on a terminal for long runs (None when quiet).

    ``done`` counts the steps finished so far; ``f(None)`` closes the bar.
    """
    from .outputs.progress import Progress, should_show

    if not should_show(total, quiet=quiet):
        return None
    bar = Progress(total, label=label, enabled=True)

    def report(done: int | None) -> None:
        if done is None:
            bar.close()
        elif done > bar.done:
            bar.update(done - bar.done)

    return report


@main.command(short_help="Smallest thread, grade and method that pass.")
@click.argument("file", type=FILE)
@click.option(
    "--thread",
    "threads",
    multiple=True,
    help="Only this thread (repeat for several), e.g. --thread M10.",
)
@click.option("--threads", "thread_range", default=None, help="Threads from..to, e.g. M6..M12.")
@click.option("--methods", default=None, help="Tightening methods, e.g. torque,tension.")
@click.option("--grades", "grade_names", default=None, help="Grades, e.g. 8.8,10.9.")
@json_option
@units_option
@handle_errors
def size(
    file: str,
    threads: tuple[str, ...],
    thread_range: str | None,
    methods: str | None,
    grade_names: str | None,
    as_json: bool,
    units: str,
) -> None:
    """Smallest thread, grade and tightening method that pass every check for FILE."""
    from .inputs.files import file_kind, load_toml, require_kind
    from .inputs.size_options import size_constraints
    from .outputs.size import size_text
    from .studies.flange_size import FLANGE_METHODS
    from .studies.size import METHODS
    from .studies.size import size as run_size

    doc = load_toml(file)
    flange_file = file_kind(doc.data) == "flange"
    constraints = size_constraints(
        threads, thread_range, methods, grade_names, FLANGE_METHODS if flange_file else METHODS
    )
    if file_kind(doc.data) == "flange":  # a flange file: bolts x grade x method x bolt count
        from .inputs.flange import flange_from_data
        from .outputs.size import flange_size_text
        from .studies.flange_size import size_flange

        fspec = _in_file(doc.path, flange_from_data, doc.data)
        fres = _in_file(doc.path, size_flange, fspec, constraints)
        if as_json:
            _print_json(fres, "size", doc.sha256)
        else:
            _echo(flange_size_text(fres, units))
        sys.exit(EXIT_OK if fres["designs"] else EXIT_FAIL)
    from .inputs.joint import joint_from_data

    require_kind(doc, "joint", "size")
    spec = _in_file(doc.path, joint_from_data, doc.data)
    progress = _progress(2000, as_json, "size")  # candidates: shown only on a terminal
    result = _in_file(doc.path, run_size, spec, progress, constraints)
    if progress is not None:
        progress(None)
    if as_json:
        _print_json(result.to_dict(), "size", doc.sha256)
    else:
        _echo(size_text(result, units))
    sys.exit(EXIT_OK if result.designs else EXIT_FAIL)


@main.command(short_help="List the catalog's data, each row with its source.")
@click.argument(
    "what",
    type=click.Choice(["threads", "grades", "materials", "gaskets", "friction", "tools"]),
)
@click.option("--json", "as_json", is_flag=True, help="Machine-readable listing on stdout.")
@handle_errors
def catalog(what: str, as_json: bool) -> None:
    """List what the catalog holds (threads, grades, materials, gaskets, friction of
    lubricants and coatings, torque tools), with sources."""
    if as_json:
        from .catalog.listing import records

        _print_json({"listing": what, "records": records(what)}, "catalog")
        return
    from .catalog import listing
    from .outputs.text import table

    headers, rows = listing(what)
    _echo(table(headers, rows))


@main.command(short_help="Copy the bundled example files into a folder.")
@click.argument("directory", type=click.Path(file_okay=False))
@click.option("--force", is_flag=True, help="Replace example files already in DIRECTORY.")
@handle_errors
def examples(directory: str, force: bool) -> None:
    """Copy the bundled example input files into DIRECTORY (created if missing)."""
    from pathlib import Path

    from .demo import bundled_examples
    from .errors import InputError
    from .outputs.files import write_files

    files = bundled_examples()
    there = [n for n in files if (Path(directory) / n).exists()]
    if there and not force:
        raise InputError(
            f"{len(there)} example file(s) already there, e.g. {there[0]} (--force replaces them)",
            source=directory,
        )
    for p in write_files(directory, files):
        _echo(str(p))


@main.command(short_help="Run the bundled example end to end.")
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
        _echo(line)


@main.command(short_help="HTML calculation report with JSON and CSV beside it.")
@click.argument("file", type=FILE)
@click.option(
    "-o",
    "--output",
    "out_dir",
    default=".",
    show_default=True,
    metavar="DIR",
    help="Folder to write the report into (created if missing).",
)
@click.option(
    "--units",
    type=click.Choice(["si", "us"]),
    default="si",
    show_default=True,
    help="Units of the report.",
)
@click.option("--json", "as_json", is_flag=True, help="Print the verdict and the files as JSON.")
@handle_errors
def report(file: str, out_dir: str, units: str, as_json: bool) -> None:
    """HTML calculation report of the joint, flange or assembly in FILE, JSON and CSV beside it (exit 1 on a fail)."""
    from .inputs.files import file_kind, load_toml
    from .outputs.files import write_files

    kind = file_kind(load_toml(file).data)
    if kind == "assembly":  # an assembly file: forces, displacements, load share
        from .assembly import solve_assembly
        from .inputs.assembly import read_assembly_file
        from .report import render_assembly_report

        adoc, asm = read_assembly_file(file, "report")
        aresult = _in_file(adoc.path, solve_assembly, asm)
        afiles = _in_file(adoc.path, render_assembly_report, adoc, aresult, units)
        written = write_files(out_dir, afiles)
        page = next(p for p in written if p.suffix == ".html")
        if as_json:
            _print_json(
                {"ok": True, "report": str(page), "files": [str(p) for p in written]},
                "report",
                adoc.sha256,
            )
        else:
            _echo(f"SOLVED: {asm.title}")
            _echo(f"Report: {page}")
            _echo("Beside it: " + ", ".join(p.name for p in written if p != page))
        sys.exit(EXIT_OK)
    if kind == "flange":  # a flange file: the flange report
        from .flange import analyse_flange
        from .inputs.flange import read_flange_file
        from .report import render_flange_report

        doc, spec = read_flange_file(file, "report")
        result = _in_file(doc.path, analyse_flange, spec)
        files = _in_file(doc.path, render_flange_report, doc, result, units)  # all rendered first
    else:
        from .inputs.joint import read_joint_file
        from .joint import analyse
        from .report import render_joint_report

        doc, spec = read_joint_file(file, "report")
        result = _in_file(doc.path, analyse, spec)
        files = _in_file(doc.path, render_joint_report, doc, result, units)  # all rendered first
    written = write_files(out_dir, files)  # all or nothing; an OSError is an InputError
    page = next(p for p in written if p.suffix == ".html")
    if as_json:
        _print_json(
            {"ok": result.ok, "report": str(page), "files": [str(p) for p in written]},
            "report",
            doc.sha256,
        )
    else:
        _echo(f"{'PASS' if result.ok else 'FAIL'}: {spec.title}")
        _echo(f"Report: {page}")
        _echo("Beside it: " + ", ".join(p.name for p in written if p != page))
    sys.exit(EXIT_OK if result.ok else EXIT_FAIL)


@main.command(short_help="Check the tool against published values.")
@json_option
@handle_errors
def verify(as_json: bool) -> None:
    """Run the bundled verification cases against published values (exit 1 if one fails)."""
    from .outputs.text import CAUTION, table
    from .verify import HEADERS, rows, run_all, summary

    results = run_all()
    doc = summary(results)
    if as_json:
        _print_json(doc, "verify")
    else:
        _echo(table(HEADERS, rows(results)))
        _echo("")
        _echo(
            f"{doc['passed']} of {len(results)} cases pass"
            + ("." if doc["ok"] else f"; {doc['failed']} FAIL.")
        )
        _echo(CAUTION)
    sys.exit(EXIT_OK if doc["ok"] else EXIT_FAIL)


if __name__ == "__main__":  # pragma: no cover
    main()
