/** A choice among a few options (a native select: big, accessible, one-handed). */
import { h, uid } from "../dom.js";
import { markTyped } from "../store.js";

/**
 * @param {object} def field definition with `choices: [{value, label}]`
 * @param {string|boolean} value the chosen value
 * @param {(value) => void} onChange
 * @param {object} [opts] `{path}`
 */
export function choiceInput(def, value, onChange, opts = {}) {
  const id = uid("ch");
  const errId = `${id}-err`;
  const select = h("select", { id, class: "field__select", "aria-describedby": errId },
    def.choices.map((c) => h("option", { value: String(c.value) }, c.label)));
  select.value = String(value);
  const error = h("p", { class: "field__error", id: errId, hidden: true });
  select.addEventListener("change", () => {
    markTyped();
    const chosen = def.choices.find((c) => String(c.value) === select.value);
    onChange(chosen ? chosen.value : select.value);
  });
  const el = h("div", { class: "field", dataset: { field: opts.path || def.api || def.key } },
    h("label", { for: id, class: "field__label" }, def.label),
    select,
    def.hint ? h("p", { class: "field__hint" }, def.hint) : null,
    error);
  return {
    el,
    input: select,
    isValid: () => true,
    setError(message) {
      error.textContent = message || "";
      error.hidden = !message;
    },
    setValue(next) {
      select.value = String(next);
    },
  };
}
