"""The cover page: title, revision, status date, who prepared it and the sign-off block."""

from __future__ import annotations

from reportlab.platypus import Paragraph, Spacer, Table, TableStyle

from workbench.figures.headline import headline

from . import styles
from .context import PackContext
from .layout import Section
from .text import elide, format_date, format_timestamp, para

SIGN_OFF_ROWS_WHEN_EMPTY = 3
TITLE_MOST = 200          # characters of the title, revision, names printed on the cover
FACT_MOST = 160
SIGNER_MOST = 44          # two lines of a sign-off row
CONTENTS = ("Summary", "Timeline", "Network", "Odds", "Drivers", "Activities",
            "Assumptions and cautions")      # when the caller does not say what the pack holds


def contents_of(parts: list) -> list[str]:
    """The section titles a story holds, in order, each once (the cover left out)."""
    titles = [p.title for p in parts if isinstance(p, Section) and p.key != "cover"]
    return list(dict.fromkeys(titles))


def cover(ctx: PackContext, width: float, contents: list[str] | None = None) -> list:
    s = ctx.settings
    story = [Section("Cover", "cover"),
             Paragraph("SLACKLINE \u00b7 APPROVAL PACK", styles.SUBTITLE), Spacer(1, 40),
             Paragraph(para(elide(s.title, TITLE_MOST)), styles.TITLE), Spacer(1, 14),
             _facts(ctx, width), Spacer(1, 18),
             *_headline(ctx, width), *_crews(ctx), Spacer(1, 18),
             Paragraph("Contents", styles.H2),
             Paragraph(para(" \u00b7 ".join(contents or CONTENTS)), styles.BODY), Spacer(1, 30),
             Paragraph("Sign-off", styles.H1),
             Paragraph("By signing, each person confirms they have reviewed this pack; the "
                       "decision rests with the organisation's own approval rules.", styles.BODY),
             Spacer(1, 8), sign_off_table(s.sign_off, width)]
    return story


def _facts(ctx: PackContext, width: float) -> Table:
    s = ctx.settings
    rows = [("Revision", s.revision or "-"),
            ("Status date", format_date(s.status_date) if s.status_date else "not set"),
            ("Prepared by", s.prepared_by or "-"),
            ("Plan file", ctx.footer.file_name),
            ("Plan hash", ctx.footer.plan_hash),
            ("Generated", f"{format_timestamp(ctx.footer.generated_at)} {ctx.footer.generated_at:%Z}".strip())]
    data = [[Paragraph(para(k), styles.BODY), Paragraph(para(elide(v, FACT_MOST)), styles.BODY)] for k, v in rows]
    table = Table(data, colWidths=[110, width - 110], hAlign="LEFT")
    table.setStyle(TableStyle([("VALIGN", (0, 0), (-1, -1), "TOP"),
                               ("TEXTCOLOR", (0, 0), (0, -1), styles.MUTED),
                               ("LINEBELOW", (0, 0), (-1, -1), 0.3, styles.GRID)]))
    return table


def _headline(ctx: PackContext, width: float) -> list:
    """The plan's headline figures, worded as in the window and Present mode: the
    simulation's when the pack has one, PERT beside them as the single-path estimate."""
    head = headline(ctx.analysis, ctx.simulation)
    rows = [[Paragraph(para(f.caption), styles.BODY), Paragraph(f"<b>{para(f.value)}</b>", styles.BODY),
             Paragraph(para(f.beside), styles.SMALL)] for f in head.figures()]
    table = Table(rows, colWidths=[width * 0.42, width * 0.28, width * 0.30], hAlign="LEFT")
    table.setStyle(TableStyle([("VALIGN", (0, 0), (-1, -1), "TOP"),
                               ("TEXTCOLOR", (0, 0), (0, -1), styles.MUTED),
                               ("LINEBELOW", (0, 0), (-1, -1), 0.3, styles.GRID)]))
    return [table, Spacer(1, 4), Paragraph(para(f"{head.note} {head.caution}"), styles.SMALL)]


def _crews(ctx: PackContext) -> list:
    """For a plan with resources: the crews' effect on the odds, where the board reads the
    headline (the Resources pages give the detail)."""
    from .resource_pages import crews_odds

    both = crews_odds(ctx)
    if both is None:
        return []
    sentence = both.sentence(float(ctx.settings.target_confidence))
    sentence = sentence[:1].lower() + sentence[1:]
    return [Spacer(1, 6), Paragraph(para(f"With the crews: {sentence} The figures above are the logic's alone; "
                                         "see Resources."), styles.BODY)]


def sign_off_table(people, width: float) -> Table:
    """Name, role, date and signature columns; blank ruled rows when no names are set."""
    head = [Paragraph(f"<b>{h}</b>", styles.SMALL) for h in ("Name", "Role", "Date", "Signature")]
    rows = [[Paragraph(para(elide(p.name, SIGNER_MOST)), styles.BODY),
             Paragraph(para(elide(p.role, SIGNER_MOST)), styles.BODY), "", ""]
            for p in people] or [["", "", "", ""] for _ in range(SIGN_OFF_ROWS_WHEN_EMPTY)]
    widths = [width * 0.27, width * 0.25, width * 0.16, width * 0.32]
    table = Table([head] + rows, colWidths=widths, rowHeights=[16] + [38] * len(rows), hAlign="LEFT")
    table.setStyle(TableStyle([("VALIGN", (0, 1), (-1, -1), "BOTTOM"),
                               ("LINEBELOW", (0, 0), (-1, 0), 0.8, styles.TEXT),
                               ("LINEBELOW", (0, 1), (-1, -1), 0.5, styles.TEXT),
                               ("LINEAFTER", (0, 1), (-2, -1), 0.3, styles.GRID),
                               ("BOTTOMPADDING", (0, 1), (-1, -1), 4)]))
    return table
