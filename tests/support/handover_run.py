"""Run the window as ``slackline one.slw`` does, make an unsaved edit, then start a second
launch ``slackline other.slw`` (what a double-click does); answer the unsaved-changes
question with the button named in argv[2] once the second launch has exited. Prints
OPENED when the window shows other.slw, then closes it. argv[1]: a scratch folder."""

import os
import subprocess
import sys
import uuid

folder, answer = sys.argv[1], sys.argv[2]
os.environ["SLACKLINE_DATA_DIR"] = os.path.join(folder, "data")
os.environ.pop("SLACKLINE_MULTI_INSTANCE", None)

from PySide6.QtCore import QSettings, QTimer  # noqa: E402
from PySide6.QtWidgets import QApplication, QMessageBox  # noqa: E402

from workbench.core.commands import EditActivity  # noqa: E402
from workbench.ui.workspace.app import application, run_app  # noqa: E402

os.environ["SLACKLINE_INSTANCE"] = f"handover-{uuid.uuid4().hex[:8]}"   # apart from any real window
QSettings.setDefaultFormat(QSettings.Format.IniFormat)
QSettings.setPath(QSettings.Format.IniFormat, QSettings.Scope.UserScope, os.path.join(folder, "settings"))
one, other = os.path.join(folder, "one.slw"), os.path.join(folder, "other.slw")
second = {}


def window():
    from workbench.ui.workspace.window import MainWindow
    return next(w for w in QApplication.topLevelWidgets() if isinstance(w, MainWindow))


def edit_then_launch_again():
    w = window()
    w.session.push(EditActivity(w.session.plan.ids()[0], name="Edited before the double-click"))
    second["proc"] = subprocess.Popen([sys.executable, "-m", "workbench", other],
                                      env={**os.environ, "QT_QPA_PLATFORM": "offscreen"})
    QTimer.singleShot(20, answer_question)


def answer_question():
    box = QApplication.activeModalWidget()
    if isinstance(box, QMessageBox) and second["proc"].poll() is not None:
        print(f"second launch exited {second['proc'].returncode}; answering {answer}", flush=True)
        next(b for b in box.buttons() if b.text() == answer).click()
        QTimer.singleShot(20, wait_for_other)
        return
    QTimer.singleShot(20, answer_question)


def wait_for_other():
    w = window()
    if w.files.path and w.files.path.endswith("other.slw"):
        print("OPENED", flush=True)
        w.close()
        return
    QTimer.singleShot(20, wait_for_other)


application()
QTimer.singleShot(300, edit_then_launch_again)
QTimer.singleShot(60_000, QApplication.quit)
print("exit", run_app([one]), flush=True)
