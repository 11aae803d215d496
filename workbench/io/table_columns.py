"""Import columns: which header names mean which activity field.

Headers are matched case-insensitively after trimming, with ``_``, ``-``, ``.`` and runs
of spaces treated alike (``Most_Likely`` = ``most likely``). Columns nobody knows are
ignored (an export's computed columns, a planner's own remarks).
"""

from __future__ import annotations

import re
from dataclasses import dataclass, field

FIELDS = ("id", "name", "optimistic", "most_likely", "pessimistic", "duration", "predecessors",
          "group", "notes", "distribution", "start_no_earlier", "finish_no_later", "resources",
          "actual_start", "actual_finish", "remaining_optimistic", "remaining_most_likely",
          "remaining_pessimistic", "remaining", "percent_complete",
          "cost", "crash_cost", "crash_optimistic", "crash_most_likely", "crash_pessimistic", "crash_duration")

ALIASES: dict[str, tuple[str, ...]] = {
    "id": ("id", "activity", "activity id", "code", "key", "ref"),
    "name": ("name", "activity name", "title", "description", "label"),
    "optimistic": ("optimistic", "a", "min", "minimum", "opt", "best", "best case"),
    "most_likely": ("most likely", "m", "likely", "ml", "mode", "typical"),
    "pessimistic": ("pessimistic", "b", "max", "maximum", "pess", "worst", "worst case"),
    "duration": ("duration", "dur", "fixed duration", "length"),
    "predecessors": ("predecessors", "predecessor", "preds", "pred", "depends on", "after", "follows"),
    "group": ("group", "phase", "stage", "workstream"),
    "notes": ("notes", "note", "comment", "comments", "remarks"),
    "distribution": ("distribution", "dist", "shape"),
    "start_no_earlier": ("start no earlier", "start not before", "not before"),
    "finish_no_later": ("finish no later", "finish not after", "not after"),
    "resources": ("resources", "resource needs", "needs", "crews"),
    "actual_start": ("actual start", "started on", "actually started"),
    "actual_finish": ("actual finish", "finished on", "actually finished"),
    "remaining_optimistic": ("remaining optimistic", "remaining a", "optimistic remaining"),
    "remaining_most_likely": ("remaining most likely", "remaining m", "most likely remaining"),
    "remaining_pessimistic": ("remaining pessimistic", "remaining b", "pessimistic remaining"),
    "remaining": ("remaining", "remaining duration", "still to do", "days left"),
    "percent_complete": ("percent complete", "% complete", "pct complete", "percent done", "% done"),
    "cost": ("cost", "normal cost", "direct cost"),
    "crash_cost": ("crash cost",),
    "crash_optimistic": ("crash optimistic",),
    "crash_most_likely": ("crash most likely",),
    "crash_pessimistic": ("crash pessimistic",),
    "crash_duration": ("crash duration",),
}

LOOKUP = {alias: name for name, aliases in ALIASES.items() for alias in aliases}
_SEPARATORS = re.compile(r"[\s_\-.]+")


def normalise(header: str) -> str:
    return _SEPARATORS.sub(" ", str(header).strip().lower()).strip()


def column_letter(index: int) -> str:
    """Spreadsheet letters for a 0-based column index: 0 → A, 26 → AA."""
    letters = ""
    index += 1
    while index:
        index, rem = divmod(index - 1, 26)
        letters = chr(65 + rem) + letters
    return letters


@dataclass
class Columns:
    """Where each known field sits in a header row, and what the file calls it."""

    index: dict[str, int] = field(default_factory=dict)
    label: dict[str, str] = field(default_factory=dict)
    ignored: list[str] = field(default_factory=list)
    problems: list[str] = field(default_factory=list)
    width: int = 0  # cells up to the last non-blank header

    def where(self, name: str) -> str:
        """``column D 'pess'`` for messages."""
        return f"column {column_letter(self.index[name])} '{self.label[name]}'"

    def has(self, name: str) -> bool:
        return name in self.index


def map_header(cells: list[str], header_row: int = 1) -> Columns:
    cols = Columns()
    cols.width = max((i + 1 for i, c in enumerate(cells) if str(c).strip()), default=0)
    for i, raw in enumerate(cells):
        text = str(raw).strip()
        if not text:
            continue
        name = LOOKUP.get(normalise(text))
        if name is None:
            cols.ignored.append(text)
        elif name in cols.index:
            cols.problems.append(f"row {header_row}: columns '{cols.label[name]}' and '{text}' both mean "
                                 f"{name.replace('_', ' ')}; keep one of them")
        else:
            cols.index[name], cols.label[name] = i, text
    _check_required(cols, cells, header_row)
    return cols


def _check_required(cols: Columns, cells: list[str], header_row: int) -> None:
    shown = ", ".join(f"'{str(c).strip()}'" for c in cells if str(c).strip()) or "nothing"
    if not cols.has("id"):
        cols.problems.append(f"row {header_row}: no id column (the header row has {shown}); "
                             f"name one column {' or '.join(repr(a) for a in ALIASES['id'][:3])}")
    three = [cols.has(n) for n in ("optimistic", "most_likely", "pessimistic")]
    if any(three) and not all(three):
        missing = [n.replace("_", " ") for n, ok in zip(("optimistic", "most_likely", "pessimistic"), three) if not ok]
        cols.problems.append(f"row {header_row}: a three-point estimate needs a {' and a '.join(missing)} column too")
    elif not any(three) and not cols.has("duration"):
        cols.problems.append(f"row {header_row}: no duration or estimate columns (the header row has {shown}); "
                             "add 'duration', or 'optimistic', 'most likely' and 'pessimistic'")
