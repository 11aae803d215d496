"""Timeline "Fit all" on a long plan: rows stay at a legible pitch, each with its own label."""

import datetime as dt
import math

import numpy as np
import pytest
from PySide6.QtCore import QPointF, Qt
from PySide6.QtGui import QFontMetricsF
from PySide6.QtTest import QTest

from workbench.core import Activity, Link, Plan, Settings
from workbench.ui.session import Session
from workbench.ui.timeline.output import render_image
from workbench.ui.timeline.view import TimelineView
from support.ui import shown

PROJECTOR = (1024, 768)


def long_plan(n=100):
    acts = [Activity(f"K{i}", f"Step {i}", duration=1 + i % 4) for i in range(n)]
    links = [Link(f"K{i}", f"K{i + 1}") for i in range(0, n - 1, 3)]
    return Plan(Settings(start=dt.date(2027, 3, 1)), acts, links)


def open_view(qtbot, plan, size=PROJECTOR):
    v = shown(qtbot, TimelineView(Session(plan)), size)
    return v


def rows_in_view(v):
    """Rows whose centre lies inside the plot area."""
    _, (top, bottom) = v.view_box.viewRange()
    return list(range(max(0, math.ceil(top)), min(v.geometry.n_rows - 1, math.floor(bottom)) + 1))


def row_pitch_px(v):
    _, (top, bottom) = v.view_box.viewRange()
    return v.view_box.height() / (bottom - top)


def ink_rows(v, image, rows):
    """Rows whose band in the label column holds dark (text) pixels in ``image``."""
    rect = v.plot.mapFromScene(v.row_axis.sceneBoundingRect()).boundingRect()
    inked = []
    for row in rows:
        y = round(v.item.deviceTransform_().map(QPointF(0.0, row)).y())
        band = [image.pixelColor(x, yy).lightness() for x in range(rect.left() + 2, rect.right() - 4)
                for yy in range(y - 4, y + 5)]
        if min(band) < 110:
            inked.append(row)
    return inked


def test_fit_all_at_projector_size_labels_every_visible_row(qtbot):
    v = open_view(qtbot, long_plan())
    v.fit_all()
    image = render_image(v)
    rows = rows_in_view(v)
    font_px = QFontMetricsF(v.row_axis.style["tickFont"]).height()
    assert v.row_axis.style["tickFont"].pixelSize() >= 11
    assert row_pitch_px(v) >= v.legible_row_pitch() - 0.01 >= font_px * 1.05
    assert rows[0] == 0 and 20 <= len(rows) < 100           # from the top; the rest by scrolling
    shown = v.row_axis.shown_labels()
    assert shown[:len(rows)] == [f"K{r}  Step {r}" for r in rows]
    assert ink_rows(v, image, rows) == rows                   # each label really drawn


def test_scrolling_down_reaches_later_rows_still_labelled(qtbot):
    v = open_view(qtbot, long_plan())
    v.fit_all()
    v.plot.setFocus()
    for _ in range(30):
        QTest.keyClick(v.plot, Qt.Key.Key_Down)
    image = render_image(v)
    rows = rows_in_view(v)
    assert rows[-1] == 99 and rows[0] > 50
    assert ink_rows(v, image, rows) == rows
    assert row_pitch_px(v) >= v.legible_row_pitch() - 0.01


def test_every_row_squeezes_the_whole_plan_in_with_thinned_labels(qtbot):
    v = open_view(qtbot, long_plan())
    v.actions_by_name["fit_rows"].trigger()
    render_image(v)
    assert rows_in_view(v) == list(range(100))
    assert row_pitch_px(v) < v.legible_row_pitch()
    assert 0 < len(v.row_axis.shown_labels()) < 100


def test_short_plan_fits_all_rows(qtbot):
    v = open_view(qtbot, long_plan(8))
    v.fit_all()
    assert rows_in_view(v) == list(range(8))
    assert row_pitch_px(v) > v.legible_row_pitch()


def test_present_mode_fits_every_row_that_fits_at_full_type(qtbot):
    v = open_view(qtbot, long_plan(8))
    v.set_present(True)
    v.fit_all()
    assert rows_in_view(v) == list(range(8))
    assert v.row_axis.page_note == ""


def test_present_mode_shows_a_page_of_rows_at_full_type_when_they_do_not_fit(qtbot):
    v = open_view(qtbot, long_plan(40))
    v.set_present(True)
    v.fit_all()
    rows = rows_in_view(v)
    assert rows[0] == 0 and 5 <= len(rows) < 40                   # a page from the top, not all 40
    assert row_pitch_px(v) >= v.legible_row_pitch() - 0.01
    assert v.row_axis.page_note.startswith(f"Rows 1\u2013{len(rows)} of 40")


@pytest.mark.parametrize("height", [400, 768, 1080])
def test_pitch_never_below_legible_at_any_height(qtbot, height):
    v = open_view(qtbot, long_plan(), (1024, height))
    v.fit_all()
    assert row_pitch_px(v) >= v.legible_row_pitch() - 0.01
    assert np.isclose(v.view_box.viewRange()[1][0], -0.5, atol=3.0)


def test_label_column_follows_a_rename_but_not_an_estimate_edit(qtbot):
    from workbench.core.commands import EditActivity
    v = open_view(qtbot, long_plan(30))
    width = v.row_axis.width()
    v.session.push(EditActivity("K3", duration=9))             # same rows: the column keeps its width
    assert v.row_axis.width() == width
    v.session.push(EditActivity("K4", name="Step four: pour and cure the ground floor slab"))
    qtbot.waitUntil(lambda: v.row_axis.width() > width)
    wider = v.row_axis.width()
    v.session.undo_stack.undo()
    qtbot.waitUntil(lambda: v.row_axis.width() == width)
    assert wider > width
