"""Assumptions and cautions: what the numbers in this pack rest on."""

from __future__ import annotations

from reportlab.platypus import Paragraph, Spacer, Table, TableStyle

from . import styles
from .context import PackContext
from .layout import Section
from .tables import cell, fit
from .text import para

RISK_HEAD = ("Risk event", "Chance", "Delay if it happens\n(a / m / b)", "On activities", "Happened\nin runs",
             "Finish later\nwhen it did")
RISK_SHARES = (0.37, 0.08, 0.16, 0.13, 0.1, 0.16)


def _count(n: int, thing: str) -> str:
    return f"{n} {thing}" + ("" if n == 1 else "s")


def _simulation_text(ctx: PackContext) -> str:
    sim, s = ctx.simulation, ctx.settings
    if sim is None:
        return "No simulation was run for this pack; only the single-path PERT figures are shown."
    risks = len(ctx.plan.risks)
    groups = len(ctx.plan.correlations)
    together = ("No correlation groups are set: every duration is drawn independently." if not groups else
                f"{_count(groups, 'correlation group')} {'makes' if groups == 1 else 'make'} the listed "
                "durations move together; all other durations are drawn independently.")
    struck = ("No risk events are set." if not risks else
              f"{_count(risks, 'risk event')} {'adds' if risks == 1 else 'add'} delays with "
              f"{'its' if risks == 1 else 'their'} stated chances (listed below).")
    return (f"The simulation drew {sim.iterations:,} sets of durations (seed {sim.seed}) from the "
            f"'{s.distribution}' distribution unless an activity names its own, on each activity's "
            f"three-point estimate; fixed durations do not vary. {together} {struck} Percentiles carry "
            f"sampling error; a different seed gives slightly different figures."
            + (f" The correlations as entered cannot all hold at once, so the nearest consistent set was "
               f"used: {sim.correlation_note}" if getattr(sim, "correlation_repaired", False) else ""))


def cautions(ctx: PackContext, width: float) -> list:
    items = [
        "Every duration in this plan is a judgement by the people who estimated it, not a "
        "measurement. The figures are only as good as those estimates.",
        "The PERT figures assume that one path (the critical path on expected durations) decides "
        "the finish and that activity durations are independent. Where other paths come close and "
        "merge, the real finish tends to be later: PERT is then optimistic.",
        _simulation_text(ctx),
        "Dates follow the plan's working calendar (working weekdays and the holidays stored in the "
        "plan file).",
        "This pack informs a decision; it does not make one. Commitments and approvals rest with the "
        "organisation's own approval rules and the people who sign the cover page.",
    ]
    story = [Section("Assumptions and cautions", "cautions"),
             Paragraph("Assumptions and cautions", styles.H1)]
    story += [Paragraph(para(t), styles.BULLET, bulletText="\u2022") for t in items]
    return story + risk_table(ctx, width)


def risk_table(ctx: PackContext, width: float) -> list:
    """The plan's risk events: what each adds, and (with a simulation) how often it struck
    and how much later the finish was in the runs where it did."""
    risks = list(ctx.plan.risks)
    if not risks:
        return []
    report = {r["id"]: r for r in (getattr(ctx.simulation, "risk_report", None) or [])}
    widths = [width * share for share in RISK_SHARES]
    unit = ctx.unit
    rows = [list(RISK_HEAD)]
    for risk in risks:
        seen = report.get(risk.id, {})
        fired, impact = seen.get("fired"), seen.get("finish_impact")
        rows.append([cell(fit(f"{risk.id} {risk.name}".strip(), widths[0] - 4)), f"{risk.probability * 100:.0f} %",
                     f"{risk.optimistic:g} / {risk.most_likely:g} / {risk.pessimistic:g} {unit}",
                     fit(", ".join(risk.activities), widths[3] - 4),
                     "—" if fired is None else f"{fired * 100:.1f} %",
                     "—" if impact is None else f"{impact:+.1f} {unit}"])
    table = Table(rows, colWidths=widths, repeatRows=1)
    table.setStyle(TableStyle([
        ("FONT", (0, 0), (-1, -1), styles.FONT, 8), ("FONT", (0, 0), (-1, 0), styles.BOLD, 8),
        ("VALIGN", (0, 0), (-1, -1), "MIDDLE"), ("ALIGN", (1, 1), (-1, -1), "RIGHT"),
        ("ALIGN", (3, 1), (3, -1), "LEFT"), ("LINEBELOW", (0, 0), (-1, 0), 0.8, styles.TEXT),
        ("TOPPADDING", (0, 0), (-1, -1), 1.5), ("BOTTOMPADDING", (0, 0), (-1, -1), 1.5)]))
    intro = ("Risk events: each may happen with its chance in a run and then adds its delay to the "
             "listed activities. PERT leaves them out; the simulation includes them.")
    return [Spacer(1, 10), Paragraph("Risk events", styles.H2), Paragraph(para(intro), styles.SMALL),
            Spacer(1, 4), table]
