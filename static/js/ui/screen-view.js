/**
 * One calculation screen: the inputs of the day it needs, a line naming the engine
 * setup in use, the results (updated as you type) and, on some screens, a chart.
 */
import { h, replace } from "../dom.js";
import { _, currentLang } from "../i18n.js";
import { field, defaultUnit, siteLabels } from "../fields.js";
import { store, activeSetup, setInput, subscribe } from "../store.js";
import { calculate } from "../api.js";
import { requestBody } from "../screens.js";
import { quantityInput } from "./quantity-input.js";
import { choiceInput } from "./choice-input.js";
import { siteInput } from "./site-input.js";
import { resultPanel } from "./result-panel.js";

const THROTTLE_MS = 150;
const CHART_DELAY_MS = 300;
let firstResultMarked = false;

/** Leading- and trailing-edge throttle: the first change computes at once. */
function throttle(fn, wait) {
  let timer = null;
  let pending = false;
  let last = -Infinity;
  const fire = () => {
    last = performance.now();
    pending = false;
    fn();
  };
  return () => {
    const since = performance.now() - last;
    if (timer === null && since >= wait) return fire();
    pending = true;
    if (timer === null) {
      timer = setTimeout(() => {
        timer = null;
        if (pending) fire();
      }, Math.max(0, wait - since));
    }
    return undefined;
  };
}

/** A widget for a field definition. */
export function widgetFor(def, value, onChange, path, system) {
  if (def.type === "site") return siteInput(def, value, onChange, { path, system });
  if (def.type === "choice") return choiceInput(def, value, onChange, { path });
  if (def.type === "bool") {
    return choiceInput({ ...def, choices: [{ value: true, label: _("Yes") }, { value: false, label: _("No") }] },
      value, onChange, { path });
  }
  return quantityInput(def, value, onChange,
    { path, defaultUnit: def.kind ? defaultUnit(def, system) : null });
}

/** Label of an API field path ("na_site.altitude") for error lists. */
export function pathLabel(path) {
  const [head, sub] = path.split(".");
  const top = field(head.replace(/\[.*$/, ""));
  const name = top ? top.label : head;
  const subLabel = sub && siteLabels()[sub];
  return subLabel ? `${name}: ${subLabel}` : name;
}

/**
 * @param {object} screen definition from screens.js
 * @param {object} ctx `{cautions}` the shared cautions panel
 * @returns {{el: HTMLElement, destroy: () => void}}
 */
export function screenView(screen, { cautions }) {
  const system = store.prefs.system;
  const entries = screen.inputs.map((spec) => {
    const def = field(spec.key);
    const path = spec.api || spec.key;
    const widget = widgetFor(def, store.inputs[spec.key], (v) => setInput(spec.key, v), path, system);
    return { spec, path, widget };
  });
  const panel = resultPanel();
  const chartBox = screen.chart ? h("div", { class: "chart-box" }) : null;
  const summary = h("p", { class: "setup-line" });

  function renderSummary() {
    const setup = activeSetup();
    replace(summary, `${_("Engine setup")}: `, h("strong", {}, setup.name), " ",
      setup.demo ? h("span", { class: "badge badge--demo" }, _("Demo")) : null, " ",
      h("a", { href: "#/engine", class: "setup-line__edit" }, _("Change")));
  }

  function showWhen() {
    for (const { spec, widget } of entries) {
      if (spec.when) widget.el.hidden = !spec.when(store.inputs);
    }
  }

  let seq = 0;
  let controller = null;
  let chartTimer = null;

  function clearErrors() {
    for (const { widget } of entries) {
      if (widget.clearErrors) widget.clearErrors();
      else widget.setError("");
    }
  }

  function placeErrors(error) {
    const others = [];
    for (const item of (error && error.fields) || []) {
      const entry = entries.find((e) => item.field === e.path || item.field.startsWith(`${e.path}.`));
      if (entry) {
        entry.widget.setError(item.message, item.field.slice(entry.path.length + 1));
      } else {
        const engineField = field(item.field.split(".")[0].replace(/\[.*$/, ""));
        others.push({ label: pathLabel(item.field), message: item.message,
          link: engineField && engineField.group ? "#/engine" : null });
      }
    }
    panel.error((error && error.message) || _("The server could not compute this."), others);
  }

  async function run() {
    if (!entries.every((e) => e.widget.isValid())) {
      panel.error(_("Fix the marked input first."));
      return;
    }
    const engine = activeSetup().engine;
    const body = requestBody(screen, engine, store.inputs, store.prefs.system, currentLang());
    seq += 1;
    const mine = seq;
    if (controller) controller.abort();
    controller = new AbortController();
    panel.busy();
    let response;
    try {
      response = await calculate(screen.endpoint, body, { signal: controller.signal });
    } catch {
      return;
    }
    if (mine !== seq) return;
    clearErrors();
    if (response.status === 200 && response.body) {
      panel.show(response.body, screen);
      cautions.update(response.body.cautions);
      if (!firstResultMarked) {
        firstResultMarked = true;
        performance.mark("webcalc:first-result");
      }
      scheduleChart(engine, body, response.body);
    } else if (response.status === 0) {
      panel.error(_("The server cannot be reached, and this device has no offline copy yet: open the app once while online."));
    } else {
      placeErrors(response.body && response.body.error);
    }
  }

  function scheduleChart(engine, body, result) {
    if (!chartBox) return;
    clearTimeout(chartTimer);
    const mine = seq;
    chartTimer = setTimeout(async () => {
      const mod = await screen.chart();
      const calc = (endpoint, chartBody) => calculate(endpoint, { ...chartBody, units: body.units,
        lang: body.lang }, { purpose: "chart", signal: controller.signal });
      try {
        const figure = await mod.buildChart({ engine, inputs: store.inputs, body, result, calc,
          system: store.prefs.system });
        if (mine === seq) replace(chartBox, figure || "");
      } catch (err) {
        if (err && err.name === "AbortError") return;
        if (mine === seq) replace(chartBox, h("p", { class: "results__message" }, _("The chart could not be drawn.")));
      }
    }, CHART_DELAY_MS);
  }

  const schedule = throttle(run, THROTTLE_MS);

  let destroyed = false;
  const unsubscribe = subscribe((what) => {
    if (destroyed) return;
    if (what === "inputs") showWhen();
    if (what === "engine" || what === "setups") renderSummary();
    if (what === "setups") {
      for (const { spec, widget } of entries) widget.setValue(store.inputs[spec.key]);
    }
    if (what !== "prefs") schedule();
  });

  renderSummary();
  showWhen();
  const form = h("form", { class: "inputs", novalidate: true, "aria-label": _("Inputs") },
    entries.map((e) => e.widget.el));
  form.addEventListener("submit", (event) => event.preventDefault());
  const el = h("section", { class: "screen", dataset: { screen: screen.id } },
    h("h2", { class: "screen__title" }, screen.title),
    h("p", { class: "screen__intro" }, screen.intro),
    summary,
    h("div", { class: "screen__body" }, form, h("div", { class: "screen__out" }, panel.el, chartBox)));
  panel.message(_("Computing…"));
  schedule();

  return {
    el,
    destroy() {
      destroyed = true;
      unsubscribe();
      clearTimeout(chartTimer);
      if (controller) controller.abort();
    },
  };
}
