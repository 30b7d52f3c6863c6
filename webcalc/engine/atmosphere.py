"""Ambient air: standard atmosphere, altimeter setting, humid air, dyno correction.

Every function takes and returns SI floats or numpy arrays. Elevations are geometric
metres unless the name says ``geopotential``.
"""

import numpy as np

from .constants import (
    LAPSE_RATE,
    P_SEA_LEVEL,
    PRESSURE_EXPONENT,
    R_DRY,
    R_EARTH,
    R_VAPOUR,
    RHO_SEA_LEVEL,
    T_SEA_LEVEL,
)

#: Hard validity ranges (outside them the API answers 400), SI units.
VALID = {
    "altitude": (-610.0, 11000.0),  # m, troposphere of the standard atmosphere
    "station_pressure": (22e3, 110e3),  # Pa
    "altimeter_setting": (85e3, 110e3),  # Pa
    "temperature": (213.15, 333.15),  # K (-60 to +60 degC)
    "relative_humidity": (0.0, 1.0),
}
#: SAE J1349 states its correction for 15 to 35 degC and 90 to 105 kPa dry air (from memory).
J1349_RANGE = {"temperature": (288.15, 308.15), "dry_air_pressure": (90e3, 105e3)}
#: Upper end of the troposphere, geopotential metres (US Standard Atmosphere 1976).
TROPOPAUSE_GEOPOTENTIAL = 11000.0


def geopotential_height(h):
    """Geopotential height from geometric elevation (US Standard Atmosphere 1976, eq. 18).

    ``H = r0 h / (r0 + h)`` with r0 = 6 356 766 m.

    :param h: geometric elevation, [m]
    :returns: geopotential height, [m']
    :validity: any elevation well below the earth radius.

    >>> round(float(geopotential_height(11000.0)), 1)
    10981.0

    References: US Standard Atmosphere 1976, NOAA-S/T 76-1562, section 1.2.
    """
    return R_EARTH * h / (R_EARTH + h)


def geometric_height(H):
    """Geometric elevation from geopotential height (inverse of :func:`geopotential_height`).

    ``h = r0 H / (r0 - H)``.

    :param H: geopotential height, [m']
    :returns: geometric elevation, [m]

    >>> round(float(geometric_height(geopotential_height(2500.0))), 9)
    2500.0
    """
    return R_EARTH * H / (R_EARTH - H)


def isa_temperature(h):
    """Standard-atmosphere temperature (US Standard Atmosphere 1976 = ICAO, troposphere).

    ``T = 288.15 - 0.0065 H`` with H the geopotential height.

    :param h: geometric elevation, [m]
    :returns: temperature, [K]
    :validity: -610 m to 11 000 m (troposphere).

    >>> round(float(isa_temperature(1000.0)), 3)
    281.651

    References: US Standard Atmosphere 1976, Table 4 (lapse rate), eq. 23.
    """
    return T_SEA_LEVEL - LAPSE_RATE * geopotential_height(h)


def isa_pressure(h):
    """Standard-atmosphere pressure (US Standard Atmosphere 1976 = ICAO, troposphere).

    ``P = 101325 (1 - 0.0065 H / 288.15)^5.25588`` Pa, H geopotential.

    :param h: geometric elevation, [m]
    :returns: static pressure, absolute, [Pa]
    :validity: -610 m to 11 000 m.

    >>> round(float(isa_pressure(0.0)), 3)
    101325.0
    >>> round(float(isa_pressure(1000.0)))
    89876

    References: US Standard Atmosphere 1976, eq. 33a; Table I.
    """
    return P_SEA_LEVEL * (1.0 - LAPSE_RATE * geopotential_height(h) / T_SEA_LEVEL) ** PRESSURE_EXPONENT


def pressure_altitude(p_abs):
    """Geometric elevation at which the standard atmosphere has pressure ``p_abs``.

    Inverse of :func:`isa_pressure`:
    ``H = 288.15 / 0.0065 (1 - (P / 101325)^(1/5.25588))``, then geometric.

    :param p_abs: absolute pressure, [Pa]
    :returns: geometric elevation, [m]
    :validity: 22 kPa to 110 kPa (the troposphere, slightly extrapolated below sea level).

    >>> round(float(pressure_altitude(isa_pressure(1500.0))), 6)
    1500.0
    """
    H = T_SEA_LEVEL / LAPSE_RATE * (1.0 - (np.asarray(p_abs, dtype=float) / P_SEA_LEVEL) ** (1.0 / PRESSURE_EXPONENT))
    return geometric_height(H)


def station_pressure_from_altimeter(p_altimeter, h):
    """Station pressure from an altimeter setting (US National Weather Service formula).

    ``P_stn = P_alt ((288 - 0.0065 h) / 288)^5.2561``.

    :param p_altimeter: altimeter setting (QNH), absolute, [Pa]
    :param h: station elevation, [m]
    :returns: station pressure, absolute, [Pa]
    :validity: altimeter setting 85 to 110 kPa, elevation -610 to 11 000 m. The NWS
        constants are rounded: it differs from :func:`isa_pressure` scaled to the same
        sea-level pressure by about 17 Pa at 2000 m and 90 Pa at 11 km.

    >>> round(float(station_pressure_from_altimeter(101325.0, 0.0)), 6)
    101325.0

    References: US National Weather Service, "Pressure conversion equations"
    (station pressure from altimeter setting); Smithsonian Meteorological Tables.
    """
    return p_altimeter * ((288.0 - 0.0065 * h) / 288.0) ** 5.2561


def altimeter_from_station_pressure(p_station, h):
    """Altimeter setting from station pressure (inverse of the NWS formula).

    :param p_station: station pressure, absolute, [Pa]
    :param h: station elevation, [m]
    :returns: altimeter setting, [Pa]
    """
    return p_station / ((288.0 - 0.0065 * h) / 288.0) ** 5.2561


def saturation_vapour_pressure(T):
    """Saturation vapour pressure over liquid water (Buck 1996 equation).

    ``Psat = 611.21 exp((18.678 - t/234.5) t / (257.14 + t))`` Pa, t in degC.

    :param T: temperature, [K]
    :returns: saturation vapour pressure, [Pa]
    :validity: used here -60 to +60 degC. Within 0.05 % of IAPWS-95 from 0 to 60 degC
        and within 0.4 % of Murphy and Koop (2005) for supercooled water down to
        -40 degC (both checked in the tests); the vapour term is small at those
        temperatures, so the density error stays far smaller.

    >>> round(float(saturation_vapour_pressure(293.15)), 1)
    2338.3

    References: A. L. Buck, "New equations for computing vapor pressure and enhancement
    factor", J. Appl. Meteor. 20 (1981), updated in the Buck Research CR-1A manual (1996).
    """
    t = np.asarray(T, dtype=float) - 273.15
    return 611.21 * np.exp((18.678 - t / 234.5) * t / (257.14 + t))


def vapour_pressure(T, relative_humidity):
    """Partial pressure of water vapour, ``P_v = RH Psat(T)``, [Pa]."""
    return relative_humidity * saturation_vapour_pressure(T)


def humid_air_density(p_abs, T, relative_humidity):
    """Density of humid air as a mix of two ideal gases.

    ``rho = P_dry / (R_d T) + P_v / (R_v T)``, ``P_dry = P - P_v``.

    :param p_abs: total (station) pressure, [Pa]
    :param T: temperature, [K]
    :param relative_humidity: relative humidity, [-] 0..1
    :returns: density, [kg/m^3]
    :validity: the site ranges (22 to 110 kPa, -60 to +60 degC).

    >>> round(float(humid_air_density(101325.0, 288.15, 0.0)), 4)
    1.225

    References: ideal gas law for each component (Dalton's law); CIPM-2007 gives the
    same within about 0.2 % at ordinary conditions.
    """
    p_v = vapour_pressure(T, relative_humidity)
    return (p_abs - p_v) / (R_DRY * T) + p_v / (R_VAPOUR * T)


def density_altitude(rho):
    """Density altitude: the standard-atmosphere elevation with this air density.

    Inverts ``rho = rho0 (1 - 0.0065 H / 288.15)^4.25588`` for geopotential H
    (rho0 = 1.225 kg/m^3) and returns the geometric elevation.

    :param rho: air density, [kg/m^3]
    :returns: geometric density altitude, [m]
    :validity: the troposphere (up to 11 000 m' geopotential); beyond it the same law
        is extrapolated (see :func:`beyond_troposphere`).

    >>> round(float(density_altitude(1.225)), 6)
    0.0

    References: US Standard Atmosphere 1976, eq. 42 with the troposphere law.
    """
    H = T_SEA_LEVEL / LAPSE_RATE * (1.0 - (np.asarray(rho, dtype=float) / RHO_SEA_LEVEL) ** (1.0 / (PRESSURE_EXPONENT - 1.0)))
    return geometric_height(H)


def beyond_troposphere(h):
    """True where a geometric elevation lies above the troposphere (11 000 m')."""
    return geopotential_height(h) > TROPOPAUSE_GEOPOTENTIAL


def sae_j1349_correction_factor(p_dry, T):
    """Dyno correction factor to SAE J1349 standard conditions (2004 and later editions).

    ``CF = 1.176 (99 / P_dry[kPa]) sqrt((t + 273) / 298) - 0.176``, t in degC.
    Standard conditions: 99 kPa dry air, 25 degC. ISA sea level gives about 0.95.

    :param p_dry: dry-air pressure, [Pa]
    :param T: inlet air temperature, [K]
    :returns: correction factor, [-] (corrected = observed x CF)
    :validity: the standard applies from 15 to 35 degC and 90 to 105 kPa dry air (from
        memory); outside, the number is still computed and flagged.

    >>> round(float(sae_j1349_correction_factor(99e3, 298.15)), 4)
    1.0

    References: SAE J1349 (revised 2004, 2008), clause 5 (from memory).
    """
    t = np.asarray(T, dtype=float) - 273.15
    return 1.176 * (99e3 / p_dry) * np.sqrt((t + 273.0) / 298.0) - 0.176


def carry_weather(h_row, h_site, p_site, T_site):
    """Carry a site's weather to another elevation (used for altitude tables).

    ``P = ISA(h_row) P_site / ISA(h_site)``; ``T = ISA_T(h_row) + (T_site - ISA_T(h_site))``.

    :param h_row: elevations of the rows, [m]
    :param h_site: elevation of the site, [m]
    :param p_site: site pressure, [Pa]
    :param T_site: site temperature, [K]
    :returns: (pressure [Pa], temperature [K]) at ``h_row``
    """
    p = isa_pressure(h_row) * p_site / isa_pressure(h_site)
    T = isa_temperature(h_row) + (T_site - isa_temperature(h_site))
    return p, T
