/**
 * The input fields of the app: the engine setup (entered once, used by every screen)
 * and the inputs of the day (boost, target power, today's air...). Each definition says
 * how the field is entered (type, unit kind) and what it is called on screen. Labels are
 * built after the catalog is loaded, so `_()` is called at render time.
 */
import { _, currentLang } from "./i18n.js";
import { systemUnit } from "./units.js";

const INDUCTION = () => [
  { value: "turbo", label: _("Turbocharger") },
  { value: "centrifugal", label: _("Centrifugal supercharger (belt)") },
  { value: "roots", label: _("Roots blower (belt)") },
  { value: "twin_screw", label: _("Twin-screw supercharger (belt)") },
];

const FUEL = () => [
  { value: "gasoline", label: _("Petrol (gasoline)") },
  { value: "e85", label: _("E85") },
  { value: "ethanol", label: _("Ethanol") },
  { value: "methanol", label: _("Methanol") },
];

/** Fuels that take an ethanol content (the blend rule). */
export const BLENDABLE = ["gasoline", "e85"];

const CONTROL = () => [
  { value: "held_manifold", label: _("Boost controller holds manifold pressure") },
  { value: "held_gauge", label: _("Wastegate holds gauge boost") },
  { value: "fixed_ratio", label: _("Belt-driven blower, same pulley (fixed ratio)") },
];

function build() {
  const list = [
    // --- engine setup -------------------------------------------------------------
    { key: "na_power", group: "baseline", type: "quantity", kind: "power",
      label: _("NA power (without boost)") },
    { key: "na_power_basis", group: "baseline", type: "choice", label: _("The NA figure is"),
      choices: [{ value: "observed", label: _("As measured (observed)") },
        { value: "sae_j1349", label: _("Corrected to SAE J1349") }] },
    { key: "na_site", group: "baseline", type: "site", label: _("Where the NA figure was measured") },
    { key: "displacement", group: "engine", type: "quantity", kind: "displacement",
      label: _("Displacement") },
    { key: "induction", group: "engine", type: "choice", label: _("Induction"), choices: INDUCTION() },
    { key: "compressor_count", group: "engine", type: "count", min: 1, max: 8,
      label: _("Number of turbos or blowers") },
    { key: "intercooler", group: "charge", type: "bool", label: _("Intercooler fitted"),
      api: "intercooler_effectiveness" },
    { key: "intercooler_effectiveness", group: "charge", type: "percent",
      label: _("Intercooler effectiveness"), hint: _("Typical air-to-air: 70 to 80 %") },
    { key: "compressor_efficiency", group: "charge", type: "percent", optional: true,
      label: _("Compressor efficiency"), hint: _("Empty: typical value for the induction type") },
    { key: "inlet_loss", group: "charge", type: "quantity", kind: "gauge_pressure", optional: true,
      units: { metric: "kPa", imperial: "psi" }, label: _("Pressure loss before the compressor"),
      hint: _("Air filter and inlet pipe. Empty: none") },
    { key: "intercooler_loss", group: "charge", type: "quantity", kind: "gauge_pressure",
      optional: true, units: { metric: "kPa", imperial: "psi" },
      label: _("Pressure loss across the intercooler"), hint: _("Empty: none") },
    { key: "fuel", group: "fuel", type: "choice", label: _("Fuel"), choices: FUEL() },
    { key: "ethanol_content", group: "fuel", type: "percent", optional: true,
      label: _("Ethanol content (by volume)"), hint: _("E10 petrol: 10 %. Empty: the fuel's standard blend") },
    { key: "injector_count", group: "injectors", type: "count", min: 1, max: 64,
      label: _("Number of injectors") },
    { key: "injector_flow", group: "injectors", type: "quantity", kind: "injector_flow",
      optional: true, label: _("Injector flow rating (each)") },
    { key: "rated_pressure", group: "injectors", type: "quantity", kind: "gauge_pressure",
      label: _("Pressure the injector is rated at") },
    { key: "base_fuel_pressure", group: "injectors", type: "quantity", kind: "gauge_pressure",
      label: _("Base fuel pressure (at zero boost)") },
    { key: "regulator", group: "injectors", type: "choice", label: _("Fuel pressure regulator"),
      choices: [{ value: "boost_referenced", label: _("Boost-referenced (rises with boost)") },
        { value: "fixed", label: _("Fixed (not referenced)") }] },
    { key: "pump_count", group: "pump", type: "count", min: 1, max: 16, label: _("Number of fuel pumps") },
    { key: "pump_curve", group: "pump", type: "curve", optional: true,
      label: _("Fuel pump flow curve (from its data sheet)") },
    { key: "power_basis", group: "figures", type: "choice", label: _("Power figures are measured"),
      choices: [{ value: "crank", label: _("At the crank (engine dyno)") },
        { value: "wheel", label: _("At the wheels (chassis dyno)") }] },
    { key: "drivetrain_loss", group: "figures", type: "percent", optional: true,
      label: _("Drivetrain loss (share of crank power)"), hint: _("An estimate: often 10 to 20 %") },
    // --- inputs of the day --------------------------------------------------------
    { key: "site", type: "site", label: _("Today's air") },
    { key: "boost", type: "quantity", kind: "gauge_pressure", label: _("Boost (gauge)") },
    { key: "target_power", type: "quantity", kind: "power", label: _("Target power") },
    { key: "measured_power", type: "quantity", kind: "power", optional: true,
      label: _("Measured power (optional)") },
    { key: "boost_set_where", type: "choice", label: _("That boost is"),
      choices: [{ value: "here", label: _("What the engine makes here") },
        { value: "home", label: _("Set where the NA figure was measured") }] },
    { key: "boost_control", type: "choice", label: _("How the boost is controlled"), choices: CONTROL() },
    { key: "rpm", type: "number", unitText: "rpm", optional: true, min: 500, max: 30000,
      label: _("Engine speed at peak power"), hint: _("For the volumetric efficiency check and the compressor chart") },
    { key: "max_duty", type: "percent", label: _("Highest injector duty allowed") },
    { key: "margin", type: "percent", label: _("Fuel pump reserve wanted") },
    { key: "line_loss", type: "quantity", kind: "gauge_pressure", optional: true,
      label: _("Pressure loss in lines and filter"), hint: _("Empty: none") },
  ];
  return new Map(list.map((f) => [f.key, f]));
}

let cache = null;
let cacheLang = null;

/** All field definitions by key (rebuilt when the language changes). */
export function fields() {
  if (!cache || cacheLang !== currentLang()) {
    cache = build();
    cacheLang = currentLang();
  }
  return cache;
}

/** One field definition. */
export function field(key) {
  return fields().get(key);
}

/** Engine-setup groups in display order. */
export function engineGroups() {
  return [
    { id: "baseline", title: _("Baseline without boost") },
    { id: "engine", title: _("Engine") },
    { id: "charge", title: _("Charge air") },
    { id: "fuel", title: _("Fuel") },
    { id: "injectors", title: _("Injectors and fuel pressure") },
    { id: "pump", title: _("Fuel pump") },
    { id: "figures", title: _("Power figures") },
  ];
}

/** Unit kinds of the quantities of a site (weather pressures default to hPa / inHg). */
export const SITE_KINDS = {
  altitude: { kind: "elevation" },
  altimeter_setting: { kind: "abs_pressure", units: { metric: "hPa", imperial: "inHg" } },
  station_pressure: { kind: "abs_pressure", units: { metric: "hPa", imperial: "inHg" } },
  temperature: { kind: "temperature" },
};

/** The unit a quantity field starts with in a unit system (field override, else kind). */
export function defaultUnit(def, system) {
  return (def.units && def.units[system]) || systemUnit(def.kind, system);
}

/** Labels of site sub-fields (for field errors such as "site.altitude"). */
export function siteLabels() {
  return {
    source: _("Air pressure from"),
    altitude: _("Altitude"),
    altimeter_setting: _("Altimeter setting (QNH)"),
    station_pressure: _("Barometer reading (station pressure)"),
    temperature: _("Air temperature"),
    relative_humidity: _("Relative humidity"),
  };
}

/** Labels of result fields and assumptions, by API name. */
export function outputLabel(name) {
  const labels = {
    station_pressure: _("Air pressure here"),
    dry_air_pressure: _("Dry-air pressure"),
    temperature: _("Air temperature"),
    air_density: _("Air density"),
    density_altitude: _("Density altitude"),
    correction_factor: _("Dyno correction factor (SAE J1349)"),
    boost_here: _("Boost here"),
    manifold_pressure: _("Manifold pressure (absolute)"),
    pressure_ratio: _("Compressor pressure ratio"),
    compressor_inlet_pressure: _("Compressor inlet pressure"),
    compressor_outlet_pressure: _("Compressor outlet pressure"),
    compressor_outlet_temperature: _("Compressor outlet temperature"),
    manifold_temperature: _("Manifold air temperature"),
    sea_level_boost: _("Same manifold pressure at sea level, as boost"),
    ideal_power: _("Ideal power"),
    expected_power: _("Expected power"),
    drive_power: _("Blower drive power"),
    pumping_power: _("Pumping gain (+) or loss (-)"),
    air_mass_flow: _("Air flow (mass)"),
    shortfall: _("Shortfall against expected"),
    boost: _("Boost needed"),
    boost_ideal: _("Boost needed, ideal"),
    max_expected_power: _("Most power reachable"),
    air_volume_flow: _("Air flow at the inlet (volume)"),
    corrected_air_flow: _("Corrected air flow per compressor (for the map)"),
    volumetric_efficiency: _("Volumetric efficiency"),
    flow_per_injector: _("Injector size needed (at rated pressure)"),
    flow_at_operating_pressure: _("Flow each injector must deliver"),
    total_fuel_flow: _("Total fuel flow"),
    pressure_difference: _("Pressure across the injectors"),
    injector_flow_at_operating_pressure: _("Your injector's flow at that pressure"),
    duty_at_power: _("Your injectors' duty at that power"),
    max_power: _("Power limit"),
    required_flow: _("Pump flow needed (with reserve)"),
    required_pressure: _("Pump outlet pressure needed"),
    available_flow: _("Your pumps' flow at that pressure"),
    margin_available: _("Reserve you have"),
    measured_power: _("Measured power"),
    max_pressure_ratio: _("Highest pressure ratio allowed"),
    coolant_temperature: _("Intercooler coolant (ambient) temperature"),
    bsfc: _("Brake specific fuel consumption"),
    afr: _("Air-fuel ratio"),
    lambda: _("Lambda"),
    exhaust_to_boost_ratio: _("Exhaust back pressure / boost"),
    drive_efficiency: _("Blower drive efficiency"),
    fuel_density: _("Fuel density"),
    reference_pressure: _("Compressor map reference pressure"),
    reference_temperature: _("Compressor map reference temperature"),
    rating_fluid_density: _("Density of the injector test fluid"),
  };
  if (labels[name]) return labels[name];
  const [head, sub] = name.split(".");
  const f = field(head);
  const base = f ? f.label : head;
  return sub ? `${base}: ${siteLabels()[sub] || labels[sub] || sub}` : base;
}
