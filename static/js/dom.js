/**
 * Tiny DOM helpers: build elements without innerHTML and without style attributes
 * (the page runs under a strict Content-Security-Policy).
 */

let counter = 0;

/** A page-unique id for label/aria wiring. */
export function uid(prefix = "id") {
  counter += 1;
  return `${prefix}-${counter}`;
}

function setProps(el, props) {
  for (const [key, value] of Object.entries(props || {})) {
    if (value === null || value === undefined || value === false) continue;
    if (key === "style") throw new Error("style attributes are not allowed (CSP)");
    if (key === "class") el.setAttribute("class", value);
    else if (key === "text") el.textContent = value;
    else if (key === "dataset") Object.assign(el.dataset, value);
    else if (key.startsWith("on") && typeof value === "function") {
      el.addEventListener(key.slice(2), value);
    } else if (key === "value" || key === "checked" || key === "selected") el[key] = value;
    else el.setAttribute(key, value === true ? "" : String(value));
  }
}

function append(el, children) {
  for (const child of children.flat(Infinity)) {
    if (child === null || child === undefined || child === false) continue;
    el.append(child instanceof Node ? child : document.createTextNode(String(child)));
  }
}

/** `h("p", {class: "x"}, "text", child)`: an HTML element. */
export function h(tag, props, ...children) {
  const el = document.createElement(tag);
  setProps(el, props);
  append(el, children);
  return el;
}

const SVG_NS = "http://www.w3.org/2000/svg";

/** `s("line", {x1: 0, ...})`: an SVG element. */
export function s(tag, props, ...children) {
  const el = document.createElementNS(SVG_NS, tag);
  setProps(el, props);
  append(el, children);
  return el;
}

/** Replace all children of `el`. */
export function replace(el, ...children) {
  el.replaceChildren();
  append(el, children);
  return el;
}
