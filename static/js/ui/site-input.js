/**
 * A place and its weather: altitude and where the air pressure comes from (standard
 * air at that altitude, a weather report's altimeter setting, or a barometer reading),
 * air temperature and humidity (both optional: a standard day and dry air).
 */
import { h } from "../dom.js";
import { _ } from "../i18n.js";
import { SITE_KINDS, defaultUnit, siteLabels } from "../fields.js";
import { quantityInput } from "./quantity-input.js";
import { choiceInput } from "./choice-input.js";

/**
 * @param {object} def field definition (label = legend)
 * @param {object} value stored site
 * @param {(site) => void} onChange
 * @param {object} opts `{path, system}`
 */
export function siteInput(def, value, onChange, opts) {
  let site = { ...value };
  const path = opts.path || def.key;
  const labels = siteLabels();
  const parts = {};
  const update = (key) => (v) => {
    site = { ...site, [key]: v };
    if (key === "source") showParts();
    onChange(site);
  };

  parts.source = choiceInput({ key: "source", label: labels.source, choices: [
    { value: "altitude", label: _("Altitude (standard air)") },
    { value: "altimeter", label: _("Weather report: altimeter setting (QNH)") },
    { value: "station", label: _("Barometer reading at the site") },
  ] }, site.source, update("source"), { path: `${path}.source` });

  const hints = {
    altitude: _("Height above sea level"),
    temperature: _("Empty: a standard day at this altitude"),
    altimeter_setting: _("As in the weather report (sea-level pressure)"),
  };
  for (const key of Object.keys(SITE_KINDS)) {
    const kindDef = { key, type: "quantity", ...SITE_KINDS[key], label: labels[key],
      hint: hints[key], optional: key === "temperature" };
    parts[key] = quantityInput(kindDef, site[key], update(key), {
      path: `${path}.${key}`, defaultUnit: defaultUnit(kindDef, opts.system),
      placeholder: key === "temperature" ? _("standard day") : undefined,
    });
  }
  parts.relative_humidity = quantityInput({ key: "relative_humidity", type: "percent",
    label: labels.relative_humidity, optional: true, hint: _("Empty: dry air") },
  site.relative_humidity, update("relative_humidity"), { path: `${path}.relative_humidity`,
    placeholder: "0" });

  function showParts() {
    parts.altimeter_setting.el.hidden = site.source !== "altimeter";
    parts.station_pressure.el.hidden = site.source !== "station";
  }
  showParts();

  const el = h("fieldset", { class: "group site" },
    h("legend", { class: "group__title" }, def.label),
    parts.source.el, parts.altitude.el, parts.altimeter_setting.el, parts.station_pressure.el,
    parts.temperature.el, parts.relative_humidity.el);

  return {
    el,
    parts,
    isValid: () => Object.values(parts).every((p) => p.isValid()),
    setError(message, sub) {
      const part = parts[sub] || parts.altitude;
      part.setError(message);
    },
    clearErrors() {
      for (const p of Object.values(parts)) p.setError("");
    },
    setValue(next) {
      site = { ...next };
      for (const [key, part] of Object.entries(parts)) part.setValue(site[key]);
      showParts();
    },
  };
}
