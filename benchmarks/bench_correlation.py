"""Correlation groups in the simulation, as ratios to the same plan without them.

    python benchmarks/bench_correlation.py

One correlation group holding every activity of a wide plan (5,000 and 20,000 activities,
200 iterations), sampled through the common factor; and, for comparison, 2,000 activities
forced through the dense matrix (a second group over the same activities makes them
overlap). Each line prints CPU seconds, the peak extra memory (tracemalloc) and the ratio
of the CPU time to the same plan simulated with no group, measured here, now.
Target: a one-coefficient group costs less than 1.5 × the plan without it.
"""

from __future__ import annotations

import datetime as dt
import os
import sys
import time
import tracemalloc

sys.path.insert(0, os.path.dirname(os.path.dirname(os.path.abspath(__file__))))

from workbench.core.model import Activity, CorrelationGroup, Plan, Settings  # noqa: E402
from workbench.core.montecarlo import simulate  # noqa: E402

ITERATIONS = 200


def wide_plan(n: int, groups: int) -> Plan:
    acts = [Activity(f"W{i}", optimistic=1, most_likely=2, pessimistic=5) for i in range(n)]
    names = tuple(a.id for a in acts)
    corr = [CorrelationGroup(f"weather {k}", names, 0.5) for k in range(groups)]
    return Plan(Settings(title="wide", start=dt.date(2027, 3, 1)), acts, [], [], corr)


def measure(plan) -> tuple[float, float]:
    t = time.process_time()
    simulate(plan, iterations=ITERATIONS, seed=1)
    cpu = time.process_time() - t
    tracemalloc.start()
    simulate(plan, iterations=ITERATIONS, seed=1)
    peak = tracemalloc.get_traced_memory()[1]
    tracemalloc.stop()
    return cpu, peak / 2**20


def main() -> None:
    for n, groups, label in ((5_000, 1, "factor"), (20_000, 1, "factor"), (2_000, 2, "dense")):
        base, _ = measure(wide_plan(n, 0))
        cpu, peak = measure(wide_plan(n, groups))
        print(f"{n:>6,} activities, one coefficient ({label:6}): {cpu:6.2f} s CPU, peak {peak:7.1f} MB, "
              f"{cpu / base:5.2f} x the plan without a group ({base:.2f} s)")


if __name__ == "__main__":
    main()
