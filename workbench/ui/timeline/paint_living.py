"""Drawing of the living-schedule marks on the Timeline (geometry from
``workbench.figures.timeline_living``):

- the compared baseline: a thin dark-grey bar just beneath each activity's bar;
- work done so far: solid dark blue at the bar's height (actual start to
  actual finish, or to the status date); remaining work keeps today's bar, so done and
  remaining work read apart in grayscale;
- a finish later than the baseline: a small reddish-purple triangle with a black edge just
  after the bar's end (shape, not colour alone)."""

from __future__ import annotations

from PySide6.QtCore import QPointF, Qt
from PySide6.QtGui import QPainter, QPainterPath, QPolygonF

from workbench.figures import style
from workbench.ui.timeline.batch import colour_of, pen

BASELINE = style.MUTED_TEXT
DONE = style.WORK_EDGE
SLIPPED = style.DEADLINE


def draw_living(p: QPainter, px, marks: dict, w: style.Weights, h: float, spans) -> None:
    """Baseline bars, done work and slip marks (``spans`` draws rectangles of marks)."""
    base, done, slipped = marks.get("baseline"), marks.get("done"), marks.get("slipped")
    if base is not None and len(base):
        thin = max(2.0, min(px.row_px * 0.14, h * 0.3))
        p.setPen(Qt.PenStyle.NoPen)
        p.setBrush(colour_of(BASELINE))
        spans(p, px, base, thin, h / 2 + max(1.0, thin * 0.5) + thin / 2)
    if done is not None and len(done):
        p.setPen(Qt.PenStyle.NoPen)
        p.setBrush(colour_of(DONE))
        spans(p, px, done, h)
    if slipped is not None and len(slipped) and px.row_px >= 6:
        _triangles(p, px, slipped, max(7.0, h * 0.45))


def _triangles(p: QPainter, px, m, size: float) -> None:
    x, y = px.x(m.x1), px.y(m.rows)
    lo, hi = px.clip
    keep = (x >= lo) & (x <= hi)
    path = QPainterPath()
    for a, b in zip((x[keep] + 3.0).tolist(), y[keep].tolist()):
        path.addPolygon(QPolygonF([QPointF(a, b - size / 2), QPointF(a + size, b), QPointF(a, b + size / 2),
                                   QPointF(a, b - size / 2)]))
    p.setPen(pen(style.TEXT, 1.0))
    p.setBrush(colour_of(SLIPPED))
    p.drawPath(path)
