"""The demo plan's checkup figures, stated and checked (counted by hand from
workbench/core/demo.py: 42 activities, 62 links after merging none)."""

import pytest

from workbench.core.checkup import run_checkup
from workbench.core.demo import demo_plan
from workbench.core.montecarlo import simulate


@pytest.fixture(scope="module")
def checkup():
    plan = demo_plan()
    return run_checkup(plan, simulation=simulate(plan, 10_000, seed=7))


def test_demo_logic_and_links(checkup):
    # X1 (the temporary clinic) has no successor; M0 and O3 are the plan's ends: 1 of 40
    assert checkup.get("missing_logic").offenders == ["X1"]
    assert checkup.get("missing_logic").value == pytest.approx(2.5)
    assert checkup.get("leads").offenders == ["O1"]                       # B6 → O1 FS −2
    assert checkup.get("lags").value == pytest.approx(100 * 9 / 62)       # 9 positive lags
    assert checkup.get("link_types").value == pytest.approx(100 * 53 / 62)  # 5 SS, 3 FF, 1 SF
    assert checkup.get("hard_constraints").value == 0.0


def test_demo_float_and_durations(checkup):
    assert checkup.get("high_float").offenders == ["B8", "E3", "I2", "X0"]  # 4 of 42
    assert checkup.get("negative_float").offenders == []
    assert checkup.get("long_durations").offenders == ["E2", "P1", "X1"]    # 3 of 40 (milestones aside)
    assert checkup.get("critical_path_test").status == "pass"
    # 129 days to the finish, 6 days of float to 10 Sep 2027: (129 + 6) / 129
    assert checkup.get("cpli").value == pytest.approx(135 / 129)


def test_demo_statuses_and_summary(checkup):
    statuses = {c.id: c.status for c in checkup}
    assert [k for k, v in statuses.items() if v == "fail"] == [
        "leads", "lags", "link_types", "high_float", "long_durations", "false_certainty", "merge_hot_spots",
        "odds_disagreement"]
    assert [k for k, v in statuses.items() if v == "n/a"] == ["invalid_dates", "resources", "missed_activities", "bei"]
    assert checkup.summary_text() == "Checkup: 6 of 14 pass"


def test_demo_false_certainty_names_the_temporary_clinic(checkup):
    # X1 is one number (60 days) with 13.3 days of float, 7.3 more than the critical path's 6
    c = checkup.get("false_certainty")
    assert c.offenders == ["X1"] and "Entered as one number: X1." in c.note


def test_demo_odds_checks_point_at_the_merges(checkup):
    merges = checkup.get("merge_hot_spots")
    assert merges.offenders[0] == "E5"             # the X-ray unit meets the lead-lined room
    odds = checkup.get("odds_disagreement")
    assert odds.value > 30 and "merge bias" in odds.note and "risk events (R1)" in odds.note


def test_short_figures_for_slides(checkup):
    assert checkup.get("lags").figure == "14.5 %" and checkup.get("leads").figure == "1"
    assert checkup.get("cpli").figure == "1.05" and checkup.get("critical_path_test").figure == ""
    assert checkup.get("odds_disagreement").figure.endswith(" pts") and checkup.get("bei").figure == ""
