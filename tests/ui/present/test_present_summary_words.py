"""Present mode's summary speaks to a room: dates in words, rounded figures without error
margins or offsets, the critical path with names."""

import re

from workbench.core.analysis import analyze
from workbench.core.demo import demo_plan
from workbench.core.montecarlo import simulate
from workbench.reports.context import PackContext
from workbench.ui.present.summary_slide import PATH_NAMED, critical_path_text, summary_lines


def _ctx():
    plan = demo_plan()
    return PackContext(plan, analyze(plan), simulate(plan, 400, seed=4), None, "a4")


def test_the_summary_has_dates_in_words_and_no_offsets_or_margins():
    values = [v for _, v, _ in summary_lines(_ctx())]
    text = "\n".join(values)
    assert "offset" not in text and "\u00b1" not in text and "pts" not in text
    assert not re.search(r"\d{4}-\d{2}-\d{2}", text)                      # no ISO dates
    assert re.search(r"\b(Mon|Tue|Wed|Thu|Fri) \d{1,2} [A-Z][a-z]{2} \d{4}\b", values[0])
    assert not re.search(r"0\.\d{4}", text)                                  # no raw probabilities


def test_the_critical_path_names_its_activities():
    ctx = _ctx()
    path = list(ctx.analysis.pert.path)
    text = critical_path_text(ctx)
    for act_id in path[:PATH_NAMED]:
        assert f"{act_id} {ctx.plan.activity(act_id).name[:10]}" in text
    assert all(a in text for a in path)
