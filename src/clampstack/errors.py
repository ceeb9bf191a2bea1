"""Error hierarchy of clampstack.

Every error a user can cause derives from :class:`ClampstackError`.  The
command line turns :class:`InputError` and :class:`SolveError` into one line on
stderr and exit code 2; nothing else is ever shown as a traceback for bad input.
"""

from __future__ import annotations

MAX_MESSAGE = 600  # characters of an error message; the middle of a longer one is cut


def printable(text: str, limit: int = MAX_MESSAGE) -> str:
    """``text`` safe for one terminal line: control characters (newlines, escape
    sequences) and undecodable characters escaped, the middle cut when too long."""
    text = text.encode("utf-8", "backslashreplace").decode("utf-8")
    text = "".join(c if c.isprintable() else c.encode("unicode_escape").decode() for c in text)
    if len(text) > limit:
        text = f"{text[: limit * 2 // 3]} ... {text[-limit // 4 :]}"
    return text


class ClampstackError(Exception):
    """Base class of every error clampstack raises on purpose."""

    def __str__(self) -> str:
        return printable(super().__str__())


class InputError(ClampstackError, ValueError):
    """Bad input: a missing or unknown key, a wrong unit, a value out of range.

    ``key`` is the key path inside the input (``part[2].length``), ``source`` the
    file it came from (filled in by the loader); the message names both.
    """

    def __init__(self, message: str, key: str | None = None, source: str | None = None):
        self.key = key
        self.source = source
        self.detail = message
        super().__init__(message)

    def with_source(self, source: str) -> InputError:
        """Return the same error with the input file named (keeps the first one set)."""
        if self.source is None:
            self.source = source
        return self

    def with_prefix(self, prefix: str) -> InputError:
        """Prefix the key path, e.g. ``part[2]`` + ``length`` -> ``part[2].length``."""
        self.key = prefix if not self.key else f"{prefix}.{self.key}"
        return self

    def __str__(self) -> str:
        parts = []
        if self.source:
            parts.append(str(self.source))
        if self.key:
            parts.append(self.key)
        parts.append(self.detail)
        return printable(": ".join(str(p) for p in parts))


class SolveError(ClampstackError, RuntimeError):
    """The model is valid input but cannot be solved (a mechanism, a cycling contact set)."""
