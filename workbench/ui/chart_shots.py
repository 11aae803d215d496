"""Screenshots of the Odds and Drivers views for people to look at (not for tests).

``python -m workbench.ui.chart_shots OUTDIR [PLAN] [--seed N] [--iterations N]`` renders
both views at 1920×1080 for the demo plan (or a plan file), with a simulation at a fixed
seed, and writes ``odds.png`` and ``drivers.png``.
"""

from __future__ import annotations

import argparse
import os
import sys
from pathlib import Path

os.environ.setdefault("QT_QPA_PLATFORM", "offscreen")

SIZE = (1920, 1080)


def _plan(path: str | None):
    if path:
        from workbench.io.tabular import load_any
        return load_any(path)
    from workbench.core.demo import demo_plan
    return demo_plan()


def render(outdir, plan, seed: int = 1, iterations: int = 10_000) -> list[Path]:
    """Simulate ``plan`` at ``seed`` and save both views as PNG files in ``outdir``."""
    from PySide6.QtWidgets import QApplication

    from workbench.core.montecarlo import simulate
    from workbench.ui.drivers.view import DriversView
    from workbench.ui.odds.view import OddsView
    from workbench.ui.session import Session

    app = QApplication.instance() or QApplication(sys.argv[:1])
    out = Path(outdir)
    out.mkdir(parents=True, exist_ok=True)
    session = Session(plan)
    views = {"odds.png": OddsView(session), "drivers.png": DriversView(session)}
    session.set_simulation(simulate(session.plan, iterations, seed=seed))
    paths = []
    for name, view in views.items():
        view.resize(*SIZE)
        view.show()
        app.processEvents()
        path = out / name
        view.grab().save(str(path))
        paths.append(path)
    for view in views.values():
        view.close()
        view.deleteLater()
    session.deleteLater()
    app.processEvents()
    return paths


def main(argv=None) -> int:
    parser = argparse.ArgumentParser(description="Render the Odds and Drivers views to PNG.")
    parser.add_argument("outdir")
    parser.add_argument("plan", nargs="?", help="a .slw, .csv or .xlsx plan (default: the demo plan)")
    parser.add_argument("--seed", type=int, default=1)
    parser.add_argument("--iterations", type=int, default=10_000)
    args = parser.parse_args(argv)
    from workbench.core.errors import PlanError
    try:
        plan = _plan(args.plan)
    except (PlanError, OSError) as exc:
        print(f"chart_shots: {exc}", file=sys.stderr)
        return 2
    for path in render(args.outdir, plan, args.seed, args.iterations):
        print(path)
    return 0


if __name__ == "__main__":
    sys.exit(main())
