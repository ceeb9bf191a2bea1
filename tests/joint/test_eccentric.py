"""Eccentric clamping and loading: VDI 2230-1's linear relations and the contact past opening.

Sources beside each check.  Most checks here are consistency checks of the model with
independent routes (numerical integration, a discrete row of springs solved by an active
set written in this file, the kern of a section from elementary mechanics); they are
labelled so.
"""

from __future__ import annotations

import math
from pathlib import Path

import numpy as np
import pytest
from scipy.integrate import quad

from clampstack.errors import InputError
from clampstack.inputs.joint import joint_from_data
from clampstack.joint.analysis import analyse
from clampstack.joint.eccentric import (
    EccentricJoint,
    Interface,
    bolt_bending_stress,
    cone_body_inertia,
)

# springs of an M12 bracket foot (SI), roughly those of examples/bracket-on-column-face.toml
DS, DP, BETA = 1.68e-9, 3.44e-10, 6.54e-6


def _joint(s=0.008, a=0.030, u=0.030, interface=None, n=0.5) -> EccentricJoint:
    return EccentricJoint(DS, DP, BETA, n, s, a, u, interface or Interface.rectangle(0.04, 0.06))


# --------------------------------------------------------------------------- the formulas


def test_cone_inertia_is_the_integrated_bending_resilience_of_a_solid_cone():
    # consistency check: l_V / I_V equals the integral of dz / I(z), I = pi D(z)^4 / 64
    dW, DA, t = 0.0166, 0.0368, 0.504
    lV = (DA - dW) / (2 * t)
    inertia = cone_body_inertia(dW, DA, 2 * lV, t, tapped=False)  # two full cones, no sleeve
    flex, _ = quad(lambda z: 64 / (math.pi * (dW + 2 * t * z) ** 4), 0, lV)
    assert inertia == pytest.approx(2 * lV / (2 * flex), rel=1e-12)
    # with a sleeve: l_K longer than the cones
    I2 = cone_body_inertia(dW, DA, 3 * lV, t, tapped=False)
    sleeve = lV / (math.pi * DA**4 / 64)
    assert I2 == pytest.approx(3 * lV / (2 * flex + sleeve), rel=1e-12)


def test_vdi_resiliences_and_load_factor():
    # VDI 2230-1:2015, 5.1.2.3 and 5.3.2 (from memory), the relations written out by hand
    j = _joint()
    dPs = DP + 0.008**2 * BETA
    dPss = DP + 0.008 * 0.030 * BETA
    assert j.dP_star == pytest.approx(dPs) and j.dP_2star == pytest.approx(dPss)
    assert j.phi_en == pytest.approx(0.5 * dPss / (DS + dPs))
    assert j.phi_m == pytest.approx(0.5 * 0.008 * BETA / (DS + dPs))


def test_opening_clamp_load_is_where_navier_pressure_vanishes():
    # consistency check: the residual clamp load F_K acts with the moment of bolt and load;
    # at F_K = F_Kab the linear pressure P/A + M u / I is zero at the edge u
    j = _joint()
    i = j.interface
    FA, MB = 12e3, 35.0
    FK = j.opening_clamp_load(FA, MB)
    FS = FK + FA
    M = FS * j.s - FA * j.a - MB
    assert FK / i.area + M * j.u / i.second_moment == pytest.approx(0, abs=1e-6 * FK / i.area)


def test_bending_stress_is_vdi_sigma_SAb_without_a_moment():
    # VDI 2230-1:2015, 5.5.3 (from memory): the bending part of sigma_SAb
    # (1/Phi - s/a)(l_K/l_ers)(E_S/E_P)(pi a d_S^3/(8 I_Bers)) Phi F_A / A_S
    j = _joint()
    FA, ES, EP, lK, lers, dS = 8e3, 205e9, 210e9, 0.020, 0.024, 0.0104
    Ibers = lK / (EP * BETA)
    FSA = j.phi_en * FA
    gamma = BETA * (FA * j.a - FSA * j.s)
    AS = math.pi * dS**2 / 4
    vdi = (1 / j.phi_en - j.s / j.a) * (lK / lers) * (ES / EP)
    vdi *= math.pi * j.a * dS**3 / (8 * Ibers) * j.phi_en * FA / AS
    assert bolt_bending_stress(gamma, ES, dS, lers) == pytest.approx(vdi, rel=1e-12)


# --------------------------------------------------------------------------- contact model


def test_contact_model_reproduces_the_linear_relations_while_closed():
    # consistency check: the spring model, forced through its contact solve below the
    # opening load, gives Phi_en* and Phi_m* of VDI 2230-1 to round-off
    j = _joint()
    FV = 35e3
    for FA, MB in ((5e3, 0.0), (12e3, 40.0), (0.0, 150.0)):
        st = j._follow(FV, FA, MB, 0.0)
        FS, FK = j.linear(FV, FA, MB)
        assert not st.opened
        assert st.bolt_load == pytest.approx(FS, rel=1e-9)
        assert st.clamp_load == pytest.approx(FK, rel=1e-9)


def test_opening_point_of_the_contact_model_is_vdi_opening_load():
    j = _joint()
    FV = 35e3
    FAab = j.opening_ratio(FV, 1.0, 0.0)
    assert not j.state(FV, FAab * (1 - 1e-6), 0.0).opened
    st = j.state(FV, FAab * (1 + 1e-3), 0.0)
    assert st.opened and st.model == "contact model"
    assert st.bolt_load == pytest.approx(j.linear(FV, FAab, 0.0)[0], rel=1e-3)


def _discrete(j: EccentricJoint, FV: float, FA: float, MB: float, N: int):
    """An independent route: N compression-only springs across the interface, active set.

    The same model as EccentricJoint (bolt path, elastic core, bed), assembled as a dense
    linear system in (F_S, w, theta) with the springs in contact, iterated until the set
    of springs in contact no longer changes.
    """
    i = j.interface
    x = (np.arange(N) + 0.5) / N * i.length - i.half
    k = j.bed_stiffness * i.area / N  # each spring carries its strip of a rectangle
    path, core_a, core_b = j._parts()
    s, a = j.s, j.a

    def solve(F_A, M_B, F_S0, ref, active):
        # unknowns F_S, w, theta; P = sum k (w + th x), M = sum k (w + th x) x over active
        ka, kx, kxx = k * active.sum(), k * x[active].sum(), k * (x[active] ** 2).sum()
        A = np.array(
            [
                # P - (F_S - F_A) = 0
                [-1.0, ka, kx],
                # M - (F_S s - F_A a - M_B) = 0
                [-s, kx, kxx],
                # (F_S - F_S0) path + core_a P + s core_b M + w + th s = ref
                [path, core_a * ka + s * core_b * kx + 1, core_a * kx + s * core_b * kxx + s],
            ]
        )
        rhs = np.array([-F_A, -F_A * a - M_B, ref + F_S0 * path])
        return np.linalg.solve(A, rhs)

    def settle(F_A, M_B, F_S0, ref):
        active = np.ones(N, bool)
        for _ in range(200):
            FS, w, th = solve(F_A, M_B, F_S0, ref, active)
            new = (w + th * x) > 0
            if (new == active).all():
                return FS, w, th, active
            active = new
        raise AssertionError("active set did not settle")

    # assembly: find the bed state under F_V at s (bolt force given): solve P, M directly
    active = np.ones(N, bool)
    for _ in range(200):
        ka, kx, kxx = k * active.sum(), k * x[active].sum(), k * (x[active] ** 2).sum()
        w0, th0 = np.linalg.solve([[ka, kx], [kx, kxx]], [FV, FV * s])
        new = (w0 + th0 * x) > 0
        if (new == active).all():
            break
        active = new
    P0, M0 = FV, FV * s
    ref = core_a * P0 + s * core_b * M0 + w0 + th0 * s
    FS, w, th, act = settle(FA, MB, FV, ref)
    return FS, FS - FA, act.sum() / N * i.length


@pytest.mark.parametrize("FA,MB", [(25e3, 0.0), (60e3, 0.0), (10e3, 400.0), (200e3, 0.0)])
def test_contact_model_against_a_row_of_springs(FA, MB):
    # consistency check against an independent discrete solve (midpoint springs: O(1/N^2))
    j = _joint()
    FV = 35e3
    st = j.state(FV, FA, MB)
    assert st.opened
    FS, FK, width = _discrete(j, FV, FA, MB, 4000)
    assert st.bolt_load == pytest.approx(FS, rel=2e-5)
    assert st.clamp_load == pytest.approx(FK, rel=5e-5)
    assert st.contact_width == pytest.approx(width, abs=2 * j.interface.length / 4000)


def test_bolt_load_past_opening_is_above_the_linear_line_and_tends_to_the_lever():
    j = _joint()
    FV = 35e3
    loads = np.linspace(0, 400e3, 41)
    FS, FK, cw = j.curve(FV, 1.0, 0.0, loads)
    assert np.all(np.diff(FS) > 0) and np.all(np.diff(cw) <= 1e-12)
    lin = FV + j.phi_en * loads
    assert np.all(FS >= lin - 1e-6 * FV)
    # equilibrium of the lifted body: the interface resultant P acts at x_P = M/P, and
    # F_S (s - x_P) = F_A (a - x_P) (statics); the lever about the far edge bounds it below
    st = j.state(FV, 400e3, 0.0)
    lever_edge = 400e3 * (j.a + j.interface.half) / (j.s + j.interface.half)
    assert st.bolt_load > lever_edge
    xP = st.contact[0] + st.contact_width / 3  # linear pressure from zero: resultant at 1/3
    assert st.bolt_load == pytest.approx(400e3 * (j.a - xP) / (j.s - xP), rel=1e-9)


def test_middle_third_rule_of_a_rectangle_and_kern_of_a_circle():
    # elementary mechanics of a no-tension section (the kern; e.g. Timoshenko & Gere,
    # Mechanics of Materials, eccentric compression; from memory): a rectangle stays in
    # full contact for e <= c/6 and beyond carries on 3 (c/2 - e); a circle's kern is D/8
    j = _joint()
    c = j.interface.length
    for e in (0.1 * c, c / 6 * (1 - 1e-9), 0.25 * c, 0.4 * c):
        w, th = j.bed_inverse(10e3, 10e3 * e)
        lo, hi = j._contact(w, th)
        expected = c if e <= c / 6 else 3 * (c / 2 - e)
        assert hi - lo == pytest.approx(expected, rel=1e-9)
    D = 0.05
    jc = _joint(s=0.0, a=0.0, u=D / 2, interface=Interface.circle(D))
    x, b = jc.interface.profile()
    area = float(np.sum(0.5 * (b[1:] + b[:-1]) * np.diff(x)))  # trapezoid rule
    assert area == pytest.approx(math.pi * D**2 / 4, rel=1e-4)
    for e, full in ((D / 8 * 0.99, True), (D / 8 * 1.02, False)):
        w, th = jc.bed_inverse(10e3, 10e3 * e)
        lo, hi = jc._contact(w, th)
        assert (hi - lo >= D * (1 - 1e-9)) is full


# --------------------------------------------------------------------------- the analysis


def _file(ecc=None, **service) -> dict:
    d = {
        "title": "bracket",
        "bolt": {"thread": "M12", "grade": "10.9", "length": "50 mm"},
        "tapped_hole": {"material": "steel", "engagement": "18 mm"},
        "clamped": [{"material": "steel", "thickness": "20 mm"}],
        "tightening": {"thread_friction": "0.10..0.16", "head_friction": "0.10..0.16"},
        "service": {"axial_load": "0..6 kN", **service},
    }
    if ecc is not None:
        d["eccentricity"] = ecc
    return d


RECT = {"width": "40 mm", "length": "60 mm"}


def test_centred_eccentricity_is_the_concentric_joint():
    # consistency check: s_sym = a = 0 gives the concentric joint's loads to round-off
    r0 = analyse(joint_from_data(_file()))
    r1 = analyse(joint_from_data(_file({"interface": RECT})))
    assert r1.load_factor == pytest.approx(r0.load_factor, rel=1e-12)
    for s0, s1 in zip(r0.states, r1.states, strict=True):
        assert s1.bolt_min == pytest.approx(s0.bolt_min, rel=1e-12)
        assert s1.clamp_max == pytest.approx(s0.clamp_max, rel=1e-12)
    names = {c.name for c in r1.checks}
    assert "opening" in names and "separation" not in names


def test_eccentric_check_and_json():
    r = analyse(
        joint_from_data(_file({"bolt_offset": "8 mm", "load_offset": "30 mm", "interface": RECT}))
    )
    d = r.to_dict()
    e = d["eccentric"]
    assert d["load_factor"] == e["load_factor"] == r.load_factor
    assert e["interface_area_mm2"] == pytest.approx(2400)
    assert e["interface_second_moment_mm4"] == pytest.approx(40 * 60**3 / 12)
    # F_Kab by hand: 6000 N (30 - 8) 30 / (720000/2400 + 8 x 30) = 7333 N
    assert d["service"]["opening_clamp_load_N"] == pytest.approx(6000 * 22 * 30 / 540)
    op = {c.name: c for c in r.checks}["opening"]
    assert op.limit == pytest.approx(7.3333, rel=1e-4) and op.passed
    assert d["service"]["separation_load_N"] is None
    fat = {c.name: c for c in r.checks}["fatigue"]
    assert "bending" in fat.detail
    assert fat.value == pytest.approx(
        (r.states[3].bolt_min - r.states[4].bolt_min) / (2 * 84.3e-6) / 1e6
        + e["bending_amplitude_MPa"],
        rel=1e-3,
    )


def test_opened_joint_fails_opening_and_uses_the_contact_model():
    r = analyse(
        joint_from_data(
            _file(
                {"bolt_offset": "8 mm", "load_offset": "30 mm", "interface": RECT},
                axial_load="0..30 kN",
            )
        )
    )
    e = r.eccentric
    assert e["opened"] and e["contact"]["model"] == "contact model"
    assert not {c.name: c for c in r.checks}["opening"].passed
    assert any("contact model" in n and "VDI 2230-1 linear" in n for n in r.notes)


def test_bolt_outside_the_core_opens_at_assembly():
    r = analyse(
        joint_from_data(
            _file({"bolt_offset": "14 mm", "interface": {"width": "40 mm", "length": "60 mm"}})
        )
    )
    op = {c.name: c for c in r.checks}["opening"]
    assert r.eccentric["open_at_assembly"] and op.unit == "mm" and not op.passed
    assert op.limit == pytest.approx(60 / 6, rel=1e-9)  # the kern c/6 of the rectangle


def test_moment_only_and_given_interface():
    r = analyse(
        joint_from_data(
            _file(
                {
                    "interface": {"area": "2400 mm^2", "second_moment": "720000 mm^4"},
                    "edge_distance": "30 mm",
                },
                axial_load="0 kN",
                bending_moment="0..120 N*m",
            )
        )
    )
    e = r.eccentric
    assert e["opening_load_N"] is None and e["opening_moment_Nm"] > 0
    assert {c.name for c in r.checks} >= {"opening", "fatigue"}


@pytest.mark.parametrize(
    "ecc,service,key",
    [
        ({"bolt_offset": "25 mm", "interface": RECT}, {}, "eccentricity.bolt_offset"),
        ({"edge_distance": "31 mm", "interface": RECT}, {}, "eccentricity.edge_distance"),
        ({"interface": {"width": "40 mm"}}, {}, "eccentricity.interface"),
        (
            {"interface": {"area": "2400 mm^2", "second_moment": "7e5 mm^4"}},
            {},
            "eccentricity.edge_distance",
        ),
        (None, {"bending_moment": "50 N*m"}, "service.bending_moment"),
    ],
)
def test_bad_eccentric_input(ecc, service, key):
    with pytest.raises(InputError) as err:
        joint_from_data(_file(ecc, **service))
    assert err.value.key == key


# --------------------------------------------------------------------------- n from the table


def test_load_introduction_from_the_joint_type():
    from clampstack.catalog.load_introduction import load_introduction_factor

    # table points (VDI 2230-1:2015, 5.2.2.2, values from memory) and linear interpolation
    assert load_introduction_factor(1, 0.0, 0.0)[0] == pytest.approx(0.70)
    assert load_introduction_factor(1, 0.2, 0.0)[0] == pytest.approx(0.5 * (0.55 + 0.30))
    assert load_introduction_factor(6, 0.9, 0.9)[0] == pytest.approx(0.05)
    d = _file()
    d["load_introduction"] = {"joint_type": 2, "load_distance": "2 mm"}  # a_k/h = 0.1
    spec = joint_from_data(d)
    assert spec.service.load_height == pytest.approx(0.46)
    assert any("SV2" in v for k, v in spec.defaults if k == "service.load_height")
    d["service"]["load_height"] = 0.3
    assert joint_from_data(d).service.load_height == 0.3
    d["load_introduction"]["joint_type"] = 7
    with pytest.raises(InputError) as err:
        joint_from_data(d)
    assert err.value.key == "load_introduction.joint_type"


def test_bolt_outside_the_core_away_from_the_edge_is_judged_by_the_contact_model():
    # the cover segment with the screw 5 mm off a 28 mm flange: core I_BT/(A_D h) = 4.67 mm
    ecc = {
        "bolt_offset": "5 mm",
        "load_offset": "12 mm",
        "edge_distance": "14 mm",
        "interface": {"width": "56 mm", "length": "28 mm"},
    }
    r = analyse(joint_from_data(_file(ecc, axial_load="0..1.5 kN")))
    e = r.eccentric
    assert e["open_at_assembly"] and not e["edge_open_at_assembly"]
    assert e["opening_basis"] == "contact model" and e["opening_clamp_load_N"] is None
    op = {c.name: c for c in r.checks}["opening"]
    lam = e["opening_load_ratio"]
    assert op.value == pytest.approx(lam) and op.limit == 1.0 and op.passed
    ej = r.eccentric_joint
    FV = r.states[2].bolt_min
    assert ej.edge_in_contact(FV, lam * 0.999 * 1.5e3, 0.0)
    assert not ej.edge_in_contact(FV, lam * 1.001 * 1.5e3, 0.0)


def test_eccentric_report_and_figures(tmp_path):
    from clampstack.inputs.files import load_toml
    from clampstack.report.joint import render_joint_report

    path = tmp_path / "b.toml"
    path.write_text(
        (Path(__file__).parents[2] / "examples" / "bracket-on-column-face.toml").read_text()
    )
    doc = load_toml(str(path))
    files = render_joint_report(doc, analyse(joint_from_data(doc.data)))
    html = files["b.html"]
    assert "Eccentric clamping and loading" in html and "F<sub>Kab</sub>" in html
    assert "beyond it (shaded) the contact model" in html  # figure 3's caption
    from clampstack.plots import bolt_load_plot, joint_diagram

    r = analyse(joint_from_data(doc.data))
    gids = {a.get_gid() for a in bolt_load_plot(r).findobj()}
    assert {"opening", "contact-width", "bolt-linear", "opening-clamp-load"} <= gids
    assert "opening" in {a.get_gid() for a in joint_diagram(r).findobj()}


@pytest.mark.parametrize(
    "load,offsets,moment",
    [
        ("1..7 kN", ("8 mm", "30 mm"), "0..20 N*m"),
        ("0..30 kN", ("8 mm", "30 mm"), "0..20 N*m"),
        ("0..60 kN", ("0 mm", "0 mm"), "0 N*m"),  # separates on the bolt's line
    ],
)
def test_sweep_at_the_service_temperature_is_check(load, offsets, moment):
    # consistency check: the sweep's vectorised evaluation (closed form, contact model where
    # the interface opens) gives check's margins at the file's service temperature
    from clampstack.studies.sweep import sweep

    ecc = {"bolt_offset": offsets[0], "load_offset": offsets[1], "interface": RECT}
    spec = joint_from_data(_file(ecc, axial_load=load, bending_moment=moment))
    r = analyse(spec)
    sw = sweep(spec, 273.15 - 20, 273.15 + 100, step=20.0)
    i = int(np.argmin(np.abs(sw.temperature - spec.service.temperature)))
    assert sw.temperature[i] == pytest.approx(spec.service.temperature)
    for c in r.checks:
        if c.name in sw.margins:
            m = sw.margins[c.name][i]
            assert (m if np.isfinite(m) else math.inf) == pytest.approx(
                c.margin, rel=1e-9, abs=1e-12
            ), c.name
    assert set(sw.margins) >= {"opening", "fatigue"} and "separation" not in sw.margins


def test_size_designs_of_an_eccentric_joint_pass_check():
    # consistency check: each design size lists, rebuilt and analysed, passes check with the
    # governing margin size reports (the deformation body follows the candidate's bolt)
    from clampstack.catalog import thread
    from clampstack.inputs.files import load_toml
    from clampstack.studies.size import candidate_spec, size

    doc = load_toml(str(Path(__file__).parents[2] / "examples" / "bracket-on-column-face.toml"))
    base = joint_from_data(doc.data)
    res = size(base)
    assert res.designs
    for d in res.designs[:3]:
        spec = candidate_spec(base, thread(d.thread), d.grade, d.method)
        r = analyse(spec)
        assert r.ok, d
        assert spec.eccentric.bending_inertia != base.eccentric.bending_inertia or d.thread == "M16"
        gov = {c.name: c for c in r.checks}[d.governing]
        assert gov.margin == pytest.approx(d.margin, rel=1e-9, abs=1e-12)


@pytest.mark.parametrize("load", ["1..7 kN", "0..30 kN"])
def test_scatter_chain_at_the_minimum_preload_is_check(load):
    # consistency check: one sample at the friction and tool extremes of F_M,min gives
    # check's minimum residual clamp load (the contact model where the interface opens)
    from clampstack.studies.scatter import evaluate, make_chain

    ecc = {"bolt_offset": "8 mm", "load_offset": "30 mm", "interface": RECT}
    spec = joint_from_data(_file(ecc, axial_load=load))
    r = analyse(spec)
    chain = make_chain(spec, {})
    tr = spec.tightening
    x = {
        "thread_friction": np.array([tr.thread_friction[1]]),
        "head_friction": np.array([tr.head_friction[1]]),
        "torque_factor": np.array([1 - tr.torque_tolerance]),
    }
    out = evaluate(chain, x, 1)
    assert out["assembly_preload"][0] == pytest.approx(r.assembly_min, rel=1e-9)
    assert out["residual_clamp_load"][0] == pytest.approx(r.residual_clamp_min, rel=1e-9)
    opening = {c.name: c for c in r.checks}["opening"]
    assert bool(out["opening"][0]) is (not opening.passed)


# --------------------------------------------------------------------------- regressions
# (found by an independent review of the module; each failed before its fix)


@pytest.mark.parametrize("moment", [None, "1 N*m"])
def test_load_on_the_bolt_line_separates_like_a_concentric_joint(moment):
    extra = {} if moment is None else {"bending_moment": moment}
    r = analyse(joint_from_data(_file({"interface": RECT}, axial_load="0..60 kN", **extra)))
    top = next(s for s in r.states if s.key == "service_max")
    if moment is None:
        # past F_A,sep the bolt carries the load alone, as without [eccentricity]
        assert top.bolt_min == pytest.approx(60e3) and top.clamp_min == 0.0
        assert any("separate" in n for n in r.notes)
    assert not {c.name: c for c in r.checks}["opening"].passed


@pytest.mark.parametrize("a", [0.0005, 0.002])
def test_large_loads_near_the_bolt_line_converge(a):
    j = _joint(s=0.0, a=a)
    for FA in (60e3, 100e3, 250e3, 1e6):
        st = j.state(30e3, FA, 0.0)
        assert st.bolt_load >= FA and st.clamp_load >= 0
        # statics of the lifted body: F_S s - F_A a = P x_P with the resultant inside contact
        xP = (st.bolt_load * j.s - FA * a) / st.clamp_load
        assert st.contact[0] - 1e-9 <= xP <= st.contact[1] + 1e-9


def test_residual_requirement_adds_the_clamp_load_against_opening():
    # VDI 2230-1 R2: F_Kerf = max(F_KQ, F_KP + F_KA); F_KP 28.213 kN + F_Kab 7.333 kN
    d = _file({"bolt_offset": "8 mm", "load_offset": "30 mm", "interface": RECT})
    d["requirements"] = {"residual_clamp_load": "28.213 kN"}
    r = analyse(joint_from_data(d))
    c = {c.name: c for c in r.checks}["residual_clamp_load"]
    assert c.limit == pytest.approx(28.213 + 6000 * 22 * 30 / 540 / 1e3)
    assert not c.passed and r.required_assembly_min > r.assembly_min


def test_an_edge_that_does_not_open_needs_no_clamp_load():
    d = _file(
        {
            "bolt_offset": "8 mm",
            "load_offset": "30 mm",
            "edge_distance": "-30 mm",
            "interface": RECT,
        },
        axial_load="2..6 kN",
    )
    d["requirements"] = {"residual_clamp_load": "10 kN"}
    r = analyse(joint_from_data(d))
    assert r.eccentric["opening_clamp_load_N"] == 0.0
    assert r.required_clamp_load == pytest.approx(10e3)


@pytest.mark.parametrize(
    "service", [{"bending_moment": "-500..50 N*m"}, {"axial_load": "-60..6 kN"}]
)
def test_the_minimum_load_may_open_the_other_edge(service):
    ecc = {"bolt_offset": "0 mm" if "bending_moment" in service else "8 mm", "interface": RECT}
    if "axial_load" in service:
        ecc["load_offset"] = "30 mm"
    r = analyse(joint_from_data(_file(ecc, **service)))
    e = r.eccentric
    assert e["edge_distance_mm"] == pytest.approx(-30.0)  # the edge the minimum load opens
    assert e["opened"] and not {c.name: c for c in r.checks}["opening"].passed
    assert any("opens at its edge (-30 mm)" in n for n in r.notes)
