"""The summary strip says how much float the critical path has when a deadline sets the
late dates (so "critical" beside a float of 6 reads right)."""

import datetime as dt

import pytest

from workbench.core import Activity, Link, Plan, Settings
from workbench.ui.session import Session
from workbench.ui.workspace.summary_strip import SummaryStrip


def chain(deadline, unit="days") -> Plan:
    acts = [Activity("A", "Dig", duration=4), Activity("B", "Pour", duration=6), Activity("C", "Cure", duration=2)]
    return Plan(Settings(start=dt.date(2027, 3, 1), unit=unit, deadline=deadline), acts,
                [Link("A", "B"), Link("A", "C")])


@pytest.mark.parametrize("deadline, unit, said", [
    (None, "days", None),
    (10.0, "days", None),                                   # the deadline is the finish: no float left
    (16.0, "days", "6 days of float to the deadline"),
    (11.0, "days", "1 day of float to the deadline"),
    (7.0, "days", "3 days late for the deadline (negative float)"),
    (12.5, "weeks", "2.5 weeks of float to the deadline"),
    (10.0 - 17 / 6, "days", "2.8 days late for the deadline (negative float)"),   # rounded like every figure
    (10.0 + 1 / 3, "days", "0.3 days of float to the deadline"),
    (10.02, "days", None),                                  # rounds to no float: nothing to say
])
def test_the_critical_paths_float_to_the_deadline_is_said(qtbot, deadline, unit, said):
    strip = SummaryStrip(Session(chain(deadline, unit)))
    qtbot.addWidget(strip)
    path = strip.texts()["path"]
    assert path.startswith("A → B")
    if said is None:
        assert "deadline" not in path
    else:
        assert path.endswith(said)
    assert strip.values["path"].text() == path
