"""The pack's Checkup page, after the summary: every check with its mark (a word and a
shape, so it reads in grayscale), the failing checks with their first offenders, and the
standard's name and edition."""

from __future__ import annotations

from reportlab.platypus import KeepTogether, Paragraph, Spacer, Table, TableStyle

from workbench.core.checkup import run_checkup
from workbench.core.checkup_limits import STANDARD_NAME, STANDARD_SOURCE

from . import styles
from .context import PackContext
from .layout import Section
from .text import para

WORDS = {"pass": "PASS", "fail": "FAIL", "n/a": "n/a"}
OFFENDERS_SHOWN = 5
SHARES = (0.09, 0.3, 0.37, 0.24)
GROUP_ROWS = {"missing_logic": "The published standard: DCMA 14-point schedule assessment",
              "false_certainty": "Slackline's own checks on the estimates and the odds (common practice)"}
ODDS_CAUTION = ("The odds checks compare estimates, which are judgement: PERT assumes one path and "
                "independent durations. The decision rests with the organisation's own approval rules.")


def checkup_pages(ctx: PackContext, width: float) -> list:
    checkup = run_checkup(ctx.plan, ctx.analysis, ctx.simulation)
    intro = (f"Graded against the {STANDARD_NAME} ({STANDARD_SOURCE}) and Slackline's own checks "
             f"on the estimates and the odds (common practice). {checkup.summary_text()}; {_not_graded(checkup)}.")
    story = [Section("Checkup", "checkup"), Paragraph("Checkup", styles.H1),
             Paragraph(para(intro), styles.BODY), checks_table(checkup, width)]
    if any(c.changed for c in checkup):
        story.append(Paragraph("* this plan's own threshold, not the standard's.", styles.SMALL))
    story += failing(ctx, checkup, width)
    story += [Spacer(1, 6), Paragraph(para(ODDS_CAUTION), styles.SMALL)]
    return story


def _not_graded(checkup) -> str:
    """The checks without a verdict: informational ones (the standard sets no threshold: they
    apply, they are just not graded) apart from those this plan cannot be measured on yet."""
    info = [c.name for c in checkup if c.status == "n/a" and c.threshold == "informational" and c.value is not None]
    missing = checkup.count("n/a") - len(info)
    text = f"{missing} do not apply to this plan yet" if missing else ""
    if info:
        text += ("; " if text else "") + f"{' and '.join(info)} {'is' if len(info) == 1 else 'are'} informational only"
    return text or "every check applies"


def _mark(status: str) -> Paragraph:
    word = WORDS[status]
    return Paragraph(f"<b>{word}</b>" if status != "n/a" else word, styles.CELL)


def checks_table(checkup, width: float) -> Table:
    head = ["Mark", "Check", "Figure", "Threshold"]
    rows = [[Paragraph(f"<b>{h}</b>", styles.CELL) for h in head]]
    for c in checkup:
        if c.id in GROUP_ROWS:
            rows.append([Paragraph(f"<b>{para(GROUP_ROWS[c.id])}</b>", styles.CELL), "", "", ""])
        name = para(c.name)
        rows.append([_mark(c.status), Paragraph(name, styles.CELL), Paragraph(para(c.value_text), styles.CELL),
                     Paragraph(para(c.threshold + (" *" if c.changed else "")), styles.CELL)])
    table = Table(rows, colWidths=[width * s for s in SHARES], hAlign="LEFT", repeatRows=1)
    table.setStyle(TableStyle(_style(checkup)))
    return table


def _style(checkup) -> list:
    cmds = [("LINEBELOW", (0, 0), (-1, 0), 0.8, styles.TEXT), ("VALIGN", (0, 0), (-1, -1), "MIDDLE"),
            ("LINEBELOW", (0, 1), (-1, -1), 0.25, styles.GRID),
            ("TOPPADDING", (0, 0), (-1, -1), 2), ("BOTTOMPADDING", (0, 0), (-1, -1), 2)]
    row = 0
    for c in checkup:
        row += 1
        if c.id in GROUP_ROWS:       # a heading row spanning the table
            cmds += [("SPAN", (0, row), (-1, row)), ("TOPPADDING", (0, row), (-1, row), 6)]
            row += 1
        if c.status == "fail":       # a heavy rule and a tint: a failure shows in grayscale too
            cmds += [("BACKGROUND", (0, row), (-1, row), styles.LIGHT_ROW),
                     ("LINEBEFORE", (0, row), (0, row), 3, styles.TEXT)]
    return cmds


def failing(ctx: PackContext, checkup, width: float) -> list:
    failed = checkup.failed
    if not failed:
        return [Paragraph("Every applicable check passes.", styles.BODY)]
    story = [Paragraph("Failing checks and their first offenders", styles.H2)]
    listed: list = []
    for c in failed:
        shown = [] if c.offenders in listed else c.offenders[:OFFENDERS_SHOWN]    # no list twice
        listed.append(c.offenders)
        more = len(c.offenders) - len(shown) if shown else 0
        names = "; ".join(f"<b>{para(i)}</b> {para(ctx.name_of(i, 60))}" for i in shown)
        lines = [Paragraph(f"<b>{para(c.name)}</b> ({para(c.value_text)}; threshold {para(c.threshold)})",
                           styles.BODY)]
        if names:
            lines.append(Paragraph(names + (f"; and {more} more" if more > 0 else ""), styles.SMALL))
        if c.note:
            lines.append(Paragraph(para(c.note), styles.SMALL))
        story.append(KeepTogether(lines + [Spacer(1, 3)]))
    return story
