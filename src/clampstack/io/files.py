"""Reading input files and writing output files safely.

Every input path goes through :func:`load_toml` (one validator: exists, is a
file, not too large, UTF-8, valid TOML); every output goes through
:func:`write_files`, which renders everything first and then replaces each
file atomically, so a failure never leaves a half-written result behind.
"""

from __future__ import annotations

import hashlib
import os
import tempfile
import tomllib
from dataclasses import dataclass
from pathlib import Path
from typing import Any

from ..errors import InputError

MAX_INPUT_BYTES = 4 * 1024 * 1024  # a joint or assembly file is a few kB; refuse the absurd


@dataclass(frozen=True)
class InputDocument:
    """A parsed input file: its path, its raw text, the TOML data and a SHA-256."""

    path: str
    text: str
    data: dict[str, Any]
    sha256: str


def load_toml(path: str | os.PathLike[str]) -> InputDocument:
    """Read and parse a TOML input file; every problem is an InputError naming the file."""
    p = Path(path)
    name = str(path)
    if not p.exists():
        raise InputError("file not found", source=name)
    if not p.is_file():
        raise InputError("not a file", source=name)
    size = p.stat().st_size
    if size > MAX_INPUT_BYTES:
        raise InputError(
            f"file is too large ({size} bytes; at most {MAX_INPUT_BYTES})", source=name
        )
    try:
        raw = p.read_bytes()
    except OSError as err:
        raise InputError(f"cannot read the file ({err.strerror})", source=name) from None
    try:
        text = raw.decode("utf-8")
    except UnicodeDecodeError:
        raise InputError("file is not UTF-8 text", source=name) from None
    try:
        data = tomllib.loads(text)
    except tomllib.TOMLDecodeError as err:
        raise InputError(f"not valid TOML: {str(err).splitlines()[0]}", source=name) from None
    except RecursionError:
        raise InputError("input is nested too deeply", source=name) from None
    return InputDocument(name, text, data, hashlib.sha256(raw).hexdigest())


def atomic_write(path: Path, content: str | bytes) -> None:
    """Write ``content`` to ``path`` through a temporary file and an atomic rename."""
    path.parent.mkdir(parents=True, exist_ok=True)
    data = content.encode("utf-8") if isinstance(content, str) else content
    fd, tmp = tempfile.mkstemp(prefix=f".{path.name}.", suffix=".tmp", dir=path.parent)
    try:
        with os.fdopen(fd, "wb") as fh:
            fh.write(data)
            fh.flush()
            os.fsync(fh.fileno())
        os.replace(tmp, path)
    except BaseException:
        try:
            os.unlink(tmp)
        except OSError:
            pass
        raise


def write_files(directory: str | os.PathLike[str], files: dict[str, str | bytes]) -> list[Path]:
    """Write already-rendered ``files`` (name -> content) into ``directory`` atomically each."""
    out = Path(directory)
    if out.exists() and not out.is_dir():
        raise InputError("output path exists and is not a folder", source=str(directory))
    written = []
    for name, content in files.items():
        target = out / name
        atomic_write(target, content)
        written.append(target)
    return written
