"""Batched drawing of Timeline marks in device pixels: one call per style (the batching
primitives, pens and colours are in ``timeline_batch``).

Used by :class:`~workbench.ui.timeline.item.TimelineItem` for screen, export and print
alike. ``px`` maps data to pixels (see ``timeline_item._Pixels``); ``marks`` are the
geometry's marks already limited to the rows on screen.
"""

from __future__ import annotations

import numpy as np
from PySide6.QtCore import QPointF, QRectF, Qt
from PySide6.QtGui import QColor, QPainter, QPainterPath, QPixmap

from workbench.figures import style
from workbench.ui.timeline import fused
from workbench.ui.timeline.batch import colour_of, common_size, lines, pen, rects, rects_of, shared_array, whole_pixels

DENSE_ROW_PX = 3.0
# Pen width → pixels a stroked outline of a whole-pixel rectangle (x, y, w, h) covers, as
# (outer start, outer end) offsets from x / x + w (and y / y + h), the inside's inset from
# x, how much narrower the inside is than w, and the least w this holds for (narrower ones
# are stroked): measured from Qt's raster stroker, checked by
# test_outlines_by_fills_match_stroked_outlines.
OUTLINE_BANDS = {1.0: (0.0, 1.0, 1.0, 1.0, 0.0), 2.5: (-1.0, 1.0, 1.0, 2.0, 1.0)}


def bar_height(px, w: style.Weights) -> float:
    """Bar height in pixels: a share of the row, never taller than twice the nominal bar."""
    return float(min(px.row_px * w.bar_fraction, w.row_height * w.bar_fraction * 2.0 * px.scale))




_STAMPS = shared_array(QPainter.PixmapFragment, 10)
_RINGS: dict[tuple, QPixmap] = {}     # (radius, ring width, pixel ratio) → drawn ring


def visible_x(px, m):
    """Pixel ends of the marks that reach into the view, clipped a little beyond its
    edges (culls marks left or right of the view, keeps coordinates small)."""
    x0, x1 = px.x(m.x0), px.x(m.x1)
    lo, hi = px.clip
    keep = (np.maximum(x0, x1) >= lo) & (np.minimum(x0, x1) <= hi)
    if not keep.all():
        x0, x1, rows = x0[keep], x1[keep], m.rows[keep]
    else:
        rows = m.rows
    return np.minimum(np.maximum(x0, lo), hi), np.minimum(np.maximum(x1, lo), hi), rows


def span_parts(px, m, h: float, shift: float = 0.0) -> tuple:
    """Marks as rectangles [x0, x1] × (row centre + shift ± h/2): (x, y, w, h) for ``rects``."""
    x0, x1, rows = visible_x(px, m)
    y = px.y(rows) + shift
    if px.row_px < 1.0 and x0.size:      # several rows per pixel: merge what overlaps
        x0, x1, y = merge_runs(x0, x1, y)
    return x0, y - h / 2, np.maximum(x1 - x0, 0.0), h


def spans(p: QPainter, px, m, h: float, shift: float = 0.0) -> None:
    """Marks as rectangles in the current pen/brush (see ``span_parts``)."""
    rects(p, *span_parts(px, m, h, shift))


def _pixel_order(x0, y):
    """Order by pixel row, then by left end: two stable radix sorts on small integers."""
    xi, yi = x0 - x0.min(), y - y.min()
    if xi.max() >= 65536 or yi.max() >= 65536:
        return np.lexsort((x0, y))
    order = np.argsort(xi.astype(np.uint16), kind="stable")
    return order[np.argsort(yi[order].astype(np.uint16), kind="stable")]


def merge_runs(x0, x1, y):
    """Join spans that land on the same pixel row and overlap or touch (whole pixels)."""
    x0, x1, y = np.round(x0), np.maximum(np.round(x1), np.round(x0) + 1), np.round(y)
    order = _pixel_order(x0, y)
    x0, x1, y = x0[order], x1[order], y[order]
    base = (y - y.min()) * (x1.max() - x0.min() + 2)   # keeps each pixel row's values apart
    reach = np.maximum.accumulate(base + x1 - x0.min()) - base + x0.min()
    start = np.r_[True, (y[1:] != y[:-1]) | (x0[1:] > reach[:-1])]
    first = np.flatnonzero(start)
    return x0[first], np.maximum.reduceat(x1, first), y[first]


def fill(p: QPainter, colour: str) -> None:
    p.setPen(Qt.PenStyle.NoPen)
    p.setBrush(colour_of(colour))


def tick_parts(px, x, rows, half: float, width: float, shift: float = 0.0) -> tuple:
    """Upright ticks as thin filled rectangles (crisp at any width): (x, y, w, h) for ``rects``."""
    xs, ys = px.x(x), px.y(rows) + shift
    return xs - width / 2, ys - half, width, 2 * half


def ticks(p: QPainter, px, x, rows, half: float, width: float, shift: float = 0.0) -> None:
    rects(p, *tick_parts(px, x, rows, half, width, shift))


def draw_bars(p: QPainter, px, m, fill_colour: str, edge: str, edge_width: float, h: float) -> None:
    if not len(m):
        return
    if px.row_px < DENSE_ROW_PX:   # too dense for outlines: a one-colour strip per bar
        fill(p, fill_colour)
        spans(p, px, m, max(1.0, px.row_px * 0.8))
        return
    parts = span_parts(px, m, h)
    if not px.raster or not outlined_by_fills(p, parts, fill_colour, edge, edge_width, fused.MIN_BAR_PX):
        p.setPen(pen(edge, edge_width) if edge_width > 0 else Qt.PenStyle.NoPen)
        p.setBrush(colour_of(fill_colour))
        rects(p, *parts)


def outlined_by_fills(p: QPainter, parts, fill_colour: str, edge: str, edge_width: float,
                      least_px: float = 0.0) -> bool:
    """Outlined rectangles as two plain fills (edge colour, then the inside), for a raster
    painter and the pen widths whose pixels are known to match a stroked outline (a
    stroke costs far more than a fill); False when the caller must stroke. Each is at
    least ``least_px`` whole pixels wide once rounded."""
    band = OUTLINE_BANDS.get(edge_width)
    if band is None or not common_size(*parts):
        return False
    box = np.empty((common_size(*parts), 4))
    whole_pixels(box, np.asarray(parts[0], float), *parts[1:])       # x, top, width, height
    np.maximum(box[:, 2], least_px, out=box[:, 2])
    lo, hi, inset, inner_less, least = band
    narrow, box = box[box[:, 2] < least], box[box[:, 2] >= least]
    fill(p, edge)
    rects(p, box[:, 0] + lo, box[:, 1] + lo, box[:, 2] + hi - lo, box[:, 3] + hi - lo)
    inner = box[(box[:, 2] > inner_less) & (box[:, 3] > inner_less)]
    p.setBrush(colour_of(fill_colour))
    rects(p, inner[:, 0] + inset, inner[:, 1] + inset, inner[:, 2] - inner_less, inner[:, 3] - inner_less)
    if narrow.size:
        p.setPen(pen(edge, edge_width))
        rects(p, narrow[:, 0], narrow[:, 1], narrow[:, 2], narrow[:, 3])
    return True


def draw_slack_lines(p: QPainter, px, m, w: style.Weights, h: float) -> None:
    """Float: a thin line EF → LF ending in a short upright tick at LF."""
    if not len(m):
        return
    fill(p, style.FLOAT)
    line = span_parts(px, m, min(w.float_line * px.scale, max(1.0, px.row_px * 0.5)))
    if px.row_px >= DENSE_ROW_PX:        # line and end tick in one call
        rects_of(p, line, tick_parts(px, m.x1, m.rows, h / 2, w.float_tick * px.scale))
    else:
        rects(p, *line)


def draw_negative_float(p: QPainter, px, m, w: style.Weights, h: float) -> None:
    """A deadline miss: dashed line LF → EF just under the bar, tick at LF (the date needed)."""
    if not len(m):
        return
    if px.row_px < DENSE_ROW_PX:
        fill(p, style.NEGATIVE_FLOAT)
        spans(p, px, m, max(1.0, px.row_px * 0.5))
        return
    shift = h / 2 + 2.5 * px.scale
    y = px.y(m.rows) + shift
    p.setPen(pen(style.NEGATIVE_FLOAT, w.float_line * 1.25 * px.scale, dash=True))
    lines(p, px.x(m.x0), y, px.x(m.x1), y)
    fill(p, style.NEGATIVE_FLOAT)
    ticks(p, px, m.x0, m.rows, h / 2, w.float_tick * 1.25 * px.scale, shift - h / 4)


def draw_whiskers(p: QPainter, px, m, w: style.Weights, h: float) -> None:
    """P10–P90 of an activity's finish: an orange line with end caps, below the row centre."""
    if not len(m) or px.row_px < DENSE_ROW_PX:
        return
    shift = h / 2 + 1.5 * px.scale
    width = w.whisker * px.scale
    fill(p, style.PROBABILITY)
    rects_of(p, span_parts(px, m, width, shift), tick_parts(px, m.x0, m.rows, h / 4, width, shift),
             tick_parts(px, m.x1, m.rows, h / 4, width, shift))


def draw_summaries(p: QPainter, px, m, critical: bool, w: style.Weights, h: float) -> None:
    """Group rows: a slim dark bar with short downward ends; a group on the critical path
    is vermillion with the critical heavy edge (so it stands out in grayscale too)."""
    if not len(m):
        return
    slim = max(1.0, h * 0.35)
    if critical and px.row_px >= DENSE_ROW_PX:
        p.setPen(pen(style.CRITICAL_EDGE, 0.8 * w.critical_outline * px.scale))
        p.setBrush(colour_of(style.CRITICAL))
    else:
        fill(p, style.CRITICAL if critical else style.SUMMARY)
    spans(p, px, m, slim, -h / 4)
    if px.row_px >= DENSE_ROW_PX:
        fill(p, style.TEXT)
        rects_of(p, tick_parts(px, m.x0, m.rows, h / 4, 2 * px.scale, -h / 8),
                 tick_parts(px, m.x1, m.rows, h / 4, 2 * px.scale, -h / 8))


def _diamonds(px, m, r: float) -> QPainterPath:
    path = QPainterPath()
    for x, y in zip(px.x(m.x0).tolist(), px.y(m.rows).tolist()):
        path.moveTo(x, y - r)
        path.lineTo(x + r, y)
        path.lineTo(x, y + r)
        path.lineTo(x - r, y)
        path.closeSubpath()
    return path


def draw_milestones(p: QPainter, px, m, critical: bool, w: style.Weights, h: float) -> None:
    """Milestones: black diamonds; a critical one is vermillion with the heavy black edge."""
    if not len(m):
        return
    if px.row_px < DENSE_ROW_PX:
        fill(p, style.CRITICAL_EDGE)
        rects(p, px.x(m.x0) - 1.5, px.y(m.rows) - 1.5, 3.0, 3.0)
        return
    r = max(3.0, h * 0.6)
    p.setPen(pen(style.CRITICAL_EDGE, (w.critical_outline if critical else 1.0) * px.scale))
    p.setBrush(colour_of(style.CRITICAL if critical else style.MILESTONE))
    p.drawPath(_diamonds(px, m, r))


def ring_pixmap(r: float, ring: float, ratio: float = 1.0) -> QPixmap:
    """A small open circle (dark ring, background inside), drawn once per size."""
    key = (round(r, 2), round(ring, 2), ratio)
    if key not in _RINGS:
        side = int(np.ceil((2 * r + ring + 2) * ratio))
        pixmap = QPixmap(side, side)
        pixmap.fill(Qt.GlobalColor.transparent)
        painter = QPainter(pixmap)
        painter.setRenderHint(QPainter.RenderHint.Antialiasing)
        painter.setPen(pen(style.WORK_EDGE, ring * ratio))
        painter.setBrush(QColor(style.BACKGROUND))
        painter.drawEllipse(QPointF(side / 2, side / 2), r * ratio, r * ratio)
        painter.end()
        pixmap.setDevicePixelRatio(ratio)
        _RINGS[key] = pixmap
    return _RINGS[key]


def stamps(p: QPainter, pixmap: QPixmap, x, y) -> None:
    """The same small picture centred on many points, in one call."""
    x, y = np.asarray(x, float), np.asarray(y, float)
    if not x.size:
        return
    side = pixmap.width()
    if _STAMPS is None:
        half = side / pixmap.devicePixelRatio() / 2
        for a, b in zip(x.tolist(), y.tolist()):
            p.drawPixmap(QPointF(a - half, b - half), pixmap)
        return
    _STAMPS.resize(x.size)
    m = _STAMPS.ndarray()
    m[:, 0], m[:, 1] = x, y                     # centre
    m[:, 2:4] = 0.0                             # source left, top
    m[:, 4:6] = side                            # source width, height
    m[:, 6:8] = 1.0 / pixmap.devicePixelRatio()  # scale
    m[:, 8], m[:, 9] = 0.0, 1.0                 # rotation, opacity
    p.drawPixmapFragments(*_STAMPS.drawargs(), pixmap)


def draw_free_float(p: QPainter, px, m, w: style.Weights, h: float) -> None:
    """Free float: a small open circle on the slack line."""
    if not len(m) or px.row_px < DENSE_ROW_PX:
        return
    r = max(2.5, h * 0.2)
    x, y = px.x(m.x0), px.y(m.rows)
    lo, hi = px.clip
    keep = (x >= lo) & (x <= hi)
    if px.raster:                                       # screen and images: one blit call
        ratio = p.device().devicePixelRatioF()
        stamps(p, ring_pixmap(r, 1.5 * px.scale, ratio), x[keep], y[keep])
        return
    p.setPen(pen(style.WORK_EDGE, 1.5 * px.scale))      # paper, PDF, SVG: true circles
    p.setBrush(QColor(style.BACKGROUND))
    for a, b in zip(x[keep].tolist(), y[keep].tolist()):
        p.drawEllipse(QPointF(a, b), r, r)


def draw_connectors(p: QPainter, px, segments: np.ndarray, rows, w: style.Weights) -> None:
    if not segments.size:
        return
    lo, hi = rows
    keep = ~(((segments[:, 1] < lo) & (segments[:, 3] < lo)) | ((segments[:, 1] > hi) & (segments[:, 3] > hi)))
    s = segments[keep]
    x0, y0, x1, y1 = px.x(s[:, 0]), px.y(s[:, 1]), px.x(s[:, 2]), px.y(s[:, 3])
    p.setPen(pen(style.MUTED_TEXT, w.connector * px.scale))
    lines(p, x0, y0, x1, y1)


def draw_preview(p: QPainter, px, preview, w: style.Weights, h: float) -> None:
    """The bar being dragged: a dashed outline to its new finish."""
    row, x0, x1 = preview
    a, b, y = float(px.x(x0)), float(px.x(x1)), float(px.y(row))
    p.setPen(pen(style.TEXT, 2 * px.scale, dash=True))
    p.setBrush(Qt.BrushStyle.NoBrush)
    p.drawRect(QRectF(a, y - h / 2 - 2, b - a, h + 4))


def draw_all(p: QPainter, px, marks: dict, geo, w: style.Weights, preview, rows, fuse: bool = True) -> None:
    """Every style in back-to-front order (``fuse``: slack lines and bars in one pass
    where that route applies; False draws each style on its own)."""
    h = bar_height(px, w)
    s = px.scale
    p.setRenderHint(QPainter.RenderHint.Antialiasing, False)
    draw_connectors(p, px, geo.connectors, rows, w)
    if len(marks["late"]):
        p.setPen(pen(style.MUTED_TEXT, w.bar_outline * s, dash=True))
        p.setBrush(Qt.BrushStyle.NoBrush)
        spans(p, px, marks["late"], h * 0.5, h * 0.25)
    if fuse and fused.usable(px, w, OUTLINE_BANDS, DENSE_ROW_PX):
        fused.draw_float_and_bars(p, px, marks, w, h, OUTLINE_BANDS)
    else:
        draw_slack_lines(p, px, marks["float"], w, h)
        draw_bars(p, px, marks["work"], style.WORK, style.WORK_EDGE, w.bar_outline * s, h)
        draw_bars(p, px, marks["critical"], style.CRITICAL, style.CRITICAL_EDGE, w.critical_outline * s, h)
    draw_negative_float(p, px, marks["negative_float"], w, h)
    draw_whiskers(p, px, marks["whisker"], w, h)
    draw_summaries(p, px, marks["summary"], False, w, h)
    draw_summaries(p, px, marks["summary_critical"], True, w, h)
    p.setRenderHint(QPainter.RenderHint.Antialiasing, px.row_px >= DENSE_ROW_PX)   # round marks
    draw_free_float(p, px, marks["free_float"], w, h)
    draw_milestones(p, px, marks["milestone"], False, w, h)
    draw_milestones(p, px, marks["milestone_critical"], True, w, h)
    if preview is not None:
        draw_preview(p, px, preview, w, h)
