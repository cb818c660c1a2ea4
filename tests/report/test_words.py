"""Every code the program decides with has words, and only the renderers make them."""

from __future__ import annotations

import ast
from pathlib import Path

import pytest

from ifcjoint.ec3.code import COMPONENTS, Component
from ifcjoint.model.codes import (
    FindingCode,
    NotCheckedCode,
    NoteCode,
    ReasonCode,
    Status,
    UnsupportedPart,
)
from ifcjoint.report import words

ROOT = Path(__file__).resolve().parents[2] / "ifcjoint"


@pytest.mark.parametrize(
    ("codes", "table"),
    [
        (Status, words.STATUS_WORDS),
        (NotCheckedCode, words.NOT_CHECKED),
        (ReasonCode, words.REASONS),
        (NoteCode, words.NOTES),
        (FindingCode, words.FINDINGS),
        (UnsupportedPart, words._PARTS),
        (Component, COMPONENTS),
    ],
)
def test_every_code_has_words(codes, table):
    assert set(table) == set(codes)


def test_codes_of_different_kinds_never_share_a_value():
    # words.coded picks the table by the code's type; values stay distinct anyway, so a code
    # read back from JSON names one thing.
    seen: dict[str, type] = {}
    for kind in (NotCheckedCode, ReasonCode, NoteCode, FindingCode):
        for c in kind:
            assert c.value not in seen or seen[c.value] is kind, c
            seen[c.value] = kind


#: Fields that hold words for people.
TEXT_FIELDS = {"reason", "message", "title", "description", "archetype_reason", "name",
               "limited_by", "governing", "notes"}


def _text_field(node) -> bool:
    return isinstance(node, ast.Attribute) and node.attr in TEXT_FIELDS


def _is_str(node) -> bool:
    return isinstance(node, ast.Constant) and isinstance(node.value, str)


def sentence_reads(tree: ast.AST) -> list[int]:
    """Lines where code searches or compares a text field against a string."""
    bad = []
    for node in ast.walk(tree):
        if (isinstance(node, ast.Call) and isinstance(node.func, ast.Attribute)
                and node.func.attr in ("startswith", "endswith") and _text_field(node.func.value)):
            bad.append(node.lineno)
        if isinstance(node, ast.Compare):
            sides = [node.left, *node.comparators]
            if any(_text_field(x) for x in sides) and any(_is_str(x) for x in sides):
                bad.append(node.lineno)
    return bad


def test_no_decision_reads_a_sentence_back():
    # Outside the renderers, nothing compares or searches words made for people: no
    # reason.startswith(...), no "..." in message, no component.name == "...".
    bad = []
    for path in ROOT.rglob("*.py"):
        if "report" in path.parts:
            continue
        lines = sentence_reads(ast.parse(path.read_text()))
        bad += [f"{path.relative_to(ROOT)}:{n}" for n in lines]
    assert bad == []


def test_the_sentence_test_catches_a_reason_read_back():
    code = ('if cap.reason.startswith("not read"):\n    x = 1\n'
            'if c.name == "end plate":\n    y = 2\n')
    assert sentence_reads(ast.parse(code)) == [1, 3]
