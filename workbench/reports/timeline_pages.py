"""The Timeline (Gantt chart) on landscape pages, from the shared timeline geometry.

Long plans are tiled: rows are split across pages (row labels and the date axis repeat on
every page), and a very long time span is split into overlapping time windows."""

from __future__ import annotations

import math

import numpy as np

from reportlab.platypus import Paragraph

from workbench.core.calendar import FIRST_DATE, LAST_DATE
from workbench.figures.timeline import timeline_geometry

from . import limits, styles
from .chart_flowable import ChartFlowable
from .layout import LANDSCAPE, Section, new_page
from .limits import least_float, summarised
from .text import format_date, para
from .timeline_living_paint import approved_variance
from .timeline_tile import TimelineTile, TileSpec

ROW_H = 14.0          # smallest row height; short plans get taller rows
MAX_ROW_H = 22.0
HEADING_SPACE = 30.0
NOTE_SPACE = 26.0                       # the two-line note of a summarised Timeline
CHROME = 2 * 18.0 + 18.0 + 8.0         # two date axes, the legend, a little air
MAX_WORKDAYS_PER_WINDOW = 330.0         # ~1.6 pt per working day on a landscape page
WINDOW_OVERLAP = 0.04


def row_chunks(n_rows: int, per_page: int) -> list[tuple[int, int]]:
    """Rows split into even page-sized chunks (no page with a lonely last row)."""
    pages = max(1, math.ceil(n_rows / max(1, per_page)))
    size = math.ceil(n_rows / pages) if n_rows else 0
    return [(r, min(r + size, n_rows)) for r in range(0, n_rows, size)] if n_rows else [(0, 0)]


def time_windows(lo: float, hi: float, per_unit: float, extent=None, most: int | None = None) -> list[tuple[float, float]]:
    """Windows over [lo, hi] of at most MAX_WORKDAYS_PER_WINDOW working days, all the same
    length (one scale on every page), and at most ``most`` of them (longer windows, a
    coarser scale, when the span needs more); only those meeting ``extent`` (lo, hi) are kept."""
    pad = 0.02 * (hi - lo)
    lo, hi = lo - pad, hi + pad
    count = max(1, math.ceil((hi - lo) * per_unit / MAX_WORKDAYS_PER_WINDOW))
    count = min(count, most) if most else count
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


def _per_page(chart_h: float) -> int:
    return int((chart_h - CHROME) // ROW_H) - 1          # one row kept for the project finish


def _rows_shown(ctx, height: float):
    """Chart height, rows per page and the ids to draw (None: all): when every activity
    would need more than TIMELINE_PAGES pages, the least-float ones, under a note."""
    chart_h = height - HEADING_SPACE
    if len(ctx.plan) <= limits.TIMELINE_PAGES * _per_page(chart_h):
        return chart_h, _per_page(chart_h), None
    chart_h -= NOTE_SPACE
    per_page = _per_page(chart_h)
    ids = ctx.analysis.schedule.ids
    return chart_h, per_page, [ids[i] for i in least_float(ctx.analysis.schedule, limits.TIMELINE_PAGES * per_page).tolist()]


def _tiles(geo, per_page: int, per_unit: float) -> list:
    """(rows, window) per page: at most TIMELINE_PAGES, and at most TIMELINE_WINDOWS time
    windows across the same rows (longer windows, a coarser scale, for a very long span)."""
    chunks = row_chunks(geo.n_rows, per_page)
    most = max(1, min(limits.TIMELINE_WINDOWS, limits.TIMELINE_PAGES // len(chunks)))
    return [(rows, win) for rows in chunks
            for win in time_windows(*geo.x_range, per_unit, row_extent(geo, *rows), most)]


def timeline_pages(ctx, frame: tuple[float, float]) -> list:
    width, height = frame
    chart_h, per_page, only = _rows_shown(ctx, height)
    geo = timeline_geometry(ctx.analysis, ctx.simulation, only=only, variance=approved_variance(ctx))
    cal = ctx.analysis.calendar
    tiles = _tiles(geo, per_page, cal.per_unit)
    chunks = sorted({rows for rows, _ in tiles})
    longest = max(hi - lo for lo, hi in chunks) or 1
    row_h = max(ROW_H, min(MAX_ROW_H, (chart_h - CHROME) / (longest + 1)))
    story = []
    for k, (rows, window) in enumerate(tiles):
        story += new_page(LANDSCAPE)
        if k == 0:
            story.append(Section("Timeline", "timeline"))
        story.append(Paragraph(_heading(ctx, geo, rows, window, k, len(tiles)), styles.H1))
        if only is not None:
            story.append(Paragraph(para(summarised(len(only), len(ctx.plan), "the Timeline")), styles.SMALL))
        spec = TileSpec(rows[0], rows[1], window[0], window[1], row_h)
        story.append(ChartFlowable(width, chart_h, TimelineTile(ctx, geo, spec).paint))
    return story


def _heading(ctx, geo, rows, window, k: int, count: int) -> str:
    if count == 1:
        return "Timeline"
    cal = ctx.analysis.calendar
    ends = np.clip(cal.start_dates(window, strict=False), FIRST_DATE, LAST_DATE)   # the padding may pass year 1
    span = f"{format_date(ends[0])} to {format_date(ends[1])}"
    text = (f"Timeline ({k + 1} of {count}): rows {rows[0] + 1:,}-{rows[1]:,} of {geo.n_rows:,}, {span}")
    return para(text)
