"""Text helpers for the approval pack: safe strings for the standard PDF fonts and the
number and date formats of the pack. Probabilities use ``workbench.figures.odds.format_probability``,
the same function the Odds view shows them with."""

from __future__ import annotations

from xml.sax.saxutils import escape

from workbench.core import formatting as fm

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


format_percent = fm.format_percent   # one number and date style: workbench.core.formatting
format_date = fm.format_date
format_day_month = fm.format_day_month
format_number = fm.format_number
format_timestamp = fm.format_timestamp
format_duration = fm.format_duration
format_signed = fm.format_signed


def plural_unit(unit: str, value: float) -> str:
    single = unit[:-1] if unit.endswith("s") else unit
    return single if abs(value - 1) < 1e-9 else unit


def elide(text: str, limit: int) -> str:
    text = clean(text)
    return text if len(text) <= limit else text[: max(1, limit - 3)].rstrip() + "..."
