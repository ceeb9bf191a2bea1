"""Generated documents that are valid and reach deep states, and unit-expression fuzzing.

Where :mod:`test_fuzz_inputs` mutates the examples (mostly stopping at parsing), these
strategies build joints and flanges from the catalog's own keys with physically sensible
ranges: threads and grades, stacks of dissimilar materials, tapped holes and nuts,
temperatures near the ends of the material data, pass sequences and patterns, and
``[distributions]``.  Every run must be clean (:func:`assert_clean`); a refusal must
name a key path or an option; an accepted result must be finite and physical.

``CLAMPSTACK_FUZZ_EXAMPLES`` (default 60 in the other module) scales these runs too: the
default here is a fast fifth of it, ``CLAMPSTACK_FUZZ_EXAMPLES=2000`` a deeper hunt.
"""

from __future__ import annotations

import json
import math
import os
import re
import time
from typing import Any

import pytest
from hypothesis import HealthCheck, given, settings
from hypothesis import strategies as st
from test_fuzz_inputs import assert_clean, run_command, time_limit, to_toml

from clampstack.errors import InputError
from clampstack.units import parse_quantity

N = max(int(os.environ.get("CLAMPSTACK_FUZZ_EXAMPLES", "60")) // 5, 8)
DEEP = settings(
    max_examples=N,
    deadline=None,
    suppress_health_check=[HealthCheck.too_slow, HealthCheck.data_too_large],
    derandomize=N <= 20,
)

THREADS = ["M6", "M8", "M10", "M12", "M16", "M20", "M24"]
GRADES = ["8.8", "10.9", "12.9"]
MATERIALS = [
    "steel",
    "steel-C45",
    "stainless",
    "cast-iron-grey",
    "cast-iron-nodular",
    "aluminium-6082-T6",
    "aluminium-cast",
    "magnesium",
    "titanium-6Al-4V",
    "bronze",
]
# an exit-2 message of a valid document names the file's key path or an option
KEYED = re.compile(r"^clampstack: error: (.+?: )?([A-Za-z_][\w.\[\]]*|--[\w-]+): ")


def _mm(x: float) -> str:
    return f"{x:.3g} mm"


@st.composite
def joints(draw) -> dict[str, Any]:
    d = {"M6": 6, "M8": 8, "M10": 10, "M12": 12, "M16": 16, "M20": 20, "M24": 24}
    thread = draw(st.sampled_from(THREADS))
    size = d[thread]
    layers = [
        {
            "material": draw(st.sampled_from(MATERIALS)),
            "thickness": _mm(draw(st.floats(0.5, 3.0)) * size),
        }
        for _ in range(draw(st.integers(1, 3)))
    ]
    grip = sum(float(x["thickness"].split()[0]) for x in layers)
    doc: dict[str, Any] = {"title": "generated joint", "clamped": layers}
    tapped = draw(st.booleans())
    if tapped:
        engagement = draw(st.floats(0.8, 2.5)) * size
        doc["tapped_hole"] = {
            "material": draw(st.sampled_from(MATERIALS)),
            "engagement": _mm(engagement),
        }
        length = grip + engagement
    else:
        doc["nut"] = {}
        length = grip + size + 3 * size / 6
    doc["bolt"] = {
        "thread": thread,
        "grade": draw(st.sampled_from(GRADES)),
        "length": _mm(math.ceil(length)),
    }
    lo = draw(st.floats(0.06, 0.16))
    tightening: dict[str, Any] = {
        "thread_friction": f"{lo:.3f}..{lo + draw(st.floats(0, 0.06)):.3f}"
    }
    if draw(st.booleans()):
        tightening["torque"] = f"{draw(st.floats(0.2, 1.0)) * 0.2 * size**3 / 10:.3g} N*m"
    doc["tightening"] = tightening
    FA = draw(st.floats(0, 0.3)) * size**2 * 0.5  # kN
    service: dict[str, Any] = {
        "axial_load": f"{FA * draw(st.floats(0, 1)):.3g}..{FA:.3g} kN",
        "temperature": f"{draw(st.sampled_from([-60, -40, 0, 20, 80, 120, 150])):g} degC",
    }
    if draw(st.booleans()):
        service["shear_load"] = f"{draw(st.floats(0, 0.05)) * size**2:.3g} kN"
    doc["service"] = service
    if draw(st.booleans()):
        doc["distributions"] = {
            "torque_factor": {"normal": [1.0, draw(st.floats(0.0, 0.05))]},
            "embedding": f"{draw(st.floats(1, 4)):.2f} um..{draw(st.floats(4, 9)):.2f} um",
        }
    return doc


@st.composite
def flanges(draw) -> dict[str, Any]:
    n = draw(st.sampled_from([4, 6, 8, 10, 12, 16, 20, 24]))
    thread = draw(st.sampled_from(["M12", "M16", "M20"]))
    size = int(thread[1:])
    gi = draw(st.floats(60, 200))
    go = gi + draw(st.floats(12, 40))
    bc = max(go + 2.2 * size, n * 2.2 * size / math.pi)
    k = draw(st.integers(1, 4))
    passes = [draw(st.integers(20, 110)) for _ in range(k)]
    return {
        "title": "generated flange",
        "flange": {
            "bolt_count": n,
            "bolt_circle": _mm(bc),
            "thickness": _mm(draw(st.floats(12, 40))),
            "material": draw(st.sampled_from(["steel", "stainless", "cast-iron-nodular"])),
        },
        "bolt": {"thread": thread, "grade": draw(st.sampled_from(GRADES))},
        "gasket": {
            "type": draw(st.sampled_from(["spiral-wound", "fibre-3mm", "elastomer"])),
            "inner_diameter": _mm(gi),
            "outer_diameter": _mm(go),
            "thickness": "3 mm",
        },
        "loading": {
            "pressure": f"{draw(st.floats(0, 60)):.3g} bar",
            "temperature": f"{draw(st.sampled_from([-60, -20, 20, 120, 200])):g} degC",
        },
        "tightening": {
            "thread_friction": "0.10..0.14",
            "passes": passes,
            "pattern": [draw(st.sampled_from(["cross", "circular"])) for _ in passes],
        },
    }


def _finite(x: Any) -> bool:
    if isinstance(x, float):
        return math.isfinite(x)
    if isinstance(x, dict):
        return all(_finite(v) for v in x.values())
    if isinstance(x, list):
        return all(_finite(v) for v in x)
    return True


def _run(cmd: str, doc: dict[str, Any], extra: list[str], tmp_path_factory):
    text = to_toml(doc)
    path = tmp_path_factory.mktemp("deep") / "input.toml"
    path.write_text(text, encoding="utf-8")
    res = run_command(cmd, path, extra)
    assert_clean(res, text)
    if res.exit_code == 2:
        assert KEYED.match(res.stderr), (res.stderr, text)
        return None
    out = json.loads(res.stdout)
    assert _finite(out), text
    return out


@DEEP
@given(doc=joints())
def test_generated_joints_check(doc, tmp_path_factory):
    out = _run("check", doc, ["--json"], tmp_path_factory)
    if out is None:
        return
    p = out["preload"]
    assert 0 <= p["assembly_min_N"] <= p["assembly_max_N"]
    assert out["bolt"]["stiffness_N_per_mm"] > 0 and out["clamped"]["stiffness_N_per_mm"] > 0
    assert 0 <= out["load_factor"] < 1
    assert out["ok"] == all(c["pass"] for c in out["checks"])


@DEEP
@given(doc=joints())
def test_generated_joints_scatter(doc, tmp_path_factory):
    out = _run("scatter", doc, ["--samples", "300", "--json"], tmp_path_factory)
    if out is None:
        return
    for pr in out["probabilities"].values():
        assert 0 <= pr["low"] <= pr["estimate"] <= pr["high"] <= 1


@DEEP
@given(doc=flanges())
def test_generated_flanges(doc, tmp_path_factory):
    out = _run("flange", doc, ["--json"], tmp_path_factory)
    if out is None:
        return
    n = doc["flange"]["bolt_count"]
    assert len(out["passes"]) == len(doc["tightening"]["passes"])
    assert all(len(p) == n and min(p) >= -1e-6 for p in out["passes"])
    for c in out["checks"]:
        if "governing_bolt" in c:
            assert 1 <= c["governing_bolt"] <= n


UNIT_TOKENS = st.sampled_from(
    [
        "m",
        "mm",
        "kN",
        "N",
        "degC",
        "K",
        "rad",
        "deg",
        "in",
        "lbf",
        "ft",
        "*",
        "/",
        "**",
        "^",
        "9",
        "2",
        "-3",
        "(",
        ")",
        " ",
        "±",
        "1e9",
        ".",
        "%",
        "delta_degC",
        "Pa",
        "bar",
    ]
)


@settings(max_examples=max(4 * N, 60), deadline=None, derandomize=True)
@given(
    tokens=st.lists(UNIT_TOKENS, min_size=1, max_size=10),
    kind=st.sampled_from(["length", "force", "torque", "temperature", "dimensionless", "area"]),
)
def test_unit_expressions_answer_quickly(tokens, kind):
    text = "4 " + "".join(tokens)
    t0 = time.perf_counter()
    with time_limit(5):
        try:
            value = parse_quantity(text, kind, "k")
        except InputError as err:
            assert err.key == "k" and "\n" not in str(err)
        else:
            assert math.isfinite(value)
    assert time.perf_counter() - t0 < 1.0, text


def test_the_deep_settings_scale_with_the_environment():
    assert N >= 8
    pytest.importorskip("hypothesis")
