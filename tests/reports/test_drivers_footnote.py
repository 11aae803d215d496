"""The Drivers chart's footnote is wrapped to its width, never cut short with an ellipsis."""

import io
import re

from pypdf import PdfReader
from reportlab.pdfgen.canvas import Canvas

from workbench.core.demo import demo_plan
from workbench.core.montecarlo import simulate
from workbench.figures import drivers as dg
from workbench.reports.drivers_pages import FOOTNOTE, paint_drivers


def test_the_footnote_is_whole_on_a_narrow_chart():
    plan = demo_plan()
    sim = simulate(plan, 300, seed=2)
    out = io.BytesIO()
    c = Canvas(out, pagesize=(420, 400))
    paint_drivers(c, 400, 380, dg.criticality_bars(sim, plan, 6), dg.sensitivity_bars(sim, plan, 6), set())
    c.save()
    text = re.sub(r"\s+", " ", PdfReader(io.BytesIO(out.getvalue())).pages[0].extract_text())
    assert FOOTNOTE in text
    assert "largest of their values." in text and "values..." not in text
