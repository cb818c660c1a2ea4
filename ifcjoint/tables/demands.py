"""The demands CSV: reading it (every problem with its line) and writing a template.

Format (docs/demands.md): one row per joint and load combination; lines starting with ``#``
are comments; units are the column-name suffixes and no other unit is accepted. Comma or
semicolon separated (a semicolon file may use decimal commas, as spreadsheets in many
locales write it).
"""

from __future__ import annotations

import csv
import io
import math
from collections.abc import Iterable
from dataclasses import dataclass, field
from pathlib import Path

from ifcjoint.errors import DemandsError
from ifcjoint.fileio import atomic_write_text, safe_cell
from ifcjoint.model.codes import Archetype, JointModel
from ifcjoint.model.demands import Demand
from ifcjoint.model.elements import Unreadable
from ifcjoint.model.identity import joint_id, split_key
from ifcjoint.model.joints import Joint

#: column -> (base quantity, factor to N or N mm). Units are part of the name.
NUMERIC_COLUMNS = {
    "M_Ed_kNm": ("M_Ed", 1e6),
    "V_Ed_kN": ("V_Ed", 1e3),
    "N_Ed_kN": ("N_Ed", 1e3),
    "M_Ed_other_side_kNm": ("M_other", 1e6),
    "Vc_above_kN": ("Vc_above", 1e3),
    "Vc_below_kN": ("Vc_below", 1e3),
}
REQUIRED_VALUES = ("combination", "M_Ed_kNm", "V_Ed_kN")
TEXT_COLUMNS = ("joint_id", "beam_guid", "beam_end", "combination", "frame", "assumed_joint")
#: Columns the template writes for people; read and ignored.
INFO_COLUMNS = ("label", "archetype", "column_guid", "note")
TEMPLATE_COLUMNS = (
    "joint_id",
    "beam_guid",
    "beam_end",
    "label",
    "archetype",
    "combination",
    "M_Ed_kNm",
    "V_Ed_kN",
    "N_Ed_kN",
    "M_Ed_other_side_kNm",
    "Vc_above_kN",
    "Vc_below_kN",
    "frame",
    "assumed_joint",
)
_BASES = {
    "M_Ed": "M_Ed_kNm",
    "V_Ed": "V_Ed_kN",
    "N_Ed": "N_Ed_kN",
    "M_Ed_other_side": "M_Ed_other_side_kNm",
    "Vc_above": "Vc_above_kN",
    "Vc_below": "Vc_below_kN",
}

TEMPLATE_HEADER = """\
# ifcjoint demands: one row per joint and load combination (docs/demands.md).
# Identify a joint by joint_id, or by beam_guid + beam_end (start|end).
# Units are in the column names: kNm, kN. Signs: M_Ed < 0 hogging (top flange in tension),
# M_Ed > 0 sagging; M_Ed_other_side: the moment of the beam on the opposite column face, same
# convention seen from that beam (double-sided joints). N_Ed > 0 tension in the beam.
# Vc_above_kN / Vc_below_kN: column shears above and below (EN 1993-1-8 5.3(3)); leave empty
# if unknown (taken as 0, reported). frame: braced|unbraced. assumed_joint: what the analysis
# model assumed, rigid|semi-rigid|pinned (compared with the joint's stiffness class).
# fin_plate rows: nominally pinned, shear only: M_Ed_kNm stays 0 (any moment fails them).
# Several combinations per joint: add one row each. Lines starting with # are ignored.
"""


@dataclass(frozen=True, slots=True, kw_only=True)
class DemandProblem:
    """A rejected row (or a warning about one), with where it is."""

    path: str
    line: int
    message: str
    severity: str = "error"  # error: row rejected | warning: row used

    def __str__(self) -> str:
        return f"{self.path}:{self.line}: {self.message}"


@dataclass(slots=True, kw_only=True)
class DemandsTable:
    """Demands read from a CSV, by joint id, with what was rejected."""

    path: str
    by_joint: dict[str, list[Demand]] = field(default_factory=dict)
    problems: list[DemandProblem] = field(default_factory=list)
    rows_read: int = 0
    rows_rejected: int = 0
    #: rows naming a beam the model holds but that could not be read: element -> lines
    unreadable_rows: dict[str, list[int]] = field(default_factory=dict)

    @property
    def rows_used(self) -> int:
        """Rows that became demands."""
        return sum(len(v) for v in self.by_joint.values())


def _number(text: str, decimal_comma: bool) -> float:
    t = text.strip().replace("\u2212", "-")
    if decimal_comma:
        t = t.replace(".", "").replace(",", ".") if "," in t else t
    v = float(t)
    if not math.isfinite(v):
        raise ValueError(text)
    return v


def _header_problems(header: list[str]) -> list[str]:
    """Wrong units and missing columns in the header line."""
    problems = []
    names = set(header)
    for h in header:
        if h in NUMERIC_COLUMNS or h in TEXT_COLUMNS or h in INFO_COLUMNS:
            continue
        for base, proper in sorted(_BASES.items(), key=lambda kv: -len(kv[0])):
            if h == base or (h.startswith(base + "_") and h not in NUMERIC_COLUMNS):
                unit = h[len(base) + 1 :] or "(none)"
                if base == "M_Ed" and unit.startswith("other_side"):
                    continue
                problems.append(
                    f"column '{h}': unit {unit!r} is not accepted; name it '{proper}' and give "
                    "the values in that unit (no conversion is guessed)"
                )
                break
    for col in REQUIRED_VALUES:
        if col not in names:
            problems.append(f"required column '{col}' missing")
    if "joint_id" not in names and not {"beam_guid", "beam_end"} <= names:
        problems.append("no way to identify joints: give 'joint_id', or 'beam_guid' and 'beam_end'")
    return problems


def _records(p: str, text: str) -> list[tuple[int, list[str], str]]:
    """The CSV's records as RFC 4180 reads them, each with the line it starts on.

    A quoted cell may hold line breaks (the record then spans several lines, and its line
    number is that of its first). Blank lines and lines starting with ``#`` outside a quoted
    cell are skipped. The delimiter is ``;`` when the header has more of them than commas
    (files written with a decimal comma), else ``,``.

    Raises:
        DemandsError: a quoted cell never closed, or a cell beyond the size limit.
    """
    lines = text.replace("\r\n", "\n").replace("\r", "\n").split("\n")
    starts: list[int] = []  # the physical line each non-comment line is
    kept: list[str] = []
    inside = False
    for no, ln in enumerate(lines, start=1):
        if not inside and (not ln.strip() or ln.lstrip().startswith("#")):
            continue
        starts.append(no)
        kept.append(ln)
        inside = inside != (ln.count('"') % 2 == 1)
    if inside:
        opened, was = 0, False
        for no, now in zip(starts, _opens(kept), strict=True):
            opened = no if now and not was else opened
            was = now
        raise DemandsError(p, opened, "a quoted cell opened on this line is never closed (a "
                           "quoted cell ends with a second double quote)")
    if not kept:
        return []
    head = kept[0]
    delim = ";" if head.count(";") > head.count(",") else ","
    reader = csv.reader((ln + "\n" for ln in kept), delimiter=delim)
    out = []
    used = 0
    try:
        for cells in reader:
            out.append((starts[used], cells, delim))
            used = reader.line_num
    except csv.Error as exc:
        at = starts[min(used, len(starts) - 1)]
        raise DemandsError(p, at, f"cannot read the CSV from this line on ({exc}); a quoted "
                           "cell must be closed by a second double quote") from exc
    return out


def _opens(lines: list[str]) -> list[bool]:
    """For each line, whether a quoted cell is still open at its end."""
    out, inside = [], False
    for ln in lines:
        inside = inside != (ln.count('"') % 2 == 1)
        out.append(inside)
    return out


def _decode(p: str, raw: bytes) -> str:
    try:
        return raw.decode("utf-8-sig")
    except UnicodeDecodeError:
        try:
            return raw.decode("cp1252")
        except UnicodeDecodeError as exc:
            raise DemandsError(p, 0, "not a text file (expected UTF-8 CSV)") from exc


class _RowError(ValueError):
    """A row that cannot be used; the message says why."""


class _UnreadableRow(_RowError):
    """A row naming a beam of the model that could not be read."""

    def __init__(self, element: str, message: str) -> None:
        super().__init__(message)
        self.element = element


@dataclass(slots=True)
class _Reader:
    """What every row is read against: the file, its format and the scan's joints."""

    path: str
    header: list[str]
    delim: str
    by_id: dict[str, Joint]
    by_beam: dict[tuple[str, str], Joint]
    seen: dict[tuple[str, str], int] = field(default_factory=dict)
    #: joint ids and beam keys of beams that could not be read -> (element, why)
    unreadable: dict[str, tuple[str, str]] = field(default_factory=dict)

    def _not_read(self, key: str) -> _RowError | None:
        hit = self.unreadable.get(key)
        if hit is None:
            return None
        element, why = hit
        return _UnreadableRow(element, f"beam {element} could not be read ({why}): its joints "
                              "are not checked; fix the model")

    def _closest(self, jid: str) -> str:
        """A "did you mean" hint: the joint ids or labels closest to a wrong id."""
        import difflib

        near = difflib.get_close_matches(jid, list(self.by_id), n=2, cutoff=0.6)
        if not near:
            labels = {j.label: j.id for j in self.by_id.values()}
            near = [f"{labels[x]} ({x})" for x in
                    difflib.get_close_matches(jid, list(labels), n=2, cutoff=0.6)]
        return f" (did you mean {' or '.join(near)}?)" if near else ""

    @property
    def decimal_comma(self) -> bool:
        return self.delim == ";"

    def joint_of(self, row: dict[str, str]) -> Joint:
        """The joint a row names, by joint_id or by beam GlobalId and end."""
        jid = row.get("joint_id", "")
        bg, be = row.get("beam_guid", ""), row.get("beam_end", "").lower()
        if jid:
            joint = self.by_id.get(jid)
            if joint is None:
                raise self._not_read(jid) or _RowError(
                    f"unknown joint_id {jid!r} (not a joint of this model's scan)"
                    + self._closest(jid))
            if bg and (joint.beam != bg or (be and joint.beam_end != be)):
                raise _RowError(
                    f"joint_id {jid!r} is beam {joint.beam} {joint.beam_end}, but the row "
                    f"says beam {bg} {be or '?'}"
                )
            return joint
        if bg:
            if be not in ("start", "end"):
                raise _RowError(f"beam_end {row.get('beam_end', '')!r}: expected 'start' or 'end'")
            joint = self.by_beam.get((bg, be))
            if joint is None:
                raise self._not_read(bg) or _RowError(
                    f"no joint at the {be} of beam {bg!r} in this model")
            return joint
        raise _RowError("no joint_id and no beam_guid: the row names no joint")

    def values(self, row: dict[str, str]) -> dict[str, float | None]:
        """The numeric cells in N and N mm (empty cells None)."""
        missing = [c for c in REQUIRED_VALUES if not row.get(c, "")]
        if missing:
            raise _RowError(f"missing required value(s): {', '.join(missing)}")
        values: dict[str, float | None] = {}
        bad = []
        for col, (key, factor) in NUMERIC_COLUMNS.items():
            cell = row.get(col, "")
            if not cell:
                values[key] = None
                continue
            try:
                values[key] = _number(cell, self.decimal_comma) * factor
            except ValueError:
                bad.append(f"{col} = {cell!r} is not a number")
        if bad:
            raise _RowError("; ".join(bad))
        return values

    def demand(self, line: int, cells: list[str], table: DemandsTable) -> tuple[Joint, Demand]:
        """One row as a demand on its joint; warnings go into the table."""
        header = self.header
        if len(cells) > len(header) and any(c.strip() for c in cells[len(header) :]):
            raise _RowError(f"{len(cells)} cells but the header has {len(header)} columns")
        row = {h: (cells[k].strip() if k < len(cells) else "") for k, h in enumerate(header)}
        joint = self.joint_of(row)
        values = self.values(row)
        frame = row.get("frame", "").lower()
        if frame not in ("", "braced", "unbraced"):
            raise _RowError(f"frame {row['frame']!r}: expected 'braced' or 'unbraced'")
        assumed = row.get("assumed_joint", "").lower().replace("semirigid", "semi-rigid")
        models = tuple(m.value for m in JointModel)
        if assumed not in ("", *models):
            raise _RowError(f"assumed_joint {row['assumed_joint']!r}: expected one of {models}")
        comb = row["combination"]
        if (joint.id, comb) in self.seen:
            raise _RowError(
                f"joint {joint.id} ({joint.label}) has combination {comb!r} already on line "
                f"{self.seen[(joint.id, comb)]}"
            )
        self.seen[(joint.id, comb)] = line
        if values["M_other"] is not None and joint.partner is None:
            table.problems.append(
                DemandProblem(
                    path=self.path,
                    line=line,
                    message=(
                        f"M_Ed_other_side_kNm given but joint {joint.id} has no beam on the "
                        "opposite face: ignored"
                    ),
                    severity="warning",
                )
            )
            values["M_other"] = None
        return joint, Demand(
            combination=comb,
            M_Ed=values["M_Ed"],
            V_Ed=values["V_Ed"],
            N_Ed=values["N_Ed"] or 0.0,
            M_other=values["M_other"],
            Vc_above=values["Vc_above"],
            Vc_below=values["Vc_below"],
            braced=None if not frame else frame == "braced",
            assumed_joint=JointModel(assumed) if assumed else None,
            source=f"{Path(self.path).name}:{line}",
        )


def read_demands(
    path: str | Path,
    joints: tuple[Joint, ...] | list[Joint],
    unreadable: Iterable[Unreadable] = (),
) -> DemandsTable:
    """Read a demands CSV against the joints of a scan.

    Every row problem is recorded with its line number and the row is skipped; the other rows
    are used. A row naming a beam that is in the model but could not be read (``unreadable``,
    from the scan) says so, and is listed against that beam. A file that cannot be used at
    all raises.

    Raises:
        ifcjoint.errors.DemandsError: the file is missing, unreadable, empty or its header is
            wrong (message names the file, the line and what was expected).
    """
    p = str(path)
    try:
        raw = Path(path).read_bytes()
    except OSError as exc:
        raise DemandsError(p, 0, f"cannot read the file ({exc.strerror or exc})") from exc
    records = _records(p, _decode(p, raw))
    if not records:
        raise DemandsError(p, 0, "no header line (expected a CSV with a header row)")
    head_line, head, delim = records[0]
    header = [h.strip() for h in head]
    hp = _header_problems(header)
    if hp:
        raise DemandsError(p, head_line, "; ".join(hp))
    table = DemandsTable(path=p)
    unknown = [h for h in header if h not in (*NUMERIC_COLUMNS, *TEXT_COLUMNS, *INFO_COLUMNS)]
    if unknown:
        table.problems.append(
            DemandProblem(
                path=p,
                line=head_line,
                message=f"column(s) not used: {', '.join(unknown)}",
                severity="warning",
            )
        )
    rd = _Reader(
        path=p,
        header=header,
        delim=delim,
        by_id={j.id: j for j in joints},
        by_beam={(j.beam, j.beam_end): j for j in joints},
        unreadable={k: (u.element, u.reason) for u in unreadable
                    for k in (u.element, split_key(u.element)[0],
                              joint_id(u.element, "start"), joint_id(u.element, "end"))},
    )
    for line, cells, _ in records[1:]:
        if not any(c.strip() for c in cells):
            continue  # a row of empty cells, as spreadsheets leave below the data
        table.rows_read += 1
        try:
            joint, demand = rd.demand(line, cells, table)
        except _RowError as exc:
            table.problems.append(DemandProblem(path=p, line=line, message=str(exc)))
            table.rows_rejected += 1
            if isinstance(exc, _UnreadableRow):
                table.unreadable_rows.setdefault(exc.element, []).append(line)
            continue
        table.by_joint.setdefault(joint.id, []).append(demand)
    _pair_partners(table, rd.by_id)
    return table


def _pair_partners(table: DemandsTable, by_id: dict[str, Joint]) -> None:
    """Fill the other side's moment (and shear) of a double-sided joint from the partner's row.

    When both beams of a double-sided joint have a row for the same combination and the row
    does not give ``M_Ed_other_side_kNm``, the partner's M_Ed is used (EN 1993-1-8 5.3: beta
    and the web panel shear need both moments). A given value that disagrees with the partner's
    row by more than 1 % (and 1 kNm) is kept and warned about. The partner's V_Ed is kept as
    ``V_other`` (a supporting web takes the reactions of both sides).
    """
    from dataclasses import replace

    for jid, rows in table.by_joint.items():
        partner = by_id[jid].partner
        if partner is None or partner not in table.by_joint:
            continue
        theirs = {d.combination: d for d in table.by_joint[partner]}
        for k, d in enumerate(rows):
            o = theirs.get(d.combination)
            if o is None:
                continue
            rows[k] = d = replace(d, V_other=o.V_Ed)
            if d.M_other is None:
                rows[k] = replace(d, M_other=o.M_Ed, other_source=o.source)
            elif abs(d.M_other - o.M_Ed) > max(0.01 * abs(o.M_Ed), 1e6):
                line = int(d.source.rsplit(":", 1)[1]) if ":" in d.source else 0
                table.problems.append(
                    DemandProblem(
                        path=table.path,
                        line=line,
                        message=(
                            f"M_Ed_other_side_kNm {d.M_other / 1e6:g} differs from the "
                            f"opposite beam's own M_Ed {o.M_Ed / 1e6:g} ({o.source}) for "
                            f"{d.combination!r}: the value on this row is used"
                        ),
                        severity="warning",
                    )
                )


def write_template(joints, path: str | Path) -> int:
    """Write a demands template: one row per joint, values empty, ready to fill.

    Returns the number of rows written. Written to a temporary file and renamed.
    """
    buf = io.StringIO()
    buf.write(TEMPLATE_HEADER)
    w = csv.writer(buf, lineterminator="\n")
    w.writerow(TEMPLATE_COLUMNS)
    n = 0
    for j in joints:
        w.writerow(
            [
                j.id,
                j.beam,
                j.beam_end,
                safe_cell(j.label),
                j.archetype,
                "",
                "0" if Archetype(j.archetype).pinned else "",  # pinned: it carries no moment
                "",
                "",
                "",
                "",
                "",
                "",
                "",
            ]
        )
        n += 1
    atomic_write_text(path, buf.getvalue())
    return n
