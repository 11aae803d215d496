"""A plan double-clicked while the window has unsaved changes: the second launch hands it
over, the window asks about the changes, and whatever the answer it opens the plan (it
once crashed here). Run in a child process, as the real thing is, so a crash is seen as
one."""

import os
import subprocess
import sys
from pathlib import Path

import pytest

from support.ui import sample_plan
from workbench.io.planfile import load_plan, save_plan
from workbench.ui.workspace.lock import lock_path

DRIVER = Path(__file__).resolve().parents[2] / "support" / "handover_run.py"


@pytest.mark.parametrize("answer", ["Don't Save", "Save"])
def test_double_click_with_unsaved_changes_opens_the_other_plan(tmp_path, answer):
    save_plan(sample_plan(), tmp_path / "one.slw")
    save_plan(sample_plan(), tmp_path / "other.slw")
    env = {**os.environ, "QT_QPA_PLATFORM": "offscreen",
           "PYTHONPATH": os.pathsep.join([str(DRIVER.parent.parent), os.environ.get("PYTHONPATH", "")])}
    done = subprocess.run([sys.executable, str(DRIVER), str(tmp_path), answer], capture_output=True,
                          text=True, timeout=120, env=env)
    assert done.returncode == 0, f"exit {done.returncode}\n{done.stdout}\n{done.stderr[-2000:]}"
    assert "second launch exited 0" in done.stdout      # it handed over and left
    assert "OPENED" in done.stdout and "exit 0" in done.stdout
    assert not Path(lock_path(str(tmp_path / "one.slw"))).exists()
    assert not Path(lock_path(str(tmp_path / "other.slw"))).exists()
    names = [a.name for a in load_plan(tmp_path / "one.slw").activities]
    assert ("Edited before the double-click" in names) == (answer == "Save")
