"""The cost curve's dates are written as everywhere else (docs/dates.md): English month
names whatever the desktop's locale, no zero-padded days ("5 Aug", not "05 Aug")."""

import re

import pytest

from test_tradeoff_chance_axis import drawn_labels
from workbench.core.formatting import DAYS, MONTHS
from support.tradeoff import shown_tradeoff_view



def reads_right(text: str) -> bool:
    """Words are English day and month names; no day is zero-padded."""
    words = re.findall(r"[A-Za-z]+", text)
    return all(w in MONTHS or w in DAYS for w in words) and not re.search(r"(^| )0\d", text)


@pytest.fixture
def view(qtbot):
    yield from shown_tradeoff_view(qtbot, (1920, 1080))


def test_the_finish_axis_and_the_optimum_read_like_every_date(qtbot, view):
    qtbot.wait(20)
    labels = [t for t in drawn_labels(view.axis) if t]
    assert len(labels) >= 3, labels
    for text in labels:
        assert reads_right(text), labels
    notes = [item.textItem.toPlainText() for item in view.curve_plot.getPlotItem().items
             if hasattr(item, "textItem") and item.textItem.toPlainText().startswith("optimum")]
    assert len(notes) == 1 and reads_right(notes[0].removeprefix("optimum ")), notes


def test_the_options_chance_is_written_like_the_odds_view(view):
    """``42.4 % ± 1.1 points``, as the Odds view and the pack write a chance and its spread."""
    text = view.summary.text()
    assert "chance" in text, text
    assert re.search(r"chance \d+(\.\d)? % \u00b1 \d+(\.\d)? points", text), text
