"""Odds view speed: a date-marker drag (readout + shading per move) and the GUI thread's
responsiveness while 10,000 iterations run in the worker.

Prints ratios against references measured in the same run (shared, noisy machine):
  drag move / empty event-loop tick, drag move / 16 ms frame budget,
  max timer gap while simulating / max timer gap while idle.
Run: QT_QPA_PLATFORM=offscreen python benchmarks/bench_odds.py [--moves N] [--iterations N]
"""

from __future__ import annotations

import argparse
import os
import statistics
import sys
import time

os.environ.setdefault("QT_QPA_PLATFORM", "offscreen")

from PySide6.QtCore import QElapsedTimer, QEvent, QObject, QTimer  # noqa: E402
from PySide6.QtWidgets import QApplication  # noqa: E402

FRAME_MS = 16.0


def demo_plan():
    try:
        from workbench.core.demo import demo_plan as make
        return make(), "demo plan"
    except ImportError:  # the demo plan is not in this checkout yet: a random network
        sys.path.insert(0, os.path.dirname(__file__))
        from random_networks import layered_network, to_plan
        return to_plan(layered_network(60, preds=2, seed=1)), "random 60-activity network (no demo plan yet)"


def empty_tick_ms(app, count: int = 300) -> list[float]:
    """One round trip through the event loop with nothing else to do."""
    out = []
    for _ in range(count):
        done = []
        t0 = time.perf_counter()
        QTimer.singleShot(0, lambda: done.append(1))
        while not done:
            app.processEvents()
        out.append((time.perf_counter() - t0) * 1000)
    return out


class PaintCounter(QObject):
    def __init__(self):
        super().__init__()
        self.count = 0

    def eventFilter(self, obj, event):  # noqa: N802 (Qt override)
        if event.type() == QEvent.Paint:
            self.count += 1
        return False


def drag_ms(app, view, moves: int, full: bool) -> tuple[list[float], list[float], int]:
    """Each move: set the marker (as a drag does), then let Qt repaint what changed
    (``full``: force a repaint of the whole chart instead). Returns wall-clock times,
    CPU times of this process (less disturbed by other work on a shared machine) and paints."""
    a = view.analysis
    lo, hi = a.pert.mean - 2 * a.pert.sd, a.pert.mean + 2 * a.pert.sd
    line, out, cpu = view.plot.markers[0], [], []
    counter = PaintCounter()
    view.plot.viewport().installEventFilter(counter)
    for k in range(moves):
        x = lo + (hi - lo) * (k % 50) / 49.0
        t0, c0 = time.perf_counter(), time.process_time()
        line.setValue(x)
        if full:
            view.plot.viewport().repaint()
        app.processEvents()
        out.append((time.perf_counter() - t0) * 1000)
        cpu.append((time.process_time() - c0) * 1000)
    view.plot.viewport().removeEventFilter(counter)
    return out, cpu, counter.count


def max_gap_ms(app, seconds: float | None, running=None, interval: int = 5) -> float:
    """Largest gap between ticks of a 5 ms timer, for ``seconds`` or while ``running()``."""
    stamps, clock = [], QElapsedTimer()
    timer = QTimer()
    timer.setInterval(interval)
    timer.timeout.connect(lambda: stamps.append(clock.nsecsElapsed() / 1e6))
    clock.start()
    timer.start()
    while (running() if running else clock.elapsed() < seconds * 1000):
        app.processEvents()
        time.sleep(0.0005)
    timer.stop()
    gaps = [b - a for a, b in zip(stamps, stamps[1:])]
    return max(gaps) if gaps else float("nan"), clock.elapsed() / 1000.0


def main() -> None:
    parser = argparse.ArgumentParser(description=__doc__.splitlines()[0])
    parser.add_argument("--moves", type=int, default=300)
    parser.add_argument("--iterations", type=int, default=10_000)
    args = parser.parse_args()
    app = QApplication.instance() or QApplication(sys.argv)
    from workbench.ui.odds.view import OddsView
    from workbench.ui.session import Session
    plan, label = demo_plan()
    session = Session(plan)
    view = OddsView(session)
    view.resize(1920, 1080)
    view.show()
    app.processEvents()
    print(f"plan: {label}, {len(plan.activities)} activities")
    run_simulation(app, view, args.iterations)
    tick = statistics.median(empty_tick_ms(app))
    print(f"empty event-loop tick (reference): median {tick:.4f} ms")
    for full in (False, True):
        moves, cpu, paints = drag_ms(app, view, args.moves, full)
        med, p95 = statistics.median(moves), sorted(moves)[int(0.95 * len(moves)) - 1]
        cmed = statistics.mean(cpu)  # CPU clock ticks coarsely: the mean is the fair figure
        what = "whole chart repainted" if full else "Qt repaints what changed"
        print(f"drag move, readout + shading ({what}; {paints} paints / {len(moves)} moves): "
              f"wall median {med:.2f} ms, p95 {p95:.2f} ms; CPU mean {cmed:.2f} ms")
        print(f"  ratio median move / empty tick: {med / tick:,.0f}x; "
              f"wall median / 16 ms budget: {med / FRAME_MS:.2f} (p95 {p95 / FRAME_MS:.2f}); "
              f"CPU mean / 16 ms budget: {cmed / FRAME_MS:.2f} (below 1 meets it)")


def run_simulation(app, view, iterations: int) -> None:
    idle_gap, idle_s = max_gap_ms(app, 2.0)
    t0 = time.perf_counter()
    view.run_simulation(iterations, 1)
    busy_gap, busy_s = max_gap_ms(app, None, running=lambda: view.runner.running)
    took = time.perf_counter() - t0
    ok = view.session.simulation is not None
    print(f"simulation of {iterations:,} iterations in the worker: {took:.2f} s, result stored: {ok}")
    print(f"  max gap between 5 ms timer ticks: idle {idle_gap:.1f} ms, while simulating {busy_gap:.1f} ms")
    print(f"  ratio max gap simulating / idle: {busy_gap / idle_gap:.1f}x; "
          f"max gap / 16 ms frame budget: {busy_gap / FRAME_MS:.2f}")


if __name__ == "__main__":
    main()
