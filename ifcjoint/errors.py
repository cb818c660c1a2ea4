"""Exceptions for input the tool cannot use.

Every message names the file (and entity or line where there is one), the value found and
what was expected. Check outcomes are data, never exceptions.
"""

from __future__ import annotations


class IfcjointError(Exception):
    """Base of every error ifcjoint raises on purpose."""


class ModelError(IfcjointError):
    """The model file cannot be used: missing, not IFC, truncated, unsupported schema, no units."""

    def __init__(self, path: str, problem: str, expected: str | None = None) -> None:
        self.path = path
        self.problem = problem
        self.expected = expected
        msg = f"{path}: {problem}"
        if expected:
            msg += f" (expected {expected})"
        super().__init__(msg)


class NoSteelError(IfcjointError):
    """The model was read but holds no steel beams or columns to scan."""

    def __init__(self, path: str, detail: str) -> None:
        self.path = path
        super().__init__(f"{path}: no steel beams or columns found to scan ({detail})")


class ConfigError(IfcjointError):
    """A configuration value or rules file is not usable."""


class DemandsError(IfcjointError):
    """The demands CSV cannot be used at all (missing, not text, wrong header)."""

    def __init__(self, path: str, line: int, problem: str) -> None:
        self.path = path
        self.line = line
        self.problem = problem
        where = f"{path}:{line}" if line else path
        super().__init__(f"{where}: {problem}")
