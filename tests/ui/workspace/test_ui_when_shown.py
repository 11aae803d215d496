"""Views hidden behind a dock tab or in a closed dock do no work on an edit, and are
up to date as soon as they are shown again."""

import numpy as np
import pytest
from PySide6.QtWidgets import QWidget

from support.ui import sample_plan, ui_env, window  # noqa: F401 (fixtures)
from workbench.core.commands import EditActivity
from workbench.core.montecarlo import simulate
from workbench.figures import drivers as fdr
from workbench.figures import odds as fo
from workbench.ui.network import view as network_view
from workbench.ui.session import Session, WhenShown, refresh_when_shown


@pytest.fixture
def shown(window, qtbot):
    window.show()
    qtbot.waitExposed(window)
    # the front views are built once the window has painted, then come on screen
    qtbot.waitUntil(lambda: {"Timeline", "Odds"} <= set(window.built_views()))
    qtbot.waitUntil(lambda: window.view("Odds").when_shown.on_screen() and not window.view("Odds").when_shown.dirty)
    return window


def count_calls(monkeypatch, module, name) -> list:
    calls, real = [], getattr(module, name)

    def counted(*args, **kwargs):
        calls.append(args)
        return real(*args, **kwargs)
    monkeypatch.setattr(module, name, counted)
    return calls


def test_helper_runs_now_when_visible_and_once_when_shown(qtbot):
    parent = QWidget()
    qtbot.addWidget(parent)
    child = QWidget(parent)
    runs = []
    helper = WhenShown(child)
    parent.show()
    helper.call(lambda: runs.append("now"))
    assert runs == ["now"] and not helper.dirty
    child.hide()
    slot = lambda: runs.append("later")  # noqa: E731
    helper.call(slot)
    helper.call(slot)                      # asked twice: still one run
    assert runs == ["now"] and helper.dirty
    child.show()
    qtbot.waitUntil(lambda: not helper.dirty)
    assert runs == ["now", "later"]


def test_helper_connects_signals_in_one_line(qtbot):
    session = Session(sample_plan())
    parent = QWidget()
    qtbot.addWidget(parent)
    child = QWidget(parent)
    runs = []
    helper = refresh_when_shown(child, lambda: runs.append(len(session.plan)), session.schedule_changed)
    assert child.when_shown is helper
    session.push(EditActivity("R", name="Survey"))
    assert runs == [] and helper.dirty            # never shown: nothing done yet
    parent.show()
    qtbot.waitUntil(lambda: not helper.dirty)
    assert runs == [len(session.plan)]


def test_views_behind_tabs_are_not_built_until_needed(shown, qtbot):
    assert "Network" not in shown.built_views() and "Drivers" not in shown.built_views()
    shown.docks["Drivers"].raise_()
    qtbot.waitUntil(lambda: "Drivers" in shown.built_views())
    assert type(shown.view("Drivers")).__name__ == "DriversView"
    assert "Network" not in shown.built_views()


def test_network_behind_a_tab_waits_and_is_right_when_raised(shown, qtbot, monkeypatch):
    view = shown.views["Network"]
    assert not view.when_shown.on_screen()   # the default layout puts it behind the Timeline
    layouts = count_calls(monkeypatch, network_view, "layout_plan")
    shown.session.push(EditActivity("P", optimistic=1, most_likely=1, pessimistic=1))
    shown.session.push(EditActivity("W", duration=30))
    assert layouts == [] and view.when_shown.dirty
    shown.docks["Network"].raise_()
    qtbot.waitUntil(lambda: view.when_shown.on_screen() and not view.when_shown.dirty)
    assert len(layouts) == 1             # two edits, one catch-up
    critical = shown.session.analysis.schedule.critical
    assert [n.critical for n in view.layout_result.nodes] == [bool(c) for c in critical]
    assert view.item.painter.texts[shown.session.plan.row_of("W")].te == "30"


def test_closed_dock_does_no_work_until_reopened(shown, qtbot, monkeypatch):
    view = shown.views["Odds"]
    assert view.when_shown.on_screen()
    shown.docks["Odds"].close()
    curves = count_calls(monkeypatch, fo, "pert_curve")
    shown.session.push(EditActivity("F", optimistic=10, most_likely=12, pessimistic=30))
    assert curves == []
    shown.docks["Odds"].show()
    qtbot.waitUntil(lambda: not view.when_shown.dirty)
    assert len(curves) == 1
    expected = fo.pert_curve(shown.session.analysis.pert, *view._span())
    assert np.allclose(view.curve.x, expected.x) and np.allclose(view.curve.cumulative, expected.cumulative)
    assert view.curve.mean == pytest.approx(shown.session.analysis.pert.mean)


def test_drivers_behind_a_tab_catch_up_with_a_simulation(shown, qtbot, monkeypatch):
    view = shown.views["Drivers"]
    assert not view.when_shown.on_screen()
    bars = count_calls(monkeypatch, fdr, "criticality_bars")
    result = simulate(shown.session.plan, 500, seed=5)
    shown.session.set_simulation(result)
    assert bars == [] and view.stack.currentIndex() == 0
    shown.docks["Drivers"].raise_()
    qtbot.waitUntil(lambda: not view.when_shown.dirty)
    assert len(bars) == 1 and view.stack.currentIndex() == 1
    want = fdr.criticality_bars(result, shown.session.plan, view.top.value())
    assert view.criticality.bars == want
