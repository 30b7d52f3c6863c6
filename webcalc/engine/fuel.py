"""Fuels, blends, BSFC defaults, injector sizing and fuel-pump flow.

Fuel mass flows in [kg/s], volume flows in [m^3/s], densities in [kg/m^3], BSFC in
[kg/J], pressures in [Pa] (fuel pressures are gauge or differences).
"""

import numpy as np

from .constants import LB_PER_HP_H

#: Binding fuel table: density [kg/m^3] and stoichiometric air-fuel ratio by mass [-].
#: gasoline: common practice; Heywood, ICE Fundamentals, App. D (from memory).
#: ethanol, methanol: CRC Handbook densities at 20 degC (from memory); stoichiometry of
#: C2H5OH (9.0) and CH3OH (6.47).
FUELS = {
    "gasoline": {"density": 745.0, "afr": 14.7},
    "ethanol": {"density": 789.0, "afr": 9.0},
    "methanol": {"density": 791.0, "afr": 6.47},
}
#: E85: 85 % ethanol by volume in gasoline (the blend rule computes its density and AFR).
E85_ETHANOL = 0.85
FUEL_NAMES = ("gasoline", "ethanol", "methanol", "e85")
#: Fuels that take an ``ethanol_content``.
BLENDABLE = ("gasoline", "e85")

#: NA air per power: gasoline at 0.50 lb/hp/h and AFR 12.5 (common practice, from memory):
#: about 9.6 hp per lb/min of air, close to the trade's 10.
NA_BSFC_GASOLINE = 0.50 * LB_PER_HP_H
NA_AFR_GASOLINE = 12.5
#: Default BSFC for fuel-system sizing, gasoline, by induction (common practice, from memory).
SIZING_BSFC_GASOLINE = {
    "na": 0.50 * LB_PER_HP_H,
    "turbo": 0.60 * LB_PER_HP_H,
    "centrifugal": 0.65 * LB_PER_HP_H,
    "roots": 0.65 * LB_PER_HP_H,
    "twin_screw": 0.65 * LB_PER_HP_H,
}
DEFAULT_MAX_DUTY = 0.80  # common practice, from memory
DEFAULT_FUEL_PRESSURE = 3e5  # Pa, 3 bar (common practice for port injection)
DEFAULT_PUMP_MARGIN = 0.20  # common practice, from memory

VALID = {
    "bsfc": (0.2 * LB_PER_HP_H, 2.0 * LB_PER_HP_H),  # kg/J
    "afr": (3.0, 25.0),
    "lambda": (0.5, 1.5),
    "injector_count": (1, 64),
    "pump_count": (1, 16),
    "duty": (0.0, 1.0),  # exclusive at 0
    "margin": (0.0, 1.0),
    "fuel_pressure": (0.5e5, 10e5),  # Pa
    "fuel_density": (600.0, 1000.0),  # kg/m^3
    "ethanol_content": (0.0, 1.0),
}


def blend(ethanol_content, gasoline=FUELS["gasoline"], ethanol=FUELS["ethanol"]):
    """Density and stoichiometric AFR of an ethanol-gasoline blend (blend rule).

    Mass fraction ``w = x rho_e / (x rho_e + (1 - x) rho_g)`` from the volume fraction x;
    ``AFR = w AFR_e + (1 - w) AFR_g`` (mass-weighted); ``rho = x rho_e + (1 - x) rho_g``
    (volume-weighted, ideal mixing).

    :param ethanol_content: ethanol by volume, [-] 0..1
    :returns: (density [kg/m^3], stoichiometric AFR [-])

    >>> [round(float(v), 3) for v in blend(0.85)]
    [782.4, 9.814]

    References: ideal mixing; stoichiometry of C2H5OH.
    """
    x = ethanol_content
    mass_e = x * ethanol["density"]
    mass_g = (1.0 - x) * gasoline["density"]
    w = mass_e / (mass_e + mass_g)
    afr = w * ethanol["afr"] + (1.0 - w) * gasoline["afr"]
    return mass_e + mass_g, afr


def fuel_properties(fuel="gasoline", ethanol_content=None):
    """Density [kg/m^3] and stoichiometric AFR [-] of a fuel of the table, blends included."""
    if fuel == "e85" or ethanol_content is not None:
        return blend(E85_ETHANOL if ethanol_content is None else ethanol_content)
    props = FUELS[fuel]
    return props["density"], props["afr"]


def na_air_defaults(afr_stoich):
    """Default NA BSFC [kg/J] and AFR [-] for a fuel: the same lambda and air per power.

    Gasoline 0.50 lb/hp/h and 12.5; other fuels ``lambda = 12.5 / 14.7`` and BSFC scaled by
    ``14.7 / AFR_st`` (common practice, from memory).
    """
    scale = FUELS["gasoline"]["afr"] / afr_stoich
    return NA_BSFC_GASOLINE * scale, NA_AFR_GASOLINE / scale


def sizing_bsfc(induction, afr_stoich):
    """Default BSFC for injector and pump sizing, [kg/J] (common practice, from memory).

    Gasoline: NA 0.50, turbo 0.60, belt-driven 0.65 lb/hp/h; other fuels scaled by
    ``14.7 / AFR_st`` (same lambda, same air per power).

    >>> round(float(sizing_bsfc("turbo", 14.7) / LB_PER_HP_H), 9)
    0.6
    """
    return SIZING_BSFC_GASOLINE[induction] * FUELS["gasoline"]["afr"] / afr_stoich


def fuel_mass_flow(power, bsfc):
    """Fuel mass flow ``m_f = P bsfc``: power [W] times BSFC [kg/J] gives [kg/s]."""
    return power * bsfc


def injector_pressure_difference(base_pressure, boost_gauge, regulator):
    """Pressure across the injector, [Pa].

    ``boost_referenced``: the regulator keeps rail minus manifold at the base pressure;
    ``fixed``: rail is held at base gauge pressure, so the difference is ``base - boost``.
    """
    if regulator == "fixed":
        return base_pressure - boost_gauge
    return base_pressure


def orifice_scale(p_to, p_from):
    """Flow ratio of an injector between two pressure differences (orifice equation).

    ``Q_to / Q_from = sqrt(dp_to / dp_from)`` (flow through a fixed orifice, Bernoulli).

    >>> float(orifice_scale(4e5, 1e5))
    2.0

    References: ISO 5167-1 (orifice flow, constant discharge coefficient).
    """
    return np.sqrt(p_to / p_from)


def injector_flow_needed(power, bsfc, count, max_duty):
    """Static flow each injector must deliver at its operating pressure, [kg/s].

    ``m_inj = P bsfc / (n duty_max)``.
    """
    return power * bsfc / (count * max_duty)


def injector_duty(power, bsfc, count, flow_at_operating):
    """Duty cycle of ``count`` injectors each flowing ``flow_at_operating`` [kg/s] (raw, may exceed 1)."""
    return power * bsfc / (count * flow_at_operating)


def injector_max_power(flow_at_operating, count, max_duty, bsfc):
    """Power that ``count`` injectors feed at ``max_duty``, [W]."""
    return flow_at_operating * count * max_duty / bsfc


def rating_fluid_scale(rho_fuel, rho_test):
    """Volume-flow ratio of fuel to the test fluid of a rating (orifice equation).

    ``Q_fuel / Q_test = sqrt(rho_test / rho_fuel)``; a volumetric rating with n-heptane
    (about 0.684 kg/L) overstates gasoline's mass flow by about 4 %.
    """
    return np.sqrt(rho_test / rho_fuel)


def pump_required_pressure(base_pressure, boost_gauge, regulator, line_loss=0.0):
    """Pump outlet pressure needed, gauge, [Pa]: base (+ boost if boost-referenced) + line loss."""
    boost_part = boost_gauge if regulator == "boost_referenced" else 0.0
    return base_pressure + boost_part + line_loss


def pump_required_flow(power, bsfc, density, margin):
    """Total fuel volume flow needed including margin, [m^3/s]: ``P bsfc (1 + margin) / rho``."""
    return power * bsfc * (1.0 + margin) / density


def pump_curve_flow(curve_pressure, curve_flow, pressure):
    """Flow of a pump at a pressure from its data-sheet curve (piecewise linear).

    Inside the curve: linear interpolation. Outside: linear extrapolation from the two
    nearest points, never below 0.

    :param curve_pressure: outlet pressures, gauge, strictly increasing, [Pa]
    :param curve_flow: flows at those pressures, [m^3/s]
    :param pressure: pressure(s) to evaluate, [Pa]
    :returns: (flow [m^3/s], extrapolated: bool array)

    >>> f, e = pump_curve_flow([1e5, 3e5, 5e5], [3e-5, 2e-5, 1e-5], 6e5)
    >>> round(float(f), 12), bool(e)
    (5e-06, True)
    """
    xp = np.asarray(curve_pressure, dtype=float)
    fp = np.asarray(curve_flow, dtype=float)
    x = np.asarray(pressure, dtype=float)
    flow = np.interp(x, xp, fp)
    lo_slope = (fp[1] - fp[0]) / (xp[1] - xp[0])
    hi_slope = (fp[-1] - fp[-2]) / (xp[-1] - xp[-2])
    flow = np.where(x < xp[0], fp[0] + lo_slope * (x - xp[0]), flow)
    flow = np.where(x > xp[-1], fp[-1] + hi_slope * (x - xp[-1]), flow)
    return np.maximum(flow, 0.0), (x < xp[0]) | (x > xp[-1])
