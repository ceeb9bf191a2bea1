"""Bolt load and clamp load against the working load (joint network), against the analysis.

Closed forms (VDI 2230-1:2015, 5.3.1-5.3.2): while clamped F_S = F_V + Phi_n F_A and
F_K = F_V - (1 - Phi_n) F_A; the interface opens at F_A,sep = F_V / (1 - Phi_n); beyond
it the bolt carries F_A and the clamp load is zero.
"""

from __future__ import annotations

import numpy as np
import pytest

from clampstack.inputs.joint import joint_from_data, read_joint_file
from clampstack.joint import analyse
from clampstack.joint.curves import load_curve

REL = 1e-9


def _result(examples_dir, name):
    _, spec = read_joint_file(str(examples_dir / f"{name}.toml"))
    return analyse(spec)


@pytest.mark.parametrize(
    "name",
    ["m10-cover-screw-aluminium", "bolt-in-aluminium-sleeve-hot", "m16-through-bolt-alternating"],
)
def test_curve_passes_through_the_analysed_states(examples_dir, name):
    r = _result(examples_dir, name)
    st = {s.key: s for s in r.states}
    FA_lo, FA_hi = r.spec.service.axial_load
    for branch, pick in (("min", 0), ("max", 1)):
        c = load_curve(r, 41, branch)
        at = {float(f): i for i, f in enumerate(c.axial_load)}
        i0, ih = at[0.0], at[FA_hi]
        bolt0 = (st["temperature"].bolt_min, st["temperature"].bolt_max)[pick]
        clamp0 = (st["temperature"].clamp_min, st["temperature"].clamp_max)[pick]
        bolth = (st["service_max"].bolt_min, st["service_max"].bolt_max)[pick]
        clamph = (st["service_max"].clamp_min, st["service_max"].clamp_max)[pick]
        assert c.bolt_load[i0] == pytest.approx(bolt0, rel=REL)
        assert c.clamp_load[i0] == pytest.approx(clamp0, rel=REL)
        assert c.bolt_load[ih] == pytest.approx(bolth, rel=REL)
        assert c.clamp_load[ih] == pytest.approx(clamph, rel=REL)
        if FA_lo != FA_hi:
            i_lo = at[FA_lo]
            lo = st["service_min"]
            assert c.bolt_load[i_lo] == pytest.approx((lo.bolt_min, lo.bolt_max)[pick], rel=REL)


def test_curve_is_the_joint_diagram_with_the_exact_knee(examples_dir):
    r = _result(examples_dir, "m10-cover-screw-aluminium")
    c = load_curve(r, 61)
    phi = r.load_factor_service
    FV = c.preload
    assert c.separation_load == r.separation_load
    assert c.separation_load in set(c.axial_load.tolist())  # the knee is one of the points
    top = 1.5 * max(r.separation_load, r.spec.service.axial_load[1])
    assert c.axial_load[0] == 0.0 and c.axial_load[-1] == pytest.approx(top, rel=1e-12)
    assert np.all(np.diff(c.axial_load) > 0)
    clamped = c.axial_load <= r.separation_load
    FA = c.axial_load
    scale = FV
    np.testing.assert_allclose(c.bolt_load[clamped], FV + phi * FA[clamped], atol=1e-9 * scale)
    np.testing.assert_allclose(
        c.clamp_load[clamped], FV - (1 - phi) * FA[clamped], atol=1e-6 * scale
    )
    np.testing.assert_allclose(c.bolt_load[~clamped], FA[~clamped], rtol=1e-9)
    assert np.all(c.clamp_load[~clamped] == 0.0)
    k = int(np.flatnonzero(FA == r.separation_load)[0])
    assert c.clamp_load[k] == pytest.approx(0.0, abs=1e-6 * scale)
    assert c.bolt_load[k] == pytest.approx(r.separation_load, rel=1e-9)


def test_thermal_example_uses_the_service_temperature(examples_dir):
    # the sleeve example gains preload when hot: the curve starts from the hot preload
    r = _result(examples_dir, "bolt-in-aluminium-sleeve-hot")
    c = load_curve(r)
    st = {s.key: s for s in r.states}
    assert r.thermal_change != 0
    assert c.preload == pytest.approx(st["temperature"].clamp_min, rel=REL)
    assert c.temperature == r.spec.service.temperature
    assert c.separation_load == pytest.approx(c.preload / (1 - r.load_factor_service), rel=1e-9)


def test_max_branch_knee_and_range():
    data = {
        "bolt": {"thread": "M12", "grade": "10.9", "length": "60 mm", "head": "hex"},
        "nut": {},
        "clamped": [{"material": "steel", "thickness": "40 mm"}],
        "tightening": {"torque": "90 N*m", "thread_friction": "0.10..0.14"},
        "service": {"axial_load": "0..15 kN", "load_height": 1.0},
    }
    r = analyse(joint_from_data(data))
    hi = load_curve(r, 11, "max", up_to=3 * r.separation_load)
    assert hi.axial_load[-1] == pytest.approx(3 * r.separation_load)
    assert hi.separation_load == pytest.approx(hi.preload / (1 - r.load_factor_service), rel=1e-12)
    k = int(np.flatnonzero(hi.axial_load == hi.separation_load)[0])
    assert hi.clamp_load[k] == pytest.approx(0.0, abs=1e-6 * hi.preload)
    assert hi.bolt_load[-1] == pytest.approx(hi.axial_load[-1], rel=1e-9)


def test_bad_arguments(examples_dir):
    r = _result(examples_dir, "m10-cover-screw-aluminium")
    with pytest.raises(ValueError, match="branch"):
        load_curve(r, branch="middle")
    with pytest.raises(ValueError, match="n_points"):
        load_curve(r, n_points=1)
