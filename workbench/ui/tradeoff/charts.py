"""The Trade-off view's two charts: their axes (costs, chance), how a plot is set up, and
where labels sit so the chart never cuts them."""

from __future__ import annotations

import pyqtgraph as pg

from workbench.figures import tradeoff as ftr


class MoneyAxis(pg.AxisItem):
    """Costs as 950, 12.5k, 1.25M (never in scientific notation)."""

    def __init__(self, **kw):
        super().__init__("left", **kw)
        self.enableAutoSIPrefix(False)

    def tickStrings(self, values, scale, spacing):  # noqa: N802 (Qt override)
        return [ftr.money(v) for v in values]


class ChanceAxis(pg.AxisItem):
    """0–100 % with both ends always labelled (they are the first tick level; the steps
    between are labelled as room allows). The last label may reach past the axis's end,
    into a right margin of the plot kept for it (``reserve_room``), instead of being dropped."""

    def __init__(self, **kw):
        super().__init__("bottom", **kw)
        self.room = 0
        ends = (ftr.CHANCE_TICKS[0], ftr.CHANCE_TICKS[-1])
        self.setTicks([[(v, f"{v:g}") for v in ends], [(v, f"{v:g}") for v in ftr.CHANCE_TICKS[1:-1]]])

    def reserve_room(self, plot_item) -> None:
        font = self.style["tickFont"] or pg.QtGui.QFont()
        half = pg.QtGui.QFontMetrics(font).horizontalAdvance(f"{ftr.CHANCE_TICKS[-1]:g}") // 2 + 6
        self.room = half
        self.setStyle(hideOverlappingLabels=half)
        left, top, _, bottom = plot_item.layout.getContentsMargins()
        plot_item.layout.setContentsMargins(left, top, half, bottom)

    def boundingRect(self):  # noqa: N802 (Qt override)
        # with a grid, pyqtgraph bounds the labels by the axis alone, whatever the style says
        room = getattr(self, "room", 0)
        return super().boundingRect().adjusted(-room, 0, room, 0)


def make_plot(title: str, left: str, bottom: str, axis=None, legend=None) -> pg.PlotWidget:
    axes = {"left": MoneyAxis()}
    if axis is not None:
        axes["bottom"] = axis
    w = pg.PlotWidget(background="w", axisItems=axes)
    w.setTitle(title, color="#000000", size="13pt")
    w.setLabel("left", left)
    w.setLabel("bottom", bottom)
    w.showGrid(x=True, y=True, alpha=0.2)
    font = pg.QtGui.QFont()
    font.setPointSize(11)
    for side in ("left", "bottom"):
        w.getAxis(side).setTickFont(font)
        w.getAxis(side).setTextPen("#000000")
    if isinstance(axis, ChanceAxis):
        axis.reserve_room(w.getPlotItem())
    if legend is not None:
        w.addLegend(offset=legend, labelTextSize="11pt", labelTextColor="#000000", brush=pg.mkBrush(255, 255, 255, 220))
    return w


def label_anchor(x: float, textbook: bool) -> tuple[float, float]:
    """Where a point's label sits: confidence plans above it (to the left on the right half);
    the textbook plan, near zero cost, beside it, so the axis never cuts it."""
    if textbook:
        return (1.12, 0.5) if x > 35 else (-0.12, 0.5)
    return (1.05, 1.1) if x > 55 else (-0.05, 1.1)


def along(x: float, lines) -> float:
    """How far ``x`` lies across the curve's span, 0 to 1: the optimum's label is anchored
    there, so at either end of the curve it stays inside the chart."""
    xs = [float(v) for v in lines.durations] + ([] if lines.deadline is None else [float(lines.deadline)])
    lo, hi = min(xs, default=x), max(xs, default=x)
    return 0.5 if hi <= lo else min(max((x - lo) / (hi - lo), 0.0), 1.0)


def font_of(size: int):
    font = pg.QtGui.QFont()
    font.setPointSize(size)
    return font


def room_range(lo: float, hi: float, up: tuple[float, float], down: tuple[float, float],
               height: float) -> tuple[float, float]:
    """A value range holding [lo, hi] with ``up[1]`` pixels above the value ``up[0]`` (a label
    over a point) and ``down[1]`` pixels below the value ``down[0]`` (a marker's lower half),
    in a plot ``height`` pixels high: on a short chart a label at the top, or a marker at the
    bottom, would otherwise be cut by the chart's edge."""
    a, b = (up[1] / height, down[1] / height) if height > 0 else (0.0, 0.0)
    if a < 0 or b < 0 or a + b >= 0.9:
        return lo, hi
    bottom, top = lo, hi
    for _ in range(60):      # the least range meeting both: a contraction, as a + b < 1
        span = top - bottom
        bottom, top = min(lo, down[0] - b * span), max(hi, up[0] + a * span)
    return bottom, top
