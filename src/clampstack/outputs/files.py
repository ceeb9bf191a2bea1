"""Writing output files safely.

Every output goes through :func:`write_files`, which is handed everything
already rendered and then replaces each file atomically, so a failure never
leaves a half-written result behind.
"""

from __future__ import annotations

import os
import tempfile
from pathlib import Path

from ..errors import InputError


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
        umask = os.umask(0)
        os.umask(umask)
        os.chmod(tmp, 0o666 & ~umask)  # mkstemp makes 0600; a result file is an ordinary file
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
