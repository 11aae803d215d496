"""Approval-pack speed: the demo plan's pack (target <= 2 s) and a 500-activity plan's pack
(target <= 5 s), simulation time excluded (the simulation is run first and handed in).

Each is printed as a ratio to a one-page reportlab document (a page of text, a table and
a few hundred vector strokes) built in the same run, so the figures travel between
machines. Median of a few runs; keep it short on a shared box.

    python benchmarks/bench_report.py [--repeat 3] [--iterations 2000]
"""

from __future__ import annotations

import argparse
import datetime as dt
import io
import statistics
import sys
import tempfile
import time
from pathlib import Path

sys.path.insert(0, str(Path(__file__).resolve().parent))

from random_networks import layered_network, to_plan  # noqa: E402

from workbench.reports.pack import build_pack  # noqa: E402

WHEN = dt.datetime(2027, 1, 1, tzinfo=dt.timezone.utc)


def one_page_reference() -> float:
    """Seconds for a one-page reportlab document with text, a table and 300 strokes."""
    from reportlab.lib.pagesizes import A4
    from reportlab.lib.styles import getSampleStyleSheet
    from reportlab.platypus import Flowable, Paragraph, SimpleDocTemplate, Table

    class Strokes(Flowable):
        def wrap(self, *_):
            return 400, 200

        def draw(self):
            for k in range(300):
                self.canv.line(k, 0, k + 50, 200 - k % 200)

    start = time.perf_counter()
    styles = getSampleStyleSheet()
    story = [Paragraph("Reference page", styles["Title"]), Paragraph("text " * 200, styles["BodyText"]),
             Table([[f"r{r}c{c}" for c in range(8)] for r in range(20)]), Strokes()]
    SimpleDocTemplate(io.BytesIO(), pagesize=A4, invariant=1).build(story)
    return time.perf_counter() - start


def demo_plan():
    root = Path(__file__).resolve().parents[1]
    if (root / "resources" / "demo.slw").exists():
        from workbench.io.planfile import load_plan
        return load_plan(root / "resources" / "demo.slw"), "resources/demo.slw"
    try:
        from workbench.core.demo import demo_plan as make
        return make(), "workbench.core.demo"
    except ImportError:
        return to_plan(layered_network(40, preds=2, seed=11)), "40-activity stand-in (no demo plan yet)"


def simulation_for(plan, iterations: int):
    try:
        from workbench.core.montecarlo import simulate
    except ImportError:
        return None
    return simulate(plan, iterations=iterations, seed=1)


def time_pack(plan, sim, repeat: int, folder: Path) -> tuple[float, int]:
    times, pages = [], 0
    for k in range(repeat):
        start = time.perf_counter()
        info = build_pack(plan, folder / f"bench-{k}.pdf", iterations=0 if sim is None else 1,
                          simulation=sim, generated_at=WHEN)
        times.append(time.perf_counter() - start)
        pages = info.pages
    return statistics.median(times), pages


def main(argv=None) -> int:
    parser = argparse.ArgumentParser()
    parser.add_argument("--repeat", type=int, default=3)
    parser.add_argument("--iterations", type=int, default=2000)
    args = parser.parse_args(argv)
    one_page_reference()                                   # warm the fonts and imports
    ref = statistics.median(one_page_reference() for _ in range(5))
    cases = [(*demo_plan(), 2.0), (to_plan(layered_network(500, preds=3, seed=5)), "500-activity layered plan", 5.0)]
    print(f"reference one-page document: {ref * 1000:.1f} ms")
    with tempfile.TemporaryDirectory() as tmp:
        for plan, label, target in cases:
            sim = simulation_for(plan, args.iterations)
            seconds, pages = time_pack(plan, sim, args.repeat, Path(tmp))
            note = "with" if sim is not None else "WITHOUT (montecarlo not importable)"
            print(f"{label}: {len(plan)} activities, {pages} pages, {note} simulation pages: "
                  f"{seconds:.2f} s = {seconds / ref:.0f}x the one-page reference "
                  f"(target {target:.0f} s: {'met' if seconds <= target else 'MISSED'})")
    return 0


if __name__ == "__main__":
    sys.exit(main())
