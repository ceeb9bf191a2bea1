"""Writing a set of output files all or nothing.

Every output goes through :func:`write_files`, which is handed everything
already rendered.  The set is written in two phases:

1. every file is written, flushed and ``fsync``-ed under a temporary name in
   the target folder itself (``.clampstack-tmp-<pid>-<token>-<n>``, so that the
   rename below stays on one file system);
2. only when *all* of them are on disk is each renamed over its target
   (``os.replace``, atomic per file) in the order given, except that the HTML
   pages go last, and the folder is ``fsync``-ed.

A failure in phase 1 (a full disk, a read-only folder, no permission, an
interrupt) removes the temporaries and leaves the old set untouched: no new
file appears.  The renames of phase 2 are several steps, not one: a kill or a
power cut in the moment between two of them can leave some files of the set
new and the rest old (never a half-written file).  Because the page is renamed
last, a new page means the whole set is new.  Temporaries left by a killed run
are recognised by their prefix and removed by the next run into the same
folder once the process that made them is gone (checked by its process id).
"""

from __future__ import annotations

import contextlib
import errno
import os
import re
import secrets
import stat
from pathlib import Path

from ..errors import InputError

TMP_PREFIX = ".clampstack-tmp-"
_TMP_RE = re.compile(r"\.clampstack-tmp-(\d+)-[0-9a-f]+-\d+")
#: earlier versions wrote each file through ``.<name>.<8 random characters>.tmp`` (mkstemp)
_LEGACY_RE = r"\.{name}\.[a-z0-9_]{{8}}\.tmp"


def _pid_alive(pid: int) -> bool:
    """Whether a process with id ``pid`` runs on this machine (True when unsure)."""
    if pid == os.getpid():
        return True
    if os.name == "nt":  # os.kill(pid, 0) would terminate the process on Windows
        return True
    try:
        os.kill(pid, 0)
    except ProcessLookupError:
        return False
    except OSError:  # PermissionError: it exists, owned by someone else
        return True
    return True


def clean_stale_temporaries(directory: Path, names: tuple[str, ...] = ()) -> list[Path]:
    """Remove the temporaries that killed runs left in ``directory``; return them.

    A file named ``.clampstack-tmp-<pid>-...`` goes when no process ``<pid>`` is
    running; ``.<name>.XXXXXXXX.tmp`` of an earlier version, for each of ``names``
    (the files about to be written), goes as well.  Only regular files are touched.
    """
    legacy = [re.compile(_LEGACY_RE.format(name=re.escape(n))) for n in names]
    removed = []
    try:
        entries = list(os.scandir(directory))
    except OSError:
        return removed
    for entry in entries:
        m = _TMP_RE.fullmatch(entry.name)
        stale = (m is not None and not _pid_alive(int(m.group(1)))) or any(
            p.fullmatch(entry.name) for p in legacy
        )
        if not stale:
            continue
        try:
            if not entry.is_file(follow_symlinks=False):
                continue
            os.unlink(entry.path)
        except OSError:
            continue
        removed.append(Path(entry.path))
    return removed


def _write_all(fd: int, data: bytes) -> None:
    """Write all of ``data`` to the open file ``fd`` (a short write continues)."""
    view = memoryview(data)
    while view:
        n = os.write(fd, view)
        view = view[n:]


def _write_temporary(path: Path, data: bytes) -> None:
    """Create ``path`` (which must not exist), write ``data``, flush it to the disk."""
    flags = os.O_WRONLY | os.O_CREAT | os.O_EXCL | getattr(os, "O_BINARY", 0)
    fd = os.open(path, flags, 0o666)  # the umask applies: an ordinary result file
    try:
        _write_all(fd, data)
        os.fsync(fd)
    finally:
        os.close(fd)


def _fsync_directory(directory: Path) -> None:
    """Make the renames in ``directory`` durable (where the platform allows it)."""
    try:
        fd = os.open(directory, os.O_RDONLY)
    except OSError:
        return
    try:
        os.fsync(fd)
    except OSError:
        pass
    finally:
        os.close(fd)


def _cannot_write(err: OSError, where: Path) -> InputError:
    reason = err.strerror or errno.errorcode.get(err.errno or 0, "") or str(err)
    return InputError(f"cannot write the output files ({reason})", source=str(where))


def write_files(directory: str | os.PathLike[str], files: dict[str, str | bytes]) -> list[Path]:
    """Write already-rendered ``files`` (name -> content) into ``directory``, all or nothing.

    The folder is created if missing.  Files are replaced in the order of
    ``files``, the ``.html`` pages last; see the module docstring for what a
    failure or a kill leaves.  Returns the paths in the order of ``files``.

    Raises
    ------
    InputError
        One line naming the folder or the file: the path is not a folder, a target
        is a folder, or the operating system refused (full disk, no permission).
    """
    out = Path(directory)
    for name in files:
        if not name or name != Path(name).name or name in (".", ".."):
            raise ValueError(f"not a plain file name: {name!r}")
    try:
        if out.exists() and not out.is_dir():
            raise InputError("output path exists and is not a folder", source=str(directory))
        out.mkdir(parents=True, exist_ok=True)
    except OSError as err:  # no permission to look, a file on the way, a read-only disk
        raise _cannot_write(err, out) from None
    clean_stale_temporaries(out, tuple(files))
    targets = [out / name for name in files]
    for target in targets:  # refuse before anything is written, not half-way through the renames
        try:
            mode = os.lstat(target).st_mode
        except FileNotFoundError:
            continue
        except OSError as err:  # a name too long for the file system
            raise _cannot_write(err, target) from None
        if stat.S_ISDIR(mode):
            raise InputError("a folder stands where an output file goes", source=str(target))
    token = secrets.token_hex(4)
    pending: list[tuple[Path, Path]] = []
    try:
        for i, (target, content) in enumerate(zip(targets, files.values(), strict=True)):
            tmp = out / f"{TMP_PREFIX}{os.getpid()}-{token}-{i}"
            data = content.encode("utf-8") if isinstance(content, str) else content
            pending.append((tmp, target))
            try:
                _write_temporary(tmp, data)
            except OSError as err:
                raise _cannot_write(err, target) from None
        pending.sort(key=lambda p: p[1].suffix == ".html")  # stable: the pages last
        while pending:
            tmp, target = pending[0]
            try:
                os.replace(tmp, target)
            except OSError as err:
                raise _cannot_write(err, target) from None
            pending.pop(0)
    finally:
        for tmp, _ in pending:  # a failure or an interrupt: no temporary stays behind
            with contextlib.suppress(OSError):
                os.unlink(tmp)
    _fsync_directory(out)
    return targets
