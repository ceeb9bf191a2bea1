"""Reading input files safely.

Every input path goes through :func:`load_toml` (one validator: exists, is a
file, not too large, UTF-8, valid TOML). Writing is the other end of the flow:
:mod:`clampstack.outputs.files`.
"""

from __future__ import annotations

import hashlib
import os
import stat as statmod
import tomllib
from dataclasses import dataclass
from pathlib import Path
from typing import Any

from ..errors import InputError, printable

MAX_INPUT_BYTES = 4 * 1024 * 1024  # a joint or assembly file is a few kB; refuse the absurd


@dataclass(frozen=True)
class InputDocument:
    """A parsed input file: its path, its raw text, the TOML data and a SHA-256."""

    path: str
    text: str
    data: dict[str, Any]
    sha256: str


MAX_NAME_SHOWN = 160  # characters of a file name shown in an error message


def display_name(path: str | os.PathLike[str] | bytes) -> str:
    """The file name as it may be printed in one line: no control characters, valid
    UTF-8 (undecodable bytes escaped), shortened in the middle when very long."""
    name = os.fsdecode(path) if isinstance(path, bytes) else os.fspath(path)
    return printable(os.fsdecode(name) if isinstance(name, bytes) else name, MAX_NAME_SHOWN)


def load_toml(path: str | os.PathLike[str]) -> InputDocument:
    """Read and parse a TOML input file; every problem is an InputError naming the file.

    The one validator of input paths: the path must name an existing regular file
    (not a folder, device or pipe) of at most :data:`MAX_INPUT_BYTES`, in UTF-8
    (a byte-order mark is accepted) and valid TOML.  Nothing else is ever raised.
    """
    try:
        raw_name = os.fspath(path)
    except TypeError:
        raise InputError(f"expected a file name, got {type(path).__name__}") from None
    name = display_name(raw_name)
    text_name = os.fsdecode(raw_name) if isinstance(raw_name, bytes) else raw_name
    if not text_name.strip():
        raise InputError("no input file given (the file name is empty)")
    if "\x00" in text_name:
        raise InputError("the file name contains a NUL character", source=name)
    if text_name == "-":
        return _parse(STDIN_NAME, _read_stdin())
    p = Path(text_name)
    try:
        st = p.stat()
    except (FileNotFoundError, NotADirectoryError):
        raise InputError("file not found", source=name) from None
    except PermissionError:
        raise InputError("permission denied", source=name) from None
    except (OSError, ValueError) as err:
        reason = getattr(err, "strerror", None) or str(err)
        raise InputError(f"cannot open the file ({reason})", source=name) from None
    if statmod.S_ISDIR(st.st_mode):
        raise InputError("is a folder, not a file", source=name)
    if not statmod.S_ISREG(st.st_mode):
        raise InputError("not a regular file (a device, pipe or socket)", source=name)
    too_large = f"file is too large (at most {MAX_INPUT_BYTES} bytes; an input file is a few kB)"
    if st.st_size > MAX_INPUT_BYTES:
        raise InputError(too_large, source=name)
    try:
        with p.open("rb") as fh:
            raw = fh.read(MAX_INPUT_BYTES + 1)  # the file may have grown since stat
    except PermissionError:
        raise InputError("permission denied", source=name) from None
    except OSError as err:
        raise InputError(f"cannot read the file ({err.strerror})", source=name) from None
    if len(raw) > MAX_INPUT_BYTES:
        raise InputError(too_large, source=name)
    return _parse(text_name, raw, name)


#: The name standard input goes by in messages and results (``-`` on the command line).
STDIN_NAME = "<stdin>"
_stdin_read: tuple[object, bytes] | None = None


def _read_stdin() -> bytes:
    """Standard input, read once per stream (a command may parse its file twice)."""
    global _stdin_read
    import sys

    if _stdin_read is None or _stdin_read[0] is not sys.stdin:
        raw = sys.stdin.buffer.read(MAX_INPUT_BYTES + 1)
        if len(raw) > MAX_INPUT_BYTES:
            raise InputError(
                f"input is too large (at most {MAX_INPUT_BYTES} bytes)", source=STDIN_NAME
            )
        _stdin_read = (sys.stdin, raw)
    return _stdin_read[1]


def file_stem(doc: InputDocument, default: str) -> str:
    """The stem of the input's file name for files written beside it ("stdin" for ``-``)."""
    if doc.path == STDIN_NAME:
        return "stdin"
    return Path(doc.path).stem or default


def _parse(text_name: str, raw: bytes, name: str | None = None) -> InputDocument:
    """Decode and parse the bytes of an input (InputError naming ``name``)."""
    name = name or text_name
    try:
        text = raw.decode("utf-8-sig")
    except UnicodeDecodeError:
        raise InputError("file is not UTF-8 text", source=name) from None
    try:
        data = tomllib.loads(text)
    except tomllib.TOMLDecodeError as err:
        first = str(err).splitlines()[0] if str(err) else "syntax error"
        raise InputError(f"not valid TOML: {first}", source=name) from None
    except RecursionError:
        raise InputError("input is nested too deeply", source=name) from None
    except (ValueError, OverflowError, MemoryError) as err:
        # e.g. an integer of more than 4300 digits (Python's conversion limit)
        detail = " ".join(str(err).split())[:120]
        raise InputError(f"not valid TOML: {detail}", source=name) from None
    return InputDocument(text_name, text, data, hashlib.sha256(raw).hexdigest())


#: The kinds of input file, and the commands that read each.
KIND_COMMANDS: dict[str, tuple[str, ...]] = {
    "joint": ("check", "sweep", "scatter", "size", "report"),
    "flange": ("flange", "sweep", "scatter", "size", "report"),
    "assembly": ("solve", "report"),
}
_KIND_NAMES = {
    "joint": "a single-bolt joint file",
    "flange": "a flange file",
    "assembly": "an assembly file",
}


def file_kind(data: dict[str, Any]) -> str | None:
    """The kind of an input file from its tables: ``"flange"`` (a ``[flange]`` table),
    ``"assembly"`` (``[[part]]`` tables), ``"joint"`` (``[bolt]`` or ``[[clamped]]``), or
    None when it is none of them.  The one rule every command uses."""
    if "flange" in data:
        return "flange"
    if "part" in data:
        return "assembly"
    if "bolt" in data or "clamped" in data:
        return "joint"
    return None


def require_kind(doc: InputDocument, kind: str, command: str) -> None:
    """InputError (naming the file) unless ``doc`` is of ``kind``: what the file is, and
    which commands read it."""
    found = file_kind(doc.data)
    if found == kind or found is None:  # none: the reader names the missing or wrong key
        return
    cmds = KIND_COMMANDS[found]
    reads = ", ".join(f"`clampstack {c}`" for c in cmds)
    raise InputError(
        f"this is {_KIND_NAMES[found]}, which `clampstack {command}` does not read; {reads} "
        + ("reads it" if len(cmds) == 1 else "read it"),
        source=doc.path,
    )
