"""The pack's "Since the approved baseline" pages: the finish then and now, the odds then
and now, the odds trend chart, the activities that slipped most, and what was added,
removed or re-estimated. Shown when the plan has an approved baseline or an odds trend."""

from __future__ import annotations

from reportlab.platypus import Paragraph, Spacer, Table, TableStyle

from workbench.core.baseline import approved, pert_figures, simulation_figures
from workbench.core.variance import variance_against
from workbench.figures import odds_trend as ot

from . import styles
from .chart_flowable import ChartFlowable
from .layout import LANDSCAPE, Section, new_page
from .text import format_date, format_number, para
from .trend_paint import TrendPainter
from workbench.core.formatting import format_whole_percent

SIDE_W = 250.0
SLIPPED_SHOWN = 10
CHANGES_SHOWN = 12


def baseline_pages(ctx, frame: tuple[float, float]) -> list:
    base, points = approved(ctx.plan.baselines), ctx.plan.odds_trend
    if base is None and not points:
        return []
    width, height = frame
    chart_w, chart_h = width - SIDE_W - 12, height - 60
    fig = ot.trend_figure(points, ctx.settings.target_confidence, base)
    title = f"Since the approved baseline: {base.name}" if base else "The odds trend"
    side = _then_and_now(ctx, base) if base else [Paragraph("No approved baseline yet.", styles.SMALL)]
    page = [Section("Since the approved baseline", "baseline"), Paragraph(para(title), styles.H1),
            Paragraph(para(ot.headline(points, base)), styles.BODY),
            _side_by_side(ChartFlowable(chart_w, chart_h - 20, TrendPainter(fig).paint), side, chart_w)]
    out = new_page(LANDSCAPE) + page
    if base is not None:
        out += new_page(LANDSCAPE) + _what_changed(ctx, base, width)
    return out


def _side_by_side(chart, side: list, chart_w: float) -> Table:
    table = Table([[chart, side]], colWidths=[chart_w + 12, SIDE_W], hAlign="LEFT")
    table.setStyle(TableStyle([("VALIGN", (0, 0), (-1, -1), "TOP")] +
                              [(k, (0, 0), (-1, -1), 0) for k in ("LEFTPADDING", "RIGHTPADDING", "TOPPADDING",
                                                                  "BOTTOMPADDING")]))
    return table


def _cells(rows, widths, header: bool = True) -> Table:
    data = [[Paragraph(para(c), styles.CELL_BOLD if header and r == 0 else styles.CELL) for c in row]
            for r, row in enumerate(rows)]
    table = Table(data, colWidths=widths, hAlign="LEFT", repeatRows=1 if header else 0)
    table.setStyle(TableStyle([("LINEBELOW", (0, 0), (-1, -1), 0.3, styles.GRID),
                               ("LINEBELOW", (0, 0), (-1, 0), 0.8, styles.TEXT), ("VALIGN", (0, 0), (-1, -1), "TOP")]))
    return table


def _chance(p) -> str:
    return "no deadline" if p is None else f"{format_whole_percent(p)}"


def _moved(value: float, unit: str) -> str:
    if abs(value) < 1e-9:
        return "unchanged"
    return f"{format_number(abs(value))} {unit} {'later' if value > 0 else 'earlier'}"


def _then_and_now(ctx, base) -> list:
    a, sim = ctx.analysis, ctx.simulation
    v = variance_against(a, base)
    pert_now = pert_figures(a)
    sim_now = simulation_figures(sim) if sim is not None else None
    then_sim = base.simulation
    rows = [("", "Approved", "Now"),
            ("Recorded / status", format_date(base.recorded), format_date(ctx.settings.status_date) if
             ctx.settings.status_date else "no status date"),
            ("Finish", format_date(base.finish), format_date(a.finish_date)),
            ("Finish moved", "", _moved(v.finish_variance, ctx.unit)),
            ("Chance (PERT)", _chance(base.pert.probability if base.pert else None), _chance(pert_now.probability)),
            ("Chance (simulation)", _chance(then_sim.probability) if then_sim else "not simulated",
             _chance(sim_now.probability) if sim_now else "not simulated"),
            ("P80", format_date((then_sim or base.pert).p80) if (then_sim or base.pert) else "",
             format_date((sim_now or pert_now).p80))]
    story = [Paragraph("Then and now", styles.H2), _cells(rows, [78, (SIDE_W - 78) / 2, (SIDE_W - 78) / 2])]
    story += [Spacer(1, 6), Paragraph(para(f"Baseline plan hash {base.plan_hash}; this pack's hash is in the footer."),
                                      styles.SMALL)]
    return story


def _what_changed(ctx, base, width: float) -> list:
    v = variance_against(ctx.analysis, base)
    names = {a.id: a.name for a in ctx.plan.activities}
    story = [Paragraph(para(f"What changed since '{base.name}'"), styles.H1),
             Paragraph("Activities that slipped most (finish later than approved)", styles.H2)]
    slipped = v.slipped(SLIPPED_SHOWN)
    rows = [("Activity", "Name", "Approved finish", "Forecast finish", f"Slip ({ctx.unit})")]
    finishes = ctx.analysis.dates()["early_finish"]
    for act_id, slip in slipped:
        i = v.ids.index(act_id)
        rows.append((act_id, names.get(act_id, ""), format_date(v.baseline_finish[i]),
                     format_date(finishes[i].astype("datetime64[D]").item()), format_number(slip)))
    if not slipped:
        rows.append(("", "No activity finishes later than approved.", "", "", ""))
    story += [_cells(rows, [70, width - 70 - 3 * 95, 95, 95, 95]), Spacer(1, 10)]
    story += _changes(v, width, ctx.unit)
    return story


def _estimate(est) -> str:
    a, m, b, d = est
    return f"{format_number(a)} / {format_number(m)} / {format_number(b)}" if a is not None else \
        ("none" if d is None else format_number(d))


def _changes(v, width: float, unit: str) -> list:
    story = [Paragraph("Added, removed and re-estimated", styles.H2)]
    rows = [("Change", "Activity", "Detail")]
    rows += [("added", x, "") for x in v.added[:CHANGES_SHOWN]]
    rows += [("removed", x, "") for x in v.removed[:CHANGES_SHOWN]]
    rows += [("re-estimated", x, f"{_estimate(old)} \u2192 {_estimate(new)} {unit}")
             for x, old, new in v.re_estimated[:CHANGES_SHOWN]]
    links = len(v.links_added) + len(v.links_removed)
    if links:
        rows.append(("links", "", f"{len(v.links_added)} added, {len(v.links_removed)} removed"))
    if len(rows) == 1:
        rows.append(("none", "", "The activities, estimates and links are as approved."))
    return story + [_cells(rows, [90, 90, width - 180])]
