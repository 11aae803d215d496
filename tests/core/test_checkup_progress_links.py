"""Checkup's link metrics read the lags the planner entered, also from a status date (the
engine marks links that progress has passed with a lag of minus infinity; that is no lead)."""

import datetime as dt

from workbench.core import Activity, Link, Plan, Settings
from workbench.core.checkup import run_checkup
from workbench.core.progress_fields import Progress

START = dt.date(2027, 1, 4)          # a Monday


def progressed_plan() -> Plan:
    """A started (SS +5 to B, FS to E); C done (FS -2 to D, a real lead); status 13 January."""
    acts = [Activity("A", duration=10, progress=Progress(actual_start=START)),
            Activity("B", duration=4),
            Activity("C", duration=3, progress=Progress(actual_start=START, actual_finish=dt.date(2027, 1, 6))),
            Activity("D", duration=5),
            Activity("E", duration=2)]
    links = [Link("A", "B", "SS", 5.0), Link("C", "D", "FS", -2.0), Link("A", "E"), Link("B", "E"), Link("D", "E")]
    return Plan(Settings(start=START, status_date=dt.date(2027, 1, 13)), acts, links)


def test_a_started_ss_link_is_no_lead_and_keeps_its_lag_in_the_notes():
    plan = progressed_plan()
    checkup = run_checkup(plan, with_simulation=False)
    leads, lags, types = checkup.get("leads"), checkup.get("lags"), checkup.get("link_types")
    assert leads.offenders == ["D"]
    assert "C \u2192 D (FS -2)" in leads.note and "inf" not in leads.note
    assert lags.offenders == ["B"] and "A \u2192 B (SS +5)" in lags.note
    text = " ".join(str(c.note) + " " + str(c.figure) for c in checkup)
    assert "inf" not in text
    assert types.offenders == ["B"] and "A \u2192 B (SS +5)" in types.note
