"""Resource-aware simulation: each iteration's sampled durations are scheduled by the serial
scheme with one fixed priority order — the levelled schedule's start order — so crews
and machines hold work back in every iteration as they would on site. A fixed priority
policy is the usual approach for stochastic resource-constrained scheduling (common
practice: the order is chosen once, before the durations are known).

A plan with progress is simulated from its status date as the logic-only simulation is:
done work sits on its actual dates and holds no crew any more, remaining work starts
after the status date and waits for the crews (the floors and cut links of
:mod:`.progress`, through :func:`.levelling.engine_bounds`).

An activity counts as critical in an iteration when it drives an activity that finishes
last (every one that ties for last, such as a finish milestone), through a chain of
drivers: an activity's drivers are the predecessors whose links set its start (all of
them when they tie, as all have no float) or, when a resource held it, the activities
that finished at that moment and freed the resource.
"""

from __future__ import annotations

import numpy as np

from .errors import PlanError
from .levelling import Leveller, level

EPS = 1e-9


class ResourcePasses:
    """Drop-in for the block passes of :mod:`.montecarlo`: finish and criticality per
    block of sampled durations (activities × iterations)."""

    def __init__(self, plan, analysis=None, rule: str = "lft"):
        if not plan.resources:
            raise PlanError("the plan has no resources: a resource-aware simulation needs at least one", "resources")
        self.leveller = Leveller(plan, analysis)
        self.key = list(level(plan, rule=rule, analysis=self.leveller.analysis).order)
        self.net = self.leveller.analysis.schedule.network
        self.varying = self.leveller.finish_floor is not None      # floors that move with durations

    def run(self, durations: np.ndarray, deadline=None, valid: int | None = None):
        n, b = durations.shape
        valid = b if valid is None else valid
        finish = np.zeros(b)
        critical = np.zeros(n, dtype=np.int64)
        offsets = self.net.link_offsets(durations)
        problem = self.leveller.problem
        floors = self.leveller.floors(durations) if self.varying else None
        for it in range(b):
            d = durations[:, it].tolist()
            floor = None if floors is None else floors[:, it].tolist()
            starts, why = problem.schedule(self.key, d, offsets[:, it].tolist(), explain=True, floor=floor)
            ends = [s + x for s, x in zip(starts, d)]
            finish[it] = max(ends) if n else 0.0
            if it < valid and n:
                for j in self._critical(finish[it], starts, ends, why, offsets[:, it]):
                    critical[j] += 1
        critical[self.leveller.done] = 0           # done work is never critical (as logic-only)
        return finish, critical

    def _critical(self, finish: float, starts, ends, why, offsets) -> set[int]:
        """Every activity driving an activity that finishes last (a finish milestone ties
        with the work before it: both are critical)."""
        found: set[int] = set()
        for last in range(len(ends)):
            if ends[last] >= finish - EPS and last not in found:
                found.update(self._chain(last, starts, ends, why, offsets))
        return found

    def _chain(self, last: int, starts, ends, why, offsets) -> set[int]:
        """Every activity that drives ``last``, back to the start: all predecessors whose
        links set its start (when two tie, both drive it, as both have no float) or, when a
        resource held it, every activity that freed that resource at that moment."""
        problem, found, todo = self.leveller.problem, set(), [last]
        while todo:
            j = todo.pop()
            if j in found:
                continue
            found.add(j)
            s = starts[j]
            if why[j].resource is not None:
                r = problem.resource_ids.index(why[j].resource)
                todo.extend(k for k in range(problem.n) if k not in found and abs(ends[k] - s) < EPS
                            and any(rr == r for rr, _ in problem.needs[k]))
            elif s > problem.floor[j] - EPS:
                todo.extend(i for i, e in problem.preds[j] if i not in found and abs(starts[i] + offsets[e] - s) < EPS)
        return found