"""Exceptions for input the tool cannot use, each carrying its exit code.

Every message names the file (and entity or line where there is one), the value found and
what was expected. Check outcomes are data, never exceptions. The command line exits with the
``exit_code`` of the exception it catches (README, "Exit codes").
"""

from __future__ import annotations

#: Exit codes of the command line (README "Exit codes"; ``ifcjoint --help``).
EXIT_OK = 0
EXIT_GATE = 1
EXIT_USAGE = 2
EXIT_INPUT = 3
EXIT_NO_STEEL = 4
EXIT_INTERNAL = 5


class IfcjointError(Exception):
    """Base of every error ifcjoint raises on purpose."""

    exit_code = EXIT_INTERNAL


class UsageError(IfcjointError):
    """The command was asked for something it cannot do (e.g. an output over the input)."""

    exit_code = EXIT_USAGE


class OutputError(IfcjointError):
    """An output cannot be written where asked (the path names it)."""

    exit_code = EXIT_USAGE


class ModelError(IfcjointError):
    """The model file cannot be used: missing, not IFC, truncated, unsupported schema, no units."""

    exit_code = EXIT_INPUT

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

    exit_code = EXIT_NO_STEEL

    def __init__(self, path: str, detail: str) -> None:
        self.path = path
        super().__init__(f"{path}: no steel beams or columns found to scan ({detail})")


class ConfigError(IfcjointError):
    """A configuration value, rules file or parameters file is not usable."""

    exit_code = EXIT_INPUT


class DemandsError(IfcjointError):
    """The demands CSV cannot be used at all (missing, not text, wrong header)."""

    exit_code = EXIT_INPUT

    def __init__(self, path: str, line: int, problem: str) -> None:
        self.path = path
        self.line = line
        self.problem = problem
        where = f"{path}:{line}" if line else path
        super().__init__(f"{where}: {problem}")


class ResultsFileError(IfcjointError):
    """A results JSON given to re-render cannot be used."""

    exit_code = EXIT_INPUT


class JointFileError(IfcjointError):
    """A joint description (``ifcjoint calc``) cannot be used: the file, the key, the problem."""

    exit_code = EXIT_INPUT

    def __init__(self, path: str, key: str, problem: str) -> None:
        self.path = path
        self.key = key
        self.problem = problem
        super().__init__(f"{path}: {key}: {problem}" if key else f"{path}: {problem}")
