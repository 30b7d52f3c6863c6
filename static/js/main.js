/**
 * Wires the app together: language, unit table and saved state first, then the app
 * bar, the screen for the current address, the cautions and the service worker.
 */
import { h, replace } from "./dom.js";
import { _, currentLang, languages, preferredLanguage, setLanguage } from "./i18n.js";
import { loadUnits, setNumberLocale } from "./units.js";
import { store, loadPrefs, loadStore, setPref, subscribe } from "./store.js";
import { screens } from "./screens.js";
import { appBar } from "./ui/app-bar.js";
import { cautionsPanel } from "./ui/cautions.js";
import { screenView } from "./ui/screen-view.js";

const DEFAULT_SCREEN = "site";

/**
 * The language picker (in the footer, by the help): remembered on the device; the page
 * reloads in the new language (inputs are saved as they change, so nothing is lost).
 */
function languagePicker() {
  const picker = h("select", { class: "language", id: "language" },
    languages().map((l) => h("option", { value: l.code, lang: l.tag, selected: l.tag === currentLang() }, l.name)));
  picker.addEventListener("change", () => {
    setPref("lang", picker.value);
    setPref("cautions", []);
    location.reload();
  });
  return h("p", { class: "language-line" }, h("label", { for: "language" }, _("Language")), " ", picker);
}

function applyTheme() {
  document.documentElement.dataset.theme = store.prefs.theme === "sun" ? "sun" : "standard";
}

/** "#/power?s=..." -> {id: "power", share: "..."} */
function parseHash() {
  const match = /^#\/([\w-]+)(?:\?(.*))?$/.exec(location.hash);
  if (!match) return { id: DEFAULT_SCREEN, share: null };
  const params = new URLSearchParams(match[2] || "");
  return { id: match[1], share: params.get("s") };
}

async function start() {
  loadPrefs();
  applyTheme();
  await Promise.all([setLanguage(preferredLanguage(store.prefs.lang)), loadUnits()]);
  setNumberLocale(currentLang());
  document.title = _("Boost and fuel check");
  loadStore();

  const list = screens();
  const bar = appBar([{ id: "engine", nav: _("Engine") }, ...list.map((s) => ({ id: s.id, nav: s.nav }))]);
  const cautions = cautionsPanel();
  const notices = h("div", { class: "notices", role: "status" });
  const viewBox = h("div", { class: "view" });
  const main = h("main", { class: "main", id: "main" }, notices, viewBox);
  const footer = h("footer", { class: "footer" },
    h("details", { class: "help" },
      h("summary", {}, _("Help")),
      // The same line as the README's quick start (a test keeps them equal).
      h("p", { class: "help__quick" }, _("Quick start: check the engine setup once (the demo shows how), then open any screen; results update as you type and keep working with no signal.")),
      h("p", {}, _("Type numbers with a decimal point or a decimal comma. Each field has its own unit; the Metric and Imperial buttons set them all."))),
    languagePicker(),
    h("p", { class: "scope" }, _("For four-stroke piston engines with port fuel injection. Rotary engines and direct injection are not covered.")));
  replace(document.getElementById("app"), bar.header, main, cautions.el, footer, bar.nav);

  let view = null;
  let shownId = null;
  async function show() {
    const { id, share } = parseHash();
    if (share) {
      const { restoreShared } = await import("./share.js");
      const message = restoreShared(share);
      replace(notices, h("p", { class: "notice" }, message));
      history.replaceState(null, "", `#/${id}`);
    }
    const screen = list.find((s) => s.id === id);
    if (view) view.destroy();
    if (id === "engine") {
      const { engineView } = await import("./ui/engine-view.js");
      view = engineView({ notices });
    } else {
      view = screenView(screen || list[0], { cautions });
    }
    shownId = screen || id === "engine" ? id : list[0].id;
    replace(viewBox, view.el);
    bar.update(shownId);
    showStorageNotice();
  }

  subscribe((what) => {
    if (what === "prefs" || what === "system") {
      applyTheme();
      bar.update(shownId);
    }
    if (what === "system" && shownId !== "engine") show();
  });
  window.addEventListener("hashchange", show);
  // What went wrong with the saved data (unreadable, newer version, storage full), on
  // every calculation screen; the Engine screen shows it in its setup manager.
  const storageNotice = h("p", { class: "notice", role: "alert" });
  const showStorageNotice = () => {
    storageNotice.textContent = store.notice || "";
    if (!store.notice || shownId === "engine") storageNotice.remove();
    else if (!storageNotice.isConnected) notices.prepend(storageNotice);
  };
  subscribe((what) => { if (what === "notice") showStorageNotice(); });
  await show();

  if ("serviceWorker" in navigator) registerWorker(notices);
}

/**
 * Register the service worker (module worker, scope "/"). When it reports an update,
 * the notice decides: reload quietly if the user has not typed yet, else offer a button.
 */
function registerWorker(notices) {
  navigator.serviceWorker.register("/sw.js", { type: "module", scope: "/" }).then((reg) => {
    const ready = () => import("./ui/update-notice.js").then((m) => m.updateReady(reg, notices));
    if (reg.waiting && navigator.serviceWorker.controller) ready();
    reg.addEventListener("updatefound", () => {
      if (navigator.serviceWorker.controller) ready();
    });
    navigator.serviceWorker.addEventListener("message", (event) => {
      if (event.data && event.data.type === "update-ready") ready();
    });
  }).catch(() => {
    // No worker (e.g. a private window): the app still works online.
  });
}

start();
