"""The Odds view at the sizes its dock has on a 1024×768 projector and a 1366×768
laptop (and larger): no label covers another, a curve or a drawn line; labels and legends
stay inside their plots; the y-axis titles fit; the side-by-side table is not cut."""

import re

import numpy as np
import pytest
from PySide6.QtCore import QPointF, QRectF
from PySide6.QtGui import QImage, QPainter

from workbench.core.demo import demo_plan
from workbench.core.montecarlo import simulate
from workbench.ui.odds.view import OddsView
from workbench.ui.session import Session
from support.ui import shown


@pytest.fixture(scope="module")
def demo():
    plan = demo_plan()
    return plan, simulate(plan, 3000, seed=11)


@pytest.fixture(params=[(428, 358), (572, 358), (805, 358), (1400, 900)], ids=lambda s: f"{s[0]}x{s[1]}")
def view(request, qtbot, demo):
    plan, sim = demo
    session = Session(plan.copy())
    v = shown(qtbot, OddsView(session), request.param)
    session.set_simulation(sim)
    qtbot.wait(30)
    yield v
    v.runner.stop()
    v.runner.wait(10_000)


def _scene(item) -> QRectF:
    return item.mapRectToScene(item.boundingRect())


def _labels(plot):
    """name → (scene rectangle, the plot it belongs to) of every label shown."""
    d, c = plot.density, plot.cumulative
    texts = [(t, d) for t in (*plot.marker_texts, plot.answer_text)] + \
            [(t, c) for t in (*plot.answer_texts, *plot.p_labels)]
    out = {f"{t.textItem.toPlainText()}#{i}": (_scene(t), owner)
           for i, (t, owner) in enumerate(texts) if t.isVisible()}
    for name, legend, owner in (("legend", plot.legend, d), ("S-curve legend", plot.cum_legend, c)):
        if legend.isVisible():
            out[name] = (legend.sceneBoundingRect(), owner)
    return out


def _polyline_px(vb, item, step=0.5):
    """Points every half pixel along a drawn curve, in scene pixels (mapped point by point)."""
    xs, ys = item.getData()
    if xs is None or len(xs) < 2 or not item.isVisible():
        return np.empty((0, 2))
    pts = np.array([[p.x(), p.y()] for p in (vb.mapViewToScene(QPointF(float(x), float(y))) for x, y in zip(xs, ys))])
    out = []
    for a, b in zip(pts[:-1], pts[1:]):
        n = max(2, int(np.hypot(*(b - a)) / step) + 2)
        t = np.linspace(0, 1, n)[:, None]
        out.append(a + (b - a) * t)
    return np.vstack(out)


def _vertical_lines_px(vb, lines):
    return [vb.mapViewToScene(QPointF(line.value(), 0)).x() for line in lines if line.isVisible()]


def test_labels_cover_no_label_curve_or_line_and_stay_inside(view):
    plot = view.plot
    labels = _labels(plot)
    assert labels or view.width() < 500                      # something is labelled but in the smallest dock
    names = sorted(labels)
    for i, a in enumerate(names):
        for b in names[i + 1:]:
            assert not labels[a][0].intersects(labels[b][0]), (a, b)
    curves = {plot.density: (plot.pert_curve, plot.hist, plot.sim_shade), plot.cumulative: (plot.pert_cdf, plot.ecdf)}
    lines = {plot.density: [*plot.markers, plot.certain], plot.cumulative: [*plot.mirrors, *plot.answers]}
    for name, (rect, owner) in labels.items():
        vb = owner.vb
        box = vb.sceneBoundingRect().adjusted(-1, -1, 1, 1)
        assert box.contains(rect), (name, rect, box)
        inner = rect.adjusted(1, 1, -1, -1)          # the text's backing may touch a line's antialiased edge
        for item in curves[owner]:
            pts = _polyline_px(vb, item)
            hit = (pts[:, 0] > inner.left()) & (pts[:, 0] < inner.right()) & \
                  (pts[:, 1] > inner.top()) & (pts[:, 1] < inner.bottom())
            assert not hit.any(), (name, item.name())
        for x in _vertical_lines_px(vb, lines[owner]):
            assert not (inner.left() < x < inner.right()), (name, x)
        if owner is plot.cumulative:
            y = vb.mapViewToScene(QPointF(0, plot.level.value())).y()
            assert not (inner.top() < y < inner.bottom()), (name, "level line")


def test_a_hidden_legend_is_replaced_by_the_key(view):
    plot = view.plot
    both = plot.legend.isVisible() and plot.cum_legend.isVisible()
    assert view.key.isVisible() == (not both)


def test_y_titles_fit_their_axes(view):
    for plot in (view.plot.density, view.plot.cumulative):
        axis = plot.getAxis("left")
        if not axis.label.isVisible() or not axis.labelText:
            continue
        label = axis.label.mapRectToScene(axis.label.boundingRect())     # upright: its height is its length
        room = plot.vb.sceneBoundingRect()                                  # the axis runs along the plot
        assert room.top() - 1 <= label.top() and label.bottom() <= room.bottom() + 1, axis.labelText


def test_the_side_by_side_table_is_not_cut(view, qtbot):
    side = view.panel.parentWidget().parentWidget()                   # the panel's scroll area
    assert view.panel.minimumSizeHint().width() <= side.viewport().width(), "the panel is cut at the right"
    table = view.panel.table
    assert table.rowCount() >= 4
    assert table.horizontalHeader().length() <= table.viewport().width() + 1
    for r in range(table.rowCount()):
        for c in (1, 2):
            text = table.item(r, c).text()
            rect = table.visualRect(table.model().index(r, c))
            lines = max(1, rect.height() // table.fontMetrics().height())
            assert table.fontMetrics().horizontalAdvance(text) <= rect.width() * lines, text


def _drawn_dates(axis) -> list[str]:
    """The date labels the axis draws (those it would hide for lack of room are left out)."""
    image = QImage(10, 10, QImage.Format.Format_ARGB32)
    painter = QPainter(image)
    try:
        specs = axis.generateDrawSpecs(painter)
    finally:
        painter.end()
    return [] if specs is None else [text for _, _, text in specs[2]]


def test_dates_under_the_s_curve_at_every_size_and_weeks_when_there_is_room(view):
    drawn = _drawn_dates(view.plot.cumulative.getAxis("bottom"))
    assert drawn, "no date under the S-curve"
    if view.width() >= 1400:
        assert any(re.fullmatch(r"\d{1,2} [A-Z][a-z]{2}( \d{4})?", t) for t in drawn), drawn
