"""Hypothesis strategies shared by the engine and API property tests."""

import math

import numpy as np
from hypothesis import settings
from hypothesis import strategies as st

from webcalc.engine import airflow, compressor as comp, fuel, power
from webcalc.engine import atmosphere as atm


@st.composite
def pump_curves(draw, max_flow=1e-2):
    """2 to 30 points, pressures strictly increasing within 0 to 20 bar (the API takes pump
    pressures up to 20 bar), flows positive and falling."""
    n = draw(st.integers(2, 30))
    start = draw(st.floats(0.0, 5e5))
    steps = draw(st.lists(st.floats(1e3, 5e4), min_size=n - 1, max_size=n - 1))
    ps = list(start + np.cumsum([0.0] + steps))
    qs = sorted(draw(st.lists(st.floats(1e-7, max_flow), min_size=n, max_size=n)), reverse=True)
    return [float(p) for p in ps], qs


ENGINE = settings(max_examples=80, deadline=None, database=None)
API = settings(max_examples=40, deadline=None, database=None)
A, C, F, P, AF = atm.VALID, comp.VALID, fuel.VALID, power.VALID, airflow.VALID


def inside(valid, key, open_low=False):
    """Floats over a VALID range; an open lower end at 0 starts at 1e-9 of the upper end
    (subnormal inputs are a 400 for a non-finite result at the API, SPEC section 3)."""
    lo, hi = valid[key]
    if open_low:
        lo = 1e-9 * hi if lo == 0.0 else math.nextafter(lo, math.inf)
    return st.floats(lo, hi, allow_nan=False, allow_infinity=False)


def finite(*values):
    return all(np.all(np.isfinite(np.asarray(v, dtype=float))) for v in values)


altitude, station_p, altimeter = inside(A, "altitude"), inside(A, "station_pressure"), inside(A, "altimeter_setting")
temperature, humidity = inside(A, "temperature"), inside(A, "relative_humidity")
boost, loss, eta = inside(C, "boost"), inside(C, "loss"), inside(C, "efficiency")
eps, coolant, eta_drive = inside(C, "effectiveness"), inside(C, "coolant_temperature"), inside(C, "drive_efficiency")
pr_max = inside(C, "max_pressure_ratio", open_low=True)
watts, bsfc, afr = inside(P, "power", open_low=True), inside(F, "bsfc"), inside(F, "afr")
duty, margin, fuel_p = inside(F, "duty", open_low=True), inside(F, "margin"), inside(F, "fuel_pressure")
density, ethanol = inside(F, "fuel_density"), inside(F, "ethanol_content")
injectors = st.integers(*F["injector_count"])
