"""Declarative input schema and the reader that validates TOML tables against it.

Each input table is a :class:`Schema` of :class:`Key` entries: name, kind
(a quantity kind from :mod:`clampstack.units`, or ``text``, ``number``,
``names``, ``bool``, ``range:<kind>``, ``table``, ``tables``), whether it is
required, its default and a line of documentation.  The same objects drive
validation (unknown keys, wrong types and units are :class:`InputError` with the
key path) and the generated input reference in ``docs/``.
"""

from __future__ import annotations

import difflib
import math
from dataclasses import dataclass
from typing import Any

from ..errors import InputError
from ..units import KINDS, check_magnitude, parse_quantity, parse_range

SIMPLE_KINDS = ("text", "number", "integer", "names", "bool", "pairs", "raw")


@dataclass(frozen=True)
class Key:
    """One input key: name, kind, documentation and default (as printed)."""

    name: str
    kind: str
    doc: str
    required: bool = False
    default: str | None = None
    choices: tuple[str, ...] | None = None
    schema: Schema | None = None
    minimum: float | None = None  # for numbers and quantities (SI), exclusive if positive
    positive: bool = False  # value must be > 0

    def describe_kind(self) -> str:
        """Human description of the expected value (for docs and errors)."""
        if self.kind in KINDS:
            return f"quantity ({KINDS[self.kind][2]})"
        if self.kind.startswith("range:"):
            inner = self.kind.split(":", 1)[1]
            what = KINDS[inner][2] if inner in KINDS else inner
            return f"value or range low..high ({what})"
        return {
            "text": "text",
            "number": "number",
            "integer": "whole number",
            "names": "list of names",
            "bool": "true / false",
            "pairs": "list of [x, y] pairs",
            "table": "table",
            "tables": "array of tables",
            "raw": "value",
        }.get(self.kind, self.kind)


@dataclass(frozen=True)
class Schema:
    """A table of keys (``[bolt]``, ``[[part]]``, ...)."""

    name: str
    doc: str
    keys: tuple[Key, ...]

    def key(self, name: str) -> Key:
        """The :class:`Key` called ``name``."""
        for k in self.keys:
            if k.name == name:
                return k
        raise KeyError(name)


SHOW_LIMIT = 60  # characters of an offending value echoed in an error message


def _show(v: Any) -> str:
    if isinstance(v, dict | list):
        text = "a table" if isinstance(v, dict) else f"a list of {len(v)}"
        return text if len(repr(v)) > SHOW_LIMIT else repr(v)
    text = f'"{v}"' if isinstance(v, str) else repr(v)
    return text if len(text) <= SHOW_LIMIT else f"{text[: SHOW_LIMIT - 5]}...{text[-3:]}"


def _join(path: str, name: str) -> str:
    return f"{path}.{name}" if path else name


MAX_DEPTH = 8  # levels of tables and arrays below the top of a document
MAX_ITEMS = 100_000  # values in a whole document (and entries in one array)
MAX_TEXT = 500  # characters of a text value (names, titles, catalog keys)


def check_shape(data: Any) -> None:
    """Refuse documents nested deeper than :data:`MAX_DEPTH` or holding more than
    :data:`MAX_ITEMS` values, before anything else looks at them (iterative: no
    recursion, so no input can exhaust the stack here)."""
    stack: list[tuple[Any, int, str]] = [(data, 0, "")]
    count = 0
    while stack:
        node, depth, kp = stack.pop()
        count += 1
        if count > MAX_ITEMS:
            raise InputError(f"input holds too many values (more than {MAX_ITEMS})")
        if depth > MAX_DEPTH:
            raise InputError(
                f"input is nested too deeply (more than {MAX_DEPTH} levels)", key=kp or None
            )
        if isinstance(node, dict):
            stack.extend((v, depth + 1, _join(kp, str(k))) for k, v in node.items())
        elif isinstance(node, list):
            stack.extend((v, depth + 1, f"{kp}[{n + 1}]") for n, v in enumerate(node))


def read_table(schema: Schema, data: Any, path: str = "", depth: int = 0) -> dict[str, Any]:
    """Validate ``data`` (a dict from TOML) against ``schema``.

    Returns a dict of every key of the schema: parsed values (SI floats for
    quantities, ``(lo, hi)`` for ranges), ``None`` for absent optional keys.
    Raises :class:`InputError` naming the key path on the first problem.
    """
    if depth == 0 and not path:
        check_shape(data)
    if depth > MAX_DEPTH:
        raise InputError("input is nested too deeply", key=path or None)
    if not isinstance(data, dict):
        raise InputError(f"expected a table, got {_show(data)}", key=path or None)
    known = {k.name for k in schema.keys}
    for name in data:
        if name not in known:
            near = (
                difflib.get_close_matches(str(name), sorted(known), n=3, cutoff=0.6)
                if len(str(name)) <= MAX_TEXT
                else []
            )
            hint = (
                f" (did you mean {', '.join(near)}?)"
                if near
                else (f" (known keys: {', '.join(sorted(known))})")
            )
            raise InputError(f"unknown key{hint}", key=_join(path, str(name)))
    out: dict[str, Any] = {}
    for key in schema.keys:
        kp = _join(path, key.name)
        if key.name not in data:
            if key.required:
                raise InputError("required key is missing", key=kp)
            out[key.name] = None
            continue
        out[key.name] = read_value(key, data[key.name], kp, depth)
    return out


def read_value(key: Key, raw: Any, kp: str, depth: int = 0) -> Any:
    """Validate and convert one value for ``key`` (see :func:`read_table`)."""
    kind = key.kind
    if kind == "table":
        assert key.schema is not None
        return read_table(key.schema, raw, kp, depth + 1)
    if kind == "tables":
        assert key.schema is not None
        if isinstance(raw, dict):
            raw = [raw]
        if not isinstance(raw, list):
            raise InputError(f"expected an array of tables [[{key.name}]]", key=kp)
        if len(raw) > MAX_ITEMS:
            raise InputError(f"too many entries ({len(raw)}; at most {MAX_ITEMS})", key=kp)
        return [
            read_table(key.schema, item, f"{kp}[{n + 1}]", depth + 1) for n, item in enumerate(raw)
        ]
    if kind == "raw":
        return raw
    if kind == "text":
        if not isinstance(raw, str) or not raw.strip():
            raise InputError(f"expected text, got {_show(raw)}", key=kp)
        if len(raw) > MAX_TEXT:
            raise InputError(
                f"text is too long ({len(raw)} characters; at most {MAX_TEXT})", key=kp
            )
        # a title or name is one line: a line break in it is kept visible as \\n
        raw = raw.replace("\r\n", "\\n").replace("\n", "\\n").replace("\r", "\\r")
        if key.choices and raw not in key.choices:
            near = difflib.get_close_matches(raw, key.choices, n=1)
            hint = f"; did you mean {_show(near[0])}?" if near else ""
            raise InputError(
                f"expected one of {', '.join(_show(c) for c in key.choices)}, got {_show(raw)}{hint}",
                key=kp,
            )
        return raw
    if kind == "bool":
        if not isinstance(raw, bool):
            raise InputError(f"expected true or false, got {_show(raw)}", key=kp)
        return raw
    if kind in ("number", "integer"):
        if isinstance(raw, bool) or not isinstance(raw, int | float):
            raise InputError(f"expected a number, got {_show(raw)}", key=kp)
        if isinstance(raw, int) and abs(raw) > 1e300:
            raise InputError(f"number is too large: {_show(raw)}", key=kp)
        if not math.isfinite(raw):
            raise InputError(f"expected a finite number, got {_show(raw)}", key=kp)
        if kind == "integer" and not (isinstance(raw, int) or float(raw).is_integer()):
            raise InputError(f"expected a whole number, got {_show(raw)}", key=kp)
        try:
            small = check_magnitude(float(raw), _show(raw))
        except InputError as err:
            raise InputError(err.detail, key=kp) from None
        value = int(raw) if kind == "integer" else small
        _check_bounds(key, value, raw, kp)
        return value
    if kind == "names":
        if isinstance(raw, str):
            raw = [raw]
        if not isinstance(raw, list) or not all(isinstance(x, str) and x.strip() for x in raw):
            raise InputError(f"expected a list of names, got {_show(raw)}", key=kp)
        for x in raw:
            if len(x) > MAX_TEXT:
                raise InputError(
                    f"name is too long ({len(x)} characters; at most {MAX_TEXT})", key=kp
                )
        if len(raw) > MAX_ITEMS:
            raise InputError(f"too many names ({len(raw)})", key=kp)
        return list(raw)
    if kind == "pairs":
        if not isinstance(raw, list) or len(raw) > MAX_ITEMS:
            raise InputError("expected a list of [x, y] pairs", key=kp)
        for n, item in enumerate(raw):
            if not isinstance(item, list) or len(item) != 2:
                raise InputError(f"entry {n + 1} is not an [x, y] pair: {_show(item)}", key=kp)
        return raw
    if kind.startswith("range:"):
        inner = kind.split(":", 1)[1]
        lo, hi = parse_range(raw, inner, kp)
        _check_bounds(key, lo, raw, kp)
        return (lo, hi)
    if kind in KINDS:
        value = parse_quantity(raw, kind, kp)
        _check_bounds(key, value, raw, kp)
        return value
    raise KeyError(kind)  # pragma: no cover - schema error


def _check_bounds(key: Key, value: float, raw: Any, kp: str) -> None:
    if key.positive and not value > 0:
        raise InputError(f"must be greater than zero, got {_show(raw)}", key=kp)
    if key.minimum is not None and value < key.minimum:
        raise InputError(f"must not be below {key.minimum:g}, got {_show(raw)}", key=kp)
