"""The Drivers slide paints the pack's chart on Present's small logical page: both panel
titles are said whole there, not cut short with an ellipsis."""

import io
import re

from pypdf import PdfReader
from reportlab.pdfgen.canvas import Canvas

from workbench.core.demo import demo_plan
from workbench.core.montecarlo import simulate
from workbench.figures import drivers as dg
from workbench.reports.drivers_pages import paint_drivers
from workbench.ui.present.chart_slide import LOGICAL_H, LOGICAL_W


def test_both_titles_fit_the_slide():
    plan = demo_plan()
    sim = simulate(plan, 300, seed=2)
    out = io.BytesIO()
    c = Canvas(out, pagesize=(LOGICAL_W, LOGICAL_H))
    paint_drivers(c, LOGICAL_W, LOGICAL_H, dg.criticality_bars(sim, plan, 8), dg.sensitivity_bars(sim, plan, 8), set())
    c.save()
    text = re.sub(r"[ \t]+", " ", PdfReader(io.BytesIO(out.getvalue())).pages[0].extract_text())
    titles = [line for line in text.splitlines() if line.startswith(("Criticality", "Sensitivity"))]
    assert len(titles) == 2, text
    assert all(not t.endswith("...") for t in titles), titles
    assert titles[0].endswith("critical path") and titles[1].endswith("the finish"), titles
