"""Text helpers for the approval pack: safe strings for the standard PDF fonts and the
number and date formats of the pack. Probabilities use ``workbench.figures.odds.format_probability``,
the same function the Odds view shows them with."""

from __future__ import annotations

import datetime as dt
import math
from xml.sax.saxutils import escape

_SUBSTITUTES = {"\u2192": "->", "\u2264": "<=", "\u2265": ">=", "\u03c3": "sd", "\u2212": "-",
                "\u2248": "~", "\u00d7": "x", "\u221e": "inf"}


def clean(text) -> str:
    """Text the standard (WinAnsi) PDF fonts can show: known symbols spelt out, the rest '?'."""
    text = "" if text is None else str(text)
    for sym, sub in _SUBSTITUTES.items():
        text = text.replace(sym, sub)
    return text.encode("cp1252", "replace").decode("cp1252")


def para(text) -> str:
    """Clean text escaped for a platypus Paragraph."""
    return escape(clean(text))


def format_percent(p: float) -> str:
    return f"{p * 100:.1f} %"


def format_date(day) -> str:
    """ISO date (YYYY-MM-DD) for a date or numpy datetime64."""
    if day is None:
        return "-"
    if not isinstance(day, dt.date):
        day = day.astype(dt.date)
    return day.isoformat()


def format_number(x: float, digits: int = 1) -> str:
    """A duration or float in plan units: whole numbers without decimals."""
    if x is None or not math.isfinite(x):
        return "-"
    x = round(float(x), 9)
    if abs(x - round(x)) < 1e-9:
        return f"{int(round(x))}"
    return f"{x:.{digits}f}"


def plural_unit(unit: str, value: float) -> str:
    single = unit[:-1] if unit.endswith("s") else unit
    return single if abs(value - 1) < 1e-9 else unit


def elide(text: str, limit: int) -> str:
    """At most ``limit`` characters; longer text ends in '...' (only its head is cleaned)."""
    text = clean(("" if text is None else str(text))[: limit + 1])
    return text if len(text) <= limit else text[: max(1, limit - 3)].rstrip() + "..."
