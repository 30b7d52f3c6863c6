"""Power with boost: the pressure-ratio rule, expected power, and the boost for a target.

Powers are crank power in [W]; pressures absolute in [Pa] unless named gauge.
"""

import numpy as np

from . import compressor
from .constants import R_DRY

VALID = {"power": (0.0, 10e6), "drivetrain_loss": (0.0, 0.5)}  # W (exclusive at 0)

#: Exponent of the temperature term in the power correction: SAE J1349 uses 0.5
#: (ISO 1585 uses 0.6, from memory).
TEMPERATURE_EXPONENT = 0.5
#: Grid and tolerance of the binding boost-for-power root find.
GRID_POINTS = 257
BISECTION_WIDTH = 1e-6  # Pa
BISECTION_MAX_HALVINGS = 200


def ideal_power(na_power, map_abs, p_na):
    """Ideal power by the pressure-ratio rule: power scales with absolute manifold pressure.

    ``P_ideal = P_na MAP / p_na``: one atmosphere of boost ideally doubles NA power.

    :param na_power: NA power, observed, [W]
    :param map_abs: manifold absolute pressure, [Pa]
    :param p_na: station pressure where the NA power was measured, [Pa]
    :returns: ideal power, [W]

    >>> round(float(ideal_power(100e3, 2 * 101325.0, 101325.0)), 6)
    200000.0

    References: the trade's pressure-ratio rule (common practice, no source); it follows
    from power being proportional to air mass per cycle at equal temperature (Heywood
    1988, sec. 2.12, eq. 2.41).
    """
    return na_power * map_abs / p_na


def expected_power(
    boost_gauge,
    *,
    na_power,
    p_na,
    T_na,
    na_air_mass_flow,
    p_baro,
    T1,
    inlet_loss=0.0,
    intercooler_loss=0.0,
    efficiency=0.72,
    effectiveness=0.75,
    T_coolant=None,
    belt_driven=False,
    drive_efficiency=compressor.DEFAULT_DRIVE_EFFICIENCY,
    exhaust_ratio=1.0,
):
    """Expected crank power at a boost, and its parts (vectorised over ``boost_gauge``).

    - ideal ``= P_na MAP / p_na`` (pressure-ratio rule);
    - gross ``= ideal (T_na / Tm)^0.5`` (SAE J1349 square-root temperature law);
    - air ``m = m_na (MAP / p_na) (T_na / Tm)`` (ideal gas law: air follows density);
    - drive ``= m cp (T2 - T1) / eta_drive`` for belt-driven compressors, else 0;
    - pumping ``= (MAP - EMAP) m / rho_m``, ``rho_m = MAP / (R_d Tm)``,
      ``EMAP = P_baro + exhaust_ratio boost`` (pumping mean effective pressure);
    - expected ``= gross + pumping - drive``.

    :param boost_gauge: boost, gauge, [Pa] (scalar or array)
    :param na_power: NA power, observed, [W]
    :param p_na: station pressure of the NA run, [Pa]
    :param T_na: air temperature of the NA run, [K]
    :param na_air_mass_flow: air mass flow of the NA run, [kg/s]
    :param p_baro: station pressure here, [Pa]
    :param T1: air temperature here (compressor inlet), [K]
    :param inlet_loss: inlet pressure drop, [Pa]; :param intercooler_loss: [Pa]
    :param efficiency: compressor isentropic efficiency, [-]
    :param effectiveness: intercooler effectiveness, [-] (0 = none)
    :param T_coolant: intercooler coolant temperature, [K] (default ``T1``)
    :param belt_driven: True for a crank-driven compressor
    :param drive_efficiency: belt and gear efficiency, [-]
    :param exhaust_ratio: exhaust gauge pressure before the turbine per unit boost, [-]
    :returns: dict of arrays: map, p1, p2, pressure_ratio, T2, Tm, ideal, gross,
        air_mass_flow, drive, pumping, expected (SI)
    :validity: boost 0 to 700 kPa; pressure ratio up to about 6; the temperature law is
        empirical (a few percent at high charge temperature).

    >>> r = expected_power(101325.0, na_power=1e5, p_na=101325.0, T_na=288.15,
    ...     na_air_mass_flow=0.1, p_baro=101325.0, T1=288.15, effectiveness=1.0)
    >>> round(float(r["expected"] / r["ideal"]), 12)
    1.0

    References: Heywood (1988), sec. 2.12 and 5.4 (pumping mean effective pressure);
    SAE J1349 (temperature law, from memory).
    """
    boost_gauge = np.asarray(boost_gauge, dtype=float)
    T_coolant = T1 if T_coolant is None else T_coolant
    map_abs, p1, p2, ratio = compressor.pressures(p_baro, boost_gauge, inlet_loss, intercooler_loss)
    T2 = compressor.outlet_temperature(T1, ratio, efficiency)
    Tm = compressor.intercooler_outlet_temperature(T2, T_coolant, effectiveness)
    ideal = ideal_power(na_power, map_abs, p_na)
    gross = ideal * (T_na / Tm) ** TEMPERATURE_EXPONENT
    air = na_air_mass_flow * (map_abs / p_na) * (T_na / Tm)
    if belt_driven:
        drive = compressor.drive_power(air, T1, T2, drive_efficiency)
    else:
        drive = np.zeros_like(air)
    emap = p_baro + exhaust_ratio * boost_gauge
    rho_m = map_abs / (R_DRY * Tm)
    pumping = (map_abs - emap) * air / rho_m
    return {
        "map": map_abs,
        "p1": p1,
        "p2": p2,
        "pressure_ratio": ratio,
        "T2": T2,
        "Tm": Tm,
        "ideal": ideal,
        "gross": gross,
        "air_mass_flow": air,
        "drive": drive,
        "pumping": pumping,
        "expected": gross + pumping - drive,
    }


def boost_for_ideal_power(target_power, na_power, p_na, p_baro):
    """Boost that gives a target power by the pressure-ratio rule (closed form).

    ``boost = p_na target / P_na - P_baro``, floored at 0.

    :returns: boost, gauge, [Pa]

    >>> round(float(boost_for_ideal_power(2e5, 1e5, 101325.0, 101325.0)), 6)
    101325.0
    """
    return np.maximum(p_na * target_power / na_power - p_baro, 0.0)


def boost_for_expected_power(target_power, boost_max, expected):
    """Boost for a target expected power: the binding grid-and-bisection root find.

    Evaluates ``expected(boost)`` on 257 equally spaced boosts from 0 to ``boost_max``;
    takes the first interval where ``expected - target`` changes sign and bisects it until
    it is at most 1e-6 Pa wide (at most 200 halvings); returns its midpoint.

    :param target_power: target, [W]
    :param boost_max: highest allowed boost (from ``max_pressure_ratio``), gauge, [Pa]
    :param expected: function of a boost array [Pa] returning expected power [W]
    :returns: (boost [Pa] or None when unreachable, max expected power on the grid [W])
    """
    if boost_max < 0:
        return None, None
    grid = np.linspace(0.0, boost_max, GRID_POINTS)
    f = np.asarray(expected(grid), dtype=float) - target_power
    max_expected = float(np.max(f) + target_power)
    crossings = np.nonzero((f[:-1] < 0) & (f[1:] >= 0))[0]
    if len(crossings) == 0:
        return None, max_expected
    i = int(crossings[0])
    lo, hi = float(grid[i]), float(grid[i + 1])
    for _ in range(BISECTION_MAX_HALVINGS):
        if hi - lo <= BISECTION_WIDTH:
            break
        mid = 0.5 * (lo + hi)
        if float(expected(np.asarray(mid))) - target_power < 0:
            lo = mid
        else:
            hi = mid
    return 0.5 * (lo + hi), max_expected
