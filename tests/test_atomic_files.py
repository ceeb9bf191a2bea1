"""All or nothing on disk: ``report`` and ``demo`` write a whole set of files or none of it.

A full disk (simulated: the write of the third file fails with ENOSPC), a read-only
folder, a folder where a file goes, a path that is a file: one line on stderr naming
the path, exit code 2, no new file and no temporary, the old set untouched.  Temporaries
left by a killed run (a process that no longer exists) are removed by the next run.
"""

from __future__ import annotations

import errno
import os
import subprocess
import sys
from pathlib import Path

import pytest
from click.testing import CliRunner

from clampstack.cli import main
from clampstack.errors import InputError
from clampstack.outputs import files as outfiles
from clampstack.outputs.files import TMP_PREFIX, clean_stale_temporaries, write_files

ROOT = Path(__file__).resolve().parents[1]
JOINT = ROOT / "examples" / "m10-cover-screw-aluminium.toml"
STEM = JOINT.stem
REPORT_SET = [f"{STEM}.json", f"{STEM}-states.csv", f"{STEM}-checks.csv", f"{STEM}.html"]


def snapshot(folder: Path) -> dict[str, bytes]:
    """Every entry of ``folder`` (hidden ones too) with its content."""
    return {p.name: p.read_bytes() for p in sorted(folder.iterdir()) if p.is_file()}


def one_error_line(res, path: Path | str) -> str:
    assert res.exit_code == 2, res.output
    assert res.exception is None or isinstance(res.exception, SystemExit)
    lines = res.stderr.strip().splitlines()
    assert len(lines) == 1, res.stderr
    assert "Traceback" not in res.stderr and res.stdout == ""
    assert lines[0].startswith("clampstack: error: ")
    assert str(path) in lines[0]
    return lines[0]


def old_set(folder: Path) -> dict[str, bytes]:
    """An earlier report set (marked as old) beside an unrelated file of the user's."""
    folder.mkdir(exist_ok=True)
    for name in REPORT_SET:
        (folder / name).write_bytes(f"old {name}\n".encode())
    (folder / "notes.txt").write_text("the user's own file\n")
    return snapshot(folder)


def full_disk_on_third_write(monkeypatch) -> list[int]:
    """Make the write of the third file of a set fail as on a full disk."""
    calls: list[int] = []
    real = outfiles._write_all

    def write_all(fd: int, data: bytes) -> None:
        calls.append(len(data))
        if len(calls) == 3:
            os.write(fd, data[: len(data) // 2])  # half of it reached the disk
            raise OSError(errno.ENOSPC, os.strerror(errno.ENOSPC))
        real(fd, data)

    monkeypatch.setattr(outfiles, "_write_all", write_all)
    return calls


# ----------------------------------------------------------------------- report


def test_report_writes_the_whole_set_and_no_temporary(tmp_path):
    out = tmp_path / "reports"
    res = CliRunner().invoke(main, ["report", str(JOINT), "-o", str(out)])
    assert res.exit_code == 0, res.output
    assert sorted(p.name for p in out.iterdir()) == sorted(REPORT_SET)


def test_report_on_a_full_disk_leaves_the_old_set(tmp_path, monkeypatch):
    out = tmp_path / "reports"
    before = old_set(out)
    calls = full_disk_on_third_write(monkeypatch)
    res = CliRunner().invoke(main, ["report", str(JOINT), "-o", str(out)])
    line = one_error_line(res, out / f"{STEM}-checks.csv")  # the file that did not fit
    assert "No space left on device" in line
    assert len(calls) == 3  # it stopped at the third file
    assert snapshot(out) == before  # the old set intact, nothing new, no temporary


def test_report_on_a_full_disk_into_a_new_folder_writes_nothing(tmp_path, monkeypatch):
    out = tmp_path / "new"
    full_disk_on_third_write(monkeypatch)
    res = CliRunner().invoke(main, ["report", str(JOINT), "-o", str(out)])
    one_error_line(res, out)
    assert list(out.iterdir()) == []


def test_an_interrupt_while_writing_leaves_no_temporary(tmp_path, monkeypatch):
    before = old_set(tmp_path)
    calls = []

    def write_all(fd: int, data: bytes) -> None:
        calls.append(1)
        if len(calls) == 2:
            raise KeyboardInterrupt
        os.write(fd, data)

    monkeypatch.setattr(outfiles, "_write_all", write_all)
    with pytest.raises(KeyboardInterrupt):
        write_files(tmp_path, {name: "new\n" for name in REPORT_SET})
    assert snapshot(tmp_path) == before


def test_a_failed_rename_removes_the_temporaries_not_yet_moved(tmp_path, monkeypatch):
    old_set(tmp_path)
    real = os.replace
    moved = []

    def replace(src, dst):
        if len(moved) == 2:
            raise OSError(errno.EIO, os.strerror(errno.EIO))
        real(src, dst)
        moved.append(Path(dst).name)

    monkeypatch.setattr(outfiles.os, "replace", replace)
    with pytest.raises(InputError, match="Input/output error"):
        write_files(tmp_path, {name: f"new {name}\n" for name in REPORT_SET})
    assert not [p for p in tmp_path.iterdir() if p.name.startswith(TMP_PREFIX)]
    # the documented window: the first two were replaced, the page (last) is still old
    assert moved == REPORT_SET[:2]
    assert (tmp_path / f"{STEM}.html").read_text() == f"old {STEM}.html\n"


@pytest.mark.skipif(
    not hasattr(os, "geteuid") or os.geteuid() == 0, reason="root writes into read-only folders"
)
def test_report_into_a_read_only_folder(tmp_path):
    out = tmp_path / "ro"
    before = old_set(out)
    out.chmod(0o500)
    try:
        res = CliRunner().invoke(main, ["report", str(JOINT), "-o", str(out)])
        line = one_error_line(res, out)
        assert "Permission denied" in line
        assert snapshot(out) == before
    finally:
        out.chmod(0o700)


def test_report_where_a_folder_stands_in_place_of_a_file(tmp_path):
    (tmp_path / f"{STEM}-checks.csv").mkdir()
    res = CliRunner().invoke(main, ["report", str(JOINT), "-o", str(tmp_path)])
    one_error_line(res, tmp_path / f"{STEM}-checks.csv")
    assert sorted(p.name for p in tmp_path.iterdir()) == [f"{STEM}-checks.csv"]


def test_report_into_a_path_that_is_a_file(tmp_path):
    target = tmp_path / "a-file"
    target.write_text("x")
    res = CliRunner().invoke(main, ["report", str(JOINT), "-o", str(target)])
    one_error_line(res, target)
    assert target.read_text() == "x"


# ----------------------------------------------------------------------- stale temporaries


def dead_pid() -> int:
    """The id of a process that has exited."""
    proc = subprocess.Popen([sys.executable, "-c", "pass"])
    proc.wait()
    return proc.pid


def test_stale_temporaries_of_a_dead_process_are_removed_by_the_next_run(tmp_path):
    pid = dead_pid()
    stale = [tmp_path / f"{TMP_PREFIX}{pid}-0a1b2c3d-{i}" for i in range(3)]
    for p in stale:
        p.write_text("half a report")
    legacy = tmp_path / f".{STEM}.html.k3j_9x0a.tmp"  # an earlier version's (mkstemp)
    legacy.write_text("half a page")
    alive = subprocess.Popen([sys.executable, "-c", "import time; time.sleep(60)"])
    try:
        busy = tmp_path / f"{TMP_PREFIX}{alive.pid}-0a1b2c3d-0"  # another run, still writing
        busy.write_text("being written")
        mine = tmp_path / f".{STEM}.html.notmine.tmp"  # not the pattern: the user's
        mine.write_text("keep")
        res = CliRunner().invoke(main, ["report", str(JOINT), "-o", str(tmp_path)])
        assert res.exit_code == 0, res.output
        assert not any(p.exists() for p in stale) and not legacy.exists()
        assert busy.exists() and mine.exists()
        assert sorted(p.name for p in tmp_path.iterdir()) == sorted(
            [*REPORT_SET, busy.name, mine.name]
        )
    finally:
        alive.kill()
        alive.wait()
    assert clean_stale_temporaries(tmp_path) == [busy]  # now that it is gone


def test_a_folder_with_a_temporary_name_is_left_alone(tmp_path):
    odd = tmp_path / f"{TMP_PREFIX}{dead_pid()}-00-0"
    odd.mkdir()
    assert clean_stale_temporaries(tmp_path) == []
    assert odd.is_dir()


# ----------------------------------------------------------------------- demo


@pytest.mark.skipif(
    not hasattr(os, "geteuid") or os.geteuid() == 0, reason="root writes into read-only folders"
)
def test_demo_into_a_read_only_folder(tmp_path):
    out = tmp_path / "ro"
    out.mkdir()
    out.chmod(0o500)
    try:
        res = CliRunner().invoke(main, ["demo", "-o", str(out / "demo")])
        one_error_line(res, out / "demo")
        assert list(out.iterdir()) == []
    finally:
        out.chmod(0o700)


def test_demo_into_a_path_that_is_a_file(tmp_path):
    target = tmp_path / "a-file"
    target.write_text("x")
    res = CliRunner().invoke(main, ["demo", "-o", str(target)])
    one_error_line(res, target)
    res = CliRunner().invoke(main, ["demo", "-o", str(target / "sub")])  # below a file
    one_error_line(res, target / "sub")
    assert target.read_text() == "x"


def test_demo_on_a_full_disk_writes_nothing(tmp_path, monkeypatch):
    out = tmp_path / "demo"
    full_disk_on_third_write(monkeypatch)
    res = CliRunner().invoke(main, ["demo", "-o", str(out)])
    one_error_line(res, out)
    assert list(out.iterdir()) == []


def test_file_names_must_be_plain(tmp_path):
    for bad in ("../x.html", "sub/x.html", "..", ""):
        with pytest.raises(ValueError):
            write_files(tmp_path, {bad: "x"})
    assert list(tmp_path.iterdir()) == []


def test_the_pages_are_renamed_last(tmp_path, monkeypatch):
    real = os.replace
    order = []

    def replace(src, dst):
        order.append(Path(dst).name)
        real(src, dst)

    monkeypatch.setattr(outfiles.os, "replace", replace)
    files = {"a.html": "1", "b.json": "2", "c.html": "3", "d.csv": "4"}
    written = write_files(tmp_path, files)
    assert [p.name for p in written] == list(files)
    assert order == ["b.json", "d.csv", "a.html", "c.html"]


KILLED_WRITER = """
import os, signal, sys
from clampstack.outputs import files
real = files._write_all
calls = []
def write_all(fd, data):
    calls.append(1)
    if len(calls) == 3:
        real(fd, data[: len(data) // 2])
        os.kill(os.getpid(), signal.SIGKILL)  # killed in the middle of the third file
    real(fd, data)
files._write_all = write_all
files.write_files(sys.argv[1], {name: "new " + name for name in sys.argv[2:]})
"""


@pytest.mark.skipif(os.name == "nt", reason="SIGKILL")
def test_a_killed_write_leaves_the_old_set_and_the_next_run_cleans_up(tmp_path):
    before = old_set(tmp_path)
    proc = subprocess.Popen([sys.executable, "-c", KILLED_WRITER, str(tmp_path), *REPORT_SET])
    assert proc.wait() == -9
    left = sorted(p.name for p in tmp_path.iterdir() if p.name.startswith(TMP_PREFIX))
    assert len(left) == 3 and all(n.startswith(f"{TMP_PREFIX}{proc.pid}-") for n in left)
    assert {k: v for k, v in snapshot(tmp_path).items() if k not in left} == before
    res = CliRunner().invoke(main, ["report", str(JOINT), "-o", str(tmp_path)])
    assert res.exit_code == 0, res.output
    assert sorted(p.name for p in tmp_path.iterdir()) == sorted([*REPORT_SET, "notes.txt"])
