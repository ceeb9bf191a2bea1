"""A progress bar for long runs, shown only on a terminal.

Long studies (sweeps with thousands of points, scatter studies) report their
progress on stderr while a person watches; piped output, ``--json`` and
``--csv`` stay clean.  The bar is click's own (``click.progressbar``): click is
loaded by the command line anyway, so it costs neither start-up time nor a
dependency; this module decides when a bar is shown and throttles its redraws.

Usage::

    with Progress(total=n, label="sweep", quiet=as_json) as bar:
        for chunk in chunks:
            ...
            bar.update(len(chunk))
"""

from __future__ import annotations

import os
import sys
import time
from collections.abc import Iterable, Iterator
from typing import IO, Any, TypeVar

T = TypeVar("T")

#: Runs with fewer steps than this finish too fast to need a bar.
MIN_TOTAL = 2000


def _is_terminal(stream: IO[str]) -> bool:
    try:
        return bool(stream.isatty())
    except (AttributeError, ValueError):  # no isatty, or a closed stream
        return False


def should_show(
    total: int, stream: IO[str] | None = None, quiet: bool = False, min_total: int = MIN_TOTAL
) -> bool:
    """True when a bar helps: not ``quiet``, at least ``min_total`` steps, ``stream`` a terminal.

    ``TERM=dumb`` (an editor's shell, some CI logs) counts as no terminal.
    """
    if quiet or total < min_total:
        return False
    if os.environ.get("TERM") == "dumb":
        return False
    return _is_terminal(stream if stream is not None else sys.stderr)


class Progress:
    """A one-line progress bar on ``stream`` (stderr by default), redrawn in place.

    Parameters
    ----------
    total
        Number of steps of the whole run.
    label
        Text in front of the bar.
    stream
        Where to draw (a terminal); default ``sys.stderr``.
    quiet
        Never draw (``--json``, ``--csv``).
    enabled
        Force the bar on or off; default :func:`should_show`.
    width
        Characters of the bar itself.
    interval
        Least time between two redraws [s] (a bar must not slow the run down).
    """

    def __init__(
        self,
        total: int,
        label: str = "",
        stream: IO[str] | None = None,
        quiet: bool = False,
        enabled: bool | None = None,
        width: int = 28,
        interval: float = 0.1,
    ):
        self.total = max(int(total), 0)
        self.label = label
        self.stream = stream if stream is not None else sys.stderr
        self.enabled = should_show(self.total, self.stream, quiet) if enabled is None else enabled
        self.width = width
        self.interval = interval
        self.done = 0
        self._shown = 0  # steps handed to click's bar
        self._last: float | None = None  # time of the last draw
        self._bar = None
        if self.enabled:
            self._bar = self._click_bar(self.stream)

    def _click_bar(self, stream: IO[str] | None) -> Any:
        """click's bar in this module's look: ``label [####....] 450/1000   45%``."""
        import click

        return click.progressbar(
            length=max(self.total, 1),
            label=self.label,
            file=stream,
            width=self.width,
            fill_char="#",
            empty_char=".",
            show_percent=True,
            show_pos=True,
            show_eta=False,
            bar_template="%(label)s [%(bar)s] %(info)s",
        )

    def line(self) -> str:
        """The text of the bar as it stands: ``label [#####.....]  450/1000   45%``."""
        bar = self._click_bar(None)
        bar.pos = min(self.done, bar.length)
        return bar.format_progress_line().strip()

    def update(self, steps: int = 1) -> None:
        """Count ``steps`` more done and redraw (at most every ``interval`` seconds)."""
        self.done += steps
        if self._bar is None:
            return
        now = time.monotonic()
        if self._last is not None and self.done < self.total and now - self._last < self.interval:
            return
        self._last = now
        self._bar.update(self.done - self._shown)
        self._shown = self.done

    def close(self) -> None:
        """Finish the bar's line, so that what follows starts on a clean line."""
        if self._bar is not None:
            if self._shown:
                self._bar.render_finish()
            self._bar = None

    def __enter__(self) -> Progress:
        return self

    def __exit__(self, *exc: object) -> None:
        self.close()


def progress(
    items: Iterable[T],
    total: int | None = None,
    label: str = "",
    stream: IO[str] | None = None,
    quiet: bool = False,
    enabled: bool | None = None,
) -> Iterator[T]:
    """Iterate over ``items``, advancing a :class:`Progress` bar by one per item."""
    if total is None:
        total = len(items) if hasattr(items, "__len__") else 0  # type: ignore[arg-type]
    with Progress(total, label, stream, quiet, enabled) as bar:
        for item in items:
            yield item
            bar.update(1)


def chunks(n: int, size: int) -> Iterator[slice]:
    """Slices of ``range(n)`` of at most ``size`` items: vectorised work in steps a bar can count."""
    if size < 1:
        raise ValueError("size must be at least 1")
    for start in range(0, n, size):
        yield slice(start, min(start + size, n))
