"""Single instance: a second launch hands its file to the running window and exits."""

import sys
import textwrap
import uuid

from PySide6.QtCore import QProcess

from workbench.ui.workspace.single_instance import SingleInstance

CLIENT = textwrap.dedent("""
    import sys
    from PySide6.QtCore import QCoreApplication
    app = QCoreApplication([])
    from workbench.ui.workspace.single_instance import SingleInstance
    sys.exit(0 if SingleInstance(sys.argv[1]).hand_over(sys.argv[2]) else 3)
""")


def run_client(qtbot, name: str, path: str) -> QProcess:
    proc = QProcess()
    proc.start(sys.executable, ["-c", CLIENT, name, path])
    assert proc.waitForStarted(10_000)
    return proc


def test_second_launch_hands_over_its_path(qtbot):
    name = f"slackline-test-{uuid.uuid4().hex[:8]}"
    first = SingleInstance(name)
    assert first.listen()
    with qtbot.waitSignal(first.path_received, timeout=20_000) as got:
        proc = run_client(qtbot, name, "/plans/bridge.slw")
    qtbot.waitUntil(lambda: proc.state() == QProcess.ProcessState.NotRunning, timeout=20_000)
    assert got.args == ["/plans/bridge.slw"]
    assert proc.exitCode() == 0
    first.close()


def test_without_a_running_window_the_launch_goes_on(qtbot):
    name = f"slackline-test-{uuid.uuid4().hex[:8]}"
    proc = run_client(qtbot, name, "")
    assert proc.waitForFinished(20_000)
    assert proc.exitCode() == 3  # nobody took it: this launch opens its own window
