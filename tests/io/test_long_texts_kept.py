"""A plan file, CSV or XLSX whose texts run past the entry limits opens with every character
(an older file, another tool's spreadsheet): the planner is never locked out of their work."""

import json

import pytest

from workbench.cli import main
from workbench.core.analysis import analyze
from workbench.core.long_texts import long_texts
from workbench.core.model import Activity, Link, Plan, Settings
from workbench.io.planfile import load_plan, save_plan
from workbench.io.tabular import export_table, load_any

NAME = ("Relocate the substation feeder and re-terminate " * 30).strip()      # 1,439 characters


def plan_with_a_long_name() -> Plan:
    acts = [Activity("A", "Survey", duration=2), Activity("B", NAME, notes="N" * 25_000, duration=3)]
    return Plan(Settings(title="Feeder move"), acts, [Link("A", "B")])


def test_a_plan_file_with_long_texts_opens_whole_and_saves_them(tmp_path):
    path = tmp_path / "old.slw"
    data = json.loads(_saved(plan_with_a_long_name(), tmp_path).read_text(encoding="utf-8"))
    data["settings"]["title"] = "Feeder move, stage two " * 20       # 460 characters, over 300
    path.write_text(json.dumps(data), encoding="utf-8")
    plan = load_plan(path)
    assert plan.activity("B").name == NAME and len(plan.activity("B").notes) == 25_000
    assert plan.settings.title == "Feeder move, stage two " * 20
    assert [(f.owner, f.field) for f in long_texts(plan)] == [("settings", "title"), ("activity B", "name"),
                                                              ("activity B", "notes")]
    again = load_plan(save_plan(plan, tmp_path / "again.slw"))      # saving keeps them too
    assert again.activity("B").name == NAME


def _saved(plan, folder):
    return save_plan(plan, folder / "plain.slw")


@pytest.mark.parametrize("suffix", [".csv", ".xlsx"])
def test_a_table_with_long_texts_opens_whole(tmp_path, suffix):
    path = export_table(analyze(plan_with_a_long_name()), tmp_path / f"feeder{suffix}")
    plan = load_any(path)
    assert plan.activity("B").name == NAME and len(plan.activity("B").notes) == 25_000
    assert [(f.owner, f.field) for f in long_texts(plan)] == [("activity B", "name"), ("activity B", "notes")]


@pytest.mark.parametrize("suffix", [".slw", ".csv", ".xlsx"])
def test_the_command_line_says_which_texts_run_long_and_goes_on(tmp_path, capsys, suffix):
    plan = plan_with_a_long_name()
    path = save_plan(plan, tmp_path / "p.slw") if suffix == ".slw" else export_table(analyze(plan), tmp_path / f"p{suffix}")
    assert main(["analyze", str(path)]) == 0
    err = capsys.readouterr().err
    assert f"note: p{suffix}: 2 texts are longer than Slackline lets you type" in err
    assert f"activity B: name ({len(NAME):,} characters; limit 500)" in err and "Every character is kept" in err


def test_a_title_typed_on_the_command_line_keeps_to_the_limit(tmp_path, capsys):
    path = save_plan(plan_with_a_long_name(), tmp_path / "p.slw")
    assert main(["analyze", str(path), "--title", "T" * 301]) == 2
    assert "--title: title is 301 characters long; use at most 300" in capsys.readouterr().err
