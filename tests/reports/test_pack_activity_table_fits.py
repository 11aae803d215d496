"""The pack's activity table: every date and figure fits inside its column, on A4 and
letter (dates written ``Wed 28 Apr 2027`` once ran into the next column)."""

from __future__ import annotations

import datetime as dt

import pytest
from reportlab.pdfbase.pdfmetrics import stringWidth
from reportlab.platypus import LongTable

from workbench.core.analysis import analyze
from workbench.core.demo import demo_plan
from workbench.reports import styles
from workbench.reports.context import PackContext
from workbench.reports.footer import FooterInfo
from workbench.reports.pack import story
from workbench.reports.tables import FONT_SIZE, HEAD

PADDING = 2 + 2        # the table's left and right cell padding


def _activity_table(paper: str) -> LongTable:
    plan = demo_plan()
    footer = FooterInfo("demo.slw", "0123abcd", dt.datetime(2027, 2, 23, tzinfo=dt.timezone.utc), "0", None)
    parts = story(PackContext(plan, analyze(plan), None, footer, paper), lambda done: None)
    found = [p for p in parts if isinstance(p, LongTable) and tuple(p._cellvalues[0]) == HEAD]
    assert len(found) == 1
    return found[0]


@pytest.mark.parametrize("paper", ["a4", "letter"])
def test_every_cell_of_the_activity_table_fits_its_column(paper):
    table = _activity_table(paper)
    for r, row in enumerate(table._cellvalues):
        for c, value in enumerate(row):
            if not isinstance(value, str):
                continue            # a Paragraph wraps inside its cell
            font = styles.BOLD if r == 0 or c == 0 else styles.FONT
            widest = max(stringWidth(line, font, FONT_SIZE) for line in value.split("\n"))
            assert widest + PADDING <= table._colWidths[c] + 1e-6, (paper, HEAD[c], value)


def test_names_keep_a_readable_column():
    table = _activity_table("letter")
    assert table._colWidths[HEAD.index("Name")] >= 150      # about 40 characters at 8 pt
