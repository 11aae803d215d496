"""Trade-off speed: the full cost curve of a 2,000-activity plan and the 90 % confidence
search on the demo plan, each as a ratio to one plain linprog solve of one duration of the
same plan (scipy.optimize.linprog, HiGHS, the model built from scratch), measured in the same
run. Wall and CPU time are both printed: the machines are shared, and wall time counts the
waits for a core.

    python benchmarks/bench_tradeoff.py           # both
    python benchmarks/bench_tradeoff.py --quick   # the curve only
"""

from __future__ import annotations

import sys
import time

import numpy as np

from random_networks import layered_network, to_plan
from workbench.core.cost_curve import cost_curve
from workbench.core.crash_lp import solve
from workbench.core.crash_problem import CrashProblem
from workbench.core.demo import demo_plan
from workbench.core.tradeoff import tradeoff


def costed(plan, seed: int = 7):
    """Invented costs: every activity a cost; two in three crashable by 10–40 % at a random slope."""
    rng = np.random.default_rng(seed)
    acts = []
    for a in plan.activities:
        cost = float(rng.integers(1, 50)) * 1000
        if a.mean > 0 and rng.random() < 2 / 3:
            f = float(rng.uniform(0.6, 0.9))
            crash = {"crash_duration": round(a.mean * f, 2)} if not a.has_estimate else {
                "crash_optimistic": round(a.optimistic * f, 2), "crash_most_likely": round(a.most_likely * f, 2),
                "crash_pessimistic": round(a.pessimistic * f, 2)}
            acts.append(a.with_(cost=cost, crash_cost=cost * float(rng.uniform(1.1, 1.6)), **crash))
        else:
            acts.append(a.with_(cost=cost))
    out = plan.copy()
    for a in acts:
        out.replace_activity(a.id, a)
    return out


def one_solve(problem: CrashProblem) -> float:
    """One plain linprog solve of the duration halfway between the shortest and the normal."""
    T = 0.5 * (problem.normal_finish + problem.shortest())
    _, _, ncol = problem.columns()
    t = time.perf_counter()
    solve(problem.rows(), ncol, problem.objective(), problem.bounds(), T, presolve=False)
    return time.perf_counter() - t


def timed(fn):
    """(result, wall seconds, CPU seconds of this process)."""
    wall, cpu = time.perf_counter(), time.process_time()
    out = fn()
    return out, time.perf_counter() - wall, time.process_time() - cpu


def best_of(fn, repeat: int = 3) -> float:
    return min(fn() for _ in range(repeat))


def curve_figures() -> None:
    plan = costed(to_plan(layered_network(2000, preds=2, seed=3, link_types=True)))
    problem = CrashProblem(plan)
    problem.shortest()
    ref = best_of(lambda: one_solve(problem))
    curve, wall, cpu = timed(lambda: cost_curve(problem=CrashProblem(plan)))
    print(f"2,000 activities: one linprog solve {ref * 1000:.0f} ms; full curve {wall:.2f} s wall, {cpu:.2f} s CPU "
          f"({len(curve.points)} breakpoints, {curve.solves} solves) = {wall / ref:.1f} x one solve "
          f"(target <= 5 s)")


def search_figures() -> None:
    demo = demo_plan()
    ref = best_of(lambda: one_solve(CrashProblem(demo)))
    result, wall, cpu = timed(lambda: tradeoff(demo, targets=[0.9], iterations=2000, seed=1))
    c = result.confidence[0]
    print(f"demo, 90 % search, 2,000 + 2,000 scenarios: one linprog solve {ref * 1000:.1f} ms; whole trade-off "
          f"{wall:.2f} s wall, {cpu:.2f} s CPU = {wall / ref:.0f} x one solve (target <= 20 s); chance "
          f"{c.chance_out_of_sample:.3f} \u00b1 {c.standard_error:.3f}, {c.solves} scenario LPs")


def main(argv: list[str]) -> None:
    curve_figures()
    if "--quick" not in argv:
        search_figures()


if __name__ == "__main__":
    main(sys.argv[1:])
