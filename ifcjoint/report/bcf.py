"""The issue list as BCF (buildingSMART BCF 3.0 by default, 2.1 on request), via bcf-client.

One topic per problem (``ifcjoint.engine.problems``; its words from the results dictionary):
stable GUIDs (uuid5 of the beam, its end and the kind of problem), the beam/column/plate/bolt
GlobalIds selected, and a camera looking at the joint. Writing over an earlier BCF of ours
keeps what people added there: comments stay, topics whose problem is gone are set to
``Closed`` with a comment, never deleted.
"""

from __future__ import annotations

import datetime as _dt
import io
import tempfile
import zipfile
from pathlib import Path
from xml.sax.saxutils import escape as xml_escape

import numpy as np
from xsdata.models.datatype import XmlDateTime

from ifcjoint.errors import OutputError
from ifcjoint.fileio import atomic_write_bytes
from ifcjoint.model.codes import Archetype
from ifcjoint.model.identity import problem_key, split_key, stable_uuid

AUTHOR = "ifcjoint"
LABEL = "ifcjoint"
PRIORITIES = {"critical": "Critical", "major": "Major", "minor": "Minor"}
TOPIC_TYPES = {
    "resistance": "Joint fails check",
    "incomplete": "Joint incomplete",
    "unchecked": "Joint not checked",
    "detailing": "Joint detailing",
    "assumption": "Analysis assumption",
}
OPEN, CLOSED = "Open", "Closed"
#: Every label our topics carry, once each: ours, the problem kinds, the archetypes.
EXTENSION_LABELS = list(dict.fromkeys(
    [LABEL, *TOPIC_TYPES, *(a.value for a in Archetype if a != Archetype.UNKNOWN)]))
#: Camera offset from the joint, metres: up, back and to the side, so the joint is in view.
CAMERA_OFFSET_M = np.array((3.0, -4.0, 2.5))
BCF_VERSIONS = ("3.0", "2.1")


def _modules(version: str):
    if version == "2.1":
        import bcf.v2.bcfxml as bx
        import bcf.v2.model as mdl
        import bcf.v2.topic as tp
        import bcf.v2.visinfo as vi
    elif version == "3.0":
        import bcf.v3.bcfxml as bx
        import bcf.v3.model as mdl
        import bcf.v3.topic as tp
        import bcf.v3.visinfo as vi
    else:
        raise ValueError(f"BCF version {version!r}: expected one of {BCF_VERSIONS}")
    return bx, mdl, tp, vi


def _when(dt: _dt.datetime) -> XmlDateTime:
    return XmlDateTime.from_datetime(dt)


def _ifc_guids(elements) -> list[str]:
    """The GlobalIds of element keys (a repeated GlobalId's ``#entity`` removed), once each."""
    return list(dict.fromkeys(split_key(e)[0] for e in elements))


def _viewpoint(vi, mdl, key: str, point_mm, elements):
    from bcf.geometry import camera_vectors_from_target_position

    target = np.asarray(point_mm, dtype=float) / 1000.0
    pos, direction, up = camera_vectors_from_target_position(target, CAMERA_OFFSET_M)
    info = mdl.VisualizationInfo(
        guid=str(stable_uuid(key + "/viewpoint")),
        components=vi.build_components(*_ifc_guids(elements)),
        perspective_camera=vi.build_camera_from_vectors(pos, direction, up),
    )
    return vi.VisualizationInfoHandler(visualization_info=info)


def _labels(mdl, version: str, labels: list[str]):
    return labels if version == "2.1" else mdl.TopicLabels(label=labels)


def _add_comment(mdl, version: str, handler, text: str, when: _dt.datetime, key: str) -> None:
    c = mdl.Comment(
        date=_when(when),
        author=AUTHOR,
        comment=text,
        guid=str(stable_uuid(key)),
    )
    if version == "2.1":
        handler.markup.comment.append(c)
    else:
        t = handler.topic
        if t.comments is None:
            t.comments = mdl.TopicComments()
        t.comments.comment.append(c)


def _comment_guids(version: str, handler) -> set[str]:
    if version == "2.1":
        return {c.guid for c in handler.markup.comment}
    cs = handler.topic.comments
    return {c.guid for c in cs.comment} if cs is not None else set()


def _labels_of(version: str, topic) -> list[str]:
    if version == "2.1":
        return list(topic.labels or [])
    return list(topic.labels.label) if topic.labels is not None else []


def _open_existing(bx, target: Path, version: str):
    """The earlier BCF of ours at the target and its topics, or (None, {})."""
    if not (target.exists() and target.stat().st_size > 0):
        return None, {}
    if not zipfile.is_zipfile(target):
        raise OutputError(
            f"{target}: exists but is not a BCF file (not a zip archive); choose another "
            "path or delete it"
        )
    old = bx.BcfXml.load(target)
    try:
        _ = old.version
        return old, dict(old.topics)
    except Exception as exc:  # a file of another kind or version
        raise OutputError(
            f"{target}: exists but is not a BCF {version} file this tool can update "
            f"({type(exc).__name__}); choose another path or delete it"
        ) from exc


def _new_document(bx, mdl, version: str, project_name: str):
    doc = bx.BcfXml.create_new(project_name)
    pid = str(stable_uuid("project/" + project_name))
    project = mdl.Project(name=project_name, project_id=pid)
    if version == "2.1":
        doc.project_info = mdl.ProjectExtension(project=project, extension_schema="")
        return doc
    doc.project_info = mdl.ProjectInfo(project=project)
    doc.extensions = mdl.Extensions(
        topic_types=mdl.ExtensionsTopicTypes(topic_type=list(TOPIC_TYPES.values())),
        topic_statuses=mdl.ExtensionsTopicStatuses(topic_status=[OPEN, CLOSED]),
        priorities=mdl.ExtensionsPriorities(priority=list(PRIORITIES.values())),
        topic_labels=mdl.ExtensionsTopicLabels(
            topic_label=list(EXTENSION_LABELS)
        ),
    )
    return doc


def _topics(results: dict):
    """(joint, problem, description with the joint id and fingerprint) for every problem."""
    for j in results["joints"]:
        c = j["check"]
        for p in c["problems"]:
            desc = p["description"] + f"\n\nJoint {j['id']}; input fingerprint {c['fingerprint']}."
            yield j, p, desc


def write_bcf(results: dict, path: str | Path, *, version: str = "3.0") -> dict[str, int]:
    """Write (or update) the BCF issue list of a check; returns counts of what was done.

    Keys of the returned dict: ``new``, ``updated``, ``closed``, ``kept`` (topics not ours).
    A new BCF 3.0 file is written directly as XML (``_write_new_bcf3``: the library builds a
    data model per topic, minutes for a large model); updating an earlier file, or BCF 2.1,
    goes through bcf-client. Both give the same content (tested through the library).

    Raises:
        ifcjoint.errors.OutputError: the target exists and is not a BCF of that version.
    """
    target = Path(path)
    if version == "3.0" and not (target.exists() and target.stat().st_size > 0):
        return _write_new_bcf3(results, target)
    return write_bcf_with_library(results, target, version=version)


def write_bcf_with_library(
    results: dict, target: Path, *, version: str = "3.0"
) -> dict[str, int]:
    """``write_bcf`` through bcf-client: new files and updates of earlier ones."""
    bx, mdl, tp, vi = _modules(version)
    old, old_topics = _open_existing(bx, target, version)
    project_name = Path(results["model"]["path"]).name
    doc = old if old is not None else _new_document(bx, mdl, version, project_name)
    ck = results["check"]
    when = _dt.datetime.fromisoformat(ck["created"])
    tool = ck["tool_version"]
    counts = {"new": 0, "updated": 0, "unchanged": 0, "closed": 0, "kept": 0}
    current = set()
    for j, p, desc in _topics(results):
        guid = p["guid"]
        current.add(guid)
        labels = [LABEL, p["kind"], j["archetype"]]
        if guid in old_topics:
            changed = _update_topic(mdl, version, old_topics[guid], p, desc, labels, when, tool)
            counts["updated" if changed else "unchanged"] += 1
            continue
        topic = mdl.Topic(
            guid=guid,
            title=p["title"],
            description=desc,
            priority=PRIORITIES[p["severity"]],
            labels=_labels(mdl, version, labels),
            creation_date=_when(when),
            creation_author=AUTHOR,
            topic_type=TOPIC_TYPES[p["kind"]],
            topic_status=OPEN,
        )
        h = tp.TopicHandler(topic_dir=Path(guid))
        h.markup = mdl.Markup(topic=topic)
        if version == "3.0":
            h.markup.topic.viewpoints = None
        key = problem_key(j["beam"], j["beam_end"], p["kind"])
        h.add_visinfo_handler(_viewpoint(vi, mdl, key, j["point_mm"], p["elements"]))
        doc.topics[guid] = h
        counts["new"] += 1
    for guid, h in old_topics.items():
        done = _close_topic(mdl, version, h, guid, when, tool) if guid not in current else None
        if done:
            counts[done] += 1
    if old is not None and not (counts["new"] or counts["updated"] or counts["closed"]):
        doc.close()
        return counts  # nothing changed: the file is left as it was
    # Save beside the target, then rename: the old file is read until the end.
    with tempfile.TemporaryDirectory(prefix="ifcjoint-bcf-") as d:
        tmp = Path(d) / target.name
        doc.save(tmp)
        data = tmp.read_bytes()
    doc.close()
    atomic_write_bytes(target, data)
    return counts


def _update_topic(mdl, version, h, p: dict, desc: str, labels, when, tool: str) -> bool:
    """Our topic found again: new title, description and priority; reopened if closed.

    Returns whether anything of the topic changed.
    """
    guid = p["guid"]
    t = h.topic
    priority = PRIORITIES[p["severity"]]
    changed = (t.title, t.description, t.priority, t.topic_type, _labels_of(version, t)) != (
        p["title"], desc, priority, TOPIC_TYPES[p["kind"]], list(labels))
    reopened = t.topic_status == CLOSED
    t.title, t.description = p["title"], desc
    t.priority = priority
    t.topic_type = TOPIC_TYPES[p["kind"]]
    t.labels = _labels(mdl, version, labels)
    if t.topic_status == CLOSED:
        t.topic_status = OPEN
        _add_comment(mdl, version, h, f"Reopened by {AUTHOR} {tool}: the problem is found "
                     "again.", when, f"{guid}/reopen/{when.isoformat()}")
    if changed:
        t.modified_date, t.modified_author = _when(when), AUTHOR
    return changed or reopened


def _close_topic(mdl, version, h, guid: str, when, tool: str) -> str | None:
    """A topic whose problem is gone: closed if ours, kept if not; None if already closed."""
    t = h.topic
    if LABEL not in _labels_of(version, t):
        return "kept"
    if t.topic_status == CLOSED:
        return None
    t.topic_status = CLOSED
    t.modified_date, t.modified_author = _when(when), AUTHOR
    key = f"{guid}/closed/{when.isoformat()}"
    if str(stable_uuid(key)) not in _comment_guids(version, h):
        _add_comment(mdl, version, h, f"Closed by {AUTHOR} {tool}: the problem is no longer "
                     "found.", when, key)
    return "closed"


# --- a new BCF 3.0 file, written directly -------------------------------------------------

_XML_HEAD = '<?xml version="1.0" encoding="UTF-8"?>\n'
_NS = ' xmlns:xs="http://www.w3.org/2001/XMLSchema"'


def _x(text) -> str:
    """Text for XML content or an attribute value."""
    return xml_escape(str(text), {'"': "&quot;"})


def _xyz(name: str, v) -> str:
    return f"<{name}><X>{float(v[0])!r}</X><Y>{float(v[1])!r}</Y><Z>{float(v[2])!r}</Z></{name}>"


def _markup3(guid: str, p: dict, desc: str, labels: list[str], when: str, vp: str) -> str:
    lab = "".join(f"<Label>{_x(x)}</Label>" for x in labels)
    return (
        f'{_XML_HEAD}<Markup{_NS}><Topic Guid="{guid}" TopicType="{_x(TOPIC_TYPES[p["kind"]])}" '
        f'TopicStatus="{OPEN}"><Title>{_x(p["title"])}</Title>'
        f"<Priority>{PRIORITIES[p['severity']]}</Priority><Labels>{lab}</Labels>"
        f"<CreationDate>{when}</CreationDate><CreationAuthor>{AUTHOR}</CreationAuthor>"
        f"<Description>{_x(desc)}</Description><Viewpoints>"
        f'<ViewPoint Guid="{vp}"><Viewpoint>{vp}.bcfv</Viewpoint></ViewPoint>'
        "</Viewpoints></Topic></Markup>\n"
    )


def _viewpoint3(vp: str, point_mm, elements) -> str:
    from bcf.geometry import camera_vectors_from_target_position

    target = np.asarray(point_mm, dtype=float) / 1000.0
    pos, direction, up = camera_vectors_from_target_position(target, CAMERA_OFFSET_M)
    comps = "".join(f'<Component IfcGuid="{_x(e)}"/>' for e in _ifc_guids(elements))
    return (
        f'{_XML_HEAD}<VisualizationInfo{_NS} Guid="{vp}"><Components><Selection>{comps}'
        '</Selection><Visibility DefaultVisibility="true"/></Components><PerspectiveCamera>'
        f"{_xyz('CameraViewPoint', pos)}{_xyz('CameraDirection', direction)}"
        f"{_xyz('CameraUpVector', up)}<FieldOfView>60.0</FieldOfView>"
        "<AspectRatio>1.0</AspectRatio></PerspectiveCamera></VisualizationInfo>\n"
    )


def _write_new_bcf3(results: dict, target: Path) -> dict[str, int]:
    """A new BCF 3.0 archive: the same topics, labels, viewpoints as the library writes."""
    project_name = Path(results["model"]["path"]).name
    when = _dt.datetime.fromisoformat(results["check"]["created"])
    stamp = when.astimezone(_dt.UTC).strftime("%Y-%m-%dT%H:%M:%SZ")
    pid = str(stable_uuid("project/" + project_name))
    types = "".join(f"<TopicType>{_x(t)}</TopicType>" for t in TOPIC_TYPES.values())
    prios = "".join(f"<Priority>{x}</Priority>" for x in PRIORITIES.values())
    labels = EXTENSION_LABELS
    buf = io.BytesIO()
    n = 0
    with zipfile.ZipFile(buf, "w", zipfile.ZIP_DEFLATED) as z:
        z.writestr("bcf.version", f'{_XML_HEAD}<Version{_NS} VersionId="3.0"/>\n')
        z.writestr("project.bcfp", f'{_XML_HEAD}<ProjectInfo{_NS}><Project ProjectId="{pid}">'
                   f"<Name>{_x(project_name)}</Name></Project></ProjectInfo>\n")
        z.writestr("extensions.xml", (
            f"{_XML_HEAD}<Extensions{_NS}><TopicTypes>{types}</TopicTypes><TopicStatuses>"
            f"<TopicStatus>{OPEN}</TopicStatus><TopicStatus>{CLOSED}</TopicStatus>"
            f"</TopicStatuses><Priorities>{prios}</Priorities><TopicLabels>"
            + "".join(f"<TopicLabel>{_x(x)}</TopicLabel>" for x in labels)
            + "</TopicLabels></Extensions>\n"))
        for j, p, desc in _topics(results):
            guid = p["guid"]
            key = problem_key(j["beam"], j["beam_end"], p["kind"])
            vp = str(stable_uuid(key + "/viewpoint"))
            z.writestr(f"{guid}/markup.bcf",
                       _markup3(guid, p, desc, [LABEL, p["kind"], j["archetype"]], stamp, vp))
            z.writestr(f"{guid}/{vp}.bcfv", _viewpoint3(vp, j["point_mm"], p["elements"]))
            n += 1
    atomic_write_bytes(target, buf.getvalue())
    return {"new": n, "updated": 0, "unchanged": 0, "closed": 0, "kept": 0}
