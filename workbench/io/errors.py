"""Errors raised while reading or writing files. Both are :class:`PlanError` subclasses,
so a caller that handles plan problems handles file problems the same way."""

from __future__ import annotations

from workbench.core.errors import PlanError


class PlanFileError(PlanError):
    """A ``.slw`` plan file cannot be read or written. The message names the file and,
    where it applies, the activity and field."""


class TableImportError(PlanError):
    """A CSV/XLSX import failed; nothing was imported. ``problems`` lists every bad row or
    cell, each naming the row number as a spreadsheet shows it, the activity and the column."""

    def __init__(self, problems: list[str], source: str = ""):
        self.problems = list(problems)
        self.source = source
        head = f"{source}: " if source else ""
        shown = "\n".join(f"  - {p}" for p in self.problems[:20])
        more = f"\n  … and {len(self.problems) - 20} more" if len(self.problems) > 20 else ""
        count = len(self.problems)
        summary = f"{head}nothing imported, {count} problem{'s' if count != 1 else ''}:\n{shown}{more}"
        super().__init__(summary, self.problems[0] if self.problems else None)
