"""The Timeline draws the compared baseline beneath the bars, the work done so far and a
mark after bars that finish later than the baseline (pixel facts, not stored pictures)."""

from pathlib import Path

import numpy as np
import pytest
from PySide6.QtCore import QPoint, QPointF

from workbench.figures import style
from workbench.io.planfile import load_plan
from workbench.ui.session import Session
from workbench.ui.timeline.output import render_image
from workbench.ui.timeline.paint_living import BASELINE, DONE, SLIPPED
from workbench.ui.timeline.view import TimelineView
from support.ui import shown

SAMPLE = Path(__file__).resolve().parents[2] / "data" / "harbour_kiosk_progress_v3.slw"


@pytest.fixture
def view(qtbot):
    v = shown(qtbot, TimelineView(Session(load_plan(SAMPLE))), (1200, 600))
    v.fit_all()
    qtbot.wait(20)
    return v


def to_px(view, x, row) -> QPoint:
    p = view.item.deviceTransform_().map(QPointF(x, row))
    return QPoint(round(p.x()), round(p.y()))


def found_below(image, point: QPoint, colour: str, reach: int) -> bool:
    """The colour within ``reach`` pixels below ``point`` (same column)."""
    want = np.array(style.rgb255(colour))
    for dy in range(0, reach + 1):
        c = image.pixelColor(point.x(), point.y() + dy)
        if np.abs(np.array([c.red(), c.green(), c.blue()]) - want).max() <= 12:
            return True
    return False


def mark(view, kind, act_id):
    m = view.geometry.marks[kind]
    k = int(np.flatnonzero(m.rows == view.geometry.row_of[act_id])[0])
    return float(m.x0[k]), float(m.x1[k]), int(m.rows[k])


def test_baseline_done_and_slip_marks_have_their_colours(view):
    image = render_image(view)
    row_px = to_px(view, 0, 1).y() - to_px(view, 0, 0).y()
    b0, b1, row = mark(view, "baseline", "PERM")
    below = to_px(view, (b0 + b1) / 2, row)
    assert found_below(image, below, BASELINE, row_px // 2)
    d0, d1, row = mark(view, "done", "PERM")
    assert found_below(image, to_px(view, (d0 + d1) / 2, row), DONE, 1)
    _, x1, row = mark(view, "slipped", "FIT")
    tip = to_px(view, x1, row)
    assert any(found_below(image, QPoint(tip.x() + dx, tip.y() - 2), SLIPPED, 4) for dx in range(3, 10))


def test_without_a_baseline_the_bars_are_as_before(view, qtbot):
    view.session.plan.baselines = []
    view.session.recalculate()
    qtbot.wait(20)
    assert len(view.geometry.marks["baseline"]) == 0 and len(view.geometry.marks["slipped"]) == 0
    assert len(view.geometry.marks["done"]) == 3
