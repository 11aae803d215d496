"""The deterministic crash LP kept in one HiGHS model, re-solved at many durations.

The cost curve asks the same linear programme at dozens of project durations T; only the
upper bounds of the rows that hold T move. Building the model once and changing just those
bounds lets HiGHS's dual simplex start from the last optimal basis (it stays dual feasible:
the objective and the matrix do not change), so a re-solve takes a handful of pivots
instead of a solve from scratch. The answers are the same linear programme's optima.
"""

from __future__ import annotations

import numpy as np
from scipy import sparse

from .crash_lp import Rows, Solution
from .errors import PlanError


def _highspy():
    import highspy
    return highspy


class DurationLP:
    """``min objective·v  s.t.  rows.A·v ≤ rows.b + T·rows.t,  bounds``, kept between calls."""

    def __init__(self, rows: Rows, columns: int, objective: np.ndarray, bounds: np.ndarray):
        hs = _highspy()
        self._hs, self._rows = hs, rows
        self._tied = np.flatnonzero(rows.t > 0).astype(np.int32)
        self._lower_tied = np.full(self._tied.size, -hs.kHighsInf)
        # the bare solver: the wrapper class prints a banner on stdout and calls back into
        # Python during the solve; neither is wanted here
        self._h = hs._Highs()
        for name, value in (("output_flag", False), ("presolve", "off")):
            self._h.setOptionValue(name, value)
        self._h.passModel(self._model(rows, columns, objective, bounds))

    def _model(self, rows: Rows, columns: int, objective, bounds):
        hs = self._hs
        A = sparse.csc_matrix((rows.val, (rows.row, rows.col)), shape=(rows.b.size, columns))
        lp = hs.HighsLp()
        lp.num_col_, lp.num_row_ = columns, rows.b.size
        lp.col_cost_ = np.asarray(objective, dtype=float)
        lp.col_lower_ = np.where(np.isneginf(bounds[:, 0]), -hs.kHighsInf, bounds[:, 0])
        lp.col_upper_ = np.where(np.isposinf(bounds[:, 1]), hs.kHighsInf, bounds[:, 1])
        lp.row_lower_ = np.full(rows.b.size, -hs.kHighsInf)
        lp.row_upper_ = rows.b.astype(float)
        lp.a_matrix_.format_ = hs.MatrixFormat.kColwise
        lp.a_matrix_.start_, lp.a_matrix_.index_, lp.a_matrix_.value_ = A.indptr, A.indices, A.data
        return lp

    def at(self, T: float) -> Solution | None:
        """The optimum at project duration T (None when T cannot be reached)."""
        h, tied = self._h, self._tied
        h.changeRowsBounds(tied.size, tied, self._lower_tied, self._rows.b[tied] + T)
        status = self._run()
        if status != self._hs.HighsModelStatus.kOptimal:     # a warm start gone astray: once more cold
            h.clearSolver()
            status = self._run()
        if status == self._hs.HighsModelStatus.kInfeasible:
            return None
        if status != self._hs.HighsModelStatus.kOptimal:
            raise PlanError(f"the plan: the linear programme did not solve ({h.modelStatusToString(status)})",
                            "tradeoff")
        solution = h.getSolution()
        duals = np.asarray(solution.row_dual)
        slope = float(duals[tied].sum())
        return Solution(float(h.getInfo().objective_function_value), slope, np.asarray(solution.col_value), duals)

    def _run(self):
        self._h.run()
        return self._h.getModelStatus()
