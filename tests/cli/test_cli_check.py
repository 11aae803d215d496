"""`slackline check`: the table, the JSON contract of issue 14, --strict, bad input."""

from __future__ import annotations

import json
from pathlib import Path

import pytest

from workbench.core.checkup import OWN_IDS, STANDARD_IDS

from test_cli import R1_CSV, run

DEMO = Path(__file__).resolve().parents[2] / "resources" / "demo.slw"


@pytest.fixture
def r1(tmp_path):
    path = tmp_path / "r1.csv"
    path.write_text(R1_CSV, encoding="utf-8")
    return path


def test_json_lists_every_standard_metric_and_our_own(capsys):
    code, out, _ = run(capsys, "check", str(DEMO), "--json", "--iterations", "2000")
    data = json.loads(out)
    assert code == 0 and set(data) == {"standard", "checks"}
    assert "DCMA" in data["standard"]["name"] and "PAM 200.1" in data["standard"]["source"]
    assert [c["id"] for c in data["checks"]] == list(STANDARD_IDS) + list(OWN_IDS)
    for c in data["checks"]:
        assert set(c) == {"id", "name", "value", "threshold", "status", "offenders", "note"}
        assert c["status"] in ("pass", "fail", "n/a")
    by_id = {c["id"]: c for c in data["checks"]}
    assert by_id["missing_logic"]["offenders"] == ["X1"] and by_id["leads"]["offenders"] == ["O1"]
    assert by_id["merge_hot_spots"]["status"] == "fail" and by_id["merge_hot_spots"]["offenders"]


def test_strict_exits_1_when_a_check_fails(capsys):
    assert run(capsys, "check", str(DEMO), "--strict", "--iterations", "0")[0] == 1
    assert run(capsys, "check", str(DEMO), "--iterations", "0")[0] == 0


def test_strict_exits_0_on_a_sound_plan(capsys, tmp_path):
    path = tmp_path / "sound.csv"
    rows = ["id,name,optimistic,most_likely,pessimistic,predecessors", "S,Start,0,0,0,"]
    rows += [f"A{i},Step {i},4,5,7,{'S' if i == 1 else f'A{i - 1}'}" for i in range(1, 9)]
    path.write_text("\n".join(rows) + "\n", encoding="utf-8")
    code, out, _ = run(capsys, "check", str(path), "--strict", "--iterations", "500")
    assert code == 0, out
    assert "Checkup: " in out and "fail" not in out.split("Notes")[0]


def test_the_table_reads_without_colour(capsys, r1):
    # R1 (Hillier & Lieberman house-building bid, estimates [memory]): K is (4, 4, 4) with one
    # week of float, so false certainty names it; J and F put the most likely at an end (2 of 13)
    code, out, _ = run(capsys, "check", str(r1), "--iterations", "0")
    assert code == 0
    line = next(l for l in out.splitlines() if "False certainty" in l)
    assert line.startswith("\u2717 fail") and line.rstrip().endswith("K")
    assert next(l for l in out.splitlines() if "Suspicious ranges" in l).startswith("\u2713 pass")
    assert "\u2013 n/a" in out and "Needs a simulation" in out and "Caution" in out


def test_a_loop_exits_2_naming_it(capsys, tmp_path):
    path = tmp_path / "loop.csv"
    path.write_text("id,name,duration,predecessors\nP1,One,2,P3\nP2,Two,2,P1\nP3,Three,2,P2\n", encoding="utf-8")
    code, _, err = run(capsys, "check", str(path))
    assert code == 2 and "P1" in err and "\u2192" in err


@pytest.mark.parametrize("argv, words", [
    (["check", "missing.slw"], "no such file"),
    (["check", str(DEMO), "--iterations", "-1"], "--iterations must be 0 or more"),
    (["check", str(DEMO), "--seed", "-4"], "--seed must be 0 or more"),
])
def test_bad_input_exits_2_naming_it(capsys, argv, words):
    code, _, err = run(capsys, *argv)
    assert code == 2 and words in err
