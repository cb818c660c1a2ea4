"""Partial factors and nationally determined parameters, in one frozen object.

Recommended values of EN 1993-1-1 / EN 1993-1-8 by default; a National Annex may change them.
Passed explicitly to every formula that needs them: there is no global "current code" switch.
"""

from __future__ import annotations

from dataclasses import dataclass


@dataclass(frozen=True, slots=True, kw_only=True)
class Parameters:
    """Partial factors and constants used by the check.

    Attributes:
        gamma_M0: resistance of cross-sections, EN 1993-1-1 6.1(1) (recommended 1.0).
        gamma_M1: resistance to instability, EN 1993-1-1 6.1(1) (recommended 1.0).
        gamma_M2: bolts, welds, plates in bearing, EN 1993-1-8 Table 2.1 (recommended 1.25).
        E: modulus of elasticity, MPa, EN 1993-1-1 3.2.6(1).
        k2: bolt tension factor, EN 1993-1-8 Table 3.4 (0.9; 0.63 for countersunk bolts).
        kb_braced: rigid-joint boundary factor for frames whose bracing reduces horizontal
            displacement by at least 80 %, EN 1993-1-8 5.2.2.5(1).
        kb_unbraced: the same for other frames.
        gamma_Mu: resistance to tying forces of nominally pinned joints (an accidental
            design situation; 1.1 in the design guide for pinned joints and in some National
            Annexes; not a factor of EN 1993-1-8 itself).
    """

    gamma_M0: float = 1.0  # the code's symbol
    gamma_M1: float = 1.0
    gamma_M2: float = 1.25
    E: float = 210_000.0
    k2: float = 0.9
    kb_braced: float = 8.0
    kb_unbraced: float = 25.0
    gamma_Mu: float = 1.1

    def as_dict(self) -> dict:
        """The values, for reports."""
        return {k: getattr(self, k) for k in self.__slots__}

    @classmethod
    def from_toml(cls, path) -> Parameters:
        """Parameters from a small TOML file (any subset of the fields; others recommended).

        Example file::

            # UK National Annex partial factors
            gamma_M0 = 1.0
            gamma_M2 = 1.25

        Raises:
            ValueError: unknown keys, or values that are not positive numbers (the message names
                the file and the key).
        """
        import tomllib
        from pathlib import Path

        data = tomllib.loads(Path(path).read_text("utf-8"))
        known = set(cls.__slots__)
        unknown = sorted(set(data) - known)
        if unknown:
            raise ValueError(
                f"{path}: unknown parameter(s) {', '.join(unknown)}; "
                f"expected some of {', '.join(sorted(known))}"
            )
        for k, v in data.items():
            if not isinstance(v, (int, float)) or isinstance(v, bool) or v <= 0:
                raise ValueError(f"{path}: {k} = {v!r} is not a positive number")
        return cls(**{k: float(v) for k, v in data.items()})


RECOMMENDED = Parameters()
