"""Plans whose dates fall far from the start: either a named refusal or correct dates,
never an internal error (issue 20, item 9)."""

from __future__ import annotations

import datetime as dt

import numpy as np
import pytest

from workbench.core.analysis import analyze
from workbench.core.errors import PlanError
from workbench.core.model import Activity, Link, Plan, Settings
from workbench.core.montecarlo import simulate

START = dt.date(2027, 1, 4)


def _chain(n=3, deadline=None, links=None, **act):
    acts = [Activity(f"A{i}", f"Step {i}", **(act or dict(optimistic=1, most_likely=2, pessimistic=4)))
            for i in range(n)]
    links = links if links is not None else [Link(f"A{i}", f"A{i + 1}") for i in range(n - 1)]
    return Plan(Settings(title="far", start=START, deadline=deadline), acts, links)


def test_a_deadline_before_year_one_is_refused_naming_the_deadline():
    plan = _chain(deadline=-1_000_000.0)
    for run in (lambda: analyze(plan), lambda: simulate(plan, iterations=64, seed=1)):
        with pytest.raises(PlanError) as err:
            run()
        assert err.value.culprit == "deadline"
        assert "before year 1" in str(err.value)


def test_a_long_lag_pushing_late_dates_before_year_one_names_the_activity():
    plan = _chain(2, deadline=3.0, links=[Link("A0", "A1", "FS", 1_000_000.0)])
    with pytest.raises(PlanError) as err:
        analyze(plan)
    assert err.value.culprit == "A0"
    assert "before year 1" in str(err.value)


def test_far_but_representable_dates_come_out_as_dates():
    plan = _chain(deadline=-500_000.0)           # about 1,900 years before the start
    result = analyze(plan).to_dict()
    late = dt.date.fromisoformat(result["activities"]["A0"]["late_start"])
    assert late.year < 200
    assert late < dt.date.fromisoformat(result["pert"]["deadline_date"])   # three steps before it
    assert result["activities"]["A0"]["total_float"] == pytest.approx(-500_000 - 6.5)


def test_one_activity_of_a_million_days_is_dated_in_its_own_millennium():
    plan = Plan(Settings(title="far", start=START), [Activity("X", "long", duration=1_000_000.0)])
    a = analyze(plan)
    finish = a.finish_date
    assert isinstance(finish, dt.date)
    # a million five-day working weeks' days: 1,400,000 calendar days, give or take a week
    assert abs((finish - START).days - 1_400_000) < 7
    dates = a.dates()
    assert dates["early_finish"].dtype == np.dtype("datetime64[D]")


def test_the_csv_export_writes_far_finishes_as_dates(tmp_path):
    from workbench.io.table_export import table_rows, write_csv

    plan = Plan(Settings(title="far", start=START), [Activity("X", "long", duration=1_000_000.0)])
    out = tmp_path / "far.csv"
    write_csv(table_rows(analyze(plan)), out)
    header, row = out.read_text(encoding="utf-8-sig").splitlines()[:2]
    cells = dict(zip(header.split(","), row.split(",")))
    assert dt.date.fromisoformat(cells["early_finish_date"]).year > 5000
