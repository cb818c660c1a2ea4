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
