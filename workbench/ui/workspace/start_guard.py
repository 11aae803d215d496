"""Starting Qt with a plain answer when it cannot: should the platform plugin fail to load
(Qt then reports a fatal error and aborts), Slackline prints Qt's messages, then which
system libraries are missing and how to install them (``workbench.syslibs``), and exits
with code 2 instead of Qt's abort."""

from __future__ import annotations

import os
import sys

from PySide6.QtCore import QtMsgType, qInstallMessageHandler

START_FAILED = 2


def _echo(context, message: str) -> None:
    category = getattr(context, "category", None) or "default"
    sys.stderr.write(message + "\n" if category == "default" else f"{category}: {message}\n")


def started(make):
    """``make()`` (which builds the QApplication) with Qt's start-up messages watched."""
    said: list[str] = []

    def handler(kind, context, message):
        said.append(message)
        _echo(context, message)
        if kind == QtMsgType.QtFatalMsg:
            from workbench.syslibs import explain_start_failure
            sys.stderr.write("\n" + explain_start_failure(said) + "\n")
            sys.stderr.flush()
            os._exit(START_FAILED)   # Qt would abort(); nothing of ours is open yet

    qInstallMessageHandler(handler)
    try:
        return make()
    finally:
        qInstallMessageHandler(None)
