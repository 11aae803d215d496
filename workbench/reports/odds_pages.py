"""The Odds pages: the finish-time curve with the shaded answer to "by the deadline?",
PERT and simulation one above the other on one date axis; then the S-curve with the
percentile table. Geometry from ``workbench.figures.odds``, shared with the Odds view."""

from __future__ import annotations

from reportlab.platypus import Paragraph, Spacer, Table, TableStyle

from workbench.figures import odds as og

from . import styles
from .chart_flowable import ChartFlowable
from .layout import LANDSCAPE, Section, new_page
from .odds_paint import OddsPainter, SCurvePainter
from .path_pages import short_path
from .text import format_date, format_duration, para

SIDE_W = 250.0
HEADING_SPACE = 36.0
SIDE_PATH_MOST = 12       # ids of the PERT path printed in the narrow side panel


def question(ctx) -> og.Question:
    """By the deadline, or, without one, by the PERT date at the plan's target confidence."""
    dl = ctx.deadline()
    if dl is None:
        dl = og.day_end(ctx.analysis.calendar, og.pert_offset_at(ctx.analysis.pert, ctx.settings.target_confidence))
    return og.Question("by", float(dl))


def odds_pages(ctx, frame: tuple[float, float]) -> list:
    width, height = frame
    chart_w, chart_h = width - SIDE_W - 12, height - HEADING_SPACE
    q = question(ctx)
    date = format_date(ctx.date_of(q.d1))
    heading = f"Odds: finishing by {'the deadline, ' if ctx.deadline() is not None else ''}{date}"
    if ctx.analysis.progress is not None:
        heading += f", from the status date {format_date(ctx.analysis.progress.status_date)}"
    page = [Section("Odds", "odds"), Paragraph(para(heading), styles.H1),
            _side_by_side(ChartFlowable(chart_w, chart_h, OddsPainter(ctx, q).paint), _comparison(ctx, q), chart_w)]
    curve = [Section("S-curve", "scurve"), Paragraph("Odds: chance of finishing by each date (S-curve)", styles.H1),
             _side_by_side(ChartFlowable(chart_w, chart_h, SCurvePainter(ctx, q).paint), _percentiles(ctx), chart_w)]
    return new_page(LANDSCAPE) + page + new_page(LANDSCAPE) + curve


def _side_by_side(chart, side: list, chart_w: float) -> Table:
    table = Table([[chart, side]], colWidths=[chart_w + 12, SIDE_W], hAlign="LEFT")
    table.setStyle(TableStyle([("VALIGN", (0, 0), (-1, -1), "TOP"), ("LEFTPADDING", (0, 0), (-1, -1), 0),
                               ("RIGHTPADDING", (0, 0), (-1, -1), 0), ("TOPPADDING", (0, 0), (-1, -1), 0),
                               ("BOTTOMPADDING", (0, 0), (-1, -1), 0)]))
    return table


def _cell_table(rows, widths, header: bool = True) -> Table:
    data = [[Paragraph(para(c), styles.CELL_BOLD if header and r == 0 else styles.CELL) for c in row]
            for r, row in enumerate(rows)]
    table = Table(data, colWidths=widths, hAlign="LEFT")
    table.setStyle(TableStyle([("LINEBELOW", (0, 0), (-1, -1), 0.3, styles.GRID),
                               ("LINEBELOW", (0, 0), (-1, 0), 0.8, styles.TEXT), ("VALIGN", (0, 0), (-1, -1), "TOP")]))
    return table


def _value(ctx, value: float, kind: str) -> str:
    if kind == "probability":
        return og.format_probability(value)
    return format_date(ctx.date_of(value))


def _comparison(ctx, q: og.Question) -> list:
    pert, sim = ctx.analysis.pert, ctx.simulation
    story = [Paragraph("PERT and simulation", styles.H2)]
    if sim is None:
        rows = [("", "PERT"), ("P(finish by)", og.format_probability(og.pert_probability(pert, q)))]
        rows += [(f"P{int(p * 100)}", _value(ctx, og.pert_offset_at(pert, p), "offset")) for p in (0.5, 0.8, 0.9)]
        return story + [_cell_table(rows, [70, SIDE_W - 70]), Spacer(1, 6),
                        Paragraph("No simulation was run for this pack.", styles.SMALL)]
    rows = [("", "PERT", "Simulation")]
    rows += [(r.label, _value(ctx, r.pert, r.kind), _value(ctx, r.sim, r.kind)) for r in og.comparison_rows(pert, sim, q)]
    note = og.merge_bias_note(pert, sim, ctx.unit)
    told = [Paragraph(para(note), styles.SMALL), Spacer(1, 6)] if note else []
    return story + [_cell_table(rows, [66, (SIDE_W - 66) / 2, (SIDE_W - 66) / 2]), Spacer(1, 6),
                    *told, *_readout(ctx)]


def _readout(ctx) -> list:
    pert = ctx.analysis.pert
    text = (f"PERT follows one path: {short_path(pert.path, SIDE_PATH_MOST)}; mean finish {format_date(ctx.date_of(pert.mean))}, "
            f"standard deviation {format_duration(pert.sd, ctx.unit)}.")
    story = [Paragraph(para(text), styles.SMALL)]
    if pert.note:
        story.append(Paragraph(para(pert.note), styles.SMALL))
    return story + [Spacer(1, 6), Paragraph(para(og.CAUTION), styles.SMALL)]


def percentile_rows(ctx) -> list[tuple[str, str, str]]:
    """Percentile, simulated finish date, and the PERT finish date for comparison."""
    sim, pert = ctx.simulation, ctx.analysis.pert
    rows = [("Confidence", "Simulation", "PERT")]
    for p in (5, 10, 20, 30, 40, 50, 60, 70, 80, 90, 95):
        simulated = _value(ctx, sim.percentile(p), "offset") if sim is not None else "-"
        rows.append((f"P{p}", simulated, _value(ctx, og.pert_offset_at(pert, p / 100), "offset")))
    return rows


def _percentiles(ctx) -> list:
    intro = ("Finish dates reached with each confidence. "
             "P80 means: in 80 % of the simulated runs the project finished by that date.")
    return [Paragraph("Percentiles", styles.H2), Paragraph(para(intro), styles.SMALL), Spacer(1, 4),
            _cell_table(percentile_rows(ctx), [58, (SIDE_W - 58) / 2, (SIDE_W - 58) / 2])]
