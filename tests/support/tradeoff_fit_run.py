"""Show the window on a screen of argv[2]×argv[3] (the offscreen platform with one screen,
see the test) with the demo plan; bring the Trade-off dock and the Drivers dock forward, wait
for the Trade-off curve; print JSON: per dock its size, whether its scroller shows a
horizontal bar, and whether its view shows its charts one at a time; for the Trade-off
charts, brought forward in turn, whether each title fits its chart. argv[1]: a scratch
folder."""

import json
import os
import sys

folder, width, height = sys.argv[1], int(sys.argv[2]), int(sys.argv[3])
os.environ["SLACKLINE_DATA_DIR"] = os.path.join(folder, "data")

from PySide6.QtCore import QSettings  # noqa: E402

from workbench.ui.session import Session  # noqa: E402
from workbench.ui.workspace.app import application, demo_plan  # noqa: E402

app = application()
QSettings.setDefaultFormat(QSettings.Format.IniFormat)
QSettings.setPath(QSettings.Format.IniFormat, QSettings.Scope.UserScope, os.path.join(folder, "settings"))
from workbench.ui.workspace.window import MainWindow  # noqa: E402


def settle():
    for _ in range(10):
        app.processEvents()


window = MainWindow(Session(demo_plan()))
window.show()
settle()
seen = {"screen": window.screen().availableGeometry().getRect()}
for title in ("Trade-off", "Drivers"):
    window.docks[title].raise_()
    settle()
    view = window.view(title)
    if title == "Trade-off":
        view.finish_work()          # bounded wait for the curve
        settle()
    area = window.docks[title].widget()
    seen[title] = {"dock": window.docks[title].size().toTuple(), "result": getattr(view, "result", None) is not None,
                   "horizontal_bar": area.horizontalScrollBar().isVisible(),
                   "view_width": view.width(), "viewport_width": area.viewport().width(),
                   "narrow": bool(getattr(view, "narrow", None) if title == "Drivers" else view.arrangement.narrow)}
view = window.view("Trade-off")
fits = []
for page, chart in (("Cost by date", view.curve_plot), ("Cost vs chance", view.chance_plot)):
    view.arrangement.show_page(page)
    settle()
    fits.append(chart.isVisible() and chart.getPlotItem().titleLabel.item.boundingRect().width() <= chart.width())
seen["Trade-off"]["titles_whole"] = fits
window.close()
settle()
print(json.dumps(seen))
