"""The Trade-off page of the approval pack (only for a plan with cost data): the cost curve
on the plan's dates, the confidence plans as extra cost against chance, the options in a
table, and the option the plan owner applied, if any. Geometry from ``figures.tradeoff``."""

from __future__ import annotations

from reportlab.lib import colors
from reportlab.platypus import Paragraph, Spacer, Table, TableStyle

from workbench.core.calendar import WorkCalendar
from workbench.core.crash_problem import has_cost_data
from workbench.core.errors import PlanError
from workbench.core.formatting import format_number, format_percent
from workbench.figures import tradeoff as ftr

from . import styles
from .axes import Axes
from .chart_flowable import ChartFlowable
from .layout import LANDSCAPE, Section, new_page
from workbench.core.formatting import format_whole_percent

TARGETS = (0.5, 0.8, 0.9)
ITERATIONS = 2000
CAUTION = ("Crash costs are estimates and quotes, not facts; chances come from a simulation on fresh scenarios "
           "(\u00b1 one standard error), and assume the crashed estimates hold. The decision rests with the "
           "organisation's own approval rules.")


def compute(ctx):
    """The trade-off for the pack (None without cost data, a deadline, or when it fails)."""
    from workbench.core.tradeoff import tradeoff

    if not has_cost_data(ctx.plan) or ctx.deadline() is None:
        return None
    seed = ctx.simulation.seed if ctx.simulation is not None else 1
    targets = sorted({*TARGETS, round(ctx.settings.target_confidence, 4)})
    try:
        return tradeoff(ctx.plan, targets=targets, iterations=ITERATIONS, seed=seed)
    except PlanError:
        return None


def tradeoff_pages(ctx, frame: tuple[float, float]) -> list:
    result = compute(ctx)
    if result is None:
        return []
    width, height = frame
    story = new_page(LANDSCAPE) + [Section("Trade-off", "tradeoff"),
                                   Paragraph("Trade-off: what it costs to buy time", styles.H1)]
    paint = lambda c, w, h: paint_tradeoff(c, w, h, result, WorkCalendar(ctx.settings))
    story += [ChartFlowable(width, height * 0.52, paint), Spacer(1, 6)]
    story += [options_table(result, width, ctx.unit), Spacer(1, 6)]
    story += applied(ctx) + [Paragraph(CAUTION, styles.SMALL)]
    return story


def paint_tradeoff(c, w: float, h: float, result, calendar) -> None:
    left = w * 0.58
    _curve(c, (0, 0, left - 30, h), ftr.curve_lines(result), calendar)
    _chances(c, (left + 30, 0, w - left - 30, h), ftr.chance_points(result))


def _title(c, x, y, text) -> None:
    c.setFont(styles.BOLD, 10)
    c.setFillColor(styles.TEXT)
    c.drawString(x, y, text)


def _curve(c, box, lines, calendar) -> None:
    x, y, w, h = box
    ys = list(lines.direct) + list(lines.indirect) + list(lines.total)
    hi_x = max(lines.durations[-1], lines.deadline or 0.0)
    ax = Axes(c, x + 48, y + 20, w - 48, h - 58, *ftr.span_with_margin([lines.durations[0], hi_x]),
              *ftr.span_with_margin(ys))
    _title(c, x, y + h - 10, "Cost of finishing by each date: direct, indirect and total")
    ax.value_axis(ftr.nice_ticks(ax.y_lo, ax.y_hi), fmt=ftr.money, grid=True)
    ax.date_axis(calendar, grid=False)
    ax.frame()
    for values, hexc, width, dash in ((lines.indirect, ftr.INDIRECT, 1.5, (3, 2)), (lines.direct, ftr.DIRECT, 2.0, None),
                                      (lines.total, ftr.TOTAL, 2.6, None)):
        c.saveState()
        if dash:
            c.setDash(*dash)
        ax.polyline(lines.durations, values, stroke=styles.colour(hexc), width=width)
        c.restoreState()
    if lines.deadline is not None:
        ax.vline(lines.deadline, styles.DEADLINE, 1.4, (4, 3), "deadline")
    ox, oy = lines.optimum
    c.setFillColor(styles.TEXT)
    c.circle(ax.px(ox), ax.py(oy), 3.5, stroke=0, fill=1)
    c.setFont(styles.BOLD, 8)
    c.drawString(ax.px(ox) + 5, ax.py(oy) + 5, f"optimum {calendar.finish_date(ox):%d %b %Y}")
    _legend(c, x, y + h - 26, [("total", ftr.TOTAL), ("direct", ftr.DIRECT), ("indirect (dashed)", ftr.INDIRECT)])


def _legend(c, x, y, items) -> None:
    """One row of line samples and labels."""
    c.setFont(styles.FONT, 8)
    for label, hexc in items:
        c.setStrokeColor(styles.colour(hexc))
        c.setLineWidth(2.4)
        c.line(x, y + 3, x + 16, y + 3)
        c.setFillColor(styles.TEXT)
        c.drawString(x + 20, y, label)
        x += 30 + c.stringWidth(label, styles.FONT, 8)


def _chances(c, box, points) -> None:
    x, y, w, h = box
    title = "Extra cost against the chance of the deadline"
    c.setFont(styles.BOLD, 10)
    _title(c, x, y + h - 10, title if c.stringWidth(title, styles.BOLD, 10) <= w else "Extra cost vs chance")
    if not points:
        return
    points = ftr.merged(points)
    ax = Axes(c, x + 44, y + 20, w - 50, h - 58, 0.0, 100.0, *ftr.cost_span([p.extra_cost for p in points]))
    ax.value_axis(ftr.nice_ticks(ax.y_lo, ax.y_hi), fmt=ftr.money, grid=True)
    c.setFont(styles.FONT, 8)
    for v in ftr.CHANCE_TICKS:
        c.drawCentredString(ax.px(v), ax.y - 12, f"{v} %")
    ax.frame()
    for p in points:
        px, py = ax.px(100 * p.chance), ax.py(p.extra_cost)
        half = ax.px(100 * p.standard_error) - ax.px(0)
        c.setStrokeColor(styles.TEXT)
        c.setLineWidth(0.8)
        c.line(px - half, py, px + half, py)
        c.setFillColor(styles.DEADLINE if p.textbook else styles.PROBABILITY)
        c.rect(px - 4, py - 4, 8, 8, stroke=1, fill=1) if p.textbook else c.circle(px, py, 4.5, stroke=1, fill=1)
        c.setFillColor(styles.TEXT)
        c.setFont(styles.FONT, 8)
        _point_label(c, ax, p, px, py, x + w)


def _point_label(c, ax, p, px: float, py: float, right: float) -> None:
    """Confidence plans labelled above-right (above-left near the right edge); the textbook
    plan, at or near zero extra cost, beside its marker on the left when there is room
    (the plans it is compared with lie to its right), else below-right."""
    width = c.stringWidth(p.short_label, styles.FONT, 8)
    if p.textbook:
        if px - 8 - width > ax.x:
            c.drawRightString(px - 8, py - 3, p.short_label)
        else:
            c.drawString(px + 7, py - 11, p.short_label)
    elif px + 7 + width > right:
        c.drawRightString(px - 7, py + 6, p.label)
    else:
        c.drawString(px + 7, py + 4, p.label)


def _chance(p: float, se: float) -> str:
    """``53.0 % ± 1.2 points``, as the window writes a simulated chance and its spread."""
    return f"{format_percent(p)} \u00b1 {format_number(se * 100)} points"


def options_table(result, width: float, unit: str) -> Table:
    rows = [["Option", "Extra cost", "Chance of the deadline", "Activities shortened (by " + unit + ")"]]
    for p in ftr.chance_points(result):
        days = result.to_deadline.point.days if p.textbook else next(c.days for c in result.confidence
                                                                   if f"{format_whole_percent(c.target)} plan" == p.label)
        crashed = ", ".join(f"{k} {v:.2f}" for k, v in result.crashed(days).items()) or "none"
        rows.append([Paragraph(p.label, styles.CELL), f"{p.extra_cost:,.0f}", _chance(p.chance, p.standard_error),
                     Paragraph(crashed, styles.CELL)])
    t = Table(rows, colWidths=[width * 0.2, width * 0.1, width * 0.15, width * 0.55])
    t.setStyle(TableStyle([("FONT", (0, 0), (-1, 0), styles.BOLD, 8), ("FONT", (0, 1), (-1, -1), styles.FONT, 8),
                           ("LINEBELOW", (0, 0), (-1, 0), 0.6, colors.black), ("VALIGN", (0, 0), (-1, -1), "TOP"),
                           ("ROWBACKGROUNDS", (0, 1), (-1, -1), [colors.white, styles.LIGHT_ROW])]))
    return t


def applied(ctx) -> list:
    b = ctx.settings.bought
    if b is None:
        return [Paragraph("No trade-off option has been applied to this plan.", styles.BODY)]
    odds = "" if b.chance is None else f", expected chance {_chance(b.chance, b.standard_error or 0)}"
    bought = ", ".join(f"{i} by {x:.2f}" for i, x in b.crashed)
    return [Paragraph(f"<b>Applied option: {b.label}</b> \u2014 {b.cost:,.0f} extra{odds}. Shortened: {bought}. "
                      "The estimates in this pack already include it.", styles.BODY)]
