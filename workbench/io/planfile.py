"""The ``.slw`` plan file ("Slackline workbook"): UTF-8 JSON, versioned, saved atomically.

>>> save_plan(plan, "bridge.slw")      # keeps the previous file as bridge.slw.bak
>>> plan = load_plan("bridge.slw")
>>> plan_hash(plan)                    # '3f9a0c1d22be': traces a printed pack to its inputs
"""

from __future__ import annotations

import codecs
import hashlib
import json
from pathlib import Path

from workbench.core.model import Plan

from . import atomic
from .atomic import OwnershipChange
from .errors import PlanFileError
from .plan_checks import check_storable, cleaned_data, may_hold_surrogates, unstorable_text
from .safe_read import NotReadable, read_regular_file
from .paused_gc import paused_gc
from .plan_bulk import bulk_plan_data
from .plan_codec import FORMAT, VERSION, plan_from_dict, plan_to_dict
from .plan_lines import fast_dumps, fast_parts
from .plan_migrate import upgrade
from .read_back import quick_read_back

__all__ = ["FORMAT", "VERSION", "OwnershipChange", "PlanFileError", "load_plan", "save_plan", "plan_to_dict",
           "plan_from_dict", "plan_hash", "dumps", "loads", "upgrade", "ownership_problem"]

# The largest plan file read or written. Saving refuses a plan beyond it, so every file
# Slackline writes can be opened again (a 1,000,000-activity plan is about 280 MB).
MAX_BYTES = 2 * 1024 ** 3
TOO_LARGE_ADVICE = ("; Slackline never writes a plan file this large. If it is a plan, split it into "
                    "smaller plans; otherwise it is not a plan file")


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
    with paused_gc():
        return fast_dumps(plan, _layout) or _layout(plan_to_dict(plan)) + "\n"


def loads(text: str | bytes, source: str = "plan file") -> Plan:
    """A plan from plan file text (str, or UTF-8 bytes already checked by :func:`_decode`)."""
    raw = text.encode("utf-8", "surrogatepass") if isinstance(text, str) else text
    suspicious = may_hold_surrogates(raw)     # a surrogate escape: read carefully, check every text
    with paused_gc():
        data = None if suspicious else bulk_plan_data(raw, VERSION)   # the fast route; None: read it carefully
        if data is None:
            data = _careful_json(raw.decode("utf-8") if isinstance(text, bytes) else text, source)
            if suspicious:
                check_storable(data, source)
        try:
            return plan_from_dict(data)
        except PlanFileError as exc:
            raise PlanFileError(f"{source}: {exc}", exc.culprit) from exc


def _careful_json(text: str, source: str):
    try:
        return json.loads(text, parse_constant=_no_constant, object_pairs_hook=_no_duplicates)
    except json.JSONDecodeError as exc:
        raise PlanFileError(f"{source}: not valid JSON (line {exc.lineno}, column {exc.colno}: {exc.msg})") from exc
    except (ValueError, RecursionError) as exc:
        raise PlanFileError(f"{source}: not valid plan JSON: {exc}") from exc


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


def _read(path: Path) -> bytes:
    try:
        return read_regular_file(path, MAX_BYTES, TOO_LARGE_ADVICE)
    except NotReadable as exc:
        raise PlanFileError(str(exc), "file") from None
    except OSError as exc:
        raise PlanFileError(f"cannot read {path}: {exc.strerror or exc}") from exc


def load_plan(path) -> Plan:
    """Read, upgrade and check a plan file. Raises :class:`PlanFileError` with a message
    naming the file and, where it applies, the activity and field."""
    path = Path(path)
    raw = _read(path)
    try:
        _decode(raw, path.name)               # refuses what is not UTF-8 text, saying why
        return loads(raw.removeprefix(codecs.BOM_UTF8), path.name)
    except MemoryError:
        raise PlanFileError(f"{path.name}: not enough memory to open this {len(raw) / 2**20:,.0f} MB plan; "
                            "close other programs and open it again, or open it on a computer with more memory") from None
    except PlanFileError as exc:
        bak = path.with_name(path.name + ".bak")
        if path.suffix != ".bak" and bak.is_file():
            raise PlanFileError(f"{exc}\n(the previous save is kept as {bak.name})", exc.culprit) from exc
        raise


# --- saving ----------------------------------------------------------------------
def encode_plan(plan: Plan) -> bytes:
    """The plan file's bytes, refused (naming the field) when a text cannot be stored as
    UTF-8 or the file would be too large to open again."""
    with paused_gc():
        pieces = fast_parts(plan, _layout) or [_layout(plan_to_dict(plan)) + "\n"]
        try:
            for k, piece in enumerate(pieces):   # each piece's text let go once encoded
                pieces[k] = piece.encode("utf-8")
        except UnicodeEncodeError:
            raise PlanFileError(f"not saved: {unstorable_text(plan_to_dict(plan))}", "text") from None
        data = b"".join(pieces)
        del pieces
    _refuse_oversize(len(data))
    if not quick_read_back(data, plan):       # never write a file we could not read back
        loads(data, "not saved")
    return data


def encode_parts(plan: Plan) -> list[bytes]:
    """The bytes :func:`encode_plan` gives, in pieces, each made in short steps so that a
    worker thread writing them (the autosave) never holds Python's lock for long; without
    the read-back parse (the caller checks what it wrote against these bytes instead).
    Refused, naming the field, as :func:`encode_plan` refuses."""
    with paused_gc():
        texts = fast_parts(plan, _layout)
        if texts is None:
            whole = _layout(plan_to_dict(plan)) + "\n"
            texts = [whole[i:i + atomic.CHUNK] for i in range(0, len(whole), atomic.CHUNK)]
        try:
            parts = [text.encode("utf-8") for text in texts]
        except UnicodeEncodeError:
            raise PlanFileError(f"not saved: {unstorable_text(plan_to_dict(plan))}", "text") from None
    _refuse_oversize(sum(map(len, parts)))
    return parts


def _refuse_oversize(size: int) -> None:
    if size > MAX_BYTES:
        raise PlanFileError(f"not saved: the plan file would be {size / 2**20:,.0f} MB, more than the "
                            f"{MAX_BYTES / 2**20:,.0f} MB a plan file may hold; split the plan into smaller plans",
                            "size")


def storable_copy(plan: Plan) -> Plan:
    """The plan with every text it cannot store cleaned (lone surrogates become U+FFFD):
    what a recovery copy keeps when the plan itself cannot be saved as it is."""
    return plan_from_dict(cleaned_data(plan_to_dict(plan)))


def _keep_backup(path: Path, accept_owner_change: bool) -> None:
    """Copy the file about to be replaced to ``NAME.bak`` (written atomically, with the
    plan's own permissions, owner and group)."""
    data = _read(path)
    atomic.write_file(path.with_name(path.name + ".bak"), data, like=path,
                      accept_owner_change=accept_owner_change)


def ownership_problem(path) -> str | None:
    """What saving over ``path`` would change about its owner or group (ask first), or None."""
    return atomic.ownership_problem(Path(path).resolve())


def save_plan(plan: Plan, path, backup: bool = True, accept_owner_change: bool = False) -> Path:
    """Write the plan atomically (see :mod:`atomic`): a temporary file in the same folder,
    synced, given the old file's mode, owner and group, then renamed over the target. The
    previous file is kept as ``NAME.slw.bak``. If anything fails the previous file is
    untouched. When the owner or group could not be kept, :class:`OwnershipChange` is
    raised before anything is written, unless ``accept_owner_change``."""
    path = Path(path)
    data = encode_plan(plan)
    try:
        if path.is_symlink():
            path = path.resolve()
        problem = None if accept_owner_change else atomic.ownership_problem(path)
        if problem:
            raise OwnershipChange(f"{problem}. Save anyway, or save under another name.", "owner")
        if backup and path.is_file():
            _keep_backup(path, accept_owner_change)
        atomic.write_file(path, data, accept_owner_change=accept_owner_change)
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

