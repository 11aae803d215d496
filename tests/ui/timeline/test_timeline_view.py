"""Timeline view: pixel facts on a rendered image, selection both ways, the duration drag."""

import datetime as dt

import numpy as np
import pytest
from PySide6.QtCore import QPoint, QPointF, Qt
from PySide6.QtGui import QImage
from PySide6.QtTest import QTest

from workbench.core import Activity, Link, Plan, Settings
from workbench.core.commands import EditActivity
from workbench.figures import style
from workbench.figures.timeline import dragged_estimate
from workbench.ui.session import Session
from workbench.ui.timeline.output import export_pdf, export_svg, render_image
from workbench.ui.timeline.view import TimelineView
from support.timeline import bar_of
from support.ui import shown


def small_plan(deadline=None):
    acts = [Activity("A", "Survey", optimistic=1, most_likely=2, pessimistic=3),
            Activity("B", "Order parts", optimistic=1, most_likely=2, pessimistic=9),
            Activity("C", "Assemble", optimistic=6, most_likely=9, pessimistic=18),
            Activity("D", "Paint", duration=3),
            Activity("M", "Handover", duration=0)]
    links = [Link("A", "C"), Link("B", "D"), Link("C", "M"), Link("D", "M")]
    return Plan(Settings(start=dt.date(2026, 12, 7), deadline=deadline), acts, links)


def shown_view(qtbot, session: Session, size: tuple[int, int]) -> TimelineView:
    """A Timeline on screen at ``size``, fitted."""
    v = shown(qtbot, TimelineView(session), size)
    v.fit_all()
    return v


@pytest.fixture
def view(qtbot):
    session = Session(small_plan())
    v = shown_view(qtbot, session, (1200, 600))
    qtbot.wait(20)
    return v


def to_px(view, x, row) -> QPoint:
    p = view.item.deviceTransform_().map(QPointF(x, row))
    return QPoint(round(p.x()), round(p.y()))


def colour_at(image, point: QPoint) -> str:
    return image.pixelColor(point).name().upper()


def near(image, point: QPoint, colour: str, radius: int = 2) -> bool:
    want = np.array(style.rgb255(colour))
    for dy in range(-radius, radius + 1):
        c = image.pixelColor(point.x(), point.y() + dy)
        if np.abs(np.array([c.red(), c.green(), c.blue()]) - want).max() <= 12:
            return True
    return False


def bar(view, act_id):
    return bar_of(view, act_id)


def test_critical_and_work_bars_have_their_colours(view):
    image = render_image(view)
    kind, row, x0, x1 = bar(view, "C")
    assert kind == "critical"
    assert colour_at(image, to_px(view, (x0 + x1) / 2, row)) == style.CRITICAL
    kind, row, x0, x1 = bar(view, "D")
    assert kind == "work"
    assert colour_at(image, to_px(view, (x0 + x1) / 2, row)) == style.WORK


def test_critical_bar_carries_a_heavy_dark_edge(view):
    image = render_image(view)
    _, row, x0, x1 = bar(view, "C")
    centre = to_px(view, (x0 + x1) / 2, row)
    column = [image.pixelColor(centre.x(), y) for y in range(centre.y() - 40, centre.y())]
    dark = [c for c in column if style.gray_level(c.name()) < 0.15]
    assert len(dark) >= 2          # at least two pixel rows of near-black above the centre


def test_slack_line_drawn_where_the_geometry_puts_it(view):
    image = render_image(view)
    m = view.geometry.marks["float"]
    assert len(m)
    for row, x0, x1 in zip(m.rows.tolist(), m.x0.tolist(), m.x1.tolist()):
        assert near(image, to_px(view, (x0 + x1) / 2, row), style.FLOAT)
        assert not near(image, to_px(view, x1 + (x1 - x0) * 0.5 + 1, row), style.FLOAT)


def test_milestone_diamond_is_drawn(view):
    image = render_image(view)
    m = view.geometry.marks["milestone_critical"]
    point = to_px(view, float(m.x0[0]), int(m.rows[0]))
    assert colour_at(image, point) in (style.CRITICAL, style.MILESTONE)


def test_selection_follows_the_session(view):
    view.session.select(["D"])
    assert view.item._selected_rows.tolist() == [view.geometry.row_of["D"]]
    image = view.plot.grab().toImage()       # on screen (exports leave the selection out)
    (x_lo, x_hi), _ = view.view_box.viewRange()
    row = view.geometry.row_of["D"]
    assert colour_at(image, to_px(view, x_lo + 0.01 * (x_hi - x_lo), row)) == style.SELECTION
    view.session.select([])
    assert view.item._selected_rows.size == 0


def test_click_selects_in_the_session(view, qtbot):
    _, row, x0, x1 = bar(view, "B")
    with qtbot.waitSignal(view.session.selection_changed, timeout=2000) as sig:
        QTest.mouseClick(view.plot.viewport(), Qt.MouseButton.LeftButton, Qt.KeyboardModifier.NoModifier,
                         to_px(view, (x0 + x1) / 2, row))
    assert sig.args == [["B"]]
    assert view.session.selected() == ["B"]


def press_and_move(view, start: QPoint, step: QPoint, steps: int):
    """Press at ``start`` and move ``steps`` times by ``step``, without releasing.
    Returns the viewport, for the release."""
    vp = view.plot.viewport()
    QTest.mousePress(vp, Qt.MouseButton.LeftButton, Qt.KeyboardModifier.NoModifier, start)
    for k in range(1, steps + 1):
        QTest.mouseMove(vp, start + step * k)
    return vp


def drag(view, start: QPoint, end: QPoint, steps: int = 6) -> None:
    vp = view.plot.viewport()
    QTest.mousePress(vp, Qt.MouseButton.LeftButton, Qt.KeyboardModifier.NoModifier, start)
    for k in range(1, steps + 1):
        QTest.mouseMove(vp, start + (end - start) * k / steps)
        QTest.qWait(5)
    QTest.mouseRelease(vp, Qt.MouseButton.LeftButton, Qt.KeyboardModifier.NoModifier, end)


def test_dragging_a_bar_end_is_one_undo_step_with_the_right_most_likely(view, qtbot):
    session = view.session
    before = session.plan.activity("C")
    _, row, es, ef = bar(view, "C")
    start = to_px(view, ef, row)
    end = start + QPoint(120, 0)
    moving, finished = [], []
    view.duration_dragging.connect(lambda i, v: moving.append((i, v)))
    view.duration_dragged.connect(lambda i, v: finished.append((i, v)))
    steps_before = session.undo_stack.count()
    # where the pointer lets go, in plan units as the view stood during the drag (the
    # view may refit to the longer plan once the change lands)
    x_end = view.item.deviceTransform_().inverted()[0].map(QPointF(end)).x()
    drag(view, start, end)
    expected = dragged_estimate(before, x_end - es, resolution=1.0)     # a plan in days
    after = session.plan.activity("C")
    assert session.undo_stack.count() == steps_before + 1
    assert after.most_likely == pytest.approx(expected["most_likely"])
    assert after.most_likely > before.most_likely
    assert (after.optimistic, after.pessimistic) == (before.optimistic, before.pessimistic)
    assert len(moving) >= 2 and len(finished) == 1 and finished[0][0] == "C"
    session.undo_stack.undo()
    assert session.plan.activity("C") == before


def test_live_preview_does_not_change_the_plan(view):
    _, row, es, ef = bar(view, "C")
    start = to_px(view, ef, row)
    vp = press_and_move(view, start, QPoint(120, 0), 4)   # far enough for a whole day
    assert view.item._preview is not None and view.item._preview[2] > ef
    assert view.session.undo_stack.count() == 0
    QTest.mouseRelease(vp, Qt.MouseButton.LeftButton, Qt.KeyboardModifier.NoModifier, start + QPoint(100, 0))
    assert view.item._preview is None


def test_dragging_elsewhere_pans_without_editing(view):
    _, row, es, ef = bar(view, "C")
    before = view.view_box.viewRange()[0]
    drag(view, to_px(view, (es + ef) / 2, row) + QPoint(0, 0), to_px(view, (es + ef) / 2, row) + QPoint(-150, 0))
    assert view.session.undo_stack.count() == 0
    assert view.view_box.viewRange()[0] != before


def test_redraws_on_schedule_change(view):
    view.session.push(EditActivity("D", duration=10))
    kind, row, x0, x1 = bar(view, "D")
    assert x1 - x0 == pytest.approx(10)


def test_critical_path_filter_and_group_toggle(view):
    view.show_critical_path(True)
    assert view.geometry.keys == ["A", "C", "M"]
    view.show_critical_path(False)
    assert len(view.geometry.keys) == 5


def test_keyboard_zoom_and_pan(view):
    (x0, x1), _ = view.view_box.viewRange()
    QTest.keyClick(view.plot, Qt.Key.Key_Plus)
    (y0, y1), _ = view.view_box.viewRange()
    assert (y1 - y0) < (x1 - x0)
    QTest.keyClick(view.plot, Qt.Key.Key_Right)
    (z0, z1), _ = view.view_box.viewRange()
    assert z0 > y0


def test_tooltip_names_dates_and_floats(view):
    from workbench.ui.timeline.tooltip import tooltip_text
    text = tooltip_text(view.session.analysis, None, "D")
    assert text.startswith("D  Paint")
    # D follows B (te (1 + 8 + 9) / 6 = 3): starts on the fourth working day, Thu 10 Dec,
    # lasts 3 working days (Thu, Fri, Mon) and may slip 6 before M.
    assert "Early: Thu 10 Dec 2026 \u2192 Mon 14 Dec 2026" in text
    assert "total float 6, free float 6" in text and "te 3 days" in text


def test_unschedulable_plan_shows_a_message(qtbot):
    plan = small_plan()
    plan.links.append(Link("M", "A"))      # a loop the core refuses to schedule
    session = Session(plan)
    v = TimelineView(session)
    qtbot.addWidget(v)
    assert session.analysis is None
    assert v.geometry is None and v._message.isVisible()
    assert "loop" in v._message.textItem.toPlainText()


def test_exports(view, tmp_path):
    png, svg, pdf = tmp_path / "t.png", tmp_path / "t.svg", tmp_path / "t.pdf"
    view.export_png(png, (800, 500))
    from PySide6.QtGui import QImage
    assert QImage(str(png)).size().width() > 700
    export_svg(view, svg)
    text = svg.read_text()
    assert "<svg" in text and style.CRITICAL.lower() in text.lower()
    export_pdf(view, pdf)
    from pypdf import PdfReader
    assert len(PdfReader(str(pdf)).pages) == 1


def test_work_bar_edge_is_light_in_grayscale(view):
    """Counterpart of the heavy-edge test: a grayscale print tells the two apart."""
    image = render_image(view)
    _, row, x0, x1 = bar(view, "D")
    centre = to_px(view, (x0 + x1) / 2, row)
    column = [image.pixelColor(centre.x(), y) for y in range(centre.y() - 40, centre.y())]
    assert not [c for c in column if style.gray_level(c.name()) < 0.15]


def test_negative_float_mark_in_the_deadline_colour(qtbot):
    session = Session(small_plan(deadline=10.0))     # the chain A, C, M needs 12: a miss of 2
    v = shown_view(qtbot, session, (1200, 600))
    m = v.geometry.marks["negative_float"]
    rows = {v.geometry.keys[r] for r in m.rows.tolist()}
    # A (te 2) → C (te 10) → M takes 12 against a deadline of 10; B → D → M takes 6.
    assert rows == {"A", "C", "M"}
    image = render_image(v)
    k = v.geometry.keys.index("C")
    hit = np.flatnonzero(m.rows == k)[0]
    x = (m.x0[hit] + m.x1[hit]) / 2
    from workbench.ui.timeline.item import _Pixels
    from workbench.ui.timeline.paint import bar_height
    h = bar_height(_Pixels(v.item.deviceTransform_(), 1.0), style.SCREEN)
    centre = to_px(v, x, k)
    below = QPoint(centre.x(), round(centre.y() + h / 2 + 2.5))   # the dashed miss line under the bar
    found = any(near(image, QPoint(below.x() + dx, below.y()), style.NEGATIVE_FLOAT, radius=3) for dx in range(0, 12))
    assert found


class FakeResult:
    def __init__(self, ids, finish):
        self.ids, self.finish = ids, np.asarray(finish, float)
        self.criticality = np.linspace(0, 1, len(ids))

    def percentile(self, p):
        return float(np.percentile(self.finish, p))


def test_simulation_adds_the_finish_band_and_criticality(view):
    ids = view.session.analysis.schedule.ids
    view.session.set_simulation(FakeResult(ids, np.linspace(11, 16, 51)))
    assert view.reference.band.scene() is not None
    assert view.reference.band.getRegion() == pytest.approx((11.5, 15.5))
    from workbench.ui.timeline.tooltip import tooltip_text
    assert "criticality 50 % (simulated)" in tooltip_text(view.session.analysis, view.session.simulation, "C")
    view.session.set_simulation(None)
    assert view.reference.band.scene() is None


def test_clicking_a_group_row_collapses_it(qtbot):
    plan = small_plan()
    for act_id in ("A", "C"):
        plan.replace_activity(act_id, plan.activity(act_id).with_(group="Build"))
    v = shown_view(qtbot, Session(plan), (1000, 500))
    row = v.geometry.keys.index("Build")
    QTest.mouseClick(v.plot.viewport(), Qt.MouseButton.LeftButton, Qt.KeyboardModifier.NoModifier, to_px(v, 1.0, row))
    assert v.collapsed == {"Build"}
    assert "C" not in v.geometry.row_of and v.geometry.kinds[row] == "group"
    assert v.row_axis.label_text(row).startswith("\u25b8")


def test_hover_shows_the_activity_numbers(view):
    _, row, x0, x1 = bar(view, "C")
    view._hover(QPointF((x0 + x1) / 2, row), None)
    assert view.item.toolTip().startswith("C  Assemble")
    assert "estimate 6 / 9 / 18" in view.item.toolTip()


def test_long_labels_are_elided_to_the_column(qtbot):
    plan = small_plan()
    plan.replace_activity("D", plan.activity("D").with_(name="Paint every wall, door, window frame and skirting board twice"))
    v = shown(qtbot, TimelineView(Session(plan)), (700, 400))
    assert v.row_axis.width() <= 0.32 * 700 + 1
    render_image(v)                    # paints the label column
    texts = v.row_axis.shown_labels()
    assert any(t.startswith("D  Paint") and t.endswith("\u2026") for t in texts)


def test_only_rows_on_screen_are_painted(qtbot):
    acts = [Activity(f"T{i}", duration=1 + i % 5) for i in range(300)]
    plan = Plan(Settings(start=dt.date(2026, 12, 7)), acts, [Link(f"T{i}", f"T{i + 1}") for i in range(299)])
    v = shown(qtbot, TimelineView(Session(plan)), (1000, 600))
    v.view_box.setYRange(100, 120, padding=0)
    render_image(v)
    assert 15 <= v.item.painted_rows <= 25


def test_present_mode_uses_heavier_weights(view):
    small = view.row_axis.style["tickFont"].pixelSize()
    view.set_present(True)
    assert view.item._weights is style.PRESENT
    assert view.row_axis.style["tickFont"].pixelSize() > small
    view.set_present(False)
    assert view.item._weights is style.SCREEN


def test_empty_plan_says_so(qtbot):
    v = TimelineView(Session(Plan(Settings(start=dt.date(2026, 12, 7)))))
    qtbot.addWidget(v)
    assert v.geometry.n_rows == 0
    assert v._message.isVisible() and "No activities yet" in v._message.textItem.toPlainText()
    v.session.push(__import__("workbench.core.commands", fromlist=["AddActivity"]).AddActivity(Activity("A", duration=2)))
    assert not v._message.isVisible() and v.geometry.keys == ["A"]


def test_svg_lines_up_with_the_screen(view, tmp_path):
    """The SVG, drawn back at the view's size, has the critical colour inside the critical bar
    and the float colour on the slack line, where the screen geometry puts them."""
    from PySide6.QtGui import QColor, QImage, QPainter
    from PySide6.QtSvg import QSvgRenderer
    path = tmp_path / "t.svg"
    export_svg(view, path)
    size = view.plot.viewport().size()
    image = QImage(size, QImage.Format.Format_ARGB32)
    image.fill(QColor("white"))
    painter = QPainter(image)
    QSvgRenderer(str(path)).render(painter)
    painter.end()
    _, row, x0, x1 = bar(view, "C")
    assert colour_at(image, to_px(view, (x0 + x1) / 2, row)) == style.CRITICAL
    m = view.geometry.marks["float"]
    assert near(image, to_px(view, (m.x0[0] + m.x1[0]) / 2, int(m.rows[0])), style.FLOAT)


def test_nonworking_stretches_found_between_working_days():
    from workbench.core import WorkCalendar
    from workbench.ui.timeline.item import nonworking_finder
    cal = WorkCalendar(Settings(start=dt.date(2026, 12, 7)))      # a Monday
    # Weekends fall after the 5th and 10th working day; 25 Dec 2026 (a Friday) is a
    # working day unless it is listed as a holiday.
    assert nonworking_finder(cal)(0, 12).tolist() == [5.0, 10.0]
    cal = WorkCalendar(Settings(start=dt.date(2026, 12, 7),
                                calendar=__import__("workbench.core", fromlist=["Calendar"]).Calendar(
                                    holidays=(dt.date(2026, 12, 9),))))
    assert nonworking_finder(cal)(0, 6).tolist() == [2.0, 4.0]


def test_drag_released_where_it_started_leaves_no_undo_step(view):
    _, row, es, ef = bar(view, "C")
    start = to_px(view, ef, row)
    drag(view, start, start + QPoint(120, 0), steps=3)
    view.session.undo_stack.undo()
    count = view.session.undo_stack.count()
    _, row, es, ef = bar(view, "C")
    start = to_px(view, ef, row)
    vp = view.plot.viewport()
    QTest.mousePress(vp, Qt.MouseButton.LeftButton, Qt.KeyboardModifier.NoModifier, start)
    QTest.mouseMove(vp, start + QPoint(120, 0))
    QTest.mouseMove(vp, start)
    QTest.mouseRelease(vp, Qt.MouseButton.LeftButton, Qt.KeyboardModifier.NoModifier, start)
    assert view.session.undo_stack.index() == count - 1 and view.item._preview is None


def test_dense_spans_merge_per_pixel_row_without_losing_coverage():
    from workbench.ui.timeline.paint import merge_runs
    rng = np.random.default_rng(3)
    x0 = rng.uniform(0, 300, 400)
    x1 = x0 + rng.uniform(0, 40, 400)
    y = rng.integers(0, 20, 400).astype(float)
    a, b, r = merge_runs(x0, x1, y)
    assert len(a) < len(x0)
    covered = np.zeros((20, 400), bool)
    for s, e, row in zip(np.round(x0), np.maximum(np.round(x1), np.round(x0) + 1), y):
        covered[int(row), int(s):int(e)] = True
    merged = np.zeros_like(covered)
    for s, e, row in zip(a, b, r):
        assert not merged[int(row), int(s):int(e)].any()          # runs never overlap
        merged[int(row), int(s):int(e)] = True
    assert (merged == covered).all()


def test_image_kept_once_settled_and_cleared_by_set_methods(view):
    from PySide6.QtGui import QImage, QPainter
    image = QImage(view.plot.size(), QImage.Format.Format_ARGB32_Premultiplied)

    def draw(v):                              # one paint, no event processing in between
        painter = QPainter(image)
        v.plot.render(painter)
        painter.end()
    view.item.set_preview(None)               # any set_* clears the recording
    assert view.item._cache is None
    draw(view)                                # first paint after a change: drawn directly
    assert view.item._cache is None
    draw(view)                                # same view again: now recorded
    assert view.item._cache is not None
    view.item.set_preview((0, 0.0, 1.0))
    assert view.item._cache is None
    view.item.set_preview(None)
    draw(view)
    draw(view)
    assert view.item._cache is not None
    view.session.push(EditActivity("D", duration=5))
    assert view.item._cache is None


def test_escape_cancels_a_drag(view):
    _, row, es, ef = bar(view, "C")
    start = to_px(view, ef, row)
    vp = press_and_move(view, start, QPoint(30, 0), 3)
    assert view.item._preview is not None
    QTest.keyClick(view.plot, Qt.Key.Key_Escape)
    QTest.mouseRelease(vp, Qt.MouseButton.LeftButton, Qt.KeyboardModifier.NoModifier, start + QPoint(90, 0))
    assert view.item._preview is None and view.session.undo_stack.count() == 0


def test_print_preview_uses_the_shared_page_routine(view, monkeypatch, tmp_path):
    from PySide6.QtPrintSupport import QPrintPreviewDialog, QPrinter
    from pypdf import PdfReader
    out = tmp_path / "preview.pdf"

    def fake_exec(dialog):                    # what the preview does when it draws a page
        printer = QPrinter(QPrinter.PrinterMode.HighResolution)
        printer.setOutputFormat(QPrinter.OutputFormat.PdfFormat)
        printer.setOutputFileName(str(out))
        dialog.paintRequested.emit(printer)
        return 0

    monkeypatch.setattr(QPrintPreviewDialog, "exec", fake_exec)
    view.print_preview()
    text = PdfReader(str(out)).pages[0].extract_text()
    assert "Timeline" in text and "Assemble" in text


def test_a_critical_activity_under_a_pixel_wide_still_shows(qtbot):
    """Zoomed out, a very short critical activity is still a dark mark on its row (at
    least one pixel of bar inside its heavy edge), not nothing."""
    acts = [Activity("S", "Sign-off", optimistic=0.05, most_likely=0.1, pessimistic=0.15),
            Activity("L", "Long works", optimistic=200, most_likely=300, pessimistic=400)]
    plan = Plan(Settings(start=dt.date(2026, 12, 7)), acts, [Link("L", "S")])
    v = shown_view(qtbot, Session(plan), (900, 400))
    qtbot.wait(20)
    kind, row, x0, x1 = bar(v, "S")
    assert kind == "critical"
    t = v.item.deviceTransform_()
    assert t.map(QPointF(x1, row)).x() - t.map(QPointF(x0, row)).x() < 1    # under a pixel here
    image = v.plot.grab().toImage()            # on screen (the one-pass route)
    centre = to_px(v, (x0 + x1) / 2, row)
    dark = [x for x in range(centre.x() - 3, centre.x() + 4)
            if style.gray_level(image.pixelColor(x, centre.y()).name()) < 0.15]
    assert len(dark) >= 2


def test_panning_beyond_any_calendar_date_draws_without_error(qtbot):
    """A plan reaching far ahead lets the view pan past the calendar's reach (and before
    year 1): the chart, shading and date axis draw what exists there, nothing fails."""
    plan = Plan(Settings(start=dt.date(2026, 12, 7)),
                [Activity("A", "Very long", duration=740_000), Activity("B", "Longer still", duration=740_000),
                 Activity("C", "Next", duration=5)],
                [Link("A", "B"), Link("B", "C")])
    v = shown_view(qtbot, Session(plan), (900, 400))
    image = QImage(v.size(), QImage.Format.Format_ARGB32_Premultiplied)
    shown = {}
    for lo in (-2e6, 1.0e6, 1.505e6, 2.5e6):       # 1.505e6: past the reach, inside the chart
        v.view_box.setXRange(lo, lo + 30, padding=0)       # zoomed in: non-working days shaded
        v.drop_paint_caches()
        v.render(image)                                    # pytest-qt fails on errors in paint
        shown[lo] = v.date_axis.shown_labels()
    assert shown[1.0e6] and not shown[-2e6] and not shown[2.5e6]


def test_every_line_label_is_drawn_above_every_line(qtbot):
    """The P10 / P90 lines often fall near the deadline: no line may cross another line's
    label. Each label rides on its own line stacked above every visible line, and moves
    with its line."""
    v = shown_view(qtbot, Session(small_plan(deadline=14.0)), (1200, 600))
    ids = v.session.analysis.schedule.ids
    v.session.set_simulation(FakeResult(ids, np.linspace(11, 16, 51)))
    ref = v.reference
    assert {"start", "deadline", "p10", "p90"} <= set(ref.lines)
    lowest_label = min(line.zValue() for line in ref.lines.values())
    assert all(stroke.zValue() < lowest_label for stroke in ref.strokes.values())
    for name, line in ref.lines.items():
        assert line.value() == ref.strokes[name].value()
        assert line.label.scene() is not None and line.pen.style() == Qt.PenStyle.NoPen
    v.session.set_simulation(None)
    assert "p10" not in ref.lines and "p10" not in ref.strokes
