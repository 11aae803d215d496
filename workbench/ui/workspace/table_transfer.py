"""CSV/XLSX in and out of the window: import through a preview (one undo step or
nothing at all), export of the activities with their computed schedule."""

from __future__ import annotations

import datetime as dt
from pathlib import Path

from workbench.core.commands import ReplacePlan
from workbench.core.errors import PlanError
from workbench.core.date_text import show_date
from workbench.core.model import Plan, Settings
from workbench.ui import prompts
from workbench.ui.workspace import import_dialog
from workbench.ui.session import Session

WEEKDAYS = ("Mon", "Tue", "Wed", "Thu", "Fri", "Sat", "Sun")


def read_for_preview(session: Session, path: str):
    """(plan, problems): the table as a plan, or None and every problem found."""
    try:
        from workbench.io.tabular import read_table
    except ImportError:
        return None, ["table import is not available in this installation"]
    try:
        return read_table(path, settings=session.plan.settings), []
    except PlanError as exc:
        return None, list(getattr(exc, "problems", None) or [str(exc)])
    except OSError as exc:
        return None, [f"{path}: {exc.strerror or exc}"]


def import_table(widget, session: Session, path: str, start_new=None) -> bool:
    """Preview the table; then either start a new plan from it (``start_new(plan)``, which
    asks about unsaved changes) or replace the open plan's activities, keeping its settings,
    as one undo step."""
    plan, problems = read_for_preview(session, path)
    choice = import_dialog.preview_import(widget, path, plan, problems, kept_settings(session.plan))
    if not choice or plan is None:
        return False
    if choice == import_dialog.NEW and start_new is not None:
        done = start_new(Plan(Settings(title=Path(path).stem), plan.activities, plan.links))
    else:
        done = session.push(ReplacePlan(_keep_extras(session.plan, plan), text=f"Import {Path(path).name}"))
    if done:
        tell_long_texts(widget, plan, Path(path).name)
    return done


def tell_long_texts(widget, plan: Plan, name: str) -> None:
    """Say which texts run over the entry limits (kept whole, never refused)."""
    from workbench.core.long_texts import describe, long_texts
    note = describe(long_texts(plan), gap="\n")
    if note:
        prompts.show_info(widget, "Long texts kept", f"{name}: {note}")


def kept_settings(plan: Plan) -> str:
    """What of the open plan an import that keeps its settings keeps, said in full."""
    s = plan.settings
    cal = s.calendar
    deadline = "none" if s.deadline is None else _when(plan, s.deadline)
    parts = [f"title “{s.title}”", f"start {show_date(s.start)}", f"deadline {deadline}",
             f"working week {', '.join(WEEKDAYS[d] for d in cal.workdays)}",
             f"{len(cal.holidays)} holiday{'s' if len(cal.holidays) != 1 else ''}"]
    if plan.risks:
        parts.append(f"{len(plan.risks)} risk event(s) naming imported activities")
    return "; ".join(parts)


def _when(plan: Plan, deadline) -> str:
    if isinstance(deadline, dt.date):
        return show_date(deadline)
    from workbench.core.calendar import WorkCalendar
    return show_date(WorkCalendar(plan.settings).finish_date(float(deadline)))


def _keep_extras(old: Plan, new: Plan) -> Plan:
    """The imported activities and links with the open plan's settings, and its risks and
    correlation groups where every activity they name is still there."""
    ids = set(new.ids())
    risks = [r for r in old.risks if set(r.activities) <= ids]
    groups = [g for g in old.correlations if set(g.activities) <= ids]
    return Plan(old.settings, new.activities, new.links, risks, groups)


def export_table(widget, session: Session) -> bool:
    if session.analysis is None:
        prompts.show_error(widget, "Export", f"The plan cannot be scheduled, so there is nothing to export: "
                                             f"{session.analysis_error}")
        return False
    path = prompts.ask_save_path(widget, "Export activities", session.in_folder(f"{session.plan.settings.title}.csv"),
                                 prompts.EXPORT_FILTER)
    if not path:
        return False
    if Path(path).suffix.lower() not in (".csv", ".xlsx"):
        path += ".csv"
    try:
        from workbench.io.tabular import export_table as write
        write(session.analysis, path)
    except (PlanError, OSError, ImportError) as exc:
        prompts.show_error(widget, "Export", f"{path}: {getattr(exc, 'strerror', None) or exc}")
        return False
    return True
