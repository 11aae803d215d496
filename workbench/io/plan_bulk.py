"""Reading a plan file's activity and link lists in bulk.

A plan file is mostly its ``activities`` and ``links`` lists. They are decoded by msgspec
straight into typed rows (every field required, no unknown field), turned into columns
and checked a column at a time with numpy; the records are then built in one pass. The
other sections (settings, risks, correlation groups, ...) are small and go through the
standard library's decoder, which reports a field given twice.

Anything unusual sends the whole file back to the careful reader (``plan_codec``), which
names the culprit exactly as it always has: :func:`bulk_plan_data` returns None for a
file it cannot vouch for, and a row that fails a bulk check is rebuilt by the careful
per-entry reader, which raises the same message it would have raised alone.

No field may appear twice in an object. msgspec would keep the last one silently, so the
colons are counted: every key of a JSON object is followed by exactly one colon, so the
file's colons must equal the keys read plus the colons inside the text values read; one
more means a key nobody read (a repeated field).
"""

from __future__ import annotations

import json
from operator import attrgetter
from typing import Any

import msgspec
import numpy as np

from workbench.core.model import _BAD_ID, DISTRIBUTIONS, LINK_TYPES, MAX_ID_LENGTH, MAX_UNITS, Activity, Link

ACTIVITY_KEYS = ("id", "name", "group", "notes", "optimistic", "most_likely", "pessimistic",
                 "duration", "distribution", "start_no_earlier", "finish_no_later")
LINK_KEYS = ("pred", "succ", "type", "lag")
BULK = ("activities", "links")


class ActivityRow(msgspec.Struct, forbid_unknown_fields=True, gc=False):
    id: str
    name: str
    group: str
    notes: str
    optimistic: float | None
    most_likely: float | None
    pessimistic: float | None
    duration: float | None
    distribution: str | None
    start_no_earlier: Any
    finish_no_later: Any


class LinkRow(msgspec.Struct, forbid_unknown_fields=True, gc=False):
    pred: str
    succ: str
    type: str
    lag: float


_TOP = msgspec.json.Decoder(dict[str, msgspec.Raw])
_ROWS = {"activities": msgspec.json.Decoder(list[ActivityRow]), "links": msgspec.json.Decoder(list[LinkRow])}


def _no_duplicates(pairs):
    obj = dict(pairs)
    if len(obj) != len(pairs):
        raise ValueError("a field appears twice in one object")
    return obj


def _no_constant(name: str):
    raise ValueError(name)


def _small(raw) -> Any:
    """One small section, by the standard library (duplicates and NaN refused)."""
    return json.loads(bytes(raw), parse_constant=_no_constant, object_pairs_hook=_no_duplicates)


def _colons(value) -> int:
    """Keys plus colons inside text, in a decoded JSON value (small values only)."""
    if isinstance(value, str):
        return value.count(":")
    if isinstance(value, dict):
        return sum(1 + k.count(":") + _colons(v) for k, v in value.items())
    if isinstance(value, list):
        return sum(map(_colons, value))
    return 0


def _text_colons(column) -> int:
    return "\x00".join(filter(None, column)).count(":")


class ActivityRows(list):
    """The ``activities`` list as decoded rows; ``build`` makes the records."""

    def key_colons(self) -> int:
        """One colon per key (constraint objects included)."""
        cols = self.columns()
        extra = sum(_colons(v) for k in ("start_no_earlier", "finish_no_later") for v in cols[k] if v is not None)
        return len(ACTIVITY_KEYS) * len(self) + extra

    def text_colons(self) -> int:
        """Colons inside the text values (constraint objects hold none that count here:
        :func:`_colons` counted theirs with their keys)."""
        cols = self.columns()
        return sum(_text_colons(cols[k]) for k in ("id", "name", "group", "notes", "distribution"))

    def columns(self) -> dict[str, list]:
        if not hasattr(self, "_columns"):
            self._columns = {k: list(map(attrgetter(k), self)) for k in ACTIVITY_KEYS}
        return self._columns

    def plain(self) -> np.ndarray:
        """Per row: True when the bulk checks vouch for it (the common, unconstrained entry)."""
        c = self.columns()
        ok = plain_numbers(*(np.array(c[k], dtype=float) for k in ("optimistic", "most_likely", "pessimistic", "duration")))
        ok &= np.fromiter(map(_plain_id, c["id"]), bool, len(self)) if _BAD_ID.search("\x00".join(c["id"])) \
            else _id_lengths_ok(c["id"])
        for key in ("start_no_earlier", "finish_no_later"):
            if c[key].count(None) != len(self):
                ok &= np.fromiter(map(_is_none, c[key]), bool, len(self))
        if not set(c["distribution"]) <= _DISTRIBUTIONS:
            ok &= np.fromiter((x in _DISTRIBUTIONS for x in c["distribution"]), bool, len(self))
        return ok

    def build(self, careful) -> list[Activity]:
        """The activities in file order; a row the bulk checks doubt is read by ``careful``
        (``activity_from_dict``), which raises the exact message for a bad one."""
        if not self:
            return []
        c = self.columns()
        acts = list(map(Activity, *(c[k] for k in ACTIVITY_KEYS[:9])))
        for i in np.flatnonzero(~self.plain()).tolist():
            acts[i] = careful(msgspec.structs.asdict(self[i]), i + 1)
        return acts


_DISTRIBUTIONS = frozenset(DISTRIBUTIONS) | {None}


def plain_numbers(a: np.ndarray, m: np.ndarray, b: np.ndarray, d: np.ndarray) -> np.ndarray:
    """Per activity (NaN for a missing value): an ordered three-point estimate within range,
    or none and a duration; any duration within range. What ``Activity`` accepts outright."""
    with np.errstate(invalid="ignore"):
        three = (0 <= a) & (a <= m) & (m <= b) & (b <= MAX_UNITS)
        none = np.isnan(a) & np.isnan(m) & np.isnan(b)
        fixed = np.isnan(d) | ((0 <= d) & (d <= MAX_UNITS))
    return (three | (none & ~np.isnan(d))) & fixed


def _is_none(value) -> bool:
    return value is None


def _plain_id(act_id: str) -> bool:
    return 0 < len(act_id) <= MAX_ID_LENGTH and not _BAD_ID.search(act_id)


def _id_lengths_ok(ids) -> np.ndarray:
    lengths = np.fromiter(map(len, ids), np.int64, len(ids))
    return (lengths > 0) & (lengths <= MAX_ID_LENGTH)


class LinkRows(list):
    """The ``links`` list as decoded rows; ``build`` makes the records."""

    def columns(self) -> dict[str, list]:
        if not hasattr(self, "_columns"):
            self._columns = {k: list(map(attrgetter(k), self)) for k in LINK_KEYS}
        return self._columns

    def key_colons(self) -> int:
        return len(LINK_KEYS) * len(self)

    def text_colons(self) -> int:
        c = self.columns()
        return sum(_text_colons(c[k]) for k in ("pred", "succ", "type"))

    def plain(self) -> np.ndarray:
        c = self.columns()
        n = len(self)
        lag = np.array(c["lag"], dtype=float)
        ok = np.abs(lag) <= MAX_UNITS
        if any(map(str.__eq__, c["pred"], c["succ"])):
            ok &= np.fromiter(map(str.__ne__, c["pred"], c["succ"]), bool, n)
        if "" in c["pred"] or "" in c["succ"]:
            ok &= np.fromiter(map(bool, c["pred"]), bool, n) & np.fromiter(map(bool, c["succ"]), bool, n)
        if not set(c["type"]) <= _LINK_TYPES:
            ok &= np.fromiter((t in _LINK_TYPES for t in c["type"]), bool, n)
        return ok

    def build(self, careful) -> list[Link]:
        """The links in file order; doubtful rows go through ``careful`` (``link_from_dict``)."""
        if not self:
            return []
        c = self.columns()
        links = list(map(Link, c["pred"], c["succ"], c["type"], c["lag"]))
        for i in np.flatnonzero(~self.plain()).tolist():
            links[i] = careful(msgspec.structs.asdict(self[i]), i + 1)
        return links


_LINK_TYPES = frozenset(LINK_TYPES)
_ROW_LISTS = {"activities": ActivityRows, "links": LinkRows}


def bulk_plan_data(raw: bytes, version: int) -> dict | None:
    """Plan file data with the activity and link lists as typed rows, or None when the
    careful reader should read this file (not the current ``version``, a missing or extra
    field in a row, a field given twice, text that is not valid JSON, ...)."""
    if b"\\u003a" in raw or b"\\u003A" in raw:     # an escaped colon would upset the count
        return None
    try:
        parts = _TOP.decode(raw)
        data, colons = {}, len(parts)
        for key, part in parts.items():
            if key in _ROW_LISTS:
                data[key] = _ROW_LISTS[key](_ROWS[key].decode(part))
                colons += data[key].key_colons()
            else:
                data[key] = _small(part)
                colons += _colons(data[key])
    except (msgspec.DecodeError, msgspec.ValidationError, ValueError, RecursionError):
        return None
    if data.get("version") != version or type(data.get("version")) is not int:
        return None
    found = raw.count(b":")
    if found != colons:     # colons in the activity and link texts, counted only when there are some
        colons += sum(data[key].text_colons() for key in _ROW_LISTS if key in data)
    return data if found == colons else None
