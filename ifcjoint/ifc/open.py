"""Opening a model file: .ifc or .ifczip, whole, of a supported schema.

The header is checked before the parser sees the file, so a file that is not IFC, is
truncated or is of another schema gets a message that says so.
"""

from __future__ import annotations

import hashlib
import re
import tempfile
import zipfile
from pathlib import Path

import ifcopenshell

from ifcjoint.errors import ModelError

SUPPORTED_SCHEMAS = ("IFC2X3", "IFC4", "IFC4X3")


def _header(raw: bytes) -> str:
    return raw[:8192].decode("latin-1", errors="replace")


_NON_ASCII = re.compile(r"[^\x00-\x7f]+")


def _step_escape(run: str) -> str:
    r"""Characters as ISO 10303-21 writes them: \X2\hhhh\X0\ (\X4\ beyond 16 bits)."""
    if all(ord(c) <= 0xFFFF for c in run):
        return "\\X2\\" + "".join(f"{ord(c):04X}" for c in run) + "\\X0\\"
    return "\\X4\\" + "".join(f"{ord(c):08X}" for c in run) + "\\X0\\"


def encode_raw_text(raw: bytes) -> tuple[str | None, str | None]:
    r"""A file with raw non-ASCII bytes, re-encoded as ISO 10303-21 requires, and the note.

    ISO 10303-21 allows only ASCII in a file; characters beyond it are written as \X\,
    \X2\ or \X4\ escapes, which the parser decodes. Exporters that write raw bytes
    instead (common) would lose those characters silently: the bytes are read as UTF-8 when
    they are valid UTF-8, else as Latin-1, and escaped. Returns (None, None) for an ASCII file.
    """
    if raw.isascii():
        return None, None
    try:
        text, enc = raw.decode("utf-8"), "UTF-8"
    except UnicodeDecodeError:
        text, enc = raw.decode("latin-1"), "Latin-1"
    n = len(_NON_ASCII.findall(text))
    note = (f"{n} run(s) of raw non-ASCII characters (not allowed by ISO 10303-21) read as "
            f"{enc}; check names and grades that hold them")
    return _NON_ASCII.sub(lambda m: _step_escape(m.group(0)), text), note


#: Largest .ifc an .ifczip may unpack to, and the highest compression ratio believed above
#: 64 MB: a "zip bomb" is refused before it fills the memory (common practice, no source).
MAX_UNZIPPED_BYTES = 16 * 1024**3
MAX_RATIO = 200.0


def _ifc_from_zip(p: Path, name: str) -> bytes:
    """The .ifc inside an ifczip, read with limits; damage of any kind is a ModelError."""
    import zlib

    try:
        with zipfile.ZipFile(p) as zf:
            infos = [i for i in zf.infolist() if i.filename.lower().endswith(".ifc")]
            if not infos:
                raise ModelError(name, "zip archive holds no .ifc file",
                                 "an ifczip with one .ifc inside")
            info = infos[0]
            ratio = info.file_size / max(1, info.compress_size)
            if info.file_size > MAX_UNZIPPED_BYTES or (
                    info.file_size > 64 * 1024**2 and ratio > MAX_RATIO):
                raise ModelError(
                    name, f"{info.filename!r} would unpack to {info.file_size / 1e9:.1f} GB "
                    f"({ratio:.0f} times its packed size); refused as a likely zip bomb",
                    "an ifczip of a real model")
            out = bytearray()
            with zf.open(info) as fh:
                while chunk := fh.read(1 << 20):
                    out += chunk
                    if len(out) > max(info.file_size, 1) or len(out) > MAX_UNZIPPED_BYTES:
                        raise ModelError(name, f"{info.filename!r} unpacks to more than its "
                                         "declared size; refused", "an undamaged ifczip")
            return bytes(out)
    except (zipfile.BadZipFile, zlib.error, EOFError, NotImplementedError, RuntimeError,
            ValueError) as exc:
        raise ModelError(name, f"damaged zip archive ({type(exc).__name__}: {exc})",
                         "an undamaged ifczip") from exc
    except OSError as exc:
        raise ModelError(name, f"cannot read the zip archive ({exc.strerror or exc})") from exc


def open_model(path: str | Path) -> tuple[ifcopenshell.file, str, tuple[str, ...]]:
    """Open an IFC-SPF file or an ifczip, checking it is whole and of a supported schema.

    Returns:
        The opened file, the SHA-256 of the bytes on disk, and notes on how it was read
        (raw non-ASCII bytes decoded, see ``encode_raw_text``).

    Raises:
        ModelError: missing, unreadable, not IFC, truncated, or an unsupported schema.
    """
    f, sha, notes, _ = open_model_text(path)
    return f, sha, notes


def open_model_text(path: str | Path) -> tuple[ifcopenshell.file, str, tuple[str, ...], bytes]:
    """As :func:`open_model`, with the IFC-SPF bytes the file was parsed from.

    An ifczip's unpacked .ifc; for readers of the text itself (``ifc.digests``).

    Raises:
        ModelError: as :func:`open_model`.
    """
    p = Path(path)
    if not p.exists():
        raise ModelError(str(path), "file not found")
    if p.is_dir():
        raise ModelError(str(path), "is a folder", "an .ifc or .ifczip file")
    try:
        raw = p.read_bytes()
    except OSError as exc:
        raise ModelError(str(path), f"cannot read the file: {exc.strerror}") from exc
    sha = hashlib.sha256(raw).hexdigest()
    with tempfile.TemporaryDirectory(prefix="ifcjoint-") as tmp:
        spf = p
        if raw[:4] == b"PK\x03\x04":
            raw = _ifc_from_zip(p, str(path))
            spf = Path(tmp) / "model.ifc"
            spf.write_bytes(raw)
        head = _header(raw)
        if not head.lstrip().startswith("ISO-10303-21"):
            raise ModelError(
                str(path),
                "not an IFC file (no ISO-10303-21 header)",
                "an IFC-SPF (.ifc) or .ifczip file",
            )
        m = re.search(r"FILE_SCHEMA\s*\(\s*\(\s*'([^']*)'", head, re.IGNORECASE)
        schema = (m.group(1) if m else "").upper()
        if not any(schema == s or schema.startswith(s + "_") for s in SUPPORTED_SCHEMAS):
            raise ModelError(
                str(path),
                f"unsupported schema {schema or '(none given)'!r}",
                "IFC2X3, IFC4 or IFC4X3",
            )
        tail = raw[-2048:].decode("latin-1", errors="replace")
        if "END-ISO-10303-21" not in tail:
            raise ModelError(
                str(path),
                "file is truncated (no END-ISO-10303-21; at its end)",
                "a complete IFC file",
            )
        text, note = encode_raw_text(raw)
        try:
            if text is None:
                f = ifcopenshell.open(str(spf), format=".ifc")
            else:
                f = ifcopenshell.file.from_string(text)
        except Exception as exc:  # the parser raises several kinds
            raise ModelError(str(path), f"the IFC parser rejected the file: {exc}") from exc
    return f, sha, (note,) if note else (), raw
