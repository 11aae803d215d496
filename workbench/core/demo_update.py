"""The second demo plan: the Kestrel Vale clinic fit-out three months later (invented).

The board approved the plan on 26 February 2027 (the approved baseline). By the status
date, Friday 28 May 2027, the design is done, planning consent took four weeks longer than
hoped, the contractor was appointed a week late and is mobilising, the X-ray unit's maker
has quoted eleven more weeks, recruitment is under way, and a crew started the entrance
ramp before the strip-out it should follow (out-of-sequence progress). Asbestos found in
the survey became an activity of its own, and the lift was re-estimated after a quote.
Three monthly updates each recorded the chance of the committed opening date: the odds
trend a newcomer sees in the Odds view and the pack.

>>> plan = demo_update_plan(plan_hash)      # plan_hash: workbench.io.planfile.plan_hash
"""

from __future__ import annotations

import datetime as dt

from .analysis import analyze
from .baseline import make_baseline, make_trend_point, with_trend_point
from .calendar import WorkCalendar
from .demo import demo_plan
from .model import Activity, Link
from .montecarlo import simulate
from .progress_fields import Progress

D = dt.date
APPROVED_ON = D(2027, 2, 26)
UPDATES = (D(2027, 3, 26), D(2027, 4, 30), D(2027, 5, 28))
ITERATIONS = 4000

# id: (actual start, actual finish or None, remaining work of what is in progress)
ACTUALS = {
    "M0": (D(2027, 3, 1), D(2027, 3, 1), None),
    "A1": (D(2027, 3, 1), D(2027, 3, 9), None),
    "D1": (D(2027, 3, 1), D(2027, 3, 9), None),
    "X0": (D(2027, 3, 10), D(2027, 3, 18), None),
    "E1": (D(2027, 3, 10), D(2027, 3, 19), None),
    "A2": (D(2027, 3, 10), D(2027, 4, 16), None),
    "D2": (D(2027, 3, 10), D(2027, 3, 29), None),
    "D3": (D(2027, 3, 17), D(2027, 4, 14), None),
    "I2": (D(2027, 3, 24), D(2027, 4, 30), None),
    "E3": (D(2027, 3, 22), D(2027, 4, 23), None),
    "A3": (D(2027, 3, 30), D(2027, 4, 13), None),
    "D4": (D(2027, 4, 15), D(2027, 4, 28), None),
    "A4": (D(2027, 4, 29), D(2027, 5, 21), None),
    "E2": (D(2027, 3, 22), None, Progress(remaining_optimistic=40.0, remaining_most_likely=48.0,
                                          remaining_pessimistic=70.0)),
    "P1": (D(2027, 4, 19), None, Progress(percent_complete=35.0)),
    "X1": (D(2027, 3, 19), None, Progress(remaining=62.0)),
    "B1": (D(2027, 5, 24), None, Progress(remaining=2.0)),
    "B8": (D(2027, 5, 25), None, Progress(remaining=4.0)),
}
ASBESTOS = Activity("B2A", "Remove asbestos found behind the banking-hall panelling", "Building works",
                    optimistic=4.0, most_likely=6.0, pessimistic=10.0)
LIFT = dict(optimistic=20.0, most_likely=25.0, pessimistic=40.0)


def demo_update_plan(plan_hash) -> object:
    """The plan at its latest status date with its approved baseline and odds trend.
    ``plan_hash(plan)`` gives the hash stored with the baseline and trend points."""
    plan = demo_plan()
    plan.settings.title = "Kestrel Vale community clinic fit-out (May update)"
    plan.settings.revision = "C"
    first = simulate(plan, ITERATIONS, seed=2027)
    plan.baselines = [make_baseline("Board approval, February 2027", analyze(plan), plan_hash(plan), first,
                                    recorded=APPROVED_ON, approved=True)]
    _changes(plan)
    for day in UPDATES:
        _progress_at(plan, day)
        run = simulate(plan, ITERATIONS, seed=day.toordinal())
        plan.odds_trend = with_trend_point(plan.odds_trend, make_trend_point(analyze(plan), run, plan_hash(plan)))
    return plan


def _changes(plan) -> None:
    """The asbestos removal added after the survey, the lift re-estimated; the asbestos
    risk event has struck, so it leaves the risk list."""
    plan.insert_activity(plan.row_of("B2") + 1, ASBESTOS)
    plan.set_links(plan.links + [Link("B1", "B2A"), Link("B2A", "B3")])
    plan.replace_activity("B7", plan.activity("B7").with_(**LIFT))
    plan.risks = []


def _progress_at(plan, day: dt.date) -> None:
    """Progress as known at ``day``: actuals up to it; work then in progress reported as
    the share of its estimate elapsed (the latest update gives its remaining work)."""
    plan.settings.status_date = day
    cal = WorkCalendar(plan.settings)
    for act_id, (start, finish, left) in ACTUALS.items():
        act = plan.activity(act_id)
        if start > day:
            progress = None
        elif finish is not None and finish <= day:
            progress = Progress(actual_start=start, actual_finish=finish)
        elif day == UPDATES[-1]:
            progress = left.with_(actual_start=start)
        else:
            elapsed = cal.offset_through(day) - cal.offset_before(start)
            progress = Progress(actual_start=start, percent_complete=round(min(90.0, 100.0 * elapsed / act.mean)))
        plan.replace_activity(act_id, act.with_(progress=progress))
