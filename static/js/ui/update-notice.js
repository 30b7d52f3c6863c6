/**
 * "An update is ready": reload at once if the user has not started typing, else show a
 * notice with a reload button (typing is never interrupted).
 */
import { h } from "../dom.js";
import { _ } from "../i18n.js";
import { store } from "../store.js";

let shown = false;

/** Ask the waiting worker to take over, then reload once it controls the page. */
function activate(reg) {
  navigator.serviceWorker.addEventListener("controllerchange", () => location.reload(), { once: true });
  if (reg.waiting) reg.waiting.postMessage({ type: "skip-waiting" });
}

/**
 * @param {ServiceWorkerRegistration} reg
 * @param {HTMLElement} notices where to show the notice
 */
export function updateReady(reg, notices) {
  if (shown) return;
  if (!reg.waiting) {
    const worker = reg.installing;
    if (worker) {
      worker.addEventListener("statechange", () => {
        if (worker.state === "installed") updateReady(reg, notices);
      });
    }
    return;
  }
  shown = true;
  if (!store.typed) {
    activate(reg);
    return;
  }
  const button = h("button", { type: "button", class: "button" }, _("Reload now"));
  button.addEventListener("click", () => activate(reg));
  notices.append(h("p", { class: "notice notice--update" },
    _("A new version of the app is ready."), " ", button));
}
