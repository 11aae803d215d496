"""A plotting rectangle on a reportlab canvas: data-to-page mapping, axes, ticks, lines."""

from __future__ import annotations

from dataclasses import dataclass

from reportlab.lib import colors
from reportlab.pdfbase.pdfmetrics import stringWidth

from workbench.figures.ticks import date_ticks, fitted_date_ticks

from . import styles
from .text import clean

TICK_FONT = 8.0


@dataclass
class Axes:
    """Data x in [x_lo, x_hi] and y in [y_lo, y_hi] drawn into the page box (x, y, w, h)."""

    canvas: object
    x: float
    y: float
    w: float
    h: float
    x_lo: float
    x_hi: float
    y_lo: float = 0.0
    y_hi: float = 1.0

    def px(self, value: float) -> float:
        span = (self.x_hi - self.x_lo) or 1.0
        return self.x + (value - self.x_lo) / span * self.w

    def py(self, value: float) -> float:
        span = (self.y_hi - self.y_lo) or 1.0
        return self.y + (value - self.y_lo) / span * self.h

    def polyline(self, xs, ys, close: bool = False, fill=None, stroke=None, width: float = 1.0):
        c = self.canvas
        path = c.beginPath()
        pts = list(zip(xs, ys))
        if not pts:
            return
        path.moveTo(self.px(pts[0][0]), self.py(pts[0][1]))
        for a, b in pts[1:]:
            path.lineTo(self.px(a), self.py(b))
        if close:
            path.close()
        c.saveState()
        if fill is not None:
            c.setFillColor(fill)
        if stroke is not None:
            c.setStrokeColor(stroke)
        c.setLineWidth(width)
        c.drawPath(path, stroke=int(stroke is not None), fill=int(fill is not None))
        c.restoreState()

    def vline(self, value: float, colour, width: float = 1.0, dash=None, label: str = "", top: bool = True):
        c, x = self.canvas, self.px(value)
        c.saveState()
        c.setStrokeColor(colour)
        c.setLineWidth(width)
        if dash:
            c.setDash(*dash)
        c.line(x, self.y, x, self.y + self.h)
        if label:
            text = clean(label)
            y = self.y + self.h + 3 if top else self.y + self.h - 10
            half = c.stringWidth(text, styles.BOLD, TICK_FONT) / 2 + 1.5
            c.setFillColor(colors.white)          # a backing, so a line drawn later never crosses it
            c.rect(x - half, y - 2, 2 * half, TICK_FONT + 2, stroke=0, fill=1)
            c.setFillColor(colour)
            c.setFont(styles.BOLD, TICK_FONT)
            c.drawCentredString(x, y, text)
        c.restoreState()

    def frame(self, width: float = 0.6):
        c = self.canvas
        c.saveState()
        c.setStrokeColor(styles.TEXT)
        c.setLineWidth(width)
        c.line(self.x, self.y, self.x + self.w, self.y)
        c.line(self.x, self.y, self.x, self.y + self.h)
        c.restoreState()

    def date_axis(self, calendar, max_ticks: int | None = None, grid: bool = True, at_top: bool = False):
        """Date ticks from the shared tick chooser, with light grid lines."""
        c = self.canvas
        if max_ticks:
            ticks = date_ticks(calendar, self.x_lo, self.x_hi, max_ticks)
        else:       # as fine as the labels allow: days or weeks when there is room
            measure = lambda text: c.stringWidth(clean(text), styles.FONT, TICK_FONT)
            ticks = fitted_date_ticks(calendar, self.x_lo, self.x_hi, self.w, measure, gap=10.0)
        c.saveState()
        c.setFont(styles.FONT, TICK_FONT)
        base = self.y + self.h if at_top else self.y
        for offset, text in ticks:
            x = self.px(offset)
            if grid:
                c.setStrokeColor(styles.GRID)
                c.setLineWidth(0.4)
                c.line(x, self.y, x, self.y + self.h)
            c.setStrokeColor(styles.TEXT)
            c.setLineWidth(0.6)
            c.line(x, base, x, base + (3 if at_top else -3))
            c.setFillColor(styles.TEXT)
            c.drawCentredString(x, base + 5 if at_top else base - 12, clean(text))
        c.restoreState()
        return ticks

    def value_axis(self, ticks, fmt=lambda v: f"{v:g}", right: bool = False, grid: bool = False):
        """Numeric ticks on the left (or right) edge."""
        c = self.canvas
        c.saveState()
        c.setFont(styles.FONT, TICK_FONT)
        edge = self.x + self.w if right else self.x
        for v in ticks:
            y = self.py(v)
            if grid:
                c.setStrokeColor(styles.GRID)
                c.setLineWidth(0.4)
                c.line(self.x, y, self.x + self.w, y)
            c.setStrokeColor(styles.TEXT)
            c.line(edge, y, edge + (3 if right else -3), y)
            c.setFillColor(styles.TEXT)
            text = clean(fmt(v))
            if right:
                c.drawString(edge + 5, y - 3, text)
            else:
                c.drawRightString(edge - 5, y - 3, text)
        c.restoreState()


def text_width(text: str, size: float, bold: bool = False) -> float:
    return stringWidth(clean(text), styles.BOLD if bold else styles.FONT, size)
