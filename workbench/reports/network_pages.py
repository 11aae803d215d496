"""The Network diagram on landscape pages: one fitted overview, then, when the overview is
too small to read a node's numbers, detail pages tiling the diagram at a legible scale."""

from __future__ import annotations

import math

import numpy as np

from reportlab.platypus import Paragraph

from workbench.figures.network_layout import layout_plan

from . import limits, styles
from .chart_flowable import ChartFlowable
from .layout import LANDSCAPE, Section, new_page
from .text import para
from .network_paint import DETAIL_SCALE, MIN_DETAIL_SCALE, NetworkPainter, View, link_bounds

HEADING_SPACE = 30.0
NOTE_SPACE = 30.0
DETAIL_NOTE_SPACE = 16.0
DETAIL_NOTE = ("Each box: id and PERT te; name; ES, EF, total float TF / LS, LF, free float FF (plan units "
               "from the start). Critical: vermillion, heavy outline.")
MARGIN_UNITS = 12.0
SUMMARISED = "Overview: ids only;"


def cuts(starts, ends, lo: float, hi: float, size: float, pad: float = 6.0) -> list[tuple[float, float]]:
    """Windows of at most ``size`` covering [lo, hi], each ending in a gap between boxes
    (given as intervals starts..ends) where one exists, so no box is cut in two."""
    out, a = [], lo
    while a < hi - 1e-6:
        b = a + size
        while True:
            straddle = [s for s, e in zip(starts, ends) if s < b < e and s > a + 0.3 * size]
            if not straddle:
                break
            b = min(straddle) - pad
        out.append((a, b))
        a = b
    return out


def tiles(layout, page_w: float, page_h: float, scale: float) -> list[View]:
    """Page-sized windows of the layout at ``scale``: vertical strips of whole columns;
    down a strip, pages overlap by one node height, so a node cut at the foot of one page
    appears whole at the head of the next."""
    b, win_h = layout.boxes, page_h / scale
    xs = cuts(b[:, 0], b[:, 0] + b[:, 2], -MARGIN_UNITS, layout.width + MARGIN_UNITS, page_w / scale)
    total = layout.height + 2 * MARGIN_UNITS
    if total <= win_h:
        top = (layout.height - win_h) / 2           # everything fits one page high: centred
        return [View(x0, top, x1 - x0, win_h, scale) for x0, x1 in xs]
    step = max(win_h - float(b[:, 3].max()) - 2 * MARGIN_UNITS, win_h * 0.5)
    count = math.ceil((total - win_h) / step) + 1
    return [View(x0, -MARGIN_UNITS + k * step, x1 - x0, win_h, scale) for k in range(count) for x0, x1 in xs]


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
            Paragraph(f"Network, detail {k + 1} of {len(views)}", styles.H1),
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


def detail_scale(layout, page_h: float) -> float:
    """DETAIL_SCALE, or a little less (not below MIN_DETAIL_SCALE) when that lets the whole
    height of the diagram fit one page: fewer pages for wide, shallow networks."""
    fits = page_h / (layout.height + 2 * MARGIN_UNITS)
    return DETAIL_SCALE if fits >= DETAIL_SCALE else max(MIN_DETAIL_SCALE, fits)


def _note(scale: float) -> str:
    base = ("Boxes are activities (id and PERT te on top; early/late start and finish, total float TF "
            "and free float FF below, in plan units from the start). Critical activities and the links "
            "that drive them are vermillion with a heavy outline.")
    if scale < MIN_DETAIL_SCALE:
        return "Overview: ids only; the detail pages that follow show every box's numbers. " + base
    return base
