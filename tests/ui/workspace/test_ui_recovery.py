"""Autosave and recovery: copies go to the data folder (never over the planner's file),
and work left by a killed window is offered back and restored exactly."""

import os
import subprocess
import sys
import textwrap

from support.ui import plan_state, sample_plan, ui_env, window  # noqa: F401 (fixtures)
from workbench.core.commands import EditActivity, SetPredecessors, settings_with
from workbench.core.model import Link
from workbench.io.planfile import load_plan, save_plan

KILLED_WRITER = textwrap.dedent("""
    import os, signal, sys
    os.environ["QT_QPA_PLATFORM"] = "offscreen"
    from PySide6.QtCore import QCoreApplication
    app = QCoreApplication([])
    from workbench.io.planfile import load_plan
    from workbench.ui.workspace.recovery import RecoveryStore
    store = RecoveryStore()
    store.claim(sys.argv[2] or None)
    store.write(load_plan(sys.argv[1]))
    sys.stdout.write("written\\n"); sys.stdout.flush()
    os.kill(os.getpid(), signal.SIGKILL) if hasattr(signal, "SIGKILL") else os._exit(9)
""")


def edited_plan():
    plan = sample_plan()
    SetPredecessors("E", [Link("F", "E", "FS", 1.5)]).do(plan)
    EditActivity("D", name="Draw layout — rev B", most_likely=6.25).do(plan)
    plan.set_settings(settings_with(plan.settings, title="Office refit (unsaved)", revision="C"))
    return plan


def leave_recovery(tmp_path, plan, source: str) -> None:
    """Run a process that writes a recovery copy and is then killed (no clean-up)."""
    work = tmp_path / "in_progress.slw"
    save_plan(plan, work, backup=False)
    env = dict(os.environ)
    result = subprocess.run([sys.executable, "-c", KILLED_WRITER, str(work), source],
                            env=env, capture_output=True, text=True, timeout=120)
    assert "written" in result.stdout, result.stderr
    assert result.returncode != 0  # it died without cleaning up
    work.unlink()


def test_copy_left_by_killed_process_is_offered_and_restores_exactly(window, ui_env, tmp_path):
    original = tmp_path / "refit.slw"
    save_plan(sample_plan(), original)
    before_bytes = original.read_bytes()
    lost = edited_plan()
    leave_recovery(tmp_path, lost, str(original))
    ui_env.replies["ask_recovery"] = "restore"
    assert window.files.offer_recovery()
    assert ui_env.names() == ["ask_recovery"]
    assert plan_state(window.session.plan) == plan_state(lost)
    assert window.files.path == str(original.resolve())
    assert window.isWindowModified()  # restored work is not saved yet
    assert original.read_bytes() == before_bytes
    assert window.files.store.orphans() == []  # offered once only


def test_choosing_the_saved_file_opens_it_and_drops_the_copy(window, ui_env, tmp_path):
    original = tmp_path / "refit.slw"
    saved = sample_plan()
    saved.set_settings(settings_with(saved.settings, title="As saved"))
    save_plan(saved, original)
    leave_recovery(tmp_path, edited_plan(), str(original))
    ui_env.replies["ask_recovery"] = "open"
    assert window.files.offer_recovery()
    assert plan_state(window.session.plan) == plan_state(load_plan(original))
    assert window.files.store.orphans() == []


def test_discard_removes_the_copy(window, ui_env, tmp_path):
    leave_recovery(tmp_path, edited_plan(), "")
    ui_env.replies["ask_recovery"] = "discard"
    before = plan_state(window.session.plan)
    assert not window.files.offer_recovery()
    assert plan_state(window.session.plan) == before
    assert window.files.store.orphans() == []


def test_autosave_writes_to_data_folder_only_when_changed(window, ui_env, tmp_path):
    user_file = tmp_path / "mine.slw"
    ui_env.replies["ask_save_path"] = str(user_file)
    assert window.files.save_as()
    mine = user_file.read_bytes()
    assert not window.files.autosave()  # nothing changed
    window.session.push(EditActivity("R", name="Survey every room"))
    assert window.files.autosave()
    folder = tmp_path / "data" / "recovery"
    copies = list(folder.glob("*.slw"))
    assert len(copies) == 1
    assert load_plan(copies[0]).activity("R").name == "Survey every room"
    assert user_file.read_bytes() == mine
    assert not window.files.autosave()  # no change since the last copy
    assert window.files.save()
    assert list(folder.glob("*.slw")) == []


def test_own_running_copy_is_not_offered(window, ui_env):
    window.session.push(EditActivity("R", name="Survey"))
    assert window.files.autosave()
    from workbench.ui.workspace.recovery import RecoveryStore
    assert RecoveryStore().orphans() == []  # its lock is held by this live window


def test_clean_close_leaves_no_copy(window, ui_env, tmp_path):
    window.session.push(EditActivity("R", name="Survey"))
    assert window.files.autosave()
    ui_env.replies["ask_unsaved"] = "discard"
    window.close()
    assert list((tmp_path / "data" / "recovery").glob("*.slw")) == []
