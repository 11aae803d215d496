"""How long the window's own thread is held by an autosave of a large plan (default
100,000 activities): the longest gap between ticks of a 5 ms timer on the main thread
while the recovery copy is written by a worker from a snapshot, against the time the
same copy takes when written on the main thread (the old way), measured in the same run.

    python benchmarks/bench_autosave.py [N]
"""
import os, sys, tempfile, threading, time
from pathlib import Path
sys.path.insert(0, str(Path(__file__).resolve().parent))
os.environ.setdefault("QT_QPA_PLATFORM", "offscreen")
from random_networks import layered_network, to_plan
from PySide6.QtCore import QCoreApplication, QTimer
from workbench.ui.workspace.recovery import RecoveryStore

n = int(sys.argv[1]) if len(sys.argv) > 1 else 100_000
plan = to_plan(layered_network(n, preds=2, seed=3))
app = QCoreApplication([])
with tempfile.TemporaryDirectory() as folder:
    store = RecoveryStore(Path(folder))
    store.claim(None)
    t = time.perf_counter(); store.write(plan); blocking = time.perf_counter() - t

    gaps, last = [], [time.perf_counter()]
    def tick():
        now = time.perf_counter(); gaps.append(now - last[0]); last[0] = now
    timer = QTimer(); timer.setInterval(5); timer.timeout.connect(tick); timer.start()
    t = time.perf_counter(); snap = plan.snapshot(); snapshot = time.perf_counter() - t
    worker = threading.Thread(target=store.write, args=(snap,)); worker.start()
    while worker.is_alive():
        app.processEvents(); time.sleep(0.001)
    timer.stop()
    store.release()
print(f"{n} activities: recovery copy written on the main thread {blocking*1e3:.0f} ms (reference)")
print(f"  snapshot on the main thread        {snapshot*1e3:8.1f} ms  = {snapshot/blocking:6.3f} x reference")
print(f"  longest main-thread gap meanwhile  {max(gaps)*1e3:8.1f} ms  = {max(gaps)/blocking:6.3f} x reference")
