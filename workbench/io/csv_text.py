"""Reading a CSV file's bytes: encoding detection, delimiter sniffing, numbered rows.

Encoding: a UTF-8 byte-order mark → ``utf-8-sig``; a UTF-16 mark → ``utf-16``; text
that decodes as UTF-8 → ``utf-8``; anything else → ``cp1252`` (the usual spreadsheet
export on Western Windows machines), which the import report says it used.
Delimiter: whichever of ``,`` ``;`` tab occurs most outside quotes in the first ten
non-blank lines (ties favour the comma).
"""

from __future__ import annotations

import codecs
import csv
import io
import unicodedata

from .errors import TableImportError
from .paused_gc import paused_gc

DELIMITERS = (",", ";", "\t")
DELIMITER_NAMES = {",": "comma", ";": "semicolon", "\t": "tab"}


def decode(raw: bytes, source: str) -> tuple[str, str]:
    """The file's text and the name of the encoding used."""
    if not raw.strip(b" \t\r\n\x00\xef\xbb\xbf\xff\xfe"):
        raise TableImportError(["the file is empty"], source)
    if raw.startswith(codecs.BOM_UTF8):
        return _strict(raw, "utf-8-sig", source), "utf-8-sig"
    if raw.startswith((codecs.BOM_UTF16_LE, codecs.BOM_UTF16_BE)):
        return _strict(raw, "utf-16", source), "utf-16"
    if b"\x00" in raw[:65536]:
        raise TableImportError(["this is a binary file, not CSV text (use .csv or .xlsx)"], source)
    try:
        return raw.decode("utf-8"), "utf-8"
    except UnicodeDecodeError:
        pass
    try:
        return raw.decode("cp1252"), "cp1252"
    except UnicodeDecodeError:
        return raw.decode("latin-1"), "latin-1"


def _strict(raw: bytes, encoding: str, source: str) -> str:
    try:
        return raw.decode(encoding)
    except UnicodeDecodeError as exc:
        raise TableImportError([f"the file starts with a {encoding} mark but byte {exc.start} is not {encoding}"], source) from exc


def looks_binary(text: str) -> bool:
    """More than 1% control characters (other than tab and line ends) in the first 64k."""
    head = text[:65536]
    bad = sum(1 for c in head if c not in "\t\r\n\f" and unicodedata.category(c) == "Cc")
    return bad > max(2, len(head) // 100)


def _count_outside_quotes(line: str, delimiter: str) -> int:
    count, quoted = 0, False
    for char in line:
        if char == '"':
            quoted = not quoted
        elif char == delimiter and not quoted:
            count += 1
    return count


def sniff_delimiter(text: str) -> str:
    lines = [line for line in text[:65536].splitlines() if line.strip()][:10]
    counts = [(sum(_count_outside_quotes(line, d) for line in lines), -i, d) for i, d in enumerate(DELIMITERS)]
    best = max(counts)
    return best[2] if best[0] > 0 else ","


def csv_rows(text: str, delimiter: str, source: str) -> list[tuple[int, list[str]]]:
    """Records numbered from 1 (the header's row), as a spreadsheet shows them."""
    reader = csv.reader(io.StringIO(text, newline=""), delimiter=delimiter)
    try:
        with paused_gc():   # millions of small lists, no cycles: collections would only rescan them
            return [(i, row) for i, row in enumerate(reader, 1)]
    except csv.Error as exc:
        raise TableImportError([f"line {reader.line_num}: cannot read the CSV text ({exc})"], source) from exc
