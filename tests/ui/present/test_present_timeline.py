"""Present mode's Timeline slide on a 1024×768 projector: groups folded so every row fits
large, keys to open them or show the critical path, the opened rows in pages at the
Present type with keys to turn them, reference-line labels apart, whole date labels. Geometry and pixel facts, offscreen Qt."""

from __future__ import annotations

import numpy as np
import pytest
from PySide6.QtCore import QPointF, QRectF, Qt
from PySide6.QtGui import QColor, QFontMetricsF

from workbench.core.montecarlo import simulate
from workbench.figures import style
from workbench.ui.present.shots import _plan
from workbench.ui.session import Session

from support.ui import present_at
from workbench.ui.timeline.present import continued_group, fold_all, group_names, rows_note


@pytest.fixture(scope="module")
def demo():
    plan = _plan(None)
    return plan, simulate(plan, iterations=500, seed=3)


@pytest.fixture
def slide(qtbot, demo):
    plan, sim = demo
    session = Session(plan.copy())
    session.set_simulation(sim)
    win = present_at(qtbot, session, 1)
    qtbot.wait(20)
    view = win.stack.currentWidget()
    assert win.current_title() == "Timeline"
    return win, view


def rows_in_view(view):
    (_, _), (top, bottom) = view.view_box.viewRange()
    return top, bottom


def row_px(view) -> float:
    top, bottom = rows_in_view(view)
    return view.view_box.height() / (bottom - top)


def test_opens_with_groups_folded_and_every_row_in_view_at_a_large_size(slide):
    win, view = slide
    geo = view.geometry
    groups = group_names(view.session.plan)
    assert len(groups) >= 2 and geo.n_rows == len(groups)          # one summary row per group
    assert set(geo.kinds) == {"group"}
    top, bottom = rows_in_view(view)
    assert top <= -0.5 and bottom >= geo.n_rows - 0.5                # no row cut off
    assert row_px(view) >= style.PRESENT.row_height                 # at least Present's row size
    assert "G:" in win.counter.text()                               # the keys are on the slide


def open_groups(view, qtbot):
    qtbot.keyClick(view.plot, Qt.Key.Key_G)
    qtbot.wait(20)


def labelled_rows(view):
    """The rows that carry a label now, and the label type."""
    labels = view.row_axis.generateDrawSpecs(None)[2]
    assert labels.step == 1                                          # no row shares a label
    return labels.rows.tolist(), labels.font


def centred_rows(view) -> list[int]:
    """Rows whose centre lies inside the chart, below the header band of the line labels
    (on a later page it spans the rows before the page: they are not drawn, see
    ``test_rows_above_a_later_page_leave_the_header_band_to_the_line_labels``)."""
    top, bottom = rows_in_view(view)
    return [r for r in range(view.geometry.n_rows) if max(top, view.page_first - 0.5) < r < bottom]


def test_g_opens_every_group_as_a_page_of_rows_in_the_present_type(slide, qtbot):
    win, view = slide
    n_acts = len(view.session.plan.activities)
    open_groups(view, qtbot)
    n = view.geometry.n_rows
    assert n == n_acts + len(group_names(view.session.plan))
    rows, font = labelled_rows(view)
    present_px = round(style.PRESENT.label_font_size * 96 / 72)
    assert font.pixelSize() >= present_px == view.row_axis.floor_px  # the Present type, never smaller
    assert rows == centred_rows(view) == list(range(len(rows)))      # every row shown is labelled
    assert 10 <= len(rows) < n
    assert row_px(view) >= view.legible_row_pitch() - 0.01
    assert view.row_axis.page_note.splitlines()[0] == f"Rows 1\u2013{len(rows)} of {n}"
    assert "more rows" in view.row_axis.page_note
    assert "[ ]" in win.counter.text()                               # the keys are on the slide


def test_paging_keys_show_the_next_rows_and_the_note_follows(slide, qtbot):
    win, view = slide
    open_groups(view, qtbot)
    first_page, _ = labelled_rows(view)
    per = len(first_page)
    qtbot.keyClick(view.plot, Qt.Key.Key_BracketRight)
    rows, font = labelled_rows(view)
    assert rows == centred_rows(view) == list(range(per, 2 * per))
    assert font.pixelSize() >= view.row_axis.floor_px
    assert view.row_axis.page_note.splitlines()[0] == f"Rows {per + 1}\u2013{2 * per} of {view.geometry.n_rows}"
    assert "back" in view.row_axis.page_note
    assert win.current_title() == "Timeline"                         # the key did not step slides
    qtbot.keyClick(view.plot, Qt.Key.Key_P)                           # back, with the other key
    assert labelled_rows(view)[0] == first_page
    qtbot.keyClick(view.plot, Qt.Key.Key_BracketLeft)                 # no page before the first
    assert labelled_rows(view)[0] == first_page
    qtbot.keyClick(view.plot, Qt.Key.Key_N)
    assert labelled_rows(view)[0] == list(range(per, 2 * per))


def test_the_last_page_ends_at_the_last_row(slide, qtbot):
    win, view = slide
    open_groups(view, qtbot)
    n = view.geometry.n_rows
    per = len(labelled_rows(view)[0])
    for _ in range(n // per + 3):                                      # more presses than pages
        qtbot.keyClick(view.plot, Qt.Key.Key_BracketRight)
    rows, _ = labelled_rows(view)
    assert rows == centred_rows(view) == list(range(n - per, n))      # a full page, the last row last
    assert view.row_axis.page_note.splitlines()[0] == f"Rows {n - per + 1}\u2013{n} of {n}"
    assert "more rows" not in view.row_axis.page_note
    assert win.current_title() == "Timeline"


def test_rows_above_a_later_page_leave_the_header_band_to_the_line_labels(slide, qtbot):
    win, view = slide
    open_groups(view, qtbot)
    qtbot.keyClick(view.plot, Qt.Key.Key_BracketRight)
    qtbot.wait(20)
    first = view.page_first
    assert first > 0
    vb = view.view_box
    band_bottom = vb.mapViewToScene(QPointF(0, first - 0.5)).y()
    band_top = vb.sceneBoundingRect().top()
    assert band_bottom - band_top > 60
    for name in ("start", "deadline", "p10", "p90"):
        label = view._lines[name].label
        rect = label.sceneBoundingRect()
        assert label.isVisible() and band_top - 1 <= rect.top() and rect.bottom() <= band_bottom + 1, name
    a, b = (view._lines[k].label.sceneBoundingRect() for k in ("p10", "p90"))
    assert not a.intersects(b)
    image = view.plot.grab().toImage()
    left = round(vb.sceneBoundingRect().left())
    bar_blue = QColor(style.WORK)
    inked = [(x, y) for y in range(round(band_top) + 2, round(band_bottom) - 2, 2)
             for x in range(left + 2, image.width() - 2, 3)
             if _near(image.pixelColor(x, y), bar_blue)]
    assert inked == []                                                 # no bars of earlier rows there
    assert len(view.date_axis.shown_labels()) >= 2                     # the date axis still labelled


def _near(colour, target, tol=30) -> bool:
    return all(abs(a - b) <= tol for a, b in zip(colour.getRgb()[:3], target.getRgb()[:3]))


def test_g_again_folds_back_to_the_whole_view(slide, qtbot):
    win, view = slide
    open_groups(view, qtbot)
    qtbot.keyClick(view.plot, Qt.Key.Key_BracketRight)
    open_groups(view, qtbot)                                           # fold them again
    n = view.geometry.n_rows
    assert n == len(group_names(view.session.plan))
    top, bottom = rows_in_view(view)
    assert top <= -0.5 and bottom >= n - 0.5
    assert labelled_rows(view)[0] == list(range(n))
    assert view.row_axis.page_note == "" and view.page_first == 0 and view.item.first_row == 0


def test_c_shows_the_critical_activities_themselves(slide, qtbot):
    win, view = slide
    qtbot.keyClick(view.plot, Qt.Key.Key_C)
    geo = view.geometry
    critical = set(view.session.analysis.pert.path)
    shown = {k for k, kind in zip(geo.keys, geo.kinds) if kind != "group"}
    assert critical <= shown and shown <= set(view.session.plan.ids())
    assert win.current_title() == "Timeline"                        # the key did not step slides
    qtbot.keyClick(view.plot, Qt.Key.Key_C)
    assert not view.critical_only


def test_finish_p10_and_p90_labels_do_not_overlap(slide):
    _, view = slide
    assert {"p10", "p90"} <= set(view._lines)
    a = view._lines["p10"].label.sceneBoundingRect()
    b = view._lines["p90"].label.sceneBoundingRect()
    assert a.height() > 10 and b.height() > 10
    assert not a.intersects(b)


def test_date_labels_are_whole_and_inside_the_slide(slide):
    win, view = slide
    axis = view.date_axis
    labels = axis.shown_labels()
    assert len(labels) >= 2
    _, (_, xs), texts = axis.generateDrawSpecs(None)
    room = axis.boundingRect()
    font_px = axis.style["tickFont"].pixelSize()
    assert font_px >= 16
    for x, top, w, text in texts:
        assert room.left() <= x and x + w <= room.right()
        assert top + font_px <= room.bottom() + 1                   # not cut at the foot
    bottom = axis.mapRectToScene(room).bottom()
    assert bottom <= view.plot.height()


def test_the_last_date_label_lies_inside_the_screen(slide):
    """The chart reaches the slide's right edge: a month label centred on a tick near it
    would be cut there, so it is left out rather than drawn in part."""
    win, view = slide
    axis = view.date_axis
    _, (_, xs), texts = axis.generateDrawSpecs(None)
    shown = view.plot.viewport().rect()
    assert len(texts) >= 2
    for x, top, w, text in texts:
        rect = view.plot.mapFromScene(axis.mapRectToScene(QRectF(x, top, w, 10))).boundingRect()
        assert shown.left() <= rect.left() and rect.right() <= shown.right() + 1, (text, rect, shown)
    right_edge = view.plot.mapFromScene(axis.mapToScene(QPointF(float(xs[-1]), 0))).x()
    assert right_edge > shown.right() - 30       # a tick near the edge: the case that cut "Oct"


def test_date_labels_are_drawn_below_the_chart(slide):
    win, view = slide
    image = view.plot.grab().toImage()
    axis_rect = view.date_axis.mapRectToScene(view.date_axis.boundingRect()).toRect()
    band = np.array([[image.pixelColor(x, y).lightness() for x in range(axis_rect.left(), axis_rect.right(), 2)]
                     for y in range(axis_rect.top() + 8, min(axis_rect.bottom(), image.height() - 1))])
    assert (band < 100).sum() > 50                                   # dark text pixels under the ticks


def test_the_finish_lines_come_with_the_odds_caution(slide):
    win, view = slide
    assert {"p10", "p90"} <= set(view._lines)                       # simulated finish lines drawn
    assert win.caution.isVisible() and "judgement" in win.caution.text()


def test_a_group_folded_on_a_page_refits_the_pages(slide, qtbot):
    win, view = slide
    open_groups(view, qtbot)
    n = view.geometry.n_rows
    members = sum(1 for a in view.session.plan.activities if a.group == "Approvals")
    view.toggle_group("Approvals")                                     # what a click on its row does
    assert view.geometry.n_rows == n - members
    assert view.row_axis.page_note.splitlines()[0].endswith(f"of {n - members}")
    rows, _ = labelled_rows(view)
    assert rows == centred_rows(view) and rows[0] == 0


def test_dragging_the_rows_by_hand_leaves_the_pages(slide, qtbot):
    win, view = slide
    open_groups(view, qtbot)
    qtbot.keyClick(view.plot, Qt.Key.Key_BracketRight)
    first = view.page_first
    assert first > 0
    view.view_box.sigRangeChangedManually.emit([False, True])          # as a wheel or a drag does
    assert view.page_first == view.item.first_row == 0 and view.row_axis.page_note == ""
    rows, font = labelled_rows(view)
    assert rows[0] < first                                             # the rows above are back
    assert font.pixelSize() >= view.row_axis.floor_px
    qtbot.keyClick(view.plot, Qt.Key.Key_BracketRight)                 # the pages come back
    assert view.page_first > 0 and view.row_axis.page_note


def test_a_page_that_starts_inside_a_group_names_the_group(slide):
    _, view = slide
    fold_all(view, False)
    geo = view.geometry
    inside = geo.row_of["B6"]
    assert geo.kinds[inside] != "group"
    assert continued_group(geo, inside) == "Building works"
    assert continued_group(geo, geo.keys.index("Services")) == ""      # a page starting at a group row
    note = rows_note(inside, 17, geo.n_rows, continued_group(geo, inside))
    assert note.splitlines()[:2] == [f"Rows {inside + 1}\u2013{inside + 17} of {geo.n_rows}",
                                     "Building works, continued"]


@pytest.mark.parametrize("simulated", [False, True])
def test_the_page_note_sits_above_the_first_label(demo, qtbot, simulated):
    plan, sim = demo
    session = Session(plan.copy())
    if simulated:
        session.set_simulation(sim)
    win = present_at(qtbot, session, 1)
    view = win.stack.currentWidget()
    open_groups(view, qtbot)
    qtbot.keyClick(view.plot, Qt.Key.Key_BracketRight)
    labels = view.row_axis.generateDrawSpecs(None)[2]
    lines = view.row_axis.page_note.splitlines()
    assert len(lines) == 4                                             # rows, group, both keys
    note_bottom = labels.bounds.top() + 2 + len(lines) * QFontMetricsF(labels.font).lineSpacing()
    first_top = min(top for _, top, *_ in labels.specs())
    assert note_bottom <= first_top
