"""Network view benchmark: layout of 500 and 2,000 activities, and one pan/zoom frame.

Targets: layout ≤ 0.5 s for 500 and ≤ 3 s for 2,000 activities; a pan/zoom frame of
2,000 nodes ≤ 30 ms. Every time is printed as a ratio against a reference measured in
the same run (one CPM analysis of the same plan; an empty view's frame), and against its
target. Run: ``python benchmarks/bench_network.py`` (about half a minute).
"""

from __future__ import annotations

import os
import statistics
import sys
import time
from pathlib import Path

os.environ.setdefault("QT_QPA_PLATFORM", "offscreen")
sys.path.insert(0, str(Path(__file__).resolve().parent))

from random_networks import layered_network, to_plan  # noqa: E402

from workbench.core.analysis import analyze  # noqa: E402
from workbench.figures.network_layout import layout_plan, structure_geometry  # noqa: E402


def best_of(fn, repeats: int) -> float:
    times = []
    for _ in range(repeats):
        t0 = time.perf_counter()
        fn()
        times.append(time.perf_counter() - t0)
    return min(times)


def bench_layout(n: int, target: float) -> None:
    plan = to_plan(layered_network(n, preds=3, seed=11))
    analysis = analyze(plan)

    def fresh():
        structure_geometry.cache_clear()
        layout_plan(plan, analysis)

    t = best_of(fresh, 3)
    ref = best_of(lambda: analyze(plan), 3)
    cached = best_of(lambda: layout_plan(plan, analysis), 3)
    lay = layout_plan(plan, analysis)
    print(f"layout {n:>5} activities, {len(plan.links)} links: {t:.3f} s = {t / target:.2f} x target "
          f"({target:g} s) = {t / ref:.1f} x one CPM analysis; cached re-layout {cached / ref:.2f} x CPM; "
          f"crossings {lay.crossings} (plan order {lay.naive_crossings}, ratio {lay.crossings / max(1, lay.naive_crossings):.2f})")


def frame_ms(view, app, kind: str, steps: int = 8) -> float:
    """Median time of one repaint after a small pan, a small zoom, or a zoom followed by
    the sharp redraw that comes once zooming pauses ("settle")."""
    port, box = view.graphics.viewport(), view.viewbox
    times = []
    for i in range(steps):
        sign = 1 if i % 2 else -1
        if kind == "pan":
            box.translateBy(t=(sign * 0.03 * box.viewRect().width(), 0.0))
        else:
            f = 1.05 if sign > 0 else 1 / 1.05
            box.scaleBy((f, f))
        app.processEvents()
        if kind == "settle":
            view.item._settled = True
        t0 = time.perf_counter()
        port.repaint()
        times.append(time.perf_counter() - t0)
    return statistics.median(times) * 1000.0


def bench_frames() -> None:
    from PySide6.QtCore import QRectF
    from PySide6.QtWidgets import QApplication

    from workbench.core.model import Plan, Settings
    from workbench.ui.network.view import NetworkView
    from workbench.ui.session import Session

    app = QApplication.instance() or QApplication([])
    empty = NetworkView(Session(Plan(Settings(title="empty"))))
    full = NetworkView(Session(to_plan(layered_network(2000, preds=3, seed=11))))
    for v in (empty, full):
        v.resize(1600, 900)
        v.show()
    app.processEvents()
    base = frame_ms(empty, app, "pan", steps=24)
    report = []
    for kind in ("pan", "zoom", "settle"):
        report.append((f"whole network fitted, {kind}", frame_ms(full, app, kind)))
    x, y, w, h = full.layout_result.boxes[1000]
    full.viewbox.setRange(QRectF(x - 4 * w, y - 3 * h, 9 * w, 6 * h), padding=0)
    app.processEvents()
    for kind in ("pan", "zoom"):
        report.append((f"zoomed in with full node text, {kind}", frame_ms(full, app, kind)))
    for label, ms in report:
        print(f"frame, 2000 nodes, {label}: {ms:.1f} ms = {ms / 30:.2f} x target (30 ms) "
              f"= {ms / max(base, 1e-3):.1f} x an empty view ({base:.2f} ms)")


if __name__ == "__main__":
    bench_layout(500, 0.5)
    bench_layout(2000, 3.0)
    bench_frames()
