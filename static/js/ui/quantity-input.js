/**
 * A numeric input with its unit: a quantity (number + unit picker), a percentage (stored
 * as a fraction), a count or a plain number with a fixed unit text (rpm). Big target,
 * decimal keyboard; the unit picker labels what was typed (changing it keeps the number).
 */
import { h, uid } from "../dom.js";
import { _, format } from "../i18n.js";
import { choicesFor, inputText, parseNumber, unitLabel } from "../units.js";
import { markTyped } from "../store.js";

function shownNumber(type, value) {
  if (value === null || value === undefined) return "";
  if (type === "quantity") return inputText(value.value);
  if (type === "percent") return inputText(Number((value * 100).toPrecision(12)));
  return inputText(value);
}

/**
 * @param {object} def field definition (type, kind, label, hint, optional, unitText)
 * @param {*} value stored value
 * @param {(value) => void} onChange called with the new stored value when valid
 * @param {object} [opts] `{path, placeholder, defaultUnit}`
 */
export function quantityInput(def, value, onChange, opts = {}) {
  const id = uid("in");
  const hintId = `${id}-hint`;
  const errId = `${id}-err`;
  let current = value;
  let valid = true;
  const unitFallback = opts.defaultUnit || null;

  const input = h("input", {
    id, type: "text", inputmode: def.type === "count" ? "numeric" : "decimal",
    autocomplete: "off", spellcheck: "false", enterkeyhint: "done",
    class: "field__input", value: shownNumber(def.type, value),
    placeholder: opts.placeholder || (def.optional ? _("optional") : ""),
    "aria-describedby": def.hint ? `${hintId} ${errId}` : errId,
  });
  const error = h("p", { class: "field__error", id: errId, hidden: true });

  let unitEl;
  if (def.type === "quantity") {
    const unit = (value && value.unit) || unitFallback;
    unitEl = h("select", { class: "field__unit", "aria-label": format(_("Unit of %(field)s"), { field: def.label }) },
      choicesFor(def.kind, unit).map((u) => h("option", { value: u, selected: u === unit }, unitLabel(u))));
    unitEl.value = unit;
    unitEl.addEventListener("change", () => {
      markTyped();
      if (current && typeof current.value === "number") {
        current = { value: current.value, unit: unitEl.value };
        onChange(current);
      }
    });
  } else {
    const text = def.type === "percent" ? "%" : def.unitText || "";
    unitEl = text ? h("span", { class: "field__unit field__unit--fixed", "aria-hidden": "true" }, text) : null;
  }

  function setError(message) {
    error.textContent = message || "";
    error.hidden = !message;
    input.setAttribute("aria-invalid", message ? "true" : "false");
  }

  input.addEventListener("input", () => {
    markTyped();
    const n = parseNumber(input.value);
    if (Number.isNaN(n)) {
      valid = false;
      setError(_("Enter a number, for example 1.5"));
      return;
    }
    if (def.type === "count" && n !== null && !Number.isInteger(n)) {
      valid = false;
      setError(_("Enter a whole number"));
      return;
    }
    valid = true;
    setError("");
    if (n === null) current = null;
    else if (def.type === "quantity") current = { value: n, unit: unitEl.value };
    else if (def.type === "percent") current = n / 100;
    else current = n;
    onChange(current);
  });

  const label = h("label", { for: id, class: "field__label" }, def.label);
  const el = h("div", { class: "field", dataset: { field: opts.path || def.key } },
    label,
    h("div", { class: "field__row" }, input, unitEl),
    def.hint ? h("p", { class: "field__hint", id: hintId }, def.hint) : null,
    error);

  return {
    el,
    input,
    setError,
    isValid: () => valid,
    /** Show a new stored value (not while the user is typing in this field). */
    setValue(next) {
      current = next;
      if (document.activeElement !== input) {
        input.value = shownNumber(def.type, next);
        valid = true;
        setError("");
      }
      if (def.type === "quantity" && next && next.unit && unitEl.value !== next.unit) {
        if (![...unitEl.options].some((o) => o.value === next.unit)) {
          unitEl.append(h("option", { value: next.unit }, unitLabel(next.unit)));
        }
        unitEl.value = next.unit;
      }
    },
  };
}
