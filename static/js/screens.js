/**
 * The calculation screens: what each one asks (inputs of the day; the engine setup is
 * shared), which endpoint it calls, how the request body is built from the setup, and
 * which results it shows. Bodies follow SPEC section 3; quantities are sent as
 * `{"value", "unit"}` objects, fractions as plain numbers.
 */
import { _ } from "./i18n.js";
import { BLENDABLE } from "./fields.js";

const present = (v) => v !== null && v !== undefined;

/** Copy the keys of `values` that are set. */
function pick(values, keys) {
  const out = {};
  for (const key of keys) if (present(values[key])) out[key] = values[key];
  return out;
}

/** A site object for the API from the stored form (source decides which pressure). */
export function siteBody(site) {
  if (!site) return {};
  const out = pick(site, ["altitude", "temperature", "relative_humidity"]);
  if (site.source === "altimeter" && present(site.altimeter_setting)) {
    out.altimeter_setting = site.altimeter_setting;
  }
  if (site.source === "station" && present(site.station_pressure)) {
    out.station_pressure = site.station_pressure;
  }
  return out;
}

/** Curve table -> list of `{pressure, flow}` points (empty rows left out). */
export function curveBody(curve) {
  if (!curve) return null;
  const points = curve.points
    .filter(([p, f]) => present(p) && present(f))
    .map(([p, f]) => ({ pressure: { value: p, unit: curve.pressure_unit },
      flow: { value: f, unit: curve.flow_unit } }));
  return points.length ? points : null;
}

function charge(e) {
  return {
    induction: e.induction,
    intercooler_effectiveness: e.intercooler ? e.intercooler_effectiveness ?? 0.75 : 0,
    ...pick(e, ["compressor_efficiency", "inlet_loss", "intercooler_loss"]),
  };
}

function fuel(e) {
  const out = { fuel: e.fuel };
  if (BLENDABLE.includes(e.fuel) && present(e.ethanol_content)) out.ethanol_content = e.ethanol_content;
  return out;
}

function basis(e) {
  if (e.power_basis !== "wheel") return {};
  return pick({ power_basis: "wheel", drivetrain_loss: e.drivetrain_loss },
    ["power_basis", "drivetrain_loss"]);
}

function baseline(e) {
  return { ...pick(e, ["na_power"]), na_power_basis: e.na_power_basis, na_site: siteBody(e.na_site) };
}

function fuelSystem(e) {
  return { ...fuel(e), induction: e.induction,
    ...pick(e, ["base_fuel_pressure"]), regulator: e.regulator };
}

/**
 * The screens. `inputs` lists the inputs of the day shown on the screen (`api` is the
 * request field when it differs); `outputs` the results in order (first ones large).
 */
export function screens() {
  return [
    {
      id: "site", endpoint: "site", nav: _("Conditions"), title: _("Today's air"),
      intro: _("Air pressure, density and the dyno correction factor for where you are."),
      inputs: [{ key: "site" }],
      body: (e, i) => ({ site: siteBody(i.site) }),
      outputs: ["station_pressure", "density_altitude", "correction_factor", "air_density",
        "dry_air_pressure", "temperature"],
      notes: () => [
        _("At standard sea-level air the SAE J1349 factor is about 0.95, not 1: the standard's reference air (25 °C, 99 kPa dry) is warmer and thinner."),
        _("For a boosted engine whose boost control holds manifold pressure, the correction overstates the power it would make in the reference air."),
      ],
    },
    {
      id: "pressure-ratio", endpoint: "pressure-ratio", nav: _("Boost"),
      title: _("Boost and pressure ratio"),
      intro: _("What the compressor sees at this boost in today's air, and how hot the charge gets."),
      inputs: [{ key: "boost" }, { key: "boost_set_where" },
        { key: "boost_control", when: (i) => i.boost_set_where === "home" }, { key: "site" }],
      body: (e, i) => {
        const out = { ...pick(i, ["boost"]), site: siteBody(i.site), ...charge(e) };
        if (i.boost_set_where === "home") {
          out.boost_set_at = { site: siteBody(e.na_site), control: i.boost_control };
        }
        return out;
      },
      hideNull: ["boost_here"],
      outputs: ["pressure_ratio", "manifold_pressure", "boost_here", "compressor_outlet_temperature",
        "manifold_temperature", "sea_level_boost", "compressor_inlet_pressure",
        "compressor_outlet_pressure"],
    },
    {
      id: "power", endpoint: "power", nav: _("Power check"), title: _("Power check"),
      intro: _("What the engine should make at this boost, and where to look if it made less."),
      inputs: [{ key: "boost" }, { key: "measured_power" }, { key: "site" }],
      body: (e, i) => ({ ...baseline(e), ...pick(i, ["boost", "measured_power"]),
        site: siteBody(i.site), ...charge(e), ...fuel(e), ...basis(e) }),
      outputs: ["expected_power", "ideal_power", "shortfall", "drive_power", "pumping_power",
        "pressure_ratio", "manifold_temperature", "air_mass_flow"],
      chart: () => import("./charts/power-boost.js"),
    },
    {
      id: "boost-for-power", endpoint: "boost-for-power", nav: _("Boost target"),
      title: _("Boost for a target power"),
      intro: _("The boost needed for a power here, and how it changes with altitude."),
      inputs: [{ key: "target_power" }, { key: "site" }],
      body: (e, i) => ({ ...baseline(e), ...pick(i, ["target_power"]), site: siteBody(i.site),
        ...charge(e), ...fuel(e), ...basis(e) }),
      outputs: ["boost", "boost_ideal", "pressure_ratio", "manifold_pressure", "expected_power",
        "max_expected_power"],
      chart: () => import("./charts/altitude.js"),
    },
    {
      id: "airflow", endpoint: "airflow", nav: _("Airflow"), title: _("Airflow"),
      intro: _("Air flow for a power, and the corrected flow to read a compressor map."),
      inputs: [{ key: "target_power", api: "power" }, { key: "boost" }, { key: "rpm" }, { key: "site" }],
      body: (e, i) => {
        const out = { ...pick({ power: i.target_power }, ["power"]), ...fuel(e),
          site: siteBody(i.site), ...pick(i, ["boost"]), ...charge(e),
          compressor_count: e.compressor_count ?? 1, ...basis(e) };
        if (present(i.rpm) && present(e.displacement)) {
          out.rpm = i.rpm;
          out.displacement = e.displacement;
        }
        return out;
      },
      outputs: ["air_mass_flow", "corrected_air_flow", "pressure_ratio", "air_volume_flow",
        "volumetric_efficiency"],
      chart: () => import("./charts/compressor.js"),
    },
    {
      id: "injectors", endpoint: "injectors", nav: _("Injectors"), title: _("Injectors"),
      intro: _("Injector size for a power, and the duty and power limit of yours."),
      inputs: [{ key: "target_power", api: "power" }, { key: "boost" }, { key: "max_duty" }],
      body: (e, i) => ({ ...pick({ power: i.target_power }, ["power"]), ...fuelSystem(e),
        ...pick(e, ["injector_count", "injector_flow", "rated_pressure"]),
        ...pick(i, ["boost", "max_duty"]), ...basis(e) }),
      outputs: ["flow_per_injector", "duty_at_power", "max_power", "total_fuel_flow",
        "flow_at_operating_pressure", "injector_flow_at_operating_pressure", "pressure_difference"],
    },
    {
      id: "fuel-pump", endpoint: "fuel-pump", nav: _("Fuel pump"), title: _("Fuel pump"),
      intro: _("Fuel flow and pressure the pump must deliver, and whether yours keeps up."),
      inputs: [{ key: "target_power", api: "power" }, { key: "boost" }, { key: "margin" },
        { key: "line_loss" }],
      body: (e, i) => {
        const out = { ...pick({ power: i.target_power }, ["power"]), ...fuelSystem(e),
          ...pick(i, ["boost", "margin", "line_loss"]), pump_count: e.pump_count ?? 1, ...basis(e) };
        const curve = curveBody(e.pump_curve);
        if (curve) out.pump_curve = curve;
        return out;
      },
      outputs: ["required_flow", "required_pressure", "available_flow", "margin_available",
        "max_power"],
      chart: () => import("./charts/pump.js"),
    },
  ];
}

/** Percent-style results (fractions shown as %). */
export const PERCENT_OUTPUTS = ["shortfall", "margin_available", "duty_at_power",
  "volumetric_efficiency"];

/** Plain ratios. */
export const RATIO_OUTPUTS = ["pressure_ratio", "correction_factor"];

/** The full request body of a screen: its fields plus units and language. */
export function requestBody(screen, engine, inputs, system, lang) {
  return { ...screen.body(engine, inputs), units: system, lang };
}
