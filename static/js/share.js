/**
 * Share links: the engine setup and the inputs of the day, as base64url JSON in the
 * address fragment (`#/<screen>?s=...`): never sent to the server, restored on open.
 */
import { _, format } from "./i18n.js";
import { validateInputs, validateSetup } from "./setups.js";
import { store, activeSetup, addSetup, replaceInputs, selectSetup } from "./store.js";

const LINK_VERSION = 1;

function toBase64Url(text) {
  const bytes = new TextEncoder().encode(text);
  let binary = "";
  for (const b of bytes) binary += String.fromCharCode(b);
  return btoa(binary).replace(/\+/g, "-").replace(/\//g, "_").replace(/=+$/, "");
}

function fromBase64Url(data) {
  const b64 = data.replace(/-/g, "+").replace(/_/g, "/");
  const binary = atob(b64 + "===".slice((b64.length + 3) % 4));
  return new TextDecoder().decode(Uint8Array.from(binary, (c) => c.charCodeAt(0)));
}

/** The share link of the active setup and the inputs of the day. */
export function shareLink(screen = "site") {
  const setup = activeSetup();
  const payload = { v: LINK_VERSION, setup: { name: setup.name, demo: setup.demo, engine: setup.engine },
    inputs: store.inputs };
  return `${location.origin}/#/${screen}?s=${toBase64Url(JSON.stringify(payload))}`;
}

/**
 * Restore a link's data: its setup becomes the active one (saved on this device, or the
 * saved one it equals), its inputs replace the inputs of the day. Returns a message.
 */
export function restoreShared(data) {
  let payload;
  try {
    payload = JSON.parse(fromBase64Url(data));
  } catch {
    return _("This share link is damaged: nothing was changed.");
  }
  if (!payload || payload.v !== LINK_VERSION) return _("This share link is from another version of the app: nothing was changed.");
  const { setup, errors } = validateSetup(payload.setup, _("Shared setup"));
  const { inputs, errors: inputErrors } = validateInputs(payload.inputs);
  if (!setup || !inputs) {
    return `${_("This share link could not be read: nothing was changed.")} ${[...errors, ...inputErrors].slice(0, 3).join("; ")}`;
  }
  const same = store.doc.setups.find((s) => JSON.stringify(s.engine) === JSON.stringify(setup.engine));
  let name;
  if (same) {
    selectSetup(same.id);
    name = same.name;
  } else {
    name = addSetup(setup).name;
  }
  replaceInputs(inputs);
  return format(_("Opened the shared setup \"%(name)s\" (saved on this device) with its inputs."), { name });
}
