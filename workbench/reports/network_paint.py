"""Drawing of the activity-on-node diagram from ``workbench.figures.network_layout``:
a window of the layout (layout units, y down) mapped onto a rectangle of the page."""

from __future__ import annotations

import math
from dataclasses import dataclass

import numpy as np

from reportlab.lib.colors import white as _WHITE

from . import fonts, styles
from .tables import fit
from .text import clean, format_day_month, format_duration, format_number

DETAIL_SCALE = 0.6     # points per layout unit preferred for the detail pages (8 pt names)
MIN_DETAIL_SCALE = 0.45   # smallest scale at which a box still shows its numbers (type has floors)


@dataclass(frozen=True)
class View:
    """Layout window (x0, y0, w, h) drawn at ``scale`` points per unit into a page box."""

    x0: float
    y0: float
    w: float
    h: float
    scale: float
    rows: frozenset | None = None   # the boxes this page draws (plan rows); None: all in view

    def page(self, x: float, y: float, top: float) -> tuple[float, float]:
        return (x - self.x0) * self.scale, top - (y - self.y0) * self.scale


def link_bounds(layout) -> np.ndarray:
    """(k, 4) bounding boxes x0, y0, x1, y1 of every link route, for culling."""
    out = np.zeros((len(layout.links), 4))
    for k, link in enumerate(layout.links):
        pts = np.asarray(link.points, dtype=float)
        out[k] = (*pts.min(axis=0), *pts.max(axis=0))
    return out


class NetworkPainter:
    def __init__(self, ctx, layout, view: View, link_boxes=None):
        self.ctx, self.layout, self.view = ctx, layout, view
        self.detail = view.scale >= MIN_DETAIL_SCALE * 0.999
        self.link_boxes = link_bounds(layout) if link_boxes is None else link_boxes
        self.dates = ctx.analysis.dates() if self.detail else None

    def paint(self, c, w: float, h: float) -> None:
        c.saveState()
        path = c.beginPath()
        path.rect(0, h - self.view.h * self.view.scale, self.view.w * self.view.scale, self.view.h * self.view.scale)
        c.clipPath(path, stroke=0, fill=0)
        v, b = self.view, self.link_boxes
        seen = (b[:, 2] >= v.x0) & (b[:, 0] <= v.x0 + v.w) & (b[:, 3] >= v.y0) & (b[:, 1] <= v.y0 + v.h)
        links = [self.layout.links[k] for k in np.flatnonzero(seen)]
        shown = {node.id for node in self.layout.nodes if self._visible(node)}
        if v.rows is not None:          # a detail page: only links touching its own boxes
            links = [l for l in links if l.pred in shown or l.succ in shown]
        for link in sorted(links, key=lambda l: l.critical):
            self._link(c, link, h)
        for node in self.layout.nodes:
            if node.id in shown:
                self._node(c, node, h)
        if self.detail and len(shown) < len(self.layout.nodes):
            placed: list[tuple[str, float, float]] = []
            for link in sorted(links, key=lambda l: not l.critical):
                self._off_page_tag(c, link, shown, h, placed)
        c.restoreState()

    def _off_page_tag(self, c, link, shown: set[str], top: float, placed: list) -> None:
        """Where a link leaves the page towards a box on another page (or comes from one),
        the other box's id at the page edge: "-> B1" / "A4 ->"."""
        if (link.pred in shown) == (link.succ in shown):
            return
        leaving = link.pred in shown
        points = link.points if leaving else link.points[::-1]
        edge = _exit_point(points, self.view)
        if edge is None:                 # the other box lies in this window, drawn elsewhere
            edge = points[-1]
        x, y = self.view.page(*edge, top)
        text = clean(f"-> {link.succ}" if leaving else f"{link.pred} ->")   # the pack's fonts have no arrow glyph
        size = 7.5
        width = c.stringWidth(text, styles.BOLD, size)
        page_w = self.view.w * self.view.scale
        bottom = top - self.view.h * self.view.scale + 2.0
        x = min(max(x - width / 2, 2.0), page_w - width - 2.0)
        y = min(max(y - size / 2, bottom), top - size - 2.0)
        if any(t == text and abs(px - x) < 40 and abs(py - y) < 14 for t, px, py, _ in placed):
            return                           # two links to the same box leave at the same place
        y = _free_row(placed, x, y, width, size, bottom, top - size - 2.0)
        placed.append((text, x, y, width))
        c.saveState()
        c.setFillColor(_WHITE)
        c.setStrokeColor(styles.CRITICAL if link.critical else styles.MUTED)
        c.setLineWidth(0.6)
        c.rect(x - 2, y - 2, width + 4, size + 3, stroke=1, fill=1)
        c.setFillColor(styles.TEXT)
        c.setFont(styles.BOLD, size)
        fonts.draw(c, x, y, text)
        c.restoreState()

    def _visible(self, node) -> bool:
        v = self.view
        if v.rows is not None:
            return node.row in v.rows
        return node.x + node.w >= v.x0 and node.x <= v.x0 + v.w and node.y + node.h >= v.y0 and node.y <= v.y0 + v.h

    # --- links -----------------------------------------------------------------
    def _link(self, c, link, top: float) -> None:
        pts = [self.view.page(x, y, top) for x, y in link.points]
        c.saveState()
        c.setStrokeColor(styles.CRITICAL if link.critical else styles.MUTED)
        c.setFillColor(styles.CRITICAL if link.critical else styles.MUTED)
        c.setLineWidth(max(1.6, 5 * self.view.scale) if link.critical else max(0.5, 1.5 * self.view.scale))
        path = c.beginPath()
        path.moveTo(*pts[0])
        for p in pts[1:]:
            path.lineTo(*p)
        c.drawPath(path, stroke=1, fill=0)
        _arrow(c, pts[-2], pts[-1], max(3.0, 9 * self.view.scale))
        if link.label and self.detail:
            x, y = self.view.page(*link.label_at, top)
            text = clean(link.label)
            width = c.stringWidth(text, styles.BOLD, 7.5)
            page_w, page_h = self.view.w * self.view.scale, self.view.h * self.view.scale
            if not (x - width / 2 >= 0 and x + width / 2 <= page_w and top - page_h <= y and y + 10 <= top):
                c.restoreState()             # the label would be cut by the page's edge: the page
                return                       # where the link's box sits shows it whole
            c.setFillColor(_WHITE)
            c.rect(x - width / 2 - 1.5, y + 1, width + 3, 9, stroke=0, fill=1)
            c.setFont(styles.BOLD, 7.5)
            c.setFillColor(styles.TEXT)
            c.drawCentredString(x, y + 3, text)
        c.restoreState()

    # --- nodes -----------------------------------------------------------------
    def _node(self, c, node, top: float) -> None:
        s = self.view.scale
        x, y_top = self.view.page(node.x, node.y, top)
        w, h = node.w * s, node.h * s
        head = h * (0.24 if self.detail else 1.0)
        c.saveState()
        c.setFillColor(_WHITE)
        c.rect(x, y_top - h, w, h, stroke=0, fill=1)
        c.setFillColor(styles.CRITICAL if node.critical else styles.WORK)
        c.rect(x, y_top - head, w, head, stroke=0, fill=1)
        c.setStrokeColor(styles.TEXT if node.critical else styles.WORK_EDGE)
        c.setLineWidth(max(1.5, 4.5 * s) if node.critical else max(0.4, 1.2 * s))
        c.rect(x, y_top - h, w, h, stroke=1, fill=0)
        self._head_text(c, node, x, y_top, w, head)
        if self.detail:
            self._body_text(c, node, x, y_top - head, w, h - head)
        c.restoreState()

    def _head_text(self, c, node, x, y_top, w, head) -> None:
        if self.detail:
            size = max(7.0, min(10.0, head * 0.55, 20 * self.view.scale))
        else:   # overview: the id as large as its box allows
            size = min(14.0, head * 0.6, (w - 4) / max(c.stringWidth(node.id, styles.BOLD, 1.0), 1e-6))
        if size < 3.0:
            return
        i = node.row
        c.setFillColor(_WHITE)
        _label_box(c, x + 2, y_top - head / 2 - size * 0.35, w * (0.6 if self.detail else 1.0) - 2, size, node.id, styles.BOLD)
        if self.detail:
            te = self.ctx.analysis.means[i]
            c.setFont(styles.BOLD, size * 0.8)
            c.drawRightString(x + w - 3, y_top - head / 2 - size * 0.3, f"te {format_number(te)}")

    def _body_text(self, c, node, x, y_top, w, h) -> None:
        """The name, then early dates, late dates and floats in two columns: dates (the
        year is in the page heading), never offsets."""
        i = node.row
        name_size = max(7.0, min(9.0, 14 * self.view.scale))
        c.setFillColor(styles.TEXT)
        c.setFont(styles.FONT, name_size)
        fonts.draw(c, x + 3, y_top - name_size * 1.2, fit(self.ctx.plan.activities[i].name, w - 6, styles.FONT, name_size))
        num = max(7.0, min(8.5, 13 * self.view.scale))
        grid_top = y_top - name_size * 1.9
        row_h, col_w = (grid_top - (y_top - h)) / 3, w / 2
        c.setStrokeColor(styles.GRID)
        c.setLineWidth(0.4)
        for k in range(3):
            c.line(x, grid_top - k * row_h, x + w, grid_top - k * row_h)
        c.line(x + col_w, grid_top, x + col_w, grid_top - 3 * row_h)
        for k, (label, text, late) in enumerate(self._cells(i)):
            cx, cy = x + (k % 2) * col_w, grid_top - (k // 2 + 1) * row_h
            c.setFont(styles.FONT, num * 0.8)
            c.setFillColor(styles.MUTED)
            c.drawString(cx + 2, cy + row_h * 0.3, label)
            c.setFont(styles.BOLD, num)
            c.setFillColor(styles.DEADLINE if late else styles.TEXT)
            room = col_w - 6 - c.stringWidth(label, styles.FONT, num * 0.8)
            c.drawRightString(cx + col_w - 2, cy + row_h * 0.3, fit(text, room, styles.BOLD, num))

    def _cells(self, i: int) -> list[tuple[str, str, bool]]:
        s, d, unit = self.ctx.analysis.schedule, self.dates, self.ctx.unit
        day = lambda key: format_day_month(d[key][i])
        return [("ES", day("early_start"), False), ("EF", day("early_finish"), False),
                ("LS", day("late_start"), False), ("LF", day("late_finish"), False),
                ("TF", format_duration(s.total_float[i], unit), s.total_float[i] < -1e-9),
                ("FF", format_duration(s.free_float[i], unit), False)]


def _free_row(placed, x: float, y: float, width: float, size: float, lo: float, hi: float) -> float:
    """``y``, or the nearest height (down first, then up, a tag's height at a time, within
    lo..hi) where a tag at ``x`` of ``width`` overlaps no tag placed before (tags of links
    leaving near one another would otherwise print over each other)."""
    step = size + 5.0

    def clashes(yy):
        return any(x - 2 < px + pw + 2 and px - 2 < x + width + 2 and yy - 2 < py + size + 1 and py - 2 < yy + size + 1
                   for _, px, py, pw in placed)
    for k in range(0, 40):
        for yy in ((y,) if k == 0 else (y - k * step, y + k * step)):
            if lo <= yy <= hi and not clashes(yy):
                return yy
    return y


def _exit_point(points, view: View):
    """The first point where a route (from inside the view) crosses the view's edge."""
    x0, y0, x1, y1 = view.x0, view.y0, view.x0 + view.w, view.y0 + view.h
    inside = lambda p: x0 <= p[0] <= x1 and y0 <= p[1] <= y1
    for a, b in zip(points, points[1:]):
        if inside(a) and not inside(b):
            t = 1.0
            for lo, hi, pa, pb in ((x0, x1, a[0], b[0]), (y0, y1, a[1], b[1])):
                if pb > hi:
                    t = min(t, (hi - pa) / (pb - pa))
                elif pb < lo:
                    t = min(t, (lo - pa) / (pb - pa))
            return a[0] + t * (b[0] - a[0]), a[1] + t * (b[1] - a[1])
    return None


def _label_box(c, x, y, width, size, text, font) -> None:
    c.setFont(font, size)
    fonts.draw(c, x, y, fit(text, width, font, size))


def _arrow(c, a, b, size: float) -> None:
    angle = math.atan2(b[1] - a[1], b[0] - a[0])
    path = c.beginPath()
    path.moveTo(*b)
    for turn in (2.7, -2.7):
        path.lineTo(b[0] + size * math.cos(angle + turn), b[1] + size * math.sin(angle + turn))
    path.close()
    c.drawPath(path, stroke=0, fill=1)
