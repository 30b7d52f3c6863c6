"""Conditions: station pressure, humid air, density altitude, SAE J1349 correction."""

from ..engine import atmosphere
from .common import Result, finite, resolve_site

OUTPUTS = {
    "station_pressure": "abs_pressure",
    "dry_air_pressure": "abs_pressure",
    "vapour_pressure": "abs_pressure",
    "temperature": "temperature",
    "air_density": "air_density",
    "density_altitude": "elevation",
    "pressure_altitude": "elevation",
    "correction_factor": None,
}


def air(site, result):
    """Humid-air state and the J1349 factor of a resolved site; adds its warnings."""
    p, T, rh = site["pressure"], site["temperature"], site["humidity"]
    p_v = finite(atmosphere.vapour_pressure(T, rh))
    p_dry = p - p_v
    cf = finite(atmosphere.sae_j1349_correction_factor(p_dry, T))
    (t_lo, t_hi), (p_lo, p_hi) = atmosphere.J1349_RANGE["temperature"], atmosphere.J1349_RANGE["dry_air_pressure"]
    if not (t_lo <= T <= t_hi and p_lo <= p_dry <= p_hi):
        result.warn("correction_out_of_range", "caution")
    return p_v, p_dry, cf


def calculate(inp):
    result = Result()
    site = resolve_site(inp.get("site"), result)
    p_v, p_dry, cf = air(site, result)
    rho = finite(atmosphere.humid_air_density(site["pressure"], site["temperature"], site["humidity"]))
    h_density = finite(atmosphere.density_altitude(rho))
    if atmosphere.beyond_troposphere(h_density):
        result.warn("beyond_troposphere", "info")
    result.values.update(
        station_pressure=site["pressure"],
        dry_air_pressure=p_dry,
        vapour_pressure=p_v,
        temperature=site["temperature"],
        air_density=rho,
        density_altitude=h_density,
        pressure_altitude=finite(atmosphere.pressure_altitude(site["pressure"])),
        correction_factor=cf,
    )
    return result
