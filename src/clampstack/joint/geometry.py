"""Size-dependent standard defaults of a joint's parts, and how the parts must fit together.

Both the input reader (:mod:`clampstack.inputs.joint`) and the studies that vary a
validated joint (:mod:`clampstack.studies.size`) take the defaults that depend on
the bolt's size from here (head bearing face, plain shank, clearance hole,
washer, nut height), each with the note that is printed beside it, and check the
assembled joint with :func:`check_fit`, so a varied specification obeys exactly
the rules of a file.
"""

from __future__ import annotations

from dataclasses import replace
from typing import TypeVar

from ..catalog import Thread
from ..catalog.parts import bearing_face_diameter
from ..components import default_shank_length
from ..errors import InputError
from .model import JointSpec, LayerSpec, PartMaterial

S = TypeVar("S")  # a frozen spec dataclass with a `defaults` field


def head_bearing_diameter(thr: Thread, head: str) -> tuple[float, str]:
    """Default outer bearing diameter d_W under the head [m], with its note.

    Socket head: the head diameter d_k of ISO 4762; hexagon head or stud nut: the
    bearing face d_w,min (ISO 4014 / ISO 4032, :func:`~clampstack.catalog.parts.bearing_face_diameter`).
    """
    if head == "socket":
        if thr.socket_head_diameter is None:
            raise InputError(
                f"no standard socket head for {thr.designation}; give bearing_diameter",
                key="bolt.bearing_diameter",
            )
        dW = thr.socket_head_diameter
        std = "ASME B18.3" if thr.system == "unified" else "ISO 4762"
        return dW, f"{dW * 1e3:g} mm (socket head d_k, {std})"
    dW = bearing_face_diameter(thr.head_across_flats)
    if thr.system == "unified":
        return dW, (
            f"{dW * 1e3:.4g} mm (0.93 x the across-flats width of the ASME B18.2.1 hex head: "
            "the catalog has no unified bearing-face table; common practice, no source)"
        )
    return dW, f"{dW * 1e3:.4g} mm (bearing face d_w,min of the hex head)"


def nut_bearing_diameter(thr: Thread) -> float:
    """Default outer bearing diameter under an ISO 4032 nut [m] (its d_w,min)."""
    return bearing_face_diameter(thr.head_across_flats)


def plain_shank(thr: Thread, length: float, head: str) -> tuple[float, str]:
    """Default plain shank length inside the clamp [m], with its note.

    Stud: threaded through (0). Socket screw: ``l - b`` with the ISO 4762 reference
    thread length ``b = 2 d + 12 mm`` (from memory). Hexagon bolt: ISO 4014 thread
    length (:func:`~clampstack.components.default_shank_length`).
    """
    if head == "stud":
        return 0.0, "0 (stud threaded through the clamp length)"
    if thr.system == "unified":
        # ASME B18.2.1 hex cap screws: thread length 2 D + 1/4 in up to 6 in long, 2 D +
        # 1/2 in beyond; ASME B18.3 socket head cap screws: 2 D + 1/2 in (from memory)
        inch = 0.0254
        extra = 0.5 * inch if head == "socket" or length > 6 * inch else 0.25 * inch
        shank = max(0.0, length - (2 * thr.d + extra))
        std = "ASME B18.3" if head == "socket" else "ASME B18.2.1"
        return shank, f"{shank * 1e3:.4g} mm ({std} thread length 2D + {extra / inch:g} in)"
    if head == "socket":
        shank = max(0.0, length - (2 * thr.d + 12e-3))
        return shank, f"{shank * 1e3:g} mm (ISO 4762 thread length 2d + 12 mm)"
    shank = float(default_shank_length(thr.d, length))
    return shank, f"{shank * 1e3:g} mm (ISO 4014 thread length)"


def clearance_hole(thr: Thread, key: str) -> tuple[float, str]:
    """Default clearance hole d_h [m]: ISO 273 medium series, with its note."""
    if thr.hole_medium is None:
        raise InputError(
            f"no standard clearance hole for {thr.designation}; give hole", key=f"{key}.hole"
        )
    if thr.system == "unified":
        return thr.hole_medium, f"{thr.hole_medium * 1e3:.4g} mm (ASME B18.2.8 normal fit)"
    return thr.hole_medium, f"{thr.hole_medium * 1e3:g} mm (ISO 273 medium)"


def shank_in_clamp(shank: float, lK: float) -> float:
    """The plain shank as the bolt keeps it: cut to the clamp length ``lK`` within round-off.

    A shank clearly longer than ``lK`` is kept as it is, so that :func:`check_fit` refuses it.
    """
    return shank if shank > lK * (1 + 1e-9) else min(shank, lK)


def check_temperature(
    pm: PartMaterial,
    T: float,
    key: str,
    props: tuple[str, ...] = ("E", "alpha"),
    extrapolate: bool = False,
    part: str | None = None,
) -> None:
    """The catalog data of a part's material must cover ``T`` [K]: no silent extrapolation.

    ``props`` are the properties taken from the catalog (``"E"``, ``"alpha"``; one given in
    the file is not checked).  With ``extrapolate`` a property may lie at most
    :data:`~clampstack.catalog.COLD_MARGIN` below its data (the joint's temperature model
    extrapolates there and flags it in the notes).  ``key`` is the key the error names:
    the one the temperature came from; ``part`` names the part in the message.
    """
    for prop in pm.from_catalog(props):
        try:
            pm.material.check(prop, T, extrapolate, part)  # type: ignore[union-attr]
        except InputError as err:
            raise InputError(err.detail, key=key) from None


def temperature_key(own: str, given: frozenset[str], *fallbacks: str) -> str:
    """The file key a part's temperature came from: its own, else the keys it defaults to.

    ``own`` (``clamped[2].temperature``), then ``fallbacks`` (a nut takes the bolt's), then
    ``service.temperature`` and ``service.assembly_temperature`` (the service temperature's
    default); the first one the file sets.  ``own`` when none is set.
    """
    for key in (own, *fallbacks, "service.temperature", "service.assembly_temperature"):
        if key in given:
            return key
    return own


def check_layer(layer: LayerSpec, d: float) -> None:
    """A plate, sleeve or washer must fit on a bolt of diameter ``d`` [m]."""
    key = layer.key
    if layer.kind == "washer":
        if layer.hole < d * 0.999:
            raise InputError(
                f"inner diameter {layer.hole * 1e3:g} mm is smaller than the bolt ({d * 1e3:g} mm)",
                key=f"{key}.inner_diameter",
            )
        if layer.outer_diameter is None or layer.outer_diameter <= layer.hole:
            raise InputError(
                "outer diameter must exceed the inner diameter", key=f"{key}.outer_diameter"
            )
        return
    if layer.outer_diameter is not None and layer.outer_diameter <= layer.hole:
        raise InputError("outer diameter must exceed the hole", key=f"{key}.outer_diameter")
    if layer.kind == "sleeve" and layer.outer_diameter is None:
        raise InputError("a sleeve needs its outer_diameter", key=f"{key}.outer_diameter")
    if layer.hole <= d * 0.999:
        raise InputError(
            f"hole {layer.hole * 1e3:g} mm is smaller than the bolt ({d * 1e3:g} mm)",
            key=f"{key}.hole",
        )


def check_fit(spec: JointSpec, given: frozenset[str] = frozenset()) -> None:
    """The parts of a joint must fit together (InputError naming the key that does not).

    Layers on the bolt, the bolt's reach (through the clamp length and the nut, or
    into the tapped hole by at least two threads), the plain shank inside the clamp
    length, the bearing faces wider than the holes they sit on, and the materials'
    temperature data at the service and assembly temperatures.  ``given`` (key
    paths the file set) chooses which key an error names.
    """
    thr, b = spec.bolt.thread, spec.bolt
    for layer in spec.layers:
        check_layer(layer, thr.d)
    lK = spec.clamp_length
    T_asm = spec.service.assembly_temperature
    if spec.tapped_hole is not None:
        t = spec.tapped_hole
        available = b.length - lK
        if available <= 0:
            raise InputError(
                f"bolt length {b.length * 1e3:g} mm does not reach through the clamp length "
                f"{lK * 1e3:g} mm",
                key="bolt.length",
            )
        if t.engagement > available * (1 + 1e-9):
            raise InputError(
                f"engagement {t.engagement * 1e3:g} mm is longer than the bolt reaches "
                f"({available * 1e3:g} mm beyond the clamp length)",
                key="tapped_hole.engagement",
            )
        if t.engagement < 2 * thr.P:
            raise InputError(
                f"engagement {t.engagement * 1e3:g} mm is less than two threads",
                key="tapped_hole.engagement",
            )
        check_temperature(
            t.material,
            t.temperature,
            temperature_key("tapped_hole.temperature", given),
            ("E",),
            True,
            "tapped hole",
        )
        check_temperature(
            t.material, T_asm, "service.assembly_temperature", ("E",), True, "tapped hole"
        )
    else:
        nut = spec.nut
        assert nut is not None
        if b.head != "stud" and b.length < lK + nut.height * (1 - 1e-9):
            raise InputError(
                f"bolt length {b.length * 1e3:g} mm is shorter than clamp length plus nut "
                f"({(lK + nut.height) * 1e3:g} mm)",
                key="bolt.length",
            )
        check_temperature(
            nut.material,
            nut.temperature,
            temperature_key("nut.temperature", given, "bolt.temperature"),
            ("E",),
            True,
            "nut",
        )
        check_temperature(nut.material, T_asm, "service.assembly_temperature", ("E",), True, "nut")
    if b.shank_length > lK * (1 + 1e-9):
        raise InputError(
            f"the plain shank ({b.shank_length * 1e3:g} mm) is longer than the clamp length "
            f"({lK * 1e3:g} mm): the thread would not reach the "
            f"{'tapped hole' if spec.tapped else 'nut'}; choose a shorter bolt or give shank_length",
            key="bolt.shank_length" if "bolt.shank_length" in given else "bolt.length",
        )
    if b.shank_diameter is not None and b.shank_diameter >= thr.d:
        raise InputError(
            "a reduced shank must be thinner than the thread", key="bolt.shank_diameter"
        )
    if b.shank_diameter is not None and b.shank_length <= 0:
        raise InputError("a reduced shank needs shank_length", key="bolt.shank_length")
    if b.bearing_diameter <= spec.layers[0].hole:
        raise InputError(
            f"bearing diameter {b.bearing_diameter * 1e3:.4g} mm is not larger than the hole "
            f"{spec.layers[0].hole * 1e3:.4g} mm under the head",
            key="bolt.bearing_diameter",
        )
    if spec.nut is not None and spec.nut.bearing_diameter <= spec.layers[-1].hole:
        raise InputError(
            f"bearing diameter {spec.nut.bearing_diameter * 1e3:.4g} mm is not larger than the "
            f"hole {spec.layers[-1].hole * 1e3:.4g} mm under the nut",
            key="nut.bearing_diameter",
        )
    both = ("E", "alpha")
    check_temperature(
        b.material, b.temperature, temperature_key("bolt.temperature", given), both, True, "bolt"
    )
    check_temperature(b.material, T_asm, "service.assembly_temperature", both, True, "bolt")
    for layer in spec.layers:
        part = f"{layer.kind} {layer.name!r}"
        own = f"{layer.key}.temperature" if layer.key else "service.temperature"
        check_temperature(
            layer.material, layer.temperature, temperature_key(own, given), both, True, part
        )
        check_temperature(layer.material, T_asm, "service.assembly_temperature", both, True, part)


def with_defaults(spec: S, notes: dict[str, str]) -> S:
    """``spec`` (a joint or flange spec) with the printed notes in ``notes`` replaced or added."""
    kept = tuple((k, v) for k, v in spec.defaults if k not in notes)
    return replace(spec, defaults=kept + tuple(notes.items()))
