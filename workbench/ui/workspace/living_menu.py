"""The Progress menu: move the status date, manage baselines, and record the approval pack
just written as the (approved) baseline — the signed pack becomes the baseline, and the
plan hash in its footer ties the two."""

from __future__ import annotations

from PySide6.QtGui import QAction
from PySide6.QtWidgets import QInputDialog

from workbench.ui.workspace import baselines_dialog, status_dialog


def record_last_pack(window, name: str | None = None) -> bool:
    """Record the last exported pack as the approved baseline (asks for a name when none is
    given); refused when there is no pack or the plan changed since it was written."""
    from workbench.core.baseline import make_baseline
    from workbench.core.baseline_commands import RecordBaseline
    from workbench.core.errors import PlanError
    from workbench.io.planfile import plan_hash

    session, info = window.session, getattr(window, "last_pack", None)
    if info is None or info.analysis is None:
        return session.refuse("no approval pack has been exported from this window yet")
    if plan_hash(session.plan) != info.hash:
        return session.refuse("the plan changed since the pack was written; export the pack again first")
    if name is None:
        name, ok = QInputDialog.getText(window, "Record the pack as the baseline", "Name of the baseline:",
                                        text=f"Approval pack {info.hash}")
        if not ok:
            return False
    try:
        base = make_baseline(name, info.analysis, info.hash, info.simulation, approved=True)
    except PlanError as exc:
        return session.refuse(str(exc))
    return session.push(RecordBaseline(base))


def open_progress_demo(window) -> bool:
    """The bundled demo three months later (progress, approved baseline, odds trend), as a
    new unsaved plan so the bundled file is never overwritten."""
    from workbench.io.planfile import load_plan
    from workbench.resources import demo_update_path

    return window.files.new_plan(load_plan(demo_update_path()))


def living_menu(window, acts: dict) -> None:
    menu = window.menuBar().addMenu("&Progress")
    move = QAction("Move the &Status Date…", window)
    move.setStatusTip("Report progress to a new status date and re-forecast the remaining work")
    move.triggered.connect(lambda: status_dialog.move_status_date(window))      # looked up when used
    manage = QAction("&Baselines…", window)
    manage.setStatusTip("Record, rename, approve, delete and compare baselines")
    manage.triggered.connect(lambda: baselines_dialog.manage_baselines(window))
    pack = QAction("Record the Last &Pack as the Baseline…", window)
    pack.setStatusTip("The approval pack just exported becomes the approved baseline (same plan hash)")
    pack.triggered.connect(lambda: record_last_pack(window))
    demo = QAction("Open the Progress &Demo", window)
    demo.setStatusTip("The demo plan three months later: progress, an approved baseline and the odds trend")
    demo.triggered.connect(lambda: open_progress_demo(window))
    menu.addActions([move, manage, pack])
    menu.addSeparator()
    menu.addAction(demo)
    acts["move_status_date"], acts["baselines"], acts["record_pack"] = move, manage, pack
    acts["progress_demo"] = demo
