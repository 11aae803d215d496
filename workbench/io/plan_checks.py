"""Checks on plan file data that name the culprit: text a UTF-8 file cannot hold (a lone
surrogate, e.g. ``"\\ud800"`` written as a JSON escape) and a link given twice.

Kept apart from the field reader so that the fast path of reading stays untouched: the
text check runs only when the file holds a surrogate escape at all.
"""

from __future__ import annotations

import re
from operator import attrgetter

from workbench.core.text import clean_text, lone_surrogate

from .errors import PlanFileError

_SURROGATE_ESCAPE = re.compile(r"\\u[dD][89a-fA-F][0-9a-fA-F]{2}")
_LABEL_KEYS = {"activities": ("activity", "id"), "risks": ("risk", "id"), "correlations": ("correlation group", "name")}


_SURROGATE_ESCAPE_BYTES = re.compile(_SURROGATE_ESCAPE.pattern.encode("ascii"))


def may_hold_surrogates(text: str | bytes) -> bool:
    """True when the JSON text (or its UTF-8 bytes) has a surrogate escape (a pair is fine,
    a lone one is not)."""
    pattern = _SURROGATE_ESCAPE_BYTES if isinstance(text, bytes) else _SURROGATE_ESCAPE
    return pattern.search(text) is not None


def _label(section: str, position: int, entry) -> str:
    if section == "links" and isinstance(entry, dict):
        return f"link {entry.get('pred', '?')} \u2192 {entry.get('succ', '?')}"
    kind, key = _LABEL_KEYS.get(section, (section.rstrip("s"), "id"))
    name = entry.get(key) if isinstance(entry, dict) else None
    if isinstance(name, str) and lone_surrogate(name) is None:
        return f"{kind} {name}"
    return f"{kind} {position}"


def _find(value, where: str, key: str | None):
    if isinstance(value, str):
        bad = lone_surrogate(value)
        if bad is not None:
            field = f"field '{key}'" if key else "an entry"
            return f"{where}: {field} holds a broken character (lone surrogate U+{ord(value[bad]):04X} at position {bad + 1}) that a UTF-8 file cannot store"
        return None
    if isinstance(value, dict):
        for k, v in value.items():
            found = _find(k, where, None) or _find(v, where, k if key is None or where.endswith(":") else f"{key}.{k}")
            if found:
                return found
    if isinstance(value, list):
        for item in value:
            found = _find(item, where, key)
            if found:
                return found
    return None


def unstorable_text(data) -> str | None:
    """Where plan data holds text that UTF-8 cannot store, as a message naming the
    activity (or settings, link, risk…) and the field; None when all text is storable."""
    if not isinstance(data, dict):
        return _find(data, "plan file", None)
    for section, value in data.items():
        if section == "settings" and isinstance(value, dict):
            found = _find(value, "settings", None)
        elif isinstance(value, list):
            found = next((f for i, e in enumerate(value, 1) if (f := _find(e, _label(section, i, e), None))), None)
        else:
            found = _find(value, "plan file", section)
        if found:
            return found
    return None


def check_storable(data, source: str) -> None:
    problem = unstorable_text(data)
    if problem:
        raise PlanFileError(f"{source}: {problem}; retype it or remove it with a text editor", "text")


def refuse_duplicate_links(links) -> None:
    """A link of one type from the same predecessor to the same successor may appear once
    only (an SS and an FF link between the same two activities are two links)."""
    keys = zip(map(attrgetter("pred"), links), map(attrgetter("succ"), links), map(attrgetter("type"), links))
    if len(set(keys)) == len(links):
        return                          # the common case, in bulk; else name the first repeat
    seen: dict[tuple[str, str, str], int] = {}
    for i, link in enumerate(links, 1):
        key = (link.pred, link.succ, link.type)
        if key in seen:
            raise PlanFileError(f"link {link.pred} \u2192 {link.succ} ({link.type}) appears twice (links {seen[key]} "
                                f"and {i}); keep one of them", link.succ)
        seen[key] = i



def cleaned_data(value):
    """Plan data with every text it cannot store cleaned (lone surrogates become U+FFFD)."""
    if isinstance(value, str):
        return clean_text(value)
    if isinstance(value, dict):
        return {cleaned_data(k): cleaned_data(v) for k, v in value.items()}
    if isinstance(value, list):
        return [cleaned_data(v) for v in value]
    return value
