"""The window tests' fixtures: temporary settings and data folder, dialogs that answer at once, a window;
and Python's cycle collector on the window thread only, as in the app (workbench/ui/collector.py)."""

import pytest

from support.ui import ui_env, window  # noqa: F401 (fixtures)
from workbench.ui.collector import collect_due, collect_on_window_thread


@pytest.fixture(autouse=True, scope="session")
def _collector_on_the_window_thread(qapp):
    """A widget left in a reference cycle by one test must never be destroyed by a worker
    thread of a later one (Qt can hang or crash then): collect on this thread only."""
    collector = collect_on_window_thread(qapp)
    yield
    collector.stop()


@pytest.fixture(autouse=True)
def _collect_after_each_test(_collector_on_the_window_thread):
    yield
    collect_due()
