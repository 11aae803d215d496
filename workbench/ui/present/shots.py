"""Screenshots of Present mode at projector size, for people to look at:
``python -m workbench.ui.present.shots OUTDIR [PLAN] [--iterations N] [--seed S]``
writes OUTDIR/present-1-summary.png … one per slide, at 1024×768, offscreen."""

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
    if simulation is not None:
        session.set_simulation(simulation)
    window = PresentWindow(session)
    window.resize(*size)
    window.show()
    out = []
    for index in range(window.slide_count()):
        window.go(index)
        for _ in range(5):              # let the charts lay out their axes before grabbing
            app.processEvents()
            time.sleep(0.05)
        path = Path(outdir) / f"present-{index + 1}-{window.current_title().lower()}.png"
        window.grab().save(str(path))
        out.append(path)
    window.close()
    return out


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
