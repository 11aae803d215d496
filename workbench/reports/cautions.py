"""Assumptions and cautions: what the numbers in this pack rest on."""

from __future__ import annotations

from reportlab.platypus import Paragraph

from . import styles
from .context import PackContext
from .layout import Section
from .text import para


def _simulation_text(ctx: PackContext) -> str:
    sim, s = ctx.simulation, ctx.settings
    if sim is None:
        return "No simulation was run for this pack; only the single-path PERT figures are shown."
    risks = len(ctx.plan.risks)
    groups = len(ctx.plan.correlations)
    return (f"The simulation drew {sim.iterations:,} sets of durations (seed {sim.seed}) from the "
            f"'{s.distribution}' distribution unless an activity names its own, on each activity's "
            f"three-point estimate; fixed durations do not vary. {groups} correlation group(s) make "
            f"listed durations move together; all other durations are drawn independently. "
            f"{risks} risk event(s) add delays with their stated probabilities. Percentiles carry "
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
    return story
