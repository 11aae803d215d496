"""Window speed: cold start, and edit → recompute → repaint on a 2,000-activity plan.

    python benchmarks/bench_ui.py [--quick]

Each figure is printed with a reference measured in the same run on the same machine:
cold start against ``python -c pass``; an edit round trip against the core's
``analyze(plan)`` alone. Targets: cold start ≤ 1.5 s, edit round trip ≤ 100 ms.
"""

from __future__ import annotations

import os
import statistics
import subprocess
import sys
import tempfile
import time
from pathlib import Path

ROOT = Path(__file__).resolve().parents[1]
sys.path.insert(0, str(ROOT))

HEAVY = ("PySide6.QtWidgets", "scipy.stats", "pyqtgraph")
START_SCRIPT = """
import sys
from PySide6.QtCore import QTimer
from PySide6.QtWidgets import QApplication
from workbench.ui.app import application, run_app
def shown():
    QApplication.processEvents()
    print("shown", flush=True)
    QApplication.quit()
app = application()
QTimer.singleShot(0, shown)
sys.exit(run_app([]))
"""


def _wall(args: list[str], env: dict, marker: str | None = None) -> float:
    """Seconds from launching ``args`` to its exit, or to the line ``marker`` on its output."""
    t0 = time.perf_counter()
    proc = subprocess.Popen(args, env=env, stdout=subprocess.PIPE, stderr=subprocess.DEVNULL, text=True)
    if marker is not None:
        for line in proc.stdout:
            if line.strip() == marker:
                break
    elapsed = time.perf_counter() - t0 if marker is not None else None
    proc.communicate(timeout=300)
    if proc.returncode != 0:
        raise RuntimeError(f"{args[:2]} exited with {proc.returncode}")
    return elapsed if elapsed is not None else time.perf_counter() - t0


def cold_start(repeats: int) -> tuple[float, float, dict]:
    """Median seconds of (python -c pass, start to a shown window with the demo plan), and
    of importing the heaviest dependencies alone, to show where the time goes."""
    with tempfile.TemporaryDirectory() as tmp:
        env = dict(os.environ, QT_QPA_PLATFORM=os.environ.get("QT_QPA_PLATFORM", "offscreen"),
                   SLACKLINE_MULTI_INSTANCE="1", SLACKLINE_DATA_DIR=tmp, XDG_CONFIG_HOME=tmp, HOME=tmp)
        ref, app = [], []
        parts: dict[str, list[float]] = {m: [] for m in HEAVY}
        for _ in range(repeats):
            ref.append(_wall([sys.executable, "-c", "pass"], env))
            app.append(_wall([sys.executable, "-c", START_SCRIPT], env, marker="shown"))
            for module in HEAVY:
                parts[module].append(_wall([sys.executable, "-c", f"import {module}"], env))
    return statistics.median(ref), statistics.median(app), {m: statistics.median(v) for m, v in parts.items()}


def edit_round_trip(n: int, edits: int, views: bool = True) -> tuple[float, float]:
    """Median ms of (analyze alone, push an edit + recompute + repaint the whole window).
    ``views=False`` puts placeholders in the docks: the window's own share."""
    os.environ.setdefault("QT_QPA_PLATFORM", "offscreen")
    os.environ["SLACKLINE_DATA_DIR"] = tempfile.mkdtemp(prefix="slackline-bench-")
    from benchmarks.random_networks import layered_network, to_plan
    from workbench.core.analysis import analyze
    from workbench.core.commands import EditActivity
    from workbench.ui.app import application
    from workbench.ui import main_window
    from workbench.ui.main_window import MainWindow
    from workbench.ui.session import Session
    app = application()
    real_make_view = main_window.make_view
    if not views:
        main_window.make_view = lambda *args, **kwargs: None
    plan = to_plan(layered_network(n, preds=3, seed=7))
    window = MainWindow(Session(plan))
    window.resize(1920, 1080)
    window.show()
    app.processEvents()
    core, full = [], []
    ids = plan.ids()
    for k in range(edits):
        t0 = time.perf_counter()
        analyze(plan)
        core.append(time.perf_counter() - t0)
        act = plan.activity(ids[(k * 37) % n])
        t0 = time.perf_counter()
        window.session.push(EditActivity(act.id, pessimistic=act.pessimistic + 1.0))
        app.processEvents()  # delivers the pending updates: everything that changed is repainted
        full.append(time.perf_counter() - t0)
    window.files.close()
    window.hide()
    main_window.make_view = real_make_view
    return statistics.median(core) * 1000, statistics.median(full) * 1000


def main() -> int:
    quick = "--quick" in sys.argv
    ref, start, parts = cold_start(2 if quick else 4)
    print(f"cold start: {start:.2f} s to a shown window; python -c pass {ref:.3f} s; ratio {start / ref:.1f}x "
          f"(target <= 1.5 s: {'met' if start <= 1.5 else 'missed'})")
    print("  importing alone: " + "; ".join(f"{m} {t:.2f} s ({t / start:.0%} of the start)" for m, t in parts.items()))
    edits = 8 if quick else 20
    for label, views in (("window with all views", True), ("window, views as placeholders", False)):
        core_ms, full_ms = edit_round_trip(2000, edits, views)
        print(f"2,000 activities, {label}: edit -> recompute -> repaint median {full_ms:.1f} ms; "
              f"analyze alone {core_ms:.1f} ms; ratio {full_ms / core_ms:.1f}x "
              f"(target <= 100 ms: {'met' if full_ms <= 100 else 'missed'})")
    return 0


if __name__ == "__main__":
    sys.exit(main())
