/**
 * The general cautions (response field `cautions`): on every screen, collapsible,
 * never gone. The last ones received are kept on the device so they show at once.
 */
import { h, replace } from "../dom.js";
import { _ } from "../i18n.js";
import { store, rememberCautions, setPref } from "../store.js";

export function cautionsPanel() {
  const list = h("ul", { class: "cautions__list" });
  const details = h("details", { class: "cautions", open: store.prefs.cautionsOpen },
    h("summary", { class: "cautions__summary" }, _("Read before you rely on these numbers")), list);
  details.addEventListener("toggle", () => setPref("cautionsOpen", details.open));
  const el = h("aside", { class: "cautions-box", "aria-label": _("Cautions") }, details);

  function render(cautions) {
    if (!cautions.length) {
      replace(list, h("li", {}, _("Estimates only: verify on a dyno with wideband lambda and knock monitoring, and raise boost in small steps.")));
      return;
    }
    replace(list, cautions.map((c) => h("li", { dataset: { code: c.code } }, c.message)));
  }
  render(store.prefs.cautions || []);

  return {
    el,
    /** Show the cautions of a response (kept when a response has none). */
    update(cautions) {
      if (!Array.isArray(cautions) || !cautions.length) return;
      rememberCautions(cautions);
      render(cautions);
    },
  };
}
