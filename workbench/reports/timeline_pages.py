"""The Timeline (Gantt chart) on landscape pages, from the shared timeline geometry.

Long plans are tiled: rows are split across pages (row labels and the date axis repeat on
every page), and a very long time span is split into overlapping time windows."""

from __future__ import annotations

import math

from reportlab.platypus import Paragraph

from workbench.figures.timeline import timeline_geometry

from . import styles
from .chart_flowable import ChartFlowable
from .layout import LANDSCAPE, Section, new_page
from .text import format_date, para
from .timeline_tile import TimelineTile, TileSpec

ROW_H = 14.0          # smallest row height; short plans get taller rows
MAX_ROW_H = 22.0
HEADING_SPACE = 30.0
CHROME = 2 * 18.0 + 18.0 + 8.0         # two date axes, the legend, a little air
MAX_WORKDAYS_PER_WINDOW = 330.0         # ~1.6 pt per working day on a landscape page
WINDOW_OVERLAP = 0.04


def row_chunks(n_rows: int, per_page: int) -> list[tuple[int, int]]:
    """Rows split into even page-sized chunks (no page with a lonely last row)."""
    pages = max(1, math.ceil(n_rows / max(1, per_page)))
    size = math.ceil(n_rows / pages) if n_rows else 0
    return [(r, min(r + size, n_rows)) for r in range(0, n_rows, size)] if n_rows else [(0, 0)]


def time_windows(lo: float, hi: float, per_unit: float, extent=None) -> list[tuple[float, float]]:
    """Windows over [lo, hi] of at most MAX_WORKDAYS_PER_WINDOW working days, all the same
    length (one scale on every page); only those meeting ``extent`` (lo, hi) are kept."""
    pad = 0.02 * (hi - lo)
    lo, hi = lo - pad, hi + pad
    count = max(1, math.ceil((hi - lo) * per_unit / MAX_WORKDAYS_PER_WINDOW))
    step = (hi - lo) / count
    overlap = WINDOW_OVERLAP * step
    windows = [(lo + k * step - (overlap if k else 0), lo + (k + 1) * step + (overlap if k < count - 1 else 0))
               for k in range(count)]
    if extent is None or count == 1:
        return windows
    return [w for w in windows if w[1] >= extent[0] and w[0] <= extent[1]] or windows[:1]


def row_extent(geo, lo_row: int, hi_row: int) -> tuple[float, float] | None:
    """The x span of every mark on rows lo_row..hi_row-1, or None when they carry none."""
    spans = [(float(m.x0.min()), float(m.x1.max())) for m in
             (geo.marks[k].within(lo_row, hi_row - 1) for k in geo.marks) if len(m)]
    return (min(a for a, _ in spans), max(b for _, b in spans)) if spans else None


def timeline_pages(ctx, frame: tuple[float, float]) -> list:
    geo = timeline_geometry(ctx.analysis, ctx.simulation)
    width, height = frame
    chart_h = height - HEADING_SPACE
    per_page = int((chart_h - CHROME) // ROW_H) - 1          # one row kept for the project finish
    cal = ctx.analysis.calendar
    chunks = row_chunks(geo.n_rows, per_page)
    tiles = [(rows, win) for rows in chunks
             for win in time_windows(*geo.x_range, cal.per_unit, row_extent(geo, *rows))]
    longest = max(hi - lo for lo, hi in chunks) or 1
    row_h = max(ROW_H, min(MAX_ROW_H, (chart_h - CHROME) / (longest + 1)))
    story = []
    for k, (rows, window) in enumerate(tiles):
        story += new_page(LANDSCAPE)
        if k == 0:
            story.append(Section("Timeline", "timeline"))
        story.append(Paragraph(_heading(ctx, geo, rows, window, k, len(tiles)), styles.H1))
        spec = TileSpec(rows[0], rows[1], window[0], window[1], row_h)
        story.append(ChartFlowable(width, chart_h, TimelineTile(ctx, geo, spec).paint))
    return story


def _heading(ctx, geo, rows, window, k: int, count: int) -> str:
    if count == 1:
        return "Timeline"
    cal = ctx.analysis.calendar
    span = f"{format_date(cal.start_date(window[0]))} to {format_date(cal.start_date(window[1]))}"
    text = (f"Timeline ({k + 1} of {count}): rows {rows[0] + 1}-{rows[1]} of {geo.n_rows}, {span}")
    return para(text)
