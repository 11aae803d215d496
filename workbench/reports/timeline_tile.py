"""One page of the Timeline: a block of rows in one time window, drawn on a canvas."""

from __future__ import annotations

from dataclasses import dataclass

from reportlab.lib import colors

from . import marks as mk
from . import fonts, styles
from .axes import Axes
from .tables import fit
from .timeline_living_paint import draw_living, living_legend

LABEL_W = 200.0
AXIS_H = 18.0
LEGEND_H = 18.0
LABEL_SIZE = 8.0


@dataclass(frozen=True)
class TileSpec:
    row_lo: int
    row_hi: int
    x_lo: float
    x_hi: float
    row_h: float


class TimelineTile:
    def __init__(self, ctx, geo, spec: TileSpec):
        self.ctx, self.geo, self.spec = ctx, geo, spec

    # --- layout --------------------------------------------------------------
    def _axes(self, c, w: float, h: float) -> Axes:
        s = self.spec
        rows_h = (s.row_hi - s.row_lo + 1) * s.row_h      # + the project finish row
        top = h - AXIS_H
        return Axes(c, LABEL_W, top - rows_h, w - LABEL_W - 8, rows_h, s.x_lo, s.x_hi)

    def yc(self, ax: Axes, row: int) -> float:
        """Page y of a row's centre line."""
        return ax.y + ax.h - (row - self.spec.row_lo + 0.5) * self.spec.row_h

    def paint(self, c, w: float, h: float) -> None:
        ax = self._axes(c, w, h)
        self._bands(ax)
        ax.date_axis(self.ctx.analysis.calendar, at_top=True)
        ax.date_axis(self.ctx.analysis.calendar, grid=False)
        c.saveState()
        path = c.beginPath()
        path.rect(ax.x, ax.y - 1, ax.w, ax.h + 2)
        c.clipPath(path, stroke=0, fill=0)
        self._marks(ax)
        self._reference_lines(ax)
        self._finish_row(ax)
        c.restoreState()
        self._reference_labels(ax)
        self._labels(ax)
        self._finish_label(ax)
        ax.frame()
        items = self._legend_items()
        mk.legend(c, 0, max(2.0, ax.y - AXIS_H - LEGEND_H + 4), items, legend_size(c, items, w))

    # --- layers --------------------------------------------------------------
    def _bands(self, ax: Axes) -> None:
        c = ax.canvas
        c.saveState()
        c.setFillColor(styles.LIGHT_ROW)
        for r in range(self.spec.row_lo, self.spec.row_hi):
            if r % 2:
                c.rect(0, self.yc(ax, r) - self.spec.row_h / 2, ax.x + ax.w, self.spec.row_h, stroke=0, fill=1)
        c.restoreState()

    def _visible(self, kind: str):
        m = self.geo.marks[kind].within(self.spec.row_lo, self.spec.row_hi - 1)
        return m.take((m.x1 >= self.spec.x_lo) & (m.x0 <= self.spec.x_hi))

    def _marks(self, ax: Axes) -> None:
        c, bh = ax.canvas, self.spec.row_h * 0.6
        for kind in ("summary", "summary_critical"):
            self._summaries(ax, kind)
        m = self._visible("float")
        for r, x0, x1 in zip(m.rows, m.x0, m.x1):
            mk.slack_line(c, ax.px(x0), ax.px(x1), self.yc(ax, r), bh * 0.9)
        self._free_float(ax)
        self._negative_float(ax)
        m = self._visible("work")
        for r, x0, x1 in zip(m.rows, m.x0, m.x1):
            mk.work_bar(c, ax.px(x0), self.yc(ax, r) - bh / 2, ax.px(x1) - ax.px(x0), bh)
        m = self._visible("critical")
        for r, x0, x1 in zip(m.rows, m.x0, m.x1):
            mk.critical_bar(c, ax.px(x0), self.yc(ax, r) - bh / 2, ax.px(x1) - ax.px(x0), bh)
        draw_living(self, ax, bh)
        for kind, fill in (("milestone", styles.TEXT), ("milestone_critical", styles.CRITICAL)):
            m = self._visible(kind)
            for r, x0 in zip(m.rows, m.x0):
                mk.diamond(c, ax.px(x0), self.yc(ax, r), bh * 0.65, fill, 1.2 if fill is styles.CRITICAL else 0.6)
        self._whiskers(ax)

    def _summaries(self, ax: Axes, kind: str) -> None:
        c, bh = ax.canvas, self.spec.row_h * 0.3
        c.saveState()
        c.setFillColor(styles.CRITICAL if kind == "summary_critical" else styles.SUMMARY)
        c.setStrokeColor(styles.TEXT)
        c.setLineWidth(1.2 if kind == "summary_critical" else 0.4)
        m = self._visible(kind)
        for r, x0, x1 in zip(m.rows, m.x0, m.x1):
            y = self.yc(ax, r)
            c.rect(ax.px(x0), y - bh / 2, ax.px(x1) - ax.px(x0), bh, stroke=1, fill=1)
            for x in (ax.px(x0), ax.px(x1)):
                c.line(x, y - bh * 1.3, x, y + bh / 2)
        c.restoreState()

    def _free_float(self, ax: Axes) -> None:
        c = ax.canvas
        c.saveState()
        c.setStrokeColor(styles.WORK_EDGE)
        c.setLineWidth(1.2)
        m = self._visible("free_float")
        for r, x in zip(m.rows, m.x0):
            y = self.yc(ax, r)
            c.line(ax.px(x), y - 2.5, ax.px(x), y + 2.5)
        c.restoreState()

    def _negative_float(self, ax: Axes) -> None:
        c = ax.canvas
        c.saveState()
        c.setStrokeColor(styles.DEADLINE)
        c.setLineWidth(2.0)
        c.setDash(2, 1.5)
        m = self._visible("negative_float")
        for r, x0, x1 in zip(m.rows, m.x0, m.x1):
            y = self.yc(ax, r) - self.spec.row_h * 0.4
            c.line(ax.px(x0), y, ax.px(x1), y)
        c.restoreState()

    def _finish_row(self, ax: Axes) -> None:
        """The last row: the project finish on PERT means, and its P10-P90 when simulated."""
        c, y = ax.canvas, self.yc(ax, self.spec.row_hi)
        c.saveState()
        c.setStrokeColor(styles.TEXT)
        c.setLineWidth(0.6)
        c.line(ax.x, y + self.spec.row_h / 2, ax.x + ax.w, y + self.spec.row_h / 2)
        if self.geo.finish_whisker:
            lo, hi = self.geo.finish_whisker
            c.setStrokeColor(styles.PROBABILITY)
            c.setLineWidth(2.5)
            c.line(ax.px(lo), y, ax.px(hi), y)
            for x in (lo, hi):
                c.line(ax.px(x), y - 3.5, ax.px(x), y + 3.5)
        c.restoreState()
        mk.diamond(c, ax.px(self.geo.finish), y, self.spec.row_h * 0.35, styles.TEXT)

    def _whiskers(self, ax: Axes) -> None:
        c = ax.canvas
        c.saveState()
        c.setStrokeColor(styles.PROBABILITY)
        c.setLineWidth(1.0)
        m = self._visible("whisker")
        for r, x0, x1 in zip(m.rows, m.x0, m.x1):
            y = self.yc(ax, r) + self.spec.row_h * 0.38
            c.line(ax.px(x0), y, ax.px(x1), y)
            c.line(ax.px(x0), y - 1.5, ax.px(x0), y + 1.5)
            c.line(ax.px(x1), y - 1.5, ax.px(x1), y + 1.5)
        c.restoreState()

    # --- reference lines, labels, legend ----------------------------------------
    LINES = {"start": (styles.TEXT, 0.8, None), "deadline": (styles.DEADLINE, 1.8, (5, 2)),
             "status": (styles.STATUS, 1.5, (2, 2))}

    def _reference_lines(self, ax: Axes) -> None:
        for name, offset in self.geo.lines.items():
            colour, width, dash = self.LINES.get(name, (styles.TEXT, 0.8, None))
            ax.vline(offset, colour, width, dash)

    def _reference_labels(self, ax: Axes) -> None:
        c = ax.canvas
        c.saveState()
        c.setFont(styles.BOLD, 7.5)
        for name, offset in self.geo.lines.items():
            if name != "start" and self.spec.x_lo <= offset <= self.spec.x_hi:
                # at the top of the plot, clear of the finish row's P10-P90 bar at the foot
                text, x, y = name.capitalize(), ax.px(offset) + 2, ax.y + ax.h - 9
                c.setFillColor(colors.white)
                c.rect(x - 1, y - 1.5, c.stringWidth(text, styles.BOLD, 7.5) + 2, 8.5, stroke=0, fill=1)
                c.setFillColor(self.LINES[name][0])
                c.drawString(x, y, text)
        c.restoreState()

    def _labels(self, ax: Axes) -> None:
        c, geo = ax.canvas, self.geo
        c.saveState()
        for r in range(self.spec.row_lo, self.spec.row_hi):
            group = geo.kinds[r] == "group"
            indent = 4 + 10 * int(geo.depth[r])
            font = styles.BOLD if group or self._critical_row(r) else styles.FONT
            c.setFont(font, LABEL_SIZE)
            c.setFillColor(styles.TEXT)
            fonts.draw(c, indent, self.yc(ax, r) - LABEL_SIZE * 0.35, fit(geo.labels[r], LABEL_W - indent - 6, font, LABEL_SIZE))
        group = self.continued_group()
        if group is not None:            # the tile starts inside a group whose row is on the page before
            c.setFont(styles.BOLD, LABEL_SIZE)
            c.setFillColor(styles.MUTED)
            fonts.draw(c, 4, ax.y + ax.h + 4, fit(f"{group} (continued)", LABEL_W - 10, styles.BOLD, LABEL_SIZE))
        c.restoreState()

    def continued_group(self) -> str | None:
        """The group the tile's first row belongs to, when that group's own row is on an
        earlier tile."""
        geo, first = self.geo, self.spec.row_lo
        if first <= 0 or first >= len(geo.kinds) or int(geo.depth[first]) == 0:
            return None
        for r in range(first - 1, -1, -1):
            if geo.kinds[r] == "group" and int(geo.depth[r]) < int(geo.depth[first]):
                return geo.labels[r]
        return None

    def _finish_label(self, ax: Axes) -> None:
        c = ax.canvas
        text = "Project finish" + (" (P10-P90)" if self.geo.finish_whisker else "")
        c.setFont(styles.BOLD, LABEL_SIZE)
        c.setFillColor(styles.TEXT)
        c.drawString(4, self.yc(ax, self.spec.row_hi) - LABEL_SIZE * 0.35, text)

    def _critical_row(self, r: int) -> bool:
        i = int(self.geo.index[r])
        return i >= 0 and bool(self.ctx.analysis.schedule.critical[i])

    def _legend_items(self):
        line = mk.line_swatch
        items = [("Critical (hatched, heavy outline)", lambda c, x, y, w, h: mk.critical_bar(c, x, y, w, h, 1.0)),
                 ("Other work", mk.work_bar),
                 ("Float (ends at late finish)", lambda c, x, y, w, h: mk.slack_line(c, x, x + w, y + h / 2, h)),
                 ("Free float ends", _free_float_swatch),
                 ("Milestone", lambda c, x, y, w, h: mk.diamond(c, x + w / 2, y + h / 2, h * 0.6, styles.TEXT)),
                 ]
        if "deadline" in self.geo.lines:
            items.append(("Deadline", line(styles.DEADLINE, 1.8, (5, 2))))
        if "status" in self.geo.lines:
            items.append(("Status date", line(styles.STATUS, 1.5, (2, 2))))
        if len(self.geo.marks["negative_float"]):
            items.append(("Negative float", line(styles.DEADLINE, 2.0, (2, 1.5))))
        if len(self.geo.marks["whisker"]) or self.geo.finish_whisker:
            items.append(("P10-P90 finish", line(styles.PROBABILITY, 2.0)))
        return items + living_legend(self.geo)


def legend_size(c, items, width: float, size: float = 8.0) -> float:
    """The largest type size (8 pt down to 6) at which the one-line legend fits ``width``."""
    while size > 6.0 and sum(26 + c.stringWidth(label, styles.FONT, size) for label, _ in items) > width:
        size -= 0.5
    return size


def _free_float_swatch(c, x, y, w, h):
    mk.slack_line(c, x, x + w, y + h / 2, h)
    c.saveState()
    c.setStrokeColor(styles.WORK_EDGE)
    c.setLineWidth(1.2)
    c.line(x + w / 2, y + h / 2 - 2.5, x + w / 2, y + h / 2 + 2.5)
    c.restoreState()
