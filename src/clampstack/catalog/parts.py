"""Standard part dimensions that the joint's defaults need: bearing faces, plain washers.

Small tables of ISO product standards, in mm as printed, each row from the
standard named beside it ("from memory" where recalled).  SI floats out (m).
"""

from __future__ import annotations

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


def washer_size(d: float) -> tuple[float, float]:
    """Default plain washer (thickness, outer diameter) [m] for a bolt of diameter d [m]."""
    key = round(d * 1e3, 3)
    if key in _ISO7089:
        h, od = _ISO7089[key]  # type: ignore[index]
        return h * 1e-3, od * 1e-3
    return 0.16 * d, 2.0 * d
