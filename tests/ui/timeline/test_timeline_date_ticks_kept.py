"""The Timeline's date axis keeps the ticks it chose while the range, the width, the font
and the calendar's working days stay the same (an edit makes a new calendar of the same
days), and chooses again when any of them changes."""

import dataclasses

from support.plans import footbridge_plan
from workbench.core.commands import EditActivity, SetSettings
from workbench.ui.session import Session
from workbench.ui.timeline.view import TimelineView
from support.ui import shown


def _view(qtbot):
    view = shown(qtbot, TimelineView(Session(footbridge_plan())), (900, 500))
    view.fit_all()
    view.view_box.setXRange(0, 40, padding=0)        # days on the axis: holidays move ticks
    qtbot.wait(10)
    return view


def test_ticks_kept_across_an_edit_and_chosen_again_on_zoom_and_calendar_change(qtbot):
    view = _view(qtbot)
    axis = view.date_axis
    labels = axis.shown_labels()
    kept = axis._fitted
    session = view.session
    first = session.plan.activities[1]
    session.push(EditActivity(first.id, name="Renamed"))
    view.view_box.setXRange(0, 40, padding=0)
    assert axis._calendar is session.analysis.calendar
    assert axis.shown_labels() == labels and axis._fitted is kept          # same days, same ticks
    view.view_box.setXRange(0, 400, padding=0)                              # zoomed out: chosen again
    assert axis.shown_labels() != labels
    view.view_box.setXRange(0, 40, padding=0)
    assert axis.shown_labels() == labels
    settings = session.plan.settings
    day = session.analysis.calendar.start_date(3.0)
    cal = dataclasses.replace(settings.calendar, holidays=tuple(settings.calendar.holidays) + (day,))
    session.push(SetSettings(dataclasses.replace(settings, calendar=cal)))
    view.view_box.setXRange(0, 40, padding=0)
    assert axis._calendar is session.analysis.calendar
    axis.shown_labels()
    assert axis._fitted is not kept                                          # another calendar: chosen again
    assert [o for o, _ in axis._fitted] != [o for o, _ in kept]
