"""The Drivers page: criticality index and the sensitivity tornado from the simulation,
drawn from ``workbench.figures.drivers`` geometry (the Drivers view's)."""

from __future__ import annotations

from reportlab.platypus import Paragraph

from workbench.figures import drivers as dg

from . import marks as mk
from . import fonts, styles
from .chart_flowable import ChartFlowable
from .layout import LANDSCAPE, Section, new_page
from .tables import fit
from .text import wrap_words

TOP = 15
HEADING_SPACE = 30.0
LABEL_W = 150.0
BAR_ROW = 17.0


FOOTNOTE = ("Activities on the PERT critical path are drawn hatched with a heavy outline. A folded row "
            "stands for the remaining activities and shows the largest of their values. Milestones are not "
            "ranked for criticality (a start or finish milestone lies on every path).")


def drivers_pages(ctx, frame: tuple[float, float]) -> list:
    width, height = frame
    story = new_page(LANDSCAPE) + [Section("Drivers", "drivers"), Paragraph("Drivers: what moves the finish", styles.H1)]
    sim = ctx.simulation
    if sim is None:
        return story + [Paragraph("No simulation was run for this pack, so the drivers are not ranked.", styles.BODY)]
    crit = dg.criticality_bars(sim, ctx.plan, TOP)
    sens = dg.sensitivity_bars(sim, ctx.plan, TOP)
    critical = set(ctx.analysis.pert.path)
    paint = lambda c, w, h: paint_drivers(c, w, h, crit, sens, critical)
    return story + [ChartFlowable(width, height - HEADING_SPACE, paint)]


def paint_drivers(c, w: float, h: float, crit, sens, critical: set[str]) -> None:
    """Criticality (left) and the sensitivity tornado (right) side by side in w × h points."""
    half = (w - 20) / 2
    _panel(c, (0, h, half), crit, False, "Criticality index: runs on the critical path", critical)
    _panel(c, (half + 20, h, half), sens, True, "Sensitivity: correlation with the finish", critical)
    c.setFont(styles.FONT, 8)
    c.setFillColor(styles.MUTED)
    lines = wrap_words(c, FOOTNOTE, w, styles.FONT, 8)           # wrapped, never cut short
    for k, line in enumerate(lines):
        c.drawString(0, 4 + 10 * (len(lines) - 1 - k), line)



def _panel(c, box, bars, signed: bool, title: str, critical: set[str]) -> None:
    x0, h, w = box
    lo, hi = dg.value_span(bars, signed)
    label_w = min(LABEL_W, 0.42 * w)
    plot_x, plot_w = x0 + label_w, w - label_w - 30
    top = h - 26
    row = min(max(BAR_ROW, (h - 60) / max(len(bars), 1)), 1.6 * BAR_ROW)
    px = lambda v: plot_x + (v - lo) / (hi - lo) * plot_w
    c.setFont(styles.BOLD, 10)
    c.setFillColor(styles.TEXT)
    fonts.draw(c, x0, h - 12, fit(title, w, styles.BOLD, 10))
    _grid(c, px, (lo, hi), (top, top - len(bars) * row), signed, plot_w)
    for rect in dg.bar_rects(bars):
        y = top - (rect.row + 0.5) * row
        _bar(c, px(rect.x0), y - row * 0.35, px(rect.x1) - px(rect.x0), row * 0.7, rect.bar, critical)
        c.setFont(styles.BOLD if not rect.bar.is_folded else styles.FONT, 8)
        c.setFillColor(styles.TEXT)
        fonts.draw(c, x0, y - 3, fit(rect.bar.label, label_w - 6, styles.BOLD, 8))
        value = f"{rect.bar.value * 100:.0f} %" if not signed else f"{rect.bar.value:+.2f}"
        if rect.bar.is_folded:          # the largest of the rest, not their sum
            value = f"each ≤ {abs(rect.bar.value) * 100:.0f} %" if not signed else f"each |r| ≤ {abs(rect.bar.value):.2f}"
        c.setFont(styles.FONT, 8)
        c.drawString(px(max(rect.x1, 0.0)) + 3, y - 3, value)


def _grid(c, px, span, rows_y, signed, plot_w) -> None:
    (lo, hi), (top, bottom) = span, rows_y
    most = 6 if plot_w >= 160 else 3      # a narrow panel: fewer ticks so their labels do not collide
    if not signed:
        ticks = [k / 5 for k in range(6)] if most > 3 else [0.0, 0.5, 1.0]
    else:
        ticks = _signed_ticks(lo, hi, most)
    c.saveState()
    c.setFont(styles.FONT, 7.5)
    for v in ticks:
        c.setStrokeColor(styles.TEXT if abs(v) < 1e-12 else styles.GRID)
        c.setLineWidth(0.8 if abs(v) < 1e-12 else 0.4)
        c.line(px(v), bottom, px(v), top)
        c.setFillColor(styles.TEXT)
        c.drawCentredString(px(v), bottom - 10, f"{v * 100:.0f} %" if not signed else f"{v:+.2f}")
    c.restoreState()


def _signed_ticks(lo: float, hi: float, most: int) -> list[float]:
    """Round correlation ticks inside [lo, hi], zero always among them, at most ``most``."""
    for step in (0.05, 0.1, 0.2, 0.25, 0.5, 1.0):
        ticks = [k * step for k in range(int(lo / step), int(hi / step) + 1) if lo <= k * step <= hi]
        if len(ticks) <= most:
            return ticks
    return [0.0]


def _bar(c, x, y, w, h, bar, critical: set[str]) -> None:
    if bar.is_folded:
        c.saveState()
        c.setFillColor(styles.GRID)
        c.setStrokeColor(styles.MUTED)
        c.rect(x, y, w, h, stroke=1, fill=1)
        c.restoreState()
    elif bar.act_id in critical:
        mk.critical_bar(c, x, y, w, h, 1.0)
    else:
        mk.work_bar(c, x, y, w, h)

