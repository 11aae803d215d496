"""The critical path in the pack, however long: a short form for the summary and side
panels, and, for a long path, the whole of it in order, wrapped over numbered rows of a
table that continues from page to page."""

from __future__ import annotations

from reportlab.platypus import LongTable, Paragraph, TableStyle

from . import styles
from .context import PackContext
from .layout import Section
from .text import para

PATH_JOIN = " \u2013 "
SUMMARY_MOST = 60        # ids printed in full on the summary page
PER_ROW = 10             # ids per row of the full listing


def short_path(ids, most: int = SUMMARY_MOST) -> str:
    """The path joined by dashes; past ``most`` ids, its head and tail around an ellipsis
    and the count, so the text stays a few lines long."""
    ids = list(ids)
    if len(ids) <= most:
        return PATH_JOIN.join(ids)
    head, tail = ids[: max(1, most - 3)], ids[-2:]
    return (PATH_JOIN.join(head) + PATH_JOIN + "\u2026" + PATH_JOIN + PATH_JOIN.join(tail)
            + f" ({len(ids):,} activities)")


def is_long(ctx: PackContext) -> bool:
    return len(ctx.analysis.pert.path) > SUMMARY_MOST


def full_path(ctx: PackContext, width: float) -> list:
    """The whole critical path in order, PER_ROW ids a row; empty when the summary shows it all."""
    if not is_long(ctx):
        return []
    ids = list(ctx.analysis.pert.path)
    head = [Paragraph("<b>Steps</b>", styles.CELL), Paragraph("<b>Activities, in order</b>", styles.CELL)]
    rows = [head]
    for k in range(0, len(ids), PER_ROW):
        part = ids[k:k + PER_ROW]
        rows.append([Paragraph(f"{k + 1:,}\u2013{k + len(part):,}", styles.CELL),
                     Paragraph(para(PATH_JOIN.join(part)), styles.CELL)])
    table = LongTable(rows, colWidths=[62, width - 62], repeatRows=1, hAlign="LEFT", splitInRow=1)
    table.setStyle(TableStyle([("LINEBELOW", (0, 0), (-1, 0), 0.8, styles.TEXT),
                               ("LINEBELOW", (0, 1), (-1, -1), 0.25, styles.GRID),
                               ("VALIGN", (0, 0), (-1, -1), "TOP"),
                               ("TOPPADDING", (0, 0), (-1, -1), 1.5), ("BOTTOMPADDING", (0, 0), (-1, -1), 1.5)]))
    intro = (f"The critical path on PERT means runs through {len(ids):,} activities; they are listed "
             "here in order, from the first to the last.")
    return [Section("Critical path in full", "fullpath"), Paragraph("Critical path in full", styles.H1),
            Paragraph(para(intro), styles.SMALL), table]
