"""The one date format and number style (workbench.core.formatting)."""

import datetime as dt

import numpy as np
from hypothesis import given
from hypothesis import strategies as st

from workbench.core import formatting as fm


def test_dates_read_weekday_day_month_year_from_any_date_type():
    # 2 September 2027 is a Thursday (printed calendar of 2027).
    for value in (dt.date(2027, 9, 2), dt.datetime(2027, 9, 2, 15, 30), np.datetime64("2027-09-02")):
        assert fm.format_date(value) == "Thu 2 Sep 2027"
    assert fm.format_date(None) == "-"
    assert fm.format_day_month(dt.date(2027, 9, 2)) == "Thu 2 Sep"
    assert fm.format_timestamp(dt.datetime(2027, 9, 2, 9, 5)) == "Thu 2 Sep 2027 09:05"


def test_dates_do_not_follow_the_c_library_locale(monkeypatch):
    import locale
    try:
        locale.setlocale(locale.LC_TIME, "de_DE.UTF-8")
    except locale.Error:
        pass                                   # the locale is not installed: nothing to change
    try:
        assert fm.format_date(dt.date(2027, 3, 4)) == "Thu 4 Mar 2027"
    finally:
        locale.setlocale(locale.LC_TIME, "C")


@given(st.dates(dt.date(1900, 1, 1), dt.date(2200, 12, 31)))
def test_shown_and_iso_dates_read_back(day):
    assert fm.parse_date(fm.format_date(day)) == day
    assert fm.parse_date(day.isoformat()) == day
    assert fm.parse_date(f"{day.day:02d} {fm.MONTH_NAMES[day.month - 1]} {day.year}") == day


def test_text_that_is_no_date_is_refused():
    for text in ("", "soon", "31 Feb 2027", "2027-13-01", "Thu 2 Sept"):
        assert fm.parse_date(text) is None


def test_numbers_are_rounded_for_people_and_never_negative_zero():
    assert fm.format_number(1.33333) == "1.3"
    assert fm.format_number(19.5333) == "19.5"
    assert fm.format_number(21.6667) == "21.7"
    assert fm.format_number(44.00000001) == "44"
    assert fm.format_number(-0.004) == "0"
    assert fm.format_number(-0.04, 1) == "0"
    assert fm.format_number(-2.5) == "-2.5"
    assert fm.format_number(None) == "-" and fm.format_number(float("nan")) == "-"
    assert fm.format_signed(0.8) == "+0.8" and fm.format_signed(-0.01) == "0"
    assert fm.format_duration(1.33333) == "1.3 days" and fm.format_duration(1.0) == "1 day"
    assert fm.format_duration(1.04, "weeks") == "1 week"


@given(st.floats(-1e6, 1e6))
def test_no_number_prints_as_negative_zero(x):
    text = fm.format_number(x)
    assert not text.startswith("-0") or text.startswith("-0.")
    assert text != "-0"
    assert abs(float(text) - x) <= 0.05 + 1e-9 * abs(x)


def test_percentages_never_claim_certainty_they_do_not_have():
    assert fm.format_percent(0.8547) == "85.5 %"
    assert fm.format_percent(0.99996) == "> 99.9 %"
    assert fm.format_percent(0.00002) == "< 0.1 %"
    assert fm.format_percent(1.0) == "100 %" and fm.format_percent(0.0) == "0 %"


def test_a_stored_timestamp_reads_as_people_write_it():
    assert fm.format_stored_timestamp("2027-03-01T14:05:33") == "Mon 1 Mar 2027 14:05"
    assert fm.format_stored_timestamp("not a time") == "not a time"
