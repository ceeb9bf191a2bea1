"""Lubricants and coatings set both friction ranges; torque tool classes set the tolerance."""

from __future__ import annotations

import json
from pathlib import Path

import pytest
from click.testing import CliRunner

from clampstack.catalog.friction import friction_listing, lubricant, tool, tool_listing
from clampstack.cli import main
from clampstack.errors import InputError
from clampstack.inputs.joint import joint_from_data
from clampstack.joint.analysis import analyse
from clampstack.studies.scatter import scatter

EXAMPLES = Path(__file__).parent.parent / "examples"


def _joint(**tightening) -> dict:
    return {
        "title": "lubricated",
        "bolt": {"thread": "M12", "grade": "8.8", "length": "50 mm"},
        "nut": {},
        "clamped": [{"material": "steel", "thickness": "30 mm"}],
        "tightening": {"torque": "70 N*m", **tightening},
        "service": {"axial_load": "5 kN"},
    }


def test_catalog_rows_have_sources_and_sensible_ranges():
    _, rows = friction_listing()
    assert len(rows) >= 6 and all(r[-1] for r in rows)
    for key in ("mos2-paste", "zinc-flake-lubricated", "phosphated-oiled", "stainless-dry"):
        x = lubricant(key)
        assert 0 < x.thread[0] <= x.thread[1] < 1 and 0 < x.head[0] <= x.head[1] < 1
    # VDI 2230-1 Table A5 (from memory): MoS2 paste is the lowest class, dry stainless high
    assert lubricant("mos2-paste").thread[1] < lubricant("stainless-dry").thread[0]
    _, rows = tool_listing()
    assert len(rows) >= 5 and all(r[-1] for r in rows)
    assert tool("click-wrench").tolerance == pytest.approx(0.06)


def test_a_lubricant_sets_both_ranges_as_printed_defaults():
    spec = joint_from_data(_joint(lubricant="zinc-flake-lubricated"))
    assert spec.tightening.thread_friction == (0.09, 0.15)
    assert spec.tightening.head_friction == (0.09, 0.15)
    r = analyse(spec)
    d = dict(r.defaults)
    assert "lubricant zinc-flake-lubricated" in d["tightening.thread_friction"]
    assert r.to_dict()["tightening"]["lubricant"] == "zinc-flake-lubricated"


def test_a_tool_sets_the_torque_tolerance_and_the_preload_range():
    r = analyse(joint_from_data(_joint(thread_friction="0.10..0.14", tool="dial-wrench")))
    assert r.spec.tightening.torque_tolerance == pytest.approx(0.04)
    assert r.torque[2] == pytest.approx(70 * 1.04) and r.torque[1] == pytest.approx(70 * 0.96)
    assert "tool dial-wrench" in dict(r.defaults)["tightening.torque_tolerance"]
    # scatter samples the tool's tolerance as a uniform torque factor by default
    sr = scatter(r.spec, {}, 1000)
    assert "torque_factor" in sr.distributions and "0.96" in sr.distributions["torque_factor"]


@pytest.mark.parametrize(
    ("tightening", "key", "words"),
    [
        ({"lubricant": "mos2-paste", "thread_friction": 0.1}, "tightening.lubricant", "not both"),
        ({"lubricant": "zink flake lubricated"}, "tightening.lubricant", "did you mean"),
        ({"tool": "click-wrench", "torque_tolerance": 0.05}, "tightening.tool", "not both"),
        ({"tool": "torque stick"}, "tightening.tool", "unknown torque tool"),
    ],
)
def test_bad_combinations_are_refused(tightening, key, words):
    with pytest.raises(InputError) as err:
        joint_from_data(_joint(**tightening))
    assert err.value.key == key and words in str(err.value)


def test_a_flange_takes_them_too_and_shows_its_defaults(tmp_path):
    text = (EXAMPLES / "pump-outlet-flange-8-bolts.toml").read_text(encoding="utf-8")
    text = "\n".join(ln for ln in text.splitlines() if "_friction =" not in ln)
    text = text.replace(
        "[tightening]", '[tightening]\nlubricant = "mos2-paste"\ntool = "nutrunner"'
    )
    p = tmp_path / "flange.toml"
    p.write_text(text, encoding="utf-8")
    res = CliRunner().invoke(main, ["flange", str(p), "--json"])
    assert res.exit_code in (0, 1), res.output
    out = json.loads(res.stdout)
    assert out["tightening"]["lubricant"] == "mos2-paste"
    assert out["tightening"]["torque_tolerance"] == pytest.approx(0.05)
    assert "tightening.torque_tolerance" in out["defaults"]


@pytest.mark.parametrize("what", ["friction", "tools"])
def test_catalog_command_lists_them(what):
    res = CliRunner().invoke(main, ["catalog", what])
    assert res.exit_code == 0 and "source" in res.stdout


# ---------------------------------------------------------------- nut factor T = K F d


def test_nut_factor_gives_t_equals_k_f_d_at_both_ends():
    # Shigley eq. (8-27): T = K F d; F_M,max = T_max / (K_min d), F_M,min = T_min / (K_max d)
    r = analyse(joint_from_data(_joint(nut_factor="0.18..0.22")))
    d = 12e-3
    assert r.assembly_max == pytest.approx(70 * 1.06 / (0.18 * d), rel=1e-9)
    assert r.assembly_min == pytest.approx(70 * 0.94 / (0.22 * d), rel=1e-9)
    j = r.to_dict()["tightening"]
    assert j["nut_factor"] == [0.18, 0.22]
    mu = j["thread_friction"]
    assert mu == j["head_friction"] and 0.1 < mu[0] < mu[1] < 0.25
    assert "implied by the nut factor" in dict(r.defaults)["tightening.thread_friction"]


@pytest.mark.parametrize(
    ("tightening", "words"),
    [
        ({"nut_factor": 0.2, "thread_friction": 0.12}, "not both"),
        ({"nut_factor": 0.2, "lubricant": "mos2-paste"}, "not both"),
        ({"nut_factor": 0.8}, "outside 0.05..0.6"),
        ({"nut_factor": 0.03}, "outside 0.05..0.6"),
    ],
)
def test_bad_nut_factors_are_refused(tightening, words):
    with pytest.raises(InputError) as err:
        joint_from_data(_joint(**tightening))
    assert err.value.key == "tightening.nut_factor" and words in str(err.value)
