"""The window maximized on one screen of argv[2]×argv[3] (the offscreen platform given that
screen, see the tests), the demo plan open, the dock argv[4] ("Checkup" or "Odds")
brought forward; print JSON: the dock's size, its scroller's sideways scroll bar and the
view's measurements the tests check. argv[1]: a scratch folder."""

import json
import os
import sys
import time

folder, width, height, title = sys.argv[1], int(sys.argv[2]), int(sys.argv[3]), sys.argv[4]
os.environ["SLACKLINE_DATA_DIR"] = os.path.join(folder, "data")
os.environ["SLACKLINE_AUTOSAVE_MS"] = "3600000"

from PySide6.QtCore import QRect, QSettings  # noqa: E402
from PySide6.QtGui import QFontMetricsF  # noqa: E402

from workbench.ui.session import Session  # noqa: E402
from workbench.ui.workspace.app import application, demo_plan  # noqa: E402

app = application()
QSettings.setDefaultFormat(QSettings.Format.IniFormat)
QSettings.setPath(QSettings.Format.IniFormat, QSettings.Scope.UserScope, os.path.join(folder, "settings"))
from workbench.ui.workspace.window import MainWindow  # noqa: E402


def settle(until=lambda: True, rounds: int = 200) -> None:
    """Run the event loop a while, and on until ``until()`` holds (a bounded number of rounds)."""
    for i in range(rounds):
        app.processEvents()
        time.sleep(0.01)
        if i >= 20 and until():
            return


def inside(view, widget) -> bool:
    return view.rect().contains(QRect(widget.mapTo(view, widget.rect().topLeft()), widget.size()))


def checkup(view) -> dict:
    table = view.table
    return {"headline": view.headline.text(), "min_width": view.minimumSizeHint().width(),
            "inside": {n: inside(view, getattr(view, n)) for n in ("headline", "thresholds", "standard", "caution")},
            "table_fits": table.horizontalHeader().length() <= table.viewport().width()}


def odds(view) -> dict:
    plot = view.plot
    settle(lambda: all(hasattr(p, "_y_room") for p in (plot.density, plot.cumulative)) and not plot._placing)
    titles = {}
    for name, chart in (("density", plot.density), ("cumulative", plot.cumulative)):
        axis = chart.getAxis("left")
        label = axis.label.mapRectToScene(axis.label.boundingRect())
        titles[name] = {"text": axis.labelText, "shown": axis.label.isVisible(), "label": label.getRect(),
                        "plot": chart.vb.sceneBoundingRect().getRect()}
    line = QFontMetricsF(plot.density.getAxis("left").label.font()).height()
    return {"min_width": view.minimumSizeHint().width(), "titles": titles, "line": line}


window = MainWindow(Session(demo_plan()))
window.showMaximized()
settle()
dock = window.docks[title]
dock.show()
dock.raise_()
settle(lambda: window.view(title).isVisible())
view = window.view(title)
settle()
area = dock.widget()
bar = area.horizontalScrollBar()
seen = {"window": window.size().toTuple(), "dock": dock.size().toTuple(),
        "viewport": area.viewport().size().toTuple(), "sideways": bar.isVisible() or bar.maximum() > 0,
        **(checkup(view) if title == "Checkup" else odds(view))}
window.close()
settle(rounds=25)
print(json.dumps(seen))
