"""A view or window closed while its worker runs neither hangs nor crashes: the close
returns even when the work ignores the stop (the wait is bounded), the late result is
dropped, and every Qt object dies on the window's thread, never on the worker's."""

import gc
import threading

import pytest

from support.plans import house_plan
from support.ui import sample_plan, ui_env  # noqa: F401 (fixtures)
from workbench.core.commands import EditActivity
from workbench.core.demo import demo_plan
from workbench.ui import workers
from workbench.ui.session import Session


def on_main_thread() -> bool:
    return threading.current_thread() is threading.main_thread()


class Gate:
    """Stands in for a worker's job: waits for the test, ignoring any stop, then returns."""

    def __init__(self):
        self.entered, self.release, self.threads = threading.Event(), threading.Event(), []

    def __call__(self, *args, **kwargs):
        self.threads.append(threading.current_thread())
        self.entered.set()
        self.release.wait(30)
        return kwargs.get("late", "a result nobody should receive")

    def finish(self) -> None:
        self.release.set()
        for thread in self.threads:
            thread.join(10)
            assert not thread.is_alive()


@pytest.fixture
def gate(monkeypatch):
    monkeypatch.setattr(workers, "CLOSE_WAIT_S", 0.05)
    g = Gate()
    yield g
    g.finish()


def spy(monkeypatch, cls, name) -> list:
    """Calls of ``cls.name`` (a receiver of the worker's result) are recorded, not run."""
    calls = []
    monkeypatch.setattr(cls, name, lambda self, *args: calls.append(args))
    return calls


def track(*objects) -> list:
    died = []
    for obj in objects:
        obj.destroyed.connect(lambda *_: died.append(on_main_thread()))
    return died


def close_and_delete(qtbot, widget, died, count):
    widget.close()                                  # returns: the worker still runs
    widget.deleteLater()
    qtbot.waitUntil(lambda: len(died) == count, timeout=5000)


def test_odds_view(qtbot, gate, monkeypatch):
    from workbench.ui.odds import runner
    from workbench.ui.odds.view import OddsView
    monkeypatch.setattr(runner, "simulate_copy", gate)
    calls = spy(monkeypatch, runner.OddsRunner, "_on_finished")
    view = OddsView(Session(house_plan()))
    died = track(view, view.runner)
    view.run_simulation(500, 1)
    assert gate.entered.wait(10)
    close_and_delete(qtbot, view, died, 2)
    gate.finish()
    qtbot.wait(20)                                  # the late result finds nobody
    assert died == [True, True] and calls == [] and gate.threads[0].name == "slackline-odds"


def test_tradeoff_view(qtbot, gate, monkeypatch):
    from workbench.ui.tradeoff import runner
    from workbench.ui.tradeoff.view import TradeoffView
    monkeypatch.setattr(runner, "tradeoff_copy", gate)
    calls = spy(monkeypatch, runner.TradeoffRunner, "_done")
    view = TradeoffView(Session(demo_plan()))
    died = track(view, view.runner)
    view.refresh()
    assert gate.entered.wait(10)
    close_and_delete(qtbot, view, died, 2)
    gate.finish()
    qtbot.wait(20)
    assert died == [True, True] and calls == []


def test_crews_odds_in_the_resources_view(qtbot, gate, monkeypatch):
    from workbench.ui import crew_odds
    from workbench.ui.resources.view import ResourcesView
    monkeypatch.setattr(crew_odds, "compare_odds", gate)
    calls = spy(monkeypatch, crew_odds.CrewOddsRun, "_done")
    view = ResourcesView(Session(demo_plan()))
    died = track(view, view.odds)
    view.odds.run()
    assert gate.entered.wait(10)
    view.odds.stop()                                # bounded, though the work ignores it
    assert not view.odds.shared.running
    close_and_delete(qtbot, view, died, 2)
    gate.finish()
    qtbot.wait(20)
    assert died == [True, True] and calls == []


def test_checkup_keeper_of_a_session_dropped_meanwhile(qtbot, gate, monkeypatch):
    from workbench.core.montecarlo import simulate
    from workbench.ui.checkup import keeper as keeper_module
    monkeypatch.setattr(keeper_module, "replay_checks", gate)
    calls = spy(monkeypatch, keeper_module.CheckupKeeper, "_take_odds")
    session = Session(sample_plan())
    keeper = keeper_module.CheckupKeeper(session, threaded=True)
    died = track(session, keeper)
    session.set_simulation(simulate(session.plan, 200, seed=3))
    assert gate.entered.wait(10)
    del session, keeper
    gc.collect()
    assert died == [True, True]                     # gone now, here: the worker holds neither
    gate.finish()
    qtbot.wait(20)
    assert calls == []


def test_window_closed_while_the_autosave_writes(qtbot, ui_env, gate, monkeypatch, tmp_path):
    from workbench.ui.workspace import recovery
    from workbench.ui.workspace.window import MainWindow
    window = MainWindow(Session(sample_plan()))
    real_write = recovery.write_copy
    monkeypatch.setattr(recovery, "write_copy", lambda *a: (gate(), real_write(*a))[1])
    window.session.push(EditActivity("R", name="Edited before closing"))
    assert window.files.autosave()
    assert gate.entered.wait(10)
    ui_env.replies["ask_unsaved"] = "discard"
    died = track(window, window.files)
    assert window.close()                           # does not wait for the copy being written
    gate.finish()                                   # the copy lands now, and is removed again
    assert list((tmp_path / "data" / "recovery").glob("*.slw")) == []
    window.deleteLater()
    qtbot.waitUntil(lambda: len(died) == 2, timeout=5000)
    assert died == [True, True]
