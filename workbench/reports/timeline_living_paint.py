"""The living-schedule marks on the pack's Timeline pages, as on screen (geometry from
``workbench.figures.timeline_living``): the approved baseline as a thin dark-grey bar
beneath each bar, done work solid dark blue, and a reddish-purple triangle with a black
edge after a bar that now finishes later than the baseline."""

from __future__ import annotations

from reportlab.lib.colors import HexColor

from workbench.figures import style

from . import styles

BASELINE, DONE, SLIPPED = HexColor(style.MUTED_TEXT), HexColor(style.WORK_EDGE), HexColor(style.DEADLINE)


def approved_variance(ctx):
    """The analysis against the plan's approved baseline, or None."""
    from workbench.core.baseline import approved
    from workbench.core.variance import variance_against

    base = approved(getattr(ctx.plan, "baselines", ()))
    return None if base is None else variance_against(ctx.analysis, base)


def draw_living(tile, ax, bh: float) -> None:
    c = ax.canvas
    c.saveState()
    c.setFillColor(BASELINE)
    thin = max(1.2, bh * 0.22)
    m = tile._visible("baseline")
    for r, x0, x1 in zip(m.rows, m.x0, m.x1):
        c.rect(ax.px(x0), tile.yc(ax, r) - bh / 2 - thin - 0.6, max(ax.px(x1) - ax.px(x0), 0.6), thin, stroke=0, fill=1)
    c.setFillColor(DONE)
    m = tile._visible("done")
    for r, x0, x1 in zip(m.rows, m.x0, m.x1):
        c.rect(ax.px(x0), tile.yc(ax, r) - bh / 2, ax.px(x1) - ax.px(x0), bh, stroke=0, fill=1)
    c.setFillColor(SLIPPED)
    c.setStrokeColor(styles.TEXT)
    c.setLineWidth(0.5)
    m = tile._visible("slipped")
    for r, x1 in zip(m.rows, m.x1):
        _triangle(c, ax.px(x1) + 1.5, tile.yc(ax, r), bh * 0.55)
    c.restoreState()


def _triangle(c, x: float, y: float, size: float) -> None:
    path = c.beginPath()
    path.moveTo(x, y - size / 2)
    path.lineTo(x + size, y)
    path.lineTo(x, y + size / 2)
    path.close()
    c.drawPath(path, stroke=1, fill=1)


def living_legend(geo) -> list:
    items = []
    if len(geo.marks.get("done", ())):
        items.append(("Done", lambda c, x, y, w, h: _swatch(c, DONE, x, y, w, h)))
    if len(geo.marks.get("baseline", ())):
        items.append(("Baseline", lambda c, x, y, w, h: _swatch(c, BASELINE, x, y + h * 0.3, w, h * 0.35)))
    if len(geo.marks.get("slipped", ())):
        items.append(("Later than baseline", _slip_swatch))
    return items


def _swatch(c, colour, x, y, w, h) -> None:
    c.saveState()
    c.setFillColor(colour)
    c.rect(x, y, w, h, stroke=0, fill=1)
    c.restoreState()


def _slip_swatch(c, x, y, w, h) -> None:
    c.saveState()
    c.setFillColor(SLIPPED)
    c.setStrokeColor(styles.TEXT)
    c.setLineWidth(0.5)
    _triangle(c, x + w / 2 - h / 2, y + h / 2, h)
    c.restoreState()
