"""Stable identities: joint ids, problem and viewpoint GUIDs, new IFC GlobalIds.

Every identity derives from stable inputs (a beam GlobalId, its end, a kind of problem) so a
re-run changes nothing that did not change. The namespace must never change: re-runs would
duplicate BCF topics and property sets.
"""

from __future__ import annotations

import hashlib
import uuid

#: Namespace of every identity ifcjoint derives; never change it.
NAMESPACE = uuid.UUID("6f1d2c3a-5b7e-4c1d-9a8f-0e2b4c6d8a10")


#: Separates a repeated GlobalId from the entity id that makes its element's key distinct;
#: never a character of a GlobalId (IFC base-64: 0-9 A-Z a-z _ $).
KEY_SEPARATOR = "#"


def element_key(global_id: str, entity_id: int) -> str:
    """The key of an element whose GlobalId another element repeats: ``GlobalId#entity``.

    Example:
        >>> element_key("2O2Fr$t4X7Zf8NOew3FLOH", 1501)
        '2O2Fr$t4X7Zf8NOew3FLOH#1501'
    """
    return f"{global_id}{KEY_SEPARATOR}{entity_id}"


def split_key(key: str) -> tuple[str, int | None]:
    """(GlobalId, entity id or None) of an element key (see ``element_key``).

    Example:
        >>> split_key("2O2Fr$t4X7Zf8NOew3FLOH#1501")
        ('2O2Fr$t4X7Zf8NOew3FLOH', 1501)
        >>> split_key("2O2Fr$t4X7Zf8NOew3FLOH")
        ('2O2Fr$t4X7Zf8NOew3FLOH', None)
    """
    gid, sep, ent = key.partition(KEY_SEPARATOR)
    return (gid, int(ent)) if sep and ent.isdigit() else (key, None)


def joint_id(beam_guid: str, beam_end: str) -> str:
    """Stable joint id from the beam GlobalId and the end, so it survives re-export.

    Example:
        >>> joint_id("2O2Fr$t4X7Zf8NOew3FLOH", "end")[:2]
        'J-'
    """
    digest = hashlib.sha256(f"{beam_guid}/{beam_end}".encode()).hexdigest()
    return f"J-{digest[:12]}"


def stable_uuid(key: str) -> uuid.UUID:
    """A UUID that is the same on every run for the same key (uuid5 in our namespace)."""
    return uuid.uuid5(NAMESPACE, key)


def problem_key(beam_guid: str, beam_end: str, kind: str) -> str:
    """The identity of one kind of problem at one beam end."""
    return f"{beam_guid}/{beam_end}/{kind}"
