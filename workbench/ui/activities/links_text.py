"""The predecessor cell syntax (``A; B SS 2; C FF -1``), read and written by io; lags
written so that they read back exactly."""

from __future__ import annotations

from workbench.io.predecessors import format_number
from workbench.io.predecessors import format_predecessors, parse_predecessors

__all__ = ["format_number", "format_predecessors", "parse_predecessors"]
