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

HEAVY = ("PySide6.QtWidgets", "scipy.special", "pyqtgraph")   # what the window still imports before it is drawn
FRONT = ("Timeline", "Odds")   # the views on screen in the default layout
START_SCRIPT = """
import sys
from PySide6.QtCore import QTimer
from PySide6.QtWidgets import QApplication, QMainWindow
from workbench.ui.workspace.app import application, run_app
FRONT = %r

def drawn(window):
    built = getattr(window, "built_views", lambda: window.views)()
    if not set(FRONT) <= set(built):
        return False
    return not any(getattr(getattr(v, "when_shown", None), "dirty", False) for v in built.values())

said = []

def say(what):
    import time
    print(what, flush=True)
    print("cpu " + format(time.process_time(), ".4f"), flush=True)   # this process's CPU seconds so far
    said.append(what)

def check():
    QApplication.processEvents()
    windows = [w for w in QApplication.topLevelWidgets() if isinstance(w, QMainWindow) and w.isVisible()]
    if windows and drawn(windows[0]):
        QApplication.processEvents()
        say("shown")
        QApplication.quit()
    else:
        QTimer.singleShot(1, check)

from PySide6.QtCore import QEvent, QObject
from PySide6.QtWidgets import QTableView

class FirstTable(QObject):
    # says "interactive" once the Activities table has been painted with the plan's rows:
    # the window takes clicks and edits from then on (the charts may still be on their way)
    painted = False

    def eventFilter(self, watched, event):
        if self.painted and not said:
            say("interactive")
        elif not self.painted and event.type() == QEvent.Type.Paint and isinstance(watched.parent(), QTableView):
            self.painted = watched.parent().model() is not None and watched.parent().model().rowCount() > 0
        return False

app = application()
first_table = FirstTable()
app.installEventFilter(first_table)
QTimer.singleShot(0, check)
sys.exit(run_app([]))
""" % (FRONT,)


def _wall(args: list[str], env: dict, markers: tuple[str, ...] = ()) -> list[float]:
    """Seconds from launching ``args`` to each line in ``markers`` on its output (in that
    order), or to its exit when there are none."""
    t0 = time.perf_counter()
    proc = subprocess.Popen(args, env=env, stdout=subprocess.PIPE, stderr=subprocess.DEVNULL, text=True)
    times, wanted = [], list(markers)
    for line in proc.stdout if wanted else ():
        if line.strip() == wanted[0]:
            times.append(time.perf_counter() - t0)
            wanted.pop(0)
            if not wanted:
                break
    proc.communicate(timeout=300)
    if proc.returncode != 0 or wanted:
        raise RuntimeError(f"{args[:2]} exited with {proc.returncode} before {wanted}")
    return times or [time.perf_counter() - t0]


def cold_start(repeats: int) -> tuple[float, float, dict]:
    """Median seconds of (python -c pass, start to the window with the demo plan and its
    front views drawn), and of importing the heaviest dependencies alone, to show where
    the time goes."""
    with tempfile.TemporaryDirectory() as tmp:
        env = dict(os.environ, QT_QPA_PLATFORM=os.environ.get("QT_QPA_PLATFORM", "offscreen"),
                   SLACKLINE_MULTI_INSTANCE="1", SLACKLINE_DATA_DIR=tmp, XDG_CONFIG_HOME=tmp, HOME=tmp,
                   PYTHONPATH=str(ROOT))   # this tree's workbench, whatever is installed
        ref, shown = [], []
        parts: dict[str, list[float]] = {m: [] for m in HEAVY}
        for _ in range(repeats):
            ref += _wall([sys.executable, "-c", "pass"], env)
            shown += _wall([sys.executable, "-c", START_SCRIPT], env, ("shown",))
            for module in HEAVY:
                parts[module] += _wall([sys.executable, "-c", f"import {module}"], env)
    med = statistics.median
    return med(ref), med(shown), {m: med(v) for m, v in parts.items()}


def edit_round_trip(n: int, edits: int, views: bool = True, front: tuple[str, ...] = ()) -> tuple[float, float]:
    """Median ms of (analyze alone, push an edit + recompute + repaint the whole window).
    ``views=False`` puts placeholders in the docks: the window's own share. ``front``
    names docks to bring forward (the default layout shows the Timeline and the Odds)."""
    os.environ.setdefault("QT_QPA_PLATFORM", "offscreen")
    os.environ["SLACKLINE_DATA_DIR"] = tempfile.mkdtemp(prefix="slackline-bench-")
    from benchmarks.random_networks import layered_network, to_plan
    from workbench.core.analysis import analyze
    from workbench.core.commands import EditActivity
    from workbench.ui.workspace.app import application
    from workbench.ui.workspace import window as main_window
    from workbench.ui.workspace.window import MainWindow
    from workbench.ui.session import Session
    app = application()
    real_make_view = main_window.make_view
    if not views:
        main_window.make_view = lambda *args, **kwargs: None
    plan = to_plan(layered_network(n, preds=3, seed=7, link_types=True))
    window = MainWindow(Session(plan))
    window.resize(1920, 1080)
    window.show()
    for title in front:
        window.docks[title].raise_()
    for _ in range(5):
        app.processEvents()
    core, full, cpu = [], [], []
    ids = plan.ids()
    for k in range(edits):
        t0 = time.perf_counter()
        analyze(plan)
        core.append(time.perf_counter() - t0)
        act = plan.activity(ids[(k * 37) % n])
        t0, c0 = time.perf_counter(), time.process_time()
        window.session.push(EditActivity(act.id, pessimistic=act.pessimistic + 1.0))
        app.processEvents()  # delivers the pending updates: everything that changed is repainted
        full.append(time.perf_counter() - t0)
        cpu.append(time.process_time() - c0)
    window.files.close()
    window.hide()
    main_window.make_view = real_make_view
    EDIT_CPU_MS[:] = [statistics.median(cpu) * 1000]
    return statistics.median(core) * 1000, statistics.median(full) * 1000


EDIT_CPU_MS: list[float] = []   # the last edit_round_trip's median CPU ms per edit (this process)


def main() -> int:
    quick = "--quick" in sys.argv
    ref, start, parts = cold_start(2 if quick else 4)
    print(f"cold start: window with the demo plan and its front views drawn {start:.2f} s; "
          f"python -c pass {ref:.3f} s; ratio {start / ref:.1f}x (target <= 1.5 s: {'met' if start <= 1.5 else 'missed'})")
    print("  importing alone: " + "; ".join(f"{m} {t:.2f} s ({t / start:.0%} of the start)" for m, t in parts.items()))
    edits = 8 if quick else 20
    rows = (("window with all views, default layout", True, ()),
            ("window with all views, Network and Drivers in front", True, ("Network", "Drivers")),
            ("window, views as placeholders", False, ()))
    for label, views, front in rows:
        core_ms, full_ms = edit_round_trip(2000, edits, views, front)
        print(f"2,000 activities, {label}: edit -> recompute -> repaint median {full_ms:.1f} ms; "
              f"analyze alone {core_ms:.1f} ms; ratio {full_ms / core_ms:.1f}x "
              f"(target <= 100 ms: {'met' if full_ms <= 100 else 'missed'})")
    return 0


if __name__ == "__main__":
    sys.exit(main())
