"""Trade-off chart geometry shared by the window and the pack: the cost curves against the
finish (plan units from the start; the caller labels them as dates), the deadline, the
optimum, and the confidence plans as points of cost against chance."""

from __future__ import annotations

from dataclasses import dataclass

import numpy as np
from workbench.core.formatting import format_whole_percent

DIRECT, INDIRECT, TOTAL = "#0072B2", "#56B4E9", "#D55E00"
DEADLINE, OPTIMUM, CHANCE = "#CC79A7", "#000000", "#E69F00"
CHANCE_TICKS = (0, 20, 40, 60, 80, 100)      # the chance axis, in per cent: both ends always labelled


@dataclass
class CurveLines:
    durations: np.ndarray
    direct: np.ndarray
    indirect: np.ndarray
    total: np.ndarray
    optimum: tuple[float, float]          # (duration, total cost)
    deadline: float | None


def curve_lines(result) -> CurveLines:
    """Direct, indirect and total cost at every breakpoint (and the deadline, where the
    penalty bends the total), shortest first; past the normal finish the curve stops."""
    pts = result.curve.points
    xs = sorted({p.duration for p in pts} | ({result.deadline} if result.deadline is not None
                                             and pts[0].duration < result.deadline < pts[-1].duration else set()))
    direct = np.array([result.curve.at(x).direct_cost for x in xs])
    xs = np.array(xs, float)
    indirect = result.indirect_cost * xs
    total = np.array([result.total_cost(x, d) for x, d in zip(xs, direct)])
    o = result.optimum
    return CurveLines(xs, direct, indirect, total, (o.duration, result.total_cost(o.duration, o.direct_cost)),
                      result.deadline)


@dataclass
class ChancePoint:
    label: str
    chance: float
    standard_error: float
    extra_cost: float
    textbook: bool = False

    @property
    def short_label(self) -> str:
        """The label beside the point on a chart (the table keeps the full one)."""
        return "mean schedule" if self.textbook else self.label


def chance_points(result) -> list[ChancePoint]:
    """The textbook crash to the deadline and every reachable confidence plan."""
    out = []
    d = result.to_deadline
    if d is not None:
        out.append(ChancePoint("mean-schedule plan: crash the mean to the deadline", d.chance, d.standard_error,
                               d.point.direct_cost - result.problem.base_cost, True))
    for c in result.confidence:
        if c.reachable:
            out.append(ChancePoint(f"{format_whole_percent(c.target)} plan", c.chance_out_of_sample, c.standard_error, c.extra_cost))
    return out


def merged(points: list[ChancePoint]) -> list[ChancePoint]:
    """Points that land on the same spot (the same crash) drawn once, their labels joined:
    e.g. when the plan already meets every target without buying time."""
    out: list[ChancePoint] = []
    for p in points:
        same = next((q for q in out if abs(q.chance - p.chance) < 1e-9 and abs(q.extra_cost - p.extra_cost) < 0.5), None)
        if same is None:
            out.append(ChancePoint(p.label, p.chance, p.standard_error, p.extra_cost, p.textbook))
        else:
            same.label = f"{same.label}; {p.label}"
    return out


def cost_span(costs) -> tuple[float, float]:
    """The extra-cost axis: from zero to a little above the dearest plan (never empty)."""
    hi = max([0.0, *costs])
    return 0.0 - 0.08 * (hi or 1000.0), (hi or 1000.0) * 1.15


def money(value: float) -> str:
    """Short money labels for axes: 950, 5k, 12.5k, 1.25M (no currency: the plan's own)."""
    v = abs(value)
    sign = "-" if value < 0 else ""
    if v >= 1e6:
        return f"{sign}{v / 1e6:.3g}M"
    if v >= 1e3:
        return f"{sign}{v / 1e3:.3g}k"
    return f"{value:,.0f}"


def nice_ticks(lo: float, hi: float, most: int = 6) -> list[float]:
    """Round tick values (1, 2, 2.5 or 5 × a power of ten) covering [lo, hi]."""
    span = hi - lo
    if not np.isfinite(span) or span <= 0:
        return [lo]
    raw = span / max(most - 1, 1)
    power = 10.0 ** np.floor(np.log10(raw))
    step = next(m * power for m in (1, 2, 2.5, 5, 10) if m * power >= raw)
    first = np.ceil(lo / step - 1e-9) * step
    return [float(first + k * step) for k in range(int(np.floor((hi - first) / step + 1e-9)) + 1)]


def span_with_margin(values, share: float = 0.06) -> tuple[float, float]:
    lo, hi = float(np.min(values)), float(np.max(values))
    pad = (hi - lo) * share or max(abs(hi), 1.0) * share
    return lo - pad, hi + pad
