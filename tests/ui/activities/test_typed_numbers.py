"""Every number cell of the Activities table reads typed text by one rule: "1,500" is
fifteen hundred in a duration cell as in a cost cell, "1.500" is one and a half, and a
lone decimal comma ("1,5") is one and a half too."""

import pytest

from support.ui import sample_plan
from workbench.core.errors import PlanError
from workbench.ui.activities import columns as C
from workbench.ui.activities.table_model import ActivityTableModel
from workbench.ui.session import Session

READINGS = [("1,500", 1500), ("1.500", 1.5), ("1,5", 1.5), ("0,25", 0.25), ("12,500.5", 12500.5),
            ("12.500,50", 12500.5), ("1.500.000", 1_500_000), ("1,500,000", 1_500_000), ("12 500", 12500),
            ("2\u00a0000", 2000), ("-0,5", -0.5), ("+3", 3), ("7", 7), ("", None)]


@pytest.mark.parametrize("text, value", READINGS)
def test_one_reading_of_typed_numbers(text, value):
    assert C.parse_number(text, "K7", "duration") == value


@pytest.mark.parametrize("text", ["1,50,0", "1.5.0,0,0", "1,2,3", "abc", "1..5"])
def test_text_that_is_no_number_is_refused_with_the_activity_and_field(text):
    with pytest.raises(PlanError, match=r"activity K7: duration: .* is not a number"):
        C.parse_number(text, "K7", "duration")


@pytest.fixture
def model(qapp):
    return ActivityTableModel(Session(sample_plan()))


def cell(model, act_id, key):
    return model.index(model.plan.row_of(act_id), C.INDEX[key])


@pytest.mark.parametrize("key", ["duration", "cost"])
@pytest.mark.parametrize("text, value", [("1,500", 1500), ("1.500", 1.5), ("1,5", 1.5)])
def test_a_duration_cell_and_a_cost_cell_agree(model, key, text, value):
    assert model.setData(cell(model, "W", key), text)
    assert getattr(model.plan.activity("W"), key) == value


def test_three_points_typed_with_decimal_commas(model):
    for key, text in (("optimistic", "2,5"), ("most_likely", "4"), ("pessimistic", "1,000")):
        assert model.setData(cell(model, "R", key), text)
    r = model.plan.activity("R")
    assert (r.optimistic, r.most_likely, r.pessimistic) == (2.5, 4, 1000)
