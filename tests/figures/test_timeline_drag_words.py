"""The words of the note beside a dragged Timeline bar (figures.timeline_drag)."""

import datetime as dt

from workbench.core import Activity, Plan, Settings
from workbench.core.analysis import analyze
from workbench.figures.timeline import dragged_estimate
from workbench.figures.timeline_drag import drag_readout


def calendar():
    plan = Plan(Settings(start=dt.date(2027, 3, 1)), [Activity("A", duration=1)], [])
    return analyze(plan).calendar          # Mon 1 Mar 2027, weekdays


def test_a_fixed_duration_says_its_length_and_finish():
    before = Activity("F", duration=3)
    after = before.with_(**dragged_estimate(before, 6.4, resolution=1.0))
    # six working days from Mon 1 Mar: Mon–Fri, then Mon 8 Mar
    assert drag_readout(calendar(), "days", before, after, 0.0) == [
        "6 days (was 3)", "finishes Mon 8 Mar 2027"]


def test_an_estimate_names_te_most_likely_and_a_widened_pessimistic():
    before = Activity("E", optimistic=5, most_likely=8, pessimistic=14)
    after = before.with_(**dragged_estimate(before, 13.0, resolution=1.0))
    # te 13 needs m = (6·13 − 5 − 14)/4 = 14.75 > 14: the pessimistic widens and
    # m = (6·13 − 5)/5 = 14.6 (te = (5 + 4·14.6 + 14.6)/6 = 13)
    lines = drag_readout(calendar(), "days", before, after, 2.0)
    assert lines == ["te 13 days (was 8.5)", "most likely 14.6 (was 8)", "pessimistic 14.6 (was 14)",
                     "finishes Fri 19 Mar 2027"]     # working days 3..15 from Wed 3 Mar


def test_a_dragged_milestone_is_dated_the_day_it_starts():
    before = Activity("M", duration=2)
    after = before.with_(duration=0.0)
    assert drag_readout(calendar(), "days", before, after, 5.0)[-1] == "finishes Mon 8 Mar 2027"
