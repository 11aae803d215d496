"""The Timeline in a small dock (1024×768 window) with a status date and a simulation: the
line labels take as many header lines as they need, apart from each other, and the rows
below keep a legible pitch and the full label type (fewer rows, reached by scrolling)."""

import pytest
from PySide6.QtCore import QPointF

from workbench.core.montecarlo import simulate
from workbench.io.planfile import load_plan
from workbench.resources import demo_update_path
from workbench.ui.session import Session
from workbench.ui.timeline.view import TimelineView
from support.ui import shown

DOCK = (590, 200)     # the Timeline dock of a 1024×768 window, loading band hidden


@pytest.fixture(scope="module")
def progressed():
    plan = load_plan(demo_update_path())
    assert plan.settings.status_date is not None
    return plan, simulate(plan, iterations=300, seed=5)


def label_boxes(view):
    return {name: view.plot.mapFromScene(line.label.sceneBoundingRect()).boundingRect()
            for name, line in view.reference.lines.items() if line.label.isVisible()}


@pytest.mark.parametrize("size", [DOCK, (788, 240)])
@pytest.mark.parametrize("rows_to_fit", [True, False])     # on opening / the Fit all button
def test_rows_stay_legible_under_five_lines_of_labels(qtbot, progressed, size, rows_to_fit):
    plan, sim = progressed
    session = Session(plan.copy())
    view = shown(qtbot, TimelineView(session), size)
    view.set_loading_band(False)
    qtbot.wait(20)      # laid out without the band
    session.set_simulation(sim)
    view.fit_all(rows_to_fit=rows_to_fit)
    qtbot.wait(20)
    assert {"start", "deadline", "status", "p10", "p90"} == set(view.reference.lines)
    axis = view.row_axis
    bounds = axis.mapRectFromParent(axis.geometry())
    (_, _), (top, bottom) = view.view_box.viewRange()
    assert view.view_box.height() / (bottom - top) >= view.legible_row_pitch() - 0.01
    assert axis.row_font(bounds).pixelSize() == view._font().pixelSize()       # not shrunk
    assert axis.shown_labels()[0].endswith("Approvals")                        # from the top
    boxes = label_boxes(view)
    assert set(boxes) == set(view.reference.lines)                             # every label shown
    first_row_top = view.item.deviceTransform_().map(QPointF(0, -0.5)).y()
    names = sorted(boxes)
    for i, a in enumerate(names):
        assert boxes[a].bottom() <= first_row_top + 1, a                       # over no row
        for b in names[i + 1:]:
            assert not boxes[a].intersects(boxes[b]), (a, b)
