"""How fast is the critical-path engine? Ratios against networkx measured in the same run.

    python benchmarks/bench_cpm.py [--quick] [--no-cli]

For random layered FS networks of 1k, 10k and 100k activities (about 3 links each):
- full: link arrays -> compiled network -> forward/backward passes, floats, critical
  paths and PERT odds (what a first analysis costs);
- rerun: the same after a duration-only change (what an edit in the window costs);
- networkx: ``networkx.dag_longest_path_length`` on a prepared weighted DiGraph of the
  same network (it only finds the length: no floats, no late dates, no paths).
Times are CPU seconds of this process (``time.process_time``; for the whole-process row,
the children's CPU time), so that other work on a shared machine disturbs them less than
wall-clock time; each row's runs alternate between ours and the reference, and the table
shows medians. Then, for 100k, ``slackline analyze`` on a saved .slw as a
whole process against a plain script that reads the same JSON into networkx and asks
only for the longest path. Targets are in the project brief; this script only reports.
"""

from __future__ import annotations

import argparse
import os
import resource
import statistics
import subprocess
import sys
import tempfile
import time
from pathlib import Path

import networkx as nx
import numpy as np

ROOT = Path(__file__).resolve().parents[1]
sys.path.insert(0, str(ROOT))

from benchmarks.random_networks import layered_network, te, to_plan  # noqa: E402
from workbench.core.cpm import Analyzer  # noqa: E402
from workbench.core.network import compile_network  # noqa: E402
from workbench.core.pert import pert_odds  # noqa: E402

RUNS = {1_000: 21, 10_000: 11, 100_000: 5}


def cpu_time(fn) -> float:
    start = time.process_time()
    fn()
    return time.process_time() - start


def child_time(cmd: list[str], env: dict) -> float:
    """CPU time (user + system) of one whole child process."""
    before = resource.getrusage(resource.RUSAGE_CHILDREN)
    subprocess.run(cmd, check=True, capture_output=True, env=env)
    after = resource.getrusage(resource.RUSAGE_CHILDREN)
    return (after.ru_utime - before.ru_utime) + (after.ru_stime - before.ru_stime)


def alternate(runs: int, **fns) -> dict[str, float]:
    """Median time of each function, their runs interleaved."""
    times = {name: [] for name in fns}
    for _ in range(runs):
        for name, fn in fns.items():
            times[name].append(fn())
    return {name: statistics.median(t) for name, t in times.items()}


def full_analysis(net: dict, durations: np.ndarray, variances: np.ndarray):
    compiled = compile_network(net["ids"], net["src"], net["dst"], net["lag"], net["types"])
    analyzer = Analyzer(compiled)
    schedule = analyzer.run(durations)
    return analyzer, schedule, pert_odds(schedule, variances)


def nx_graph(net: dict, durations: np.ndarray) -> nx.DiGraph:
    """Activity-on-node as edge weights: i -> j weighs d_i; every node -> 'end' weighs d_i."""
    graph = nx.DiGraph()
    n = len(net["ids"])
    graph.add_weighted_edges_from(zip(net["src"].tolist(), net["dst"].tolist(), durations[net["src"]].tolist()))
    graph.add_weighted_edges_from((i, n, float(durations[i])) for i in range(n))
    return graph


def measure_mixed(n: int, runs: int, seed: int = 0) -> str:
    """Full and re-run times on a network mixing FS/SS/FF/SF links with lags (no reference)."""
    net = layered_network(n, seed=seed, link_types=True)
    d = te(net)
    var = ((net["pessimistic"] - net["optimistic"]) / 6.0) ** 2
    analyzer = full_analysis(net, d, var)[0]
    changed = d.copy()
    changed[n // 2] *= 1.2
    t = alternate(runs, full=lambda: cpu_time(lambda: full_analysis(net, d, var)),
                  rerun=lambda: cpu_time(lambda: pert_odds(analyzer.run(changed), var)))
    return (f"{n:,} activities, all four link types with lags ({net['src'].size:,} links): "
            f"full {t['full'] * 1e3:.2f} ms, rerun {t['rerun'] * 1e3:.2f} ms")


def measure(n: int, runs: int, seed: int = 0) -> dict:
    net = layered_network(n, seed=seed)
    d = te(net)
    var = ((net["pessimistic"] - net["optimistic"]) / 6.0) ** 2
    analyzer, schedule, _ = full_analysis(net, d, var)
    graph = nx_graph(net, d)
    length = nx.dag_longest_path_length(graph)
    assert abs(length - schedule.finish) < 1e-6, (length, schedule.finish)  # same answer
    rng = np.random.default_rng(seed)
    changed = []
    for _ in range(runs):                            # one activity's estimate edited each time
        arr = d.copy()
        arr[rng.integers(n)] *= 1.2
        changed.append(arr)
    it = iter(changed)
    t = alternate(runs, full=lambda: cpu_time(lambda: full_analysis(net, d, var)),
                  rerun=lambda: cpu_time(lambda: pert_odds(analyzer.run(next(it)), var)),
                  nx=lambda: cpu_time(lambda: nx.dag_longest_path_length(graph)))
    return {"n": n, "links": int(net["src"].size), "levels": len(analyzer.net.forward.steps) + 1, **t}


NX_SCRIPT = """
import json, sys, networkx as nx
data = json.load(open(sys.argv[1], encoding="utf-8"))
d = {}
for a in data["activities"]:
    if a.get("optimistic") is not None:
        d[a["id"]] = (a["optimistic"] + 4 * a["most_likely"] + a["pessimistic"]) / 6
    else:
        d[a["id"]] = a.get("duration") or 0.0
g = nx.DiGraph()
g.add_weighted_edges_from((l["pred"], l["succ"], d[l["pred"]]) for l in data["links"])
g.add_weighted_edges_from((k, "__end__", v) for k, v in d.items())
print(nx.dag_longest_path_length(g))
"""


def cli_row(n: int, runs: int) -> str:
    try:
        from workbench.io.planfile import save_plan
    except ImportError as exc:
        return f"slackline analyze row skipped: workbench.io.planfile not available ({exc})"
    if not (ROOT / "workbench" / "cli.py").exists():
        return "slackline analyze row skipped: workbench/cli.py not available yet"
    with tempfile.TemporaryDirectory() as folder:
        path = Path(folder) / "big.slw"
        save_plan(to_plan(layered_network(n)), path)
        script = Path(folder) / "nx_longest.py"
        script.write_text(NX_SCRIPT, encoding="utf-8")
        env = dict(os.environ, PYTHONPATH=str(ROOT))
        ours = [sys.executable, "-m", "workbench.cli", "analyze", str(path)]
        theirs = [sys.executable, str(script), str(path)]
        for cmd in (ours, theirs):                     # fail loudly, and warm the disk cache
            subprocess.run(cmd, check=True, capture_output=True, env=env)
        t = alternate(runs, ours=lambda: child_time(ours, env), nx=lambda: child_time(theirs, env))
    return (f"slackline analyze, {n:,} activities (.slw, whole process, CPU): {t['ours']:.2f} s; "
            f"plain networkx script on the same JSON: {t['nx']:.2f} s; ratio networkx/ours = "
            f"{t['nx'] / t['ours']:.2f}")


def main(argv=None) -> None:
    parser = argparse.ArgumentParser(description=__doc__.splitlines()[0])
    parser.add_argument("--quick", action="store_true", help="1k and 10k only")
    parser.add_argument("--no-cli", action="store_true", help="skip the whole-process row")
    args = parser.parse_args(argv)
    sizes = [1_000, 10_000] if args.quick else [1_000, 10_000, 100_000]
    print(f"{'activities':>10} {'links':>8} {'levels':>6} {'full ms':>9} {'rerun ms':>9} "
          f"{'networkx ms':>12} {'nx/full':>8} {'nx/rerun':>9}")
    for n in sizes:
        r = measure(n, RUNS[n])
        print(f"{r['n']:>10,} {r['links']:>8,} {r['levels']:>6} {r['full'] * 1e3:>9.2f} {r['rerun'] * 1e3:>9.2f} "
              f"{r['nx'] * 1e3:>12.1f} {r['nx'] / r['full']:>8.1f} {r['nx'] / r['rerun']:>9.1f}")
    print(measure_mixed(10_000, RUNS[10_000]))
    if not args.no_cli:
        print(cli_row(100_000 if not args.quick else 10_000, 3))


if __name__ == "__main__":
    main()
