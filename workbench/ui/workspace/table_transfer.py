"""CSV/XLSX in and out of the window: import through a preview (one undo step or
nothing at all), export of the activities with their computed schedule."""

from __future__ import annotations

from pathlib import Path

from workbench.core.commands import ReplacePlan
from workbench.core.errors import PlanError
from workbench.core.model import Plan
from workbench.ui import prompts
from workbench.ui.workspace import import_dialog
from workbench.ui.session import Session


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


def import_table(widget, session: Session, path: str) -> bool:
    """Preview the table; on acceptance replace the plan's content as one undo step."""
    plan, problems = read_for_preview(session, path)
    if not import_dialog.preview_import(widget, path, plan, problems) or plan is None:
        return False
    return session.push(ReplacePlan(_keep_extras(session.plan, plan), text=f"Import {Path(path).name}"))


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
    path = prompts.ask_save_path(widget, "Export activities", f"{session.plan.settings.title}.csv",
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
