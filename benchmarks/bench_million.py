"""A million activities: CSV import, analysis, save, and loading the .slw back.

    python benchmarks/bench_million.py [--n 1000000] [--code PATH] [--keep DIR]

Writes a random layered network of ``--n`` activities (about 3 links each) as a CSV table
(id, name, optimistic, most likely, pessimistic, predecessors), then runs two fresh
processes: the first imports the CSV (``read_table``), analyses it (``analyze``) and saves
it (``save_plan``); the second loads the saved ``.slw`` (``load_plan``). Each step's wall
and CPU seconds and each process's peak memory (maximum resident set) are printed,
against the goals (each step under 10 s and 3 GB; loading under 3 s) and against the
reference measured in the same run: ``python -c pass`` and reading the same CSV with
the standard library's ``csv`` module into lists.
``--code`` runs another checkout's ``workbench`` (to state a version's figures side by
side). A plan file larger than that checkout's ``MAX_BYTES`` is admitted for the
measurement (the limit itself is the plan file's business, not this benchmark's).
"""

from __future__ import annotations

import argparse
import json
import os
import subprocess
import sys
import tempfile
import time
from pathlib import Path

import numpy as np

ROOT = Path(__file__).resolve().parents[1]
sys.path.insert(0, str(ROOT))

from benchmarks.random_networks import layered_network  # noqa: E402

GB = 1024 ** 3
STEPS = r"""
import json, resource, sys, time, datetime as dt
def timed(fn):
    w, c = time.perf_counter(), time.process_time()
    out = fn()
    return out, time.perf_counter() - w, time.process_time() - c
def peak():
    return resource.getrusage(resource.RUSAGE_SELF).ru_maxrss * 1024
result = {}
if sys.argv[1] == "import":
    from workbench.core.analysis import analyze
    from workbench.core.model import Settings
    from workbench.io import planfile
    from workbench.io.tabular import read_table
    plan, *result["import"] = timed(lambda: read_table(sys.argv[2], Settings(start=dt.date(2027, 1, 4))))
    result["import_peak"] = peak()
    _, *result["analyze"] = timed(lambda: analyze(plan))
    result["analyze_peak"] = peak()
    _, *result["save"] = timed(lambda: planfile.save_plan(plan, sys.argv[3]))
    result["save_peak"] = peak()
else:
    from workbench.io import planfile
    planfile.MAX_BYTES = max(planfile.MAX_BYTES, 4 << 30)
    plan, *result["load"] = timed(lambda: planfile.load_plan(sys.argv[3]))
    result["load_peak"] = peak()
    result["activities"], result["links"] = len(plan), len(plan.links)
print(json.dumps(result))
"""
CSV_REFERENCE = r"""
import csv, sys
with open(sys.argv[1], newline="", encoding="utf-8") as f:
    rows = list(csv.reader(f))
print(len(rows))
"""


def write_csv(path: Path, n: int) -> int:
    """The network as a CSV table; returns the number of links."""
    net = layered_network(n)
    order = np.argsort(net["dst"], kind="stable")
    src, dst = net["src"][order], net["dst"][order]
    starts = np.searchsorted(dst, np.arange(n + 1))
    ids = net["ids"]
    a, m, b = (net[k].tolist() for k in ("optimistic", "most_likely", "pessimistic"))
    src_ids = [ids[s] for s in src.tolist()]
    with path.open("w", encoding="utf-8", newline="") as f:
        f.write("id,name,optimistic,most_likely,pessimistic,predecessors\n")
        for i in range(n):
            preds = ";".join(src_ids[starts[i]:starts[i + 1]])
            f.write(f"{ids[i]},Activity {ids[i]},{a[i]},{m[i]},{b[i]},{preds}\n")
    return int(src.size)


def run(script: str, args: list[str], code: Path) -> tuple[str, float, float]:
    """Stdout, wall seconds and CPU seconds of one fresh process."""
    env = dict(os.environ, PYTHONPATH=str(code))
    env.pop("PYTHONDONTWRITEBYTECODE", None)    # compiled once, as an installed app is
    before = os.times()
    start = time.perf_counter()
    # run in the checkout's folder: ``python -c`` puts the working folder first on the path
    done = subprocess.run([sys.executable, "-c", script, *args], check=True, capture_output=True, text=True, env=env,
                          cwd=code)
    wall = time.perf_counter() - start
    after = os.times()
    return done.stdout, wall, (after.children_user - before.children_user) + (after.children_system - before.children_system)


def report(name: str, wall: float, cpu: float, peak: float, goal_s: float) -> None:
    verdict = "met" if wall <= goal_s and peak <= 3 * GB else "MISSED"
    print(f"{name:<8} {wall:7.2f} s wall {cpu:7.2f} s CPU   peak {peak / GB:5.2f} GB   "
          f"goal < {goal_s:g} s, < 3 GB: {verdict}")


def main(argv=None) -> None:
    parser = argparse.ArgumentParser(description=__doc__.splitlines()[0])
    parser.add_argument("--n", type=int, default=1_000_000)
    parser.add_argument("--code", type=Path, default=ROOT, help="checkout whose workbench package runs")
    parser.add_argument("--keep", type=Path, default=None, help="folder to write the files in (kept)")
    args = parser.parse_args(argv)
    folder = args.keep or Path(tempfile.mkdtemp(prefix="slackline-million-"))
    folder.mkdir(parents=True, exist_ok=True)
    csv_path, slw_path = folder / "million.csv", folder / "million.slw"
    links = write_csv(csv_path, args.n)
    print(f"{args.n:,} activities, {links:,} links; CSV {csv_path.stat().st_size / 1e6:.0f} MB; code: {args.code}")
    _, pass_wall, _ = run("pass", [], args.code)
    _, csv_wall, csv_cpu = run(CSV_REFERENCE, [str(csv_path)], args.code)
    out, _, _ = run(STEPS, ["import", str(csv_path), str(slw_path)], args.code)
    first = json.loads(out)
    out, _, _ = run(STEPS, ["load", str(csv_path), str(slw_path)], args.code)
    second = json.loads(out)
    print(f"reference: python -c pass {pass_wall:.2f} s; csv.reader into lists {csv_wall:.2f} s wall "
          f"({csv_cpu:.2f} s CPU)")
    for step in ("import", "analyze", "save"):
        report(step, *first[step], first[f"{step}_peak"], 10.0)
    report("load", *second["load"], second["load_peak"], 3.0)
    print(f".slw {slw_path.stat().st_size / 1e6:.0f} MB ({slw_path.stat().st_size / args.n:.0f} bytes per activity); "
          f"import/csv.reader = {first['import'][0] / csv_wall:.1f}; load/csv.reader = {second['load'][0] / csv_wall:.1f}")
    if args.keep is None:
        for p in folder.iterdir():
            p.unlink()
        folder.rmdir()


if __name__ == "__main__":
    main()
