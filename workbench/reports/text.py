"""Text helpers for the approval pack: strings ready for the pack's fonts (``fonts``) and the
number and date formats of the pack. Probabilities use ``workbench.figures.odds.format_probability``,
the same function the Odds view shows them with."""

from __future__ import annotations

import re

from workbench.core import formatting as fm

from . import fonts

NARROWEST = 0.1           # no printing character is narrower than a tenth of the font size
_CONTROL = re.compile("[\x00-\x08\x0b-\x1f\x7f-\x9f]")
_SUBSTITUTES = {"\u2192": "->", "\u2264": "<=", "\u2265": ">=", "\u2212": "-",
                "\u2248": "~", "\u00d7": "x", "\u221e": "inf"}


def clean(text) -> str:
    """Text ready to draw: a few symbols spelt out as the pack always has, control
    characters and unpaired surrogates dropped, right-to-left runs in drawing order."""
    text = "" if text is None else str(text)
    for sym, sub in _SUBSTITUTES.items():
        text = text.replace(sym, sub)
    if not text.isascii() or _CONTROL.search(text):
        text = _CONTROL.sub("", text.encode("utf-8", "ignore").decode("utf-8"))   # no lone surrogates
    return fonts.visual(text)


def fit(text: str, width: float, font: str = fonts.FONT, size: float = 8.0) -> str:
    """Text shortened with '...' so it fits ``width`` points. Only as many characters as
    could ever fit are looked at, and the cut is found by bisection, so a pasted essay
    costs no more than a name."""
    text = "" if text is None else str(text)
    most = int(width / (NARROWEST * size)) + 2
    text = clean(text[:most + 1])
    if len(text) <= most and fonts.width(text, font, size) <= width:
        return text
    lo, hi = 0, min(len(text), most)          # text[:lo] + '...' fits; text[:hi] + '...' may not
    while lo < hi:
        mid = (lo + hi + 1) // 2
        if fonts.width(text[:mid] + "...", font, size) <= width:
            lo = mid
        else:
            hi = mid - 1
    return text[:lo].rstrip() + "..."


def para(text) -> str:
    """Clean text as Paragraph markup (escaped; characters of other scripts in the fallback font)."""
    return fonts.markup(clean(text))


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
    """At most ``limit`` characters; longer text ends in '...' (only its head is cleaned)."""
    text = clean(("" if text is None else str(text))[: limit + 1])
    return text if len(text) <= limit else text[: max(1, limit - 3)].rstrip() + "..."


def wrap_words(c, text: str, width: float, font: str, size: float) -> list[str]:
    """Words in lines no wider than ``width`` as ``c`` measures them (paper or screen)."""
    lines: list[str] = []
    for word in text.split():
        trial = f"{lines[-1]} {word}" if lines else word
        if lines and c.stringWidth(trial, font, size) <= width:
            lines[-1] = trial
        else:
            lines.append(word)
    return lines
