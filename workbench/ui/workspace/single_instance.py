"""One Slackline window per user: a second launch hands its file to the first and exits."""

from __future__ import annotations

import getpass
import hashlib
import os

from PySide6.QtCore import QObject, QTimer, Signal
from PySide6.QtNetwork import QLocalServer, QLocalSocket

TIMEOUT_MS = 1500


def server_name(suffix: str | None = None) -> str:
    """A per-user name for the local socket (hashed: user names may hold any character).
    ``SLACKLINE_INSTANCE`` in the environment sets the suffix: windows started with
    different values stay apart (tests, or two set-ups side by side)."""
    suffix = os.environ.get("SLACKLINE_INSTANCE", "") if suffix is None else suffix
    try:
        user = getpass.getuser()
    except Exception:  # no user name available (rare service contexts)
        user = "user"
    return "slackline-" + hashlib.sha1(f"{user}{suffix}".encode("utf-8")).hexdigest()[:12]


class SingleInstance(QObject):
    """``hand_over(path)`` returns True when another window took it; otherwise call
    ``listen()`` and receive later launches' paths through ``path_received``."""

    path_received = Signal(str)

    def __init__(self, name: str | None = None, parent=None):
        super().__init__(parent)
        self.name = name or server_name()
        self.server: QLocalServer | None = None

    def hand_over(self, path: str) -> bool:
        socket = QLocalSocket()
        socket.connectToServer(self.name)
        if not socket.waitForConnected(TIMEOUT_MS):
            return False
        socket.write((path or "").encode("utf-8") + b"\n")
        socket.flush()
        socket.waitForBytesWritten(TIMEOUT_MS)
        socket.waitForReadyRead(TIMEOUT_MS)  # the first window answers "ok"
        socket.disconnectFromServer()
        return True

    def listen(self) -> bool:
        self.server = QLocalServer(self)
        self.server.setSocketOptions(QLocalServer.SocketOption.UserAccessOption)
        if not self.server.listen(self.name):
            QLocalServer.removeServer(self.name)  # left over by a crashed window
            if not self.server.listen(self.name):
                return False
        self.server.newConnection.connect(self._on_connection)
        return True

    def _on_connection(self) -> None:
        while self.server.hasPendingConnections():
            socket = self.server.nextPendingConnection()
            socket.readyRead.connect(lambda s=socket: self._read(s))
            socket.disconnected.connect(socket.deleteLater)

    def _read(self, socket: QLocalSocket) -> None:
        if not socket.canReadLine():
            return
        path = bytes(socket.readLine().data()).decode("utf-8", "replace").strip()
        socket.write(b"ok\n")
        socket.flush()
        # Hand the path on from the event loop, not from inside the socket's signal: opening
        # may ask about unsaved changes, and while that question waits the other launch
        # disconnects and its socket is deleted under a signal still being delivered.
        QTimer.singleShot(0, self, lambda: self.path_received.emit(path))

    def close(self) -> None:
        if self.server is not None:
            self.server.close()
            self.server = None
