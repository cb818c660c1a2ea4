"""Joint description files (``ifcjoint calc``): read TOML or JSON, write them back.

The format is documented in docs/joint-file.md, with the JSON Schema
``ifcjoint/data/joint-file.schema.json``. Reading checks the file's syntax only; the values
are checked where they are used (``ifcjoint.archetypes.description``), each error naming its
key.
"""

from __future__ import annotations

import json
import tomllib
from importlib import resources
from pathlib import Path

import tomli_w

from ifcjoint.errors import JointFileError
from ifcjoint.fileio import atomic_write_text

#: File name endings read and written.
SUFFIXES = (".toml", ".json")


def joint_file_schema() -> dict:
    """The JSON Schema of a joint description."""
    text = resources.files("ifcjoint").joinpath("data/joint-file.schema.json").read_text("utf-8")
    return json.loads(text)


def read_description(path: str | Path) -> dict:
    """A joint description from a ``.toml`` or ``.json`` file.

    Raises:
        JointFileError: missing or unreadable file, unknown ending, bad syntax (with the line
            where the parser gives one), or not a table at the top.
    """
    p = Path(path)
    if p.suffix.lower() not in SUFFIXES:
        raise JointFileError(str(p), "", f"unknown file type {p.suffix!r}; expected a .toml or "
                                         ".json joint description")
    try:
        text = p.read_text("utf-8")
    except FileNotFoundError:
        raise JointFileError(str(p), "", "file not found") from None
    except UnicodeDecodeError as exc:
        raise JointFileError(str(p), "", f"not UTF-8 text ({exc.reason} at byte "
                                         f"{exc.start})") from None
    except OSError as exc:
        raise JointFileError(str(p), "", f"cannot be read ({exc.strerror})") from None
    try:
        data = json.loads(text) if p.suffix.lower() == ".json" else tomllib.loads(text)
    except json.JSONDecodeError as exc:
        raise JointFileError(str(p), "", f"not valid JSON: {exc.msg} (line {exc.lineno}, "
                                         f"column {exc.colno})") from None
    except tomllib.TOMLDecodeError as exc:
        raise JointFileError(str(p), "", f"not valid TOML: {exc}") from None
    if not isinstance(data, dict):
        raise JointFileError(str(p), "", "expected a table (object) of joint values at the top")
    return data


def write_description(description: dict, path: str | Path) -> None:
    """Write a description as TOML or JSON (by the file's ending), atomically.

    Raises:
        JointFileError: an ending other than .toml or .json.
    """
    p = Path(path)
    suffix = p.suffix.lower()
    if suffix not in SUFFIXES:
        raise JointFileError(str(p), "", f"unknown file type {p.suffix!r}; expected .toml or "
                                         ".json")
    if suffix == ".json":
        text = json.dumps(description, indent=1) + "\n"
    else:
        head = (
            "# ifcjoint joint description (docs/joint-file.md): lengths mm, strengths MPa,\n"
            "# forces kN, moments kNm. Edit and run: ifcjoint calc THIS_FILE\n"
        )
        text = head + tomli_w.dumps(description)
    atomic_write_text(p, text)
