"""The Resources pages of the approval pack (plans with resources only): each resource's
loading on the logic-only dates and on the levelled dates against its availability, what
levelling moves and what holds it, and the odds with and without the crews."""

from __future__ import annotations

from reportlab.platypus import Paragraph, Spacer, Table, TableStyle

from workbench.core.formatting import format_date, format_duration
from workbench.core.levelling import level
from workbench.core.loading import plan_loading
from workbench.figures import style
from workbench.figures.loading import loading_figure
from workbench.figures.ticks import date_ticks

from . import styles
from .chart_flowable import ChartFlowable
from .layout import LANDSCAPE, Section, new_page
from .tables import fit

PER_PAGE = 4            # loading charts per page
MOVED_ROWS = 18
_GRID = TableStyle([("FONT", (0, 0), (-1, -1), styles.FONT, 8.5), ("FONT", (0, 0), (-1, 0), styles.BOLD, 8.5),
                    ("LINEBELOW", (0, 0), (-1, 0), 0.8, styles.TEXT),
                    ("ROWBACKGROUNDS", (0, 1), (-1, -1), [None, styles.LIGHT_ROW]), ("VALIGN", (0, 0), (-1, -1), "TOP")])


def resource_pages(ctx, frame: tuple[float, float]) -> list:
    plan = ctx.plan
    if not plan.resources:
        return []
    width, height = frame
    result = level(plan, analysis=ctx.analysis)
    early = plan_loading(ctx.analysis)
    levelled = plan_loading(ctx.analysis, result.starts)
    story = new_page(LANDSCAPE) + [Section("Resources", "resources"),
                                   Paragraph("Resources: who is needed when", styles.H1),
                                   Paragraph(summary_text(ctx, result), styles.BODY)]
    chart_h = (height - 90) / 2
    for k in range(0, len(early), PER_PAGE):
        if k:
            story += new_page(LANDSCAPE)
        pairs = list(zip(early[k:k + PER_PAGE], levelled[k:k + PER_PAGE]))
        story.append(ChartFlowable(width, chart_h * ((len(pairs) + 1) // 2),
                                   lambda c, w, h, pairs=pairs: paint_grid(c, w, h, pairs, result.finish,
                                                                            ctx.analysis.calendar)))
    story += new_page(LANDSCAPE) + _moved_table(ctx, result, width) + _odds(ctx, width)
    return story


def summary_text(ctx, result) -> str:
    cal = ctx.analysis.calendar
    if result.delay <= 1e-9 and not result.moves:
        head = "Every resource has enough units for the logic-only schedule: levelling moves nothing."
    elif result.delay <= 1e-9:
        head = (f"Levelling moves {len(result.moves)} activit{'y' if len(result.moves) == 1 else 'ies'} within "
                f"their float; the finish stays {format_date(cal.finish_date(result.finish))}.")
    else:
        head = (f"On the logic-only dates some resources are asked for more units than exist. Levelled "
                f"(latest finish first, then justified), the plan finishes {format_date(cal.finish_date(result.finish))}, "
                f"{format_duration(result.delay, ctx.unit)} later than logic alone "
                f"({format_date(cal.finish_date(result.logic_finish))}); {len(result.moves)} activities move.")
    return head + (" Filled: units in use on the logic-only dates (over-allocation hatched); black line: in use on "
                   "the levelled dates; dashed: units available.")


def paint_grid(c, w, h, pairs, finish, calendar) -> None:
    cols, rows = 2, (len(pairs) + 1) // 2
    cw, ch = (w - 20) / cols, h / rows
    for i, (early, lev) in enumerate(pairs):
        x, y = (i % cols) * (cw + 20), h - (i // cols + 1) * ch
        c.saveState()
        c.translate(x, y)
        _paint_one(c, cw, ch - 12, early, lev, finish, calendar)
        c.restoreState()


def _paint_one(c, w, h, early, lev, finish, calendar) -> None:
    fig, lfig = loading_figure(early, until=finish), loading_figure(lev, until=finish)
    top = max(fig.top, lfig.top)
    x0, x1 = float(fig.edges[0]), max(float(fig.edges[-1]), float(lfig.edges[-1]))
    left, bottom, pw, ph = 34, 16, w - 40, h - 44
    px = lambda v: left + (v - x0) / max(x1 - x0, 1e-9) * pw
    py = lambda u: bottom + u / top * ph
    c.setFillColor(styles.TEXT)
    title, size = chart_title(c, fig.title, w)
    c.setFont(styles.BOLD, size)
    c.drawString(0, h - 10, title)
    c.setFont(styles.FONT, 8.5)
    c.drawString(0, h - 21, fit(f"On the levelled dates: at most {lfig.peak:g} in use", w, styles.FONT, 8.5))
    c.setFillColor(styles.colour(style.WORK))
    c.setStrokeColor(styles.colour(style.WORK_EDGE))
    for a, b, u in zip(fig.edges[:-1], fig.edges[1:], fig.use):
        if u > 0:
            c.rect(px(a), py(0), px(b) - px(a), py(u) - py(0), stroke=0, fill=1)
    _hatch_over(c, fig, px, py)
    _steps(c, lfig.edges, lfig.use, px, py, styles.colour(style.TEXT), 1.6, None)
    _steps(c, fig.edges, fig.available, px, py, styles.colour(style.TEXT), 1.0, (4, 3))
    c.setStrokeColor(styles.colour(style.TEXT))
    c.setLineWidth(0.6)
    c.line(left, bottom, left + pw, bottom)
    c.line(left, bottom, left, bottom + ph)
    c.setFont(styles.FONT, 7.5)
    c.setFillColor(styles.TEXT)
    for u in (0, top / 2, top):
        c.drawRightString(left - 3, py(u) - 2.5, f"{u:g}")
    for offset, label in date_ticks(calendar, x0, x1, max(2, int(pw // 70))):
        c.line(px(offset), bottom, px(offset), bottom - 3)
        c.drawCentredString(px(offset), bottom - 11, label)


def chart_title(c, title: str, width: float) -> tuple[str, float]:
    """The chart's title as it fits: whole; else without its bracketed detail ("(5 in use,
    4 available)"); else a size smaller; else cut with an ellipsis."""
    short = title.split(" (")[0]
    for text, size in ((title, 10), (short, 10), (short, 9)):
        if c.stringWidth(text, styles.BOLD, size) <= width:
            return text, size
    return fit(short, width, styles.BOLD, 9), 9


def _hatch_over(c, fig, px, py) -> None:
    """Over-allocated spans: the part above the availability, vermillion with black hatching
    (reads in grayscale)."""
    for a, b, u, avail in zip(fig.edges[:-1], fig.edges[1:], fig.use, fig.available):
        if u > avail + 1e-9:
            x, y, w, h = px(a), py(avail), px(b) - px(a), py(u) - py(avail)
            c.saveState()
            c.setFillColor(styles.colour(style.CRITICAL))
            c.rect(x, y, w, h, stroke=0, fill=1)
            clip = c.beginPath()
            clip.rect(x, y, w, h)
            c.clipPath(clip, stroke=0, fill=0)
            c.setStrokeColor(styles.colour(style.TEXT))
            c.setLineWidth(0.5)
            for k in range(int((w + h) // 4) + 1):          # 45° hatching, 4 pt apart
                c.line(x - h + 4 * k, y, x + 4 * k, y + h)
            c.restoreState()


def _steps(c, edges, values, px, py, colour, width, dash) -> None:
    c.saveState()
    c.setStrokeColor(colour)
    c.setLineWidth(width)
    if dash:
        c.setDash(*dash)
    path = c.beginPath()
    path.moveTo(px(edges[0]), py(values[0]))
    for a, b, v in zip(edges[:-1], edges[1:], values):
        path.lineTo(px(a), py(v))
        path.lineTo(px(b), py(v))
    c.drawPath(path, stroke=1, fill=0)
    c.restoreState()


def _moved_table(ctx, result, width) -> list:
    cal = ctx.analysis.calendar
    story = [Paragraph("What levelling moves, and what holds it", styles.H2)]
    if not result.moves:
        return story + [Paragraph("Nothing moves.", styles.BODY)]
    rows = [["Activity", "Logic-only start", "Levelled start", "Held by"]]
    for m in result.moves[:MOVED_ROWS]:
        rows.append([fit(f"{m.id}  {ctx.name_of(m.id)}", width * 0.45, styles.FONT, 8.5),
                     format_date(cal.start_date(m.logic_start)), format_date(cal.start_date(m.start)),
                     _held_by(ctx.plan, m.held_by)])
    table = Table(rows, colWidths=[width * 0.46, width * 0.16, width * 0.16, width * 0.2], repeatRows=1)
    table.setStyle(_GRID)
    more = len(result.moves) - MOVED_ROWS
    tail = [Paragraph(f"… and {more} more.", styles.BODY)] if more > 0 else []
    return story + [table] + tail + [Spacer(1, 10)]


def _held_by(plan, held_by: str) -> str:
    """A resource by its name, as the charts above call it ("Electricians", not "elec");
    "after X" as it is."""
    names = {r.id: r.name for r in plan.resources if r.name}
    return names.get(held_by, held_by)


def crews_odds(ctx):
    """The pack's odds with and without the crews (None without resources or a simulation):
    the logic-only run is the pack's own (the Odds pages' figures); the crews' run draws the
    same durations (same seed, same iterations). Worked out once per pack: the cover quotes it."""
    sim = ctx.simulation
    if sim is None or not ctx.plan.resources:
        return None
    if getattr(ctx, "_crews_odds", None) is None:
        from workbench.core.montecarlo import simulate
        from workbench.core.resource_odds import ResourceOdds
        ctx._crews_odds = ResourceOdds(sim, simulate(ctx.plan, sim.iterations, sim.seed, resources=True))
    return ctx._crews_odds


def _odds(ctx, width) -> list:
    both = crews_odds(ctx)
    if both is None:
        return []
    sim = ctx.simulation
    conf = float(ctx.settings.target_confidence)
    rows = [["", "Logic only", "With the crews"]] + [list(r) for r in both.rows(conf)]
    table = Table(rows, colWidths=[width * 0.3, width * 0.25, width * 0.25])
    table.setStyle(_GRID)
    return [Paragraph("The odds with and without the crews", styles.H2),
            Paragraph(f"{sim.iterations:,} iterations each with seed {sim.seed} (the same sampled durations); "
                      "with the crews, every iteration is scheduled in the levelled order.", styles.BODY),
            table, Spacer(1, 6), Paragraph(both.sentence(conf), styles.BODY),
            Paragraph("Caution: estimates are judgement; PERT assumes one path and independent durations, and these "
                      "odds assume the crews are worked in the levelled order. Decisions rest with your organisation's "
                      "own approval rules.", styles.SMALL)]
