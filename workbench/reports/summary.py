"""The one-page summary: dates, the odds of meeting the deadline, the critical path and
the activities that drive the risk."""

from __future__ import annotations

from reportlab.platypus import Paragraph, Spacer, Table, TableStyle

from workbench.figures.odds import format_probability, merge_bias_note

from . import styles
from .context import PackContext
from .drivers_data import top_drivers
from .layout import Section
from .path_pages import is_long, short_path

from .text import elide, format_date, format_duration, format_number, format_percent, para

CONFIDENCES = (0.5, 0.8, 0.9)
PATH_NAMES_SHOWN = 20
DRIVERS_SHOWN = 5


def summary(ctx: PackContext, width: float) -> list:
    return [Section("Summary", "summary"), Paragraph("Summary", styles.H1),
            key_figures(ctx, width), Spacer(1, 4), *reading(ctx), *critical_path(ctx, width),
            *drivers(ctx, width)]


def reading(ctx: PackContext) -> list:
    """One line on why PERT and the simulation differ (the Odds view's wording)."""
    note = merge_bias_note(ctx.analysis.pert, ctx.simulation, ctx.unit) if ctx.simulation else ""
    return [Paragraph(para(note), styles.SMALL)] if note else []


def deadline_text(ctx: PackContext) -> str:
    dl = ctx.deadline()
    if dl is None:
        return "not set"
    return format_date(ctx.date_of(dl))


def pert_probability(ctx: PackContext) -> str:
    p = ctx.analysis.probability_by_deadline()
    return "no deadline set" if p is None else format_probability(p)


def simulated_probability(ctx: PackContext) -> str:
    sim, dl = ctx.simulation, ctx.deadline()
    if sim is None:
        return "not simulated"
    if dl is None:
        return "no deadline set"
    p, err = sim.prob_by(dl)
    return f"{format_probability(p)} (\u00b1 {format_number(err * 100)} points)"


def _rows(ctx: PackContext) -> list[tuple[str, str, str]]:
    a, sim = ctx.analysis, ctx.simulation
    dur = f"{format_duration(a.schedule.finish, ctx.unit)} from the start"
    rows = [("Start", format_date(a.start_date), ""),
            ("Finish on PERT means", f"{format_date(a.finish_date)} ({dur})", ""),
            ("Deadline", deadline_text(ctx), ""),
            ("", "PERT (one path)", f"Simulation ({sim.iterations:,} runs)" if sim else "Simulation"),
            ("P(finish by deadline)", pert_probability(ctx), simulated_probability(ctx))]
    for p in CONFIDENCES:
        pert = format_date(a.date_at(p))
        simulated = format_date(ctx.date_of(sim.percentile(p * 100))) if sim else "-"
        rows.append((f"Finish date at {format_percent(p).replace('.0 ', ' ')}", pert, simulated))
    return rows


def key_figures(ctx: PackContext, width: float) -> Table:
    data = [[Paragraph(para(c), styles.BODY) for c in row] for row in _rows(ctx)]
    table = Table(data, colWidths=[width * 0.3, width * 0.35, width * 0.35], hAlign="LEFT")
    table.setStyle(TableStyle([("SPAN", (1, 0), (2, 0)), ("SPAN", (1, 1), (2, 1)), ("SPAN", (1, 2), (2, 2)),
                               ("LINEBELOW", (0, 0), (-1, -1), 0.3, styles.GRID),
                               ("LINEBELOW", (0, 3), (-1, 3), 0.8, styles.TEXT),
                               ("BACKGROUND", (0, 4), (-1, 4), styles.LIGHT_ROW),
                               ("TEXTCOLOR", (0, 0), (0, -1), styles.MUTED),
                               ("VALIGN", (0, 0), (-1, -1), "MIDDLE")]))
    return table


def critical_path(ctx: PackContext, width: float) -> list:
    pert = ctx.analysis.pert
    ids = list(pert.path)
    story = [Paragraph("Critical path", styles.H2),
             Paragraph("<b>" + para(short_path(ids)) + "</b>", styles.BODY)]
    if is_long(ctx):
        story.append(Paragraph("The whole path is listed in order under 'Critical path in full', at the "
                               "end of this pack.", styles.SMALL))
    if pert.note:
        story.append(Paragraph(para(pert.note), styles.SMALL))
    shown = ids[:PATH_NAMES_SHOWN]
    data = [[Paragraph(para(i), styles.CELL_BOLD), Paragraph(para(ctx.name_of(i)), styles.CELL)] for i in shown]
    if data:
        table = Table(data, colWidths=[70, width - 70], hAlign="LEFT")
        table.setStyle(TableStyle([("LINEBELOW", (0, 0), (-1, -1), 0.25, styles.GRID),
                                   ("TOPPADDING", (0, 0), (-1, -1), 1), ("BOTTOMPADDING", (0, 0), (-1, -1), 1)]))
        story.append(table)
    if len(ids) > len(shown):
        story.append(Paragraph(f"... and {len(ids) - len(shown):,} more: see the activity table.", styles.SMALL))
    return story


def drivers(ctx: PackContext, width: float) -> list:
    story = [Paragraph("Top risk drivers", styles.H2)]
    sim = ctx.simulation
    if sim is None:
        return story + [Paragraph("No simulation was run, so no drivers are ranked.", styles.BODY)]
    head = ["Activity", "Name", "Criticality", "Sensitivity"]
    rows = [[Paragraph(f"<b>{h}</b>", styles.CELL) for h in head]]
    shown = top_drivers(ctx, DRIVERS_SHOWN)
    for d in shown:
        rows.append([Paragraph(para(d.id), styles.CELL_BOLD), Paragraph(para(ctx.name_of(d.id)), styles.CELL),
                     Paragraph(format_percent(d.criticality), styles.CELL),
                     Paragraph(f"{d.sensitivity + 0.0:+.2f}", styles.CELL)])   # as the Drivers page
    table = Table(rows, colWidths=[70, width - 230, 80, 80], hAlign="LEFT")
    table.setStyle(TableStyle([("LINEBELOW", (0, 0), (-1, -1), 0.25, styles.GRID)]))
    note = ("Criticality: share of simulation runs in which the activity was on the critical path. "
            "Sensitivity: rank correlation between the activity's duration and the project finish."
            + _through_others(ctx, shown))
    return story + [table, Spacer(1, 4), Paragraph(para(note), styles.SMALL)]


def _through_others(ctx: PackContext, shown) -> str:
    """Why a rarely critical activity can still correlate with the finish: its duration
    moves with others' (a correlation group), and those drive the finish."""
    notes = []
    for d in shown:
        if d.criticality >= 0.05 or abs(d.sensitivity) < 0.1:
            continue
        for group in ctx.plan.correlations:
            if d.id in group.activities:
                notes.append(f"{d.id} is rarely critical but its duration moves with {_others(group, d.id)} "
                             f"('{elide(group.name, 80)}'), so it correlates with the finish through them.")
                break
    return (" " + " ".join(notes)) if notes else ""


def _others(group, act_id: str, most: int = 8) -> str:
    others = [a for a in group.activities if a != act_id]
    if len(others) <= most:
        return ", ".join(others)
    return ", ".join(others[:most]) + f" and {len(others) - most:,} others"
