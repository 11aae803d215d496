"""On the pack's Timeline pages the deadline's label sits at the top of the chart, not on
the finish row where it would cover the P10-P90 bar."""

import datetime as dt

from pypdf import PdfReader

from workbench.core.demo import demo_plan
from workbench.reports.pack import build_pack


def _placed(page) -> dict[str, float]:
    found: dict[str, float] = {}

    def visit(text, cm, tm, font, size):
        if text.strip():
            found.setdefault(text.strip(), tm[5] if cm[5] == 0 else cm[5] + tm[5])
    page.extract_text(visitor_text=visit)
    return found


def test_the_deadline_label_stays_off_the_finish_row(tmp_path):
    path = tmp_path / "pack.pdf"
    build_pack(demo_plan(), str(path), iterations=300, seed=3,
               generated_at=dt.datetime(2027, 2, 1, tzinfo=dt.timezone.utc))
    reader = PdfReader(str(path))
    pages = [p for p in reader.pages if "Project finish (P10-P90)" in p.extract_text()]
    assert pages
    for page in pages:
        placed = _placed(page)
        assert "Deadline" in placed
        assert placed["Deadline"] - placed["Project finish (P10-P90)"] > 100
