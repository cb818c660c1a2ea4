"""Small file helpers every writer shares: atomic writes and spreadsheet-safe cells."""

from __future__ import annotations

import os
import tempfile
from pathlib import Path


def atomic_write_bytes(path: str | Path, data: bytes) -> None:
    """Write to a temporary file beside the target, then rename over it."""
    path = Path(path)
    path.parent.mkdir(parents=True, exist_ok=True)
    fd, tmp = tempfile.mkstemp(dir=path.parent, prefix=f".{path.name}.", suffix=".tmp")
    try:
        with os.fdopen(fd, "wb") as fh:
            fh.write(data)
        os.replace(tmp, path)
    except BaseException:
        if os.path.exists(tmp):
            os.unlink(tmp)
        raise


def atomic_write_text(path: str | Path, text: str) -> None:
    """UTF-8 text, written atomically (see ``atomic_write_bytes``)."""
    atomic_write_bytes(path, text.encode("utf-8"))


def safe_cell(value: object) -> object:
    """Neutralise text that a spreadsheet would run as a formula (=, +, -, @, tab, CR)."""
    if isinstance(value, str) and value[:1] in ("=", "+", "-", "@", "\t", "\r"):
        return "'" + value
    return value
