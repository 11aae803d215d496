"""How fast is Checkup? Its metrics on a 10,000-activity plan, against one CPM analysis of
the same plan measured in the same run.

    python benchmarks/bench_checkup.py [--sizes 1000 10000] [--runs 11]

For random layered networks (about 3 links each, all four link types with lags, a
deadline) it times, in CPU seconds of this process, median of interleaved runs:
- analysis: ``analyze(plan)`` from scratch (compiled network, passes, floats, paths, PERT);
- checkup: ``run_checkup(plan, analysis, with_simulation=False)`` on that analysis — every
  standard metric and our own estimate checks, without the simulation-based ones (what the
  window recomputes on every edit, where the analysis exists already);
- checkup + analysis: the same starting from the plan alone (what ``slackline check`` does).
Target (issue 14): checkup ≤ 50 ms at 10,000 activities. This script only reports.
"""

from __future__ import annotations

import argparse
import statistics
import sys
import time
from pathlib import Path

ROOT = Path(__file__).resolve().parents[1]
sys.path.insert(0, str(ROOT))

from benchmarks.random_networks import layered_network, to_plan  # noqa: E402
from workbench.core.analysis import analyze  # noqa: E402
from workbench.core.checkup import run_checkup  # noqa: E402
from workbench.core.model import Settings  # noqa: E402


def cpu(fn) -> float:
    start = time.process_time()
    fn()
    return time.process_time() - start


def fresh_analysis(plan):
    plan._analyzer = None          # nothing reused: a first analysis
    return analyze(plan)


def measure(n: int, runs: int) -> dict[str, float]:
    plan = to_plan(layered_network(n, seed=1, link_types=True))
    first = analyze(plan)
    plan.settings = Settings(title=plan.settings.title, start=plan.settings.start,
                             deadline=first.schedule.finish * 1.02)
    analysis = analyze(plan)
    run_checkup(plan, analysis, with_simulation=False)          # warm caches and imports
    times: dict[str, list[float]] = {"analysis": [], "checkup": [], "checkup + analysis": []}
    for _ in range(runs):
        times["analysis"].append(cpu(lambda: fresh_analysis(plan)))
        analysis = analyze(plan)
        times["checkup"].append(cpu(lambda: run_checkup(plan, analysis, with_simulation=False)))
        times["checkup + analysis"].append(cpu(lambda: run_checkup(fresh(plan), with_simulation=False)))
    return {k: statistics.median(v) for k, v in times.items()}


def fresh(plan):
    plan._analyzer = None
    return plan


def main(argv=None) -> None:
    parser = argparse.ArgumentParser(description=__doc__.splitlines()[0])
    parser.add_argument("--sizes", type=int, nargs="+", default=[1_000, 10_000])
    parser.add_argument("--runs", type=int, default=11)
    args = parser.parse_args(argv)
    print(f"{'activities':>10}  {'analysis':>10}  {'checkup':>10}  {'ratio':>6}  {'+analysis':>10}  {'ratio':>6}")
    for n in args.sizes:
        t = measure(n, args.runs)
        base = t["analysis"]
        print(f"{n:>10,}  {base * 1e3:>8.1f}ms  {t['checkup'] * 1e3:>8.1f}ms  {t['checkup'] / base:>5.2f}x"
              f"  {t['checkup + analysis'] * 1e3:>8.1f}ms  {t['checkup + analysis'] / base:>5.2f}x")
    print("ratio: time / one CPM analysis of the same plan (same run). Target: checkup <= 50 ms at 10,000.")


if __name__ == "__main__":
    main()
