"""Time .slw save/load and CSV/XLSX import/export of a 5,000-activity layered network,
as ratios to json.dumps/json.loads of the same plan data (measured in the same run)."""
import json, sys, tempfile, time
from pathlib import Path
sys.path.insert(0, str(Path(__file__).resolve().parent))
from random_networks import layered_network, to_plan
from workbench.core import analyze
from workbench.io.planfile import save_plan, load_plan, plan_to_dict, plan_hash
from workbench.io.tabular import export_table, read_table

def best(fn, reps=3):
    times = []
    for _ in range(reps):
        t = time.perf_counter(); fn(); times.append(time.perf_counter() - t)
    return min(times)

n = int(sys.argv[1]) if len(sys.argv) > 1 else 5000
plan = to_plan(layered_network(n, preds=3, seed=1, link_types=True))
data = plan_to_dict(plan); text = json.dumps(data)
ref_dump = best(lambda: json.dumps(data)); ref_load = best(lambda: json.loads(text))
res = analyze(plan)
with tempfile.TemporaryDirectory() as d:
    d = Path(d); slw = d / "p.slw"
    t_save = best(lambda: save_plan(plan, slw)); t_load = best(lambda: load_plan(slw))
    t_hash = best(lambda: plan_hash(plan))
    t_csv_out = best(lambda: export_table(res, d / "p.csv")); t_csv_in = best(lambda: read_table(d / "p.csv", plan.settings))
    t_x_out = best(lambda: export_table(res, d / "p.xlsx"), 1); t_x_in = best(lambda: read_table(d / "p.xlsx", plan.settings), 1)
print(f"{n} activities, {len(plan.links)} links; reference json.dumps {ref_dump*1e3:.1f} ms, json.loads {ref_load*1e3:.1f} ms")
for name, t, ref in [("save .slw (incl. read-back check, fsync)", t_save, ref_dump), ("load .slw", t_load, ref_load),
                     ("plan_hash", t_hash, ref_dump), ("export CSV", t_csv_out, ref_dump), ("import CSV", t_csv_in, ref_load),
                     ("export XLSX", t_x_out, ref_dump), ("import XLSX", t_x_in, ref_load)]:
    print(f"  {name:42s} {t/ref:7.1f} x reference")
