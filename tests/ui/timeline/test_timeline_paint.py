"""Timeline drawing shortcuts change nothing that is drawn: images kept for repaints give
the very pixels of a fresh drawing, row slicing and culling keep exactly the marks in view,
the dense merge keeps every covered pixel, and a hidden Timeline waits to redraw.
Offscreen Qt; no timings."""

from __future__ import annotations

import datetime as dt

import numpy as np
import pytest
from hypothesis import given, settings, strategies as st
from PySide6.QtGui import QImage
from PySide6.QtWidgets import QWidget

from workbench.core import Activity, Link, Plan, Settings
from workbench.core.commands import EditActivity
from workbench.figures.timeline import Marks
from workbench.ui.session import Session
from workbench.ui.timeline.paint import merge_runs, visible_x
from workbench.ui.timeline.view import TimelineView
from support.ui import shown


def chain_plan(n: int) -> Plan:
    acts = [Activity(f"T{i}", f"Task number {i}", optimistic=1, most_likely=2 + i % 4, pessimistic=9)
            for i in range(n)]
    links = [Link(f"T{i}", f"T{i + 1}") for i in range(0, n - 1, 2)]
    return Plan(Settings(start=dt.date(2026, 12, 7)), acts, links)


@pytest.fixture
def view(qtbot):
    v = shown(qtbot, TimelineView(Session(chain_plan(60))), (1100, 700))
    v.fit_all()
    qtbot.wait(20)
    return v


def render(v) -> QImage:
    image = QImage(v.size(), QImage.Format.Format_ARGB32_Premultiplied)
    v.render(image)
    return image


def test_repaints_from_kept_images_match_a_fresh_drawing(view):
    view.drop_paint_caches()
    fresh = render(view)                          # drawn directly
    assert view.item._cache is None and view.row_axis._image is None
    recorded = render(view)                       # same view again: images kept and blitted
    assert view.item._cache is not None and view.row_axis._image is not None
    assert view.date_axis._image is not None
    blitted = render(view)
    assert fresh == recorded == blitted
    assert fresh != render_after(view, lambda: view.pan(0.2))    # and the pictures are not stale


def render_after(view, change) -> QImage:
    change()
    return render(view)


def test_kept_images_are_dropped_by_an_edit(view):
    render(view)
    render(view)
    assert view.item._cache is not None
    view.session.push(EditActivity("T3", most_likely=7.0))
    assert view.item._cache is None


@settings(max_examples=60, deadline=None)
@given(st.lists(st.integers(0, 40), min_size=0, max_size=60), st.floats(-2, 45), st.floats(-2, 45))
def test_within_keeps_exactly_the_marks_on_the_rows_asked(rows, a, b):
    lo, hi = min(a, b), max(a, b)
    rows = np.array(rows, dtype=int)
    x0 = np.arange(rows.size, dtype=float)
    m = Marks(rows, x0, x0 + 1.0, np.arange(rows.size))
    assert (np.diff(m.rows) >= 0).all()                       # kept in row order
    assert (m.x0 == m.index).all()                            # fields moved together
    for lo_, hi_ in ((lo, hi), (lo - 0.5, hi + 0.5), (-np.inf, hi), (lo, np.inf)):   # the row table, built once
        part = m.within(lo_, hi_)
        want = sorted(i for i, r in zip(range(rows.size), rows) if lo_ <= r <= hi_)
        assert sorted(part.index.tolist()) == want


def test_row_table_of_marks_is_made_anew_with_a_new_geometry(view, qtbot):
    old = view.geometry
    before = old.marks["work"]
    before.within(0, 5)
    view.session.push(EditActivity("T3", most_likely=8.5))
    qtbot.waitUntil(lambda: view.geometry is not old)
    after = view.geometry.marks["work"]
    assert after is not before and "_starts" not in after.__dict__     # no table carried over
    for lo, hi in ((0, 5), (2.5, 40.2), (-3, 100)):
        want = np.flatnonzero((after.rows >= lo) & (after.rows <= hi))
        assert after.within(lo, hi).index.tolist() == after.index[want].tolist()


class _Px:
    def __init__(self, clip):
        self.clip = clip

    def x(self, v):
        return np.asarray(v, float) * 10.0


def test_marks_left_or_right_of_the_view_are_culled_and_long_ones_clipped():
    m = Marks(np.arange(4), np.array([-50.0, 5.0, 90.0, -500.0]), np.array([-20.0, 8.0, 95.0, 500.0]), np.arange(4))
    x0, x1, rows = visible_x(_Px((0.0, 300.0)), m)
    assert rows.tolist() == [1, 3]                             # before and after the view: gone
    assert x0.tolist() == [50.0, 0.0] and x1.tolist() == [80.0, 300.0]


@settings(max_examples=40, deadline=None)
@given(st.integers(0, 2**31 - 1), st.sampled_from([300.0, 200_000.0]))
def test_dense_merge_keeps_coverage_for_small_and_huge_pixel_ranges(seed, width):
    rng = np.random.default_rng(seed)
    n = 200
    x0 = rng.uniform(0, width, n)
    x1 = x0 + rng.uniform(0, width / 8, n)
    y = rng.integers(0, 12, n).astype(float)
    a, b, r = merge_runs(x0, x1, y)
    for row in range(12):
        spans = sorted(zip(np.round(x0[y == row]), np.maximum(np.round(x1[y == row]), np.round(x0[y == row]) + 1)))
        merged = sorted(zip(a[r == row], b[r == row]))
        union = []
        for s, e in spans:
            if union and s <= union[-1][1]:
                union[-1] = (union[-1][0], max(union[-1][1], e))
            else:
                union.append((s, e))
        assert [tuple(map(float, u)) for u in union] == [tuple(map(float, m)) for m in merged]


def test_a_hidden_timeline_redraws_only_once_shown(qtbot):
    holder = QWidget()
    qtbot.addWidget(holder)
    v = TimelineView(Session(chain_plan(8)), holder)
    holder.resize(800, 500)
    v.resize(800, 500)
    holder.show()
    qtbot.waitExposed(holder)
    qtbot.waitUntil(lambda: v.geometry is not None)
    v.hide()
    before = v.geometry
    v.session.push(EditActivity("T1", most_likely=8.0))
    assert v.geometry is before and v.when_shown.dirty          # no work while hidden
    v.show()
    qtbot.waitUntil(lambda: v.geometry is not before)
    row = v.geometry.row_of["T1"]
    assert not v.when_shown.dirty and v.geometry is not before and row >= 0


def test_label_atlas_draws_each_label_once_and_starts_afresh_when_full(qtbot):
    from PySide6.QtGui import QColor, QFont
    from workbench.ui.timeline.label_atlas import TimelineLabelAtlas
    atlas = TimelineLabelAtlas()
    font = QFont()
    font.setPixelSize(14)
    labels = [(f"T{i}  Task {i}", 150, i % 5 == 0) for i in range(40)]
    slots = atlas.slots_for(labels, font, QColor("black"), 160.0, 18.0, 1.0)
    assert sorted(slots.tolist()) == list(range(40))               # one slot per label
    again = atlas.slots_for(labels[::-1], font, QColor("black"), 160.0, 18.0, 1.0)
    assert again.tolist() == slots[::-1].tolist()                   # nothing drawn twice
    image = atlas.image.toImage()
    ink = [sum(image.pixelColor(x, int(s * 18 + 9)).alpha() > 100 for x in range(0, 150))
           for s in slots.tolist()[:5]]
    assert all(k > 5 for k in ink)                                  # the slots hold text
    many = [(f"L{i}", 150, False) for i in range(atlas._capacity() + 10)]
    more = atlas.slots_for(many[:atlas._capacity() - 5], font, QColor("black"), 160.0, 18.0, 1.0)
    assert more.max() < atlas._capacity()                          # full: started afresh


def test_label_atlas_holds_a_screen_taller_than_its_usual_size(qtbot):
    from PySide6.QtGui import QColor, QFont
    from workbench.ui.timeline.label_atlas import MAX_HEIGHT_PX, TimelineLabelAtlas
    atlas = TimelineLabelAtlas()
    n = MAX_HEIGHT_PX // 10
    slots = atlas.slots_for([(f"R{i}", 80, False) for i in range(n)], QFont(), QColor("black"), 90.0, 20.0, 2.0)
    assert sorted(slots.tolist()) == list(range(n)) and atlas._capacity() >= n


def label_column(view) -> QImage:
    """The label column of a whole-view rendering."""
    area = view.row_axis.mapRectToScene(view.row_axis.boundingRect())
    top_left = view.plot.mapTo(view, view.plot.mapFromScene(area.topLeft()))
    return render(view).copy(top_left.x(), top_left.y(), int(area.width()), int(area.height()))


def fresh_view_of(view, qtbot) -> TimelineView:
    other = TimelineView(Session(view.session.plan.copy()))
    qtbot.addWidget(other)
    other.resize(view.size())
    other.show()
    qtbot.waitExposed(other)
    (x0, x1), (y0, y1) = view.view_box.viewRange()
    other.view_box.setRange(xRange=(x0, x1), yRange=(y0, y1), padding=0)
    qtbot.wait(20)
    return other


def test_row_label_slots_are_kept_across_redraws_and_forgotten_on_an_edit(view, qtbot):
    view.zoom(1.0)                                  # the user's view: an edit keeps it
    view.view_box.setYRange(-0.5, 19.5, padding=0)
    qtbot.wait(10)
    view.drop_paint_caches()
    first = label_column(view)
    shown = view.row_axis.generateDrawSpecs(None)[2].rows
    assert shown.size and (view.row_axis._slot_of_row[shown] >= 0).all()   # rows drawn know their slot
    view.drop_paint_caches()
    assert label_column(view) == first              # drawn again from the kept slots: same pixels
    view.session.push(EditActivity("T2", name="Renamed"))
    view.drop_paint_caches()
    edited = label_column(view)
    assert any("Renamed" in text for text in view.row_axis.shown_labels())
    assert edited != first                          # the old slot of row 2 was not reused
    other = fresh_view_of(view, qtbot)
    assert other.row_axis.shown_labels() == view.row_axis.shown_labels()
    assert edited == label_column(other)


def test_row_label_slots_follow_a_new_type_size(view):
    from PySide6.QtGui import QFont
    axis = view.row_axis
    render(view)
    before = label_column(view)
    font = QFont(axis.style["tickFont"])
    bigger = QFont(font)
    bigger.setPixelSize(font.pixelSize() + 6)
    generation = axis._atlas.generation
    axis.set_font(bigger)
    view.drop_paint_caches()
    assert label_column(view) != before                 # not stamped from the old slots
    assert axis._atlas.generation > generation          # the atlas was drawn afresh
    axis.set_font(font)
    view.drop_paint_caches()
    assert label_column(view) == before                 # slots looked up again for the old type


def test_batched_rectangles_match_one_by_one_drawing_as_the_array_grows(qtbot):
    from PySide6.QtCore import QRectF
    from PySide6.QtGui import QColor, QPainter
    from workbench.ui.timeline.paint import rects
    rng = np.random.default_rng(3)
    for n in (5, 70, 700):                        # grows past its first allocations
        x, y = rng.integers(0, 380, n).astype(float), rng.integers(0, 280, n).astype(float)
        w, h = rng.integers(1, 30, n).astype(float), 4.0
        images = []
        for batched in (True, False):
            image = QImage(400, 300, QImage.Format.Format_ARGB32_Premultiplied)
            image.fill(QColor("white"))
            p = QPainter(image)
            p.setBrush(QColor("black"))
            if batched:
                rects(p, x, y, w, h)
            else:
                for a, b, c in zip(x, y, w):
                    p.drawRect(QRectF(a, b, c, h))
            p.end()
            images.append(image)
        assert images[0] == images[1]


@pytest.mark.parametrize("width", [1.0, 2.5])
def test_outlines_by_fills_match_stroked_outlines(qtbot, width):
    from PySide6.QtGui import QColor, QPainter
    from workbench.ui.timeline.paint import colour_of, outlined_by_fills, pen, rects
    rng = np.random.default_rng(int(width * 10))
    n = 120
    x = rng.integers(0, 300, n).astype(float) + rng.choice([0.0, 0.3, 0.5, 0.7], n)
    w = np.where(rng.random(n) < 0.3, rng.integers(0, 4, n), rng.integers(0, 90, n)).astype(float)
    h = float(rng.integers(1, 14))
    y = 4.0 + np.arange(n) * (h + 4.0) + rng.choice([0.0, 0.5], n)     # rows apart, as on a chart
    images = []
    for by_fills in (True, False):
        image = QImage(420, int(y[-1] + 3 * h), QImage.Format.Format_ARGB32_Premultiplied)
        image.fill(QColor("white"))
        p = QPainter(image)
        if by_fills:
            assert outlined_by_fills(p, (x, y, w, h), "#0072B2", "#000000", width)
        else:
            p.setPen(pen("#000000", width))
            p.setBrush(colour_of("#0072B2"))
            rects(p, x, y, w, h)
        p.end()
        images.append(image)
    assert images[0] == images[1]


def mixed_plan(n: int, seed: int) -> Plan:
    """Parallel chains with short and long activities (critical and floating bars side by
    side), all after a very short critical activity (under a pixel wide when fitted)."""
    rng = np.random.default_rng(seed)
    acts = [Activity("S", "Short start", optimistic=0.05, most_likely=0.1, pessimistic=0.15)]
    links = []
    for i in range(n):
        m = float(rng.choice([0.5, 1, 2, 5, 20, 60]))
        acts.append(Activity(f"T{i}", f"Task {i}", optimistic=m * 0.8, most_likely=m, pessimistic=m * 1.6))
        before = f"T{int(rng.integers(max(0, i - 6), i))}" if i >= 3 and rng.random() < 0.8 else "S"
        links.append(Link(before, f"T{i}"))
    return Plan(Settings(start=dt.date(2026, 12, 7)), acts, links)


@pytest.mark.parametrize("seed", [1, 2, 3])
@pytest.mark.parametrize("move", ["fit", "zoom in", "zoom out", "pan right", "tall rows"])
def test_slack_lines_and_bars_in_one_pass_match_drawing_each_style(qtbot, monkeypatch, seed, move):
    """The fused route for slack lines and bars gives the very pixels of the per-style
    route, with bars cut at the view's edges, bars under one pixel wide (stroked) and
    several row pitches."""
    from workbench.ui.timeline import fused as timeline_fused
    v = shown(qtbot, TimelineView(Session(mixed_plan(80, seed))), (1000, 640))
    v.fit_all()
    if move == "zoom in":
        v.zoom(6.0)
        v.pan(0.3)
    elif move == "zoom out":
        v.zoom(0.05)
    elif move == "pan right":
        v.pan(0.45, 7)
    elif move == "tall rows":
        v.view_box.setYRange(10, 22, padding=0)
    qtbot.wait(10)
    v.drop_paint_caches()
    fused = render(v)
    assert v.item.painted_rows > 0
    used = []
    real = timeline_fused.draw_float_and_bars
    monkeypatch.setattr(timeline_fused, "draw_float_and_bars", lambda *a: used.append(1) or real(*a))
    v.drop_paint_caches()
    assert render(v) == fused and used          # the fused route was the one taken
    monkeypatch.setattr(timeline_fused, "usable", lambda *a: False)
    v.drop_paint_caches()
    assert render(v) == fused


@pytest.mark.parametrize("scale_x", [1.0, 2.0, 0.25])
def test_both_routes_agree_on_bars_at_half_pixels_and_under_a_pixel(qtbot, scale_x):
    """Slack lines and bars whose ends land exactly on half pixels (numpy rounds those to
    even), including critical bars under a pixel wide: the one-pass route and the
    per-style route give the same pixels, and every bar covers at least one pixel."""
    from PySide6.QtGui import QColor, QPainter, QTransform
    from workbench.figures import style
    from workbench.ui.timeline import paint as timeline_paint
    from workbench.ui.timeline.item import _Pixels
    starts = np.arange(40) * 7.0 + 10.5                      # device x on half pixels
    widths = np.resize([0.05, 0.3, 0.5, 0.99, 1.0, 1.5, 2.5, 7.5], starts.size)
    rows = np.arange(starts.size)
    x0 = starts / scale_x
    x1 = (starts + widths) / scale_x
    marks = {k: Marks.empty() for k in ("connectors", "late", "negative_float", "whisker", "summary",
                                        "summary_critical", "free_float", "milestone", "milestone_critical")}
    crit = rows % 3 == 0                                     # starts both odd and even halves
    marks["critical"] = Marks(rows[crit], x0[crit], x1[crit], rows[crit])
    marks["work"] = Marks(rows[~crit], x0[~crit], x1[~crit], rows[~crit])
    marks["float"] = Marks(rows, x1, x1 + 3.5 / scale_x, rows)

    class Geo:
        connectors = np.zeros((0, 4))

    images = []
    for fuse in (True, False):
        image = QImage(320, 20 * starts.size + 20, QImage.Format.Format_ARGB32_Premultiplied)
        image.fill(QColor(style.BACKGROUND))
        p = QPainter(image)
        px = _Pixels(QTransform(scale_x, 0, 0, 20.0, 0.0, 10.0), 1.0, (-1.0, 330.0 / scale_x), True)
        timeline_paint.draw_all(p, px, marks, Geo(), style.SCREEN, None, (-1.0, float(starts.size)), fuse=fuse)
        p.end()
        images.append(image)
    assert images[0] == images[1]
    pixels = np.frombuffer(images[0].constBits(), np.uint32).reshape(images[0].height(), -1)
    for row, start in zip(rows.tolist(), starts.tolist()):
        centre = pixels[10 + 20 * row, int(start) - 2:int(start) + 4]
        assert (centre != QColor(style.BACKGROUND).rgba()).any(), f"row {row}: bar not drawn"
