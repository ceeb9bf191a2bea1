"""The joint input file (``check``, ``sweep``, ``scatter``, ``size``, ``report``).

Schema per ../shared/DESIGN.md, and the reader that resolves every default
(recorded so that it is printed) and returns a :class:`~clampstack.joint.model.JointSpec`.
"""

from __future__ import annotations

from typing import Any

from ..catalog import grade as catalog_grade
from ..catalog import material as catalog_material
from ..catalog import thread as catalog_thread
from ..components import default_shank_length
from ..errors import InputError
from ..joint.checks import CHECK_NAMES
from ..joint.model import (
    ROOM,
    BoltSpec,
    JointSpec,
    LayerSpec,
    NutSpec,
    PartMaterial,
    RequirementSpec,
    ServiceSpec,
    TappedHoleSpec,
    TighteningSpec,
)
from .files import InputDocument, load_toml
from .schema import Key, Schema, read_table

_MATERIAL_KEYS = (
    Key("material", "text", "catalog material key (`clampstack catalog materials`)"),
    Key("modulus", "stress", "Young's modulus (overrides the material's; constant)", positive=True),
    Key("expansion", "expansion", "mean thermal expansion coefficient (overrides; constant)"),
)

BOLT = Schema(
    "bolt",
    "The bolt, screw or stud.",
    (
        Key(
            "thread", "text", 'thread: "M10", "M10x1.25", "1/2-13 UNC", "1/2-20 UNF"', required=True
        ),
        Key(
            "grade",
            "text",
            'property class or grade: "8.8", "10.9", "A4-80", "SAE J429 5", "ASTM A193 B7"',
            required=True,
        ),
        Key(
            "length",
            "length",
            "nominal length under the head (stud: overall length)",
            required=True,
            positive=True,
        ),
        Key(
            "shank_length",
            "length",
            "plain shank inside the clamp length",
            default="standard thread length (ISO 4014)",
            minimum=0.0,
        ),
        Key("shank_diameter", "length", "diameter of a reduced (waisted) shank", positive=True),
        Key("head", "text", "head form", default="hex", choices=("hex", "socket", "stud")),
        Key(
            "bearing_diameter",
            "length",
            "outer bearing diameter d_W under the head",
            default="standard head (s or d_k)",
            positive=True,
        ),
        *_MATERIAL_KEYS,
        Key(
            "temperature",
            "temperature",
            "service temperature of the bolt",
            default="service temperature",
        ),
        Key(
            "rolled",
            "text",
            "thread rolled before or after heat treatment (fatigue)",
            default="before",
            choices=("before", "after"),
        ),
    ),
)

NUT = Schema(
    "nut",
    "A nut (through-bolted joint).",
    (
        Key("height", "length", "nut height m", default="ISO 4032 style 1", positive=True),
        Key(
            "bearing_diameter",
            "length",
            "outer bearing diameter under the nut",
            default="bearing face d_w,min of the nut (ISO 4032)",
            positive=True,
        ),
        *_MATERIAL_KEYS,
        Key(
            "strength",
            "stress",
            "tensile strength of the nut material",
            default="matched to the bolt (ISO 898-2)",
            positive=True,
        ),
        Key("limiting_pressure", "stress", "limiting surface pressure of the part under the nut"),
        Key(
            "temperature",
            "temperature",
            "service temperature of the nut",
            default="the bolt's temperature",
        ),
    ),
)

TAPPED = Schema(
    "tapped_hole",
    "A tapped hole (tapped thread joint) instead of a nut.",
    (
        *_MATERIAL_KEYS,
        Key(
            "engagement",
            "length",
            "length of thread engagement",
            default="bolt length minus clamp length",
            positive=True,
        ),
        Key(
            "strength",
            "stress",
            "tensile strength of the tapped material",
            default="from the catalog material",
            positive=True,
        ),
        Key(
            "temperature",
            "temperature",
            "service temperature of the tapped part",
            default="service temperature",
        ),
    ),
)

WASHER = Schema(
    "washer",
    "A washer under the head or the nut.",
    (
        Key("side", "text", "where it sits", default="head", choices=("head", "nut")),
        Key("thickness", "length", "thickness", default="ISO 7089 for the thread", positive=True),
        Key(
            "outer_diameter",
            "length",
            "outer diameter",
            default="ISO 7089 for the thread",
            positive=True,
        ),
        Key("inner_diameter", "length", "inner diameter", default="the hole", positive=True),
        *_MATERIAL_KEYS,
        Key("temperature", "temperature", "service temperature", default="service temperature"),
        Key(
            "limiting_pressure", "stress", "limiting surface pressure", default="from the material"
        ),
    ),
)

CLAMPED = Schema(
    "clamped",
    "A clamped part (head side first).",
    (
        Key("name", "text", "name used in the output", default="part N"),
        *_MATERIAL_KEYS,
        Key(
            "thickness", "length", "thickness (length along the bolt)", required=True, positive=True
        ),
        Key(
            "hole", "length", "hole diameter d_h", default="ISO 273 medium clearance", positive=True
        ),
        Key(
            "outer_diameter",
            "length",
            "outer diameter D'_A of the clamped part",
            default="wide enough for a full cone",
            positive=True,
        ),
        Key(
            "kind",
            "text",
            "plate (pressure cone) or sleeve (E A / L)",
            default="plate",
            choices=("plate", "sleeve"),
        ),
        Key(
            "temperature",
            "temperature",
            "service temperature of the part",
            default="service temperature",
        ),
        Key(
            "limiting_pressure",
            "stress",
            "limiting surface pressure p_G",
            default="from the material",
        ),
    ),
)

EMBEDDING = Schema(
    "embedding",
    "Embedding (settling) of the contact faces.",
    (
        Key(
            "roughness",
            "length",
            "mean roughness depth R_z of the faces",
            default="6.3 um",
            minimum=0.0,
        ),
        Key(
            "amount",
            "length",
            "embedding amount f_Z given directly (overrides the table)",
            minimum=0.0,
        ),
    ),
)

TIGHTENING = Schema(
    "tightening",
    "How the joint is tightened.",
    (
        Key(
            "method",
            "text",
            "tightening method",
            default="torque",
            choices=("torque", "angle", "yield", "tension"),
        ),
        Key("torque", "torque", "tightening torque (method torque)", positive=True),
        Key("preload", "force", "target preload (nominal)", positive=True),
        Key(
            "thread_friction",
            "range:dimensionless",
            "thread friction mu_G, value or range",
            default="0.10..0.16",
            minimum=0.0,
        ),
        Key(
            "head_friction",
            "range:dimensionless",
            "head or nut bearing friction mu_K",
            default="as thread_friction",
            minimum=0.0,
        ),
        Key(
            "scatter",
            "number",
            "tightening factor alpha_A = F_M,max / F_M,min",
            default="by method (see theory)",
            minimum=1.0,
        ),
        Key(
            "utilization",
            "number",
            "utilisation nu of the yield point at assembly",
            default="0.9",
            positive=True,
        ),
        Key(
            "torque_tolerance",
            "number",
            "relative tolerance of the applied torque (+-)",
            default="0.06",
            minimum=0.0,
        ),
    ),
)

SERVICE = Schema(
    "service",
    "Loads and temperatures in service.",
    (
        Key(
            "axial_load",
            "range:force",
            "axial working load F_A per bolt: value or min..max",
            default="0 N",
        ),
        Key(
            "shear_load",
            "force",
            "transverse load F_Q per bolt (carried by friction)",
            default="0 N",
            minimum=0.0,
        ),
        Key(
            "load_height",
            "number",
            "load introduction factor n (0 < n <= 1)",
            default="0.5",
            positive=True,
        ),
        Key("temperature", "temperature", "service temperature", default="assembly temperature"),
        Key("assembly_temperature", "temperature", "temperature at assembly", default="20 degC"),
    ),
)

REQUIREMENTS = Schema(
    "requirements",
    "What the joint must achieve.",
    (
        Key(
            "residual_clamp_load",
            "force",
            "minimum residual clamp load (sealing etc.)",
            default="0 N",
            minimum=0.0,
        ),
        Key(
            "slip_friction",
            "number",
            "friction coefficient mu_T of the interfaces (slip)",
            default="0.15",
            positive=True,
        ),
        Key(
            "slip_safety",
            "number",
            "safety against slip S_G",
            default="1.2 static, 1.8 alternating",
            positive=True,
        ),
        Key("fatigue_safety", "number", "safety against fatigue S_D", default="1.2", positive=True),
    ),
)

SKIP = Schema(
    "skip",
    "Switch a check off, with the reason (printed with the results).",
    (
        Key("check", "text", "name of the check", required=True, choices=CHECK_NAMES),
        Key("reason", "text", "why it does not apply", required=True),
    ),
)

JOINT = Schema(
    "joint file",
    "A single-bolt joint for `clampstack check`, `sweep`, `scatter`, `size` and `report`.",
    (
        Key("title", "text", "title printed on the results", default='"untitled joint"'),
        Key(
            "clamp_model",
            "text",
            "stiffness model of the clamped plates",
            default="vdi2230",
            choices=("vdi2230", "shigley", "wileman"),
        ),
        Key("bolt", "table", "the bolt", required=True, schema=BOLT),
        Key("nut", "table", "a nut (through bolt)", schema=NUT),
        Key("tapped_hole", "table", "a tapped hole instead of a nut", schema=TAPPED),
        Key("washer", "tables", "washers", schema=WASHER),
        Key("clamped", "tables", "clamped parts, head side first", required=True, schema=CLAMPED),
        Key("embedding", "table", "embedding", schema=EMBEDDING),
        Key("tightening", "table", "tightening", schema=TIGHTENING),
        Key("service", "table", "service loads and temperatures", schema=SERVICE),
        Key("requirements", "table", "requirements", schema=REQUIREMENTS),
        Key("skip", "tables", "checks switched off, each with a reason", schema=SKIP),
        Key(
            "distributions",
            "raw",
            "scatter study: distributions of torque, friction, "
            "embedding, temperature, axial_load, yield_strength, slip_friction, preload, "
            'torque_factor, e.g. torque = {normal = ["45 N*m", "2 N*m"]}',
        ),
    ),
)


#: Bearing face diameter d_w,min of hexagon heads and nuts by width across flats s [mm]:
#: ISO 4014 / ISO 4032 product grade A (from memory).  Other sizes: 0.93 s (an
#: approximation of the same tables, common practice, no source).
_DW_MIN_MM = {
    5.5: 4.57,
    7.0: 5.88,
    8.0: 6.88,
    10.0: 8.88,
    13.0: 11.63,
    16.0: 14.63,
    18.0: 16.63,
    21.0: 19.37,
    24.0: 22.49,
    27.0: 25.34,
    30.0: 28.19,
    34.0: 31.71,
    36.0: 33.61,
    41.0: 38.0,
    46.0: 42.75,
    50.0: 46.55,
    55.0: 51.11,
}


def bearing_face_diameter(s: float) -> float:
    """Default outer bearing diameter d_w of a hexagon head or nut of width ``s`` [m]."""
    key = round(s * 1e3, 2)
    if key in _DW_MIN_MM:
        return _DW_MIN_MM[key] * 1e-3
    return 0.93 * s


#: ISO 7089 plain washers, normal series: nominal d [mm] -> (thickness h, outer d2) [mm]
#: (from memory).  Other sizes: h = 0.16 d, d2 = 2 d (common practice, no source).
_ISO7089 = {
    3: (0.5, 7),
    4: (0.8, 9),
    5: (1, 10),
    6: (1.6, 12),
    8: (1.6, 16),
    10: (2, 20),
    12: (2.5, 24),
    14: (2.5, 28),
    16: (3, 30),
    20: (3, 37),
    24: (4, 44),
    30: (4, 56),
    36: (5, 66),
    42: (8, 78),
    48: (8, 92),
    56: (10, 105),
    64: (10, 115),
}


def washer_default(d: float) -> tuple[float, float]:
    """Default plain washer (thickness, outer diameter) [m] for a bolt of diameter d [m]."""
    key = round(d * 1e3, 3)
    if key in _ISO7089:
        h, od = _ISO7089[key]  # type: ignore[index]
        return h * 1e-3, od * 1e-3
    return 0.16 * d, 2.0 * d


def read_joint_file(path: str) -> tuple[InputDocument, JointSpec]:
    """Load and validate a joint file (InputError names the file and the key)."""
    doc = load_toml(path)
    try:
        return doc, joint_from_data(doc.data)
    except InputError as err:
        raise err.with_source(doc.path) from None


def _family(key: str) -> str:
    k = key.lower()
    for prefix, fam in (
        ("alumin", "aluminium"),
        ("cast-iron-grey", "grey cast iron"),
        ("brass", "copper"),
        ("bronze", "copper"),
        ("copper", "copper"),
        ("steel", "steel"),
        ("stainless", "steel"),
    ):
        if k.startswith(prefix):
            return fam
    return "general"


def _material(raw: dict[str, Any], key: str, default: str | None, defaults: list) -> PartMaterial:
    name = raw.get("material")
    mat = None
    if name is None and raw.get("modulus") is None:
        if default is None:
            raise InputError(
                "required key is missing (give material, or modulus and expansion)",
                key=f"{key}.material",
            )
        name = default
        defaults.append((f"{key}.material", default))
    if name is not None:
        try:
            mat = catalog_material(name)
        except InputError as err:
            raise InputError(err.detail, key=f"{key}.material") from None
    if mat is None and raw.get("expansion") is None:
        if default is None:
            raise InputError(
                "a part given by modulus needs its expansion too (or a material)",
                key=f"{key}.expansion",
            )
        mat = catalog_material(default)  # the modulus overrides; expansion from the default
        defaults.append((f"{key}.expansion", f"from {default}"))
    label = mat.key if mat is not None else "user modulus"
    return PartMaterial(label, mat, raw.get("modulus"), raw.get("expansion"))


def _check_temperature(pm: PartMaterial, T: float, key: str) -> None:
    """The catalog tables must cover ``T``: no silent extrapolation."""
    if pm.material is None or (pm.modulus is not None and pm.expansion is not None):
        return
    lo, hi = pm.material.valid_range()
    if not lo - 1e-9 <= T <= hi + 1e-9:
        raise InputError(
            f"{T - 273.15:g} degC is outside the data of material {pm.material.key!r} "
            f"({lo - 273.15:g} to {hi - 273.15:g} degC)",
            key=key,
        )


def joint_from_data(data: dict[str, Any]) -> JointSpec:
    """Validate a joint file's TOML data and resolve every default."""
    raw = read_table(JOINT, data)
    defaults: list[tuple[str, str]] = []

    def dflt(key: str, text: str) -> None:
        defaults.append((key, text))

    # --- service temperatures first: parts default to them
    srv = raw["service"] or {k.name: None for k in SERVICE.keys}
    T_asm = srv["assembly_temperature"]
    if T_asm is None:
        T_asm = ROOM
        dflt("service.assembly_temperature", "20 degC")
    T_srv = srv["temperature"]
    if T_srv is None:
        T_srv = T_asm
        dflt("service.temperature", "assembly temperature")

    # --- bolt
    b = raw["bolt"]
    try:
        thr = catalog_thread(b["thread"])
    except InputError as err:
        raise InputError(err.detail, key="bolt.thread") from None
    try:
        grd = catalog_grade(b["grade"], thr.d)
    except InputError as err:
        raise InputError(err.detail, key="bolt.grade") from None
    head = b["head"] or "hex"
    if b["head"] is None:
        dflt("bolt.head", "hex")
    bolt_mat_raw = dict(b)
    bolt_mat = _material(bolt_mat_raw, "bolt", grd.material_key, [])
    if b["material"] is None and b["modulus"] is None:
        # the grade's own steel: its modulus and expansion at 20 degC, temperature tables
        # from the grade's catalog material
        bolt_mat = PartMaterial(f"{grd.material_key} (grade {grd.name})", bolt_mat.material)
        dflt("bolt.material", f"{grd.material_key} (from grade {grd.name})")
    T_bolt = b["temperature"] if b["temperature"] is not None else T_srv

    if b["bearing_diameter"] is not None:
        dW = b["bearing_diameter"]
    elif head == "socket":
        if thr.socket_head_diameter is None:
            raise InputError(
                f"no standard socket head for {thr.designation}; give bearing_diameter",
                key="bolt.bearing_diameter",
            )
        dW = thr.socket_head_diameter
        dflt("bolt.bearing_diameter", f"{dW * 1e3:g} mm (socket head d_k, ISO 4762)")
    else:
        dW = bearing_face_diameter(thr.head_across_flats)
        dflt("bolt.bearing_diameter", f"{dW * 1e3:.4g} mm (bearing face d_w,min of the hex head)")

    # --- nut or tapped hole
    if raw["nut"] is not None and raw["tapped_hole"] is not None:
        raise InputError("give [nut] or [tapped_hole], not both", key="tapped_hole")
    nut = tapped = None
    layers_raw = raw["clamped"]
    if not layers_raw:
        raise InputError("at least one clamped part is needed", key="clamped")

    # --- layers: head-side washers, clamped parts, nut-side washers
    washers = raw["washer"] or []
    hole_default = thr.hole_medium
    first_hole = layers_raw[0]["hole"] or hole_default
    if first_hole is None:
        raise InputError(
            f"no standard clearance hole for {thr.designation}; give hole", key="clamped[1].hole"
        )
    layers: list[LayerSpec] = []

    def layer_from(r: dict[str, Any], key: str, kind: str, name: str) -> LayerSpec:
        mat = _material(r, key, "steel" if kind == "washer" else None, defaults)
        T = r.get("temperature")
        T = T_srv if T is None else T
        if kind == "washer":
            if r["thickness"] is None or r["outer_diameter"] is None:
                h_w, od_w = washer_default(thr.d)
                r = dict(r)
                if r["thickness"] is None:
                    r["thickness"] = h_w
                    defaults.append((f"{key}.thickness", f"{h_w * 1e3:g} mm (ISO 7089)"))
                if r["outer_diameter"] is None:
                    r["outer_diameter"] = od_w
                    defaults.append((f"{key}.outer_diameter", f"{od_w * 1e3:g} mm (ISO 7089)"))
            hole = r["inner_diameter"] or first_hole
            if r["inner_diameter"] is None:
                defaults.append((f"{key}.inner_diameter", f"{hole * 1e3:g} mm (the hole)"))
            if hole < thr.d * 0.999:
                raise InputError(
                    f"inner diameter {hole * 1e3:g} mm is smaller than the bolt ({thr.d * 1e3:g} mm)",
                    key=f"{key}.inner_diameter",
                )
            od = r["outer_diameter"]
            if od <= hole:
                raise InputError(
                    "outer diameter must exceed the inner diameter", key=f"{key}.outer_diameter"
                )
        else:
            hole = r["hole"]
            if hole is None and hole_default is not None:
                defaults.append((f"{key}.hole", f"{hole_default * 1e3:g} mm (ISO 273 medium)"))
            if hole is None:
                if hole_default is None:
                    raise InputError(
                        f"no standard clearance hole for {thr.designation}; give hole",
                        key=f"{key}.hole",
                    )
                hole = hole_default
            od = r["outer_diameter"]
            if od is None and r.get("kind") != "sleeve":
                defaults.append((f"{key}.outer_diameter", "wide enough for a full cone"))
            if od is not None and od <= hole:
                raise InputError("outer diameter must exceed the hole", key=f"{key}.outer_diameter")
            if r["kind"] == "sleeve" and od is None:
                raise InputError("a sleeve needs its outer_diameter", key=f"{key}.outer_diameter")
        if hole <= thr.d * 0.999 and kind != "washer":
            raise InputError(
                f"hole {hole * 1e3:g} mm is smaller than the bolt ({thr.d * 1e3:g} mm)",
                key=f"{key}.hole",
            )
        pG = r.get("limiting_pressure")
        if pG is None and mat.material is not None and mat.material.pG is not None:
            pG = mat.material.pG
        return LayerSpec(
            name,
            kind if kind == "washer" else (r["kind"] or "plate"),
            r["thickness"],
            hole,
            od,
            mat,
            T,
            pG,
            _family(mat.material.key) if mat.material else "general",
        )

    for n, w in enumerate(washers):
        if (w["side"] or "head") == "head":
            layers.append(layer_from(w, f"washer[{n + 1}]", "washer", f"washer {n + 1}"))
    for n, c in enumerate(layers_raw):
        layers.append(layer_from(c, f"clamped[{n + 1}]", "plate", c["name"] or f"part {n + 1}"))
    for n, w in enumerate(washers):
        if w["side"] == "nut":
            if raw["tapped_hole"] is not None:
                raise InputError(
                    "a tapped joint has no nut-side washer", key=f"washer[{n + 1}].side"
                )
            layers.append(layer_from(w, f"washer[{n + 1}]", "washer", f"washer {n + 1}"))
    lK = sum(layer.thickness for layer in layers)

    if raw["tapped_hole"] is not None:
        t = raw["tapped_hole"]
        mat = _material(t, "tapped_hole", None, defaults)
        engagement = t["engagement"]
        available = b["length"] - lK
        if engagement is None:
            engagement = available
            dflt("tapped_hole.engagement", f"{engagement * 1e3:g} mm (bolt length - clamp length)")
        if available <= 0:
            raise InputError(
                f"bolt length {b['length'] * 1e3:g} mm does not reach through the clamp length "
                f"{lK * 1e3:g} mm",
                key="bolt.length",
            )
        if engagement > available * (1 + 1e-9):
            raise InputError(
                f"engagement {engagement * 1e3:g} mm is longer than the bolt reaches "
                f"({available * 1e3:g} mm beyond the clamp length)",
                key="tapped_hole.engagement",
            )
        if engagement < 2 * thr.P:
            raise InputError(
                f"engagement {engagement * 1e3:g} mm is less than two threads",
                key="tapped_hole.engagement",
            )
        Rm = t["strength"]
        if Rm is None:
            if mat.material is None or mat.material.Rm is None:
                raise InputError(
                    "give the strength of the tapped material", key="tapped_hole.strength"
                )
            Rm = mat.material.Rm
        T = t["temperature"] if t["temperature"] is not None else T_srv
        tapped = TappedHoleSpec(
            mat, engagement, Rm, mat.material.shear_ratio if mat.material else 0.6, T
        )
        _check_temperature(mat, T, "tapped_hole.temperature")
        _check_temperature(mat, T_asm, "service.assembly_temperature")
    else:
        nraw = raw["nut"] or {k.name: None for k in NUT.keys}
        if raw["nut"] is None:
            dflt("nut", "ISO 4032 hex nut matched to the bolt")
        if nraw["material"] is None and nraw["modulus"] is None:
            mat = bolt_mat  # a nut of the bolt's steel unless told otherwise
        else:
            mat = _material(nraw, "nut", None, defaults)
        height = nraw["height"] or thr.nut_height
        if nraw["height"] is None:
            dflt("nut.height", f"{height * 1e3:g} mm (ISO 4032)")
        dWn = nraw["bearing_diameter"] or bearing_face_diameter(thr.head_across_flats)
        Rm = nraw["strength"] or grd.Rm
        if head != "stud" and b["length"] < lK + height * (1 - 1e-9):
            raise InputError(
                f"bolt length {b['length'] * 1e3:g} mm is shorter than clamp length plus nut "
                f"({(lK + height) * 1e3:g} mm)",
                key="bolt.length",
            )
        T_nut = nraw["temperature"] if nraw["temperature"] is not None else T_bolt
        _check_temperature(mat, T_nut, "nut.temperature")
        _check_temperature(mat, T_asm, "service.assembly_temperature")
        nut = NutSpec(
            height,
            dWn,
            mat,
            Rm,
            mat.material.shear_ratio if mat.material else 0.6,
            nraw["limiting_pressure"],
            T_nut,
        )

    # --- plain shank
    if b["shank_length"] is not None:
        shank = b["shank_length"]
    elif head == "stud":
        shank = 0.0
        dflt("bolt.shank_length", "0 (stud threaded through the clamp length)")
    else:
        if head == "socket":
            # ISO 4762 reference thread length b = 2 d + 12 mm (from memory)
            shank = max(0.0, b["length"] - (2 * thr.d + 12e-3))
            dflt("bolt.shank_length", f"{shank * 1e3:g} mm (ISO 4762 thread length 2d + 12 mm)")
        else:
            shank = float(default_shank_length(thr.d, b["length"]))
            dflt("bolt.shank_length", f"{shank * 1e3:g} mm (ISO 4014 thread length)")
    if shank > lK * (1 + 1e-9):
        raise InputError(
            f"the plain shank ({shank * 1e3:g} mm) is longer than the clamp length "
            f"({lK * 1e3:g} mm): the thread would not reach the "
            f"{'tapped hole' if tapped else 'nut'}; choose a shorter bolt or give shank_length",
            key="bolt.length" if b["shank_length"] is None else "bolt.shank_length",
        )
    if b["shank_diameter"] is not None and b["shank_diameter"] >= thr.d:
        raise InputError(
            "a reduced shank must be thinner than the thread", key="bolt.shank_diameter"
        )
    if b["shank_diameter"] is not None and shank <= 0:
        raise InputError("a reduced shank needs shank_length", key="bolt.shank_length")

    # bearing faces must be wider than the holes they sit on
    if dW <= layers[0].hole:
        raise InputError(
            f"bearing diameter {dW * 1e3:.4g} mm is not larger than the hole "
            f"{layers[0].hole * 1e3:.4g} mm under the head",
            key="bolt.bearing_diameter",
        )
    if nut is not None and nut.bearing_diameter <= layers[-1].hole:
        raise InputError(
            f"bearing diameter {nut.bearing_diameter * 1e3:.4g} mm is not larger than the hole "
            f"{layers[-1].hole * 1e3:.4g} mm under the nut",
            key="nut.bearing_diameter",
        )

    bolt = BoltSpec(
        thr,
        grd,
        b["length"],
        min(shank, lK),
        b["shank_diameter"],
        head,
        dW,
        bolt_mat,
        T_bolt,
        b["rolled"] or "before",
    )

    # --- embedding
    emb = raw["embedding"] or {"roughness": None, "amount": None}
    rough = emb["roughness"]
    if rough is None:
        rough = 6.3e-6
        if emb["amount"] is None:
            dflt("embedding.roughness", "6.3 um")
    if rough >= 160e-6:
        raise InputError(
            "roughness of 160 um or more is outside the VDI 2230-1 table", key="embedding.roughness"
        )

    # --- tightening
    tr = raw["tightening"] or {k.name: None for k in TIGHTENING.keys}
    method = tr["method"] or "torque"
    if tr["method"] is None:
        dflt("tightening.method", "torque")
    if tr["torque"] is not None and tr["preload"] is not None:
        raise InputError("give torque or preload, not both", key="tightening.preload")
    if method in ("angle", "yield") and (tr["torque"] is not None or tr["preload"] is not None):
        raise InputError(
            f"method {method!r} tightens to the yield point; remove torque and "
            'preload, or use method "torque"',
            key="tightening.method",
        )
    if method == "tension" and tr["torque"] is not None:
        raise InputError(
            "a tensioner sets a preload, not a torque; give preload", key="tightening.torque"
        )
    muG = tr["thread_friction"]
    if muG is None:
        muG = (0.10, 0.16)
        dflt("tightening.thread_friction", "0.10..0.16")
    muK = tr["head_friction"]
    if muK is None:
        muK = muG
        dflt("tightening.head_friction", "as thread friction")
    for name, mu in (("thread_friction", muG), ("head_friction", muK)):
        if mu[1] > 1.0:
            raise InputError(
                f"friction coefficient {mu[1]:g} is not plausible (above 1)",
                key=f"tightening.{name}",
            )
    nu = tr["utilization"] if tr["utilization"] is not None else 0.9
    if tr["utilization"] is None:
        dflt("tightening.utilization", "0.9")
    if nu > 1.0:
        raise InputError("utilization must not exceed 1", key="tightening.utilization")
    tol = tr["torque_tolerance"] if tr["torque_tolerance"] is not None else 0.06
    if tr["torque_tolerance"] is None and method == "torque":
        dflt("tightening.torque_tolerance", "+-6 %")
    if tol >= 0.5:
        raise InputError("torque tolerance must be below 0.5", key="tightening.torque_tolerance")
    if tr["preload"] is not None:
        capacity = thr.As * grd.Rm
        if tr["preload"] > capacity:
            raise InputError(
                f"preload {tr['preload'] / 1e3:g} kN is above the bolt's tensile strength "
                f"(As x Rm = {capacity / 1e3:.4g} kN)",
                key="tightening.preload",
            )
    tightening = TighteningSpec(
        method, tr["torque"], tr["preload"], muG, muK, tr["scatter"], nu, tol
    )

    # --- service
    FA = srv["axial_load"] if srv["axial_load"] is not None else (0.0, 0.0)
    n = srv["load_height"] if srv["load_height"] is not None else 0.5
    if srv["load_height"] is None:
        dflt("service.load_height", "0.5")
    if n > 1.0:
        raise InputError("load_height n must lie in (0, 1]", key="service.load_height")
    service = ServiceSpec(FA, srv["shear_load"] or 0.0, n, T_srv, T_asm)

    # --- requirements
    rq = raw["requirements"] or {k.name: None for k in REQUIREMENTS.keys}
    alternating = FA[1] != FA[0]
    slip_safety = rq["slip_safety"] or (1.8 if alternating else 1.2)
    if service.shear_load > 0 and rq["slip_safety"] is None:
        dflt("requirements.slip_safety", f"{slip_safety:g}")
    if service.shear_load > 0 and rq["slip_friction"] is None:
        dflt("requirements.slip_friction", "0.15")
    requirements = RequirementSpec(
        rq["residual_clamp_load"] or 0.0,
        rq["slip_friction"] or 0.15,
        slip_safety,
        rq["fatigue_safety"] or 1.2,
    )

    # --- temperatures inside the catalog data
    _check_temperature(bolt.material, T_bolt, "bolt.temperature")
    _check_temperature(bolt.material, T_asm, "service.assembly_temperature")
    for layer in layers:
        _check_temperature(layer.material, layer.temperature, f"layer {layer.name!r} temperature")
        _check_temperature(layer.material, T_asm, "service.assembly_temperature")

    skips = []
    for n_s, s in enumerate(raw["skip"] or []):
        if not s["reason"].strip():
            raise InputError("a skipped check needs a reason", key=f"skip[{n_s + 1}].reason")
        if any(s["check"] == x for x, _ in skips):
            raise InputError(f"check {s['check']!r} is skipped twice", key=f"skip[{n_s + 1}].check")
        skips.append((s["check"], s["reason"].strip()))

    from ..studies.scatter import parse_distributions

    parse_distributions(raw["distributions"])  # validated here, used by scatter
    return JointSpec(
        title=raw["title"] or "untitled joint",
        bolt=bolt,
        nut=nut,
        tapped_hole=tapped,
        layers=tuple(layers),
        embedding_amount=emb["amount"],
        roughness=rough,
        tightening=tightening,
        service=service,
        requirements=requirements,
        clamp_model=raw["clamp_model"] or "vdi2230",
        skips=tuple(skips),
        defaults=tuple(defaults),
        distributions=raw["distributions"],
    )
