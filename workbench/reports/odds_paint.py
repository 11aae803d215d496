"""Drawing of the Odds chart (PERT curve and simulation bars with the shaded answer) and
of the S-curve, on a reportlab canvas, from ``workbench.figures.odds`` geometry."""

from __future__ import annotations

import numpy as np
from reportlab.lib.colors import white as _WHITE

from workbench.figures import odds as og

from . import marks as mk
from . import styles
from .axes import Axes
from .text import clean, format_date

AXIS_H = 26.0
LEGEND_H = 16.0
LEFT = 40.0
S_CURVE_POINTS = 501


def deadline_text(ctx) -> str:
    """The deadline's legend entry with its date: the line sits at the end of that day, which
    is where the next working day's tick begins, so the date is said rather than left to the axis."""
    return f"Deadline: end of {format_date(ctx.date_of(ctx.deadline()))}"


def _fill_swatch(colour):
    def draw(c, x, y, w, h):
        c.saveState()
        c.setFillColor(colour)
        c.setStrokeColor(styles.TEXT)
        c.setLineWidth(0.4)
        c.rect(x, y, w, h, stroke=1, fill=1)
        c.restoreState()
    return draw


class OddsPainter:
    def __init__(self, ctx, question: og.Question):
        self.ctx, self.q = ctx, question
        pert, sim = ctx.analysis.pert, ctx.simulation
        self.lo, self.hi = og.axis_span(pert, sim, extra=(question.d1,))

    def offset_at(self, x: float, w: float) -> float:
        """The offset under a horizontal position in a chart w points wide (the panels' mapping)."""
        return self.lo + (x - LEFT) / max(w - LEFT - 6, 1e-9) * (self.hi - self.lo)

    def paint(self, c, w: float, h: float) -> None:
        sim = self.ctx.simulation
        body = h - LEGEND_H - 4
        if sim is None:
            self._pert_panel(c, LEGEND_H + 4, w, body)
        else:
            half = body / 2
            self._pert_panel(c, LEGEND_H + 4 + half, w, half)
            self._sim_panel(c, LEGEND_H + 4, w, half)
        mk.legend(c, 0, 2, self._legend())

    def _panel(self, c, y: float, w: float, h: float, y_hi: float) -> Axes:
        ax = Axes(c, LEFT, y + AXIS_H, w - LEFT - 6, h - AXIS_H - 22, self.lo, self.hi, 0.0, y_hi)
        ax.date_axis(self.ctx.analysis.calendar)
        ax.frame()
        return ax

    def _title(self, ax: Axes, text: str) -> None:
        c = ax.canvas
        c.saveState()
        c.setFont(styles.BOLD, 11)
        c.setFillColor(styles.TEXT)
        c.drawString(ax.x, ax.y + ax.h + 8, clean(text))
        c.restoreState()

    def _pert_panel(self, c, y: float, w: float, h: float) -> None:
        pert = self.ctx.analysis.pert
        curve = og.pert_curve(pert, self.lo, self.hi)
        ax = self._panel(c, y, w, h, max(float(curve.density.max()), 1e-12) * 1.12)
        shade = og.pert_shade(pert, self.q, self.lo, self.hi)
        if curve.step:
            ax.vline(curve.mean, styles.TEXT, 2.0, label="certain finish (no spread)", top=False)
        else:
            ax.polyline(shade.x, shade.y, close=True, fill=styles.PROBABILITY)
            ax.polyline(curve.x, curve.density, stroke=styles.TEXT, width=1.6)
        self._question_line(ax)
        self._title(ax, f"PERT (one path): P(finish by {format_date(self.ctx.date_of(self.q.d1))}) = "
                        f"{og.format_probability(shade.probability)}")

    def _sim_panel(self, c, y: float, w: float, h: float) -> None:
        sim = self.ctx.simulation
        fig = og.sim_figure(sim)
        ax = self._panel(c, y, w, h, max(float(fig.heights.max()), 1e-12) * 1.12)
        p = og.sim_probability(sim, self.q)
        xs, ys = fig.step_outline()
        ax.polyline(xs, ys, close=True, fill=styles.FLOAT_TINT)
        shade = og.sim_shade(fig, self.q, p)
        ax.polyline(shade.x, shade.y, close=True, fill=styles.PROBABILITY)
        ax.polyline(xs, ys, stroke=styles.TEXT, width=0.6)
        self._question_line(ax)
        for name, offset in fig.markers.items():          # after the date line: labels on top
            ax.vline(offset, styles.TEXT, 0.8, (1.5, 1.5), label=name, top=False)
        self._title(ax, f"Simulation ({fig.iterations:,} runs, seed {fig.seed}): P(finish by "
                        f"{format_date(self.ctx.date_of(self.q.d1))}) = {og.format_probability(p)}")

    def _question_line(self, ax: Axes) -> None:
        has_deadline = self.ctx.deadline() is not None
        ax.vline(self.q.d1, styles.DEADLINE if has_deadline else styles.TEXT, 1.8, (5, 2))

    def _legend(self):
        items = [(f"Finish by {format_date(self.ctx.date_of(self.q.d1))}", _fill_swatch(styles.PROBABILITY)),
                 ("PERT curve", mk.line_swatch(styles.TEXT, 1.6))]
        if self.ctx.simulation is not None:
            items += [("Simulated finishes", _fill_swatch(styles.FLOAT_TINT)),
                      ("Simulated P50/P80/P90", mk.line_swatch(styles.TEXT, 0.8, (1.5, 1.5)))]
        if self.ctx.deadline() is not None:
            items.append((deadline_text(self.ctx), mk.line_swatch(styles.DEADLINE, 1.8, (5, 2))))
        return items


class SCurvePainter:
    def __init__(self, ctx, question: og.Question):
        self.ctx, self.q = ctx, question
        self.lo, self.hi = og.axis_span(ctx.analysis.pert, ctx.simulation, extra=(question.d1,))

    def paint(self, c, w: float, h: float) -> None:
        ax = Axes(c, LEFT, LEGEND_H + 4 + AXIS_H, w - LEFT - 6, h - LEGEND_H - AXIS_H - 16, self.lo, self.hi, 0.0, 1.0)
        ax.value_axis([k / 10 for k in range(11)], lambda v: f"{v * 100:.0f} %", grid=True)
        ax.date_axis(self.ctx.analysis.calendar)
        ax.frame()
        curve = og.pert_curve(self.ctx.analysis.pert, self.lo, self.hi)
        ax.polyline(curve.x, curve.cumulative, stroke=styles.TEXT, width=1.2)
        sim = self.ctx.simulation
        if sim is not None:
            probs = np.linspace(0.0, 1.0, S_CURVE_POINTS)
            xs = np.quantile(np.asarray(sim.finish, dtype=float), probs)
            ax.polyline(xs, probs, stroke=styles.WORK, width=2.2)
        self._guides(ax)
        ax.vline(self.q.d1, styles.DEADLINE if self.ctx.deadline() is not None else styles.TEXT, 1.8, (5, 2))
        items = [("PERT (one path)", mk.line_swatch(styles.TEXT, 1.2))]
        if sim is not None:
            items.append((f"Simulation ({sim.iterations:,} runs)", mk.line_swatch(styles.WORK, 2.2)))
        items.append((deadline_text(self.ctx) if self.ctx.deadline() is not None else "Target date",
                      mk.line_swatch(styles.DEADLINE, 1.8, (5, 2))))
        mk.legend(c, 0, 2, items)

    def _guides(self, ax: Axes) -> None:
        """Dotted guides from 50/80/90 % across to the curve and down to the date."""
        c, sim = ax.canvas, self.ctx.simulation
        c.saveState()
        c.setFont(styles.BOLD, 8)
        for p in (0.5, 0.8, 0.9):
            x = sim.percentile(p * 100) if sim is not None else og.pert_offset_at(self.ctx.analysis.pert, p)
            c.setStrokeColor(styles.MUTED)
            c.setLineWidth(0.7)
            c.setDash(1.5, 1.5)
            c.line(ax.x, ax.py(p), ax.px(x), ax.py(p))
            c.line(ax.px(x), ax.y, ax.px(x), ax.py(p))
            label = clean(f"P{int(p * 100)} {format_date(self.ctx.date_of(x))}")
            c.setFillColor(_WHITE)
            c.rect(ax.px(x) + 2, ax.py(p) - 12, c.stringWidth(label, styles.BOLD, 8) + 2, 10, stroke=0, fill=1)
            c.setFillColor(styles.TEXT)
            c.drawString(ax.px(x) + 3, ax.py(p) - 10, label)
        c.restoreState()
