/**
 * The fuel pump's data-sheet curve: a table of (outlet pressure, flow) points with one
 * unit per column, rows added and removed with buttons. Empty rows are ignored.
 */
import { h, replace } from "../dom.js";
import { _, format } from "../i18n.js";
import { choicesFor, inputText, parseNumber, unitLabel } from "../units.js";
import { defaultUnit } from "../fields.js";
import { markTyped } from "../store.js";

const MAX_POINTS = 30;

/**
 * @param {object} def field definition
 * @param {object|null} value `{pressure_unit, flow_unit, points: [[p, f], ...]}`
 * @param {(value) => void} onChange
 * @param {object} opts `{system, path}`
 */
export function pumpCurveInput(def, value, onChange, opts) {
  let curve = value ? structuredClone(value) : {
    pressure_unit: defaultUnit({ kind: "gauge_pressure" }, opts.system),
    flow_unit: defaultUnit({ kind: "pump_flow" }, opts.system),
    points: [[null, null], [null, null]],
  };
  let valid = true;
  const body = h("tbody");
  const error = h("p", { class: "field__error", hidden: true });

  const unitSelect = (kind, key, label) => {
    const select = h("select", { class: "field__unit", "aria-label": label },
      choicesFor(kind, curve[key]).map((u) => h("option", { value: u }, unitLabel(u))));
    select.value = curve[key];
    select.addEventListener("change", () => {
      markTyped();
      curve = { ...curve, [key]: select.value };
      onChange(curve);
    });
    return select;
  };
  const pressureUnit = unitSelect("gauge_pressure", "pressure_unit", _("Unit of the pump pressure"));
  const flowUnit = unitSelect("pump_flow", "flow_unit", _("Unit of the pump flow"));
  const unitLabelled = (text, select) => h("label", { class: "curve__unit" }, text, " ", select);

  function cell(row, col) {
    const label = col === 0 ? format(_("Pressure, point %(n)s"), { n: row + 1 })
      : format(_("Flow, point %(n)s"), { n: row + 1 });
    const input = h("input", { type: "text", inputmode: "decimal", class: "field__input",
      autocomplete: "off", "aria-label": label, value: inputText(curve.points[row][col]) });
    input.addEventListener("input", () => {
      markTyped();
      const n = parseNumber(input.value);
      input.setAttribute("aria-invalid", Number.isNaN(n) ? "true" : "false");
      valid = ![...body.querySelectorAll("input")].some((i) => i.getAttribute("aria-invalid") === "true");
      if (Number.isNaN(n)) return;
      curve.points[row][col] = n;
      onChange(structuredClone(curve));
    });
    return h("td", {}, input);
  }

  function render() {
    replace(body, curve.points.map((point, row) => {
      const remove = h("button", { type: "button", class: "button",
        "aria-label": format(_("Remove point %(n)s"), { n: row + 1 }) }, "✕");
      remove.addEventListener("click", () => {
        markTyped();
        curve.points.splice(row, 1);
        render();
        onChange(structuredClone(curve));
      });
      return h("tr", {}, cell(row, 0), cell(row, 1), h("td", {}, remove));
    }));
    add.disabled = curve.points.length >= MAX_POINTS;
  }

  const add = h("button", { type: "button", class: "button" }, _("Add a point"));
  add.addEventListener("click", () => {
    markTyped();
    curve.points.push([null, null]);
    render();
    body.querySelector("tr:last-child input").focus();
  });
  render();

  const el = h("div", { class: "field curve", dataset: { field: opts.path || def.key } },
    h("p", { class: "field__label" }, def.label),
    h("p", { class: "field__hint" }, _("Outlet pressure (gauge) rising from row to row; flow at the pump's rated voltage.")),
    h("div", { class: "curve__units" }, unitLabelled(_("Pressure in"), pressureUnit),
      unitLabelled(_("Flow in"), flowUnit)),
    h("table", {},
      h("thead", {}, h("tr", {},
        h("th", { scope: "col" }, _("Pressure")),
        h("th", { scope: "col" }, _("Flow")),
        h("th", { scope: "col" }, h("span", { class: "visually-hidden" }, _("Remove"))))),
      body),
    add, error);

  return {
    el,
    isValid: () => valid,
    setError(message) {
      error.textContent = message || "";
      error.hidden = !message;
    },
    setValue(next) {
      if (JSON.stringify(next) === JSON.stringify(curve)) return;
      curve = next ? structuredClone(next) : curve;
      pressureUnit.value = curve.pressure_unit;
      flowUnit.value = curve.flow_unit;
      render();
    },
  };
}
