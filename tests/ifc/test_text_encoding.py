"""Text in the model: ISO 10303-21 escapes decoded, raw non-ASCII bytes read with a note.

ISO 10303-21 allows only ASCII and writes other characters as \\X\\hh (ISO 8859-1), \\X2\\hhhh\\X0\\
(UCS-2) or \\X4\\ (UCS-4) escapes; many exporters write raw UTF-8 or Latin-1 bytes instead. A
generated model's first beam is renamed "Stahlträger Ø IPE" each way, in IFC2X3 and IFC4.
"""

from __future__ import annotations

import re

import pytest

from ifcjoint.ifc.reader import read_model

NAME = "Stahlträger Ø IPE"
ENCODINGS = {
    "x2_escape": b"Stahltr\\X2\\00E4\\X0\\ger \\X2\\00D8\\X0\\ IPE",
    "x_escape": b"Stahltr\\X\\E4ger \\X\\D8 IPE",
    "raw_utf8": NAME.encode("utf-8"),
    "raw_latin1": NAME.encode("latin-1"),
}


def _renamed(src, dst, name: bytes) -> str:
    raw = src.read_bytes()
    m = re.search(rb"(#\d+=IFCBEAM\('[^']*',[^,]*,)'([^']*)'", raw)
    out = raw[: m.start(2)] + name + raw[m.end(2):]
    dst.write_bytes(out)
    return m.group(0).split(b"'")[1].decode()  # the beam's GlobalId


@pytest.mark.parametrize("schema", ["IFC4", "IFC2X3"])
@pytest.mark.parametrize("how", sorted(ENCODINGS))
def test_names_survive_every_encoding(build_variant, tmp_path, schema, how):
    src, _ = build_variant(schema=schema)
    dst = tmp_path / "renamed.ifc"
    guid = _renamed(src, dst, ENCODINGS[how])
    m = read_model(dst)
    (beam,) = [x for x in m.members if x.guid == guid]
    assert beam.name == NAME
    raw = how.startswith("raw")
    notes = [n for n in m.notes if "non-ASCII" in n]
    assert bool(notes) == raw  # raw bytes are said, never silent
    if raw:
        assert ("UTF-8" if how == "raw_utf8" else "Latin-1") in notes[0]
