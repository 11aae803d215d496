"""Names for holiday dates (labels only: the plan stores the dates themselves)."""

from __future__ import annotations

import datetime as dt


def holiday_names(region: str, days) -> dict[dt.date, str]:
    """The public-holiday name of each of ``days`` in ``region`` ("DE", "US-CA"), where it
    has one; {} when the region is unknown or empty."""
    days = list(days)
    if not region or not days:
        return {}
    import holidays  # only when names are wanted

    country, _, subdiv = region.partition("-")
    try:
        table = holidays.country_holidays(country.upper(), subdiv=subdiv.upper() or None,
                                          years=sorted({d.year for d in days}))
    except (NotImplementedError, KeyError):
        return {}
    return {d: table.get(d) for d in days if table.get(d)}
