"""The Timeline's line labels sit in the band above the first row: never over a bar, the
finish P10 / P90 labels on a line of their own, apart from each other and the deadline's."""

import numpy as np
from PySide6.QtCore import QPointF

from support.plans import footbridge_plan
from workbench.ui.session import Session
from workbench.ui.timeline.view import TimelineView


class Runs:
    def __init__(self, ids, finish):
        self.ids, self.finish = ids, np.asarray(finish, float)
        self.criticality = np.linspace(0, 1, len(ids))

    def percentile(self, p):
        return float(np.percentile(self.finish, p))


def test_labels_stay_in_the_header_and_apart(qtbot):
    session = Session(footbridge_plan())
    view = shown(qtbot, TimelineView(session), (1400, 700))
    qtbot.wait(50)
    finish = session.analysis.schedule.finish
    session.set_simulation(Runs(session.analysis.schedule.ids, np.linspace(finish - 4, finish + 9, 101)))
    view.fit_all()
    qtbot.wait(50)
    first_row_top = view.item.deviceTransform_().map(QPointF(0, -0.5)).y()
    boxes = {}
    for name, line in view.reference.lines.items():
        rect = line.label.sceneBoundingRect()
        boxes[name] = view.plot.mapFromScene(rect).boundingRect()
        assert boxes[name].bottom() <= first_row_top + 1, name          # above every bar
    assert {"start", "deadline", "p10", "p90"} <= set(boxes)
    for a, b in (("p10", "p90"), ("p10", "deadline"), ("p90", "deadline"), ("start", "deadline")):
        assert not boxes[a].intersects(boxes[b]), (a, b)


def _label_boxes(view):
    return {name: view.plot.mapFromScene(line.label.sceneBoundingRect()).boundingRect()
            for name, line in view.reference.lines.items() if line.label.isVisible()}


def _assert_apart_above_and_inside(view):
    first_row_top = view.item.deviceTransform_().map(QPointF(0, -0.5)).y()
    inside = view.plot.mapFromScene(view.view_box.sceneBoundingRect()).boundingRect()
    boxes = _label_boxes(view)
    names = sorted(boxes)
    for i, a in enumerate(names):
        box = boxes[a]
        assert box.bottom() <= first_row_top + 1, a                                  # over no bar
        assert inside.left() - 1 <= box.left() and box.right() <= inside.right() + 1, a   # not cut
        for b in names[i + 1:]:
            assert not box.intersects(boxes[b]), (a, b)
    return boxes


import pytest  # noqa: E402
from support.ui import shown


@pytest.mark.parametrize("size", [(590, 358), (788, 358)])      # the dock at 1024×768 and 1366×768
@pytest.mark.parametrize("simulated", [False, True])
def test_labels_apart_in_a_small_dock_and_after_zooming_out(qtbot, size, simulated):
    session = Session(footbridge_plan())
    view = shown(qtbot, TimelineView(session), size)
    if simulated:
        finish = session.analysis.schedule.finish
        session.set_simulation(Runs(session.analysis.schedule.ids, np.linspace(finish - 4, finish + 9, 101)))
    view.fit_all()
    qtbot.wait(20)
    boxes = _assert_apart_above_and_inside(view)
    assert set(boxes) == set(view.reference.lines)          # at a fit every label has room
    lo, hi = session.analysis.schedule.finish * -0.2, session.analysis.schedule.finish * 4
    view.view_box.setXRange(lo, hi, padding=0)           # zoomed out: start and deadline close together
    qtbot.wait(20)
    _assert_apart_above_and_inside(view)
