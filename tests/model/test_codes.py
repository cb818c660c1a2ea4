"""Typed codes: stable values, statuses decided by codes, never by words."""

from __future__ import annotations

from ifcjoint.model.codes import (
    UNCHECKED,
    Archetype,
    NotChecked,
    NotCheckedCode,
    Status,
)


def test_every_not_checked_reason_leads_to_an_unchecked_status():
    # A reason never turns into a pass or a fail.
    for code in NotCheckedCode:
        assert NotChecked(code).status in UNCHECKED


def test_missing_data_is_unreadable_and_scope_is_unsupported():
    assert NotChecked(NotCheckedCode.DATA_NOT_READ).status == Status.UNREADABLE
    assert NotChecked(NotCheckedCode.MINOR_AXIS).status == Status.UNSUPPORTED
    assert NotChecked(NotCheckedCode.NO_DEMANDS).status == Status.NO_DEMANDS


def test_incomplete_archetypes():
    assert {a for a in Archetype if a.incomplete} == {Archetype.INCOMPLETE, Archetype.UNDETAILED}


def test_codes_are_their_output_identifiers():
    # The values are what the JSON and CSV carry: plain strings, stable.
    assert Status.NO_DEMANDS == "no_demands" and f"{Status.PASS}" == "pass"
    assert Archetype.EXTENDED_END_PLATE.value == "extended_end_plate"
