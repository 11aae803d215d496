"""Timeline Print/PDF and Export PNG give the whole plan, not only the rows scrolled into
view: PNG as one tall image, print as pages tiled by rows; labels whole; the view is put
back as it was."""

import datetime as dt

import pytest
from PySide6.QtGui import QFont, QFontMetricsF, QImage
from pypdf import PdfReader

from workbench.core import Activity, Link, Plan, Settings
from workbench.ui.session import Session
from workbench.ui.timeline import output
from workbench.ui.timeline.view import TimelineView
from support.ui import shown

LONG = "Commission heating, ventilation and water systems in the east wing plant room"


def _plan(n=70):
    acts = [Activity(f"A{i}", LONG if i == n - 1 else f"Step {i}", duration=1 + i % 4) for i in range(n)]
    links = [Link(f"A{i}", f"A{i + 1}") for i in range(n - 1)]
    return Plan(Settings(title="Long", start=dt.date(2027, 1, 4)), acts, links)


@pytest.fixture
def view(qtbot):
    v = shown(qtbot, TimelineView(Session(_plan())), (900, 500))
    qtbot.wait(50)
    v.fit_all()
    qtbot.wait(50)
    return v


def _spy(monkeypatch, view):
    seen = []
    real = output.render_to

    def spy(v, painter, target):
        lo, hi = v.view_box.viewRange()[1]
        font = v._font()
        need = QFontMetricsF(font).horizontalAdvance(f"A{v.geometry.n_rows - 1}  {LONG}")
        seen.append((lo, hi, v.row_axis.width() >= need))
        return real(v, painter, target)
    monkeypatch.setattr(output, "render_to", spy)
    return seen


def test_export_png_holds_every_row_with_whole_labels(view, monkeypatch, tmp_path):
    before = view.view_box.viewRange()
    assert before[1][1] < view.geometry.n_rows - 1               # the view shows only the top rows
    seen = _spy(monkeypatch, view)
    path = tmp_path / "t.png"
    output.export_png(view, path)
    (lo, hi, whole), = seen
    assert lo <= -0.5 and hi >= view.geometry.n_rows - 0.5 and whole
    image = QImage(str(path))
    assert image.height() >= view.geometry.n_rows * view.legible_row_pitch()
    after = view.view_box.viewRange()
    assert after[0] == pytest.approx(before[0], abs=1e-6) and after[1] == pytest.approx(before[1], abs=1e-6)


def test_print_tiles_every_row_over_pages(view, monkeypatch, tmp_path):
    seen = _spy(monkeypatch, view)
    path = tmp_path / "t.pdf"
    output.export_pdf(view, path)
    assert len(seen) >= 2 and len(PdfReader(str(path)).pages) == len(seen)
    covered = set()
    for lo, hi, whole in seen:
        assert whole
        covered |= {r for r in range(view.geometry.n_rows) if lo < r < hi}
    assert covered == set(range(view.geometry.n_rows))
    sizes = [count for _, count in output.page_rows(view)]
    assert max(sizes) - min(sizes) <= 1                            # shared evenly
