"""Where a chart's labels go so that none covers another or is struck through by a line.

Pixel geometry, y down, no Qt. A label offers a few candidate rectangles in order of
preference (right of its point, left of it, above, ...); :func:`place` takes the labels
in order of importance and gives each the first candidate that stays inside the plot and
touches neither a label placed before it, nor a fixed obstacle (a straight line drawn as
a thin rectangle), nor a curve (a polyline ``xs, ys``). A label with no free candidate
gets ``None``: the caller hides it rather than draw it over something (every figure a
label carries is also given in words beside the chart).
"""

from __future__ import annotations

from dataclasses import dataclass, field

import numpy as np

Rect = tuple[float, float, float, float]      # left, top, right, bottom


@dataclass
class Obstacles:
    """What labels must not touch: rectangles (lines drawn as thin rectangles, other
    boxes) and curves (polylines in pixels; x need not be sorted)."""

    rects: list[Rect] = field(default_factory=list)
    curves: list[tuple[np.ndarray, np.ndarray]] = field(default_factory=list)
    sorted_x: list[bool] = field(default_factory=list)     # per curve: x never decreases

    def vertical_line(self, x: float, top: float, bottom: float, width: float = 2.0) -> None:
        self.rects.append((x - width / 2, top, x + width / 2, bottom))

    def horizontal_line(self, y: float, left: float, right: float, width: float = 2.0) -> None:
        self.rects.append((left, y - width / 2, right, y + width / 2))

    def curve(self, xs, ys) -> None:
        xs, ys = np.asarray(xs, float), np.asarray(ys, float)
        keep = np.isfinite(xs) & np.isfinite(ys)
        if np.count_nonzero(keep) >= 2:
            xs, ys = xs[keep], ys[keep]
            self.curves.append((xs, ys))
            self.sorted_x.append(bool(np.all(xs[1:] >= xs[:-1])))


def rects_meet(a: Rect, b: Rect, gap: float = 0.0) -> bool:
    """True when ``a`` and ``b`` overlap or come closer than ``gap``."""
    return a[0] < b[2] + gap and b[0] < a[2] + gap and a[1] < b[3] + gap and b[1] < a[3] + gap


def inside(rect: Rect, bounds: Rect) -> bool:
    return bounds[0] <= rect[0] and rect[2] <= bounds[2] and bounds[1] <= rect[1] and rect[3] <= bounds[3]


def curve_meets(rect: Rect, xs: np.ndarray, ys: np.ndarray, sorted_x: bool | None = None) -> bool:
    """True when the polyline through (xs, ys) passes through ``rect``: some segment, cut
    to the rectangle's x range, spans y values inside it. A curve whose x never decreases
    (every chart curve here) is cut to the rectangle's x range first."""
    if sorted_x is None:
        sorted_x = bool(np.all(xs[1:] >= xs[:-1]))
    if sorted_x:
        lo = max(int(np.searchsorted(xs, rect[0], "left")) - 1, 0)
        hi = min(int(np.searchsorted(xs, rect[2], "right")) + 1, xs.size)
        xs, ys = xs[lo:hi], ys[lo:hi]
        if xs.size < 2:
            return False
    x0, x1 = xs[:-1], xs[1:]
    y0, y1 = ys[:-1], ys[1:]
    lo, hi = np.minimum(x0, x1), np.maximum(x0, x1)
    near = (hi >= rect[0]) & (lo <= rect[2])
    if not np.any(near):
        return False
    x0, x1, y0, y1 = x0[near], x1[near], y0[near], y1[near]
    dx = x1 - x0
    flat = np.abs(dx) < 1e-9                         # an upright segment (a histogram step)
    safe = np.where(flat, 1.0, dx)
    ta = np.clip((rect[0] - x0) / safe, 0.0, 1.0)
    tb = np.clip((rect[2] - x0) / safe, 0.0, 1.0)
    ya = np.where(flat, y0, y0 + (y1 - y0) * ta)
    yb = np.where(flat, y1, y0 + (y1 - y0) * tb)
    return bool(np.any((np.maximum(ya, yb) >= rect[1]) & (np.minimum(ya, yb) <= rect[3])))


def free(rect: Rect, bounds: Rect, taken: list[Rect], obstacles: Obstacles, gap: float = 2.0) -> bool:
    """True when ``rect`` is inside ``bounds`` and touches nothing."""
    if not inside(rect, bounds):
        return False
    if any(rects_meet(rect, other, gap) for other in taken):
        return False
    if any(rects_meet(rect, other) for other in obstacles.rects):
        return False
    return not any(curve_meets(rect, xs, ys, ordered)
                   for (xs, ys), ordered in zip(obstacles.curves, obstacles.sorted_x))


def place(candidates: list[list[Rect]], bounds: Rect, obstacles: Obstacles,
          taken: list[Rect] | None = None) -> list[int | None]:
    """For each label (most important first) the index of its first free candidate, or
    None. Placed labels become obstacles for the labels after them (and are appended to
    ``taken`` when given)."""
    taken = [] if taken is None else taken
    chosen: list[int | None] = []
    for options in candidates:
        pick = next((k for k, rect in enumerate(options) if free(rect, bounds, taken, obstacles)), None)
        if pick is not None:
            taken.append(options[pick])
        chosen.append(pick)
    return chosen


def around_point(x: float, y: float, w: float, h: float, pad: float = 6.0) -> list[Rect]:
    """Candidates for a label of a point: right-below, right-above, left-above, left-below,
    above, below."""
    return [(x + pad, y + pad / 2, x + pad + w, y + pad / 2 + h),
            (x + pad, y - pad / 2 - h, x + pad + w, y - pad / 2),
            (x - pad - w, y - pad / 2 - h, x - pad, y - pad / 2),
            (x - pad - w, y + pad / 2, x - pad, y + pad / 2 + h),
            (x - w / 2, y - pad - h, x + w / 2, y - pad),
            (x - w / 2, y + pad, x + w / 2, y + pad + h)]


def beside_line(x: float, top: float, bottom: float, w: float, h: float, steps: int = 6,
                pad: float = 4.0, left_first: bool = False) -> list[Rect]:
    """Candidates for the label of an upright line: on either side of it, from the top of
    the plot down, in ``steps`` heights."""
    out = []
    room = max(bottom - top - h, 0.0)
    for k in range(steps):
        y = top + 2.0 + room * k / max(steps - 1, 1)
        right = (x + pad, y, x + pad + w, y + h)
        left = (x - pad - w, y, x - pad, y + h)
        out += [left, right] if left_first else [right, left]
    return out


def corners(bounds: Rect, w: float, h: float, margin: float = 6.0) -> list[Rect]:
    """Candidates for a box in a plot's corners: top right, top left, bottom right, bottom left."""
    l, t, r, b = bounds
    return [(r - margin - w, t + margin, r - margin, t + margin + h),
            (l + margin, t + margin, l + margin + w, t + margin + h),
            (r - margin - w, b - margin - h, r - margin, b - margin),
            (l + margin, b - margin - h, l + margin + w, b - margin)]
