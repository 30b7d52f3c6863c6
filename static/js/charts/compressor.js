/**
 * Compressor operating points (pressure ratio against corrected flow per compressor)
 * from 40 % to 100 % of the peak-power speed, at the boost entered. Assumption, said on
 * the chart: full boost and flat torque over that range (power in proportion to rpm).
 * Each point is an `airflow` request with `displacement` and `rpm`, in parallel.
 */
import { _, format } from "../i18n.js";
import { formatNumber, unitLabel } from "../units.js";
import { lineChart } from "../ui/chart.js";

const SHARES = [0.4, 0.5, 0.6, 0.7, 0.8, 0.9, 1.0];

export async function buildChart({ body, calc }) {
  if (!body.rpm || !body.displacement || !body.power) return null;
  const speeds = SHARES.map((share) => Math.round(body.rpm * share)).filter((rpm) => rpm >= 500);
  const answers = await Promise.all(speeds.map((rpm) => calc("airflow", { ...body, rpm,
    power: { value: (body.power.value * rpm) / body.rpm, unit: body.power.unit } })));
  const ok = answers.map((a, i) => [speeds[i], a.body]).filter(([, b]) => b && b.corrected_air_flow);
  if (!ok.length) return null;
  const flowUnit = ok[0][1].corrected_air_flow.unit;
  const points = ok.map(([, b]) => [b.corrected_air_flow.value, b.pressure_ratio]);
  const last = ok[ok.length - 1];
  return lineChart({
    title: _("Compressor operating points"),
    xLabel: `${_("Corrected air flow per compressor")} (${unitLabel(flowUnit)})`,
    yLabel: _("Pressure ratio"),
    series: [{ label: format(_("%(low)s to %(high)s rpm"), { low: speeds[0], high: body.rpm }), points, dots: true }],
    markers: [{ x: last[1].corrected_air_flow.value, y: last[1].pressure_ratio, label: `${body.rpm} rpm` }],
    yFromZero: false,
    note: _("Assumes full boost and flat torque over this range (power in proportion to rpm). Lay the points on your compressor map; its reference conditions must match."),
    table: {
      columns: [_("rpm"), `${_("Flow")} (${unitLabel(flowUnit)})`, _("Pressure ratio"), _("Volumetric efficiency")],
      rows: ok.map(([rpm, b]) => [String(rpm), formatNumber(b.corrected_air_flow.value),
        formatNumber(b.pressure_ratio, "ratio"),
        b.volumetric_efficiency === undefined || b.volumetric_efficiency === null ? "" : formatNumber(b.volumetric_efficiency, "percent")]),
    },
  });
}
