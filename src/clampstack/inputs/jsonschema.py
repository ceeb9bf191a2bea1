"""JSON Schemas of the input files and of every ``--json`` document, from the code.

The input schemas are written from the readers' own :class:`~.schema.Schema` tables
(every key, its kind, its documentation, whether it is required, its choices), so an
editor with a TOML language server (for example Taplo or Even Better TOML, which take
a JSON Schema) checks a file as it is typed.  A quantity is a string with its unit
(``"12 mm"``) or, where the reader allows, a plain SI number; a range ``"lo..hi"``.

The output schemas state the contract's header (``schema``, ``schema_version``,
``clampstack_version``, ``input_sha256``) and the top-level keys each document
always has (DESIGN.md); further keys may appear within a version.

``python -m clampstack.inputs.jsonschema`` writes them into ``clampstack/schemas``;
a test checks that the shipped files are the generated ones and that every example
and every example's real output validates.
"""

from __future__ import annotations

import json
from pathlib import Path
from typing import Any

from .._version import SCHEMA_VERSION
from ..units import KINDS
from .schema import Key, Schema

DRAFT = "https://json-schema.org/draft/2020-12/schema"
BASE = "https://clampstack.invalid/schemas/"  # an identifier, not a URL to fetch


def _quantity(kind: str) -> dict[str, Any]:
    what = KINDS[kind][2] if kind in KINDS else kind
    return {"type": ["string", "number"], "description": f"quantity ({what})"}


def key_schema(key: Key) -> dict[str, Any]:
    """The JSON Schema of one key's value."""
    k = key.kind
    if k == "table":
        assert key.schema is not None
        out = table_schema(key.schema)
    elif k == "tables":
        assert key.schema is not None
        out = {"type": "array", "items": table_schema(key.schema)}
    elif k == "text":
        out = {"type": "string"}
        if key.choices:
            out["enum"] = list(key.choices)
    elif k == "number":
        out = {"type": "number"}
    elif k == "integer":
        out = {"type": "integer"}
    elif k == "bool":
        out = {"type": "boolean"}
    elif k == "names":
        out = {"type": ["string", "array"], "items": {"type": "string"}}
    elif k == "pairs":
        out = {"type": "array", "items": {"type": "array", "minItems": 2, "maxItems": 2}}
    elif k.startswith("range:"):
        out = _quantity(k.split(":", 1)[1])
        out["description"] = "value or range low..high, " + out["description"]
    elif k in KINDS:
        out = _quantity(k)
    else:  # raw: any value the reader interprets itself
        out = {}
    doc = key.doc + (f" [default: {key.default}]" if key.default else "")
    out["description"] = doc if "description" not in out else f"{doc}; {out['description']}"
    return out


def table_schema(schema: Schema) -> dict[str, Any]:
    """The JSON Schema of a table: its keys, the required ones, no others."""
    out: dict[str, Any] = {
        "type": "object",
        "description": schema.doc,
        "properties": {k.name: key_schema(k) for k in schema.keys},
        "additionalProperties": False,
    }
    req = [k.name for k in schema.keys if k.required]
    if req:
        out["required"] = req
    return out


def input_schemas() -> dict[str, dict[str, Any]]:
    """{file name: JSON Schema} of the three input file kinds."""
    from .assembly import ASSEMBLY
    from .flange import FLANGE_FILE
    from .joint import JOINT

    out = {}
    for kind, sch in (("joint", JOINT), ("flange", FLANGE_FILE), ("assembly", ASSEMBLY)):
        doc = {
            "$schema": DRAFT,
            "$id": f"{BASE}input-{kind}.json",
            "title": f"clampstack {kind} file",
        }
        doc.update(table_schema(sch))
        out[f"input-{kind}.json"] = doc
    return out


#: keys every document of a command always has, besides the header (DESIGN.md)
OUTPUT_KEYS: dict[str, tuple[str, ...]] = {
    "solve": ("title", "cases"),
    "check": ("title", "ok", "checks", "preload", "service", "tightening", "load_factor"),
    "sweep": ("title", "points", "limits", "ok"),
    "flange": (
        "title",
        "required_bolt_load",
        "gasket",
        "bolts",
        "passes",
        "checks",
        "ok",
        "rotation",
        "heat_cycle",
    ),
    "scatter": ("title", "samples", "seed", "percentiles", "probabilities"),
    "size": ("title", "designs"),
    "report": ("ok", "report", "files"),
    "catalog": ("listing", "records"),
    "verify": ("ok", "passed", "failed", "cases"),
}


def output_schemas() -> dict[str, dict[str, Any]]:
    """{file name: JSON Schema} of every ``--json`` document."""
    out = {}
    for name, keys in OUTPUT_KEYS.items():
        props: dict[str, Any] = {
            "schema": {"const": f"clampstack.{name}"},
            "schema_version": {"const": SCHEMA_VERSION},
            "clampstack_version": {"type": "string"},
            "input_sha256": {"type": ["string", "null"], "pattern": "^[0-9a-f]{64}$"},
        }
        props.update({k: {} for k in keys})
        out[f"output-{name}.json"] = {
            "$schema": DRAFT,
            "$id": f"{BASE}output-{name}.json",
            "title": f"clampstack {name} --json",
            "type": "object",
            "properties": props,
            "required": ["schema", "schema_version", "clampstack_version", "input_sha256", *keys],
        }
    return out


def all_schemas() -> dict[str, str]:
    """Every shipped schema file: {name: JSON text}."""
    docs = {**input_schemas(), **output_schemas()}
    return {n: json.dumps(d, indent=2, sort_keys=False) + "\n" for n, d in docs.items()}


def schema_folder() -> Path:
    """Where the package keeps its schemas."""
    return Path(__file__).resolve().parent.parent / "schemas"


def main() -> None:
    folder = schema_folder()
    folder.mkdir(exist_ok=True)
    for name, text in all_schemas().items():
        (folder / name).write_text(text, encoding="utf-8")
    print(f"wrote {len(all_schemas())} schemas into {folder}")


if __name__ == "__main__":
    main()
