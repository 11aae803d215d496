"""Resource loading: the units of each resource in use over time for a schedule (the early
dates, or levelled dates), beside what is available, and the periods where the schedule
asks for more than there is."""

from __future__ import annotations

from dataclasses import dataclass, field

import numpy as np

EPS = 1e-9


@dataclass
class Loading:
    """One resource's use as a step function: ``use[k]`` units on [times[k], times[k+1])
    (nothing after the last time); ``available[k]`` likewise; ``over`` lists the
    over-allocated periods as (start, end, most units in use, units available)."""

    resource: str
    name: str
    times: np.ndarray
    use: np.ndarray
    available: np.ndarray
    over: list[tuple[float, float, float, float]] = field(default_factory=list)

    @property
    def peak(self) -> float:
        return float(self.use.max()) if self.use.size else 0.0

    def to_dict(self, date_of=None) -> dict:
        periods = []
        for a, b, used, avail in self.over:
            item = {"start": _r(a), "end": _r(b), "in_use": _r(used), "available": _r(avail)}
            if date_of is not None:
                item["start_date"], item["end_date"] = date_of(a, b)
            periods.append(item)
        return {"name": self.name, "peak": _r(self.peak), "over_allocated": periods}


def _r(x: float) -> float:
    r = round(float(x), 9)
    return 0.0 if r == 0 else r


def loading(plan, starts, durations, profile) -> list[Loading]:
    """Per resource of ``plan``: its use for activities starting at ``starts`` (offsets,
    plan order) and lasting ``durations``; ``profile`` (:class:`~.sgs.Profile`) gives the
    units available over time."""
    starts = np.asarray(starts, dtype=float)
    ends = starts + np.asarray(durations, dtype=float)
    out = []
    for r_index, res in enumerate(plan.resources):
        rows = [(k, u) for k, act in enumerate(plan.activities) for rid, u in act.resources
                if rid == res.id and u > 0 and ends[k] > starts[k] + EPS]
        ks = np.array([k for k, _ in rows], dtype=np.int64)
        units = np.array([u for _, u in rows], dtype=float)
        cuts = np.unique(np.concatenate((starts[ks], ends[ks], np.asarray(profile.times, dtype=float))))
        delta = np.zeros(cuts.size)
        np.add.at(delta, np.searchsorted(cuts, starts[ks]), units)
        np.add.at(delta, np.searchsorted(cuts, ends[ks]), -units)
        use = np.cumsum(delta)
        use[np.abs(use) < EPS] = 0.0
        k = np.searchsorted(np.asarray(profile.times), cuts, side="right") - 1
        avail = np.asarray(profile.free[r_index], dtype=float)[np.maximum(k, 0)]
        out.append(Loading(res.id, res.name, cuts, use, avail, _over(cuts, use, avail)))
    return out


def _over(times, use, avail) -> list[tuple[float, float, float, float]]:
    """Runs of intervals where use exceeds availability (the last interval is empty)."""
    bad = use > avail + EPS
    periods, k, n = [], 0, times.size - 1
    while k < n:
        if bad[k]:
            j = k
            while j + 1 < n and bad[j + 1]:
                j += 1
            periods.append((float(times[k]), float(times[j + 1]), float(use[k:j + 1].max()),
                            float(avail[k:j + 1].min())))
            k = j + 1
        else:
            k += 1
    return periods


def plan_loading(analysis, starts=None) -> list[Loading]:
    """Loading of an analysed plan at its early starts (or the ``starts`` given)."""
    from .levelling import profile_for

    s = analysis.schedule
    return loading(analysis.plan, s.es if starts is None else starts, s.durations,
                   profile_for(analysis.plan, analysis.calendar))
