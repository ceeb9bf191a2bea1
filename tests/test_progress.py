"""The terminal progress bar: drawn on a terminal only, quiet when piped or asked to be."""

from __future__ import annotations

import io

import pytest

from clampstack.outputs.progress import MIN_TOTAL, Progress, chunks, progress, should_show


class FakeTTY(io.StringIO):
    def isatty(self) -> bool:
        return True


def test_quiet_when_piped_or_short_or_asked(monkeypatch):
    monkeypatch.delenv("TERM", raising=False)
    tty, pipe = FakeTTY(), io.StringIO()
    assert should_show(10_000, tty)
    assert not should_show(10_000, pipe)  # piped: no bar
    assert not should_show(10_000, tty, quiet=True)  # --json / --csv
    assert not should_show(MIN_TOTAL - 1, tty)  # too short to need one
    monkeypatch.setenv("TERM", "dumb")
    assert not should_show(10_000, tty)
    with Progress(10_000, "sweep", stream=pipe) as bar:
        bar.update(5000)
        bar.update(5000)
    assert pipe.getvalue() == ""


def test_bar_on_a_terminal_redraws_in_place_and_ends_its_line(monkeypatch):
    # click's own bar (click.progressbar): redrawn with carriage returns on one line, and
    # the line ended when the run is done
    monkeypatch.delenv("TERM", raising=False)
    tty = FakeTTY()
    with Progress(4000, "sweep", stream=tty, interval=0.0, width=10) as bar:
        assert bar.enabled
        bar.update(1000)
        assert tty.getvalue().endswith("sweep [##........] 1000/4000   25%")
        bar.update(3000)
        assert tty.getvalue().endswith("sweep [##########] 4000/4000  100%")
    out = tty.getvalue()
    assert out.count("\n") == 1 and out.endswith("\n")  # one line, ended once
    assert out.count("\r") == 2


def test_redraws_are_throttled(monkeypatch):
    tty = FakeTTY()
    bar = Progress(100_000, stream=tty, enabled=True, interval=3600.0)
    for _ in range(99_999):
        bar.update(1)
    assert tty.getvalue().count("\r") == 1  # the first draw only
    bar.update(1)  # the end is always drawn
    assert tty.getvalue().count("\r") == 2
    assert bar.line().endswith("100000/100000  100%")


def test_iterator_and_chunks():
    tty = FakeTTY()
    assert list(progress(range(5), stream=tty, enabled=True)) == [0, 1, 2, 3, 4]
    assert "5/5" in tty.getvalue()
    assert [(s.start, s.stop) for s in chunks(10, 4)] == [(0, 4), (4, 8), (8, 10)]
    assert list(chunks(0, 4)) == []
    with pytest.raises(ValueError):
        list(chunks(10, 0))
