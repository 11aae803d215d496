"""Timeline drawing speed, as ratios to an empty Timeline measured in the same run.

Offscreen, 1920×1080. The subject and the reference are the same widget kind (a whole
TimelineView: toolbar, label column, date axis, chart, reference lines) rendered the
same way (``QWidget.render`` into a 1920×1080 image), the reference with a plan of no
activities. Two cases, each applied alike to subject and reference:

- **after a change**: every cached picture (chart, label column, date axis) is dropped
  before each render: what the user waits for after an edit, a zoom or a pan;
- **repaint**: nothing changed since the last render (an expose, a tooltip moving away).

The zoomed view is also measured **panned to rows not shown before** (one screen further
down before each render, caches dropped): labels seen for the first time are drawn into
the label atlas and looked up once; the other cases show rows whose labels are known.

Subjects: 10,000 activities with every row in view (targets: ≤ 20 ms and ≤ 2.5× the
empty Timeline) and zoomed to about 50 rows (target ≤ 1.3×). For comparison it also
prints the earlier method (only the plot area through ``QGraphicsView.render``, only the
chart's picture dropped, against an empty pyqtgraph plot), the geometry build time, and
writes a 100-activity chart at 1024×768 to a PNG for a person to look at (as after
"Fit all": the rows from the top at a legible pitch, each with its own label).

    python benchmarks/bench_timeline.py [--out DIR] [--rounds N]
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


def render_widget(widget, image: QImage) -> None:
    """The whole widget, as the window system would get it."""
    widget.render(image)


def render_plot_only(plot, image: QImage) -> None:
    """The earlier method: the plot's scene through QGraphicsView.render."""
    painter = QPainter(image)
    plot.render(painter)
    painter.end()


def interleaved(subjects: dict, rounds: int) -> dict[str, list[float]]:
    """Ms per subject and round, measured in alternating rounds (fair on a noisy machine).

    ``subjects``: name → (widget, render function, callable run before each render or None).
    """
    images = {k: QImage(w.size(), QImage.Format.Format_ARGB32_Premultiplied) for k, (w, _, _) in subjects.items()}
    times = {k: [] for k in subjects}
    for r in range(rounds + 1):
        for name, (widget, render, before) in subjects.items():
            images[name].fill(QColor("white"))
            t0 = time.perf_counter()
            if before is not None:
                before()
            render(widget, images[name])
            if r:                       # round 0 warms up
                times[name].append((time.perf_counter() - t0) * 1000.0)
    return times


def median(times: list[float]) -> float:
    return statistics.median(times)


def ratio(times: dict, subject: str, reference: str) -> float:
    """Median over rounds of subject / reference within the same round: a burst of load
    from elsewhere on the machine hits both sides of each ratio alike."""
    return statistics.median(a / b for a, b in zip(times[subject], times[reference]))


def timeline_for(n: int, size):
    from random_networks import layered_network, to_plan
    from workbench.ui.session import Session
    from workbench.core import Plan, Settings
    from workbench.ui.timeline.view import TimelineView
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


def build_views():
    full = timeline_for(10_000, SIZE)
    full.fit_all(every_row=True)
    zoom = timeline_for(10_000, SIZE)
    zoom.fit_all()
    zoom.view_box.setYRange(100 - 0.5, 150 - 0.5, padding=0)
    blank = timeline_for(0, SIZE)
    QApplication.processEvents()
    return full, zoom, blank


def new_method(full, zoom, blank, rounds: int) -> None:
    drop = {name: view.drop_paint_caches for name, view in (("full", full), ("zoom", zoom), ("blank", blank))}
    views = {"full": full, "zoom": zoom, "blank": blank}
    changed = interleaved({k: (v, render_widget, drop[k]) for k, v in views.items()}, rounds)
    still = interleaved({k: (v, render_widget, None) for k, v in views.items()}, rounds)
    panned = interleaved({"zoom": (zoom, render_widget, lambda: pan_to_new_rows(zoom)),
                          "blank": (blank, render_widget, blank.drop_paint_caches)}, rounds)
    print(f"whole TimelineView at {SIZE[0]}x{SIZE[1]} (QWidget.render), reference: empty Timeline "
          f"{median(changed['blank']):.2f} ms after a change, {median(still['blank']):.2f} ms repaint")
    for name, label, target in (("full", "10,000 activities, all rows", "<= 20 ms, <= 2.5x"),
                                ("zoom", f"10,000 activities, {zoom.item.painted_rows} rows in view", "<= 1.3x")):
        print(f"  {label} (target {target}):")
        for case, t in (("after a change", changed), ("repaint", still)):
            print(f"    {case}: {median(t[name]):.1f} ms, {ratio(t, name, 'blank'):.2f}x empty Timeline "
                  f"(ratio of medians {median(t[name]) / median(t['blank']):.2f}x)")
    print(f"    panned to rows not shown before: {median(panned['zoom']):.1f} ms, "
          f"{ratio(panned, 'zoom', 'blank'):.2f}x empty Timeline")


def pan_to_new_rows(view) -> None:
    """One screen of rows further down (back to the top at the end), caches dropped."""
    _, (top, bottom) = view.view_box.viewRange()
    step = bottom - top + 1.0
    top = top + step if bottom + step < view.geometry.n_rows else 0.5
    view.view_box.setYRange(top, top + step - 1.0, padding=0)
    view.drop_paint_caches()


def old_method(full, zoom, blank, rounds: int) -> None:
    bare = empty_plot(SIZE)
    t = interleaved({"bare": (bare, render_plot_only, None),
                     "blank": (blank.plot, render_plot_only, None),
                     "full": (full.plot, render_plot_only, full.item._changed),
                     "zoom": (zoom.plot, render_plot_only, zoom.item._changed)}, rounds)
    print(f"earlier method (plot area only, chart picture dropped): empty pyqtgraph plot "
          f"{median(t['bare']):.2f} ms, empty Timeline plot {median(t['blank']):.2f} ms")
    for name in ("full", "zoom"):
        print(f"  {name}: {median(t[name]):.1f} ms = {ratio(t, name, 'bare'):.1f}x empty plot, "
              f"{ratio(t, name, 'blank'):.2f}x empty Timeline plot")
    bare.close()


def main(argv=None) -> int:
    args = argparse.ArgumentParser(description=__doc__.splitlines()[0])
    args.add_argument("--out", default="benchmarks/out")
    args.add_argument("--rounds", type=int, default=15)
    opts = args.parse_args(argv)
    app = QApplication.instance() or QApplication([])  # noqa: F841
    full, zoom, blank = build_views()
    new_method(full, zoom, blank, opts.rounds)
    old_method(full, zoom, blank, opts.rounds)
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
