/**
 * Boost against altitude, 0 to 3500 m, with the boost set at home (where the NA figure
 * was measured) for the target: what each boost-control style then gives up the hill
 * (`pressure-ratio` with `altitudes`) against the boost the target needs there
 * (`boost-for-power` with `altitudes`). Each table is one request.
 */
import { _ } from "../i18n.js";
import { formatNumber, unitLabel } from "../units.js";
import { lineChart } from "../ui/chart.js";

const ALTITUDES = Array.from({ length: 15 }, (_unused, i) => ({ value: i * 250, unit: "m" }));
const CHARGE_KEYS = ["induction", "intercooler_effectiveness", "compressor_efficiency", "inlet_loss",
  "intercooler_loss"];

export async function buildChart({ body, result, calc }) {
  const home = body.na_site || {};
  const need = await calc("boost-for-power", { ...body, site: home, altitudes: ALTITUDES });
  if (need.status !== 200) return null;
  const rows = need.body.altitude_table || [];
  const boostUnit = (need.body.boost_ideal && need.body.boost_ideal.unit) || "";
  const altUnit = rows.length ? rows[0].altitude.unit : "m";
  const needed = rows.filter((r) => r.boost).map((r) => [r.altitude.value, r.boost.value]);
  const series = [{ label: _("Boost needed for the target"), points: needed, dots: true }];
  const styles = [
    ["held_manifold", _("Set at home, controller holds manifold pressure")],
    ["held_gauge", _("Set at home, wastegate holds gauge boost")],
    ["fixed_ratio", _("Set at home, belt-driven blower")],
  ];
  let table = null;
  if (need.body.boost) {
    const charge = Object.fromEntries(CHARGE_KEYS.filter((k) => k in body).map((k) => [k, body[k]]));
    const styled = await calc("pressure-ratio", { ...charge, boost: need.body.boost, site: home,
      altitudes: ALTITUDES });
    if (styled.status === 200) {
      const prRows = styled.body.altitude_table || [];
      for (const [key, label] of styles) {
        series.push({ label, points: prRows.map((r) => [r.altitude.value, r[key].boost_here.value]) });
      }
      table = {
        columns: [`${_("Altitude")} (${unitLabel(altUnit)})`, _("Needed"), _("Manifold held"),
          _("Gauge held"), _("Blower")],
        rows: prRows.map((r, i) => [formatNumber(r.altitude.value),
          rows[i] && rows[i].boost ? formatNumber(rows[i].boost.value) : _("not reached"),
          ...styles.map(([key]) => formatNumber(r[key].boost_here.value))]),
      };
    }
  }
  const markers = [];
  const today = body.site && body.site.altitude;
  if (result.boost && today && rows.length && today.unit === altUnit) {
    markers.push({ x: today.value, y: result.boost.value, label: _("Today") });
  }
  return lineChart({
    title: _("Boost and altitude"),
    xLabel: `${_("Altitude")} (${unitLabel(altUnit)})`,
    yLabel: `${_("Boost")} (${unitLabel(boostUnit)})`,
    series,
    markers,
    note: need.body.boost ? _("Weather of the home site carried up the hill (standard lapse). Where a line runs below the needed boost, that control style falls short of the target.")
      : _("The target cannot be reached at home with this setup, so no home boost is drawn."),
    table,
  });
}
