"""Show the window on a screen of the size in argv[2]×argv[3] (the offscreen platform with
one screen, see the test), every dock open and each tab brought forward in turn; print
JSON: the screen, and every part of the window that lies outside it. argv[1]: a scratch
folder. With argv[4] == "restore": first save a geometry far off the screen, then start."""

import json
import os
import sys

folder, width, height = sys.argv[1], int(sys.argv[2]), int(sys.argv[3])
os.environ["SLACKLINE_DATA_DIR"] = os.path.join(folder, "data")

from PySide6.QtCore import QRect, QSettings, Qt  # noqa: E402
from PySide6.QtWidgets import QApplication, QMenuBar, QStatusBar, QToolBar  # noqa: E402

from workbench.ui.session import Session  # noqa: E402
from workbench.ui.workspace.app import application, demo_plan  # noqa: E402

app = application()
QSettings.setDefaultFormat(QSettings.Format.IniFormat)
QSettings.setPath(QSettings.Format.IniFormat, QSettings.Scope.UserScope, os.path.join(folder, "settings"))
from workbench.ui.workspace.window import MainWindow  # noqa: E402

if len(sys.argv) > 4 and sys.argv[4] == "restore":
    first = MainWindow(Session(demo_plan()))
    first.show()
    first.setGeometry(5200, 3100, 1700, 1000)   # where a big monitor that is gone had it
    first.save_layout()
    first.hide()


def settle():
    for _ in range(5):
        app.processEvents()


def outside(window, screen: QRect) -> list[str]:
    parts = [("window", window.frameGeometry())]
    for name, dock in window.docks.items():
        if dock.isVisible() and not dock.visibleRegion().isEmpty():
            parts.append((f"dock {name}", QRect(dock.mapToGlobal(dock.rect().topLeft()), dock.size())))
    for kind in (QMenuBar, QStatusBar, QToolBar):
        for bar in window.findChildren(kind, options=Qt.FindChildOption.FindDirectChildrenOnly):
            if bar.isVisible():
                parts.append((type(bar).__name__, QRect(bar.mapToGlobal(bar.rect().topLeft()), bar.size())))
    centre = window.centralWidget()
    parts.append(("table and summary", QRect(centre.mapToGlobal(centre.rect().topLeft()), centre.size())))
    return [f"{name} {r.getRect()}" for name, r in parts if not screen.contains(r)]


window = MainWindow(Session(demo_plan()))
window.show()
settle()
for dock in window.docks.values():
    dock.show()
window.views   # every view built, as after a while of use
settle()
screen = window.screen().availableGeometry()
found, widths = [], set()
for title in ("Timeline", "Network", "Odds", "Drivers", "History"):
    window.docks[title].raise_()
    settle()
    found += [f"{title} in front: {p}" for p in outside(window, screen)]
    widths.add(window.frameGeometry().width())
print(json.dumps({"screen": screen.getRect(), "outside": found, "widths": sorted(widths),
                  "min_width": window.minimumSizeHint().width(), "hidden_docks":
                  [t for t, d in window.docks.items() if not d.isVisible()]}))
