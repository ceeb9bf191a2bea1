"""The shipped JSON Schemas: generated from the code, and every example and every
example's real ``--json`` output validates against them.

The validator here covers the subset of JSON Schema 2020-12 the generator writes
(type, const, enum, pattern, properties, required, additionalProperties, items,
minItems, maxItems); it is written for this test (no schema library is a dependency).
"""

from __future__ import annotations

import json
import re
import tomllib

import pytest

from clampstack import __version__ as VERSION
from clampstack.inputs.files import file_kind
from clampstack.inputs.jsonschema import all_schemas, schema_folder
from conftest import ROOT

TYPES = {
    "object": dict,
    "array": list,
    "string": str,
    "boolean": bool,
    "null": type(None),
}


def _is(value, t: str) -> bool:
    if t == "number":
        return isinstance(value, int | float) and not isinstance(value, bool)
    if t == "integer":
        return isinstance(value, int) and not isinstance(value, bool)
    return isinstance(value, TYPES[t])


def validate(value, schema: dict, path: str = "$") -> list[str]:
    """Every violation of ``schema`` by ``value`` (empty: valid)."""
    errs: list[str] = []
    if "const" in schema and value != schema["const"]:
        errs.append(f"{path}: {value!r} is not {schema['const']!r}")
    if "enum" in schema and value not in schema["enum"]:
        errs.append(f"{path}: {value!r} not in {schema['enum']}")
    if "type" in schema:
        types = schema["type"] if isinstance(schema["type"], list) else [schema["type"]]
        if not any(_is(value, t) for t in types):
            return [*errs, f"{path}: {type(value).__name__} is not {types}"]
    if isinstance(value, str) and "pattern" in schema and not re.search(schema["pattern"], value):
        errs.append(f"{path}: {value!r} does not match {schema['pattern']}")
    if isinstance(value, dict):
        props = schema.get("properties", {})
        for r in schema.get("required", []):
            if r not in value:
                errs.append(f"{path}: missing {r}")
        for k, v in value.items():
            if k in props:
                errs += validate(v, props[k], f"{path}.{k}")
            elif schema.get("additionalProperties") is False:
                errs.append(f"{path}: unknown key {k}")
    if isinstance(value, list):
        if "minItems" in schema and len(value) < schema["minItems"]:
            errs.append(f"{path}: fewer than {schema['minItems']} items")
        if "maxItems" in schema and len(value) > schema["maxItems"]:
            errs.append(f"{path}: more than {schema['maxItems']} items")
        if "items" in schema:
            for n, v in enumerate(value):
                errs += validate(v, schema["items"], f"{path}[{n}]")
    return errs


def _load(name: str) -> dict:
    return json.loads((schema_folder() / name).read_text(encoding="utf-8"))


def test_shipped_schemas_are_the_generated_ones():
    shipped = {p.name: p.read_text(encoding="utf-8") for p in schema_folder().glob("*.json")}
    assert shipped == all_schemas(), "run: .venv/bin/python -m clampstack.inputs.jsonschema"


@pytest.mark.parametrize("path", sorted((ROOT / "examples").glob("*.toml")), ids=lambda p: p.name)
def test_every_example_validates_against_its_input_schema(path):
    data = tomllib.loads(path.read_text(encoding="utf-8"))
    schema = _load(f"input-{file_kind(data)}.json")
    assert validate(data, schema) == []


def test_the_input_schema_catches_what_the_reader_refuses():
    schema = _load("input-joint.json")
    data = tomllib.loads((ROOT / "examples" / "m10-cover-screw-aluminium.toml").read_text())
    data["bolt"]["thred"] = "M10"  # a misspelt key
    data["tightening"]["method"] = "hammer"  # not a method
    errs = validate(data, schema)
    assert any("unknown key thred" in e for e in errs)
    assert any("hammer" in e for e in errs)


def test_every_real_output_validates_against_its_output_schema():
    # the recorded --json of every command on every example (tests/snapshots), which a
    # test keeps equal to what the commands print
    outputs = json.loads((ROOT / "tests" / "snapshots" / "outputs.json").read_text())
    seen = set()
    for cmd, out in outputs.items():
        if "(its JSON file)" in cmd or not isinstance(out, dict) or "json" not in out:
            continue
        # the snapshot leaves out the volatile version; put it back
        doc = {"clampstack_version": VERSION, **out["json"]}
        name = doc["schema"].split(".", 1)[1]
        seen.add(name)
        errs = validate(doc, _load(f"output-{name}.json"))
        assert errs == [], (cmd, errs[:5])
    assert {"check", "sweep", "flange", "scatter", "size", "solve", "catalog", "verify"} <= seen
