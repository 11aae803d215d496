"""The Network slide's diagram wrapped like text into strips set one under another, at the
largest scale that fills the slide: the number of strips is the one whose strips, stacked,
use the slide's width and height best (a wide, shallow network in two or three strips on a
4:3 projector). Strips are cut in the gaps between columns, so no box is cut in two."""

from __future__ import annotations

import bisect

import numpy as np

from workbench.reports.network_pages import MARGIN_UNITS, gaps
from workbench.reports.network_paint import MIN_DETAIL_SCALE, View

MAX_STRIPS = 6        # more strips than this on one slide read as a puzzle, not a diagram
ROW_GAP = 14.0        # points between two strips on one slide
STRIP_MARGIN = 2 * MARGIN_UNITS   # layout units beside a strip's outer boxes (room for the links leaving it)


def strip_windows(layout, count: int) -> list[tuple[float, float]]:
    """At most ``count`` windows (x0, x1) of the layout's width, cut in gaps between
    columns, the widest as narrow as the gaps allow."""
    b = layout.boxes
    lo, hi = float(b[:, 0].min()), float((b[:, 0] + b[:, 2]).max())
    points = sorted(g for g in gaps(b[:, 0], b[:, 0] + b[:, 2]) if lo < g < hi)
    small, large, best = (hi - lo) / max(count, 1), hi - lo, [(lo, hi)]
    found = _greedy(points, lo, hi, small)
    if found is not None and len(found) <= count:
        return found
    for _ in range(30):                      # bisection on the widest window's width
        mid = (small + large) / 2
        found = _greedy(points, lo, hi, mid)
        if found is not None and len(found) <= count:
            large, best = mid, found
        else:
            small = mid
    return best


def _greedy(points: list[float], lo: float, hi: float, width: float) -> list[tuple[float, float]] | None:
    """Windows no wider than ``width`` from lo to hi, each ending at the farthest gap
    (``points``) in reach: the fewest such windows; None when a column is wider."""
    out, start = [], lo
    while hi - start > width + 1e-9:
        j = bisect.bisect_right(points, start + width) - 1
        if j < 0 or points[j] <= start:
            return None
        out.append((start, points[j]))
        start = points[j]
    out.append((start, hi))
    return out


def strips(layout, count: int) -> list[View]:
    """The layout in ``count`` strips (or fewer when the gaps allow no more), at scale 1."""
    b = layout.boxes
    centre = b[:, 0] + b[:, 2] / 2
    windows = strip_windows(layout, count)
    out = []
    for k, (x0, x1) in enumerate(windows):
        last = k == len(windows) - 1
        own = np.flatnonzero((centre >= x0) & ((centre <= x1) if last else (centre < x1)))
        if not len(own):
            continue
        left, right = b[own, 0].min() - STRIP_MARGIN, (b[own, 0] + b[own, 2]).max() + STRIP_MARGIN
        top, foot = b[own, 1].min() - MARGIN_UNITS, (b[own, 1] + b[own, 3]).max() + MARGIN_UNITS
        out.append(View(float(left), float(top), float(right - left), float(foot - top), 1.0,
                        frozenset(own.tolist())))
    return out


def fill_scale(views: list[View], w: float, h: float) -> float:
    """Largest scale (points per unit) at which ``views`` stacked with ROW_GAP fit w × h,
    kept in overview drawing (ids fill the boxes)."""
    widest = max(v.w for v in views)
    tall = sum(v.h for v in views)
    room = h - ROW_GAP * (len(views) - 1)
    return min(w / widest, max(room, 1.0) / tall, MIN_DETAIL_SCALE * 0.95)


def wrapped(layout, w: float, h: float) -> list[View]:
    """The strips that fill w × h points best, at their common scale (empty for no boxes)."""
    if not len(layout.boxes):
        return []
    best: list[View] = []
    best_scale = 0.0
    for count in range(1, MAX_STRIPS + 1):
        views = strips(layout, count)
        scale = fill_scale(views, w, h)
        if scale > best_scale * 1.02:       # more strips only for a clearly larger diagram
            best, best_scale = views, scale
    return [View(v.x0, v.y0, v.w, v.h, best_scale, v.rows) for v in best]


def placed(views: list[View], w: float, h: float) -> list[tuple[float, float]]:
    """(left, top) in points of each view on a w × h slide (y up): the block of strips
    centred, the strips flush left with each other."""
    if not views:
        return []
    scale = views[0].scale
    widest = max(v.w for v in views) * scale
    block = sum(v.h for v in views) * scale + ROW_GAP * (len(views) - 1)
    left, top = (w - widest) / 2, h - (h - block) / 2
    out = []
    for v in views:
        out.append((left, top))
        top -= v.h * scale + ROW_GAP
    return out
