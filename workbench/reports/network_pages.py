"""The Network diagram on landscape pages: one fitted overview, then, when the overview is
too small to read a node's numbers, detail pages tiling the diagram at a legible scale."""

from __future__ import annotations

import math

from reportlab.platypus import Paragraph

from workbench.figures.network_layout import layout_plan

from . import styles
from .chart_flowable import ChartFlowable
from .layout import LANDSCAPE, Section, new_page
from .network_paint import DETAIL_SCALE, NetworkPainter, View, link_bounds

HEADING_SPACE = 30.0
NOTE_SPACE = 30.0
OVERLAP = 0.06
MARGIN_UNITS = 12.0


def tiles(width: float, height: float, page_w: float, page_h: float, scale: float) -> list[View]:
    """Windows of the layout, page-sized at ``scale``, overlapping a little, row by row."""
    win_w, win_h = page_w / scale, page_h / scale
    step_w, step_h = win_w * (1 - OVERLAP), win_h * (1 - OVERLAP)
    nx = max(1, math.ceil((width - win_w) / step_w) + 1) if width > win_w else 1
    ny = max(1, math.ceil((height - win_h) / step_h) + 1) if height > win_h else 1
    top = (height - win_h) / 2 if height <= win_h else -MARGIN_UNITS   # centred when one row of tiles
    return [View(-MARGIN_UNITS + i * step_w, top + j * step_h, win_w, win_h, scale)
            for j in range(ny) for i in range(nx)]


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


def network_pages(ctx, frame: tuple[float, float]) -> list:
    layout = layout_plan(ctx.plan, ctx.analysis)
    width, height = frame
    chart_h = height - HEADING_SPACE - NOTE_SPACE
    overview = overview_view(layout, width, chart_h)
    fit = overview.scale
    story = new_page(LANDSCAPE) + [Section("Network", "network"), Paragraph("Network", styles.H1),
                                   ChartFlowable(width, chart_h, NetworkPainter(ctx, layout, overview).paint),
                                   Paragraph(_note(fit), styles.SMALL)]
    if fit >= DETAIL_SCALE:
        return story
    views = [v for v in tiles(layout.width, layout.height, width, chart_h, DETAIL_SCALE) if _occupied(layout, v)]
    boxes = link_bounds(layout)
    for k, view in enumerate(views):
        story += new_page(LANDSCAPE) + [
            Paragraph(f"Network, detail {k + 1} of {len(views)}", styles.H1),
            ChartFlowable(width, chart_h, NetworkPainter(ctx, layout, view, boxes).paint),
            Paragraph(_note(DETAIL_SCALE), styles.SMALL)]
    return story


def _note(scale: float) -> str:
    base = ("Boxes are activities (id and PERT te on top; early/late start and finish, total float TF "
            "and free float FF below, in plan units from the start). Critical activities and the links "
            "that drive them are vermillion with a heavy outline.")
    if scale < DETAIL_SCALE:
        return "Overview: ids only; the detail pages that follow show every box's numbers. " + base
    return base
