"""Trade-off speed: the full cost curve of a 2,000-activity plan and the 90 % confidence
search on the demo plan, each as a ratio to one plain linprog solve of one duration of the
same plan, measured in the same run.

    python benchmarks/bench_tradeoff.py
"""

from __future__ import annotations

import time

import numpy as np

from random_networks import layered_network, to_plan
from workbench.core.cost_curve import cost_curve
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
    t = time.perf_counter()
    problem.at(0.5 * (problem.normal_finish + problem.shortest()))
    return time.perf_counter() - t


def best_of(fn, repeat: int = 3) -> float:
    return min(fn() for _ in range(repeat))


def main() -> None:
    plan = costed(to_plan(layered_network(2000, preds=2, seed=3, link_types=True)))
    problem = CrashProblem(plan)
    problem.shortest()
    ref = best_of(lambda: one_solve(problem))
    t = time.perf_counter()
    curve = cost_curve(problem=CrashProblem(plan))
    full = time.perf_counter() - t
    print(f"2,000 activities: one linprog solve {ref * 1000:.0f} ms; full curve {full:.2f} s "
          f"({len(curve.points)} breakpoints, {curve.solves} solves) = {full / ref:.0f} x one solve (target <= 5 s)")
    demo = demo_plan()
    demo_problem = CrashProblem(demo)
    ref = best_of(lambda: one_solve(demo_problem))
    t = time.perf_counter()
    result = tradeoff(demo, targets=[0.9], iterations=2000, seed=1)
    search = time.perf_counter() - t
    c = result.confidence[0]
    print(f"demo, 90 % search, 2,000 + 2,000 scenarios: one linprog solve {ref * 1000:.1f} ms; whole trade-off "
          f"{search:.2f} s = {search / ref:.0f} x one solve (target <= 20 s); chance {c.chance_out_of_sample:.3f} "
          f"\u00b1 {c.standard_error:.3f}, {c.solves} scenario LPs")


if __name__ == "__main__":
    main()
