"""Launching: run_app opens the window with the file given, else the last plan."""

import os
import subprocess
import sys
import textwrap

from support.ui import sample_plan
from workbench.io.planfile import save_plan

LAUNCH = textwrap.dedent("""
    import sys
    from PySide6.QtCore import QTimer
    from PySide6.QtWidgets import QApplication
    from workbench.ui.workspace.app import application, run_app

    def report():
        QApplication.processEvents()
        win = next(w for w in QApplication.topLevelWidgets() if type(w).__name__ == "MainWindow")
        print("TITLE", win.windowTitle())
        print("COUNT", len(win.session.plan), "VISIBLE", win.isVisible())
        QApplication.quit()

    app = application()
    QTimer.singleShot(0, report)
    sys.exit(run_app(sys.argv[1:]))
""")


def launch(tmp_path, *args):
    env = dict(os.environ, QT_QPA_PLATFORM="offscreen", SLACKLINE_MULTI_INSTANCE="1",
               SLACKLINE_DATA_DIR=str(tmp_path / "data"), XDG_CONFIG_HOME=str(tmp_path / "config"),
               HOME=str(tmp_path))
    result = subprocess.run([sys.executable, "-c", LAUNCH, *args], env=env, capture_output=True,
                            text=True, timeout=180)
    assert result.returncode == 0, result.stderr[-3000:]
    return dict(line.split(" ", 1) for line in result.stdout.splitlines() if " " in line)


def test_file_argument_opens_it_then_it_is_the_last_plan(tmp_path):
    path = tmp_path / "refit.slw"
    save_plan(sample_plan(), path)
    out = launch(tmp_path, str(path))
    assert out["TITLE"].startswith("refit.slw")
    assert out["COUNT"].startswith("7 VISIBLE True")
    again = launch(tmp_path)  # no argument: the last plan from the settings
    assert again["TITLE"].startswith("refit.slw")


def test_first_run_shows_the_demo_plan(tmp_path):
    from workbench.ui.workspace.app import demo_plan
    demo = demo_plan()
    out = launch(tmp_path)
    assert out["COUNT"].startswith(f"{len(demo)} VISIBLE True")
    assert out["TITLE"].startswith(demo.settings.title)
