"""Nothing lost, nothing hangs, in the window (issue 20): recovery copies belong to one
window (item 2); a failed save never closes the window nor drops its recovery copy and
text the file cannot hold is refused at the edit (item 3); the owner is asked about before
a save would change who owns the file (item 4); a pipe is refused, not waited on (item 13);
the autosave writes from a snapshot in a worker thread (item 17)."""

import os
import threading
from pathlib import Path

import pytest

from support.ui import plan_state, sample_plan, ui_env, window  # noqa: F401 (fixtures)
from workbench.core.commands import EditActivity, settings_with
from workbench.io import atomic
from workbench.io.planfile import load_plan, save_plan


def recovery_copies(tmp_path) -> list[Path]:
    return sorted((tmp_path / "data" / "recovery").glob("*.slw"))


@pytest.fixture
def second_window(ui_env, qtbot):
    from workbench.ui.session import Session
    from workbench.ui.workspace.window import MainWindow
    win = MainWindow(Session(sample_plan()))
    yield win
    ui_env.replies["ask_unsaved"] = "discard"
    win.close()
    win.deleteLater()
    qtbot.wait(1)


def test_a_read_only_viewer_never_touches_the_editors_recovery_copy(window, second_window, ui_env, tmp_path):
    plan_file = tmp_path / "refit.slw"
    save_plan(sample_plan(), plan_file)
    assert window.files.open_path(str(plan_file))
    window.session.push(EditActivity("R", name="Survey every room (editor)"))
    assert window.files.autosave()
    window.files.finish_autosave()
    [editor_copy] = recovery_copies(tmp_path)

    ui_env.replies["ask_locked"] = "readonly"
    assert second_window.files.open_path(str(plan_file)) and second_window.files.read_only
    second_window.session.push(EditActivity("R", name="Survey (viewer)"))
    assert second_window.files.autosave()  # the viewer's work goes to its own copy
    second_window.files.finish_autosave()
    assert load_plan(editor_copy).activity("R").name == "Survey every room (editor)"
    assert len(recovery_copies(tmp_path)) == 2

    ui_env.replies["ask_unsaved"] = "discard"
    second_window.close()  # a clean close of the viewer
    assert recovery_copies(tmp_path) == [editor_copy]
    assert load_plan(editor_copy).activity("R").name == "Survey every room (editor)"


def test_after_the_viewer_closes_a_crashed_editors_work_is_offered_back(window, second_window, ui_env, tmp_path, qtbot):
    plan_file = tmp_path / "refit.slw"
    save_plan(sample_plan(), plan_file)
    assert window.files.open_path(str(plan_file))
    window.session.push(EditActivity("R", name="Survey every room (editor)"))
    window.files.autosave()
    window.files.finish_autosave()
    ui_env.replies["ask_locked"] = "readonly"
    assert second_window.files.open_path(str(plan_file))
    ui_env.replies["ask_unsaved"] = "discard"
    second_window.close()

    window.files.store._lock.unlock()  # the editor dies: its locks go, its copy stays
    window.files._lock.release()
    window.files.store._lock = None
    from workbench.ui.session import Session
    from workbench.ui.workspace.window import MainWindow
    third = MainWindow(Session(sample_plan()))
    ui_env.replies["ask_recovery"] = "restore"
    assert third.files.offer_recovery()
    assert third.session.plan.activity("R").name == "Survey every room (editor)"
    third.files.close()
    third.deleteLater()


def test_two_windows_on_one_plan_have_different_recovery_slots(window, second_window, ui_env, tmp_path):
    plan_file = tmp_path / "refit.slw"
    save_plan(sample_plan(), plan_file)
    window.files.open_path(str(plan_file))
    ui_env.replies["ask_locked"] = "readonly"
    second_window.files.open_path(str(plan_file))
    assert window.files.store.key != second_window.files.store.key
    assert window.files.store.owns and second_window.files.store.owns


def unstorable(window) -> None:
    """A title the file cannot hold, slipped past the edit checks (as a broken paste might)."""
    window.session.push(EditActivity("R", name="Survey"))
    window.session.plan.settings.title = "Refit \ud800"


def test_close_then_save_that_fails_keeps_the_window_and_the_work(window, ui_env, tmp_path):
    plan_file = tmp_path / "refit.slw"
    save_plan(sample_plan(), plan_file)
    window.files.open_path(str(plan_file))
    window.show()
    unstorable(window)
    ui_env.replies["ask_unsaved"] = "save"
    seen = []
    ui_env.replies["ask_save_as_instead"] = lambda parent, msg: seen.append(msg) or False
    assert not window.close()
    assert window.isVisible()
    assert "settings: field 'title'" in seen[0] and "lone surrogate" in seen[0]
    [copy] = recovery_copies(tmp_path)  # the work is safe although the save failed
    assert load_plan(copy).activity("R").name == "Survey"
    assert load_plan(plan_file).activity("R").name == "Survey rooms"


def test_a_disk_error_on_save_keeps_a_recovery_copy(window, ui_env, tmp_path, monkeypatch):
    plan_file = tmp_path / "refit.slw"
    save_plan(sample_plan(), plan_file)
    window.files.open_path(str(plan_file))
    window.session.push(EditActivity("R", name="Survey"))

    real_replace = os.replace

    def full(src, dst):
        if Path(dst) == plan_file:
            raise OSError(28, "No space left on device")
        return real_replace(src, dst)

    monkeypatch.setattr(atomic.os, "replace", full)
    ui_env.replies["ask_save_as_instead"] = False
    assert not window.files.save()
    assert window.isWindowModified()
    [copy] = recovery_copies(tmp_path)
    assert load_plan(copy).activity("R").name == "Survey"


def test_a_lone_surrogate_typed_into_a_cell_is_refused_naming_the_field(window):
    before = plan_state(window.session.plan)
    assert not window.session.push(EditActivity("R", name="Survey \udc80"))
    assert "activity R: name holds a broken character (lone surrogate U+DC80" in window.session.last_refusal
    assert not window.session.push(EditActivity("R", notes="\ud800"))
    assert plan_state(window.session.plan) == before


def test_the_window_asks_before_a_save_would_change_the_owner(window, ui_env, tmp_path, monkeypatch):
    plan_file = tmp_path / "team.slw"
    save_plan(sample_plan(), plan_file)
    window.files.open_path(str(plan_file))
    window.session.push(EditActivity("R", name="Survey"))
    monkeypatch.setattr(atomic, "ownership_problem", lambda *a, **k: "team.slw belongs to group planners")
    answers = iter(["cancel", "save"])
    ui_env.replies["ask_owner_change"] = lambda parent, msg: next(answers)
    assert not window.files.save()
    assert load_plan(plan_file).activity("R").name == "Survey rooms"  # nothing written
    assert window.files.save()
    assert load_plan(plan_file).activity("R").name == "Survey"
    assert [m for n, (p, m) in ui_env.asked if n == "ask_owner_change"][0].startswith("team.slw belongs to group")


@pytest.mark.skipif(not hasattr(os, "mkfifo"), reason="needs named pipes")
def test_opening_a_pipe_is_refused_not_waited_on(window, ui_env, tmp_path):
    pipe = tmp_path / "plan.slw"
    os.mkfifo(pipe)
    # Should the window ever block on the pipe, open its other end so the test ends (and fails).
    rescue = threading.Timer(30, lambda: os.close(os.open(pipe, os.O_WRONLY | os.O_NONBLOCK)))
    rescue.daemon = True
    rescue.start()
    errors = []
    ui_env.replies["show_error"] = lambda parent, title, msg: errors.append(msg)
    try:
        assert not window.files.open_path(str(pipe))
    finally:
        rescue.cancel()
    assert "it is a pipe (FIFO), not a regular file" in errors[0]


def test_autosave_writes_a_snapshot_in_a_worker_thread(window, ui_env, tmp_path, monkeypatch):
    window.session.push(EditActivity("R", name="Before the autosave"))
    started, release = threading.Event(), threading.Event()
    from workbench.ui.workspace import recovery
    real_write = recovery.write_copy
    writers = []

    def slow_write(*args):
        writers.append(threading.current_thread())
        started.set()
        release.wait(10)
        return real_write(*args)

    monkeypatch.setattr(recovery, "write_copy", slow_write)
    assert window.files.autosave()  # returns while the copy is still being written
    assert started.wait(10) and writers[0] is not threading.main_thread()
    assert window.files.autosave_running
    window.session.push(EditActivity("R", name="Typed during the autosave"))  # the window is not blocked
    release.set()
    window.files.finish_autosave()
    [copy] = recovery_copies(tmp_path)
    assert load_plan(copy).activity("R").name == "Before the autosave"  # the snapshot, not a half-edit
    assert window.session.plan.activity("R").name == "Typed during the autosave"


def test_a_snapshot_does_not_follow_later_edits():
    plan = sample_plan()
    snap = plan.snapshot()
    EditActivity("R", name="Changed").do(plan)
    plan.set_settings(settings_with(plan.settings, title="Changed too"))
    assert snap.activity("R").name == "Survey rooms" and snap.settings.title == "Office refit"
    assert plan_state(snap) == plan_state(sample_plan())
