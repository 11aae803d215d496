"""The Checkup dock: marks that read without colour, a click selects the offenders in the
table, Timeline and Network, the summary strip's count, recomputation when edits pause
(never inside the edit itself), the simulation checks from the last run, thresholds."""

import pytest
from PySide6.QtCore import Qt

from workbench.core.checkup import run_checkup
from workbench.core.commands import EditActivity
from workbench.core.montecarlo import simulate
from workbench.ui.checkup.keeper import checkup_keeper
from workbench.ui.checkup.view import CheckupView
from workbench.ui.session import Session

from support.ui import shown, sample_plan


@pytest.fixture
def view(qtbot):
    session = Session(sample_plan())
    v = shown(qtbot, CheckupView(session), (900, 600))
    return v


def _row(view, check_id):
    return next(i for i, c in enumerate(view.model.checks) if c.id == check_id)


def test_every_check_listed_with_a_mark_in_words(view):
    model = view.model
    expected = run_checkup(view.session.plan, view.session.analysis, with_simulation=False)
    assert [c.id for c in model.checks] == [c.id for c in expected]
    marks = {model.index(r, 0).data() for r in range(model.rowCount())}
    assert marks <= {"\u2713 pass", "\u2717 fail", "\u2013 n/a"} and len(marks) == 3
    assert view.headline.text().startswith(expected.summary_text())
    # a failure is also bold: it reads in grayscale
    fail = next(r for r, c in enumerate(model.checks) if c.status == "fail")
    assert model.index(fail, 0).data(Qt.ItemDataRole.FontRole).bold()


def test_clicking_a_check_selects_its_offenders(view, qtbot):
    row = _row(view, "false_certainty")          # W (4 days, one number) is critical in the sample
    offenders = view.model.checks[row].offenders
    assert offenders == ["W"]
    rect = view.table.visualRect(view.model.index(row, 1))
    qtbot.mouseClick(view.table.viewport(), Qt.MouseButton.LeftButton, pos=rect.center())
    assert view.session.selected() == ["W"]
    assert "Offenders: W" in view.detail.text()


def test_selection_reaches_the_table_timeline_and_network(window, qtbot):
    window.show()
    qtbot.waitExposed(window)
    window.show_checkup()
    checkup = window.view("Checkup")
    row = _row(checkup, "false_certainty")
    checkup.pick(row)
    assert window.activities.current_ids() == ["W"]
    timeline = window.view("Timeline")
    window.docks["Timeline"].raise_()
    qtbot.waitUntil(lambda: timeline.geometry is not None
                    and timeline.item.selected_rows() == [timeline.geometry.row_of["W"]], timeout=3000)
    network = window.view("Network")
    window.docks["Network"].raise_()
    qtbot.waitUntil(lambda: network.layout_result is not None
                    and network.item.painter.selected == {network.layout_result.index_of("W")}, timeout=3000)


def test_the_summary_strip_counts_and_opens_the_dock(window, qtbot):
    keeper = checkup_keeper(window.session)
    assert window.summary.checkup.text() == keeper.checkup.summary_text()
    assert window.summary.checkup.text().startswith("Checkup: ") and " pass" in window.summary.checkup.text()
    window.show()
    qtbot.mouseClick(window.summary.checkup, Qt.MouseButton.LeftButton)
    assert window.docks["Checkup"].isVisible()


def test_an_edit_is_checked_once_the_typing_pauses(view, qtbot):
    session, keeper = view.session, view.keeper
    before = keeper.checkup
    session.push(EditActivity("P", optimistic=50.0, most_likely=60.0, pessimistic=80.0))
    assert keeper.checkup is before                     # the edit itself does not wait for the checks
    qtbot.waitUntil(lambda: keeper.checkup is not before, timeout=3000)
    assert keeper.checkup.get("long_durations").offenders == ["P"]
    assert view.model.checks[_row(view, "long_durations")].offenders == ["P"]


def test_simulation_checks_use_the_last_run_and_say_when_it_is_stale(view, qtbot):
    session, keeper = view.session, view.keeper
    assert keeper.checkup.get("merge_hot_spots").status == "n/a"
    session.set_simulation(simulate(session.plan, 2000, seed=5))
    qtbot.waitUntil(lambda: keeper.checkup.get("merge_hot_spots").status != "n/a", timeout=10000)
    assert "From the simulation of 2,000 runs (seed 5)." in keeper.checkup.get("merge_hot_spots").note
    session.push(EditActivity("R", name="Survey every room"))
    qtbot.waitUntil(lambda: "before the latest edit" in keeper.checkup.get("merge_hot_spots").note, timeout=3000)


def test_thresholds_dialog_changes_the_plan_in_one_undo_step(view, qtbot):
    from workbench.ui.checkup.thresholds_dialog import ThresholdsDialog
    dialog = ThresholdsDialog(view.session, view)
    qtbot.addWidget(dialog)
    dialog.boxes["long_duration_days"].setValue(3.0)
    dialog.accept()
    assert view.session.plan.checkup_thresholds == {"long_duration_days": 3.0}
    view.keeper.recompute()
    row = _row(view, "long_durations")
    assert view.model.index(row, 3).data().endswith("*")
    view.session.undo_stack.undo()
    assert view.session.plan.checkup_thresholds == {}


def test_the_table_model_passes_the_model_tester(view, qtmodeltester):
    qtmodeltester.check(view.model)


def test_while_a_new_run_is_checked_the_odds_checks_say_so(qtbot, monkeypatch):
    import threading

    from workbench.ui.checkup import keeper as keeper_module
    from workbench.ui.checkup.keeper import WORKING, CheckupKeeper
    release, replay = threading.Event(), keeper_module.replay_checks
    monkeypatch.setattr(keeper_module, "replay_checks", lambda *a: (release.wait(30), replay(*a))[1])
    session = Session(sample_plan())
    keeper = CheckupKeeper(session, threaded=True)
    session.set_simulation(simulate(session.plan, 500, seed=2))
    assert keeper.checkup.get("merge_hot_spots").note == WORKING     # the worker has not reported yet
    assert keeper.checkup.get("odds_disagreement").note == WORKING
    release.set()
    qtbot.waitUntil(lambda: keeper.checkup.get("merge_hot_spots").note != WORKING, timeout=10_000)


def test_a_wide_window_shows_every_threshold_whole_and_a_dock_keeps_the_figures(qtbot):
    """At full HD the Threshold column showed "informati…" and "<= 10 po…" beside a
    1,200-pixel Figure column."""
    from workbench.core.demo import demo_plan

    session = Session(demo_plan())
    checkup_keeper(session, threaded=False)
    v = shown(qtbot, CheckupView(session), (1900, 900))
    assert v.table.columnWidth(3) >= v.table.sizeHintForColumn(3)
    v.resize(470, 600)
    qtbot.wait(20)
    assert v.table.columnWidth(2) >= v.table.columnWidth(3)        # the figures keep their room
