"""Python's cycle collector, run on the window thread only.

Python collects reference cycles in whichever thread happens to allocate when a threshold
is crossed. A window's widgets often sit in such cycles (a view and the slots that point
back at it), so a collection that starts on a worker thread (a simulation, the autosave,
a Checkup replay) would destroy Qt widgets off the window thread. Qt does not allow that:
it can crash or hang the program. So while the window runs, automatic collection is off
and a timer on the window thread collects whenever the automatic collector would have
(the same per-generation counts and thresholds), and once more when the window closes.
"""

from __future__ import annotations

import gc

from PySide6.QtCore import QObject, QTimer

INTERVAL_MS = 250


def collect_due() -> int | None:
    """Collect the oldest generation whose count passed its threshold (as Python's own
    collector would); the number of objects found unreachable, or None when none is due."""
    counts, limits = gc.get_count(), gc.get_threshold()
    for generation in (2, 1, 0):
        if limits[generation] and counts[generation] > limits[generation]:
            return gc.collect(generation)
    return None


class WindowThreadCollector(QObject):
    """Turns automatic collection off and collects from a timer on this (the window) thread."""

    def __init__(self, parent: QObject | None = None, interval_ms: int = INTERVAL_MS):
        super().__init__(parent)
        self._was_enabled = gc.isenabled()
        gc.disable()
        self._timer = QTimer(self)
        self._timer.setInterval(interval_ms)
        self._timer.timeout.connect(collect_due)
        self._timer.start()

    def stop(self) -> None:
        """Collect everything now and give collection back to Python."""
        self._timer.stop()
        gc.collect()
        if self._was_enabled:
            gc.enable()


def collect_on_window_thread(app) -> WindowThreadCollector:
    """Install the collector once per application (kept as a child of ``app``)."""
    existing = app.findChild(WindowThreadCollector)
    return existing if existing is not None else WindowThreadCollector(app)
