"""The JSON contract: every ``--json`` document starts with what it is and where from.

``schema`` names the document (``clampstack.check``, ``clampstack.flange``, ...),
``schema_version`` its version (raised when a key changes meaning or goes away; new
keys may appear within a version), ``clampstack_version`` the tool's, and
``input_sha256`` the SHA-256 of the input file's bytes (null where a command reads
no file).  The JSON Schemas in ``clampstack/schemas`` describe each document.
"""

from __future__ import annotations

from typing import Any

from .._version import SCHEMA_VERSION, __version__

#: every document an analysing command prints with --json
SCHEMAS = (
    "solve",
    "check",
    "sweep",
    "flange",
    "scatter",
    "size",
    "report",
    "catalog",
    "verify",
)


def header(schema: str, input_sha256: str | None) -> dict[str, Any]:
    """The four keys that start every ``--json`` document."""
    if schema not in SCHEMAS:
        raise ValueError(f"unknown schema {schema!r}")
    return {
        "schema": f"clampstack.{schema}",
        "schema_version": SCHEMA_VERSION,
        "clampstack_version": __version__,
        "input_sha256": input_sha256,
    }


def envelope(schema: str, payload: dict[str, Any], input_sha256: str | None) -> dict[str, Any]:
    """``payload`` with the header keys first (a payload key of the same name is replaced)."""
    out = header(schema, input_sha256)
    out.update({k: v for k, v in payload.items() if k not in out})
    return out
