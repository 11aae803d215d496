"""The serial schedule-generation scheme for resource-constrained scheduling.

Activities are taken one at a time, in priority order among those whose predecessors are
all scheduled (R. Kolisch, "Serial and parallel resource-constrained project scheduling
methods revisited", European Journal of Operational Research 90, 1996), and each is put
at the earliest start that keeps every link (FS/SS/FF/SF with lags, folded into one offset
between starts as in the critical-path engine) and fits within every resource's free
units over its whole duration. Time is continuous: the free units of each resource are a
step function kept as sorted breakpoints.

``ResourceProblem`` holds a plan compiled for this (Qt-free, plain Python lists so a
small plan schedules in microseconds per activity, fast enough to run once per simulated
iteration).
"""

from __future__ import annotations

import heapq
from bisect import bisect_right
from dataclasses import dataclass

from .errors import PlanError

EPS = 1e-9


@dataclass
class Placement:
    """Why an activity starts when it does: ``resource`` (an id) held it past ``earliest``
    (the start its links and constraints allow), else ``resource`` is None."""

    earliest: float
    resource: str | None


class Profile:
    """Free units of every resource over time: breakpoints ``times`` (ascending, the first
    at 0) and per resource the free units on [times[k], times[k+1]) (the last interval
    runs on for ever)."""

    def __init__(self, times: list[float], free: list[list[float]]):
        self.times = list(times)
        self.free = [list(f) for f in free]

    def copy(self) -> "Profile":
        return Profile(self.times, self.free)

    def _split(self, t: float) -> int:
        """Make ``t`` a breakpoint; return its index."""
        times = self.times
        k = bisect_right(times, t) - 1
        if k >= 0 and abs(times[k] - t) <= EPS:
            return k
        times.insert(k + 1, t)
        for f in self.free:
            f.insert(k + 1, f[k])
        return k + 1

    def earliest_fit(self, start: float, length: float, needs: list[tuple[int, float]]) -> tuple[float, int]:
        """The earliest t ≥ ``start`` at which ``needs`` fit over [t, t + length), and the
        resource (index) that last pushed it later (-1 when none did)."""
        times, free = self.times, self.free
        last = len(times) - 1
        t, held = start, -1
        k = max(bisect_right(times, t) - 1, 0)
        while True:
            end = t + length - EPS
            j, clash = k, -1
            while j <= last and times[j] < end:
                for r, q in needs:
                    if free[r][j] < q - EPS:
                        clash = r
                        break
                if clash >= 0:
                    break
                j += 1
            if clash < 0:
                return t, held
            if j == last:
                raise _never_fits(clash)
            t, held, k = times[j + 1], clash, j + 1

    def take(self, start: float, length: float, needs: list[tuple[int, float]]) -> None:
        """Use ``needs`` over [start, start + length)."""
        a = self._split(start)
        b = self._split(start + length)
        free = self.free
        for r, q in needs:
            f = free[r]
            for j in range(a, b):
                f[j] -= q


class _NeverFits(PlanError):
    pass


def _never_fits(r: int) -> PlanError:
    return _NeverFits(f"resource #{r} never has enough units free for long enough", str(r))


class ResourceProblem:
    """A plan's links, bounds, durations and resource needs, compiled for the serial scheme.

    ``preds[j]``: (i, link index) for each link i → j; ``succs[i]``: the j of each link;
    ``needs[j]``: (resource index, units) with units > 0; ``floor[j]``: the earliest start
    allowed by constraints (and the status date); ``profile``: every resource's free units
    before anything is scheduled."""

    def __init__(self, ids, src, dst, floor, needs, profile: Profile, resource_ids: list[str]):
        n = len(ids)
        self.ids, self.n = list(ids), n
        self.src, self.dst = [int(x) for x in src], [int(x) for x in dst]
        self.preds = [[] for _ in range(n)]
        self.succs = [[] for _ in range(n)]
        for e, (i, j) in enumerate(zip(self.src, self.dst)):
            self.preds[j].append((i, e))
            self.succs[i].append(j)
        self.indegree = [len(p) for p in self.preds]
        self.floor = [float(x) for x in floor]
        self.needs = needs
        self.profile = profile
        self.resource_ids = resource_ids

    def schedule(self, key, durations, offsets, explain: bool = False, floor=None):
        """Serial scheme: starts (list) for ``durations``/``offsets`` (per link, see
        ``Network.link_offsets``), taking eligible activities lowest ``key`` first (ties by
        index). With ``explain`` also a Placement per activity. ``floor`` replaces the
        problem's start floors for this schedule (they may depend on the durations)."""
        n, preds, succs, needs = self.n, self.preds, self.succs, self.needs
        floor = self.floor if floor is None else floor
        profile = self.profile.copy()
        left = list(self.indegree)
        eligible = [(key[j], j) for j in range(n) if left[j] == 0]
        heapq.heapify(eligible)
        starts = [0.0] * n
        why = [None] * n if explain else None
        pop, push = heapq.heappop, heapq.heappush
        while eligible:
            _, j = pop(eligible)
            es = floor[j]
            for i, e in preds[j]:
                v = starts[i] + offsets[e]
                if v > es:
                    es = v
            s, held = es, -1
            d = durations[j]
            need = needs[j]
            if need and d > EPS:
                try:
                    s, held = profile.earliest_fit(es, d, need)
                except _NeverFits as exc:
                    raise self._never(j, int(exc.culprit)) from None
                profile.take(s, d, need)
            starts[j] = s
            if explain:
                why[j] = Placement(es, self.resource_ids[held] if held >= 0 and s > es + EPS else None)
            for k in succs[j]:
                left[k] -= 1
                if left[k] == 0:
                    push(eligible, (key[k], k))
        return (starts, why) if explain else starts

    def _never(self, j: int, r: int) -> PlanError:
        act, res = self.ids[j], self.resource_ids[r]
        return PlanError(f"activity {act}: resource {res} never has the units it needs free for its whole "
                         f"duration (its availability periods are too short); it can never be scheduled", act)

    def makespan(self, starts, durations) -> float:
        return max((s + d for s, d in zip(starts, durations)), default=0.0)

    def reversed(self, offsets, durations, horizon: float) -> tuple["ResourceProblem", list[float]]:
        """The mirror problem (time runs back from ``horizon``; links point the other way)
        and its offsets: a start S'ᵢ = horizon − (Sᵢ + dᵢ). A link i → j with offset o
        (Sⱼ ≥ Sᵢ + o) becomes j → i with offset o + dⱼ − dᵢ. The mirrored links are built
        once; only the free units depend on ``horizon``."""
        mirror = getattr(self, "_mirror", None)
        if mirror is None:
            mirror = self._mirror = ResourceProblem.__new__(ResourceProblem)
            mirror.ids, mirror.n = self.ids, self.n
            mirror.src, mirror.dst = self.dst, self.src
            mirror.preds, mirror.succs = [[] for _ in range(self.n)], [[] for _ in range(self.n)]
            for e, (i, j) in enumerate(zip(self.src, self.dst)):
                mirror.preds[i].append((j, e))
                mirror.succs[j].append(i)
            mirror.indegree = [len(p) for p in mirror.preds]
            mirror.floor = [0.0] * self.n
            mirror.needs, mirror.resource_ids = self.needs, self.resource_ids
        mirror.profile = mirror_profile(self.profile, horizon)
        back = [o + durations[j] - durations[i] for o, i, j in zip(offsets, self.src, self.dst)]
        return mirror, back


def mirror_profile(profile: Profile, horizon: float) -> Profile:
    """Free units seen backwards from ``horizon``: the value at reversed time t is the value
    at horizon − t (intervals before 0 in forward time do not exist; after ``horizon`` in
    reversed time the first interval's units continue)."""
    times, free = profile.times, profile.free
    cuts = [t for t in times if 0 < t < horizon]
    rev_times = [0.0] + [horizon - t for t in reversed(cuts)]
    rev_free = []
    for f in free:
        values = []
        for t in rev_times:
            forward = horizon - t - EPS * 10            # just before the mirrored point
            k = max(bisect_right(times, forward) - 1, 0)
            values.append(f[k])
        rev_free.append(values)
    return Profile(rev_times, rev_free)
