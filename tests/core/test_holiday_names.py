"""Holiday names are labels for stored dates (from the holidays package)."""

import datetime as dt

from workbench.core.holiday_names import holiday_names


def test_names_of_known_dates_and_nothing_for_ordinary_days():
    # Christmas Day and New Year's Day are public holidays in Germany (holidays package).
    names = holiday_names("DE", [dt.date(2027, 12, 25), dt.date(2028, 1, 1), dt.date(2027, 3, 10)])
    assert set(names) == {dt.date(2027, 12, 25), dt.date(2028, 1, 1)}
    assert all(isinstance(n, str) and n for n in names.values())


def test_unknown_or_empty_region_gives_no_names():
    assert holiday_names("", [dt.date(2027, 12, 25)]) == {}
    assert holiday_names("XX", [dt.date(2027, 12, 25)]) == {}
