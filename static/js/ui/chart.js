/**
 * A small self-hosted SVG line chart, legible on a phone: lines told apart by colour
 * and dash pattern, markers for single points, dashed guides, a legend, and the numbers
 * as a table for screen readers and for reading exact values.
 */
import { h, s, uid } from "../dom.js";
import { _ } from "../i18n.js";
import { formatNumber } from "../units.js";

const W = 360;
const H = 230;
const M = { left: 50, right: 14, top: 12, bottom: 42 };
const DASHES = ["", "7 4", "2 4", "10 3 2 3"];

/** "Nice" ticks (1, 2, 5 x 10^k) covering [lo, hi]. */
export function ticks(lo, hi, count = 5) {
  if (!(hi > lo)) {
    const pad = Math.abs(lo) * 0.1 || 1;
    return ticks(lo - pad, hi + pad, count);
  }
  const raw = (hi - lo) / count;
  const mag = 10 ** Math.floor(Math.log10(raw));
  const step = [1, 2, 2.5, 5, 10].map((m) => m * mag).find((st) => st >= raw);
  const out = [];
  for (let v = Math.floor(lo / step) * step; v <= hi + step * 1e-9; v += step) {
    out.push(Number(v.toPrecision(12)));
  }
  if (out[out.length - 1] < hi) out.push(Number((out[out.length - 1] + step).toPrecision(12)));
  return out;
}

/**
 * @param {object} spec
 * @param {string} spec.title
 * @param {string} spec.xLabel axis title with unit
 * @param {string} spec.yLabel
 * @param {Array<{label: string, points: number[][], dots?: boolean}>} spec.series
 * @param {Array<{x: number, y: number, label: string}>} [spec.markers]
 * @param {Array<{x?: number, y?: number, label: string}>} [spec.guides]
 * @param {string} [spec.note]
 * @param {{columns: string[], rows: Array<Array<string>>}} [spec.table]
 * @param {boolean} [spec.yFromZero]
 */
export function lineChart(spec) {
  const series = spec.series.filter((se) => se.points.length);
  const markers = spec.markers || [];
  const guides = spec.guides || [];
  const xs = [...series.flatMap((se) => se.points.map((p) => p[0])), ...markers.map((m) => m.x),
    ...guides.filter((g) => g.x !== undefined).map((g) => g.x)];
  const ys = [...series.flatMap((se) => se.points.map((p) => p[1])), ...markers.map((m) => m.y),
    ...guides.filter((g) => g.y !== undefined).map((g) => g.y)];
  if (spec.yFromZero !== false) ys.push(0);
  const xt = ticks(Math.min(...xs), Math.max(...xs));
  const yt = ticks(Math.min(...ys), Math.max(...ys));
  const [x0, x1] = [xt[0], xt[xt.length - 1]];
  const [y0, y1] = [yt[0], yt[yt.length - 1]];
  const px = (x) => M.left + ((x - x0) / (x1 - x0)) * (W - M.left - M.right);
  const py = (y) => H - M.bottom - ((y - y0) / (y1 - y0)) * (H - M.top - M.bottom);

  const titleId = uid("chart");
  const svg = s("svg", { viewBox: `0 0 ${W} ${H}`, role: "img", "aria-labelledby": titleId },
    s("title", {}, spec.title),
    yt.map((v) => s("g", {},
      s("line", { class: "grid", x1: M.left, x2: W - M.right, y1: py(v), y2: py(v) }),
      s("text", { x: M.left - 6, y: py(v) + 4, "text-anchor": "end", "font-size": 11 }, formatNumber(v)))),
    xt.map((v) => s("g", {},
      s("line", { class: "tick", x1: px(v), x2: px(v), y1: H - M.bottom, y2: H - M.bottom + 4 }),
      s("text", { x: px(v), y: H - M.bottom + 16, "text-anchor": "middle", "font-size": 11 }, formatNumber(v)))),
    s("line", { class: "axis", x1: M.left, x2: W - M.right, y1: H - M.bottom, y2: H - M.bottom }),
    s("line", { class: "axis", x1: M.left, x2: M.left, y1: M.top, y2: H - M.bottom }),
    s("text", { x: (M.left + W - M.right) / 2, y: H - 6, "text-anchor": "middle", "font-size": 12 }, spec.xLabel),
    s("text", { x: 12, y: (M.top + H - M.bottom) / 2, "text-anchor": "middle", "font-size": 12,
      transform: `rotate(-90 12 ${(M.top + H - M.bottom) / 2})` }, spec.yLabel),
    guides.map((g) => (g.x !== undefined
      ? s("line", { class: "guide", x1: px(g.x), x2: px(g.x), y1: M.top, y2: H - M.bottom })
      : s("line", { class: "guide", x1: M.left, x2: W - M.right, y1: py(g.y), y2: py(g.y) }))),
    series.map((se, i) => s("g", {},
      s("polyline", { class: `series series-${(i % 4) + 1}`, "stroke-dasharray": DASHES[i % 4] || null,
        points: se.points.map(([x, y]) => `${px(x).toFixed(1)},${py(y).toFixed(1)}`).join(" ") }),
      se.dots ? se.points.map(([x, y]) => s("circle", { class: `dot-${(i % 4) + 1}`, cx: px(x), cy: py(y), r: 3.5 })) : null)),
    markers.map((m) => s("g", {},
      s("circle", { class: "marker", cx: px(m.x), cy: py(m.y), r: 6 }),
      s("text", { x: Math.min(px(m.x) + 9, W - M.right - 4), y: py(m.y) - 9, "font-size": 12,
        "text-anchor": px(m.x) > W - 80 ? "end" : "start" }, m.label))));

  const sample = (i) => s("svg", { viewBox: "0 0 28 12", "aria-hidden": "true" },
    s("line", { class: `series series-${(i % 4) + 1}`, x1: 1, x2: 27, y1: 6, y2: 6,
      "stroke-dasharray": DASHES[i % 4] || null }));
  const markerSample = () => s("svg", { viewBox: "0 0 28 12", "aria-hidden": "true" },
    s("circle", { class: "marker", cx: 14, cy: 6, r: 4.5 }));
  const legend = h("ul", { class: "chart__legend" },
    series.map((se, i) => h("li", {}, sample(i), se.label)),
    markers.map((m) => h("li", {}, markerSample(), m.legend || m.label)),
    guides.filter((g) => g.label).map((g) => h("li", {}, `┆ ${g.label}`)));

  const table = spec.table ? h("details", { class: "chart__table" },
    h("summary", {}, _("Show the numbers")),
    h("table", {},
      h("thead", {}, h("tr", {}, spec.table.columns.map((c) => h("th", { scope: "col" }, c)))),
      h("tbody", {}, spec.table.rows.map((row) => h("tr", {}, row.map((c) => h("td", {}, c))))))) : null;

  return h("figure", { class: "chart" },
    h("figcaption", { class: "chart__title", id: titleId }, spec.title),
    svg, legend, spec.note ? h("p", { class: "chart__note" }, spec.note) : null, table);
}
