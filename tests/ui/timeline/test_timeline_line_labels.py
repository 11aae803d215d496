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
    view = TimelineView(session)
    qtbot.addWidget(view)
    view.resize(1400, 700)
    view.show()
    qtbot.waitExposed(view)
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
