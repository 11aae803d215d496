"""Typed dates: ISO and the display format, in full; refusals say what is wrong."""

import datetime as dt

import pytest
from hypothesis import given
from hypothesis import strategies as st

from workbench.core.date_text import maybe_date, read_date, show_date
from workbench.core.errors import PlanError

DAY = dt.date(2027, 3, 12)


@pytest.mark.parametrize("text", [
    "2027-03-12", " 2027-03-12 ", "2027-3-12", "2027/03/12", "20270312",
    "12 Mar 2027", "12 mar 2027", "12 March 2027", "12-Mar-2027", "12 Mar. 2027",
    "Fri 12 Mar 2027", "Friday, 12 March 2027", "Mar 12 2027", "March 12, 2027", "March 12th, 2027",
])
def test_every_accepted_form_gives_the_whole_date(text):
    assert read_date(text) == DAY


def test_the_year_typed_is_the_year_kept():
    """Typing a full date replaces the year too (the field once kept the old one)."""
    assert read_date("2027-03-12").year == 2027
    assert read_date("12 Mar 2031") == dt.date(2031, 3, 12)


@pytest.mark.parametrize("text, words", [
    ("", "no date"),
    ("2027-02-29", "February 2027 has 28 days"),
    ("2027-13-01", "no month 13"),
    ("12 Mrz 2027", "not a month name"),
    ("03/12/2027", "either way round"),
    ("next Friday", "not a date"),
])
def test_refusals_say_why(text, words):
    with pytest.raises(PlanError) as caught:
        read_date(text)
    assert words in str(caught.value)
    assert maybe_date(text) is None


def test_leap_day_is_a_date():
    assert read_date("29 Feb 2028") == dt.date(2028, 2, 29)


@given(st.dates(min_value=dt.date(1000, 1, 1), max_value=dt.date(9999, 12, 31)))
def test_shown_and_iso_dates_read_back(day):
    assert read_date(show_date(day)) == day
    assert read_date(day.isoformat()) == day
    assert read_date(day.strftime("%a %d %B %Y").replace(day.strftime("%a"), "Mon")) == day
