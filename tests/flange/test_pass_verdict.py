"""The flange verdict follows the passes it prints; ASME PCC-1 legacy cross patterns.

Sequences: ASME PCC-1-2013 Table 4, "Legacy cross-pattern tightening sequence and
bolt-numbering system" (from memory).
"""

from __future__ import annotations

import numpy as np
import pytest
from test_flange import data  # the same test flange (tests/flange/test_flange.py)

from clampstack.flange.analysis import PCC1_LEGACY, analyse_flange, cross_order, cross_rule
from clampstack.inputs.flange import flange_from_data

PCC1 = {  # from memory, PCC-1-2013 Table 4 (bolts numbered clockwise)
    12: [1, 7, 4, 10, 2, 8, 5, 11, 3, 9, 6, 12],
    16: [1, 9, 5, 13, 3, 11, 7, 15, 2, 10, 6, 14, 4, 12, 8, 16],
    20: [1, 11, 6, 16, 3, 13, 8, 18, 5, 15, 10, 20, 2, 12, 7, 17, 4, 14, 9, 19],
    24: [1, 13, 7, 19, 4, 16, 10, 22, 2, 14, 8, 20, 5, 17, 11, 23, 3, 15, 9, 21, 6, 18, 12, 24],
}


@pytest.mark.parametrize("n", sorted(PCC1))
def test_pcc1_legacy_sequences(n):
    assert [b + 1 for b in cross_order(n)] == PCC1[n]
    assert "PCC-1" in cross_rule(n) and "Table 4" in cross_rule(n)


@pytest.mark.parametrize("n", [4, 8, 12, 16, 20, 24])
def test_the_construction_for_other_multiples_of_four_reproduces_the_table(n):
    # the rule used beyond 24 bolts (groups of four bolts 90 degrees apart) gives the
    # tabulated rows where the table has them (consistency check of the construction)
    from clampstack.flange.analysis import _quarter_offsets

    q = n // 4
    built = [k + j * q + 1 for k in _quarter_offsets(q) for j in (0, 2, 1, 3)]
    assert built == list(PCC1_LEGACY[n])


@pytest.mark.parametrize("n", [5, 6, 10, 28, 32, 36, 40, 48, 64, 7, 30])
def test_other_counts_are_permutations_with_a_stated_rule(n):
    order = cross_order(n)
    assert sorted(order) == list(range(n))
    assert order[0] == 0
    rule = cross_rule(n)
    assert ("no source" in rule) if n % 4 else ("built as ASME PCC-1" in rule)
    if n % 4 == 0:  # each group of four is 90 degrees apart
        q = n // 4
        for g in range(0, n, 4):
            grp = order[g : g + 4]
            assert {(b - grp[0]) % n for b in grp} == {0, q, 2 * q, 3 * q}


def _result(passes, pattern):
    d = data()
    d["tightening"] = {"thread_friction": "0.10..0.14", "passes": passes, "pattern": pattern}
    return analyse_flange(flange_from_data(d))


def _checks(r):
    return {c.name: c for c in r.checks}


def test_single_full_pass_leaves_bolts_below_the_window_and_fails():
    r = _result([100], ["cross"])
    after = r.passes[-1]
    assert np.min(after) < 0.2 * np.max(after)  # elastic interaction: early bolts relax
    c = _checks(r)["bolt_preload_window"]
    low = r.assembly_range[0] / r.target
    i = int(np.argmin(after))
    assert c.value == pytest.approx(after[i] * low / 1e3, rel=1e-12)
    assert c.limit == pytest.approx(r.window[0] / 1e3, rel=1e-12)
    assert not c.passed and not r.ok
    assert c.extra["governing_bolt"] == i + 1
    assert r.to_dict()["checks"][1]["governing_bolt"] == i + 1


def test_half_pass_leaves_unseated_sectors_and_fails_seating():
    r = _result([50], ["cross"])
    c = _checks(r)
    assert np.min(r.passes[-1]) == pytest.approx(0.0, abs=1e-6 * r.target)
    assert not c["gasket_seating"].passed and not c["bolt_preload_window"].passed
    # seating is checked per bolt sector on the ring's gasket forces after the pass
    low = r.assembly_range[0] / r.target
    assert c["gasket_seating"].value == pytest.approx(np.min(r.assembly_gasket) * low / 1e3)
    assert c["gasket_seating"].limit == pytest.approx(r.app2.Wm2 / r.spec.bolt_count / 1e3)


def test_the_usual_passes_pass_and_the_checks_use_their_loads():
    r = _result([30, 70, 100, 100], ["cross", "cross", "cross", "circular"])
    c = _checks(r)
    assert r.ok
    hi = r.assembly_range[1] / r.target
    peak = np.max(np.vstack(r.passes), axis=0)
    assert c["assembly_preload"].value == pytest.approx(np.max(peak) * hi / 1e3, rel=1e-12)
    sector = r.spec.gasket.area / r.spec.bolt_count
    crush = max(
        np.max(r.assembly_gasket) * hi, np.max(r.service_gasket + (hi - 1) * r.assembly_gasket)
    )
    assert c["gasket_crush"].value == pytest.approx(crush / sector / 1e6, rel=1e-12)
