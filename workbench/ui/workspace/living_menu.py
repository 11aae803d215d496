"""The Progress menu: move the status date, manage baselines."""

from __future__ import annotations

from functools import partial

from PySide6.QtGui import QAction

from workbench.ui.workspace.baselines_dialog import manage_baselines
from workbench.ui.workspace.status_dialog import move_status_date


def living_menu(window, acts: dict) -> None:
    menu = window.menuBar().addMenu("&Progress")
    move = QAction("Move the &Status Date…", window)
    move.setStatusTip("Report progress to a new status date and re-forecast the remaining work")
    move.triggered.connect(partial(move_status_date, window))
    manage = QAction("&Baselines…", window)
    manage.setStatusTip("Record, rename, approve, delete and compare baselines")
    manage.triggered.connect(partial(manage_baselines, window))
    menu.addActions([move, manage])
    acts["move_status_date"], acts["baselines"] = move, manage
