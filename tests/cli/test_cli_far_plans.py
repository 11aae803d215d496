"""The command line on plans whose dates fall far from the start or that are too long
to print in full: a named message and exit 2, or correct output (issue 20, item 9)."""

from __future__ import annotations

import csv
import datetime as dt

import pytest

from workbench.cli import main
from workbench.core.model import Activity, Link, Plan, Settings
from workbench.io.planfile import save_plan

START = dt.date(2027, 1, 4)


def _save(tmp_path, plan, name="far.slw"):
    path = tmp_path / name
    save_plan(plan, path)
    return str(path)


def _chain(deadline=None, links=None):
    acts = [Activity(f"A{i}", f"Step {i}", optimistic=1, most_likely=2, pessimistic=4) for i in range(4)]
    links = [Link(f"A{i}", f"A{i + 1}") for i in range(3)] if links is None else links
    return Plan(Settings(title="far", start=START, deadline=deadline), acts, links)


@pytest.mark.parametrize("verb", [["analyze"], ["simulate", "--iterations", "64", "--seed", "1"],
                                  ["report", "--iterations", "64", "--seed", "1", "-o", "PDF"], ["export", "-o", "CSV"]])
def test_a_deadline_before_year_one_exits_2_naming_it(tmp_path, capsys, verb):
    plan = _save(tmp_path, _chain(deadline=-1_000_000.0))
    argv = [verb[0], plan] + [str(tmp_path / "out.pdf") if a == "PDF" else str(tmp_path / "out.csv") if a == "CSV"
                              else a for a in verb[1:]]
    assert main(argv) == 2
    err = capsys.readouterr().err
    assert "deadline" in err and "before year 1" in err and "internal error" not in err


def test_a_lag_far_into_the_past_names_the_activity(tmp_path, capsys):
    plan = _save(tmp_path, _chain(deadline=5.0, links=[Link("A0", "A1", "FS", 1_000_000.0)]))
    assert main(["analyze", plan]) == 2
    assert "activity A0" in capsys.readouterr().err


def test_a_million_day_activity_reports_and_exports_dates(tmp_path, capsys):
    plan = Plan(Settings(title="long", start=START), [Activity("X", "Very long", duration=1_000_000.0)])
    path = _save(tmp_path, plan)
    assert main(["report", path, "-o", str(tmp_path / "p.pdf"), "--iterations", "64", "--seed", "1"]) == 0
    assert main(["export", path, "-o", str(tmp_path / "p.csv")]) == 0
    with open(tmp_path / "p.csv", encoding="utf-8-sig", newline="") as f:
        row = next(csv.DictReader(f))
    assert dt.date.fromisoformat(row["early_finish_date"]).year > 5000
