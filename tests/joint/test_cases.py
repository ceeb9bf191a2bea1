"""Load cases ([[case]]): the check chain per case, the governing values, the studies.

Consistency checks: a case is the joint with its [service] state replaced, so each case
must give what the same joint file with that [service] gives; the governing values are the
worst of the cases.
"""

from __future__ import annotations

import copy

import pytest
from click.testing import CliRunner

from clampstack.cli import main
from clampstack.errors import InputError
from clampstack.inputs.joint import joint_from_data
from clampstack.joint.analysis import analyse
from clampstack.joint.cases import case_spec


def _file(cases=None, **service) -> dict:
    d = {
        "title": "foot bolt",
        "bolt": {"thread": "M12", "grade": "10.9", "length": "60 mm"},
        "nut": {},
        "washer": [{}, {"side": "nut"}],
        "clamped": [
            {
                "name": "foot",
                "material": "aluminium-6082-T6",
                "thickness": "20 mm",
                "temperature": "100 degC",
            },
            {"name": "frame", "material": "steel", "thickness": "16 mm"},
        ],
        "tightening": {"torque": "70 N*m", "lubricant": "phosphated-oiled"},
        "service": {"axial_load": "0..6 kN", "temperature": "60 degC", **service},
        "requirements": {"residual_clamp_load": "8 kN"},
    }
    if cases is not None:
        d["case"] = cases
    return d


CASES = [
    {"name": "cold start", "temperature": "-40 degC"},
    {"name": "hot running", "temperature": "120 degC"},
    {"name": "proof test", "axial_load": "0..15 kN", "temperature": "20 degC"},
]


def test_each_case_is_the_joint_with_that_service_state():
    r = analyse(joint_from_data(_file(CASES)))
    assert [c.name for c in r.cases] == ["cold start", "hot running", "proof test"]
    # the proof test is the file with that [service] (at 20 degC: every part at 20 degC)
    alone = _file(axial_load="0..15 kN", temperature="20 degC")
    alone["clamped"][0]["temperature"] = "20 degC"
    ref = analyse(joint_from_data(alone))
    proof = r.cases[2].result
    assert proof.residual_clamp_min == pytest.approx(ref.residual_clamp_min, rel=1e-12)
    assert proof.bolt_load_max == pytest.approx(ref.bolt_load_max, rel=1e-12)


def test_parts_keep_their_rise_in_proportion():
    # the foot is at 100 degC when the joint is at 60 degC (assembly 20): rise ratio 2
    spec = joint_from_data(_file(CASES))
    hot = case_spec(spec, spec.cases[1])  # 120 degC: the foot at 20 + 2 x 100 = 220 degC
    foot = next(x for x in hot.layers if x.name == "foot")
    assert foot.temperature - 273.15 == pytest.approx(220.0)
    assert hot.bolt.temperature - 273.15 == pytest.approx(120.0)


def test_governing_values_are_the_worst_case():
    r = analyse(joint_from_data(_file(CASES)))
    by_case = {cr.name: {c.name: c for c in cr.result.checks} for cr in r.cases}
    for c in r.checks:
        gc = c.extra["governing_case"]
        assert c.margin == min(by_case[n][c.name].margin for n in by_case)
        assert by_case[gc][c.name].margin == c.margin
    assert r.ok == all(cr.result.ok for cr in r.cases)
    assert r.required_assembly_min == max(cr.result.required_assembly_min for cr in r.cases)
    d = r.to_dict()
    assert d["governing_case"] == r.governing_case
    assert [c["name"] for c in d["cases"]] == [c["name"] for c in CASES]
    assert set(d["cases"][0]) >= {"name", "ok", "preload", "service", "checks"}
    assert all("governing_case" in c for c in d["checks"])


def test_a_case_equal_to_the_service_state_changes_nothing():
    plain = analyse(joint_from_data(_file()))
    same = analyse(joint_from_data(_file([{"name": "as [service]"}])))
    assert [c.margin for c in same.checks] == pytest.approx(
        [c.margin for c in plain.checks], rel=1e-12
    )
    assert same.torque == plain.torque


@pytest.mark.parametrize(
    "cases,key",
    [
        ([{"name": "a"}, {"name": "a"}], "case[2].name"),
        ([{"name": " "}], "case[1].name"),
        ([{"name": "m", "bending_moment": "10 N*m"}], "case[1].bending_moment"),
        ([{"name": "x", "pressure": "1 bar"}], "case[1]"),
    ],
)
def test_bad_cases(cases, key):
    with pytest.raises(InputError) as err:
        joint_from_data(_file(cases))
    assert err.value.key.startswith(key)


def test_sweep_and_scatter_say_which_case(tmp_path):
    import tomllib  # noqa: F401  (the file is written with the fuzz writer below)

    from tests.fuzz.test_fuzz_inputs import to_toml

    path = tmp_path / "cases.toml"
    path.write_text(to_toml(_file(copy.deepcopy(CASES))))
    res = CliRunner().invoke(main, ["sweep", str(path), "--temperature", "-40..120"])
    assert res.exit_code in (0, 1) and "(the governing case of check" in res.output
    res = CliRunner().invoke(
        main, ["scatter", str(path), "--samples", "500", "--case", "proof test"]
    )
    assert res.exit_code in (0, 1) and "Load case 'proof test' (--case)" in res.output
    res = CliRunner().invoke(main, ["sweep", str(path), "--temperature", "0..50", "--case", "x"])
    assert res.exit_code == 2 and "--case: no load case 'x'" in res.output


def test_size_designs_pass_every_case():
    from clampstack.catalog import thread
    from clampstack.studies.size import candidate_spec, size

    base = joint_from_data(_file(CASES))
    res = size(base)
    assert res.cases == ("cold start", "hot running", "proof test")
    for d in res.designs[:2]:
        r = analyse(candidate_spec(base, thread(d.thread), d.grade, d.method))
        assert r.ok and {c.name: c for c in r.checks}[d.governing].margin == pytest.approx(
            d.margin, rel=1e-9
        )


def test_part_temperatures_of_a_case():
    cases = [
        {"name": "sun on the foot", "part_temperatures": {"foot": "140 degC", "bolt": "80 degC"}}
    ]
    spec = joint_from_data(_file(cases))
    cs = case_spec(spec, spec.cases[0])
    assert next(x for x in cs.layers if x.name == "foot").temperature - 273.15 == pytest.approx(140)
    assert cs.bolt.temperature - 273.15 == pytest.approx(80)
    # the frame follows the joint (60 degC in [service])
    assert next(x for x in cs.layers if x.name == "frame").temperature - 273.15 == pytest.approx(60)
    for bad, key in (({"shoe": "20 degC"}, "shoe"), ({"bolt": "5 kN"}, "bolt")):
        with pytest.raises(InputError) as err:
            joint_from_data(_file([{"name": "x", "part_temperatures": bad}]))
        assert err.value.key == f"case[1].part_temperatures.{key}"
