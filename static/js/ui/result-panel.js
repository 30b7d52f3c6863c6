/**
 * The results of a screen: the values with their units, the warnings next to them
 * (severity in words and a symbol, not by colour alone), the causes of a shortfall,
 * what was assumed, and a marker when the numbers were computed on this device.
 */
import { h, replace } from "../dom.js";
import { _ } from "../i18n.js";
import { formatNumber, unitLabel } from "../units.js";
import { outputLabel } from "../fields.js";
import { PERCENT_OUTPUTS, RATIO_OUTPUTS } from "../screens.js";

const SEVERITY = {
  danger: { symbol: "⛔", word: () => _("Danger") },
  caution: { symbol: "⚠", word: () => _("Caution") },
  info: { symbol: "ℹ", word: () => _("Note") },
};

function styleOf(name) {
  if (PERCENT_OUTPUTS.includes(name)) return "percent";
  if (RATIO_OUTPUTS.includes(name)) return "ratio";
  return "number";
}

/** Text and data attributes for one value (quantity object, number or null). */
function valueNode(name, value) {
  if (value === null || value === undefined) {
    return h("dd", { class: "result__value result__value--none", dataset: { value: "null" } },
      _("not reached"));
  }
  if (typeof value === "number") {
    return h("dd", { class: "result__value", dataset: { value: String(value), unit: "" } },
      h("span", { class: "result__num" }, formatNumber(value, styleOf(name))));
  }
  if (typeof value === "object" && typeof value.value === "number") {
    return h("dd", { class: "result__value", dataset: { value: String(value.value), unit: value.unit } },
      h("span", { class: "result__num" }, formatNumber(value.value)), " ",
      h("span", { class: "result__unit" }, unitLabel(value.unit)));
  }
  return h("dd", { class: "result__value" }, String(value));
}

/** A list of warnings `[{code, severity, message}]`. */
export function warningList(warnings) {
  if (!warnings || !warnings.length) return null;
  return h("ul", { class: "warnings", "aria-label": _("Warnings") },
    warnings.map((w) => {
      const sev = SEVERITY[w.severity] || SEVERITY.info;
      return h("li", { class: `warning warning--${w.severity}`, dataset: { code: w.code } },
        h("span", { class: "warning__symbol", "aria-hidden": "true" }, sev.symbol),
        h("strong", { class: "warning__severity" }, `${sev.word()}:`), " ", w.message);
    }));
}

function assumptionItem([name, value]) {
  let text;
  if (value && typeof value === "object" && typeof value.value === "number") {
    text = `${formatNumber(value.value)} ${unitLabel(value.unit)}`;
  } else if (typeof value === "number") text = formatNumber(value, styleOf(name));
  else text = typeof value === "object" ? JSON.stringify(value) : String(value);
  return h("li", {}, `${outputLabel(name)}: `, h("span", { class: "assumed__value" }, text));
}

/** The panel; `show()` renders one API response. */
export function resultPanel() {
  const el = h("section", { class: "results", "aria-live": "polite", "aria-label": _("Results") });
  let busyTimer = null;

  return {
    el,
    /** Mark the panel as waiting (only shown when an answer takes a while). */
    busy() {
      clearTimeout(busyTimer);
      busyTimer = setTimeout(() => el.classList.add("results--busy"), 400);
    },
    /**
     * @param {object} body successful response body
     * @param {object} screen screen definition (outputs, notes)
     */
    show(body, screen) {
      clearTimeout(busyTimer);
      el.classList.remove("results--busy");
      const device = body.computed_on === "device";
      const hidden = screen.hideNull || [];
      const items = screen.outputs.filter((name) => name in body
        && !(body[name] === null && hidden.includes(name))).map((name, index) =>
        h("div", { class: index < 2 ? "result result--main" : "result", dataset: { field: name } },
          h("dt", { class: "result__label" }, outputLabel(name)), valueNode(name, body[name])));
      const causes = Array.isArray(body.causes) && body.causes.length
        ? h("div", { class: "causes" }, h("h3", {}, _("Where to look first")),
          h("ol", {}, body.causes.map((c) => h("li", { dataset: { code: c.code || "" } },
            c.message || c.code,
            c.power && typeof c.power.value === "number"
              ? ` (${_("about")} ${formatNumber(c.power.value)} ${unitLabel(c.power.unit)})` : "")))) : null;
      const assumed = body.assumptions && Object.keys(body.assumptions).length
        ? h("details", { class: "assumed" }, h("summary", {}, _("Values assumed")),
          h("ul", {}, Object.entries(body.assumptions).map(assumptionItem))) : null;
      const notes = screen.notes ? h("ul", { class: "notes" }, screen.notes().map((n) => h("li", {}, n))) : null;
      replace(el,
        device ? h("p", { class: "badge badge--device" }, _("Computed on this device (offline)")) : null,
        h("dl", { class: "result-list" }, items),
        warningList(body.warnings),
        causes, notes, assumed);
    },
    /**
     * Show an error: the message and the field errors that have no input on screen
     * (`others`: [{label, message}]).
     */
    error(message, others = []) {
      clearTimeout(busyTimer);
      el.classList.remove("results--busy");
      replace(el, h("div", { class: "error" },
        h("p", { class: "error__message" }, h("strong", {}, `${_("Cannot compute")}: `), message),
        others.length ? h("ul", { class: "error__fields" },
          others.map((o) => h("li", {}, o.link ? h("a", { href: o.link }, o.label) : o.label,
            `: ${o.message}`))) : null));
    },
    /** A plain message, e.g. waiting for the first result. */
    message(text) {
      replace(el, h("p", { class: "results__message" }, text));
    },
  };
}
