/**
 * The fuel pump's curve (from the engine setup) with the operating point and the flow
 * needed. One extra request asks the API for the results in the curve's own units.
 */
import { _ } from "../i18n.js";
import { formatNumber, unitLabel } from "../units.js";
import { lineChart } from "../ui/chart.js";

export async function buildChart({ engine, body, calc }) {
  const curve = engine.pump_curve;
  if (!curve || !body.pump_curve) return null;
  const answer = await calc("fuel-pump", { ...body, output_units: {
    required_flow: curve.flow_unit, available_flow: curve.flow_unit, required_pressure: curve.pressure_unit } });
  if (answer.status !== 200) return null;
  const r = answer.body;
  const count = body.pump_count || 1;
  const points = curve.points.filter(([p, f]) => p !== null && f !== null).map(([p, f]) => [p, f * count]);
  const markers = [];
  if (r.available_flow) {
    markers.push({ x: r.required_pressure.value, y: r.available_flow.value, label: _("Operating point") });
  }
  return lineChart({
    title: count > 1 ? _("Fuel pump curve (all pumps together)") : _("Fuel pump curve"),
    xLabel: `${_("Pump outlet pressure")} (${unitLabel(curve.pressure_unit)})`,
    yLabel: `${_("Flow")} (${unitLabel(curve.flow_unit)})`,
    series: [{ label: _("Pump flow (data sheet)"), points, dots: true }],
    markers,
    guides: [{ y: r.required_flow.value, label: _("Flow needed, with reserve") },
      { x: r.required_pressure.value, label: _("Pressure needed") }],
    note: _("At the pump's rated voltage: lower voltage means less flow."),
    table: {
      columns: [`${_("Pressure")} (${unitLabel(curve.pressure_unit)})`, `${_("Flow")} (${unitLabel(curve.flow_unit)})`],
      rows: points.map(([p, f]) => [formatNumber(p), formatNumber(f)]),
    },
  });
}
