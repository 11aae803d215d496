"""Timeline drawing speed, as ratios to an empty plot measured in the same run.

Offscreen, 1920×1080. Prints:
- full redraw of 10,000 activities (all rows in view, cached picture cleared each time)
  vs an empty pyqtgraph plot of the same size (targets: ≤ 20 ms and ≤ 2.5×);
- the same chart zoomed to ~50 visible rows vs the empty plot (target ≤ 1.3×), both
  redrawn after a change and repainted unchanged (from the cached QPicture);
- geometry build time for 10,000 activities (for information);
and writes a 100-activity chart at 1024×768 to a PNG for a person to look at.

    python benchmarks/bench_timeline.py [--out DIR] [--repeat N]
"""

from __future__ import annotations

import argparse
import datetime as dt
import os
import statistics
import sys
import time
from pathlib import Path

os.environ.setdefault("QT_QPA_PLATFORM", "offscreen")
sys.path.insert(0, str(Path(__file__).resolve().parent))

from PySide6.QtGui import QColor, QImage, QPainter  # noqa: E402
from PySide6.QtWidgets import QApplication  # noqa: E402

SIZE = (1920, 1080)


def render_once(widget, image: QImage, before=None) -> float:
    """Milliseconds to paint the whole plot widget into ``image``."""
    image.fill(QColor("white"))
    t0 = time.perf_counter()
    if before is not None:
        before()
    painter = QPainter(image)
    widget.render(painter)
    painter.end()
    return (time.perf_counter() - t0) * 1000.0


def interleaved(subjects: dict, rounds: int) -> dict[str, float]:
    """Median ms per subject, measured in alternating rounds (fair on a noisy machine).

    ``subjects``: name → (widget, callable run before each paint or None).
    """
    images = {k: QImage(w.size(), QImage.Format.Format_ARGB32_Premultiplied) for k, (w, _) in subjects.items()}
    times = {k: [] for k in subjects}
    for r in range(rounds + 1):
        for name, (widget, before) in subjects.items():
            ms = render_once(widget, images[name], before)
            if r:                       # round 0 warms up
                times[name].append(ms)
    return {k: statistics.median(v) for k, v in times.items()}


def timeline_for(n: int, size):
    from random_networks import layered_network, to_plan
    from workbench.ui.session import Session
    from workbench.core import Plan, Settings
    from workbench.ui.timeline_view import TimelineView
    plan = to_plan(layered_network(n, seed=7)) if n else Plan(Settings(start=dt.date(2027, 1, 4)))
    view = TimelineView(Session(plan))
    view.resize(*size)
    view.show()
    QApplication.processEvents()
    return view


def empty_plot(size):
    import pyqtgraph as pg
    plot = pg.PlotWidget(background="w")
    plot.resize(*size)
    plot.show()
    QApplication.processEvents()
    return plot


def geometry_ms(view, repeat: int) -> float:
    from workbench.figures.timeline import timeline_geometry
    analysis = view.session.analysis
    times = []
    for _ in range(repeat):
        t0 = time.perf_counter()
        timeline_geometry(analysis)
        times.append((time.perf_counter() - t0) * 1000.0)
    return statistics.median(times)


def main(argv=None) -> int:
    args = argparse.ArgumentParser(description=__doc__.splitlines()[0])
    args.add_argument("--out", default="benchmarks/out")
    args.add_argument("--rounds", type=int, default=15)
    opts = args.parse_args(argv)
    app = QApplication.instance() or QApplication([])
    full = timeline_for(10_000, SIZE)
    full.fit_all()
    zoom, still = timeline_for(10_000, SIZE), timeline_for(10_000, SIZE)
    for view in (zoom, still):
        view.fit_all()
        view.view_box.setYRange(100 - 0.5, 150 - 0.5, padding=0)
    bare, blank = empty_plot(SIZE), timeline_for(0, SIZE)
    QApplication.processEvents()
    t = interleaved({"bare": (bare, None),
                     "blank": (blank.plot, None),
                     "full": (full.plot, full.item._changed),
                     "zoom": (zoom.plot, zoom.item._changed),
                     "zoom_cached": (still.plot, None)}, opts.rounds)
    print(f"references at {SIZE[0]}x{SIZE[1]}: empty pyqtgraph plot {t['bare']:.2f} ms; "
          f"empty Timeline (no activities: same axes, lines, label column) {t['blank']:.2f} ms")
    for name, label, target in (("full", "10,000 activities, all rows", "<= 20 ms, <= 2.5x"),
                                ("zoom", f"10,000 activities, {zoom.item.painted_rows} rows in view", "<= 1.3x")):
        print(f"{label}: {t[name]:.1f} ms = {t[name] / t['bare']:.1f}x empty plot, "
              f"{t[name] / t['blank']:.2f}x empty Timeline (target {target})")
    print(f"same view repainted from its cached QPicture: {t['zoom_cached']:.1f} ms = "
          f"{t['zoom_cached'] / t['bare']:.1f}x empty plot, {t['zoom_cached'] / t['blank']:.2f}x empty Timeline")
    print(f"geometry for 10,000 activities: {geometry_ms(full, 3):.1f} ms (on schedule change, not per paint)")
    out = Path(opts.out)
    out.mkdir(parents=True, exist_ok=True)
    small = timeline_for(100, (1024, 768))
    small.fit_all()
    small.export_png(out / "timeline_100.png", (1024, 768))
    print(f"wrote {out / 'timeline_100.png'} (look at it: every label must be legible)")
    return 0


if __name__ == "__main__":
    sys.exit(main())
