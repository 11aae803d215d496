"""Geometry of the odds trend: the chance of the committed date over status dates.

One point per status date (``plan.odds_trend``): the chance of the deadline by simulation
(the thick line) and by PERT (the thin one), with the approved baseline's odds as the first,
hollow mark, and the plan's target confidence as a level line. x values are calendar day
numbers (``date.toordinal()``), so updates a week or a month apart sit honestly spaced.
Shared by the Odds view and the approval pack.
"""

from __future__ import annotations

import datetime as dt
from dataclasses import dataclass, field

import numpy as np
from workbench.core.formatting import format_whole_percent

STEADY = 0.01     # a move smaller than one percentage point reads as "steady"


@dataclass
class TrendFigure:
    x: np.ndarray                     # day numbers of the status dates
    simulation: np.ndarray            # chance of the deadline by simulation (NaN where unknown)
    pert: np.ndarray                  # ... by PERT
    dates: list[dt.date]
    target: float                     # the plan's target confidence
    x_lo: float
    x_hi: float
    baseline: tuple[float, float, str] | None = None   # (x, chance, name) of the approved baseline
    deadline_moves: list[tuple[float, str]] = field(default_factory=list)   # where the deadline changed
    ticks: list[tuple[float, str]] = field(default_factory=list)

    @property
    def empty(self) -> bool:
        return self.x.size == 0 and self.baseline is None


def _chance(value) -> float:
    return float("nan") if value is None else float(value)


def trend_figure(points, target: float = 0.8, baseline=None) -> TrendFigure:
    """The figure of ``points`` (TrendPoints by status date) and, optionally, the approved
    ``baseline`` (its simulation odds, else PERT, at its status date or recording date)."""
    dates = [p.status_date for p in points]
    x = np.array([d.toordinal() for d in dates], dtype=float)
    sim = np.array([_chance(p.simulation_probability) for p in points])
    pert = np.array([_chance(p.pert_probability) for p in points])
    mark = _baseline_mark(baseline)
    xs = list(x) + ([mark[0]] if mark else [])
    lo, hi = (min(xs), max(xs)) if xs else (0.0, 1.0)
    pad = max(3.0, 0.06 * (hi - lo))
    fig = TrendFigure(x, sim, pert, dates, float(target), lo - pad, hi + pad, mark)
    fig.deadline_moves = _deadline_moves(points)
    fig.ticks = date_ticks(fig.x_lo, fig.x_hi)
    return fig


def _baseline_mark(baseline):
    if baseline is None:
        return None
    odds = baseline.simulation or baseline.pert
    if odds is None or odds.probability is None:
        return None
    day = baseline.status_date or baseline.recorded
    return float(day.toordinal()), float(odds.probability), baseline.name


def _deadline_moves(points) -> list[tuple[float, str]]:
    out = []
    for before, after in zip(points, points[1:]):
        if before.deadline != after.deadline and after.deadline is not None:
            out.append((float(after.status_date.toordinal()), f"deadline now {after.deadline.isoformat()}"))
    return out


def date_ticks(lo: float, hi: float, most: int = 7) -> list[tuple[float, str]]:
    """Ticks on whole days: weekly, fortnightly or monthly steps to stay under ``most``."""
    first, last = int(np.ceil(lo)), int(np.floor(hi))
    span = max(1, last - first)
    for step in (1, 7, 14, 28, 56, 91, 182, 364):
        if span / step <= most:
            break
    start = dt.date.fromordinal(first)
    if step >= 28:        # months: the first of each month
        return _month_ticks(first, last, max(1, step // 28))
    if step >= 7:
        first += (7 - start.weekday()) % 7      # Mondays
    return [(float(d), dt.date.fromordinal(d).strftime("%d %b").lstrip("0")) for d in range(first, last + 1, step)]


def _month_ticks(first: int, last: int, every: int) -> list[tuple[float, str]]:
    day = dt.date.fromordinal(first).replace(day=1)
    out = []
    while day.toordinal() <= last:
        if day.toordinal() >= first and (day.month - 1) % every == 0:
            out.append((float(day.toordinal()), day.strftime("%b %Y")))
        day = (day + dt.timedelta(days=32)).replace(day=1)
    return out


def headline(points, baseline=None) -> str:
    """One sentence a board remembers: where the chance of the committed date stands, and
    whether it is rising, falling or steady since the previous update (simulation first)."""
    series = [(p.status_date, p.simulation_probability if p.simulation_probability is not None else p.pert_probability)
              for p in points]
    series = [(d, c) for d, c in series if c is not None]
    mark = _baseline_mark(baseline)
    if not series:
        return "No odds recorded yet: run a simulation after moving the status date."
    day, now = series[-1]
    text = f"Chance of the committed date on {_day(day)}: {format_whole_percent(now)}"
    if len(series) > 1:
        before_day, before = series[-2]
        text += f", {direction(before, now)} from {format_whole_percent(before)} on {_day(before_day)}"
    if mark is not None:
        text += f"; {format_whole_percent(mark[1])} when '{mark[2]}' was approved"
    return text + "."


def direction(before: float, now: float) -> str:
    if now > before + STEADY:
        return "up"
    if now < before - STEADY:
        return "down"
    return "steady"


def _day(day: dt.date) -> str:
    return f"{day.day} {day.strftime('%b %Y')}"
