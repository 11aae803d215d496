"""Baselines, variance against them, the odds trend and their undoable commands.

Sign convention (positive = later than the baseline) and the content of a baseline follow
GAO-16-89G (2015), best practice 10 ("maintaining a baseline schedule"). Expected numbers
are worked out by hand; the calendar is Monday to Friday from Monday 4 January 2027.
"""

import datetime as dt

import numpy as np
import pytest

from workbench.core import Activity, Link, Plan, PlanError, Settings, analyze
from workbench.core import baseline as bl
from workbench.core.baseline_commands import (ApproveBaseline, DeleteBaseline, MoveStatusDate, RecordBaseline,
                                              RecordTrendPoint, RenameBaseline)
from workbench.core.montecarlo import simulate
from workbench.core.progress_fields import Progress
from workbench.core.variance import variance_against

MONDAY = dt.date(2027, 1, 4)


def plan():
    acts = [Activity("A", duration=5), Activity("B", optimistic=2, most_likely=4, pessimistic=9),
            Activity("C", duration=3), Activity("D", duration=1)]
    links = [Link("A", "B"), Link("B", "C"), Link("A", "D")]
    return Plan(Settings(title="base", start=MONDAY, deadline=dt.date(2027, 1, 29)), acts, links)


def baseline_of(p, name="Approved", approved=True, sim=None):
    return bl.make_baseline(name, analyze(p), "abc123def456", sim, recorded=dt.date(2027, 1, 1), approved=approved)


def test_a_baseline_holds_dates_estimates_links_and_odds():
    p = plan()
    run = simulate(p, 500, seed=3)
    b = baseline_of(p, sim=run)
    # A 0..5 (Mon 4 – Fri 8), B te = (2 + 16 + 9)/6 = 4.5: 5..9.5 (Mon 11 – Fri 15), C 9.5..12.5 → Wed 20.
    assert b.activity("A").start == MONDAY and b.activity("A").finish == dt.date(2027, 1, 8)
    assert b.activity("B").estimate() == (2, 4, 9, None) and b.activity("C").finish == dt.date(2027, 1, 20)
    assert b.finish == dt.date(2027, 1, 20) and b.deadline == dt.date(2027, 1, 29)
    assert b.pert.method == "pert" and b.pert.probability == pytest.approx(analyze(p).probability_by_deadline())
    assert (b.simulation.iterations, b.simulation.seed) == (500, 3)
    assert b.simulation.p50 <= b.simulation.p80 <= b.simulation.p90
    assert b.links == tuple(p.links) and b.plan_hash == "abc123def456"


def test_variance_counts_working_days_later_as_positive_and_lists_the_changes():
    p = plan()
    b = baseline_of(p)
    p.replace_activity("B", p.activity("B").with_(optimistic=4, most_likely=6, pessimistic=11))  # te 6.5: +2
    p.remove_activity("D")
    p.insert_activity(4, Activity("E", duration=2))
    p.set_links([Link("A", "B"), Link("B", "C"), Link("C", "E", "FS", 1.0)])
    v = variance_against(analyze(p), b)
    assert v.start.tolist()[:3] == [0, 0, 2] and v.finish.tolist()[:3] == [0, 2, 2]
    assert np.isnan(v.start[3]) and v.baseline_start[3] is None            # E is new
    # finish: C ends 14.5 → day 14 (Fri 22); E 15.5..17.5 → day 17 (Wed 27); baseline Wed 20: +5.
    assert v.finish_variance == 5
    assert v.added == ["E"] and v.removed == ["D"]
    assert v.re_estimated == [("B", (2, 4, 9, None), (4, 6, 11, None))]
    assert v.links_added == [("C", "E", "FS", 1.0)] and v.links_removed == [("A", "D", "FS", 0.0)]
    assert v.slipped() == [("B", 2.0), ("C", 2.0)]


def test_variance_reads_actual_starts_of_started_work():
    p = plan()
    b = baseline_of(p)
    p.replace_activity("A", p.activity("A").with_(progress=Progress(actual_start=dt.date(2027, 1, 6), remaining=4)))
    p.settings.status_date = dt.date(2027, 1, 8)
    v = variance_against(analyze(p), b)
    # A started Wednesday (+2) and finishes 5 + 4 = 9 → Thu 14 (baseline Fri 8: +4).
    assert v.start[0] == 2 and v.finish[0] == 4


def test_the_json_carries_progress_and_baseline_fields():
    p = plan()
    b = baseline_of(p)
    p.replace_activity("A", p.activity("A").with_(progress=Progress(actual_start=0.0, actual_finish=6.0)))
    p.settings.status_date = dt.date(2027, 1, 12)
    a = analyze(p)
    data = a.to_dict(variance_against(a, b))
    assert data["status_offset"] == 7 and data["status_date"] == "2027-01-12" and data["baseline"] == "Approved"
    assert data["activities"]["A"]["state"] == "done" and data["activities"]["A"]["actual_finish"] == 6
    assert data["activities"]["A"]["remaining_mean"] == 0 and data["activities"]["B"]["state"] == "not started"
    assert data["activities"]["B"]["baseline_start"] == "2027-01-11"
    # B now starts at the status offset 7 (Wed 13), two working days after its baseline.
    assert data["activities"]["B"]["start_variance"] == 2 and data["finish_variance"] == 2
    plain = analyze(plan()).to_dict()
    assert plain["status_offset"] is None and plain["finish_variance"] is None
    assert plain["activities"]["A"]["actual_start"] is None and plain["activities"]["B"]["remaining_mean"] == 4.5


def test_baseline_lists_refuse_duplicates_and_keep_one_approved():
    p = plan()
    first = bl.with_baseline([], baseline_of(p, "Tender"))
    both = bl.with_baseline(first, baseline_of(p, "Board"))
    assert [x.approved for x in both] == [False, True] and bl.approved(both).name == "Board"
    with pytest.raises(PlanError, match="a baseline named 'Board' exists already"):
        bl.with_baseline(both, baseline_of(p, "Board"))
    assert [x.name for x in bl.renamed(both, "Tender", "Tender rev B")] == ["Tender rev B", "Board"]
    assert bl.approved(bl.approved_as(both, "Tender")).name == "Tender"
    assert bl.chosen(both) is both[1] and bl.chosen(both, "Tender") is both[0]
    with pytest.raises(PlanError, match="no baseline named 'Nope' .*'Tender', 'Board'"):
        bl.without(both, "Nope")
    with pytest.raises(PlanError, match="needs a name"):
        bl.check_name("  ")


def test_baseline_commands_are_one_undo_step_each():
    p = plan()
    steps = [RecordBaseline(baseline_of(p, "Tender", approved=False)), RecordBaseline(baseline_of(p, "Board")),
             RenameBaseline("Tender", "Tender rev B"), ApproveBaseline("Tender rev B"), DeleteBaseline("Board")]
    seen = []
    for cmd in steps:
        seen.append(list(p.baselines))
        cmd.do(p)
    assert [(x.name, x.approved) for x in p.baselines] == [("Tender rev B", True)]
    for cmd, before in zip(reversed(steps), reversed(seen)):
        cmd.undo(p)
        assert p.baselines == before


def test_the_odds_trend_keeps_one_point_per_status_date_in_order():
    p = plan()
    points = []
    for day, seed in ((dt.date(2027, 1, 15), 1), (dt.date(2027, 1, 8), 2), (dt.date(2027, 1, 15), 3)):
        p.settings.status_date = day
        point = bl.make_trend_point(analyze(p), simulate(p, 200, seed=seed), "h")
        RecordTrendPoint(point).do(p)
        points.append(point)
    assert [(x.status_date, x.seed) for x in p.odds_trend] == [(dt.date(2027, 1, 8), 2), (dt.date(2027, 1, 15), 3)]
    assert 0 <= p.odds_trend[0].simulation_probability <= 1 and p.odds_trend[0].deadline == dt.date(2027, 1, 29)


def test_moving_the_status_date_with_remaining_estimates_is_one_step():
    p = plan()
    cmd = MoveStatusDate(p, dt.date(2027, 1, 6), {"A": Progress(actual_start=MONDAY, remaining=3.0)})
    cmd.do(p)
    assert p.settings.status_date == dt.date(2027, 1, 6) and p.activity("A").progress.remaining == 3.0
    assert analyze(p).schedule.ef[0] == 6
    cmd.undo(p)
    assert p.settings.status_date is None and p.activity("A").progress is None
