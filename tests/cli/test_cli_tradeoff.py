"""`slackline tradeoff`: the JSON contract of the issue, and exit 2 with the reason."""

from __future__ import annotations

import json
from pathlib import Path

import pytest

from workbench.cli import main

DEMO = Path(__file__).resolve().parents[2] / "resources" / "demo.slw"


@pytest.fixture(scope="module")
def demo_json(tmp_path_factory):
    import io
    import contextlib

    out = io.StringIO()
    with contextlib.redirect_stdout(out):
        code = main(["tradeoff", str(DEMO), "--confidence", "0.9", "--iterations", "800", "--seed", "3", "--json"])
    assert code == 0
    return json.loads(out.getvalue())


def test_json_has_the_fields_of_the_issue(demo_json):
    d = demo_json
    curve = d["curve"]
    assert [p["duration"] for p in curve] == sorted(p["duration"] for p in curve)
    assert all(set(p) == {"duration", "direct_cost", "crashed"} for p in curve)
    assert curve[-1]["crashed"] == {} and curve[0]["direct_cost"] > curve[-1]["direct_cost"]
    assert set(d["optimum"]) == {"duration", "direct_cost", "indirect_cost", "total_cost"}
    o = d["optimum"]
    assert o["total_cost"] == pytest.approx(o["direct_cost"] + o["indirect_cost"], abs=0.02)
    assert {"cost", "crashed", "chance"} <= set(d["to_deadline"])
    c = d["to_confidence"]
    assert {"target", "cost", "crashed", "chance_in_sample", "chance_out_of_sample", "standard_error"} <= set(c)
    assert c["target"] == 0.9 and c["chance_in_sample"] >= 0.9 and c["crashed"]
    assert d["to_deadline"]["chance"] < 0.9 and d["seed"] == 3


def test_overrides_change_the_optimum(capsys):
    assert main(["tradeoff", str(DEMO), "--indirect-cost", "0", "--penalty", "0", "--iterations", "64",
                 "--seed", "1", "--json"]) == 0
    free = json.loads(capsys.readouterr().out)
    assert free["optimum"]["indirect_cost"] == 0 and free["optimum"]["duration"] == free["curve"][-1]["duration"]
    assert main(["tradeoff", str(DEMO), "--indirect-cost", "1e6", "--iterations", "64", "--seed", "1", "--json"]) == 0
    dear = json.loads(capsys.readouterr().out)
    assert dear["optimum"]["duration"] == dear["curve"][0]["duration"]


@pytest.mark.parametrize("extra, message", [
    (["--deadline", "60"], "cannot be met even with every activity fully crashed"),
    (["--confidence", "1.5"], "--confidence must lie between 0 and 1"),
    (["--penalty", "-2"], "--penalty must be"),
    (["--deadline", "soon"], "neither a number"),
])
def test_bad_input_exits_2(capsys, extra, message):
    assert main(["tradeoff", str(DEMO), "--iterations", "64", *extra]) == 2
    assert message in capsys.readouterr().err


def test_plan_without_costs_exits_2(tmp_path, capsys):
    plan = tmp_path / "plain.csv"
    plan.write_text("id,duration,predecessors\nA,3,\nB,4,A\n", encoding="utf-8")
    assert main(["tradeoff", str(plan)]) == 2
    assert "no cost data" in capsys.readouterr().err


def test_text_output_carries_the_caution(capsys):
    assert main(["tradeoff", str(DEMO), "--iterations", "128", "--seed", "2"]) == 0
    out = capsys.readouterr().out
    assert "Total-cost optimum" in out and "fresh simulation" in out and "Caution" in out


def test_spreadsheet_plan_without_deadline_gives_the_curve_only(tmp_path, capsys):
    plan = tmp_path / "costed.csv"
    plan.write_text("id,duration,predecessors,cost,crash cost,crash duration\n"
                    "A,10,,1000,1400,6\nB,8,,500,650,5\nC,5,A;B,800,1100,4\n", encoding="utf-8")
    assert main(["tradeoff", str(plan), "--json"]) == 0
    d = json.loads(capsys.readouterr().out)
    assert [(p["duration"], p["direct_cost"]) for p in d["curve"]] == [(10, 3100), (11, 2800), (13, 2500), (15, 2300)]
    assert d["to_deadline"] is None and d["to_confidence"] is None and d["deadline"] is None


def test_half_given_crash_data_is_named_as_not_shortened(tmp_path, capsys):
    plan = tmp_path / "half.csv"
    plan.write_text("id,duration,predecessors,cost,crash cost,crash duration\n"
                    "A,10,,1000,1400,6\nB,8,,500,,5\nC,5,A;B,800,1100,\n", encoding="utf-8")
    assert main(["tradeoff", str(plan), "--json"]) == 0
    d = json.loads(capsys.readouterr().out)
    assert d["not_shortened"] == {"B": "crash cost", "C": "crash estimate"}
    assert [(p["duration"], p["direct_cost"]) for p in d["curve"]] == [(13, 2500), (15, 2300)]  # A alone, to B-C
    assert main(["tradeoff", str(plan)]) == 0
    assert "Not shortened, crash data incomplete: B (no crash cost); C (no crash estimate)" in capsys.readouterr().out
