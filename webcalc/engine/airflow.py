"""Air mass and volume flow, corrected flow for compressor maps, volumetric efficiency."""

from .constants import P_SEA_LEVEL, R_DRY, T_SEA_LEVEL

VALID = {
    "displacement": (0.05e-3, 30e-3),  # m^3
    "rpm": (500.0, 30000.0),  # rev/min
    "reference_pressure": (50e3, 110e3),  # Pa
    "reference_temperature": (200.0, 350.0),  # K
    "compressor_count": (1, 16),
}
#: Plausible band of implied volumetric efficiency (common practice, from memory).
PLAUSIBLE_VOLUMETRIC_EFFICIENCY = (0.5, 1.3)
DEFAULT_REFERENCE_PRESSURE = P_SEA_LEVEL
DEFAULT_REFERENCE_TEMPERATURE = T_SEA_LEVEL


def air_mass_flow(power, bsfc, afr):
    """Engine air mass flow for a power: ``m_air = P bsfc AFR``.

    :param power: crank power, [W]
    :param bsfc: brake specific fuel consumption, [kg/J]
    :param afr: air-fuel ratio by mass, [-]
    :returns: air mass flow, [kg/s]

    >>> from webcalc.engine.constants import HP, LB, LB_PER_HP_H
    >>> round(float(air_mass_flow(HP, 0.5 * LB_PER_HP_H, 12.5) * 60 / LB * 60), 4)
    6.25

    (6.25 lb/h per hp: about 9.6 hp per lb/min of air.) References: Heywood (1988),
    eq. 2.24 and 2.29 (definitions of sfc and AFR).
    """
    return power * bsfc * afr


def gas_density(p_abs, T):
    """Dry-air density by the ideal gas law, ``rho = P / (R_d T)``, [kg/m^3]."""
    return p_abs / (R_DRY * T)


def volume_flow(mass_flow, p_abs, T):
    """Volume flow of air at a pressure and temperature: ``V = m R_d T / P``, [m^3/s]."""
    return mass_flow / gas_density(p_abs, T)


def corrected_flow(mass_flow, p1, T1, p_ref=DEFAULT_REFERENCE_PRESSURE, T_ref=DEFAULT_REFERENCE_TEMPERATURE):
    """Corrected mass flow for reading a compressor map.

    ``m_corr = m sqrt(T1 / T_ref) / (P1 / P_ref)``.

    :param mass_flow: air through one compressor, [kg/s]
    :param p1: compressor inlet pressure, absolute, [Pa]
    :param T1: compressor inlet temperature, [K]
    :param p_ref: the map's reference pressure, [Pa]
    :param T_ref: the map's reference temperature, [K]
    :returns: corrected flow, [kg/s]

    >>> round(float(corrected_flow(0.3, 101325.0 / 2, 288.15)), 12)
    0.6

    References: SAE J922 (turbocharger nomenclature), corrected flow definition; Watson
    and Janota (1982), sec. 4.2.
    """
    return mass_flow * (T1 / T_ref) ** 0.5 / (p1 / p_ref)


def volumetric_efficiency(mass_flow, rho_manifold, displacement, rpm):
    """Implied volumetric efficiency of a four-stroke engine, relative to manifold density.

    ``VE = m / (rho_m V_d N / 120)``, N in rev/min (two revolutions per cycle).

    :param mass_flow: engine air mass flow, [kg/s]
    :param rho_manifold: charge density in the manifold, [kg/m^3]
    :param displacement: swept volume, [m^3]
    :param rpm: engine speed, [rev/min] (a plain number; never pint's rpm)
    :returns: volumetric efficiency, [-]

    >>> round(float(volumetric_efficiency(1.225 * 2e-3 * 6000 / 120, 1.225, 2e-3, 6000)), 12)
    1.0

    References: Heywood (1988), eq. 2.27.
    """
    return mass_flow / (rho_manifold * displacement * rpm / 120.0)
