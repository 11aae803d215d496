"""The ``.slw`` plan file ("Slackline workbook"): UTF-8 JSON, versioned, saved atomically.

>>> save_plan(plan, "bridge.slw")      # keeps the previous file as bridge.slw.bak
>>> plan = load_plan("bridge.slw")
>>> plan_hash(plan)                    # '3f9a0c1d22be': traces a printed pack to its inputs
"""

from __future__ import annotations

import hashlib
import json
import os
import secrets
from pathlib import Path

from workbench.core.model import Plan

from .errors import PlanFileError
from .plan_codec import FORMAT, VERSION, plan_from_dict, plan_to_dict
from .plan_migrate import upgrade

__all__ = ["FORMAT", "VERSION", "PlanFileError", "load_plan", "save_plan", "plan_to_dict",
           "plan_from_dict", "plan_hash", "dumps", "loads", "upgrade"]

MAX_BYTES = 256 * 1024 * 1024
CHUNK = 1 << 16


# --- text ⇄ data ---------------------------------------------------------------
def _no_constant(name: str):
    raise ValueError(f"{name} is not allowed (numbers must be finite)")


def _no_duplicates(pairs):
    obj = dict(pairs)
    if len(obj) != len(pairs):
        seen = set()
        for key, _ in pairs:
            if key in seen:
                raise ValueError(f"the field {key!r} appears twice in one object")
            seen.add(key)
    return obj


def _layout(value, depth: int = 0) -> str:
    """JSON with one line per setting and per activity/link (readable, diff-friendly)."""
    pad, inner = " " * depth, " " * (depth + 1)
    if depth < 2 and isinstance(value, dict) and value:
        body = ",\n".join(f"{inner}{json.dumps(k, ensure_ascii=False)}: {_layout(v, depth + 1)}" for k, v in value.items())
        return "{\n" + body + "\n" + pad + "}"
    if depth == 1 and isinstance(value, list) and value and isinstance(value[0], dict):
        body = ",\n".join(inner + _layout(v, 2) for v in value)
        return "[\n" + body + "\n" + pad + "]"
    return json.dumps(value, ensure_ascii=False, allow_nan=False, separators=(", ", ": "))


def dumps(plan: Plan) -> str:
    """The plan file text (UTF-8 JSON); every float written exactly (shortest repr)."""
    return _layout(plan_to_dict(plan)) + "\n"


def loads(text: str, source: str = "plan file") -> Plan:
    try:
        data = json.loads(text, parse_constant=_no_constant, object_pairs_hook=_no_duplicates)
    except json.JSONDecodeError as exc:
        raise PlanFileError(f"{source}: not valid JSON (line {exc.lineno}, column {exc.colno}: {exc.msg})") from exc
    except (ValueError, RecursionError) as exc:
        raise PlanFileError(f"{source}: not valid plan JSON: {exc}") from exc
    try:
        return plan_from_dict(data)
    except PlanFileError as exc:
        raise PlanFileError(f"{source}: {exc}", exc.culprit) from exc


def _decode(raw: bytes, name: str) -> str:
    if not raw.strip():
        raise PlanFileError(f"{name}: the file is empty")
    if raw.startswith((b"\xff\xfe", b"\xfe\xff")):
        raise PlanFileError(f"{name}: the file was saved as UTF-16 text; a Slackline plan file is UTF-8 JSON")
    if b"\x00" in raw[:4096]:
        raise PlanFileError(f"{name}: this is a binary file, not a Slackline plan file")
    try:
        return raw.decode("utf-8-sig")
    except UnicodeDecodeError as exc:
        raise PlanFileError(f"{name}: not UTF-8 text (bad byte at position {exc.start}); "
                            "a Slackline plan file is UTF-8 JSON") from exc


def load_plan(path) -> Plan:
    """Read, upgrade and check a plan file. Raises :class:`PlanFileError` with a message
    naming the file and, where it applies, the activity and field."""
    path = Path(path)
    try:
        if path.stat().st_size > MAX_BYTES:
            raise PlanFileError(f"{path.name}: too large for a plan file ({path.stat().st_size} bytes)")
        raw = path.read_bytes()
    except OSError as exc:
        raise PlanFileError(f"cannot read {path}: {exc.strerror or exc}") from exc
    try:
        return loads(_decode(raw, path.name), path.name)
    except PlanFileError as exc:
        bak = path.with_name(path.name + ".bak")
        if path.suffix != ".bak" and bak.is_file():
            raise PlanFileError(f"{exc}\n(the previous save is kept as {bak.name})", exc.culprit) from exc
        raise


# --- saving ----------------------------------------------------------------------
def _fsync_folder(folder: Path) -> None:
    """Make the rename durable; not every OS lets a folder be opened (then skip)."""
    if os.name == "nt":
        return
    try:
        fd = os.open(folder, os.O_RDONLY)
    except OSError:
        return
    try:
        os.fsync(fd)
    except OSError:
        pass
    finally:
        os.close(fd)


def _write_all(handle, data: bytes) -> None:
    for i in range(0, len(data), CHUNK):
        handle.write(data[i:i + CHUNK])


def _open_temp(folder: Path, name: str) -> tuple[int, Path]:
    """A new file beside the target, created with the usual permissions (umask applies)."""
    flags = os.O_WRONLY | os.O_CREAT | os.O_EXCL | getattr(os, "O_BINARY", 0)
    while True:
        tmp = folder / f".{name}.{secrets.token_hex(4)}.tmp"
        try:
            return os.open(tmp, flags, 0o666), tmp
        except FileExistsError:
            continue


def _write_temp(folder: Path, name: str, data: bytes, mode: int | None) -> Path:
    fd, tmp = _open_temp(folder, name)
    try:
        with os.fdopen(fd, "wb") as handle:
            _write_all(handle, data)
            handle.flush()
            os.fsync(handle.fileno())
        if mode is not None:
            os.chmod(tmp, mode)
    except BaseException:
        tmp.unlink(missing_ok=True)
        raise
    return tmp


def _keep_backup(path: Path) -> None:
    """Copy the file about to be replaced to ``NAME.bak`` (itself written atomically)."""
    data = path.read_bytes()
    bak = path.with_name(path.name + ".bak")
    tmp = _write_temp(path.parent, bak.name, data, None)
    try:
        os.replace(tmp, bak)
    except BaseException:
        tmp.unlink(missing_ok=True)
        raise


def save_plan(plan: Plan, path, backup: bool = True) -> Path:
    """Write the plan atomically: a temporary file in the same folder, flushed and
    synced, then renamed over the target (and the folder synced). The previous file is
    kept as ``NAME.slw.bak``. If anything fails the previous file is untouched."""
    path = Path(path)
    if path.is_symlink():
        path = path.resolve()
    text = dumps(plan)
    loads(text, "not saved")  # never write a file we could not read back
    try:
        existed = path.exists()
        mode = (path.stat().st_mode & 0o7777) if existed else None
        if existed and backup:
            _keep_backup(path)
        tmp = _write_temp(path.parent, path.name, text.encode("utf-8"), mode)
        try:
            os.replace(tmp, path)
        except BaseException:
            tmp.unlink(missing_ok=True)
            raise
        _fsync_folder(path.parent)
    except OSError as exc:
        raise PlanFileError(f"could not save {path}: {exc.strerror or exc}; the previous file is unchanged") from exc
    return path


def plan_hash(plan: Plan) -> str:
    """First 12 hex digits of the SHA-256 of the canonical plan data (sorted keys, no
    whitespace): the same inputs always give the same hash. The plan's history (its
    baselines and odds trend) is left out, so recording a baseline keeps the hash it holds."""
    data = plan_to_dict(plan)
    data.pop("baselines", None), data.pop("odds_trend", None)
    text = json.dumps(data, sort_keys=True, separators=(",", ":"), ensure_ascii=False,
                      allow_nan=False)
    return hashlib.sha256(text.encode("utf-8")).hexdigest()[:12]

