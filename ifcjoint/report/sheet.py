"""One joint's calculation sheet: the component rows every renderer shows, and plain text.

The text sheet is what ``ifcjoint calc`` prints: inputs, components by zone with their
clause and values used, the row distribution, resistances and classes, utilisations per
combination, notes and what could not be computed. It renders a joint of a results
dictionary (``joint["check"]``), so a scanned joint and a described one read the same.
"""

from __future__ import annotations

import math

from ifcjoint.ec3.code import Component, Zone
from ifcjoint.report.words import STATUS_WORDS

_ZONE_ORDER = {Zone.TENSION: 0, Zone.COMPRESSION: 1, Zone.SHEAR: 2, Zone.SUPPORT: 3, Zone.TYING: 4}


def fmt(v, digits: int = 1) -> str:
    """A number for a sheet (``-`` when not available)."""
    if v is None:
        return "-"
    if isinstance(v, (int, float)) and not isinstance(v, bool):
        if not math.isfinite(v):
            return "not available"
        text = f"{v:,.{digits}f}"
        return text[1:] if text.startswith("-") and not text.strip("-0.,") else text  # no "-0.0"
    return str(v)


def component_rows(check: dict, code) -> list[dict]:
    """The components of a joint's check with zone, formula and values used, by zone."""
    rows = []
    for x in check.get("components") or []:
        info = code.components.get(Component(x["component"])) if x.get("component") else None
        where = (
            f"row {x['row']}"
            if x.get("row")
            else (f"rows {x['rows'][0]}-{x['rows'][-1]}" if x.get("rows") else "")
        )
        rows.append(
            {
                **x,
                "where": where,
                "zone": info.zone if info else Zone.TENSION,
                "formula": info.formula if info else "",
                "inputs_text": ", ".join(
                    f"{k} = {fmt(v, 2) if isinstance(v, float) else v}"
                    for k, v in (x.get("inputs") or {}).items()
                    if v is not None
                ),
            }
        )
    rows.sort(key=lambda r: _ZONE_ORDER[r["zone"]])
    return rows


def _table(head: list[str], rows: list[list[str]], right: set[int] = frozenset()) -> list[str]:
    """Rows of text in aligned columns (numbers right-aligned)."""
    cells = [head, *rows]
    widths = [max(len(r[i]) for r in cells) for i in range(len(head))]

    def line(r: list[str]) -> str:
        return "  ".join(
            (c.rjust(w) if i in right else c.ljust(w)) for i, (c, w) in enumerate(zip(r, widths,
                                                                                       strict=True))
        ).rstrip()

    return [line(head), line(["-" * w for w in widths]), *(line(r) for r in rows)]


def _inputs_lines(i: dict) -> list[str]:
    out = []
    for key in ("column", "beam"):
        m = i[key]
        span = f", span {fmt(m.get('span_mm'), 0)} mm" if m.get("span_mm") else ""
        out.append(
            f"  {key:<10} {m['name'] or '(by dimensions)'} {m['grade']}: h {m['h']}, b {m['b']}, "
            f"tw {m['tw']}, tf {m['tf']}, r {m['r']} mm; fy {m['fy']:g}, fu {m['fu']:g} MPa "
            f"({m.get('strength_source') or 'given'}){span}"
        )
    p = i.get("plate")
    if p:
        out.append(
            f"  {'end plate':<10} {p['tp']:g} x {p['bp']:g} x {fmt(p['hp'], 1)} mm {p['grade']}: "
            f"fy {p['fy']:g}, fu {p['fu']:g} MPa ({p.get('strength_source') or 'given'}); "
            f"{fmt(p['projection_top'], 1)} above, {fmt(p['projection_bottom'], 1)} below the "
            "beam"
        )
    b = i.get("bolts")
    if b:
        rows = ", ".join(fmt(z, 1) for z in b["rows_from_beam_top"])
        out.append(
            f"  {'bolts':<10} M{b['d']:g} class {b['grade']} (fub {b['fub']:g} MPa), As "
            f"{b['As']:g} mm2, d0 {b['d0']:g}, gauge {b['gauge']:g} mm; rows at {rows} mm "
            "below the beam top"
        )
    w = i["welds"]
    out.append(
        f"  {'welds':<10} flanges a = {fmt(w['top_flange_throat'])} / "
        f"{fmt(w['bottom_flange_throat'])} mm, web a = {fmt(w['web_throat'])} mm"
        + (" (assumed: not modelled)" if w.get("assumed") else "")
    )
    for s in i.get("stiffeners") or []:
        out.append(
            f"  {'stiffeners':<10} pair {s['t']:g} x {fmt(s['b'], 1)} mm at "
            f"{fmt(s['level'], 1)} mm below the beam top, fy {s['fy']:g} MPa, "
            f"snipe {s['snipe']:g} mm, "
            + (f"weld leg {s['weld_leg']:g} mm" if s["weld_leg"] else "weld leg not given")
        )
    for s in i.get("web_plates") or []:
        out.append(
            f"  {'web plate':<10} {s['t']:g} x {fmt(s['b'], 1)} mm, {s['sides']} side(s), fy "
            f"{s['fy']:g} MPa"
        )
    params = ", ".join(f"{k} {v:g}" for k, v in i["params"].items())
    out.append(f"  {'factors':<10} {params}")
    alpha = f"alpha {i['alpha']:g} (given)" if i.get("alpha") else f"alpha {i.get('alpha_method')}"
    out.append(
        f"  {'choices':<10} beta {i['beta']:g} (without demands), {alpha}, frame "
        f"{'braced' if i['braced'] else 'unbraced'}"
    )
    return out


def render_sheet_text(joint: dict, results: dict, code) -> str:
    """One joint's calculation sheet as plain text (units in the headings)."""
    c = joint["check"]
    status = STATUS_WORDS[c["status"]]
    head = f"{joint['label']} ({joint['archetype']}): {status}"
    if c.get("utilisation") is not None:
        g = c["governing"]
        where = "; ".join(x for x in (g["clause"], g["combination"]) if x)
        head += f", utilisation {c['utilisation']:.3f}: {g['name']} ({where})"
    lines = [head]
    if c.get("status_reason"):
        lines.append(f"  why: {c['status_reason']}")
    lines += [f"  {results['caution']}", ""]
    i = c.get("inputs")
    if i:
        lines += ["1. Inputs (mm, MPa)", *_inputs_lines(i), ""]
    if c.get("demands"):
        rows = [[d["combination"], fmt(d["M_Ed_kNm"]), fmt(d["V_Ed_kN"]), fmt(d["N_Ed_kN"]),
                 fmt(d["M_Ed_other_side_kNm"]), d["frame"] or "", d["assumed_joint"] or ""]
                for d in c["demands"]]
        lines += ["2. Demands",
                  *("  " + x for x in _table(
                      ["combination", "M_Ed kNm", "V_Ed kN", "N_Ed kN", "M other kNm", "frame",
                       "assumed"], rows, {1, 2, 3, 4})), ""]
    comps = component_rows(c, code)
    if comps:
        rows = [[str(x["zone"]), x["name"], x["clause"], x["where"], fmt(x["F_Rd_kN"]),
                 str(x["mode"] or ""), x["inputs_text"]] for x in comps]
        lines += ["3. Components (hogging)",
                  *("  " + x for x in _table(
                      ["zone", "component", "clause", "rows", "F_Rd kN", "mode", "values used"],
                      rows, {4})), ""]
        rows = [[str(t["row"]), fmt(t["h_r_mm"]), fmt(t["F_tr_Rd_kN"], 2), t["limited_by"]]
                for t in c.get("tension_rows") or []]
        lines += [f"4. Effective tension resistance of the rows ({code.name} 6.2.7.2)",
                  *("  " + x for x in _table(["row", "h_r mm", "F_tr,Rd kN", "limited by"],
                                             rows, {1, 2})), ""]
    rs = c.get("resistance")
    if rs:
        cl = c.get("classification") or {}
        lines += [
            "5. Resistance, stiffness, classification",
            f"  Mj,Rd hogging / sagging (6.2.7.2)   {fmt(rs['Mj_Rd_hogging_kNm'], 2)} / "
            f"{fmt(rs['Mj_Rd_sagging_kNm'], 2)} kNm",
            f"  Vj,Rd (Table 3.4, 6.2.2)            {fmt(rs['Vj_Rd_kN'], 2)} kN",
            f"  Vwp,Rd (6.2.6.1)                    {fmt(rs['Vwp_Rd_kN'], 2)} kN",
            f"  Nj,Rd tension / compression         {fmt(rs['Nj_Rd_tension_kN'])} / "
            f"{fmt(rs['Nj_Rd_compression_kN'])} kN (common practice, no source)",
            f"  z (6.3.3.1)                         {fmt(rs['z_mm'])} mm",
            f"  Sj,ini hogging / sagging (6.3.1)    {fmt(rs['Sj_ini_kNm_per_rad'])} / "
            f"{fmt(rs.get('Sj_ini_sagging_kNm_per_rad'))} kNm/rad",
            f"  stiffness class (5.2.2.5)           {cl.get('stiffness', '-')}",
            f"  strength class (5.2.3)              {cl.get('strength', '-')} (hogging), "
            f"{cl.get('strength_sagging') or '-'} (sagging)",
        ]
        lines += [f"  not available ({g['sign']}): {g['reason']}" for g in c.get("gaps") or []]
        lines.append("")
    if c.get("detailing_failures"):
        lines += ["Broken rules the resistance depends on (the joint fails)"]
        lines += [f"  {u['utilisation']:.3f}  {u['name']} ({u['clause']}); {u['detail']}"
                  for u in c["detailing_failures"]]
        lines.append("")
    if c.get("combinations"):
        rows = [[cb["combination"], fmt(cb["beta"], 2), u["name"], u["clause"],
                 fmt(u["demand"], 1), fmt(u["resistance"], 1), u["unit"],
                 fmt(u["utilisation"], 3)]
                for cb in c["combinations"] for u in cb["utilisations"]]
        lines += ["6. Utilisation per combination",
                  *("  " + x for x in _table(
                      ["combination", "beta", "check", "clause", "demand", "resistance", "unit",
                       "utilisation"], rows, {1, 4, 5, 7}))]
        lines += [f"  {cb['combination']}: {n}" for cb in c["combinations"] for n in cb["notes"]]
        lines.append("")
    findings = joint.get("findings") or []
    lines += ["7. Detailing findings"]
    lines += [f"  [{f['severity']}{', fails the joint' if f.get('fails_joint') else ''}] "
              f"{f['message']} ({f['basis']})" for f in findings] or ["  none"]
    lines.append("")
    if c.get("engine_notes"):
        lines += ["Notes", *(f"  - {n}" for n in c["engine_notes"]), ""]
    if c.get("engine_reason"):
        lines += [f"Not checked: {c['engine_reason']}", ""]
    lines.append(results["caution"])
    return "\n".join(lines) + "\n"
