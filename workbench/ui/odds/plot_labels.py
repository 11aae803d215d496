"""Labels of the Odds charts set where they cover no line, curve or other label, and the
y-axis titles worded to fit the plots' height (``workbench.figures.label_place`` decides;
this file measures the items and moves them). A label with no free place is hidden: the
side panel gives every figure in words."""

from __future__ import annotations

import re

import numpy as np
import pyqtgraph as pg
from PySide6.QtCore import QPointF

from workbench.figures import label_place as lp

# y-axis titles, longest first: the longest that fits the plot's height is shown
Y_TITLES = {"density": ("Likelihood of finishing (density per unit)", "Likelihood of finishing", "Likelihood"),
            "cumulative": ("Chance of finishing by the date", "Chance by the date", "Chance")}
# a title takes at most this share of its plot's height, centred on it: the two charts'
# titles, one above the other, stay apart and each sits clearly beside its own plot
TITLE_SHARE = 0.7


def scene_rect(vb) -> lp.Rect:
    r = vb.sceneBoundingRect()
    return r.left(), r.top(), r.right(), r.bottom()


def _to_scene(vb):
    """x, y arrays in view units → scene pixels (the view's map is linear)."""
    o = vb.mapViewToScene(QPointF(0.0, 0.0))
    u = vb.mapViewToScene(QPointF(1.0, 1.0))
    sx, sy = u.x() - o.x(), u.y() - o.y()
    return lambda xs, ys: (o.x() + sx * np.asarray(xs, float), o.y() + sy * np.asarray(ys, float))


def curve_obstacles(vb, items, obstacles: lp.Obstacles) -> None:
    to_scene = _to_scene(vb)
    for item in items:
        if not item.isVisible():
            continue
        xs, ys = item.getData()
        if xs is not None and len(xs) >= 2:
            obstacles.curve(*to_scene(xs, ys))


def line_obstacles(vb, lines, obstacles: lp.Obstacles) -> None:
    to_scene = _to_scene(vb)
    left, top, right, bottom = scene_rect(vb)
    for line in lines:
        if not line.isVisible():
            continue
        if line.angle == 90:
            x = float(to_scene([line.value()], [0.0])[0][0])
            obstacles.vertical_line(x, top, bottom, 3.0)
        else:
            y = float(to_scene([0.0], [line.value()])[1][0])
            obstacles.horizontal_line(y, left, right, 3.0)


def size_of(text_item: pg.TextItem) -> tuple[float, float]:
    r = text_item.textItem.boundingRect()
    return r.width(), r.height()


def put(vb, text_item: pg.TextItem, rect: lp.Rect | None) -> None:
    """Show ``text_item`` with its top left at ``rect``'s (scene pixels), or hide it."""
    if rect is None:
        text_item.setVisible(False)
        return
    text_item.setAnchor((0.0, 0.0))
    text_item.setPos(vb.mapSceneToView(QPointF(rect[0], rect[1])))
    text_item.setVisible(True)


def put_legend(vb, legend, rect: lp.Rect | None) -> None:
    if rect is None:
        legend.setVisible(False)
        return
    box = vb.sceneBoundingRect()
    legend.anchor(itemPos=(0, 0), parentPos=(0, 0), offset=(rect[0] - box.left(), rect[1] - box.top()))
    legend.setVisible(True)


def legend_size(legend) -> tuple[float, float]:
    r = legend.boundingRect()
    return r.width(), r.height()


def fit_y_title(plot, titles: tuple[str, ...]) -> None:
    """Show the longest of ``titles`` that fits along the middle of the plot's left axis,
    as drawn (or none); measured again only when the axis height changes."""
    axis = plot.getAxis("left")
    room = plot.vb.height() * TITLE_SHARE      # the axis runs along the plot's height
    if abs(getattr(plot, "_y_room", -99.0) - room) < 1.0:
        return
    plot._y_room = room
    for title in titles:
        plot.setLabel("left", title)
        if axis.label.boundingRect().width() <= room:
            axis.showLabel(True)
            axis.resizeEvent(None)             # centred again for this wording's length
            return
    axis.showLabel(False)


_WEEKDAY = re.compile(r"\b(Mon|Tue|Wed|Thu|Fri|Sat|Sun) ")
_YEAR = re.compile(r" \d{4}\b")


def shorter(text: str) -> str:
    """The same date said shorter for a small chart: "by Fri 10 Sep 2027" → "by 10 Sep"."""
    return _YEAR.sub("", _WEEKDAY.sub("", text))


def place_items(vb, entries, bounds: lp.Rect, obstacles: lp.Obstacles, taken: list) -> None:
    """Place each ``(text_item, text, candidates)`` in turn (``candidates(w, h)`` gives the
    rectangles to try for a label w × h): the whole text first, then the shorter one;
    hidden when neither has a free place."""
    for item, text, candidates in entries:
        for wording in dict.fromkeys((text, shorter(text))):
            item.setText(wording)
            options = candidates(*size_of(item))
            pick = lp.place([options], bounds, obstacles, taken)[0]
            if pick is not None:
                put(vb, item, options[pick])
                break
        else:
            item.setText(text)
            put(vb, item, None)
