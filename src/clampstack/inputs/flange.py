"""The flange input file (``clampstack flange``): schema and reader."""

from __future__ import annotations

import math
from typing import Any

from ..catalog import gasket as catalog_gasket
from ..catalog import material as catalog_material
from ..catalog.parts import bearing_face_diameter
from ..errors import InputError
from ..flange.model import (
    FlangeSpec,
    GasketSpec,
    bolt_allowable_stress,
    check_fit,
    ring_outer_diameter,
)
from ..joint.geometry import clearance_hole
from ..joint.model import ROOM, PartMaterial
from ..units import parse_quantity
from .files import InputDocument, load_toml, require_kind
from .joint import NUT as JOINT_NUT
from .joint import TIGHTENING as JOINT_TIGHTENING
from .schema import Key, Schema, read_table
from .tables import Defaults, empty, given_keys, thread_and_grade, tightening

FLANGE = Schema(
    "flange",
    "The flange ring(s).",
    (
        Key("bolt_count", "integer", "number of bolts, equally spaced", required=True),
        Key("bolt_circle", "length", "bolt circle diameter", required=True, positive=True),
        Key("thickness", "length", "thickness of each flange ring", required=True, positive=True),
        Key("material", "text", "catalog material of the flange", default="steel"),
        Key(
            "inner_diameter",
            "length",
            "bore of the flange ring",
            default="gasket inner diameter",
            positive=True,
        ),
        Key(
            "outer_diameter",
            "length",
            "outer diameter of the flange ring",
            default="bolt circle + 2.5 x hole",
            positive=True,
        ),
        Key(
            "mating",
            "text",
            "identical flange pair or a rigid mating face",
            default="flange",
            choices=("flange", "rigid"),
        ),
        Key(
            "rotation",
            "bool",
            "the flange rings rotate under the bolt, gasket and pressure loads (ring "
            "theory); false: the axial model alone",
            default="true",
        ),
    ),
)

BOLT = Schema(
    "bolt",
    "The bolts (studs with two nuts on a flange pair).",
    (
        Key("thread", "text", 'thread, e.g. "M16", "5/8-11 UNC"', required=True),
        Key("grade", "text", 'grade, e.g. "8.8", "ASTM A193 B7"', required=True),
        Key("material", "text", "catalog material of the bolt", default="the grade's steel"),
        Key(
            "modulus", "stress", "Young's modulus of the bolt (overrides; constant)", positive=True
        ),
        Key("expansion", "expansion", "thermal expansion of the bolt (overrides; constant)"),
        Key(
            "length",
            "length",
            "bolt or stud length (checked to reach through nuts and flanges)",
            positive=True,
        ),
        Key(
            "head",
            "text",
            "bolt form",
            default="stud (flange pair), hex (rigid face)",
            choices=("hex", "socket", "stud"),
        ),
        Key(
            "shank_length",
            "length",
            "plain shank inside the clamp length",
            default="0",
            minimum=0.0,
        ),
        Key("shank_diameter", "length", "diameter of a reduced shank", positive=True),
        Key(
            "temperature",
            "temperature",
            "bolt temperature in operation",
            default="loading.bolt_temperature",
        ),
        Key(
            "rolled",
            "text",
            "thread rolled before or after heat treatment",
            default="before",
            choices=("before", "after"),
        ),
        Key("hole", "length", "bolt hole in the flange", default="ISO 273 medium", positive=True),
        Key(
            "bearing_diameter",
            "length",
            "bearing face of the nut",
            default="d_w,min of the nut",
            positive=True,
        ),
        Key(
            "allowable_stress",
            "stress",
            "allowable bolt stress S_b at design temperature",
            default="ASME II-D Table 3 for B7, else min(R_m/5, R_p0.2/4)",
            positive=True,
        ),
        Key(
            "allowable_stress_ambient",
            "stress",
            "allowable bolt stress S_a at ambient",
            default="as allowable_stress",
            positive=True,
        ),
    ),
)

NUT = JOINT_NUT  # the nuts of a flange take the keys of a joint's [nut]

GASKET = Schema(
    "gasket",
    "The ring gasket.",
    (
        Key("type", "text", "catalog gasket type (`clampstack catalog gaskets`)"),
        Key("inner_diameter", "length", "gasket inner diameter", required=True, positive=True),
        Key(
            "outer_diameter",
            "length",
            "gasket outer diameter (contact face)",
            required=True,
            positive=True,
        ),
        Key("thickness", "length", "gasket thickness", required=True, positive=True),
        Key("m", "number", "maintenance factor m (overrides the type)", minimum=0.0),
        Key("y", "stress", "seating stress y (overrides the type)", minimum=0.0),
        Key("max_stress", "stress", "largest allowed gasket stress (crush)", positive=True),
        Key("unload_modulus", "stress", "unloading modulus of the gasket", positive=True),
        Key("curve", "pairs", 'loading curve [[strain, "stress"], ...], e.g. [[0.1, "30 MPa"]]'),
        Key(
            "expansion",
            "expansion",
            "thermal expansion through the thickness (overrides the type)",
        ),
        Key(
            "relaxation",
            "number",
            "creep relaxation factor P_QR when hot, residual / initial gasket stress "
            "(EN 13555; overrides the type's table)",
            positive=True,
        ),
    ),
)

LOADING = Schema(
    "loading",
    "Loads and temperatures in operation.",
    (
        Key("pressure", "stress", "internal design pressure", default="0", minimum=0.0),
        Key("axial_force", "force", "external axial force on the joint (tension +)", default="0"),
        Key("bending_moment", "moment", "external bending moment", default="0", minimum=0.0),
        Key(
            "temperature",
            "temperature",
            "flange (and gasket) temperature in operation",
            default="assembly temperature",
        ),
        Key(
            "bolt_temperature",
            "temperature",
            "bolt temperature in operation",
            default="flange temperature",
        ),
        Key("assembly_temperature", "temperature", "temperature at assembly", default="20 degC"),
        Key("flange_temperature", "temperature", "flange temperature (same as temperature)"),
        Key(
            "gasket_temperature",
            "temperature",
            "gasket temperature in operation (expansion and creep relaxation; the gasket "
            "curve itself has no temperature data)",
            default="flange temperature",
        ),
    ),
)

TIGHTENING = Schema(
    "tightening",
    "Tightening (the keys of a joint's [tightening]) and the pass sequence.",
    (
        *JOINT_TIGHTENING.keys,
        Key(
            "passes", "raw", "pass targets in % of the final preload", default="[30, 70, 100, 100]"
        ),
        Key(
            "pattern",
            "raw",
            'pattern of every pass ("cross", "circular", "custom") or one per pass',
            default="cross, last pass circular",
        ),
        Key("order", "raw", "custom bolt order (1-based), with pattern custom"),
        Key("sequence", "raw", "the same as pattern (a name) or order (a list of bolt numbers)"),
        Key(
            "tensioning",
            "text",
            'method tension: "all" (a tensioner on every bolt at once), "half" (every other '
            'bolt, then the rest, then a check pass) or "sequence" (one tool, bolt by bolt, '
            "in the passes and pattern)",
            default='"all"',
            choices=("all", "half", "sequence"),
        ),
    ),
)

FLANGE_FILE = Schema(
    "flange file",
    "A gasketed flange for `clampstack flange`.",
    (
        Key("title", "text", "title", default='"untitled flange"'),
        Key("flange", "table", "the flange", required=True, schema=FLANGE),
        Key("bolt", "table", "the bolts", required=True, schema=BOLT),
        Key("nut", "table", "the nuts", schema=NUT),
        Key("gasket", "table", "the gasket", required=True, schema=GASKET),
        Key("loading", "table", "loads in operation", schema=LOADING),
        Key("tightening", "table", "tightening and passes", schema=TIGHTENING),
        Key(
            "distributions",
            "raw",
            "what `clampstack scatter` varies: thread_friction, head_friction, nut_factor, "
            "torque or torque_factor (each bolt, each pass), preload (each bolt), "
            'gasket_relaxation (each flange); "low..high" or {normal = [mean, std]}, ...',
        ),
    ),
)


def read_flange_file(path: str, command: str = "flange") -> tuple[InputDocument, FlangeSpec]:
    """Load and validate a flange file (InputError names the file and the key)."""
    doc = load_toml(path)
    require_kind(doc, "flange", command)
    try:
        return doc, flange_from_data(doc.data)
    except InputError as err:
        raise err.with_source(doc.path) from None


def _mat(key: str, where: str) -> PartMaterial:
    try:
        m = catalog_material(key)
    except InputError as err:
        raise InputError(err.detail, key=where) from None
    return PartMaterial(m.key, m)


def _nut_material(nut_raw: dict[str, Any]) -> PartMaterial | None:
    """The nut's material when the file gives one (modulus and expansion, or a catalog key)."""
    if nut_raw.get("modulus") is not None:
        if nut_raw.get("expansion") is None:
            raise InputError("give the nut's modulus and expansion together", key="nut.expansion")
        return PartMaterial("user nut", None, nut_raw["modulus"], nut_raw["expansion"])
    if nut_raw.get("material") is not None:
        return _mat(nut_raw["material"], "nut.material")
    return None


def flange_from_data(data: dict[str, Any]) -> FlangeSpec:
    """Validate a flange file's TOML data, resolve every default and check that the parts fit.

    One reader per table: ``[flange]`` (bolt count, ring), ``[bolt]`` and ``[nut]``
    (thread, grade, holes, nuts, allowable stresses), ``[gasket]``, ``[loading]``,
    ``[tightening]`` (shared with joint files) and its pass sequence.
    """
    raw = read_table(FLANGE_FILE, data)
    rec = Defaults()
    f, b = raw["flange"], raw["bolt"]
    n = bolt_count(f)
    thr, grd = thread_and_grade(b)
    hole = b["hole"]
    if hole is None:
        hole, note = clearance_hole(thr, "bolt")
        rec.note("bolt.hole", note)
    gasket = gasket_table(raw["gasket"], rec)
    ring = ring_table(f, gasket, hole, rec)
    bolts = bolt_table(b, raw["nut"] or {}, thr, grd, hole, ring["mating"], rec)
    tr = raw["tightening"] or empty(TIGHTENING)
    DKm = 0.5 * (bolts["bearing_diameter"] + hole)  # the turned nut (ISO 16047)
    tight = tightening(tr, thr, grd, rec, DKm)
    if tight.method == "angle":
        raise InputError(
            "angle-controlled tightening is modelled for single-bolt joints (clampstack "
            "check); for a flange use method torque, yield or tension",
            key="tightening.method",
        )
    tensioning = tensioning_mode(tr, tight.method, n, rec)
    passes, patterns, order = pass_sequence(tr, n, rec)
    spec = FlangeSpec(
        title=raw["title"] or "untitled flange",
        bolt_count=n,
        bolt_circle=f["bolt_circle"],
        thickness=f["thickness"],
        **ring,
        thread=thr,
        grade=grd,
        **bolts,
        gasket=gasket,
        **loading(raw["loading"] or empty(LOADING), b),
        method=tight.method,
        torque=tight.torque,
        preload=tight.preload,
        thread_friction=tight.thread_friction,
        head_friction=tight.head_friction,
        scatter=tight.scatter,
        utilization=tight.utilization,
        torque_tolerance=tight.torque_tolerance,
        lubricant=tight.lubricant,
        tool=tight.tool,
        nut_factor=tight.nut_factor,
        tensioning=tensioning,
        load_transfer_factor=tight.load_transfer_factor,
        rotation=f["rotation"] if f.get("rotation") is not None else True,
        distributions=_distributions(raw.get("distributions"), tight.method),
        passes=passes,
        patterns=patterns,
        order=order,
        defaults=rec.as_tuple(),
        given=given_keys(raw),
    )
    check_fit(spec)
    return spec


def _distributions(raw: Any, method: str) -> dict[str, Any]:
    """``[distributions]`` of a flange file (what ``clampstack scatter`` varies)."""
    from .distributions import FLANGE_DIST_KEYS, parse_distributions

    out = parse_distributions(raw, FLANGE_DIST_KEYS)
    rel = out.get("gasket_relaxation")
    if rel is not None:
        # a relaxation factor is residual over initial gasket stress: at most 1
        from ..joint.model import MAX_TRUNCATED

        above = 1.0 - rel.share_below(1.0) if rel.kind != "lognormal" else float("nan")
        if (rel.kind == "uniform" and rel.b > 1.0) or not above <= MAX_TRUNCATED:
            raise InputError(
                "the relaxation factor is residual / initial gasket stress, at most 1: give "
                "a range or distribution that stays at or below 1",
                key="distributions.gasket_relaxation",
            )
    torque_keys = ("torque", "torque_factor", "thread_friction", "head_friction", "nut_factor")
    for k in out:
        if method != "torque" and k in torque_keys:
            raise InputError(f"{k} applies to method torque", key=f"distributions.{k}")
        if method == "torque" and k == "preload":
            raise InputError(
                "with method torque the preload follows from torque and friction; vary "
                "those instead",
                key="distributions.preload",
            )
    return out


def tensioning_mode(tr: dict[str, Any], method: str, n: int, rec: Defaults) -> str | None:
    """How the tensioners are applied (method tension): "all", "half" or "sequence".

    With "all" and "half" the bolts of a pass are tensioned together, so the torque passes
    (``passes``, ``pattern``, ``order``, ``sequence``) do not apply and are refused.
    """
    mode = tr.get("tensioning")
    if method != "tension":
        if mode is not None:
            raise InputError(
                'tensioning applies to method = "tension" only', key="tightening.tensioning"
            )
        return None
    mode = rec.pick("tightening.tensioning", mode, "all", '"all" (a tensioner on every bolt)')
    if mode in ("all", "half"):
        for k in ("passes", "pattern", "order", "sequence"):
            if tr.get(k) is not None:
                raise InputError(
                    f'with tensioning = "{mode}" the bolts of a pass are tensioned together; '
                    f'{k} applies to torque passes or to tensioning = "sequence"',
                    key=f"tightening.{k}",
                )
    if mode == "half" and n < 4:
        raise InputError(
            'tensioning = "half" needs at least 4 bolts (two sets of every other bolt)',
            key="tightening.tensioning",
        )
    return mode


def ring_table(f: dict[str, Any], gasket: GasketSpec, hole: float, rec: Defaults) -> dict[str, Any]:
    """``[flange]`` ring: material (steel), inner diameter (the gasket's), outer diameter, mating."""
    fmat = _mat(f["material"] or "steel", "flange.material")
    if f["material"] is None:
        rec.note("flange.material", "steel")
    ring_out = f["outer_diameter"] or ring_outer_diameter(f["bolt_circle"], hole)
    if f["outer_diameter"] is None:
        rec.note("flange.outer_diameter", f"{ring_out * 1e3:.4g} mm")
    return {
        "ring_inner_diameter": f["inner_diameter"] or gasket.inner_diameter,
        "ring_outer_diameter": ring_out,
        "material": fmat,
        "mating": f["mating"] or "flange",
    }


def bolt_table(
    b: dict[str, Any],
    nut_raw: dict[str, Any],
    thr: Any,
    grd: Any,
    hole: float,
    mating: str,
    rec: Defaults,
) -> dict[str, Any]:
    """``[bolt]`` and ``[nut]``: material, nut bearing face and height, head, shank, S_b and S_a."""
    if b["bearing_diameter"] is not None and nut_raw.get("bearing_diameter") is not None:
        if b["bearing_diameter"] <= hole:
            raise InputError(
                "bearing diameter must exceed the bolt hole", key="bolt.bearing_diameter"
            )
    Sb = b["allowable_stress"]
    if Sb is None:
        Sb, note = bolt_allowable_stress(grd, thr)
        rec.note("bolt.allowable_stress", note)
    return {
        "bolt_material": bolt_material(b, grd),
        "nut_height": nut_raw.get("height") or thr.nut_height,
        "nut_material": _nut_material(nut_raw),
        "unused": tuple(
            f"nut.{k}"
            for k in ("strength", "limiting_pressure", "temperature")
            if nut_raw.get(k) is not None
        )
        + (("bolt.rolled",) if b["rolled"] is not None else ()),
        "head": b["head"] or ("stud" if mating == "flange" else "hex"),
        "shank_length": b["shank_length"] or 0.0,
        "shank_diameter": b["shank_diameter"],
        "bearing_diameter": nut_raw.get("bearing_diameter")
        or b["bearing_diameter"]
        or bearing_face_diameter(thr.head_across_flats),
        "hole": hole,
        "allowable_stress": Sb,
        "allowable_stress_ambient": b["allowable_stress_ambient"] or Sb,
        "bolt_length": b["length"],
    }


def bolt_count(f: dict[str, Any]) -> int:
    """``[flange] bolt_count``: 3 to 1000 bolts."""
    n = f["bolt_count"]
    if n < 3:
        raise InputError(f"a flange needs at least 3 bolts, got {n}", key="flange.bolt_count")
    if n > 1000:
        raise InputError(
            f"{n} bolts is more than this tool models (at most 1000)", key="flange.bolt_count"
        )
    return n


def bolt_material(b: dict[str, Any], grd: Any) -> PartMaterial:
    """The bolt's catalog material (the grade's steel by default), or a constant modulus and expansion."""
    bmat = _mat(b["material"] or grd.material_key, "bolt.material")
    if b["modulus"] is not None or b["expansion"] is not None:
        if b["modulus"] is None or b["expansion"] is None:
            raise InputError("give the bolt's modulus and expansion together", key="bolt.modulus")
        bmat = PartMaterial("user bolt", bmat.material, b["modulus"], b["expansion"])
    return bmat


def gasket_curve(points: list[Any]) -> tuple[tuple[float, ...], tuple[float, ...]]:
    """``[gasket] curve``: loading curve points (strain, stress), from the origin, rising."""
    strains, stresses = [0.0], [0.0]
    for k, pt in enumerate(points):
        key = f"gasket.curve[{k + 1}]"
        e = parse_quantity(pt[0], "dimensionless", key)
        st = parse_quantity(pt[1], "stress", key)
        if e == 0.0 and st == 0.0 and k == 0:
            continue  # the origin, given explicitly
        if not (0 < e < 1):
            raise InputError("strain must lie between 0 and 1", key=key)
        strains.append(e)
        stresses.append(st)
    if (
        len(strains) < 2
        or any(b2 <= a2 for a2, b2 in zip(strains, strains[1:], strict=False))
        or any(b2 < a2 for a2, b2 in zip(stresses, stresses[1:], strict=False))
    ):
        raise InputError(
            "curve points must rise in strain and must not fall in stress", key="gasket.curve"
        )
    return tuple(strains), tuple(stresses)


def _nearest_type(m: float, y: float) -> Any:
    """The catalog gasket type nearest in (m, y): its loading behaviour stands in."""
    from ..catalog import gaskets as catalog_gaskets

    return min(
        catalog_gaskets(),
        key=lambda t: (
            abs(math.log((t.m + 0.1) / (m + 0.1))) + abs(math.log((t.y + 1e5) / (y + 1e5)))
        ),
    )


def gasket_table(g: dict[str, Any], rec: Defaults) -> GasketSpec:
    """``[gasket]``: a catalog type, or m and y (ASME VIII-1 App. 2) and optionally a curve."""
    gi, go, gt = g["inner_diameter"], g["outer_diameter"], g["thickness"]
    if gi >= go:
        raise InputError(
            "gasket inner diameter must be below its outer diameter", key="gasket.inner_diameter"
        )
    cat = None
    if g["type"] is not None:
        try:
            cat = catalog_gasket(g["type"])
        except InputError as err:
            raise InputError(err.detail, key="gasket.type") from None
    m = g["m"] if g["m"] is not None else (cat.m if cat else None)
    y = g["y"] if g["y"] is not None else (cat.y if cat else None)
    if m is None or y is None:
        raise InputError(
            "give the gasket type, or its factors m and y (ASME VIII-1 App. 2; "
            "they set the seating and operating loads)",
            key="gasket.m",
        )
    curve = gasket_curve(g["curve"]) if g["curve"] is not None else None
    like = cat
    if cat is None and curve is None:
        like = _nearest_type(m, y)
        rec.note("gasket.curve", f"typical curve of catalog type {like.key!r} (nearest m and y)")
    if curve is None:
        assert like is not None
        curve = (like.curve_strain, like.curve_stress)
    max_stress = g["max_stress"] or (like.max_stress if like else None)
    if max_stress is None:
        max_stress = curve[1][-1]
        rec.note("gasket.max_stress", f"{max_stress / 1e6:.4g} MPa (top of the curve)")
    unload = g["unload_modulus"] or (like.unload_modulus if like else None)
    if unload is None:
        unload = (curve[1][-1] - curve[1][-2]) / (curve[0][-1] - curve[0][-2])
        rec.note("gasket.unload_modulus", f"{unload / 1e6:.4g} MPa (last slope of the curve)")
    if not unload > 0:
        raise InputError("the unloading modulus must be positive", key="gasket.unload_modulus")
    return GasketSpec(
        name=cat.key if cat else "user gasket",
        inner_diameter=gi,
        outer_diameter=go,
        thickness=gt,
        m=m,
        y=y,
        max_stress=max_stress,
        unload_modulus=unload,
        curve_strain=curve[0],
        curve_stress=curve[1],
        source=cat.source if cat else ("user m, y; curve of " + like.key if like else "user data"),
        **_service_data(g, like or _nearest_type(m, y), rec),
    )


def _service_data(g: dict[str, Any], like: Any, rec: Defaults) -> dict[str, Any]:
    """The gasket's expansion and creep relaxation: given, or the (nearest) type's."""
    relax = g.get("relaxation")
    if relax is not None and not relax <= 1.0:
        raise InputError(
            f"a relaxation factor is residual / initial gasket stress, at most 1, got {relax:g}",
            key="gasket.relaxation",
        )
    src = like.service_source if like is not None else ""
    out: dict[str, Any] = {"relaxation_given": relax, "service_source": src}
    if g.get("expansion") is not None:
        out["expansion"] = g["expansion"]
    elif like is not None:
        out["expansion"] = like.expansion
    if like is not None:
        out["relax_temperature"] = like.relax_temperature
        out["relax_factor"] = like.relax_factor
        if g.get("type") is None:
            rec.note(
                "gasket.relaxation",
                f"expansion and creep relaxation of catalog type {like.key!r} (nearest m and y)",
            )
    return out


def loading(ld: dict[str, Any], b: dict[str, Any]) -> dict[str, float]:
    """``[loading]``: pressure, external force and moment, assembly/flange/bolt temperatures."""
    T_asm = ld["assembly_temperature"] if ld["assembly_temperature"] is not None else ROOM
    if ld.get("flange_temperature") is not None:
        if ld["temperature"] is not None and ld["temperature"] != ld["flange_temperature"]:
            raise InputError(
                "give temperature or flange_temperature, not both", key="loading.flange_temperature"
            )
        ld = dict(ld, temperature=ld["flange_temperature"])
    T_fl = ld["temperature"] if ld["temperature"] is not None else T_asm
    T_b = ld["bolt_temperature"] if ld["bolt_temperature"] is not None else T_fl
    if b["temperature"] is not None:
        T_b = b["temperature"]
    return {
        "pressure": ld["pressure"] or 0.0,
        "axial_force": ld["axial_force"] or 0.0,
        "bending_moment": ld["bending_moment"] or 0.0,
        "T_assembly": T_asm,
        "T_flange": T_fl,
        "T_bolt": T_b,
        "T_gasket": ld.get("gasket_temperature"),
    }


def _percentages(passes: Any, rec: Defaults) -> list[Any]:
    """Pass targets as percentages: "30 %" strings and fractions (0.3) converted."""
    if not isinstance(passes, list):
        return passes
    conv = []
    for k, p in enumerate(passes):
        if isinstance(p, str):  # "30 %"
            p = parse_quantity(p, "dimensionless", f"tightening.passes[{k + 1}]") * 100
        conv.append(p)
    if (
        conv
        and all(
            isinstance(p, int | float) and not isinstance(p, bool) and 0 < p <= 1.0 for p in conv
        )
        and max(conv) <= 1.0
        and any(p < 1.0 for p in conv)
    ):
        rec.note("tightening.passes", "read as fractions of the target")
        return [100 * p for p in conv]  # given as fractions: 0.3 means 30 %
    return conv


def pass_sequence(
    tr: dict[str, Any], n: int, rec: Defaults
) -> tuple[tuple[float, ...], tuple[str, ...], tuple[int, ...] | None]:
    """Passes (fractions of the target), a pattern per pass and a custom bolt order (0-based).

    Default: 30, 70, 100, 100 % (ASME PCC-1 legacy practice, from memory), cross
    pattern with the last pass circular.
    """
    passes = _percentages(tr["passes"] if tr["passes"] is not None else [30, 70, 100, 100], rec)
    seq = tr.get("sequence")
    if seq is not None:
        if isinstance(seq, str) and tr["pattern"] is None:
            tr = dict(tr, pattern=seq)
        elif isinstance(seq, list) and tr["order"] is None:
            tr = dict(tr, order=seq)
        else:
            raise InputError(
                "give sequence, or pattern and order, not both", key="tightening.sequence"
            )
    if (
        not isinstance(passes, list)
        or not passes
        or len(passes) > 20
        or not all(isinstance(p, int | float) and not isinstance(p, bool) for p in passes)
        or not all(0 < p <= 110 for p in passes)
    ):
        raise InputError(
            "expected a list of 1 to 20 percentages between 0 and 110", key="tightening.passes"
        )
    pat = tr["pattern"]
    if pat is None:
        pats = ["cross"] * len(passes)
        if len(passes) >= 3:
            pats[-1] = "circular"
    elif isinstance(pat, str):
        pats = [pat] * len(passes)
    elif isinstance(pat, list) and len(pat) == len(passes):
        pats = list(pat)
    else:
        raise InputError("expected one pattern, or one per pass", key="tightening.pattern")
    for p in pats:
        if p not in ("cross", "circular", "custom"):
            raise InputError(
                f"unknown pattern {p!r} (cross, circular or custom)", key="tightening.pattern"
            )
    order = None
    if "custom" in pats or tr["order"] is not None:
        o = tr["order"]
        if (
            not isinstance(o, list)
            or sorted(o) != list(range(1, n + 1))
            or not all(isinstance(v, int) for v in o)
        ):
            raise InputError(
                f"expected every bolt number 1..{n} exactly once", key="tightening.order"
            )
        order = tuple(v - 1 for v in o)
        if tr["pattern"] is None:
            pats = ["custom"] * len(passes)
    return tuple(p / 100.0 for p in passes), tuple(pats), order
