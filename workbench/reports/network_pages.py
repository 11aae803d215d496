"""The Network diagram on landscape pages: one fitted overview, then, when the overview is
too small to read a node's numbers, detail pages tiling the diagram at a legible scale."""

from __future__ import annotations

import math

import numpy as np

from reportlab.platypus import Paragraph

from workbench.figures.network_layout import layout_plan

from . import limits, styles
from .text import format_date, para
from .chart_flowable import ChartFlowable
from .layout import LANDSCAPE, Section, new_page
from .network_paint import DETAIL_SCALE, MIN_DETAIL_SCALE, NetworkPainter, View, link_bounds

HEADING_SPACE = 30.0
NOTE_SPACE = 30.0
DETAIL_NOTE_SPACE = 16.0
DETAIL_NOTE = ("Each box: id and PERT te; name; early start ES and finish EF; late start LS and finish LF; "
               "total float TF and free float FF. Critical: vermillion, heavy outline.")
MARGIN_UNITS = 12.0
SUMMARISED = "Overview: ids only;"
PAGE_MARGIN = 56.0    # layout units kept left and right of a detail page's boxes: room for link tags


def gaps(starts, ends) -> list[float]:
    """Points between boxes along one axis (boxes given as intervals starts..ends): the
    middle of every gap in the union of the intervals."""
    order = np.argsort(starts)
    out, reach = [], None
    for s, e in zip(np.asarray(starts, float)[order], np.asarray(ends, float)[order]):
        if reach is not None and s > reach:
            out.append((reach + s) / 2)
        reach = e if reach is None else max(reach, e)
    return out


def cuts(starts, ends, lo: float, hi: float, size: float, cost=None) -> list[tuple[float, float]]:
    """Windows of at most ``size`` covering [lo, hi], each cut in a gap between boxes so no
    box is cut in two. ``cost(a, b)`` gives a window's (pages, smallest share): the windows
    chosen need the fewest pages and, among those, make the smallest share as large as
    possible — by default one page a window, shared by length, so no sliver is left at
    the end. Only where no gap lies within a window's reach is a window cut through."""
    cost = cost or (lambda a, b: (1, b - a))
    points = [lo]
    for g in [g for g in gaps(starts, ends) if lo < g < hi] + [hi]:
        while g - points[-1] > size + 1e-6:
            points.append(points[-1] + size)       # no gap within reach: forced
        points.append(g)
    best = [(0, -math.inf, -1)]                    # per point: pages, -smallest share, previous
    for j in range(1, len(points)):
        options = []
        for i in range(j - 1, -1, -1):
            if points[j] - points[i] > size + 1e-6:
                break
            pages, share = cost(points[i], points[j])
            options.append((best[i][0] + pages, max(best[i][1], -share), i))
        best.append(min(options))
    out, j = [], len(points) - 1
    while j > 0:
        out.append((points[best[j][2]], points[j]))
        j = best[j][2]
    return out[::-1]


def tiles(layout, page_w: float, page_h: float, scale: float) -> list[View]:
    """Page-sized windows of the layout at ``scale``: vertical strips cut in the gaps
    between columns; down a strip, its boxes (top to bottom) are shared among as few pages
    as hold them. Strips and pages are chosen together: the fewest pages, and the fullest
    emptiest page. Each page draws its own boxes only, whole: no page cuts through a box."""
    b = layout.boxes
    if not len(b):
        return []
    centre, tall = b[:, 0] + b[:, 2] / 2, page_h / scale - 2 * MARGIN_UNITS

    def members(x0, x1):
        return np.flatnonzero((centre >= x0) & (centre < x1))

    def cost(x0, x1):
        groups = stack(b[members(x0, x1)], tall)
        return (len(groups), min(len(g) for g in groups)) if groups else (0, math.inf)

    views = []
    span = (-PAGE_MARGIN, layout.width + PAGE_MARGIN, page_w / scale - 2 * PAGE_MARGIN)
    for x0, x1 in cuts(b[:, 0], b[:, 0] + b[:, 2], *span, cost):
        inside = members(x0, x1)
        for rows in stack(b[inside], tall):
            views.append(_window(b, inside[rows], scale))
    return views


def _window(b, own, scale: float) -> View:
    """The page window around some boxes (plan rows ``own``), with a margin."""
    left, top = b[own, 0].min() - PAGE_MARGIN, b[own, 1].min() - MARGIN_UNITS
    right = (b[own, 0] + b[own, 2]).max() + PAGE_MARGIN
    foot = (b[own, 1] + b[own, 3]).max() + MARGIN_UNITS
    return View(float(left), float(top), float(right - left), float(foot - top), scale, frozenset(own.tolist()))


def stack(boxes, height: float) -> list[np.ndarray]:
    """The boxes (x, y, w, h) in groups, top to bottom, each group no taller than
    ``height``: as few groups as possible, the smallest as large as possible."""
    if not len(boxes):
        return []
    order = np.argsort(boxes[:, 1], kind="stable")
    top, foot = boxes[order, 1], boxes[order, 1] + boxes[order, 3]
    n = len(order)
    best = [(0, -math.inf, -1)]                    # per prefix: groups, -smallest, previous
    for j in range(1, n + 1):
        options = []
        for i in range(j - 1, -1, -1):
            if foot[i:j].max() - top[i] > height + 1e-6 and i < j - 1:
                break                              # taller than a page (one box always fits)
            options.append((best[i][0] + 1, max(best[i][1], -(j - i)), i))
        best.append(min(options))
    groups, j = [], n
    while j > 0:
        i = best[j][2]
        groups.append(order[i:j])
        j = i
    return groups[::-1]


def _occupied(layout, view: View) -> bool:
    b = layout.boxes
    if not len(b):
        return False
    inside = ((b[:, 0] + b[:, 2] >= view.x0) & (b[:, 0] <= view.x0 + view.w)
              & (b[:, 1] + b[:, 3] >= view.y0) & (b[:, 1] <= view.y0 + view.h))
    return bool(inside.any())


def overview_view(layout, width: float, height: float) -> View:
    """The whole diagram fitted into width × height points, centred vertically."""
    total_w, total_h = layout.width + 2 * MARGIN_UNITS, layout.height + 2 * MARGIN_UNITS
    fit = min(width / total_w, height / total_h, 1.0)
    return View(-MARGIN_UNITS, layout.height / 2 - height / fit / 2, total_w, height / fit, fit)


def too_large(ctx) -> list:
    """The Network section of a plan too large to draw: what to use instead."""
    text = (f"This plan has {len(ctx.plan):,} activities; a network diagram of more than "
            f"{limits.NETWORK_ACTIVITIES:,} cannot be read on paper, so none is printed. The Network view "
            "in the window shows it in full; the Timeline and the activity table of this "
            "pack give every printed activity's dates and floats.")
    return new_page(LANDSCAPE) + [Section("Network", "network"), Paragraph("Network", styles.H1),
                                  Paragraph(para(text), styles.BODY)]


def network_pages(ctx, frame: tuple[float, float]) -> list:
    if len(ctx.plan) > limits.NETWORK_ACTIVITIES:
        return too_large(ctx)
    layout = layout_plan(ctx.plan, ctx.analysis)
    width, height = frame
    chart_h = height - HEADING_SPACE - NOTE_SPACE
    overview = overview_view(layout, width, chart_h)
    views, note = _detail_views(ctx, layout, width, height, overview.scale)
    if note.startswith(SUMMARISED):               # a third line of note
        chart_h -= 12
        overview = overview_view(layout, width, chart_h)
    story = new_page(LANDSCAPE) + [Section("Network", "network"), Paragraph("Network", styles.H1),
                                   ChartFlowable(width, chart_h, NetworkPainter(ctx, layout, overview).paint),
                                   Paragraph(para(note), styles.SMALL)]
    detail_h = height - HEADING_SPACE - DETAIL_NOTE_SPACE
    boxes = link_bounds(layout)
    for k, view in enumerate(views):
        story += new_page(LANDSCAPE) + [
            Paragraph(para(f"Network, detail {k + 1} of {len(views)}: {_span(ctx, view)}"), styles.H1),
            ChartFlowable(width, detail_h, NetworkPainter(ctx, layout, view, boxes).paint),
            Paragraph(DETAIL_NOTE, styles.SMALL)]
    return story


def _detail_views(ctx, layout, width: float, height: float, fit: float) -> tuple[list[View], str]:
    """The detail pages' windows (none when the overview is legible) and the overview's
    note; past NETWORK_DETAIL_PAGES, only the pages showing critical boxes, said in the note."""
    if fit >= MIN_DETAIL_SCALE:
        return [], _note(fit)
    detail_h = height - HEADING_SPACE - DETAIL_NOTE_SPACE
    scale = detail_scale(layout, detail_h)
    views = [v for v in tiles(layout, width, detail_h, scale) if _occupied(layout, v)]
    if len(views) <= limits.NETWORK_DETAIL_PAGES:
        return views, _note(fit)
    total = len(views)
    views = _critical_views(layout, views, ctx.analysis.schedule.critical)[:limits.NETWORK_DETAIL_PAGES]
    return views, _some_detail(total, len(views)) + " " + _note(MIN_DETAIL_SCALE)


def _critical_views(layout, views: list[View], critical) -> list[View]:
    """The views holding at least one critical activity's box, in page order."""
    b = layout.boxes[np.asarray(critical, dtype=bool)]
    return [v for v in views if len(b) and bool(((b[:, 0] + b[:, 2] >= v.x0) & (b[:, 0] <= v.x0 + v.w)
                                                  & (b[:, 1] + b[:, 3] >= v.y0) & (b[:, 1] <= v.y0 + v.h)).any())]


def _some_detail(pages: int, shown: int) -> str:
    return (f"{SUMMARISED} every box at a legible scale would take {pages:,} pages, so the {shown} "
            f"detail pages that follow show the critical path's boxes only (the Network view in the window shows all).")
def _span(ctx, view) -> str:
    """The dates a detail page covers (its boxes' early starts to late finishes): the
    year its boxes' short dates belong to."""
    rows = sorted(view.rows)
    d = ctx.analysis.dates()
    first, last = d["early_start"][rows].min(), d["late_finish"][rows].max()
    return f"{format_date(min(first, last))} to {format_date(max(first, last))}"


def detail_scale(layout, page_h: float) -> float:
    """DETAIL_SCALE, or a little less (not below MIN_DETAIL_SCALE) when that lets the whole
    height of the diagram fit one page: fewer pages for wide, shallow networks. When even
    the smallest scale would not fit it, DETAIL_SCALE: the pages are legible."""
    fits = page_h / (layout.height + 2 * MARGIN_UNITS)
    return min(DETAIL_SCALE, fits) if fits >= MIN_DETAIL_SCALE else DETAIL_SCALE


def _note(scale: float) -> str:
    base = ("Boxes are activities (id and PERT te on top; early and late start and finish dates, total "
            "float TF and free float FF below). Critical activities and the links that drive them are "
            "vermillion with a heavy outline.")
    if scale < MIN_DETAIL_SCALE:
        return "Overview: ids only; the detail pages that follow show every box's numbers. " + base
    return base
