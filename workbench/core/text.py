"""Text the plan can hold: every field is saved as UTF-8, which cannot store a lone
surrogate (half of a UTF-16 pair, e.g. pasted from a broken source). Edits clean it
(:func:`clean_text`); the model refuses it (:func:`check_text`), naming the field."""

from __future__ import annotations

import re

from .errors import PlanError

_SURROGATE = re.compile("[\ud800-\udfff]")
REPLACEMENT = "\ufffd"


def lone_surrogate(text: str) -> int | None:
    """Index of the first character UTF-8 cannot store, or None (the common case is fast)."""
    if text.isascii():
        return None
    m = _SURROGATE.search(text)
    return m.start() if m else None


def clean_text(text: str) -> str:
    """``text`` with every lone surrogate replaced by U+FFFD (the replacement character)."""
    return text if lone_surrogate(text) is None else _SURROGATE.sub(REPLACEMENT, text)


def check_text(text, owner: str, field_name: str, culprit: str | None = None) -> None:
    """Raise PlanError naming ``owner`` and ``field_name`` when ``text`` cannot be saved."""
    if isinstance(text, str):
        bad = lone_surrogate(text)
        if bad is not None:
            raise PlanError(f"{owner}: {field_name} holds a broken character (lone surrogate "
                            f"U+{ord(text[bad]):04X} at position {bad + 1}) that cannot be saved; retype it",
                            culprit or owner)
