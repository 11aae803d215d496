"""Baselines and the odds trend: what was approved, and how the odds moved since. No Qt.

A *baseline* is a named, dated snapshot of the plan: every activity's planned start and
finish dates and estimates, the links, the project finish, the PERT and simulation
figures (P50/P80/P90, the chance of the deadline, iterations and seed) and the plan
hash. A plan keeps several, at most one marked *approved*.

The *odds trend* is one point per status date: the deadline, the chance of it by PERT
and by simulation, the simulated P50/P80/P90 and the plan hash. Recording a point for a
status date that already has one replaces it (the latest run of that update counts).
"""

from __future__ import annotations

import datetime as dt
from dataclasses import dataclass, replace

import numpy as np

from .errors import PlanError
from .model import Link
from .progress_fields import NOT_STARTED


@dataclass(frozen=True)
class OddsFigures:
    """The odds at one moment, by PERT or by simulation (dates are finish dates)."""

    method: str                         # "pert" or "simulation"
    p50: dt.date
    p80: dt.date
    p90: dt.date
    probability: float | None = None    # chance of the deadline (None: no deadline)
    iterations: int | None = None       # simulation only
    seed: int | None = None


@dataclass(frozen=True)
class BaselineActivity:
    id: str
    start: dt.date
    finish: dt.date
    optimistic: float | None = None
    most_likely: float | None = None
    pessimistic: float | None = None
    duration: float | None = None

    def estimate(self) -> tuple:
        return (self.optimistic, self.most_likely, self.pessimistic, self.duration)


@dataclass(frozen=True)
class Baseline:
    name: str
    recorded: dt.date
    finish: dt.date
    plan_hash: str
    activities: tuple[BaselineActivity, ...]
    links: tuple[Link, ...] = ()
    pert: OddsFigures | None = None
    simulation: OddsFigures | None = None
    deadline: dt.date | None = None
    status_date: dt.date | None = None
    approved: bool = False

    def activity(self, act_id: str) -> BaselineActivity | None:
        return next((a for a in self.activities if a.id == act_id), None)


@dataclass(frozen=True)
class TrendPoint:
    status_date: dt.date
    deadline: dt.date | None
    pert_probability: float | None
    simulation_probability: float | None
    p50: dt.date
    p80: dt.date
    p90: dt.date
    plan_hash: str
    iterations: int = 0
    seed: int = 0


# --- making them ------------------------------------------------------------------
def planned_dates(analysis) -> tuple[np.ndarray, np.ndarray]:
    """Per activity the start and finish dates a planner reads: actual start where work
    has started (the engine's early start is then that of the remaining work)."""
    dates = analysis.dates()
    start, finish = dates["early_start"].copy(), dates["early_finish"]
    frame = analysis.progress
    if frame is not None:
        started = np.flatnonzero(frame.state != NOT_STARTED)
        if started.size:
            start[started] = analysis.calendar.start_dates(frame.actual_start[started])
            mile = analysis.schedule.durations[started] == 0
            start[started[mile]] = finish[started[mile]]
    return start, finish


def pert_figures(analysis) -> OddsFigures:
    return OddsFigures("pert", *(analysis.date_at(p) for p in (0.5, 0.8, 0.9)), analysis.probability_by_deadline())


def simulation_figures(result) -> OddsFigures:
    days = [result.date_of(result.percentile(p)) for p in (50, 80, 90)]
    chance = None if result.deadline is None else float(result.prob_by(result.deadline)[0])
    return OddsFigures("simulation", *days, chance, int(result.iterations), int(result.seed))


def make_baseline(name: str, analysis, plan_hash: str, simulation=None, recorded: dt.date | None = None,
                  approved: bool = False) -> Baseline:
    """A baseline of the analysed plan now (``simulation``: a SimulationResult of it, or None)."""
    name = check_name(name)
    plan = analysis.plan
    start, finish = planned_dates(analysis)
    starts = start.astype("datetime64[D]").astype(dt.date).tolist()
    finishes = finish.astype("datetime64[D]").astype(dt.date).tolist()
    acts = tuple(BaselineActivity(a.id, s, f, a.optimistic, a.most_likely, a.pessimistic, a.duration)
                 for a, s, f in zip(plan.activities, starts, finishes))
    deadline = None if analysis.deadline is None else analysis.date_of_duration(analysis.deadline)
    return Baseline(name, recorded or dt.date.today(), analysis.finish_date, plan_hash, acts, tuple(plan.links),
                    pert_figures(analysis), None if simulation is None else simulation_figures(simulation),
                    deadline, plan.settings.status_date, approved)


def make_trend_point(analysis, simulation, plan_hash: str) -> TrendPoint:
    """The odds trend point of a simulation run from the analysis' status date."""
    frame = analysis.progress
    day = frame.status_date if frame is not None else (analysis.plan.settings.status_date or analysis.start_date)
    sim = simulation_figures(simulation)
    deadline = None if analysis.deadline is None else analysis.date_of_duration(analysis.deadline)
    return TrendPoint(day, deadline, analysis.probability_by_deadline(), sim.probability, sim.p50, sim.p80, sim.p90,
                      plan_hash, sim.iterations, sim.seed)


def check_name(name) -> str:
    if not isinstance(name, str) or not name.strip():
        raise PlanError("a baseline needs a name", "baseline")
    if len(name) > 80:
        raise PlanError(f"baseline name {name[:20]!r}… is {len(name)} characters long; use at most 80", "baseline")
    return name.strip()


# --- lists of them (return new lists: commands keep the old one for undo) -------------
def with_baseline(baselines: list[Baseline], new: Baseline) -> list[Baseline]:
    """Add ``new`` (refusing a name in use); when it is approved, no other one stays so."""
    if any(b.name == new.name for b in baselines):
        raise PlanError(f"a baseline named {new.name!r} exists already; choose another name", "baseline")
    kept = [replace(b, approved=False) for b in baselines] if new.approved else list(baselines)
    return kept + [new]


def renamed(baselines: list[Baseline], old: str, new: str) -> list[Baseline]:
    find(baselines, old)
    new = check_name(new)
    if new != old and any(b.name == new for b in baselines):
        raise PlanError(f"a baseline named {new!r} exists already; choose another name", "baseline")
    return [replace(b, name=new) if b.name == old else b for b in baselines]


def approved_as(baselines: list[Baseline], name: str | None) -> list[Baseline]:
    """Mark ``name`` approved (None: none is)."""
    if name is not None:
        find(baselines, name)
    return [replace(b, approved=(b.name == name)) for b in baselines]


def without(baselines: list[Baseline], name: str) -> list[Baseline]:
    find(baselines, name)
    return [b for b in baselines if b.name != name]


def find(baselines: list[Baseline], name: str) -> Baseline:
    for b in baselines:
        if b.name == name:
            return b
    known = ", ".join(repr(b.name) for b in baselines) or "none recorded"
    raise PlanError(f"no baseline named {name!r} (baselines: {known})", "baseline")


def approved(baselines: list[Baseline]) -> Baseline | None:
    return next((b for b in baselines if b.approved), None)


def chosen(baselines: list[Baseline], name: str | None = None) -> Baseline | None:
    """The named baseline, else the approved one, else None."""
    return find(baselines, name) if name else approved(baselines)


def with_trend_point(points: list[TrendPoint], point: TrendPoint) -> list[TrendPoint]:
    """Add a point, replacing one of the same status date; ordered by status date."""
    kept = [p for p in points if p.status_date != point.status_date]
    return sorted(kept + [point], key=lambda p: p.status_date)
