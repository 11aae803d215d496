"""Desktop integration: the application object, files opened by the system while
Slackline runs (a QFileOpenEvent on macOS), the desktop entry name and the app icon."""

import os
import subprocess
import sys
import textwrap

from PySide6.QtCore import QSize
from PySide6.QtGui import QImage

from support.ui import sample_plan
from workbench.core.model import Activity, Plan, Settings
from workbench.io.planfile import save_plan
from workbench.resources import resources_dir

SCRIPT = textwrap.dedent("""
    import sys
    from PySide6.QtCore import QCoreApplication, QTimer
    from PySide6.QtGui import QFileOpenEvent, QGuiApplication
    from PySide6.QtWidgets import QApplication
    from workbench.ui.workspace.app import application, run_app

    early, later = sys.argv[1], sys.argv[2]
    app = application()
    print("CLASS", type(app).__name__)
    print("DESKTOP", QGuiApplication.desktopFileName())
    print("ICON", not app.windowIcon().isNull())
    QCoreApplication.postEvent(app, QFileOpenEvent(early))     # before there is a window

    def window():
        return next(w for w in QApplication.topLevelWidgets() if type(w).__name__ == "MainWindow")

    def report(tag):
        QApplication.processEvents()
        print(tag, window().windowTitle().split("[")[0], len(window().session.plan))

    def first():
        report("FIRST")
        QCoreApplication.postEvent(app, QFileOpenEvent(later))  # while the window runs
        QTimer.singleShot(0, second)

    def second():
        report("SECOND")
        QApplication.quit()

    QTimer.singleShot(0, first)
    sys.exit(run_app([]))
""")


def one_activity_plan() -> Plan:
    return Plan(Settings(title="Shed"), [Activity("A", "Build shed", duration=3)], [])


def test_files_opened_by_the_system_reach_the_window(tmp_path):
    early, later = tmp_path / "refit.slw", tmp_path / "shed.slw"
    save_plan(sample_plan(), early)
    save_plan(one_activity_plan(), later)
    env = dict(os.environ, QT_QPA_PLATFORM="offscreen", SLACKLINE_MULTI_INSTANCE="1",
               SLACKLINE_DATA_DIR=str(tmp_path / "data"), XDG_CONFIG_HOME=str(tmp_path / "config"),
               HOME=str(tmp_path))
    result = subprocess.run([sys.executable, "-c", SCRIPT, str(early), str(later)], env=env,
                            capture_output=True, text=True, timeout=180)
    assert result.returncode == 0, result.stderr[-3000:]
    out = dict(line.split(" ", 1) for line in result.stdout.splitlines() if " " in line)
    assert out["CLASS"] == "SlacklineApp"
    assert out["DESKTOP"] == "org.slackline.Slackline"
    assert out["ICON"] == "True"
    assert out["FIRST"] == "refit.slw 7"       # the request that came before the window
    assert out["SECOND"] == "shed.slw 1"       # and the one that came while it ran


def test_app_icon_is_the_installed_one(qapp):
    from workbench.ui import icons
    assert icons.APP_ICON_DIR == resources_dir() / "icon"
    app_icon = icons.icon("app")
    pngs = sorted((resources_dir() / "icon").glob("slackline-*.png"))
    assert len(pngs) >= 5
    for png in pngs:                                        # each rendered size is used as it is
        size = int(png.stem.split("-")[1])
        drawn = app_icon.pixmap(QSize(size, size)).toImage().convertToFormat(QImage.Format.Format_ARGB32)
        assert drawn == QImage(str(png)).convertToFormat(QImage.Format.Format_ARGB32), png.name
    image = app_icon.pixmap(QSize(100, 100)).toImage()     # between the PNG sizes: from the SVG
    assert (image.width(), image.height()) == (100, 100)
    opaque = sum(image.pixelColor(x, y).alpha() > 200 for y in range(0, 100, 5) for x in range(0, 100, 5))
    assert opaque > 50


def test_window_uses_the_app_icon(qapp, qtbot):
    from workbench.ui.icons import app_icon
    from workbench.ui.workspace.window import MainWindow
    window = MainWindow()
    qtbot.addWidget(window)
    want = app_icon().pixmap(QSize(48, 48)).toImage()
    assert window.windowIcon().pixmap(QSize(48, 48)).toImage() == want
    window.files.close()
