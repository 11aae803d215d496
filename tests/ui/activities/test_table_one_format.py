"""The table writes dates and computed figures in Slackline's one style, and reads a
date back as it shows it."""

import datetime as dt
import re

from support.ui import sample_plan
from workbench.core import formatting as fm
from workbench.ui.activities import columns as C
from workbench.ui.activities.table_model import ActivityTableModel
from workbench.ui.session import Session


def _text(model, act_id, key):
    return model.index(model.plan.row_of(act_id), C.INDEX[key]).data()


def test_dates_and_figures_read_as_everywhere_else(qapp):
    session = Session(sample_plan())
    model = ActivityTableModel(session)
    act = session.plan.activities[0].id
    shown = _text(model, act, "early_start")
    assert re.fullmatch(r"(Mon|Tue|Wed|Thu|Fri|Sat|Sun) \d{1,2} [A-Z][a-z]{2} \d{4}", shown)
    i = session.analysis.schedule.index(act)
    assert shown == fm.format_date(session.analysis.dates()["early_start"][i])
    for a in session.plan.activities:
        for key in ("te", "sd", "total_float", "free_float"):
            value = _text(model, a.id, key)
            assert value in ("", "0") or re.fullmatch(r"-?\d+(\.\d)?", value), (a.id, key, value)


def test_a_constraint_typed_as_shown_is_read_back(qapp):
    session = Session(sample_plan())
    model = ActivityTableModel(session)
    act = session.plan.activities[-1].id
    day = session.plan.settings.start + dt.timedelta(days=30)
    assert model.setData(model.index(model.plan.row_of(act), C.INDEX["start_no_earlier"]), fm.format_date(day))
    assert session.plan.activity(act).start_no_earlier == day
    assert _text(model, act, "start_no_earlier") == fm.format_date(day)
