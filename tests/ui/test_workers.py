"""Background work by one rule (workbench/ui/workers.py): plain data in, results back on the
window's thread through the long-lived hub, bounded waits, nothing Qt released on a worker."""

import gc
import threading

import pytest
from PySide6.QtCore import QObject

from workbench.ui import workers


def on_main_thread() -> bool:
    return threading.current_thread() is threading.main_thread()


class Receiver(QObject):
    def __init__(self):
        super().__init__()
        self.got, self.failed, self.steps = [], [], []

    def take(self, result):
        self.got.append((result, on_main_thread()))

    def fail(self, exc):
        self.failed.append(str(exc))

    def step(self, done, total):
        self.steps.append((done, total))


def gated(release: threading.Event, entered: threading.Event, result="late result"):
    """Work that waits for the test (ignoring any stop), then returns ``result``."""
    def work(*args, **kwargs):
        entered.set()
        release.wait(30)
        return result
    return work


def counting(n, progress):
    for i in range(n):
        progress(i + 1, n)
    return n * 2


def test_the_result_and_progress_arrive_on_the_window_thread(qtbot):
    receiver = Receiver()
    job = workers.start(counting, 3, on_done=receiver.take, on_progress=receiver.step)
    qtbot.waitUntil(lambda: bool(receiver.got), timeout=10_000)
    assert receiver.got == [(6, True)]
    assert receiver.steps == [(1, 3), (2, 3), (3, 3)]
    assert job.wait(5) and not job.running


def test_a_failure_arrives_as_the_exception(qtbot):
    receiver = Receiver()
    workers.start(int, "twelve", on_done=receiver.take, on_failed=receiver.fail)
    qtbot.waitUntil(lambda: bool(receiver.failed), timeout=10_000)
    assert "twelve" in receiver.failed[0] and receiver.got == []


@pytest.mark.parametrize("bad", [lambda r: (r,), lambda r: ([1, r],), lambda r: ({"x": r},),
                                 lambda r: (r.take,)])
def test_work_that_would_hold_a_qt_object_is_refused(bad):
    receiver = Receiver()
    with pytest.raises(TypeError, match="plain data only"):
        workers.start(print, *bad(receiver))
    with pytest.raises(TypeError, match="plain data only"):
        workers.start(receiver.take, 1)


def test_a_receiver_dropped_while_the_work_runs_dies_on_the_window_thread_and_gets_nothing(qtbot):
    release, entered = threading.Event(), threading.Event()
    receiver, died = Receiver(), []
    receiver.destroyed.connect(lambda *_: died.append(on_main_thread()))
    job = workers.start(gated(release, entered), on_done=receiver.take)
    assert entered.wait(10)
    del receiver
    gc.collect()
    assert died == [True]            # the worker held no reference: it went here and now
    release.set()
    assert job.wait(10)
    qtbot.wait(20)                   # the hub's queued delivery finds nobody to give it to
    assert died == [True]


def test_an_abandoned_job_delivers_nothing_and_its_wait_is_bounded(qtbot):
    release, entered = threading.Event(), threading.Event()
    receiver = Receiver()
    job = workers.start(gated(release, entered), on_done=receiver.take, cancellable=True)
    assert entered.wait(10)
    job.abandon()
    assert job.stopping
    assert not job.wait(0.05)        # the work ignores the stop: the wait still returns
    release.set()
    assert job.wait(10)
    qtbot.wait(20)
    assert receiver.got == []


def test_closing_a_window_abandons_the_jobs_of_what_it_holds(qtbot):
    from PySide6.QtWidgets import QWidget
    release, entered = threading.Event(), threading.Event()
    outer, inner = QWidget(), Receiver()
    qtbot.addWidget(outer)
    inner.setParent(outer)
    job = workers.start(gated(release, entered), on_done=inner.take, cancellable=True)
    assert workers.abandon_within(outer) == 1 and job.stopping
    release.set()
    assert job.wait(10)
    qtbot.wait(20)
    assert inner.got == []


def test_a_live_plan_is_refused_but_its_snapshot_is_plain(qtbot):
    from support.ui import sample_plan
    from workbench.ui.session import Session
    session, receiver = Session(sample_plan()), Receiver()
    session.plan.subscribe(receiver.step)           # as the Activities table does
    with pytest.raises(TypeError, match="with listeners"):
        workers.start(len, session.plan.activities, session.plan)
    job = workers.start(len, session.plan.snapshot().activities, on_done=receiver.take)
    assert job.wait(10)
    qtbot.waitUntil(lambda: bool(receiver.got), timeout=10_000)
    assert receiver.got == [(len(session.plan.activities), True)]
