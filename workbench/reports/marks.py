"""Small drawing primitives shared by the chart pages: hatched critical bars, diamonds,
slack lines with their upright tick, legend swatches."""

from __future__ import annotations

from . import styles

HATCH_STEP = 4.0


def critical_bar(c, x: float, y: float, w: float, h: float, outline: float = 1.4) -> None:
    """Vermillion bar with diagonal hatching and a heavy dark outline (reads in grayscale)."""
    c.saveState()
    c.setFillColor(styles.CRITICAL)
    c.rect(x, y, w, h, stroke=0, fill=1)
    path = c.beginPath()
    path.rect(x, y, w, h)
    c.clipPath(path, stroke=0, fill=0)
    c.setStrokeColor(styles.TEXT)
    c.setLineWidth(0.35)
    k = -h
    while k < w:
        c.line(x + k, y, x + k + h, y + h)
        k += HATCH_STEP
    c.restoreState()
    c.saveState()
    c.setStrokeColor(styles.TEXT)
    c.setLineWidth(outline)
    c.rect(x, y, w, h, stroke=1, fill=0)
    c.restoreState()


def work_bar(c, x: float, y: float, w: float, h: float) -> None:
    c.saveState()
    c.setFillColor(styles.WORK)
    c.setStrokeColor(styles.WORK_EDGE)
    c.setLineWidth(0.5)
    c.rect(x, y, w, h, stroke=1, fill=1)
    c.restoreState()


def diamond(c, x: float, y: float, r: float, fill, outline: float = 0.6) -> None:
    path = c.beginPath()
    path.moveTo(x, y + r)
    path.lineTo(x + r, y)
    path.lineTo(x, y - r)
    path.lineTo(x - r, y)
    path.close()
    c.saveState()
    c.setFillColor(fill)
    c.setStrokeColor(styles.TEXT)
    c.setLineWidth(outline)
    c.drawPath(path, stroke=1, fill=1)
    c.restoreState()


def slack_line(c, x0: float, x1: float, y: float, tick: float, width: float = 1.0) -> None:
    """The float line from EF to LF ending in a short upright tick."""
    c.saveState()
    c.setStrokeColor(styles.FLOAT)
    c.setLineWidth(width)
    c.line(x0, y, x1, y)
    c.line(x1, y - tick / 2, x1, y + tick / 2)
    c.restoreState()


def line_swatch(colour, width: float, dash=None):
    """A legend swatch drawing a line across its box (``dash`` as reportlab's setDash args)."""
    def draw(c, x, y, w, h):
        c.saveState()
        c.setStrokeColor(colour)
        c.setLineWidth(width)
        if dash:
            c.setDash(*dash)
        c.line(x, y + h / 2, x + w, y + h / 2)
        c.restoreState()
    return draw


def legend(c, x: float, y: float, items: list[tuple[str, callable]], size: float = 8.0) -> None:
    """A one-line legend: each item draws its swatch in a 14×7 box, then its label."""
    c.saveState()
    c.setFont(styles.FONT, size)
    for label, swatch in items:
        swatch(c, x, y, 14.0, 7.0)
        c.setFillColor(styles.TEXT)
        c.drawString(x + 18, y, label)
        x += 26 + c.stringWidth(label, styles.FONT, size)
    c.restoreState()
