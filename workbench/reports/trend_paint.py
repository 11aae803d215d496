"""Drawing of the odds trend on a reportlab canvas, from ``workbench.figures.odds_trend``.

Simulation: a thick blue line with filled square marks; PERT: a thin black dashed line
with small round marks; the approved baseline: a hollow diamond labelled with its name;
the target confidence: a dotted level line. Shapes and dashes differ, so the chart reads
in grayscale as well as in colour."""

from __future__ import annotations

import numpy as np

from workbench.figures import odds_trend as ot

from . import marks as mk
from . import styles
from .axes import TICK_FONT, Axes
from .text import clean
from workbench.core.formatting import format_whole_percent

LEFT, AXIS_H, LEGEND_H = 40.0, 26.0, 16.0


def _marks(ax: Axes, xs, ys, kind: str, size: float) -> None:
    c = ax.canvas
    c.saveState()
    for x, y in zip(xs, ys):
        if not np.isfinite(y):
            continue
        px, py = ax.px(x), ax.py(y)
        if kind == "square":
            c.setFillColor(styles.WORK)
            c.rect(px - size, py - size, 2 * size, 2 * size, stroke=0, fill=1)
        else:
            c.setFillColor(styles.TEXT)
            c.circle(px, py, size, stroke=0, fill=1)
    c.restoreState()


def _series(ax: Axes, xs, ys, colour, width: float, dash=None) -> None:
    ok = np.isfinite(ys)
    if ok.sum() >= 2:
        c = ax.canvas
        c.saveState()
        if dash:
            c.setDash(*dash)
        ax.polyline(xs[ok], ys[ok], stroke=colour, width=width)
        c.restoreState()


class TrendPainter:
    def __init__(self, fig: ot.TrendFigure, big: bool = False):
        self.fig, self.scale = fig, 1.5 if big else 1.0

    def paint(self, c, w: float, h: float) -> None:
        fig, s = self.fig, self.scale
        ax = Axes(c, LEFT, LEGEND_H + 4 + AXIS_H, w - LEFT - 10, h - LEGEND_H - AXIS_H - 24,
                  fig.x_lo, fig.x_hi, 0.0, 1.06)
        ax.value_axis([k / 10 for k in range(0, 11, 2)], lambda v: f"{v * 100:.0f} %", grid=True)
        self._x_ticks(ax)
        ax.frame()
        self._target(ax)
        for x, text in fig.deadline_moves:
            ax.vline(x, styles.DEADLINE, 1.2, (4, 2), label=text, top=False)
        _series(ax, fig.x, fig.pert, styles.TEXT, 1.0 * s, (3, 2))
        _series(ax, fig.x, fig.simulation, styles.WORK, 2.6 * s)
        _marks(ax, fig.x, fig.pert, "dot", 2.2 * s)
        _marks(ax, fig.x, fig.simulation, "square", 3.2 * s)
        self._values(ax)
        self._baseline(ax)
        mk.legend(c, 0, 2, self._legend())

    def _x_ticks(self, ax: Axes) -> None:
        c = ax.canvas
        c.saveState()
        c.setFont(styles.FONT, TICK_FONT)
        for x, text in self.fig.ticks:
            c.setStrokeColor(styles.GRID)
            c.setLineWidth(0.4)
            c.line(ax.px(x), ax.y, ax.px(x), ax.y + ax.h)
            c.setFillColor(styles.TEXT)
            c.drawCentredString(ax.px(x), ax.y - 12, clean(text))
        c.restoreState()

    def _target(self, ax: Axes) -> None:
        c, y = ax.canvas, ax.py(self.fig.target)
        c.saveState()
        c.setStrokeColor(styles.MUTED)
        c.setLineWidth(1.0)
        c.setDash(1, 2)
        c.line(ax.x, y, ax.x + ax.w, y)
        c.setFillColor(styles.MUTED)
        c.setFont(styles.BOLD, TICK_FONT)
        c.drawRightString(ax.x + ax.w - 2, y + 3, clean(f"target {format_whole_percent(self.fig.target)}"))
        c.restoreState()

    def _values(self, ax: Axes) -> None:
        """Each simulated chance written above its mark, large enough for the back row."""
        c = ax.canvas
        c.saveState()
        c.setFont(styles.BOLD, 9 * self.scale)
        c.setFillColor(styles.TEXT)
        for x, y in zip(self.fig.x, self.fig.simulation):
            if np.isfinite(y):
                c.drawCentredString(ax.px(x), ax.py(y) + 6 * self.scale, f"{format_whole_percent(y)}")
        c.restoreState()

    def _baseline(self, ax: Axes) -> None:
        if self.fig.baseline is None:
            return
        x, y, name = self.fig.baseline
        c = ax.canvas
        c.saveState()
        mk.diamond(c, ax.px(x), ax.py(y), 5 * self.scale, _white(), 1.2)
        c.setFont(styles.BOLD, 8 * self.scale)
        c.setFillColor(styles.TEXT)
        c.drawString(ax.px(x) + 7, ax.py(y) - 12 * self.scale, clean(f"approved: {name} ({format_whole_percent(y)})"))
        c.restoreState()

    def _legend(self):
        items = [("Chance of the deadline by simulation", mk.line_swatch(styles.WORK, 2.6)),
                 ("by PERT (one path)", mk.line_swatch(styles.TEXT, 1.0, (3, 2))),
                 ("Target confidence", mk.line_swatch(styles.MUTED, 1.0, (1, 2)))]
        if self.fig.baseline is not None:
            items.append(("Approved baseline", lambda c, x, y, w, h: mk.diamond(c, x + w / 2, y + h / 2, 3.5, _white(), 1.0)))
        return items


def _white():
    from reportlab.lib.colors import white
    return white
