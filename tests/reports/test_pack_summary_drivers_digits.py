"""The summary's top risk drivers print every correlation with two decimals, as the
Drivers page does ("+0.30", not "+0.3"), so the column lines up and the pages agree."""

import re

from workbench.core.analysis import analyze
from workbench.core.demo import demo_plan
from workbench.core.montecarlo import simulate
from workbench.reports.context import PackContext
from workbench.reports.summary import drivers


def test_every_sensitivity_has_two_decimals():
    plan = demo_plan()
    ctx = PackContext(plan, analyze(plan), simulate(plan, 1000, seed=2), None, "a4")  # seed 2: +0.30 and +0.20 among them
    table = drivers(ctx, 500)[1]
    texts = [row[3].text for row in table._cellvalues[1:]]
    assert len(texts) == 5
    assert all(re.fullmatch(r"[+-]\d\.\d\d", t) for t in texts), texts
