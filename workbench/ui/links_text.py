"""The predecessor cell syntax (``A; B SS 2; C FF -1``), read and written by io."""

from __future__ import annotations

try:  # the tabular module re-exports these once it lands
    from workbench.io.tabular import format_predecessors, parse_predecessors
except ImportError:  # pragma: no cover - depends on what has landed in io
    from workbench.io.predecessors import format_predecessors, parse_predecessors

__all__ = ["format_predecessors", "parse_predecessors"]
