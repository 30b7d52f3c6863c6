"""Calculations behind each endpoint: validated SI inputs in, SI results and warning codes out.

This layer composes the pure engine models, applies the defaults (recording each one as
an assumption) and decides the warnings. It knows nothing of HTTP, units or languages;
the browser's offline engine mirrors it file by file in ``static/js/calc/``.
"""

from . import airflow, boost, fuel, site

CALCULATIONS = {
    "site": site.calculate,
    "pressure-ratio": boost.pressure_ratio,
    "power": boost.power_check,
    "boost-for-power": boost.boost_for_power,
    "airflow": airflow.calculate,
    "injectors": fuel.injectors,
    "fuel-pump": fuel.fuel_pump,
}
OUTPUTS = {
    "site": site.OUTPUTS,
    "pressure-ratio": boost.PRESSURE_RATIO_OUTPUTS,
    "power": boost.POWER_OUTPUTS,
    "boost-for-power": boost.BOOST_FOR_POWER_OUTPUTS,
    "airflow": airflow.OUTPUTS,
    "injectors": fuel.INJECTOR_OUTPUTS,
    "fuel-pump": fuel.PUMP_OUTPUTS,
}
