"""Compressor side: pressures, pressure ratio, outlet and manifold temperature, drive power.

Pressures are absolute unless the parameter says ``gauge`` or ``loss`` (a difference).
"""

import numpy as np

from .constants import CP_AIR, GAMMA_AIR

INDUCTIONS = ("turbo", "centrifugal", "roots", "twin_screw")
#: Belt-driven types whose compressor power comes off the crank.
BELT_DRIVEN = ("centrifugal", "roots", "twin_screw")

#: Default isentropic efficiency by induction (common practice, from memory).
DEFAULT_EFFICIENCY = {"turbo": 0.72, "centrifugal": 0.70, "twin_screw": 0.65, "roots": 0.55}
#: Default highest pressure ratio a compressor of each type is asked for (common practice, from memory).
DEFAULT_MAX_PRESSURE_RATIO = {"turbo": 4.0, "centrifugal": 3.5, "twin_screw": 3.0, "roots": 2.5}
#: Pressure ratio above which a caution is raised (common practice, from memory).
CAUTION_PRESSURE_RATIO = {"turbo": 3.0, "centrifugal": 3.0, "twin_screw": 2.5, "roots": 2.0}
#: Default intercooler effectiveness (common practice, from memory); 0 = no intercooler.
DEFAULT_INTERCOOLER_EFFECTIVENESS = 0.75
#: Default mechanical efficiency of a blower drive (belt and gears; common practice, from memory).
DEFAULT_DRIVE_EFFICIENCY = 0.95

VALID = {
    "boost": (0.0, 700e3),  # Pa gauge
    "loss": (0.0, 50e3),  # Pa
    "exhaust_back_pressure": (0.0, 1000e3),  # Pa gauge
    "max_pressure_ratio": (1.0, 6.0),  # exclusive at 1
    "efficiency": (0.3, 1.0),
    "effectiveness": (0.0, 1.0),
    "drive_efficiency": (0.5, 1.0),
    "coolant_temperature": (213.15, 373.15),  # K (-60 to +100 degC)
}


def pressures(p_baro, boost_gauge, inlet_loss=0.0, intercooler_loss=0.0):
    """Manifold, compressor inlet and outlet pressures, and the compressor pressure ratio.

    ``MAP = P_baro + boost``; ``P1 = P_baro - inlet_loss``; ``P2 = MAP + intercooler_loss``;
    ``PR = P2 / P1`` (total pressures; humidity is not taken out).

    :param p_baro: station pressure, absolute, [Pa]
    :param boost_gauge: boost, gauge, [Pa]
    :param inlet_loss: pressure drop of filter and inlet ducting, [Pa]
    :param intercooler_loss: pressure drop across intercooler and pipes, [Pa]
    :returns: (MAP [Pa], P1 [Pa], P2 [Pa], PR [-])
    :validity: boost 0 to 700 kPa, losses 0 to 50 kPa; P1 must stay above 0.

    >>> [round(float(x), 4) for x in pressures(100e3, 100e3, 2e3, 10e3)]
    [200000.0, 98000.0, 210000.0, 2.1429]

    References: Heywood, Internal Combustion Engine Fundamentals (1988), sec. 6.8.
    """
    map_abs = p_baro + boost_gauge
    p1 = p_baro - inlet_loss
    p2 = map_abs + intercooler_loss
    return map_abs, p1, p2, p2 / p1


def outlet_temperature(T1, pressure_ratio, efficiency):
    """Compressor outlet temperature from the isentropic efficiency.

    ``T2 = T1 (1 + (PR^((k-1)/k) - 1) / eta_c)``, k = 1.4.

    :param T1: compressor inlet temperature, [K]
    :param pressure_ratio: P2 / P1, [-]
    :param efficiency: isentropic (adiabatic) efficiency, [-] 0.3..1
    :returns: outlet temperature, [K]
    :validity: PR 1 to 6 (ideal gas, constant k).

    >>> round(float(outlet_temperature(300.0, 2.0, 0.7)), 2)
    393.86

    References: Heywood (1988), eq. 6.32; Watson and Janota, Turbocharging the Internal
    Combustion Engine (1982), ch. 4.
    """
    exponent = (GAMMA_AIR - 1.0) / GAMMA_AIR
    return T1 * (1.0 + (np.power(pressure_ratio, exponent) - 1.0) / efficiency)


def intercooler_outlet_temperature(T2, coolant_temperature, effectiveness):
    """Charge temperature after an intercooler of given effectiveness.

    ``Tm = T2 - eps (T2 - T_coolant)``; eps = 0 means no intercooler.

    :param T2: compressor outlet temperature, [K]
    :param coolant_temperature: cooling medium temperature (ambient air for air-to-air), [K]
    :param effectiveness: heat-exchanger effectiveness, [-] 0..1
    :returns: manifold temperature, [K]

    >>> round(float(intercooler_outlet_temperature(400.0, 300.0, 0.75)), 6)
    325.0

    References: Incropera and DeWitt, Fundamentals of Heat and Mass Transfer, sec. 11.4
    (effectiveness definition, air the minimum-capacity stream).
    """
    return T2 - effectiveness * (T2 - coolant_temperature)


def drive_power(air_mass_flow, T1, T2, drive_efficiency):
    """Shaft power taken from the crank by a belt-driven compressor.

    ``P = m cp (T2 - T1) / eta_drive`` (steady-flow energy equation, cp = 1005 J/(kg K)).

    :param air_mass_flow: air through the compressor, [kg/s]
    :param T1: inlet temperature, [K]
    :param T2: outlet temperature, [K]
    :param drive_efficiency: belt and gear efficiency, [-] 0.5..1
    :returns: drive power, [W]

    >>> round(float(drive_power(0.5, 300.0, 380.0, 1.0)), 3)
    40200.0

    References: Heywood (1988), eq. 6.31 (compressor work).
    """
    return air_mass_flow * CP_AIR * (T2 - T1) / drive_efficiency


def highest_boost(max_pressure_ratio, p1, intercooler_loss, p_baro):
    """Highest gauge boost the compressor reaches at its ``max_pressure_ratio``.

    ``boost_max = PR_max P1 - intercooler_loss - P_baro`` (may be negative: unreachable).

    :returns: boost, gauge, [Pa]
    """
    return max_pressure_ratio * p1 - intercooler_loss - p_baro


BOOST_CONTROLS = ("held_manifold", "held_gauge", "fixed_ratio")


def boost_here(control, boost_set, p_set, p_here, inlet_loss=0.0, intercooler_loss=0.0):
    """Gauge boost at another site for boost set elsewhere, by the style of boost control.

    - ``held_manifold`` (closed-loop control of manifold absolute pressure):
      ``MAP`` is kept, ``boost_here = P_set + boost_set - P_here``.
    - ``held_gauge`` (a wastegate spring referenced to the atmosphere): gauge boost kept.
    - ``fixed_ratio`` (belt-driven blower at the same rpm): ``P2 / P1`` is kept, losses
      included: ``boost_here = PR_set (P_here - inlet_loss) - intercooler_loss - P_here``.

    Never below 0 (the engine then runs unboosted).

    :param control: one of :data:`BOOST_CONTROLS`
    :param boost_set: boost where it was set, gauge, [Pa]
    :param p_set: station pressure where it was set, [Pa]
    :param p_here: station pressure here, [Pa] (scalar or array)
    :returns: boost here, gauge, [Pa]

    >>> round(float(boost_here("held_manifold", 100e3, 101325.0, 90e3)), 3)
    111325.0
    >>> round(float(boost_here("fixed_ratio", 100e3, 100e3, 80e3)), 3)
    80000.0
    """
    p_here = np.asarray(p_here, dtype=float)
    if control == "held_manifold":
        boost = p_set + boost_set - p_here
    elif control == "held_gauge":
        boost = boost_set + 0.0 * p_here
    else:
        ratio = pressures(p_set, boost_set, inlet_loss, intercooler_loss)[3]
        boost = ratio * (p_here - inlet_loss) - intercooler_loss - p_here
    return np.maximum(boost, 0.0)
