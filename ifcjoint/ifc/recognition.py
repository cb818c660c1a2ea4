"""Recognition rules (data in ``ifcjoint/data/recognition.toml``) compiled for use.

The rules decide whether a member is steel, what kind a fastener element is, and which
non-IfcPlate elements are plates. Users extend them with a TOML file of the same shape.
"""

from __future__ import annotations

import re
import tomllib
from dataclasses import dataclass
from importlib import resources
from pathlib import Path

from ifcjoint.errors import ConfigError
from ifcjoint.model.codes import FastenerKind, SteelState


@dataclass(frozen=True, slots=True)
class FastenerRule:
    """One fastener rule: classes it applies to, fields it reads, its pattern and kind."""

    classes: frozenset[str]
    fields: tuple[str, ...]
    pattern: re.Pattern[str]
    kind: FastenerKind


@dataclass(frozen=True, slots=True)
class Rules:
    """Compiled recognition rules."""

    member_as_column: frozenset[str]
    member_as_beam: frozenset[str]
    vertical_within_deg: float
    horizontal_within_deg: float
    steel_material: tuple[re.Pattern[str], ...]
    steel_profile_types: frozenset[str]
    steel_profile_names: tuple[re.Pattern[str], ...]
    non_steel: tuple[re.Pattern[str], ...]
    fastener_classes: frozenset[str]
    default_bolt: frozenset[str]
    fastener_rules: tuple[FastenerRule, ...]
    plate_classes: frozenset[str]
    plate_fields: tuple[str, ...]
    plate_pattern: re.Pattern[str] | None
    bolt_shape_classes: frozenset[str] = frozenset()
    bolt_shape_diameter: tuple[float, float] = (8.0, 48.0)
    bolt_shape_length: tuple[float, float] = (15.0, 500.0)

    def looks_like_bolt(self, ifc_class: str, diameter_mm: float, length_mm: float) -> bool:
        """True when an unrecognised element's cylindrical body has a bolt's size."""
        if ifc_class not in self.bolt_shape_classes:
            return False
        d0, d1 = self.bolt_shape_diameter
        l0, l1 = self.bolt_shape_length
        return d0 <= diameter_mm <= d1 and l0 <= length_mm <= l1 and length_mm > diameter_mm

    def steel_state(self, material: str, profile_type: str, profile_name: str) -> SteelState:
        """Steel, not steel or unknown from material and profile text."""
        if material and any(p.search(material) for p in self.non_steel):
            return SteelState.NON_STEEL
        if material and any(p.search(material) for p in self.steel_material):
            return SteelState.STEEL
        if profile_type in self.steel_profile_types:
            return SteelState.STEEL
        if profile_name and any(p.search(profile_name) for p in self.steel_profile_names):
            return SteelState.STEEL
        return SteelState.UNKNOWN

    def fastener_kind(self, ifc_class: str, texts: dict[str, str]) -> FastenerKind | None:
        """Kind of a fastener-like element, or None when no rule makes it a fastener."""
        for rule in self.fastener_rules:
            if ifc_class not in rule.classes:
                continue
            for f in rule.fields:
                t = texts.get(f) or ""
                if t and rule.pattern.search(t):
                    return rule.kind
        if ifc_class in self.default_bolt:
            return FastenerKind.BOLT
        if ifc_class in ("IfcFastener",):
            return FastenerKind.OTHER
        return None

    def is_plate(self, ifc_class: str, texts: dict[str, str]) -> bool:
        """True when a non-IfcPlate element reads as a plate by its text."""
        if ifc_class not in self.plate_classes or self.plate_pattern is None:
            return False
        return any(self.plate_pattern.search(texts.get(f) or "") for f in self.plate_fields)


def _compile(patterns: list[str], where: str) -> tuple[re.Pattern[str], ...]:
    out = []
    for p in patterns:
        try:
            out.append(re.compile(p.replace("(?i)", ""), re.IGNORECASE))
        except re.error as exc:
            raise ConfigError(f"{where}: bad pattern {p!r}: {exc}") from exc
    return tuple(out)


def _fastener_kind(kind: object, where: str) -> FastenerKind:
    try:
        return FastenerKind(kind)
    except ValueError:
        kinds = ", ".join(k.value for k in FastenerKind)
        raise ConfigError(
            f"{where}: fastener rule kind {kind!r} is not one of {kinds}"
        ) from None


def _merge(base: dict, extra: dict) -> dict:
    out = dict(base)
    for k, v in extra.items():
        if isinstance(v, dict) and isinstance(out.get(k), dict):
            out[k] = _merge(out[k], v)
        elif isinstance(v, list) and isinstance(out.get(k), list):
            out[k] = list(v) + list(out[k])  # user rules first, so they win
        else:
            out[k] = v
    return out


def load_rules(extra: str | Path | None = None) -> Rules:
    """Load the bundled rules, extended by a user TOML file when given.

    Args:
        extra: path of a TOML file shaped like the bundled one; its lists come first.

    Raises:
        ConfigError: the file is missing or not valid TOML, or a pattern does not compile.
    """
    text = resources.files("ifcjoint").joinpath("data/recognition.toml").read_text("utf-8")
    data = tomllib.loads(text)
    where = "recognition.toml"
    if extra is not None:
        try:
            data = _merge(data, tomllib.loads(Path(extra).read_text("utf-8")))
        except (OSError, UnicodeDecodeError, tomllib.TOMLDecodeError) as exc:
            why = exc.strerror if isinstance(exc, OSError) and exc.strerror else exc
            raise ConfigError(f"{extra} (--rules): cannot read recognition rules: {why}") from exc
        where = str(extra)
    try:
        return _build_rules(data, where)
    except ConfigError:
        raise
    except (KeyError, TypeError, ValueError, AttributeError) as exc:
        raise ConfigError(
            f"{where}: recognition rules not shaped like ifcjoint/data/recognition.toml "
            f"({type(exc).__name__}: {exc})") from exc


def _build_rules(data: dict, where: str) -> Rules:
    """The rules from the merged TOML tables (see ``load_rules``)."""
    m, s, f, p = data["members"], data["steel"], data["fasteners"], data.get("plates", {})
    rules = []
    for r in f.get("rule", []):
        for pat in _compile([r["pattern"]], where):
            kind = _fastener_kind(r.get("kind"), where)
            rules.append(FastenerRule(frozenset(r["classes"]), tuple(r["fields"]), pat, kind))
    plate_pat = _compile([p["pattern"]], where)[0] if p.get("pattern") else None
    shape = f.get("bolt_shape", {})
    return Rules(
        member_as_column=frozenset(m.get("member_as_column", [])),
        member_as_beam=frozenset(m.get("member_as_beam", [])),
        vertical_within_deg=float(m.get("vertical_within_deg", 20.0)),
        horizontal_within_deg=float(m.get("horizontal_within_deg", 30.0)),
        steel_material=_compile(s.get("material_patterns", []), where),
        steel_profile_types=frozenset(s.get("profile_types", [])),
        steel_profile_names=_compile(s.get("profile_patterns", []), where),
        non_steel=_compile(s.get("non_steel_patterns", []), where),
        fastener_classes=frozenset(f.get("fastener_classes", [])),
        default_bolt=frozenset(f.get("default_bolt", [])),
        fastener_rules=tuple(rules),
        plate_classes=frozenset(p.get("classes", [])),
        plate_fields=tuple(p.get("fields", [])),
        plate_pattern=plate_pat,
        bolt_shape_classes=frozenset(shape.get("classes", [])),
        bolt_shape_diameter=tuple(shape.get("diameter_mm", (8.0, 48.0))),
        bolt_shape_length=tuple(shape.get("length_mm", (15.0, 500.0))),
    )
