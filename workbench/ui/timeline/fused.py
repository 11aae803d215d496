"""The Timeline's commonest marks on screen in one numpy pass: slack lines with their end
ticks and the outlined bars of ordinary and critical activities.

Same pixels as drawing each style on its own (``timeline_paint.draw_slack_lines`` and
``draw_bars``; a test compares the two), but the rows on screen are placed, culled and
rounded to whole pixels for all three styles together, so a redraw after a change costs a
handful of numpy calls whatever the number of styles. Used for raster painters (screen,
images) at a legible row pitch with the screen pen widths; anything else takes the
per-style route.
"""

from __future__ import annotations

import numpy as np
from PySide6.QtCore import QRectF, Qt
from PySide6.QtGui import QPainter

from workbench.figures import style
from workbench.ui.timeline.batch import colour_of, shared_array

# One array per layer (pointer made once per allocation): slack lines and ticks, then the
# edge and inside of ordinary bars, then of critical bars.
_LAYERS = [shared_array(QRectF) for _ in range(5)]
MIN_BAR_PX = 1.0      # a bar is at least this many whole pixels wide (a short activity stays visible)


def usable(px, w: style.Weights, bands: dict, dense_row_px: float) -> bool:
    """True when the fused route applies to this paint."""
    edges = (w.bar_outline * px.scale, w.critical_outline * px.scale)
    return (_LAYERS[0] is not None and px.raster and px.row_px >= dense_row_px
            and px.x_affine[0] > 0.0 and px.x_affine[1] == 0.0 and px.y_affine[0] == 0.0
            and all(e in bands and bands[e][4] <= MIN_BAR_PX for e in edges))


def draw_float_and_bars(p: QPainter, px, marks: dict, w: style.Weights, h: float, bands: dict) -> None:
    """Slack lines (EF → LF, tick at LF), then ordinary bars, then critical bars.

    Every mark runs left to right (x0 ≤ x1) and x grows to the right (``usable``)."""
    fl, wk, cr = marks["float"], marks["work"], marks["critical"]
    nf, nw, nc = len(fl), len(wk), len(cr)
    if not nf + nw + nc:
        return
    s = px.scale
    ax, _, bx = px.x_affine
    _, ay, by = px.y_affine
    lo, hi = px.clip
    # spans: slack lines then bars, each from x0 to x1, culled and cut at the view's edges
    left = np.concatenate((fl.x0, wk.x0, cr.x0))
    right = np.concatenate((fl.x1, wk.x1, cr.x1))
    centre = np.concatenate((fl.rows, wk.rows, cr.rows)).astype(float)
    left *= ax
    left += bx
    right *= ax
    right += bx
    centre *= ay
    centre += by
    tick_w = w.float_tick * s
    tick_left = right[:nf] - tick_w / 2                      # slack line end ticks: never cut
    keep = (right >= lo) & (left <= hi)
    np.maximum(left, lo, out=left)
    np.minimum(left, hi, out=left)
    np.maximum(right, lo, out=right)
    np.minimum(right, hi, out=right)
    width = right - left
    np.maximum(width, 0.0, out=width)
    line_h = min(w.float_line * s, max(1.0, px.row_px * 0.5))
    box = np.empty((left.size, 4))
    x0 = np.rint(left)
    box[:, 0] = x0
    left += width
    box[:, 2] = np.rint(left, out=left)
    box[:, 2] -= x0
    np.maximum(box[nf:, 2], MIN_BAR_PX, out=box[nf:, 2])     # after rounding: never 0 px
    for part, height in ((slice(0, nf), line_h), (slice(nf, None), h)):
        whole = max(float(np.rint(height)), 1.0)
        box[part, 1] = np.rint(centre[part] - height / 2 + (height - whole) / 2)
        box[part, 3] = whole
    whole_h = max(float(np.rint(h)), 1.0)
    ticks = np.empty((nf, 4))
    x0 = np.rint(tick_left)
    ticks[:, 0] = x0
    tick_left += tick_w
    ticks[:, 2] = np.rint(tick_left) - x0
    ticks[:, 1] = np.rint(centre[:nf] - h / 2 + (h - whole_h) / 2)
    ticks[:, 3] = whole_h
    lines = box[:nf][keep[:nf]]
    _fill(p, 0, style.FLOAT, np.concatenate((lines, ticks)) if nf else lines)
    at = nf
    for n, colour, edge, edge_width, layer in ((nw, style.WORK, style.WORK_EDGE, w.bar_outline * s, 1),
                                               (nc, style.CRITICAL, style.CRITICAL_EDGE, w.critical_outline * s, 3)):
        bars = box[at:at + n][keep[at:at + n]]
        at += n
        _outlined(p, layer, bars, colour, edge, bands[edge_width])


def _outlined(p: QPainter, layer: int, bars: np.ndarray, colour: str, edge: str, band) -> None:
    """Whole-pixel boxes (at least ``MIN_BAR_PX`` wide, so wide enough for ``band``)
    outlined as two fills: the edge, then the inside."""
    if not bars.size:
        return
    lo, hi, inset, inner_less, _ = band
    edges = bars + (lo, lo, hi - lo, hi - lo)
    inside = bars[(bars[:, 2] > inner_less) & (bars[:, 3] > inner_less)] + (inset, inset, -inner_less, -inner_less)
    _fill(p, layer, edge, edges)
    _fill(p, layer + 1, colour, inside)


def _fill(p: QPainter, layer: int, colour: str, boxes: np.ndarray) -> None:
    p.setPen(Qt.PenStyle.NoPen)
    p.setBrush(colour_of(colour))
    _draw(p, layer, boxes)


def _draw(p: QPainter, layer: int, boxes: np.ndarray) -> None:
    if not boxes.shape[0]:
        return
    batch = _LAYERS[layer]
    batch.resize(boxes.shape[0])
    batch.ndarray()[:] = boxes
    p.drawRects(*batch.drawargs())
