"""Stack pin: PySide6-Essentials 6.12.0 on Python 3.11 drops a reference to None on
every Qt call that returns nothing and aborts after about 16,000 such calls. Whatever
PySide6 is installed must survive far more than that."""

import subprocess
import sys
import textwrap

CALLS = 60_000

SCRIPT = textwrap.dedent(f"""
    import os, sys
    os.environ["QT_QPA_PLATFORM"] = "offscreen"
    from PySide6.QtWidgets import QApplication, QWidget
    app = QApplication([])
    widget = QWidget()
    before = sys.getrefcount(None)
    for i in range({CALLS}):
        widget.setEnabled(i % 2 == 0)   # returns nothing (void)
    widget.setEnabled(True)
    print("done", {CALLS}, sys.getrefcount(None) - before)
""")


def test_many_void_qt_calls_exit_cleanly():
    result = subprocess.run([sys.executable, "-c", SCRIPT], capture_output=True, text=True, timeout=300)
    assert result.returncode == 0, (result.returncode, result.stderr[-2000:])
    words = result.stdout.split()
    assert words[:2] == ["done", str(CALLS)]
    # None's reference count must not fall by one per call (it would be about -CALLS)
    assert int(words[2]) > -1000
