"""Dragging a bar's end: a note says the new length and finish date while the pointer
moves, the value lands on whole working days, and the view does not jump on release."""

import datetime as dt

import numpy as np
import pytest
from PySide6.QtCore import QPoint, QPointF, Qt
from PySide6.QtTest import QTest

from workbench.core import Activity, Link, Plan, Settings
from workbench.core.formatting import format_date
from workbench.ui.session import Session
from workbench.ui.timeline.view import TimelineView
from support.timeline import bar_of
from support.ui import shown


def plan(unit="days"):
    acts = [Activity("A", "Survey", optimistic=1, most_likely=2, pessimistic=3),
            Activity("C", "Assemble", optimistic=6, most_likely=9, pessimistic=18),
            Activity("D", "Paint", duration=3),
            Activity("M", "Handover", duration=0)]
    links = [Link("A", "C"), Link("A", "D"), Link("C", "M"), Link("D", "M")]
    return Plan(Settings(start=dt.date(2026, 12, 7), unit=unit), acts, links)


@pytest.fixture
def view(qtbot):
    v = shown(qtbot, TimelineView(Session(plan())), (1024, 500))
    v.fit_all()
    qtbot.wait(20)          # the item's transform follows the fitted range
    return v


def bar_end(view, act_id):
    return bar_of(view, act_id)[1:]


def px(view, x, row) -> QPoint:
    p = view.item.deviceTransform_().map(QPointF(x, row))
    return QPoint(round(p.x()), round(p.y()))


def data_x(view, point: QPoint) -> float:
    return view.item.deviceTransform_().inverted()[0].map(QPointF(point)).x()


def press_move(view, start: QPoint, end: QPoint, steps: int = 5):
    vp = view.plot.viewport()
    QTest.mousePress(vp, Qt.MouseButton.LeftButton, Qt.KeyboardModifier.NoModifier, start)
    for k in range(1, steps + 1):
        QTest.mouseMove(vp, start + (end - start) * k / steps)
        QTest.qWait(5)
    return vp


def test_the_note_says_the_new_length_and_finish_while_dragging(view):
    row, es, ef = bar_end(view, "D")                 # 3 working days from Mon 7 Dec 2026
    start = px(view, ef, row)
    target = px(view, es + 5.3, row)                 # pointer noise: 5.3 days
    vp = press_move(view, start, target)
    text = view.bar_drag.readout.text()
    # 5 working days from Tue 8 Dec (after A's te of 2, i.e. two days from Mon 7 Dec):
    # Wed 9, Thu 10, Fri 11, Mon 14, Tue 15 Dec 2026
    calendar = view.session.analysis.calendar
    assert "5 days (was 3)" in text
    assert f"finishes {format_date(calendar.finish_date(es + 5))}" in text
    assert format_date(calendar.finish_date(es + 5)) == "Tue 15 Dec 2026"
    assert view.session.plan.activity("D").duration == 3          # nothing pushed yet
    QTest.mouseRelease(vp, Qt.MouseButton.LeftButton, Qt.KeyboardModifier.NoModifier, target)
    assert view.bar_drag.readout.text() == ""                       # gone on release
    assert view.session.plan.activity("D").duration == 5.0


def test_an_estimate_shows_te_and_most_likely_and_lands_on_whole_days(view):
    row, es, ef = bar_end(view, "C")
    target = QPoint(px(view, ef, row).x() + 97, px(view, ef, row).y())
    vp = press_move(view, px(view, ef, row), target)
    text = view.bar_drag.readout.text()
    assert text.startswith("te ") and "most likely" in text and "finishes" in text
    QTest.mouseRelease(vp, Qt.MouseButton.LeftButton, Qt.KeyboardModifier.NoModifier, target)
    after = view.session.plan.activity("C")
    wanted = round(data_x(view, target) - es)                     # whole working days
    assert after.mean == pytest.approx(wanted, abs=0.01)
    assert abs(after.mean - round(after.mean)) < 0.01               # not 12.3 of pointer noise
    assert view.session.undo_stack.count() == 1


def test_a_plan_in_weeks_snaps_to_a_working_day(qtbot):
    v = shown(qtbot, TimelineView(Session(plan("weeks"))), (1024, 500))
    v.fit_all()
    qtbot.wait(20)
    row, es, ef = bar_end(v, "D")
    target = px(v, es + 3.37, row)
    vp = press_move(v, px(v, ef, row), target)
    QTest.mouseRelease(vp, Qt.MouseButton.LeftButton, Qt.KeyboardModifier.NoModifier, target)
    days = v.session.plan.activity("D").duration * 5               # a week of five working days
    assert days == pytest.approx(round(days)) and days != 15


def test_the_view_stays_where_it_was_after_release(view):
    """Lengthening the last activity moves the plan's finish: a refit would shift the
    dates on screen; the view keeps its range instead."""
    row, es, ef = bar_end(view, "C")
    before = view.view_box.viewRange()
    target = px(view, ef + 4, row)
    vp = press_move(view, px(view, ef, row), target)
    QTest.mouseRelease(vp, Qt.MouseButton.LeftButton, Qt.KeyboardModifier.NoModifier, target)
    assert view.session.plan.activity("C").mean > 10                # the plan did change
    after = view.view_box.viewRange()
    assert np.allclose(after[0], before[0]) and np.allclose(after[1], before[1])
    view.session.undo_stack.undo()                                  # one undo step
    assert view.session.plan.activity("C").most_likely == 9
