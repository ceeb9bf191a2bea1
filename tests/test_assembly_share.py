"""Assemblies: preload, count, load share and the load at which a contact part unloads.

A bolt (stiffness k_b) and a compression-only sleeve (k_s) between two nodes is the joint of
VDI 2230-1 5.3.1 with n = 1: a preload P needs the misfit -P (1/k_b + 1/k_s); the bolt takes
the share Phi_K = k_b/(k_b + k_s) of a load that pulls the nodes apart; the sleeve unloads at
F_A,sep = P / (1 - Phi_K) (5.3.2).  Closed forms of the statics, worked by hand here.
"""

from __future__ import annotations

import pytest

from clampstack.assembly import solve_assembly
from clampstack.errors import InputError
from clampstack.inputs.assembly import assembly_from_data

KB, KS = 300e6, 900e6  # N/m


def _data(count=1, preload="20 kN", load="12 kN", **bolt) -> dict:
    per = KB / max(count, 1)  # a bad count is refused by the reader, not here
    return {
        "title": "bolt and sleeve",
        "part": [
            {
                "name": "bolt",
                "ends": ["A", "B"],
                "stiffness": f"{per / 1e6:.12g} kN/mm",
                "preload": preload,
                "count": count,
                **bolt,
            },
            {
                "name": "sleeve",
                "ends": ["A", "B"],
                "stiffness": f"{KS / 1e6:g} kN/mm",
                "contact": "compression",
            },
        ],
        "supports": {"fixed": ["A"]},
        "case": [{"name": "pull", "load": [{"node": "B", "force": load}]}],
    }


@pytest.mark.parametrize("count", [1, 4])
def test_preload_share_and_separation_by_hand(count):
    P = 20e3 / count
    r = solve_assembly(assembly_from_data(_data(count, preload=f"{P / 1e3:.12g} kN")))
    asm_state, pull = r.cases
    assert asm_state.force["bolt"] == pytest.approx(P, rel=1e-9)
    assert asm_state.force["bolt"] * count == pytest.approx(20e3, rel=1e-9)
    assert r.fitted_misfits["bolt"] == pytest.approx(-20e3 * (1 / KB + 1 / KS), rel=1e-9)
    phi = KB / (KB + KS)
    share = pull.load_share["B: 12000 N"]
    assert share["bolt"] == pytest.approx(phi, rel=1e-6)
    assert share["sleeve"] == pytest.approx(1 - phi, rel=1e-6)
    assert pull.force["bolt"] * count == pytest.approx(20e3 + phi * 12e3, rel=1e-9)
    ev = {e["part"]: e for e in pull.events}
    F_sep = 20e3 / (1 - phi)
    assert ev["sleeve"]["event"] == "unloads"
    assert ev["sleeve"]["at_factor"] * 12e3 == pytest.approx(F_sep, rel=1e-9)
    d = r.to_dict()
    part = d["cases"][0]["parts"]["bolt"]
    assert part["count"] == count and part["total_force_N"] == pytest.approx(20e3, rel=1e-9)
    assert d["preloads"]["bolt"]["preload_N"] == pytest.approx(P)


@pytest.mark.parametrize(
    "bolt,over,key",
    [({"misfit": "-0.1 mm"}, {}, "part[1].preload"), ({}, {"count": 0}, "part[1].count")],
)
def test_bad_preload_and_count(bolt, over, key):
    d = _data(**bolt)
    d["part"][0].update(over)
    with pytest.raises(InputError) as err:
        assembly_from_data(d)
    assert err.value.key == key


def test_compression_part_cannot_take_a_tensile_preload():
    d = _data(preload=None)
    del d["part"][0]["preload"]
    d["part"][1]["preload"] = "5 kN"
    with pytest.raises(InputError) as err:
        assembly_from_data(d)
    assert err.value.key == "part[2].preload"


def test_report_of_an_assembly(tmp_path):
    import csv
    import json
    from pathlib import Path

    from click.testing import CliRunner

    from clampstack.cli import main

    ex = Path(__file__).parents[1] / "examples" / "load-cell-rig-bolts-and-sleeves.toml"
    res = CliRunner().invoke(main, ["report", str(ex), "-o", str(tmp_path)])
    assert res.exit_code == 0, res.output
    stem = ex.stem
    html = (tmp_path / f"{stem}.html").read_text()
    for part in (
        "Inputs",
        "States",
        "Case: test push 150 kN",
        "Load share",
        "unloads at",
        "Figure 1",
        "Figure 2",
        "Caution",
    ):
        assert part in html, part
    data = json.loads((tmp_path / f"{stem}.json").read_text())
    assert data["report"]["input_sha256"] and len(data["cases"]) == 4
    rows = list(csv.DictReader((tmp_path / f"{stem}-parts.csv").open()))
    bolts = [r for r in rows if r["part"] == "bolts (M16)" and r["case"] == "assembly"][0]
    assert float(bolts["total_force_N"]) == pytest.approx(4 * float(bolts["force_N"]))
