"""What does scheduling from a status date cost? Ratios against the same plan without progress.

    python benchmarks/bench_progress.py [--quick]

A random layered network of 10,000 activities (all four link types with lags) is analysed
once without progress; a status date is then put at 40 % of its finish, and activities that
finished by then in that schedule become done on those dates, those that started become in
progress with a remaining estimate (a third of them by percent complete). Rows:

- full: ``analyze`` of a plan not analysed before (the network compiled, the progress
  resolved, floats, critical paths, PERT);
- rerun: ``analyze`` again after an estimate changed (the compiled network reused);
- simulate: ``simulate`` with 2,000 iterations (``--quick``: 500).

Each row alternates runs of the plan with progress and the same plan without it (no
progress, no status date) and shows median CPU seconds and their ratio. The target in the
issue is a ratio of at most 1.2 for the analysis; this script only reports.
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
from workbench.core.montecarlo import simulate  # noqa: E402
from workbench.core.progress_fields import Progress  # noqa: E402


def cpu(fn) -> float:
    start = time.process_time()
    fn()
    return time.process_time() - start


def with_progress(plan):
    """A copy of ``plan`` with progress consistent with its own schedule, and a status date."""
    a = analyze(plan)
    s, cal = a.schedule, a.calendar
    status = cal.finish_date(0.4 * s.finish)
    T = cal.offset_through(status)
    out = plan.copy()
    for i, act in enumerate(plan.activities):
        es, ef = float(s.es[i]), float(s.ef[i])
        if ef <= T and es < T:
            p = Progress(actual_start=es, actual_finish=ef)
        elif es < T:
            p = (Progress(actual_start=es, percent_complete=50.0) if i % 3 == 0 else
                 Progress(actual_start=es, remaining_optimistic=1.0, remaining_most_likely=2.0, remaining_pessimistic=4.0))
        else:
            continue
        out.replace_activity(act.id, act.with_(progress=p))
    out.settings.status_date = status
    return out


def fresh(plan):
    plan._analyzer = None
    return plan


def edited(plan, k: int):
    act = plan.activities[k % len(plan)]
    if act.has_estimate:
        plan.replace_activity(act.id, act.with_(pessimistic=act.pessimistic + 0.5))
    return plan


def row(name: str, runs: int, progress_fn, plain_fn) -> str:
    times = {"progress": [], "plain": []}
    for _ in range(runs):
        times["progress"].append(cpu(progress_fn))
        times["plain"].append(cpu(plain_fn))
    p, q = statistics.median(times["progress"]), statistics.median(times["plain"])
    return f"{name:<10} from a status date {p * 1e3:9.1f} ms   without progress {q * 1e3:9.1f} ms   ratio {p / q:5.2f}"


def main(argv=None) -> int:
    parser = argparse.ArgumentParser(description=__doc__.splitlines()[0])
    parser.add_argument("--quick", action="store_true")
    args = parser.parse_args(argv)
    n, runs, iterations = 10_000, (5 if args.quick else 11), (500 if args.quick else 2_000)
    plain = to_plan(layered_network(n, seed=3, link_types=True))
    progressed = with_progress(plain)
    frame = analyze(progressed).progress
    counts = [int((frame.state == k).sum()) for k in (2, 1, 0)]
    print(f"{n:,} activities, {len(plain.links):,} links; status date {frame.status_date}: "
          f"{counts[0]:,} done, {counts[1]:,} in progress, {counts[2]:,} not started")
    print(row("full", runs, lambda: analyze(fresh(progressed)), lambda: analyze(fresh(plain))))
    k = iter(range(10 ** 6))
    print(row("rerun", runs, lambda: analyze(edited(progressed, next(k))), lambda: analyze(edited(plain, next(k)))))
    print(row("simulate", 3, lambda: simulate(progressed, iterations, seed=1),
              lambda: simulate(plain, iterations, seed=1)))
    return 0


if __name__ == "__main__":
    sys.exit(main())
