"""Screenshots of Present mode at projector size, for people to look at:
``python -m workbench.ui.present.shots OUTDIR [PLAN] [--iterations N] [--seed S]``
writes OUTDIR/present-1-summary.png … one per slide, at 1024×768, offscreen, and the
Timeline slide again with its groups open (present-2-timeline-open.png: the first page of rows)."""

from __future__ import annotations

import argparse
import os
import sys
import time
from pathlib import Path

SIZE = (1024, 768)


def _plan(path):
    if path:
        from workbench.io.tabular import load_any
        return load_any(path)
    demo = Path(__file__).resolve().parents[2] / "resources" / "demo.slw"
    if demo.exists():
        from workbench.io.planfile import load_plan
        return load_plan(demo)
    from workbench.core.demo import demo_plan
    return demo_plan()


def shoot(outdir, plan, simulation=None, size=SIZE) -> list[Path]:
    from PySide6.QtWidgets import QApplication

    from workbench.ui.present.window import PresentWindow
    from workbench.ui.session import Session

    app = QApplication.instance() or QApplication([])
    session = Session(plan)
    from workbench.ui.checkup.keeper import checkup_keeper
    checkup_keeper(session, threaded=False)      # the Checkup slide's odds checks are ready when shot
    if simulation is not None:
        session.set_simulation(simulation)
    window = PresentWindow(session)
    window.resize(*size)
    window.show()
    out = []
    for index in range(window.slide_count()):
        window.go(index)
        name = f"present-{index + 1}-{window.current_title().lower()}"
        out.append(_grab(app, window, Path(outdir) / f"{name}.png"))
        if window.current_title() == "Timeline":
            out.append(_groups_open(app, window, Path(outdir) / f"{name}-open.png"))
    window.close()
    return out


def _grab(app, window, path: Path) -> Path:
    for _ in range(5):              # let the charts lay out their axes before grabbing
        app.processEvents()
        time.sleep(0.05)
    finish = getattr(window.stack.currentWidget(), "finish_work", None)
    if callable(finish):            # a slide working in the background shows its result
        finish()
        for _ in range(5):
            app.processEvents()
            time.sleep(0.05)
    window.grab().save(str(path))
    return path


def _groups_open(app, window, path: Path) -> Path:
    """The Timeline slide with every group open (what G shows), then folded again."""
    from workbench.ui.timeline.present import fold_all
    view = window.stack.currentWidget()
    fold_all(view, False)
    _grab(app, window, path)
    fold_all(view, True)
    return path


def main(argv=None) -> int:
    os.environ.setdefault("QT_QPA_PLATFORM", "offscreen")
    parser = argparse.ArgumentParser(prog="python -m workbench.ui.present.shots")
    parser.add_argument("outdir")
    parser.add_argument("plan", nargs="?")
    parser.add_argument("--iterations", type=int, default=10_000)
    parser.add_argument("--seed", type=int, default=1)
    args = parser.parse_args(argv)
    Path(args.outdir).mkdir(parents=True, exist_ok=True)
    plan = _plan(args.plan)
    simulation = None
    if args.iterations > 0:
        from workbench.core.montecarlo import simulate
        simulation = simulate(plan, iterations=args.iterations, seed=args.seed)
    for path in shoot(args.outdir, plan, simulation):
        print(path)
    return 0


if __name__ == "__main__":
    sys.exit(main())
