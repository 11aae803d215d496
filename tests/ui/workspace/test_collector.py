"""Reference cycles holding Qt widgets are freed on the window thread, never on a worker
thread that happens to allocate when Python's collector would start."""

import gc
import threading

from PySide6.QtCore import Qt
from PySide6.QtWidgets import QWidget

from workbench.ui.collector import WindowThreadCollector, collect_due
from workbench.ui.workspace.app import application


class Panel(QWidget):
    """Like every widget of ours, a Python subclass."""


def widget_in_a_cycle(record: list) -> None:
    w = Panel()
    w.itself = w                     # only the cycle collector can free it
    w.destroyed.connect(lambda *_: record.append(threading.current_thread().name),
                        Qt.ConnectionType.DirectConnection)


HELD: list = []


def busy_worker() -> None:
    """Makes many new containers and keeps them (as a simulation's results are kept), far
    past every collection threshold."""
    HELD.append([[i] for i in range(50 * gc.get_threshold()[0])])


def test_the_application_turns_automatic_collection_off(qapp):
    app = application([])
    assert app.findChild(WindowThreadCollector) is not None
    assert not gc.isenabled()


def test_a_cycle_is_freed_on_the_window_thread_not_the_busy_worker(qapp, qtbot):
    application([])
    record: list[str] = []
    widget_in_a_cycle(record)
    worker = threading.Thread(target=busy_worker, name="busy worker")
    worker.start()
    worker.join()
    assert record == []                                      # the worker collected nothing
    qtbot.waitUntil(lambda: record != [], timeout=5000)      # the window thread's timer did
    assert record == [threading.main_thread().name]
    HELD.clear()


def test_collect_due_follows_pythons_thresholds(qapp):
    application([])                                          # automatic collection off
    gc.collect()
    assert collect_due() is None                             # nothing due right after a collection
    junk = [[i] for i in range(gc.get_threshold()[0] * 2)]   # past the youngest generation's threshold
    assert gc.get_count()[0] > gc.get_threshold()[0]
    assert collect_due() is not None
    assert gc.get_count()[0] < gc.get_threshold()[0]
    del junk


def test_without_the_collector_the_worker_would_have_freed_it(qapp):
    """The hazard itself, shown with Python's automatic collection back on for a moment: the
    worker is already waiting, so the window thread allocates almost nothing meanwhile."""
    record: list[str] = []
    go = threading.Event()
    worker = threading.Thread(target=lambda: (go.wait(), busy_worker()), name="busy worker")
    worker.start()
    gc.collect()                     # counts back to zero: the next collection is the worker's
    widget_in_a_cycle(record)
    gc.enable()
    try:
        go.set()
        worker.join()
    finally:
        gc.disable()
    HELD.clear()
    assert record == ["busy worker"]
