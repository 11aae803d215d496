"""A plan prepared for crashing: its network, PERT means, crash ranges and cost slopes,
and the deterministic linear programme at any project duration T."""

from __future__ import annotations

import numpy as np

from .analysis import moments
from .calendar import WorkCalendar
from .cpm import Analyzer, constraint_bounds
from .crash_lp import Rows, Solution, finish_rows_needed, schedule_rows, solve
from .crash_terms import cost_slope, crash_range, missing_crash_data
from .duration_lp import DurationLP
from .errors import PlanError
from .network import compile_plan

TIE_BREAK = 1e-9
FEASIBLE_SLACK = 1e-9   # relative: durations within this of the shortest count as reachable


def has_cost_data(plan) -> bool:
    return any(a.cost is not None for a in plan.activities)


class CrashProblem:
    """Everything the curve and the confidence search share about one plan."""

    def __init__(self, plan):
        plan.settings.validated()
        if not has_cost_data(plan):
            raise PlanError("the plan has no cost data: give activities a cost, and a crash cost and "
                            "crash estimate where they can be shortened", "cost")
        self.plan = plan
        self.calendar = WorkCalendar(plan.settings)
        self.net = compile_plan(plan)
        self.ids = self.net.ids
        acts = [plan.activity(i) for i in self.ids]
        self.te, self.variances = (v[[plan.row_of(i) for i in self.ids]] for v in moments(plan))
        self.span = np.array([crash_range(a) for a in acts])
        self.slope = np.array([cost_slope(a) for a in acts])
        self.base_cost = float(sum(a.cost or 0.0 for a in acts))
        # activities given half their crash data: kept, but not shortened ({id: what is missing})
        self.incomplete = {a.id: m for a in acts if (m := missing_crash_data(a)) is not None}
        self.crashable = np.flatnonzero(self.span > 0)
        floor, fnlt = constraint_bounds(plan, self.calendar)
        order = [plan.row_of(i) for i in self.ids]
        self.floor, self.fnlt = np.maximum(floor[order], 0.0), fnlt[order]
        self.sinks = finish_rows_needed(self.net)
        self.normal_finish = Analyzer(self.net, self.floor, self.fnlt).run(self.te, paths=False).finish
        self._rows: Rows | None = None
        self._lp: DurationLP | None = None

    @property
    def size(self) -> int:
        return self.net.size

    def columns(self) -> tuple[np.ndarray, np.ndarray, int]:
        """Column of each S_i and x_i (−1 when not crashable), and the column count."""
        n, k = self.size, self.crashable.size
        x_col = np.full(n, -1, dtype=np.int64)
        x_col[self.crashable] = n + np.arange(k)
        return np.arange(n), x_col, n + k

    def bounds(self) -> np.ndarray:
        k = self.crashable.size
        lower = np.concatenate([self.floor, np.zeros(k)])
        upper = np.concatenate([np.full(self.size, np.inf), self.span[self.crashable]])
        return np.column_stack([lower, upper])

    def crash_prices(self) -> np.ndarray:
        """The LP's price per unit bought of each crashable activity: its cost slope, and
        for a free crash (crash cost = normal cost) a billionth of the dearest slope, so
        the LP does not buy free days it does not need."""
        slopes = self.slope[self.crashable]
        return np.where(slopes > 0, slopes, TIE_BREAK * max(1.0, float(slopes.max(initial=0.0))))

    def objective(self) -> np.ndarray:
        return np.concatenate([np.zeros(self.size), self.crash_prices()])

    def rows(self) -> Rows:
        if self._rows is None:
            s_col, x_col, _ = self.columns()
            self._rows = schedule_rows(self.net, self.te, np.ones(self.size), s_col, x_col, self.sinks)
        return self._rows

    def days(self, values: np.ndarray) -> np.ndarray:
        """Days bought per activity (network order) from an LP solution vector."""
        out = np.zeros(self.size)
        out[self.crashable] = np.clip(values[self.size: self.size + self.crashable.size], 0.0,
                                      self.span[self.crashable])
        return out

    def at(self, T: float) -> Solution | None:
        """The cheapest crash that finishes by T (None when T cannot be reached). One
        model serves every T, each solve starting from the last one's basis."""
        if self._lp is None:
            _, _, ncol = self.columns()
            self._lp = DurationLP(self.rows(), ncol, self.objective(), self.bounds())
        return self._lp.at(T)

    def shortest(self) -> float:
        """The shortest project duration any crash reaches (the links may make a fully
        crashed plan longer than that: an activity driven through its finish and driving
        through its start)."""
        if self.crashable.size == 0:
            return self.normal_finish
        rows = self.rows()
        _, _, ncol = self.columns()
        tied = np.flatnonzero(rows.t > 0)
        extended = Rows(np.concatenate([rows.row, tied]), np.concatenate([rows.col, np.full(tied.size, ncol)]),
                        np.concatenate([rows.val, -np.ones(tied.size)]), rows.b, np.zeros_like(rows.t))
        objective = np.concatenate([np.zeros(ncol), [1.0]])
        found = solve(extended, ncol + 1, objective, np.vstack([self.bounds(), [-np.inf, np.inf]]), 0.0)
        return min(float(found.values[-1]), self.normal_finish)

    def direct_cost(self, days: np.ndarray) -> float:
        return self.base_cost + float(np.dot(self.slope, days))
