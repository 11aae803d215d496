"""Background work for the window, all by one rule.

- The work is a plain function given plain data (a copy or snapshot of the plan, numbers,
  paths): never a QObject, a Session or a view, nor a method of one. :func:`start`
  refuses anything else, so a worker can never hold the last reference to a Qt object
  and have it deleted on the wrong thread.
- What it returns (or raises, or reports as progress) comes back through the signal of
  one long-lived object, the hub, made on the window's thread and kept for the life of
  the program. The hub hands it to the receivers on the window's thread; it holds them
  weakly, so a pending job never keeps a view alive, and a receiver that has gone (its
  view closed and deleted) or a job abandoned gets nothing.
- The window's thread never waits on a worker without a bound: :meth:`Job.wait` takes a
  timeout. A window that closes abandons its jobs; a job still running then finishes
  on its own (its threads are daemons) and its result is dropped.
"""

from __future__ import annotations

import functools
import inspect
import itertools
import threading
import time
import weakref
from dataclasses import dataclass, field
from typing import Callable

import shiboken6
from PySide6.QtCore import QObject, Signal, Slot

CLOSE_WAIT_S = 5.0     # how long a closing view waits for its worker to notice the stop


class _Hub(QObject):
    posted = Signal(int, str, object)    # token, "done" | "failed" | "progress", payload

    @Slot(int, str, object)
    def deliver(self, token: int, kind: str, payload) -> None:
        entry = _receivers.get(token)
        if entry is None:
            return                       # abandoned, or already finished
        if kind != "progress":
            del _receivers[token]
        receiver = entry.get(kind)
        if receiver is not None:
            receiver(*payload) if kind == "progress" else receiver(payload)


_hub: _Hub | None = None
_receivers: dict[int, "_Receivers"] = {}
_tokens = itertools.count(1)
_threads: set[threading.Thread] = set()     # started and not yet ended


def _the_hub() -> _Hub:
    global _hub
    if _hub is None or not shiboken6.isValid(_hub):
        _hub = _Hub()                    # on the window's thread (start() runs there)
        _hub.posted.connect(_hub.deliver)
    return _hub


def _weak(fn: Callable | None):
    """A weak reference to a bound method (a plain function is kept as is)."""
    if fn is None:
        return None
    return weakref.WeakMethod(fn) if inspect.ismethod(fn) else (lambda: fn)


@dataclass
class _Receivers:
    refs: dict = field(default_factory=dict)
    stop: threading.Event = field(default_factory=threading.Event)

    def get(self, kind: str):
        ref = self.refs.get(kind)
        fn = ref() if ref is not None else None
        owner = getattr(fn, "__self__", None)
        if isinstance(owner, QObject) and not shiboken6.isValid(owner):
            return None                  # its view was deleted meanwhile
        return fn


def _post(token: int, kind: str, payload) -> None:
    """From the worker: hand ``payload`` to the hub (queued to the window's thread)."""
    hub = _hub
    try:
        if hub is not None:
            hub.posted.emit(token, kind, payload)
    except RuntimeError:                 # the program is shutting down
        pass


def _progress(token: int, *values) -> None:
    _post(token, "progress", tuple(values))


def _run(token: int, work: Callable, args: tuple, kwargs: dict) -> None:
    try:
        result = work(*args, **kwargs)
    except Exception as exc:             # noqa: BLE001 - the receiver decides what to say
        exc.__traceback__ = None         # no frames kept alive by the message
        _post(token, "failed", exc)
    else:
        _post(token, "done", result)
    finally:
        _threads.discard(threading.current_thread())


class Job:
    """One piece of work started by :func:`start` (held by the view, on its thread)."""

    def __init__(self, token: int, thread: threading.Thread, stop: threading.Event):
        self.token, self._thread, self._stop = token, thread, stop

    @property
    def running(self) -> bool:
        return self._thread.is_alive()

    @property
    def stopping(self) -> bool:
        return self._stop.is_set()

    def stop(self) -> None:
        """Ask the work to stop (its ``cancel()`` turns true); what it reports still comes."""
        self._stop.set()

    def abandon(self) -> None:
        """Stop, and drop whatever the work still reports (the view is going away)."""
        self._stop.set()
        _receivers.pop(self.token, None)

    def wait(self, timeout: float) -> bool:
        """Wait at most ``timeout`` seconds; True when the work has ended."""
        self._thread.join(timeout)
        return not self._thread.is_alive()


def _is_qt(value) -> bool:
    return isinstance(value, QObject) or isinstance(getattr(value, "__self__", None), QObject)


def check_plain(work: Callable, args: tuple, kwargs: dict) -> None:
    """Refuse (TypeError) work that would hold a Qt object: the work itself, its arguments
    or the items of a list, tuple or dict argument."""
    inner = work.func if isinstance(work, functools.partial) else work
    values = [work, inner, *args, *kwargs.values()]
    if isinstance(work, functools.partial):
        values += [*work.args, *work.keywords.values()]
    for value in list(values):
        if isinstance(value, (list, tuple, set)):
            values += list(value)
        elif isinstance(value, dict):
            values += list(value.values())
    culprit = next((v for v in values if _is_qt(v)), None)
    if culprit is not None:
        raise TypeError(f"a worker takes plain data only, not {type(culprit).__name__} (see workbench/ui/workers.py)")
    live = next((v for v in values if getattr(v, "_listeners", None)), None)
    if live is not None:     # a session's own plan: its listeners are the session's methods
        raise TypeError(f"a worker takes plain data only, not a {type(live).__name__} with listeners "
                        "(hand it .copy() or .snapshot())")


def start(work: Callable, *args, on_done: Callable | None = None, on_failed: Callable | None = None,
          on_progress: Callable | None = None, cancellable: bool = False, name: str = "slackline-worker",
          **kwargs) -> Job:
    """Run ``work(*args, **kwargs)`` in a worker thread. With ``cancellable`` the work also
    gets ``cancel=`` (a function true once :meth:`Job.stop` is called); with
    ``on_progress`` it gets ``progress=`` (call it with numbers). ``on_done(result)`` /
    ``on_failed(exception)`` / ``on_progress(*numbers)`` run on the window's thread."""
    if threading.current_thread() is not threading.main_thread():
        raise RuntimeError("workers.start is called on the window's thread (the hub lives there)")
    check_plain(work, args, kwargs)
    _the_hub()
    token, stop = next(_tokens), threading.Event()
    if cancellable:
        kwargs["cancel"] = stop.is_set
    if on_progress is not None:
        kwargs["progress"] = functools.partial(_progress, token)
    _receivers[token] = _Receivers({"done": _weak(on_done), "failed": _weak(on_failed),
                                    "progress": _weak(on_progress)}, stop)
    thread = threading.Thread(target=_run, args=(token, work, args, kwargs), name=name, daemon=True)
    _threads.add(thread)
    thread.start()
    return Job(token, thread, stop)


def _within(obj, root: QObject) -> bool:
    while isinstance(obj, QObject) and shiboken6.isValid(obj):
        if obj is root:
            return True
        obj = obj.parent()
    return False


def abandon_within(root: QObject) -> int:
    """Abandon every job reporting to ``root`` or an object inside it (a window closing);
    how many were abandoned."""
    gone = [token for token, entry in _receivers.items()
            if any(_within(getattr(ref(), "__self__", None), root) for ref in entry.refs.values() if ref is not None)]
    for token in gone:
        _receivers.pop(token).stop.set()
    return len(gone)


def pending() -> int:
    """How many started jobs have not reported their end (for tests)."""
    return len(_receivers)


def settle(timeout: float) -> list[str]:
    """Abandon every job and wait, at most ``timeout`` seconds in all, for their threads
    to end (the test suite does this after each test); the names of those still running."""
    for entry in _receivers.values():
        entry.stop.set()
    _receivers.clear()
    deadline = time.monotonic() + timeout
    for thread in list(_threads):
        thread.join(max(0.0, deadline - time.monotonic()))
    return sorted(t.name for t in _threads if t.is_alive())


class OneJobAtATime:
    """For a runner (a QObject) that keeps one job at a time: ``_job`` is the run whose
    reports come through, ``_last`` the run started last (for :meth:`wait`)."""

    _job: Job | None = None
    _last: Job | None = None

    @property
    def running(self) -> bool:
        return self._job is not None

    def _begin(self, job: Job) -> None:
        self._job = self._last = job

    def stop(self) -> None:
        """Ask the current run to stop; what it reports (a cancellation) still comes."""
        if self._job is not None:
            self._job.stop()

    def abandon(self) -> bool:
        """Stop the current run and drop whatever it still reports (its view is closing);
        True when there was one."""
        if self._job is None:
            return False
        self._job.abandon()
        self._job = None
        return True

    def wait(self, msecs: int = 30_000) -> bool:
        """Wait at most ``msecs`` for the run started last to end; True when none runs."""
        return self._last is None or self._last.wait(msecs / 1000)
