"""The Slackline window: the Activities table in the middle, a summary strip above it,
views in docks around it, menus, a status bar; files through the FileController."""

from __future__ import annotations

import importlib
from functools import partial
from pathlib import Path

from PySide6.QtCore import QByteArray, QSettings, Qt
from PySide6.QtGui import QCloseEvent
from PySide6.QtWidgets import QDockWidget, QLabel, QMainWindow, QUndoView, QVBoxLayout, QWidget

from workbench.core.model import Plan
from workbench.ui.activities.panel import ActivitiesPanel
from workbench.ui.workspace.after_paint import AfterFirstPaint
from workbench.ui.workspace.files import TABLE_SUFFIXES, FileController
from workbench.ui import prompts, workers
from workbench.ui.icons import icon
from workbench.ui.workspace.notice_bar import NoticeBar
from workbench.ui.workspace.recovery import RecoveryStore
from workbench.ui.session import Session, WhenShown
from workbench.ui.workspace.screen_fit import first_size, keep_on_screen, scroller
from workbench.ui.workspace.summary_strip import SummaryStrip
from workbench.ui.workspace.menus import build_menus
from workbench.ui.workspace import activity_menu

# (dock title, module, class, what the placeholder promises)
VIEWS = (
    ("Timeline", "workbench.ui.timeline.view", "TimelineView",
     "The Timeline will appear here: a Gantt chart of the schedule with float drawn as slack lines."),
    ("Network", "workbench.ui.network.view", "NetworkView",
     "The Network will appear here: the activity-on-node diagram with the critical path marked."),
    ("Odds", "workbench.ui.odds.view", "OddsView",
     "The Odds view will appear here: the chance of finishing by any date."),
    ("Drivers", "workbench.ui.drivers.view", "DriversView",
     "The Drivers view will appear here: which activities drive the finish date."),
    ("Trade-off", "workbench.ui.tradeoff.view", "TradeoffView",
     "The Trade-off view will appear here: what it costs to buy time."),
    ("Checkup", "workbench.ui.checkup.view", "CheckupView",
     "The Checkup will appear here: is this schedule sound enough to sign?"),
    ("Resources", "workbench.ui.resources.view", "ResourcesView",
     "The Resources view will appear here: loading, levelling and the odds with the crews."),
)
STATE_VERSION = 1


def make_view(module: str, cls: str, session: Session, parent=None) -> QWidget | None:
    """The view, its module imported on first use (a view's import error is a bug: it is raised)."""
    view_class = getattr(importlib.import_module(module), cls)
    return view_class(session, parent)


def placeholder(text: str, parent=None) -> QLabel:
    label = QLabel(text, parent)
    label.setWordWrap(True)
    label.setAlignment(Qt.AlignmentFlag.AlignCenter)
    label.setMargin(24)
    label.setAccessibleName("View not available yet")
    return label


class MainWindow(QMainWindow):
    """One window, one session. ``views`` maps a dock title to its widget."""

    def __init__(self, session: Session | None = None, store: RecoveryStore | None = None, parent=None):
        super().__init__(parent)
        self.session = session or Session(Plan())
        if self.session.parent() is None:
            self.session.setParent(self)
        self.files = FileController(self.session, self, store)
        self.setWindowIcon(icon("app"))
        self.setAcceptDrops(True)
        self.setDockOptions(QMainWindow.DockOption.AnimatedDocks | QMainWindow.DockOption.AllowTabbedDocks
                            | QMainWindow.DockOption.AllowNestedDocks)
        self._build_centre()
        self.docks: dict[str, QDockWidget] = {}
        self._slots: dict[str, QWidget] = {}       # dock content holders, filled on demand
        self._built: dict[str, QWidget] = {}
        self._watching = False
        self._build_docks()
        self._build_status()
        self.menu_actions = build_menus(self)
        self._connect()
        self.restore_layout()
        self.update_title()

    # --- building ------------------------------------------------------------
    def _build_centre(self) -> None:
        centre = QWidget(self)
        layout = QVBoxLayout(centre)
        layout.setContentsMargins(0, 0, 0, 0)
        layout.setSpacing(2)
        self.summary = SummaryStrip(self.session, centre)
        self.summary.checkup.clicked.connect(self.show_checkup)
        self.notice = NoticeBar(centre)
        self.activities = ActivitiesPanel(self.session, centre)
        layout.addWidget(self.summary)
        layout.addWidget(self.notice)
        layout.addWidget(self.activities, 1)
        self.setCentralWidget(centre)

    def show_checkup(self) -> None:
        """Bring the Checkup dock forward (the summary strip's "Checkup: N of M pass")."""
        dock = self.docks["Checkup"]
        dock.show()
        dock.raise_()
        self.view("Checkup")

    def _add_dock(self, title: str, widget: QWidget, area) -> QDockWidget:
        dock = QDockWidget(title, self)
        dock.setObjectName(f"dock_{title.lower()}")
        dock.setWidget(widget)
        dock.setAccessibleName(f"{title} panel")
        self.addDockWidget(area, dock)
        self.docks[title] = dock
        return dock

    def _build_docks(self) -> None:
        """Docks get an empty holder; a view (and the modules it needs) is built the first
        time its dock comes on screen once the window is up: views behind a tab or in a
        closed dock are not built (nor kept up to date) until they are brought forward."""
        for title, *_ in VIEWS:
            holder = QWidget(self)
            holder.setAccessibleName(f"{title} view")
            holder.setFocusPolicy(Qt.FocusPolicy.ClickFocus)   # a click in a chart puts its dock in focus (Ctrl+C)
            QVBoxLayout(holder).setContentsMargins(0, 0, 0, 0)
            self._slots[title] = holder
            self._add_dock(title, scroller(holder, self), Qt.DockWidgetArea.BottomDockWidgetArea)
        self.history = QUndoView(self.session.undo_stack, self)
        self.history.setEmptyLabel("Opened plan")
        self.history.setAccessibleName("Edit history")
        self._add_dock("History", self.history, Qt.DockWidgetArea.BottomDockWidgetArea)
        self._arrange()

    def _arrange(self) -> None:
        """Default layout: Timeline, Network and Resources on the lower left, Odds, Drivers and
        History on the lower right, the table above them."""
        for dock in self.docks.values():
            dock.setFloating(False)
            dock.show()
            self.addDockWidget(Qt.DockWidgetArea.BottomDockWidgetArea, dock)
        self.splitDockWidget(self.docks["Timeline"], self.docks["Odds"], Qt.Orientation.Horizontal)
        self.tabifyDockWidget(self.docks["Timeline"], self.docks["Network"])
        self.tabifyDockWidget(self.docks["Network"], self.docks["Trade-off"])
        self.tabifyDockWidget(self.docks["Network"], self.docks["Resources"])
        self.tabifyDockWidget(self.docks["Odds"], self.docks["Drivers"])
        self.tabifyDockWidget(self.docks["Drivers"], self.docks["Checkup"])
        self.tabifyDockWidget(self.docks["Checkup"], self.docks["History"])
        self.docks["Timeline"].raise_()
        self.docks["Odds"].raise_()
        self._default_sizes()

    def _default_sizes(self) -> None:
        """Give the table most of the width and the Timeline the lower part of the window
        (at most the size of the screen)."""
        first_size(self)
        self.resizeDocks([self.docks["Timeline"], self.docks["Odds"]],
                         [int(self.width() * 0.58), int(self.width() * 0.42)], Qt.Orientation.Horizontal)
        self.resizeDocks([self.docks["Timeline"]], [int(self.height() * 0.48)], Qt.Orientation.Vertical)

    def view(self, title: str) -> QWidget:
        """The view in the dock ``title`` (built now if it has not been yet)."""
        if title not in self._built:
            module, cls, promise = next(v[1:] for v in VIEWS if v[0] == title)
            holder = self._slots[title]
            widget = make_view(module, cls, self.session, holder) or placeholder(promise, holder)
            self._built[title] = widget
            holder.layout().addWidget(widget)
            activity_menu.attach(self, title, widget)     # right-click on bars and boxes
        return self._built[title]

    def _watch_views(self) -> None:
        for title, holder in self._slots.items():
            if title not in self._built:
                WhenShown(holder).call(partial(self.view, title))

    def showEvent(self, event) -> None:  # noqa: N802 (Qt override)
        super().showEvent(event)
        if not self._watching:   # build the views on screen once the window is up
            self._watching = True
            keep_on_screen(self)  # now that the frame is known, the whole of it on the screen
            AfterFirstPaint(self.activities, self._watch_views)

    def built_views(self) -> dict[str, QWidget]:
        """The views built so far (those whose docks have been on screen, or asked for)."""
        return dict(self._built)

    @property
    def views(self) -> dict[str, QWidget]:
        """Every dock's view by title (builds those not built yet)."""
        return {title: self.view(title) for title, *_ in VIEWS}

    def _build_status(self) -> None:
        bar = self.statusBar()
        self.save_label = QLabel(self)
        self.save_label.setAccessibleName("Save state")
        self.recalc_label = QLabel(self)
        self.recalc_label.setAccessibleName("Recalculation time")
        bar.addPermanentWidget(self.save_label)
        bar.addPermanentWidget(self.recalc_label)

    def _connect(self) -> None:
        stack = self.session.undo_stack
        stack.cleanChanged.connect(self.update_title)
        self.files.path_changed.connect(self.update_title)
        self.files.message.connect(lambda text: self.statusBar().showMessage(text, 5000))
        self.activities.message.connect(lambda text: self.statusBar().showMessage(text, 5000))
        self.session.edit_refused.connect(self.notice.show_problem)
        self.files.saved.connect(self.notice.hide)    # a saved plan has nothing pending
        self.session.schedule_changed.connect(self._on_schedule_changed)
        self._on_schedule_changed()

    # --- state shown -----------------------------------------------------------
    def _on_schedule_changed(self) -> None:
        self.notice.hide()
        ms = self.session.recalc_ms
        problem = "" if self.session.analysis is not None else " — cannot schedule"
        self.recalc_label.setText(f"Recalculated in {ms:.0f} ms{problem}")
        self.update_title()

    def update_title(self, *_) -> None:
        name = self.files.display_name()
        ro = " (read-only)" if self.files.read_only else ""
        self.setWindowTitle(f"{name}[*]{ro} — Slackline")
        modified = self.files.modified
        self.setWindowModified(modified)
        if self.files.path:
            text = "Unsaved changes" if modified else "All changes saved"
        else:
            text = "Not saved to a file yet" if modified or len(self.session.plan) else "New plan"
        self.save_label.setText(text)
        self.save_label.setToolTip(self.files.path or "Use File → Save As to keep this plan")

    # --- layout persistence ------------------------------------------------------
    def save_layout(self) -> None:
        settings = QSettings()
        settings.setValue("window/geometry", self.saveGeometry())
        settings.setValue("window/state", self.saveState(STATE_VERSION))

    def restore_layout(self) -> bool:
        settings = QSettings()
        geometry, state = settings.value("window/geometry"), settings.value("window/state")
        if isinstance(geometry, QByteArray):
            self.restoreGeometry(geometry)
            keep_on_screen(self)
        else:
            first_size(self)
        return isinstance(state, QByteArray) and self.restoreState(state, STATE_VERSION)

    def reset_layout(self) -> None:
        self._arrange()

    # --- files in from outside -------------------------------------------------------
    def open_path(self, path: str) -> bool:
        """Open a file handed over by the command line, a second launch or a drop."""
        self.raise_()
        self.activateWindow()
        return self.files.open_path(path)

    @staticmethod
    def _dropped_paths(event) -> list[str]:
        urls = event.mimeData().urls() if event.mimeData().hasUrls() else []
        paths = [u.toLocalFile() for u in urls if u.isLocalFile()]
        return [p for p in paths if Path(p).suffix.lower() in (".slw",) + TABLE_SUFFIXES]

    def dragEnterEvent(self, event) -> None:
        if self._dropped_paths(event):
            event.acceptProposedAction()
        else:
            event.ignore()

    def dropEvent(self, event) -> None:
        paths = self._dropped_paths(event)
        if paths:
            event.acceptProposedAction()
            self.open_path(paths[0])

    # --- closing -------------------------------------------------------------------
    def closeEvent(self, event: QCloseEvent) -> None:
        try:
            may_close = self.files.maybe_save()
        except Exception as exc:  # noqa: BLE001 - a failed save never closes the window
            prompts.show_error(self, "Not closed", f"The plan could not be saved, so the window stays open: {exc}")
            may_close = False
        if not may_close:
            event.ignore()
            return
        self.save_layout()
        self.files.close()
        workers.abandon_within(self)      # the views' runs stop; what they still report is dropped
        event.accept()
