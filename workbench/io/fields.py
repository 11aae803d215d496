"""Typed reading of one JSON object, with messages naming the entry and the field:
``activity B7: field 'pessimistic' must be a number, got "ten"``."""

from __future__ import annotations

import datetime as dt
import json
import math
import re

from .errors import PlanFileError

_ISO_DATE = re.compile(r"^\d{4}-\d{2}-\d{2}$")
_MISSING = object()
MAX_EXACT_INT = 2 ** 53  # whole numbers beyond this are not plan numbers (and may not fit a float)


def show(value) -> str:
    """A short JSON rendering of a bad value for a message."""
    try:
        text = json.dumps(value, ensure_ascii=False)
    except (TypeError, ValueError):
        text = repr(value)
    return text if len(text) <= 40 else text[:37] + "..."


def parse_iso_date(text) -> dt.date | None:
    """``YYYY-MM-DD`` as a date, or None when the text is not exactly that."""
    if not isinstance(text, str) or not _ISO_DATE.match(text):
        return None
    try:
        return dt.date.fromisoformat(text)
    except ValueError:
        return None


class Fields:
    """Reads fields from ``data`` (a dict) and remembers which were used, so that
    :meth:`done` can report a field nobody knows (a typo, or a file edited by hand)."""

    def __init__(self, data, where: str):
        if not isinstance(data, dict):
            raise PlanFileError(f"{where}: must be an object {{...}}, got {show(data)}", where)
        self.data, self.where, self.used = data, where, set()

    @classmethod
    def entry(cls, data, kind: str, position: int, key: str = "id") -> "Fields":
        """An entry of a list, labelled by its id where it has one, else by its position."""
        label = f"{kind} {position}"
        if isinstance(data, dict):
            if kind == "link" and isinstance(data.get("pred"), str) and isinstance(data.get("succ"), str):
                label = f"link {data['pred']} \u2192 {data['succ']}"
            elif isinstance(data.get(key), str) and data[key].strip():
                label = f"{kind} {data[key]}"
        return cls(data, label)

    def error(self, key: str, what: str) -> PlanFileError:
        return PlanFileError(f"{self.where}: field '{key}' {what}", self.where)

    def raw(self, key: str, default=None):
        self.used.add(key)
        return self.data.get(key, default)

    def _value(self, key: str, required: bool):
        value = self.raw(key, _MISSING)
        if value is _MISSING or value is None:
            if required:
                raise self.error(key, "is missing")
            return _MISSING
        return value

    def text(self, key: str, default="", required: bool = False):
        value = self._value(key, required)
        if value is _MISSING:
            return default
        if not isinstance(value, str):
            raise self.error(key, f"must be text, got {show(value)}")
        return value

    def number(self, key: str, default=None, required: bool = False):
        value = self._value(key, required)
        if value is _MISSING:
            return default
        if isinstance(value, bool) or not isinstance(value, (int, float)):
            raise self.error(key, f"must be a number, got {show(value)}")
        if isinstance(value, int) and abs(value) > MAX_EXACT_INT:
            raise self.error(key, f"is too large a number ({len(str(abs(value)))} digits)")
        if not math.isfinite(value):
            raise self.error(key, f"must be a finite number, got {value}")
        return float(value)

    def date(self, key: str, required: bool = False):
        value = self._value(key, required)
        if value is _MISSING:
            return None
        day = parse_iso_date(value)
        if day is None:
            raise self.error(key, f"must be a date written YYYY-MM-DD, got {show(value)}")
        return day

    def point(self, key: str):
        """A tagged offset or date: ``{"offset": 3.5}`` or ``{"date": "2026-03-02"}``."""
        value = self._value(key, False)
        if value is _MISSING:
            return None
        if isinstance(value, dict) and len(value) == 1 and ("offset" in value or "date" in value):
            inner = Fields(value, f"{self.where}: field '{key}'")
            return inner.number("offset", required=True) if "offset" in value else inner.date("date", required=True)
        raise self.error(key, f'must be {{"offset": number}} or {{"date": "YYYY-MM-DD"}}, got {show(value)}')

    def raw_list(self, key: str) -> list:
        value = self._value(key, False)
        if value is _MISSING:
            return []
        if not isinstance(value, list):
            raise self.error(key, f"must be a list [...], got {show(value)}")
        return value

    def sub(self, key: str) -> "Fields":
        value = self._value(key, False)
        return Fields({} if value is _MISSING else value, f"{self.where} {key}")

    def sub_list(self, key: str) -> list["Fields"]:
        return [Fields(x, f"{self.where} {key} {i}") for i, x in enumerate(self.raw_list(key), 1)]

    def text_list(self, key: str) -> list[str]:
        items = self.raw_list(key)
        for item in items:
            if not isinstance(item, str):
                raise self.error(key, f"must list text, got {show(item)}")
        return items

    def date_list(self, key: str) -> list[dt.date]:
        days = [parse_iso_date(x) for x in self.raw_list(key)]
        for raw, day in zip(self.raw_list(key), days):
            if day is None:
                raise self.error(key, f"must list dates written YYYY-MM-DD, got {show(raw)}")
        return days

    def int_list(self, key: str, lo: int, hi: int, default: list[int]) -> list[int]:
        if self.raw(key) is None:
            return list(default)
        items = self.raw_list(key)
        for item in items:
            if isinstance(item, bool) or not isinstance(item, int) or not lo <= item <= hi:
                raise self.error(key, f"must list whole numbers {lo}..{hi}, got {show(item)}")
        return items

    def check_known(self, key: str, ids, known: set[str]) -> None:
        for act_id in ids:
            if act_id not in known:
                raise self.error(key, f"names unknown activity {act_id!r}")

    def done(self) -> None:
        for key in self.data:
            if key not in self.used:
                raise PlanFileError(f"{self.where}: unknown field '{key}'", self.where)
