"""One call from a plan to its schedule, dates and PERT odds: what every view and the
command line show. Pure data, no Qt."""

from __future__ import annotations

import datetime as dt
from dataclasses import dataclass
from operator import attrgetter

import numpy as np

from .calendar import WorkCalendar, round_offset
from .cpm import Analyzer, Schedule
from .pert import PertOdds, pert_odds
from .progress import engine_inputs, progress_frame


@dataclass
class Analysis:
    plan: object
    calendar: WorkCalendar
    schedule: Schedule
    pert: PertOdds
    means: np.ndarray
    variances: np.ndarray
    deadline: float | None
    progress: object = None      # a progress.ProgressFrame when analysed from a status date
    floor: np.ndarray | None = None     # start-no-earlier offsets (0 when none), plan order
    ceiling: np.ndarray | None = None   # finish-no-later offsets (+inf when none), plan order

    # --- dates ---------------------------------------------------------
    @property
    def start_date(self) -> dt.date:
        return self.calendar.start_date(0.0)

    @property
    def finish_date(self) -> dt.date:
        """The day the project ends: the evening of its last working day, or the morning a
        start milestone opens when one is the last thing in the plan."""
        s = self.schedule
        last = s.ef >= s.finish - 1e-9
        if not s.ef.size or bool(np.any(self.opens()[last])):
            return self.calendar.start_date(s.finish)
        return self.calendar.finish_date(s.finish)

    def opens(self) -> np.ndarray:
        """Per activity, true for a start milestone: a milestone held where it is by its own
        floor (the project start or its start-no-earlier date) rather than by a predecessor's
        finish — a gate, dated the morning it opens. Other milestones are finish milestones,
        and so is a gate whose own finish-no-later date falls at the same instant (it is then
        read by that date: "no later than Monday" stays Monday)."""
        s = self.schedule
        floor = np.zeros(s.es.size) if self.floor is None else self.floor
        ceiling = np.full(s.es.size, np.inf) if self.ceiling is None else self.ceiling
        return (s.durations == 0) & (s.es <= floor + 1e-9) & (ceiling > s.es + 1e-9)

    def date_of_duration(self, duration: float) -> dt.date:
        """The calendar day by whose end a project of this duration finishes."""
        return self.calendar.finish_date(duration)

    def dates(self) -> dict[str, np.ndarray]:
        """Calendar dates per activity; a milestone's start and finish share one date, the
        morning it opens for a start milestone, the evening it happens for a finish one."""
        s, cal = self.schedule, self.calendar
        mile, opens = s.durations == 0, self.opens()
        early = cal.milestone_dates(s.es, opens)
        late = cal.milestone_dates(s.ls, opens & self._late_opens())
        return {
            "early_start": np.where(mile, early, cal.start_dates(s.es)),
            "early_finish": np.where(mile, early, cal.finish_dates(s.ef)),
            "late_start": np.where(mile, late, cal.start_dates(s.ls)),
            "late_finish": np.where(mile, late, cal.finish_dates(s.lf)),
        }

    def _late_opens(self) -> np.ndarray:
        """Where a start milestone's late date is read as a morning too: with no float (one
        date for both), or when a successor holds it (the morning that successor must start).
        Held by its own limit (a deadline, a finish-no-later date) it reads as that evening."""
        s = self.schedule
        ceiling = np.full(s.es.size, np.inf) if self.ceiling is None else self.ceiling
        limit = np.minimum(ceiling, np.inf if s.deadline is None else s.deadline)
        return (np.abs(s.ls - s.es) <= 1e-9) | (s.lf < limit - 1e-9)

    # --- odds ----------------------------------------------------------
    def probability_by_deadline(self) -> float | None:
        return None if self.deadline is None else self.pert.prob_by(self.deadline)

    def date_at(self, probability: float) -> dt.date:
        return self.date_of_duration(self.pert.duration_at(probability))

    def to_dict(self, variance=None) -> dict:
        """The JSON contract of ``slackline analyze --json``; ``variance`` (a
        :class:`~.variance.Variance`) adds the baseline columns."""
        from .progress_json import progress_columns, progress_top, variance_columns

        s, p = self.schedule, self.pert
        columns = {k: _rounded(v) for k, v in (("es", s.es), ("ef", s.ef), ("ls", s.ls), ("lf", s.lf),
                                                ("total_float", s.total_float), ("free_float", s.free_float))}
        columns["critical"] = s.critical.tolist()
        columns["mean"], columns["variance"] = _rounded(self.means), _rounded(self.variances)
        columns.update({k: np.datetime_as_string(v, unit="D").tolist() for k, v in self.dates().items()})
        columns.update(progress_columns(self))
        if variance is not None:
            columns.update(variance_columns(variance))
        names = list(columns)
        acts = {act_id: {"name": a.name, **dict(zip(names, row))}
                for act_id, a, row in zip(s.ids, self.plan.activities, zip(*columns.values()))}
        pert = {"mean": round_offset(p.mean), "variance": round_offset(p.variance),
                "sd": round_offset(p.sd), "path": list(p.path)}
        if p.note:
            pert["note"] = p.note
        if self.deadline is not None:
            pert["deadline"] = round_offset(self.deadline)
            pert["deadline_date"] = self.date_of_duration(self.deadline).isoformat()
            pert["z"] = _finite(p.z(self.deadline))
            pert["probability"] = p.prob_by(self.deadline)
        return {
            "title": self.plan.settings.title,
            "unit": self.plan.settings.unit,
            "duration": round_offset(s.finish),
            "start": self.start_date.isoformat(),
            "finish": self.finish_date.isoformat(),
            "critical_path": list(p.path),
            "critical_paths": s.paths,
            "activities": acts,
            "pert": pert,
            **progress_top(self, variance),
        }


def _rounded(values: np.ndarray) -> list[float]:
    """:func:`round_offset` over an array: binary noise rounded away, no negative zeros."""
    r = np.round(np.asarray(values, dtype=float), 9)
    r[r == 0] = 0.0
    return r.tolist()


def _finite(value: float):
    if np.isfinite(value):
        return round_offset(value)
    return "inf" if value > 0 else "-inf"


def moments(plan) -> tuple[np.ndarray, np.ndarray]:
    """PERT mean and variance of every activity, in plan order."""
    acts = plan.activities        # numpy reads a missing value (None) as NaN
    fixed, a, m, b = (np.array(list(map(attrgetter(k), acts)), dtype=float).reshape(-1)
                      for k in ("duration", "optimistic", "most_likely", "pessimistic"))
    has = ~(np.isnan(a) | np.isnan(m) | np.isnan(b))
    means = np.where(has, (a + 4.0 * m + b) / 6.0, np.nan_to_num(fixed))
    variances = np.where(has, ((b - a) / 6.0) ** 2, 0.0)
    return means, variances


def analyze(plan, deadline=None, status_date=None) -> Analysis:
    """Schedule the plan on PERT means and compute the odds.

    ``deadline`` (an offset or a date) overrides the plan's own deadline setting;
    ``status_date`` the plan's status date. A plan with progress is scheduled from its
    status date (see :mod:`.progress`): means, variances and odds are the remaining work's.
    Raises :class:`~workbench.core.errors.PlanError` (or CycleError) naming the culprit.
    Re-analysing the same plan after edits that keep its ids and links (estimates, names,
    constraints, settings) reuses the compiled network.
    """
    plan.settings.validated()
    calendar = WorkCalendar(plan.settings)
    chosen = plan.settings.deadline if deadline is None else deadline
    dl = calendar.resolve(chosen, finish=True)
    analyzer = Analyzer.reusing(getattr(plan, "_analyzer", None), plan, calendar)
    plan._analyzer = analyzer           # the next analysis of this plan starts from here
    means, variances = moments(plan)
    frame = progress_frame(plan, calendar, status_date, means, analyzer.net)
    if frame is not None:
        analyzer = analyzer.from_status(engine_inputs(frame, analyzer.net, analyzer.floor))
        means, variances = frame.moments(means, variances)
    schedule = analyzer.run(means, deadline=dl)
    check_in_calendar(schedule, calendar, dl)
    return Analysis(plan, calendar, schedule, pert_odds(schedule, variances), means, variances, dl, frame,
                    analyzer.floor, analyzer.fnlt)


def check_in_calendar(schedule, calendar, deadline=None) -> None:
    """Refuse a schedule whose dates no calendar can show, naming the activity that goes
    furthest, or the deadline when it is the one out of range (every view and export
    converts offsets to dates later)."""
    from .calendar import MAX_DAYS, OutOfCalendar
    from .errors import PlanError

    _check_deadline_date(calendar, deadline)
    if not schedule.ef.size:
        return
    reach = np.maximum(np.abs(schedule.ef), np.abs(schedule.ls)) * calendar.per_unit
    worst = int(np.argmax(reach))
    if reach[worst] > MAX_DAYS:
        act = schedule.ids[worst]
        raise PlanError(f"activity {act}: its dates fall more than {MAX_DAYS:,} working days from the "
                        f"start, beyond any calendar; check its duration, lags and constraints", act)
    columns = (schedule.es, schedule.ef, schedule.ls, schedule.lf)
    lows = [int(np.argmin(c)) for c in columns]
    highs = [int(np.argmax(c)) for c in columns]
    for rows in (lows, highs):
        offsets = [c[r] for c, r in zip(columns, rows)]
        try:
            calendar.start_dates(offsets)
            calendar.finish_dates(offsets)
        except OutOfCalendar as exc:
            act = schedule.ids[rows[exc.worst]]
            side = "before year 1" if exc.before else "after year 9999"
            raise PlanError(f"activity {act}: its dates fall {side}, beyond any calendar; check its "
                            f"duration, lags and constraints, and the deadline", act) from None


def _check_deadline_date(calendar, deadline) -> None:
    from .calendar import OutOfCalendar
    from .errors import PlanError

    if deadline is None:
        return
    try:
        calendar.finish_dates([deadline])
    except OutOfCalendar as exc:
        side = "before year 1" if exc.before else "after year 9999"
        raise PlanError(f"settings: the deadline (offset {deadline:,.0f}) falls {side}, beyond any "
                        f"calendar; set a deadline near the plan's dates", "deadline") from None
