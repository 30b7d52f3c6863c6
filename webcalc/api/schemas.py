"""The inputs of every endpoint, built from the engine's validity ranges (SPEC section 3)."""

from ..engine import airflow, atmosphere, compressor, fuel, power
from ..engine.constants import P_SEA_LEVEL
from .fields import Choice, Count, Fraction, List, Number, Object, Quantity, Text, UnitMap

A, C, F, P = atmosphere.VALID, compressor.VALID, fuel.VALID, power.VALID


def site_fields():
    return [
        Quantity("altitude", "elevation", *A["altitude"], description="Geometric elevation."),
        Quantity("station_pressure", "abs_pressure", *A["station_pressure"], description="Absolute station pressure."),
        Quantity("altimeter_setting", "abs_pressure", *A["altimeter_setting"],
                 description="Altimeter setting (QNH) of a weather report; needs altitude."),
        Quantity("temperature", "temperature", *A["temperature"], description="Air temperature."),
        Fraction("relative_humidity", *A["relative_humidity"], description="Relative humidity, 0 to 1."),
    ]


def site(name="site", description="Where the engine runs now."):
    return Object(name, site_fields(), description=description)


COMMON = [
    Choice("units", ("metric", "imperial", "si"), description="Unit system of the outputs (default metric)."),
    UnitMap("output_units", description="Per-field output units by flat field name."),
    Text("lang", description="Language of messages (else Accept-Language)."),
]
POWER_BASIS = [
    Choice("power_basis", ("crank", "wheel"), description="Basis of every power in and out (default crank)."),
    Fraction("drivetrain_loss", *P["drivetrain_loss"], description="Drivetrain loss as a fraction of crank power; needed for wheel."),
]


def fuel_choice():
    return [
        Choice("fuel", fuel.FUEL_NAMES, description="Fuel (default gasoline)."),
        Fraction("ethanol_content", *F["ethanol_content"], description="Ethanol by volume (gasoline or e85 only)."),
    ]


def boost(required=True):
    return Quantity("boost", "gauge_pressure", *C["boost"], required=required, description="Boost, gauge.")


INDUCTION = Choice("induction", compressor.INDUCTIONS, description="Compressor type (default turbo).")


def compressor_options():
    return [
        INDUCTION,
        Quantity("inlet_loss", "gauge_pressure", *C["loss"], description="Pressure drop before the compressor."),
        Quantity("intercooler_loss", "gauge_pressure", *C["loss"], description="Pressure drop between compressor and manifold."),
        Fraction("compressor_efficiency", *C["efficiency"], description="Isentropic efficiency (default by induction)."),
        Fraction("intercooler_effectiveness", *C["effectiveness"], description="0 = no intercooler (default 0.75)."),
        Quantity("coolant_temperature", "temperature", *C["coolant_temperature"],
                 description="Intercooler coolant temperature (default: site temperature)."),
        Number("max_pressure_ratio", *C["max_pressure_ratio"], lo_open=True, description="Highest ratio the compressor is asked for."),
    ]


def boost_set_at():
    return Object("boost_set_at", [
        site("site", "Where the boost was set."),
        Choice("control", compressor.BOOST_CONTROLS, required=True),
    ], description="Boost is what the engine makes at another site, with this control style.")


ALTITUDES = List("altitudes", Quantity("altitude", "elevation", *A["altitude"]), 1, 50,
                 description="Elevations for an altitude table.")


def na_run():
    return [
        Quantity("na_power", "power", *P["power"], lo_open=True, required=True, description="NA power."),
        site("na_site", "Where the NA power was measured (default: site)."),
        Choice("na_power_basis", ("observed", "sae_j1349"), description="NA figure observed or SAE J1349 corrected."),
        *fuel_choice(),
        Quantity("bsfc", "bsfc", *F["bsfc"], description="BSFC of the NA run (for its air flow)."),
        Number("afr", *F["afr"], description="Air-fuel ratio of the NA run."),
        Number("exhaust_to_boost_ratio", 0.0, 5.0, description="Exhaust gauge pressure per unit boost (default 1 turbo, 0 blower)."),
        Fraction("drive_efficiency", *C["drive_efficiency"], description="Blower drive efficiency (default 0.95)."),
    ]


def fuel_system():
    return [
        Quantity("power", "power", *P["power"], lo_open=True, required=True, description="Engine power."),
        *fuel_choice(),
        Quantity("bsfc", "bsfc", *F["bsfc"], description="BSFC (default by fuel and induction)."),
        Quantity("fuel_density", "density", *F["fuel_density"], description="Fuel density override."),
        Choice("induction", ("na",) + compressor.INDUCTIONS, description="Induction (default turbo)."),
        boost(required=False),
        Quantity("base_fuel_pressure", "gauge_pressure", *F["fuel_pressure"],
                 description="Rail pressure at zero boost, relative to the manifold (default 3 bar)."),
        Choice("regulator", ("boost_referenced", "fixed"), description="Regulator type (default boost_referenced)."),
    ]


PUMP_POINT = Object("point", [
    Quantity("pressure", "gauge_pressure", 0.0, 2e6, required=True, description="Pump outlet pressure, gauge."),
    Quantity("flow", "pump_flow", 0.0, None, lo_open=True, required=True, description="Flow at that pressure."),
])

ENDPOINTS = {
    "site": [site(), *COMMON],
    "pressure-ratio": [boost(), site(), *compressor_options(), boost_set_at(), ALTITUDES, *COMMON],
    "power": [
        *na_run()[:1], boost(), site(), *na_run()[1:], *compressor_options(),
        Quantity("exhaust_back_pressure", "gauge_pressure", *C["exhaust_back_pressure"],
                 description="Exhaust pressure before the turbine at this boost, gauge."),
        Quantity("measured_power", "power", *P["power"], lo_open=True, description="Power measured at this boost."),
        Choice("measured_power_basis", ("observed", "sae_j1349"), description="Measured figure observed or corrected."),
        boost_set_at(), ALTITUDES, *POWER_BASIS, *COMMON,
    ],
    "boost-for-power": [
        Quantity("target_power", "power", *P["power"], lo_open=True, required=True, description="Target power."),
        *na_run()[:1], site(), *na_run()[1:], *compressor_options(), ALTITUDES, *POWER_BASIS, *COMMON,
    ],
    "airflow": [
        Quantity("power", "power", *P["power"], lo_open=True, required=True, description="Engine power."),
        *fuel_choice(),
        Quantity("bsfc", "bsfc", *F["bsfc"], description="BSFC (default 0.50 lb/hp/h gasoline, scaled by fuel)."),
        Number("afr", *F["afr"], description="Air-fuel ratio (or lambda)."),
        Number("lambda", *F["lambda"], description="Lambda (or afr)."),
        site(), boost(required=False), *compressor_options(),
        Count("compressor_count", *airflow.VALID["compressor_count"], description="Compressors sharing the flow (default 1)."),
        Quantity("displacement", "displacement", *airflow.VALID["displacement"], description="Engine displacement."),
        Number("rpm", *airflow.VALID["rpm"], description="Engine speed, rev/min."),
        Quantity("reference_pressure", "abs_pressure", *airflow.VALID["reference_pressure"],
                 description=f"Compressor-map reference pressure (default {P_SEA_LEVEL:g} Pa)."),
        Quantity("reference_temperature", "temperature", *airflow.VALID["reference_temperature"],
                 description="Compressor-map reference temperature (default 288.15 K)."),
        *POWER_BASIS, *COMMON,
    ],
    "injectors": [
        *fuel_system(),
        Count("injector_count", *F["injector_count"], required=True, description="Number of injectors."),
        Fraction("max_duty", *F["duty"], lo_open=True, description="Highest allowed duty cycle (default 0.80)."),
        Quantity("rated_pressure", "gauge_pressure", *F["fuel_pressure"], description="Pressure of the injector rating (default 3 bar)."),
        Quantity("injector_flow", "injector_flow", 0.0, None, lo_open=True, description="A given injector's rating at rated_pressure."),
        Quantity("rating_fluid_density", "density", *F["fuel_density"], description="Density of the rating's test fluid."),
        *POWER_BASIS, *COMMON,
    ],
    "fuel-pump": [
        *fuel_system(),
        Quantity("line_loss", "gauge_pressure", *C["loss"], description="Pressure drop from pump to rail."),
        Fraction("margin", *F["margin"], description="Flow margin (default 0.20)."),
        Count("pump_count", *F["pump_count"], description="Pumps in parallel (default 1)."),
        List("pump_curve", PUMP_POINT, 2, 30, description="Data-sheet curve at the pump's rated voltage."),
        *POWER_BASIS, *COMMON,
    ],
}
