"""New, Open and Import (as a new plan) clear every result that belongs to the old plan."""

import pytest

from support.ui import sample_plan
from workbench.core.commands import EditActivity
from workbench.core.montecarlo import simulate
from workbench.io.planfile import save_plan


def simulated(window, qtbot, stale: bool):
    window.show()
    qtbot.waitExposed(window)
    odds, drivers = window.view("Odds"), window.view("Drivers")
    window.session.set_simulation(simulate(window.session.plan, 500, seed=4))
    if stale:
        window.session.push(EditActivity("R", name="Survey again"))
    for view in (odds, drivers):
        view.when_shown.catch_up()
        assert view.result is not None and view.stale == stale
    assert len(odds.plot.hist.getData()[0]) > 0
    return odds, drivers


def assert_nothing_of_the_old_plan(window, odds, drivers):
    for view in (odds, drivers):
        view.when_shown.catch_up()
        assert view.result is None and not view.stale
    x, _ = odds.plot.hist.getData()
    assert x is None or len(x) == 0
    assert odds.controls.status.text().startswith("No simulation yet")


@pytest.mark.parametrize("stale", [False, True])
def test_new_plan_drops_the_old_simulation(window, ui_env, qtbot, stale):
    odds, drivers = simulated(window, qtbot, stale)
    ui_env.replies["ask_unsaved"] = "discard"
    assert window.files.new_plan()
    assert_nothing_of_the_old_plan(window, odds, drivers)


@pytest.mark.parametrize("stale", [False, True])
def test_opening_another_plan_drops_the_old_simulation(window, ui_env, qtbot, tmp_path, stale):
    odds, drivers = simulated(window, qtbot, stale)
    other = tmp_path / "other.slw"
    save_plan(sample_plan(), other)
    ui_env.replies["ask_unsaved"] = "discard"
    assert window.files.open_path(str(other))
    assert_nothing_of_the_old_plan(window, odds, drivers)


def test_an_edit_still_keeps_the_run_marked_stale(window, ui_env, qtbot):
    odds, drivers = simulated(window, qtbot, stale=True)
    assert odds.result is not None and odds.stale
    assert drivers.result is not None and drivers.stale
