"""`slackline level`, `simulate --resources`, `import --resources` and the resource part of
`analyze --json`: the JSON contract, what gets written, and named refusals (exit 2)."""

from __future__ import annotations

import json
from pathlib import Path

import pytest

from workbench.cli import main
from workbench.core.analysis import analyze
from workbench.io.planfile import load_plan

DEMO = Path(__file__).resolve().parents[2] / "resources" / "demo.slw"
ACTIVITIES = """id,name,duration,predecessors,resources
A,Paint east wing,4,,crew
B,Paint west wing,3,,crew 1
C,Hand over,0,A;B,
"""
RESOURCES = "id,name,units\ncrew,Painters,1\n"


def run(capsys, *argv):
    try:
        code = main([str(a) for a in argv])
    except SystemExit as exc:          # argparse's own refusals
        code = exc.code
    out, err = capsys.readouterr()
    return code, out, err


@pytest.fixture
def painters(tmp_path, capsys):
    (tmp_path / "acts.csv").write_text(ACTIVITIES)
    (tmp_path / "res.csv").write_text(RESOURCES)
    code, out, err = run(capsys, "import", tmp_path / "acts.csv", "-o", tmp_path / "p.slw", "--start", "2027-01-04",
                         "--resources", tmp_path / "res.csv")
    assert code == 0, err
    assert "1 resources" in out
    return tmp_path / "p.slw"


def test_level_json_contract(painters, capsys):
    code, out, err = run(capsys, "level", painters, "--json")
    data = json.loads(out)
    assert code == 0 and data["rule"] == "lft" and data["schedules_tried"] >= 1
    assert (data["finish"], data["logic_finish"], data["delay"]) == (7, 4, 3)
    assert data["starts"] == {"A": 0, "B": 4, "C": 7}
    assert {"id": "B", "logic_start": 0, "start": 4, "held_by": "crew"} in data["moved"]
    assert data["finish_date"] == "2027-01-12"      # 7 working days from Mon 4 Jan: ends Tue 12 Jan


def test_level_writes_a_plan_whose_logic_gives_the_levelled_dates(painters, tmp_path, capsys):
    out_path = tmp_path / "levelled.slw"
    code, out, _ = run(capsys, "level", painters, "-o", out_path, "--budget", "50")
    assert code == 0 and "wrote" in out and "held by" in out
    levelled = load_plan(out_path)
    assert analyze(levelled).schedule.finish == 7
    assert levelled.activity("B").start_no_earlier == 4 and "crew" in levelled.activity("B").notes


def test_analyze_json_names_peak_use_and_over_allocation(painters, capsys):
    code, out, _ = run(capsys, "analyze", painters, "--json")
    crew = json.loads(out)["resources"]["crew"]
    assert code == 0 and crew["peak"] == 2
    assert crew["over_allocated"] == [{"start": 0, "end": 3, "in_use": 2, "available": 1,
                                       "start_date": "2027-01-04", "end_date": "2027-01-06"}]


def test_resource_aware_simulation_of_the_demo(capsys):
    code, out, _ = run(capsys, "simulate", DEMO, "--resources", "--iterations", "300", "--seed", "4", "--json")
    aware = json.loads(out)
    code2, out2, _ = run(capsys, "simulate", DEMO, "--iterations", "300", "--seed", "4", "--json")
    logic = json.loads(out2)
    assert code == code2 == 0 and aware["resource_aware"] is True and "resource_aware" not in logic
    assert aware["mean"] > logic["mean"] and aware["probability"] < logic["probability"]   # crews cost time


@pytest.mark.parametrize("argv, words", [
    (["level", "{plan}", "--rule", "quickest"], ["invalid choice"]),
    (["level", "{plan}", "--budget", "-3"], ["--budget"]),
    (["level", "{plan}", "-o", "{dir}/x.csv"], ["-o", ".slw"]),
    (["level", "{nores}"], ["no resources to level"]),
    (["simulate", "{nores}", "--resources", "--iterations", "10"], ["no resources"]),
])
def test_bad_arguments_exit_2_naming_the_field(painters, tmp_path, capsys, argv, words):
    nores = tmp_path / "plain.csv"
    nores.write_text("id,duration\nA,2\n")
    argv = [a.format(plan=painters, dir=tmp_path, nores=nores) for a in argv]
    code, out, err = run(capsys, *argv)
    assert code == 2
    for w in words:
        assert w in err


def test_import_refuses_unknown_and_oversized_needs_with_rows(tmp_path, capsys):
    (tmp_path / "acts.csv").write_text("id,duration,resources\nA,2,crew 2\nB,3,crane\nC,1,crew x\n")
    (tmp_path / "res.csv").write_text(RESOURCES)
    code, _, err = run(capsys, "import", tmp_path / "acts.csv", "-o", tmp_path / "p.slw", "--resources", tmp_path / "res.csv")
    assert code == 2
    assert "row 2" in err and "needs 2 units of crew but at most 1" in err
    assert "row 3" in err and "unknown resource 'crane'" in err
    assert "row 4" in err and "units 'x' of resource crew must be a number" in err
    assert not (tmp_path / "p.slw").exists()


def test_import_without_a_resources_table_says_where_to_give_one(tmp_path, capsys):
    (tmp_path / "acts.csv").write_text(ACTIVITIES)
    code, _, err = run(capsys, "import", tmp_path / "acts.csv", "-o", tmp_path / "p.slw")
    assert code == 2 and "unknown resource 'crew'" in err and "--resources" in err


def test_bad_resources_file_is_named(tmp_path, capsys):
    (tmp_path / "acts.csv").write_text(ACTIVITIES)
    (tmp_path / "res.csv").write_text("id,name,units\ncrew,Painters,lots\n")
    code, _, err = run(capsys, "import", tmp_path / "acts.csv", "-o", tmp_path / "p.slw", "--resources", tmp_path / "res.csv")
    assert code == 2 and "res.csv" in err and "row 2, column 'units': 'lots' is not a number" in err


def test_when_the_crews_cost_nothing_the_words_say_so(tmp_path, capsys):
    """Two painters for two one-painter jobs: nothing waits, so no 'later by 0'."""
    (tmp_path / "acts.csv").write_text(ACTIVITIES)
    (tmp_path / "res.csv").write_text("id,name,units\ncrew,Painters,2\n")
    plan = tmp_path / "p.slw"
    assert run(capsys, "import", tmp_path / "acts.csv", "-o", plan, "--start", "2027-01-04",
               "--resources", tmp_path / "res.csv")[0] == 0
    code, out, _ = run(capsys, "level", plan)
    assert code == 0 and "Delay          none: levelling keeps the logic-only finish" in out
    code, out, _ = run(capsys, "simulate", plan, "--resources", "--iterations", "500", "--seed", "4")
    assert code == 0 and "the same as PERT's" in out and "later by" not in out


def test_level_budget_is_the_total_number_of_schedules(capsys):
    code, out, _ = run(capsys, "level", DEMO, "--budget", "120", "--json")
    assert code == 0 and 114 < json.loads(out)["schedules_tried"] <= 120


def test_import_names_the_resource_columns_it_does_not_read(tmp_path, capsys):
    """A misspelt heading ('unitz') is not lost silently: the import names it."""
    (tmp_path / "acts.csv").write_text(ACTIVITIES)
    (tmp_path / "res.csv").write_text("id,name,units,unitz,shift\ncrew,Painters,1,2,day\n")
    code, out, err = run(capsys, "import", tmp_path / "acts.csv", "-o", tmp_path / "p.slw", "--start", "2027-01-04",
                         "--resources", tmp_path / "res.csv")
    assert code == 0 and "1 resources" in out
    assert "res.csv: columns not read: 'unitz', 'shift'" in err
