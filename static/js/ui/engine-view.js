/**
 * The engine setup screen: the saved setups, then the engine entered once (NA baseline,
 * induction, intercooler, fuel, injectors, regulator, pump curve) that every screen uses.
 */
import { h, replace } from "../dom.js";
import { _ } from "../i18n.js";
import { engineGroups, fields, BLENDABLE } from "../fields.js";
import { store, activeSetup, setEngineValue, subscribe } from "../store.js";
import { widgetFor } from "./screen-view.js";
import { pumpCurveInput } from "./pump-curve-input.js";
import { setupManager } from "./setup-manager.js";

/** Fields shown only when another value makes them matter. */
const WHEN = {
  intercooler_effectiveness: (e) => e.intercooler === true,
  intercooler_loss: (e) => e.intercooler === true,
  ethanol_content: (e) => BLENDABLE.includes(e.fuel),
  drivetrain_loss: (e) => e.power_basis === "wheel",
};

export function engineView() {
  const manager = setupManager();
  const groupsBox = h("div", { class: "engine-groups" });
  let widgets = [];
  let builtFor = null;

  function build() {
    builtFor = activeSetup().id;
    const engine = activeSetup().engine;
    const system = store.prefs.system;
    widgets = [];
    const all = [...fields().values()].filter((f) => f.group);
    replace(groupsBox, engineGroups().map((group) => h("fieldset", { class: "group" },
      h("legend", { class: "group__title" }, group.title),
      all.filter((f) => f.group === group.id).map((def) => {
        const onChange = (v) => setEngineValue(def.key, v);
        const widget = def.type === "curve"
          ? pumpCurveInput(def, engine[def.key], onChange, { system, path: def.key })
          : widgetFor(def, engine[def.key], onChange, def.api || def.key, system);
        widgets.push({ def, widget });
        return widget.el;
      }))));
    showWhen();
  }

  function showWhen() {
    const engine = activeSetup().engine;
    for (const { def, widget } of widgets) {
      if (WHEN[def.key]) widget.el.hidden = !WHEN[def.key](engine);
    }
  }

  build();
  const unsubscribe = subscribe((what) => {
    if (what === "setups" || what === "system") {
      manager.render();
      // a rename keeps the form (and the field being typed in) as it is
      if (what === "system" || activeSetup().id !== builtFor) build();
    }
    if (what === "engine") showWhen();
  });

  const el = h("section", { class: "screen", dataset: { screen: "engine" } },
    h("h2", { class: "screen__title" }, _("Engine setup")),
    h("p", { class: "screen__intro" }, _("Enter the engine once: every screen uses it. Changes are saved on this device as you type.")),
    manager.el, groupsBox);
  return { el, destroy: unsubscribe };
}
