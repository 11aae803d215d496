"""The command line as a whole process, against plain references run in the same session.

    python benchmarks/bench_cli.py [--runs 3] [--only analyze|simulate|start|imports]

- analyze: ``slackline analyze PLAN --json`` of a 100,000-activity .slw against a plain
  script that reads the same file with ``json`` into networkx and asks only for the
  longest path (goal: ours ≤ 0.5 × the script).
- simulate: ``slackline simulate PLAN --json`` of 1,000 activities × 10,000 iterations
  against a minimal numpy script that samples the same beta-PERT durations and takes the
  maximum over paths, computing only the finish (goal: ours ≤ 1.0 × the script).
- start: ``slackline --version`` and ``slackline analyze`` of the demo plan against
  ``python -c pass`` (goal: each under 0.25 s).
- imports: for each verb, the five heaviest imports (``python -X importtime``, cumulative).

Times are medians of ``--runs`` alternating runs: wall seconds and CPU seconds (user +
system of the child). The machine is shared, so the ratio to the reference run beside it
is the figure to read; CPU ratios are steadier than wall ratios.
"""

from __future__ import annotations

import argparse
import os
import re
import statistics
import subprocess
import sys
import tempfile
import time
from pathlib import Path

ROOT = Path(__file__).resolve().parents[1]
sys.path.insert(0, str(ROOT))

from benchmarks.random_networks import layered_network, to_plan  # noqa: E402

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

NUMPY_SCRIPT = """
import json, sys, numpy as np
data = json.load(open(sys.argv[1], encoding="utf-8"))
ids = {a["id"]: i for i, a in enumerate(data["activities"])}
a, m, b = (np.array([x[k] for x in data["activities"]]) for k in ("optimistic", "most_likely", "pessimistic"))
src = np.array([ids[l["pred"]] for l in data["links"]])
dst = np.array([ids[l["succ"]] for l in data["links"]])
level = np.zeros(len(ids), dtype=int)
for _ in range(len(ids)):                      # longest-path level of every activity
    new = np.maximum(level, np.zeros_like(level))
    np.maximum.at(new, dst, level[src] + 1)
    if np.array_equal(new, level):
        break
    level = new
rng = np.random.default_rng(int(sys.argv[2]))
span = np.where(b > a, b - a, 1.0)
alpha, beta = 1 + 4 * (m - a) / span, 1 + 4 * (b - m) / span
d = a[:, None] + (b - a)[:, None] * rng.beta(alpha[:, None], beta[:, None], (len(ids), int(sys.argv[3])))
finish = d.copy()
for k in range(1, level.max() + 1):            # finish = own duration + latest predecessor finish
    into = level[dst] == k
    start = np.zeros((len(ids), d.shape[1]))
    np.maximum.at(start, dst[into], finish[src[into]])
    rows = level == k
    finish[rows] = start[rows] + d[rows]
print(np.percentile(finish.max(axis=0), [50, 80]))
"""


def child(cmd: list[str], env: dict) -> tuple[float, float]:
    """Wall and CPU seconds (user + system) of one whole child process."""
    before = os.times()
    start = time.perf_counter()
    subprocess.run(cmd, check=True, capture_output=True, env=env)
    wall = time.perf_counter() - start
    after = os.times()
    return wall, (after.children_user - before.children_user) + (after.children_system - before.children_system)


def alternate(runs: int, env: dict, **cmds) -> dict[str, tuple[float, float]]:
    """Median (wall, CPU) per command, the runs interleaved; one unmeasured warm-up each."""
    for cmd in cmds.values():
        subprocess.run(cmd, check=True, capture_output=True, env=env)
    times = {name: [] for name in cmds}
    for _ in range(runs):
        for name, cmd in cmds.items():
            times[name].append(child(cmd, env))
    return {name: (statistics.median(w for w, _ in t), statistics.median(c for _, c in t)) for name, t in times.items()}


def slackline(*args: str) -> list[str]:
    return [sys.executable, "-m", "workbench.cli", *args]


def ratio_line(what: str, ours, ref, ref_name: str, goal: float) -> str:
    wall, cpu = ours[0] / ref[0], ours[1] / ref[1]
    verdict = "met" if max(wall, cpu) <= goal else "MISSED"
    return (f"{what}: ours {ours[0]:.2f} s wall / {ours[1]:.2f} s CPU; {ref_name} {ref[0]:.2f} s / {ref[1]:.2f} s; "
            f"ratio ours/reference {wall:.2f} wall, {cpu:.2f} CPU (goal <= {goal:g} on both: {verdict})")


def bench_analyze(folder: Path, env: dict, runs: int, n: int = 100_000) -> str:
    from workbench.io.planfile import save_plan

    path = folder / "analyze.slw"
    save_plan(to_plan(layered_network(n)), path)
    script = folder / "nx_longest.py"
    script.write_text(NX_SCRIPT, encoding="utf-8")
    t = alternate(runs, env, ours=slackline("analyze", str(path), "--json"), ref=[sys.executable, str(script), str(path)])
    return ratio_line(f"analyze --json, {n:,} activities", t["ours"], t["ref"], "networkx script", 0.5)


def bench_simulate(folder: Path, env: dict, runs: int, n: int = 1000, iterations: int = 10_000) -> str:
    from workbench.io.planfile import save_plan

    path = folder / "simulate.slw"
    save_plan(to_plan(layered_network(n, seed=1)), path)
    script = folder / "numpy_finish.py"
    script.write_text(NUMPY_SCRIPT, encoding="utf-8")
    t = alternate(runs, env, ours=slackline("simulate", str(path), "--iterations", str(iterations), "--seed", "1", "--json"),
                  ref=[sys.executable, str(script), str(path), "1", str(iterations)])
    return ratio_line(f"simulate --json, {n:,} x {iterations:,}", t["ours"], t["ref"], "numpy script", 1.0)


def bench_start(env: dict, runs: int) -> list[str]:
    demo = str(ROOT / "resources" / "demo.slw")
    t = alternate(runs, env, version=slackline("--version"), demo=slackline("analyze", demo),
                  demo_json=slackline("analyze", demo, "--json"), bare=[sys.executable, "-c", "pass"])
    bare, bare_cpu = t["bare"]
    out = [f"python -c pass: {bare:.3f} s wall, {bare_cpu:.3f} s CPU"]
    for name, label in (("version", "slackline --version"), ("demo", "slackline analyze demo.slw"),
                        ("demo_json", "slackline analyze demo.slw --json")):
        wall, cpu = t[name]
        out.append(f"{label}: {wall:.3f} s wall, {cpu:.3f} s CPU ({wall / bare:.1f} x python -c pass; goal < 0.25 s: "
                   f"{'met' if wall < 0.25 else 'MISSED'} by wall time, {'met' if cpu < 0.25 else 'MISSED'} by CPU "
                   f"time, the figure on an idle machine)")
    return out


IMPORT_LINE = re.compile(r"import time:\s+(\d+) \|\s+(\d+) \|(\s*)(\S+)")


def top_imports(cmd: list[str], env: dict, top: int = 5) -> str:
    """The heaviest top-level imports of one run (cumulative microseconds)."""
    done = subprocess.run([sys.executable, "-X", "importtime", *cmd[1:]], capture_output=True, text=True, env=env)
    rows = []
    for line in done.stderr.splitlines():
        m = IMPORT_LINE.match(line)
        if m and len(m.group(3)) <= 1:
            rows.append((int(m.group(2)), m.group(4)))
    rows.sort(reverse=True)
    total = sum(us for us, _ in rows)
    shown = ", ".join(f"{name} {us / 1e3:.0f} ms" for us, name in rows[:top])
    return f"{total / 1e3:6.0f} ms in top-level imports: {shown}"


def bench_imports(folder: Path, env: dict) -> list[str]:
    from workbench.io.planfile import save_plan

    plan = folder / "imports.slw"
    save_plan(to_plan(layered_network(50, seed=2)), plan)
    cases = {
        "--version": slackline("--version"),
        "analyze": slackline("analyze", str(plan)),
        "simulate": slackline("simulate", str(plan), "--iterations", "100"),
        "export": slackline("export", str(plan), "-o", str(folder / "out.csv")),
        "import": slackline("import", str(folder / "out.csv"), "-o", str(folder / "back.slw")),
        "report": slackline("report", str(plan), "-o", str(folder / "pack.pdf"), "--iterations", "100"),
    }
    for cmd in cases.values():      # warm the bytecode caches first
        subprocess.run(cmd, capture_output=True, env=env)
    return [f"{verb:<10} {top_imports(cmd, env)}" for verb, cmd in cases.items()]


def main(argv=None) -> None:
    parser = argparse.ArgumentParser(description=__doc__.splitlines()[0])
    parser.add_argument("--runs", type=int, default=3)
    parser.add_argument("--only", choices=("analyze", "simulate", "start", "imports"))
    args = parser.parse_args(argv)
    env = dict(os.environ, PYTHONPATH=str(ROOT))
    env.pop("PYTHONDONTWRITEBYTECODE", None)    # warm means compiled once: as an installed app is
    with tempfile.TemporaryDirectory() as tmp:
        folder = Path(tmp)
        if args.only in (None, "start"):
            print("\n".join(bench_start(env, max(args.runs, 5))))
        if args.only in (None, "imports"):
            print("\n".join(bench_imports(folder, env)))
        if args.only in (None, "simulate"):
            print(bench_simulate(folder, env, args.runs))
        if args.only in (None, "analyze"):
            print(bench_analyze(folder, env, args.runs))


if __name__ == "__main__":
    main()
