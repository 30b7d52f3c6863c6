/**
 * Power against boost: ideal (pressure-ratio rule) and expected power at seven boosts
 * from 0 to 1.5 times the boost entered, with the measured figure as a point. Every
 * point comes from the API (`power`), the requests in parallel.
 */
import { _ } from "../i18n.js";
import { convert, formatNumber, unitLabel } from "../units.js";
import { lineChart } from "../ui/chart.js";

const STEPS = 7;

export async function buildChart({ body, result, calc }) {
  if (!body.boost) return null;
  const { unit } = body.boost;
  const top = body.boost.value > 0 ? body.boost.value * 1.5 : convert(1, "bar", unit) || 1;
  const boosts = Array.from({ length: STEPS }, (_unused, i) => (top * i) / (STEPS - 1));
  const { measured_power: measured, ...rest } = body;
  const answers = await Promise.all(boosts.map((value) => calc("power", { ...rest, boost: { value, unit } })));
  const ok = answers.map((a, i) => [boosts[i], a]).filter(([, a]) => a.status === 200 && a.body.expected_power);
  if (!ok.length) return null;
  const powerUnit = ok[0][1].body.expected_power.unit;
  const ideal = ok.map(([b, a]) => [b, a.body.ideal_power.value]);
  const expected = ok.map(([b, a]) => [b, a.body.expected_power.value]);
  const markers = [];
  if (measured && result.measured_power) {
    markers.push({ x: body.boost.value, y: result.measured_power.value, label: _("Measured") });
  }
  return lineChart({
    title: _("Power against boost"),
    xLabel: `${_("Boost")} (${unitLabel(unit)})`,
    yLabel: `${_("Power")} (${unitLabel(powerUnit)})`,
    series: [{ label: _("Ideal"), points: ideal }, { label: _("Expected"), points: expected, dots: true }],
    markers,
    guides: [{ x: body.boost.value, label: _("Your boost") }],
    table: {
      columns: [`${_("Boost")} (${unitLabel(unit)})`, `${_("Ideal")} (${unitLabel(powerUnit)})`,
        `${_("Expected")} (${unitLabel(powerUnit)})`],
      rows: ok.map(([b], i) => [formatNumber(b), formatNumber(ideal[i][1]), formatNumber(expected[i][1])]),
    },
  });
}
