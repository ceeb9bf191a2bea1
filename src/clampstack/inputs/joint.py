"""The joint input file (``check``, ``sweep``, ``scatter``, ``size``, ``report``).

Schema per ../shared/DESIGN.md, and the reader that resolves every default
(recorded so that it is printed) and returns a :class:`~clampstack.joint.model.JointSpec`.
"""

from __future__ import annotations

from dataclasses import replace
from typing import Any

from ..catalog.parts import washer_size
from ..errors import InputError
from ..joint import geometry
from ..joint.checks import CHECK_NAMES
from ..joint.eccentric import Interface, substitute_inertia
from ..joint.model import (
    ROOM,
    BoltSpec,
    CaseSpec,
    EccentricSpec,
    JointSpec,
    LayerSpec,
    NutSpec,
    PartMaterial,
    RequirementSpec,
    ServiceSpec,
    TappedHoleSpec,
)
from ..units import parse_quantity
from .distributions import parse_distributions
from .files import InputDocument, load_toml, require_kind
from .schema import Key, Schema, read_table
from .tables import Defaults, empty, given_keys, part_material, thread_and_grade, tightening

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
            "width_across_flats",
            "length",
            "width across flats s (nut dilation in the stripping check)",
            default="ISO 4032 (ASME B18.2.2 for inch threads)",
            positive=True,
        ),
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
            default="0.06, or the tool's",
            minimum=0.0,
        ),
        Key("snug_torque", "torque", "snug torque before the angle (method angle)", positive=True),
        Key(
            "angle",
            "range:angle",
            "nut rotation after the snug torque (method angle), value or range",
            minimum=0.0,
        ),
        Key(
            "angle_tolerance",
            "angle",
            "tolerance of the rotation (+-), method angle",
            default="0 deg",
            minimum=0.0,
        ),
        Key(
            "load_transfer_factor",
            "number",
            "method tension: residual preload / applied tension",
            default="1 / (1 + d / l_K)",
            positive=True,
        ),
        Key(
            "nut_factor",
            "range:dimensionless",
            "nut factor K of T = K F d, value or range, instead of friction coefficients "
            "(it lumps friction and geometry; the friction it implies is printed)",
            minimum=0.0,
        ),
        Key(
            "lubricant",
            "text",
            "lubricant or coating (a key of `clampstack catalog friction`): sets both friction "
            "ranges",
        ),
        Key(
            "tool",
            "text",
            "torque tool class (a key of `clampstack catalog tools`): sets the torque tolerance",
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
        Key(
            "bending_moment",
            "range:moment",
            "bending moment M_B on the interface per bolt, value or range acting with the "
            "axial load's min..max (needs [eccentricity]); positive in the sense of an axial "
            "load at positive load_offset",
            default="0 N*m",
        ),
        Key("temperature", "temperature", "service temperature", default="assembly temperature"),
        Key("assembly_temperature", "temperature", "temperature at assembly", default="20 degC"),
    ),
)

INTERFACE = Schema(
    "eccentricity.interface",
    "The clamped interface: width and length (a rectangle, length along the bolt-load line), "
    "a diameter (a circle), or area and second moment.",
    (
        Key("width", "length", "rectangle: extent across the bolt-load line", positive=True),
        Key("length", "length", "rectangle: extent along the bolt-load line", positive=True),
        Key("diameter", "length", "circle: diameter", positive=True),
        Key("area", "area", "area A_D (with second_moment)", positive=True),
        Key(
            "second_moment",
            "second_moment",
            "second moment of area I_BT about the axis of symmetry, for bending along the "
            "bolt-load line (with area)",
            positive=True,
        ),
    ),
)

ECCENTRICITY = Schema(
    "eccentricity",
    "Eccentric clamping and loading (VDI 2230-1:2015, 5.1.2.3 and 5.3.2). Offsets are measured "
    "from the interface's axis of symmetry along the line through bolt and load, positive "
    "toward the load's side. Absent: the joint is concentric.",
    (
        Key("bolt_offset", "length", "s_sym: the bolt axis's offset", default="0 mm"),
        Key("load_offset", "length", "a: the axial load's line of action", default="0 mm"),
        Key(
            "edge_distance",
            "length",
            "u: the edge that opens first (signed, negative on the far side)",
            default="the edge of the interface that opens first under the load",
        ),
        Key("interface", "table", "the interface's shape", required=True, schema=INTERFACE),
        Key(
            "bending_inertia",
            "second_moment",
            "I_Bers: substitute moment of inertia of the deformation body (override)",
            default="VDI 2230-1 cone and sleeve, at most I_BT",
            positive=True,
        ),
    ),
)

LOAD_INTRODUCTION = Schema(
    "load_introduction",
    "The load introduction factor n from the joint's geometry: VDI 2230-1:2015, 5.2.2.2, "
    "joint types SV1 to SV6 (table values from memory). A given service.load_height overrides.",
    (
        Key(
            "joint_type",
            "integer",
            "VDI 2230-1 joint type SV1..SV6: 1 loads introduced at the head and nut side "
            "faces, through 6 at the interface",
            required=True,
        ),
        Key(
            "height",
            "length",
            "h: height of the basic solid (the clamped part the load enters)",
            default="the clamp length l_K",
            positive=True,
        ),
        Key(
            "load_distance",
            "length",
            "a_k: distance of the load's entry from the edge of the basic solid",
            default="0 mm",
            minimum=0.0,
        ),
        Key(
            "connection_length",
            "length",
            "l_A: length of the connecting solid between the basic solid and the load's entry",
            default="0 mm",
            minimum=0.0,
        ),
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
        Key(
            "check_basis",
            "text",
            "assembly preload of the working-stress, fatigue and surface-pressure checks: "
            "permissible (F_M,zul, as VDI 2230-1 R8-R10) or actual (F_M,max of the given "
            "torque or preload)",
            default="permissible",
            choices=("permissible", "actual"),
        ),
        Key(
            "max_failure_probability",
            "number",
            "scatter: largest allowed probability of separation, bolt yield or slip (the 95 % "
            "upper bound is compared; exceeded: exit code 1)",
            default="no limit",
            positive=True,
        ),
    ),
)

CASE = Schema(
    "case",
    "A load case: the check chain runs for every case; each sets its own loads and "
    "temperatures in place of [service] (a key left out keeps the [service] value). Parts "
    "with a temperature of their own keep their rise in proportion to the joint's.",
    (
        Key("name", "text", "name of the case (printed, and in the JSON)", required=True),
        Key("axial_load", "range:force", "axial working load F_A per bolt: value or min..max"),
        Key("shear_load", "force", "transverse load F_Q per bolt", minimum=0.0),
        Key(
            "bending_moment",
            "range:moment",
            "bending moment M_B per bolt, value or range (needs [eccentricity])",
        ),
        Key("temperature", "temperature", "service temperature of the case"),
        Key("assembly_temperature", "temperature", "temperature at assembly"),
        Key(
            "part_temperatures",
            "raw",
            "temperatures of single parts in this case, by name: bolt, nut, tapped_hole or a "
            'clamped part\'s or washer\'s name, e.g. {bolt = "80 degC", "gearbox foot" = '
            '"140 degC"} (the others follow the joint)',
        ),
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
        Key("eccentricity", "table", "eccentric clamping and loading", schema=ECCENTRICITY),
        Key(
            "load_introduction",
            "table",
            "the load introduction factor n from the joint type",
            schema=LOAD_INTRODUCTION,
        ),
        Key("case", "tables", "load cases (cold start, hot running, proof test, ...)", schema=CASE),
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


def read_joint_file(path: str, command: str = "check") -> tuple[InputDocument, JointSpec]:
    """Load and validate a joint file (InputError names the file and the key)."""
    doc = load_toml(path)
    require_kind(doc, "joint", command)
    try:
        return doc, joint_from_data(doc.data)
    except InputError as err:
        raise err.with_source(doc.path) from None


def joint_from_data(data: dict[str, Any]) -> JointSpec:
    """Validate a joint file's TOML data, resolve every default and check that the parts fit.

    One reader per table below, in the order the defaults depend on each other:
    temperatures, bolt, clamped parts and washers, nut or tapped hole, plain shank,
    embedding, tightening, service, requirements, skipped checks, distributions.
    """
    raw = read_table(JOINT, data)
    rec = Defaults()
    srv = raw["service"] or empty(SERVICE)
    T_asm, T_srv = service_temperatures(srv, rec)
    b = raw["bolt"]
    thr, grd = thread_and_grade(b)
    head = rec.pick("bolt.head", b["head"], "hex", "hex")
    bolt_mat = bolt_material(b, grd, rec)
    dW = b["bearing_diameter"]
    if dW is None:
        dW, note = geometry.head_bearing_diameter(thr, head)
        rec.note("bolt.bearing_diameter", note)
    if raw["nut"] is not None and raw["tapped_hole"] is not None:
        raise InputError("give [nut] or [tapped_hole], not both", key="tapped_hole")
    layers = stack(raw, thr, T_srv, rec)
    lK = sum(layer.thickness for layer in layers)
    nut = tapped = None
    T_bolt = b["temperature"] if b["temperature"] is not None else T_srv
    if raw["tapped_hole"] is not None:
        tapped = tapped_hole(raw["tapped_hole"], b["length"] - lK, T_srv, rec)
    else:
        nut = nut_table(raw["nut"], thr, grd, bolt_mat, T_bolt, rec)
    bolt = BoltSpec(
        thr,
        grd,
        b["length"],
        0.0,
        b["shank_diameter"],
        head,
        dW,
        bolt_mat,
        T_bolt,
        b["rolled"] or "before",
    )
    bolt = replace(bolt, shank_length=shank(b, bolt, lK, rec))
    rough, amount = embedding(raw["embedding"], rec)
    DKm = 0.5 * ((dW if nut is None else nut.bearing_diameter) + layers[0].hole)
    tight = tightening(raw["tightening"] or empty(TIGHTENING), thr, grd, rec, DKm)
    service = service_loads(
        srv, T_srv, T_asm, rec, load_introduction(raw["load_introduction"], lK, rec)
    )
    ecc = eccentricity(raw["eccentricity"], layers, dW, tapped is not None, service, rec)
    requirements = requirement_table(raw["requirements"], service, rec)
    skips = skipped_checks(raw["skip"])
    names = ("bolt", "nut" if nut is not None else "tapped_hole") + tuple(x.name for x in layers)
    cases = load_cases(raw["case"], ecc is not None, names)
    given = given_keys(raw)
    spec = JointSpec(
        title=raw["title"] or "untitled joint",
        bolt=bolt,
        nut=nut,
        tapped_hole=tapped,
        layers=layers,
        embedding_amount=amount,
        roughness=rough,
        tightening=tight,
        service=service,
        requirements=requirements,
        clamp_model=raw["clamp_model"] or "vdi2230",
        skips=skips,
        defaults=rec.as_tuple(),
        distributions=None
        if raw["distributions"] is None
        else parse_distributions(raw["distributions"]),
        given=given,
        eccentric=ecc,
        cases=cases,
    )
    geometry.check_fit(spec, given)
    return spec


def service_temperatures(srv: dict[str, Any], rec: Defaults) -> tuple[float, float]:
    """Assembly and service temperature [K] (``[service]``); the parts default to them."""
    T_asm = rec.pick("service.assembly_temperature", srv["assembly_temperature"], ROOM, "20 degC")
    T_srv = rec.pick("service.temperature", srv["temperature"], T_asm, "assembly temperature")
    return T_asm, T_srv


def bolt_material(b: dict[str, Any], grd: Any, rec: Defaults) -> PartMaterial:
    """The bolt's material: given, or the grade's own steel (its catalog temperature tables)."""
    pm = part_material(b, "bolt", grd.material_key, Defaults())
    if b["material"] is None and b["modulus"] is None:
        rec.note("bolt.material", f"{grd.material_key} (from grade {grd.name})")
        return PartMaterial(f"{grd.material_key} (grade {grd.name})", pm.material)
    return pm


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


def stack(raw: dict[str, Any], thr: Any, T_srv: float, rec: Defaults) -> tuple[LayerSpec, ...]:
    """Head-side washers, the ``[[clamped]]`` parts, nut-side washers, head side first."""
    clamped, washers = raw["clamped"], raw["washer"] or []
    if not clamped:
        raise InputError("at least one clamped part is needed", key="clamped")
    first_hole = clamped[0]["hole"]
    if first_hole is None:
        first_hole = geometry.clearance_hole(thr, "clamped[1]")[0]
    out: list[LayerSpec] = []
    for n, w in enumerate(washers):
        if (w["side"] or "head") == "head":
            out.append(washer(w, n + 1, thr, first_hole, T_srv, rec))
    for n, c in enumerate(clamped):
        out.append(clamped_part(c, n + 1, thr, T_srv, rec))
    for n, w in enumerate(washers):
        if w["side"] == "nut":
            if raw["tapped_hole"] is not None:
                raise InputError(
                    "a tapped joint has no nut-side washer", key=f"washer[{n + 1}].side"
                )
            out.append(washer(w, n + 1, thr, first_hole, T_srv, rec))
    return tuple(out)


def _layer(
    r: dict[str, Any], key: str, kind: str, name: str, hole: float, od: Any, mat, T_srv: float
) -> LayerSpec:
    pG = r.get("limiting_pressure")
    if pG is None and mat.material is not None and mat.material.pG is not None:
        pG = mat.material.pG
    T = r.get("temperature")
    return LayerSpec(
        name,
        kind,
        r["thickness"],
        hole,
        od,
        mat,
        T_srv if T is None else T,
        pG,
        _family(mat.material.key) if mat.material else "general",
        key,
    )


def washer(
    w: dict[str, Any], n: int, thr: Any, first_hole: float, T_srv: float, rec: Defaults
) -> LayerSpec:
    """One ``[[washer]]``: ISO 7089 thickness and outer diameter, the hole inside by default."""
    key = f"washer[{n}]"
    mat = part_material(w, key, "steel", rec)
    h_w, od_w = washer_size(thr.d)
    w = dict(w)
    std = (
        "0.16 d and 2 d: the catalog has no ASME B18.22.1 washer table; common practice"
        if thr.system == "unified"
        else "ISO 7089"
    )
    w["thickness"] = rec.pick(
        f"{key}.thickness", w["thickness"], h_w, f"{h_w * 1e3:.4g} mm ({std})"
    )
    od = rec.pick(
        f"{key}.outer_diameter", w["outer_diameter"], od_w, f"{od_w * 1e3:.4g} mm ({std})"
    )
    hole = w["inner_diameter"] or first_hole
    if w["inner_diameter"] is None:
        rec.note(f"{key}.inner_diameter", f"{hole * 1e3:g} mm (the hole)")
    return _layer(w, key, "washer", f"washer {n}", hole, od, mat, T_srv)


def clamped_part(c: dict[str, Any], n: int, thr: Any, T_srv: float, rec: Defaults) -> LayerSpec:
    """One ``[[clamped]]`` plate or sleeve: ISO 273 medium hole, a full cone by default."""
    key = f"clamped[{n}]"
    mat = part_material(c, key, None, rec)
    hole = c["hole"]
    if hole is None:
        hole, note = geometry.clearance_hole(thr, key)
        rec.note(f"{key}.hole", note)
    od = c["outer_diameter"]
    if od is None and c["kind"] != "sleeve":
        rec.note(f"{key}.outer_diameter", "wide enough for a full cone")
    return _layer(c, key, c["kind"] or "plate", c["name"] or f"part {n}", hole, od, mat, T_srv)


def tapped_hole(t: dict[str, Any], available: float, T_srv: float, rec: Defaults) -> TappedHoleSpec:
    """The ``[tapped_hole]``: material, engagement (all the bolt reaches by default), strength."""
    mat = part_material(t, "tapped_hole", None, rec)
    engagement = t["engagement"]
    if engagement is None:
        engagement = available
        rec.note("tapped_hole.engagement", f"{engagement * 1e3:g} mm (bolt length - clamp length)")
    Rm = t["strength"]
    if Rm is None:
        if mat.material is None or mat.material.Rm is None:
            raise InputError("give the strength of the tapped material", key="tapped_hole.strength")
        Rm = mat.material.Rm
    T = t["temperature"] if t["temperature"] is not None else T_srv
    return TappedHoleSpec(mat, engagement, Rm, mat.material.shear_ratio if mat.material else 0.6, T)


def nut_table(
    nraw: dict[str, Any] | None,
    thr: Any,
    grd: Any,
    bolt_mat: PartMaterial,
    T_bolt: float,
    rec: Defaults,
) -> NutSpec:
    """The ``[nut]``: an ISO 4032 nut of the bolt's steel and strength unless told otherwise."""
    if nraw is None:
        rec.note("nut", "ISO 4032 hex nut matched to the bolt")
        nraw = empty(NUT)
    if nraw["material"] is None and nraw["modulus"] is None:
        mat = bolt_mat
    else:
        mat = part_material(nraw, "nut", None, rec)
    height = nraw["height"] or thr.nut_height
    if nraw["height"] is None:
        std = "ASME B18.2.2" if thr.system == "unified" else "ISO 4032"
        rec.note("nut.height", f"{height * 1e3:.4g} mm ({std})")
    return NutSpec(
        height,
        nraw["bearing_diameter"] or geometry.nut_bearing_diameter(thr),
        mat,
        nraw["strength"] or grd.Rm,
        mat.material.shear_ratio if mat.material else 0.6,
        nraw["limiting_pressure"],
        nraw["temperature"] if nraw["temperature"] is not None else T_bolt,
        nraw["width_across_flats"] or thr.head_across_flats,
    )


def shank(b: dict[str, Any], bolt: BoltSpec, lK: float, rec: Defaults) -> float:
    """Plain shank inside the clamp length [m]: given, or the head standard's thread length."""
    if b["shank_length"] is not None:
        value = b["shank_length"]
    else:
        value, note = geometry.plain_shank(bolt.thread, bolt.length, bolt.head)
        rec.note("bolt.shank_length", note)
    return geometry.shank_in_clamp(value, lK)


def embedding(emb: dict[str, Any] | None, rec: Defaults) -> tuple[float, float | None]:
    """``[embedding]``: roughness R_z (6.3 um) or an amount f_Z given directly [m]."""
    emb = emb or empty(EMBEDDING)
    rough = emb["roughness"]
    if rough is None:
        rough = 6.3e-6
        if emb["amount"] is None:
            rec.note("embedding.roughness", "6.3 um")
    if rough >= 160e-6:
        raise InputError(
            "roughness of 160 um or more is outside the VDI 2230-1 table", key="embedding.roughness"
        )
    return rough, emb["amount"]


def service_loads(
    srv: dict[str, Any],
    T_srv: float,
    T_asm: float,
    rec: Defaults,
    table_n: tuple[float, str] | None = None,
) -> ServiceSpec:
    """``[service]``: axial load range, shear load, bending moment, load introduction factor n.

    ``n``: given, else from ``[load_introduction]`` (``table_n``: value and how it was
    found), else 0.5.
    """
    FA = srv["axial_load"] if srv["axial_load"] is not None else (0.0, 0.0)
    if table_n is not None and srv["load_height"] is None:
        n = rec.pick("service.load_height", None, table_n[0], table_n[1])
    else:
        n = rec.pick("service.load_height", srv["load_height"], 0.5, "0.5")
        if table_n is not None:
            rec.note(
                "load_introduction",
                f"not used: the given service.load_height = {n:g} overrides the table's "
                f"n = {table_n[0]:.3g}",
            )
    if n > 1.0:
        raise InputError("load_height n must lie in (0, 1]", key="service.load_height")
    MB = srv["bending_moment"] if srv["bending_moment"] is not None else (0.0, 0.0)
    return ServiceSpec(FA, srv["shear_load"] or 0.0, n, T_srv, T_asm, MB)


def load_introduction(
    li: dict[str, Any] | None, lK: float, rec: Defaults
) -> tuple[float, str] | None:
    """``[load_introduction]``: n from the VDI 2230-1 joint types table, and its basis."""
    if li is None:
        return None
    from ..catalog.load_introduction import joint_types, load_introduction_factor

    jt = li["joint_type"]
    if jt not in joint_types():
        raise InputError(
            f"joint_type must be one of {', '.join(map(str, joint_types()))} (SV1..SV6), got {jt}",
            key="load_introduction.joint_type",
        )
    h = li["height"]
    if h is None:
        h = lK
        rec.note("load_introduction.height", f"{h * 1e3:.4g} mm (the clamp length)")
    ak = li["load_distance"] or 0.0
    lA = li["connection_length"] or 0.0
    n, source = load_introduction_factor(jt, ak / h, lA / h)
    return n, (f"{n:.3g} (joint type SV{jt}, a_k/h = {ak / h:.3g}, l_A/h = {lA / h:.3g}; {source})")


def eccentricity(
    e: dict[str, Any] | None,
    layers: tuple[LayerSpec, ...],
    dW: float,
    tapped: bool,
    service: ServiceSpec,
    rec: Defaults,
) -> EccentricSpec | None:
    """``[eccentricity]``: offsets, interface shape and the deformation body's inertia."""
    if e is None:
        if any(service.bending_moment):
            raise InputError(
                "a bending moment needs an [eccentricity] table (the interface that carries it)",
                key="service.bending_moment",
            )
        return None
    itf = {k: v for k, v in e["interface"].items() if v is not None}
    if set(itf) == {"width", "length"}:
        interface = Interface.rectangle(itf["width"], itf["length"])
    elif set(itf) == {"diameter"}:
        interface = Interface.circle(itf["diameter"])
    elif set(itf) == {"area", "second_moment"}:
        interface = Interface.given(itf["area"], itf["second_moment"])
    else:
        raise InputError(
            "give width and length (a rectangle), diameter (a circle), or area and "
            f"second_moment; got {', '.join(sorted(itf)) or 'nothing'}",
            key="eccentricity.interface",
        )
    s = e["bolt_offset"] or 0.0
    a = e["load_offset"] or 0.0
    u = e["edge_distance"]
    h = interface.half
    hole = max(lay.hole for lay in layers)
    if interface.shape != "given":
        if abs(s) + 0.5 * hole >= h:
            raise InputError(
                f"the bolt's hole must lie inside the interface: |bolt_offset| + hole/2 = "
                f"{(abs(s) + 0.5 * hole) * 1e3:.4g} mm reaches its edge at {h * 1e3:.4g} mm",
                key="eccentricity.bolt_offset",
            )
        if interface.width is not None and interface.width <= hole:
            raise InputError(
                f"the interface ({interface.width * 1e3:.4g} mm wide) is not wider than the hole "
                f"({hole * 1e3:.4g} mm)",
                key="eccentricity.interface.width",
            )
        if u is not None and abs(u) > h * (1 + 1e-9):
            raise InputError(
                f"edge_distance {u * 1e3:.4g} mm lies outside the interface (its edges are at "
                f"+-{h * 1e3:.4g} mm)",
                key="eccentricity.edge_distance",
            )
    elif u is None:
        raise InputError(
            "give edge_distance: an interface given by area and second_moment has no known edge",
            key="eccentricity.edge_distance",
        )
    if u is not None and u == 0:
        raise InputError(
            "edge_distance must not be zero (the edge is away from the axis)",
            key="eccentricity.edge_distance",
        )
    if u is None:
        rec.note("eccentricity.edge_distance", "the edge that opens first under the load")
    lK = sum(lay.thickness for lay in layers)
    ods = [lay.outer_diameter for lay in layers if lay.outer_diameter and lay.kind == "plate"]
    I_Bers, basis = substitute_inertia(dW, lK, min(ods) if ods else None, tapped, interface)
    if e["bending_inertia"] is not None:
        I_Bers, basis = e["bending_inertia"], "given"
    else:
        rec.note("eccentricity.bending_inertia", f"{I_Bers * 1e12:.4g} mm^4 ({basis})")
    return EccentricSpec(s, a, u, interface, I_Bers, basis)


def requirement_table(
    rq: dict[str, Any] | None, service: ServiceSpec, rec: Defaults
) -> RequirementSpec:
    """``[requirements]``: residual clamp load, slip friction and safety, fatigue safety."""
    rq = rq or empty(REQUIREMENTS)
    alternating = (service.axial_load[1] != service.axial_load[0]) or (
        service.bending_moment[1] != service.bending_moment[0]
    )
    slip_safety = rq["slip_safety"] or (1.8 if alternating else 1.2)
    if service.shear_load > 0 and rq["slip_safety"] is None:
        rec.note("requirements.slip_safety", f"{slip_safety:g}")
    if service.shear_load > 0 and rq["slip_friction"] is None:
        rec.note("requirements.slip_friction", "0.15")
    return RequirementSpec(
        rq["residual_clamp_load"] or 0.0,
        rq["slip_friction"] or 0.15,
        slip_safety,
        rq["fatigue_safety"] or 1.2,
        rq["check_basis"] or "permissible",
        rq["max_failure_probability"],
    )


def load_cases(
    rows: list[dict[str, Any]] | None, eccentric: bool, part_names: tuple[str, ...] = ()
) -> tuple[CaseSpec, ...]:
    """``[[case]]``: named load cases, each name once; a moment only with [eccentricity];
    ``part_temperatures`` by the names of the joint's parts (``part_names``)."""
    out: list[CaseSpec] = []
    for n, c in enumerate(rows or []):
        key = f"case[{n + 1}]"
        parts: list[tuple[str, float]] = []
        raw_parts = c["part_temperatures"]
        if raw_parts is not None:
            if not isinstance(raw_parts, dict):
                raise InputError(
                    "expected a table of part names and temperatures",
                    key=f"{key}.part_temperatures",
                )
            for pname, value in raw_parts.items():
                pkey = f"{key}.part_temperatures.{pname}"
                if pname not in part_names:
                    raise InputError(
                        f"no part called {pname!r}; the parts are {', '.join(part_names)}",
                        key=pkey,
                    )
                T = parse_quantity(value, "temperature", pkey)
                if T < 0:
                    raise InputError("a temperature below absolute zero", key=pkey)
                parts.append((pname, T))
        name = c["name"].strip()
        if not name:
            raise InputError("a load case needs a name", key=f"{key}.name")
        if any(x.name == name for x in out):
            raise InputError(f"two load cases are called {name!r}", key=f"{key}.name")
        if c["bending_moment"] is not None and any(c["bending_moment"]) and not eccentric:
            raise InputError(
                "a bending moment needs an [eccentricity] table (the interface that carries it)",
                key=f"{key}.bending_moment",
            )
        out.append(
            CaseSpec(
                name,
                c["axial_load"],
                c["shear_load"],
                c["bending_moment"],
                c["temperature"],
                c["assembly_temperature"],
                tuple(parts),
            )
        )
    return tuple(out)


def skipped_checks(rows: list[dict[str, Any]] | None) -> tuple[tuple[str, str], ...]:
    """``[[skip]]``: checks switched off, each once and with a reason."""
    skips: list[tuple[str, str]] = []
    for n, s in enumerate(rows or []):
        if not s["reason"].strip():
            raise InputError("a skipped check needs a reason", key=f"skip[{n + 1}].reason")
        if any(s["check"] == x for x, _ in skips):
            raise InputError(f"check {s['check']!r} is skipped twice", key=f"skip[{n + 1}].check")
        skips.append((s["check"], s["reason"].strip()))
    return tuple(skips)
