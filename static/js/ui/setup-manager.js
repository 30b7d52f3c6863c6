/**
 * Saved setups on this device: pick, rename, write notes, add, copy, delete; export all
 * as a JSON file and import one (an older format is migrated; a bad file is refused and
 * nothing saved is touched); a share link that carries the setup and inputs in the
 * address; and what went wrong with the saved data, if anything (store.notice).
 */
import { h, replace } from "../dom.js";
import { _, format } from "../i18n.js";
import { store, activeSetup, addSetup, deleteSetup, exportDocument, importDocument, markTyped,
  renameSetup, selectSetup, setNotes, subscribe } from "../store.js";
import { blankEngine, validateDocument, NOTES_MAX } from "../setups.js";
import { shareLink } from "../share.js";

function download(name, text) {
  const url = URL.createObjectURL(new Blob([text], { type: "application/json" }));
  const a = h("a", { href: url, download: name });
  document.body.append(a);
  a.click();
  a.remove();
  setTimeout(() => URL.revokeObjectURL(url), 1000);
}

/** Read and check an imported file (migrated if older); returns `{doc, errors}`. */
export async function readSetupsFile(file) {
  let raw;
  try {
    raw = JSON.parse(await file.text());
  } catch {
    return { doc: null, errors: [_("The file is not valid JSON.")] };
  }
  return validateDocument(raw);
}

export function setupManager() {
  const message = h("p", { class: "manager__message", role: "status" });
  const say = (text, ok = true) => {
    message.className = ok ? "manager__message message--ok" : "manager__message message--error";
    message.textContent = text;
  };

  const picker = h("select", { id: "setup-picker", class: "field__select" });
  picker.addEventListener("change", () => selectSetup(picker.value));
  const name = h("input", { id: "setup-name", type: "text", class: "field__input", autocomplete: "off",
    maxlength: "100" });
  name.addEventListener("change", () => {
    if (name.value.trim()) renameSetup(activeSetup().id, name.value);
  });
  const notes = h("textarea", { id: "setup-notes", class: "field__input", rows: "3",
    maxlength: String(NOTES_MAX) });
  notes.addEventListener("input", () => {
    markTyped();
    setNotes(activeSetup().id, notes.value);
  });
  const demoNote = h("p", { class: "notice" });
  const storageNote = h("p", { class: "notice manager__storage", role: "alert" });

  const button = (text, onClick, cls = "button") => {
    const b = h("button", { type: "button", class: cls }, text);
    b.addEventListener("click", onClick);
    return b;
  };

  let armed = false;
  const remove = button(_("Delete"), () => {
    if (store.doc.setups.length < 2) {
      say(_("The last setup cannot be deleted."), false);
      return;
    }
    if (!armed) {
      armed = true;
      remove.textContent = _("Tap again to delete");
      setTimeout(() => {
        armed = false;
        remove.textContent = _("Delete");
      }, 4000);
      return;
    }
    armed = false;
    const gone = activeSetup().name;
    deleteSetup(activeSetup().id);
    say(format(_("Deleted \"%(name)s\"."), { name: gone }));
  }, "button button--danger");

  const fileInput = h("input", { type: "file", accept: "application/json,.json",
    "aria-label": _("Import setups from a file") });
  fileInput.addEventListener("change", async () => {
    const file = fileInput.files && fileInput.files[0];
    fileInput.value = "";
    if (!file) return;
    const { doc, errors } = await readSetupsFile(file);
    if (!doc) {
      say(`${_("Import refused; nothing saved was changed.")} ${errors.slice(0, 4).join(" ")}`, false);
      return;
    }
    const added = importDocument(doc);
    say(added.length ? format(_("Imported %(n)s setups: %(names)s."), { n: added.length, names: added.join(", ") })
      : _("Nothing new in that file: those setups are already saved."));
  });

  const linkBox = h("input", { type: "text", class: "share-link", readonly: true,
    "aria-label": _("Share link"), hidden: true });

  const actions = h("div", { class: "manager__actions" },
    button(_("New setup"), () => {
      addSetup({ name: _("My engine"), demo: false, engine: blankEngine() });
      say(_("New setup added: enter your engine below."));
    }),
    button(_("Copy"), () => {
      const copy = addSetup({ ...activeSetup(), demo: false, name: format(_("%(name)s (copy)"), { name: activeSetup().name }) });
      say(format(_("Saved a copy as \"%(name)s\"."), { name: copy.name }));
    }),
    remove,
    button(_("Export file"), () => {
      const date = new Date().toISOString().slice(0, 10);
      download(`webcalc-setups-${date}.json`, `${JSON.stringify(exportDocument(), null, 2)}\n`);
      say(_("Exported all saved setups to a file."));
    }),
    h("label", { class: "button file-button" }, _("Import file"), fileInput),
    button(_("Share link"), async () => {
      linkBox.value = shareLink();
      linkBox.hidden = false;
      linkBox.select();
      try {
        await navigator.clipboard.writeText(linkBox.value);
        say(_("Link copied: it holds this setup and today's inputs."));
      } catch {
        say(_("Copy the link below: it holds this setup and today's inputs."));
      }
    }));

  function render() {
    const active = activeSetup();
    replace(picker, store.doc.setups.map((s) => h("option", { value: s.id }, s.name)));
    picker.value = active.id;
    if (document.activeElement !== name) name.value = active.name;
    if (document.activeElement !== notes) notes.value = active.notes || "";
    demoNote.hidden = !active.demo;
    demoNote.textContent = _("This is a demo setup with invented values, so that every screen shows results at once. Enter your own engine, or add a new setup.");
  }
  function showStorage() {
    storageNote.hidden = !store.notice;
    storageNote.textContent = store.notice || "";
  }
  showStorage();
  render();

  const el = h("section", { class: "group manager", "aria-labelledby": "manager-title" },
    h("h3", { id: "manager-title", class: "group__title" }, _("Saved setups")),
    h("div", { class: "field" }, h("label", { for: "setup-picker", class: "field__label" }, _("Setup in use")), picker),
    h("div", { class: "field" }, h("label", { for: "setup-name", class: "field__label" }, _("Name")), name),
    h("div", { class: "field" }, h("label", { for: "setup-notes", class: "field__label" }, _("Notes")), notes),
    demoNote, storageNote, actions, linkBox, message);
  // the manager has no destroy: its listener goes once the screen is gone
  const unsubscribe = subscribe((what) => {
    if (what !== "notice") return;
    if (!el.isConnected) unsubscribe();
    else showStorage();
  });
  return { el, render, say };
}
