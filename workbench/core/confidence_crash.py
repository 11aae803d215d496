"""Crash to a confidence: the cheapest days bought so that the chance of finishing by the
deadline reaches a target, by sample average approximation.

Method. One fixed set of N scenarios (common random numbers, :mod:`.crash_scenarios`)
stands in for the odds: a crash reaches the target in sample when at least ⌈target·N⌉
scenarios finish by the deadline. Choosing *which* scenarios to meet is the hard
(mixed-integer) part; for a chosen set K the cheapest crash meeting all of K is one linear
programme, because every scenario's durations are linear in the days bought. So the
search alternates: rank the scenarios by their finish under the current crash, keep the
⌈target·N⌉ earliest as K, solve the LP for K (scenario rows are added only when violated:
constraint generation keeps the LP small). The current crash meets all of the new K, so
each round costs no more than the last; it stops when a round saves nothing. It starts
from both no crash and the deterministic crash to the deadline and keeps the cheaper.
Why: exact for a fixed K, monotone, and it uses the same LP as the deterministic curve;
a greedy by criticality would need a polish by this very LP anyway.

The in-sample chance of an optimised plan flatters it (the plan was fitted to those
scenarios), so the search aims one standard error above the target in sample
(⌈(p + √(p(1−p)/N))·N⌉ scenarios, or as many as full crashing meets if fewer); the honest figure is the chance on a fresh,
independent scenario set, with its standard error √(p(1−p)/N).
"""

from __future__ import annotations

import math
from dataclasses import dataclass

import numpy as np

from .crash_lp import schedule_rows, solve, stack
from .crash_scenarios import MET
from .montecarlo import SimulationCancelled

ROUNDS = 8
GUARD = 1.0          # standard errors aimed above the target in sample
MARGIN = 1e-7        # the LP aims this far inside the deadline (its feasibility tolerance)


@dataclass
class ConfidencePlan:
    target: float
    days: np.ndarray | None        # days bought per activity (network order); None: unreachable
    extra_cost: float
    chance_in_sample: float
    chance_out_of_sample: float
    standard_error: float
    solves: int = 0

    @property
    def reachable(self) -> bool:
        return self.days is not None


class _Search:
    def __init__(self, problem, scenarios, tick):
        self.p, self.sc, self.tick, self.solves = problem, scenarios, tick, 0
        n, k = problem.size, problem.crashable.size
        self.x_col = np.full(n, -1, dtype=np.int64)
        self.x_col[problem.crashable] = np.arange(k)
        self.objective_x = problem.crash_prices()
        self.T = scenarios.deadline - MARGIN * max(1.0, abs(scenarios.deadline))

    def lp(self, which: list[int]) -> np.ndarray | None:
        """The cheapest crash meeting every scenario in ``which``."""
        p, sc = self.p, self.sc
        n, k = p.size, p.crashable.size
        parts, row0 = [], 0
        for j, s in enumerate(which):
            r = schedule_rows(p.net, sc.normal[:, s], sc.gain[:, s], k + j * n + np.arange(n), self.x_col, p.sinks, row0)
            row0 += r.b.size
            parts.append(r)
        ncol = k + len(which) * n
        objective = np.concatenate([self.objective_x, np.zeros(len(which) * n)])
        bounds = [(0.0, s) for s in p.span[p.crashable]] + [(f, None) for f in p.floor] * len(which)
        self.tick()
        self.solves += 1
        sol = solve(stack(parts), ncol, objective, bounds, self.T, "the confidence search")
        if sol is None:
            return None
        days = np.zeros(n)
        days[p.crashable] = np.clip(sol.values[:k], 0.0, p.span[p.crashable])
        return days

    def meet(self, keep: np.ndarray, start: np.ndarray) -> np.ndarray | None:
        """The cheapest crash meeting every scenario in ``keep``, by constraint generation."""
        finish = self.sc.finishes(start)
        worst = keep[np.argsort(finish[keep])[::-1]]
        active = set(worst[: max(16, keep.size // 20)].tolist())
        while True:
            days = self.lp(sorted(active))
            if days is None:
                return None
            finish = self.sc.finishes(days)
            late = keep[finish[keep] > self.sc.deadline + MET]
            fresh = [s for s in late.tolist() if s not in active]
            if not fresh:
                return days
            active.update(fresh)

    def run(self, start: np.ndarray, need: int) -> np.ndarray | None:
        days, best = start, None
        for _ in range(ROUNDS):
            keep = np.argsort(self.sc.finishes(days), kind="stable")[:need]
            found = self.meet(keep, days)
            if found is None:
                return best
            if best is not None and self.cost(found) >= self.cost(best) * (1 - 1e-9) - 1e-9:
                return best
            best = days = found
        return best

    def cost(self, days: np.ndarray) -> float:
        return float(np.dot(self.p.slope, days))


def _ticker(progress, cancel, total: int):
    state = {"done": 0}

    def tick():
        if cancel is not None and cancel():
            raise SimulationCancelled("the trade-off search was cancelled")
        state["done"] += 1
        if progress is not None:
            progress(min(state["done"], total - 1), total)
    return tick


def crash_to_confidence(problem, target: float, inside, outside, starts, progress=None, cancel=None) -> ConfidencePlan:
    """The cheapest crash whose in-sample chance (scenario set ``inside``) reaches ``target``;
    its chance on ``outside`` (an independent set) with the standard error."""
    n = inside.iterations
    reachable = int(np.sum(inside.finishes(problem.span) <= inside.deadline + MET))
    need = min(reachable, n, math.ceil((target + GUARD * _se(target, n)) * n - 1e-9))
    search = _Search(problem, inside, _ticker(progress, cancel, 40))
    full = problem.span.copy()
    if reachable < math.ceil(target * n - 1e-9):
        return ConfidencePlan(target, None, math.nan, inside.chance(full), outside.chance(full),
                              _se(outside.chance(full), outside.iterations), search.solves)
    found = [d for d in (search.run(s, need) for s in starts) if d is not None]
    if not found:          # from every start the LP met no wider set: search from the full crash,
        found = [d for d in (search.run(full, need),) if d is not None] or [full]   # which reaches it
    days = min(found, key=search.cost)
    out = outside.chance(days)
    return ConfidencePlan(target, days, search.cost(days), inside.chance(days), out,
                          _se(out, outside.iterations), search.solves)


def _se(p: float, n: int) -> float:
    return math.sqrt(max(p * (1 - p), 0.0) / n)
