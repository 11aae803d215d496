"""Timeline geometry without Qt (workbench.figures.timeline).

Check values: Hendrickson, *Project Management for Construction*, ch. 10, nine-activity
example (reference case R2): ES/LS A 0/0, B 0/9, C 4/4, D 4/15, E 12/13, F 12/12,
G 21/22, H 21/25, I 24/24; total/free float B 9/9, D 11/10, E 1/0, G 1/1, H 4/4.
"""

import datetime as dt
import sys

import numpy as np
import pytest

from workbench.core import Activity, Link, Plan, Settings, analyze
from workbench.figures.timeline import (KINDS, critical_ids, finish_whisker, timeline_geometry)

R2_PRED = {"A": "", "B": "", "C": "A", "D": "A", "E": "BC", "F": "BC", "G": "DE", "H": "DE", "I": "FG"}
R2_D = {"A": 4, "B": 3, "C": 8, "D": 7, "E": 9, "F": 12, "G": 2, "H": 5, "I": 6}
R2_ES = {"A": 0, "B": 0, "C": 4, "D": 4, "E": 12, "F": 12, "G": 21, "H": 21, "I": 24}
R2_LS = {"A": 0, "B": 9, "C": 4, "D": 15, "E": 13, "F": 12, "G": 22, "H": 25, "I": 24}
R2_FF = {"B": 9, "D": 10, "G": 1, "H": 4}   # E has total float 1 but free float 0


def r2_plan(groups=None, deadline=None, extra=(), status=None):
    groups = groups or {}
    acts = [Activity(k, name=f"step {k}", duration=d, group=groups.get(k, "")) for k, d in R2_D.items()]
    links = [Link(p, k) for k, ps in R2_PRED.items() for p in ps]
    for act, preds in extra:
        acts.append(act)
        links += [Link(p, act.id) for p in preds]
    return Plan(Settings(start=dt.date(2026, 12, 7), deadline=deadline, status_date=status), acts, links)


def marks_by_id(geo, kind):
    m = geo.marks[kind]
    return {geo.keys[r]: (x0, x1) for r, x0, x1 in zip(m.rows.tolist(), m.x0.tolist(), m.x1.tolist())}


def test_bars_span_early_start_to_early_finish_in_table_order():
    geo = timeline_geometry(analyze(r2_plan()))
    assert geo.keys == list(R2_D)
    bars = {**marks_by_id(geo, "critical"), **marks_by_id(geo, "work")}
    assert bars == {k: (R2_ES[k], R2_ES[k] + R2_D[k]) for k in R2_D}
    assert set(marks_by_id(geo, "critical")) == {"A", "C", "F", "I"}   # published critical path


def test_slack_line_runs_from_early_to_late_finish():
    geo = timeline_geometry(analyze(r2_plan()))
    floats = marks_by_id(geo, "float")
    expected = {k: (R2_ES[k] + R2_D[k], R2_LS[k] + R2_D[k]) for k in R2_D if R2_LS[k] > R2_ES[k]}
    assert floats == expected
    assert set(floats) == {"B", "D", "E", "G", "H"}


def test_free_float_mark_sits_at_early_finish_plus_free_float():
    geo = timeline_geometry(analyze(r2_plan()))
    free = marks_by_id(geo, "free_float")
    # Only D's free float (10) falls short of its total float (11); for B, G and H the two
    # are equal and the slack line's end tick already marks the point.
    assert free == {"D": (4 + 7 + 10,) * 2}


def test_milestone_is_a_point_at_its_date():
    ms = Activity("M", name="handover", duration=0)
    geo = timeline_geometry(analyze(r2_plan(extra=[(ms, "I")])))
    assert marks_by_id(geo, "milestone_critical") == {"M": (30.0, 30.0)}
    assert "M" not in marks_by_id(geo, "critical") and "M" not in marks_by_id(geo, "work")
    assert geo.kinds[geo.row_of["M"]] == "milestone"
    assert geo.activity_at(30.0, geo.row_of["M"], slack=0.1) == "M"


def test_negative_float_when_the_deadline_cannot_be_met():
    geo = timeline_geometry(analyze(r2_plan(deadline=26.0)))
    neg = marks_by_id(geo, "negative_float")
    # The chain takes 30 days, the deadline is 26: every late finish moves 4 earlier, and
    # wherever that falls before the early finish (total float below 4) the miss shows.
    late_finish = {k: R2_LS[k] + R2_D[k] - 4 for k in R2_D}
    assert neg == {k: (late_finish[k], R2_ES[k] + R2_D[k]) for k in "ACFIEG"}
    assert neg["E"] == (18.0, 21.0)
    assert "negative_float" in KINDS
    assert geo.lines["deadline"] == 26.0
    assert "C" not in marks_by_id(geo, "float")


def test_deadline_later_than_finish_gives_every_activity_float():
    geo = timeline_geometry(analyze(r2_plan(deadline=33.0)))
    floats = marks_by_id(geo, "float")
    assert floats["I"] == (30.0, 33.0)
    assert not geo.marks["negative_float"].rows.size


def test_groups_gather_members_under_a_summary_row_and_collapse():
    groups = {"C": "Frame", "F": "Frame", "D": "Fit-out", "H": "Fit-out"}
    analysis = analyze(r2_plan(groups))
    geo = timeline_geometry(analysis)
    assert geo.keys == ["A", "B", "Frame", "C", "F", "Fit-out", "D", "H", "E", "G", "I"]
    assert geo.kinds[2] == "group" and geo.depth.tolist()[3] == 1
    assert marks_by_id(geo, "summary_critical") == {"Frame": (4.0, 24.0)}
    assert marks_by_id(geo, "summary") == {"Fit-out": (4.0, 26.0)}
    folded = timeline_geometry(analysis, collapsed={"Frame"})
    assert folded.keys == ["A", "B", "Frame", "Fit-out", "D", "H", "E", "G", "I"]
    assert folded.row(2).collapsed and "C" not in folded.row_of
    assert marks_by_id(folded, "summary_critical") == {"Frame": (4.0, 24.0)}
    assert "C" not in marks_by_id(folded, "critical")


def test_only_critical_rows():
    analysis = analyze(r2_plan())
    geo = timeline_geometry(analysis, only=critical_ids(analysis))
    assert geo.keys == ["A", "C", "F", "I"]
    assert geo.row_of == {"A": 0, "C": 1, "F": 2, "I": 3}


def test_late_bars_and_connectors():
    geo = timeline_geometry(analyze(r2_plan()), late_bars=True, connectors=True)
    late = marks_by_id(geo, "late")
    assert late["D"] == (15.0, 22.0)
    segs = geo.connectors
    assert segs.shape == (3 * len(r2_plan().links), 4)
    # The A → C link leaves A's finish (x 4, row 0) and arrives at C's start (x 4, row 2).
    first = segs[:3]
    assert first[0][:2].tolist() == [4.0, 0.0] and first[-1][2:].tolist() == [4.0, 2.0]


def test_reference_lines_status_and_range():
    geo = timeline_geometry(analyze(r2_plan(status=dt.date(2026, 12, 11))))
    assert geo.lines["start"] == 0.0
    assert geo.lines["status"] == 5.0   # Mon 7 .. Fri 11 Dec: end of the fifth working day
    assert geo.x_range == (0.0, 30.0)


class FakeResult:
    """Stands in for a SimulationResult: only what the geometry reads."""

    def __init__(self, ids, finish, per_activity=None):
        self.ids, self.finish, self.activity_finish = ids, np.asarray(finish, float), per_activity

    def percentile(self, p):
        return float(np.percentile(self.finish, p))


def test_whiskers_from_simulation():
    analysis = analyze(r2_plan())
    ids = analysis.schedule.ids
    finish = np.linspace(28, 40, 101)
    geo = timeline_geometry(analysis, FakeResult(ids, finish))
    assert geo.finish_whisker == pytest.approx((np.percentile(finish, 10), np.percentile(finish, 90)))
    assert not len(geo.marks["whisker"])
    per = np.tile(np.linspace(0, 10, 11), (len(ids), 1)) + np.arange(len(ids))[:, None]
    geo = timeline_geometry(analysis, FakeResult(ids, finish, per))
    assert marks_by_id(geo, "whisker")["C"] == pytest.approx((3.0, 11.0))
    assert finish_whisker(FakeResult(["X"], finish), ids) is None   # a stale result is ignored


def test_dragged_estimate_moves_most_likely_to_the_new_mean():
    from workbench.figures.timeline import dragged_estimate
    act = Activity("C", optimistic=6, most_likely=9, pessimistic=18)   # te 10
    changes = dragged_estimate(act, 11.0)
    assert changes == {"most_likely": 10.5}            # (6 + 4·10.5 + 18) / 6 = 11
    assert act.with_(**changes).mean == pytest.approx(11.0)
    assert dragged_estimate(act, 2.0) == {"most_likely": 6.0}   # never below optimistic


def test_dragged_estimate_widens_pessimistic_when_needed():
    from workbench.figures.timeline import dragged_estimate
    act = Activity("C", optimistic=6, most_likely=9, pessimistic=18)
    changes = dragged_estimate(act, 20.0)
    new = act.with_(**changes).validated()
    assert new.optimistic <= new.most_likely <= new.pessimistic
    assert new.most_likely == new.pessimistic == pytest.approx(22.8)   # (6 + 5·22.8) / 6 = 20
    assert new.mean == pytest.approx(20.0)
    assert dragged_estimate(Activity("F", duration=4), 6.26) == {"duration": 6.3}
