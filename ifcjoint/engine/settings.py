"""Choices for the check where the model is silent, and the design code it follows."""

from __future__ import annotations

from dataclasses import dataclass

from ifcjoint.ec3.code import EN_1993_1_8, Eurocode3
from ifcjoint.ec3.params import Parameters

#: Design codes by name: the check records the name, renderers look the code up here.
DESIGN_CODES: dict[str, Eurocode3] = {EN_1993_1_8.name: EN_1993_1_8}


def design_code(name: str) -> Eurocode3:
    """The design-code object of that name (clause citations, names, symbols).

    Raises:
        KeyError: no design code of that name.
    """
    return DESIGN_CODES[name]


@dataclass(frozen=True, slots=True, kw_only=True)
class CheckSettings:
    """Choices for the check where the model is silent.

    Attributes:
        code: the design code with its nationally determined parameters (EN 1993-1-8 with
            the recommended values unless a parameters file changed them).
        weld_throat_ratio: fillet weld throat as a fraction of the thickness of the part it
            joins when welds are not modelled; None (default): full-strength double fillet
            welds by the simplified method, a = t fy sqrt(3) beta_w gamma_M2 / (2 fu)
            (EN 1993-1-8 4.5.3.3), rounded up to the mm.
        strength_basis: ``EN 1993-1-1`` (Table 3.1) or ``EN 10025`` (product standard).
        braced: frame braced (kb = 8) or not (kb = 25) for the stiffness classification.
        alpha_method: alpha of EN 1993-1-8 Figure 6.11: ``chart`` (the chart's published
            closed form, ``ifcjoint.ec3.effective_lengths.alpha_fig_6_11``) or
            ``conservative`` (4.45, the chart's lowest value, everywhere).
    """

    code: Eurocode3 = EN_1993_1_8
    weld_throat_ratio: float | None = None
    strength_basis: str = "EN 1993-1-1"
    braced: bool = True
    alpha_method: str = "chart"

    @property
    def params(self) -> Parameters:
        """The partial factors and NDPs of the design code."""
        return self.code.params
