"""The activity table: PERT mean and spread, early/late dates, floats; header on every page."""

from __future__ import annotations

from reportlab.pdfbase.pdfmetrics import stringWidth
from reportlab.platypus import LongTable, Paragraph, TableStyle

from . import fonts, limits, styles
from .context import PackContext
from .layout import Section
from .limits import least_float, summarised
from .text import fit, format_date

HEAD = ("ID", "Name", "te", "sd", "ES", "EF", "LS", "LF", "Total\nfloat", "Free\nfloat", "Crit.")
SHARES = (0.085, 0.255, 0.055, 0.05, 0.09, 0.09, 0.09, 0.09, 0.065, 0.065, 0.065)
FONT_SIZE = 8
DATES = ("early_start", "early_finish", "late_start", "late_finish")
DATE_COLUMNS = (4, 5, 6, 7)
PADDING = 2 + 2                 # left and right padding of every cell


def cell(text: str):
    """A table cell for fitted text: the text itself, or a Paragraph when part of it
    needs the fallback font (a plain cell draws in one font)."""
    parts = fonts.runs(text, styles.FONT)
    if len(parts) == 1 and parts[0][1] == styles.FONT:
        return parts[0][0]
    return Paragraph(fonts.markup(text), styles.CELL)


def _fixed(x: float) -> str:
    """Two decimals in every row, so a column's figures line up."""
    return f"{round(float(x), 9) + 0.0:.2f}"


def _rows_of(ctx: PackContext, shown) -> list[int]:
    return list(range(len(ctx.plan.activities))) if shown is None else shown.tolist()


def column_widths(ctx: PackContext, width: float, shown=None) -> list[float]:
    """The shares of ``width``, but each date column at least as wide as its widest date;
    the name column gives way."""
    widths = [width * share for share in SHARES]
    dates = ctx.analysis.dates()
    texts = [format_date(dates[k][i]) for k in DATES for i in _rows_of(ctx, shown)]
    need = max((stringWidth(t, styles.FONT, FONT_SIZE) for t in texts), default=0.0) + PADDING + 1
    for c in DATE_COLUMNS:
        widths[c] = max(widths[c], need)
    widths[1] = width - sum(widths) + widths[1]
    return widths


def activity_rows(ctx: PackContext, widths: list[float], shown=None) -> list[list[str]]:
    """One row per activity, or per plan row in ``shown``."""
    a, s = ctx.analysis, ctx.analysis.schedule
    dates = a.dates()
    acts = ctx.plan.activities
    rows = []
    for i in _rows_of(ctx, shown):
        act = acts[i]
        rows.append([cell(fit(act.id, widths[0] - 4, styles.BOLD)), cell(fit(act.name, widths[1] - 4)),
                     _fixed(a.means[i]), _fixed(a.variances[i] ** 0.5),
                     *(format_date(dates[k][i]) for k in DATES),
                     _fixed(s.total_float[i]), _fixed(s.free_float[i]),
                     "YES" if s.critical[i] else ""])
    return rows


def _table_style(ctx: PackContext, shown) -> TableStyle:
    cmds = [("FONT", (0, 0), (-1, -1), styles.FONT, FONT_SIZE), ("FONT", (0, 0), (-1, 0), styles.BOLD, FONT_SIZE),
            ("FONT", (0, 1), (0, -1), styles.BOLD, FONT_SIZE), ("VALIGN", (0, 0), (-1, -1), "MIDDLE"),
            ("ALIGN", (2, 0), (-1, -1), "RIGHT"), ("LINEBELOW", (0, 0), (-1, 0), 0.8, styles.TEXT),
            ("TOPPADDING", (0, 0), (-1, -1), 1.5), ("BOTTOMPADDING", (0, 0), (-1, -1), 1.5),
            ("LEFTPADDING", (0, 0), (-1, -1), PADDING / 2), ("RIGHTPADDING", (0, 0), (-1, -1), PADDING / 2)]
    for row, critical in enumerate(ctx.analysis.schedule.critical[shown].tolist(), start=1):
        if critical:
            cmds += [("TEXTCOLOR", (-1, row), (-1, row), styles.CRITICAL), ("FONT", (-1, row), (-1, row), styles.BOLD, FONT_SIZE)]
        if row % 2 == 0:
            cmds.append(("BACKGROUND", (0, row), (-1, row), styles.LIGHT_ROW))
    return TableStyle(cmds)


def activity_table(ctx: PackContext, width: float) -> list:
    total = len(ctx.plan)
    shown = least_float(ctx.analysis.schedule, limits.TABLE_ROWS)
    widths = column_widths(ctx, width, shown)
    table = LongTable([list(HEAD)] + activity_rows(ctx, widths, shown), colWidths=widths, repeatRows=1)
    table.setStyle(_table_style(ctx, shown))
    unit = ctx.unit
    intro = (f"te: PERT expected duration, sd: its standard deviation, floats in {unit}; "
             "ES/EF/LS/LF are calendar dates (start dates are the first working day, finish "
             "dates the last). Critical activities are marked YES.")
    if ctx.deadline() is not None:
        intro += (f" The late dates come from the deadline ({format_date(ctx.date_of(ctx.deadline()))}), so "
                  "floats are measured to it: the critical activities are those with the least float, "
                  "which is more than zero when the plan finishes early and negative when it is late.")
    if shown.size < total:
        intro += " " + summarised(shown.size, total, "this table")
    return [Section("Activities", "activities"), Paragraph("Activities", styles.H1),
            Paragraph(intro, styles.SMALL), table]
