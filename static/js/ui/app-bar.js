/**
 * The app bar: title, unit system (metric / imperial), sunlight theme, and the
 * navigation between screens (a bottom bar on a phone, a side list on a laptop).
 */
import { h } from "../dom.js";
import { _ } from "../i18n.js";
import { store, setPref } from "../store.js";

/**
 * @param {Array<{id, nav}>} items navigation entries (screen id and short name)
 */
export function appBar(items) {
  const systems = [
    { value: "metric", label: _("Metric") },
    { value: "imperial", label: _("Imperial") },
  ];
  const systemButtons = systems.map((sys) => {
    const button = h("button", { type: "button", class: "toggle", dataset: { system: sys.value },
      "aria-pressed": String(store.prefs.system === sys.value) }, sys.label);
    button.addEventListener("click", () => setPref("system", sys.value));
    return button;
  });
  const theme = h("button", { type: "button", class: "toggle toggle--theme",
    "aria-pressed": String(store.prefs.theme === "sun") }, _("Sunlight mode"));
  theme.addEventListener("click", () => setPref("theme", store.prefs.theme === "sun" ? "standard" : "sun"));

  const links = items.map((item) => h("a", { href: `#/${item.id}`, class: "nav__link",
    dataset: { screen: item.id } }, item.nav));
  const header = h("header", { class: "appbar" },
    h("h1", { class: "appbar__title" }, _("Boost and fuel check")),
    h("div", { class: "appbar__controls" },
      h("div", { class: "segmented", role: "group", "aria-label": _("Units") }, systemButtons),
      theme));
  const nav = h("nav", { class: "nav", "aria-label": _("Screens") }, h("ul", { class: "nav__list" },
    links.map((a) => h("li", {}, a))));

  return {
    header,
    nav,
    /** Reflect the preferences and the current screen. */
    update(current) {
      for (const b of systemButtons) b.setAttribute("aria-pressed", String(store.prefs.system === b.dataset.system));
      theme.setAttribute("aria-pressed", String(store.prefs.theme === "sun"));
      for (const a of links) {
        if (a.dataset.screen === current) a.setAttribute("aria-current", "page");
        else a.removeAttribute("aria-current");
      }
    },
  };
}
