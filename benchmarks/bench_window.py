"""The window as a user waits for it: start, opening a big plan, an edit, a re-analysis.

    python benchmarks/bench_window.py [--runs 3] [--n 10000]

- start: launch to the demo plan with its front views drawn (warm: one unmeasured launch
  first), against ``python -c pass`` (goal ≤ 1.0 s);
- open: launch with a ``--n``-activity plan to its front views drawn (goal ≤ 3 s);
- edit: an estimate edit pushed, recomputed and repainted in every visible view, at
  ``--n`` activities (goal ≤ 100 ms), beside ``analyze`` alone;
- re-analysis: the engine's re-run after a duration-only change at ``--n`` activities
  (goal ≤ 1 ms), beside a full first analysis.

Launches are separate processes: wall seconds and the child's CPU seconds, medians of
``--runs``, for the whole process (launch to its exit); beneath each, the same launch to two
moments the child reports itself: "interactive" (the plan painted in the Activities table:
the window takes clicks and edits; the charts are built just after) and "front views drawn".
The machine is shared, so read the figures beside their reference.
"""

from __future__ import annotations

import argparse
import os
import statistics
import subprocess
import sys
import tempfile
import time
from pathlib import Path

ROOT = Path(__file__).resolve().parents[1]
sys.path.insert(0, str(ROOT))

from benchmarks.bench_ui import EDIT_CPU_MS, START_SCRIPT, edit_round_trip  # noqa: E402

OPEN_SCRIPT = START_SCRIPT.replace("run_app([])", "run_app(sys.argv[1:])")


def launch(args: list[str], env: dict) -> tuple[float, float]:
    """Wall and CPU seconds of one child, to the line 'shown' (it then quits); the wall and
    CPU seconds at each of its marker lines ('interactive', 'shown') go to ``MARKS``."""
    before = os.times()
    start = time.perf_counter()
    proc = subprocess.Popen(args, env=env, stdout=subprocess.PIPE, stderr=subprocess.PIPE, text=True)
    marks, last = {}, None
    for line in proc.stdout:
        line = line.strip()
        if line in ("interactive", "shown"):
            marks[line], last = [time.perf_counter() - start], line
        elif line.startswith("cpu ") and last:
            marks[last].append(float(line.split()[1]))
    err = proc.communicate(timeout=600)[1]
    wall = time.perf_counter() - start
    after = os.times()
    if proc.returncode != 0 or "shown" not in marks:
        raise RuntimeError(f"{args[:3]} failed: {err[-500:]}")
    MARKS.setdefault(" ".join(args[-1:]), []).append(marks)
    return wall, (after.children_user - before.children_user) + (after.children_system - before.children_system)


MARKS: dict[str, list[dict]] = {}   # per launch command: its children's marker times


def marker_lines(key: str, label: str) -> list[str]:
    """Median wall and CPU seconds to each marker of the launches of ``key``."""
    runs = MARKS.get(key, [])[1:]           # the first launch warms the caches, unmeasured
    out = []
    for mark, what in (("interactive", "the plan painted in the table (window takes clicks and edits)"),
                       ("shown", "front views drawn")):
        got = [r[mark] for r in runs if mark in r]
        if got:
            wall, cpu = statistics.median(g[0] for g in got), statistics.median(g[1] for g in got)
            out.append(f"  {label}, to {what}: {wall:.2f} s wall, {cpu:.2f} s CPU")
    return out


def bare(env: dict) -> tuple[float, float]:
    """Wall and CPU seconds of ``python -c pass``."""
    before, start = os.times(), time.perf_counter()
    subprocess.run([sys.executable, "-c", "pass"], env=env, check=True)
    after = os.times()
    return time.perf_counter() - start, (after.children_user - before.children_user) + (after.children_system - before.children_system)


def medians(runs: int, env: dict, **cmds) -> dict[str, tuple[float, float]]:
    """Median (wall, CPU) per launch, after one unmeasured warm launch each; runs interleaved."""
    for cmd in cmds.values():
        launch(cmd, env)
    out = {name: [] for name in (*cmds, "bare")}
    for _ in range(runs):
        out["bare"].append(bare(env))
        for name, cmd in cmds.items():
            out[name].append(launch(cmd, env))
    return {k: (statistics.median(w for w, _ in v), statistics.median(c for _, c in v)) for k, v in out.items()}


def window_figures(runs: int, n: int) -> list[str]:
    from benchmarks.random_networks import layered_network, to_plan
    from workbench.io.planfile import save_plan

    with tempfile.TemporaryDirectory() as tmp:
        env = dict(os.environ, QT_QPA_PLATFORM=os.environ.get("QT_QPA_PLATFORM", "offscreen"),
                   SLACKLINE_MULTI_INSTANCE="1", SLACKLINE_DATA_DIR=tmp, XDG_CONFIG_HOME=tmp, HOME=tmp,
                   PYTHONPATH=str(ROOT))
        env.pop("PYTHONDONTWRITEBYTECODE", None)    # warm means compiled once: as an installed app is
        big = Path(tmp) / "big.slw"
        save_plan(to_plan(layered_network(n, seed=7)), big)
        t = medians(runs, env, start=[sys.executable, "-c", START_SCRIPT],
                    open=[sys.executable, "-c", OPEN_SCRIPT, str(big)])
    bare = t["bare"]
    lines = [f"python -c pass: {bare[0]:.2f} s wall, {bare[1]:.2f} s CPU"]
    for key, label, goal in (("start", "launch to the demo, front views drawn", 1.0),
                             ("open", f"launch with a {n:,}-activity plan, front views drawn", 3.0)):
        wall, cpu = t[key]
        lines.append(f"{label}: {wall:.2f} s wall, {cpu:.2f} s CPU ({wall / bare[0]:.0f} x python -c pass); "
                     f"goal <= {goal:g} s: {'met' if wall <= goal else 'MISSED'} by wall time, "
                     f"{'met' if cpu <= goal else 'MISSED'} by CPU time (the figure on an idle machine)")
        lines += marker_lines(START_SCRIPT if key == "start" else str(big), "   of which")
    return lines


def rerun_figures(n: int, runs: int = 21) -> str:
    import numpy as np

    from benchmarks.random_networks import layered_network, te
    from workbench.core.cpm import Analyzer
    from workbench.core.network import compile_network

    net = layered_network(n, seed=7, link_types=True)
    d = te(net)
    analyzer = Analyzer(compile_network(net["ids"], net["src"], net["dst"], net["lag"], net["types"]))
    analyzer.run(d)
    rng = np.random.default_rng(0)
    full, rerun = [], []
    for _ in range(runs):
        start = time.process_time()
        Analyzer(compile_network(net["ids"], net["src"], net["dst"], net["lag"], net["types"])).run(d)
        full.append(time.process_time() - start)
        changed = d.copy()
        changed[rng.integers(n)] *= 1.2
        start = time.process_time()
        analyzer.run(changed)
        rerun.append(time.process_time() - start)
    r, f = statistics.median(rerun) * 1e3, statistics.median(full) * 1e3
    return (f"re-analysis after a duration-only edit, {n:,} activities: {r:.2f} ms CPU (whole network; "
            f"first analysis {f:.2f} ms); goal <= 1 ms: {'met' if r <= 1 else 'MISSED'}")


def main(argv=None) -> None:
    parser = argparse.ArgumentParser(description=__doc__.splitlines()[0])
    parser.add_argument("--runs", type=int, default=3)
    parser.add_argument("--n", type=int, default=10_000)
    args = parser.parse_args(argv)
    print(rerun_figures(args.n))
    print("\n".join(window_figures(args.runs, args.n)))
    core_ms, full_ms = edit_round_trip(args.n, 10)
    cpu_ms = EDIT_CPU_MS[0]
    print(f"edit -> recompute -> repaint, {args.n:,} activities, default layout: {full_ms:.0f} ms wall, "
          f"{cpu_ms:.0f} ms CPU (analyze alone {core_ms:.1f} ms wall, ratio {full_ms / core_ms:.1f} x); goal <= 100 ms: "
          f"{'met' if full_ms <= 100 else 'MISSED'} by wall time, {'met' if cpu_ms <= 100 else 'MISSED'} by CPU time")


if __name__ == "__main__":
    main()
