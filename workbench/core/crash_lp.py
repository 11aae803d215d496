"""The linear programme behind crashing: start times and days bought under the links.

Variables: the start S_i of every activity (S_i ≥ its start floor: the project start or a
start-no-earlier constraint) and, for every activity that can be shortened, the days
x_i ∈ [0, range_i] bought off its duration. With durations d_i = D_i − g_i·x_i (g = 1 for
the PERT means; per scenario in the confidence search) the links read

    FS: S_i + d_i + lag ≤ S_j         SS: S_i + lag ≤ S_j
    FF: S_i + d_i + lag ≤ S_j + d_j   SF: S_i + lag ≤ S_j + d_j

and every activity whose finish may end the project gets S_i + d_i ≤ T. Finish-no-later
constraints act as in the analysis (on the floats, not on the schedule) and are not
imposed. Rows are built as sparse arrays so one scenario or a thousand stack alike.
"""

from __future__ import annotations

from dataclasses import dataclass

import numpy as np
from scipy import sparse
from scipy.optimize import linprog

from .errors import PlanError


def shown(value: float) -> float:
    """A duration or amount from the LP as reported: to a millionth of a plan unit (the
    solver's tolerances make the digits beyond noise)."""
    r = round(float(value), 6)
    return 0.0 if r == 0 else r


@dataclass
class Rows:
    """Sparse rows A·v ≤ b + T·t over the columns of one problem."""

    row: np.ndarray
    col: np.ndarray
    val: np.ndarray
    b: np.ndarray
    t: np.ndarray          # 1 on the rows whose bound moves with the project duration T


def finish_rows_needed(net) -> np.ndarray:
    """Activities that need their own S_i + d_i ≤ T row: all but those followed by an FS
    or FF link with a lag ≥ 0 (their successor finishes no earlier than they do)."""
    covered = np.zeros(net.size, dtype=bool)
    covered[net.src[(net.src_fin > 0) & (net.lag >= 0)]] = True
    return np.flatnonzero(~covered)


def schedule_rows(net, durations, gains, s_col, x_col, sinks, first_row: int = 0) -> Rows:
    """The link rows and finish rows of one schedule. ``s_col[i]`` is S_i's column,
    ``x_col[i]`` x_i's column (−1: the activity cannot be shortened), ``gains`` g_i."""
    src, dst, lag = net.src, net.dst, net.lag
    fin_i, fin_j = net.src_fin > 0, net.dst_fin > 0
    m = src.size
    D, g = np.asarray(durations, float), np.asarray(gains, float)
    link_rows = np.arange(m) + first_row
    parts = [(link_rows, s_col[src], np.ones(m)), (link_rows, s_col[dst], -np.ones(m))]
    xi, xj = x_col[src], x_col[dst]
    use_i, use_j = fin_i & (xi >= 0), fin_j & (xj >= 0)
    parts.append((link_rows[use_i], xi[use_i], -g[src][use_i]))
    parts.append((link_rows[use_j], xj[use_j], g[dst][use_j]))
    b_link = -lag - np.where(fin_i, D[src], 0.0) + np.where(fin_j, D[dst], 0.0)
    k = sinks.size
    sink_rows = np.arange(k) + first_row + m
    parts.append((sink_rows, s_col[sinks], np.ones(k)))
    xs = x_col[sinks]
    use = xs >= 0
    parts.append((sink_rows[use], xs[use], -g[sinks][use]))
    row, col, val = (np.concatenate(p) for p in zip(*parts))
    b = np.concatenate([b_link, -D[sinks]])
    t = np.concatenate([np.zeros(m), np.ones(k)])
    return Rows(row, col, val, b, t)


def stack(parts: list[Rows]) -> Rows:
    return Rows(*(np.concatenate([getattr(p, f) for p in parts]) for f in ("row", "col", "val", "b", "t")))


@dataclass
class Solution:
    cost: float            # objective value
    slope: float           # d cost / d T: a subgradient of the cost curve at T
    values: np.ndarray     # all variables
    marginals: np.ndarray  # duals of the rows (≤ 0)


def solve(rows: Rows, columns: int, objective, bounds, T: float, what: str = "the plan",
          presolve: bool = True) -> Solution | None:
    """Minimise ``objective`` under ``rows`` with project duration T; None if infeasible.
    (The deterministic rows are lean already: there HiGHS's presolve costs more than it saves.)"""
    A = sparse.csr_matrix((rows.val, (rows.row, rows.col)), shape=(rows.b.size, columns))
    res = linprog(objective, A_ub=A, b_ub=rows.b + T * rows.t, bounds=bounds, method="highs",
                  options={"presolve": presolve})
    if res.status == 2:
        return None
    if res.status != 0:
        raise PlanError(f"{what}: the linear programme did not solve ({res.message})", "tradeoff")
    slope = float(np.dot(res.ineqlin.marginals, rows.t))
    return Solution(float(res.fun), slope, res.x, res.ineqlin.marginals)
