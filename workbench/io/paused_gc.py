"""No cyclic garbage collection while a big plan or table is built."""

from __future__ import annotations

import gc
from contextlib import contextmanager


@contextmanager
def paused_gc():
    """No cyclic garbage collection while a big plan is built: its records hold no cycles,
    and a collection every few thousand new objects, each scanning all the objects made
    so far, costs more than the building itself."""
    was = gc.isenabled()
    gc.disable()
    try:
        yield
    finally:
        if was:
            gc.enable()
