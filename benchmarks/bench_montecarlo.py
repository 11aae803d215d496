"""Monte Carlo throughput and memory, as ratios to a floor measured in the same run.

    python benchmarks/bench_montecarlo.py            # 1,000 × 10,000 and 10,000 × 1,000
    python benchmarks/bench_montecarlo.py --big      # also 10,000 × 10,000 (memory bound)
    python benchmarks/bench_montecarlo.py --profile  # where the time goes (cProfile, top 15)

For each case it prints activity-iterations per second (including criticality and
sensitivity), the peak extra memory (tracemalloc: numpy registers its buffers), and the
ratio of the run's CPU time to a *streaming floor*: one ``np.maximum`` over as many float64
values as the run has activity-iterations, timed here, now, on this machine. Times are
process CPU times, the fastest of ``--repeat`` runs (the box is shared and noisy; wall time
of that run is printed too); memory is measured in one more run of the same case, since
tracemalloc slows every allocation.
Targets: ≥ 1.5e7 activity-iterations/s; peak extra memory ≤ 150 MB for 10,000 × 10,000.
"""

from __future__ import annotations

import argparse
import gc
import os
import sys
import time
import tracemalloc

import numpy as np

sys.path.insert(0, os.path.dirname(os.path.dirname(os.path.abspath(__file__))))

from benchmarks.random_networks import layered_network, to_plan  # noqa: E402
from workbench.core.montecarlo import simulate  # noqa: E402
from workbench.core.quantile_table import beta_pert_table  # noqa: E402

MB = 2**20


def streaming_floor(values: int) -> float:
    """Seconds for one np.maximum over ``values`` float64 numbers (in 1e7-value slices)."""
    step = min(values, 10_000_000)
    a, b = np.random.default_rng(0).random(step), np.random.default_rng(1).random(step)
    np.maximum(a, b, out=a)
    start = time.process_time()
    done = 0
    while done < values:
        k = min(step, values - done)
        np.maximum(a[:k], b[:k], out=a[:k])
        done += k
    return time.process_time() - start


def run_case(n: int, iterations: int, seed: int = 1, block: int | None = None, repeat: int = 3) -> dict:
    """The fastest of ``repeat`` timed runs (CPU time; the floor likewise), then memory in
    one more run: tracemalloc hooks every allocation, which would slow the timed runs."""
    plan = to_plan(layered_network(n, seed=seed))
    simulate(plan, 64, seed=0)                     # warm caches (table, imports)
    elapsed = wall = floor = float("inf")
    for _ in range(repeat):
        gc.collect()
        start, cpu = time.perf_counter(), time.process_time()
        simulate(plan, iterations, seed=seed, block_size=block)
        if time.process_time() - cpu < elapsed:
            wall, elapsed = time.perf_counter() - start, time.process_time() - cpu
        floor = min(floor, streaming_floor(n * iterations))
    gc.collect()
    tracemalloc.start()
    base = tracemalloc.get_traced_memory()[0]
    res = simulate(plan, iterations, seed=seed, block_size=block)
    peak = tracemalloc.get_traced_memory()[1] - base
    tracemalloc.stop()
    return {"n": n, "iterations": iterations, "seconds": elapsed, "wall": wall, "rate": n * iterations / elapsed,
            "peak_mb": peak / MB, "floor_ratio": elapsed / floor, "block": res.block_size,
            "links": len(plan.links)}


def report(case: dict) -> None:
    print(f"{case['n']:>6} activities ({case['links']} links) x {case['iterations']:>6} iterations: "
          f"{case['seconds']:6.2f} s CPU ({case['wall']:.2f} s wall), {case['rate']:.2e} activity-iterations/s "
          f"({case['rate'] / 1.5e7:.2f} x target 1.5e7), "
          f"{case['floor_ratio']:.0f} x streaming floor, peak extra {case['peak_mb']:.0f} MB "
          f"(block {case['block']})")


def main() -> None:
    parser = argparse.ArgumentParser(description=__doc__.splitlines()[0])
    parser.add_argument("--big", action="store_true", help="also 10,000 x 10,000 (memory target)")
    parser.add_argument("--profile", action="store_true")
    parser.add_argument("--block", type=int, default=None, help="iterations per block (default: automatic)")
    parser.add_argument("--repeat", type=int, default=3, help="timed runs per case; the fastest counts (default 3)")
    args = parser.parse_args()
    beta_pert_table()
    if args.profile:
        import cProfile
        import pstats
        plan = to_plan(layered_network(1000, seed=1))
        cProfile.runctx("simulate(plan, 10000, seed=1)", globals(), {"plan": plan, "simulate": simulate}, "/tmp/mc.prof")
        pstats.Stats("/tmp/mc.prof").sort_stats("tottime").print_stats(15)
        return
    cases = [(1000, 10_000), (10_000, 1000)] + ([(10_000, 10_000)] if args.big else [])
    for n, iters in cases:
        report(run_case(n, iters, block=args.block, repeat=1 if (n, iters) == (10_000, 10_000) else args.repeat))


if __name__ == "__main__":
    main()
