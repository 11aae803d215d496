"""The second bundled plan: the clinic fit-out three months later shows every part of the
living schedule at once (progress of each kind, an approved baseline, an odds trend)."""

import datetime as dt

import numpy as np

from workbench.core import analyze
from workbench.core.progress_fields import DONE, IN_PROGRESS, NOT_STARTED
from workbench.core.variance import variance_against
from workbench.io.demo_files import demo_update_text
from workbench.io.planfile import load_plan
from workbench.resources import demo_update_path


def test_the_bundled_file_is_the_generated_scenario():
    assert demo_update_path().read_text(encoding="utf-8") == demo_update_text()


def test_a_newcomer_sees_progress_baseline_variance_and_the_trend():
    plan = load_plan(demo_update_path())
    a = analyze(plan)
    states = set(a.progress.state.tolist())
    assert states == {DONE, IN_PROGRESS, NOT_STARTED} and a.progress.status_date == dt.date(2027, 5, 28)
    assert any("B8 started before its predecessor B2" in w for w in a.progress.warnings)
    (base,) = [b for b in plan.baselines if b.approved]
    v = variance_against(a, base)
    assert v.finish_variance > 0 and v.added == ["B2A"] and [r[0] for r in v.re_estimated] == ["B7"]
    assert [p.status_date for p in plan.odds_trend] == [dt.date(2027, 3, 26), dt.date(2027, 4, 30),
                                                        dt.date(2027, 5, 28)]
    chances = [p.simulation_probability for p in plan.odds_trend]
    assert chances[-1] < base.simulation.probability and np.all(np.diff(chances) < 0)
    assert all(p.deadline == plan.baselines[0].deadline for p in plan.odds_trend)
