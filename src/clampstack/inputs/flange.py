"""The flange input file (``clampstack flange``): schema and reader."""

from __future__ import annotations

import math
from typing import Any

from ..catalog import gasket as catalog_gasket
from ..catalog import grade as catalog_grade
from ..catalog import material as catalog_material
from ..catalog import thread as catalog_thread
from ..errors import InputError
from ..flange.model import FlangeSpec, GasketSpec
from ..joint.model import ROOM, PartMaterial
from ..units import parse_quantity
from .files import InputDocument, load_toml
from .joint import NUT as JOINT_NUT
from .joint import TIGHTENING as JOINT_TIGHTENING
from .joint import bearing_face_diameter
from .schema import Key, Schema, read_table

PSI = 6894.757293168361

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
            "gasket temperature (accepted; the gasket curve has no temperature data)",
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
    ),
)


def read_flange_file(path: str) -> tuple[InputDocument, FlangeSpec]:
    """Load and validate a flange file (InputError names the file and the key)."""
    doc = load_toml(path)
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


def _temp_ok(pm: PartMaterial, T: float, key: str) -> None:
    lo, hi = pm.material.valid_range()
    if not lo - 1e-9 <= T <= hi + 1e-9:
        raise InputError(
            f"{T - 273.15:g} degC is outside the data of material "
            f"{pm.material.key!r} ({lo - 273.15:g} to {hi - 273.15:g} degC)",
            key=key,
        )


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
    """Validate a flange file's TOML data and resolve every default."""
    raw = read_table(FLANGE_FILE, data)
    defaults: list[tuple[str, str]] = []
    f, b, g = raw["flange"], raw["bolt"], raw["gasket"]
    n = f["bolt_count"]
    if n < 3:
        raise InputError(f"a flange needs at least 3 bolts, got {n}", key="flange.bolt_count")
    if n > 1000:
        raise InputError(
            f"{n} bolts is more than this tool models (at most 1000)", key="flange.bolt_count"
        )
    try:
        thr = catalog_thread(b["thread"])
    except InputError as err:
        raise InputError(err.detail, key="bolt.thread") from None
    try:
        grd = catalog_grade(b["grade"], thr.d)
    except InputError as err:
        raise InputError(err.detail, key="bolt.grade") from None
    hole = b["hole"] or thr.hole_medium
    if b["hole"] is None:
        defaults.append(("bolt.hole", f"{hole * 1e3:g} mm (ISO 273 medium)"))
    dW = b["bearing_diameter"] or bearing_face_diameter(thr.head_across_flats)
    if dW <= hole:
        raise InputError("bearing diameter must exceed the bolt hole", key="bolt.bearing_diameter")
    Dbc = f["bolt_circle"]
    chord = Dbc * math.sin(math.pi / n)  # distance between neighbouring bolt axes
    if chord < dW:
        raise InputError(
            f"{n} bolts do not fit on a {Dbc * 1e3:.4g} mm bolt circle: neighbouring bolts "
            f"are {chord * 1e3:.3g} mm apart, less than the nut bearing diameter "
            f"{dW * 1e3:.3g} mm",
            key="flange.bolt_count",
        )
    # --- gasket
    gi, go, gt = g["inner_diameter"], g["outer_diameter"], g["thickness"]
    if gi >= go:
        raise InputError(
            "gasket inner diameter must be below its outer diameter", key="gasket.inner_diameter"
        )
    if go > Dbc - hole:
        raise InputError(
            f"gasket outer diameter {go * 1e3:g} mm reaches the bolt holes (bolt circle "
            f"{Dbc * 1e3:g} mm minus hole {hole * 1e3:g} mm); a ring gasket lies inside the bolts",
            key="gasket.outer_diameter",
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
    curve = None
    if g["curve"] is not None:
        strains, stresses = [0.0], [0.0]
        for k, pt in enumerate(g["curve"]):
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
        curve = (tuple(strains), tuple(stresses))
    like = cat
    if cat is None and curve is None:
        # m and y only: the loading behaviour of the catalog type nearest in (m, y)
        import math as _m

        from ..catalog import gaskets as catalog_gaskets

        like = min(
            catalog_gaskets(),
            key=lambda t: (
                abs(_m.log((t.m + 0.1) / (m + 0.1))) + abs(_m.log((t.y + 1e5) / (y + 1e5)))
            ),
        )
        defaults.append(
            ("gasket.curve", f"typical curve of catalog type {like.key!r} (nearest m and y)")
        )
    if curve is None:
        assert like is not None
        curve = (like.curve_strain, like.curve_stress)
    max_stress = g["max_stress"] or (like.max_stress if like else None)
    if max_stress is None:
        max_stress = curve[1][-1]
        defaults.append(("gasket.max_stress", f"{max_stress / 1e6:.4g} MPa (top of the curve)"))
    unload = g["unload_modulus"] or (like.unload_modulus if like else None)
    if unload is None:
        unload = (curve[1][-1] - curve[1][-2]) / (curve[0][-1] - curve[0][-2])
        defaults.append(
            ("gasket.unload_modulus", f"{unload / 1e6:.4g} MPa (last slope of the curve)")
        )
    if not unload > 0:
        raise InputError("the unloading modulus must be positive", key="gasket.unload_modulus")
    gasket = GasketSpec(
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
    )
    # --- flange ring
    fmat = _mat(f["material"] or "steel", "flange.material")
    if f["material"] is None:
        defaults.append(("flange.material", "steel"))
    ring_in = f["inner_diameter"] or gi
    ring_out = f["outer_diameter"] or (Dbc + 2.5 * hole)
    if f["outer_diameter"] is None:
        defaults.append(("flange.outer_diameter", f"{ring_out * 1e3:.4g} mm"))
    if not ring_in < Dbc - hole or not ring_out > Dbc + hole:
        raise InputError(
            "the bolt holes must lie within the flange ring", key="flange.outer_diameter"
        )
    if ring_out < Dbc + dW * (1 - 1e-9):
        raise InputError(
            f"the nuts ({dW * 1e3:.4g} mm bearing face) overhang the flange: bolt circle "
            f"{Dbc * 1e3:g} mm + nut > outer diameter {ring_out * 1e3:.4g} mm",
            key="flange.outer_diameter",
        )
    chord = Dbc * math.sin(math.pi / n)
    if chord < dW * (1 - 1e-9):
        raise InputError(
            f"{n} bolts do not fit on the {Dbc * 1e3:g} mm bolt circle: neighbouring nuts "
            f"({dW * 1e3:.4g} mm) overlap ({chord * 1e3:.4g} mm apart)",
            key="flange.bolt_count",
        )
    bmat = _mat(b["material"] or grd.material_key, "bolt.material")
    if b["modulus"] is not None or b["expansion"] is not None:
        if b["modulus"] is None or b["expansion"] is None:
            raise InputError("give the bolt's modulus and expansion together", key="bolt.modulus")
        bmat = PartMaterial("user bolt", bmat.material, b["modulus"], b["expansion"])
    nut_raw = raw["nut"] or {}
    if nut_raw.get("bearing_diameter") is not None:
        dW = nut_raw["bearing_diameter"]
        if dW <= hole:
            raise InputError(
                "bearing diameter must exceed the bolt hole", key="nut.bearing_diameter"
            )
    # --- allowable bolt stresses (ASME App. 2)
    Sb = b["allowable_stress"]
    if Sb is None:
        if grd.name == "ASTM A193 B7" and thr.d <= 2.5 * 0.0254:
            Sb = 25000 * PSI
            defaults.append(
                (
                    "bolt.allowable_stress",
                    "172.4 MPa (25 ksi, ASME II-D Table 3, SA-193 B7, from memory)",
                )
            )
        else:
            Sb = min(grd.Rm / 5, grd.Rp02 / 4)
            defaults.append(
                (
                    "bolt.allowable_stress",
                    f"{Sb / 1e6:.4g} MPa (min(R_m/5, "
                    "R_p0.2/4), bolting design factors, from memory)",
                )
            )
    Sa = b["allowable_stress_ambient"] or Sb
    # --- the bolt must reach through both flanges (or one and the rigid part), gasket and nuts
    pair = (f["mating"] or "flange") == "flange"
    grip = (2 if pair else 1) * f["thickness"] + gt
    need = grip + (2 if pair else 1) * (nut_raw.get("height") or thr.nut_height)
    if b["length"] is not None and b["length"] < need * (1 - 1e-9):
        raise InputError(
            f"bolt length {b['length'] * 1e3:g} mm does not reach through the joint "
            f"({need * 1e3:.4g} mm with {'both nuts' if pair else 'the nut'})",
            key="bolt.length",
        )
    if (b["shank_length"] or 0.0) > grip:
        raise InputError("the plain shank is longer than the grip", key="bolt.shank_length")
    if b["shank_diameter"] is not None and b["shank_diameter"] >= thr.d:
        raise InputError(
            "a reduced shank must be thinner than the thread", key="bolt.shank_diameter"
        )

    # --- loading
    ld = raw["loading"] or {k.name: None for k in LOADING.keys}
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
    for pm, T, key in (
        (fmat, T_fl, "loading.temperature"),
        (fmat, T_asm, "loading.assembly_temperature"),
        (bmat, T_b, "loading.bolt_temperature"),
        (bmat, T_asm, "loading.assembly_temperature"),
    ):
        _temp_ok(pm, T, key)
    # --- tightening
    tr = raw["tightening"] or {k.name: None for k in TIGHTENING.keys}
    method = tr["method"] or "torque"
    if tr["torque"] is not None and tr["preload"] is not None:
        raise InputError("give torque or preload, not both", key="tightening.preload")
    if method in ("yield", "angle") and (tr["torque"] is not None or tr["preload"] is not None):
        raise InputError(
            f"method {method!r} tightens to the yield point; remove torque and preload",
            key="tightening.method",
        )
    if method == "tension" and tr["torque"] is not None:
        raise InputError("a tensioner sets a preload, not a torque", key="tightening.torque")
    muG = tr["thread_friction"] or (0.10, 0.16)
    muK = tr["head_friction"] or muG
    passes = tr["passes"] if tr["passes"] is not None else [30, 70, 100, 100]
    if isinstance(passes, list):
        conv = []
        for k, p in enumerate(passes):
            if isinstance(p, str):  # "30 %"
                p = parse_quantity(p, "dimensionless", f"tightening.passes[{k + 1}]") * 100
            conv.append(p)
        passes = conv
        if (
            passes
            and all(
                isinstance(p, int | float) and not isinstance(p, bool) and 0 < p <= 1.0
                for p in passes
            )
            and max(passes) <= 1.0
            and any(p < 1.0 for p in passes)
        ):
            passes = [100 * p for p in passes]  # given as fractions: 0.3 means 30 %
            defaults.append(("tightening.passes", "read as fractions of the target"))
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
    return FlangeSpec(
        title=raw["title"] or "untitled flange",
        bolt_count=n,
        bolt_circle=Dbc,
        thickness=f["thickness"],
        ring_inner_diameter=ring_in,
        ring_outer_diameter=ring_out,
        material=fmat,
        mating=f["mating"] or "flange",
        thread=thr,
        grade=grd,
        bolt_material=bmat,
        nut_height=nut_raw.get("height") or thr.nut_height,
        nut_material=_nut_material(nut_raw),
        unused=tuple(
            f"nut.{k}"
            for k in ("strength", "limiting_pressure", "temperature")
            if nut_raw.get(k) is not None
        )
        + (("bolt.rolled",) if b["rolled"] is not None else ()),
        head=b["head"] or ("stud" if (f["mating"] or "flange") == "flange" else "hex"),
        shank_length=b["shank_length"] or 0.0,
        shank_diameter=b["shank_diameter"],
        bearing_diameter=dW,
        hole=hole,
        allowable_stress=Sb,
        allowable_stress_ambient=Sa,
        gasket=gasket,
        pressure=ld["pressure"] or 0.0,
        axial_force=ld["axial_force"] or 0.0,
        bending_moment=ld["bending_moment"] or 0.0,
        T_assembly=T_asm,
        T_flange=T_fl,
        T_bolt=T_b,
        method=method,
        torque=tr["torque"],
        preload=tr["preload"],
        thread_friction=muG,
        head_friction=muK,
        scatter=tr["scatter"],
        utilization=tr["utilization"] if tr["utilization"] is not None else 0.9,
        torque_tolerance=tr["torque_tolerance"] if tr["torque_tolerance"] is not None else 0.06,
        passes=tuple(p / 100.0 for p in passes),
        patterns=tuple(pats),
        order=order,
        defaults=tuple(defaults),
    )
