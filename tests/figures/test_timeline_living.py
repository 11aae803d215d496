"""Timeline geometry of the living schedule: baseline bars, done work, slip marks."""

import datetime as dt
from pathlib import Path

import numpy as np

from workbench.core import analyze
from workbench.core.variance import variance_against
from workbench.figures.timeline import timeline_geometry
from workbench.io.planfile import load_plan

SAMPLE = Path(__file__).resolve().parents[1] / "data" / "harbour_kiosk_progress_v3.slw"


def marks_of(geo, kind, act_id):
    m = geo.marks[kind]
    hit = np.flatnonzero(m.rows == geo.row_of[act_id])
    return [(float(m.x0[k]), float(m.x1[k])) for k in hit]


def test_done_work_runs_from_the_actual_start_to_the_finish_or_the_status_date():
    a = analyze(load_plan(SAMPLE))
    geo = timeline_geometry(a)
    assert marks_of(geo, "done", "SURV") == [(0.0, 3.0)]            # done 2–4 March
    assert marks_of(geo, "done", "PERM") == [(3.0, 10.0)]           # started 5 March, status 13 March
    assert marks_of(geo, "done", "FIT") == [] and len(geo.marks["baseline"]) == 0


def test_baseline_bars_sit_on_the_baseline_dates_and_slips_are_marked():
    plan = load_plan(SAMPLE)
    a = analyze(plan)
    v = variance_against(a, plan.baselines[0])
    geo = timeline_geometry(a, variance=v)
    cal = a.calendar
    base = plan.baselines[0].activity("PERM")
    assert marks_of(geo, "baseline", "PERM") == [(cal.offset_before(base.start), cal.offset_through(base.finish))]
    open_ = plan.baselines[0].activity("OPEN")                       # a milestone: a point
    assert marks_of(geo, "baseline", "OPEN") == [(cal.offset_through(open_.finish),) * 2]
    slipped = {geo.keys[r] for r in geo.marks["slipped"].rows.tolist()}
    assert slipped == {plan.ids()[i] for i in np.flatnonzero(np.nan_to_num(v.finish) > 0)}
    assert "PERM" in slipped and "SURV" not in slipped


def test_without_progress_or_baseline_nothing_new_is_drawn():
    plan = load_plan(SAMPLE.parent / "harbour_kiosk_v3.slw")
    geo = timeline_geometry(analyze(plan))
    assert all(len(geo.marks[k]) == 0 for k in ("baseline", "done", "slipped"))
