"""Shared fixture for the engine tests: the power model with the product's defaults.

The unit factors are exact definitions from NIST SP 811 (2008), Appendix B; they are
written out here rather than taken from the engine so that a wrong engine constant
cannot hide itself.
"""

import pytest

from webcalc.engine import compressor, fuel
from webcalc.engine.constants import P_SEA_LEVEL, T_SEA_LEVEL

# NIST SP 811 (2008), Appendix B.8/B.9: exact definitions.
NIST_LB = 0.45359237  # kg
NIST_FT = 0.3048  # m
NIST_IN = 0.0254  # m
NIST_LBF = NIST_LB * 9.80665  # N (pound-force = pound x standard gravity)
NIST_PSI = NIST_LBF / NIST_IN**2  # Pa (6.894 757 E+03 in SP 811)
NIST_HP = 550.0 * NIST_FT * NIST_LBF  # W (horsepower, 550 ft lbf/s = 745.699 87 W)


def default_power_kwargs(na_hp, induction, intercooled, **overrides):
    """Keyword arguments of ``power.expected_power`` with the product's default settings.

    Defaults (SPEC section 4): efficiency by induction, intercooler effectiveness 0.75 if
    intercooled else 0, coolant = site temperature, ISA sea level for both runs, exhaust
    ratio 1 for a turbo and 0 for a blower, drive efficiency 0.95, NA air from gasoline at
    0.50 lb/hp/h and AFR 12.5 via ``fuel.na_air_defaults(14.7)``. ``overrides`` replace any.
    """
    na_power = na_hp * NIST_HP
    bsfc, afr = fuel.na_air_defaults(14.7)
    kwargs = dict(
        na_power=na_power,
        p_na=P_SEA_LEVEL,
        T_na=T_SEA_LEVEL,
        na_air_mass_flow=na_power * bsfc * afr,
        p_baro=P_SEA_LEVEL,
        T1=T_SEA_LEVEL,
        efficiency=compressor.DEFAULT_EFFICIENCY[induction],
        effectiveness=compressor.DEFAULT_INTERCOOLER_EFFECTIVENESS if intercooled else 0.0,
        belt_driven=induction in compressor.BELT_DRIVEN,
        drive_efficiency=compressor.DEFAULT_DRIVE_EFFICIENCY,
        exhaust_ratio=1.0 if induction == "turbo" else 0.0,
    )
    kwargs.update(overrides)
    return kwargs


@pytest.fixture
def power_defaults():
    """The :func:`default_power_kwargs` builder as a fixture."""
    return default_power_kwargs
