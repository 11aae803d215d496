"""Writing a plan file's activity and link lines fast, byte for byte as the plain writer.

The plain writer (``planfile._layout``) turns each activity and link into a dict and each
dict into one line with ``json.dumps``. Here the lines come from columns instead: every
text value through the same C string encoder ``json.dumps`` uses, every number through
``float.__repr__`` (which is how ``json.dumps`` writes a float), put into a fixed line
pattern. An entry the pattern does not cover (a constraint, a value of an unexpected
type) is written by ``json.dumps`` as before. If the plan file layout gains an activity
or link field this module does not know, it steps aside (``fast_dumps`` returns None)
and the plain writer writes everything, so a new field can never be dropped.
"""

from __future__ import annotations

import json
from json.encoder import encode_basestring
from operator import attrgetter

from workbench.core.model import Activity, Link

from .plan_codec import OPTIONAL_ACTIVITY_FIELDS, activity_to_dict, plan_to_dict

ACTIVITY_LINE = ('{"id": %s, "name": %s, "group": %s, "notes": %s, "optimistic": %s, "most_likely": %s, '
                 '"pessimistic": %s, "duration": %s, "distribution": %s, "start_no_earlier": null, '
                 '"finish_no_later": null}')
LINK_LINE = '{"pred": %s, "succ": %s, "type": %s, "lag": %s}'
_TEXT = ("id", "name", "group", "notes")
_NUMBERS = ("optimistic", "most_likely", "pessimistic", "duration")
_BAD_FLOATS = frozenset(("nan", "inf", "-inf"))


def _entry(data: dict) -> str:
    return json.dumps(data, ensure_ascii=False, allow_nan=False, separators=(", ", ": "))


def _sample_plan():
    """A small plan using every activity and link field (and a constraint)."""
    import datetime as dt

    from workbench.core.model import Plan, Settings

    acts = [Activity("A", "n \u00e9\"", "g", "x\ny", 1.0, 2.0, 3.5, None, "uniform"),
            Activity("B", duration=4.0, start_no_earlier=2.0)]
    return Plan(Settings(start=dt.date(2027, 1, 4)), acts, [Link("A", "B", "SS", -1.5)])


def _covered(layout) -> bool:
    """Does the line pattern still write exactly what the plain writer writes? (Checked
    once, on a sample plan: a field added to the layout makes this False.)"""
    plan = _sample_plan()
    parts = _fast(plan, layout)
    return parts is not None and "".join(parts) == layout(plan_to_dict(plan)) + "\n"


def _texts(values) -> list[str] | None:
    if not set(map(type, values)) <= {str}:
        return None
    return list(map(encode_basestring, values))


def _numbers(values, optional: bool) -> list[str] | None:
    kinds = set(map(type, values))
    if not kinds <= ({float, int, type(None)} if optional else {float, int}):
        return None
    if kinds == {float}:
        out = list(map(float.__repr__, values))
    else:
        out = ["null" if v is None else float.__repr__(float(v)) for v in values]
    return None if _BAD_FLOATS.intersection(out) else out


def activity_lines(acts) -> list[str] | None:
    """One line per activity, or None when some value is of a type the pattern does not
    write (the plain writer then writes, or refuses, everything as before)."""
    cols = [_texts(list(map(attrgetter(k), acts))) for k in _TEXT]
    cols += [_numbers(list(map(attrgetter(k), acts)), True) for k in _NUMBERS]
    dist = list(map(attrgetter("distribution"), acts))
    cols.append(None if not set(map(type, dist)) <= {str, type(None)}
                else ["null" if d is None else encode_basestring(d) for d in dist])
    if any(c is None for c in cols):
        return None
    lines = [ACTIVITY_LINE % row for row in zip(*cols)]
    for key in ("start_no_earlier", "finish_no_later"):
        values = list(map(attrgetter(key), acts))
        if values.count(None) != len(values):
            for i in (i for i, v in enumerate(values) if v is not None):
                lines[i] = _entry(activity_to_dict(acts[i]))
    for key in OPTIONAL_ACTIVITY_FIELDS:          # written only when set: the plain entry writes them
        for i, value in enumerate(map(attrgetter(key), acts)):
            if value:
                lines[i] = _entry(activity_to_dict(acts[i]))
    return lines


def link_lines(links: list[Link]) -> list[str] | None:
    cols = [_texts(list(map(attrgetter(k), links))) for k in ("pred", "succ", "type")]
    cols.append(_numbers(list(map(attrgetter("lag"), links)), False))
    if any(c is None for c in cols):
        return None
    return [LINK_LINE % row for row in zip(*cols)]


SLICE = 2000   # lines joined at a time: no single step holds Python's lock for long


def _block(pieces: list[str]) -> list[str]:
    """A list at depth 1 as the plain writer lays it out (one entry per line), from its
    entries joined :data:`SLICE` lines at a time."""
    if not pieces:
        return ["[]"]
    parts = ["[\n  "]
    for k, piece in enumerate(pieces):
        parts += [",\n  ", piece] if k else [piece]
    return parts + ["\n ]"]


def _sliced(make, items) -> list[str] | None:
    """``make(items)`` a slice at a time (each step over the columns stays short), each
    slice's lines joined at once: no list of every line is ever held."""
    pieces: list[str] = []
    for start in range(0, len(items), SLICE):
        part = make(items[start:start + SLICE])
        if part is None:
            return None
        pieces.append(",\n  ".join(part))
    return pieces


def fast_dumps(plan, layout) -> str | None:
    """The plan file text, the same as ``layout(plan_to_dict(plan)) + "\\n"``; None when
    this writer cannot vouch for that (the caller then uses the plain writer)."""
    parts = fast_parts(plan, layout)
    return None if parts is None else "".join(parts)


def fast_parts(plan, layout) -> list[str] | None:
    """:func:`fast_dumps` as a list of pieces (none larger than :data:`SLICE` lines), for
    a writer that must not hold Python's lock long (the autosave's worker thread)."""
    if layout not in _COVERED:
        _COVERED[layout] = _covered(layout)
    return _fast(plan, layout) if _COVERED[layout] else None


def _fast(plan, layout) -> list[str] | None:
    acts, links = _sliced(activity_lines, plan.activities), _sliced(link_lines, plan.links)
    if acts is None or links is None:
        return None
    data = plan_to_dict(plan, rows=False)
    blocks = {"activities": _block(acts), "links": _block(links)}
    parts = ["{\n"]
    for n, (key, value) in enumerate(data.items()):
        parts.append((",\n" if n else "") + f" {json.dumps(key, ensure_ascii=False)}: ")
        parts += blocks[key] if key in blocks else [layout(value, 1)]
    return parts + ["\n}\n"]


_COVERED: dict = {}
